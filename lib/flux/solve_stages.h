/* solve_stages.h - the stages after the driving forces, written once on
 * rows of L lanes (base/lanes.h) for both pipelines: the batched kernel
 * (batched/batch_kernel.c, L = its vector width, or 1 above
 * MCDI_LANES_NMAX species) and the single-state call (flux/ms_rows.c,
 * L = 1). Never installed.
 *
 * Order (batched/batch_kernel.c body(), flux/ms_rows.c):
 *   inverse diffusivities 1/Đ_ij (packed lower triangle, i > j; each
 *   caller fills it from its own input), Blanc sums, then either the
 *   mixture-averaged fluxes, or the trace species, the right-hand side,
 *   the solve of (Gs + a s s^T) U = b and the composition of the fluxes.
 *   The zero-sum clean-up and the mass basis follow (lanes.h, stages.h).
 * The equations are in batched/batch_kernel.c and flux/maxwell_stefan.c.
 * The batched kernel keeps a fused solve on its lane vectors
 * (batched/kernel_ldl.h, ldl_solve_v) for full vector blocks; every other
 * block, and the single state, solves with mcdi_ldl_rows below.
 */
#ifndef MCD_SOLVE_STAGES_H
#define MCD_SOLVE_STAGES_H

#include <math.h>
#include "base/lanes.h"

/* The rows a solve works on, each n rows of L lanes (n * nd rows for d,
 * t, r, J; n (n + 1) / 2 rows for tri; one row for c). The batched kernel
 * points them into its block (batched/batch_layout.h), the single-state
 * call into the core bank (flux/core_layout.h). */
typedef struct mcdi_rows {
    double *tri;     /* 1/Đ (packed lower), then A, then L of L D L^T */
    double *x;       /* mole fractions */
    double *s;       /* sqrt(x) */
    double *S;       /* Blanc sums sum_{j != i} x_j / Đ_ij */
    double *num;     /* sum_{j != i} x_j */
    double *minv;    /* harmonic sums of pure cells (mixture-averaged) */
    double *Dg;      /* pivots of L D L^T */
    double *iDg;     /* their inverses */
    double *wk;      /* -D_im, -1/s_i, multipliers (per stage) */
    double *d;       /* driving forces */
    double *t;       /* trace fluxes J / c */
    double *r;       /* right-hand side, then the solution U */
    double *J;       /* fluxes */
    const double *c; /* concentration */
} mcdi_rows;

/* Blanc sums S_i = sum_{j != i} x_j / Đ_ij and num_i = sum_{j != i} x_j
 * from the packed inverse diffusivities, along the contiguous rows of the
 * lower triangle: row i's terms (j < i) in local accumulators (registers;
 * accumulating in S[i] itself chained every term through a store at
 * L = 1), which then start S_i, and its terms for the earlier species
 * added to theirs (the later rows add theirs to S_i). Each sum adds its
 * terms in the order of j, each term fused (MCDI_FMA) where the set has
 * FMA. num only when want_num (the mixture-averaged and iterative models
 * read it). */
KINLINE void mcdi_blanc_rows(const mcdi_rows *R, const int want_num,
                             const size_t n, const size_t L)
{
    double *restrict S = R->S, *restrict num = R->num;
    const double *restrict x = R->x;
    double as[MCDI_LANES], an[MCDI_LANES];
    size_t i, j, l;
    for (i = 0; i < n; i++) {
        const double *q = R->tri + i * (i + 1) / 2 * L;
        for_lanes (l)
            as[l] = 0.0;
        for (j = 0; j < i; j++)
            for_lanes (l) {
                as[l] = MCDI_FMA(x[j * L + l], q[j * L + l], as[l]);
                S[j * L + l] += x[i * L + l] * q[j * L + l];
            }
        for_lanes (l)
            S[i * L + l] = as[l];
        if (!want_num)
            continue;
        for_lanes (l)
            an[l] = 0.0;
        for (j = 0; j < i; j++)
            for_lanes (l) {
                an[l] += x[j * L + l];
                num[j * L + l] += x[i * L + l];
            }
        for_lanes (l)
            num[i * L + l] = an[l];
    }
}

