/* mixavg.c - mixture-averaged (Hirschfelder-Curtiss / Blanc) diffusion
 * fluxes, used by mcd_flux_compute with MCD_MODEL_MIXTURE_AVERAGED.
 *
 * Effective diffusivity of species i in the mixture (Hirschfelder, Curtiss
 * and Bird 1954; the form of Blanc's law for a species in a mixture):
 *     D_im = (1 - x_i) / sum_{j != i} x_j / Đ_ij.
 * 1 - x_i is evaluated as sum_{j != i} x_j (no cancellation near x_i = 1).
 * For a trace species (x_i = 0) this is exactly Blanc's law
 * 1 / D_im = sum_j x_j / Đ_ij, the same value as the exact Maxwell-Stefan
 * solution gives for that species.
 * Pure species i (x_i = 1, all others 0): numerator and denominator vanish
 * and the limit depends on the direction of approach. We define it as the
 * equal-weight harmonic mean D_im = (N - 1) / sum_{j != i} 1 / Đ_ij, i.e.
 * the limit along x_j = (1 - x_i)/(N - 1). It only matters through the
 * correction flux (the pure species' flux is minus the sum of the others).
 *
 * Mole basis (molar-average frame):
 *     J*_i = -c D_im d_i,   J_i = J*_i - x_i sum_k J*_k,
 * with d_i the driving force (grad x_i for an ideal mixture without
 * pressure diffusion). The correction velocity sum_k J*_k / c restores the
 * zero-sum; trace species are not affected by it.
 *
 * Mass basis (mass-average frame), Hirschfelder-Curtiss form:
 *     j*_i = -rho (M_i / Mbar) D_im d_i = M_i J*_i,
 *     j_i  = j*_i - w_i sum_k j*_k.
 * Substituting J_i above into the basis change j_i = M_i J_i -
 * w_i sum_k M_k J_k gives exactly the same j_i (the x_i-correction terms
 * cancel because w_i Mbar = x_i M_i), so mcd_flux_compute obtains the mass
 * basis by converting the molar fluxes; the two routes agree identically.
 *
 * When all Đ_ij are equal to Đ, D_im = Đ, sum_k J*_k = -c Đ sum_k d_k = 0
 * and J_i = -c Đ d_i: the exact Maxwell-Stefan solution.
 * Cost O(N^2) (one division per pair) + O(N n_dim); no linear solve.
 */
#include "base/mcd_internal.h"
#include "flux/flux_core.h"
#include "base/lanes.h"

static inline double dij_pair(const double *Dij, size_t n, size_t i, size_t j)
{
    return i < j ? Dij[i * n + j] : Dij[j * n + i];
}

double mcdi_mixavg_dim(size_t n, size_t i, const double *x, const double *Dij)
{
    double num = 0.0, den = 0.0;
    size_t j;
    if (n < 2)
        return 0.0;
    for (j = 0; j < n; j++) {
        if (j == i)
            continue;
        num += x[j];
        den += x[j] / dij_pair(Dij, n, i, j);
    }
    if (den > 0.0)
        return num / den;
    /* pure species: equal-weight harmonic mean (documented limit) */
    den = 0.0;
    for (j = 0; j < n; j++)
        if (j != i)
            den += 1.0 / dij_pair(Dij, n, i, j);
    return (double)(n - 1) / den;
}

void mcdi_mixavg_fluxes(size_t n, size_t nd, const double *x, const double *d,
                        const double *Dij, double c, double *J, double *den,
                        double *num)
{
    double sum[MCD_MAX_DIM] = {0.0, 0.0, 0.0};
    size_t i, j, dd;
    /* Blanc sums den_i = sum_{j != i} x_j / Đ_ij (one division per pair)
     * and num_i = sum_{j != i} x_j = 1 - x_i without cancellation */
    for (i = 0; i < n; i++)
        den[i] = num[i] = 0.0;
    for (i = 0; i < n; i++)
        for (j = i + 1; j < n; j++) {
            double inv = 1.0 / Dij[i * n + j];
            den[i] += x[j] * inv;
            den[j] += x[i] * inv;
            num[i] += x[j];
            num[j] += x[i];
        }
    for (i = 0; i < n; i++) {
        double Dim =
            den[i] > 0.0 ? num[i] / den[i] : mcdi_mixavg_dim(n, i, x, Dij);
        for (dd = 0; dd < nd; dd++) {
            /* c last: c D_im underflows where the flux does not (c =
             * 1e-300, Đ = 1e-30: test_edge_cases) */
            double Ji = -(c * (Dim * d[i * nd + dd]));
            J[i * nd + dd] = Ji;
            sum[dd] += Ji;
        }
    }
    for (i = 0; i < n; i++)
        for (dd = 0; dd < nd; dd++)
            J[i * nd + dd] -= x[i] * sum[dd];
    /* a second pass removes the round-off left by the first (the weights
     * x sum to 1 only to round-off) */
    mcdi_flux_zero_sum(n, nd, x, J);
}
