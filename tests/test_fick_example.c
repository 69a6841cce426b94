/*
 * test_fick_example.c - the generalized Fick matrix against published
 * formulas and textbook cases.
 *
 * Sources:
 *  - Taylor, R. and Krishna, R. (1993), "Multicomponent Mass Transfer",
 *    Wiley, ch. 2 (section on ideal gases): for a ternary ideal gas the
 *    matrix [D] = [B]^-1 has the explicit entries (species 3 dependent)
 *      D11 = Đ13 (x1 Đ23 + (1 - x1) Đ12) / S
 *      D12 = x1 Đ23 (Đ13 - Đ12) / S
 *      D21 = x2 Đ13 (Đ23 - Đ12) / S
 *      D22 = Đ23 (x2 Đ13 + (1 - x2) Đ12) / S
 *      S   = x1 Đ23 + x2 Đ13 + x3 Đ12
 *    (equation form from memory, equation number not confirmed; the test
 *    below also checks it against an independent long-double inverse of
 *    [B], so a faulty recollection would show up as a failure there).
 *    The same chapter states that all Đ equal gives [D] = Đ [I], that
 *    Đ12 = Đ13 makes D12 vanish, and that the eigenvalues of [D] of an
 *    ideal gas are real and positive and do not depend on which species is
 *    taken as dependent (from memory).
 *  - Worked example data: the acetone (1) / methanol (2) / air (3) Stefan
 *    tube of Carty and Schrodt (1975), Ind. Eng. Chem. Fundam. 14, 276, as
 *    used for the Maxwell-Stefan worked example of Taylor and Krishna
 *    (1993, ch. 2): 328.5 K, 99.4 kPa, Đ12 = 8.48, Đ13 = 13.72,
 *    Đ23 = 19.91 mm^2/s, liquid-surface composition x1 = 0.319,
 *    x2 = 0.528 (all from memory; we could not confirm the book's printed
 *    Fick-matrix entries, so the check is against the book's formula, not
 *    against printed digits).
 *  - Duncan and Toor (1962), AIChE J. 8, 38: H2 (1) / N2 (2) / CO2 (3),
 *    Đ = 83.3, 68.0, 16.8 mm^2/s at the mean composition (0.25, 0.50,
 *    0.25) (Đ as quoted by Taylor and Krishna 1993, ch. 5; see
 *    test_duncan_toor.c).
 *  - Binary limit: the Fick diffusivity of a binary is the same in the
 *    molar and the mass frame and equals Đ12 for an ideal gas (Bird,
 *    Stewart and Lightfoot 2002, ch. 17 and 24; Taylor and Krishna 1993,
 *    ch. 3).
 *  - Frame change molar -> mass: derived here from the basis change in the
 *    design notes, j_i = M_i J_i - w_i sum_k M_k J_k, and the chain rule
 *    grad x = [Q] grad w; the result [D°] = [Q]^-1 [D] [Q] is a similarity
 *    transform (Taylor and Krishna 1993, ch. 3, give the same structure).
 */
#include <check.h>
#include <float.h>
#include <math.h>
#include <stdint.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

#include "mcdiff.h"
#include "support.h"

/* The references here are computed in long double, and doubles are
 * promoted to it on purpose; Clang's -Wdouble-promotion (unlike GCC's)
 * flags double to long double as well. */
#if defined(__clang__)
#pragma clang diagnostic ignored "-Wdouble-promotion"
#endif

#define NMAX 6

static mcd_workspace *ws;

static void setup(void)
{
    ck_assert_int_eq(mcd_workspace_new(NMAX, &ws), MCD_OK);
}
static void teardown(void)
{
    mcd_workspace_free(ws);
    ws = NULL;
}

/* Deterministic PRNG (xorshift64*, fixed seed) for the sweeps. */
static sup_rng rng = SUP_RNG(SUP_XORSHIFT64STAR, 0x9E3779B97F4A7C15ull);

static void sym3(double d12, double d13, double d23, double *D)
{
    memset(D, 0, 9 * sizeof(double));
    D[1] = D[3] = d12;
    D[2] = D[6] = d13;
    D[5] = D[7] = d23;
}

/* Taylor and Krishna (1993) explicit ternary ideal-gas [D], species 3
 * (index 2) dependent, row-major over species 1, 2. */
