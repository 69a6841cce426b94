/* test_liquid_batch.c - mcd_liquid_flux_batch: batched fluxes of a liquid.
 *
 * Against the single-state route (mcd_liquid_eval, mcd_flux_compute,
 * mcd_flux_to_volume_frame) over random liquids of every activity model,
 * N = 2..6, random cells with trace species, both composition and flux
 * bases, both models, with and without partial molar volumes; the
 * zero-sum in each frame; the binary closed forms J_1 = -c Đ Gamma grad
 * x_1 (Maxwell-Stefan with the thermodynamic factor) and J^V_1 = -D grad
 * c_1 (the same D in the volume frame); refusal of an unstable cell
 * (named, outputs untouched) and of bad input (named field and cell).
 */
#include <check.h>
#include <math.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

#include "mcdiff.h"
#include "support.h"
#include "liquid_support.h"

#define NMAX 6
#define KMAX 41

static mcd_workspace *ws;

static void setup(void)
{
    ck_assert_int_eq(mcd_workspace_new(NMAX, &ws), MCD_OK);
}
static void teardown(void) { mcd_workspace_free(ws); }

static const mcd_activity_model models[4] = {
    MCD_ACTIVITY_NRTL, MCD_ACTIVITY_WILSON, MCD_ACTIVITY_UNIQUAC,
    MCD_ACTIVITY_IDEAL};

/* One batch: K cells in SoA arrays, and per cell what the single-state
 * route needs (mole fractions x, the call's composition y). */
typedef struct batch {
    size_t n, nd, K;
    mcd_basis cb, fb;
    double T[KMAX], c[KMAX], M[NMAX];
    double y[NMAX * KMAX], g[NMAX * 3 * KMAX], V[NMAX * KMAX];
    double x[KMAX][NMAX];
} batch;

/* Cell k: a stable state of liq (redrawn until mcd_liquid_eval accepts
 * it, at most 200 draws; the refusal itself is tested below), with a
 * trace species (x = 0) in every fifth cell for N >= 3, gradients of
 * zero mean, partial molar volumes near the pure ones (ideal mixing
 * perturbed by up to 10 %) and c = 1 / sum x_i Vbar_i. */
static void random_cell(sup_rng *r, const mcd_liquid *liq, batch *b, size_t k)
{
    const size_t n = b->n, nd = b->nd, K = b->K;
    double x[NMAX], y[NMAX], g[NMAX * 3], G[NMAX * NMAX], sv = 0.0;
    int draws = 0;
    for (;;) {
        ck_assert_int_lt(draws++, 200);
        b->T[k] = sup_range(r, 285, 365);
        sup_fractions(r, n, 0.02, x);
        if (n >= 3 && k % 5 == 4) {
            size_t t = (size_t)(sup_u01(r) * (double)n) % n;
            double s = 1.0 - x[t];
            x[t] = 0.0;
            for (size_t i = 0; i < n; i++)
                x[i] /= s;
        }
        if (mcd_liquid_eval(ws, liq, b->T[k], x, NULL, G, NULL, NULL) == MCD_OK)
            break;
    }
    if (b->cb == MCD_BASIS_MASS)
        ck_assert_int_eq(mcd_comp_x_to_w(n, b->M, x, y), MCD_OK);
    else
        memcpy(y, x, sizeof y);
    /* the library's mole fractions of y (the single-state route's) */
    if (b->cb == MCD_BASIS_MASS)
        ck_assert_int_eq(mcd_comp_w_to_x(n, b->M, y, b->x[k]), MCD_OK);
    else
        memcpy(b->x[k], x, sizeof x);
    sup_gradients_zero_mean(r, n, nd, -20, 20, g);
    for (size_t i = 0; i < n; i++) {
        double v = sup_range(r, 2e-5, 1.5e-4) * sup_range(r, 0.9, 1.1);
        b->V[i * K + k] = v;
        sv += b->x[k][i] * v;
        b->y[i * K + k] = y[i];
        for (size_t d = 0; d < nd; d++)
            b->g[(i * nd + d) * K + k] = g[i * nd + d];
    }
    b->c[k] = 1.0 / sv;
}

