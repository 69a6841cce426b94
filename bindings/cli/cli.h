/* cli.h - private declarations shared by the files of the mcdiff tool.
 * The tool uses only the public header mcdiff.h. */
#ifndef MCDIFF_CLI_H
#define MCDIFF_CLI_H

#include <stddef.h>
#include <stdio.h>
#include "mcdiff.h"

/* Exit codes of the tool. */
enum {
    CLI_OK = 0,   /* success */
    CLI_FAIL = 1, /* the computation failed */
    CLI_USAGE = 2 /* bad command line */
};

/* One-line caution printed with every estimate (tables: short; JSON: long). */
#define CLI_CAUTION_SHORT                                                      \
    "Note: estimates carry typical errors; not a substitute for validated "    \
    "data, local codes or licensed engineering review."
#define CLI_CAUTION_LONG                                                       \
    "Diffusivities here are estimates with the typical errors listed; they "   \
    "do not replace validated data, local codes and licensed engineering "     \
    "review."
/* The transfer commands (film, bulbs) add the hazard of sizing equipment. */
#define CLI_CAUTION_TRANSFER_SHORT                                             \
    "Note: estimated diffusivities and idealised film/bulb models; do not "    \
    "size absorbers, condensers or other equipment handling hazardous "        \
    "gases on them without validated data, local codes and licensed "          \
    "engineering review."
#define CLI_CAUTION_TRANSFER_LONG                                              \
    "Fluxes and compositions here rest on estimated diffusivities with the "   \
    "typical errors listed and on idealised film and two-bulb models; they "   \
    "do not replace validated data, local codes and licensed engineering "     \
    "review, least of all in the design of absorbers, condensers or other "    \
    "equipment handling hazardous gases."

/* ---- messages (main.c) ---- */
/* "mcdiff <cmd>: bad value for ARG: why" on stderr; returns CLI_USAGE. */
int cli_usage_error(const char *cmd, const char *arg, const char *fmt, ...)
#if defined(__GNUC__)
    __attribute__((format(printf, 3, 4)))
#endif
    ;
/* "mcdiff <cmd>: what: <status text> (detail)" on stderr; returns CLI_FAIL. */
int cli_fail(const char *cmd, const char *what, mcd_status st,
             const char *detail);

/* Names of the species of the command (kept, not copied), so that library
 * details saying "species K" (0-based) are shown with the name. */
void cli_species_names(char *const *names, size_t n);
/* detail with each "species K" replaced by the name (static buffer). */
const char *cli_detail(const char *detail);

/* ---- argument scanning (args.c) ---- */
/* A tiny option scanner: options are "--long", "--long=value", "-s", "-svalue"
 * or "-s value". Everything else is positional. A lone "--" ends options. */
typedef struct cli_opt {
    const char *long_name; /* without the dashes */
    char short_name;       /* 0 if none */
    int takes_value;       /* 1: needs a value; CLI_REPEAT: a value, and the
                              option may be given several times */
    int id;                /* returned by cli_args_next */
} cli_opt;

/* takes_value of an option given once per item (-g per direction, --pair
 * per pair). Every other option with a value may be given only once: a
 * second one (under any of its spellings) is a usage error naming it. */
#define CLI_REPEAT 2
#define CLI_MAX_SEEN 64

typedef struct cli_args {
    int argc;
    char **argv;
    int pos;             /* next index in argv */
    int only_positional; /* after "--" */
    const cli_opt *opts;
    const char *cmd;     /* command name for messages */
    const char *value;   /* value of the last option (or positional text) */
    const char *spelled; /* the option for messages, e.g. "-T/--temperature" */
    char spelled_buf[80];
    /* options with a value seen so far (id, first value), for the rule on
       repeated options */
    int seen_id[CLI_MAX_SEEN];
    const char *seen_value[CLI_MAX_SEEN];
    int n_seen;
    const char *last_number; /* the previous word, when it was an option's
                                plain number (else NULL) */
} cli_args;

