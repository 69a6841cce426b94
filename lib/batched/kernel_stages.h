/* kernel_stages.h - the stages of a block that every model shares:
 * loading and checking, fractions, driving forces, inverse diffusivities,
 * Blanc sums, the mixture-averaged fluxes, trace species, right-hand
 * side, composition, zero-sum, mass basis and store.
 * Included only by batch_kernel.c, which is compiled once per instruction
 * set: everything here is inlined into the block body. Never installed. */
#ifndef MCD_KERNEL_STAGES_H
#define MCD_KERNEL_STAGES_H

#include "flux/solve_stages.h"

/* The rows of a block as the shared stages (flux/solve_stages.h) take
 * them. */
KINLINE mcdi_rows rows_of(const mcdi_kblock *b)
{
    const mcdi_rows R = {b->tri, b->x,  b->s, b->S, b->num, b->minv, b->Dg,
                         b->iDg, b->wk, b->d, b->t, b->r,   b->J,    b->c};
    return R;
}

/* The loading stages flag a lane whose input breaks a rule by OR-ing 1
 * into bl[l] (a lane vector of flags: no reduction per row); the body
 * tests the flags once, after the last loading stage (lanes_any). */
KINLINE int lanes_any(const long long *restrict bl, const size_t L)
{
    long long any = 0;
    size_t l;
    if (L == MCDI_VLANES) {
        mcdi_vl v;
        memcpy(&v, bl, sizeof v);
        return any_lane_v(v);
    }
    for (l = 0; l < L; l++)
        any |= bl[l];
    return any != 0;
}

/* Per-cell scalars: c, or T and P (and c = P / (R T)) of a mixture call. */
KINLINE void stage_load_scalars(const mcdi_bjob *jb, const mcdi_kblock *b,
                                long long *restrict bl, size_t k0, size_t nv,
                                const size_t L)
{
    double *restrict c = b->c;
    size_t l;
    if (jb->mix != NULL) {
        double *restrict Tl = b->T, *restrict Pl = b->P;
        const mcdi_pf pf = pf_of(jb, 1, 0);
        load_row(Tl, jb->T + k0, nv, L, pf);
        load_row(Pl, jb->P + k0, nv, L, pf);
        for_lanes (l) {
            bl[l] |= !((Tl[l] > 0.0) & (Tl[l] <= DBL_MAX));
            bl[l] |= !((Pl[l] > 0.0) & (Pl[l] <= DBL_MAX));
            c[l] = Pl[l] / (RGAS * Tl[l]);
            bl[l] |= !(c[l] >= DBL_MIN); /* a normal c, as single-state */
        }
    } else if (L == MCDI_VLANES && nv == L) {
        const mcdi_vd v = load_vrow(c, jb->c + k0, pf_of(jb, 1, 0));
        flag_lanes(bl, ~((v >= DBL_MIN) & (v <= DBL_MAX)));
    } else {
        load_row(c, jb->c + k0, nv, L, pf_of(jb, 1, 0));
        for_lanes (l)
            bl[l] |= !((c[l] >= DBL_MIN) &
                       (c[l] <= DBL_MAX)); /* normal c, as single-state */
    }
}

/* The composition rows (into x or w) and their sums. */
KINLINE void stage_load_comp(const mcdi_bjob *jb, const mcdi_kblock *b,
                             long long *restrict bl, size_t k0, size_t nv,
                             const size_t n, const size_t L)
{
    const size_t K = jb->rs; /* row stride (batch.h) */
    const double *const comp = jb->comp + mcdi_cell_at(jb, k0, n);
    double *restrict sum = b->sum;
    double *restrict y = jb->comp_basis == MCD_BASIS_MASS ? b->w : b->x;
    const mcdi_pf pf = pf_of(jb, n, n);
    size_t i, l;
    if (L == MCDI_VLANES && nv == L) {
        /* the same rules on registers (kernel_lanes.h) */
        mcdi_vd sm = {0.0};
        mcdi_vl bad = {0};
        for (i = 0; i < n; i++) {
            const mcdi_vd q = load_vrow(y + i * L, comp + i * K, pf);
            bad |= ~((q >= 0.0) & (q <= DBL_MAX));
            sm += q;
        }
        *(mcdi_vd *)(void *)sum = sm;
        /* |sum - 1| <= tol, written so that NaN fails */
        bad |= ~((sm - 1.0 <= MCD_SUM_TOL) & (sm - 1.0 >= -MCD_SUM_TOL));
        flag_lanes(bl, bad);
        return;
    }
    for_lanes (l)
        sum[l] = 0.0;
    for (i = 0; i < n; i++) {
        load_row(y + i * L, comp + i * K, nv, L, pf);
        for_lanes (l) {
            double q = y[i * L + l];
            bl[l] |= !((q >= 0.0) & (q <= DBL_MAX));
            sum[l] += q;
        }
    }
    for_lanes (l)
        bl[l] |= !(fabs(sum[l] - 1.0) <= MCD_SUM_TOL);
}

