/* workspace.h - private view of struct mcd_workspace. Never installed.
 *
 * A workspace owns every scratch array that the flux core (maxwell_stefan.c,
 * ms_ldl.c, fick.c) and the transfer layer need for up to `cap` species, so
 * that no per-state call allocates. All memory is obtained at
 * mcd_workspace_new time through the workspace's allocator.
 *
 * Two banks of scratch exist:
 *
 *  - the CORE bank (core_mem, core_int), used only inside one call of
 *    mcd_flux_compute / mcd_fick_matrix / mcd_fick_eigenvalues, laid out
 *    by name in flux/core_layout.h. Its contents are garbage between
 *    calls. Other modules must not use it.
 *
 *  - the TRANSFER bank (tf_mem, tf_ipiv), used by the transfer layer
 *    only, laid out by name in transfer/tf_layout.h (which also sizes it
 *    for the constructor, api/workspace_new.c). The flux core never
 *    touches it, so a transfer call may keep data there while it calls
 *    mcd_flux_compute or mcd_fick_matrix on the same workspace.
 *
 *  - the LIQUID bank (liq_mem), used by mcd_liquid_eval and its callers
 *    (and by mcd_liquid_flux_batch for one gathered cell), laid out by
 *    name in liquid/liq_layout.h.
 *  - the POROUS bank (pm_mem), used by the porous-media layer only
 *    (Dusty Gas Model), laid out by name in porous/pm_layout.h. It holds
 *    nothing between calls.
 *
 *  - the BATCH bank (batch_*), per-thread block scratch of the batched
 *    calls, laid out by batched/batch_layout.h.
 *
 *  - the dgeev work array (mcdi_ws_geev_work) is sized at alloc time by a
 *    workspace query for n = cap with right eigenvectors requested (the
 *    larger of the two job kinds), so a module may call
 *    LAPACKE_dgeev_work(LAPACK_COL_MAJOR, 'N', 'V' or 'N', n <= cap, ...)
 *    with it. It is plain scratch inside one LAPACK call: it holds nothing
 *    between calls, and mcd_fick_eigenvalues uses it too.
 *
 * LAPACKE note: the *_work functions with LAPACK_ROW_MAJOR allocate a
 * transposed copy internally. Call them with LAPACK_COL_MAJOR (symmetric
 * matrices are the same in both layouts; store or transpose others).
 */
#ifndef MCD_WORKSPACE_H
#define MCD_WORKSPACE_H

#include <stddef.h>
#include "mcdiff.h"

struct mcd_workspace {
    size_t cap;       /* species capacity, 1..MCD_MAX_SPECIES */
    mcd_allocator al; /* copy of the caller's allocator */

    /* CORE bank (flux core only) */
    double *core_mem; /* flux/core_layout.h */
    int *core_int;

    /* dgeev work array (see above) */
    double *geev_work;
    size_t geev_lwork;

    /* TRANSFER bank (transfer/tf_layout.h) */
    double *tf_mem;
    int *tf_ipiv; /* cap ints (LAPACK pivots) */

    /* LIQUID bank (liquid/liq_layout.h): the liquid calls only */
    double *liq_mem;
    /* POROUS bank (porous/pm_layout.h) */
    double *pm_mem;

    /* BATCH bank (batch.c only): per-thread scratch of batch_per_thread
     * doubles each, batch_threads of them, 64-byte aligned inside
     * batch_raw. */
    void *batch_raw;
    double *batch_mem;
    size_t batch_per_thread, batch_threads;
    size_t threads_req; /* mcd_workspace_set_threads (0 = default) */
    size_t iter_max;    /* MCD_MODEL_ITERATIVE settings */
    double iter_tol;
    double iter_err; /* outcome of the last ITERATIVE call */
    size_t iter_used;
    int stage_cut;   /* batched blocks stop after this stage (bench_stages
                      * only; 0 = run all; see mcdi_bjob.cut) */
    int dij_read;    /* mcd_workspace_set_dij_read (mcd_dij_read) */
    int stagger_off; /* no staggered prefetch (mcdi_bjob.stagger; the A/B
                      * of bench_stride only; 0 = by the rule) */
};

/* dgeev work array and its length (lwork for LAPACKE_dgeev_work). */
double *mcdi_ws_geev_work(mcd_workspace *ws, size_t *out_lwork);

#endif
