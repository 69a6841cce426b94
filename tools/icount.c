/* icount.c - count the instructions one call of the library executes, by
 * single-stepping it under ptrace (Linux, x86-64): for hosts whose
 * virtual machine offers no hardware performance counters. Slow (a few
 * microseconds a step) but exact, and the same on every run.
 *
 * The call is mcd_flux_batch_dij (exact Maxwell-Stefan, mole basis, 3
 * directions, SoA, per-cell Dij and c; the shared reference kernel's
 * work) on K cells of N species, or mcd_flux_compute on one of them
 * ("single"). The states are random but valid (every x_i > 0,
 * gradients summing to zero, symmetric Dij). The call runs three times
 * untraced first (page faults, lazy binding, the cached ISA choice).
 *
 *   built by meson as build/tests/icount (Linux, x86-64)
 *   usage: build/tests/icount batched|single N K [RIPFILE]
 * Exit 77 where ptrace is not allowed (the test `icount` then skips).
 * Prints the instructions of the traced call. With RIPFILE, writes the
 * address of every instruction (hex, one a line) there and the child's
 * memory map to RIPFILE.maps; tools/icount_report.py turns them into
 * counts per stage of the kernel or per source line. The instructions of
 * a block are the difference of two counts (K and K + 8 cells), which
 * removes the call's fixed cost. */
#define _GNU_SOURCE
#include <signal.h>
#include <stdint.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>
#include <sys/ptrace.h>
#include <sys/user.h>
#include <sys/wait.h>
#include <unistd.h>

#include "mcdiff.h"

static uint64_t rng = 0x1C0u;
static double u01(void)
{
    rng = rng * 6364136223846793005ull + 1442695040888963407ull;
    return (double)(rng >> 11) * 0x1.0p-53;
}

/* The traced process: build the cells, warm up, stop, call, stop. */
static void child(int single, size_t N, size_t K)
{
    mcd_workspace *ws = NULL;
    double *x = malloc(sizeof(double) * N * K);
    double *g = malloc(sizeof(double) * N * 3 * K);
    double *D = malloc(sizeof(double) * N * N * K);
    double *c = malloc(sizeof(double) * K);
    double *J = malloc(sizeof(double) * N * 3 * K);
    double *x1 = malloc(sizeof(double) * N),
           *g1 = malloc(sizeof(double) * N * 3);
    double *D1 = malloc(sizeof(double) * N * N);
    size_t i, j, k, d;
    mcd_status st;
    int r;
    if (!x || !g || !D || !c || !J || !x1 || !g1 || !D1 ||
        mcd_workspace_new(N, &ws) != MCD_OK)
        _exit(3);
    for (k = 0; k < K; k++) {
        double s = 0.0;
        c[k] = 30.0 + 20.0 * u01();
        for (i = 0; i < N; i++)
            s += x[i * K + k] = 0.05 + u01();
        for (i = 0; i < N; i++)
            x[i * K + k] /= s;
        for (d = 0; d < 3; d++) {
            double gs = 0.0;
            for (i = 0; i < N; i++) {
                double v = i + 1 == N ? -gs : u01() - 0.5;
                g[(i * 3 + d) * K + k] = v;
                gs += v;
            }
        }
        for (i = 0; i < N; i++)
            for (j = i; j < N; j++)
                D[(i * N + j) * K + k] = D[(j * N + i) * K + k] =
                    1e-5 * (0.2 + u01());
    }
    for (i = 0; i < N; i++)
        x1[i] = x[i * K];
    for (i = 0; i < N * 3; i++)
        g1[i] = g[i * K];
    for (i = 0; i < N * N; i++)
        D1[i] = D[i * K];
    {
        const mcd_cells cl = {.n_cells = K,
                              .n_dim = 3,
                              .comp_basis = MCD_BASIS_MOLE,
                              .comp = x,
                              .grad = g};
        const mcd_state one = {.n_species = N,
                               .n_dim = 3,
                               .comp_basis = MCD_BASIS_MOLE,
                               .c = c[0],
                               .Dij = D1,
                               .comp = x1,
                               .grad = g1};
        for (r = 0; r < 4; r++) {
            if (r == 3)
                raise(SIGSTOP); /* the tracer steps from here */
            st = single
                     ? mcd_flux_compute(ws, MCD_MODEL_MAXWELL_STEFAN, &one,
                                        MCD_BASIS_MOLE, J)
                     : mcd_flux_batch_dij(ws, MCD_MODEL_MAXWELL_STEFAN, N, NULL,
                                          D, c, &cl, MCD_BASIS_MOLE, J);
            if (r == 3)
                raise(SIGSTOP); /* to here */
            if (st != MCD_OK)
                _exit(4);
        }
    }
    _exit(0);
}

