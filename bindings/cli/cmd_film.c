/* cmd_film.c - `mcdiff film`: steady molar fluxes through a film or Stefan
 * tube between two compositions (mcd_film_solve), by the exact
 * Maxwell-Stefan solution, the linearized theory or both, and the
 * composition profile across the film (mcd_film_profile) as CSV.
 */
#include <math.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>
#include "cli.h"

static void help(FILE *f)
{
    fputs(
        "usage: mcdiff film -s A,B,C --x0 LIST --xL LIST -L LEN -T TEMP\n"
        "                   -P PRES BOOTSTRAP [options]\n"
        "\n"
        "Steady total molar fluxes N_i [mol/(m^2 s)] of an isothermal,\n"
        "isobaric ideal gas through a film or Stefan tube of length L, from\n"
        "composition x0 at z = 0 to xL at z = L (positive towards z = L).\n"
        "The fluxes are constant across the film; the bootstrap fixes\n"
        "their sum.\n"
        "\n"
        "options (lists are comma-separated, one value per species, in the\n"
        "order of -s):\n"
        "  -s, --species LIST        species names or formulas (2 or more)\n"
        "  --x0 LIST                 mole fractions [-] at z = 0, sum 1\n"
        "  --xL LIST                 mole fractions [-] at z = L, sum 1\n"
        "  -L, --length LEN          film thickness or tube length; m, cm or\n"
        "                            mm suffix, bare = m\n"
        "  -T, --temperature TEMP    K or C suffix (also F), bare = K\n"
        "  -P, --pressure PRES       Pa, kPa, MPa, bar, atm or psi, bare = Pa\n"
        "bootstrap (exactly one):\n"
        "  --stagnant NAME           species NAME does not move (N = 0); it\n"
        "                            must be present at both ends\n"
        "  --equimolar               no net molar flux (sum N_i = 0)\n"
        "  --weights LIST            sum nu_i N_i = 0 with weights nu [-]\n"
        "  --ratios LIST --match NAME  N_i = z_i N_t with flux ratios z [-]\n"
        "                            (sum 1); the end value x(L) of species\n"
        "                            NAME is matched, the others follow\n"
        "  --total-flux VALUE        sum N_i = VALUE [mol/(m^2 s)]\n"
        "more options:\n"
        "  --model NAME              exact (Maxwell-Stefan, Krishna-Standart;\n"
        "                            default), linearized ([D] frozen at the\n"
        "                            mean composition) or both (with the\n"
        "                            deviation of linearized from "
        "exact)\n" CLI_METHOD_HELP
        "  --pair A:B=D[@T,P]        binary diffusivity of a pair [m^2/s, or\n"
        "                            cm2/s suffix], as for 'mcdiff fluxes'\n"
        "  --profile                 print the composition profile instead:\n"
        "                            CSV z_m,x_A,x_B,... (exact fluxes)\n"
        "  --points N                points of the profile, 2 to 100000\n"
        "                            (default 11, equally spaced)\n"
        "  --json                    one JSON object (SI): fluxes under\n"
        "                            \"fluxes\" [mol/(m^2 s)], "
        "\"iterations\",\n"
        "                            \"residual\"; with --profile also\n"
        "                            \"profile\"\n"
        "  --csv                     the flux table as CSV: header row\n"
        "                            species,x0,xL,N_mol_per_m2_s[,...]\n"
        "  --species-file FILE       also load species from FILE\n"
        "  -h, --help                this text\n"
        "\n"
        "example (acetone and methanol evaporating into stagnant air):\n"
        "  mcdiff film -s acetone,methanol,air --x0 0.319,0.528,0.153 \\\n"
        "      --xL 0,0,1 -L 23.8cm -T 328.5 -P 99.4kPa --stagnant air \\\n"
        "      --pair acetone:methanol=8.48e-6 --pair acetone:air=13.72e-6 \\\n"
        "      --pair methanol:air=19.91e-6 --model both\n",
        f);
}

enum {
    O_X0 = 1,
    O_XL,
    O_LEN,
    O_STAG,
    O_EQUI,
    O_WEIGHTS,
    O_RATIOS,
    O_MATCH,
    O_TOTAL,
    O_MODEL,
    O_PROFILE,
    O_POINTS
};

