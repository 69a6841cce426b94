/* kernel_ldl.h - the exact model: (Gs + a s s^T) U = b by L D L^T
 * without pivoting, on lane vectors or one lane row at a time.
 * Included only by batch_kernel.c, which is compiled once per instruction
 * set: everything here is inlined into the block body. Never installed. */
#ifndef MCD_KERNEL_LDL_H
#define MCD_KERNEL_LDL_H

/* 1 / d for a pivot vector. On AVX-512 a full-width division (one per 16
 * cycles on the divider, ~22 cycles latency) sits on the chain of every
 * row; there the 14-bit estimate y0 = vrcp14pd(d) is refined with
 * e = 1 - d y0 (|e| < 2^-14) to y0 (1 + e)(1 + e^2) = y0 (1 + e + e^2 +
 * e^3), relative error e^4 < 2^-56 plus two roundings: within 2 ulp of the
 * division (common practice: Newton's iteration for the reciprocal,
 * two steps folded into one polynomial). Only when every lane's pivot is
 * in [2^-1000, 2^1000]; otherwise (tiny, huge, non-positive or NaN pivots,
 * rare) the division, so special values and the ESING check are as before. */
#if MCDI_KISA == 4 && defined(__AVX512F__) && MCDI_VLANES == 8
#include <immintrin.h>
#define MCDI_FAST_RECIP 1
#else
#define MCDI_FAST_RECIP 0
#endif
KINLINE mcdi_vd recip_pivot(const mcdi_vd d, const size_t n)
{
#if MCDI_FAST_RECIP
    /* the estimate pays only with a constant n <= 5 (the block
     * instances of batch_kernel.c, ldl_fixed's n_dim = 1 and 2 solves):
     * 6-10 % faster whole call at N = 3 and 5 on the
     * AVX-512 host, 1-2 % slower in the generic one (A/B, one run) */
    const __m512d dv = (__m512d)d;
    const __mmask8 in =
        _mm512_cmp_pd_mask(dv, _mm512_set1_pd(0x1p-1000), _CMP_GT_OQ) &
        _mm512_cmp_pd_mask(dv, _mm512_set1_pd(0x1p1000), _CMP_LT_OQ);
    if (n <= 5 && __builtin_expect(in == 0xFF, 1)) {
        const mcdi_vd one = {1.0, 1.0, 1.0, 1.0, 1.0, 1.0, 1.0, 1.0};
        const mcdi_vd y0 = (mcdi_vd)_mm512_rcp14_pd(dv);
        const mcdi_vd e = one - d * y0;
        const mcdi_vd y1 = y0 + y0 * e, e2 = e * e;
        return y1 + y1 * e2;
    }
#else
    (void)n;
#endif
    return 1.0 / d;
}

/* Assemble A = Gs + a s s^T row by row (A holds the packed lower triangle
 * of the inverse diffusivities on entry and L on exit), factor A = L D L^T
 * by rows (W_j = L_ij D_j), run the forward substitution of each row as
 * soon as it is factored, then the diagonal scaling and the backward
 * substitution. R: right-hand sides [i * nd + dd] in, solution out; Dg gets
 * the pivots. Returns 0 if some lane has a pivot that is not > 0 (or NaN).
 *
 * Above kreg species the rows are taken KTILE at a time: the columns left
 * of the tile are done for its rows together, so each loaded L_jk serves
 * KTILE independent multiply-add chains (the factor is in L2 cache at
 * large n; one load per FMA was the limit), then the tile's own triangle
 * row by row. Wm: KTILE * n vectors (the tile's W rows). Up to kreg
 * (<= LDL_REGMAX) species W and 1/D are local arrays, registers after
 * unrolling: KREG in the instances of any n, n itself in ldl_fixed's. */
/* GCC left the row loop of the constant-n instances (n <= 5) rolled, with
 * W and 1/D in memory and a compare-and-branch per column; unrolled, they
 * live in registers (issue 15, A/B: factor and solve 7.7 -> 5.2 ns per
 * cell at N = 5, whole call 27.0 -> 24.2; 12.8 -> 12.1 at N = 3; N = 7,
 * 10 and 20 unchanged within noise). 16: the loops over a constant n of
 * ldl_fixed (below, up to 16) unroll completely. */
