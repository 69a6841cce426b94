/* test_binary_experimental.c - gas and liquid binary diffusivities of
 * built-in species against measured values from handbook tables.
 *
 * Sources (each row below names its own):
 *  [CRC]   CRC Handbook of Chemistry and Physics, table "Diffusion in gases"
 *          (values from Marrero and Mason, J. Phys. Chem. Ref. Data 1, 1
 *          (1972) and Kestin et al., ibid. 13, 229 (1984)), 101.325 kPa.
 *          Rows with fewer than 7 entries start at a later column; the
 *          column of the first entry was fixed by the ratio of neighbouring
 *          entries (e.g. CH4-air 0.210 -> 0.321 is a factor 1.53 =
 *          (373.15/293.15)^1.75, so 0.210 is at 293.15 K).
 *  [WWW]   Welty, Wicks and Wilson, Fundamentals of Momentum, Heat and Mass
 *          Transfer, 3rd ed. (1984), table of binary mass diffusivities in
 *          gases (D P in cm^2 atm/s), as reprinted in Benitez, Principles
 *          and Modern Applications of Mass Transfer Operations, App. A,
 *          Table A.1; and liquids at infinite dilution, Table A.2.
 *  [JAHNE] CRC Handbook, table "Diffusion of gases in water" (Jaehne,
 *          Heinz and Dietrich, J. Geophys. Res. 92, 10767 (1987)).
 *
 * Bounds. Published average absolute errors (mcd_method_typical_error,
 * sources in lib/props/binary.c): FSG 5.4 %, Wilke-Lee 7 %, Chapman-Enskog 8 %,
 * Wilke-Chang 11 %. Per pair we allow 3 times the average (single pairs in
 * the published comparisons reach 15-25 %), and over the whole set the
 * mean absolute error must not exceed the published average. Measured
 * (48 pairs, built-in table of the data layer): FSG 4.7 %, Chapman-Enskog
 * 5.8 %, Wilke-Lee 5.7 %; the run prints every pair.
 */
#include <check.h>
#include <math.h>
#include <stdio.h>
#include <string.h>
#include <stdlib.h>

#include "mcdiff.h"
#include "support.h"

typedef struct {
    const char *a, *b;
    double T;     /* K, at 1 atm */
    double D_cgs; /* measured, cm^2/s */
    const char *src;
    int disputed; /* sources disagree beyond the method error: the pair
                     enters the mean but not the per-pair bound */
} gas_pair;