static const cli_opt film_opts[] = {CLI_MIXTURE_OPTIONS,
                                    {"x0", 0, 1, O_X0},
                                    {"xL", 0, 1, O_XL},
                                    {"xl", 0, 1, O_XL},
                                    {"length", 'L', 1, O_LEN},
                                    {"stagnant", 0, 1, O_STAG},
                                    {"equimolar", 0, 0, O_EQUI},
                                    {"weights", 0, 1, O_WEIGHTS},
                                    {"ratios", 0, 1, O_RATIOS},
                                    {"match", 0, 1, O_MATCH},
                                    {"total-flux", 0, 1, O_TOTAL},
                                    {"model", 0, 1, O_MODEL},
                                    {"profile", 0, 0, O_PROFILE},
                                    {"points", 0, 1, O_POINTS},
                                    {NULL, 0, 0, 0}};

/* Which film theories to run. */
enum { RUN_EXACT = 1, RUN_LINEARIZED = 2, RUN_BOTH = 3 };

typedef struct film_job {
    cli_state s;
    double L;
    double x0in[MCD_MAX_SPECIES], xLin[MCD_MAX_SPECIES];
    size_t nx0, nxL;
    double xL[MCD_MAX_SPECIES]; /* validated xL */
    mcd_film_bootstrap kind;
    const char *boot_opt;           /* e.g. "--stagnant" */
    const char *species_name;       /* --stagnant / --match */
    size_t species;                 /* its index */
    double values[MCD_MAX_SPECIES]; /* weights, ratios or N_t */
    size_t nvalues;
    int run; /* RUN_* */
    int profile;
    size_t points;
    /* results */
    double Ne[MCD_MAX_SPECIES], Nl[MCD_MAX_SPECIES];
    size_t it_e, it_l;
    double res_e, res_l;
    double *z, *xz; /* profile */
    /* --ratios: the end state the solved fluxes reach (only the matched
     * species' value is imposed; the others follow from the film) */
    double xLs[MCD_MAX_SPECIES];
    int have_xLs;
} film_job;

static const char *boot_name(mcd_film_bootstrap k)
{
    switch (k) {
    case MCD_FILM_BOOT_STAGNANT: return "stagnant";
    case MCD_FILM_BOOT_EQUIMOLAR: return "equimolar";
    case MCD_FILM_BOOT_WEIGHTS: return "weights";
    case MCD_FILM_BOOT_RATIOS: return "ratios";
    case MCD_FILM_BOOT_TOTAL: return "total";
    }
    return "?";
}

