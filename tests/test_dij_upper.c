/* test_dij_upper.c - mcd_workspace_set_dij_read(ws, MCD_DIJ_READ_UPPER):
 * mcd_flux_batch_dij reads the upper triangle of each cell's Dij only.
 * Checked over random batches (N = 1..12 and 20, cell counts that are
 * not multiples of 8, trace species, every model, both flux bases, SoA
 * and tiled, one and two threads): with the diagonal and the lower
 * triangle filled with NaN the results are bit for bit those of the
 * default mode on the symmetric matrix; the default mode refuses the
 * same NaN-filled input; a bad upper entry is named with the default
 * mode's message and cell; the setting is per workspace and reversible;
 * a bad mode is refused by name; no heap allocation. The reference is
 * the library's own default path (checked against published data in
 * test_batch and the single-state suites): the checks are identities.
 */
#define SUP_ALLOC_HOOK /* this program counts allocations */
#include <check.h>
#include <math.h>
#include <stdint.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

#include "mcdiff.h"
#include "support.h"

static sup_rng rng = SUP_RNG(SUP_SPLITMIX64, 0xD1A);

static double *xmalloc(size_t nd)
{
    double *p = malloc((nd > 0 ? nd : 1) * sizeof(double));
    ck_assert_ptr_nonnull(p);
    return p;
}

/* Index of row q of cell k of an array of Q rows (SoA or tiles of 8). */
static size_t at(int tiled, size_t Q, size_t K, size_t q, size_t k)
{
    return tiled ? k / 8 * 8 * Q + 8 * q + k % 8 : q * K + k;
}

/* Doubles of an array of Q rows over K cells. */
static size_t len(int tiled, size_t Q, size_t K)
{
    return tiled ? (K + 7) / 8 * 8 * Q : Q * K;
}

/* A random batch: fractions with some trace species, gradients summing
 * to zero, c, and Dij twice: sym (symmetric, diagonal 0) and up (the
 * same upper triangle, NaN on the diagonal and below it). */
typedef struct batch {
    size_t n, K;
    int tiled;
    double *x, *g, *c, *M, *sym, *up;
} batch;

static void batch_make(batch *b, size_t n, size_t K, int tiled)
{
    size_t i, j, k, d;
    b->n = n;
    b->K = K;
    b->tiled = tiled;
    b->x = xmalloc(len(tiled, n, K));
    b->g = xmalloc(len(tiled, 3 * n, K));
    b->c = xmalloc(K);
    b->M = xmalloc(n);
    b->sym = xmalloc(len(tiled, n * n, K));
    b->up = xmalloc(len(tiled, n * n, K));
    for (i = 0; i < len(tiled, n * n, K); i++)
        b->sym[i] = b->up[i] = SUP_NAN; /* padding slots of tiles too */
    for (i = 0; i < n; i++)
        b->M[i] = sup_molar_mass(&rng);
    for (k = 0; k < K; k++) {
        double s = 0.0;
        b->c[k] = sup_range(&rng, 5.0, 80.0);
        for (i = 0; i < n; i++) {
            /* about one in six a trace species (x = 0), never all */
            double v =
                sup_u01(&rng) < 0.17 && i > 0 ? 0.0 : sup_range(&rng, 0.01, 1);
            b->x[at(tiled, n, K, i, k)] = v;
            s += v;
        }
        for (i = 0; i < n; i++)
            b->x[at(tiled, n, K, i, k)] /= s;
        for (d = 0; d < 3; d++) {
            double m = 0.0;
            for (i = 0; i < n; i++)
                m += (b->g[at(tiled, 3 * n, K, i * 3 + d, k)] =
                          sup_range(&rng, -50.0, 50.0));
            for (i = 0; i < n; i++)
                b->g[at(tiled, 3 * n, K, i * 3 + d, k)] -= m / (double)n;
        }
        for (i = 0; i < n; i++) {
            b->sym[at(tiled, n * n, K, i * n + i, k)] = 0.0;
            for (j = i + 1; j < n; j++) {
                const double v = sup_log_uniform(&rng, 2e-6, 50.0);
                b->sym[at(tiled, n * n, K, i * n + j, k)] = v;
                b->sym[at(tiled, n * n, K, j * n + i, k)] = v;
                b->up[at(tiled, n * n, K, i * n + j, k)] = v;
            }
        }
    }
}

static void batch_free(batch *b)
{
    free(b->x);
    free(b->g);
    free(b->c);
    free(b->M);
    free(b->sym);
    free(b->up);
}

