/* transient_1d.c - embedding libmcdiff in a 1-D transient finite-volume
 * solver: species continuity with diffusion and a reaction, fluxes from the
 * library at every face and every step (see fv1d.c for the model).
 *
 * DEMO ONLY: the scenario (geometry, initial compositions, rate constant)
 * is invented; the binary diffusivities are Fuller-Schettler-Giddings
 * estimates from the built-in table.
 *
 * Four runs over the same grid, each with ONE batched library call
 * (mcd_flux_batch) per step for all faces: inert and reacting, each with the
 * exact Maxwell-Stefan fluxes and with mixture-averaged ones. Checks (exit 1
 * when one fails):
 *   - inert runs: every species' inventory sum_k c x_ik dz is constant;
 *   - reacting runs: every element's inventory is constant, and every
 *     species' inventory changed by exactly nu_i times the reaction extent;
 *   - sum_i x_ik = 1 in every cell.
 * The tolerance is an a-priori round-off bound, 4 (n_steps + n_cells) eps:
 * each step rounds every cell value once (relative error <= eps of the
 * value, so <= eps of the inventory summed over cells, twice with the
 * rounding of the increment) and the final sum over n_cells adds <= n_cells
 * eps; the factor 4 is margin. Mass is never created by the scheme itself,
 * only by rounding, so anything larger would be a bug.
 * It also prints the largest difference of mole fractions between the
 * Maxwell-Stefan and mixture-averaged runs at the end time, and runs the
 * reacting Maxwell-Stefan case a second time with one mcd_flux_compute
 * call per face instead of one mcd_flux_batch call per step: the two must
 * agree to 1e-10 (they differ only by round-off), and the timings show
 * what batching saves.
 *
 * Usage: transient_1d [--cells N] [--steps S] [--time T] [--out FILE]
 *   --cells N   number of cells (default 50)
 *   --steps S   time steps (default: the fewest stable ones)
 *   --time T    end time in s (default 0.2)
 *   --out FILE  write the final reacting Maxwell-Stefan profiles to FILE
 * Exit status: 0 all checks passed, 1 a check or library call failed or
 * the step count is above the stability limit, 2 usage error.
 */
#include <float.h>
#include <math.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>
#include <time.h>
#include "fv1d.h"

#define NS FV1D_NS

static int parse_size(const char *s, size_t *out)
{
    char *end;
    unsigned long long v;
    if (!s || *s == '\0' || *s == '-')
        return 1;
    v = strtoull(s, &end, 10);
    if (*end != '\0' || v == 0 || v > 100000000ULL)
        return 1;
    *out = (size_t)v;
    return 0;
}

static int parse_pos(const char *s, double *out)
{
    char *end;
    double v;
    if (!s || *s == '\0')
        return 1;
    v = strtod(s, &end);
    if (*end != '\0' || !(v > 0.0) || !(v < 1e6))
        return 1;
    *out = v;
    return 0;
}

static void usage(FILE *f)
{
    fprintf(f, "usage: transient_1d [--cells N] [--steps S] [--time T_s] "
               "[--out FILE]\n");
}

/* One run and its conservation numbers. */
typedef struct run_result {
    double *x;          /* final mole fractions, n_cells x NS */
    double extent;      /* reaction extent [mol/m^2] */
    double species_err; /* inert: max_i |dI_i|/I_i(0); reacting: max_i
                               |dI_i - nu_i extent| / sum I(0) */
    double element_err; /* max_e |dE_e| / E_e(0) */
    double sum_err;     /* max_k |sum_i x_ik - 1| */
    double seconds;
    size_t calls;
} run_result;

