/* test_edge_cases.c - numerical edge cases against an independent
 * extended-precision reference.
 *
 * States: trace species (x_i = 0 and x_i = 1e-30), a pure component
 * (x_k = 1, all others 0), binary diffusivities spread over 6 decades,
 * N = 100 species, and combinations. For each state mcd_flux_compute
 * (Maxwell-Stefan, ideal mixture) must return finite fluxes that sum to zero
 * to round-off and agree with a reference computed here.
 *
 * Reference (written for this test, independent of lib/): the
 * Maxwell-Stefan equations in their classical N x N form (Taylor and
 * Krishna 1993, eq. 2.1.14 with the zero-sum replacing the equation of the
 * most abundant species, "common practice"):
 *   for i != r:  sum_{j != i} x_i J_j / (c Đ_ij) - J_i sum_{j != i} x_j/(c Đ_ij) = d_i,
 *   row r:       sum_j J_j = 0,
 * with d_i = grad x_i - x_i sum_k grad x_k (the projection mcd_flux_compute
 * documents). Solved in long double (x87 80-bit, 64-bit mantissa) by LU with
 * partial pivoting followed by three steps of iterative refinement whose
 * residual is also formed in long double. The library instead solves a
 * scaled symmetric positive definite system by Cholesky, so the two routes
 * share no code and no formulation.
 *
 * Accuracy measure: e = max_i |J_i - Jref_i| / max_i |Jref_i| per state.
 * Accepted: e <= 1e-11 (ACCURACY below). This is the accuracy we propose
 * the header documents for mcd_flux_compute with Đ spread over up to 6
 * decades and N <= 100. A backward-stable solver guarantees only ~ N kappa
 * eps (Higham 2002, "Accuracy and Stability of Numerical Algorithms", 2nd
 * ed., ch. 7 and 10, from memory); kappa_1 of the reference matrix is printed
 * for each state (up to 1e8 here, but that matrix is unscaled: the library's
 * scaled symmetric system is far better conditioned). Measured errors are
 * printed too: all are below 1e-14, so 1e-11 leaves a margin of 1000 for
 * other BLAS/LAPACK builds and compilers.
 */
#include <check.h>
#include <float.h>
#include <math.h>
#include <stdint.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

#include "mcdiff.h"
#include "support.h"

/* The references here are computed in long double, and doubles are
 * promoted to it on purpose; Clang's -Wdouble-promotion (unlike GCC's)
 * flags double to long double as well. */
#if defined(__clang__)
#pragma clang diagnostic ignored "-Wdouble-promotion"
#endif

#define NMAX 100
#define ND 2
/* accepted normwise relative error of the fluxes (see the top comment) */
#define ACCURACY 1e-11

/* Largest relative error seen per family (printed at the end). */
static double worst_ms, worst_mass, worst_fick;

/* Solve A X = B (n x n, nrhs columns, all row-major) in long double with
 * partial pivoting and iterative refinement. Returns kappa_1(A). */
