/* bulbs.c - transient two-bulb diffusion cell.
 *
 * Model. Two well-mixed bulbs, volumes V1 and V2, joined by a capillary of
 * cross-section A and length L; closed, isothermal, isobaric ideal gas
 * (total concentration c everywhere). Each bulb keeps its number of moles,
 * so the capillary carries no net molar flux (N_t = 0, equimolar
 * counter-diffusion). The capillary holds a negligible volume and is
 * quasi-steady: at every instant its fluxes N (from bulb 1 at z = 0
 * towards bulb 2 at z = L) are those of a steady film between x1 and x2:
 *
 *   c V1 dx1/dt = -A N(x1, x2),   c V2 dx2/dt = +A N(x1, x2).       (1)
 *
 * Hence V1 x1 + V2 x2 is constant for every species, and both bulbs tend
 * to the volume-weighted mean xbar = (V1 x1 + V2 x2)/(V1 + V2).
 *
 * Linearized theory (Toor 1964; Stewart and Prober 1964): with [D] (molar
 * frame, ideal gas, Gamma = I) frozen at xbar, N = J = (c/L) [D] Delta for
 * Delta = x1 - x2 (N-1 independent species), and (1) gives
 *   d Delta/dt = -beta [D] Delta,  beta = A (V1 + V2)/(L V1 V2),
 *   Delta(t) = [P] exp(-beta [Lambda] t) [P]^-1 Delta(0),
 * with [D] = [P][Lambda][P]^-1 from LAPACK dgeev (right eigenvectors;
 * dgeev because [D] is not symmetric; its eigenvalues are real and positive
 * for ideal gases, being those of a product of two symmetric positive
 * definite matrices). The call uses LAPACKE_dgeev_work in column-major order
 * with the workspace's dgeev work array, and dgetrf/dgetrs for [P]^-1.
 * Should [P] be singular or the spectrum complex (round-off with nearly
 * equal eigenvalues), the scaling-and-squaring exponential of film.c
 * is used instead: Delta(t) = exp(-beta t [D]) Delta(0).
 * Then x1 = xbar + V2/(V1+V2) Delta, x2 = xbar - V1/(V1+V2) Delta.
 *
 * Integration: (1) with the exact equimolar film fluxes (Krishna-Standart,
 * mcdi_film_core) by the embedded Runge-Kutta 5(4) pair of Dormand and
 * Prince (1980), FSAL, with the usual step controller
 * h_new = h min(5, max(0.2, 0.9 err^-1/5)), err = max |local error| /
 * rel_tol on the mole fractions. Only x1 is integrated; x2 is recovered
 * from V1 x1 + V2 x2 = V1 x1(0) + V2 x2(0), so every species is conserved
 * to round-off by construction. Stage compositions are clipped at 0 and
 * renormalised before the flux evaluation only (the state itself is never
 * modified). To leave the outputs untouched on failure, the integration is
 * run once without writing and, if it succeeds, repeated (identically)
 * while writing.
 *
 * Scratch: the b_* regions of the transfer scratch (tf_layout.h), distinct
 * from the film's, which the integration calls; the linearized call also
 * uses its matrices and pivots.
 */
#include <math.h>
#include <string.h>
#include <lapacke.h>

#include "base/mcd_internal.h"
#include "base/workspace.h"
#include "transfer/film.h"
#include "transfer/tf_layout.h"
#include "flux/flux_core.h"

#define BULBS_MAX_STEPS 200000

typedef struct bulbs_in {
    size_t n;
    double c, V1, V2, A, L;
    const double *t;
    size_t n_times;
} bulbs_in;

