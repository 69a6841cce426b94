/* test_thermal_kt.c - thermal diffusion from kinetic theory: the
 * Lennard-Jones collision integrals, the binary thermal diffusion factor
 * in the first Chapman-Enskog approximation, pairwise mixture ratios, and
 * the Dufour heat flux.
 *
 * Outside checks (source beside each value):
 *  - Omega(1,1)* and Omega(2,2)* against the Neufeld, Janzen and Aziz
 *    (1972) fits and against the Monchick-Mason values as tabulated by
 *    Bird, Stewart and Lightfoot (2002), Table E.2;
 *  - the isotopic limit of the first approximation and its rigid-sphere
 *    value 105/118 (from memory);
 *  - Maxwell molecules (6 C* - 5 = 0): alpha_T = 0 (Chapman and Cowling;
 *    the introduction of T. L. Ibbs, "Some Experiments on Thermal
 *    Diffusion", 1921, p. 385, stored copy at https://archive.org/,
 *    states it for "fifth power centres of force");
 *  - the heavier species goes to the cold side (the same introduction:
 *    "the heavier and larger molecules diffusing towards the cooler
 *    side");
 *  - measured thermal diffusion factors of five gas pairs;
 *  - the binary law J_1 = -c D_12 (grad x_1 + k_T grad ln T);
 *  - Onsager reciprocity between thermal diffusion and the Dufour effect.
 */
#include <check.h>
#include <math.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

#include "mcdiff.h"
#include "support.h"

#define NMAX 9
#define NDIM 3

static sup_rng rng = SUP_RNG(SUP_SPLITMIX64, 0x5EED7E11ull);

/* ------------------------------------------------------------------ */
/* Collision integrals                                                 */
/* ------------------------------------------------------------------ */

/* The table (quadrature of the definitions, tools/gen_collision.c) and
 * the Neufeld-Janzen-Aziz fits are two independent routes. Neufeld et al.
 * give their fits' deviation from the tables they fitted as about 0.1 %
 * (from memory); the quadrature's own error is below 1e-4 (the tool's
 * step-halving check). 3e-3 bounds both with room. */
START_TEST(collision_table_agrees_with_neufeld_fits)
{
    for (int k = 0; k <= 400; k++) {
        double Ts = fmin(0.3 * pow(100.0 / 0.3, k / 400.0), 100.0), o[4], od,
               ov;
        ck_assert_int_eq(mcd_lj_collision_integrals(Ts, o, NULL), MCD_OK);
        ck_assert_int_eq(mcd_binary_omega_d(Ts, &od), MCD_OK);
        ck_assert_int_eq(mcd_viscosity_omega22(Ts, &ov), MCD_OK);
        ck_assert_msg(fabs(o[0] / od - 1.0) < 3e-3, "Omega(1,1) at T* %g", Ts);
        ck_assert_msg(fabs(o[3] / ov - 1.0) < 3e-3, "Omega(2,2) at T* %g", Ts);
    }
}
END_TEST

/* Monchick and Mason (1961) as tabulated by Bird, Stewart and Lightfoot,
 * Transport Phenomena, 2nd ed. (2002), Table E.2 (given there to four or
 * five digits): {T*, Omega(2,2)*, Omega(1,1)*}. 2e-3 covers the
 * table's last digit and interpolation. */
START_TEST(collision_table_agrees_with_published_values)
{
    static const double tab[][3] = {
        {0.30, 2.840, 2.649},  {1.00, 1.593, 1.440},   {2.50, 1.0933, 1.0006},
        {5.0, 0.9268, 0.8428}, {10.0, 0.8244, 0.7422},
    };
    for (size_t k = 0; k < sizeof tab / sizeof tab[0]; k++) {
        double o[4], r[3];
        ck_assert_int_eq(mcd_lj_collision_integrals(tab[k][0], o, r), MCD_OK);
        ck_assert_msg(fabs(o[3] / tab[k][1] - 1.0) < 2e-3,
                      "Omega(2,2) at T* %g: %g", tab[k][0], o[3]);
        ck_assert_msg(fabs(o[0] / tab[k][2] - 1.0) < 2e-3,
                      "Omega(1,1) at T* %g: %g", tab[k][0], o[0]);
        ck_assert_double_eq_tol(r[0], o[3] / o[0], 1e-15);
        ck_assert_double_eq_tol(r[1], (5 * o[1] - 4 * o[2]) / o[0], 1e-14);
        ck_assert_double_eq_tol(r[2], o[1] / o[0], 1e-15);
    }
}
END_TEST

/* ------------------------------------------------------------------ */
/* The first-approximation formula                                     */
/* ------------------------------------------------------------------ */