/* Fractions scaled to sum 1, and the other basis (w needs M). */
KINLINE void stage_fractions(const mcdi_bjob *jb, const mcdi_kblock *b,
                             const size_t n, const size_t L)
{
    const int mass_in = jb->comp_basis == MCD_BASIS_MASS;
    const double *M = jb->M;
    /* not restrict: y is x or w, which the conversion reads */
    double *x = b->x, *w = b->w, *y = mass_in ? w : x;
    const double *restrict sum = b->sum;
    size_t i, l;
    for (i = 0; i < n; i++)
        for_lanes (l)
            y[i * L + l] = y[i * L + l] / sum[l];
    if (mass_in)
        mcdi_w_to_x_lanes(n, L, M, w, x); /* base/composition.h */
    else if (M != NULL)
        mcdi_x_to_w_lanes(n, L, M, x, w);
}

/* The gradients (into d), grad ln P (into v) and the thermal diffusion
 * ratios and grad ln T (into kT, gT). */
KINLINE void stage_load_forces(const mcdi_bjob *jb, const mcdi_kblock *b,
                               long long *restrict bl, size_t k0, size_t nv,
                               const size_t n, const size_t L, const size_t nd)
{
    const size_t K = jb->rs; /* row stride (batch.h) */
    const double *const grad = jb->grad + mcdi_cell_at(jb, k0, n * nd);
    const double *const glnP =
        jb->glnP != NULL ? jb->glnP + mcdi_cell_at(jb, k0, nd) : NULL;
    const double *const kT =
        jb->kT != NULL ? jb->kT + mcdi_cell_at(jb, k0, n) : NULL;
    const double *const glnT =
        jb->kT != NULL ? jb->glnT + mcdi_cell_at(jb, k0, nd) : NULL;
    double *restrict d = b->d, *restrict v = b->v;
    const mcdi_pf pg = pf_of(jb, n * nd, n), pd = pf_of(jb, nd, n),
                  pn = pf_of(jb, n, n);
    size_t i, dd, l;
    if (L == MCDI_VLANES && nv == L) {
        /* the same rule on registers: the sum of v * 0 over the rows is
         * NaN exactly where some v is infinite or NaN (one multiply-add
         * a row; kernel_lanes.h) */
        const mcdi_vd zero = {0.0};
        mcdi_vd nz = zero;
        for (i = 0; i < n * nd; i++)
            nz += load_vrow(d + i * L, grad + i * K, pg) * zero;
        for (dd = 0; glnP != NULL && dd < nd; dd++)
            nz += load_vrow(v + dd * L, glnP + dd * K, pd) * zero;
        for (i = 0; kT != NULL && i < n; i++)
            nz += load_vrow(b->kT + i * L, kT + i * K, pn) * zero;
        for (dd = 0; kT != NULL && dd < nd; dd++)
            nz += load_vrow(b->gT + dd * L, glnT + dd * K, pd) * zero;
        flag_lanes(bl, nz != nz);
        return;
    }
    for (i = 0; i < n * nd; i++) {
        load_row(d + i * L, grad + i * K, nv, L, pg);
        for_lanes (l)
            bl[l] |= !(fabs(d[i * L + l]) <= DBL_MAX);
    }
    if (jb->glnP != NULL) {
        for (dd = 0; dd < nd; dd++) {
            load_row(v + dd * L, glnP + dd * K, nv, L, pd);
            for_lanes (l)
                bl[l] |= !(fabs(v[dd * L + l]) <= DBL_MAX);
        }
    }
    if (jb->kT != NULL) {
        for (i = 0; i < n; i++) {
            load_row(b->kT + i * L, kT + i * K, nv, L, pn);
            for_lanes (l)
                bl[l] |= !(fabs(b->kT[i * L + l]) <= DBL_MAX);
        }
        for (dd = 0; dd < nd; dd++) {
            load_row(b->gT + dd * L, glnT + dd * K, nv, L, pd);
            for_lanes (l)
                bl[l] |= !(fabs(b->gT[dd * L + l]) <= DBL_MAX);
        }
    }
}

