/* test_flux_identities.c - identities of the diffusion fluxes
 * (mcd_flux_compute) and the workspace life cycle.
 *
 * Every check is an identity that holds exactly in exact arithmetic, proved
 * over thousands of random states (local deterministic PRNG, fixed seed):
 * zero-sum, the Maxwell-Stefan equations themselves (residual evaluated
 * independently in long double), Onsager symmetry, equal-Đ reduction to the
 * mixture-averaged model, the binary (N = 2) reduction to Fick's law,
 * Blanc's law for trace species and its x_i -> 0 limit, permutation
 * invariance, mass/mole basis consistency, the thermodynamic-factor and
 * pressure-diffusion driving forces derived by hand, and every error path.
 * The workspace TCase checks the life cycle (allocation failure at every
 * k-th allocation, no leak) and that per-state calls never allocate.
 *
 * Sources of the identities: Taylor and Krishna (1993), Multicomponent Mass
 * Transfer, ch. 1-2 (Maxwell-Stefan equations, basis changes, binary
 * limit); Hirschfelder, Curtiss and Bird (1954) (mixture-averaged
 * diffusivity, Blanc's law); Onsager reciprocity as stated for the
 * Maxwell-Stefan form by Taylor and Krishna (1993), ch. 2 (symmetric Đ);
 * Darken relation D = Đ Gamma for a binary (Taylor and Krishna 1993, ch. 2,
 * from memory). Tolerances are justified beside each check; the largest
 * errors met are printed to stderr (see the test log).
 */
#include <check.h>
#include <float.h>
#include <math.h>
#include <stdint.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

#include "mcdiff.h"

#define SUP_ALLOC_HOOK /* this program counts allocations */
#include "support.h"

/* The references here are computed in long double, and doubles are
 * promoted to it on purpose; Clang's -Wdouble-promotion (unlike GCC's)
 * flags double to long double as well. */
#if defined(__clang__)
#pragma clang diagnostic ignored "-Wdouble-promotion"
#endif

#define NMAX 30
#define DMAX 3

/* ------------------------------------------------------------------ */
/* PRNG and random states                                               */
/* ------------------------------------------------------------------ */

static sup_rng rng = SUP_RNG(SUP_SPLITMIX64, 0);

typedef struct state {
    size_t n, nd;
    double c;
    double M[NMAX], x[NMAX], w[NMAX];
    double D[NMAX * NMAX];
    double g[NMAX * DMAX]; /* grad x, sums to zero per direction */
} state;

/* Composition kinds: 0 uniform, 1 log-uniform over 8 decades (near-trace
 * species), 2 with exact zeros (trace species), 3 one dominant carrier. */
static void random_state(state *s, size_t n, int allow_zero)
{
    int kind = (int)(sup_next(&rng) % (allow_zero ? 4 : 3));
    double sx = 0.0;
    size_t i;
    if (kind == 2 && !allow_zero)
        kind = 0;
    s->n = n;
    s->nd = 1 + (size_t)(sup_next(&rng) % DMAX);
    s->c = sup_decades(&rng, -1.0, 4.0); /* 0.1 .. 1e4 mol/m^3 */
    for (i = 0; i < n; i++) {
        s->M[i] = sup_molar_mass(&rng);
        switch (kind) {
        case 0: s->x[i] = sup_range(&rng, 0.01, 1.0); break;
        case 1: s->x[i] = sup_decades(&rng, -8.0, 0.0); break;
        case 2:
            s->x[i] = (sup_next(&rng) % 3 == 0) ? 0.0 : sup_u01(&rng);
            break;
        default: s->x[i] = sup_decades(&rng, -6.0, -2.0); break;
        }
    }
    if (kind == 3)
        s->x[sup_next(&rng) % n] = 1.0;
    for (i = 0; i < n; i++)
        sx += s->x[i];
    if (sx == 0.0) {
        s->x[sup_next(&rng) % n] = 1.0;
        sx = 1.0;
    }
    for (i = 0; i < n; i++)
        s->x[i] /= sx;
    /* binary diffusivities over two decades (gases: 1e-6 .. 1e-4 m^2/s) */
    sup_dij_decades(&rng, n, s->D, -6.0, -4.0);
    sup_gradients_zero_mean(&rng, n, s->nd, -100.0, 100.0, s->g);
    {
        double sm = 0.0;
        for (i = 0; i < n; i++)
            sm += s->x[i] * s->M[i];
        for (i = 0; i < n; i++)
            s->w[i] = s->x[i] * s->M[i] / sm;
    }
}

static size_t random_n(void)
{
    /* N = 1 .. 30, with small N more frequent */
    return (sup_next(&rng) % 3 == 0) ? 1 + (size_t)(sup_next(&rng) % 4)
                                     : 1 + (size_t)(sup_next(&rng) % NMAX);
}

static mcd_workspace *ws;

static void setup(void)
{
    ck_assert_int_eq(mcd_workspace_new(NMAX, &ws), MCD_OK);
}
static void teardown(void)
{
    mcd_workspace_free(ws);
    ws = NULL;
}

static mcd_status flux(const state *s, mcd_model model, mcd_basis cb,
                       const double *comp, const double *grad,
                       const double *Gamma, const double *glnP, mcd_basis fb,
                       double *out)
{
    return mcd_flux_compute(ws, model,
                            &(mcd_state){.n_species = s->n,
                                         .n_dim = s->nd,
                                         .M = s->M,
                                         .Dij = s->D,
                                         .c = s->c,
                                         .comp_basis = cb,
                                         .comp = comp,
                                         .grad = grad,
                                         .Gamma = Gamma,
                                         .grad_lnP = glnP},
                            fb, out);
}

/* ------------------------------------------------------------------ */
/* zero-sum and the Maxwell-Stefan equations                           */
/* ------------------------------------------------------------------ */

START_TEST(flux_identities_zero_sum_in_both_bases)
{
    /* Tolerance: the sum of N <= 30 fluxes after the clean-up is a few
     * rounding errors of the largest flux: 30 eps ~ 7e-15; 1e-13 relative
     * to sum |F_i| leaves a margin of ~15. */
    double worst = 0.0;
    int k, m, b;
    sup_seed(&rng, 0x5EED0001u);
    for (k = 0; k < 3000; k++) {
        state s;
        random_state(&s, random_n(), 1);
        for (m = 0; m < 2; m++)
            for (b = 0; b < 2; b++) {
                double F[NMAX * DMAX];
                size_t i, d;
                ck_assert_int_eq(flux(&s, (mcd_model)m, MCD_BASIS_MOLE, s.x,
                                      s.g, NULL, NULL, (mcd_basis)b, F),
                                 MCD_OK);
                for (d = 0; d < s.nd; d++) {
                    double sum = 0.0, sabs = 0.0;
                    for (i = 0; i < s.n; i++) {
                        sum += F[i * s.nd + d];
                        sabs += fabs(F[i * s.nd + d]);
                    }
                    if (s.n == 1) {
                        ck_assert(F[d] == 0.0);
                        continue;
                    }
                    ck_assert(sabs > 0.0);
                    if (fabs(sum) / sabs > worst)
                        worst = fabs(sum) / sabs;
                    ck_assert_msg(fabs(sum) <= 1e-13 * sabs,
                                  "N=%zu model %d basis %d: sum %g vs %g", s.n,
                                  m, b, sum, sabs);
                }
            }
    }
    fprintf(stderr, "zero_sum: largest |sum F| / sum |F| = %.3g\n", worst);
}
END_TEST

/* Residual of the Maxwell-Stefan equations in long double, row by row,
 * relative to the size of the terms of that row. */
