#!/usr/bin/env python3
"""mcdiff transfer calculations against scipy:

* the steady film (Stefan tube) by shooting, a fixed-step propagator and
  Newton from the linearized fluxes (continuation and scipy.optimize.root
  'lm' when Newton fails), by a second, different method, collocation
  with scipy.integrate.solve_bvp, and by integrating the library's fluxes
  and profiles with scipy.integrate.solve_ivp (DOP853); the ratios
  bootstrap by scipy.optimize.brentq;
* the two-bulb cell by scipy.integrate.solve_ivp: the linearized theory
  (Toor 1964; Stewart and Prober 1964) with [D] = [B]^-1 from numpy, and
  the quasi-steady exact capillary flux (scipy.linalg.expm of the film
  matrix, scipy.optimize.root for the equimolar fluxes) integrated in time.

numpy and scipy are needed for the references in both test variants; with
MCDIFF_NO_NUMPY=1 the package itself still runs without numpy and returns
lists. Without scipy (or numpy) the script prints the reason and exits 77.
"""

import collections
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
# Film: an independent reference solver
# ---------------------------------------------------------------------------
#
# The film equations dx/dz = (1/c) [A(N)] x, A_ii = sum_{j!=i} N_j/Đ_ij,
# A_ij = -N_i/Đ_ij, are linear in x for fixed fluxes N: x(L) = exp(M) x0
# with M = (L/c) [A(N)]. Shooting solves for the N at which x(L) meets the
# other end and the bootstrap holds.
#
# Why no adaptive integrator inside the root finder: solve_ivp picks its
# steps from the solution, so its x(L) is off by up to 4e-12 (measured,
# rtol 1e-12) by an amount that jumps whenever the step sequence changes
# with N; a root finder asked for xtol 1e-13 then sees a noisy function
# and may stall ("not making good progress"), on one machine and not on
# another. Here x(L) comes from a FIXED-step method: 2^k steps h = L/2^k
# of the Taylor method of order 18, evaluated as T18(M/2^k)^(2^k) by
# repeated squaring (the same polynomial as stepping 2^k times). For a
# fixed k it is a polynomial in N, so Newton converges quadratically down
# to rounding. k is fixed for a whole solve, from ||M||_1 / 2^k <= 1/2 at
# the starting point, and checked at the solution (<= 1, else k is raised
# and Newton resumed); the Taylor remainder of one step is then below
# 1/19! e = 2e-17 of |x| (0.5^19/19! e^0.5 = 3e-23 at 1/2). Few steps
# matter as much as the order: each squaring doubles the rounding error,
# and order 12 with ||M/2^k|| <= 1/32 was 10 to 20 times worse.
# Measured on the 3200 random films of seeds 1..200 (the generator below)
# and the Stefan tube, at the reference's solution, against x(L) from a
# 40-digit matrix exponential (mpmath): max error 5.4e-15 (k <= 4,
# ||M/2^k||_1 <= 0.65 there; scipy.linalg.expm 1.9e-15, solve_ivp DOP853
# at rtol 1e-12 3.9e-12), ||exp(M)||_1 up to 112: far below RES_TOL and
# the tolerances of the tests (1e-10 and up).
#
# solve_ivp (DOP853), an independent integrator, stays for the checks that
# cannot give up: the library's own N integrated from x0 must end at xL,
# and the library's profiles must follow the integrated ones.

TAYLOR_ORDER = 18
STEP_NORM_START = 0.5          # ||M / 2^k||_1 chosen at the start
STEP_NORM_MAX = 1.0            # ... and required at the solution
RES_TOL = 1e-12                # accepted shooting residual (mole fractions)
REF_STATS = collections.Counter()   # which reference method was needed


def film_matrix(D, N):
    """[A(N)] of dx/dz = (1/c) [A] x (N may be complex: complex step)."""
    n = len(N)
    off = ~np.eye(n, dtype=bool)
    Dinv = np.zeros((n, n))
    Dinv[off] = 1.0 / D[off]           # 1/Đ_ij off the diagonal, 0 on it
    A = -N[:, None] * Dinv             # A_ij = -N_i/Đ_ij
    np.fill_diagonal(A, Dinv @ N)      # A_ii = sum_{j!=i} N_j/Đ_ij
    return A


def taylor_steps(M, step_norm):
    """Smallest k with ||M||_1 / 2^k <= step_norm."""
    nrm = np.abs(M).sum(axis=0).max()
    if not np.isfinite(nrm):
        raise FloatingPointError("film matrix not finite")
    return max(0, math.ceil(math.log2(nrm / step_norm))) if nrm > 0 else 0


