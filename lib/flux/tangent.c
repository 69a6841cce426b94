/* tangent.c - derivatives of the diffusion fluxes of mcd_flux_compute
 * (exact Maxwell-Stefan and mixture-averaged models, mole and mass
 * bases) with respect to the composition, the temperature and the
 * pressure: mcd_flux_jacobian, mcd_flux_jacobian_tp, and the per-cell
 * core of mcd_flux_batch_jacobian (mcdi_flux_jacobian_state).
 *
 * Forward-mode differentiation of the pipeline of mcd_flux_compute
 * (maxwell_stefan.c), one direction at a time: a direction is a change
 * dy of the input fractions (a unit vector e_k for column k), dc of the
 * concentration and dĐ of the binary diffusivities. Stages and their
 * tangents (sums over species unless said):
 *
 * 1. Fractions. Mole input y: x = y / sum y, dx = (dy - x sum dy) / sum y,
 *    and where w is needed w_i = x_i M_i / Mbar, Mbar = sum x M,
 *    dw_i = (M_i dx_i - w_i dMbar) / Mbar, dMbar = sum M dx.
 *    Mass input y: w = y / sum y, dw likewise; x_i = Mbar w_i / M_i with
 *    1 / Mbar = sum w / M, so dx_i = Mbar (dw_i / M_i - x_i q),
 *    q = sum dw / M, dMbar = -Mbar^2 q.
 * 2. Mole-fraction gradients. Mass input: the caller holds grad w fixed,
 *    and grad x_i = Mbar (grad w_i / M_i - x_i Sg), Sg = sum grad w / M,
 *    moves with w: d grad x_i = dMbar grad w_i / M_i
 *    - (dx_i Mbar + x_i dMbar) Sg. Mole input: fixed.
 * 3. Driving forces s_i = sum_j Gamma_ij grad x_j + (x_i - w_i) grad ln P
 *    + k_T,i grad ln T (Gamma, grad ln P, k_T, grad ln T held fixed),
 *    projected: d_i = s_i - x_i sum s, so
 *    dd_i = ds_i - dx_i sum s - x_i sum ds, which sums to zero when
 *    sum dx = 0 (composition directions) and is 0 for the others.
 * 4a. Exact model: d_i = sum_{j != i} (x_i J_j - x_j J_i) / (c Đ_ij),
 *    bilinear in (x, J), with 1 / (c Đ_ij) varying as
 *    -(dc / c + dĐ_ij / Đ_ij) / (c Đ_ij). dJ solves the same equations
 *    with the driving force
 *      f_i = dd_i - (1/c) sum_{j != i} [(dx_i J_j - dx_j J_i)
 *            - (x_i J_j - x_j J_i)(dc / c + dĐ_ij / Đ_ij)] / Đ_ij,
 *    which sums to zero over i (each bracket is antisymmetric in i, j),
 *    so dJ = F(f) with F the flux solve of mcd_flux_compute (trace
 *    species, Blanc's law, included): one solve per direction.
 * 4b. Mixture-averaged model: J*_i = -c D_im d_i, D_im = num_i / S_i,
 *    num_i = sum_{j != i} x_j, S_i = sum_{j != i} x_j / Đ_ij, and
 *    J_i = J*_i - x_i sum J*. Tangents:
 *      dS_i = sum_{j != i} (dx_j - x_j dĐ_ij / Đ_ij) / Đ_ij,
 *      dD_im = (dnum_i - D_im dS_i) / S_i,
 *      dJ*_i = -(dc D_im d_i + c dD_im d_i + c D_im dd_i),
 *      dJ_i = dJ*_i - dx_i sum J* - x_i sum dJ*.
 *    Near a pure species m (the others' fractions e), S_m ~ e, so dD_mm
 *    and dJ*_m grow as 1/e while J_m = num_m J*_m - x_m sum_{k != m} J*_k
 *    stays bounded; dJ_m is formed in that order (num_m dJ*_m - x_m
 *    sum_{k != m} dJ*_k - dx_m sum J*), the others with sum dJ* split
 *    the same way, so no 1/e term cancels. At a pure species itself
 *    (S_m = 0) the flux uses D_mm = (N - 1) / sum_{j != m} 1 / Đ_mj;
 *    its dependence on x has no limit there (it depends on the direction
 *    of approach), and the tangent holds that D_mm fixed in x (its
 *    dependence on Đ is kept): mcd_flux_jacobian documents it.
 * 5. Mass basis: j_i = M_i J_i - w_i sum M J, so
 *    dj_i = M_i dJ_i - dw_i sum M J - w_i sum M dJ.
 *
 * The zero-sum clean-ups of mcd_flux_compute remove round-off only and
 * have no tangent. Cost per column: the exact model one flux solve of N
 * species (N + 1 for the Jacobian), the mixture-averaged model O(N^2).
 * Conditioning: the exact model's tangent is the flux solve itself, so
 * it inherits that solve's accuracy (maxwell_stefan.c); the
 * mixture-averaged one has no solve, only the sums above.
 */
