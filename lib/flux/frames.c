/* frames.c - diffusion fluxes in other bases and reference frames, total
 * fluxes from a bootstrap condition, zero-sum projection.
 *
 * Notation: v_i species velocities, u = sum x_i v_i (molar average),
 * v = sum w_i v_i (mass average), v^V = sum c_i Vbar_i v_i (volume average).
 * J_i = c_i (v_i - u), j_i = rho_i (v_i - v), N_i = c_i v_i, n_i = M_i N_i.
 *
 * Every relation used here follows from these definitions in one line
 * (Taylor and Krishna, Multicomponent Mass Transfer, 1993, ch. 1, give the
 * same results as matrices between frames):
 *
 *  basis change (flux_convert), using v - u = (1/rho) sum_k M_k J_k:
 *    j_i = rho_i (v_i - u) - rho_i (v - u) = M_i J_i - w_i sum_k M_k J_k,
 *    J_i = c_i (v_i - v) - c_i (u - v)    = j_i/M_i - x_i sum_k j_k/M_k;
 *  volume frame, using sum_k c_k Vbar_k = 1:
 *    J^V_i = J_i + c_i (u - v^V) = J_i - c x_i sum_k Vbar_k J_k;
 *  frame of species k (x_k > 0): v_k - u = J_k / c_k, so
 *    J^k_i = J_i - x_i J_k / x_k;
 *  total fluxes: N_i = J_i + x_i N_t with N_t = c u (mass basis analogous),
 *    N_t fixed by the bootstrap:  TOTAL given; STAGNANT N_s = 0 ->
 *    N_t = -J_s / y_s; EQUIMOLAR N_t = 0; WEIGHTS sum nu_i N_i = 0 ->
 *    N_t = -sum nu_i J_i / sum nu_i y_i.
 *
 * No linear solve is needed anywhere here: every relation is explicit.
 * Conditioning: the basis change and the frame changes are rank-one updates
 * of the identity; their round-off is ~N eps relative to the largest
 * |M_i J_i|. The bootstrap divisions by y_s or sum nu_i y_i amplify the
 * diffusion fluxes by 1/y_s (a nearly absent stagnant species is a nearly
 * singular bootstrap): that is physics, not round-off, and is left to the
 * caller. A WEIGHTS bootstrap whose sum nu_i y_i is zero, or cancels to
 * round-off (|sum| <= 64 eps sum |nu_i y_i|), is reported as MCD_EDOM.
 *
 * All calls validate every input before they write anything. Finite
 * inputs can still produce an infinite result (e.g. fluxes near 1e308, or
 * M_i J_i overflowing): every call therefore runs its arithmetic twice,
 * first only checking that each result is finite (MCD_EDOM otherwise,
 * nothing written), then storing the bit-identical values. The outputs are
 * O(N n_dim), so the second pass costs little.
 */
#include <float.h>
#include <string.h>
#include "base/mcd_internal.h"
#include "base/composition.h"

static int basis_ok(mcd_basis b)
{
    return b == MCD_BASIS_MOLE || b == MCD_BASIS_MASS;
}

/* The two passes of every call: pass 0 only checks that v is finite (0
 * when not), pass 1 stores it. */
static int put(int pass, double v, double *dst)
{
    if (pass == 0)
        return mcdi_finite(v);
    *dst = v;
    return 1;
}

/* v not NULL and its len entries finite. */
static int all_finite(const double *v, size_t len)
{
    size_t i;
    if (v == NULL)
        return 0;
    for (i = 0; i < len; i++)
        if (!mcdi_finite(v[i]))
            return 0;
    return 1;
}

static int sizes_ok(size_t n, size_t n_dim)
{
    return n >= 1 && n <= MCD_MAX_SPECIES && n_dim >= 1 && n_dim <= MCD_MAX_DIM;
}

/* M, fractions and flux field: EINVAL checks on all of them first, then the
 * domain checks. */
