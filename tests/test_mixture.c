/* test_mixture.c - mixtures of built-in species and their binary
 * diffusivity matrices: symmetry, zero diagonal, agreement with
 * mcd_db_binary_gas pair by pair, per-pair methods, user values and their
 * scaling, error reporting. */
#include <check.h>
#include <math.h>
#include <stdint.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

#include "mcdiff.h"
#include "support.h"
#include "props/mixture.h" /* internal fast path, tested against the API */

#define NS 6

static const char *const names6[NS] = {"nitrogen", "oxygen",   "carbon-dioxide",
                                       "water",    "hydrogen", "methane"};

static sup_rng rng = SUP_RNG(SUP_XORSHIFT64STAR, 0); /* seeded by each test */

static mcd_db *db;
static mcd_mixture *mix;

static void setup(void)
{
    ck_assert_int_eq(mcd_db_new_builtin(&db), MCD_OK);
    ck_assert_int_eq(mcd_mixture_new(db, NS, names6, MCD_GAS_FSG, &mix),
                     MCD_OK);
}
static void teardown(void)
{
    mcd_mixture_free(mix);
    mcd_db_free(db);
    mix = NULL;
    db = NULL;
}

static size_t dbi(const char *name)
{
    size_t i = 0;
    ck_assert_int_eq(mcd_db_find(db, name, &i), MCD_OK);
    return i;
}

/* Compare the mixture matrix with mcd_db_binary_gas using methods[i*NS+j]. */
static void check_against_pairs(const mcd_method *methods, double T, double P)
{
    double D[NS * NS], R[NS * NS];
    unsigned W[NS * NS];
    ck_assert_int_eq(mcd_mixture_binaries(mix, T, P, D, R, W), MCD_OK);
    for (size_t i = 0; i < NS; i++) {
        ck_assert(D[i * NS + i] == 0.0);
        ck_assert(R[i * NS + i] == 0.0);
        ck_assert_uint_eq(W[i * NS + i], 0u);
        for (size_t j = 0; j < NS; j++) {
            if (i == j)
                continue;
            double d = SUP_GUARD, r = SUP_GUARD;
            unsigned w = 0;
            /* Symmetric to the bit: each pair is computed once. */
            ck_assert(D[i * NS + j] == D[j * NS + i]);
            ck_assert_uint_eq(W[i * NS + j], W[j * NS + i]);
            ck_assert_int_eq(
                mcd_db_binary_gas(db, dbi(names6[i]), dbi(names6[j]),
                                  (mcd_gas_method)methods[i * NS + j], T, P, &d,
                                  &r, &w),
                MCD_OK);
            /* Same code path (copied parameters, same formula): identical,
             * except that the mixture computes (i, j) with i < j only and
             * each method is symmetric to the bit (test_binary.c). */
            ck_assert_msg(D[i * NS + j] == d, "(%zu,%zu) %g vs %g", i, j,
                          D[i * NS + j], d);
            ck_assert(R[i * NS + j] == r);
            ck_assert_uint_eq(W[i * NS + j], w);
        }
    }
}

START_TEST(mixture_matrix_is_symmetric_and_equals_binary_gas)
{
    mcd_method m[NS * NS];
    for (size_t k = 0; k < NS * NS; k++)
        m[k] = MCD_METHOD_FSG;
    sup_seed(&rng, 4242);
    for (int t = 0; t < 50; t++) {
        double T = sup_range(&rng, 220, 1200),
               P = sup_exp_range(&rng, 1e3, 5e6);
        check_against_pairs(m, T, P);
    }
}
END_TEST

START_TEST(mixture_per_pair_methods_are_used)
{
    mcd_method m[NS * NS];
    for (size_t k = 0; k < NS * NS; k++)
        m[k] = MCD_METHOD_FSG;
    ck_assert_int_eq(mcd_mixture_set_method(mix, 0, 1, MCD_GAS_CHAPMAN_ENSKOG),
                     MCD_OK);
    m[0 * NS + 1] = m[1 * NS + 0] = MCD_METHOD_CHAPMAN_ENSKOG;
    /* Given as (j, i): applies to the pair. */
    ck_assert_int_eq(mcd_mixture_set_method(mix, 5, 2, MCD_GAS_WILKE_LEE),
                     MCD_OK);
    m[5 * NS + 2] = m[2 * NS + 5] = MCD_METHOD_WILKE_LEE;
    ck_assert_int_eq(mcd_mixture_set_method(mix, 3, 4, MCD_GAS_CHAPMAN_ENSKOG),
                     MCD_OK);
    m[3 * NS + 4] = m[4 * NS + 3] = MCD_METHOD_CHAPMAN_ENSKOG;
    check_against_pairs(m, 350.0, 2.0e5);
    check_against_pairs(m, 800.0, 1.0e4);
    /* A mixture made with another default uses it everywhere. */
    mcd_mixture *m2 = NULL;
    ck_assert_int_eq(mcd_mixture_new(db, NS, names6, MCD_GAS_WILKE_LEE, &m2),
                     MCD_OK);
    double D[NS * NS];
    ck_assert_int_eq(mcd_mixture_binaries(m2, 300.0, 1e5, D, NULL, NULL),
                     MCD_OK);
    double d = 0;
    ck_assert_int_eq(mcd_db_binary_gas(db, dbi("water"), dbi("methane"),
                                       MCD_GAS_WILKE_LEE, 300.0, 1e5, &d, NULL,
                                       NULL),
                     MCD_OK);
    ck_assert(D[3 * NS + 5] == d);
    mcd_mixture_free(m2);
}
END_TEST

