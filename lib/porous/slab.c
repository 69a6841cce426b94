/* slab.c - steady Dusty Gas Model fluxes through a porous slab between two
 * gas states (mcd_slab_solve) and the profile across it
 * (mcd_slab_profile).
 *
 * Problem: an isothermal slab 0 <= z <= L; at steady state without
 * reaction the total fluxes N_i are constant across it. Given N, the
 * Dusty Gas Model fixes the local gradients explicitly (the inverse,
 * mcdi_dgm_grad1), so the state y = (x_1..x_N, P) obeys the ODE
 *   dy/dz = f(y; N),  y(0) = (x0, P0),
 * with open-gas binary diffusivities Đ_ij(P) = Đ_ij(P_ref) P_ref / P (the
 * low-pressure law) and a constant mixture viscosity. The N unknown fluxes
 * are found by shooting: the residual r(N) = [x_i(L) - xL_i for the first
 * N-1 species; one more condition] vanishes, where the last condition is
 *   PRESSURES: P(L) = PL (both end pressures given);
 *   STAGNANT:  N_k = 0 for the named species (P(L) is then a result);
 *   TOTAL:     sum_i N_i = N_t (P(L) is a result).
 * (sum_i x_i(L) = 1 holds by construction, so N - 1 compositions suffice.)
 * With given flux ratios (mcd_slab_solve_ratios: N_i = z_i N_t, as a
 * reaction's stoichiometry fixes them at a catalyst surface) N_t is the
 * one unknown and the residual is x_s(L) - xL_s of the named species s
 * alone; the other far-end fractions and P(L) are results (the open
 * film's RATIOS bootstrap, film.c). Its start: the inverse model at the
 * mean composition gives grad x_s = a N_t, so N_t = (xL_s - x0_s)/(a L).
 *
 * Method: the ODE is integrated by the classical fourth-order Runge-Kutta
 * method with m equal steps (a smooth residual in N), and Newton's method
 * with a forward-difference Jacobian (relative step 1e-7) and step halving
 * solves r(N) = 0 to 1e-12 (compositions) from the linearized start: the
 * single-state fluxes at the mean state with the mean gradients
 * ((xL - x0)/L, (PL - P0)/L), or with the pressure gradient that meets
 * the bootstrap. The step count starts at 64 and doubles until two
 * successive converged fluxes differ by less than 1e-10 relative (RK4's
 * error falls 16-fold per doubling), up to 16384 steps. The Jacobian's
 * N x N system is solved by Gaussian elimination with partial pivoting
 * (row swaps in place; no LAPACK, no allocation).
 */
#include <math.h>
#include <string.h>

#include "base/mcd_internal.h"
#include "base/checks.h"
#include "base/composition.h"
#include "porous/porous.h"
#include "porous/pm_layout.h"

#define SLAB_M0 64       /* first step count */
#define SLAB_M_MAX 16384 /* last step count tried */
#define SLAB_NEWTON 60   /* Newton iterations per step count */
#define SLAB_TOL 1e-12   /* residual (mole fractions) */
#define SLAB_REFINE 1e-10

/* The condition that completes a slab problem. For RATIOS (z != NULL)
 * the one unknown is N_t, held in N[0] (the other entries stay 0), the
 * fluxes are z N_t and the residual is x_s(L) - xL_s alone. */
typedef struct slab_prob {
    mcd_slab_kind kind; /* PRESSURES, STAGNANT, TOTAL (z == NULL) */
    size_t species;     /* STAGNANT: the still species; RATIOS: matched */
    double value;       /* TOTAL: sum_i N_i */
    double scale;       /* flux scale of the bootstrap condition */
    const double *z;    /* RATIOS: N_i = z_i N_t; else NULL */
    size_t nu;          /* unknowns: n, or 1 (RATIOS) */
} slab_prob;

/* Context of one slab problem. */
typedef struct slab_ctx {
    const mcd_slab *sl;
    mcdi_pore_eff e;
    mcdi_pm pm;
    size_t n;
    double PLt; /* far-end pressure aimed at (PRESSURES) */
} slab_ctx;