static void tk_ternary(double d12, double d13, double d23, const double *x,
                       long double *F)
{
    long double D12 = d12, D13 = d13, D23 = d23;
    long double x1 = x[0], x2 = x[1], x3 = x[2];
    long double S = x1 * D23 + x2 * D13 + x3 * D12;
    F[0] = D13 * (x1 * D23 + (1.0L - x1) * D12) / S;
    F[1] = x1 * D23 * (D13 - D12) / S;
    F[2] = x2 * D13 * (D23 - D12) / S;
    F[3] = D23 * (x2 * D13 + (1.0L - x2) * D12) / S;
}

/* Independent [D] = [B]^-1 (Taylor and Krishna 1993, ch. 2, B_ii =
 * x_i/Đ_in + sum_{k != i} x_k/Đ_ik, B_ij = -x_i (1/Đ_ij - 1/Đ_in)) for
 * any n <= NMAX, dependent species dep, by Gauss-Jordan in long double. */
static void ref_fick(size_t n, const double *Dij, const double *x, size_t dep,
                     long double *F)
{
    size_t idx[NMAX], m = 0;
    long double R[NMAX][2 * NMAX];
    for (size_t i = 0; i < n; i++)
        if (i != dep)
            idx[m++] = i;
    for (size_t a = 0; a < m; a++) {
        size_t i = idx[a];
        for (size_t b = 0; b < m; b++) {
            size_t j = idx[b];
            long double v;
            if (a == b) {
                v = (long double)x[i] / Dij[i * n + dep];
                for (size_t k = 0; k < n; k++)
                    if (k != i)
                        v += (long double)x[k] / Dij[i * n + k];
            } else {
                v = -(long double)x[i] *
                    (1.0L / Dij[i * n + j] - 1.0L / Dij[i * n + dep]);
            }
            R[a][b] = v;
            R[a][m + b] = (a == b) ? 1.0L : 0.0L;
        }
    }
    for (size_t p = 0; p < m; p++) {
        size_t piv = p;
        for (size_t a = p + 1; a < m; a++)
            if (fabsl(R[a][p]) > fabsl(R[piv][p]))
                piv = a;
        for (size_t b = 0; b < 2 * m; b++) {
            long double t = R[p][b];
            R[p][b] = R[piv][b];
            R[piv][b] = t;
        }
        long double d = R[p][p];
        for (size_t b = 0; b < 2 * m; b++)
            R[p][b] /= d;
        for (size_t a = 0; a < m; a++) {
            if (a == p)
                continue;
            long double f = R[a][p];
            for (size_t b = 0; b < 2 * m; b++)
                R[a][b] -= f * R[p][b];
        }
    }
    for (size_t a = 0; a < m; a++)
        for (size_t b = 0; b < m; b++)
            F[a * m + b] = R[a][m + b];
}

/* Molar -> mass frame: [D°] = (1/Mbar) [A] [D] [Q] with
 * A_ik = M_i δ_ik - w_i (M_k - M_n)   (from j_i = M_i J_i - w_i sum M_k J_k
 *                                      and J_n = -sum_{k != n} J_k)
 * Q_kj = Mbar (δ_kj / M_k - x_k (1/M_j - 1/M_n))   (grad x = Q grad w)
 * and rho = c Mbar. Indices over the species != n. */
static void ref_mass_frame(size_t n, const double *M, const double *x,
                           size_t dep, const long double *F, long double *Fo)
{
    size_t idx[NMAX], m = 0;
    long double Mbar = 0.0L, w[NMAX];
    long double A[NMAX][NMAX], Q[NMAX][NMAX], T[NMAX][NMAX];
    for (size_t i = 0; i < n; i++)
        Mbar += (long double)x[i] * M[i];
    for (size_t i = 0; i < n; i++)
        w[i] = (long double)x[i] * M[i] / Mbar;
    for (size_t i = 0; i < n; i++)
        if (i != dep)
            idx[m++] = i;
    long double Mn = M[dep];
    for (size_t a = 0; a < m; a++)
        for (size_t b = 0; b < m; b++) {
            size_t i = idx[a], k = idx[b];
            A[a][b] = (a == b ? (long double)M[i] : 0.0L) -
                      w[i] * ((long double)M[k] - Mn);
            Q[a][b] = Mbar * ((a == b ? 1.0L / M[i] : 0.0L) -
                              (long double)x[i] * (1.0L / M[k] - 1.0L / Mn));
        }
    for (size_t a = 0; a < m; a++)
        for (size_t b = 0; b < m; b++) {
            long double s = 0.0L;
            for (size_t k = 0; k < m; k++)
                s += F[a * m + k] * Q[k][b];
            T[a][b] = s;
        }
    for (size_t a = 0; a < m; a++)
        for (size_t b = 0; b < m; b++) {
            long double s = 0.0L;
            for (size_t k = 0; k < m; k++)
                s += A[a][k] * T[k][b];
            Fo[a * m + b] = s / Mbar;
        }
}

