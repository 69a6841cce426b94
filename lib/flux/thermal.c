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
