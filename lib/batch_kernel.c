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
 * Equations: as mcd_flux_compute (maxwell_stefan.c, mixavg.c), with the
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

#include "mcd_internal.h"
#include "mixture.h"
#include "batch.h"
#include "batch_layout.h"
#include "flux_core.h"

#if defined(__GNUC__) && !defined(__clang__)
#define KINLINE static inline __attribute__((always_inline))
#else
#define KINLINE static inline
#endif

/* This file is compiled once per instruction set (lib/meson.build sets
 * MCDI_KISA to 4, 3 or 1 with the matching -march); the lanes of a block
 * are the doubles of one vector register of that set, so that a lane
 * vector is one register. (Wider generic vectors than the hardware's were
 * lowered by GCC through the stack: the AVX2 code ran 4-8x slower than
 * the AVX-512 code before this split.) */
#ifndef MCDI_KISA
#define MCDI_KISA 1
#endif
#if defined(__AVX512F__)
#define MCDI_VLANES 8
#elif defined(__AVX__)
#define MCDI_VLANES 4
#else
#define MCDI_VLANES 2
#endif
#if MCDI_VLANES > MCDI_LANES
#error "MCDI_LANES (batch.h) must be the largest lane count"
#endif

#define RGAS MCD_GAS_CONSTANT

/* Relative change of the fluxes below which successive iterates differ by
 * round-off only: they stop contracting (rho ~ 1, a cycle between two
 * round-off neighbours), and the estimate is del / (1 - 0.999) instead of
 * HUGE_VAL (a binary, whose first iterate is exact, ran to max_iter and
 * reported an infinite estimate). */
#define MCDI_ITER_FLOOR (64.0 * DBL_EPSILON)

/* Streaming stores of whole output lines (batch.h): the AVX-512 build
 * only, where a block's row of 8 doubles is one 64-byte line. */
#if MCDI_KISA == 4 && defined(__AVX512F__) && MCDI_VLANES == 8
#define MCDI_CAN_STREAM 1
#include <immintrin.h>
#else
#define MCDI_CAN_STREAM 0
#endif

/* A loop over the lanes of a block: vectorised (OpenMP SIMD pragma, enabled
 * by -fopenmp-simd without the OpenMP runtime; ignored elsewhere). */
#if defined(_OPENMP) || defined(MCDI_OMP_SIMD)
#define LANES _Pragma("omp simd") for (l = 0; l < L; l++)
#else
#define LANES for (l = 0; l < L; l++)
#endif
/* The same with an OR-reduction of the int flag `bad` (input checks): the
 * reduction clause keeps these loops vectorised. */
#if defined(_OPENMP) || defined(MCDI_OMP_SIMD)
#define LANES_BAD _Pragma("omp simd reduction(|:bad)") for (l = 0; l < L; l++)
#else
#define LANES_BAD for (l = 0; l < L; l++)
#endif

/* Rows factored together above KREG species (ldl_solve_v). */
#define KTILE MCDI_KTILE


/* Prefetch distance of the input streams, in doubles (8 blocks ahead). */
#define MCDI_PREFETCH 64

/* Load row src[k0 .. k0+nv-1] into dst[0..L-1], padding with src[k0]. */
KINLINE void load_row(double *restrict dst, const double *restrict src,
                      size_t nv, size_t L)
{
    size_t l;
    /* the next blocks of this input stream (a few dozen streams at once
     * are more than the hardware prefetchers follow) */
    __builtin_prefetch(src + MCDI_PREFETCH, 0, 0);
    if (nv == L) {
        LANES
            dst[l] = src[l];
    } else {
        for (l = 0; l < nv; l++)
            dst[l] = src[l];
        for (; l < L; l++)
            dst[l] = src[0];
    }
}

/* Scalar re-check of one cell in the order of mcd_flux_compute; sets what
 * and returns the status (MCD_OK if the cell is fine). */
static mcd_status check_cell(const mcdi_bjob *jb, size_t k, const char **what)
{
    const size_t n = jb->n, nd = jb->nd, K = jb->K;
    double sum = 0.0;
    size_t i, j;
    if (jb->mix != NULL) {
        if (!mcdi_finite(jb->T[k])) { *what = "T: not finite"; return MCD_EINVAL; }
        if (!(jb->T[k] > 0.0)) { *what = "T: not > 0"; return MCD_EDOM; }
        if (!mcdi_finite(jb->P[k])) { *what = "P: not finite"; return MCD_EINVAL; }
        if (!(jb->P[k] > 0.0)) { *what = "P: not > 0"; return MCD_EDOM; }
        if (!(jb->P[k] / (RGAS * jb->T[k]) >= DBL_MIN)) {
            *what = "P / (R T): concentration not a normal positive number";
            return MCD_EDOM;
        }
    } else {
        if (!mcdi_finite(jb->c[k])) { *what = "c: not finite"; return MCD_EINVAL; }
        if (!(jb->c[k] >= DBL_MIN)) { *what = "c: not a normal positive number"; return MCD_EDOM; }
        for (i = 0; i < n; i++)
            for (j = 0; j < n; j++)
                if (i != j && !mcdi_finite(jb->Dij[(i * n + j) * K + k])) {
                    *what = "Dij: entry not finite";
                    return MCD_EINVAL;
                }
        for (i = 0; i < n; i++)
            for (j = 0; j < n; j++)
                if (i != j && !(jb->Dij[(i * n + j) * K + k] > 0.0)) {
                    *what = "Dij: entry not > 0";
                    return MCD_EDOM;
                }
        for (i = 0; i < n; i++)
            for (j = 0; j < n; j++)
                if (i != j && !(jb->Dij[(i * n + j) * K + k] >= DBL_MIN)) {
                    *what = "Dij: entry subnormal (< DBL_MIN)";
                    return MCD_EDOM;
                }
        for (i = 0; i < n; i++)
            for (j = i + 1; j < n; j++) {
                double a = jb->Dij[(i * n + j) * K + k];
                double b = jb->Dij[(j * n + i) * K + k];
                double big = a > b ? a : b;
                if (!(fabs(a - b) <= 1e-12 * big)) {
                    *what = "Dij: not symmetric to 1e-12";
                    return MCD_EDOM;
                }
            }
    }
    for (i = 0; i < n; i++)
        if (!mcdi_finite(jb->comp[i * K + k])) {
            *what = "comp: entry not finite";
            return MCD_EINVAL;
        }
    for (i = 0; i < n; i++)
        if (!(jb->comp[i * K + k] >= 0.0)) {
            *what = "comp: entry negative";
            return MCD_EDOM;
        }
    for (i = 0; i < n; i++)
        sum += jb->comp[i * K + k];
    if (!(fabs(sum - 1.0) <= MCD_SUM_TOL)) {
        *what = "comp: sum differs from 1 by more than 1e-6";
        return MCD_EDOM;
    }
    for (i = 0; i < n * nd; i++)
        if (!mcdi_finite(jb->grad[i * K + k])) {
            *what = "grad: entry not finite";
            return MCD_EINVAL;
        }
    if (jb->glnP != NULL)
        for (i = 0; i < nd; i++)
            if (!mcdi_finite(jb->glnP[i * K + k])) {
                *what = "grad_lnP: entry not finite";
                return MCD_EINVAL;
            }
    *what = "";
    return MCD_OK;
}

/* Neufeld-Janzen-Aziz collision integral, as binary.c (exact path). */
static double omega_exact(double Ts) { return mcdi_omega_d(Ts); }

/* ------------------------------------------------------------------ */
/* fused LDL^T solve on lane vectors                                    */
/* ------------------------------------------------------------------ */

/* One value per lane of a full block, as a GCC/Clang generic vector: the
 * compiler maps it onto the clone's registers (one zmm, two ymm or four
 * xmm). may_alias: scratch rows are accessed both as double and as this. */
typedef double mcdi_vd
    __attribute__((vector_size(MCDI_VLANES * sizeof(double)), may_alias));
typedef long long mcdi_vl
    __attribute__((vector_size(MCDI_VLANES * sizeof(long long)), may_alias));

/* Up to this many species the pivots and the multipliers W live in local
 * arrays, which become registers once the loops over a constant n are
 * unrolled; above it they live in the caller's scratch. */
#define KREG 8

/* Assemble A = Gs + a s s^T row by row (A holds the packed lower triangle
 * of the inverse diffusivities on entry and L on exit), factor A = L D L^T
 * by rows (W_j = L_ij D_j), run the forward substitution of each row as
 * soon as it is factored, then the diagonal scaling and the backward
 * substitution. R: right-hand sides [i * nd + dd] in, solution out; Dg gets
 * the pivots. Returns 0 if some lane has a pivot that is not > 0 (or NaN).
 *
 * Above KREG species the rows are taken KTILE at a time: the columns left
 * of the tile are done for its rows together, so each loaded L_jk serves
 * KTILE independent multiply-add chains (the factor is in L2 cache at
 * large n; one load per FMA was the limit), then the tile's own triangle
 * row by row. Wm: KTILE * n vectors (the tile's W rows). Up to KREG
 * species W and 1/D are local arrays, registers after unrolling. */
