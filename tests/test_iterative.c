/* test_iterative.c - the Ern-Giovangigli iterative Maxwell-Stefan solver
 * (identities only: no outside check values; the reference is the exact
 * solve, itself checked against published data elsewhere)
 * (MCD_MODEL_ITERATIVE of the batched calls).
 *
 * Ern and Giovangigli (1994, Multicomponent Transport Algorithms,
 * Springer monograph m24) prove that the splitting with the diagonal
 * Ms_ii = S_i / (1 - x_i) and the projection onto the zero-sum converges
 * to the exact solution and that its first iterate is the
 * mixture-averaged approximation. Checked here against the library's
 * exact solution (mcd_flux_compute, itself checked against the
 * Maxwell-Stefan equations in test_flux_identities) over random states
 * with N up to 100: convergence to round-off, the first iterate, the
 * honesty of the returned error estimate, and the iteration settings.
 */
#include <check.h>
#include <math.h>
#include <stdint.h>
#include <stdio.h>
#include <stdlib.h>

#include "mcdiff.h"
#include "support.h"

static sup_rng rng = SUP_RNG(SUP_SPLITMIX64, 0);

#define KC 9 /* cells per call: one full vector block and one lane */
#define ND 2

typedef struct prob {
    size_t n;
    double *D, *c, *x, *g, *ref, *out;
} prob;

/* Random cells (with trace species in some cells) and their exact fluxes. */
static void prob_make(prob *p, size_t n, mcd_workspace *ws, mcd_model refm)
{
    size_t i, j, k;
    p->n = n;
    p->D = malloc(n * n * KC * sizeof(double));
    p->c = malloc(KC * sizeof(double));
    p->x = malloc(n * KC * sizeof(double));
    p->g = malloc(n * ND * KC * sizeof(double));
    p->ref = malloc(n * ND * KC * sizeof(double));
    p->out = malloc(n * ND * KC * sizeof(double));
    ck_assert(p->D && p->c && p->x && p->g && p->ref && p->out);
    for (k = 0; k < KC; k++) {
        double s = 0.0, Dk[100 * 100], xk[100], gk[200], F[200];
        p->c[k] = 10.0 + 50.0 * sup_u01(&rng);
        for (i = 0; i < n; i++) {
            xk[i] = (k % 3 == 2 && i % 4 == 1 && n > 2) ? 0.0
                                                        : 0.01 + sup_u01(&rng);
            s += xk[i];
        }
        for (i = 0; i < n; i++) {
            xk[i] /= s;
            p->x[i * KC + k] = xk[i];
            for (j = 0; j < ND; j++)
                p->g[(i * ND + j) * KC + k] = gk[i * ND + j] =
                    2.0 * sup_u01(&rng) - 1.0;
        }
        for (i = 0; i < n; i++) {
            Dk[i * n + i] = 0.0;
            for (j = i + 1; j < n; j++)
                Dk[i * n + j] = Dk[j * n + i] = 5e-6 * pow(20.0, sup_u01(&rng));
        }
        for (i = 0; i < n * n; i++)
            p->D[i * KC + k] = Dk[i];
        ck_assert_int_eq(
            mcd_flux_compute(ws, refm,
                             &(mcd_state){.n_species = n,
                                          .n_dim = ND,
                                          .Dij = Dk,
                                          .c = p->c[k],
                                          .comp_basis = MCD_BASIS_MOLE,
                                          .comp = xk,
                                          .grad = gk},
                             MCD_BASIS_MOLE, F),
            MCD_OK);
        for (i = 0; i < n * ND; i++)
            p->ref[i * KC + k] = F[i];
    }
}

static void prob_free(prob *p)
{
    free(p->D);
    free(p->c);
    free(p->x);
    free(p->g);
    free(p->ref);
    free(p->out);
}

/* Largest per-cell error relative to the cell's largest exact flux. */
static double prob_err(const prob *p)
{
    double worst = 0.0;
    for (size_t k = 0; k < KC; k++) {
        double sc = 0.0, e = 0.0;
        for (size_t i = 0; i < p->n * ND; i++) {
            double a = p->out[i * KC + k], b = p->ref[i * KC + k];
            if (fabs(b) > sc)
                sc = fabs(b);
            if (fabs(a - b) > e)
                e = fabs(a - b);
        }
        if (e / sc > worst)
            worst = e / sc;
    }
    return worst;
}

