/* viscosity.c - gas viscosity: pure species by the first Chapman-Enskog
 * approximation with the Lennard-Jones Omega(2,2) collision integral, and
 * mixtures by Wilke's mixing rule. Closed forms: no linear algebra, no
 * allocation. Inputs are checked so that NaN fails (EINVAL for NaN or
 * infinity, EDOM for values out of range); outputs are written on success
 * only.
 *
 * Typical errors (the header's MCD_VISC_*_TYPICAL_ERROR):
 *  - Chapman-Enskog with Lennard-Jones parameters fitted to viscosity
 *    (Svehla 1962), non-polar gases: about 1.5 %; Poling, Prausnitz and
 *    O'Connell, The Properties of Gases and Liquids, 5th ed. (2001),
 *    sec. 9-4 (from memory). Polar gases and the quantum gases at low T
 *    are worse (flagged).
 *  - Wilke (1950) for mixtures of non-polar gases: about 2 % beyond the
 *    pure-species errors, worse for mixtures with H2 or He with heavy
 *    gases (same source, sec. 9-5, from memory).
 */
#include <math.h>
#include <string.h>

#include "base/mcd_internal.h"
#include "base/checks.h"
#include "props/binary.h"
#include "props/mixture.h"

#define K_BOLTZMANN 1.380649e-23 /* J/K, exact (SI 2019) */
#define N_AVOGADRO 6.02214076e23 /* 1/mol, exact (SI 2019) */
#define PI 3.14159265358979323846

/*
 * Neufeld, Janzen and Aziz, J. Chem. Phys. 57, 1100 (1972): fit of the
 * Lennard-Jones (12-6) collision integral Omega^(2,2)* for viscosity,
 *   Omega_v = A/T*^B + C/exp(D T*) + E/exp(F T*) + R T*^B sin(S T*^W - P),
 * A = 1.16145, B = 0.14874, C = 0.52487, D = 0.77320, E = 2.16178,
 * F = 2.43787, R = -6.435e-4, S = 18.0323, W = -0.76830, P = 7.27371,
 * valid 0.3 <= T* <= 100 (first six constants as reprinted by Poling et
 * al. 2001, eq. 9-4.3, which drops the sine term; the sine term's
 * constants from memory of the 1972 paper; it changes Omega_v by less than
 * 0.1 %). tests/test_porous.c checks the fit against the Monchick-Mason
 * table as given by Bird, Stewart and Lightfoot (2002), Table E.2.
 */
static double omega22(double Ts)
{
    double b = pow(Ts, 0.14874);
    return 1.16145 / b + 0.52487 / exp(0.77320 * Ts) +
           2.16178 / exp(2.43787 * Ts) -
           6.435e-4 * b * sin(18.0323 * pow(Ts, -0.76830) - 7.27371);
}

mcd_status mcdi_api_viscosity_omega22(double T_star, double *out_omega)
{
    mcd_status st;
    if ((st = mcdi_check_ptr(NULL, out_omega, "out_omega")) != MCD_OK ||
        (st = mcdi_check_positive(NULL, T_star, "T_star")) != MCD_OK)
        return st;
    *out_omega = omega22(T_star);
    return MCD_OK;
}

/*
 * First Chapman-Enskog approximation for a pure gas of Lennard-Jones
 * molecules (Hirschfelder, Curtiss and Bird 1954, eq. 8.2-18; Bird,
 * Stewart and Lightfoot 2002, eq. 1.4-14):
 *   mu = (5/16) sqrt(pi m k T) / (pi sigma^2 Omega_v)
 *      = (5/16) sqrt(M k T / (pi N_A)) / (sigma^2 Omega_v),
 * m = M / N_A. In the usual units this is 2.6693e-5 sqrt(M T) /
 * (sigma^2 Omega_v) poise with M in g/mol and sigma in Angstrom.
 */
static double ce_viscosity(double T, double M, double sigma, double eps_k)
{
    return (5.0 / 16.0) * sqrt(M * K_BOLTZMANN * T / (PI * N_AVOGADRO)) /
           (sigma * sigma * omega22(T / eps_k));
}