KINLINE void ldl_row_tail(const size_t nd, mcdi_vd *restrict A, const size_t i,
                          const size_t j0, const mcdi_vd *restrict s,
                          const mcdi_vd a, mcdi_vd *restrict W,
                          const mcdi_vd *restrict iD, const mcdi_vd *restrict R,
                          mcdi_vd *restrict f)
{
    mcdi_vd *restrict Ai = A + i * (i + 1) / 2;
    const mcdi_vd si = s[i];
    size_t j, k, dd;
    for (j = j0; j < i; j++) {
        const mcdi_vd *restrict Aj = A + j * (j + 1) / 2;
        mcdi_vd t = si * s[j] * (a - Ai[j]), lij;
        for (k = 0; k < j; k++)
            t -= W[k] * Aj[k];
        W[j] = t;
        lij = t * iD[j];
        Ai[j] = lij;
        for (dd = 0; dd < nd; dd++)
            f[dd] -= lij * R[j * nd + dd];
    }
}

KINLINE int ldl_solve_v(const size_t n, const size_t nd, mcdi_vd *restrict A,
                        const mcdi_vd *restrict s, const mcdi_vd *restrict S,
                        const mcdi_vd *restrict x, const mcdi_vd a,
                        mcdi_vd *restrict R, mcdi_vd *restrict Dg,
                        mcdi_vd *restrict iDm, mcdi_vd *restrict Wm)
{
    mcdi_vd Wl[KREG], iDl[KREG];
    mcdi_vd *restrict iD = n <= KREG ? iDl : iDm;
    const mcdi_vd zero = {0.0};
    mcdi_vl ok = zero == zero; /* all lanes true */
    size_t i, i0, j, k, dd, l, r;
    const size_t step = n <= KREG ? 1 : KTILE; /* rows per tile */
    for (i0 = 0; i0 < n; i0 += step) {
        const size_t nr = n - i0 < step ? n - i0 : step;
        mcdi_vd f[KTILE][MCD_MAX_DIM];
        for (r = 0; r < nr; r++)
            for (dd = 0; dd < nd; dd++)
                f[r][dd] = R[(i0 + r) * nd + dd];
        if (n > KREG && nr == KTILE) {
            /* columns j < i0 for the KTILE rows together */
            for (j = 0; j < i0; j++) {
                const mcdi_vd *restrict Aj = A + j * (j + 1) / 2;
                const mcdi_vd sj = s[j];
                mcdi_vd t[KTILE];
                for (r = 0; r < KTILE; r++)
                    t[r] = s[i0 + r] * sj *
                           (a - A[(i0 + r) * (i0 + r + 1) / 2 + j]);
                for (k = 0; k < j; k++) {
                    const mcdi_vd ajk = Aj[k];
                    for (r = 0; r < KTILE; r++)
                        t[r] -= Wm[r * n + k] * ajk;
                }
                for (r = 0; r < KTILE; r++) {
                    const mcdi_vd lij = t[r] * iD[j];
                    Wm[r * n + j] = t[r];
                    A[(i0 + r) * (i0 + r + 1) / 2 + j] = lij;
                    for (dd = 0; dd < nd; dd++)
                        f[r][dd] -= lij * R[j * nd + dd];
                }
            }
        }
        for (r = 0; r < nr; r++) {
            const size_t ii = i0 + r;
            mcdi_vd *restrict W = n <= KREG ? Wl : Wm + r * n;
            mcdi_vd *restrict Ai = A + ii * (ii + 1) / 2;
            mcdi_vd dg;
            ldl_row_tail(nd, A, ii, (n > KREG && nr == KTILE) ? i0 : 0, s, a,
                         W, iD, R, f[r]);
            dg = S[ii] + a * x[ii];
            for (k = 0; k < ii; k++)
                dg -= W[k] * Ai[k];
            Dg[ii] = dg;
            ok &= dg > zero;
            iD[ii] = 1.0 / dg;
            for (dd = 0; dd < nd; dd++)
                R[ii * nd + dd] = f[r][dd];
        }
    }
    for (l = 0; l < MCDI_VLANES; l++)
        if (ok[l] == 0)
            return 0;
    for (i = n; i-- > 0;) {
        mcdi_vd f[MCD_MAX_DIM];
        for (dd = 0; dd < nd; dd++)
            f[dd] = R[i * nd + dd] * iD[i];
        for (k = i + 1; k < n; k++) {
            const mcdi_vd lki = A[k * (k + 1) / 2 + i];
            for (dd = 0; dd < nd; dd++)
                f[dd] -= lki * R[k * nd + dd];
        }
        for (dd = 0; dd < nd; dd++)
            R[i * nd + dd] = f[dd];
    }
    return 1;
}

#if MCDI_CAN_STREAM
/* Streaming stores of one full block (batch.h). Row e starts o_e doubles
 * into a 64-byte line (o_e is the same for every block of the row). With
 * o_e = 0 the block is the line. Otherwise the line at p - o_e takes the
 * last o_e values of the previous block (the carry) and the first 8 - o_e
 * of this one; the rest wait in the carry. A block that does not follow
 * the carry's block in this thread (the thread's first, or one after a
 * block that failed or went through another path) writes its first
 * 8 - o_e values with ordinary masked stores; a carry left over is
 * written the same way (stream_flush). No cell outside the block and the
 * carry is ever touched, so threads never write each other's cells. */
KINLINE __m512i stream_index(unsigned o)
{
    /* line[j] = j < o ? prev[8 - o + j] : cur[j - o] (vpermt2pd) */
    return _mm512_add_epi64(_mm512_set1_epi64((long long)(8u - o)),
                            _mm512_set_epi64(7, 6, 5, 4, 3, 2, 1, 0));
}

static void stream_flush(size_t rows, double *outb, size_t K, double *nts)
{
    mcdi_stream_state *st = (mcdi_stream_state *)(void *)nts;
    const __m512d *carry = (const __m512d *)(void *)(nts + 8);
    size_t e, k0p;
    if (!st->pending)
        return;
    k0p = st->next_k0 - 8;
    for (e = 0; e < rows; e++) {
        double *p = outb + e * K + k0p;
        const unsigned o = (unsigned)(((uintptr_t)p >> 3) & 7u);
        if (o != 0) /* lanes 8 - o .. 7 are still held back */
            _mm512_mask_storeu_pd(p, (__mmask8)((0xFFu << (8u - o)) & 0xFFu),
                                  carry[e]);
    }
    st->pending = 0;
}

KINLINE void stream_rows(size_t rows, const mcdi_vd *restrict J, double *outb,
                         size_t K, size_t k0, double *nts)
{
    mcdi_stream_state *st = (mcdi_stream_state *)(void *)nts;
    __m512d *carry = (__m512d *)(void *)(nts + 8);
    const int cont = st->pending && st->next_k0 == k0;
    size_t e;
    if (st->pending && !cont)
        stream_flush(rows, outb, K, nts);
    for (e = 0; e < rows; e++) {
        double *p = outb + e * K + k0;
        const unsigned o = (unsigned)(((uintptr_t)p >> 3) & 7u);
        const __m512d cur = (__m512d)J[e];
        if (o == 0) {
            _mm512_stream_pd(p, cur);
            continue;
        }
        if (cont)
            _mm512_stream_pd(p - o, _mm512_permutex2var_pd(carry[e],
                                                           stream_index(o),
                                                           cur));
        else
            _mm512_mask_storeu_pd(p, (__mmask8)(0xFFu >> o), cur);
        carry[e] = cur;
    }
    st->pending = 1;
    st->next_k0 = k0 + 8;
}
#endif

/* Molar fluxes of a full block from the solution U of the scaled system:
 * J_i = c (s_i U_i + t_i - x_i sum_t t_t), then the zero-sum clean-up
 * J_i -= x_i sum_k J_k, written to out[e * K + l] (e = i * nd + dd) in the
 * same pass (with `stream`, by stream_rows). J: scratch for one
 * direction's fluxes. Returns 0 (nothing written, J holds all fluxes) if
 * some flux is not finite. */