static mcd_status check_M_x_F(size_t n, size_t n_dim, const double *M,
                              const double *x, const double *F, double *sx)
{
    mcd_status st;
    if (M != NULL) {
        for (size_t i = 0; i < n; i++)
            if (!mcdi_finite(M[i]))
                return MCD_EINVAL;
    }
    for (size_t i = 0; i < n; i++)
        if (!mcdi_finite(x[i]))
            return MCD_EINVAL;
    st = mcdi_comp_check_field(n, n_dim, F);
    if (st != MCD_OK)
        return st;
    if (M != NULL) {
        st = mcdi_comp_check_M(n, M);
        if (st != MCD_OK)
            return st;
    }
    return mcdi_comp_check(n, x, sx);
}

mcd_status mcdi_api_flux_convert(size_t n_species, size_t n_dim,
                                 const double *M, const double *x,
                                 mcd_basis from, const double *flux_in,
                                 mcd_basis to, double *out_flux)
{
    const size_t n = n_species;
    double sx, S;
    mcd_status st;
    size_t i, d;
    int pass;

    if (!sizes_ok(n, n_dim) || M == NULL || x == NULL || flux_in == NULL ||
        out_flux == NULL || !basis_ok(from) || !basis_ok(to))
        return MCD_EINVAL;
    st = check_M_x_F(n, n_dim, M, x, flux_in, &sx);
    if (st != MCD_OK)
        return st;

    if (from == to) {
        memcpy(out_flux, flux_in, n * n_dim * sizeof(double));
        return MCD_OK;
    }
    /* S = sum x_k M_k over the caller's x; w_i = x_i M_i / S. */
    S = 0.0;
    for (i = 0; i < n; i++)
        S += x[i] * M[i];
    if (!mcdi_finite(S) || !(S > 0.0))
        return MCD_EDOM;
    for (pass = 0; pass < 2; pass++)
        for (d = 0; d < n_dim; d++) {
            double t = 0.0, v;
            if (from == MCD_BASIS_MOLE) {
                /* j_i = M_i J_i - w_i sum_k M_k J_k */
                for (i = 0; i < n; i++)
                    t += M[i] * flux_in[i * n_dim + d];
                for (i = 0; i < n; i++) {
                    v = M[i] * flux_in[i * n_dim + d] - (x[i] * M[i] / S) * t;
                    if (!put(pass, v, &out_flux[i * n_dim + d]))
                        return MCD_EDOM;
                }
            } else {
                /* J_i = j_i/M_i - x_i sum_k j_k/M_k */
                for (i = 0; i < n; i++)
                    t += flux_in[i * n_dim + d] / M[i];
                for (i = 0; i < n; i++) {
                    v = flux_in[i * n_dim + d] / M[i] - (x[i] / sx) * t;
                    if (!put(pass, v, &out_flux[i * n_dim + d]))
                        return MCD_EDOM;
                }
            }
        }
    return MCD_OK;
}

mcd_status mcdi_api_flux_to_volume_frame(size_t n_species, size_t n_dim,
                                         double c, const double *x,
                                         const double *Vbar, const double *J,
                                         double *out_JV)
{
    const size_t n = n_species;
    double sx, sxv = 0.0;
    mcd_status st;
    size_t i, d;
    int pass;

    if (!sizes_ok(n, n_dim) || x == NULL || Vbar == NULL || J == NULL ||
        out_JV == NULL || !mcdi_finite(c))
        return MCD_EINVAL;
    /* Partial molar volumes may be negative (some solutes in liquids), so
     * only finiteness is required of each; the sum condition below. */
    for (i = 0; i < n; i++)
        if (!mcdi_finite(Vbar[i]))
            return MCD_EINVAL;
    st = check_M_x_F(n, n_dim, NULL, x, J, &sx);
    if (st != MCD_OK)
        return st;
    if (!(c > 0.0))
        return MCD_EDOM;
    for (i = 0; i < n; i++)
        sxv += (x[i] / sx) * Vbar[i];
    if (!(fabs(c * sxv - 1.0) <= 1e-6))
        return MCD_EDOM;
    for (pass = 0; pass < 2; pass++)
        for (d = 0; d < n_dim; d++) {
            double t = 0.0;
            for (i = 0; i < n; i++)
                t += Vbar[i] * J[i * n_dim + d];
            for (i = 0; i < n; i++) {
                double v = J[i * n_dim + d] - c * (x[i] / sx) * t;
                if (!put(pass, v, &out_JV[i * n_dim + d]))
                    return MCD_EDOM;
            }
        }
    return MCD_OK;
}

