/* liq.h - the liquid of `mcdiff liquid`: its definition gathered from a
 * parameter file (liq_file.c, format in mcdiff.1 and README.md) and from
 * command-line options (liq_def.c), then built into an mcd_liquid; the
 * flux path (liq_flux.c) and the evaporation path (liq_evap.c).
 * Public header only, like the rest of the tool. */
#ifndef MCDIFF_CLI_LIQ_H
#define MCDIFF_CLI_LIQ_H

#include "cli.h"

#define LIQ_MAX 32        /* species of a liquid */
#define LIQ_NAME 64       /* longest species name + 1 */
#define LIQ_SOURCE 200    /* longest source text + 1 */
#define LIQ_FROM_CLI (-1) /* origin of a value given on the command line */

/* Caution of the evaporation path. */
#define LIQ_CAUTION_EVAP_SHORT                                                 \
    "Caution: evaporating solvents are often flammable or toxic. These are "   \
    "estimates (activity model, vapour pressures, diffusivities, idealised "   \
    "Stefan tube), not a substitute for validated data, local codes and "      \
    "licensed engineering review."
#define LIQ_CAUTION_EVAP_LONG LIQ_CAUTION_EVAP_SHORT

/* Where a value came from: 0 not given, > 0 the file's line, LIQ_FROM_CLI
 * an option. */
typedef int liq_origin;

typedef struct liq_pair {
    double coef_ij[3], coef_ji[3]; /* a, b [K], e of p_ij and p_ji */
    double alpha;                  /* NRTL non-randomness (NaN: not given) */
    double T_min, T_max;           /* fitted range [K] (0, 0: none) */
    liq_origin at;
} liq_pair;

typedef struct liq_antoine {
    double A, B, C, T_min, T_max; /* log10(P/Pa) = A - B/(T/K + C) */
    char source[LIQ_SOURCE];
    liq_origin at;
} liq_antoine;

typedef struct liq_def {
    const char *file; /* --params FILE or NULL */
    size_t n;         /* species (0: not known yet) */
    liq_origin n_at;  /* where n was fixed: species records, -s or -x */
    char names[LIQ_MAX][LIQ_NAME]; /* "" when not named */
    int named;                     /* 1: species have names */
    int model;                     /* mcd_activity_model, -1: not given */
    liq_origin model_at;
    double sp[3][LIQ_MAX]; /* V [m^3/mol], r, q (mcd_liquid_param order) */
    liq_origin sp_at[3][LIQ_MAX];
    double M[LIQ_MAX]; /* molar mass [kg/mol] from the file, NaN else */
    liq_origin M_at[LIQ_MAX];
    liq_pair pair[LIQ_MAX][LIQ_MAX];      /* [i][j], i < j */
    double dinf[LIQ_MAX][LIQ_MAX];        /* [i][j]: i infinitely dilute in j */
    liq_origin dinf_at[LIQ_MAX][LIQ_MAX]; /* [i][j], i < j */
    liq_antoine ant[LIQ_MAX];
} liq_def;

/* Empty definition (no species, no model). */
void liq_def_init(liq_def *d);
/* Read the parameter file into d (d->file is set). CLI_OK or CLI_USAGE
 * after a message "FILE:LINE: ..." naming the field. */
int liq_file_load(liq_def *d, const char *cmd, const char *path);
/* The same from an open stream; path names it in messages (kept). */
int liq_file_read(liq_def *d, const char *cmd, const char *path, FILE *f);
/* Text naming where a value came from: "FILE:LINE" or the option. */
const char *liq_origin_text(const liq_def *d, liq_origin at, const char *option,
                            char *buf, size_t len);
/* Species index of a token: a 1-based number or a name. -1 if none. */
long liq_def_species(const liq_def *d, const char *token);
/* Display name of species i: its name, or its 1-based number. */
const char *liq_def_name(const liq_def *d, size_t i, char *buf, size_t len);

/* Options of the command line added to the definition (after the file):
 * a value the file gave already is an error naming its line. Each returns
 * CLI_OK or CLI_USAGE after a message. */
int liq_def_species_option(liq_def *d, const char *cmd, const char *opt,
                           const char *list);