def taylor_propagator(M, k):
    """exp(M) by 2^k steps of the Taylor method of order TAYLOR_ORDER:
    T(S)^(2^k), S = M/2^k, T(S) = I + S + ... + S^18/18! (Horner)."""
    n = M.shape[0]
    S = M / 2.0 ** k
    eye = np.eye(n)
    P = eye
    for j in range(TAYLOR_ORDER, 0, -1):
        P = eye + (S @ P) / j
    for _ in range(k):
        P = P @ P
    return P


def film_end(D, c, L, x0, N, k=None):
    """x(L) of the film for fluxes N; k None: chosen for this N (accurate
    everywhere, but steps change with N: for bracketing methods only)."""
    M = (L / c) * film_matrix(D, N)
    if k is None:
        k = taylor_steps(M, STEP_NORM_START)
    return taylor_propagator(M, k) @ x0


def bootstrap_total(kind, J, xm, sp=None, values=None):
    """N_t such that N = J + xm N_t meets the bootstrap."""
    if kind == "stagnant":        # N_sp = 0
        return -J[sp] / xm[sp]
    if kind == "equimolar":
        return 0.0
    if kind == "total":
        return float(values)
    if kind == "weights":         # sum v_i N_i = 0
        return -np.dot(values, J) / np.dot(values, xm)
    raise ValueError(kind)


def linearized_film_flux(D, c, L, x0, xL, kind, sp=None, values=None):
    """The independent starting point: the linearized theory (Toor 1964;
    Stewart and Prober 1964) computed here, [D] = [B]^-1 at the mean
    composition, J = -c [D] (xL - x0)/L for species 0..n-2 (J_n = -sum),
    N = J + xm N_t with N_t from the bootstrap."""
    n = len(x0)
    xm = 0.5 * (x0 + xL)
    B, idx = b_matrix(D, xm, n - 1)
    J = np.zeros(n)
    J[idx] = -(c / L) * np.linalg.solve(B, (xL - x0)[idx])
    J[n - 1] = -J[idx].sum()
    return J + xm * bootstrap_total(kind, J, xm, sp, values)


def maxabs(a):
    return float(np.abs(a).max())


def complex_step_jacobian(fun, u, h=1e-30):
    """Jacobian of a real-analytic fun by the complex step (Lyness and
    Moler 1967; Squire and Trapp 1998; from memory): Im fun(u + i h e_k)/h
    is column k to rounding, without the cancellation of differences."""
    J = np.empty((len(u), len(u)))
    for k in range(len(u)):
        w = u.astype(complex)
        w[k] += 1j * h
        J[:, k] = fun(w).imag / h
    return J


def newton(fun, u, maxit=30):
    """Newton with the complex-step Jacobian and step halving on the max
    residual; returns u once max|fun(u)| <= RES_TOL and no step improves
    it further, None when it cannot get there."""
    u = np.array(u, dtype=float)
    r = fun(u)
    nr = maxabs(r)
    if not np.isfinite(nr):
        return None
    for _ in range(maxit):
        try:
            du = np.linalg.solve(complex_step_jacobian(fun, u), -r)
        except np.linalg.LinAlgError:
            return None
        if not np.all(np.isfinite(du)):
            return None
        small = maxabs(du) <= 1e-14 * max(1.0, maxabs(u))
        t = 1.0
        while t >= 1.0 / 1024:
            v = u + t * du
            rv = fun(v)
            nv = maxabs(rv)
            if np.isfinite(nv) and nv <= (1.0 - 1e-4 * t) * nr:
                break
            t *= 0.5
        else:                      # no decrease: rounding floor, or stuck
            return u if nr <= RES_TOL else None
        u, r, nr = v, rv, nv
        if small:
            break
    return u if nr <= RES_TOL else None