/* Maxwell molecules (repulsion by the inverse fifth power of distance):
 * no thermal diffusion (Chapman's result as stated in the introduction of
 * T. L. Ibbs, "Some Experiments on Thermal Diffusion", 1921, p. 385,
 * stored copy at https://archive.org/). Here C* = 5/6 makes the factor
 * 6 C* - 5 vanish; 6 * (5/6) - 5 is zero to one rounding (1e-16), times
 * a ratio of order one. */
START_TEST(kinetic_maxwell_molecules_give_no_thermal_diffusion)
{
    for (int k = 0; k < 2000; k++) {
        double a, M1 = sup_molar_mass(&rng), M2 = sup_molar_mass(&rng);
        double x1 = sup_u01(&rng), A = sup_range(&rng, 0.9, 1.3);
        double B = sup_range(&rng, 0.9, 1.4);
        double R1 = sup_range(&rng, 0.5, 2.0), R2 = sup_range(&rng, 0.5, 2.0);
        ck_assert_int_eq(
            mcd_thermal_factor_kinetic(M1, M2, x1, A, B, 5.0 / 6.0, R1, R2, &a),
            MCD_OK);
        ck_assert_msg(fabs(a) < 1e-13, "alpha_T %g", a);
    }
}
END_TEST

/* Isotopes (M1 = m(1 + e), M2 = m(1 - e), equal sigma and eps, so R1 =
 * R2 = A*): alpha_T / e -> 15 (2A + 5)(6C - 5) / (2A (16A - 12B + 55)) at
 * every composition; rigid spheres 105/118 (from memory). The next term
 * is O(e) = 1e-7 relative; round-off 1e-16 / e = 1e-9. */
START_TEST(kinetic_isotopic_limit)
{
    const double e = 1e-7;
    double a;
    ck_assert_int_eq(
        mcd_thermal_factor_kinetic(1 + e, 1 - e, 0.3, 1, 1, 1, 1, 1, &a),
        MCD_OK);
    ck_assert_double_eq_tol(a / e, 105.0 / 118.0, 1e-6);
    for (int k = 0; k < 2000; k++) {
        double m = sup_molar_mass(&rng), x1 = sup_u01(&rng);
        double A = sup_range(&rng, 0.9, 1.3), B = sup_range(&rng, 0.9, 1.4);
        double C = sup_range(&rng, 0.7, 1.0), want;
        ck_assert_int_eq(mcd_thermal_factor_kinetic(m * (1 + e), m * (1 - e),
                                                    x1, A, B, C, A, A, &a),
                         MCD_OK);
        want =
            15 * (2 * A + 5) * (6 * C - 5) / (2 * A * (16 * A - 12 * B + 55));
        ck_assert_msg(fabs(a / e - want) < 1e-6 * (1 + fabs(want)),
                      "alpha/e %.10g want %.10g", a / e, want);
    }
}
END_TEST

/* Exchanging the species flips the sign; same operations in another
 * order: a few roundings of an O(1) result. */
START_TEST(kinetic_antisymmetric_in_the_species)
{
    for (int k = 0; k < 2000; k++) {
        double a, b, M1 = sup_molar_mass(&rng), M2 = sup_molar_mass(&rng);
        double x1 = sup_u01(&rng), A = sup_range(&rng, 0.9, 1.3);
        double B = sup_range(&rng, 0.9, 1.4), C = sup_range(&rng, 0.7, 1.0);
        double R1 = sup_range(&rng, 0.5, 2.0), R2 = sup_range(&rng, 0.5, 2.0);
        mcd_thermal_factor_kinetic(M1, M2, x1, A, B, C, R1, R2, &a);
        mcd_thermal_factor_kinetic(M2, M1, 1 - x1, A, B, C, R2, R1, &b);
        ck_assert_msg(fabs(a + b) < 1e-13 * (1 + fabs(a)), "%g %g", a, b);
    }
}
END_TEST

/* ------------------------------------------------------------------ */
/* Gas pairs                                                           */
/* ------------------------------------------------------------------ */

static size_t find(const mcd_db *db, const char *name)
{
    size_t i;
    ck_assert_int_eq(mcd_db_find(db, name, &i), MCD_OK);
    return i;
}

/* The stated typical error e widened by warnings w, written out here as
 * the rule of mcd_typical_error_widened states it (common practice, see
 * lib/props/explain.c): x2 for each of high pressure, polar, quantum,
 * associating; x1.5 for each of temperature, estimated parameter,
 * scaled; at most 100 %. */
static double widened(double e, unsigned w)
{
    const unsigned major[] = {MCD_WARN_HIGH_PRESSURE, MCD_WARN_POLAR,
                              MCD_WARN_QUANTUM, MCD_WARN_ASSOCIATING};
    const unsigned minor[] = {MCD_WARN_TEMPERATURE, MCD_WARN_ESTIMATED_PARAM,
                              MCD_WARN_SCALED};
    size_t k;
    for (k = 0; k < 4; k++)
        if (w & major[k])
            e *= 2.0;
    for (k = 0; k < 3; k++)
        if (w & minor[k])
            e *= 1.5;
    return e < 1.0 ? e : 1.0;
}

