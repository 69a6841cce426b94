/* (invariants only: no outside check values)
 * fuzz_flux.c - libFuzzer harness for the flux entry points fed arbitrary
 * doubles and sizes: mcd_flux_compute, mcd_fick_matrix, mcd_fick_fluxes,
 * mcd_fick_eigenvalues, the frame functions (mcd_flux_convert,
 * mcd_flux_to_volume_frame, mcd_flux_to_species_frame, mcd_flux_total,
 * mcd_flux_velocity_difference, mcd_flux_project, mcd_flux_diagnose) and the
 * batched mcd_flux_batch_dij.
 *
 * Input layout: a 4-byte header (species count, n_dim, flags, extra), then
 * doubles read by fuzz_double (raw bit patterns - NaN, inf, subnormal,
 * negative, huge - or reasonable magnitudes). The species count is 1..8
 * (workspace capacity 8) or one of 0, 9, MCD_MAX_SPECIES + 1, SIZE_MAX:
 * arrays are sized for 8 species, so a call that does not reject a larger
 * count reads out of bounds and AddressSanitizer stops it.
 *
 * Invariants for every single-state call:
 *   status MCD_OK  => every output finite; fluxes sum to zero over species
 *                     (|sum| <= 1e-9 sum |F|, round-off with a wide margin);
 *   status != OK   => every output untouched (guard bytes), a workspace
 *                     message exists for workspace calls.
 * Batched call (both Dij reads, mcd_workspace_set_dij_read): MCD_OK =>
 * finite and zero-sum per cell.
 */
#include "fuzz_common.h"
#include "mcdiff.h"

int LLVMFuzzerTestOneInput(const uint8_t *data, size_t size);

#define NS 8
#define KMAX 3

static mcd_workspace *ws;

/* Fluxes finite and summing to zero relative to their scale: that of the
 * output, or of `scale_from` (the input of a projection, whose output may
 * be round-off only). */
static double g_abs_scale; /* extra absolute scale of the flux sums */

static void require_zero_sum_ref(const char *what, size_t n, size_t nd,
                                 const double *F, size_t stride,
                                 const double *scale_from)
{
    for (size_t d = 0; d < nd; d++) {
        double s = 0, a = 0;
        for (size_t i = 0; i < n; i++) {
            double v = F[(i * nd + d) * stride];
            FUZZ_REQUIRE(isfinite(v), "%s: flux (%zu,%zu) = %g", what, i, d, v);
            s += v;
            a += fabs(scale_from ? scale_from[i * nd + d] : v);
        }
        /* 1e-300: subnormal sums keep only a few significant bits */
        FUZZ_REQUIRE(fabs(s) <= 1e-9 * (a + g_abs_scale) + 1e-300 ||
                         !isfinite(a),
                     "%s: sum %g over |F| %g", what, s, a);
    }
}

static void require_zero_sum(const char *what, size_t n, size_t nd,
                             const double *F, size_t stride)
{
    require_zero_sum_ref(what, n, nd, F, stride, NULL);
}

static void require_finite(const char *what, const double *v, size_t n)
{
    for (size_t i = 0; i < n; i++)
        FUZZ_REQUIRE(isfinite(v[i]), "%s: entry %zu = %g", what, i, v[i]);
}

