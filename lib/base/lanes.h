/* lanes.h - per-species rows of L lanes, the layout every flux stage
 * works on: quantity q of species i in lane l at q[i * L + l], and of
 * species i in direction dd at q[(i * nd + dd) * L + l]. The batched
 * kernel runs L cells at once (L = the vector width, or 1 above
 * MCDI_LANES_NMAX species); the single-state call is L = 1, for which
 * the layout is the plain row-major one. Never installed. */
#ifndef MCD_LANES_H
#define MCD_LANES_H

#include <math.h>
#include <stddef.h>

/* Always inlined where the compiler allows: the stages are instantiated
 * for constant n, L and nd by their callers. */
#if defined(__GNUC__) && !defined(__clang__)
#define KINLINE static inline __attribute__((always_inline))
#else
#define KINLINE static inline
#endif

/* Most lanes of any kernel (8: one AVX-512 register of doubles); local
 * lane accumulators are arrays of this many. */
#define MCDI_LANES 8

/* A loop over the L lanes of a row: vectorised (OpenMP SIMD pragma,
 * enabled by -fopenmp-simd without the OpenMP runtime; ignored
 * elsewhere). */
#if defined(_OPENMP) || defined(MCDI_OMP_SIMD)
#define for_lanes(l) _Pragma("omp simd") for (l = 0; l < L; l++)
#else
#define for_lanes(l) for (l = 0; l < L; l++)
#endif
/* The same with an OR-reduction of the int flag `bad` (input checks): the
 * reduction clause keeps these loops vectorised. */
#if defined(_OPENMP) || defined(MCDI_OMP_SIMD)
#define for_lanes_bad(l)                                                       \
    _Pragma("omp simd reduction(|:bad)") for (l = 0; l < L; l++)
#else
#define for_lanes_bad(l) for (l = 0; l < L; l++)
#endif

/* a * b + c, fused where the instruction set has FMA (as -ffp-contract=fast
 * contracts the same expression elsewhere). Written out where a sum is
 * accumulated in a local: GCC's -O3 in-order ("fold-left") vectorisation
 * of such a sum multiplies first and adds after, not fused, so the same
 * source gave other bits in the -O3 kernels than in the -O2 objects. */
#if defined(__FMA__)
#define MCDI_FMA(a, b, c) fma(a, b, c)
#else
#define MCDI_FMA(a, b, c) ((a) * (b) + (c))
#endif

/* A loop over species (not lanes) that is worth vectorising even where
 * the loop vectoriser is off (the single-state objects: flux/ms_ldl.c),
 * e.g. square roots and reciprocals, where the divider is the limit; the
 * second form with an OR-reduction of the int flag `ntr`. */
#if defined(_OPENMP) || defined(MCDI_OMP_SIMD)
#define MCDI_SIMD _Pragma("omp simd")
#define MCDI_SIMD_OR_NTR _Pragma("omp simd reduction(|:ntr)")
#else
#define MCDI_SIMD
#define MCDI_SIMD_OR_NTR
#endif

/* out_i = v_i - y_i sum_k w_k v_k in each direction (out may be v), w
 * NULL meaning weights 1: the zero-sum clean-up (w = 1, y = x for molar
 * fluxes, so trace species stay exact), the projection of driving forces
 * onto sum_i d_i = 0 (w = 1, y = x) and onto s^T v = 0 (w = y = s). The
 * sum lives in a local array, i.e. in registers. */
KINLINE void remove_along_into(double *out, const double *v, const double *w,
                               const double *restrict y, const size_t n,
                               const size_t L, const size_t nd)
{
    double p[MCDI_LANES];
    size_t i, dd, l;
    if (L == 1 && nd == 3) {
        /* one lane, three directions (the usual single-state call): the
         * three sums side by side in registers, independent chains, each
         * in the order of the loop below (the same bits) */
        double p0 = 0.0, p1 = 0.0, p2 = 0.0;
        for (i = 0; i < n; i++) {
            const double wi = w != NULL ? w[i] : 1.0;
            p0 += wi * v[3 * i];
            p1 += wi * v[3 * i + 1];
            p2 += wi * v[3 * i + 2];
        }
        for (i = 0; i < n; i++) {
            out[3 * i] = v[3 * i] - y[i] * p0;
            out[3 * i + 1] = v[3 * i + 1] - y[i] * p1;
            out[3 * i + 2] = v[3 * i + 2] - y[i] * p2;
        }
        return;
    }
    for (dd = 0; dd < nd; dd++) {
        for_lanes (l)
            p[l] = 0.0;
        for (i = 0; i < n; i++)
            for_lanes (l)
                p[l] +=
                    (w != NULL ? w[i * L + l] : 1.0) * v[(i * nd + dd) * L + l];
        for (i = 0; i < n; i++)
            for_lanes (l)
                out[(i * nd + dd) * L + l] =
                    v[(i * nd + dd) * L + l] - y[i * L + l] * p[l];
    }
}

/* The same in place. */
KINLINE void remove_along(double *v, const double *w, const double *restrict y,
                          const size_t n, const size_t L, const size_t nd)
{
    remove_along_into(v, v, w, y, n, L, nd);
}

#endif
