/* main.c - entry point of the mcdiff tool: version check, dispatch to the
 * subcommands, shared message helpers.
 *
 * Exit codes: 0 success, 1 the computation failed, 2 bad command line.
 */
#include <ctype.h>
#include <math.h>
#include <stdarg.h>
#include <stdlib.h>
#include <stdio.h>
#include <string.h>
#include "cli.h"

int cli_usage_error(const char *cmd, const char *arg, const char *fmt, ...)
{
    va_list ap;
    fprintf(stderr, "mcdiff%s%s: ", cmd ? " " : "", cmd ? cmd : "");
    if (arg)
        fprintf(stderr, "%s: ", arg);
    va_start(ap, fmt);
    vfprintf(stderr, fmt, ap);
    va_end(ap);
    fputc('\n', stderr);
    return CLI_USAGE;
}

/* Species names of the current command, for library details. */
static char *const *cli_names;
static size_t cli_n_names;

void cli_species_names(char *const *names, size_t n)
{
    cli_names = names;
    cli_n_names = n;
}

/* The library numbers species from 0 (C indices); people read names: each
 * "species K" of a library detail becomes "species 'NAME'". */
const char *cli_detail(const char *detail)
{
    static char buf[1024];
    const char *p = detail;
    size_t used = 0;
    if (!detail || !cli_names)
        return detail;
    buf[0] = '\0';
    while (*p && used + 1 < sizeof buf) {
        const char *q = strstr(p, "species ");
        char *end;
        unsigned long k;
        if (!q) {
            used += (size_t)snprintf(buf + used, sizeof buf - used, "%s", p);
            break;
        }
        q += strlen("species ");
        used += (size_t)snprintf(buf + used, sizeof buf - used, "%.*s",
                                 (int)(q - p), p);
        if (used >= sizeof buf)
            break;
        if (isdigit((unsigned char)*q) &&
            (k = strtoul(q, &end, 10)) < cli_n_names) {
            used += (size_t)snprintf(buf + used, sizeof buf - used, "'%s'",
                                     cli_names[k]);
            p = end;
            if (p[0] == ' ' && p[1] == '\'' && strchr(p + 2, '\''))
                p = strchr(p + 2, '\'') + 1; /* the name followed already */
        } else {
            p = q;
        }
    }
    buf[sizeof buf - 1] = '\0';
    return buf;
}

int cli_fail(const char *cmd, const char *what, mcd_status st,
             const char *detail)
{
    detail = cli_detail(detail);
    fprintf(stderr, "mcdiff%s%s: %s failed: %s", cmd ? " " : "", cmd ? cmd : "",
            what, mcd_status_string((int)st));
    if (detail && *detail)
        fprintf(stderr, " (%s)", detail);
    fputc('\n', stderr);
    return CLI_FAIL;
}

void cli_warn_text(unsigned bits, char *buf, size_t len)
{
    unsigned b;
    size_t used = 0;
    buf[0] = '\0';
    for (b = 1; b != 0 && b <= bits; b <<= 1) {
        const char *s;
        int k;
        if (!(bits & b))
            continue;
        s = mcd_warning_string(b);
        k = snprintf(buf + used, len - used, "%s%s", used ? "; " : "",
                     s ? s : "unknown warning");
        if (k < 0 || (size_t)k >= len - used)
            break;
        used += (size_t)k;
    }
}

double cli_widened_error(mcd_method m, unsigned warn)
{
    double e = (double)NAN;
    if (mcd_typical_error_widened(m, warn, &e) != MCD_OK)
        return (double)NAN;
    return e;
}

int cli_open_db(const char *cmd, const char *extra_file, mcd_db **out_db)
{
    mcd_db *db = NULL;
    mcd_status st = mcd_db_new_builtin(&db);
    if (st != MCD_OK)
        return cli_fail(cmd, "opening the built-in species table", st, NULL);
    if (extra_file) {
        st = mcd_db_load_file(db, extra_file);
        if (st != MCD_OK) {
            const char *err = mcd_last_error();
            mcd_db_free(db);
            if (st == MCD_ENOMEM)
                return cli_fail(cmd, "loading --species-file", st, err);
            return cli_usage_error(cmd, "--species-file", "%s: %s%s%s",
                                   extra_file, mcd_status_string((int)st),
                                   *err ? ": " : "", err);
        }
    }
    *out_db = db;
    return CLI_OK;
}

