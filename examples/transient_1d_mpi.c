/* transient_1d_mpi.c - the solver of transient_1d.c split across MPI ranks.
 *
 * DEMO ONLY: the invented scenario of fv1d.c (see there for the model).
 *
 * The cells are cut into contiguous blocks, one per rank. Every rank keeps
 * one ghost cell on each side; before each step the ranks swap their edge
 * compositions with their neighbours (MPI_Sendrecv), then compute the
 * fluxes of all faces of their block with the library and update their
 * cells. A face on a block boundary is computed by both neighbouring ranks
 * from the same two compositions in the same order of operations, so both
 * get the same bits and the result equals the serial one exactly.
 *
 * Rank 0 gathers the final compositions, runs the same problem serially in
 * the same process, and compares: the test passes when every mole fraction
 * is bitwise identical (it also prints the largest difference) and the
 * element inventories of the gathered result are conserved to the round-off
 * bound of transient_1d.c. Both the Maxwell-Stefan and the mixture-averaged
 * reacting runs are checked.
 *
 * Usage: mpirun -np P transient_1d_mpi [--cells N] [--steps S] [--time T]
 * Exit status: 0 identical and conserved, 1 otherwise, 2 usage error.
 */
#include <float.h>
#include <math.h>
#include <mpi.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>
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

/* Parse argv; 0 ok, 1 help printed, 2 usage error. */
static int parse_args(int argc, char **argv, int rank, size_t *n_cells,
                      size_t *n_steps, double *t_end)
{
    int a;
    for (a = 1; a < argc; a++) {
        const char *v = (a + 1 < argc) ? argv[a + 1] : NULL;
        int bad = 0;
        if (strcmp(argv[a], "--cells") == 0)
            bad = parse_size(v, n_cells), a++;
        else if (strcmp(argv[a], "--steps") == 0)
            bad = parse_size(v, n_steps), a++;
        else if (strcmp(argv[a], "--time") == 0)
            bad = parse_pos(v, t_end), a++;
        else if (strcmp(argv[a], "--help") == 0 || strcmp(argv[a], "-h") == 0) {
            if (rank == 0)
                printf("usage: mpirun -np P transient_1d_mpi [--cells N] "
                       "[--steps S] [--time T_s]\n");
            return 1;
        } else
            bad = 1;
        if (bad) {
            if (rank == 0)
                fprintf(stderr, "usage: mpirun -np P transient_1d_mpi "
                                "[--cells N] [--steps S] [--time T_s]\n");
            return 2;
        }
    }
    return 0;
}

/* Cells [first, first + n) of rank r out of size, n >= 1 when
 * n_cells >= size. */
static void block(size_t n_cells, int size, int r, size_t *first, size_t *n)
{
    size_t q = n_cells / (size_t)size, m = n_cells % (size_t)size;
    size_t ur = (size_t)r;
    *n = q + (ur < m ? 1 : 0);
    *first = ur * q + (ur < m ? ur : m);
}

/* Run one reacting case in parallel and, on rank 0, compare it with a
 * serial run. Returns 0 if identical and conserved (on rank 0; other ranks
 * return 0), 1 otherwise. Library failures abort the job. */