static int parse(film_job *fj, const char *cmd, int argc, char **argv)
{
    cli_state *s = &fj->s;
    cli_args a;
    int id, rc, nboot = 0, have_points = 0;
    char why[200];
    const char *match = NULL;

    cli_state_defaults(s);
    fj->run = RUN_EXACT;
    fj->points = 11;
    fj->L = (double)NAN;
    cli_args_init(&a, cmd, argc, argv, film_opts);
    while ((id = cli_args_next(&a)) != CLI_ARG_END) {
        if (id >= CLI_O_SPECIES && id != CLI_O_HELP) {
            rc = cli_state_option(s, cmd, &a, id);
            if (rc != CLI_OK)
                return rc;
            continue;
        }
        switch (id) {
        case CLI_ARG_ERROR: return CLI_USAGE;
        case CLI_O_HELP: help(stdout); return -1;
        case O_X0:
        case O_XL:
            if ((id == O_X0 && fj->nx0) || (id == O_XL && fj->nxL))
                return cli_usage_error(cmd, a.spelled, "given twice");
            if (cli_parse_list(
                    a.value, id == O_X0 ? fj->x0in : fj->xLin, MCD_MAX_SPECIES,
                    id == O_X0 ? &fj->nx0 : &fj->nxL, why, sizeof why) != 0)
                return cli_usage_error(cmd, a.spelled, "%s", why);
            break;
        case O_LEN:
            if (cli_parse_length(a.value, &fj->L, why, sizeof why) != 0)
                return cli_usage_error(cmd, a.spelled, "%s", why);
            break;
        case O_STAG:
        case O_EQUI:
        case O_WEIGHTS:
        case O_RATIOS:
        case O_TOTAL:
            if (nboot++)
                return cli_usage_error(cmd, a.spelled,
                                       "give exactly one bootstrap "
                                       "(--stagnant, --equimolar, --weights, "
                                       "--ratios or --total-flux)");
            fj->boot_opt = id == O_STAG      ? "--stagnant"
                           : id == O_EQUI    ? "--equimolar"
                           : id == O_WEIGHTS ? "--weights"
                           : id == O_RATIOS  ? "--ratios"
                                             : "--total-flux";
            if (id == O_STAG) {
                fj->kind = MCD_FILM_BOOT_STAGNANT;
                fj->species_name = a.value;
            } else if (id == O_EQUI) {
                fj->kind = MCD_FILM_BOOT_EQUIMOLAR;
            } else if (id == O_TOTAL) {
                fj->kind = MCD_FILM_BOOT_TOTAL;
                if (cli_parse_number(a.value, &fj->values[0], why,
                                     sizeof why) != 0)
                    return cli_usage_error(cmd, a.spelled,
                                           "%s (a molar flux in "
                                           "mol/(m^2 s), no unit suffix)",
                                           why);
                fj->nvalues = 1;
            } else {
                fj->kind = id == O_WEIGHTS ? MCD_FILM_BOOT_WEIGHTS
                                           : MCD_FILM_BOOT_RATIOS;
                if (cli_parse_list(a.value, fj->values, MCD_MAX_SPECIES,
                                   &fj->nvalues, why, sizeof why) != 0)
                    return cli_usage_error(cmd, a.spelled, "%s", why);
            }
            break;
        case O_MATCH: match = a.value; break;
        case O_MODEL:
            if (strcmp(a.value, "exact") == 0)
                fj->run = RUN_EXACT;
            else if (strcmp(a.value, "linearized") == 0)
                fj->run = RUN_LINEARIZED;
            else if (strcmp(a.value, "both") == 0)
                fj->run = RUN_BOTH;
            else
                return cli_usage_error(cmd, a.spelled,
                                       "'%s' is not a film model (exact, "
                                       "linearized or both)",
                                       a.value);
            break;
        case O_PROFILE: fj->profile = 1; break;
        case O_POINTS: {
            double v;
            if (cli_parse_number(a.value, &v, why, sizeof why) != 0 ||
                v != floor(v) || v < 2 || v > 100000)
                return cli_usage_error(cmd, a.spelled,
                                       "'%s' is not a whole number in "
                                       "2..100000",
                                       a.value);
            fj->points = (size_t)v;
            have_points = 1;
            break;
        }
        case CLI_ARG_POSITIONAL:
            return cli_usage_error(cmd, a.value,
                                   "unexpected argument (options only; see "
                                   "--help)");
        default: return CLI_USAGE;
        }
    }
    if ((rc = cli_state_require(s, cmd)) != CLI_OK)
        return rc;
    if (fj->nx0 == 0)
        return cli_usage_error(cmd, "--x0",
                               "is required (mole fractions "
                               "at z = 0)");
    if (fj->nxL == 0)
        return cli_usage_error(cmd, "--xL",
                               "is required (mole fractions "
                               "at z = L)");
    if (fj->nx0 != s->n)
        return cli_usage_error(cmd, "--x0", "has %zu values for %zu species",
                               fj->nx0, s->n);
    if (fj->nxL != s->n)
        return cli_usage_error(cmd, "--xL", "has %zu values for %zu species",
                               fj->nxL, s->n);
    if (isnan(fj->L))
        return cli_usage_error(cmd, "-L/--length", "is required");
    if (nboot == 0)
        return cli_usage_error(cmd, "--stagnant",
                               "a bootstrap is required: one of "
                               "--stagnant NAME, --equimolar, --weights, "
                               "--ratios with --match, --total-flux");
    if ((fj->kind == MCD_FILM_BOOT_WEIGHTS ||
         fj->kind == MCD_FILM_BOOT_RATIOS) &&
        fj->nvalues != s->n)
        return cli_usage_error(cmd, fj->boot_opt,
                               "has %zu values for %zu species", fj->nvalues,
                               s->n);
    if (fj->kind == MCD_FILM_BOOT_RATIOS && !match)
        return cli_usage_error(cmd, "--match",
                               "is required with --ratios (the species "
                               "whose value at z = L is matched)");
    if (fj->kind != MCD_FILM_BOOT_RATIOS && match)
        return cli_usage_error(cmd, "--match", "is only used with --ratios");
    if (fj->kind == MCD_FILM_BOOT_RATIOS)
        fj->species_name = match;
    if (have_points && !fj->profile)
        return cli_usage_error(cmd, "--points", "is only used with --profile");
    return CLI_OK;
}

