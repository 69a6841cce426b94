/* test_jacobian.c - mcd_flux_jacobian_comp against finite differences of
 * mcd_flux_compute, closed forms of two species, and its identities.
 *
 * Outside relation: for two species with gradients summing to zero the
 * flux J_1 = -c D_12 (grad x_1 + (x_1 - w_1) grad ln P) (Bird, Stewart
 * and Lightfoot 2002, sec. 24.2, pressure diffusion; from memory), so
 * without pressure diffusion it does not depend on the composition at
 * all, and with it dJ_1/dx_1 along x_2 = 1 - x_1 is
 * -c D_12 grad ln P (1 - M_1 M_2 / Mbar^2).
 */
#include <check.h>
#include <math.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

#include "mcdiff.h"
#include "support.h"

#define NMAX 12
#define ND 2

static sup_rng rng = SUP_RNG(SUP_SPLITMIX64, 0x1AC0B1ull);

typedef struct jstate {
    size_t n;
    double x[NMAX], M[NMAX], D[NMAX * NMAX], g[NMAX * ND], G[NMAX * NMAX];
    double glnP[ND], kT[NMAX], glnT[ND], c;
} jstate;

static void draw(jstate *s, size_t n, double lo)
{
    size_t i, j;
    double m = 0.0;
    s->n = n;
    sup_fractions(&rng, n, lo, s->x);
    for (i = 0; i < n; i++)
        s->M[i] = sup_molar_mass(&rng);
    sup_dij_decades(&rng, n, s->D, -5.5, -4.5);
    sup_gradients_zero_mean(&rng, n, ND, -20.0, 20.0, s->g);
    for (i = 0; i < n; i++)
        for (j = 0; j < n; j++)
            s->G[i * n + j] =
                (i == j ? 1.0 : 0.0) + 0.1 * sup_range(&rng, -1.0, 1.0);
    for (i = 0; i < n; i++) {
        s->kT[i] = sup_range(&rng, -0.1, 0.1);
        m += s->kT[i];
    }
    for (i = 0; i < n; i++)
        s->kT[i] -= m / (double)n;
    for (i = 0; i < ND; i++) {
        s->glnP[i] = sup_range(&rng, -30.0, 30.0);
        s->glnT[i] = sup_range(&rng, -100.0, 100.0);
    }
    s->c = sup_range(&rng, 10.0, 60.0);
}

/* flags: 1 pressure diffusion, 2 Gamma, 4 thermal diffusion */
static mcd_state state_of(const jstate *s, const double *x, int flags)
{
    mcd_state st = {0};
    st.n_species = s->n;
    st.n_dim = ND;
    st.comp_basis = MCD_BASIS_MOLE;
    st.c = s->c;
    st.M = s->M;
    st.Dij = s->D;
    st.comp = x;
    st.grad = s->g;
    st.grad_lnP = flags & 1 ? s->glnP : NULL;
    st.Gamma = flags & 2 ? s->G : NULL;
    st.kT = flags & 4 ? s->kT : NULL;
    st.grad_lnT = flags & 4 ? s->glnT : NULL;
    return st;
}

static void flux_at(mcd_workspace *ws, const jstate *s, int flags, size_t k,
                    double t, double *J)
{
    double x[NMAX];
    size_t j;
    mcd_state st;
    for (j = 0; j < s->n; j++) /* y = x + t (e_k - x): stays on the simplex */
        x[j] = s->x[j] + t * ((j == k ? 1.0 : 0.0) - s->x[j]);
    st = state_of(s, x, flags);
    ck_assert_int_eq(
        mcd_flux_compute(ws, MCD_MODEL_MAXWELL_STEFAN, &st, MCD_BASIS_MOLE, J),
        MCD_OK);
}

