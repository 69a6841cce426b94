/* thermal.c - thermal diffusion ratios from thermal diffusion coefficients
 * (mcd_thermal_ratios).
 *
 * The Maxwell-Stefan equations with thermal diffusion (Hirschfelder,
 * Curtiss and Bird 1954, sec. 7.4; Taylor and Krishna 1993, sec. 2.3):
 *   d_i = -sum_{j != i} (x_i x_j / Đ_ij)
 *         (v_i - v_j + (D_i^T / rho_i - D_j^T / rho_j) grad ln T).
 * Moving the thermal part to the left gives the ordinary equations with
 * the driving force d_i + k_T,i grad ln T, which is how every flux path
 * takes it (flux/stages.h), with
 *   k_T,i = sum_{j != i} (x_i x_j / Đ_ij) (D_i^T / rho_i - D_j^T / rho_j)
 *         = (1/c) sum_{j != i} (x_j D_i^T / M_i - x_i D_j^T / M_j) / Đ_ij,
 * using rho_i = c x_i M_i: no division by x_i, so trace species are
 * regular. The terms are antisymmetric in (i, j), so sum_i k_T,i = 0 up
 * to round-off.
 *
 * Why it is the usual mass-flux form: with u_i = v_i + D_i^T grad ln T /
 * rho_i the equations are the ordinary ones in u, whose mass fluxes
 * j'_i = rho_i (u_i - v) sum to sum_i D_i^T grad ln T = 0; by uniqueness
 * j' is the ordinary solution and j_i = j'_i - D_i^T grad ln T (Bird,
 * Stewart and Lightfoot 2002, sec. 24.2). tests/test_thermal.c checks
 * this identity through mcd_flux_compute. It needs sum_i D_i^T = 0
 * exactly, so the caller's D^T is first projected by D_i^T -= w_i sum_k
 * D_k^T (weights w: a trace species keeps its value).
 */
#include <string.h>

#include "base/mcd_internal.h"
#include "base/checks.h"
#include "base/workspace.h"
#include "flux/flux_core.h"
#include "flux/core_layout.h"

static mcd_status check_ratios(mcd_workspace *ws, const mcd_state *s,
                               const double *DT, const double *out_kT)
{
    const size_t n = s->n_species;
    mcd_status st;
    if ((st = mcdi_check_species(ws, n, 1, 0, "n_species")) != MCD_OK ||
        (st = mcdi_check_basis(ws, s->comp_basis, "comp_basis")) != MCD_OK ||
        (st = MCDI_CHECK_PTRS2(DT, out_kT)) != MCD_OK ||
        (st = mcdi_check_conc(ws, s->c, "c")) != MCD_OK ||
        (st = mcdi_check_M(ws, n, s->M)) != MCD_OK ||
        (st = mcdi_check_dij(ws, n, s->Dij)) != MCD_OK ||
        (st = mcdi_check_comp(ws, n, s->comp, "comp")) != MCD_OK)
        return st;
    return mcdi_check_finite_vec(ws, n, DT, "DT");
}

mcd_status mcdi_api_thermal_ratios(mcd_workspace *ws, const mcd_state *state,
                                   const double *DT, double *out_kT)
{
    mcdi_flux_view v;
    double sum = 0.0;
    size_t n, i, j;
    mcd_status st;
    if ((st = mcdi_check_ws_obj(ws, state, "state")) != MCD_OK)
        return st;
    if ((st = check_ratios(ws, state, DT, out_kT)) != MCD_OK)
        return st;
    n = state->n_species;
    mcdi_flux_scratch(ws, &v);
    mcdi_flux_fractions(n, state->M, state->comp_basis, state->comp, v.x, v.w);
    for (i = 0; i < n; i++)
        sum += DT[i];
    for (i = 0; i < n; i++)
        v.DT[i] = DT[i] - v.w[i] * sum;
    for (i = 0; i < n; i++) {
        const double *Di = state->Dij + i * n;
        const double ai = v.DT[i] / state->M[i];
        double k = 0.0;
        for (j = 0; j < n; j++)
            if (j != i)
                k += (v.x[j] * ai - v.x[i] * v.DT[j] / state->M[j]) / Di[j];
        v.kT[i] = k / state->c;
        if (!mcdi_finite(v.kT[i]))
            return mcdi_fail(MCD_EDOM,
                             "result: k_T of species %zu is not finite "
                             "(inputs outside the representable range)",
                             i);
    }
    memcpy(out_kT, v.kT, n * sizeof(double));
    return MCD_OK;
}

/*
 * Dufour heat flux (mcd_dufour_heat_flux): the reciprocal of thermal
 * diffusion, from the linear laws of irreversible thermodynamics (de Groot
 * and Mazur 1962, ch. 11; Hirschfelder, Curtiss and Bird 1954, sec. 7.4;
 * derived here, from memory of the method). For an ideal gas the entropy
 * production is
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
 */
mcd_status mcdi_api_dufour_heat_flux(size_t n_species, size_t n_dim,
                                     const double *x, const double *M,
                                     const double *theta, double T,
                                     mcd_basis flux_basis, const double *flux,
                                     double *out_q)
{
    const size_t n = n_species;
    double q[MCD_MAX_DIM], mean = 0.0, sum = 0.0;
    size_t i, d;
    mcd_status st;
    if (n < 1 || n > MCD_MAX_SPECIES)
        return mcdi_fail(MCD_EINVAL, "argument n_species: %zu is not in 1..%d",
                         n, MCD_MAX_SPECIES);
    if ((st = MCDI_CHECK_PTRS3(x, theta, flux)) != MCD_OK ||
        (st = mcdi_check_ptr(NULL, out_q, "out_q")) != MCD_OK ||
        (st = mcdi_check_dim(NULL, n_dim)) != MCD_OK ||
        (st = mcdi_check_basis(NULL, flux_basis, "flux_basis")) != MCD_OK ||
        (st = mcdi_check_positive(NULL, T, "T")) != MCD_OK ||
        (st = mcdi_check_comp(NULL, n, x, "x")) != MCD_OK ||
        (st = mcdi_check_finite_vec(NULL, n, theta, "theta")) != MCD_OK ||
        (st = mcdi_check_finite_vec(NULL, n * n_dim, flux, "flux")) != MCD_OK)
        return st;
    if (flux_basis == MCD_BASIS_MASS &&
        (st = mcdi_check_M(NULL, n, M)) != MCD_OK)
        return st;
    for (i = 0; i < n; i++)
        sum += x[i];
    for (i = 0; i < n; i++)
        mean += x[i] / sum * theta[i];
    for (d = 0; d < n_dim; d++)
        q[d] = 0.0;
    for (i = 0; i < n; i++) {
        double f = MCD_GAS_CONSTANT * T * (theta[i] - mean);
        if (flux_basis == MCD_BASIS_MASS)
            f /= M[i];
        for (d = 0; d < n_dim; d++)
            q[d] += f * flux[i * n_dim + d];
    }
    for (d = 0; d < n_dim; d++)
        if (!mcdi_finite(q[d]))
            return mcdi_fail(MCD_EDOM, "result: the heat flux is not finite "
                                       "(inputs outside the representable "
                                       "range)");
    memcpy(out_q, q, n_dim * sizeof(double));
    return MCD_OK;
}
