/* test_tiled.c - the tiled layout of the batched calls (MCD_LAYOUT_TILED8,
 * mcd_cells.layout): the same cells given in tiles of 8 give bit-for-bit
 * the results of the SoA layout, for every model and basis pair, N = 1..12
 * and 20, cell counts that are not multiples of 8 (1, 7, 9, 17, 100),
 * trace species, thermal diffusion and pressure diffusion, with one and
 * two threads; the slots of the padding cells are neither read (they hold
 * NaN) nor written; a bad cell is named by its cell index as in SoA; the
 * calls that do not offer the layout refuse it naming cells->layout; no
 * heap allocation. The reference is the library's own SoA path (checked
 * against published data in test_batch and the single-state suites), so
 * no outside values are needed; the checks are identities.
 */
#define SUP_ALLOC_HOOK /* this program counts allocations */
#include <check.h>
#include <math.h>
#include <stdint.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

#include "mcdiff.h"
#include "support.h"

static sup_rng rng = SUP_RNG(SUP_SPLITMIX64, 0);

static void *xmalloc(size_t b)
{
    void *p = malloc(b > 0 ? b : 1);
    ck_assert_ptr_nonnull(p);
    return p;
}

/* 64-byte aligned (a tiled output on a line takes the streaming stores,
 * lib/batched/kernel_emit.h; test 'tiled_stream' forces them on). */
static double *xalign(size_t nd)
{
    void *p = aligned_alloc(64, (nd * sizeof(double) + 63) / 64 * 64 + 64);
    ck_assert_ptr_nonnull(p);
    return p;
}

/* Doubles of an array of Q rows over K cells in tiles of 8. */
static size_t tlen(size_t Q, size_t K) { return (K + 7) / 8 * 8 * Q; }

/* Index of row q of cell k in tiles (mcd_layout). */
static size_t tat(size_t Q, size_t q, size_t k)
{
    return k / 8 * 8 * Q + 8 * q + k % 8;
}

/* SoA array s (Q x K) into a new tiled array, padding slots NaN. */
static double *tiled_of(const double *s, size_t Q, size_t K)
{
    double *t;
    size_t q, k;
    if (s == NULL)
        return NULL;
    t = xmalloc(tlen(Q, K) * sizeof(double));
    for (k = 0; k < tlen(Q, K); k++)
        t[k] = SUP_NAN;
    for (q = 0; q < Q; q++)
        for (k = 0; k < K; k++)
            t[tat(Q, q, k)] = s[q * K + k];
    return t;
}

/* One problem in SoA: K cells, N species. */
typedef struct prob {
    size_t n, K, nd;
    double *M, *D, *c, *comp, *grad, *glnP, *kT, *glnT, *T, *P;
} prob;

static void prob_free(prob *p)
{
    free(p->M);
    free(p->D);
    free(p->c);
    free(p->comp);
    free(p->grad);
    free(p->glnP);
    free(p->kT);
    free(p->glnT);
    free(p->T);
    free(p->P);
}