START_TEST(mixture_user_values_scale_with_t175_over_p)
{
    /* N2-CO2 0.165 cm^2/s at 298 K, 1 atm (Welty et al. 1984). */
    const double D0 = 0.165e-4, T0 = 298.0, P0 = MCD_ATM;
    double D[NS * NS], R[NS * NS];
    unsigned W[NS * NS];
    ck_assert_int_eq(mcd_mixture_set_binary(mix, 2, 0, D0, T0, P0), MCD_OK);
    ck_assert_int_eq(mcd_mixture_binaries(mix, T0, P0, D, R, W), MCD_OK);
    /* At the reference state: D0 to round-off (pow of 1.0 is exact). */
    ck_assert_double_eq_tol(D[0 * NS + 2] / D0, 1.0, 1e-15);
    ck_assert(D[2 * NS + 0] == D[0 * NS + 2]);
    ck_assert(isnan(R[0 * NS + 2]));
    ck_assert_uint_eq(W[0 * NS + 2], 0u);
    /* Twice T, three times P: D0 2^1.75 / 3 (a few ulp). */
    ck_assert_int_eq(mcd_mixture_binaries(mix, 2 * T0, 3 * P0, D, R, W),
                     MCD_OK);
    ck_assert_double_eq_tol(D[0 * NS + 2] / (D0 * pow(2.0, 1.75) / 3.0), 1.0,
                            1e-14);
    ck_assert_uint_eq(W[0 * NS + 2] & MCD_WARN_SCALED, 0u);
    /* Far from the reference: > 2x in T or > 10x in P is flagged. */
    ck_assert_int_eq(mcd_mixture_binaries(mix, 2.1 * T0, P0, D, R, W), MCD_OK);
    ck_assert(W[0 * NS + 2] & MCD_WARN_SCALED);
    ck_assert_int_eq(mcd_mixture_binaries(mix, T0, 0.09 * P0, D, R, W), MCD_OK);
    ck_assert(W[0 * NS + 2] & MCD_WARN_SCALED);
    ck_assert_int_eq(mcd_mixture_binaries(mix, 0.45 * T0, P0, D, R, W), MCD_OK);
    ck_assert(W[0 * NS + 2] & MCD_WARN_SCALED);
    /* Agrees with mcd_binary_scale. */
    double s = 0;
    ck_assert_int_eq(mcd_binary_scale(D0, T0, P0, 415.0, 3.3e5, 1.75, &s),
                     MCD_OK);
    ck_assert_int_eq(mcd_mixture_binaries(mix, 415.0, 3.3e5, D, NULL, NULL),
                     MCD_OK);
    ck_assert_double_eq_tol(D[2 * NS + 0] / s, 1.0, 1e-15);
    /* Other pairs unaffected. */
    double d = 0;
    ck_assert_int_eq(mcd_db_binary_gas(db, dbi("nitrogen"), dbi("oxygen"),
                                       MCD_GAS_FSG, 415.0, 3.3e5, &d, NULL,
                                       NULL),
                     MCD_OK);
    ck_assert(D[0 * NS + 1] == d);
    /* Switch the pair to an estimate (the value is dropped), and back by
     * giving the value again. */
    ck_assert_int_eq(mcd_mixture_set_method(mix, 0, 2, MCD_GAS_FSG), MCD_OK);
    ck_assert_int_eq(mcd_mixture_binaries(mix, T0, P0, D, NULL, NULL), MCD_OK);
    ck_assert_double_ne_tol(D[0 * NS + 2], D0, 1e-9);
    ck_assert_int_eq(mcd_mixture_set_binary(mix, 0, 2, D0, T0, P0), MCD_OK);
    ck_assert_int_eq(mcd_mixture_binaries(mix, T0, P0, D, NULL, NULL), MCD_OK);
    ck_assert_double_eq_tol(D[0 * NS + 2] / D0, 1.0, 1e-15);
    /* A value outside mcd_gas_method (USER is not one) is refused. */
    ck_assert_int_eq(
        mcd_mixture_set_method(mix, 3, 4, (mcd_gas_method)MCD_METHOD_USER),
        MCD_EINVAL);
}
END_TEST