#define CLI_ARG_END (-1)        /* no more arguments */
#define CLI_ARG_POSITIONAL (-2) /* a positional argument in ->value */
#define CLI_ARG_ERROR (-3)      /* message already printed */

void cli_args_init(cli_args *a, const char *cmd, int argc, char **argv,
                   const cli_opt *opts);
int cli_args_next(cli_args *a);

/* ---- numbers and units (units.c) ---- */
/* All parsers return 0 on success or write a reason (without the argument
 * name) into why[whylen] and return -1. Values are SI. */
int cli_parse_number(const char *text, double *out, char *why, size_t whylen);
/* 1 if text is a whole plain number (as cli_parse_number accepts). */
int cli_is_plain_number(const char *text);
/* 1 if text is one of the unit words the tool accepts (C, K, bar, cm2/s
 * ...): a positional word like this after a number was meant as its unit. */
int cli_is_unit_word(const char *text);
int cli_parse_temperature(const char *text, double *out_K, char *why,
                          size_t whylen);
int cli_parse_pressure(const char *text, double *out_Pa, char *why,
                       size_t whylen);
/* Diffusivity: bare number = m^2/s; suffixes "m2/s" and "cm2/s". */
int cli_parse_diffusivity(const char *text, double *out, char *why,
                          size_t whylen);
/* Viscosity: bare number = Pa s; suffixes "Pa.s", "mPa.s", "cP". */
int cli_parse_viscosity(const char *text, double *out, char *why,
                        size_t whylen);
/* Length: bare = m; suffixes "m", "cm", "mm". Must be > 0. */
int cli_parse_length(const char *text, double *out, char *why, size_t whylen);
/* Area: bare = m^2; suffixes "m2", "cm2", "mm2". Must be > 0. */
int cli_parse_area(const char *text, double *out, char *why, size_t whylen);
/* Volume: bare = m^3; suffixes "m3", "L", "mL", "cm3". Must be > 0. */
int cli_parse_volume(const char *text, double *out, char *why, size_t whylen);
/* Concentration: bare = mol/m^3; suffixes "mol/m3", "kmol/m3", "mol/L".
 * Density: bare = kg/m^3; suffixes "kg/m3", "g/cm3", "kg/L", "g/L". Both
 * must be > 0. */
int cli_parse_concentration(const char *text, double *out, char *why,
                            size_t whylen);
int cli_parse_density(const char *text, double *out, char *why, size_t whylen);
/* Time: bare = s; suffixes "s", "min", "h". Must be >= 0. */
int cli_parse_time(const char *text, double *out, char *why, size_t whylen);
/* Times: a comma-separated list of times, non-decreasing, or
 * START:STOP:COUNT (COUNT >= 2 equally spaced times, START <= STOP).
 * *out is malloc'ed (caller frees); *out_n receives the count. */
int cli_parse_times(const char *text, double **out, size_t *out_n, char *why,
                    size_t whylen);
/* Plausibility of a value already in SI units: 0 when it is inside the
 * deliberately wide range of its quantity, else 1 with a sentence in
 * why[whylen] saying so and naming the unit that would make the number
 * plausible. Gas diffusivity at pressure P [Pa]: D P within 0.01..1000
 * Pa m^2/s (D = 1e-7..1e-2 m^2/s at 1 atm; gas pairs in handbook tables
 * lie within 0.05..1.5 cm^2/s at 1 atm, from memory of Reid, Prausnitz and
 * Poling 1987). Solvent viscosity: 1e-4..0.1 Pa s (0.1..100 cP; water
 * 0.89 mPa s at 25 C, common practice). */
int cli_implausible_gas_D(const char *text, double D, double P, char *why,
                          size_t whylen);
int cli_implausible_viscosity(const char *text, double mu, char *why,
                              size_t whylen);
/* Comma-separated plain numbers; *out_n receives the count (<= cap). */
int cli_parse_list(const char *text, double *out, size_t cap, size_t *out_n,
                   char *why, size_t whylen);
/* Split a comma-separated list of words into buf (modified copy);
 * returns count or -1 on an empty item or too many items. */
