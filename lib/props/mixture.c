/* mixture.c - a set of N species picked from a database, each pair with its
 * own method (or a caller's measured value), and the N x N matrix of binary
 * diffusivities at a state.
 *
 * The mixture copies the species parameters (mcdi_spec) out of the
 * database, so it does not refer to it afterwards. For every pair it keeps
 * the state-independent coefficient of its method (see mcdi_pair_coef):
 *   FSG and USER:  D_ij = coef_ij T^1.75 / P
 *   CE and WL:     D_ij = coef_ij T^1.5 / (P Omega_D(T / eps_ij))
 *   Brokaw:        D_ij = coef_ij T^1.5 / (P (Omega_D(T*) + 0.19 delta_ij^2
 *                  / T*)),  T* = T / eps_ij
 * (Brokaw 1969, see binary.c: sigma, eps and delta_ij from the dipoles,
 * boiling points and boiling-point volumes). MCD_GAS_RECOMMENDED picks
 * one of these per pair once, when the pair is set (mcdi_pair_recommended,
 * the rule of the database pair); the pair keeps the method picked.
 * USER: coef = D_ref P_ref / T_ref^1.75, i.e. D = D_ref (T/T_ref)^1.75
 * (P_ref/P), the Fuller-Schettler-Giddings temperature law (Fuller et al.
 * 1966) and the 1/P law of dilute gases.
 *
 * mcd_mixture_binaries reads the mixture only (reentrant) and allocates
 * nothing; it validates everything and checks that every pair has data
 * before it writes any output.
 */
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

#include "base/mcd_internal.h"
#include "base/checks.h"
#include "props/binary.h"
#include "props/mixture.h"

#define M_PI_VAL 3.14159265358979323846

/* struct mcd_mixture is defined in mixture.h (the batched kernels read
 * it). */

MCD_API void mcd_mixture_free(mcd_mixture *mix)
{
    if (mix == NULL)
        return;
    free(mix->spec);
    free(mix->method);
    free(mix->pstat);
    free(mix->coef);
    free(mix->icoef);
    free(mix->eps);
    free(mix->delta);
    free(mix->M);
    free(mix->fit_deg);
    free(mix->fit_q);
    free(mix->user);
    free(mix);
}

/* ------------------------------------------------------------------ */
/* temperature fit of the collision integral (batched calls)           */
/* ------------------------------------------------------------------ */

/*
 * For a Chapman-Enskog, Wilke-Lee or Brokaw pair, D = coef T^1.5 / (P
 * Omega(T)); the only costly factor is Omega = Omega_D(T / eps) (three
 * exponentials and a power in the Neufeld-Janzen-Aziz form; Brokaw adds
 * 0.19 delta^2 eps / T, as smooth). Over a declared range [T_min, T_max]
 * it is a smooth function of u = (ln T - lmid) / lhalf in [-1, 1], so it
 * is interpolated at the K+1 Chebyshev nodes u_m = cos(pi (m + 1/2) /
 * (K+1)) (near-minimax; Rivlin 1974, ch. 1 - common practice):
 *     Omega(u) ~ sum_k a_k T_k(u),
 *     a_k = (2 / (K+1)) sum_m Omega(u_m) cos(pi k (m + 1/2) / (K+1)),
 * with a_0 halved. The batched kernel evaluates 1/D = (P / T^1.5)
 * sum_k (a_k / coef) T_k(u), a few multiply-adds per pair and cell. The
 * degree is raised (4, 6, ..., MCDI_FIT_MAXDEG) until the largest relative
 * error of D, |Omega / Omega_fit - 1| checked on 257 points uniform in u
 * (nodes excluded), is below 1e-12 or stops improving; the best degree is
 * kept and its error reported.
 */
#define FIT_TARGET 1e-12
#define FIT_GRID 257

/* The collision integral of pair ij at T: Omega_D(T*), with Brokaw's
 * polar term for a Brokaw pair (the same expression as binary_db.c). */