/* Map a failed film solution: input that the library rejects as out of
 * its domain and that one option explains is bad input (exit 2, naming the
 * option); anything else is a failed computation (exit 1). Either way the
 * library's status text and detail are shown. */
static int film_failed(film_job *fj, const char *cmd, mcd_status st)
{
    const cli_state *s = &fj->s;
    const char *detail = cli_detail(mcd_last_error());
    const char *arg = NULL;
    char reason[200] = "";
    size_t n = s->n, i, k = fj->species;

    if (fj->kind == MCD_FILM_BOOT_TOTAL &&
        (st == MCD_ESING || st == MCD_ENOCONV ||
         (st == MCD_EDOM && strstr(detail, "rate factor")))) {
        /* a total flux far above the film's diffusive scale c D/L: the
         * profiles are exponential layers too thin to resolve */
        double Dmin = HUGE_VAL, Dmax = 0.0;
        for (i = 0; i < n; i++)
            for (k = 0; k < n; k++)
                if (i != k) {
                    Dmin = fmin(Dmin, s->Dij[i * n + k]);
                    Dmax = fmax(Dmax, s->Dij[i * n + k]);
                }
        return cli_usage_error(
            cmd, "--total-flux",
            "%g mol/(m^2 s) is %.3g to %.3g times the diffusive flux "
            "scale c D/L of this film (%.3g to %.3g mol/(m^2 s)): "
            "convection swamps diffusion and the profiles become layers "
            "too thin to resolve; give a total flux within a few tens of "
            "c D/L (in mol/(m^2 s)) (%s: %s)",
            fj->values[0], fabs(fj->values[0]) * fj->L / (s->c * Dmax),
            fabs(fj->values[0]) * fj->L / (s->c * Dmin), s->c * Dmin / fj->L,
            s->c * Dmax / fj->L, mcd_status_string((int)st), detail);
    }
    if (st == MCD_EDOM || st == MCD_EINVAL) {
        switch (fj->kind) {
        case MCD_FILM_BOOT_STAGNANT:
            if (!(s->x[k] > 0.0) || !(fj->xL[k] > 0.0)) {
                arg = "--stagnant";
                snprintf(reason, sizeof reason,
                         "'%s' is absent at z = %s, so it cannot be the "
                         "stagnant species",
                         fj->species_name, !(s->x[k] > 0.0) ? "0" : "L");
            }
            break;
        case MCD_FILM_BOOT_WEIGHTS: {
            double d0 = 0.0, dL = 0.0;
            for (i = 0; i < n; i++) {
                d0 += fj->values[i] * s->x[i];
                dL += fj->values[i] * fj->xL[i];
            }
            if (fabs(d0) < 1e-9 && fabs(dL) < 1e-9) {
                arg = "--weights";
                snprintf(reason, sizeof reason,
                         "sum nu_i x_i vanishes at both ends");
            }
            break;
        }
        case MCD_FILM_BOOT_RATIOS: {
            double sum = 0.0;
            for (i = 0; i < n; i++)
                sum += fj->values[i];
            if (!(fabs(sum - 1.0) <= MCD_SUM_TOL)) {
                arg = "--ratios";
                snprintf(reason, sizeof reason, "the ratios sum to %g, not 1",
                         sum);
            } else if (fj->values[k] == 0.0 && s->x[k] == 0.0) {
                arg = "--match";
                snprintf(reason, sizeof reason,
                         "'%s' is absent at z = 0 and has ratio 0: the total "
                         "flux is undetermined",
                         fj->species_name);
            }
            break;
        }
        case MCD_FILM_BOOT_TOTAL:
            if (strstr(detail, "TOTAL")) {
                arg = "--total-flux";
                snprintf(reason, sizeof reason,
                         "%g mol/(m^2 s) is beyond what the film can carry",
                         fj->values[0]);
            }
            break;
        case MCD_FILM_BOOT_EQUIMOLAR: break;
        }
    }
    if (arg)
        return cli_usage_error(cmd, arg, "%s: %s%s%s%s", reason,
                               mcd_status_string((int)st), *detail ? " (" : "",
                               detail, *detail ? ")" : "");
    return cli_fail(cmd, "the film solution", st, detail);
}