#include <string.h>

#include "base/mcd_internal.h"
#include "base/checks.h"
#include "base/workspace.h"
#include "flux/flux_core.h"
#include "flux/core_layout.h"

/* The state, its basis and model, and its stages' values (tangent.c's
 * regions of the core bank, and the sums below). */
typedef struct tan_ctx {
    const mcd_state *s;
    mcd_model model;
    mcd_basis fb;
    size_t n, nd, m;         /* species, directions, most abundant */
    int need_w;              /* w used (grad ln P, mass basis) */
    double sumy, Mbar;       /* input sum, mean molar mass */
    double Ss[MCD_MAX_DIM];  /* sum_i s_i */
    double Sg[MCD_MAX_DIM];  /* sum_l grad w_l / M_l (mass input) */
    double SJs[MCD_MAX_DIM]; /* sum_i J*_i (mixture-averaged) */
    double SMJ[MCD_MAX_DIM]; /* sum_i M_i J_i (mass fluxes) */
    mcdi_flux_view v;
} tan_ctx;

/* Đ_ij (or its change) from the upper triangle, as the flux solve reads. */
static double upper(const double *D, size_t n, size_t i, size_t j)
{
    return i < j ? D[i * n + j] : D[j * n + i];
}

/* Stages 1-3 at the state: x, w, grad x, s, d, and the model's base
 * values (J by the flux solve itself, into v.jJ). */
static void tan_base(tan_ctx *t)
{
    const mcd_state *s = t->s;
    const size_t n = t->n, nd = t->nd;
    const mcdi_flux_view *v = &t->v;
    double *x = v->tx, *w = v->tw;
    size_t i, j, d;
    t->sumy = 0.0;
    for (i = 0; i < n; i++)
        t->sumy += s->comp[i];
    if (s->comp_basis == MCD_BASIS_MOLE) {
        for (i = 0; i < n; i++)
            x[i] = s->comp[i] / t->sumy;
        memcpy(v->tgx, s->grad, n * nd * sizeof(double));
        t->Mbar = 0.0;
        if (t->need_w) {
            for (i = 0; i < n; i++)
                t->Mbar += x[i] * s->M[i];
            for (i = 0; i < n; i++)
                w[i] = x[i] * s->M[i] / t->Mbar;
        }
    } else {
        double r = 0.0;
        for (i = 0; i < n; i++) {
            w[i] = s->comp[i] / t->sumy;
            r += w[i] / s->M[i];
        }
        t->Mbar = 1.0 / r;
        for (i = 0; i < n; i++)
            x[i] = t->Mbar * w[i] / s->M[i];
        for (d = 0; d < nd; d++) {
            double g = 0.0;
            for (i = 0; i < n; i++)
                g += s->grad[i * nd + d] / s->M[i];
            t->Sg[d] = g;
            for (i = 0; i < n; i++)
                v->tgx[i * nd + d] =
                    t->Mbar * (s->grad[i * nd + d] / s->M[i] - x[i] * g);
        }
    }
    for (d = 0; d < nd; d++) {
        double S = 0.0;
        for (i = 0; i < n; i++) {
            double si = 0.0;
            if (s->Gamma != NULL)
                for (j = 0; j < n; j++)
                    si += s->Gamma[i * n + j] * v->tgx[j * nd + d];
            else
                si = v->tgx[i * nd + d];
            if (s->grad_lnP != NULL)
                si += (x[i] - w[i]) * s->grad_lnP[d];
            if (s->kT != NULL)
                si += s->kT[i] * s->grad_lnT[d];
            v->ts[i * nd + d] = si;
            S += si;
        }
        t->Ss[d] = S;
        for (i = 0; i < n; i++)
            v->td[i * nd + d] = v->ts[i * nd + d] - x[i] * S;
    }
    for (i = 0; i < n; i++)
        for (j = i; j < n; j++)
            v->tiD[i * n + j] = v->tiD[j * n + i] =
                j == i ? 0.0 : 1.0 / s->Dij[i * n + j];
    t->m = mcdi_flux_most_abundant(n, x);
    for (i = 0; i < n; i++) {
        double S = 0.0, num = 0.0, h = 0.0;
        for (j = 0; j < n; j++)
            if (j != i) {
                S += x[j] * v->tiD[i * n + j];
                num += x[j];
                h += v->tiD[i * n + j];
            }
        v->tS[i] = S;
        v->tDm[i] = S > 0.0 ? num / S : (double)(n - 1) / h;
        for (d = 0; d < nd; d++) {
            double p = 0.0;
            for (j = 0; j < n; j++)
                p += v->tiD[i * n + j] * v->jJ[j * nd + d];
            v->tP[i * nd + d] = p;
        }
    }
    for (d = 0; d < nd; d++) {
        double a = 0.0, b = 0.0;
        for (i = 0; i < n; i++) {
            const double q = t->model == MCD_MODEL_MIXTURE_AVERAGED
                                 ? s->c * (-v->tDm[i] * v->td[i * nd + d])
                                 : 0.0;
            v->tJs[i * nd + d] = q;
            a += q;
            if (t->fb == MCD_BASIS_MASS)
                b += s->M[i] * v->jJ[i * nd + d];
        }
        t->SJs[d] = a;
        t->SMJ[d] = b;
    }
}

