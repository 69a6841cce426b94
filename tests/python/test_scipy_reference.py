#!/usr/bin/env python3
"""mcdiff transfer calculations against scipy:

* the steady film (Stefan tube) by shooting with scipy.integrate.solve_ivp
  (DOP853) and scipy.optimize.root, and by a second, different method,
  collocation with scipy.integrate.solve_bvp;
* the two-bulb cell by scipy.integrate.solve_ivp: the linearized theory
  (Toor 1964; Stewart and Prober 1964) with [D] = [B]^-1 from numpy, and
  the quasi-steady exact capillary flux (scipy.linalg.expm of the film
  matrix, scipy.optimize.root for the equimolar fluxes) integrated in time.

numpy and scipy are needed for the references in both test variants; with
MCDIFF_NO_NUMPY=1 the package itself still runs without numpy and returns
lists. Without scipy (or numpy) the script prints the reason and exits 77.
"""

import math
import sys
import unittest

import _support
from _support import b_matrix

_MAIN = __name__ == "__main__"
np = _support.require("numpy", _MAIN, " (needed by scipy)")
_support.require("scipy", _MAIN,
                 " (the film and bulb references use scipy.integrate)")
import scipy.integrate  # noqa: E402
import scipy.linalg  # noqa: E402
import scipy.optimize  # noqa: E402

import mcdiff  # noqa: E402


def arr(a):
    return np.asarray(a, dtype=float)


def random_case(rng, n):
    return np.array(rng.dij(n)), np.array(rng.composition(n))


Rng = _support.Rng


# ---------------------------------------------------------------------------
# Film
# ---------------------------------------------------------------------------

def ms_rhs(D, c, N):
    n = len(N)

    def f(z, x):
        x = np.asarray(x)
        out = np.zeros_like(x)
        for i in range(n):
            for j in range(n):
                if j != i:
                    out[i] += (x[i] * N[j] - x[j] * N[i]) / D[i, j]
        return out / c
    return f


def integrate_film(D, c, L, x0, N, z_eval=None):
    sol = scipy.integrate.solve_ivp(ms_rhs(D, c, N), (0.0, L), x0,
                                    method="DOP853", rtol=1e-12, atol=1e-15,
                                    t_eval=z_eval, dense_output=False)
    if not sol.success:
        raise RuntimeError(sol.message)
    return sol.y


def shoot_film(D, c, L, x0, xL, kind, sp=None, values=None, guess=None):
    """Fluxes by shooting: solve_ivp + scipy.optimize.root."""
    n = len(x0)
    Dm = np.mean(D[~np.eye(n, dtype=bool)])
    scale = c * Dm / L

    def resid(u):
        N = u * scale
        xe = integrate_film(D, c, L, x0, N)[:, -1]
        r = list(xe[:n - 1] - xL[:n - 1])
        if kind == "stagnant":
            r.append(u[sp])
        elif kind == "equimolar":
            r.append(u.sum())
        elif kind == "total":
            r.append(u.sum() - values / scale)
        elif kind == "weights":
            r.append(np.dot(values, u))
        return np.array(r)

    u0 = (x0 - xL) if guess is None else np.asarray(guess) / scale
    sol = scipy.optimize.root(resid, u0, method="hybr",
                              options={"xtol": 1e-13})
    if not sol.success or np.abs(sol.fun).max() > 1e-10:
        raise RuntimeError("shooting failed: %s" % sol.message)
    return sol.x * scale


def bvp_film(D, c, L, x0, xL, kind, sp=None, guess=None):
    """Fluxes by collocation: solve_bvp with the fluxes as parameters."""
    n = len(x0)

    def fun(z, y, p):
        f = ms_rhs(D, c, p)
        return np.column_stack([f(0, y[:, k]) for k in range(y.shape[1])])

    def bc(ya, yb, p):
        r = list(ya - x0) + list(yb[:n - 1] - xL[:n - 1])
        r.append(p[sp] if kind == "stagnant" else p.sum())
        return np.array(r)

    z = np.linspace(0, L, 41)
    y = np.outer(x0, 1 - z / L) + np.outer(xL, z / L)
    p0 = np.asarray(guess, dtype=float)
    sol = scipy.integrate.solve_bvp(fun, bc, z, y, p=p0, tol=1e-10,
                                    max_nodes=200000)
    if not sol.success:
        raise RuntimeError("solve_bvp: " + sol.message)
    return sol.p, sol