static int solve(film_job *fj, const char *cmd, mcd_film_method m, double *N,
                 size_t *it, double *res)
{
    cli_state *s = &fj->s;
    mcd_status st = mcd_film_solve(s->ws,
                                   &(mcd_film){.n_species = s->n,
                                               .c = s->c,
                                               .L = fj->L,
                                               .Dij = s->Dij,
                                               .x0 = s->x,
                                               .xL = fj->xL},
                                   fj->kind, fj->species,
                                   (fj->kind == MCD_FILM_BOOT_EQUIMOLAR ||
                                    fj->kind == MCD_FILM_BOOT_STAGNANT)
                                       ? NULL
                                       : fj->values,
                                   m, N, it, res);
    if (st != MCD_OK)
        return film_failed(fj, cmd, st);
    return CLI_OK;
}

/* Relative deviation of the linearized flux from the exact one: 0 when
 * both vanish, NaN (not defined) when only the exact one does. */
static double deviation(double exact, double lin)
{
    if (exact == 0.0)
        return lin == 0.0 ? 0.0 : (double)NAN;
    return (lin - exact) / fabs(exact);
}

static void print_profile_csv(const film_job *fj)
{
    const cli_state *s = &fj->s;
    cli_csv c;
    size_t p, i, n = s->n;
    cli_csv_init(&c, stdout);
    cli_csv_head(&c, "z", "", "m");
    for (i = 0; i < n; i++)
        cli_csv_head(&c, "x_", mcd_mixture_name(s->mix, i), "-");
    cli_csv_end_row(&c);
    for (p = 0; p < fj->points; p++) {
        cli_csv_number(&c, fj->z[p]);
        for (i = 0; i < n; i++)
            cli_csv_number(&c, cli_shown(fj->xz[p * n + i], 1.0));
        cli_csv_end_row(&c);
    }
}

static void print_flux_csv(const film_job *fj)
{
    const cli_state *s = &fj->s;
    cli_csv c;
    size_t i, n = s->n;
    const double *N = fj->run == RUN_LINEARIZED ? fj->Nl : fj->Ne;
    double sN = cli_scale(N, n, 1), sNl = cli_scale(fj->Nl, n, 1);
    cli_csv_init(&c, stdout);
    cli_csv_text(&c, "species");
    cli_csv_text(&c, "x0");
    cli_csv_text(&c, "xL");
    cli_csv_head(&c, "N", "", "mol/(m^2 s)");
    if (fj->run == RUN_BOTH) {
        cli_csv_head(&c, "N_linearized", "", "mol/(m^2 s)");
        cli_csv_text(&c, "deviation");
    }
    cli_csv_end_row(&c);
    for (i = 0; i < n; i++) {
        cli_csv_text(&c, mcd_mixture_name(s->mix, i));
        cli_csv_number(&c, s->x[i]);
        cli_csv_number(&c, cli_shown(fj->xL[i], 1.0));
        cli_csv_number(&c, cli_shown(N[i], sN));
        if (fj->run == RUN_BOTH) {
            cli_csv_number(&c, cli_shown(fj->Nl[i], sNl));
            cli_csv_number(&c, deviation(fj->Ne[i], fj->Nl[i]));
        }
        cli_csv_end_row(&c);
    }
}

static double sum_of(size_t n, const double *v)
{
    double acc = 0.0;
    size_t i;
    for (i = 0; i < n; i++)
        acc += v[i];
    return acc;
}

