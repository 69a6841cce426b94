#!/usr/bin/env bash
# .ci/robustness.sh - sanitizer, valgrind, ThreadSanitizer and fuzzing
# stages. Run from the repository root after the main test run (.ci/run);
# takes no arguments. Prints one line per stage,
#     robustness: <stage> ok
#     robustness: <stage> FAIL (<why>)
# then "robustness: N passed, M failed", and exits non-zero if any stage
# failed. Logs: build-robust-logs/<stage>.log (not part of the repo).
#
# Stages
#   asan      gcc, -Db_sanitize=address,undefined: the whole `meson test`
#             (Python binding disabled: an uninstrumented interpreter cannot
#             load an ASan library; the CLI tests run the instrumented tool;
#             suite `install` skipped: it builds an uninstrumented consumer
#             program against the installed ASan library, which cannot run).
#             UB and leaks are fatal (halt_on_error=1, detect_leaks=1,
#             CK_FORK=no so that each Check suite is one process whose
#             leaks are reported at exit).
#   valgrind  `meson test --setup valgrind` (tests/meson.build) on the unit
#             suite of the plain `build` directory (built by .ci/run;
#             configured here if missing): --leak-check=full, any error or
#             definite/indirect leak fails.
#   tsan      gcc -fsanitize=thread, tests/test_threads only.
#   openmp    gcc, -Dopenmp=enabled: the batched calls parallel over cells;
#             the batch, allocation and thread suites (results bit-identical
#             to one thread) and the exported-symbol check.
#   fuzz      clang + libFuzzer (-Dfuzz=true), each harness for
#             FUZZ_SECONDS (default 20) or FUZZ_RUNS (default 2000000)
#             executions, whichever comes first, from a temporary copy of
#             tests/fuzz/corpus/<harness>/ (the repository is not changed).
#   clang     the default build with clang instead of gcc, warnings as
#             errors (the main build is gcc's): the whole `meson test`
#             less the install suite (the baseline kernel only: the kernels
#             per instruction set are built by gcc alone).
#   matrix    the plain build's whole `meson test` (less the install suite)
#             under other kernel instruction-set caps and with Debian's
#             OpenBLAS instead of the reference BLAS (tools/test-matrix.sh;
#             OpenBLAS is fetched with apt-get download and unpacked into a
#             temporary folder, never installed).
# Environment: ROBUST_STAGES="asan valgrind tsan openmp clang matrix fuzz"
# selects stages;
# FUZZ_SECONDS, FUZZ_RUNS as above; JOBS (default 2) for ninja;
# ROBUST_PREFIX (default "build-": build-asan, build-tsan, build-clang, build-fuzz,
# build-robust-logs) and ROBUST_PLAIN (default "build") place the build
# directories elsewhere, e.g. ROBUST_PREFIX=/tmp/rb- ROBUST_PLAIN=/tmp/rb-plain.
set -u
cd "$(dirname "$0")/.." || exit 1

STAGES=${ROBUST_STAGES:-"asan valgrind tsan openmp clang matrix fuzz"}
FUZZ_SECONDS=${FUZZ_SECONDS:-20}
FUZZ_RUNS=${FUZZ_RUNS:-2000000}
JOBS=${JOBS:-2}
PFX=${ROBUST_PREFIX:-build-}
PLAIN=${ROBUST_PLAIN:-build}
LOGDIR=${PFX}robust-logs
rm -rf "$LOGDIR"
mkdir -p "$LOGDIR"
LOGABS=$(cd "$LOGDIR" && pwd)
passed=0
failed=0

# Uninstrumented OpenBLAS threads confuse ThreadSanitizer and leave
# "possibly lost" blocks under valgrind: run LAPACK single-threaded.
export OPENBLAS_NUM_THREADS=1
export MCD_TEST_DATA="$PWD/tests/data"
NO_EXTRAS=(-Dpython=disabled -Dmpi=disabled)

# Each stage's line ends with its wall time, [N s] (STAGE_T0 is set before
# each stage runs).
STAGE_T0=$SECONDS
took() { echo "[$((SECONDS - STAGE_T0)) s]"; }
ok() { echo "robustness: $1 ok${2:+ ($2)} $(took)"; passed=$((passed + 1)); }
fail() { echo "robustness: $1 FAIL ($2) $(took)"; failed=$((failed + 1)); }
skipped=0
skip() { echo "robustness: $1 skipped ($2) $(took)"; skipped=$((skipped + 1)); }

