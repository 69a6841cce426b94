/* liq_eval.c - mcd_liquid_eval: ln gamma, the thermodynamic factor, the
 * phase-stability test and the Vignes / Kooijman-Taylor diffusivities of a
 * liquid at one state. Everything is computed into the workspace's liquid
 * scratch (liq_layout.h) and copied to the outputs at the end, so outputs
 * are untouched on any failure.
 */
#include <float.h>
#include <math.h>
#include <string.h>

#include "base/mcd_internal.h"
#include "base/checks.h"
#include "base/composition.h"
#include "liquid/liq_layout.h"
#include "liquid/liquid.h"

static const char *model_name(mcd_activity_model m)
{
    switch (m) {
    case MCD_ACTIVITY_NRTL: return "NRTL";
    case MCD_ACTIVITY_WILSON: return "Wilson";
    case MCD_ACTIVITY_UNIQUAC: return "UNIQUAC";
    default: return "ideal";
    }
}

/* Every parameter the model (and the diffusivities, when need_d) needs is
 * set; else ENODATA naming the first missing one. */
static mcd_status check_params(const mcd_liquid *liq, int need_d)
{
    static const char *const spname[MCDI_LIQ_NSP] = {
        "molar volume (MCD_LIQ_MOLAR_VOLUME)", "r (MCD_LIQ_UNIQUAC_R)",
        "q (MCD_LIQ_UNIQUAC_Q)"};
    size_t n = liq->n, i, j;
    for (i = 0; i < n && liq->model != MCD_ACTIVITY_IDEAL; i++)
        for (j = i + 1; j < n; j++)
            if (!liq->pset[i * n + j])
                return mcdi_fail(MCD_ENODATA,
                                 "pair (%zu, %zu): %s interaction parameters "
                                 "not set",
                                 i, j, model_name(liq->model));
    for (i = 0; i < n; i++) {
        for (j = 0; j < MCDI_LIQ_NSP; j++) {
            int need = (liq->model == MCD_ACTIVITY_WILSON &&
                        j == MCD_LIQ_MOLAR_VOLUME) ||
                       (liq->model == MCD_ACTIVITY_UNIQUAC &&
                        j != MCD_LIQ_MOLAR_VOLUME);
            if (need && !(liq->sp[i * MCDI_LIQ_NSP + j] > 0))
                return mcdi_fail(MCD_ENODATA, "species %zu: %s %s not set", i,
                                 model_name(liq->model), spname[j]);
        }
    }
    for (i = 0; i < n && need_d; i++)
        for (j = 0; j < n; j++)
            if (i != j && !(liq->dinf[i * n + j] > 0))
                return mcdi_fail(MCD_ENODATA,
                                 "pair (%zu, %zu): infinite-dilution "
                                 "diffusivity of species %zu in %zu not set",
                                 i < j ? i : j, i < j ? j : i, i, j);
    return MCD_OK;
}

/* The model's pair matrix at T (NRTL tau, Wilson Lambda, UNIQUAC tau) into
 * t; warning bits for T outside a declared range. EDOM when a value is not
 * finite (parameters that overflow at this T). */
static mcd_status pair_matrix(const mcd_liquid *liq, double T, double *t,
                              unsigned *warn)
{
    size_t n = liq->n, i, j;
    double lnT = log(T);
    for (i = 0; i < n; i++) {
        for (j = 0; j < n; j++) {
            const double *c = liq->coef + 3 * (i * n + j);
            const double *r = liq->trange + 2 * (i * n + j);
            double p = c[0] + c[1] / T + c[2] * lnT, v;
            const double *sp = liq->sp;
            if (i == j)
                p = 0.0;
            else if (r[1] > 0 && !(T >= r[0] && T <= r[1]))
                *warn |= MCD_WARN_TEMPERATURE;
            switch (liq->model) {
            case MCD_ACTIVITY_WILSON:
                v = sp[j * MCDI_LIQ_NSP + MCD_LIQ_MOLAR_VOLUME] /
                    sp[i * MCDI_LIQ_NSP + MCD_LIQ_MOLAR_VOLUME] * exp(-p);
                break;
            case MCD_ACTIVITY_UNIQUAC: v = exp(-p); break;
            default: v = p; break;
            }
            if (!mcdi_finite(v) ||
                (liq->model != MCD_ACTIVITY_NRTL &&
                 liq->model != MCD_ACTIVITY_IDEAL && !(v >= DBL_MIN)))
                return mcdi_fail(MCD_EDOM,
                                 "pair (%zu, %zu): %s parameter %g out of "
                                 "range at T = %g K",
                                 i, j, model_name(liq->model), v, T);
            t[i * n + j] = v;
        }
    }
    return MCD_OK;
}