static mcd_status run_iter(mcd_workspace *ws, prob *p)
{
    return mcd_flux_batch_dij(ws, MCD_MODEL_ITERATIVE, p->n, NULL, p->D, p->c,
                              &(mcd_cells){.n_cells = KC,
                                           .n_dim = ND,
                                           .comp_basis = MCD_BASIS_MOLE,
                                           .comp = p->x,
                                           .grad = p->g},
                              MCD_BASIS_MOLE, p->out);
}

START_TEST(iterative_converges_to_the_exact_solution)
{
    static const size_t Ns[] = {2, 3, 5, 10, 20, 50, 100};
    mcd_workspace *ws;
    sup_seed(&rng, 0x17E4A7001ull);
    ck_assert_int_eq(mcd_workspace_new(100, &ws), MCD_OK);
    for (size_t t = 0; t < sizeof Ns / sizeof Ns[0]; t++) {
        prob p;
        double e, est;
        size_t used;
        prob_make(&p, Ns[t], ws, MCD_MODEL_MAXWELL_STEFAN);
        ck_assert_int_eq(mcd_workspace_set_iterative(ws, 500, 1e-14), MCD_OK);
        ck_assert_int_eq(run_iter(ws, &p), MCD_OK);
        ck_assert_int_eq(mcd_workspace_iterative_outcome(ws, &est, &used),
                         MCD_OK);
        e = prob_err(&p);
        fprintf(stderr,
                "N=%3zu tol 1e-14: error %.2e, estimate %.2e, %zu iterations\n",
                Ns[t], e, est, used);
        /* 1e-12: the iteration converges to the exact solution; at tol
         * 1e-14 only round-off (~1e-15 x the modest condition number of
         * these states) remains */
        ck_assert_msg(e <= 1e-12, "N=%zu error %.3g", Ns[t], e);
        ck_assert_uint_le(used, 500);
        /* iterates that stall at round-off (N = 2, 3 here: rho ~ 1) still
         * get a finite estimate that bounds the error (was HUGE_VAL) */
        ck_assert_msg(est < 1e-10 && e <= est,
                      "N=%zu estimate %.3g, error %.3g", Ns[t], est, e);
        prob_free(&p);
    }
    mcd_workspace_free(ws);
}
END_TEST

/* A binary's first iterate is already exact (the mixture-averaged flux
 * with the correction velocity is exact for N = 2): the iteration stops as
 * soon as the change is seen to be round-off, with a small estimate. */
START_TEST(iterative_binary_stops_at_once)
{
    mcd_workspace *ws;
    sup_seed(&rng, 0x17E4A7004ull);
    ck_assert_int_eq(mcd_workspace_new(2, &ws), MCD_OK);
    for (int trial = 0; trial < 50; trial++) {
        prob p;
        double est;
        size_t used;
        prob_make(&p, 2, ws, MCD_MODEL_MAXWELL_STEFAN);
        ck_assert_int_eq(mcd_workspace_set_iterative(ws, 100, 1e-10), MCD_OK);
        ck_assert_int_eq(run_iter(ws, &p), MCD_OK);
        ck_assert_int_eq(mcd_workspace_iterative_outcome(ws, &est, &used),
                         MCD_OK);
        ck_assert_msg(used <= 3, "trial %d: %zu iterations", trial, used);
        ck_assert_msg(est <= 1e-10 && prob_err(&p) <= est,
                      "trial %d: estimate %.3g, error %.3g", trial, est,
                      prob_err(&p));
        prob_free(&p);
    }
    mcd_workspace_free(ws);
}
END_TEST

