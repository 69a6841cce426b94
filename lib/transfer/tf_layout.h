/* tf_layout.h - the transfer layer's scratch in the workspace, every region
 * named once (base/layout.h). Never installed.
 *
 * One list for the film and the two-bulb calls, so their regions are
 * distinct by construction: the two-bulb integration keeps its state in
 * its own regions (b_*) while it calls the film. Each region is a vector
 * of cap doubles (n = cap) or a cap x cap matrix. The four matrices are
 * the only regions used by more than one computation: they belong to the
 * innermost transfer computation running (a film solve or profile, or
 * mcd_bulbs_linearized, which calls no film function); no function keeps
 * data in them across a call to another transfer function. Sized by
 * api/workspace_new.c (mcdi_tf_doubles), carved by mcdi_tf_scratch.
 */
#ifndef MCD_TF_LAYOUT_H
#define MCD_TF_LAYOUT_H

#include "base/layout.h"
#include "base/workspace.h"

/* clang-format off */
#define MCDI_TF_REGIONS(R)                                                  \
    /* matrices: film (mat3 = B_e), profile and expm slots, or the     */  \
    /* linearized two bulbs (Dm, Ac, VR, LU)                            */  \
    R(mat0, n * n) R(mat1, n * n) R(mat2, n * n) R(mat3, n * n)             \
    /* film: reduced x0 - xL, right-hand side, end fluxes, map image    */  \
    R(delta, n) R(rhs, n) R(J, n) R(G, n)                                   \
    /* film iteration: fluxes, previous map, previous image, last good */  \
    R(N, n) R(fprev, n) R(Gprev, n) R(Ngood, n)                             \
    /* film: mean composition; secant differences of the iteration     */  \
    R(xbar, n) R(dF0, n) R(dF1, n) R(dG0, n) R(dG1, n)                      \
    /* film: normalised end compositions, residual fluxes              */  \
    R(x0n, n) R(xLn, n) R(Nres, n)                                          \
    /* two bulbs: normalised starts, mean, initial difference,         */  \
    /* totals V1 x1 + V2 x2, capillary fluxes                          */  \
    R(b_x1n, n) R(b_x2n, n) R(b_xbar, n) R(b_dl0, n) R(b_tot, n) R(b_N, n)  \
    /* linearized: eigenvalues (re, im), coefficients, differences     */  \
    R(b_wr, n) R(b_wi, n) R(b_coef, n) R(b_dl, n)                           \
    /* integration: Runge-Kutta stages, stage state, state, next state, */ \
    /* clipped bulb compositions                                       */  \
    R(b_k0, n) R(b_k1, n) R(b_k2, n) R(b_k3, n) R(b_k4, n) R(b_k5, n)       \
    R(b_k6, n) R(b_ys, n) R(b_y, n) R(b_yn, n) R(b_x1c, n) R(b_x2c, n)      \
    /* evaporation: interface gas composition, fluxes, partial         */  \
    /* pressures (kept while it calls the film)                        */  \
    R(e_y0, n) R(e_N, n) R(e_p, n)
/* clang-format on */

/* mcdi_tf, mcdi_tf_doubles(cap, 0, 1), mcdi_tf_carve(mem, cap, 0, 1, &tf) */
MCDI_DEFINE_LAYOUT(mcdi_tf, MCDI_TF_REGIONS, mcdi_tf_doubles, mcdi_tf_carve)

/* The regions of ws's transfer scratch. */
static inline void mcdi_tf_scratch(mcd_workspace *ws, mcdi_tf *tf)
{
    mcdi_tf_carve(ws->tf_mem, ws->cap, 0, 1, tf);
}

#endif