/* Stage 1-2 tangents of the direction e_k of the input fractions. */
static void tan_dir_comp(const tan_ctx *t, size_t k, double *dx, double *dw,
                         double *dg)
{
    const mcd_state *s = t->s;
    const size_t n = t->n, nd = t->nd;
    const double *x = t->v.tx, *w = t->v.tw, Mb = t->Mbar;
    size_t i, d;
    if (s->comp_basis == MCD_BASIS_MOLE) {
        double dM = 0.0;
        for (i = 0; i < n; i++)
            dx[i] = ((i == k ? 1.0 : 0.0) - x[i]) / t->sumy;
        memset(dg, 0, n * nd * sizeof(double));
        if (!t->need_w)
            return;
        for (i = 0; i < n; i++)
            dM += s->M[i] * dx[i];
        for (i = 0; i < n; i++)
            dw[i] = (s->M[i] * dx[i] - w[i] * dM) / Mb;
    } else {
        double q = 0.0, dM;
        for (i = 0; i < n; i++) {
            dw[i] = ((i == k ? 1.0 : 0.0) - w[i]) / t->sumy;
            q += dw[i] / s->M[i];
        }
        dM = -Mb * Mb * q;
        for (i = 0; i < n; i++)
            dx[i] = Mb * (dw[i] / s->M[i] - x[i] * q);
        for (i = 0; i < n; i++)
            for (d = 0; d < nd; d++)
                dg[i * nd + d] = dM * s->grad[i * nd + d] / s->M[i] -
                                 (dx[i] * Mb + x[i] * dM) * t->Sg[d];
    }
}

/* Stage 3 tangent: dd from dx, dw (NULL: 0) and d grad x (NULL: 0). */
static void tan_forces(const tan_ctx *t, const double *dx, const double *dw,
                       const double *dg, double *dd)
{
    const mcd_state *s = t->s;
    const size_t n = t->n, nd = t->nd;
    size_t i, j, d;
    for (d = 0; d < nd; d++) {
        double S = 0.0;
        for (i = 0; i < n; i++) {
            double si = 0.0;
            if (dg != NULL && s->Gamma != NULL)
                for (j = 0; j < n; j++)
                    si += s->Gamma[i * n + j] * dg[j * nd + d];
            else if (dg != NULL)
                si = dg[i * nd + d];
            if (s->grad_lnP != NULL && dw != NULL)
                si += (dx[i] - dw[i]) * s->grad_lnP[d];
            dd[i * nd + d] = si;
            S += si;
        }
        for (i = 0; i < n; i++)
            dd[i * nd + d] -= dx[i] * t->Ss[d] + t->v.tx[i] * S;
    }
}

