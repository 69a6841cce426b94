/* bench_jacobian.c - the cost of flux Jacobians and of thermal diffusion
 * in the batched calls.
 *
 * Run with `meson test -C <build> --benchmark` (or the executable
 * directly; an optional argument scales the number of cells, then
 * optional species counts). Prints numbers only: no timing is asserted.
 *
 * Same cells for every side (N species, 3 directions, mole basis, ideal
 * mixture, every fraction > 0, per-cell Đ log-uniform over one decade,
 * SoA): for each model (exact Maxwell-Stefan, mixture-averaged)
 *   (f) mcd_flux_batch_dij: fluxes only, the batched kernel;
 *   (j) mcd_flux_batch_jacobian: fluxes and composition Jacobians
 *       (N n_dim x N per cell), the single-state core per cell.
 * and both again with thermal diffusion (per-cell k_T,i summing to zero,
 * |k_T,i| <= 0.05, and grad ln T in [-100, 100] 1/m given in mcd_cells):
 *   (fT) mcd_flux_batch_dij with kT and grad_lnT;
 *   (jT) mcd_flux_batch_jacobian with kT and grad_lnT.
 * Each side runs REPS times in the same run, interleaved (f, fT, j, jT
 * in every repetition); the median, min and max cells/s are printed with
 * the ratios of the medians (j) / (f), (fT) / (f) and (jT) / (j). A
 * caller who does not ask for Jacobians calls (f), which the Jacobian
 * work does not touch, so it pays nothing for them; a caller without
 * thermal diffusion leaves kT and grad_lnT NULL.
 */
#define _GNU_SOURCE /* clock_gettime */
#include <stdio.h>
#include <stdlib.h>
#include <string.h>
#include <time.h>

#include "mcdiff.h"
#include "bench_util.h"
#define SUP_NO_CHECK /* no Check here */
#include "support.h"

#define REPS 5
#define ND 3

static sup_rng rng = SUP_RNG(SUP_SPLITMIX64, 0x1AC0B5ull);

/* median, min, max cells/s of REPS times */
static void rates(double *t, size_t K, double *r)
{
    qsort(t, REPS, sizeof(double), cmp_double);
    r[0] = (double)K / t[REPS / 2];
    r[1] = (double)K / t[REPS - 1];
    r[2] = (double)K / t[0];
}