START_TEST(mixture_unknown_species_is_named_in_the_error_detail)
{
    const char *names[3] = {"nitrogen", "unobtainium-x", "oxygen"};
    static char token;
    mcd_mixture *m = (mcd_mixture *)&token; /* sentinel: must not change */
    mcd_mixture *const sentinel = m;
    ck_assert_int_eq(mcd_mixture_new(db, 3, names, MCD_GAS_FSG, &m),
                     MCD_ENOTFOUND);
    ck_assert_ptr_eq(m, sentinel);
    ck_assert_ptr_nonnull(strstr(mcd_last_error(), "unobtainium-x"));
    /* Formula lookup (unique formula) works as in mcd_db_find. */
    const char *byformula[2] = {"CO2", "N2"};
    ck_assert_int_eq(mcd_mixture_new(db, 2, byformula, MCD_GAS_FSG, &m),
                     MCD_OK);
    ck_assert_str_eq(mcd_mixture_name(m, 0), "carbon-dioxide");
    mcd_mixture_free(m);
    /* Duplicates, NULL names, bad counts and methods are EINVAL. */
    const char *dup[2] = {"nitrogen", "N2"};
    m = sentinel;
    ck_assert_int_eq(mcd_mixture_new(db, 2, dup, MCD_GAS_FSG, &m), MCD_EINVAL);
    ck_assert_ptr_nonnull(strstr(mcd_last_error(), "N2"));
    const char *withnull[2] = {"nitrogen", NULL};
    ck_assert_int_eq(mcd_mixture_new(db, 2, withnull, MCD_GAS_FSG, &m),
                     MCD_EINVAL);
    ck_assert_int_eq(mcd_mixture_new(db, 0, names6, MCD_GAS_FSG, &m),
                     MCD_EINVAL);
    ck_assert_int_eq(
        mcd_mixture_new(db, MCD_MAX_SPECIES + 1, names6, MCD_GAS_FSG, &m),
        MCD_EINVAL);
    ck_assert_int_eq(
        mcd_mixture_new(db, 2, names6, (mcd_gas_method)MCD_METHOD_USER, &m),
        MCD_EINVAL);
    ck_assert_int_eq(mcd_mixture_new(db, 2, names6,
                                     (mcd_gas_method)MCD_METHOD_WILKE_CHANG,
                                     &m),
                     MCD_EINVAL);
    ck_assert_int_eq(mcd_mixture_new(NULL, 2, names6, MCD_GAS_FSG, &m),
                     MCD_EINVAL);
    ck_assert_int_eq(mcd_mixture_new(db, 2, NULL, MCD_GAS_FSG, &m), MCD_EINVAL);
    ck_assert_int_eq(mcd_mixture_new(db, 2, names6, MCD_GAS_FSG, NULL),
                     MCD_EINVAL);
    ck_assert_ptr_eq(m, sentinel);
}
END_TEST

START_TEST(mixture_bad_state_and_arguments_leave_outputs_untouched)
{
    double D[NS * NS], R[NS * NS];
    unsigned W[NS * NS];
    for (size_t k = 0; k < NS * NS; k++) {
        D[k] = R[k] = SUP_GUARD;
        W[k] = 0xdeadu;
    }
    const double badv[] = {SUP_NAN, SUP_INF, -SUP_INF};
    for (size_t b = 0; b < 3; b++) {
        ck_assert_int_eq(mcd_mixture_binaries(mix, badv[b], 1e5, D, R, W),
                         MCD_EINVAL);
        ck_assert_int_eq(mcd_mixture_binaries(mix, 300, badv[b], D, R, W),
                         MCD_EINVAL);
        ck_assert_int_eq(mcd_mixture_set_binary(mix, 0, 1, badv[b], 300, 1e5),
                         MCD_EINVAL);
        ck_assert_int_eq(mcd_mixture_set_binary(mix, 0, 1, 1e-5, badv[b], 1e5),
                         MCD_EINVAL);
        ck_assert_int_eq(mcd_mixture_set_binary(mix, 0, 1, 1e-5, 300, badv[b]),
                         MCD_EINVAL);
    }
    ck_assert_int_eq(mcd_mixture_binaries(mix, 0.0, 1e5, D, R, W), MCD_EDOM);
    ck_assert_int_eq(mcd_mixture_binaries(mix, 300, -1.0, D, R, W), MCD_EDOM);
    ck_assert_int_eq(mcd_mixture_binaries(NULL, 300, 1e5, D, R, W), MCD_EINVAL);
    ck_assert_int_eq(mcd_mixture_binaries(mix, 300, 1e5, NULL, R, W),
                     MCD_EINVAL);
    for (size_t k = 0; k < NS * NS; k++) {
        ck_assert(D[k] == SUP_GUARD && R[k] == SUP_GUARD);
        ck_assert_uint_eq(W[k], 0xdeadu);
    }
    ck_assert_int_eq(mcd_mixture_set_binary(mix, 0, 1, -1e-5, 300, 1e5),
                     MCD_EDOM);
    ck_assert_int_eq(mcd_mixture_set_binary(mix, 0, 1, 1e-5, 0.0, 1e5),
                     MCD_EDOM);
    ck_assert_int_eq(mcd_mixture_set_binary(mix, 0, NS, 1e-5, 300, 1e5),
                     MCD_EBADLEN);
    ck_assert_int_eq(mcd_mixture_set_binary(mix, 2, 2, 1e-5, 300, 1e5),
                     MCD_EINVAL);
    ck_assert_int_eq(mcd_mixture_set_binary(NULL, 0, 1, 1e-5, 300, 1e5),
                     MCD_EINVAL);
    ck_assert_int_eq(mcd_mixture_set_method(mix, NS, 0, MCD_GAS_FSG),
                     MCD_EBADLEN);
    ck_assert_int_eq(mcd_mixture_set_method(mix, 1, 1, MCD_GAS_FSG),
                     MCD_EINVAL);
    ck_assert_int_eq(mcd_mixture_set_method(
                         mix, 0, 1, (mcd_gas_method)MCD_METHOD_WILKE_CHANG),
                     MCD_EINVAL);
    ck_assert_int_eq(mcd_mixture_set_method(mix, 0, 1, (mcd_gas_method)77),
                     MCD_EINVAL);
    ck_assert_int_eq(mcd_mixture_set_method(NULL, 0, 1, MCD_GAS_FSG),
                     MCD_EINVAL);
    /* None of the refused calls changed the mixture. */
    mcd_method m[NS * NS];
    for (size_t k = 0; k < NS * NS; k++)
        m[k] = MCD_METHOD_FSG;
    check_against_pairs(m, 300.0, 1e5);
}
END_TEST