static void lib_fick(size_t n, const double *M, const double *Dij,
                     const double *x, mcd_basis basis, size_t dep, double *out,
                     size_t *used)
{
    mcd_status st = mcd_fick_matrix(ws,
                                    &(mcd_state){.n_species = n,
                                                 .M = M,
                                                 .Dij = Dij,
                                                 .comp_basis = MCD_BASIS_MOLE,
                                                 .comp = x},
                                    basis, dep, out, used);
    ck_assert_msg(st == MCD_OK, "mcd_fick_matrix: %s (%s)",
                  mcd_status_string(st), mcd_last_error());
}

static long double max_absl(const long double *v, size_t n)
{
    long double m = 0.0L;
    for (size_t i = 0; i < n; i++)
        if (fabsl(v[i]) > m)
            m = fabsl(v[i]);
    return m;
}

/* Largest deviation relative to the largest reference entry. */
static double rel_dev(const double *D, const long double *R, size_t len)
{
    long double s = max_absl(R, len), e = 0.0L;
    for (size_t k = 0; k < len; k++) {
        long double d = fabsl((long double)D[k] - R[k]);
        if (d > e)
            e = d;
    }
    return (double)(e / s);
}

/* ------------------------------------------------------------------ */
/* Worked examples                                                     */
/* ------------------------------------------------------------------ */

/* Carty and Schrodt (1975) data as in Taylor and Krishna (1993), ch. 2
 * (from memory), mole fractions at the liquid surface. */
static const double CS_D12 = 8.48e-6, CS_D13 = 13.72e-6, CS_D23 = 19.91e-6;
static const double CS_X[3] = {0.319, 0.528, 0.153};
/* Molar masses [kg/mol]: acetone C3H6O, methanol CH4O from IUPAC atomic
 * weights; air 28.9586e-3 (dry air, common practice). */
static const double CS_M[3] = {58.0791e-3, 32.0419e-3, 28.9586e-3};

/* Duncan and Toor (1962) mean composition, Đ via Taylor and Krishna. */
static const double DT_D12 = 83.3e-6, DT_D13 = 68.0e-6, DT_D23 = 16.8e-6;
static const double DT_X[3] = {0.25, 0.50, 0.25};
static const double DT_M[3] = {2.01588e-3, 28.0134e-3, 44.0095e-3};

/* Agreement tolerance 1e-12 relative to the largest entry: both sides are
 * a 2x2 inverse of a matrix with condition number below 10 here; double
 * rounding gives ~1e-16, so 1e-12 is loose for round-off and tight for any
 * formula error (which would show at 1e-3 or worse). */
#define FICK_TOL 1e-12

