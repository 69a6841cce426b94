/** @file mcdiff.h
 * @brief Multicomponent diffusion fluxes for simulators.
 *
 * The only installed header of libmcdiff. Self-contained C99; usable from C++.
 *
 * Units: SI everywhere. T [K], P [Pa], D [m^2/s], c [mol/m^3], rho [kg/m^3],
 * M [kg/mol], molar fluxes [mol/(m^2 s)], mass fluxes [kg/(m^2 s)],
 * gradients of mole or mass fractions [1/m], viscosity [Pa s],
 * Lennard-Jones sigma [m], epsilon/k [K], dipole moment [C m],
 * molar volume [m^3/mol].
 *
 * Layout: matrices are row-major, element (i,j) at i*n + j. Flux and gradient
 * arrays are n_species x n_dim: row = species, column = spatial direction,
 * element (i,d) at i*n_dim + d.
 *
 * Errors: every fallible call returns an mcd_status. On error, output arrays
 * are left untouched unless a function's documentation says otherwise, and
 * mcd_last_error() gives the detail (which argument, which entry, which
 * missing parameter). The library never prints, aborts or exits.
 *
 * Threads: objects created by mcd_*_new/alloc are owned by the caller. A
 * species database or mixture that is no longer modified may be shared
 * read-only by any number of threads; a workspace belongs to one thread at a
 * time.
 *
 * Labels at the end of each block: "Fails:" lists the status codes the call
 * can return besides MCD_OK; "Allocates:" whether it may allocate heap memory.
 */
#ifndef MCDIFF_H
#define MCDIFF_H

#include <stddef.h>

