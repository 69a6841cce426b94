/* film.c - steady multicomponent diffusion through a film or Stefan tube.
 *
 * Model. One-dimensional, isothermal, isobaric ideal-gas film 0 <= z <= L
 * with constant total concentration c, binary diffusivities Đ_ij and
 * constant total molar fluxes N_i (steady state, no reaction). The
 * Maxwell-Stefan equations in terms of total fluxes,
 *
 *   c dx_i/dz = sum_{j != i} (x_i N_j - x_j N_i) / Đ_ij,          (1)
 *
 * are LINEAR in x for given N. Two equivalent forms are used.
 *
 * (a) Full form, all N species: dx/dz = (1/c) [A] x with
 *     A_ii = sum_{j != i} N_j/Đ_ij, A_ij = -N_i/Đ_ij. Every column of [A]
 *     sums to zero, so sum_i x_i is conserved exactly, and the profile is
 *     x(z) = exp((z/c)[A]) x0 (mcd_film_profile, RATIOS bootstrap).
 *
 * (b) Reduced form (Krishna and Standart 1976; Taylor and Krishna 1993,
 *     ch. 8): eliminate a dependent species d (the most abundant) with
 *     x_d = 1 - sum of the others; in eta = z/L the N-1 fractions obey
 *       dx/deta = [Phi] x + phi,
 *       Phi_ii = (L/c)(N_i/Đ_id + sum_{k != i} N_k/Đ_ik),
 *       Phi_ij = -(L/c) N_i (1/Đ_ij - 1/Đ_id),
 *     which has the same structure as the Maxwell-Stefan matrix [B] of
 *     mcd_fick_matrix with x replaced by (L/c) N. Solving the linear ODE
 *     between x0 and xL gives the composition gradients at both ends:
 *       dx/deta|_0 = -phi1(Phi)^-1 (x0 - xL),
 *       dx/deta|_L = -phi1(Phi)^-1 exp(Phi) (x0 - xL),
 *     with phi1(Phi) = (exp(Phi) - I) Phi^-1 = sum_k Phi^k/(k+1)!, an
 *     entire function, so no inverse of a possibly singular [Phi] (zero
 *     fluxes, equimolar binary) is needed. This is the Krishna-Standart
 *     correction matrix [Xi] = [Phi][exp(Phi) - I]^-1 = phi1(Phi)^-1 in a
 *     form that stays well defined at zero flux. With c dx/dz = -[B(x)] J
 *     at an end e, the diffusion fluxes there are
 *       J_e = (c/L) [B(x_e)]^-1 [Xi] (x0 - xL)          (end 0),
 *       J_e = (c/L) [B(x_e)]^-1 [Xi] exp(Phi) (x0 - xL) (end L),
 *     i.e. J_e = (c/L) (phi1(Phi) B_e)^-1 r with r the right-hand side, and
 *     the total fluxes follow from the bootstrap, N = J_e + x_e N_t
 *     ((N) = c [beta][k*](x0 - xL) in Krishna and Standart's notation).
 *     Because [Phi] depends on N, the fluxes are found by successive
 *     substitution from the zero-flux (Phi = 0) estimate, accelerated by
 *     Anderson mixing (see film_iterate).
 *
 * Linearized theory (Toor 1964; Stewart and Prober 1964): [D] = [B]^-1
 * frozen at the mean composition xbar = (x0 + xL)/2, so that (reduced)
 * c dx/dz = -[B(xbar)] (N - x N_t) and [Phi] = (N_t L/c) [B(xbar)]; the same end formulas apply with
 * B_e = B(xbar) (all matrices are then functions of one matrix and
 * commute).
 *
 * Matrix functions: exp(A) and phi1(A) by scaling and squaring (Moler and
 * Van Loan 2003, method 3; Higham 2008, ch. 10): A is scaled by 2^-s so
 * that ||A||_1 <= 1/2, phi1 is summed by Horner's rule to the A^14/15!
 * term (truncation below 2e-18 relative), exp(A) = I + A phi1(A), and the
 * pair is squared back with exp(2A) = exp(A)^2,
 * phi1(2A) = (exp(A) + I) phi1(A) / 2. This is stable for the real,
 * non-negative spectra of Maxwell-Stefan matrices and needs no eigenvectors
 * (an eigen-decomposition loses accuracy when [Phi] is close to defective,
 * e.g. when two fluxes are nearly equal). Rounding grows with the number
 * s of squarings; for films with rate factors ||Phi|| of order 1 to 10 the
 * fluxes agree with an independent RK4 shooting solution to ~1e-13
 * (tests/test_film.c).
 *
 * Linear systems (phi1(Phi) B_e) J = r: LAPACK dgetrf/dgetrs (LU with
 * partial pivoting) through the LAPACKE *_work interface in column-major
 * order (a row-major matrix is passed as its transpose with trans = 'T'),
 * so LAPACKE allocates nothing. [B] is nonsingular at every composition
 * (its inverse is the Fick matrix of an ideal gas) and phi1(Phi) has the
 * eigenvalues (e^l - 1)/l > 0 for the real eigenvalues l of [Phi], so the
 * product is nonsingular for physical states; dgetrf's info > 0 is
 * reported as MCD_ESING all the same.
 *
 * Scratch: the film regions of the transfer scratch (tf_layout.h) and its
 * matrices.
 */