#if defined(__GNUC__) && !defined(__clang__)
#define LDL_UNROLL _Pragma("GCC unroll 16")
#else
#define LDL_UNROLL
#endif
KINLINE void ldl_row_tail(const size_t nd, mcdi_vd *restrict A, const size_t i,
                          const size_t j0, const mcdi_vd *restrict s,
                          const mcdi_vd a, mcdi_vd *restrict W,
                          const mcdi_vd *restrict iD, const mcdi_vd *restrict R,
                          mcdi_vd *restrict f)
{
    mcdi_vd *restrict Ai = A + i * (i + 1) / 2;
    const mcdi_vd si = s[i];
    size_t j, k, dd;
    LDL_UNROLL
    for (j = j0; j < i; j++) {
        const mcdi_vd *restrict Aj = A + j * (j + 1) / 2;
        mcdi_vd t = si * s[j] * (a - Ai[j]), lij;
        LDL_UNROLL
        for (k = 0; k < j; k++)
            t -= W[k] * Aj[k];
        W[j] = t;
        lij = t * iD[j];
        Ai[j] = lij;
        for (dd = 0; dd < nd; dd++)
            f[dd] -= lij * R[j * nd + dd];
    }
}

#define LDL_REGMAX 16
KINLINE int ldl_solve_v(const size_t n, const size_t nd, const size_t kreg,
                        mcdi_vd *restrict A, const mcdi_vd *restrict s,
                        const mcdi_vd *restrict S, const mcdi_vd *restrict x,
                        const mcdi_vd a, mcdi_vd *restrict R,
                        mcdi_vd *restrict Dg, mcdi_vd *restrict iDm,
                        mcdi_vd *restrict Wm)
{
    mcdi_vd Wl[LDL_REGMAX], iDl[LDL_REGMAX];
    mcdi_vd *restrict iD = n <= kreg ? iDl : iDm;
    const mcdi_vd zero = {0.0};
    mcdi_vl ok = zero == zero; /* all lanes true */
    size_t i, i0, j, k, dd, r;
    const size_t step = n <= kreg ? 1 : KTILE; /* rows per tile */
    LDL_UNROLL
    for (i0 = 0; i0 < n; i0 += step) {
        const size_t nr = n - i0 < step ? n - i0 : step;
        mcdi_vd f[KTILE][MCD_MAX_DIM];
        for (r = 0; r < nr; r++)
            for (dd = 0; dd < nd; dd++)
                f[r][dd] = R[(i0 + r) * nd + dd];
        if (n > kreg && nr == KTILE) {
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
            mcdi_vd *restrict W = n <= kreg ? Wl : Wm + r * n;
            mcdi_vd *restrict Ai = A + ii * (ii + 1) / 2;
            mcdi_vd dg;
            ldl_row_tail(nd, A, ii, (n > kreg && nr == KTILE) ? i0 : 0, s, a, W,
                         iD, R, f[r]);
            dg = S[ii] + a * x[ii];
            LDL_UNROLL
            for (k = 0; k < ii; k++)
                dg -= W[k] * Ai[k];
            Dg[ii] = dg;
            ok &= dg > zero;
            iD[ii] = recip_pivot(dg, n);
            for (dd = 0; dd < nd; dd++)
                R[ii * nd + dd] = f[r][dd];
        }
    }
    if (any_lane_v(~ok))
        return 0;
    LDL_UNROLL
    for (i = n; i-- > 0;) {
        mcdi_vd f[MCD_MAX_DIM];
        for (dd = 0; dd < nd; dd++)
            f[dd] = R[i * nd + dd] * iD[i];
        /* the newest unknown (k = i + 1) last: once unrolled, row i
         * waits for row i + 1 by one multiply-add, not n - i - 1 */
        LDL_UNROLL
        for (k = n - 1; k > i; k--) {
            const mcdi_vd lki = A[k * (k + 1) / 2 + i];
            for (dd = 0; dd < nd; dd++)
                f[dd] -= lki * R[k * nd + dd];
        }
        for (dd = 0; dd < nd; dd++)
            R[i * nd + dd] = f[dd];
    }
    return 1;
}