static void print_json(const film_job *fj)
{
    const cli_state *s = &fj->s;
    size_t i, n = s->n;
    cli_json j;
    const double *N = fj->run == RUN_LINEARIZED ? fj->Nl : fj->Ne;

    cli_json_init(&j, stdout);
    cli_json_object_begin(&j, NULL);
    cli_json_array_begin(&j, "species");
    for (i = 0; i < n; i++)
        cli_json_string(&j, NULL, mcd_mixture_name(s->mix, i));
    cli_json_array_end(&j);
    cli_json_number(&j, "T", s->T);
    cli_json_number(&j, "P", s->P);
    cli_json_number(&j, "c", s->c);
    cli_json_number(&j, "L", fj->L);
    cli_json_numbers(&j, "x0", s->x, n);
    cli_json_numbers(&j, "xL", fj->xL, n);
    if (fj->have_xLs) {
        cli_json_numbers(&j, "xL_solved", fj->xLs, n);
        cli_json_string(&j, "xL_imposed",
                        mcd_mixture_name(s->mix, fj->species));
    }
    cli_json_object_begin(&j, "bootstrap");
    cli_json_string(&j, "kind", boot_name(fj->kind));
    if (fj->kind == MCD_FILM_BOOT_STAGNANT || fj->kind == MCD_FILM_BOOT_RATIOS)
        cli_json_string(&j, "species", mcd_mixture_name(s->mix, fj->species));
    if (fj->kind == MCD_FILM_BOOT_WEIGHTS || fj->kind == MCD_FILM_BOOT_RATIOS)
        cli_json_numbers(&j, "values", fj->values, n);
    if (fj->kind == MCD_FILM_BOOT_TOTAL)
        cli_json_number(&j, "total_flux", fj->values[0]);
    cli_json_object_end(&j);
    cli_json_string(&j, "model",
                    fj->run == RUN_EXACT        ? "exact"
                    : fj->run == RUN_LINEARIZED ? "linearized"
                                                : "both");
    cli_state_json_binaries(s, &j);
    cli_json_string(&j, "flux_unit", "mol/(m^2 s)");
    cli_json_numbers(&j, "fluxes", N, n);
    cli_json_number(&j, "total_flux", sum_of(n, N));
    cli_json_integer(
        &j, "iterations",
        (long long)(fj->run == RUN_LINEARIZED ? fj->it_l : fj->it_e));
    cli_json_number(&j, "residual",
                    fj->run == RUN_LINEARIZED ? fj->res_l : fj->res_e);
    if (fj->run == RUN_BOTH) {
        double dev[MCD_MAX_SPECIES];
        for (i = 0; i < n; i++)
            dev[i] = deviation(fj->Ne[i], fj->Nl[i]);
        cli_json_numbers(&j, "fluxes_linearized", fj->Nl, n);
        cli_json_integer(&j, "iterations_linearized", (long long)fj->it_l);
        cli_json_number(&j, "residual_linearized", fj->res_l);
        cli_json_numbers(&j, "deviation", dev, n);
    }
    if (fj->profile) {
        size_t p;
        cli_json_object_begin(&j, "profile");
        cli_json_numbers(&j, "z", fj->z, fj->points);
        cli_json_array_begin(&j, "x");
        for (p = 0; p < fj->points; p++)
            cli_json_numbers(&j, NULL, fj->xz + p * n, n);
        cli_json_array_end(&j);
        cli_json_object_end(&j);
    }
    cli_json_string(&j, "caution", CLI_CAUTION_TRANSFER_LONG);
    cli_json_object_end(&j);
    cli_json_finish(&j);
}