#include <math.h>
#include <string.h>
#include <lapacke.h>

#include "base/mcd_internal.h"
#include "base/workspace.h"
#include "base/composition.h"
#include "transfer/film.h"
#include "transfer/tf_layout.h"
#include "flux/flux_core.h"

_Static_assert(sizeof(lapack_int) == sizeof(int),
               "workspace pivots are int; lapack_int must match");

#define FILM_TOL 1e-12        /* relative change at convergence */
#define FILM_MAX_ITER 200     /* fixed-point iterations */
#define EXPM_MAX_NORM 1.0e4   /* larger ||A||_1 overflows exp anyway */
#define EXPM_TERMS 14         /* Horner terms of phi1 (A^14/15!) */
#define PROFILE_MAX_RATE 600. /* ||(L/c) A||_1 bound: exp stays finite */

/* ------------------------------------------------------------------ */
/* Validation helpers                                                  */
/* ------------------------------------------------------------------ */

mcd_status mcdi_tf_check_comp(mcd_workspace *ws, size_t n, const double *x,
                              const char *name, double *out)
{
    double sum;
    mcd_status st;
    if (x == NULL)
        return mcdi_fail(MCD_EINVAL, "argument %s: NULL", name);
    st = mcdi_comp_check(n, x, &sum);
    if (st != MCD_OK)
        return mcdi_fail(st,
                         "argument %s: entries must be finite, >= 0 and "
                         "sum to 1",
                         name);
    mcdi_comp_scale_to_one(n, x, out);
    return MCD_OK;
}

/* ------------------------------------------------------------------ */
/* Small dense kernels (row-major)                                     */
/* ------------------------------------------------------------------ */

void mcdi_tf_matmul(size_t m, const double *A, const double *B, double *C)
{
    size_t i, j, k;
    for (i = 0; i < m * m; i++)
        C[i] = 0.0;
    for (i = 0; i < m; i++) {
        for (k = 0; k < m; k++) {
            double a = A[i * m + k];
            if (a == 0.0)
                continue;
            for (j = 0; j < m; j++)
                C[i * m + j] += a * B[k * m + j];
        }
    }
}

static int all_finite(size_t len, const double *v)
{
    size_t i;
    for (i = 0; i < len; i++)
        if (!mcdi_finite(v[i]))
            return 0;
    return 1;
}

mcd_status mcdi_tf_expm_phi(size_t m, double *slot[3])
{
    double *A = slot[0], *P = slot[1], *T = slot[2], *tmp;
    double norm = 0.0, scale = 1.0;
    size_t i, j, s = 0;
    int k;

    for (j = 0; j < m; j++) {
        double col = 0.0;
        for (i = 0; i < m; i++)
            col += fabs(A[i * m + j]);
        if (col > norm || !mcdi_finite(col))
            norm = col;
    }
    if (!mcdi_finite(norm) || !(norm <= EXPM_MAX_NORM))
        return MCD_EDOM;
    while (norm * scale > 0.5) {
        scale *= 0.5;
        s++;
    }
    for (i = 0; i < m * m; i++)
        A[i] *= scale;

    /* phi1(A) = I + A/2 (I + A/3 (I + ... (I + A/(K+1)))) */
    for (i = 0; i < m * m; i++)
        P[i] = 0.0;
    for (i = 0; i < m; i++)
        P[i * m + i] = 1.0;
    for (k = EXPM_TERMS + 1; k >= 2; k--) {
        mcdi_tf_matmul(m, A, P, T);
        for (i = 0; i < m * m; i++)
            P[i] = T[i] / (double)k;
        for (i = 0; i < m; i++)
            P[i * m + i] += 1.0;
    }
    /* E = I + A phi1(A), held in T; A is free afterwards */
    mcdi_tf_matmul(m, A, P, T);
    for (i = 0; i < m; i++)
        T[i * m + i] += 1.0;
    {
        double *E = T, *F = A;
        for (i = 0; i < s; i++) {
            /* phi1(2A) = (E P + P)/2 */
            mcdi_tf_matmul(m, E, P, F);
            for (j = 0; j < m * m; j++)
                F[j] = 0.5 * (F[j] + P[j]);
            tmp = P;
            P = F;
            F = tmp;
            /* exp(2A) = E E */
            mcdi_tf_matmul(m, E, E, F);
            tmp = E;
            E = F;
            F = tmp;
        }
        slot[0] = F;
        slot[1] = P;
        slot[2] = E;
    }
    if (!all_finite(m * m, slot[1]) || !all_finite(m * m, slot[2]))
        return MCD_EDOM;
    return MCD_OK;
}

