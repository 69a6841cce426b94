/* test_diagnose.c - flags for reverse, osmotic and barrier diffusion. */
#include <check.h>
#include <math.h>
#include <stdint.h>
#include <stdlib.h>
#include <string.h>

#include "mcdiff.h"
#include "support.h"

#define GUARD_FLAGS 0xDEADu

static sup_rng rng = SUP_RNG(SUP_SPLITMIX64, 0);

START_TEST(diagnose_flags_each_effect)
{
    /* 5 species, 1 direction:
     * 0 normal (flux down its gradient), 1 reverse (up its gradient),
     * 2 osmotic (no gradient), 3 barrier (no flux), 4 neither. */
    const double g[5] = {1.0, -0.5, 0.0, 0.8, 0.0};
    const double F[5] = {-2.0, -0.3, 0.7, 0.0, 0.0};
    unsigned fl[5];
    ck_assert_int_eq(mcd_flux_diagnose(5, 1, g, F, 1e-3, fl), MCD_OK);
    ck_assert_uint_eq(fl[0], 0u);
    ck_assert_uint_eq(fl[1], MCD_DIAG_REVERSE);
    ck_assert_uint_eq(fl[2], MCD_DIAG_OSMOTIC);
    ck_assert_uint_eq(fl[3], MCD_DIAG_BARRIER);
    ck_assert_uint_eq(fl[4], 0u);
}
END_TEST

START_TEST(diagnose_threshold_is_inclusive_and_relative)
{
    /* species 1 gradient exactly rel_tol times the largest: nearly zero */
    const double g[2] = {2.0, 2.0 * 0.125}; /* 0.125 exact in binary */
    const double F[2] = {-1.0, 0.5};
    unsigned fl[2];
    ck_assert_int_eq(mcd_flux_diagnose(2, 1, g, F, 0.125, fl), MCD_OK);
    ck_assert_uint_eq(fl[1], MCD_DIAG_OSMOTIC);
    /* a slightly smaller tolerance: the gradient counts, flux goes up it */
    ck_assert_int_eq(mcd_flux_diagnose(2, 1, g, F, 0.124, fl), MCD_OK);
    ck_assert_uint_eq(fl[1], MCD_DIAG_REVERSE);
}
END_TEST

START_TEST(diagnose_uses_euclidean_norm_over_directions)
{
    /* species 1 gradient (3e-4, 4e-4): Euclidean norm 5e-4, max-norm 4e-4,
     * 1-norm 7e-4; largest gradient (species 0) has norm 1. */
    const double g[4] = {1.0, 0.0, 3e-4, 4e-4};
    const double F[4] = {-1.0, 0.0, 0.0, 0.5};
    unsigned fl[2];
    /* 4.5e-4 < 5e-4: not nearly zero (a max-norm would say it is) */
    ck_assert_int_eq(mcd_flux_diagnose(2, 2, g, F, 4.5e-4, fl), MCD_OK);
    ck_assert_uint_eq(fl[1], MCD_DIAG_REVERSE); /* F.g = 2e-4 > 0 */
    /* 5.5e-4 > 5e-4: nearly zero (a 1-norm would say it is not) */
    ck_assert_int_eq(mcd_flux_diagnose(2, 2, g, F, 5.5e-4, fl), MCD_OK);
    ck_assert_uint_eq(fl[1], MCD_DIAG_OSMOTIC);
}
END_TEST

START_TEST(diagnose_reverse_uses_dot_product)
{
    /* components of opposite sign, dot product decides */
    const double g[6] = {1.0, 1.0, 0.0, 1.0, -0.2, 0.0};
    const double F1[6] = {-1.0, -1.0, 0.0, 0.5, 0.3, 0.0}; /* 0.5-0.06 > 0 */
    const double F2[6] = {-1.0, -1.0, 0.0, 0.1, 0.6, 0.0}; /* 0.1-0.12 < 0 */
    unsigned fl[2];
    ck_assert_int_eq(mcd_flux_diagnose(2, 3, g, F1, 1e-3, fl), MCD_OK);
    ck_assert_uint_eq(fl[1], MCD_DIAG_REVERSE);
    ck_assert_int_eq(mcd_flux_diagnose(2, 3, g, F2, 1e-3, fl), MCD_OK);
    ck_assert_uint_eq(fl[1], 0u);
}
END_TEST