static void print_table(const film_job *fj)
{
    const cli_state *s = &fj->s;
    size_t i, n = s->n;
    cli_table t;
    const char *cells[6];
    char b[6][64];
    int both = fj->run == RUN_BOTH;
    const double *N = fj->run == RUN_LINEARIZED ? fj->Nl : fj->Ne;
    double sN = cli_scale(N, n, 1), sNl = cli_scale(fj->Nl, n, 1);

    printf("film: %zu species, L = %.6g m, T = %.6g K, P = %.6g Pa, "
           "c = %.5g mol/m^3 (ideal gas)\n",
           n, fj->L, s->T, s->P, s->c);
    printf("bootstrap: ");
    switch (fj->kind) {
    case MCD_FILM_BOOT_STAGNANT:
        printf("%s stagnant (N = 0)\n", mcd_mixture_name(s->mix, fj->species));
        break;
    case MCD_FILM_BOOT_EQUIMOLAR: printf("equimolar (sum N_i = 0)\n"); break;
    case MCD_FILM_BOOT_WEIGHTS:
        printf("sum nu_i N_i = 0, nu =");
        for (i = 0; i < n; i++)
            printf("%s%.6g", i ? ", " : " ", fj->values[i]);
        printf("\n");
        break;
    case MCD_FILM_BOOT_RATIOS:
        printf("N_i = z_i N_t, z =");
        for (i = 0; i < n; i++)
            printf("%s%.6g", i ? ", " : " ", fj->values[i]);
        printf("; x(L) of %s matched\n", mcd_mixture_name(s->mix, fj->species));
        break;
    case MCD_FILM_BOOT_TOTAL:
        printf("sum N_i = %.6g mol/(m^2 s)\n", fj->values[0]);
        break;
    }
    printf("binary diffusivities:\n");
    cli_state_print_binaries(s, stdout);
    printf("total molar fluxes, constant across the film, positive from "
           "z = 0 towards z = L\n(%s):\n",
           fj->run == RUN_EXACT
               ? "exact Maxwell-Stefan, Krishna-Standart matrix solution"
           : fj->run == RUN_LINEARIZED
               ? "linearized theory, [D] at the mean composition"
               : "exact Maxwell-Stefan and linearized theory");
    cli_table_init(&t, both ? 6 : 4);
    t.right[1] = t.right[2] = t.right[3] = 1;
    if (both)
        t.right[4] = t.right[5] = 1;
    cells[0] = "species";
    cells[1] = "x(z=0)";
    cells[2] = "x(z=L)";
    cells[3] = both ? "N exact [mol/(m^2 s)]" : "N [mol/(m^2 s)]";
    cells[4] = "N linearized [mol/(m^2 s)]";
    cells[5] = "deviation";
    cli_table_row(&t, cells);
    for (i = 0; i < n; i++) {
        cells[0] = mcd_mixture_name(s->mix, i);
        snprintf(b[1], sizeof b[1], "%.5g", s->x[i]);
        if (fj->have_xLs)
            snprintf(b[2], sizeof b[2], "%.5g%s", cli_shown(fj->xLs[i], 1.0),
                     i == fj->species ? " *" : "");
        else
            snprintf(b[2], sizeof b[2], "%.5g", cli_shown(fj->xL[i], 1.0));
        snprintf(b[3], sizeof b[3], "%.5e", cli_shown(N[i], sN));
        snprintf(b[4], sizeof b[4], "%.5e", cli_shown(fj->Nl[i], sNl));
        {
            double d = deviation(fj->Ne[i], fj->Nl[i]);
            if (isnan(d))
                snprintf(b[5], sizeof b[5], "-");
            else
                snprintf(b[5], sizeof b[5], "%+.2f %%", 100.0 * d);
        }
        for (size_t k = 1; k < 6; k++)
            cells[k] = b[k];
        cli_table_row(&t, cells);
    }
    cells[0] = "total";
    cells[1] = cells[2] = "";
    snprintf(b[3], sizeof b[3], "%.5e", sum_of(n, N));
    cells[3] = b[3];
    snprintf(b[4], sizeof b[4], "%.5e", sum_of(n, fj->Nl));
    cells[4] = b[4];
    cells[5] = "";
    cli_table_row(&t, cells);
    cli_table_print(&t, stdout, "  ");
    cli_table_free(&t);
    if (fj->run & RUN_EXACT)
        printf("  exact: %zu iterations, residual %.1e\n", fj->it_e, fj->res_e);
    if (fj->run & RUN_LINEARIZED)
        printf("  linearized: %zu iterations, residual %.1e\n", fj->it_l,
               fj->res_l);
    if (both)
        printf("  deviation = (N linearized - N exact) / |N exact|\n");
    if (fj->have_xLs)
        printf("  x(z=L): the end state the fluxes reach; * = imposed "
               "(--match), the others follow from the film\n");
    printf("%s\n", CLI_CAUTION_TRANSFER_SHORT);
}

