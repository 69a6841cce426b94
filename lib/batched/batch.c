/* batch.c - batched flux calls: argument checks, the loop over blocks of
 * cells (optionally OpenMP-parallel), the array-of-structures convenience
 * path and the iterative-model settings. The arithmetic is in
 * batch_kernel.c (see there for the equations and methods).
 *
 * Determinism: blocks are fixed by cell index (MCDI_LANES consecutive
 * cells) and every cell is computed by the same code whatever thread runs
 * its block; the only quantities combined across cells are maxima (error
 * estimate, iteration count) and the lowest failing cell index, which do
 * not depend on the order. So the results are bit-for-bit those of the
 * serial run.
 */
#include <float.h>
#include <stdint.h>
#include <stdio.h>
#include <string.h>
#ifdef _OPENMP
#include <omp.h>
#endif

#include "base/mcd_internal.h"
#include "base/workspace.h"
#include "props/mixture.h"
#include "batched/batch.h"
#include "batched/batch_layout.h"
#include "flux/flux_core.h"

/* Whether some pair of the mixture depends on T through a collision
 * integral (Chapman-Enskog, Wilke-Lee, Brokaw) rather than the exact power law:
 * decided once per call, not per block. */
static int mixture_has_omega(const mcd_mixture *mix)
{
    size_t i, j, n = mix->n;
    for (i = 1; i < n; i++)
        for (j = 0; j < i; j++) {
            int m = mix->method[i * n + j];
            if (m != MCD_METHOD_FSG && m != MCD_METHOD_USER)
                return 1;
        }
    return 0;
}

size_t mcdi_batch_scratch_doubles(size_t cap)
{
    /* blocks of up to MCDI_LANES cells up to MCDI_LANES_NMAX species, one
     * cell at a time above; each followed by the AoS staging */
    const size_t nl = cap < MCDI_LANES_NMAX ? cap : MCDI_LANES_NMAX;
    size_t need = mcdi_kblock_doubles(nl, MCD_MAX_DIM, MCDI_LANES) +
                  mcdi_aos_doubles(nl, MCD_MAX_DIM, MCDI_LANES);
    {
        /* two blocks at once up to MCDI_PAIR_NMAX species (batch.h) */
        const size_t np = cap < MCDI_PAIR_NMAX ? cap : MCDI_PAIR_NMAX,
                     two = 2 * mcdi_kblock_doubles(np, MCD_MAX_DIM, MCDI_LANES);
        need = two > need ? two : need;
    }
    if (cap > MCDI_LANES_NMAX) {
        size_t one = mcdi_kblock_doubles(cap, MCD_MAX_DIM, 1) +
                     mcdi_aos_doubles(cap, MCD_MAX_DIM, 1);
        need = one > need ? one : need;
    }
    {
        size_t jc = mcdi_jcell_doubles(cap, MCD_MAX_DIM, 1);
        need = jc > need ? jc : need;
    }
    return MCDI_STREAM_DOUBLES + need; /* streaming state, then the block */
}

/* The first rule that cell k of the job breaks, checked in the order and
 * with the messages of the single-state calls (checks.c); MCD_OK if the
 * cell is fine. The rules are those the kernel's loading stages apply. */