static double pair_omega(const mcd_mixture *mix, size_t ij, double T)
{
    double Ts = T / mix->eps[ij];
    if (mix->method[ij] == MCD_METHOD_BROKAW)
        return mcdi_brokaw_omega(Ts, mix->delta[ij]);
    return mcdi_omega_d(Ts);
}

/* Fit pair (i, j) if its method needs one; returns its max error. */
static double fit_pair(mcd_mixture *mix, size_t i, size_t j)
{
    size_t n = mix->n, ij = i * n + j, ji = j * n + i;
    mcd_method m = (mcd_method)mix->method[ij];
    double best_err = HUGE_VAL, coefs[MCDI_FIT_MAXDEG + 1];
    double best[MCDI_FIT_MAXDEG + 1];
    unsigned best_deg = 0;
    mix->fit_deg[ij] = mix->fit_deg[ji] = 0;
    if ((m != MCD_METHOD_CHAPMAN_ENSKOG && m != MCD_METHOD_WILKE_LEE &&
         m != MCD_METHOD_BROKAW) ||
        mix->pstat[ij] != MCD_OK || !(mix->eps[ij] > 0.0))
        return 0.0;
    for (unsigned K = 4; K <= MCDI_FIT_MAXDEG; K += 2) {
        double f[MCDI_FIT_MAXDEG + 1], err = 0.0;
        for (unsigned q = 0; q <= K; q++) {
            double u = cos(M_PI_VAL * (q + 0.5) / (K + 1));
            double T = exp(mix->fit_lmid + mix->fit_lhalf * u);
            f[q] = pair_omega(mix, ij, T);
        }
        for (unsigned k = 0; k <= K; k++) {
            double a = 0.0;
            for (unsigned q = 0; q <= K; q++)
                a += f[q] * cos(M_PI_VAL * k * (q + 0.5) / (K + 1));
            coefs[k] = a * 2.0 / (K + 1);
        }
        coefs[0] *= 0.5;
        for (unsigned g = 0; g < FIT_GRID; g++) {
            double u = -1.0 + 2.0 * g / (FIT_GRID - 1);
            double T = exp(mix->fit_lmid + mix->fit_lhalf * u);
            double ex = pair_omega(mix, ij, T);
            double t0 = 1.0, t1 = u, v = coefs[0] + coefs[1] * u, e;
            for (unsigned k = 2; k <= K; k++) {
                double t2 = 2.0 * u * t1 - t0;
                v += coefs[k] * t2;
                t0 = t1;
                t1 = t2;
            }
            e = fabs(ex / v - 1.0);
            if (!(e <= err))
                err = e; /* NaN propagates as a huge error */
        }
        if (err < best_err) {
            best_err = err;
            best_deg = K;
            memcpy(best, coefs, (K + 1) * sizeof(double));
        } else if (err > 0.5 * best_err) {
            break; /* stopped improving (round-off floor) */
        }
        if (best_err <= FIT_TARGET)
            break;
    }
    if (!(best_err < 1e-3)) /* unusable fit: keep the pair exact */
        return 0.0;
    for (unsigned k = 0; k <= best_deg; k++) {
        double q = best[k] * mix->icoef[ij];
        mix->fit_q[ij * (MCDI_FIT_MAXDEG + 1) + k] = q;
        mix->fit_q[ji * (MCDI_FIT_MAXDEG + 1) + k] = q;
    }
    mix->fit_deg[ij] = mix->fit_deg[ji] = (unsigned char)best_deg;
    return best_err;
}

static void fit_all(mcd_mixture *mix)
{
    double err = 0.0;
    for (size_t i = 0; i < mix->n; i++)
        for (size_t j = i + 1; j < mix->n; j++) {
            double e = fit_pair(mix, i, j);
            if (e > err)
                err = e;
        }
    mix->fit_err = err;
}

