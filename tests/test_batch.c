/* test_batch.c - batched flux calls (mcd_flux_batch, mcd_flux_batch_dij,
 * mcd_flux_batch_aos) against the single-state mcd_flux_compute.
 *
 * The batched kernels solve the same equations with a different
 * factorisation (LDL^T vectorised across cells instead of a per-state
 * Cholesky) and different rounding (fused multiply-adds, reciprocal
 * products), so the check is agreement to 1e-12 relative to the largest
 * flux of each cell, over random states: N = 1..30 and 100, every model
 * and basis pair, with and without pressure diffusion, trace species
 * (x_i = 0 exactly), near-trace species, pure components, and cell counts
 * that are not multiples of the vector width (0, 1, 7, 8, 9, 37).
 * The reference is the library's own single-state path, itself checked
 * against published data and identities in the other suites (Taylor and
 * Krishna 1993, ch. 2, for the Maxwell-Stefan equations). Two tests have
 * other references, marked in their comments: the iterative model on
 * power-law mixtures against the exact batched model (identity), and
 * overflowing cells reported as errors (common practice).
 */
#include <check.h>
#include <math.h>
#include <stdint.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

#include "mcdiff.h"
#include "support.h"

static sup_rng rng = SUP_RNG(SUP_SPLITMIX64, 0);

/* SoA arrays of K cells of N species. */
typedef struct cells {
    size_t n, K, nd;
    double *M, *D, *c, *comp, *grad, *glnP, *T, *P;
} cells;

static void *xmalloc(size_t b)
{
    void *p = malloc(b > 0 ? b : 1);
    ck_assert_ptr_nonnull(p);
    return p;
}

static void cells_free(cells *s)
{
    free(s->M);
    free(s->D);
    free(s->c);
    free(s->comp);
    free(s->grad);
    free(s->glnP);
    free(s->T);
    free(s->P);
}

/* Random fractions of one cell into y (stride K). kind: 0 uniform, 1
 * near-trace (8 decades), 2 exact zeros, 3 pure component. */
static void random_fracs(double *y, size_t n, size_t K, size_t k, int kind)
{
    double s = 0.0;
    size_t i, p = (size_t)(sup_next(&rng) % n);
    for (i = 0; i < n; i++) {
        double v;
        switch (kind) {
        case 0: v = sup_range(&rng, 0.01, 1.0); break;
        case 1: v = sup_decades(&rng, -8.0, 0.0); break;
        case 2:
            v = (sup_next(&rng) % 3 == 0 && i != p) ? 0.0
                                                    : sup_u01(&rng) + 1e-3;
            break;
        default: v = i == p ? 1.0 : 0.0; break;
        }
        y[i * K + k] = v;
        s += v;
    }
    for (i = 0; i < n; i++)
        y[i * K + k] /= s;
}

static void cells_make(cells *s, size_t n, size_t K, size_t nd)
{
    size_t i, j, k;
    s->n = n;
    s->K = K;
    s->nd = nd;
    s->M = xmalloc(n * sizeof(double));
    s->D = xmalloc(n * n * K * sizeof(double));
    s->c = xmalloc(K * sizeof(double));
    s->comp = xmalloc(n * K * sizeof(double));
    s->grad = xmalloc(n * nd * K * sizeof(double));
    s->glnP = xmalloc(nd * K * sizeof(double));
    s->T = xmalloc(K * sizeof(double));
    s->P = xmalloc(K * sizeof(double));
    for (i = 0; i < n; i++)
        s->M[i] = sup_molar_mass(&rng);
    for (k = 0; k < K; k++) {
        int kind = (int)(sup_next(&rng) % 4);
        if (kind == 3 && sup_next(&rng) % 3 != 0)
            kind = 2; /* pure components less often */
        s->c[k] = sup_decades(&rng, -1.0, 4.0);
        s->T[k] = sup_range(&rng, 250.0, 1500.0);
        s->P[k] = sup_range(&rng, 2e4, 5e5);
        random_fracs(s->comp, n, K, k, kind);
        for (i = 0; i < n * nd; i++)
            s->grad[i * K + k] = sup_range(&rng, -1.0, 1.0);
        for (i = 0; i < nd; i++)
            s->glnP[i * K + k] = sup_range(&rng, -2.0, 2.0);
        for (i = 0; i < n; i++) {
            s->D[(i * n + i) * K + k] = 0.0;
            for (j = i + 1; j < n; j++)
                s->D[(i * n + j) * K + k] = s->D[(j * n + i) * K + k] =
                    5e-6 * pow(20.0, sup_u01(&rng));
        }
    }
}

/* The same cells as arrays of structures (cell after cell) for
 * mcd_flux_batch_aos; al (the ln P gradients) may be NULL. */
static void cells_to_aos(const cells *s, double *ac, double *ag, double *al)
{
    size_t n = s->n, K = s->K, nd = s->nd, i, k;
    for (k = 0; k < K; k++) {
        for (i = 0; i < n; i++)
            ac[k * n + i] = s->comp[i * K + k];
        for (i = 0; i < n * nd; i++)
            ag[k * n * nd + i] = s->grad[i * K + k];
        if (al != NULL)
            for (i = 0; i < nd; i++)
                al[k * nd + i] = s->glnP[i * K + k];
    }
}

/* Gather cell k into single-state arrays. */
static void cell_get(const cells *s, size_t k, double *D, double *y, double *g,
                     double *gl)
{
    size_t n = s->n, K = s->K, i;
    for (i = 0; i < n * n; i++)
        D[i] = s->D[i * K + k];
    for (i = 0; i < n; i++)
        y[i] = s->comp[i * K + k];
    for (i = 0; i < n * s->nd; i++)
        g[i] = s->grad[i * K + k];
    for (i = 0; i < s->nd; i++)
        gl[i] = s->glnP[i * K + k];
}

/* Largest relative difference of cell k of a batched output against a
 * single-state flux F (relative to the cell's largest |F|). */
static double cell_rel(const double *out, size_t K, size_t k, const double *F,
                       size_t m)
{
    double sc = 0.0, e = 0.0;
    size_t i;
    for (i = 0; i < m; i++) {
        if (fabs(F[i]) > sc)
            sc = fabs(F[i]);
        if (fabs(out[i * K + k] - F[i]) > e)
            e = fabs(out[i * K + k] - F[i]);
    }
    return sc > 0.0 ? e / sc : e;
}

static double worst_dij, worst_mix;

/* The batched call (exact, mole basis, SoA) on all cells of s. */
static mcd_status batch_cells(mcd_workspace *ws, const cells *s, double *out)
{
    return mcd_flux_batch_dij(ws, MCD_MODEL_MAXWELL_STEFAN, s->n, NULL, s->D,
                              s->c,
                              &(mcd_cells){.n_cells = s->K,
                                           .n_dim = s->nd,
                                           .comp_basis = MCD_BASIS_MOLE,
                                           .comp = s->comp,
                                           .grad = s->grad},
                              MCD_BASIS_MOLE, out);
}