static mcd_status check_cell(mcd_workspace *ws, const mcdi_bjob *jb, size_t k)
{
    const size_t n = jb->n, nd = jb->nd, K = jb->rs; /* row stride */
    mcd_status st = MCD_OK;
    if (jb->mix != NULL) {
        if ((st = mcdi_check_positive(ws, jb->T[k], "T")) != MCD_OK ||
            (st = mcdi_check_positive(ws, jb->P[k], "P")) != MCD_OK)
            return st;
        if (!(jb->P[k] / (MCD_GAS_CONSTANT * jb->T[k]) >= DBL_MIN))
            return mcdi_fail(MCD_EDOM,
                             "argument P: the concentration P / (R T) = %g "
                             "is not a normal positive number",
                             jb->P[k] / (MCD_GAS_CONSTANT * jb->T[k]));
    } else if ((st = mcdi_check_conc(ws, jb->c[k], "c")) != MCD_OK ||
               (st = (jb->dij_upper ? mcdi_check_dij_upper_strided
                                    : mcdi_check_dij_strided)(
                    ws, n, jb->Dij + mcdi_cell_at(jb, k, n * n), K)) !=
                   MCD_OK) {
        return st;
    }
    if ((st = mcdi_check_comp_strided(ws, n, jb->comp + mcdi_cell_at(jb, k, n),
                                      K, "comp")) != MCD_OK ||
        (st = mcdi_check_finite_strided(ws, n, nd,
                                        jb->grad + mcdi_cell_at(jb, k, n * nd),
                                        K, "grad")) != MCD_OK)
        return st;
    if (jb->glnP != NULL && (st = mcdi_check_finite_strided(
                                 ws, 1, nd, jb->glnP + mcdi_cell_at(jb, k, nd),
                                 K, "grad_lnP")) != MCD_OK)
        return st;
    if (jb->kT != NULL)
        st = mcdi_check_thermal_strided(ws, n, nd,
                                        jb->kT + mcdi_cell_at(jb, k, n),
                                        jb->glnT + mcdi_cell_at(jb, k, nd), K);
    return st;
}

/* Name the first bad cell of a block [k0, k0 + nv) that the kernel flagged
 * (res->recheck), as "cell <shown>: argument ...", shown = shift + k. */
static mcd_status recheck_block(mcd_workspace *ws, const mcdi_bjob *jb,
                                size_t k0, size_t nv, size_t shift)
{
    char msg[MCDI_ERRLEN];
    size_t k;
    for (k = k0; k < k0 + nv; k++) {
        mcd_status st = check_cell(ws, jb, k);
        if (st != MCD_OK) {
            memcpy(msg, mcdi_err_text(), sizeof msg);
            msg[sizeof msg - 1] = '\0';
            return mcdi_fail(st, "cell %zu: %s", shift + k, msg);
        }
    }
    return mcdi_fail(MCD_EINTERNAL, "cell %zu: internal: validation mismatch",
                     shift + k0);
}

/* What mcd_workspace_iterative_outcome reports after an iterative call. */
static void note_iter(mcd_workspace *ws, const mcdi_bjob *jb, double err,
                      size_t used)
{
    if (jb->model == MCD_MODEL_ITERATIVE) {
        ws->iter_err = err;
        ws->iter_used = used;
    }
}

/* Run the job over cells [0, K) with the workspace's scratch. */
static mcd_status run_job(mcd_workspace *ws, const mcdi_bjob *jb)
{
    const size_t K = jb->K, L = mcdi_batch_lanes(jb->n);
    const size_t nblk = (K + L - 1) / L;
    size_t fail_cell = (size_t)-1, iter_used = 0;
    double iter_err = 0.0;
    mcd_status fail_st = MCD_OK;
    const char *fail_what = "";
    int fail_recheck = 0;
    int nthreads = 1;
#ifdef _OPENMP
    nthreads =
        ws->threads_req > 0 ? (int)ws->threads_req : omp_get_max_threads();
    if (nthreads > (int)ws->batch_threads)
        nthreads = (int)ws->batch_threads;
    if ((size_t)nthreads > nblk)
        nthreads = nblk > 0 ? (int)nblk : 1;
    if (nthreads < 1)
        nthreads = 1;
#endif
    (void)nthreads;
#ifdef _OPENMP
#pragma omp parallel num_threads(nthreads) if (nthreads > 1)
#endif
    {
        int tid = 0, team = 1;
        double *mem;
        mcdi_bres res;
        size_t b0, b1, kfail;
#ifdef _OPENMP
        tid = omp_get_thread_num();
        team = omp_get_num_threads();
#endif
        /* a contiguous range of blocks per thread; each cell's result
         * does not depend on which thread computes it */
        b0 = nblk * (size_t)tid / (size_t)team;
        b1 = nblk * (size_t)(tid + 1) / (size_t)team;
        mem = ws->batch_mem + (size_t)tid * ws->batch_per_thread;
        mcdi_batch_stream_reset(mem);
        kfail =
            mcdi_batch_blocks(jb, b0 * L, b1 * L < K ? b1 * L : K, mem, &res);
        mcdi_batch_finish(jb, mem);
#ifdef _OPENMP
#pragma omp critical
#endif
        {
            if (res.st != MCD_OK) {
                /* the thread's first failing block; the blocks of the
                 * threads before it lie before it */
                if (kfail + res.lane < fail_cell) {
                    fail_cell = kfail + res.lane;
                    fail_st = res.st;
                    fail_what = res.what;
                    fail_recheck = res.recheck;
                }
            } else {
                mcdi_merge_iter(&iter_err, &iter_used, res.iter_err,
                                res.iter_used);
            }
        }
    }
    note_iter(ws, jb, iter_err, iter_used);
    if (fail_recheck)
        return recheck_block(ws, jb, fail_cell,
                             K - fail_cell < L ? K - fail_cell : L, 0);
    if (fail_st != MCD_OK)
        return mcdi_fail(fail_st, "cell %zu: %s", fail_cell, fail_what);
    return MCD_OK;
}

