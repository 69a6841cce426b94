/* binary.h - private declarations of the properties layer (binary.c,
 * binary_db.c, mixture.c). Never installed. */
#ifndef MCD_BINARY_H
#define MCD_BINARY_H

#include <stddef.h>
#include "mcdiff.h"

/* One debye in C m: 1e-21 / c (c = 299792458 m/s exactly). */
#define MCDI_DEBYE 3.33564095198152e-30

/* Parameters of one species copied out of a database: value p[k] is valid
 * when bit (1u << k) of `known` is set. `cls` holds MCDI_CLS_* bits decided
 * once from the name, formula and parameters (see mcdi_classify). */
typedef struct mcdi_spec {
    double p[MCD_PARAM_COUNT];
    unsigned known;
    unsigned cls;
    char name[64];
} mcdi_spec;

#define MCDI_CLS_QUANTUM 0x1u /* H2, D2, He: quantum effects at low T */
#define MCDI_CLS_ASSOC 0x2u   /* hydrogen-bonding species */

/* Fill *out from species i of db (reads through the public mcd_db_* calls
 * only). Fails: EINVAL (db/out NULL), ENOTFOUND (i out of range).
 * Allocates: no. */
mcd_status mcdi_spec_from_db(const mcd_db *db, size_t i, mcdi_spec *out);

/* Classification bits from a name and formula (either may be NULL) and the
 * association factor (assoc < 0 when unknown). */
unsigned mcdi_classify(const char *name, const char *formula, double assoc);

/* Gas binary diffusivity of a pair of copied species by a gas method
 * (FSG, CHAPMAN_ENSKOG, WILKE_LEE), with the method's typical error and
 * the warning bits. T and P are validated here too.
 * Fails: EINVAL, EDOM, ENODATA. Allocates: no. */
mcd_status mcdi_pair_gas(const mcdi_spec *a, const mcdi_spec *b, mcd_method m,
                         double T, double P, double *out_D, double *out_rel_err,
                         unsigned *out_warn);

/* State-independent part of a gas method for a pair, so that
 *   FSG:          D = coef * T^1.75 / P
 *   CE, WL:       D = coef * T^1.5 / (P * Omega_D(T / eps_ab))
 *   BROKAW:       D = coef * T^1.5 / (P * mcdi_brokaw_omega(T / eps_ab,
 *                                                            delta_ab))
 * reproduces mcdi_pair_gas bit for bit. *out_eps_ab is 0 for FSG;
 * *out_delta_ab (Brokaw's polar parameter of the pair) is 0 except for
 * BROKAW. Sets *out_estimated to 1 when Lennard-Jones parameters were
 * estimated. Fails: EINVAL (method), ENODATA (the detail names the species
 * and the parameter), EDOM. Allocates: no. */
mcd_status mcdi_pair_coef(const mcdi_spec *a, const mcdi_spec *b, mcd_method m,
                          double *out_coef, double *out_eps_ab,
                          double *out_delta_ab, int *out_estimated);

/* The method recommended for a pair (the rule `mcdiff binary` marks and
 * MCD_GAS_RECOMMENDED applies): Brokaw's polar correction when the pair
 * is polar (mcdi_pair_polar) and both species have Brokaw's data; else
 * the first of FSG, Chapman-Enskog, Wilke-Lee whose parameters the pair
 * has; FSG when none has (its ENODATA then names what is missing). Reads
 * parameters only; sets no error detail. */
mcd_method mcdi_pair_recommended(const mcdi_spec *a, const mcdi_spec *b);

/* Whether a pair is polar: the dipole moment of either species above 1
 * debye (the rule of MCD_WARN_POLAR). */
int mcdi_pair_polar(const mcdi_spec *a, const mcdi_spec *b);

/* Lennard-Jones sigma [m] and eps/k [K] of one species for method m:
 * tabulated, or estimated from Vb and Tb (then *estimated is set to 1).
 * Fails: ENODATA (the detail names the species). Allocates: no. */
mcd_status mcdi_lj_params(const mcdi_spec *s, mcd_method m, double *sig,
                          double *eps, int *estimated);

/* Warning bits that depend only on the pair and the state (not on a
 * method's own range): HIGH_PRESSURE (P = 0: none), POLAR, QUANTUM,
 * ASSOCIATING. */
/* A typical relative error e widened by the MCD_WARN_* bits in warn, the
 * rule of mcd_typical_error_widened (explain.c): MCD_WIDEN_MAJOR for each
 * major bit, MCD_WIDEN_MINOR for each minor one, at most MCD_WIDEN_CAP;
 * other bits are ignored. */
double mcdi_widen_error(double e, unsigned warn);

unsigned mcdi_pair_state_warnings(const mcdi_spec *a, const mcdi_spec *b,
                                  double T, double P);

/* Pair coefficients from raw parameters (inputs assumed validated). */
double mcdi_fsg_coef(double MA, double MB, double VA, double VB);
double mcdi_ce_coef(double MA, double MB, double sigA, double sigB);
double mcdi_wl_coef(double MA, double MB, double sigA, double sigB);
/* Neufeld-Janzen-Aziz Omega_D without argument checks (T* > 0). */
double mcdi_omega_d(double T_star);

/* Brokaw (1969): per-species delta [-], sigma [m] and eps/k [K] from the
 * dipole [C m], Vb [m^3/mol] and Tb [K] (inputs assumed validated); the
 * polar collision integral; and D [m^2/s] from the two parameter triples
 * {delta, sigma, eps}. See binary.c. */
void mcdi_brokaw_params(double dip, double Vb, double Tb, double *out_delta,
                        double *out_sigma, double *out_eps);
double mcdi_brokaw_omega(double T_star, double delta_ab);
double mcdi_brokaw_d(double T, double P, double MA, double MB,
                     const double pa[3], const double pb[3]);

/* Gas methods' tested temperature ranges used for MCD_WARN_TEMPERATURE. */
#define MCDI_FSG_T_MIN 200.0  /* K, common practice, see binary.c */
#define MCDI_FSG_T_MAX 1100.0 /* K */
#define MCDI_TSTAR_MIN 0.3    /* Neufeld et al. (1972) fit range */
#define MCDI_TSTAR_MAX 100.0
/* Pressure above which a low-pressure method is flagged [Pa]. */
#define MCDI_HIGH_P 1.0e6
/* ... or above this fraction of the pair's mean critical pressure. */
#define MCDI_HIGH_P_REDUCED 0.3
/* Quantum gases are flagged below this temperature [K]. */
#define MCDI_QUANTUM_T 100.0

#endif