/* The single-state call (exact, mole basis) on cell k of s, gathered into
 * D (N N), x (N), g (N nd); with `upper` the lower triangle of D is the
 * upper one mirrored, as MCD_DIJ_READ_UPPER reads it. Fluxes into out. */
static mcd_status single_cell(mcd_workspace *ws, const cells *s, size_t k,
                              int upper, double *D, double *x, double *g,
                              double *out)
{
    const size_t N = s->n, K = s->K, ND = s->nd;
    size_t i, j, q;
    for (q = 0; q < N * N; q++)
        D[q] = s->D[q * K + k];
    for (i = 0; upper && i < N; i++)
        for (j = 0; j < i; j++)
            D[i * N + j] = D[j * N + i];
    for (q = 0; q < N; q++)
        x[q] = s->comp[q * K + k];
    for (q = 0; q < N * ND; q++)
        g[q] = s->grad[q * K + k];
    return mcd_flux_compute(ws, MCD_MODEL_MAXWELL_STEFAN,
                            &(mcd_state){.n_species = N,
                                         .n_dim = ND,
                                         .Dij = D,
                                         .c = s->c[k],
                                         .comp_basis = MCD_BASIS_MOLE,
                                         .comp = x,
                                         .grad = g},
                            MCD_BASIS_MOLE, out);
}

/* A set of N-species cells with the buffers to run the batched call on
 * all of them (out) and the single-state call on one (Dc, xc, gc, oc),
 * and a workspace for both. */
typedef struct cellset {
    cells s;
    double *out, *Dc, *xc, *gc, *oc;
    mcd_workspace *ws;
} cellset;

static void cellset_make(cellset *c, size_t N, size_t K, size_t ND,
                         uint64_t seed)
{
    sup_seed(&rng, seed);
    c->out = xmalloc(N * ND * K * sizeof(double));
    c->Dc = xmalloc(N * N * sizeof(double));
    c->xc = xmalloc(N * sizeof(double));
    c->gc = xmalloc(N * ND * sizeof(double));
    c->oc = xmalloc(N * ND * sizeof(double));
    ck_assert_int_eq(mcd_workspace_new(N, &c->ws), MCD_OK);
    cells_make(&c->s, N, K, ND);
}

static void cellset_free(cellset *c)
{
    cells_free(&c->s);
    free(c->out), free(c->Dc), free(c->xc), free(c->gc), free(c->oc);
    mcd_workspace_free(c->ws);
}

START_TEST(batch_dij_matches_single_state_calls)
{
    static const size_t Ns[] = {1,  2,  3,  4,  5,  6,  7,  8,  9,  10,
                                12, 15, 16, 17, 20, 24, 25, 29, 30, 100};
    static const size_t Ks[] = {0, 1, 7, 8, 9, 37};
    size_t ni, n, K, k, cfg;
    mcd_workspace *ws;
    sup_seed(&rng, 0xBA7C4001ull + (uint64_t)_i);
    ck_assert_int_eq(mcd_workspace_new(100, &ws), MCD_OK);
    for (ni = (size_t)_i; ni < sizeof Ns / sizeof Ns[0]; ni += 4) {
        n = Ns[ni];
        for (cfg = 0; cfg < 24; cfg++) {
            mcd_model model = cfg % 3 == 0   ? MCD_MODEL_MAXWELL_STEFAN
                              : cfg % 3 == 1 ? MCD_MODEL_MIXTURE_AVERAGED
                                             : MCD_MODEL_ITERATIVE;
            mcd_basis cb = (cfg / 3) % 2 ? MCD_BASIS_MASS : MCD_BASIS_MOLE;
            mcd_basis fb = (cfg / 6) % 2 ? MCD_BASIS_MASS : MCD_BASIS_MOLE;
            int use_p = (cfg / 12) % 2;
            /* every n_dim with every model (the exact model's
             * constant-n solves are separate code per n_dim,
             * kernel_ldl.h) */
            size_t nd = 1 + (cfg + cfg / 3) % 3;
            cells s;
            double *out;
            K = Ks[(cfg + ni) % 6];
            if (n == 100 && K > 9)
                K = 9; /* keep the reference calls affordable */
            cells_make(&s, n, K, nd);
            out = xmalloc(n * nd * (K + 1) * sizeof(double));
            sup_guard_fill(out, n * nd * (K + 1));
            if (model == MCD_MODEL_ITERATIVE)
                ck_assert_int_eq(mcd_workspace_set_iterative(ws, 1000, 0.0),
                                 MCD_OK);
            ck_assert_msg(mcd_flux_batch_dij(
                              ws, model, n, s.M, s.D, s.c,
                              &(mcd_cells){.n_cells = K,
                                           .n_dim = nd,
                                           .comp_basis = cb,
                                           .comp = s.comp,
                                           .grad = s.grad,
                                           .grad_lnP = use_p ? s.glnP : NULL},
                              fb, out) == MCD_OK,
                          "N=%zu K=%zu: %s", n, K, mcd_last_error());
            /* nothing written past the K cells (K=0 writes nothing) */
            ck_assert(sup_guard_intact(out + n * nd * K, n * nd));
            for (k = 0; k < K; k++) {
                double D[100 * 100], y[100], g[300], gl[3], F[300], e;
                cell_get(&s, k, D, y, g, gl);
                ck_assert_int_eq(
                    mcd_flux_compute(
                        ws,
                        model == MCD_MODEL_ITERATIVE ? MCD_MODEL_MAXWELL_STEFAN
                                                     : model,
                        &(mcd_state){.n_species = n,
                                     .n_dim = nd,
                                     .M = s.M,
                                     .Dij = D,
                                     .c = s.c[k],
                                     .comp_basis = cb,
                                     .comp = y,
                                     .grad = g,
                                     .grad_lnP = use_p ? gl : NULL},
                        fb, F),
                    MCD_OK);
                e = cell_rel(out, K, k, F, n * nd);
                if (e > worst_dij)
                    worst_dij = e;
                /* 1e-12: both solve the same well-conditioned SPD system
                 * (Đ within a factor 20, so cond ~ 1e2..1e4); the
                 * iterative model run to its round-off floor (tol 0,
                 * up to 1000 iterations) meets it as well. */
                ck_assert_msg(e <= 1e-12,
                              "N=%zu model=%d cb=%d fb=%d p=%d cell %zu: rel "
                              "diff %.3g",
                              n, (int)model, (int)cb, (int)fb, use_p, k, e);
            }
            free(out);
            cells_free(&s);
        }
    }
    fprintf(stderr, "batch_dij: largest relative difference %.3g\n", worst_dij);
    mcd_workspace_free(ws);
}
END_TEST

/* Mixture-driven calls: Đ from the mixture at each cell's T and P (FSG,
 * Chapman-Enskog, Wilke-Lee and user pairs), c = P / (R T). */
