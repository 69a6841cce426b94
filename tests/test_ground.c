/* test_ground.c - the batched exact fluxes of full blocks up to ten
 * species (the grounded form, lib/batched/kernel_ldl.h: stage_ground_gth
 * up to five species, stage_ground_any from six) against an independent
 * extended-precision solve, on states whose mole fractions span up to 12
 * decades and whose binary diffusivities span up to 6.
 *
 * Reference (written for this test, independent of lib/): the
 * Maxwell-Stefan equations in their classical N x N form (Taylor and
 * Krishna 1993, eq. 2.1.14, as in test_edge_cases.c), the zero-sum
 * replacing the equation of the most abundant species (common practice):
 *   for i != r:  sum_{j != i} (x_i J_j - x_j J_i) / Đ_ij = c d_i,
 *   row r:       sum_j J_j = 0,
 * solved in long double by LU with partial pivoting and four steps of
 * iterative refinement with the residual formed in long double. The
 * gradients here sum to zero, so d_i = grad x_i.
 *
 * Accepted: e = max_i |J_i - Jref_i| / max_i |Jref_i| <= 1e-13 per cell.
 * Measured on the AVX-512 host under all three kernel ISAs, 16000-32000
 * cells a case: at most 8.5e-15 (N = 5, Đ over 6 decades, x86-64-v1
 * kernel), 4.8e-15 with AVX-512. The scaled form the other blocks and
 * the single-state call use fails this test (N = 3: 1.1e-11) and reaches
 * 3.7e-11 in the wider run; so did the grounded form while it factored
 * with the L D L^T of the scaled form (6.6e-12).
 *
 * From six to ten species (measured on the AMD AVX-512 host, 1024 cells
 * a case): at most 3.8e-15 in the batched call and 2.5e-15 in the
 * single-state call, where the scaled form reached 1.6e-13 at N = 6
 * (the batched call before stage_ground_any) and 5.7e-11 at N = 8 (the
 * single-state call before fused_gth_any).
 *
 * The single-state call, which takes the grounded form up to ten species
 * too (lib/flux/ms_ldl.c, fused_gth and fused_gth_any), is held to the
 * same accuracy on the same cells (measured at most 8.2e-15; before, with the scaled form,
 * 3.7e-11): CK_FORK=no MCD_GROUND_CELLS=32000 build/tests/test_ground
 * gives the wider run quoted above and in include/mcdiff.h.
 *
 * Second check: each lane grounds a species chosen from its own cell's
 * data, so a cell's fluxes do not depend on the other cells of its block:
 * the same cells in reverse order give the same bits.
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

/* The reference is long double on purpose: GCC's -Wdouble-promotion
 * warns only about float to double, Clang's flags double to long double
 * as well. */
#if defined(__clang__)
#pragma clang diagnostic ignored "-Wdouble-promotion"
#endif

#define ACCURACY 1e-13
#define NMAX 10
/* the single-state call takes the grounded form up to this many species
 * (MCDI_MS_GTH_ANY_N, lib/flux/ms_ldl.c); above, its error is printed */
#define SINGLE_NMAX 10
/* cells per case: MCD_GROUND_CELLS (rounded to a multiple of 8, every
 * vector width, so that every block is full), 1024 by default */
static size_t K = 1024;
#define ND 3

static sup_rng rng = SUP_RNG(SUP_SPLITMIX64, 0x6A0D0001ull);