/* Driving forces (flux/stages.h, shared with the single-state call): the
 * gradients of mass fractions turned into those of mole fractions first;
 * grad ln P was loaded into v. */
KINLINE void stage_forces(const mcdi_bjob *jb, const mcdi_kblock *b,
                          const size_t n, const size_t L, const size_t nd)
{
    if (jb->comp_basis == MCD_BASIS_MASS)
        mcdi_grad_w_to_x_lanes(n, L, nd, jb->M, b->w, b->d, b->d);
    mcdi_driving_forces(n, L, nd, b->x, b->w, b->d, NULL,
                        jb->glnP != NULL ? b->v : NULL,
                        jb->kT != NULL ? b->kT : NULL, b->gT, b->d);
}

/* Inverse binary diffusivities (packed lower, i > j) from the caller's
 * per-cell Dij: both triangles checked (normal, finite, symmetric), or
 * with jb->dij_upper the upper one only (normal, finite; the lower one
 * is not loaded: MCD_DIJ_READ_UPPER). */
KINLINE void stage_invdiff_dij(const mcdi_bjob *jb, const mcdi_kblock *b,
                               long long *restrict bl, size_t k0, size_t nv,
                               const size_t n, const size_t L)
{
    const size_t K = jb->rs; /* row stride (batch.h) */
    const double *const Dij = jb->Dij + mcdi_cell_at(jb, k0, n * n);
    const mcdi_pf pf = pf_of(jb, n * n, n);
    double *restrict wk = b->wk;
    size_t i, j, l;
    if (L == MCDI_VLANES && nv == L) {
        /* the same rules on registers, accumulated over the rows (a few
         * instructions a row, kernel_lanes.h): nz = sum of v * 0 is NaN
         * exactly where some v is infinite or NaN, lo the smallest value
         * (>= DBL_MIN; a lane with a NaN is flagged by nz whatever lo
         * holds there), bad where |a - b| > MCDI_DIJ_SYM_TOL max(a, b) */
        mcdi_vd *tri = (mcdi_vd *)(void *)b->tri;
        mcdi_vl bad = {0};
        const mcdi_vd zero = {0.0}, dmin = zero + DBL_MIN;
        const mcdi_vl sign = (mcdi_vl)(zero * -1.0); /* -0.0: the sign bit */
        mcdi_vd nz = zero, lo = zero + DBL_MAX;
        if (jb->dij_upper) {
            for (i = 1; i < n; i++)
                for (j = 0; j < i; j++) {
                    const mcdi_vd a = load_v(Dij + (j * n + i) * K, pf);
                    nz += a * zero;
                    lo = min_v(a, lo);
                    tri[i * (i + 1) / 2 + j] = 1.0 / a;
                }
            flag_lanes(bl, (nz != nz) | (lo < dmin));
            return;
        }
        for (i = 1; i < n; i++)
            for (j = 0; j < i; j++) {
                const mcdi_vd a = load_v(Dij + (j * n + i) * K, pf);
                const mcdi_vd bb = load_v(Dij + (i * n + j) * K, pf);
                const mcdi_vd mx = max_v(a, bb);
                const mcdi_vd df = a - bb;
                const mcdi_vd adf = (mcdi_vd)((mcdi_vl)df & ~sign);
                nz += df * zero; /* a - b: finite for finite a, b > 0 */
                lo = min_v(min_v(a, bb), lo);
                bad |= adf > MCDI_DIJ_SYM_TOL * mx;
                tri[i * (i + 1) / 2 + j] = 1.0 / a;
            }
        bad |= (nz != nz) | (lo < dmin);
        flag_lanes(bl, bad);
        return;
    }
    for (i = 1; i < n; i++)
        for (j = 0; j < i; j++) {
            double *q = b->tri + (i * (i + 1) / 2 + j) * L;
            const double *up = Dij + (j * n + i) * K;
            const double *lo = Dij + (i * n + j) * K;
            load_row(q, up, nv, L, pf);
            if (jb->dij_upper) {
                for_lanes (l) {
                    const double a = q[l];
                    bl[l] |= !((a >= DBL_MIN) & (a <= DBL_MAX));
                    q[l] = 1.0 / a;
                }
                continue;
            }
            load_row(wk, lo, nv, L, pf);
            for_lanes (l) {
                double a = q[l], bb = wk[l], m = a > bb ? a : bb;
                bl[l] |= !((a >= DBL_MIN) & (a <= DBL_MAX));
                bl[l] |= !((bb >= DBL_MIN) & (bb <= DBL_MAX));
                bl[l] |= !(fabs(a - bb) <= MCDI_DIJ_SYM_TOL * m);
                q[l] = 1.0 / a;
            }
        }
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
    for_lanes (l) {
        double sq = sqrt(Tl[l]), qq = sqrt(sq);
        f175[l] = Pl[l] / (Tl[l] * sq * qq); /* P / T^1.75 */
        f15[l] = Pl[l] / (Tl[l] * sq);       /* P / T^1.5 */
    }
    if (any_lj && mx->fit_on) {
        for_lanes (l) {
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
            for_lanes (l)
                cheb[k * L + l] = 2.0 * cheb[L + l] * cheb[(k - 1) * L + l] -
                                  cheb[(k - 2) * L + l];
    } else {
        all_fit = 0;
        for_lanes (l)
            infit[l] = 0.0;
    }
    return all_fit;
}

/* Inverse binary diffusivity of pair ij of a mixture at the lanes' T and
 * P into q: power law, the fit, or the exact collision integral (Brokaw's
 * with its polar term). */
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
        for_lanes (l)
            q[l] = f175[l] * ic;
        return;
    }
    {
        unsigned deg =
            (mx->fit_on && mx->fit_deg != NULL) ? mx->fit_deg[ij] : 0u;
        if (deg > 0) {
            const double *fq = mx->fit_q + ij * (MCDI_FIT_MAXDEG + 1);
            const double *restrict f15 = b->f15;
            for_lanes (l)
                q[l] = fq[0];
            for (k = 1; k <= deg; k++)
                for_lanes (l)
                    q[l] += fq[k] * cheb[k * L + l];
            for_lanes (l)
                q[l] *= f15[l];
        }
        if ((deg == 0 || !all_fit) && m == MCD_METHOD_BROKAW) {
            double e = mx->eps[ij], cf = mx->coef[ij], dl = mx->delta[ij];
            for_lanes (l)
                if (deg == 0 || !(infit[l] > 0.0))
                    q[l] = (Pl[l] * omega_brokaw(Tl[l] / e, dl)) /
                           (cf * Tl[l] * sqrt(Tl[l]));
        } else if (deg == 0 || !all_fit) {
            double e = mx->eps[ij], cf = mx->coef[ij];
            for_lanes (l)
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
    size_t i, j;
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
        const mcdi_rows R = rows_of(b);
        mcdi_blanc_rows(&R, jb->model != MCD_MODEL_MAXWELL_STEFAN, n, L);
    }
}