static const gas_pair gas_pairs[] = {
    /* [CRC] 293.15 K, large excess of air */
    {"argon", "air", 293.15, 0.189, "CRC (Marrero-Mason 1972)", 0},
    {"methane", "air", 293.15, 0.210, "CRC (Marrero-Mason 1972)", 0},
    {"carbon-monoxide", "air", 293.15, 0.208, "CRC (Marrero-Mason 1972)", 0},
    {"carbon-dioxide", "air", 293.15, 0.160, "CRC (Marrero-Mason 1972)", 0},
    {"hydrogen", "air", 293.15, 0.756, "CRC (Marrero-Mason 1972)", 0},
    {"water", "air", 293.15, 0.242, "CRC (Marrero-Mason 1972)", 0},
    {"helium", "air", 293.15, 0.697, "CRC (Marrero-Mason 1972)", 0},
    /* [CRC] 293.15 K, equimolar */
    {"argon", "carbon-monoxide", 293.15, 0.190, "CRC (Marrero-Mason 1972)", 0},
    {"argon", "carbon-dioxide", 293.15, 0.148, "CRC (Marrero-Mason 1972)", 0},
    {"argon", "hydrogen", 293.15, 0.794, "CRC (Marrero-Mason 1972)", 0},
    {"argon", "helium", 293.15, 0.726, "CRC (Marrero-Mason 1972)", 0},
    {"argon", "krypton", 293.15, 0.134, "CRC (Marrero-Mason 1972)", 0},
    {"argon", "nitrogen", 293.15, 0.190, "CRC (Marrero-Mason 1972)", 0},
    {"argon", "neon", 293.15, 0.313, "CRC (Marrero-Mason 1972)", 0},
    {"argon", "oxygen", 293.15, 0.187, "CRC (Marrero-Mason 1972)", 0},
    {"argon", "xenon", 293.15, 0.108, "CRC (Marrero-Mason 1972)", 0},
    {"methane", "hydrogen", 293.15, 0.708, "CRC (Marrero-Mason 1972)", 0},
    {"methane", "helium", 293.15, 0.650, "CRC (Marrero-Mason 1972)", 0},
    {"methane", "nitrogen", 293.15, 0.208, "CRC (Marrero-Mason 1972)", 0},
    {"methane", "oxygen", 293.15, 0.220, "CRC (Marrero-Mason 1972)", 0},
    /* [CRC] other temperatures */
    {"argon", "helium", 200.0, 0.381, "CRC (Marrero-Mason 1972)", 0},
    {"argon", "helium", 673.15, 2.911, "CRC (Marrero-Mason 1972)", 0},
    {"hydrogen", "air", 573.15, 2.444, "CRC (Marrero-Mason 1972)", 0},
    {"carbon-dioxide", "air", 473.15, 0.390, "CRC (Marrero-Mason 1972)", 0},
    /* [WWW] vapours and gases, D P in cm^2 atm/s */
    {"air", "ammonia", 273.0, 0.198, "Welty et al. 1984, Benitez Tab. A.1", 0},
    {"air", "benzene", 298.0, 0.0962, "Welty et al. 1984, Benitez Tab. A.1", 0},
    {"air", "ethanol", 298.0, 0.132, "Welty et al. 1984, Benitez Tab. A.1", 0},
    {"air", "methanol", 298.0, 0.162, "Welty et al. 1984, Benitez Tab. A.1", 0},
    {"air", "toluene", 298.0, 0.0844, "Welty et al. 1984, Benitez Tab. A.1", 0},
    {"air", "water", 298.0, 0.260, "Welty et al. 1984, Benitez Tab. A.1", 0},
    {"air", "n-octane", 298.0, 0.0602, "Welty et al. 1984, Benitez Tab. A.1",
     0},
    {"air", "chlorine", 273.0, 0.124, "Welty et al. 1984, Benitez Tab. A.1", 0},
    {"air", "sulfur-dioxide", 273.0, 0.122,
     "Welty et al. 1984, Benitez Tab. A.1", 0},
    {"air", "ethyl-acetate", 273.0, 0.0709,
     "Welty et al. 1984, Benitez Tab. A.1", 0},
    {"carbon-dioxide", "nitrogen", 298.0, 0.165,
     "Welty et al. 1984, Benitez Tab. A.1", 0},
    {"carbon-dioxide", "hydrogen", 273.0, 0.550,
     "Welty et al. 1984, Benitez Tab. A.1", 0},
    {"carbon-dioxide", "nitrous-oxide", 298.0, 0.117,
     "Welty et al. 1984, Benitez Tab. A.1", 0},
    {"carbon-dioxide", "propane", 298.0, 0.0863,
     "Welty et al. 1984, Benitez Tab. A.1", 0},
    /* Disputed: FSG is +27 % from this value, Chapman-Enskog -10 %; other
     * compilations list CO2-H2O near 0.198 cm^2/s at 307 K (Cussler,
     * Diffusion, Table 5.1-1; from memory), i.e. about 0.19 at 298 K. */
    {"carbon-dioxide", "water", 298.0, 0.164,
     "Welty et al. 1984, Benitez Tab. A.1", 1},
    {"carbon-monoxide", "nitrogen", 288.0, 0.192,
     "Welty et al. 1984, Benitez Tab. A.1", 0},
    {"hydrogen", "ethane", 273.0, 0.439, "Welty et al. 1984, Benitez Tab. A.1",
     0},
    {"hydrogen", "oxygen", 273.0, 0.697, "Welty et al. 1984, Benitez Tab. A.1",
     0},
    {"hydrogen", "ammonia", 293.0, 0.849, "Welty et al. 1984, Benitez Tab. A.1",
     0},
    {"nitrogen", "ammonia", 293.0, 0.241, "Welty et al. 1984, Benitez Tab. A.1",
     0},
    {"nitrogen", "ethylene", 298.0, 0.163,
     "Welty et al. 1984, Benitez Tab. A.1", 0},
    {"nitrogen", "oxygen", 273.0, 0.181, "Welty et al. 1984, Benitez Tab. A.1",
     0},
    {"helium", "water", 298.0, 0.908, "Welty et al. 1984, Benitez Tab. A.1", 0},
    {"oxygen", "benzene", 296.0, 0.0939, "Welty et al. 1984, Benitez Tab. A.1",
     0},
};
#define N_GAS (sizeof gas_pairs / sizeof gas_pairs[0])