/* Checks shared by every batched entry point (writes nothing). */
mcd_status mcdi_batch_check_common(mcd_workspace *ws, mcd_model model, size_t n,
                                   const mcd_cells *cl, mcd_basis flux_basis,
                                   const double *out, const char *out_name)
{
    mcd_status st;
    if ((st = mcdi_check_ws_obj(ws, cl, "cells")) != MCD_OK)
        return st;
    if ((st = mcdi_check_species(ws, n, 1, 0, "n_species")) != MCD_OK ||
        (st = mcdi_check_dim(ws, cl->n_dim)) != MCD_OK ||
        (st = mcdi_check_model(ws, model, 1)) != MCD_OK ||
        (st = mcdi_check_basis(ws, cl->comp_basis, "comp_basis")) != MCD_OK ||
        (st = mcdi_check_basis(ws, flux_basis, "flux_basis")) != MCD_OK ||
        (st = mcdi_check_ptr(ws, cl->comp, "comp")) != MCD_OK ||
        (st = mcdi_check_ptr(ws, cl->grad, "grad")) != MCD_OK ||
        (st = mcdi_check_ptr(ws, out, out_name)) != MCD_OK)
        return st;
    if ((cl->kT == NULL) != (cl->grad_lnT == NULL))
        return mcdi_fail(MCD_EINVAL,
                         "argument %s: NULL while %s is given (thermal "
                         "diffusion needs both)",
                         cl->kT == NULL ? "kT" : "grad_lnT",
                         cl->kT == NULL ? "grad_lnT" : "kT");
    return MCD_OK;
}

mcd_status mcdi_batch_check_layout(const mcd_cells *cl, int tiled_ok,
                                   const char *call)
{
    if (cl->layout == MCD_LAYOUT_SOA ||
        (cl->layout == MCD_LAYOUT_TILED8 && tiled_ok))
        return MCD_OK;
    if (cl->layout == MCD_LAYOUT_TILED8)
        return mcdi_fail(MCD_EINVAL,
                         "argument cells->layout: MCD_LAYOUT_TILED8 is not "
                         "offered by %s (use MCD_LAYOUT_SOA)",
                         call);
    return mcdi_fail(MCD_EINVAL,
                     "argument cells->layout: %d is not a mcd_layout (0 SoA, "
                     "1 tiled)",
                     (int)cl->layout);
}

/* The bytes a job reads and writes. */
static size_t job_bytes(const mcdi_bjob *jb)
{
    const size_t n = jb->n, nd = jb->nd;
    size_t per_cell = n + 2 * n * nd + (jb->mix != NULL ? 2 : 1 + n * n) +
                      (jb->glnP != NULL ? nd : 0) +
                      (jb->kT != NULL ? n + nd : 0);
    double bytes = 8.0 * (double)per_cell * (double)jb->K;
    return bytes >= 1e18 ? (size_t)1e18 : (size_t)bytes;
}

