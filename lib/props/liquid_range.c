/* liquid_range.c - the temperature ranges of the infinite-dilution
 * correlations for liquids (Wilke-Chang, Tyn-Calus, Hayduk-Minhas) and
 * the warning bit for a temperature outside them
 * (mcd_method_temperature_range). The database route of Wilke-Chang
 * (binary_db.c) uses the same range.
 *
 * Ranges: the three correlations were fitted to diffusivities measured in
 * liquids near room temperature, the aqueous ones in liquid water; none of
 * the papers states a sharp validity range (from memory). We use the
 * liquid range of water at 1 atm, 273.15 K to 373.15 K, for all three
 * (common practice: the solvent must be liquid and the data sets are
 * concentrated between about 283 K and 333 K); a state outside it is
 * flagged, not refused.
 */
#include <math.h>

#include "base/mcd_internal.h"
#include "base/error.h"

#define LIQ_T_MIN 273.15 /* K, freezing point of water at 1 atm */
#define LIQ_T_MAX 373.15 /* K, normal boiling point of water */

mcd_status mcdi_api_method_temperature_range(mcd_method method, double T,
                                             double *out_T_min,
                                             double *out_T_max,
                                             unsigned *out_warn)
{
    if (method != MCD_METHOD_WILKE_CHANG && method != MCD_METHOD_TYN_CALUS &&
        method != MCD_METHOD_HAYDUK_MINHAS)
        return mcdi_fail(MCD_EINVAL,
                         "argument method: %d has no stored temperature "
                         "range (wilke-chang, tyn-calus or hayduk-minhas)",
                         (int)method);
    if (!mcdi_finite(T))
        return mcdi_fail(MCD_EINVAL, "argument T: not finite");
    if (!(T > 0.0))
        return mcdi_fail(MCD_EDOM, "argument T: %g K is not > 0", T);
    if (out_T_min != NULL)
        *out_T_min = LIQ_T_MIN;
    if (out_T_max != NULL)
        *out_T_max = LIQ_T_MAX;
    if (out_warn != NULL)
        *out_warn = T < LIQ_T_MIN || T > LIQ_T_MAX ? MCD_WARN_TEMPERATURE : 0u;
    return MCD_OK;
}
