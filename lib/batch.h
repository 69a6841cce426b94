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

/* Most lanes per block of any kernel (scratch is sized for it). The lanes
 * actually used depend on the instruction set chosen at run time
 * (mcdi_batch_lanes): 8 with AVX-512, 4 with AVX2, 2 otherwise, i.e. one
 * vector register per lane vector. Above MCDI_LANES_NMAX species one cell
 * at a time (lanes = 1) with LAPACK's blocked Cholesky for the exact
 * model. */
#define MCDI_LANES 8
#define MCDI_LANES_NMAX 128

/* One batched call, as the kernel sees it (inputs SoA with stride K). */
typedef struct mcdi_bjob {
    size_t n, nd, K;
    int model;                 /* mcd_model */
    int comp_basis, flux_basis;
    const mcd_mixture *mix;    /* mixture mode (T, P used) or NULL */
    int mix_has_omega;         /* some pair of mix needs Omega_D(T) (CE/WL) */
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

/* Process cells k0 .. k0+nv-1 (1 <= nv <= mcdi_batch_lanes(n)) of the job.
 * mem: scratch of mcdi_batch_scratch_doubles(n) doubles, 64-byte aligned.
 * Writes the block's outputs unless res->st != MCD_OK. Dispatches to the
 * kernel of the instruction set chosen at run time (kernel_isa.c). */
void mcdi_batch_block(const mcdi_bjob *job, size_t k0, size_t nv, double *mem,
                      mcdi_bres *res);

/* Lanes used for n species by the kernel chosen at run time. */
size_t mcdi_batch_lanes(size_t n);

/* The kernels, one object of batch_kernel.c per instruction set:
 * v4 (x86-64-v4: AVX-512, 8 lanes), v3 (x86-64-v3: AVX2 + FMA, 4 lanes),
 * v1 (the compiler's baseline, 2 lanes; the only one off x86-64 or
 * without GCC). */
void mcdi_batch_block_v4(const mcdi_bjob *job, size_t k0, size_t nv,
                         double *mem, mcdi_bres *res);
void mcdi_batch_block_v3(const mcdi_bjob *job, size_t k0, size_t nv,
                         double *mem, mcdi_bres *res);
void mcdi_batch_block_v1(const mcdi_bjob *job, size_t k0, size_t nv,
                         double *mem, mcdi_bres *res);
/* Lanes of each kernel object (the doubles in its vector registers). */
extern const size_t mcdi_batch_lanes_v4, mcdi_batch_lanes_v3,
    mcdi_batch_lanes_v1;

#endif