/* Random cells: a third with trace species (exact zeros), some pure. */
static void prob_make(prob *p, size_t n, size_t K, size_t nd)
{
    size_t i, j, k;
    p->n = n;
    p->K = K;
    p->nd = nd;
    p->M = xmalloc(n * sizeof(double));
    p->D = xmalloc(n * n * K * sizeof(double));
    p->c = xmalloc(K * sizeof(double));
    p->comp = xmalloc(n * K * sizeof(double));
    p->grad = xmalloc(n * nd * K * sizeof(double));
    p->glnP = xmalloc(nd * K * sizeof(double));
    p->kT = xmalloc(n * K * sizeof(double));
    p->glnT = xmalloc(nd * K * sizeof(double));
    p->T = xmalloc(K * sizeof(double));
    p->P = xmalloc(K * sizeof(double));
    for (i = 0; i < n; i++)
        p->M[i] = sup_molar_mass(&rng);
    for (k = 0; k < K; k++) {
        const int kind = (int)(sup_next(&rng) % 3);
        const size_t pure = (size_t)(sup_next(&rng) % n);
        double s = 0.0, ks = 0.0;
        for (i = 0; i < n; i++) {
            double v = sup_range(&rng, 0.01, 1.0);
            if (kind == 1 && i != pure && sup_next(&rng) % 3 == 0)
                v = 0.0; /* trace species */
            if (kind == 2 && sup_next(&rng) % 16 == 0)
                v = i == pure ? 1.0 : 0.0;
            p->comp[i * K + k] = v;
            s += v;
        }
        for (i = 0; i < n; i++)
            p->comp[i * K + k] /= s;
        for (i = 0; i < n; i++) {
            p->kT[i * K + k] = sup_range(&rng, -0.1, 0.1);
            ks += p->kT[i * K + k];
        }
        for (i = 0; i < n; i++)
            p->kT[i * K + k] -= ks / (double)n;
        p->c[k] = sup_decades(&rng, -1.0, 3.0);
        p->T[k] = sup_range(&rng, 250.0, 1500.0);
        p->P[k] = sup_range(&rng, 2e4, 5e5);
        for (i = 0; i < n * nd; i++)
            p->grad[i * K + k] = sup_range(&rng, -1.0, 1.0);
        for (i = 0; i < nd; i++) {
            p->glnP[i * K + k] = sup_range(&rng, -2.0, 2.0);
            p->glnT[i * K + k] = sup_range(&rng, -5.0, 5.0);
        }
        for (i = 0; i < n; i++) {
            p->D[(i * n + i) * K + k] = 0.0;
            for (j = i + 1; j < n; j++)
                p->D[(i * n + j) * K + k] = p->D[(j * n + i) * K + k] =
                    5e-6 * pow(20.0, sup_u01(&rng));
        }
    }
}

/* Options of one comparison. */
typedef struct opts {
    mcd_model model;
    mcd_basis cb, fb;
    int use_p, use_t;
} opts;

/* The SoA and tiled calls on the same cells (mix: mcd_flux_batch, else
 * mcd_flux_batch_dij); outputs compared bit for bit, padding slots of the
 * tiled output untouched. */
static void compare(mcd_workspace *ws, const mcd_mixture *mix, const prob *p,
                    const opts *o)
{
    const size_t n = p->n, K = p->K, nd = p->nd, Q = n * nd;
    double *tc = tiled_of(p->comp, n, K), *tg = tiled_of(p->grad, Q, K);
    double *tl = o->use_p ? tiled_of(p->glnP, nd, K) : NULL;
    double *tk = o->use_t ? tiled_of(p->kT, n, K) : NULL;
    double *tt = o->use_t ? tiled_of(p->glnT, nd, K) : NULL;
    double *tD = tiled_of(p->D, n * n, K);
    double *out = xmalloc((Q * K + 1) * sizeof(double));
    double *tout = xalign(tlen(Q, K));
    double *guard = xmalloc(tlen(Q, K) * sizeof(double));
    mcd_cells cs = {.n_cells = K,
                    .n_dim = nd,
                    .comp_basis = o->cb,
                    .comp = p->comp,
                    .grad = p->grad,
                    .grad_lnP = o->use_p ? p->glnP : NULL,
                    .kT = o->use_t ? p->kT : NULL,
                    .grad_lnT = o->use_t ? p->glnT : NULL};
    mcd_cells ct = {.n_cells = K,
                    .n_dim = nd,
                    .comp_basis = o->cb,
                    .comp = tc,
                    .grad = tg,
                    .grad_lnP = tl,
                    .kT = tk,
                    .grad_lnT = tt,
                    .layout = MCD_LAYOUT_TILED8};
    mcd_status s1, s2;
    char m1[512];
    size_t q, k;
    sup_guard_fill(tout, tlen(Q, K));
    memcpy(guard, tout, tlen(Q, K) * sizeof(double));
    s1 = mix != NULL
             ? mcd_flux_batch(ws, mix, o->model, p->T, p->P, &cs, o->fb, out)
             : mcd_flux_batch_dij(ws, o->model, n, p->M, p->D, p->c, &cs, o->fb,
                                  out);
    snprintf(m1, sizeof m1, "%s", mcd_last_error());
    s2 = mix != NULL
             ? mcd_flux_batch(ws, mix, o->model, p->T, p->P, &ct, o->fb, tout)
             : mcd_flux_batch_dij(ws, o->model, n, p->M, tD, p->c, &ct, o->fb,
                                  tout);
    ck_assert_msg(s1 == s2, "N %zu K %zu model %d: SoA %d (%s), tiled %d (%s)",
                  n, K, (int)o->model, (int)s1, m1, (int)s2, mcd_last_error());
    if (s1 == MCD_OK) {
        /* the first difference, asserted once (a Check assertion per
         * element costs a message to the runner: minutes under valgrind) */
        size_t bq = Q, bk = K, pad_bad = 0;
        for (q = 0; q < Q && bq == Q; q++)
            for (k = 0; k < K; k++)
                if (memcmp(&out[q * K + k], &tout[tat(Q, q, k)],
                           sizeof(double)) != 0) {
                    bq = q, bk = k;
                    break;
                }
        ck_assert_msg(bq == Q,
                      "N %zu K %zu nd %zu model %d cb %d fb %d p %d t "
                      "%d: row %zu cell %zu: %.17g vs %.17g",
                      n, K, nd, (int)o->model, (int)o->cb, (int)o->fb, o->use_p,
                      o->use_t, bq, bk, bq < Q ? out[bq * K + bk] : 0.0,
                      bq < Q ? tout[tat(Q, bq, bk)] : 0.0);
        for (k = K; k < (K + 7) / 8 * 8; k++)
            for (q = 0; q < Q; q++)
                pad_bad += memcmp(&tout[tat(Q, q, k)], &guard[tat(Q, q, k)],
                                  sizeof(double)) != 0;
        ck_assert_msg(pad_bad == 0, "N %zu K %zu: %zu padding slots written", n,
                      K, pad_bad);
    } else {
        ck_assert_str_eq(m1, mcd_last_error());
    }
    free(tc);
    free(tg);
    free(tl);
    free(tk);
    free(tt);
    free(tD);
    free(out);
    free(tout);
    free(guard);
}

