/* test_composition.c - mole/mass fractions, concentrations, gradients. */
#include <check.h>
#include <math.h>
#include <stdint.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

#include "mcdiff.h"
#include "support.h"

#define NMAX 30
#define N_STATES 4000

/* ---- deterministic PRNG (splitmix64), fixed seeds ------------------- */
static sup_rng rng = SUP_RNG(SUP_SPLITMIX64, 0);

/* Random state: n in 1..NMAX, molar masses log-uniform 2e-3..0.35 kg/mol
 * (hydrogen to heavy vapours), fractions with ~20 % exact zeros and 1 in 10
 * states a pure component; gradients summing to zero over species. */
static size_t random_state(double *M, double *x, double *gx, size_t n_dim)
{
    size_t n = 1 + (size_t)(sup_next(&rng) % NMAX);
    double s = 0.0;
    int pure = (sup_next(&rng) % 10) == 0;
    size_t ip = (size_t)(sup_next(&rng) % n);
    for (size_t i = 0; i < n; i++) {
        M[i] = sup_molar_mass(&rng);
        if (pure)
            x[i] = (i == ip) ? 1.0 : 0.0;
        else
            x[i] = (sup_next(&rng) % 5 == 0) ? 0.0 : sup_u01(&rng);
        s += x[i];
    }
    if (s == 0.0) {
        x[ip] = 1.0;
        s = 1.0;
    }
    for (size_t i = 0; i < n; i++)
        x[i] /= s;
    sup_gradients_zero_mean(&rng, n, n_dim, -1.0, 1.0, gx);
    return n;
}

/* ---- round trips over random states ---------------------------------- */

START_TEST(composition_x_w_x_round_trip)
{
    double M[NMAX], x[NMAX], g[NMAX * 3], w[NMAX], x2[NMAX], worst = 0.0;
    sup_seed(&rng, 1001);
    for (int k = 0; k < N_STATES; k++) {
        size_t n = random_state(M, x, g, 1);
        double sw = 0.0;
        ck_assert_int_eq(mcd_comp_x_to_w(n, M, x, w), MCD_OK);
        ck_assert_int_eq(mcd_comp_w_to_x(n, M, w, x2), MCD_OK);
        for (size_t i = 0; i < n; i++) {
            sw += w[i];
            ck_assert(w[i] >= 0.0);
            /* a zero mole fraction gives an exactly zero mass fraction */
            if (x[i] == 0.0)
                ck_assert(w[i] == 0.0 && x2[i] == 0.0);
            if (fabs(x2[i] - x[i]) > worst)
                worst = fabs(x2[i] - x[i]);
        }
        /* Fractions are <= 1; a sum over <= 30 terms of two divisions and
         * products each loses < 100 eps ~ 2e-14. */
        ck_assert_double_eq_tol(sw, 1.0, 1e-13);
    }
    fprintf(stderr, "x->w->x worst abs error %.3g\n", worst);
    /* required accuracy of the round trip (absolute, fractions <= 1) */
    ck_assert_double_le(worst, 1e-12);
}
END_TEST

START_TEST(composition_x_c_x_round_trip)
{
    double M[NMAX], x[NMAX], g[NMAX], c[NMAX], x2[NMAX], ct, worst = 0.0;
    sup_seed(&rng, 1002);
    for (int k = 0; k < N_STATES; k++) {
        size_t n = random_state(M, x, g, 1);
        /* c over 1e-3..1e5 mol/m^3: rarefied gas to dense liquid */
        double c_tot = 1e-3 * pow(10.0, 8.0 * sup_u01(&rng));
        ck_assert_int_eq(mcd_comp_x_to_c(n, c_tot, x, c), MCD_OK);
        ck_assert_int_eq(mcd_comp_c_to_x(n, c, x2, &ct), MCD_OK);
        /* relative round-off of a <= 30-term sum: < 1e-14 */
        ck_assert_double_eq_tol(ct / c_tot, 1.0, 1e-13);
        for (size_t i = 0; i < n; i++)
            if (fabs(x2[i] - x[i]) > worst)
                worst = fabs(x2[i] - x[i]);
    }
    fprintf(stderr, "x->c->x worst abs error %.3g\n", worst);
    ck_assert_double_le(worst, 1e-12);
}
END_TEST

