/* test_frames.c - bases, reference frames, total fluxes, zero-sum projection.
 *
 * Every check builds a state from species velocities v_i and computes the
 * fluxes directly from their definitions (J_i = c_i (v_i - u), j_i = rho_i
 * (v_i - v), J^V_i = c_i (v_i - v^V), J^k_i = c_i (v_i - v_k), N_i = c_i v_i),
 * independently of the library's formulas, then compares.
 * Tolerances: every flux here is a short sum (<= 30 terms) of products of
 * O(1) factors, so its round-off is at most a few hundred eps relative to the
 * largest flux of the state; 1e-12 relative to that scale leaves a margin of
 * ~20 and still catches any wrong term (which would be O(1)).
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

#define NMAX 30
#define DMAX 3
#define N_STATES 3000
#define TOL 1e-12

static sup_rng rng = SUP_RNG(SUP_SPLITMIX64, 0);
static double floor_scale; /* see relerr */

/* A random mixture and species velocities, with all derived quantities
 * computed from the definitions. */
typedef struct state {
    size_t n, nd;
    double c, rho, Mbar;
    double M[NMAX], x[NMAX], w[NMAX];
    double v[NMAX * DMAX];    /* species velocities [m/s] */
    double u[DMAX], vm[DMAX]; /* molar and mass averages */
} state;

static void averages(state *s)
{
    for (size_t d = 0; d < s->nd; d++) {
        s->u[d] = 0.0;
        s->vm[d] = 0.0;
        for (size_t i = 0; i < s->n; i++) {
            s->u[d] += s->x[i] * s->v[i * s->nd + d];
            s->vm[d] += s->w[i] * s->v[i * s->nd + d];
        }
    }
}

static void random_state(state *s, size_t nmin)
{
    double sx = 0.0;
    s->n = nmin + (size_t)(sup_next(&rng) % (NMAX - nmin + 1));
    s->nd = 1 + (size_t)(sup_next(&rng) % DMAX);
    s->c = 0.1 * pow(10.0, 5.0 * sup_u01(&rng)); /* 0.1 .. 1e4 mol/m^3 */
    for (size_t i = 0; i < s->n; i++) {
        s->M[i] = sup_molar_mass(&rng);
        s->x[i] = (sup_next(&rng) % 6 == 0) ? 0.0 : sup_u01(&rng);
        sx += s->x[i];
        for (size_t d = 0; d < s->nd; d++)
            s->v[i * s->nd + d] = sup_range(&rng, -1.0, 1.0);
    }
    if (sx == 0.0) {
        s->x[0] = 1.0;
        sx = 1.0;
    }
    s->Mbar = 0.0;
    for (size_t i = 0; i < s->n; i++) {
        s->x[i] /= sx;
        s->Mbar += s->x[i] * s->M[i];
    }
    for (size_t i = 0; i < s->n; i++)
        s->w[i] = s->x[i] * s->M[i] / s->Mbar;
    s->rho = s->c * s->Mbar;
    floor_scale = s->c; /* molar fluxes; mass-flux checks set rho */
    averages(s);
}

/* J_i = c_i (v_i - ref) for a reference velocity ref (n_dim). */
static void molar_flux(const state *s, const double *ref, double *J)
{
    for (size_t i = 0; i < s->n; i++)
        for (size_t d = 0; d < s->nd; d++)
            J[i * s->nd + d] = s->c * s->x[i] * (s->v[i * s->nd + d] - ref[d]);
}
/* j_i = rho_i (v_i - ref) */
static void mass_flux(const state *s, const double *ref, double *j)
{
    for (size_t i = 0; i < s->n; i++)
        for (size_t d = 0; d < s->nd; d++)
            j[i * s->nd + d] =
                s->rho * s->w[i] * (s->v[i * s->nd + d] - ref[d]);
}

/* Largest |a - b| relative to the flux scale of the state: the largest
 * |b|, but at least `floor` (c or rho times a velocity of 1 m/s), so that a
 * reference that is zero up to round-off (one species, or velocities shifted
 * to a zero average) is not compared relatively with its own round-off. */
static double relerr(const double *a, const double *b, size_t m)
{
    double e = 0.0, sc = sup_max_abs(b, m);
    if (sc < floor_scale)
        sc = floor_scale;
    for (size_t i = 0; i < m; i++)
        if (fabs(a[i] - b[i]) > e)
            e = fabs(a[i] - b[i]);
    return sc > 0.0 ? e / sc : e;
}
/* largest |sum over species| relative to the largest entry */
static double sumerr(const double *a, size_t n, size_t nd)
{
    double e = 0.0, sc = sup_max_abs(a, n * nd);
    for (size_t d = 0; d < nd; d++) {
        double s = 0.0;
        for (size_t i = 0; i < n; i++)
            s += a[i * nd + d];
        if (fabs(s) > e)
            e = fabs(s);
    }
    return sc > 0.0 ? e / sc : e;
}

/* ---------------------------------------------------------------- */