static const size_t Ks[] = {1, 7, 9, 17, 100};

START_TEST(tiled_dij_is_bit_identical_to_soa)
{
    static const size_t Ns[] = {1, 2, 3, 4, 5, 6, 7, 8, 9, 10, 11, 12, 20};
    const size_t n = Ns[_i];
    mcd_workspace *ws;
    size_t cfg, ki;
    sup_seed(&rng, 0x7113D000ull + (uint64_t)_i);
    ck_assert_int_eq(mcd_workspace_new(32, &ws), MCD_OK);
    ck_assert_int_eq(mcd_workspace_set_iterative(ws, 25, 0.0), MCD_OK);
    for (ki = 0; ki < sizeof Ks / sizeof Ks[0]; ki++)
        for (cfg = 0; cfg < 48; cfg++) {
            /* every model x basis pair x pressure x thermal; n_dim varies */
            const opts o = {
                .model = (mcd_model)(cfg % 3),
                .cb = (cfg / 3) % 2 ? MCD_BASIS_MASS : MCD_BASIS_MOLE,
                .fb = (cfg / 6) % 2 ? MCD_BASIS_MASS : MCD_BASIS_MOLE,
                .use_p = (int)((cfg / 12) % 2),
                .use_t = (int)((cfg / 24) % 2)};
            const size_t nd = cfg % 2 ? 3 : 1 + (cfg + ki) % 3;
            prob p;
            prob_make(&p, n, Ks[ki], nd);
            compare(ws, NULL, &p, &o);
            prob_free(&p);
        }
    mcd_workspace_free(ws);
}
END_TEST

/* mcd_flux_batch on a mixture (Fuller-Schettler-Giddings pairs; with
 * Chapman-Enskog pairs too at odd N): T and P have one row, the same in
 * both layouts. */
