/* test_threads.c - concurrent use of shared read-only objects
 * (identities only: threaded results must equal serial ones bit for bit).
 *
 * The header promises: a database or mixture that is no longer modified may
 * be shared read-only by any number of threads; a workspace belongs to one
 * thread at a time. Here NTHREADS threads share one database and one
 * mixture, each owns its workspace, and every thread computes the same
 * NSTATES states (binaries from the mixture, Maxwell-Stefan and
 * mixture-averaged fluxes, the Fick matrix and a film solve). Every result
 * must be bitwise identical to the serial run (a shared liquid too): the
 * library keeps no hidden shared mutable state, so there is nothing that
 * could differ. Run under ThreadSanitizer by .ci/robustness.sh.
 */
#include <check.h>
#include <math.h>
#include <pthread.h>
#include <stdint.h>
#include <stdlib.h>
#include <stdio.h>
#include <string.h>

#include "mcdiff.h"
#include "support.h"

#define NS 5
#define ND 3
#define NSTATES 64
#define NTHREADS 4
/* Values per state: Dij, MS flux, MA flux, mass-basis MS flux, Fick matrix,
 * film fluxes. */
#define PER_STATE (NS * NS + 3 * NS * ND + (NS - 1) * (NS - 1) + NS)

static const char *const names[NS] = {"nitrogen", "oxygen", "carbon-dioxide",
                                      "water", "argon"};
static mcd_db *g_db;
static mcd_mixture *g_mix;
static double g_M[NS];
static double g_serial[NSTATES][PER_STATE];

/* Deterministic state k from a local xorshift generator (fixed seed). */
typedef struct state {
    double T, P, c, x[NS], xL[NS], grad[NS * ND];
} state;

static void make_state(int k, state *st)
{
    sup_rng s =
        SUP_RNG(SUP_XORSHIFT64, 0x9E3779B97F4A7C15ull ^
                                    (uint64_t)(k + 1) * 0xD1B54A32D192ED03ull);
    double sum = 0.0, sumL = 0.0;
    for (int r = 0; r < 4; r++)
        sup_next(&s);
    st->T = 250.0 + 500.0 * sup_u01(&s);
    st->P = 5e4 + 3e5 * sup_u01(&s);
    st->c = st->P / (MCD_GAS_CONSTANT * st->T);
    for (int i = 0; i < NS; i++) {
        st->x[i] = 0.05 + sup_u01(&s);
        st->xL[i] = 0.05 + sup_u01(&s);
        sum += st->x[i];
        sumL += st->xL[i];
    }
    for (int i = 0; i < NS; i++) {
        st->x[i] /= sum;
        st->xL[i] /= sumL;
    }
    for (int d = 0; d < ND; d++) {
        double g = 0.0;
        for (int i = 0; i < NS - 1; i++) {
            st->grad[i * ND + d] = 20.0 * (sup_u01(&s) - 0.5);
            g += st->grad[i * ND + d];
        }
        st->grad[(NS - 1) * ND + d] = -g;
    }
}

/* Everything one state produces, written into out[PER_STATE]. Returns the
 * first non-OK status. */
