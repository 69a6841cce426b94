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
#define MCD_VERSION_MINOR 4
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
/** Index of a species by what a user types. Since 0.1 (the rules after
 *  the first two since 0.3). The first rule that gives one species wins:
 *  the name, case-insensitive; the name with spaces and '_' read as '-'
 *  ("carbon dioxide"); a common synonym of a built-in species ("propene",
 *  "R-134a", "sulphur dioxide"); a formula by composition ("C2H6O" finds
 *  ethanol, written C2H5OH); text that is not a formula but matches one
 *  species' formula in another case ("h2o").
 *  Fails: EINVAL, ENOTFOUND (the detail names the species when a formula
 *  fits several, e.g. C4H10, and suggests the closest names on a miss)
 *  | Allocates: no */
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
    MCD_METHOD_USER = 5,           /**< value supplied by the caller */
    MCD_METHOD_TYN_CALUS = 6,      /**< Tyn-Calus (dilute solute in liquid)
                                        Since 0.3. */
    MCD_METHOD_HAYDUK_MINHAS = 7,  /**< Hayduk-Minhas (dilute solute in
                                        water). Since 0.3. */
    MCD_METHOD_BROKAW = 8          /**< Chapman-Enskog with Brokaw's (1969)
                                        polar (Stockmayer) correction
                                        (gases). Since 0.4. */
} mcd_method;

/** Gas-phase correlations, the methods a database pair or a mixture pair
 *  can be estimated by (numerically equal to the mcd_method values of the
 *  same name, so a gas method can be passed to mcd_method_name), and the
 *  per-pair choice MCD_GAS_RECOMMENDED of a mixture. */
typedef enum mcd_gas_method {
    MCD_GAS_FSG = 1,            /**< Fuller-Schettler-Giddings */
    MCD_GAS_CHAPMAN_ENSKOG = 2, /**< Chapman-Enskog, Lennard-Jones */
    MCD_GAS_WILKE_LEE = 3,      /**< Wilke-Lee */
    MCD_GAS_BROKAW = 8,         /**< Brokaw's polar correction, for database
                                     pairs (Since 0.4) and mixture pairs
                                     (Since 0.4: mcd_mixture_new,
                                     mcd_mixture_set_method). */
    MCD_GAS_RECOMMENDED = 100   /**< Mixtures only: each pair gets the
                                     method `mcdiff binary` recommends for
                                     it: MCD_GAS_BROKAW when either species
                                     is polar (dipole above 1 debye, the
                                     rule of MCD_WARN_POLAR) and both have
                                     Brokaw's data (dipole, Vb, Tb); else
                                     the first of FSG, Chapman-Enskog,
                                     Wilke-Lee whose parameters the pair
                                     has (FSG when none has). Not an
                                     mcd_method: mcd_mixture_pair_method
                                     tells the method picked. A database
                                     pair (mcd_db_binary_gas) refuses it
                                     with EINVAL. Since 0.4. */
} mcd_gas_method;

/** Short name of a method ("fsg", "chapman-enskog", "wilke-lee",
 *  "wilke-chang", "user", "tyn-calus", "hayduk-minhas", "brokaw"), or NULL.
 *  Since 0.1. */
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
/** Chapman-Enskog with Brokaw's (1969) polar correction (Stockmayer
 *  potential): per species delta = 1.94e3 mu^2 / (Vb Tb) (mu in debye, Vb
 *  in cm^3/mol), eps/k = 1.18 (1 + 1.3 delta^2) Tb, sigma = (1.585 Vb /
 *  (1 + 1.3 delta^2))^(1/3) Angstrom; geometric-mean combining rules; and
 *  Omega_D = Omega_D(T*) + 0.19 delta_AB^2 / T*. Meant for pairs with a
 *  polar species (a nonpolar one has dipole 0). Since 0.4.
 *  @param MA,MB molar masses [kg/mol]; @param dipA,dipB dipole moments
 *  [C m] (>= 0); @param VbA,VbB liquid molar volumes at the normal boiling
 *  point [m^3/mol]; @param TbA,TbB normal boiling points [K].
 *  Fails: EINVAL (NaN/inf, NULL), EDOM (non-positive input, negative
 *  dipole) | Allocates: no */
MCD_API mcd_status mcd_binary_brokaw(double T, double P, double MA, double MB,
                                     double dipA, double dipB, double VbA,
                                     double VbB, double TbA, double TbB,
                                     double *out_D);
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
 *  MCD_GAS_BROKAW (Since 0.4) needs the dipole, Vb and Tb of both species
 *  and is the method to prefer when either is polar (MCD_WARN_POLAR of the
 *  other methods: dipole above 1 debye); its own estimate does not carry
 *  MCD_WARN_POLAR.
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

/** Widening factors of the typical error under warnings (a rule of thumb,
 *  common practice, not a published law): the stated error is the
 *  method's published average times the factor of every warning class
 *  that applies, capped at 1 (100 %). Polar, associating, quantum gas and
 *  high pressure double it each (polar and hydrogen-bonding pairs show
 *  errors of 20-27 % where the published average of a gas method is
 *  5-8 %); temperature out of range, an estimated parameter and a value
 *  scaled far from its reference state multiply it by 1.5 each. */
#define MCD_WIDEN_MAJOR 2.0
/** Factor of MCD_WARN_TEMPERATURE, _ESTIMATED_PARAM and _SCALED. */
#define MCD_WIDEN_MINOR 1.5
/** Cap of the widened error [-] (beyond it an estimate gives an order of
 *  magnitude only). */
#define MCD_WIDEN_CAP 1.0

/** Typical relative error of an estimate by method m that carries the
 *  MCD_WARN_* bits warn: mcd_method_typical_error(m) times
 *  MCD_WIDEN_MAJOR for each of HIGH_PRESSURE, POLAR, QUANTUM,
 *  ASSOCIATING and MCD_WIDEN_MINOR for each of TEMPERATURE,
 *  ESTIMATED_PARAM, SCALED that is set, at most MCD_WIDEN_CAP. NaN (status
 *  OK) when the method has no published error (MCD_METHOD_USER).
 *  @param m       a method of mcd_method
 *  @param warn    MCD_WARN_* bits as returned with the estimate
 *  @param out_rel_err  widened relative error [-]. Since 0.4.
 *  Fails: EINVAL (NULL, unknown method, unknown warning bit)
 *  | Allocates: no */
MCD_API mcd_status mcd_typical_error_widened(mcd_method m, unsigned warn,
                                             double *out_rel_err);

/** @name Slots of mcd_db_binary_explain's output
 *  Indices into the array of MCD_EXPLAIN_COUNT doubles; a slot the method
 *  does not use is NaN. Slots from MCD_EXPLAIN_RESERVED on are NaN and
 *  reserved for later methods. Since 0.4.
 *  @{ */
#define MCD_EXPLAIN_D 0         /**< the estimate D [m^2/s] */
#define MCD_EXPLAIN_T 1         /**< temperature [K] */
#define MCD_EXPLAIN_P 2         /**< pressure [Pa] (gas methods) */
#define MCD_EXPLAIN_M_A 3       /**< molar mass of A (solute) [kg/mol] */
#define MCD_EXPLAIN_M_B 4       /**< molar mass of B (solvent) [kg/mol] */
#define MCD_EXPLAIN_M_AB 5      /**< 2 / (1/M_A + 1/M_B) [kg/mol] (gas) */
#define MCD_EXPLAIN_V_A 6       /**< diffusion volume of A [-] (FSG) */
#define MCD_EXPLAIN_V_B 7       /**< diffusion volume of B [-] (FSG) */
#define MCD_EXPLAIN_V_ROOTS 8   /**< V_A^(1/3) + V_B^(1/3) [-] (FSG) */
#define MCD_EXPLAIN_SIGMA_A 9   /**< Lennard-Jones sigma of A [m] */
#define MCD_EXPLAIN_SIGMA_B 10  /**< Lennard-Jones sigma of B [m] */
#define MCD_EXPLAIN_SIGMA_AB 11 /**< (sigma_A + sigma_B) / 2 [m]; Brokaw:
                                     (sigma_A sigma_B)^(1/2), sigma and
                                     eps/k from Vb, Tb and the dipole */
#define MCD_EXPLAIN_EPS_A 12    /**< epsilon/k of A [K] */
#define MCD_EXPLAIN_EPS_B 13    /**< epsilon/k of B [K] */
#define MCD_EXPLAIN_EPS_AB 14   /**< sqrt(eps_A eps_B) [K] */
#define MCD_EXPLAIN_T_STAR 15   /**< T / eps_AB [-] */
#define MCD_EXPLAIN_OMEGA_D 16  /**< collision integral Omega_D(T*) [-];
                                     Brokaw: + 0.19 delta_AB^2 / T* */
#define MCD_EXPLAIN_WL_FACTOR 17 /**< Wilke-Lee 3.03 - 0.98 / M_AB^(1/2),
                                      M_AB in g/mol [-] */
#define MCD_EXPLAIN_PHI 18      /**< Wilke-Chang association factor of the
                                     solvent [-] */
#define MCD_EXPLAIN_MU_B 19     /**< solvent viscosity [Pa s] */
#define MCD_EXPLAIN_VB_A 20     /**< solute molar volume at its normal
                                     boiling point [m^3/mol] */
#define MCD_EXPLAIN_REL_ERR 21  /**< method's published typical error [-] */
#define MCD_EXPLAIN_REL_ERR_WIDENED 22 /**< mcd_typical_error_widened [-] */
#define MCD_EXPLAIN_WARN 23     /**< MCD_WARN_* bits (an integer) */
#define MCD_EXPLAIN_ESTIMATED 24 /**< 1 when sigma or eps/k was estimated
                                      from Vb or Tb, else 0 (LJ methods) */
#define MCD_EXPLAIN_DELTA_A 25  /**< Brokaw's polar parameter of A,
                                     1.94e3 mu_p^2 / (Vb Tb) (mu_p in
                                     debye, Vb in cm^3/mol, Tb in K) [-] */
#define MCD_EXPLAIN_DELTA_B 26  /**< the same of B [-] */
#define MCD_EXPLAIN_DELTA_AB 27 /**< (delta_A delta_B)^(1/2) [-] */
#define MCD_EXPLAIN_RESERVED 28 /**< first reserved slot */
#define MCD_EXPLAIN_COUNT 32    /**< length of the output array */
/** @} */

/** The intermediates behind a binary estimate, so that it can be checked
 *  by hand: the same estimate as mcd_db_binary_gas (a, b, gas methods) or
 *  mcd_db_binary_liquid (a the solute, b the solvent, MCD_METHOD_WILKE_CHANG)
 *  with the quantities its formula combines, each in its MCD_EXPLAIN_*
 *  slot (SI units as listed there; unused slots NaN). D in the D slot is
 *  bit for bit the value of the estimating call.
 *  @param db          species database
 *  @param a,b         species indices (0-based)
 *  @param method      MCD_METHOD_FSG, _CHAPMAN_ENSKOG, _WILKE_LEE or
 *                     _WILKE_CHANG
 *  @param T           temperature [K]
 *  @param P           pressure [Pa] (gas methods; ignored by Wilke-Chang)
 *  @param mu_solvent  viscosity of b [Pa s] (Wilke-Chang; ignored by gas
 *                     methods)
 *  @param out_values  MCD_EXPLAIN_COUNT doubles, written only on success.
 *  Since 0.4.
 *  Fails: EINVAL (NULL, method), EDOM, ENODATA, ENOTFOUND | Allocates: no */
MCD_API mcd_status mcd_db_binary_explain(const mcd_db *db, size_t a, size_t b,
                                         mcd_method method, double T,
                                         double P, double mu_solvent,
                                         double *out_values);

/* ------------------------------------------------------------------ */
/* Mixtures: N species and their binary diffusivities                  */
/* ------------------------------------------------------------------ */

/** N species with their binary diffusivities, estimated or given
 *  (opaque; mcd_mixture_new, mcd_mixture_free). */
typedef struct mcd_mixture mcd_mixture;

