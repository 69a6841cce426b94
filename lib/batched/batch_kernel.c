/* batch_kernel.c - lane-vectorised kernels of the batched flux calls
 * (mcd_flux_batch, mcd_flux_batch_dij, mcd_flux_batch_aos; driver in
 * batch.c). Compiled with -O3 -fno-math-errno -ffp-contract=fast (see
 * lib/meson.build); on x86-64 with GCC the file is compiled for AVX-512,
 * AVX2+FMA and baseline SSE2 and kernel_isa.c picks one object at run
 * time, so the default build is portable and still uses the machine's
 * vector width.
 *
 * Layout: a block holds L cells ("lanes"); every quantity of species i is
 * L contiguous doubles, q[i*L + l]. Each step below is a loop over lanes
 * that the compiler vectorises; the species loops are fully unrolled for
 * N <= 5 and n_dim = 3 (instantiated for each, see block_lanes).
 *
 * Equations: as mcd_flux_compute (maxwell_stefan.c, flux/solve_stages.h),
 * with the
 * same scaled symmetric positive definite form of the Maxwell-Stefan
 * equations (Ern and Giovangigli 1994):
 *     (Gs + a s s^T) U = b,   s_i = sqrt(x_i),   J_i = c s_i U_i,
 *     (Gs)_ii = S_i = sum_{k != i} x_k / Đ_ik,   (Gs)_ij = -s_i s_j / Đ_ij,
 *     b_i = -(d_i - x_i sum_{t trace} J_t / (c Đ_it)) / s_i,
 * a = max S_i over the species present (the largest Blanc sum, inside the
 * spectrum of Gs on s-perp, so it does not worsen the conditioning). Trace
 * species (x_i = 0) obey Blanc's law exactly, J_i = -c d_i / S_i, and are
 * carried as decoupled rows (s_i = 0 makes their off-diagonal entries and
 * right-hand side 0, their diagonal S_i > 0), so every lane runs the same
 * code whatever its set of trace species; the species present absorb the
 * trace fluxes through J_k -= x_k sum_t J_t. A pure component (one x_k = 1)
 * has S_k = 0; then a = max S_i over all species (> 0) keeps the matrix
 * definite.
 *
 * Blocks of the exact model with n_dim = 3 and 2 <= N <= 5 (full ones with
 * molar fluxes through the fused emit, the last partial block and mass fluxes
 * through stage_ground_fluxes) solve the grounded form instead (kernel_ldl.h,
 * stage_ground_gth): u_i = J_i / (c x_i), the (N - 1) x (N - 1) graph
 * Laplacian with the most abundant species of each lane grounded, by an
 * elimination without subtraction (Grassmann, Taksar and Heyman), no square
 * roots; a block with a trace species takes the scaled form. From 6 to
 * 10 species the same, with n unknowns and the grounded species of each
 * lane left where it lies (stage_ground_any).
 *
 * Factorisation (exact model): LDL^T without pivoting and without square
 * roots, left-looking, packed lower triangle, vectorised across the L
 * cells: D_j = A_jj - sum_{k<j} L_jk^2 D_k, L_ij = (A_ij - sum_{k<j} L_ik
 * L_jk D_k) / D_j. The matrix is SPD with a diagonal bounded below by the
 * Blanc sums, so no pivoting is needed (Golub and Van Loan 2013, sec.
 * 4.2); a non-positive pivot (round-off on absurd inputs) is MCD_ESING.
 * Cost N^3/3 flops per cell. For N > MCDI_LANES_NMAX one cell is solved at
 * a time (lanes = 1) by the same LDL^T. LAPACK's blocked Cholesky is not
 * used here: a threaded BLAS (OpenBLAS) allocates inside dpotrf for larger
 * N, which would break the no-allocation guarantee of the batched calls.
 *
 * Iterative model (Ern and Giovangigli 1994, "Multicomponent Transport
 * Algorithms", Springer monograph m24, ch. 5; and J. Comput. Phys.
 * 120 (1995) 105): the splitting Gs = Ms - Zs with the diagonal
 * Ms_ii = S_i / (1 - x_i) and the projector Ps = I - s s^T onto the
 * constraint s^T U = 0 (sum J_i = 0) give the convergent iteration
 *     U^0 = Ps Ms^-1 b,   U^{k+1} = Ps Ms^-1 (Zs U^k + b),
 * whose limit is the exact solution; U^0 is the mixture-averaged flux with
 * the x-weighted correction velocity. With Ms^-1 Zs U = x_i U_i + (1 -
 * x_i) s_i sum_j s_j U_j / (S_i Đ_ij) one iteration costs O(N^2 n_dim).
 * Error estimate per cell: with delta_k = max |s (U^{k+1} - U^k)| / max
 * |s U^{k+1}| (relative change of the fluxes) and the observed contraction
 * rho = max(delta_k / delta_{k-1}, delta_{k-1} / delta_{k-2}), the error is
 * estimated as delta_k / (1 - rho), the geometric-tail bound of the error
 * of U^k, which over-estimates that of the returned U^{k+1} by about
 * 1/rho; rho >= 0.999 counts as not converged (estimate HUGE_VAL) unless
 * delta_k is round-off (MCDI_ITER_FLOOR). A cell stops when its estimate is <= tol and is then no
 * longer updated, so its result does not depend on the other cells of its
 * block.
 */
