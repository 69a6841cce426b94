/* batch_jac.c - mcd_flux_batch_jacobian: batched fluxes with their
 * composition Jacobians.
 *
 * Each cell is gathered from the SoA arrays (stride K) into an mcd_state
 * in the workspace's batched bank (batch_layout.h, MCDI_JCELL_REGIONS)
 * and computed by the single-state core (flux/tangent.c), which uses the
 * core bank, then scattered back. Equal to K single-state calls to the
 * bit; the batched flux calls are untouched (a caller who does not ask
 * for Jacobians pays nothing). The cost is dominated by the N + 1 flux
 * solves per cell (exact model) or the O(N^3) sums (mixture-averaged),
 * next to which the gather is O(N^2 + N n_dim).
 */
#include <stdio.h>
#include <string.h>

#include "base/mcd_internal.h"
#include "base/checks.h"
#include "base/error.h"
#include "base/workspace.h"
#include "batched/batch.h"
#include "batched/batch_layout.h"
#include "flux/flux_core.h"

/* Cell k of the arrays into g and st (n species, nd directions, K cells). */
static void gather(const mcd_cells *cl, size_t n, const double *M,
                   const double *Dij, const double *c, size_t k,
                   const mcdi_jcell *g, mcd_state *st)
{
    const size_t nd = cl->n_dim, K = cl->n_cells;
    size_t i;
    memset(st, 0, sizeof *st);
    for (i = 0; i < n; i++)
        g->comp[i] = cl->comp[i * K + k];
    for (i = 0; i < n * nd; i++)
        g->grad[i] = cl->grad[i * K + k];
    for (i = 0; i < n * n; i++)
        g->Dij[i] = Dij[i * K + k];
    st->n_species = n;
    st->n_dim = nd;
    st->comp_basis = cl->comp_basis;
    st->c = c[k];
    st->M = M;
    st->Dij = g->Dij;
    st->comp = g->comp;
    st->grad = g->grad;
    if (cl->grad_lnP != NULL) {
        for (i = 0; i < nd; i++)
            g->glnP[i] = cl->grad_lnP[i * K + k];
        st->grad_lnP = g->glnP;
    }
    if (cl->kT != NULL) {
        for (i = 0; i < n; i++)
            g->kT[i] = cl->kT[i * K + k];
        for (i = 0; i < nd; i++)
            g->glnT[i] = cl->grad_lnT[i * K + k];
        st->kT = g->kT;
        st->grad_lnT = g->glnT;
    }
}

mcd_status mcdi_api_flux_batch_jacobian(mcd_workspace *ws, mcd_model model,
                                        size_t n_species, const double *M,
                                        const double *Dij, const double *c,
                                        const mcd_cells *cells,
                                        mcd_basis flux_basis, double *out_flux,
                                        double *out_jac)
{
    const mcd_cells *cl = cells;
    mcdi_jcell g;
    size_t n = n_species, nd, K, k, e;
    mcd_status st;
    if ((st = mcdi_jac_model_ok(model)) != MCD_OK)
        return st;
    if ((st = mcdi_batch_check_common(ws, model, n, cl, flux_basis, out_jac,
                                      "out_jac")) != MCD_OK ||
        (st = mcdi_batch_check_layout(cl, 0, "mcd_flux_batch_jacobian")) !=
            MCD_OK ||
        (st = MCDI_CHECK_PTRS2(Dij, c)) != MCD_OK)
        return st;
    if ((cl->comp_basis == MCD_BASIS_MASS || flux_basis == MCD_BASIS_MASS ||
         cl->grad_lnP != NULL) &&
        (st = mcdi_check_M(ws, n, M)) != MCD_OK)
        return st;
    nd = cl->n_dim;
    K = cl->n_cells;
    mcdi_jcell_carve(ws->batch_mem + MCDI_STREAM_DOUBLES, n, nd, 1, &g);
    for (k = 0; k < K; k++) {
        mcd_state one;
        gather(cl, n, M, Dij, c, k, &g, &one);
        st = mcdi_flux_jacobian_state(ws, model, &one, flux_basis,
                                      out_flux != NULL ? g.flux : NULL, g.jac,
                                      "out_jac");
        if (st != MCD_OK) {
            char msg[MCDI_ERRLEN];
            snprintf(msg, sizeof msg, "%s", mcdi_err_text());
            return mcdi_fail(st, "cell %zu: %s", k, msg);
        }
        for (e = 0; e < n * nd * n; e++)
            out_jac[e * K + k] = g.jac[e];
        if (out_flux != NULL)
            for (e = 0; e < n * nd; e++)
                out_flux[e * K + k] = g.flux[e];
    }
    return MCD_OK;
}
