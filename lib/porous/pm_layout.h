/* pm_layout.h - the porous-media layer's scratch in the workspace, every
 * region named once (base/layout.h). Never installed.
 *
 * Regions are vectors of cap doubles (n = cap), the cap x cap matrix of the
 * Dusty Gas Model, and its right-hand sides (one column per direction plus
 * one for the pressure-gradient response of the closed-end call). Sized by
 * api/workspace_new.c (mcdi_pm_doubles), carved by mcdi_pm_scratch. No
 * region holds data between calls.
 */
#ifndef MCD_PM_LAYOUT_H
#define MCD_PM_LAYOUT_H

#include "base/layout.h"
#include "base/workspace.h"

/* Columns of the right-hand-side block: MCD_MAX_DIM directions and the
 * response to a unit pressure gradient. */
#define MCDI_PM_COLS (MCD_MAX_DIM + 1)

/* clang-format off */
#define MCDI_PM_REGIONS(R)                                                  \
    /* DGM matrix H (row-major), right-hand sides / solutions (n x cols) */ \
    R(H, n * n) R(rhs, n * MCDI_PM_COLS)                                    \
    /* normalised mole fractions, projected gradients (n x MCD_MAX_DIM), */ \
    /* effective Knudsen diffusivities, viscous factors k_i             */  \
    R(xn, n) R(gx, n * MCD_MAX_DIM) R(DK, n) R(kv, n)                       \
    /* results before they are copied out: fluxes or gradients           */ \
    R(out, n * MCD_MAX_DIM)                                                 \
    /* one cell of the batched call, gathered: Dij, x, grad x, grad P    */ \
    R(cD, n * n) R(cx, n) R(cg, n * MCD_MAX_DIM) R(cgP, MCD_MAX_DIM)       \
    /* slab: Dij at the local pressure, end compositions (given, aimed   */ \
    /* at by the continuation), mean state,                             */ \
    /* states (n fractions + P), Runge-Kutta stages, Newton fluxes,     */ \
    /* trial and previous fluxes, step, residuals, Jacobian, the fluxes */ \
    /* z N_t of given ratios                                             */ \
    R(sD, n * n) R(x0n, n) R(xLn, n) R(xLt, n) R(xm, n) R(gm, n)                     \
    R(y0, n + 1) R(yL, n + 1) R(yt, n + 1) R(k1, n + 1) R(k2, n + 1)        \
    R(k3, n + 1) R(k4, n + 1) R(N, n) R(Nt, n) R(Nprev, n) R(dN, n)         \
    R(r, n) R(rt, n) R(J, n * n) R(Nz, n)
/* clang-format on */

/* mcdi_pm, mcdi_pm_doubles(cap, 0, 1), mcdi_pm_carve(mem, cap, 0, 1, &pm) */
MCDI_DEFINE_LAYOUT(mcdi_pm, MCDI_PM_REGIONS, mcdi_pm_doubles, mcdi_pm_carve)

/* The regions of ws's porous-media scratch. */
static inline void mcdi_pm_scratch(mcd_workspace *ws, mcdi_pm *pm)
{
    mcdi_pm_carve(ws->pm_mem, ws->cap, 0, 1, pm);
}

#endif