/* The heavier species goes to the cold side (alpha_T > 0 with the heavy
 * species first): "the heavier and larger molecules diffusing towards the
 * cooler side" (T. L. Ibbs, "Some Experiments on Thermal Diffusion",
 * 1921, p. 385, introduction; stored copy at https://archive.org/), for
 * the usual pairs at ordinary and flame temperatures (the sign reversal
 * of the 12-6 model lies at T* < 1). */
START_TEST(pairs_heavier_species_goes_to_the_cold_side)
{
    static const char *const p[][2] = {
        {"Ar", "He"}, {"N2", "H2"}, {"CO2", "H2"}, {"Xe", "He"},
        {"N2", "He"}, {"Ar", "Ne"}, {"Kr", "Ar"},  {"Ar", "H2"},
    };
    static const double T[] = {300.0, 600.0, 1500.0};
    static const double x[] = {0.05, 0.5, 0.95};
    mcd_db *db;
    ck_assert_int_eq(mcd_db_new_builtin(&db), MCD_OK);
    for (size_t k = 0; k < sizeof p / sizeof p[0]; k++)
        for (size_t t = 0; t < 3; t++)
            for (size_t q = 0; q < 3; q++) {
                double a, b, rel;
                unsigned w;
                size_t i = find(db, p[k][0]), j = find(db, p[k][1]);
                ck_assert_int_eq(
                    mcd_db_thermal_factor(db, i, j, T[t], x[q], &a, &rel, &w),
                    MCD_OK);
                ck_assert_msg(a > 0.0, "%s-%s at %g K: %g", p[k][0], p[k][1],
                              T[t], a);
                ck_assert_double_eq_tol(
                    rel, widened(MCD_THERMAL_CE_TYPICAL_ERROR, w), 1e-15);
                ck_assert_int_eq(mcd_db_thermal_factor(db, j, i, T[t], 1 - x[q],
                                                       &b, NULL, NULL),
                                 MCD_OK);
                ck_assert_double_eq_tol(a + b, 0.0, 1e-13);
            }
    mcd_db_free(db);
}
END_TEST

/* Measured thermal diffusion factors near room temperature and equal
 * mole fractions, heavy species first. Every value is from memory (we
 * believe of the size reported in the reviews of Grew and Ibbs, Thermal
 * Diffusion in Gases, 1952, and Mason, Munn and Smith, Adv. At. Mol.
 * Phys. 2, 1966; not confirmed: a search of the stored public pages
 * found the papers' abstracts but no numbers). Compared within the
 * stated typical error MCD_THERMAL_CE_TYPICAL_ERROR. */
START_TEST(pairs_agree_with_measured_factors)
{
    static const struct {
        const char *a, *b;
        double alpha;
    } m[] = {
        {"Ar", "He", 0.38},  /* from memory */
        {"Ar", "Ne", 0.18},  /* from memory */
        {"N2", "H2", 0.34},  /* from memory */
        {"CO2", "H2", 0.28}, /* from memory */
        {"N2", "He", 0.36},  /* from memory */
    };
    mcd_db *db;
    ck_assert_int_eq(mcd_db_new_builtin(&db), MCD_OK);
    for (size_t k = 0; k < sizeof m / sizeof m[0]; k++) {
        double a;
        ck_assert_int_eq(mcd_db_thermal_factor(db, find(db, m[k].a),
                                               find(db, m[k].b), 300.0, 0.5, &a,
                                               NULL, NULL),
                         MCD_OK);
        ck_assert_msg(fabs(a / m[k].alpha - 1.0) <=
                          MCD_THERMAL_CE_TYPICAL_ERROR,
                      "%s-%s: %g, measured %g", m[k].a, m[k].b, a, m[k].alpha);
    }
    mcd_db_free(db);
}
END_TEST

/* ------------------------------------------------------------------ */
/* Mixtures                                                            */
/* ------------------------------------------------------------------ */

static const char *const gases[NMAX] = {"H2",  "He", "Ne", "N2", "Ar",
                                        "CO2", "Kr", "Xe", "CH4"};

static mcd_mixture *mix_new(const mcd_db *db, size_t n, const char **names)
{
    mcd_mixture *m;
    ck_assert_int_eq(mcd_mixture_new(db, n, names, MCD_GAS_CHAPMAN_ENSKOG, &m),
                     MCD_OK);
    return m;
}

/* The typical error is widened by the warnings as a diffusivity's is: a
 * polar, associating pair (water-nitrogen) is flagged and gets at least
 * twice the stated 20 %; so does a mixture holding that pair; a
 * non-polar pair at ordinary temperature keeps the stated value. */