KINLINE int emit_mole_v(const size_t n, const size_t nd,
                        const mcdi_vd *restrict s, const mcdi_vd *restrict x,
                        const mcdi_vd *restrict U, const mcdi_vd *restrict t,
                        const int ntr, const mcdi_vd c, mcdi_vd *restrict J,
                        double *restrict outb, const size_t K,
                        const size_t k0, const int stream, double *nts)
{
    double *restrict out = outb + k0;
    const mcdi_vd zero = {0.0};
    mcdi_vd nan_acc = zero; /* q * 0 is NaN exactly when q is inf or NaN */
    double lanes_sum = 0.0;
    size_t i, dd, e, l;
    for (dd = 0; dd < nd; dd++) {
        mcdi_vd st = zero, rs = zero;
        if (ntr)
            for (i = 0; i < n; i++)
                st += t[i * nd + dd];
        for (i = 0; i < n; i++) {
            mcdi_vd q;
            e = i * nd + dd;
            q = s[i] * U[e];
            if (ntr)
                q += t[e] - x[i] * st;
            q *= c;
            J[e] = q;
            rs += q;
        }
        for (i = 0; i < n; i++) {
            mcdi_vd q;
            e = i * nd + dd;
            q = J[e] - x[i] * rs;
            nan_acc += q * zero;
            J[e] = q;
        }
    }
    /* one horizontal sum per block: a per-element compare-and-mask cost
     * 13 % of the whole N = 10 block (profiled) */
    for (l = 0; l < MCDI_VLANES; l++)
        lanes_sum += nan_acc[l];
    if (lanes_sum != lanes_sum)
        return 0;
#if MCDI_CAN_STREAM
    if (stream) {
        stream_rows(n * nd, J, outb, K, k0, nts);
        return 1;
    }
#else
    (void)stream;
    (void)nts;
#endif
    for (e = 0; e < n * nd; e++)
        memcpy(out + e * K, &J[e], sizeof J[e]);
    return 1;
}

/* The Ern-Giovangigli step around the product P_e = sum_j invD_ij SU_j:
 * iter_su forms SU = s U; iter_finish turns P (held in V) into the next
 * iterate V_e = x_i U_e + minv_i (s_i f P_e + d_e wk_i), with f = 1 when
 * P already holds the inverse diffusivities' scale. */
KINLINE void iter_su(const size_t n, const size_t nd,
                     const mcdi_vd *restrict s, const mcdi_vd *restrict U,
                     mcdi_vd *restrict SU)
{
    size_t i, dd;
    for (i = 0; i < n; i++)
        for (dd = 0; dd < nd; dd++)
            SU[i * nd + dd] = s[i] * U[i * nd + dd];
}

KINLINE void iter_finish(const size_t n, const size_t nd, const mcdi_vd f,
                         const mcdi_vd *restrict s, const mcdi_vd *restrict x,
                         const mcdi_vd *restrict minv,
                         const mcdi_vd *restrict wk,
                         const mcdi_vd *restrict d,
                         const mcdi_vd *restrict U, mcdi_vd *restrict V)
{
    size_t i, dd;
    for (i = 0; i < n; i++)
        for (dd = 0; dd < nd; dd++) {
            const size_t e = i * nd + dd;
            V[e] = x[i] * U[e] + minv[i] * (s[i] * f * V[e] + d[e] * wk[i]);
        }
}

/* One Ern-Giovangigli step before the projection, on full lane vectors:
 * V_e = x_i U_e + minv_i (s_i sum_{j != i} invD_ij s_j U_{j,dd} + d_e wk_i),
 * e = i * nd + dd (the products s_j U_j are formed once, in SU).
 * Q: packed lower inverse diffusivities. The product is symmetric: each
 * q_ij (j < i) is loaded once and used for both rows, row i accumulating
 * q SU_j in registers and row j accumulating q SU_i in V, so the packed
 * triangle (L2-resident at large n: 320 kB at n = 100) is read once per
 * iteration instead of twice. Above KREG species the rows are taken KTILE
 * at a time, so that each V_j is loaded and stored once per tile. */
KINLINE void iter_product_v(const size_t n, const size_t nd,
                            const mcdi_vd *restrict Q,
                            const mcdi_vd *restrict s,
                            const mcdi_vd *restrict x,
                            const mcdi_vd *restrict minv,
                            const mcdi_vd *restrict wk,
                            const mcdi_vd *restrict d,
                            const mcdi_vd *restrict U, mcdi_vd *restrict SU,
                            mcdi_vd *restrict V)
{
    const mcdi_vd zero = {0.0}, one = zero + 1.0;
    size_t i, j, dd, r, jj, i0 = 0;
    iter_su(n, nd, s, U, SU);
    for (i = 0; i < n * nd; i++)
        V[i] = zero;
    for (; n > KREG && i0 + KTILE <= n; i0 += KTILE) {
        mcdi_vd acc[KTILE][MCD_MAX_DIM];
        const mcdi_vd *restrict Qr[KTILE];
        for (r = 0; r < KTILE; r++) {
            Qr[r] = Q + (i0 + r) * (i0 + r + 1) / 2;
            for (dd = 0; dd < nd; dd++)
                acc[r][dd] = zero;
        }
        for (j = 0; j < i0; j++) {
            mcdi_vd t[MCD_MAX_DIM];
            for (dd = 0; dd < nd; dd++)
                t[dd] = V[j * nd + dd];
            for (r = 0; r < KTILE; r++) {
                const mcdi_vd q = Qr[r][j];
                for (dd = 0; dd < nd; dd++) {
                    acc[r][dd] += q * SU[j * nd + dd];
                    t[dd] += q * SU[(i0 + r) * nd + dd];
                }
            }
            for (dd = 0; dd < nd; dd++)
                V[j * nd + dd] = t[dd];
        }
        /* pairs inside the tile */
        for (r = 1; r < KTILE; r++)
            for (jj = 0; jj < r; jj++) {
                const mcdi_vd q = Qr[r][i0 + jj];
                for (dd = 0; dd < nd; dd++) {
                    acc[r][dd] += q * SU[(i0 + jj) * nd + dd];
                    acc[jj][dd] += q * SU[(i0 + r) * nd + dd];
                }
            }
        for (r = 0; r < KTILE; r++)
            for (dd = 0; dd < nd; dd++)
                V[(i0 + r) * nd + dd] += acc[r][dd];
    }
    for (i = i0; i < n; i++) {
        const mcdi_vd *restrict Qi = Q + i * (i + 1) / 2;
        mcdi_vd acc[MCD_MAX_DIM];
        for (dd = 0; dd < nd; dd++)
            acc[dd] = zero;
        for (j = 0; j < i; j++) {
            const mcdi_vd q = Qi[j];
            for (dd = 0; dd < nd; dd++) {
                acc[dd] += q * SU[j * nd + dd];
                V[j * nd + dd] += q * SU[i * nd + dd];
            }
        }
        for (dd = 0; dd < nd; dd++)
            V[i * nd + dd] += acc[dd];
    }
    iter_finish(n, nd, one, s, x, minv, wk, d, U, V);
}

/* The same step when every pair follows the exact power law (Fuller or
 * the caller's value): invD_ij = f_l C_ij with C = 1 / coef (mixture,
 * n x n, zero diagonal) the same for every cell, so the coefficients are
 * scalars shared by the lanes (broadcast from a small matrix) and no
 * per-lane triangle is read at all; the rows are taken KTILE at a time so
 * that each SU_j load feeds KTILE * nd multiply-adds. f: P / T^1.75. */
KINLINE void iter_product_c(const size_t n, const size_t nd,
                            const double *restrict C, const mcdi_vd f,
                            const mcdi_vd *restrict s,
                            const mcdi_vd *restrict x,
                            const mcdi_vd *restrict minv,
                            const mcdi_vd *restrict wk,
                            const mcdi_vd *restrict d,
                            const mcdi_vd *restrict U, mcdi_vd *restrict SU,
                            mcdi_vd *restrict V)
{
    const mcdi_vd zero = {0.0};
    size_t i, j, dd, r, i0 = 0;
    iter_su(n, nd, s, U, SU);
    for (; i0 + KTILE <= n; i0 += KTILE) {
        mcdi_vd acc[KTILE][MCD_MAX_DIM];
        for (r = 0; r < KTILE; r++)
            for (dd = 0; dd < nd; dd++)
                acc[r][dd] = zero;
        for (j = 0; j < n; j++)
            for (r = 0; r < KTILE; r++) {
                const double q = C[(i0 + r) * n + j];
                for (dd = 0; dd < nd; dd++)
                    acc[r][dd] += q * SU[j * nd + dd];
            }
        for (r = 0; r < KTILE; r++)
            for (dd = 0; dd < nd; dd++)
                V[(i0 + r) * nd + dd] = acc[r][dd];
    }
    for (i = i0; i < n; i++) {
        const double *restrict Ci = C + i * n;
        mcdi_vd acc[MCD_MAX_DIM];
        for (dd = 0; dd < nd; dd++)
            acc[dd] = zero;
        for (j = 0; j < n; j++)
            for (dd = 0; dd < nd; dd++)
                acc[dd] += Ci[j] * SU[j * nd + dd];
        for (dd = 0; dd < nd; dd++)
            V[i * nd + dd] = acc[dd];
    }
    iter_finish(n, nd, f, s, x, minv, wk, d, U, V);
}

