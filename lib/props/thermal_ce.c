/* thermal_ce.c - thermal diffusion factors from kinetic theory: the
 * Lennard-Jones collision integrals beyond Omega(1,1)* and Omega(2,2)*,
 * the binary thermal diffusion factor alpha_T in the first Chapman-Enskog
 * approximation, and pairwise thermal diffusion ratios of a mixture.
 * Closed forms and a table look-up: no allocation, no linear algebra.
 *
 * Collision integrals: props/collision_table.c holds Omega(1,1)*,
 * Omega(1,2)*, Omega(1,3)* and Omega(2,2)* of the 12-6 potential at 201
 * points uniform in ln T* on [0.3, 100], computed by tools/gen_collision.c
 * by direct quadrature of the kinetic-theory definitions (Hirschfelder,
 * Curtiss and Bird 1954, eqs. 8.2-1 to 8.2-5: classical deflection angle,
 * cross sections, thermal average). The tool checks itself on the
 * r^-12 potential, whose ratios C* = 17/18 and B* are exact; the table
 * agrees with the Neufeld, Janzen and Aziz (1972) fits of Omega(1,1)* and
 * Omega(2,2)* that the library already uses (tests/test_thermal_kt.c).
 * Interpolation: cubic Lagrange in ln T* on ln Omega, step 0.029 in
 * ln T*; its error (h^4 times the fourth derivative) is below 1e-7.
 * Ratios (HCB eqs. 8.2-15 to 8.2-17):
 *   A* = Omega(2,2)* / Omega(1,1)*,
 *   B* = (5 Omega(1,2)* - 4 Omega(1,3)*) / Omega(1,1)*,
 *   C* = Omega(1,2)* / Omega(1,1)*.
 *
 * Thermal diffusion factor, first Chapman-Enskog approximation (Chapman
 * and Cowling, The Mathematical Theory of Non-Uniform Gases, ch. 9;
 * Hirschfelder, Curtiss and Bird 1954, eqs. 8.2-50 to 8.2-56; written
 * from memory and checked below against the isotopic limit, which was
 * recalled separately), with mu_i = M_i / (M_1 + M_2):
 *   alpha_T = (6 C* - 5) (x1 S1 - x2 S2) / (x1^2 Q1 + x2^2 Q2 + x1 x2 Q12),
 *   S1  = (mu1 / mu2) sqrt(2 mu2) R1 - 4 mu1 mu2 A* - (15/2) mu2 (mu2 - mu1),
 *   Q1  = (2 / mu2) sqrt(2 mu2) R1 [(5/2 - (6/5) B*) mu1^2 + 3 mu2^2
 *                                   + (8/5) A* mu1 mu2],
 *   Q12 = 15 (mu1 - mu2)^2 (5/2 - (6/5) B*) + 4 mu1 mu2 A* (11 - (12/5) B*)
 *         + (8/5) R1 R2 / sqrt(mu1 mu2),
 *   R1  = sigma_1^2 Omega(2,2)*(T / eps_1) / (sigma_12^2 Omega(1,1)*(T /
 *         eps_12)),
 * S2, Q2, R2 by exchanging 1 and 2; A*, B*, C* of the unlike pair at
 * T / eps_12; sigma_12 = (sigma_1 + sigma_2) / 2, eps_12 = sqrt(eps_1
 * eps_2). k_T = x1 x2 alpha_T; alpha_T > 0 when species 1 moves to the
 * cold side (the sign of mcd_state.kT). Checks of the form:
 *  - isotopes (M1 -> M2, equal sigma and eps): alpha_T -> 15 (2A* + 5)
 *    (6C* - 5) / (2 A* (16 A* - 12 B* + 55)) (M1 - M2) / (M1 + M2),
 *    independent of composition; for rigid spheres (A* = B* = C* = 1)
 *    105/118 (M1 - M2) / (M1 + M2) (from memory, the classic isotopic
 *    value); the composition independence fixes the 8/5 of Q12's last
 *    term, which the three memories give alike;
 *  - Maxwell molecules (r^-4 repulsion, 6 C* - 5 = 0): alpha_T = 0;
 *  - the heavier species goes to the cold side (S2 dominates when M2 >>
 *    M1).
 * The first approximation is known to lie below the converged
 * Chapman-Enskog value, by up to some 10 % for very unequal masses (from
 * memory); polyatomic gases lose part of their thermal diffusion to
 * inelastic collisions (lower alpha_T, up to some 30 %, from memory).
 *
 * Mixtures (our choice of a published building block, documented in the
 * header): pairwise additive ratios
 *   k_T,i = sum_{j != i} x_i x_j alpha_T,ij(x_i / (x_i + x_j)),
 * each alpha_T,ij the binary first approximation at the pair's own
 * composition. alpha_T,ij = -alpha_T,ji, so sum_i k_T,i = 0 exactly
 * (each pair adds +t and -t); N = 2 is the binary exactly; a trace species
 * gets x_i sum_j x_j alpha_T,ij(0), the usual estimate for a light trace
 * species in a mixture (Chapman and Cowling's Lorentzian-type limit, from
 * memory). It ignores how a third species changes the pair's
 * velocity distribution: fair for light species (H2, He) in heavier
 * gases, rough between heavy species in the presence of light ones.
 */
