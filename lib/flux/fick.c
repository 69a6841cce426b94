/* fick.c - generalized Fick matrices, fluxes from them, and their
 * eigenvalues (mcd_fick_matrix, mcd_fick_fluxes, mcd_fick_eigenvalues).
 *
 * Molar frame (Taylor and Krishna 1993, ch. 2). Eliminating the flux of
 * the dependent species n with J_n = -sum_{k != n} J_k from the
 * Maxwell-Stefan equations of the other N - 1 species gives
 *     -c d_i = sum_{j != n} B_ij J_j,   i != n,
 *     B_ii = x_i / Đ_in + sum_{k != i} x_k / Đ_ik,
 *     B_ij = -x_i (1/Đ_ij - 1/Đ_in)       (j != i),
 * so (J) = -c [B]^-1 (d). With the driving forces written on the N - 1
 * independent gradients (grad x_n = -sum_{j != n} grad x_j),
 *     d_i = sum_j Gamma_ij grad x_j = sum_{j != n} (Gamma_ij - Gamma_in) grad x_j,
 * the reduced thermodynamic factor is Gr_ij = Gamma_ij - Gamma_in and
 *     [D] = [B]^-1 [Gr],   (J) = -c [D] (grad x).
 * mcd_flux_compute first projects the driving forces onto sum_i d_i = 0
 * with d -> (I - x 1^T) d; for identical results from both routes with any
 * caller Gamma, the same projection is applied here: Gamma' = (I - x 1^T)
 * Gamma, i.e. Gamma'_ij = Gamma_ij - x_i colsum_j, so
 *     Gr_ij = Gamma_ij - Gamma_in - x_i (colsum_j - colsum_n).
 * For a thermodynamically consistent Gamma (equal column sums) and for the
 * ideal mixture (Gamma = NULL, Gr = I) this changes nothing.
 * B is not symmetric: LU with partial pivoting, LAPACK dgetrf/dgetrs in
 * LAPACK_COL_MAJOR (B is assembled directly in column-major order so the
 * *_work calls do not allocate a transposed copy); for m <= FICK_SMALL_M a
 * hand-written elimination with partial pivoting does the same arithmetic
 * without the call overhead. B is nonsingular for
 * every admissible state (it represents the regular Maxwell-Stefan
 * operator on the zero-sum subspace); a trace species i has a diagonal
 * row, B_ii = Blanc sum, which reproduces Blanc's law. The dependent
 * species should be abundant: MCD_DEPENDENT_AUTO picks the largest x. Cost
 * O(N^3) (one LU and N - 1 solves).
 *
 * Mass frame. Let A and C be the (N-1) x (N-1) matrices of the basis
 * change on the independent species (k, i, j != n; Mbar = sum x_k M_k):
 *   fluxes:    j_i = M_i J_i - w_i sum_k M_k J_k
 *                  = sum_k A_ik J_k,   A_ik = M_i delta_ik - w_i (M_k - M_n),
 *   gradients: grad x_i = Mbar [grad w_i / M_i - x_i sum_k grad w_k / M_k]
 *                  = Mbar sum_k C_ik grad w_k,
 *              C_ik = delta_ik / M_i - x_i (1/M_k - 1/M_n),
 * using J_n = -sum J_k and grad w_n = -sum grad w_k. Then
 *     (j) = A (J) = -c A [D] (grad x) = -c Mbar A [D] C (grad w)
 *         = -rho [D°] (grad w),     [D°] = A [D] C   (rho = c Mbar).
 * Multiplying out, A C = I (using sum_k (M_k - M_n) x_k = Mbar - M_n and
 * x_i M_i = w_i Mbar), so [D°] = A [D] A^-1 is similar to [D]: same
 * eigenvalues in both frames (Taylor and Krishna 1993, ch. 3). A and C are
 * diagonal plus rank one, so the transformation costs O(N^2).
 */
#include <string.h>
#include <lapacke.h>

#include "base/mcd_internal.h"
#include "base/workspace.h"
#include "base/composition.h"
#include "flux/flux_core.h"
#include "flux/core_layout.h"

