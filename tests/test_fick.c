/* test_fick.c - generalized Fick matrices (mcd_fick_matrix), fluxes from
 * them (mcd_fick_fluxes) and their eigenvalues (mcd_fick_eigenvalues).
 *
 * Checks, over random states with a local deterministic PRNG:
 *  - fluxes from [D] (molar frame) and [D°] (mass frame) equal the fluxes
 *    of mcd_flux_compute, for every choice of the dependent species and for
 *    an arbitrary thermodynamic-factor matrix;
 *  - the ternary [D] equals B^-1 Gamma evaluated by hand from the formulas
 *    of Taylor and Krishna (1993), ch. 2 (explicit 2x2 inverse);
 *  - N = 2 gives the binary Fick diffusivity Đ (times Gamma: Darken) in
 *    both frames (Taylor and Krishna 1993, ch. 2-3);
 *  - a trace species has the Blanc row D_tj = delta_tj / sum_k x_k/Đ_tk;
 *  - eigenvalues of [D] for an ideal gas are real and positive and do not
 *    depend on the dependent species or on the frame (the frame change is
 *    a similarity transformation; Taylor and Krishna 1993, ch. 3 and 5);
 *  - eigenvalue sorting on matrices with known spectra; every error path
 *    with outputs left untouched.
 * Tolerances are justified beside each check; the largest errors met are
 * printed to stderr.
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

static sup_rng rng = SUP_RNG(SUP_SPLITMIX64, 0);

typedef struct state {
    size_t n, nd;
    double c, rho;
    double M[NMAX], x[NMAX], w[NMAX];
    double D[NMAX * NMAX];
    double g[NMAX * DMAX];  /* grad x, exact zero sum per direction */
    double gw[NMAX * DMAX]; /* grad w, exact zero sum per direction */
} state;

