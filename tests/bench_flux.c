/* bench_flux.c - throughput of mcd_flux_compute against a naive baseline.
 *
 * Run with `meson test -C <build> --benchmark` (or the executable directly;
 * an optional argument scales the number of cells, e.g. 0.1 for a quick
 * run). Prints numbers only: no timing is asserted anywhere.
 *
 * Both sides compute exact Maxwell-Stefan molar diffusion fluxes (mole
 * basis, ideal mixture, 3 directions) on the same pre-generated random
 * valid states (every x_i > 0, symmetric Đ_ij, zero-sum gradients):
 *   - library: mcd_flux_compute(MCD_MODEL_MAXWELL_STEFAN, ...) with one
 *     workspace reused for all cells;
 *   - baseline, written here: per cell build the (N-1) x (N-1) matrix [B]
 *     of Taylor and Krishna (1993, ch. 2) with the last species dependent,
 *       B_ii = x_i/Đ_iN + sum_{k != i} x_k/Đ_ik,
 *       B_ij = -x_i (1/Đ_ij - 1/Đ_iN),
 *     solve [B] (J) = -c (grad x) for the 3 directions with
 *     LAPACKE_dgesv_work (column-major, preallocated pivots: no allocation
 *     inside the loop), and set J_N = -sum of the others.
 * Each side runs REPS times over all cells; the median time is reported,
 * as cells per second, with their ratio and the largest difference between
 * the two results relative to the largest flux of the cell.
 */
#define _POSIX_C_SOURCE 200809L /* clock_gettime under -std=c11 */
#include <math.h>
#include <stdint.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>
#include <time.h>
#include <lapacke.h>

#include "mcdiff.h"

#define REPS 7
#define ND 3

static uint64_t rng_state = 0x5EEDull;
static uint64_t rng_next(void)
{
    uint64_t z = (rng_state += 0x9E3779B97F4A7C15ull);
    z = (z ^ (z >> 30)) * 0xBF58476D1CE4E5B9ull;
    z = (z ^ (z >> 27)) * 0x94D049BB133111EBull;
    return z ^ (z >> 31);
}
static double rng_u01(void) { return (double)(rng_next() >> 11) * 0x1.0p-53; }

static double now_s(void)
{
    struct timespec ts;
    clock_gettime(CLOCK_MONOTONIC, &ts);
    return (double)ts.tv_sec + 1e-9 * (double)ts.tv_nsec;
}

static int cmp_double(const void *a, const void *b)
{
    double x = *(const double *)a, y = *(const double *)b;
    return (x > y) - (x < y);
}

typedef struct cells {
    size_t n, ncell;
    double *x, *grad, *D, *c;   /* per cell: n, n*ND, n*n, 1 */
} cells;

static int make_cells(cells *s, size_t n, size_t ncell)
{
    s->n = n;
    s->ncell = ncell;
    s->x = malloc(ncell * n * sizeof(double));
    s->grad = malloc(ncell * n * ND * sizeof(double));
    s->D = malloc(ncell * n * n * sizeof(double));
    s->c = malloc(ncell * sizeof(double));
    if (!s->x || !s->grad || !s->D || !s->c)
        return -1;
    for (size_t k = 0; k < ncell; k++) {
        double *x = s->x + k * n, *g = s->grad + k * n * ND, *D = s->D + k * n * n;
        double sum = 0.0;
        for (size_t i = 0; i < n; i++) {
            x[i] = 0.02 + rng_u01();
            sum += x[i];
        }
        for (size_t i = 0; i < n; i++)
            x[i] /= sum;
        for (size_t d = 0; d < ND; d++) {
            double m = 0.0;
            for (size_t i = 0; i < n; i++) {
                g[i * ND + d] = 2.0 * rng_u01() - 1.0;
                m += g[i * ND + d];
            }
            for (size_t i = 0; i < n; i++)
                g[i * ND + d] -= m / (double)n;
        }
        /* gas-like binary diffusivities 5e-6 .. 1e-4 m^2/s */
        for (size_t i = 0; i < n; i++) {
            D[i * n + i] = 0.0;
            for (size_t j = i + 1; j < n; j++)
                D[i * n + j] = D[j * n + i] = 5e-6 * pow(20.0, rng_u01());
        }
        s->c[k] = 20.0 + 30.0 * rng_u01(); /* mol/m^3 */
    }
    return 0;
}

static void free_cells(cells *s)
{
    free(s->x);
    free(s->grad);
    free(s->D);
    free(s->c);
}