#include <float.h>
#include <math.h>
#include <stdint.h>
#include <string.h>

#include "base/checks.h" /* MCDI_DIJ_SYM_TOL, shared with the re-check */
#include "base/mcd_internal.h"
#include "props/mixture.h"
#include "batched/batch.h"
#include "batched/batch_layout.h"
#include "flux/flux_core.h"
#include "flux/stages.h"
#include "base/composition.h"
#include "batched/kernel_lanes.h"

/* Neufeld-Janzen-Aziz collision integral, as binary.c (exact path). */
static double omega_exact(double Ts) { return mcdi_omega_d(Ts); }
/* Brokaw's polar collision integral, as binary.c (exact path). */
static double omega_brokaw(double Ts, double delta_ab)
{
    return mcdi_brokaw_omega(Ts, delta_ab);
}

/* ------------------------------------------------------------------ */
/* the stages of a block                                               */
/* ------------------------------------------------------------------ */

/* Each stage reads and writes the regions of the block's scratch
 * (batch_layout.h) and is inlined into body(), which is instantiated for
 * constant n, L and nd; a stage that checks inputs returns non-zero when
 * some lane is out of range (the cell is then named by report_bad_cell).
 * A driving force is added once, in flux/stages.h (shared with the
 * single-state call), plus its loader in stage_load_forces. */
#include "batched/kernel_stages.h" /* shared by every model */
#include "batched/kernel_emit.h"   /* fluxes and fused emit (mole basis) */
#include "batched/kernel_ldl.h"    /* exact model */
#include "batched/kernel_iter.h"   /* iterative model */

/* The lowest lane with a non-positive (or NaN) pivot: ESING. */
static void report_not_definite(const double *Dg, size_t nv, mcdi_bres *res,
                                size_t n, size_t L)
{
    size_t j, l;
    for (l = 0; l < nv; l++)
        for (j = 0; j < n; j++)
            if (!(Dg[j * L + l] > 0.0)) {
                res->st = MCD_ESING;
                res->lane = l;
                res->what = "Maxwell-Stefan matrix not positive definite "
                            "(round-off; check Dij scale)";
                return;
            }
    res->st = MCD_EINTERNAL; /* flagged without a bad pivot */
    res->lane = 0;
    res->what = "internal: pivot check mismatch";
}

/* A block flagged by a loading stage: the driver names the first bad cell
 * with the argument checks of the single-state calls (batch.c). */
static void report_bad_cell(mcdi_bres *res)
{
    res->st = MCD_EINVAL; /* replaced by the re-check's status */
    res->lane = 0;
    res->recheck = 1;
    res->what = "";
}

