/* liquid.c - the liquid object: species, activity model, pair and species
 * parameters, infinite-dilution diffusivities. Construction allocates;
 * the setters check their arguments and write nothing on failure.
 * Evaluation is in liq_eval.c, the models in activity.c. */
#include <float.h>
#include <stdlib.h>
#include <string.h>

#include "base/mcd_internal.h"
#include "liquid/liquid.h"

MCD_API void mcd_liquid_free(mcd_liquid *liq)
{
    if (liq == NULL)
        return;
    free(liq->sp);
    free(liq->coef);
    free(liq->alpha);
    free(liq->trange);
    free(liq->pset);
    free(liq->dinf);
    free(liq->ant);
    free(liq);
}

mcd_status mcdi_api_liquid_new(size_t n, mcd_activity_model model,
                               mcd_liquid **out_liq)
{
    mcd_liquid *liq;
    if (out_liq == NULL)
        return mcdi_fail(MCD_EINVAL, "argument out_liq: NULL");
    if (n < 1 || n > MCD_MAX_SPECIES)
        return mcdi_fail(MCD_EINVAL, "argument n_species: %zu is not in 1..%d",
                         n, MCD_MAX_SPECIES);
    if (model != MCD_ACTIVITY_IDEAL && model != MCD_ACTIVITY_NRTL &&
        model != MCD_ACTIVITY_WILSON && model != MCD_ACTIVITY_UNIQUAC)
        return mcdi_fail(MCD_EINVAL, "argument model: %d is not a model",
                         (int)model);
    liq = calloc(1, sizeof *liq);
    if (liq == NULL)
        return MCD_ENOMEM;
    liq->n = n;
    liq->model = model;
    liq->sp = malloc(n * MCDI_LIQ_NSP * sizeof(double));
    liq->coef = calloc(3 * n * n, sizeof(double));
    liq->alpha = calloc(n * n, sizeof(double));
    liq->trange = calloc(2 * n * n, sizeof(double));
    liq->pset = calloc(n * n, 1);
    liq->dinf = calloc(n * n, sizeof(double));
    liq->ant = malloc(5 * n * sizeof(double));
    if (!liq->sp || !liq->coef || !liq->alpha || !liq->trange || !liq->pset ||
        !liq->dinf || !liq->ant) {
        mcd_liquid_free(liq);
        return MCD_ENOMEM;
    }
    for (size_t k = 0; k < n * MCDI_LIQ_NSP; k++)
        liq->sp[k] = (double)NAN;
    for (size_t k = 0; k < 5 * n; k++)
        liq->ant[k] = (double)NAN;
    *out_liq = liq;
    return MCD_OK;
}

/* liq not NULL, i (and j when two) in range, i != j. */
static mcd_status check_pair(const mcd_liquid *liq, size_t i, size_t j)
{
    if (liq == NULL)
        return mcdi_fail(MCD_EINVAL, "argument liq: NULL");
    if (i >= liq->n || j >= liq->n)
        return mcdi_fail(MCD_EINVAL, "pair (%zu, %zu): index not below %zu", i,
                         j, liq->n);
    if (i == j)
        return mcdi_fail(MCD_EINVAL, "pair (%zu, %zu): i == j", i, j);
    return MCD_OK;
}

mcd_status mcdi_api_liquid_set_species(mcd_liquid *liq, size_t i,
                                       mcd_liquid_param p, double value)
{
    if (liq == NULL)
        return mcdi_fail(MCD_EINVAL, "argument liq: NULL");
    if (i >= liq->n)
        return mcdi_fail(MCD_EINVAL, "argument i: %zu is not below %zu", i,
                         liq->n);
    if ((int)p < 0 || (int)p >= MCDI_LIQ_NSP)
        return mcdi_fail(MCD_EINVAL, "argument p: %d is not a parameter",
                         (int)p);
    if (!mcdi_finite(value))
        return mcdi_fail(MCD_EINVAL, "argument value: %g is not finite", value);
    if (!(value > 0))
        return mcdi_fail(MCD_EDOM, "argument value: %g is not > 0", value);
    liq->sp[i * MCDI_LIQ_NSP + (size_t)p] = value;
    return MCD_OK;
}