static mcd_db *db;
static mcd_mixture *make_mix(size_t n, int lj)
{
    const char *names[64];
    mcd_mixture *m = NULL;
    size_t i, cnt = mcd_db_species_count(db), got = 0;
    for (i = 0; i < cnt && got < n; i++) {
        double v;
        if (lj && (mcd_db_param(db, i, MCD_PARAM_LJ_SIGMA, &v) != MCD_OK ||
                   mcd_db_param(db, i, MCD_PARAM_LJ_EPS_K, &v) != MCD_OK))
            continue;
        if (mcd_db_param(db, i, MCD_PARAM_DIFF_VOLUME, &v) != MCD_OK)
            continue;
        names[got++] = mcd_db_name(db, i);
    }
    ck_assert_uint_eq(got, n);
    ck_assert_int_eq(mcd_mixture_new(db, n, names, MCD_GAS_FSG, &m), MCD_OK);
    return m;
}

START_TEST(batch_mixture_matches_single_state_calls)
{
    static const size_t Ns[] = {2, 3, 5, 8, 11, 20};
    size_t ni;
    mcd_workspace *ws;
    sup_seed(&rng, 0xBA7C4002ull);
    ck_assert_int_eq(mcd_db_new_builtin(&db), MCD_OK);
    ck_assert_int_eq(mcd_workspace_new(30, &ws), MCD_OK);
    for (ni = 0; ni < sizeof Ns / sizeof Ns[0]; ni++) {
        size_t n = Ns[ni], K = 13 + ni, nd = 3, k, i, j, pass;
        mcd_mixture *m = make_mix(n, 1);
        cells s;
        double *out = xmalloc(n * nd * K * sizeof(double));
        double *aos_out = xmalloc(n * nd * K * sizeof(double));
        double *ac = xmalloc(n * K * sizeof(double));
        double *ag = xmalloc(n * nd * K * sizeof(double));
        double *al = xmalloc(nd * K * sizeof(double));
        double Mm[32];
        /* mixed methods: CE, WL, user values and FSG */
        for (i = 0; i < n; i++)
            for (j = i + 1; j < n; j++) {
                int r = (int)((i + 2 * j) % 4);
                if (r == 1)
                    ck_assert_int_eq(
                        mcd_mixture_set_method(m, i, j, MCD_GAS_CHAPMAN_ENSKOG),
                        MCD_OK);
                else if (r == 2)
                    ck_assert_int_eq(
                        mcd_mixture_set_method(m, i, j, MCD_GAS_WILKE_LEE),
                        MCD_OK);
                else if (r == 3)
                    ck_assert_int_eq(mcd_mixture_set_binary(m, i, j, 1.5e-5,
                                                            300.0, 101325.0),
                                     MCD_OK);
            }
        ck_assert_int_eq(mcd_mixture_molar_masses(m, Mm), MCD_OK);
        cells_make(&s, n, K, nd);
        cells_to_aos(&s, ac, ag, al);
        for (pass = 0; pass < 12; pass++) {
            mcd_model model = (mcd_model)(pass % 3);
            mcd_basis cb = (pass / 3) % 2 ? MCD_BASIS_MASS : MCD_BASIS_MOLE;
            mcd_basis fb = (pass / 6) % 2 ? MCD_BASIS_MASS : MCD_BASIS_MOLE;
            const double *gl = pass % 2 ? s.glnP : NULL;
            if (model == MCD_MODEL_ITERATIVE)
                ck_assert_int_eq(mcd_workspace_set_iterative(ws, 1000, 0.0),
                                 MCD_OK);
            ck_assert_msg(mcd_flux_batch(ws, m, model, s.T, s.P,
                                         &(mcd_cells){.n_cells = K,
                                                      .n_dim = nd,
                                                      .comp_basis = cb,
                                                      .comp = s.comp,
                                                      .grad = s.grad,
                                                      .grad_lnP = gl},
                                         fb, out) == MCD_OK,
                          "%s", mcd_last_error());
            ck_assert_int_eq(
                mcd_flux_batch_aos(ws, m, model, s.T, s.P,
                                   &(mcd_cells){.n_cells = K,
                                                .n_dim = nd,
                                                .comp_basis = cb,
                                                .comp = ac,
                                                .grad = ag,
                                                .grad_lnP = gl ? al : NULL},
                                   fb, aos_out),
                MCD_OK);
            for (k = 0; k < K; k++) {
                double D[32 * 32], y[32], g[96], F[96], e;
                double c = s.P[k] / (MCD_GAS_CONSTANT * s.T[k]);
                ck_assert_int_eq(
                    mcd_mixture_binaries(m, s.T[k], s.P[k], D, NULL, NULL),
                    MCD_OK);
                for (i = 0; i < n; i++)
                    y[i] = s.comp[i * K + k];
                for (i = 0; i < n * nd; i++)
                    g[i] = s.grad[i * K + k];
                ck_assert_int_eq(
                    mcd_flux_compute(
                        ws,
                        model == MCD_MODEL_ITERATIVE ? MCD_MODEL_MAXWELL_STEFAN
                                                     : model,
                        &(mcd_state){.n_species = n,
                                     .n_dim = nd,
                                     .M = Mm,
                                     .Dij = D,
                                     .c = c,
                                     .comp_basis = cb,
                                     .comp = y,
                                     .grad = g,
                                     .grad_lnP = gl ? al + k * nd : NULL},
                        fb, F),
                    MCD_OK);
                e = cell_rel(out, K, k, F, n * nd);
                if (e > worst_mix)
                    worst_mix = e;
                /* 1e-12 as above; Đ itself differs only by rounding
                 * (reciprocal coefficients, T^1.75 from square roots) */
                ck_assert_msg(e <= 1e-12, "N=%zu pass %zu cell %zu: %.3g", n,
                              pass, k, e);
                /* the AoS path runs the same kernel: identical bits */
                for (i = 0; i < n * nd; i++)
                    ck_assert(aos_out[k * n * nd + i] == out[i * K + k]);
            }
        }
        free(out);
        free(aos_out);
        free(ac);
        free(ag);
        free(al);
        cells_free(&s);
        mcd_mixture_free(m);
    }
    fprintf(stderr, "batch_mixture: largest relative difference %.3g\n",
            worst_mix);
    mcd_workspace_free(ws);
    mcd_db_free(db);
}
END_TEST

