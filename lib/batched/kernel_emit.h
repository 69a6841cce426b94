/* kernel_emit.h - the fused emit of full mole-basis blocks, with
 * streaming stores of whole output lines on AVX-512.
 * Included only by batch_kernel.c, which is compiled once per instruction
 * set: everything here is inlined into the block body. Never installed. */
#ifndef MCD_KERNEL_EMIT_H
#define MCD_KERNEL_EMIT_H

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

static void stream_flush(const mcdi_bjob *jb, size_t rows, double *nts)
{
    mcdi_stream_state *st = (mcdi_stream_state *)(void *)nts;
    const __m512d *carry = (const __m512d *)(void *)(nts + 8);
    double *ob;
    size_t e;
    if (!st->pending)
        return;
    /* row 0 of the held block (a tiled out is 64-byte aligned, batch.c:
     * o = 0 on every row, nothing is held) */
    ob = jb->out + mcdi_cell_at(jb, st->next_k0 - 8, rows);
    for (e = 0; e < rows; e++) {
        double *p = ob + e * jb->rs;
        const unsigned o = (unsigned)(((uintptr_t)p >> 3) & 7u);
        if (o != 0) /* lanes 8 - o .. 7 are still held back */
            _mm512_mask_storeu_pd(p, (__mmask8)((0xFFu << (8u - o)) & 0xFFu),
                                  carry[e]);
    }
    st->pending = 0;
}

KINLINE void stream_rows(const mcdi_bjob *jb, size_t rows,
                         const mcdi_vd *restrict J, size_t k0, double *nts)
{
    mcdi_stream_state *st = (mcdi_stream_state *)(void *)nts;
    __m512d *carry = (__m512d *)(void *)(nts + 8);
    const int cont = st->pending && st->next_k0 == k0;
    double *const ob = jb->out + mcdi_cell_at(jb, k0, rows);
    const size_t rs = jb->rs;
    size_t e;
    if (st->pending && !cont)
        stream_flush(jb, rows, nts);
    for (e = 0; e < rows; e++) {
        double *p = ob + e * rs;
        const unsigned o = (unsigned)(((uintptr_t)p >> 3) & 7u);
        const __m512d cur = (__m512d)J[e];
        if (o == 0) {
            _mm512_stream_pd(p, cur);
            continue;
        }
        if (cont)
            _mm512_stream_pd(
                p - o, _mm512_permutex2var_pd(carry[e], stream_index(o), cur));
        else
            _mm512_mask_storeu_pd(p, (__mmask8)(0xFFu >> o), cur);
        carry[e] = cur;
    }
    st->pending = 1;
    st->next_k0 = k0 + 8;
}
#endif

/* Molar fluxes of a block from the solution U of the scaled system (s = sqrt
 * x, t the trace fluxes, ntr their count) or of the grounded one (s = x,
 * ntr = 0): J_i = c (s_i U_i + t_i - x_i sum_t t_t), then the zero-sum
 * clean-up J_i -= x_i sum_k J_k, into J. The one place these operations
 * are written, so that a cell gets the same bits through the fused emit
 * below (full blocks) and through stage_ground_fluxes (kernel_ldl.h: the
 * last, partial block and mass fluxes). Returns 0 if some flux is not
 * finite. */
KINLINE int compose_clean_v(const size_t n, const size_t nd,
                            const mcdi_vd *restrict s,
                            const mcdi_vd *restrict x,
                            const mcdi_vd *restrict U,
                            const mcdi_vd *restrict t, const int ntr,
                            const mcdi_vd c, mcdi_vd *restrict J)
{
    const mcdi_vd zero = {0.0};
    mcdi_vd nan_acc = zero; /* q * 0 is NaN exactly when q is inf or NaN */
    size_t i, dd, e;
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
    /* one test per block: a per-element compare-and-mask cost 13 % of the
     * whole N = 10 block (profiled) */
    return !any_lane_v(nan_acc != nan_acc);
}

/* The fluxes of a full mole-basis block (compose_clean_v), written to
 * out[e * K + l] (e = i * nd + dd) in the same pass (with jb->stream, by
 * stream_rows), in the job's layout (row e of the block at out +
 * mcdi_cell_at + e rs). J: scratch for the fluxes. Returns 0 (nothing
 * written, J holds all fluxes) if some flux is not finite. */
KINLINE int emit_mole_v(const size_t n, const size_t nd,
                        const mcdi_vd *restrict s, const mcdi_vd *restrict x,
                        const mcdi_vd *restrict U, const mcdi_vd *restrict t,
                        const int ntr, const mcdi_vd c, mcdi_vd *restrict J,
                        const mcdi_bjob *jb, const size_t k0, double *nts)
{
    double *restrict out = jb->out + mcdi_cell_at(jb, k0, n * nd);
    const size_t K = jb->rs; /* row stride (batch.h) */
    size_t e;
    if (!compose_clean_v(n, nd, s, x, U, t, ntr, c, J))
        return 0;
#if MCDI_CAN_STREAM
    if (jb->stream) {
        stream_rows(jb, n * nd, J, k0, nts);
        return 1;
    }
#else
    (void)nts;
#endif
    for (e = 0; e < n * nd; e++)
        memcpy(out + e * K, &J[e], sizeof J[e]);
    return 1;
}

#endif