/* The reference fluxes of one cell (J[i * ND + d]). */
static void reference(size_t n, const double *x, const double *D,
                      const double *g, double c, long double *J)
{
    long double A0[NMAX][NMAX], A[NMAX][NMAX], b[NMAX], y[NMAX], z[NMAX];
    size_t r = 0, perm[NMAX], i, j, k;
    int d, it;
    for (i = 1; i < n; i++)
        if (x[i] > x[r])
            r = i;
    for (i = 0; i < n; i++) {
        for (j = 0; j < n; j++)
            A0[i][j] = i == r ? 1.0L : 0.0L;
        for (j = 0; j < n && i != r; j++)
            if (j != i) {
                const long double iD = 1.0L / (long double)D[i * n + j];
                A0[i][j] += (long double)x[i] * iD;
                A0[i][i] -= (long double)x[j] * iD;
            }
    }
    memcpy(A, A0, sizeof A);
    for (i = 0; i < n; i++)
        perm[i] = i;
    for (k = 0; k < n; k++) {
        size_t p = k;
        for (i = k + 1; i < n; i++)
            if (fabsl(A[i][k]) > fabsl(A[p][k]))
                p = i;
        for (j = 0; j < n; j++) {
            const long double t = A[k][j];
            A[k][j] = A[p][j];
            A[p][j] = t;
        }
        {
            const size_t t = perm[k];
            perm[k] = perm[p];
            perm[p] = t;
        }
        for (i = k + 1; i < n; i++) {
            const long double f = A[i][k] /= A[k][k];
            for (j = k + 1; j < n; j++)
                A[i][j] -= f * A[k][j];
        }
    }
    for (d = 0; d < ND; d++) {
        for (i = 0; i < n; i++) {
            b[i] = i == r ? 0.0L : (long double)c * g[i * ND + d];
            y[i] = 0.0L;
        }
        for (it = 0; it < 4; it++) {
            long double res[NMAX];
            for (i = 0; i < n; i++) {
                long double t = b[i];
                for (j = 0; j < n; j++)
                    t -= A0[i][j] * y[j];
                res[i] = t;
            }
            for (i = 0; i < n; i++) {
                long double t = res[perm[i]];
                for (j = 0; j < i; j++)
                    t -= A[i][j] * z[j];
                z[i] = t;
            }
            for (i = n; i-- > 0;) {
                long double t = z[i];
                for (j = i + 1; j < n; j++)
                    t -= A[i][j] * z[j];
                z[i] = t / A[i][i];
            }
            for (i = 0; i < n; i++)
                y[i] += z[i];
        }
        for (i = 0; i < n; i++)
            J[i * ND + d] = y[i];
    }
}

typedef struct batch {
    double *x, *D, *g, *c, *J;
} batch;

static void batch_alloc(batch *s, size_t n)
{
    s->x = malloc(n * K * sizeof(double));
    s->D = malloc(n * n * K * sizeof(double));
    s->g = malloc(n * ND * K * sizeof(double));
    s->c = malloc(K * sizeof(double));
    s->J = malloc(n * ND * K * sizeof(double));
    ck_assert(s->x && s->D && s->g && s->c && s->J);
}

static void batch_free(batch *s)
{
    free(s->x);
    free(s->D);
    free(s->g);
    free(s->c);
    free(s->J);
}

/* The two calls under test, mole fractions and mole fluxes in 3
 * directions: the batched call on K cells in SoA (x[i * K + k], D[(i * n
 * + j) * K + k], g[(i * ND + d) * K + k]; one cell in SoA is a state's
 * own arrays) and the single-state call. */
static mcd_status batch_call(mcd_workspace *ws, size_t n, size_t k,
                             const double *x, const double *D, const double *g,
                             const double *c, double *J)
{
    return mcd_flux_batch_dij(ws, MCD_MODEL_MAXWELL_STEFAN, n, NULL, D, c,
                              &(mcd_cells){.n_cells = k,
                                           .n_dim = ND,
                                           .comp_basis = MCD_BASIS_MOLE,
                                           .comp = x,
                                           .grad = g},
                              MCD_BASIS_MOLE, J);
}

static mcd_status single_call(mcd_workspace *ws, size_t n, const double *x,
                              const double *D, const double *g, double c,
                              double *J)
{
    return mcd_flux_compute(ws, MCD_MODEL_MAXWELL_STEFAN,
                            &(mcd_state){.n_species = n,
                                         .n_dim = ND,
                                         .comp_basis = MCD_BASIS_MOLE,
                                         .c = c,
                                         .Dij = D,
                                         .comp = x,
                                         .grad = g},
                            MCD_BASIS_MOLE, J);
}

static void batch_run(mcd_workspace *ws, size_t n, const batch *s)
{
    ck_assert_msg(batch_call(ws, n, K, s->x, s->D, s->g, s->c, s->J) == MCD_OK,
                  "%s", mcd_last_error());
}

/* Whether long double arithmetic carries more bits than double here: not
 * where long double is double, nor under valgrind, whose x87 emulation
 * computes long doubles in 64 bits (the documented limitation of its
 * memcheck; from memory). Without it the reference is no better than
 * the library and the accuracy is not checked (the bit checks still are). */
static int extended_precision(void)
{
    volatile long double one = 1.0L, tiny = 0x1p-60L;
    return LDBL_MANT_DIG > DBL_MANT_DIG && (one + tiny) - one == tiny;
}

/* Cell k of SoA arrays at stride ks (x: n rows, D: n^2, g: n ND) from
 * one state, and back. */
static void cell_put(size_t n, size_t ks, size_t k, const double *xs,
                     const double *Dc, const double *gc, double *x, double *D,
                     double *g)
{
    size_t i;
    for (i = 0; i < n; i++)
        x[i * ks + k] = xs[i];
    for (i = 0; i < n * n; i++)
        D[i * ks + k] = Dc[i];
    for (i = 0; i < n * ND; i++)
        g[i * ks + k] = gc[i];
}