/** New mixture of n species picked by name from db (parameters are copied:
 *  the mixture does not refer to db afterwards). Every pair uses the
 *  default method until changed (MCD_GAS_RECOMMENDED: each pair its
 *  recommended one; MCD_GAS_BROKAW and MCD_GAS_RECOMMENDED Since 0.4).
 *  A species named twice is EINVAL. A pair whose method lacks a parameter
 *  is no failure here: mcd_mixture_binaries and the flux calls return
 *  ENODATA naming the pair, the species and the parameter.
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
 *  MCD_GAS_RECOMMENDED picks the pair's recommended method (see
 *  mcd_gas_method). Since 0.1 (MCD_GAS_BROKAW, MCD_GAS_RECOMMENDED Since
 *  0.4). Fails: EINVAL, EBADLEN (index) | Allocates: no */
MCD_API mcd_status mcd_mixture_set_method(mcd_mixture *mix, size_t i,
                                          size_t j, mcd_gas_method m);
/** The method pair (i, j) (i != j) is estimated by: the gas method set
 *  (for MCD_GAS_RECOMMENDED the one it picked: MCD_METHOD_BROKAW,
 *  _FSG, _CHAPMAN_ENSKOG or _WILKE_LEE), or MCD_METHOD_USER for a value
 *  given with mcd_mixture_set_binary. Since 0.4.
 *  @param out_method  the pair's mcd_method (untouched on failure).
 *  Fails: EINVAL (NULL, i == j), EBADLEN (index) | Allocates: no */
MCD_API mcd_status mcd_mixture_pair_method(const mcd_mixture *mix, size_t i,
                                           size_t j, mcd_method *out_method);
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
/* Gas viscosity                                                       */
/* ------------------------------------------------------------------ */

/** Typical relative error of a pure-gas viscosity by Chapman-Enskog with
 *  Lennard-Jones parameters fitted to viscosity, for non-polar gases
 *  (Poling, Prausnitz and O'Connell 2001, sec. 9-4, from memory). Polar
 *  gases are flagged MCD_WARN_POLAR and are worse. Since 0.3. */
#define MCD_VISC_CE_TYPICAL_ERROR 0.015
/** Typical relative error added by Wilke's mixing rule for non-polar
 *  mixtures (same source, sec. 9-5, from memory); mixtures of H2 or He
 *  with heavy gases are worse. Since 0.3. */
#define MCD_VISC_WILKE_TYPICAL_ERROR 0.02

/** Neufeld-Janzen-Aziz (1972) fit of the Lennard-Jones collision integral
 *  Omega(2,2)* for viscosity, valid 0.3 <= T* <= 100 (T* = k T / eps).
 *  Since 0.3.
 *  Fails: EINVAL (NULL, NaN), EDOM (T* <= 0) | Allocates: no */
MCD_API mcd_status mcd_viscosity_omega22(double T_star, double *out_omega);

/** Viscosity [Pa s] of a pure gas at low pressure by the first
 *  Chapman-Enskog approximation, mu = (5/16) sqrt(M k T / (pi N_A)) /
 *  (sigma^2 Omega(2,2)*(T / eps_k)). Typical error
 *  MCD_VISC_CE_TYPICAL_ERROR for non-polar gases. Since 0.3.
 *  @param T      temperature [K], > 0.
 *  @param M      molar mass [kg/mol], > 0.
 *  @param sigma  Lennard-Jones sigma [m], > 0.
 *  @param eps_k  Lennard-Jones epsilon/k [K], > 0.
 *  @param out_mu viscosity [Pa s].
 *  Fails: EINVAL (NULL, NaN), EDOM (non-positive input, overflow)
 *  | Allocates: no */
MCD_API mcd_status mcd_viscosity_chapman_enskog(double T, double M,
                                                double sigma, double eps_k,
                                                double *out_mu);

/** Viscosity [Pa s] of a gas mixture from its species' viscosities by
 *  Wilke's (1950) mixing rule: mu = sum_i x_i mu_i / sum_j x_j Phi_ij,
 *  Phi_ij = [1 + (mu_i/mu_j)^(1/2) (M_j/M_i)^(1/4)]^2 / [8 (1 +
 *  M_i/M_j)]^(1/2). Typical error MCD_VISC_WILKE_TYPICAL_ERROR beyond the
 *  species' own. Since 0.3.
 *  @param n_species  N, 1..MCD_MAX_SPECIES.
 *  @param M      molar masses [kg/mol], length N, > 0.
 *  @param mu     species viscosities [Pa s] at the mixture's T, length N,
 *                > 0 (measured, or from mcd_viscosity_chapman_enskog).
 *  @param x      mole fractions, length N, validated as mcd_comp_normalize.
 *  @param out_mu mixture viscosity [Pa s].
 *  Fails: EINVAL, EDOM | Allocates: no */
MCD_API mcd_status mcd_viscosity_wilke(size_t n_species, const double *M,
                                       const double *mu, const double *x,
                                       double *out_mu);

/** Viscosity [Pa s] of species i of a database at low pressure by
 *  Chapman-Enskog from its molar mass and Lennard-Jones parameters.
 *  Since 0.3.
 *  @param out_rel_err  MCD_VISC_CE_TYPICAL_ERROR (may be NULL).
 *  @param out_warn     MCD_WARN_* bits: TEMPERATURE (T* outside the fit
 *                      range), POLAR (dipole > 1 debye), QUANTUM (H2, D2,
 *                      He below 100 K), ASSOCIATING (may be NULL).
 *  Fails: EINVAL, EDOM, ENOTFOUND (index), ENODATA (M, sigma or eps/k
 *  missing) | Allocates: no */
MCD_API mcd_status mcd_db_viscosity_gas(const mcd_db *db, size_t i, double T,
                                        double *out_mu, double *out_rel_err,
                                        unsigned *out_warn);

/** Viscosities [Pa s] of every species of a mixture at T, as
 *  mcd_db_viscosity_gas (out_mu length N, written only when every species
 *  succeeds); out_warn is the OR of their warning bits (may be NULL). Pass
 *  them to mcd_viscosity_wilke for the mixture's viscosity. Since 0.3.
 *  Fails: EINVAL, EDOM, ENODATA | Allocates: no */
MCD_API mcd_status mcd_mixture_viscosities(const mcd_mixture *mix, double T,
                                           double *out_mu, unsigned *out_warn);

/* ------------------------------------------------------------------ */
/* Thermal diffusion factors from kinetic theory                       */
/* ------------------------------------------------------------------ */

/** Typical relative error of a binary thermal diffusion factor alpha_T by
 *  the first Chapman-Enskog approximation with Lennard-Jones parameters
 *  fitted to viscosity, for pairs of non-polar gases near room
 *  temperature (our reading of the comparisons with measurements reviewed
 *  by Grew and Ibbs 1952 and by Mason, Munn and Smith 1966, from memory;
 *  tests/test_thermal_kt.c compares five pairs). Thermal diffusion
 *  estimates are much less accurate than diffusivity estimates: the first
 *  approximation lies below the converged theory by up to some 10 % for
 *  very unequal masses, polyatomic gases lose part of the effect to
 *  inelastic collisions, and alpha_T is a small difference of large terms
 *  that changes sign at low T*, where the relative error is unbounded.
 *  Since 0.4. */
#define MCD_THERMAL_CE_TYPICAL_ERROR 0.2
/** Typical relative error of the pairwise thermal diffusion ratios of a
 *  mixture of three or more species (mcd_mixture_thermal_ratios): an
 *  estimate of ours, not a published figure; fair for light species in
 *  heavier gases, worse between heavy species. Since 0.4. */
#define MCD_THERMAL_MIX_TYPICAL_ERROR 0.3

/** Reduced collision integrals of the Lennard-Jones (12-6) potential and
 *  their ratios, at T* = k T / eps in 0.3..100. Since 0.4.
 *
 *  From a table computed once by direct quadrature of the kinetic-theory
 *  definitions (classical deflection angle, cross sections, thermal
 *  average; Hirschfelder, Curtiss and Bird 1954, eqs. 8.2-1 to 8.2-5;
 *  tools/gen_collision.c), interpolated in ln T*. Omega(1,1)* and
 *  Omega(2,2)* agree with the Neufeld-Janzen-Aziz fits
 *  (mcd_binary_omega_d, mcd_viscosity_omega22) to about 0.1 %.
 *  @param T_star      reduced temperature [-], 0.3..100.
 *  @param out_omega   length 4: Omega(1,1)*, Omega(1,2)*, Omega(1,3)*,
 *                     Omega(2,2)* (may be NULL).
 *  @param out_ratios  length 3: A* = Omega(2,2)* / Omega(1,1)*,
 *                     B* = (5 Omega(1,2)* - 4 Omega(1,3)*) / Omega(1,1)*,
 *                     C* = Omega(1,2)* / Omega(1,1)* (may be NULL; not both).
 *  Fails: EINVAL (NaN, both outputs NULL), EDOM (T* outside 0.3..100)
 *  | Allocates: no */
MCD_API mcd_status mcd_lj_collision_integrals(double T_star,
                                              double *out_omega,
                                              double *out_ratios);

/** Binary thermal diffusion factor alpha_T [-] in the first Chapman-Enskog
 *  approximation from given collision quantities (any potential): the
 *  formula of Chapman and Cowling and of Hirschfelder, Curtiss and Bird
 *  (1954, eqs. 8.2-50 ff.; lib/props/thermal_ce.c writes it out),
 *  alpha_T = (6 C - 5) (x1 S1 - x2 S2) / (x1^2 Q1 + x2^2 Q2 + x1 x2 Q12).
 *  It vanishes for Maxwell molecules (C = 5/6). k_T = x1 x2 alpha_T;
 *  alpha_T > 0 when species 1 moves to the cold side. Since 0.4.
 *  @param M1,M2  molar masses [kg/mol], > 0.
 *  @param x1     mole fraction of species 1, 0..1.
 *  @param A,B,C  the unlike pair's ratios A*, B*, C* [-], > 0.
 *  @param R1,R2  sigma_i^2 Omega(2,2)*_i / (sigma_12^2 Omega(1,1)*_12)
 *                [-], > 0 (the like pairs' viscosity cross sections over
 *                the unlike pair's diffusion cross section).
 *  @param out_alpha  alpha_T [-].
 *  Fails: EINVAL (NULL, NaN), EDOM (out of range, result not finite)
 *  | Allocates: no */
MCD_API mcd_status mcd_thermal_factor_kinetic(double M1, double M2, double x1,
                                              double A, double B, double C,
                                              double R1, double R2,
                                              double *out_alpha);

/** Binary thermal diffusion factor alpha_T [-] of two Lennard-Jones gases
 *  in the first Chapman-Enskog approximation (mcd_thermal_factor_kinetic
 *  with mcd_lj_collision_integrals; sigma_12 = (sigma_1 + sigma_2)/2,
 *  eps_12 = sqrt(eps_1 eps_2)). Typical error
 *  MCD_THERMAL_CE_TYPICAL_ERROR: far less accurate than a diffusivity.
 *  A reduced temperature outside 0.3..100 is clamped to the table's end
 *  and flagged. Since 0.4.
 *  @param T          temperature [K], > 0.
 *  @param M1,M2      molar masses [kg/mol]; @param sig1,sig2 sigma [m];
 *  @param eps1,eps2  epsilon/k [K]; all > 0.
 *  @param x1         mole fraction of species 1, 0..1.
 *  @param out_alpha  alpha_T [-], > 0 when species 1 goes to the cold side.
 *  @param out_warn   MCD_WARN_TEMPERATURE (may be NULL).
 *  Fails: EINVAL, EDOM | Allocates: no */
MCD_API mcd_status mcd_thermal_factor_ce(double T, double M1, double M2,
                                         double sig1, double sig2,
                                         double eps1, double eps2, double x1,
                                         double *out_alpha,
                                         unsigned *out_warn);

