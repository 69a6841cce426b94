/* test_thermal.c - thermal diffusion: the driving force k_T,i grad ln T in
 * every flux path (single state, batched SoA and AoS, all three models,
 * both bases), and mcd_thermal_ratios.
 *
 * Outside relations checked:
 *  - the binary law J_1 = -c D_12 (grad x_1 + k_T grad ln T) with
 *    k_T = k_T,1 = -k_T,2 (Chapman and Cowling 1970, ch. 8; Bird, Stewart
 *    and Lightfoot 2002, sec. 24.2; from memory);
 *  - for two species k_T = rho D_1^T / (c^2 M_1 M_2 D_12) (Bird, Stewart
 *    and Lightfoot 2002, sec. 24.2; from memory);
 *  - the mass-flux form j_i = j_i(no thermal term) - D_i^T grad ln T of
 *    the Maxwell-Stefan equations with thermal diffusion (Hirschfelder,
 *    Curtiss and Bird 1954, sec. 7.4; derived in lib/flux/thermal.c),
 *    over random states with trace species.
 */
#include <check.h>
#include <math.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

#include "mcdiff.h"
#include "support.h"

#define NMAX 16
#define NDIM 3

static sup_rng rng = SUP_RNG(SUP_SPLITMIX64, 0x7E4D1FFull);

/* A random state: fractions (some exactly 0 when trace), M, Dij over two
 * decades, gradients with zero mean, k_T summing to zero, grad ln T. */
typedef struct tstate {
    size_t n;
    double x[NMAX], M[NMAX], D[NMAX * NMAX], g[NMAX * NDIM];
    double kT[NMAX], glnT[NDIM], c;
} tstate;

static void draw(tstate *s, size_t n, int trace)
{
    size_t i, d;
    double m = 0.0;
    s->n = n;
    sup_fractions(&rng, n, 0.02, s->x);
    if (trace && n > 2) {
        double sum = 0.0;
        s->x[n / 2] = 0.0; /* one trace species */
        for (i = 0; i < n; i++)
            sum += s->x[i];
        for (i = 0; i < n; i++)
            s->x[i] /= sum;
    }
    for (i = 0; i < n; i++)
        s->M[i] = sup_molar_mass(&rng);
    sup_dij_decades(&rng, n, s->D, -6.0, -4.0);
    sup_gradients_zero_mean(&rng, n, NDIM, -50.0, 50.0, s->g);
    for (i = 0; i < n; i++) {
        s->kT[i] = sup_range(&rng, -0.3, 0.3);
        m += s->kT[i];
    }
    for (i = 0; i < n; i++)
        s->kT[i] -= m / (double)n;
    for (d = 0; d < NDIM; d++)
        s->glnT[d] = sup_range(&rng, -200.0, 200.0);
    s->c = sup_range(&rng, 5.0, 80.0);
}

static mcd_state state_of(const tstate *s, int thermal)
{
    mcd_state st = {0};
    st.n_species = s->n;
    st.n_dim = NDIM;
    st.comp_basis = MCD_BASIS_MOLE;
    st.c = s->c;
    st.M = s->M;
    st.Dij = s->D;
    st.comp = s->x;
    st.grad = s->g;
    if (thermal) {
        st.kT = s->kT;
        st.grad_lnT = s->glnT;
    }
    return st;
}

static mcd_workspace *ws_new(void)
{
    mcd_workspace *ws;
    ck_assert_int_eq(mcd_workspace_new(NMAX, &ws), MCD_OK);
    return ws;
}

