/* composition.c - mole fractions, mass fractions, concentrations.
 *
 * Notation (see the header): x_i mole fractions, w_i mass fractions, M_i
 * molar masses [kg/mol], Mbar = sum x_i M_i = 1 / sum (w_i / M_i),
 * c total molar concentration [mol/m^3], c_i = c x_i.
 *
 * Validation and renormalisation (every public call here):
 *   - n in 1..MCD_MAX_SPECIES and non-NULL pointers, else MCD_EINVAL;
 *   - every entry finite, else MCD_EINVAL (checked for all entries before
 *     any domain test, so NaN anywhere gives EINVAL);
 *   - every entry >= 0 (-0.0 is accepted), else MCD_EDOM;
 *   - |sum - 1| <= MCD_SUM_TOL, else MCD_EDOM;
 *   - the fractions are then divided by their sum. The conversions below
 *     are homogeneous of degree zero in the fractions, so they are evaluated
 *     directly on the caller's values and the renormalisation is implied
 *     exactly (no intermediate copy, no allocation).
 * Outputs are written only after all validation has passed.
 *
 * Gradients: the maps x -> w and w -> x are differentiated exactly,
 * including the renormalisation (the derivative of the degree-zero map), so
 * that grad w computed here is the true gradient of the w field that the
 * caller's x field represents, and sums to zero over species whatever the
 * sum of the given grad x rows. With S = sum_k x_k M_k:
 *   dw_i = (M_i / S) (dx_i - x_i dS / S),      dS = sum_k M_k dx_k,
 * and with T = sum_k w_k / M_k:
 *   dx_i = (1 / (M_i T)) (dw_i - w_i dT / T),  dT = sum_k dw_k / M_k.
 * For normalised x these are the usual dw_i = (M_i/Mbar)(dx_i - x_i dMbar /
 * Mbar) (Bird, Stewart and Lightfoot, Transport Phenomena, 2nd ed., 2002,
 * ch. 17, from memory). Conditioning: all terms are sums of
 * non-negative products except the bracket, whose cancellation is bounded by
 * the size of the gradients themselves; relative round-off ~ N eps.
 */
#include <string.h>
#include "base/mcd_internal.h"
#include "base/composition.h"

/* ------------------------------------------------------------------ */
/* validators                                                           */
/* ------------------------------------------------------------------ */

int mcdi_comp_vec_ok(size_t n, const double *y)
{
    size_t i;
    if (y == NULL || n < 1 || n > MCD_MAX_SPECIES)
        return 0;
    for (i = 0; i < n; i++)
        if (!mcdi_finite(y[i]))
            return 0;
    return 1;
}

mcd_status mcdi_comp_check(size_t n, const double *y, double *out_sum)
{
    double s = 0.0;
    size_t i;
    if (!mcdi_comp_vec_ok(n, y))
        return MCD_EINVAL;
    for (i = 0; i < n; i++) {
        if (!(y[i] >= 0.0))
            return MCD_EDOM;
        s += y[i];
    }
    if (!(fabs(s - 1.0) <= MCD_SUM_TOL))
        return MCD_EDOM;
    if (out_sum != NULL)
        *out_sum = s;
    return MCD_OK;
}

mcd_status mcdi_comp_nonneg_total(size_t n, const double *v, double *out_sum)
{
    double s = 0.0;
    size_t i;
    for (i = 0; i < n; i++) {
        if (!(v[i] >= 0.0))
            return MCD_EDOM;
        s += v[i];
    }
    if (!(s > 0.0) || !mcdi_finite(s))
        return MCD_EDOM;
    *out_sum = s;
    return MCD_OK;
}

mcd_status mcdi_comp_check_M(size_t n, const double *M)
{
    size_t i;
    if (!mcdi_comp_vec_ok(n, M))
        return MCD_EINVAL;
    for (i = 0; i < n; i++)
        if (!(M[i] > 0.0))
            return MCD_EDOM;
    return MCD_OK;
}

mcd_status mcdi_comp_check_field(size_t n, size_t n_dim, const double *p)
{
    size_t i;
    if (p == NULL || n_dim < 1 || n_dim > MCD_MAX_DIM)
        return MCD_EINVAL;
    for (i = 0; i < n * n_dim; i++)
        if (!mcdi_finite(p[i]))
            return MCD_EINVAL;
    return MCD_OK;
}

/* ------------------------------------------------------------------ */
/* fast kernels                                                         */
/* ------------------------------------------------------------------ */