START_TEST(batch_power_law_mixture_iterative_matches_exact)
{
    /* Identity (no outside source): a mixture whose pairs all follow the
     * exact power law (Fuller pairs and the caller's values) takes the
     * iterative model's shared-coefficient product; run to convergence
     * (tol 0, 1000 iterations) it must give the exact model's fluxes to
     * round-off, in both bases, with pressure diffusion, trace species and
     * pure cells (cells_make draws them), for N on both sides of the
     * 4-row tiles. */
    static const size_t Ns[] = {2, 3, 4, 5, 9, 13, 20};
    size_t ni;
    mcd_workspace *ws;
    double worst = 0.0;
    sup_seed(&rng, 0xBA7C4012ull);
    ck_assert_int_eq(mcd_db_new_builtin(&db), MCD_OK);
    ck_assert_int_eq(mcd_workspace_new(30, &ws), MCD_OK);
    for (ni = 0; ni < sizeof Ns / sizeof Ns[0]; ni++) {
        size_t n = Ns[ni], K = 17 + 3 * ni, nd = 3, k, i, j, pass;
        mcd_mixture *m = make_mix(n, 0);
        cells s;
        double *ex = xmalloc(n * nd * K * sizeof(double));
        double *it = xmalloc(n * nd * K * sizeof(double));
        for (i = 0; i < n; i++)
            for (j = i + 1; j < n; j++)
                if ((i + j) % 3 == 0)
                    ck_assert_int_eq(mcd_mixture_set_binary(
                                         m, i, j, 1.1e-5 + 1e-6 * (double)j,
                                         300.0, 101325.0),
                                     MCD_OK);
        cells_make(&s, n, K, nd);
        for (pass = 0; pass < 4; pass++) {
            mcd_basis cb = pass % 2 ? MCD_BASIS_MASS : MCD_BASIS_MOLE;
            mcd_basis fb = pass / 2 ? MCD_BASIS_MASS : MCD_BASIS_MOLE;
            const double *gl = pass == 3 ? s.glnP : NULL;
            ck_assert_int_eq(mcd_flux_batch(ws, m, MCD_MODEL_MAXWELL_STEFAN,
                                            s.T, s.P,
                                            &(mcd_cells){.n_cells = K,
                                                         .n_dim = nd,
                                                         .comp_basis = cb,
                                                         .comp = s.comp,
                                                         .grad = s.grad,
                                                         .grad_lnP = gl},
                                            fb, ex),
                             MCD_OK);
            ck_assert_int_eq(mcd_workspace_set_iterative(ws, 1000, 0.0),
                             MCD_OK);
            ck_assert_msg(mcd_flux_batch(ws, m, MCD_MODEL_ITERATIVE, s.T, s.P,
                                         &(mcd_cells){.n_cells = K,
                                                      .n_dim = nd,
                                                      .comp_basis = cb,
                                                      .comp = s.comp,
                                                      .grad = s.grad,
                                                      .grad_lnP = gl},
                                         fb, it) == MCD_OK,
                          "%s", mcd_last_error());
            for (k = 0; k < K; k++) {
                double F[96], e;
                for (i = 0; i < n * nd; i++)
                    F[i] = ex[i * K + k];
                e = cell_rel(it, K, k, F, n * nd);
                if (e > worst)
                    worst = e;
                ck_assert_msg(e <= 1e-12, "N=%zu pass %zu cell %zu: %.3g", n,
                              pass, k, e);
            }
        }
        free(ex);
        free(it);
        cells_free(&s);
        mcd_mixture_free(m);
    }
    fprintf(stderr,
            "batch_power_law_iterative: largest relative difference %.3g\n",
            worst);
    mcd_workspace_free(ws);
    mcd_db_free(db);
}
END_TEST

