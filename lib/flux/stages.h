/* stages.h - the stages of a flux computation that both pipelines run,
 * written once on rows of L lanes (base/lanes.h): the single-state calls
 * (maxwell_stefan.c) with L = 1, the batched kernel
 * (batched/kernel_stages.h) with its lanes. Never installed.
 *
 * Driving forces:
 *   d_i = sum_j Gamma_ij grad x_j + (x_i - w_i) grad ln P
 *         + k_T,i grad ln T,
 * projected onto sum_i d_i = 0 with weights x (maxwell_stefan.c explains
 * why). The thermal term is that of the Maxwell-Stefan equations with
 * thermal diffusion (flux/thermal.c derives k_T,i from the coefficients
 * D_i^T). A new driving force is one more term in mcdi_driving_forces,
 * and one more input for the callers to load and check.
 * Mass basis: j_i = M_i J_i - w_i sum_k M_k J_k (mcdi_mass_fluxes).
 */
#ifndef MCD_FORCES_H
#define MCD_FORCES_H

#include "base/lanes.h"

/* d from the mole-fraction gradients gx (d may be gx), the thermodynamic
 * factor Gamma (n x n row-major, one state: L = 1 only; NULL = ideal),
 * grad ln P (nd rows of L lanes, NULL = none; then w may be NULL) and
 * thermal diffusion: the ratios kT (n rows of L lanes) with grad ln T (nd
 * rows of L lanes), both NULL for none. x, w: fractions. */
KINLINE void mcdi_driving_forces(const size_t n, const size_t L,
                                 const size_t nd, const double *restrict x,
                                 const double *w, const double *gx,
                                 const double *Gamma, const double *glnP,
                                 const double *kT, const double *glnT,
                                 double *d)
{
    const double *src = gx; /* the unprojected forces so far */
    size_t i, j, dd, l;
    if (Gamma != NULL) {
        for (i = 0; i < n; i++)
            for (dd = 0; dd < nd; dd++) {
                double s = 0.0;
                for (j = 0; j < n; j++)
                    s += Gamma[i * n + j] * gx[j * nd + dd];
                d[i * nd + dd] = s;
            }
        src = d;
    }
    if (glnP != NULL) {
        for (i = 0; i < n; i++)
            for (dd = 0; dd < nd; dd++)
                for_lanes (l)
                    d[(i * nd + dd) * L + l] =
                        src[(i * nd + dd) * L + l] +
                        (x[i * L + l] - w[i * L + l]) * glnP[dd * L + l];
        src = d;
    }
    if (kT != NULL) {
        for (i = 0; i < n; i++)
            for (dd = 0; dd < nd; dd++)
                for_lanes (l)
                    d[(i * nd + dd) * L + l] = src[(i * nd + dd) * L + l] +
                                               kT[i * L + l] * glnT[dd * L + l];
        src = d;
    }
    /* onto sum_i d_i = 0 with weights x, from src in one pass */
    remove_along_into(d, src, NULL, x, n, L, nd);
}

/* Mass fluxes in place of the molar fluxes J (n x nd rows of L lanes):
 * j_i = M_i J_i - w_i sum_k M_k J_k, then the round-off residual of
 * sum_i j_i removed with weights w. Whether the zero-sum survived is the
 * caller's check (mcdi_mass_zero_sum_kept, or per lane in the kernel). */
KINLINE void mcdi_mass_fluxes(const size_t n, const size_t L, const size_t nd,
                              const double *M, const double *restrict w,
                              double *restrict J)
{
    double sm[MCDI_LANES], rs[MCDI_LANES];
    size_t i, dd, l;
    for (dd = 0; dd < nd; dd++) {
        for_lanes (l)
            sm[l] = rs[l] = 0.0;
        for (i = 0; i < n; i++)
            for_lanes (l)
                sm[l] += M[i] * J[(i * nd + dd) * L + l];
        for (i = 0; i < n; i++)
            for_lanes (l) {
                size_t e = (i * nd + dd) * L + l;
                J[e] = M[i] * J[e] - w[i * L + l] * sm[l];
                rs[l] += J[e];
            }
        for (i = 0; i < n; i++)
            for_lanes (l)
                J[(i * nd + dd) * L + l] -= w[i * L + l] * rs[l];
    }
}

#endif
