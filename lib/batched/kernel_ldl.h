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

/* The grounded form, for blocks of the exact model (Đ per cell or a
 * mixture), n_dim = 3 and 2 <= n <= MCDI_GROUND_NMAX, where every species
 * is present in every lane. With u_i = J_i / (c x_i) the Maxwell-Stefan
 * equations are the graph Laplacian system
 *     sum_j x_i x_j (u_j - u_i) / Đ_ij = d_i,
 * singular only along u = const. Grounding one species g (u_g = 0)
 * leaves the (n - 1) x (n - 1) system A u = -d, A_ij = -x_i x_j / Đ_ij,
 * A_ii = x_i S_i: a diagonally dominant M-matrix whose row sums are the
 * ties x_i x_g / Đ_ig to the grounded species. stage_ground_gth solves it
 * by an elimination that only ever adds non-negative terms, so it is
 * accurate however the Đ_ij spread; J_i = c x_i u_i (J_g = 0), and the
 * zero-sum clean-up of the emit, J_i -= x_i sum_k J_k, is the shift
 * u -> u - sum_k x_k u_k back to the molar-average frame. That shift
 * cancels u_g's offset from the average: after it J_g = -x_g sum_k J_k,
 * so the offset is at most |J_g| / x_g, small against the fluxes when
 * x_g is large. Each lane grounds its most abundant species (the last
 * one on ties), or the last species where its x is within a factor
 * MCDI_GROUND_KEEP of the largest; in the order the factor takes them,
 * the grounded species and species n - 1 trade places lane by lane, so a
 * cell's fluxes depend on its own data only, and a block whose every
 * lane grounds the last species (a carrier gas stored last) skips the
 * permutation.
 * Against a long-double solve (tests/test_ground.c, 32000 cells a case,
 * x over up to 12 decades, Đ over up to 6): at most 5e-15 of the largest
 * flux (8.5e-15 in the x86-64-v1 kernel), where the scaled form reaches
 * 3.7e-11. Scarce species tied to each other by a tiny Đ: 6.5e-17
 * against an exact rational solve, where the scaled form is off by 1.8e-5
 * or, at Đ = 2e-139, entirely. Measured, not kept: the same system
 * through the scaled form's L D L^T (pivots by subtraction) reached
 * 6.6e-12 with the grounded species chosen by the largest x_i^2 S_i, and
 * 3.3e-11 by the largest x_i; the x_i^2 S_i rule also grounded a scarce
 * species tied to others by a tiny Đ, where the shift then left fluxes
 * that did not sum to zero (the fuzzer's find, test_ground.c).
 * Speed: no square roots and one unknown fewer than the scaled form;
 * the whole call in cache against the scaled form (tools/anchor.sh, the
 * AVX-512 host, 3 alternating runs, random compositions): 1.31x at N = 2,
 * 1.16x at 3, 1.05x at 4 and 5 (most blocks permute); with the last
 * species 2-4 times as abundant as each other one (no permutation) 1.28x
 * at N = 3 and 4, 1.16-1.21x at 5. With random compositions it also ran
 * 1.04-1.13x faster than the same form through the scaled form's L D L^T
 * with the x_i^2 S_i rule (level with a carrier gas at N = 5); likely
 * cause, not measured: its matrix lives in registers, not in tri.
 * A block with a trace species, some x_i S_i below MCDI_GROUND_AMIN or
 * S_i above MCDI_GROUND_SMAX (where the scaled form's range checks
 * decide), a pivot that is not > 0 or a flux that is not finite takes the
 * scaled form instead. The form is chosen per block, never per pair of
 * blocks (body2): a cell's bits depend only on its own block. */
#define MCDI_GROUND_NMAX 5
/* Whether the grounded form is compiled into a block instance: with GCC
 * only where n is a compile-time constant (the instances of n = 2 to 5,
 * batch_kernel.c), so that the generic instance keeps its code (compiled
 * in there, never run, it added 0.6 % instructions at N = 10 and 1.5 % at
 * N = 20; tools/icount). */
#if defined(__GNUC__) && !defined(__clang__)
#define MCDI_GROUND_HERE(n) __builtin_constant_p(n)
#else
#define MCDI_GROUND_HERE(n) 1
#endif
#define MCDI_GROUND_AMIN 0x1p-960
#define MCDI_GROUND_SMAX 0x1p960
#define MCDI_GROUND_KEEP 4.0

