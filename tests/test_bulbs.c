/*
 * test_bulbs.c - transient two-bulb cell (mcd_bulbs_linearized,
 * mcd_bulbs_integrate).
 *
 * Outside checks:
 *  - Duncan and Toor (1962), AIChE J. 8, 38: hydrogen (0) / nitrogen (1) /
 *    carbon dioxide (2) in two bulbs joined by a capillary at 35.2 C and
 *    about 1 atm. Bulb 1 starts as N2 + CO2, bulb 2 as H2 + N2 with almost
 *    the same N2 fraction. They observed N2 diffusing with almost no
 *    gradient of its own (osmotic diffusion), then against its gradient
 *    (reverse diffusion), a zero N2 flux with a finite gradient (diffusion
 *    barrier) and finally ordinary relaxation to equilibrium. Data, all
 *    FROM MEMORY (the search tool found no copy of the paper; they agree
 *    with the values used in tests/test_duncan_toor.c, and Taylor and
 *    Krishna 1993, ch. 5, discuss the experiment):
 *      Đ(H2-N2) = 83.3, Đ(H2-CO2) = 68.0, Đ(N2-CO2) = 16.8 mm^2/s;
 *      bulb 1: x(N2) = 0.50086, x(CO2) = 0.49914;
 *      bulb 2: x(H2) = 0.50121, x(N2) = 0.49879;
 *      capillary length 85.9 mm, diameter 2.08 mm; bulb volumes 77.99 and
 *      78.63 cm^3.
 *  - Binary closed form (common practice): with constant Đ the difference
 *    of the bulb compositions decays as exp(-beta Đ t),
 *    beta = A (V1 + V2)/(L V1 V2).
 *  - Conservation in a closed cell (common practice).
 */
#include <check.h>
#include <math.h>
#include <stdint.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

#include "mcdiff.h"
#include "support.h"

#define NMAX 8

static sup_rng rng = SUP_RNG(SUP_XORSHIFT64STAR, 0x243f6a8885a308d3ULL);

static mcd_workspace *ws;
static void setup(void)
{
    ck_assert_int_eq(mcd_workspace_new(NMAX, &ws), MCD_OK);
}
static void teardown(void) { mcd_workspace_free(ws); }

/* Duncan and Toor (1962), from memory (see top). */
enum { H2 = 0, N2 = 1, CO2 = 2 };
static const double DT_D[9] = {0,       83.3e-6, 68.0e-6, 83.3e-6, 0,
                               16.8e-6, 68.0e-6, 16.8e-6, 0};
static const double DT_X1[3] = {0.0, 0.50086, 0.49914};
static const double DT_X2[3] = {0.50121, 0.49879, 0.0};
static const double DT_L = 85.9e-3;    /* m */
static const double DT_DIAM = 2.08e-3; /* m */
static const double DT_V1 = 77.99e-6;  /* m^3 */
static const double DT_V2 = 78.63e-6;  /* m^3 */
static const double DT_T = 308.35;     /* K, 35.2 C */
static const double DT_P = 101325.0;   /* Pa, about 1 atm */

#define NT 242 /* 0 to 60 h by 0.25 h, then 400 h */