static void cell_get(size_t n, size_t ks, size_t k, const double *x,
                     const double *D, const double *g, double *xs, double *Dc,
                     double *gc)
{
    size_t i;
    for (i = 0; i < n; i++)
        xs[i] = x[i * ks + k];
    for (i = 0; i < n * n; i++)
        Dc[i] = D[i * ks + k];
    for (i = 0; i < n * ND; i++)
        gc[i] = g[i * ks + k];
}

/* The single-state call's error on one cell against the reference. */
static double single_error(mcd_workspace *ws, size_t n, const double *x,
                           const double *D, const double *g, double c,
                           const long double *Jr, double big)
{
    double J[NMAX * ND], e = 0.0;
    size_t i;
    ck_assert_int_eq(single_call(ws, n, x, D, g, c, J), MCD_OK);
    for (i = 0; i < n * ND; i++) {
        const double t = (double)fabsl(J[i] - Jr[i]) / big;
        if (t > e)
            e = t;
    }
    return e;
}

START_TEST(grounded_blocks_match_an_extended_precision_solve)
{
    const double xdec[] = {0.0, 4.0, 12.0}, ddec[] = {2.0, 6.0};
    size_t n, a, b, i, j, k, q;
    const char *env = getenv("MCD_GROUND_CELLS");
    const int check = extended_precision();
    if (!check)
        printf("long double is no wider than double here: the accuracy "
               "is printed, not checked\n");
    if (env != NULL && atol(env) > 0)
        K = ((size_t)atol(env) + 7) / 8 * 8;
    for (n = 2; n <= NMAX; n++) {
        mcd_workspace *ws = NULL;
        batch s, rv;
        ck_assert_int_eq(mcd_workspace_new(n, &ws), MCD_OK);
        batch_alloc(&s, n);
        batch_alloc(&rv, n);
        for (a = 0; a < 3; a++)
            for (b = 0; b < 2; b++) {
                double worst = 0.0, worst1 = 0.0;
                for (k = 0; k < K; k++) {
                    double sum = 0.0, x[NMAX], D[NMAX * NMAX], g[NMAX * ND];
                    for (i = 0; i < n; i++)
                        sum += x[i] = pow(10.0, -xdec[a] * sup_u01(&rng));
                    for (i = 0; i < n; i++)
                        x[i] /= sum;
                    for (i = 0; i < n; i++)
                        for (j = i + 1; j < n; j++)
                            D[i * n + j] = D[j * n + i] =
                                1e-5 *
                                pow(10.0, ddec[b] * (sup_u01(&rng) - 0.5));
                    for (i = 0; i < n; i++)
                        D[i * n + i] = 1e-5;
                    sup_gradients_zero_mean(&rng, n, ND, -50.0, 50.0, g);
                    /* the last species' gradients: minus the others' sum,
                     * so that every direction sums to zero exactly */
                    for (q = 0; q < ND; q++) {
                        double t = 0.0;
                        for (i = 0; i + 1 < n; i++)
                            t += g[i * ND + q];
                        g[(n - 1) * ND + q] = -t;
                    }
                    s.c[k] = sup_range(&rng, 20.0, 60.0);
                    cell_put(n, K, k, x, D, g, s.x, s.D, s.g);
                }
                batch_run(ws, n, &s);
                for (k = 0; k < K; k++) {
                    double x[NMAX], D[NMAX * NMAX], g[NMAX * ND], e = 0.0, e1,
                                                                  big = 0.0;
                    long double Jr[NMAX * ND];
                    cell_get(n, K, k, s.x, s.D, s.g, x, D, g);
                    reference(n, x, D, g, s.c[k], Jr);
                    for (i = 0; i < n * ND; i++)
                        if (fabsl(Jr[i]) > big)
                            big = (double)fabsl(Jr[i]);
                    for (i = 0; i < n * ND; i++) {
                        const double t =
                            (double)fabsl(s.J[i * K + k] - Jr[i]) / big;
                        if (t > e)
                            e = t;
                    }
                    if (e > worst)
                        worst = e;
                    e1 = single_error(ws, n, x, D, g, s.c[k], Jr, big);
                    if (e1 > worst1)
                        worst1 = e1;
                    ck_assert_msg(!check || n > SINGLE_NMAX || e1 <= ACCURACY,
                                  "N=%zu x over %g decades, Dij over %g: cell "
                                  "%zu single-state error %.3g",
                                  n, xdec[a], ddec[b], k, e1);
                    ck_assert_msg(!check || e <= ACCURACY,
                                  "N=%zu x over %g decades, Dij over %g: cell "
                                  "%zu error %.3g",
                                  n, xdec[a], ddec[b], k, e);
                }
                printf("N=%zu x over %2g decades, Dij over %g, %zu cells: "
                       "largest error %.2g (single-state call %.2g)\n",
                       n, xdec[a], ddec[b], K, worst, worst1);
                /* the same cells in reverse order: the same bits */
                for (k = 0; k < K; k++) {
                    rv.c[K - 1 - k] = s.c[k];
                    for (i = 0; i < n; i++)
                        rv.x[i * K + K - 1 - k] = s.x[i * K + k];
                    for (i = 0; i < n * n; i++)
                        rv.D[i * K + K - 1 - k] = s.D[i * K + k];
                    for (i = 0; i < n * ND; i++)
                        rv.g[i * K + K - 1 - k] = s.g[i * K + k];
                }
                batch_run(ws, n, &rv);
                for (k = 0; k < K; k++)
                    for (i = 0; i < n * ND; i++)
                        ck_assert_msg(rv.J[i * K + K - 1 - k] == s.J[i * K + k],
                                      "N=%zu cell %zu: %.17g reversed, %.17g",
                                      n, k, rv.J[i * K + K - 1 - k],
                                      s.J[i * K + k]);
            }
        batch_free(&s);
        batch_free(&rv);
        mcd_workspace_free(ws);
    }
}
END_TEST