mcd_status mcdi_api_flux_to_species_frame(size_t n_species, size_t n_dim,
                                          const double *x, const double *J,
                                          size_t k, double *out_Jk)
{
    const size_t n = n_species;
    double sx;
    mcd_status st;
    size_t i, d;
    int pass;

    if (!sizes_ok(n, n_dim) || x == NULL || J == NULL || out_Jk == NULL ||
        k >= n)
        return MCD_EINVAL;
    st = check_M_x_F(n, n_dim, NULL, x, J, &sx);
    if (st != MCD_OK)
        return st;
    if (!(x[k] > 0.0))
        return MCD_EDOM;
    /* x_i / x_k is unaffected by renormalisation. */
    for (pass = 0; pass < 2; pass++)
        for (d = 0; d < n_dim; d++) {
            double r = J[k * n_dim + d] / x[k];
            for (i = 0; i < n; i++) {
                double v = (i == k) ? 0.0 : J[i * n_dim + d] - x[i] * r;
                /* J_k / x_k may overflow */
                if (!put(pass, v, &out_Jk[i * n_dim + d]))
                    return MCD_EDOM;
            }
        }
    return MCD_OK;
}

mcd_status mcdi_api_flux_total(size_t n_species, size_t n_dim, mcd_basis basis,
                               const double *comp, const double *diff,
                               mcd_bootstrap kind, size_t species,
                               const double *values, double *out_total,
                               double *out_bulk)
{
    const size_t n = n_species;
    double sy, bulk[MCD_MAX_DIM];
    mcd_status st;
    size_t i, d;

    if (!sizes_ok(n, n_dim) || comp == NULL || diff == NULL ||
        out_total == NULL || !basis_ok(basis))
        return MCD_EINVAL;
    switch (kind) {
    case MCD_BOOT_TOTAL:
        if (!all_finite(values, n_dim))
            return MCD_EINVAL;
        break;
    case MCD_BOOT_WEIGHTS:
        if (!all_finite(values, n))
            return MCD_EINVAL;
        break;
    case MCD_BOOT_STAGNANT:
        if (species >= n)
            return MCD_EINVAL;
        break;
    case MCD_BOOT_EQUIMOLAR: break;
    default: return MCD_EINVAL;
    }
    st = check_M_x_F(n, n_dim, NULL, comp, diff, &sy);
    if (st != MCD_OK)
        return st;

    switch (kind) {
    case MCD_BOOT_TOTAL:
        for (d = 0; d < n_dim; d++)
            bulk[d] = values[d];
        break;
    case MCD_BOOT_EQUIMOLAR:
        for (d = 0; d < n_dim; d++)
            bulk[d] = 0.0;
        break;
    case MCD_BOOT_STAGNANT: {
        double ys = comp[species] / sy;
        if (!(ys > 0.0))
            return MCD_EDOM;
        for (d = 0; d < n_dim; d++)
            bulk[d] = -diff[species * n_dim + d] / ys;
        break;
    }
    default: { /* MCD_BOOT_WEIGHTS */
        double s = 0.0, sabs = 0.0;
        for (i = 0; i < n; i++) {
            double t = values[i] * (comp[i] / sy);
            s += t;
            sabs += fabs(t);
        }
        if (!(fabs(s) > 64.0 * DBL_EPSILON * sabs))
            return MCD_EDOM;
        for (d = 0; d < n_dim; d++) {
            double t = 0.0;
            for (i = 0; i < n; i++)
                t += values[i] * diff[i * n_dim + d];
            bulk[d] = -t / s;
        }
        break;
    }
    }
    for (d = 0; d < n_dim; d++)
        if (!mcdi_finite(bulk[d]))
            return MCD_EDOM; /* overflow from a tiny y_s or sum nu y */

    for (i = 0; i < n; i++)
        for (d = 0; d < n_dim; d++)
            if (!mcdi_finite(diff[i * n_dim + d] + (comp[i] / sy) * bulk[d]))
                return MCD_EDOM; /* a total flux overflows */
    for (i = 0; i < n; i++)
        for (d = 0; d < n_dim; d++)
            out_total[i * n_dim + d] =
                diff[i * n_dim + d] + (comp[i] / sy) * bulk[d];
    if (out_bulk != NULL)
        for (d = 0; d < n_dim; d++)
            out_bulk[d] = bulk[d];
    return MCD_OK;
}