def shoot_film(D, c, L, x0, xL, kind, sp=None, values=None):
    """Reference fluxes by shooting with the fixed-step propagator:
    Newton from the linearized start; if that fails, continuation in the
    end composition xL(s) = x0 + s (xL - x0), s from 0 to 1 in steps
    halved on failure, each started from the previous solution; then
    scipy.optimize.root 'lm'. Each accepted on its residual; RuntimeError
    (with the case) only when all fail."""
    n = len(x0)
    x0, xL = np.asarray(x0, float), np.asarray(xL, float)
    Dm = np.mean(D[~np.eye(n, dtype=bool)])
    scale = c * Dm / L                 # fluxes scaled to O(1) unknowns u

    def start(s):
        xt = x0 + s * (xL - x0)
        return linearized_film_flux(D, c, L, x0, xt, kind, sp, values) / scale

    def residual(s, k):
        xt = x0 + s * (xL - x0)

        def r(u):
            xe = film_end(D, c, L, x0, u * scale, k)
            if kind == "stagnant":
                b = u[sp]
            elif kind == "equimolar":
                b = u.sum()
            elif kind == "total":
                b = u.sum() - values / scale
            else:
                b = np.dot(values, u)
            return np.append(xe[:n - 1] - xt[:n - 1], b)
        return r

    def steps(u, step_norm):
        return taylor_steps((L / c) * film_matrix(D, u * scale), step_norm)

    def by_newton(k):
        return newton(residual(1.0, k), start(1.0))

    def by_continuation(k):
        s, ds, u = 0.0, 0.125, start(0.0)    # exact at s = 0 (x = x0)
        while s < 1.0:
            s1 = min(1.0, s + ds)
            v = newton(residual(s1, k), u)
            if v is None:
                ds *= 0.5
                if ds < 1.0 / 4096:
                    return None
                continue
            s, u, ds = s1, v, 2.0 * ds
        return u

    def by_lm(k):
        f = residual(1.0, k)
        sol = scipy.optimize.root(
            f, start(1.0), method="lm",
            jac=lambda u: complex_step_jacobian(f, u),
            options={"xtol": 1e-15, "ftol": 1e-15})
        u = sol.x
        if not (np.all(np.isfinite(u)) and maxabs(f(u)) <= RES_TOL):
            u = newton(f, u)              # polish, judged on the residual
        return u

    k = steps(start(1.0), STEP_NORM_START)
    for name, method in (("newton", by_newton),
                         ("continuation", by_continuation), ("lm", by_lm)):
        try:
            u = method(k)
        except (FloatingPointError, np.linalg.LinAlgError, ValueError):
            u = None
        if u is not None and steps(u, STEP_NORM_MAX) > k:
            # the solution lies farther than the start: more steps, resume
            k = steps(u, STEP_NORM_START)
            REF_STATS["more Taylor steps"] += 1
            u = newton(residual(1.0, k), u)
        if u is not None and maxabs(residual(1.0, k)(u)) <= RES_TOL:
            REF_STATS[name] += 1
            return u * scale
    case = ("D=%r c=%r L=%r x0=%r xL=%r kind=%r sp=%r values=%r"
            % (D.tolist(), c, L, x0.tolist(), xL.tolist(), kind, sp,
               values if values is None or np.ndim(values) == 0
               else np.asarray(values).tolist()))
    print("\nreference shooting failed on every method: " + case)
    raise RuntimeError("reference shooting failed (Newton, continuation, "
                       "lm) on " + case)


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


FILM_KINDS = ["stagnant", "equimolar", "weights", "total"]


def random_film_case(rng, trial):
    """Case `trial` of the random films, drawn from rng in a fixed order:
    (D, c, L, x0, xL, kind, sp, values, keywords for film_solve)."""
    n = 2 + trial % 4
    D, x0 = random_case(rng, n)
    xL = np.array(rng.composition(n))
    c, L = 40.0, 0.02 + 0.08 * rng.uniform()
    kind = FILM_KINDS[trial % 4]
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
    return D, c, L, x0, xL, kind, sp, vals, kw


def random_ratios_case(rng):
    """A ratios film (species 0 matched): (D, c, L, x0, xL, z)."""
    n = 3
    D, x0 = random_case(rng, n)
    xL = np.array(rng.composition(n))
    if x0[0] < xL[0]:
        x0, xL = xL, x0
    zr = np.array([x0[0] + 0.5, 0.2, 0.3 - x0[0]])
    return D, 40.0, 0.05, x0, xL, zr


def linearized_ratio_total(D, c, L, x0, xL, z, k):
    """N_t of the ratios bootstrap N = z N_t by the linearized theory:
    J = (z - xm) N_t, so x(L) - x0 = -(L/c) N_t g with g = [B] (z - xm)
    over species 0..n-2 (g_n = -sum); species k matched."""
    n = len(x0)
    xm = 0.5 * (x0 + xL)
    B, idx = b_matrix(D, xm, n - 1)
    g = np.zeros(n)
    g[idx] = B @ (z - xm)[idx]
    g[n - 1] = -g[idx].sum()
    return -(c / L) * (xL[k] - x0[k]) / g[k] if g[k] != 0.0 else math.nan


RATIOS_MAX_NORM = 50.0   # walk only where ||M||_1 <= 50 (exp(50) = 5e21)