static long double ms_residual(const state *s, const double *d, const double *J)
{
    long double worst = 0.0L;
    size_t n = s->n, nd = s->nd, i, j, q;
    for (q = 0; q < nd; q++)
        for (i = 0; i < n; i++) {
            long double r = (long double)d[i * nd + q];
            long double sc = fabsl(r);
            for (j = 0; j < n; j++) {
                long double t1, t2, cd;
                if (j == i)
                    continue;
                cd = (long double)s->c * (long double)s->D[i * n + j];
                t1 = (long double)s->x[i] * (long double)J[j * nd + q] / cd;
                t2 = (long double)s->x[j] * (long double)J[i * nd + q] / cd;
                r -= t1 - t2;
                sc += fabsl(t1) + fabsl(t2);
            }
            if (sc > 0.0L && fabsl(r) / sc > worst)
                worst = fabsl(r) / sc;
        }
    return worst;
}

START_TEST(flux_identities_fluxes_satisfy_maxwell_stefan_equations)
{
    /* The solve is backward stable for the scaled SPD matrix; the residual
     * of each row relative to the magnitude of its terms is then a modest
     * multiple of eps times the condition number of the scaled problem
     * (Đ spread 100, x down to 1e-8). Measured ~4e-15; 1e-12 leaves a
     * margin of ~250. */
    long double worst = 0.0L;
    int k;
    sup_seed(&rng, 0x5EED0002u);
    for (k = 0; k < 3000; k++) {
        state s;
        double J[NMAX * DMAX];
        long double r;
        random_state(&s, 2 + (size_t)(sup_next(&rng) % (NMAX - 1)), 1);
        ck_assert_int_eq(flux(&s, MCD_MODEL_MAXWELL_STEFAN, MCD_BASIS_MOLE, s.x,
                              s.g, NULL, NULL, MCD_BASIS_MOLE, J),
                         MCD_OK);
        r = ms_residual(&s, s.g, J);
        if (r > worst)
            worst = r;
        ck_assert_msg(r <= 1e-12L, "N=%zu residual %Lg", s.n, r);
    }
    fprintf(stderr, "maxwell_stefan residual: largest relative %.3Lg\n", worst);
}
END_TEST

/* ------------------------------------------------------------------ */
/* Onsager symmetry                                                     */
/* ------------------------------------------------------------------ */

START_TEST(flux_identities_onsager_symmetry_of_velocity_map)
{
    /* With Gamma = I and grad x = e_j - e_k, S_ij = V_i - V_k (V_i =
     * J_i/(c x_i)) is the matrix of the map d -> V on the zero-sum subspace
     * in the basis e_j - e_k. It is symmetric because the Maxwell-Stefan
     * matrix is (Đ_ij = Đ_ji). Tolerance: each entry is a solve with
     * relative error ~ cond * eps (x >= 1e-8 gives velocities up to 1e8
     * times larger for rare species, but S is compared relative to its
     * largest entry). Measured ~5e-16 (the assembled matrix is exactly
     * symmetric); 1e-12 relative to max |S|. */
    double worst = 0.0;
    int k;
    sup_seed(&rng, 0x5EED0003u);
    for (k = 0; k < 300; k++) {
        state s;
        double Gam[NMAX * NMAX], S[NMAX * NMAX], J[NMAX * DMAX], g[NMAX];
        size_t n, i, j, ref, q;
        double smax = 0.0;
        random_state(&s, 2 + (size_t)(sup_next(&rng) % (NMAX - 1)), 0);
        n = s.n;
        s.nd = 1;
        ref = (size_t)(sup_next(&rng) % n);
        for (i = 0; i < n * n; i++)
            Gam[i] = 0.0;
        for (i = 0; i < n; i++)
            Gam[i * n + i] = 1.0;
        for (j = 0; j < n; j++) {
            if (j == ref)
                continue;
            for (q = 0; q < n; q++)
                g[q] = 0.0;
            g[j] = 1.0;
            g[ref] = -1.0;
            ck_assert_int_eq(
                mcd_flux_compute(ws, MCD_MODEL_MAXWELL_STEFAN,
                                 &(mcd_state){.n_species = n,
                                              .n_dim = 1,
                                              .Dij = s.D,
                                              .c = s.c,
                                              .comp_basis = MCD_BASIS_MOLE,
                                              .comp = s.x,
                                              .grad = g,
                                              .Gamma = Gam},
                                 MCD_BASIS_MOLE, J),
                MCD_OK);
            for (i = 0; i < n; i++)
                S[i * n + j] =
                    J[i] / (s.c * s.x[i]) - J[ref] / (s.c * s.x[ref]);
        }
        for (i = 0; i < n; i++)
            for (j = 0; j < n; j++)
                if (i != ref && j != ref && fabs(S[i * n + j]) > smax)
                    smax = fabs(S[i * n + j]);
        for (i = 0; i < n; i++)
            for (j = i + 1; j < n; j++) {
                double e;
                if (i == ref || j == ref)
                    continue;
                e = fabs(S[i * n + j] - S[j * n + i]) / smax;
                if (e > worst)
                    worst = e;
                ck_assert_msg(e <= 1e-12, "N=%zu S(%zu,%zu) asym %g", n, i, j,
                              e);
            }
        /* the map is also negative definite: S_jj < 0 (flux down the
         * gradient of its own driving force difference) */
        for (j = 0; j < n; j++)
            if (j != ref)
                ck_assert(S[j * n + j] < 0.0);
    }
    fprintf(stderr, "onsager: largest relative asymmetry %.3g\n", worst);
}
END_TEST

/* ------------------------------------------------------------------ */
/* reductions                                                           */
/* ------------------------------------------------------------------ */

START_TEST(flux_identities_equal_diffusivities_give_mixture_averaged)
{
    /* With all Đ_ij = Đ both models give J_i = -c Đ grad x_i exactly;
     * tolerance 1e-12 relative to the largest flux covers the O(N eps)
     * rounding of the solve and of the basis conversions. */
    double worst = 0.0;
    int k, cb, fb;
    sup_seed(&rng, 0x5EED0004u);
    for (k = 0; k < 2000; k++) {
        state s;
        double Dv, gw[NMAX * DMAX];
        size_t i, j;
        random_state(&s, random_n(), 1);
        Dv = sup_decades(&rng, -6.0, -4.0);
        for (i = 0; i < s.n; i++)
            for (j = 0; j < s.n; j++)
                s.D[i * s.n + j] = (i == j) ? 0.0 : Dv;
        ck_assert_int_eq(mcd_comp_grad_x_to_w(s.n, s.nd, s.M, s.x, s.g, gw),
                         MCD_OK);
        for (cb = 0; cb < 2; cb++)
            for (fb = 0; fb < 2; fb++) {
                double Fms[NMAX * DMAX], Fma[NMAX * DMAX], e;
                const double *comp = cb ? s.w : s.x, *grad = cb ? gw : s.g;
                ck_assert_int_eq(flux(&s, MCD_MODEL_MAXWELL_STEFAN,
                                      (mcd_basis)cb, comp, grad, NULL, NULL,
                                      (mcd_basis)fb, Fms),
                                 MCD_OK);
                ck_assert_int_eq(flux(&s, MCD_MODEL_MIXTURE_AVERAGED,
                                      (mcd_basis)cb, comp, grad, NULL, NULL,
                                      (mcd_basis)fb, Fma),
                                 MCD_OK);
                e = sup_rel_diff(Fma, Fms, s.n * s.nd);
                if (e > worst)
                    worst = e;
                ck_assert_msg(e <= 1e-12, "N=%zu cb %d fb %d: %g", s.n, cb, fb,
                              e);
                if (cb == 0 && fb == 0 && s.n > 1) {
                    /* and both equal -c Đ grad x */
                    for (i = 0; i < s.n * s.nd; i++)
                        ck_assert(fabs(Fms[i] + s.c * Dv * s.g[i]) <=
                                  1e-12 * s.c * Dv *
                                      sup_max_abs(s.g, s.n * s.nd));
                }
            }
    }
    fprintf(stderr, "equal_D: largest relative MS - MA difference %.3g\n",
            worst);
}
END_TEST

