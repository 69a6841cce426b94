/* dufour.c - the Dufour heat flux of one state (mcd_dufour_heat_flux)
 * and of many cells (mcd_dufour_heat_flux_batch), from fluxes already
 * solved.
 *
 * The reciprocal of thermal diffusion, from the linear laws of
 * irreversible thermodynamics (de Groot and Mazur 1962, ch. 11;
 * Hirschfelder, Curtiss and Bird 1954, sec. 7.4; derived here, from
 * memory of the method). For an ideal gas the entropy production is
 *   T sigma = q' . X_0 + sum_i F_i . u_i,   X_0 = -grad ln T,
 *   F_i = -p d_i (sum_i F_i = 0), u_i = v_i - v (any reference v),
 * with q' the heat flux less the enthalpy carried by diffusion. The
 * Maxwell-Stefan equations with thermal diffusion are the resistance laws
 *   F_i = sum_j K_ij u_j - p k_T,i X_0,  K_ij symmetric (p x_i x_j / Đ_ij
 *   off the diagonal), so p k_T,i is the coefficient of X_0 in the force
 * on species i when the fluxes are held. Writing the conductance laws
 * u = L F + l X_0, q' = l^T F + L_00 X_0 (Onsager: L symmetric, one l in
 * both) and eliminating F gives F = K u - K l X_0 and
 *   q' = (K l)^T u + (L_00 - l^T K l) X_0,  K l = p k_T,
 * so the heat flux that the diffusion fluxes carry is
 *   q_D = p sum_i k_T,i u_i = R T sum_i (k_T,i / x_i) J_i
 * (J_i = c x_i u_i molar fluxes; the rest of q' is -lambda grad T). It
 * does not depend on the reference velocity because sum_i k_T,i = 0. With
 * theta_i = k_T,i / x_i, finite for a trace species (k_T,i ~ x_i), and the
 * projection k_T,i -= x_i sum_k k_T,k that the flux path applies
 * (theta_i -= sum_k x_k theta_k):
 *   mole fluxes J_i (sum zero):          q_D = R T sum_i theta_i J_i,
 *   mass fluxes j_i = rho_i (v_i - v):    q_D = R T sum_i theta'_i j_i / M_i,
 * both the same number for one state. tests/test_thermal_kt.c checks the
 * reciprocity sum_i F^a_i . u^b_i = q_D^a . X_0^b between a state a with
 * composition gradients only and a state b with a temperature gradient
 * only, over random states with trace species.
 *
 * Both calls run the same function on one state (dufour_state, entries
 * s apart: s = 1 for the single state, K for a cell of the SoA arrays),
 * so a batched cell equals the single-state call to the bit
 * (tests/test_thermal_kt.c). The batched call checks and computes every
 * cell before it writes any output (a second pass stores), so a failing
 * cell leaves out_q untouched; the work is O(N n_dim) a cell, far below
 * the flux solve that produced the fluxes.
 */
#include <stdio.h>
#include <string.h>

#include "base/mcd_internal.h"
#include "base/checks.h"
#include "base/error.h"

/* q[d] of one state; entries of x, theta at [i s], of flux at
 * [(i nd + d) s]. Returns 0 when every q[d] is finite. */
static int dufour_state(size_t n, size_t nd, const double *x, const double *M,
                        const double *theta, double T, mcd_basis flux_basis,
                        const double *flux, size_t s, double *q)
{
    double mean = 0.0, sum = 0.0;
    size_t i, d;
    int bad = 0;
    for (i = 0; i < n; i++)
        sum += x[i * s];
    for (i = 0; i < n; i++)
        mean += x[i * s] / sum * theta[i * s];
    for (d = 0; d < nd; d++)
        q[d] = 0.0;
    for (i = 0; i < n; i++) {
        double f = MCD_GAS_CONSTANT * T * (theta[i * s] - mean);
        if (flux_basis == MCD_BASIS_MASS)
            f /= M[i];
        for (d = 0; d < nd; d++)
            q[d] += f * flux[(i * nd + d) * s];
    }
    for (d = 0; d < nd; d++)
        bad |= !mcdi_finite(q[d]);
    return bad;
}

static mcd_status not_finite(void)
{
    return mcdi_fail(MCD_EDOM, "result: the heat flux is not finite "
                               "(inputs outside the representable range)");
}

