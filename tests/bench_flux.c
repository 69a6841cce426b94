/* bench_flux.c - throughput of the flux calls against a naive baseline.
 *
 * Run with `meson test -C <build> --benchmark` (or the executable directly;
 * an optional argument scales the number of cells, e.g. 0.1 for a quick
 * run). Prints numbers only: no timing is asserted anywhere.
 *
 * Every side computes molar diffusion fluxes (mole basis, ideal mixture,
 * 3 directions) of the same cells: a mixture of N species with
 * Fuller-Schettler-Giddings pairs, per cell T, P, mole fractions (all > 0)
 * and gradients, stored as structure of arrays, more cells than the
 * last-level cache holds (>= 48 MB of input per run, so the data stream
 * from memory):
 *  (a) baseline, written here as an in-house code would: per cell compute
 *      Đ_ij = coef_ij T^1.75 / P, build the (N-1) x (N-1) matrix [B] of
 *      Taylor and Krishna (1993, ch. 2) with the last species dependent,
 *        B_ii = x_i/Đ_iN + sum_{k != i} x_k/Đ_ik,
 *        B_ij = -x_i (1/Đ_ij - 1/Đ_iN),
 *      solve [B] J = -c grad x for 3 directions with LAPACKE_dgesv_work
 *      (preallocated pivots: no allocation), J_N = -sum of the others;
 *  (b) the library's single-state call: the same Đ per cell, then
 *      mcd_flux_compute (exact Maxwell-Stefan);
 *  (c) mcd_flux_batch, exact Maxwell-Stefan (Đ from the mixture inside);
 *  (d) mcd_flux_batch, iterative (Ern-Giovangigli), tol 1e-7: its own
 *      error estimate and the measured largest difference from (a);
 *  (e) mcd_flux_batch, mixture-averaged (a different model: its
 *      difference from (a) is the model error, not a bug);
 *  (b0) the caller's share of (b): the same loop (Đ per cell, gathers)
 *      calling an empty function instead of mcd_flux_compute. (b) can
 *      never be faster than (b0); the line says how many ns per cell a
 *      single-state call may take for (b) to reach 5x (a).
 * Each side runs REPS times; median, min and max cells/s are printed, the
 * ratio of the medians to (a), and the largest difference from (a)
 * relative to the largest flux of the cell. (m) is a memory floor: a
 * loop that only reads the same inputs (T, P, x, gradients) and writes the
 * same number of outputs, cell by cell like the kernels, no arithmetic to
 * speak of. (t) is the one-core triad bandwidth (a_i = b_i + s c_i over
 * arrays far larger than the caches), timed in the same runs: the ceiling
 * of any kernel that reads its inputs once and writes its outputs once;
 * the line also gives the bytes a cell of (c) moves and the fraction of
 * the triad that (c) achieves. The one-core DGEMM rate of the
 * installed BLAS is printed as the machine's reference, and the achieved
 * GFLOP/s of (c) counting N^3/3 (LDL^T) + 2 N^2 n_dim (solves) + 4 N^2
 * (assembly) flops per cell. With an OpenMP build, (c) is also timed with
 * 2 threads.
 */
#define _GNU_SOURCE /* clock_gettime, dlsym(RTLD_DEFAULT) */
#include <dlfcn.h>
#include <math.h>
#include <stdint.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>
#include <time.h>
#include <lapacke.h>
#if defined(__SSE2__)
#include <emmintrin.h>
#endif

#include "mcdiff.h"
#include "bench_util.h"
#define SUP_NO_CHECK /* no Check here */
#include "support.h"

#define REPS 5
#define ND 3

static sup_rng rng = SUP_RNG(SUP_SPLITMIX64, 0x5EEDull);

/* The caller's side of (b) and (b0) for cell k: Đ = coef T^1.75 / P and
 * the cell's fractions and gradients gathered from the SoA arrays. */
static void caller_gather(size_t n, size_t K, size_t k, const double *T,
                          const double *P, const double *coef, const double *x,
                          const double *g, double *Dc, double *xs, double *gs)
{
    const double f = pow(T[k], 1.75) / P[k];
    for (size_t i = 0; i < n * n; i++)
        Dc[i] = coef[i] * f;
    for (size_t i = 0; i < n; i++)
        xs[i] = x[i * K + k];
    for (size_t i = 0; i < n * ND; i++)
        gs[i] = g[i * K + k];
}