static mcd_status bulbs_check(mcd_workspace *ws, const mcd_bulbs *b,
                              size_t n_times, const double *t, double *out_x1,
                              double *out_x2, int monotone, mcdi_tf *tf)
{
    mcd_status st;
    size_t k, n;
    double *x1n, *x2n;
    if ((st = mcdi_check_ws_obj(ws, b, "bulbs")) != MCD_OK)
        return st;
    n = b->n_species;
    mcdi_tf_scratch(ws, tf);
    x1n = tf->b_x1n;
    x2n = tf->b_x2n;
    if ((st = mcdi_tf_check_ws_n(ws, n)) != MCD_OK ||
        (st = mcdi_check_dij(ws, n, b->Dij)) != MCD_OK ||
        (st = mcdi_check_positive(ws, b->c, "c")) != MCD_OK ||
        (st = mcdi_check_positive(ws, b->V1, "V1")) != MCD_OK ||
        (st = mcdi_check_positive(ws, b->V2, "V2")) != MCD_OK ||
        (st = mcdi_check_positive(ws, b->A, "A")) != MCD_OK ||
        (st = mcdi_check_positive(ws, b->L, "L")) != MCD_OK ||
        (st = mcdi_tf_check_comp(ws, n, b->x1_0, "x1_0", x1n)) != MCD_OK ||
        (st = mcdi_tf_check_comp(ws, n, b->x2_0, "x2_0", x2n)) != MCD_OK)
        return st;
    if (n_times == 0)
        return MCD_OK;
    if ((st = MCDI_CHECK_PTRS3(t, out_x1, out_x2)) != MCD_OK)
        return st;
    for (k = 0; k < n_times; k++) {
        if (!mcdi_finite(t[k]))
            return mcdi_fail(MCD_EINVAL, "argument t: entry %zu is not finite",
                             k);
        if (!(t[k] >= 0))
            return mcdi_fail(MCD_EDOM, "argument t: entry %zu = %g is negative",
                             k, t[k]);
        if (monotone && k > 0 && !(t[k] >= t[k - 1]))
            return mcdi_fail(
                MCD_EDOM,
                "argument t: entry %zu is below entry %zu (not ascending)", k,
                k - 1);
    }
    return MCD_OK;
}

/* ------------------------------------------------------------------ */
/* Linearized theory                                                   */
/* ------------------------------------------------------------------ */

/* The Fick matrix (molar frame, ideal gas) at the mean composition xbar,
 * the most abundant species dependent (its index into *dep). */
static mcd_status mean_fick_matrix(mcd_workspace *ws, size_t n,
                                   const double *Dij, const double *xbar,
                                   double *Dm, size_t *dep)
{
    mcd_state mean = {0};
    mean.n_species = n;
    mean.comp_basis = MCD_BASIS_MOLE;
    mean.Dij = Dij;
    mean.comp = xbar;
    return mcdi_api_fick_matrix(ws, &mean, MCD_BASIS_MOLE, MCD_DEPENDENT_AUTO,
                                Dm, dep);
}

/* The modes of the linearized system: dgeev of the (n-1) x (n-1) matrix
 * tf->mat0 (row-major) into eigenvalues tf->b_wr (+ i tf->b_wi) and
 * column-major eigenvectors tf->mat2, and the initial difference tf->b_dl0
 * in that basis (tf->b_coef). 0 when there is no usable real
 * decomposition (the caller then uses the matrix exponential); the
 * negative LAPACK argument error is EINTERNAL in *st. */
static int bulbs_modes(mcd_workspace *ws, size_t m, mcdi_tf *tf, mcd_status *st)
{
    double *Ac = tf->mat1, *VR = tf->mat2, *LU = tf->mat3, *work;
    double wmax = 0.0;
    size_t i, j, lwork = 0;
    lapack_int info, *ipiv = (lapack_int *)ws->tf_ipiv;

    /* column-major copy (the transpose of row-major) */
    for (i = 0; i < m; i++)
        for (j = 0; j < m; j++)
            Ac[i + j * m] = tf->mat0[i * m + j];
    work = mcdi_ws_geev_work(ws, &lwork);
    info = LAPACKE_dgeev_work(LAPACK_COL_MAJOR, 'N', 'V', (lapack_int)m, Ac,
                              (lapack_int)m, tf->b_wr, tf->b_wi, NULL, 1, VR,
                              (lapack_int)m, work, (lapack_int)lwork);
    if (info < 0) {
        *st = mcdi_fail(MCD_EINTERNAL, "dgeev: argument %d", (int)-info);
        return 0;
    }
    if (info > 0)
        return 0;
    for (i = 0; i < m; i++)
        wmax = fmax(wmax, fabs(tf->b_wr[i]));
    for (i = 0; i < m; i++)
        if (!(fabs(tf->b_wi[i]) <= 1e-10 * wmax))
            return 0;
    memcpy(LU, VR, m * m * sizeof(double));
    memcpy(tf->b_coef, tf->b_dl0, m * sizeof(double));
    info = LAPACKE_dgetrf_work(LAPACK_COL_MAJOR, (lapack_int)m, (lapack_int)m,
                               LU, (lapack_int)m, ipiv);
    if (info == 0)
        info =
            LAPACKE_dgetrs_work(LAPACK_COL_MAJOR, 'N', (lapack_int)m, 1, LU,
                                (lapack_int)m, ipiv, tf->b_coef, (lapack_int)m);
    if (info != 0)
        return 0;
    for (i = 0; i < m; i++)
        if (!mcdi_finite(tf->b_coef[i]))
            return 0;
    return 1;
}

