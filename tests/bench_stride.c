/* bench_stride.c - the staggered prefetch of the batched SoA call
 * (lib/batched/kernel_lanes.h, pf_stagger) against none, on the same
 * cells, interleaved in one process on one thread.
 *
 * The call is mcd_flux_batch_dij (exact Maxwell-Stefan, mole basis, 3
 * directions, per-cell Đ_ij and c) on ~256 MB of cells (streamed from
 * memory), each array a separate 64-byte aligned allocation. Three cell
 * counts per N: K a multiple of 32 (rows a multiple of 256 bytes apart),
 * K + 16 (128 bytes; the library staggers both) and K + 8 (K / 8 odd:
 * no stagger, both columns time the same code). The rule's N >= 7 is
 * compiled into the kernels (MCDI_STAG_NMIN): below it both columns time
 * the same code too.
 * The workspace's stagger_off (lib/base/workspace.h, an internal field
 * that no public call sets) turns the stagger off for the A/B. Prints
 * cells/s, median [min, max] of the samples, and on/off (ratio of the
 * medians); the results must be the same bits either way (exit 1 if
 * not). No timing is asserted.
 *   usage: bench_stride [N...]   (default 7 8 10 20 50)
 */
#define _POSIX_C_SOURCE 200112L /* clock_gettime */
#include <stdint.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>
#include <time.h>

#include "mcdiff.h"
#include "bench_util.h"
#include "base/workspace.h"

#define SAMPLES 7

static uint64_t rs = 0x57A6u;
static double u01(void)
{
    rs = rs * 6364136223846793005ull + 1442695040888963407ull;
    return (double)(rs >> 11) * 0x1.0p-53;
}

/* One line: N and K, the stagger on and off in turn. */
static int run(mcd_workspace *ws, size_t n, size_t K)
{
    double *D = dalloc(n * n * K), *c = dalloc(K), *x = dalloc(n * K);
    double *g = dalloc(3 * n * K),
           *J[2] = {dalloc(3 * n * K), dalloc(3 * n * K)};
    double t[2][SAMPLES], med[2];
    size_t i, j, k, d, smp;
    int bad;
    for (k = 0; k < K; k++) {
        double s = 0.0;
        c[k] = 40.0 * (0.5 + u01());
        for (i = 0; i < n; i++)
            s += (x[i * K + k] = 0.05 + u01());
        for (i = 0; i < n; i++)
            x[i * K + k] /= s;
        for (d = 0; d < 3; d++) {
            double m = 0.0;
            for (i = 0; i < n; i++)
                m += (g[(i * 3 + d) * K + k] = u01() - 0.5);
            for (i = 0; i < n; i++)
                g[(i * 3 + d) * K + k] -= m / (double)n;
        }
        for (i = 0; i < n; i++) {
            D[(i * n + i) * K + k] = 0.0;
            for (j = i + 1; j < n; j++)
                D[(i * n + j) * K + k] = D[(j * n + i) * K + k] =
                    1e-5 * (0.2 + 2.0 * u01());
        }
    }
    for (smp = 0; smp <= SAMPLES; smp++)
        for (i = 0; i < 2; i++) {
            double t0 = now_s();
            ws->stagger_off = (int)i;
            if (mcd_flux_batch_dij(ws, MCD_MODEL_MAXWELL_STEFAN, n, NULL, D, c,
                                   &(mcd_cells){.n_cells = K,
                                                .n_dim = 3,
                                                .comp_basis = MCD_BASIS_MOLE,
                                                .comp = x,
                                                .grad = g},
                                   MCD_BASIS_MOLE, J[i]) != MCD_OK) {
                fprintf(stderr, "bench_stride: %s\n", mcd_last_error());
                exit(1);
            }
            if (smp > 0) /* sample 0 warms up */
                t[i][smp - 1] = now_s() - t0;
        }
    bad = memcmp(J[0], J[1], 3 * n * K * sizeof(double)) != 0;
    for (i = 0; i < 2; i++) {
        qsort(t[i], SAMPLES, sizeof(double), cmp_double);
        med[i] = t[i][SAMPLES / 2];
    }
    printf("N %3zu K %9zu (K %% 32 = %2zu)  stagger on %.3e [%.3e, %.3e]  off "
           "%.3e [%.3e, %.3e]  on/off %.2f%s\n",
           n, K, K % 32, (double)K / med[0], (double)K / t[0][SAMPLES - 1],
           (double)K / t[0][0], (double)K / med[1],
           (double)K / t[1][SAMPLES - 1], (double)K / t[1][0], med[1] / med[0],
           bad ? "  RESULTS DIFFER" : "");
    fflush(stdout);
    free(D);
    free(c);
    free(x);
    free(g);
    free(J[0]);
    free(J[1]);
    return bad;
}

int main(int argc, char **argv)
{
    static const size_t def[] = {7, 8, 10, 20, 50};
    size_t ns[32], nn = 0, i, cap = 0;
    mcd_workspace *ws;
    int bad = 0;
    for (i = 1; i < (size_t)argc && nn < 32; i++)
        ns[nn++] = (size_t)strtoul(argv[i], NULL, 10);
    if (nn == 0)
        for (nn = 0; nn < sizeof def / sizeof def[0]; nn++)
            ns[nn] = def[nn];
    for (i = 0; i < nn; i++)
        cap = ns[i] > cap ? ns[i] : cap;
    if (mcd_workspace_new(cap, &ws) != MCD_OK ||
        mcd_workspace_set_threads(ws, 1) != MCD_OK)
        return 1;
    printf("mcdiff %s: staggered prefetch of SoA rows, streamed (~256 MB)\n",
           mcd_version_string());
    for (i = 0; i < nn && !bad; i++) {
        const size_t n = ns[i], per = n * n + 7 * n + 1;
        const size_t K = (size_t)(256e6 / (8.0 * (double)per)) / 32 * 32;
        if (n < 1 || n > cap)
            continue;
        bad |= run(ws, n, K);
        bad |= run(ws, n, K + 16);
        bad |= run(ws, n, K + 8);
    }
    mcd_workspace_free(ws);
    return bad;
}