START_TEST(iterative_error_estimate_is_honest)
{
    static const double tols[] = {1e-2, 1e-4, 1e-6, 1e-8, 1e-10};
    static const size_t Ns[] = {3, 10, 30, 100};
    mcd_workspace *ws;
    double worst_ratio = 0.0;
    sup_seed(&rng, 0x17E4A7002ull);
    ck_assert_int_eq(mcd_workspace_new(100, &ws), MCD_OK);
    for (size_t t = 0; t < sizeof Ns / sizeof Ns[0]; t++) {
        prob p;
        prob_make(&p, Ns[t], ws, MCD_MODEL_MAXWELL_STEFAN);
        for (size_t q = 0; q < sizeof tols / sizeof tols[0]; q++) {
            double e, est;
            size_t used;
            ck_assert_int_eq(mcd_workspace_set_iterative(ws, 1000, tols[q]),
                             MCD_OK);
            ck_assert_int_eq(run_iter(ws, &p), MCD_OK);
            ck_assert_int_eq(mcd_workspace_iterative_outcome(ws, &est, &used),
                             MCD_OK);
            e = prob_err(&p);
            if (e / est > worst_ratio)
                worst_ratio = e / est;
            fprintf(
                stderr,
                "N=%3zu tol %.0e: error %.2e, estimate %.2e, %zu iterations\n",
                Ns[t], tols[q], e, est, used);
            /* honest: the estimate bounds the true error (no slack), and
             * the tolerance is met */
            ck_assert_msg(e <= est, "N=%zu tol %g: error %.3g > estimate %.3g",
                          Ns[t], tols[q], e, est);
            ck_assert_msg(est <= tols[q], "estimate %.3g above tol %g", est,
                          tols[q]);
        }
        prob_free(&p);
    }
    fprintf(stderr, "largest error / estimate: %.3g\n", worst_ratio);
    mcd_workspace_free(ws);
}
END_TEST

START_TEST(iterative_first_iterate_is_mixture_averaged_and_counts_iterations)
{
    mcd_workspace *ws;
    prob p;
    double e1, e2, est;
    size_t used;
    sup_seed(&rng, 0x17E4A7003ull);
    ck_assert_int_eq(mcd_workspace_new(12, &ws), MCD_OK);
    /* reference = mixture-averaged model: the starting point U^0; one
     * iteration moves away from it towards the exact solution */
    prob_make(&p, 12, ws, MCD_MODEL_MIXTURE_AVERAGED);
    ck_assert_int_eq(mcd_workspace_set_iterative(ws, 1, 0.0), MCD_OK);
    ck_assert_int_eq(run_iter(ws, &p), MCD_OK);
    ck_assert_int_eq(mcd_workspace_iterative_outcome(ws, &est, &used), MCD_OK);
    ck_assert_uint_eq(used, 1);
    /* after one iteration no contraction is known: infinite estimate */
    ck_assert(est > 1e300);
    e1 = prob_err(&p);
    ck_assert_int_eq(mcd_workspace_set_iterative(ws, 7, 0.0), MCD_OK);
    ck_assert_int_eq(run_iter(ws, &p), MCD_OK);
    ck_assert_int_eq(mcd_workspace_iterative_outcome(ws, NULL, &used), MCD_OK);
    ck_assert_uint_eq(used, 7); /* tol 0: exactly max_iter */
    e2 = prob_err(&p);
    /* distance from the mixture-averaged start grows as the iterates
     * approach the (different) exact solution, and is non-zero */
    ck_assert(e1 > 0.0);
    ck_assert(e2 > e1 * 0.5);
    prob_free(&p);
    mcd_workspace_free(ws);
}
END_TEST

/* mcd_flux_compute with MCD_MODEL_ITERATIVE is the batched iteration on a
 * batch of one cell: mcd_flux_batch_dij with K = 1 to round-off (the single
 * state hands over its projected forces, projected once more there); with a thermodynamic factor, mass fractions or
 * trace species it agrees with the exact model to the reported error
 * estimate; the workspace's outcome is that call's. */