/* Solve M y = b in place for a row-major m x m matrix M (destroyed). */
static mcd_status solve_rowmajor(size_t m, double *M, lapack_int *ipiv,
                                 double *b)
{
    lapack_int info;
    info = LAPACKE_dgetrf_work(LAPACK_COL_MAJOR, (lapack_int)m, (lapack_int)m,
                               M, (lapack_int)m, ipiv);
    if (info > 0)
        return MCD_ESING;
    if (info < 0)
        return MCD_EINTERNAL;
    info = LAPACKE_dgetrs_work(LAPACK_COL_MAJOR, 'T', (lapack_int)m, 1, M,
                               (lapack_int)m, ipiv, b, (lapack_int)m);
    if (info != 0)
        return MCD_EINTERNAL;
    return all_finite(m, b) ? MCD_OK : MCD_ESING;
}

/* ------------------------------------------------------------------ */
/* Film problem                                                        */
/* ------------------------------------------------------------------ */

typedef struct film {
    mcd_workspace *ws;
    size_t n, m, d; /* species, reduced size, dependent index */
    const double *Dij;
    double c, L;
    const double *x0, *xL, *xe; /* ends and the bootstrap end */
    int end_L;                  /* 1 if the bootstrap uses the end at L */
    mcd_film_bootstrap kind;
    size_t species;
    const double *values;
    mcd_film_method method;
    mcdi_tf tf;     /* the transfer scratch (tf_layout.h) */
    double *mat[4]; /* tf.mat0..3; mat[3] = B_e */
    double *delta;  /* reduced x0 - xL (m) */
    double *rhs;    /* right-hand side (m) */
    double *J;      /* diffusion fluxes at the end (n) */
    lapack_int *ipiv;
} film;

static size_t red(const film *f, size_t k) { return k < f->d ? k : k + 1; }

/* B[v] (m x m) times `scale`: the Maxwell-Stefan matrix structure
 * B_ii = v_i/Đ_id + sum_{k != i} v_k/Đ_ik, B_ij = -v_i (1/Đ_ij - 1/Đ_id). */
static void build_B(const film *f, const double *v, double scale, double *B)
{
    size_t a, b, k, n = f->n, m = f->m, d = f->d;
    for (a = 0; a < m; a++) {
        size_t i = red(f, a);
        double diag = v[i] / f->Dij[i * n + d];
        for (k = 0; k < n; k++)
            if (k != i)
                diag += v[k] / f->Dij[i * n + k];
        for (b = 0; b < m; b++) {
            size_t j = red(f, b);
            B[a * m + b] =
                (a == b)
                    ? scale * diag
                    : -scale * v[i] *
                          (1.0 / f->Dij[i * n + j] - 1.0 / f->Dij[i * n + d]);
        }
    }
}

/* One Krishna-Standart evaluation: N_out = G(N). */
static mcd_status film_map(film *f, const double *N, double *N_out)
{
    size_t m = f->m, n = f->n, i, a;
    double *slot[3] = {f->mat[0], f->mat[1], f->mat[2]};
    double Nt, sJ;
    mcd_status st;

    if (f->method == MCD_FILM_EXACT) {
        build_B(f, N, f->L / f->c, slot[0]);
    } else {
        double s = 0.0;
        for (i = 0; i < n; i++)
            s += N[i];
        s *= f->L / f->c;
        for (i = 0; i < m * m; i++)
            slot[0][i] = s * f->mat[3][i];
    }
    st = mcdi_tf_expm_phi(m, slot);
    if (st != MCD_OK)
        return st;
    /* slot[1] = phi1(Phi), slot[2] = exp(Phi), slot[0] free */
    if (f->end_L) {
        for (a = 0; a < m; a++) {
            double acc = 0.0;
            for (i = 0; i < m; i++)
                acc += slot[2][a * m + i] * f->delta[i];
            f->rhs[a] = acc;
        }
    } else {
        memcpy(f->rhs, f->delta, m * sizeof(double));
    }
    mcdi_tf_matmul(m, slot[1], f->mat[3], slot[0]);
    st = solve_rowmajor(m, slot[0], f->ipiv, f->rhs);
    if (st != MCD_OK)
        return st;
    /* A species absent at both ends has no flux: x_s = 0 through the film
     * satisfies its equation only with N_s = 0. Its row of Phi is diagonal
     * then, so J_s = 0 in exact arithmetic, but the pivoting and squaring
     * of the matrix functions leave ~1e-18; set it exactly (the dependent
     * species, the most abundant, is never absent). */
    sJ = 0.0;
    for (a = 0; a < m; a++) {
        size_t s = red(f, a);
        double Ja = (f->x0[s] == 0.0 && f->xL[s] == 0.0)
                        ? 0.0
                        : f->c / f->L * f->rhs[a];
        f->J[s] = Ja;
        sJ += Ja;
    }
    f->J[f->d] = -sJ;

    switch (f->kind) {
    case MCD_FILM_BOOT_TOTAL: Nt = f->values[0]; break;
    case MCD_FILM_BOOT_EQUIMOLAR: Nt = 0.0; break;
    case MCD_FILM_BOOT_STAGNANT:
        Nt = -f->J[f->species] / f->xe[f->species];
        break;
    default: { /* WEIGHTS */
        double num = 0.0, den = 0.0;
        for (i = 0; i < n; i++) {
            num += f->values[i] * f->J[i];
            den += f->values[i] * f->xe[i];
        }
        Nt = -num / den;
        break;
    }
    }
    for (i = 0; i < n; i++)
        N_out[i] = f->J[i] + f->xe[i] * Nt;
    if (f->kind == MCD_FILM_BOOT_STAGNANT)
        N_out[f->species] = 0.0;
    return all_finite(n, N_out) ? MCD_OK : MCD_EDOM;
}