START_TEST(mixture_missing_parameters_give_enodata)
{
    mcd_db *d = NULL;
    mcd_mixture *m = NULL;
    size_t i;
    ck_assert_int_eq(mcd_db_new(&d), MCD_OK);
    ck_assert_int_eq(mcd_db_add(d, "gas-a", "N2", 0, &i), MCD_OK);
    ck_assert_int_eq(mcd_db_add(d, "gas-b", "C3H8", 0, &i), MCD_OK);
    const char *nm[2] = {"gas-a", "gas-b"};
    /* No Lennard-Jones data and nothing to estimate them from. */
    ck_assert_int_eq(mcd_mixture_new(d, 2, nm, MCD_GAS_CHAPMAN_ENSKOG, &m),
                     MCD_OK);
    ck_assert_str_eq(mcd_last_error(), ""); /* the gap shows when used */
    double D[4] = {SUP_GUARD, SUP_GUARD, SUP_GUARD, SUP_GUARD};
    ck_assert_int_eq(mcd_mixture_binaries(m, 300, 1e5, D, NULL, NULL),
                     MCD_ENODATA);
    for (int k = 0; k < 4; k++)
        ck_assert(D[k] == SUP_GUARD);
    /* The detail names the pair, the species, the parameter and the method. */
    ck_assert_str_eq(
        mcd_last_error(),
        "pair (0, 1) gas-a-gas-b by chapman-enskog: species 'gas-a' has no "
        "Lennard-Jones sigma nor a molar volume Vb (needed by chapman-enskog)");
    /* The same words from the database call, and from a batched call. */
    ck_assert_int_eq(
        mcd_db_binary_gas(d, 1, 0, MCD_GAS_WILKE_LEE, 300, 1e5, D, NULL, NULL),
        MCD_ENODATA);
    ck_assert_str_eq(mcd_last_error(),
                     "species 'gas-b' has no Lennard-Jones sigma nor a "
                     "molar volume Vb (needed by wilke-lee)");
    {
        mcd_workspace *ws = NULL;
        double T = 300, P = 1e5, x[2] = {0.5, 0.5}, g[2] = {1, -1},
               J[2] = {0, 0};
        ck_assert_int_eq(mcd_workspace_new(2, &ws), MCD_OK);
        ck_assert_int_eq(
            mcd_flux_batch(ws, m, MCD_MODEL_MAXWELL_STEFAN, &T, &P,
                           &(mcd_cells){.n_cells = 1,
                                        .n_dim = 1,
                                        .comp_basis = MCD_BASIS_MOLE,
                                        .comp = x,
                                        .grad = g},
                           MCD_BASIS_MOLE, J),
            MCD_ENODATA);
        ck_assert_ptr_nonnull(
            strstr(mcd_last_error(), "pair (0, 1) gas-a-gas-b"));
        mcd_workspace_free(ws);
    }
    ck_assert_int_eq(mcd_db_param(d, 0, MCD_PARAM_TB, D), MCD_ENODATA);
    ck_assert_str_eq(mcd_last_error(), "species 'gas-a' has no Tb (K)");
    /* FSG needs only M and the diffusion volumes, known from formulas. */
    ck_assert_int_eq(mcd_mixture_set_method(m, 0, 1, MCD_GAS_FSG), MCD_OK);
    ck_assert_int_eq(mcd_mixture_binaries(m, 300, 1e5, D, NULL, NULL), MCD_OK);
    ck_assert_double_gt(D[1], 0.0);
    /* A user value works without any parameter. */
    ck_assert_int_eq(mcd_mixture_set_method(m, 0, 1, MCD_GAS_WILKE_LEE),
                     MCD_OK);
    ck_assert_int_eq(mcd_mixture_set_binary(m, 1, 0, 1.1e-5, 300, 1e5), MCD_OK);
    ck_assert_int_eq(mcd_mixture_binaries(m, 300, 1e5, D, NULL, NULL), MCD_OK);
    ck_assert_double_eq_tol(D[1] / 1.1e-5, 1.0, 1e-15);
    mcd_mixture_free(m);
    mcd_db_free(d);
}
END_TEST

START_TEST(mixture_is_independent_of_the_database)
{
    double before[NS * NS], after[NS * NS];
    ck_assert_int_eq(mcd_mixture_binaries(mix, 333.0, 9e4, before, NULL, NULL),
                     MCD_OK);
    /* Change a parameter in the db, then free it: the mixture keeps its
     * copy. */
    ck_assert_int_eq(
        mcd_db_set_param(db, dbi("nitrogen"), MCD_PARAM_DIFF_VOLUME, 99.0),
        MCD_OK);
    mcd_db_free(db);
    db = NULL;
    ck_assert_int_eq(mcd_mixture_binaries(mix, 333.0, 9e4, after, NULL, NULL),
                     MCD_OK);
    for (size_t k = 0; k < NS * NS; k++)
        ck_assert(before[k] == after[k]);
    ck_assert_int_eq(mcd_db_new_builtin(&db), MCD_OK); /* for teardown */
}
END_TEST

START_TEST(mixture_accessors_report_species)
{
    double M[NS];
    for (size_t i = 0; i < NS; i++)
        M[i] = SUP_GUARD;
    ck_assert_uint_eq(mcd_mixture_species_count(mix), NS);
    ck_assert_uint_eq(mcd_mixture_species_count(NULL), 0);
    ck_assert_int_eq(mcd_mixture_molar_masses(mix, M), MCD_OK);
    for (size_t i = 0; i < NS; i++) {
        double m = 0;
        ck_assert_str_eq(mcd_mixture_name(mix, i),
                         mcd_db_name(db, dbi(names6[i])));
        ck_assert_int_eq(
            mcd_db_param(db, dbi(names6[i]), MCD_PARAM_MOLAR_MASS, &m), MCD_OK);
        ck_assert(M[i] == m);
    }
    ck_assert_ptr_null(mcd_mixture_name(mix, NS));
    ck_assert_ptr_null(mcd_mixture_name(NULL, 0));
    ck_assert_int_eq(mcd_mixture_molar_masses(NULL, M), MCD_EINVAL);
    ck_assert_int_eq(mcd_mixture_molar_masses(mix, NULL), MCD_EINVAL);
    mcd_mixture_free(NULL); /* no-op */
}
END_TEST

