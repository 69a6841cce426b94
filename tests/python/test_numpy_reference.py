#!/usr/bin/env python3
"""mcdiff against numpy's linear algebra: the generalized Fick matrix
[D] = [B]^-1 of Taylor and Krishna (1993, "Multicomponent Mass Transfer",
Wiley, eqs. 2.1.21-2.1.23: B_ii = x_i/Đ_in + sum_{k != i} x_k/Đ_ik,
B_ij = -x_i (1/Đ_ij - 1/Đ_in), species n dependent) by numpy.linalg.solve,
its eigenvalues by numpy.linalg.eigvals, and the fluxes in both bases.

numpy is needed for the references in both test variants; with
MCDIFF_NO_NUMPY=1 the package itself still runs without numpy and returns
lists (the comparisons convert them). Without numpy the script prints the
reason and exits 77.
"""

import sys
import unittest

import _support
from _support import b_matrix

np = _support.require("numpy", __name__ == "__main__",
                      " (the reference computations use numpy.linalg)")

import mcdiff  # noqa: E402


def arr(a):
    return np.asarray(a, dtype=float)


def random_case(rng, n):
    return np.array(rng.dij(n)), np.array(rng.composition(n))


Rng = _support.Rng


class FickAgainstNumpy(unittest.TestCase):
    def test_fick_matrix_equals_inverse_of_b(self):
        rng = Rng(101)
        worst, worst_eig, worst_cond = 0.0, 0.0, 0.0
        for trial in range(300):
            n = 2 + trial % 7
            D, x = random_case(rng, n)
            dep = trial % n if trial % 3 else None
            F = mcdiff.fick_matrix(D, x, dependent=dep)
            used = F.dependent
            if dep is None:
                self.assertEqual(used, int(np.argmax(x)))
            B, idx = b_matrix(D, x, used)
            Dref = np.linalg.solve(B, np.eye(n - 1))
            Dlib = arr(F.D)
            cond = np.linalg.cond(B)
            # both sides are backward stable solves of the same matrix: the
            # difference is bounded by a few eps * cond([B]); 50 eps cond
            rel = np.abs(Dlib - Dref).max() / np.abs(Dref).max()
            self.assertLess(rel, 50 * 2.2e-16 * cond, (n, trial))
            worst = max(worst, rel)
            worst_cond = max(worst_cond, cond)
            # eigenvalues: library dgeev vs numpy.linalg.eigvals of the
            # numpy matrix, sorted by real part; real and positive for an
            # ideal gas (Taylor and Krishna 1993, ch. 2)
            e_lib = np.array(mcdiff.fick_eigenvalues(F.D), dtype=complex)
            e_ref = np.linalg.eigvals(Dref)
            e_ref = e_ref[np.argsort(-e_ref.real)]
            self.assertTrue(np.all(e_lib.real > 0))
            self.assertTrue(np.all(np.abs(e_lib.imag) <=
                                   1e-8 * np.abs(e_lib.real).max()))
            erel = np.abs(e_lib - e_ref).max() / np.abs(e_ref).max()
            self.assertLess(erel, 1e-9, (n, trial))
            worst_eig = max(worst_eig, erel)
        print("\n  Fick matrix vs numpy.linalg.solve: max rel. diff %.1e "
              "(max cond(B) %.1e); eigenvalues vs numpy.linalg.eigvals: "
              "%.1e" % (worst, worst_cond, worst_eig))

    def test_fluxes_equal_numpy_solution_in_both_bases(self):
        rng = Rng(102)
        M = np.array([2.016e-3, 28.014e-3, 44.009e-3, 39.948e-3, 16.043e-3])
        worst = 0.0
        for trial in range(100):
            n = 2 + trial % 4
            D, x = random_case(rng, n)
            c = 20 + 30 * rng.uniform()
            g = np.array([rng.uniform(-5, 5) for _ in range(n)])
            g -= g.mean()          # mole-fraction gradients sum to zero
            Mn = M[:n]
            # numpy: J over species != n-1 from B J = -c grad x
            B, idx = b_matrix(D, x, n - 1)
            Jr = np.linalg.solve(B, -c * g[idx])
            Jref = np.append(Jr, -Jr.sum())
            J = arr(mcdiff.flux_compute(D, c, x, g, M=Mn))
            rel = np.abs(J - Jref).max() / np.abs(Jref).max()
            self.assertLess(rel, 1e-11)
            # mass basis: j_i = M_i J_i - w_i sum_k M_k J_k (Taylor and
            # Krishna 1993, ch. 1) with w from numpy
            w = x * Mn / (x @ Mn)
            jref = Mn * Jref - w * (Mn @ Jref)
            j = arr(mcdiff.flux_compute(D, c, x, g, M=Mn, flux_basis="mass"))
            relm = np.abs(j - jref).max() / np.abs(jref).max()
            self.assertLess(relm, 1e-11)
            # mass-basis Fick matrix: j = -rho [D°] grad w over species !=
            # dependent, grad w from numpy (chain rule of w(x))
            Mbar = x @ Mn
            gw = Mn / Mbar * g - w * (Mn @ g) / Mbar
            Fm = mcdiff.fick_matrix(D, x, M=Mn, basis="mass")
            rho = c * Mbar
            jf = arr(mcdiff.fick_fluxes(Fm.D, Fm.dependent, rho, gw))
            relf = np.abs(jf - jref).max() / np.abs(jref).max()
            self.assertLess(relf, 1e-10)
            worst = max(worst, rel, relm, relf)
        print("\n  fluxes vs numpy (mole, mass, mass Fick): max rel. diff "
              "%.1e" % worst)



if __name__ == "__main__":
    sys.exit(_support.run(__name__))