void mcdi_comp_scale_to_one(size_t n, const double *y, double *out)
{
    double s = 0.0;
    size_t i;
    for (i = 0; i < n; i++)
        s += y[i];
    for (i = 0; i < n; i++)
        out[i] = y[i] / s;
}

double mcdi_comp_mbar_x(size_t n, const double *M, const double *x)
{
    double sxm = 0.0, sx = 0.0;
    size_t i;
    for (i = 0; i < n; i++) {
        sxm += x[i] * M[i];
        sx += x[i];
    }
    return sxm / sx;
}

double mcdi_comp_mbar_w(size_t n, const double *M, const double *w)
{
    double swm = 0.0, sw = 0.0;
    size_t i;
    for (i = 0; i < n; i++) {
        swm += w[i] / M[i];
        sw += w[i];
    }
    return sw / swm;
}

double mcdi_comp_x_to_w(size_t n, const double *M, const double *x,
                        double *out_w)
{
    const double mbar = mcdi_comp_mbar_x(n, M, x);
    mcdi_x_to_w_lanes(n, 1, M, x, out_w);
    return mbar;
}

double mcdi_comp_w_to_x(size_t n, const double *M, const double *w,
                        double *out_x)
{
    const double mbar = mcdi_comp_mbar_w(n, M, w);
    mcdi_w_to_x_lanes(n, 1, M, w, out_x);
    return mbar;
}

void mcdi_comp_grad_x_to_w(size_t n, size_t n_dim, const double *M,
                           const double *x, const double *grad_x,
                           double *out_grad_w)
{
    double S = 0.0;
    size_t i, d;
    for (i = 0; i < n; i++)
        S += x[i] * M[i];
    for (d = 0; d < n_dim; d++) {
        double dS = 0.0, r;
        for (i = 0; i < n; i++)
            dS += M[i] * grad_x[i * n_dim + d];
        r = dS / S;
        for (i = 0; i < n; i++)
            out_grad_w[i * n_dim + d] =
                (M[i] / S) * (grad_x[i * n_dim + d] - x[i] * r);
    }
}

void mcdi_comp_grad_w_to_x(size_t n, size_t n_dim, const double *M,
                           const double *w, const double *grad_w,
                           double *out_grad_x)
{
    mcdi_grad_w_to_x_lanes(n, 1, n_dim, M, w, grad_w, out_grad_x);
}

/* ------------------------------------------------------------------ */
/* public API                                                           */
/* ------------------------------------------------------------------ */

mcd_status mcdi_api_comp_normalize(size_t n, const double *y, double *out_y)
{
    mcd_status st;
    if (out_y == NULL)
        return MCD_EINVAL;
    st = mcdi_comp_check(n, y, NULL);
    if (st != MCD_OK)
        return st;
    mcdi_comp_scale_to_one(n, y, out_y); /* aliasing y == out_y is fine */
    return MCD_OK;
}

/* Validate (M, y) in the order: pointers and n, then M, then y. */
static mcd_status check_M_y(size_t n, const double *M, const double *y,
                            const void *out)
{
    mcd_status st;
    if (out == NULL || M == NULL || y == NULL || n < 1 || n > MCD_MAX_SPECIES)
        return MCD_EINVAL;
    /* All NaN tests before all domain tests, across both arrays. */
    for (size_t i = 0; i < n; i++)
        if (!mcdi_finite(M[i]) || !mcdi_finite(y[i]))
            return MCD_EINVAL;
    st = mcdi_comp_check_M(n, M);
    if (st != MCD_OK)
        return st;
    return mcdi_comp_check(n, y, NULL);
}

/* The four calls on (M, y): the same checks, then one conversion. */
typedef enum { M_Y_X_TO_W, M_Y_W_TO_X, M_Y_MBAR_X, M_Y_MBAR_W } m_y_op;

static mcd_status on_M_y(m_y_op op, size_t n, const double *M, const double *y,
                         double *out)
{
    mcd_status st = check_M_y(n, M, y, out);
    if (st != MCD_OK)
        return st;
    switch (op) {
    case M_Y_X_TO_W: (void)mcdi_comp_x_to_w(n, M, y, out); break;
    case M_Y_W_TO_X: (void)mcdi_comp_w_to_x(n, M, y, out); break;
    case M_Y_MBAR_X: *out = mcdi_comp_mbar_x(n, M, y); break;
    case M_Y_MBAR_W: *out = mcdi_comp_mbar_w(n, M, y); break;
    }
    return MCD_OK;
}

mcd_status mcdi_api_comp_x_to_w(size_t n, const double *M, const double *x,
                                double *out_w)
{
    return on_M_y(M_Y_X_TO_W, n, M, x, out_w);
}

