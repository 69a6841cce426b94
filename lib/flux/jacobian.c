/* jacobian.c - derivatives of the exact Maxwell-Stefan fluxes with respect
 * to the mole fractions (mcd_flux_jacobian_comp).
 *
 * mcd_flux_compute reads its fractions renormalised, x = y / sum y, so
 * the derivative of what it returns with respect to its input y_k is
 *   dJ/dy_k = G_k - sum_j x_j G_j,     G_j = dJ/dx_j,
 * the derivative along e_k - x, which stays on the simplex (at sum y = 1).
 * G_j may be the derivative of any smooth extension of the equations off
 * the simplex; the one used here reads
 *   d_i = sum_{j != i} (x_i J_j - x_j J_i) / (c Đ_ij)        (linear in x)
 *   d_i = s_i - (x_i / sum x) sum_l s_l,
 *   s_i = sum_j Gamma_ij grad x_j + (x_i - w_i) grad ln P + k_T,i grad ln T,
 *   w_i = x_i M_i / sum_l x_l M_l,
 * with Gamma, the gradients, k_T and grad ln T held fixed. Differentiating
 * the first line at fixed d gives the same equations for G_k with the
 * driving force
 *   f_i = dd_i/dx_k - (delta_ik sum_{j != i} J_j / (c Đ_ij)
 *                      - [i != k] J_i / (c Đ_ik)),
 *   dd_i/dx_k = (delta_ik - (delta_ik M_i - w_i M_k) / Mbar - x_i) g_lnP
 *               - (delta_ik - x_i) sum_l s_l,
 * which sums to zero over i (the columns of the Maxwell-Stefan operator
 * sum to zero), so G_k = F(f), F the flux solve of mcd_flux_compute
 * (trace species included). Cost: N + 1 solves of N species.
 */
#include <string.h>

#include "base/mcd_internal.h"
#include "base/checks.h"
#include "base/workspace.h"
#include "flux/flux_core.h"
#include "flux/core_layout.h"

/* The driving force f of column k into f (n x nd), from x, J and the
 * state's forces. */
static void column_force(const mcd_state *s, const mcdi_flux_view *v, size_t k,
                         double *f)
{
    const size_t n = s->n_species, nd = s->n_dim;
    const double *x = v->x, *J = v->jJ, *D = s->Dij;
    double Mbar = 0.0;
    size_t i, j, d;
    if (s->grad_lnP != NULL)
        for (i = 0; i < n; i++)
            Mbar += x[i] * s->M[i];
    for (d = 0; d < nd; d++) {
        double S = 0.0; /* sum of the unprojected forces */
        for (i = 0; i < n; i++) {
            double si = 0.0;
            if (s->Gamma != NULL)
                for (j = 0; j < n; j++)
                    si += s->Gamma[i * n + j] * s->grad[j * nd + d];
            else
                si = s->grad[i * nd + d];
            if (s->grad_lnP != NULL)
                si += (x[i] - x[i] * s->M[i] / Mbar) * s->grad_lnP[d];
            if (s->kT != NULL)
                si += s->kT[i] * s->grad_lnT[d];
            S += si;
        }
        for (i = 0; i < n; i++) {
            const double dik = i == k ? 1.0 : 0.0;
            double fi = -(dik - x[i]) * S, b = 0.0;
            if (s->grad_lnP != NULL) {
                const double wi = x[i] * s->M[i] / Mbar;
                fi += (dik - (dik * s->M[i] - wi * s->M[k]) / Mbar - x[i]) *
                      s->grad_lnP[d];
            }
            if (i == k) {
                for (j = 0; j < n; j++)
                    if (j != i)
                        b += J[j * nd + d] / D[i * n + j];
            } else {
                b = -J[i * nd + d] / D[i * n + k];
            }
            f[i * nd + d] = fi - b / s->c;
        }
    }
}

mcd_status mcdi_api_flux_jacobian_comp(mcd_workspace *ws,
                                       const mcd_state *state, double *out_dJ)
{
    mcdi_flux_view v;
    mcd_state col;
    size_t n, nd, k, e;
    mcd_status st;
    if ((st = mcdi_check_ws_obj(ws, state, "state")) != MCD_OK)
        return st;
    if (state->comp_basis != MCD_BASIS_MOLE)
        return mcdi_fail(MCD_EINVAL,
                         "argument comp_basis: the Jacobian takes mole "
                         "fractions (MCD_BASIS_MOLE) in this version");
    if ((st = mcdi_check_ptr(ws, out_dJ, "out_dJ")) != MCD_OK)
        return st;
    mcdi_flux_scratch(ws, &v);
    /* validates the state, leaves x in v.x */
    st = mcdi_flux_state(ws, MCD_MODEL_MAXWELL_STEFAN, state, MCD_BASIS_MOLE,
                         v.jJ, NULL);
    if (st != MCD_OK)
        return st;
    n = state->n_species;
    nd = state->n_dim;
    if (n == 1) { /* J = 0 whatever x */
        memset(out_dJ, 0, nd * sizeof(double));
        return MCD_OK;
    }
    memset(&col, 0, sizeof col);
    col.n_species = n;
    col.n_dim = nd;
    col.comp_basis = MCD_BASIS_MOLE;
    col.c = state->c;
    col.Dij = state->Dij;
    col.comp = state->comp;
    col.grad = v.jd;
    for (k = 0; k < n; k++) {
        column_force(state, &v, k, v.jd);
        st = mcdi_flux_state(ws, MCD_MODEL_MAXWELL_STEFAN, &col, MCD_BASIS_MOLE,
                             v.jac + k * n * nd, NULL);
        if (st != MCD_OK)
            return st;
    }
    /* dJ/dy_k = G_k - sum_j x_j G_j, in place (column k of entry e at
     * jac[k n nd + e]); checked before anything is written */
    for (e = 0; e < n * nd; e++) {
        double m = 0.0;
        for (k = 0; k < n; k++)
            m += v.x[k] * v.jac[k * n * nd + e];
        for (k = 0; k < n; k++) {
            double *q = &v.jac[k * n * nd + e];
            *q -= m;
            if (!mcdi_finite(*q))
                return mcdi_fail(MCD_EDOM,
                                 "result: dJ/dx of species %zu is not "
                                 "finite (inputs outside the representable "
                                 "range)",
                                 e / nd);
        }
    }
    for (e = 0; e < n * nd; e++)
        for (k = 0; k < n; k++)
            out_dJ[e * n + k] = v.jac[k * n * nd + e];
    return MCD_OK;
}