START_TEST(composition_gradient_round_trip)
{
    double M[NMAX], x[NMAX], gx[NMAX * 3], w[NMAX], gw[NMAX * 3], gx2[NMAX * 3],
        worst = 0.0, worst_sum = 0.0;
    sup_seed(&rng, 1003);
    for (int k = 0; k < N_STATES; k++) {
        size_t n_dim = 1 + (size_t)(sup_next(&rng) % 3);
        size_t n = random_state(M, x, gx, n_dim);
        double gscale = 0.0;
        for (size_t i = 0; i < n * n_dim; i++)
            if (fabs(gx[i]) > gscale)
                gscale = fabs(gx[i]);
        ck_assert_int_eq(mcd_comp_x_to_w(n, M, x, w), MCD_OK);
        ck_assert_int_eq(mcd_comp_grad_x_to_w(n, n_dim, M, x, gx, gw), MCD_OK);
        ck_assert_int_eq(mcd_comp_grad_w_to_x(n, n_dim, M, w, gw, gx2), MCD_OK);
        for (size_t d = 0; d < n_dim; d++) {
            double s = 0.0, sabs = 0.0;
            for (size_t i = 0; i < n; i++) {
                double e = fabs(gx2[i * n_dim + d] - gx[i * n_dim + d]);
                if (gscale > 0.0 && e / gscale > worst)
                    worst = e / gscale;
                s += gw[i * n_dim + d];
                sabs += fabs(gw[i * n_dim + d]);
            }
            if (sabs > 0.0 && fabs(s) / sabs > worst_sum)
                worst_sum = fabs(s) / sabs;
        }
    }
    fprintf(stderr, "grad x->w->x worst rel error %.3g, sum grad w %.3g\n",
            worst, worst_sum);
    /* errors relative to the largest gradient entry of the state */
    ck_assert_double_le(worst, 1e-12);
    /* grad w sums to zero: round-off of a <= 30-term sum */
    ck_assert_double_le(worst_sum, 1e-13);
}
END_TEST

/* The gradient conversion is the exact differential: compare with a
 * central finite difference of x -> w along a random zero-sum direction. */
START_TEST(composition_gradient_matches_finite_difference)
{
    double M[NMAX], x[NMAX], gx[NMAX], gw[NMAX], xp[NMAX], xm[NMAX], wp[NMAX],
        wm[NMAX];
    sup_seed(&rng, 1004);
    for (int k = 0; k < 500; k++) {
        size_t n = random_state(M, x, gx, 1);
        int ok = 1;
        double h = 1e-5;
        /* keep x +- h gx non-negative: scale the step */
        for (size_t i = 0; i < n; i++)
            if (gx[i] != 0.0 && x[i] < h * fabs(gx[i]))
                ok = 0;
        if (!ok)
            continue;
        for (size_t i = 0; i < n; i++) {
            xp[i] = x[i] + h * gx[i];
            xm[i] = x[i] - h * gx[i];
        }
        ck_assert_int_eq(mcd_comp_grad_x_to_w(n, 1, M, x, gx, gw), MCD_OK);
        ck_assert_int_eq(mcd_comp_x_to_w(n, M, xp, wp), MCD_OK);
        ck_assert_int_eq(mcd_comp_x_to_w(n, M, xm, wm), MCD_OK);
        for (size_t i = 0; i < n; i++) {
            double fd = (wp[i] - wm[i]) / (2.0 * h);
            /* central difference: truncation O(h^2 |w'''|) with |w'''| up
             * to ~(M_max/M_min)^2 ~ 3e4, plus round-off eps/h ~ 1e-11 */
            ck_assert_double_eq_tol(gw[i], fd, 1e-5 * (1.0 + fabs(fd)));
        }
    }
}
END_TEST

/* Gradients whose rows do not sum to zero: only the part that changes the
 * normalised composition matters (the map is homogeneous of degree 0). */