/* dy/dz at y (n fractions, then P) for fluxes N into dy. Fails: EDOM when
 * the pressure is not positive. */
static mcd_status slab_rhs(slab_ctx *c, const double *y, const double *N,
                           double *dy)
{
    size_t n = c->n, e;
    double P = y[n], s;
    mcd_dgm g;
    if (!(P > 0.0) || !mcdi_finite(P))
        return mcdi_fail(MCD_EDOM, "the pressure goes negative inside the "
                                   "slab (no steady state with these ends)");
    s = c->sl->P_ref / P;
    for (e = 0; e < n * n; e++)
        c->pm.sD[e] = c->sl->Dij[e] * s;
    g = (mcd_dgm){.n_species = n,
                  .n_dim = 1,
                  .T = c->sl->T,
                  .P = P,
                  .mu = c->sl->mu,
                  .M = c->sl->M,
                  .Dij = c->pm.sD,
                  .x = y};
    /* y's fractions may leave [0, 1] slightly inside a step; the formulas
     * hold for any real x (no logarithms or roots), so no clipping */
    mcdi_dgm_prepare(&g, &c->e, 0, &c->pm);
    mcdi_dgm_grad1(&g, &c->pm, N, dy, &dy[n]);
    return MCD_OK;
}

/* Integrate from z = 0 (y0) over length len in m RK4 steps into y.
 * Uses the regions k1..k4, yt. */
static mcd_status slab_integrate(slab_ctx *c, const double *y0, double len,
                                 size_t m, const double *N, double *y)
{
    size_t n1 = c->n + 1, s, i;
    double h = len / (double)m;
    double *k1 = c->pm.k1, *k2 = c->pm.k2, *k3 = c->pm.k3, *k4 = c->pm.k4,
           *yt = c->pm.yt;
    mcd_status st;
    memcpy(y, y0, n1 * sizeof *y);
    for (s = 0; s < m; s++) {
        if ((st = slab_rhs(c, y, N, k1)) != MCD_OK)
            return st;
        for (i = 0; i < n1; i++)
            yt[i] = y[i] + 0.5 * h * k1[i];
        if ((st = slab_rhs(c, yt, N, k2)) != MCD_OK)
            return st;
        for (i = 0; i < n1; i++)
            yt[i] = y[i] + 0.5 * h * k2[i];
        if ((st = slab_rhs(c, yt, N, k3)) != MCD_OK)
            return st;
        for (i = 0; i < n1; i++)
            yt[i] = y[i] + h * k3[i];
        if ((st = slab_rhs(c, yt, N, k4)) != MCD_OK)
            return st;
        for (i = 0; i < n1; i++)
            y[i] += h / 6.0 * (k1[i] + 2.0 * k2[i] + 2.0 * k3[i] + k4[i]);
    }
    for (i = 0; i < n1; i++)
        if (!mcdi_finite(y[i]))
            return mcdi_fail(MCD_EDOM, "slab profile overflows");
    return MCD_OK;
}

/* Residual r(u) (p->nu entries) with m steps for the unknowns u: the
 * fluxes, or N_t (RATIOS). */
static mcd_status slab_residual(slab_ctx *c, const slab_prob *p, size_t m,
                                const double *u, double *r)
{
    size_t n = c->n, i;
    double *y = c->pm.yL;
    const double *N = u;
    mcd_status st;
    if (p->z != NULL) {
        for (i = 0; i < n; i++)
            c->pm.Nz[i] = p->z[i] * u[0];
        N = c->pm.Nz;
    }
    c->pm.y0[n] = c->sl->P0;
    memcpy(c->pm.y0, c->pm.x0n, n * sizeof *y);
    if ((st = slab_integrate(c, c->pm.y0, c->sl->L, m, N, y)) != MCD_OK)
        return st;
    if (p->z != NULL) {
        r[0] = y[p->species] - c->pm.xLt[p->species];
        return MCD_OK;
    }
    for (i = 0; i + 1 < n; i++)
        r[i] = y[i] - c->pm.xLt[i];
    if (p->kind == MCD_SLAB_PRESSURES)
        r[n - 1] = (y[n] - c->PLt) / c->PLt;
    else if (p->kind == MCD_SLAB_STAGNANT)
        r[n - 1] = N[p->species] / p->scale;
    else {
        double t = 0.0;
        for (i = 0; i < n; i++)
            t += N[i];
        r[n - 1] = (t - p->value) / p->scale;
    }
    return MCD_OK;
}