static mcd_status run(mcd_workspace *ws, const batch *b, mcd_model model,
                      mcd_basis fb, const double *Dij, double *J)
{
    return mcd_flux_batch_dij(
        ws, model, b->n, b->M, Dij, b->c,
        &(mcd_cells){.n_cells = b->K,
                     .n_dim = 3,
                     .comp_basis = MCD_BASIS_MOLE,
                     .comp = b->x,
                     .grad = b->g,
                     .layout = b->tiled ? MCD_LAYOUT_TILED8 : MCD_LAYOUT_SOA},
        fb, J);
}

static const size_t NS[] = {1, 2, 3, 4, 5, 6, 7, 8, 9, 10, 11, 12, 20};
static const size_t KS[] = {1, 7, 9, 17, 100};

/* The upper triangle alone (lower and diagonal NaN) gives the bits of
 * the default mode on the symmetric matrix; the default mode refuses
 * the NaN-filled input. Loop index: the entry of NS. */
START_TEST(upper_is_bit_identical_to_both)
{
    const size_t n = NS[_i];
    const mcd_model models[] = {MCD_MODEL_MAXWELL_STEFAN,
                                MCD_MODEL_MIXTURE_AVERAGED,
                                MCD_MODEL_ITERATIVE};
    const mcd_basis bases[] = {MCD_BASIS_MOLE, MCD_BASIS_MASS};
    mcd_workspace *ws = NULL;
    size_t mismatches = 0, runs = 0, ki, mi, bi;
    int tiled, refused = 1;
    ck_assert_int_eq(mcd_workspace_new(n, &ws), MCD_OK);
    for (tiled = 0; tiled < 2; tiled++)
        for (ki = 0; ki < sizeof KS / sizeof KS[0]; ki++) {
            batch b;
            const size_t nJ = len(tiled, 3 * n, KS[ki]);
            double *J0 = xmalloc(nJ), *J1 = xmalloc(nJ);
            batch_make(&b, n, KS[ki], tiled);
            for (mi = 0; mi < 3; mi++)
                for (bi = 0; bi < 2; bi++) {
                    mcd_status s0, s1, s2;
                    memset(J0, 0, nJ * sizeof(double));
                    memset(J1, 0, nJ * sizeof(double));
                    ck_assert_int_eq(
                        mcd_workspace_set_dij_read(ws, MCD_DIJ_READ_BOTH),
                        MCD_OK);
                    s0 = run(ws, &b, models[mi], bases[bi], b.sym, J0);
                    s2 = run(ws, &b, models[mi], bases[bi], b.up, J1);
                    ck_assert_int_eq(
                        mcd_workspace_set_dij_read(ws, MCD_DIJ_READ_UPPER),
                        MCD_OK);
                    s1 = run(ws, &b, models[mi], bases[bi], b.up, J1);
                    ck_assert_msg(s0 == MCD_OK && s1 == MCD_OK,
                                  "N %zu K %zu model %d basis %d: %d %d (%s)",
                                  n, KS[ki], (int)models[mi], (int)bases[bi],
                                  (int)s0, (int)s1, mcd_last_error());
                    /* N = 1 has no off-diagonal entry: nothing to refuse */
                    if (n > 1 && s2 == MCD_OK)
                        refused = 0;
                    mismatches +=
                        memcmp(J0, J1, nJ * sizeof(double)) != 0 ? 1 : 0;
                    runs++;
                }
            free(J0);
            free(J1);
            batch_free(&b);
        }
    ck_assert_msg(mismatches == 0, "N %zu: %zu of %zu runs differ", n,
                  mismatches, runs);
    ck_assert_msg(refused,
                  "N %zu: the default mode took NaN below the "
                  "diagonal",
                  n);
    mcd_workspace_free(ws);
}
END_TEST

/* A bad upper entry (NaN, 0, negative, subnormal) is named as in the
 * default mode: same status, same message, same cell. */