START_TEST(composition_gradient_ignores_normalisation_direction)
{
    double M[NMAX], x[NMAX], gx[NMAX], gx_shift[NMAX], gw[NMAX], gw2[NMAX];
    sup_seed(&rng, 1005);
    for (int k = 0; k < 1000; k++) {
        size_t n = random_state(M, x, gx, 1);
        double a = sup_range(&rng, -3.0, 3.0), scale = 0.0;
        for (size_t i = 0; i < n; i++) {
            gx_shift[i] = gx[i] + a * x[i]; /* adds d(sum x) along x */
            if (fabs(gx[i]) > scale)
                scale = fabs(gx[i]);
        }
        ck_assert_int_eq(mcd_comp_grad_x_to_w(n, 1, M, x, gx, gw), MCD_OK);
        ck_assert_int_eq(mcd_comp_grad_x_to_w(n, 1, M, x, gx_shift, gw2),
                         MCD_OK);
        for (size_t i = 0; i < n; i++)
            /* cancellation of a*x_i terms of size <= 3: ~1e-15 each */
            ck_assert_double_eq_tol(gw[i], gw2[i], 1e-13 * (1.0 + scale));
    }
}
END_TEST

START_TEST(composition_mean_molar_mass_both_ways_agree)
{
    double M[NMAX], x[NMAX], g[NMAX], w[NMAX], mx, mw, worst = 0.0;
    sup_seed(&rng, 1006);
    for (int k = 0; k < N_STATES; k++) {
        size_t n = random_state(M, x, g, 1);
        double mmin = 1.0, mmax = 0.0;
        ck_assert_int_eq(mcd_comp_x_to_w(n, M, x, w), MCD_OK);
        ck_assert_int_eq(mcd_comp_mean_molar_mass_x(n, M, x, &mx), MCD_OK);
        ck_assert_int_eq(mcd_comp_mean_molar_mass_w(n, M, w, &mw), MCD_OK);
        for (size_t i = 0; i < n; i++)
            if (x[i] > 0.0) {
                if (M[i] < mmin)
                    mmin = M[i];
                if (M[i] > mmax)
                    mmax = M[i];
            }
        /* a mean lies between the extremes of the species present */
        ck_assert(mx >= mmin * (1 - 1e-14) && mx <= mmax * (1 + 1e-14));
        if (fabs(mw / mx - 1.0) > worst)
            worst = fabs(mw / mx - 1.0);
    }
    fprintf(stderr, "Mbar x vs w worst rel diff %.3g\n", worst);
    ck_assert_double_le(worst, 1e-13); /* two <= 30-term sums */
}
END_TEST

/* Dry air at sea level: major constituents of the U.S. Standard Atmosphere
 * 1976 (NOAA/NASA/USAF), mole fractions N2 0.78084, O2 0.209476, Ar
 * 0.00934, CO2 0.000314 and its sea-level mean molar mass 28.9644 kg/kmol
 * (from memory). The four species cover 0.99997 of the gas; renormalised
 * they give Mbar within 2e-5 of the tabulated value (the trace gases left
 * out, Ne and He mostly, shift it by less than that). Molar masses of N2,
 * O2, Ar, CO2 from the standard atomic weights (IUPAC; from memory). */
START_TEST(composition_dry_air_mean_molar_mass)
{
    const double M[4] = {28.0134e-3, 31.9988e-3, 39.948e-3, 44.0095e-3};
    double x[4] = {0.78084, 0.209476, 0.00934, 0.000314}, xn[4], w[4], mx, mw;
    double s = x[0] + x[1] + x[2] + x[3];
    /* 3e-5 short of 1: more than MCD_SUM_TOL, the library must refuse */
    ck_assert_int_eq(mcd_comp_mean_molar_mass_x(4, M, x, &mx), MCD_EDOM);
    for (int i = 0; i < 4; i++)
        xn[i] = x[i] / s;
    ck_assert_int_eq(mcd_comp_mean_molar_mass_x(4, M, xn, &mx), MCD_OK);
    ck_assert_double_eq_tol(mx / 28.9644e-3, 1.0, 5e-5);
    ck_assert_int_eq(mcd_comp_x_to_w(4, M, xn, w), MCD_OK);
    ck_assert_int_eq(mcd_comp_mean_molar_mass_w(4, M, w, &mw), MCD_OK);
    ck_assert_double_eq_tol(mw / mx, 1.0, 1e-14);
    /* oxygen is about 23.1 % of air by mass (common practice) */
    ck_assert_double_eq_tol(w[1], 0.2314, 5e-4);
}
END_TEST