START_TEST(bulbs_duncan_toor_nitrogen_osmotic_reverse_then_normal)
{
    static double t[NT], x1[NT * 3], x2[NT * 3], l1[NT * 3], l2[NT * 3];
    double c, A = 0.78539816339744831 * DT_DIAM * DT_DIAM,
              /* pi/4 d^2 */ tot[3], maxdiff = 0.0;
    int phase = 0; /* 0 osmotic start, 1 reverse, 2 normal */
    double t_rev_start = -1, t_rev_end = -1, t_barrier = -1;
    double prevN = 0.0;
    int seen_barrier = 0;
    ck_assert_int_eq(mcd_comp_ideal_gas_c(DT_T, DT_P, &c), MCD_OK);
    for (int k = 0; k < NT - 1; k++)
        t[k] = 900.0 * k;
    t[NT - 1] = 400 * 3600.0;
    ck_assert_int_eq(mcd_bulbs_integrate(ws,
                                         &(mcd_bulbs){.n_species = 3,
                                                      .c = c,
                                                      .V1 = DT_V1,
                                                      .V2 = DT_V2,
                                                      .A = A,
                                                      .L = DT_L,
                                                      .Dij = DT_D,
                                                      .x1_0 = DT_X1,
                                                      .x2_0 = DT_X2},
                                         NT, t, 1e-9, x1, x2),
                     MCD_OK);
    ck_assert_int_eq(mcd_bulbs_linearized(ws,
                                          &(mcd_bulbs){.n_species = 3,
                                                       .c = c,
                                                       .V1 = DT_V1,
                                                       .V2 = DT_V2,
                                                       .A = A,
                                                       .L = DT_L,
                                                       .Dij = DT_D,
                                                       .x1_0 = DT_X1,
                                                       .x2_0 = DT_X2},
                                          NT, t, l1, l2),
                     MCD_OK);
    for (int i = 0; i < 3; i++)
        tot[i] = DT_V1 * DT_X1[i] + DT_V2 * DT_X2[i];

    for (int k = 0; k < NT - 1; k++) {
        double N[3], grad[3];
        unsigned flags[3];
        /* every species conserved to round-off: a few ulp of the total */
        for (int i = 0; i < 3; i++) {
            ck_assert_double_eq_tol(DT_V1 * x1[3 * k + i] +
                                        DT_V2 * x2[3 * k + i],
                                    tot[i], 4e-16 * (DT_V1 + DT_V2));
            ck_assert_double_eq_tol(DT_V1 * l1[3 * k + i] +
                                        DT_V2 * l2[3 * k + i],
                                    tot[i], 4e-16 * (DT_V1 + DT_V2));
            maxdiff = fmax(maxdiff, fabs(x1[3 * k + i] - l1[3 * k + i]));
            maxdiff = fmax(maxdiff, fabs(x2[3 * k + i] - l2[3 * k + i]));
        }
        /* capillary flux (bulb 1 -> bulb 2) and mean gradient */
        ck_assert_int_eq(mcd_film_solve(ws,
                                        &(mcd_film){.n_species = 3,
                                                    .c = c,
                                                    .L = DT_L,
                                                    .Dij = DT_D,
                                                    .x0 = x1 + 3 * k,
                                                    .xL = x2 + 3 * k},
                                        MCD_FILM_BOOT_EQUIMOLAR, 0, NULL,
                                        MCD_FILM_EXACT, N, NULL, NULL),
                         MCD_OK);
        for (int i = 0; i < 3; i++)
            grad[i] = (x2[3 * k + i] - x1[3 * k + i]) / DT_L;
        /* "nearly zero" = 1 % of the largest gradient or flux */
        ck_assert_int_eq(mcd_flux_diagnose(3, 1, grad, N, 0.01, flags), MCD_OK);
        if (k == 0) {
            ck_assert_uint_eq(flags[N2], MCD_DIAG_OSMOTIC);
            ck_assert(N[N2] > 0); /* N2 leaves the CO2 bulb */
        } else if (flags[N2] & MCD_DIAG_REVERSE) {
            ck_assert_int_le(phase, 1); /* never after normal diffusion */
            if (phase == 0)
                t_rev_start = t[k];
            phase = 1;
            t_rev_end = t[k];
        } else if (phase == 1 && N[N2] * grad[N2] < 0) {
            phase = 2; /* ordinary diffusion down the gradient */
        }
        if (k > 0 && prevN > 0 && N[N2] <= 0)
            t_barrier = t[k];
        if (flags[N2] & MCD_DIAG_BARRIER) {
            /* a barrier only between reverse and normal diffusion */
            ck_assert_int_ge(phase, 1);
            seen_barrier = 1;
        }
        ck_assert(!(phase == 2 && N[N2] > 0)); /* no second reversal */
        prevN = N[N2];
        /* H2 and CO2 always diffuse normally */
        ck_assert(!(flags[H2] & MCD_DIAG_REVERSE));
        ck_assert(!(flags[CO2] & MCD_DIAG_REVERSE));
    }
    printf("Duncan-Toor (integrated): osmotic at t = 0, reverse N2 "
           "diffusion from %.2f h to %.2f h, N2 flux changes sign near "
           "%.2f h; max |integrated - linearized| = %.2e\n",
           t_rev_start / 3600, t_rev_end / 3600, t_barrier / 3600, maxdiff);
    ck_assert_int_eq(phase, 2);
    ck_assert_int_eq(seen_barrier, 1);
    ck_assert(t_rev_start > 0 && t_rev_end > t_rev_start);
    ck_assert(t_barrier >= t_rev_end);
    /* qualitative agreement of the two theories: the compositions differ
     * by well under the N2 excursion (~0.07); measured ~3e-3 */
    ck_assert(maxdiff < 0.01);
    /* the excursion itself: N2 in bulb 1 falls below 0.45 (both models) */
    {
        double mn = 1.0, mnl = 1.0;
        for (int k = 0; k < NT - 1; k++) {
            mn = fmin(mn, x1[3 * k + N2]);
            mnl = fmin(mnl, l1[3 * k + N2]);
        }
        printf("Duncan-Toor: min x(N2) in bulb 1 = %.4f (integrated), "
               "%.4f (linearized)\n",
               mn, mnl);
        ck_assert(mn < 0.45 && mnl < 0.45);
    }
    /* final state: the volume-weighted mean; after 400 h (~25 time
     * constants) the remaining difference is ~1e-11: 1e-8 */
    for (int i = 0; i < 3; i++) {
        double mean = tot[i] / (DT_V1 + DT_V2);
        ck_assert_double_eq_tol(x1[3 * (NT - 1) + i], mean, 1e-8);
        ck_assert_double_eq_tol(x2[3 * (NT - 1) + i], mean, 1e-8);
        ck_assert_double_eq_tol(l1[3 * (NT - 1) + i], mean, 1e-8);
        ck_assert_double_eq_tol(l2[3 * (NT - 1) + i], mean, 1e-8);
    }
}
END_TEST

