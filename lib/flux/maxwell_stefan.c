/* maxwell_stefan.c - exact Maxwell-Stefan diffusion fluxes (mcd_flux_compute)
 * and the argument validators shared by the flux core.
 *
 * Equations (Taylor and Krishna 1993, ch. 2; Hirschfelder, Curtiss and Bird
 * 1954): for species i = 1..N,
 *     d_i = sum_{j != i} (x_i J_j - x_j J_i) / (c Đ_ij),   sum_i J_i = 0,
 *     d_i = sum_j Gamma_ij grad x_j + (x_i - w_i) grad ln P.
 *
 * Symmetric form. With the diffusion velocities V_i = J_i / (c x_i) the
 * equations read  G V = -d  with
 *     G_ij = -x_i x_j / Đ_ij (i != j),   G_ii = sum_{k != i} x_i x_k / Đ_ik,
 * a symmetric matrix with zero row sums. For x_i > 0 and every Đ_ij > 0 the
 * graph of G is complete, so G is positive semidefinite with the
 * one-dimensional null space span(1) (it is a weighted graph Laplacian). The
 * range of G is therefore {d : sum_i d_i = 0}: the problem is solvable iff
 * the driving forces sum to zero (which Gibbs-Duhem guarantees physically),
 * and the solution is unique once the reference velocity is fixed by the
 * constraint x^T V = sum J_i / c = 0. This is why the method is well posed.
 *
 * Consistency of the input: caller gradients need not sum exactly to zero
 * (round-off, or an approximate Gamma). Before solving, the driving forces
 * are projected onto the solvable subspace by d_i -= x_i sum_k d_k. The
 * weights x leave trace species (x_i = 0) untouched and, for a dilute
 * mixture, put the correction on the abundant carrier, which is the usual
 * "dependent species" choice; mcd_fick_matrix applies the same projection
 * to Gamma so that both routes give the same fluxes for any input.
 *
 * Regularisation (Ern and Giovangigli 1994, "Multicomponent Transport
 * Algorithms", the "G + a y y^T" device): the constraint is folded into the
 * matrix. With the symmetric diagonal scaling X^{-1/2} (s_i = sqrt(x_i),
 * U_i = s_i V_i) the system becomes
 *     (Gs + a s s^T) U = -X^{-1/2} d,     Gs = X^{-1/2} G X^{-1/2},
 *     (Gs)_ii = sum_{k != i} x_k / Đ_ik,  (Gs)_ij = -s_i s_j / Đ_ij.
 * s is a unit vector (sum x = 1) spanning the null space of Gs, so adding
 * a s s^T moves only the zero eigenvalue, to a, and leaves the others; the
 * matrix is symmetric positive definite and solved by Cholesky. We take
 * a = max_i (Gs)_ii, inside the spectrum of Gs on s-perp, so the
 * regularisation does not worsen the conditioning. Since the right-hand
 * side is orthogonal to s, the solution satisfies s^T U = x^T V = 0, i.e.
 * sum J_i = 0. The scaling makes the diagonal the Blanc sum of each
 * species, independent of x_i, so near-trace species are as well
 * conditioned as abundant ones and J_i = c s_i U_i tends continuously to
 * Blanc's law as x_i -> 0.
 *
 * Trace species (x_i = 0 exactly): their equation reduces to
 *     d_i = -J_i sum_j x_j / (c Đ_ij)   (Blanc's law, exact),
 * so J_i is explicit. They enter the equations of the other species only
 * through x_k J_i / (c Đ_ki), which is moved to the right-hand side, and
 * through the zero-sum, which becomes sum_{x_k > 0} J_k = -S_T with S_T the
 * sum of the trace fluxes; because G 1 = 0 this is met by adding the uniform
 * velocity -S_T / c to the species present: J_k -= x_k S_T. No epsilon is
 * involved. A pure component (one x_k = 1) is the case of a single species
 * present: it takes J_k = -S_T. N = 1 gives zero flux.
 *
 * The pipeline after the driving forces is the batched kernel's
 * (flux/solve_stages.h) with one lane, in ms_ldl.c: inverse diffusivities,
 * Blanc sums, then the mixture-averaged fluxes, or the trace fluxes and
 * their coupling, the right-hand side, the shift a, L D L^T without
 * pivoting or square roots on the dense matrix (trace species are
 * decoupled rows: s_i = 0) and the composition J = c (s U + t - x S_T).
 * States without trace species up to MCDI_MS_FUSED_N species take the
 * fused kernel of the same equations and the same factor (flux_core.h).
 * Cost n(n-1)/2 + 3n divisions and square roots, n^3/6 + n^2 n_dim
 * multiply-adds.
 *
 * Zero-sum clean-up: after the solve the residual r = sum_i J_i (round-off
 * only) is removed with weights x (J_i -= x_i r), again leaving trace
 * species exact. In the mass basis j_i = M_i J_i - w_i sum_k M_k J_k and
 * the residual of sum j_i is removed with weights w.
 */
