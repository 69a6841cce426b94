/* bench_layout.c - the batched exact call (mcd_flux_batch_dij, mole basis,
 * 3 directions, per-cell Dij and c) on the same cells in the SoA layout
 * and in tiles of 8 (MCD_LAYOUT_TILED8), interleaved in one process on
 * one thread: once with ~2 MB of cell data (in cache) and once with
 * ~256 MB (streamed from memory). Prints cells/s, median [min, max] of
 * the samples, and tiled/SoA (ratio of the medians); checks that both
 * layouts give the same bits.
 *   usage: bench_layout [--soa] [N...]   (default 3 5 10 20 50)
 * --soa: the SoA layout only (to time a build without the tiled layout,
 * linked against its library, in A/B runs).
 */
#define _POSIX_C_SOURCE 200112L /* clock_gettime */
#include <stdint.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>
#include <time.h>

#include "mcdiff.h"
#include "bench_util.h"

#define SAMPLES 9

static size_t nlay = 2; /* layouts timed: SoA, tiled (1 with --soa) */

/* SoA s (Q x K) into tiles t (mcd_layout). */
static void tile(const double *s, size_t Q, size_t K, double *t)
{
    size_t q, k;
    for (q = 0; q < Q; q++)
        for (k = 0; k < K; k++)
            t[k / 8 * 8 * Q + 8 * q + k % 8] = s[q * K + k];
}

static uint64_t rs = 0x1A70u;
static double u01(void)
{
    rs = rs * 6364136223846793005ull + 1442695040888963407ull;
    return (double)(rs >> 11) * 0x1.0p-53;
}

typedef struct arrays {
    double *D, *c, *x, *g, *J;
} arrays;

static mcd_status call(mcd_workspace *ws, size_t n, size_t K, const arrays *a,
                       mcd_layout lay)
{
    return mcd_flux_batch_dij(ws, MCD_MODEL_MAXWELL_STEFAN, n, NULL, a->D, a->c,
                              &(mcd_cells){.n_cells = K,
                                           .n_dim = 3,
                                           .comp_basis = MCD_BASIS_MOLE,
                                           .comp = a->x,
                                           .grad = a->g,
                                           .layout = lay},
                              MCD_BASIS_MOLE, a->J);
}