static mcd_status compute_state(mcd_workspace *ws, int k, double *out)
{
    state st;
    mcd_status r;
    double *D = out, *Jms = D + NS * NS, *Jma = Jms + NS * ND;
    double *jms = Jma + NS * ND, *F = jms + NS * ND,
           *Nf = F + (NS - 1) * (NS - 1);
    make_state(k, &st);
    if ((r = mcd_mixture_binaries(g_mix, st.T, st.P, D, NULL, NULL)) != MCD_OK)
        return r;
    if ((r = mcd_flux_compute(ws, MCD_MODEL_MAXWELL_STEFAN,
                              &(mcd_state){.n_species = NS,
                                           .n_dim = ND,
                                           .M = g_M,
                                           .Dij = D,
                                           .c = st.c,
                                           .comp_basis = MCD_BASIS_MOLE,
                                           .comp = st.x,
                                           .grad = st.grad},
                              MCD_BASIS_MOLE, Jms)) != MCD_OK)
        return r;
    if ((r = mcd_flux_compute(ws, MCD_MODEL_MIXTURE_AVERAGED,
                              &(mcd_state){.n_species = NS,
                                           .n_dim = ND,
                                           .M = g_M,
                                           .Dij = D,
                                           .c = st.c,
                                           .comp_basis = MCD_BASIS_MOLE,
                                           .comp = st.x,
                                           .grad = st.grad},
                              MCD_BASIS_MOLE, Jma)) != MCD_OK)
        return r;
    if ((r = mcd_flux_compute(ws, MCD_MODEL_MAXWELL_STEFAN,
                              &(mcd_state){.n_species = NS,
                                           .n_dim = ND,
                                           .M = g_M,
                                           .Dij = D,
                                           .c = st.c,
                                           .comp_basis = MCD_BASIS_MOLE,
                                           .comp = st.x,
                                           .grad = st.grad},
                              MCD_BASIS_MASS, jms)) != MCD_OK)
        return r;
    if ((r = mcd_fick_matrix(ws,
                             &(mcd_state){.n_species = NS,
                                          .M = g_M,
                                          .Dij = D,
                                          .comp_basis = MCD_BASIS_MOLE,
                                          .comp = st.x},
                             MCD_BASIS_MOLE, 0, F, NULL)) != MCD_OK)
        return r;
    /* Film: equimolar counter-diffusion between x and xL over 1 mm. */
    return mcd_film_solve(ws,
                          &(mcd_film){.n_species = NS,
                                      .c = st.c,
                                      .L = 1e-3,
                                      .Dij = D,
                                      .x0 = st.x,
                                      .xL = st.xL},
                          MCD_FILM_BOOT_EQUIMOLAR, 0, NULL, MCD_FILM_EXACT, Nf,
                          NULL, NULL);
}

typedef struct job {
    int id;
    int mismatches; /* states whose result differs from serial */
    int failures;   /* calls that did not return MCD_OK */
    double out[PER_STATE];
} job;

static void *worker(void *arg)
{
    job *jb = arg;
    mcd_workspace *ws = NULL;
    if (mcd_workspace_new(NS, &ws) != MCD_OK) {
        jb->failures = NSTATES;
        return NULL;
    }
    /* Each thread walks the states from a different starting point so that
     * the threads are in different parts of the computation at once. */
    for (int r = 0; r < NSTATES; r++) {
        int k = (r + jb->id * (NSTATES / NTHREADS)) % NSTATES;
        if (compute_state(ws, k, jb->out) != MCD_OK)
            jb->failures++;
        else if (memcmp(jb->out, g_serial[k], sizeof jb->out) != 0)
            jb->mismatches++;
    }
    mcd_workspace_free(ws);
    return NULL;
}

static void setup(void)
{
    ck_assert_int_eq(mcd_db_new_builtin(&g_db), MCD_OK);
    ck_assert_int_eq(mcd_mixture_new(g_db, NS, names, MCD_GAS_FSG, &g_mix),
                     MCD_OK);
    /* Two pairs by other methods so that every code path of binaries runs. */
    ck_assert_int_eq(
        mcd_mixture_set_method(g_mix, 0, 1, MCD_GAS_CHAPMAN_ENSKOG), MCD_OK);
    ck_assert_int_eq(
        mcd_mixture_set_binary(g_mix, 2, 3, 1.6e-5, 298.15, MCD_ATM), MCD_OK);
    ck_assert_int_eq(mcd_mixture_molar_masses(g_mix, g_M), MCD_OK);
}

static void teardown(void)
{
    mcd_mixture_free(g_mix);
    mcd_db_free(g_db);
    g_mix = NULL;
    g_db = NULL;
}