#include <float.h>
#include <string.h>

#include "base/mcd_internal.h"
#include "base/workspace.h"
#include "base/composition.h"
#include "flux/flux_core.h"
#include "flux/core_layout.h"
#include "flux/stages.h"
#include "flux/solve_stages.h"
#include "base/isa.h"

/* ------------------------------------------------------------------ */
/* small kernels                                                        */
/* ------------------------------------------------------------------ */

double mcdi_flux_fractions(size_t n, const double *M, mcd_basis basis,
                           const double *comp, double *x, double *w)
{
    double Mbar = 0.0;
    if (basis == MCD_BASIS_MOLE) {
        mcdi_comp_scale_to_one(n, comp, x);
        if (M != NULL && w != NULL)
            Mbar = mcdi_comp_x_to_w(n, M, x, w);
    } else {
        /* mass basis: M is always given (validated by the callers) */
        mcdi_comp_scale_to_one(n, comp, w);
        Mbar = mcdi_comp_w_to_x(n, M, w, x);
    }
    return Mbar;
}

size_t mcdi_flux_most_abundant(size_t n, const double *x)
{
    size_t i, best = 0;
    for (i = 1; i < n; i++)
        if (x[i] > x[best])
            best = i;
    return best;
}

/* Whether the mass fluxes F (n x nd) still sum to zero after the
 * clean-up. j_i = M_i J_i - w_i sum_k M_k J_k cancels when the molar
 * masses span many decades (found by fuzz_flux: M = 1.3e-163 next to
 * 0.03 kg/mol, molar fluxes 1e170, mass fluxes 1e8): the terms lose the
 * result entirely and no weighting of the residual restores the balance.
 * Then the call fails rather than hand out fluxes that do not balance. */
int mcdi_mass_zero_sum_kept(size_t n, size_t nd, const double *F)
{
    size_t i, dd;
    for (dd = 0; dd < nd; dd++) {
        double s = 0.0, a = 0.0;
        for (i = 0; i < n; i++) {
            s += F[i * nd + dd];
            a += fabs(F[i * nd + dd]);
        }
        if (!(fabs(s) <= MCDI_MASS_SUM_TOL * a + 1e-300))
            return 0;
    }
    return 1;
}

/* ------------------------------------------------------------------ */
/* public entry                                                         */
/* ------------------------------------------------------------------ */

/* Every argument of mcd_flux_compute and field of its state, in the
 * documented order (writes nothing but the message). */
static mcd_status check_state(mcd_workspace *ws, mcd_model model,
                              const mcd_state *s, mcd_basis flux_basis,
                              const double *out_flux, int need_M,
                              int iterative_ok)
{
    const size_t n = s->n_species, nd = s->n_dim;
    const double c = s->c;
    mcd_status st;
    /* The usual call passes every scalar check: one test of them all
     * (each condition is the one its check below tests; c finite and
     * normal as c in [DBL_MIN, DBL_MAX], false for NaN), and the checks,
     * in the documented order, name the first failure otherwise. */
    const int scalars_ok =
        n >= 1 && n <= ws->cap && nd >= 1 && nd <= MCD_MAX_DIM &&
        (model == MCD_MODEL_MAXWELL_STEFAN ||
         model == MCD_MODEL_MIXTURE_AVERAGED ||
         (iterative_ok && model == MCD_MODEL_ITERATIVE)) &&
        (s->comp_basis == MCD_BASIS_MOLE || s->comp_basis == MCD_BASIS_MASS) &&
        (flux_basis == MCD_BASIS_MOLE || flux_basis == MCD_BASIS_MASS) &&
        out_flux != NULL && c >= DBL_MIN && c <= DBL_MAX;
    if (!scalars_ok &&
        ((st = mcdi_check_species(ws, n, 1, 0, "n_species")) != MCD_OK ||
         (st = mcdi_check_dim(ws, nd)) != MCD_OK ||
         (st = mcdi_check_model(ws, model, iterative_ok)) != MCD_OK ||
         (st = mcdi_check_basis(ws, s->comp_basis, "comp_basis")) != MCD_OK ||
         (st = mcdi_check_basis(ws, flux_basis, "flux_basis")) != MCD_OK ||
         (st = mcdi_check_ptr(ws, out_flux, "out_flux")) != MCD_OK ||
         (st = mcdi_check_conc(ws, c, "c")) != MCD_OK))
        return st;
    if (need_M && (st = mcdi_check_M(ws, n, s->M)) != MCD_OK)
        return st;
    if ((st = mcdi_check_dij(ws, n, s->Dij)) != MCD_OK ||
        (st = mcdi_check_comp(ws, n, s->comp, "comp")) != MCD_OK ||
        (st = mcdi_check_finite(ws, n, nd, s->grad, "grad")) != MCD_OK)
        return st;
    if (s->Gamma != NULL &&
        (st = mcdi_check_finite(ws, n, n, s->Gamma, "Gamma")) != MCD_OK)
        return st;
    if (s->grad_lnP != NULL &&
        (st = mcdi_check_finite(ws, 1, nd, s->grad_lnP, "grad_lnP")) != MCD_OK)
        return st;
    return mcdi_check_thermal(ws, n, nd, s->kT, s->grad_lnT);
}