START_TEST(batch_errors_name_the_cell_and_write_nothing_on_argument_errors)
{
    enum { N = 4, K = 11, ND = 2 };
    cells s;
    double out[N * ND * K];
    mcd_workspace *ws, *small;
    size_t i;
    sup_seed(&rng, 0xBA7C4003ull);
    ck_assert_int_eq(mcd_workspace_new(N, &ws), MCD_OK);
    ck_assert_int_eq(mcd_workspace_new(N - 1, &small), MCD_OK);
    cells_make(&s, N, K, ND);
    sup_guard_fill(out, N * ND * K);
#define CALL(w, model, n, M_, D_, c_, cb_, x_, g_, fb, o)                      \
    mcd_flux_batch_dij(w, model, n, M_, D_, c_,                                \
                       &(mcd_cells){.n_cells = K,                              \
                                    .n_dim = ND,                               \
                                    .comp_basis = cb_,                         \
                                    .comp = x_,                                \
                                    .grad = g_},                               \
                       fb, o)
    ck_assert_int_eq(CALL(NULL, 0, N, s.M, s.D, s.c, 0, s.comp, s.grad, 0, out),
                     MCD_EINVAL);
    ck_assert_int_eq(mcd_flux_batch_dij(ws, 0, N, s.M, s.D, s.c, NULL, 0, out),
                     MCD_EINVAL);
    ck_assert_str_eq(mcd_last_error(), "argument cells: NULL");
    ck_assert_int_eq(
        CALL(small, 0, N, s.M, s.D, s.c, 0, s.comp, s.grad, 0, out),
        MCD_EBADLEN);
    ck_assert_int_eq(CALL(ws, 0, 0, s.M, s.D, s.c, 0, s.comp, s.grad, 0, out),
                     MCD_EINVAL);
    ck_assert_int_eq(
        CALL(ws, (mcd_model)7, N, s.M, s.D, s.c, 0, s.comp, s.grad, 0, out),
        MCD_EINVAL);
    ck_assert_int_eq(
        CALL(ws, 0, N, s.M, s.D, s.c, (mcd_basis)5, s.comp, s.grad, 0, out),
        MCD_EINVAL);
    ck_assert_int_eq(
        CALL(ws, 0, N, s.M, s.D, s.c, 0, s.comp, s.grad, (mcd_basis)5, out),
        MCD_EINVAL);
    ck_assert_int_eq(CALL(ws, 0, N, NULL, s.D, s.c, 1, s.comp, s.grad, 0, out),
                     MCD_EINVAL);
    ck_assert_int_eq(CALL(ws, 0, N, s.M, NULL, s.c, 0, s.comp, s.grad, 0, out),
                     MCD_EINVAL);
    ck_assert_int_eq(CALL(ws, 0, N, s.M, s.D, NULL, 0, s.comp, s.grad, 0, out),
                     MCD_EINVAL);
    ck_assert_int_eq(CALL(ws, 0, N, s.M, s.D, s.c, 0, NULL, s.grad, 0, out),
                     MCD_EINVAL);
    ck_assert_int_eq(CALL(ws, 0, N, s.M, s.D, s.c, 0, s.comp, NULL, 0, out),
                     MCD_EINVAL);
    ck_assert_int_eq(CALL(ws, 0, N, s.M, s.D, s.c, 0, s.comp, s.grad, 0, NULL),
                     MCD_EINVAL);
    s.M[2] = -1.0;
    ck_assert_int_eq(CALL(ws, 0, N, s.M, s.D, s.c, 1, s.comp, s.grad, 0, out),
                     MCD_EDOM);
    s.M[2] = 0.03;
    ck_assert(sup_guard_intact(out, N * ND * K));
    ck_assert_int_eq(mcd_workspace_set_iterative(ws, 0, 1e-8), MCD_EINVAL);
    ck_assert_int_eq(mcd_workspace_set_iterative(ws, 10, -1.0), MCD_EINVAL);
    ck_assert_int_eq(mcd_workspace_set_iterative(ws, 10, SUP_NAN), MCD_EINVAL);
    ck_assert_int_eq(mcd_workspace_set_iterative(NULL, 10, 1e-8), MCD_EINVAL);
    ck_assert_int_eq(mcd_workspace_iterative_outcome(NULL, NULL, NULL),
                     MCD_EINVAL);
    ck_assert_int_eq(mcd_workspace_set_threads(NULL, 1), MCD_EINVAL);

    /* per-cell errors: status, and the message names the lowest bad cell */
    {
        struct {
            double *p;
            double v;
            mcd_status st;
        } bad[] = {
            {&s.c[9], SUP_NAN, MCD_EINVAL},
            {&s.c[9], -1.0, MCD_EDOM},
            {&s.comp[1 * K + 9], -0.1, MCD_EDOM},
            {&s.comp[2 * K + 9], SUP_NAN, MCD_EINVAL},
            {&s.comp[0 * K + 9], 3.0, MCD_EDOM},
            {&s.grad[3 * K + 9], SUP_INF, MCD_EINVAL},
            {&s.D[(0 * N + 1) * K + 9], 0.0, MCD_EDOM},
            {&s.D[(2 * N + 1) * K + 9], SUP_NAN, MCD_EINVAL},
            {&s.D[(1 * N + 3) * K + 9], 1.1e-5, MCD_EDOM} /* asymmetric */,
        };
        for (i = 0; i < sizeof bad / sizeof bad[0]; i++) {
            double keep = *bad[i].p;
            *bad[i].p = bad[i].v;
            ck_assert_int_eq(CALL(ws, (mcd_model)(i % 3), N, s.M, s.D, s.c, 0,
                                  s.comp, s.grad, 0, out),
                             bad[i].st);
            ck_assert_msg(strncmp(mcd_last_error(), "cell 9: ", 8) == 0, "%s",
                          mcd_last_error());
            /* the same words as the single-state call on that cell */
            {
                double Dc[N * N], xc[N], gc[N * ND], oc[N * ND];
                char batched[256];
                size_t q;
                snprintf(batched, sizeof batched, "%s", mcd_last_error() + 8);
                for (q = 0; q < N * N; q++)
                    Dc[q] = s.D[q * K + 9];
                for (q = 0; q < N; q++)
                    xc[q] = s.comp[q * K + 9];
                for (q = 0; q < N * ND; q++)
                    gc[q] = s.grad[q * K + 9];
                ck_assert_int_eq(
                    mcd_flux_compute(ws, MCD_MODEL_MAXWELL_STEFAN,
                                     &(mcd_state){.n_species = N,
                                                  .n_dim = ND,
                                                  .M = s.M,
                                                  .Dij = Dc,
                                                  .c = s.c[9],
                                                  .comp_basis = MCD_BASIS_MOLE,
                                                  .comp = xc,
                                                  .grad = gc},
                                     MCD_BASIS_MOLE, oc),
                    bad[i].st);
                ck_assert_str_eq(batched, mcd_last_error());
            }
            *bad[i].p = keep;
        }
    }
    /* mixture entry points */
    ck_assert_int_eq(mcd_db_new_builtin(&db), MCD_OK);
    {
        mcd_mixture *m = make_mix(N, 0);
        ck_assert_int_eq(mcd_flux_batch(ws, NULL, 0, s.T, s.P,
                                        &(mcd_cells){.n_cells = K,
                                                     .n_dim = ND,
                                                     .comp_basis = 0,
                                                     .comp = s.comp,
                                                     .grad = s.grad},
                                        0, out),
                         MCD_EINVAL);
        ck_assert_int_eq(mcd_flux_batch(ws, m, 0, NULL, s.P,
                                        &(mcd_cells){.n_cells = K,
                                                     .n_dim = ND,
                                                     .comp_basis = 0,
                                                     .comp = s.comp,
                                                     .grad = s.grad},
                                        0, out),
                         MCD_EINVAL);
        ck_assert_int_eq(mcd_flux_batch_aos(ws, m, 0, s.T, NULL,
                                            &(mcd_cells){.n_cells = K,
                                                         .n_dim = ND,
                                                         .comp_basis = 0,
                                                         .comp = s.comp,
                                                         .grad = s.grad},
                                            0, out),
                         MCD_EINVAL);
        ck_assert_int_eq(mcd_flux_batch(small, m, 0, s.T, s.P,
                                        &(mcd_cells){.n_cells = K,
                                                     .n_dim = ND,
                                                     .comp_basis = 0,
                                                     .comp = s.comp,
                                                     .grad = s.grad},
                                        0, out),
                         MCD_EBADLEN);
        s.T[4] = -3.0;
        ck_assert_int_eq(mcd_flux_batch(ws, m, 0, s.T, s.P,
                                        &(mcd_cells){.n_cells = K,
                                                     .n_dim = ND,
                                                     .comp_basis = 0,
                                                     .comp = s.comp,
                                                     .grad = s.grad},
                                        0, out),
                         MCD_EDOM);
        ck_assert_str_eq(mcd_last_error(), "cell 4: argument T: -3 is not > 0");
        s.T[4] = 400.0;
        s.P[10] = SUP_NAN;
        ck_assert_int_eq(mcd_flux_batch(ws, m, 0, s.T, s.P,
                                        &(mcd_cells){.n_cells = K,
                                                     .n_dim = ND,
                                                     .comp_basis = 0,
                                                     .comp = s.comp,
                                                     .grad = s.grad},
                                        0, out),
                         MCD_EINVAL);
        ck_assert_str_eq(mcd_last_error(), "cell 10: argument P: not finite");
        s.P[10] = 1e5;
        ck_assert_int_eq(mcd_flux_batch(ws, m, 0, s.T, s.P,
                                        &(mcd_cells){.n_cells = K,
                                                     .n_dim = ND,
                                                     .comp_basis = 0,
                                                     .comp = s.comp,
                                                     .grad = s.grad},
                                        0, out),
                         MCD_OK);
        mcd_mixture_free(m);
    }
    mcd_db_free(db);
    cells_free(&s);
    mcd_workspace_free(ws);
    mcd_workspace_free(small);
#undef CALL
}
END_TEST

/* The loading stages check a full block of lanes in registers and the
 * tail block lane by lane: a bad input in either gives the status and the
 * words of the single-state call on that cell, and the lowest bad cell is
 * named. K = 27: cells 3 and 9 lie in full blocks for 2, 4 and 8 lanes
 * (N = 3 runs full blocks two at a time: cell 3 is in the first block of
 * a pair for 4 and 8 lanes, in the second for 2; cell 9 in the second for
 * 8 lanes, the first for 4), cell 25 in the tail for 4 and 8 lanes. Exact
 * model, 3 directions. */
