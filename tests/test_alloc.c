/* test_alloc.c - no heap allocation in any per-call API of the batched
 * flux layer (and the single-state flux call it is compared with), nor in
 * the liquid's per-state calls.
 *
 * On glibc the executable interposes malloc, calloc, realloc and
 * posix_memalign (forwarding to the __libc_* entry points: SUP_ALLOC_HOOK
 * in support.h, shared with test_flux_identities) and counts calls made
 * inside a window. A direct malloc inside the window proves the hook is
 * live (under AddressSanitizer it is not, and the test then only checks
 * that the calls succeed). A warm-up pass runs first so that one-time
 * initialisation of the BLAS is not counted. Common practice for such
 * checks; no outside data.
 */
#include <check.h>
#include <math.h>
#include <stdio.h>
#include <stdlib.h>

#include "mcdiff.h"

#define SUP_ALLOC_HOOK /* this program counts allocations */
#include "support.h"

#define KC 11
#define ND 3
#define NBIG 150 /* above the lane limit: one cell at a time */

static double Dsoa[NBIG * NBIG * KC], csoa[KC], xsoa[NBIG * KC];
static double gsoa[NBIG * ND * KC], lsoa[ND * KC], out[NBIG * ND * KC];
static double T[KC], P[KC], M[NBIG], Dcell[NBIG * NBIG], F[NBIG * ND];

START_TEST(alloc_batched_calls_do_not_allocate)
{
    mcd_db *db;
    mcd_mixture *mix;
    mcd_workspace *ws;
    const char *names[6] = {"nitrogen", "oxygen",  "carbon-dioxide",
                            "water",    "methane", "argon"};
    int st[64], ns = 0, pass, live;
    size_t n, i, j, k;
    double est, e2;
    size_t used;

    ck_assert_int_eq(mcd_db_new_builtin(&db), MCD_OK);
    ck_assert_int_eq(mcd_mixture_new(db, 6, names, MCD_GAS_FSG, &mix), MCD_OK);
    ck_assert_int_eq(mcd_mixture_set_method(mix, 0, 1, MCD_GAS_CHAPMAN_ENSKOG),
                     MCD_OK);
    ck_assert_int_eq(mcd_mixture_set_method(mix, 2, 4, MCD_GAS_WILKE_LEE),
                     MCD_OK);
    ck_assert_int_eq(mcd_workspace_new(NBIG, &ws), MCD_OK);
    for (k = 0; k < KC; k++) {
        T[k] = 300.0 + 50.0 * (double)k;
        P[k] = 1e5;
        csoa[k] = 40.0;
    }
    for (i = 0; i < NBIG; i++)
        M[i] = 0.002 + 0.001 * (double)(i % 40);

    for (pass = 0; pass < 2; pass++) { /* pass 0 warms up the BLAS */
        ns = 0;
        if (pass == 1)
            sup_alloc_open();
        for (n = 6; n <= NBIG; n += NBIG - 6) {
            for (k = 0; k < KC; k++) {
                for (i = 0; i < n; i++) {
                    xsoa[i * KC + k] = 1.0 / (double)n;
                    for (j = 0; j < ND; j++)
                        gsoa[(i * ND + j) * KC + k] =
                            (double)((i + j + k) % 3) - 1.0;
                    for (j = 0; j < n; j++)
                        Dsoa[(i * n + j) * KC + k] =
                            i == j ? 0.0 : 1e-5 * (1.0 + (double)((i + j) % 7));
                }
                for (j = 0; j < ND; j++)
                    lsoa[j * KC + k] = 0.1;
            }
            for (int model = 0; model < 3; model++) {
                st[ns++] = mcd_flux_batch_dij(
                    ws, (mcd_model)model, n, M, Dsoa, csoa,
                    &(mcd_cells){.n_cells = KC,
                                 .n_dim = ND,
                                 .comp_basis = MCD_BASIS_MASS,
                                 .comp = xsoa,
                                 .grad = gsoa,
                                 .grad_lnP = lsoa},
                    MCD_BASIS_MASS, out);
                if (n == 6) {
                    st[ns++] = mcd_flux_batch(
                        ws, mix, (mcd_model)model, T, P,
                        &(mcd_cells){.n_cells = KC,
                                     .n_dim = ND,
                                     .comp_basis = MCD_BASIS_MOLE,
                                     .comp = xsoa,
                                     .grad = gsoa,
                                     .grad_lnP = lsoa},
                        MCD_BASIS_MASS, out);
                    st[ns++] = mcd_flux_batch_aos(
                        ws, mix, (mcd_model)model, T, P,
                        &(mcd_cells){.n_cells = KC,
                                     .n_dim = ND,
                                     .comp_basis = MCD_BASIS_MOLE,
                                     .comp = xsoa,
                                     .grad = gsoa},
                        MCD_BASIS_MOLE, out);
                }
            }
            if (n > 24)
                continue; /* single-state LAPACK path: see test_flux_identities */
            for (i = 0; i < n * n; i++)
                Dcell[i] = Dsoa[i * KC];
            st[ns++] =
                mcd_flux_compute(ws, MCD_MODEL_MAXWELL_STEFAN,
                                 &(mcd_state){.n_species = n,
                                              .n_dim = ND,
                                              .M = M,
                                              .Dij = Dcell,
                                              .c = 40.0,
                                              .comp_basis = MCD_BASIS_MOLE,
                                              .comp = xsoa,
                                              .grad = gsoa},
                                 MCD_BASIS_MOLE, F);
        }
        st[ns++] = mcd_workspace_set_iterative(ws, 50, 1e-9);
        st[ns++] = mcd_workspace_iterative_outcome(ws, &est, &used);
        st[ns++] = mcd_workspace_set_threads(ws, 0);
        st[ns++] = mcd_mixture_temperature_fit(mix, NULL, NULL, &e2);
        if (pass == 1)
            break;
        for (i = 0; i < (size_t)ns; i++)
            ck_assert_msg(st[i] == MCD_OK, "call %zu: %d (%s)", i, st[i],
                          mcd_last_error());
    }
    live = sup_alloc_close();
    for (i = 0; i < (size_t)ns; i++)
        ck_assert_int_eq(st[i], MCD_OK);
    fprintf(stderr,
            "allocation hook %s; allocations in the window: %ld "
            "(the probe included) over %d calls\n",
            live ? "live" : "not live", (long)sup_alloc_count, ns);
    if (live)
        ck_assert_int_eq(sup_alloc_count, 1); /* the probe only */
    mcd_workspace_free(ws);
    mcd_mixture_free(mix);
    mcd_db_free(db);
}
END_TEST