START_TEST(warned_pairs_get_a_wider_error)
{
    mcd_db *db;
    mcd_mixture *mix;
    const char *names[] = {"N2", "H2O", "Ar"};
    double a, rel, x[3] = {0.5, 0.3, 0.2}, kT[3];
    unsigned w;
    ck_assert_int_eq(mcd_db_new_builtin(&db), MCD_OK);
    ck_assert_int_eq(mcd_db_thermal_factor(db, find(db, "N2"), find(db, "H2O"),
                                           400.0, 0.5, &a, &rel, &w),
                     MCD_OK);
    ck_assert_uint_ne(w & MCD_WARN_POLAR, 0);
    ck_assert(rel >= 2.0 * MCD_THERMAL_CE_TYPICAL_ERROR);
    ck_assert_double_eq_tol(rel, widened(MCD_THERMAL_CE_TYPICAL_ERROR, w),
                            1e-15);
    ck_assert_int_eq(mcd_db_thermal_factor(db, find(db, "Ar"), find(db, "N2"),
                                           400.0, 0.5, &a, &rel, &w),
                     MCD_OK);
    ck_assert_uint_eq(w, 0);
    ck_assert_double_eq(rel, MCD_THERMAL_CE_TYPICAL_ERROR);
    ck_assert_int_eq(
        mcd_mixture_new(db, 3, names, MCD_GAS_CHAPMAN_ENSKOG, &mix), MCD_OK);
    ck_assert_int_eq(
        mcd_mixture_thermal_ratios(mix, 400.0, x, kT, NULL, &rel, &w), MCD_OK);
    ck_assert_uint_ne(w & MCD_WARN_POLAR, 0);
    ck_assert(rel >= 2.0 * MCD_THERMAL_MIX_TYPICAL_ERROR);
    mcd_mixture_free(mix);
    mcd_db_free(db);
}
END_TEST

/* N = 2 is the binary k_T = x1 x2 alpha_T (same arithmetic); the ratios
 * sum to zero (each pair adds +t and -t: round-off of N terms); theta
 * times x is k_T. */
START_TEST(mixture_ratios_binary_and_zero_sum)
{
    mcd_db *db;
    ck_assert_int_eq(mcd_db_new_builtin(&db), MCD_OK);
    for (size_t n = 2; n <= NMAX; n++) {
        mcd_mixture *mix = mix_new(db, n, (const char **)gases);
        for (int k = 0; k < 50; k++) {
            double x[NMAX], kT[NMAX], th[NMAX], rel, s = 0, big = 0;
            double T = sup_range(&rng, 250.0, 2000.0);
            unsigned w;
            sup_fractions(&rng, n, 0.0, x);
            ck_assert_int_eq(
                mcd_mixture_thermal_ratios(mix, T, x, kT, th, &rel, &w),
                MCD_OK);
            for (size_t i = 0; i < n; i++) {
                s += kT[i];
                big = fmax(big, fabs(kT[i]));
                ck_assert_double_eq_tol(th[i] * x[i], kT[i],
                                        1e-14 * (1 + fabs(kT[i])));
            }
            ck_assert_msg(fabs(s) <= 4.0 * n * 2.2e-16 * big, "sum %g", s);
            if (n == 2) {
                double a;
                ck_assert_int_eq(mcd_db_thermal_factor(db, find(db, gases[0]),
                                                       find(db, gases[1]), T,
                                                       x[0], &a, NULL, NULL),
                                 MCD_OK);
                ck_assert_double_eq_tol(kT[0], x[0] * x[1] * a, 1e-15);
                ck_assert_double_eq_tol(
                    rel, widened(MCD_THERMAL_CE_TYPICAL_ERROR, w), 1e-15);
            } else {
                ck_assert_double_eq_tol(
                    rel, widened(MCD_THERMAL_MIX_TYPICAL_ERROR, w), 1e-15);
            }
        }
        mcd_mixture_free(mix);
    }
    mcd_db_free(db);
}
END_TEST

/* A species with x_i = 0 has k_T,i = 0, a finite theta_i = sum_j x_j
 * alpha_ij(0), and leaves the other species' ratios as without it. */