/* Solve J d = -r in place (J n x n row-major, destroyed) by elimination
 * with partial pivoting; d overwrites r. ESING when a pivot is 0. */
static mcd_status slab_lin(size_t n, double *J, double *r)
{
    size_t i, j, k, p;
    for (k = 0; k < n; k++) {
        p = k;
        for (i = k + 1; i < n; i++)
            if (fabs(J[i * n + k]) > fabs(J[p * n + k]))
                p = i;
        if (!(fabs(J[p * n + k]) > 0.0))
            return mcdi_fail(MCD_ESING, "slab: singular Newton matrix");
        if (p != k) {
            for (j = 0; j < n; j++) {
                double t = J[k * n + j];
                J[k * n + j] = J[p * n + j];
                J[p * n + j] = t;
            }
            {
                double t = r[k];
                r[k] = r[p];
                r[p] = t;
            }
        }
        for (i = k + 1; i < n; i++) {
            double l = J[i * n + k] / J[k * n + k];
            for (j = k + 1; j < n; j++)
                J[i * n + j] -= l * J[k * n + j];
            r[i] -= l * r[k];
        }
    }
    for (k = n; k-- > 0;) {
        double s = r[k];
        for (j = k + 1; j < n; j++)
            s -= J[k * n + j] * r[j];
        r[k] = s / J[k * n + k];
    }
    for (k = 0; k < n; k++)
        r[k] = -r[k];
    return MCD_OK;
}

static double max_abs(size_t n, const double *v)
{
    double m = 0.0;
    for (size_t i = 0; i < n; i++)
        m = fmax(m, fabs(v[i]));
    return m;
}

/* Newton on N (pm.N, updated in place) with m steps. */
static mcd_status slab_newton(slab_ctx *c, const slab_prob *p, size_t m,
                              size_t *its)
{
    size_t n = p->nu, it, i, j;
    double scale = p->scale;
    double *N = c->pm.N, *r = c->pm.r, *rt = c->pm.rt, *J = c->pm.J,
           *Nt = c->pm.Nt, *d = c->pm.dN;
    mcd_status st;
    int shrink = 0;
    /* a start whose profile leaves the domain (a pressure going negative:
     * strongly non-linear slabs) is pulled towards N = 0, where the
     * profile is constant, until it stays inside */
    while ((st = slab_residual(c, p, m, N, r)) != MCD_OK) {
        if (st != MCD_EDOM || ++shrink > 60)
            return st;
        mcdi_err_clear();
        for (i = 0; i < n; i++)
            N[i] *= 0.5;
        /* and once more, away from the edge of the domain */
        if ((st = slab_residual(c, p, m, N, r)) == MCD_OK) {
            for (i = 0; i < n; i++)
                N[i] *= 0.5;
        }
        mcdi_err_clear();
    }
    for (it = 0; it < SLAB_NEWTON; it++) {
        double rn = max_abs(n, r), lam = 1.0;
        if (rn <= SLAB_TOL)
            return MCD_OK;
        for (j = 0; j < n; j++) {
            /* relative to the fluxes themselves (the scale c D / L can be
             * decades above them in Knudsen-dominated pores) */
            double h =
                1e-7 * fmax(fmax(fabs(N[j]), max_abs(n, N)), 1e-9 * scale);
            memcpy(Nt, N, n * sizeof *N);
            Nt[j] += h;
            if (slab_residual(c, p, m, Nt, rt) != MCD_OK) {
                /* at the edge of the domain: the backward difference */
                mcdi_err_clear();
                h = -h;
                Nt[j] = N[j] + h;
                if ((st = slab_residual(c, p, m, Nt, rt)) != MCD_OK)
                    return st;
            }
            for (i = 0; i < n; i++)
                J[i * n + j] = (rt[i] - r[i]) / h;
        }
        memcpy(d, r, n * sizeof *r);
        if ((st = slab_lin(n, J, d)) != MCD_OK)
            return st;
        /* step halving: accept the first step that lowers the residual */
        for (;;) {
            for (i = 0; i < n; i++)
                Nt[i] = N[i] + lam * d[i];
            st = slab_residual(c, p, m, Nt, rt);
            if (st == MCD_OK && max_abs(n, rt) < rn)
                break;
            mcdi_err_clear();
            lam *= 0.5;
            if (lam < 1e-6)
                return mcdi_fail(MCD_ENOCONV,
                                 "slab: Newton stalls at residual %.3g "
                                 "(%zu steps)",
                                 rn, m);
        }
        memcpy(N, Nt, n * sizeof *N);
        memcpy(r, rt, n * sizeof *r);
        (*its)++;
    }
    if (max_abs(n, r) <= SLAB_TOL)
        return MCD_OK;
    return mcdi_fail(MCD_ENOCONV, "slab: no convergence, residual %.3g",
                     max_abs(n, r));
}