mcd_status mcdi_api_viscosity_chapman_enskog(double T, double M, double sigma,
                                             double eps_k, double *out_mu)
{
    mcd_status st;
    double mu;
    if ((st = mcdi_check_ptr(NULL, out_mu, "out_mu")) != MCD_OK ||
        (st = mcdi_check_positive2(T, "T", M, "M")) != MCD_OK ||
        (st = mcdi_check_positive2(sigma, "sigma", eps_k, "eps_k")) != MCD_OK)
        return st;
    mu = ce_viscosity(T, M, sigma, eps_k);
    if (!(mu > 0.0) || !mcdi_finite(mu))
        return mcdi_fail(MCD_EDOM, "viscosity overflows or underflows at "
                                   "this state");
    *out_mu = mu;
    return MCD_OK;
}

/*
 * Wilke, J. Chem. Phys. 18, 517 (1950):
 *   mu_mix = sum_i x_i mu_i / sum_j x_j Phi_ij,
 *   Phi_ij = [1 + (mu_i/mu_j)^(1/2) (M_j/M_i)^(1/4)]^2
 *            / [8 (1 + M_i/M_j)]^(1/2),
 * Phi_ii = 1 (Poling et al. 2001, eqs. 9-5.13 and 9-5.14). O(N^2), no
 * scratch. Species with x_i = 0 contribute nothing; every denominator
 * holds x_i Phi_ii = x_i for a present species, so it is > 0.
 */
static double wilke(size_t n, const double *M, const double *mu,
                    const double *x)
{
    double num = 0.0;
    size_t i, j;
    for (i = 0; i < n; i++) {
        double den = 0.0;
        if (!(x[i] > 0.0))
            continue;
        for (j = 0; j < n; j++) {
            double a, phi;
            if (j == i) {
                den += x[j];
                continue;
            }
            a = 1.0 + sqrt(mu[i] / mu[j]) * sqrt(sqrt(M[j] / M[i]));
            phi = a * a / sqrt(8.0 * (1.0 + M[i] / M[j]));
            den += x[j] * phi;
        }
        num += x[i] * mu[i] / den;
    }
    /* no renormalisation needed: the form is homogeneous of degree 0 in
     * x, so fractions summing to 1 within MCD_SUM_TOL give the same value
     * as their renormalised copy */
    return num;
}

mcd_status mcdi_api_viscosity_wilke(size_t n_species, const double *M,
                                    const double *mu, const double *x,
                                    double *out_mu)
{
    mcd_status st;
    size_t i;
    double v;
    if ((st = MCDI_CHECK_PTRS3(M, mu, x)) != MCD_OK ||
        (st = mcdi_check_ptr(NULL, out_mu, "out_mu")) != MCD_OK)
        return st;
    if (n_species < 1 || n_species > MCD_MAX_SPECIES)
        return mcdi_fail(MCD_EINVAL, "argument n_species: %zu is not in 1..%d",
                         n_species, MCD_MAX_SPECIES);
    if ((st = mcdi_check_M(NULL, n_species, M)) != MCD_OK ||
        (st = mcdi_check_comp(NULL, n_species, x, "x")) != MCD_OK)
        return st;
    for (i = 0; i < n_species; i++) {
        if (!mcdi_finite(mu[i]))
            return mcdi_fail(MCD_EINVAL, "argument mu: entry %zu is not finite",
                             i);
        if (!(mu[i] > 0.0))
            return mcdi_fail(MCD_EDOM, "argument mu: entry %zu = %g is not > 0",
                             i, mu[i]);
    }
    v = wilke(n_species, M, mu, x);
    if (!(v > 0.0) || !mcdi_finite(v))
        return mcdi_fail(MCD_EDOM, "mixture viscosity overflows or "
                                   "underflows");
    *out_mu = v;
    return MCD_OK;
}

static int has(const mcdi_spec *s, mcd_param p)
{
    return (s->known >> (unsigned)p) & 1u;
}

