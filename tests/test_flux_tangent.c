/* test_flux_tangent.c - mcd_flux_jacobian, mcd_flux_jacobian_tp and
 * mcd_flux_batch_jacobian against high-order finite differences of
 * mcd_flux_compute over thousands of random states (N = 2..30, both
 * models, both bases, trace species and nearly pure components), closed
 * forms of two species, identities, batched against single-state, and
 * every error path.
 *
 * Outside relations (two species; Bird, Stewart and Lightfoot 2002,
 * sec. 24.2, from memory): J_1 = -c D_12 (grad x_1 + (x_1 - w_1)
 * grad ln P) and the mass flux j_1 = -rho D_12 grad w_1, rho = c Mbar,
 * without pressure diffusion. The mixture-averaged model equals the
 * exact one for two species (D_1m = D_12; common practice).
 *
 * Finite differences and their tolerance. Column k is the derivative
 * along e_k - y (which stays on the simplex: mcd_flux_compute checks the
 * sum of the fractions), equal to column k because every row satisfies
 * sum_j y_j dF/dy_j = 0 (checked separately). The fluxes are analytic in
 * the mole fractions with a radius about l = the smallest nonzero mole
 * fraction (Blanc sums, D_im and the pivots of the solve vary on that
 * scale); along the direction the mole fractions move at speed up to v_k
 * (1 in the mole basis, up to Mbar / M_k with mass fractions), so the
 * step is h = 3e-4 l / v_k. With the radius as small as l / 8 the
 * fourth-order central difference has truncation f^(5) h^4 / 30 <=
 * 4 (8 h v_k / l)^4 |F| v_k / l = 1.3e-10 |F| v_k / l, and round-off
 * 1.5 eps_F |F| / h with eps_F <= 1e-13 the relative error of one flux
 * evaluation (mcd_flux_compute's accuracy statement: below 1e-11
 * normwise for far worse spreads of Đ; these states spread Đ over one
 * decade) = 5e-10 |F| v_k / l. The fourth-order forward difference
 * used for a trace species' column (its fraction cannot go below 0) has
 * 6 times the truncation and 7 times the round-off: below 5e-9. Hence
 * the check |FD - A| <= 1e-8 max(|A|, v |F| / l), a bound on the error
 * of the reference, not a measured error. (With h = 0.004 l, and l taken
 * in the input basis, some trace-species columns in mass fractions
 * missed by 1e-4, and h = 1e-3 l / v_k still by 2e-8: truncation, gone
 * at smaller steps; the step must follow the mole fractions.)
 */
#include <check.h>
#include <math.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

#include "mcdiff.h"
#include "support.h"

#define NMAX 30
#define ND 2

static sup_rng rng = SUP_RNG(SUP_SPLITMIX64, 0x7A46E27ull);

typedef struct tstate {
    size_t n;
    mcd_basis basis;
    double y[NMAX], M[NMAX], D[NMAX * NMAX], g[NMAX * ND], G[NMAX * NMAX];
    double glnP[ND], kT[NMAX], glnT[ND], c;
    double aT[NMAX * NMAX]; /* exponents of Đ ~ T^a / P (T, P checks) */
    int flags;              /* 1 pressure diffusion, 2 Gamma, 4 thermal */
} tstate;

/* kind: 0 all present, 1 one trace species (y = 0), 2 nearly pure (the
 * others share 1e-4), 3 trace and nearly pure */
static void draw(tstate *s, size_t n, int kind, int flags, mcd_basis b)
{
    size_t i, j;
    double m = 0.0, sum = 0.0;
    s->n = n;
    s->basis = b;
    s->flags = flags;
    sup_fractions(&rng, n, 0.1, s->y);
    if (kind >= 2) {
        size_t p = (size_t)(sup_u01(&rng) * (double)n) % n;
        for (i = 0; i < n; i++)
            s->y[i] = i == p ? 1.0 - 1e-4 : 1e-4 * s->y[i];
    }
    if (kind % 2 == 1 && n >= 3)
        s->y[(size_t)(sup_u01(&rng) * (double)n) % n] *= 0.0;
    for (i = 0; i < n; i++)
        sum += s->y[i];
    for (i = 0; i < n; i++)
        s->y[i] /= sum;
    for (i = 0; i < n; i++)
        s->M[i] = sup_molar_mass(&rng);
    sup_dij_decades(&rng, n, s->D, -5.5, -4.5);
    for (i = 0; i < n; i++)
        for (j = 0; j < n; j++)
            s->aT[i * n + j] = 1.5 + 0.25 * (double)((i + j) % 3);
    sup_gradients_zero_mean(&rng, n, ND, -20.0, 20.0, s->g);
    for (i = 0; i < n; i++)
        for (j = 0; j < n; j++)
            s->G[i * n + j] =
                (i == j ? 1.0 : 0.0) + 0.1 * sup_range(&rng, -1.0, 1.0);
    for (i = 0; i < n; i++) {
        s->kT[i] = sup_range(&rng, -0.1, 0.1);
        m += s->kT[i];
    }
    for (i = 0; i < n; i++)
        s->kT[i] -= m / (double)n;
    for (i = 0; i < ND; i++) {
        s->glnP[i] = sup_range(&rng, -30.0, 30.0);
        s->glnT[i] = sup_range(&rng, -100.0, 100.0);
    }
    s->c = sup_range(&rng, 10.0, 60.0);
}