START_TEST(jacobian_matches_finite_differences)
{
    mcd_workspace *ws;
    double worst = 0.0;
    int rep;
    ck_assert_int_eq(mcd_workspace_new(NMAX, &ws), MCD_OK);
    for (rep = 0; rep < 240; rep++) {
        const size_t n = 2 + (size_t)(rep % 9);
        const int flags = rep % 8;
        jstate s;
        double A[NMAX * ND * NMAX], Jp2[NMAX * ND], Jp1[NMAX * ND];
        double Jm1[NMAX * ND], Jm2[NMAX * ND], scale, xmin = 1.0, err = 0.0;
        size_t k, e;
        mcd_state st;
        draw(&s, n, 0.1);
        st = state_of(&s, s.x, flags);
        ck_assert_msg(mcd_flux_jacobian_comp(ws, &st, A) == MCD_OK, "%s",
                      mcd_last_error());
        /* relative to the largest derivative, or to the largest flux
         * where the derivatives vanish (two species, no pressure term) */
        flux_at(ws, &s, flags, 0, 0.0, Jp1);
        scale = fmax(sup_max_abs(A, n * ND * n), sup_max_abs(Jp1, n * ND));
        for (k = 0; k < n; k++)
            if (s.x[k] < xmin)
                xmin = s.x[k];
        for (k = 0; k < n; k++) {
            /* fourth-order central difference along e_k - x; h keeps
             * every fraction positive. The derivatives of order five
             * scale as 1/x^5, so the truncation is ~ (h / xmin)^4 = 3e-10
             * relative, the round-off ~ eps / h ~ 1e-12 (measured 2.4e-10
             * at most; h = 0.05 xmin gave errors near 1e-7) */
            const double h = 0.004 * xmin;
            flux_at(ws, &s, flags, k, 2 * h, Jp2);
            flux_at(ws, &s, flags, k, h, Jp1);
            flux_at(ws, &s, flags, k, -h, Jm1);
            flux_at(ws, &s, flags, k, -2 * h, Jm2);
            for (e = 0; e < n * ND; e++) {
                double fd =
                    (-Jp2[e] + 8 * Jp1[e] - 8 * Jm1[e] + Jm2[e]) / (12 * h);
                double dv = fabs(fd - A[e * n + k]);
                if (dv > err)
                    err = dv;
            }
        }
        err /= scale;
        if (err > worst)
            worst = err;
        ck_assert_msg(err < 1e-8, "rep %d n %zu flags %d: %g", rep, n, flags,
                      err);
    }
    printf("jacobian: largest difference from finite differences %.1e of the "
           "largest derivative\n",
           worst);
    mcd_workspace_free(ws);
}
END_TEST

START_TEST(jacobian_two_species_closed_forms)
{
    mcd_workspace *ws;
    const double M[2] = {0.002, 0.044}, D[4] = {0, 6e-5, 6e-5, 0};
    const double x[2] = {0.35, 0.65}, g[2] = {8.0, -8.0}, glnP[1] = {25.0};
    const double c = 40.0;
    double A[4], Mbar = x[0] * M[0] + x[1] * M[1], want;
    mcd_state st = {0};
    ck_assert_int_eq(mcd_workspace_new(2, &ws), MCD_OK);
    st.n_species = 2;
    st.n_dim = 1;
    st.comp_basis = MCD_BASIS_MOLE;
    st.c = c;
    st.M = M;
    st.Dij = D;
    st.comp = x;
    st.grad = g;
    /* no pressure diffusion: J_1 = -c D g_1 whatever x */
    ck_assert_int_eq(mcd_flux_jacobian_comp(ws, &st, A), MCD_OK);
    for (int e = 0; e < 4; e++)
        ck_assert_msg(fabs(A[e]) <= 1e-12 * c * 6e-5 * 8.0, "%d: %g", e, A[e]);
    /* with it: along e_1 - x = (1 - x_1)(1, -1) */
    st.grad_lnP = glnP;
    ck_assert_int_eq(mcd_flux_jacobian_comp(ws, &st, A), MCD_OK);
    want =
        (1 - x[0]) * (-c * 6e-5 * glnP[0] * (1 - M[0] * M[1] / (Mbar * Mbar)));
    ck_assert_msg(sup_rel(A[0], want) < 1e-12, "%g vs %g", A[0], want);
    ck_assert(fabs(A[0] + A[2]) <= 1e-15 * fabs(want)); /* J_2 = -J_1 */
    mcd_workspace_free(ws);
}
END_TEST

