/* forces.h - the driving forces of diffusion, written once for both flux
 * pipelines. Never installed.
 *
 *   d_i = sum_j Gamma_ij grad x_j + (x_i - w_i) grad ln P,
 *
 * projected onto sum_i d_i = 0 with weights x (maxwell_stefan.c explains
 * why), on rows of L lanes (base/lanes.h): the single-state calls run it
 * with L = 1, the batched kernel (batched/kernel_stages.h, stage_forces)
 * with its lanes. A new driving force (thermal diffusion is next) is one
 * more term here, and one more input for the callers to load.
 */
#ifndef MCD_FORCES_H
#define MCD_FORCES_H

#include <string.h>
#include "base/lanes.h"

/* d from the mole-fraction gradients gx (d may be gx), the thermodynamic
 * factor Gamma (n x n row-major, one state: L = 1 only; NULL = ideal) and
 * grad ln P (nd rows of L lanes, NULL = none); x, w: fractions (w may be
 * NULL without grad ln P). */
KINLINE void mcdi_driving_forces(const size_t n, const size_t L,
                                 const size_t nd, const double *restrict x,
                                 const double *w, const double *gx,
                                 const double *Gamma, const double *glnP,
                                 double *d)
{
    size_t i, j, dd, l;
    if (Gamma != NULL) {
        for (i = 0; i < n; i++)
            for (dd = 0; dd < nd; dd++) {
                double s = 0.0;
                for (j = 0; j < n; j++)
                    s += Gamma[i * n + j] * gx[j * nd + dd];
                d[i * nd + dd] = s;
            }
    } else if (d != gx) {
        memcpy(d, gx, n * nd * L * sizeof(double));
    }
    if (glnP != NULL)
        for (i = 0; i < n; i++)
            for (dd = 0; dd < nd; dd++)
                for_lanes (l)
                    d[(i * nd + dd) * L + l] +=
                        (x[i * L + l] - w[i * L + l]) * glnP[dd * L + l];
    remove_along(d, NULL, x, n, L, nd); /* onto sum_i d_i = 0, weights x */
}

#endif