/* One line: N, the data size, the two layouts timed in turn. */
static int run(mcd_workspace *ws, size_t n, double bytes, const char *what)
{
    const size_t per = n * n + 1 + n + 6 * n; /* doubles a cell, in + out */
    size_t K = (size_t)(bytes / (8.0 * (double)per)), Kt, i, j, k, d;
    size_t reps, r, smp;
    arrays a[2];
    double t[2][SAMPLES], med[2], one;
    int bad = 0;
    K = K < 64 ? 64 : K;
    Kt = (K + 7) / 8 * 8;
    /* each array starts a different number of 64-byte lines into a page
     * (as separate allocations of a real code would), so that loads and
     * stores of the same cell do not share the low 12 address bits */
    for (i = 0; i < 2; i++) {
        a[i].D = dalloc(n * n * Kt + 64) + 8 * 0;
        a[i].c = dalloc(Kt + 64) + 8 * 2;
        a[i].x = dalloc(n * Kt + 64) + 8 * 5;
        a[i].g = dalloc(3 * n * Kt + 64) + 8 * 3;
        a[i].J = dalloc(3 * n * Kt + 64) + 8 * 7;
    }
    for (k = 0; k < K; k++) {
        double s = 0.0;
        a[0].c[k] = 40.0 * (0.5 + u01());
        for (i = 0; i < n; i++)
            s += (a[0].x[i * K + k] = 0.05 + u01());
        for (i = 0; i < n; i++)
            a[0].x[i * K + k] /= s;
        for (d = 0; d < 3; d++) {
            double m = 0.0;
            for (i = 0; i < n; i++)
                m += (a[0].g[(i * 3 + d) * K + k] = u01() - 0.5);
            for (i = 0; i < n; i++)
                a[0].g[(i * 3 + d) * K + k] -= m / (double)n;
        }
        for (i = 0; i < n; i++) {
            a[0].D[(i * n + i) * K + k] = 0.0;
            for (j = i + 1; j < n; j++)
                a[0].D[(i * n + j) * K + k] = a[0].D[(j * n + i) * K + k] =
                    1e-5 * (0.2 + 2.0 * u01());
        }
    }
    memcpy(a[1].c, a[0].c, K * sizeof(double));
    tile(a[0].D, n * n, K, a[1].D);
    tile(a[0].x, n, K, a[1].x);
    tile(a[0].g, 3 * n, K, a[1].g);
    /* warm up, and the repetitions for ~0.05 s a sample */
    one = now_s();
    for (i = 0; i < nlay; i++)
        if (call(ws, n, K, &a[i], i ? MCD_LAYOUT_TILED8 : MCD_LAYOUT_SOA) !=
            MCD_OK) {
            fprintf(stderr, "bench_layout: %s\n", mcd_last_error());
            return 1;
        }
    one = (now_s() - one) / (double)nlay;
    reps = one > 0.05 ? 1 : (size_t)(0.05 / (one > 1e-7 ? one : 1e-7)) + 1;
    for (smp = 0; smp < SAMPLES; smp++)
        for (i = 0; i < nlay; i++) {
            double t0 = now_s();
            for (r = 0; r < reps; r++)
                (void)call(ws, n, K, &a[i],
                           i ? MCD_LAYOUT_TILED8 : MCD_LAYOUT_SOA);
            t[i][smp] = (now_s() - t0) / (double)reps;
        }
    for (k = 0; k < K && nlay == 2; k++)
        for (i = 0; i < 3 * n; i++)
            bad |= memcmp(&a[0].J[i * K + k],
                          &a[1].J[k / 8 * 8 * 3 * n + 8 * i + k % 8],
                          sizeof(double)) != 0;
    for (i = 0; i < nlay; i++) {
        qsort(t[i], SAMPLES, sizeof(double), cmp_double);
        med[i] = t[i][SAMPLES / 2];
    }
    if (nlay == 1)
        printf("N %3zu %-8s K %9zu  SoA %.3e [%.3e, %.3e]\n", n, what, K,
               (double)K / med[0], (double)K / t[0][SAMPLES - 1],
               (double)K / t[0][0]);
    else
        printf("N %3zu %-8s K %9zu  SoA %.3e [%.3e, %.3e]  tiled %.3e [%.3e, "
               "%.3e]  tiled/SoA %.2f%s\n",
               n, what, K, (double)K / med[0], (double)K / t[0][SAMPLES - 1],
               (double)K / t[0][0], (double)K / med[1],
               (double)K / t[1][SAMPLES - 1], (double)K / t[1][0],
               med[0] / med[1], bad ? "  RESULTS DIFFER" : "");
    fflush(stdout);
    for (i = 0; i < 2; i++) {
        free(a[i].D);
        free(a[i].c - 8 * 2);
        free(a[i].x - 8 * 5);
        free(a[i].g - 8 * 3);
        free(a[i].J - 8 * 7);
    }
    return bad;
}

int main(int argc, char **argv)
{
    static const size_t def[] = {3, 5, 10, 20, 50};
    size_t ns[32], nn = 0, i, cap = 0;
    mcd_workspace *ws;
    int bad = 0;
    for (i = 1; i < (size_t)argc && nn < 32; i++) {
        if (strcmp(argv[i], "--soa") == 0)
            nlay = 1;
        else
            ns[nn++] = (size_t)strtoul(argv[i], NULL, 10);
    }
    if (nn == 0)
        for (nn = 0; nn < sizeof def / sizeof def[0]; nn++)
            ns[nn] = def[nn];
    for (i = 0; i < nn; i++)
        cap = ns[i] > cap ? ns[i] : cap;
    if (mcd_workspace_new(cap, &ws) != MCD_OK ||
        mcd_workspace_set_threads(ws, 1) != MCD_OK)
        return 1;
    for (i = 0; i < nn; i++) {
        bad |= run(ws, ns[i], 2e6, "cache");
        bad |= run(ws, ns[i], 256e6, "streamed");
    }
    mcd_workspace_free(ws);
    return bad ? 2 : 0;
}