/* Checks of a slab problem (writes nothing but the detail); the end
 * compositions renormalised into x0n and xLn. need_xL: xL is read
 * (mcd_slab_solve); need_PL: PL too (PRESSURES). */
static mcd_status slab_check(mcd_workspace *ws, const mcd_pore *pore,
                             const mcd_slab *sl, int need_xL, int need_PL,
                             slab_ctx *c)
{
    mcd_status st;
    size_t n;
    if (ws == NULL)
        return mcdi_fail(MCD_EINVAL, "argument ws: NULL");
    if (sl == NULL)
        return mcdi_fail(MCD_EINVAL, "argument slab: NULL");
    n = sl->n_species;
    if ((st = mcdi_check_species(ws, n, 1, 0, "n_species")) != MCD_OK ||
        (st = mcdi_pore_check(pore, &c->e)) != MCD_OK ||
        (st = mcdi_check_positive2(sl->T, "T", sl->mu, "mu")) != MCD_OK ||
        (st = mcdi_check_positive2(sl->L, "L", sl->P_ref, "P_ref")) != MCD_OK ||
        (st = mcdi_check_positive(ws, sl->P0, "P0")) != MCD_OK ||
        (need_PL && (st = mcdi_check_positive(ws, sl->PL, "PL")) != MCD_OK) ||
        (st = mcdi_check_M(ws, n, sl->M)) != MCD_OK ||
        (st = mcdi_check_dij(ws, n, sl->Dij)) != MCD_OK ||
        (st = mcdi_check_comp(ws, n, sl->x0, "x0")) != MCD_OK ||
        (need_xL && (st = mcdi_check_comp(ws, n, sl->xL, "xL")) != MCD_OK))
        return st;
    for (size_t i = 0; i < n; i++)
        if (!mcdi_finite(c->e.f * mcdi_knudsen(sl->T, sl->M[i], c->e.d)))
            return mcdi_fail(MCD_EDOM, "argument d_pore: Knudsen "
                                       "diffusivity outside the double range");
    c->sl = sl;
    c->n = n;
    c->PLt = sl->PL;
    mcdi_pm_scratch(ws, &c->pm);
    mcdi_comp_scale_to_one(n, sl->x0, c->pm.x0n);
    if (need_xL)
        mcdi_comp_scale_to_one(n, sl->xL, c->pm.xLn);
    return MCD_OK;
}

/* The linearized start for RATIOS (pm.N[0] = N_t, the rest 0): the
 * inverse model at the mean composition and P0 gives grad x_s = a N_t for
 * the fluxes z N_t, and N_t = (xL_s - x0_s) / (a L). */