/* Molar volume of an ideal gas at 273.15 K and 101325 Pa is 22.414 L/mol,
 * so c = 1/22.414e-3 = 44.615 mol/m^3 (common practice; CODATA lists
 * 22.413 969 54 L/mol, from memory). 22.414 has 5 significant digits:
 * tolerance 3e-5 relative. */
START_TEST(composition_ideal_gas_at_stp)
{
    double c = 0.0;
    ck_assert_int_eq(mcd_comp_ideal_gas_c(273.15, MCD_ATM, &c), MCD_OK);
    ck_assert_double_eq_tol(c / (1.0 / 22.414e-3), 1.0, 3e-5);
    ck_assert_double_eq_tol(c, 44.615, 44.615 * 3e-5);
    /* scales as P / T */
    {
        double c2 = 0.0;
        ck_assert_int_eq(mcd_comp_ideal_gas_c(2.0 * 273.15, 3.0 * MCD_ATM, &c2),
                         MCD_OK);
        ck_assert_double_eq_tol(c2 / c, 1.5, 1e-15);
    }
}
END_TEST

START_TEST(composition_renormalises_within_tolerance)
{
    /* sum = 1 + 9e-7, inside MCD_SUM_TOL = 1e-6 */
    double y[3] = {0.2, 0.3, 0.5 + 9e-7}, out[3], s;
    ck_assert_int_eq(mcd_comp_normalize(3, y, out), MCD_OK);
    s = out[0] + out[1] + out[2];
    ck_assert_double_eq_tol(s, 1.0, 4e-16); /* one rounding per term */
    ck_assert_double_eq_tol(out[0], 0.2 / (1.0 + 9e-7), 1e-16);
    /* in place is allowed */
    ck_assert_int_eq(mcd_comp_normalize(3, y, y), MCD_OK);
    ck_assert(y[0] == out[0] && y[1] == out[1] && y[2] == out[2]);
    /* below: sum = 1 - 9e-7 */
    {
        double z[2] = {0.5, 0.5 - 9e-7}, o[2];
        ck_assert_int_eq(mcd_comp_normalize(2, z, o), MCD_OK);
        ck_assert_double_eq_tol(o[0] + o[1], 1.0, 4e-16);
    }
    /* the conversions renormalise too: unnormalised x gives the same w */
    {
        const double M[3] = {2e-3, 28e-3, 44e-3};
        double xa[3] = {0.2, 0.3, 0.5}, xb[3], wa[3], wb[3];
        for (int i = 0; i < 3; i++)
            xb[i] = xa[i] * (1.0 + 8e-7);
        ck_assert_int_eq(mcd_comp_x_to_w(3, M, xa, wa), MCD_OK);
        ck_assert_int_eq(mcd_comp_x_to_w(3, M, xb, wb), MCD_OK);
        for (int i = 0; i < 3; i++)
            ck_assert_double_eq_tol(wa[i], wb[i], 1e-15);
    }
}
END_TEST

START_TEST(composition_rejects_sum_beyond_tolerance)
{
    double y[3] = {0.2, 0.3, 0.5 + 2e-6}, out[3];
    sup_guard_fill(out, 3);
    ck_assert_int_eq(mcd_comp_normalize(3, y, out), MCD_EDOM);
    ck_assert(sup_guard_intact(out, 3));
    y[2] = 0.5 - 2e-6;
    ck_assert_int_eq(mcd_comp_normalize(3, y, out), MCD_EDOM);
    ck_assert(sup_guard_intact(out, 3));
    /* in-place call that fails leaves the input untouched */
    ck_assert_int_eq(mcd_comp_normalize(3, y, y), MCD_EDOM);
    ck_assert(y[2] == 0.5 - 2e-6);
}
END_TEST