START_TEST(frames_mass_flux_from_molar_matches_definition)
{
    state s;
    double J[NMAX * DMAX], j[NMAX * DMAX], jc[NMAX * DMAX], Jc[NMAX * DMAX];
    double e1 = 0, e2 = 0, e3 = 0;
    sup_seed(&rng, 2001);
    for (int k = 0; k < N_STATES; k++) {
        random_state(&s, 1);
        molar_flux(&s, s.u, J);
        mass_flux(&s, s.vm, j);
        ck_assert_int_eq(mcd_flux_convert(s.n, s.nd, s.M, s.x, MCD_BASIS_MOLE,
                                          J, MCD_BASIS_MASS, jc),
                         MCD_OK);
        ck_assert_int_eq(mcd_flux_convert(s.n, s.nd, s.M, s.x, MCD_BASIS_MASS,
                                          j, MCD_BASIS_MOLE, Jc),
                         MCD_OK);
        /* scale: the fluxes are c x_i (or rho w_i) * O(1) velocities */
        floor_scale = s.rho;
        if (relerr(jc, j, s.n * s.nd) > e1)
            e1 = relerr(jc, j, s.n * s.nd);
        floor_scale = s.c;
        if (relerr(Jc, J, s.n * s.nd) > e2)
            e2 = relerr(Jc, J, s.n * s.nd);
        if (sumerr(jc, s.n, s.nd) > e3)
            e3 = sumerr(jc, s.n, s.nd);
    }
    fprintf(stderr,
            "J->j vs definition %.3g, j->J vs definition %.3g, "
            "sum j %.3g\n",
            e1, e2, e3);
    ck_assert_double_le(e1, TOL);
    ck_assert_double_le(e2, TOL);
    ck_assert_double_le(e3, 1e-13);
}
END_TEST

START_TEST(frames_convert_round_trip_and_zero_sum)
{
    state s;
    double J[NMAX * DMAX], j[NMAX * DMAX], J2[NMAX * DMAX], cp[NMAX * DMAX];
    double e1 = 0, e2 = 0, e3 = 0;
    sup_seed(&rng, 2002);
    for (int k = 0; k < N_STATES; k++) {
        random_state(&s, 1);
        molar_flux(&s, s.u, J);
        ck_assert_int_eq(mcd_flux_convert(s.n, s.nd, s.M, s.x, MCD_BASIS_MOLE,
                                          J, MCD_BASIS_MASS, j),
                         MCD_OK);
        ck_assert_int_eq(mcd_flux_convert(s.n, s.nd, s.M, s.x, MCD_BASIS_MASS,
                                          j, MCD_BASIS_MOLE, J2),
                         MCD_OK);
        if (relerr(J2, J, s.n * s.nd) > e1)
            e1 = relerr(J2, J, s.n * s.nd);
        if (sumerr(j, s.n, s.nd) > e2)
            e2 = sumerr(j, s.n, s.nd);
        if (sumerr(J2, s.n, s.nd) > e3)
            e3 = sumerr(J2, s.n, s.nd);
        /* same basis copies */
        ck_assert_int_eq(mcd_flux_convert(s.n, s.nd, s.M, s.x, MCD_BASIS_MASS,
                                          j, MCD_BASIS_MASS, cp),
                         MCD_OK);
        ck_assert(memcmp(cp, j, s.n * s.nd * sizeof(double)) == 0);
    }
    fprintf(stderr, "molar->mass->molar %.3g, sums %.3g %.3g\n", e1, e2, e3);
    ck_assert_double_le(e1, TOL);
    ck_assert_double_le(e2, 1e-13); /* <= 30-term sums of O(scale) terms */
    ck_assert_double_le(e3, 1e-13);
}
END_TEST

/* Any input, zero-sum or not, is turned into a diffusion flux: the output
 * sums to zero (sum_i j_i = sum M J - (sum w) sum M J = 0). */
START_TEST(frames_convert_output_always_sums_to_zero)
{
    state s;
    double F[NMAX * DMAX], out[NMAX * DMAX], e = 0;
    sup_seed(&rng, 2003);
    for (int k = 0; k < 1000; k++) {
        random_state(&s, 1);
        for (size_t i = 0; i < s.n * s.nd; i++)
            F[i] = sup_range(&rng, -1.0, 1.0);
        ck_assert_int_eq(
            mcd_flux_convert(s.n, s.nd, s.M, s.x,
                             k % 2 ? MCD_BASIS_MASS : MCD_BASIS_MOLE, F,
                             k % 2 ? MCD_BASIS_MOLE : MCD_BASIS_MASS, out),
            MCD_OK);
        if (sumerr(out, s.n, s.nd) > e)
            e = sumerr(out, s.n, s.nd);
    }
    ck_assert_double_le(e, 1e-13);
}
END_TEST

/* Volume frame: ideal gas (Vbar_i = 1/c: volume average = molar average,
 * so J^V = J) and a non-ideal set of partial molar volumes (some negative,
 * as for some solutes in liquids) scaled to sum x_i Vbar_i = 1/c. */