/* ------------------------------------------------------------------ */
/* the stages of a block, in the order body() runs them                */
/* ------------------------------------------------------------------ */

/* Each stage reads and writes the regions of the block's scratch
 * (batch_layout.h) and is inlined into body(), which is instantiated for
 * constant n, L and nd; a stage that checks inputs returns non-zero when
 * some lane is out of range (the cell is then named by report_bad_cell).
 * Adding a driving force means changing stage_forces (and its loader). */

/* Per-cell scalars: c, or T and P (and c = P / (R T)) of a mixture call. */
KINLINE int stage_load_scalars(const mcdi_bjob *jb, const mcdi_kblock *b,
                               size_t k0, size_t nv, const size_t L)
{
    double *restrict c = b->c;
    int bad = 0;
    size_t l;
    if (jb->mix != NULL) {
        double *restrict Tl = b->T, *restrict Pl = b->P;
        load_row(Tl, jb->T + k0, nv, L);
        load_row(Pl, jb->P + k0, nv, L);
        LANES_BAD {
            bad |= !((Tl[l] > 0.0) & (Tl[l] <= DBL_MAX));
            bad |= !((Pl[l] > 0.0) & (Pl[l] <= DBL_MAX));
            c[l] = Pl[l] / (RGAS * Tl[l]);
            bad |= !(c[l] >= DBL_MIN); /* a normal c, as single-state */
        }
    } else {
        load_row(c, jb->c + k0, nv, L);
        LANES_BAD
            bad |= !((c[l] >= DBL_MIN) & (c[l] <= DBL_MAX)); /* normal c, as single-state */
    }
    return bad;
}

/* The composition rows (into x or w) and their sums. */
KINLINE int stage_load_comp(const mcdi_bjob *jb, const mcdi_kblock *b,
                            size_t k0, size_t nv, const size_t n,
                            const size_t L)
{
    const size_t K = jb->K;
    double *restrict sum = b->sum;
    double *restrict y = jb->comp_basis == MCD_BASIS_MASS ? b->w : b->x;
    int bad = 0;
    size_t i, l;
    LANES
        sum[l] = 0.0;
    for (i = 0; i < n; i++) {
        load_row(y + i * L, jb->comp + i * K + k0, nv, L);
        LANES_BAD {
            double q = y[i * L + l];
            bad |= !((q >= 0.0) & (q <= DBL_MAX));
            sum[l] += q;
        }
    }
    LANES_BAD
        bad |= !(fabs(sum[l] - 1.0) <= MCD_SUM_TOL);
    return bad;
}

/* Fractions scaled to sum 1, and the other basis (w needs M). */
KINLINE void stage_fractions(const mcdi_bjob *jb, const mcdi_kblock *b,
                             const size_t n, const size_t L)
{
    const int mass_in = jb->comp_basis == MCD_BASIS_MASS;
    const double *M = jb->M;
    double *restrict x = b->x, *restrict w = b->w, *restrict sum = b->sum;
    double *restrict y = mass_in ? w : x;
    size_t i, l;
    for (i = 0; i < n; i++)
        LANES
            y[i * L + l] = y[i * L + l] / sum[l];
    if (mass_in) {
        /* x_i = (w_i / M_i) / sum_k w_k / M_k */
        LANES
            sum[l] = 0.0;
        for (i = 0; i < n; i++)
            LANES
                sum[l] += w[i * L + l] / M[i];
        for (i = 0; i < n; i++)
            LANES
                x[i * L + l] = (w[i * L + l] / M[i]) / sum[l];
    } else if (M != NULL) {
        LANES
            sum[l] = 0.0;
        for (i = 0; i < n; i++)
            LANES
                sum[l] += x[i * L + l] * M[i];
        for (i = 0; i < n; i++)
            LANES
                w[i * L + l] = x[i * L + l] * M[i] / sum[l];
    }
}

/* The gradients (into d) and grad ln P (into v). */
KINLINE int stage_load_forces(const mcdi_bjob *jb, const mcdi_kblock *b,
                              size_t k0, size_t nv, const size_t n,
                              const size_t L, const size_t nd)
{
    const size_t K = jb->K;
    double *restrict d = b->d, *restrict v = b->v;
    int bad = 0;
    size_t i, dd, l;
    for (i = 0; i < n * nd; i++) {
        load_row(d + i * L, jb->grad + i * K + k0, nv, L);
        LANES_BAD
            bad |= !(fabs(d[i * L + l]) <= DBL_MAX);
    }
    if (jb->glnP != NULL) {
        for (dd = 0; dd < nd; dd++) {
            load_row(v + dd * L, jb->glnP + dd * K + k0, nv, L);
            LANES_BAD
                bad |= !(fabs(v[dd * L + l]) <= DBL_MAX);
        }
    }
    return bad;
}

/* Driving forces d_i = grad x_i + (x_i - w_i) grad ln P, projected onto
 * sum_i d_i = 0 with weights x (the gradients of mass fractions are
 * turned into those of mole fractions first). */
KINLINE void stage_forces(const mcdi_bjob *jb, const mcdi_kblock *b,
                          const size_t n, const size_t L, const size_t nd)
{
    const double *M = jb->M;
    double *restrict d = b->d, *restrict v = b->v;
    const double *restrict x = b->x, *restrict w = b->w;
    size_t i, dd, l;
    if (jb->comp_basis == MCD_BASIS_MASS) {
        /* dx_i = (dw_i - w_i dT/T) / (M_i T), T = sum w_k / M_k */
        double *restrict Tw = b->tw, *restrict rr = b->col;
        LANES
            Tw[l] = 0.0;
        for (i = 0; i < n; i++)
            LANES
                Tw[l] += w[i * L + l] / M[i];
        for (dd = 0; dd < nd; dd++) {
            LANES
                rr[l] = 0.0;
            for (i = 0; i < n; i++)
                LANES
                    rr[l] += d[(i * nd + dd) * L + l] / M[i];
            LANES
                rr[l] = rr[l] / Tw[l];
            for (i = 0; i < n; i++)
                LANES
                    d[(i * nd + dd) * L + l] =
                        (d[(i * nd + dd) * L + l] - w[i * L + l] * rr[l]) /
                        (M[i] * Tw[l]);
        }
    }
    if (jb->glnP != NULL)
        for (i = 0; i < n; i++)
            for (dd = 0; dd < nd; dd++)
                LANES
                    d[(i * nd + dd) * L + l] +=
                        (x[i * L + l] - w[i * L + l]) * v[dd * L + l];
    /* projection onto sum_i d_i = 0 with weights x */
    for (dd = 0; dd < nd; dd++) {
        double *restrict sd = b->col;
        LANES
            sd[l] = 0.0;
        for (i = 0; i < n; i++)
            LANES
                sd[l] += d[(i * nd + dd) * L + l];
        for (i = 0; i < n; i++)
            LANES
                d[(i * nd + dd) * L + l] -= x[i * L + l] * sd[l];
    }
}

/* Inverse binary diffusivities (packed lower, i > j) from the caller's
 * per-cell Dij: both triangles checked (normal, finite, symmetric). */
KINLINE int stage_invdiff_dij(const mcdi_bjob *jb, const mcdi_kblock *b,
                              size_t k0, size_t nv, const size_t n,
                              const size_t L)
{
    const size_t K = jb->K;
    double *restrict wk = b->wk;
    int bad = 0;
    size_t i, j, l;
    for (i = 1; i < n; i++)
        for (j = 0; j < i; j++) {
            double *q = b->tri + (i * (i + 1) / 2 + j) * L;
            const double *up = jb->Dij + (j * n + i) * K + k0;
            const double *lo = jb->Dij + (i * n + j) * K + k0;
            load_row(q, up, nv, L);
            load_row(wk, lo, nv, L);
            LANES_BAD {
                double a = q[l], bb = wk[l], m = a > bb ? a : bb;
                bad |= !((a >= DBL_MIN) & (a <= DBL_MAX));
                bad |= !((bb >= DBL_MIN) & (bb <= DBL_MAX));
                bad |= !(fabs(a - bb) <= 1e-12 * m);
                q[l] = 1.0 / a;
            }
        }
    return bad;
}

/* Temperature factors of a mixture call: P / T^1.75 (FSG and user pairs),
 * P / T^1.5 and, where the mixture has a fit, the Chebyshev polynomials
 * of ln T. Returns whether every lane lies inside the fit's range. */