/* The fused solve with n and n_dim compile-time constants, n from 2 to
 * LDL_FIXED_MAX (with n_dim = 3 from 6: below, the block instances of
 * batch_kernel.c have a constant n already; stage_exact calls this only
 * for n > 5 there), in the instances of any n: the species loops
 * unroll, W and 1/D live in registers. With n known only at run time the
 * loops stay rolled and W and 1/D in memory (issue 15, N = 10 on the
 * AVX-512 host: 46 of 126 ns a cell in the factor and solves,
 * bench_stages; with n_dim a run-time value too, the n_dim = 1 and 2
 * calls were slower per cell than n_dim = 3). Not in the baseline
 * (x86-64-v1) kernel: level there (A/B at N = 6, 10, 16), and each n
 * costs 3-45 KB of code. Returns -1 when no constant n covers n (the
 * caller then runs the solve for any n), else ldl_solve_v's answer. */
#if MCDI_KISA >= 3
#define LDL_FIXED_MAX 16
#else
#define LDL_FIXED_MAX 0
#endif
KINLINE int ldl_fixed(const size_t n, const size_t nd, mcdi_vd *restrict A,
                      const mcdi_vd *restrict s, const mcdi_vd *restrict S,
                      const mcdi_vd *restrict x, const mcdi_vd a,
                      mcdi_vd *restrict R, mcdi_vd *restrict Dg)
{
#if LDL_FIXED_MAX
#define LDL_CASE(d, nn)                                                        \
    case nn:                                                                   \
        return ldl_solve_v(nn, d, nn, A, s, S, x, a, R, Dg, NULL, NULL);
#define LDL_CASES(d)                                                           \
    switch (n) {                                                               \
        LDL_CASE(d, 2)                                                         \
        LDL_CASE(d, 3)                                                         \
        LDL_CASE(d, 4)                                                         \
        LDL_CASE(d, 5)                                                         \
        LDL_CASE(d, 6)                                                         \
        LDL_CASE(d, 7)                                                         \
        LDL_CASE(d, 8)                                                         \
        LDL_CASE(d, 9)                                                         \
        LDL_CASE(d, 10)                                                        \
        LDL_CASE(d, 11)                                                        \
        LDL_CASE(d, 12)                                                        \
        LDL_CASE(d, 13)                                                        \
        LDL_CASE(d, 14)                                                        \
        LDL_CASE(d, 15)                                                        \
        LDL_CASE(d, 16)                                                        \
    default: break;                                                            \
    }
    _Static_assert(LDL_FIXED_MAX == 16, "the cases below go to 16");
    _Static_assert(LDL_FIXED_MAX <= LDL_REGMAX, "W and 1/D local up to n");
    if (nd == 3)
        LDL_CASES(3)
    else if (nd == 2)
        LDL_CASES(2)
    else if (nd == 1)
        LDL_CASES(1)
#undef LDL_CASES
#undef LDL_CASE
#else
    (void)n, (void)nd, (void)A, (void)s, (void)S, (void)x, (void)a, (void)R,
        (void)Dg;
#endif
    return -1;
}

/* Exact model: the shift a (flux/solve_stages.h), then
 * (Gs + a s s^T) U = b solved in r: fused on lane vectors for a full
 * vector block, else by the shared one-lane-row stage. Returns 0 if some
 * lane's matrix is not positive definite. */
KINLINE int stage_exact(const mcdi_kblock *b, const size_t n, const size_t L,
                        const size_t nd)
{
    const mcdi_rows R = rows_of(b);
    double amax[MCDI_LANES];
    mcdi_shift_rows(&R, amax, n, L);
    if (L == MCDI_VLANES) {
        /* assembly, LDL^T and both substitutions fused, in registers */
        mcdi_vd av;
        memcpy(&av, amax, sizeof av);
        if (n > 5 || nd != 3) {
            const int got =
                ldl_fixed(n, nd, (mcdi_vd *)b->tri, (const mcdi_vd *)b->s,
                          (const mcdi_vd *)b->S, (const mcdi_vd *)b->x, av,
                          (mcdi_vd *)b->r, (mcdi_vd *)b->Dg);
            if (got >= 0)
                return got;
        }
        return ldl_solve_v(
            n, nd, KREG, (mcdi_vd *)b->tri, (const mcdi_vd *)b->s,
            (const mcdi_vd *)b->S, (const mcdi_vd *)b->x, av, (mcdi_vd *)b->r,
            (mcdi_vd *)b->Dg, (mcdi_vd *)b->iDg, (mcdi_vd *)b->Wt);
    }
    return mcdi_ldl_rows(&R, amax, n, L, nd);
}

#endif