static int run_case(size_t n_cells, size_t n_steps, double t_end, int react,
                    mcd_model model, int per_face, fv1d_problem *p,
                    run_result *res)
{
    fv1d_solver s;
    double inv0[NS], inv1[NS], el0[FV1D_NE], el1[FV1D_NE], total0 = 0.0;
    double *x0;
    size_t i, k, e;
    clock_t t0;
    int rc = 1;

    memset(res, 0, sizeof *res);
    if (fv1d_problem_init(p, n_cells, n_steps, t_end, react, model, stderr))
        return 1;
    p->per_face = per_face;
    res->x = malloc(n_cells * NS * sizeof *res->x);
    x0 = malloc(n_cells * NS * sizeof *x0);
    if (!res->x || !x0) {
        fprintf(stderr, "transient_1d: out of memory\n");
        free(x0);
        fv1d_problem_free(p);
        return 1;
    }
    if (fv1d_solver_init(&s, p, n_cells, stderr)) {
        free(x0);
        fv1d_problem_free(p);
        return 1;
    }
    fv1d_initial(p, 0, n_cells, x0);
    t0 = clock();
    if (fv1d_run_serial(&s, p, res->x, &res->extent, stderr))
        goto done;
    res->seconds = (double)(clock() - t0) / CLOCKS_PER_SEC;
    res->calls = s.calls;

    fv1d_inventory(p, n_cells, x0, inv0);
    fv1d_inventory(p, n_cells, res->x, inv1);
    fv1d_elements(p, inv0, el0);
    fv1d_elements(p, inv1, el1);
    for (i = 0; i < NS; i++)
        total0 += inv0[i];
    for (i = 0; i < NS; i++) {
        double d =
            react ? fabs(inv1[i] - inv0[i] - p->nu[i] * res->extent) / total0
                  : fabs(inv1[i] - inv0[i]) / inv0[i];
        if (d > res->species_err)
            res->species_err = d;
    }
    for (e = 0; e < FV1D_NE; e++) {
        double d = fabs(el1[e] - el0[e]) / el0[e];
        if (d > res->element_err)
            res->element_err = d;
    }
    for (k = 0; k < n_cells; k++) {
        double sum = 0.0;
        for (i = 0; i < NS; i++)
            sum += res->x[k * NS + i];
        if (fabs(sum - 1.0) > res->sum_err)
            res->sum_err = fabs(sum - 1.0);
    }
    rc = 0;
done:
    fv1d_solver_free(&s);
    fv1d_problem_free(p); /* the numbers in *p stay valid */
    free(x0);
    return rc;
}

static double max_diff(size_t n, const double *a, const double *b)
{
    double d = 0.0;
    size_t k;
    for (k = 0; k < n; k++)
        if (fabs(a[k] - b[k]) > d)
            d = fabs(a[k] - b[k]);
    return d;
}