START_TEST(tiled_mixture_is_bit_identical_to_soa)
{
    mcd_db *db;
    mcd_workspace *ws;
    size_t n, ki, cfg;
    sup_seed(&rng, 0x7113D100ull);
    ck_assert_int_eq(mcd_db_new_builtin(&db), MCD_OK);
    ck_assert_int_eq(mcd_workspace_new(32, &ws), MCD_OK);
    ck_assert_int_eq(mcd_workspace_set_iterative(ws, 25, 0.0), MCD_OK);
    for (n = 2; n <= 12; n += 1 + (n >= 6)) {
        const char *names[16];
        mcd_mixture *mix = NULL;
        size_t i, got = 0, cnt = mcd_db_species_count(db);
        for (i = 0; i < cnt && got < n; i++) {
            double v;
            if (mcd_db_param(db, i, MCD_PARAM_LJ_SIGMA, &v) == MCD_OK &&
                mcd_db_param(db, i, MCD_PARAM_LJ_EPS_K, &v) == MCD_OK &&
                mcd_db_param(db, i, MCD_PARAM_DIFF_VOLUME, &v) == MCD_OK)
                names[got++] = mcd_db_name(db, i);
        }
        ck_assert_uint_eq(got, n);
        ck_assert_int_eq(mcd_mixture_new(db, n, names, MCD_GAS_FSG, &mix),
                         MCD_OK);
        if (n % 2)
            ck_assert_int_eq(
                mcd_mixture_set_method(mix, 0, 1, MCD_GAS_CHAPMAN_ENSKOG),
                MCD_OK);
        for (ki = 0; ki < sizeof Ks / sizeof Ks[0]; ki++)
            for (cfg = 0; cfg < 24; cfg++) {
                const opts o = {
                    .model = (mcd_model)(cfg % 3),
                    .cb = (cfg / 3) % 2 ? MCD_BASIS_MASS : MCD_BASIS_MOLE,
                    .fb = (cfg / 6) % 2 ? MCD_BASIS_MASS : MCD_BASIS_MOLE,
                    .use_p = (int)((cfg / 12) % 2),
                    .use_t = (int)(cfg % 2)};
                prob p;
                prob_make(&p, n, Ks[ki], 3);
                compare(ws, mix, &p, &o);
                prob_free(&p);
            }
        mcd_mixture_free(mix);
    }
    mcd_workspace_free(ws);
    mcd_db_free(db);
}
END_TEST

/* A bad value in cell 13 (the second tile, lane 5) of each input array:
 * the same status and message as SoA, naming cell 13. */
START_TEST(tiled_bad_cells_are_named_as_in_soa)
{
    const size_t n = 4, K = 20, nd = 3, bad = 13;
    mcd_workspace *ws;
    prob p;
    size_t w;
    sup_seed(&rng, 0x7113D200ull);
    ck_assert_int_eq(mcd_workspace_new(8, &ws), MCD_OK);
    for (w = 0; w < 7; w++) {
        const opts o = {.model = (mcd_model)(w % 3),
                        .cb = MCD_BASIS_MOLE,
                        .fb = MCD_BASIS_MOLE,
                        .use_p = 1,
                        .use_t = 1};
        prob_make(&p, n, K, nd);
        switch (w) {
        case 0: p.comp[2 * K + bad] = SUP_NAN; break;
        case 1: p.comp[1 * K + bad] = -0.25; break;
        case 2: p.grad[7 * K + bad] = SUP_INF; break;
        case 3: p.D[(1 * n + 2) * K + bad] *= 1.5; break; /* asymmetric */
        case 4: p.c[bad] = -1.0; break;
        case 5: p.kT[3 * K + bad] = SUP_NAN; break;
        default: p.glnP[2 * K + bad] = SUP_NAN; break;
        }
        compare(ws, NULL, &p, &o); /* same status and message */
        ck_assert_msg(strncmp(mcd_last_error(), "cell 13: ", 9) == 0, "%s",
                      mcd_last_error());
        prob_free(&p);
    }
    mcd_workspace_free(ws);
}
END_TEST

