/* liq_layout.h - the liquid layer's scratch in the workspace, every region
 * named once (base/layout.h). Never installed.
 *
 * Used by mcd_liquid_eval only (nothing is kept between calls); its own
 * bank (liq_mem), so a liquid call never disturbs the flux core's or the
 * transfer layer's scratch. Sized by api/workspace_new.c
 * (mcdi_liq_doubles), carved by mcdi_liq_scratch.
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
    /* stability: reduced Hessian; diffusivities                        */  \
    R(A, n * n) R(D, n * n)
/* clang-format on */

/* mcdi_liq, mcdi_liq_doubles(cap, 0, 1), mcdi_liq_carve(mem, cap, 0, 1, &l) */
MCDI_DEFINE_LAYOUT(mcdi_liq, MCDI_LIQ_REGIONS, mcdi_liq_doubles, mcdi_liq_carve)

/* The regions of ws's liquid scratch. */
static inline void mcdi_liq_scratch(mcd_workspace *ws, mcdi_liq *l)
{
    mcdi_liq_carve(ws->liq_mem, ws->cap, 0, 1, l);
}

#endif