/* ------------------------------------------------------------------ */
/* the block body, instantiated for constant n and L                    */
/* ------------------------------------------------------------------ */

/* The fluxes of a block solved in the grounded form (u in r): a full
 * mole-basis block through the fused emit, the last, partial block (its
 * lanes past nv repeat the first cell) and mass fluxes through
 * stage_ground_fluxes and the usual stages. Returns 1 when the block is
 * done (stored, or an error in res), 0 if some flux is not finite, before
 * anything is stored (the scaled form then). */
KINLINE int ground_out(const mcdi_bjob *jb, const mcdi_kblock *b, size_t k0,
                       size_t nv, mcdi_bres *res, const size_t n,
                       const size_t L, const size_t nd, double *nts)
{
    const int mass_out = jb->flux_basis == MCD_BASIS_MASS;
    if (nv == L && !mass_out)
        return emit_mole_v(n, nd, (const mcdi_vd *)b->x, (const mcdi_vd *)b->x,
                           (const mcdi_vd *)b->r, (const mcdi_vd *)b->t, 0,
                           *(const mcdi_vd *)b->c, (mcdi_vd *)b->J, jb, k0,
                           nts);
    if (!stage_ground_fluxes(b, n, nd))
        return 0;
    if (!mass_out || stage_mass(jb, b, nv, res, n, L, nd))
        stage_store(jb, b, k0, nv, res, n, L, nd);
    return 1;
}

/* Stage profile (tests/bench_stages.c): return after stage k when the
 * job asks for it; one predictable branch per stage and block. */
#define CUT(k)                                                                 \
    do {                                                                       \
        if (__builtin_expect(cut == (k), 0))                                   \
            return;                                                            \
    } while (0)

