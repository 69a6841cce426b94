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
 * Factorisation: hand-written Cholesky for up to MS_SMALL_N species present
 * (no call overhead, row-major lower triangle); above that LAPACK
 * dpotrf/dpotrs (blocked Cholesky, LAPACK_COL_MAJOR: the matrix is
 * symmetric so the layout does not matter, and the *_work variants do not
 * allocate). Cost O(N^3 / 3) per state plus O(N^2 n_dim).
 *
 * Zero-sum clean-up: after the solve the residual r = sum_i J_i (round-off
 * only) is removed with weights x (J_i -= x_i r), again leaving trace
 * species exact. In the mass basis j_i = M_i J_i - w_i sum_k M_k J_k and
 * the residual of sum j_i is removed with weights w.
 */
#include <float.h>
#include <string.h>
#include <lapacke.h>

#include "mcd_internal.h"
#include "workspace.h"
#include "composition.h"
#include "flux_core.h"

/* Largest number of species present solved by the hand-written Cholesky. */
#ifndef MS_SMALL_N
#define MS_SMALL_N 24
#endif

/* ------------------------------------------------------------------ */
/* validators                                                           */
/* ------------------------------------------------------------------ */

mcd_status mcdi_flux_check_dij(mcd_workspace *ws, size_t n, const double *Dij)
{
    size_t i, j;
    if (Dij == NULL)
        return mcdi_ws_fail(ws, MCD_EINVAL, "argument Dij: NULL");
    for (i = 0; i < n; i++)
        for (j = 0; j < n; j++)
            if (i != j && !mcdi_finite(Dij[i * n + j]))
                return mcdi_ws_fail(ws, MCD_EINVAL,
                                    "argument Dij: entry (%zu,%zu) is not finite",
                                    i, j);
    for (i = 0; i < n; i++)
        for (j = 0; j < n; j++)
            if (i != j && !(Dij[i * n + j] > 0.0))
                return mcdi_ws_fail(ws, MCD_EDOM,
                                    "argument Dij: entry (%zu,%zu) = %g is not > 0",
                                    i, j, Dij[i * n + j]);
    for (i = 0; i < n; i++)
        for (j = i + 1; j < n; j++) {
            double a = Dij[i * n + j], b = Dij[j * n + i];
            double big = a > b ? a : b;
            if (!(fabs(a - b) <= MCDI_DIJ_SYM_TOL * big))
                return mcdi_ws_fail(ws, MCD_EDOM,
                                    "argument Dij: entries (%zu,%zu) = %.17g and "
                                    "(%zu,%zu) = %.17g differ by more than 1e-12 "
                                    "relative (not symmetric)",
                                    i, j, a, j, i, b);
        }
    return MCD_OK;
}

mcd_status mcdi_flux_check_comp(mcd_workspace *ws, size_t n, const double *y,
                                const char *name)
{
    double s = 0.0;
    size_t i;
    mcd_status st;
    if (y == NULL)
        return mcdi_ws_fail(ws, MCD_EINVAL, "argument %s: NULL", name);
    st = mcdi_comp_check(n, y, NULL);
    if (st == MCD_OK)
        return MCD_OK;
    /* locate the offending entry for the message (same order of checks as
     * mcdi_comp_check: non-finite first, then negative, then the sum) */
    for (i = 0; i < n; i++)
        if (!mcdi_finite(y[i]))
            return mcdi_ws_fail(ws, st, "argument %s: entry %zu is not finite",
                                name, i);
    for (i = 0; i < n; i++)
        if (!(y[i] >= 0.0))
            return mcdi_ws_fail(ws, st, "argument %s: entry %zu = %g is negative",
                                name, i, y[i]);
    for (i = 0; i < n; i++)
        s += y[i];
    /* "1e-6" is MCD_SUM_TOL, written out for a readable message */
    return mcdi_ws_fail(ws, st,
                        "argument %s: sum %.10g differs from 1 by more than 1e-6",
                        name, s);
}