KINLINE int stage_temperature(const mcd_mixture *mx, const mcdi_kblock *b,
                              int any_lj, const size_t L)
{
    const double *restrict Tl = b->T, *restrict Pl = b->P;
    double *restrict f175 = b->f175, *restrict f15 = b->f15;
    double *restrict infit = b->infit, *restrict cheb = b->cheb;
    int all_fit = 1;
    size_t k, l;
    LANES {
        double sq = sqrt(Tl[l]), qq = sqrt(sq);
        f175[l] = Pl[l] / (Tl[l] * sq * qq); /* P / T^1.75 */
        f15[l] = Pl[l] / (Tl[l] * sq);       /* P / T^1.5 */
    }
    if (any_lj && mx->fit_on) {
        LANES {
            double u = (log(Tl[l]) - mx->fit_lmid) / mx->fit_lhalf;
            infit[l] = (Tl[l] >= mx->fit_Tmin && Tl[l] <= mx->fit_Tmax);
            if (!(infit[l] > 0.0)) {
                all_fit = 0;
                u = 0.0;
            }
            cheb[l] = 1.0;
            cheb[L + l] = u;
        }
        for (k = 2; k <= MCDI_FIT_MAXDEG; k++)
            LANES
                cheb[k * L + l] = 2.0 * cheb[L + l] * cheb[(k - 1) * L + l] -
                                  cheb[(k - 2) * L + l];
    } else {
        all_fit = 0;
        LANES
            infit[l] = 0.0;
    }
    return all_fit;
}

/* Inverse binary diffusivity of pair ij of a mixture at the lanes' T and
 * P into q: power law, the fit, or the exact collision integral. */
KINLINE void invdiff_pair(const mcd_mixture *mx, const mcdi_kblock *b,
                          size_t ij, int all_fit, double *restrict q,
                          const size_t L)
{
    const double *restrict Tl = b->T, *restrict Pl = b->P;
    const double *restrict infit = b->infit, *restrict cheb = b->cheb;
    int m = mx->method[ij];
    size_t k, l;
    if (m == MCD_METHOD_FSG || m == MCD_METHOD_USER) {
        const double ic = mx->icoef[ij], *restrict f175 = b->f175;
        LANES
            q[l] = f175[l] * ic;
        return;
    }
    {
        unsigned deg = (mx->fit_on && mx->fit_deg != NULL) ? mx->fit_deg[ij]
                                                           : 0u;
        if (deg > 0) {
            const double *fq = mx->fit_q + ij * (MCDI_FIT_MAXDEG + 1);
            const double *restrict f15 = b->f15;
            LANES
                q[l] = fq[0];
            for (k = 1; k <= deg; k++)
                LANES
                    q[l] += fq[k] * cheb[k * L + l];
            LANES
                q[l] *= f15[l];
        }
        if (deg == 0 || !all_fit) {
            double e = mx->eps[ij], cf = mx->coef[ij];
            LANES
                if (deg == 0 || !(infit[l] > 0.0))
                    q[l] = (Pl[l] * omega_exact(Tl[l] / e)) /
                           (cf * Tl[l] * sqrt(Tl[l]));
        }
    }
}

/* Inverse binary diffusivities of a mixture call (none with the shared
 * power-law coefficients, pl: iter_product_c reads those directly). */
KINLINE void stage_invdiff_mixture(const mcdi_bjob *jb, const mcdi_kblock *b,
                                   int pl, const size_t n, const size_t L)
{
    const mcd_mixture *mx = jb->mix;
    const int all_fit = stage_temperature(mx, b, jb->mix_has_omega, L);
    size_t i, j;
    for (i = 1; i < n && !pl; i++)
        for (j = 0; j < i; j++)
            invdiff_pair(mx, b, i * n + j, all_fit,
                         b->tri + (i * (i + 1) / 2 + j) * L, L);
}

/* Blanc sums S_i = sum_{j != i} x_j / Đ_ij and num_i = sum_{j != i} x_j. */
KINLINE void stage_blanc(const mcdi_bjob *jb, const mcdi_kblock *b, int pl,
                         const size_t n, const size_t L)
{
    double *restrict S = b->S, *restrict num = b->num;
    const double *restrict x = b->x;
    size_t i, j, l;
    if (pl) {
        /* S_i = f sum_j C_ij x_j (C_ii = 0) */
        const mcdi_vd *xv = (const mcdi_vd *)x, f = *(const mcdi_vd *)b->f175;
        const double *C = jb->mix->icoef;
        for (i = 0; i < n; i++) {
            mcdi_vd as = {0.0}, an = {0.0};
            for (j = 0; j < n; j++)
                as += C[i * n + j] * xv[j];
            for (j = 0; j < i; j++)
                an += xv[j];
            for (j = i + 1; j < n; j++)
                an += xv[j];
            ((mcdi_vd *)S)[i] = f * as;
            ((mcdi_vd *)num)[i] = an;
        }
    } else if (L == MCDI_VLANES) {
        /* row by row, accumulated in registers */
        const mcdi_vd *xv = (const mcdi_vd *)x, *qv = (const mcdi_vd *)b->tri;
        for (i = 0; i < n; i++) {
            mcdi_vd as = {0.0}, an = {0.0};
            for (j = 0; j < i; j++) {
                as += xv[j] * qv[i * (i + 1) / 2 + j];
                an += xv[j];
            }
            for (j = i + 1; j < n; j++) {
                as += xv[j] * qv[j * (j + 1) / 2 + i];
                an += xv[j];
            }
            ((mcdi_vd *)S)[i] = as;
            ((mcdi_vd *)num)[i] = an;
        }
    } else {
        for (i = 0; i < n * L; i++)
            S[i] = num[i] = 0.0;
        for (i = 1; i < n; i++)
            for (j = 0; j < i; j++) {
                const double *q = b->tri + (i * (i + 1) / 2 + j) * L;
                LANES {
                    S[i * L + l] += x[j * L + l] * q[l];
                    S[j * L + l] += x[i * L + l] * q[l];
                    num[i * L + l] += x[j * L + l];
                    num[j * L + l] += x[i * L + l];
                }
            }
    }
}

/* Mixture-averaged fluxes: J*_i = -c D_im d_i, D_im = num_i / S_i (the
 * equal-weight harmonic mean for a pure species, as mixavg.c), then
 * J = J* - x sum J* (the zero-sum clean-up of body() runs it again). */
KINLINE void stage_mixavg(const mcdi_kblock *b, const size_t n,
                          const size_t L, const size_t nd)
{
    const double *restrict S = b->S, *restrict num = b->num;
    const double *restrict x = b->x, *restrict c = b->c, *restrict d = b->d;
    double *restrict minv = b->minv, *restrict wk = b->wk, *restrict J = b->J;
    int pure = 0;
    size_t i, j, dd, l;
    for (i = 0; i < n * L; i++)
        pure |= !(S[i] > 0.0);
    if (pure) {
        for (i = 0; i < n * L; i++)
            minv[i] = 0.0;
        for (i = 1; i < n; i++)
            for (j = 0; j < i; j++) {
                const double *q = b->tri + (i * (i + 1) / 2 + j) * L;
                LANES {
                    minv[i * L + l] += q[l];
                    minv[j * L + l] += q[l];
                }
            }
    }
    for (i = 0; i < n; i++)
        LANES {
            double Sl = S[i * L + l];
            double Dim = Sl > 0.0 ? num[i * L + l] / Sl
                                  : (double)(n - 1) / minv[i * L + l];
            wk[i * L + l] = -Dim;
        }
    for (dd = 0; dd < nd; dd++) {
        double *restrict sj = b->col;
        LANES
            sj[l] = 0.0;
        for (i = 0; i < n; i++)
            LANES {
                /* c last: c D_im underflows where the flux does not
                 * (c = 1e-300, Đ = 1e-30: test_edge_cases) */
                double q = c[l] * (wk[i * L + l] * d[(i * nd + dd) * L + l]);
                J[(i * nd + dd) * L + l] = q;
                sj[l] += q;
            }
        for (i = 0; i < n; i++)
            LANES
                J[(i * nd + dd) * L + l] -= x[i * L + l] * sj[l];
    }
}

/* s = sqrt(x); trace fluxes t_i = J_i / c = -d_i / S_i for x_i = 0 (else
 * 0), and their coupling to the species present moved to the right-hand
 * side: d_k -= x_k sum_t t_t / Đ_kt. Returns whether a lane has a trace
 * species. */