/* a where k, else b, lane by lane */
KINLINE mcdi_vd pick_v(const mcdi_vl k, const mcdi_vd a, const mcdi_vd b)
{
    return (mcdi_vd)((k & (mcdi_vl)a) | (~k & (mcdi_vl)b));
}

/* The species each lane grounds (kg[i], i < m = n - 1: the lanes that
 * ground species i; species m elsewhere): the most abundant one (the
 * last one on ties), or species m where x_m is within a factor
 * MCDI_GROUND_KEEP of the largest x_i, so that a block whose lanes all
 * keep it (a carrier gas stored last) needs no permutation. Returns 0 if
 * some lane has a trace species (x_i = 0: the scaled form then, without
 * trying this one), 1 if every lane grounds species m, 2 otherwise.
 * Writes only kg. */
KINLINE int ground_pick(const mcdi_kblock *b, const size_t n,
                        mcdi_vl *restrict kg)
{
    const size_t m = n - 1;
    const mcdi_vd *restrict x = (const mcdi_vd *)(const void *)b->x;
    const mcdi_vd zero = {0.0};
    mcdi_vd best;
    mcdi_vl any = {0}, trace = {0}, keep;
    size_t i, j;
    for (i = 0; i < n; i++)
        trace |= ~(x[i] > zero);
    if (any_lane_v(trace))
        return 0;
    best = x[m];
    for (i = m; i-- > 0;) { /* strictly larger: the last one on ties */
        const mcdi_vl gt = x[i] > best;
        best = max_v(x[i], best);
        for (j = i + 1; j < m; j++)
            kg[j] &= ~gt;
        kg[i] = gt;
    }
    keep = MCDI_GROUND_KEEP * x[m] >= best;
    for (i = 0; i < m; i++) {
        kg[i] &= ~keep;
        any |= kg[i];
    }
    return any_lane_v(any) ? 2 : 1;
}

/* The grounded system solved by elimination without subtraction
 * (the GTH algorithm of Grassmann, Taksar and Heyman for the stationary
 * vector of a Markov chain, Operations Research 1985, year from memory;
 * written here from its idea, for this system): A u = -d with
 * A_ij = -w_ij (w_ij = x_i x_j / Đ_ij >= 0) and A_ii = e_i + sum_j w_ij,
 * where e_i = x_i x_g / Đ_ig >= 0 is species i's tie to the grounded one.
 * Eliminating row k keeps that structure: w_ij += w_ik w_jk / p_k and
 * e_i += w_ik e_k / p_k, and the pivot p_k = e_k + sum_{j > k} w_kj is a
 * sum of non-negative terms, never a difference, so every pivot and
 * multiplier has a small relative error however the Đ_ij spread. Reads x,
 * d and 1/Đ (tri, left as it is) and writes u to r in species order (u_g
 * = 0); with perm (ground_pick returned 2) species m takes the place of
 * the species a lane grounds (kg[i]), else species m is grounded in
 * every lane. Returns 0 (the scaled form then) if some lane breaks the
 * range rule below (a trace species, say) or has a pivot that is not
 * > 0 (a species tied to nothing). */
