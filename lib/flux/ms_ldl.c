/* ms_ldl.c - the single-state fluxes after the driving forces
 * (mcd_flux_compute): the stages of flux/solve_stages.h, the batched
 * kernel's, run with one lane (mcdi_ms_rows), with the exact solve on a
 * dense matrix: assembly of the regularised symmetric matrix, LDL^T
 * factorisation without pivoting or square roots, and the two triangular
 * solves (LAPACK above MCDI_MS_LAPACK_N species). States without trace
 * species and at most MCDI_MS_FUSED_N species take mcdi_ms_ldl, the same
 * equations and the same factor with the assembly fused (flux_core.h);
 * up to MCDI_MS_GTH_ANY_N species it first tries the grounded form
 * (fused_gth up to MCDI_MS_GTH_N species, fused_gth_any above:
 * elimination without subtraction, accurate however the Đ spread), the
 * scaled form deciding where that cannot run.
 *
 * Equations: see the top comment of maxwell_stefan.c. For the m species
 * present (x_k > 0), with s_k = sqrt(x_k) and R_kl = 1 / Đ_kl,
 *     A = Gs + a s s^T,   A_kk = S_k + a x_k,   A_kl = s_k s_l (a - R_kl),
 *     S_k = sum_{l != k} x_l R_kl (Blanc sum),  a = max_k S_k,
 *     A U = -X^{-1/2} d,   J_k = c s_k U_k.
 * A is symmetric positive definite (maxwell_stefan.c), so A = L D L^T exists
 * without pivoting; D_k > 0 is checked and its failure reported.
 *
 * Cost per state: m(m-1)/2 reciprocals of Đ, 2m square roots and
 * reciprocals, m reciprocal pivots (the only divisions: the factor and the
 * solves multiply by stored reciprocals), m^3/6 + m^2 n_dim fused
 * multiply-adds. The previous Cholesky route took a square root per pivot
 * and a division per solve step and right-hand side; at N = 3 that was
 * 39 divisions and square roots against 12 here.
 *
 * The factor is row-oriented ("up-looking"): row i of L is computed from
 * rows 0..i-1, which are kept twice, as rows of L (lower triangle of A)
 * and as rows of L^T (upper triangle), so that every inner loop of the
 * factor and of both solves is a contiguous multiply-add, vectorisable and
 * free of dot-product dependency chains. (A dot-product formulation with
 * vectorised reductions ran 1.6x slower at N = 10; without them it ran
 * within noise of this one.)
 *
 * Compiled with -O2 without the loop vectoriser (lib/meson.build), once
 * per instruction set on x86-64 with GCC (runtime dispatch in
 * kernel_isa.c; FMA contraction where the set has FMA).
 */
#include <float.h>
#include <math.h>
#include <lapacke.h>

#include "base/mcd_internal.h"
#include "flux/flux_core.h"
#include "flux/solve_stages.h"

/* Compiled once per instruction set (MCDI_KISA = 3 or 1 with the matching
 * -march, see lib/meson.build); kernel_isa.c hands out the one to call. */
#ifndef MCDI_KISA
#define MCDI_KISA 1
#endif
#define MSNAME_(isa) mcdi_ms_ldl_v##isa
#define MSNAME(isa) MSNAME_(isa)
#define RNAME_(isa) mcdi_ms_rows_v##isa
#define RNAME(isa) RNAME_(isa)

#if defined(__GNUC__)
#define MINLINE static inline __attribute__((always_inline))
#else
#define MINLINE static inline
#endif

/* A loop vectorised on its own (-fopenmp-simd; this file is otherwise built
 * without the loop vectoriser: see lib/meson.build). */
#if defined(_OPENMP) || defined(MCDI_OMP_SIMD)
#define SIMD_LOOP _Pragma("omp simd")
#else
#define SIMD_LOOP
#endif

#if defined(__GNUC__) && !defined(__clang__)
#define UNROLL4 _Pragma("GCC unroll 4")
#else
#define UNROLL4
#endif

/* The back substitution L^T u = z after D z = y for nd = 3, in place in
 * Y (m x 3 row-major, y in): row by row from the last, each u_i a chain
 * of multiply-adds in registers over the row of L^T in the upper triangle
 * (A[i m + p] = L_pi), p from m - 1 down, the order of the column sweep
 * it replaces, so the same bits (the column sweep carried every step
 * through a store and a reload of Y). The pivot row's values are held in
 * scalars: copying them through a small array let GCC merge two 8-byte
 * loads of just-stored values into one 16-byte load, which defeats store
 * forwarding (measured: 13 % of the whole N = 3 call on one
 * instruction). */
