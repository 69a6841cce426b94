/* dgm.c - the Dusty Gas Model at one state: total molar fluxes from the
 * gradients (mcd_dgm_fluxes), with the total flux given and the pressure
 * gradient unknown (mcd_dgm_closed), and the gradients that carry given
 * fluxes (mcd_dgm_gradients), and the fluxes of many cells
 * (mcd_dgm_fluxes_batch).
 *
 * Equations (Mason and Malinauskas, Gas Transport in Porous Media: The
 * Dusty-Gas Model, 1983, ch. 5, for an isothermal ideal gas; recalled
 * (from memory) and re-derived here): the pore walls are a motionless,
 * very heavy species. For the diffusive fluxes N^D,
 *   sum_{j != i} (x_j N^D_i - x_i N^D_j) / D^e_ij + N^D_i / D^e_K,i
 *       = -grad p_i / (R T),
 * and the total flux adds the viscous (Darcy) flux of the mixture,
 * N_i = N^D_i + N^V_i, N^V_i = -x_i (c B0 / mu) grad P. The viscous part
 * drops out of the molecular sum (x_j x_i - x_i x_j = 0), so for the total
 * fluxes
 *   sum_{j != i} (x_j N_i - x_i N_j) / D^e_ij + N_i / D^e_K,i
 *       = -(1/(R T)) [P grad x_i + x_i k_i grad P],
 *   k_i = 1 + B0 P / (mu D^e_K,i),
 * i.e. H N = rhs with H_ii = 1/D^e_K,i + sum_{j != i} x_j / D^e_ij and
 * H_ij = -x_i / D^e_ij. Summing over i cancels the molecular terms:
 *   sum_i N_i / D^e_K,i = -(grad P / (R T)) sum_i x_i k_i,
 * which with grad P = 0 is Graham's law of diffusion,
 * sum_i N_i sqrt(M_i) = 0, at every pore size.
 *
 * Solution: H is strictly diagonally dominant by columns (column j:
 * H_jj - sum_{i != j} |H_ij| = 1/D^e_K,j > 0), so Gaussian elimination
 * without pivoting is stable (growth factor <= 2; Wilkinson 1961, Golub
 * and Van Loan, Matrix Computations, 4th ed., sec. 3.4.10) and every
 * pivot stays positive. It runs on the workspace's H in place, all
 * directions (and the unit pressure response) as right-hand sides at
 * once: O(N^3 / 3 + N^2 cols), no LAPACK call, no allocation.
 * Conditioning: cond(H) is about max(D^e_K / D^e) over species, large
 * only in the molecular limit, where the fluxes are still accurate to
 * cond * eps relative to the largest flux.
 *
 * Mole-fraction gradients are first projected onto sum_i grad x_i = 0 by
 * grad x_i -= x_i sum_k grad x_k (the convention of mcd_flux_compute).
 */
#include <math.h>
#include <string.h>

#include "base/mcd_internal.h"
#include "base/checks.h"
#include "base/composition.h"
#include "porous/porous.h"
#include "porous/pm_layout.h"

/* The checks of one state (writes nothing but the detail): the
 * state's fields after the counts, as the three calls and every cell of
 * the batched call apply them. need_gx: grad_x is read. The Knudsen
 * diffusivities must be finite (they overflow only for absurd d_pore). */
static mcd_status dgm_check_state(mcd_workspace *ws, const mcd_dgm *g,
                                  const mcdi_pore_eff *e, int need_gx)
{
    mcd_status st;
    size_t n = g->n_species, nd = g->n_dim, i;
    if ((st = mcdi_check_positive2(g->T, "T", g->P, "P")) != MCD_OK ||
        (st = mcdi_check_positive(ws, g->mu, "mu")) != MCD_OK ||
        (st = mcdi_check_M(ws, n, g->M)) != MCD_OK ||
        (st = mcdi_check_dij(ws, n, g->Dij)) != MCD_OK ||
        (st = mcdi_check_comp(ws, n, g->x, "x")) != MCD_OK)
        return st;
    if (need_gx &&
        (st = mcdi_check_finite(ws, n, nd, g->grad_x, "grad_x")) != MCD_OK)
        return st;
    if (g->grad_P != NULL &&
        (st = mcdi_check_finite_vec(ws, nd, g->grad_P, "grad_P")) != MCD_OK)
        return st;
    for (i = 0; i < n; i++) {
        double DK = e->f * mcdi_knudsen(g->T, g->M[i], e->d);
        if (!(DK > 0.0) || !mcdi_finite(DK))
            return mcdi_fail(MCD_EDOM,
                             "argument d_pore: Knudsen diffusivity of "
                             "species %zu outside the double range",
                             i);
    }
    return MCD_OK;
}

