/* diagnose.c - flag the coupling effects of multicomponent diffusion.
 *
 * In a binary mixture a species always diffuses down its own gradient. In a
 * mixture of three or more species the cross terms of the Maxwell-Stefan
 * equations can make a species move
 *   - up its own gradient (reverse diffusion, MCD_DIAG_REVERSE),
 *   - with no gradient of its own (osmotic diffusion, MCD_DIAG_OSMOTIC),
 *   - not at all despite a gradient (diffusion barrier, MCD_DIAG_BARRIER),
 * the three effects described by Toor (1957, AIChE J. 3, 197; from memory)
 * and seen for nitrogen in the Duncan and Toor (1962) H2/N2/CO2 two-bulb
 * experiment.
 *
 * Per species i, with g_i = grad_i and F_i = flux_i (vectors over the n_dim
 * directions) and Euclidean norms |.|:
 *   G = max_k |g_k|,  F = max_k |F_k|,
 *   g_i "nearly zero"  <=>  |g_i| <= rel_tol * G,
 *   F_i "nearly zero"  <=>  |F_i| <= rel_tol * F,
 *   REVERSE  <=>  F_i . g_i > 0 and neither g_i nor F_i is nearly zero,
 *   OSMOTIC  <=>  g_i nearly zero and F_i not,
 *   BARRIER  <=>  F_i nearly zero and g_i not.
 * The three flags are mutually exclusive.
 * Degenerate inputs follow from the same definitions: when every gradient
 * is zero (G = 0) every g_i is nearly zero, so every species with a
 * non-negligible flux is OSMOTIC and none is REVERSE or BARRIER; when every
 * flux is zero (F = 0) every species with a non-negligible gradient is
 * BARRIER; when both are zero no flag is set.
 *
 * Norms and dot products are computed on vectors scaled by their largest
 * component, so no finite input overflows. No linear algebra is needed.
 */
#include "base/mcd_internal.h"

/* Euclidean norm of v[0..m-1] with stride 1, overflow-safe. */
static double norm_scaled(const double *v, size_t m)
{
    double a = 0.0, s = 0.0;
    size_t d;
    for (d = 0; d < m; d++)
        if (fabs(v[d]) > a)
            a = fabs(v[d]);
    if (a == 0.0)
        return 0.0;
    for (d = 0; d < m; d++) {
        double t = v[d] / a;
        s += t * t;
    }
    return a * sqrt(s);
}

/* Sign-correct dot product of two vectors, each scaled by its own largest
 * component (only the sign is used). */
static double dot_scaled(const double *u, const double *v, size_t m)
{
    double au = 0.0, av = 0.0, s = 0.0;
    size_t d;
    for (d = 0; d < m; d++) {
        if (fabs(u[d]) > au)
            au = fabs(u[d]);
        if (fabs(v[d]) > av)
            av = fabs(v[d]);
    }
    if (au == 0.0 || av == 0.0)
        return 0.0;
    for (d = 0; d < m; d++)
        s += (u[d] / au) * (v[d] / av);
    return s;
}

mcd_status mcdi_api_flux_diagnose(size_t n_species, size_t n_dim,
                                  const double *grad, const double *flux,
                                  double rel_tol, unsigned *out_flags)
{
    const size_t n = n_species;
    double gmax = 0.0, fmax = 0.0;
    size_t i;

    if (n < 1 || n > MCD_MAX_SPECIES || n_dim < 1 || n_dim > MCD_MAX_DIM ||
        grad == NULL || flux == NULL || out_flags == NULL ||
        !(rel_tol > 0.0 && rel_tol < 1.0))
        return MCD_EINVAL;
    for (i = 0; i < n * n_dim; i++)
        if (!mcdi_finite(grad[i]) || !mcdi_finite(flux[i]))
            return MCD_EINVAL;

    for (i = 0; i < n; i++) {
        double g = norm_scaled(grad + i * n_dim, n_dim);
        double f = norm_scaled(flux + i * n_dim, n_dim);
        if (g > gmax)
            gmax = g;
        if (f > fmax)
            fmax = f;
    }
    for (i = 0; i < n; i++) {
        double g = norm_scaled(grad + i * n_dim, n_dim);
        double f = norm_scaled(flux + i * n_dim, n_dim);
        int g_small = g <= rel_tol * gmax;
        int f_small = f <= rel_tol * fmax;
        unsigned flags = 0u;
        if (g_small && !f_small)
            flags |= MCD_DIAG_OSMOTIC;
        else if (f_small && !g_small)
            flags |= MCD_DIAG_BARRIER;
        else if (!g_small && !f_small &&
                 dot_scaled(flux + i * n_dim, grad + i * n_dim, n_dim) > 0.0)
            flags |= MCD_DIAG_REVERSE;
        out_flags[i] = flags;
    }
    return MCD_OK;
}