START_TEST(fick_example_stefan_tube_matches_published_formula)
{
    double Dij[9];
    sym3(CS_D12, CS_D13, CS_D23, Dij);
    long double Ftk[4], Fb[4];
    tk_ternary(CS_D12, CS_D13, CS_D23, CS_X, Ftk);
    ref_fick(3, Dij, CS_X, 2, Fb);
    /* The recalled formula equals the B-matrix inverse (checks the
     * recollection; long double, so 1e-15). */
    ck_assert(rel_dev((const double[]){(double)Fb[0], (double)Fb[1],
                                       (double)Fb[2], (double)Fb[3]},
                      Ftk, 4) < 1e-15);

    double D[4] = {12345.678, 12345.678, 12345.678, 12345.678};
    size_t used = 99;
    lib_fick(3, CS_M, Dij, CS_X, MCD_BASIS_MOLE, 2, D, &used);
    ck_assert_uint_eq(used, 2);
    double e = rel_dev(D, Ftk, 4);
    ck_assert_msg(e <= FICK_TOL, "Stefan tube [D] deviation %g", e);
    /* Hand evaluation of the formula with these data: S = 14.8929 mm^2/s,
     * D11 = 11.1712, D12 = 2.23467, D21 = 5.55975, D22 = 15.0355 mm^2/s
     * (6 digits, so tolerance 1e-5 relative). Positive cross terms here:
     * Đ13 > Đ12 and Đ23 > Đ12. */
    static const double hand[4] = {11.1712e-6, 2.23467e-6, 5.55975e-6,
                                   15.0355e-6};
    for (int k = 0; k < 4; k++)
        ck_assert_msg(fabs(D[k] - hand[k]) <= 1e-5 * fabs(hand[k]),
                      "D[%d] = %.8g vs hand %.8g", k, D[k], hand[k]);
}
END_TEST

START_TEST(fick_example_duncan_toor_mean_state_matches_published_formula)
{
    double Dij[9];
    sym3(DT_D12, DT_D13, DT_D23, Dij);
    long double Ftk[4];
    tk_ternary(DT_D12, DT_D13, DT_D23, DT_X, Ftk);
    double D[4];
    size_t used = 99;
    lib_fick(3, DT_M, Dij, DT_X, MCD_BASIS_MOLE, 2, D, &used);
    ck_assert_uint_eq(used, 2);
    double e = rel_dev(D, Ftk, 4);
    ck_assert_msg(e <= FICK_TOL, "Duncan-Toor [D] deviation %g", e);
    /* Hand evaluation of the formula: S = 59.025 mm^2/s,
     * D11 = 68.0 * 66.675 / S = 76.8132, D12 = 4.2 * (-15.3) / S = -1.08869,
     * D21 = 34.0 * (-66.5) / S = -38.3058, D22 = 16.8 * 75.65 / S = 21.5319
     * mm^2/s (rounded to 6 digits, so tolerance 1e-5 relative). */
    static const double hand[4] = {76.8132e-6, -1.08869e-6, -38.3058e-6,
                                   21.5319e-6};
    for (int k = 0; k < 4; k++)
        ck_assert_msg(fabs(D[k] - hand[k]) <= 1e-5 * fabs(hand[k]),
                      "D[%d] = %.8g vs hand %.8g", k, D[k], hand[k]);
}
END_TEST

/* Hand calculation with the published formula and exact binary fractions:
 * Đ12 = 1, Đ13 = 2, Đ23 = 4 (x 1e-5 m^2/s), x = (1/4, 1/4, 1/2):
 * S = 1 + 0.5 + 0.5 = 2, D11 = 2 (1 + 0.75)/2 = 1.75, D12 = 1 * 1 / 2 = 0.5,
 * D21 = 0.5 * 3 / 2 = 0.75, D22 = 4 (0.5 + 0.75)/2 = 2.5 (x 1e-5). */
START_TEST(fick_example_hand_calculation_exact_fractions)
{
    double Dij[9];
    static const double x[3] = {0.25, 0.25, 0.5};
    sym3(1e-5, 2e-5, 4e-5, Dij);
    double D[4];
    lib_fick(3, NULL, Dij, x, MCD_BASIS_MOLE, 2, D, NULL);
    static const double hand[4] = {1.75e-5, 0.5e-5, 0.75e-5, 2.5e-5};
    for (int k = 0; k < 4; k++)
        /* exact rationals up to the representation of 1e-5 and a few
         * roundings in the solve: 64 eps of the largest entry. */
        ck_assert_msg(fabs(D[k] - hand[k]) <= 64 * DBL_EPSILON * 2.5e-5,
                      "D[%d] = %.17g vs %.17g", k, D[k], hand[k]);
}
END_TEST