/* The counts, the workspace and the pore structure (writes nothing). */
static mcd_status dgm_check_head(mcd_workspace *ws, const mcd_pore *pore,
                                 size_t n, size_t nd, mcdi_pore_eff *e)
{
    mcd_status st;
    if (ws == NULL)
        return mcdi_fail(MCD_EINVAL, "argument ws: NULL");
    if ((st = mcdi_check_species(ws, n, 1, 0, "n_species")) != MCD_OK ||
        (st = mcdi_check_dim(ws, nd)) != MCD_OK ||
        (st = mcdi_pore_check(pore, e)) != MCD_OK)
        return st;
    return MCD_OK;
}

/* The state's derived values in the workspace: xn, DK, kv, H, and the
 * projected gradients gx when need_gx. Inputs checked. */
void mcdi_dgm_prepare(const mcd_dgm *g, const mcdi_pore_eff *e, int need_gx,
                      mcdi_pm *pm)
{
    size_t n = g->n_species, nd = g->n_dim, i, j, k;
    mcdi_comp_scale_to_one(n, g->x, pm->xn);
    for (i = 0; i < n; i++) {
        pm->DK[i] = e->f * mcdi_knudsen(g->T, g->M[i], e->d);
        pm->kv[i] = 1.0 + e->B0 * g->P / (g->mu * pm->DK[i]);
    }
    /* H_ii = 1/D^e_K,i + sum_{j != i} x_j / D^e_ij, H_ij = -x_i / D^e_ij */
    for (i = 0; i < n; i++) {
        double d = 1.0 / pm->DK[i];
        for (j = 0; j < n; j++) {
            double inv;
            if (j == i)
                continue;
            inv = 1.0 / (e->f * g->Dij[i * n + j]);
            d += pm->xn[j] * inv;
            pm->H[i * n + j] = -pm->xn[i] * inv;
        }
        pm->H[i * n + i] = d;
    }
    if (need_gx)
        for (k = 0; k < nd; k++) {
            double sum = 0.0;
            for (i = 0; i < n; i++)
                sum += g->grad_x[i * nd + k];
            for (i = 0; i < n; i++)
                pm->gx[i * MCD_MAX_DIM + k] =
                    g->grad_x[i * nd + k] - pm->xn[i] * sum;
        }
}

/* Checks of a single-state call, then the derived values in the
 * workspace. */
static mcd_status dgm_setup(mcd_workspace *ws, const mcd_pore *pore,
                            const mcd_dgm *g, int need_gx, mcdi_pm *pm,
                            mcdi_pore_eff *e)
{
    mcd_status st;
    if (g == NULL)
        return ws == NULL ? mcdi_fail(MCD_EINVAL, "argument ws: NULL")
                          : mcdi_fail(MCD_EINVAL, "argument dgm: NULL");
    if ((st = dgm_check_head(ws, pore, g->n_species, g->n_dim, e)) != MCD_OK ||
        (st = dgm_check_state(ws, g, e, need_gx)) != MCD_OK)
        return st;
    mcdi_pm_scratch(ws, pm);
    mcdi_dgm_prepare(g, e, need_gx, pm);
    return MCD_OK;
}

/* Solve H X = B in place for `cols` columns of pm->rhs (stride
 * MCDI_PM_COLS) by elimination without pivoting (see the top). Fails:
 * ESING when a pivot is not positive (not reachable for checked inputs),
 * EDOM when the solution is not finite. */