START_TEST(frames_volume_frame_matches_definition)
{
    state s;
    double J[NMAX * DMAX], JV[NMAX * DMAX], JVref[NMAX * DMAX], Vb[NMAX];
    double vV[DMAX], e_ideal = 0, e_non = 0;
    sup_seed(&rng, 2004);
    for (int k = 0; k < N_STATES; k++) {
        int ideal = k % 2 == 0;
        double sxv = 0.0;
        random_state(&s, 1);
        for (size_t i = 0; i < s.n; i++) {
            Vb[i] = ideal ? 1.0 / s.c : sup_range(&rng, -0.3, 2.0) / s.c;
            sxv += s.x[i] * Vb[i];
        }
        if (!ideal) {
            if (!(sxv > 0.05 / s.c))
                continue; /* rescaling would blow the volumes up */
            for (size_t i = 0; i < s.n; i++)
                Vb[i] /= s.c * sxv;
        }
        for (size_t d = 0; d < s.nd; d++) {
            vV[d] = 0.0;
            for (size_t i = 0; i < s.n; i++)
                vV[d] += s.c * s.x[i] * Vb[i] * s.v[i * s.nd + d];
        }
        molar_flux(&s, s.u, J);
        molar_flux(&s, vV, JVref);
        ck_assert_int_eq(
            mcd_flux_to_volume_frame(s.n, s.nd, s.c, s.x, Vb, J, JV), MCD_OK);
        double e = relerr(JV, JVref, s.n * s.nd);
        if (ideal && e > e_ideal)
            e_ideal = e;
        if (!ideal && e > e_non)
            e_non = e;
        if (ideal) /* J^V = J: only round-off of sum_k J_k */
            ck_assert_double_le(relerr(JV, J, s.n * s.nd), 1e-13);
    }
    fprintf(stderr, "volume frame: ideal %.3g, non-ideal %.3g\n", e_ideal,
            e_non);
    ck_assert_double_le(e_ideal, TOL);
    /* the non-ideal volumes up to ~40/c after rescaling amplify round-off
     * by at most ~40 */
    ck_assert_double_le(e_non, 1e-11);
}
END_TEST

START_TEST(frames_species_frame_matches_definition)
{
    state s;
    double J[NMAX * DMAX], Jk[NMAX * DMAX], ref[NMAX * DMAX], e = 0;
    sup_seed(&rng, 2005);
    for (int t = 0; t < N_STATES; t++) {
        size_t k;
        random_state(&s, 1);
        do
            k = (size_t)(sup_next(&rng) % s.n);
        while (s.x[k] == 0.0);
        molar_flux(&s, s.u, J);
        molar_flux(&s, s.v + k * s.nd, ref);
        ck_assert_int_eq(mcd_flux_to_species_frame(s.n, s.nd, s.x, J, k, Jk),
                         MCD_OK);
        for (size_t d = 0; d < s.nd; d++)
            ck_assert(Jk[k * s.nd + d] == 0.0);
        /* the reference J^k_i = c_i (v_i - v_k) is as large as c |v| ~ c;
         * the library divides J_k by x_k, which may be small: the error
         * scale is |J_k|/x_k ~ c, same as the reference */
        if (relerr(Jk, ref, s.n * s.nd) > e)
            e = relerr(Jk, ref, s.n * s.nd);
    }
    fprintf(stderr, "species frame %.3g\n", e);
    ck_assert_double_le(e, TOL);
}
END_TEST