START_TEST(mixture_fast_path_matches_api)
{
    /* Mixed methods and a user value; the internal evaluator must give the
     * API's numbers: identical for estimated pairs (same coefficient, same
     * expression), a few ulp for the user pair (precomputed
     * D_ref P_ref / T_ref^1.75 instead of the scaled form): 1e-14. */
    ck_assert_int_eq(mcd_mixture_set_method(mix, 0, 1, MCD_GAS_CHAPMAN_ENSKOG),
                     MCD_OK);
    ck_assert_int_eq(mcd_mixture_set_method(mix, 2, 5, MCD_GAS_WILKE_LEE),
                     MCD_OK);
    ck_assert_int_eq(mcd_mixture_set_binary(mix, 3, 4, 0.85e-4, 293.0, MCD_ATM),
                     MCD_OK);
    ck_assert_int_eq(mcdi_mixture_ready(mix), MCD_OK);
    sup_seed(&rng, 99);
    for (int t = 0; t < 100; t++) {
        double T = sup_range(&rng, 200, 1500),
               P = sup_exp_range(&rng, 1e3, 1e7);
        double A[NS * NS], B[NS * NS];
        ck_assert_int_eq(mcd_mixture_binaries(mix, T, P, A, NULL, NULL),
                         MCD_OK);
        mcdi_mixture_binaries_fast(mix, T, P, B);
        for (size_t k = 0; k < NS * NS; k++) {
            if (k == 3 * NS + 4 || k == 4 * NS + 3)
                ck_assert_double_eq_tol(B[k] / A[k], 1.0, 1e-14);
            else
                ck_assert(A[k] == B[k]);
        }
    }
}
END_TEST

/* Species for the Brokaw tests: polar ones (dipole above 1 debye) with
 * Brokaw's data, a weakly polar one with its data (H2S, 0.9 debye: not
 * polar by the MCD_WARN_POLAR rule), nonpolar ones with its data, helium
 * (no Vb) and carbon dioxide (no Tb) without it (built-in table). */
#define NB 11
static const char *const namesb[NB] = {
    "water",    "ammonia",        "methanol",
    "acetone",  "sulfur-dioxide", "air",
    "nitrogen", "methane",        "hydrogen-sulfide",
    "helium",   "carbon-dioxide"};

/* Does species `name` of db have everything Brokaw's method needs? */
static int has_brokaw_data(const char *name)
{
    static const mcd_param need[4] = {MCD_PARAM_MOLAR_MASS, MCD_PARAM_DIPOLE,
                                      MCD_PARAM_VB, MCD_PARAM_TB};
    double v;
    for (int q = 0; q < 4; q++)
        if (mcd_db_param(db, dbi(name), need[q], &v) != MCD_OK)
            return 0;
    return 1;
}

static int is_polar(const char *name)
{
    double dip = 0.0;
    (void)mcd_db_param(db, dbi(name), MCD_PARAM_DIPOLE, &dip);
    return dip > 1.0 * 3.33564095198152e-30; /* 1 debye [C m] */
}

/* Mixture pair (i, j) of namesb against the database pair by method g at
 * (T, P): D, typical error and warnings identical (the same copied
 * parameters through the same expression, binary_db.c). */
static void check_brokaw_pair(const mcd_mixture *m, const double *D,
                              const double *R, const unsigned *W, size_t i,
                              size_t j, double T, double P)
{
    double d = SUP_GUARD, r = SUP_GUARD;
    unsigned w = 0;
    mcd_method pm = MCD_METHOD_USER;
    ck_assert_int_eq(mcd_mixture_pair_method(m, i, j, &pm), MCD_OK);
    ck_assert_int_eq(mcd_db_binary_gas(db, dbi(namesb[i]), dbi(namesb[j]),
                                       (mcd_gas_method)pm, T, P, &d, &r, &w),
                     MCD_OK);
    ck_assert_msg(D[i * NB + j] == d && D[j * NB + i] == d,
                  "%s-%s by %s at %g K, %g Pa: %.17g vs %.17g", namesb[i],
                  namesb[j], mcd_method_name(pm), T, P, D[i * NB + j], d);
    ck_assert(R[i * NB + j] == r);
    ck_assert_uint_eq(W[i * NB + j], w);
}

