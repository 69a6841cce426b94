#!/usr/bin/env bash
# Runs the shared reference-kernel comparison (../shared/perf-anchor/run.sh)
# against this tree's API. The shared driver was written for the 0.1 calls
# (mcd_workspace_alloc, the flat mcd_flux_batch_dij, mcd_workspace_last_error);
# this copies the harness to a temporary directory, rewrites those three
# calls to their 0.2+ forms (same cells, same work) and runs it.
#   usage: tools/anchor.sh BUILD_DIR [N...]      (from the project root)
set -eu
src=${MCD_ANCHOR_DIR:-$(cd "$(dirname "$0")/../.." && pwd)/shared/perf-anchor}
[ -f "$src/driver.c" ] || { echo "anchor.sh: no perf-anchor at $src (set MCD_ANCHOR_DIR)" >&2; exit 1; }
tmp=$(mktemp -d); trap 'rm -rf "$tmp"' EXIT
cp "$src"/* "$tmp/"
python3 - "$tmp/driver.c" <<'PY'
import re, sys
p = sys.argv[1]; s = open(p).read()
s = s.replace("mcd_workspace_alloc((size_t)N, &ws)", "mcd_workspace_new((size_t)N, &ws)")
s = s.replace("mcd_workspace_last_error(ws)", "mcd_last_error()")
old = re.search(r"mcd_flux_batch_dij\(ws, MCD_MODEL_MAXWELL_STEFAN, \(size_t\)N, \(size_t\)K, 3,\s*"
                r"NULL, Dm, c, MCD_BASIS_MOLE, xm, gm, NULL, MCD_BASIS_MOLE, Jm\)", s)
if not old: sys.exit("anchor.sh: the shared driver changed; update tools/anchor.sh")
new = ("mcd_flux_batch_dij(ws, MCD_MODEL_MAXWELL_STEFAN, (size_t)N, NULL, Dm, c, "
       "&(mcd_cells){.n_cells = (size_t)K, .n_dim = 3, .comp_basis = MCD_BASIS_MOLE, "
       ".comp = xm, .grad = gm}, MCD_BASIS_MOLE, Jm)")
s = s[:old.start()] + new + s[old.end():]
open(p, "w").write(s)
PY
cd "$(dirname "$0")/.." && bash "$tmp/run.sh" "$@"
