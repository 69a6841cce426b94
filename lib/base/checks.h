/* checks.h - argument checks shared by every call that takes a workspace
 * (checks.c). Never installed.
 *
 * Each check sets the status and the message together (mcdi_fail):
 * "argument <name>: <what>", with the entry's index. It writes nothing
 * else.
 */
#ifndef MCD_CHECKS_H
#define MCD_CHECKS_H

#include <stddef.h>
#include "mcdiff.h"
#include "base/error.h"

/* Relative tolerance of the symmetry check of Dij (documented in the
 * header: relative difference <= 1e-12). */
#define MCDI_DIJ_SYM_TOL 1e-12

/* The workspace and the call's main object: ws NULL is EINVAL without
 * words (the entry's fallback names the call), obj NULL is EINVAL
 * "argument <name>: NULL". */
static inline mcd_status mcdi_check_ws_obj(const mcd_workspace *ws,
                                           const void *obj, const char *name)
{
    if (ws == NULL)
        return MCD_EINVAL;
    if (obj == NULL)
        return mcdi_fail(MCD_EINVAL, "argument %s: NULL", name);
    return MCD_OK;
}

/* p != NULL (EINVAL). */
mcd_status mcdi_check_ptr(mcd_workspace *ws, const void *p, const char *name);

/* The first NULL of count pointers p[k], named names[k] (EINVAL);
 * MCDI_CHECK_PTRS2/3 name each by its expression, which must be the
 * argument's name. */
mcd_status mcdi_check_ptrs(size_t count, const void *const *p,
                           const char *const *names);
#define MCDI_CHECK_PTRS2(a, b)                                                 \
    mcdi_check_ptrs(2, (const void *const[]){a, b},                            \
                    (const char *const[]){#a, #b})
#define MCDI_CHECK_PTRS3(a, b, c)                                              \
    mcdi_check_ptrs(3, (const void *const[]){a, b, c},                         \
                    (const char *const[]){#a, #b, #c})

/* n entries finite (EINVAL, "entry i"); NULL is EINVAL. */
mcd_status mcdi_check_finite_vec(mcd_workspace *ws, size_t n, const double *p,
                                 const char *name);

/* A species count: lo..MCD_MAX_SPECIES (EINVAL; above MCD_MAX_SPECIES only
 * with max_is_einval, as the transfer calls have always had it) and at
 * most the workspace's capacity (EBADLEN). */
mcd_status mcdi_check_species(mcd_workspace *ws, size_t n, size_t lo,
                              int max_is_einval, const char *name);

/* n_dim in 1..MCD_MAX_DIM (EINVAL). */
mcd_status mcdi_check_dim(mcd_workspace *ws, size_t nd);

/* A known mcd_basis value (EINVAL). */
mcd_status mcdi_check_basis(mcd_workspace *ws, mcd_basis b, const char *name);

/* MAXWELL_STEFAN or MIXTURE_AVERAGED, and ITERATIVE where iterative_ok
 * (the batched calls) (EINVAL). */
mcd_status mcdi_check_model(mcd_workspace *ws, mcd_model model,
                            int iterative_ok);

/* A finite (EINVAL) positive (EDOM) scalar. */
mcd_status mcdi_check_positive(mcd_workspace *ws, double v, const char *name);

/* Two such scalars, both finiteness tests (EINVAL) before both domain
 * tests (EDOM), e.g. T and P. */
mcd_status mcdi_check_positive2(double a, const char *name_a, double b,
                                const char *name_b);

/* Binary diffusivities: off-diagonal entries finite (EINVAL), > 0 (EDOM),
 * not subnormal (>= DBL_MIN, EDOM), symmetric to MCDI_DIJ_SYM_TOL relative
 * (EDOM). Diagonal ignored. The one Dij check of the library: the
 * transfer layer (film.c, bulbs.c) uses it too. */
mcd_status mcdi_check_dij(mcd_workspace *ws, size_t n, const double *Dij);

/* Fractions as mcd_comp_normalize (uses mcdi_comp_check). `name` is the
 * argument name used in the message. */
mcd_status mcdi_check_comp(mcd_workspace *ws, size_t n, const double *y,
                           const char *name);

/* Molar masses finite (EINVAL) and > 0 (EDOM). */
mcd_status mcdi_check_M(mcd_workspace *ws, size_t n, const double *M);

/* rows x cols array all finite (EINVAL); NULL is EINVAL. */
mcd_status mcdi_check_finite(mcd_workspace *ws, size_t rows, size_t cols,
                             const double *p, const char *name);

/* Largest ratio of molar masses accepted where the bases are converted
 * (mass basis, pressure diffusion). Beyond it the conversion of mass- to
 * mole-fraction gradients cancels beyond double precision and the driving
 * forces no longer balance (found by fuzz_flux: 2.8e-306 next to 0.03
 * kg/mol gave molar fluxes whose sum was 3e48 of 2e55). Electrons next to
 * a polymer are about 1e9. mcdi_M_span_ok: every ratio within it. */
#define MCDI_M_SPAN 1e12
int mcdi_M_span_ok(size_t n, const double *M);

/* Thermal diffusion inputs: the ratios kT (n, finite) and grad ln T (nd,
 * finite), both given or both NULL (EINVAL naming the missing one). */
mcd_status mcdi_check_thermal(mcd_workspace *ws, size_t n, size_t nd,
                              const double *kT, const double *grad_lnT);
/* The same rules and messages for one cell of a batched call (both
 * given; entry e at p[e * stride]). */
mcd_status mcdi_check_thermal_strided(mcd_workspace *ws, size_t n, size_t nd,
                                      const double *kT, const double *grad_lnT,
                                      size_t stride);

/* A total concentration [mol/m^3]: finite (EINVAL), a normal positive
 * number (EDOM). */
mcd_status mcdi_check_conc(mcd_workspace *ws, double c, const char *name);

/* The same rules and messages as mcdi_check_dij, _comp and _finite for one
 * cell of a batched call: element e of the cell at p[e * stride] (p
 * already offset to the cell; not NULL). Used to name the first bad cell
 * after the kernel flagged its block. */
mcd_status mcdi_check_dij_strided(mcd_workspace *ws, size_t n,
                                  const double *Dij, size_t stride);
/* As mcdi_check_dij_strided for the entries above the diagonal only, no
 * symmetry (MCD_DIJ_READ_UPPER). */
mcd_status mcdi_check_dij_upper_strided(mcd_workspace *ws, size_t n,
                                        const double *Dij, size_t stride);
mcd_status mcdi_check_comp_strided(mcd_workspace *ws, size_t n, const double *y,
                                   size_t stride, const char *name);
mcd_status mcdi_check_finite_strided(mcd_workspace *ws, size_t rows,
                                     size_t cols, const double *p,
                                     size_t stride, const char *name);
/* As mcdi_check_finite_vec ("entry i") for p[i * stride]. */
mcd_status mcdi_check_finite_vec_strided(mcd_workspace *ws, size_t n,
                                         const double *p, size_t stride,
                                         const char *name);

#endif