START_TEST(mixture_brokaw_pairs_equal_the_database_pair)
{
    /* Identity: every pair of a mixture whose default is Brokaw, at random
     * states, equals mcd_db_binary_gas(..., MCD_GAS_BROKAW) to the bit
     * (the mixture precomputes coef, eps_AB and delta_AB; the database
     * pair computes them per call with the same operations). Species
     * without Brokaw's data are left out here (see the ENODATA test). */
    const char *sel[NB];
    size_t ns = 0;
    mcd_mixture *m = NULL;
    for (size_t k = 0; k < NB; k++)
        if (has_brokaw_data(namesb[k]))
            sel[ns++] = namesb[k];
    ck_assert_uint_eq(ns, NB - 2); /* helium and carbon dioxide lack it */
    ck_assert_int_eq(mcd_mixture_new(db, ns, sel, MCD_GAS_BROKAW, &m), MCD_OK);
    sup_seed(&rng, 1969);
    for (int t = 0; t < 40; t++) {
        double T = sup_range(&rng, 250, 1200),
               P = sup_exp_range(&rng, 1e3, 5e6);
        double D[NB * NB], R[NB * NB], F[NB * NB];
        unsigned W[NB * NB];
        ck_assert_int_eq(mcd_mixture_binaries(m, T, P, D, R, W), MCD_OK);
        mcdi_mixture_binaries_fast(m, T, P, F);
        for (size_t i = 0; i < ns; i++)
            for (size_t j = 0; j < ns; j++) {
                double d = SUP_GUARD, r = SUP_GUARD;
                unsigned w = 0;
                if (i == j)
                    continue;
                ck_assert_int_eq(mcd_db_binary_gas(db, dbi(sel[i]), dbi(sel[j]),
                                                   MCD_GAS_BROKAW, T, P, &d, &r,
                                                   &w),
                                 MCD_OK);
                ck_assert_msg(D[i * ns + j] == d, "%s-%s: %.17g vs %.17g",
                              sel[i], sel[j], D[i * ns + j], d);
                ck_assert(F[i * ns + j] == d); /* the fast path too */
                ck_assert(R[i * ns + j] == r);
                ck_assert_uint_eq(W[i * ns + j], w);
                /* corrected, not flagged */
                ck_assert(!(W[i * ns + j] & MCD_WARN_POLAR));
            }
    }
    mcd_mixture_free(m);
    /* Per pair on an FSG mixture: the same values for those pairs. */
    ck_assert_int_eq(mcd_mixture_new(db, NB, namesb, MCD_GAS_FSG, &m), MCD_OK);
    ck_assert_int_eq(mcd_mixture_set_method(m, 0, 5, MCD_GAS_BROKAW), MCD_OK);
    ck_assert_int_eq(mcd_mixture_set_method(m, 3, 1, MCD_GAS_BROKAW), MCD_OK);
    {
        double D[NB * NB], R[NB * NB];
        unsigned W[NB * NB];
        mcd_method pm;
        ck_assert_int_eq(mcd_mixture_binaries(m, 330.0, 2e5, D, R, W), MCD_OK);
        check_brokaw_pair(m, D, R, W, 0, 5, 330.0, 2e5);
        check_brokaw_pair(m, D, R, W, 1, 3, 330.0, 2e5);
        check_brokaw_pair(m, D, R, W, 0, 1, 330.0, 2e5);
        ck_assert_int_eq(mcd_mixture_pair_method(m, 5, 0, &pm), MCD_OK);
        ck_assert_int_eq(pm, MCD_METHOD_BROKAW);
        ck_assert_int_eq(mcd_mixture_pair_method(m, 0, 1, &pm), MCD_OK);
        ck_assert_int_eq(pm, MCD_METHOD_FSG);
    }
    mcd_mixture_free(m);
}
END_TEST

START_TEST(mixture_recommended_follows_the_database_pair_rule)
{
    /* MCD_GAS_RECOMMENDED gives each pair the method `mcdiff binary`
     * recommends: Brokaw when either species is polar (dipole above 1
     * debye) and both have its data, else the first of FSG,
     * Chapman-Enskog, Wilke-Lee that applies (FSG for every species here:
     * their diffusion volumes follow from the formula). The expected
     * method is worked out here from the parameters, independently of
     * the library's rule; the values must equal the database pair's. */
    mcd_mixture *m = NULL;
    size_t n_brokaw = 0;
    ck_assert_int_eq(mcd_mixture_new(db, NB, namesb, MCD_GAS_RECOMMENDED, &m),
                     MCD_OK);
    for (size_t i = 0; i < NB; i++)
        for (size_t j = 0; j < NB; j++) {
            mcd_method pm = (mcd_method)0, want;
            if (i == j)
                continue;
            want = (is_polar(namesb[i]) || is_polar(namesb[j])) &&
                           has_brokaw_data(namesb[i]) &&
                           has_brokaw_data(namesb[j])
                       ? MCD_METHOD_BROKAW
                       : MCD_METHOD_FSG;
            ck_assert_int_eq(mcd_mixture_pair_method(m, i, j, &pm), MCD_OK);
            ck_assert_msg(pm == want, "%s-%s: %s, expected %s", namesb[i],
                          namesb[j], mcd_method_name(pm),
                          mcd_method_name(want));
            n_brokaw += pm == MCD_METHOD_BROKAW;
        }
    /* 5 polar species with data: 10 pairs among them, 5 x 4 with the
     * others that have data (air, N2, CH4, H2S); twice (i, j) and (j, i) */
    ck_assert_uint_eq(n_brokaw, 2 * (10 + 20));
    {
        const double Ts[3] = {280.0, 450.0, 900.0}, Ps[3] = {2e4, MCD_ATM, 3e6};
        for (int s = 0; s < 3; s++) {
            double D[NB * NB], R[NB * NB];
            unsigned W[NB * NB];
            ck_assert_int_eq(mcd_mixture_binaries(m, Ts[s], Ps[s], D, R, W),
                             MCD_OK);
            for (size_t i = 0; i < NB; i++)
                for (size_t j = i + 1; j < NB; j++)
                    check_brokaw_pair(m, D, R, W, i, j, Ts[s], Ps[s]);
        }
    }
    /* Per pair: back to the recommendation after another method; a given
     * value reads back as USER (any value: only its method is read). */
    {
        mcd_method pm;
        ck_assert_int_eq(mcd_mixture_set_method(m, 0, 5, MCD_GAS_WILKE_LEE),
                         MCD_OK);
        ck_assert_int_eq(mcd_mixture_pair_method(m, 0, 5, &pm), MCD_OK);
        ck_assert_int_eq(pm, MCD_METHOD_WILKE_LEE);
        ck_assert_int_eq(mcd_mixture_set_method(m, 5, 0, MCD_GAS_RECOMMENDED),
                         MCD_OK);
        ck_assert_int_eq(mcd_mixture_pair_method(m, 0, 5, &pm), MCD_OK);
        ck_assert_int_eq(pm, MCD_METHOD_BROKAW);
        ck_assert_int_eq(mcd_mixture_set_binary(m, 0, 6, 2.5e-5, 300.0, 1e5),
                         MCD_OK);
        ck_assert_int_eq(mcd_mixture_pair_method(m, 6, 0, &pm), MCD_OK);
        ck_assert_int_eq(pm, MCD_METHOD_USER);
        /* bad arguments: a clear error, the output untouched */
        pm = (mcd_method)77;
        ck_assert_int_eq(mcd_mixture_pair_method(m, 2, 2, &pm), MCD_EINVAL);
        ck_assert_int_eq(mcd_mixture_pair_method(m, 2, NB, &pm), MCD_EBADLEN);
        ck_assert_ptr_nonnull(strstr(mcd_last_error(), "argument j"));
        ck_assert_int_eq((int)pm, 77);
        ck_assert_int_eq(mcd_mixture_set_method(m, 0, 1, (mcd_gas_method)99),
                         MCD_EINVAL);
        ck_assert_ptr_nonnull(strstr(mcd_last_error(), "argument m"));
    }
    mcd_mixture_free(m);
}
END_TEST

