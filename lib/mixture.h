/* mixture.h - private interface of mixture.c for the flux layer and later
 * speed work. Never installed. */
#ifndef MCD_MIXTURE_H
#define MCD_MIXTURE_H

#include "mcdiff.h"

/* MCD_OK when every pair of the mixture has the parameters its method
 * needs, else MCD_ENODATA (EINVAL for NULL). O(n^2) flag scan, no
 * arithmetic. */
mcd_status mcdi_mixture_ready(const mcd_mixture *mix);

/* Cheap evaluation of the n x n binary diffusivity matrix at (T, P):
 * per-pair coefficients are precomputed when the mixture or a pair's method
 * or user value changes, so this does one pow for T^1.75 and T^1.5 per call
 * and one collision integral per Lennard-Jones pair; no warnings, no error
 * estimates, no argument checks. Precondition: mix != NULL, out_D != NULL,
 * T and P finite and > 0, mcdi_mixture_ready(mix) == MCD_OK. Gives the same
 * values as mcd_mixture_binaries (bit for bit for estimated pairs; to
 * rounding for user values). Diagonal set to 0. Allocates: no. */
void mcdi_mixture_binaries_fast(const mcd_mixture *mix, double T, double P,
                                double *out_D);

#endif