/* Stage 4a's driving force f (entries f[i * ld + d]) of one direction:
 * with R_ij = 1/Đ_ij, P_i = sum_j R_ij J_j and S_i = sum_j R_ij x_j (at
 * the state) and Q_i = sum_j R_ij dx_j, the sum of 4a is
 *   dx_i P_i - J_i Q_i - (dc / c)(x_i P_i - J_i S_i)
 *   - sum_j (x_i J_j - x_j J_i) dĐ_ij R_ij^2,
 * O(N^2) a direction (the last sum only for dĐ). */
static void tan_exact_force(const tan_ctx *t, const double *dx,
                            const double *dd, double dc, const double *dD,
                            double *f, size_t ld)
{
    const size_t n = t->n, nd = t->nd;
    const double *x = t->v.tx, *J = t->v.jJ, *iD = t->v.tiD, c = t->s->c;
    const double *P = t->v.tP, *S = t->v.tS, r = dc / c;
    size_t i, j, d;
    for (i = 0; i < n; i++) {
        double Q = 0.0;
        for (j = 0; j < n; j++)
            Q += iD[i * n + j] * dx[j];
        for (d = 0; d < nd; d++) {
            const double Pi = P[i * nd + d], Ji = J[i * nd + d];
            double a = dx[i] * Pi - Ji * Q - r * (x[i] * Pi - Ji * S[i]);
            for (j = 0; dD != NULL && j < n; j++) {
                const double e = iD[i * n + j];
                a -= (x[i] * J[j * nd + d] - x[j] * Ji) * upper(dD, n, i, j) *
                     e * e;
            }
            f[i * ld + d] = dd[i * nd + d] - a / c;
        }
    }
}

/* Stage 4a: dJ (molar) of the exact model by one flux solve. */
static mcd_status tan_exact(mcd_workspace *ws, const tan_ctx *t,
                            const double *dx, const double *dd, double dc,
                            const double *dD, double *dJ)
{
    tan_exact_force(t, dx, dd, dc, dD, t->v.jd, t->nd);
    return mcdi_flux_solve_exact(ws, t->n, t->nd, t->v.tx, t->v.jd, t->s->Dij,
                                 t->s->c, dJ);
}

/* Stage 4b: dJ (molar) of the mixture-averaged model. */
static void tan_mixavg(const tan_ctx *t, const double *dx, const double *dd,
                       double dc, const double *dD, double *dJ)
{
    const mcd_state *s = t->s;
    const size_t n = t->n, nd = t->nd, m = t->m;
    const double *x = t->v.tx, *Dm = t->v.tDm, *dv = t->v.td, c = s->c;
    double num_m = 0.0, sdx = 0.0;
    size_t i, j, d;
    for (j = 0; j < n; j++)
        sdx += dx[j];
    for (i = 0; i < n; i++) {
        double dnum = sdx - dx[i], dS = 0.0, h = 0.0, dDm;
        const double *iD = t->v.tiD + i * n;
        for (j = 0; j < n; j++) /* iD[i] = 0 */
            dS += dx[j] * iD[j];
        for (j = 0; dD != NULL && j < n; j++)
            if (j != i) {
                const double e = upper(dD, n, i, j) * iD[j];
                dS -= x[j] * e * iD[j];
                h += e * iD[j];
            }
        if (i == m)
            for (j = 0; j < n; j++)
                num_m += j != m ? x[j] : 0.0;
        dDm = t->v.tS[i] > 0.0 ? (dnum - Dm[i] * dS) / t->v.tS[i]
                               : Dm[i] * Dm[i] / (double)(n - 1) * h;
        for (d = 0; d < nd; d++)
            dJ[i * nd + d] =
                -(dc * Dm[i] * dv[i * nd + d] + c * dDm * dv[i * nd + d] +
                  c * Dm[i] * dd[i * nd + d]);
    }
    for (d = 0; d < nd; d++) {
        const double dm = dJ[m * nd + d];
        double Sp = 0.0; /* sum of dJ* over the species other than m */
        for (i = 0; i < n; i++)
            Sp += i != m ? dJ[i * nd + d] : 0.0;
        for (i = 0; i < n; i++)
            if (i != m)
                dJ[i * nd + d] -= dx[i] * t->SJs[d] + x[i] * (Sp + dm);
        dJ[m * nd + d] = num_m * dm - x[m] * Sp - dx[m] * t->SJs[d];
    }
}