static void main_help(FILE *f)
{
    fputs(
        "mcdiff - binary and multicomponent gas diffusion: diffusivities, "
        "fluxes,\n"
        "Fick matrices, films and two-bulb cells\n"
        "\n"
        "usage: mcdiff [--version | --help] COMMAND [OPTIONS]\n"
        "\n"
        "commands:\n"
        "  species [NAME]   the built-in species table, or one species in "
        "full\n"
        "  binary A B       binary diffusivity of a pair by each estimation "
        "method\n"
        "  fluxes           diffusion fluxes of N species for given gradients\n"
        "  matrix           binary and generalized Fick matrices of a mixture\n"
        "  film             steady fluxes through a film or Stefan tube\n"
        "  bulbs            composition histories of a two-bulb diffusion "
        "cell\n"
        "  liquid           activity coefficients, thermodynamic factor and\n"
        "                   diffusivities of a liquid mixture\n"
        "  porous           fluxes in a porous medium (Dusty Gas Model)\n"
        "  demo             a short worked scenario with invented numbers\n"
        "\n"
        "Run 'mcdiff COMMAND --help' for the options of a command.\n"
        "Quantities accept units: temperature K or C (also F; bare = K),\n"
        "absolute pressure Pa, kPa, MPa, bar, atm or psi (bare = Pa); lengths\n"
        "m, cm, mm, in; volumes m3, L, mL, cm3; times s, min, h. Write the\n"
        "unit next to the number (25C) or quote both (\"25 C\"). An option\n"
        "with a value is given once (-g and --pair once per item). Values\n"
        "far outside the usual range of their quantity are warned about on\n"
        "stderr (JSON: input_warnings). Results are SI unless a column\n"
        "heading says otherwise. --json and --csv give machine-readable\n"
        "output (CSV headers carry SI units, e.g. D_m2_per_s).\n"
        "\n"
        "example:\n"
        "  mcdiff binary carbon-dioxide nitrogen -T 25C -P 1atm\n"
        "\n"
        "exit status: 0 success, 1 computation failed, 2 bad command line.\n"
        "See also: man mcdiff\n",
        f);
}

/* Compile-time vs runtime major version. 0 if they agree. */
static int version_mismatch(void)
{
    return mcd_version_number() / 10000u != (unsigned)MCD_VERSION_MAJOR;
}

static int print_version(void)
{
    printf("mcdiff tool built with header %d.%d.%d, running library %s\n",
           MCD_VERSION_MAJOR, MCD_VERSION_MINOR, MCD_VERSION_PATCH,
           mcd_version_string());
    if (version_mismatch()) {
        fprintf(stderr,
                "mcdiff: library major version %u differs from the "
                "header's %d: rebuild the tool against this library\n",
                mcd_version_number() / 10000u, MCD_VERSION_MAJOR);
        return CLI_FAIL;
    }
    return CLI_OK;
}

typedef struct command {
    const char *name;
    int (*run)(int argc, char **argv);
} command;

static const command commands[] = {
    {"species", cli_cmd_species}, {"binary", cli_cmd_binary},
    {"fluxes", cli_cmd_fluxes},   {"matrix", cli_cmd_matrix},
    {"demo", cli_cmd_demo},       {"film", cli_cmd_film},
    {"bulbs", cli_cmd_bulbs},     {"liquid", cli_cmd_liquid},
    {"porous", cli_cmd_porous},   {NULL, NULL}};

int main(int argc, char **argv)
{
    const command *c;
    if (argc < 2) {
        main_help(stderr);
        return CLI_USAGE;
    }
    if (strcmp(argv[1], "--help") == 0 || strcmp(argv[1], "-h") == 0) {
        main_help(stdout);
        return CLI_OK;
    }
    if (strcmp(argv[1], "--version") == 0)
        return print_version();
    if (version_mismatch()) {
        fprintf(stderr,
                "mcdiff: library %s does not match the header %d.%d.%d this "
                "tool was built with (major version differs)\n",
                mcd_version_string(), MCD_VERSION_MAJOR, MCD_VERSION_MINOR,
                MCD_VERSION_PATCH);
        return CLI_FAIL;
    }
    for (c = commands; c->name; c++)
        if (strcmp(argv[1], c->name) == 0)
            return c->run(argc - 2, argv + 2);
    if (argv[1][0] == '-')
        return cli_usage_error(NULL, argv[1],
                               "unknown option before the command "
                               "(try --help)");
    return cli_usage_error(NULL, argv[1],
                           "unknown command (species, binary, fluxes, "
                           "matrix, film, bulbs, liquid, porous, demo)");
}