START_TEST(thermal_binary_law_every_model)
{
    /* J_1 = -c D_12 (grad x_1 + k_T grad ln T), J_2 = -J_1 */
    const double x[2] = {0.3, 0.7}, D[4] = {0, 4e-5, 4e-5, 0}, c = 40.0;
    const double g[4] = {10.0, -3.0, -10.0, 3.0};
    const double kT[2] = {0.05, -0.05}, glnT[2] = {2.0, -1.0};
    mcd_workspace *ws = ws_new();
    mcd_state st = {0};
    int model;
    st.n_species = 2;
    st.n_dim = 2;
    st.comp_basis = MCD_BASIS_MOLE;
    st.c = c;
    st.Dij = D;
    st.comp = x;
    st.grad = g;
    st.kT = kT;
    st.grad_lnT = glnT;
    for (model = 0; model < 3; model++) {
        double J[4];
        size_t d;
        ck_assert_int_eq(
            mcd_flux_compute(ws, (mcd_model)model, &st, MCD_BASIS_MOLE, J),
            MCD_OK);
        for (d = 0; d < 2; d++) {
            double want = -c * 4e-5 * (g[d] + 0.05 * glnT[d]);
            ck_assert_msg(sup_rel(J[d], want) < 1e-13, "model %d: %g vs %g",
                          model, J[d], want);
            ck_assert(fabs(J[d] + J[2 + d]) <= 1e-15 * fabs(want));
        }
    }
    mcd_workspace_free(ws);
}
END_TEST

START_TEST(thermal_positive_kT_sends_species_to_the_cold_side)
{
    /* no composition gradient: the flux of species 1 (k_T > 0) points
     * down the temperature gradient (common practice: the sign
     * convention of k_T). */
    const double x[2] = {0.5, 0.5}, D[4] = {0, 7e-5, 7e-5, 0};
    const double g[3] = {0, 0, 0}, kT[2] = {0.02, -0.02}, glnT[1] = {30.0};
    mcd_workspace *ws = ws_new();
    mcd_state st = {0};
    double J[2];
    st.n_species = 2;
    st.n_dim = 1;
    st.c = 40.0;
    st.Dij = D;
    st.comp = x;
    st.grad = g;
    st.kT = kT;
    st.grad_lnT = glnT;
    ck_assert_int_eq(
        mcd_flux_compute(ws, MCD_MODEL_MAXWELL_STEFAN, &st, MCD_BASIS_MOLE, J),
        MCD_OK);
    ck_assert(J[0] < 0.0 && J[1] > 0.0);
    mcd_workspace_free(ws);
}
END_TEST

START_TEST(thermal_ratios_binary_closed_form)
{
    /* k_T = rho D_1^T / (c^2 M_1 M_2 D_12), both composition bases */
    const double M[2] = {0.004, 0.040}, D[4] = {0, 7.3e-5, 7.3e-5, 0};
    const double x[2] = {0.4, 0.6}, c = 41.6, DT[2] = {3e-6, -3e-6};
    mcd_workspace *ws = ws_new();
    mcd_state st = {0};
    double w[2], kT[2], rho, want;
    int basis;
    ck_assert_int_eq(mcd_comp_x_to_w(2, M, x, w), MCD_OK);
    rho = c * (x[0] * M[0] + x[1] * M[1]);
    want = rho * DT[0] / (c * c * M[0] * M[1] * 7.3e-5);
    st.n_species = 2;
    st.c = c;
    st.M = M;
    st.Dij = D;
    for (basis = 0; basis < 2; basis++) {
        st.comp_basis = (mcd_basis)basis;
        st.comp = basis == MCD_BASIS_MOLE ? x : w;
        ck_assert_int_eq(mcd_thermal_ratios(ws, &st, DT, kT), MCD_OK);
        ck_assert_msg(sup_rel(kT[0], want) < 1e-13, "%g vs %g", kT[0], want);
        ck_assert(fabs(kT[0] + kT[1]) <= 1e-15 * want);
    }
    mcd_workspace_free(ws);
}
END_TEST