/* (b0): an empty callee the compiler cannot see through */
static void empty_call(const double *a, const double *b, const double *c)
{
    (void)a;
    (void)b;
    (void)c;
}
static void (*volatile empty_fn)(const double *, const double *,
                                 const double *) = empty_call;

/* rates from times: med, min, max cells/s */
typedef struct rate {
    double med, lo, hi;
} rate;
static rate rates(double *t, size_t ncell)
{
    rate r;
    qsort(t, REPS, sizeof(double), cmp_double);
    r.med = (double)ncell / t[REPS / 2];
    r.lo = (double)ncell / t[REPS - 1];
    r.hi = (double)ncell / t[0];
    return r;
}

/* Database of N species: invented hydrocarbon-like species (formula only,
 * Fuller volumes from increments). Benchmark data, not physical claims. */
static mcd_mixture *make_mixture(mcd_db *db, size_t n)
{
    const char *names[128];
    char nm[128][16];
    mcd_mixture *mix = NULL;
    for (size_t i = 0; i < n; i++) {
        char f[32];
        size_t cn = 1 + i % 9, o = (i / 9) % 3, nn = (i / 27) % 2;
        snprintf(nm[i], sizeof nm[i], "bench%03zu", i);
        snprintf(f, sizeof f, "C%zuH%zuO%zuN%zu", cn, 2 * cn + 2, o + 0,
                 nn + 0);
        if (o == 0 && nn == 0)
            snprintf(f, sizeof f, "C%zuH%zu", cn, 2 * cn + 2);
        else if (nn == 0)
            snprintf(f, sizeof f, "C%zuH%zuO%zu", cn, 2 * cn + 2, o);
        else if (o == 0)
            snprintf(f, sizeof f, "C%zuH%zuN", cn, 2 * cn + 3);
        if (mcd_db_add(db, nm[i], f, 0, NULL) != MCD_OK)
            return NULL;
        names[i] = nm[i];
    }
    if (mcd_mixture_new(db, n, names, MCD_GAS_FSG, &mix) != MCD_OK)
        return NULL;
    return mix;
}

/* Baseline: one cell. B and rhs column-major. */
static lapack_int baseline_cell(size_t n, const double *x, size_t K,
                                const double *g, const double *coef, double T,
                                double P, double *D, double *B, double *rhs,
                                lapack_int *ipiv, double *J)
{
    const size_t m = n - 1, N = n - 1;
    const double c = P / (MCD_GAS_CONSTANT * T), f = pow(T, 1.75) / P;
    lapack_int info;
    for (size_t i = 0; i < n * n; i++)
        D[i] = coef[i] * f;
    for (size_t i = 0; i < m; i++) {
        double inv_iN = 1.0 / D[i * n + N];
        double bii = x[i * K] * inv_iN;
        for (size_t k = 0; k < n; k++)
            if (k != i)
                bii += x[k * K] / D[i * n + k];
        B[i + i * m] = bii;
        for (size_t j = 0; j < m; j++)
            if (j != i)
                B[i + j * m] = -x[i * K] * (1.0 / D[i * n + j] - inv_iN);
        for (size_t d = 0; d < ND; d++)
            rhs[i + d * m] = -c * g[(i * ND + d) * K];
    }
    info = LAPACKE_dgesv_work(LAPACK_COL_MAJOR, (lapack_int)m, ND, B,
                              (lapack_int)m, ipiv, rhs, (lapack_int)m);
    for (size_t d = 0; d < ND; d++) {
        double s = 0.0;
        for (size_t i = 0; i < m; i++) {
            J[i * ND + d] = rhs[i + d * m];
            s += rhs[i + d * m];
        }
        J[N * ND + d] = -s;
    }
    return info;
}

/* (t): the one-core triad a_i = b_i + s c_i (McCalpin's STREAM kernel)
 * over three arrays far larger than the caches, 24 bytes per element
 * (two reads, one write). Its bandwidth is the ceiling of any kernel that
 * reads its inputs and writes its outputs once; it is timed in the same
 * runs as the flux calls, and the mixture call's line gives the fraction
 * of it that the call achieves. */
#define TRIAD_LEN ((size_t)1 << 23) /* 8 Mi doubles = 64 MiB per array */
static void triad(double *a, const double *b, const double *c, double s)
{
    for (size_t i = 0; i < TRIAD_LEN; i++)
        a[i] = b[i] + s * c[i];
}