/* Limiting cases stated in Taylor and Krishna (1993), ch. 2. */
START_TEST(fick_example_limiting_cases)
{
    double Dij[9], D[4];
    static const double x[3] = {0.2, 0.3, 0.5};
    /* All Đ equal: [D] = Đ [I]. */
    sym3(3e-5, 3e-5, 3e-5, Dij);
    lib_fick(3, NULL, Dij, x, MCD_BASIS_MOLE, 2, D, NULL);
    /* round-off only: 1e-13 of Đ */
    ck_assert(fabs(D[0] - 3e-5) <= 1e-13 * 3e-5);
    ck_assert(fabs(D[3] - 3e-5) <= 1e-13 * 3e-5);
    ck_assert(fabs(D[1]) <= 1e-13 * 3e-5);
    ck_assert(fabs(D[2]) <= 1e-13 * 3e-5);
    /* Đ12 = Đ13: species 1 sees 2 and 3 alike, so D12 = 0 and
     * D11 = Đ12 (the binary value). */
    sym3(5e-5, 5e-5, 1e-5, Dij);
    lib_fick(3, NULL, Dij, x, MCD_BASIS_MOLE, 2, D, NULL);
    ck_assert(fabs(D[1]) <= 1e-13 * 5e-5);
    ck_assert(fabs(D[0] - 5e-5) <= 1e-13 * 5e-5);
}
END_TEST

/* Binary: [D] = Đ12 in the molar frame, and the same number in the mass
 * frame (Bird, Stewart and Lightfoot 2002; Taylor and Krishna 1993). */
START_TEST(fick_example_binary_same_in_both_frames)
{
    static const double M[2] = {2.01588e-3, 44.0095e-3};
    double Dij[4] = {0.0, 68.0e-6, 68.0e-6, 0.0};
    for (int k = 1; k < 10; k++) {
        double x[2] = {k / 10.0, 1.0 - k / 10.0};
        double Dm = 0.0, Dw = 0.0;
        lib_fick(2, M, Dij, x, MCD_BASIS_MOLE, MCD_DEPENDENT_AUTO, &Dm, NULL);
        lib_fick(2, M, Dij, x, MCD_BASIS_MASS, MCD_DEPENDENT_AUTO, &Dw, NULL);
        ck_assert_msg(fabs(Dm - 68.0e-6) <= 1e-14 * 68.0e-6 * 10, "molar %g",
                      Dm);
        ck_assert_msg(fabs(Dw - 68.0e-6) <= 1e-13 * 68.0e-6, "mass %.17g", Dw);
    }
}
END_TEST

/* ------------------------------------------------------------------ */
/* Mass frame and eigenvalues of the worked examples                   */
/* ------------------------------------------------------------------ */

static void check_mass_frame_and_eigen(const double *M, const double *Dij,
                                       const double *x)
{
    long double Fref[4], Foref[4];
    double D[4], Do[4];
    ref_fick(3, Dij, x, 2, Fref);
    ref_mass_frame(3, M, x, 2, Fref, Foref);
    lib_fick(3, M, Dij, x, MCD_BASIS_MOLE, 2, D, NULL);
    lib_fick(3, M, Dij, x, MCD_BASIS_MASS, 2, Do, NULL);
    double e = rel_dev(Do, Foref, 4);
    /* Products of matrices with entries up to M_i/Mbar ~ 20 in the H2
     * system: allow 1e-11. */
    ck_assert_msg(e <= 1e-11, "mass-frame [D] deviation %g", e);

    /* Same eigenvalues in both frames (similarity transform), real,
     * positive, and equal to the roots of the characteristic polynomial. */
    long double tr = Fref[0] + Fref[3],
                det = Fref[0] * Fref[3] - Fref[1] * Fref[2];
    long double disc = tr * tr - 4.0L * det;
    ck_assert(disc > 0.0L);
    long double l1 = 0.5L * (tr + sqrtl(disc)), l2 = det / l1;
    double re[2], im[2], reo[2], imo[2];
    ck_assert_int_eq(mcd_fick_eigenvalues(ws, 2, D, re, im), MCD_OK);
    ck_assert_int_eq(mcd_fick_eigenvalues(ws, 2, Do, reo, imo), MCD_OK);
    ck_assert(fabsl(re[0] - l1) <= 1e-12L * l1 &&
              fabsl(re[1] - l2) <= 1e-12L * l1);
    ck_assert(fabsl(reo[0] - l1) <= 1e-11L * l1 &&
              fabsl(reo[1] - l2) <= 1e-11L * l1);
    ck_assert(im[0] == 0.0 && im[1] == 0.0 && imo[0] == 0.0 && imo[1] == 0.0);
    ck_assert(re[1] > 0.0 && reo[1] > 0.0);

    /* Eigenvalues independent of the dependent species. */
    for (size_t dep = 0; dep < 2; dep++) {
        double D2[4], r2[2], i2[2];
        lib_fick(3, M, Dij, x, MCD_BASIS_MOLE, dep, D2, NULL);
        ck_assert_int_eq(mcd_fick_eigenvalues(ws, 2, D2, r2, i2), MCD_OK);
        ck_assert(fabsl(r2[0] - l1) <= 1e-12L * l1 &&
                  fabsl(r2[1] - l2) <= 1e-12L * l1);
    }
}