/* mcd_flux_total with each bootstrap made true of the velocities. */
static void check_total(mcd_basis basis, uint64_t seed)
{
    state s;
    double F[NMAX * DMAX], tot[NMAX * DMAX], ref[NMAX * DMAX], bulk[DMAX];
    double nu[NMAX], vals[DMAX], zero[DMAX] = {0, 0, 0};
    double worst[4] = {0, 0, 0, 0};
    sup_seed(&rng, seed);
    for (int t = 0; t < N_STATES; t++) {
        mcd_bootstrap kind = (mcd_bootstrap)(t % 4);
        size_t sp = 0;
        const double *y;
        double rho_or_c;
        random_state(&s, 1);
        y = basis == MCD_BASIS_MOLE ? s.x : s.w;
        rho_or_c = basis == MCD_BASIS_MOLE ? s.c : s.rho;
        floor_scale = rho_or_c;
        if (kind == MCD_BOOT_STAGNANT) {
            do
                sp = (size_t)(sup_next(&rng) % s.n);
            while (s.x[sp] == 0.0);
            for (size_t d = 0; d < s.nd; d++)
                s.v[sp * s.nd + d] = 0.0;
        } else if (kind == MCD_BOOT_EQUIMOLAR || kind == MCD_BOOT_WEIGHTS) {
            /* shift all velocities uniformly by a so that the condition
             * holds: sum nu_i y_i (v_i + a) = 0 (nu = 1 for equimolar) */
            double syn = 0.0;
            for (size_t i = 0; i < s.n; i++) {
                nu[i] = kind == MCD_BOOT_EQUIMOLAR ? 1.0
                                                   : sup_range(&rng, -1.0, 2.0);
                syn += nu[i] * y[i];
            }
            if (fabs(syn) < 0.05) {
                t--; /* too ill-posed for a clean comparison: redraw */
                continue;
            }
            for (size_t d = 0; d < s.nd; d++) {
                double a = 0.0;
                for (size_t i = 0; i < s.n; i++)
                    a += nu[i] * y[i] * s.v[i * s.nd + d];
                a = -a / syn;
                for (size_t i = 0; i < s.n; i++)
                    s.v[i * s.nd + d] += a;
            }
        }
        averages(&s);
        if (basis == MCD_BASIS_MOLE)
            molar_flux(&s, s.u, F);
        else
            mass_flux(&s, s.vm, F);
        molar_flux(&s, zero, ref); /* N_i = c_i v_i */
        if (basis == MCD_BASIS_MASS)
            for (size_t i = 0; i < s.n; i++)
                for (size_t d = 0; d < s.nd; d++)
                    ref[i * s.nd + d] *= s.M[i]; /* n_i = M_i N_i */
        for (size_t d = 0; d < s.nd; d++)
            vals[d] = rho_or_c * (basis == MCD_BASIS_MOLE ? s.u[d] : s.vm[d]);
        sup_guard_fill(bulk, DMAX);
        ck_assert_int_eq(mcd_flux_total(s.n, s.nd, basis, y, F, kind, sp,
                                        kind == MCD_BOOT_TOTAL     ? vals
                                        : kind == MCD_BOOT_WEIGHTS ? nu
                                                                   : NULL,
                                        tot, bulk),
                         MCD_OK);
        double e = relerr(tot, ref, s.n * s.nd);
        /* bulk flux: c u or rho v of the construction */
        double eb = 0.0, scb = sup_max_abs(ref, s.n * s.nd);
        if (scb < floor_scale)
            scb = floor_scale;
        for (size_t d = 0; d < s.nd; d++)
            if (fabs(bulk[d] - vals[d]) / scb > eb)
                eb = fabs(bulk[d] - vals[d]) / scb;
        if (eb > e)
            e = eb;
        if (e > worst[kind])
            worst[kind] = e;
        if (kind == MCD_BOOT_STAGNANT)
            for (size_t d = 0; d < s.nd; d++)
                ck_assert_double_le(
                    fabs(tot[sp * s.nd + d]),
                    TOL * (sup_max_abs(ref, s.n * s.nd) + floor_scale));
    }
    fprintf(stderr,
            "total (%s): TOTAL %.3g STAGNANT %.3g EQUIMOLAR %.3g "
            "WEIGHTS %.3g\n",
            basis == MCD_BASIS_MOLE ? "mole" : "mass", worst[0], worst[1],
            worst[2], worst[3]);
    /* TOTAL and EQUIMOLAR: a few roundings per entry. STAGNANT divides by
     * y_s (random, can be ~1e-3: amplifies by up to 1/y_s times eps);
     * WEIGHTS divides by |sum nu y| >= 0.05 */
    ck_assert_double_le(worst[0], TOL);
    ck_assert_double_le(worst[2], TOL);
    ck_assert_double_le(worst[3], TOL);
    ck_assert_double_le(worst[1], 1e-9);
}

START_TEST(frames_total_reproduces_species_fluxes_mole)
{
    check_total(MCD_BASIS_MOLE, 2006);
}
END_TEST

START_TEST(frames_total_reproduces_species_fluxes_mass)
{
    check_total(MCD_BASIS_MASS, 2007);
}
END_TEST

START_TEST(frames_total_binary_stefan_flow_and_null_bulk)
{
    const double x[2] = {0.4, 0.6}, J[2] = {1.0, -1.0};
    double out[2];
    ck_assert_int_eq(mcd_flux_total(2, 1, MCD_BASIS_MOLE, x, J,
                                    MCD_BOOT_EQUIMOLAR, 0, NULL, out, NULL),
                     MCD_OK);
    ck_assert(out[0] == 1.0 && out[1] == -1.0);
    /* Stefan tube with species 1 stagnant: N_1 = 0, N_0 = J_0 / (1 - x_0)
     * (binary Stefan flow, common practice) */
    ck_assert_int_eq(mcd_flux_total(2, 1, MCD_BASIS_MOLE, x, J,
                                    MCD_BOOT_STAGNANT, 1, NULL, out, NULL),
                     MCD_OK);
    ck_assert_double_eq_tol(out[0], 1.0 / 0.6, 1e-15);
    ck_assert_double_eq_tol(out[1], 0.0, 1e-15);
}
END_TEST

START_TEST(frames_velocity_difference_matches_construction)
{
    state s;
    double J[NMAX * DMAX], dv[DMAX], ref[DMAX], e = 0;
    sup_seed(&rng, 2008);
    for (int t = 0; t < N_STATES; t++) {
        random_state(&s, 1);
        molar_flux(&s, s.u, J);
        for (size_t d = 0; d < s.nd; d++)
            ref[d] = s.vm[d] - s.u[d];
        ck_assert_int_eq(
            mcd_flux_velocity_difference(s.n, s.nd, s.M, s.c, s.x, J, dv),
            MCD_OK);
        /* scale: velocities are O(1) m/s; compare absolutely */
        for (size_t d = 0; d < s.nd; d++)
            if (fabs(dv[d] - ref[d]) > e)
                e = fabs(dv[d] - ref[d]);
    }
    fprintf(stderr, "velocity difference %.3g m/s\n", e);
    ck_assert_double_le(e, TOL);
}
END_TEST