/* Blocks of cells with a trace species take the scaled form, the others
 * the grounded one; two blocks run together (lib/batched/batch_kernel.c,
 * body2) where the pairs start with each thread's range of blocks. The
 * same cells shifted by 8 (one block of 8 lanes: other pairs) must give
 * the same bits, or a cell's result would depend on the thread count;
 * N = 2 to 5 (pairs run up to MCDI_PAIR_NMAX, lib/batched/batch.h). */
START_TEST(block_forms_do_not_depend_on_the_pairing)
{
    const size_t KA = 256, KB = KA - 8;
    double *x = malloc(NMAX * KA * sizeof(double)),
           *D = malloc(NMAX * NMAX * KA * sizeof(double)),
           *g = malloc(NMAX * ND * KA * sizeof(double)),
           *c = malloc(KA * sizeof(double)),
           *J = malloc(NMAX * ND * KA * sizeof(double)),
           *x2 = malloc(NMAX * KB * sizeof(double)),
           *D2 = malloc(NMAX * NMAX * KB * sizeof(double)),
           *g2 = malloc(NMAX * ND * KB * sizeof(double)),
           *c2 = malloc(KB * sizeof(double)),
           *J2 = malloc(NMAX * ND * KB * sizeof(double));
    mcd_workspace *ws = NULL;
    size_t i, j, k, n;
    ck_assert(x && D && g && c && J && x2 && D2 && g2 && c2 && J2);
    ck_assert_int_eq(mcd_workspace_new(NMAX, &ws), MCD_OK);
    for (n = 2; n <= NMAX; n++) {
        for (k = 0; k < KA; k++) {
            double xs[NMAX], Dc[NMAX * NMAX], gc[NMAX * ND];
            sup_fractions(&rng, n, 0.05, xs);
            if (k % 24 == 5) { /* a trace species in every third block */
                xs[1] += xs[0];
                xs[0] = 0.0;
            }
            sup_dij_decades(&rng, n, Dc, -5.0, -4.0);
            sup_gradients_zero_mean(&rng, n, ND, -10.0, 10.0, gc);
            c[k] = sup_range(&rng, 20.0, 60.0);
            cell_put(n, KA, k, xs, Dc, gc, x, D, g);
        }
        for (k = 0; k < KB; k++) {
            c2[k] = c[k + 8];
            for (i = 0; i < n; i++)
                x2[i * KB + k] = x[i * KA + k + 8];
            for (i = 0; i < n * n; i++)
                D2[i * KB + k] = D[i * KA + k + 8];
            for (i = 0; i < n * ND; i++)
                g2[i * KB + k] = g[i * KA + k + 8];
        }
        ck_assert_int_eq(batch_call(ws, n, KA, x, D, g, c, J), MCD_OK);
        ck_assert_int_eq(batch_call(ws, n, KB, x2, D2, g2, c2, J2), MCD_OK);
        for (k = 0; k < KB; k++)
            for (j = 0; j < n * ND; j++)
                ck_assert_msg(J2[j * KB + k] == J[j * KA + k + 8],
                              "N = %zu, cell %zu row %zu: %.17g shifted, "
                              "%.17g",
                              n, k + 8, j, J2[j * KB + k], J[j * KA + k + 8]);
    }
    mcd_workspace_free(ws);
    free(x), free(D), free(g), free(c), free(J);
    free(x2), free(D2), free(g2), free(c2), free(J2);
}
END_TEST