/* Without modes, exp(-beta t [D]) must stay in range for every t: checked
 * before anything is written. */
static mcd_status bulbs_exp_range(size_t m, const double *Dm, double beta,
                                  size_t n_times, const double *t)
{
    double norm = 0.0, tmax = 0.0;
    size_t i, j, k;
    for (j = 0; j < m; j++) {
        double col = 0.0;
        for (i = 0; i < m; i++)
            col += fabs(Dm[i * m + j]);
        norm = fmax(norm, col);
    }
    for (k = 0; k < n_times; k++)
        tmax = fmax(tmax, t[k]);
    if (!(beta * tmax * norm <= 1e4))
        return mcdi_fail(MCD_ESING,
                         "no real eigen-decomposition of [D] and "
                         "beta t ||D|| = %g too large for exp",
                         beta * tmax * norm);
    return MCD_OK;
}

/* The independent differences x1 - x2 at time tk into tf->b_dl: from the
 * modes, or from exp(-beta tk [D]) applied to tf->b_dl0. */
static mcd_status bulbs_diff_at(size_t m, mcdi_tf *tf, int use_eig, double beta,
                                double tk)
{
    size_t i, j;
    if (use_eig) {
        for (i = 0; i < m; i++) {
            double acc = 0.0;
            for (j = 0; j < m; j++)
                acc += tf->mat2[i + j * m] * exp(-beta * tf->b_wr[j] * tk) *
                       tf->b_coef[j];
            tf->b_dl[i] = acc;
        }
        return MCD_OK;
    }
    {
        double *slot[3] = {tf->mat1, tf->mat2, tf->mat3};
        for (i = 0; i < m * m; i++)
            slot[0][i] = -beta * tk * tf->mat0[i];
        if (mcdi_tf_expm_phi(m, slot) != MCD_OK)
            return mcdi_fail(MCD_EINTERNAL, "exp overflow");
        for (i = 0; i < m; i++) {
            double acc = 0.0;
            for (j = 0; j < m; j++)
                acc += slot[2][i * m + j] * tf->b_dl0[j];
            tf->b_dl[i] = acc;
        }
    }
    return MCD_OK;
}

mcd_status mcdi_api_bulbs_linearized(mcd_workspace *ws, const mcd_bulbs *bulbs,
                                     size_t n_times, const double *t,
                                     double *out_x1, double *out_x2)
{
    mcdi_tf tf;
    double beta, f1, f2, *xbar;
    size_t n, m, d, i, j, k;
    int use_eig;
    mcd_status st;

    st = bulbs_check(ws, bulbs, n_times, t, out_x1, out_x2, 0, &tf);
    if (st != MCD_OK || n_times == 0)
        return st;
    n = bulbs->n_species;
    xbar = tf.b_xbar;
    for (i = 0; i < n; i++)
        xbar[i] = (bulbs->V1 * tf.b_x1n[i] + bulbs->V2 * tf.b_x2n[i]) /
                  (bulbs->V1 + bulbs->V2);
    st = mean_fick_matrix(ws, n, bulbs->Dij, xbar, tf.mat0, &d);
    if (st != MCD_OK)
        return st;
    m = n - 1;
    beta =
        bulbs->A * (bulbs->V1 + bulbs->V2) / (bulbs->L * bulbs->V1 * bulbs->V2);
    f1 = bulbs->V2 / (bulbs->V1 + bulbs->V2);
    f2 = bulbs->V1 / (bulbs->V1 + bulbs->V2);
    for (i = 0, k = 0; i < n; i++)
        if (i != d)
            tf.b_dl0[k++] = tf.b_x1n[i] - tf.b_x2n[i];

    st = MCD_OK;
    use_eig = bulbs_modes(ws, m, &tf, &st);
    if (st != MCD_OK)
        return st;
    if (!use_eig &&
        (st = bulbs_exp_range(m, tf.mat0, beta, n_times, t)) != MCD_OK)
        return st;

    for (k = 0; k < n_times; k++) {
        double sum = 0.0;
        if ((st = bulbs_diff_at(m, &tf, use_eig, beta, t[k])) != MCD_OK)
            return st;
        for (i = 0, j = 0; i < n; i++) {
            double di;
            if (i == d)
                continue;
            di = tf.b_dl[j++];
            sum += di;
            out_x1[k * n + i] = xbar[i] + f1 * di;
            out_x2[k * n + i] = xbar[i] - f2 * di;
        }
        out_x1[k * n + d] = xbar[d] - f1 * sum;
        out_x2[k * n + d] = xbar[d] + f2 * sum;
    }
    return MCD_OK;
}