START_TEST(thermal_ratios_give_the_mass_flux_form)
{
    /* j_i(kT from D^T) = j_i(no thermal term) - D^T_i grad ln T with the
     * projected D^T_i = D^T_i - w_i sum_k D^T_k, over random states */
    mcd_workspace *ws = ws_new();
    int rep;
    for (rep = 0; rep < 400; rep++) {
        size_t n = 2 + (size_t)(rep % 11), i, d;
        tstate s;
        double DT[NMAX], DTp[NMAX], w[NMAX], kT[NMAX], sum = 0.0;
        double j0[NMAX * NDIM], j1[NMAX * NDIM], want[NMAX * NDIM];
        mcd_state st;
        draw(&s, n, rep % 3 == 0);
        for (i = 0; i < n; i++) {
            DT[i] = sup_range(&rng, -1e-5, 1e-5);
            sum += DT[i];
        }
        ck_assert_int_eq(mcd_comp_x_to_w(n, s.M, s.x, w), MCD_OK);
        for (i = 0; i < n; i++)
            DTp[i] = DT[i] - w[i] * sum;
        st = state_of(&s, 0);
        ck_assert_int_eq(mcd_thermal_ratios(ws, &st, DT, kT), MCD_OK);
        ck_assert_int_eq(mcd_flux_compute(ws, MCD_MODEL_MAXWELL_STEFAN, &st,
                                          MCD_BASIS_MASS, j0),
                         MCD_OK);
        st.kT = kT;
        st.grad_lnT = s.glnT;
        ck_assert_int_eq(mcd_flux_compute(ws, MCD_MODEL_MAXWELL_STEFAN, &st,
                                          MCD_BASIS_MASS, j1),
                         MCD_OK);
        for (i = 0; i < n; i++)
            for (d = 0; d < NDIM; d++)
                want[i * NDIM + d] = j0[i * NDIM + d] - DTp[i] * s.glnT[d];
        /* Dij over two decades and molar masses over two: the solve's
         * normwise error is ~1e-14 (tests/test_edge_cases.c); 1e-10
         * leaves room for the conditioning of random states. */
        ck_assert_msg(sup_rel_diff(j1, want, n * NDIM) < 1e-10,
                      "rep %d, n %zu: %g", rep, n,
                      sup_rel_diff(j1, want, n * NDIM));
    }
    mcd_workspace_free(ws);
}
END_TEST

START_TEST(thermal_fluxes_sum_to_zero_in_every_model_and_basis)
{
    mcd_workspace *ws = ws_new();
    int rep;
    for (rep = 0; rep < 300; rep++) {
        size_t n = 2 + (size_t)(rep % 14), i, d;
        int model = rep % 3, fb = (rep / 3) % 2;
        tstate s;
        double F[NMAX * NDIM];
        mcd_state st;
        draw(&s, n, rep % 4 == 1);
        st = state_of(&s, 1);
        ck_assert_int_eq(
            mcd_flux_compute(ws, (mcd_model)model, &st, (mcd_basis)fb, F),
            MCD_OK);
        for (d = 0; d < NDIM; d++) {
            double sum = 0.0, a = 0.0;
            for (i = 0; i < n; i++) {
                sum += F[i * NDIM + d];
                a += fabs(F[i * NDIM + d]);
            }
            /* zero-sum to round-off of the terms: N eps */
            ck_assert_msg(fabs(sum) <= 64 * 2.3e-16 * a, "rep %d: %g of %g",
                          rep, sum, a);
        }
    }
    mcd_workspace_free(ws);
}
END_TEST

/* K random cells of n species in SoA layout (comp[i*K + k]). */
typedef struct soa {
    size_t n, K;
    double *comp, *grad, *Dij, *c, *kT, *glnT;
} soa;

static void soa_make(soa *b, size_t n, size_t K, tstate *cells, int trace)
{
    size_t k, i, j, d;
    b->n = n;
    b->K = K;
    b->comp = malloc(n * K * sizeof(double));
    b->grad = malloc(n * NDIM * K * sizeof(double));
    b->Dij = malloc(n * n * K * sizeof(double));
    b->c = malloc(K * sizeof(double));
    b->kT = malloc(n * K * sizeof(double));
    b->glnT = malloc(NDIM * K * sizeof(double));
    ck_assert(b->comp && b->grad && b->Dij && b->c && b->kT && b->glnT);
    for (k = 0; k < K; k++) {
        tstate *s = &cells[k];
        draw(s, n, trace && k % 2 == 0);
        if (k > 0) /* one M for all cells */
            memcpy(s->M, cells[0].M, sizeof s->M);
        b->c[k] = s->c;
        for (i = 0; i < n; i++) {
            b->comp[i * K + k] = s->x[i];
            b->kT[i * K + k] = s->kT[i];
            for (d = 0; d < NDIM; d++)
                b->grad[(i * NDIM + d) * K + k] = s->g[i * NDIM + d];
            for (j = 0; j < n; j++)
                b->Dij[(i * n + j) * K + k] = s->D[i * n + j];
        }
        for (d = 0; d < NDIM; d++)
            b->glnT[d * K + k] = s->glnT[d];
    }
}