START_TEST(bulbs_binary_decays_exponentially)
{
    for (int trial = 0; trial < 10; trial++) {
        double D = 1e-5 + 5e-5 * sup_u01(&rng), Dm[4] = {0, D, D, 0};
        double V1 = 5e-5 + 1e-4 * sup_u01(&rng),
               V2 = 5e-5 + 1e-4 * sup_u01(&rng);
        double A = 1e-6 + 5e-6 * sup_u01(&rng), L = 0.02 + 0.1 * sup_u01(&rng),
               c = 40;
        double a1 = sup_u01(&rng), a2 = sup_u01(&rng);
        double x1_0[2] = {a1, 1 - a1}, x2_0[2] = {a2, 1 - a2};
        double beta = A * (V1 + V2) / (L * V1 * V2), t[6];
        double x1[12], x2[12], l1[12], l2[12];
        for (int k = 0; k < 6; k++)
            t[k] = k * 0.4 / (beta * D);
        ck_assert_int_eq(mcd_bulbs_integrate(ws,
                                             &(mcd_bulbs){.n_species = 2,
                                                          .c = c,
                                                          .V1 = V1,
                                                          .V2 = V2,
                                                          .A = A,
                                                          .L = L,
                                                          .Dij = Dm,
                                                          .x1_0 = x1_0,
                                                          .x2_0 = x2_0},
                                             6, t, 1e-10, x1, x2),
                         MCD_OK);
        ck_assert_int_eq(mcd_bulbs_linearized(ws,
                                              &(mcd_bulbs){.n_species = 2,
                                                           .c = c,
                                                           .V1 = V1,
                                                           .V2 = V2,
                                                           .A = A,
                                                           .L = L,
                                                           .Dij = Dm,
                                                           .x1_0 = x1_0,
                                                           .x2_0 = x2_0},
                                              6, t, l1, l2),
                         MCD_OK);
        for (int k = 0; k < 6; k++) {
            double d = (a1 - a2) * exp(-beta * D * t[k]);
            /* linearized theory is exact for a binary: round-off 1e-14 */
            ck_assert_double_eq_tol(l1[2 * k] - l2[2 * k], d, 1e-14);
            /* integration: local tolerance 1e-10 over ~50 steps: 1e-8 */
            ck_assert_double_eq_tol(x1[2 * k] - x2[2 * k], d, 1e-8);
        }
    }
}
END_TEST