/* Two threads give the bits of one (blocks never straddle a tile). */
START_TEST(tiled_threads_give_identical_results)
{
    const size_t n = 7, K = 1001, nd = 3, Q = n * nd;
    mcd_workspace *ws;
    prob p;
    double *tc, *tg, *tD, *o1, *o2;
    int model;
    sup_seed(&rng, 0x7113D300ull);
    ck_assert_int_eq(mcd_workspace_new(8, &ws), MCD_OK);
    prob_make(&p, n, K, nd);
    tc = tiled_of(p.comp, n, K);
    tg = tiled_of(p.grad, Q, K);
    tD = tiled_of(p.D, n * n, K);
    o1 = xalign(tlen(Q, K));
    o2 = (double *)xmalloc((tlen(Q, K) + 1) * sizeof(double)) +
         1; /* off a line */
    for (model = 0; model < 3; model++) {
        const mcd_cells ct = {.n_cells = K,
                              .n_dim = nd,
                              .comp = tc,
                              .grad = tg,
                              .layout = MCD_LAYOUT_TILED8};
        size_t q, k;
        ck_assert_int_eq(mcd_workspace_set_threads(ws, 1), MCD_OK);
        ck_assert_int_eq(mcd_flux_batch_dij(ws, (mcd_model)model, n, p.M, tD,
                                            p.c, &ct, MCD_BASIS_MASS, o1),
                         MCD_OK);
        ck_assert_int_eq(mcd_workspace_set_threads(ws, 2), MCD_OK);
        ck_assert_int_eq(mcd_flux_batch_dij(ws, (mcd_model)model, n, p.M, tD,
                                            p.c, &ct, MCD_BASIS_MASS, o2),
                         MCD_OK);
        size_t ndiff = 0;
        for (q = 0; q < Q; q++)
            for (k = 0; k < K; k++)
                ndiff += memcmp(&o1[tat(Q, q, k)], &o2[tat(Q, q, k)],
                                sizeof(double)) != 0;
        ck_assert_msg(ndiff == 0, "model %d: %zu values differ", model, ndiff);
    }
    free(tc);
    free(tg);
    free(tD);
    free(o1);
    free(o2 - 1);
    prob_free(&p);
    mcd_workspace_free(ws);
}
END_TEST

/* The calls without the tiled layout refuse it, naming cells->layout and
 * writing nothing; an unknown layout is refused by every call. */
START_TEST(tiled_refused_where_not_offered)
{
    const size_t n = 2, K = 3;
    double x[6] = {0.5, 0.5, 0.5, 0.5, 0.5, 0.5}, g[6] = {1, 1, 1, -1, -1, -1};
    double D[12] = {0, 0, 0, 1e-5, 1e-5, 1e-5, 1e-5, 1e-5, 1e-5, 0, 0, 0};
    double c[3] = {40, 40, 40}, T[3] = {300, 300, 300}, P[3] = {1e5, 1e5, 1e5};
    double M[2] = {0.028, 0.032}, V[6] = {5e-5, 5e-5, 5e-5, 5e-5, 5e-5, 5e-5};
    double out[48], jac[48];
    mcd_cells ct = {.n_cells = K,
                    .n_dim = 1,
                    .comp = x,
                    .grad = g,
                    .layout = MCD_LAYOUT_TILED8};
    mcd_workspace *ws;
    mcd_db *db;
    mcd_mixture *mix;
    mcd_liquid *liq;
    unsigned w;
    const char *names[2];
    size_t i;
    ck_assert_int_eq(mcd_workspace_new(4, &ws), MCD_OK);
    ck_assert_int_eq(mcd_db_new_builtin(&db), MCD_OK);
    names[0] = mcd_db_name(db, 0);
    names[1] = mcd_db_name(db, 1);
    ck_assert_int_eq(mcd_mixture_new(db, n, names, MCD_GAS_FSG, &mix), MCD_OK);
    ck_assert_int_eq(mcd_liquid_new(n, MCD_ACTIVITY_IDEAL, &liq), MCD_OK);
    sup_guard_fill(out, 48);
    ck_assert_int_eq(mcd_flux_batch_aos(ws, mix, MCD_MODEL_MAXWELL_STEFAN, T, P,
                                        &ct, MCD_BASIS_MOLE, out),
                     MCD_EINVAL);
    ck_assert_ptr_nonnull(strstr(mcd_last_error(), "cells->layout"));
    ck_assert_ptr_nonnull(strstr(mcd_last_error(), "mcd_flux_batch_aos"));
    ck_assert_int_eq(mcd_flux_batch_jacobian(ws, MCD_MODEL_MAXWELL_STEFAN, n, M,
                                             D, c, &ct, MCD_BASIS_MOLE, out,
                                             jac),
                     MCD_EINVAL);
    ck_assert_ptr_nonnull(strstr(mcd_last_error(), "cells->layout"));
    ck_assert_int_eq(mcd_liquid_flux_batch(ws, liq, MCD_MODEL_MAXWELL_STEFAN, T,
                                           c, M, V, &ct, MCD_BASIS_MOLE, out,
                                           &w),
                     MCD_EINVAL);
    ck_assert_ptr_nonnull(strstr(mcd_last_error(), "cells->layout"));
    ck_assert_ptr_nonnull(strstr(mcd_last_error(), "mcd_liquid_flux_batch"));
    ct.layout = (mcd_layout)7;
    ck_assert_int_eq(mcd_flux_batch_dij(ws, MCD_MODEL_MAXWELL_STEFAN, n, M, D,
                                        c, &ct, MCD_BASIS_MOLE, out),
                     MCD_EINVAL);
    ck_assert_ptr_nonnull(strstr(mcd_last_error(), "cells->layout"));
    ck_assert_int_eq(mcd_flux_batch(ws, mix, MCD_MODEL_MAXWELL_STEFAN, T, P,
                                    &ct, MCD_BASIS_MOLE, out),
                     MCD_EINVAL);
    ck_assert_ptr_nonnull(strstr(mcd_last_error(), "cells->layout"));
    ck_assert(sup_guard_intact(out, 48));
    (void)i;
    mcd_liquid_free(liq);
    mcd_mixture_free(mix);
    mcd_db_free(db);
    mcd_workspace_free(ws);
}
END_TEST

