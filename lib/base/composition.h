/* composition.h - private composition helpers (mcdi_comp_*) shared by the
 * flux core and the frame conversions. Never installed.
 *
 * Two kinds of helper:
 *  - validators (return mcd_status, write nothing), used by every public
 *    call before it writes an output;
 *  - fast kernels (void / double, no checks at all): the caller has already
 *    validated its inputs. They accept fractions that are normalised or
 *    merely positive-scaled (see each one), and never allocate.
 */
#ifndef MCD_COMPOSITION_H
#define MCD_COMPOSITION_H

#include <stddef.h>
#include "mcdiff.h"
#include "base/lanes.h"

/* ---- validators (write nothing on error) ---------------------------- */

/* Fractions y[0..n-1]: n in 1..MCD_MAX_SPECIES and y != NULL (else EINVAL),
 * every entry finite (else EINVAL), every entry >= 0 (else EDOM),
 * |sum - 1| <= MCD_SUM_TOL (else EDOM). On success *out_sum (may be NULL)
 * receives the sum, by which the caller divides to renormalise.
 * EINVAL takes precedence over EDOM (all entries are scanned for NaN first). */
mcd_status mcdi_comp_check(size_t n, const double *y, double *out_sum);

/* 1 if y is not NULL, 1 <= n <= MCD_MAX_SPECIES and every y_i finite. */
int mcdi_comp_vec_ok(size_t n, const double *y);

/* Finite v (checked by the caller) with every v_i >= 0 and a positive
 * finite sum, written to *out_sum; EDOM otherwise (nothing written). */
mcd_status mcdi_comp_nonneg_total(size_t n, const double *v, double *out_sum);

/* Molar masses: M != NULL and finite (EINVAL), > 0 (EDOM). */
mcd_status mcdi_comp_check_M(size_t n, const double *M);

/* n x n_dim array: p != NULL, n_dim in 1..MCD_MAX_DIM, all entries finite
 * (EINVAL otherwise). n is assumed already checked. */
mcd_status mcdi_comp_check_field(size_t n, size_t n_dim, const double *p);

/* ---- fast kernels (no validation) ----------------------------------- */

/* out[i] = y[i] / sum(y). y and out may alias. Requires sum(y) > 0. */
void mcdi_comp_scale_to_one(size_t n, const double *y, double *out);

/* sum x_i M_i / sum x_i (exact for unnormalised x). */
double mcdi_comp_mbar_x(size_t n, const double *M, const double *x);

/* 1 / (sum w_i / M_i / sum w_i) (exact for unnormalised w). */
double mcdi_comp_mbar_w(size_t n, const double *M, const double *w);

/* w_i = x_i M_i / sum_k x_k M_k; returns sum_k x_k M_k / sum_k x_k (Mbar).
 * x need only be non-negative with a positive sum. out_w may not alias x. */
double mcdi_comp_x_to_w(size_t n, const double *M, const double *x,
                        double *out_w);

/* x_i = (w_i/M_i) / sum_k (w_k/M_k); returns Mbar. Same conditions. */
double mcdi_comp_w_to_x(size_t n, const double *M, const double *w,
                        double *out_x);

/* Exact differential of the map x -> w (including renormalisation):
 *   dw_i = (M_i / S)(dx_i - x_i dS / S),  S = sum x_k M_k, dS = sum M_k dx_k.
 * grad arrays n x n_dim (row = species). out may not alias grad_x.
 * The result sums to zero over species exactly in exact arithmetic. */
void mcdi_comp_grad_x_to_w(size_t n, size_t n_dim, const double *M,
                           const double *x, const double *grad_x,
                           double *out_grad_w);

/* x_i = (w_i / M_i) / sum_k w_k / M_k and w_i = x_i M_i / sum_k x_k M_k
 * from normalised fractions, on rows of L lanes (base/lanes.h): the one
 * implementation, run with L = 1 by mcdi_comp_w_to_x / _x_to_w and with
 * its lanes by the batched kernel. */
KINLINE void mcdi_basis_lanes(const size_t n, const size_t L, const double *M,
                              const int to_x, const double *restrict y,
                              double *restrict out)
{
    double s[MCDI_LANES];
    size_t i, l;
    for_lanes (l)
        s[l] = 0.0;
    for (i = 0; i < n; i++)
        for_lanes (l)
            s[l] += to_x ? y[i * L + l] / M[i] : y[i * L + l] * M[i];
    for (i = 0; i < n; i++)
        for_lanes (l)
            out[i * L + l] =
                (to_x ? y[i * L + l] / M[i] : y[i * L + l] * M[i]) / s[l];
}

KINLINE void mcdi_w_to_x_lanes(const size_t n, const size_t L, const double *M,
                               const double *restrict w, double *restrict x)
{
    mcdi_basis_lanes(n, L, M, 1, w, x);
}

KINLINE void mcdi_x_to_w_lanes(const size_t n, const size_t L, const double *M,
                               const double *restrict x, double *restrict w)
{
    mcdi_basis_lanes(n, L, M, 0, x, w);
}

/* Exact differential of the map w -> x:
 *   dx_i = (1/(M_i S))(dw_i - w_i dS / S),  S = sum w_k/M_k,
 *   dS = sum dw_k / M_k,
 * on rows of L lanes (base/lanes.h): mass-fraction gradients g in,
 * mole-fraction gradients out (out may be g: each entry is read before
 * it is written). The one implementation: the single-state calls run it
 * with L = 1 (mcdi_comp_grad_w_to_x), the batched kernel with its lanes. */
KINLINE void mcdi_grad_w_to_x_lanes(const size_t n, const size_t L,
                                    const size_t nd, const double *M,
                                    const double *restrict w, const double *g,
                                    double *out)
{
    double S[MCDI_LANES], r[MCDI_LANES];
    size_t i, dd, l;
    for_lanes (l)
        S[l] = 0.0;
    for (i = 0; i < n; i++)
        for_lanes (l)
            S[l] += w[i * L + l] / M[i];
    for (dd = 0; dd < nd; dd++) {
        for_lanes (l)
            r[l] = 0.0;
        for (i = 0; i < n; i++)
            for_lanes (l)
                r[l] += g[(i * nd + dd) * L + l] / M[i];
        for_lanes (l)
            r[l] = r[l] / S[l];
        for (i = 0; i < n; i++)
            for_lanes (l)
                out[(i * nd + dd) * L + l] =
                    (g[(i * nd + dd) * L + l] - w[i * L + l] * r[l]) /
                    (M[i] * S[l]);
    }
}

/* The same for one state (L = 1). */
void mcdi_comp_grad_w_to_x(size_t n, size_t n_dim, const double *M,
                           const double *w, const double *grad_w,
                           double *out_grad_x);

#endif
