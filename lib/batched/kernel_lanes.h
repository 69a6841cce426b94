/* kernel_lanes.h - lanes of a block: the per-ISA lane count, the lane
 * loops, the lane vector type and the row loader.
 * Included only by batch_kernel.c, which is compiled once per instruction
 * set: everything here is inlined into the block body. Never installed. */
#ifndef MCD_KERNEL_LANES_H
#define MCD_KERNEL_LANES_H

#include <float.h>
#include <math.h>
#include <stdint.h>
#include <string.h>

#include "mcdiff.h"
#include "base/lanes.h"
#include "batched/batch.h"

/* batch_kernel.c is compiled once per instruction set (lib/meson.build sets
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
#error "MCDI_LANES (base/lanes.h) must be the largest lane count"
#endif

#define RGAS MCD_GAS_CONSTANT

/* Streaming stores of whole output lines (batch.h): the AVX-512 build
 * only, where a block's row of 8 doubles is one 64-byte line. */
#if MCDI_KISA == 4 && defined(__AVX512F__) && MCDI_VLANES == 8
#define MCDI_CAN_STREAM 1
#include <immintrin.h>
#else
#define MCDI_CAN_STREAM 0
#endif

/* Rows factored together above KREG species (ldl_solve_v). */
#define KTILE MCDI_KTILE

/* Prefetch distance of the input streams, in doubles (8 blocks ahead):
 * MCDI_PREFETCH in the SoA layout; in tiles (batch.h) the same row of
 * the tile 8 tiles ahead, MCDI_PREFETCH Q for an array of Q rows. */
#define MCDI_PREFETCH 64

/* Extra prefetch distance of a SoA row, 0, 8, 16 or 24 doubles (0-3
 * blocks), from a fold of the row's address bits above the 4 KiB page.
 * When the rows lie a multiple of 128 bytes apart (n_cells a multiple of
 * 16), every row's prefetch of a block falls on the same offset within
 * 256 bytes at once; on the Intel AVX-512 host the SoA Dij call then ran
 * 1.3-1.6x slower streamed at N = 7..50 than with n_cells / 8 odd (a
 * memory-side conflict, mechanism not identified: the VM has no
 * performance counters). Spreading the rows' prefetch targets over four
 * blocks removes most of it (issue 15; tests/bench_stride.c, the
 * benchmark `stride`). jb->stagger (batch.c, stagger_choice: such a
 * stride, N >= MCDI_STAG_NMIN and MCDI_STAG_ROWS input rows a cell) turns
 * it on where it was measured to pay; with fewer rows it made calls
 * slower (the Dij call at N = 6 1.4x, the mixture call at N = 8 1.12x).
 * The address fold, not the row index, so that every stride gets spread
 * (a row index times an odd stride can cancel). */
KINLINE size_t pf_stagger(const double *p)
{
    uintptr_t a = (uintptr_t)p >> 12;
    a ^= a >> 2;
    a ^= a >> 4;
    a ^= a >> 8;
    return 8 * (size_t)(a & 3);
}

/* How far ahead the rows of one input array are prefetched: the
 * distance in doubles and whether the SoA stagger applies. A loading
 * stage takes it once per array (pf_of), so that the flags of the job
 * are read once, not per row: stores to the scratch go through a
 * may_alias type and made the compiler reload jb->tiled and
 * jb->stagger before every row (2-4 instructions a row, 5-10 % of a
 * block at N = 3 and 5, counted with tools/icount.c). */
typedef struct mcdi_pf {
    size_t dist; /* doubles ahead */
    int stag;    /* add pf_stagger of the row's address */
    int l2;      /* into L2 only (jb->pf_l2) */
} mcdi_pf;

/* For an array of Q rows of a job of n species (n = 0 for the per-cell
 * scalars; constant n < MCDI_STAG_NMIN folds the stagger away in the
 * small-n instances). */
KINLINE mcdi_pf pf_of(const mcdi_bjob *jb, size_t Q, size_t n)
{
    mcdi_pf p;
    p.dist = jb->tiled ? MCDI_PREFETCH * Q : MCDI_PREFETCH;
    p.stag = !jb->tiled && n >= MCDI_STAG_NMIN && jb->stagger;
    p.l2 = n >= MCDI_STAG_NMIN && jb->pf_l2;
    return p;
}