static void soa_free(soa *b)
{
    free(b->comp);
    free(b->grad);
    free(b->Dij);
    free(b->c);
    free(b->kT);
    free(b->glnT);
}

START_TEST(thermal_batched_matches_single_state)
{
    static const size_t Ns[] = {2, 3, 4, 5, 7, 12};
    mcd_workspace *ws = ws_new();
    size_t ni;
    ck_assert_int_eq(mcd_workspace_set_iterative(ws, 1000, 0.0), MCD_OK);
    for (ni = 0; ni < sizeof Ns / sizeof Ns[0]; ni++) {
        const size_t n = Ns[ni], K = 21;
        tstate cells[21];
        soa b;
        double *out = malloc(n * NDIM * K * sizeof(double));
        int model, fb;
        ck_assert_ptr_nonnull(out);
        soa_make(&b, n, K, cells, 1);
        for (model = 0; model < 3; model++)
            for (fb = 0; fb < 2; fb++) {
                mcd_cells cl = {.n_cells = K,
                                .n_dim = NDIM,
                                .comp_basis = MCD_BASIS_MOLE,
                                .comp = b.comp,
                                .grad = b.grad,
                                .kT = b.kT,
                                .grad_lnT = b.glnT};
                size_t k, i, d;
                ck_assert_msg(mcd_flux_batch_dij(ws, (mcd_model)model, n,
                                                 cells[0].M, b.Dij, b.c, &cl,
                                                 (mcd_basis)fb, out) == MCD_OK,
                              "%s", mcd_last_error());
                for (k = 0; k < K; k++) {
                    double F[NMAX * NDIM], G[NMAX * NDIM];
                    mcd_state st = state_of(&cells[k], 1);
                    ck_assert_int_eq(mcd_flux_compute(ws, (mcd_model)model, &st,
                                                      (mcd_basis)fb, F),
                                     MCD_OK);
                    for (i = 0; i < n; i++)
                        for (d = 0; d < NDIM; d++)
                            G[i * NDIM + d] = out[(i * NDIM + d) * K + k];
                    /* the same equations by the same stages; different
                     * lane widths only change rounding (1e-13 as the
                     * batched suites) */
                    ck_assert_msg(sup_rel_diff(G, F, n * NDIM) < 1e-13,
                                  "n %zu model %d basis %d cell %zu: %g", n,
                                  model, fb, k, sup_rel_diff(G, F, n * NDIM));
                }
            }
        soa_free(&b);
        free(out);
    }
    mcd_workspace_free(ws);
}
END_TEST

/* A mixture of n built-in species that have diffusion volumes. */
static mcd_mixture *mix_of(const mcd_db *db, size_t n)
{
    const char *names[NMAX];
    size_t i, cnt = mcd_db_species_count(db), got = 0;
    mcd_mixture *m;
    for (i = 0; i < cnt && got < n; i++) {
        double v;
        if (mcd_db_param(db, i, MCD_PARAM_DIFF_VOLUME, &v) == MCD_OK)
            names[got++] = mcd_db_name(db, i);
    }
    ck_assert_uint_eq(got, n);
    ck_assert_int_eq(mcd_mixture_new(db, n, names, MCD_GAS_FSG, &m), MCD_OK);
    return m;
}