/*
 * Phase stability. The Hessian of the Gibbs energy of mixing, in mole
 * numbers and units of R T / n_T, is S_ij = delta_ij / x_i - 1 + H_ij; it
 * is positive semi-definite with the null vector x where the liquid is
 * stable (intrinsic stability: Modell and Reid 1983, ch. 7 - common
 * practice). Over the species present, with r the most abundant, the
 * composition changes e_a - e_r span a complement of x, so the liquid is
 * stable iff
 *   A_ab = sqrt(x_a x_b) (S_ab - S_ar - S_rb + S_rr)
 *        = delta_ab + sqrt(x_a x_b) (1/x_r + H_ab - H_ar - H_rb + H_rr),
 * a, b present and != r,
 * is positive definite (the sqrt(x) scaling makes the entropic part the
 * identity plus a rank-one term, so A is well conditioned away from the
 * spinodal). A Cholesky factorisation (hand-written: the order is small,
 * and a failing pivot is the answer, not an error of LAPACK) tests it; a
 * pivot below 1e-12 of its diagonal entry counts as not positive (the
 * spinodal itself, det Gamma = 0, within round-off). Absent species
 * (x = 0) cannot make the liquid unstable: their ln x term is unbounded.
 * For N = 2 the single entry is x_1 x_2 S = Gamma_11 - Gamma_12, the
 * reduced thermodynamic factor.
 */
static int stable(size_t n, const double *x, const double *H, double *A)
{
    size_t r = 0, m = 0, a, b, k, idx[MCD_MAX_SPECIES];
    for (a = 0; a < n; a++)
        if (x[a] > x[r])
            r = a;
    for (a = 0; a < n; a++)
        if (a != r && x[a] > 0)
            idx[m++] = a;
    for (a = 0; a < m; a++) {
        for (b = 0; b < m; b++) {
            size_t i = idx[a], j = idx[b];
            A[a * m + b] =
                (a == b ? 1.0 : 0.0) +
                sqrt(x[i] * x[j]) * (1.0 / x[r] + H[i * n + j] - H[i * n + r] -
                                     H[r * n + j] + H[r * n + r]);
        }
    }
    for (a = 0; a < m; a++) {
        double d = A[a * m + a], d0 = fabs(d);
        for (k = 0; k < a; k++)
            d -= A[a * m + k] * A[a * m + k];
        if (!(d > 1e-12 * d0))
            return 0;
        d = sqrt(d);
        A[a * m + a] = d;
        for (b = a + 1; b < m; b++) {
            double s = A[b * m + a];
            for (k = 0; k < a; k++)
                s -= A[b * m + k] * A[a * m + k];
            A[b * m + a] = s / d;
        }
    }
    return 1;
}

/*
 * Maxwell-Stefan diffusivities of the concentrated liquid from the
 * infinite-dilution values (D°_ij: i infinitely dilute in j):
 *   ln Đ_ij = x_j ln D°_ij + x_i ln D°_ji
 *             + sum_{k != i,j} x_k (ln D°_ik + ln D°_jk) / 2,
 * Kooijman and Taylor, Ind. Eng. Chem. Res. 30, 1217 (1991), eq. 15 with
 * Đ_ij at x_k -> 1 estimated as sqrt(D°_ik D°_jk) (their eq. 17); for
 * N = 2 this is Vignes, Ind. Eng. Chem. Fundam. 5, 189 (1966), applied to
 * the Maxwell-Stefan diffusivity. Symmetric by construction.
 * With L_ij = ln D°_ij (mcdi_liquid_log_dinf, computed once per call:
 * no logarithm here) and S_i = sum_k x_k L_ik (L_ii = 0), the sum over
 * k != i, j is S_i - x_j L_ij: O(N^2) instead of O(N^3) logarithms. The
 * differences are exact where a third species is absent (S_i - x_j L_ij
 * = 0 for N = 2 and at x_k = 0), so the limits are Vignes' to the
 * rounding of exp; elsewhere they lose a few ulps of |L| (~20), below
 * 1e-14 relative in Đ. S: scratch of n.
 */