class FilmAgainstScipy(unittest.TestCase):
    def test_stefan_tube_by_shooting_and_collocation(self):
        # Carty and Schrodt (1975) Stefan tube as used by Taylor and Krishna
        # (1993, ch. 8), all numbers from memory (see test_published.py).
        D = np.array([[0, 8.48e-6, 13.72e-6], [8.48e-6, 0, 19.91e-6],
                      [13.72e-6, 19.91e-6, 0]])
        x0 = np.array([0.319, 0.528, 0.153])
        xL = np.array([0.0, 0.0, 1.0])
        c, L = mcdiff.ideal_gas_c(328.5, 99.4e3), 0.238
        N = arr(mcdiff.film_solve(D, c, L, x0, xL, "stagnant", species=2).N)
        Ns = shoot_film(D, c, L, x0, xL, "stagnant", sp=2)
        Nb, sol = bvp_film(D, c, L, x0, xL, "stagnant", sp=2, guess=N * 1.1)
        rs = np.abs(N - Ns).max() / np.abs(N).max()
        rb = np.abs(N - Nb).max() / np.abs(N).max()
        # profile at 11 points against the bvp solution's interpolant
        z = np.linspace(0, L, 11)
        X = arr(mcdiff.film_profile(D, c, L, x0, N, z))
        rp = np.abs(X - sol.sol(z).T).max()
        print("\n  Stefan tube: library vs shooting %.1e, vs solve_bvp %.1e "
              "(fluxes); profile vs solve_bvp %.1e" % (rs, rb, rp))
        # shooting: DOP853 at rtol 1e-12, root to 1e-13: 1e-9
        self.assertLess(rs, 1e-9)
        # collocation tolerance 1e-10 on the residual: 1e-7 on fluxes
        self.assertLess(rb, 1e-7)
        self.assertLess(rp, 1e-7)

    def test_random_films_with_every_local_bootstrap(self):
        rng = Rng(103)
        worst, worst_prof = 0.0, 0.0
        kinds = ["stagnant", "equimolar", "weights", "total"]
        for trial in range(16):
            n = 2 + trial % 4
            D, x0 = random_case(rng, n)
            xL = np.array(rng.composition(n))
            c, L = 40.0, 0.02 + 0.08 * rng.uniform()
            kind = kinds[trial % 4]
            kw, sp, vals = {}, None, None
            if kind == "stagnant":
                sp = n - 1
                kw["species"] = sp
            elif kind == "weights":
                vals = np.array([1.0 + rng.uniform() for _ in range(n)])
                kw["values"] = vals
            elif kind == "total":
                vals = 1e-3 * rng.uniform(-1, 1)
                kw["values"] = vals
            N = arr(mcdiff.film_solve(D, c, L, x0, xL, kind, **kw).N)
            Ns = shoot_film(D, c, L, x0, xL, kind, sp=sp, values=vals)
            rel = np.abs(N - Ns).max() / np.abs(Ns).max()
            self.assertLess(rel, 1e-8, (trial, kind))
            worst = max(worst, rel)
            z = np.linspace(0, L, 7)
            X = arr(mcdiff.film_profile(D, c, L, x0, N, z))
            Xs = integrate_film(D, c, L, x0, N, z).T
            worst_prof = max(worst_prof, np.abs(X - Xs).max())
            self.assertLess(np.abs(X - Xs).max(), 1e-10)
        print("\n  random films: fluxes vs solve_ivp+root max rel. diff "
              "%.1e; profiles vs solve_ivp %.1e" % (worst, worst_prof))

    def test_ratios_bootstrap_by_scalar_root(self):
        rng = Rng(104)
        for trial in range(4):
            n = 3
            D, x0 = random_case(rng, n)
            xL = np.array(rng.composition(n))
            if x0[0] < xL[0]:
                x0, xL = xL, x0
            zr = np.array([x0[0] + 0.5, 0.2, 0.3 - x0[0]])
            c, L = 40.0, 0.05
            N = arr(mcdiff.film_solve(D, c, L, x0, xL, "ratios", species=0,
                                      values=zr).N)

            def r(Nt):
                return integrate_film(D, c, L, x0, zr * Nt)[0, -1] - xL[0]
            Nt0 = N.sum()
            Nt = scipy.optimize.brentq(r, 0.5 * Nt0, 1.5 * Nt0, xtol=1e-16,
                                       rtol=1e-14)
            self.assertLess(np.abs(N - zr * Nt).max() / np.abs(N).max(), 1e-8)


# ---------------------------------------------------------------------------
# Two-bulb cell
# ---------------------------------------------------------------------------

# Duncan and Toor (1962) as in test_published.py (sources there).
DT_D = np.array([[0.0, 83.3e-6, 68.0e-6], [83.3e-6, 0.0, 16.8e-6],
                 [68.0e-6, 16.8e-6, 0.0]])