START_TEST(bulbs_random_mixtures_conserve_and_equilibrate)
{
    double worst = 0.0;
    for (int trial = 0; trial < 12; trial++) {
        size_t n = 3 + (size_t)(trial % 4);
        double D[NMAX * NMAX], x1_0[NMAX], x2_0[NMAX], Dmin = 1;
        double x1[4 * NMAX], x2[4 * NMAX], l1[4 * NMAX], l2[4 * NMAX];
        double V1 = 1e-4, V2 = 2e-4 * sup_u01(&rng) + 2e-5, A = 3e-6, L = 0.05;
        double c = 40, beta = A * (V1 + V2) / (L * V1 * V2), t[4];
        sup_dij_log_uniform(&rng, n, D, 5e-6, 16.0);
        for (size_t i = 0; i < n; i++)
            for (size_t j = i + 1; j < n; j++)
                Dmin = fmin(Dmin, D[i * n + j]);
        sup_fractions(&rng, n, 0.0, x1_0);
        sup_fractions(&rng, n, 0.0, x2_0);
        x1_0[trial % n] = 0.0; /* one species absent from bulb 1 */
        {
            double s = 0;
            for (size_t i = 0; i < n; i++)
                s += x1_0[i];
            for (size_t i = 0; i < n; i++)
                x1_0[i] /= s;
        }
        t[0] = 0;
        t[1] = 0.3 / (beta * Dmin);
        t[2] = 2.0 / (beta * Dmin);
        t[3] = 40.0 / (beta * Dmin); /* ~e^-40 of the slowest mode */
        ck_assert_int_eq(mcd_bulbs_integrate(ws,
                                             &(mcd_bulbs){.n_species = n,
                                                          .c = c,
                                                          .V1 = V1,
                                                          .V2 = V2,
                                                          .A = A,
                                                          .L = L,
                                                          .Dij = D,
                                                          .x1_0 = x1_0,
                                                          .x2_0 = x2_0},
                                             4, t, 1e-8, x1, x2),
                         MCD_OK);
        ck_assert_int_eq(mcd_bulbs_linearized(ws,
                                              &(mcd_bulbs){.n_species = n,
                                                           .c = c,
                                                           .V1 = V1,
                                                           .V2 = V2,
                                                           .A = A,
                                                           .L = L,
                                                           .Dij = D,
                                                           .x1_0 = x1_0,
                                                           .x2_0 = x2_0},
                                              4, t, l1, l2),
                         MCD_OK);
        for (size_t i = 0; i < n; i++) {
            double tot = V1 * x1_0[i] + V2 * x2_0[i], mean = tot / (V1 + V2);
            for (int k = 0; k < 4; k++) {
                /* conservation to round-off: a few ulp */
                ck_assert_double_eq_tol(V1 * x1[k * n + i] + V2 * x2[k * n + i],
                                        tot, 4e-16 * (V1 + V2));
                ck_assert_double_eq_tol(V1 * l1[k * n + i] + V2 * l2[k * n + i],
                                        tot, 4e-16 * (V1 + V2));
                worst = fmax(worst, fabs(x1[k * n + i] - l1[k * n + i]));
            }
            /* t = 0 reproduces the start (renormalised input: 1e-15) */
            ck_assert_double_eq_tol(x1[i], x1_0[i], 1e-15);
            ck_assert_double_eq_tol(l2[i], x2_0[i], 1e-15);
            /* slowest eigenvalue >= Dmin/ (a few): 1e-6 is generous */
            ck_assert_double_eq_tol(x1[3 * n + i], mean, 1e-6);
            ck_assert_double_eq_tol(l1[3 * n + i], mean, 1e-6);
        }
    }
    printf("random cells: max |integrated - linearized| = %.2e\n", worst);
}
END_TEST