/* The Maxwell-Stefan rate matrix of fluxes N, scaled: out_ij =
 * -scale N_i / D_ij (i != j), out_ii = scale sum_j N_j / D_ij, so that
 * dx/dz = (1/c) A x integrates to x(z) = exp((z/c) A) x(0). */
static void rate_matrix(size_t n, const double *Dij, const double *N,
                        double scale, double *out)
{
    size_t i, j;
    for (i = 0; i < n; i++) {
        double diag = 0.0;
        for (j = 0; j < n; j++) {
            if (j == i)
                continue;
            diag += N[j] / Dij[i * n + j];
            out[i * n + j] = -scale * N[i] / Dij[i * n + j];
        }
        out[i * n + i] = scale * diag;
    }
}

/* End composition of species s for N = z N_t (RATIOS). */
static mcd_status ratios_end(film *f, double Nt, double *out_xs)
{
    size_t n = f->n, m = f->m, i, j, s = f->species;
    double *slot[3] = {f->mat[0], f->mat[1], f->mat[2]};
    double *Nv = f->J, acc;
    mcd_status st;

    if (f->method == MCD_FILM_EXACT) {
        /* full form: x(L) = exp((L/c) A) x0 */
        for (i = 0; i < n; i++)
            Nv[i] = f->values[i] * Nt;
        rate_matrix(n, f->Dij, Nv, f->L / f->c, slot[0]);
        st = mcdi_tf_expm_phi(n, slot);
        if (st != MCD_OK)
            return st;
        acc = 0.0;
        for (j = 0; j < n; j++)
            acc += slot[2][s * n + j] * f->x0[j];
        *out_xs = acc;
        return mcdi_finite(acc) ? MCD_OK : MCD_EDOM;
    }
    /* linearized: (x - z)(L) = exp((N_t L/c) Bbar) (x0 - z), reduced */
    for (i = 0; i < m * m; i++)
        slot[0][i] = Nt * f->L / f->c * f->mat[3][i];
    st = mcdi_tf_expm_phi(m, slot);
    if (st != MCD_OK)
        return st;
    acc = 0.0;
    for (i = 0; i < m; i++) {
        size_t a = red(f, i);
        double xa = f->values[a];
        for (j = 0; j < m; j++) {
            size_t b = red(f, j);
            xa += slot[2][i * m + j] * (f->x0[b] - f->values[b]);
        }
        if (a == s)
            *out_xs = xa;
        acc += xa;
    }
    if (s == f->d)
        *out_xs = 1.0 - acc;
    return mcdi_finite(*out_xs) ? MCD_OK : MCD_EDOM;
}