static long double ref_solve(size_t n, const long double *A, size_t nrhs,
                             const long double *B, long double *X)
{
    long double *LU = malloc(n * n * sizeof *LU);
    long double *r = malloc(n * sizeof *r), *inv = malloc(n * n * sizeof *inv);
    size_t *piv = malloc(n * sizeof *piv);
    long double anorm = 0.0L, inorm = 0.0L;
    ck_assert(LU && r && inv && piv);
    memcpy(LU, A, n * n * sizeof *LU);
    for (size_t k = 0; k < n; k++) {
        size_t p = k;
        for (size_t i = k + 1; i < n; i++)
            if (fabsl(LU[i * n + k]) > fabsl(LU[p * n + k]))
                p = i;
        piv[k] = p;
        ck_assert_msg(LU[p * n + k] != 0.0L, "reference matrix singular");
        if (p != k)
            for (size_t j = 0; j < n; j++) {
                long double t = LU[k * n + j];
                LU[k * n + j] = LU[p * n + j];
                LU[p * n + j] = t;
            }
        for (size_t i = k + 1; i < n; i++) {
            long double f = LU[i * n + k] /= LU[k * n + k];
            for (size_t j = k + 1; j < n; j++)
                LU[i * n + j] -= f * LU[k * n + j];
        }
    }
    /* solve one right-hand side in place */
#define LU_SOLVE(v)                                                            \
    do {                                                                       \
        for (size_t k = 0; k < n; k++) {                                       \
            long double t = v[piv[k]];                                         \
            v[piv[k]] = v[k];                                                  \
            v[k] = t;                                                          \
        }                                                                      \
        for (size_t i = 1; i < n; i++)                                         \
            for (size_t j = 0; j < i; j++)                                     \
                v[i] -= LU[i * n + j] * v[j];                                  \
        for (size_t i = n; i-- > 0;) {                                         \
            for (size_t j = i + 1; j < n; j++)                                 \
                v[i] -= LU[i * n + j] * v[j];                                  \
            v[i] /= LU[i * n + i];                                             \
        }                                                                      \
    } while (0)
    for (size_t q = 0; q < nrhs; q++) {
        long double *x = malloc(n * sizeof *x);
        ck_assert_ptr_nonnull(x);
        for (size_t i = 0; i < n; i++)
            x[i] = B[i * nrhs + q];
        LU_SOLVE(x);
        for (int it = 0; it < 3; it++) {
            for (size_t i = 0; i < n; i++) {
                long double s = B[i * nrhs + q];
                for (size_t j = 0; j < n; j++)
                    s -= A[i * n + j] * x[j];
                r[i] = s;
            }
            LU_SOLVE(r);
            for (size_t i = 0; i < n; i++)
                x[i] += r[i];
        }
        for (size_t i = 0; i < n; i++)
            X[i * nrhs + q] = x[i];
        free(x);
    }
    /* kappa_1 from the explicit inverse */
    for (size_t q = 0; q < n; q++) {
        for (size_t i = 0; i < n; i++)
            r[i] = i == q ? 1.0L : 0.0L;
        LU_SOLVE(r);
        for (size_t i = 0; i < n; i++)
            inv[i * n + q] = r[i];
    }
#undef LU_SOLVE
    for (size_t j = 0; j < n; j++) {
        long double sa = 0.0L, si = 0.0L;
        for (size_t i = 0; i < n; i++) {
            sa += fabsl(A[i * n + j]);
            si += fabsl(inv[i * n + j]);
        }
        if (sa > anorm)
            anorm = sa;
        if (si > inorm)
            inorm = si;
    }
    free(LU);
    free(r);
    free(inv);
    free(piv);
    return anorm * inorm;
}

/* Reference molar fluxes J (n x ND) of an ideal mixture. */
static long double ref_fluxes(size_t n, const double *D, double c,
                              const double *x, const double *grad,
                              long double *J)
{
    long double *A = calloc(n * n, sizeof *A), *B = calloc(n * ND, sizeof *B);
    size_t r = 0;
    ck_assert(A && B);
    for (size_t i = 1; i < n; i++)
        if (x[i] > x[r])
            r = i;
    for (size_t d = 0; d < ND; d++) {
        long double s = 0.0L;
        for (size_t k = 0; k < n; k++)
            s += grad[k * ND + d];
        for (size_t i = 0; i < n; i++)
            B[i * ND + d] =
                (long double)grad[i * ND + d] - (long double)x[i] * s;
    }
    for (size_t i = 0; i < n; i++) {
        if (i == r) {
            for (size_t j = 0; j < n; j++)
                A[i * n + j] = 1.0L;
            for (size_t d = 0; d < ND; d++)
                B[i * ND + d] = 0.0L;
            continue;
        }
        long double diag = 0.0L;
        for (size_t j = 0; j < n; j++) {
            if (j == i)
                continue;
            long double cd = (long double)c * (long double)D[i * n + j];
            A[i * n + j] = (long double)x[i] / cd;
            diag -= (long double)x[j] / cd;
        }
        A[i * n + i] = diag;
    }
    long double kappa = ref_solve(n, A, ND, B, J);
    free(A);
    free(B);
    return kappa;
}

static double rel_err(size_t n, const double *v, const long double *ref)
{
    long double num = 0.0L, den = 0.0L;
    for (size_t i = 0; i < n; i++) {
        long double e = fabsl((long double)v[i] - ref[i]);
        if (e > num)
            num = e;
        if (fabsl(ref[i]) > den)
            den = fabsl(ref[i]);
    }
    return den > 0.0L ? (double)(num / den) : (double)num;
}

static void check_zero_sum(size_t n, const double *F)
{
    for (size_t d = 0; d < ND; d++) {
        double s = 0.0, a = 0.0;
        for (size_t i = 0; i < n; i++) {
            ck_assert_msg(isfinite(F[i * ND + d]), "flux (%zu,%zu) not finite",
                          i, d);
            s += F[i * ND + d];
            a += fabs(F[i * ND + d]);
        }
        /* summing n terms in double: |error| <= (n-1) eps sum |F_i|
         * (Higham 2002, eq. 4.4, from memory), 4x margin */
        ck_assert_msg(fabs(s) <= 4.0 * (double)n * DBL_EPSILON * a + 1e-300,
                      "sum of fluxes %g vs scale %g", s, a);
    }
}