START_TEST(bulbs_work_at_full_workspace_capacity)
{
    /* n equal to the workspace capacity: same results as a larger one */
    for (size_t n = 2; n <= 5; n++) {
        mcd_workspace *w;
        double D[NMAX * NMAX], a[NMAX], b[NMAX], t[2] = {0, 3e4};
        double p1[2 * NMAX], p2[2 * NMAX], q1[2 * NMAX], q2[2 * NMAX];
        sup_dij_log_uniform(&rng, n, D, 5e-6, 16.0);
        sup_fractions(&rng, n, 0.1, a);
        sup_fractions(&rng, n, 0.1, b);
        ck_assert_int_eq(mcd_workspace_new(n, &w), MCD_OK);
        for (int lin = 0; lin < 2; lin++) {
            if (lin) {
                ck_assert_int_eq(
                    mcd_bulbs_linearized(w,
                                         &(mcd_bulbs){.n_species = n,
                                                      .c = 40,
                                                      .V1 = 1e-4,
                                                      .V2 = 1e-4,
                                                      .A = 3e-6,
                                                      .L = 0.05,
                                                      .Dij = D,
                                                      .x1_0 = a,
                                                      .x2_0 = b},
                                         2, t, p1, p2),
                    MCD_OK);
                ck_assert_int_eq(
                    mcd_bulbs_linearized(ws,
                                         &(mcd_bulbs){.n_species = n,
                                                      .c = 40,
                                                      .V1 = 1e-4,
                                                      .V2 = 1e-4,
                                                      .A = 3e-6,
                                                      .L = 0.05,
                                                      .Dij = D,
                                                      .x1_0 = a,
                                                      .x2_0 = b},
                                         2, t, q1, q2),
                    MCD_OK);
            } else {
                ck_assert_int_eq(
                    mcd_bulbs_integrate(w,
                                        &(mcd_bulbs){.n_species = n,
                                                     .c = 40,
                                                     .V1 = 1e-4,
                                                     .V2 = 1e-4,
                                                     .A = 3e-6,
                                                     .L = 0.05,
                                                     .Dij = D,
                                                     .x1_0 = a,
                                                     .x2_0 = b},
                                        2, t, 1e-8, p1, p2),
                    MCD_OK);
                ck_assert_int_eq(
                    mcd_bulbs_integrate(ws,
                                        &(mcd_bulbs){.n_species = n,
                                                     .c = 40,
                                                     .V1 = 1e-4,
                                                     .V2 = 1e-4,
                                                     .A = 3e-6,
                                                     .L = 0.05,
                                                     .Dij = D,
                                                     .x1_0 = a,
                                                     .x2_0 = b},
                                        2, t, 1e-8, q1, q2),
                    MCD_OK);
            }
            for (size_t i = 0; i < 2 * n; i++) {
                ck_assert_double_eq(p1[i], q1[i]);
                ck_assert_double_eq(p2[i], q2[i]);
            }
        }
        mcd_workspace_free(w);
    }
}
END_TEST