START_TEST(threads_results_bitwise_equal_serial)
{
    mcd_workspace *ws = NULL;
    pthread_t th[NTHREADS];
    job jobs[NTHREADS];
    ck_assert_int_eq(mcd_workspace_new(NS, &ws), MCD_OK);
    for (int k = 0; k < NSTATES; k++) {
        ck_assert_int_eq(compute_state(ws, k, g_serial[k]), MCD_OK);
        for (int q = 0; q < PER_STATE; q++)
            ck_assert(isfinite(g_serial[k][q]));
    }
    mcd_workspace_free(ws);

    memset(jobs, 0, sizeof jobs);
    for (int t = 0; t < NTHREADS; t++) {
        jobs[t].id = t;
        ck_assert_int_eq(pthread_create(&th[t], NULL, worker, &jobs[t]), 0);
    }
    for (int t = 0; t < NTHREADS; t++)
        ck_assert_int_eq(pthread_join(th[t], NULL), 0);
    for (int t = 0; t < NTHREADS; t++) {
        ck_assert_msg(jobs[t].failures == 0, "thread %d: %d failed calls", t,
                      jobs[t].failures);
        ck_assert_msg(jobs[t].mismatches == 0,
                      "thread %d: %d states differ from serial", t,
                      jobs[t].mismatches);
    }
}
END_TEST

/* Read-only database queries from many threads at once. */
typedef struct dbjob {
    int bad;
} dbjob;

static void *db_worker(void *arg)
{
    dbjob *j = arg;
    for (int r = 0; r < 200; r++) {
        size_t idx;
        double D, M;
        unsigned warn;
        if (mcd_db_find(g_db, names[r % NS], &idx) != MCD_OK)
            j->bad++;
        else if (mcd_db_param(g_db, idx, MCD_PARAM_MOLAR_MASS, &M) != MCD_OK ||
                 M != g_M[r % NS])
            j->bad++;
        size_t a, b;
        if (mcd_db_find(g_db, "nitrogen", &a) != MCD_OK ||
            mcd_db_find(g_db, "helium", &b) != MCD_OK ||
            mcd_db_binary_gas(g_db, a, b, MCD_GAS_CHAPMAN_ENSKOG, 300.0 + r,
                              MCD_ATM, &D, NULL, &warn) != MCD_OK ||
            !(D > 0))
            j->bad++;
        double Mf;
        if (mcd_formula_molar_mass("CH3(CH2)4CH3", &Mf) != MCD_OK)
            j->bad++;
    }
    return NULL;
}

START_TEST(threads_shared_database_queries)
{
    pthread_t th[NTHREADS];
    dbjob jobs[NTHREADS];
    memset(jobs, 0, sizeof jobs);
    for (int t = 0; t < NTHREADS; t++)
        ck_assert_int_eq(pthread_create(&th[t], NULL, db_worker, &jobs[t]), 0);
    for (int t = 0; t < NTHREADS; t++)
        ck_assert_int_eq(pthread_join(th[t], NULL), 0);
    for (int t = 0; t < NTHREADS; t++)
        ck_assert_int_eq(jobs[t].bad, 0);
}
END_TEST

/* Each thread fails with its own unknown element symbol, many times, and
 * must always read its own detail back: mcd_last_error is per thread. */
typedef struct {
    int id, bad;
} errjob;

static void *err_worker(void *arg)
{
    errjob *j = (errjob *)arg;
    char formula[8], want[32];
    snprintf(formula, sizeof formula, "X%c2", 'a' + j->id);
    snprintf(want, sizeof want, "'X%c'", 'a' + j->id);
    for (int r = 0; r < 2000; r++) {
        double M;
        if (mcd_formula_molar_mass(formula, &M) != MCD_ENOTFOUND ||
            strstr(mcd_last_error(), want) == NULL)
            j->bad++;
        if (mcd_formula_molar_mass("H2O", &M) != MCD_OK ||
            mcd_last_error()[0] != '\0')
            j->bad++;
    }
    return NULL;
}