static inline double dij_pair(const double *Dij, size_t n, size_t i, size_t j)
{
    return i < j ? Dij[i * n + j] : Dij[j * n + i];
}

/* Largest m solved by the hand-written elimination (avoids the LAPACK call
 * overhead, which dominates for small systems). */
#ifndef FICK_SMALL_M
#define FICK_SMALL_M 24
#endif

/* Solve A X = R in place (A m x m, R m x m, both column-major) by Gaussian
 * elimination with partial pivoting applied to all right-hand sides at
 * once: the same arithmetic as dgetrf + dgetrs. Returns 0, or k+1 if
 * column k has no nonzero pivot. */
static size_t gauss_solve_small(size_t m, double *A, double *R)
{
    size_t i, j, k, q, p;
    for (k = 0; k < m; k++) {
        double big = fabs(A[k + k * m]), piv;
        p = k;
        for (i = k + 1; i < m; i++)
            if (fabs(A[i + k * m]) > big) {
                big = fabs(A[i + k * m]);
                p = i;
            }
        if (!(big > 0.0))
            return k + 1;
        if (p != k) {
            for (j = 0; j < m; j++) {
                double t = A[k + j * m];
                A[k + j * m] = A[p + j * m];
                A[p + j * m] = t;
                t = R[k + j * m];
                R[k + j * m] = R[p + j * m];
                R[p + j * m] = t;
            }
        }
        piv = A[k + k * m];
        for (i = k + 1; i < m; i++) {
            double l = A[i + k * m] / piv;
            if (l == 0.0)
                continue;
            for (j = k + 1; j < m; j++)
                A[i + j * m] -= l * A[k + j * m];
            for (q = 0; q < m; q++)
                R[i + q * m] -= l * R[k + q * m];
        }
    }
    for (q = 0; q < m; q++) {
        double *r = R + q * m;
        for (i = m; i-- > 0;) {
            double t = r[i];
            for (j = i + 1; j < m; j++)
                t -= A[i + j * m] * r[j];
            r[i] = t / A[i + i * m];
        }
    }
    return 0;
}

/* Reduced index (species other than dep, in order) -> species index. */
static size_t sp(size_t a, size_t dep) { return a < dep ? a : a + 1; }

/* B of Taylor and Krishna (column-major, element (r, q) at r + q m) with
 * dep the dependent species, and the reduced (projected) thermodynamic
 * factor in X (the identity when Gamma is NULL). cs: n scratch. */
static void assemble_B_gamma(size_t n, size_t dep, const double *x,
                             const double *Dij, const double *Gamma, double *B,
                             double *X, double *cs)
{
    const size_t m = n - 1;
    size_t r, q, k;
    for (r = 0; r < m; r++) {
        size_t i = sp(r, dep);
        double inv_in = 1.0 / dij_pair(Dij, n, i, dep);
        double diag = x[i] * inv_in;
        for (k = 0; k < n; k++)
            if (k != i)
                diag += x[k] / dij_pair(Dij, n, i, k);
        for (q = 0; q < m; q++) {
            size_t j = sp(q, dep);
            B[r + q * m] =
                (j == i) ? diag
                         : -x[i] * (1.0 / dij_pair(Dij, n, i, j) - inv_in);
        }
    }
    if (Gamma == NULL) {
        for (q = 0; q < m; q++)
            for (r = 0; r < m; r++)
                X[r + q * m] = r == q ? 1.0 : 0.0;
        return;
    }
    for (k = 0; k < n; k++) {
        double s = 0.0;
        size_t i;
        for (i = 0; i < n; i++)
            s += Gamma[i * n + k];
        cs[k] = s;
    }
    for (r = 0; r < m; r++) {
        size_t i = sp(r, dep);
        for (q = 0; q < m; q++) {
            size_t j = sp(q, dep);
            X[r + q * m] = Gamma[i * n + j] - Gamma[i * n + dep] -
                           x[i] * (cs[j] - cs[dep]);
        }
    }
}

/* X := B^-1 X (m x m, column-major): Gaussian elimination up to
 * FICK_SMALL_M, LAPACK's LU above. ESING when B is singular. */