static mcd_state state_of(const tstate *s, const double *y, const double *D,
                          double c)
{
    mcd_state st = {0};
    st.n_species = s->n;
    st.n_dim = ND;
    st.comp_basis = s->basis;
    st.c = c;
    st.M = s->M;
    st.Dij = D;
    st.comp = y;
    st.grad = s->g;
    st.grad_lnP = s->flags & 1 ? s->glnP : NULL;
    st.Gamma = s->flags & 2 ? s->G : NULL;
    st.kT = s->flags & 4 ? s->kT : NULL;
    st.grad_lnT = s->flags & 4 ? s->glnT : NULL;
    return st;
}

/* F at y + t (e_k - y) */
static void flux_at(mcd_workspace *ws, const tstate *s, mcd_model model,
                    mcd_basis fb, size_t k, double t, double *F)
{
    double y[NMAX];
    size_t j;
    mcd_state st;
    for (j = 0; j < s->n; j++)
        y[j] = s->y[j] + t * ((j == k ? 1.0 : 0.0) - s->y[j]);
    st = state_of(s, y, s->D, s->c);
    ck_assert_msg(mcd_flux_compute(ws, model, &st, fb, F) == MCD_OK, "%s",
                  mcd_last_error());
}

/* The largest speed max_i |dx_i/dt| of the mole fractions along
 * y + t (e_k - y) (mass fractions move the mole fractions up to
 * Mbar / M_k times faster). */
static double mole_speed(const tstate *s, size_t k)
{
    double x[NMAX], dx, q = 0.0, r = 0.0, Mb, v = 0.0;
    size_t i;
    if (s->basis == MCD_BASIS_MOLE) {
        for (i = 0; i < s->n; i++)
            v = fmax(v, fabs((i == k ? 1.0 : 0.0) - s->y[i]));
        return v;
    }
    for (i = 0; i < s->n; i++) {
        r += s->y[i] / s->M[i];
        q += ((i == k ? 1.0 : 0.0) - s->y[i]) / s->M[i];
    }
    Mb = 1.0 / r;
    for (i = 0; i < s->n; i++) {
        x[i] = Mb * s->y[i] / s->M[i];
        dx = Mb * (((i == k ? 1.0 : 0.0) - s->y[i]) / s->M[i] - x[i] * q);
        v = fmax(v, fabs(dx));
    }
    return v;
}

/* The smallest nonzero mole fraction of the state. */
static double smallest_x(const tstate *s)
{
    double r = 0.0, l = 1.0;
    size_t i;
    for (i = 0; i < s->n; i++)
        r += s->basis == MCD_BASIS_MOLE ? s->y[i] : s->y[i] / s->M[i];
    for (i = 0; i < s->n; i++) {
        double x =
            s->basis == MCD_BASIS_MOLE ? s->y[i] / r : s->y[i] / s->M[i] / r;
        if (x > 0.0 && x < l)
            l = x;
    }
    return l;
}

/* largest |FD - A| / max(|A|, v |F| / l) over the columns of one state,
 * v the largest mole_speed */