/* One state: MS mole fluxes vs reference, mass fluxes vs converted
 * reference, Fick route vs reference, MA model finite and zero-sum. */
static void check_state(const char *label, size_t n, const double *M,
                        const double *D, double c, const double *x,
                        const double *grad)
{
    mcd_workspace *ws = NULL;
    double *J = malloc(n * ND * sizeof *J), *jm = malloc(n * ND * sizeof *jm);
    double *F = malloc(n * n * sizeof *F), *JF = malloc(n * ND * sizeof *JF);
    long double *Jr = malloc(n * ND * sizeof *Jr),
                *jr = malloc(n * ND * sizeof *jr);
    size_t dep = 0;
    ck_assert(J && jm && F && JF && Jr && jr);
    ck_assert_int_eq(mcd_workspace_new(n, &ws), MCD_OK);
    long double kappa = ref_fluxes(n, D, c, x, grad, Jr);
    const double tol = ACCURACY;

    /* Maxwell-Stefan, molar */
    ck_assert_int_eq(mcd_flux_compute(ws, MCD_MODEL_MAXWELL_STEFAN,
                                      &(mcd_state){.n_species = n,
                                                   .n_dim = ND,
                                                   .M = M,
                                                   .Dij = D,
                                                   .c = c,
                                                   .comp_basis = MCD_BASIS_MOLE,
                                                   .comp = x,
                                                   .grad = grad},
                                      MCD_BASIS_MOLE, J),
                     MCD_OK);
    check_zero_sum(n, J);
    double e = rel_err(n * ND, J, Jr);
    printf("edge %-36s N=%3zu kappa_1=%9.3Le  MS rel err %.2e\n", label, n,
           kappa, e);
    ck_assert_msg(e <= tol, "%s: MS relative error %g above %g", label, e, tol);
    if (e > worst_ms)
        worst_ms = e;

    /* Maxwell-Stefan, mass fluxes: j_i = M_i J_i - w_i sum_k M_k J_k */
    ck_assert_int_eq(mcd_flux_compute(ws, MCD_MODEL_MAXWELL_STEFAN,
                                      &(mcd_state){.n_species = n,
                                                   .n_dim = ND,
                                                   .M = M,
                                                   .Dij = D,
                                                   .c = c,
                                                   .comp_basis = MCD_BASIS_MOLE,
                                                   .comp = x,
                                                   .grad = grad},
                                      MCD_BASIS_MASS, jm),
                     MCD_OK);
    check_zero_sum(n, jm);
    {
        long double Mbar = 0.0L;
        for (size_t i = 0; i < n; i++)
            Mbar += (long double)x[i] * M[i];
        for (size_t d = 0; d < ND; d++) {
            long double s = 0.0L;
            for (size_t k = 0; k < n; k++)
                s += (long double)M[k] * Jr[k * ND + d];
            for (size_t i = 0; i < n; i++)
                jr[i * ND + d] = (long double)M[i] * Jr[i * ND + d] -
                                 (long double)x[i] * M[i] / Mbar * s;
        }
        double em = rel_err(n * ND, jm, jr);
        /* the conversion adds a few roundings per entry: same bound */
        ck_assert_msg(em <= tol, "%s: mass-flux relative error %g above %g",
                      label, em, tol);
        if (em > worst_mass)
            worst_mass = em;
    }

    /* Fick route: J = -c [D] grad x over the independent species */
    if (n >= 2) {
        ck_assert_int_eq(
            mcd_fick_matrix(ws,
                            &(mcd_state){.n_species = n,
                                         .M = M,
                                         .Dij = D,
                                         .comp_basis = MCD_BASIS_MOLE,
                                         .comp = x},
                            MCD_BASIS_MOLE, MCD_DEPENDENT_AUTO, F, &dep),
            MCD_OK);
        ck_assert_int_eq(mcd_fick_fluxes(n, ND, F, dep, c, grad, JF), MCD_OK);
        double ef = rel_err(n * ND, JF, Jr);
        /* [D] = [B]^-1 then a product: a few more roundings, same bound */
        ck_assert_msg(ef <= tol, "%s: Fick-route relative error %g above %g",
                      label, ef, tol);
        if (ef > worst_fick)
            worst_fick = ef;
    }

    /* mixture-averaged: finite, zero-sum (no reference: an approximation) */
    ck_assert_int_eq(mcd_flux_compute(ws, MCD_MODEL_MIXTURE_AVERAGED,
                                      &(mcd_state){.n_species = n,
                                                   .n_dim = ND,
                                                   .M = M,
                                                   .Dij = D,
                                                   .c = c,
                                                   .comp_basis = MCD_BASIS_MOLE,
                                                   .comp = x,
                                                   .grad = grad},
                                      MCD_BASIS_MOLE, J),
                     MCD_OK);
    check_zero_sum(n, J);
    ck_assert_int_eq(mcd_flux_compute(ws, MCD_MODEL_MIXTURE_AVERAGED,
                                      &(mcd_state){.n_species = n,
                                                   .n_dim = ND,
                                                   .M = M,
                                                   .Dij = D,
                                                   .c = c,
                                                   .comp_basis = MCD_BASIS_MOLE,
                                                   .comp = x,
                                                   .grad = grad},
                                      MCD_BASIS_MASS, J),
                     MCD_OK);
    check_zero_sum(n, J);

    mcd_workspace_free(ws);
    free(J);
    free(jm);
    free(F);
    free(JF);
    free(Jr);
    free(jr);
}

