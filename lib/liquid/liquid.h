/* liquid.h - private view of struct mcd_liquid and the activity models
 * (liquid.c, activity.c, liq_eval.c). Never installed. */
#ifndef MCD_LIQUID_H
#define MCD_LIQUID_H

#include <stddef.h>
#include "mcdiff.h"

/* Number of species parameters (mcd_liquid_param). */
#define MCDI_LIQ_NSP 3

/* The liquid. Pair arrays are n x n; entry (i, j) belongs to the ordered
 * pair (p_ij), except alpha, trange and pset, which are kept equal in both
 * triangles. Unset species parameters are NaN, unset D° are 0. */
struct mcd_liquid {
    size_t n;
    mcd_activity_model model;
    double *sp;          /* n x MCDI_LIQ_NSP species parameters */
    double *coef;        /* n x n x 3: a, b, e of p_ij(T) */
    double *alpha;       /* n x n NRTL non-randomness */
    double *trange;      /* n x n x 2: T_min, T_max (0, 0: none) */
    unsigned char *pset; /* n x n: pair parameters set */
    double *dinf;        /* n x n: D° of i infinitely dilute in j */
    double *ant;         /* n x 5 Antoine A, B, C, T_min, T_max (A NaN:
                            not set, the species is not volatile) */
};

/* Partial pressures p_i = x_i gamma_i P_i^sat(T) [Pa] of the species with
 * Antoine constants (0 for the others) into p, from validated x (sum 1)
 * and ln gamma; warning bits for T outside an Antoine range. EDOM when a
 * vapour pressure overflows. */
mcd_status mcdi_liquid_partial(const mcd_liquid *liq, double T, const double *x,
                               const double *lng, double *p, unsigned *warn);

/* Activity model at one state: from the pair matrix t (n x n, model's
 * meaning: NRTL tau_ij, Wilson Lambda_ij, UNIQUAC tau_ij), the NRTL
 * alphas, the species parameters and mole fractions x (sum 1), write
 * ln gamma (n) and the symmetric matrix H_ij = n_T d ln gamma_i / d n_j
 * (n x n). Scratch: s1, s2, s3, r, q (n each), g, w, p (n x n each).
 * Returns 0, or -1 when a value is not finite (overflow). */
typedef struct mcdi_act_scratch {
    double *s1, *s2, *s3, *r, *q, *g, *w, *p;
} mcdi_act_scratch;

int mcdi_activity_eval(const mcd_liquid *liq, const double *t, const double *x,
                       double *lng, double *H, const mcdi_act_scratch *sc);

/* Every parameter the model (and, with need_d, the diffusivities) needs
 * is set; else ENODATA naming the first missing one (liq_eval.c). The
 * check of mcd_liquid_eval, for callers that evaluate many states. */
mcd_status mcdi_liquid_ready(const mcd_liquid *liq, int need_d);

/* L_ij = ln D°_ij (n x n, 0 on the diagonal) of a liquid whose D° are
 * all set: the logarithms of the diffusivities, once per call. */
void mcdi_liquid_log_dinf(const mcd_liquid *liq, double *L);

/* The liquid at (T, x) without the argument checks of mcd_liquid_eval:
 * T > 0 and x (n validated mole fractions summing to one) already
 * checked, mcdi_liquid_ready(liq, out_Dij != NULL) passed, lnD from
 * mcdi_liquid_log_dinf (read only with out_Dij). Writes Gamma
 * (n x n) and Đ (n x n) unless NULL (both NULL: only the stability test)
 * and ORs warning bits into *warn; nothing written on failure. EDOM for
 * an overflow or an unstable state ("argument <xname>: the liquid is not
 * stable ..."). Uses the liquid bank's eval regions (liq_layout.h), so x
 * and the outputs must lie elsewhere (e.g. its cell regions). */
mcd_status mcdi_liquid_state(mcd_workspace *ws, const mcd_liquid *liq, double T,
                             const double *x, const char *xname,
                             const double *lnD, double *out_Gamma,
                             double *out_Dij, unsigned *warn);

#endif