static double fd_error(mcd_workspace *ws, const tstate *s, mcd_model model,
                       mcd_basis fb, const double *A)
{
    static const double cf[5] = {-25.0, 48.0, -36.0, 16.0, -3.0};
    const size_t n = s->n, m = n * ND;
    const double l = smallest_x(s);
    double F[5][NMAX * ND], v = 0.0, scale, err = 0.0;
    size_t k, e, q;
    flux_at(ws, s, model, fb, 0, 0.0, F[0]);
    for (k = 0; k < n; k++)
        v = fmax(v, mole_speed(s, k));
    scale = fmax(sup_max_abs(A, m * n), v * sup_max_abs(F[0], m) / l);
    for (k = 0; k < n; k++) {
        const double h = 3e-4 * l / mole_speed(s, k);
        if (s->y[k] > 0.0) { /* central, fourth order */
            flux_at(ws, s, model, fb, k, 2 * h, F[1]);
            flux_at(ws, s, model, fb, k, h, F[2]);
            flux_at(ws, s, model, fb, k, -h, F[3]);
            flux_at(ws, s, model, fb, k, -2 * h, F[4]);
            for (e = 0; e < m; e++) {
                double fd =
                    (-F[1][e] + 8 * F[2][e] - 8 * F[3][e] + F[4][e]) / (12 * h);
                err = fmax(err, fabs(fd - A[e * n + k]));
            }
        } else { /* forward, fourth order */
            flux_at(ws, s, model, fb, k, 0.0, F[0]);
            for (q = 1; q < 5; q++)
                flux_at(ws, s, model, fb, k, (double)q * h, F[q]);
            for (e = 0; e < m; e++) {
                double fd = 0.0;
                for (q = 0; q < 5; q++)
                    fd += cf[q] * F[q][e];
                fd /= 12 * h;
                err = fmax(err, fabs(fd - A[e * n + k]));
            }
        }
    }
    return err / scale;
}

START_TEST(tangent_matches_finite_differences)
{
    mcd_workspace *ws;
    double worst[2] = {0.0, 0.0};
    int rep;
    ck_assert_int_eq(mcd_workspace_new(NMAX, &ws), MCD_OK);
    for (rep = 0; rep < 4000; rep++) {
        const size_t n = 2 + (size_t)(rep % 29);
        const mcd_model model = (rep / 29) % 2 ? MCD_MODEL_MIXTURE_AVERAGED
                                               : MCD_MODEL_MAXWELL_STEFAN;
        const mcd_basis cb = (rep / 58) % 2 ? MCD_BASIS_MASS : MCD_BASIS_MOLE;
        const mcd_basis fb = (rep / 116) % 2 ? MCD_BASIS_MASS : MCD_BASIS_MOLE;
        const int kind = (rep / 7) % 4, flags = (rep / 3) % 8;
        static double A[NMAX * ND * NMAX];
        tstate s;
        mcd_state st;
        double err;
        if (n > 12 && rep % 4 != 0)
            continue; /* the large states every fourth time: run time */
        draw(&s, n, kind, flags, cb);
        st = state_of(&s, s.y, s.D, s.c);
        ck_assert_msg(mcd_flux_jacobian(ws, model, &st, fb, A) == MCD_OK, "%s",
                      mcd_last_error());
        err = fd_error(ws, &s, model, fb, A);
        worst[model == MCD_MODEL_MIXTURE_AVERAGED] =
            fmax(worst[model == MCD_MODEL_MIXTURE_AVERAGED], err);
        ck_assert_msg(err <= 1e-8,
                      "rep %d n %zu model %d bases %d/%d kind %d flags %d: "
                      "%g",
                      rep, n, (int)model, (int)cb, (int)fb, kind, flags, err);
    }
    printf("flux_tangent: largest difference from finite differences (of "
           "max(|A|, |F|/l)): exact %.1e, mixture-averaged %.1e\n",
           worst[0], worst[1]);
    mcd_workspace_free(ws);
}
END_TEST

