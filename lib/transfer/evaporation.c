/* evaporation.c - mcd_liquid_evaporation: a liquid evaporating through a
 * stagnant gas film (Stefan tube) into an inert gas, with the interface
 * vapour from the liquid's activity model and vapour pressures.
 *
 * Equations: at z = 0, y_i = x_i gamma_i P_i^sat / P (modified Raoult's
 * law, mcd_liquid_vle) for the liquid's species and y_inert = 1 - sum y_i;
 * at z = L the caller's composition; the inert is stagnant. The film is
 * the exact Krishna-Standart solution of mcd_film_solve (Krishna and
 * Standart 1976), so a single evaporating species reproduces Stefan's law
 * N = (c Đ / L) ln((1 - y_L) / (1 - y_0)). The mass rate is sum N_i M_i
 * and the level falls by (mass rate / rho_liquid), reported in mm/h
 * (x 1e3 mm/m x 3600 s/h).
 */
#include <string.h>

#include "base/mcd_internal.h"
#include "base/checks.h"
#include "liquid/liquid.h"
#include "transfer/film.h"
#include "transfer/tf_layout.h"

mcd_status mcdi_api_liquid_evaporation(mcd_workspace *ws, const mcd_liquid *liq,
                                       const mcd_film *gas, double T, double P,
                                       const double *x_liq, const double *M,
                                       double rho_liquid, double *out_y0,
                                       double *out_N, double *out_mass_rate,
                                       double *out_level_rate,
                                       unsigned *out_warn)
{
    mcdi_tf tf;
    mcd_film f;
    unsigned warn = 0;
    double sum = 0.0, rate = 0.0;
    mcd_status st;
    size_t n, i;
    if ((st = MCDI_CHECK_PTRS3(ws, liq, gas)) != MCD_OK ||
        (st = MCDI_CHECK_PTRS3(x_liq, M, out_N)) != MCD_OK)
        return st;
    n = liq->n;
    if (gas->n_species != n + 1)
        return mcdi_fail(MCD_EINVAL,
                         "argument gas: n_species %zu is not the liquid's "
                         "%zu species plus one inert gas",
                         gas->n_species, n);
    if ((st = mcdi_check_species(ws, n + 1, 2, 0, "gas")) != MCD_OK ||
        (st = mcdi_check_positive2(T, "T", P, "P")) != MCD_OK ||
        (st = mcdi_check_positive(ws, rho_liquid, "rho_liquid")) != MCD_OK ||
        (st = mcdi_check_M(ws, n + 1, M)) != MCD_OK)
        return st;
    mcdi_tf_scratch(ws, &tf);
    if ((st = mcdi_api_liquid_vle(ws, liq, T, x_liq, tf.e_p, &warn)) != MCD_OK)
        return st;
    for (i = 0; i < n; i++) {
        tf.e_y0[i] = tf.e_p[i] / P;
        sum += tf.e_y0[i];
    }
    if (!(sum < 1.0))
        return mcdi_fail(MCD_EDOM,
                         "argument P: the liquid boils (bubble pressure %g Pa "
                         ">= P = %g Pa at T = %g K)",
                         sum * P, P, T);
    tf.e_y0[n] = 1.0 - sum;
    f = *gas;
    f.x0 = tf.e_y0;
    if ((st = mcdi_api_film_solve(ws, &f, MCD_FILM_BOOT_STAGNANT, n, NULL,
                                  MCD_FILM_EXACT, tf.e_N, NULL, NULL)) !=
        MCD_OK)
        return st;
    for (i = 0; i < n; i++)
        rate += tf.e_N[i] * M[i];
    tf.e_N[n] = 0.0; /* stagnant by construction */
    if (out_y0 != NULL)
        memcpy(out_y0, tf.e_y0, (n + 1) * sizeof(double));
    memcpy(out_N, tf.e_N, (n + 1) * sizeof(double));
    if (out_mass_rate != NULL)
        *out_mass_rate = rate;
    if (out_level_rate != NULL)
        *out_level_rate = rate / rho_liquid * 1e3 * 3600.0;
    if (out_warn != NULL)
        *out_warn = warn;
    return MCD_OK;
}