/* Mixture-averaged (Hirschfelder-Curtiss / Blanc) diffusion fluxes
 * (MCD_MODEL_MIXTURE_AVERAGED, single-state and batched calls).
 *
 * Effective diffusivity of species i in the mixture (Hirschfelder, Curtiss
 * and Bird 1954; the form of Blanc's law for a species in a mixture):
 *     D_im = (1 - x_i) / sum_{j != i} x_j / Đ_ij.
 * 1 - x_i is evaluated as sum_{j != i} x_j (no cancellation near x_i = 1).
 * For a trace species (x_i = 0) this is exactly Blanc's law
 * 1 / D_im = sum_j x_j / Đ_ij, the same value as the exact Maxwell-Stefan
 * solution gives for that species.
 * Pure species i (x_i = 1, all others 0): numerator and denominator vanish
 * and the limit depends on the direction of approach. We define it as the
 * equal-weight harmonic mean D_im = (N - 1) / sum_{j != i} 1 / Đ_ij, i.e.
 * the limit along x_j = (1 - x_i)/(N - 1). It only matters through the
 * correction flux (the pure species' flux is minus the sum of the others).
 *
 * Mole basis (molar-average frame):
 *     J*_i = -c D_im d_i,   J_i = J*_i - x_i sum_k J*_k,
 * with d_i the driving force (grad x_i for an ideal mixture without
 * pressure diffusion). The correction velocity sum_k J*_k / c restores the
 * zero-sum; trace species are not affected by it.
 *
 * Mass basis (mass-average frame), Hirschfelder-Curtiss form:
 *     j*_i = -rho (M_i / Mbar) D_im d_i = M_i J*_i,
 *     j_i  = j*_i - w_i sum_k j*_k.
 * Substituting J_i above into the basis change j_i = M_i J_i -
 * w_i sum_k M_k J_k gives exactly the same j_i (the x_i-correction terms
 * cancel because w_i Mbar = x_i M_i), so both pipelines obtain the mass
 * basis by converting the molar fluxes; the two routes agree identically.
 *
 * When all Đ_ij are equal to Đ, D_im = Đ, sum_k J*_k = -c Đ sum_k d_k = 0
 * and J_i = -c Đ d_i: the exact Maxwell-Stefan solution.
 * Cost O(N^2) (one division per pair) + O(N n_dim); no linear solve.
 *
 * Here: J*_i = -c D_im d_i, D_im = num_i / S_i from the Blanc sums (for a
 * pure species the harmonic mean above, from minv), then
 * J = J* - x sum J* (the callers' zero-sum clean-up runs it again). */
KINLINE void mcdi_mixavg_rows(const mcdi_rows *R, const size_t n,
                              const size_t L, const size_t nd)
{
    const double *restrict S = R->S, *restrict num = R->num;
    const double *restrict x = R->x, *restrict c = R->c, *restrict d = R->d;
    double *restrict minv = R->minv, *restrict wk = R->wk, *restrict J = R->J;
    int pure = 0;
    size_t i, j, dd, l;
    for (i = 0; i < n * L; i++)
        pure |= !(S[i] > 0.0);
    if (pure) {
        for (i = 0; i < n * L; i++)
            minv[i] = 0.0;
        for (i = 1; i < n; i++)
            for (j = 0; j < i; j++) {
                const double *q = R->tri + (i * (i + 1) / 2 + j) * L;
                for_lanes (l) {
                    minv[i * L + l] += q[l];
                    minv[j * L + l] += q[l];
                }
            }
    }
    for (i = 0; i < n; i++)
        for_lanes (l) {
            double Sl = S[i * L + l];
            double Dim = Sl > 0.0 ? num[i * L + l] / Sl
                                  : (double)(n - 1) / minv[i * L + l];
            wk[i * L + l] = -Dim;
        }
    for (dd = 0; dd < nd; dd++) {
        double sj[MCDI_LANES];
        for_lanes (l)
            sj[l] = 0.0;
        for (i = 0; i < n; i++)
            for_lanes (l) {
                /* c last: c D_im underflows where the flux does not
                 * (c = 1e-300, Đ = 1e-30: test_edge_cases) */
                double q = c[l] * (wk[i * L + l] * d[(i * nd + dd) * L + l]);
                J[(i * nd + dd) * L + l] = q;
                sj[l] += q;
            }
        for (i = 0; i < n; i++)
            for_lanes (l)
                J[(i * nd + dd) * L + l] -= x[i * L + l] * sj[l];
    }
}

/* s = sqrt(x); trace fluxes t_i = J_i / c = -d_i / S_i for x_i = 0 (else
 * 0; Blanc's law, exact). Returns whether a lane has a trace species;
 * t is written only then (mcdi_compose_rows reads it only then). */