#ifdef __cplusplus
extern "C" {
#endif

/* ------------------------------------------------------------------ */
/* Version                                                             */
/* ------------------------------------------------------------------ */

/** Major version of this header; a change breaks the API and ABI. */
#define MCD_VERSION_MAJOR 0
/** Minor version of this header (adds symbols). */
#define MCD_VERSION_MINOR 2
/** Patch version of this header (changes no symbols). */
#define MCD_VERSION_PATCH 0
/** Version of this header as MAJOR*10000 + MINOR*100 + PATCH; compare
 *  with mcd_version_number() for the library running. */
#define MCD_VERSION_NUMBER \
    (MCD_VERSION_MAJOR * 10000 + MCD_VERSION_MINOR * 100 + MCD_VERSION_PATCH)

/** @def MCD_API
 *  Export control of the public functions: default visibility on GCC and
 *  Clang; dllexport/dllimport on Windows; empty for static use (define
 *  MCD_STATIC). */
#if defined(MCD_STATIC)
#define MCD_API
#elif defined(_WIN32)
#if defined(MCD_BUILDING_LIB)
#define MCD_API __declspec(dllexport)
#else
#define MCD_API __declspec(dllimport)
#endif
#elif defined(__GNUC__) && __GNUC__ >= 4
#define MCD_API __attribute__((visibility("default")))
#else
#define MCD_API
#endif

/** @def MCD_DEPRECATED(msg)
 *  Marks a function that a later version removes; the compiler warns with
 *  msg where it is used. */
#if defined(__GNUC__) || defined(__clang__)
#define MCD_DEPRECATED(msg) __attribute__((deprecated(msg)))
#elif defined(_MSC_VER)
#define MCD_DEPRECATED(msg) __declspec(deprecated(msg))
#else
#define MCD_DEPRECATED(msg)
#endif

/** Runtime version as MAJOR*10000 + MINOR*100 + PATCH. Since 0.1. */
MCD_API unsigned mcd_version_number(void);
/** Runtime version as a static "MAJOR.MINOR.PATCH" string. Since 0.1. */
MCD_API const char *mcd_version_string(void);

/* ------------------------------------------------------------------ */
/* Status codes (numeric values never change once released)            */
/* ------------------------------------------------------------------ */

/** Status of every fallible call: MCD_OK or the reason it failed
 *  (mcd_status_string gives the text, mcd_last_error the detail). */
typedef enum mcd_status {
    MCD_OK = 0,        /**< success */
    MCD_EINVAL = 1,    /**< NULL pointer, NaN or infinity, bad count or enum */
    MCD_EDOM = 2,      /**< outside the model's domain (negative fraction, sum
                            not 1, non-positive T, P, c or D, asymmetric D) */
    MCD_EBADLEN = 3,   /**< size differs from the workspace's or mixture's */
    MCD_ENOMEM = 4,    /**< allocation failed */
    MCD_ESING = 5,     /**< singular or indefinite matrix (LAPACK info > 0) */
    MCD_EINTERNAL = 6, /**< internal error (LAPACK info < 0): a library bug */
    MCD_ENOTFOUND = 7, /**< unknown species, element or method */
    MCD_EPARSE = 8,    /**< malformed formula, file or text */
    MCD_ENODATA = 9,   /**< a parameter the method needs is missing */
    MCD_ENOCONV = 10,  /**< iteration did not converge */
    MCD_EIO = 11       /**< file could not be opened or read */
} mcd_status;

/** Static, never-NULL English text for a status code. Since 0.1.
 *  Fails: - | Allocates: no */
MCD_API const char *mcd_status_string(int status);

/** Detail of the last call in the calling thread that returned an
 *  mcd_status: "" after a success; after a failure, English text naming
 *  the argument and entry at fault (for example "argument c: -1 is not >
 *  0", "cell 17: argument T: NaN is not finite", "line 4: unknown unit
 *  'furlong'", "pair (0, 2) fsg: species 'silane' has no diffusion
 *  volume"), at least "<function>: <status text>". Calls returning other
 *  types (names, counts, getters) leave it alone. Thread-local: each
 *  thread sees its own calls. The pointer stays valid for the thread's
 *  lifetime; the text changes with its next such call. Since 0.2.
 *  Fails: - | Allocates: no */
MCD_API const char *mcd_last_error(void);

/* ------------------------------------------------------------------ */
/* Limits and tolerances                                               */
/* ------------------------------------------------------------------ */

/** Largest number of species accepted by any call. */
#define MCD_MAX_SPECIES 1024
/** Largest number of spatial directions in flux and gradient arrays. */
#define MCD_MAX_DIM 3
/** A composition whose sum differs from 1 by at most this is renormalised;
 *  a larger difference is MCD_EDOM. */
#define MCD_SUM_TOL 1e-6
/** Universal gas constant [J/(mol K)], exact in the 2019 SI (CODATA 2018). */
#define MCD_GAS_CONSTANT 8.31446261815324
/** Standard atmosphere [Pa], exact by definition. */
#define MCD_ATM 101325.0

/* ------------------------------------------------------------------ */
/* Chemical formulas and elements                                      */
/* ------------------------------------------------------------------ */

/*
 * Formula grammar: element symbols (capital letter, optional lower-case
 * letter) each followed by an optional positive integer count; parenthesised
 * groups with an optional count, nested up to 8 deep. Examples: "C3H5Cl",
 * "CH3COCH3", "(CH3)2CO", "SF6", "CH3(CH2)4CH3". No spaces, charges or
 * hydrates. On a parse error mcd_last_error() names the 1-based character
 * position.
 */

/** Molar mass [kg/mol] of a formula from the IUPAC standard atomic weights
 *  (conventional values for elements given as intervals). Since 0.1.
 *  @param formula  NUL-terminated formula, see the grammar above.
 *  @param out_M    molar mass [kg/mol].
 *  Fails: EINVAL (NULL), EPARSE (malformed), ENOTFOUND (unknown element)
 *  | Allocates: no */
MCD_API mcd_status mcd_formula_molar_mass(const char *formula, double *out_M);

/** Element counts of a formula, merged per element in order of first
 *  appearance. Since 0.1.
 *  @param cap        capacity of out_Z and out_count.
 *  @param out_Z      atomic numbers, @param out_count  atom counts.
 *  @param out_n      number of distinct elements written.
 *  Fails: EINVAL, EPARSE, ENOTFOUND, EBADLEN (more than cap elements)
 *  | Allocates: no */
MCD_API mcd_status mcd_formula_elements(const char *formula, size_t cap,
                                        int *out_Z, long *out_count,
                                        size_t *out_n);

/** Fuller-Ensley-Giddings diffusion volume [-] (the sum of atomic and
 *  structural increments, in the method's cm^3-based units) of a formula.
 *  Only C, H, O, N, S, F, Cl, Br, I are covered by increments.
 *  @param n_rings  number of aromatic or heterocyclic rings (each adds the
 *                  method's ring increment, -18.3 in the 1969 set); 0 for
 *                  none (>= 0). Since 0.1.
 *  Fails: EINVAL, EPARSE, ENOTFOUND, ENODATA (element without increment)
 *  | Allocates: no */
MCD_API mcd_status mcd_formula_diffusion_volume(const char *formula,
                                                int n_rings, double *out_V);

/** Tabulated Fuller-Ensley-Giddings diffusion volume of a simple molecule
 *  (H2, D2, He, N2, O2, air, Ar, Kr, Xe, Ne, CO, CO2, N2O, NH3, H2O, SF6,
 *  Cl2, Br2, SO2), looked up by formula. Since 0.1.
 *  Fails: EINVAL, ENOTFOUND (not a tabulated molecule) | Allocates: no */
MCD_API mcd_status mcd_formula_molecule_volume(const char *formula, double *out_V);

/** Symbol of element Z (1..118), or NULL. Since 0.1. */
MCD_API const char *mcd_element_symbol(int Z);
/** Standard atomic weight of element Z [kg/mol]. Since 0.1.
 *  Fails: EINVAL (NULL output), ENOTFOUND (Z out of range or no standard
 *  weight) | Allocates: no */
MCD_API mcd_status mcd_element_weight(int Z, double *out_kg_per_mol);

/* ------------------------------------------------------------------ */
/* Species database                                                    */
/* ------------------------------------------------------------------ */

/** A species database: the built-in table and species the caller adds
 *  (opaque; mcd_db_new_builtin, mcd_db_free). */
typedef struct mcd_db mcd_db;

/** Species parameters. A parameter that is not known is reported as
 *  MCD_ENODATA by mcd_db_param. */
typedef enum mcd_param {
    MCD_PARAM_MOLAR_MASS = 0,   /**< M [kg/mol] */
    MCD_PARAM_DIFF_VOLUME = 1,  /**< Fuller diffusion volume [-] */
    MCD_PARAM_LJ_SIGMA = 2,     /**< Lennard-Jones sigma [m] */
    MCD_PARAM_LJ_EPS_K = 3,     /**< Lennard-Jones epsilon/k_B [K] */
    MCD_PARAM_DIPOLE = 4,       /**< dipole moment [C m] */
    MCD_PARAM_VB = 5,           /**< liquid molar volume at the normal
                                     boiling point [m^3/mol] */
    MCD_PARAM_TB = 6,           /**< normal boiling point [K] */
    MCD_PARAM_ASSOC = 7,        /**< Wilke-Chang association factor of the
                                     species as a solvent [-] */
    MCD_PARAM_TC = 8,           /**< critical temperature [K] */
    MCD_PARAM_PC = 9,           /**< critical pressure [Pa] */
    MCD_PARAM_COUNT = 10
} mcd_param;

/** Short machine name of a parameter ("M", "V_diff", "sigma", "eps_k",
 *  "dipole", "Vb", "Tb", "assoc", "Tc", "Pc"), or NULL. Since 0.1. */
MCD_API const char *mcd_param_name(mcd_param p);
/** SI unit text of a parameter ("kg/mol", "-", "m", "K", "C m",
 *  "m^3/mol", "Pa"), or NULL. Since 0.1. */
MCD_API const char *mcd_param_unit(mcd_param p);

/** New empty database. Free with mcd_db_free. Since 0.1.
 *  Fails: EINVAL, ENOMEM | Allocates: yes */
MCD_API mcd_status mcd_db_new(mcd_db **out_db);
/** New database holding a copy of the built-in species table (at least 40
 *  gases and vapours with sources). Since 0.1.
 *  Fails: EINVAL, ENOMEM | Allocates: yes */
MCD_API mcd_status mcd_db_new_builtin(mcd_db **out_db);
/** Free a database; NULL is a no-op. Since 0.1. */
MCD_API void mcd_db_free(mcd_db *db);

/** Number of species (0 for NULL). Since 0.1. */
MCD_API size_t mcd_db_species_count(const mcd_db *db);
/** Index of a species by name (case-insensitive), or else by exact formula
 *  when exactly one species has it. Since 0.1.
 *  Fails: EINVAL, ENOTFOUND | Allocates: no */
MCD_API mcd_status mcd_db_find(const mcd_db *db, const char *name,
                               size_t *out_index);
/** Name of species i, or NULL when out of range. Pointer valid until the
 *  database is modified or freed. Since 0.1. */
MCD_API const char *mcd_db_name(const mcd_db *db, size_t i);
/** Formula of species i as given, or NULL. Since 0.1. */
MCD_API const char *mcd_db_formula(const mcd_db *db, size_t i);
/** Source of parameter p of species i (citation text; "user" for values set
 *  through the API or a file), or NULL. Since 0.1. */
MCD_API const char *mcd_db_source(const mcd_db *db, size_t i, mcd_param p);
/** Value of parameter p of species i in SI units. Since 0.1.
 *  Fails: EINVAL (NULL, i or p out of range), ENODATA (not known)
 *  | Allocates: no */
MCD_API mcd_status mcd_db_param(const mcd_db *db, size_t i, mcd_param p,
                                double *out_value);

/** Add a species, or reset one of the same name (case-insensitive), from its
 *  formula: molar mass from atomic weights, diffusion volume from the
 *  tabulated molecular value if any, else from increments with n_rings ring
 *  corrections (unknown when an element has no increment, e.g. Si). Besides
 *  the formula grammar, "air" and "D2" are accepted here. n_rings > 0 for a
 *  tabulated molecule, or a non-positive volume, is EINVAL. Other
 *  parameters start unknown. Since 0.1.
 *  @param name     1 to 63 characters from [A-Za-z0-9_+-,()'] starting with a
 *                  letter or digit.
 *  Fails: EINVAL, EPARSE (bad name or formula), ENOTFOUND, ENOMEM
 *  | Allocates: yes */
MCD_API mcd_status mcd_db_add(mcd_db *db, const char *name,
                              const char *formula, int n_rings,
                              size_t *out_index);
/** Set parameter p of species i (SI units; must be finite and > 0, except a
 *  dipole moment or association factor which may be 0). Source becomes
 *  "user". Since 0.1.
 *  Fails: EINVAL, EDOM | Allocates: no */
MCD_API mcd_status mcd_db_set_param(mcd_db *db, size_t i, mcd_param p,
                                    double value);
/** Load species from a text file in the mcdiff species format (see README).
 *  All or nothing: on any error the database is unchanged and mcd_last_error() names
 *  the line. Since 0.1.
 *  Fails: EINVAL, EIO, EPARSE, ENOTFOUND, EDOM, ENOMEM | Allocates: yes */
MCD_API mcd_status mcd_db_load_file(mcd_db *db, const char *path);
/** As mcd_db_load_file, from a NUL-terminated string. Since 0.1. */
MCD_API mcd_status mcd_db_load_string(mcd_db *db, const char *text);

/* ------------------------------------------------------------------ */
/* Compositions                                                        */
/* ------------------------------------------------------------------ */

/** Validate fractions (mole or mass) and renormalise them: every entry
 *  finite and >= 0, sum within MCD_SUM_TOL of 1. out_y may equal y.
 *  Since 0.1.  Fails: EINVAL (NULL, n_species out of range, NaN/inf), EDOM
 *  (negative entry, sum off by more than MCD_SUM_TOL) | Allocates: no */
MCD_API mcd_status mcd_comp_normalize(size_t n_species, const double *y,
                                      double *out_y);
/** Mass fractions from mole fractions: w_i = x_i M_i / Mbar. Validates x as
 *  mcd_comp_normalize does; M finite and > 0. out_w must not alias.
 *  Since 0.1. Fails: EINVAL, EDOM | Allocates: no */
MCD_API mcd_status mcd_comp_x_to_w(size_t n_species, const double *M,
                                   const double *x, double *out_w);
/** Mole fractions from mass fractions: x_i = (w_i/M_i) / sum_k (w_k/M_k).
 *  Since 0.1. Fails: EINVAL, EDOM | Allocates: no */
MCD_API mcd_status mcd_comp_w_to_x(size_t n_species, const double *M,
                                   const double *w, double *out_x);
/** Mean molar mass [kg/mol] from mole fractions: sum x_i M_i. Since 0.1.
 *  Fails: EINVAL, EDOM | Allocates: no */
MCD_API mcd_status mcd_comp_mean_molar_mass_x(size_t n_species, const double *M,
                                              const double *x,
                                              double *out_Mbar);
/** Mean molar mass [kg/mol] from mass fractions: 1 / sum (w_i/M_i).
 *  Since 0.1. Fails: EINVAL, EDOM | Allocates: no */
MCD_API mcd_status mcd_comp_mean_molar_mass_w(size_t n_species, const double *M,
                                              const double *w,
                                              double *out_Mbar);
/** Species concentrations [mol/m^3]: c_i = c x_i. Since 0.1.
 *  Fails: EINVAL, EDOM | Allocates: no */
MCD_API mcd_status mcd_comp_x_to_c(size_t n_species, double c, const double *x,
                                   double *out_ci);
/** Mole fractions and total concentration from concentrations [mol/m^3]
 *  ci (each >= 0, sum > 0); out_c must not be NULL. Since 0.1. Fails: EINVAL, EDOM | Allocates: no */
MCD_API mcd_status mcd_comp_c_to_x(size_t n_species, const double *ci, double *out_x,
                                   double *out_c);
/** Ideal-gas total concentration c = P / (R T) [mol/m^3]. Since 0.1.
 *  Fails: EINVAL (NaN/inf), EDOM (T <= 0 or P <= 0) | Allocates: no */
MCD_API mcd_status mcd_comp_ideal_gas_c(double T, double P, double *out_c);
/** Gradients of mass fractions from mole fractions and their gradients
 *  (grad_x is n_species x n_dim; rows need not sum exactly to zero).
 *  Since 0.1. Fails: EINVAL, EDOM | Allocates: no */
MCD_API mcd_status mcd_comp_grad_x_to_w(size_t n_species, size_t n_dim,
                                        const double *M, const double *x,
                                        const double *grad_x,
                                        double *out_grad_w);
/** Gradients of mole fractions from mass fractions and their gradients.
 *  Since 0.1. Fails: EINVAL, EDOM | Allocates: no */
MCD_API mcd_status mcd_comp_grad_w_to_x(size_t n_species, size_t n_dim,
                                        const double *M, const double *w,
                                        const double *grad_w,
                                        double *out_grad_x);

/* ------------------------------------------------------------------ */
/* Binary diffusivities                                                */
/* ------------------------------------------------------------------ */

/** Methods of estimating a binary diffusivity. */
typedef enum mcd_method {
    MCD_METHOD_FSG = 1,            /**< Fuller-Schettler-Giddings (gases) */
    MCD_METHOD_CHAPMAN_ENSKOG = 2, /**< Chapman-Enskog, Lennard-Jones,
                                        Neufeld collision integral */
    MCD_METHOD_WILKE_LEE = 3,      /**< Wilke-Lee (gases) */
    MCD_METHOD_WILKE_CHANG = 4,    /**< Wilke-Chang (dilute solute in liquid) */
    MCD_METHOD_USER = 5            /**< value supplied by the caller */
} mcd_method;

/** Gas-phase correlations, the methods a database pair or a mixture pair
 *  can be estimated by (numerically equal to the mcd_method values of the
 *  same name, so a gas method can be passed to mcd_method_name). */
typedef enum mcd_gas_method {
    MCD_GAS_FSG = 1,            /**< Fuller-Schettler-Giddings */
    MCD_GAS_CHAPMAN_ENSKOG = 2, /**< Chapman-Enskog, Lennard-Jones */
    MCD_GAS_WILKE_LEE = 3       /**< Wilke-Lee */
} mcd_gas_method;

/** Short name of a method ("fsg", "chapman-enskog", "wilke-lee",
 *  "wilke-chang", "user"), or NULL. Since 0.1. */
MCD_API const char *mcd_method_name(mcd_method m);
/** Method from its short name (case-insensitive). Since 0.1.
 *  Fails: EINVAL, ENOTFOUND | Allocates: no */
MCD_API mcd_status mcd_method_from_name(const char *name, mcd_method *out_m);
/** Typical (average absolute) relative error of a method's estimates, as
 *  published for its validation set, e.g. 0.05 for 5 %. NaN for USER or an
 *  unknown method.
 *  Since 0.1. */
MCD_API double mcd_method_typical_error(mcd_method m);

/** Warning bits returned with estimates. */
#define MCD_WARN_HIGH_PRESSURE 0x01u /**< P above the low-pressure range */
#define MCD_WARN_POLAR 0x02u         /**< polar species, Lennard-Jones or
                                          volume model less reliable */
#define MCD_WARN_TEMPERATURE 0x04u   /**< T outside the method's tested range */
#define MCD_WARN_QUANTUM 0x08u       /**< H2/He/D2 at low T (quantum effects) */
#define MCD_WARN_ASSOCIATING 0x10u   /**< hydrogen-bonding species */
#define MCD_WARN_ESTIMATED_PARAM 0x20u /**< a parameter was estimated (e.g.
                                          sigma from Vb) not tabulated */