static mcd_status solve_B(mcd_workspace *ws, size_t m, double *B, double *X,
                          int *ipiv)
{
    lapack_int info;
    if (m <= FICK_SMALL_M) {
        size_t bad = gauss_solve_small(m, B, X);
        if (bad != 0)
            return mcdi_fail(MCD_ESING,
                             "Maxwell-Stefan matrix B singular at column %zu",
                             bad - 1);
        return MCD_OK;
    }
    info = LAPACKE_dgetrf_work(LAPACK_COL_MAJOR, (lapack_int)m, (lapack_int)m,
                               B, (lapack_int)m, ipiv);
    if (info > 0)
        return mcdi_fail(MCD_ESING,
                         "Maxwell-Stefan matrix B singular (dgetrf "
                         "info %d)",
                         (int)info);
    if (info < 0)
        return mcdi_fail(MCD_EINTERNAL, "dgetrf info %d", (int)info);
    info =
        LAPACKE_dgetrs_work(LAPACK_COL_MAJOR, 'N', (lapack_int)m, (lapack_int)m,
                            B, (lapack_int)m, ipiv, X, (lapack_int)m);
    if (info != 0)
        return mcdi_fail(MCD_EINTERNAL, "dgetrs info %d", (int)info);
    return MCD_OK;
}

/* Mass-basis Fick matrix in place of the molar one X (column-major):
 * [D°] = A [D] C, A = diag(M) - w dM^T, C = diag(1/M) - x dI^T with
 * dM_k = M_k - M_n, dI_k = 1/M_k - 1/M_n (reduced indices). t, qv: m
 * scratch each. */
static void fick_to_mass_basis(size_t n, size_t dep, const double *M,
                               const double *x, const double *w, double *X,
                               double *t, double *qv)
{
    const size_t m = n - 1;
    const double Mn = M[dep];
    size_t r, q;
    for (q = 0; q < m; q++) { /* t = dM^T [D] (row vector) */
        double s = 0.0;
        for (r = 0; r < m; r++)
            s += (M[sp(r, dep)] - Mn) * X[r + q * m];
        t[q] = s;
    }
    for (q = 0; q < m; q++)
        for (r = 0; r < m; r++) {
            size_t i = sp(r, dep);
            X[r + q * m] = M[i] * X[r + q * m] - w[i] * t[q];
        }
    for (r = 0; r < m; r++) { /* qv = (A[D]) x */
        double s = 0.0;
        for (q = 0; q < m; q++)
            s += X[r + q * m] * x[sp(q, dep)];
        qv[r] = s;
    }
    for (q = 0; q < m; q++) {
        size_t j = sp(q, dep);
        double inv_j = 1.0 / M[j], dI = 1.0 / M[j] - 1.0 / Mn;
        for (r = 0; r < m; r++)
            X[r + q * m] = X[r + q * m] * inv_j - qv[r] * dI;
    }
}