/* Random state: fractions from `g` (entries set to 0 where zero_mask),
 * Đ log-uniform in [Dlo, Dlo * 10^decades], gradients with zero sum. */
static void random_state(sup_rng *g, size_t n, double Dlo, double decades,
                         const int *zero_mask, double *M, double *D, double *x,
                         double *grad)
{
    double sum = 0.0;
    for (size_t i = 0; i < n; i++) {
        M[i] = 0.002 + 0.3 * sup_u01(g);
        x[i] = (zero_mask && zero_mask[i]) ? 0.0 : 0.01 + sup_u01(g);
        sum += x[i];
    }
    for (size_t i = 0; i < n; i++)
        x[i] /= sum;
    for (size_t i = 0; i < n; i++) {
        D[i * n + i] = 0.0;
        for (size_t j = i + 1; j < n; j++)
            D[i * n + j] = D[j * n + i] = Dlo * pow(10.0, decades * sup_u01(g));
    }
    for (size_t d = 0; d < ND; d++) {
        double s = 0.0;
        for (size_t i = 0; i + 1 < n; i++) {
            grad[i * ND + d] = 100.0 * (sup_u01(g) - 0.5);
            s += grad[i * ND + d];
        }
        grad[(n - 1) * ND + d] = -s;
    }
}

static const double C_TOT = 40.0; /* mol/m^3, near 1 atm and 300 K */

START_TEST(edge_cases_trace_species)
{
    /* x_1 = 0 exactly and x_2 = 1e-30: Blanc's law for the trace species */
    double M[4] = {0.002, 0.028, 0.032, 0.044};
    double D[16] = {0,      7.8e-5, 7.0e-5, 6.5e-5, 7.8e-5, 0,
                    2.1e-5, 1.6e-5, 7.0e-5, 2.1e-5, 0,      1.5e-5,
                    6.5e-5, 1.6e-5, 1.5e-5, 0};
    double x0[4] = {0.0, 0.5, 0.3, 0.2};
    double x1[4] = {1e-30, 0.5, 0.3, 0.2 - 1e-30};
    double grad[8] = {3.0, -1.0, -1.0, 0.5, -1.5, 0.2, -0.5, 0.3};
    check_state("x_i = 0", 4, M, D, C_TOT, x0, grad);
    check_state("x_i = 1e-30", 4, M, D, C_TOT, x1, grad);
    /* the trace flux of x_i = 0 is Blanc's law: J = -c grad / sum x_j/Đ */
    {
        mcd_workspace *ws;
        double J[8];
        ck_assert_int_eq(mcd_workspace_new(4, &ws), MCD_OK);
        ck_assert_int_eq(
            mcd_flux_compute(ws, MCD_MODEL_MAXWELL_STEFAN,
                             &(mcd_state){.n_species = 4,
                                          .n_dim = 2,
                                          .M = M,
                                          .Dij = D,
                                          .c = C_TOT,
                                          .comp_basis = MCD_BASIS_MOLE,
                                          .comp = x0,
                                          .grad = grad},
                             MCD_BASIS_MOLE, J),
            MCD_OK);
        double s = x0[1] / D[1] + x0[2] / D[2] + x0[3] / D[3];
        for (int d = 0; d < 2; d++)
            /* explicit formula, a few roundings: 1e-14 relative */
            ck_assert_double_eq_tol(J[d], -C_TOT * grad[d] / s,
                                    1e-14 * fabs(J[d]));
        mcd_workspace_free(ws);
    }
}
END_TEST

