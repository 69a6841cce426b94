/* liquid_batch.c - mcd_liquid_flux_batch: diffusion fluxes of a liquid
 * at many cells (SoA layout of the batched calls), each with its own
 * temperature, composition and gradients.
 *
 * Per cell: the liquid's thermodynamic factor Gamma and Vignes /
 * Kooijman-Taylor Đ_ij at (T_k, x_k) (liquid/liq_eval.c,
 * mcdi_liquid_state), then the single-state flux core
 * (flux/maxwell_stefan.c, mcdi_flux_state) on the Maxwell-Stefan
 * equations d_i = sum_j Gamma_ij grad x_j (+ k_T,i grad ln T) =
 * sum_{j != i} (x_i J_j - x_j J_i) / (c Đ_ij). With partial molar
 * volumes the molar fluxes are moved to the volume-average velocity,
 * J^V_i = J_i - c x_i sum_k Vbar_k J_k (flux/frames.c, the public
 * mcd_flux_to_volume_frame's code), and on the mass basis reported as
 * M_i J^V_i. Each cell equals the single-state route (mcd_liquid_eval,
 * mcd_flux_compute, mcd_flux_to_volume_frame) to round-off.
 *
 * Two passes over the cells: the first checks every cell's inputs (cheap:
 * no activity model), so that bad input fails before anything is
 * written; the second evaluates the liquid, solves and stores cell by
 * cell. A cell whose liquid is not stable is found in the second pass
 * (the stability test is part of the activity evaluation): the cells
 * before it are then written, as in the other batched calls. (An
 * earlier version also ran the activity model in the first pass, to
 * leave everything untouched on an unstable cell; that cost up to 2.8x
 * the single-state loop, measured, and was dropped.)
 *
 * Here (api layer) because it uses both the liquid and the flux layers,
 * which are of one rank. One cell is gathered from the SoA arrays into
 * the cell regions of the liquid bank (liquid/liq_layout.h); the
 * activity model uses the bank's eval regions and the flux core its own
 * bank, so nothing overlaps and nothing is allocated.
 */
#include <math.h>
#include <stdio.h>
#include <string.h>

#include "base/mcd_internal.h"
#include "base/checks.h"
#include "base/composition.h"
#include "batched/batch.h"
#include "flux/flux_core.h"
#include "liquid/liq_layout.h"
#include "liquid/liquid.h"

/* The arguments of one call. */
typedef struct lb_call {
    const mcd_liquid *liq;
    mcd_model model;
    const double *T, *c, *M, *Vbar;
    const mcd_cells *cl;
    mcd_basis fb;
    size_t n, nd, K;
} lb_call;

/* Cell k of the caller's arrays (stride K) into g; its normalised mole
 * fractions into g->x (the fractions already checked). */
static void gather(const lb_call *a, size_t k, const mcdi_lcell *g)
{
    const mcd_cells *cl = a->cl;
    const size_t n = a->n, nd = a->nd, K = a->K;
    size_t i;
    for (i = 0; i < n; i++)
        g->comp[i] = cl->comp[i * K + k];
    for (i = 0; i < n * nd; i++)
        g->grad[i] = cl->grad[i * K + k];
    if (cl->kT != NULL) {
        for (i = 0; i < n; i++)
            g->kT[i] = cl->kT[i * K + k];
        for (i = 0; i < nd; i++)
            g->glnT[i] = cl->grad_lnT[i * K + k];
    }
    if (a->Vbar != NULL)
        for (i = 0; i < n; i++)
            g->Vbar[i] = a->Vbar[i * K + k];
    if (cl->comp_basis == MCD_BASIS_MASS)
        mcdi_comp_w_to_x(n, a->M, g->comp, g->x);
    else
        mcdi_comp_scale_to_one(n, g->comp, g->x);
}

/* The inputs of cell k, in the order and with the words of the
 * single-state calls (the first rule broken, without the cell's name),
 * then the cell gathered into g. */