stage_asan() {
    local log=$LOGDIR/asan.log
    rm -rf "${PFX}asan"
    if ! meson setup "${PFX}asan" -Db_sanitize=address,undefined -Db_lundef=false \
            "${NO_EXTRAS[@]}" >"$log" 2>&1; then
        fail asan "meson setup, see $log"; return
    fi
    if ! ninja -j"$JOBS" -C "${PFX}asan" >>"$log" 2>&1; then
        fail asan "build, see $log"; return
    fi
    if ASAN_OPTIONS=halt_on_error=1:detect_leaks=1:abort_on_error=0:detect_stack_use_after_return=1 \
       UBSAN_OPTIONS=halt_on_error=1:print_stacktrace=1 \
       LSAN_OPTIONS=exitcode=23 CK_FORK=no \
       meson test -C "${PFX}asan" --print-errorlogs --timeout-multiplier 4 \
           --no-suite install >>"$log" 2>&1; then
        ok asan "$(grep -E '^Ok:' "$log" | tr -s ' ') tests"
    else
        fail asan "$(grep -E '^(Ok|Fail|Timeout):' "$log" | tr -s ' ' | tr '\n' ' ')see $log"
    fi
}

stage_valgrind() {
    local log=$LOGDIR/valgrind.log
    if ! command -v valgrind >/dev/null; then
        fail valgrind "valgrind not installed"; return
    fi
    if [ ! -f "$PLAIN/build.ninja" ]; then
        meson setup "$PLAIN" >"$log" 2>&1 || { fail valgrind "meson setup, see $log"; return; }
    fi
    ninja -j"$JOBS" -C "$PLAIN" >>"$log" 2>&1 || { fail valgrind "build, see $log"; return; }
    # the 'valgrind' test setup of tests/meson.build: memcheck, any error or
    # definite/indirect leak fails; the kernel-variant repeats and the
    # Python script checks are left out (--suite unit would bring them back)
    if meson test -C "$PLAIN" --setup valgrind --suite unit --no-suite kernel-variant \
            --no-suite script --num-processes "$JOBS" --print-errorlogs \
            --logbase valgrind >>"$log" 2>&1; then
        ok valgrind "$(grep -E '^Ok:' "$log" | tr -s ' ') tests, 0 errors, 0 leaks"
    else
        fail valgrind "$(grep -E '^(Ok|Fail|Timeout):' "$log" | tr -s ' ' | tr '\n' ' ')see $log"
    fi
}

stage_tsan() {
    local log=$LOGDIR/tsan.log
    rm -rf "${PFX}tsan"
    # Full instrumentation: the kernels are chosen by a plain function
    # (lib/base/isa.c), not by ifunc resolvers, which ran during
    # relocation before the TSan runtime existed and needed
    # --param=tsan-instrument-func-entry-exit=0 here.
    if ! CC=gcc meson setup "${PFX}tsan" -Db_sanitize=thread -Db_lundef=false -Dcli=false \
            -Dfortran=disabled "${NO_EXTRAS[@]}" >"$log" 2>&1; then
        fail tsan "meson setup, see $log"; return
    fi
    if ! ninja -j"$JOBS" -C "${PFX}tsan" tests/test_threads >>"$log" 2>&1; then
        fail tsan "build, see $log"; return
    fi
    if TSAN_OPTIONS=halt_on_error=1:second_deadlock_stack=1 CK_FORK=no \
            "${PFX}tsan"/tests/test_threads >>"$log" 2>&1; then
        ok tsan "test_threads clean"
    else
        fail tsan "see $log"
    fi
}

stage_openmp() {
    local log=$LOGDIR/openmp.log
    rm -rf "${PFX}openmp"
    if ! CC=gcc meson setup "${PFX}openmp" -Dopenmp=enabled -Dcli=false \
            -Dfortran=disabled "${NO_EXTRAS[@]}" >"$log" 2>&1; then
        fail openmp "meson setup, see $log"; return
    fi
    if ! ninja -j"$JOBS" -C "${PFX}openmp" >>"$log" 2>&1; then
        fail openmp "build, see $log"; return
    fi
    if OMP_NUM_THREADS=2 meson test -C "${PFX}openmp" --print-errorlogs \
            batch alloc threads iterative exported_symbols \
            >>"$log" 2>&1; then
        ok openmp "$(grep -E '^Ok:' "$log" | tr -s ' ') tests"
    else
        fail openmp "$(grep -E '^(Ok|Fail|Timeout):' "$log" | tr -s ' ' | tr '\n' ' ')see $log"
    fi
}