mcd_status mcdi_api_flux_velocity_difference(size_t n_species, size_t n_dim,
                                             const double *M, double c,
                                             const double *x, const double *J,
                                             double *out_v_minus_u)
{
    const size_t n = n_species;
    double sx, rho;
    mcd_status st;
    size_t i, d;
    int pass;

    if (!sizes_ok(n, n_dim) || M == NULL || x == NULL || J == NULL ||
        out_v_minus_u == NULL || !mcdi_finite(c))
        return MCD_EINVAL;
    st = check_M_x_F(n, n_dim, M, x, J, &sx);
    if (st != MCD_OK)
        return st;
    if (!(c > 0.0))
        return MCD_EDOM;
    rho = c * mcdi_comp_mbar_x(n, M, x);
    if (!(rho > 0.0) || !mcdi_finite(rho))
        return MCD_EDOM;
    for (pass = 0; pass < 2; pass++)
        for (d = 0; d < n_dim; d++) {
            double t = 0.0;
            for (i = 0; i < n; i++)
                t += M[i] * J[i * n_dim + d];
            if (!put(pass, t / rho, &out_v_minus_u[d]))
                return MCD_EDOM;
        }
    return MCD_OK;
}

/* Zero-sum projection F_i -= a_i sum_k F_k, sum a_i = 1. With a = x it
 * shifts every species velocity F_i / c_i by the same amount (a correction
 * velocity); with a_i = 1/N it is the orthogonal projection onto the
 * hyperplane sum F = 0. Applying it twice changes nothing beyond
 * round-off: sum_i (F_i - a_i r) = r - r = 0. */
mcd_status mcdi_api_flux_project(size_t n_species, size_t n_dim,
                                 const double *weights, double *inout_flux,
                                 double *out_residual)
{
    const size_t n = n_species;
    double sw = 0.0;
    mcd_status st;
    size_t i, d;
    int pass;

    if (!sizes_ok(n, n_dim) || inout_flux == NULL)
        return MCD_EINVAL;
    if (weights != NULL)
        for (i = 0; i < n; i++)
            if (!mcdi_finite(weights[i]))
                return MCD_EINVAL;
    st = mcdi_comp_check_field(n, n_dim, inout_flux);
    if (st != MCD_OK)
        return st;
    if (weights != NULL && mcdi_comp_nonneg_total(n, weights, &sw) != MCD_OK)
        return MCD_EDOM;
    /* pass 0: no sum or projected flux may overflow (nothing written);
     * pass 1: project (column d is read for r before it is changed, and
     * the columns are independent, so both passes see the same values) */
    for (pass = 0; pass < 2; pass++)
        for (d = 0; d < n_dim; d++) {
            double r = 0.0;
            for (i = 0; i < n; i++)
                r += inout_flux[i * n_dim + d];
            if (!mcdi_finite(r))
                return MCD_EDOM;
            for (i = 0; i < n; i++) {
                double a = weights != NULL ? weights[i] / sw : 1.0 / (double)n;
                double v = inout_flux[i * n_dim + d] - a * r;
                if (!put(pass, v, &inout_flux[i * n_dim + d]))
                    return MCD_EDOM;
            }
            if (pass == 1 && out_residual != NULL)
                out_residual[d] = r;
        }
    return MCD_OK;
}