/* Whether the job streams its outputs: by the bytes it reads and writes
 * (batch.h, kernel_isa.c). Only the SoA entries ask; the AoS path writes
 * into staging that it reads back at once. */
static int stream_choice(const mcdi_bjob *jb)
{
    if (((uintptr_t)jb->out & 7u) != 0)
        return 0; /* lines are found from the address of a double */
    if (jb->tiled && ((uintptr_t)jb->out & 63u) != 0)
        return 0; /* a tiled block's row is a line only on a line */
    return mcdi_batch_stream_choice(job_bytes(jb));
}

/* The job of a batched call: sizes, models and the cells' arrays; *need_M
 * says whether the molar masses are needed (mass basis on either side,
 * or pressure diffusion). */
static void job_init(mcdi_bjob *jb, const mcd_workspace *ws, mcd_model model,
                     size_t n, size_t K, const mcd_cells *cl, mcd_basis fb,
                     double *out_flux, int *need_M)
{
    memset(jb, 0, sizeof *jb);
    jb->n = n;
    jb->nd = cl->n_dim;
    jb->K = K;
    jb->tiled = cl->layout == MCD_LAYOUT_TILED8;
    jb->rs = jb->tiled ? 8 : K;
    jb->model = (int)model;
    jb->comp_basis = (int)cl->comp_basis;
    jb->flux_basis = (int)fb;
    jb->max_iter = ws->iter_max;
    jb->tol = ws->iter_tol;
    jb->cut = ws->stage_cut;
    jb->comp = cl->comp;
    jb->grad = cl->grad;
    jb->glnP = cl->grad_lnP;
    jb->kT = cl->kT;
    jb->glnT = cl->grad_lnT;
    jb->out = out_flux;
    *need_M = cl->comp_basis == MCD_BASIS_MASS || fb == MCD_BASIS_MASS ||
              cl->grad_lnP != NULL;
}

/* Input rows a cell reads. */
static size_t job_rows(const mcdi_bjob *jb)
{
    const size_t n = jb->n, nd = jb->nd;
    size_t rows = n + n * nd; /* comp, grad */
    if (jb->Dij != NULL)
        rows += 1 + (jb->dij_upper ? n * (n - 1) / 2 : n * n);
    else
        rows += 2; /* T, P */
    if (jb->glnP != NULL)
        rows += nd;
    if (jb->kT != NULL)
        rows += n + nd;
    return rows;
}

/* Whether the kernels stagger the prefetches of the SoA rows
 * (kernel_lanes.h, pf_stagger): rows a multiple of 128 bytes apart (K a
 * multiple of 16) and many of them read per cell (MCDI_STAG_ROWS, at
 * least MCDI_STAG_NMIN species). Measured (benchmark `stride` and A/B
 * builds, streamed, K a multiple of 32): the Dij call 1.17-1.56x faster
 * at N = 7..50 (78 to 2651 rows), 1.4x slower at N = 6 (61 rows); the
 * mixture call 1.15x faster at N = 20 (82 rows), level at 10 (42),
 * 1.12x slower at 8 (34). Only when the cells stream from memory (the
 * bytes of the call at least the last-level cache, as for streaming
 * stores): in cache a prefetch gains nothing and the address fold of
 * every row and block was 14 % of the instructions of the Dij call at
 * N = 10 (counted by single-stepping one call). */
static int stagger_choice(const mcd_workspace *ws, const mcdi_bjob *jb)
{
    return !jb->tiled && jb->K % 16 == 0 && jb->n >= MCDI_STAG_NMIN &&
           job_rows(jb) >= MCDI_STAG_ROWS && !ws->stagger_off &&
           mcdi_batch_beyond_cache(job_bytes(jb));
}

