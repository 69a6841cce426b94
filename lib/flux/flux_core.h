/* flux_core.h - private declarations shared by the flux core files
 * (maxwell_stefan.c, ms_ldl.c, fick.c). Never installed.
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

/* The dense scratch of the one-lane exact solve (ms_ldl.c): A (n*n),
 * dinv (n), Yt (n*nd, LAPACK's column-major right-hand sides). */
typedef struct mcdi_dense {
    double *A, *dinv, *Yt;
} mcdi_dense;

/* The fluxes of one state after its driving forces, by the stages the
 * batched kernel runs (flux/solve_stages.h) with one lane: R->x
 * (normalised mole fractions), R->d (driving forces projected onto
 * sum_i d_i = 0) and R->c in; R->J out (molar frame, before the zero-sum
 * clean-up); the other rows of R and D are scratch (R->Dg, R->iDg
 * unused). model: exact (MCD_MODEL_MAXWELL_STEFAN) or
 * MCD_MODEL_MIXTURE_AVERAGED; Dij: n x n, read from the upper triangle.
 * The exact solve is a dense up-looking L D L^T (LAPACK's dpotrf/dpotrs
 * `_work` above MCDI_MS_LAPACK_N, 32, species: no allocation). Returns
 * 0, or k+1 when the pivot of species k is not positive. One definition
 * per instruction set (ms_ldl.c compiled once per set). */
struct mcdi_rows;
#define MCDI_MS_ROWS_DECL(name)                                                \
    size_t name(const struct mcdi_rows *R, const mcdi_dense *D,                \
                mcd_model model, size_t n, size_t nd, const double *Dij)
MCDI_MS_ROWS_DECL(mcdi_ms_rows_v3);
MCDI_MS_ROWS_DECL(mcdi_ms_rows_v1);
typedef MCDI_MS_ROWS_DECL((*mcdi_ms_rows_fn));
mcdi_ms_rows_fn mcdi_ms_rows_select(void);

/* The exact model for m >= 2 species, all present (xp > 0), and at most
 * MCDI_MS_FUSED_N of them (up to 5 in the grounded form first, ms_ldl.c
 * fused_gth): the same equations and the same L D L^T as
 * mcdi_ms_rows with the Blanc sums, shift, assembly and right-hand side
 * fused into a few passes (the stages' separate passes cost 4-8 % of a
 * call at N = 3..20, measured). Đ: upper triangle of Dp (row stride ld);
 * dp: driving forces (m x nd row-major, summing to zero); fluxes c s U
 * into Y (m x nd), distinct from dp. Scratch: A (m*m), T (m(m-1)/2: 1/Đ
 * packed), sq, isq, S, dinv (m each), Yt (m*nd; may be dp). Returns 0,
 * or k+1 when pivot k is not positive. One definition per instruction
 * set (ms_ldl.c). */
#define MCDI_MS_FUSED_N 32
#define MCDI_MS_LDL_DECL(name)                                                 \
    size_t name(size_t m, size_t nd, const double *xp, const double *Dp,       \
                size_t ld, const double *dp, double c, double *A, double *T,   \
                double *sq, double *isq, double *S, double *dinv, double *Y,   \
                double *Yt)
MCDI_MS_LDL_DECL(mcdi_ms_ldl_v3);
MCDI_MS_LDL_DECL(mcdi_ms_ldl_v1);
typedef MCDI_MS_LDL_DECL((*mcdi_ms_ldl_fn));
/* The variants for the instruction set chosen at run time (base/isa.c);
 * returned as pointers so that the caller's call is direct (forwarding
 * 14 arguments through a dispatching function cost 8 % of an N = 3 call). */
mcdi_ms_ldl_fn mcdi_ms_ldl_select(void);

/* Molar diffusion fluxes J (n x nd, molar frame) of one state from its
 * mole fractions x and driving forces d by a solver of another layer (the
 * iterative model runs in the batched layer: mcdi_batch_iterate_one). */
typedef mcd_status (*mcdi_state_solver)(mcd_workspace *ws, size_t n, size_t nd,
                                        const double *x, const double *d,
                                        const double *Dij, double c, double *J);

/* mcd_flux_compute (maxwell_stefan.c) with the solver of
 * MCD_MODEL_ITERATIVE given by the caller (api/flux_compute.c); iterate
 * NULL makes that model EINVAL. */
mcd_status mcdi_flux_state(mcd_workspace *ws, mcd_model model,
                           const mcd_state *state, mcd_basis flux_basis,
                           double *out_flux, mcdi_state_solver iterate);

/* The exact model's molar fluxes J (n x nd) of a state already
 * validated by mcdi_flux_state: x normalised (n >= 2), driving forces f
 * (n x nd, projected again onto sum_i f_i = 0 as mcdi_flux_state does);
 * no checks, no finiteness test of J (the caller's). The flux solve of
 * mcd_flux_compute (maxwell_stefan.c); uses the core bank's flux view
 * except jJ, jd, jac and the t* regions. */
mcd_status mcdi_flux_solve_exact(mcd_workspace *ws, size_t n, size_t nd,
                                 const double *x, const double *f,
                                 const double *Dij, double c, double *J);

/* The same for ncol right-hand sides at once with one factorisation
 * (F: n x ncol row-major, projected in place, then overwritten; Y: n x
 * ncol): every species present (x_i > 0), n >= 2 (the fused kernel,
 * LAPACK's Cholesky above MCDI_MS_LAPACK_N; ncol is its n_dim, any
 * size). */
mcd_status mcdi_flux_solve_exact_wide(mcd_workspace *ws, size_t n, size_t ncol,
                                      const double *x, double *F,
                                      const double *Dij, double c, double *Y);

/* mcd_flux_jacobian with the fluxes as well (tangent.c): out_jac
 * (N n_dim x N, as mcd_flux_jacobian) and, unless NULL, out_flux (N x
 * n_dim, equal to mcd_flux_compute's to the bit); both written only on
 * success; jac_name names out_jac in messages. The per-cell core of
 * mcd_flux_batch_jacobian. */
mcd_status mcdi_flux_jacobian_state(mcd_workspace *ws, mcd_model model,
                                    const mcd_state *state, mcd_basis fb,
                                    double *out_flux, double *out_jac,
                                    const char *jac_name);

/* The models the Jacobians are defined for (tangent.c): MCD_OK for
 * MAXWELL_STEFAN and MIXTURE_AVERAGED; EINVAL with the one message that
 * says why not for ITERATIVE. Other values: MCD_OK (mcdi_check_model
 * names them). */
mcd_status mcdi_jac_model_ok(mcd_model model);

#endif