/* The last, partial block of a call takes the grounded form too
 * (batch_kernel.c, stage_ground_fluxes): a cell must get the same bits
 * in a full block and alone (a call of one cell), N = 2 to 5, without
 * trace species. */
START_TEST(last_block_matches_full_blocks)
{
    enum { KF = 32 };
    double *x = malloc(NMAX * KF * sizeof(double)),
           *D = malloc(NMAX * NMAX * KF * sizeof(double)),
           *g = malloc(NMAX * ND * KF * sizeof(double)),
           *c = malloc(KF * sizeof(double)),
           *J = malloc(NMAX * ND * KF * sizeof(double));
    mcd_workspace *ws = NULL;
    size_t i, k, n;
    ck_assert(x && D && g && c && J);
    ck_assert_int_eq(mcd_workspace_new(NMAX, &ws), MCD_OK);
    for (n = 2; n <= NMAX; n++) {
        for (k = 0; k < KF; k++) {
            double xs[NMAX], Dc[NMAX * NMAX], gc[NMAX * ND];
            sup_fractions(&rng, n, 0.01, xs);
            sup_dij_decades(&rng, n, Dc, -7.0, -4.0);
            sup_gradients_zero_mean(&rng, n, ND, -10.0, 10.0, gc);
            c[k] = sup_range(&rng, 20.0, 60.0);
            cell_put(n, KF, k, xs, Dc, gc, x, D, g);
        }
        ck_assert_int_eq(batch_call(ws, n, KF, x, D, g, c, J), MCD_OK);
        for (k = 0; k < KF; k++) {
            double xs[NMAX], Dc[NMAX * NMAX], gc[NMAX * ND], J1[NMAX * ND];
            cell_get(n, KF, k, x, D, g, xs, Dc, gc);
            ck_assert_int_eq(batch_call(ws, n, 1, xs, Dc, gc, &c[k], J1),
                             MCD_OK);
            for (i = 0; i < n * ND; i++)
                ck_assert_msg(J1[i] == J[i * KF + k],
                              "N = %zu, cell %zu row %zu: %.17g alone, %.17g "
                              "in a full block",
                              n, k, i, J1[i], J[i * KF + k]);
        }
    }
    mcd_workspace_free(ws);
    free(x), free(D), free(g), free(c), free(J);
}
END_TEST

/* Scarce species tied to each other by a tiny Đ: the equations are then
 * ill-conditioned in the classical sense (the scarce species move almost as
 * one, held back by a weak tie to the rest), but the exact fluxes are well
 * determined by the data, and the grounded form's elimination without
 * subtraction (kernel_ldl.h, stage_ground_gth) keeps them. Check values: three
 * states solved in exact rational arithmetic (Python's fractions, with sympy's
 * LUsolve for the first two and a plain Gaussian elimination for the third, on
 * the doubles below as given; written for this test). The first is the state
 * fuzz_flux found (tests/fuzz/corpus/fuzz_flux/regress_grounded_zero_sum, its
 * gradients projected to sum to zero): grounding the scarce species there, as
 * an earlier rule did, gave fluxes summing to -21600 over |F| = 21600; the
 * scaled form (mcd_flux_compute and these blocks before the grounded form)
 * gives fluxes of about 1e-87 instead of 2.16e4. The second has x of 1.3e-6,
 * 1.7e-6 and 1.4e-9 and Đ of 2.2e-25 and 1.3e-25 between the scarcest and the
 * other two; the scaled form's error is 1.8e-5 of the largest flux there
 * (measured). The third has two species at x = 1e-170 and 2e-170 tied by Đ =
 * 1e-300: x_i x_j underflows to 0 there while the tie x_i x_j / Đ_ij = 2e-40
 * dominates their rows, so the ties must be formed as x_i (x_j / Đ_ij); formed
 * the other way the tie vanished and the fluxes were off by 0.39 of the
 * largest (the exact solution of the untied state, same script). Accepted, for
 * the batched call and the single-state call (grounded form too,
 * lib/flux/ms_ldl.c): 1e-13 of the largest flux per state (measured 6.5e-17
 * batched), also for the batched call on the state alone (a last, partial
 * block). Then 40 cells of such states drawn at random: their fluxes must sum
 * to zero within 1e-13 of their magnitude per cell and direction; their error
 * against the long-double reference is printed, not asserted (about 1e-8: the
 * reference itself, whose classical form loses digits here; the scaled form's
 * was 3e-5). */