START_TEST(thermal_aos_matches_soa)
{
    mcd_db *db;
    mcd_workspace *ws = ws_new();
    const size_t n = 4, K = 19;
    size_t k, i, d;
    tstate cells[19];
    soa b;
    double T[19], P[19], ac[4 * 19], ag[4 * NDIM * 19], ak[4 * 19];
    double al[NDIM * 19], out[4 * NDIM * 19], aout[4 * NDIM * 19];
    mcd_mixture *m;
    ck_assert_int_eq(mcd_db_new_builtin(&db), MCD_OK);
    m = mix_of(db, n);
    soa_make(&b, n, K, cells, 1);
    for (k = 0; k < K; k++) {
        T[k] = 250.0 + 20.0 * (double)k;
        P[k] = 1e5 + 1e3 * (double)k;
        for (i = 0; i < n; i++) {
            ac[k * n + i] = b.comp[i * K + k];
            ak[k * n + i] = b.kT[i * K + k];
            for (d = 0; d < NDIM; d++)
                ag[(k * n + i) * NDIM + d] = b.grad[(i * NDIM + d) * K + k];
        }
        for (d = 0; d < NDIM; d++)
            al[k * NDIM + d] = b.glnT[d * K + k];
    }
    ck_assert_int_eq(mcd_flux_batch(ws, m, MCD_MODEL_MAXWELL_STEFAN, T, P,
                                    &(mcd_cells){.n_cells = K,
                                                 .n_dim = NDIM,
                                                 .comp = b.comp,
                                                 .grad = b.grad,
                                                 .kT = b.kT,
                                                 .grad_lnT = b.glnT},
                                    MCD_BASIS_MOLE, out),
                     MCD_OK);
    ck_assert_int_eq(mcd_flux_batch_aos(ws, m, MCD_MODEL_MAXWELL_STEFAN, T, P,
                                        &(mcd_cells){.n_cells = K,
                                                     .n_dim = NDIM,
                                                     .comp = ac,
                                                     .grad = ag,
                                                     .kT = ak,
                                                     .grad_lnT = al},
                                        MCD_BASIS_MOLE, aout),
                     MCD_OK);
    for (k = 0; k < K; k++) {
        double F[4 * NDIM], G[4 * NDIM];
        for (i = 0; i < n; i++)
            for (d = 0; d < NDIM; d++) {
                F[i * NDIM + d] = out[(i * NDIM + d) * K + k];
                G[i * NDIM + d] = aout[(k * n + i) * NDIM + d];
            }
        /* the AoS call runs the SoA kernel on transposed blocks: the
         * lanes differ, so the rounding may (1e-13 as test_batch) */
        ck_assert_msg(sup_rel_diff(G, F, n * NDIM) < 1e-13, "cell %zu: %g", k,
                      sup_rel_diff(G, F, n * NDIM));
    }
    soa_free(&b);
    mcd_mixture_free(m);
    mcd_db_free(db);
    mcd_workspace_free(ws);
}
END_TEST

START_TEST(thermal_bad_input_named_outputs_untouched)
{
    mcd_workspace *ws = ws_new();
    tstate s;
    mcd_state st;
    double F[NMAX * NDIM], kT[NMAX], bad[NMAX];
    draw(&s, 3, 0);
    st = state_of(&s, 1);
    st.grad_lnT = NULL;
    sup_guard_fill(F, 3 * NDIM);
    ck_assert_int_eq(
        mcd_flux_compute(ws, MCD_MODEL_MAXWELL_STEFAN, &st, MCD_BASIS_MOLE, F),
        MCD_EINVAL);
    ck_assert_str_eq(mcd_last_error(), "argument grad_lnT: NULL while kT is "
                                       "given (thermal diffusion needs both)");
    st = state_of(&s, 1);
    memcpy(bad, s.kT, sizeof bad);
    bad[1] = SUP_NAN;
    st.kT = bad;
    ck_assert_int_eq(
        mcd_flux_compute(ws, MCD_MODEL_MAXWELL_STEFAN, &st, MCD_BASIS_MOLE, F),
        MCD_EINVAL);
    ck_assert_str_eq(mcd_last_error(), "argument kT: entry 1 is not finite");
    st = state_of(&s, 1);
    memcpy(bad, s.glnT, NDIM * sizeof(double));
    bad[2] = SUP_INF;
    st.grad_lnT = bad;
    ck_assert_int_eq(mcd_flux_compute(ws, MCD_MODEL_MIXTURE_AVERAGED, &st,
                                      MCD_BASIS_MASS, F),
                     MCD_EINVAL);
    ck_assert_str_eq(mcd_last_error(),
                     "argument grad_lnT: entry (0,2) is not finite");
    ck_assert(sup_guard_intact(F, 3 * NDIM));

    /* mcd_thermal_ratios: M is required, D^T finite */
    st = state_of(&s, 0);
    st.M = NULL;
    sup_guard_fill(kT, 3);
    ck_assert_int_eq(mcd_thermal_ratios(ws, &st, s.kT, kT), MCD_EINVAL);
    st = state_of(&s, 0);
    bad[0] = 1e-6;
    bad[1] = SUP_NAN;
    bad[2] = -1e-6;
    ck_assert_int_eq(mcd_thermal_ratios(ws, &st, bad, kT), MCD_EINVAL);
    ck_assert_str_eq(mcd_last_error(), "argument DT: entry 1 is not finite");
    ck_assert_int_eq(mcd_thermal_ratios(ws, &st, NULL, kT), MCD_EINVAL);
    ck_assert(sup_guard_intact(kT, 3));
    mcd_workspace_free(ws);
}
END_TEST