/* Every error path of every call, outputs untouched. */
START_TEST(composition_error_paths_leave_outputs_untouched)
{
    const double M[3] = {2e-3, 28e-3, 44e-3};
    const double x[3] = {0.2, 0.3, 0.5};
    const double g[6] = {0.1, -0.2, 0.3, 0.0, -0.4, 0.2};
    double out[6], o1;
    double bad[3];
    double Mb[3];
    const double nan = SUP_NAN, inf = SUP_INF;

#define EXPECT(call, code)                                                     \
    do {                                                                       \
        sup_guard_fill(out, 6);                                                \
        o1 = SUP_GUARD;                                                        \
        ck_assert_int_eq((call), (code));                                      \
        ck_assert(sup_guard_intact(out, 6));                                   \
        ck_assert(o1 == SUP_GUARD);                                            \
    } while (0)

    /* normalize */
    EXPECT(mcd_comp_normalize(3, NULL, out), MCD_EINVAL);
    EXPECT(mcd_comp_normalize(3, x, NULL), MCD_EINVAL);
    EXPECT(mcd_comp_normalize(0, x, out), MCD_EINVAL);
    EXPECT(mcd_comp_normalize(MCD_MAX_SPECIES + 1, x, out), MCD_EINVAL);
    memcpy(bad, x, sizeof bad);
    bad[1] = nan;
    EXPECT(mcd_comp_normalize(3, bad, out), MCD_EINVAL);
    bad[1] = inf;
    EXPECT(mcd_comp_normalize(3, bad, out), MCD_EINVAL);
    bad[1] = -inf;
    EXPECT(mcd_comp_normalize(3, bad, out), MCD_EINVAL);
    bad[1] = -0.1;
    bad[2] = 0.9;
    EXPECT(mcd_comp_normalize(3, bad, out), MCD_EDOM);
    /* NaN anywhere wins over a negative entry elsewhere */
    bad[2] = nan;
    EXPECT(mcd_comp_normalize(3, bad, out), MCD_EINVAL);

    /* x_to_w, w_to_x, mean molar masses: shared validation */
    memcpy(Mb, M, sizeof Mb);
    EXPECT(mcd_comp_x_to_w(3, NULL, x, out), MCD_EINVAL);
    EXPECT(mcd_comp_x_to_w(3, M, NULL, out), MCD_EINVAL);
    EXPECT(mcd_comp_x_to_w(3, M, x, NULL), MCD_EINVAL);
    EXPECT(mcd_comp_x_to_w(0, M, x, out), MCD_EINVAL);
    Mb[0] = nan;
    EXPECT(mcd_comp_x_to_w(3, Mb, x, out), MCD_EINVAL);
    EXPECT(mcd_comp_w_to_x(3, Mb, x, out), MCD_EINVAL);
    EXPECT(mcd_comp_mean_molar_mass_x(3, Mb, x, &o1), MCD_EINVAL);
    EXPECT(mcd_comp_mean_molar_mass_w(3, Mb, x, &o1), MCD_EINVAL);
    Mb[0] = 0.0;
    EXPECT(mcd_comp_x_to_w(3, Mb, x, out), MCD_EDOM);
    EXPECT(mcd_comp_w_to_x(3, Mb, x, out), MCD_EDOM);
    EXPECT(mcd_comp_mean_molar_mass_x(3, Mb, x, &o1), MCD_EDOM);
    EXPECT(mcd_comp_mean_molar_mass_w(3, Mb, x, &o1), MCD_EDOM);
    Mb[0] = -2e-3;
    EXPECT(mcd_comp_x_to_w(3, Mb, x, out), MCD_EDOM);
    memcpy(bad, x, sizeof bad);
    bad[0] = -1e-3;
    bad[1] = 0.301;
    EXPECT(mcd_comp_x_to_w(3, M, bad, out), MCD_EDOM);
    EXPECT(mcd_comp_w_to_x(3, M, bad, out), MCD_EDOM);
    EXPECT(mcd_comp_mean_molar_mass_x(3, M, bad, &o1), MCD_EDOM);
    EXPECT(mcd_comp_mean_molar_mass_w(3, M, bad, &o1), MCD_EDOM);
    memcpy(bad, x, sizeof bad);
    bad[0] = 0.25;
    EXPECT(mcd_comp_w_to_x(3, M, bad, out), MCD_EDOM);
    bad[0] = nan;
    EXPECT(mcd_comp_w_to_x(3, M, bad, out), MCD_EINVAL);
    EXPECT(mcd_comp_mean_molar_mass_w(3, M, NULL, &o1), MCD_EINVAL);
    EXPECT(mcd_comp_mean_molar_mass_w(3, M, x, NULL), MCD_EINVAL);
    EXPECT(mcd_comp_mean_molar_mass_x(3, M, x, NULL), MCD_EINVAL);

    /* x_to_c */
    EXPECT(mcd_comp_x_to_c(3, 40.0, x, NULL), MCD_EINVAL);
    EXPECT(mcd_comp_x_to_c(3, 40.0, NULL, out), MCD_EINVAL);
    EXPECT(mcd_comp_x_to_c(3, nan, x, out), MCD_EINVAL);
    EXPECT(mcd_comp_x_to_c(3, inf, x, out), MCD_EINVAL);
    EXPECT(mcd_comp_x_to_c(3, 0.0, x, out), MCD_EDOM);
    EXPECT(mcd_comp_x_to_c(3, -1.0, x, out), MCD_EDOM);
    memcpy(bad, x, sizeof bad);
    bad[2] = 0.6;
    EXPECT(mcd_comp_x_to_c(3, 40.0, bad, out), MCD_EDOM);

    /* c_to_x */
    {
        double c[3] = {1.0, 2.0, 3.0};
        EXPECT(mcd_comp_c_to_x(3, NULL, out, &o1), MCD_EINVAL);
        EXPECT(mcd_comp_c_to_x(3, c, NULL, &o1), MCD_EINVAL);
        EXPECT(mcd_comp_c_to_x(3, c, out, NULL), MCD_EINVAL);
        EXPECT(mcd_comp_c_to_x(0, c, out, &o1), MCD_EINVAL);
        c[1] = nan;
        EXPECT(mcd_comp_c_to_x(3, c, out, &o1), MCD_EINVAL);
        c[1] = -2.0;
        EXPECT(mcd_comp_c_to_x(3, c, out, &o1), MCD_EDOM);
        c[0] = c[1] = c[2] = 0.0;
        EXPECT(mcd_comp_c_to_x(3, c, out, &o1), MCD_EDOM);
        c[0] = c[1] = c[2] = 1e308; /* total overflows */
        EXPECT(mcd_comp_c_to_x(3, c, out, &o1), MCD_EDOM);
    }

    /* ideal gas */
    EXPECT(mcd_comp_ideal_gas_c(300.0, 1e5, NULL), MCD_EINVAL);
    EXPECT(mcd_comp_ideal_gas_c(nan, 1e5, &o1), MCD_EINVAL);
    EXPECT(mcd_comp_ideal_gas_c(300.0, inf, &o1), MCD_EINVAL);
    EXPECT(mcd_comp_ideal_gas_c(0.0, 1e5, &o1), MCD_EDOM);
    EXPECT(mcd_comp_ideal_gas_c(-300.0, 1e5, &o1), MCD_EDOM);
    EXPECT(mcd_comp_ideal_gas_c(300.0, 0.0, &o1), MCD_EDOM);
    EXPECT(mcd_comp_ideal_gas_c(300.0, -1.0, &o1), MCD_EDOM);
    EXPECT(mcd_comp_ideal_gas_c(1e-320, 1e300, &o1), MCD_EDOM); /* overflow */

    /* gradient conversions */
    {
        double gb[6];
        memcpy(gb, g, sizeof gb);
        EXPECT(mcd_comp_grad_x_to_w(3, 2, M, x, g, NULL), MCD_EINVAL);
        EXPECT(mcd_comp_grad_x_to_w(3, 2, M, x, NULL, out), MCD_EINVAL);
        EXPECT(mcd_comp_grad_x_to_w(3, 2, NULL, x, g, out), MCD_EINVAL);
        EXPECT(mcd_comp_grad_x_to_w(3, 2, M, NULL, g, out), MCD_EINVAL);
        EXPECT(mcd_comp_grad_x_to_w(3, 0, M, x, g, out), MCD_EINVAL);
        EXPECT(mcd_comp_grad_x_to_w(3, 4, M, x, g, out), MCD_EINVAL);
        EXPECT(mcd_comp_grad_x_to_w(0, 2, M, x, g, out), MCD_EINVAL);
        EXPECT(mcd_comp_grad_w_to_x(3, 0, M, x, g, out), MCD_EINVAL);
        EXPECT(mcd_comp_grad_w_to_x(3, 2, M, x, NULL, out), MCD_EINVAL);
        gb[5] = nan;
        EXPECT(mcd_comp_grad_x_to_w(3, 2, M, x, gb, out), MCD_EINVAL);
        EXPECT(mcd_comp_grad_w_to_x(3, 2, M, x, gb, out), MCD_EINVAL);
        gb[5] = inf;
        EXPECT(mcd_comp_grad_x_to_w(3, 2, M, x, gb, out), MCD_EINVAL);
        Mb[0] = 0.0;
        EXPECT(mcd_comp_grad_x_to_w(3, 2, Mb, x, g, out), MCD_EDOM);
        EXPECT(mcd_comp_grad_w_to_x(3, 2, Mb, x, g, out), MCD_EDOM);
        memcpy(bad, x, sizeof bad);
        bad[0] = 0.3;
        EXPECT(mcd_comp_grad_x_to_w(3, 2, M, bad, g, out), MCD_EDOM);
        EXPECT(mcd_comp_grad_w_to_x(3, 2, M, bad, g, out), MCD_EDOM);
    }
#undef EXPECT
}
END_TEST

