/* test_dufour.c - the batched Dufour heat flux (mcd_dufour_heat_flux_batch)
 * against its single-state twin (mcd_dufour_heat_flux).
 *
 * The physics of q_D (Onsager reciprocity with thermal diffusion, the
 * trace-species limit) is checked on the single-state call in
 * tests/test_thermal_kt.c; here the batched call must give the same bits
 * for every cell, over random batches of the SoA layout with trace
 * species and pure components, molar and mass fluxes from the batched
 * flux call with thermal diffusion; q_D = 0 exactly without thermal
 * diffusion (theta = 0); a bad cell anywhere fails the call with the
 * single-state message prefixed by "cell <k>: " and writes nothing.
 */
#include <check.h>
#include <math.h>
#include <stdio.h>
#include <string.h>

#include "mcdiff.h"
#include "support.h"

#define NMAX 12
#define KMAX 40

static sup_rng rng = SUP_RNG(SUP_SPLITMIX64, 0xD0F0A2ull);

/* A random batch of K cells of n species in nd directions, SoA. */
typedef struct batch {
    size_t n, nd, K;
    double M[NMAX], x[NMAX * KMAX], th[NMAX * KMAX], kT[NMAX * KMAX];
    double D[NMAX * NMAX * KMAX], c[KMAX], T[KMAX];
    double g[NMAX * 3 * KMAX], glnT[3 * KMAX];
} batch;

/* Cell k's mole fractions: all present, a trace species (x = 0) or a
 * pure component, by k mod 5. */
static void cell_fractions(size_t n, size_t k, double *xs)
{
    sup_fractions(&rng, n, 0.05, xs);
    if (k % 5 == 1 && n > 2) {
        size_t t = (size_t)(sup_u01(&rng) * (double)n) % n;
        double s = 0.0;
        xs[t] = 0.0;
        for (size_t i = 0; i < n; i++)
            s += xs[i];
        for (size_t i = 0; i < n; i++)
            xs[i] /= s;
    } else if (k % 5 == 3) {
        size_t p = (size_t)(sup_u01(&rng) * (double)n) % n;
        for (size_t i = 0; i < n; i++)
            xs[i] = i == p ? 1.0 : 0.0;
    }
}

static void draw(batch *b)
{
    const size_t n = b->n, K = b->K, nd = b->nd;
    for (size_t i = 0; i < n; i++)
        b->M[i] = sup_molar_mass(&rng);
    for (size_t k = 0; k < K; k++) {
        double xs[NMAX], Dm[NMAX * NMAX], gs[NMAX * 3];
        cell_fractions(n, k, xs);
        sup_dij_decades(&rng, n, Dm, -5.0, -4.0);
        sup_gradients_zero_mean(&rng, n, nd, -50.0, 50.0, gs);
        for (size_t i = 0; i < n; i++) {
            b->x[i * K + k] = xs[i];
            b->th[i * K + k] = sup_range(&rng, -0.6, 0.6);
            b->kT[i * K + k] = xs[i] * b->th[i * K + k];
        }
        for (size_t i = 0; i < n * n; i++)
            b->D[i * K + k] = Dm[i];
        for (size_t i = 0; i < n * nd; i++)
            b->g[i * K + k] = gs[i];
        for (size_t d = 0; d < nd; d++)
            b->glnT[d * K + k] = sup_range(&rng, -300.0, 300.0);
        b->c[k] = sup_range(&rng, 5.0, 80.0);
        b->T[k] = sup_range(&rng, 250.0, 2000.0);
    }
}

/* The batched exact fluxes of b (with thermal diffusion when thermal). */
static void fluxes(mcd_workspace *ws, const batch *b, int thermal, mcd_basis fb,
                   double *F)
{
    mcd_cells cl = {.n_cells = b->K,
                    .n_dim = b->nd,
                    .comp_basis = MCD_BASIS_MOLE,
                    .comp = b->x,
                    .grad = b->g};
    if (thermal) {
        cl.kT = b->kT;
        cl.grad_lnT = b->glnT;
    }
    ck_assert_msg(mcd_flux_batch_dij(ws, MCD_MODEL_MAXWELL_STEFAN, b->n, b->M,
                                     b->D, b->c, &cl, fb, F) == MCD_OK,
                  "%s", mcd_last_error());
}

/* The single-state call on cell k of the SoA arrays. */
static mcd_status single(const batch *b, size_t k, const double *th,
                         mcd_basis fb, const double *F, double *q)
{
    const size_t n = b->n, K = b->K, nd = b->nd;
    double xs[NMAX], ts[NMAX], fs[NMAX * 3];
    for (size_t i = 0; i < n; i++) {
        xs[i] = b->x[i * K + k];
        ts[i] = th[i * K + k];
    }
    for (size_t e = 0; e < n * nd; e++)
        fs[e] = F[e * K + k];
    return mcd_dufour_heat_flux(n, nd, xs, b->M, ts, b->T[k], fb, fs, q);
}

/* Every cell of 300 random batches (N = 2..12, K = 1..40, n_dim 1..3,
 * molar and mass fluxes): the batched q_D equals the single-state call's
 * bit for bit (both run one function of lib/flux/dufour.c on the same
 * numbers, so no tolerance applies). */