MINLINE void back_ldl3(size_t m, const double *A, const double *dinv, double *Y)
{
    size_t i, p;
    for (i = m; i-- > 0;) {
        const double *Ui = A + i * m, f = dinv[i];
        double u0 = Y[3 * i] * f, u1 = Y[3 * i + 1] * f, u2 = Y[3 * i + 2] * f;
        for (p = m; --p > i;) {
            const double l = Ui[p];
            u0 -= l * Y[3 * p];
            u1 -= l * Y[3 * p + 1];
            u2 -= l * Y[3 * p + 2];
        }
        Y[3 * i] = u0;
        Y[3 * i + 1] = u1;
        Y[3 * i + 2] = u2;
    }
}

/* The same for any nd, one direction at a time. */
MINLINE void solve_ldl(size_t m, size_t nd, const double *A, const double *dinv,
                       double *Y)
{
    size_t i, j, p, dd;
    for (dd = 0; dd < nd; dd++) {
        for (p = 0; p + 1 < m; p++) {
            const double *Up = A + p * m, v = Y[p * nd + dd];
            for (j = p + 1; j < m; j++)
                Y[j * nd + dd] -= Up[j] * v;
        }
        for (i = 0; i < m; i++)
            Y[i * nd + dd] *= dinv[i];
        for (p = m; p-- > 1;) {
            const double *Lp = A + p * m, v = Y[p * nd + dd];
            for (i = 0; i < p; i++)
                Y[i * nd + dd] -= Lp[i] * v;
        }
    }
}

/* Above this many species the factor and the solves are LAPACK's
 * (blocked Cholesky). It was 24 when LAPACK won from N = 50 (18.8 us
 * against 23.4 us for the loops, N = 100 72 against 140 us). Since the
 * solves run in registers (forward fused into the factor), the loops are
 * faster than the reference (netlib) LAPACK at every N measured, in
 * cache, mcd_flux_compute: N = 26 2.5 us against 5.8, N = 30 3.6 against
 * 7.6, N = 50 12.0 against 20.8, N = 100 79 against 111. 32 keeps N <= 32
 * on the loops; an optimised LAPACK (blocked, vectorised) may win from a
 * smaller N than the reference one (not measured: not installed). */
#ifndef MCDI_MS_LAPACK_N
#define MCDI_MS_LAPACK_N 32
#endif

/* Cholesky A = U^T U by LAPACK on the assembled lower triangle (row-major
 * lower = column-major upper) and the solve for Y (m x nd row-major),
 * through Yt (column-major copy). Returns 0 or k+1 for pivot k. */
static size_t solve_lapack(size_t m, size_t nd, double *A, double *Y,
                           double *Yt)
{
    lapack_int info;
    size_t i, dd;
    info = LAPACKE_dpotrf_work(LAPACK_COL_MAJOR, 'U', (lapack_int)m, A,
                               (lapack_int)m);
    if (info != 0) /* < 0 (an argument) cannot happen: report pivot 0 */
        return info > 0 ? (size_t)info : 1;
    for (i = 0; i < m; i++)
        for (dd = 0; dd < nd; dd++)
            Yt[dd * m + i] = Y[i * nd + dd];
    LAPACKE_dpotrs_work(LAPACK_COL_MAJOR, 'U', (lapack_int)m, (lapack_int)nd, A,
                        (lapack_int)m, Yt, (lapack_int)m);
    for (i = 0; i < m; i++)
        for (dd = 0; dd < nd; dd++)
            Y[i * nd + dd] = Yt[dd * m + i];
    return 0;
}

/* Steps p..p+3 (ldl_steps4) and p, p+1 (ldl_steps2) of row i of the
 * up-looking factor below, for rows without trace species: the
 * multipliers W_iq -> L_iq of the block (the later ones first updated by
 * the earlier, in step order), the pivot di, the updates of the rest of
 * row i with each element loaded and stored once for the whole block (in
 * step order: the same bits as one step at a time; fewer loads and
 * stores, measured 1.2x at N = 20), L_iq also into the upper triangle
 * (row q of L^T), and for nd = 3 the forward substitution's terms. */