KINLINE int mcdi_trace_rows(const mcdi_rows *R, const size_t n, const size_t L,
                            const size_t nd)
{
    const double *restrict S = R->S, *restrict x = R->x, *restrict d = R->d;
    double *restrict s = R->s, *restrict t = R->t;
    int ntr = 0;
    size_t i, dd, l;
    if (L == 1) {
        /* one state: vectorised over the species */
        MCDI_SIMD_OR_NTR
        for (i = 0; i < n; i++) {
            s[i] = sqrt(x[i]);
            ntr |= !(x[i] > 0.0);
        }
    } else {
        /* lane rows: one vector per species (a loop over all n L values
         * left n L mod 2 L of them to scalar square roots: the stage cost
         * 3.7 ns of 20 per cell at N = 3) */
        int bad = 0; /* reduced over the lanes once, not per species */
        for (i = 0; i < n; i++)
            for_lanes_bad (l) {
                s[i * L + l] = sqrt(x[i * L + l]);
                bad |= !(x[i * L + l] > 0.0);
            }
        ntr = bad;
    }
    if (!ntr)
        return 0;
    for (i = 0; i < n; i++) {
        int bad = 0; /* species i is trace in some lane */
        for_lanes_bad (l)
            bad |= !(x[i * L + l] > 0.0);
        if (!bad) { /* present in every lane: no division */
            for (dd = 0; dd < nd * L; dd++)
                t[i * nd * L + dd] = 0.0;
            continue;
        }
        for (dd = 0; dd < nd; dd++)
            for_lanes (l) {
                double Sl = S[i * L + l];
                double q = -d[(i * nd + dd) * L + l] / (Sl > 0.0 ? Sl : 1.0);
                t[(i * nd + dd) * L + l] = x[i * L + l] > 0.0 ? 0.0 : q;
            }
    }
    return 1;
}

/* The trace fluxes' coupling moved to the right-hand side of the other
 * species: d_k -= x_k sum_t t_t / Đ_kt, c-free ((J_t / c) / Đ: c Đ
 * underflowed to 0 for c = 1e-300, Đ = 1e-30: test_edge_cases). Run only
 * when mcdi_trace_rows found a trace species. Only the columns of species
 * that are trace in some lane are visited (t is +0 in the lanes where the
 * species is present, so its term there changes nothing): O(n nd) per
 * trace species instead of O(n^2 nd). Each d_k takes its terms in the
 * order of t. */
KINLINE void mcdi_trace_couple_rows(const mcdi_rows *R, const size_t n,
                                    const size_t L, const size_t nd)
{
    const double *restrict x = R->x, *restrict t = R->t;
    double *restrict d = R->d;
    size_t k, j, dd, l;
    for (j = 0; j < n; j++) {
        int bad = 0; /* species j is trace in some lane */
        for_lanes_bad (l)
            bad |= !(x[j * L + l] > 0.0);
        if (!bad)
            continue;
        for (k = 0; k < n; k++) {
            /* 1/Đ_kj from the packed lower triangle */
            const double *q =
                R->tri +
                (k > j ? k * (k + 1) / 2 + j : j * (j + 1) / 2 + k) * L;
            if (k == j)
                continue;
            for (dd = 0; dd < nd; dd++)
                for_lanes (l)
                    d[(k * nd + dd) * L + l] -=
                        x[k * L + l] * t[(j * nd + dd) * L + l] * q[l];
        }
    }
}

/* Right-hand side b_i = d_i wk_i into r from wk = -1 / s_i (0 for trace
 * species), already in wk. */
KINLINE void mcdi_rhs_rows_from_wk(const mcdi_rows *R, const size_t n,
                                   const size_t L, const size_t nd)
{
    const double *restrict d = R->d, *restrict wk = R->wk;
    double *restrict r = R->r;
    size_t i, dd, l;
    for (i = 0; i < n; i++)
        for (dd = 0; dd < nd; dd++)
            for_lanes (l)
                r[(i * nd + dd) * L + l] =
                    d[(i * nd + dd) * L + l] * wk[i * L + l];
}

/* Right-hand side b_i = -d_i / s_i (0 for trace species) into r; wk keeps
 * -1 / s_i (the iteration recomputes b from it). */
KINLINE void mcdi_rhs_rows(const mcdi_rows *R, const size_t n, const size_t L,
                           const size_t nd)
{
    const double *restrict s = R->s;
    double *restrict wk = R->wk;
    size_t i, l;
    if (L == 1) {
        MCDI_SIMD
        for (i = 0; i < n; i++)
            wk[i] = s[i] > 0.0 ? -1.0 / s[i] : 0.0;
    } else {
        /* one vector per species (as mcdi_trace_rows) */
        for (i = 0; i < n; i++)
            for_lanes (l)
                wk[i * L + l] = s[i * L + l] > 0.0 ? -1.0 / s[i * L + l] : 0.0;
    }
    mcdi_rhs_rows_from_wk(R, n, L, nd);
}

/* The shift a of the exact model: the largest Blanc sum of the species
 * present (of all species for a pure component, whose own sum is 0), inside
 * the spectrum of Gs on s-perp, so it does not worsen the conditioning. */
KINLINE void mcdi_shift_rows(const mcdi_rows *R, double *restrict amax,
                             const size_t n, const size_t L)
{
    const double *restrict S = R->S, *restrict x = R->x;
    double amax2[MCDI_LANES];
    size_t i, l;
    for_lanes (l)
        amax[l] = amax2[l] = 0.0;
    for (i = 0; i < n; i++)
        for_lanes (l) {
            double Sl = S[i * L + l];
            double Sp = x[i * L + l] > 0.0 ? Sl : 0.0;
            amax[l] = Sp > amax[l] ? Sp : amax[l];
            amax2[l] = Sl > amax2[l] ? Sl : amax2[l];
        }
    for_lanes (l)
        amax[l] = amax[l] > 0.0 ? amax[l] : amax2[l];
}