START_TEST(composition_accepts_limits)
{
    /* n = 1 (pure) and n = MCD_MAX_SPECIES are valid sizes */
    static double y[MCD_MAX_SPECIES], out[MCD_MAX_SPECIES];
    double one = 1.0, o = 0.0, M1 = 0.018, w1 = 0.0;
    for (size_t i = 0; i < MCD_MAX_SPECIES; i++)
        y[i] = 1.0 / MCD_MAX_SPECIES;
    ck_assert_int_eq(mcd_comp_normalize(MCD_MAX_SPECIES, y, out), MCD_OK);
    ck_assert_int_eq(mcd_comp_normalize(1, &one, &o), MCD_OK);
    ck_assert(o == 1.0);
    ck_assert_int_eq(mcd_comp_x_to_w(1, &M1, &one, &w1), MCD_OK);
    ck_assert(w1 == 1.0);
    /* -0.0 is not negative */
    {
        double z[2] = {-0.0, 1.0}, oz[2];
        ck_assert_int_eq(mcd_comp_normalize(2, z, oz), MCD_OK);
    }
}
END_TEST

int main(void)
{
    Suite *s = suite_create("mcd:composition");
    TCase *tc = tcase_create("round_trips");
    tcase_add_test(tc, composition_x_w_x_round_trip);
    tcase_add_test(tc, composition_x_c_x_round_trip);
    tcase_add_test(tc, composition_gradient_round_trip);
    tcase_add_test(tc, composition_gradient_matches_finite_difference);
    tcase_add_test(tc, composition_gradient_ignores_normalisation_direction);
    tcase_add_test(tc, composition_mean_molar_mass_both_ways_agree);
    suite_add_tcase(s, tc);
    tc = tcase_create("reference_values");
    tcase_add_test(tc, composition_dry_air_mean_molar_mass);
    tcase_add_test(tc, composition_ideal_gas_at_stp);
    suite_add_tcase(s, tc);
    tc = tcase_create("validation");
    tcase_add_test(tc, composition_renormalises_within_tolerance);
    tcase_add_test(tc, composition_rejects_sum_beyond_tolerance);
    tcase_add_test(tc, composition_error_paths_leave_outputs_untouched);
    tcase_add_test(tc, composition_accepts_limits);
    suite_add_tcase(s, tc);

    return sup_run(s);
}