KINLINE void body(const mcdi_bjob *jb, size_t k0, size_t nv, double *mem,
                  mcdi_bres *res, const size_t n, const size_t L,
                  const size_t nd)
{
    double *const nts = mem - MCDI_STREAM_DOUBLES; /* streaming state */
    const int mass_out = jb->flux_basis == MCD_BASIS_MASS;
    /* the job's choices read once: stores to the scratch go through a
     * may_alias type, after which a read of jb->... is a load again */
    const int cut = jb->cut, model = jb->model;
    const mcd_mixture *const mix = jb->mix;
    /* iterative model on a power-law mixture: the inverse diffusivities
     * are f_l / coef_ij, used through the shared 1 / coef (Blanc sums,
     * iter_product_c); the per-lane triangle is filled only for the trace
     * coupling of blocks with trace species */
    const int pl = mix != NULL && !jb->mix_has_omega &&
                   model == MCD_MODEL_ITERATIVE && L == MCDI_VLANES;
    mcdi_kblock b;
    size_t i;

    /* lanes whose inputs break a rule (the loading stages OR 1 in); the
     * stages in between compute on every lane (IEEE arithmetic, no traps)
     * and a flagged block is reported before anything is stored */
    long long bl[MCDI_LANES] = {0};

    mcdi_kblock_carve(mem, n, nd, L, &b);
    res->st = MCD_OK;
    stage_load_scalars(jb, &b, bl, k0, nv, L);
    stage_load_comp(jb, &b, bl, k0, nv, n, L);
    CUT(1);
    stage_fractions(jb, &b, n, L);
    CUT(2);
    stage_load_forces(jb, &b, bl, k0, nv, n, L, nd);
    CUT(3);
    stage_forces(jb, &b, n, L, nd);
    CUT(4);
    if (mix == NULL && n > 1)
        stage_invdiff_dij(jb, &b, bl, k0, nv, n, L);
    if (lanes_any(bl, L)) {
        report_bad_cell(res);
        return;
    }
    if (n == 1) {
        /* a single species does not diffuse */
        for (i = 0; i < nd * L; i++)
            b.J[i] = 0.0;
        stage_store(jb, &b, k0, nv, res, n, L, nd);
        return;
    }
    if (mix != NULL)
        stage_invdiff_mixture(jb, &b, pl, n, L);
    CUT(5);
    if (L == MCDI_VLANES && model == MCD_MODEL_MAXWELL_STEFAN && nd == 3 &&
        MCDI_GROUND_HERE(n) && n <= MCDI_GROUND_NMAX) {
        /* the grounded form (kernel_ldl.h), which needs no Blanc sums;
         * if it fails (1/Đ is left as it was), the scaled form */
        mcdi_vl kg[MCDI_GROUND_NMAX];
        const int gp = ground_pick(&b, n, kg);
        int ok;
        CUT(6);
        ok = gp != 0 && (gp == 1 ? stage_ground_gth(&b, n, nd, kg, 0)
                                 : stage_ground_gth(&b, n, nd, kg, 1));
        CUT(7);
        CUT(8);
        CUT(9);
        if (ok && ground_out(jb, &b, k0, nv, res, n, L, nd, nts))
            return;
    } else if (L == MCDI_VLANES && model == MCD_MODEL_MAXWELL_STEFAN) {
        /* the same from 6 to 10 species (kernel_ldl.h, ground_fixed:
         * -1 where it does not run) */
        int got;
        CUT(6);
        got = ground_fixed(&b, n, nd);
        CUT(7);
        CUT(8);
        CUT(9);
        if (got > 0 && ground_out(jb, &b, k0, nv, res, n, L, nd, nts))
            return;
    }
    stage_blanc(jb, &b, pl, n, L);
    CUT(6);

    if (model == MCD_MODEL_MIXTURE_AVERAGED) {
        stage_mixavg(&b, n, L, nd);
    } else {
        int wkr, ntr;
        ntr = stage_trace(jb, &b, pl, n, L, nd, &wkr);
        CUT(7);
        stage_rhs(&b, n, L, nd, wkr);
        CUT(8);
        if (model == MCD_MODEL_MAXWELL_STEFAN) {
            if (!stage_exact(&b, n, L, nd)) {
                report_not_definite(b.Dg, nv, res, n, L);
                return;
            }
        } else {
            stage_iterate(jb, &b, pl, nv, res, n, L, nd);
        }
        CUT(9);
        if (L == MCDI_VLANES && nv == L && !mass_out) {
            /* full block, mole basis: compose, clean up and store at once
             * (a flux not finite: J holds them all, stage_store reports) */
            if (!emit_mole_v(n, nd, (const mcdi_vd *)b.s, (const mcdi_vd *)b.x,
                             (const mcdi_vd *)b.r, (const mcdi_vd *)b.t, ntr,
                             *(const mcdi_vd *)b.c, (mcdi_vd *)b.J, jb, k0,
                             nts))
                stage_store(jb, &b, k0, nv, res, n, L, nd);
            return;
        }
        stage_compose(&b, ntr, n, L, nd);
    }
    remove_along(b.J, NULL, b.x, n, L, nd); /* zero-sum, weights x */
    if (mass_out && !stage_mass(jb, &b, nv, res, n, L, nd))
        return;
    stage_store(jb, &b, k0, nv, res, n, L, nd);
}