MINLINE void ldl_steps4(double *A, size_t m, size_t i, size_t p,
                        const double *dinv, double *di, size_t nd,
                        const double *Y, double *y0, double *y1, double *y2)
{
    double *Ai = A + i * m;
    size_t j;
    double *U0 = A + p * m, *U1 = U0 + m, *U2 = U1 + m, *U3 = U2 + m;
    const double w0 = Ai[p], l0 = w0 * dinv[p];
    double w1 = Ai[p + 1], w2 = Ai[p + 2], w3 = Ai[p + 3], l1, l2, l3;
    w1 -= w0 * U0[p + 1];
    w2 -= w0 * U0[p + 2];
    w3 -= w0 * U0[p + 3];
    l1 = w1 * dinv[p + 1];
    w2 -= w1 * U1[p + 2];
    w3 -= w1 * U1[p + 3];
    l2 = w2 * dinv[p + 2];
    w3 -= w2 * U2[p + 3];
    l3 = w3 * dinv[p + 3];
    *di -= w0 * l0;
    *di -= w1 * l1;
    *di -= w2 * l2;
    *di -= w3 * l3;
    for (j = p + 4; j < i; j++) {
        double t = Ai[j];
        t -= w0 * U0[j];
        t -= w1 * U1[j];
        t -= w2 * U2[j];
        t -= w3 * U3[j];
        Ai[j] = t;
    }
    Ai[p] = U0[i] = l0;
    Ai[p + 1] = U1[i] = l1;
    Ai[p + 2] = U2[i] = l2;
    Ai[p + 3] = U3[i] = l3;
    if (nd == 3) {
        *y0 -= l0 * Y[3 * p];
        *y1 -= l0 * Y[3 * p + 1];
        *y2 -= l0 * Y[3 * p + 2];
        *y0 -= l1 * Y[3 * p + 3];
        *y1 -= l1 * Y[3 * p + 4];
        *y2 -= l1 * Y[3 * p + 5];
        *y0 -= l2 * Y[3 * p + 6];
        *y1 -= l2 * Y[3 * p + 7];
        *y2 -= l2 * Y[3 * p + 8];
        *y0 -= l3 * Y[3 * p + 9];
        *y1 -= l3 * Y[3 * p + 10];
        *y2 -= l3 * Y[3 * p + 11];
    }
}

MINLINE void ldl_steps2(double *A, size_t m, size_t i, size_t p,
                        const double *dinv, double *di, size_t nd,
                        const double *Y, double *y0, double *y1, double *y2)
{
    double *Ai = A + i * m;
    size_t j;
    double *U0 = A + p * m, *U1 = U0 + m;
    const double w0 = Ai[p], l0 = w0 * dinv[p];
    double w1 = Ai[p + 1], l1;
    w1 -= w0 * U0[p + 1];
    l1 = w1 * dinv[p + 1];
    *di -= w0 * l0;
    *di -= w1 * l1;
    for (j = p + 2; j < i; j++) {
        double t = Ai[j];
        t -= w0 * U0[j];
        t -= w1 * U1[j];
        Ai[j] = t;
    }
    Ai[p] = U0[i] = l0;
    Ai[p + 1] = U1[i] = l1;
    if (nd == 3) {
        *y0 -= l0 * Y[3 * p];
        *y1 -= l0 * Y[3 * p + 1];
        *y2 -= l0 * Y[3 * p + 2];
        *y0 -= l1 * Y[3 * p + 3];
        *y1 -= l1 * Y[3 * p + 4];
        *y2 -= l1 * Y[3 * p + 5];
    }
}

/* Factor A = L D L^T (lower triangle and diagonal of the dense m x m A
 * hold the matrix) and solve in place for U in Y (m x nd row-major):
 * LAPACK above MCDI_MS_LAPACK_N species, else the up-looking loops.
 * skip_zero (a constant at each call): skip zero multipliers, the rows and
 * columns of trace species (a branch per multiplier that costs the fused
 * no-trace kernel 2-3 % at N = 10). Returns 0 or k+1 for pivot k. */