static int usage(void)
{
    fprintf(stderr,
            "usage: icount batched|single N K [RIPFILE]\n"
            "  N species (1..%d), K cells (>= 1)\n",
            MCD_MAX_SPECIES);
    return 2;
}

int main(int argc, char **argv)
{
    int single, status;
    long N, K, steps = 0;
    FILE *rip = NULL;
    pid_t pid;
    if (argc < 4 || argc > 5)
        return usage();
    if (strcmp(argv[1], "batched") != 0 && strcmp(argv[1], "single") != 0)
        return usage();
    single = strcmp(argv[1], "single") == 0;
    N = strtol(argv[2], NULL, 10);
    K = strtol(argv[3], NULL, 10);
    if (N < 1 || N > MCD_MAX_SPECIES || K < 1)
        return usage();
    if (argc == 5 && (rip = fopen(argv[4], "w")) == NULL) {
        perror(argv[4]);
        return 1;
    }
    pid = fork();
    if (pid < 0) {
        perror("fork");
        return 1;
    }
    if (pid == 0) {
        if (ptrace(PTRACE_TRACEME, 0, NULL, NULL) != 0)
            _exit(5);
        child(single, (size_t)N, (size_t)K);
    }
    if (waitpid(pid, &status, 0) < 0)
        return 1;
    if (WIFEXITED(status) && WEXITSTATUS(status) == 5) {
        fprintf(stderr, "icount: ptrace is not allowed here\n");
        return 77; /* skipped, for meson test */
    }
    if (!WIFSTOPPED(status)) {
        fprintf(stderr, "icount: the child did not stop (status %d)\n", status);
        return 1;
    }
    if (rip != NULL) { /* the map, for the addresses of the library */
        char path[64], mpath[4096], line[1024];
        FILE *in, *out;
        snprintf(path, sizeof path, "/proc/%d/maps", (int)pid);
        snprintf(mpath, sizeof mpath, "%s.maps", argv[4]);
        in = fopen(path, "r");
        out = fopen(mpath, "w");
        if (in == NULL || out == NULL) {
            fprintf(stderr, "icount: cannot copy %s to %s\n", path, mpath);
            return 1;
        }
        while (fgets(line, sizeof line, in) != NULL)
            fputs(line, out);
        fclose(in);
        fclose(out);
    }
    for (;;) {
        struct user_regs_struct regs;
        if (ptrace(PTRACE_SINGLESTEP, pid, NULL, NULL) != 0 ||
            waitpid(pid, &status, 0) < 0) {
            perror("icount: ptrace");
            return 1;
        }
        if (!WIFSTOPPED(status)) {
            fprintf(stderr, "icount: the call failed (child status %d)\n",
                    status);
            return 1;
        }
        if (WSTOPSIG(status) == SIGSTOP)
            break;
        if (rip != NULL) {
            if (ptrace(PTRACE_GETREGS, pid, NULL, &regs) != 0) {
                perror("icount: ptrace");
                return 1;
            }
            fprintf(rip, "%llx\n", (unsigned long long)regs.rip);
        }
        steps++;
    }
    if (rip != NULL)
        fclose(rip);
    ptrace(PTRACE_CONT, pid, NULL, NULL);
    waitpid(pid, &status, 0);
    printf("%s N = %ld, K = %ld: %ld instructions\n", argv[1], N, K, steps);
    return WIFEXITED(status) && WEXITSTATUS(status) == 0 ? 0 : 1;
}