KINLINE int stage_ground_gth(const mcdi_kblock *b, const size_t n,
                             const size_t nd, const mcdi_vl *restrict kg,
                             const int perm)
{
    const size_t m = n - 1, tm = m * (m + 1) / 2; /* row m of the triangle */
    const mcdi_vd *restrict tri = (const mcdi_vd *)(const void *)b->tri;
    const mcdi_vd *restrict x = (const mcdi_vd *)(const void *)b->x;
    const mcdi_vd *restrict d = (const mcdi_vd *)(const void *)b->d;
    mcdi_vd *restrict r = (mcdi_vd *)(void *)b->r;
    const mcdi_vd zero = {0.0};
    mcdi_vd w[MCDI_GROUND_NMAX * MCDI_GROUND_NMAX], e[MCDI_GROUND_NMAX],
        s[MCDI_GROUND_NMAX], f[MCDI_GROUND_NMAX * 3], ip[MCDI_GROUND_NMAX],
        xg = x[m];
    mcdi_vl ok = zero == zero;
    size_t i, j, k, dd;
    for (i = 0; perm && i < m; i++)
        xg = pick_v(kg[i], x[i], xg);
    LDL_UNROLL
    for (i = 0; i < m; i++) {
        /* position i holds species m where the lane grounds i */
        mcdi_vd gl = tri[tm + i]; /* 1/Đ to the grounded species */
        s[i] = perm ? pick_v(kg[i], x[m], x[i]) : x[i];
        for (k = 0; perm && k < m; k++)
            if (k != i)
                gl = pick_v(
                    kg[k],
                    tri[k < i ? i * (i + 1) / 2 + k : k * (k + 1) / 2 + i], gl);
        e[i] = s[i] * (xg * gl);
        for (dd = 0; dd < nd; dd++)
            f[i * nd + dd] =
                -(perm ? pick_v(kg[i], d[m * nd + dd], d[i * nd + dd])
                       : d[i * nd + dd]);
        LDL_UNROLL
        for (j = 0; j < i; j++) {
            mcdi_vd t = tri[i * (i + 1) / 2 + j];
            if (perm)
                t = pick_v(kg[i], tri[tm + j], pick_v(kg[j], tri[tm + i], t));
            /* x_j / Đ first: x_i x_j can underflow where w does not */
            w[i * m + j] = s[i] * (s[j] * t);
        }
    }
    /* the range rule: every row sum x_i S_i of the ties (position i:
     * e_i + sum_j w_ij; the grounded species: sum_i e_i) at least
     * MCDI_GROUND_AMIN and S_i at most MCDI_GROUND_SMAX, else the scaled
     * form decides (a trace species, Đ near DBL_MIN or DBL_MAX) */
    {
        mcdi_vd eg = zero;
        mcdi_vl low;
        LDL_UNROLL
        for (i = 0; i < m; i++) {
            mcdi_vd t = e[i];
            eg += e[i];
            for (j = 0; j < m; j++)
                if (j != i)
                    t += j < i ? w[i * m + j] : w[j * m + i];
            ok &= (t >= MCDI_GROUND_AMIN) & (t <= MCDI_GROUND_SMAX * s[i]);
        }
        low = ~((eg >= MCDI_GROUND_AMIN) & (eg <= MCDI_GROUND_SMAX * xg));
        if (any_lane_v(low | ~ok))
            return 0;
    }
    LDL_UNROLL
    for (k = 0; k < m; k++) {
        mcdi_vd p = e[k];
        for (j = k + 1; j < m; j++)
            p += w[j * m + k];
        ok &= p > zero;
        ip[k] = recip_pivot(p, n);
        for (i = k + 1; i < m; i++) {
            /* rows k + 1 .. i - 1 hold their multipliers l_jk already */
            const mcdi_vd wik = w[i * m + k], l = wik * ip[k];
            w[i * m + k] = l;
            e[i] += l * e[k];
            for (dd = 0; dd < nd; dd++)
                f[i * nd + dd] += l * f[k * nd + dd];
            for (j = k + 1; j < i; j++)
                w[i * m + j] += wik * w[j * m + k];
        }
    }
    if (any_lane_v(~ok))
        return 0;
    LDL_UNROLL
    for (i = m; i-- > 0;) {
        for (dd = 0; dd < nd; dd++) {
            mcdi_vd t = f[i * nd + dd] * ip[i];
            for (k = m - 1; k > i; k--)
                t += w[k * m + i] * f[k * nd + dd];
            f[i * nd + dd] = t;
        }
    }
    for (dd = 0; dd < nd; dd++) {
        mcdi_vd um = zero; /* u_m: position i where species m took i's */
        for (i = 0; i < m; i++) {
            const mcdi_vd u = f[i * nd + dd];
            if (perm) {
                um = pick_v(kg[i], u, um);
                r[i * nd + dd] = pick_v(kg[i], zero, u);
            } else {
                r[i * nd + dd] = u;
            }
        }
        r[m * nd + dd] = um;
    }
    return 1;
}

