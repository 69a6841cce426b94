/* kernel_iter.h - the iterative model (Ern-Giovangigli): the
 * products, the projection, the error estimate and the iteration.
 * Included only by batch_kernel.c, which is compiled once per instruction
 * set: everything here is inlined into the block body. Never installed. */
#ifndef MCD_KERNEL_ITER_H
#define MCD_KERNEL_ITER_H

/* Relative change of the fluxes below which successive iterates differ by
 * round-off only: they stop contracting (rho ~ 1, a cycle between two
 * round-off neighbours), and the estimate is del / (1 - 0.999) instead of
 * HUGE_VAL (a binary, whose first iterate is exact, ran to max_iter and
 * reported an infinite estimate). */
#define MCDI_ITER_FLOOR (64.0 * DBL_EPSILON)

/* The Ern-Giovangigli step around the product P_e = sum_j invD_ij SU_j:
 * iter_su forms SU = s U; iter_finish turns P (held in V) into the next
 * iterate V_e = x_i U_e + minv_i (s_i f P_e + d_e wk_i), with f = 1 when
 * P already holds the inverse diffusivities' scale. */
KINLINE void iter_su(const size_t n, const size_t nd, const mcdi_vd *restrict s,
                     const mcdi_vd *restrict U, mcdi_vd *restrict SU)
{
    size_t i, dd;
    for (i = 0; i < n; i++)
        for (dd = 0; dd < nd; dd++)
            SU[i * nd + dd] = s[i] * U[i * nd + dd];
}

KINLINE void iter_finish(const size_t n, const size_t nd, const mcdi_vd f,
                         const mcdi_vd *restrict s, const mcdi_vd *restrict x,
                         const mcdi_vd *restrict minv,
                         const mcdi_vd *restrict wk, const mcdi_vd *restrict d,
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
KINLINE void
iter_product_v(const size_t n, const size_t nd, const mcdi_vd *restrict Q,
               const mcdi_vd *restrict s, const mcdi_vd *restrict x,
               const mcdi_vd *restrict minv, const mcdi_vd *restrict wk,
               const mcdi_vd *restrict d, const mcdi_vd *restrict U,
               mcdi_vd *restrict SU, mcdi_vd *restrict V)
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
KINLINE void
iter_product_c(const size_t n, const size_t nd, const double *restrict C,
               const mcdi_vd f, const mcdi_vd *restrict s,
               const mcdi_vd *restrict x, const mcdi_vd *restrict minv,
               const mcdi_vd *restrict wk, const mcdi_vd *restrict d,
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
                for_lanes (l) {
                    J[(i * nd + dd) * L + l] +=
                        q[l] * s[j * L + l] * r[(j * nd + dd) * L + l];
                    J[(j * nd + dd) * L + l] +=
                        q[l] * s[i * L + l] * r[(i * nd + dd) * L + l];
                }
        }
    for (i = 0; i < n; i++)
        for (dd = 0; dd < nd; dd++)
            for_lanes (l) {
                size_t e = (i * nd + dd) * L + l;
                v[e] = x[i * L + l] * r[e] +
                       minv[i * L + l] *
                           (s[i * L + l] * J[e] + d[e] * wk[i * L + l]);
            }
}

/* Error estimate of one iteration per lane (see the top comment); lanes
 * that have stopped keep theirs. */
KINLINE void iter_estimate(const mcdi_kblock *b, size_t it, const size_t n,
                           const size_t L, const size_t nd)
{
    const double *restrict s = b->s, *restrict v = b->v, *restrict r = b->r;
    const double *restrict active = b->active;
    double nrm[MCDI_LANES], dmax[MCDI_LANES];
    double *restrict dprev = b->dprev, *restrict dprev2 = b->dprev2;
    double *restrict est = b->est, *restrict iters = b->iters;
    size_t i, dd, l;
    for_lanes (l)
        nrm[l] = 0.0;
    for_lanes (l)
        dmax[l] = 0.0;
    for (i = 0; i < n; i++)
        for (dd = 0; dd < nd; dd++)
            for_lanes (l) {
                size_t e = (i * nd + dd) * L + l;
                double a = fabs(s[i * L + l] * v[e]);
                double q = fabs(s[i * L + l] * (v[e] - r[e]));
                nrm[l] = a > nrm[l] ? a : nrm[l];
                dmax[l] = q > dmax[l] ? q : dmax[l];
            }
    for_lanes (l) {
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
        for_lanes (l) {
            double Sl = S[i * L + l];
            minv[i * L + l] = Sl > 0.0 ? num[i * L + l] / Sl : 0.0;
        }
    /* U^0 = Ps Minv b */
    for (i = 0; i < n * nd; i++)
        for_lanes (l)
            r[i * L + l] *= minv[(i / nd) * L + l];
    remove_along(r, b->s, b->s, n, L, nd); /* U^0 onto s^T U = 0 */
    for_lanes (l) {
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
        remove_along(v, b->s, b->s, n, L, nd);
        iter_estimate(b, it, n, L, nd);
        for (i = 0; i < n * nd; i++)
            for_lanes (l)
                if (active[l] > 0.0)
                    r[i * L + l] = v[i * L + l];
        for_lanes (l) {
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

#endif