START_TEST(edge_cases_pure_component)
{
    double M[3] = {0.028, 0.032, 0.044};
    double D[9] = {0, 2.0e-5, 1.6e-5, 2.0e-5, 0, 1.5e-5, 1.6e-5, 1.5e-5, 0};
    double grad[6] = {0.0, 0.0, 1.0, -2.0, -1.0, 2.0};
    for (int k = 0; k < 3; k++) {
        double x[3] = {0, 0, 0};
        char label[32];
        x[k] = 1.0;
        snprintf(label, sizeof label, "x_%d = 1", k);
        check_state(label, 3, M, D, C_TOT, x, grad);
    }
}
END_TEST

START_TEST(edge_cases_diffusivities_six_decades)
{
    sup_rng g = SUP_RNG(SUP_XORSHIFT64, 0x243F6A8885A308D3ull);
    double M[8], D[64], x[8], grad[16];
    for (int r = 0; r < 20; r++) {
        char label[48];
        random_state(&g, 8, 1e-10, 6.0, NULL, M, D, x, grad);
        /* pin the extremes so that the spread is exactly 6 decades */
        D[1] = D[8] = 1e-10;
        D[2] = D[16] = 1e-4;
        snprintf(label, sizeof label, "Dij over 6 decades #%d", r);
        check_state(label, 8, M, D, C_TOT, x, grad);
    }
}
END_TEST

START_TEST(edge_cases_hundred_species)
{
    static double M[NMAX], D[NMAX * NMAX], x[NMAX], grad[NMAX * ND];
    static int zero[NMAX];
    sup_rng g = SUP_RNG(SUP_XORSHIFT64, 0x13198A2E03707344ull);
    random_state(&g, NMAX, 1e-6, 2.0, NULL, M, D, x, grad);
    check_state("N = 100", NMAX, M, D, C_TOT, x, grad);
    random_state(&g, NMAX, 1e-9, 6.0, NULL, M, D, x, grad);
    check_state("N = 100, Dij over 6 decades", NMAX, M, D, C_TOT, x, grad);
    for (size_t i = 0; i < NMAX; i++)
        zero[i] = (i % 3) == 1;
    random_state(&g, NMAX, 1e-9, 6.0, zero, M, D, x, grad);
    check_state("N = 100, a third at x = 0", NMAX, M, D, C_TOT, x, grad);
    for (size_t i = 0; i < NMAX; i++)
        zero[i] = i != 17;
    random_state(&g, NMAX, 1e-9, 6.0, zero, M, D, x, grad);
    check_state("N = 100, x_17 = 1", NMAX, M, D, C_TOT, x, grad);
    printf("edge worst relative errors: MS molar %.2e, MS mass %.2e, Fick "
           "route %.2e\n",
           worst_ms, worst_mass, worst_fick);
}
END_TEST

START_TEST(edge_cases_extreme_scales)
{
    /* Very low and very high concentrations and gradients: the fluxes scale
     * linearly, so results stay finite and match the reference. */
    double M[3] = {0.028, 0.032, 0.044};
    double D[9] = {0, 2.0e-5, 1.6e-5, 2.0e-5, 0, 1.5e-5, 1.6e-5, 1.5e-5, 0};
    double x[3] = {0.5, 0.3, 0.2};
    double g_small[6] = {1e-200, -1e-200, -6e-201, 6e-201, -4e-201, 4e-201};
    double g_big[6] = {1e100, -1e100, -6e99, 6e99, -4e99, 4e99};
    check_state("c = 1e-10, tiny gradients", 3, M, D, 1e-10, x, g_small);
    check_state("c = 1e10, huge gradients", 3, M, D, 1e10, x, g_big);
}
END_TEST

START_TEST(edge_cases_tiny_concentration_near_trace_species)
{
    /* Found by fuzz_flux (corpus file regress_cs_underflow): c near DBL_MIN
     * (7.3e-304), a near-trace species (x = 1.6e-60) in a carrier, tiny Đ
     * and a huge gradient. The fluxes are representable (1.17e-212), but
     * forming c s_0 first underflowed (9e-334 -> 0), the flux of the trace
     * species was lost and the zero-sum clean-up then left it alone
     * (sum = |F|). Reference: the binary Fick law of the Maxwell-Stefan
     * equations, J_0 = -c Đ d_0 (Taylor and Krishna 1993, ch. 2), with the
     * projected driving force d_0 = g_0 (1 - x_0). */
    const double x0 = 1.5637585523680613e-60, Dv = 1.0989607864272113e-178;
    const double c = 7.2911220195576408e-304, g0 = -1.4555762469866733e269;
    double D[4] = {0.0, Dv, Dv, 0.0}, x[2] = {x0, 1.0}, g[2] = {g0, 0.0};
    double J[2], want;
    mcd_workspace *ws;
    ck_assert_int_eq(mcd_workspace_new(2, &ws), MCD_OK);
    ck_assert_int_eq(mcd_flux_compute(ws, MCD_MODEL_MAXWELL_STEFAN,
                                      &(mcd_state){.n_species = 2,
                                                   .n_dim = 1,
                                                   .Dij = D,
                                                   .c = c,
                                                   .comp_basis = MCD_BASIS_MOLE,
                                                   .comp = x,
                                                   .grad = g},
                                      MCD_BASIS_MOLE, J),
                     MCD_OK);
    want = -c * (Dv * (g0 * (1.0 - x0))); /* ordered to stay representable */
    ck_assert_msg(fabs(J[0] - want) <= 1e-12 * fabs(want),
                  "J0 %.17g want %.17g", J[0], want);
    ck_assert_msg(fabs(J[0] + J[1]) <= 1e-12 * fabs(want), "sum %.3g",
                  J[0] + J[1]);
    mcd_workspace_free(ws);
}
END_TEST

