/* mixture.h - private interface of mixture.c for the flux layer and the
 * batched kernels. Never installed. */
#ifndef MCD_MIXTURE_H
#define MCD_MIXTURE_H

#include "mcdiff.h"
#include "props/binary.h"

/* Largest Chebyshev degree of a temperature fit (see
 * mcd_mixture_set_temperature_fit in mixture.c). */
#define MCDI_FIT_MAXDEG 24

/* The mixture. Pair data are stored n x n (both triangles kept equal);
 * batched kernels read them directly (read only). */
struct mcd_mixture {
    size_t n;
    mcdi_spec *spec;       /* n species */
    unsigned char *method; /* n*n mcd_method per pair (symmetric) */
    unsigned char *pstat;  /* n*n mcd_status of the pair's coefficient */
    double *coef;          /* n*n, see mixture.c */
    double *icoef;         /* n*n, 1 / coef (0 when coef is 0) */
    double *eps;           /* n*n eps_ab [K] for CE/WL/Brokaw, else 0 */
    double *delta;         /* n*n Brokaw's delta_ab [-], 0 otherwise */
    double *user;          /* n*n*3: D_ref, T_ref, P_ref (D_ref 0 if none) */
    double *M;             /* n molar masses [kg/mol] (0 when unknown) */
    int M_ok;              /* every molar mass known */
    /* temperature fit of Omega_D for CE/WL/Brokaw pairs (fit_on == 0:
     * none; Brokaw: Omega_D + 0.19 delta_ab^2 / T*) */
    int fit_on;
    double fit_Tmin, fit_Tmax, fit_err;
    double fit_lmid, fit_lhalf; /* ln T = lmid + lhalf u, u in [-1, 1] */
    unsigned char *fit_deg;     /* n*n degree per pair (0: no fit) */
    double *fit_q;              /* n*n*(MCDI_FIT_MAXDEG+1): Chebyshev
                                     coefficients of Omega_D / coef */
};

/* MCD_OK when every pair of the mixture has the parameters its method
 * needs, else MCD_ENODATA (EINVAL for NULL). O(n^2) flag scan, no
 * arithmetic. */
mcd_status mcdi_mixture_ready(const mcd_mixture *mix);

/* Cheap evaluation of the n x n binary diffusivity matrix at (T, P):
 * per-pair coefficients are precomputed when the mixture or a pair's method
 * or user value changes, so this does one pow for T^1.75 and T^1.5 per call
 * and one collision integral per Lennard-Jones pair (Brokaw's with its
 * polar term); no warnings, no error
 * estimates, no argument checks. Precondition: mix != NULL, out_D != NULL,
 * T and P finite and > 0, mcdi_mixture_ready(mix) == MCD_OK. Gives the same
 * values as mcd_mixture_binaries (bit for bit for estimated pairs; to
 * rounding for user values). Diagonal set to 0. Allocates: no. */
void mcdi_mixture_binaries_fast(const mcd_mixture *mix, double T, double P,
                                double *out_D);

#endif