/* Baseline: one cell, [B] in column-major, dgesv. Returns LAPACK info. */
static lapack_int baseline_cell(size_t n, const double *x, const double *g,
                                const double *D, double c, double *B,
                                double *rhs, lapack_int *ipiv, double *J)
{
    const size_t m = n - 1, N = n - 1; /* N: index of the dependent one */
    lapack_int info;
    if (n == 1) {
        for (size_t d = 0; d < ND; d++)
            J[d] = 0.0;
        return 0;
    }
    for (size_t i = 0; i < m; i++) {
        double inv_iN = 1.0 / D[i * n + N];
        double bii = x[i] * inv_iN;
        for (size_t k = 0; k < n; k++)
            if (k != i)
                bii += x[k] / D[i * n + k];
        B[i + i * m] = bii;
        for (size_t j = 0; j < m; j++)
            if (j != i)
                B[i + j * m] = -x[i] * (1.0 / D[i * n + j] - inv_iN);
        for (size_t d = 0; d < ND; d++)
            rhs[i + d * m] = -c * g[i * ND + d];
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

static int run(size_t n, size_t ncell)
{
    cells s;
    mcd_workspace *ws = NULL;
    double *out_lib, *out_base, *B, *rhs;
    lapack_int *ipiv;
    double t_lib[REPS], t_base[REPS], maxrel = 0.0, check = 0.0;
    int bad = 0;

    if (make_cells(&s, n, ncell) != 0) {
        fprintf(stderr, "out of memory\n");
        return 1;
    }
    out_lib = malloc(ncell * n * ND * sizeof(double));
    out_base = malloc(ncell * n * ND * sizeof(double));
    B = malloc(n * n * sizeof(double));
    rhs = malloc(n * ND * sizeof(double));
    ipiv = malloc(n * sizeof(lapack_int));
    if (!out_lib || !out_base || !B || !rhs || !ipiv ||
        mcd_workspace_alloc(n, &ws) != MCD_OK) {
        fprintf(stderr, "out of memory\n");
        return 1;
    }

    for (int r = 0; r < REPS; r++) {
        double t0 = now_s();
        for (size_t k = 0; k < ncell; k++) {
            mcd_status st = mcd_flux_compute(
                ws, MCD_MODEL_MAXWELL_STEFAN, n, ND, NULL, s.D + k * n * n,
                s.c[k], MCD_BASIS_MOLE, s.x + k * n, s.grad + k * n * ND, NULL,
                NULL, MCD_BASIS_MOLE, out_lib + k * n * ND);
            if (st != MCD_OK)
                bad = 1;
        }
        t_lib[r] = now_s() - t0;

        t0 = now_s();
        for (size_t k = 0; k < ncell; k++)
            if (baseline_cell(n, s.x + k * n, s.grad + k * n * ND,
                              s.D + k * n * n, s.c[k], B, rhs, ipiv,
                              out_base + k * n * ND) != 0)
                bad = 1;
        t_base[r] = now_s() - t0;
    }
    if (bad) {
        fprintf(stderr, "N=%zu: a call failed (%s)\n", n,
                mcd_workspace_last_error(ws));
        return 1;
    }
    for (size_t k = 0; k < ncell; k++) {
        const double *a = out_lib + k * n * ND, *b = out_base + k * n * ND;
        double sc = 0.0, e = 0.0;
        for (size_t i = 0; i < n * ND; i++) {
            if (fabs(b[i]) > sc) sc = fabs(b[i]);
            if (fabs(a[i] - b[i]) > e) e = fabs(a[i] - b[i]);
            check += a[i];
        }
        if (sc > 0.0 && e / sc > maxrel)
            maxrel = e / sc;
    }
    qsort(t_lib, REPS, sizeof(double), cmp_double);
    qsort(t_base, REPS, sizeof(double), cmp_double);
    {
        double cl = (double)ncell / t_lib[REPS / 2];
        double cb = (double)ncell / t_base[REPS / 2];
        printf("N=%2zu cells=%7zu  mcd_flux_compute %11.0f cells/s  "
               "baseline (B + dgesv) %11.0f cells/s  ratio %.2f  "
               "max rel diff %.2e  (checksum %.3g)\n",
               n, ncell, cl, cb, cl / cb, maxrel, check);
    }
    mcd_workspace_free(ws);
    free(out_lib);
    free(out_base);
    free(B);
    free(rhs);
    free(ipiv);
    free_cells(&s);
    return 0;
}

int main(int argc, char **argv)
{
    const size_t sizes[3] = {3, 10, 30};
    double scale = 1.0;
    int rc = 0;
    if (argc > 1) {
        char *end;
        scale = strtod(argv[1], &end);
        if (*end != '\0' || !(scale > 0.0 && scale <= 100.0)) {
            fprintf(stderr, "usage: %s [cell-count scale in (0, 100]]\n", argv[0]);
            return 2;
        }
    }
    printf("Maxwell-Stefan fluxes, mole basis, %d directions, median of %d "
           "repetitions\n", ND, REPS);
    /* A threaded BLAS can slow down small dgesv/dpotrf calls a lot (thread
     * start-up per call); say which setting this run had. */
    {
        const char *ob = getenv("OPENBLAS_NUM_THREADS");
        const char *omp = getenv("OMP_NUM_THREADS");
        printf("OPENBLAS_NUM_THREADS=%s OMP_NUM_THREADS=%s\n",
               ob ? ob : "(unset)", omp ? omp : "(unset)");
    }
    for (int t = 0; t < 3; t++) {
        size_t n = sizes[t];
        /* 2e5 cells at N = 3, scaled by (3/N)^2 so each size runs ~equally
         * long on the O(N^3) baseline */
        size_t ncell = (size_t)(scale * 2e5 * 9.0 / (double)(n * n));
        if (ncell < 10)
            ncell = 10;
        rc |= run(n, ncell);
    }
    return rc;
}