# A second compiler: its warnings (-Wdouble-promotion also flags double to
# long double, -Wfor-loop-analysis, ...) and its code generation.
stage_clang() {
    local log=$LOGDIR/clang.log
    if ! command -v clang >/dev/null; then
        fail clang "clang not installed"; return
    fi
    rm -rf "${PFX}clang"
    if ! CC=clang meson setup "${PFX}clang" --werror >"$log" 2>&1; then
        fail clang "meson setup, see $log"; return
    fi
    if ! ninja -j"$JOBS" -C "${PFX}clang" >>"$log" 2>&1; then
        fail clang "build with --werror: $(grep -c 'warning:\|error:' "$log") diagnostics, see $log"; return
    fi
    if meson test -C "${PFX}clang" --no-suite install --num-processes "$JOBS" \
            --print-errorlogs >>"$log" 2>&1; then
        ok clang "clang $(clang -dumpversion): $(grep -E '^Ok:' "$log" | tr -s ' ') tests"
    else
        fail clang "$(grep -E '^(Ok|Fail|Timeout):' "$log" | tr -s ' ' | tr '\n' ' ')see $log"
    fi
}

# The whole suite again under other instruction-set caps and another BLAS
# (tools/test-matrix.sh): reference BLAS with the baseline kernels (no FMA,
# 2 lanes), and Debian's OpenBLAS (unpacked here, not installed, so the
# system's BLAS choice is untouched) with the AVX2 kernels and OpenBLAS's
# own core detection, and with the native kernels and OPENBLAS_CORETYPE as
# the environment has it.
stage_matrix() {
    local log=$LOGDIR/matrix.log ob deb libdir
    if [ ! -f "$PLAIN/build.ninja" ]; then
        meson setup "$PLAIN" >"$log" 2>&1 || { fail matrix "meson setup, see $log"; return; }
    fi
    ninja -j"$JOBS" -C "$PLAIN" >>"$log" 2>&1 || { fail matrix "build, see $log"; return; }
    ob=$(mktemp -d)
    if (cd "$ob" && apt-get download libopenblas0-pthread) >>"$log" 2>&1 \
            && deb=$(ls "$ob"/libopenblas0-pthread_*.deb 2>/dev/null) \
            && dpkg -x "$deb" "$ob/root" >>"$log" 2>&1; then
        libdir=$(dirname "$(find "$ob/root" -path '*openblas-pthread/libblas.so.3' | head -1)")
    fi
    if [ -z "${libdir:-}" ] || [ "$libdir" = . ]; then
        rm -rf "$ob"
        skip matrix "could not unpack Debian's libopenblas0-pthread (apt-get download), see $log"
        return
    fi
    if (unset OPENBLAS_NUM_THREADS; tools/test-matrix.sh "$PLAIN" v1:reference:keep \
            "v3:$libdir:unset" "native:$libdir:keep") >>"$log" 2>&1; then
        ok matrix "$(grep -c '^matrix: .* ok' "$log") runs: $(grep -E '^matrix: ' "$log" | cut -d' ' -f2 | sed "s|$libdir|openblas|" | tr '\n' ' ')"
    else
        fail matrix "$(grep -E '^matrix: .* FAIL' "$log" | cut -d' ' -f2 | sed "s|$libdir|openblas|" | tr '\n' ' ')see $log"
    fi
    rm -rf "$ob"
}

probe_fuzzer_link() {
    local d rc
    d=$(mktemp -d)
    printf '%s\n' 'int LLVMFuzzerTestOneInput(const unsigned char *d, unsigned long n);' \
        'int LLVMFuzzerTestOneInput(const unsigned char *d, unsigned long n) { return (int)(d && n > 7u) & 0; }' \
        >"$d/probe.c"
    clang -fsanitize=fuzzer "$d/probe.c" -o "$d/probe"
    rc=$?
    rm -rf "$d"
    return $rc
}

