/* bench_stages.c - where the time of a batched exact call goes, stage by
 * stage.
 *
 * Run with `meson test -C <build> --benchmark` (or the executable
 * directly; optional arguments: the species counts, e.g. `3 5 10`).
 * Prints numbers only: no timing is asserted anywhere.
 *
 * The call is mcd_flux_batch_dij (exact Maxwell-Stefan, mole basis in and
 * out, 3 directions, per-cell Đ_ij and c, mole fractions all > 0, the
 * gradients summing to zero) on cells that fit in the caches (about
 * 1.5 MB of input: the kernel's own cost, not the memory's). The
 * workspace's stage_cut (lib/base/workspace.h, an internal field that no
 * public call sets) makes every block return after stage k, so timing
 * the call for k = 1, 2, ... and the whole call, interleaved in the same
 * run, gives each stage's cost as the difference of two medians:
 *   1 load + check c and the composition, 2 fractions (scaled to sum 1),
 *   3 load + check the gradients, 4 driving forces (projection),
 *   5 load + check Đ and 1/Đ, 6 Blanc sums, 7 trace species,
 *   8 right-hand side, 9 factor and solve, 10 compose, clean up, store
 * (from 2 to 5 species the grounded form's stages: see ground_name).
 * A stage cut early leaves later stages' work undone but not their data
 * movement into the caches, so the differences are the stages' marginal
 * costs in this order. The whole call's cells/s and ns per cell are
 * printed with min and max over the repetitions. Up to MCDI_PAIR_NMAX
 * (4) species the whole call runs full blocks two at a time and a cut
 * call one at a time (batch_kernel.c), so there the last stage's share
 * also holds the difference of the two (a few per cent at N = 3). */
#define _GNU_SOURCE /* clock_gettime */
#include <math.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>
#include <time.h>

#include "mcdiff.h"
#include "bench_util.h"
#include "base/workspace.h"
#include "base/isa.h"

#define NSTAGE 10
#define REPS 15

static const char *stage_name[NSTAGE] = {
    "load, check c and x", "fractions",       "load, check grad",
    "driving forces",      "load Dij, 1/Dij", "Blanc sums",
    "trace species",       "right-hand side", "factor and solve",
    "compose, store"};
/* Full blocks of 2 to 5 species take the grounded form (MCDI_GROUND_NMAX,
 * lib/batched/kernel_ldl.h), whose cuts mean: 6 choice of the grounded
 * species, 7 the ties, the range rule, the elimination and the back
 * substitution; 8 and 9 do nothing there. */
#define GROUND_NMAX 5
static const char *ground_name[NSTAGE] = {
    "load, check c and x", "fractions",       "load, check grad",
    "driving forces",      "load Dij, 1/Dij", "choose grounded",
    "ties, eliminate",     "(none)",          "(none)",
    "compose, store"};

/* From 6 to 10 species (stage_ground_any, through ground_fixed): 6 does
 * nothing, 7 is the whole grounded solve. */
#define GROUND_ANY_NMAX 10
static const char *ground_any_name[NSTAGE] = {
    "load, check c and x", "fractions",       "load, check grad",
    "driving forces",      "load Dij, 1/Dij", "(none)",
    "choose, ties, elim.", "(none)",          "(none)",
    "compose, store"};

static unsigned long long rng = 0x9e3779b97f4a7c15ULL;
static double urand(void)
{
    rng ^= rng << 13;
    rng ^= rng >> 7;
    rng ^= rng << 17;
    return (double)(rng >> 11) * (1.0 / 9007199254740992.0);
}

static int cmp_d(const void *a, const void *b)
{
    double x = *(const double *)a, y = *(const double *)b;
    return (x > y) - (x < y);
}

/* Cells of the call (SoA, stride K): x > 0 summing to 1, symmetric Đ,
 * gradients summing to zero, c. */
typedef struct cells {
    double *x, *D, *g, *c, *J;
} cells;

static int make_cells(size_t n, size_t K, cells *cl)
{
    size_t k, i, j, d;
    cl->x = malloc(n * K * sizeof(double));
    cl->D = malloc(n * n * K * sizeof(double));
    cl->g = malloc(3 * n * K * sizeof(double));
    cl->c = malloc(K * sizeof(double));
    cl->J = malloc(3 * n * K * sizeof(double));
    if (!cl->x || !cl->D || !cl->g || !cl->c || !cl->J)
        return 0;
    for (k = 0; k < K; k++) {
        double s = 0.0;
        for (i = 0; i < n; i++) {
            cl->x[i * K + k] = 0.05 + urand();
            s += cl->x[i * K + k];
        }
        for (i = 0; i < n; i++)
            cl->x[i * K + k] /= s;
        for (i = 0; i < n; i++)
            for (j = 0; j <= i; j++) {
                double v = i == j ? 1e-5 : 2e-6 + 4e-5 * urand();
                cl->D[(i * n + j) * K + k] = cl->D[(j * n + i) * K + k] = v;
            }
        for (d = 0; d < 3; d++) {
            double m = 0.0;
            for (i = 0; i < n; i++) {
                cl->g[(i * 3 + d) * K + k] = 200.0 * urand() - 100.0;
                m += cl->g[(i * 3 + d) * K + k];
            }
            for (i = 0; i < n; i++)
                cl->g[(i * 3 + d) * K + k] -= m / (double)n;
        }
        cl->c[k] = 20.0 + 40.0 * urand();
    }
    return 1;
}