static mcd_status film_ratios(film *f, double *out_N, size_t *out_it,
                              double *out_res)
{
    size_t n = f->n, m = f->m, s = f->species, i, a, it;
    double Dmax = 0.0, fscale, Nt, r, Js = 0.0, zs = f->values[s];
    double target = f->xL[s], dz;
    mcd_status st;

    for (i = 0; i < n * n; i++)
        if (i / n != i % n && f->Dij[i] > Dmax)
            Dmax = f->Dij[i];
    fscale = f->c * Dmax / f->L;

    /* zero-flux estimate of J_s: (c/L) B(x0)^-1 (x0 - xL) */
    build_B(f, f->x0, 1.0, f->mat[0]);
    memcpy(f->rhs, f->delta, m * sizeof(double));
    st = solve_rowmajor(m, f->mat[0], f->ipiv, f->rhs);
    if (st != MCD_OK)
        return mcdi_fail(st, "RATIOS: singular matrix [B(x0)]");
    {
        double sum = 0.0;
        for (a = 0; a < m; a++) {
            double Ja = f->c / f->L * f->rhs[a];
            if (red(f, a) == s)
                Js = Ja;
            sum += Ja;
        }
        if (s == f->d)
            Js = -sum;
    }
    dz = zs - f->x0[s];
    if (fabs(dz) < 0.05)
        dz = (dz < 0 ? -0.05 : 0.05);
    Nt = Js / dz;
    st = ratios_end(f, Nt, &r);
    if (st != MCD_OK)
        return mcdi_fail(st, "RATIOS: rate factor out of range at the start");
    r -= target;
    for (it = 1; it <= FILM_MAX_ITER; it++) {
        double h = 1e-7 * (fabs(Nt) + 1e-3 * fscale), rp, slope, step;
        double lam = 1.0;
        st = ratios_end(f, Nt + h, &rp);
        if (st != MCD_OK)
            return mcdi_fail(MCD_ENOCONV, "RATIOS: diverged, residual %g", r);
        slope = (rp - target - r) / h;
        if (!(fabs(slope) > 0) || !mcdi_finite(slope))
            return mcdi_fail(MCD_EDOM,
                             "RATIOS: end composition of species %zu "
                             "does not depend on the total flux",
                             s);
        step = -r / slope;
        for (;;) { /* backtracking on |r| */
            double rn;
            st = ratios_end(f, Nt + lam * step, &rn);
            if (st == MCD_OK && fabs(rn - target) < fabs(r)) {
                Nt += lam * step;
                r = rn - target;
                break;
            }
            lam *= 0.5;
            if (lam < 1e-6) {
                if (fabs(r) <= 1e-14)
                    goto done;
                return mcdi_fail(MCD_ENOCONV,
                                 "RATIOS: no progress, residual %g", r);
            }
        }
        if (fabs(lam * step) <= FILM_TOL * fabs(Nt) || fabs(r) <= 1e-15) {
        done:
            for (i = 0; i < n; i++)
                out_N[i] = f->values[i] * Nt;
            if (out_it != NULL)
                *out_it = it;
            if (out_res != NULL)
                *out_res = fabs(r);
            return MCD_OK;
        }
    }
    return mcdi_fail(MCD_ENOCONV,
                     "RATIOS: no convergence in %d iterations, residual "
                     "%g",
                     FILM_MAX_ITER, r);
}

static mcd_status film_iterate(film *f, double *out_N, size_t *out_it,
                               double *out_res);

mcd_status mcdi_film_core(mcd_workspace *ws, size_t n, const double *Dij,
                          double c, double L, const double *x0,
                          const double *xL, mcd_film_bootstrap kind,
                          size_t species, const double *values,
                          mcd_film_method method, double *out_N,
                          size_t *out_iterations, double *out_residual)
{
    film f;
    size_t i, a;
    double best = 0.0;

    memset(&f, 0, sizeof f);
    f.ws = ws;
    f.n = n;
    f.m = n - 1;
    f.Dij = Dij;
    f.c = c;
    f.L = L;
    f.x0 = x0;
    f.xL = xL;
    f.xe = x0;
    f.kind = kind;
    f.species = species;
    f.values = values;
    f.method = method;
    mcdi_tf_scratch(ws, &f.tf);
    f.mat[0] = f.tf.mat0;
    f.mat[1] = f.tf.mat1;
    f.mat[2] = f.tf.mat2;
    f.mat[3] = f.tf.mat3;
    f.delta = f.tf.delta;
    f.rhs = f.tf.rhs;
    f.J = f.tf.J;
    f.ipiv = (lapack_int *)ws->tf_ipiv;

    /* dependent species: the most abundant over both ends */
    f.d = 0;
    for (i = 0; i < n; i++) {
        double v = x0[i] + xL[i];
        if (v > best) {
            best = v;
            f.d = i;
        }
    }
    for (a = 0; a < f.m; a++)
        f.delta[a] = x0[red(&f, a)] - xL[red(&f, a)];

    /* bootstrap end */
    if (kind == MCD_FILM_BOOT_STAGNANT) {
        if (!(x0[species] > 0) || !(xL[species] > 0))
            return mcdi_fail(
                MCD_EDOM,
                "argument species: stagnant species %zu must be present at "
                "both ends (x0 = %g, xL = %g)",
                species, x0[species], xL[species]);
    } else if (kind == MCD_FILM_BOOT_WEIGHTS) {
        double d0 = 0.0, dL = 0.0, vmax = 0.0;
        for (i = 0; i < n; i++) {
            d0 += values[i] * x0[i];
            dL += values[i] * xL[i];
            vmax = fmax(vmax, fabs(values[i]));
        }
        if (!(fmax(fabs(d0), fabs(dL)) > 1e-12 * vmax))
            return mcdi_fail(MCD_EDOM, "WEIGHTS: sum nu_i x_i is zero at both "
                                       "ends");
        if (fabs(dL) > fabs(d0)) {
            f.end_L = 1;
            f.xe = xL;
        }
    }
    /* B_e: at the bootstrap end (exact) or at the mean (linearized) */
    if (method == MCD_FILM_EXACT) {
        build_B(&f, f.xe, 1.0, f.mat[3]);
    } else {
        double *xbar = f.tf.xbar;
        for (i = 0; i < n; i++)
            xbar[i] = 0.5 * (x0[i] + xL[i]);
        build_B(&f, xbar, 1.0, f.mat[3]);
    }
    if (kind == MCD_FILM_BOOT_TOTAL) {
        /* the rate factor is at least |N_t| L/(c Đ_max): reject totals
         * whose exp(Phi) cannot be represented */
        double Dmax = 0.0;
        for (i = 0; i < n * n; i++)
            if (i / n != i % n && Dij[i] > Dmax)
                Dmax = Dij[i];
        if (!(fabs(values[0]) * L / (c * Dmax) <= EXPM_MAX_NORM))
            return mcdi_fail(MCD_EDOM,
                             "TOTAL: rate factor |N_t| L/(c D) = %g is "
                             "out of range",
                             fabs(values[0]) * L / (c * Dmax));
    }
    if (kind == MCD_FILM_BOOT_RATIOS)
        return film_ratios(&f, out_N, out_iterations, out_residual);

    return film_iterate(&f, out_N, out_iterations, out_residual);
}