/* Two full blocks at k0 and k0 + L of the exact model with Đ per cell
 * and mole fluxes (n <= MCDI_PAIR_NMAX, batch.h): each stage of the first
 * block, then the same stage of the second, so that the work of the two can
 * overlap (A/B against one block at a time, tools/anchor.sh, three alternating
 * runs on the Intel AVX-512 host, scaled form: N = 2 0.16-0.17 -> 0.21-0.23 of
 * the reference in cache, N = 3 0.27-0.28 -> 0.28-0.29 in cache and 1.01-1.03
 * -> 1.09-1.15 streamed; N = 4 and 5 were slower this way, 4-10 %; with the
 * grounded form N = 4 gains, MCDI_PAIR_NMAX in batch.h). The second block's
 * scratch follows the first's. Returns 1 when both blocks are stored; 2 or 3
 * when the first or the second block's fluxes are not finite (res set by
 * stage_store as in body(); the first block is stored before the second is
 * reported); 0 when a loading check or a pivot of the scaled form failed, or
 * the first block's grounded fluxes were not finite, before anything was
 * stored: the caller then runs body() on each block, which reports as always
 * (and takes the scaled form where the grounded one failed); 4 when the first
 * block is stored and the second's grounded fluxes were not finite: body()
 * redoes the second; 5 when one block takes the grounded form and the other
 * cannot (a trace species, the range rule or a pivot, kernel_ldl.h), before
 * anything was stored: the caller runs body() on each (so that a block's form,
 * and so its bits, never depends on the block it is paired with: the pairs
 * start where each thread's range of blocks starts). */
KINLINE int body2(const mcdi_bjob *jb, size_t k0, double *mem, const size_t n,
                  const size_t L, const size_t nd, mcdi_bres *res)
{
    double *const nts = mem - MCDI_STREAM_DOUBLES;
    mcdi_kblock b1, b2;
    long long bl1[MCDI_LANES] = {0}, bl2[MCDI_LANES] = {0};
    int ntr1, ntr2, wkr1, wkr2;
    mcdi_kblock_carve(mem, n, nd, L, &b1);
    mcdi_kblock_carve(mem + mcdi_kblock_doubles(n, nd, L), n, nd, L, &b2);
    stage_load_scalars(jb, &b1, bl1, k0, L, L);
    stage_load_scalars(jb, &b2, bl2, k0 + L, L, L);
    stage_load_comp(jb, &b1, bl1, k0, L, n, L);
    stage_load_comp(jb, &b2, bl2, k0 + L, L, n, L);
    stage_fractions(jb, &b1, n, L);
    stage_fractions(jb, &b2, n, L);
    stage_load_forces(jb, &b1, bl1, k0, L, n, L, nd);
    stage_load_forces(jb, &b2, bl2, k0 + L, L, n, L, nd);
    stage_forces(jb, &b1, n, L, nd);
    stage_forces(jb, &b2, n, L, nd);
    stage_invdiff_dij(jb, &b1, bl1, k0, L, n, L);
    stage_invdiff_dij(jb, &b2, bl2, k0 + L, L, n, L);
    if (lanes_any(bl1, L) | lanes_any(bl2, L))
        return 0;
    if (nd == 3 && MCDI_GROUND_HERE(n) && n <= MCDI_GROUND_NMAX) {
        /* both blocks grounded (kernel_ldl.h), else both scaled */
        mcdi_vl kg1[MCDI_GROUND_NMAX], kg2[MCDI_GROUND_NMAX];
        const int gp1 = ground_pick(&b1, n, kg1),
                  gp2 = ground_pick(&b2, n, kg2);
        int ok1 = 0, ok2 = 0;
        if (gp1 != 0)
            ok1 = gp1 == 1 ? stage_ground_gth(&b1, n, nd, kg1, 0)
                           : stage_ground_gth(&b1, n, nd, kg1, 1);
        if (gp2 != 0)
            ok2 = gp2 == 1 ? stage_ground_gth(&b2, n, nd, kg2, 0)
                           : stage_ground_gth(&b2, n, nd, kg2, 1);
        if (ok1 != ok2)
            return 5; /* one of each: body() on each, as alone */
        if (ok1) {
            if (!emit_mole_v(n, nd, (const mcdi_vd *)b1.x,
                             (const mcdi_vd *)b1.x, (const mcdi_vd *)b1.r,
                             (const mcdi_vd *)b1.t, 0, *(const mcdi_vd *)b1.c,
                             (mcdi_vd *)b1.J, jb, k0, nts))
                return 0;
            if (!emit_mole_v(n, nd, (const mcdi_vd *)b2.x,
                             (const mcdi_vd *)b2.x, (const mcdi_vd *)b2.r,
                             (const mcdi_vd *)b2.t, 0, *(const mcdi_vd *)b2.c,
                             (mcdi_vd *)b2.J, jb, k0 + L, nts))
                return 4;
            return 1;
        }
    }
    stage_blanc(jb, &b1, 0, n, L);
    stage_blanc(jb, &b2, 0, n, L);
    ntr1 = stage_trace(jb, &b1, 0, n, L, nd, &wkr1);
    ntr2 = stage_trace(jb, &b2, 0, n, L, nd, &wkr2);
    stage_rhs(&b1, n, L, nd, wkr1);
    stage_rhs(&b2, n, L, nd, wkr2);
    if (!(stage_exact(&b1, n, L, nd) & stage_exact(&b2, n, L, nd)))
        return 0;
    if (!emit_mole_v(n, nd, (const mcdi_vd *)b1.s, (const mcdi_vd *)b1.x,
                     (const mcdi_vd *)b1.r, (const mcdi_vd *)b1.t, ntr1,
                     *(const mcdi_vd *)b1.c, (mcdi_vd *)b1.J, jb, k0, nts)) {
        stage_store(jb, &b1, k0, L, res, n, L, nd);
        if (res->st != MCD_OK)
            return 2;
    }
    if (!emit_mole_v(n, nd, (const mcdi_vd *)b2.s, (const mcdi_vd *)b2.x,
                     (const mcdi_vd *)b2.r, (const mcdi_vd *)b2.t, ntr2,
                     *(const mcdi_vd *)b2.c, (mcdi_vd *)b2.J, jb, k0 + L,
                     nts)) {
        stage_store(jb, &b2, k0 + L, L, res, n, L, nd);
        if (res->st != MCD_OK)
            return 3;
    }
    return 1;
}