MINLINE size_t ldl_dense(size_t m, size_t nd, double *A, double *dinv,
                         double *Y, double *Yt, const int skip_zero)
{
    size_t i, j, p;
    if (m > MCDI_MS_LAPACK_N)
        return solve_lapack(m, nd, A, Y, Yt);
    /* Up-looking L D L^T. Row i of the lower triangle turns from A_ij into
     * W_ij = L_ij D_j by updates with rows of L^T, which are kept in the
     * upper triangle (A[p m + j] = L_jp): each update is a contiguous
     * multiply-add over j, independent across j (no dot-product chains).
     * For nd = 3 the forward substitution L y = b runs in the same loop:
     * y_i -= L_ip y_p as each L_ip is formed (p rising, the order of the
     * separate row sweep it replaces: the same bits), in registers. */
    for (i = 0; i < m; i++) {
        double *Ai = A + i * m, di = Ai[i];
        double y0 = 0.0, y1 = 0.0, y2 = 0.0;
        if (nd == 3) {
            y0 = Y[3 * i];
            y1 = Y[3 * i + 1];
            y2 = Y[3 * i + 2];
        }
        /* without trace species: blocks of four steps, then of two */
        for (p = 0; !skip_zero && p + 3 < i; p += 4)
            ldl_steps4(A, m, i, p, dinv, &di, nd, Y, &y0, &y1, &y2);
        for (; !skip_zero && p + 1 < i; p += 2)
            ldl_steps2(A, m, i, p, dinv, &di, nd, Y, &y0, &y1, &y2);
        for (; p < i; p++) {
            double *Up = A + p * m;
            const double w = Ai[p];
            double l = w * dinv[p];
            if (skip_zero &&
                w == 0.0) { /* a trace species' row or column: nothing */
                Ai[p] = Up[i] = l = 0.0;
            } else {
                di -= w * l;
                for (j = p + 1; j < i; j++)
                    Ai[j] -= w * Up[j];
                Ai[p] = l;
                Up[i] = l;
            }
            if (nd == 3) {
                y0 -= l * Y[3 * p];
                y1 -= l * Y[3 * p + 1];
                y2 -= l * Y[3 * p + 2];
            }
        }
        if (nd == 3) {
            Y[3 * i] = y0;
            Y[3 * i + 1] = y1;
            Y[3 * i + 2] = y2;
        }
        if (!(di > 0.0))
            return i + 1;
        dinv[i] = 1.0 / di;
    }
    /* D z = y, L^T u = z by rows of L^T (nd = 3); otherwise all three
     * solves one direction at a time */
    if (nd == 3)
        back_ldl3(m, A, dinv, Y);
    else
        solve_ldl(m, nd, A, dinv, Y);
    return 0;
}

/* The exact solve of one state in the stages (L = 1): A = Gs + a s s^T
 * assembled into the lower triangle and the diagonal of the dense A
 * (m x m) from the stage rows (1/Đ packed in tri, s, S, x, a), then
 * ldl_dense on Y (the rows' r). Trace species are decoupled rows
 * (s_i = 0: zero off-diagonal entries). Returns 0 or k+1 for pivot k. */
MINLINE size_t exact_dense(size_t m, size_t nd, const mcdi_rows *R, double a,
                           double *A, double *dinv, double *Y, double *Yt)
{
    const double *tri = R->tri, *s = R->s, *S = R->S, *x = R->x;
    size_t i, j;
    for (i = 0; i < m; i++) {
        double *Ai = A + i * m;
        const double *Ti = tri + i * (i + 1) / 2, si = s[i];
        for (j = 0; j < i; j++)
            Ai[j] = si * s[j] * (a - Ti[j]);
        Ai[i] = S[i] + a * x[i];
    }
    return ldl_dense(m, nd, A, dinv, Y, Yt, 1);
}

/* The stages after the driving forces for constant nd (flux/solve_stages.h,
 * the same as the batched kernel's, with one lane). */
MINLINE size_t rows_body(const mcdi_rows *R, const mcdi_dense *D,
                         mcd_model model, const size_t n, const size_t nd)
{
    double a;
    size_t bad;
    int ntr;
    mcdi_blanc_rows(R, model == MCD_MODEL_MIXTURE_AVERAGED, n, 1);
    if (model == MCD_MODEL_MIXTURE_AVERAGED) {
        mcdi_mixavg_rows(R, n, 1, nd);
        return 0;
    }
    ntr = mcdi_trace_rows(R, n, 1, nd);
    if (ntr)
        mcdi_trace_couple_rows(R, n, 1, nd);
    mcdi_rhs_rows(R, n, 1, nd);
    mcdi_shift_rows(R, &a, n, 1);
    bad = exact_dense(n, nd, R, a, D->A, D->dinv, R->r, D->Yt);
    if (bad != 0)
        return bad;
    mcdi_compose_rows(R, ntr, n, 1, nd);
    return 0;
}