/* Copy the fluxes out unless one is not finite (inputs at the edge of the
 * double range, e.g. Đ ~ 1e-310, can overflow) or mass fluxes lost their
 * zero-sum to cancellation: EDOM then, out untouched. */
static mcd_status emit_checked(mcd_workspace *ws, size_t n, size_t nd,
                               const double *J, mcd_basis flux_basis,
                               double *out_flux)
{
    double acc[4] = {0.0, 0.0, 0.0, 0.0};
    size_t i;
    /* one NaN-propagating pass (J * 0 is NaN exactly for inf and NaN;
     * four independent sums, not one chain of n nd additions: every term
     * is 0 or NaN, so the order does not matter); the loop names the
     * species */
    for (i = 0; i + 4 <= n * nd; i += 4) {
        acc[0] += J[i] * 0.0;
        acc[1] += J[i + 1] * 0.0;
        acc[2] += J[i + 2] * 0.0;
        acc[3] += J[i + 3] * 0.0;
    }
    for (; i < n * nd; i++)
        acc[0] += J[i] * 0.0;
    if ((acc[0] + acc[1]) + (acc[2] + acc[3]) != 0.0)
        for (i = 0; i < n * nd; i++)
            if (!mcdi_finite(J[i]))
                return mcdi_fail(MCD_EDOM,
                                 "result: flux of species %zu is not "
                                 "finite (inputs outside the "
                                 "representable range)",
                                 i / nd);
    if (flux_basis == MCD_BASIS_MASS && !mcdi_mass_zero_sum_kept(n, nd, J))
        return mcdi_fail(MCD_EDOM,
                         "result: mass fluxes lost to cancellation (the "
                         "molar masses are too far apart for double "
                         "precision: %s)",
                         "sum over species not zero");
    memcpy(out_flux, J, n * nd * sizeof(double));
    return MCD_OK;
}

/* Whether every species is present (x_i > 0): one branch-free pass. */
static int all_present(size_t n, const double *x)
{
    int ok = 1;
    size_t i;
    for (i = 0; i < n; i++)
        ok &= x[i] > 0.0;
    return ok;
}

/* The fluxes of the state in v (x, d) into v.J, then the zero-sum
 * clean-up (weights x: trace species stay exact). The stages the batched
 * kernel runs, with one lane (ms_ldl.c, flux/solve_stages.h); the exact
 * model without trace species up to MCDI_MS_FUSED_N species by the fused
 * kernel of the same equations (flux_core.h says why). */
static mcd_status solve_state(mcd_workspace *ws, const mcdi_flux_view *v,
                              mcd_model model, size_t n, size_t nd,
                              const double *Dij, double c)
{
    size_t bad;
    if (model == MCD_MODEL_MAXWELL_STEFAN && n <= MCDI_MS_FUSED_N &&
        all_present(n, v->x)) {
        bad = mcdi_ms_ldl_select()(n, nd, v->x, Dij, n, v->d, c, v->A, v->tri,
                                   v->s, v->isq, v->S, v->dinv, v->J, v->Yt);
    } else {
        /* no Dg, iDg: the one-lane exact solve keeps its pivots in D */
        const mcdi_rows R = {v->tri, v->x,  v->s, v->S, v->num, v->minv, NULL,
                             NULL,   v->wk, v->d, v->t, v->r,   v->J,    &c};
        const mcdi_dense D = {v->A, v->dinv, v->Yt};
        bad = mcdi_ms_rows_select()(&R, &D, model, n, nd, Dij);
    }
    if (bad != 0)
        return mcdi_fail(MCD_ESING,
                         "Maxwell-Stefan matrix not positive definite at "
                         "pivot %zu (round-off; check Dij scale)",
                         bad - 1);
    mcdi_flux_zero_sum(n, nd, v->x, v->J);
    return MCD_OK;
}