/* The liquid's per-state calls (mcd_liquid_eval, _vle, _evaporation) and
 * its batched fluxes (mcd_liquid_flux_batch, 3 cells, mass fractions in,
 * mass fluxes relative to the volume-average velocity out: every path)
 * for every activity model: no allocation inside the window. */
START_TEST(alloc_liquid_calls_do_not_allocate)
{
    const mcd_activity_model models[4] = {MCD_ACTIVITY_IDEAL, MCD_ACTIVITY_NRTL,
                                          MCD_ACTIVITY_WILSON,
                                          MCD_ACTIVITY_UNIQUAC};
    const double cf[3] = {0.05, 40.0, 0.0};
    double x[4] = {0.4, 0.3, 0.2, 0.1}, lng[4], G[16], D[16], p[4];
    double Dg[25], xL[5] = {0, 0, 0, 0, 1}, Mg[5], y0[5], N[5], rate, lvl;
    /* 3 cells, SoA: mass fractions (summing to 1 per cell), gradients,
     * T, and volumes: ideal mixing, c = 1 / sum x_i V_i from the mole
     * fractions of the mass fractions with molar masses Mg */
    double wc[12] = {0.4, 0.25, 0.1, 0.3, 0.25, 0.2,
                     0.2, 0.25, 0.3, 0.1, 0.25, 0.4};
    double gc[12] = {1, 2, -1, -1, 0, 1, 0, -2, 0, 0, 0, 0},
           Tc[3] = {290, 300, 310};
    double Vc[12], cc[3], fl[12];
    mcd_liquid *liq[4];
    mcd_workspace *ws;
    int st[16], ns = 0, pass, live;
    unsigned w;
    ck_assert_int_eq(mcd_workspace_new(5, &ws), MCD_OK);
    for (size_t i = 0; i < 25; i++)
        Dg[i] = i % 6 == 0 ? 0.0 : 1.5e-5;
    for (size_t i = 0; i < 5; i++)
        Mg[i] = 0.02 + 0.01 * (double)i;
    for (size_t k = 0; k < 3; k++) {
        double xs[4], s = 0.0, v = 0.0;
        for (size_t i = 0; i < 4; i++)
            s += (xs[i] = wc[i * 3 + k] / Mg[i]);
        for (size_t i = 0; i < 4; i++) {
            Vc[i * 3 + k] = 5e-5 * (1.0 + 0.1 * (double)i);
            v += xs[i] / s * Vc[i * 3 + k];
        }
        cc[k] = 1.0 / v;
    }
    for (int m = 0; m < 4; m++) {
        ck_assert_int_eq(mcd_liquid_new(4, models[m], &liq[m]), MCD_OK);
        for (size_t i = 0; i < 4; i++) {
            mcd_liquid_set_species(liq[m], i, MCD_LIQ_MOLAR_VOLUME, 5e-5);
            mcd_liquid_set_species(liq[m], i, MCD_LIQ_UNIQUAC_R, 2.0);
            mcd_liquid_set_species(liq[m], i, MCD_LIQ_UNIQUAC_Q, 2.0);
            mcd_liquid_set_antoine(liq[m], i, 9.0, 1500.0, -50.0, 250.0, 400.0);
            for (size_t j = i + 1; j < 4; j++) {
                mcd_liquid_set_pair(liq[m], i, j, cf, cf, 0.3, 0, 0);
                mcd_liquid_set_dinf(liq[m], i, j, 1e-9, 2e-9);
            }
        }
    }
    for (pass = 0; pass < 2; pass++) {
        ns = 0;
        if (pass == 1)
            sup_alloc_open();
        for (int m = 0; m < 4; m++) {
            st[ns++] = mcd_liquid_eval(ws, liq[m], 300.0, x, lng, G, D, &w);
            st[ns++] = mcd_liquid_vle(ws, liq[m], 300.0, x, p, &w);
            st[ns++] = mcd_liquid_evaporation(
                ws, liq[m],
                &(mcd_film){
                    .n_species = 5, .c = 40.0, .L = 0.01, .Dij = Dg, .xL = xL},
                300.0, 1e5, x, Mg, 800.0, y0, N, &rate, &lvl, &w);
            st[ns++] = mcd_liquid_flux_batch(
                ws, liq[m], MCD_MODEL_MAXWELL_STEFAN, Tc, cc, Mg, Vc,
                &(mcd_cells){.n_cells = 3,
                             .n_dim = 1,
                             .comp_basis = MCD_BASIS_MASS,
                             .comp = wc,
                             .grad = gc},
                MCD_BASIS_MASS, fl, &w);
        }
        if (pass == 0)
            for (int i = 0; i < ns; i++)
                ck_assert_msg(st[i] == MCD_OK, "call %d: %s", i,
                              mcd_last_error());
    }
    live = sup_alloc_close();
    for (int i = 0; i < ns; i++)
        ck_assert_int_eq(st[i], MCD_OK);
    if (live)
        ck_assert_int_eq(sup_alloc_count, 1); /* the probe only */
    for (int m = 0; m < 4; m++)
        mcd_liquid_free(liq[m]);
    mcd_workspace_free(ws);
}
END_TEST

int main(void)
{
    Suite *s = suite_create("mcd:alloc");
    TCase *tc = tcase_create("alloc");
    tcase_set_timeout(tc, 120);
    tcase_add_test(tc, alloc_batched_calls_do_not_allocate);
    tcase_add_test(tc, alloc_liquid_calls_do_not_allocate);
    suite_add_tcase(s, tc);
    return sup_run(s);
}