START_TEST(upper_bad_entry_named_as_both)
{
    const double bad[] = {SUP_NAN, 0.0, -1e-5, 1e-310, SUP_INF};
    const size_t n = 5, K = 37, cell = 29;
    mcd_workspace *ws = NULL;
    size_t t;
    int tiled;
    ck_assert_int_eq(mcd_workspace_new(n, &ws), MCD_OK);
    for (tiled = 0; tiled < 2; tiled++)
        for (t = 0; t < sizeof bad / sizeof bad[0]; t++) {
            batch b;
            char m0[512], m1[512];
            mcd_status s0, s1;
            double *J = xmalloc(len(tiled, 3 * n, K));
            batch_make(&b, n, K, tiled);
            /* entry (1,3) of the cell, both triangles in sym */
            b.sym[at(tiled, n * n, K, 1 * n + 3, cell)] = bad[t];
            b.sym[at(tiled, n * n, K, 3 * n + 1, cell)] = bad[t];
            b.up[at(tiled, n * n, K, 1 * n + 3, cell)] = bad[t];
            mcd_workspace_set_dij_read(ws, MCD_DIJ_READ_BOTH);
            s0 =
                run(ws, &b, MCD_MODEL_MAXWELL_STEFAN, MCD_BASIS_MOLE, b.sym, J);
            snprintf(m0, sizeof m0, "%s", mcd_last_error());
            mcd_workspace_set_dij_read(ws, MCD_DIJ_READ_UPPER);
            s1 = run(ws, &b, MCD_MODEL_MAXWELL_STEFAN, MCD_BASIS_MOLE, b.up, J);
            snprintf(m1, sizeof m1, "%s", mcd_last_error());
            ck_assert_int_ne(s0, MCD_OK);
            ck_assert_int_eq(s1, s0);
            ck_assert_str_eq(m1, m0);
            ck_assert_msg(strstr(m1, "cell 29") != NULL &&
                              strstr(m1, "entry (1,3)") != NULL,
                          "message: %s", m1);
            free(J);
            batch_free(&b);
        }
    mcd_workspace_free(ws);
}
END_TEST

/* An asymmetric matrix: refused by default, taken in upper mode with the
 * results of its upper triangle mirrored (the caller vouched). */
START_TEST(upper_skips_only_the_symmetry_check)
{
    const size_t n = 4, K = 16;
    mcd_workspace *ws = NULL;
    batch b;
    double *J0 = xmalloc(3 * n * K), *J1 = xmalloc(3 * n * K);
    double *asym = xmalloc(n * n * K);
    size_t q;
    ck_assert_int_eq(mcd_workspace_new(n, &ws), MCD_OK);
    batch_make(&b, n, K, 0);
    memcpy(asym, b.sym, n * n * K * sizeof(double));
    for (q = 0; q < K; q++) /* (2,0) 10 % off its mirror (0,2) */
        asym[(2 * n + 0) * K + q] *= 1.1;
    ck_assert_int_eq(
        run(ws, &b, MCD_MODEL_MAXWELL_STEFAN, MCD_BASIS_MOLE, asym, J0),
        MCD_EDOM);
    ck_assert_ptr_nonnull(strstr(mcd_last_error(), "not symmetric"));
    ck_assert_int_eq(
        run(ws, &b, MCD_MODEL_MAXWELL_STEFAN, MCD_BASIS_MOLE, b.sym, J0),
        MCD_OK);
    ck_assert_int_eq(mcd_workspace_set_dij_read(ws, MCD_DIJ_READ_UPPER),
                     MCD_OK);
    ck_assert_int_eq(
        run(ws, &b, MCD_MODEL_MAXWELL_STEFAN, MCD_BASIS_MOLE, asym, J1),
        MCD_OK);
    ck_assert_int_eq(memcmp(J0, J1, 3 * n * K * sizeof(double)), 0);
    /* back to the default: refused again */
    ck_assert_int_eq(mcd_workspace_set_dij_read(ws, MCD_DIJ_READ_BOTH), MCD_OK);
    ck_assert_int_eq(
        run(ws, &b, MCD_MODEL_MAXWELL_STEFAN, MCD_BASIS_MOLE, asym, J1),
        MCD_EDOM);
    free(J0);
    free(J1);
    free(asym);
    batch_free(&b);
    mcd_workspace_free(ws);
}
END_TEST

/* Two threads give the serial bits in upper mode (OpenMP builds; one
 * thread otherwise, the same check). */