START_TEST(flux_identities_mixture_averaged_matches_hand_formula)
{
    /* Hirschfelder-Curtiss with the correction flux, evaluated here in long
     * double: D_im = (sum_{j != i} x_j) / sum_{j != i} x_j/Đ_ij;
     * mole: J*_i = -c D_im grad x_i, J_i = J*_i - x_i sum_k J*_k;
     * mass: j*_i = -c M_i D_im grad x_i (= -rho (M_i/Mbar) D_im grad x_i),
     *       j_i = j*_i - w_i sum_k j*_k.
     * Tolerance 1e-13 relative to the largest flux: O(N) roundings. */
    double worst = 0.0;
    int k, b;
    sup_seed(&rng, 0x5EED000Cu);
    for (k = 0; k < 2000; k++) {
        state s;
        long double Dim[NMAX], ref[NMAX * DMAX];
        double F[NMAX * DMAX], R[NMAX * DMAX], e;
        size_t n, i, j, d;
        random_state(&s, 2 + (size_t)(sup_next(&rng) % (NMAX - 1)), 1);
        n = s.n;
        for (i = 0; i < n; i++) {
            long double num = 0.0L, den = 0.0L;
            for (j = 0; j < n; j++)
                if (j != i) {
                    num += s.x[j];
                    den += (long double)s.x[j] / s.D[i * n + j];
                }
            if (den == 0.0L) /* pure species: documented limit */
                for (j = 0, num = (long double)(n - 1); j < n; j++)
                    if (j != i)
                        den += 1.0L / s.D[i * n + j];
            Dim[i] = num / den;
        }
        for (b = 0; b < 2; b++) {
            for (d = 0; d < s.nd; d++) {
                long double sum = 0.0L;
                for (i = 0; i < n; i++) {
                    long double f =
                        -(long double)s.c * Dim[i] * s.g[i * s.nd + d];
                    if (b)
                        f *= s.M[i];
                    ref[i * s.nd + d] = f;
                    sum += f;
                }
                for (i = 0; i < n; i++)
                    ref[i * s.nd + d] -= (b ? s.w[i] : s.x[i]) * sum;
            }
            for (i = 0; i < n * s.nd; i++)
                R[i] = (double)ref[i];
            ck_assert_int_eq(flux(&s, MCD_MODEL_MIXTURE_AVERAGED,
                                  MCD_BASIS_MOLE, s.x, s.g, NULL, NULL,
                                  (mcd_basis)b, F),
                             MCD_OK);
            e = sup_rel_diff(F, R, n * s.nd);
            if (e > worst)
                worst = e;
            ck_assert_msg(e <= 1e-13, "N=%zu basis %d: %g", n, b, e);
        }
    }
    fprintf(stderr, "mixture-averaged vs hand formula: %.3g\n", worst);
}
END_TEST

START_TEST(flux_identities_binary_reduces_to_fick)
{
    /* N = 2: J_1 = -c Đ_12 grad x_1 (molar frame) and j_1 = -rho Đ_12
     * grad w_1 (mass frame) for both models (Taylor and Krishna 1993,
     * ch. 2 and 3). Tolerance 1e-13 relative: a handful of roundings. */
    int k, m;
    sup_seed(&rng, 0x5EED0005u);
    for (k = 0; k < 2000; k++) {
        state s;
        double gw[2 * DMAX], rho = 0.0;
        size_t d;
        random_state(&s, 2, 1);
        for (d = 0; d < s.nd; d++) /* exactly consistent gradients */
            s.g[s.nd + d] = -s.g[d];
        rho = s.c * (s.x[0] * s.M[0] + s.x[1] * s.M[1]);
        ck_assert_int_eq(mcd_comp_grad_x_to_w(2, s.nd, s.M, s.x, s.g, gw),
                         MCD_OK);
        for (m = 0; m < 2; m++) {
            double J[2 * DMAX], j[2 * DMAX];
            ck_assert_int_eq(flux(&s, (mcd_model)m, MCD_BASIS_MOLE, s.x, s.g,
                                  NULL, NULL, MCD_BASIS_MOLE, J),
                             MCD_OK);
            ck_assert_int_eq(flux(&s, (mcd_model)m, MCD_BASIS_MASS, s.w, gw,
                                  NULL, NULL, MCD_BASIS_MASS, j),
                             MCD_OK);
            for (d = 0; d < s.nd; d++) {
                double ref = -s.c * s.D[1] * s.g[d];
                double refm = -rho * s.D[1] * gw[d];
                ck_assert(fabs(J[d] - ref) <= 1e-13 * fabs(ref) + 1e-300);
                ck_assert(fabs(J[s.nd + d] + ref) <=
                          1e-13 * fabs(ref) + 1e-300);
                ck_assert_msg(fabs(j[d] - refm) <= 1e-12 * fabs(refm) + 1e-300,
                              "mass binary %g vs %g", j[d], refm);
            }
        }
    }
}
END_TEST

START_TEST(flux_identities_trace_species_obey_blanc_law)
{
    /* x_t = 0: J_t = -c d_t / sum_j x_j/Đ_tj exactly (tolerance 4 N eps
     * for the rounding of the Blanc sum). The limit x_t = 1e-12 (the others
     * rescaled by 1 - 1e-12) changes every flux by O(x_t Đmax/Đmin) =
     * O(1e-10) relatively (the new x_t/Đ_jt terms against the Blanc sums
     * of the others); 1e-9 relative to the largest flux. */
    double worst_exact = 0.0, worst_limit = 0.0;
    int k, m;
    sup_seed(&rng, 0x5EED0006u);
    for (k = 0; k < 2000; k++) {
        state s, s2;
        double J0[NMAX * DMAX], J1[NMAX * DMAX];
        size_t t, i, d;
        random_state(&s, 2 + (size_t)(sup_next(&rng) % (NMAX - 1)), 0);
        t = (size_t)(sup_next(&rng) % s.n);
        if (s.x[t] == 1.0)
            continue;
        {
            double r = 1.0 - s.x[t];
            s.x[t] = 0.0;
            for (i = 0; i < s.n; i++)
                s.x[i] /= r;
        }
        s2 = s;
        for (i = 0; i < s.n; i++)
            s2.x[i] = (i == t) ? 1e-12 : s.x[i] * (1.0 - 1e-12);
        for (m = 0; m < 2; m++) {
            ck_assert_int_eq(flux(&s, (mcd_model)m, MCD_BASIS_MOLE, s.x, s.g,
                                  NULL, NULL, MCD_BASIS_MOLE, J0),
                             MCD_OK);
            for (d = 0; d < s.nd; d++) {
                long double sum = 0.0L, sx = 0.0L, ref;
                double e;
                /* Blanc with the mole fractions normalised as the library
                 * does (the test's x sums to 1 only to round-off) */
                for (i = 0; i < s.n; i++) {
                    sx += (long double)s.x[i];
                    if (i != t)
                        sum +=
                            (long double)s.x[i] / (long double)s.D[t * s.n + i];
                }
                ref = -(long double)s.c * (long double)s.g[t * s.nd + d] * sx /
                      sum;
                e = (double)(fabsl((long double)J0[t * s.nd + d] - ref) /
                             (fabsl(ref) + 1e-300L));
                if (e > worst_exact)
                    worst_exact = e;
                ck_assert_msg(e <= 4.0 * NMAX * DBL_EPSILON,
                              "Blanc %g model %d N %zu", e, m, s.n);
            }
            if (m == 0) {
                double e;
                ck_assert_int_eq(flux(&s2, MCD_MODEL_MAXWELL_STEFAN,
                                      MCD_BASIS_MOLE, s2.x, s2.g, NULL, NULL,
                                      MCD_BASIS_MOLE, J1),
                                 MCD_OK);
                e = sup_rel_diff(J1, J0, s.n * s.nd);
                if (e > worst_limit)
                    worst_limit = e;
                ck_assert_msg(e <= 1e-9, "limit x_t -> 1e-12: %g", e);
            }
        }
    }
    fprintf(stderr, "blanc: exact rel err %.3g, limit 1e-12 rel diff %.3g\n",
            worst_exact, worst_limit);
}
END_TEST