START_TEST(mixture_brokaw_missing_data_names_species_and_parameter)
{
    mcd_db *d = NULL;
    mcd_mixture *m = NULL;
    size_t i;
    const char *nm[2] = {"polar-x", "gas-b"};
    double D[4] = {SUP_GUARD, SUP_GUARD, SUP_GUARD, SUP_GUARD};
    mcd_method pm;
    char mixmsg[512];
    ck_assert_int_eq(mcd_db_new(&d), MCD_OK);
    /* invented species: only which parameters exist matters here */
    ck_assert_int_eq(mcd_db_add(d, "polar-x", "H2O", 0, &i), MCD_OK);
    ck_assert_int_eq(mcd_db_set_param(d, i, MCD_PARAM_DIPOLE, 6e-30), MCD_OK);
    ck_assert_int_eq(mcd_db_set_param(d, i, MCD_PARAM_TB, 373.0), MCD_OK);
    ck_assert_int_eq(mcd_db_add(d, "gas-b", "N2", 0, &i), MCD_OK);
    ck_assert_int_eq(mcd_db_set_param(d, i, MCD_PARAM_DIPOLE, 0.0), MCD_OK);
    ck_assert_int_eq(mcd_db_set_param(d, i, MCD_PARAM_VB, 3.1e-5), MCD_OK);
    ck_assert_int_eq(mcd_db_set_param(d, i, MCD_PARAM_TB, 77.0), MCD_OK);
    ck_assert_int_eq(mcd_mixture_new(d, 2, nm, MCD_GAS_BROKAW, &m), MCD_OK);
    ck_assert_int_eq(mcd_mixture_binaries(m, 300, 1e5, D, NULL, NULL),
                     MCD_ENODATA);
    for (int k = 0; k < 4; k++)
        ck_assert(D[k] == SUP_GUARD);
    snprintf(mixmsg, sizeof mixmsg, "%s", mcd_last_error());
    ck_assert_str_eq(mixmsg,
                     "pair (0, 1) polar-x-gas-b by brokaw: species 'polar-x' "
                     "has no molar volume at the boiling point (Vb) (needed "
                     "by brokaw)");
    /* the database pair says the same */
    ck_assert_int_eq(
        mcd_db_binary_gas(d, 0, 1, MCD_GAS_BROKAW, 300, 1e5, D, NULL, NULL),
        MCD_ENODATA);
    ck_assert_ptr_nonnull(strstr(mixmsg, mcd_last_error()));
    /* without its data a polar pair is not recommended Brokaw */
    ck_assert_int_eq(mcd_mixture_set_method(m, 0, 1, MCD_GAS_RECOMMENDED),
                     MCD_OK);
    ck_assert_int_eq(mcd_mixture_pair_method(m, 0, 1, &pm), MCD_OK);
    ck_assert_int_eq(pm, MCD_METHOD_FSG);
    ck_assert_int_eq(mcd_mixture_binaries(m, 300, 1e5, D, NULL, NULL), MCD_OK);
    /* with it, it is */
    ck_assert_int_eq(mcd_db_set_param(d, 0, MCD_PARAM_VB, 1.9e-5), MCD_OK);
    mcd_mixture_free(m);
    ck_assert_int_eq(mcd_mixture_new(d, 2, nm, MCD_GAS_RECOMMENDED, &m),
                     MCD_OK);
    ck_assert_int_eq(mcd_mixture_pair_method(m, 1, 0, &pm), MCD_OK);
    ck_assert_int_eq(pm, MCD_METHOD_BROKAW);
    mcd_mixture_free(m);
    mcd_db_free(d);
}
END_TEST