mcd_status mcdi_api_fick_matrix(mcd_workspace *ws, const mcd_state *state,
                                mcd_basis basis, size_t dependent,
                                double *out_D, size_t *out_dependent)
{
    static const mcd_state none; /* read only after the NULL check below */
    const mcd_state *s = state != NULL ? state : &none;
    const size_t n = s->n_species;
    const double *M = s->M, *Dij = s->Dij, *comp = s->comp, *Gamma = s->Gamma;
    const mcd_basis comp_basis = s->comp_basis;
    size_t m, dep, r, q;
    int need_M;
    double *x, *w, *B, *X, *cs, *t, *qv;
    int *ipiv;
    mcdi_fick_view v;
    mcdi_fick_iview iv;
    mcd_status st;

    if ((st = mcdi_check_ws_obj(ws, state, "state")) != MCD_OK)
        return st;
    if ((st = mcdi_check_species(ws, n, 1, 0, "n_species")) != MCD_OK ||
        (st = mcdi_check_basis(ws, comp_basis, "comp_basis")) != MCD_OK ||
        (st = mcdi_check_basis(ws, basis, "basis")) != MCD_OK)
        return st;
    if (dependent != MCD_DEPENDENT_AUTO && dependent >= n)
        return mcdi_fail(MCD_EINVAL,
                         "argument dependent: %zu is not a species index "
                         "(0..%zu) nor MCD_DEPENDENT_AUTO",
                         dependent, n - 1);
    if (n > 1 && out_D == NULL)
        return mcdi_fail(MCD_EINVAL, "argument out_D: NULL");
    need_M = comp_basis == MCD_BASIS_MASS || basis == MCD_BASIS_MASS;
    if (need_M && (st = mcdi_check_M(ws, n, M)) != MCD_OK)
        return st;
    if ((st = mcdi_check_dij(ws, n, Dij)) != MCD_OK)
        return st;
    if ((st = mcdi_check_comp(ws, n, comp, "comp")) != MCD_OK)
        return st;
    if (Gamma != NULL &&
        (st = mcdi_check_finite(ws, n, n, Gamma, "Gamma")) != MCD_OK)
        return st;

    mcdi_fick_scratch(ws, &v, &iv);
    x = v.x;
    w = v.w;
    mcdi_flux_fractions(n, need_M ? M : NULL, comp_basis, comp, x, w);
    dep = dependent == MCD_DEPENDENT_AUTO ? mcdi_flux_most_abundant(n, x)
                                          : dependent;
    if (n == 1) {
        if (out_dependent != NULL)
            *out_dependent = dep;
        return MCD_OK;
    }
    m = n - 1;
    B = v.B;
    X = v.X;
    cs = v.cs;
    t = v.t;
    qv = v.qv;
    ipiv = iv.ipiv;

    assemble_B_gamma(n, dep, x, Dij, Gamma, B, X, cs);
    if ((st = solve_B(ws, m, B, X, ipiv)) != MCD_OK)
        return st;
    if (basis == MCD_BASIS_MASS)
        fick_to_mass_basis(n, dep, M, x, w, X, t, qv);

    for (r = 0; r < m * m; r++)
        if (!mcdi_finite(X[r]))
            return mcdi_fail(MCD_EDOM,
                             "result: Fick matrix entry not finite (inputs "
                             "outside the representable range)");
    for (r = 0; r < m; r++)
        for (q = 0; q < m; q++)
            out_D[r * m + q] = X[r + q * m];
    if (out_dependent != NULL)
        *out_dependent = dep;
    return MCD_OK;
}

mcd_status mcdi_api_fick_fluxes(size_t n_species, size_t n_dim, const double *D,
                                size_t dependent, double conc,
                                const double *grad, double *out_flux)
{
    const size_t n = n_species, nd = n_dim;
    size_t m, r, q, dd, i;
    int pass;

    if (n < 1 || n > MCD_MAX_SPECIES || nd < 1 || nd > MCD_MAX_DIM)
        return MCD_EINVAL;
    if (dependent >= n || grad == NULL || out_flux == NULL ||
        (n > 1 && D == NULL))
        return MCD_EINVAL;
    if (!mcdi_finite(conc))
        return MCD_EINVAL;
    if (!(conc > 0.0))
        return MCD_EDOM;
    m = n - 1;
    for (r = 0; r < m * m; r++)
        if (!mcdi_finite(D[r]))
            return MCD_EINVAL;
    for (i = 0; i < n; i++)
        if (i != dependent)
            for (dd = 0; dd < nd; dd++)
                if (!mcdi_finite(grad[i * nd + dd]))
                    return MCD_EINVAL;

    /* Two passes over the same arithmetic: the first only checks that no
     * flux overflows (finite inputs can still give inf, e.g. D ~ 1e300 and
     * grad ~ 1e300), so that on MCD_EDOM nothing has been written; the
     * second stores. Both passes compute bit-identical values. */
    for (pass = 0; pass < 2; pass++) {
        for (dd = 0; dd < nd; dd++) {
            double s = 0.0;
            for (r = 0; r < m; r++) {
                size_t ir = r < dependent ? r : r + 1;
                double f = 0.0;
                for (q = 0; q < m; q++) {
                    size_t iq = q < dependent ? q : q + 1;
                    f += D[r * m + q] * grad[iq * nd + dd];
                }
                f *= -conc;
                if (pass == 1)
                    out_flux[ir * nd + dd] = f;
                s += f;
            }
            if (pass == 0 && !mcdi_finite(s))
                return MCD_EDOM; /* a flux or their sum overflows */
            if (pass == 1)
                out_flux[dependent * nd + dd] = -s;
        }
    }
    return MCD_OK;
}