#define MCD_WARN_SCALED 0x40u        /**< user value scaled far (>2x in T or
                                          10x in P) from its reference state */
/** Text of one warning bit, or NULL for an unknown bit. Since 0.1. */
MCD_API const char *mcd_warning_string(unsigned bit);

/** Fuller-Schettler-Giddings from raw parameters. Since 0.1.
 *  @param MA,MB molar masses [kg/mol]; @param VA,VB diffusion volumes [-].
 *  Fails: EINVAL (NaN/inf), EDOM (non-positive input) | Allocates: no */
MCD_API mcd_status mcd_binary_fsg(double T, double P, double MA, double MB,
                               double VA, double VB, double *out_D);
/** Chapman-Enskog with Lennard-Jones parameters, combining rules
 *  sigma_AB = (sigma_A + sigma_B)/2, eps_AB = sqrt(eps_A eps_B), and the
 *  Neufeld-Janzen-Aziz collision integral. Since 0.1.
 *  @param sigA,sigB [m]; @param epsA,epsB epsilon/k [K].
 *  Fails: EINVAL, EDOM | Allocates: no */
MCD_API mcd_status mcd_binary_chapman_enskog(double T, double P, double MA,
                                          double MB, double sigA, double sigB,
                                          double epsA, double epsB,
                                          double *out_D);
/** Wilke-Lee from raw Lennard-Jones parameters (same conventions as
 *  mcd_binary_chapman_enskog). Since 0.1. Fails: EINVAL, EDOM | Allocates: no */
MCD_API mcd_status mcd_binary_wilke_lee(double T, double P, double MA, double MB,
                                     double sigA, double sigB, double epsA,
                                     double epsB, double *out_D);
/** Wilke-Chang infinite-dilution diffusivity of a solute in a liquid.
 *  @param mu_solvent  solvent viscosity at T [Pa s]
 *  @param M_solvent   [kg/mol]; @param phi association factor [-] (> 0)
 *  @param Vb_solute   solute molar volume at its normal boiling point
 *                     [m^3/mol]. Since 0.1.
 *  Fails: EINVAL, EDOM | Allocates: no */
MCD_API mcd_status mcd_binary_wilke_chang(double T, double mu_solvent,
                                       double M_solvent, double phi,
                                       double Vb_solute, double *out_D);
/** Neufeld-Janzen-Aziz (1972) fit of the diffusion collision integral
 *  Omega_D(T*), T* = k T / eps, valid 0.3 <= T* <= 100. Since 0.1.
 *  Fails: EINVAL, EDOM (T* <= 0) | Allocates: no */
MCD_API mcd_status mcd_binary_omega_d(double T_star, double *out_omega);
/** Scale a known gas diffusivity to another state:
 *  D = D_ref (T/T_ref)^exponent (P_ref/P). Use 1.75 for the
 *  Fuller-Schettler-Giddings law. Since 0.1.
 *  Fails: EINVAL, EDOM | Allocates: no */
MCD_API mcd_status mcd_binary_scale(double D_ref, double T_ref, double P_ref,
                                    double T, double P, double exponent,
                                    double *out_D);

/** Gas binary diffusivity of species a and b of a database by a method.
 *  @param out_rel_err  typical relative error of the method (may be NULL)
 *  @param out_warn     MCD_WARN_* bits (may be NULL). Since 0.1.
 *  Fails: EINVAL, EDOM, ENODATA (parameter missing), ENOTFOUND (index)
 *  | Allocates: no */
MCD_API mcd_status mcd_db_binary_gas(const mcd_db *db, size_t a, size_t b,
                                  mcd_gas_method method, double T, double P,
                                  double *out_D, double *out_rel_err,
                                  unsigned *out_warn);