static mcd_status dgm_solve(size_t n, size_t cols, mcdi_pm *pm)
{
    double *H = pm->H, *B = pm->rhs;
    size_t i, j, k, c;
    for (k = 0; k < n; k++) {
        double piv = H[k * n + k], r;
        if (!(piv > 0.0) || !mcdi_finite(piv))
            return mcdi_fail(MCD_ESING,
                             "Dusty Gas Model matrix: pivot %zu "
                             "is not positive",
                             k);
        r = 1.0 / piv;
        for (i = k + 1; i < n; i++) {
            double l = H[i * n + k] * r;
            if (l == 0.0)
                continue;
            for (j = k + 1; j < n; j++)
                H[i * n + j] -= l * H[k * n + j];
            for (c = 0; c < cols; c++)
                B[i * MCDI_PM_COLS + c] -= l * B[k * MCDI_PM_COLS + c];
        }
    }
    for (k = n; k-- > 0;) {
        for (c = 0; c < cols; c++) {
            double s = B[k * MCDI_PM_COLS + c];
            for (j = k + 1; j < n; j++)
                s -= H[k * n + j] * B[j * MCDI_PM_COLS + c];
            s /= H[k * n + k];
            if (!mcdi_finite(s))
                return mcdi_fail(MCD_EDOM, "Dusty Gas Model: fluxes "
                                           "overflow");
            B[k * MCDI_PM_COLS + c] = s;
        }
    }
    return MCD_OK;
}

/* The fluxes of a prepared state into pm->rhs (columns 0..nd-1):
 * rhs_i = -(P grad x_i + x_i k_i grad P) / (R T), then the solve. */
static mcd_status dgm_forward(const mcd_dgm *g, mcdi_pm *pm)
{
    size_t n = g->n_species, nd = g->n_dim, i, k;
    double RT = MCD_GAS_CONSTANT * g->T;
    for (i = 0; i < n; i++)
        for (k = 0; k < nd; k++) {
            double gP = g->grad_P != NULL ? g->grad_P[k] : 0.0;
            pm->rhs[i * MCDI_PM_COLS + k] =
                -(g->P * pm->gx[i * MCD_MAX_DIM + k] +
                  pm->xn[i] * pm->kv[i] * gP) /
                RT;
        }
    return dgm_solve(n, nd, pm);
}

mcd_status mcdi_api_dgm_fluxes(mcd_workspace *ws, const mcd_pore *pore,
                               const mcd_dgm *dgm, double *out_N)
{
    mcdi_pm pm;
    mcdi_pore_eff e;
    mcd_status st;
    size_t n, nd, i, k;
    if ((st = dgm_setup(ws, pore, dgm, 1, &pm, &e)) != MCD_OK)
        return st;
    if (out_N == NULL)
        return mcdi_fail(MCD_EINVAL, "argument out_N: NULL");
    if ((st = dgm_forward(dgm, &pm)) != MCD_OK)
        return st;
    n = dgm->n_species;
    nd = dgm->n_dim;
    for (i = 0; i < n; i++)
        for (k = 0; k < nd; k++)
            out_N[i * nd + k] = pm.rhs[i * MCDI_PM_COLS + k];
    return MCD_OK;
}

/* Cell k of a batched call gathered into the workspace (regions cD, cx,
 * cg, cgP) as a single state g. */
static void dgm_gather(const mcd_dgm_cells *cl, size_t n, const double *M,
                       size_t k, mcdi_pm *pm, mcd_dgm *g)
{
    size_t K = cl->n_cells, nd = cl->n_dim, i;
    for (i = 0; i < n * n; i++)
        pm->cD[i] = cl->Dij[i * K + k];
    for (i = 0; i < n; i++)
        pm->cx[i] = cl->x[i * K + k];
    for (i = 0; i < n * nd; i++)
        pm->cg[i] = cl->grad_x[i * K + k];
    if (cl->grad_P != NULL)
        for (i = 0; i < nd; i++)
            pm->cgP[i] = cl->grad_P[i * K + k];
    *g = (mcd_dgm){.n_species = n,
                   .n_dim = nd,
                   .T = cl->T[k],
                   .P = cl->P[k],
                   .mu = cl->mu[k],
                   .M = M,
                   .Dij = pm->cD,
                   .x = pm->cx,
                   .grad_x = pm->cg,
                   .grad_P = cl->grad_P != NULL ? pm->cgP : NULL};
}

/*
 * Batched fluxes: every cell is gathered into the workspace and run
 * through the single-state stages (the same code, so the same bits as
 * mcd_dgm_fluxes). Two passes: the first checks every cell and names the
 * first bad one, so that bad input writes nothing; the second computes.
 */