static int run_and_compare(size_t n_cells, size_t n_steps, double t_end,
                           mcd_model model, int rank, int size)
{
    fv1d_problem p;
    fv1d_solver s;
    size_t first, n_local, step, k;
    double *x, *all = NULL, *ser = NULL, *x0 = NULL, extent = 0.0;
    double extent_all = 0.0, extent_ser = 0.0, t_par, t_ser = 0.0;
    int left = rank > 0 ? rank - 1 : MPI_PROC_NULL;
    int right = rank < size - 1 ? rank + 1 : MPI_PROC_NULL;
    int *counts = NULL, *displs = NULL, rc = 0;
    const int tag_l = 11, tag_r = 12;

    if (fv1d_problem_init(&p, n_cells, n_steps, t_end, 1, model, stderr))
        MPI_Abort(MPI_COMM_WORLD, 1);
    block(n_cells, size, rank, &first, &n_local);
    x = calloc((n_local + 2) * NS, sizeof *x);
    if (!x || fv1d_solver_init(&s, &p, n_local, stderr))
        MPI_Abort(MPI_COMM_WORLD, 1);
    fv1d_initial(&p, first, n_local, x + NS);

    MPI_Barrier(MPI_COMM_WORLD);
    t_par = MPI_Wtime();
    for (step = 0; step < p.n_steps; step++) {
        /* Halo exchange: my first cell to the left neighbour's right ghost,
         * my last cell to the right neighbour's left ghost. */
        MPI_Sendrecv(x + NS, NS, MPI_DOUBLE, left, tag_l,
                     x + (n_local + 1) * NS, NS, MPI_DOUBLE, right, tag_l,
                     MPI_COMM_WORLD, MPI_STATUS_IGNORE);
        MPI_Sendrecv(x + n_local * NS, NS, MPI_DOUBLE, right, tag_r, x, NS,
                     MPI_DOUBLE, left, tag_r, MPI_COMM_WORLD,
                     MPI_STATUS_IGNORE);
        if (fv1d_step(&s, &p, first, n_local, left != MPI_PROC_NULL,
                      right != MPI_PROC_NULL, x, &extent, stderr))
            MPI_Abort(MPI_COMM_WORLD, 1);
    }
    t_par = MPI_Wtime() - t_par;

    if (rank == 0) {
        int r;
        counts = malloc((size_t)size * sizeof *counts);
        displs = malloc((size_t)size * sizeof *displs);
        all = malloc(n_cells * NS * sizeof *all);
        ser = malloc(n_cells * NS * sizeof *ser);
        x0 = malloc(n_cells * NS * sizeof *x0);
        if (!counts || !displs || !all || !ser || !x0)
            MPI_Abort(MPI_COMM_WORLD, 1);
        for (r = 0; r < size; r++) {
            size_t f, n;
            block(n_cells, size, r, &f, &n);
            counts[r] = (int)(n * NS);
            displs[r] = (int)(f * NS);
        }
    }
    MPI_Gatherv(x + NS, (int)(n_local * NS), MPI_DOUBLE, all, counts, displs,
                MPI_DOUBLE, 0, MPI_COMM_WORLD);
    MPI_Reduce(&extent, &extent_all, 1, MPI_DOUBLE, MPI_SUM, 0, MPI_COMM_WORLD);

    if (rank == 0) {
        fv1d_solver s_ser;
        double inv0[NS], inv1[NS], el0[FV1D_NE], el1[FV1D_NE];
        double dmax = 0.0, el_err = 0.0, tol;
        size_t n_diff = 0, e;
        if (fv1d_solver_init(&s_ser, &p, n_cells, stderr))
            MPI_Abort(MPI_COMM_WORLD, 1);
        t_ser = MPI_Wtime();
        if (fv1d_run_serial(&s_ser, &p, ser, &extent_ser, stderr))
            MPI_Abort(MPI_COMM_WORLD, 1);
        t_ser = MPI_Wtime() - t_ser;
        fv1d_solver_free(&s_ser);
        for (k = 0; k < n_cells * NS; k++) {
            if (memcmp(&all[k], &ser[k], sizeof(double)) != 0)
                n_diff++;
            if (fabs(all[k] - ser[k]) > dmax)
                dmax = fabs(all[k] - ser[k]);
        }
        fv1d_initial(&p, 0, n_cells, x0);
        fv1d_inventory(&p, n_cells, x0, inv0);
        fv1d_inventory(&p, n_cells, all, inv1);
        fv1d_elements(&p, inv0, el0);
        fv1d_elements(&p, inv1, el1);
        for (e = 0; e < FV1D_NE; e++)
            if (fabs(el1[e] - el0[e]) / el0[e] > el_err)
                el_err = fabs(el1[e] - el0[e]) / el0[e];
        /* Same a-priori round-off bound as transient_1d.c. */
        tol = 4.0 * (double)(p.n_steps + p.n_cells) * DBL_EPSILON;
        printf("%-18s %zu ranks: %zu of %zu mole fractions differ from the "
               "serial run, largest difference %.3e\n",
               model == MCD_MODEL_MAXWELL_STEFAN ? "Maxwell-Stefan"
                                                 : "mixture-averaged",
               (size_t)size, n_diff, n_cells * NS, dmax);
        printf("%-18s element balance error %.2e (tolerance %.2e), extent "
               "%.9e vs serial %.9e mol/m^2\n",
               "", el_err, tol, extent_all, extent_ser);
        printf("%-18s wall time: parallel %.3f s, serial %.3f s\n", "", t_par,
               t_ser);
        if (n_diff != 0 || !(el_err <= tol))
            rc = 1;
    }
    fv1d_solver_free(&s);
    fv1d_problem_free(&p);
    free(x);
    free(all);
    free(ser);
    free(x0);
    free(counts);
    free(displs);
    return rc;
}

int main(int argc, char **argv)
{
    int rank, size, prc, rc = 0;
    size_t n_cells = 50, n_steps = 0;
    double t_end = 0.2;

    MPI_Init(&argc, &argv);
    MPI_Comm_rank(MPI_COMM_WORLD, &rank);
    MPI_Comm_size(MPI_COMM_WORLD, &size);

    prc = parse_args(argc, argv, rank, &n_cells, &n_steps, &t_end);
    if (prc != 0) {
        MPI_Finalize();
        return prc == 1 ? 0 : 2;
    }
    if (n_cells < (size_t)size || n_cells < 3) {
        if (rank == 0)
            fprintf(stderr,
                    "transient_1d_mpi: need at least max(3, ranks) "
                    "cells, got %zu for %d ranks\n",
                    n_cells, size);
        MPI_Finalize();
        return 2;
    }
    if (rank == 0)
        printf("transient_1d_mpi - INVENTED scenario (see fv1d.c), %zu "
               "cells on %d ranks, reacting runs\n",
               n_cells, size);
    rc |= run_and_compare(n_cells, n_steps, t_end, MCD_MODEL_MAXWELL_STEFAN,
                          rank, size);
    rc |= run_and_compare(n_cells, n_steps, t_end, MCD_MODEL_MIXTURE_AVERAGED,
                          rank, size);
    /* Every rank exits with rank 0's verdict. */
    MPI_Bcast(&rc, 1, MPI_INT, 0, MPI_COMM_WORLD);
    if (rank == 0)
        printf(rc == 0 ? "Parallel runs identical to serial and conserved.\n"
                       : "MISMATCH between parallel and serial runs.\n");
    MPI_Finalize();
    return rc;
}