static mcd_db *db;
static void setup(void) { ck_assert_int_eq(mcd_db_new_builtin(&db), MCD_OK); }
static void teardown(void)
{
    mcd_db_free(db);
    db = NULL;
}

static size_t find(const char *name)
{
    size_t i = (size_t)-1;
    mcd_status st = mcd_db_find(db, name, &i);
    ck_assert_msg(st == MCD_OK, "built-in species '%s' missing (%s)", name,
                  mcd_status_string(st));
    return i;
}

/* Run every pair through one method; check the per-pair and mean bounds.
 * A pair whose parameters the method lacks fails the test (the built-in
 * table is expected to cover every species used here). */
static void check_gas_method(mcd_method m)
{
    double avg = mcd_method_typical_error(m);
    double sum = 0.0, worst = 0.0;
    size_t worst_k = 0;
    for (size_t k = 0; k < N_GAS; k++) {
        const gas_pair *p = &gas_pairs[k];
        double D = SUP_NAN, rel = SUP_NAN;
        unsigned w = 0;
        mcd_status st =
            mcd_db_binary_gas(db, find(p->a), find(p->b), (mcd_gas_method)m,
                              p->T, MCD_ATM, &D, &rel, &w);
        ck_assert_msg(st == MCD_OK, "%s: %s-%s: %s", mcd_method_name(m), p->a,
                      p->b, mcd_status_string(st));
        double dexp = p->D_cgs * 1e-4;
        double e = fabs(D - dexp) / dexp;
        printf("  %-15s %-16s %-15s %7.2f K  exp %.4f  est %.4f cm2/s  %+6.1f "
               "%%  warn 0x%02x  [%s]\n",
               mcd_method_name(m), p->a, p->b, p->T, p->D_cgs, D * 1e4,
               100 * (D - dexp) / dexp, w, p->src);
        ck_assert_msg(p->disputed || e <= 3 * avg,
                      "%s %s-%s at %g K: error %.1f %% > %.1f %%",
                      mcd_method_name(m), p->a, p->b, p->T, 100 * e, 300 * avg);
        ck_assert(rel == avg);
        sum += e;
        if (e > worst) {
            worst = e;
            worst_k = k;
        }
    }
    double mean = sum / (double)N_GAS;
    printf("%s: %zu pairs, mean absolute error %.1f %% (published %.1f %%), "
           "worst %.1f %% (%s-%s)\n",
           mcd_method_name(m), (size_t)N_GAS, 100 * mean, 100 * avg,
           100 * worst, gas_pairs[worst_k].a, gas_pairs[worst_k].b);
    ck_assert_msg(mean <= avg, "%s mean error %.1f %% > %.1f %%",
                  mcd_method_name(m), 100 * mean, 100 * avg);
}

START_TEST(binary_experimental_fsg_within_published_error)
{
    check_gas_method(MCD_METHOD_FSG);
}
END_TEST

START_TEST(binary_experimental_chapman_enskog_within_published_error)
{
    check_gas_method(MCD_METHOD_CHAPMAN_ENSKOG);
}
END_TEST

START_TEST(binary_experimental_wilke_lee_within_published_error)
{
    check_gas_method(MCD_METHOD_WILKE_LEE);
}
END_TEST

START_TEST(binary_experimental_set_has_twenty_pairs)
{
    size_t undisputed = 0;
    for (size_t k = 0; k < N_GAS; k++)
        undisputed += !gas_pairs[k].disputed;
    ck_assert_uint_ge(undisputed, 20);
}
END_TEST