/* kinds: 0 uniform, 1 log-uniform over 6 decades, 2 with exact zeros */
static void random_state(state *s, size_t n, int allow_zero)
{
    int kind = (int)(sup_next(&rng) % (allow_zero ? 3 : 2));
    double sx = 0.0, sm = 0.0;
    size_t i, d;
    s->n = n;
    s->nd = 1 + (size_t)(sup_next(&rng) % DMAX);
    s->c = sup_decades(&rng, -1.0, 4.0);
    for (i = 0; i < n; i++) {
        s->M[i] = sup_molar_mass(&rng);
        s->x[i] = kind == 0 ? sup_range(&rng, 0.01, 1.0)
                  : kind == 1
                      ? sup_decades(&rng, -6.0, 0.0)
                      : ((sup_next(&rng) % 3 == 0) ? 0.0 : sup_u01(&rng));
        sx += s->x[i];
    }
    if (sx == 0.0) {
        s->x[0] = 1.0;
        sx = 1.0;
    }
    for (i = 0; i < n; i++)
        s->x[i] /= sx;
    sup_dij_decades(&rng, n, s->D, -6.0, -4.0);
    for (i = 0; i < n; i++)
        sm += s->x[i] * s->M[i];
    for (i = 0; i < n; i++)
        s->w[i] = s->x[i] * s->M[i] / sm;
    s->rho = s->c * sm;
    /* gradients with an exactly zero sum: the last row is minus the sum
     * of the others (Fick fluxes ignore the dependent row, so only an
     * exactly consistent set makes the two routes comparable) */
    for (d = 0; d < s->nd; d++) {
        double t = 0.0, tw = 0.0;
        for (i = 0; i + 1 < n; i++) {
            s->g[i * s->nd + d] = sup_range(&rng, -100.0, 100.0);
            s->gw[i * s->nd + d] = sup_range(&rng, -100.0, 100.0);
            t += s->g[i * s->nd + d];
            tw += s->gw[i * s->nd + d];
        }
        s->g[(n - 1) * s->nd + d] = -t;
        s->gw[(n - 1) * s->nd + d] = -tw;
    }
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

/* ------------------------------------------------------------------ */

START_TEST(fick_fluxes_equal_flux_compute_for_any_dependent)
{
    /* J = -c [D] grad x and j = -rho [D°] grad w against mcd_flux_compute
     * (molar: x input; mass: w input, mass output), for every dependent
     * species and MCD_DEPENDENT_AUTO, with Gamma = NULL or an arbitrary
     * matrix. Both routes solve the same equations with different
     * factorisations (LU of the nonsymmetric B versus Cholesky of the
     * scaled symmetric form); the difference is bounded by the
     * conditioning of B with the chosen dependent species (a rare
     * dependent species, down to x = 1e-6 here, makes B less well
     * conditioned). Measured up to ~5e-14 (mass frame, which adds the
     * basis change); 1e-11 relative to the largest flux leaves a margin of
     * ~200. */
    double worst[2] = {0.0, 0.0};
    int k, b;
    sup_seed(&rng, 0xF1C0001u);
    for (k = 0; k < 400; k++) {
        state s;
        double Gam[NMAX * NMAX];
        const double *G = NULL;
        size_t n, dep, i;
        random_state(&s, 2 + (size_t)(sup_next(&rng) % (NMAX - 1)), 1);
        n = s.n;
        if (k % 2) {
            for (i = 0; i < n * n; i++)
                Gam[i] = sup_range(&rng, -0.3, 0.3) +
                         ((i % (n + 1)) == 0 ? 1.0 : 0.0);
            G = Gam;
        }
        for (b = 0; b < 2; b++) {
            double F[NMAX * DMAX];
            const double *comp = b ? s.w : s.x, *grad = b ? s.gw : s.g;
            double conc = b ? s.rho : s.c;
            ck_assert_int_eq(
                mcd_flux_compute(ws, MCD_MODEL_MAXWELL_STEFAN,
                                 &(mcd_state){.n_species = n,
                                              .n_dim = s.nd,
                                              .M = s.M,
                                              .Dij = s.D,
                                              .c = s.c,
                                              .comp_basis = (mcd_basis)b,
                                              .comp = comp,
                                              .grad = grad,
                                              .Gamma = G},
                                 (mcd_basis)b, F),
                MCD_OK);
            for (dep = 0; dep <= n; dep++) {
                double Df[(NMAX - 1) * (NMAX - 1)], Ff[NMAX * DMAX], e;
                size_t want = dep == n ? MCD_DEPENDENT_AUTO : dep, used = 999;
                mcd_status st =
                    mcd_fick_matrix(ws,
                                    &(mcd_state){.n_species = n,
                                                 .M = s.M,
                                                 .Dij = s.D,
                                                 .comp_basis = (mcd_basis)b,
                                                 .comp = comp,
                                                 .Gamma = G},
                                    (mcd_basis)b, want, Df, &used);
                ck_assert_msg(st == MCD_OK, "fick_matrix N=%zu dep %zu: %d %s",
                              n, dep, (int)st, mcd_last_error());
                if (dep < n)
                    ck_assert_uint_eq(used, dep);
                else
                    for (i = 0; i < n; i++)
                        ck_assert(s.x[i] <= s.x[used]);
                ck_assert_int_eq(
                    mcd_fick_fluxes(n, s.nd, Df, used, conc, grad, Ff), MCD_OK);
                e = sup_rel_diff(Ff, F, n * s.nd);
                if (e > worst[b])
                    worst[b] = e;
                ck_assert_msg(e <= 1e-11, "N=%zu basis %d dep %zu: %g", n, b,
                              used, e);
            }
        }
    }
    fprintf(stderr, "fick vs flux_compute: molar %.3g, mass %.3g\n", worst[0],
            worst[1]);
}
END_TEST

START_TEST(fick_ternary_matrix_matches_hand_formula)
{
    /* [D] = B^-1 Gr for N = 3 with dependent species 2, evaluated here
     * directly from B_ii = x_i/Đ_i3 + sum_{k != i} x_k/Đ_ik, B_ij =
     * -x_i (1/Đ_ij - 1/Đ_i3), Gr_ij = Gamma_ij - Gamma_i3 (Gamma with equal
     * column sums, for which the library's projection is the identity) and
     * the explicit 2x2 inverse. Tolerance 1e-12 relative to max |D|: a few
     * dozen roundings. */
    int k;
    sup_seed(&rng, 0xF1C0002u);
    for (k = 0; k < 2000; k++) {
        state s;
        double G[9], B[4], Gr[4], ref[4], Df[4], det;
        size_t i, j, q;
        random_state(&s, 3, 1);
        if (s.x[2] == 0.0)
            continue;
        for (i = 0; i < 9; i++)
            G[i] = sup_range(&rng, -0.3, 0.3) + ((i % 4) == 0 ? 1.0 : 0.0);
        for (j = 0; j < 3; j++)
            G[6 + j] = 1.0 - G[j] - G[3 + j];
        for (i = 0; i < 2; i++)
            for (j = 0; j < 2; j++) {
                if (i == j) {
                    double t = s.x[i] / s.D[i * 3 + 2];
                    for (q = 0; q < 3; q++)
                        if (q != i)
                            t += s.x[q] / s.D[i * 3 + q];
                    B[i * 2 + j] = t;
                } else {
                    B[i * 2 + j] =
                        -s.x[i] * (1.0 / s.D[i * 3 + j] - 1.0 / s.D[i * 3 + 2]);
                }
                Gr[i * 2 + j] = G[i * 3 + j] - G[i * 3 + 2];
            }
        det = B[0] * B[3] - B[1] * B[2];
        ref[0] = (B[3] * Gr[0] - B[1] * Gr[2]) / det;
        ref[1] = (B[3] * Gr[1] - B[1] * Gr[3]) / det;
        ref[2] = (-B[2] * Gr[0] + B[0] * Gr[2]) / det;
        ref[3] = (-B[2] * Gr[1] + B[0] * Gr[3]) / det;
        ck_assert_int_eq(
            mcd_fick_matrix(ws,
                            &(mcd_state){.n_species = 3,
                                         .M = s.M,
                                         .Dij = s.D,
                                         .comp_basis = MCD_BASIS_MOLE,
                                         .comp = s.x,
                                         .Gamma = G},
                            MCD_BASIS_MOLE, 2, Df, NULL),
            MCD_OK);
        ck_assert_msg(sup_rel_diff(Df, ref, 4) <= 1e-12, "ternary %g",
                      sup_rel_diff(Df, ref, 4));
    }
}
END_TEST

START_TEST(fick_binary_is_fick_diffusivity_in_both_frames)
{
    /* N = 2: [D] = [D°] = Đ_12 (ideal), = Đ_12 G with Gamma = G I (Darken;
     * Taylor and Krishna 1993, ch. 2, from memory). 1e-13 relative. */
    int k, b;
    sup_seed(&rng, 0xF1C0003u);
    for (k = 0; k < 1000; k++) {
        state s;
        double Gb = sup_range(&rng, 0.2, 3.0), G[4], Df = SUP_GUARD;
        size_t used = 9;
        random_state(&s, 2, 0);
        G[0] = Gb;
        G[1] = 0.0;
        G[2] = 0.0;
        G[3] = Gb;
        for (b = 0; b < 2; b++) {
            ck_assert_int_eq(
                mcd_fick_matrix(ws,
                                &(mcd_state){.n_species = 2,
                                             .M = s.M,
                                             .Dij = s.D,
                                             .comp_basis = MCD_BASIS_MOLE,
                                             .comp = s.x},
                                (mcd_basis)b, MCD_DEPENDENT_AUTO, &Df, &used),
                MCD_OK);
            ck_assert(fabs(Df - s.D[1]) <= 1e-13 * s.D[1]);
            ck_assert_uint_eq(used, s.x[1] > s.x[0] ? 1u : 0u);
            ck_assert_int_eq(
                mcd_fick_matrix(ws,
                                &(mcd_state){.n_species = 2,
                                             .M = s.M,
                                             .Dij = s.D,
                                             .comp_basis = MCD_BASIS_MOLE,
                                             .comp = s.x,
                                             .Gamma = G},
                                (mcd_basis)b, 0, &Df, &used),
                MCD_OK);
            ck_assert(fabs(Df - s.D[1] * Gb) <= 1e-13 * s.D[1] * Gb);
        }
    }
}
END_TEST

START_TEST(fick_trace_species_row_is_blanc)
{
    /* A trace species t (x_t = 0) has B_tj = 0 off the diagonal, so its row
     * of [D] is delta_tj / sum_k x_k/Đ_tk (Blanc). 1e-13 relative to the
     * Blanc value; off-diagonal entries vanish up to the round-off of the
     * pivoted LU (which may mix the trace row with others): 1e-13 of
     * max |D|. */
    int k;
    sup_seed(&rng, 0xF1C0004u);
    for (k = 0; k < 1000; k++) {
        state s;
        double Df[(NMAX - 1) * (NMAX - 1)];
        size_t n, t, used, r, q;
        random_state(&s, 3 + (size_t)(sup_next(&rng) % (NMAX - 2)), 0);
        n = s.n;
        t = (size_t)(sup_next(&rng) % n);
        {
            double rr = 1.0 - s.x[t];
            if (rr <= 0.0)
                continue;
            s.x[t] = 0.0;
            for (r = 0; r < n; r++)
                s.x[r] /= rr;
        }
        ck_assert_int_eq(
            mcd_fick_matrix(ws,
                            &(mcd_state){.n_species = n,
                                         .M = s.M,
                                         .Dij = s.D,
                                         .comp_basis = MCD_BASIS_MOLE,
                                         .comp = s.x},
                            MCD_BASIS_MOLE, MCD_DEPENDENT_AUTO, Df, &used),
            MCD_OK);
        ck_assert_uint_ne(used, t);
        r = t < used ? t : t - 1;
        for (q = 0; q < n - 1; q++) {
            if (q == r) {
                double S = 0.0, sx = 0.0, ref;
                size_t j;
                for (j = 0; j < n; j++) {
                    sx += s.x[j];
                    if (j != t)
                        S += s.x[j] / s.D[t * n + j];
                }
                ref = sx / S;
                ck_assert(fabs(Df[r * (n - 1) + q] - ref) <= 1e-13 * ref);
            } else {
                ck_assert_msg(fabs(Df[r * (n - 1) + q]) <=
                                  1e-13 * sup_max_abs(Df, (n - 1) * (n - 1)),
                              "off-diagonal %g", Df[r * (n - 1) + q]);
            }
        }
    }
}
END_TEST

static int cmp_dbl(const void *a, const void *b)
{
    double x = *(const double *)a, y = *(const double *)b;
    return (x < y) - (x > y);
}

START_TEST(fick_eigenvalues_real_positive_and_invariant)
{
    /* Ideal gas: [D] is similar to a symmetric positive definite matrix, so
     * its eigenvalues are real and positive; they do not depend on the
     * dependent species nor on the frame (similarity). dgeev returns them
     * with backward error ~ eps ||D||; for a nonsymmetric matrix the
     * forward error of each eigenvalue is that times its condition number,
     * so eigenvalues are compared at 1e-9 relative to the largest (measured
     * ~3e-13) and the
     * imaginary parts must be below 1e-8 of it (a near-degenerate pair may
     * come out as a complex pair with a tiny imaginary part). */
    double worst = 0.0;
    int k, b;
    sup_seed(&rng, 0xF1C0005u);
    for (k = 0; k < 300; k++) {
        state s;
        double ref[NMAX], re[NMAX], im[NMAX], Df[(NMAX - 1) * (NMAX - 1)];
        size_t n, m, dep, i, have = 0;
        random_state(&s, 2 + (size_t)(sup_next(&rng) % (NMAX - 1)), 0);
        n = s.n;
        m = n - 1;
        for (b = 0; b < 2; b++)
            for (dep = 0; dep < n; dep += 1 + (size_t)(sup_next(&rng) % 3)) {
                double e = 0.0;
                ck_assert_int_eq(
                    mcd_fick_matrix(ws,
                                    &(mcd_state){.n_species = n,
                                                 .M = s.M,
                                                 .Dij = s.D,
                                                 .comp_basis = MCD_BASIS_MOLE,
                                                 .comp = s.x},
                                    (mcd_basis)b, dep, Df, NULL),
                    MCD_OK);
                ck_assert_int_eq(mcd_fick_eigenvalues(ws, m, Df, re, im),
                                 MCD_OK);
                for (i = 0; i + 1 < m; i++)
                    ck_assert(re[i] >= re[i + 1]);
                for (i = 0; i < m; i++) {
                    ck_assert_msg(re[i] > 0.0, "eigenvalue %g", re[i]);
                    ck_assert(fabs(im[i]) <= 1e-8 * re[0]);
                }
                /* compare as sorted real parts */
                qsort(re, m, sizeof(double), cmp_dbl);
                if (!have) {
                    memcpy(ref, re, m * sizeof(double));
                    have = 1;
                    continue;
                }
                for (i = 0; i < m; i++)
                    if (fabs(re[i] - ref[i]) / ref[0] > e)
                        e = fabs(re[i] - ref[i]) / ref[0];
                if (e > worst)
                    worst = e;
                ck_assert_msg(e <= 1e-9, "N=%zu basis %d dep %zu: %g", n, b,
                              dep, e);
            }
    }
    fprintf(stderr, "eigenvalues: largest relative spread %.3g\n", worst);
}
END_TEST

START_TEST(fick_eigenvalues_known_spectra_and_sorting)
{
    double rot[4] = {0.0, -1.0, 1.0, 0.0};
    double tri[9] = {3.0, 1.0, 2.0, 0.0, 5.0, 1.0, 0.0, 0.0, 1.0};
    double re[3], im[3];
    /* rotation: +-i, positive imaginary part first (tolerance: dgeev on a
     * 2x2 standard-form block is exact to a few eps) */
    ck_assert_int_eq(mcd_fick_eigenvalues(ws, 2, rot, re, im), MCD_OK);
    ck_assert(fabs(re[0]) < 1e-15 && fabs(re[1]) < 1e-15);
    ck_assert(fabs(im[0] - 1.0) < 1e-15 && fabs(im[1] + 1.0) < 1e-15);
    /* triangular: the diagonal, sorted decreasing */
    ck_assert_int_eq(mcd_fick_eigenvalues(ws, 3, tri, re, im), MCD_OK);
    ck_assert(fabs(re[0] - 5.0) < 1e-14 && fabs(re[1] - 3.0) < 1e-14 &&
              fabs(re[2] - 1.0) < 1e-14);
    ck_assert(im[0] == 0.0 && im[1] == 0.0 && im[2] == 0.0);
    /* m = 0 is a no-op */
    re[0] = SUP_GUARD;
    ck_assert_int_eq(mcd_fick_eigenvalues(ws, 0, NULL, re, im), MCD_OK);
    ck_assert(re[0] == SUP_GUARD);
}
END_TEST

/* Finite entries whose eigenvalues overflow (found by fuzz_flux: an
 * eigenvalue of inf came back with MCD_OK): EDOM, outputs untouched. The
 * matrix [[a, a], [a, a]] with a = 1.5e308 has the eigenvalues 0 and
 * 2a > DBL_MAX; a triangular one keeps its (finite) diagonal. */
START_TEST(fick_eigenvalues_that_overflow_are_an_error)
{
    const double a = 1.5e308;
    const double over[4] = {a, a, a, a}, tri[4] = {a, 0.0, a, -a};
    double re[2], im[2];
    mcd_workspace *w;
    ck_assert_int_eq(mcd_workspace_new(3, &w), MCD_OK);
    sup_guard_fill(re, 2);
    sup_guard_fill(im, 2);
    ck_assert_int_eq(mcd_fick_eigenvalues(w, 2, over, re, im), MCD_EDOM);
    ck_assert(sup_guard_intact(re, 2) && sup_guard_intact(im, 2));
    ck_assert_ptr_nonnull(strstr(mcd_last_error(), "not finite"));
    ck_assert_int_eq(mcd_fick_eigenvalues(w, 2, tri, re, im), MCD_OK);
    ck_assert(re[0] == a && re[1] == -a && im[0] == 0.0 && im[1] == 0.0);
    mcd_workspace_free(w);
}
END_TEST

/* mcd_fick_matrix with the state's fields as arguments (table rows below). */
static mcd_status fick_args(mcd_workspace *w, size_t n, const double *M,
                            const double *D, mcd_basis cb, const double *x,
                            const double *G, mcd_basis basis, size_t dep,
                            double *out, size_t *out_dep)
{
    mcd_state s = {0};
    s.n_species = n;
    s.M = M;
    s.Dij = D;
    s.comp_basis = cb;
    s.comp = x;
    s.Gamma = G;
    return mcd_fick_matrix(w, &s, basis, dep, out, out_dep);
}

START_TEST(fick_errors_leave_outputs_untouched)
{
    enum { N = 3 };
    double M[N] = {0.002, 0.028, 0.044};
    double D[N * N] = {0, 7.8e-5, 6.8e-5, 7.8e-5, 0, 1.7e-5, 6.8e-5, 1.7e-5, 0};
    double x[N] = {0.2, 0.3, 0.5}, bad[N * N];
    double out[4], re[2], im[2], F[N * 2];
    double g[N * 2] = {1, 2, -3, 0, 2, -2};
    size_t dep = 777;
    mcd_workspace *small;

#define GUARDS()                                                               \
    do {                                                                       \
        sup_guard_fill(out, 4);                                                \
        sup_guard_fill(re, 2);                                                 \
        sup_guard_fill(im, 2);                                                 \
        sup_guard_fill(F, N * 2);                                              \
        dep = 777;                                                             \
    } while (0)
#define INTACT()                                                               \
    do {                                                                       \
        ck_assert(sup_guard_intact(out, 4));                                   \
        ck_assert(sup_guard_intact(re, 2) && sup_guard_intact(im, 2));         \
        ck_assert(sup_guard_intact(F, N * 2));                                 \
        ck_assert_uint_eq(dep, 777);                                           \
    } while (0)
#define FM(code, arg, ...)                                                     \
    do {                                                                       \
        GUARDS();                                                              \
        ck_assert_int_eq(fick_args(__VA_ARGS__), code);                        \
        INTACT();                                                              \
        {                                                                      \
            const char *a_ = (arg);                                            \
            if (a_ != NULL)                                                    \
                ck_assert_msg(strstr(mcd_last_error(), a_) != NULL,            \
                              "'%s' lacks '%s'", mcd_last_error(), a_);        \
        }                                                                      \
    } while (0)

    FM(MCD_EINVAL, NULL, NULL, N, M, D, 0, x, NULL, 0, MCD_DEPENDENT_AUTO, out,
       &dep);
    FM(MCD_EINVAL, "n_species", ws, 0, M, D, 0, x, NULL, 0, MCD_DEPENDENT_AUTO,
       out, &dep);
    FM(MCD_EBADLEN, "n_species", ws, NMAX + 1, M, D, 0, x, NULL, 0,
       MCD_DEPENDENT_AUTO, out, &dep);
    FM(MCD_EINVAL, "comp_basis", ws, N, M, D, (mcd_basis)3, x, NULL, 0,
       MCD_DEPENDENT_AUTO, out, &dep);
    FM(MCD_EINVAL, "basis", ws, N, M, D, 0, x, NULL, (mcd_basis)3,
       MCD_DEPENDENT_AUTO, out, &dep);
    FM(MCD_EINVAL, "dependent", ws, N, M, D, 0, x, NULL, 0, 3, out, &dep);
    FM(MCD_EINVAL, "out_D", ws, N, M, D, 0, x, NULL, 0, 0, NULL, &dep);
    FM(MCD_EINVAL, "M", ws, N, NULL, D, 0, x, NULL, 1, 0, out, &dep);
    FM(MCD_EINVAL, "M", ws, N, NULL, D, 1, x, NULL, 0, 0, out, &dep);
    FM(MCD_EINVAL, "Dij", ws, N, M, NULL, 0, x, NULL, 0, 0, out, &dep);
    memcpy(bad, D, sizeof(bad));
    bad[5] = -2e-5;
    FM(MCD_EDOM, "argument Dij: entry (1,2)", ws, N, M, bad, 0, x, NULL, 0, 0,
       out, &dep);
    bad[5] = 1.7e-5 * (1.0 + 1e-10);
    FM(MCD_EDOM, "symmetric", ws, N, M, bad, 0, x, NULL, 0, 0, out, &dep);
    bad[5] = SUP_NAN;
    FM(MCD_EINVAL, "Dij", ws, N, M, bad, 0, x, NULL, 0, 0, out, &dep);
    /* subnormal Đ: outside the domain (1/Đ overflows), EDOM, nothing
     * written */
    memcpy(bad, D, sizeof(bad));
    bad[1] = bad[3] = 1e-310;
    FM(MCD_EDOM, "subnormal", ws, N, M, bad, 0, x, NULL, 0, 2, out, &dep);
    {
        double xs[N] = {0.2, 0.3, 0.51}, xn[N] = {-0.2, 0.7, 0.5};
        double Gn[N * N] = {1, 0, 0, 0, 1, 0, 0, SUP_NAN, 1};
        FM(MCD_EDOM, "argument comp: sum", ws, N, M, D, 0, xs, NULL, 0, 0, out,
           &dep);
        FM(MCD_EDOM, "argument comp: entry 0", ws, N, M, D, 1, xn, NULL, 0, 0,
           out, &dep);
        FM(MCD_EINVAL, "comp", ws, N, M, D, 0, NULL, NULL, 0, 0, out, &dep);
        FM(MCD_EINVAL, "Gamma", ws, N, M, D, 0, x, Gn, 0, 0, out, &dep);
    }
    ck_assert_int_eq(mcd_workspace_new(2, &small), MCD_OK);
    GUARDS();
    ck_assert_int_eq(
        mcd_fick_matrix(
            small,
            &(mcd_state){
                .n_species = N, .M = M, .Dij = D, .comp_basis = 0, .comp = x},
            0, 0, out, &dep),
        MCD_EBADLEN);
    INTACT();
    /* eigenvalues: m above capacity - 1, NULL, NaN */
    GUARDS();
    ck_assert_int_eq(mcd_fick_eigenvalues(small, 2, out, re, im), MCD_EBADLEN);
    INTACT();
    ck_assert(strstr(mcd_last_error(), "argument order") != NULL);
    mcd_workspace_free(small);
    GUARDS();
    ck_assert_int_eq(mcd_fick_eigenvalues(NULL, 2, out, re, im), MCD_EINVAL);
    ck_assert_int_eq(mcd_fick_eigenvalues(ws, 2, NULL, re, im), MCD_EINVAL);
    ck_assert_int_eq(mcd_fick_eigenvalues(ws, 2, out, NULL, im), MCD_EINVAL);
    ck_assert_int_eq(mcd_fick_eigenvalues(ws, 2, out, re, NULL), MCD_EINVAL);
    out[2] = SUP_NAN;
    ck_assert_int_eq(mcd_fick_eigenvalues(ws, 2, out, re, im), MCD_EINVAL);
    out[2] = SUP_GUARD;
    INTACT();

    /* fick_fluxes */
    GUARDS();
    {
        double Dm[4] = {1e-5, 0.0, 0.0, 2e-5},
               Dn[4] = {1e-5, SUP_NAN, 0.0, 2e-5};
        ck_assert_int_eq(mcd_fick_fluxes(0, 2, Dm, 0, 40.0, g, F), MCD_EINVAL);
        ck_assert_int_eq(mcd_fick_fluxes(N, 0, Dm, 0, 40.0, g, F), MCD_EINVAL);
        ck_assert_int_eq(mcd_fick_fluxes(N, 4, Dm, 0, 40.0, g, F), MCD_EINVAL);
        ck_assert_int_eq(mcd_fick_fluxes(N, 2, Dm, N, 40.0, g, F), MCD_EINVAL);
        ck_assert_int_eq(
            mcd_fick_fluxes(N, 2, Dm, MCD_DEPENDENT_AUTO, 40.0, g, F),
            MCD_EINVAL);
        ck_assert_int_eq(mcd_fick_fluxes(N, 2, NULL, 0, 40.0, g, F),
                         MCD_EINVAL);
        ck_assert_int_eq(mcd_fick_fluxes(N, 2, Dm, 0, 40.0, NULL, F),
                         MCD_EINVAL);
        ck_assert_int_eq(mcd_fick_fluxes(N, 2, Dm, 0, 40.0, g, NULL),
                         MCD_EINVAL);
        ck_assert_int_eq(mcd_fick_fluxes(N, 2, Dm, 0, 0.0, g, F), MCD_EDOM);
        ck_assert_int_eq(mcd_fick_fluxes(N, 2, Dm, 0, -1.0, g, F), MCD_EDOM);
        ck_assert_int_eq(mcd_fick_fluxes(N, 2, Dm, 0, SUP_NAN, g, F),
                         MCD_EINVAL);
        ck_assert_int_eq(mcd_fick_fluxes(N, 2, Dn, 0, 40.0, g, F), MCD_EINVAL);
        g[3] = SUP_NAN; /* species 1: not the dependent one */
        ck_assert_int_eq(mcd_fick_fluxes(N, 2, Dm, 0, 40.0, g, F), MCD_EINVAL);
        INTACT();
        /* the dependent row of grad is ignored, even if not finite */
        g[3] = 0.0;
        g[0] = SUP_NAN;
        ck_assert_int_eq(mcd_fick_fluxes(N, 2, Dm, 0, 40.0, g, F), MCD_OK);
        /* species 1: -40 (1e-5 * 0 + 0 * 2) ... direction 0: grad x_1 = -3,
         * grad x_2 = 2 -> F_1 = -40 * 1e-5 * (-3), F_2 = -40 * 2e-5 * 2 */
        ck_assert(fabs(F[2] - 1.2e-3) < 1e-18 && fabs(F[4] + 1.6e-3) < 1e-18);
        ck_assert(fabs(F[0] + F[2] + F[4]) < 1e-18);
    }
    /* N = 1: nothing written by fick_matrix; fick_fluxes gives zero */
    {
        double one = 1.0, M1 = 0.028, D1 = 0.0, F1[2] = {SUP_GUARD, SUP_GUARD};
        double g1[2] = {0.5, 0.5};
        out[0] = SUP_GUARD;
        dep = 777;
        ck_assert_int_eq(mcd_fick_matrix(ws,
                                         &(mcd_state){.n_species = 1,
                                                      .M = &M1,
                                                      .Dij = &D1,
                                                      .comp_basis = 0,
                                                      .comp = &one},
                                         1, MCD_DEPENDENT_AUTO, out, &dep),
                         MCD_OK);
        ck_assert(out[0] == SUP_GUARD);
        ck_assert_uint_eq(dep, 0);
        ck_assert_int_eq(mcd_fick_fluxes(1, 2, NULL, 0, 40.0, g1, F1), MCD_OK);
        ck_assert(F1[0] == 0.0 && F1[1] == 0.0);
    }
#undef FM
#undef GUARDS
#undef INTACT
}
END_TEST

static Suite *fick_suite(void)
{
    Suite *s = suite_create("mcd:fick");
    TCase *tc = tcase_create("fick");
    tcase_add_checked_fixture(tc, setup, teardown);
    tcase_set_timeout(tc, 240);
    tcase_add_test(tc, fick_fluxes_equal_flux_compute_for_any_dependent);
    tcase_add_test(tc, fick_ternary_matrix_matches_hand_formula);
    tcase_add_test(tc, fick_binary_is_fick_diffusivity_in_both_frames);
    tcase_add_test(tc, fick_trace_species_row_is_blanc);
    tcase_add_test(tc, fick_eigenvalues_real_positive_and_invariant);
    tcase_add_test(tc, fick_eigenvalues_known_spectra_and_sorting);
    tcase_add_test(tc, fick_eigenvalues_that_overflow_are_an_error);
    tcase_add_test(tc, fick_errors_leave_outputs_untouched);
    suite_add_tcase(s, tc);
    return s;
}

int main(void) { return sup_run(fick_suite()); }