KINLINE void prefetch_row(const double *src, const mcdi_pf pf)
{
    const double *const t = src + pf.dist + (pf.stag ? pf_stagger(src) : 0);
    if (pf.l2)
        __builtin_prefetch(t, 0, 2); /* prefetcht1 */
    else
        __builtin_prefetch(t, 0, 3); /* prefetcht0 */
}

/* Load row src[k0 .. k0+nv-1] into dst[0..L-1], padding with src[k0];
 * prefetch the same row ahead (pf, from pf_of). */
KINLINE void load_row(double *restrict dst, const double *restrict src,
                      size_t nv, size_t L, const mcdi_pf pf)
{
    size_t l;
    /* the next blocks of this input stream (a few dozen streams at once
     * are more than the hardware prefetchers follow), into every cache
     * level (prefetcht0; into L2 only for the Dij call with many rows,
     * pf_of): the non-temporal hint (prefetchnta) kept the
     * lines out of L2, so inputs that fit in the caches came from L3 on
     * every call; on the Intel AVX-512 host t0 ran N = 10 1.7x and N = 3
     * streamed 1.3x faster than nta (issue 15, A/B in DEVELOPERS.md) */
    prefetch_row(src, pf);
    if (nv == L) {
        for_lanes (l)
            dst[l] = src[l];
    } else {
        for (l = 0; l < nv; l++)
            dst[l] = src[l];
        for (; l < L; l++)
            dst[l] = src[0];
    }
}

/* One value per lane of a full block, as a GCC/Clang generic vector: the
 * compiler maps it onto the clone's registers (one zmm, two ymm or four
 * xmm). may_alias: scratch rows are accessed both as double and as this. */
typedef double mcdi_vd
    __attribute__((vector_size(MCDI_VLANES * sizeof(double)), may_alias));
typedef long long mcdi_vl
    __attribute__((vector_size(MCDI_VLANES * sizeof(long long)), may_alias));

/* Full vector blocks (nv == L == MCDI_VLANES): load row src[0 .. L-1]
 * into the aligned scratch row dst and return it, so that the loading
 * stages check the value in a register (their flags accumulate in a
 * register too, and reach bl once per stage: OR-ing each row's flags
 * into bl in memory chained every row of inputs through a store and a
 * reload, about 5 ns per cell at N = 3, issue 15). */
KINLINE mcdi_vd load_v(const double *restrict src, const mcdi_pf pf)
{
    mcdi_vd v;
    prefetch_row(src, pf); /* as load_row */
    memcpy(&v, src, sizeof v);
    return v;
}

KINLINE mcdi_vd load_vrow(double *restrict dst, const double *restrict src,
                          const mcdi_pf pf)
{
    const mcdi_vd v = load_v(src, pf);
    *(mcdi_vd *)(void *)dst = v;
    return v;
}

/* Whether some lane of v is not zero: one test on the vector (a loop
 * over the lanes was 16-29 instructions a test, counted with
 * tools/icount.c). */
#if defined(__AVX__)
#include <immintrin.h>
#endif
KINLINE int any_lane_v(const mcdi_vl v)
{
#if defined(__AVX512F__) && MCDI_VLANES == 8
    return _mm512_test_epi64_mask((__m512i)v, (__m512i)v) != 0;
#elif defined(__AVX__) && MCDI_VLANES == 4
    return !_mm256_testz_si256((__m256i)v, (__m256i)v);
#else
    long long any = 0;
    size_t l;
    for (l = 0; l < MCDI_VLANES; l++)
        any |= v[l];
    return any != 0;
#endif
}

/* a < b ? a : b and a > b ? a : b, lane by lane (b where either is
 * NaN; the loading checks flag NaN lanes apart). */
