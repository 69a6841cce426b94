/* core_layout.h - the flux core's scratch in the workspace (its CORE
 * bank), every region named once (base/layout.h). Never installed.
 *
 * The bank belongs to one call of the flux core at a time and holds
 * nothing between calls; each entry point carves its own view of it
 * (n = cap below), so the size is the larger of the views. Sized by
 * api/workspace_new.c (mcdi_core_doubles, mcdi_core_ints).
 */
#ifndef MCD_CORE_LAYOUT_H
#define MCD_CORE_LAYOUT_H

#include "base/layout.h"
#include "base/workspace.h"

/* mcd_flux_compute and its stages (ms_ldl.c, flux/solve_stages.h: the
 * rows of mcdi_rows with one lane, and the dense exact solve), and
 * mcd_thermal_ratios (x, w, DT, kT), mcd_flux_jacobian_comp (jJ, jd,
 * jac: regions the flux solve it calls does not touch) and the tangents
 * of flux/tangent.c (jJ, jd, jac and the t* regions, untouched by the
 * flux solve as well) */
/* clang-format off */
#define MCDI_FLUX_REGIONS(R)                                                \
    R(x, n) R(w, n)              /* mole and mass fractions */             \
    R(gx, n * MCD_MAX_DIM)       /* mole-fraction gradients (mass input) */ \
    R(d, n * MCD_MAX_DIM)        /* driving forces */                      \
    R(J, n * MCD_MAX_DIM)        /* fluxes */                              \
    R(tri, n * (n + 1) / 2)      /* 1/Đ, packed lower triangle */          \
    R(s, n)                      /* sqrt(x) */                             \
    R(S, n)                      /* Blanc sums */                          \
    R(num, n)                    /* sum_{j != i} x_j */                    \
    R(minv, n)                   /* harmonic sums of a pure species */     \
    R(wk, n)                     /* -D_im, -1/s_i */                       \
    R(t, n * MCD_MAX_DIM)        /* trace fluxes J / c */                  \
    R(r, n * MCD_MAX_DIM)        /* right-hand side, then U */             \
    R(A, n * n)                  /* Gs + a s s^T and its factor */         \
    R(dinv, n)                   /* inverse pivots */                      \
    R(isq, n)                    /* 1/sqrt(x) (fused exact kernel) */      \
    R(Yt, n * MCD_MAX_DIM)       /* LAPACK's right-hand sides */          \
    R(DT, n) R(kT, n)            /* mcd_thermal_ratios: D^T, k_T */       \
    R(jJ, n * MCD_MAX_DIM)       /* mcd_flux_jacobian_comp: J, */          \
    R(jd, n * MCD_MAX_DIM)       /* the forces of one column, */           \
    R(jac, n * n * MCD_MAX_DIM)  /* and the columns dJ/dx_k */          \
    R(tx, n) R(tw, n)            /* tangent.c: the state's x, w, */        \
    R(tgx, n * MCD_MAX_DIM)      /* mole-fraction gradients, */            \
    R(ts, n * MCD_MAX_DIM)       /* unprojected forces, */                 \
    R(td, n * MCD_MAX_DIM)       /* projected forces, */                   \
    R(tS, n) R(tDm, n)           /* Blanc sums, D_im (mixture-averaged), */ \
    R(tiD, n * n)                /* 1/Đ_ij, full (diagonal 0), */          \
    R(tP, n * MCD_MAX_DIM)       /* sum_j J_j / Đ_ij, */                   \
    R(tJs, n * MCD_MAX_DIM)      /* uncorrected fluxes J* (the same), */   \
    R(tdx, n) R(tdw, n)          /* and of one direction: dx, dw, */       \
    R(tdg, n * MCD_MAX_DIM)      /* d grad x, */                           \
    R(tdd, n * MCD_MAX_DIM)      /* d forces, */                           \
    R(tdJ, n * MCD_MAX_DIM)      /* d fluxes, */                           \
    R(tF, n * n * MCD_MAX_DIM)   /* the forces of all columns */
/* clang-format on */

/* mcd_fick_matrix and mcd_fick_eigenvalues */
/* clang-format off */
#define MCDI_FICK_REGIONS(R)                                                \
    R(x, n) R(w, n)              /* mole and mass fractions */             \
    R(B, n * n)                  /* [B], then its LU (column-major) */     \
    R(X, n * n)                  /* Gamma, then [D] (column-major) */      \
    R(cs, n) R(t, n) R(qv, n)    /* column sums, mass-basis products */    \
    R(wr, n) R(wi, n)            /* eigenvalues, real and imaginary */
#define MCDI_FICK_INTS(R) R(ipiv, n) /* LU pivots */
/* clang-format on */

MCDI_DEFINE_LAYOUT(mcdi_flux_view, MCDI_FLUX_REGIONS, mcdi_flux_doubles,
                   mcdi_flux_carve)
MCDI_DEFINE_LAYOUT(mcdi_fick_view, MCDI_FICK_REGIONS, mcdi_fick_doubles,
                   mcdi_fick_carve)
MCDI_DEFINE_LAYOUT_OF(mcdi_fick_iview, int, MCDI_LAYOUT_IFIELD, MCDI_FICK_INTS,
                      mcdi_fick_ints, mcdi_fick_icarve)

/* Elements of the bank for cap species: the larger view. */
static inline size_t mcdi_core_doubles(size_t cap)
{
    size_t a = mcdi_flux_doubles(cap, 0, 1), b = mcdi_fick_doubles(cap, 0, 1);
    return a > b ? a : b;
}
static inline size_t mcdi_core_ints(size_t cap)
{
    return mcdi_fick_ints(cap, 0, 1);
}

/* The views of ws's core bank. */
static inline void mcdi_flux_scratch(mcd_workspace *ws, mcdi_flux_view *v)
{
    mcdi_flux_carve(ws->core_mem, ws->cap, 0, 1, v);
}
static inline void mcdi_fick_scratch(mcd_workspace *ws, mcdi_fick_view *v,
                                     mcdi_fick_iview *iv)
{
    mcdi_fick_carve(ws->core_mem, ws->cap, 0, 1, v);
    mcdi_fick_icarve(ws->core_int, ws->cap, 0, 1, iv);
}

#endif