/* Cells [kb, ke) in blocks of L from kb (the last one may be short):
 * the block loop of mcdi_batch_blocks (batch.h), here so that a block
 * costs no call, dispatch or function prologue of its own. */
KINLINE size_t run_blocks(const mcdi_bjob *jb, size_t kb, size_t ke,
                          double *mem, mcdi_bres *res, const size_t n,
                          const size_t L, const size_t nd)
{
    double err = 0.0;
    size_t used = 0, k0 = kb;
    if (L == MCDI_VLANES && n >= 2 && n <= MCDI_PAIR_NMAX && jb->mix == NULL &&
        jb->model == MCD_MODEL_MAXWELL_STEFAN &&
        jb->flux_basis == MCD_BASIS_MOLE && jb->cut == 0)
        for (; k0 + 2 * L <= ke; k0 += 2 * L) {
            mcdi_bres r = {MCD_OK, 0, "", 0, 0.0, 0};
            const int got = body2(jb, k0, mem, n, L, nd, &r);
            if (got == 2 || got == 3) {
                *res = r;
                return got == 2 ? k0 : k0 + L;
            }
            if (got == 4) { /* the first stored, the second by body() */
                k0 += L;
                break;
            }
            if (got == 5) { /* one grounded block, one scaled: alone */
                size_t h;
                for (h = 0; h < 2; h++) {
                    body(jb, k0 + h * L, L, mem, &r, n, L, nd);
                    if (r.st != MCD_OK) {
                        *res = r;
                        return k0 + h * L;
                    }
                }
                continue;
            }
            if (got == 0)
                break; /* the blocks one at a time from here */
        }
    for (; k0 < ke; k0 += L) {
        const size_t nv = ke - k0 < L ? ke - k0 : L;
        mcdi_bres r = {MCD_OK, 0, "", 0, 0.0, 0};
        body(jb, k0, nv, mem, &r, n, L, nd);
        if (r.st != MCD_OK) {
            *res = r;
            return k0;
        }
        mcdi_merge_iter(&err, &used, r.iter_err, r.iter_used);
    }
    *res = (mcdi_bres){MCD_OK, 0, "", 0, err, used};
    return ke;
}