KINLINE int stage_trace(const mcdi_bjob *jb, const mcdi_kblock *b, int pl,
                        const size_t n, const size_t L, const size_t nd)
{
    const double *restrict S = b->S, *restrict x = b->x;
    double *restrict s = b->s, *restrict t = b->t, *restrict d = b->d;
    int ntr = 0;
    size_t i, j, dd, l;
    for (i = 0; i < n * L; i++) {
        s[i] = sqrt(x[i]);
        ntr |= !(x[i] > 0.0);
    }
    for (i = 0; i < n * nd * L; i++)
        t[i] = 0.0;
    if (!ntr)
        return 0;
    for (i = 0; i < n; i++)
        for (dd = 0; dd < nd; dd++)
            LANES {
                double Sl = S[i * L + l];
                double q = -d[(i * nd + dd) * L + l] / (Sl > 0.0 ? Sl : 1.0);
                t[(i * nd + dd) * L + l] = x[i * L + l] > 0.0 ? 0.0 : q;
            }
    if (pl)
        for (i = 1; i < n; i++)
            for (j = 0; j < i; j++) {
                double *q = b->tri + (i * (i + 1) / 2 + j) * L;
                const double ic = jb->mix->icoef[i * n + j];
                const double *restrict f175 = b->f175;
                LANES
                    q[l] = f175[l] * ic;
            }
    for (i = 1; i < n; i++)
        for (j = 0; j < i; j++) {
            const double *q = b->tri + (i * (i + 1) / 2 + j) * L;
            for (dd = 0; dd < nd; dd++)
                LANES {
                    d[(i * nd + dd) * L + l] -=
                        x[i * L + l] * t[(j * nd + dd) * L + l] * q[l];
                    d[(j * nd + dd) * L + l] -=
                        x[j * L + l] * t[(i * nd + dd) * L + l] * q[l];
                }
        }
    return 1;
}

/* Right-hand side b_i = -d_i / s_i (0 for trace species) into r; wk keeps
 * -1 / s_i (the iteration recomputes b from it). */
KINLINE void stage_rhs(const mcdi_kblock *b, const size_t n, const size_t L,
                       const size_t nd)
{
    const double *restrict s = b->s, *restrict d = b->d;
    double *restrict wk = b->wk, *restrict r = b->r;
    size_t i, dd, l;
    for (i = 0; i < n; i++)
        LANES
            wk[i * L + l] = s[i * L + l] > 0.0 ? -1.0 / s[i * L + l] : 0.0;
    for (i = 0; i < n; i++)
        for (dd = 0; dd < nd; dd++)
            LANES
                r[(i * nd + dd) * L + l] =
                    d[(i * nd + dd) * L + l] * wk[i * L + l];
}

/* LDL^T of A = Gs + a s s^T one lane row at a time (blocks of L lanes
 * other than the vector width: one cell of a large n), then the solve of
 * L D L^T U = b for each direction, in r. Returns 0 on a pivot that is not
 * > 0 (or NaN). */
KINLINE int ldl_solve_rows(const mcdi_kblock *b, const size_t n,
                           const size_t L, const size_t nd)
{
    const double *restrict s = b->s, *restrict S = b->S, *restrict x = b->x;
    const double *restrict amax = b->amax;
    double *restrict tri = b->tri, *restrict wk = b->wk, *restrict Dg = b->Dg;
    double *restrict iDg = b->iDg, *restrict r = b->r, *restrict acc = b->acc;
    int sing = 0;
    size_t i, j, k, dd, l;
    /* A = Gs + a s s^T in place of invD */
    for (i = 0; i < n; i++) {
        double *row = tri + (i * (i + 1) / 2) * L;
        for (j = 0; j < i; j++)
            LANES
                row[j * L + l] = s[i * L + l] * s[j * L + l] *
                                 (amax[l] - row[j * L + l]);
        LANES
            row[i * L + l] = S[i * L + l] + amax[l] * x[i * L + l];
    }
    /* LDL^T, left-looking, packed lower */
    for (j = 0; j < n; j++) {
        double *Lj = tri + (j * (j + 1) / 2) * L;
        for (k = 0; k < j; k++)
            LANES
                wk[k * L + l] = Lj[k * L + l] * Dg[k * L + l];
        LANES
            acc[l] = Lj[j * L + l];
        for (k = 0; k < j; k++)
            LANES
                acc[l] -= Lj[k * L + l] * wk[k * L + l];
        LANES {
            Dg[j * L + l] = acc[l];
            sing |= !(acc[l] > 0.0);
            iDg[j * L + l] = 1.0 / acc[l];
        }
        for (i = j + 1; i < n; i++) {
            double *Li = tri + (i * (i + 1) / 2) * L;
            LANES
                acc[l] = Li[j * L + l];
            for (k = 0; k < j; k++)
                LANES
                    acc[l] -= Li[k * L + l] * wk[k * L + l];
            LANES
                Li[j * L + l] = acc[l] * iDg[j * L + l];
        }
    }
    if (sing)
        return 0;
    for (dd = 0; dd < nd; dd++) {
        for (i = 0; i < n; i++) {
            const double *Li = tri + (i * (i + 1) / 2) * L;
            double *ri = r + (i * nd + dd) * L;
            for (k = 0; k < i; k++)
                LANES
                    ri[l] -= Li[k * L + l] * r[(k * nd + dd) * L + l];
        }
        for (i = 0; i < n; i++)
            LANES
                r[(i * nd + dd) * L + l] *= iDg[i * L + l];
        for (i = n; i-- > 0;) {
            const double *Li = tri + (i * (i + 1) / 2) * L;
            double *ri = r + (i * nd + dd) * L;
            for (k = 0; k < i; k++)
                LANES
                    r[(k * nd + dd) * L + l] -= Li[k * L + l] * ri[l];
        }
    }
    return 1;
}

/* Exact model: a = the largest Blanc sum of the species present (of all
 * species for a pure component), then (Gs + a s s^T) U = b solved in r.
 * Returns 0 if some lane's matrix is not positive definite. */
KINLINE int stage_exact(const mcdi_kblock *b, const size_t n, const size_t L,
                        const size_t nd)
{
    const double *restrict S = b->S, *restrict x = b->x;
    double *restrict amax = b->amax, *restrict amax2 = b->amax2;
    size_t i, l;
    LANES
        amax[l] = amax2[l] = 0.0;
    for (i = 0; i < n; i++)
        LANES {
            double Sl = S[i * L + l];
            double Sp = x[i * L + l] > 0.0 ? Sl : 0.0;
            amax[l] = Sp > amax[l] ? Sp : amax[l];
            amax2[l] = Sl > amax2[l] ? Sl : amax2[l];
        }
    LANES
        amax[l] = amax[l] > 0.0 ? amax[l] : amax2[l];
    if (L == MCDI_VLANES)
        /* assembly, LDL^T and both substitutions fused, in registers */
        return ldl_solve_v(n, nd, (mcdi_vd *)b->tri, (const mcdi_vd *)b->s,
                           (const mcdi_vd *)S, (const mcdi_vd *)x,
                           *(const mcdi_vd *)amax, (mcdi_vd *)b->r,
                           (mcdi_vd *)b->Dg, (mcdi_vd *)b->iDg,
                           (mcdi_vd *)b->Wt);
    return ldl_solve_rows(b, n, L, nd);
}

/* v = Ps v: projection onto s^T v = 0, per direction. */
KINLINE void project_s(const mcdi_kblock *b, double *restrict v,
                       const size_t n, const size_t L, const size_t nd)
{
    const double *restrict s = b->s;
    double *restrict p = b->col;
    size_t i, dd, l;
    for (dd = 0; dd < nd; dd++) {
        LANES
            p[l] = 0.0;
        for (i = 0; i < n; i++)
            LANES
                p[l] += s[i * L + l] * v[(i * nd + dd) * L + l];
        for (i = 0; i < n; i++)
            LANES
                v[(i * nd + dd) * L + l] -= s[i * L + l] * p[l];
    }
}

/* One Ern-Giovangigli step before the projection, one lane row at a time
 * (blocks other than the vector width): J holds sum_j invD_ij s_j U_j. */
KINLINE void iter_product_rows(const mcdi_kblock *b, const size_t n,
                               const size_t L, const size_t nd)
{
    const double *restrict s = b->s, *restrict x = b->x, *restrict r = b->r;
    const double *restrict minv = b->minv, *restrict d = b->d;
    const double *restrict wk = b->wk;
    double *restrict J = b->J, *restrict v = b->v;
    size_t i, j, dd, l;
    for (i = 0; i < n * nd * L; i++)
        J[i] = 0.0;
    for (i = 1; i < n; i++)
        for (j = 0; j < i; j++) {
            const double *q = b->tri + (i * (i + 1) / 2 + j) * L;
            for (dd = 0; dd < nd; dd++)
                LANES {
                    J[(i * nd + dd) * L + l] +=
                        q[l] * s[j * L + l] * r[(j * nd + dd) * L + l];
                    J[(j * nd + dd) * L + l] +=
                        q[l] * s[i * L + l] * r[(i * nd + dd) * L + l];
                }
        }
    for (i = 0; i < n; i++)
        for (dd = 0; dd < nd; dd++)
            LANES {
                size_t e = (i * nd + dd) * L + l;
                v[e] = x[i * L + l] * r[e] +
                       minv[i * L + l] * (s[i * L + l] * J[e] +
                                          d[e] * wk[i * L + l]);
            }
}