#include <math.h>
#include <string.h>

#include "base/mcd_internal.h"
#include "base/checks.h"
#include "props/binary.h"
#include "props/collision.h"
#include "props/mixture.h"

int mcdi_collision(double T_star, double out[4])
{
    const double u0 = log(MCDI_COLL_TMIN);
    const double h = (log(MCDI_COLL_TMAX) - u0) / (MCDI_COLL_NT - 1);
    double t, u, w[4];
    int clamped = 0;
    long i;
    size_t q, k;
    if (!(T_star >= MCDI_COLL_TMIN)) {
        T_star = MCDI_COLL_TMIN;
        clamped = 1;
    } else if (T_star > MCDI_COLL_TMAX) {
        T_star = MCDI_COLL_TMAX;
        clamped = 1;
    }
    u = (log(T_star) - u0) / h;
    i = (long)floor(u) - 1; /* stencil i .. i + 3 around u */
    if (i < 0)
        i = 0;
    if (i > MCDI_COLL_NT - 4)
        i = MCDI_COLL_NT - 4;
    t = u - (double)i; /* position in the stencil, nodes at 0, 1, 2, 3 */
    w[0] = -(t - 1.0) * (t - 2.0) * (t - 3.0) / 6.0;
    w[1] = t * (t - 2.0) * (t - 3.0) / 2.0;
    w[2] = -t * (t - 1.0) * (t - 3.0) / 2.0;
    w[3] = t * (t - 1.0) * (t - 2.0) / 6.0;
    for (q = 0; q < 4; q++) {
        double s = 0.0;
        for (k = 0; k < 4; k++)
            s += w[k] * log(mcdi_collision_table[(size_t)i + k][q]);
        out[q] = exp(s);
    }
    return clamped;
}

/* The first-approximation formula above; masses enter only through
 * mu1 = M1 / (M1 + M2). Inputs assumed valid. */
static double alpha_first(double mu1, double x1, double A, double B, double C,
                          double R1, double R2)
{
    const double mu2 = 1.0 - mu1, x2 = 1.0 - x1;
    const double b = 2.5 - 1.2 * B;
    const double S1 = mu1 / mu2 * sqrt(2.0 * mu2) * R1 - 4.0 * mu1 * mu2 * A -
                      7.5 * mu2 * (mu2 - mu1);
    const double S2 = mu2 / mu1 * sqrt(2.0 * mu1) * R2 - 4.0 * mu1 * mu2 * A -
                      7.5 * mu1 * (mu1 - mu2);
    const double Q1 = 2.0 / mu2 * sqrt(2.0 * mu2) * R1 *
                      (b * mu1 * mu1 + 3.0 * mu2 * mu2 + 1.6 * A * mu1 * mu2);
    const double Q2 = 2.0 / mu1 * sqrt(2.0 * mu1) * R2 *
                      (b * mu2 * mu2 + 3.0 * mu1 * mu1 + 1.6 * A * mu1 * mu2);
    const double Q12 = 15.0 * (mu1 - mu2) * (mu1 - mu2) * b +
                       4.0 * mu1 * mu2 * A * (11.0 - 2.4 * B) +
                       1.6 * R1 * R2 / sqrt(mu1 * mu2);
    return (6.0 * C - 5.0) * (x1 * S1 - x2 * S2) /
           (x1 * x1 * Q1 + x2 * x2 * Q2 + x1 * x2 * Q12);
}