/* Brokaw's polar correction against plain Chapman-Enskog on the pairs of
 * the table above with a polar member (dipole above 1 debye, the
 * MCD_WARN_POLAR rule) whose parameters Brokaw's method has (dipole, Vb
 * and Tb of both species: He and CO2 lack Vb or Tb and are skipped).
 * Measured values and their sources are those of gas_pairs. Checks:
 * every such pair within 3 times Brokaw's typical error; over the set a
 * smaller mean absolute error than Chapman-Enskog's and no more than the
 * typical error; and for the water and ammonia pairs, where the dipole
 * dominates, each Brokaw estimate closer to the measurement than
 * Chapman-Enskog's. (Alcohols with air are about as good either way:
 * printed, not asserted per pair.) */
START_TEST(binary_experimental_brokaw_beats_chapman_enskog_on_polar_pairs)
{
    const double debye = 3.33564e-30; /* C m */
    double avg = mcd_method_typical_error(MCD_METHOD_BROKAW);
    double sum_b = 0.0, sum_ce = 0.0;
    size_t n = 0, n_strong = 0;
    for (size_t k = 0; k < N_GAS; k++) {
        const gas_pair *p = &gas_pairs[k];
        size_t a = find(p->a), b = find(p->b);
        double da = 0.0, db_ = 0.0, Db = SUP_NAN, Dce = SUP_NAN, rel = SUP_NAN;
        unsigned wb = 0, wce = 0;
        (void)mcd_db_param(db, a, MCD_PARAM_DIPOLE, &da);
        (void)mcd_db_param(db, b, MCD_PARAM_DIPOLE, &db_);
        if (!(da > debye || db_ > debye))
            continue;
        if (mcd_db_binary_gas(db, a, b, MCD_GAS_BROKAW, p->T, MCD_ATM, &Db,
                              &rel, &wb) != MCD_OK) {
            printf("  brokaw %s-%s: %s (skipped)\n", p->a, p->b,
                   mcd_last_error());
            continue;
        }
        ck_assert_int_eq(mcd_db_binary_gas(db, a, b, MCD_GAS_CHAPMAN_ENSKOG,
                                           p->T, MCD_ATM, &Dce, NULL, &wce),
                         MCD_OK);
        double dexp = p->D_cgs * 1e-4;
        double eb = fabs(Db - dexp) / dexp, ece = fabs(Dce - dexp) / dexp;
        printf("  polar %-16s %-15s %7.2f K  exp %.4f  brokaw %.4f (%+5.1f %%)"
               "  c-e %.4f (%+5.1f %%)  [%s]\n",
               p->a, p->b, p->T, p->D_cgs, Db * 1e4, 100 * (Db - dexp) / dexp,
               Dce * 1e4, 100 * (Dce - dexp) / dexp, p->src);
        ck_assert(rel == avg);
        /* the polar flag is the reason to prefer Brokaw: set on the
         * Chapman-Enskog estimate, not on Brokaw's own */
        ck_assert(wce & MCD_WARN_POLAR);
        ck_assert(!(wb & MCD_WARN_POLAR));
        ck_assert_msg(eb <= 3 * avg, "brokaw %s-%s: %.1f %%", p->a, p->b,
                      100 * eb);
        if (strcmp(p->a, "water") == 0 || strcmp(p->b, "water") == 0 ||
            strcmp(p->a, "ammonia") == 0 || strcmp(p->b, "ammonia") == 0) {
            ck_assert_msg(eb < ece, "%s-%s: brokaw %.1f %% vs c-e %.1f %%",
                          p->a, p->b, 100 * eb, 100 * ece);
            n_strong++;
        }
        sum_b += eb;
        sum_ce += ece;
        n++;
    }
    printf("brokaw: %zu polar pairs, mean absolute error %.1f %% "
           "(chapman-enskog %.1f %%, typical %.1f %%)\n",
           n, 100 * sum_b / (double)n, 100 * sum_ce / (double)n, 100 * avg);
    ck_assert_uint_ge(n, 6);
    ck_assert_uint_ge(n_strong, 3);
    ck_assert(sum_b < sum_ce);
    ck_assert(sum_b / (double)n <= avg);
}
END_TEST

