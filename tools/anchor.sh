#!/usr/bin/env bash
# Runs the shared reference-kernel comparison (../shared/perf-anchor/run.sh)
# against this tree's API. The shared driver was written for the 0.1 calls
# (mcd_workspace_alloc, the flat mcd_flux_batch_dij, mcd_workspace_last_error);
# this copies the harness to a temporary directory, rewrites those three
# calls to their 0.2+ forms (same cells, same work) and runs it.
# With MCD_ANCHOR_LAYOUT=tiled the library reads and writes its tiled
# layout (MCD_LAYOUT_TILED8), the reference kernel's own block layout,
# converted outside the timed loop as the reference kernel's is. With
# MCD_ANCHOR_DIJ=upper the library reads the upper triangle of Dij only
# (mcd_workspace_set_dij_read, MCD_DIJ_READ_UPPER: no symmetry check), as
# the reference kernel does. With MCD_ANCHOR_HUGE=1 every array of both
# sides (the reference kernel's too) starts on a 2 MB boundary and is
# advised onto transparent huge pages (madvise MADV_HUGEPAGE; Linux, where
# /sys/kernel/mm/transparent_hugepage/enabled is madvise or always).
# With MCD_ANCHOR_CARRIER=1 the last species is drawn 2-4 times as
# abundant as each other one (a carrier gas stored last: the batched
# call's grounded blocks then need no permutation, kernel_ldl.h); both
# sides get the same cells, as always.
#   usage: tools/anchor.sh BUILD_DIR [N...]      (from the project root)
set -eu
src=${MCD_ANCHOR_DIR:-$(cd "$(dirname "$0")/../.." && pwd)/shared/perf-anchor}
[ -f "$src/driver.c" ] || { echo "anchor.sh: no perf-anchor at $src (set MCD_ANCHOR_DIR)" >&2; exit 1; }
tmp=$(mktemp -d); trap 'rm -rf "$tmp"' EXIT
cp "$src"/* "$tmp/"
python3 - "$tmp/driver.c" "${MCD_ANCHOR_LAYOUT:-soa}" "${MCD_ANCHOR_DIJ:-both}" "${MCD_ANCHOR_HUGE:-0}" "${MCD_ANCHOR_CARRIER:-0}" <<'PY'
import re, sys
p = sys.argv[1]; s = open(p).read()
if sys.argv[5] not in ("0", "1"):
    sys.exit("anchor.sh: MCD_ANCHOR_CARRIER must be 0 or 1")
if sys.argv[5] == "1":
    a = "xe[i] = ur(0.01, 1.0);"
    if s.count(a) != 1:
        sys.exit("anchor.sh: the shared driver changed; update tools/anchor.sh (carrier)")
    s = s.replace(a, "xe[i] = i == N - 1 ? ur(2.0, 4.0) : ur(0.01, 1.0);")
if sys.argv[4] not in ("0", "1"):
    sys.exit("anchor.sh: MCD_ANCHOR_HUGE must be 0 or 1")
if sys.argv[4] == "1":
    # the driver's one allocator: 2 MB aligned and rounded, then advised
    a = "    double *p = aligned_alloc(64, bytes ? bytes : 64);"
    if s.count(a) != 1:
        sys.exit("anchor.sh: the shared driver changed; update tools/anchor.sh (huge)")
    s = s.replace(a, "    bytes = (bytes / (2u << 20) + 1) * (2u << 20);\n"
                     "    double *p = aligned_alloc(2u << 20, bytes);\n"
                     "    if (p && madvise(p, bytes, MADV_HUGEPAGE) != 0) perror(\"madvise\");")
    s = "#define _DEFAULT_SOURCE\n#include <sys/mman.h>\n" + s
if sys.argv[2] not in ("soa", "tiled"):
    sys.exit("anchor.sh: MCD_ANCHOR_LAYOUT must be soa or tiled")
if sys.argv[3] not in ("both", "upper"):
    sys.exit("anchor.sh: MCD_ANCHOR_DIJ must be both or upper")
tiled = sys.argv[2] == "tiled"
if sys.argv[3] == "upper":
    # the opt-in upper-triangle read (mcd_workspace_set_dij_read)
    a = 'if (mcd_workspace_alloc((size_t)N, &ws) != MCD_OK) { fprintf(stderr, "workspace\\n"); return 1; }'
    if s.count(a) != 1:
        sys.exit("anchor.sh: the shared driver changed; update tools/anchor.sh (upper)")
    s = s.replace(a, a + " mcd_workspace_set_dij_read(ws, MCD_DIJ_READ_UPPER);")
s = s.replace("mcd_workspace_alloc((size_t)N, &ws)", "mcd_workspace_new((size_t)N, &ws)")
s = s.replace("mcd_workspace_last_error(ws)", "mcd_last_error()")
old = re.search(r"mcd_flux_batch_dij\(ws, MCD_MODEL_MAXWELL_STEFAN, \(size_t\)N, \(size_t\)K, 3,\s*"
                r"NULL, Dm, c, MCD_BASIS_MOLE, xm, gm, NULL, MCD_BASIS_MOLE, Jm\)", s)
if not old: sys.exit("anchor.sh: the shared driver changed; update tools/anchor.sh")
new = ("mcd_flux_batch_dij(ws, MCD_MODEL_MAXWELL_STEFAN, (size_t)N, NULL, Dm, c, "
       "&(mcd_cells){.n_cells = (size_t)K, .n_dim = 3, .comp_basis = MCD_BASIS_MOLE, "
       ".comp = xm, .grad = gm}, MCD_BASIS_MOLE, Jm)")
s = s[:old.start()] + new + s[old.end():]
if tiled:
    # the library's tiled layout (MCD_LAYOUT_TILED8), which with 8 lanes is
    # the reference kernel's own [block][row][lane]: filled and read back
    # outside the timed loop, as the reference kernel's conversion is
    reps = [("xm[i * K + k] = x[k * N + i]", "xm[k / 8 * 8 * N + 8 * i + k % 8] = x[k * N + i]"),
            ("Dm[q * K + k] = D[k * N * N + q]", "Dm[k / 8 * 8 * N * N + 8 * q + k % 8] = D[k * N * N + q]"),
            ("gm[q * K + k] = g[k * N * 3 + q]", "gm[k / 8 * 8 * N * 3 + 8 * q + k % 8] = g[k * N * 3 + q]"),
            ("m = Jm[q * K + k]", "m = Jm[k / 8 * 8 * N * 3 + 8 * q + k % 8]"),
            (".comp = xm, .grad = gm}", ".comp = xm, .grad = gm, .layout = MCD_LAYOUT_TILED8}")]
    for a, b in reps:
        if s.count(a) != 1:
            sys.exit("anchor.sh: the shared driver changed; update tools/anchor.sh (tiled)")
        s = s.replace(a, b)
open(p, "w").write(s)
PY
cd "$(dirname "$0")/.." && bash "$tmp/run.sh" "$@"