START_TEST(dufour_batch_equals_single_state_bit_for_bit)
{
    static batch b;
    static double F[NMAX * 3 * KMAX], q[3 * KMAX];
    mcd_workspace *ws;
    size_t nonzero = 0, entries = 0;
    ck_assert_int_eq(mcd_workspace_new(NMAX, &ws), MCD_OK);
    for (int r = 0; r < 300; r++) {
        const mcd_basis fb = r % 2 ? MCD_BASIS_MASS : MCD_BASIS_MOLE;
        b.n = 2 + (size_t)(r % (NMAX - 1));
        b.nd = 1 + (size_t)(r % 3);
        b.K = 1 + (size_t)(sup_u01(&rng) * KMAX) % KMAX;
        draw(&b);
        fluxes(ws, &b, 1, fb, F);
        ck_assert_int_eq(mcd_dufour_heat_flux_batch(b.n, b.K, b.nd, b.x, b.M,
                                                    b.th, b.T, fb, F, q),
                         MCD_OK);
        for (size_t k = 0; k < b.K; k++) {
            double q1[3];
            ck_assert_int_eq(single(&b, k, b.th, fb, F, q1), MCD_OK);
            for (size_t d = 0; d < b.nd; d++) {
                ck_assert_msg(memcmp(&q[d * b.K + k], &q1[d], sizeof(double)) ==
                                  0,
                              "batch %d cell %zu dir %zu: %.17g vs %.17g", r, k,
                              d, q[d * b.K + k], q1[d]);
                nonzero += q1[d] != 0.0;
                entries++;
            }
        }
    }
    /* the comparison is not between zeros: nearly every cell carries heat
     * (99 % of the entries here; a few pure cells have none) */
    ck_assert_msg(nonzero > 9 * entries / 10, "%zu nonzero of %zu", nonzero,
                  entries);
    mcd_workspace_free(ws);
}
END_TEST

/* Without thermal diffusion (k_T = 0 in every cell: theta = 0) the fluxes
 * carry no Dufour heat: q_D = R T sum_i (0 - 0) J_i = 0 exactly, in both
 * bases, whatever the fluxes. */
START_TEST(dufour_batch_zero_without_thermal_diffusion)
{
    static batch b;
    static double F[NMAX * 3 * KMAX], q[3 * KMAX], zero[NMAX * KMAX];
    mcd_workspace *ws;
    ck_assert_int_eq(mcd_workspace_new(NMAX, &ws), MCD_OK);
    for (int r = 0; r < 60; r++) {
        const mcd_basis fb = r % 2 ? MCD_BASIS_MASS : MCD_BASIS_MOLE;
        b.n = 2 + (size_t)(r % (NMAX - 1));
        b.nd = 1 + (size_t)(r % 3);
        b.K = 1 + (size_t)(sup_u01(&rng) * KMAX) % KMAX;
        draw(&b);
        fluxes(ws, &b, 0, fb, F);
        sup_guard_fill(q, 3 * KMAX);
        ck_assert_int_eq(mcd_dufour_heat_flux_batch(b.n, b.K, b.nd, b.x, b.M,
                                                    zero, b.T, fb, F, q),
                         MCD_OK);
        for (size_t e = 0; e < b.nd * b.K; e++)
            ck_assert_msg(q[e] == 0.0, "batch %d entry %zu: %g", r, e, q[e]);
        ck_assert(sup_guard_intact(q + b.nd * b.K, 3 * KMAX - b.nd * b.K));
    }
    mcd_workspace_free(ws);
}
END_TEST

/* A bad cell in the middle of a batch: the status and the message of the
 * single-state call on that cell, prefixed "cell <k>: ", and out_q
 * untouched (the good cells before it are not written either). */
START_TEST(dufour_batch_bad_cell_named_nothing_written)
{
    static batch b;
    static double F[NMAX * 3 * KMAX], q[3 * KMAX], q1[3];
    mcd_workspace *ws;
    const size_t bad = 7;
    ck_assert_int_eq(mcd_workspace_new(NMAX, &ws), MCD_OK);
    b.n = 4;
    b.nd = 3;
    b.K = 20;
    draw(&b);
    fluxes(ws, &b, 1, MCD_BASIS_MOLE, F);
    for (int kind = 0; kind < 5; kind++) {
        static batch m;
        static double Fm[NMAX * 3 * KMAX];
        char want[600];
        mcd_status st1, st;
        m = b;
        memcpy(Fm, F, sizeof F);
        switch (kind) {
        case 0: m.T[bad] = -1.0; break;
        case 1: m.T[bad] = SUP_NAN; break;
        case 2: m.x[1 * b.K + bad] = -0.25; break;
        case 3: m.th[2 * b.K + bad] = SUP_INF; break;
        default: Fm[(3 * b.nd + 2) * b.K + bad] = SUP_NAN; break;
        }
        st1 = single(&m, bad, m.th, MCD_BASIS_MOLE, Fm, q1);
        ck_assert_int_ne(st1, MCD_OK);
        snprintf(want, sizeof want, "cell %zu: %s", bad, mcd_last_error());
        sup_guard_fill(q, 3 * KMAX);
        st = mcd_dufour_heat_flux_batch(m.n, m.K, m.nd, m.x, m.M, m.th, m.T,
                                        MCD_BASIS_MOLE, Fm, q);
        ck_assert_int_eq(st, st1);
        ck_assert_str_eq(mcd_last_error(), want);
        ck_assert(sup_guard_intact(q, 3 * KMAX));
    }
    mcd_workspace_free(ws);
}
END_TEST

int main(void)
{
    Suite *s = suite_create("mcd:dufour");
    TCase *tc = tcase_create("batch");
    tcase_add_test(tc, dufour_batch_equals_single_state_bit_for_bit);
    tcase_add_test(tc, dufour_batch_zero_without_thermal_diffusion);
    tcase_add_test(tc, dufour_batch_bad_cell_named_nothing_written);
    suite_add_tcase(s, tc);
    return sup_run(s);
}