/* A mixture built with MCD_GAS_RECOMMENDED holds every species of the
 * table's polar pairs (the same measured values and sources, gas_pairs).
 * For each polar pair whose species have Brokaw's data the mixture must
 * pick Brokaw's correction and give the database pair's Brokaw value (the
 * same parameters through the same expression: equal to the bit), and so
 * stay within 3 times Brokaw's typical error of the measurement as above;
 * a polar pair without the data (CO2 has no Tb, helium no Vb) falls back
 * to FSG, the database pair's FSG value. The mixture is evaluated at each
 * row's temperature, 1 atm. */
START_TEST(binary_experimental_recommended_mixture_takes_brokaw_for_polar)
{
    const double debye = 3.33564e-30; /* C m */
    double avg = mcd_method_typical_error(MCD_METHOD_BROKAW);
    const char *names[2 * N_GAS];
    size_t ns = 0, n_brokaw = 0, n_fsg = 0;
    mcd_mixture *mix = NULL;
    for (size_t k = 0; k < N_GAS; k++) {
        const char *ab[2] = {gas_pairs[k].a, gas_pairs[k].b};
        double da = 0.0, db_ = 0.0;
        (void)mcd_db_param(db, find(ab[0]), MCD_PARAM_DIPOLE, &da);
        (void)mcd_db_param(db, find(ab[1]), MCD_PARAM_DIPOLE, &db_);
        if (!(da > debye || db_ > debye))
            continue;
        for (int q = 0; q < 2; q++) {
            size_t i = 0;
            while (i < ns && strcmp(names[i], ab[q]) != 0)
                i++;
            if (i == ns)
                names[ns++] = ab[q];
        }
    }
    ck_assert_uint_ge(ns, 8);
    ck_assert_int_eq(mcd_mixture_new(db, ns, names, MCD_GAS_RECOMMENDED, &mix),
                     MCD_OK);
    for (size_t k = 0; k < N_GAS; k++) {
        const gas_pair *p = &gas_pairs[k];
        size_t ia = ns, ib = ns;
        double D[64 * 64], d = SUP_NAN, dexp = p->D_cgs * 1e-4;
        mcd_method pm = (mcd_method)0;
        for (size_t i = 0; i < ns; i++) {
            if (strcmp(names[i], p->a) == 0)
                ia = i;
            if (strcmp(names[i], p->b) == 0)
                ib = i;
        }
        {
            double da = 0.0, db_ = 0.0;
            (void)mcd_db_param(db, find(p->a), MCD_PARAM_DIPOLE, &da);
            (void)mcd_db_param(db, find(p->b), MCD_PARAM_DIPOLE, &db_);
            if (!(da > debye || db_ > debye))
                continue; /* not a polar pair */
        }
        ck_assert(ia < ns && ib < ns);
        ck_assert_uint_le(ns, 64);
        ck_assert_int_eq(
            mcd_mixture_binaries(mix, p->T, MCD_ATM, D, NULL, NULL), MCD_OK);
        ck_assert_int_eq(mcd_mixture_pair_method(mix, ia, ib, &pm), MCD_OK);
        if (mcd_db_binary_gas(db, find(p->a), find(p->b), MCD_GAS_BROKAW, p->T,
                              MCD_ATM, &d, NULL, NULL) == MCD_OK) {
            double e = fabs(d - dexp) / dexp;
            ck_assert_msg(pm == MCD_METHOD_BROKAW, "%s-%s: %s", p->a, p->b,
                          mcd_method_name(pm));
            ck_assert_msg(D[ia * ns + ib] == d, "%s-%s: %.17g vs %.17g", p->a,
                          p->b, D[ia * ns + ib], d);
            ck_assert_msg(e <= 3 * avg, "%s-%s: %.1f %% [%s]", p->a, p->b,
                          100 * e, p->src);
            n_brokaw++;
        } else {
            ck_assert_msg(pm == MCD_METHOD_FSG, "%s-%s: %s", p->a, p->b,
                          mcd_method_name(pm));
            ck_assert_int_eq(mcd_db_binary_gas(db, find(p->a), find(p->b),
                                               MCD_GAS_FSG, p->T, MCD_ATM, &d,
                                               NULL, NULL),
                             MCD_OK);
            ck_assert(D[ia * ns + ib] == d);
            n_fsg++;
        }
    }
    printf("recommended mixture of %zu species: %zu measured polar pairs by "
           "brokaw, %zu without its data by fsg\n",
           ns, n_brokaw, n_fsg);
    ck_assert_uint_ge(n_brokaw, 6);
    mcd_mixture_free(mix);
}
END_TEST