/** Binary thermal diffusion factor alpha_T [-] of species a and b of a
 *  database at x_a (as mcd_thermal_factor_ce; Lennard-Jones parameters
 *  estimated as for mcd_db_binary_gas when missing). Since 0.4.
 *  @param out_rel_err  MCD_THERMAL_CE_TYPICAL_ERROR widened by the
 *                      warnings below by the rule of
 *                      mcd_typical_error_widened (may be NULL).
 *  @param out_warn     MCD_WARN_* bits: TEMPERATURE (a T* outside
 *                      0.3..100), POLAR, QUANTUM, ASSOCIATING,
 *                      ESTIMATED_PARAM (may be NULL).
 *  Fails: EINVAL (a == b), EDOM, ENOTFOUND (index), ENODATA
 *  | Allocates: no */
MCD_API mcd_status mcd_db_thermal_factor(const mcd_db *db, size_t a, size_t b,
                                         double T, double x_a,
                                         double *out_alpha,
                                         double *out_rel_err,
                                         unsigned *out_warn);

/** Thermal diffusion ratios k_T,i [-] of a gas mixture for mcd_state.kT,
 *  pairwise from binary first approximations:
 *  k_T,i = sum_{j != i} x_i x_j alpha_T,ij(x_i / (x_i + x_j)). They sum to
 *  zero exactly; N = 2 gives the binary k_T = x1 x2 alpha_T; a trace
 *  species gets x_i sum_j x_j alpha_T,ij(0), the usual estimate for a light
 *  trace species (H2, He) in a mixture. The coupling through third
 *  species is ignored: fair for light species in heavier gases, rough
 *  between heavy species. Typical error MCD_THERMAL_CE_TYPICAL_ERROR for
 *  two species, MCD_THERMAL_MIX_TYPICAL_ERROR beyond. Since 0.4.
 *  @param T       temperature [K], > 0.
 *  @param x       mole fractions, length N, validated as mcd_comp_normalize.
 *  @param out_kT  length N, k_T,i > 0 when species i moves to the cold side.
 *  @param out_theta  length N, theta_i = k_T,i / x_i = sum_j x_j
 *                 alpha_T,ij, finite also for a species with x_i = 0 (the
 *                 input of mcd_dufour_heat_flux); may be NULL.
 *  @param out_rel_err  typical relative error (may be NULL), widened by
 *                      out_warn by the rule of mcd_typical_error_widened.
 *  @param out_warn     OR of the pairs' warning bits (may be NULL).
 *  Fails: EINVAL, EDOM, ENODATA | Allocates: no */
MCD_API mcd_status mcd_mixture_thermal_ratios(const mcd_mixture *mix, double T,
                                              const double *x, double *out_kT,
                                              double *out_theta,
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
    const double *kT;       /**< thermal diffusion ratios k_T,i [-], N, or
                                 NULL (fluxes only; Since 0.3) */
    const double *grad_lnT; /**< gradient of ln T [1/m], n_dim, or NULL
                                 (fluxes only; Since 0.3) */
} mcd_state;

/** Diffusion fluxes of all species at one state. Since 0.1.
 *
 *  Solves the Maxwell-Stefan equations
 *    d_i = sum_{j != i} (x_i J_j - x_j J_i) / (c Đ_ij),  sum_i J_i = 0,
 *    d_i = sum_j Gamma_ij grad x_j + (x_i - w_i) grad ln P
 *          + k_T,i grad ln T,
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
 *    kT, grad_lnT     thermal diffusion: the thermal diffusion ratios
 *                     k_T,i [-] (length N, finite, summing to zero as
 *                     kinetic theory gives them; mcd_thermal_ratios makes
 *                     them from thermal diffusion coefficients D_i^T) and
 *                     grad ln T [1/m] (length n_dim, finite). Both or
 *                     neither: one without the other is EINVAL. For two
 *                     species J_1 = -c D_12 (grad x_1 + k_T grad ln T),
 *                     k_T = k_T,1 = -k_T,2 > 0 when species 1 moves to
 *                     the cold side. The term enters every model the same
 *                     way (mixture-averaged: k_T,i are the thermal
 *                     diffusion ratios of V_i = -(D_im / x_i)(d_i)).
 *  @param flux_basis  MOLE: out_flux = J_i; MASS: out_flux = j_i.
 *  @param out_flux    N x n_dim; sums to zero over species to round-off.
 *  The driving forces are first projected onto sum_i d_i = 0 by
 *  d_i -= x_i sum_k d_k (removes round-off or an inconsistent Gamma; trace
 *  species are untouched). A NaN or infinite input is EINVAL, a finite
 *  out-of-range one EDOM. Accuracy: on the states of
 *  tests/test_edge_cases.c (Đ spread over up to 6 decades, N <= 100, trace
 *  species) the fluxes agree with an extended-precision solution to a
 *  normwise relative error below 1e-11 (measured about 1e-14). States of
 *  2 to 10 species without trace species (exact model) are solved in the
 *  grounded form, by an elimination without subtraction: on random
 *  states with Đ spread over 6 decades at most 8.2e-15 of the largest
 *  flux (32000 states a case, tests/test_ground.c), and scarce species
 *  tied to each other by a tiny Đ (1e-25 m^2/s, say) to 1e-13 of an exact
 *  solution. Other states take the scaled form, which reaches a few 1e-11
 *  on such random states (5.7e-11 at N = 8, measured) and can be far off
 *  on such tied states (1.8e-5 in one at N = 4, 0.018 in one at N = 7,
 *  before 0.4.0; a known issue, DEVELOPERS.md). Mass fluxes are differences of the terms
 *  M_i J_i; when the molar masses span so many decades that those terms
 *  cancel beyond double precision (fluxes that would not sum to zero), the
 *  call fails with EDOM instead (the molar fluxes remain available).
 *  Fails: EINVAL, EDOM, EBADLEN (N > capacity), ESING, EINTERNAL
 *  | Allocates: no
 *  | Threads: one ws per thread */
MCD_API mcd_status mcd_flux_compute(mcd_workspace *ws, mcd_model model,
                                    const mcd_state *state,
                                    mcd_basis flux_basis, double *out_flux);

/** Derivatives of the exact Maxwell-Stefan diffusion fluxes with respect
 *  to the mole fractions, at fixed gradients, for implicit and Newton
 *  solvers. Since 0.3.
 *
 *  The x_k are taken as independent variables of the equations of
 *  mcd_flux_compute (read with the fractions as given, not renormalised):
 *  d_i = sum_{j != i} (x_i J_j - x_j J_i) / (c Đ_ij) is linear in x and J,
 *  so dJ/dx_k solves the same equations with the driving force
 *    dd/dx_k - (sum_{j != i} J_j / (c Đ_ij) if i = k, else
 *               -J_i / (c Đ_ik)),
 *  where dd/dx_k is the derivative of the projected driving forces
 *  (pressure diffusion included through w(x); Gamma, grad, grad ln P, k_T
 *  and grad ln T held fixed). Cost: N + 1 solves. On the simplex (sum of
 *  the changes zero) the result is the derivative of mcd_flux_compute;
 *  along (1, ..., 1) it carries the homogeneity sum_k x_k dJ/dx_k = -J of
 *  an ideal mixture without pressure diffusion. The derivative with
 *  respect to the gradients is -c times the Fick matrix (mcd_fick_matrix).
 *
 *  @param state   as mcd_flux_compute, comp_basis MOLE (the mass basis is
 *                 EINVAL in this version).
 *  @param out_dJ  N n_dim x N: out_dJ[(i*n_dim + d)*N + k] =
 *                 dJ_{i,d}/dx_k [mol/(m^2 s)], molar fluxes relative to
 *                 the molar-average velocity.
 *  Fails: as mcd_flux_compute; EINVAL (mass basis); EDOM (a derivative
 *  not finite) | Allocates: no */
MCD_API mcd_status mcd_flux_jacobian_comp(mcd_workspace *ws,
                                          const mcd_state *state,
                                          double *out_dJ);

/** Derivatives of the fluxes of mcd_flux_compute with respect to its
 *  input fractions (comp, in state->comp_basis), at fixed gradients, for
 *  the exact and the mixture-averaged models, in either flux basis: the
 *  Jacobian an implicit or Newton solver needs. Since 0.4.
 *
 *  It is the derivative of what mcd_flux_compute returns, renormalisation
 *  of the fractions (x = y / sum y) included, so every row satisfies
 *  sum_k y_k dF_i/dy_k = 0 and every column sums to zero over species
 *  (the fluxes' zero-sum in their frame). Held fixed: the gradients as
 *  given (state->grad; with mass fractions the mole-fraction gradients
 *  that follow from them move with w, and that is included), Gamma,
 *  grad ln P, k_T, grad ln T, c and Dij. Pressure diffusion enters
 *  through w(x). The derivative with respect to the gradients is
 *  -c [D] (mcd_fick_matrix).
 *    MAXWELL_STEFAN: one extra flux solve per column (N + 1 in all), the
 *      same solver as mcd_flux_compute (trace species included).
 *    MIXTURE_AVERAGED: D_im = (1 - x_i) / sum_{j != i} x_j / Đ_ij and the
 *      correction flux differentiated in closed form, O(N^3) without a
 *      solve. At a pure component (one x_m = 1) that flux is not
 *      differentiable (the limit of D_mm depends on the direction of
 *      approach); the call returns the derivative with D_mm held at the
 *      value mcd_flux_compute uses there, (N - 1) / sum_j 1 / Đ_mj.
 *    ITERATIVE: EINVAL (use MAXWELL_STEFAN, which it approximates).
 *  Checked against fourth-order finite differences of mcd_flux_compute
 *  over thousands of random states, N = 2..30, trace species and nearly
 *  pure components (tests/test_flux_tangent.c).
 *
 *  @param ws         workspace with capacity >= N.
 *  @param model      MAXWELL_STEFAN or MIXTURE_AVERAGED.
 *  @param state      as mcd_flux_compute (either comp_basis).
 *  @param flux_basis MOLE: molar fluxes J_i; MASS: mass fluxes j_i (M
 *                    required).
 *  @param out_dflux  N n_dim x N: out_dflux[(i*n_dim + d)*N + k] =
 *                    dF_{i,d}/dy_k, [mol/(m^2 s)] or [kg/(m^2 s)] per
 *                    unit fraction. Written only on success.
 *  Fails: as mcd_flux_compute; EINVAL (ITERATIVE); EDOM (a derivative not
 *  finite) | Allocates: no | Threads: one ws per thread */
MCD_API mcd_status mcd_flux_jacobian(mcd_workspace *ws, mcd_model model,
                                     const mcd_state *state,
                                     mcd_basis flux_basis, double *out_dflux);

/** Derivatives of the fluxes of mcd_flux_compute with respect to the
 *  temperature and the pressure, at fixed composition, gradients,
 *  grad ln P, grad ln T, Gamma and k_T. Since 0.4.
 *
 *  The state's T and P enter the fluxes only through c and Dij, so this
 *  call includes exactly two dependences and says which: c = P / (R T)
 *  (ideal gas: dc/dT = -c / T, dc/dP = c / P, with the state's c), and
 *  the binary diffusivities' own, which the caller passes (dDij_dT,
 *  dDij_dP). For the power-law scaling of the Fuller-Schettler-Giddings
 *  estimate and of a mixture's caller values, Đ = a T^1.75 / P, pass
 *  dĐ/dT = 1.75 Đ / T and dĐ/dP = -Đ / P; for a tabulated or fitted Đ the
 *  slope of that fit. A zero matrix declares Dij independent of T or P.
 *  Not included: a temperature dependence of Gamma or k_T, and the change
 *  of grad ln T or grad ln P with T or P (held as given).
 *
 *  @param ws          workspace with capacity >= N.
 *  @param model       MAXWELL_STEFAN or MIXTURE_AVERAGED.
 *  @param state       as mcd_flux_compute.
 *  @param flux_basis  MOLE or MASS (as mcd_flux_compute).
 *  @param T           temperature [K] of the state, > 0 (read only when
 *                     out_dT is requested).
 *  @param P           pressure [Pa] of the state, > 0 (read only when
 *                     out_dP is requested).
 *  @param dDij_dT     dĐ_ij/dT [m^2/(s K)], N x N, finite, upper triangle
 *                     read (as Dij); required when out_dT is given.
 *  @param dDij_dP     dĐ_ij/dP [m^2/(s Pa)], likewise with out_dP.
 *  @param out_dT      N x n_dim: dF_{i,d}/dT, or NULL.
 *  @param out_dP      N x n_dim: dF_{i,d}/dP, or NULL (not both NULL).
 *                     Written only on success.
 *  Fails: as mcd_flux_jacobian; EINVAL (both outputs NULL, a needed
 *  dDij NULL, NaN); EDOM (T or P not > 0) | Allocates: no
 *  | Threads: one ws per thread */