/* Memory floor: read every input of the batched call once, write every
 * output once (the sum keeps the reads from being optimised away). */
static void stream_floor(size_t n, size_t K, const double *T, const double *P,
                         const double *x, const double *g, double *out)
{
    for (size_t k = 0; k < K; k++) {
        double s = T[k] + P[k];
        for (size_t i = 0; i < n; i++)
            s += x[i * K + k];
        for (size_t i = 0; i < n * ND; i++)
            out[i * K + k] = g[i * K + k] + s;
    }
}

/* largest per-cell relative difference of SoA out against AoS ref */
static double maxrel(size_t n, size_t K, const double *soa, const double *ref)
{
    double worst = 0.0;
    for (size_t k = 0; k < K; k++) {
        double sc = 0.0, e = 0.0;
        for (size_t i = 0; i < n * ND; i++) {
            double b = ref[k * n * ND + i], a = soa[i * K + k];
            if (fabs(b) > sc)
                sc = fabs(b);
            if (fabs(a - b) > e)
                e = fabs(a - b);
        }
        if (sc > 0.0 && e / sc > worst)
            worst = e / sc;
    }
    return worst;
}

static void dgemm_reference(void)
{
    typedef void (*dgemm_fn)(
        const char *, const char *, const int *, const int *, const int *,
        const double *, const double *, const int *, const double *,
        const int *, const double *, double *, const int *);
    typedef char *(*cfg_fn)(void);
    dgemm_fn dg = (dgemm_fn)(uintptr_t)dlsym(RTLD_DEFAULT, "dgemm_");
    cfg_fn cfg = (cfg_fn)(uintptr_t)dlsym(RTLD_DEFAULT, "openblas_get_config");
    const int n = 1000;
    double *a, *b, *c, t[3], one = 1.0, zero = 0.0;
    printf("BLAS: %s\n", cfg ? cfg() : "(not OpenBLAS, or no config symbol)");
    if (dg == NULL) {
        printf("DGEMM reference: dgemm_ not found\n");
        return;
    }
    a = malloc(sizeof(double) * n * n);
    b = malloc(sizeof(double) * n * n);
    c = malloc(sizeof(double) * n * n);
    for (int i = 0; i < n * n; i++) {
        a[i] = sup_u01(&rng);
        b[i] = sup_u01(&rng);
        c[i] = 0.0;
    }
    dg("N", "N", &n, &n, &n, &one, a, &n, b, &n, &zero, c, &n); /* warm up */
    for (int r = 0; r < 3; r++) {
        double t0 = now_s();
        dg("N", "N", &n, &n, &n, &one, a, &n, b, &n, &zero, c, &n);
        t[r] = now_s() - t0;
    }
    qsort(t, 3, sizeof(double), cmp_double);
    printf("DGEMM reference (n = %d, one call at a time): %.1f GFLOP/s "
           "(median of 3)\n",
           n, 2.0 * n * n * n / t[1] * 1e-9);
    free(a);
    free(b);
    free(c);
}