mcd_status mcdi_api_dgm_fluxes_batch(mcd_workspace *ws, const mcd_pore *pore,
                                     size_t n_species, const double *M,
                                     const mcd_dgm_cells *cells, double *out_N)
{
    mcdi_pm pm;
    mcdi_pore_eff e;
    mcd_dgm g;
    mcd_status st;
    size_t K, nd, n = n_species, k, i;
    if (cells == NULL)
        return mcdi_fail(MCD_EINVAL, "argument cells: NULL");
    K = cells->n_cells;
    nd = cells->n_dim;
    if ((st = dgm_check_head(ws, pore, n, nd, &e)) != MCD_OK ||
        (st = MCDI_CHECK_PTRS2(M, out_N)) != MCD_OK)
        return st;
    if (K > 0 &&
        ((st = MCDI_CHECK_PTRS3(cells->T, cells->P, cells->mu)) != MCD_OK ||
         (st = MCDI_CHECK_PTRS3(cells->Dij, cells->x, cells->grad_x)) !=
             MCD_OK))
        return st;
    mcdi_pm_scratch(ws, &pm);
    for (k = 0; k < K; k++) {
        dgm_gather(cells, n, M, k, &pm, &g);
        if ((st = dgm_check_state(ws, &g, &e, 1)) != MCD_OK) {
            char msg[MCDI_ERRLEN];
            memcpy(msg, mcdi_err_text(), sizeof msg);
            msg[sizeof msg - 1] = '\0';
            return mcdi_fail(st, "cell %zu: %s", k, msg);
        }
    }
    for (k = 0; k < K; k++) {
        dgm_gather(cells, n, M, k, &pm, &g);
        mcdi_dgm_prepare(&g, &e, 1, &pm);
        if ((st = dgm_forward(&g, &pm)) != MCD_OK) {
            char msg[MCDI_ERRLEN];
            memcpy(msg, mcdi_err_text(), sizeof msg);
            msg[sizeof msg - 1] = '\0';
            return mcdi_fail(st, "cell %zu: %s", k, msg);
        }
        for (i = 0; i < n * nd; i++)
            out_N[i * K + k] = pm.rhs[(i / nd) * MCDI_PM_COLS + i % nd];
    }
    return MCD_OK;
}

/* The checked results (rows of stride MCD_MAX_DIM) and the pressure
 * gradient out to the caller. */
static void emit(size_t n, size_t nd, const double *rows, const double *gP,
                 double *out, double *out_grad_P)
{
    size_t i, k;
    for (i = 0; i < n; i++)
        for (k = 0; k < nd; k++)
            out[i * nd + k] = rows[i * MCD_MAX_DIM + k];
    for (k = 0; k < nd; k++)
        out_grad_P[k] = gP[k];
}

/*
 * Total flux given (N_t = sum_i N_i per direction; 0 for a closed end),
 * pressure gradient unknown. The fluxes are linear in grad P:
 * N = a + b grad P with H a = rhs(grad x, grad P = 0) and
 * H b = -x k / (R T); H^-1 >= 0 entrywise (H is a non-singular M-matrix:
 * positive diagonal, non-positive off-diagonal, column dominant), so b <= 0
 * with sum_i b_i < 0, and grad P = (N_t - sum a) / sum b is unique.
 */
mcd_status mcdi_api_dgm_closed(mcd_workspace *ws, const mcd_pore *pore,
                               const mcd_dgm *dgm, const double *N_t,
                               double *out_N, double *out_grad_P)
{
    mcdi_pm pm;
    mcdi_pore_eff e;
    mcd_status st;
    size_t n, nd, i, k;
    double RT, sb = 0.0, gP[MCD_MAX_DIM];
    if ((st = dgm_setup(ws, pore, dgm, 1, &pm, &e)) != MCD_OK ||
        (st = MCDI_CHECK_PTRS3(N_t, out_N, out_grad_P)) != MCD_OK ||
        (st = mcdi_check_finite_vec(ws, dgm->n_dim, N_t, "N_t")) != MCD_OK)
        return st;
    n = dgm->n_species;
    nd = dgm->n_dim;
    RT = MCD_GAS_CONSTANT * dgm->T;
    for (i = 0; i < n; i++) {
        for (k = 0; k < nd; k++)
            pm.rhs[i * MCDI_PM_COLS + k] =
                -dgm->P * pm.gx[i * MCD_MAX_DIM + k] / RT;
        pm.rhs[i * MCDI_PM_COLS + nd] = -pm.xn[i] * pm.kv[i] / RT;
    }
    if ((st = dgm_solve(n, nd + 1, &pm)) != MCD_OK)
        return st;
    for (i = 0; i < n; i++)
        sb += pm.rhs[i * MCDI_PM_COLS + nd];
    if (!(sb < 0.0))
        return mcdi_fail(MCD_ESING, "Dusty Gas Model: no pressure gradient "
                                    "response (underflow)");
    for (k = 0; k < nd; k++) {
        double sa = 0.0;
        for (i = 0; i < n; i++)
            sa += pm.rhs[i * MCDI_PM_COLS + k];
        gP[k] = (N_t[k] - sa) / sb;
        if (!mcdi_finite(gP[k]))
            return mcdi_fail(MCD_EDOM, "Dusty Gas Model: pressure gradient "
                                       "overflows");
    }
    for (i = 0; i < n; i++)
        for (k = 0; k < nd; k++) {
            double v = pm.rhs[i * MCDI_PM_COLS + k] +
                       pm.rhs[i * MCDI_PM_COLS + nd] * gP[k];
            if (!mcdi_finite(v))
                return mcdi_fail(MCD_EDOM, "Dusty Gas Model: fluxes "
                                           "overflow");
            pm.out[i * MCD_MAX_DIM + k] = v;
        }
    emit(n, nd, pm.out, gP, out_N, out_grad_P);
    return MCD_OK;
}