mcd_status mcdi_flux_check_M(mcd_workspace *ws, size_t n, const double *M)
{
    size_t i;
    mcd_status st;
    if (M == NULL)
        return mcdi_ws_fail(ws, MCD_EINVAL,
                            "argument M: NULL but needed (mass basis or "
                            "pressure diffusion)");
    st = mcdi_comp_check_M(n, M);
    if (st == MCD_OK)
        return MCD_OK;
    for (i = 0; i < n; i++)
        if (!mcdi_finite(M[i]))
            return mcdi_ws_fail(ws, st, "argument M: entry %zu is not finite", i);
    for (i = 0; i < n; i++)
        if (!(M[i] > 0.0))
            return mcdi_ws_fail(ws, st, "argument M: entry %zu = %g is not > 0",
                                i, M[i]);
    return mcdi_ws_fail(ws, st, "argument M: invalid");
}

mcd_status mcdi_flux_check_finite(mcd_workspace *ws, size_t rows, size_t cols,
                                  const double *p, const char *name)
{
    size_t i, k;
    if (p == NULL)
        return mcdi_ws_fail(ws, MCD_EINVAL, "argument %s: NULL", name);
    for (i = 0; i < rows; i++)
        for (k = 0; k < cols; k++)
            if (!mcdi_finite(p[i * cols + k]))
                return mcdi_ws_fail(ws, MCD_EINVAL,
                                    "argument %s: entry (%zu,%zu) is not finite",
                                    name, i, k);
    return MCD_OK;
}

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

/* Binary diffusivity of pair (i, j), i != j, always read from the upper
 * triangle so that the assembled matrices are exactly symmetric. */
static inline double dij_pair(const double *Dij, size_t n, size_t i, size_t j)
{
    return i < j ? Dij[i * n + j] : Dij[j * n + i];
}

/* In-place Cholesky A = L L^T of an m x m row-major SPD matrix (lower
 * triangle used and overwritten). Returns 0, or k+1 if pivot k is not
 * positive. */
static size_t chol_small(size_t m, double *A)
{
    size_t i, j, k;
    for (j = 0; j < m; j++) {
        double *Lj = A + j * m;
        double s = Lj[j];
        for (k = 0; k < j; k++)
            s -= Lj[k] * Lj[k];
        if (!(s > 0.0))
            return j + 1;
        s = sqrt(s);
        Lj[j] = s;
        for (i = j + 1; i < m; i++) {
            double *Li = A + i * m;
            double t = Li[j];
            for (k = 0; k < j; k++)
                t -= Li[k] * Lj[k];
            Li[j] = t / s;
        }
    }
    return 0;
}

/* Solve L L^T u = b for nd right-hand sides stored column-major (b[k +
 * dd*m]) after chol_small. */
static void chol_small_solve(size_t m, const double *L, size_t nd, double *b)
{
    size_t dd, i, k;
    for (dd = 0; dd < nd; dd++) {
        double *v = b + dd * m;
        for (i = 0; i < m; i++) {
            double t = v[i];
            for (k = 0; k < i; k++)
                t -= L[i * m + k] * v[k];
            v[i] = t / L[i * m + i];
        }
        for (i = m; i-- > 0;) {
            double t = v[i];
            for (k = i + 1; k < m; k++)
                t -= L[k * m + i] * v[k];
            v[i] = t / L[i * m + i];
        }
    }
}

/* ------------------------------------------------------------------ */
/* exact Maxwell-Stefan kernel                                          */
/* ------------------------------------------------------------------ */