START_TEST(mixture_trace_species)
{
    const char *with[4] = {"N2", "H2", "Ar", "He"},
               *without[3] = {"N2", "Ar", "He"};
    double x4[4] = {0.5, 0.0, 0.3, 0.2}, x3[3] = {0.5, 0.3, 0.2};
    double k4[4], k3[3], th[4], want = 0.0;
    mcd_db *db;
    mcd_mixture *m4, *m3;
    ck_assert_int_eq(mcd_db_new_builtin(&db), MCD_OK);
    m4 = mix_new(db, 4, with);
    m3 = mix_new(db, 3, without);
    ck_assert_int_eq(
        mcd_mixture_thermal_ratios(m4, 400.0, x4, k4, th, NULL, NULL), MCD_OK);
    ck_assert_int_eq(
        mcd_mixture_thermal_ratios(m3, 400.0, x3, k3, NULL, NULL, NULL),
        MCD_OK);
    ck_assert_double_eq(k4[1], 0.0);
    ck_assert_double_eq_tol(k4[0], k3[0], 1e-15);
    ck_assert_double_eq_tol(k4[2], k3[1], 1e-15);
    ck_assert_double_eq_tol(k4[3], k3[2], 1e-15);
    for (size_t j = 0; j < 4; j++) {
        double a;
        if (j == 1)
            continue;
        mcd_db_thermal_factor(db, find(db, "H2"), find(db, with[j]), 400.0, 0.0,
                              &a, NULL, NULL);
        want += x4[j] * a;
    }
    ck_assert_double_eq_tol(th[1], want, 1e-14);
    ck_assert_msg(th[1] < 0.0, "H2 goes to the hot side: %g", th[1]);
    mcd_mixture_free(m4);
    mcd_mixture_free(m3);
    mcd_db_free(db);
}
END_TEST

/* The binary law J_1 = -c D_12 (grad x_1 + k_T grad ln T) with k_T from
 * the kinetic estimate, through mcd_flux_compute: a 1 x 1 solve, a few
 * roundings. */
START_TEST(binary_flux_law_with_kinetic_ratio)
{
    const char *names[2] = {"Ar", "He"};
    mcd_db *db;
    mcd_mixture *mix;
    mcd_workspace *ws;
    ck_assert_int_eq(mcd_db_new_builtin(&db), MCD_OK);
    mix = mix_new(db, 2, names);
    ck_assert_int_eq(mcd_workspace_new(2, &ws), MCD_OK);
    for (int k = 0; k < 200; k++) {
        double x[2], kT[2], D[4], M[2], g[2], glnT[1], J[2], c, T, P;
        mcd_state s = {0};
        T = sup_range(&rng, 250.0, 1500.0);
        P = sup_range(&rng, 5e4, 5e5);
        x[0] = sup_range(&rng, 0.01, 0.99);
        x[1] = 1 - x[0];
        g[0] = sup_range(&rng, -50, 50);
        g[1] = -g[0];
        glnT[0] = sup_range(&rng, -300, 300);
        ck_assert_int_eq(
            mcd_mixture_thermal_ratios(mix, T, x, kT, NULL, NULL, NULL),
            MCD_OK);
        ck_assert_int_eq(mcd_mixture_binaries(mix, T, P, D, NULL, NULL),
                         MCD_OK);
        ck_assert_int_eq(mcd_mixture_molar_masses(mix, M), MCD_OK);
        mcd_comp_ideal_gas_c(T, P, &c);
        s.n_species = 2;
        s.n_dim = 1;
        s.comp_basis = MCD_BASIS_MOLE;
        s.c = c;
        s.M = M;
        s.Dij = D;
        s.comp = x;
        s.grad = g;
        s.kT = kT;
        s.grad_lnT = glnT;
        ck_assert_int_eq(mcd_flux_compute(ws, MCD_MODEL_MAXWELL_STEFAN, &s,
                                          MCD_BASIS_MOLE, J),
                         MCD_OK);
        {
            double want = -c * D[1] * (g[0] + kT[0] * glnT[0]);
            double scale = c * D[1] * (fabs(g[0]) + fabs(kT[0] * glnT[0]));
            ck_assert_msg(fabs(J[0] - want) <= 1e-13 * scale, "%g %g", J[0],
                          want);
            ck_assert_msg(fabs(J[0] + J[1]) <= 1e-13 * scale, "sum");
        }
    }
    mcd_workspace_free(ws);
    mcd_mixture_free(mix);
    mcd_db_free(db);
}
END_TEST

/* ------------------------------------------------------------------ */
/* Dufour heat flux                                                    */
/* ------------------------------------------------------------------ */

typedef struct dstate {
    size_t n;
    double x[NMAX], M[NMAX], D[NMAX * NMAX], th[NMAX], kT[NMAX], c, T;
} dstate;

static void ddraw(dstate *s, size_t n, int trace)
{
    s->n = n;
    sup_fractions(&rng, n, 0.05, s->x);
    if (trace) {
        double sum = 0;
        s->x[n - 1] = 0.0;
        for (size_t i = 0; i < n; i++)
            sum += s->x[i];
        for (size_t i = 0; i < n; i++)
            s->x[i] /= sum;
    }
    for (size_t i = 0; i < n; i++) {
        s->M[i] = sup_molar_mass(&rng);
        s->th[i] = sup_range(&rng, -0.6, 0.6);
        s->kT[i] = s->x[i] * s->th[i];
    }
    sup_dij_decades(&rng, n, s->D, -5.0, -4.0);
    s->T = sup_range(&rng, 250.0, 2000.0);
    s->c = sup_range(&rng, 5.0, 80.0);
}