START_TEST(flux_identities_pure_component_and_single_species)
{
    /* x = e_p: every other species is a trace species with J_i = -c Đ_ip
     * d_i (Blanc with one partner) and J_p = -sum of the others.
     * N = 1: zero flux. Tolerance: a few roundings, 1e-14 relative. */
    int k;
    sup_seed(&rng, 0x5EED0007u);
    for (k = 0; k < 500; k++) {
        state s;
        double J[NMAX * DMAX];
        size_t p, i, d;
        random_state(&s, 2 + (size_t)(sup_next(&rng) % (NMAX - 1)), 0);
        p = (size_t)(sup_next(&rng) % s.n);
        for (i = 0; i < s.n; i++)
            s.x[i] = (i == p) ? 1.0 : 0.0;
        ck_assert_int_eq(flux(&s, (mcd_model)(k & 1), MCD_BASIS_MOLE, s.x, s.g,
                              NULL, NULL, MCD_BASIS_MOLE, J),
                         MCD_OK);
        for (d = 0; d < s.nd; d++) {
            double sum = 0.0;
            for (i = 0; i < s.n; i++) {
                double ref = -s.c * s.D[i * s.n + p] * s.g[i * s.nd + d];
                if (i == p)
                    continue;
                ck_assert(fabs(J[i * s.nd + d] - ref) <= 1e-14 * fabs(ref));
                sum += J[i * s.nd + d];
            }
            ck_assert(fabs(J[p * s.nd + d] + sum) <=
                      1e-14 * sup_max_abs(J, s.n * s.nd));
        }
    }
    {
        double M1 = 0.028, D1 = 0.0, x1 = 1.0, g1[3] = {1.0, 2.0, 3.0};
        double F[3] = {SUP_GUARD, SUP_GUARD, SUP_GUARD};
        ck_assert_int_eq(
            mcd_flux_compute(ws, MCD_MODEL_MAXWELL_STEFAN,
                             &(mcd_state){.n_species = 1,
                                          .n_dim = 3,
                                          .M = &M1,
                                          .Dij = &D1,
                                          .c = 40.0,
                                          .comp_basis = MCD_BASIS_MOLE,
                                          .comp = &x1,
                                          .grad = g1},
                             MCD_BASIS_MASS, F),
            MCD_OK);
        ck_assert(F[0] == 0.0 && F[1] == 0.0 && F[2] == 0.0);
    }
}
END_TEST

START_TEST(flux_identities_permutation_invariance)
{
    /* Relabelling species permutes the fluxes. Round-off differs with the
     * order of summation only (the solve's conditioning times a different
     * rounding pattern). Measured ~6e-15; 1e-12 relative to the largest
     * flux. */
    double worst = 0.0;
    int k, m, b;
    sup_seed(&rng, 0x5EED0008u);
    for (k = 0; k < 1500; k++) {
        state s, p;
        size_t perm[NMAX], i, j, d;
        random_state(&s, random_n(), 1);
        p = s;
        for (i = 0; i < s.n; i++)
            perm[i] = i;
        for (i = s.n; i-- > 1;) {
            size_t r = (size_t)(sup_next(&rng) % (i + 1)), t = perm[i];
            perm[i] = perm[r];
            perm[r] = t;
        }
        for (i = 0; i < s.n; i++) {
            p.x[i] = s.x[perm[i]];
            p.w[i] = s.w[perm[i]];
            p.M[i] = s.M[perm[i]];
            for (j = 0; j < s.n; j++)
                p.D[i * s.n + j] = s.D[perm[i] * s.n + perm[j]];
            for (d = 0; d < s.nd; d++)
                p.g[i * s.nd + d] = s.g[perm[i] * s.nd + d];
        }
        for (m = 0; m < 2; m++)
            for (b = 0; b < 2; b++) {
                double F[NMAX * DMAX], G[NMAX * DMAX], Fp[NMAX * DMAX], e;
                ck_assert_int_eq(flux(&s, (mcd_model)m, MCD_BASIS_MOLE, s.x,
                                      s.g, NULL, NULL, (mcd_basis)b, F),
                                 MCD_OK);
                ck_assert_int_eq(flux(&p, (mcd_model)m, MCD_BASIS_MOLE, p.x,
                                      p.g, NULL, NULL, (mcd_basis)b, G),
                                 MCD_OK);
                for (i = 0; i < s.n; i++)
                    for (d = 0; d < s.nd; d++)
                        Fp[i * s.nd + d] = F[perm[i] * s.nd + d];
                e = sup_rel_diff(G, Fp, s.n * s.nd);
                if (e > worst)
                    worst = e;
                ck_assert_msg(e <= 1e-12, "N=%zu perm diff %g", s.n, e);
            }
    }
    fprintf(stderr, "permutation: largest relative difference %.3g\n", worst);
}
END_TEST

START_TEST(flux_identities_mass_and_mole_bases_are_consistent)
{
    /* (a) mass-basis output equals mcd_flux_convert of the molar output;
     * (b) mass-fraction input equals converting w, grad w to x, grad x
     * first. Tolerance: the conversions are O(N) sums of O(1) products,
     * with the solve's conditioning on top for (b). Measured ~1e-14;
     * 1e-12 relative to the largest flux. */
    double worst_a = 0.0, worst_b = 0.0;
    int k, m;
    sup_seed(&rng, 0x5EED0009u);
    for (k = 0; k < 2000; k++) {
        state s;
        double gw[NMAX * DMAX];
        random_state(&s, random_n(), 1);
        ck_assert_int_eq(mcd_comp_grad_x_to_w(s.n, s.nd, s.M, s.x, s.g, gw),
                         MCD_OK);
        for (m = 0; m < 2; m++) {
            double J[NMAX * DMAX], j[NMAX * DMAX], jc[NMAX * DMAX];
            double Jw[NMAX * DMAX], e;
            ck_assert_int_eq(flux(&s, (mcd_model)m, MCD_BASIS_MOLE, s.x, s.g,
                                  NULL, NULL, MCD_BASIS_MOLE, J),
                             MCD_OK);
            ck_assert_int_eq(flux(&s, (mcd_model)m, MCD_BASIS_MOLE, s.x, s.g,
                                  NULL, NULL, MCD_BASIS_MASS, j),
                             MCD_OK);
            ck_assert_int_eq(mcd_flux_convert(s.n, s.nd, s.M, s.x,
                                              MCD_BASIS_MOLE, J, MCD_BASIS_MASS,
                                              jc),
                             MCD_OK);
            e = sup_rel_diff(j, jc, s.n * s.nd);
            if (e > worst_a)
                worst_a = e;
            ck_assert_msg(e <= 1e-12, "mass out vs convert %g", e);
            ck_assert_int_eq(flux(&s, (mcd_model)m, MCD_BASIS_MASS, s.w, gw,
                                  NULL, NULL, MCD_BASIS_MOLE, Jw),
                             MCD_OK);
            e = sup_rel_diff(Jw, J, s.n * s.nd);
            if (e > worst_b)
                worst_b = e;
            ck_assert_msg(e <= 1e-12, "mass in vs mole in %g", e);
        }
    }
    fprintf(stderr, "bases: out vs convert %.3g, in w vs in x %.3g\n", worst_a,
            worst_b);
}
END_TEST