mcd_status mcdi_api_mixture_set_temperature_fit(mcd_mixture *mix, double T_min,
                                                double T_max,
                                                double *out_max_rel_err)
{
    size_t n;
    if (mix == NULL)
        return MCD_EINVAL;
    if (!mcdi_finite(T_min) || !mcdi_finite(T_max))
        return MCD_EINVAL;
    if (T_min == 0.0 && T_max == 0.0) {
        mix->fit_on = 0;
        mix->fit_Tmin = mix->fit_Tmax = mix->fit_err = 0.0;
        if (out_max_rel_err != NULL)
            *out_max_rel_err = 0.0;
        return MCD_OK;
    }
    if (!(T_min > 0.0) || !(T_max > T_min))
        return MCD_EDOM;
    n = mix->n;
    if (mix->fit_deg == NULL) {
        mix->fit_deg = calloc(n * n, 1);
        mix->fit_q = calloc(n * n * (MCDI_FIT_MAXDEG + 1), sizeof(double));
        if (mix->fit_deg == NULL || mix->fit_q == NULL) {
            free(mix->fit_deg);
            free(mix->fit_q);
            mix->fit_deg = NULL;
            mix->fit_q = NULL;
            return MCD_ENOMEM;
        }
    }
    mix->fit_Tmin = T_min;
    mix->fit_Tmax = T_max;
    mix->fit_lmid = 0.5 * (log(T_max) + log(T_min));
    mix->fit_lhalf = 0.5 * (log(T_max) - log(T_min));
    mix->fit_on = 1;
    fit_all(mix);
    if (out_max_rel_err != NULL)
        *out_max_rel_err = mix->fit_err;
    return MCD_OK;
}

mcd_status mcdi_api_mixture_temperature_fit(const mcd_mixture *mix,
                                            double *out_T_min,
                                            double *out_T_max,
                                            double *out_max_rel_err)
{
    if (mix == NULL)
        return MCD_EINVAL;
    if (out_T_min != NULL)
        *out_T_min = mix->fit_on ? mix->fit_Tmin : 0.0;
    if (out_T_max != NULL)
        *out_T_max = mix->fit_on ? mix->fit_Tmax : 0.0;
    if (out_max_rel_err != NULL)
        *out_max_rel_err = mix->fit_on ? mix->fit_err : 0.0;
    return MCD_OK;
}

/* Recompute the coefficient of pair (i, j) and (j, i) from its method. */
static void update_pair(mcd_mixture *mix, size_t i, size_t j)
{
    size_t n = mix->n, ij = i * n + j, ji = j * n + i;
    mcd_method m = (mcd_method)mix->method[ij];
    double coef = 0.0, eps = 0.0, delta = 0.0;
    mcd_status st = MCD_OK;
    if (m == MCD_METHOD_USER) {
        const double *u = mix->user + 3 * ij;
        coef = u[0] * u[2] / pow(u[1], 1.75);
    } else {
        int est;
        st = mcdi_pair_coef(&mix->spec[i], &mix->spec[j], m, &coef, &eps,
                            &delta, &est);
        if (st != MCD_OK) {
            coef = 0.0;
            eps = 0.0;
            delta = 0.0;
            mcdi_err_clear(); /* kept in pstat; mcdi_mixture_ready names it */
        }
    }
    mix->coef[ij] = mix->coef[ji] = coef;
    mix->icoef[ij] = mix->icoef[ji] = coef > 0.0 ? 1.0 / coef : 0.0;
    mix->eps[ij] = mix->eps[ji] = eps;
    mix->delta[ij] = mix->delta[ji] = delta;
    mix->pstat[ij] = mix->pstat[ji] = (unsigned char)st;
    mix->method[ji] = mix->method[ij];
    if (mix->fit_on) {
        /* the reported error stays a bound: it never decreases here */
        double e = fit_pair(mix, i, j);
        if (e > mix->fit_err)
            mix->fit_err = e;
    }
}

static int is_gas_method(mcd_gas_method g)
{
    return g == MCD_GAS_FSG || g == MCD_GAS_CHAPMAN_ENSKOG ||
           g == MCD_GAS_WILKE_LEE || g == MCD_GAS_BROKAW ||
           g == MCD_GAS_RECOMMENDED;
}

/* Set pair (i, j) to gas method g (MCD_GAS_RECOMMENDED: the method the
 * rule picks for this pair) and recompute its coefficients. */
