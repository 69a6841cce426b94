/* pore.c - pore-structure parameters, Knudsen diffusivities, effective
 * diffusivities and the Bosanquet interpolation.
 *
 * The caller's pore structure (mcd_pore) holds the porosity epsilon, the
 * tortuosity tau, the mean pore diameter d and the permeability B0. These
 * are usually fitted to permeation and diffusion measurements of the
 * medium; the formulas below only carry them.
 *
 *  - Effective diffusivities (parallel-pore model): D^e = (epsilon/tau) D
 *    (Mason and Malinauskas, Gas Transport in Porous Media: The Dusty-Gas
 *    Model, 1983, ch. 2; common practice).
 *  - Knudsen diffusivity of species i in a cylindrical pore of diameter d
 *    (Knudsen 1909; kinetic theory, mean speed sqrt(8 R T / (pi M))):
 *      D_K,i = (d/3) sqrt(8 R T / (pi M_i)).
 *  - Permeability when the caller gives none: Poiseuille flow in a bundle
 *    of straight cylindrical pores, B0 = d^2/32 per pore (Hagen-Poiseuille:
 *    mean velocity -(d^2/32) grad P / mu), scaled by epsilon/tau for the
 *    medium like the diffusivities, B0 = (epsilon/tau) d^2/32 (Mason and
 *    Malinauskas 1983, ch. 2; for one straight pore, epsilon = tau = 1,
 *    this is d^2/32).
 *  - Bosanquet interpolation (Pollard and Present, Phys. Rev. 73, 762
 *    (1948), who credit Bosanquet): 1/D = 1/D_m + 1/D_K. Exact for trace
 *    species in the isobaric Dusty Gas Model, an approximation otherwise.
 */
#include <math.h>

#include "base/mcd_internal.h"
#include "base/checks.h"
#include "porous/porous.h"

#define PI 3.14159265358979323846

double mcdi_knudsen(double T, double M, double d)
{
    return (d / 3.0) * sqrt(8.0 * MCD_GAS_CONSTANT * T / (PI * M));
}

/* A finite (EINVAL) scalar in the range `ok` (EDOM, message "what"). */
static mcd_status range(double v, int ok, const char *name, const char *what)
{
    if (!mcdi_finite(v))
        return mcdi_fail(MCD_EINVAL, "argument %s: not finite", name);
    if (!ok)
        return mcdi_fail(MCD_EDOM, "argument %s: %g is not %s", name, v, what);
    return MCD_OK;
}

mcd_status mcdi_pore_check(const mcd_pore *pore, mcdi_pore_eff *out)
{
    mcd_status st;
    double f, B0;
    if (pore == NULL)
        return mcdi_fail(MCD_EINVAL, "argument pore: NULL");
    if ((st = range(pore->porosity,
                    pore->porosity > 0.0 && pore->porosity <= 1.0, "porosity",
                    "in (0, 1]")) != MCD_OK ||
        (st = range(pore->tortuosity, pore->tortuosity >= 1.0, "tortuosity",
                    ">= 1")) != MCD_OK ||
        (st = range(pore->d_pore, pore->d_pore > 0.0, "d_pore", "> 0")) !=
            MCD_OK ||
        (st = range(pore->permeability, pore->permeability >= 0.0,
                    "permeability", "> 0 (or 0: from d_pore)")) != MCD_OK)
        return st;
    f = pore->porosity / pore->tortuosity;
    B0 = pore->permeability > 0.0 ? pore->permeability
                                  : f * pore->d_pore * pore->d_pore / 32.0;
    if (!(B0 > 0.0) || !mcdi_finite(B0))
        return mcdi_fail(MCD_EDOM,
                         "argument d_pore: %g gives a permeability outside "
                         "the double range",
                         pore->d_pore);
    out->f = f;
    out->d = pore->d_pore;
    out->B0 = B0;
    return MCD_OK;
}

mcd_status mcdi_api_pore_permeability(const mcd_pore *pore, double *out_B0)
{
    mcdi_pore_eff e;
    mcd_status st;
    if ((st = mcdi_check_ptr(NULL, out_B0, "out_B0")) != MCD_OK ||
        (st = mcdi_pore_check(pore, &e)) != MCD_OK)
        return st;
    *out_B0 = e.B0;
    return MCD_OK;
}

mcd_status mcdi_api_pore_effective(const mcd_pore *pore, double D,
                                   double *out_De)
{
    mcdi_pore_eff e;
    mcd_status st;
    if ((st = mcdi_check_ptr(NULL, out_De, "out_De")) != MCD_OK ||
        (st = mcdi_pore_check(pore, &e)) != MCD_OK ||
        (st = mcdi_check_positive(NULL, D, "D")) != MCD_OK)
        return st;
    *out_De = e.f * D;
    return MCD_OK;
}

mcd_status mcdi_api_knudsen_diffusivity(double T, double M, double d_pore,
                                        double *out_DK)
{
    mcd_status st;
    double DK;
    if ((st = mcdi_check_ptr(NULL, out_DK, "out_DK")) != MCD_OK ||
        (st = mcdi_check_positive2(T, "T", M, "M")) != MCD_OK ||
        (st = mcdi_check_positive(NULL, d_pore, "d_pore")) != MCD_OK)
        return st;
    DK = mcdi_knudsen(T, M, d_pore);
    if (!(DK > 0.0) || !mcdi_finite(DK))
        return mcdi_fail(MCD_EDOM, "Knudsen diffusivity outside the double "
                                   "range");
    *out_DK = DK;
    return MCD_OK;
}

mcd_status mcdi_api_bosanquet(double D_m, double D_K, double *out_D)
{
    mcd_status st;
    if ((st = mcdi_check_ptr(NULL, out_D, "out_D")) != MCD_OK ||
        (st = mcdi_check_positive2(D_m, "D_m", D_K, "D_K")) != MCD_OK)
        return st;
    /* D_m D_K / (D_m + D_K) overflows for huge inputs; this form does not */
    *out_D = 1.0 / (1.0 / D_m + 1.0 / D_K);
    return MCD_OK;
}
