#!/bin/sh
# run_python_install_test.sh - the two ways of installing the Python
# package, each into a fresh virtual environment (python3 -m venv
# --system-site-packages, so numpy and the build tools come from Debian),
# checked from outside the source tree with no PYTHONPATH, MCDIFF_LIBRARY
# or LD_LIBRARY_PATH:
#   1. meson setup --prefix=VENV, meson install: `import mcdiff` in the
#      environment's python finds the package and the installed library,
#      and VENV/bin/mcdiff runs (its run path finds libmcdiff);
#   2. pip install --no-build-isolation --no-index SRC (meson-python, from
#      pyproject.toml): the package comes with the library beside it.
# Exit 0 pass, 1 fail, 77 skip (reason printed): no venv module, no meson,
# no meson-python.
#
# Usage (from install/meson.build): run_python_install_test.sh SRC MESON PYTHON
set -u
SRC=$1 MESON=$2 PY=$3

skip() { echo "SKIP: $*"; exit 77; }
fail() { echo "FAIL: $*"; exit 1; }
note() { echo "python-install-test: $*"; }

[ -n "$MESON" ] || skip "the meson command was not found when configuring"
"$PY" -c 'import venv, ensurepip' 2>/dev/null ||
    skip "$PY has no venv/ensurepip (Debian: apt-get install python3-venv)"

TMP=$(mktemp -d "${TMPDIR:-/tmp}/mcdiff-pyinstall.XXXXXX") || fail "mktemp"
trap 'rm -rf "$TMP"' EXIT INT TERM
unset PYTHONPATH MCDIFF_LIBRARY LD_LIBRARY_PATH

# what an installed package must do: load its library and compute
CHECK='
import os, sys, mcdiff
venv = os.path.realpath(sys.argv[1])
pkg = os.path.realpath(mcdiff.__file__)
lib = os.path.realpath(mcdiff.library_path)
assert pkg.startswith(venv + os.sep), "package from %s, not the venv" % pkg
assert lib.startswith(venv + os.sep), "library from %s, not the venv" % lib
db = mcdiff.Database.builtin()
mix = db.mixture(["hydrogen", "nitrogen"])
J = mix.fluxes(300.0, mcdiff.ATM, [0.5, 0.5], [1.0, -1.0])
assert abs(J[0] + J[1]) < 1e-12 * abs(J[0]) and J[0] < 0, J
print("package", pkg, "library", lib)
'

# --- 1. meson install into the environment's prefix -------------------------
V1=$TMP/venv-meson
"$PY" -m venv --system-site-packages "$V1" >"$TMP/venv1.log" 2>&1 ||
    { cat "$TMP/venv1.log"; fail "python3 -m venv"; }
note "meson setup --prefix=$V1"
"$MESON" setup "$TMP/b" "$SRC" --prefix="$V1" -Dtests=disabled \
    -Dfortran=disabled -Dmpi=disabled -Ddefault_library=shared \
    >"$TMP/setup.log" 2>&1 || { cat "$TMP/setup.log"; fail "meson setup"; }
"$MESON" compile -C "$TMP/b" >"$TMP/build.log" 2>&1 ||
    { tail -40 "$TMP/build.log"; fail "meson compile"; }
"$MESON" install -C "$TMP/b" --quiet >"$TMP/install.log" 2>&1 ||
    { cat "$TMP/install.log"; fail "meson install"; }
(cd "$TMP" && "$V1/bin/python" -c "$CHECK" "$V1") ||
    fail "import mcdiff after meson install into $V1"
"$V1/bin/mcdiff" --version >"$TMP/cli.txt" 2>&1 ||
    { cat "$TMP/cli.txt"; fail "$V1/bin/mcdiff --version (no LD_LIBRARY_PATH)"; }
note "meson install: ok; $(head -n 1 "$TMP/cli.txt")"

# --- 2. pip install . ----------------------------------------------------------
"$PY" -c 'import mesonpy' 2>/dev/null ||
    skip "meson install part passed; pip part needs meson-python (Debian: apt-get install python3-mesonpy)"
V2=$TMP/venv-pip
"$PY" -m venv --system-site-packages "$V2" >"$TMP/venv2.log" 2>&1 ||
    { cat "$TMP/venv2.log"; fail "python3 -m venv"; }
note "pip install --no-build-isolation --no-index $SRC"
(cd "$TMP" && "$V2/bin/python" -m pip install --no-build-isolation --no-index \
    --no-cache-dir --disable-pip-version-check "$SRC") >"$TMP/pip.log" 2>&1 ||
    { tail -60 "$TMP/pip.log"; fail "pip install"; }
if grep -q "could not be mapped" "$TMP/pip.log"; then
    grep "could not be mapped" "$TMP/pip.log"; fail "files left out of the wheel"
fi
(cd "$TMP" && "$V2/bin/python" -c "$CHECK" "$V2") ||
    fail "import mcdiff after pip install into $V2"
note "pip install: ok"
exit 0