/* Stage 5 in place: molar tangents dJ (entries dJ[i * ld + d]) to mass
 * fluxes; dw NULL: 0. */
static void tan_mass(const tan_ctx *t, const double *dw, double *dJ, size_t ld)
{
    const size_t n = t->n, nd = t->nd;
    size_t i, d;
    for (d = 0; d < nd; d++) {
        double sm = 0.0;
        for (i = 0; i < n; i++)
            sm += t->s->M[i] * dJ[i * ld + d];
        for (i = 0; i < n; i++)
            dJ[i * ld + d] = t->s->M[i] * dJ[i * ld + d] -
                             (dw != NULL ? dw[i] * t->SMJ[d] : 0.0) -
                             t->v.tw[i] * sm;
    }
}

/* Stages 4 and 5: the flux tangent of one direction into dJ (n x nd) in
 * the flux basis. dx, dw: stage 1 tangents (dw NULL: none). */
static mcd_status tan_flux(mcd_workspace *ws, const tan_ctx *t,
                           const double *dx, const double *dw, const double *dd,
                           double dc, const double *dD, double *dJ)
{
    if (t->model == MCD_MODEL_MIXTURE_AVERAGED) {
        tan_mixavg(t, dx, dd, dc, dD, dJ);
    } else {
        mcd_status st = tan_exact(ws, t, dx, dd, dc, dD, dJ);
        if (st != MCD_OK)
            return st;
    }
    if (t->fb == MCD_BASIS_MASS)
        tan_mass(t, dw, dJ, t->nd);
    return MCD_OK;
}

/* Whether the exact model's columns can share one factorisation: every
 * species present (the fused solve, flux_core.h, which takes LAPACK's
 * blocked Cholesky above MCDI_MS_LAPACK_N species; trace species take
 * the column-by-column path). */
static int tan_wide(const tan_ctx *t)
{
    size_t i;
    if (t->model != MCD_MODEL_MAXWELL_STEFAN || t->n < 2)
        return 0;
    for (i = 0; i < t->n; i++)
        if (!(t->v.tx[i] > 0.0))
            return 0;
    return 1;
}

/* The N columns of the exact model with one factorisation: the forces of
 * all columns side by side (n x N n_dim, column k's at k n_dim) into
 * v.tF, one solve with N n_dim right-hand sides into v.jac (the same
 * layout), then the mass basis per column. */
static mcd_status tan_columns_wide(mcd_workspace *ws, tan_ctx *t)
{
    const size_t n = t->n, nd = t->nd, ld = n * nd;
    const mcdi_flux_view *v = &t->v;
    const double *dw = t->need_w ? v->tdw : NULL;
    mcd_status st;
    size_t k;
    for (k = 0; k < n; k++) {
        tan_dir_comp(t, k, v->tdx, v->tdw, v->tdg);
        tan_forces(t, v->tdx, dw, v->tdg, v->tdd);
        tan_exact_force(t, v->tdx, v->tdd, 0.0, NULL, v->tF + k * nd, ld);
    }
    st = mcdi_flux_solve_exact_wide(ws, n, ld, v->tx, v->tF, t->s->Dij, t->s->c,
                                    v->jac);
    if (st != MCD_OK || t->fb != MCD_BASIS_MASS)
        return st;
    for (k = 0; k < n; k++) {
        tan_dir_comp(t, k, v->tdx, v->tdw, v->tdg);
        tan_mass(t, dw, v->jac + k * nd, ld);
    }
    return MCD_OK;
}