/* ------------------------------------------------------------------ */
/* dispatch on n (constant-folded instances for small n)                */
/* ------------------------------------------------------------------ */

#define LANES_SMALL MCDI_VLANES

/* n and n_dim = 3 (the common case) as compile-time constants for small
 * n (2 to 5), so that the species loops unroll; larger n and other n_dim
 * share one generic instance. The set
 * of instances is kept small on purpose: every instance is compiled once
 * per ISA clone, and each costs several seconds of compile time. */
/* One function per instance, each cloned per ISA on its own: a single
 * function holding every instance took GCC minutes to optimise (passes
 * that grow faster than the function size). */
#define INSTANCE(name, nn, ndd)                                                \
    __attribute__((noinline)) static size_t name(const mcdi_bjob *jb,          \
                                                 size_t kb, size_t ke,         \
                                                 double *mem, mcdi_bres *res)  \
    {                                                                          \
        return run_blocks(jb, kb, ke, mem, res, nn, LANES_SMALL, ndd);         \
    }
INSTANCE(block_n2_d3, 2, 3)
INSTANCE(block_n3_d3, 3, 3)
INSTANCE(block_n4_d3, 4, 3)
INSTANCE(block_n5_d3, 5, 3)
INSTANCE(block_nn_d3, jb->n, 3)
/* n_dim 1 or 2: block_lanes sends 3 to the instances above, and saying
 * so lets the compiler drop the n_dim = 3 constant-n solves (ldl_fixed,
 * kernel_ldl.h) here */
__attribute__((noinline)) static size_t block_nn_dd(const mcdi_bjob *jb,
                                                    size_t kb, size_t ke,
                                                    double *mem, mcdi_bres *res)
{
    const size_t nd = jb->nd;
    if (nd == 3)
        __builtin_unreachable();
    return run_blocks(jb, kb, ke, mem, res, jb->n, LANES_SMALL, nd);
}

static size_t block_lanes(const mcdi_bjob *jb, size_t kb, size_t ke,
                          double *mem, mcdi_bres *res)
{
    if (jb->nd != 3)
        return block_nn_dd(jb, kb, ke, mem, res);
    switch (jb->n) {
    case 2: return block_n2_d3(jb, kb, ke, mem, res);
    case 3: return block_n3_d3(jb, kb, ke, mem, res);
    case 4: return block_n4_d3(jb, kb, ke, mem, res);
    case 5: return block_n5_d3(jb, kb, ke, mem, res);
    default: return block_nn_d3(jb, kb, ke, mem, res);
    }
}

static size_t block_single(const mcdi_bjob *jb, size_t kb, size_t ke,
                           double *mem, mcdi_bres *res)
{
    return run_blocks(jb, kb, ke, mem, res, jb->n, 1, jb->nd);
}

#define KNAME_(isa) mcdi_batch_blocks_v##isa
#define KNAME(isa) KNAME_(isa)
#define FNAME_(isa) mcdi_batch_finish_v##isa
#define FNAME(isa) FNAME_(isa)
#define KLANES_(isa) mcdi_batch_lanes_v##isa
#define KLANES(isa) KLANES_(isa)
const size_t KLANES(MCDI_KISA) = MCDI_VLANES;

size_t KNAME(MCDI_KISA)(const mcdi_bjob *jb, size_t kb, size_t ke, double *mem,
                        mcdi_bres *res)
{
    mem += MCDI_STREAM_DOUBLES; /* streaming state first (batch.h) */
    if (jb->n > MCDI_LANES_NMAX)
        return block_single(jb, kb, ke, mem, res);
    return block_lanes(jb, kb, ke, mem, res);
}

void FNAME(MCDI_KISA)(const mcdi_bjob *jb, double *mem)
{
#if MCDI_CAN_STREAM
    if (!jb->stream)
        return;
    stream_flush(jb, jb->n * jb->nd, mem);
    _mm_sfence(); /* the streamed lines before anything after the call */
#else
    (void)jb;
    (void)mem;
#endif
}