START_TEST(fick_example_stefan_tube_mass_frame_and_eigenvalues)
{
    double Dij[9];
    sym3(CS_D12, CS_D13, CS_D23, Dij);
    check_mass_frame_and_eigen(CS_M, Dij, CS_X);
}
END_TEST

START_TEST(fick_example_duncan_toor_mass_frame_and_eigenvalues)
{
    double Dij[9];
    sym3(DT_D12, DT_D13, DT_D23, Dij);
    check_mass_frame_and_eigen(DT_M, Dij, DT_X);
}
END_TEST

/* The mass-frame matrix reproduces the mass fluxes: j from
 * mcd_flux_compute (mass basis) equals -rho [D°] grad w for the species
 * other than the dependent one. */
START_TEST(fick_example_mass_frame_matrix_gives_mass_fluxes)
{
    double Dij[9];
    sym3(CS_D12, CS_D13, CS_D23, Dij);
    const double c =
        99.4e3 / (MCD_GAS_CONSTANT * 328.5);  /* T&K example (from memory) */
    double w[3], gw[3] = {-25.0, 11.0, 14.0}; /* invented gradient [1/m] */
    ck_assert_int_eq(mcd_comp_x_to_w(3, CS_M, CS_X, w), MCD_OK);
    double Mbar = 0.0;
    for (int i = 0; i < 3; i++)
        Mbar += CS_X[i] * CS_M[i];
    double rho = c * Mbar;
    double Do[4], jlib[3], jfick[3];
    lib_fick(3, CS_M, Dij, CS_X, MCD_BASIS_MASS, 2, Do, NULL);
    ck_assert_int_eq(mcd_fick_fluxes(3, 1, Do, 2, rho, gw, jfick), MCD_OK);
    ck_assert_int_eq(mcd_flux_compute(ws, MCD_MODEL_MAXWELL_STEFAN,
                                      &(mcd_state){.n_species = 3,
                                                   .n_dim = 1,
                                                   .M = CS_M,
                                                   .Dij = Dij,
                                                   .c = c,
                                                   .comp_basis = MCD_BASIS_MASS,
                                                   .comp = w,
                                                   .grad = gw},
                                      MCD_BASIS_MASS, jlib),
                     MCD_OK);
    double s = fmax(fabs(jlib[0]), fmax(fabs(jlib[1]), fabs(jlib[2])));
    for (int i = 0; i < 3; i++)
        ck_assert_msg(fabs(jlib[i] - jfick[i]) <= 1e-11 * s, "j[%d] %g vs %g",
                      i, jlib[i], jfick[i]);
}
END_TEST

/* ------------------------------------------------------------------ */
/* Sweeps: the formula and the frame change over many random states    */
/* ------------------------------------------------------------------ */