START_TEST(threads_error_detail_is_per_thread)
{
    pthread_t th[NTHREADS];
    errjob jobs[NTHREADS];
    memset(jobs, 0, sizeof jobs);
    for (int t = 0; t < NTHREADS; t++) {
        jobs[t].id = t;
        ck_assert_int_eq(pthread_create(&th[t], NULL, err_worker, &jobs[t]), 0);
    }
    for (int t = 0; t < NTHREADS; t++)
        ck_assert_int_eq(pthread_join(th[t], NULL), 0);
    for (int t = 0; t < NTHREADS; t++)
        ck_assert_int_eq(jobs[t].bad, 0);
}
END_TEST

/* A liquid shared read-only by every thread (the header: it may be, one
 * workspace each): each thread evaluates ln gamma, Gamma and Dij at the
 * same compositions, which must equal the serial results bit for bit. */
#define LQ_N 4
#define LQ_STATES 32
static mcd_liquid *g_liq;
static double g_lq_ref[LQ_STATES][LQ_N + 2 * LQ_N * LQ_N];

static int liquid_state(mcd_workspace *ws, int k, double *out)
{
    double x[LQ_N] = {0.1 + 0.01 * k, 0.2, 0.3, 0.4 - 0.01 * k};
    return mcd_liquid_eval(ws, g_liq, 300.0 + k, x, out, out + LQ_N,
                           out + LQ_N + LQ_N * LQ_N, NULL);
}

static void *liquid_worker(void *arg)
{
    int *bad = (int *)arg;
    mcd_workspace *ws = NULL;
    double out[LQ_N + 2 * LQ_N * LQ_N];
    if (mcd_workspace_new(LQ_N, &ws) != MCD_OK) {
        (*bad)++;
        return NULL;
    }
    for (int r = 0; r < 50; r++)
        for (int k = 0; k < LQ_STATES; k++)
            if (liquid_state(ws, k, out) != MCD_OK ||
                memcmp(out, g_lq_ref[k], sizeof out) != 0)
                (*bad)++;
    mcd_workspace_free(ws);
    return NULL;
}

START_TEST(threads_shared_liquid_equals_serial)
{
    const double c[3] = {0.1, 80.0, 0.0};
    pthread_t th[NTHREADS];
    int bad[NTHREADS] = {0};
    mcd_workspace *ws = NULL;
    ck_assert_int_eq(mcd_liquid_new(LQ_N, MCD_ACTIVITY_NRTL, &g_liq), MCD_OK);
    for (size_t i = 0; i < LQ_N; i++)
        for (size_t j = i + 1; j < LQ_N; j++) {
            ck_assert_int_eq(mcd_liquid_set_pair(g_liq, i, j, c, c, 0.3, 0, 0),
                             MCD_OK);
            ck_assert_int_eq(mcd_liquid_set_dinf(g_liq, i, j, 1e-9 * (1 + i),
                                                 1e-9 * (1 + j)),
                             MCD_OK);
        }
    ck_assert_int_eq(mcd_workspace_new(LQ_N, &ws), MCD_OK);
    for (int k = 0; k < LQ_STATES; k++)
        ck_assert_int_eq(liquid_state(ws, k, g_lq_ref[k]), MCD_OK);
    mcd_workspace_free(ws);
    for (int t = 0; t < NTHREADS; t++)
        ck_assert_int_eq(pthread_create(&th[t], NULL, liquid_worker, &bad[t]),
                         0);
    for (int t = 0; t < NTHREADS; t++)
        ck_assert_int_eq(pthread_join(th[t], NULL), 0);
    for (int t = 0; t < NTHREADS; t++)
        ck_assert_int_eq(bad[t], 0);
    mcd_liquid_free(g_liq);
}
END_TEST

int main(void)
{
    Suite *s = suite_create("mcd:threads");
    TCase *tc = tcase_create("shared");
    tcase_add_checked_fixture(tc, setup, teardown);
    tcase_set_timeout(tc, 240);
    tcase_add_test(tc, threads_results_bitwise_equal_serial);
    tcase_add_test(tc, threads_shared_database_queries);
    tcase_add_test(tc, threads_error_detail_is_per_thread);
    tcase_add_test(tc, threads_shared_liquid_equals_serial);
    suite_add_tcase(s, tc);
    return sup_run(s);
}