/* ------------------------------------------------------------------ */
/* thermodynamic factor and pressure diffusion                         */
/* ------------------------------------------------------------------ */

START_TEST(flux_identities_gamma_and_pressure_driving_forces)
{
    /* Hand derivations:
     * (1) binary with Gamma = G I (consistent binary thermodynamics):
     *     J_1 = -c Đ G grad x_1 (Darken: Fick D = Đ Gamma).
     * (2) binary with an arbitrary 2x2 Gamma: d_1 = (G11 - G12) g,
     *     d_2 = (G21 - G22) g (g = grad x_1 = -grad x_2); the library
     *     projects d_i -= x_i (d_1 + d_2), so J_1 = -c Đ (x_2 d_1 - x_1 d_2).
     * (3) N species, Gamma with equal column sums (so sum_i d_i = 0):
     *     fluxes equal those with Gamma = NULL and grad x replaced by
     *     d = Gamma grad x computed here.
     * (4) pressure diffusion: fluxes with grad ln P equal those with
     *     grad x replaced by grad x + (x - w) grad ln P; binary closed form
     *     J_1 = -c Đ (grad x_1 + (x_1 - w_1) grad ln P).
     * Tolerances: 1e-12 relative, for the binary (a few roundings) and for
     * N species (same solve, right-hand sides rounded differently; the
     * other identity tests measure such differences at ~1e-14). */
    int k, m;
    sup_seed(&rng, 0x5EED000Au);
    for (k = 0; k < 1000; k++) {
        state s;
        double G[4], J[2 * DMAX], glnP[DMAX];
        size_t d;
        random_state(&s, 2, 0);
        for (d = 0; d < s.nd; d++) {
            glnP[d] = sup_range(&rng, -50.0, 50.0);
            s.g[s.nd + d] = -s.g[d];
        }
        for (m = 0; m < 2; m++) {
            double Gb = sup_range(&rng, 0.1, 3.0);
            G[0] = Gb;
            G[1] = 0.0;
            G[2] = 0.0;
            G[3] = Gb;
            ck_assert_int_eq(flux(&s, (mcd_model)m, MCD_BASIS_MOLE, s.x, s.g, G,
                                  NULL, MCD_BASIS_MOLE, J),
                             MCD_OK);
            for (d = 0; d < s.nd; d++) {
                double ref = -s.c * s.D[1] * Gb * s.g[d];
                ck_assert(fabs(J[d] - ref) <= 1e-12 * fabs(ref) + 1e-300);
            }
            G[0] = sup_range(&rng, -2, 2);
            G[1] = sup_range(&rng, -2, 2);
            G[2] = sup_range(&rng, -2, 2);
            G[3] = sup_range(&rng, -2, 2);
            ck_assert_int_eq(flux(&s, (mcd_model)m, MCD_BASIS_MOLE, s.x, s.g, G,
                                  NULL, MCD_BASIS_MOLE, J),
                             MCD_OK);
            for (d = 0; d < s.nd; d++) {
                double g = s.g[d], d1 = (G[0] - G[1]) * g,
                       d2 = (G[2] - G[3]) * g;
                double ref = -s.c * s.D[1] * (s.x[1] * d1 - s.x[0] * d2);
                ck_assert(fabs(J[d] - ref) <=
                          1e-12 * s.c * s.D[1] * (fabs(d1) + fabs(d2)) +
                              1e-300);
            }
            ck_assert_int_eq(flux(&s, (mcd_model)m, MCD_BASIS_MOLE, s.x, s.g,
                                  NULL, glnP, MCD_BASIS_MOLE, J),
                             MCD_OK);
            for (d = 0; d < s.nd; d++) {
                double dr = s.g[d] + (s.x[0] - s.w[0]) * glnP[d];
                double ref = -s.c * s.D[1] * dr;
                ck_assert(
                    fabs(J[d] - ref) <=
                    1e-12 * s.c * s.D[1] *
                            (fabs(s.g[d]) + fabs((s.x[0] - s.w[0]) * glnP[d])) +
                        1e-300);
            }
        }
    }
    for (k = 0; k < 1000; k++) {
        state s;
        double Gam[NMAX * NMAX], dg[NMAX * DMAX], glnP[DMAX];
        double F1[NMAX * DMAX], F2[NMAX * DMAX];
        size_t n, i, j, d;
        random_state(&s, 2 + (size_t)(sup_next(&rng) % (NMAX - 1)), 1);
        n = s.n;
        for (i = 0; i < n * n; i++)
            Gam[i] =
                sup_range(&rng, -0.5, 0.5) + ((i % (n + 1)) == 0 ? 1.5 : 0.0);
        for (j = 0; j < n; j++) { /* equal column sums (= 1) */
            double cs = 0.0;
            for (i = 0; i + 1 < n; i++)
                cs += Gam[i * n + j];
            Gam[(n - 1) * n + j] = 1.0 - cs;
        }
        for (i = 0; i < n; i++)
            for (d = 0; d < s.nd; d++) {
                double t = 0.0;
                for (j = 0; j < n; j++)
                    t += Gam[i * n + j] * s.g[j * s.nd + d];
                dg[i * s.nd + d] = t;
            }
        for (d = 0; d < s.nd; d++)
            glnP[d] = sup_range(&rng, -50.0, 50.0);
        for (m = 0; m < 2; m++) {
            ck_assert_int_eq(flux(&s, (mcd_model)m, MCD_BASIS_MOLE, s.x, s.g,
                                  Gam, NULL, MCD_BASIS_MOLE, F1),
                             MCD_OK);
            ck_assert_int_eq(flux(&s, (mcd_model)m, MCD_BASIS_MOLE, s.x, dg,
                                  NULL, NULL, MCD_BASIS_MOLE, F2),
                             MCD_OK);
            ck_assert_msg(sup_rel_diff(F1, F2, n * s.nd) <= 1e-12,
                          "Gamma N=%zu %g", n, sup_rel_diff(F1, F2, n * s.nd));
            for (i = 0; i < n; i++)
                for (d = 0; d < s.nd; d++)
                    dg[i * s.nd + d] =
                        s.g[i * s.nd + d] + (s.x[i] - s.w[i]) * glnP[d];
            ck_assert_int_eq(flux(&s, (mcd_model)m, MCD_BASIS_MOLE, s.x, s.g,
                                  NULL, glnP, MCD_BASIS_MOLE, F1),
                             MCD_OK);
            ck_assert_int_eq(flux(&s, (mcd_model)m, MCD_BASIS_MOLE, s.x, dg,
                                  NULL, NULL, MCD_BASIS_MOLE, F2),
                             MCD_OK);
            ck_assert_msg(sup_rel_diff(F1, F2, n * s.nd) <= 1e-12,
                          "lnP N=%zu %g", n, sup_rel_diff(F1, F2, n * s.nd));
            /* restore dg for the next model */
            for (i = 0; i < n; i++)
                for (d = 0; d < s.nd; d++) {
                    double t = 0.0;
                    for (j = 0; j < n; j++)
                        t += Gam[i * n + j] * s.g[j * s.nd + d];
                    dg[i * s.nd + d] = t;
                }
        }
    }
}
END_TEST