size_t RNAME(MCDI_KISA)(const mcdi_rows *R, const mcdi_dense *D,
                        mcd_model model, size_t n, size_t nd, const double *Dij)
{
    size_t i, j;
    /* 1/Đ from the upper triangle (exactly symmetric matrices, as the
     * batched kernel) into the packed lower one: row i is column i of
     * the upper triangle (vectorised: the divider is the bottleneck here,
     * 190 reciprocals at n = 20) */
    for (i = 1; i < n; i++) {
        double *Ti = R->tri + i * (i + 1) / 2;
        SIMD_LOOP
        for (j = 0; j < i; j++)
            Ti[j] = 1.0 / Dij[j * n + i];
    }
    if (nd != 3)
        return rows_body(R, D, model, n, nd);
    /* a few species as constants, so that the species loops unroll (the
     * states that reach here at small n have a trace species, or are
     * mixture-averaged) */
    switch (n) {
    case 3: return rows_body(R, D, model, 3, 3);
    case 4: return rows_body(R, D, model, 4, 3);
    case 5: return rows_body(R, D, model, 5, 3);
    default: return rows_body(R, D, model, n, 3);
    }
}

/* The grounded form of the same state (the batched kernel's for blocks
 * up to 5 species, lib/batched/kernel_ldl.h): with u_i = J_i / (c x_i)
 * and the most abundant species g grounded (u_g = 0), A u = -d over the
 * other m - 1 species, A_ij = -w_ij (w_ij = x_i x_j / Đ_ij), A_ii = e_i +
 * sum_j w_ij (e_i = x_i x_g / Đ_ig), eliminated without subtraction: the
 * pivot p_k = e_k + sum_{i > k} w_ik, then w_ij += w_ik w_jk / p_k and
 * e_i += w_ik e_k / p_k (the GTH algorithm's idea for Markov chains), so
 * the factor keeps a small relative error however the Đ spread. Row i
 * (position i: species i + (i >= g)) holds the Schur complement's w in
 * its lower part and, once eliminated, its multipliers l_ji = w_ji / p_i
 * in its upper part (row of L^T: contiguous updates and back
 * substitution). Fluxes J_i = c (x_i u_i) into Y, J_g = 0; the caller's
 * zero-sum clean-up is the shift back to the molar-average frame (small:
 * x_g >= 1/m). Returns 0 (Y is scratch then) if a pivot is not a positive
 * finite number or a flux is not finite: the scaled form then decides. */
/* Up to this many species (the batched kernel's stage_ground_gth goes to
 * 5 too; fused_gth_any, below, takes 6 to MCDI_MS_GTH_ANY_N). Above,
 * these plain loops ran far slower than the tuned L D L^T of the scaled
 * form (bench_single, 3 alternating runs: N = 3 0.94x the time, 5 1.04x,
 * 10 1.26x, 20 1.47x, 30 1.55x). */
#define MCDI_MS_GTH_N 5
MINLINE int fused_gth(size_t m, const size_t nd, const double *xp,
                      const double *Dp, size_t ld, const double *dp, double c,
                      double *A, double *e, double *dinv, double *Y)
{
    const size_t mm = m - 1;
    size_t g = 0, i, j, k, dd;
    double chk = 0.0;
    for (i = 1; i < m; i++)
        if (xp[i] >= xp[g])
            g = i;
    double eg = 0.0;
    for (i = 0; i < mm; i++) {
        const size_t si = i + (i >= g);
        double *Ai = A + i * m;
        dinv[i] = e[i] =
            xp[si] * (xp[g] / (si < g ? Dp[si * ld + g] : Dp[g * ld + si]));
        eg += e[i];
        for (j = 0; j < i; j++) {
            const size_t sj = j + (j >= g); /* sj < si: upper triangle */
            /* x_j / Đ first: x_i x_j can underflow where w does not */
            const double w = xp[si] * (xp[sj] / Dp[sj * ld + si]);
            Ai[j] = w;
            dinv[i] += w; /* the row sums x_i S_i, for the check below */
            dinv[j] += w;
        }
        for (dd = 0; dd < nd; dd++)
            Y[i * nd + dd] = -dp[si * nd + dd];
    }
    /* x_i S_i below 2^-960 or S_i above 2^960 (Đ near DBL_MIN or
     * DBL_MAX): the scaled form and its verdict, as the batched kernel
     * does (MCDI_GROUND_AMIN, MCDI_GROUND_SMAX) */
    if (!(eg >= 0x1p-960 && eg <= 0x1p960 * xp[g]))
        return 0;
    for (i = 0; i < mm; i++)
        if (!(dinv[i] >= 0x1p-960 && dinv[i] <= 0x1p960 * xp[i + (i >= g)]))
            return 0;
    for (k = 0; k < mm; k++) {
        double *Uk = A + k * m, p = e[k], ip;
        for (i = k + 1; i < mm; i++)
            p += A[i * m + k];
        if (!(p > 0.0 && p <= DBL_MAX))
            return 0;
        ip = dinv[k] = 1.0 / p;
        for (i = k + 1; i < mm; i++) {
            double *Ai = A + i * m;
            const double wik = Ai[k], l = wik * ip;
            Uk[i] = l;
            e[i] += l * e[k];
            for (dd = 0; dd < nd; dd++)
                Y[i * nd + dd] += l * Y[k * nd + dd];
            for (j = k + 1; j < i; j++)
                Ai[j] += wik * Uk[j];
        }
    }
    for (i = mm; i-- > 0;) {
        const double *Ui = A + i * m;
        for (dd = 0; dd < nd; dd++) {
            double u = Y[i * nd + dd] * dinv[i];
            for (j = mm - 1; j > i; j--)
                u += Ui[j] * Y[j * nd + dd];
            Y[i * nd + dd] = u;
        }
    }
    /* into species order from the last row (si >= i: no row is
     * overwritten before it is read) */
    for (i = mm; i-- > 0;) {
        const size_t si = i + (i >= g);
        for (dd = 0; dd < nd; dd++) {
            const double q = c * (xp[si] * Y[i * nd + dd]);
            Y[si * nd + dd] = q;
            chk += q * 0.0;
        }
    }
    for (dd = 0; dd < nd; dd++)
        Y[g * nd + dd] = 0.0;
    return chk == 0.0; /* NaN if some flux is not finite */
}