mcd_status mcdi_flux_solve_exact(mcd_workspace *ws, size_t n, size_t nd,
                                 const double *x, const double *f,
                                 const double *Dij, double c, double *J)
{
    mcdi_flux_view v;
    mcd_status st;
    mcdi_flux_scratch(ws, &v);
    memcpy(v.x, x, n * sizeof(double));
    /* the projection of mcdi_driving_forces (f sums to zero already) */
    remove_along_into(v.d, f, NULL, v.x, n, 1, nd);
    if ((st = solve_state(ws, &v, MCD_MODEL_MAXWELL_STEFAN, n, nd, Dij, c)) !=
        MCD_OK)
        return st;
    memcpy(J, v.J, n * nd * sizeof(double));
    return MCD_OK;
}

mcd_status mcdi_flux_solve_exact_wide(mcd_workspace *ws, size_t n, size_t ncol,
                                      const double *x, double *F,
                                      const double *Dij, double c, double *Y)
{
    mcdi_flux_view v;
    size_t bad;
    mcdi_flux_scratch(ws, &v);
    remove_along(F, NULL, x, n, 1, ncol);
    bad = mcdi_ms_ldl_select()(n, ncol, x, Dij, n, F, c, v.A, v.tri, v.s, v.isq,
                               v.S, v.dinv, Y, F);
    if (bad != 0)
        return mcdi_fail(MCD_ESING,
                         "Maxwell-Stefan matrix not positive definite at "
                         "pivot %zu (round-off; check Dij scale)",
                         bad - 1);
    mcdi_flux_zero_sum(n, ncol, x, Y);
    return MCD_OK;
}

mcd_status mcdi_flux_state(mcd_workspace *ws, mcd_model model,
                           const mcd_state *state, mcd_basis flux_basis,
                           double *out_flux, mcdi_state_solver iterate)
{
    static const mcd_state none; /* read only after the NULL check below */
    const mcd_state *s = state != NULL ? state : &none;
    const size_t n = s->n_species, nd = s->n_dim;
    const double *M = s->M, *Dij = s->Dij, c = s->c;
    const mcd_basis comp_basis = s->comp_basis;
    const int need_M = comp_basis == MCD_BASIS_MASS ||
                       flux_basis == MCD_BASIS_MASS || s->grad_lnP != NULL;
    double *x, *w, *d, *J;
    const double *gx;
    mcdi_flux_view v;
    size_t dd;
    mcd_status st;

    if ((st = mcdi_check_ws_obj(ws, state, "state")) != MCD_OK)
        return st;
    /* validate everything before writing anything */
    if ((st = check_state(ws, model, s, flux_basis, out_flux, need_M,
                          iterate != NULL)) != MCD_OK)
        return st;
    if (n == 1) {
        for (dd = 0; dd < nd; dd++)
            out_flux[dd] = 0.0;
        return MCD_OK;
    }

    /* compute into workspace scratch */
    mcdi_flux_scratch(ws, &v);
    x = v.x;
    w = need_M ? v.w : NULL;
    d = v.d;
    J = v.J;
    mcdi_flux_fractions(n, need_M ? M : NULL, comp_basis, s->comp, x, w);
    if (comp_basis == MCD_BASIS_MOLE) {
        gx = s->grad;
    } else {
        mcdi_comp_grad_w_to_x(n, nd, M, w, s->grad, v.gx);
        gx = v.gx;
    }
    mcdi_driving_forces(n, 1, nd, x, w, gx, s->Gamma, s->grad_lnP, s->kT,
                        s->grad_lnT, d);
    st = model == MCD_MODEL_ITERATIVE
             ? iterate(ws, n, nd, x, d, Dij, c, J)
             : solve_state(ws, &v, model, n, nd, Dij, c);
    if (st != MCD_OK)
        return st;
    if (flux_basis == MCD_BASIS_MASS)
        mcdi_mass_fluxes(n, 1, nd, M, w, J);
    return emit_checked(ws, n, nd, J, flux_basis, out_flux);
}

/* The single-state core object for the chosen instruction set
 * (base/isa.c). */
mcdi_ms_ldl_fn mcdi_ms_ldl_select(void)
{
    switch (mcdi_isa()) {
#if defined(MCDI_HAVE_KISA)
    case 4: /* the x86-64-v3 build: no gain from AVX-512 on a few species */
    case 3: return mcdi_ms_ldl_v3;
#endif
    default: return mcdi_ms_ldl_v1;
    }
}

mcdi_ms_rows_fn mcdi_ms_rows_select(void)
{
    switch (mcdi_isa()) {
#if defined(MCDI_HAVE_KISA)
    case 4:
    case 3: return mcdi_ms_rows_v3;
#endif
    default: return mcdi_ms_rows_v1;
    }
}
