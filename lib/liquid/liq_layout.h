/* liq_layout.h - the liquid layer's scratch in the workspace, every region
 * named once (base/layout.h). Never installed.
 *
 * Used by mcd_liquid_eval (nothing is kept between calls); its own
 * bank (liq_mem), so a liquid call never disturbs the flux core's or the
 * transfer layer's scratch. Sized by api/workspace_new.c
 * (mcdi_liq_doubles + mcdi_lcell_doubles), carved by mcdi_liq_scratch.
 *
 * After the eval regions, the cell regions (MCDI_LCELL_REGIONS):
 * mcd_liquid_flux_batch (api/liquid_batch.c) gathers one cell there from
 * its SoA arrays into an mcd_state while mcdi_liquid_state uses the eval
 * regions and the flux core its own bank.
 */
#ifndef MCD_LIQ_LAYOUT_H
#define MCD_LIQ_LAYOUT_H

#include "base/layout.h"
#include "base/workspace.h"

/* clang-format off */
#define MCDI_LIQ_REGIONS(R)                                                 \
    /* normalised composition, ln gamma                                 */  \
    R(x, n) R(lng, n)                                                       \
    /* model pair matrix at T, H = n_T d ln gamma / d n, Gamma          */  \
    R(t, n * n) R(H, n * n) R(Gam, n * n)                                   \
    /* model scratch: three vectors, UNIQUAC r and q, three matrices    */  \
    R(s1, n) R(s2, n) R(s3, n) R(r, n) R(q, n)                              \
    R(g, n * n) R(w, n * n) R(p, n * n)                                     \
    /* stability: reduced Hessian; diffusivities; ln D°                  */  \
    R(A, n * n) R(D, n * n) R(L, n * n)
/* clang-format on */

/* mcdi_liq, mcdi_liq_doubles(cap, 0, 1), mcdi_liq_carve(mem, cap, 0, 1, &l) */
MCDI_DEFINE_LAYOUT(mcdi_liq, MCDI_LIQ_REGIONS, mcdi_liq_doubles, mcdi_liq_carve)

/* The regions of ws's liquid scratch. */
static inline void mcdi_liq_scratch(mcd_workspace *ws, mcdi_liq *l)
{
    mcdi_liq_carve(ws->liq_mem, ws->cap, 0, 1, l);
}

/* clang-format off */
#define MCDI_LCELL_REGIONS(R)                                               \
    /* one cell's inputs: fractions, mole fractions, gradients, thermal    \
     * ratios and grad ln T, partial molar volumes                      */  \
    R(comp, n) R(x, n) R(grad, n * nd) R(kT, n) R(glnT, nd) R(Vbar, n)     \
    /* its thermodynamic factor and diffusivities, molar fluxes and the   \
     * fluxes it reports                                                */  \
    R(Gam, n * n) R(Dij, n * n) R(J, n * nd) R(flux, n * nd)              \
    /* ln D° of the call (mcdi_liquid_log_dinf)                         */  \
    R(lnD, n * n)
/* clang-format on */

/* mcdi_lcell, mcdi_lcell_doubles(cap, MCD_MAX_DIM, 1), mcdi_lcell_carve */
MCDI_DEFINE_LAYOUT(mcdi_lcell, MCDI_LCELL_REGIONS, mcdi_lcell_doubles,
                   mcdi_lcell_carve)

/* The cell regions of ws's liquid bank for n species, nd directions
 * (after the eval regions, sized for the capacity). */
static inline void mcdi_lcell_scratch(mcd_workspace *ws, size_t n, size_t nd,
                                      mcdi_lcell *c)
{
    mcdi_lcell_carve(ws->liq_mem + mcdi_liq_doubles(ws->cap, 0, 1), n, nd, 1,
                     c);
}

#endif