/* Liquids at infinite dilution. */
typedef struct {
    const char *solute, *solvent;
    double T;     /* K */
    double mu;    /* solvent viscosity at T, Pa s */
    double D_cgs; /* measured, cm^2/s */
    const char *src;
} liq_pair;

/* Viscosity of water at 25 C: 0.8900 mPa s (IAPWS 2008 formulation,
 * Huber et al., J. Phys. Chem. Ref. Data 38, 101 (2009); from memory).
 * Ethyl acetate at 20 C: 0.455 mPa s (CRC Handbook, "Viscosity of
 * liquids"; from memory). */
static const liq_pair liq_pairs[] = {
    {"carbon-dioxide", "water", 298.15, 0.8900e-3, 1.91e-5,
     "CRC gases in water (Jaehne 1987)"},
    {"methane", "water", 298.15, 0.8900e-3, 1.84e-5,
     "CRC gases in water (Jaehne 1987)"},
    {"air", "water", 298.0, 0.8900e-3, 2.00e-5,
     "Welty et al. 1984, Benitez Table A.2"},
    {"benzene", "water", 298.15, 0.8900e-3, 1.02e-5,
     "Witherspoon and Bonoli 1969 (from memory)"},
    {"acetone", "ethyl-acetate", 293.0, 0.455e-3, 3.18e-5,
     "Welty et al. 1984, Benitez Table A.2"},
};
#define N_LIQ (sizeof liq_pairs / sizeof liq_pairs[0])

START_TEST(binary_experimental_wilke_chang_within_published_error)
{
    /* Wilke-Chang: 11 % average (Reid and Sherwood 1966, quoted by Hayduk
     * and Laudie 1974); single solutes in the same comparisons reach about
     * 20 %: per-pair bound 2 x 11 % = 22 %; mean bound the average itself
     * (11 %). Light gases such as H2 (-33 % against Jaehne's 5.11e-5 cm^2/s)
     * are known failures of the method and are not in this set. */
    double avg = mcd_method_typical_error(MCD_METHOD_WILKE_CHANG), sum = 0.0;
    for (size_t k = 0; k < N_LIQ; k++) {
        const liq_pair *p = &liq_pairs[k];
        double D = SUP_NAN, rel = SUP_NAN;
        unsigned w = 0;
        mcd_status st = mcd_db_binary_liquid(
            db, find(p->solute), find(p->solvent), p->T, p->mu, &D, &rel, &w);
        ck_assert_msg(st == MCD_OK, "%s in %s: %s", p->solute, p->solvent,
                      mcd_status_string(st));
        double e = fabs(D - p->D_cgs * 1e-4) / (p->D_cgs * 1e-4);
        printf("  wilke-chang %-15s in %-14s %6.2f K  exp %.3g  est %.3g cm2/s "
               " %+6.1f %%  warn 0x%02x  [%s]\n",
               p->solute, p->solvent, p->T, p->D_cgs, D * 1e4,
               100 * (D * 1e4 - p->D_cgs) / p->D_cgs, w, p->src);
        ck_assert_msg(e <= 2 * avg, "%s in %s: %.1f %%", p->solute, p->solvent,
                      100 * e);
        sum += e;
    }
    printf("wilke-chang: %zu solutes, mean absolute error %.1f %% (published "
           "%.1f %%)\n",
           (size_t)N_LIQ, 100 * sum / (double)N_LIQ, 100 * avg);
    ck_assert_double_le(sum / (double)N_LIQ, avg);
}
END_TEST

/* Vb [m^3/mol] of a built-in species (tabulated or Le Bas, with the
 * table's source). */
static double vb_of(const char *name)
{
    double v = SUP_NAN;
    ck_assert_int_eq(mcd_db_param(db, find(name), MCD_PARAM_VB, &v), MCD_OK);
    return v;
}