static void slab_start_ratios(slab_ctx *c, mcd_dgm *g, const slab_prob *p)
{
    size_t n = c->n, s = p->species;
    double gP, a;
    mcdi_dgm_prepare(g, &c->e, 0, &c->pm);
    mcdi_dgm_grad1(g, &c->pm, p->z, c->pm.k1, &gP);
    a = c->pm.k1[s];
    memset(c->pm.N, 0, n * sizeof *c->pm.N);
    c->pm.N[0] = a != 0.0 ? c->pm.gm[s] / a : 0.0;
    if (!mcdi_finite(c->pm.N[0]))
        c->pm.N[0] = 0.0;
}

/* The linearized start (pm.N) and the flux scale p->scale: the
 * single-state fluxes at the mean state with the mean gradients, the
 * pressure gradient given (PRESSURES) or chosen to meet the bootstrap. */
static mcd_status slab_start(mcd_workspace *ws, const mcd_pore *pore,
                             slab_ctx *c, slab_prob *p)
{
    const mcd_slab *sl = c->sl;
    size_t n = c->n, i;
    double Pm = sl->P0, gP = 0.0, Dmax = 0.0, Nt, *N = c->pm.N;
    mcd_dgm g;
    mcd_status st;
    if (p->z == NULL && p->kind == MCD_SLAB_PRESSURES) {
        Pm = 0.5 * (sl->P0 + sl->PL);
        gP = (sl->PL - sl->P0) / sl->L;
    }
    for (i = 0; i < n * n; i++) {
        c->pm.sD[i] = sl->Dij[i] * sl->P_ref / Pm;
        Dmax = fmax(Dmax, c->pm.sD[i]);
    }
    for (i = 0; i < n; i++) {
        c->pm.xm[i] = 0.5 * (c->pm.x0n[i] + c->pm.xLn[i]);
        c->pm.gm[i] = (c->pm.xLn[i] - c->pm.x0n[i]) / sl->L;
    }
    if (n == 1)
        Dmax = c->e.f * mcdi_knudsen(sl->T, sl->M[0], c->e.d);
    p->scale = Pm / (MCD_GAS_CONSTANT * sl->T) * c->e.f * Dmax / sl->L;
    g = (mcd_dgm){.n_species = n,
                  .n_dim = 1,
                  .T = sl->T,
                  .P = Pm,
                  .mu = sl->mu,
                  .M = sl->M,
                  .Dij = c->pm.sD,
                  .x = c->pm.xm,
                  .grad_x = c->pm.gm,
                  .grad_P = &gP};
    if (p->z != NULL) {
        slab_start_ratios(c, &g, p);
        return MCD_OK;
    }
    if (p->kind == MCD_SLAB_PRESSURES)
        return mcdi_api_dgm_fluxes(ws, pore, &g, N);
    if (p->kind == MCD_SLAB_TOTAL)
        return mcdi_api_dgm_closed(ws, pore, &g, &p->value, N, &gP);
    /* STAGNANT: N is affine in N_t; two closed-end solutions fix the
     * N_t that stops the species */
    Nt = 0.0;
    if ((st = mcdi_api_dgm_closed(ws, pore, &g, &Nt, c->pm.Nt, &gP)) !=
            MCD_OK ||
        (st = mcdi_api_dgm_closed(ws, pore, &g, &p->scale, N, &gP)) != MCD_OK)
        return st;
    {
        double a0 = c->pm.Nt[p->species], b = N[p->species] - a0;
        Nt = b != 0.0 ? -a0 * p->scale / b : 0.0;
    }
    return mcdi_api_dgm_closed(ws, pore, &g, &Nt, N, &gP);
}

/* The far end aimed at: a fraction t of the way from the near end. */
static void slab_target(slab_ctx *c, double t)
{
    for (size_t i = 0; i < c->n; i++)
        c->pm.xLt[i] = c->pm.x0n[i] + t * (c->pm.xLn[i] - c->pm.x0n[i]);
    c->PLt = c->sl->P0 + t * (c->sl->PL - c->sl->P0);
}

/* Newton at the first step count on the real far end; when it fails from
 * the linearized start (strongly non-linear slabs, e.g. a stagnant species
 * whose fraction changes several-fold), continuation: the far end moves
 * from the near end to the real one in up to 64 steps, each Newton solve
 * starting from the last, the step halved on failure. */