/* Error estimate of one iteration per lane (see the top comment); lanes
 * that have stopped keep theirs. */
KINLINE void iter_estimate(const mcdi_kblock *b, size_t it, const size_t n,
                           const size_t L, const size_t nd)
{
    const double *restrict s = b->s, *restrict v = b->v, *restrict r = b->r;
    const double *restrict active = b->active;
    double *restrict nrm = b->nrm, *restrict dmax = b->dmax;
    double *restrict dprev = b->dprev, *restrict dprev2 = b->dprev2;
    double *restrict est = b->est, *restrict iters = b->iters;
    size_t i, dd, l;
    LANES
        nrm[l] = 0.0;
    LANES
        dmax[l] = 0.0;
    for (i = 0; i < n; i++)
        for (dd = 0; dd < nd; dd++)
            LANES {
                size_t e = (i * nd + dd) * L + l;
                double a = fabs(s[i * L + l] * v[e]);
                double q = fabs(s[i * L + l] * (v[e] - r[e]));
                nrm[l] = a > nrm[l] ? a : nrm[l];
                dmax[l] = q > dmax[l] ? q : dmax[l];
            }
    LANES {
        double del = nrm[l] > 0.0 ? dmax[l] / nrm[l] : 0.0;
        double rho = del / dprev[l], e2;
        double rho2 = dprev[l] / dprev2[l];
        if (!(active[l] > 0.0))
            continue;
        /* the larger of the last two contraction ratios (robust to
         * oscillating iterates); del / (1 - rho) bounds the error of the
         * previous iterate, so it over-estimates that of the one returned */
        if (it >= 3 && rho2 > rho)
            rho = rho2;
        if (it == 1)
            e2 = HUGE_VAL; /* no contraction observed yet */
        else if (rho < 0.999)
            e2 = del / (1.0 - rho);
        else if (del <= MCDI_ITER_FLOOR)
            e2 = del / (1.0 - 0.999); /* stalled at round-off */
        else
            e2 = HUGE_VAL;
        if (del == 0.0)
            e2 = 0.0;
        est[l] = e2;
        dprev2[l] = dprev[l];
        dprev[l] = del;
        iters[l] = (double)it;
    }
}

/* Iterative model (Ern-Giovangigli, see the top comment): U in r. */
KINLINE void stage_iterate(const mcdi_bjob *jb, const mcdi_kblock *b, int pl,
                           size_t nv, mcdi_bres *res, const size_t n,
                           const size_t L, const size_t nd)
{
    const double *restrict S = b->S, *restrict num = b->num;
    double *restrict minv = b->minv, *restrict r = b->r, *restrict v = b->v;
    double *restrict dprev = b->dprev, *restrict dprev2 = b->dprev2;
    double *restrict est = b->est, *restrict active = b->active;
    double *restrict iters = b->iters;
    size_t i, it, l;
    for (i = 0; i < n; i++)
        LANES {
            double Sl = S[i * L + l];
            minv[i * L + l] = Sl > 0.0 ? num[i * L + l] / Sl : 0.0;
        }
    /* U^0 = Ps Minv b */
    for (i = 0; i < n * nd; i++)
        LANES
            r[i * L + l] *= minv[(i / nd) * L + l];
    project_s(b, r, n, L, nd);
    LANES {
        dprev[l] = HUGE_VAL;
        dprev2[l] = HUGE_VAL;
        est[l] = HUGE_VAL;
        active[l] = 1.0;
        iters[l] = 0.0;
    }
    for (it = 1; it <= jb->max_iter; it++) {
        double nact = 0.0;
        /* v_i = x_i U_i + minv_i (s_i sum_j invD_ij s_j U_j + b_i), b = d wk */
        if (pl)
            iter_product_c(n, nd, jb->mix->icoef, *(const mcdi_vd *)b->f175,
                           (const mcdi_vd *)b->s, (const mcdi_vd *)b->x,
                           (const mcdi_vd *)minv, (const mcdi_vd *)b->wk,
                           (const mcdi_vd *)b->d, (const mcdi_vd *)r,
                           (mcdi_vd *)b->J, (mcdi_vd *)v);
        else if (L == MCDI_VLANES)
            iter_product_v(n, nd, (const mcdi_vd *)b->tri,
                           (const mcdi_vd *)b->s, (const mcdi_vd *)b->x,
                           (const mcdi_vd *)minv, (const mcdi_vd *)b->wk,
                           (const mcdi_vd *)b->d, (const mcdi_vd *)r,
                           (mcdi_vd *)b->J, (mcdi_vd *)v);
        else
            iter_product_rows(b, n, L, nd);
        project_s(b, v, n, L, nd);
        iter_estimate(b, it, n, L, nd);
        for (i = 0; i < n * nd; i++)
            LANES
                if (active[l] > 0.0)
                    r[i * L + l] = v[i * L + l];
        LANES {
            if (active[l] > 0.0 && it >= 2 && est[l] <= jb->tol)
                active[l] = 0.0;
            if (l < nv)
                nact += active[l];
        }
        if (nact == 0.0)
            break;
    }
    for (l = 0; l < nv; l++) {
        double e2 = est[l];
        if (!(e2 <= res->iter_err))
            res->iter_err = e2;
        if ((size_t)iters[l] > res->iter_used)
            res->iter_used = (size_t)iters[l];
    }
}

/* Molar fluxes from the solution U: J_i = c (s_i U_i + t_i - x_i sum_t t_t). */
KINLINE void stage_compose(const mcdi_kblock *b, const size_t n,
                           const size_t L, const size_t nd)
{
    const double *restrict s = b->s, *restrict x = b->x, *restrict r = b->r;
    const double *restrict t = b->t, *restrict c = b->c;
    double *restrict J = b->J, *restrict st = b->col;
    size_t i, dd, l;
    for (dd = 0; dd < nd; dd++) {
        LANES
            st[l] = 0.0;
        for (i = 0; i < n; i++)
            LANES
                st[l] += t[(i * nd + dd) * L + l];
        for (i = 0; i < n; i++)
            LANES {
                size_t e = (i * nd + dd) * L + l;
                J[e] = c[l] * (s[i * L + l] * r[e] + t[e] - x[i * L + l] * st[l]);
            }
    }
}

/* Zero-sum clean-up J_i -= y_i sum_k J_k with weights y (x for molar
 * fluxes: trace species stay exact; w for mass fluxes). */
KINLINE void zero_sum(const mcdi_kblock *b, const double *restrict y,
                      const size_t n, const size_t L, const size_t nd)
{
    double *restrict J = b->J, *restrict rs = b->col;
    size_t i, dd, l;
    for (dd = 0; dd < nd; dd++) {
        LANES
            rs[l] = 0.0;
        for (i = 0; i < n; i++)
            LANES
                rs[l] += J[(i * nd + dd) * L + l];
        for (i = 0; i < n; i++)
            LANES
                J[(i * nd + dd) * L + l] -= y[i * L + l] * rs[l];
    }
}

/* Mass fluxes j_i = M_i J_i - w_i sum_k M_k J_k, the residual removed with
 * w; fails (EDOM in res) where the terms cancelled, as
 * mcdi_mass_zero_sum_kept (non-finite lanes are left to stage_store).
 * Returns 0 on failure. */
KINLINE int stage_mass(const mcdi_bjob *jb, const mcdi_kblock *b, size_t nv,
                       mcdi_bres *res, const size_t n, const size_t L,
                       const size_t nd)
{
    const double *M = jb->M;
    const double *restrict w = b->w;
    double *restrict J = b->J, *restrict sm = b->col, *restrict rs = b->col2;
    size_t i, dd, l;
    for (dd = 0; dd < nd; dd++) {
        LANES
            sm[l] = rs[l] = 0.0;
        for (i = 0; i < n; i++)
            LANES
                sm[l] += M[i] * J[(i * nd + dd) * L + l];
        for (i = 0; i < n; i++)
            LANES {
                size_t e = (i * nd + dd) * L + l;
                J[e] = M[i] * J[e] - w[i * L + l] * sm[l];
                rs[l] += J[e];
            }
        for (i = 0; i < n; i++)
            LANES
                J[(i * nd + dd) * L + l] -= w[i * L + l] * rs[l];
        LANES
            sm[l] = rs[l] = 0.0;
        for (i = 0; i < n; i++)
            LANES {
                const double q = J[(i * nd + dd) * L + l];
                sm[l] += q;
                rs[l] += fabs(q);
            }
        for (l = 0; l < nv; l++)
            if ((rs[l] <= DBL_MAX) &&
                !(fabs(sm[l]) <= MCDI_MASS_SUM_TOL * rs[l] + 1e-300)) {
                res->st = MCD_EDOM;
                res->lane = l;
                res->what = "result: mass fluxes lost to cancellation "
                            "(the molar masses are too far apart for "
                            "double precision)";
                return 0;
            }
    }
    return 1;
}