int cli_split_words(char *buf, char **out, size_t cap);

/* ---- JSON writer (json.c) ---- */
#define CLI_JSON_MAX_DEPTH 16
typedef struct cli_json {
    FILE *f;
    int depth;
    int count[CLI_JSON_MAX_DEPTH]; /* items written at each level */
    int is_array[CLI_JSON_MAX_DEPTH];
} cli_json;

void cli_json_init(cli_json *j, FILE *f);
/* key is used inside objects and must be NULL inside arrays. */
void cli_json_object_begin(cli_json *j, const char *key);
void cli_json_object_end(cli_json *j);
void cli_json_array_begin(cli_json *j, const char *key);
void cli_json_array_end(cli_json *j);
void cli_json_string(cli_json *j, const char *key, const char *s);
void cli_json_number(cli_json *j, const char *key, double v);
void cli_json_integer(cli_json *j, const char *key, long long v);
void cli_json_bool(cli_json *j, const char *key, int v);
void cli_json_null(cli_json *j, const char *key);
/* Array of n numbers on one line. */
void cli_json_numbers(cli_json *j, const char *key, const double *v, size_t n);
/* Finish the document with a newline. */
void cli_json_finish(cli_json *j);

/* ---- CSV writer (csv.c) ---- */
/* RFC 4180 fields separated by commas, rows ended by "\n"; a field with a
 * comma, quote or line break is quoted. Numbers print with %.15g; a number
 * that is not finite or not known is an empty field. */
typedef struct cli_csv {
    FILE *f;
    int col; /* fields written in the current row */
} cli_csv;

void cli_csv_init(cli_csv *c, FILE *f);
void cli_csv_text(cli_csv *c, const char *s); /* NULL = empty field */
void cli_csv_number(cli_csv *c, double v);
void cli_csv_integer(cli_csv *c, long long v);
/* A header name made of prefix, name and an SI unit: "x1_" + "air" + ""
 * or "D" + "" + "m^2/s" -> "D_m2_per_s" (unit text "-" adds nothing). */
void cli_csv_head(cli_csv *c, const char *prefix, const char *name,
                  const char *unit);
void cli_csv_end_row(cli_csv *c);

/* ---- binary --explain (explain.c) ---- */
/* The slots of mcd_db_binary_explain: as an "explain" JSON object (named
 * slots that are not NaN, SI) and as hand-check text. */
void cli_explain_json(cli_json *j, const double *v);
void cli_explain_text(mcd_method m, const double *v, FILE *f);

/* ---- binary --thermal-factor (binary_thermal.c) ---- */
/* The pair's thermal diffusion factor at x_a (mcd_db_thermal_factor), with
 * its typical error and warnings; printed with the caution that thermal
 * diffusion estimates are far less accurate than diffusivities. */
typedef struct cli_thermal_factor {
    double x_a, alpha, rel_err;
    unsigned warn;
} cli_thermal_factor;
/* Fills alpha, rel_err, warn (x_a set by the caller); CLI_FAIL with the
 * library's message on failure. */
int cli_thermal_factor_estimate(const char *cmd, const mcd_db *db, size_t a,
                                size_t b, double T, cli_thermal_factor *out);
void cli_thermal_factor_text(const cli_thermal_factor *t, const char *name_a,
                             FILE *f);
/* A "thermal_diffusion" object: x_A, alpha_T, k_T, typical_error, method,
 * warnings, caution. */
void cli_thermal_factor_json(cli_json *j, const cli_thermal_factor *t);

/* ---- typical errors under warnings (main.c) ---- */
/* mcd_typical_error_widened, NaN when it fails or has no value. */
double cli_widened_error(mcd_method m, unsigned warn);
/* One line that says how stated errors were widened. */
#define CLI_WIDEN_NOTE                                                         \
    "typical errors are the method's published average widened by its "        \
    "warnings: x2 for each polar, associating, quantum-gas or high-pressure "  \
    "warning, x1.5 for each temperature, estimated-parameter or scaling "      \
    "warning, at most 100 % (a rule of thumb, not a published law)"