/* Viscosity of one copied species by Chapman-Enskog, with its typical
 * error and warnings. Fails: ENODATA (no M, sigma or eps/k), EDOM. */
static mcd_status spec_viscosity(const mcdi_spec *s, double T, double *out_mu,
                                 unsigned *out_warn)
{
    unsigned w = 0;
    double mu, Ts;
    if (!has(s, MCD_PARAM_MOLAR_MASS) || !has(s, MCD_PARAM_LJ_SIGMA) ||
        !has(s, MCD_PARAM_LJ_EPS_K))
        return mcdi_fail(MCD_ENODATA,
                         "species '%s' has no %s (needed by the "
                         "Chapman-Enskog viscosity)",
                         s->name,
                         !has(s, MCD_PARAM_MOLAR_MASS) ? "molar mass"
                         : !has(s, MCD_PARAM_LJ_SIGMA)
                             ? "Lennard-Jones sigma"
                             : "Lennard-Jones epsilon/k");
    Ts = T / s->p[MCD_PARAM_LJ_EPS_K];
    mu = ce_viscosity(T, s->p[MCD_PARAM_MOLAR_MASS], s->p[MCD_PARAM_LJ_SIGMA],
                      s->p[MCD_PARAM_LJ_EPS_K]);
    if (!(mu > 0.0) || !mcdi_finite(mu))
        return mcdi_fail(MCD_EDOM,
                         "species '%s': viscosity overflows or "
                         "underflows at T = %g K",
                         s->name, T);
    if (Ts < MCDI_TSTAR_MIN || Ts > MCDI_TSTAR_MAX)
        w |= MCD_WARN_TEMPERATURE;
    if (has(s, MCD_PARAM_DIPOLE) && s->p[MCD_PARAM_DIPOLE] > MCDI_DEBYE)
        w |= MCD_WARN_POLAR;
    if ((s->cls & MCDI_CLS_QUANTUM) && T < MCDI_QUANTUM_T)
        w |= MCD_WARN_QUANTUM;
    if (s->cls & MCDI_CLS_ASSOC)
        w |= MCD_WARN_ASSOCIATING;
    *out_mu = mu;
    if (out_warn != NULL)
        *out_warn = w;
    return MCD_OK;
}

mcd_status mcdi_api_db_viscosity_gas(const mcd_db *db, size_t i, double T,
                                     double *out_mu, double *out_rel_err,
                                     unsigned *out_warn)
{
    mcdi_spec s;
    mcd_status st;
    if ((st = MCDI_CHECK_PTRS2(db, out_mu)) != MCD_OK ||
        (st = mcdi_check_positive(NULL, T, "T")) != MCD_OK)
        return st;
    if ((st = mcdi_spec_from_db(db, i, &s)) != MCD_OK)
        return st == MCD_ENOTFOUND
                   ? mcdi_fail(st, "argument i: %zu is not a species index", i)
                   : st;
    if ((st = spec_viscosity(&s, T, out_mu, out_warn)) != MCD_OK)
        return st;
    if (out_rel_err != NULL)
        *out_rel_err = MCD_VISC_CE_TYPICAL_ERROR;
    return MCD_OK;
}

mcd_status mcdi_api_mixture_viscosities(const mcd_mixture *mix, double T,
                                        double *out_mu, unsigned *out_warn)
{
    mcd_status st;
    size_t i;
    unsigned w = 0;
    if ((st = MCDI_CHECK_PTRS2(mix, out_mu)) != MCD_OK ||
        (st = mcdi_check_positive(NULL, T, "T")) != MCD_OK)
        return st;
    /* check every species before writing any output */
    for (i = 0; i < mix->n; i++) {
        double mu;
        unsigned wi = 0;
        if ((st = spec_viscosity(&mix->spec[i], T, &mu, &wi)) != MCD_OK)
            return st;
        w |= wi;
    }
    for (i = 0; i < mix->n; i++)
        spec_viscosity(&mix->spec[i], T, &out_mu[i], NULL);
    if (out_warn != NULL)
        *out_warn = w;
    return MCD_OK;
}