/* The single-state route for cell k: mcd_liquid_eval, mcd_flux_compute,
 * and with Vbar mcd_flux_to_volume_frame (times M_i for mass fluxes). */
static void single_cell(const mcd_liquid *liq, mcd_model model, const batch *b,
                        size_t k, int vol, double *F)
{
    const size_t n = b->n, nd = b->nd, K = b->K;
    double G[NMAX * NMAX], D[NMAX * NMAX], y[NMAX], g[NMAX * 3], V[NMAX];
    double J[NMAX * 3];
    for (size_t i = 0; i < n; i++) {
        y[i] = b->y[i * K + k];
        V[i] = b->V[i * K + k];
        for (size_t d = 0; d < nd; d++)
            g[i * nd + d] = b->g[(i * nd + d) * K + k];
    }
    ck_assert_int_eq(
        mcd_liquid_eval(ws, liq, b->T[k], b->x[k], NULL, G, D, NULL), MCD_OK);
    mcd_state s = {.n_species = n,
                   .n_dim = nd,
                   .comp_basis = b->cb,
                   .c = b->c[k],
                   .M = b->M,
                   .Dij = D,
                   .comp = y,
                   .grad = g,
                   .Gamma = G};
    if (!vol) {
        ck_assert_int_eq(mcd_flux_compute(ws, model, &s, b->fb, F), MCD_OK);
        return;
    }
    ck_assert_int_eq(mcd_flux_compute(ws, model, &s, MCD_BASIS_MOLE, J),
                     MCD_OK);
    ck_assert_int_eq(mcd_flux_to_volume_frame(n, nd, b->c[k], b->x[k], V, J, F),
                     MCD_OK);
    if (b->fb == MCD_BASIS_MASS)
        for (size_t i = 0; i < n; i++)
            for (size_t d = 0; d < nd; d++)
                F[i * nd + d] *= b->M[i];
}

/*
 * Batched against the single-state route, cell by cell, over 160 random
 * batches: every activity model (NRTL, Wilson, UNIQUAC, ideal), N =
 * 2..6, 1..3 directions, 1..41 cells, composition and flux bases (mole
 * and mass), the exact and the mixture-averaged models, with and without
 * partial molar volumes, trace species. Both routes run the same code on
 * the same numbers (the batched call gathers each cell and calls the
 * single-state core); 1e-13 of the cell's largest flux allows for a
 * different order of a few sums, should the code paths ever diverge.
 * Then the zero-sum in the cell's frame: sum_i F_i (no Vbar, MOLE),
 * sum_i j_i (MASS), sum_i Vbar_i J^V_i (MOLE with Vbar) or sum_i Vbar_i
 * j^V_i / M_i (MASS with Vbar), each to 1e-12 of the sum of the
 * magnitudes of its terms (round-off of N-term sums after an O(N^3)
 * solve of a well-conditioned system, with margin).
 */