mcd_status mcdi_jac_model_ok(mcd_model model)
{
    if (model == MCD_MODEL_ITERATIVE)
        return mcdi_fail(MCD_EINVAL,
                         "argument model: the derivatives are those of "
                         "MCD_MODEL_MAXWELL_STEFAN (which the iterative "
                         "model approximates) or "
                         "MCD_MODEL_MIXTURE_AVERAGED");
    return MCD_OK;
}

/* Validation and the base state: the checks of mcd_flux_compute (its
 * flux solve runs on the state, into v.jJ), then the model, flux basis,
 * output and M for mass fluxes. On success *t is ready (n >= 2) or
 * t->n == 1 (no flux, zero derivatives). */
static mcd_status tan_setup(mcd_workspace *ws, tan_ctx *t, mcd_model model,
                            const mcd_state *state, mcd_basis fb,
                            const void *out, const char *out_name)
{
    mcd_status st;
    memset(t, 0, sizeof *t);
    if ((st = mcdi_check_ws_obj(ws, state, "state")) != MCD_OK)
        return st;
    if ((st = mcdi_jac_model_ok(model)) != MCD_OK)
        return st;
    if ((st = mcdi_check_model(ws, model, 0)) != MCD_OK ||
        (st = mcdi_check_basis(ws, fb, "flux_basis")) != MCD_OK ||
        (st = mcdi_check_ptr(ws, out, out_name)) != MCD_OK)
        return st;
    mcdi_flux_scratch(ws, &t->v);
    st = mcdi_flux_state(ws, model, state, MCD_BASIS_MOLE, t->v.jJ, NULL);
    if (st != MCD_OK)
        return st;
    if (fb == MCD_BASIS_MASS &&
        (st = mcdi_check_M(ws, state->n_species, state->M)) != MCD_OK)
        return st;
    t->s = state;
    t->model = model;
    t->fb = fb;
    t->n = state->n_species;
    t->nd = state->n_dim;
    t->need_w = state->grad_lnP != NULL || fb == MCD_BASIS_MASS ||
                state->comp_basis == MCD_BASIS_MASS;
    if (t->n >= 2)
        tan_base(t);
    return MCD_OK;
}

/* EDOM unless the cnt values of q, blocks of n x nd entries, are
 * finite (names the species). */
static mcd_status tan_finite(const double *q, size_t cnt, size_t n, size_t nd)
{
    size_t e;
    for (e = 0; e < cnt; e++)
        if (!mcdi_finite(q[e]))
            return mcdi_fail(MCD_EDOM,
                             "result: a derivative of the flux of species "
                             "%zu is not finite (inputs outside the "
                             "representable range)",
                             (e % (n * nd)) / nd);
    return MCD_OK;
}

mcd_status mcdi_flux_jacobian_state(mcd_workspace *ws, mcd_model model,
                                    const mcd_state *state, mcd_basis fb,
                                    double *out_flux, double *out_jac,
                                    const char *jac_name)
{
    tan_ctx t;
    size_t n, nd, k, e;
    int wide;
    mcd_status st = tan_setup(ws, &t, model, state, fb, out_jac, jac_name);
    if (st != MCD_OK)
        return st;
    n = t.n;
    nd = t.nd;
    wide = tan_wide(&t);
    if (wide && (st = tan_columns_wide(ws, &t)) != MCD_OK)
        return st;
    for (k = 0; !wide && n >= 2 && k < n; k++) {
        const mcdi_flux_view *v = &t.v;
        tan_dir_comp(&t, k, v->tdx, v->tdw, v->tdg);
        tan_forces(&t, v->tdx, t.need_w ? v->tdw : NULL, v->tdg, v->tdd);
        st = tan_flux(ws, &t, v->tdx, t.need_w ? v->tdw : NULL, v->tdd, 0.0,
                      NULL, v->jac + k * n * nd);
        if (st != MCD_OK)
            return st;
    }
    if (n >= 2 && (st = tan_finite(t.v.jac, n * n * nd, n, nd)) != MCD_OK)
        return st;
    /* the fluxes by mcd_flux_compute's own path (v.jd is not touched by
     * it), so that they equal that call's to the bit */
    if (out_flux != NULL &&
        (st = mcdi_flux_state(ws, model, state, fb, t.v.jd, NULL)) != MCD_OK)
        return st;
    /* column k of entry e = i nd + d: at jac[k n nd + e], or (wide) at
     * jac[i n nd + k nd + d] */
    for (e = 0; e < n * nd; e++)
        for (k = 0; k < n; k++)
            out_jac[e * n + k] =
                n < 2  ? 0.0
                : wide ? t.v.jac[(e / nd) * n * nd + k * nd + e % nd]
                       : t.v.jac[k * n * nd + e];
    if (out_flux != NULL)
        memcpy(out_flux, t.v.jd, n * nd * sizeof(double));
    return MCD_OK;
}