static int run(size_t n, double scale)
{
    /* the Jacobians are N^2 n_dim doubles a cell: about 40 MB of them */
    size_t K = (size_t)(scale * 5e6 / (double)(n * n * ND));
    double *x, *g, *D, *c, *F, *Jc, *kT, *glT, xs[64], Dm[64 * 64];
    mcd_workspace *ws = NULL;
    size_t k, i, j;
    int mo, rc = 0;
    if (K < 64)
        K = 64;
    if (mcd_workspace_new(n, &ws) != MCD_OK)
        return 1;
    x = malloc(n * K * sizeof(double));
    g = malloc(n * ND * K * sizeof(double));
    D = malloc(n * n * K * sizeof(double));
    c = malloc(K * sizeof(double));
    F = malloc(n * ND * K * sizeof(double));
    Jc = malloc(n * ND * n * K * sizeof(double));
    kT = malloc(n * K * sizeof(double));
    glT = malloc(ND * K * sizeof(double));
    if (!x || !g || !D || !c || !F || !Jc || !kT || !glT) {
        rc = 1;
        goto done;
    }
    for (k = 0; k < K; k++) {
        double gg[64 * ND];
        sup_fractions(&rng, n, 0.05, xs);
        sup_dij_log_uniform(&rng, n, Dm, 1e-5, 10.0);
        sup_gradients_zero_mean(&rng, n, ND, -50.0, 50.0, gg);
        for (i = 0; i < n; i++)
            x[i * K + k] = xs[i];
        for (i = 0; i < n * ND; i++)
            g[i * K + k] = gg[i];
        for (i = 0; i < n; i++)
            for (j = 0; j < n; j++)
                D[(i * n + j) * K + k] = Dm[i * n + j];
        c[k] = sup_range(&rng, 10.0, 60.0);
        {
            double m = 0.0;
            for (i = 0; i < n; i++) {
                kT[i * K + k] = sup_range(&rng, -0.05, 0.05);
                m += kT[i * K + k];
            }
            for (i = 0; i < n; i++)
                kT[i * K + k] -= m / (double)n;
            for (i = 0; i < ND; i++)
                glT[i * K + k] = sup_range(&rng, -100.0, 100.0);
        }
    }
    printf("\nN = %zu, %zu cells, cells/s median [min, max] of %d runs\n", n, K,
           REPS);
    for (mo = 0; mo < 2; mo++) {
        const mcd_model model =
            mo ? MCD_MODEL_MIXTURE_AVERAGED : MCD_MODEL_MAXWELL_STEFAN;
        const mcd_cells cl = {.n_cells = K,
                              .n_dim = ND,
                              .comp_basis = MCD_BASIS_MOLE,
                              .comp = x,
                              .grad = g};
        mcd_cells clT = cl;
        double tf[REPS], tj[REPS], tfT[REPS], tjT[REPS];
        double rf[3], rj[3], rfT[3], rjT[3];
        int r;
        clT.kT = kT;
        clT.grad_lnT = glT;
        for (r = 0; r < REPS; r++) {
            double t0 = now_s();
            rc |= mcd_flux_batch_dij(ws, model, n, NULL, D, c, &cl,
                                     MCD_BASIS_MOLE, F) != MCD_OK;
            tf[r] = now_s() - t0;
            t0 = now_s();
            rc |= mcd_flux_batch_dij(ws, model, n, NULL, D, c, &clT,
                                     MCD_BASIS_MOLE, F) != MCD_OK;
            tfT[r] = now_s() - t0;
            t0 = now_s();
            rc |= mcd_flux_batch_jacobian(ws, model, n, NULL, D, c, &cl,
                                          MCD_BASIS_MOLE, F, Jc) != MCD_OK;
            tj[r] = now_s() - t0;
            t0 = now_s();
            rc |= mcd_flux_batch_jacobian(ws, model, n, NULL, D, c, &clT,
                                          MCD_BASIS_MOLE, F, Jc) != MCD_OK;
            tjT[r] = now_s() - t0;
        }
        rates(tf, K, rf);
        rates(tj, K, rj);
        rates(tfT, K, rfT);
        rates(tjT, K, rjT);
        printf("  %-12s (f)  fluxes            %11.4g [%10.4g, %10.4g]\n"
               "  %-12s (fT) fluxes, thermal   %11.4g [%10.4g, %10.4g]  "
               "ratio (fT)/(f) %.3f\n",
               mo ? "mixture-avg" : "exact", rf[0], rf[1], rf[2], "", rfT[0],
               rfT[1], rfT[2], rfT[0] / rf[0]);
        printf("  %-12s (j)  Jacobian          %11.4g [%10.4g, %10.4g]  "
               "ratio (j)/(f) %.3f\n"
               "  %-12s (jT) Jacobian, thermal %11.4g [%10.4g, %10.4g]  "
               "ratio (jT)/(j) %.3f\n",
               "", rj[0], rj[1], rj[2], rj[0] / rf[0], "", rjT[0], rjT[1],
               rjT[2], rjT[0] / rj[0]);
    }
    if (rc)
        fprintf(stderr, "N = %zu: a call failed: %s\n", n, mcd_last_error());
done:
    fflush(stdout);
    free(x);
    free(g);
    free(D);
    free(c);
    free(F);
    free(Jc);
    free(kT);
    free(glT);
    mcd_workspace_free(ws);
    return rc;
}

int main(int argc, char **argv)
{
    const size_t sizes[] = {3, 5, 10, 20, 50};
    double scale = 1.0;
    int rc = 0;
    if (argc > 1) {
        char *end;
        scale = strtod(argv[1], &end);
        if (*end != '\0' || !(scale > 0.0 && scale <= 100.0)) {
            fprintf(stderr,
                    "usage: %s [cell-count scale in (0, 100]] [N (<= 64) "
                    "...]\n",
                    argv[0]);
            return 2;
        }
    }
    printf("mcdiff %s flux Jacobian benchmark: mole basis, %d directions, "
           "one core\n",
           mcd_version_string(), ND);
    if (argc > 2) {
        for (int a = 2; a < argc; a++) {
            size_t n = (size_t)strtoul(argv[a], NULL, 10);
            if (n < 2 || n > 64) {
                fprintf(stderr, "N must be 2..64\n");
                return 2;
            }
            rc |= run(n, scale);
        }
    } else {
        for (size_t t = 0; t < sizeof sizes / sizeof sizes[0]; t++)
            rc |= run(sizes[t], scale);
    }
    return rc;
}