START_TEST(thermal_batched_bad_cell_named_as_single_state)
{
    mcd_workspace *ws = ws_new();
    const size_t n = 3, K = 11;
    tstate cells[11];
    soa b;
    double out[3 * NDIM * 11], F[3 * NDIM];
    char single[256];
    mcd_state st;
    mcd_cells cl;
    soa_make(&b, n, K, cells, 0);
    cl = (mcd_cells){.n_cells = K,
                     .n_dim = NDIM,
                     .comp = b.comp,
                     .grad = b.grad,
                     .kT = b.kT,
                     .grad_lnT = b.glnT};
    /* cell 7: k_T of species 2 not finite */
    b.kT[2 * K + 7] = SUP_NAN;
    cells[7].kT[2] = SUP_NAN;
    st = state_of(&cells[7], 1);
    ck_assert_int_eq(
        mcd_flux_compute(ws, MCD_MODEL_MAXWELL_STEFAN, &st, MCD_BASIS_MOLE, F),
        MCD_EINVAL);
    snprintf(single, sizeof single, "cell 7: %s", mcd_last_error());
    ck_assert_int_eq(mcd_flux_batch_dij(ws, MCD_MODEL_MAXWELL_STEFAN, n,
                                        cells[0].M, b.Dij, b.c, &cl,
                                        MCD_BASIS_MOLE, out),
                     MCD_EINVAL);
    ck_assert_str_eq(mcd_last_error(), single);
    /* one of the pair missing: the call, not a cell */
    b.kT[2 * K + 7] = 0.0;
    cl.grad_lnT = NULL;
    ck_assert_int_eq(mcd_flux_batch_dij(ws, MCD_MODEL_MAXWELL_STEFAN, n,
                                        cells[0].M, b.Dij, b.c, &cl,
                                        MCD_BASIS_MOLE, out),
                     MCD_EINVAL);
    ck_assert_str_eq(mcd_last_error(), "argument grad_lnT: NULL while kT is "
                                       "given (thermal diffusion needs both)");
    soa_free(&b);
    mcd_workspace_free(ws);
}
END_TEST

int main(void)
{
    Suite *s = suite_create("mcd:thermal");
    TCase *tc = tcase_create("laws");
    tcase_add_test(tc, thermal_binary_law_every_model);
    tcase_add_test(tc, thermal_positive_kT_sends_species_to_the_cold_side);
    tcase_add_test(tc, thermal_ratios_binary_closed_form);
    tcase_add_test(tc, thermal_ratios_give_the_mass_flux_form);
    tcase_add_test(tc, thermal_fluxes_sum_to_zero_in_every_model_and_basis);
    suite_add_tcase(s, tc);
    tc = tcase_create("paths");
    tcase_add_test(tc, thermal_batched_matches_single_state);
    tcase_add_test(tc, thermal_aos_matches_soa);
    suite_add_tcase(s, tc);
    tc = tcase_create("errors");
    tcase_add_test(tc, thermal_bad_input_named_outputs_untouched);
    tcase_add_test(tc, thermal_batched_bad_cell_named_as_single_state);
    suite_add_tcase(s, tc);
    return sup_run(s);
}