/* Whether the kernels prefetch into L2 only (prefetcht1): the Dij call
 * with many input rows a cell, where 8 blocks ahead of every row is more
 * than L1 holds (72 rows x 8 blocks x 64 bytes = 36 KiB of a 48 KiB L1;
 * lines prefetched into L1 evicted before their use is the likely cause,
 * not observed: no counters on this VM). Measured (tools/anchor.sh, A/B
 * of one build, 2 runs): streamed SoA N = 7 0.48 -> 0.55 of the
 * reference, 10 0.45 -> 0.51, 20 0.52 -> 0.60-0.63, 50 0.58 -> 0.65;
 * tiled N = 10 0.66 -> 0.69, 20 0.69 -> 0.72-0.74; in cache level
 * (0.38-0.40 at N = 10, 0.52-0.56 at 20, both ways), but at N = 100
 * with 5.5 MB of cells (in L3) 1.41-1.45 -> 1.36-1.38: so only when the
 * call's data is at least the last-level cache, as the stagger. Not the mixture
 * call, which computes its Dij: at N = 20 streamed (bench_flux 5 20)
 * 2.75-2.84e6 cells/s without, 2.67-2.74e6 with. */
static int pf_l2_choice(const mcdi_bjob *jb)
{
    return jb->Dij != NULL && jb->n >= MCDI_STAG_NMIN &&
           job_rows(jb) >= MCDI_STAG_ROWS &&
           mcdi_batch_beyond_cache(job_bytes(jb));
}

/* Run a job on the caller's (SoA) arrays. */
static mcd_status run_soa(mcd_workspace *ws, mcdi_bjob *jb)
{
    if (jb->K == 0)
        return MCD_OK;
    jb->stream = stream_choice(jb);
    jb->stagger = stagger_choice(ws, jb);
    jb->pf_l2 = pf_l2_choice(jb);
    return run_job(ws, jb);
}

/* The checks of a mixture-driven call (mcd_flux_batch, mcd_flux_batch_aos)
 * and the job they describe, its inputs at stride K (the caller's arrays,
 * or the AoS staging). */
static mcd_status mixture_job(mcd_workspace *ws, const mcd_mixture *mix,
                              mcd_model model, const double *T, const double *P,
                              const mcd_cells *cl, mcd_basis flux_basis,
                              double *out_flux, int aos, mcdi_bjob *jb)
{
    mcd_status st;
    size_t n;
    int need_M;
    if ((st = mcdi_check_ws_obj(ws, mix, "mix")) != MCD_OK)
        return st;
    n = mix->n;
    if ((st = mcdi_batch_check_common(ws, model, n, cl, flux_basis, out_flux,
                                      "out_flux")) != MCD_OK ||
        (st = mcdi_batch_check_layout(cl, !aos, "mcd_flux_batch_aos")) !=
            MCD_OK)
        return st;
    if ((st = MCDI_CHECK_PTRS2(T, P)) != MCD_OK)
        return st;
    if ((st = mcdi_mixture_ready(mix)) != MCD_OK) {
        char why[MCDI_ERRLEN]; /* names the pair and what it lacks */
        snprintf(why, sizeof why, "%s", mcdi_err_text());
        return mcdi_fail(st, "argument mix: %s", why);
    }
    if (!mix->M_ok)
        return mcdi_fail(MCD_ENODATA, "argument mix: a molar mass is "
                                      "unknown");
    job_init(jb, ws, model, n, aos ? mcdi_batch_lanes(n) : cl->n_cells, cl,
             flux_basis, out_flux, &need_M);
    jb->mix = mix;
    jb->mix_has_omega = mixture_has_omega(mix);
    jb->M = need_M ? mix->M : NULL;
    if (jb->M != NULL && !mcdi_M_span_ok(n, jb->M))
        return mcdi_fail(MCD_EDOM,
                         "argument mix: the molar masses span more than a "
                         "factor 1e12 (the basis conversions would lose "
                         "all precision)");
    jb->T = T;
    jb->P = P;
    return MCD_OK;
}