START_TEST(fick_example_formula_holds_over_random_ternaries)
{
    double worst = 0.0, worst_mass = 0.0;
    for (int t = 0; t < 500; t++) {
        double d12 = 1e-6 * pow(100.0, sup_u01(&rng));
        double d13 = 1e-6 * pow(100.0, sup_u01(&rng));
        double d23 = 1e-6 * pow(100.0, sup_u01(&rng));
        double x[3], M[3], Dij[9];
        double a = 0.02 + sup_u01(&rng), b = 0.02 + sup_u01(&rng),
               cc = 0.02 + sup_u01(&rng);
        x[0] = a / (a + b + cc);
        x[1] = b / (a + b + cc);
        x[2] = 1.0 - x[0] - x[1];
        for (int i = 0; i < 3; i++)
            M[i] = 2e-3 + 0.2 * sup_u01(&rng);
        sym3(d12, d13, d23, Dij);
        long double Ftk[4], Foref[4];
        tk_ternary(d12, d13, d23, x, Ftk);
        double D[4], Do[4];
        lib_fick(3, M, Dij, x, MCD_BASIS_MOLE, 2, D, NULL);
        double e = rel_dev(D, Ftk, 4);
        if (e > worst)
            worst = e;
        ref_mass_frame(3, M, x, 2, Ftk, Foref);
        lib_fick(3, M, Dij, x, MCD_BASIS_MASS, 2, Do, NULL);
        double em = rel_dev(Do, Foref, 4);
        if (em > worst_mass)
            worst_mass = em;
        /* Eigenvalues real and positive for every ideal-gas state. */
        double re[2], im[2];
        ck_assert_int_eq(mcd_fick_eigenvalues(ws, 2, D, re, im), MCD_OK);
        ck_assert(im[0] == 0.0 && im[1] == 0.0 && re[1] > 0.0);
    }
    /* Đ spans two decades and molar masses a factor 100, so the 2x2
     * problems have condition numbers up to ~1e4: 1e-10 of the largest
     * entry. */
    ck_assert_msg(worst <= 1e-10, "worst molar deviation %g", worst);
    ck_assert_msg(worst_mass <= 1e-9, "worst mass deviation %g", worst_mass);
}
END_TEST

/* Quaternary and larger: library [D] against the independent B inverse
 * (the same published definition, Taylor and Krishna 1993, ch. 2). */
START_TEST(fick_example_b_inverse_holds_for_more_species)
{
    size_t n = (size_t)_i;
    double worst = 0.0;
    for (int t = 0; t < 100; t++) {
        double Dij[NMAX * NMAX], x[NMAX], s = 0.0;
        for (size_t i = 0; i < n; i++) {
            x[i] = 0.02 + sup_u01(&rng);
            s += x[i];
            Dij[i * n + i] = 0.0;
            for (size_t j = 0; j < i; j++)
                Dij[i * n + j] = Dij[j * n + i] =
                    1e-6 * pow(100.0, sup_u01(&rng));
        }
        for (size_t i = 0; i < n; i++)
            x[i] /= s;
        size_t used = 99;
        double D[(NMAX - 1) * (NMAX - 1)];
        lib_fick(n, NULL, Dij, x, MCD_BASIS_MOLE, MCD_DEPENDENT_AUTO, D, &used);
        size_t am = 0;
        for (size_t i = 1; i < n; i++)
            if (x[i] > x[am])
                am = i;
        ck_assert_uint_eq(used, am);
        long double F[(NMAX - 1) * (NMAX - 1)];
        ref_fick(n, Dij, x, used, F);
        double e = rel_dev(D, F, (n - 1) * (n - 1));
        if (e > worst)
            worst = e;
    }
    ck_assert_msg(worst <= 1e-10, "n=%zu worst deviation %g", n, worst);
}
END_TEST

static Suite *fick_example_suite(void)
{
    Suite *s = suite_create("mcd:fick_example");
    TCase *tc = tcase_create("fick_example");
    tcase_add_checked_fixture(tc, setup, teardown);
    tcase_add_test(tc, fick_example_stefan_tube_matches_published_formula);
    tcase_add_test(
        tc, fick_example_duncan_toor_mean_state_matches_published_formula);
    tcase_add_test(tc, fick_example_hand_calculation_exact_fractions);
    tcase_add_test(tc, fick_example_limiting_cases);
    tcase_add_test(tc, fick_example_binary_same_in_both_frames);
    tcase_add_test(tc, fick_example_stefan_tube_mass_frame_and_eigenvalues);
    tcase_add_test(tc, fick_example_duncan_toor_mass_frame_and_eigenvalues);
    tcase_add_test(tc, fick_example_mass_frame_matrix_gives_mass_fluxes);
    tcase_add_test(tc, fick_example_formula_holds_over_random_ternaries);
    tcase_add_loop_test(tc, fick_example_b_inverse_holds_for_more_species, 4,
                        NMAX + 1);
    suite_add_tcase(s, tc);
    return s;
}

int main(void) { return sup_run(fick_example_suite()); }