START_TEST(batch_bad_cells_in_full_and_tail_blocks_are_named)
{
    enum { N = 3, K = 27, ND = 3 };
    const size_t at[] = {3, 9, 25};
    cells s;
    double out[N * ND * K];
    mcd_workspace *ws;
    size_t a, i;
    sup_seed(&rng, 0xBA7C4021ull);
    ck_assert_int_eq(mcd_workspace_new(N, &ws), MCD_OK);
    cells_make(&s, N, K, ND);
    for (a = 0; a < sizeof at / sizeof at[0]; a++) {
        const size_t k = at[a];
        struct {
            double *p;
            double v;
            mcd_status st;
        } bad[] = {
            {&s.c[k], SUP_NAN, MCD_EINVAL},
            {&s.c[k], 0.0, MCD_EDOM},
            {&s.comp[1 * K + k], -0.1, MCD_EDOM},
            {&s.comp[2 * K + k], SUP_INF, MCD_EINVAL},
            {&s.comp[0 * K + k], 3.0, MCD_EDOM} /* sum */,
            {&s.grad[7 * K + k], -SUP_INF, MCD_EINVAL},
            {&s.grad[0 * K + k], SUP_NAN, MCD_EINVAL},
            {&s.D[(2 * N + 0) * K + k], 1e-310, MCD_EDOM} /* subnormal */,
            {&s.D[(0 * N + 2) * K + k], SUP_INF, MCD_EINVAL},
            {&s.D[(1 * N + 2) * K + k], SUP_NAN, MCD_EINVAL},
            {&s.D[(2 * N + 1) * K + k], 0.0, MCD_EDOM},
        };
        for (i = 0; i < sizeof bad / sizeof bad[0]; i++) {
            const double keep = *bad[i].p;
            double Dc[N * N], xc[N], gc[N * ND], oc[N * ND];
            char want[32], batched[256];
            mcd_status st;
            *bad[i].p = bad[i].v;
            st = batch_cells(ws, &s, out);
            ck_assert_msg(st == bad[i].st, "cell %zu case %zu: status %d", k, i,
                          (int)st);
            snprintf(want, sizeof want, "cell %zu: ", k);
            ck_assert_msg(strncmp(mcd_last_error(), want, strlen(want)) == 0,
                          "case %zu: %s", i, mcd_last_error());
            snprintf(batched, sizeof batched, "%s",
                     mcd_last_error() + strlen(want));
            /* the same words as the single-state call on that cell */
            ck_assert_int_eq(single_cell(ws, &s, k, 0, Dc, xc, gc, oc),
                             bad[i].st);
            ck_assert_str_eq(batched, mcd_last_error());
            *bad[i].p = keep;
        }
    }
    cells_free(&s);
    mcd_workspace_free(ws);
}
END_TEST

/* A pair (a, b), b < a, near a0 in [1, 2) scaled by 2^e, whose
 * difference equals the symmetry tolerance exactly as both checks
 * compute it: |a - b| == fl(1e-12 max(a, b)). The tolerance p = fl(1e-12
 * a) is chosen a multiple of the spacing of the doubles in [1, 2) (so
 * that a - p is exact) and a found near p / 1e-12 with fl(1e-12 a) == p;
 * scaling by a power of two keeps every equality. */
static void pair_at_tolerance(double a0, int e, double *a, double *b)
{
    const double t = 1e-12, q = nearbyint(t * a0 / 0x1p-52), p = q * 0x1p-52;
    double c = p / t;
    int k;
    for (k = 0; k < 100000 && t * c != p; k++)
        c = p / t + (k % 2 ? 1.0 : -1.0) * (double)(k / 2 + 1) * 0x1p-52;
    ck_assert_msg(t * c == p, "no pair at the tolerance near %g", a0);
    ck_assert(fabs(c - (c - p)) == t * c);
    *a = ldexp(c, e);
    *b = ldexp(c - p, e);
}

/* Inputs at the edges of the rules (Dij at DBL_MAX and DBL_MIN, a pair's
 * asymmetry within one rounding of the 1e-12 tolerance and exactly at it,
 * gradients of DBL_MAX): the batched call must judge every cell as the single-state
 * call does (same status, same words), in a full block and the tail,
 * in the small-N instance and the generic one, with either Dij read.
 * The kernel's loading checks are accumulated over rows (kernel_stages.h);
 * a lane flagged there that the re-check finds good would be EINTERNAL.
 * Common practice: the predicate of the fast check equals the reference
 * check's on every input, including the boundary. */
START_TEST(batch_edge_inputs_are_judged_as_by_the_single_state_call)
{
    const size_t ns[] = {3, 10}, K = 27, ND = 3;
    size_t in, a, i, up;
    for (in = 0; in < 2; in++) {
        const size_t N = ns[in];
        const size_t at[] = {9, 25};
        cellset cs;
        cells *const sp = &cs.s;
        cellset_make(&cs, N, K, ND, 0xED6E0001ull + in);
        for (a = 0; a < 2; a++) {
            const size_t k = at[a];
            double *const d01 = &sp->D[(0 * N + 1) * K + k];
            double *const d10 = &sp->D[(1 * N + 0) * K + k];
            for (i = 0; i < 44; i++) {
                const double keep01 = *d01, keep10 = *d10,
                             keepg = sp->grad[2 * K + k];
                /* i = 0..3 the range edges, then asymmetries around
                 * the tolerance: b = a (1 - r), r in 1e-12 (1 +- 4 ulp) */
                double va = 1e-5, vb = 1e-5;
                if (i == 0)
                    va = vb = DBL_MAX;
                else if (i == 1)
                    va = vb = DBL_MIN;
                else if (i == 2)
                    va = vb = nextafter(DBL_MIN, 0.0);
                else if (i == 3)
                    sp->grad[2 * K + k] = -DBL_MAX;
                else if (i >= 40) {
                    /* exactly at the tolerance (good: the rule is <=),
                     * then one ulp beyond it (bad); either entry the
                     * larger */
                    pair_at_tolerance(1.0 + 0.2 * (double)a, -17, &va, &vb);
                    if (i % 2)
                        vb = nextafter(vb, 0.0);
                    if (i >= 42) {
                        const double tmp = va;
                        va = vb;
                        vb = tmp;
                    }
                } else {
                    const double r =
                        1e-12 * (1.0 + (double)((int)i - 22) * 2.2e-16);
                    va = sup_decades(&rng, -8.0, 2.0);
                    vb = i % 2 ? va * (1.0 - r) : va / (1.0 - r);
                }
                *d01 = va;
                *d10 = vb;
                for (up = 0; up < 2; up++) {
                    char want[32], batched[256];
                    mcd_status st, st1;
                    ck_assert_int_eq(
                        mcd_workspace_set_dij_read(
                            cs.ws, up ? MCD_DIJ_READ_UPPER : MCD_DIJ_READ_BOTH),
                        MCD_OK);
                    st = batch_cells(cs.ws, sp, cs.out);
                    snprintf(want, sizeof want, "cell %zu: ", k);
                    snprintf(batched, sizeof batched, "%s", mcd_last_error());
                    st1 = single_cell(cs.ws, sp, k, (int)up, cs.Dc, cs.xc,
                                      cs.gc, cs.oc);
                    ck_assert_msg(st == st1,
                                  "N %zu cell %zu case %zu read %zu: batched "
                                  "%d (%s), single %d (%s)",
                                  N, k, i, up, (int)st, batched, (int)st1,
                                  mcd_last_error());
                    if (i >= 40) /* at the tolerance, or beyond it */
                        ck_assert_msg(st == (i % 2 && !up ? MCD_EDOM : MCD_OK),
                                      "N %zu case %zu read %zu: %d (%s)", N, i,
                                      up, (int)st, batched);
                    if (strncmp(mcd_last_error(), "argument", 8) == 0) {
                        /* an input rule: the same words (the results'
                         * failures, ESING and fluxes not finite, are
                         * worded per call) */
                        ck_assert_msg(strncmp(batched, want, strlen(want)) == 0,
                                      "%s", batched);
                        ck_assert_str_eq(batched + strlen(want),
                                         mcd_last_error());
                    }
                }
                *d01 = keep01;
                *d10 = keep10;
                sp->grad[2 * K + k] = keepg;
            }
        }
        ck_assert_int_eq(mcd_workspace_set_dij_read(cs.ws, MCD_DIJ_READ_BOTH),
                         MCD_OK);
        cellset_free(&cs);
    }
}
END_TEST