/* The checks of both calls that do not depend on the cell. */
static mcd_status check_common(size_t n, size_t n_dim, const double *M,
                               mcd_basis flux_basis)
{
    mcd_status st;
    if ((st = mcdi_check_dim(NULL, n_dim)) != MCD_OK ||
        (st = mcdi_check_basis(NULL, flux_basis, "flux_basis")) != MCD_OK)
        return st;
    if (flux_basis == MCD_BASIS_MASS)
        return mcdi_check_M(NULL, n, M);
    return MCD_OK;
}

static mcd_status check_count(size_t n)
{
    if (n < 1 || n > MCD_MAX_SPECIES)
        return mcdi_fail(MCD_EINVAL, "argument n_species: %zu is not in 1..%d",
                         n, MCD_MAX_SPECIES);
    return MCD_OK;
}

mcd_status mcdi_api_dufour_heat_flux(size_t n_species, size_t n_dim,
                                     const double *x, const double *M,
                                     const double *theta, double T,
                                     mcd_basis flux_basis, const double *flux,
                                     double *out_q)
{
    const size_t n = n_species;
    double q[MCD_MAX_DIM];
    mcd_status st;
    if ((st = check_count(n)) != MCD_OK ||
        (st = MCDI_CHECK_PTRS3(x, theta, flux)) != MCD_OK ||
        (st = mcdi_check_ptr(NULL, out_q, "out_q")) != MCD_OK ||
        (st = mcdi_check_dim(NULL, n_dim)) != MCD_OK ||
        (st = mcdi_check_basis(NULL, flux_basis, "flux_basis")) != MCD_OK ||
        (st = mcdi_check_positive(NULL, T, "T")) != MCD_OK ||
        (st = mcdi_check_comp(NULL, n, x, "x")) != MCD_OK ||
        (st = mcdi_check_finite_vec(NULL, n, theta, "theta")) != MCD_OK ||
        (st = mcdi_check_finite_vec(NULL, n * n_dim, flux, "flux")) != MCD_OK)
        return st;
    if ((st = check_common(n, n_dim, M, flux_basis)) != MCD_OK)
        return st;
    if (dufour_state(n, n_dim, x, M, theta, T, flux_basis, flux, 1, q))
        return not_finite();
    memcpy(out_q, q, n_dim * sizeof(double));
    return MCD_OK;
}

/* Cell k's inputs, with the single-state call's rules and words. */
static mcd_status check_cell(size_t n, size_t nd, size_t K, size_t k,
                             const double *x, const double *theta,
                             const double *T, const double *flux)
{
    mcd_status st;
    if ((st = mcdi_check_positive(NULL, T[k], "T")) != MCD_OK ||
        (st = mcdi_check_comp_strided(NULL, n, x + k, K, "x")) != MCD_OK ||
        (st = mcdi_check_finite_vec_strided(NULL, n, theta + k, K, "theta")) !=
            MCD_OK ||
        (st = mcdi_check_finite_vec_strided(NULL, n * nd, flux + k, K,
                                            "flux")) != MCD_OK)
        return st;
    return MCD_OK;
}

mcd_status mcdi_api_dufour_heat_flux_batch(size_t n_species, size_t n_cells,
                                           size_t n_dim, const double *x,
                                           const double *M, const double *theta,
                                           const double *T,
                                           mcd_basis flux_basis,
                                           const double *flux, double *out_q)
{
    const size_t n = n_species, K = n_cells;
    double q[MCD_MAX_DIM];
    size_t k, d;
    mcd_status st;
    if ((st = check_count(n)) != MCD_OK ||
        (st = MCDI_CHECK_PTRS3(x, theta, T)) != MCD_OK ||
        (st = mcdi_check_ptr(NULL, flux, "flux")) != MCD_OK ||
        (st = mcdi_check_ptr(NULL, out_q, "out_q")) != MCD_OK ||
        (st = check_common(n, n_dim, M, flux_basis)) != MCD_OK)
        return st;
    for (k = 0; k < K; k++) { /* check and compute, write nothing */
        st = check_cell(n, n_dim, K, k, x, theta, T, flux);
        if (st == MCD_OK && dufour_state(n, n_dim, x + k, M, theta + k, T[k],
                                         flux_basis, flux + k, K, q))
            st = not_finite();
        if (st != MCD_OK) {
            char msg[MCDI_ERRLEN];
            snprintf(msg, sizeof msg, "%s", mcdi_err_text());
            return mcdi_fail(st, "cell %zu: %s", k, msg);
        }
    }
    for (k = 0; k < K; k++) { /* every cell is good: store */
        dufour_state(n, n_dim, x + k, M, theta + k, T[k], flux_basis, flux + k,
                     K, q);
        for (d = 0; d < n_dim; d++)
            out_q[d * K + k] = q[d];
    }
    return MCD_OK;
}
