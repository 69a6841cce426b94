/* batch_layout.h - the scratch of one block of the batched kernels, laid
 * out from one list. Never installed.
 *
 * Every region of a block's scratch is named in MCDI_KBLOCK_REGIONS with
 * its size in lane rows (one row = L doubles, one value per lane). The same
 * list declares the fields of mcdi_kblock, sizes the scratch
 * (mcdi_kblock_doubles, used by batch.c to size a thread's region) and
 * carves it (mcdi_kblock_carve, used by the kernels), so size and layout
 * cannot disagree. Every region is a whole number of rows, so with a
 * 64-byte aligned start every row of an 8-lane block is one aligned
 * vector. The AoS staging of mcd_flux_batch_aos has its own list below.
 */
#ifndef MCD_BATCH_LAYOUT_H
#define MCD_BATCH_LAYOUT_H

#include <stddef.h>
#include "mcdiff.h"
#include "props/mixture.h"
#include "base/layout.h"

/* Rows factored together above KREG species (ldl_solve_v, kernel_ldl.h). */
#define MCDI_KTILE 4

/* R(name, rows): rows may use n (species), nd (directions). */
/* clang-format off */
#define MCDI_KBLOCK_REGIONS(R)                                              \
    R(tri, n * (n + 1) / 2) /* packed lower: 1/Đ, then A, then L of LDL^T */ \
    R(x, n)      /* mole fractions */                                       \
    R(w, n)      /* mass fractions */                                       \
    R(s, n)      /* sqrt(x) */                                              \
    R(S, n)      /* Blanc sums sum_{j != i} x_j / Đ_ij */                   \
    R(num, n)    /* 1 - x_i, summed over the others */                      \
    R(minv, n)   /* diagonal of the iteration; harmonic sums of pure cells */ \
    R(Dg, n)     /* pivots of LDL^T */                                      \
    R(iDg, n)    /* their inverses */                                       \
    R(wk, n)     /* -D_im, -1/s_i, LDL^T multipliers (per stage) */         \
    R(d, n * nd) /* driving forces */                                       \
    R(t, n * nd) /* trace fluxes J / c */                                   \
    R(r, n * nd) /* right-hand side, then the solution U */                 \
    R(v, n * nd) /* next iterate; grad ln P while loading */                \
    R(J, n * nd) /* fluxes */                                               \
    R(kT, n)     /* thermal diffusion ratios */                             \
    R(gT, nd)    /* grad ln T */                                            \
    R(Wt, MCDI_KTILE * n) /* W rows of a tile (ldl_solve_v) */              \
    R(cheb, MCDI_FIT_MAXDEG + 1) /* Chebyshev polynomials of ln T */        \
    R(c, 1)      /* concentration */                                        \
    R(T, 1)      /* temperature (mixture calls) */                          \
    R(P, 1)      /* pressure (mixture calls) */                             \
    R(f175, 1)   /* P / T^1.75 */                                           \
    R(f15, 1)    /* P / T^1.5 */                                            \
    R(infit, 1)  /* 1 where T is inside the mixture's fit range */          \
    R(sum, 1)    /* sum of the composition */                               \
    R(dprev, 1)  /* relative change of the previous iteration */            \
    R(dprev2, 1) /* and of the one before */                                \
    R(est, 1)    /* error estimate of the iteration */                      \
    R(active, 1) /* 1 while the lane iterates */                            \
    R(iters, 1)  /* iterations used */
/* clang-format on */

/* mcdi_kblock, mcdi_kblock_doubles, mcdi_kblock_carve: a block's scratch
 * (the kernels carve it, batch.c sizes a thread's region with it). */
MCDI_DEFINE_LAYOUT(mcdi_kblock, MCDI_KBLOCK_REGIONS, mcdi_kblock_doubles,
                   mcdi_kblock_carve)

/* AoS staging (mcd_flux_batch_aos): a block of cells transposed into the
 * SoA layout the kernels read, placed after the kernel's scratch. */
/* clang-format off */
#define MCDI_AOS_REGIONS(R)                                                 \
    R(T, 1) R(P, 1) R(comp, n) R(grad, n * nd) R(glnP, nd) R(kT, n)        \
    R(glnT, nd) R(out, n * nd)
/* clang-format on */
MCDI_DEFINE_LAYOUT(mcdi_aos_stage, MCDI_AOS_REGIONS, mcdi_aos_doubles,
                   mcdi_aos_carve)

/* mcd_flux_batch_jacobian (batch_jac.c): one cell gathered from the SoA
 * arrays into the arrays of an mcd_state, and its results, at the start
 * of thread 0's region after the streaming state (the call is serial). */
/* clang-format off */
#define MCDI_JCELL_REGIONS(R)                                               \
    R(comp, n) R(grad, n * nd) R(glnP, nd) R(kT, n) R(glnT, nd)           \
    R(Dij, n * n) R(flux, n * nd) R(jac, n * nd * n)
/* clang-format on */
MCDI_DEFINE_LAYOUT(mcdi_jcell, MCDI_JCELL_REGIONS, mcdi_jcell_doubles,
                   mcdi_jcell_carve)

#endif