KINLINE mcdi_vd min_v(const mcdi_vd a, const mcdi_vd b)
{
#if defined(__AVX512F__) && MCDI_VLANES == 8
    return (mcdi_vd)_mm512_min_pd((__m512d)a, (__m512d)b);
#elif defined(__AVX__) && MCDI_VLANES == 4
    return (mcdi_vd)_mm256_min_pd((__m256d)a, (__m256d)b);
#else
    const mcdi_vl lt = a < b;
    return (mcdi_vd)((lt & (mcdi_vl)a) | (~lt & (mcdi_vl)b));
#endif
}

KINLINE mcdi_vd max_v(const mcdi_vd a, const mcdi_vd b)
{
#if defined(__AVX512F__) && MCDI_VLANES == 8
    return (mcdi_vd)_mm512_max_pd((__m512d)a, (__m512d)b);
#elif defined(__AVX__) && MCDI_VLANES == 4
    return (mcdi_vd)_mm256_max_pd((__m256d)a, (__m256d)b);
#else
    const mcdi_vl gt = a > b;
    return (mcdi_vd)((gt & (mcdi_vl)a) | (~gt & (mcdi_vl)b));
#endif
}

/* OR a lane vector of flags into bl (kernel_stages.h). */
KINLINE void flag_lanes(long long *restrict bl, const mcdi_vl bad)
{
    mcdi_vl cur;
    memcpy(&cur, bl, sizeof cur);
    cur |= bad;
    memcpy(bl, &cur, sizeof cur);
}

/* s = sqrt(x) and w = -1 / sqrt(x) for the n lane rows of x without the
 * divider, on AVX-512 (x86-64-v4 kernel): y0 = vrsqrt14pd(x), relative
 * error below 2^-14, and two Newton steps y <- y (3/2 - x y^2 / 2), each
 * taking the error e to about -3 e^2 / 2, so about 3.4 e^4 < 2^-54 after
 * both, plus the roundings of the steps and of s = x y (common practice:
 * Newton's iteration for the reciprocal square root); a few ulp from the
 * correctly rounded sqrt(x) and -1 / sqrt(x). At N = 3 the three square
 * roots (done as six 256-bit halves on the AVX-512 host measured) and
 * three divisions took most of the divider's time of a block
 * (DEVELOPERS.md). Only when every lane of every row is
 * in (2^-1000, 2), i.e. no trace species and no tiny fraction: returns
 * 1; else 0, and s and w hold values the exact path then overwrites
 * (computed on every lane, IEEE arithmetic, no traps). */
#if MCDI_KISA == 4 && defined(__AVX512F__) && MCDI_VLANES == 8
#define MCDI_FAST_RSQRT 1
#else
#define MCDI_FAST_RSQRT 0
#endif
KINLINE int rsqrt_rows(const double *restrict x, double *restrict s,
                       double *restrict w, const size_t n)
{
#if MCDI_FAST_RSQRT
    const mcdi_vd *xv = (const mcdi_vd *)(const void *)x;
    mcdi_vd *sv = (mcdi_vd *)(void *)s, *wv = (mcdi_vd *)(void *)w;
    const mcdi_vd zero = {0.0}, half = zero + 0.5, c15 = zero + 1.5;
    __mmask8 in = 0xFF;
    size_t i;
    for (i = 0; i < n; i++) {
        const mcdi_vd v = xv[i], h = half * v;
        mcdi_vd y = (mcdi_vd)_mm512_rsqrt14_pd((__m512d)v);
        in &= _mm512_cmp_pd_mask((__m512d)v, _mm512_set1_pd(0x1p-1000),
                                 _CMP_GT_OQ) &
              _mm512_cmp_pd_mask((__m512d)v, _mm512_set1_pd(2.0), _CMP_LT_OQ);
        y = y * (c15 - h * y * y);
        y = y * (c15 - h * y * y);
        sv[i] = v * y;
        wv[i] = -y;
    }
    return in == 0xFF;
#else
    (void)x, (void)s, (void)w, (void)n;
    return 0;
#endif
}

/* Up to this many species the pivots and the multipliers W live in local
 * arrays, which become registers once the loops over a constant n are
 * unrolled; above it they live in the caller's scratch. */
#define KREG 8

#endif