START_TEST(diagnose_degenerate_inputs)
{
    const double z[3] = {0.0, 0.0, 0.0};
    const double g[3] = {1.0, -1.0, 0.0};
    const double F[3] = {0.5, 0.0, -0.5};
    unsigned fl[3];
    /* all gradients zero: every species with a flux is osmotic */
    ck_assert_int_eq(mcd_flux_diagnose(3, 1, z, F, 1e-3, fl), MCD_OK);
    ck_assert_uint_eq(fl[0], MCD_DIAG_OSMOTIC);
    ck_assert_uint_eq(fl[1], 0u);
    ck_assert_uint_eq(fl[2], MCD_DIAG_OSMOTIC);
    /* all fluxes zero: every species with a gradient is a barrier */
    ck_assert_int_eq(mcd_flux_diagnose(3, 1, g, z, 1e-3, fl), MCD_OK);
    ck_assert_uint_eq(fl[0], MCD_DIAG_BARRIER);
    ck_assert_uint_eq(fl[1], MCD_DIAG_BARRIER);
    ck_assert_uint_eq(fl[2], 0u);
    /* both zero: nothing */
    ck_assert_int_eq(mcd_flux_diagnose(3, 1, z, z, 1e-3, fl), MCD_OK);
    for (int i = 0; i < 3; i++)
        ck_assert_uint_eq(fl[i], 0u);
    /* a single species: its own maximum, never nearly zero */
    {
        double g1 = 2.0, F1 = -1.0;
        unsigned f1;
        ck_assert_int_eq(mcd_flux_diagnose(1, 1, &g1, &F1, 0.5, &f1), MCD_OK);
        ck_assert_uint_eq(f1, 0u);
    }
}
END_TEST

/* Flags do not depend on units (scaling) or on species order; huge and
 * tiny magnitudes do not overflow. */
START_TEST(diagnose_invariant_under_scaling_and_permutation)
{
    double g[30 * 3], F[30 * 3], gs[30 * 3], Fs[30 * 3];
    unsigned fl[30], fs[30];
    size_t perm[30];
    sup_seed(&rng, 3001);
    for (int t = 0; t < 2000; t++) {
        size_t n = 1 + (size_t)(sup_next(&rng) % 30),
               nd = 1 + (size_t)(sup_next(&rng) % 3);
        double sg = pow(10.0, -200.0 + 400.0 * sup_u01(&rng));
        double sf = pow(10.0, -200.0 + 400.0 * sup_u01(&rng));
        for (size_t i = 0; i < n * nd; i++) {
            /* some exact zeros and tiny rows so all flags occur */
            int kind = (int)(sup_next(&rng) % 6);
            g[i] = kind == 0   ? 0.0
                   : kind == 1 ? 1e-6 * (sup_u01(&rng) - 0.5)
                               : sup_u01(&rng) - 0.5;
            kind = (int)(sup_next(&rng) % 6);
            F[i] = kind == 0   ? 0.0
                   : kind == 1 ? 1e-6 * (sup_u01(&rng) - 0.5)
                               : sup_u01(&rng) - 0.5;
        }
        for (size_t i = 0; i < n; i++)
            perm[i] = i;
        for (size_t i = n; i > 1; i--) {
            size_t j = (size_t)(sup_next(&rng) % i), tmp = perm[i - 1];
            perm[i - 1] = perm[j];
            perm[j] = tmp;
        }
        for (size_t i = 0; i < n; i++)
            for (size_t d = 0; d < nd; d++) {
                /* powers of two would be exact; sg, sf are not, so a norm
                 * sitting exactly on the threshold could flip: the random
                 * data make that a measure-zero event */
                gs[i * nd + d] = sg * g[perm[i] * nd + d];
                Fs[i * nd + d] = sf * F[perm[i] * nd + d];
            }
        ck_assert_int_eq(mcd_flux_diagnose(n, nd, g, F, 1e-3, fl), MCD_OK);
        ck_assert_int_eq(mcd_flux_diagnose(n, nd, gs, Fs, 1e-3, fs), MCD_OK);
        for (size_t i = 0; i < n; i++) {
            ck_assert_uint_eq(fs[i], fl[perm[i]]);
            /* at most one flag per species */
            ck_assert(fl[i] == 0u || fl[i] == MCD_DIAG_REVERSE ||
                      fl[i] == MCD_DIAG_OSMOTIC || fl[i] == MCD_DIAG_BARRIER);
        }
    }
}
END_TEST