/* The grounded form from MCDI_MS_GTH_N + 1 to MCDI_MS_GTH_ANY_N species,
 * as the batched kernel's stage_ground_any (lib/batched/kernel_ldl.h):
 * the most abundant species g (the last one on ties) stays where it is,
 * with a zero row and column of ties, its ties to the others in e, a zero
 * right-hand side and a pivot taken as 1, so that its step eliminates
 * nothing and u_g = 0; the other steps eliminate without subtraction,
 * column by column (row k's multipliers l_kq = W_kq / p_q, then column k of
 * the Schur complement, W_jk += sum_q W_jq l_kq, and the pivot p_k = e_k +
 * sum_{j > k} W_jk). W in the lower triangle of A (m x m), e in e, the row
 * sums in rs, the multipliers of a row in lk, 1/p in dinv; fluxes J_i = c
 * (x_i u_i) into Y, J_g = 0 (the caller's clean-up is the shift back to
 * the molar-average frame). Returns 0 (Y is scratch then) if a species is
 * absent, a row sum breaks the range rule of fused_gth, a pivot is not a
 * positive finite number or a flux is not finite: the scaled form then.
 * Speed against the scaled form (bench_single, the AMD AVX-512 host,
 * alternating runs): the call takes about 1.2x the time at N = 6 and
 * 1.3x at 8 and 10 (185 -> 220, 240 -> 320, 330 -> 440 ns): the price of
 * its accuracy there (5.7e-11 -> 2.5e-15 on random states, 0.018 ->
 * 4.3e-16 on a tied one; tests/test_ground.c) and of agreeing with the
 * batched call, which takes the same form. Not faster (measured level or
 * slower): the pivot's sum or the dot products in several chains, the
 * loops unrolled by four, the vectorised 1/Đ pass of fused_ldl in place
 * of the divisions here, one helper for the two three-direction sums
 * below (5-8 % slower: the back substitution then took the newest
 * unknown first, and the forward one a multiply by 1). */