START_TEST(liquid_batch_equals_single_state_route)
{
    sup_rng r = SUP_RNG(SUP_SPLITMIX64, 1811);
    static batch b;
    double out[NMAX * 3 * KMAX], F[NMAX * 3];
    size_t cells = 0, traces = 0;
    for (int trial = 0; trial < 160; trial++) {
        mcd_activity_model m = models[trial % 4];
        mcd_model model = (trial / 4) % 3 == 2 ? MCD_MODEL_MIXTURE_AVERAGED
                                               : MCD_MODEL_MAXWELL_STEFAN;
        int vol = (trial / 8) % 2;
        b.n = 2 + (size_t)(trial / 2) % 5;
        b.nd = 1 + (size_t)trial % 3;
        b.K = 1 + (size_t)(sup_u01(&r) * KMAX) % KMAX;
        b.cb = (trial / 3) % 2 ? MCD_BASIS_MASS : MCD_BASIS_MOLE;
        b.fb = (trial / 5) % 2 ? MCD_BASIS_MASS : MCD_BASIS_MOLE;
        for (size_t i = 0; i < b.n; i++)
            b.M[i] = sup_range(&r, 0.018, 0.2);
        mcd_liquid *liq = random_liquid(&r, m, b.n);
        for (size_t k = 0; k < b.K; k++)
            random_cell(&r, liq, &b, k);
        mcd_cells cl = {.n_cells = b.K,
                        .n_dim = b.nd,
                        .comp_basis = b.cb,
                        .comp = b.y,
                        .grad = b.g};
        unsigned warn = 99;
        ck_assert_msg(mcd_liquid_flux_batch(ws, liq, model, b.T, b.c, b.M,
                                            vol ? b.V : NULL, &cl, b.fb, out,
                                            &warn) == MCD_OK,
                      "trial %d: %s", trial, mcd_last_error());
        ck_assert_uint_eq(warn, 0);
        for (size_t k = 0; k < b.K; k++) {
            const size_t n = b.n, nd = b.nd, K = b.K;
            single_cell(liq, model, &b, k, vol, F);
            double sc = sup_max_abs(F, n * nd);
            ck_assert_double_gt(sc, 0.0);
            for (size_t e = 0; e < n * nd; e++)
                ck_assert_msg(fabs(out[e * K + k] - F[e]) <= 1e-13 * sc,
                              "trial %d cell %zu entry %zu: %.17g vs %.17g",
                              trial, k, e, out[e * K + k], F[e]);
            for (size_t d = 0; d < nd; d++) {
                double s = 0.0, a = 0.0;
                for (size_t i = 0; i < n; i++) {
                    double t = out[(i * nd + d) * K + k];
                    if (vol)
                        t *= b.V[i * K + k] /
                             (b.fb == MCD_BASIS_MASS ? b.M[i] : 1.0);
                    s += t;
                    a += fabs(t);
                }
                ck_assert_msg(fabs(s) <= 1e-12 * a, "trial %d: sum %g of %g",
                              trial, s, a);
            }
            for (size_t i = 0; i < n; i++)
                traces += b.x[k][i] == 0.0;
            cells++;
        }
        mcd_liquid_free(liq);
    }
    ck_assert_uint_ge(cells, 2000);
    ck_assert_uint_ge(traces, 100);
}
END_TEST

/*
 * Binary closed forms, NRTL with alpha = 0: the two-suffix Margules
 * equation ln gamma_1 = A x_2^2, A = tau_12 + tau_21 (Renon and Prausnitz
 * 1968), reduced thermodynamic factor Gamma = 1 - 2 A x_1 x_2; Vignes
 * (1966) Đ = (D°_12)^x_2 (D°_21)^x_1; the Maxwell-Stefan flux of a
 * binary J_1 = -c Đ Gamma grad x_1 (Taylor and Krishna 1993, ch. 2).
 * In the volume frame with constant molar volumes (c = 1 / (x_1 V_1 +
 * x_2 V_2)), J^V_1 = J_1 - c x_1 (V_1 - V_2) J_1 = c V_2 J_1, which is
 * -D grad c_1 with the same D = Đ Gamma, since grad c_1 = c^2 V_2 grad
 * x_1 (derived here from the definitions; the frame independence of the
 * binary D is the textbook result, Bird, Stewart and Lightfoot 2002,
 * ch. 17, from memory). A = 1.5 keeps the liquid stable (2 A x_1 x_2 <=
 * 0.75). Tolerance 1e-12 relative: the closed forms and the library
 * differ by the round-off of a few exponentials and a 1 x 1 solve.
 */