mcd_status mcdi_ms_fluxes(mcd_workspace *ws, size_t n, size_t nd,
                          const double *x, const double *d,
                          const double *Dij, double c, double *J)
{
    double *A = ws->core_mat[0];
    double *rhs = ws->core_nd[3];
    double *sq = ws->core_vec[2];   /* sqrt(x) of present species (compact) */
    double *S = ws->core_vec[3];    /* Blanc sums sum_j x_j / Đ_ij */
    int *pos = ws->core_idx[0];     /* species present (x > 0) */
    int *tr = ws->core_idx[1];      /* trace species (x = 0) */
    double ST[MCD_MAX_DIM] = {0.0, 0.0, 0.0};
    size_t m = 0, nt = 0, i, k, l, dd;

    if (n == 1) {
        for (dd = 0; dd < nd; dd++)
            J[dd] = 0.0;
        return MCD_OK;
    }
    for (i = 0; i < n; i++) {
        if (x[i] > 0.0)
            pos[m++] = (int)i;
        else
            tr[nt++] = (int)i;
        S[i] = 0.0;
    }
    /* m >= 1 because the fractions sum to 1. */

    /* Assemble the scaled matrix Gs on the species present and their Blanc
     * sums (trace species contribute x_j = 0 to them). */
    for (k = 0; k < m; k++)
        sq[k] = sqrt(x[pos[k]]);
    for (k = 0; k < m; k++) {
        size_t ik = (size_t)pos[k];
        A[k * m + k] = 0.0;
        for (l = k + 1; l < m; l++) {
            size_t il = (size_t)pos[l];
            double inv = 1.0 / dij_pair(Dij, n, ik, il);
            S[ik] += x[il] * inv;
            S[il] += x[ik] * inv;
            A[k * m + l] = A[l * m + k] = -sq[k] * sq[l] * inv;
        }
    }

    /* Trace species: Blanc's law, exact. */
    for (k = 0; k < nt; k++) {
        size_t it = (size_t)tr[k];
        double s = 0.0;
        for (l = 0; l < m; l++)
            s += x[pos[l]] / dij_pair(Dij, n, it, (size_t)pos[l]);
        S[it] = s;
        for (dd = 0; dd < nd; dd++) {
            double Ji = -c * d[it * nd + dd] / s;
            J[it * nd + dd] = Ji;
            ST[dd] += Ji;
        }
    }

    if (m == 1) {
        /* pure component: it balances the trace fluxes */
        size_t ip = (size_t)pos[0];
        for (dd = 0; dd < nd; dd++)
            J[ip * nd + dd] = -ST[dd];
    } else {
        double a = 0.0;
        for (k = 0; k < m; k++)
            if (S[pos[k]] > a)
                a = S[pos[k]];
        /* Right-hand side -(d_i - x_i sum_T J_t / (c Đ_it)) / s_i,
         * column-major m x nd. */
        for (k = 0; k < m; k++) {
            size_t ik = (size_t)pos[k];
            for (dd = 0; dd < nd; dd++) {
                double dti = d[ik * nd + dd];
                for (l = 0; l < nt; l++) {
                    size_t it = (size_t)tr[l];
                    dti -= x[ik] * J[it * nd + dd] /
                           (c * dij_pair(Dij, n, ik, it));
                }
                rhs[k + dd * m] = -dti / sq[k];
            }
        }
        /* Gs + a s s^T */
        for (k = 0; k < m; k++) {
            A[k * m + k] = S[pos[k]] + a * x[pos[k]];
            for (l = k + 1; l < m; l++) {
                double v = A[k * m + l] + a * sq[k] * sq[l];
                A[k * m + l] = A[l * m + k] = v;
            }
        }
        if (m <= MS_SMALL_N) {
            size_t bad = chol_small(m, A);
            if (bad != 0)
                return mcdi_ws_fail(ws, MCD_ESING,
                                    "Maxwell-Stefan matrix not positive definite "
                                    "at pivot %zu (round-off; check Dij scale)",
                                    bad - 1);
            chol_small_solve(m, A, nd, rhs);
        } else {
            lapack_int info = LAPACKE_dpotrf_work(LAPACK_COL_MAJOR, 'L',
                                                  (lapack_int)m, A,
                                                  (lapack_int)m);
            if (info > 0)
                return mcdi_ws_fail(ws, MCD_ESING,
                                    "Maxwell-Stefan matrix not positive definite "
                                    "(dpotrf info %d)", (int)info);
            if (info < 0)
                return mcdi_ws_fail(ws, MCD_EINTERNAL, "dpotrf info %d",
                                    (int)info);
            info = LAPACKE_dpotrs_work(LAPACK_COL_MAJOR, 'L', (lapack_int)m,
                                       (lapack_int)nd, A, (lapack_int)m, rhs,
                                       (lapack_int)m);
            if (info != 0)
                return mcdi_ws_fail(ws, MCD_EINTERNAL, "dpotrs info %d",
                                    (int)info);
        }
        for (k = 0; k < m; k++) {
            size_t ik = (size_t)pos[k];
            for (dd = 0; dd < nd; dd++)
                J[ik * nd + dd] = c * sq[k] * rhs[k + dd * m] - x[ik] * ST[dd];
        }
    }

    /* zero-sum clean-up with weights x (trace species stay exact) */
    for (dd = 0; dd < nd; dd++) {
        double r = 0.0;
        for (i = 0; i < n; i++)
            r += J[i * nd + dd];
        for (i = 0; i < n; i++)
            J[i * nd + dd] -= x[i] * r;
    }
    return MCD_OK;
}