# A crash is only useful if it can be reproduced where the logs are not
# kept (CI keeps stdout only): print the harness's own message, the
# sanitizer's summary and each saved input as base64 (decode with
# `base64 -d > crash && build-fuzz/tests/fuzz/<harness> crash`).
report_fuzz_crash() {
    local h=$1 log=$2 f
    sed -n "/^=== $h\$/,\$p" "$log" |
        grep -E 'invariant violated|ERROR: |SUMMARY: |runtime error|leak of|#[0-9]+ 0x.* in (mcd|LLVMFuzzer)' |
        head -n 20 | sed "s/^/robustness: fuzz $h: /"
    for f in "$LOGABS/$h-"*; do
        [ -f "$f" ] || continue
        echo "robustness: fuzz $h: input $(basename "$f") ($(wc -c <"$f") bytes), base64:"
        base64 -w 76 "$f" | head -n 40 | sed 's/^/    /'
    done
}

stage_fuzz() {
    local log=$LOGDIR/fuzz.log h corpus summary="" bad=0 execs fz
    if ! command -v clang >/dev/null; then
        fail fuzz "clang not installed"; return
    fi
    # clang links -fsanitize=fuzzer against its own versioned runtime
    # (Debian: libclang-rt-<major>-dev, which .ci/run picks for the
    # installed clang). Without it the stage cannot run at all: say so and
    # which package is missing, instead of failing on a build error.
    if ! probe_fuzzer_link >"$log" 2>&1; then
        skip fuzz "clang $(clang -dumpversion 2>/dev/null) cannot link -fsanitize=fuzzer: install libclang-rt-$(clang -dumpversion 2>/dev/null | cut -d. -f1)-dev, see $log"
        return
    fi
    rm -rf "${PFX}fuzz"
    if ! CC=clang meson setup "${PFX}fuzz" -Dfuzz=true -Dtests=disabled -Dcli=false \
            -Dfortran=disabled "${NO_EXTRAS[@]}" -Db_sanitize=address,undefined -Db_lundef=false \
            -Dc_args=-fsanitize=fuzzer-no-link >"$log" 2>&1; then
        fail fuzz "meson setup, see $log"; return
    fi
    if ! ninja -j"$JOBS" -C "${PFX}fuzz" >>"$log" 2>&1; then
        fail fuzz "build, see $log"; return
    fi
    fz=$(cd "${PFX}fuzz" && pwd)/tests/fuzz
    for src in tests/fuzz/fuzz_*.c; do
        h=$(basename "$src" .c)
        [ -x "$fz/$h" ] || continue
        corpus=$(mktemp -d)
        cp -r "tests/fuzz/corpus/$h/." "$corpus/" 2>/dev/null || true
        echo "=== $h" >>"$log"
        if (cd "$corpus" && ASAN_OPTIONS=detect_leaks=1 \
                "$fz/$h" -max_total_time="$FUZZ_SECONDS" \
                -runs="$FUZZ_RUNS" -rss_limit_mb=2048 -print_final_stats=1 \
                -artifact_prefix="$LOGABS/$h-" . ) >>"$log" 2>&1; then
            execs=$(grep -E 'stat::number_of_executed_units' "$log" | tail -1 | awk '{print $2}')
            summary="$summary $h=${execs:-?}"
        else
            bad=$((bad + 1))
            summary="$summary $h=CRASH"
            report_fuzz_crash "$h" "$log"
        fi
        rm -rf "$corpus"
    done
    if [ -z "$summary" ]; then
        fail fuzz "no harness built, see $log"
    elif [ "$bad" -eq 0 ]; then
        ok fuzz "executions:$summary"
    else
        fail fuzz "$bad harness(es) crashed:$summary; reproducers in $LOGDIR/"
    fi
}

for s in $STAGES; do
    STAGE_T0=$SECONDS
    case $s in
    asan) stage_asan ;;
    valgrind) stage_valgrind ;;
    tsan) stage_tsan ;;
    openmp) stage_openmp ;;
    clang) stage_clang ;;
    fuzz) stage_fuzz ;;
    matrix) stage_matrix ;;
    *) fail "$s" "unknown stage" ;;
    esac
done
if [ "$skipped" -gt 0 ]; then
    echo "robustness: $passed passed, $failed failed, $skipped skipped"
else
    echo "robustness: $passed passed, $failed failed"
fi
[ "$failed" -eq 0 ]