MCD_API mcd_status mcd_flux_jacobian_tp(mcd_workspace *ws, mcd_model model,
                                        const mcd_state *state,
                                        mcd_basis flux_basis, double T,
                                        double P, const double *dDij_dT,
                                        const double *dDij_dP, double *out_dT,
                                        double *out_dP);

/** Dufour heat flux q_D [W/m^2]: the heat that diffusion fluxes carry
 *  through thermal diffusion's reciprocal effect, an optional output
 *  computed from fluxes already solved (it costs nothing when not
 *  called). Since 0.4.
 *
 *  From the linear laws of irreversible thermodynamics with Onsager's
 *  reciprocal relations (de Groot and Mazur 1962, ch. 11; Hirschfelder,
 *  Curtiss and Bird 1954, sec. 7.4; derivation in lib/flux/thermal.c):
 *    q_D = R T sum_i theta_i J_i,   theta_i = k_T,i / x_i,
 *  for molar fluxes J_i relative to the molar-average velocity, and
 *  q_D = R T sum_i (theta_i - sum_k x_k theta_k) j_i / M_i for mass fluxes
 *  (the same number). The coefficient that couples the heat flux to the
 *  composition forces is then the one that couples the species fluxes to
 *  grad ln T (tests/test_thermal_kt.c checks the reciprocity). The total
 *  heat flux adds -lambda grad T and the enthalpy carried by the fluxes.
 *  Like the thermal diffusion ratios it rests on, q_D is far less
 *  accurate than the fluxes (MCD_THERMAL_CE_TYPICAL_ERROR at best).
 *  @param n_species  N, 1..MCD_MAX_SPECIES; @param n_dim 1..MCD_MAX_DIM.
 *  @param x      mole fractions, length N, validated as mcd_comp_normalize.
 *  @param M      molar masses [kg/mol], length N (mass fluxes only; may be
 *                NULL for molar fluxes).
 *  @param theta  k_T,i / x_i [-], length N, finite; for a species with
 *                x_i = 0 the limit (mcd_mixture_thermal_ratios gives it).
 *  @param T      temperature [K], > 0.
 *  @param flux_basis  MOLE: flux holds J_i [mol/(m^2 s)]; MASS: j_i
 *                [kg/(m^2 s)] (as from mcd_flux_compute).
 *  @param flux   N x n_dim, finite.
 *  @param out_q  length n_dim [W/m^2].
 *  Fails: EINVAL (NULL, NaN, counts), EDOM | Allocates: no */
MCD_API mcd_status mcd_dufour_heat_flux(size_t n_species, size_t n_dim,
                                        const double *x, const double *M,
                                        const double *theta, double T,
                                        mcd_basis flux_basis,
                                        const double *flux, double *out_q);

/** The Dufour heat flux of mcd_dufour_heat_flux for K cells at once, in
 *  the structure-of-arrays layout of the batched calls (mcd_cells,
 *  mcd_flux_batch_dij), from fluxes already solved (e.g. the out_flux of
 *  mcd_flux_batch or mcd_flux_batch_dij); a separate call, so that a
 *  caller who does not want q_D pays nothing. Each cell is computed by
 *  the code of mcd_dufour_heat_flux: the result equals K single-state
 *  calls to the bit. As accurate as the thermal diffusion ratios behind
 *  theta: far less than the fluxes (MCD_THERMAL_CE_TYPICAL_ERROR at best).
 *  Since 0.4.
 *  @param n_species  N, 1..MCD_MAX_SPECIES.
 *  @param n_cells    K (0 is allowed and writes nothing).
 *  @param n_dim      1..MCD_MAX_DIM.
 *  @param x      mole fractions, N x K (x[i*K + k]), each cell validated
 *                as mcd_comp_normalize.
 *  @param M      molar masses [kg/mol], length N, shared by all cells
 *                (mass fluxes only; may be NULL for molar fluxes).
 *  @param theta  k_T,i / x_i [-], N x K (theta[i*K + k]), finite; for a
 *                species with x_i = 0 the limit (mcd_mixture_thermal_ratios
 *                gives it per cell).
 *  @param T      temperatures [K], length K, each > 0.
 *  @param flux_basis  MOLE: flux holds J_i [mol/(m^2 s)]; MASS: j_i
 *                [kg/(m^2 s)].
 *  @param flux   (N n_dim) x K (flux[(i*n_dim + d)*K + k]), finite.
 *  @param out_q  n_dim x K [W/m^2] (out_q[d*K + k]); written only on
 *                success.
 *  Fails: EINVAL (NULL, NaN, counts), EDOM (messages "cell <k>: ...")
 *  | Allocates: no */
MCD_API mcd_status mcd_dufour_heat_flux_batch(size_t n_species,
                                              size_t n_cells, size_t n_dim,
                                              const double *x, const double *M,
                                              const double *theta,
                                              const double *T,
                                              mcd_basis flux_basis,
                                              const double *flux,
                                              double *out_q);

/** Thermal diffusion ratios k_T,i [-] from thermal diffusion coefficients
 *  D_i^T [kg/(m s)], for mcd_state.kT / mcd_cells.kT. Since 0.3.
 *
 *  The Maxwell-Stefan equations with thermal diffusion (Hirschfelder,
 *  Curtiss and Bird 1954, sec. 7.4; Taylor and Krishna 1993, sec. 2.3)
 *    d_i = -sum_{j != i} (x_i x_j / Đ_ij)
 *          (v_i - v_j + (D_i^T / rho_i - D_j^T / rho_j) grad ln T)
 *  are the ones mcd_flux_compute solves with the driving force
 *  d_i + k_T,i grad ln T, where (rho_i = c x_i M_i)
 *    k_T,i = (1/c) sum_{j != i} (x_j D_i^T / M_i - x_i D_j^T / M_j) / Đ_ij,
 *  which sums to zero over i and needs no division by x_i (trace species
 *  are fine). With these k_T the mass fluxes of mcd_flux_compute are the
 *  ones without the thermal term minus D_i^T grad ln T, the usual form
 *  j_i = ... - D_i^T grad ln T (Bird, Stewart and Lightfoot 2002, sec.
 *  24.2). For two species k_T = k_T,1 = rho D_1^T / (c^2 M_1 M_2 Đ_12).
 *
 *  @param ws     workspace with capacity >= N (scratch only).
 *  @param state  n_species, comp_basis, c, M (required), Dij and comp as
 *                in mcd_flux_compute (the other fields are not read).
 *  @param DT     thermal diffusion coefficients [kg/(m s)], length N,
 *                finite; kinetic theory gives sum_i D_i^T = 0, and the
 *                sum is first made exactly zero by D_i^T -= w_i sum_k
 *                D_k^T (mass fractions w: the mass fluxes then balance).
 *  @param out_kT length N; sums to zero to round-off.
 *  Fails: EINVAL (NULL, N < 1, NaN/inf), EBADLEN (N > capacity), EDOM
 *  (fractions, Dij, c, M out of range) | Allocates: no */
MCD_API mcd_status mcd_thermal_ratios(mcd_workspace *ws,
                                      const mcd_state *state,
                                      const double *DT, double *out_kT);

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
 * i.e. every quantity is a contiguous row of K values. mcd_flux_batch and
 * mcd_flux_batch_dij also take every array in tiles of 8 cells (faster
 * from N = 7 on, see mcd_layout). The convenience call
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
 * mcd_workspace_set_threads); every cell is computed by the same code whatever
 * the thread count, so results are bit-for-bit identical to the serial run.
 * Without OpenMP the calls are serial. The CPU's vector width (SSE2, AVX2,
 * AVX-512) is chosen at run time on x86-64; no -march flag is needed. With
 * AVX-512, a call whose inputs and outputs together exceed the last-level
 * cache writes its outputs with streaming stores (past the caches: the first
 * outputs would have left them anyway); environment variable
 * MCDIFF_STREAM_STORES=never or =always overrides that choice. The values are
 * the same either way. The exact model's fluxes agree with mcd_flux_compute's
 * to round-off, not bit for bit: with AVX-512 the kernel takes the square
 * roots of the mole fractions and the pivots' reciprocals from hardware
 * estimates refined by Newton steps (a few ulp), and blocks of 2 to 10
 * species without trace species (3 directions, molar or mass fluxes, the last
 * partial block too) solve the grounded system instead of the scaled N x N
 * one, by an elimination without subtraction (about 1e-14 of the largest flux
 * apart with Đ within 2 decades). The grounded form is the more accurate:
 * against extended-precision and exact solutions at most 8.5e-15 of the
 * largest flux with Đ over 6 decades (the scaled form: 3.7e-11) and 6.5e-17
 * with scarce species tied by a tiny Đ (the scaled form: 1.8e-5);
 * tests/test_ground.c. A cell gets the same bits in a full block and in the
 * last, partial one. mcd_flux_compute solves such states of up to 10
 * species in the grounded form too.
 */

/** How the per-cell arrays of a batched call are laid out in memory
 *  (mcd_cells.layout). An array of Q rows over K cells (Q = N for comp,
 *  N n_dim for grad and out_flux, N N for Dij, 1 for T, P and c, ...):
 *  - MCD_LAYOUT_SOA: row q of cell k at [q*K + k] (structure of arrays).
 *  - MCD_LAYOUT_TILED8: cells in tiles of 8: row q of cell k at
 *    [(k/8)*8*Q + 8*q + k%8]; an array spans ceil(K/8) tiles of 8 Q
 *    doubles. The slots of the padding cells k >= K of the last tile are
 *    neither read nor written (8 Q ceil(K/8) doubles is always enough;
 *    the array may end after the slot of its last row's cell K - 1).
 *    One tile of an array is one contiguous piece of memory, read in
 *    order. Arrays of one row (T, P, c: length K) are the same in both
 *    layouts. A tiled out_flux on a 64-byte boundary lets large calls
 *    use streaming stores (as SoA rows do). Results are bit-for-bit
 *    those of the SoA layout. Offered by mcd_flux_batch and
 *    mcd_flux_batch_dij; the other calls taking mcd_cells refuse it
 *    (EINVAL naming cells->layout).
 *  Which is faster (exact model, mole basis, 3 directions, one thread,
 *  AVX-512 host, tests/bench_layout, tiled / SoA cells per second):
 *  N >= 7: tiled, 1.1x to 1.5x when the cells stream from memory (1.3x
 *  at N = 10 and 20, 1.55x at N = 50), 1.0x to 1.13x in cache.
 *  N <= 6: SoA, the tiled layout is 0.8x to 0.9x streamed and level in
 *  cache. Converting a SoA array costs a pass over it: the tiled layout
 *  pays when the caller keeps its cells in tiles. In the SoA layout the
 *  row stride K matters a little when the cells stream from memory: with
 *  K / 8 odd the call ran 1.0x to 1.12x faster than with K a multiple of
 *  32 at N = 7 to 50 (tests/bench_stride; the library staggers its
 *  prefetches for K a multiple of 16, which was 1.3x to 1.6x slower
 *  without); the results do not depend on K. A SoA block reads each row
 *  from its own 4 KB page: with the arrays on 2 MB pages (Linux:
 *  madvise MADV_HUGEPAGE) mcd_flux_batch_dij ran 1.16x to 1.4x faster
 *  streamed at N = 3 to 50 and 1.15x in cache at N = 20 and 50 (tiled: 1.1x
 *  streamed); see README, "Batched fluxes for simulators". With 2 MB
 *  pages for both, tiled stayed the faster layout streamed (1.35x at
 *  N = 10, 1.12x at 20, 1.25x at 50; separate runs of one session) and
 *  was level in cache at N = 20.
 *  Since 0.4. */