mcd_status mcdi_api_liquid_set_pair(mcd_liquid *liq, size_t i, size_t j,
                                    const double *coef_ij,
                                    const double *coef_ji, double alpha,
                                    double T_min, double T_max)
{
    mcd_status st;
    size_t n, k;
    if ((st = check_pair(liq, i, j)) != MCD_OK)
        return st;
    if (coef_ij == NULL || coef_ji == NULL)
        return mcdi_fail(MCD_EINVAL, "argument %s: NULL",
                         coef_ij == NULL ? "coef_ij" : "coef_ji");
    for (k = 0; k < 3; k++)
        if (!mcdi_finite(coef_ij[k]) || !mcdi_finite(coef_ji[k]))
            return mcdi_fail(MCD_EINVAL, "argument %s: entry %zu is not finite",
                             mcdi_finite(coef_ij[k]) ? "coef_ji" : "coef_ij",
                             k);
    if (!mcdi_finite(alpha) || !mcdi_finite(T_min) || !mcdi_finite(T_max))
        return mcdi_fail(MCD_EINVAL, "argument %s: not finite",
                         !mcdi_finite(alpha)   ? "alpha"
                         : !mcdi_finite(T_min) ? "T_min"
                                               : "T_max");
    if (liq->model == MCD_ACTIVITY_NRTL && !(alpha >= -1.0 && alpha <= 1.0))
        return mcdi_fail(MCD_EDOM, "argument alpha: %g is not in [-1, 1]",
                         alpha);
    if (!(T_min == 0.0 && T_max == 0.0) && !(T_min > 0 && T_max > T_min))
        return mcdi_fail(MCD_EDOM,
                         "arguments T_min, T_max: [%g, %g] is not a range "
                         "0 < T_min < T_max (or both 0)",
                         T_min, T_max);
    n = liq->n;
    for (k = 0; k < 3; k++) {
        liq->coef[3 * (i * n + j) + k] = coef_ij[k];
        liq->coef[3 * (j * n + i) + k] = coef_ji[k];
    }
    liq->alpha[i * n + j] = liq->alpha[j * n + i] =
        liq->model == MCD_ACTIVITY_NRTL ? alpha : 0.0;
    liq->trange[2 * (i * n + j)] = liq->trange[2 * (j * n + i)] = T_min;
    liq->trange[2 * (i * n + j) + 1] = liq->trange[2 * (j * n + i) + 1] = T_max;
    liq->pset[i * n + j] = liq->pset[j * n + i] = 1;
    return MCD_OK;
}

mcd_status mcdi_api_liquid_set_dinf(mcd_liquid *liq, size_t i, size_t j,
                                    double D_i_in_j, double D_j_in_i)
{
    mcd_status st;
    if ((st = check_pair(liq, i, j)) != MCD_OK)
        return st;
    if (!mcdi_finite(D_i_in_j) || !mcdi_finite(D_j_in_i))
        return mcdi_fail(MCD_EINVAL, "argument %s: not finite",
                         mcdi_finite(D_i_in_j) ? "D_j_in_i" : "D_i_in_j");
    if (!(D_i_in_j >= DBL_MIN) || !(D_j_in_i >= DBL_MIN))
        return mcdi_fail(MCD_EDOM,
                         "argument %s: %g is not a positive normal "
                         "number",
                         D_i_in_j >= DBL_MIN ? "D_j_in_i" : "D_i_in_j",
                         D_i_in_j >= DBL_MIN ? D_j_in_i : D_i_in_j);
    liq->dinf[i * liq->n + j] = D_i_in_j;
    liq->dinf[j * liq->n + i] = D_j_in_i;
    return MCD_OK;
}

/*
 * Antoine's equation, log10(P^sat / Pa) = A - B / (T / K + C) (Antoine
 * 1888; the usual three-constant form). Constants published for mmHg and
 * degrees Celsius convert as A_Pa = A + log10(133.322368), C_K = C -
 * 273.15; for bar and K, A_Pa = A + 5. The correlation holds only over the
 * range it was fitted on: outside [T_min, T_max] the evaluation warns.
 */
mcd_status mcdi_api_liquid_set_antoine(mcd_liquid *liq, size_t i, double A,
                                       double B, double C, double T_min,
                                       double T_max)
{
    const double v[5] = {A, B, C, T_min, T_max};
    static const char *const nm[5] = {"A", "B", "C", "T_min", "T_max"};
    if (liq == NULL)
        return mcdi_fail(MCD_EINVAL, "argument liq: NULL");
    if (i >= liq->n)
        return mcdi_fail(MCD_EINVAL, "argument i: %zu is not below %zu", i,
                         liq->n);
    for (size_t k = 0; k < 5; k++)
        if (!mcdi_finite(v[k]))
            return mcdi_fail(MCD_EINVAL, "argument %s: not finite", nm[k]);
    if (!(B > 0))
        return mcdi_fail(MCD_EDOM, "argument B: %g is not > 0", B);
    if (!(T_min > 0 && T_max > T_min && T_min + C > 0))
        return mcdi_fail(MCD_EDOM,
                         "arguments T_min, T_max: [%g, %g] is not a range "
                         "0 < T_min < T_max with T_min + C > 0",
                         T_min, T_max);
    memcpy(liq->ant + 5 * i, v, sizeof v);
    return MCD_OK;
}