START_TEST(mixture_brokaw_batched_fluxes_and_fit_match_single_state)
{
    /* The batched call reads the mixture's pair data itself (exact
     * collision integral, or the temperature fit): its fluxes must equal
     * the single-state call fed with mcd_mixture_binaries, to 1e-12 of the
     * largest flux of a cell exactly as in test_batch.c (the same
     * equations, other rounding), and with the fit to the fit's error
     * (1e-12 target) times the conditioning of the solve: 1e-9. */
    enum { K = 37, N = 5 };
    const char *nm[N] = {"water", "ammonia", "acetone", "air", "methane"};
    mcd_mixture *m = NULL;
    mcd_workspace *ws = NULL;
    double T[K], P[K], x[N * K], g[N * K], out[N * K], M[N], fit_err = -1;
    ck_assert_int_eq(mcd_mixture_new(db, N, nm, MCD_GAS_RECOMMENDED, &m),
                     MCD_OK);
    ck_assert_int_eq(mcd_mixture_set_method(m, 3, 4, MCD_GAS_CHAPMAN_ENSKOG),
                     MCD_OK);
    ck_assert_int_eq(mcd_mixture_molar_masses(m, M), MCD_OK);
    ck_assert_int_eq(mcd_workspace_new(N, &ws), MCD_OK);
    sup_seed(&rng, 0xB20CA3ull);
    for (size_t k = 0; k < K; k++) {
        double s = 0.0, gs = 0.0;
        T[k] = sup_range(&rng, 300, 900);
        P[k] = sup_exp_range(&rng, 2e4, 2e6);
        for (size_t i = 0; i < N; i++) {
            x[i * K + k] = sup_range(&rng, 0.05, 1.0);
            s += x[i * K + k];
            g[i * K + k] = sup_range(&rng, -10, 10);
            gs += g[i * K + k];
        }
        for (size_t i = 0; i < N; i++) {
            x[i * K + k] /= s;
            g[i * K + k] -= gs / N;
        }
    }
    for (int fit = 0; fit < 2; fit++) {
        double tol = fit ? 1e-9 : 1e-12;
        if (fit) {
            ck_assert_int_eq(
                mcd_mixture_set_temperature_fit(m, 280.0, 950.0, &fit_err),
                MCD_OK);
            ck_assert(fit_err > 0.0 && fit_err < 1e-10);
            /* the Brokaw pairs are fitted, not left exact (internal) */
            ck_assert_uint_gt(m->fit_deg[0 * N + 1], 0);
            ck_assert_uint_gt(m->fit_deg[2 * N + 3], 0);
        }
        ck_assert_msg(mcd_flux_batch(ws, m, MCD_MODEL_MAXWELL_STEFAN, T, P,
                                     &(mcd_cells){.n_cells = K,
                                                  .n_dim = 1,
                                                  .comp_basis = MCD_BASIS_MOLE,
                                                  .comp = x,
                                                  .grad = g},
                                     MCD_BASIS_MOLE, out) == MCD_OK,
                      "%s", mcd_last_error());
        for (size_t k = 0; k < K; k++) {
            double D[N * N], y[N], gg[N], F[N], big = 0.0;
            double c = P[k] / (MCD_GAS_CONSTANT * T[k]);
            ck_assert_int_eq(mcd_mixture_binaries(m, T[k], P[k], D, NULL, NULL),
                             MCD_OK);
            for (size_t i = 0; i < N; i++) {
                y[i] = x[i * K + k];
                gg[i] = g[i * K + k];
            }
            ck_assert_int_eq(
                mcd_flux_compute(ws, MCD_MODEL_MAXWELL_STEFAN,
                                 &(mcd_state){.n_species = N,
                                              .n_dim = 1,
                                              .M = M,
                                              .Dij = D,
                                              .c = c,
                                              .comp_basis = MCD_BASIS_MOLE,
                                              .comp = y,
                                              .grad = gg},
                                 MCD_BASIS_MOLE, F),
                MCD_OK);
            for (size_t i = 0; i < N; i++)
                big = fmax(big, fabs(F[i]));
            for (size_t i = 0; i < N; i++)
                ck_assert_msg(fabs(out[i * K + k] - F[i]) <= tol * big,
                              "fit %d cell %zu species %zu: %.17g vs %.17g",
                              fit, k, i, out[i * K + k], F[i]);
        }
    }
    mcd_workspace_free(ws);
    mcd_mixture_free(m);
}
END_TEST

int main(void)
{
    Suite *s = suite_create("mcd:mixture");
    TCase *tc = tcase_create("mixture");
    tcase_add_checked_fixture(tc, setup, teardown);
    tcase_add_test(tc, mixture_matrix_is_symmetric_and_equals_binary_gas);
    tcase_add_test(tc, mixture_per_pair_methods_are_used);
    tcase_add_test(tc, mixture_user_values_scale_with_t175_over_p);
    tcase_add_test(tc, mixture_unknown_species_is_named_in_the_error_detail);
    tcase_add_test(tc, mixture_bad_state_and_arguments_leave_outputs_untouched);
    tcase_add_test(tc, mixture_missing_parameters_give_enodata);
    tcase_add_test(tc, mixture_is_independent_of_the_database);
    tcase_add_test(tc, mixture_accessors_report_species);
    tcase_add_test(tc, mixture_fast_path_matches_api);
    tcase_add_test(tc, mixture_brokaw_pairs_equal_the_database_pair);
    tcase_add_test(tc, mixture_recommended_follows_the_database_pair_rule);
    tcase_add_test(tc, mixture_brokaw_missing_data_names_species_and_parameter);
    tcase_add_test(tc,
                   mixture_brokaw_batched_fluxes_and_fit_match_single_state);
    suite_add_tcase(s, tc);
    return sup_run(s);
}