START_TEST(tangent_identities)
{
    /* columns sum to zero over species (the fluxes do at every
     * composition); rows satisfy sum_k y_k dF/dy_k = 0 (the fractions are
     * read renormalised). Each sum has N terms of size <= max|A| with
     * relative errors of a few eps each, and the derivatives themselves
     * carry the flux solve's relative error (< 1e-13 here, see the head
     * comment) on the scale |F| / l: bound 1e-11 max(|A|, |F| / l). The
     * exact model's Jacobian equals mcd_flux_jacobian_comp (the same
     * equations, another order of operations: same bound). */
    mcd_workspace *ws;
    int rep;
    ck_assert_int_eq(mcd_workspace_new(NMAX, &ws), MCD_OK);
    for (rep = 0; rep < 1200; rep++) {
        const size_t n = 2 + (size_t)(rep % 29);
        const mcd_model model =
            rep % 2 ? MCD_MODEL_MIXTURE_AVERAGED : MCD_MODEL_MAXWELL_STEFAN;
        const mcd_basis cb = (rep / 2) % 2 ? MCD_BASIS_MASS : MCD_BASIS_MOLE;
        const mcd_basis fb = (rep / 4) % 2 ? MCD_BASIS_MASS : MCD_BASIS_MOLE;
        static double A[NMAX * ND * NMAX], B[NMAX * ND * NMAX];
        double F[NMAX * ND], scale, l = 1.0;
        tstate s;
        mcd_state st;
        size_t i, k, d;
        draw(&s, n, (rep / 8) % 4, (rep / 3) % 8, cb);
        st = state_of(&s, s.y, s.D, s.c);
        ck_assert_int_eq(mcd_flux_jacobian(ws, model, &st, fb, A), MCD_OK);
        ck_assert_int_eq(mcd_flux_compute(ws, model, &st, fb, F), MCD_OK);
        for (k = 0; k < n; k++)
            if (s.y[k] > 0.0 && s.y[k] < l)
                l = s.y[k];
        scale = fmax(sup_max_abs(A, n * ND * n), sup_max_abs(F, n * ND) / l);
        for (d = 0; d < ND; d++)
            for (k = 0; k < n; k++) {
                double sum = 0.0;
                for (i = 0; i < n; i++)
                    sum += A[(i * ND + d) * n + k];
                ck_assert_msg(fabs(sum) <= 1e-11 * scale, "rep %d: %g", rep,
                              sum / scale);
            }
        for (i = 0; i < n * ND; i++) {
            double sum = 0.0;
            for (k = 0; k < n; k++)
                sum += s.y[k] * A[i * n + k];
            ck_assert_msg(fabs(sum) <= 1e-11 * scale, "rep %d: %g", rep,
                          sum / scale);
        }
        if (model == MCD_MODEL_MAXWELL_STEFAN && cb == MCD_BASIS_MOLE &&
            fb == MCD_BASIS_MOLE) {
            ck_assert_int_eq(mcd_flux_jacobian_comp(ws, &st, B), MCD_OK);
            for (i = 0; i < n * ND * n; i++)
                ck_assert_msg(fabs(A[i] - B[i]) <= 1e-11 * scale, "rep %d: %g",
                              rep, (A[i] - B[i]) / scale);
        }
    }
    mcd_workspace_free(ws);
}
END_TEST

START_TEST(tangent_two_species_closed_forms)
{
    mcd_workspace *ws;
    const double M[2] = {0.002, 0.044}, D[4] = {0, 6e-5, 6e-5, 0};
    const double x[2] = {0.35, 0.65}, g[2] = {8.0, -8.0}, glnP[1] = {25.0};
    const double c = 40.0;
    double A[4], B[4], Mbar = x[0] * M[0] + x[1] * M[1], want;
    mcd_state st = {0};
    int mo;
    ck_assert_int_eq(mcd_workspace_new(2, &ws), MCD_OK);
    st.n_species = 2;
    st.n_dim = 1;
    st.comp_basis = MCD_BASIS_MOLE;
    st.c = c;
    st.M = M;
    st.Dij = D;
    st.comp = x;
    st.grad = g;
    for (mo = 0; mo < 2; mo++) {
        const mcd_model model =
            mo ? MCD_MODEL_MIXTURE_AVERAGED : MCD_MODEL_MAXWELL_STEFAN;
        /* molar, no pressure diffusion: J_1 = -c D g_1 whatever x (to
         * round-off of the O(1) sums: 1e-12 of c D g) */
        st.comp_basis = MCD_BASIS_MOLE;
        st.grad_lnP = NULL;
        ck_assert_int_eq(mcd_flux_jacobian(ws, model, &st, MCD_BASIS_MOLE, A),
                         MCD_OK);
        for (int e = 0; e < 4; e++)
            ck_assert_msg(fabs(A[e]) <= 1e-12 * c * 6e-5 * 8.0, "%d: %g", e,
                          A[e]);
        /* with pressure diffusion: column 1 (along e_1 - x) */
        st.grad_lnP = glnP;
        ck_assert_int_eq(mcd_flux_jacobian(ws, model, &st, MCD_BASIS_MOLE, A),
                         MCD_OK);
        want = (1 - x[0]) *
               (-c * 6e-5 * glnP[0] * (1 - M[0] * M[1] / (Mbar * Mbar)));
        ck_assert_msg(sup_rel(A[0], want) < 1e-12, "%g vs %g", A[0], want);
        /* mass fractions and mass fluxes: j_1 = -c Mbar D g_w1 with
         * 1 / Mbar = sum w / M, so along e_1 - w
         * dj_1 = c D g_w1 Mbar^2 (1 / M_1 - 1 / Mbar) */
        st.grad_lnP = NULL;
        st.comp_basis = MCD_BASIS_MASS; /* x read as mass fractions */
        ck_assert_int_eq(mcd_flux_jacobian(ws, model, &st, MCD_BASIS_MASS, B),
                         MCD_OK);
        {
            const double Mw = 1.0 / (x[0] / M[0] + x[1] / M[1]);
            want = c * 6e-5 * g[0] * Mw * Mw * (1.0 / M[0] - 1.0 / Mw);
            ck_assert_msg(sup_rel(B[0], want) < 1e-12, "%g vs %g", B[0], want);
            ck_assert(fabs(B[0] + B[2]) <= 1e-14 * fabs(want));
        }
    }
    mcd_workspace_free(ws);
}
END_TEST