#ifndef MCDI_MS_GTH_ANY_N
#define MCDI_MS_GTH_ANY_N 10
#endif
MINLINE int fused_gth_any(size_t m, const size_t nd, const double *xp,
                          const double *Dp, size_t ld, const double *dp,
                          double c, double *A, double *e, double *rs,
                          double *lk, double *dinv, double *Y)
{
    size_t g = 0, i, j, k, q, dd;
    double chk = 0.0;
    for (i = 0; i < m; i++) {
        if (!(xp[i] > 0.0))
            return 0;
        if (xp[i] >= xp[g])
            g = i;
        e[i] = rs[i] = 0.0;
    }
    for (i = 1; i < m; i++) {
        double *Ai = A + i * m;
        for (j = 0; j < i; j++) {
            /* x_j / Đ first: x_i x_j can underflow where w does not */
            const double w = xp[i] * (xp[j] / Dp[j * ld + i]);
            rs[i] += w;
            rs[j] += w;
            Ai[j] = w;
        }
    }
    for (i = 0; i < m; i++)
        if (!(rs[i] >= 0x1p-960 && rs[i] <= 0x1p960 * xp[i]))
            return 0;
    for (j = 0; j < g; j++) { /* g's ties into e, out of the matrix */
        e[j] = A[g * m + j];
        A[g * m + j] = 0.0;
    }
    for (i = g + 1; i < m; i++) {
        e[i] = A[i * m + g];
        A[i * m + g] = 0.0;
    }
    for (i = 0; i < m; i++)
        for (dd = 0; dd < nd; dd++)
            Y[i * nd + dd] = i == g ? 0.0 : -dp[i * nd + dd];
    for (k = 0; k < m; k++) {
        double *Ak = A + k * m, ek = e[k], p;
        for (q = 0; q < k; q++) {
            lk[q] = Ak[q] * dinv[q];
            ek += lk[q] * e[q];
        }
        e[k] = ek;
        if (nd == 3) { /* the three directions in registers */
            double t0 = Y[3 * k], t1 = Y[3 * k + 1], t2 = Y[3 * k + 2];
            for (q = 0; q < k; q++) {
                const double l = lk[q];
                t0 += l * Y[3 * q];
                t1 += l * Y[3 * q + 1];
                t2 += l * Y[3 * q + 2];
            }
            Y[3 * k] = t0;
            Y[3 * k + 1] = t1;
            Y[3 * k + 2] = t2;
        } else {
            for (dd = 0; dd < nd; dd++) {
                double t = Y[k * nd + dd];
                for (q = 0; q < k; q++)
                    t += lk[q] * Y[q * nd + dd];
                Y[k * nd + dd] = t;
            }
        }
        p = ek;
        for (j = k + 1; j < m; j++) {
            double *Aj = A + j * m, t = Aj[k];
            for (q = 0; q < k; q++)
                t += Aj[q] * lk[q];
            Aj[k] = t;
            p += t;
        }
        for (q = 0; q < k; q++)
            Ak[q] = lk[q]; /* row k of L now */
        if (k == g)
            p = 1.0;
        if (!(p > 0.0 && p <= DBL_MAX))
            return 0;
        dinv[k] = 1.0 / p;
    }
    for (i = m; i-- > 0;) {
        if (nd == 3) {
            const double f = dinv[i];
            double u0 = Y[3 * i] * f, u1 = Y[3 * i + 1] * f,
                   u2 = Y[3 * i + 2] * f;
            for (k = m - 1; k > i; k--) {
                const double l = A[k * m + i];
                u0 += l * Y[3 * k];
                u1 += l * Y[3 * k + 1];
                u2 += l * Y[3 * k + 2];
            }
            Y[3 * i] = u0;
            Y[3 * i + 1] = u1;
            Y[3 * i + 2] = u2;
            continue;
        }
        for (dd = 0; dd < nd; dd++) {
            double u = Y[i * nd + dd] * dinv[i];
            for (k = m - 1; k > i; k--)
                u += A[k * m + i] * Y[k * nd + dd];
            Y[i * nd + dd] = u;
        }
    }
    for (i = 0; i < m * nd; i++) {
        const double q2 = c * (xp[i / nd] * Y[i]);
        Y[i] = q2;
        chk += q2 * 0.0;
    }
    return chk == 0.0; /* NaN if some flux is not finite */
}

/* The exact model for a state without trace species and at most
 * MCDI_MS_FUSED_N species (see maxwell_stefan.c): the Blanc sums, the
 * shift, the assembly and the right-hand side fused into a few passes
 * over the dense A (the stages cost 4-8 % more there, measured), then
 * the same ldl_dense; nd a constant at each call (below).
 *
 * 1/Đ is packed by rows of the lower triangle (T, row i at i(i-1)/2:
 * R_ij = 1/Đ_ji, j < i, from the upper triangle of Dp as the batched
 * kernel), so that every loop after the packing runs over contiguous
 * rows: the Blanc sums as a dot product and an update per row, the
 * assembly as a row (loops of a few entries: unrolled by four rather
 * than vectorised, whose set-up costs more there). Each S_i is summed in
 * the order j = 0, 1, ..., m - 1 (j != i), as before and as the batched
 * kernel sums it. (Packed by rows of the upper triangle, the assembly
 * read T with a stride that changed every step.) */