/* ---- aligned tables (table.c) ---- */
#define CLI_TABLE_MAX_COLS 16
typedef struct cli_table {
    size_t ncols;
    size_t nrows, cap;
    char **cells;                  /* nrows x ncols strings (heap) */
    int right[CLI_TABLE_MAX_COLS]; /* 1: right-align the column */
} cli_table;

/* ncols columns; the first two rows added are usually header and units. */
int cli_table_init(cli_table *t, size_t ncols);
/* Add a row of ncols cells (NULL cell = empty). Returns 0 or -1 (memory). */
int cli_table_row(cli_table *t, const char *const *cells);
/* Print with columns padded to their widest cell, two spaces apart. */
void cli_table_print(const cli_table *t, FILE *f, const char *indent);
void cli_table_free(cli_table *t);
/* Round-off shown as data: text tables and CSV print a value whose
 * magnitude is at most CLI_ROUNDOFF_REL (64 units of round-off, 2^-46 =
 * 1.4e-14) times the scale of its column as 0; JSON keeps every double as
 * computed. The scale of a column is its largest magnitude; the columns
 * of one quantity over several species (fluxes) share one scale, and
 * mole fractions have scale 1 (they sum to 1, so their round-off is
 * relative to 1). */
#define CLI_ROUNDOFF_REL 0x1p-46
/* Largest finite magnitude of v[0], v[stride], ... (n values). */
double cli_scale(const double *v, size_t n, size_t stride);
/* v, or 0 when |v| <= CLI_ROUNDOFF_REL scale (NaN stays NaN). */
double cli_shown(double v, double scale);
/* Format a number for tables: %.4g style, "-" when NaN. */
void cli_fmt_num(char *buf, size_t len, double v);

/* ---- shared state options of fluxes and matrix (state.c) ---- */
typedef struct cli_state {
    size_t n;                     /* species */
    size_t n_dim;                 /* 0 when no gradients were given */
    char *names_buf;              /* owned copy of the species list */
    char *names[MCD_MAX_SPECIES]; /* species as typed */
    double T, P, c;               /* K, Pa, mol/m^3 */
    mcd_basis comp_basis;         /* -x (mole) or -w (mass) */
    mcd_basis out_basis;          /* --basis */
    mcd_model model;              /* --model */
    mcd_gas_method method;        /* --method (MCD_GAS_RECOMMENDED too) */
    double *comp;                 /* n */
    double *grad;                 /* n x n_dim, in comp_basis */
    double grad_lnP[MCD_MAX_DIM];
    int have_grad_lnP;
    double kT[MCD_MAX_SPECIES]; /* --thermal-ratios [-] */
    int have_kT;
    int kT_estimated;         /* --thermal-ratios estimate: kinetic theory */
    double kT_rel_err;        /* its typical relative error */
    unsigned kT_warn;         /* its warning bits */
    double dTdz[MCD_MAX_DIM]; /* --temperature-gradient [K/m] */
    int have_dTdz;
    size_t dependent; /* MCD_DEPENDENT_AUTO or index */
    const char *dependent_name;
    const char *file; /* --species-file or NULL */
    int json;
    int csv;
    const char *comp_opt; /* option named for a bad composition
                                       (NULL: -x/--mole-fractions or
                                       -w/--mass-fractions) */
    /* pairs given on the command line, resolved after the mixture exists */
    size_t n_pairs;
    struct cli_pair {
        const char *a, *b;
        double D, T_ref, P_ref; /* T_ref/P_ref NaN: use the state */
        const char *text;
    } pairs[64];
    char *pair_bufs[64]; /* owned parsed copies of the pairs */
    size_t *dbidx;       /* n: database index of each species */
    /* results */
    mcd_db *db;
    mcd_mixture *mix;
    mcd_workspace *ws;
    double *M;             /* n */
    double *x;             /* n mole fractions */
    double *w;             /* n mass fractions */
    double *Dij, *rel_err; /* n x n */
    unsigned *warn;        /* n x n */
    unsigned *user_pair;   /* n x n: 1 if given on the command line */
    /* warnings about the input (implausible values, projected gradients):
       printed on stderr when found, listed as "input_warnings" in JSON */
    char notes[8][400];
    size_t n_notes;
    /* set by commands that use the state without a gas mixture (liquid) */
    const char *pair_opt; /* the option of s->pairs in messages (NULL:
                             "--pair") */
    int volume_frame;     /* out_basis MOLE relative to the volume-average
                             velocity (liquid --basis volume) */
} cli_state;
/* The option named for s->pairs in messages. */
#define cli_pair_opt(s) ((s)->pair_opt ? (s)->pair_opt : "--pair")
/* Display name of species i: the mixture's name, or s->names[i] when
 * the state has no mixture. */