mcd_status mcdi_api_flux_jacobian(mcd_workspace *ws, mcd_model model,
                                  const mcd_state *state, mcd_basis flux_basis,
                                  double *out_dflux)
{
    return mcdi_flux_jacobian_state(ws, model, state, flux_basis, NULL,
                                    out_dflux, "out_dflux");
}

/* The checks of mcd_flux_jacobian_tp's own arguments (after the state's):
 * T or P and its dĐ for each requested output. */
static mcd_status check_tp(mcd_workspace *ws, size_t n, double T, double P,
                           const double *dDT, const double *dDP,
                           const double *oT, const double *oP)
{
    mcd_status st;
    if (oT != NULL &&
        ((st = mcdi_check_positive(ws, T, "T")) != MCD_OK ||
         (st = mcdi_check_ptr(ws, dDT, "dDij_dT")) != MCD_OK ||
         (st = mcdi_check_finite(ws, n, n, dDT, "dDij_dT")) != MCD_OK))
        return st;
    if (oP != NULL &&
        ((st = mcdi_check_positive(ws, P, "P")) != MCD_OK ||
         (st = mcdi_check_ptr(ws, dDP, "dDij_dP")) != MCD_OK ||
         (st = mcdi_check_finite(ws, n, n, dDP, "dDij_dP")) != MCD_OK))
        return st;
    return MCD_OK;
}

mcd_status mcdi_api_flux_jacobian_tp(mcd_workspace *ws, mcd_model model,
                                     const mcd_state *state,
                                     mcd_basis flux_basis, double T, double P,
                                     const double *dDij_dT,
                                     const double *dDij_dP, double *out_dT,
                                     double *out_dP)
{
    tan_ctx t;
    size_t n, nd, q;
    mcd_status st;
    double *outs[2];
    outs[0] = out_dT;
    outs[1] = out_dP;
    st = tan_setup(ws, &t, model, state, flux_basis,
                   out_dT != NULL ? (const void *)out_dT : out_dP,
                   "out_dT and out_dP (both NULL)");
    if (st != MCD_OK)
        return st;
    n = state->n_species;
    nd = state->n_dim;
    if ((st = check_tp(ws, n, T, P, dDij_dT, dDij_dP, out_dT, out_dP)) !=
        MCD_OK)
        return st;
    if (n == 1) { /* J = 0 whatever T and P */
        for (q = 0; q < 2; q++)
            if (outs[q] != NULL)
                memset(outs[q], 0, nd * sizeof(double));
        return MCD_OK;
    }
    memset(t.v.jac, 0, 2 * n * nd * sizeof(double));
    /* c = P / (R T): dc/dT = -c / T, dc/dP = c / P; forces fixed */
    memset(t.v.tdd, 0, n * nd * sizeof(double));
    memset(t.v.tdx, 0, n * sizeof(double));
    for (q = 0; q < 2; q++) {
        if (outs[q] == NULL)
            continue;
        st = tan_flux(ws, &t, t.v.tdx, NULL, t.v.tdd,
                      q == 0 ? -state->c / T : state->c / P,
                      q == 0 ? dDij_dT : dDij_dP, t.v.jac + q * n * nd);
        if (st != MCD_OK)
            return st;
    }
    if ((st = tan_finite(t.v.jac, 2 * n * nd, n, nd)) != MCD_OK)
        return st;
    for (q = 0; q < 2; q++)
        if (outs[q] != NULL)
            memcpy(outs[q], t.v.jac + q * n * nd, n * nd * sizeof(double));
    return MCD_OK;
}
