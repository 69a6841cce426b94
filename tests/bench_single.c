/* bench_single.c - the single-state call against the batched one, per
 * cell, on the same cells, interleaved in one process on one thread.
 *
 * Both compute exact Maxwell-Stefan fluxes, mole basis, 3 directions,
 * from per-cell Đ_ij and c (mcd_flux_compute on each cell's own arrays,
 * gathered beforehand; mcd_flux_batch_dij on the SoA arrays), on a few
 * hundred cells that stay in cache. Random valid states (every x_i > 0,
 * gradients summing to zero, Đ symmetric within 0.2..1.2e-5 m^2/s).
 * Prints ns per cell, median [min, max] of the samples, the ratio single
 * / batched of the medians (the speed issue's target: <= 2 at N >= 10)
 * and the largest relative difference of the fluxes (exit 1 above
 * 1e-12: the two paths must agree). No timing is asserted.
 *   usage: bench_single [N...]   (default 3 5 10 15 20 30)
 */
#define _POSIX_C_SOURCE 200112L /* clock_gettime */
#include <math.h>
#include <stdint.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

#include "mcdiff.h"
#include "bench_util.h"

#define SAMPLES 9
#define CELLS 256

static uint64_t rs = 0x51D6u;
static double u01(void)
{
    rs = rs * 6364136223846793005ull + 1442695040888963407ull;
    return (double)(rs >> 11) * 0x1.0p-53;
}

static int run(size_t n)
{
    const size_t K = CELLS, nd = 3;
    double *x = dalloc(n * K), *g = dalloc(n * nd * K), *D = dalloc(n * n * K);
    double *c = dalloc(K), *Jb = dalloc(n * nd * K), *Js = dalloc(n * nd * K);
    double *xs = dalloc(n * K), *gs = dalloc(n * nd * K),
           *Ds = dalloc(n * n * K);
    double tb[SAMPLES], ts[SAMPLES], worst = 0.0, scale = 0.0;
    mcd_workspace *ws = NULL;
    size_t i, j, k, d, q;
    int s, rc = 0;
    const size_t reps = 1 + (size_t)(4e6 / ((double)(n * n * n + 50 * n) * K));
    if (mcd_workspace_new(n, &ws) != MCD_OK) {
        fprintf(stderr, "bench_single: %s\n", mcd_last_error());
        return 1;
    }
    for (k = 0; k < K; k++) {
        double sum = 0.0;
        c[k] = 30.0 + 20.0 * u01();
        for (i = 0; i < n; i++)
            sum += x[i * K + k] = 0.05 + u01();
        for (i = 0; i < n; i++)
            x[i * K + k] /= sum;
        for (d = 0; d < nd; d++) {
            double gsum = 0.0;
            for (i = 0; i < n; i++) {
                double v = i + 1 == n ? -gsum : u01() - 0.5;
                g[(i * nd + d) * K + k] = v;
                gsum += v;
            }
        }
        for (i = 0; i < n; i++)
            for (j = i; j < n; j++)
                D[(i * n + j) * K + k] = D[(j * n + i) * K + k] =
                    1e-5 * (0.2 + u01());
        /* cell k's own arrays for the single-state call */
        for (i = 0; i < n; i++)
            xs[k * n + i] = x[i * K + k];
        for (q = 0; q < n * nd; q++)
            gs[k * n * nd + q] = g[q * K + k];
        for (q = 0; q < n * n; q++)
            Ds[k * n * n + q] = D[q * K + k];
    }
    for (s = 0; s < SAMPLES; s++) {
        double t0 = now_s();
        size_t r;
        for (r = 0; r < reps; r++)
            if (mcd_flux_batch_dij(ws, MCD_MODEL_MAXWELL_STEFAN, n, NULL, D, c,
                                   &(mcd_cells){.n_cells = K,
                                                .n_dim = nd,
                                                .comp_basis = MCD_BASIS_MOLE,
                                                .comp = x,
                                                .grad = g},
                                   MCD_BASIS_MOLE, Jb) != MCD_OK) {
                fprintf(stderr, "bench_single: %s\n", mcd_last_error());
                return 1;
            }
        tb[s] = (now_s() - t0) / ((double)reps * (double)K);
        t0 = now_s();
        for (r = 0; r < reps; r++)
            for (k = 0; k < K; k++) {
                const mcd_state st = {.n_species = n,
                                      .n_dim = nd,
                                      .comp_basis = MCD_BASIS_MOLE,
                                      .c = c[k],
                                      .Dij = Ds + k * n * n,
                                      .comp = xs + k * n,
                                      .grad = gs + k * n * nd};
                if (mcd_flux_compute(ws, MCD_MODEL_MAXWELL_STEFAN, &st,
                                     MCD_BASIS_MOLE,
                                     Js + k * n * nd) != MCD_OK) {
                    fprintf(stderr, "bench_single: %s\n", mcd_last_error());
                    return 1;
                }
            }
        ts[s] = (now_s() - t0) / ((double)reps * (double)K);
    }
    for (k = 0; k < K; k++)
        for (q = 0; q < n * nd; q++)
            if (fabs(Jb[q * K + k]) > scale)
                scale = fabs(Jb[q * K + k]);
    for (k = 0; k < K; k++)
        for (q = 0; q < n * nd; q++) {
            double e = fabs(Jb[q * K + k] - Js[k * n * nd + q]) / scale;
            if (!(e <= worst))
                worst = e;
        }
    qsort(tb, SAMPLES, sizeof(double), cmp_double);
    qsort(ts, SAMPLES, sizeof(double), cmp_double);
    printf("N = %3zu  batched %8.1f ns/cell [%8.1f, %8.1f]  single %8.1f "
           "[%8.1f, %8.1f]  single/batched %5.2f  maxdiff %.1e\n",
           n, 1e9 * tb[SAMPLES / 2], 1e9 * tb[0], 1e9 * tb[SAMPLES - 1],
           1e9 * ts[SAMPLES / 2], 1e9 * ts[0], 1e9 * ts[SAMPLES - 1],
           ts[SAMPLES / 2] / tb[SAMPLES / 2], worst);
    if (!(worst <= 1e-12)) {
        fprintf(stderr, "bench_single: the two calls differ (%.2e)\n", worst);
        rc = 1;
    }
    mcd_workspace_free(ws);
    free(x), free(g), free(D), free(c), free(Jb), free(Js);
    free(xs), free(gs), free(Ds);
    return rc;
}

int main(int argc, char **argv)
{
    static const size_t def[] = {3, 5, 10, 15, 20, 30};
    int rc = 0, a;
    size_t i;
    printf("mcdiff single-state / batched (exact, mole basis, 3 directions, "
           "%d cells in cache, one thread; medians of %d)\n",
           CELLS, SAMPLES);
    if (argc > 1) {
        for (a = 1; a < argc; a++) {
            char *end;
            unsigned long v = strtoul(argv[a], &end, 10);
            if (*end != '\0' || v < 2 || v > MCD_MAX_SPECIES) {
                fprintf(stderr, "usage: bench_single [N...] (2..%d)\n",
                        MCD_MAX_SPECIES);
                return 2;
            }
            rc |= run((size_t)v);
        }
    } else {
        for (i = 0; i < sizeof def / sizeof def[0]; i++)
            rc |= run(def[i]);
    }
    return rc;
}