START_TEST(frames_projection_removes_residual)
{
    double F[NMAX * DMAX], F0[NMAX * DMAX], F1[NMAX * DMAX], r[DMAX], r2[DMAX];
    double wts[NMAX];
    sup_seed(&rng, 2009);
    for (int t = 0; t < N_STATES; t++) {
        size_t n = 1 + (size_t)(sup_next(&rng) % NMAX);
        size_t nd = 1 + (size_t)(sup_next(&rng) % DMAX);
        int use_w = t % 2;
        double sw = 0.0, sc;
        for (size_t i = 0; i < n * nd; i++)
            F[i] = F0[i] = sup_range(&rng, -1.0, 1.0) * 10.0;
        for (size_t i = 0; i < n; i++) {
            wts[i] = (sup_next(&rng) % 5 == 0) ? 0.0 : sup_u01(&rng);
            sw += wts[i];
        }
        if (sw == 0.0) {
            wts[0] = 0.5;
            sw = 0.5;
        }
        sc = sup_max_abs(F0, n * nd);
        ck_assert_int_eq(mcd_flux_project(n, nd, use_w ? wts : NULL, F, r),
                         MCD_OK);
        for (size_t d = 0; d < nd; d++) {
            double s0 = 0.0, s1 = 0.0;
            for (size_t i = 0; i < n; i++) {
                s0 += F0[i * nd + d];
                s1 += F[i * nd + d];
            }
            /* reported residual is the sum of the input */
            ck_assert_double_eq_tol(r[d], s0, 1e-13 * sc);
            /* sum is zero after projection (<= 30 roundings of size sc) */
            ck_assert_double_le(fabs(s1), 1e-13 * sc);
            /* exactly a_i r removed */
            for (size_t i = 0; i < n; i++) {
                double a = use_w ? wts[i] / sw : 1.0 / (double)n;
                ck_assert_double_eq_tol(F0[i * nd + d] - F[i * nd + d],
                                        a * r[d], 1e-14 * sc);
            }
        }
        /* idempotent: second projection removes only round-off */
        memcpy(F1, F, n * nd * sizeof(double));
        ck_assert_int_eq(mcd_flux_project(n, nd, use_w ? wts : NULL, F1, r2),
                         MCD_OK);
        for (size_t d = 0; d < nd; d++)
            ck_assert_double_le(fabs(r2[d]), 1e-13 * sc);
        for (size_t i = 0; i < n * nd; i++)
            ck_assert_double_le(fabs(F1[i] - F[i]), 1e-13 * sc);
    }
}
END_TEST

/* With weights x, the projection changes every species velocity
 * F_i / c_i by the same amount: a correction velocity. */
START_TEST(frames_projection_with_x_is_uniform_velocity_shift)
{
    state s;
    double F[NMAX * DMAX], F0[NMAX * DMAX], r[DMAX];
    sup_seed(&rng, 2010);
    for (int t = 0; t < N_STATES; t++) {
        random_state(&s, 1);
        /* a flux set that does not sum to zero: from velocities relative to
         * a wrong reference (0) */
        for (size_t i = 0; i < s.n; i++)
            for (size_t d = 0; d < s.nd; d++)
                F[i * s.nd + d] = F0[i * s.nd + d] =
                    s.c * s.x[i] * s.v[i * s.nd + d];
        ck_assert_int_eq(mcd_flux_project(s.n, s.nd, s.x, F, r), MCD_OK);
        for (size_t d = 0; d < s.nd; d++) {
            /* residual = c u, shift = -u for every species */
            ck_assert_double_eq_tol(r[d], s.c * s.u[d], 1e-13 * s.c);
            for (size_t i = 0; i < s.n; i++) {
                if (s.x[i] == 0.0) {
                    ck_assert(F[i * s.nd + d] == F0[i * s.nd + d]);
                    continue;
                }
                double dvel =
                    (F[i * s.nd + d] - F0[i * s.nd + d]) / (s.c * s.x[i]);
                /* velocities O(1); round-off of F/(c x_i) relative to the
                 * flux scale c, divided by x_i: bounded by 1e-14 / x_i */
                ck_assert_double_eq_tol(dvel, -s.u[d], 1e-14 / s.x[i] + 1e-13);
            }
        }
    }
}
END_TEST