/* Write the block's fluxes, never non-finite ones (EDOM in res). */
KINLINE void stage_store(const mcdi_bjob *jb, const mcdi_kblock *b,
                         size_t k0, size_t nv, mcdi_bres *res, const size_t n,
                         const size_t L, const size_t nd)
{
    const double *restrict J = b->J;
    const size_t K = jb->K;
    int bad = 0;
    size_t i, l;
#if defined(_OPENMP) || defined(MCDI_OMP_SIMD)
#pragma omp simd reduction(|:bad)
#endif
    for (i = 0; i < n * nd * L; i++)
        bad |= !(fabs(J[i]) <= DBL_MAX);
    if (bad) {
        for (l = 0; l < nv; l++)
            for (i = 0; i < n * nd; i++)
                if (!(fabs(J[i * L + l]) <= DBL_MAX)) {
                    res->st = MCD_EDOM;
                    res->lane = l;
                    res->what = "result: flux not finite (inputs outside the "
                                "representable range)";
                    return;
                }
    }
    for (i = 0; i < n * nd; i++) {
        double *restrict o = jb->out + i * K + k0;
        const double *restrict Ji = J + i * L;
        if (nv == L) {
            LANES /* full block: vector stores */
                o[l] = Ji[l];
        } else {
            for (l = 0; l < nv; l++)
                o[l] = Ji[l];
        }
    }
}

/* The lowest lane with a non-positive (or NaN) pivot: ESING. */
static void report_not_definite(const mcdi_kblock *b, size_t nv,
                                mcdi_bres *res, size_t n, size_t L)
{
    size_t j, l;
    for (l = 0; l < nv; l++)
        for (j = 0; j < n; j++)
            if (!(b->Dg[j * L + l] > 0.0)) {
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

/* A block flagged by a loading stage: the lowest cell out of range, named
 * by the scalar re-check. */
static void report_bad_cell(const mcdi_bjob *jb, size_t k0, size_t nv,
                            mcdi_bres *res)
{
    size_t l;
    for (l = 0; l < nv; l++) {
        const char *what = "";
        mcd_status st = check_cell(jb, k0 + l, &what);
        if (st != MCD_OK) {
            res->st = st;
            res->lane = l;
            res->what = what;
            return;
        }
    }
    res->st = MCD_EINTERNAL; /* a flagged block without a bad cell */
    res->lane = 0;
    res->what = "internal: validation mismatch";
}

/* ------------------------------------------------------------------ */
/* the block body, instantiated for constant n and L                    */
/* ------------------------------------------------------------------ */

KINLINE void body(const mcdi_bjob *jb, size_t k0, size_t nv, double *mem,
                  mcdi_bres *res, const size_t n, const size_t L,
                  const size_t nd)
{
    double *const nts = mem - MCDI_STREAM_DOUBLES; /* streaming state */
    const int mass_out = jb->flux_basis == MCD_BASIS_MASS;
    /* iterative model on a power-law mixture: the inverse diffusivities
     * are f_l / coef_ij, used through the shared 1 / coef (Blanc sums,
     * iter_product_c); the per-lane triangle is filled only for the trace
     * coupling of blocks with trace species */
    const int pl = jb->mix != NULL && !jb->mix_has_omega &&
                   jb->model == MCD_MODEL_ITERATIVE && L == MCDI_VLANES;
    mcdi_kblock b;
    size_t i;

    mcdi_kblock_carve(mem, n, nd, L, &b);
    res->st = MCD_OK;
    if ((stage_load_scalars(jb, &b, k0, nv, L) |
         stage_load_comp(jb, &b, k0, nv, n, L)) != 0) {
        report_bad_cell(jb, k0, nv, res);
        return;
    }
    stage_fractions(jb, &b, n, L);
    if (stage_load_forces(jb, &b, k0, nv, n, L, nd)) {
        report_bad_cell(jb, k0, nv, res);
        return;
    }
    stage_forces(jb, &b, n, L, nd);
    if (n == 1) {
        /* a single species does not diffuse */
        for (i = 0; i < nd * L; i++)
            b.J[i] = 0.0;
        stage_store(jb, &b, k0, nv, res, n, L, nd);
        return;
    }
    if (jb->mix == NULL) {
        if (stage_invdiff_dij(jb, &b, k0, nv, n, L)) {
            report_bad_cell(jb, k0, nv, res);
            return;
        }
    } else {
        stage_invdiff_mixture(jb, &b, pl, n, L);
    }
    stage_blanc(jb, &b, pl, n, L);

    if (jb->model == MCD_MODEL_MIXTURE_AVERAGED) {
        stage_mixavg(&b, n, L, nd);
    } else {
        const int ntr = stage_trace(jb, &b, pl, n, L, nd);
        stage_rhs(&b, n, L, nd);
        if (jb->model == MCD_MODEL_MAXWELL_STEFAN) {
            if (!stage_exact(&b, n, L, nd)) {
                report_not_definite(&b, nv, res, n, L);
                return;
            }
        } else {
            stage_iterate(jb, &b, pl, nv, res, n, L, nd);
        }
        if (L == MCDI_VLANES && nv == L && !mass_out) {
            /* full block, mole basis: compose, clean up and store at once
             * (a flux not finite: J holds them all, stage_store reports) */
            if (!emit_mole_v(n, nd, (const mcdi_vd *)b.s, (const mcdi_vd *)b.x,
                             (const mcdi_vd *)b.r, (const mcdi_vd *)b.t, ntr,
                             *(const mcdi_vd *)b.c, (mcdi_vd *)b.J, jb->out,
                             jb->K, k0, jb->stream, nts))
                stage_store(jb, &b, k0, nv, res, n, L, nd);
            return;
        }
        stage_compose(&b, n, L, nd);
    }
    zero_sum(&b, b.x, n, L, nd); /* trace species stay exact */
    if (mass_out && !stage_mass(jb, &b, nv, res, n, L, nd))
        return;
    stage_store(jb, &b, k0, nv, res, n, L, nd);
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
#define INSTANCE(name, nn, ndd)                                            \
    __attribute__((noinline)) static void name(                           \
        const mcdi_bjob *jb, size_t k0, size_t nv, double *mem,          \
        mcdi_bres *res)                                                   \
    {                                                                     \
        body(jb, k0, nv, mem, res, nn, LANES_SMALL, ndd);                 \
    }
INSTANCE(block_n2_d3, 2, 3)
INSTANCE(block_n3_d3, 3, 3)
INSTANCE(block_n4_d3, 4, 3)
INSTANCE(block_n5_d3, 5, 3)
INSTANCE(block_nn_d3, jb->n, 3)
INSTANCE(block_nn_dd, jb->n, jb->nd)

static void block_lanes(const mcdi_bjob *jb, size_t k0, size_t nv, double *mem,
                        mcdi_bres *res)
{
    if (jb->nd != 3) {
        block_nn_dd(jb, k0, nv, mem, res);
        return;
    }
    switch (jb->n) {
    case 2: block_n2_d3(jb, k0, nv, mem, res); break;
    case 3: block_n3_d3(jb, k0, nv, mem, res); break;
    case 4: block_n4_d3(jb, k0, nv, mem, res); break;
    case 5: block_n5_d3(jb, k0, nv, mem, res); break;
    default: block_nn_d3(jb, k0, nv, mem, res); break;
    }
}

static void block_single(const mcdi_bjob *jb, size_t k0, size_t nv,
                         double *mem, mcdi_bres *res)
{
    body(jb, k0, nv, mem, res, jb->n, 1, jb->nd);
}

#define KNAME_(isa) mcdi_batch_block_v##isa
#define KNAME(isa) KNAME_(isa)
#define FNAME_(isa) mcdi_batch_finish_v##isa
#define FNAME(isa) FNAME_(isa)
#define KLANES_(isa) mcdi_batch_lanes_v##isa
#define KLANES(isa) KLANES_(isa)
const size_t KLANES(MCDI_KISA) = MCDI_VLANES;

void KNAME(MCDI_KISA)(const mcdi_bjob *jb, size_t k0, size_t nv, double *mem,
                      mcdi_bres *res)
{
    mem += MCDI_STREAM_DOUBLES; /* streaming state first (batch.h) */
    if (jb->n > MCDI_LANES_NMAX)
        block_single(jb, k0, nv, mem, res);
    else
        block_lanes(jb, k0, nv, mem, res);
}

void FNAME(MCDI_KISA)(const mcdi_bjob *jb, double *mem)
{
#if MCDI_CAN_STREAM
    if (!jb->stream)
        return;
    stream_flush(jb->n * jb->nd, jb->out, jb->K, mem);
    _mm_sfence(); /* the streamed lines before anything after the call */
#else
    (void)jb;
    (void)mem;
#endif
}