/* Fractions at the edge of the kernel's fast square roots (vrsqrt14pd
 * and Newton steps, taken when every fraction of a block is in (2^-1000,
 * 2), kernel_lanes.h): one species per cell at 2^-1000 and the doubles
 * next to it, at tiny and near-one values, the others sharing the rest.
 * Blocks on either side of the edge must give the single-state call's
 * fluxes to 1e-12 of the cell's largest (common practice: a few ulp on
 * s = sqrt(x) move the fluxes by a few ulp times the condition). N = 3
 * (two blocks at a time) and 10, full blocks and the tail. */
START_TEST(batch_fractions_at_the_fast_sqrt_edge_match_the_single_state_call)
{
    static const double tiny[] = {0x1p-1000,
                                  0x1.0000000000001p-1000,
                                  0x1.fffffffffffffp-1001,
                                  0x1p-999,
                                  1e-300,
                                  1e-200,
                                  1e-100,
                                  1e-30,
                                  1e-16,
                                  0.5,
                                  1.0 - 1e-15};
    const size_t ns[] = {3, 10}, K = 40, ND = 3,
                 nt = sizeof tiny / sizeof tiny[0];
    size_t in, k, i, q;
    for (in = 0; in < 2; in++) {
        const size_t N = ns[in];
        cellset cs;
        cells *const sp = &cs.s;
        cellset_make(&cs, N, K, ND, 0xF5A7E000ull + in);
        for (k = 0; k < K; k++) {
            const size_t p = k % N;
            const double xp = tiny[k % nt];
            double rest = 0.0;
            for (i = 0; i < N; i++)
                if (i != p)
                    rest += sp->comp[i * K + k] = sup_range(&rng, 0.1, 1.0);
            for (i = 0; i < N; i++)
                sp->comp[i * K + k] =
                    i == p ? xp : sp->comp[i * K + k] * ((1.0 - xp) / rest);
        }
        ck_assert_int_eq(batch_cells(cs.ws, sp, cs.out), MCD_OK);
        for (k = 0; k < K; k++) {
            double big = 0.0, e = 0.0;
            ck_assert_int_eq(
                single_cell(cs.ws, sp, k, 0, cs.Dc, cs.xc, cs.gc, cs.oc),
                MCD_OK);
            for (q = 0; q < N * ND; q++) {
                big = fmax(big, fabs(cs.oc[q]));
                e = fmax(e, fabs(cs.oc[q] - cs.out[q * K + k]));
            }
            ck_assert_msg(e <= 1e-12 * big,
                          "N %zu cell %zu x %.17g: %.3g of %.3g", N, k,
                          tiny[k % nt], e, big);
        }
        cellset_free(&cs);
    }
}
END_TEST

START_TEST(batch_overflowing_fluxes_are_reported_with_the_cell)
{
    /* Inputs each finite and in range whose fluxes overflow (c Đ grad ~
     * 1e313): the single-state call refuses them (EDOM, "result: ..."),
     * and so must the batch, naming the cell, whether the cell sits in a
     * full block of lanes (5, 12) or in the tail (18). Common practice:
     * never hand out inf or NaN as a flux. */
    enum { N = 3, K = 21, ND = 3 };
    const size_t bad_cells[] = {5, 12, 18};
    cells s;
    double out[N * ND * K], Dc[N * N], y[N], g[N * ND], gl[ND], J[N * ND];
    mcd_workspace *ws;
    size_t b, i, j;
    int model;
    sup_seed(&rng, 0xBA7C4011ull);
    ck_assert_int_eq(mcd_workspace_new(N, &ws), MCD_OK);
    cells_make(&s, N, K, ND);
    for (b = 0; b < sizeof bad_cells / sizeof bad_cells[0]; b++) {
        const size_t k = bad_cells[b];
        char want[32];
        for (i = 0; i < N; i++)
            for (j = 0; j < N; j++)
                if (i != j)
                    s.D[(i * N + j) * K + k] = 1e300;
        s.c[k] = 1e10;
        for (i = 0; i < N * ND; i++)
            s.grad[i * K + k] = (i % 2 ? 1e3 : -1e3) * (double)(i / ND + 1);
        cell_get(&s, k, Dc, y, g, gl);
        snprintf(want, sizeof want, "cell %zu: result:", k);
        for (model = 0; model <= 1; model++) {
            mcd_model md =
                model ? MCD_MODEL_MIXTURE_AVERAGED : MCD_MODEL_MAXWELL_STEFAN;
            ck_assert_int_eq(
                mcd_flux_compute(ws, md,
                                 &(mcd_state){.n_species = N,
                                              .n_dim = ND,
                                              .M = s.M,
                                              .Dij = Dc,
                                              .c = s.c[k],
                                              .comp_basis = MCD_BASIS_MOLE,
                                              .comp = y,
                                              .grad = g},
                                 MCD_BASIS_MOLE, J),
                MCD_EDOM);
            ck_assert_int_eq(
                mcd_flux_batch_dij(ws, md, N, s.M, s.D, s.c,
                                   &(mcd_cells){.n_cells = K,
                                                .n_dim = ND,
                                                .comp_basis = MCD_BASIS_MOLE,
                                                .comp = s.comp,
                                                .grad = s.grad},
                                   MCD_BASIS_MOLE, out),
                MCD_EDOM);
            ck_assert_msg(strncmp(mcd_last_error(), want, strlen(want)) == 0,
                          "model %d: %s", model, mcd_last_error());
        }
        /* restore an ordinary cell */
        for (i = 0; i < N; i++)
            for (j = i + 1; j < N; j++)
                s.D[(i * N + j) * K + k] = s.D[(j * N + i) * K + k] = 1e-5;
        s.c[k] = 40.0;
        for (i = 0; i < N * ND; i++)
            s.grad[i * K + k] = 0.5;
    }
    ck_assert_int_eq(
        mcd_flux_batch_dij(ws, MCD_MODEL_MAXWELL_STEFAN, N, s.M, s.D, s.c,
                           &(mcd_cells){.n_cells = K,
                                        .n_dim = ND,
                                        .comp_basis = MCD_BASIS_MOLE,
                                        .comp = s.comp,
                                        .grad = s.grad},
                           MCD_BASIS_MOLE, out),
        MCD_OK);
    for (i = 0; i < N * ND * K; i++)
        ck_assert(isfinite(out[i]));
    cells_free(&s);
    mcd_workspace_free(ws);
}
END_TEST

/* OpenMP builds: 1 and 2 threads give identical bits (blocks are fixed by
 * cell index); in a serial build both runs are serial and equal. */