/* Ternary Maxwell-Stefan fluxes of the H2(1) / N2(2) / CO2(3) system of
 * Duncan and Toor (1962), computed here independently of the library with
 * the (N-1) x (N-1) [B] matrix of Taylor and Krishna (1993, ch. 2):
 *   B_ii = x_i/D_i3 + sum_{k != i} x_k/D_ik,  B_ij = -x_i (1/D_ij - 1/D_i3),
 *   (J) = -c [B]^-1 (grad x).
 * Binary diffusivities at 35.2 C, 1 atm: D_12 = 83.8, D_13 = 68.0,
 * D_23 = 16.8 mm^2/s (Duncan and Toor 1962, as quoted by Taylor and Krishna
 * 1993; from memory). At the start of the experiment the two bulbs held
 * nearly equal N2 (about 0.50 each) and H2 / CO2 on opposite sides (from
 * memory): with grad x_N2 = 0 nitrogen still diffuses (osmotic); a small
 * N2 gradient along its flux gives reverse diffusion; the gradient at which
 * the N2 flux vanishes is a diffusion barrier. */
static void ternary_ms(const double x[3], const double g[3], double J[3])
{
    const double D12 = 83.8e-6, D13 = 68.0e-6, D23 = 16.8e-6;
    const double c = MCD_ATM / (MCD_GAS_CONSTANT * 308.35); /* ideal gas */
    double B11 = x[0] / D13 + x[1] / D12 + x[2] / D13;
    double B12 = -x[0] * (1.0 / D12 - 1.0 / D13);
    double B22 = x[1] / D23 + x[0] / D12 + x[2] / D23;
    double B21 = -x[1] * (1.0 / D12 - 1.0 / D23);
    double det = B11 * B22 - B12 * B21;
    J[0] = -c * (B22 * g[0] - B12 * g[1]) / det;
    J[1] = -c * (-B21 * g[0] + B11 * g[1]) / det;
    J[2] = -J[0] - J[1];
}

START_TEST(diagnose_duncan_toor_nitrogen_effects)
{
    const double x[3] = {0.25, 0.50, 0.25};
    double g[3] = {0.5 / 0.086, 0.0, -0.5 / 0.086}; /* [1/m], ~8.6 cm path */
    double J[3], J0[3], J1[3];
    unsigned fl[3];

    /* osmotic: no N2 gradient, N2 flux not negligible */
    ternary_ms(x, g, J0);
    ck_assert_int_eq(mcd_flux_diagnose(3, 1, g, J0, 1e-3, fl), MCD_OK);
    ck_assert_uint_eq(fl[0], 0u);
    ck_assert_uint_eq(fl[1], MCD_DIAG_OSMOTIC);
    ck_assert_uint_eq(fl[2], 0u);

    /* reverse: a small N2 gradient in the direction of its osmotic flux */
    g[1] = (J0[1] > 0.0 ? 1.0 : -1.0) * 0.05;
    g[2] = -g[0] - g[1];
    ternary_ms(x, g, J);
    ck_assert_int_eq(mcd_flux_diagnose(3, 1, g, J, 1e-3, fl), MCD_OK);
    ck_assert_uint_eq(fl[1], MCD_DIAG_REVERSE);

    /* barrier: the N2 flux is linear in g_2 (g_3 = -g_1 - g_2); find its
     * zero from two evaluations */
    {
        double ga = g[1];
        ternary_ms(x, g, J1);
        double gb = 0.0; /* J0 at g_2 = 0 */
        double g2 = gb - J0[1] * (ga - gb) / (J1[1] - J0[1]);
        g[1] = g2;
        g[2] = -g[0] - g[1];
        ternary_ms(x, g, J);
        /* |J_2| is now round-off (~1e-16 of the others) */
        ck_assert_int_eq(mcd_flux_diagnose(3, 1, g, J, 1e-3, fl), MCD_OK);
        ck_assert_uint_eq(fl[1], MCD_DIAG_BARRIER);
        ck_assert_uint_eq(fl[0], 0u);
        ck_assert_uint_eq(fl[2], 0u);
    }
}
END_TEST