/* No heap allocation in the tiled calls (warm-up pass first, as
 * test_alloc.c). */
START_TEST(tiled_calls_allocate_nothing)
{
    const size_t n = 5, K = 37, nd = 3, Q = n * nd;
    mcd_workspace *ws;
    prob p;
    double *tc, *tg, *tD, *o;
    int pass, live = 0, model;
    sup_seed(&rng, 0x7113D400ull);
    ck_assert_int_eq(mcd_workspace_new(8, &ws), MCD_OK);
    prob_make(&p, n, K, nd);
    tc = tiled_of(p.comp, n, K);
    tg = tiled_of(p.grad, Q, K);
    tD = tiled_of(p.D, n * n, K);
    o = xmalloc(tlen(Q, K) * sizeof(double));
    for (pass = 0; pass < 2; pass++) {
        mcd_status st[6];
        int ns = 0, i;
        if (pass == 1)
            sup_alloc_open();
        for (model = 0; model < 3; model++) {
            const mcd_cells ct = {.n_cells = K,
                                  .n_dim = nd,
                                  .comp_basis = MCD_BASIS_MASS,
                                  .comp = tc,
                                  .grad = tg,
                                  .layout = MCD_LAYOUT_TILED8};
            st[ns++] = mcd_flux_batch_dij(ws, (mcd_model)model, n, p.M, tD, p.c,
                                          &ct, MCD_BASIS_MASS, o);
            st[ns++] = mcd_flux_batch_dij(ws, (mcd_model)model, n, p.M, tD, p.c,
                                          &ct, MCD_BASIS_MOLE, o);
        }
        if (pass == 1) {
            live = sup_alloc_close();
            if (live)
                ck_assert_msg(sup_alloc_count == 1,
                              "%ld allocations besides the probe",
                              (long)sup_alloc_count - 1);
        }
        for (i = 0; i < ns; i++)
            ck_assert_msg(st[i] == MCD_OK, "call %d: %s", i, mcd_last_error());
    }
    free(tc);
    free(tg);
    free(tD);
    free(o);
    prob_free(&p);
    mcd_workspace_free(ws);
}
END_TEST

int main(void)
{
    Suite *s = suite_create("mcd:tiled");
    TCase *tc = tcase_create("tiled");
    tcase_set_timeout(tc, 300);
    tcase_add_loop_test(tc, tiled_dij_is_bit_identical_to_soa, 0, 13);
    tcase_add_test(tc, tiled_mixture_is_bit_identical_to_soa);
    tcase_add_test(tc, tiled_bad_cells_are_named_as_in_soa);
    tcase_add_test(tc, tiled_threads_give_identical_results);
    tcase_add_test(tc, tiled_refused_where_not_offered);
    tcase_add_test(tc, tiled_calls_allocate_nothing);
    suite_add_tcase(s, tc);
    return sup_run(s);
}