/* Rows J[i * stride] (i < m) within 1e-13 of the largest exact flux big
 * of the exact fluxes je of state `state`, through the call `what`. */
static void assert_near_exact(size_t m, const double *J, size_t stride,
                              const double *je, double big, const char *what,
                              size_t state)
{
    size_t i;
    for (i = 0; i < m; i++)
        ck_assert_msg(fabs(J[i * stride] - je[i]) <= 1e-13 * big,
                      "%s, state %zu, row %zu: %.17g, exact %.17g", what, state,
                      i, J[i * stride], je[i]);
}

START_TEST(tightly_tied_scarce_species)
{
    enum { n = 4, KS = 64, NEXACT = 3 };
    /* upper triangles of Đ [m^2/s] (the diagonal is not read) */
    static const double xe[3][n] = {
        {1.9667335289588307e-27, 9.8336676447941531e-27, 1.0,
         8.8503008803147375e-20},
        {1.3e-6, 1.7e-6, 0.99999699860000002, 1.3999999999999999e-09},
        {1e-170, 2e-170, 0.5, 0.5}};
    static const double De[3][n][n] = {
        {{0, 1.0431724258821144e-05, 5.2704249142216854e-06,
          2.0087766792229954e-139},
         {0, 0, 2.0000000000000003e-06, 2.0087766792234922e-139},
         {0, 0, 0, 2.0000000000000003e-06}},
        {{0, 3e-6, 5e-6, 2.2e-25}, {0, 0, 4.1e-6, 1.3e-25}, {0, 0, 0, 7e-6}},
        {{0, 1e-300, 1e-5, 2e-5}, {0, 0, 3e-5, 1.5e-5}, {0, 0, 0, 2.5e-5}}};
    /* (U: gradients of the third state as exact multiples, which sum to
     * exactly zero) */
#define U 0x1p-548
    static const double ge[3][n * ND] = {
        {9e7, 9e7, 9e7, 9e7, 9e7, 9e7, -2.7e8, -2.7e8, -2.7e8, 9e7, 9e7, 9e7},
        {10, -20, 30, 5, 7, -9, -40, 11, 2, 25, 2, -23},
        {U, 2 * U, -U, -3 * U, U, 4 * U, 5 * U, -4 * U, 0, -3 * U, U, -3 * U}};
#undef U
    /* the exact fluxes [mol/(m^2 s)] at c = 40 mol/m^3 */
    static const double Je[3][n * ND] = {
        {-0.00047999994261892914, -0.00047999994261892914,
         -0.00047999994261892914, -0.0023999997130946457,
         -0.0023999997130946457, -0.0023999997130946457, 21600.000297851468,
         21600.000297851468, 21600.000297851468, -21599.99741785181,
         -21599.99741785181, -21599.99741785181},
        {-0.0030822388156933511, 0.00084761567439694066, 0.00015411194065154672,
         -0.0040306199897246087, 0.0011084204971076438, 0.00020153099959535262,
         0.0071161781395272048, -0.0019569489883845977, -0.00035580890695242467,
         -3.319334109244854e-06, 9.1281688001308603e-07,
         1.6596670552534332e-07},
        {4.9615150658149056e-169, -7.4422725987223575e-169,
         -7.4422725987223575e-169, 9.9230301316298112e-169,
         -1.4884545197444715e-168, -1.4884545197444715e-168,
         -5.1372353910625163e-168, 3.9071931143292381e-168,
         -4.3413256825880422e-169, 3.648780871318045e-168,
         -1.6745113347125305e-168, 2.6668143478755118e-168}};
    const int check = extended_precision();
    double worst = 0.0, worst1 = 0.0;
    double *x = malloc(n * KS * sizeof(double)),
           *D = malloc(n * n * KS * sizeof(double)),
           *g = malloc(n * ND * KS * sizeof(double)),
           *c = malloc(KS * sizeof(double)),
           *J = malloc(n * ND * KS * sizeof(double));
    mcd_workspace *ws = NULL;
    size_t i, j, k, d;
    ck_assert(x && D && g && c && J);
    ck_assert_int_eq(mcd_workspace_new(n, &ws), MCD_OK);
    for (k = 0; k < KS; k++) {
        double xs[n], Dc[n * n], gc[n * ND];
        if (k < 8 * NEXACT) { /* the exact states, a block of 8 each */
            const size_t e = k / 8;
            memcpy(xs, xe[e], sizeof xs);
            for (i = 0; i < n; i++)
                for (j = 0; j < n; j++)
                    Dc[i * n + j] = De[e][i < j ? i : j][i < j ? j : i];
            memcpy(gc, ge[e], sizeof gc);
            c[k] = 40.0;
        } else {
            xs[0] = 1e-6 * sup_range(&rng, 1.0, 2.0);
            xs[1] = 1e-6 * sup_range(&rng, 1.0, 2.0);
            xs[3] = 1e-9 * sup_range(&rng, 1.0, 2.0);
            xs[2] = 1.0 - xs[0] - xs[1] - xs[3];
            for (i = 0; i < n; i++)
                for (j = 0; j <= i; j++)
                    Dc[i * n + j] = Dc[j * n + i] =
                        2e-6 * sup_range(&rng, 1.0, 5.0);
            Dc[0 * n + 3] = Dc[3 * n + 0] = 1e-25 * sup_range(&rng, 1.0, 3.0);
            Dc[1 * n + 3] = Dc[3 * n + 1] = 1e-25 * sup_range(&rng, 1.0, 3.0);
            sup_gradients_zero_mean(&rng, n, ND, -50.0, 50.0, gc);
            for (d = 0; d < ND; d++) /* sums exactly zero */
                gc[(n - 1) * ND + d] = -(gc[d] + gc[ND + d] + gc[2 * ND + d]);
            c[k] = sup_range(&rng, 20.0, 60.0);
        }
        cell_put(n, KS, k, xs, Dc, gc, x, D, g);
    }
    ck_assert_msg(batch_call(ws, n, KS, x, D, g, c, J) == MCD_OK, "%s",
                  mcd_last_error());
    for (k = 0; k < KS; k++) {
        double xs[n], Dc[n * n], gc[n * ND], big = 0.0, e = 0.0;
        long double Jr[n * ND];
        for (d = 0; d < ND; d++) {
            double sum = 0.0, mag = 0.0;
            for (i = 0; i < n; i++) {
                sum += J[(i * ND + d) * KS + k];
                mag += fabs(J[(i * ND + d) * KS + k]);
            }
            ck_assert_msg(fabs(sum) <= 1e-13 * mag,
                          "cell %zu direction %zu: sum %g over |J| %g", k, d,
                          sum, mag);
        }
        if (k < 8 * NEXACT) {
            const double *je = Je[k / 8];
            for (i = 0; i < n * ND; i++)
                if (fabs(je[i]) > big)
                    big = fabs(je[i]);
            assert_near_exact(n * ND, J + k, KS, je, big, "batched call",
                              k / 8);
            if (k % 8 == 0) { /* the single-state call on the same state */
                double J1[n * ND];
                cell_get(n, KS, k, x, D, g, xs, Dc, gc);
                ck_assert_int_eq(single_call(ws, n, xs, Dc, gc, c[k], J1),
                                 MCD_OK);
                assert_near_exact(n * ND, J1, 1, je, big, "single-state call",
                                  k / 8);
                /* the batched call on this cell alone: a last, partial
                 * block (one cell in SoA is the state's own arrays) */
                ck_assert_int_eq(batch_call(ws, n, 1, xs, Dc, gc, &c[k], J1),
                                 MCD_OK);
                assert_near_exact(n * ND, J1, 1, je, big,
                                  "batched call on one cell", k / 8);
            }
            continue;
        }
        cell_get(n, KS, k, x, D, g, xs, Dc, gc);
        reference(n, xs, Dc, gc, c[k], Jr);
        for (i = 0; i < n * ND; i++)
            if (fabsl(Jr[i]) > big)
                big = (double)fabsl(Jr[i]);
        for (i = 0; i < n * ND; i++) {
            const double t = (double)fabsl(J[i * KS + k] - Jr[i]) / big;
            if (t > e)
                e = t;
        }
        if (e > worst)
            worst = e;
        e = single_error(ws, n, xs, Dc, gc, c[k], Jr, big);
        if (e > worst1)
            worst1 = e;
    }
    printf("scarce species tied by tiny Dij, %d cells: largest error %.2g "
           "(single-state call %.2g), %s\n",
           KS - 8 * NEXACT, worst, worst1,
           check ? "not asserted" : "reference no wider than double");
    mcd_workspace_free(ws);
    free(x), free(D), free(g), free(c), free(J);
}
END_TEST