mcd_status mcdi_api_lj_collision_integrals(double T_star, double *out_omega,
                                           double *out_ratios)
{
    double o[4];
    mcd_status st;
    if (out_omega == NULL && out_ratios == NULL)
        return mcdi_fail(MCD_EINVAL, "argument out_omega: NULL together "
                                     "with out_ratios (nothing to compute)");
    if ((st = mcdi_check_positive(NULL, T_star, "T_star")) != MCD_OK)
        return st;
    if (T_star < MCDI_COLL_TMIN || T_star > MCDI_COLL_TMAX)
        return mcdi_fail(MCD_EDOM,
                         "argument T_star: %g is outside the "
                         "table's range 0.3..100",
                         T_star);
    mcdi_collision(T_star, o);
    if (out_omega != NULL)
        memcpy(out_omega, o, sizeof o);
    if (out_ratios != NULL) {
        out_ratios[0] = o[3] / o[0];
        out_ratios[1] = (5.0 * o[1] - 4.0 * o[2]) / o[0];
        out_ratios[2] = o[1] / o[0];
    }
    return MCD_OK;
}

/* Checks of the kinetic call's inputs; writes nothing. */
static mcd_status check_kinetic(double M1, double M2, double x1,
                                const double q[5])
{
    static const char *const names[5] = {"A", "B", "C", "R1", "R2"};
    mcd_status st;
    size_t k;
    if ((st = mcdi_check_positive2(M1, "M1", M2, "M2")) != MCD_OK)
        return st;
    if (!mcdi_finite(x1))
        return mcdi_fail(MCD_EINVAL, "argument x1: not finite");
    if (!(x1 >= 0.0 && x1 <= 1.0))
        return mcdi_fail(MCD_EDOM, "argument x1: %g is not in [0, 1]", x1);
    for (k = 0; k < 5; k++)
        if ((st = mcdi_check_positive(NULL, q[k], names[k])) != MCD_OK)
            return st;
    return MCD_OK;
}

/* Finite result or EDOM (a denominator lost to extreme inputs). */
static mcd_status put_alpha(double a, double *out_alpha)
{
    if (!mcdi_finite(a))
        return mcdi_fail(MCD_EDOM, "result: alpha_T is not finite (inputs "
                                   "outside the representable range)");
    *out_alpha = a;
    return MCD_OK;
}

mcd_status mcdi_api_thermal_factor_kinetic(double M1, double M2, double x1,
                                           double A, double B, double C,
                                           double R1, double R2,
                                           double *out_alpha)
{
    const double q[5] = {A, B, C, R1, R2};
    mcd_status st;
    if ((st = mcdi_check_ptr(NULL, out_alpha, "out_alpha")) != MCD_OK ||
        (st = check_kinetic(M1, M2, x1, q)) != MCD_OK)
        return st;
    return put_alpha(alpha_first(M1 / (M1 + M2), x1, A, B, C, R1, R2),
                     out_alpha);
}

/* alpha_T of a Lennard-Jones pair (inputs valid); sets
 * MCD_WARN_TEMPERATURE in *warn when a T* left the table. */