static void dflux(mcd_workspace *ws, const dstate *s, const double *g,
                  const double *glnT, mcd_basis fb, double *J)
{
    mcd_state st = {0};
    st.n_species = s->n;
    st.n_dim = NDIM;
    st.comp_basis = MCD_BASIS_MOLE;
    st.c = s->c;
    st.M = s->M;
    st.Dij = s->D;
    st.comp = s->x;
    st.grad = g;
    st.kT = s->kT;
    st.grad_lnT = glnT;
    ck_assert_int_eq(mcd_flux_compute(ws, MCD_MODEL_MAXWELL_STEFAN, &st, fb, J),
                     MCD_OK);
}

/* Velocity u_i = v_i - v (molar average) of every species in state b;
 * a trace species by its own equation (Blanc's law with the thermal
 * force): d_i / x_i -> theta'_i grad ln T when grad x_i = 0. */
static void velocities(const dstate *s, const double *J, const double *glnT,
                       double *u)
{
    const size_t n = s->n;
    double mean = 0.0;
    for (size_t i = 0; i < n; i++)
        mean += s->x[i] * s->th[i];
    for (size_t i = 0; i < n; i++)
        for (size_t d = 0; d < NDIM; d++) {
            if (s->x[i] > 0.0) {
                u[i * NDIM + d] = J[i * NDIM + d] / (s->c * s->x[i]);
                continue;
            }
            double num = -(s->th[i] - mean) * glnT[d], den = 0.0;
            for (size_t j = 0; j < n; j++)
                if (j != i && s->x[j] > 0.0) {
                    num += s->x[j] * J[j * NDIM + d] / (s->c * s->x[j]) /
                           s->D[i * n + j];
                    den += s->x[j] / s->D[i * n + j];
                }
            u[i * NDIM + d] = num / den;
        }
}

/* Onsager reciprocity: with state a (composition gradients, no grad T)
 * and state b (grad ln T only) at the same point,
 *   sum_i F^a_i . u^b_i = q_D^a . X_0^b,  F_i = -p d_i, X_0 = -grad ln T,
 * i.e. p sum_i d^a_i . u^b_i = q_D^a . grad ln T^b: the coefficient that
 * couples the heat flux to the composition forces equals the one that
 * couples the species fluxes to the temperature force. Both sides are
 * sums of O(N) products of fluxes accurate to 1e-11 normwise (the
 * documented accuracy of mcd_flux_compute); 1e-9 of the sum of the
 * magnitudes covers it for N <= 9 with Đ over one decade. Mass fluxes
 * give the same q_D (the same sum in another frame: round-off). */
START_TEST(dufour_onsager_reciprocity)
{
    mcd_workspace *ws;
    ck_assert_int_eq(mcd_workspace_new(NMAX, &ws), MCD_OK);
    for (int k = 0; k < 600; k++) {
        size_t n = 2 + (size_t)(k % (NMAX - 1));
        int trace = n > 2 && k % 3 == 0;
        dstate s;
        double g[NMAX * NDIM], z[NMAX * NDIM] = {0}, glnT[NDIM], z3[NDIM] = {0};
        double Ja[NMAX * NDIM], ja[NMAX * NDIM], Jb[NMAX * NDIM];
        double ub[NMAX * NDIM], qa[NDIM], qm[NDIM], lhs = 0, rhs = 0, mag = 0;
        ddraw(&s, n, trace);
        sup_gradients_zero_mean(&rng, n, NDIM, -50.0, 50.0, g);
        for (size_t d = 0; d < NDIM; d++)
            glnT[d] = sup_range(&rng, -300.0, 300.0);
        dflux(ws, &s, g, z3, MCD_BASIS_MOLE, Ja);
        dflux(ws, &s, g, z3, MCD_BASIS_MASS, ja);
        dflux(ws, &s, z, glnT, MCD_BASIS_MOLE, Jb);
        ck_assert_int_eq(mcd_dufour_heat_flux(n, NDIM, s.x, s.M, s.th, s.T,
                                              MCD_BASIS_MOLE, Ja, qa),
                         MCD_OK);
        ck_assert_int_eq(mcd_dufour_heat_flux(n, NDIM, s.x, s.M, s.th, s.T,
                                              MCD_BASIS_MASS, ja, qm),
                         MCD_OK);
        velocities(&s, Jb, glnT, ub);
        {
            const double p = s.c * MCD_GAS_CONSTANT * s.T;
            for (size_t i = 0; i < n; i++)
                for (size_t d = 0; d < NDIM; d++) {
                    lhs += p * g[i * NDIM + d] * ub[i * NDIM + d];
                    mag += fabs(p * g[i * NDIM + d] * ub[i * NDIM + d]);
                }
        }
        for (size_t d = 0; d < NDIM; d++) {
            double qs = 0;
            rhs += qa[d] * glnT[d];
            for (size_t i = 0; i < n; i++)
                qs += fabs(MCD_GAS_CONSTANT * s.T * s.th[i] * Ja[i * NDIM + d]);
            ck_assert_msg(fabs(qa[d] - qm[d]) <= 1e-11 * (qs + 1e-300),
                          "mole %g mass %g", qa[d], qm[d]);
            mag += fabs(qa[d] * glnT[d]);
        }
        ck_assert_msg(fabs(lhs - rhs) <= 1e-9 * mag,
                      "n %zu trace %d: %.15g vs %.15g", n, trace, lhs, rhs);
    }
    mcd_workspace_free(ws);
}
END_TEST