static void set_pair(mcd_mixture *mix, size_t i, size_t j, mcd_gas_method g)
{
    mcd_method m = g == MCD_GAS_RECOMMENDED
                       ? mcdi_pair_recommended(&mix->spec[i], &mix->spec[j])
                       : (mcd_method)g;
    mix->method[i * mix->n + j] = (unsigned char)m;
    update_pair(mix, i, j);
}

mcd_status mcdi_api_mixture_new(const mcd_db *db, size_t n,
                                const char *const *names,
                                mcd_gas_method default_gas,
                                mcd_mixture **out_mix)
{
    mcd_mixture *mix = NULL;
    size_t *idx = NULL;
    mcd_status st = MCD_OK;
    if (db == NULL || names == NULL || out_mix == NULL) {
        mcdi_note("NULL argument");
        return MCD_EINVAL;
    }
    if (n < 1 || n > MCD_MAX_SPECIES) {
        mcdi_note("number of species %zu not in 1..%d", n, MCD_MAX_SPECIES);
        return MCD_EINVAL;
    }
    if (!is_gas_method(default_gas)) {
        mcdi_note("argument default_method: %d is not a gas method (fsg, "
                  "chapman-enskog, wilke-lee, brokaw or recommended)",
                  (int)default_gas);
        return MCD_EINVAL;
    }
    mix = calloc(1, sizeof *mix);
    idx = calloc(n, sizeof *idx);
    if (mix == NULL || idx == NULL) {
        st = MCD_ENOMEM;
        goto fail;
    }
    mix->n = n;
    mix->spec = calloc(n, sizeof *mix->spec);
    mix->method = calloc(n * n, 1);
    mix->pstat = calloc(n * n, 1);
    mix->coef = calloc(n * n, sizeof(double));
    mix->icoef = calloc(n * n, sizeof(double));
    mix->eps = calloc(n * n, sizeof(double));
    mix->delta = calloc(n * n, sizeof(double));
    mix->user = calloc(3 * n * n, sizeof(double));
    mix->M = calloc(n, sizeof(double));
    if (!mix->spec || !mix->method || !mix->pstat || !mix->coef || !mix->eps ||
        !mix->delta || !mix->user || !mix->icoef || !mix->M) {
        st = MCD_ENOMEM;
        goto fail;
    }
    for (size_t i = 0; i < n; i++) {
        if (names[i] == NULL) {
            mcdi_note("species name %zu is NULL", i);
            st = MCD_EINVAL;
            goto fail;
        }
        st = mcdi_api_db_find(db, names[i], &idx[i]);
        if (st != MCD_OK) {
            mcdi_note("unknown species '%s' (name %zu of the mixture)",
                      names[i], i);
            if (st != MCD_EINVAL)
                st = MCD_ENOTFOUND;
            goto fail;
        }
        for (size_t k = 0; k < i; k++) {
            if (idx[k] == idx[i]) {
                mcdi_note("species '%s' (name %zu) is the same as name %zu",
                          names[i], i, k);
                st = MCD_EINVAL;
                goto fail;
            }
        }
        st = mcdi_spec_from_db(db, idx[i], &mix->spec[i]);
        if (st != MCD_OK) {
            mcdi_note("species '%s' could not be read", names[i]);
            goto fail;
        }
    }
    mix->M_ok = 1;
    for (size_t i = 0; i < n; i++) {
        if ((mix->spec[i].known >> MCD_PARAM_MOLAR_MASS) & 1u)
            mix->M[i] = mix->spec[i].p[MCD_PARAM_MOLAR_MASS];
        else
            mix->M_ok = 0;
    }
    for (size_t i = 0; i < n; i++) {
        for (size_t j = i + 1; j < n; j++)
            set_pair(mix, i, j, default_gas);
    }
    free(idx);
    *out_mix = mix;
    return MCD_OK;
fail:
    if (st == MCD_ENOMEM)
        mcdi_note("out of memory");
    free(idx);
    mcd_mixture_free(mix);
    return st;
}