/* Đ_ij(T, P) = D_ij (T / T0)^a_ij (P0 / P), c = P / (R T) */
static void tp_state(const tstate *s, double T, double P, double *D, double *c)
{
    const double T0 = 300.0, P0 = 101325.0;
    size_t i;
    for (i = 0; i < s->n * s->n; i++)
        D[i] = s->D[i] * pow(T / T0, s->aT[i]) * (P0 / P);
    *c = P / (MCD_GAS_CONSTANT * T);
}

START_TEST(tangent_tp_matches_finite_differences)
{
    /* central fourth-order differences in T and P with h = 1e-3 T (P):
     * the fluxes are smooth in T on the scale T (powers of T / T0), so
     * truncation ~ (h/T)^4 |F| / T = 1e-12 |F| / T, round-off 1.5
     * eps_F |F| / h = 1.5e-10 |F| / T: bound 1e-8 max(|dF|, |F| / T). With
     * every a_ij = 1.75 (the Fuller-Schettler-Giddings scaling) the
     * fluxes go as c Đ ~ T^0.75 exactly: dF/dT = 0.75 F / T and dF/dP = 0
     * (bound: a few eps of |F| / T). */
    mcd_workspace *ws;
    int rep;
    ck_assert_int_eq(mcd_workspace_new(NMAX, &ws), MCD_OK);
    for (rep = 0; rep < 600; rep++) {
        const size_t n = 2 + (size_t)(rep % 29);
        const mcd_model model =
            rep % 2 ? MCD_MODEL_MIXTURE_AVERAGED : MCD_MODEL_MAXWELL_STEFAN;
        const mcd_basis cb = (rep / 2) % 2 ? MCD_BASIS_MASS : MCD_BASIS_MOLE;
        const mcd_basis fb = (rep / 4) % 2 ? MCD_BASIS_MASS : MCD_BASIS_MOLE;
        const int fsg = rep % 5 == 0;
        static double D[NMAX * NMAX], dT[NMAX * NMAX], dP[NMAX * NMAX];
        double oT[NMAX * ND], oP[NMAX * ND], F[4][NMAX * ND], F0[NMAX * ND];
        double T = 0.0, P = 0.0, c, scale;
        tstate s;
        mcd_state st;
        size_t i, q, e;
        draw(&s, n, (rep / 8) % 4, (rep / 3) % 8, cb);
        if (fsg)
            for (i = 0; i < n * n; i++)
                s.aT[i] = 1.75;
        T = sup_range(&rng, 250.0, 1500.0);
        P = sup_range(&rng, 2e4, 5e5);
        tp_state(&s, T, P, D, &c);
        for (i = 0; i < n * n; i++) {
            dT[i] = s.aT[i] * D[i] / T;
            dP[i] = -D[i] / P;
        }
        st = state_of(&s, s.y, D, c);
        ck_assert_msg(mcd_flux_jacobian_tp(ws, model, &st, fb, T, P, dT, dP, oT,
                                           oP) == MCD_OK,
                      "%s", mcd_last_error());
        ck_assert_int_eq(mcd_flux_compute(ws, model, &st, fb, F0), MCD_OK);
        for (q = 0; q < 2; q++) {
            const double X = q == 0 ? T : P, h = 1e-3 * X;
            const double *o = q == 0 ? oT : oP;
            static const double off[4] = {2.0, 1.0, -1.0, -2.0};
            for (i = 0; i < 4; i++) {
                double Dh[NMAX * NMAX], ch;
                mcd_state sh;
                tp_state(&s, q == 0 ? T + off[i] * h : T,
                         q == 1 ? P + off[i] * h : P, Dh, &ch);
                sh = state_of(&s, s.y, Dh, ch);
                ck_assert_int_eq(mcd_flux_compute(ws, model, &sh, fb, F[i]),
                                 MCD_OK);
            }
            scale = fmax(sup_max_abs(o, n * ND), sup_max_abs(F0, n * ND) / X);
            for (e = 0; e < n * ND; e++) {
                double fd =
                    (-F[0][e] + 8 * F[1][e] - 8 * F[2][e] + F[3][e]) / (12 * h);
                ck_assert_msg(fabs(fd - o[e]) <= 1e-8 * scale,
                              "rep %d q %zu e %zu: %g vs %g", rep, q, e, fd,
                              o[e]);
                if (fsg)
                    ck_assert_msg(
                        fabs(o[e] - (q == 0 ? 0.75 * F0[e] / T : 0.0)) <=
                            1e-12 * sup_max_abs(F0, n * ND) / X,
                        "rep %d q %zu: %g", rep, q, o[e]);
            }
        }
    }
    mcd_workspace_free(ws);
}
END_TEST