int LLVMFuzzerTestOneInput(const uint8_t *data, size_t size)
{
    fuzz_in in = {data, size, 0};
    static const size_t odd_n[4] = {0, 9, MCD_MAX_SPECIES + 1, (size_t)-1};
    double M[NS], D[NS * NS], x[NS], grad[NS * 3], Gamma[NS * NS], glnP[3];
    double vals[NS], Vbar[NS], J[NS * 3];
    double out[NS * 3], F[NS * NS], re[NS], im[NS], out2[NS * 3], bulk[3];
    double cvec[KMAX], Dk[NS * NS * KMAX], xk[NS * KMAX], gk[NS * 3 * KMAX];
    double outk[NS * 3 * KMAX];
    unsigned flags[NS];
    size_t n, nd, nn, dep = 0, K;
    uint8_t b0, fl, ex;
    mcd_model model;
    mcd_basis cb, fb;
    double c, sum;
    mcd_status st, st_flux;

    if (ws == NULL && mcd_workspace_new(NS, &ws) != MCD_OK)
        abort();
    b0 = fuzz_u8(&in);
    n = b0 >= 0xF0 ? odd_n[b0 & 3] : (size_t)(1 + b0 % NS);
    nd = fuzz_u8(&in) % 5;
    fl = fuzz_u8(&in);
    ex = fuzz_u8(&in);
    model = (mcd_model)((fl & 3) == 3 ? 7 : (fl & 3));
    cb = (fl & 4) ? MCD_BASIS_MASS : MCD_BASIS_MOLE;
    fb = (fl & 8) ? MCD_BASIS_MASS : MCD_BASIS_MOLE;
    nn = n <= NS ? n : NS; /* entries actually present in the arrays */

    c = fuzz_double(&in, 40.0);
    for (size_t i = 0; i < NS; i++)
        M[i] = fuzz_double(&in, 0.03);
    memset(D, 0, sizeof D);
    for (size_t i = 0; i < nn; i++)
        for (size_t j = i + 1; j < nn; j++)
            D[i * NS + j] = D[j * NS + i] = fuzz_double(&in, 1e-5);
    /* the flux calls take an n x n matrix: repack from stride NS */
    {
        double tmp[NS * NS];
        for (size_t i = 0; i < nn; i++)
            for (size_t j = 0; j < nn; j++)
                tmp[i * nn + j] = D[i * NS + j];
        memcpy(D, tmp, sizeof tmp);
        if (ex & 1) /* make it asymmetric sometimes */
            D[nn > 1 ? 1 : 0] *= 1.0 + 1e-6;
    }
    sum = 0;
    for (size_t i = 0; i < NS; i++) {
        x[i] = fuzz_double(&in, 0.5);
        if (i < nn)
            sum += x[i];
    }
    if ((fl & 0x80) && isfinite(sum) && sum > 0)
        for (size_t i = 0; i < nn; i++)
            x[i] /= sum; /* reach the valid paths */
    for (size_t i = 0; i < NS * 3; i++)
        grad[i] = fuzz_double(&in, 10.0);
    for (size_t i = 0; i < NS * NS; i++)
        Gamma[i] = (i % (nn + 1) == 0) ? 1.0 : 0.0;
    if (fl & 0x10)
        for (size_t i = 0; i < nn * nn; i++)
            Gamma[i] += fuzz_double(&in, 0.1);
    for (size_t d = 0; d < 3; d++)
        glnP[d] = fuzz_double(&in, 1.0);
    for (size_t i = 0; i < NS; i++) {
        vals[i] = fuzz_double(&in, 1.0);
        Vbar[i] = 1.0 / c;
    }
    for (size_t i = 0; i < NS * 3; i++)
        J[i] = fuzz_double(&in, 1e-3);

    /* Scale of the fluxes the inputs can produce, c Đ |d| (times M for mass
     * fluxes): when the driving forces cancel (e.g. equal gradients, whose
     * projection is zero) the exact fluxes vanish and the computed ones are
     * round-off of this size, so the zero-sum is judged against it. */
    {
        double Dm = 0, gm = 0, Gm = 0, pm = 0, Mm = 1;
        for (size_t q = 0; q < nn * nn; q++) {
            Dm = fmax(Dm, fabs(D[q]));
            Gm = fmax(Gm, fabs(Gamma[q]));
        }
        for (size_t q = 0; q < nn * 3; q++)
            gm = fmax(gm, fabs(grad[q]));
        for (size_t q = 0; q < 3; q++)
            pm = fmax(pm, fabs(glnP[q]));
        for (size_t q = 0; q < nn; q++)
            Mm = fmax(Mm, fabs(M[q]));
        g_abs_scale =
            fabs(c) * Dm * (gm * (1 + Gm * (double)nn) + pm) * Mm * (double)nn;
        if (!isfinite(g_abs_scale))
            g_abs_scale = HUGE_VAL;
        /* A subnormal c is rejected (EDOM) by the library, so the
         * zero-sum is checked for every accepted c. */
    }

    /* 1. mcd_flux_compute */
    memset(out, FUZZ_GUARD_BYTE, sizeof out);
    st_flux =
        mcd_flux_compute(ws, model,
                         &(mcd_state){.n_species = n,
                                      .n_dim = nd,
                                      .M = (fl & 0x40) ? NULL : M,
                                      .Dij = D,
                                      .c = c,
                                      .comp_basis = cb,
                                      .comp = x,
                                      .grad = grad,
                                      .Gamma = (fl & 0x10) ? Gamma : NULL,
                                      .grad_lnP = (fl & 0x20) ? glnP : NULL},
                         fb, out);
    if (st_flux == MCD_OK) {
        require_zero_sum("flux_compute", n, nd, out, 1);
        memcpy(J, out, n * nd * sizeof(double)); /* a consistent flux set */
    } else {
        FUZZ_REQUIRE(fuzz_untouched(out, sizeof out),
                     "flux_compute wrote on error %d", st_flux);
        FUZZ_REQUIRE(mcd_last_error()[0] != '\0', "no message for %d", st_flux);
    }

    /* 2. Fick matrix, its fluxes and eigenvalues */
    memset(F, FUZZ_GUARD_BYTE, sizeof F);
    memset(&dep, FUZZ_GUARD_BYTE, sizeof dep);
    st = mcd_fick_matrix(ws,
                         &(mcd_state){.n_species = n,
                                      .M = (fl & 0x40) ? NULL : M,
                                      .Dij = D,
                                      .comp_basis = cb,
                                      .comp = x,
                                      .Gamma = (fl & 0x10) ? Gamma : NULL},
                         fb, (ex & 2) ? MCD_DEPENDENT_AUTO : (size_t)(ex >> 4),
                         F, &dep);
    if (st == MCD_OK) {
        FUZZ_REQUIRE(dep < n, "dependent %zu", dep);
        require_finite("fick_matrix", F, (n - 1) * (n - 1));
        memset(out2, FUZZ_GUARD_BYTE, sizeof out2);
        st = mcd_fick_fluxes(n, nd, F, dep, c, grad, out2);
        if (st == MCD_OK)
            require_zero_sum("fick_fluxes", n, nd, out2, 1);
        else
            FUZZ_REQUIRE(fuzz_untouched(out2, sizeof out2),
                         "fick_fluxes wrote on error %d", st);
        memset(re, FUZZ_GUARD_BYTE, sizeof re);
        memset(im, FUZZ_GUARD_BYTE, sizeof im);
        st = mcd_fick_eigenvalues(ws, n - 1, F, re, im);
        if (st == MCD_OK) {
            require_finite("eigen re", re, n - 1);
            require_finite("eigen im", im, n - 1);
        } else {
            FUZZ_REQUIRE(fuzz_untouched(re, sizeof re) &&
                             fuzz_untouched(im, sizeof im),
                         "eigenvalues wrote on error %d", st);
        }
    } else {
        FUZZ_REQUIRE(fuzz_untouched(F, sizeof F) &&
                         fuzz_untouched(&dep, sizeof dep),
                     "fick_matrix wrote on error %d", st);
    }
    /* Calls without a workspace accept any n up to MCD_MAX_SPECIES: n = 9
     * is valid for them but larger than our arrays, so they are skipped
     * for it (n = 0 and n > MCD_MAX_SPECIES must still be rejected). */
    if (n == 9)
        return 0;
    /* fick_fluxes with the raw (fuzzed) matrix too */
    memset(out2, FUZZ_GUARD_BYTE, sizeof out2);
    st = mcd_fick_fluxes(n, nd, Gamma, (size_t)(ex >> 5),
                         fuzz_double(&in, 40.0), grad, out2);
    if (st == MCD_OK)
        require_zero_sum("fick_fluxes raw", n, nd, out2, 1);
    else
        FUZZ_REQUIRE(fuzz_untouched(out2, sizeof out2),
                     "fick_fluxes wrote on error %d", st);

        /* 3. frames */
#define FRAME_CALL(what, call, zsum)                                           \
    do {                                                                       \
        memset(out2, FUZZ_GUARD_BYTE, sizeof out2);                            \
        st = call;                                                             \
        if (st == MCD_OK) {                                                    \
            if (zsum)                                                          \
                require_zero_sum(what, n, nd, out2, 1);                        \
            else                                                               \
                require_finite(what, out2, n *nd);                             \
        } else {                                                               \
            FUZZ_REQUIRE(fuzz_untouched(out2, sizeof out2),                    \
                         "%s wrote on error %d", what, st);                    \
        }                                                                      \
    } while (0)
    FRAME_CALL("flux_convert", mcd_flux_convert(n, nd, M, x, cb, J, fb, out2),
               0);
    FRAME_CALL("volume_frame",
               mcd_flux_to_volume_frame(n, nd, c, x, Vbar, J, out2), 0);
    FRAME_CALL(
        "species_frame",
        mcd_flux_to_species_frame(n, nd, x, J, nn ? (size_t)ex % nn : 0, out2),
        0);
    memset(bulk, FUZZ_GUARD_BYTE, sizeof bulk);
    FRAME_CALL("flux_total",
               mcd_flux_total(n, nd, cb, x, J, (mcd_bootstrap)(ex % 6),
                              (size_t)(ex >> 4) % 9, vals, out2, bulk),
               0);
    if (st == MCD_OK)
        require_finite("bulk", bulk, nd);
    else
        FUZZ_REQUIRE(fuzz_untouched(bulk, sizeof bulk),
                     "bulk written on error");
    {
        double v3[3];
        memset(v3, FUZZ_GUARD_BYTE, sizeof v3);
        st = mcd_flux_velocity_difference(n, nd, M, c, x, J, v3);
        if (st == MCD_OK)
            require_finite("velocity_difference", v3, nd);
        else
            FUZZ_REQUIRE(fuzz_untouched(v3, sizeof v3),
                         "v - u written on error %d", st);
    }
    {
        double io[NS * 3], keep[NS * 3], res[3];
        memcpy(io, J, sizeof io);
        memcpy(keep, J, sizeof keep);
        memset(res, FUZZ_GUARD_BYTE, sizeof res);
        st = mcd_flux_project(n, nd, (ex & 4) ? NULL : vals, io, res);
        if (st == MCD_OK)
            require_zero_sum_ref("flux_project", n, nd, io, 1, keep);
        else
            FUZZ_REQUIRE(memcmp(io, keep, sizeof io) == 0 &&
                             fuzz_untouched(res, sizeof res),
                         "flux_project changed its array on error %d", st);
    }
    memset(flags, FUZZ_GUARD_BYTE, sizeof flags);
    st = mcd_flux_diagnose(n, nd, grad, J, fuzz_double(&in, 1e-3), flags);
    if (st == MCD_OK) {
        for (size_t i = 0; i < n; i++)
            FUZZ_REQUIRE((flags[i] & ~7u) == 0 &&
                             (flags[i] & (flags[i] - 1)) == 0,
                         "flags %u not exclusive", flags[i]);
    } else {
        FUZZ_REQUIRE(fuzz_untouched(flags, sizeof flags),
                     "flags written on error %d", st);
    }

    /* 4. batched, K cells that replicate this state (SoA layout) */
    K = 1 + ex % KMAX;
    for (size_t k = 0; k < K; k++) {
        cvec[k] = c;
        for (size_t q = 0; q < nn * nn; q++)
            Dk[q * K + k] = D[q];
        for (size_t i = 0; i < nn; i++)
            xk[i * K + k] = x[i];
        for (size_t q = 0; q < nn * 3; q++)
            gk[q * K + k] = grad[q];
    }
    memset(outk, FUZZ_GUARD_BYTE, sizeof outk);
    /* bit 7 of the extra byte: the upper-triangle read (the lower triangle
     * of the fuzzed Dij is then ignored, asymmetric or not) */
    if (mcd_workspace_set_dij_read(
            ws, (ex & 0x80) ? MCD_DIJ_READ_UPPER : MCD_DIJ_READ_BOTH) != MCD_OK)
        abort();
    st = mcd_flux_batch_dij(ws, model, n, (fl & 0x40) ? NULL : M, Dk, cvec,
                            &(mcd_cells){.n_cells = K,
                                         .n_dim = nd,
                                         .comp_basis = cb,
                                         .comp = xk,
                                         .grad = gk},
                            fb, outk);
    if (st == MCD_OK) {
        for (size_t k = 0; k < K; k++)
            require_zero_sum("flux_batch_dij", n, nd, outk + k, K);
    }
    /* Not required: that the batch succeeds whenever the single call does.
     * Near-singular states can differ (ESING from one route, OK from the
     * other); both are documented outcomes (see /work/notes/bugs.md). */
    return 0;
}