START_TEST(bulbs_errors_leave_outputs_untouched)
{
    double D[9], a[3] = {0.2, 0.3, 0.5}, b[3] = {0.6, 0.3, 0.1};
    double bad[3] = {0.2, 0.3, 0.6}, t[2] = {0, 100}, tdec[2] = {100, 50};
    double tneg[2] = {-1, 5}, o1[6], o2[6];
    mcd_workspace *small;
    memcpy(D, DT_D, sizeof D);
#define EXPECT2(call, code)                                                    \
    do {                                                                       \
        sup_guard_fill(o1, 6);                                                 \
        sup_guard_fill(o2, 6);                                                 \
        ck_assert_int_eq((call), (code));                                      \
        ck_assert(sup_guard_intact(o1, 6));                                    \
        ck_assert(sup_guard_intact(o2, 6));                                    \
    } while (0)
    for (int lin = 0; lin < 2; lin++) {
#define CALL(W, N_, DD, C_, V1_, V2_, A_, L_, X1, X2, T)                       \
    (lin ? mcd_bulbs_linearized(W,                                             \
                                &(mcd_bulbs){.n_species = N_,                  \
                                             .c = C_,                          \
                                             .V1 = V1_,                        \
                                             .V2 = V2_,                        \
                                             .A = A_,                          \
                                             .L = L_,                          \
                                             .Dij = DD,                        \
                                             .x1_0 = X1,                       \
                                             .x2_0 = X2},                      \
                                2, T, o1, o2)                                  \
         : mcd_bulbs_integrate(W,                                              \
                               &(mcd_bulbs){.n_species = N_,                   \
                                            .c = C_,                           \
                                            .V1 = V1_,                         \
                                            .V2 = V2_,                         \
                                            .A = A_,                           \
                                            .L = L_,                           \
                                            .Dij = DD,                         \
                                            .x1_0 = X1,                        \
                                            .x2_0 = X2},                       \
                               2, T, 1e-8, o1, o2))
        ck_assert_int_eq(mcd_workspace_new(3, &small), MCD_OK);
        EXPECT2(lin ? mcd_bulbs_linearized(small, NULL, 2, t, o1, o2)
                    : mcd_bulbs_integrate(small, NULL, 2, t, 1e-8, o1, o2),
                MCD_EINVAL);
        ck_assert_str_eq(mcd_last_error(), "argument bulbs: NULL");
        mcd_workspace_free(small);
        EXPECT2(CALL(NULL, 3, D, 40, 1e-4, 1e-4, 1e-6, 0.05, a, b, t),
                MCD_EINVAL);
        EXPECT2(CALL(ws, 1, D, 40, 1e-4, 1e-4, 1e-6, 0.05, a, b, t),
                MCD_EINVAL);
        EXPECT2(CALL(ws, 3, NULL, 40, 1e-4, 1e-4, 1e-6, 0.05, a, b, t),
                MCD_EINVAL);
        EXPECT2(CALL(ws, 3, D, SUP_NAN, 1e-4, 1e-4, 1e-6, 0.05, a, b, t),
                MCD_EINVAL);
        EXPECT2(CALL(ws, 3, D, 40, 0.0, 1e-4, 1e-6, 0.05, a, b, t), MCD_EDOM);
        EXPECT2(CALL(ws, 3, D, 40, 1e-4, -1e-4, 1e-6, 0.05, a, b, t), MCD_EDOM);
        EXPECT2(CALL(ws, 3, D, 40, 1e-4, 1e-4, 0.0, 0.05, a, b, t), MCD_EDOM);
        EXPECT2(CALL(ws, 3, D, 40, 1e-4, 1e-4, 1e-6, SUP_INF, a, b, t),
                MCD_EINVAL);
        EXPECT2(CALL(ws, 3, D, 40, 1e-4, 1e-4, 1e-6, 0.05, bad, b, t),
                MCD_EDOM);
        EXPECT2(CALL(ws, 3, D, 40, 1e-4, 1e-4, 1e-6, 0.05, a, NULL, t),
                MCD_EINVAL);
        EXPECT2(CALL(ws, 3, D, 40, 1e-4, 1e-4, 1e-6, 0.05, a, b, tneg),
                MCD_EDOM);
        EXPECT2(CALL(ws, 3, D, 40, 1e-4, 1e-4, 1e-6, 0.05, a, b, NULL),
                MCD_EINVAL);
        ck_assert_int_eq(mcd_workspace_new(2, &small), MCD_OK);
        EXPECT2(CALL(small, 3, D, 40, 1e-4, 1e-4, 1e-6, 0.05, a, b, t),
                MCD_EBADLEN);
        mcd_workspace_free(small);
#undef CALL
    }
    /* integration only: decreasing times, rel_tol out of range or NaN */
    EXPECT2(mcd_bulbs_integrate(ws,
                                &(mcd_bulbs){.n_species = 3,
                                             .c = 40,
                                             .V1 = 1e-4,
                                             .V2 = 1e-4,
                                             .A = 1e-6,
                                             .L = 0.05,
                                             .Dij = D,
                                             .x1_0 = a,
                                             .x2_0 = b},
                                2, tdec, 1e-8, o1, o2),
            MCD_EDOM);
    EXPECT2(mcd_bulbs_integrate(ws,
                                &(mcd_bulbs){.n_species = 3,
                                             .c = 40,
                                             .V1 = 1e-4,
                                             .V2 = 1e-4,
                                             .A = 1e-6,
                                             .L = 0.05,
                                             .Dij = D,
                                             .x1_0 = a,
                                             .x2_0 = b},
                                2, t, 0.5, o1, o2),
            MCD_EDOM);
    EXPECT2(mcd_bulbs_integrate(ws,
                                &(mcd_bulbs){.n_species = 3,
                                             .c = 40,
                                             .V1 = 1e-4,
                                             .V2 = 1e-4,
                                             .A = 1e-6,
                                             .L = 0.05,
                                             .Dij = D,
                                             .x1_0 = a,
                                             .x2_0 = b},
                                2, t, SUP_NAN, o1, o2),
            MCD_EINVAL);
    /* decreasing times are fine for the closed-form linearized theory */
    ck_assert_int_eq(mcd_bulbs_linearized(ws,
                                          &(mcd_bulbs){.n_species = 3,
                                                       .c = 40,
                                                       .V1 = 1e-4,
                                                       .V2 = 1e-4,
                                                       .A = 1e-6,
                                                       .L = 0.05,
                                                       .Dij = D,
                                                       .x1_0 = a,
                                                       .x2_0 = b},
                                          2, tdec, o1, o2),
                     MCD_OK);
    /* n_times = 0 writes nothing */
    EXPECT2(mcd_bulbs_integrate(ws,
                                &(mcd_bulbs){.n_species = 3,
                                             .c = 40,
                                             .V1 = 1e-4,
                                             .V2 = 1e-4,
                                             .A = 1e-6,
                                             .L = 0.05,
                                             .Dij = D,
                                             .x1_0 = a,
                                             .x2_0 = b},
                                0, t, 1e-8, o1, o2),
            MCD_OK);
#undef EXPECT2
}
END_TEST

static Suite *bulbs_suite(void)
{
    Suite *s = suite_create("mcd:bulbs");
    TCase *tc = tcase_create("bulbs");
    tcase_add_checked_fixture(tc, setup, teardown);
    tcase_set_timeout(tc, 120);
    tcase_add_test(tc, bulbs_duncan_toor_nitrogen_osmotic_reverse_then_normal);
    tcase_add_test(tc, bulbs_binary_decays_exponentially);
    tcase_add_test(tc, bulbs_random_mixtures_conserve_and_equilibrate);
    tcase_add_test(tc, bulbs_work_at_full_workspace_capacity);
    tcase_add_test(tc, bulbs_errors_leave_outputs_untouched);
    suite_add_tcase(s, tc);
    return s;
}

int main(void) { return sup_run(bulbs_suite()); }