static mcd_status check_cell(mcd_workspace *ws, const lb_call *a, size_t k,
                             const mcdi_lcell *g)
{
    const mcd_cells *cl = a->cl;
    const size_t n = a->n, nd = a->nd, K = a->K;
    double sxv = 0.0;
    mcd_status st;
    size_t i;
    if ((st = mcdi_check_positive(ws, a->T[k], "T")) != MCD_OK ||
        (st = mcdi_check_conc(ws, a->c[k], "c")) != MCD_OK ||
        (st = mcdi_check_comp_strided(ws, n, cl->comp + k, K, "comp")) !=
            MCD_OK ||
        (st = mcdi_check_finite_strided(ws, n, nd, cl->grad + k, K, "grad")) !=
            MCD_OK)
        return st;
    if (cl->kT != NULL &&
        (st = mcdi_check_thermal_strided(ws, n, nd, cl->kT + k,
                                         cl->grad_lnT + k, K)) != MCD_OK)
        return st;
    if (a->Vbar != NULL && (st = mcdi_check_finite_strided(
                                ws, n, 1, a->Vbar + k, K, "Vbar")) != MCD_OK)
        return st;
    gather(a, k, g);
    if (a->Vbar == NULL)
        return MCD_OK;
    for (i = 0; i < n; i++)
        sxv += g->x[i] * g->Vbar[i];
    if (!(fabs(a->c[k] * sxv - 1.0) <= 1e-6))
        return mcdi_fail(MCD_EDOM,
                         "argument Vbar: c sum_i x_i Vbar_i = %g differs "
                         "from 1 by more than 1e-6 (the partial molar "
                         "volumes and c disagree)",
                         a->c[k] * sxv);
    return MCD_OK;
}

/* The fluxes of cell k, gathered in g, into g->flux. */
static mcd_status cell_flux(mcd_workspace *ws, const lb_call *a, size_t k,
                            const mcdi_lcell *g, unsigned *warn)
{
    const size_t n = a->n, nd = a->nd;
    mcd_state s;
    mcd_status st;
    size_t i, d;
    if ((st = mcdi_liquid_state(ws, a->liq, a->T[k], g->x, "comp", g->lnD,
                                g->Gam, g->Dij, warn)) != MCD_OK)
        return st;
    memset(&s, 0, sizeof s);
    s.n_species = n;
    s.n_dim = nd;
    s.comp_basis = a->cl->comp_basis;
    s.c = a->c[k];
    s.M = a->M;
    s.Dij = g->Dij;
    s.comp = g->comp;
    s.grad = g->grad;
    s.Gamma = g->Gam;
    if (a->cl->kT != NULL) {
        s.kT = g->kT;
        s.grad_lnT = g->glnT;
    }
    if (a->Vbar == NULL)
        return mcdi_flux_state(ws, a->model, &s, a->fb, g->flux, NULL);
    if ((st = mcdi_flux_state(ws, a->model, &s, MCD_BASIS_MOLE, g->J, NULL)) !=
        MCD_OK)
        return st;
    if (mcdi_api_flux_to_volume_frame(n, nd, s.c, g->x, g->Vbar, g->J,
                                      g->flux) != MCD_OK)
        return mcdi_fail(MCD_EDOM, "result: a flux relative to the "
                                   "volume-average velocity is not finite");
    if (a->fb == MCD_BASIS_MASS)
        for (i = 0; i < n; i++)
            for (d = 0; d < nd; d++)
                g->flux[i * nd + d] *= a->M[i];
    return MCD_OK;
}

/* The failure st of cell k, its detail prefixed with "cell k: ". */
static mcd_status cell_fail(mcd_status st, size_t k)
{
    char msg[MCDI_ERRLEN];
    snprintf(msg, sizeof msg, "%s", mcdi_err_text());
    return mcdi_fail(st, "cell %zu: %s", k, msg);
}