static void free_cells(cells *cl)
{
    free(cl->x);
    free(cl->D);
    free(cl->g);
    free(cl->c);
    free(cl->J);
}

/* Seconds per call of the batch with blocks cut after stage `cut`. */
static double time_call(mcd_workspace *ws, size_t n, size_t K, const cells *cl,
                        int cut, long inner)
{
    const mcd_cells mc = {.n_cells = K,
                          .n_dim = 3,
                          .comp_basis = MCD_BASIS_MOLE,
                          .comp = cl->x,
                          .grad = cl->g};
    double t0;
    long r;
    ws->stage_cut = cut;
    t0 = now_s();
    for (r = 0; r < inner; r++)
        if (mcd_flux_batch_dij(ws, MCD_MODEL_MAXWELL_STEFAN, n, NULL, cl->D,
                               cl->c, &mc, MCD_BASIS_MOLE, cl->J) != MCD_OK) {
            fprintf(stderr, "bench_stages: %s\n", mcd_last_error());
            exit(1);
        }
    return (now_s() - t0) / (double)inner;
}

static int run_n(size_t n)
{
    /* ~1.5 MB of input: in the caches; not a power of two */
    const size_t K = 1500000 / ((n * n + 4 * n + 1) * 8) / 8 * 8 + 3;
    double t[NSTAGE][REPS], med[NSTAGE];
    mcd_workspace *ws = NULL;
    cells cl;
    long inner;
    int s, r;
    if (!make_cells(n, K, &cl) || mcd_workspace_new(n, &ws) != MCD_OK) {
        fprintf(stderr, "bench_stages: out of memory\n");
        return 1;
    }
    mcd_workspace_set_threads(ws, 1);
    {
        double one = time_call(ws, n, K, &cl, 0, 1);
        inner = one > 0.0 ? (long)(0.02 / one) + 1 : 1;
    }
    for (r = 0; r < REPS; r++) /* interleaved: the machine's drift hits all */
        for (s = 0; s < NSTAGE; s++)
            t[s][r] =
                time_call(ws, n, K, &cl, s + 1 < NSTAGE ? s + 1 : 0, inner) /
                (double)K * 1e9;
    for (s = 0; s < NSTAGE; s++) {
        qsort(t[s], REPS, sizeof(double), cmp_d);
        med[s] = t[s][REPS / 2];
    }
    printf("N = %zu, %zu cells in cache, ns per cell (median of %d):\n", n, K,
           REPS);
    for (s = 0; s < NSTAGE; s++) {
        double inc = med[s] - (s > 0 ? med[s - 1] : 0.0);
        printf("  %2d %-18s %7.2f  (%4.0f %%)   cumulative %7.2f\n", s + 1,
               n >= 2 && n <= GROUND_NMAX                ? ground_name[s]
               : n > GROUND_NMAX && n <= GROUND_ANY_NMAX ? ground_any_name[s]
                                                         : stage_name[s],
               inc, 100.0 * inc / med[NSTAGE - 1], med[s]);
    }
    printf("  whole call: %.3g cells/s (median) [%.3g, %.3g], %.2f ns per "
           "cell\n\n",
           1e9 / med[NSTAGE - 1], 1e9 / t[NSTAGE - 1][REPS - 1],
           1e9 / t[NSTAGE - 1][0], med[NSTAGE - 1]);
    mcd_workspace_free(ws);
    free_cells(&cl);
    return 0;
}

int main(int argc, char **argv)
{
    static const size_t def[] = {3, 5, 10, 20};
    int a, rc = 0;
    printf("bench_stages: mcd_flux_batch_dij, exact, mole basis, 3 "
           "directions, one thread; kernels x86-64-v%d (1: baseline)\n\n",
           mcdi_isa());
    if (argc > 1) {
        for (a = 1; a < argc; a++)
            rc |= run_n((size_t)strtoul(argv[a], NULL, 10));
    } else {
        for (a = 0; a < (int)(sizeof def / sizeof def[0]); a++)
            rc |= run_n(def[a]);
    }
    return rc;
}