/* ------------------------------------------------------------------ */
/* errors                                                               */
/* ------------------------------------------------------------------ */

START_TEST(flux_identities_errors_leave_output_untouched)
{
    enum { N = 3, ND = 2 };
    double M[N] = {0.002, 0.028, 0.044};
    double D[N * N] = {0, 7.8e-5, 6.8e-5, 7.8e-5, 0, 1.7e-5, 6.8e-5, 1.7e-5, 0};
    double x[N] = {0.2, 0.3, 0.5};
    double g[N * ND] = {1, -1, 2, 0, -3, 1};
    double Gam[N * N] = {1, 0, 0, 0, 1, 0, 0, 0, 1};
    double glnP[ND] = {0.1, 0.2};
    double out[N * ND];
    double bad[N * N];
    struct {
        int code;
        const char *arg;
    } r;
    mcd_workspace *small;

#define EXPECT(call, codev, argname)                                           \
    do {                                                                       \
        sup_guard_fill(out, N *ND);                                            \
        r.code = (int)(call);                                                  \
        r.arg = (argname);                                                     \
        ck_assert_int_eq(r.code, (codev));                                     \
        ck_assert(sup_guard_intact(out, N *ND));                               \
        if (r.arg != NULL)                                                     \
            ck_assert_msg(strstr(mcd_last_error(), r.arg) != NULL,             \
                          "message '%s' lacks '%s'", mcd_last_error(), r.arg); \
    } while (0)
#define CALL(ws_, model_, n_, nd_, M_, D_, c_, cb_, x_, g_, G_, lp_, fb_)      \
    mcd_flux_compute(ws_, model_,                                              \
                     &(mcd_state){.n_species = n_,                             \
                                  .n_dim = nd_,                                \
                                  .M = M_,                                     \
                                  .Dij = D_,                                   \
                                  .c = c_,                                     \
                                  .comp_basis = cb_,                           \
                                  .comp = x_,                                  \
                                  .grad = g_,                                  \
                                  .Gamma = G_,                                 \
                                  .grad_lnP = lp_},                            \
                     fb_, out)

    EXPECT(CALL(NULL, 0, N, ND, M, D, 40.0, 0, x, g, NULL, NULL, 0), MCD_EINVAL,
           NULL);
    EXPECT(CALL(ws, 0, 0, ND, M, D, 40.0, 0, x, g, NULL, NULL, 0), MCD_EINVAL,
           "n_species");
    ck_assert_int_eq(mcd_workspace_new(2, &small), MCD_OK);
    sup_guard_fill(out, N * ND);
    ck_assert_int_eq(mcd_flux_compute(small, 0,
                                      &(mcd_state){.n_species = N,
                                                   .n_dim = ND,
                                                   .M = M,
                                                   .Dij = D,
                                                   .c = 40.0,
                                                   .comp_basis = 0,
                                                   .comp = x,
                                                   .grad = g},
                                      0, out),
                     MCD_EBADLEN);
    ck_assert(sup_guard_intact(out, N * ND));
    ck_assert(strstr(mcd_last_error(), "n_species") != NULL);
    mcd_workspace_free(small);
    EXPECT(CALL(ws, 0, NMAX + 1, ND, M, D, 40.0, 0, x, g, NULL, NULL, 0),
           MCD_EBADLEN, "n_species");
    EXPECT(CALL(ws, 0, N, 0, M, D, 40.0, 0, x, g, NULL, NULL, 0), MCD_EINVAL,
           "n_dim");
    EXPECT(CALL(ws, 0, N, 4, M, D, 40.0, 0, x, g, NULL, NULL, 0), MCD_EINVAL,
           "n_dim");
    EXPECT(CALL(ws, (mcd_model)7, N, ND, M, D, 40.0, 0, x, g, NULL, NULL, 0),
           MCD_EINVAL, "model");
    EXPECT(CALL(ws, 0, N, ND, M, D, 40.0, (mcd_basis)2, x, g, NULL, NULL, 0),
           MCD_EINVAL, "comp_basis");
    EXPECT(CALL(ws, 0, N, ND, M, D, 40.0, 0, x, g, NULL, NULL, (mcd_basis)9),
           MCD_EINVAL, "flux_basis");
    EXPECT(CALL(ws, 0, N, ND, M, NULL, 40.0, 0, x, g, NULL, NULL, 0),
           MCD_EINVAL, "Dij");
    EXPECT(CALL(ws, 0, N, ND, M, D, 40.0, 0, NULL, g, NULL, NULL, 0),
           MCD_EINVAL, "comp");
    EXPECT(CALL(ws, 0, N, ND, M, D, 40.0, 0, x, NULL, NULL, NULL, 0),
           MCD_EINVAL, "grad");
    EXPECT(mcd_flux_compute(ws, 0, NULL, 0, out), MCD_EINVAL,
           "argument state: NULL");
    EXPECT(CALL(ws, 0, N, ND, NULL, D, 40.0, 1, x, g, NULL, NULL, 0),
           MCD_EINVAL, "M");
    EXPECT(CALL(ws, 0, N, ND, NULL, D, 40.0, 0, x, g, NULL, NULL, 1),
           MCD_EINVAL, "M");
    EXPECT(CALL(ws, 0, N, ND, NULL, D, 40.0, 0, x, g, NULL, glnP, 0),
           MCD_EINVAL, "M");
    ck_assert_int_eq(mcd_flux_compute(ws, 0,
                                      &(mcd_state){.n_species = N,
                                                   .n_dim = ND,
                                                   .M = M,
                                                   .Dij = D,
                                                   .c = 40.0,
                                                   .comp_basis = 0,
                                                   .comp = x,
                                                   .grad = g},
                                      0, NULL),
                     MCD_EINVAL);
    EXPECT(CALL(ws, 0, N, ND, M, D, 0.0, 0, x, g, NULL, NULL, 0), MCD_EDOM,
           "c");
    EXPECT(CALL(ws, 0, N, ND, M, D, -40.0, 0, x, g, NULL, NULL, 0), MCD_EDOM,
           "c");
    EXPECT(CALL(ws, 0, N, ND, M, D, SUP_NAN, 0, x, g, NULL, NULL, 0),
           MCD_EINVAL, "c");
    EXPECT(CALL(ws, 0, N, ND, M, D, SUP_INF, 0, x, g, NULL, NULL, 0),
           MCD_EINVAL, "c");
    {
        double Mb[N] = {0.002, -0.028, 0.044}, Mn[N] = {0.002, SUP_NAN, 0.044};
        EXPECT(CALL(ws, 0, N, ND, Mb, D, 40.0, 1, x, g, NULL, NULL, 0),
               MCD_EDOM, "argument M: entry 1");
        EXPECT(CALL(ws, 0, N, ND, Mn, D, 40.0, 0, x, g, NULL, NULL, 1),
               MCD_EINVAL, "argument M: entry 1");
    }
    memcpy(bad, D, sizeof(bad));
    bad[2 * N + 0] = -1.0;
    EXPECT(CALL(ws, 0, N, ND, M, bad, 40.0, 0, x, g, NULL, NULL, 0), MCD_EDOM,
           "argument Dij: entry (2,0) = -1 is not > 0");
    bad[2 * N + 0] = 0.0;
    EXPECT(CALL(ws, 0, N, ND, M, bad, 40.0, 0, x, g, NULL, NULL, 0), MCD_EDOM,
           "Dij");
    bad[2 * N + 0] = SUP_NAN;
    EXPECT(CALL(ws, 0, N, ND, M, bad, 40.0, 0, x, g, NULL, NULL, 0), MCD_EINVAL,
           "Dij");
    memcpy(bad, D, sizeof(bad));
    bad[1 * N + 2] *= 1.0 + 1e-9; /* asymmetric beyond 1e-12 */
    EXPECT(CALL(ws, 1, N, ND, M, bad, 40.0, 0, x, g, NULL, NULL, 0), MCD_EDOM,
           "symmetric");
    memcpy(bad, D, sizeof(bad));
    bad[1 * N + 2] *= 1.0 + 1e-14; /* within 1e-12: accepted */
    sup_guard_fill(out, N * ND);
    ck_assert_int_eq(CALL(ws, 0, N, ND, M, bad, 40.0, 0, x, g, NULL, NULL, 0),
                     MCD_OK);
    ck_assert_str_eq(mcd_last_error(), "");
    bad[4] = SUP_NAN; /* the diagonal is ignored */
    ck_assert_int_eq(CALL(ws, 0, N, ND, M, bad, 40.0, 0, x, g, NULL, NULL, 0),
                     MCD_OK);
    {
        double xn[N] = {0.2, -0.1, 0.9}, xs[N] = {0.2, 0.27, 0.5};
        double xq[N] = {0.2, SUP_NAN, 0.5};
        EXPECT(CALL(ws, 0, N, ND, M, D, 40.0, 0, xn, g, NULL, NULL, 0),
               MCD_EDOM, "argument comp: entry 1 = -0.1 is negative");
        EXPECT(CALL(ws, 0, N, ND, M, D, 40.0, 0, xs, g, NULL, NULL, 0),
               MCD_EDOM,
               "argument comp: sum 0.97 differs from 1 by more than 1e-6");
        EXPECT(CALL(ws, 1, N, ND, M, D, 40.0, 1, xq, g, NULL, NULL, 1),
               MCD_EINVAL, "comp");
    }
    {
        double gn[N * ND] = {1, -1, 2, 0, -3, SUP_NAN};
        double Gn[N * N] = {1, 0, 0, 0, SUP_INF, 0, 0, 0, 1};
        double ln[ND] = {0.0, SUP_NAN};
        EXPECT(CALL(ws, 0, N, ND, M, D, 40.0, 0, x, gn, NULL, NULL, 0),
               MCD_EINVAL, "argument grad");
        EXPECT(CALL(ws, 0, N, ND, M, D, 40.0, 0, x, g, Gn, NULL, 0), MCD_EINVAL,
               "Gamma");
        EXPECT(CALL(ws, 0, N, ND, M, D, 40.0, 0, x, g, NULL, ln, 0), MCD_EINVAL,
               "grad_lnP");
    }
    /* Đ_01 = 1e-310 (subnormal): outside the domain, 1/Đ would overflow;
     * rejected before any arithmetic, naming the entry */
    memcpy(bad, D, sizeof(bad));
    bad[1] = bad[3] = 1e-310;
    EXPECT(CALL(ws, 0, N, ND, M, bad, 40.0, 0, x, g, NULL, NULL, 0), MCD_EDOM,
           "argument Dij: entry (0,1) = 1e-310 is subnormal");
    /* a success clears the message */
    ck_assert_int_eq(CALL(ws, 0, N, ND, M, D, 40.0, 0, x, g, Gam, glnP, 1),
                     MCD_OK);
    ck_assert_str_eq(mcd_last_error(), "");
#undef EXPECT
#undef CALL
}
END_TEST