static double alpha_lj(double T, double M1, double M2, double s1, double s2,
                       double e1, double e2, double x1, unsigned *warn)
{
    double o12[4], o1[4], o2[4], s12 = 0.5 * (s1 + s2), R1, R2;
    int out = mcdi_collision(T / sqrt(e1 * e2), o12);
    out |= mcdi_collision(T / e1, o1);
    out |= mcdi_collision(T / e2, o2);
    if (out)
        *warn |= MCD_WARN_TEMPERATURE;
    R1 = (s1 / s12) * (s1 / s12) * o1[3] / o12[0];
    R2 = (s2 / s12) * (s2 / s12) * o2[3] / o12[0];
    return alpha_first(M1 / (M1 + M2), x1, o12[3] / o12[0],
                       (5.0 * o12[1] - 4.0 * o12[2]) / o12[0], o12[1] / o12[0],
                       R1, R2);
}

mcd_status mcdi_api_thermal_factor_ce(double T, double M1, double M2,
                                      double sig1, double sig2, double eps1,
                                      double eps2, double x1, double *out_alpha,
                                      unsigned *out_warn)
{
    const double one[5] = {1.0, 1.0, 1.0, 1.0, 1.0};
    unsigned w = 0;
    mcd_status st;
    if ((st = mcdi_check_ptr(NULL, out_alpha, "out_alpha")) != MCD_OK ||
        (st = mcdi_check_positive(NULL, T, "T")) != MCD_OK ||
        (st = check_kinetic(M1, M2, x1, one)) != MCD_OK ||
        (st = mcdi_check_positive2(sig1, "sig1", sig2, "sig2")) != MCD_OK ||
        (st = mcdi_check_positive2(eps1, "eps1", eps2, "eps2")) != MCD_OK)
        return st;
    st = put_alpha(alpha_lj(T, M1, M2, sig1, sig2, eps1, eps2, x1, &w),
                   out_alpha);
    if (st == MCD_OK && out_warn != NULL)
        *out_warn = w;
    return st;
}

/* alpha_T of two copied species with warnings. Fails: ENODATA, EDOM. */
static mcd_status spec_alpha(const mcdi_spec *a, const mcdi_spec *b, double T,
                             double xa, double *out_alpha, unsigned *out_warn)
{
    double sa, sb, ea, eb;
    int est = 0;
    unsigned w;
    mcd_status st;
    if (!((a->known >> MCD_PARAM_MOLAR_MASS) & 1u) ||
        !((b->known >> MCD_PARAM_MOLAR_MASS) & 1u))
        return mcdi_fail(MCD_ENODATA,
                         "species '%s' has no molar mass (needed by the "
                         "thermal diffusion factor)",
                         ((a->known >> MCD_PARAM_MOLAR_MASS) & 1u) ? b->name
                                                                   : a->name);
    if ((st = mcdi_lj_params(a, MCD_METHOD_CHAPMAN_ENSKOG, &sa, &ea, &est)) !=
            MCD_OK ||
        (st = mcdi_lj_params(b, MCD_METHOD_CHAPMAN_ENSKOG, &sb, &eb, &est)) !=
            MCD_OK)
        return st;
    w = mcdi_pair_state_warnings(a, b, T, 0.0);
    if (est)
        w |= MCD_WARN_ESTIMATED_PARAM;
    st = put_alpha(alpha_lj(T, a->p[MCD_PARAM_MOLAR_MASS],
                            b->p[MCD_PARAM_MOLAR_MASS], sa, sb, ea, eb, xa, &w),
                   out_alpha);
    *out_warn = w;
    return st;
}