def ratios_total(D, c, L, x0, xL, z, k):
    """Reference N_t of the ratios bootstrap N = z N_t (species k matched),
    or None when r(N_t) = x_k(L) - xL_k changes sign nowhere with
    ||M(z N_t)||_1 <= RATIOS_MAX_NORM.

    The bracket comes from the linearized N_t0 alone, widened until the
    sign changes: two walkers leave N_t0 in steps of a factor 2^(1/4), one
    outward, one inward down to 1e-8 N_t0, through 0 (r(0) = x0_k - xL_k
    exactly) and out on the other side; the first sign change either meets
    is handed to brentq. A walk, not a fixed factor around N_t0: N_t0 is
    only an estimate (off by up to 98 % on the cases of random_ratios_case
    with Rng seeds 1..200), and the residual, a sum of exp(lambda N_t L/c)
    over the eigenvalues lambda of (L/c)[A(z)], may have no root (seeds 15
    and 16), or roots only far away and oscillating in N_t (complex
    lambda: seeds 7 and 55, trials 2 and 1). Steps of the
    propagator chosen per N_t, accurate to rounding everywhere: brentq, a
    bracketing method, needs no smoothness."""
    Nt0 = linearized_ratio_total(D, c, L, x0, xL, z, k)
    M1 = (L / c) * film_matrix(D, z)          # M(z N_t) = N_t M1
    top = RATIOS_MAX_NORM / np.abs(M1).sum(axis=0).max()
    if not (np.isfinite(Nt0) and 0.0 < abs(Nt0) < top):
        Nt0 = top / RATIOS_MAX_NORM           # ||M|| = 1: a neutral start

    def r(Nt):
        xk = film_end(D, c, L, x0, z * Nt)[k] if Nt != 0.0 else x0[k]
        return xk - xL[k]

    q = 2.0 ** 0.25
    inward = [Nt0 * q ** -j for j in range(1, 107)]     # to 1e-8 N_t0
    farther = [Nt0 * q ** j for j in range(1, 200)
               if q ** j * abs(Nt0) <= top]
    walkers = [iter(farther),
               iter(inward + [0.0] + [-v for v in reversed(inward)] +
                    [-Nt0] + [-v for v in farther])]
    r0 = r(Nt0)
    last = [(Nt0, r0), (Nt0, r0)]
    steps = 0
    while walkers != [None, None]:
        for w in (0, 1):
            Nt = None if walkers[w] is None else next(walkers[w], None)
            if Nt is None:
                walkers[w] = None
                continue
            steps += 1
            rv = r(Nt)
            if not np.isfinite(rv):
                walkers[w] = None
                continue
            Na, ra = last[w]
            if ra * rv <= 0.0:
                REF_STATS["ratios walk steps"] += steps
                if ra == 0.0:
                    return Na
                return scipy.optimize.brentq(r, min(Na, Nt), max(Na, Nt),
                                             xtol=1e-16, rtol=1e-14)
            last[w] = (Nt, rv)
    REF_STATS["ratios walk steps"] += steps
    return None


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
        # collocation started from the linearized fluxes, not the library's
        Nlin = linearized_film_flux(D, c, L, x0, xL, "stagnant", sp=2)
        Nb, sol = bvp_film(D, c, L, x0, xL, "stagnant", sp=2, guess=Nlin)
        rs = np.abs(N - Ns).max() / np.abs(N).max()
        rb = np.abs(N - Nb).max() / np.abs(N).max()
        # the library's N integrated by solve_ivp from x0 must end at xL
        re = np.abs(integrate_film(D, c, L, x0, N)[:, -1] - xL).max()
        # profile at 11 points against the bvp solution's interpolant
        z = np.linspace(0, L, 11)
        X = arr(mcdiff.film_profile(D, c, L, x0, N, z))
        rp = np.abs(X - sol.sol(z).T).max()
        print("\n  Stefan tube: library vs shooting %.1e, vs solve_bvp %.1e "
              "(fluxes); its N by solve_ivp ends %.1e from xL; profile vs "
              "solve_bvp %.1e" % (rs, rb, re, rp))
        # shooting: residual <= 1e-12 with a propagator exact to rounding
        # (see above): far below 1e-9
        self.assertLess(rs, 1e-9)
        # collocation tolerance 1e-10 on the residual: 1e-7 on fluxes
        self.assertLess(rb, 1e-7)
        self.assertLess(rp, 1e-7)
        # DOP853 at rtol 1e-12, atol 1e-15: 1e-10 as for the profiles
        self.assertLess(re, 1e-10)

    def test_random_films_with_every_local_bootstrap(self):
        rng = Rng(103)
        worst, worst_prof, worst_end = 0.0, 0.0, 0.0
        before = REF_STATS.copy()
        for trial in range(16):
            D, c, L, x0, xL, kind, sp, vals, kw = random_film_case(rng,
                                                                   trial)
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
            # the library's N, integrated from x0, ends at the given xL
            end = np.abs(Xs[-1] - xL).max()
            worst_end = max(worst_end, end)
            self.assertLess(end, 1e-10, (trial, kind))
        used = REF_STATS - before
        print("\n  random films: fluxes vs shooting max rel. diff %.1e; "
              "profiles vs solve_ivp %.1e; library's N by solve_ivp ends "
              "%.1e from xL (reference: %s)"
              % (worst, worst_prof, worst_end,
                 ", ".join("%s %d" % kv for kv in sorted(used.items()))))

    def test_ratios_bootstrap_by_scalar_root(self):
        rng = Rng(104)
        worst, worst_end, no_root = 0.0, 0.0, 0
        before = REF_STATS["ratios walk steps"]
        for trial in range(4):
            D, c, L, x0, xL, zr = random_ratios_case(rng)
            Nt = ratios_total(D, c, L, x0, xL, zr, 0)
            try:
                N = arr(mcdiff.film_solve(D, c, L, x0, xL, "ratios",
                                          species=0, values=zr).N)
            except mcdiff.NoConvergenceError as e:
                # documented (header, mcd_film_solve) for a ratios film
                # that no physical flux satisfies: right if the reference
                # found no root either, or only a root whose film leaves
                # [0, 1] (complex eigenvalues of the film matrix give such
                # far, oscillating roots; seen in 4 of 800 random cases)
                if Nt is not None:
                    X = np.array([film_end(D, c, z, x0, zr * Nt)
                                  for z in np.linspace(L / 100, L, 100)])
                    if X.min() >= -1e-9 and X.max() <= 1 + 1e-9:
                        self.fail("trial %d: library %s; the reference has "
                                  "N_t = %r with a physical film (mole "
                                  "fractions from %.3g to %.3g)"
                                  % (trial, e, Nt, X.min(), X.max()))
                no_root += 1
                continue
            # the library's N integrated by solve_ivp: x_0(L) = xL_0
            end = abs(integrate_film(D, c, L, x0, N)[0, -1] - xL[0])
            self.assertLess(end, 1e-10, trial)
            self.assertIsNotNone(Nt, "trial %d: the library has N_t = %r, "
                                 "the reference no root with ||M||_1 <= %g"
                                 % (trial, N.sum(), RATIOS_MAX_NORM))
            rel = np.abs(N - zr * Nt).max() / np.abs(N).max()
            self.assertLess(rel, 1e-8, trial)
            worst, worst_end = max(worst, rel), max(worst_end, end)
        print("\n  ratios films: fluxes vs brentq max rel. diff %.1e; "
              "library's N by solve_ivp ends %.1e from xL_0 (reference walk "
              "%d steps; no physical root, library agrees: %d)"
              % (worst, worst_end, REF_STATS["ratios walk steps"] - before,
                 no_root))


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
    x(L) = expm(L/c [A(N)]) x1 (film_matrix above), N_n = -(sum of the
    others); scipy root 'hybr' from guess (the previous flux of the
    integration), accepted on its residual, not on sol.success; when the
    residual is above RES_TOL, the robust shooting above (linearized start,
    Newton, continuation, lm)."""
    n = len(x1)
    scale = c * 1e-5 / L

    def resid(u):
        N = np.append(u, -u.sum()) * scale
        xe = scipy.linalg.expm((L / c) * film_matrix(D, N)) @ x1
        return xe[:n - 1] - x2[:n - 1]

    sol = scipy.optimize.root(resid, guess / scale, method="hybr",
                              options={"xtol": 1e-13})
    u = sol.x
    if np.all(np.isfinite(u)) and maxabs(resid(u)) <= RES_TOL:
        return np.append(u, -u.sum()) * scale
    REF_STATS["bulbs: hybr residual too large"] += 1
    return shoot_film(D, c, L, x1, x2, "equimolar")


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
              "%.1e (hybr fell back to shooting %d times)"
              % (diff, REF_STATS["bulbs: hybr residual too large"]))
        # two error-controlled integrations at 1e-10 over ~10 time
        # constants: 1e-8 in mole fraction
        self.assertLess(diff, 1e-8)



if __name__ == "__main__":
    sys.exit(_support.run(__name__))