START_TEST(iterative_single_state_is_a_batch_of_one)
{
    enum { NMAX = 12 };
    mcd_workspace *ws = NULL;
    double D[NMAX * NMAX], x[NMAX], M[NMAX], g[NMAX * 3], G[NMAX * NMAX];
    double Ji[NMAX * 3], Jb[NMAX * 3], Jx[NMAX * 3], c = 40.0;
    ck_assert_int_eq(mcd_workspace_new(NMAX, &ws), MCD_OK);
    ck_assert_int_eq(mcd_workspace_set_iterative(ws, 1000, 1e-13), MCD_OK);
    sup_seed(&rng, 77);
    for (int trial = 0; trial < 300; trial++) {
        size_t n = 2 + (size_t)(sup_u01(&rng) * (NMAX - 1)), nd = 1 + trial % 3;
        int kind = trial % 4; /* 0 ideal mole, 1 Gamma, 2 mass, 3 trace */
        double err = -1.0, scale;
        size_t its = 0;
        sup_dij_decades(&rng, n, D, -6.0, -4.0);
        sup_fractions(&rng, n, 0.05, x);
        if (kind == 3) { /* a trace species */
            double rest = 1.0 - x[n - 1];
            x[n - 1] = 0.0;
            for (size_t i = 0; i + 1 < n; i++)
                x[i] /= rest;
        }
        for (size_t i = 0; i < n; i++)
            M[i] = sup_molar_mass(&rng);
        sup_gradients_zero_mean(&rng, n, nd, -50.0, 50.0, g);
        for (size_t i = 0; i < n; i++)
            for (size_t j = 0; j < n; j++)
                G[i * n + j] = (i == j) + 0.05 * sup_range(&rng, -1.0, 1.0);
        mcd_state st = {.n_species = n,
                        .n_dim = nd,
                        .c = c,
                        .M = M,
                        .Dij = D,
                        .comp = x,
                        .grad = g};
        if (kind == 1)
            st.Gamma = G;
        if (kind == 2)
            st.comp_basis = MCD_BASIS_MASS;
        {
            mcd_status r = mcd_flux_compute(ws, MCD_MODEL_ITERATIVE, &st,
                                            MCD_BASIS_MOLE, Ji);
            ck_assert_msg(r == MCD_OK, "trial %d kind %d n %zu: %d %s", trial,
                          kind, n, r, mcd_last_error());
        }
        ck_assert_int_eq(mcd_workspace_iterative_outcome(ws, &err, &its),
                         MCD_OK);
        ck_assert(err >= 0.0 && err <= 1e-12 && its >= 1);
        ck_assert_int_eq(mcd_flux_compute(ws, MCD_MODEL_MAXWELL_STEFAN, &st,
                                          MCD_BASIS_MOLE, Jx),
                         MCD_OK);
        scale = sup_max_abs(Jx, n * nd);
        for (size_t k = 0; k < n * nd; k++)
            ck_assert_msg(fabs(Ji[k] - Jx[k]) <= 1e-10 * scale,
                          "trial %d kind %d n %zu: %g vs %g", trial, kind, n,
                          Ji[k], Jx[k]);
        if (kind == 0) {
            mcd_cells one = {.n_cells = 1, .n_dim = nd, .comp = x, .grad = g};
            ck_assert_int_eq(mcd_flux_batch_dij(ws, MCD_MODEL_ITERATIVE, n,
                                                NULL, D, &c, &one,
                                                MCD_BASIS_MOLE, Jb),
                             MCD_OK);
            for (size_t k = 0; k < n * nd; k++)
                ck_assert_msg(fabs(Ji[k] - Jb[k]) <= 1e-13 * scale,
                              "trial %d: entry %zu %g vs %g", trial, k, Ji[k],
                              Jb[k]);
        }
    }
    mcd_workspace_free(ws);
}
END_TEST

int main(void)
{
    Suite *s = suite_create("mcd:iterative");
    TCase *tc = tcase_create("iterative");
    tcase_set_timeout(tc, 300);
    tcase_add_test(tc, iterative_converges_to_the_exact_solution);
    tcase_add_test(tc, iterative_binary_stops_at_once);
    tcase_add_test(tc, iterative_error_estimate_is_honest);
    tcase_add_test(
        tc, iterative_first_iterate_is_mixture_averaged_and_counts_iterations);
    tcase_add_test(tc, iterative_single_state_is_a_batch_of_one);
    suite_add_tcase(s, tc);
    return sup_run(s);
}