/* A trace species carries Dufour heat with its flux (theta_i J_i): the
 * result at x_i = 0 is the limit of x_i -> 0 (first order in x_i). */
START_TEST(dufour_trace_species_is_the_limit)
{
    mcd_workspace *ws;
    ck_assert_int_eq(mcd_workspace_new(NMAX, &ws), MCD_OK);
    for (int k = 0; k < 100; k++) {
        size_t n = 3 + (size_t)(k % (NMAX - 2));
        dstate s, t;
        double g[NMAX * NDIM], z3[NDIM] = {0}, J0[NMAX * NDIM];
        double J1[NMAX * NDIM], q0[NDIM], q1[NDIM];
        ddraw(&s, n, 1);
        sup_gradients_zero_mean(&rng, n, NDIM, -50.0, 50.0, g);
        t = s;
        t.x[n - 1] = 1e-9;
        t.x[0] -= 1e-9;
        for (size_t i = 0; i < n; i++)
            t.kT[i] = t.x[i] * t.th[i];
        dflux(ws, &s, g, z3, MCD_BASIS_MOLE, J0);
        dflux(ws, &t, g, z3, MCD_BASIS_MOLE, J1);
        mcd_dufour_heat_flux(n, NDIM, s.x, s.M, s.th, s.T, MCD_BASIS_MOLE, J0,
                             q0);
        mcd_dufour_heat_flux(n, NDIM, t.x, t.M, t.th, t.T, MCD_BASIS_MOLE, J1,
                             q1);
        for (size_t d = 0; d < NDIM; d++) {
            double sc = 0;
            for (size_t i = 0; i < n; i++)
                sc += fabs(MCD_GAS_CONSTANT * s.T * s.th[i] * J0[i * NDIM + d]);
            ck_assert_msg(fabs(q0[d] - q1[d]) <= 1e-6 * sc, "%g %g", q0[d],
                          q1[d]);
        }
    }
    mcd_workspace_free(ws);
}
END_TEST

/* ------------------------------------------------------------------ */
/* Errors                                                              */
/* ------------------------------------------------------------------ */