int cli_cmd_film(int argc, char **argv)
{
    const char *cmd = "film";
    film_job *fj = calloc(1, sizeof *fj);
    cli_state *s;
    mcd_status st;
    int rc;
    size_t i, n;

    if (!fj)
        return cli_fail(cmd, "setting up", MCD_ENOMEM, NULL);
    s = &fj->s;
    rc = parse(fj, cmd, argc, argv);
    if (rc != CLI_OK) {
        rc = rc < 0 ? CLI_OK : rc;
        goto done;
    }
    n = s->n;
    /* The state validates and reports the composition at z = 0. */
    s->comp_basis = s->out_basis = MCD_BASIS_MOLE;
    s->comp_opt = "--x0";
    s->comp = malloc(n * sizeof *s->comp);
    if (!s->comp) {
        rc = cli_fail(cmd, "setting up", MCD_ENOMEM, NULL);
        goto done;
    }
    memcpy(s->comp, fj->x0in, n * sizeof *s->comp);
    rc = cli_state_setup(s, cmd);
    if (rc != CLI_OK)
        goto done;
    st = mcd_comp_normalize(n, fj->xLin, fj->xL);
    if (st == MCD_EDOM || st == MCD_EINVAL) {
        rc = cli_fractions_error(cmd, "--xL", st, fj->xLin, n);
        goto done;
    }
    if (fj->species_name) {
        long k = cli_state_find(s, fj->species_name);
        if (k < 0) {
            rc = cli_usage_error(
                cmd,
                fj->kind == MCD_FILM_BOOT_STAGNANT ? "--stagnant" : "--match",
                "'%s' is not in the species list", fj->species_name);
            goto done;
        }
        fj->species = (size_t)k;
    }

    if (fj->run & RUN_EXACT) {
        rc = solve(fj, cmd, MCD_FILM_EXACT, fj->Ne, &fj->it_e, &fj->res_e);
        if (rc != CLI_OK)
            goto done;
    }
    if (fj->run & RUN_LINEARIZED) {
        rc = solve(fj, cmd, MCD_FILM_LINEARIZED, fj->Nl, &fj->it_l, &fj->res_l);
        if (rc != CLI_OK)
            goto done;
    }
    if (fj->kind == MCD_FILM_BOOT_RATIOS) {
        const double zL = fj->L;
        st = mcd_film_profile(s->ws,
                              &(mcd_film){.n_species = n,
                                          .c = s->c,
                                          .L = fj->L,
                                          .Dij = s->Dij,
                                          .x0 = s->x},
                              fj->run & RUN_EXACT ? fj->Ne : fj->Nl, 1, &zL,
                              fj->xLs);
        if (st != MCD_OK) {
            rc = cli_fail(cmd, "the end state of the film", st,
                          mcd_last_error());
            goto done;
        }
        /* the matched value is the imposed one (the solve's mismatch is
         * the residual printed with the fluxes), not its round-off */
        fj->xLs[fj->species] = fj->xL[fj->species];
        fj->have_xLs = 1;
    }
    if (fj->profile) {
        /* The profile is the exact solution for the exact fluxes. */
        if (!(fj->run & RUN_EXACT)) {
            rc = solve(fj, cmd, MCD_FILM_EXACT, fj->Ne, &fj->it_e, &fj->res_e);
            if (rc != CLI_OK)
                goto done;
        }
        fj->z = malloc(fj->points * sizeof *fj->z);
        fj->xz = malloc(fj->points * n * sizeof *fj->xz);
        if (!fj->z || !fj->xz) {
            rc = cli_fail(cmd, "setting up", MCD_ENOMEM, NULL);
            goto done;
        }
        for (i = 0; i < fj->points; i++)
            fj->z[i] = fj->L * ((double)i / (double)(fj->points - 1));
        fj->z[fj->points - 1] = fj->L;
        st = mcd_film_profile(s->ws,
                              &(mcd_film){.n_species = n,
                                          .c = s->c,
                                          .L = fj->L,
                                          .Dij = s->Dij,
                                          .x0 = s->x},
                              fj->Ne, fj->points, fj->z, fj->xz);
        if (st != MCD_OK) {
            rc = cli_fail(cmd, "the film profile", st, mcd_last_error());
            goto done;
        }
    }

    if (s->json) {
        print_json(fj);
    } else if (fj->profile) {
        print_profile_csv(fj);
        fprintf(stderr, "%s\n", CLI_CAUTION_TRANSFER_SHORT);
    } else if (s->csv) {
        print_flux_csv(fj);
        fprintf(stderr, "%s\n", CLI_CAUTION_TRANSFER_SHORT);
    } else {
        print_table(fj);
    }
    rc = CLI_OK;
done:
    free(fj->z);
    free(fj->xz);
    cli_state_free(s);
    free(fj);
    return rc;
}