/* Fixed-point iteration N = G(N) from N = 0 (the zero-flux solution),
 * accelerated by Anderson mixing of depth 2 (Walker and Ni 2011, "type II"):
 * with residuals f_k = G(N_k) - N_k and the differences dF, dG of the last
 * two iterates, gamma = argmin ||f_k - dF gamma||_2 (2 x 2 normal equations,
 * depth dropped to 1 or 0 when they are ill-conditioned) and
 * N_{k+1} = G(N_k) - dG gamma. Plain successive substitution (the
 * Krishna-Standart iteration) converges linearly with a factor that grows
 * with the rate factor (about 0.8 for the acetone-methanol-air Stefan tube,
 * i.e. ~100 iterations to 1e-12); the mixing brings this to ~10. If G cannot
 * be evaluated at a trial point (overflow of exp(Phi) for a wild iterate),
 * the step is halved back towards the last good iterate and the history is
 * cleared. */
static mcd_status film_iterate(film *f, double *out_N, size_t *out_it,
                               double *out_res)
{
    size_t n = f->n, i, it, depth = 0, halvings = 0;
    double *G = f->tf.G, *N = f->tf.N, *fprev = f->tf.fprev;
    double *Gprev = f->tf.Gprev, *Ngood = f->tf.Ngood;
    double *dF[2], *dG[2];
    double r = HUGE_VAL;
    mcd_status st;

    dF[0] = f->tf.dF0;
    dF[1] = f->tf.dF1;
    dG[0] = f->tf.dG0;
    dG[1] = f->tf.dG1;
    for (i = 0; i < n; i++)
        N[i] = Ngood[i] = 0.0;
    for (it = 1; it <= FILM_MAX_ITER; it++) {
        double dmax = 0.0, nmax = 0.0;
        st = film_map(f, N, G);
        if (st == MCD_EDOM && it > 1 && halvings < 40) {
            halvings++;
            depth = 0;
            for (i = 0; i < n; i++)
                N[i] = Ngood[i] + 0.5 * (N[i] - Ngood[i]);
            continue;
        }
        if (st == MCD_EDOM && it > 1)
            return mcdi_fail(MCD_ENOCONV,
                             "film: fluxes diverged at iteration %zu "
                             "(last change %g)",
                             it, r);
        if (st == MCD_EDOM)
            return mcdi_fail(MCD_EDOM, "film: rate factor out of range");
        if (st != MCD_OK)
            return mcdi_fail(st, "film: singular matrix");
        memcpy(Ngood, N, n * sizeof(double));
        for (i = 0; i < n; i++) {
            dmax = fmax(dmax, fabs(G[i] - N[i]));
            nmax = fmax(nmax, fmax(fabs(G[i]), fabs(N[i])));
        }
        r = nmax > 0 ? dmax / nmax : 0.0;
        if (r <= FILM_TOL) {
            memcpy(out_N, G, n * sizeof(double));
            if (out_it != NULL)
                *out_it = it;
            if (out_res != NULL)
                *out_res = r;
            return MCD_OK;
        }
        /* history: shift and append the newest differences */
        if (it > 1) {
            double *t0 = dF[0], *t1 = dG[0];
            dF[0] = dF[1];
            dG[0] = dG[1];
            dF[1] = t0;
            dG[1] = t1;
            for (i = 0; i < n; i++) {
                double fk = G[i] - N[i];
                dF[1][i] = fk - fprev[i];
                dG[1][i] = G[i] - Gprev[i];
            }
            if (depth < 2)
                depth++;
        }
        for (i = 0; i < n; i++) {
            fprev[i] = G[i] - N[i];
            Gprev[i] = G[i];
        }
        {
            /* least squares on the last `depth` columns (newest is 1) */
            double a00 = 0, a01 = 0, a11 = 0, b0 = 0, b1 = 0, g0 = 0, g1 = 0;
            size_t use = depth;
            for (i = 0; i < n; i++) {
                a11 += dF[1][i] * dF[1][i];
                b1 += dF[1][i] * fprev[i];
                if (use == 2) {
                    a00 += dF[0][i] * dF[0][i];
                    a01 += dF[0][i] * dF[1][i];
                    b0 += dF[0][i] * fprev[i];
                }
            }
            if (use == 2) {
                double det = a00 * a11 - a01 * a01;
                if (det > 1e-10 * a00 * a11) {
                    g0 = (b0 * a11 - b1 * a01) / det;
                    g1 = (a00 * b1 - a01 * b0) / det;
                } else {
                    use = 1;
                }
            }
            if (use == 1) {
                if (a11 > 0) {
                    g0 = 0.0;
                    g1 = b1 / a11;
                } else {
                    use = 0;
                }
            }
            for (i = 0; i < n; i++) {
                double v = G[i];
                if (use >= 1)
                    v -= g1 * dG[1][i];
                if (use == 2)
                    v -= g0 * dG[0][i];
                N[i] = v;
            }
        }
    }
    return mcdi_fail(MCD_ENOCONV,
                     "film: no convergence in %d iterations, last "
                     "relative change %g",
                     FILM_MAX_ITER, r);
}

