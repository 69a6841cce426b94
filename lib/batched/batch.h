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
#include "base/lanes.h" /* MCDI_LANES */

/* Lanes per block: at most MCDI_LANES (base/lanes.h; scratch is sized for
 * it). The lanes actually used depend on the instruction set chosen at
 * run time (mcdi_batch_lanes): 8 with AVX-512, 4 with AVX2, 2 otherwise,
 * i.e. one vector register per lane vector. Above MCDI_LANES_NMAX species
 * one cell at a time (lanes = 1), through the same stages. */
#define MCDI_LANES_NMAX 128

/* Up to this many species the kernel runs full blocks of the exact model
 * (Đ per cell, mole fluxes) two at a time, stage by stage (body2 in
 * batch_kernel.c), so a thread's scratch holds two such blocks
 * (mcdi_batch_scratch_doubles). 0 turns it off (for A/B timings).
 * 4: with the grounded form (kernel_ldl.h), on an AMD EPYC host with
 * AVX-512 (tools/anchor.sh, ratio to the reference, medians of 4
 * alternating runs, in cache): pairs up to 5 against up to 3 gave N = 4
 * 0.26 -> 0.30 (streamed 0.61-0.62 -> 0.66, 2 runs) and N = 5 0.295 ->
 * 0.32 in cache but 0.53-0.57 -> 0.49-0.51 streamed (3 runs); N = 2 and
 * 3 lose 0.20-0.21 and 0.26 without pairs, against 0.25 and 0.27. */
#ifndef MCDI_PAIR_NMAX
#define MCDI_PAIR_NMAX 4
#endif

/* The staggered prefetch of SoA rows (batch.c, stagger_choice) and the
 * prefetch into L2 only (pf_l2): at least this many species (a
 * compile-time constant of the kernels, so that the small-n instances
 * fold it away) and input rows per cell. */
#define MCDI_STAG_NMIN 7
#define MCDI_STAG_ROWS 72

/* One batched call, as the kernel sees it. Every per-cell array (inputs
 * and out) is in the call's layout: SoA (row q of cell k at q K + k) or
 * tiled (MCD_LAYOUT_TILED8: at (k - k%8) Q + 8 q + k%8 for an array of Q
 * rows); mcdi_cell_at gives where a cell's row 0 lies, rs the distance
 * between rows, so the kernels address both with one rule. */
typedef struct mcdi_bjob {
    size_t n, nd, K;
    size_t rs;   /* row stride: K (SoA) or 8 (tiled) */
    int tiled;   /* MCD_LAYOUT_TILED8 */
    int pf_l2;   /* prefetch the inputs into L2, not L1 (kernel_lanes.h,
                  * pf_of; batch.c, run_soa) */
    int stagger; /* stagger the prefetches of the SoA rows (kernel_lanes.h,
                  * pf_stagger; batch.c, stagger_choice) */
    int model;   /* mcd_model */
    int comp_basis, flux_basis;
    const mcd_mixture *mix; /* mixture mode (T, P used) or NULL */
    int mix_has_omega; /* some pair of mix needs Omega_D(T) (CE/WL/Brokaw) */
    const double *T, *P;
    const double *Dij, *c; /* per-cell mode */
    int dij_upper;         /* read the upper triangle of Dij only
                            * (MCD_DIJ_READ_UPPER) */
    const double *M;       /* molar masses or NULL when not needed */
    const double *comp, *grad, *glnP;
    const double *kT, *glnT; /* thermal diffusion: both or neither */
    double *out;
    int stream; /* stream full output lines past the caches
                                * (kernels that can: v4; see batch.c) */
    size_t max_iter;
    double tol;
    int cut; /* stage profile (tests/bench_stages.c): a block returns after
              * its stage number `cut` without writing outputs; 0 = run all
              * (copied from the workspace's stage_cut, never set by a
              * public call) */
} mcdi_bjob;

/* Index of row 0 of cell k in an array of Q rows of the job's layout
 * (row q at + q rs). Blocks never straddle a tile: L divides 8 (or is 1). */
static inline size_t mcdi_cell_at(const mcdi_bjob *jb, size_t k, size_t Q)
{
    return jb->tiled ? (k & ~(size_t)7) * Q + (k & 7) : k;
}

/* Outcome of one block. */
typedef struct mcdi_bres {
    mcd_status st;    /* MCD_OK or the failure */
    size_t lane;      /* failing lane (when st != MCD_OK) */
    const char *what; /* static text naming the failure (results) */
    int recheck;      /* an input of some lane breaks a rule: batch.c
                            * names the first bad cell (mcdi_batch_recheck) */
    double iter_err;  /* largest iterative error estimate */
    size_t iter_used; /* largest number of iterations */
} mcdi_bres;

/* Streaming stores. With job->stream set, the v4 kernel writes each
 * output row of a full mole-basis block as whole 64-byte lines with
 * non-temporal stores (no read of the line first, no eviction of the
 * inputs): the values of a row that do not fill its line yet wait in a
 * per-thread carry at the front of the thread's scratch and go out with
 * the next block's. State and carry: MCDI_STREAM_DOUBLES doubles at the
 * front of every thread's scratch; the block scratch follows. A thread
 * resets the state before its first block (mcdi_batch_stream_reset) and
 * calls mcdi_batch_finish after its last one (writes what is held back,
 * then a store fence). Kernels without streaming ignore both. */
