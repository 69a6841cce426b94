"""Shared helpers of the Python binding tests (standard library only).

Each tests/python/test_*.py is a script run by meson twice: with numpy,
and with MCDIFF_NO_NUMPY=1 (numpy hidden). When a tool a script needs is
missing, it prints the reason and exits with 77, meson's code for a
skipped test; under `python -m unittest` the module is skipped instead.

Environment (set by bindings/python/meson.build): MCDIFF_LIBRARY (shared
library), PYTHONPATH (bindings/python), MCDIFF_HEADER (include/mcdiff.h),
MCD_TEST_DATA (tests/data), MCDIFF_CLI (the command-line tool, optional).
Run by hand from a checkout, the paths default to the source tree.
"""

import importlib
import math
import os
import sys
import unittest

HERE = os.path.dirname(os.path.abspath(__file__))
ROOT = os.path.dirname(os.path.dirname(HERE))
PKG_DIR = os.path.join(ROOT, "bindings", "python")
if PKG_DIR not in sys.path and not any(
        os.path.abspath(p) == PKG_DIR for p in sys.path):
    sys.path.insert(0, PKG_DIR)

HEADER = os.environ.get("MCDIFF_HEADER",
                        os.path.join(ROOT, "include", "mcdiff.h"))
TEST_DATA = os.environ.get("MCD_TEST_DATA", os.path.join(ROOT, "tests",
                                                          "data"))
CLI = os.environ.get("MCDIFF_CLI")
NO_NUMPY = os.environ.get("MCDIFF_NO_NUMPY", "") not in ("", "0")


def skip_module(reason, main):
    """Skip the whole script: exit 77 with the reason when run as a
    script, else raise unittest.SkipTest."""
    if main:
        print("SKIP: %s (interpreter %s)" % (reason, sys.executable))
        sys.stdout.flush()
        sys.exit(77)
    raise unittest.SkipTest(reason)


def require_numpy_variant(main):
    """In the numpy variant (MCDIFF_NO_NUMPY unset) numpy must import."""
    if NO_NUMPY:
        return
    try:
        importlib.import_module("numpy")
    except ImportError:
        skip_module("the numpy variant of this test needs numpy, which this "
                    "interpreter cannot import", main)


def require(module, main, why=""):
    try:
        return importlib.import_module(module)
    except ImportError:
        skip_module("%s is not available%s" % (module, why), main)


def run(module_name):
    """Run the tests of a script; exit 0 (all passed), 1 (a failure)."""
    prog = unittest.main(module=module_name, exit=False, verbosity=2)
    r = prog.result
    print("%s: %d run, %d failures, %d errors, %d skipped (numpy %s)"
          % (os.path.basename(sys.argv[0]), r.testsRun, len(r.failures),
             len(r.errors), len(r.skipped),
             "hidden" if NO_NUMPY else "available"))
    return 0 if r.wasSuccessful() else 1


def flat(a):
    """Flatten a number, (nested) list or numpy array to a list of
    floats (complex kept)."""
    if hasattr(a, "tolist"):
        a = a.tolist()
    if isinstance(a, (int, float, complex)):
        return [a]
    out = []
    for v in a:
        out.extend(flat(v))
    return out


def max_abs(a):
    return max((abs(v) for v in flat(a)), default=0.0)


def max_abs_diff(a, b):
    fa, fb = flat(a), flat(b)
    assert len(fa) == len(fb), (len(fa), len(fb))
    return max((abs(u - v) for u, v in zip(fa, fb)), default=0.0)


class Rng:
    """Deterministic xorshift64* generator (fixed seed), as in the C
    tests, so that runs are reproducible without numpy."""

    def __init__(self, seed=0x9E3779B97F4A7C15):
        self.s = seed & 0xFFFFFFFFFFFFFFFF

    def uniform(self, lo=0.0, hi=1.0):
        s = self.s
        s ^= s >> 12
        s ^= (s << 25) & 0xFFFFFFFFFFFFFFFF
        s ^= s >> 27
        self.s = s
        v = ((s * 2685821657736338717) & 0xFFFFFFFFFFFFFFFF) >> 11
        return lo + (hi - lo) * v / 9007199254740992.0

    def composition(self, n, lo=0.05):
        x = [lo + self.uniform() for _ in range(n)]
        s = sum(x)
        return [v / s for v in x]

    def dij(self, n, lo=5e-6, hi=8e-5):
        """Symmetric binary diffusivities, log-uniform in [lo, hi]."""
        D = [[0.0] * n for _ in range(n)]
        for i in range(n):
            for j in range(i + 1, n):
                D[i][j] = D[j][i] = lo * math.exp(self.uniform() *
                                                  math.log(hi / lo))
        return D


def b_matrix(D, x, dep):
    """The [B] matrix of Taylor and Krishna (1993, eqs. 2.1.21-2.1.23) over
    the species other than dep, ideal gas, as a numpy array (D and x numpy
    arrays); returns (B, indices of the species kept)."""
    import numpy as np
    n = len(x)
    idx = [i for i in range(n) if i != dep]
    m = len(idx)
    B = np.empty((m, m))
    for a, i in enumerate(idx):
        for b, j in enumerate(idx):
            if a == b:
                B[a, b] = x[i] / D[i, dep] + sum(x[k] / D[i, k]
                                                 for k in range(n) if k != i)
            else:
                B[a, b] = -x[i] * (1.0 / D[i, j] - 1.0 / D[i, dep])
    return B, idx