static mcd_status slab_continuation(slab_ctx *c, const slab_prob *p,
                                    size_t *its)
{
    size_t n = c->n;
    double t = 0.0, dt = 0.125;
    mcd_status st;
    slab_target(c, 1.0);
    memcpy(c->pm.Nprev, c->pm.N, n * sizeof *c->pm.N);
    if (slab_newton(c, p, SLAB_M0, its) == MCD_OK)
        return MCD_OK;
    mcdi_err_clear();
    memcpy(c->pm.N, c->pm.Nprev, n * sizeof *c->pm.N);
    while (t < 1.0) {
        double tn = fmin(1.0, t + dt);
        slab_target(c, tn);
        memcpy(c->pm.Nprev, c->pm.N, n * sizeof *c->pm.N);
        st = slab_newton(c, p, SLAB_M0, its);
        if (st == MCD_OK) {
            t = tn;
            dt = fmin(2.0 * dt, 0.25);
            continue;
        }
        memcpy(c->pm.N, c->pm.Nprev, n * sizeof *c->pm.N);
        dt *= 0.5;
        if (dt < 1.0 / 64.0)
            return st;
        mcdi_err_clear();
    }
    return MCD_OK;
}

/* Start, continuation and step-count refinement of a checked problem;
 * the fluxes to out_N (z N_t for RATIOS), the far pressure and the
 * iteration count to the optional outputs. */
static mcd_status slab_run(mcd_workspace *ws, const mcd_pore *pore, slab_ctx *c,
                           slab_prob *p, double *out_N, double *out_PL,
                           size_t *out_iterations)
{
    mcd_status st;
    size_t n = c->n, m, its = 0, i;
    if ((st = slab_start(ws, pore, c, p)) != MCD_OK ||
        (st = slab_continuation(c, p, &its)) != MCD_OK)
        return st;
    for (m = SLAB_M0;; m *= 2) {
        memcpy(c->pm.Nprev, c->pm.N, n * sizeof *c->pm.N);
        if ((st = slab_newton(c, p, m, &its)) != MCD_OK)
            return st;
        if (m > SLAB_M0) {
            double dmax = 0.0;
            for (i = 0; i < n; i++)
                dmax = fmax(dmax, fabs(c->pm.N[i] - c->pm.Nprev[i]));
            if (dmax <= SLAB_REFINE * fmax(max_abs(n, c->pm.N), p->scale))
                break;
        }
        if (m >= SLAB_M_MAX)
            return mcdi_fail(MCD_ENOCONV,
                             "slab: fluxes still change with %zu steps "
                             "(profile too steep)",
                             m);
    }
    for (i = 0; i < n; i++)
        out_N[i] = p->z != NULL ? p->z[i] * c->pm.N[0] : c->pm.N[i];
    if (out_PL != NULL)
        *out_PL = c->pm.yL[n];
    if (out_iterations != NULL)
        *out_iterations = its;
    return MCD_OK;
}

mcd_status mcdi_api_slab_solve(mcd_workspace *ws, const mcd_pore *pore,
                               const mcd_slab *slab, mcd_slab_kind kind,
                               size_t species, double value, double *out_N,
                               double *out_PL, size_t *out_iterations)
{
    slab_ctx c;
    slab_prob p = {.kind = kind, .species = species, .value = value};
    mcd_status st;
    size_t n;
    if ((st = slab_check(ws, pore, slab, 1, kind == MCD_SLAB_PRESSURES, &c)) !=
            MCD_OK ||
        (st = mcdi_check_ptr(ws, out_N, "out_N")) != MCD_OK)
        return st;
    n = c.n;
    p.nu = n;
    if (kind != MCD_SLAB_PRESSURES && kind != MCD_SLAB_STAGNANT &&
        kind != MCD_SLAB_TOTAL)
        return mcdi_fail(MCD_EINVAL, "argument kind: unknown value %d",
                         (int)kind);
    if (kind == MCD_SLAB_STAGNANT && species >= n)
        return mcdi_fail(MCD_EINVAL,
                         "argument species: %zu is not a species index "
                         "(0..%zu)",
                         species, n - 1);
    if (kind == MCD_SLAB_TOTAL && !mcdi_finite(value))
        return mcdi_fail(MCD_EINVAL, "argument value: not finite");
    return slab_run(ws, pore, &c, &p, out_N, out_PL, out_iterations);
}