START_TEST(errors_named_outputs_untouched)
{
    double o[4], r[3], a = SUP_GUARD, k[3], q[NDIM], x[2] = {0.5, 0.5};
    double th[2] = {0.1, -0.1}, J[2 * NDIM] = {0}, M[2] = {0.004, 0.04};
    const char *names[3] = {"N2", "H2", "Ar"};
    unsigned w = 77;
    mcd_db *db;
    mcd_mixture *mix;
    sup_guard_fill(o, 4);
    sup_guard_fill(r, 3);
    sup_guard_fill(k, 3);
    sup_guard_fill(q, NDIM);
    ck_assert_int_eq(mcd_lj_collision_integrals(0.2, o, r), MCD_EDOM);
    ck_assert_int_eq(mcd_lj_collision_integrals(101.0, o, r), MCD_EDOM);
    ck_assert_int_eq(mcd_lj_collision_integrals(SUP_NAN, o, r), MCD_EINVAL);
    ck_assert_int_eq(mcd_lj_collision_integrals(1.0, NULL, NULL), MCD_EINVAL);
    ck_assert(strstr(mcd_last_error(), "out_omega") != NULL);
    ck_assert(sup_guard_intact(o, 4) && sup_guard_intact(r, 3));
    ck_assert_int_eq(
        mcd_thermal_factor_kinetic(0.004, 0.04, 1.5, 1, 1, 1, 1, 1, &a),
        MCD_EDOM);
    ck_assert(strstr(mcd_last_error(), "x1") != NULL);
    ck_assert_int_eq(
        mcd_thermal_factor_kinetic(0.004, 0.04, 0.5, 1, SUP_NAN, 1, 1, 1, &a),
        MCD_EINVAL);
    ck_assert(strstr(mcd_last_error(), "argument B") != NULL);
    ck_assert_int_eq(
        mcd_thermal_factor_kinetic(-1, 0.04, 0.5, 1, 1, 1, 1, 1, &a), MCD_EDOM);
    ck_assert_int_eq(
        mcd_thermal_factor_kinetic(0.004, 0.04, 0.5, 1, 1, 1, 1, 1, NULL),
        MCD_EINVAL);
    ck_assert_int_eq(mcd_thermal_factor_ce(0.0, 0.004, 0.04, 2.5e-10, 3.5e-10,
                                           10, 93, 0.5, &a, &w),
                     MCD_EDOM);
    ck_assert_int_eq(mcd_thermal_factor_ce(300, 0.004, 0.04, 2.5e-10, SUP_NAN,
                                           10, 93, 0.5, &a, &w),
                     MCD_EINVAL);
    ck_assert(a == SUP_GUARD && w == 77);
    /* out of the table: clamped and flagged */
    ck_assert_int_eq(mcd_thermal_factor_ce(1.0, 0.004, 0.04, 2.5e-10, 3.5e-10,
                                           10, 93, 0.5, &a, &w),
                     MCD_OK);
    ck_assert_uint_eq(w & MCD_WARN_TEMPERATURE, MCD_WARN_TEMPERATURE);
    a = SUP_GUARD;
    ck_assert_int_eq(mcd_db_new_builtin(&db), MCD_OK);
    ck_assert_int_eq(mcd_db_thermal_factor(db, 0, 0, 300, 0.5, &a, NULL, NULL),
                     MCD_EINVAL);
    ck_assert_int_eq(
        mcd_db_thermal_factor(db, 0, 100000, 300, 0.5, &a, NULL, NULL),
        MCD_ENOTFOUND);
    ck_assert_int_eq(mcd_db_thermal_factor(db, 0, 1, 300, -0.1, &a, NULL, NULL),
                     MCD_EDOM);
    ck_assert(a == SUP_GUARD);
    mix = mix_new(db, 3, names);
    {
        double xb[3] = {0.5, 0.6, 0.1}, x3[3] = {0.2, 0.3, 0.5};
        ck_assert_int_eq(
            mcd_mixture_thermal_ratios(mix, 300, xb, k, NULL, NULL, NULL),
            MCD_EDOM);
        ck_assert_int_eq(
            mcd_mixture_thermal_ratios(mix, SUP_NAN, x3, k, NULL, NULL, NULL),
            MCD_EINVAL);
        ck_assert(sup_guard_intact(k, 3));
    }
    ck_assert_int_eq(
        mcd_dufour_heat_flux(2, NDIM, x, M, th, -1.0, MCD_BASIS_MOLE, J, q),
        MCD_EDOM);
    ck_assert_int_eq(
        mcd_dufour_heat_flux(2, NDIM, x, NULL, th, 300.0, MCD_BASIS_MASS, J, q),
        MCD_EINVAL);
    ck_assert_int_eq(
        mcd_dufour_heat_flux(2, 0, x, M, th, 300.0, MCD_BASIS_MOLE, J, q),
        MCD_EINVAL);
    th[1] = SUP_NAN;
    ck_assert_int_eq(
        mcd_dufour_heat_flux(2, NDIM, x, M, th, 300.0, MCD_BASIS_MOLE, J, q),
        MCD_EINVAL);
    ck_assert(strstr(mcd_last_error(), "theta") != NULL);
    ck_assert(sup_guard_intact(q, NDIM));
    mcd_mixture_free(mix);
    mcd_db_free(db);
}
END_TEST

int main(void)
{
    Suite *s = suite_create("mcd:thermal_kt");
    TCase *tc = tcase_create("collision");
    tcase_add_test(tc, collision_table_agrees_with_neufeld_fits);
    tcase_add_test(tc, collision_table_agrees_with_published_values);
    suite_add_tcase(s, tc);
    tc = tcase_create("formula");
    tcase_add_test(tc, kinetic_maxwell_molecules_give_no_thermal_diffusion);
    tcase_add_test(tc, kinetic_isotopic_limit);
    tcase_add_test(tc, kinetic_antisymmetric_in_the_species);
    suite_add_tcase(s, tc);
    tc = tcase_create("pairs");
    tcase_add_test(tc, pairs_heavier_species_goes_to_the_cold_side);
    tcase_add_test(tc, pairs_agree_with_measured_factors);
    tcase_add_test(tc, mixture_ratios_binary_and_zero_sum);
    tcase_add_test(tc, warned_pairs_get_a_wider_error);
    tcase_add_test(tc, mixture_trace_species);
    tcase_add_test(tc, binary_flux_law_with_kinetic_ratio);
    suite_add_tcase(s, tc);
    tc = tcase_create("dufour");
    tcase_add_test(tc, dufour_onsager_reciprocity);
    tcase_add_test(tc, dufour_trace_species_is_the_limit);
    suite_add_tcase(s, tc);
    tc = tcase_create("errors");
    tcase_add_test(tc, errors_named_outputs_untouched);
    suite_add_tcase(s, tc);
    return sup_run(s);
}