START_TEST(tangent_batched_equals_single_state)
{
    /* each cell runs the single-state code, so the results agree to the
     * bit; 1e-13 relative allows only for a compiler contracting a
     * multiply-add differently in the two inlining contexts (a few eps
     * per operation over chains of O(N) operations) */
    enum { K = 37, N = 9 };
    mcd_workspace *ws;
    static double comp[N * K], grad[N * ND * K], Dij[N * N * K], c[K];
    static double glnP[ND * K], kT[N * K], glnT[ND * K];
    static double flux[N * ND * K], jac[N * ND * N * K];
    double A[N * ND * N], F[N * ND];
    int mo, fbi;
    size_t k, i;
    ck_assert_int_eq(mcd_workspace_new(N, &ws), MCD_OK);
    tstate cells[K];
    for (k = 0; k < K; k++) {
        /* flags 5: pressure and thermal diffusion (cells have no Gamma) */
        draw(&cells[k], N, (int)(k % 4), 5, MCD_BASIS_MOLE);
        for (i = 0; i < N; i++) {
            comp[i * K + k] = cells[k].y[i];
            kT[i * K + k] = cells[k].kT[i];
            cells[k].M[i] = cells[0].M[i]; /* shared by the cells */
        }
        for (i = 0; i < N * ND; i++)
            grad[i * K + k] = cells[k].g[i];
        for (i = 0; i < N * N; i++)
            Dij[i * K + k] = cells[k].D[i];
        for (i = 0; i < ND; i++) {
            glnP[i * K + k] = cells[k].glnP[i];
            glnT[i * K + k] = cells[k].glnT[i];
        }
        c[k] = cells[k].c;
    }
    for (mo = 0; mo < 2; mo++)
        for (fbi = 0; fbi < 2; fbi++) {
            const mcd_model model =
                mo ? MCD_MODEL_MIXTURE_AVERAGED : MCD_MODEL_MAXWELL_STEFAN;
            const mcd_basis fb = fbi ? MCD_BASIS_MASS : MCD_BASIS_MOLE;
            mcd_cells cl = {0};
            cl.n_cells = K;
            cl.n_dim = ND;
            cl.comp_basis = MCD_BASIS_MOLE;
            cl.comp = comp;
            cl.grad = grad;
            cl.grad_lnP = glnP;
            cl.kT = kT;
            cl.grad_lnT = glnT;
            ck_assert_msg(mcd_flux_batch_jacobian(ws, model, N, cells[0].M, Dij,
                                                  c, &cl, fb, flux,
                                                  jac) == MCD_OK,
                          "%s", mcd_last_error());
            for (k = 0; k < K; k++) {
                mcd_state st =
                    state_of(&cells[k], cells[k].y, cells[k].D, cells[k].c);
                double sa, sf;
                ck_assert_int_eq(mcd_flux_jacobian(ws, model, &st, fb, A),
                                 MCD_OK);
                ck_assert_int_eq(mcd_flux_compute(ws, model, &st, fb, F),
                                 MCD_OK);
                sa = sup_max_abs(A, N * ND * N);
                sf = sup_max_abs(F, N * ND);
                for (i = 0; i < N * ND * N; i++)
                    ck_assert_msg(fabs(jac[i * K + k] - A[i]) <= 1e-13 * sa,
                                  "mo %d fb %d k %zu i %zu: %g vs %g", mo, fbi,
                                  k, i, jac[i * K + k], A[i]);
                for (i = 0; i < N * ND; i++)
                    ck_assert(fabs(flux[i * K + k] - F[i]) <= 1e-13 * sf);
            }
            /* out_flux NULL: the Jacobians alone, the same */
            ck_assert_int_eq(mcd_flux_batch_jacobian(ws, model, N, cells[0].M,
                                                     Dij, c, &cl, fb, NULL,
                                                     jac),
                             MCD_OK);
        }
    mcd_workspace_free(ws);
}
END_TEST