START_TEST(batch_threads_give_identical_results)
{
    size_t n = 7, K = 1001, nd = 3, i;
    cells s;
    double *o1, *o2;
    mcd_workspace *ws;
    sup_seed(&rng, 0xBA7C4004ull);
    ck_assert_int_eq(mcd_workspace_new(n, &ws), MCD_OK);
    cells_make(&s, n, K, nd);
    o1 = xmalloc(n * nd * K * sizeof(double));
    o2 = xmalloc(n * nd * K * sizeof(double));
    for (int model = 0; model < 3; model++) {
        ck_assert_int_eq(mcd_workspace_set_threads(ws, 1), MCD_OK);
        ck_assert_int_eq(
            mcd_flux_batch_dij(ws, (mcd_model)model, n, s.M, s.D, s.c,
                               &(mcd_cells){.n_cells = K,
                                            .n_dim = nd,
                                            .comp_basis = MCD_BASIS_MOLE,
                                            .comp = s.comp,
                                            .grad = s.grad},
                               MCD_BASIS_MASS, o1),
            MCD_OK);
        ck_assert_int_eq(mcd_workspace_set_threads(ws, 2), MCD_OK);
        ck_assert_int_eq(
            mcd_flux_batch_dij(ws, (mcd_model)model, n, s.M, s.D, s.c,
                               &(mcd_cells){.n_cells = K,
                                            .n_dim = nd,
                                            .comp_basis = MCD_BASIS_MOLE,
                                            .comp = s.comp,
                                            .grad = s.grad},
                               MCD_BASIS_MASS, o2),
            MCD_OK);
        for (i = 0; i < n * nd * K; i++)
            ck_assert(o1[i] == o2[i]);
    }
    free(o1);
    free(o2);
    cells_free(&s);
    mcd_workspace_free(ws);
}
END_TEST

/* Output rows at every offset inside a 64-byte line. The AVX-512 kernel
 * can write full output lines with streaming stores and hold back the
 * values that do not fill a line yet (lib/batched/batch.h); its tests run again
 * with MCDIFF_STREAM_STORES=always (the *_stream entries of
 * tests/meson.build). Whatever the store path, the SoA results must equal
 * those of the AoS path (which never streams) bit for bit, for every
 * offset of the output, cell counts around the block size, one and two
 * threads, and the doubles just before and after the output must stay
 * untouched. Reference: the library's other path (identity). */
START_TEST(batch_outputs_at_every_line_offset_match_the_aos_path)
{
    static const size_t Ks[] = {1, 7, 8, 9, 16, 23, 64, 131};
    static const size_t Ns[] = {5, 12};
    size_t ni, ki, i, k;
    mcd_workspace *ws;
    sup_seed(&rng, 0xBA7C4005ull);
    ck_assert_int_eq(mcd_db_new_builtin(&db), MCD_OK);
    ck_assert_int_eq(mcd_workspace_new(12, &ws), MCD_OK);
    for (ni = 0; ni < sizeof Ns / sizeof Ns[0]; ni++)
        for (ki = 0; ki < sizeof Ks / sizeof Ks[0]; ki++) {
            const size_t n = Ns[ni], K = Ks[ki], nd = ni == 0 ? 3 : 2;
            const size_t tot = (n * nd * K + 24 + 7) / 8 * 8; /* whole lines */
            mcd_mixture *m = make_mix(n, 0);
            cells s;
            double *ref = xmalloc(n * nd * K * sizeof(double));
            double *ac = xmalloc(n * K * sizeof(double));
            double *ag = xmalloc(n * nd * K * sizeof(double));
            double *buf = aligned_alloc(64, tot * sizeof(double));
            int model, th;
            unsigned off;
            ck_assert_ptr_nonnull(buf);
            cells_make(&s, n, K, nd);
            cells_to_aos(&s, ac, ag, NULL);
            for (model = 0; model < 2; model++) {
                const mcd_model md =
                    model ? MCD_MODEL_ITERATIVE : MCD_MODEL_MAXWELL_STEFAN;
                ck_assert_int_eq(mcd_flux_batch_aos(
                                     ws, m, md, s.T, s.P,
                                     &(mcd_cells){.n_cells = K,
                                                  .n_dim = nd,
                                                  .comp_basis = MCD_BASIS_MOLE,
                                                  .comp = ac,
                                                  .grad = ag},
                                     MCD_BASIS_MOLE, ref),
                                 MCD_OK);
                for (th = 1; th <= 2; th++)
                    for (off = 0; off < 8; off++) {
                        double *out = buf + 8 + off;
                        ck_assert_int_eq(
                            mcd_workspace_set_threads(ws, (size_t)th), MCD_OK);
                        sup_guard_fill(buf, tot);
                        ck_assert_msg(
                            mcd_flux_batch(
                                ws, m, md, s.T, s.P,
                                &(mcd_cells){.n_cells = K,
                                             .n_dim = nd,
                                             .comp_basis = MCD_BASIS_MOLE,
                                             .comp = s.comp,
                                             .grad = s.grad},
                                MCD_BASIS_MOLE, out) == MCD_OK,
                            "%s", mcd_last_error());
                        ck_assert_msg(sup_guard_intact(buf, 8 + off),
                                      "N=%zu K=%zu offset %u: wrote before "
                                      "the output",
                                      n, K, off);
                        ck_assert_msg(
                            sup_guard_intact(buf + 8 + off + n * nd * K,
                                             tot - (8 + off + n * nd * K)),
                            "N=%zu K=%zu offset %u: wrote after "
                            "the output",
                            n, K, off);
                        for (k = 0; k < K; k++)
                            for (i = 0; i < n * nd; i++)
                                ck_assert_msg(
                                    out[i * K + k] == ref[k * n * nd + i],
                                    "N=%zu K=%zu offset %u threads %d "
                                    "cell %zu row %zu: %.17g vs %.17g",
                                    n, K, off, th, k, i, out[i * K + k],
                                    ref[k * n * nd + i]);
                    }
            }
            free(buf);
            free(ref);
            free(ac);
            free(ag);
            cells_free(&s);
            mcd_mixture_free(m);
        }
    mcd_workspace_free(ws);
    mcd_db_free(db);
}
END_TEST

int main(void)
{
    Suite *s = suite_create("mcd:batch");
    TCase *tc = tcase_create("batch");
    tcase_set_timeout(tc, 300);
    tcase_add_loop_test(tc, batch_dij_matches_single_state_calls, 0, 4);
    tcase_add_test(tc, batch_mixture_matches_single_state_calls);
    tcase_add_test(tc, batch_power_law_mixture_iterative_matches_exact);
    tcase_add_test(
        tc, batch_errors_name_the_cell_and_write_nothing_on_argument_errors);
    tcase_add_test(tc, batch_bad_cells_in_full_and_tail_blocks_are_named);
    tcase_add_test(tc,
                   batch_edge_inputs_are_judged_as_by_the_single_state_call);
    tcase_add_test(
        tc, batch_fractions_at_the_fast_sqrt_edge_match_the_single_state_call);
    tcase_add_test(tc, batch_overflowing_fluxes_are_reported_with_the_cell);
    tcase_add_test(tc, batch_threads_give_identical_results);
    tcase_add_test(tc, batch_outputs_at_every_line_offset_match_the_aos_path);
    suite_add_tcase(s, tc);
    return sup_run(s);
}
