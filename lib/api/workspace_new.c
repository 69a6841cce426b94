/* workspace_new.c - mcd_workspace_new and mcd_workspace_free: the
 * scratch of every layer for up to n_species species (workspace.h for the
 * banks), sized here, above the layers that use it.
 *
 * Every buffer is a separate allocation through the workspace's allocator,
 * so that a test can make the k-th allocation fail for every k; the
 * constructor starts from zeroed memory and unwinds through one `goto fail`
 * that calls mcd_workspace_free.
 */
#include <stdlib.h>
#include <string.h>
#include <lapacke.h>

#include "base/mcd_internal.h"
#include "base/workspace.h"
#include "batched/batch.h"
#include "transfer/tf_layout.h"
#include "porous/pm_layout.h"
#include "flux/core_layout.h"
#include "liquid/liq_layout.h"
#ifdef _OPENMP
#include <omp.h>
#endif

static void *default_alloc(void *ud, size_t size)
{
    (void)ud;
    return malloc(size);
}

static void default_free(void *ud, void *p)
{
    (void)ud;
    free(p);
}

/* a * b * elem without overflow; 0 on overflow. */
static size_t mul_size(size_t a, size_t b, size_t elem)
{
    if (a != 0 && b > ((size_t)-1) / a)
        return 0;
    if (a * b != 0 && elem > ((size_t)-1) / (a * b))
        return 0;
    return a * b * elem;
}

/* Allocate `bytes` (> 0) zeroed; NULL on failure or bytes == 0. */
static void *ws_calloc(mcd_workspace *ws, size_t bytes)
{
    void *p;
    if (bytes == 0)
        return NULL;
    p = ws->al.alloc(ws->al.ud, bytes);
    if (p != NULL)
        memset(p, 0, bytes);
    return p;
}

MCD_API void mcd_workspace_free(mcd_workspace *ws)
{
    if (ws == NULL)
        return;
    ws->al.free(ws->al.ud, ws->core_mem);
    ws->al.free(ws->al.ud, ws->core_int);
    ws->al.free(ws->al.ud, ws->geev_work);
    ws->al.free(ws->al.ud, ws->tf_mem);
    ws->al.free(ws->al.ud, ws->tf_ipiv);
    ws->al.free(ws->al.ud, ws->liq_mem);
    ws->al.free(ws->al.ud, ws->pm_mem);
    ws->al.free(ws->al.ud, ws->batch_raw);
    {
        mcd_allocator al = ws->al;
        al.free(al.ud, ws);
    }
}

mcd_status mcdi_api_workspace_new_with(size_t n_species,
                                       const mcd_allocator *allocator,
                                       mcd_workspace **out_ws)
{
    mcd_workspace *ws;
    size_t core_bytes, core_int_bytes, int_bytes, tf_bytes, liq_bytes;
    size_t pm_bytes;

    if (out_ws == NULL || allocator == NULL || allocator->alloc == NULL ||
        allocator->free == NULL)
        return MCD_EINVAL;
    if (n_species < 1 || n_species > MCD_MAX_SPECIES)
        return MCD_EINVAL;

    /* n_species <= MCD_MAX_SPECIES: no size below overflows */
    core_bytes = mcdi_core_doubles(n_species) * sizeof(double);
    core_int_bytes = mcdi_core_ints(n_species) * sizeof(int);
    int_bytes = n_species * sizeof(int);
    tf_bytes = mcdi_tf_doubles(n_species, 0, 1) * sizeof(double);
    liq_bytes = (mcdi_liq_doubles(n_species, 0, 1) +
                 mcdi_lcell_doubles(n_species, MCD_MAX_DIM, 1)) *
                sizeof(double);
    pm_bytes = mcdi_pm_doubles(n_species, 0, 1) * sizeof(double);

    ws = (mcd_workspace *)allocator->alloc(allocator->ud, sizeof(*ws));
    if (ws == NULL)
        return MCD_ENOMEM;
    memset(ws, 0, sizeof(*ws));
    ws->cap = n_species;
    ws->al = *allocator;

    if ((ws->core_mem = (double *)ws_calloc(ws, core_bytes)) == NULL ||
        (ws->core_int = (int *)ws_calloc(ws, core_int_bytes)) == NULL)
        goto fail;
    if ((ws->tf_mem = (double *)ws_calloc(ws, tf_bytes)) == NULL ||
        (ws->tf_ipiv = (int *)ws_calloc(ws, int_bytes)) == NULL ||
        (ws->liq_mem = (double *)ws_calloc(ws, liq_bytes)) == NULL ||
        (ws->pm_mem = (double *)ws_calloc(ws, pm_bytes)) == NULL)
        goto fail;

    /* batched scratch: one region per OpenMP thread, each a multiple of 8
     * doubles so that every region starts 64-byte aligned */
    {
        size_t per = (mcdi_batch_scratch_doubles(n_species) + 7) & ~(size_t)7;
        size_t nt = 1, bytes;
#ifdef _OPENMP
        nt = (size_t)omp_get_max_threads();
        if (nt < 1)
            nt = 1;
#endif
        bytes = mul_size(per * nt + 8, 1, sizeof(double));
        if (bytes == 0 || (ws->batch_raw = ws_calloc(ws, bytes)) == NULL)
            goto fail;
        ws->batch_mem = (double *)(((size_t)ws->batch_raw + 63) & ~(size_t)63);
        ws->batch_per_thread = per;
        ws->batch_threads = nt;
        ws->iter_max = 100;
        ws->iter_tol = 1e-10;
    }

    /* dgeev workspace query for the largest n with right eigenvectors (the
     * job that needs the most work). The minimum LAPACK accepts is 4n; the
     * optimal size from the query is used when it is larger. */
    {
        lapack_int n = (lapack_int)n_species, info;
        double wq = 0.0, dummy_v = 0.0;
        size_t lwork = 4 * n_species + 16;
        mcdi_fick_view v;
        mcdi_fick_carve(ws->core_mem, n_species, 0, 1, &v);
        info = LAPACKE_dgeev_work(LAPACK_COL_MAJOR, 'N', 'V', n, v.B, n, v.wr,
                                  v.wi, &dummy_v, 1, v.X, n, &wq, -1);
        if (info == 0 && wq > (double)lwork && wq < 1e9)
            lwork = (size_t)wq;
        ws->geev_lwork = lwork;
        if ((ws->geev_work = (double *)ws_calloc(
                 ws, mul_size(lwork, 1, sizeof(double)))) == NULL)
            goto fail;
    }

    *out_ws = ws;
    return MCD_OK;

fail:
    mcd_workspace_free(ws);
    return MCD_ENOMEM;
}

mcd_status mcdi_api_workspace_new(size_t n_species, mcd_workspace **out_ws)
{
    mcd_allocator al;
    al.alloc = default_alloc;
    al.free = default_free;
    al.ud = NULL;
    return mcdi_api_workspace_new_with(n_species, &al, out_ws);
}