static int run(mcd_db *db, size_t n, double scale)
{
    /* >= 48 MB of batched input (T, P, x, grad) per run */
    size_t K = (size_t)(scale * 48e6 / (8.0 * (2.0 + 4.0 * (double)n)));
    mcd_mixture *mix = make_mixture(db, n);
    mcd_workspace *ws = NULL;
    double *T, *P, *x, *g, *coef, *ref, *out, *D, *B, *rhs, *Jc, *Dc, *ref2;
    lapack_int *ipiv;
    double ta[REPS], tb[REPS], tc[REPS], td[REPS], te[REPS], tt[REPS];
    double tm[REPS], t0b[REPS], ttr[REPS], *ta_, *tb_, *tc_;
    double err_d = 0.0, est_d = 0.0, dc, dd, de = 0.0, db_ = 0.0;
    size_t it_d = 0;
    int bad = 0;
    rate ra, rb, rc, rd, re, rm, rb0, rtr;

    if (K < 64)
        K = 64;
    if (mix == NULL || mcd_workspace_new(n, &ws) != MCD_OK) {
        fprintf(stderr, "setup failed for N=%zu\n", n);
        return 1;
    }
    T = malloc(K * sizeof(double));
    P = malloc(K * sizeof(double));
    x = malloc(K * n * sizeof(double));
    g = malloc(K * n * ND * sizeof(double));
    ref = malloc(K * n * ND * sizeof(double));
    ref2 = malloc(K * n * ND * sizeof(double));
    out = malloc(K * n * ND * sizeof(double));
    coef = malloc(n * n * sizeof(double));
    D = malloc(n * n * sizeof(double));
    Dc = malloc(n * n * sizeof(double));
    B = malloc(n * n * sizeof(double));
    rhs = malloc(n * ND * sizeof(double));
    Jc = malloc(n * ND * sizeof(double));
    ipiv = malloc(n * sizeof(lapack_int));
    ta_ = malloc(TRIAD_LEN * sizeof(double));
    tb_ = malloc(TRIAD_LEN * sizeof(double));
    tc_ = malloc(TRIAD_LEN * sizeof(double));
    if (!T || !P || !x || !g || !ref || !ref2 || !out || !coef || !D || !B ||
        !rhs || !ipiv || !Jc || !Dc || !ta_ || !tb_ || !tc_) {
        fprintf(stderr, "out of memory\n");
        return 1;
    }
    for (size_t i = 0; i < TRIAD_LEN; i++) { /* touch every page */
        ta_[i] = 0.0;
        tb_[i] = 1.0;
        tc_[i] = 2.0;
    }
    /* coef_ij = Đ_ij at T = 1 K, P = 1 Pa (FSG: Đ = coef T^1.75 / P) */
    mcd_mixture_binaries(mix, 1.0, 1.0, coef, NULL, NULL);
    for (size_t k = 0; k < K; k++) {
        double s = 0.0;
        T[k] = 300.0 + 900.0 * sup_u01(&rng);
        P[k] = 5e4 + 4.5e5 * sup_u01(&rng);
        for (size_t i = 0; i < n; i++) {
            x[i * K + k] = 0.02 + sup_u01(&rng);
            s += x[i * K + k];
        }
        for (size_t i = 0; i < n; i++)
            x[i * K + k] /= s;
        for (size_t d = 0; d < ND; d++) {
            double m = 0.0;
            for (size_t i = 0; i < n; i++) {
                g[(i * ND + d) * K + k] = 2.0 * sup_u01(&rng) - 1.0;
                m += g[(i * ND + d) * K + k];
            }
            for (size_t i = 0; i < n; i++)
                g[(i * ND + d) * K + k] -= m / (double)n;
        }
    }
    mcd_workspace_set_iterative(ws, 200, 1e-7);
    mcd_workspace_set_threads(ws, 1);
    for (int r = 0; r < REPS; r++) {
        double t0 = now_s();
        for (size_t k = 0; k < K; k++)
            if (baseline_cell(n, x + k, K, g + k, coef, T[k], P[k], D, B, rhs,
                              ipiv, ref + k * n * ND) != 0)
                bad = 1;
        ta[r] = now_s() - t0;

        /* (b): same Đ construction, then the single-state call (inputs
         * gathered from the SoA arrays, as a caller with SoA data would) */
        t0 = now_s();
        for (size_t k = 0; k < K; k++) {
            double xs[128], gs[128 * ND];
            caller_gather(n, K, k, T, P, coef, x, g, Dc, xs, gs);
            if (mcd_flux_compute(
                    ws, MCD_MODEL_MAXWELL_STEFAN,
                    &(mcd_state){.n_species = n,
                                 .n_dim = ND,
                                 .Dij = Dc,
                                 .c = P[k] / (MCD_GAS_CONSTANT * T[k]),
                                 .comp_basis = MCD_BASIS_MOLE,
                                 .comp = xs,
                                 .grad = gs},
                    MCD_BASIS_MOLE, Jc) != MCD_OK)
                bad = 1;
        }
        tb[r] = now_s() - t0;

        /* (b0): the caller's side of (b) alone */
        t0 = now_s();
        for (size_t k = 0; k < K; k++) {
            double xs[128], gs[128 * ND];
            caller_gather(n, K, k, T, P, coef, x, g, Dc, xs, gs);
            empty_fn(Dc, xs, gs);
        }
        t0b[r] = now_s() - t0;

        t0 = now_s();
        if (mcd_flux_batch(ws, mix, MCD_MODEL_ITERATIVE, T, P,
                           &(mcd_cells){.n_cells = K,
                                        .n_dim = ND,
                                        .comp_basis = MCD_BASIS_MOLE,
                                        .comp = x,
                                        .grad = g},
                           MCD_BASIS_MOLE, out) != MCD_OK)
            bad = 1;
        td[r] = now_s() - t0;
        if (r == 0) {
            err_d = maxrel(n, K, out, ref);
            mcd_workspace_iterative_outcome(ws, &est_d, &it_d);
        }

        t0 = now_s();
        if (mcd_flux_batch(ws, mix, MCD_MODEL_MIXTURE_AVERAGED, T, P,
                           &(mcd_cells){.n_cells = K,
                                        .n_dim = ND,
                                        .comp_basis = MCD_BASIS_MOLE,
                                        .comp = x,
                                        .grad = g},
                           MCD_BASIS_MOLE, out) != MCD_OK)
            bad = 1;
        te[r] = now_s() - t0;
        if (r == 0)
            de = maxrel(n, K, out, ref);

        t0 = now_s();
        if (mcd_flux_batch(ws, mix, MCD_MODEL_MAXWELL_STEFAN, T, P,
                           &(mcd_cells){.n_cells = K,
                                        .n_dim = ND,
                                        .comp_basis = MCD_BASIS_MOLE,
                                        .comp = x,
                                        .grad = g},
                           MCD_BASIS_MOLE, out) != MCD_OK)
            bad = 1;
        tc[r] = now_s() - t0;

        t0 = now_s();
        stream_floor(n, K, T, P, x, g, ref2);
        tm[r] = now_s() - t0;

        t0 = now_s();
        triad(ta_, tb_, tc_, 1.0 + 1e-3 * r);
        ttr[r] = now_s() - t0;
    }
    if (bad) {
        fprintf(stderr, "N=%zu: a call failed (%s)\n", n, mcd_last_error());
        return 1;
    }
    dc = maxrel(n, K, out, ref);
    /* (b) agreement on the last cells (Jc holds the last one) */
    {
        double sc = 0.0, e = 0.0;
        for (size_t i = 0; i < n * ND; i++) {
            double b = ref[(K - 1) * n * ND + i];
            if (fabs(b) > sc)
                sc = fabs(b);
            if (fabs(Jc[i] - b) > e)
                e = fabs(Jc[i] - b);
        }
        db_ = e / sc;
    }
    dd = err_d;
    ra = rates(ta, K);
    rb = rates(tb, K);
    rc = rates(tc, K);
    rd = rates(td, K);
    re = rates(te, K);
    rm = rates(tm, K);
    rb0 = rates(t0b, K);
    rtr = rates(ttr, TRIAD_LEN); /* elements per second */
    printf("\nN = %zu, %zu cells, cells/s median [min, max] of %d runs, ratio "
           "of medians to (a), max rel diff from (a)\n",
           n, K, REPS);
    printf("  (a) baseline B+dgesv   %11.4g [%10.4g, %10.4g]\n", ra.med, ra.lo,
           ra.hi);
    printf("  (b) mcd_flux_compute   %11.4g [%10.4g, %10.4g]  x%6.2f  diff "
           "%.1e (last cell)\n",
           rb.med, rb.lo, rb.hi, rb.med / ra.med, db_);
    printf("  (b0) caller's share    %11.4g [%10.4g, %10.4g]  (b) at 5x (a) "
           "needs <= %.0f ns/cell, "
           "%.0f ns of it the caller's loop\n",
           rb0.med, rb0.lo, rb0.hi, 1e9 / (5.0 * ra.med), 1e9 / rb0.med);
    printf("  (c) batch exact        %11.4g [%10.4g, %10.4g]  x%6.2f  diff "
           "%.1e  %.2f GFLOP/s\n",
           rc.med, rc.lo, rc.hi, rc.med / ra.med, dc,
           rc.med * ((double)n * n * n / 3.0 + 2.0 * n * n * ND + 4.0 * n * n) *
               1e-9);
    printf("  (d) batch iterative    %11.4g [%10.4g, %10.4g]  x%6.2f  diff "
           "%.1e  estimate %.1e  iterations <= %zu\n",
           rd.med, rd.lo, rd.hi, rd.med / ra.med, dd, est_d, it_d);
    printf("  (e) batch mixture-avg  %11.4g [%10.4g, %10.4g]  x%6.2f  diff "
           "%.1e (model difference)\n",
           re.med, re.lo, re.hi, re.med / ra.med, de);
    printf("  (m) memory floor       %11.4g [%10.4g, %10.4g]  x%6.2f  (read "
           "inputs, write outputs, cell by cell)\n",
           rm.med, rm.lo, rm.hi, rm.med / ra.med);
    {
        /* bytes a cell of the mixture call reads (T, P, x, gradients) and
         * writes (fluxes) */
        const double cell_bytes = 8.0 * (2.0 + (double)n + 2.0 * n * ND);
        const double gbs = 24.0 * rtr.med * 1e-9;
        printf("  (t) triad, one core    %8.2f GB/s [%6.2f, %6.2f]  (the "
               "ceiling); (c) moves %.0f bytes a cell: %.2f GB/s, %.0f %% "
               "of the triad\n",
               gbs, 24.0 * rtr.lo * 1e-9, 24.0 * rtr.hi * 1e-9, cell_bytes,
               cell_bytes * rc.med * 1e-9,
               100.0 * cell_bytes * rc.med * 1e-9 / gbs);
    }
    /* thread scaling of (c) (OpenMP builds only) */
#ifdef _OPENMP
    if (getenv("MCD_BENCH_THREADS") != NULL) {
        rate r1 = {0, 0, 0}, r2 = {0, 0, 0};
        for (int th = 1; th <= 2; th++) {
            mcd_workspace_set_threads(ws, (size_t)th);
            for (int r = 0; r < REPS; r++) {
                double t0 = now_s();
                mcd_flux_batch(ws, mix, MCD_MODEL_MAXWELL_STEFAN, T, P,
                               &(mcd_cells){.n_cells = K,
                                            .n_dim = ND,
                                            .comp_basis = MCD_BASIS_MOLE,
                                            .comp = x,
                                            .grad = g},
                               MCD_BASIS_MOLE, out);
                tt[r] = now_s() - t0;
            }
            if (th == 1)
                r1 = rates(tt, K);
            else
                r2 = rates(tt, K);
        }
        printf("  (c) threads: 1: %.4g [%.4g, %.4g]  2: %.4g [%.4g, %.4g]  "
               "speed-up %.2f\n",
               r1.med, r1.lo, r1.hi, r2.med, r2.lo, r2.hi, r2.med / r1.med);
    }
#else
    (void)tt;
#endif
    fflush(stdout);
    mcd_workspace_free(ws);
    mcd_mixture_free(mix);
    free(T);
    free(P);
    free(x);
    free(g);
    free(ref);
    free(ref2);
    free(ta_);
    free(tb_);
    free(tc_);
    free(out);
    free(coef);
    free(D);
    free(Dc);
    free(B);
    free(rhs);
    free(Jc);
    free(ipiv);
    return 0;
}