static void vignes(size_t n, const double *L, const double *x, double *S,
                   double *D)
{
    size_t i, j, k;
    for (i = 0; i < n; i++) {
        double s = 0.0;
        for (k = 0; k < n; k++)
            s += x[k] * L[i * n + k];
        S[i] = s;
    }
    for (i = 0; i < n; i++) {
        D[i * n + i] = 0.0;
        for (j = i + 1; j < n; j++) {
            double a = x[j] * L[i * n + j], b = x[i] * L[j * n + i];
            double e = a + b + 0.5 * ((S[i] - a) + (S[j] - b));
            D[i * n + j] = D[j * n + i] = exp(e);
        }
    }
}

void mcdi_liquid_log_dinf(const mcd_liquid *liq, double *L)
{
    size_t n = liq->n, i, j;
    for (i = 0; i < n; i++)
        for (j = 0; j < n; j++)
            L[i * n + j] = i == j ? 0.0 : log(liq->dinf[i * n + j]);
}

mcd_status mcdi_liquid_partial(const mcd_liquid *liq, double T, const double *x,
                               const double *lng, double *p, unsigned *warn)
{
    for (size_t i = 0; i < liq->n; i++) {
        const double *a = liq->ant + 5 * i;
        double lg;
        if (!mcdi_finite(a[0])) {
            p[i] = 0.0;
            continue;
        }
        if (!(T >= a[3] && T <= a[4]))
            *warn |= MCD_WARN_TEMPERATURE;
        if (!(T + a[2] > 0))
            return mcdi_fail(MCD_EDOM,
                             "species %zu: T = %g K is below the pole of its "
                             "Antoine equation (T + C <= 0)",
                             i, T);
        lg = a[0] - a[1] / (T + a[2]);
        p[i] = x[i] * exp(lng[i] + lg * 2.302585092994046); /* ln 10 */
        if (!mcdi_finite(p[i]))
            return mcdi_fail(MCD_EDOM,
                             "species %zu: vapour pressure overflows at T = "
                             "%g K",
                             i, T);
    }
    return MCD_OK;
}

/* Modified Raoult's law at the interface: the liquid's activity
 * coefficients (stable states only) and the Antoine vapour pressures. */
mcd_status mcdi_api_liquid_vle(mcd_workspace *ws, const mcd_liquid *liq,
                               double T, const double *x, double *out_p,
                               unsigned *out_warn)
{
    mcdi_liq l;
    unsigned warn = 0;
    mcd_status st;
    if ((st = MCDI_CHECK_PTRS3(ws, liq, out_p)) != MCD_OK ||
        (st = mcdi_api_liquid_eval(ws, liq, T, x, NULL, NULL, NULL, &warn)) !=
            MCD_OK)
        return st;
    /* eval left ln gamma and the normalised x in the liquid scratch */
    mcdi_liq_scratch(ws, &l);
    if ((st = mcdi_liquid_partial(liq, T, l.x, l.lng, l.s1, &warn)) != MCD_OK)
        return st;
    memcpy(out_p, l.s1, liq->n * sizeof(double));
    if (out_warn != NULL)
        *out_warn = warn;
    return MCD_OK;
}

/* The state at (T, l->x) into the liquid scratch: pair matrix, ln gamma,
 * H, the stability test, Gamma and, given lnD (ln D°, n x n), the
 * diffusivities (l->D).
 * l->x holds validated mole fractions summing to one; the parameters are
 * checked (check_params). xname names the caller's argument that holds
 * the composition in the message of an unstable state. */