mcd_status mcdi_api_slab_solve_ratios(mcd_workspace *ws, const mcd_pore *pore,
                                      const mcd_slab *slab, size_t species,
                                      const double *ratios, double *out_N,
                                      double *out_PL, size_t *out_iterations)
{
    slab_ctx c;
    slab_prob p = {
        .kind = MCD_SLAB_TOTAL, .species = species, .z = ratios, .nu = 1};
    mcd_status st;
    size_t n, i;
    double sum = 0.0;
    if ((st = slab_check(ws, pore, slab, 1, 0, &c)) != MCD_OK ||
        (st = MCDI_CHECK_PTRS2(ratios, out_N)) != MCD_OK ||
        (st = mcdi_check_finite_vec(ws, slab->n_species, ratios, "ratios")) !=
            MCD_OK)
        return st;
    n = c.n;
    if (species >= n)
        return mcdi_fail(MCD_EINVAL,
                         "argument species: %zu is not a species index "
                         "(0..%zu)",
                         species, n - 1);
    for (i = 0; i < n; i++)
        sum += ratios[i];
    if (!(fabs(sum - 1.0) <= MCD_SUM_TOL))
        return mcdi_fail(MCD_EDOM, "argument ratios: sum to %g, not 1", sum);
    if (ratios[species] == 0.0 && c.pm.x0n[species] == 0.0)
        return mcdi_fail(MCD_EDOM,
                         "argument species: %zu is absent at z = 0 and its "
                         "ratio is 0 (it never appears): N_t undetermined",
                         species);
    return slab_run(ws, pore, &c, &p, out_N, out_PL, out_iterations);
}

mcd_status mcdi_api_slab_profile(mcd_workspace *ws, const mcd_pore *pore,
                                 const mcd_slab *slab, const double *N,
                                 size_t n_points, const double *z,
                                 double *out_x, double *out_P)
{
    slab_ctx c;
    mcd_status st;
    size_t n, k, pass;
    if ((st = slab_check(ws, pore, slab, 0, 0, &c)) != MCD_OK ||
        (st = MCDI_CHECK_PTRS3(N, out_x, out_P)) != MCD_OK ||
        (st = mcdi_check_finite_vec(ws, slab->n_species, N, "N")) != MCD_OK)
        return st;
    n = c.n;
    if (n_points > 0 && z == NULL)
        return mcdi_fail(MCD_EINVAL, "argument z: NULL");
    for (k = 0; k < n_points; k++)
        if (!mcdi_finite(z[k]) || !(z[k] >= 0.0 && z[k] <= slab->L))
            return mcdi_fail(mcdi_finite(z[k]) ? MCD_EDOM : MCD_EINVAL,
                             "argument z: entry %zu = %g is not in [0, L]", k,
                             z[k]);
    memcpy(c.pm.y0, c.pm.x0n, n * sizeof *c.pm.y0);
    c.pm.y0[n] = slab->P0;
    /* pass 0 checks every point (a pressure that goes negative), pass 1
     * writes: bad input leaves the outputs untouched */
    for (pass = 0; pass < 2; pass++)
        for (k = 0; k < n_points; k++) {
            size_t m = (size_t)ceil(1024.0 * z[k] / slab->L);
            if ((st = slab_integrate(&c, c.pm.y0, z[k], m ? m : 1, N,
                                     c.pm.yL)) != MCD_OK)
                return st;
            if (pass == 1) {
                memcpy(out_x + k * n, c.pm.yL, n * sizeof *out_x);
                out_P[k] = c.pm.yL[n];
            }
        }
    return MCD_OK;
}