const char *cli_state_name(const cli_state *s, size_t i);
/* Gradients of fractions must sum to zero: project them (g_i -= f_i sum_k
 * g_k, f = s->x or s->w per comp_basis) with a warning when they do not. */
void cli_state_project_gradients(cli_state *s, const char *cmd);
/* The usage error for fractions v[n] that mcd_comp_normalize refused
 * (status st): what is required and what they sum to. CLI_USAGE. */
int cli_fractions_error(const char *cmd, const char *opt, mcd_status st,
                        const double *v, size_t n);
/* Print "mcdiff CMD: warning: ..." on stderr and keep it in s->notes. */
void cli_state_note(cli_state *s, const char *cmd, const char *fmt, ...)
#if defined(__GNUC__)
    __attribute__((format(printf, 3, 4)))
#endif
    ;

/* Option ids shared by every command that builds a mixture (fluxes,
 * matrix, film, bulbs); a command's own ids stay below 100. */
enum {
    CLI_O_SPECIES = 100,
    CLI_O_T,
    CLI_O_P,
    CLI_O_METHOD,
    CLI_O_PAIR,
    CLI_O_FILE,
    CLI_O_JSON,
    CLI_O_CSV,
    CLI_O_HELP
};
/* Entries for these options in a cli_opt table. */
#define CLI_MIXTURE_OPTIONS                                                    \
    {"species", 's', 1, CLI_O_SPECIES}, {"temperature", 'T', 1, CLI_O_T},      \
        {"pressure", 'P', 1, CLI_O_P}, {"method", 'm', 1, CLI_O_METHOD},       \
        {"pair", 0, CLI_REPEAT, CLI_O_PAIR},                                   \
        {"species-file", 0, 1, CLI_O_FILE}, {"json", 0, 0, CLI_O_JSON},        \
        {"csv", 0, 0, CLI_O_CSV},                                              \
    {                                                                          \
        "help", 'h', 0, CLI_O_HELP                                             \
    }
/* Reset s to its defaults (no species, T and P not given, fsg). */
/* --method NAME of the mixture commands: fsg, chapman-enskog, wilke-lee,
 * brokaw or recommended (each pair the method 'mcdiff binary' recommends
 * for it). 0 or -1 (unknown). */
int cli_gas_method_from_name(const char *name, mcd_gas_method *out);
/* Name of a gas method for messages ("recommended" too). */
const char *cli_gas_method_name(mcd_gas_method g);
/* Help text of --method shared by the mixture commands (two lines, the
 * first after the option, the second indented like the others). */
#define CLI_METHOD_HELP                                                        \
    "  -m, --method NAME         estimate of the binary diffusivities:\n"      \
    "                            recommended (default): each pair the one\n"   \
    "                            'mcdiff binary' recommends (brokaw for a\n"   \
    "                            polar pair with its data, else the first\n"   \
    "                            of fsg, chapman-enskog, wilke-lee that\n"     \
    "                            applies); or one method for every pair:\n"    \
    "                            fsg, chapman-enskog, wilke-lee, brokaw\n"