mcd_status mcdi_api_db_thermal_factor(const mcd_db *db, size_t a, size_t b,
                                      double T, double x_a, double *out_alpha,
                                      double *out_rel_err, unsigned *out_warn)
{
    mcdi_spec sa, sb;
    double alpha;
    unsigned w = 0;
    mcd_status st;
    if ((st = MCDI_CHECK_PTRS2(db, out_alpha)) != MCD_OK ||
        (st = mcdi_check_positive(NULL, T, "T")) != MCD_OK)
        return st;
    if (!mcdi_finite(x_a))
        return mcdi_fail(MCD_EINVAL, "argument x_a: not finite");
    if (!(x_a >= 0.0 && x_a <= 1.0))
        return mcdi_fail(MCD_EDOM, "argument x_a: %g is not in [0, 1]", x_a);
    if (mcdi_spec_from_db(db, a, &sa) != MCD_OK)
        return mcdi_fail(MCD_ENOTFOUND,
                         "argument a: %zu is not a species "
                         "index",
                         a);
    if (mcdi_spec_from_db(db, b, &sb) != MCD_OK)
        return mcdi_fail(MCD_ENOTFOUND,
                         "argument b: %zu is not a species "
                         "index",
                         b);
    if (a == b)
        return mcdi_fail(MCD_EINVAL, "argument b: the same species as a");
    if ((st = spec_alpha(&sa, &sb, T, x_a, &alpha, &w)) != MCD_OK)
        return st;
    *out_alpha = alpha;
    if (out_rel_err != NULL) /* widened by the pair's warnings */
        *out_rel_err = mcdi_widen_error(MCD_THERMAL_CE_TYPICAL_ERROR, w);
    if (out_warn != NULL)
        *out_warn = w;
    return MCD_OK;
}

/* One pass over the pairs: k_T,i into out (when not NULL) and the OR of
 * the warnings. Fails: ENODATA, EDOM (nothing written then by the caller,
 * which runs a checking pass first). */
static mcd_status mixture_pass(const mcd_mixture *mix, double T,
                               const double *x, double sum, double *out,
                               double *theta, unsigned *warn)
{
    const size_t n = mix->n;
    size_t i, j;
    for (i = 0; i < n; i++) {
        if (out != NULL)
            out[i] = 0.0;
        if (theta != NULL)
            theta[i] = 0.0;
    }
    for (i = 0; i < n; i++)
        for (j = i + 1; j < n; j++) {
            double xi = x[i] / sum, xj = x[j] / sum, a, t;
            unsigned w = 0;
            mcd_status st;
            st = spec_alpha(&mix->spec[i], &mix->spec[j], T,
                            xi + xj > 0.0 ? xi / (xi + xj) : 0.5, &a, &w);
            if (st != MCD_OK)
                return st;
            *warn |= w;
            t = xi * xj * a;
            if (out != NULL) {
                out[i] += t;
                out[j] -= t;
            }
            if (theta != NULL) { /* k_T,i / x_i, finite when x_i = 0 */
                theta[i] += xj * a;
                theta[j] -= xi * a;
            }
        }
    return MCD_OK;
}

mcd_status mcdi_api_mixture_thermal_ratios(const mcd_mixture *mix, double T,
                                           const double *x, double *out_kT,
                                           double *out_theta,
                                           double *out_rel_err,
                                           unsigned *out_warn)
{
    unsigned w = 0;
    double sum = 0.0;
    size_t i;
    mcd_status st;
    if ((st = MCDI_CHECK_PTRS3(mix, x, out_kT)) != MCD_OK ||
        (st = mcdi_check_positive(NULL, T, "T")) != MCD_OK ||
        (st = mcdi_check_comp(NULL, mix->n, x, "x")) != MCD_OK)
        return st;
    for (i = 0; i < mix->n; i++)
        sum += x[i];
    /* a checking pass, then the writing one: outputs untouched on error */
    if ((st = mixture_pass(mix, T, x, sum, NULL, NULL, &w)) != MCD_OK)
        return st;
    mixture_pass(mix, T, x, sum, out_kT, out_theta, &w);
    if (out_rel_err != NULL) /* widened by the pairs' warnings */
        *out_rel_err =
            mcdi_widen_error(mix->n == 2 ? MCD_THERMAL_CE_TYPICAL_ERROR
                                         : MCD_THERMAL_MIX_TYPICAL_ERROR,
                             w);
    if (out_warn != NULL)
        *out_warn = w;
    return MCD_OK;
}