/* The grounded form for blocks of the generic instance of batch_kernel.c (n
 * > MCDI_GROUND_NMAX) up to GROUND_ANY_MAX species: the same system and the
 * same elimination without subtraction as stage_ground_gth, with n unknowns
 * in place of n - 1 and no permutation. Each lane grounds its most abundant
 * species g (the last one on ties) where it lies: its row and column of ties
 * are zero, its ties to the others are their e_i, its right-hand side is
 * zero and its pivot (0) is taken as 1, so its step eliminates nothing and
 * its u_g comes out 0; every other step is stage_ground_gth's, in species
 * order, with the updates gathered column by column (below). n <=
 * GROUND_ANY_MAX and n_dim <= 3, constants at each call (ground_fixed): the
 * matrix and the vectors are locals. Reads x, d and 1/Đ (tri, left as it is)
 * and writes u to r. Returns 0 (the scaled form then) if some lane has a
 * trace species, breaks the range rule of stage_ground_gth or has a pivot
 * that is not > 0. */
#define GROUND_ANY_MAX 10
KINLINE int stage_ground_any(const mcdi_kblock *b, const size_t n,
                             const size_t nd)
{
    const mcdi_vd *restrict tri = (const mcdi_vd *)(const void *)b->tri;
    const mcdi_vd *restrict x = (const mcdi_vd *)(const void *)b->x;
    const mcdi_vd *restrict d = (const mcdi_vd *)(const void *)b->d;
    mcdi_vd *restrict r = (mcdi_vd *)(void *)b->r;
    const mcdi_vd zero = {0.0}, one = zero + 1.0;
    /* locals: registers and known stack slots once the loops unroll */
    mcdi_vd W[GROUND_ANY_MAX * (GROUND_ANY_MAX + 1) / 2], e[GROUND_ANY_MAX],
        rsum[GROUND_ANY_MAX], ip[GROUND_ANY_MAX], lk[GROUND_ANY_MAX],
        f[GROUND_ANY_MAX * 3];
    mcdi_vd best = x[0], gv = zero; /* g of each lane, as a double */
    mcdi_vl gm[GROUND_ANY_MAX], trace = ~(x[0] > zero), ok = zero == zero;
    size_t i, j, k, q, dd;
    LDL_UNROLL
    for (i = 1; i < n; i++) {
        const mcdi_vl ge = x[i] >= best; /* the last one on ties */
        trace |= ~(x[i] > zero);
        best = max_v(x[i], best);
        gv = pick_v(ge, zero + (double)i, gv);
    }
    if (any_lane_v(trace))
        return 0;
    LDL_UNROLL
    for (i = 0; i < n; i++) {
        gm[i] = gv == (double)i;
        rsum[i] = e[i] = zero;
    }
    /* the ties w_ij = x_i (x_j / Đ_ij) (x_j / Đ first: x_i x_j can
     * underflow where w does not), their row sums x_i S_i for the range
     * rule, the ties to g into e and out of the matrix */
    LDL_UNROLL
    for (i = 1; i < n; i++) {
        LDL_UNROLL
        for (j = 0; j < i; j++) {
            const mcdi_vd w = x[i] * (x[j] * tri[i * (i + 1) / 2 + j]);
            rsum[i] += w;
            rsum[j] += w;
            e[j] = pick_v(gm[i], w, e[j]);
            e[i] = pick_v(gm[j], w, e[i]);
            W[i * (i + 1) / 2 + j] = pick_v(gm[i] | gm[j], zero, w);
        }
    }
    LDL_UNROLL
    for (i = 0; i < n; i++)
        ok &= (rsum[i] >= MCDI_GROUND_AMIN) &
              (rsum[i] <= MCDI_GROUND_SMAX * x[i]);
    if (any_lane_v(~ok))
        return 0;
    LDL_UNROLL
    for (i = 0; i < n; i++) {
        LDL_UNROLL
        for (dd = 0; dd < nd; dd++)
            f[i * nd + dd] = pick_v(gm[i], zero, -d[i * nd + dd]);
    }
    /* column by column (left-looking): at step k, row k's multipliers
     * l_kq = W_kq / p_q (q < k, into lk), then e_k, f_k and column k of
     * the Schur complement, W_jk += sum_q W_jq l_kq for j > k, each a sum
     * of one load and one multiply-add per term (W_jq: the ties of row j
     * as they stood when column q was eliminated), and the pivot p_k = e_k
     * + sum_j W_jk: the right-looking updates of stage_ground_gth summed
     * in another order, still without a subtraction */
    LDL_UNROLL
    for (k = 0; k < n; k++) {
        mcdi_vd ek = e[k], fk[3], p;
        LDL_UNROLL
        for (dd = 0; dd < nd; dd++)
            fk[dd] = f[k * nd + dd];
        LDL_UNROLL
        for (q = 0; q < k; q++) {
            const mcdi_vd l = W[k * (k + 1) / 2 + q] * ip[q];
            lk[q] = l;
            ek += l * e[q];
            LDL_UNROLL
            for (dd = 0; dd < nd; dd++)
                fk[dd] += l * f[q * nd + dd];
        }
        e[k] = ek;
        LDL_UNROLL
        for (dd = 0; dd < nd; dd++)
            f[k * nd + dd] = fk[dd];
        p = ek;
        LDL_UNROLL
        for (j = k + 1; j < n; j++) {
            mcdi_vd t = W[j * (j + 1) / 2 + k];
            LDL_UNROLL
            for (q = 0; q < k; q++)
                t += W[j * (j + 1) / 2 + q] * lk[q];
            W[j * (j + 1) / 2 + k] = t;
            p += t;
        }
        LDL_UNROLL
        for (q = 0; q < k; q++)
            W[k * (k + 1) / 2 + q] = lk[q]; /* row k of L now */
        p = pick_v(gm[k], one, p);
        ok &= p > zero;
        ip[k] = 1.0 / p;
    }
    if (any_lane_v(~ok))
        return 0;
    /* u_i = f_i / p_i + sum_{k > i} l_ki u_k (row k of W holds l_kq) */
    LDL_UNROLL
    for (i = n; i-- > 0;) {
        mcdi_vd t[3];
        LDL_UNROLL
        for (dd = 0; dd < nd; dd++)
            t[dd] = f[i * nd + dd] * ip[i];
        LDL_UNROLL
        for (k = n - 1; k > i; k--) {
            const mcdi_vd l = W[k * (k + 1) / 2 + i];
            LDL_UNROLL
            for (dd = 0; dd < nd; dd++)
                t[dd] += l * f[k * nd + dd];
        }
        LDL_UNROLL
        for (dd = 0; dd < nd; dd++)
            f[i * nd + dd] = r[i * nd + dd] = t[dd];
    }
    return 1;
}

