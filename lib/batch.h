/* batch.h - private interface between the batched driver (batch.c) and the
 * lane kernels (batch_kernel.c). Never installed.
 *
 * A "block" is up to `lanes` consecutive cells processed together: every
 * per-species quantity is held in scratch as lanes contiguous doubles
 * ([element][lane]), so that each arithmetic step is a loop over lanes
 * that the compiler vectorises (SSE2 / AVX2 / AVX-512 clones chosen at run
 * time). Blocks are fixed by cell index, so a cell's result never depends
 * on the thread count.
 */
#ifndef MCD_BATCH_H
#define MCD_BATCH_H

#include <stddef.h>
#include "mcdiff.h"

/* Lanes per block for N <= MCDI_LANES_NMAX; above that one cell at a time
 * (lanes = 1) with LAPACK's blocked Cholesky for the exact model. */
#define MCDI_LANES 8
#define MCDI_LANES_NMAX 128

/* One batched call, as the kernel sees it (inputs SoA with stride K). */
typedef struct mcdi_bjob {
    size_t n, nd, K;
    int model;                 /* mcd_model */
    int comp_basis, flux_basis;
    const mcd_mixture *mix;    /* mixture mode (T, P used) or NULL */
    const double *T, *P;
    const double *Dij, *c;     /* per-cell mode */
    const double *M;           /* molar masses or NULL when not needed */
    const double *comp, *grad, *glnP;
    double *out;
    size_t max_iter;
    double tol;
} mcdi_bjob;

/* Outcome of one block. */
typedef struct mcdi_bres {
    mcd_status st;         /* MCD_OK or the failure */
    size_t lane;           /* failing lane (when st != MCD_OK) */
    const char *what;      /* static text naming the failing input */
    double iter_err;       /* largest iterative error estimate */
    size_t iter_used;      /* largest number of iterations */
} mcdi_bres;

/* Doubles of scratch one thread needs for any call with n <= cap. */
size_t mcdi_batch_scratch_doubles(size_t cap);

/* Process cells k0 .. k0+nv-1 (1 <= nv <= lanes for this n) of the job.
 * mem: scratch of mcdi_batch_scratch_doubles(n) doubles, 64-byte aligned.
 * Writes the block's outputs unless res->st != MCD_OK. */
void mcdi_batch_block(const mcdi_bjob *job, size_t k0, size_t nv, double *mem,
                      mcdi_bres *res);

/* Lanes used for n species. */
static inline size_t mcdi_batch_lanes(size_t n)
{
    return n <= MCDI_LANES_NMAX ? MCDI_LANES : 1;
}

#endif
