#!/usr/bin/env bash
# tools/test-matrix.sh - run the whole test suite of a built tree under other
# "machines": each batch-kernel instruction-set cap and each BLAS/LAPACK that
# Debian offers, so that a tolerance or a reference solver that only holds on
# the developer's CPU or BLAS shows up before CI moves to another machine.
#
#   tools/test-matrix.sh BUILD_DIR CONFIG...
#
# CONFIG is ISA:BLAS:CORETYPE
#   ISA       native | v3 | v1   (MCDIFF_KERNEL_ISA; native = the CPU's best)
#   BLAS      reference | DIR    (DIR holds libblas.so.3 and liblapack.so.3,
#                                 put first on LD_LIBRARY_PATH for that run
#                                 only; e.g. the openblas-pthread folder of
#                                 Debian's libopenblas0-pthread)
#   CORETYPE  keep | unset | NAME  (OPENBLAS_CORETYPE as found, removed, or
#                                 set to NAME, e.g. Haswell)
#
# Example (OpenBLAS unpacked, not installed, so the system BLAS is untouched):
#   apt-get download libopenblas0-pthread && dpkg -x libopenblas0-pthread_*.deb ob
#   tools/test-matrix.sh build native:reference:keep v1:reference:keep \
#       v3:$PWD/ob/usr/lib/x86_64-linux-gnu/openblas-pthread:unset
#
# Each run is `meson test --no-rebuild` without the install suite (it does
# not depend on the kernel or the BLAS), logged under its own --logbase so
# that the build's main testlog is left alone. Prints one line per run,
#     matrix: <config> ok|FAIL (<meson summary>) [N s]
# and exits non-zero if any run failed.
set -u
if [ $# -lt 2 ]; then
    sed -n '2,29p' "$0" | sed 's/^# \{0,1\}//'
    exit 2
fi
build=$1
shift
bad=0
n=0
for cfg in "$@"; do
    IFS=: read -r isa blas core <<<"$cfg"
    if [ -z "${core:-}" ]; then
        echo "matrix: $cfg FAIL (expected ISA:BLAS:CORETYPE)"
        bad=$((bad + 1))
        continue
    fi
    unsets=()   # env -u options come before the assignments
    env_args=()
    case $isa in
    native) unsets+=(-u MCDIFF_KERNEL_ISA) ;;
    v1 | v3) env_args+=("MCDIFF_KERNEL_ISA=$isa") ;;
    *) echo "matrix: $cfg FAIL (ISA must be native, v3 or v1)"; bad=$((bad + 1)); continue ;;
    esac
    if [ "$blas" != reference ]; then
        if [ ! -e "$blas/libblas.so.3" ] || [ ! -e "$blas/liblapack.so.3" ]; then
            echo "matrix: $cfg FAIL (no libblas.so.3 and liblapack.so.3 in $blas)"
            bad=$((bad + 1))
            continue
        fi
        env_args+=("LD_LIBRARY_PATH=$blas${LD_LIBRARY_PATH:+:$LD_LIBRARY_PATH}")
    fi
    case $core in
    keep) ;;
    unset) unsets+=(-u OPENBLAS_CORETYPE -u OPENBLAS_L2_SIZE) ;;
    *) env_args+=("OPENBLAS_CORETYPE=$core") ;;
    esac
    n=$((n + 1))
    t0=$SECONDS
    base="matrix-$n-$isa-$(basename "$blas")-$core"
    out=$(env "${unsets[@]}" "${env_args[@]}" meson test -C "$build" --no-rebuild --print-errorlogs \
        --no-suite install --logbase "$base" 2>&1)
    rc=$?
    summary=$(grep -E '^(Ok|Expected Fail|Fail|Timeout|Skipped):' <<<"$out" | tr -s ' ' | tr '\n' ' ')
    if [ $rc -eq 0 ]; then
        echo "matrix: $cfg ok (${summary% }) [$((SECONDS - t0)) s]"
    else
        echo "matrix: $cfg FAIL (${summary}log $build/meson-logs/$base.txt) [$((SECONDS - t0)) s]"
        grep -E '^ *[0-9]+/[0-9]+ .*(FAIL|TIMEOUT)' <<<"$out" | head -20
        bad=$((bad + 1))
    fi
done
[ "$bad" -eq 0 ]