/* ------------------------------------------------------------------ */
/* workspace life cycle                                                 */
/* ------------------------------------------------------------------ */

typedef struct counting {
    int n_alloc, fail_at, live;
} counting;

static void *cnt_alloc(void *ud, size_t size)
{
    counting *c = (counting *)ud;
    void *p;
    c->n_alloc++;
    if (c->fail_at > 0 && c->n_alloc == c->fail_at)
        return NULL;
    p = malloc(size);
    if (p != NULL)
        c->live++;
    return p;
}
static void cnt_free(void *ud, void *p)
{
    counting *c = (counting *)ud;
    if (p != NULL) {
        c->live--;
        free(p);
    }
}

START_TEST(flux_identities_workspace_alloc_and_failure_injection)
{
    mcd_workspace *w = (mcd_workspace *)&w, *w0 = w;
    mcd_allocator al;
    counting cnt = {0, 0, 0};
    int total, k;

    ck_assert_int_eq(mcd_workspace_new(0, &w), MCD_EINVAL);
    ck_assert_int_eq(mcd_workspace_new(MCD_MAX_SPECIES + 1, &w), MCD_EINVAL);
    ck_assert_int_eq(mcd_workspace_new(3, NULL), MCD_EINVAL);
    ck_assert_ptr_eq(w, w0);
    mcd_workspace_free(NULL);
    ck_assert_uint_eq(mcd_workspace_capacity(NULL), 0);
    /* free and the getters leave the detail of the failure above */
    ck_assert_str_ne(mcd_last_error(), "");

    al.alloc = cnt_alloc;
    al.free = cnt_free;
    al.ud = &cnt;
    ck_assert_int_eq(mcd_workspace_new_with(3, NULL, &w), MCD_EINVAL);
    {
        mcd_allocator half = al;
        half.free = NULL;
        ck_assert_int_eq(mcd_workspace_new_with(3, &half, &w), MCD_EINVAL);
        half = al;
        half.alloc = NULL;
        ck_assert_int_eq(mcd_workspace_new_with(3, &half, &w), MCD_EINVAL);
    }
    ck_assert_int_eq(cnt.n_alloc, 0);

    ck_assert_int_eq(mcd_workspace_new_with(7, &al, &w), MCD_OK);
    ck_assert_uint_eq(mcd_workspace_capacity(w), 7);
    ck_assert_str_eq(mcd_last_error(), "");
    total = cnt.n_alloc;
    ck_assert_int_gt(total, 1);
    mcd_workspace_free(w);
    ck_assert_int_eq(cnt.live, 0);

    for (k = 1; k <= total; k++) {
        counting c2 = {0, k, 0};
        mcd_workspace *w2 = w0;
        al.ud = &c2;
        ck_assert_int_eq(mcd_workspace_new_with(7, &al, &w2), MCD_ENOMEM);
        ck_assert_ptr_eq(w2, w0);
        ck_assert_int_eq(c2.live, 0); /* nothing leaked */
    }

    /* largest capacity: allocates and reports it */
    ck_assert_int_eq(mcd_workspace_new(MCD_MAX_SPECIES, &w), MCD_OK);
    ck_assert_uint_eq(mcd_workspace_capacity(w), MCD_MAX_SPECIES);
    mcd_workspace_free(w);
}
END_TEST