int liq_def_model_option(liq_def *d, const char *cmd, const char *opt,
                         const char *name);
int liq_def_pair_option(liq_def *d, const char *cmd, const char *text);
int liq_def_dinf_option(liq_def *d, const char *cmd, const char *text);
int liq_def_antoine_option(liq_def *d, const char *cmd, const char *text);
int liq_def_species_list_option(liq_def *d, const char *cmd, const char *opt,
                                int which, const char *list);
/* Every parameter the model needs (and the infinite-dilution
 * diffusivities when need_d) is there; else CLI_USAGE naming the pair or
 * species and where to give it. */
int liq_def_check(const liq_def *d, const char *cmd, int need_d);
/* 1 when every pair has infinite-dilution diffusivities. */
int liq_def_have_dinf(const liq_def *d);
/* 1 when at least one species has Antoine constants. */
int liq_def_have_antoine(const liq_def *d);
/* The mcd_liquid of the definition. CLI_OK, CLI_USAGE or CLI_FAIL. */
int liq_def_build(const liq_def *d, const char *cmd, mcd_liquid **out);
/* Model name ("ideal", "nrtl", "wilson", "uniquac") and its index from a
 * name (-1 when unknown). */
const char *liq_model_name(int model);
int liq_model_from_name(const char *name);

/* ---- the paths of `mcdiff liquid` beyond the properties ---- */
/* State options of the flux path and the evaporation path, gathered by
 * cmd_liquid.c. */
typedef struct liq_run {
    liq_def def;
    double T;          /* K */
    double x[LIQ_MAX]; /* liquid mole fractions */
    size_t nx;
    double win[LIQ_MAX]; /* -w: mass fractions as given */
    size_t nw;
    int mass_comp; /* 1: -w given (x follows from it and the masses) */
    double grad[LIQ_MAX * MCD_MAX_DIM]; /* n x n_dim, mole fractions [1/m] */
    double rows[MCD_MAX_DIM][LIQ_MAX];
    size_t nrow[MCD_MAX_DIM];
    size_t n_dim;
    double conc;          /* --concentration [mol/m^3] or NaN */
    double density;       /* --density [kg/m^3] or NaN */
    double Vbar[LIQ_MAX]; /* --partial-volumes [m^3/mol] */
    size_t nVbar;
    int basis;                /* 0 mole, 1 mass, 2 volume; -1 default */
    const char *dependent;    /* --dependent or NULL */
    const char *species_file; /* --species-file or NULL */
    int json, csv;
    /* evaporation */
    const char *inert;    /* --evaporate GAS or NULL */
    double P, L, rho_liq; /* Pa, m, kg/m^3 (NaN: not given) */
    const char *gas_pairs[64];
    size_t n_gas_pairs;
    const char *method;       /* -m/--method or NULL */
    double xtop[LIQ_MAX + 1]; /* --xL: gas at z = L, N + 1 */
    size_t nxtop;
    char *name_ptr[LIQ_MAX]; /* display names (def names or numbers) */
    char num_names[LIQ_MAX][16];
} liq_run;

/* The status of a liquid call as an exit code: missing or bad parameters
 * are usage errors (2), a liquid that splits or boils and other failures
 * computation errors (1); message printed. */
int liq_eval_status(const char *cmd, const char *what, mcd_status st);
/* An n x n matrix as text under a title, and as a JSON array of rows. */
void liq_print_matrix(const char *title, size_t n, const double *A);
void liq_json_matrix(cli_json *js, const char *key, size_t n, const double *A);

/* Molar masses of the species: from the file (M=), else from the species
 * table by name (with --species-file). CLI_OK, or CLI_USAGE naming the
 * species without one (why: what needs them). */
int liq_molar_masses(const liq_run *r, const char *cmd, const char *why,
                     double *M);
/* Fluxes and Fick matrix of the liquid at (T, x, grad). */
int liq_run_fluxes(liq_run *r, const char *cmd);
/* The liquid evaporating through a Stefan tube into r->inert. */
int liq_run_evaporation(liq_run *r, const char *cmd);

#endif