START_TEST(tangent_bad_input_outputs_untouched)
{
    mcd_workspace *ws;
    tstate s;
    double A[4 * ND * 4], oT[4 * ND], oP[4 * ND], dD[16] = {0};
    double comp[4], grad[4 * ND], Dij[16], c[1], jac[4 * ND * 4], fl[4 * ND];
    mcd_state st;
    mcd_cells cl = {0};
    size_t i;
    ck_assert_int_eq(mcd_workspace_new(4, &ws), MCD_OK);
    draw(&s, 4, 0, 0, MCD_BASIS_MOLE);
    sup_guard_fill(A, 4 * ND * 4);
    sup_guard_fill(oT, 4 * ND);
    sup_guard_fill(oP, 4 * ND);
    st = state_of(&s, s.y, s.D, s.c);
    ck_assert_int_eq(
        mcd_flux_jacobian(ws, MCD_MODEL_ITERATIVE, &st, MCD_BASIS_MOLE, A),
        MCD_EINVAL);
    ck_assert_ptr_nonnull(strstr(mcd_last_error(), "argument model"));
    ck_assert_int_eq(
        mcd_flux_jacobian(ws, (mcd_model)9, &st, MCD_BASIS_MOLE, A),
        MCD_EINVAL);
    ck_assert_int_eq(
        mcd_flux_jacobian(ws, MCD_MODEL_MAXWELL_STEFAN, &st, (mcd_basis)5, A),
        MCD_EINVAL);
    ck_assert_ptr_nonnull(strstr(mcd_last_error(), "flux_basis"));
    ck_assert_int_eq(mcd_flux_jacobian(ws, MCD_MODEL_MAXWELL_STEFAN, &st,
                                       MCD_BASIS_MOLE, NULL),
                     MCD_EINVAL);
    ck_assert_int_eq(mcd_flux_jacobian(NULL, MCD_MODEL_MAXWELL_STEFAN, &st,
                                       MCD_BASIS_MOLE, A),
                     MCD_EINVAL);
    ck_assert_int_eq(mcd_flux_jacobian(ws, MCD_MODEL_MAXWELL_STEFAN, NULL,
                                       MCD_BASIS_MOLE, A),
                     MCD_EINVAL);
    st.M = NULL; /* mass fluxes need M */
    ck_assert_int_eq(mcd_flux_jacobian(ws, MCD_MODEL_MIXTURE_AVERAGED, &st,
                                       MCD_BASIS_MASS, A),
                     MCD_EINVAL);
    ck_assert_ptr_nonnull(strstr(mcd_last_error(), "argument M"));
    st = state_of(&s, s.y, s.D, s.c);
    s.y[1] = -0.2; /* a state the flux call rejects */
    ck_assert_int_eq(mcd_flux_jacobian(ws, MCD_MODEL_MIXTURE_AVERAGED, &st,
                                       MCD_BASIS_MOLE, A),
                     MCD_EDOM);
    ck_assert_ptr_nonnull(strstr(mcd_last_error(), "argument comp"));
    draw(&s, 4, 0, 0, MCD_BASIS_MOLE);
    st = state_of(&s, s.y, s.D, s.c);
    /* T and P */
    ck_assert_int_eq(mcd_flux_jacobian_tp(ws, MCD_MODEL_MAXWELL_STEFAN, &st,
                                          MCD_BASIS_MOLE, 300.0, 1e5, dD, dD,
                                          NULL, NULL),
                     MCD_EINVAL);
    ck_assert_int_eq(mcd_flux_jacobian_tp(ws, MCD_MODEL_MAXWELL_STEFAN, &st,
                                          MCD_BASIS_MOLE, -3.0, 1e5, dD, dD, oT,
                                          oP),
                     MCD_EDOM);
    ck_assert_ptr_nonnull(strstr(mcd_last_error(), "argument T"));
    ck_assert_int_eq(mcd_flux_jacobian_tp(ws, MCD_MODEL_MAXWELL_STEFAN, &st,
                                          MCD_BASIS_MOLE, 300.0, SUP_NAN, dD,
                                          dD, oT, oP),
                     MCD_EINVAL);
    ck_assert_ptr_nonnull(strstr(mcd_last_error(), "argument P"));
    ck_assert_int_eq(mcd_flux_jacobian_tp(ws, MCD_MODEL_MAXWELL_STEFAN, &st,
                                          MCD_BASIS_MOLE, 300.0, 1e5, NULL, dD,
                                          oT, oP),
                     MCD_EINVAL);
    ck_assert_ptr_nonnull(strstr(mcd_last_error(), "dDij_dT"));
    dD[5] = SUP_INF;
    ck_assert_int_eq(mcd_flux_jacobian_tp(ws, MCD_MODEL_MAXWELL_STEFAN, &st,
                                          MCD_BASIS_MOLE, 300.0, 1e5, NULL, dD,
                                          NULL, oP),
                     MCD_EINVAL);
    ck_assert_ptr_nonnull(strstr(mcd_last_error(), "dDij_dP"));
    ck_assert_int_eq(mcd_flux_jacobian_tp(ws, MCD_MODEL_ITERATIVE, &st,
                                          MCD_BASIS_MOLE, 300.0, 1e5, NULL, dD,
                                          NULL, oP),
                     MCD_EINVAL);
    ck_assert(sup_guard_intact(A, 4 * ND * 4));
    ck_assert(sup_guard_intact(oT, 4 * ND));
    ck_assert(sup_guard_intact(oP, 4 * ND));
    /* batched: a bad cell is named */
    for (i = 0; i < 4; i++)
        comp[i] = s.y[i];
    comp[2] = -0.5;
    for (i = 0; i < 4 * ND; i++)
        grad[i] = s.g[i];
    for (i = 0; i < 16; i++)
        Dij[i] = s.D[i];
    c[0] = s.c;
    cl.n_cells = 1;
    cl.n_dim = ND;
    cl.comp = comp;
    cl.grad = grad;
    sup_guard_fill(jac, 4 * ND * 4);
    sup_guard_fill(fl, 4 * ND);
    ck_assert_int_eq(mcd_flux_batch_jacobian(ws, MCD_MODEL_MAXWELL_STEFAN, 4,
                                             s.M, Dij, c, &cl, MCD_BASIS_MOLE,
                                             fl, jac),
                     MCD_EDOM);
    ck_assert_ptr_nonnull(strstr(mcd_last_error(), "cell 0: argument comp"));
    ck_assert_int_eq(mcd_flux_batch_jacobian(ws, MCD_MODEL_ITERATIVE, 4, s.M,
                                             Dij, c, &cl, MCD_BASIS_MOLE, fl,
                                             jac),
                     MCD_EINVAL);
    ck_assert_int_eq(mcd_flux_batch_jacobian(ws, MCD_MODEL_MAXWELL_STEFAN, 4,
                                             s.M, Dij, c, &cl, MCD_BASIS_MOLE,
                                             fl, NULL),
                     MCD_EINVAL);
    ck_assert_ptr_nonnull(strstr(mcd_last_error(), "out_jac"));
    ck_assert_int_eq(mcd_flux_batch_jacobian(ws, MCD_MODEL_MAXWELL_STEFAN, 4,
                                             s.M, NULL, c, &cl, MCD_BASIS_MOLE,
                                             fl, jac),
                     MCD_EINVAL);
    ck_assert_int_eq(mcd_flux_batch_jacobian(ws, MCD_MODEL_MAXWELL_STEFAN, 4,
                                             NULL, Dij, c, &cl, MCD_BASIS_MASS,
                                             fl, jac),
                     MCD_EINVAL);
    ck_assert(sup_guard_intact(jac, 4 * ND * 4));
    ck_assert(sup_guard_intact(fl, 4 * ND));
    mcd_workspace_free(ws);
}
END_TEST

int main(void)
{
    Suite *s = suite_create("mcd:flux_tangent");
    TCase *tc = tcase_create("derivatives");
    tcase_set_timeout(tc, 600);
    tcase_add_test(tc, tangent_matches_finite_differences);
    tcase_add_test(tc, tangent_identities);
    tcase_add_test(tc, tangent_two_species_closed_forms);
    tcase_add_test(tc, tangent_tp_matches_finite_differences);
    tcase_add_test(tc, tangent_batched_equals_single_state);
    tcase_add_test(tc, tangent_bad_input_outputs_untouched);
    suite_add_tcase(s, tc);
    return sup_run(s);
}