int main(int argc, char **argv)
{
    size_t n_cells = 50, n_steps = 0, i, k;
    double t_end = 0.2, tol;
    const char *out_path = NULL;
    fv1d_problem p;
    /* inert MS, inert MA, reacting MS, reacting MA (batched calls), and
     * reacting MS again with one single-state call per face. */
    run_result r[5];
    static const char *const label[5] = {
        "inert, Maxwell-Stefan", "inert, mixture-averaged",
        "reacting, Maxwell-Stefan", "reacting, mixture-averaged",
        "reacting, M-S, per-face calls"};
    double d_path;
    int a, c, fails = 0, rc = 1;

    for (a = 1; a < argc; a++) {
        const char *v = (a + 1 < argc) ? argv[a + 1] : NULL;
        if (strcmp(argv[a], "--cells") == 0) {
            if (parse_size(v, &n_cells)) {
                fprintf(stderr, "transient_1d: --cells needs a count\n");
                return 2;
            }
            a++;
        } else if (strcmp(argv[a], "--steps") == 0) {
            if (parse_size(v, &n_steps)) {
                fprintf(stderr, "transient_1d: --steps needs a count\n");
                return 2;
            }
            a++;
        } else if (strcmp(argv[a], "--time") == 0) {
            if (parse_pos(v, &t_end)) {
                fprintf(stderr, "transient_1d: --time needs seconds > 0\n");
                return 2;
            }
            a++;
        } else if (strcmp(argv[a], "--out") == 0) {
            if (!v) {
                fprintf(stderr, "transient_1d: --out needs a file name\n");
                return 2;
            }
            out_path = v;
            a++;
        } else if (strcmp(argv[a], "--help") == 0 ||
                   strcmp(argv[a], "-h") == 0) {
            usage(stdout);
            return 0;
        } else {
            usage(stderr);
            return 2;
        }
    }
    if (n_cells < 3) {
        fprintf(stderr, "transient_1d: need at least 3 cells\n");
        return 2;
    }
    memset(r, 0, sizeof r);
    for (c = 0; c < 5; c++)
        if (run_case(n_cells, n_steps, t_end, c >= 2,
                     (c % 2) ? MCD_MODEL_MIXTURE_AVERAGED
                             : MCD_MODEL_MAXWELL_STEFAN,
                     c == 4, &p, &r[c]))
            goto done;

    printf("transient_1d - INVENTED scenario, made-up numbers, for "
           "illustration only\n");
    printf("Closed 1-D gas gap, L = %.3g m, T = %.0f K, P = %.0f Pa, "
           "c = %.4g mol/m^3.\n",
           p.L, p.T, p.P, p.c);
    printf("Catalyst on cells %zu..%zu: CO + H2O -> CO2 + H2, "
           "r = k c_CO c_H2O, k = %g m^3/(mol s) (invented).\n",
           p.zone_lo, p.zone_hi - 1, p.k_rate);
    printf("%zu cells, %zu explicit steps of %.3g s to t = %.3g s\n"
           "(stable for D* = %.3g m^2/s; largest binary diffusivity "
           "%.3g m^2/s).\n",
           p.n_cells, p.n_steps, p.dt, p.t_end, p.D_star, p.D_max);
    printf("Fluxes: %zu batched library calls per run (one per step, all "
           "%zu faces),\n        or %zu single-state calls.\n\n",
           r[0].calls, n_cells - 1, r[4].calls);

    printf("Final mole fractions, reacting, Maxwell-Stefan "
           "(mixture-averaged minus exact in brackets):\n");
    printf("  %8s", "z [mm]");
    for (i = 0; i < NS; i++)
        printf(" %18s", p.short_names[i]);
    printf("\n");
    for (k = 0; k < n_cells; k += (n_cells >= 10 ? n_cells / 10 : 1)) {
        printf("  %8.3f", 1e3 * ((double)k + 0.5) * p.dz);
        for (i = 0; i < NS; i++)
            printf(" %7.4f (%+8.1e)", r[2].x[k * NS + i],
                   r[3].x[k * NS + i] - r[2].x[k * NS + i] + 0.0);
        printf("\n");
    }

    tol = 4.0 * (double)(p.n_steps + p.n_cells) * DBL_EPSILON;
    printf("\nConservation (tolerance %.2e = 4 (steps + cells) eps):\n", tol);
    printf("  %-30s %12s %12s %12s %9s\n", "run", "species", "elements",
           "|sum x - 1|", "cpu [s]");
    for (c = 0; c < 5; c++) {
        int ok = r[c].species_err <= tol && r[c].element_err <= tol &&
                 r[c].sum_err <= tol;
        printf("  %-30s %12.2e %12.2e %12.2e %9.3f %s\n", label[c],
               r[c].species_err, r[c].element_err, r[c].sum_err, r[c].seconds,
               ok ? "ok" : "FAILED");
        if (!ok)
            fails++;
    }
    printf("  (species: inert = max relative change of an inventory; "
           "reacting = max |change - nu_i extent| / total)\n");
    printf("Reaction extent: %.6e mol/m^2 (MS), %.6e mol/m^2 (MA).\n",
           r[2].extent, r[3].extent);
    printf("\nMaxwell-Stefan vs mixture-averaged, largest |x_MS - x_MA| at "
           "t = %.3g s:\n  inert %.3e, reacting %.3e\n",
           p.t_end, max_diff(n_cells * NS, r[0].x, r[1].x),
           max_diff(n_cells * NS, r[2].x, r[3].x));

    /* The batched and single-state paths solve the same equations; their
     * fluxes differ by round-off (~1e-16 relative), which can accumulate
     * at most linearly over the steps (1e4 x 1e-16 = 1e-12), so 1e-10 is a
     * safe bound for "the same solution". */
    d_path = max_diff(n_cells * NS, r[2].x, r[4].x);
    printf("Batched vs single-state calls (reacting M-S): largest |dx| = "
           "%.3e (bound 1e-10), cpu %.3f s vs %.3f s.\n",
           d_path, r[2].seconds, r[4].seconds);
    if (!(d_path <= 1e-10)) {
        fprintf(stderr,
                "transient_1d: batched and single-state results "
                "differ by %.3e\n",
                d_path);
        fails++;
    }

    if (out_path) {
        FILE *f = fopen(out_path, "w");
        if (!f) {
            fprintf(stderr, "transient_1d: cannot write %s\n", out_path);
            goto done;
        }
        fprintf(f, "# z_m");
        for (i = 0; i < NS; i++)
            fprintf(f, " x_%s", p.short_names[i]);
        fprintf(f, "\n");
        for (k = 0; k < n_cells; k++) {
            fprintf(f, "%.17g", ((double)k + 0.5) * p.dz);
            for (i = 0; i < NS; i++)
                fprintf(f, " %.17g", r[2].x[k * NS + i]);
            fprintf(f, "\n");
        }
        if (fclose(f) != 0) {
            fprintf(stderr, "transient_1d: error writing %s\n", out_path);
            goto done;
        }
    }
    if (fails) {
        fprintf(stderr, "transient_1d: %d check(s) failed\n", fails);
        goto done;
    }
    printf("All checks passed.\n");
    rc = 0;
done:
    for (c = 0; c < 5; c++)
        free(r[c].x);
    return rc;
}