/* Mixture-averaged fluxes (flux/solve_stages.h); the zero-sum clean-up
 * of body() runs after them. */
KINLINE void stage_mixavg(const mcdi_kblock *b, const size_t n, const size_t L,
                          const size_t nd)
{
    const mcdi_rows R = rows_of(b);
    mcdi_mixavg_rows(&R, n, L, nd);
}

/* s = sqrt(x); trace fluxes t_i = J_i / c = -d_i / S_i for x_i = 0 (else
 * 0), and their coupling to the other species moved to the right-hand
 * side (flux/solve_stages.h); with the shared power-law coefficients (pl)
 * the inverse diffusivities the coupling reads are filled first. Returns
 * whether a lane has a trace species (t is written only then). */
KINLINE int stage_trace(const mcdi_bjob *jb, const mcdi_kblock *b, int pl,
                        const size_t n, const size_t L, const size_t nd,
                        int *wk_ready)
{
    const mcdi_rows R = rows_of(b);
    size_t i, j, l;
    /* exact model, every species present in every lane: s and wk = -1 / s
     * without the divider (kernel_lanes.h), and no trace species. Not for
     * the iterative model, whose error estimate (the change between
     * iterates) would not see the few ulp these differ by */
    *wk_ready = L == MCDI_VLANES && jb->model == MCD_MODEL_MAXWELL_STEFAN &&
                rsqrt_rows(b->x, b->s, b->wk, n);
    if (*wk_ready || !mcdi_trace_rows(&R, n, L, nd))
        return 0;
    if (pl)
        for (i = 1; i < n; i++)
            for (j = 0; j < i; j++) {
                double *q = b->tri + (i * (i + 1) / 2 + j) * L;
                const double ic = jb->mix->icoef[i * n + j];
                const double *restrict f175 = b->f175;
                for_lanes (l)
                    q[l] = f175[l] * ic;
            }
    mcdi_trace_couple_rows(&R, n, L, nd);
    return 1;
}