static mcd_status state_core(const mcd_liquid *liq, double T, const mcdi_liq *l,
                             const double *lnD, unsigned *warn,
                             const char *xname)
{
    mcdi_act_scratch sc;
    mcd_status st;
    size_t n = liq->n, i, j;
    if ((st = pair_matrix(liq, T, l->t, warn)) != MCD_OK)
        return st;
    sc.s1 = l->s1, sc.s2 = l->s2, sc.s3 = l->s3, sc.r = l->r, sc.q = l->q;
    sc.g = l->g, sc.w = l->w, sc.p = l->p;
    if (mcdi_activity_eval(liq, l->t, l->x, l->lng, l->H, &sc) != 0)
        return mcdi_fail(MCD_EDOM,
                         "%s: activity coefficients overflow at "
                         "T = %g K (parameters out of range)",
                         model_name(liq->model), T);
    if (!stable(n, l->x, l->H, l->A))
        return mcdi_fail(MCD_EDOM,
                         "argument %s: the liquid is not stable at this "
                         "composition and T = %g K (thermodynamic factor not "
                         "positive definite: it splits into two liquid "
                         "phases)",
                         xname, T);
    for (i = 0; i < n; i++)
        for (j = 0; j < n; j++)
            l->Gam[i * n + j] =
                (i == j ? 1.0 : 0.0) + l->x[i] * l->H[i * n + j];
    if (lnD != NULL)
        vignes(n, lnD, l->x, l->s1, l->D);
    return MCD_OK;
}

mcd_status mcdi_liquid_ready(const mcd_liquid *liq, int need_d)
{
    return check_params(liq, need_d);
}

mcd_status mcdi_liquid_state(mcd_workspace *ws, const mcd_liquid *liq, double T,
                             const double *x, const char *xname,
                             const double *lnD, double *out_Gamma,
                             double *out_Dij, unsigned *warn)
{
    mcdi_liq l;
    mcd_status st;
    size_t n = liq->n;
    mcdi_liq_scratch(ws, &l);
    memcpy(l.x, x, n * sizeof(double));
    if ((st = state_core(liq, T, &l, out_Dij != NULL ? lnD : NULL, warn,
                         xname)) != MCD_OK)
        return st;
    if (out_Gamma != NULL)
        memcpy(out_Gamma, l.Gam, n * n * sizeof(double));
    if (out_Dij != NULL)
        memcpy(out_Dij, l.D, n * n * sizeof(double));
    return MCD_OK;
}

mcd_status mcdi_api_liquid_eval(mcd_workspace *ws, const mcd_liquid *liq,
                                double T, const double *x, double *out_lngamma,
                                double *out_Gamma, double *out_Dij,
                                unsigned *out_warn)
{
    mcdi_liq l;
    unsigned warn = 0;
    mcd_status st;
    size_t n;
    if ((st = MCDI_CHECK_PTRS3(ws, liq, x)) != MCD_OK)
        return st;
    n = liq->n;
    if ((st = mcdi_check_species(ws, n, 1, 0, "liq")) != MCD_OK ||
        (st = mcdi_check_positive(ws, T, "T")) != MCD_OK ||
        (st = mcdi_check_comp(ws, n, x, "x")) != MCD_OK ||
        (st = check_params(liq, out_Dij != NULL)) != MCD_OK)
        return st;
    mcdi_liq_scratch(ws, &l);
    mcdi_comp_scale_to_one(n, x, l.x);
    if (out_Dij != NULL)
        mcdi_liquid_log_dinf(liq, l.L);
    if ((st = state_core(liq, T, &l, out_Dij != NULL ? l.L : NULL, &warn,
                         "x")) != MCD_OK)
        return st;
    if (out_lngamma != NULL)
        memcpy(out_lngamma, l.lng, n * sizeof(double));
    if (out_Gamma != NULL)
        memcpy(out_Gamma, l.Gam, n * n * sizeof(double));
    if (out_Dij != NULL)
        memcpy(out_Dij, l.D, n * n * sizeof(double));
    if (out_warn != NULL)
        *out_warn = warn;
    return MCD_OK;
}