START_TEST(edge_cases_trace_coupling_when_c_times_dij_underflows)
{
    /* A trace species (x = 0) with c = 1e-300 and Đ = 1e-30 m^2/s: c Đ
     * underflows to 0 in double, though every flux is about 1e-300 and
     * representable (the gradients are about 1e30). The coupling of the
     * species present to the trace flux, x_k J_t / (c Đ_kt), was formed
     * with c Đ and gave inf, so the call returned EDOM; the c-free form
     * x_k (J_t / c) / Đ_kt, which the batched kernel uses, does not.
     * Reference: the Maxwell-Stefan equations are homogeneous, J scales as
     * c Đ grad (Taylor and Krishna 1993, ch. 2), so the fluxes equal
     * 1e-300 times those of c = 1, Đ scaled by 1e30, gradients by 1e-30. */
    enum { N = 3 }; /* ND = 2, the file's */
    const double x[N] = {0.6, 0.4, 0.0};
    const double g1[N * ND] = {0.3, -0.2, -0.1, 0.5, -0.2, -0.3};
    const double Dn[N * N] = {0, 1.0, 2.0, 1.0, 0, 0.5, 2.0, 0.5, 0};
    double D[N * N], g[N * ND], J[N * ND], Jr[N * ND], scale = 0.0, sum;
    mcd_workspace *ws;
    size_t i, d;
    for (i = 0; i < N * N; i++)
        D[i] = Dn[i] * 1e-30;
    for (i = 0; i < N * ND; i++)
        g[i] = g1[i] * 1e30;
    ck_assert_int_eq(mcd_workspace_new(N, &ws), MCD_OK);
    ck_assert_msg(mcd_flux_compute(ws, MCD_MODEL_MAXWELL_STEFAN,
                                   &(mcd_state){.n_species = N,
                                                .n_dim = ND,
                                                .Dij = D,
                                                .c = 1e-300,
                                                .comp_basis = MCD_BASIS_MOLE,
                                                .comp = x,
                                                .grad = g},
                                   MCD_BASIS_MOLE, J) == MCD_OK,
                  "%s", mcd_last_error());
    ck_assert_int_eq(mcd_flux_compute(ws, MCD_MODEL_MAXWELL_STEFAN,
                                      &(mcd_state){.n_species = N,
                                                   .n_dim = ND,
                                                   .Dij = Dn,
                                                   .c = 1.0,
                                                   .comp_basis = MCD_BASIS_MOLE,
                                                   .comp = x,
                                                   .grad = g1},
                                      MCD_BASIS_MOLE, Jr),
                     MCD_OK);
    for (i = 0; i < N * ND; i++)
        if (fabs(Jr[i]) > scale)
            scale = fabs(Jr[i]);
    ck_assert(scale > 0.1);
    for (i = 0; i < N * ND; i++)
        ck_assert_msg(fabs(J[i] / 1e-300 - Jr[i]) <= 1e-12 * scale,
                      "J[%zu] = %.17g, want %.17g e-300", i, J[i], Jr[i]);
    for (d = 0; d < ND; d++) {
        sum = 0.0;
        for (i = 0; i < N; i++)
            sum += J[i * ND + d];
        ck_assert(fabs(sum) <= 1e-14 * scale * 1e-300);
    }
    mcd_workspace_free(ws);
}
END_TEST