mcd_status mcdi_api_flux_batch_dij(mcd_workspace *ws, mcd_model model,
                                   size_t n_species, const double *M,
                                   const double *Dij, const double *c,
                                   const mcd_cells *cells, mcd_basis flux_basis,
                                   double *out_flux)
{
    const mcd_cells *cl = cells;
    mcdi_bjob jb;
    mcd_status st;
    int need_M;
    if ((st = mcdi_batch_check_common(ws, model, n_species, cl, flux_basis,
                                      out_flux, "out_flux")) != MCD_OK ||
        (st = mcdi_batch_check_layout(cl, 1, "mcd_flux_batch_dij")) != MCD_OK)
        return st;
    if ((st = MCDI_CHECK_PTRS2(Dij, c)) != MCD_OK)
        return st;
    job_init(&jb, ws, model, n_species, cl->n_cells, cl, flux_basis, out_flux,
             &need_M);
    if (need_M && (st = mcdi_check_M(ws, n_species, M)) != MCD_OK)
        return st;
    jb.Dij = Dij;
    jb.dij_upper = ws->dij_read == MCD_DIJ_READ_UPPER;
    jb.c = c;
    jb.M = need_M ? M : NULL;
    return run_soa(ws, &jb);
}

/* AoS: each block of L cells is transposed into SoA staging that follows
 * the kernel's scratch in the thread's region, computed with stride L,
 * and transposed back. Serial (the staging is per workspace thread 0).
 * jb describes the caller's arrays on entry. */
static mcd_status run_aos(mcd_workspace *ws, mcdi_bjob *jb, size_t n_cells)
{
    const double *T = jb->T, *P = jb->P, *comp = jb->comp, *grad = jb->grad,
                 *grad_lnP = jb->glnP, *kT = jb->kT, *glnT = jb->glnT;
    double *out_flux = jb->out, iter_err = 0.0;
    const size_t n = jb->n, nd = jb->nd, L = jb->K;
    size_t k0, iter_used = 0;
    mcdi_aos_stage sg;
    if (n_cells == 0)
        return MCD_OK;
    /* staging after the kernel's block scratch in thread 0's region (both
     * counted by mcdi_batch_scratch_doubles) */
    mcdi_aos_carve(ws->batch_mem + MCDI_STREAM_DOUBLES +
                       mcdi_kblock_doubles(n, nd, L),
                   n, nd, L, &sg);
    jb->T = sg.T;
    jb->P = sg.P;
    jb->comp = sg.comp;
    jb->grad = sg.grad;
    jb->glnP = grad_lnP != NULL ? sg.glnP : NULL;
    jb->kT = kT != NULL ? sg.kT : NULL;
    jb->glnT = glnT != NULL ? sg.glnT : NULL;
    jb->out = sg.out;
    for (k0 = 0; k0 < n_cells; k0 += L) {
        size_t nv = n_cells - k0 < L ? n_cells - k0 : L, l, i, d;
        mcdi_bres res;
        for (l = 0; l < nv; l++) {
            size_t k = k0 + l;
            sg.T[l] = T[k];
            sg.P[l] = P[k];
            for (i = 0; i < n; i++)
                sg.comp[i * L + l] = comp[k * n + i];
            for (i = 0; i < n * nd; i++)
                sg.grad[i * L + l] = grad[k * n * nd + i];
            if (grad_lnP != NULL)
                for (d = 0; d < nd; d++)
                    sg.glnP[d * L + l] = grad_lnP[k * nd + d];
            if (kT != NULL) {
                for (i = 0; i < n; i++)
                    sg.kT[i * L + l] = kT[k * n + i];
                for (d = 0; d < nd; d++)
                    sg.glnT[d * L + l] = glnT[k * nd + d];
            }
        }
        (void)mcdi_batch_blocks(jb, 0, nv, ws->batch_mem, &res);
        if (res.st != MCD_OK) {
            note_iter(ws, jb, iter_err, iter_used);
            if (res.recheck)
                return recheck_block(ws, jb, 0, nv, k0);
            return mcdi_fail(res.st, "cell %zu: %s", k0 + res.lane, res.what);
        }
        mcdi_merge_iter(&iter_err, &iter_used, res.iter_err, res.iter_used);
        for (l = 0; l < nv; l++)
            for (i = 0; i < n * nd; i++)
                out_flux[(k0 + l) * n * nd + i] = sg.out[i * L + l];
    }
    note_iter(ws, jb, iter_err, iter_used);
    return MCD_OK;
}