/* Hayduk-Minhas (1982) for the solutes in water and Tyn-Calus (1975, form
 * without parachors) for the liquid solutes of the same set (its scope:
 * organic liquid solutes, include/mcdiff.h; dissolved gases are printed,
 * not checked: CO2, CH4 and air in water come out 18-25 % low), with the
 * molar volumes of the built-in table. Bounds as for Wilke-Chang: per pair
 * twice the published average error (10 % each, from memory, see
 * lib/props/binary.c), the mean at most the average. */
START_TEST(binary_experimental_hayduk_minhas_and_tyn_calus)
{
    const mcd_method ms[2] = {MCD_METHOD_HAYDUK_MINHAS, MCD_METHOD_TYN_CALUS};
    for (int a = 0; a < 2; a++) {
        double avg = mcd_method_typical_error(ms[a]), sum = 0.0;
        size_t count = 0;
        for (size_t k = 0; k < N_LIQ; k++) {
            const liq_pair *p = &liq_pairs[k];
            double D = SUP_NAN, ref = p->D_cgs * 1e-4;
            mcd_status st;
            if (ms[a] == MCD_METHOD_HAYDUK_MINHAS) {
                if (strcmp(p->solvent, "water") != 0)
                    continue;
                st =
                    mcd_binary_hayduk_minhas(p->T, p->mu, vb_of(p->solute), &D);
            } else {
                st = mcd_binary_tyn_calus(p->T, p->mu, vb_of(p->solute),
                                          vb_of(p->solvent), &D);
            }
            ck_assert_int_eq(st, MCD_OK);
            double e = fabs(D - ref) / ref, Tb = SUP_NAN;
            mcd_db_param(db, find(p->solute), MCD_PARAM_TB, &Tb);
            if (ms[a] == MCD_METHOD_TYN_CALUS && !(Tb > p->T)) {
                printf("  %-13s %-15s in %-14s exp %.3g est %.3g cm2/s "
                       "%+6.1f %%  (a gas: outside the scope, not checked)\n",
                       mcd_method_name(ms[a]), p->solute, p->solvent, p->D_cgs,
                       D * 1e4, 100 * (D - ref) / ref);
                continue;
            }
            printf("  %-13s %-15s in %-14s exp %.3g est %.3g cm2/s %+6.1f %%  "
                   "[%s]\n",
                   mcd_method_name(ms[a]), p->solute, p->solvent, p->D_cgs,
                   D * 1e4, 100 * (D - ref) / ref, p->src);
            ck_assert_msg(e <= 2 * avg, "%s: %s in %s: %.1f %%",
                          mcd_method_name(ms[a]), p->solute, p->solvent,
                          100 * e);
            sum += e;
            count++;
        }
        printf("%s: %zu solutes, mean absolute error %.1f %% (published "
               "%.1f %%)\n",
               mcd_method_name(ms[a]), count, 100 * sum / (double)count,
               100 * avg);
        ck_assert_uint_ge(count, 2);
        ck_assert_double_le(sum / (double)count, avg);
    }
}
END_TEST

int main(void)
{
    Suite *s = suite_create("mcd:binary_experimental");
    TCase *tc = tcase_create("experimental");
    tcase_add_checked_fixture(tc, setup, teardown);
    tcase_add_test(tc, binary_experimental_set_has_twenty_pairs);
    tcase_add_test(tc, binary_experimental_fsg_within_published_error);
    tcase_add_test(tc,
                   binary_experimental_chapman_enskog_within_published_error);
    tcase_add_test(tc, binary_experimental_wilke_lee_within_published_error);
    tcase_add_test(
        tc, binary_experimental_brokaw_beats_chapman_enskog_on_polar_pairs);
    tcase_add_test(
        tc, binary_experimental_recommended_mixture_takes_brokaw_for_polar);
    tcase_add_test(tc, binary_experimental_wilke_chang_within_published_error);
    tcase_add_test(tc, binary_experimental_hayduk_minhas_and_tyn_calus);
    suite_add_tcase(s, tc);
    return sup_run(s);
}