void cli_state_defaults(cli_state *s);
/* Handle one shared option (id >= CLI_O_SPECIES, not CLI_O_HELP).
 * Returns CLI_OK, CLI_USAGE or CLI_FAIL (message printed). */
int cli_state_option(cli_state *s, const char *cmd, const cli_args *a, int id);
/* After the scan: species, T and P given, not both --json and --csv.
 * CLI_OK or CLI_USAGE. */
int cli_state_require(const cli_state *s, const char *cmd);
/* Species index of NAME in the state's list (after cli_state_setup), or
 * -1 when it is not there. */
long cli_state_find(const cli_state *s, const char *name);

/* Parse the state options of `fluxes` (need_grad = 1) or `matrix`.
 * Returns -1 when --help was printed (exit 0), else a CLI_* code. */
int cli_state_parse(cli_state *s, const char *cmd, int argc, char **argv,
                    int need_grad, void (*help)(FILE *));
/* Build the mixture, set the pairs, compute binaries. CLI_OK or CLI_FAIL. */
int cli_state_setup(cli_state *s, const char *cmd);
void cli_state_free(cli_state *s);
/* Table of the binary diffusivities (cm^2/s) with their source/method. */
void cli_state_print_binaries(const cli_state *s, FILE *f);
void cli_state_json_binaries(const cli_state *s, cli_json *j);
void cli_state_json_header(const cli_state *s, cli_json *j);

/* ---- shared result printing of fluxes and matrix (report.c) ---- */
/* Gradients of the state converted to `basis` (n x n_dim). */
int cli_state_grad_in(const cli_state *s, const char *cmd, mcd_basis basis,
                      double *out);
/* Exact generalized Fick matrix in the output basis; *out_dep receives the
 * dependent species. D has room for (n-1)^2. CLI_OK or CLI_FAIL. */
int cli_state_fick(cli_state *s, const char *cmd, double *D, size_t *out_dep);
void cli_print_fick(const cli_state *s, const double *D, size_t dep, FILE *f);
void cli_json_fick(const cli_state *s, const double *D, size_t dep,
                   cli_json *j);
/* Flux table with gradients, zero-sum row and flags (flags may be NULL). */
/* MCD_DIAG_* bits as words ("reverse", "osmotic", "barrier"; "-" for
 * none) and as one JSON array of those words (empty for none). */
void cli_flag_text(unsigned fl, char *buf, size_t len);
void cli_json_flags(cli_json *j, unsigned fl);
void cli_print_fluxes(const cli_state *s, const double *flux,
                      const unsigned *flags, FILE *f);
void cli_json_fluxes(const cli_state *s, const double *flux,
                     const unsigned *flags, cli_json *j);
/* The flux table as CSV: species, fraction, gradients [1/m], fluxes
 * (SI), and flags (when flags != NULL, space-separated names). */
void cli_csv_fluxes(const cli_state *s, const double *flux,
                    const unsigned *flags, FILE *f);
/* Per direction: sum over species and that sum relative to the largest
 * |flux| (0 when all fluxes vanish). */
void cli_zero_sum(size_t n, size_t n_dim, const double *flux, double *sum,
                  double *rel);
const char *cli_flux_unit(mcd_basis b);

/* ---- subcommands ---- */
int cli_cmd_species(int argc, char **argv);
int cli_cmd_binary(int argc, char **argv);
int cli_cmd_fluxes(int argc, char **argv);
int cli_cmd_matrix(int argc, char **argv);
int cli_cmd_demo(int argc, char **argv);
int cli_cmd_film(int argc, char **argv);
int cli_cmd_bulbs(int argc, char **argv);
int cli_cmd_liquid(int argc, char **argv);
int cli_cmd_porous(int argc, char **argv);

/* Open the built-in database, then load extra_file if not NULL.
 * Returns CLI_OK, CLI_USAGE (bad file) or CLI_FAIL. */
int cli_open_db(const char *cmd, const char *extra_file, mcd_db **out_db);

/* Warnings bits as "a; b; c" into buf. */
void cli_warn_text(unsigned bits, char *buf, size_t len);

#endif