/* Eigenvalues of a caller's Fick matrix: LAPACK dgeev (balancing,
 * Hessenberg reduction and shifted QR; no eigenvectors), because [D] is
 * not symmetric. Its work array is sized once at workspace allocation by a
 * workspace query (see workspace.c), so nothing is allocated here. For an
 * ideal gas [D] is similar to a symmetric positive definite matrix (the
 * symmetric Maxwell-Stefan form), so the exact eigenvalues are real and
 * positive; dgeev computes them with backward error ~ eps ||D||, and a
 * nearly degenerate pair may come out as a complex pair with an imaginary
 * part of that order. Eigenvalues are invariant under the choice of the
 * dependent species and under the frame change (similarity). Reference:
 * Taylor and Krishna (1993), ch. 5 (eigenvalues of [D] and the
 * linearized theory of Toor 1964 and Stewart and Prober 1964). */
mcd_status mcdi_api_fick_eigenvalues(mcd_workspace *ws, size_t m,
                                     const double *D, double *out_re,
                                     double *out_im)
{
    double *A, *wr, *wi, dummy = 0.0;
    mcdi_fick_view v;
    mcdi_fick_iview iv;
    size_t k, l;
    lapack_int info;
    mcd_status st;

    if (ws == NULL)
        return MCD_EINVAL;
    if (m > ws->cap - 1)
        return mcdi_fail(MCD_EBADLEN,
                         "argument order: %zu exceeds the workspace capacity "
                         "minus one (%zu)",
                         m, ws->cap - 1);
    if (m == 0)
        return MCD_OK;
    if ((st = MCDI_CHECK_PTRS3(D, out_re, out_im)) != MCD_OK ||
        (st = mcdi_check_finite(ws, m, m, D, "D")) != MCD_OK)
        return st;
    /* The row-major D read as column-major is D^T: same eigenvalues. */
    mcdi_fick_scratch(ws, &v, &iv);
    A = v.B;
    wr = v.wr;
    wi = v.wi;
    memcpy(A, D, m * m * sizeof(double));
    info = LAPACKE_dgeev_work(LAPACK_COL_MAJOR, 'N', 'N', (lapack_int)m, A,
                              (lapack_int)m, wr, wi, &dummy, 1, &dummy, 1,
                              ws->geev_work, (lapack_int)ws->geev_lwork);
    if (info > 0)
        return mcdi_fail(MCD_ESING,
                         "dgeev: QR iteration did not converge (info %d)",
                         (int)info);
    if (info < 0)
        return mcdi_fail(MCD_EINTERNAL, "dgeev info %d", (int)info);
    /* finite entries near DBL_MAX can have eigenvalues that overflow
     * (found by fuzz_flux): never hand them out */
    for (k = 0; k < m; k++)
        if (!mcdi_finite(wr[k]) || !mcdi_finite(wi[k]))
            return mcdi_fail(MCD_EDOM,
                             "result: eigenvalue %zu is not finite (entries "
                             "of D too large)",
                             k);
    /* insertion sort by decreasing real part, then decreasing imaginary
     * part (keeps a conjugate pair together, positive part first) */
    for (k = 1; k < m; k++) {
        double a = wr[k], b = wi[k];
        l = k;
        while (l > 0 && (wr[l - 1] < a || (wr[l - 1] == a && wi[l - 1] < b))) {
            wr[l] = wr[l - 1];
            wi[l] = wi[l - 1];
            l--;
        }
        wr[l] = a;
        wi[l] = b;
    }
    memcpy(out_re, wr, m * sizeof(double));
    memcpy(out_im, wi, m * sizeof(double));
    return MCD_OK;
}