START_TEST(jacobian_identities_with_trace_species)
{
    /* every column sums to zero over species (the fluxes do for every
     * composition), and sum_k x_k dJ/dx_k = 0 (mcd_flux_compute reads
     * the fractions renormalised: scaling them changes nothing) */
    mcd_workspace *ws;
    int rep;
    ck_assert_int_eq(mcd_workspace_new(NMAX, &ws), MCD_OK);
    for (rep = 0; rep < 200; rep++) {
        const size_t n = 3 + (size_t)(rep % 10);
        jstate s;
        double A[NMAX * ND * NMAX], scale, sx = 0.0;
        size_t i, d, k;
        mcd_state st;
        draw(&s, n, 0.02);
        s.x[rep % n] = 0.0; /* a trace species */
        for (i = 0; i < n; i++)
            sx += s.x[i];
        for (i = 0; i < n; i++)
            s.x[i] /= sx;
        st = state_of(&s, s.x, rep % 8);
        ck_assert_int_eq(mcd_flux_jacobian_comp(ws, &st, A), MCD_OK);
        scale = sup_max_abs(A, n * ND * n);
        for (d = 0; d < ND; d++)
            for (k = 0; k < n; k++) {
                double sum = 0.0;
                for (i = 0; i < n; i++)
                    sum += A[(i * ND + d) * n + k];
                ck_assert_msg(fabs(sum) <= 1e-12 * scale, "rep %d: %g", rep,
                              sum);
            }
        for (i = 0; i < n * ND; i++) {
            double sum = 0.0;
            for (k = 0; k < n; k++)
                sum += s.x[k] * A[i * n + k];
            ck_assert_msg(fabs(sum) <= 1e-12 * scale, "rep %d: %g", rep, sum);
        }
    }
    mcd_workspace_free(ws);
}
END_TEST

START_TEST(jacobian_bad_input_outputs_untouched)
{
    mcd_workspace *ws;
    jstate s;
    double A[NMAX * ND * NMAX];
    mcd_state st;
    ck_assert_int_eq(mcd_workspace_new(NMAX, &ws), MCD_OK);
    draw(&s, 4, 0.1);
    sup_guard_fill(A, 4 * ND * 4);
    st = state_of(&s, s.x, 0);
    st.comp_basis = MCD_BASIS_MASS;
    ck_assert_int_eq(mcd_flux_jacobian_comp(ws, &st, A), MCD_EINVAL);
    ck_assert_ptr_nonnull(strstr(mcd_last_error(), "comp_basis"));
    st = state_of(&s, s.x, 0);
    st.grad = NULL;
    ck_assert_int_eq(mcd_flux_jacobian_comp(ws, &st, A), MCD_EINVAL);
    ck_assert_ptr_nonnull(strstr(mcd_last_error(), "grad"));
    st = state_of(&s, s.x, 0);
    ck_assert_int_eq(mcd_flux_jacobian_comp(ws, &st, NULL), MCD_EINVAL);
    ck_assert_int_eq(mcd_flux_jacobian_comp(NULL, &st, A), MCD_EINVAL);
    ck_assert_int_eq(mcd_flux_jacobian_comp(ws, NULL, A), MCD_EINVAL);
    ck_assert(sup_guard_intact(A, 4 * ND * 4));
    mcd_workspace_free(ws);
}
END_TEST

int main(void)
{
    Suite *s = suite_create("mcd:jacobian");
    TCase *tc = tcase_create("derivatives");
    tcase_add_test(tc, jacobian_matches_finite_differences);
    tcase_add_test(tc, jacobian_two_species_closed_forms);
    tcase_add_test(tc, jacobian_identities_with_trace_species);
    tcase_add_test(tc, jacobian_bad_input_outputs_untouched);
    suite_add_tcase(s, tc);
    return sup_run(s);
}