typedef enum mcd_layout {
    MCD_LAYOUT_SOA = 0,   /**< [q*K + k] (the default) */
    MCD_LAYOUT_TILED8 = 1 /**< [(k/8)*8*Q + 8*q + k%8] */
} mcd_layout;

/** The per-cell inputs every batched call takes: K cells' fractions and
 *  gradients in the layout of the call (SoA or tiled, see mcd_layout, for
 *  mcd_flux_batch and mcd_flux_batch_dij, per-cell arrays for
 *  mcd_flux_batch_aos). The index formulas below are those of the SoA
 *  layout. Zero-initialise it and set the fields; a field added in a
 *  later version keeps its old meaning when left 0 or NULL. Since 0.2. */
typedef struct mcd_cells {
    size_t n_cells;         /**< K (0 is allowed and writes nothing) */
    size_t n_dim;           /**< 1..MCD_MAX_DIM */
    mcd_basis comp_basis;   /**< comp and grad: mole or mass fractions */
    const double *comp;     /**< fractions [-], N x K (comp[i*K + k]) */
    const double *grad;     /**< their gradients [1/m], (N n_dim) x K */
    const double *grad_lnP; /**< gradient of ln P [1/m], n_dim x K, or
                                 NULL (no pressure diffusion) */
    const double *kT;       /**< thermal diffusion ratios [-], N x K, or
                                 NULL (as mcd_state.kT; Since 0.3) */
    const double *grad_lnT; /**< gradient of ln T [1/m], n_dim x K, or
                                 NULL (with kT: both or neither) */
    mcd_layout layout;      /**< of every per-cell array of the call,
                                 inputs and outputs (mcd_layout; 0 = SoA;
                                 Since 0.4) */
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
 *  @param cells       K, n_dim, comp_basis, comp, grad, grad_lnP, kT,
 *                     grad_lnT, layout (mcd_cells; with MCD_LAYOUT_TILED8
 *                     every per-cell array, T, P and out_flux included,
 *                     is in tiles, see mcd_layout); messages name the
 *                     fields.
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
 *  cells->kT[k*N + i] and cells->grad_lnT[k*n_dim + d] (or NULL),
 *  out_flux[(k*N + i)*n_dim + d]; T and P length K. Cells are transposed
 *  block by block into workspace memory (serially: no OpenMP here), so it
 *  is a little slower than the SoA call but much faster than K calls of
 *  mcd_flux_compute. cells->layout must be MCD_LAYOUT_SOA (0): the tiled
 *  layout is refused (EINVAL naming cells->layout). Since 0.1.
 *  Fails: as mcd_flux_batch | Allocates: no | Threads: one ws per thread */
MCD_API mcd_status mcd_flux_batch_aos(mcd_workspace *ws,
                                      const mcd_mixture *mix,
                                      mcd_model model, const double *T,
                                      const double *P, const mcd_cells *cells,
                                      mcd_basis flux_basis, double *out_flux);

/** Batched fluxes with their composition Jacobians (as mcd_flux_jacobian
 *  per cell), the caller's own per-cell binary diffusivities and
 *  concentrations, SoA layout as mcd_flux_batch_dij. A sibling of the
 *  batched flux calls, so that those pay nothing for it. Since 0.4.
 *
 *  Each cell is computed by the single-state code of mcd_flux_jacobian
 *  (and its fluxes by that of mcd_flux_compute): the results equal K
 *  single-state calls to the bit, serially, cell after cell through
 *  workspace staging. The fluxes can differ from mcd_flux_batch_dij's in
 *  the last bits (another kernel; both within the accuracy stated at
 *  mcd_flux_compute).
 *
 *  @param ws          workspace with capacity >= n_species.
 *  @param model       MAXWELL_STEFAN or MIXTURE_AVERAGED.
 *  @param n_species   N, as mcd_flux_batch_dij.
 *  @param M           molar masses [kg/mol], as mcd_flux_batch_dij.
 *  @param Dij         binary diffusivities [m^2/s], (N N) x K, as
 *                     mcd_flux_batch_dij.
 *  @param c           total molar concentrations [mol/m^3], length K.
 *  @param cells       K, n_dim, comp_basis, comp, grad, grad_lnP, kT,
 *                     grad_lnT (mcd_cells); layout MCD_LAYOUT_SOA only
 *                     (MCD_LAYOUT_TILED8: EINVAL naming cells->layout).
 *  @param flux_basis  MOLE or MASS (fluxes and Jacobians).
 *  @param out_flux    (N n_dim) x K as mcd_flux_batch_dij, or NULL.
 *  @param out_jac     (N n_dim N) x K:
 *                     out_jac[((i*n_dim + d)*N + k)*K + cell] =
 *                     dF_{i,d}/dy_k of that cell (mcd_flux_jacobian).
 *  Fails: as mcd_flux_batch_dij (messages "cell <k>: ..."), EINVAL
 *  (ITERATIVE) | Allocates: no | Threads: one ws per thread */
MCD_API mcd_status mcd_flux_batch_jacobian(mcd_workspace *ws, mcd_model model,
                                           size_t n_species, const double *M,
                                           const double *Dij, const double *c,
                                           const mcd_cells *cells,
                                           mcd_basis flux_basis,
                                           double *out_flux, double *out_jac);

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

/** How mcd_flux_batch_dij reads each cell's Dij (mcd_workspace_set_dij_read).
 *  Since 0.4. */
typedef enum mcd_dij_read {
    MCD_DIJ_READ_BOTH = 0, /**< default: both triangles read and checked */
    MCD_DIJ_READ_UPPER = 1 /**< the upper triangle only, symmetry vouched */
} mcd_dij_read;

/** How later mcd_flux_batch_dij calls on this workspace read the cells'
 *  binary diffusivities: an opt-in that skips one check, for callers whose
 *  matrices are symmetric by construction. Since 0.4.
 *  - MCD_DIJ_READ_BOTH (default): every off-diagonal entry is read and
 *    checked (finite, >= DBL_MIN) and each cell's matrix must be symmetric
 *    (relative difference <= 1e-12); the fluxes use the upper triangle.
 *  - MCD_DIJ_READ_UPPER: only the upper triangle, Dij[(i*N + j)*K + k]
 *    with j > i (SoA; the same entries in tiles), is read and checked
 *    (finite, >= DBL_MIN, messages as above); the diagonal and the lower
 *    triangle are never read and may hold anything. The symmetry check is
 *    skipped: the caller vouches for it. The fluxes are bit for bit those
 *    of MCD_DIJ_READ_BOTH on the symmetric matrix with this upper
 *    triangle. What it saves is memory traffic: N (N + 1) / 2 of the
 *    N^2 rows of Dij per cell are not loaded, which is what bounds the
 *    call when the cells stream from memory at N >= 10 (measured with
 *    tools/anchor.sh, MCD_ANCHOR_DIJ=upper; see README "Changes"); in
 *    cache it saves little.
 *  Other calls (mcd_flux_batch_aos, mcd_flux_batch_jacobian, the mixture
 *  calls, the single-state calls) always read and check both triangles.
 *  Fails: EINVAL (ws NULL, mode not one of these) | Allocates: no */
MCD_API mcd_status mcd_workspace_set_dij_read(mcd_workspace *ws,
                                              mcd_dij_read mode);

/** Declare a temperature range [T_min, T_max] over which batched calls may
 *  evaluate the Chapman-Enskog, Wilke-Lee and Brokaw pairs of this
 *  mixture from a fit instead of exactly: for each such pair, Omega_D(T /
 *  eps) (Brokaw: with its polar term, Since 0.4) is fitted by a Chebyshev polynomial in ln T (interpolation at Chebyshev nodes, the
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

/* ------------------------------------------------------------------ */
/* Liquids: activity, thermodynamic factors, diffusivities          */
/* ------------------------------------------------------------------ */

/*
 * A liquid mixture of N species described by an activity-coefficient model
 * with the caller's parameters. For a composition x and temperature T,
 * mcd_liquid_eval gives ln gamma_i, the thermodynamic factor matrix Gamma
 * and the Maxwell-Stefan diffusivities Đ_ij of the concentrated liquid,
 * ready for the mcd_state of mcd_flux_compute and mcd_fick_matrix (Gamma
 * and Dij fields; c is the liquid's molar concentration, which the caller
 * supplies).
 *
 * Models (pair parameter p_ij(T) = a_ij + b_ij / T + e_ij ln T, T in K;
 * a and e dimensionless, b in K; ordered pairs: p_ij and p_ji differ):
 *   NRTL (Renon and Prausnitz 1968): tau_ij = p_ij, G_ij = exp(-alpha_ij
 *     tau_ij), alpha_ij = alpha_ji the non-randomness parameter.
 *     ln gamma_i = sum_j x_j tau_ji G_ji / sum_k x_k G_ki
 *       + sum_j x_j G_ij / (sum_k x_k G_kj) (tau_ij - sum_m x_m tau_mj G_mj
 *         / sum_k x_k G_kj).
 *     Parameters given as Delta g_ij [J/mol] (tau_ij = Delta g_ij / (R T))
 *     are b_ij = Delta g_ij / R; the form Delta g_ij = A + B T gives
 *     b_ij = A / R, a_ij = B / R.
 *   Wilson (1964): Lambda_ij = (V_j / V_i) exp(-p_ij), with p_ij =
 *     (lambda_ij - lambda_ii) / (R T) (so b_ij = (lambda_ij - lambda_ii) /
 *     R) and V_i the liquid molar volumes (MCD_LIQ_MOLAR_VOLUME).
 *     ln gamma_i = 1 - ln sum_j x_j Lambda_ij - sum_k x_k Lambda_ki /
 *     sum_j x_j Lambda_kj. Wilson's model cannot describe two liquid
 *     phases.
 *   UNIQUAC (Abrams and Prausnitz 1975): tau_ij = exp(-p_ij), p_ij =
 *     (u_ij - u_jj) / (R T); volume and area parameters r_i, q_i
 *     (MCD_LIQ_UNIQUAC_R, _Q), coordination number z = 10.
 *   IDEAL: gamma_i = 1, Gamma = I; no parameters.
 *
 * Thermodynamic factor: the N x N matrix Gamma_ij = delta_ij + x_i
 * n_T d ln gamma_i / d n_j (derivatives with respect to mole numbers at
 * fixed T and P; n_T the total). It gives d_i = sum_j Gamma_ij grad x_j
 * for any gradients that sum to zero, which is the convention of
 * mcd_state.Gamma, and every column sums to 1 (Gibbs-Duhem), so the
 * projection of mcd_flux_compute leaves it unchanged. The (N-1) x (N-1)
 * matrix of Taylor and Krishna (1993), Gamma_ij = delta_ij + x_i
 * d ln gamma_i / d x_j with x_k (the dependent species) eliminated, is
 * Gamma_ij - Gamma_ik for i, j != k: exactly the matrix mcd_fick_matrix
 * forms with dependent = k. Derivatives are analytic.
 *
 * Phase stability: where the mixture would split into two liquids (the
 * Hessian of the Gibbs energy of mixing is not positive definite on the
 * composition changes of the species present, i.e. beyond a spinodal, where
 * det Gamma = 0), mcd_liquid_eval fails with MCD_EDOM and says so: fluxes
 * there would be meaningless. Between the binodal and the spinodal the
 * mixture is metastable and is accepted.
 *
 * Diffusivities: from the infinite-dilution values D°_ij (i infinitely
 * dilute in j; mcd_liquid_set_dinf) by Vignes (1966) for N = 2,
 *   Đ_12 = (D°_12)^x_2 (D°_21)^x_1,
 * and its multicomponent generalisation of Kooijman and Taylor (1991),
 *   Đ_ij = (D°_ij)^x_j (D°_ji)^x_i prod_{k != i,j} (D°_ik D°_jk)^(x_k/2).
 * Vignes reproduces mutual diffusion in nearly ideal binaries within about
 * 10-20 % and is poorer for associating (hydrogen-bonding) mixtures
 * (Taylor and Krishna 1993, ch. 4; from memory). Against measured data
 * of two nearly ideal binaries across the composition range (toluene /
 * CCl4, CCl4 / cyclohexane; tests/test_liquid_data.c) it is within 5 %;
 * associating mixtures are not checked yet. The D° are used as
 * given at every temperature: set them for the temperature of use (for
 * example from mcd_binary_wilke_chang, _tyn_calus, _hayduk_minhas).
 *
 * Caution: activity parameters fitted to vapour-liquid data may predict
 * spurious phase splits or wrong Gamma away from their fitted range; the
 * results do not replace validated data and engineering review.
 */

/** A liquid mixture: its activity model, parameters and infinite-dilution
 *  diffusivities (opaque; mcd_liquid_new, mcd_liquid_free). */
typedef struct mcd_liquid mcd_liquid;

/** Activity-coefficient models of a liquid. */
typedef enum mcd_activity_model {
    MCD_ACTIVITY_IDEAL = 0,  /**< gamma = 1 (Raoult) */
    MCD_ACTIVITY_NRTL = 1,   /**< Renon and Prausnitz (1968) */
    MCD_ACTIVITY_WILSON = 2, /**< Wilson (1964) */
    MCD_ACTIVITY_UNIQUAC = 3 /**< Abrams and Prausnitz (1975) */
} mcd_activity_model;

/** Species parameters of a liquid. */
typedef enum mcd_liquid_param {
    MCD_LIQ_MOLAR_VOLUME = 0, /**< liquid molar volume V_i [m^3/mol]
                                   (Wilson) */
    MCD_LIQ_UNIQUAC_R = 1,    /**< UNIQUAC volume parameter r_i [-] */
    MCD_LIQ_UNIQUAC_Q = 2     /**< UNIQUAC area parameter q_i [-] */
} mcd_liquid_param;

/** New liquid of n_species species (1..MCD_MAX_SPECIES) with an activity
 *  model. Every pair and species parameter the model needs starts unset
 *  (mcd_liquid_eval names the first missing one). Free with
 *  mcd_liquid_free. Since 0.3.
 *  Fails: EINVAL (NULL, n or model out of range), ENOMEM | Allocates: yes */
MCD_API mcd_status mcd_liquid_new(size_t n_species, mcd_activity_model model,
                                  mcd_liquid **out_liq);
/** Free a liquid; NULL is a no-op. Since 0.3. */
MCD_API void mcd_liquid_free(mcd_liquid *liq);

/** Set species parameter p of species i: Wilson's molar volume [m^3/mol]
 *  or UNIQUAC's r, q [-] (finite, > 0). Since 0.3.
 *  Fails: EINVAL (NULL, i or p out of range, NaN), EDOM (value <= 0)
 *  | Allocates: no */
MCD_API mcd_status mcd_liquid_set_species(mcd_liquid *liq, size_t i,
                                          mcd_liquid_param p, double value);

/** Set the interaction parameters of the pair (i, j), i != j, of the
 *  model (see the section's introduction): p_ij(T) = coef_ij[0] +
 *  coef_ij[1] / T + coef_ij[2] ln T and p_ji from coef_ji (each length 3,
 *  finite), for NRTL the non-randomness alpha (= alpha_ji, finite, in
 *  [-1, 1]; ignored by the other models), and the temperature range
 *  [T_min, T_max] [K] over which the parameters were fitted (0 < T_min <
 *  T_max; both 0: no range): mcd_liquid_eval flags MCD_WARN_TEMPERATURE
 *  outside it. Since 0.3.
 *  Fails: EINVAL (NULL, i == j or out of range, NaN), EDOM (alpha or range
 *  out of range) | Allocates: no */
MCD_API mcd_status mcd_liquid_set_pair(mcd_liquid *liq, size_t i, size_t j,
                                       const double *coef_ij,
                                       const double *coef_ji, double alpha,
                                       double T_min, double T_max);

/** Set the infinite-dilution diffusivities of the pair (i, j), i != j:
 *  D_i_in_j of i infinitely dilute in j and D_j_in_i [m^2/s] (finite,
 *  >= DBL_MIN). Needed for Đ by mcd_liquid_eval. Since 0.3.
 *  Fails: EINVAL (NULL, indices, NaN), EDOM (<= 0) | Allocates: no */
MCD_API mcd_status mcd_liquid_set_dinf(mcd_liquid *liq, size_t i, size_t j,
                                       double D_i_in_j, double D_j_in_i);

/** Activity coefficients, thermodynamic factor and Maxwell-Stefan
 *  diffusivities of the liquid at (T, x). Any output may be NULL; those
 *  given are written only on success. Reads the liquid only (may be
 *  shared between threads, one workspace each). Since 0.3.
 *  @param ws          workspace with capacity >= the liquid's N.
 *  @param T           temperature [K], > 0.
 *  @param x           mole fractions, length N, validated as by
 *                     mcd_comp_normalize; species may be absent (x = 0).
 *  @param out_lngamma ln gamma_i [-], length N.
 *  @param out_Gamma   thermodynamic factor [-], N x N row-major (see the
 *                     section's introduction): the mcd_state.Gamma of this
 *                     state.
 *  @param out_Dij     Maxwell-Stefan diffusivities [m^2/s], N x N
 *                     symmetric, diagonal 0 (Vignes / Kooijman-Taylor):
 *                     the mcd_state.Dij of this state. Requires every
 *                     pair's mcd_liquid_set_dinf.
 *  @param out_warn    MCD_WARN_TEMPERATURE when T lies outside a pair's
 *                     declared range (may be NULL).
 *  Fails: EINVAL (NULL ws, liq or x, NaN), EBADLEN (N > capacity), EDOM
 *  (T <= 0, composition out of range, the liquid splits into two phases
 *  at this state: the detail says "not stable"; a parameter giving an
 *  overflow), ENODATA (a pair's or species' parameter is missing; the
 *  detail names the pair or species and the parameter) | Allocates: no
 *  | Threads: one ws per thread */
MCD_API mcd_status mcd_liquid_eval(mcd_workspace *ws, const mcd_liquid *liq,
                                   double T, const double *x,
                                   double *out_lngamma, double *out_Gamma,
                                   double *out_Dij, unsigned *out_warn);

/** Batched diffusion fluxes of a liquid at many cells (SoA layout of the
 *  batched calls, see "Batched fluxes"): at each cell k the liquid's
 *  thermodynamic factor Gamma and Maxwell-Stefan diffusivities Đ_ij at
 *  (T[k], x_k) (as mcd_liquid_eval), then the fluxes of mcd_flux_compute
 *  with them, optionally relative to the volume-average velocity. Since
 *  0.4.
 *
 *  Each cell runs the single-state code (mcd_liquid_eval's, then
 *  mcd_flux_compute's): the fluxes equal that route (with
 *  mcd_flux_to_volume_frame when Vbar is given) to round-off. A cell
 *  costs a little less than those two calls made by the caller: 0.53 to
 *  0.95 of them per cell for N = 2..6 (measured, 5003 cells, NRTL,
 *  Wilson, UNIQUAC; 0.15 to 1.8 us per cell on a 2020s x86-64 core). No
 *  vectorisation across cells, no OpenMP: serial, cell after cell,
 *  through workspace scratch.
 *
 *  Before anything is written every cell's inputs are checked (the rules
 *  of mcd_flux_batch_dij): bad input leaves the outputs untouched. The
 *  liquid's stability is tested with its evaluation, cell by cell: an
 *  unstable cell fails with EDOM ("cell <k>: argument comp: the liquid is
 *  not stable ..."), and, as in the other batched calls, the cells before
 *  it are then already written (so are they on a failure of a cell's
 *  solve: ESING, or EDOM for fluxes that are not finite or mass fluxes
 *  lost to cancellation, inputs at the edge of the double range).
 *
 *  @param ws          workspace with capacity >= the liquid's N.
 *  @param liq         the liquid (read only; may be shared between
 *                     threads); every pair's infinite-dilution
 *                     diffusivities and the model's parameters set.
 *  @param model       MAXWELL_STEFAN or MIXTURE_AVERAGED (ITERATIVE:
 *                     EINVAL).
 *  @param T           temperatures [K], length K, each > 0.
 *  @param c           total molar concentrations of the liquid [mol/m^3],
 *                     length K, each >= DBL_MIN.
 *  @param M           molar masses [kg/mol], length N; needed for the mass
 *                     basis (comp_basis or flux_basis), may be NULL
 *                     otherwise.
 *  @param Vbar        partial molar volumes [m^3/mol], N x K
 *                     (Vbar[i*K + k]), finite, with c sum_i x_i Vbar_i = 1
 *                     within 1e-6 in each cell (ideal volume mixing:
 *                     the pure molar volumes and c = 1 / sum_i x_i V_i);
 *                     then the fluxes are relative to the volume-average
 *                     velocity: J^V_i = J_i - c x_i sum_k Vbar_k J_k, so
 *                     sum_i Vbar_i J^V_i = 0 (MOLE), or M_i J^V_i (MASS,
 *                     sum_i Vbar_i j^V_i / M_i = 0). NULL: the usual
 *                     frames (molar-average for MOLE, mass-average for
 *                     MASS).
 *  @param cells       K, n_dim, comp_basis, comp, grad, kT, grad_lnT
 *                     (mcd_cells); grad_lnP must be NULL (pressure
 *                     diffusion in liquids is not modelled: EINVAL);
 *                     layout MCD_LAYOUT_SOA only (MCD_LAYOUT_TILED8:
 *                     EINVAL naming cells->layout).
 *  @param flux_basis  MOLE: J_i [mol/(m^2 s)]; MASS: j_i [kg/(m^2 s)].
 *  @param out_flux    (N n_dim) x K (out_flux[(i*n_dim + d)*K + k]); must
 *                     not alias an input. Sums to zero over species in
 *                     each cell (with Vbar: weighted as above).
 *  @param out_warn    MCD_WARN_TEMPERATURE when some T[k] lies outside a
 *                     pair's declared range (OR over cells; may be NULL).
 *  Fails: EINVAL (NULL, counts, enums, ITERATIVE, grad_lnP, NaN/inf in a
 *  cell), EBADLEN (N > capacity), EDOM (a cell out of range, c and Vbar
 *  disagreeing, the liquid not stable), ENODATA (a parameter or D°
 *  missing: "argument liq: ..."), ESING; messages "cell <k>: ..."
 *  | Allocates: no | Threads: one ws per thread */
MCD_API mcd_status mcd_liquid_flux_batch(mcd_workspace *ws,
                                         const mcd_liquid *liq,
                                         mcd_model model, const double *T,
                                         const double *c, const double *M,
                                         const double *Vbar,
                                         const mcd_cells *cells,
                                         mcd_basis flux_basis,
                                         double *out_flux, unsigned *out_warn);

/** Set the Antoine constants of species i: log10(P^sat / Pa) = A - B /
 *  (T / K + C), valid over [T_min, T_max] [K] (0 < T_min < T_max, T_min +
 *  C > 0; B > 0). Constants published for mmHg and degrees Celsius
 *  convert as A + log10(133.322368) and C - 273.15; for bar and K, A + 5.
 *  Name the source of the constants next to them in your code. A species
 *  without Antoine constants is not volatile (partial pressure 0). Since
 *  0.3.
 *  Fails: EINVAL (NULL, i out of range, NaN), EDOM (B <= 0, bad range)
 *  | Allocates: no */
MCD_API mcd_status mcd_liquid_set_antoine(mcd_liquid *liq, size_t i, double A,
                                          double B, double C, double T_min,
                                          double T_max);

/** Vapour-liquid equilibrium at an interface by the modified Raoult's law
 *  (ideal vapour, Poynting factor 1: low pressure): partial pressures
 *  p_i = x_i gamma_i(T, x) P_i^sat(T) [Pa] with the activity model and the
 *  Antoine constants (0 for species without them). The bubble pressure is
 *  sum p_i; over a gas at total pressure P the interface vapour mole
 *  fractions are y_i = p_i / P. Since 0.3.
 *  @param x        liquid mole fractions, length N (as mcd_liquid_eval).
 *  @param out_p    partial pressures [Pa], length N.
 *  @param out_warn MCD_WARN_TEMPERATURE outside a pair's or an Antoine
 *                  range (may be NULL).
 *  Fails: as mcd_liquid_eval (ENODATA for missing activity parameters;
 *  EDOM where the liquid splits or a vapour pressure overflows)
 *  | Allocates: no | Threads: one ws per thread */
MCD_API mcd_status mcd_liquid_vle(mcd_workspace *ws, const mcd_liquid *liq,
                                  double T, const double *x, double *out_p,
                                  unsigned *out_warn);

/** Evaporation of a liquid through a stagnant gas film or Stefan tube into
 *  an inert gas. The gas holds the liquid's N species (same order) and one
 *  inert, insoluble species last (N + 1 species): at the liquid surface
 *  (z = 0) the vapour is in equilibrium with the liquid x_liq
 *  (mcd_liquid_vle: y_i = p_i / P, the inert the rest), at z = L the gas
 *  has gas->xL, the inert does not move (MCD_FILM_BOOT_STAGNANT), and the
 *  fluxes are the exact Maxwell-Stefan film solution (mcd_film_solve,
 *  MCD_FILM_EXACT). Isothermal and quasi-steady: the liquid composition
 *  and level are frozen while the film is solved; for a mixture the rate
 *  is the instantaneous one. Since 0.3.
 *  @param gas       the gas film: n_species = N + 1 (capacity of ws at
 *                   least that), c [mol/m^3] (for an ideal gas P / (R T)),
 *                   L [m], Dij (N + 1) x (N + 1) gas diffusivities, xL
 *                   (N + 1); gas->x0 is ignored (computed).
 *  @param T, P      temperature [K] and total gas pressure [Pa], > 0; the
 *                   bubble pressure must stay below P (else the liquid
 *                   boils: EDOM).
 *  @param x_liq     liquid mole fractions, length N.
 *  @param M         molar masses [kg/mol], length N + 1.
 *  @param rho_liquid liquid density [kg/m^3], > 0.
 *  @param out_y0    interface gas mole fractions, N + 1 (may be NULL).
 *  @param out_N     molar fluxes [mol/(m^2 s)], N + 1, positive from the
 *                   liquid into the gas; the inert's is 0.
 *  @param out_mass_rate  evaporation rate sum_i N_i M_i [kg/(m^2 s)] (may
 *                   be NULL).
 *  @param out_level_rate fall of the liquid level, mass rate / rho_liquid,
 *                   in mm/h (may be NULL).
 *  @param out_warn  warning bits of mcd_liquid_vle (may be NULL).
 *  Caution: evaporating solvents are often flammable or toxic; these are
 *  estimates for design studies, not a substitute for validated data and
 *  engineering review.
 *  Fails: EINVAL, EBADLEN, EDOM (as mcd_liquid_vle and mcd_film_solve;
 *  the liquid boils), ENODATA, ESING, ENOCONV | Allocates: no | Threads:
 *  one ws per thread */
MCD_API mcd_status mcd_liquid_evaporation(
    mcd_workspace *ws, const mcd_liquid *liq, const mcd_film *gas, double T,
    double P, const double *x_liq, const double *M, double rho_liquid,
    double *out_y0, double *out_N, double *out_mass_rate,
    double *out_level_rate, unsigned *out_warn);

/** Tyn-Calus infinite-dilution diffusivity of a solute in a liquid
 *  solvent, in the form without parachors of Poling, Prausnitz and
 *  O'Connell (2001, sec. 11-9): D = 8.93e-8 V_B^0.267 V_A^-0.433 T / mu_B
 *  (A solute, B solvent; cm^2/s, V in cm^3/mol at the normal boiling
 *  point, mu in cP), in SI here. For organic liquid solutes; not for water
 *  as the solute or viscous solvents (> 20 cP).
 *  Typical error: mcd_method_typical_error(MCD_METHOD_TYN_CALUS). Since 0.3.
 *  @param mu_solvent  solvent viscosity at T [Pa s].
 *  @param Vb_solute, Vb_solvent  molar volumes at the normal boiling
 *                     points [m^3/mol].
 *  Fails: EINVAL, EDOM | Allocates: no */
MCD_API mcd_status mcd_binary_tyn_calus(double T, double mu_solvent,
                                        double Vb_solute, double Vb_solvent,
                                        double *out_D);

/** Hayduk-Minhas (1982) infinite-dilution diffusivity of a solute in
 *  water: D = 1.25e-8 (V_A^-0.19 - 0.292) T^1.52 mu_w^(9.58 / V_A - 1.12)
 *  (cm^2/s, V_A in cm^3/mol at the normal boiling point, mu_w in cP), in
 *  SI here. Typical error: mcd_method_typical_error(
 *  MCD_METHOD_HAYDUK_MINHAS). Since 0.3.
 *  @param mu_water  viscosity of water at T [Pa s].
 *  @param Vb_solute molar volume of the solute at its normal boiling point
 *                   [m^3/mol].
 *  Fails: EINVAL, EDOM | Allocates: no */
MCD_API mcd_status mcd_binary_hayduk_minhas(double T, double mu_water,
                                            double Vb_solute, double *out_D);

/** Temperature range [K] of an infinite-dilution correlation for liquids
 *  (MCD_METHOD_WILKE_CHANG, _TYN_CALUS, _HAYDUK_MINHAS), and the warning
 *  bit for a temperature T: MCD_WARN_TEMPERATURE when T lies outside it
 *  (the estimate is still made by the raw call; flag or refuse it). The
 *  range is the liquid range of water at 1 atm, 273.15 K to 373.15 K, for
 *  all three: their data sets are near-ambient liquids and none states a
 *  sharp limit (the database route of Wilke-Chang flags the same range).
 *  Any output may be NULL. Since 0.4.
 *  @param T           temperature [K], > 0.
 *  @param out_T_min, out_T_max  the range [K].
 *  @param out_warn    MCD_WARN_TEMPERATURE or 0.
 *  Fails: EINVAL (another method, NaN), EDOM (T <= 0) | Allocates: no */
MCD_API mcd_status mcd_method_temperature_range(mcd_method method, double T,
                                                double *out_T_min,
                                                double *out_T_max,
                                                unsigned *out_warn);

/* ------------------------------------------------------------------ */
/* Porous media: Knudsen diffusion and the Dusty Gas Model             */
/* ------------------------------------------------------------------ */

/*
 * Gas transport in the pores of a catalyst pellet, electrode, membrane
 * support or adsorbent, where molecules hit the walls as often as each
 * other and a pressure gradient drives viscous flow. The Dusty Gas Model
 * (Mason and Malinauskas 1983) treats the walls as one more, motionless
 * species. Isothermal ideal gas; for total molar fluxes N_i
 * [mol/(m^2 s)] per unit cross-section of the medium:
 *   sum_{j != i} (x_j N_i - x_i N_j) / D^e_ij + N_i / D^e_K,i
 *       = -(1/(R T)) [P grad x_i + x_i (1 + B0 P / (mu D^e_K,i)) grad P],
 * with effective binary diffusivities D^e_ij = (porosity/tortuosity) Đ_ij,
 * effective Knudsen diffusivities D^e_K,i = (porosity/tortuosity)
 * (d_pore/3) sqrt(8 R T / (pi M_i)), the permeability B0 and the mixture
 * viscosity mu. Limits: tiny pores give Knudsen diffusion,
 * N_i = -D^e_K,i grad c_i; large pores without a pressure gradient give
 * the open-gas Maxwell-Stefan fluxes scaled by porosity/tortuosity; a
 * uniform composition under a pressure gradient gives Darcy flow plus
 * Knudsen slip. Under a uniform pressure, sum_i N_i sqrt(M_i) = 0 at
 * every pore size (Graham's law of diffusion).
 *
 * Cautions: porosity, tortuosity, pore diameter and permeability are
 * properties of the medium that are usually FITTED to permeation and
 * diffusion measurements of that medium; the parallel-pore relations used
 * when they are not given are rough. Results are estimates for design
 * studies, not a substitute for measured data, and designs that handle
 * toxic, flammable or pressurised gases need validated data, the
 * applicable codes and licensed engineering review.
 */

/** Pore structure of a porous medium (the caller's values; usually
 *  fitted). Zero-initialise it and set the fields. Since 0.3. */
typedef struct mcd_pore {
    double porosity;     /**< void fraction epsilon [-], in (0, 1] */
    double tortuosity;   /**< tortuosity factor tau [-], >= 1 */
    double d_pore;       /**< mean pore diameter [m], > 0 */
    double permeability; /**< B0 [m^2] of the medium, > 0; or 0: from the
                              pore diameter for a bundle of straight
                              cylindrical pores (Poiseuille),
                              B0 = (porosity/tortuosity) d_pore^2 / 32
                              (d_pore^2/32 for one straight pore) */
} mcd_pore;

/** Permeability B0 [m^2] that the Dusty Gas Model calls use for a pore
 *  structure (given, or from d_pore as documented in mcd_pore); also the
 *  check of a pore structure. Since 0.3.
 *  Fails: EINVAL (NULL, NaN), EDOM (porosity outside (0, 1], tortuosity
 *  < 1, d_pore <= 0, permeability < 0) | Allocates: no */
MCD_API mcd_status mcd_pore_permeability(const mcd_pore *pore,
                                         double *out_B0);

/** Effective diffusivity D^e = (porosity/tortuosity) D [m^2/s] of an open
 *  gas (binary or Knudsen) diffusivity D [m^2/s] (> 0). Since 0.3.
 *  Fails: EINVAL, EDOM | Allocates: no */
MCD_API mcd_status mcd_pore_effective(const mcd_pore *pore, double D,
                                      double *out_De);

/** Knudsen diffusivity [m^2/s] of a gas in a cylindrical pore,
 *  D_K = (d_pore/3) sqrt(8 R T / (pi M)) (not yet scaled by
 *  porosity/tortuosity; see mcd_pore_effective). Since 0.3.
 *  @param T [K] > 0; @param M [kg/mol] > 0; @param d_pore [m] > 0.
 *  Fails: EINVAL, EDOM | Allocates: no */
MCD_API mcd_status mcd_knudsen_diffusivity(double T, double M, double d_pore,
                                           double *out_DK);

/** Bosanquet interpolation 1/D = 1/D_m + 1/D_K [m^2/s] between a
 *  molecular diffusivity D_m (e.g. a species' mixture diffusivity) and its
 *  Knudsen diffusivity D_K, both > 0. A simpler alternative to the Dusty
 *  Gas Model: exact for a trace species under a uniform pressure,
 *  otherwise an approximation that misses the coupling of the fluxes
 *  (Graham's law) and the viscous flux. Since 0.3.
 *  Fails: EINVAL, EDOM | Allocates: no */
MCD_API mcd_status mcd_bosanquet(double D_m, double D_K, double *out_D);

/** One state of a gas in a porous medium: the input of the mcd_dgm_*
 *  calls. Zero-initialise it and set the fields; pointers are borrowed
 *  for the call. Since 0.3. */
typedef struct mcd_dgm {
    size_t n_species;     /**< N, 1..capacity of the workspace */
    size_t n_dim;         /**< directions, 1..MCD_MAX_DIM */
    double T;             /**< temperature [K], > 0 (uniform) */
    double P;             /**< pressure [Pa], > 0 */
    double mu;            /**< mixture viscosity [Pa s], > 0 (the caller's
                               value, or mcd_viscosity_wilke) */
    const double *M;      /**< molar masses [kg/mol], N */
    const double *Dij;    /**< open-gas binary diffusivities at (T, P)
                               [m^2/s], N x N, as for mcd_flux_compute
                               (not yet scaled by porosity/tortuosity) */
    const double *x;      /**< mole fractions, N (as mcd_comp_normalize) */
    const double *grad_x; /**< their gradients [1/m], N x n_dim (projected
                               onto sum_i grad x_i = 0 by grad x_i -= x_i
                               sum_k grad x_k); unused by
                               mcd_dgm_gradients */
    const double *grad_P; /**< pressure gradient [Pa/m], n_dim, or NULL
                               (uniform pressure); used by mcd_dgm_fluxes
                               only */
} mcd_dgm;

/** Total molar fluxes N_i [mol/(m^2 s)] (per unit cross-section of the
 *  medium) at one state by the Dusty Gas Model (equations above), for
 *  given composition and pressure gradients. With grad_P NULL or zero
 *  this is the isobaric case: the total flux N_t = sum N_i is then the
 *  unknown the model fixes (Graham's law). Solved by Gaussian elimination
 *  of the N x N column-dominant matrix in the workspace (no pivoting
 *  needed, no allocation). Since 0.3.
 *  @param ws     workspace with capacity >= dgm->n_species.
 *  @param pore   pore structure (checked as mcd_pore_permeability).
 *  @param dgm    the state; messages name its fields ("argument mu: ...").
 *  @param out_N  N x n_dim total molar fluxes.
 *  Fails: EINVAL (NULL, NaN, counts), EBADLEN (N > capacity), EDOM (out
 *  of range, overflow), ESING | Allocates: no | Threads: one ws per
 *  thread */
MCD_API mcd_status mcd_dgm_fluxes(mcd_workspace *ws, const mcd_pore *pore,
                                  const mcd_dgm *dgm, double *out_N);

/** Dusty Gas Model with the total flux given and the pressure gradient
 *  unknown: the closed-end case (N_t = 0: a dead-end pore or a closed
 *  diffusion cell, where a pressure gradient builds up) or a known net
 *  flow. dgm->grad_P is ignored. Since 0.3.
 *  @param N_t        total molar flux sum_i N_i [mol/(m^2 s)], n_dim.
 *  @param out_N      N x n_dim total molar fluxes.
 *  @param out_grad_P the pressure gradient [Pa/m] that carries them,
 *                    n_dim.
 *  Other parameters and failures as mcd_dgm_fluxes. Since 0.3.
 *  Fails: EINVAL, EBADLEN, EDOM, ESING | Allocates: no */
MCD_API mcd_status mcd_dgm_closed(mcd_workspace *ws, const mcd_pore *pore,
                                  const mcd_dgm *dgm, const double *N_t,
                                  double *out_N, double *out_grad_P);

/** Inverse Dusty Gas Model: the mole-fraction gradients and the pressure
 *  gradient that carry given total fluxes N at the state dgm (whose
 *  grad_x and grad_P are ignored). Explicit, no solve: grad P from the sum
 *  of the equations (sum_i N_i / D^e_K,i), then grad x_i from equation i.
 *  The gradients sum to zero to round-off; mcd_dgm_fluxes with them
 *  returns N. Since 0.3.
 *  @param N           total molar fluxes [mol/(m^2 s)], N x n_dim.
 *  @param out_grad_x  N x n_dim [1/m].
 *  @param out_grad_P  n_dim [Pa/m].
 *  Fails: EINVAL, EBADLEN, EDOM | Allocates: no */
MCD_API mcd_status mcd_dgm_gradients(mcd_workspace *ws, const mcd_pore *pore,
                                     const mcd_dgm *dgm, const double *N,
                                     double *out_grad_x, double *out_grad_P);

/** Many states ("cells") of one gas mixture in one porous medium: the
 *  input of mcd_dgm_fluxes_batch, in the structure-of-arrays layout of
 *  the batched flux calls (K = n_cells, N species): every quantity is a
 *  contiguous row of K values. Zero-initialise it and set the fields.
 *  Since 0.3. */
typedef struct mcd_dgm_cells {
    size_t n_cells;       /**< K (0 is allowed and writes nothing) */
    size_t n_dim;         /**< 1..MCD_MAX_DIM */
    const double *T;      /**< temperatures [K], K */
    const double *P;      /**< pressures [Pa], K */
    const double *mu;     /**< mixture viscosities [Pa s], K */
    const double *Dij;    /**< open-gas binary diffusivities [m^2/s],
                               (N N) x K: Dij[(i*N + j)*K + k] */
    const double *x;      /**< mole fractions, N x K: x[i*K + k] */
    const double *grad_x; /**< gradients [1/m], (N n_dim) x K:
                               grad_x[(i*n_dim + d)*K + k] */
    const double *grad_P; /**< pressure gradients [Pa/m], n_dim x K, or
                               NULL (uniform pressure in every cell) */
} mcd_dgm_cells;

/** Dusty Gas Model fluxes of K cells (mcd_dgm_fluxes for each; the same
 *  code, so the same values). Each cell is gathered into the workspace:
 *  no allocation. Every cell is checked before any output is written, so
 *  bad input leaves out_N untouched and mcd_last_error() names the first
 *  bad cell ("cell 17: argument x: ..."); only an overflow inside a
 *  cell's solve (EDOM, ESING: extreme but valid input) can leave the
 *  cells before it written. Since 0.3.
 *  @param pore       pore structure shared by all cells.
 *  @param n_species  N, 1..capacity of ws.
 *  @param M          molar masses [kg/mol], N, shared by all cells.
 *  @param cells      the cells (mcd_dgm_cells).
 *  @param out_N      total molar fluxes [mol/(m^2 s)], (N n_dim) x K:
 *                    out_N[(i*n_dim + d)*K + k].
 *  Fails: EINVAL, EBADLEN, EDOM, ESING | Allocates: no | Threads: one ws
 *  per thread */
MCD_API mcd_status mcd_dgm_fluxes_batch(mcd_workspace *ws,
                                        const mcd_pore *pore, size_t n_species,
                                        const double *M,
                                        const mcd_dgm_cells *cells,
                                        double *out_N);

/*
 * Porous slab: steady Dusty Gas Model fluxes through an isothermal slab of
 * thickness L between two gas states, x0 and P0 at z = 0 and xL (and PL)
 * at z = L. The total fluxes N_i are constant across the slab (no
 * reaction). Open-gas binary diffusivities follow the low-pressure law
 * Đ_ij(P) = Đ_ij(P_ref) P_ref / P along the slab; the mixture viscosity
 * is taken constant (the caller's value, e.g. at the mean composition).
 * The same cautions as for the single-state calls apply.
 */

/** Which condition completes a slab problem (mcd_slab_solve). */
typedef enum mcd_slab_kind {
    MCD_SLAB_PRESSURES = 0, /**< both end pressures given: the model fixes
                                 every flux (no bootstrap needed) */
    MCD_SLAB_STAGNANT = 1,  /**< species `species` does not move; PL is a
                                 result */
    MCD_SLAB_TOTAL = 2      /**< sum_i N_i = value [mol/(m^2 s)]; PL is a
                                 result */
} mcd_slab_kind;

/** A porous slab and its end states: the input of mcd_slab_solve and
 *  mcd_slab_profile. Zero-initialise it and set the fields. Since 0.3. */
typedef struct mcd_slab {
    size_t n_species;  /**< N, 1..capacity of the workspace */
    double T;          /**< temperature [K], > 0 (uniform) */
    double mu;         /**< mixture viscosity [Pa s], > 0 (constant) */
    double L;          /**< slab thickness [m], > 0 */
    double P_ref;      /**< pressure [Pa] at which Dij are given, > 0 */
    const double *M;   /**< molar masses [kg/mol], N */
    const double *Dij; /**< open-gas binary diffusivities at P_ref
                            [m^2/s], N x N */
    const double *x0;  /**< mole fractions at z = 0, N */
    double P0;         /**< pressure at z = 0 [Pa], > 0 */
    const double *xL;  /**< mole fractions at z = L, N (mcd_slab_solve) */
    double PL;         /**< pressure at z = L [Pa], > 0 (PRESSURES) */
} mcd_slab;

/** Steady fluxes through a porous slab by the Dusty Gas Model: a
 *  converged numerical solution of the boundary-value problem (shooting:
 *  the ODE dy/dz = f(y; N) for y = (x, P) from the explicit inverse model,
 *  fourth-order Runge-Kutta with the step count doubled until the fluxes
 *  change by less than 1e-10 relative, Newton's method on N to end
 *  residuals of 1e-12). Since 0.3.
 *  @param ws       workspace with capacity >= slab->n_species.
 *  @param pore     pore structure (as mcd_pore_permeability).
 *  @param slab     the slab and its end states; messages name its fields.
 *  @param kind     MCD_SLAB_PRESSURES, _STAGNANT or _TOTAL.
 *  @param species  STAGNANT: the species that does not move.
 *  @param value    TOTAL: sum_i N_i [mol/(m^2 s)]; ignored otherwise.
 *  @param out_N    total molar fluxes [mol/(m^2 s)], N, positive towards
 *                  z = L.
 *  @param out_PL   pressure at z = L [Pa] (the given one for PRESSURES;
 *                  may be NULL).
 *  @param out_iterations  Newton iterations over all step counts (may be
 *                  NULL).
 *  Fails: EINVAL, EBADLEN, EDOM (out of range; the pressure going
 *  negative inside the slab), ESING, ENOCONV (Newton stalls, e.g. end
 *  states no steady flux connects) | Allocates: no | Threads: one ws per
 *  thread */
MCD_API mcd_status mcd_slab_solve(mcd_workspace *ws, const mcd_pore *pore,
                                  const mcd_slab *slab, mcd_slab_kind kind,
                                  size_t species, double value, double *out_N,
                                  double *out_PL, size_t *out_iterations);

/** Steady fluxes through a porous slab with given flux ratios, as a
 *  reaction's stoichiometry fixes them at a catalyst surface (A -> 2B:
 *  ratios (-1, 2)/(-1 + 2) = (-1, 2)): N_i = ratios_i N_t for every
 *  species, N_t the one unknown. The far-end fraction of species
 *  `species` is matched (xL must still be a valid composition; its other
 *  entries are not imposed); the other far-end fractions and PL (slab->PL
 *  is ignored) are results, as with the open film's
 *  MCD_FILM_BOOT_RATIOS. The same converged shooting as mcd_slab_solve
 *  (Newton on N_t). Since 0.4.
 *  @param species  the species whose fraction at z = L is matched.
 *  @param ratios   z_i [-], N, finite, sum 1 (within MCD_SUM_TOL).
 *  @param out_N    total molar fluxes [mol/(m^2 s)], N, exactly ratios_i
 *                  N_t, positive towards z = L.
 *  @param out_PL   the resulting pressure at z = L [Pa] (may be NULL).
 *  @param out_iterations  Newton iterations (may be NULL).
 *  Other parameters as mcd_slab_solve; mcd_slab_profile with out_N gives
 *  the profile and the far-end state.
 *  Fails: EINVAL (NULL, NaN, species out of range), EBADLEN, EDOM (out of
 *  range, ratios not summing to 1, species absent at z = 0 with ratio 0,
 *  the pressure going negative), ESING, ENOCONV (no N_t reaches xL of the
 *  species, e.g. its ratio lies between its two end fractions in a
 *  binary) | Allocates: no | Threads: one ws per thread */
MCD_API mcd_status mcd_slab_solve_ratios(mcd_workspace *ws,
                                         const mcd_pore *pore,
                                         const mcd_slab *slab, size_t species,
                                         const double *ratios, double *out_N,
                                         double *out_PL,
                                         size_t *out_iterations);

/** Profile across a slab for given fluxes N (e.g. from mcd_slab_solve):
 *  the ODE integrated from z = 0 (x0, P0) by fourth-order Runge-Kutta
 *  with steps of at most L/1024. xL and PL are not used. Since 0.3.
 *  @param N         total molar fluxes [mol/(m^2 s)], N.
 *  @param n_points  number of positions (0 writes nothing).
 *  @param z         positions [m], each in [0, L].
 *  @param out_x     mole fractions, n_points x N (row = position).
 *  @param out_P     pressures [Pa], n_points.
 *  Fails: EINVAL, EBADLEN, EDOM (also a pressure going negative) |
 *  Allocates: no */
MCD_API mcd_status mcd_slab_profile(mcd_workspace *ws, const mcd_pore *pore,
                                    const mcd_slab *slab, const double *N,
                                    size_t n_points, const double *z,
                                    double *out_x, double *out_P);

#ifdef __cplusplus
}
#endif

#endif /* MCDIFF_H */