/** Wilke-Chang infinite-dilution diffusivity of solute in solvent, both from
 *  a database (solute needs Vb; solvent needs M and an association factor,
 *  1.0 when unknown, flagged). @param mu_solvent  [Pa s] at T. Since 0.1.
 *  Fails: EINVAL, EDOM, ENODATA, ENOTFOUND | Allocates: no */
MCD_API mcd_status mcd_db_binary_liquid(const mcd_db *db, size_t solute,
                                     size_t solvent, double T,
                                     double mu_solvent, double *out_D,
                                     double *out_rel_err, unsigned *out_warn);

/* ------------------------------------------------------------------ */
/* Mixtures: N species and their binary diffusivities                  */
/* ------------------------------------------------------------------ */

/** N species with their binary diffusivities, estimated or given
 *  (opaque; mcd_mixture_new, mcd_mixture_free). */
typedef struct mcd_mixture mcd_mixture;

/** New mixture of n species picked by name from db (parameters are copied:
 *  the mixture does not refer to db afterwards). Every pair uses the
 *  default method until changed. A species named twice is EINVAL.
 *  Since 0.1.
 *  Fails: EINVAL, ENOTFOUND (the detail names the species), ENOMEM
 *  | Allocates: yes */
MCD_API mcd_status mcd_mixture_new(const mcd_db *db, size_t n_species,
                                   const char *const *names,
                                   mcd_gas_method default_method,
                                   mcd_mixture **out_mix);
/** Free a mixture; NULL is a no-op. Since 0.1. */
MCD_API void mcd_mixture_free(mcd_mixture *mix);
/** Number of species (0 for NULL). Since 0.1. */
MCD_API size_t mcd_mixture_species_count(const mcd_mixture *mix);
/** Name of species i or NULL. Since 0.1. */
MCD_API const char *mcd_mixture_name(const mcd_mixture *mix, size_t i);
/** Molar masses [kg/mol], length n_species. Since 0.1.
 *  Fails: EINVAL, ENODATA | Allocates: no */
MCD_API mcd_status mcd_mixture_molar_masses(const mcd_mixture *mix,
                                            double *out_M);
/** Estimate pair (i, j) (i != j) by gas method m from now on (a value
 *  given with mcd_mixture_set_binary is dropped; give it again to use it).
 *  Since 0.1. Fails: EINVAL, EBADLEN (index) | Allocates: no */
MCD_API mcd_status mcd_mixture_set_method(mcd_mixture *mix, size_t i,
                                          size_t j, mcd_gas_method m);
/** Give a measured Đ_ij [m^2/s] at (T_ref, P_ref) for pair (i, j); at other
 *  states it is scaled as (T/T_ref)^1.75 (P_ref/P). Since 0.1.
 *  Fails: EINVAL, EDOM, EBADLEN | Allocates: no */
MCD_API mcd_status mcd_mixture_set_binary(mcd_mixture *mix, size_t i,
                                          size_t j, double D, double T_ref,
                                          double P_ref);
/** Matrix of binary diffusivities at (T, P): out_D N x N symmetric, diagonal
 *  set to 0. out_rel_err and out_warn (N x N each) may be NULL. Reads the
 *  mixture only: may run concurrently on a shared mixture. Since 0.1.
 *  Fails: EINVAL, EDOM, ENODATA (the pair's method lacks a
 *  parameter) | Allocates: no */
MCD_API mcd_status mcd_mixture_binaries(const mcd_mixture *mix, double T,
                                        double P, double *out_D,
                                        double *out_rel_err,
                                        unsigned *out_warn);

/* ------------------------------------------------------------------ */
/* Workspaces                                                          */
/* ------------------------------------------------------------------ */

/** Scratch memory and the last error of one thread's calls (opaque;
 *  mcd_workspace_new, mcd_workspace_free). */
typedef struct mcd_workspace mcd_workspace;

/** Custom allocator. alloc(ud, size) returns memory aligned for double or
 *  NULL; free(ud, p) releases it (p may be NULL). */
typedef struct mcd_allocator {
    void *(*alloc)(void *ud, size_t size); /**< allocate size bytes */
    void (*free)(void *ud, void *p);       /**< release p (may be NULL) */
    void *ud; /**< the caller's data, passed to alloc and free */
} mcd_allocator;

/** Allocate a workspace for up to n_species species (1..MCD_MAX_SPECIES):
 *  all scratch memory of the flux, Fick-matrix and transfer calls.
 *  Since 0.1. Fails: EINVAL, ENOMEM | Allocates: yes */
MCD_API mcd_status mcd_workspace_new(size_t n_species,
                                       mcd_workspace **out_ws);
/** As mcd_workspace_new with a caller allocator (copied). Since 0.1. */
MCD_API mcd_status mcd_workspace_new_with(size_t n_species,
                                            const mcd_allocator *allocator,
                                            mcd_workspace **out_ws);
/** Free a workspace; NULL is a no-op. Since 0.1. */
MCD_API void mcd_workspace_free(mcd_workspace *ws);
/** Species capacity of a workspace (0 for NULL). Since 0.1. */
MCD_API size_t mcd_workspace_capacity(const mcd_workspace *ws);

/* ------------------------------------------------------------------ */
/* Diffusion fluxes                                                    */
/* ------------------------------------------------------------------ */

/** Composition basis: mole or mass fractions, and the fluxes that go
 *  with them. */
typedef enum mcd_basis {
    MCD_BASIS_MOLE = 0, /**< mole fractions; molar fluxes J_i relative to the
                             molar-average velocity [mol/(m^2 s)] */
    MCD_BASIS_MASS = 1  /**< mass fractions; mass fluxes j_i relative to the
                             mass-average velocity [kg/(m^2 s)] */
} mcd_basis;

/** Flux models of mcd_flux_compute and the batched calls. */
typedef enum mcd_model {
    MCD_MODEL_MAXWELL_STEFAN = 0,    /**< exact Maxwell-Stefan */
    MCD_MODEL_MIXTURE_AVERAGED = 1,  /**< effective (Blanc) diffusivity per
                                          species with a zero-sum correction */
    MCD_MODEL_ITERATIVE = 2          /**< Maxwell-Stefan by the convergent
                                          iteration of Ern and Giovangigli
                                          (1994), O(N^2) per iteration
                                          (in mcd_flux_compute too since
                                          0.2, as a batch of one cell).
                                          It pays off only for large N in
                                          batched calls: measured slower
                                          than the exact batched model up
                                          to N = 50, 1.5x faster at
                                          N = 100 (tol 1e-7). Since 0.1. */
} mcd_model;

/** One state of a mixture with its gradients: the input of
 *  mcd_flux_compute and mcd_fick_matrix. Zero-initialise it (in C,
 *  `mcd_state s = {0};` or a designated initialiser) and set the fields the
 *  call uses; a field that a later version adds keeps its old meaning when
 *  left 0 or NULL. Pointers are borrowed for the duration of the call.
 *  Since 0.2. */
typedef struct mcd_state {
    size_t n_species;       /**< N, 1..capacity of the workspace */
    size_t n_dim;           /**< directions, 1..MCD_MAX_DIM (fluxes only) */
    mcd_basis comp_basis;   /**< comp and grad: mole or mass fractions */
    double c;               /**< total molar concentration [mol/m^3]
                                 (fluxes only) */
    const double *M;        /**< molar masses [kg/mol], N, or NULL */
    const double *Dij;      /**< binary diffusivities [m^2/s], N x N */
    const double *comp;     /**< fractions, N */
    const double *grad;     /**< their gradients [1/m], N x n_dim (fluxes
                                 only) */
    const double *Gamma;    /**< thermodynamic factors, N x N, or NULL */
    const double *grad_lnP; /**< gradient of ln P [1/m], n_dim, or NULL */
} mcd_state;