int main(int argc, char **argv)
{
    const size_t sizes[] = {3, 5, 10, 20, 50, 100};
    double scale = 1.0;
    int rc = 0;
    mcd_db *db = NULL;
    if (argc > 1) {
        char *end;
        scale = strtod(argv[1], &end);
        if (*end != '\0' || !(scale > 0.0 && scale <= 100.0)) {
            fprintf(stderr,
                    "usage: %s [cell-count scale in (0, 100]] [N ...]\n",
                    argv[0]);
            return 2;
        }
    }
    {
        const char *ob = getenv("OPENBLAS_NUM_THREADS");
        const char *omp = getenv("OMP_NUM_THREADS");
        printf(
            "mcdiff %s flux benchmark: mole basis, %d directions, one core\n",
            mcd_version_string(), ND);
        printf(
            "OPENBLAS_NUM_THREADS=%s OMP_NUM_THREADS=%s MCD_BENCH_THREADS=%s\n",
            ob ? ob : "(unset)", omp ? omp : "(unset)",
            getenv("MCD_BENCH_THREADS") ? "set" : "(unset: no thread scaling)");
    }
    dgemm_reference();
    if (mcd_db_new(&db) != MCD_OK)
        return 1;
    if (argc > 2) {
        for (int a = 2; a < argc; a++)
            rc |= run(db, (size_t)strtoul(argv[a], NULL, 10), scale);
    } else {
        for (size_t t = 0; t < sizeof sizes / sizeof sizes[0]; t++)
            rc |= run(db, sizes[t], scale);
    }
    mcd_db_free(db);
    return rc;
}