/* Scarce species tied to each other by a tiny Đ among 7 species: the
 * grounded form of 6 to 10 species (kernel_ldl.h, stage_ground_any). x of
 * 1.3e-6, 1.7e-6 and 1.4e-9 with Đ of 2.2e-25 and 1.3e-25 between the
 * scarcest and the other two (the second state above, among four more
 * abundant species). Check values: the exact fluxes, solved in rational
 * arithmetic (Python's fractions, a plain Gaussian elimination on the
 * doubles below as given; the script of the third state above, written for
 * this test). Accepted: 1e-13 of the largest flux, for the batched call in
 * a full block and on the state alone (measured 1.4e-16 both) and for the
 * single-state call (measured 4.3e-16). In the scaled form both were far
 * off: the batched call 0.033 (before stage_ground_any), the single-state
 * call 0.018 (before fused_gth_any, lib/flux/ms_ldl.c). */
START_TEST(tied_scarce_species_among_seven)
{
    enum { n = 7, KS = 8 };
    static const double xs[n] = {
        1.3e-06, 1.7e-06, 1.4e-09, 0.3, 0.25, 0.2, 0.24999699860000013,
    };
    /* the upper triangle of Đ [m^2/s], row by row */
    static const double Du[n * (n - 1) / 2] = {
        3e-06,   2.2e-25, 4.1e-06, 7e-06,   2.5e-05, 1.1e-05, 1.3e-25,
        9e-06,   1.6e-05, 2e-05,   8e-06,   1.2e-05, 3.3e-05, 4.4e-06,
        5.5e-06, 1.8e-05, 2.2e-05, 7.7e-06, 6.6e-06, 1.5e-05, 1.9e-05,
    };
    static const double gs[n * ND] = {
        10,  -20, 30, 5, 7, -9, -4, 11,  2,  25, 2,
        -23, -6,  3,  8, 1, -2, -5, -31, -1, -3,
    };
    /* the exact fluxes [mol/(m^2 s)] at c = 40 mol/m^3 */
    static const double je[n * ND] = {
        -0.0017073544394293476,  0.00031042559003984546, -0.003569897799966877,
        -0.002232694266912724,   0.0004059411560210618,  -0.00466832789204767,
        -1.8386893962811744e-06, 3.3430448145332173e-07, -3.84450532292252e-06,
        -0.011993466246067378,   -0.0006747436682466711, 0.009476268667108066,
        0.003188238188329993,    -0.0012054600328543412, -0.004732652588467254,
        0.0006076193481735802,   0.0007465794509554335,  0.0013848898342884023,
        0.012139496105302157,    0.00041692319960321837, 0.002113564284408255,
    };
    double Dc[n * n], x[n * KS], D[n * n * KS], g[n * ND * KS], c[KS],
        J[n * ND * KS], J1[n * ND], big = 0.0;
    mcd_workspace *ws = NULL;
    size_t i, j, k, q = 0;
    for (i = 0; i < n; i++) {
        Dc[i * n + i] = 1e-5; /* not read */
        for (j = i + 1; j < n; j++, q++)
            Dc[i * n + j] = Dc[j * n + i] = Du[q];
    }
    for (k = 0; k < KS; k++) {
        c[k] = 40.0;
        cell_put(n, KS, k, xs, Dc, gs, x, D, g);
    }
    for (i = 0; i < n * ND; i++)
        if (fabs(je[i]) > big)
            big = fabs(je[i]);
    ck_assert_int_eq(mcd_workspace_new(n, &ws), MCD_OK);
    ck_assert_msg(batch_call(ws, n, KS, x, D, g, c, J) == MCD_OK, "%s",
                  mcd_last_error());
    for (k = 0; k < KS; k++)
        assert_near_exact(n * ND, J + k, KS, je, big, "batched call", k);
    ck_assert_int_eq(batch_call(ws, n, 1, xs, Dc, gs, c, J1), MCD_OK);
    assert_near_exact(n * ND, J1, 1, je, big, "batched call on one cell", 0);
    ck_assert_int_eq(single_call(ws, n, xs, Dc, gs, 40.0, J1), MCD_OK);
    assert_near_exact(n * ND, J1, 1, je, big, "single-state call", 0);
    mcd_workspace_free(ws);
}
END_TEST

int main(void)
{
    Suite *s = suite_create("ground");
    TCase *tc = tcase_create("core");
    tcase_add_test(tc, grounded_blocks_match_an_extended_precision_solve);
    tcase_add_test(tc, block_forms_do_not_depend_on_the_pairing);
    tcase_add_test(tc, tightly_tied_scarce_species);
    tcase_add_test(tc, tied_scarce_species_among_seven);
    tcase_add_test(tc, last_block_matches_full_blocks);
    suite_add_tcase(s, tc);
    return sup_run(s);
}