/** Diffusion fluxes of all species at one state. Since 0.1.
 *
 *  Solves the Maxwell-Stefan equations
 *    d_i = sum_{j != i} (x_i J_j - x_j J_i) / (c Đ_ij),  sum_i J_i = 0,
 *    d_i = sum_j Gamma_ij grad x_j + (x_i - w_i) grad ln P,
 *  exactly (MAXWELL_STEFAN) or with mixture-averaged diffusivities
 *  D_im = (1 - x_i) / sum_{j != i} x_j / Đ_ij and a correction flux
 *  proportional to x_i (mole basis) or w_i (mass basis) that restores the
 *  zero-sum (MIXTURE_AVERAGED). Species with x_i = 0 obey Blanc's law.
 *
 *  @param ws          workspace with capacity >= state->n_species.
 *  @param state       the state (mcd_state); its fields are checked as
 *                     follows, and messages name them ("argument comp:
 *                     entry 2 = -0.1 is negative").
 *    n_species        N, 1..capacity; n_dim 1..MCD_MAX_DIM.
 *    M                molar masses [kg/mol], length N (needed for the mass
 *                     basis and pressure diffusion; may be NULL otherwise);
 *                     largest / smallest <= 1e12 where needed (beyond, the
 *                     basis conversions lose all precision: EDOM).
 *    Dij              binary diffusivities [m^2/s], N x N, symmetric
 *                     (relative difference <= 1e-12), off-diagonal normal
 *                     positive numbers (>= DBL_MIN; a subnormal one is
 *                     EDOM), diagonal ignored.
 *    c                total molar concentration [mol/m^3], a normal positive
 *                     number (>= DBL_MIN; a subnormal c is EDOM).
 *    comp_basis       whether comp/grad are mole or mass fractions.
 *    comp             fractions, length N, validated as mcd_comp_normalize.
 *    grad             their gradients [1/m], N x n_dim.
 *    Gamma            thermodynamic factor matrix [-], N x N in mole
 *                     fractions, or NULL for an ideal mixture (identity).
 *                     Row i gives d_i = sum_j Gamma_ij grad x_j.
 *    grad_lnP         gradient of ln P [1/m], length n_dim, or NULL.
 *  @param flux_basis  MOLE: out_flux = J_i; MASS: out_flux = j_i.
 *  @param out_flux    N x n_dim; sums to zero over species to round-off.
 *  The driving forces are first projected onto sum_i d_i = 0 by
 *  d_i -= x_i sum_k d_k (removes round-off or an inconsistent Gamma; trace
 *  species are untouched). A NaN or infinite input is EINVAL, a finite
 *  out-of-range one EDOM. Accuracy: for Đ spread over up to 6 decades and
 *  N <= 100 the fluxes agree with an extended-precision solution to a
 *  normwise relative error below 1e-11 (measured about 1e-14,
 *  tests/test_edge_cases.c). Mass fluxes are differences of the terms
 *  M_i J_i; when the molar masses span so many decades that those terms
 *  cancel beyond double precision (fluxes that would not sum to zero), the
 *  call fails with EDOM instead (the molar fluxes remain available).
 *  Fails: EINVAL, EDOM, EBADLEN (N > capacity), ESING, EINTERNAL
 *  | Allocates: no
 *  | Threads: one ws per thread */
MCD_API mcd_status mcd_flux_compute(mcd_workspace *ws, mcd_model model,
                                    const mcd_state *state,
                                    mcd_basis flux_basis, double *out_flux);

/** Value for `dependent` arguments: pick the most abundant species. */
#define MCD_DEPENDENT_AUTO ((size_t)-1)

/** Generalized Fick matrix [D] ((N-1) x (N-1), row-major over the species
 *  other than `dependent`, in their original order) such that
 *  J = -c [D] grad x (MOLE basis, molar-average frame) or
 *  j = -rho [D°] grad w (MASS basis, mass-average frame, obtained from the
 *  molar one by the frame transformation). [D] = [B]^-1 [Gamma].
 *  @param state           as for mcd_flux_compute; n_dim, c and grad are
 *                         not used; M is needed for the MASS basis.
 *  @param basis           basis of the matrix (MOLE or MASS).
 *  @param dependent       index of the species left out, or
 *                         MCD_DEPENDENT_AUTO (the most abundant).
 *  @param out_dependent   index used (may be NULL). For N = 1
 *                         nothing is written to out_D. The matrix carries no
 *                         concentration: pass c (MOLE) or rho = c Mbar (MASS)
 *                         to mcd_fick_fluxes. Its fluxes equal those of
 *                         mcd_flux_compute when the gradients sum to zero
 *                         (Gamma is projected the same way). Since 0.1.
 *  Fails: EINVAL, EDOM, EBADLEN, ESING | Allocates: no */
MCD_API mcd_status mcd_fick_matrix(mcd_workspace *ws, const mcd_state *state,
                                   mcd_basis basis, size_t dependent,
                                   double *out_D, size_t *out_dependent);

/** Fluxes from a caller's Fick matrix: for i != dependent,
 *  F_i = -c_or_rho sum_j D_ij grad_j, F_dependent = -sum of the others.
 *  @param D     (N-1) x (N-1) as produced by mcd_fick_matrix.
 *  @param c_or_rho  c [mol/m^3] for molar fluxes, rho [kg/m^3] for mass fluxes.
 *  @param grad  N x n_dim gradients (the dependent row is ignored and may
 *               hold anything). @param dependent  a species index
 *               (MCD_DEPENDENT_AUTO is EINVAL here). D may be NULL for N = 1.
 *  Since 0.1. Fails: EINVAL, EDOM | Allocates: no */
MCD_API mcd_status mcd_fick_fluxes(size_t n_species, size_t n_dim,
                                   const double *D, size_t dependent,
                                   double c_or_rho, const double *grad,
                                   double *out_flux);

/** Eigenvalues of an order x order Fick matrix (LAPACK dgeev), order <=
 *  capacity - 1 of ws (or 0). Sorted by decreasing real part. Since 0.1.
 *  Fails: EINVAL, EBADLEN, ESING (no convergence), EDOM (an eigenvalue
 *  overflows: entries near DBL_MAX) | Allocates: no */
MCD_API mcd_status mcd_fick_eigenvalues(mcd_workspace *ws, size_t order,
                                        const double *D, double *out_re,
                                        double *out_im);

/* ------------------------------------------------------------------ */
/* Bases, frames and total fluxes                                      */
/* ------------------------------------------------------------------ */

/** Convert diffusion fluxes between bases and their frames:
 *  j_i = M_i J_i - w_i sum_k M_k J_k,  J_i = j_i/M_i - x_i sum_k j_k/M_k.
 *  @param x  mole fractions. in and out may not alias. Same basis copies.
 *  Since 0.1. Fails: EINVAL, EDOM | Allocates: no */
MCD_API mcd_status mcd_flux_convert(size_t n_species, size_t n_dim,
                                    const double *M, const double *x,
                                    mcd_basis from, const double *flux_in,
                                    mcd_basis to, double *out_flux);
/** Molar fluxes relative to the volume-average velocity:
 *  J^V_i = J_i - c x_i sum_k Vbar_k J_k.
 *  @param Vbar partial molar volumes [m^3/mol] with sum x_i Vbar_i = 1/c
 *  (checked to 1e-6 relative; ideal gas: Vbar_i = 1/c). Since 0.1.
 *  Fails: EINVAL, EDOM | Allocates: no */
MCD_API mcd_status mcd_flux_to_volume_frame(size_t n_species, size_t n_dim,
                                            double c, const double *x,
                                            const double *Vbar,
                                            const double *J, double *out_JV);
/** Molar fluxes relative to the velocity of species k (x_k > 0):
 *  J^k_i = J_i - x_i J_k / x_k (so J^k_k = 0). Since 0.1.
 *  Fails: EINVAL, EDOM | Allocates: no */
MCD_API mcd_status mcd_flux_to_species_frame(size_t n_species, size_t n_dim,
                                             const double *x, const double *J,
                                             size_t k, double *out_Jk);

/** Condition that fixes the total flux (bootstrap) of mcd_flux_total. */
typedef enum mcd_bootstrap {
    MCD_BOOT_TOTAL = 0,     /**< total flux given: values = N_t (or n_t), n_dim */
    MCD_BOOT_STAGNANT = 1,  /**< species `species` does not move */
    MCD_BOOT_EQUIMOLAR = 2, /**< N_t = 0 (MOLE) or n_t = 0 (MASS) */
    MCD_BOOT_WEIGHTS = 3    /**< sum_i nu_i N_i = 0; values = nu, length N */
} mcd_bootstrap;

/** Total fluxes from diffusion fluxes and a bootstrap condition:
 *  N_i = J_i + x_i N_t (MOLE) or n_i = j_i + w_i n_t (MASS).
 *  @param comp  x (MOLE) or w (MASS); @param diff  J or j (N x n_dim).
 *  @param out_total  N x n_dim; @param out_bulk  N_t or n_t (n_dim), may be
 *  NULL. Since 0.1.
 *  Fails: EINVAL, EDOM (stagnant species absent; sum nu_i y_i zero or
 *  cancelling to round-off; bulk flux overflows)
 *  | Allocates: no */
MCD_API mcd_status mcd_flux_total(size_t n_species, size_t n_dim,
                                  mcd_basis basis, const double *comp,
                                  const double *diff, mcd_bootstrap kind,
                                  size_t species, const double *values,
                                  double *out_total, double *out_bulk);