#define MCDI_STREAM_DOUBLES (8 + MCDI_LANES_NMAX * MCD_MAX_DIM * MCDI_LANES)
typedef struct mcdi_stream_state {
    size_t pending; /* a carry is held for the block before next_k0 */
    size_t next_k0; /* first cell of the block that can continue it */
} mcdi_stream_state;
static inline void mcdi_batch_stream_reset(double *mem)
{
    ((mcdi_stream_state *)(void *)mem)->pending = 0;
}
void mcdi_batch_finish(const mcdi_bjob *job, double *mem);
void mcdi_batch_finish_v4(const mcdi_bjob *job, double *mem);
void mcdi_batch_finish_v3(const mcdi_bjob *job, double *mem);
void mcdi_batch_finish_v1(const mcdi_bjob *job, double *mem);
/* Whether a call whose inputs and outputs take `bytes` should stream its
 * outputs (kernel_isa.c: the last-level cache size, MCDIFF_STREAM_STORES). */
int mcdi_batch_stream_choice(size_t bytes);
/* Whether a call of this many bytes read and written is at least the
 * last-level cache (the size mcdi_batch_stream_choice compares with). */
int mcdi_batch_beyond_cache(size_t bytes);

/* Doubles of scratch one thread needs for any call with n <= cap: the
 * streaming state, a block's scratch and the AoS staging, both laid out
 * by batch_layout.h (batch.c). */
size_t mcdi_batch_scratch_doubles(size_t cap);

/* The argument checks every batched call starts with (batch.c): ws,
 * cells, n, n_dim, model, bases, comp, grad, the output (named out_name)
 * and the thermal pair. */
mcd_status mcdi_batch_check_common(mcd_workspace *ws, mcd_model model, size_t n,
                                   const mcd_cells *cl, mcd_basis flux_basis,
                                   const double *out, const char *out_name);
/* cells->layout: a known layout, and SoA unless the call (named `call`)
 * takes the tiled one too (tiled_ok). */
mcd_status mcdi_batch_check_layout(const mcd_cells *cl, int tiled_ok,
                                   const char *call);

/* Process cells k_begin .. k_end-1 of the job in blocks of
 * mcdi_batch_lanes(n) cells from k_begin (the last one may be short),
 * with the block loop inside the kernel (the calls and dispatch of one
 * block were a tenth of the instructions of a block at N = 3). Stops at
 * the first block whose res->st != MCD_OK and returns its first cell
 * (res names the failure); otherwise returns k_end, with res->st == MCD_OK
 * and res->iter_err, res->iter_used the largest over the blocks (NaN
 * wins). mem: scratch of mcdi_batch_scratch_doubles(n) doubles, 64-byte
 * aligned. Writes the outputs of every block before the failing one.
 * Dispatches to the kernel of the instruction set chosen at run time
 * (kernel_isa.c). */
size_t mcdi_batch_blocks(const mcdi_bjob *job, size_t k_begin, size_t k_end,
                         double *mem, mcdi_bres *res);

/* The larger error estimate (NaN wins) and iteration count of two. */
static inline void mcdi_merge_iter(double *err, size_t *used, double e,
                                   size_t u)
{
    if (e > *err || e != e)
        *err = e;
    if (u > *used)
        *used = u;
}

/* Lanes used for n species by the kernel chosen at run time. */
size_t mcdi_batch_lanes(size_t n);

/* The kernels, one object of batch_kernel.c per instruction set:
 * v4 (x86-64-v4: AVX-512, 8 lanes), v3 (x86-64-v3: AVX2 + FMA, 4 lanes),
 * v1 (the compiler's baseline, 2 lanes; the only one off x86-64 or
 * without GCC). */
size_t mcdi_batch_blocks_v4(const mcdi_bjob *job, size_t k_begin, size_t k_end,
                            double *mem, mcdi_bres *res);
size_t mcdi_batch_blocks_v3(const mcdi_bjob *job, size_t k_begin, size_t k_end,
                            double *mem, mcdi_bres *res);
size_t mcdi_batch_blocks_v1(const mcdi_bjob *job, size_t k_begin, size_t k_end,
                            double *mem, mcdi_bres *res);
/* Lanes of each kernel object (the doubles in its vector registers). */
extern const size_t mcdi_batch_lanes_v4, mcdi_batch_lanes_v3,
    mcdi_batch_lanes_v1;

/* MCD_MODEL_ITERATIVE for one state (mcd_flux_compute): the molar fluxes
 * J (n x nd) from mole fractions x and driving forces d, as a batched call
 * of one cell (the layouts coincide for K = 1); the workspace's iteration
 * outcome is that call's. Inputs already validated. An mcdi_state_solver
 * (flux/flux_core.h). */
mcd_status mcdi_batch_iterate_one(mcd_workspace *ws, size_t n, size_t nd,
                                  const double *x, const double *d,
                                  const double *Dij, double c, double *J);

#endif