START_TEST(liquid_batch_binary_closed_forms)
{
    const double tau[3] = {0.75, 0, 0}, D12 = 1.2e-9, D21 = 2.7e-9;
    const double V1 = 4.1e-5, V2 = 1.8e-5; /* m^3/mol: methanol- and
                                             water-like, illustrative */
    enum { K = 9 };
    double T[K], c[K], y[2 * K], g[2 * K], V[2 * K], J[2 * K], JV[2 * K];
    mcd_liquid *liq = NULL;
    ck_assert_int_eq(mcd_liquid_new(2, MCD_ACTIVITY_NRTL, &liq), MCD_OK);
    ck_assert_int_eq(mcd_liquid_set_pair(liq, 0, 1, tau, tau, 0.0, 0, 0),
                     MCD_OK);
    ck_assert_int_eq(mcd_liquid_set_dinf(liq, 0, 1, D12, D21), MCD_OK);
    for (size_t k = 0; k < K; k++) {
        double x1 = 0.05 + 0.1125 * (double)k;
        T[k] = 290.0 + 5.0 * (double)k;
        y[k] = x1, y[K + k] = 1 - x1;
        g[k] = 3.0 - (double)k, g[K + k] = -g[k];
        V[k] = V1, V[K + k] = V2;
        c[k] = 1.0 / (x1 * V1 + (1 - x1) * V2);
    }
    mcd_cells cl = {.n_cells = K,
                    .n_dim = 1,
                    .comp_basis = MCD_BASIS_MOLE,
                    .comp = y,
                    .grad = g};
    ck_assert_int_eq(mcd_liquid_flux_batch(ws, liq, MCD_MODEL_MAXWELL_STEFAN, T,
                                           c, NULL, NULL, &cl, MCD_BASIS_MOLE,
                                           J, NULL),
                     MCD_OK);
    ck_assert_int_eq(mcd_liquid_flux_batch(ws, liq, MCD_MODEL_MAXWELL_STEFAN, T,
                                           c, NULL, V, &cl, MCD_BASIS_MOLE, JV,
                                           NULL),
                     MCD_OK);
    for (size_t k = 0; k < K; k++) {
        double x1 = y[k], x2 = 1 - x1;
        double D = pow(D12, x2) * pow(D21, x1) * (1 - 2 * 1.5 * x1 * x2);
        double ref = -c[k] * D * g[k];
        double gc1 = c[k] * c[k] * V2 * g[k];
        ck_assert_double_le(fabs(J[k] - ref), 1e-12 * fabs(ref) + 1e-300);
        ck_assert_double_le(fabs(J[K + k] + ref), 1e-12 * fabs(ref) + 1e-300);
        ck_assert_double_le(fabs(JV[k] + D * gc1),
                            1e-12 * fabs(D * gc1) + 1e-300);
        ck_assert_double_le(fabs(V1 * JV[k] + V2 * JV[K + k]),
                            1e-12 * V1 * fabs(JV[k]) + 1e-300);
    }
    mcd_liquid_free(liq);
}
END_TEST

/* A batch with an unstable cell: NRTL alpha = 0, A = 2.5 (tau 1.25 each:
 * spinodal at x_1 x_2 = 1 / (2 A) = 0.2, as in tests/test_liquid.c).
 * Cells 0-2 and 4 lie outside the spinodal (x_1 = 0.1, 0.15, 0.9, 0.05),
 * cell 3 at x_1 = 0.5 inside it: EDOM naming cell 3 and "not stable",
 * the output untouched (the check pass runs before any write), the
 * warning untouched too. Without cell 3 the call succeeds. */