/** Difference of the mass- and molar-average velocities [m/s]:
 *  v - u = (1/rho) sum_k M_k J_k with rho = c Mbar. Since 0.1.
 *  Fails: EINVAL, EDOM | Allocates: no */
MCD_API mcd_status mcd_flux_velocity_difference(size_t n_species, size_t n_dim,
                                           const double *M, double c,
                                           const double *x, const double *J,
                                           double *out_v_minus_u);
/** Project a caller's flux set onto the zero-sum in place:
 *  F_i -= a_i sum_k F_k with a_i = weights_i / sum weights (weights = x for
 *  a correction velocity in the molar frame, w in the mass frame), or
 *  a_i = 1/N when weights is NULL (orthogonal projection).
 *  @param out_residual  the removed sum_k F_k per direction (n_dim), may be
 *  NULL. Since 0.1. Fails: EINVAL, EDOM | Allocates: no */
MCD_API mcd_status mcd_flux_project(size_t n_species, size_t n_dim,
                                    const double *weights, double *inout_flux,
                                    double *out_residual);

/** Per-species diagnostic bits. */
#define MCD_DIAG_REVERSE 0x1u  /**< flux up its own gradient (F.grad > 0) */
#define MCD_DIAG_OSMOTIC 0x2u  /**< flux with (nearly) zero own gradient */
#define MCD_DIAG_BARRIER 0x4u  /**< (nearly) zero flux with a gradient */

/** Flag coupling effects. "Nearly zero" means a Euclidean norm at most
 *  rel_tol times the largest norm over species of that quantity (gradients
 *  or fluxes). The flags are mutually exclusive: REVERSE needs both norms
 *  above the threshold. If all gradients are zero, every species with a
 *  flux is OSMOTIC; if all fluxes are zero, every species with a gradient
 *  is BARRIER; if both, no flags.
 *  @param rel_tol in (0, 1), e.g. 1e-3. Since 0.1.
 *  Fails: EINVAL | Allocates: no */
MCD_API mcd_status mcd_flux_diagnose(size_t n_species, size_t n_dim,
                                     const double *grad, const double *flux,
                                     double rel_tol, unsigned *out_flags);

/* ------------------------------------------------------------------ */
/* Batched fluxes (many states per call)                               */
/* ------------------------------------------------------------------ */

/*
 * Batched calls compute the diffusion fluxes of many independent states
 * ("cells") in one call, with the same equations and conventions as
 * mcd_flux_compute (ideal mixture: Gamma = identity; optional pressure
 * diffusion). They are the fast path for simulators: no per-cell call
 * overhead, code specialised for small N and vectorised across cells, no
 * heap allocation (all scratch is in the workspace).
 *
 * Layout (structure of arrays, the fast one): with K = n_cells, N species
 * and n_dim directions, cell k is
 *   T[k], P[k], c[k]                     per-cell scalars, length K
 *   comp[i*K + k]                        fraction of species i, N x K
 *   grad[(i*n_dim + d)*K + k]            gradient of species i, direction d
 *   grad_lnP[d*K + k]                    n_dim x K
 *   Dij[(i*N + j)*K + k]                 per-cell binary diffusivities
 *   out_flux[(i*n_dim + d)*K + k]        same layout as grad
 * i.e. every quantity is a contiguous row of K values. The convenience call
 * mcd_flux_batch_aos takes per-cell arrays instead (see there).
 *
 * Temperature and pressure dependence: the mixture carries it. Pairs with
 * the Fuller-Schettler-Giddings method or a caller's value scale exactly as
 * Đ = coef T^1.75 / P (evaluated per cell, no fit). Chapman-Enskog and
 * Wilke-Lee pairs depend on T through T^1.5 / Omega_D(k T / eps); they are
 * evaluated exactly per cell (three exponentials and a power per pair and
 * cell), unless a temperature fit was declared with
 * mcd_mixture_set_temperature_fit, in which case cells with T inside the
 * declared range use the fit (a few multiply-adds per pair) and the fit's
 * maximum relative error is reported by that call.
 *
 * Errors: all arguments are checked, every cell's inputs are validated
 * (as mcd_flux_compute validates one state: T, P, c > 0 and finite,
 * fractions finite, >= 0 and summing to 1 within MCD_SUM_TOL, gradients
 * finite, Đ finite, >= DBL_MIN and symmetric). Unlike the single-state calls, on
 * an error detected in a cell the output of OTHER cells may already have
 * been written; mcd_last_error() names the lowest failing cell
 * ("cell 17: ..."). Argument errors (NULL, counts, enums) write nothing.
 *
 * Threads: built with the Meson option -Dopenmp=enabled, a batched call
 * distributes blocks of cells over OpenMP threads (see
 * mcd_workspace_set_threads); every cell is computed by the same code
 * whatever the thread count, so results are bit-for-bit identical to the
 * serial run. Without OpenMP the calls are serial. The CPU's vector width
 * (SSE2, AVX2, AVX-512) is chosen at run time on x86-64; no -march flag is
 * needed. With AVX-512, a call whose inputs and outputs together exceed the
 * last-level cache writes its outputs with streaming stores (past the
 * caches: the first outputs would have left them anyway); environment
 * variable MCDIFF_STREAM_STORES=never or =always overrides that choice.
 * The values are the same either way.
 */

/** The per-cell inputs every batched call takes: K cells' fractions and
 *  gradients in the layout of the call (SoA for mcd_flux_batch and
 *  mcd_flux_batch_dij, per-cell arrays for mcd_flux_batch_aos).
 *  Zero-initialise it and set the fields; a field added in a later version
 *  keeps its old meaning when left 0 or NULL. Since 0.2. */
typedef struct mcd_cells {
    size_t n_cells;         /**< K (0 is allowed and writes nothing) */
    size_t n_dim;           /**< 1..MCD_MAX_DIM */
    mcd_basis comp_basis;   /**< comp and grad: mole or mass fractions */
    const double *comp;     /**< fractions [-], N x K (comp[i*K + k]) */
    const double *grad;     /**< their gradients [1/m], (N n_dim) x K */
    const double *grad_lnP; /**< gradient of ln P [1/m], n_dim x K, or
                                 NULL (no pressure diffusion) */
} mcd_cells;

/** Batched diffusion fluxes of a mixture at many states (SoA layout, see
 *  above). The binary diffusivities of every cell come from the mixture at
 *  the cell's T and P; c = P / (R T) (ideal gas). Since 0.1.
 *
 *  @param ws          workspace with capacity >= N, the mixture's species
 *                     count (mcd_mixture_species_count).
 *  @param mix         mixture (read only; may be shared between threads).
 *  @param model       MAXWELL_STEFAN (exact), ITERATIVE (Ern-Giovangigli,
 *                     settings from mcd_workspace_set_iterative) or
 *                     MIXTURE_AVERAGED.
 *  @param T           temperatures [K], length K, each > 0.
 *  @param P           pressures [Pa], length K, each > 0 (and c = P / (R T)
 *                     a normal number, >= DBL_MIN).
 *  @param cells       K, n_dim, comp_basis, comp, grad, grad_lnP
 *                     (mcd_cells); messages name the fields.
 *  @param flux_basis  MOLE: J_i [mol/(m^2 s)]; MASS: j_i [kg/(m^2 s)].
 *  @param out_flux    (N n_dim) x K; must not alias an input. Sums to zero
 *                     over species in each cell to round-off.
 *  Fails: EINVAL (NULL, counts, enums, NaN/inf in a cell), EDOM (a cell
 *  out of range), EBADLEN (N > capacity), ENODATA (a pair lacks a
 *  parameter or M unknown), ESING, EINTERNAL | Allocates: no
 *  | Threads: one ws per thread */
MCD_API mcd_status mcd_flux_batch(mcd_workspace *ws, const mcd_mixture *mix,
                                  mcd_model model, const double *T,
                                  const double *P, const mcd_cells *cells,
                                  mcd_basis flux_basis, double *out_flux);