MCD_API size_t mcd_mixture_species_count(const mcd_mixture *mix)
{
    return mix == NULL ? 0 : mix->n;
}

MCD_API const char *mcd_mixture_name(const mcd_mixture *mix, size_t i)
{
    if (mix == NULL || i >= mix->n)
        return NULL;
    return mix->spec[i].name;
}

mcd_status mcdi_api_mixture_molar_masses(const mcd_mixture *mix, double *out_M)
{
    if (mix == NULL || out_M == NULL)
        return MCD_EINVAL;
    for (size_t i = 0; i < mix->n; i++)
        if (!((mix->spec[i].known >> MCD_PARAM_MOLAR_MASS) & 1u))
            return mcdi_fail(MCD_ENODATA, "species %zu '%s' has no molar mass",
                             i, mix->spec[i].name);
    for (size_t i = 0; i < mix->n; i++)
        out_M[i] = mix->spec[i].p[MCD_PARAM_MOLAR_MASS];
    return MCD_OK;
}

mcd_status mcdi_api_mixture_set_method(mcd_mixture *mix, size_t i, size_t j,
                                       mcd_gas_method gas)
{
    if (mix == NULL)
        return MCD_EINVAL;
    if (i >= mix->n || j >= mix->n)
        return MCD_EBADLEN;
    if (i == j)
        return mcdi_fail(MCD_EINVAL,
                         "arguments i, j: both %zu (a pair "
                         "needs two species)",
                         i);
    if (!is_gas_method(gas))
        return mcdi_fail(MCD_EINVAL,
                         "argument m: %d is not a gas method (fsg, "
                         "chapman-enskog, wilke-lee, brokaw or recommended)",
                         (int)gas);
    set_pair(mix, i, j, gas);
    return MCD_OK;
}

mcd_status mcdi_api_mixture_pair_method(const mcd_mixture *mix, size_t i,
                                        size_t j, mcd_method *out_method)
{
    mcd_status st;
    if ((st = MCDI_CHECK_PTRS2(mix, out_method)) != MCD_OK)
        return st;
    if (i >= mix->n || j >= mix->n)
        return mcdi_fail(MCD_EBADLEN,
                         "argument %s: %zu is not a species index of the "
                         "mixture (%zu species)",
                         i >= mix->n ? "i" : "j", i >= mix->n ? i : j, mix->n);
    if (i == j)
        return mcdi_fail(MCD_EINVAL,
                         "arguments i, j: both %zu (a pair "
                         "needs two species)",
                         i);
    *out_method = (mcd_method)mix->method[i * mix->n + j];
    return MCD_OK;
}

mcd_status mcdi_api_mixture_set_binary(mcd_mixture *mix, size_t i, size_t j,
                                       double D, double T_ref, double P_ref)
{
    size_t n;
    if (mix == NULL)
        return MCD_EINVAL;
    if (!mcdi_finite(D) || !mcdi_finite(T_ref) || !mcdi_finite(P_ref))
        return MCD_EINVAL;
    if (!(D > 0) || !(T_ref > 0) || !(P_ref > 0))
        return MCD_EDOM;
    n = mix->n;
    if (i >= n || j >= n)
        return MCD_EBADLEN;
    if (i == j)
        return MCD_EINVAL;
    for (int k = 0; k < 2; k++) {
        double *u = mix->user + 3 * (k == 0 ? i * n + j : j * n + i);
        u[0] = D;
        u[1] = T_ref;
        u[2] = P_ref;
    }
    mix->method[i * n + j] = (unsigned char)MCD_METHOD_USER;
    update_pair(mix, i, j);
    return MCD_OK;
}

/* The status of pair (i, j) whose estimate failed, with a detail naming
 * the pair and what its method lacks (recomputed: only failures pay). */