START_TEST(frames_error_paths_leave_outputs_untouched)
{
    const double M[3] = {2e-3, 28e-3, 44e-3}, x[3] = {0.2, 0.3, 0.5};
    const double J[6] = {0.1, 0.2, -0.3, 0.1, 0.2, -0.3};
    const double Vb[3] = {1.0 / 40, 1.0 / 40, 1.0 / 40};
    const double nan = SUP_NAN, inf = SUP_INF;
    double out[6], ob[3], Mb[3], xb[3], Jb[6], Vbb[3], F[6];
    const mcd_basis MO = MCD_BASIS_MOLE, MA = MCD_BASIS_MASS;

#define EXPECT(call, code)                                                     \
    do {                                                                       \
        sup_guard_fill(out, 6);                                                \
        sup_guard_fill(ob, 3);                                                 \
        ck_assert_int_eq((call), (code));                                      \
        ck_assert(sup_guard_intact(out, 6));                                   \
        ck_assert(sup_guard_intact(ob, 3));                                    \
    } while (0)
#define RESET()                                                                \
    do {                                                                       \
        memcpy(Mb, M, sizeof Mb);                                              \
        memcpy(xb, x, sizeof xb);                                              \
        memcpy(Jb, J, sizeof Jb);                                              \
        memcpy(Vbb, Vb, sizeof Vbb);                                           \
    } while (0)

    RESET();
    /* convert */
    EXPECT(mcd_flux_convert(0, 2, M, x, MO, J, MA, out), MCD_EINVAL);
    EXPECT(mcd_flux_convert(MCD_MAX_SPECIES + 1, 2, M, x, MO, J, MA, out),
           MCD_EINVAL);
    EXPECT(mcd_flux_convert(3, 0, M, x, MO, J, MA, out), MCD_EINVAL);
    EXPECT(mcd_flux_convert(3, 4, M, x, MO, J, MA, out), MCD_EINVAL);
    EXPECT(mcd_flux_convert(3, 2, NULL, x, MO, J, MA, out), MCD_EINVAL);
    EXPECT(mcd_flux_convert(3, 2, M, NULL, MO, J, MA, out), MCD_EINVAL);
    EXPECT(mcd_flux_convert(3, 2, M, x, MO, NULL, MA, out), MCD_EINVAL);
    EXPECT(mcd_flux_convert(3, 2, M, x, MO, J, MA, NULL), MCD_EINVAL);
    EXPECT(mcd_flux_convert(3, 2, M, x, (mcd_basis)2, J, MA, out), MCD_EINVAL);
    EXPECT(mcd_flux_convert(3, 2, M, x, MO, J, (mcd_basis)-1, out), MCD_EINVAL);
    Mb[1] = nan;
    EXPECT(mcd_flux_convert(3, 2, Mb, x, MO, J, MA, out), MCD_EINVAL);
    Mb[1] = -1.0;
    EXPECT(mcd_flux_convert(3, 2, Mb, x, MO, J, MA, out), MCD_EDOM);
    RESET();
    xb[0] = inf;
    EXPECT(mcd_flux_convert(3, 2, M, xb, MO, J, MA, out), MCD_EINVAL);
    xb[0] = -0.2;
    xb[1] = 0.7;
    EXPECT(mcd_flux_convert(3, 2, M, xb, MO, J, MA, out), MCD_EDOM);
    xb[0] = 0.3;
    xb[1] = 0.3;
    EXPECT(mcd_flux_convert(3, 2, M, xb, MA, J, MO, out), MCD_EDOM);
    RESET();
    Jb[4] = nan;
    EXPECT(mcd_flux_convert(3, 2, M, x, MO, Jb, MA, out), MCD_EINVAL);
    EXPECT(mcd_flux_convert(3, 2, M, x, MO, Jb, MO, out), MCD_EINVAL);

    /* volume frame */
    RESET();
    EXPECT(mcd_flux_to_volume_frame(3, 2, 40.0, NULL, Vb, J, out), MCD_EINVAL);
    EXPECT(mcd_flux_to_volume_frame(3, 2, 40.0, x, NULL, J, out), MCD_EINVAL);
    EXPECT(mcd_flux_to_volume_frame(3, 2, 40.0, x, Vb, NULL, out), MCD_EINVAL);
    EXPECT(mcd_flux_to_volume_frame(3, 2, 40.0, x, Vb, J, NULL), MCD_EINVAL);
    EXPECT(mcd_flux_to_volume_frame(0, 2, 40.0, x, Vb, J, out), MCD_EINVAL);
    EXPECT(mcd_flux_to_volume_frame(3, 0, 40.0, x, Vb, J, out), MCD_EINVAL);
    EXPECT(mcd_flux_to_volume_frame(3, 2, nan, x, Vb, J, out), MCD_EINVAL);
    EXPECT(mcd_flux_to_volume_frame(3, 2, 0.0, x, Vb, J, out), MCD_EDOM);
    EXPECT(mcd_flux_to_volume_frame(3, 2, -40.0, x, Vb, J, out), MCD_EDOM);
    /* sum x Vbar = 1/c violated by 1e-5 relative */
    EXPECT(mcd_flux_to_volume_frame(3, 2, 40.0 * (1 + 1e-5), x, Vb, J, out),
           MCD_EDOM);
    Vbb[2] = nan;
    EXPECT(mcd_flux_to_volume_frame(3, 2, 40.0, x, Vbb, J, out), MCD_EINVAL);
    RESET();
    xb[2] = 0.6;
    EXPECT(mcd_flux_to_volume_frame(3, 2, 40.0, xb, Vb, J, out), MCD_EDOM);
    Jb[0] = inf;
    EXPECT(mcd_flux_to_volume_frame(3, 2, 40.0, x, Vb, Jb, out), MCD_EINVAL);

    /* species frame */
    RESET();
    EXPECT(mcd_flux_to_species_frame(3, 2, NULL, J, 0, out), MCD_EINVAL);
    EXPECT(mcd_flux_to_species_frame(3, 2, x, NULL, 0, out), MCD_EINVAL);
    EXPECT(mcd_flux_to_species_frame(3, 2, x, J, 0, NULL), MCD_EINVAL);
    EXPECT(mcd_flux_to_species_frame(3, 2, x, J, 3, out), MCD_EINVAL);
    EXPECT(mcd_flux_to_species_frame(3, 4, x, J, 0, out), MCD_EINVAL);
    xb[0] = 0.0;
    xb[1] = 0.5;
    EXPECT(mcd_flux_to_species_frame(3, 2, xb, J, 0, out), MCD_EDOM);
    xb[0] = nan;
    EXPECT(mcd_flux_to_species_frame(3, 2, xb, J, 1, out), MCD_EINVAL);
    Jb[3] = nan;
    EXPECT(mcd_flux_to_species_frame(3, 2, x, Jb, 1, out), MCD_EINVAL);

    /* total */
    RESET();
    {
        const double nt[2] = {0.5, -0.5};
        const double nu0[3] = {1.0, 1.0, -1.0}; /* sum nu x = 0.2+0.3-0.5 = 0 */
        double nub[3] = {1.0, 2.0, 3.0};
        EXPECT(
            mcd_flux_total(3, 2, MO, NULL, J, MCD_BOOT_TOTAL, 0, nt, out, ob),
            MCD_EINVAL);
        EXPECT(
            mcd_flux_total(3, 2, MO, x, NULL, MCD_BOOT_TOTAL, 0, nt, out, ob),
            MCD_EINVAL);
        EXPECT(mcd_flux_total(3, 2, MO, x, J, MCD_BOOT_TOTAL, 0, nt, NULL, ob),
               MCD_EINVAL);
        EXPECT(mcd_flux_total(3, 2, MO, x, J, MCD_BOOT_TOTAL, 0, NULL, out, ob),
               MCD_EINVAL);
        EXPECT(
            mcd_flux_total(3, 2, MO, x, J, MCD_BOOT_WEIGHTS, 0, NULL, out, ob),
            MCD_EINVAL);
        EXPECT(mcd_flux_total(0, 2, MO, x, J, MCD_BOOT_EQUIMOLAR, 0, NULL, out,
                              ob),
               MCD_EINVAL);
        EXPECT(mcd_flux_total(3, 0, MO, x, J, MCD_BOOT_EQUIMOLAR, 0, NULL, out,
                              ob),
               MCD_EINVAL);
        EXPECT(mcd_flux_total(3, 2, (mcd_basis)5, x, J, MCD_BOOT_EQUIMOLAR, 0,
                              NULL, out, ob),
               MCD_EINVAL);
        EXPECT(
            mcd_flux_total(3, 2, MO, x, J, (mcd_bootstrap)4, 0, nub, out, ob),
            MCD_EINVAL);
        EXPECT(
            mcd_flux_total(3, 2, MO, x, J, (mcd_bootstrap)17, 0, nub, out, ob),
            MCD_EINVAL);
        EXPECT(
            mcd_flux_total(3, 2, MO, x, J, MCD_BOOT_STAGNANT, 3, NULL, out, ob),
            MCD_EINVAL);
        nub[1] = nan;
        EXPECT(
            mcd_flux_total(3, 2, MO, x, J, MCD_BOOT_WEIGHTS, 0, nub, out, ob),
            MCD_EINVAL);
        EXPECT(
            mcd_flux_total(3, 2, MO, x, J, MCD_BOOT_TOTAL, 0, nub + 1, out, ob),
            MCD_EINVAL);
        Jb[2] = nan;
        EXPECT(mcd_flux_total(3, 2, MA, x, Jb, MCD_BOOT_EQUIMOLAR, 0, NULL, out,
                              ob),
               MCD_EINVAL);
        xb[1] = -0.3;
        xb[2] = 1.1;
        EXPECT(mcd_flux_total(3, 2, MA, xb, J, MCD_BOOT_EQUIMOLAR, 0, NULL, out,
                              ob),
               MCD_EDOM);
        xb[0] = 0.0;
        xb[1] = 0.5;
        xb[2] = 0.5;
        /* stagnant species absent */
        EXPECT(mcd_flux_total(3, 2, MO, xb, J, MCD_BOOT_STAGNANT, 0, NULL, out,
                              ob),
               MCD_EDOM);
        EXPECT(mcd_flux_total(3, 2, MA, xb, J, MCD_BOOT_STAGNANT, 0, NULL, out,
                              ob),
               MCD_EDOM);
        /* sum nu_i y_i = 0 (exactly, and to round-off) */
        EXPECT(
            mcd_flux_total(3, 2, MO, x, J, MCD_BOOT_WEIGHTS, 0, nu0, out, ob),
            MCD_EDOM);
        {
            double xr[3] = {0.1, 0.2, 0.7}, nur[3] = {7.0, 0.0, -1.0};
            /* 0.1*7 - 0.7 cancels to round-off */
            EXPECT(mcd_flux_total(3, 2, MO, xr, J, MCD_BOOT_WEIGHTS, 0, nur,
                                  out, ob),
                   MCD_EDOM);
        }
        {
            double xt[3] = {1e-320, 0.5, 0.5};
            /* tiny stagnant fraction: bulk flux overflows */
            EXPECT(mcd_flux_total(3, 2, MO, xt, J, MCD_BOOT_STAGNANT, 0, NULL,
                                  out, ob),
                   MCD_EDOM);
        }
    }

    /* velocity difference */
    RESET();
    EXPECT(mcd_flux_velocity_difference(3, 2, NULL, 40.0, x, J, ob),
           MCD_EINVAL);
    EXPECT(mcd_flux_velocity_difference(3, 2, M, 40.0, NULL, J, ob),
           MCD_EINVAL);
    EXPECT(mcd_flux_velocity_difference(3, 2, M, 40.0, x, NULL, ob),
           MCD_EINVAL);
    EXPECT(mcd_flux_velocity_difference(3, 2, M, 40.0, x, J, NULL), MCD_EINVAL);
    EXPECT(mcd_flux_velocity_difference(0, 2, M, 40.0, x, J, ob), MCD_EINVAL);
    EXPECT(mcd_flux_velocity_difference(3, 5, M, 40.0, x, J, ob), MCD_EINVAL);
    EXPECT(mcd_flux_velocity_difference(3, 2, M, nan, x, J, ob), MCD_EINVAL);
    EXPECT(mcd_flux_velocity_difference(3, 2, M, 0.0, x, J, ob), MCD_EDOM);
    Mb[0] = 0.0;
    EXPECT(mcd_flux_velocity_difference(3, 2, Mb, 40.0, x, J, ob), MCD_EDOM);
    Mb[0] = inf;
    EXPECT(mcd_flux_velocity_difference(3, 2, Mb, 40.0, x, J, ob), MCD_EINVAL);
    xb[1] = 0.31;
    EXPECT(mcd_flux_velocity_difference(3, 2, M, 40.0, xb, J, ob), MCD_EDOM);
    Jb[1] = nan;
    EXPECT(mcd_flux_velocity_difference(3, 2, M, 40.0, x, Jb, ob), MCD_EINVAL);

    /* projection: the in-out array and the residual stay untouched */
#define EXPECT_P(wts, nn, nd, code)                                            \
    do {                                                                       \
        memcpy(F, J, sizeof F);                                                \
        sup_guard_fill(ob, 3);                                                 \
        ck_assert_int_eq(mcd_flux_project((nn), (nd), (wts), F, ob), (code));  \
        ck_assert(memcmp(F, J, sizeof F) == 0);                                \
        ck_assert(sup_guard_intact(ob, 3));                                    \
    } while (0)
    {
        double wb[3] = {1.0, 2.0, 3.0};
        EXPECT_P(wb, 0, 2, MCD_EINVAL);
        EXPECT_P(wb, 3, 0, MCD_EINVAL);
        EXPECT_P(wb, 3, 4, MCD_EINVAL);
        ck_assert_int_eq(mcd_flux_project(3, 2, wb, NULL, ob), MCD_EINVAL);
        wb[1] = nan;
        EXPECT_P(wb, 3, 2, MCD_EINVAL);
        wb[1] = -1.0;
        EXPECT_P(wb, 3, 2, MCD_EDOM);
        wb[0] = wb[1] = wb[2] = 0.0;
        EXPECT_P(wb, 3, 2, MCD_EDOM);
        wb[0] = wb[1] = wb[2] = 1e308; /* sum overflows */
        EXPECT_P(wb, 3, 2, MCD_EDOM);
        memcpy(F, J, sizeof F);
        F[5] = nan;
        sup_guard_fill(ob, 3);
        ck_assert_int_eq(mcd_flux_project(3, 2, NULL, F, ob), MCD_EINVAL);
        ck_assert(sup_guard_intact(ob, 3));
        ck_assert(F[0] == J[0] && F[4] == J[4] && isnan(F[5]));
    }
#undef EXPECT
#undef EXPECT_P
#undef RESET
}
END_TEST