/** Batched diffusion fluxes with the caller's own per-cell binary
 *  diffusivities and concentrations (SoA layout, see above). Since 0.1.
 *
 *  @param n_species   N, 1..capacity of ws.
 *  @param M           molar masses [kg/mol], length N, shared by all cells;
 *                     needed for the mass basis and pressure diffusion, may
 *                     be NULL otherwise; largest / smallest <= 1e12 (EDOM;
 *                     the same holds for a mixture's molar masses).
 *  @param Dij         binary diffusivities [m^2/s], (N N) x K
 *                     (Dij[(i*N + j)*K + k]), each cell's matrix symmetric
 *                     (relative difference <= 1e-12), off-diagonal
 *                     >= DBL_MIN, diagonal ignored.
 *  @param c           total molar concentrations [mol/m^3], length K, each >= DBL_MIN.
 *  Other parameters as in mcd_flux_batch.
 *  Fails: EINVAL, EDOM, EBADLEN, ESING, EINTERNAL | Allocates: no
 *  | Threads: one ws per thread */
MCD_API mcd_status mcd_flux_batch_dij(mcd_workspace *ws, mcd_model model,
                                      size_t n_species, const double *M,
                                      const double *Dij, const double *c,
                                      const mcd_cells *cells,
                                      mcd_basis flux_basis, double *out_flux);

/** As mcd_flux_batch with per-cell (array of structures) arrays, the
 *  layout of K consecutive single-state calls: cells->comp[k*N + i],
 *  cells->grad[(k*N + i)*n_dim + d], cells->grad_lnP[k*n_dim + d] (or NULL),
 *  out_flux[(k*N + i)*n_dim + d]; T and P length K. Cells are transposed
 *  block by block into workspace memory (serially: no OpenMP here), so it
 *  is a little slower than the SoA call but much faster than K calls of
 *  mcd_flux_compute. Since 0.1.
 *  Fails: as mcd_flux_batch | Allocates: no | Threads: one ws per thread */
MCD_API mcd_status mcd_flux_batch_aos(mcd_workspace *ws,
                                      const mcd_mixture *mix,
                                      mcd_model model, const double *T,
                                      const double *P, const mcd_cells *cells,
                                      mcd_basis flux_basis, double *out_flux);

/** Settings of MCD_MODEL_ITERATIVE for later calls on this workspace.
 *  Each cell iterates until its error estimate (see
 *  mcd_workspace_iterative_outcome) is <= tol or max_iter iterations are
 *  done; tol = 0 runs exactly max_iter iterations. Defaults: max_iter 100,
 *  tol 1e-10. Since 0.1.
 *  @param max_iter  1..1000 iterations after the start, which is the
 *                   mixture-averaged flux with a mole-fraction correction
 *                   velocity (the estimate needs >= 2 iterations).
 *  @param tol       relative tolerance [-] on the fluxes, finite, >= 0.
 *  Fails: EINVAL | Allocates: no */
MCD_API mcd_status mcd_workspace_set_iterative(mcd_workspace *ws,
                                               size_t max_iter, double tol);

/** Outcome of the last ITERATIVE call on this workspace (batched, or
 *  mcd_flux_compute, which counts as one cell): the
 *  largest error estimate over its cells, relative to the largest flux of
 *  the cell (max_i |J_i - J_i,exact| / max_i |J_i|, estimated from the
 *  observed contraction of successive iterates; iterates that differ by
 *  round-off only, < 64 DBL_EPSILON, and no longer contract count as
 *  1000 times that change, about 1e-11 at most), and the largest number of
 *  iterations a cell used. A cell that stops at max_iter above tol does not
 *  make the call fail: check the estimate. Both are 0 before any such call.
 *  Either pointer may be NULL. Since 0.1.
 *  Fails: EINVAL (ws NULL) | Allocates: no */
MCD_API mcd_status mcd_workspace_iterative_outcome(const mcd_workspace *ws,
                                                double *out_max_error,
                                                size_t *out_max_iter);

/** Number of OpenMP threads used by later batched calls on this workspace:
 *  0 (default) means the OpenMP default (OMP_NUM_THREADS), capped at the
 *  thread count the workspace was allocated for (omp_get_max_threads() at
 *  mcd_workspace_new time). Ignored, and always 1, in a build without
 *  OpenMP. Since 0.1.
 *  Fails: EINVAL (ws NULL) | Allocates: no */
MCD_API mcd_status mcd_workspace_set_threads(mcd_workspace *ws,
                                             size_t n_threads);

/** Declare a temperature range [T_min, T_max] over which batched calls may
 *  evaluate the Chapman-Enskog and Wilke-Lee pairs of this mixture from a
 *  fit instead of exactly: for each such pair, Omega_D(T / eps) is fitted
 *  by a Chebyshev polynomial in ln T (interpolation at Chebyshev nodes, the
 *  degree raised up to 24 until the error is below 1e-12 or stops
 *  improving). The fit's largest relative error on Đ over the range
 *  (checked on a fine grid) is returned. Cells outside the range, and
 *  mcd_mixture_binaries and the single-state calls, stay exact. FSG and
 *  user pairs scale exactly and need no fit. Changing a pair's method or
 *  value afterwards refits it. T_min = T_max = 0 removes the fit.
 *  Not thread-safe with concurrent readers of the mixture. Since 0.1.
 *  @param T_min,T_max  range [K], 0 < T_min < T_max (or both 0).
 *  @param out_max_rel_err  largest relative fit error of Đ [-] (may be
 *                   NULL; 0 when no pair needs a fit).
 *  Fails: EINVAL, EDOM, ENOMEM | Allocates: yes */
MCD_API mcd_status mcd_mixture_set_temperature_fit(mcd_mixture *mix,
                                                   double T_min, double T_max,
                                                   double *out_max_rel_err);

/** The declared fit range and its largest relative error (all 0 when no
 *  fit is declared). Pointers may be NULL. Since 0.1.
 *  Fails: EINVAL (mix NULL) | Allocates: no */
MCD_API mcd_status mcd_mixture_temperature_fit(const mcd_mixture *mix,
                                               double *out_T_min,
                                               double *out_T_max,
                                               double *out_max_rel_err);

/* ------------------------------------------------------------------ */
/* Mass transfer: film / Stefan tube, two-bulb cell                    */
/* ------------------------------------------------------------------ */

/*
 * Steady film (Stefan tube, stagnant film of thickness L): isothermal,
 * isobaric ideal gas with constant total concentration c and binary
 * diffusivities Đ_ij; compositions x0 at z = 0 and xL at z = L; the total
 * molar fluxes N_i [mol/(m^2 s)] are constant across the film, positive
 * from z = 0 towards z = L. The Maxwell-Stefan equations
 *   c dx_i/dz = sum_{j != i} (x_i N_j - x_j N_i) / Đ_ij
 * are linear in x for given N, so the profile is a matrix exponential and
 * the fluxes follow from the exact matrix solution of Krishna and Standart
 * (1976). A bootstrap condition fixes the total flux N_t = sum N_i:
 * MCD_FILM_BOOT_STAGNANT (N_species = 0), EQUIMOLAR (N_t = 0), WEIGHTS
 * (sum nu_i N_i = 0, values = nu), TOTAL (values[0] = N_t) or RATIOS (see
 * mcd_film_solve). Pure-species ends, absent species and zero fluxes are
 * handled exactly.
 */

/** Condition that fixes the total flux of a film (mcd_film_solve): the
 *  local conditions of mcd_bootstrap (same meaning and numeric values)
 *  plus RATIOS, which only a film can impose. */
typedef enum mcd_film_bootstrap {
    MCD_FILM_BOOT_TOTAL = 0,     /**< values[0] = N_t [mol/(m^2 s)] */
    MCD_FILM_BOOT_STAGNANT = 1,  /**< species `species` does not move */
    MCD_FILM_BOOT_EQUIMOLAR = 2, /**< N_t = 0 */
    MCD_FILM_BOOT_WEIGHTS = 3,   /**< sum_i nu_i N_i = 0; values = nu */
    MCD_FILM_BOOT_RATIOS = 4     /**< N_i = z_i N_t for every species;
                                      values = z, length N, sum 1 */
} mcd_film_bootstrap;

/** Film theory used by mcd_film_solve. */
typedef enum mcd_film_method {
    MCD_FILM_EXACT = 0,     /**< Krishna-Standart exact matrix solution:
                                 [D] varies with x through the film */
    MCD_FILM_LINEARIZED = 1 /**< linearized theory (Toor 1964; Stewart and
                                 Prober 1964): [D] constant, evaluated at
                                 the mean composition (x0 + xL)/2 */
} mcd_film_method;

/** A steady film or Stefan tube: the input of mcd_film_solve and
 *  mcd_film_profile. Zero-initialise it and set the fields. Since 0.2. */