/* stage_ground_any for a constant n from 6 to GROUND_ANY_MAX and n_dim =
 * 3, so that its loops unroll and its locals live in registers or fixed
 * stack slots; in every kernel, the baseline one too (unlike ldl_fixed),
 * so that the accuracy does not depend on the machine.
 * Measured against the scaled form (tools/anchor.sh, in cache, the AMD
 * AVX-512 host, 3 alternating runs): 1.14x at N = 6, 1.13x at 8, 1.02x
 * at 10, but 0.89x at 12 and 16 (its matrix no longer fits the
 * registers), hence 10. Its loops with n known only at run time, or with
 * the matrix in tri, ran 2-2.5x the time of the scaled form's stages at N
 * = 10 (66-77 against 28 ns a cell, bench_stages). Returns -1 (nothing
 * done) where no instance covers n and n_dim: the scaled form then. */
KINLINE int ground_fixed(const mcdi_kblock *b, const size_t n, const size_t nd)
{
#define GROUND_CASE(nn)                                                        \
    case nn: return stage_ground_any(b, nn, 3);
    _Static_assert(GROUND_ANY_MAX == 10, "the cases below go to 10");
    if (nd == 3)
        switch (n) {
            GROUND_CASE(6)
            GROUND_CASE(7)
            GROUND_CASE(8)
            GROUND_CASE(9)
            GROUND_CASE(10)
        default: break;
        }
#undef GROUND_CASE
    return -1;
}

/* The molar fluxes of a grounded block for the blocks the fused emit
 * (kernel_emit.h) does not take, the last, partial block of a call and
 * mass fluxes: J_i = c (x_i u_i) and the zero-sum clean-up (the shift back
 * to the molar-average frame) by the emit's own compose_clean_v, so that a
 * cell gets the same fluxes in a full block and in the last one. Returns 0
 * if some flux is not finite (the scaled form then, as after the emit). */
KINLINE int stage_ground_fluxes(const mcdi_kblock *b, const size_t n,
                                const size_t nd)
{
    const mcdi_vd *x = (const mcdi_vd *)(const void *)b->x;
    return compose_clean_v(n, nd, x, x, (const mcdi_vd *)(const void *)b->r,
                           NULL, 0, *(const mcdi_vd *)(const void *)b->c,
                           (mcdi_vd *)(void *)b->J);
}

#endif