/* L D L^T of A = Gs + a s s^T one lane row at a time (trace species are
 * decoupled rows: s_i = 0), left-looking on the packed lower triangle,
 * then L D L^T U = b for each direction, in r. Returns 0 on a pivot that
 * is not > 0 (or NaN); Dg then holds every pivot. */
KINLINE int mcdi_ldl_rows(const mcdi_rows *R, const double *amax,
                          const size_t n, const size_t L, const size_t nd)
{
    const double *restrict s = R->s, *restrict S = R->S, *restrict x = R->x;
    double *restrict tri = R->tri, *restrict wk = R->wk, *restrict Dg = R->Dg;
    double *restrict iDg = R->iDg, *restrict r = R->r;
    double acc[MCDI_LANES];
    int sing = 0;
    size_t i, j, k, dd, l;
    /* A = Gs + a s s^T in place of invD */
    for (i = 0; i < n; i++) {
        double *row = tri + (i * (i + 1) / 2) * L;
        for (j = 0; j < i; j++)
            for_lanes (l)
                row[j * L + l] =
                    s[i * L + l] * s[j * L + l] * (amax[l] - row[j * L + l]);
        for_lanes (l)
            row[i * L + l] = S[i * L + l] + amax[l] * x[i * L + l];
    }
    /* LDL^T, left-looking, packed lower */
    for (j = 0; j < n; j++) {
        double *Lj = tri + (j * (j + 1) / 2) * L;
        for (k = 0; k < j; k++)
            for_lanes (l)
                wk[k * L + l] = Lj[k * L + l] * Dg[k * L + l];
        for_lanes (l)
            acc[l] = Lj[j * L + l];
        for (k = 0; k < j; k++)
            for_lanes (l)
                acc[l] -= Lj[k * L + l] * wk[k * L + l];
        for_lanes (l) {
            Dg[j * L + l] = acc[l];
            sing |= !(acc[l] > 0.0);
            iDg[j * L + l] = 1.0 / acc[l];
        }
        for (i = j + 1; i < n; i++) {
            double *Li = tri + (i * (i + 1) / 2) * L;
            for_lanes (l)
                acc[l] = Li[j * L + l];
            for (k = 0; k < j; k++)
                for_lanes (l)
                    acc[l] -= Li[k * L + l] * wk[k * L + l];
            for_lanes (l)
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
                for_lanes (l)
                    ri[l] -= Li[k * L + l] * r[(k * nd + dd) * L + l];
        }
        for (i = 0; i < n; i++)
            for_lanes (l)
                r[(i * nd + dd) * L + l] *= iDg[i * L + l];
        for (i = n; i-- > 0;) {
            const double *Li = tri + (i * (i + 1) / 2) * L;
            double *ri = r + (i * nd + dd) * L;
            for (k = 0; k < i; k++)
                for_lanes (l)
                    r[(k * nd + dd) * L + l] -= Li[k * L + l] * ri[l];
        }
    }
    return 1;
}

/* Molar fluxes from the solution U: J_i = c (s_i U_i + t_i - x_i sum_t t_t),
 * where ntr (mcdi_trace_rows) says that some lane has a trace species;
 * else J_i = c (s_i U_i + 0), the same value (+ 0 as the full form turns
 * a product -0 into +0). */
KINLINE void mcdi_compose_rows(const mcdi_rows *R, const int ntr,
                               const size_t n, const size_t L, const size_t nd)
{
    const double *restrict s = R->s, *restrict x = R->x, *restrict r = R->r;
    const double *restrict t = R->t, *restrict c = R->c;
    double *restrict J = R->J, st[MCDI_LANES];
    size_t i, dd, l;
    if (!ntr) {
        for (i = 0; i < n; i++)
            for (dd = 0; dd < nd; dd++)
                for_lanes (l) {
                    size_t e = (i * nd + dd) * L + l;
                    J[e] = c[l] * (s[i * L + l] * r[e] + 0.0);
                }
        return;
    }
    for (dd = 0; dd < nd; dd++) {
        for_lanes (l)
            st[l] = 0.0;
        for (i = 0; i < n; i++)
            for_lanes (l)
                st[l] += t[(i * nd + dd) * L + l];
        for (i = 0; i < n; i++)
            for_lanes (l) {
                size_t e = (i * nd + dd) * L + l;
                J[e] =
                    c[l] * (s[i * L + l] * r[e] + t[e] - x[i * L + l] * st[l]);
            }
    }
}

#endif