START_TEST(diagnose_error_paths_leave_outputs_untouched)
{
    const double g[4] = {1.0, 0.0, -1.0, 0.0}, F[4] = {-1.0, 0.0, 1.0, 0.0};
    double bad[4];
    unsigned fl[2];
#define EXPECT(call)                                                           \
    do {                                                                       \
        fl[0] = fl[1] = GUARD_FLAGS;                                           \
        ck_assert_int_eq((call), MCD_EINVAL);                                  \
        ck_assert_uint_eq(fl[0], GUARD_FLAGS);                                 \
        ck_assert_uint_eq(fl[1], GUARD_FLAGS);                                 \
    } while (0)
    EXPECT(mcd_flux_diagnose(0, 2, g, F, 1e-3, fl));
    EXPECT(mcd_flux_diagnose(MCD_MAX_SPECIES + 1, 2, g, F, 1e-3, fl));
    EXPECT(mcd_flux_diagnose(2, 0, g, F, 1e-3, fl));
    EXPECT(mcd_flux_diagnose(2, 4, g, F, 1e-3, fl));
    EXPECT(mcd_flux_diagnose(2, 2, NULL, F, 1e-3, fl));
    EXPECT(mcd_flux_diagnose(2, 2, g, NULL, 1e-3, fl));
    ck_assert_int_eq(mcd_flux_diagnose(2, 2, g, F, 1e-3, NULL), MCD_EINVAL);
    EXPECT(mcd_flux_diagnose(2, 2, g, F, 0.0, fl));
    EXPECT(mcd_flux_diagnose(2, 2, g, F, 1.0, fl));
    EXPECT(mcd_flux_diagnose(2, 2, g, F, -0.1, fl));
    EXPECT(mcd_flux_diagnose(2, 2, g, F, SUP_NAN, fl));
    memcpy(bad, g, sizeof bad);
    bad[3] = SUP_NAN;
    EXPECT(mcd_flux_diagnose(2, 2, bad, F, 1e-3, fl));
    bad[3] = SUP_INF;
    EXPECT(mcd_flux_diagnose(2, 2, F, bad, 1e-3, fl));
#undef EXPECT
}
END_TEST

int main(void)
{
    Suite *s = suite_create("mcd:diagnose");
    TCase *tc = tcase_create("flags");
    tcase_add_test(tc, diagnose_flags_each_effect);
    tcase_add_test(tc, diagnose_threshold_is_inclusive_and_relative);
    tcase_add_test(tc, diagnose_uses_euclidean_norm_over_directions);
    tcase_add_test(tc, diagnose_reverse_uses_dot_product);
    tcase_add_test(tc, diagnose_degenerate_inputs);
    tcase_add_test(tc, diagnose_invariant_under_scaling_and_permutation);
    tcase_add_test(tc, diagnose_duncan_toor_nitrogen_effects);
    suite_add_tcase(s, tc);
    tc = tcase_create("errors");
    tcase_add_test(tc, diagnose_error_paths_leave_outputs_untouched);
    suite_add_tcase(s, tc);
    return sup_run(s);
}