int main(void)
{
    Suite *s = suite_create("mcd:frames");
    TCase *tc = tcase_create("bases_and_frames");
    tcase_add_test(tc, frames_mass_flux_from_molar_matches_definition);
    tcase_add_test(tc, frames_convert_round_trip_and_zero_sum);
    tcase_add_test(tc, frames_convert_output_always_sums_to_zero);
    tcase_add_test(tc, frames_volume_frame_matches_definition);
    tcase_add_test(tc, frames_species_frame_matches_definition);
    tcase_add_test(tc, frames_velocity_difference_matches_construction);
    suite_add_tcase(s, tc);
    tc = tcase_create("total_fluxes");
    tcase_add_test(tc, frames_total_reproduces_species_fluxes_mole);
    tcase_add_test(tc, frames_total_reproduces_species_fluxes_mass);
    tcase_add_test(tc, frames_total_binary_stefan_flow_and_null_bulk);
    suite_add_tcase(s, tc);
    tc = tcase_create("projection");
    tcase_add_test(tc, frames_projection_removes_residual);
    tcase_add_test(tc, frames_projection_with_x_is_uniform_velocity_shift);
    suite_add_tcase(s, tc);
    tc = tcase_create("errors");
    tcase_add_test(tc, frames_error_paths_leave_outputs_untouched);
    suite_add_tcase(s, tc);

    return sup_run(s);
}