DT_X1 = np.array([0.0, 0.50086, 0.49914])
DT_X2 = np.array([0.50121, 0.49879, 0.0])
DT_L, DT_V1, DT_V2 = 85.9e-3, 77.99e-6, 78.63e-6
DT_A = math.pi / 4 * 2.08e-3 ** 2


def equimolar_film_flux(D, c, L, x1, x2, guess):
    """Exact equimolar film flux between x1 (z = 0) and x2 (z = L):
    x(L) = expm(L/c [A(N)]) x1 with A_ii = sum_{j != i} N_j/Đ_ij,
    A_ij = -N_i/Đ_ij; N_n = -(sum of the others); scipy root."""
    n = len(x1)
    scale = c * 1e-5 / L

    off = ~np.eye(n, dtype=bool)
    Dinv = np.zeros((n, n))
    Dinv[off] = 1.0 / D[off]          # 1/Đ_ij off the diagonal, 0 on it

    def xend(u):
        N = np.append(u, -u.sum()) * scale
        A = -N[:, None] * Dinv
        np.fill_diagonal(A, Dinv @ N)
        return scipy.linalg.expm((L / c) * A) @ x1

    sol = scipy.optimize.root(lambda u: xend(u)[:n - 1] - x2[:n - 1],
                              guess / scale, method="hybr",
                              options={"xtol": 1e-13})
    u = sol.x
    return np.append(u, -u.sum()) * scale


class BulbsAgainstScipy(unittest.TestCase):
    def setUp(self):
        self.c = mcdiff.ideal_gas_c(308.35, 101325.0)
        self.t = np.array([0, 0.5, 1, 2, 4, 6, 8, 12, 20]) * 3600.0

    def test_linearized_theory_by_solve_ivp(self):
        c, V1, V2 = self.c, DT_V1, DT_V2
        beta = DT_A * (V1 + V2) / (DT_L * V1 * V2)
        xbar = (V1 * DT_X1 + V2 * DT_X2) / (V1 + V2)
        B, idx = b_matrix(DT_D, xbar, 2)
        Dm = np.linalg.solve(B, np.eye(2))     # [D] at the mean, numpy
        d0 = (DT_X1 - DT_X2)[idx]
        sol = scipy.integrate.solve_ivp(lambda t, d: -beta * Dm @ d,
                                        (0, self.t[-1]), d0, method="DOP853",
                                        rtol=1e-12, atol=1e-15,
                                        t_eval=self.t)
        delta = np.vstack([sol.y, -sol.y.sum(axis=0)]).T
        x1 = xbar + V2 / (V1 + V2) * delta
        x2 = xbar - V1 / (V1 + V2) * delta
        l1, l2 = mcdiff.bulbs_linearized(DT_D, c, V1, V2, DT_A, DT_L, DT_X1,
                                         DT_X2, self.t)
        diff = max(np.abs(arr(l1) - x1).max(), np.abs(arr(l2) - x2).max())
        print("\n  two bulbs, linearized: library vs solve_ivp max |dx| "
              "%.1e" % diff)
        # eigen-decomposition vs DOP853 at rtol 1e-12: 1e-10 in x
        self.assertLess(diff, 1e-10)

    def test_exact_capillary_flux_by_solve_ivp(self):
        c, V1, V2 = self.c, DT_V1, DT_V2
        tot = V1 * DT_X1 + V2 * DT_X2
        state = {"N": c * 5e-5 * (DT_X1 - DT_X2) / DT_L}

        def rhs(t, x1):
            x2 = (tot - V1 * x1) / V2
            N = equimolar_film_flux(DT_D, c, DT_L, x1, x2, state["N"][:2])
            state["N"] = N
            return -DT_A * N / (c * V1)

        sol = scipy.integrate.solve_ivp(rhs, (0, self.t[-1]), DT_X1,
                                        method="DOP853", rtol=1e-10,
                                        atol=1e-13, t_eval=self.t)
        self.assertTrue(sol.success, sol.message)
        x1 = sol.y.T
        x2 = (tot - V1 * x1) / V2
        i1, i2 = mcdiff.bulbs_integrate(DT_D, c, V1, V2, DT_A, DT_L, DT_X1,
                                        DT_X2, self.t, 1e-10)
        diff = max(np.abs(arr(i1) - x1).max(), np.abs(arr(i2) - x2).max())
        print("\n  two bulbs, exact film flux: library vs solve_ivp max |dx| "
              "%.1e" % diff)
        # two error-controlled integrations at 1e-10 over ~10 time
        # constants: 1e-8 in mole fraction
        self.assertLess(diff, 1e-8)



if __name__ == "__main__":
    sys.exit(_support.run(__name__))