static mcd_status pair_failure(const mcd_mixture *mix, size_t i, size_t j)
{
    mcd_method m = (mcd_method)mix->method[i * mix->n + j];
    double coef, eps, delta;
    int est;
    char why[MCDI_ERRLEN];
    mcd_status st = mcdi_pair_coef(&mix->spec[i], &mix->spec[j], m, &coef, &eps,
                                   &delta, &est);
    if (st == MCD_OK) /* cannot happen: pstat is the same computation */
        st = (mcd_status)mix->pstat[i * mix->n + j];
    snprintf(why, sizeof why, "%s", mcdi_err_text());
    return mcdi_fail(st, "pair (%zu, %zu) %s-%s by %s: %s", i, j,
                     mix->spec[i].name, mix->spec[j].name, mcd_method_name(m),
                     why);
}

mcd_status mcdi_mixture_ready(const mcd_mixture *mix)
{
    if (mix == NULL)
        return MCD_EINVAL;
    for (size_t k = 0; k < mix->n * mix->n; k++)
        if (mix->pstat[k] != MCD_OK)
            return pair_failure(mix, k / mix->n, k % mix->n);
    return MCD_OK;
}

void mcdi_mixture_binaries_fast(const mcd_mixture *mix, double T, double P,
                                double *out_D)
{
    size_t n = mix->n;
    double t175 = pow(T, 1.75), t15 = pow(T, 1.5);
    for (size_t i = 0; i < n; i++) {
        out_D[i * n + i] = 0.0;
        for (size_t j = i + 1; j < n; j++) {
            size_t ij = i * n + j;
            double D;
            mcd_method m = (mcd_method)mix->method[ij];
            if (m == MCD_METHOD_FSG || m == MCD_METHOD_USER)
                D = mix->coef[ij] * t175 / P;
            else
                D = mix->coef[ij] * t15 / (P * pair_omega(mix, ij, T));
            out_D[ij] = D;
            out_D[j * n + i] = D;
        }
    }
}

/* Warning bits of a user value used at (T, P). */
static unsigned user_warnings(const double *u, double T, double P)
{
    unsigned w = 0;
    double rt = T / u[1], rp = P / u[2];
    if (rt > 2.0 || rt < 0.5 || rp > 10.0 || rp < 0.1)
        w |= MCD_WARN_SCALED;
    if (P > MCDI_HIGH_P)
        w |= MCD_WARN_HIGH_PRESSURE;
    return w;
}

mcd_status mcdi_api_mixture_binaries(const mcd_mixture *mix, double T, double P,
                                     double *out_D, double *out_rel_err,
                                     unsigned *out_warn)
{
    size_t n;
    mcd_status st;
    if ((st = MCDI_CHECK_PTRS2(mix, out_D)) != MCD_OK ||
        (st = mcdi_check_positive2(T, "T", P, "P")) != MCD_OK)
        return st;
    if ((st = mcdi_mixture_ready(mix)) != MCD_OK)
        return st;
    n = mix->n;
    for (size_t i = 0; i < n; i++) {
        out_D[i * n + i] = 0.0;
        if (out_rel_err != NULL)
            out_rel_err[i * n + i] = 0.0;
        if (out_warn != NULL)
            out_warn[i * n + i] = 0u;
        for (size_t j = i + 1; j < n; j++) {
            size_t ij = i * n + j, ji = j * n + i;
            mcd_method m = (mcd_method)mix->method[ij];
            double D, rel;
            unsigned w;
            if (m == MCD_METHOD_USER) {
                const double *u = mix->user + 3 * ij;
                D = u[0] * pow(T / u[1], 1.75) * (u[2] / P);
                rel = mcd_method_typical_error(MCD_METHOD_USER);
                w = user_warnings(u, T, P);
            } else {
                /* Cannot fail: state and pair data were checked above. */
                st = mcdi_pair_gas(&mix->spec[i], &mix->spec[j], m, T, P, &D,
                                   &rel, &w);
                if (st != MCD_OK)
                    return MCD_EINTERNAL;
            }
            out_D[ij] = out_D[ji] = D;
            if (out_rel_err != NULL)
                out_rel_err[ij] = out_rel_err[ji] = rel;
            if (out_warn != NULL)
                out_warn[ij] = out_warn[ji] = w;
        }
    }
    return MCD_OK;
}