START_TEST(edge_cases_mixture_averaged_when_c_times_dij_underflows)
{
    /* The mixture-averaged flux -c D_im d_i formed c D_im first: for
     * c = 1e-300 and Đ = 1e-30 that product underflowed to 0 and every
     * flux came out 0, though the fluxes are about 1e-300. Reference:
     * homogeneity as in the test above (J scales as c Đ grad), for the
     * single-state and the batched calls. */
    enum { N = 3 };
    const double x[N] = {0.5, 0.3, 0.2};
    const double g1[N * ND] = {0.3, -0.2, -0.1, 0.5, -0.2, -0.3};
    const double Dn[N * N] = {0, 1.0, 2.0, 1.0, 0, 0.5, 2.0, 0.5, 0};
    const double c = 1e-300;
    double D[N * N], g[N * ND], J[N * ND], Jb[N * ND], Jr[N * ND], scale = 0.0;
    mcd_workspace *ws;
    size_t i;
    for (i = 0; i < N * N; i++)
        D[i] = Dn[i] * 1e-30;
    for (i = 0; i < N * ND; i++)
        g[i] = g1[i] * 1e30;
    ck_assert_int_eq(mcd_workspace_new(N, &ws), MCD_OK);
    ck_assert_int_eq(mcd_flux_compute(ws, MCD_MODEL_MIXTURE_AVERAGED,
                                      &(mcd_state){.n_species = N,
                                                   .n_dim = ND,
                                                   .Dij = Dn,
                                                   .c = 1.0,
                                                   .comp_basis = MCD_BASIS_MOLE,
                                                   .comp = x,
                                                   .grad = g1},
                                      MCD_BASIS_MOLE, Jr),
                     MCD_OK);
    ck_assert_int_eq(mcd_flux_compute(ws, MCD_MODEL_MIXTURE_AVERAGED,
                                      &(mcd_state){.n_species = N,
                                                   .n_dim = ND,
                                                   .Dij = D,
                                                   .c = c,
                                                   .comp_basis = MCD_BASIS_MOLE,
                                                   .comp = x,
                                                   .grad = g},
                                      MCD_BASIS_MOLE, J),
                     MCD_OK);
    /* one cell, SoA with K = 1 is the same memory order */
    ck_assert_int_eq(
        mcd_flux_batch_dij(ws, MCD_MODEL_MIXTURE_AVERAGED, N, NULL, D, &c,
                           &(mcd_cells){.n_cells = 1,
                                        .n_dim = ND,
                                        .comp_basis = MCD_BASIS_MOLE,
                                        .comp = x,
                                        .grad = g},
                           MCD_BASIS_MOLE, Jb),
        MCD_OK);
    for (i = 0; i < N * ND; i++)
        if (fabs(Jr[i]) > scale)
            scale = fabs(Jr[i]);
    ck_assert(scale > 0.1);
    for (i = 0; i < N * ND; i++) {
        ck_assert_msg(fabs(J[i] / c - Jr[i]) <= 1e-12 * scale,
                      "single J[%zu] = %.17g, want %.17g e-300", i, J[i],
                      Jr[i]);
        ck_assert_msg(fabs(Jb[i] / c - Jr[i]) <= 1e-12 * scale,
                      "batched J[%zu] = %.17g, want %.17g e-300", i, Jb[i],
                      Jr[i]);
    }
    mcd_workspace_free(ws);
}
END_TEST

/* lib/flux/maxwell_stefan.c, internal (the static library exports it) */
int mcdi_mass_zero_sum_kept(size_t n, size_t nd, const double *F);