START_TEST(liquid_batch_unstable_cell_is_named)
{
    const double tau[3] = {1.25, 0, 0};
    enum { K = 5 };
    double T[K] = {300, 300, 300, 300, 300}, c[K], y[2 * K], g[2 * K];
    double out[2 * K];
    const double x1[K] = {0.1, 0.15, 0.9, 0.5, 0.05};
    unsigned warn = 7;
    mcd_liquid *liq = NULL;
    ck_assert_int_eq(mcd_liquid_new(2, MCD_ACTIVITY_NRTL, &liq), MCD_OK);
    ck_assert_int_eq(mcd_liquid_set_pair(liq, 0, 1, tau, tau, 0.0, 0, 0),
                     MCD_OK);
    ck_assert_int_eq(mcd_liquid_set_dinf(liq, 0, 1, 1e-9, 2e-9), MCD_OK);
    for (size_t k = 0; k < K; k++) {
        y[k] = x1[k], y[K + k] = 1 - x1[k];
        g[k] = 1.0, g[K + k] = -1.0;
        c[k] = 2e4;
    }
    mcd_cells cl = {.n_cells = K,
                    .n_dim = 1,
                    .comp_basis = MCD_BASIS_MOLE,
                    .comp = y,
                    .grad = g};
    sup_guard_fill(out, 2 * K);
    ck_assert_int_eq(mcd_liquid_flux_batch(ws, liq, MCD_MODEL_MAXWELL_STEFAN, T,
                                           c, NULL, NULL, &cl, MCD_BASIS_MOLE,
                                           out, &warn),
                     MCD_EDOM);
    ck_assert_msg(strstr(mcd_last_error(), "cell 3:") != NULL &&
                      strstr(mcd_last_error(), "not stable") != NULL &&
                      strstr(mcd_last_error(), "comp") != NULL,
                  "%s", mcd_last_error());
    /* cells 0..2 are written (the batched rule), cell 3 on are not */
    for (size_t i = 0; i < 2; i++)
        ck_assert(sup_guard_intact(out + i * K + 3, K - 3));
    ck_assert_uint_eq(warn, 7);
    y[3] = 0.2, y[K + 3] = 0.8; /* x_1 x_2 = 0.16 < 0.2: stable */
    ck_assert_int_eq(mcd_liquid_flux_batch(ws, liq, MCD_MODEL_MAXWELL_STEFAN, T,
                                           c, NULL, NULL, &cl, MCD_BASIS_MOLE,
                                           out, &warn),
                     MCD_OK);
    ck_assert_uint_eq(warn, 0);
    mcd_liquid_free(liq);
}
END_TEST

/* The call with one change from a good one; expects status st, a message
 * containing `want` (and "cell <k>:" when cell >= 0), outputs untouched. */
typedef struct bad_case {
    mcd_workspace *ws;
    const mcd_liquid *liq;
    mcd_model model;
    const double *T, *c, *M, *V;
    mcd_cells cl;
    mcd_basis fb;
    double *out;
} bad_case;

static void expect_bad(const bad_case *a, mcd_status st, int cell,
                       const char *want, int line)
{
    double out[4 * 3 * 4];
    unsigned warn = 5;
    char tag[32];
    sup_guard_fill(out, 4 * 3 * 4);
    mcd_status got = mcd_liquid_flux_batch(a->ws, a->liq, a->model, a->T, a->c,
                                           a->M, a->V, &a->cl, a->fb,
                                           a->out != NULL ? out : NULL, &warn);
    ck_assert_msg(got == st, "line %d: status %d, want %d (%s)", line, got, st,
                  mcd_last_error());
    ck_assert_msg(strstr(mcd_last_error(), want) != NULL,
                  "line %d: '%s' lacks '%s'", line, mcd_last_error(), want);
    if (cell >= 0) {
        snprintf(tag, sizeof tag, "cell %d:", cell);
        ck_assert_msg(strstr(mcd_last_error(), tag) != NULL,
                      "line %d: '%s' lacks '%s'", line, mcd_last_error(), tag);
    }
    ck_assert_msg(sup_guard_intact(out, 4 * 3 * 4), "line %d: written", line);
    ck_assert_uint_eq(warn, 5);
}

/* Bad input: each argument and each cell field, with the code and the
 * words of the other calls, the field and the cell named; nothing
 * written. Also: K = 0 writes nothing, N = 1 gives zero fluxes, and a T
 * outside a pair's declared range sets MCD_WARN_TEMPERATURE. */