/* ------------------------------------------------------------------ */
/* Public calls                                                        */
/* ------------------------------------------------------------------ */

mcd_status mcdi_tf_check_ws_n(mcd_workspace *ws, size_t n)
{
    if (ws == NULL)
        return MCD_EINVAL;
    return mcdi_check_species(ws, n, 2, 1, "n_species");
}

/* Start of mcd_film_solve and mcd_film_profile, in their order of checks:
 * workspace and n, the output (when named), the method. */
static mcd_status film_check_head(mcd_workspace *ws, size_t n,
                                  const double *out, const char *out_name,
                                  mcd_film_method method)
{
    mcd_status st = mcdi_tf_check_ws_n(ws, n);
    if (st != MCD_OK)
        return st;
    if (out_name != NULL && out == NULL)
        return mcdi_fail(MCD_EINVAL, "argument %s: NULL", out_name);
    if (method != MCD_FILM_EXACT && method != MCD_FILM_LINEARIZED)
        return mcdi_fail(MCD_EINVAL, "argument method: unknown value %d",
                         (int)method);
    return MCD_OK;
}

/* The film's state: Dij, c > 0, L > 0. */
static mcd_status film_check_state(mcd_workspace *ws, size_t n,
                                   const double *Dij, double c, double L)
{
    mcd_status st;
    if ((st = mcdi_check_dij(ws, n, Dij)) != MCD_OK ||
        (st = mcdi_check_positive(ws, c, "c")) != MCD_OK ||
        (st = mcdi_check_positive(ws, L, "L")) != MCD_OK)
        return st;
    return MCD_OK;
}