START_TEST(edge_cases_molar_masses_decades_apart_are_an_error)
{
    /* Found by fuzz_flux (corpus files regress_mass_cancellation and
     * regress_mass_gradients): a species of molar mass 1.3e-163 kg/mol next
     * to three of 0.03 kg/mol, mass fractions and their gradients in, mass
     * fluxes out. The molar fluxes are about 1e170 and sum to zero; the
     * mass fluxes, about 1e8, are what is left of
     * j_i = M_i J_i - w_i sum_k M_k J_k after terms of 1e168 cancel, which
     * double precision cannot represent: the call returned MCD_OK with mass
     * fluxes summing to -1.2e8 (and with M down to 2.8e-306 the mole-
     * fraction gradients themselves cancelled). Now molar masses spanning
     * more than a factor 1e12 are EDOM wherever the bases are converted,
     * in both paths, writing nothing; the molar fluxes without conversion
     * stay available. Behind that, mass fluxes that do not sum to zero
     * after the clean-up are EDOM too (mcdi_mass_zero_sum_kept, checked
     * directly below). Reference: the zero-sum of diffusion fluxes
     * (common practice: their definition). */
    enum { N = 4, D3 = 3 };
    const double M[N] = {1.3075051478364073e-163, 0.03, 0.03, 0.03};
    const double D[N * N] = {0,  10,   10, 10,   10, 0,    1e-5, 1e-5,
                             10, 1e-5, 0,  1e-5, 10, 1e-5, 1e-5, 0};
    const double w[N] = {8.9062438251681993e-164, 1.0 / 3.0, 1.0 / 3.0,
                         1.0 / 3.0};
    const double g[N * D3] = {0, 1e7, 10, 10, 10, 10, 10, 10, 10, 10, 5, 10};
    const double c = 40.00001323223114; /* as found */
    double out[N * D3], guard = 12345.678, s, a;
    mcd_workspace *ws;
    size_t i, d;
    ck_assert_int_eq(mcd_workspace_new(N, &ws), MCD_OK);
    for (i = 0; i < N * D3; i++)
        out[i] = guard;
    ck_assert_int_eq(mcd_flux_compute(ws, MCD_MODEL_MAXWELL_STEFAN,
                                      &(mcd_state){.n_species = N,
                                                   .n_dim = D3,
                                                   .M = M,
                                                   .Dij = D,
                                                   .c = c,
                                                   .comp_basis = MCD_BASIS_MASS,
                                                   .comp = w,
                                                   .grad = g},
                                      MCD_BASIS_MASS, out),
                     MCD_EDOM);
    ck_assert_ptr_nonnull(strstr(mcd_last_error(), "span"));
    for (i = 0; i < N * D3; i++)
        ck_assert(out[i] == guard);
    /* batched, one cell (SoA with K = 1 is the same memory order) */
    ck_assert_int_eq(
        mcd_flux_batch_dij(ws, MCD_MODEL_MAXWELL_STEFAN, N, M, D, &c,
                           &(mcd_cells){.n_cells = 1,
                                        .n_dim = D3,
                                        .comp_basis = MCD_BASIS_MASS,
                                        .comp = w,
                                        .grad = g},
                           MCD_BASIS_MASS, out),
        MCD_EDOM);
    ck_assert_ptr_nonnull(strstr(mcd_last_error(), "span"));
    for (i = 0; i < N * D3; i++)
        ck_assert(out[i] == guard);
    /* the molar fluxes of the same molar state, no conversion: fine */
    {
        double x[N], sxm = 0.0;
        for (i = 0; i < N; i++)
            sxm += w[i] / M[i];
        for (i = 0; i < N; i++)
            x[i] = w[i] / M[i] / sxm;
        ck_assert_int_eq(
            mcd_flux_compute(ws, MCD_MODEL_MAXWELL_STEFAN,
                             &(mcd_state){.n_species = N,
                                          .n_dim = D3,
                                          .Dij = D,
                                          .c = c,
                                          .comp_basis = MCD_BASIS_MOLE,
                                          .comp = x,
                                          .grad = g},
                             MCD_BASIS_MOLE, out),
            MCD_OK);
    }
    for (d = 0; d < D3; d++) {
        s = a = 0.0;
        for (i = 0; i < N; i++) {
            s += out[i * D3 + d];
            a += fabs(out[i * D3 + d]);
        }
        ck_assert(fabs(s) <= 1e-14 * a);
    }
    /* the second guard: balanced mass fluxes pass, these do not (the
     * values the unguarded code returned for this input) */
    {
        const double bal[4] = {-1.2e8, 4e7, 4e7, 4e7};
        const double lost[4] = {-1.17597e8, 0.0, 0.0, 0.0};
        ck_assert_int_eq(mcdi_mass_zero_sum_kept(4, 1, bal), 1);
        ck_assert_int_eq(mcdi_mass_zero_sum_kept(4, 1, lost), 0);
    }
    mcd_workspace_free(ws);
}
END_TEST

int main(void)
{
    Suite *s = suite_create("mcd:edge_cases");
    TCase *tc = tcase_create("reference");
    tcase_set_timeout(tc, 240);
    tcase_add_test(tc, edge_cases_trace_species);
    tcase_add_test(tc, edge_cases_pure_component);
    tcase_add_test(tc, edge_cases_diffusivities_six_decades);
    tcase_add_test(tc, edge_cases_hundred_species);
    tcase_add_test(tc, edge_cases_extreme_scales);
    tcase_add_test(tc, edge_cases_tiny_concentration_near_trace_species);
    tcase_add_test(tc, edge_cases_trace_coupling_when_c_times_dij_underflows);
    tcase_add_test(tc, edge_cases_mixture_averaged_when_c_times_dij_underflows);
    tcase_add_test(tc, edge_cases_molar_masses_decades_apart_are_an_error);
    suite_add_tcase(s, tc);
    return sup_run(s);
}