START_TEST(liquid_batch_bad_input)
{
    const double cf[3] = {0.05, 40.0, 0.0};
    enum { N = 3, K = 4 };
    double T[K] = {300, 310, 320, 330}, c[K] = {2e4, 2e4, 2e4, 2e4};
    double M[N] = {0.03, 0.05, 0.07};
    double y[N * K] = {0.2, 0.3, 0.4, 0.5, 0.3, 0.3,
                       0.3, 0.3, 0.5, 0.4, 0.3, 0.2};
    double g[N * K] = {1, 2, 3, 4, -1, -1, -1, -1, 0, -1, -2, -3};
    double V[N * K], out[N * K];
    mcd_liquid *liq = NULL, *nod = NULL, *one = NULL;
    mcd_workspace *small = NULL;
    ck_assert_int_eq(mcd_liquid_new(N, MCD_ACTIVITY_NRTL, &liq), MCD_OK);
    ck_assert_int_eq(mcd_liquid_new(N, MCD_ACTIVITY_NRTL, &nod), MCD_OK);
    for (size_t i = 0; i < N; i++)
        for (size_t j = i + 1; j < N; j++) {
            ck_assert_int_eq(
                mcd_liquid_set_pair(liq, i, j, cf, cf, 0.3, 280, 325), MCD_OK);
            ck_assert_int_eq(mcd_liquid_set_pair(nod, i, j, cf, cf, 0.3, 0, 0),
                             MCD_OK);
            ck_assert_int_eq(mcd_liquid_set_dinf(liq, i, j, 1e-9, 2e-9),
                             MCD_OK);
        }
    for (size_t k = 0; k < K; k++) {
        double s = 0.0;
        for (size_t i = 0; i < N; i++)
            s += y[i * K + k] * (V[i * K + k] = 3e-5 * (double)(i + 1));
        c[k] = 1.0 / s;
    }
    bad_case ok = {.ws = ws,
                   .liq = liq,
                   .model = MCD_MODEL_MAXWELL_STEFAN,
                   .T = T,
                   .c = c,
                   .M = M,
                   .V = V,
                   .cl = {.n_cells = K,
                          .n_dim = 1,
                          .comp_basis = MCD_BASIS_MOLE,
                          .comp = y,
                          .grad = g},
                   .fb = MCD_BASIS_MOLE,
                   .out = out};
    bad_case a;
    double Tb[K], cb[K], yb[N * K], gb[N * K], Vb[N * K], kT[N * K];
    double glnT[K] = {1, 1, 1, 1}, glnP[K] = {0, 0, 0, 0};
    unsigned warn = 0;

    /* the good call, and its warning: T[3] = 330 K is above 325 K */
    ck_assert_int_eq(mcd_liquid_flux_batch(ws, liq, ok.model, T, c, M, V,
                                           &ok.cl, ok.fb, out, &warn),
                     MCD_OK);
    ck_assert_uint_eq(warn, MCD_WARN_TEMPERATURE);

    a = ok, a.liq = NULL;
    expect_bad(&a, MCD_EINVAL, -1, "argument liq", __LINE__);
    a = ok, a.out = NULL;
    expect_bad(&a, MCD_EINVAL, -1, "out_flux", __LINE__);
    a = ok, a.T = NULL;
    expect_bad(&a, MCD_EINVAL, -1, "argument T", __LINE__);
    a = ok, a.c = NULL;
    expect_bad(&a, MCD_EINVAL, -1, "argument c", __LINE__);
    a = ok, a.cl.comp = NULL;
    expect_bad(&a, MCD_EINVAL, -1, "argument comp", __LINE__);
    a = ok, a.cl.n_dim = 4;
    expect_bad(&a, MCD_EINVAL, -1, "n_dim", __LINE__);
    a = ok, a.model = MCD_MODEL_ITERATIVE;
    expect_bad(&a, MCD_EINVAL, -1, "argument model", __LINE__);
    a = ok, a.model = (mcd_model)77;
    expect_bad(&a, MCD_EINVAL, -1, "model", __LINE__);
    a = ok, a.fb = (mcd_basis)9;
    expect_bad(&a, MCD_EINVAL, -1, "flux_basis", __LINE__);
    a = ok, a.cl.grad_lnP = glnP;
    expect_bad(&a, MCD_EINVAL, -1, "argument grad_lnP", __LINE__);
    a = ok, a.cl.kT = kT;
    expect_bad(&a, MCD_EINVAL, -1, "grad_lnT", __LINE__);
    a = ok, a.M = NULL, a.fb = MCD_BASIS_MASS;
    expect_bad(&a, MCD_EINVAL, -1, "argument M", __LINE__);
    a = ok, a.liq = nod;
    expect_bad(&a, MCD_ENODATA, -1, "argument liq: pair (0, 1)", __LINE__);
    ck_assert_int_eq(mcd_workspace_new(2, &small), MCD_OK);
    a = ok, a.ws = small;
    expect_bad(&a, MCD_EBADLEN, -1, "", __LINE__);
    mcd_workspace_free(small);

    /* per cell: the cell and the field named */
    memcpy(Tb, T, sizeof T);
    Tb[2] = SUP_NAN;
    a = ok, a.T = Tb;
    expect_bad(&a, MCD_EINVAL, 2, "argument T", __LINE__);
    Tb[2] = -5.0;
    expect_bad(&a, MCD_EDOM, 2, "argument T", __LINE__);
    memcpy(cb, c, sizeof c);
    cb[1] = 0.0;
    a = ok, a.c = cb;
    expect_bad(&a, MCD_EDOM, 1, "argument c", __LINE__);
    memcpy(yb, y, sizeof y);
    yb[1 * K + 3] = -0.1;
    a = ok, a.cl.comp = yb;
    expect_bad(&a, MCD_EDOM, 3, "argument comp", __LINE__);
    memcpy(gb, g, sizeof g);
    gb[2 * K + 1] = SUP_INF;
    a = ok, a.cl.grad = gb;
    expect_bad(&a, MCD_EINVAL, 1, "argument grad", __LINE__);
    memcpy(Vb, V, sizeof V);
    Vb[0 * K + 2] = SUP_NAN;
    a = ok, a.V = Vb;
    expect_bad(&a, MCD_EINVAL, 2, "argument Vbar", __LINE__);
    Vb[0 * K + 2] = 2.0 * V[2];
    expect_bad(&a, MCD_EDOM, 2, "argument Vbar", __LINE__);
    for (size_t e = 0; e < N * K; e++)
        kT[e] = 0.01;
    kT[2 * K + 3] = SUP_NAN;
    a = ok, a.cl.kT = kT, a.cl.grad_lnT = glnT;
    expect_bad(&a, MCD_EINVAL, 3, "argument kT", __LINE__);

    /* K = 0 writes nothing; N = 1: zero fluxes */
    {
        double o[3];
        sup_guard_fill(o, 3);
        a = ok, a.cl.n_cells = 0;
        ck_assert_int_eq(mcd_liquid_flux_batch(ws, liq, a.model, T, c, M, V,
                                               &a.cl, a.fb, o, NULL),
                         MCD_OK);
        ck_assert(sup_guard_intact(o, 3));
        double y1[3] = {1, 1, 1}, g1[3] = {0, 0, 0}, c1[3] = {5e4, 5e4, 5e4};
        ck_assert_int_eq(mcd_liquid_new(1, MCD_ACTIVITY_IDEAL, &one), MCD_OK);
        mcd_cells c1l = {.n_cells = 3,
                         .n_dim = 1,
                         .comp_basis = MCD_BASIS_MOLE,
                         .comp = y1,
                         .grad = g1};
        ck_assert_int_eq(mcd_liquid_flux_batch(ws, one, a.model, T, c1, NULL,
                                               NULL, &c1l, MCD_BASIS_MOLE, o,
                                               NULL),
                         MCD_OK);
        for (size_t k = 0; k < 3; k++)
            ck_assert_double_eq(o[k], 0.0);
    }
    mcd_liquid_free(one);
    mcd_liquid_free(nod);
    mcd_liquid_free(liq);
}
END_TEST

int main(void)
{
    Suite *s = suite_create("mcd:liquid_batch");
    TCase *tc = tcase_create("liquid_batch");
    tcase_add_checked_fixture(tc, setup, teardown);
    tcase_set_timeout(tc, 120);
    tcase_add_test(tc, liquid_batch_equals_single_state_route);
    tcase_add_test(tc, liquid_batch_binary_closed_forms);
    tcase_add_test(tc, liquid_batch_unstable_cell_is_named);
    tcase_add_test(tc, liquid_batch_bad_input);
    suite_add_tcase(s, tc);
    return sup_run(s);
}