mcd_status mcdi_api_film_solve(mcd_workspace *ws, const mcd_film *fm,
                               mcd_film_bootstrap kind, size_t species,
                               const double *values, mcd_film_method method,
                               double *out_N, size_t *out_iterations,
                               double *out_residual)
{
    double *x0n, *xLn, *Nres;
    mcdi_tf tf;
    size_t n, i, its = 0;
    double res = 0.0;
    mcd_status st;

    if (fm == NULL)
        return mcdi_fail(MCD_EINVAL, "argument film: NULL");
    n = fm->n_species;
    if ((st = film_check_head(ws, n, out_N, "out_N", method)) != MCD_OK ||
        (st = film_check_state(ws, n, fm->Dij, fm->c, fm->L)) != MCD_OK)
        return st;
    mcdi_tf_scratch(ws, &tf);
    x0n = tf.x0n;
    xLn = tf.xLn;
    Nres = tf.Nres;
    if ((st = mcdi_tf_check_comp(ws, n, fm->x0, "x0", x0n)) != MCD_OK ||
        (st = mcdi_tf_check_comp(ws, n, fm->xL, "xL", xLn)) != MCD_OK)
        return st;

    switch (kind) {
    case MCD_FILM_BOOT_EQUIMOLAR: break;
    case MCD_FILM_BOOT_STAGNANT:
        if (species >= n)
            return mcdi_fail(
                MCD_EINVAL,
                "argument species: %zu is not a species index (0..%zu)",
                species, n - 1);
        break;
    case MCD_FILM_BOOT_TOTAL:
        if (values == NULL || !mcdi_finite(values[0]))
            return mcdi_fail(MCD_EINVAL,
                             "TOTAL: values[0] (N_t) missing or not "
                             "finite");
        break;
    case MCD_FILM_BOOT_WEIGHTS:
    case MCD_FILM_BOOT_RATIOS: {
        double sum = 0.0;
        if (values == NULL)
            return mcdi_fail(MCD_EINVAL, "argument values: NULL");
        for (i = 0; i < n; i++) {
            if (!mcdi_finite(values[i]))
                return mcdi_fail(MCD_EINVAL,
                                 "argument values: entry %zu is not finite", i);
            sum += values[i];
        }
        if (kind == MCD_FILM_BOOT_RATIOS) {
            if (species >= n)
                return mcdi_fail(
                    MCD_EINVAL,
                    "argument species: %zu is not a species index (0..%zu)",
                    species, n - 1);
            if (!(fabs(sum - 1.0) <= MCD_SUM_TOL))
                return mcdi_fail(MCD_EDOM, "RATIOS: z sums to %g, not 1", sum);
            if (values[species] == 0.0 && x0n[species] == 0.0)
                return mcdi_fail(MCD_EDOM,
                                 "RATIOS: species %zu absent and not "
                                 "moving: N_t undetermined",
                                 species);
        }
        break;
    }
    default:
        return mcdi_fail(MCD_EINVAL, "argument kind: unknown value %d",
                         (int)kind);
    }
    st = mcdi_film_core(ws, n, fm->Dij, fm->c, fm->L, x0n, xLn, kind, species,
                        values, method, Nres, &its, &res);
    if (st != MCD_OK)
        return st;
    memcpy(out_N, Nres, n * sizeof(double));
    if (out_iterations != NULL)
        *out_iterations = its;
    if (out_residual != NULL)
        *out_residual = res;
    return MCD_OK;
}

mcd_status mcdi_api_film_profile(mcd_workspace *ws, const mcd_film *fm,
                                 const double *N, size_t n_points,
                                 const double *z, double *out_x)
{
    double *x0n, *slot[3];
    mcdi_tf tf;
    double norm = 0.0;
    size_t n, i, j, p;
    mcd_status st;

    if (fm == NULL)
        return mcdi_fail(MCD_EINVAL, "argument film: NULL");
    n = fm->n_species;
    if ((st = film_check_head(ws, n, NULL, NULL, MCD_FILM_EXACT)) != MCD_OK ||
        (st = film_check_state(ws, n, fm->Dij, fm->c, fm->L)) != MCD_OK)
        return st;
    mcdi_tf_scratch(ws, &tf);
    x0n = tf.x0n;
    if ((st = mcdi_tf_check_comp(ws, n, fm->x0, "x0", x0n)) != MCD_OK)
        return st;
    if ((st = mcdi_check_finite_vec(ws, n, N, "N")) != MCD_OK)
        return st;
    if (n_points == 0)
        return MCD_OK;
    if ((st = MCDI_CHECK_PTRS2(z, out_x)) != MCD_OK)
        return st;
    for (p = 0; p < n_points; p++) {
        if (!mcdi_finite(z[p]))
            return mcdi_fail(MCD_EINVAL, "argument z: entry %zu is not finite",
                             p);
        if (!(z[p] >= 0 && z[p] <= fm->L))
            return mcdi_fail(MCD_EDOM,
                             "argument z: entry %zu = %g is not in [0, L]", p,
                             z[p]);
    }
    /* rate factor ||(L/c) A||_1 bounded: exp stays finite below */
    for (j = 0; j < n; j++) {
        double col = 0.0;
        for (i = 0; i < n; i++)
            if (i != j)
                col += 2.0 * fabs(N[i]) / fm->Dij[i * n + j];
        norm = fmax(norm, col);
    }
    norm *= fm->L / fm->c;
    if (!(norm <= PROFILE_MAX_RATE))
        return mcdi_fail(MCD_EDOM, "rate factor %g too large for a profile",
                         norm);

    for (p = 0; p < n_points; p++) {
        double sc = z[p] / fm->c;
        slot[0] = tf.mat0;
        slot[1] = tf.mat1;
        slot[2] = tf.mat2;
        rate_matrix(n, fm->Dij, N, sc, slot[0]);
        st = mcdi_tf_expm_phi(n, slot);
        if (st != MCD_OK) /* cannot happen after the bound above */
            return mcdi_fail(MCD_EINTERNAL, "profile overflow");
        for (i = 0; i < n; i++) {
            double acc = 0.0;
            for (j = 0; j < n; j++)
                acc += slot[2][i * n + j] * x0n[j];
            out_x[p * n + i] = acc;
        }
    }
    return MCD_OK;
}