/* ------------------------------------------------------------------ */
/* public entry                                                         */
/* ------------------------------------------------------------------ */

MCD_API mcd_status mcd_flux_compute(mcd_workspace *ws, mcd_model model,
                                    size_t n_species, size_t n_dim,
                                    const double *M, const double *Dij,
                                    double c, mcd_basis comp_basis,
                                    const double *comp,
                                    const double *grad_comp,
                                    const double *Gamma,
                                    const double *grad_lnP,
                                    mcd_basis flux_basis, double *out_flux)
{
    const size_t n = n_species, nd = n_dim;
    int need_M;
    double *x, *w, *d, *J;
    const double *gx;
    size_t i, j, dd;
    mcd_status st;

    if (ws == NULL)
        return MCD_EINVAL;
    mcdi_ws_clear_error(ws);

    /* ---- validate everything before writing anything ---- */
    if (n < 1)
        return mcdi_ws_fail(ws, MCD_EINVAL, "argument n_species: 0 is not >= 1");
    if (n > ws->cap)
        return mcdi_ws_fail(ws, MCD_EBADLEN,
                            "argument n_species: %zu exceeds the workspace "
                            "capacity %zu", n, ws->cap);
    if (nd < 1 || nd > MCD_MAX_DIM)
        return mcdi_ws_fail(ws, MCD_EINVAL,
                            "argument n_dim: %zu is not in 1..%d", nd,
                            MCD_MAX_DIM);
    if (model != MCD_MODEL_MAXWELL_STEFAN && model != MCD_MODEL_MIXTURE_AVERAGED)
        return mcdi_ws_fail(ws, MCD_EINVAL, "argument model: unknown value %d",
                            (int)model);
    if (comp_basis != MCD_BASIS_MOLE && comp_basis != MCD_BASIS_MASS)
        return mcdi_ws_fail(ws, MCD_EINVAL,
                            "argument comp_basis: unknown value %d",
                            (int)comp_basis);
    if (flux_basis != MCD_BASIS_MOLE && flux_basis != MCD_BASIS_MASS)
        return mcdi_ws_fail(ws, MCD_EINVAL,
                            "argument flux_basis: unknown value %d",
                            (int)flux_basis);
    if (out_flux == NULL)
        return mcdi_ws_fail(ws, MCD_EINVAL, "argument out_flux: NULL");
    if (!mcdi_finite(c))
        return mcdi_ws_fail(ws, MCD_EINVAL, "argument c: not finite");
    /* A subnormal c (< DBL_MIN) is rejected: the fluxes would underflow
     * unevenly and lose the zero-sum. */
    if (!(c >= DBL_MIN))
        return mcdi_ws_fail(ws, MCD_EDOM,
                            "argument c: %g is not a normal positive number", c);
    need_M = comp_basis == MCD_BASIS_MASS || flux_basis == MCD_BASIS_MASS ||
             grad_lnP != NULL;
    if (need_M && (st = mcdi_flux_check_M(ws, n, M)) != MCD_OK)
        return st;
    if ((st = mcdi_flux_check_dij(ws, n, Dij)) != MCD_OK)
        return st;
    if ((st = mcdi_flux_check_comp(ws, n, comp, "comp")) != MCD_OK)
        return st;
    if ((st = mcdi_flux_check_finite(ws, n, nd, grad_comp, "grad_comp")) !=
        MCD_OK)
        return st;
    if (Gamma != NULL &&
        (st = mcdi_flux_check_finite(ws, n, n, Gamma, "Gamma")) != MCD_OK)
        return st;
    if (grad_lnP != NULL &&
        (st = mcdi_flux_check_finite(ws, 1, nd, grad_lnP, "grad_lnP")) !=
            MCD_OK)
        return st;

    if (n == 1) {
        for (dd = 0; dd < nd; dd++)
            out_flux[dd] = 0.0;
        return MCD_OK;
    }

    /* ---- compute into workspace scratch ---- */
    x = ws->core_vec[0];
    w = need_M ? ws->core_vec[1] : NULL;
    d = ws->core_nd[1];
    J = ws->core_nd[2];
    mcdi_flux_fractions(n, need_M ? M : NULL, comp_basis, comp, x, w);

    if (comp_basis == MCD_BASIS_MOLE) {
        gx = grad_comp;
    } else {
        mcdi_comp_grad_w_to_x(n, nd, M, w, grad_comp, ws->core_nd[0]);
        gx = ws->core_nd[0];
    }

    /* driving forces d_i = sum_j Gamma_ij grad x_j + (x_i - w_i) grad ln P */
    if (Gamma != NULL) {
        for (i = 0; i < n; i++)
            for (dd = 0; dd < nd; dd++) {
                double s = 0.0;
                for (j = 0; j < n; j++)
                    s += Gamma[i * n + j] * gx[j * nd + dd];
                d[i * nd + dd] = s;
            }
    } else {
        memcpy(d, gx, n * nd * sizeof(double));
    }
    if (grad_lnP != NULL)
        for (i = 0; i < n; i++)
            for (dd = 0; dd < nd; dd++)
                d[i * nd + dd] += (x[i] - w[i]) * grad_lnP[dd];
    /* projection onto sum_i d_i = 0 with weights x (see the top comment) */
    for (dd = 0; dd < nd; dd++) {
        double s = 0.0;
        for (i = 0; i < n; i++)
            s += d[i * nd + dd];
        for (i = 0; i < n; i++)
            d[i * nd + dd] -= x[i] * s;
    }

    if (model == MCD_MODEL_MAXWELL_STEFAN) {
        st = mcdi_ms_fluxes(ws, n, nd, x, d, Dij, c, J);
        if (st != MCD_OK)
            return st;
    } else {
        mcdi_mixavg_fluxes(n, nd, x, d, Dij, c, J, ws->core_vec[3],
                           ws->core_vec[4]);
    }

    if (flux_basis == MCD_BASIS_MASS) {
        /* j_i = M_i J_i - w_i sum_k M_k J_k, then remove the round-off
         * residual of sum_i j_i with weights w */
        for (dd = 0; dd < nd; dd++) {
            double s = 0.0, r = 0.0;
            for (i = 0; i < n; i++)
                s += M[i] * J[i * nd + dd];
            for (i = 0; i < n; i++) {
                J[i * nd + dd] = M[i] * J[i * nd + dd] - w[i] * s;
                r += J[i * nd + dd];
            }
            for (i = 0; i < n; i++)
                J[i * nd + dd] -= w[i] * r;
        }
    }

    /* inputs at the edge of the double range (e.g. Đ ~ 1e-310) can
     * overflow; never hand out non-finite fluxes */
    for (i = 0; i < n * nd; i++)
        if (!mcdi_finite(J[i]))
            return mcdi_ws_fail(ws, MCD_EDOM,
                                "result: flux of species %zu is not finite "
                                "(inputs outside the representable range)",
                                i / nd);
    memcpy(out_flux, J, n * nd * sizeof(double));
    return MCD_OK;
}