mcd_status mcdi_api_comp_w_to_x(size_t n, const double *M, const double *w,
                                double *out_x)
{
    return on_M_y(M_Y_W_TO_X, n, M, w, out_x);
}

mcd_status mcdi_api_comp_mean_molar_mass_x(size_t n, const double *M,
                                           const double *x, double *out_Mbar)
{
    return on_M_y(M_Y_MBAR_X, n, M, x, out_Mbar);
}

mcd_status mcdi_api_comp_mean_molar_mass_w(size_t n, const double *M,
                                           const double *w, double *out_Mbar)
{
    return on_M_y(M_Y_MBAR_W, n, M, w, out_Mbar);
}

mcd_status mcdi_api_comp_x_to_c(size_t n, double c_total, const double *x,
                                double *out_c)
{
    double s;
    mcd_status st;
    size_t i;
    if (out_c == NULL || !mcdi_finite(c_total))
        return MCD_EINVAL;
    st = mcdi_comp_check(n, x, &s);
    if (st != MCD_OK)
        return st;
    if (!(c_total > 0.0))
        return MCD_EDOM;
    for (i = 0; i < n; i++)
        out_c[i] = c_total * (x[i] / s);
    return MCD_OK;
}

/* Concentrations -> fractions: no sum condition, but each c_i >= 0 and the
 * total must be positive and finite (a sum that overflows is EDOM). */
mcd_status mcdi_api_comp_c_to_x(size_t n, const double *c, double *out_x,
                                double *out_c_total)
{
    double s;
    size_t i;
    if (c == NULL || out_x == NULL || out_c_total == NULL || n < 1 ||
        n > MCD_MAX_SPECIES)
        return MCD_EINVAL;
    for (i = 0; i < n; i++)
        if (!mcdi_finite(c[i]))
            return MCD_EINVAL;
    if (mcdi_comp_nonneg_total(n, c, &s) != MCD_OK)
        return MCD_EDOM;
    for (i = 0; i < n; i++)
        out_x[i] = c[i] / s;
    *out_c_total = s;
    return MCD_OK;
}

/* Ideal gas: c = P / (R T), R = MCD_GAS_CONSTANT (CODATA 2018, exact). */
mcd_status mcdi_api_comp_ideal_gas_c(double T, double P, double *out_c)
{
    double c;
    if (out_c == NULL || !mcdi_finite(T) || !mcdi_finite(P))
        return MCD_EINVAL;
    if (!(T > 0.0) || !(P > 0.0))
        return MCD_EDOM;
    c = P / (MCD_GAS_CONSTANT * T);
    if (!mcdi_finite(c) || !(c > 0.0)) /* overflow/underflow at extremes */
        return MCD_EDOM;
    *out_c = c;
    return MCD_OK;
}

/* Shared validation of the gradient conversions. */
static mcd_status check_grad(size_t n, size_t n_dim, const double *M,
                             const double *y, const double *grad,
                             const double *out)
{
    mcd_status st;
    if (out == NULL || grad == NULL || n_dim < 1 || n_dim > MCD_MAX_DIM)
        return MCD_EINVAL;
    if (M == NULL || y == NULL || n < 1 || n > MCD_MAX_SPECIES)
        return MCD_EINVAL;
    st = mcdi_comp_check_field(n, n_dim, grad);
    if (st != MCD_OK)
        return st;
    return check_M_y(n, M, y, out);
}

/* Both gradient conversions: the same checks, then one of them. */
static mcd_status on_grad(int to_x, size_t n, size_t n_dim, const double *M,
                          const double *y, const double *grad, double *out)
{
    mcd_status st = check_grad(n, n_dim, M, y, grad, out);
    if (st != MCD_OK)
        return st;
    if (to_x)
        mcdi_comp_grad_w_to_x(n, n_dim, M, y, grad, out);
    else
        mcdi_comp_grad_x_to_w(n, n_dim, M, y, grad, out);
    return MCD_OK;
}

mcd_status mcdi_api_comp_grad_x_to_w(size_t n, size_t n_dim, const double *M,
                                     const double *x, const double *grad_x,
                                     double *out_grad_w)
{
    return on_grad(0, n, n_dim, M, x, grad_x, out_grad_w);
}

mcd_status mcdi_api_comp_grad_w_to_x(size_t n, size_t n_dim, const double *M,
                                     const double *w, const double *grad_w,
                                     double *out_grad_x)
{
    return on_grad(1, n, n_dim, M, w, grad_w, out_grad_x);
}