/*
 * Inverse: the gradients that carry given total fluxes N. No solve: with
 * r = R T H N, the equations read r_i = -(P grad x_i + x_i k_i grad P).
 * Summing over i (sum grad x_i = 0, molecular terms cancel):
 *   grad P = -R T (sum_i N_i / D^e_K,i) / sum_i x_i k_i,
 * then grad x_i = -(r_i + x_i k_i grad P) / P. A species with x_i = 0 must
 * then have a flux only through its own gradient, which is what this
 * gives; the gradients sum to zero to round-off.
 */
void mcdi_dgm_grad1(const mcd_dgm *g, const mcdi_pm *pm, const double *N,
                    double *out_gx, double *out_gP)
{
    size_t n = g->n_species, i, j;
    double RT = MCD_GAS_CONSTANT * g->T, sxk = 0.0, s = 0.0, gP;
    for (i = 0; i < n; i++) {
        sxk += pm->xn[i] * pm->kv[i];
        s += N[i] / pm->DK[i];
    }
    gP = -RT * s / sxk;
    for (i = 0; i < n; i++) {
        double r = 0.0;
        for (j = 0; j < n; j++)
            r += pm->H[i * n + j] * N[j];
        out_gx[i] = -(RT * r + pm->xn[i] * pm->kv[i] * gP) / g->P;
    }
    *out_gP = gP;
}

mcd_status mcdi_api_dgm_gradients(mcd_workspace *ws, const mcd_pore *pore,
                                  const mcd_dgm *dgm, const double *N,
                                  double *out_grad_x, double *out_grad_P)
{
    mcdi_pm pm;
    mcdi_pore_eff e;
    mcd_status st;
    size_t n, nd, i, j, k;
    double RT, sxk = 0.0, gP[MCD_MAX_DIM];
    if ((st = dgm_setup(ws, pore, dgm, 0, &pm, &e)) != MCD_OK ||
        (st = MCDI_CHECK_PTRS3(N, out_grad_x, out_grad_P)) != MCD_OK ||
        (st = mcdi_check_finite(ws, dgm->n_species, dgm->n_dim, N, "N")) !=
            MCD_OK)
        return st;
    n = dgm->n_species;
    nd = dgm->n_dim;
    RT = MCD_GAS_CONSTANT * dgm->T;
    for (i = 0; i < n; i++)
        sxk += pm.xn[i] * pm.kv[i];
    for (k = 0; k < nd; k++) {
        double s = 0.0;
        for (i = 0; i < n; i++)
            s += N[i * nd + k] / pm.DK[i];
        gP[k] = -RT * s / sxk;
    }
    for (i = 0; i < n; i++)
        for (k = 0; k < nd; k++) {
            double r = 0.0, v;
            for (j = 0; j < n; j++)
                r += pm.H[i * n + j] * N[j * nd + k];
            v = -(RT * r + pm.xn[i] * pm.kv[i] * gP[k]) / dgm->P;
            if (!mcdi_finite(v) || !mcdi_finite(gP[k]))
                return mcdi_fail(MCD_EDOM, "Dusty Gas Model: gradients "
                                           "overflow");
            pm.out[i * MCD_MAX_DIM + k] = v;
        }
    emit(n, nd, pm.out, gP, out_grad_x, out_grad_P);
    return MCD_OK;
}
