/* liquid_support.h - a random liquid for the liquid tests
 * (tests/test_liquid.c, tests/test_liquid_batch.c). Header-only; include
 * it after "support.h". */
#ifndef MCD_TESTS_LIQUID_SUPPORT_H
#define MCD_TESTS_LIQUID_SUPPORT_H

/* A liquid of n species with random parameters of model m (all its pairs
 * and species, whatever the model needs): moderate interactions (tau of
 * order 1) as in published fits of miscible pairs, and D° of 0.3 to 3
 * 1e-9 m^2/s. */
static mcd_liquid *random_liquid(sup_rng *r, mcd_activity_model m, size_t n)
{
    mcd_liquid *liq = NULL;
    ck_assert_int_eq(mcd_liquid_new(n, m, &liq), MCD_OK);
    for (size_t i = 0; i < n; i++) {
        ck_assert_int_eq(mcd_liquid_set_species(liq, i, MCD_LIQ_MOLAR_VOLUME,
                                                sup_range(r, 2e-5, 1.5e-4)),
                         MCD_OK);
        /* q / r between 0.8 and 1.2 as for real molecules (water 1.5) */
        double ri = sup_range(r, 0.9, 5.0);
        ck_assert_int_eq(mcd_liquid_set_species(liq, i, MCD_LIQ_UNIQUAC_R, ri),
                         MCD_OK);
        ck_assert_int_eq(mcd_liquid_set_species(liq, i, MCD_LIQ_UNIQUAC_Q,
                                                ri * sup_range(r, 0.8, 1.2)),
                         MCD_OK);
        for (size_t j = i + 1; j < n; j++) {
            /* UNIQUAC's residual part scales with q (up to 5): smaller
             * energies keep the liquid mostly one phase */
            double f = m == MCD_ACTIVITY_UNIQUAC ? 0.3 : 1.0;
            double cij[3] = {f * sup_range(r, -0.2, 0.2),
                             f * sup_range(r, -100, 200),
                             f * sup_range(r, -0.03, 0.03)};
            double cji[3] = {f * sup_range(r, -0.2, 0.2),
                             f * sup_range(r, -100, 200),
                             f * sup_range(r, -0.03, 0.03)};
            ck_assert_int_eq(mcd_liquid_set_pair(liq, i, j, cij, cji,
                                                 sup_range(r, 0.1, 0.5), 0, 0),
                             MCD_OK);
            ck_assert_int_eq(mcd_liquid_set_dinf(liq, i, j,
                                                 sup_decades(r, -9.5, -8.5),
                                                 sup_decades(r, -9.5, -8.5)),
                             MCD_OK);
        }
    }
    return liq;
}

#endif