/* ------------------------------------------------------------------ */
/* Time integration                                                    */
/* ------------------------------------------------------------------ */

/* Dormand-Prince 5(4) tableau. */
static const double DP_C[7] = {0.0,     1.0 / 5, 3.0 / 10, 4.0 / 5,
                               8.0 / 9, 1.0,     1.0};
static const double DP_A[7][6] = {
    {0, 0, 0, 0, 0, 0},
    {1.0 / 5, 0, 0, 0, 0, 0},
    {3.0 / 40, 9.0 / 40, 0, 0, 0, 0},
    {44.0 / 45, -56.0 / 15, 32.0 / 9, 0, 0, 0},
    {19372.0 / 6561, -25360.0 / 2187, 64448.0 / 6561, -212.0 / 729, 0, 0},
    {9017.0 / 3168, -355.0 / 33, 46732.0 / 5247, 49.0 / 176, -5103.0 / 18656,
     0},
    {35.0 / 384, 0, 500.0 / 1113, 125.0 / 192, -2187.0 / 6784, 11.0 / 84}};
/* 5th-order weights = last row of DP_A (plus 0 for k7); 4th-order: */
static const double DP_BS[7] = {
    5179.0 / 57600, 0,       7571.0 / 16695, 393.0 / 640, -92097.0 / 339200,
    187.0 / 2100,   1.0 / 40};

typedef struct integ {
    mcd_workspace *ws;
    size_t n;
    const double *Dij;
    double c, L, rate1; /* rate1 = A / (c V1) */
    double V1, V2;
    const double *tot; /* V1 x1 + V2 x2 per species */
    double *x1c, *x2c, *N;
} integ;

/* f(y) = dx1/dt = -A N / (c V1) with x2 from conservation. */
static mcd_status rhs(integ *g, const double *y, double *out)
{
    size_t i, n = g->n;
    double s1 = 0.0, s2 = 0.0;
    mcd_status st;
    for (i = 0; i < n; i++) {
        double a = y[i], b = (g->tot[i] - g->V1 * y[i]) / g->V2;
        g->x1c[i] = a > 0 ? a : 0.0;
        g->x2c[i] = b > 0 ? b : 0.0;
        s1 += g->x1c[i];
        s2 += g->x2c[i];
    }
    if (!(s1 > 0) || !(s2 > 0))
        return MCD_EDOM;
    for (i = 0; i < n; i++) {
        g->x1c[i] /= s1;
        g->x2c[i] /= s2;
    }
    st = mcdi_film_core(g->ws, n, g->Dij, g->c, g->L, g->x1c, g->x2c,
                        MCD_FILM_BOOT_EQUIMOLAR, 0, NULL, MCD_FILM_EXACT, g->N,
                        NULL, NULL);
    if (st != MCD_OK)
        return st;
    for (i = 0; i < n; i++)
        out[i] = -g->rate1 * g->N[i];
    return MCD_OK;
}