/* mcd_flux_batch (SoA) and mcd_flux_batch_aos. */
static mcd_status batch_mixture(mcd_workspace *ws, const mcd_mixture *mix,
                                mcd_model model, const double *T,
                                const double *P, const mcd_cells *cells,
                                mcd_basis flux_basis, double *out_flux, int aos)
{
    mcdi_bjob jb;
    mcd_status st;
    if ((st = mixture_job(ws, mix, model, T, P, cells, flux_basis, out_flux,
                          aos, &jb)) != MCD_OK)
        return st;
    return aos ? run_aos(ws, &jb, cells->n_cells) : run_soa(ws, &jb);
}

mcd_status mcdi_api_flux_batch(mcd_workspace *ws, const mcd_mixture *mix,
                               mcd_model model, const double *T,
                               const double *P, const mcd_cells *cells,
                               mcd_basis flux_basis, double *out_flux)
{
    return batch_mixture(ws, mix, model, T, P, cells, flux_basis, out_flux, 0);
}

mcd_status mcdi_api_flux_batch_aos(mcd_workspace *ws, const mcd_mixture *mix,
                                   mcd_model model, const double *T,
                                   const double *P, const mcd_cells *cells,
                                   mcd_basis flux_basis, double *out_flux)
{
    return batch_mixture(ws, mix, model, T, P, cells, flux_basis, out_flux, 1);
}

mcd_status mcdi_api_workspace_set_iterative(mcd_workspace *ws, size_t max_iter,
                                            double tol)
{
    if (ws == NULL)
        return MCD_EINVAL;
    if (max_iter < 1 || max_iter > 1000)
        return mcdi_fail(MCD_EINVAL, "argument max_iter: %zu is not in 1..1000",
                         max_iter);
    if (!mcdi_finite(tol) || !(tol >= 0.0))
        return mcdi_fail(MCD_EINVAL, "argument tol: not a finite value >= 0");
    ws->iter_max = max_iter;
    ws->iter_tol = tol;
    return MCD_OK;
}

mcd_status mcdi_api_workspace_iterative_outcome(const mcd_workspace *ws,
                                                double *out_max_error,
                                                size_t *out_max_iter)
{
    if (ws == NULL)
        return MCD_EINVAL;
    if (out_max_error != NULL)
        *out_max_error = ws->iter_err;
    if (out_max_iter != NULL)
        *out_max_iter = ws->iter_used;
    return MCD_OK;
}

mcd_status mcdi_api_workspace_set_threads(mcd_workspace *ws, size_t n_threads)
{
    if (ws == NULL)
        return MCD_EINVAL;
    ws->threads_req = n_threads;
    return MCD_OK;
}

mcd_status mcdi_api_workspace_set_dij_read(mcd_workspace *ws, mcd_dij_read mode)
{
    if (ws == NULL)
        return MCD_EINVAL;
    if (mode != MCD_DIJ_READ_BOTH && mode != MCD_DIJ_READ_UPPER)
        return mcdi_fail(MCD_EINVAL,
                         "argument mode: %d is not an mcd_dij_read "
                         "(0 both triangles, 1 upper triangle only)",
                         (int)mode);
    ws->dij_read = (int)mode;
    return MCD_OK;
}

mcd_status mcdi_batch_iterate_one(mcd_workspace *ws, size_t n, size_t nd,
                                  const double *x, const double *d,
                                  const double *Dij, double c, double *J)
{
    mcd_cells one = {0};
    one.n_cells = 1;
    one.n_dim = nd;
    one.comp_basis = MCD_BASIS_MOLE;
    one.comp = x;
    one.grad = d; /* the forces, already with Gamma and grad ln P terms */
    return mcdi_api_flux_batch_dij(ws, MCD_MODEL_ITERATIVE, n, NULL, Dij, &c,
                                   &one, MCD_BASIS_MOLE, J);
}
