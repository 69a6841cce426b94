/* porous.h - private declarations of the porous-media layer (pore.c,
 * dgm.c). Never installed. */
#ifndef MCD_POROUS_H
#define MCD_POROUS_H

#include <stddef.h>
#include "mcdiff.h"

/* Pore-structure parameters checked (messages name the field: "argument
 * porosity: ..."), with the derived values the Dusty Gas Model uses.
 * Fails: EINVAL (NULL, NaN), EDOM (out of range). */
typedef struct mcdi_pore_eff {
    double f;  /* porosity / tortuosity [-] */
    double d;  /* mean pore diameter [m] */
    double B0; /* permeability [m^2]: given, or f d^2 / 32 */
} mcdi_pore_eff;
mcd_status mcdi_pore_check(const mcd_pore *pore, mcdi_pore_eff *out);

/* Open-pore Knudsen diffusivity (d/3) sqrt(8 R T / (pi M)) [m^2/s] of
 * checked inputs. */
double mcdi_knudsen(double T, double M, double d);

#endif