/* Right-hand side b_i = -d_i / s_i (0 for trace species) into r; wk keeps
 * -1 / s_i (flux/solve_stages.h); wk_ready: stage_trace left it in wk. */
KINLINE void stage_rhs(const mcdi_kblock *b, const size_t n, const size_t L,
                       const size_t nd, const int wk_ready)
{
    const mcdi_rows R = rows_of(b);
    if (wk_ready)
        mcdi_rhs_rows_from_wk(&R, n, L, nd);
    else
        mcdi_rhs_rows(&R, n, L, nd);
}

/* Molar fluxes from the solution U (flux/solve_stages.h); ntr: the
 * return of stage_trace. */
KINLINE void stage_compose(const mcdi_kblock *b, const int ntr, const size_t n,
                           const size_t L, const size_t nd)
{
    const mcdi_rows R = rows_of(b);
    mcdi_compose_rows(&R, ntr, n, L, nd);
}

/* Mass fluxes j_i = M_i J_i - w_i sum_k M_k J_k, the residual removed with
 * w; fails (EDOM in res) where the terms cancelled, as
 * mcdi_mass_zero_sum_kept (non-finite lanes are left to stage_store).
 * Returns 0 on failure. */
KINLINE int stage_mass(const mcdi_bjob *jb, const mcdi_kblock *b, size_t nv,
                       mcdi_bres *res, const size_t n, const size_t L,
                       const size_t nd)
{
    const double *J = b->J; /* written by mcdi_mass_fluxes: not restrict */
    double sm[MCDI_LANES] = {0.0}, rs[MCDI_LANES] = {0.0};
    size_t i, dd, l;
    mcdi_mass_fluxes(n, L, nd, jb->M, b->w, b->J); /* flux/stages.h */
    for (dd = 0; dd < nd; dd++) {
        for_lanes (l)
            sm[l] = rs[l] = 0.0;
        for (i = 0; i < n; i++)
            for_lanes (l) {
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
KINLINE void stage_store(const mcdi_bjob *jb, const mcdi_kblock *b, size_t k0,
                         size_t nv, mcdi_bres *res, const size_t n,
                         const size_t L, const size_t nd)
{
    const double *restrict J = b->J;
    const size_t K = jb->rs; /* row stride (batch.h) */
    double *const out = jb->out + mcdi_cell_at(jb, k0, n * nd);
    int bad = 0;
    size_t i, l;
#if defined(_OPENMP) || defined(MCDI_OMP_SIMD)
#pragma omp simd reduction(| : bad)
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
        double *restrict o = out + i * K;
        const double *restrict Ji = J + i * L;
        if (nv == L) {
            for_lanes (l) /* full block: vector stores */
                o[l] = Ji[l];
        } else {
            for (l = 0; l < nv; l++)
                o[l] = Ji[l];
        }
    }
}

#endif