START_TEST(upper_threads_give_serial_bits)
{
    const size_t n = 10, K = 1003;
    mcd_workspace *ws = NULL;
    batch b;
    double *J0 = xmalloc(3 * n * K), *J1 = xmalloc(3 * n * K);
    ck_assert_int_eq(mcd_workspace_new(n, &ws), MCD_OK);
    ck_assert_int_eq(mcd_workspace_set_dij_read(ws, MCD_DIJ_READ_UPPER),
                     MCD_OK);
    batch_make(&b, n, K, 0);
    ck_assert_int_eq(mcd_workspace_set_threads(ws, 1), MCD_OK);
    ck_assert_int_eq(
        run(ws, &b, MCD_MODEL_MAXWELL_STEFAN, MCD_BASIS_MOLE, b.up, J0),
        MCD_OK);
    ck_assert_int_eq(mcd_workspace_set_threads(ws, 2), MCD_OK);
    ck_assert_int_eq(
        run(ws, &b, MCD_MODEL_MAXWELL_STEFAN, MCD_BASIS_MOLE, b.up, J1),
        MCD_OK);
    ck_assert_int_eq(memcmp(J0, J1, 3 * n * K * sizeof(double)), 0);
    free(J0);
    free(J1);
    batch_free(&b);
    mcd_workspace_free(ws);
}
END_TEST

/* Bad arguments of the setter; the other batched calls keep checking
 * both triangles whatever the setting. */
START_TEST(upper_setter_and_scope)
{
    const size_t n = 3, K = 8;
    mcd_workspace *ws = NULL;
    batch b;
    double *J = xmalloc(3 * n * K), *jac = xmalloc(3 * n * n * K);
    ck_assert_int_eq(mcd_workspace_new(n, &ws), MCD_OK);
    ck_assert_int_eq(mcd_workspace_set_dij_read(NULL, MCD_DIJ_READ_UPPER),
                     MCD_EINVAL);
    ck_assert_int_eq(mcd_workspace_set_dij_read(ws, (mcd_dij_read)2),
                     MCD_EINVAL);
    ck_assert_ptr_nonnull(strstr(mcd_last_error(), "argument mode"));
    ck_assert_int_eq(mcd_workspace_set_dij_read(ws, MCD_DIJ_READ_UPPER),
                     MCD_OK);
    batch_make(&b, n, K, 0);
    ck_assert_int_eq(mcd_flux_batch_jacobian(
                         ws, MCD_MODEL_MAXWELL_STEFAN, n, NULL, b.up, b.c,
                         &(mcd_cells){.n_cells = K,
                                      .n_dim = 3,
                                      .comp_basis = MCD_BASIS_MOLE,
                                      .comp = b.x,
                                      .grad = b.g},
                         MCD_BASIS_MOLE, J, jac),
                     MCD_EINVAL);
    free(J);
    free(jac);
    batch_free(&b);
    mcd_workspace_free(ws);
}
END_TEST

/* The upper-mode call allocates nothing. */
START_TEST(upper_allocates_nothing)
{
    const size_t n = 7, K = 45;
    mcd_workspace *ws = NULL;
    batch b;
    double *J = xmalloc(3 * n * K);
    mcd_status st;
    int live;
    ck_assert_int_eq(mcd_workspace_new(n, &ws), MCD_OK);
    ck_assert_int_eq(mcd_workspace_set_dij_read(ws, MCD_DIJ_READ_UPPER),
                     MCD_OK);
    batch_make(&b, n, K, 0);
    /* once before counting: first-call set-up (e.g. the ISA choice) */
    ck_assert_int_eq(
        run(ws, &b, MCD_MODEL_MAXWELL_STEFAN, MCD_BASIS_MOLE, b.up, J), MCD_OK);
    sup_alloc_open();
    st = run(ws, &b, MCD_MODEL_MAXWELL_STEFAN, MCD_BASIS_MOLE, b.up, J);
    live = sup_alloc_close();
    ck_assert_int_eq(st, MCD_OK);
    if (live)
        ck_assert_msg(sup_alloc_count == 1, "%ld allocations besides the probe",
                      (long)sup_alloc_count - 1);
    free(J);
    batch_free(&b);
    mcd_workspace_free(ws);
}
END_TEST

int main(void)
{
    Suite *s = suite_create("mcd:dij_upper");
    TCase *tc = tcase_create("dij_upper");
    tcase_set_timeout(tc, 300);
    tcase_add_loop_test(tc, upper_is_bit_identical_to_both, 0,
                        (int)(sizeof NS / sizeof NS[0]));
    tcase_add_test(tc, upper_bad_entry_named_as_both);
    tcase_add_test(tc, upper_skips_only_the_symmetry_check);
    tcase_add_test(tc, upper_threads_give_serial_bits);
    tcase_add_test(tc, upper_setter_and_scope);
    tcase_add_test(tc, upper_allocates_nothing);
    suite_add_tcase(s, tc);
    return sup_run(s);
}
