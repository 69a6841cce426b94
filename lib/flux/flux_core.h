/* flux_core.h - private declarations shared by the flux core files
 * (maxwell_stefan.c, mixavg.c, fick.c). Never installed.
 *
 * Argument checks live in checks.h (included here); kernels do no
 * validation.
 */
#ifndef MCD_FLUX_CORE_H
#define MCD_FLUX_CORE_H

#include <stddef.h>
#include "mcdiff.h"
#include "base/checks.h"
#include "base/lanes.h"
#include "flux/core_layout.h"

/* ---- kernels -------------------------------------------------------- */

/* Normalised mole fractions x (length n) from validated fractions in
 * `basis`; when M != NULL also mass fractions w (may be NULL to skip).
 * Returns the mean molar mass (0 when M == NULL). */
double mcdi_flux_fractions(size_t n, const double *M, mcd_basis basis,
                           const double *comp, double *x, double *w);

/* Index of the most abundant species (first one on ties). */
size_t mcdi_flux_most_abundant(size_t n, const double *x);

/* Mass fluxes that no longer sum to zero to this relative tolerance after
 * the clean-up were lost to cancellation (see mcdi_mass_zero_sum_kept). */
#define MCDI_MASS_SUM_TOL 1e-10

/* 1 if every direction of the mass fluxes F (n x nd) sums to zero to
 * MCDI_MASS_SUM_TOL of its sum of magnitudes (maxwell_stefan.c). */
int mcdi_mass_zero_sum_kept(size_t n, size_t nd, const double *F);

/* Zero-sum clean-up of molar fluxes J (n x nd): J_i -= x_i sum_k J_k per
 * direction (weights x: trace species, x_i = 0, stay exact). */
static inline void mcdi_flux_zero_sum(size_t n, size_t nd, const double *x,
                                      double *J)
{
    remove_along(J, NULL, x, n, 1, nd);
}

/* Exact Maxwell-Stefan diffusion fluxes J (n x nd, molar frame) for
 * normalised x and driving forces d (n x nd) with sum_i d_i = 0.
 * Scratch: the regions A, Dc, xc, dc, Y, sq, isq, S, dinv, pos, tr of
 * the caller's view v, iv of the core bank (core_layout.h: carved once
 * per call, by the caller); x, d and J must not be any of those
 * (mcd_flux_compute passes its x, d, J regions). ws only takes the
 * message. Fails with ESING (round-off made the matrix indefinite).
 * Defined in maxwell_stefan.c. */
mcd_status mcdi_ms_fluxes(mcd_workspace *ws, const mcdi_flux_view *v,
                          const mcdi_flux_iview *iv, size_t n, size_t nd,
                          const double *x, const double *d, const double *Dij,
                          double c, double *J);

/* Dense core of mcdi_ms_fluxes for m >= 2 species all present (xp > 0):
 * assembles Gs + a s s^T from Đ (upper triangle of Dp, row stride ld),
 * factors it as L D L^T and solves for the fluxes c s U, returned in Y
 * (m x nd, row-major) for the driving forces dp (m x nd row-major,
 * summing to zero). Scratch: A (m*m),
 * sq, isq, S, dinv (m each), Yt (m*nd; may be dp, which is read only by
 * the assembly); Y (m*nd) distinct from dp. Returns 0, or k+1 when pivot k
 * is not positive. Above 24 species the factor and solves are LAPACK's
 * dpotrf/dpotrs (*_work: no allocation). One definition per instruction
 * set (ms_ldl.c compiled once per set). */
#define MCDI_MS_LDL_DECL(name)                                                 \
    size_t name(size_t m, size_t nd, const double *xp, const double *Dp,       \
                size_t ld, const double *dp, double c, double *A, double *sq,  \
                double *isq, double *S, double *dinv, double *Y, double *Yt)
MCDI_MS_LDL_DECL(mcdi_ms_ldl_v3);
MCDI_MS_LDL_DECL(mcdi_ms_ldl_v1);
typedef MCDI_MS_LDL_DECL((*mcdi_ms_ldl_fn));
/* The variant for the instruction set chosen at run time (kernel_isa.c);
 * returned as a pointer so that the caller's call is direct (forwarding
 * 14 arguments through a dispatching function cost 8 % of an N = 3 call). */
mcdi_ms_ldl_fn mcdi_ms_ldl_select(void);

/* Mixture-averaged diffusion fluxes J (n x nd, molar frame, zero-sum
 * restored with weights x). den and num are scratch arrays of length n
 * (distinct from x, d, J). Defined in mixavg.c. */
void mcdi_mixavg_fluxes(size_t n, size_t nd, const double *x, const double *d,
                        const double *Dij, double c, double *J, double *den,
                        double *num);

/* Mixture-averaged diffusivity D_im [m^2/s] of species i (see mixavg.c for
 * the x_i = 1 limit). */
double mcdi_mixavg_dim(size_t n, size_t i, const double *x, const double *Dij);

#endif