MINLINE size_t fused_ldl(size_t m, const size_t nd, const double *xp,
                         const double *Dp, size_t ld, const double *dp,
                         double c, double *A, double *T, double *sq,
                         double *isq, double *S, double *dinv, double *Y,
                         double *Yt)
{
    double a = 0.0;
    size_t i, j, k, dd;

    if (m <= MCDI_MS_GTH_N &&
        fused_gth(m, nd, xp, Dp, ld, dp, c, A, S, dinv, Y))
        return 0;
    if (m > MCDI_MS_GTH_N && m <= MCDI_MS_GTH_ANY_N &&
        fused_gth_any(m, nd, xp, Dp, ld, dp, c, A, S, sq, isq, dinv, Y))
        return 0;
    /* vectorised: at m = 10 the divider is the bottleneck of the assembly
     * (square roots, reciprocals); +8 % of this routine, measured */
    SIMD_LOOP
    for (i = 0; i < m; i++) {
        sq[i] = sqrt(xp[i]);
        isq[i] = 1.0 / sq[i];
    }
    /* the reciprocals R_ij: copied column by column of the upper triangle
     * and then divided in one vectorised pass (per row the short rows
     * left most of the divisions to scalar epilogues; the divider is the
     * limit there) */
    if (m >= 6) {
        for (i = 1, k = 0; i < m; i++) {
            const double *Dc = Dp + i;
            UNROLL4
            for (j = 0; j < i; j++, k++)
                T[k] = Dc[j * ld];
        }
        SIMD_LOOP
        for (j = 0; j < k; j++)
            T[j] = 1.0 / T[j];
    } else { /* a few pairs: the copy costs more than it saves */
        for (i = 1, k = 0; i < m; i++)
            for (j = 0; j < i; j++)
                T[k++] = 1.0 / Dp[j * ld + i];
    }
    /* Blanc sums S_i = sum_{j != i} x_j R_ij: row i of T gives the terms
     * j < i of S_i (first, in order) and the term j = i of every S_j,
     * j < i (after their own rows, in order of i) */
    S[0] = 0.0;
    for (i = 1, k = 0; i < m; k += i, i++) {
        const double *Ti = T + k, xi = xp[i];
        double t = 0.0;
        UNROLL4
        for (j = 0; j < i; j++)
            t += xp[j] * Ti[j];
        UNROLL4
        for (j = 0; j < i; j++)
            S[j] += xi * Ti[j];
        S[i] = t;
    }
    for (i = 0; i < m; i++)
        if (S[i] > a)
            a = S[i];
    /* A = Gs + a s s^T into the lower triangle and the diagonal; the
     * right-hand side -d_k / s_k into Y (m x nd, row-major) */
    for (i = 0, k = 0; i < m; k += i, i++) {
        double *Ai = A + i * m;
        const double si = sq[i], *Ti = T + k;
        UNROLL4
        for (j = 0; j < i; j++)
            Ai[j] = si * sq[j] * (a - Ti[j]);
        Ai[i] = S[i] + a * xp[i];
        if (nd == 3) { /* unrolled (-O2 keeps even this loop) */
            Y[3 * i] = -dp[3 * i] * isq[i];
            Y[3 * i + 1] = -dp[3 * i + 1] * isq[i];
            Y[3 * i + 2] = -dp[3 * i + 2] * isq[i];
        } else {
            for (dd = 0; dd < nd; dd++)
                Y[i * nd + dd] = -dp[i * nd + dd] * isq[i];
        }
    }
    {
        size_t bad = ldl_dense(m, nd, A, dinv, Y, Yt, 0);
        if (bad != 0)
            return bad;
    }
    /* J = c (s U), in this order: s U is at most U, while c s can
     * underflow (c near DBL_MIN, a near-trace species) and lose a flux
     * the others balance (found by fuzz_flux: c = 7e-304, x = 1.6e-60) */
    for (i = 0; i < m; i++) {
        if (nd == 3) {
            Y[3 * i] = c * (sq[i] * Y[3 * i]);
            Y[3 * i + 1] = c * (sq[i] * Y[3 * i + 1]);
            Y[3 * i + 2] = c * (sq[i] * Y[3 * i + 2]);
        } else {
            for (dd = 0; dd < nd; dd++)
                Y[i * nd + dd] = c * (sq[i] * Y[i * nd + dd]);
        }
    }
    return 0;
}

size_t MSNAME(MCDI_KISA)(size_t m, size_t nd, const double *xp,
                         const double *Dp, size_t ld, const double *dp,
                         double c, double *A, double *T, double *sq,
                         double *isq, double *S, double *dinv, double *Y,
                         double *Yt)
{
    /* nd = 3 as a constant: the fused forward substitution, the
     * right-hand side and the fluxes unrolled over the directions */
    if (nd == 3)
        return fused_ldl(m, 3, xp, Dp, ld, dp, c, A, T, sq, isq, S, dinv, Y,
                         Yt);
    return fused_ldl(m, nd, xp, Dp, ld, dp, c, A, T, sq, isq, S, dinv, Y, Yt);
}