/* One full integration; writes outputs only when `write` is set. */
static mcd_status integrate(integ *g, const double *x1n, size_t n_times,
                            const double *t, double rel_tol, double h0,
                            int write, double *out_x1, double *out_x2)
{
    mcd_workspace *ws = g->ws;
    size_t n = g->n, i, s, k, steps = 0;
    double *kk[7], *ys, *y, *yn;
    double tc = 0.0, h = h0;
    mcdi_tf tf;
    mcd_status st;

    mcdi_tf_scratch(ws, &tf);
    kk[0] = tf.b_k0;
    kk[1] = tf.b_k1;
    kk[2] = tf.b_k2;
    kk[3] = tf.b_k3;
    kk[4] = tf.b_k4;
    kk[5] = tf.b_k5;
    kk[6] = tf.b_k6;
    ys = tf.b_ys;
    y = tf.b_y;
    yn = tf.b_yn;

    memcpy(y, x1n, n * sizeof(double));
    st = rhs(g, y, kk[0]);
    if (st != MCD_OK)
        return st;
    for (k = 0; k < n_times; k++) {
        while (tc < t[k]) {
            double err = 0.0, hs, fac;
            int last = 0;
            if (++steps > BULBS_MAX_STEPS)
                return mcdi_fail(MCD_ENOCONV, "bulbs: more than %d steps",
                                 BULBS_MAX_STEPS);
            if (tc + h >= t[k]) {
                hs = t[k] - tc;
                last = 1;
            } else {
                hs = h;
            }
            for (s = 1; s < 7; s++) {
                size_t q;
                for (i = 0; i < n; i++) {
                    double acc = y[i];
                    for (q = 0; q < s; q++)
                        acc += hs * DP_A[s][q] * kk[q][i];
                    ys[i] = acc;
                }
                if (s == 6)
                    memcpy(yn, ys, n * sizeof(double));
                st = rhs(g, ys, kk[s]);
                if (st != MCD_OK)
                    return mcdi_fail(st,
                                     "bulbs: capillary flux failed at "
                                     "t = %g",
                                     tc + DP_C[s] * hs);
            }
            for (i = 0; i < n; i++) {
                double e = 0.0;
                for (s = 0; s < 7; s++) {
                    double b = (s < 6) ? DP_A[6][s] : 0.0;
                    e += (b - DP_BS[s]) * kk[s][i];
                }
                err = fmax(err, fabs(hs * e) / rel_tol);
            }
            if (!mcdi_finite(err))
                err = 1e10;
            fac = err > 0 ? 0.9 * pow(err, -0.2) : 5.0;
            fac = fmin(5.0, fmax(0.2, fac));
            if (err <= 1.0) {
                tc = last ? t[k] : tc + hs;
                memcpy(y, yn, n * sizeof(double));
                memcpy(kk[0], kk[6], n * sizeof(double)); /* FSAL */
                if (!last || fac < 1.0)
                    h = hs * fac;
            } else {
                h = hs * fac;
                if (!(h > 1e-14 * fmax(tc, t[k])) || h == 0.0)
                    return mcdi_fail(MCD_ENOCONV,
                                     "bulbs: step size underflow at "
                                     "t = %g",
                                     tc);
            }
        }
        if (write) {
            for (i = 0; i < n; i++) {
                out_x1[k * n + i] = y[i];
                out_x2[k * n + i] = (g->tot[i] - g->V1 * y[i]) / g->V2;
            }
        }
    }
    return MCD_OK;
}

mcd_status mcdi_api_bulbs_integrate(mcd_workspace *ws, const mcd_bulbs *bulbs,
                                    size_t n_times, const double *t,
                                    double rel_tol, double *out_x1,
                                    double *out_x2)
{
    double *x1n, *x2n, *tot, Dmax = 0.0, h0;
    mcdi_tf tf;
    integ g;
    size_t n, i;
    mcd_status st;

    st = bulbs_check(ws, bulbs, n_times, t, out_x1, out_x2, 1, &tf);
    if (st != MCD_OK)
        return st;
    n = bulbs->n_species;
    x1n = tf.b_x1n;
    x2n = tf.b_x2n;
    tot = tf.b_tot;
    if (!mcdi_finite(rel_tol))
        return mcdi_fail(MCD_EINVAL, "argument rel_tol: not finite");
    if (!(rel_tol >= 1e-12 && rel_tol <= 1e-2))
        return mcdi_fail(
            MCD_EDOM, "argument rel_tol: %g is not in [1e-12, 1e-2]", rel_tol);
    if (n_times == 0)
        return MCD_OK;
    for (i = 0; i < n; i++)
        tot[i] = bulbs->V1 * x1n[i] + bulbs->V2 * x2n[i];
    for (i = 0; i < n * n; i++)
        if (i / n != i % n && bulbs->Dij[i] > Dmax)
            Dmax = bulbs->Dij[i];
    memset(&g, 0, sizeof g);
    g.ws = ws;
    g.n = n;
    g.Dij = bulbs->Dij;
    g.c = bulbs->c;
    g.L = bulbs->L;
    g.V1 = bulbs->V1;
    g.V2 = bulbs->V2;
    g.rate1 = bulbs->A / (bulbs->c * bulbs->V1);
    g.tot = tot;
    g.x1c = tf.b_x1c;
    g.x2c = tf.b_x2c;
    g.N = tf.b_N;
    /* first step: a small fraction of the fastest relaxation time */
    h0 = 1e-3 * bulbs->L * bulbs->V1 * bulbs->V2 /
         (bulbs->A * (bulbs->V1 + bulbs->V2) * Dmax);
    st = integrate(&g, x1n, n_times, t, rel_tol, h0, 0, NULL, NULL);
    if (st != MCD_OK)
        return st;
    return integrate(&g, x1n, n_times, t, rel_tol, h0, 1, out_x1, out_x2);
}
