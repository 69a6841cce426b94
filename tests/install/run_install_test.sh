#!/bin/sh
# run_install_test.sh - install this build into a temporary DESTDIR and use
# the staged copy from outside the build, as a simulator would:
#   1. meson install -C BUILDDIR --destdir TMP --no-rebuild --quiet
#   2. check the installed files (header, library, pkg-config file, CMake
#      package files; the CLI, its man page and the Fortran module when they
#      were installed)
#   3. compile tests/install/consumer.c with cc and pkg-config (sysroot into
#      the DESTDIR, a run path to the staged library directory as a user
#      outside the system directories writes it), run it and check that it
#      loaded the staged library
#   4. if cmake is installed: the same through find_package(mcdiff CONFIG
#      REQUIRED) with CMAKE_PREFIX_PATH into the DESTDIR, plus version checks
#   5. if the Fortran module was installed and its compiler is here: compile
#      tests/install/consumer.f90 against the staged mcdiff.mod
# Exit 0 pass, 1 fail, 77 skip (reason printed): no meson, no C compiler.
# A missing cmake or pkg-config skips only that part (reported).
#
# Usage (from install/meson.build):
#   run_install_test.sh BUILDDIR MESON PREFIX LIBDIR INCLUDEDIR BINDIR MANDIR SRCDIR [DATADIR [PYTHON]]
# Everything staged is run with no LD_LIBRARY_PATH: the installed programs
# and libraries carry run paths relative to themselves ($ORIGIN), so the
# staged tree works as an installation under any prefix would.
set -u

BUILD=$1 MESON=$2 PREFIX=$3 LIBDIR=$4 INCLUDEDIR=$5 BINDIR=$6 MANDIR=$7 SRC=$8
DATADIR=${9:-share} PYTHON=${10:-}
unset LD_LIBRARY_PATH DYLD_LIBRARY_PATH

skip() { echo "SKIP: $*"; exit 77; }
fail() { echo "FAIL: $*"; exit 1; }
note() { echo "install-test: $*"; }

