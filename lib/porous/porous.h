/* porous.h - private declarations of the porous-media layer (pore.c,
 * dgm.c). Never installed. */
#ifndef MCD_POROUS_H
#define MCD_POROUS_H

#include <stddef.h>
#include "mcdiff.h"
#include "porous/pm_layout.h"

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

/* The derived values of a checked state in the workspace (xn, DK, kv, H;
 * the projected gradients gx when need_gx), dgm.c. */
void mcdi_dgm_prepare(const mcd_dgm *g, const mcdi_pore_eff *e, int need_gx,
                      mcdi_pm *pm);

/* Inverse Dusty Gas Model in one direction for a prepared state: the
 * mole-fraction gradients out_gx (n) and the pressure gradient that carry
 * the fluxes N (n), dgm.c (see mcd_dgm_gradients). No checks. */
void mcdi_dgm_grad1(const mcd_dgm *g, const mcdi_pm *pm, const double *N,
                    double *out_gx, double *out_gP);

#endif