/* The call's arguments (not the cells'), in the documented order. */
static mcd_status check_args(mcd_workspace *ws, const lb_call *a,
                             const double *out_flux)
{
    const mcd_cells *cl = a->cl;
    mcd_status st;
    if ((st = mcdi_check_species(ws, a->n, 1, 0, "liq")) != MCD_OK ||
        (st = mcdi_batch_check_common(ws, a->model, a->n, cl, a->fb, out_flux,
                                      "out_flux")) != MCD_OK ||
        (st = mcdi_batch_check_layout(cl, 0, "mcd_liquid_flux_batch")) !=
            MCD_OK)
        return st;
    if (a->model == MCD_MODEL_ITERATIVE)
        return mcdi_fail(MCD_EINVAL,
                         "argument model: MCD_MODEL_ITERATIVE is not offered "
                         "for liquids (use MAXWELL_STEFAN, which it "
                         "approximates)");
    if (cl->grad_lnP != NULL)
        return mcdi_fail(MCD_EINVAL,
                         "argument grad_lnP: not NULL, but pressure "
                         "diffusion in a liquid is not modelled (the flux "
                         "core's term is the ideal gas's)");
    if ((st = mcdi_check_ptr(ws, a->T, "T")) != MCD_OK ||
        (st = mcdi_check_ptr(ws, a->c, "c")) != MCD_OK)
        return st;
    if ((cl->comp_basis == MCD_BASIS_MASS || a->fb == MCD_BASIS_MASS) &&
        (st = mcdi_check_M(ws, a->n, a->M)) != MCD_OK)
        return st;
    if ((st = mcdi_liquid_ready(a->liq, 1)) != MCD_OK) {
        char why[MCDI_ERRLEN]; /* names the pair or species and what */
        snprintf(why, sizeof why, "%s", mcdi_err_text());
        return mcdi_fail(st, "argument liq: %s", why);
    }
    return MCD_OK;
}

mcd_status mcdi_api_liquid_flux_batch(mcd_workspace *ws, const mcd_liquid *liq,
                                      mcd_model model, const double *T,
                                      const double *c, const double *M,
                                      const double *Vbar,
                                      const mcd_cells *cells,
                                      mcd_basis flux_basis, double *out_flux,
                                      unsigned *out_warn)
{
    lb_call a;
    mcdi_lcell g;
    unsigned warn = 0;
    mcd_status st;
    size_t k, e;
    if ((st = mcdi_check_ws_obj(ws, liq, "liq")) != MCD_OK)
        return st;
    memset(&a, 0, sizeof a);
    a.liq = liq;
    a.model = model;
    a.T = T;
    a.c = c;
    a.M = M;
    a.Vbar = Vbar;
    a.cl = cells;
    a.fb = flux_basis;
    a.n = liq->n;
    if ((st = check_args(ws, &a, out_flux)) != MCD_OK)
        return st;
    a.nd = cells->n_dim;
    a.K = cells->n_cells;
    mcdi_lcell_scratch(ws, a.n, a.nd, &g);
    /* pass 1: every cell's inputs valid; nothing written */
    for (k = 0; k < a.K; k++)
        if ((st = check_cell(ws, &a, k, &g)) != MCD_OK)
            return cell_fail(st, k);
    /* pass 2: the liquid (stability included) and the fluxes, cell by
     * cell; a failure leaves the cells before it written */
    mcdi_liquid_log_dinf(liq, g.lnD);
    for (k = 0; k < a.K; k++) {
        gather(&a, k, &g);
        if ((st = cell_flux(ws, &a, k, &g, &warn)) != MCD_OK)
            return cell_fail(st, k);
        for (e = 0; e < a.n * a.nd; e++)
            out_flux[e * a.K + k] = g.flux[e];
    }
    if (out_warn != NULL)
        *out_warn = warn;
    return MCD_OK;
}