START_TEST(flux_identities_large_capacity_path_matches_small)
{
    /* N = 40 species present uses the LAPACK Cholesky (the hand-written one
     * stops at 24). The same mixture solved as N species in a larger
     * workspace must satisfy the Maxwell-Stefan equations equally well:
     * residual 1e-12 as in the residual test. */
    mcd_workspace *big;
    int k;
    sup_seed(&rng, 0x5EED000Bu);
    ck_assert_int_eq(mcd_workspace_new(64, &big), MCD_OK);
    for (k = 0; k < 50; k++) {
        enum { NB = 60 };
        static double D[NB * NB], x[NB], g[NB], J[NB], sx;
        size_t i, j;
        long double worst = 0.0L;
        sx = 0.0;
        for (i = 0; i < NB; i++) {
            x[i] = (i % 7 == 3) ? 0.0 : sup_decades(&rng, -6.0, 0.0);
            sx += x[i];
            g[i] = sup_range(&rng, -1.0, 1.0);
        }
        for (i = 0; i < NB; i++)
            x[i] /= sx;
        {
            double m = 0.0;
            for (i = 0; i < NB; i++)
                m += g[i];
            for (i = 0; i < NB; i++)
                g[i] -= m / NB;
        }
        sup_dij_decades(&rng, NB, D, -6.0, -4.0);
        ck_assert_int_eq(
            mcd_flux_compute(big, MCD_MODEL_MAXWELL_STEFAN,
                             &(mcd_state){.n_species = NB,
                                          .n_dim = 1,
                                          .Dij = D,
                                          .c = 30.0,
                                          .comp_basis = MCD_BASIS_MOLE,
                                          .comp = x,
                                          .grad = g},
                             MCD_BASIS_MOLE, J),
            MCD_OK);
        for (i = 0; i < NB; i++) {
            long double r = g[i], sc = fabsl(r);
            for (j = 0; j < NB; j++) {
                long double t1, t2;
                if (j == i)
                    continue;
                t1 = (long double)x[i] * J[j] / (30.0L * D[i * NB + j]);
                t2 = (long double)x[j] * J[i] / (30.0L * D[i * NB + j]);
                r -= t1 - t2;
                sc += fabsl(t1) + fabsl(t2);
            }
            if (fabsl(r) / sc > worst)
                worst = fabsl(r) / sc;
        }
        ck_assert_msg(worst <= 1e-12L, "N=60 residual %Lg", worst);
    }
    mcd_workspace_free(big);
}
END_TEST

/* ------------------------------------------------------------------ */
/* allocation counter (glibc only, not under AddressSanitizer)          */
/* ------------------------------------------------------------------ */

/* The per-state calls must not allocate, LAPACK included (LAPACKE's
 * row-major wrappers and high-level drivers would). On glibc the test
 * executable interposes malloc and friends (SUP_ALLOC_HOOK in support.h),
 * forwarding to the __libc_* entry points, and counts calls made inside a
 * window. A direct malloc inside the window proves that the hook is live
 * (it is not under AddressSanitizer); without a live hook the test only
 * checks that the calls succeed. */
START_TEST(flux_identities_per_state_calls_do_not_allocate)
{
    /* N = 40 takes the LAPACK paths (dpotrf/dpotrs, dgetrf/dgetrs, dgeev)
     * as well as the hand-written ones (N = 5). */
    enum { NB = 40 };
    static double D[NB * NB], x[NB], g[NB * 2], M[NB], F[NB * 2];
    static double Df[(NB - 1) * (NB - 1)], re[NB], im[NB], Dn[NB * NB];
    mcd_workspace *big;
    size_t i, j, nn, ns = 0;
    int pass, live, st[8];
    sup_seed(&rng, 0x5EED000Du);
    ck_assert_int_eq(mcd_workspace_new(NB, &big), MCD_OK);
    for (i = 0; i < NB; i++) {
        x[i] = 1.0 / NB;
        M[i] = sup_range(&rng, 0.002, 0.2);
        g[2 * i] = (i % 2) ? 1.0 : -1.0;
        g[2 * i + 1] = (i % 3 == 0) ? 2.0 : (i % 3 == 1 ? -1.0 : -1.0);
        for (j = i; j < NB; j++)
            D[i * NB + j] = D[j * NB + i] =
                (i == j) ? 0.0 : sup_range(&rng, 1e-5, 1e-4);
    }
    /* Check's assertions allocate (messages to the parent process), so the
     * statuses are collected inside the window and checked after it. */
    for (pass = 0; pass < 2; pass++) { /* pass 0 warms up the BLAS */
        if (pass == 1)
            sup_alloc_open();
        ns = 0;
        for (nn = 5; nn <= NB; nn += NB - 5) {
            double xs[NB], sx = 0.0;
            for (i = 0; i < nn; i++)
                sx += x[i];
            for (i = 0; i < nn; i++)
                xs[i] = x[i] / sx;
            /* the sub-matrix of the first nn species, stride nn */
            for (i = 0; i < nn; i++)
                for (j = 0; j < nn; j++)
                    Dn[i * nn + j] = D[i * NB + j];
            st[ns++] =
                mcd_flux_compute(big, MCD_MODEL_MAXWELL_STEFAN,
                                 &(mcd_state){.n_species = nn,
                                              .n_dim = 2,
                                              .M = M,
                                              .Dij = Dn,
                                              .c = 40.0,
                                              .comp_basis = MCD_BASIS_MASS,
                                              .comp = xs,
                                              .grad = g},
                                 MCD_BASIS_MASS, F);
            st[ns++] =
                mcd_flux_compute(big, MCD_MODEL_MIXTURE_AVERAGED,
                                 &(mcd_state){.n_species = nn,
                                              .n_dim = 2,
                                              .M = M,
                                              .Dij = Dn,
                                              .c = 40.0,
                                              .comp_basis = MCD_BASIS_MOLE,
                                              .comp = xs,
                                              .grad = g},
                                 MCD_BASIS_MASS, F);
            st[ns++] =
                mcd_fick_matrix(big,
                                &(mcd_state){.n_species = nn,
                                             .M = M,
                                             .Dij = Dn,
                                             .comp_basis = MCD_BASIS_MOLE,
                                             .comp = xs},
                                MCD_BASIS_MASS, MCD_DEPENDENT_AUTO, Df, NULL);
            st[ns++] = mcd_fick_eigenvalues(big, nn - 1, Df, re, im);
        }
        if (pass == 1)
            break;
        for (i = 0; i < ns; i++)
            ck_assert_int_eq(st[i], MCD_OK);
    }
    live = sup_alloc_close();
    for (i = 0; i < ns; i++)
        ck_assert_int_eq(st[i], MCD_OK);
    fprintf(stderr,
            "allocation hook %s; allocations in the window: %ld "
            "(the probe included)\n",
            live ? "live" : "not live", (long)sup_alloc_count);
    if (live)
        ck_assert_int_eq(sup_alloc_count, 1); /* the probe only */
    mcd_workspace_free(big);
}
END_TEST

static Suite *flux_suite(void)
{
    Suite *s = suite_create("mcd:flux_identities");
    TCase *tc = tcase_create("identities");
    tcase_add_checked_fixture(tc, setup, teardown);
    tcase_set_timeout(tc, 240);
    tcase_add_test(tc, flux_identities_zero_sum_in_both_bases);
    tcase_add_test(tc, flux_identities_fluxes_satisfy_maxwell_stefan_equations);
    tcase_add_test(tc, flux_identities_onsager_symmetry_of_velocity_map);
    tcase_add_test(tc,
                   flux_identities_equal_diffusivities_give_mixture_averaged);
    tcase_add_test(tc, flux_identities_mixture_averaged_matches_hand_formula);
    tcase_add_test(tc, flux_identities_binary_reduces_to_fick);
    tcase_add_test(tc, flux_identities_trace_species_obey_blanc_law);
    tcase_add_test(tc, flux_identities_pure_component_and_single_species);
    tcase_add_test(tc, flux_identities_permutation_invariance);
    tcase_add_test(tc, flux_identities_mass_and_mole_bases_are_consistent);
    tcase_add_test(tc, flux_identities_gamma_and_pressure_driving_forces);
    tcase_add_test(tc, flux_identities_errors_leave_output_untouched);
    tcase_add_test(tc, flux_identities_large_capacity_path_matches_small);
    suite_add_tcase(s, tc);
    tc = tcase_create("workspace");
    tcase_add_test(tc, flux_identities_workspace_alloc_and_failure_injection);
    tcase_add_test(tc, flux_identities_per_state_calls_do_not_allocate);
    suite_add_tcase(s, tc);
    return s;
}

int main(void) { return sup_run(flux_suite()); }