typedef struct mcd_film {
    size_t n_species;  /**< N, 2..capacity of the workspace */
    double c;          /**< total molar concentration [mol/m^3], > 0 */
    double L;          /**< film thickness or tube length [m], > 0 */
    const double *Dij; /**< binary diffusivities [m^2/s], N x N */
    const double *x0;  /**< mole fractions at z = 0, length N */
    const double *xL;  /**< mole fractions at z = L, length N
                            (mcd_film_solve only) */
} mcd_film;

/** Steady fluxes through a film between two compositions. Since 0.1.
 *
 *  Iterates on the fluxes (successive substitution with Anderson mixing)
 *  to a relative change <= 1e-12 within 200 iterations. With RATIOS the
 *  fluxes are N_i = z_i N_t exactly for every species, N_t is the one
 *  unknown, and the end composition at z = L is matched for species
 *  `species` only; the other end values then follow from
 *  the film (see mcd_film_profile). Binary films reproduce the closed forms
 *  N_A = (c Đ/L) ln((1 - xA_L)/(1 - xA_0)) (B stagnant) and
 *  N_A = z_A (c Đ/L) ln((z_A - xA_L)/(z_A - xA_0)) (ratios).
 *
 *  @param ws       workspace with capacity >= film->n_species.
 *  @param film     the film (mcd_film); its fields are checked as follows
 *                  and messages name them ("argument x0: entry 1 ..."):
 *    n_species     number of species N, 2..capacity.
 *    Dij           binary diffusivities [m^2/s], N x N row-major, symmetric
 *                  (relative difference <= 1e-12), off-diagonal normal
 *                  positive numbers (>= DBL_MIN; a subnormal one is EDOM,
 *                  as in the flux calls), diagonal ignored.
 *    c             total molar concentration [mol/m^3], > 0.
 *    L             film thickness or tube length [m], > 0.
 *    x0            mole fractions at z = 0, length N, validated as by
 *                  mcd_comp_normalize (sum within MCD_SUM_TOL of 1).
 *    xL            mole fractions at z = L, same rules.
 *  @param kind     bootstrap condition (mcd_film_bootstrap).
 *  @param species  for STAGNANT: the species that does not move (present,
 *                  x > 0, at both ends); for RATIOS: the species whose end
 *                  composition is matched; ignored otherwise.
 *  @param values   TOTAL: N_t [mol/(m^2 s)], length 1; WEIGHTS: nu [-],
 *                  length N; RATIOS: z [-], length N, sum 1; NULL
 *                  otherwise.
 *  @param method   MCD_FILM_EXACT or MCD_FILM_LINEARIZED.
 *  @param out_N    total molar fluxes [mol/(m^2 s)], length N.
 *  @param out_iterations  iterations used (may be NULL).
 *  @param out_residual    last relative flux change; for RATIOS the last
 *                  |x_species(L) - xL_species| (may be NULL).
 *  Fails: EINVAL (NULL, NaN, n or enum out of range), EBADLEN (n >
 *  capacity), EDOM (compositions, c, L or Đ out of range, stagnant species
 *  absent at an end, sum nu_i x_i = 0 at both ends, RATIOS with species
 *  absent at z = 0 and z_species = 0, rate factor |N_t| L/(c Đ) beyond
 *  1e4), ESING (singular matrix), ENOCONV (no convergence, e.g. RATIOS
 *  with z_species between the two end values, where no flux reproduces
 *  xL, or RATIOS where the only N_t that reproduce xL lie far from the
 *  linearized estimate and give mole fractions outside [0, 1] inside the
 *  film; mcd_last_error() gives the last residual) | Allocates: no
 *  | Threads: one ws per thread */
MCD_API mcd_status mcd_film_solve(mcd_workspace *ws, const mcd_film *film,
                                  mcd_film_bootstrap kind, size_t species,
                                  const double *values,
                                  mcd_film_method method, double *out_N,
                                  size_t *out_iterations,
                                  double *out_residual);

/** Composition profile of a steady film for given fluxes: the exact
 *  solution x(z) = exp((z/c) [A]) x0 of the Maxwell-Stefan equations, with
 *  A_ii = sum_{j != i} N_j/Đ_ij and A_ij = -N_i/Đ_ij, by scaling and
 *  squaring. With the fluxes of mcd_film_solve (EXACT), x(L) = xL.
 *  Since 0.1.
 *  @param N         total molar fluxes [mol/(m^2 s)], length N (finite).
 *  @param n_points  number of positions (0 writes nothing).
 *  @param z         positions [m], length n_points, each in [0, L].
 *  @param out_x     mole fractions, n_points x N row-major (row = position).
 *  @param film      as in mcd_film_solve; xL is not used.
 *  Fails: EINVAL, EBADLEN, EDOM | Allocates: no | Threads: one ws per
 *  thread */
MCD_API mcd_status mcd_film_profile(mcd_workspace *ws, const mcd_film *film,
                                    const double *N, size_t n_points,
                                    const double *z, double *out_x);

/*
 * Two-bulb diffusion cell: well-mixed bulbs of volumes V1 and V2 [m^3]
 * joined by a capillary of cross-section A [m^2] and length L [m], closed,
 * isothermal and isobaric (ideal gas): the capillary carries no net molar
 * flux (equimolar counter-diffusion) and is treated as quasi-steady. Every
 * species is conserved, V1 x1(t) + V2 x2(t) = V1 x1(0) + V2 x2(0), and
 * both bulbs tend to the volume-weighted mean composition.
 */

/** A two-bulb cell and its initial state: the input of mcd_bulbs_linearized
 *  and mcd_bulbs_integrate. Zero-initialise it and set the fields.
 *  Since 0.2. */
typedef struct mcd_bulbs {
    size_t n_species;   /**< N, 2..capacity of the workspace */
    double c;           /**< total molar concentration [mol/m^3], > 0 */
    double V1;          /**< volume of bulb 1 [m^3], > 0 */
    double V2;          /**< volume of bulb 2 [m^3], > 0 */
    double A;           /**< capillary cross-section [m^2], > 0 */
    double L;           /**< capillary length [m], > 0 */
    const double *Dij;  /**< binary diffusivities as in mcd_film */
    const double *x1_0; /**< initial mole fractions of bulb 1, length N */
    const double *x2_0; /**< initial mole fractions of bulb 2, length N */
} mcd_bulbs;

/** Two-bulb compositions by the linearized theory (Toor 1964; Stewart and
 *  Prober 1964): [D] (molar frame, ideal gas) constant at the
 *  volume-weighted mean composition, so that the difference
 *  Delta = x1 - x2 obeys d Delta/dt = -beta [D] Delta with
 *  beta = A (V1 + V2) / (L V1 V2), solved through the eigen-decomposition
 *  of [D] (LAPACK dgeev). Since 0.1.
 *  @param ws        workspace with capacity >= bulbs->n_species.
 *  @param bulbs     the cell and its initial state (mcd_bulbs); messages
 *                   name its fields.
 *  @param n_times   number of output times (0 writes nothing).
 *  @param t         output times [s], length n_times, each >= 0.
 *  @param out_x1,out_x2  mole fractions, n_times x N row-major each
 *                   (row = time).
 *  Fails: EINVAL, EBADLEN, EDOM, ESING | Allocates: no | Threads: one ws
 *  per thread */
MCD_API mcd_status mcd_bulbs_linearized(mcd_workspace *ws,
                                        const mcd_bulbs *bulbs,
                                        size_t n_times, const double *t,
                                        double *out_x1, double *out_x2);

/** Two-bulb compositions by time integration: the capillary flux at each
 *  instant is the exact steady equimolar film solution between x1 and x2
 *  (mcd_film_solve, EXACT, MCD_FILM_BOOT_EQUIMOLAR), and c V1 dx1/dt = -A N
 *  is integrated by an embedded Runge-Kutta 5(4) pair (Dormand and Prince
 *  1980) with error control; x2 follows from conservation, so every
 *  species is conserved to round-off. Since 0.1.
 *  @param t         output times [s], length n_times, each >= 0 and
 *                   non-decreasing.
 *  @param rel_tol   local error tolerance [-] on mole fractions, in
 *                   [1e-12, 1e-2].
 *  Other parameters as in mcd_bulbs_linearized.
 *  Fails: EINVAL, EBADLEN, EDOM, ESING, ENOCONV (step size underflow or
 *  film not converging) | Allocates: no | Threads: one ws per thread */
MCD_API mcd_status mcd_bulbs_integrate(mcd_workspace *ws,
                                       const mcd_bulbs *bulbs, size_t n_times,
                                       const double *t, double rel_tol,
                                       double *out_x1, double *out_x2);

#ifdef __cplusplus
}
#endif

#endif /* MCDIFF_H */