# paths of the options may be relative to the prefix or absolute
abspath() { case $1 in /*) printf '%s\n' "$1" ;; *) printf '%s\n' "$PREFIX/$1" ;; esac; }
LIBDIR=$(abspath "$LIBDIR")
INCLUDEDIR=$(abspath "$INCLUDEDIR")
BINDIR=$(abspath "$BINDIR")
MANDIR=$(abspath "$MANDIR")
DATADIR=$(abspath "$DATADIR")

[ -n "$MESON" ] || skip "the meson command was not found when configuring"
CC=${CC:-cc}
# shellcheck disable=SC2086 # CC may hold a launcher and the compiler
command -v ${CC%% *} >/dev/null 2>&1 || skip "no C compiler ($CC) to build the consumer"

TMP=$(mktemp -d "${TMPDIR:-/tmp}/mcdiff-install.XXXXXX") || fail "mktemp"
trap 'rm -rf "$TMP"' EXIT INT TERM
R=$TMP/root

note "meson install --destdir $R"
"$MESON" install -C "$BUILD" --destdir "$R" --no-rebuild --quiet \
    >"$TMP/install.log" 2>&1 || { cat "$TMP/install.log"; fail "meson install"; }

# --- installed files --------------------------------------------------------
[ -f "$R$INCLUDEDIR/mcdiff.h" ] || fail "header missing: $INCLUDEDIR/mcdiff.h"
LIBFILE=
for f in "$R$LIBDIR"/libmcdiff.so "$R$LIBDIR"/libmcdiff.dylib "$R$LIBDIR"/libmcdiff.a; do
    if [ -e "$f" ]; then LIBFILE=$f; break; fi
done
[ -n "$LIBFILE" ] || fail "library missing in $LIBDIR"
note "library: ${LIBFILE#"$R"}"
PCDIR=$R$LIBDIR/pkgconfig
[ -f "$PCDIR/mcdiff.pc" ] || fail "pkg-config file missing: $LIBDIR/pkgconfig/mcdiff.pc"
CMDIR=$R$LIBDIR/cmake/mcdiff
[ -f "$CMDIR/mcdiffConfig.cmake" ] || fail "missing $LIBDIR/cmake/mcdiff/mcdiffConfig.cmake"
[ -f "$CMDIR/mcdiffConfigVersion.cmake" ] || fail "missing $LIBDIR/cmake/mcdiff/mcdiffConfigVersion.cmake"
# nothing may escape the DESTDIR into the build tree's paths
grep -q "$BUILD" "$PCDIR/mcdiff.pc" "$CMDIR/mcdiffConfig.cmake" &&
    fail "installed package files refer to the build directory $BUILD"

# no library search path: run paths must do
runlib() { "$@"; }
RPATH_FLAG="-Wl,-rpath,$R$LIBDIR"
if command -v readelf >/dev/null 2>&1; then
    for f in "$R$LIBDIR"/libmcdiff.so.* "$R$LIBDIR"/libmcdiff_fortran.so.* "$R$BINDIR/mcdiff"; do
        [ -f "$f" ] && [ ! -h "$f" ] || continue
        readelf -d "$f" | grep -q 'R\(UN\)\{0,1\}PATH.*\$ORIGIN' ||
            fail "${f#"$R"} has no run path relative to \$ORIGIN: $(readelf -d "$f" | grep PATH)"
    done
fi

if [ -x "$R$BINDIR/mcdiff" ]; then
    runlib "$R$BINDIR/mcdiff" --version >"$TMP/cli.txt" 2>&1 ||
        { cat "$TMP/cli.txt"; fail "installed mcdiff --version"; }
    note "CLI installed and runs: $(head -n 1 "$TMP/cli.txt")"
else
    note "CLI not installed (built with -Dcli=false?): not checked"
fi
MAN5=
for f in "$R$MANDIR"/man5/mcdiff-species.5*; do
    if [ -f "$f" ]; then MAN5=$f; break; fi
done
[ -n "$MAN5" ] || fail "the species-file format page is not installed: $MANDIR/man5/mcdiff-species.5"
[ -f "$R$DATADIR/doc/mcdiff/README.md" ] || fail "README not installed in $DATADIR/doc/mcdiff"
note "species-file page and README installed: ${MAN5#"$R"}, $DATADIR/doc/mcdiff/README.md"
LIQ="$R$DATADIR/doc/mcdiff/liquid-methanol-water.txt"
[ -f "$LIQ" ] || fail "the example liquid parameter file is not installed in $DATADIR/doc/mcdiff"
note "example liquid parameter file installed: $DATADIR/doc/mcdiff/liquid-methanol-water.txt"
if [ -x "$R$BINDIR/mcdiff" ]; then
    runlib "$R$BINDIR/mcdiff" liquid --params "$LIQ" -x 0.3,0.7 -T 320 \
        >"$TMP/liq.txt" 2>&1 || { cat "$TMP/liq.txt"; fail "installed mcdiff liquid --params (the installed example)"; }
fi
MAN=
for f in "$R$MANDIR"/man1/mcdiff.1*; do
    if [ -f "$f" ]; then MAN=$f; break; fi
done
if [ -n "$MAN" ]; then
    # a man page must at least have a NAME section naming the tool
    grep -qi '^\.SH *"\{0,1\}NAME' "$MAN" 2>/dev/null || gzip -dc "$MAN" 2>/dev/null |
        grep -qi '^\.SH *"\{0,1\}NAME' || fail "man page without a NAME section: ${MAN#"$R"}"
    note "man page installed: ${MAN#"$R"}"
else
    note "no man page installed: not checked"
fi

# --- pkg-config + cc ---------------------------------------------------------
if command -v pkg-config >/dev/null 2>&1; then
    # PKG_CONFIG_PATH first so a system-wide mcdiff.pc cannot win; the
    # sysroot prefixes -I/-L of the .pc file with the DESTDIR.
    # a static-only installation needs the private dependencies too
    PCSTATIC=
    case $LIBFILE in *.a) PCSTATIC=--static ;; esac
    FLAGS=$(PKG_CONFIG_PATH="$PCDIR${PKG_CONFIG_PATH:+:$PKG_CONFIG_PATH}" \
            PKG_CONFIG_SYSROOT_DIR="$R" pkg-config $PCSTATIC --cflags --libs mcdiff) ||
        fail "pkg-config --cflags --libs mcdiff"
    note "pkg-config: $FLAGS"
    case $FLAGS in *"$R"*) ;; *) fail "pkg-config flags do not point into the DESTDIR";; esac
    # the header's directory only: no multiarch or library directory
    CFLAGS_PC=$(PKG_CONFIG_PATH="$PCDIR${PKG_CONFIG_PATH:+:$PKG_CONFIG_PATH}" \
            PKG_CONFIG_SYSROOT_DIR="$R" pkg-config --cflags mcdiff)
    [ "$(echo $CFLAGS_PC)" = "-I$R$INCLUDEDIR" ] ||
        fail "pkg-config --cflags mcdiff gives '$CFLAGS_PC', expected -I$R$INCLUDEDIR"
else
    note "pkg-config not found: pkg-config part SKIPPED, using -I/-L directly"
    FLAGS="-I$R$INCLUDEDIR -L$R$LIBDIR -lmcdiff"
    case $LIBFILE in *.a) FLAGS="$FLAGS -llapacke -llapack" ;; esac
    PCSTATIC=
fi
# shellcheck disable=SC2086 # word splitting of CC and FLAGS is intended
$CC -o "$TMP/consumer" "$SRC/consumer.c" $FLAGS "$RPATH_FLAG" -lm >"$TMP/cc.log" 2>&1 ||
    { cat "$TMP/cc.log"; fail "compiling consumer.c against the installed copy"; }
runlib "$TMP/consumer" || fail "consumer (pkg-config build)"
if command -v ldd >/dev/null 2>&1 && [ "${LIBFILE##*.}" != a ]; then
    WHERE=$(runlib ldd "$TMP/consumer" | grep 'libmcdiff\.')
    case $WHERE in *"$R"*) note "loaded: $WHERE" ;;
                   *) fail "consumer did not load the staged library: $WHERE" ;; esac
fi

# --- CMake find_package --------------------------------------------------------
if command -v cmake >/dev/null 2>&1; then
    mkdir -p "$TMP/cmake-src"
    cp "$SRC/consumer.c" "$TMP/cmake-src/"
    cat >"$TMP/cmake-src/CMakeLists.txt" <<EOF
cmake_minimum_required(VERSION 3.10)
project(mcdiff_consumer C)
find_package(mcdiff 0.1 CONFIG REQUIRED)
if(NOT mcdiff_DIR MATCHES "^$R/")
  message(FATAL_ERROR "found mcdiff outside the DESTDIR: \${mcdiff_DIR}")
endif()
if(NOT TARGET mcdiff::mcdiff)
  message(FATAL_ERROR "no imported target mcdiff::mcdiff")
endif()
# a newer major version must be refused by mcdiffConfigVersion.cmake
find_package(mcdiff 99 CONFIG QUIET)
if(mcdiff_FOUND)
  message(FATAL_ERROR "mcdiff 99 accepted by the version file")
endif()
find_package(mcdiff \${MCDIFF_EXPECT_VERSION} EXACT CONFIG REQUIRED)
message(STATUS "mcdiff \${mcdiff_VERSION} from \${mcdiff_DIR}")
add_executable(consumer consumer.c)
target_link_libraries(consumer PRIVATE mcdiff::mcdiff m)
if(MCDIFF_TEST_FORTRAN)
  enable_language(Fortran)
  if(NOT TARGET mcdiff::fortran)
    message(FATAL_ERROR "mcdiff.mod installed but no imported target mcdiff::fortran")
  endif()
  add_executable(fconsumer consumer.f90)
  target_link_libraries(fconsumer PRIVATE mcdiff::fortran)
endif()
EOF
    VERSION=$(sed -n 's/^Version: *//p' "$PCDIR/mcdiff.pc")
    CCBIN=${CC##* }
    # the Fortran target too when the module was installed and its compiler
    # is here (mcdiff.mod only works with the compiler that wrote it)
    FC=${FC:-gfortran}
    CM_FORTRAN=OFF
    if [ -f "$R$INCLUDEDIR/mcdiff.mod" ] && command -v "$FC" >/dev/null 2>&1; then
        CM_FORTRAN=ON
        cp "$SRC/consumer.f90" "$TMP/cmake-src/"
    fi
    if ! cmake -S "$TMP/cmake-src" -B "$TMP/cmake-build" \
            -DCMAKE_PREFIX_PATH="$R$PREFIX" -DCMAKE_C_COMPILER="$CCBIN" \
            -DCMAKE_Fortran_COMPILER="$FC" -DMCDIFF_TEST_FORTRAN="$CM_FORTRAN" \
            -DMCDIFF_EXPECT_VERSION="$VERSION" >"$TMP/cmake.log" 2>&1 ||
       ! cmake --build "$TMP/cmake-build" >>"$TMP/cmake.log" 2>&1; then
        cat "$TMP/cmake.log"
        fail "CMake consumer (find_package(mcdiff CONFIG REQUIRED))"
    fi
    grep 'mcdiff .* from' "$TMP/cmake.log" | sed 's/^-- /install-test: cmake: /'
    runlib "$TMP/cmake-build/consumer" || fail "consumer (CMake build)"
    if [ "$CM_FORTRAN" = ON ]; then
        runlib "$TMP/cmake-build/fconsumer" || fail "Fortran consumer (CMake build, mcdiff::fortran)"
    else
        note "CMake mcdiff::fortran not checked (module not installed or no $FC)"
    fi
else
    note "cmake not found: CMake find_package part SKIPPED"
fi

# --- Fortran module ----------------------------------------------------------
if [ -f "$R$INCLUDEDIR/mcdiff.mod" ]; then
    [ -f "$R$INCLUDEDIR/mcdiff.f90" ] || fail "mcdiff.mod installed without mcdiff.f90"
    [ -f "$PCDIR/mcdiff-fortran.pc" ] || fail "mcdiff-fortran.pc missing"
    FC=${FC:-gfortran}
    if command -v "$FC" >/dev/null 2>&1 && command -v pkg-config >/dev/null 2>&1; then
        FFLAGS=$(PKG_CONFIG_PATH="$PCDIR${PKG_CONFIG_PATH:+:$PKG_CONFIG_PATH}" \
                 PKG_CONFIG_SYSROOT_DIR="$R" pkg-config $PCSTATIC --cflags --libs mcdiff-fortran) ||
            fail "pkg-config mcdiff-fortran"
        # shellcheck disable=SC2086
        "$FC" -o "$TMP/fconsumer" "$SRC/consumer.f90" $FFLAGS "$RPATH_FLAG" >"$TMP/fc.log" 2>&1 ||
            { cat "$TMP/fc.log"; fail "compiling consumer.f90 with the installed mcdiff.mod"; }
        runlib "$TMP/fconsumer" || fail "Fortran consumer"
    else
        note "no Fortran compiler ($FC) or pkg-config: Fortran consumer SKIPPED"
    fi
else
    note "Fortran module not installed: not checked"
fi

# --- Python package -----------------------------------------------------------
if [ -n "$PYTHON" ] && [ -x "$PYTHON" ]; then
    PYFILE=$(cd "$R" && find . -path '*/mcdiff/_native.py' | head -n 1)
    [ -n "$PYFILE" ] || fail "Python package not installed"
    PYDIR=$(dirname "$(dirname "${PYFILE#.}")")
    note "Python package: $PYDIR/mcdiff"
    # where the interpreter it was installed for looks, when the prefix is
    # one it searches (as /usr/local for Debian's python3)
    if "$PYTHON" -c 'import sys; sys.exit(0 if any(p.startswith(sys.argv[1] + "/") for p in sys.path) else 1)' "$PREFIX"; then
        "$PYTHON" -c 'import sys; sys.exit(0 if sys.argv[1] in sys.path else 1)' "$PYDIR" ||
            fail "$PYDIR is not on the sys.path of $PYTHON"
    fi
    (cd "$TMP" && PYTHONPATH="$R$PYDIR" MCDIFF_LIBRARY="$(ls "$R$LIBDIR"/libmcdiff.so.[0-9]* | head -n 1)" \
        "$PYTHON" -c 'import mcdiff, sys; sys.exit(0 if mcdiff.__file__.startswith(sys.argv[1]) else 1)' "$R") ||
        fail "the staged Python package does not import"
fi

note "all checks passed"
exit 0
