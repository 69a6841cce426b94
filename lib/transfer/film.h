/* film.h - private helpers shared by the transfer layer (film.c, bulbs.c).
 * Never installed. Internal non-static functions use the mcdi_tf_ and
 * mcdi_film_ prefixes. */
#ifndef MCD_FILM_H
#define MCD_FILM_H

#include <stddef.h>
#include "mcdiff.h"

/* Arguments are checked with checks.h (the same rules and messages as the
 * flux calls); the two helpers below add what only this layer needs. */

/* Start of every transfer call: ws not NULL (EINVAL, no message), its
 * error cleared, n in 2..MCD_MAX_SPECIES (EINVAL) and <= the workspace
 * capacity (EBADLEN). */
mcd_status mcdi_tf_check_ws_n(mcd_workspace *ws, size_t n);

/* Validate and renormalise a composition into out (length n). */
mcd_status mcdi_tf_check_comp(mcd_workspace *ws, size_t n, const double *x,
                              const char *name, double *out);

/* C = A B for m x m row-major matrices (C must not alias A or B). */
void mcdi_tf_matmul(size_t m, const double *A, const double *B, double *C);

/* Matrix exponential E = exp(A) and phi1(A) = sum_k A^k/(k+1)! of an m x m
 * row-major matrix by scaling and squaring (see film.c). On entry slot[0]
 * holds A (destroyed); on return slot[1] = phi1(A), slot[2] = exp(A),
 * slot[0] = free scratch (the three pointers are permuted).
 * Returns MCD_EDOM if the norm of A is not finite or too large, or if the
 * result overflowed. */
mcd_status mcdi_tf_expm_phi(size_t m, double *slot[3]);

/* Film fluxes on validated, normalised inputs (see mcd_film_solve). Uses
 * the film regions of the transfer scratch, its matrices and pivots
 * (tf_layout.h), never the two bulbs' regions. Writes out_N only on
 * success. */
mcd_status mcdi_film_core(mcd_workspace *ws, size_t n, const double *Dij,
                          double c, double L, const double *x0,
                          const double *xL, mcd_film_bootstrap kind,
                          size_t species, const double *values,
                          mcd_film_method method, double *out_N,
                          size_t *out_iterations, double *out_residual);

#endif
