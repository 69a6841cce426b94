/* cmd_bulbs.c - `mcdiff bulbs`: composition histories of a closed two-bulb
 * diffusion cell (mcd_bulbs_integrate, mcd_bulbs_linearized), as CSV or
 * JSON.
 */
#include <math.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>
#include "cli.h"

static void help(FILE *f)
{
    fputs(
        "usage: mcdiff bulbs -s A,B,C --x1 LIST --x2 LIST --v1 VOL --v2 VOL\n"
        "                    -L LEN (--area AREA | --diameter LEN)\n"
        "                    -t TIMES -T TEMP -P PRES [options]\n"
        "\n"
        "Mole fractions in two well-mixed bulbs of an ideal gas joined by a\n"
        "capillary (closed, isothermal, isobaric: equimolar counter-diffusion\n"
        "through a quasi-steady capillary), at the times asked for. Every\n"
        "species is conserved (V1 x1 + V2 x2 constant) and both bulbs tend\n"
        "to the volume-weighted mean composition.\n"
        "\n"
        "options (lists are comma-separated, one value per species, in the\n"
        "order of -s):\n"
        "  -s, --species LIST        species names or formulas (2 or more)\n"
        "  --x1 LIST                 initial mole fractions [-] in bulb 1\n"
        "  --x2 LIST                 initial mole fractions [-] in bulb 2\n"
        "  --v1 VOL, --v2 VOL        bulb volumes; m3, L, mL or cm3 suffix,\n"
        "                            bare = m3\n"
        "  -L, --length LEN          capillary length; m, cm or mm, bare = m\n"
        "  --area AREA               capillary cross-section; m2, cm2 or mm2,\n"
        "                            bare = m2\n"
        "  --diameter LEN            or its inner diameter (area pi d^2/4);\n"
        "                            m, cm or mm, bare = m\n"
        "  -t, --times TIMES         output times, s, min, h or d suffix,\n"
        "                            bare = s: a list (0,30min,1h,2d; not\n"
        "                            decreasing) or START:STOP:COUNT\n"
        "                            (0:10h:21 = 21 equally spaced times)\n"
        "  --time-unit UNIT          s (default), min, h or d: the unit of\n"
        "                            the printed times (CSV column t_UNIT)\n"
        "  -T, --temperature TEMP    K or C suffix (also F), bare = K\n"
        "  -P, --pressure PRES       Pa, kPa, MPa, bar, atm or psi, bare = Pa\n"
        "  --model NAME              integrated (default: exact film fluxes\n"
        "                            at every instant, Runge-Kutta with error\n"
        "                            control) or linearized ([D] frozen at\n"
        "                            the mean composition, closed form)\n"
        "  --tolerance TOL           local error tolerance on the mole\n"
        "                            fractions of integrated, 1e-12 to 1e-2\n"
        "                            (default 1e-9)\n" CLI_METHOD_HELP
        "  --pair A:B=D[@T,P]        binary diffusivity of a pair [m^2/s, or\n"
        "                            cm2/s suffix], as for 'mcdiff fluxes'\n"
        "  --csv                     CSV (the default): header row\n"
        "                            t_s,x1_A,...,x2_A,...,N_A_mol_per_m2_s,\n"
        "                            ...,flags_A,... then one row per time;\n"
        "                            the caution goes to stderr\n"
        "  --json                    one JSON object (SI): \"t\" [s], \"x1\",\n"
        "                            \"x2\", \"N\", \"flags\" (rows = times),\n"
        "                            \"x_final\"\n"
        "  --species-file FILE       also load species from FILE\n"
        "  -h, --help                this text\n"
        "\n"
        "N_i is the flux from bulb 1 to bulb 2 through the capillary at\n"
        "that instant: the exact equimolar film between the two bulb\n"
        "compositions (for --model linearized too). Coupling flags of each\n"
        "species against its mean gradient (x2 - x1)/L: osmotic = a flux\n"
        "with no gradient of its own, reverse = a flux up its own gradient,\n"
        "barrier = no flux despite a gradient; 'no' and 'zero' mean at most\n"
        "1e-3 of the largest gradient or flux of that time. Mole fractions\n"
        "within 1.4e-14 of 0 and fluxes within 1.4e-14 of the largest flux\n"
        "print as 0 (round-off; JSON keeps the computed doubles).\n"
        "\n"
        "example (invented cell: hydrogen against carbon dioxide, nitrogen\n"
        "in both bulbs):\n"
        "  mcdiff bulbs -s H2,N2,CO2 --x1 0.5,0.5,0 --x2 0,0.5,0.5 \\\n"
        "      --v1 80cm3 --v2 0.1L -L 9cm --diameter 2mm -t 0:6h:13 \\\n"
        "      -T 35C -P 1atm\n",
        f);
}

enum {
    O_X1 = 1,
    O_X2,
    O_V1,
    O_V2,
    O_LEN,
    O_AREA,
    O_DIAM,
    O_TIMES,
    O_MODEL,
    O_TOL,
    O_TUNIT
};

static const cli_opt bulbs_opts[] = {CLI_MIXTURE_OPTIONS,
                                     {"x1", 0, 1, O_X1},
                                     {"x2", 0, 1, O_X2},
                                     {"v1", 0, 1, O_V1},
                                     {"v2", 0, 1, O_V2},
                                     {"V1", 0, 1, O_V1},
                                     {"V2", 0, 1, O_V2},
                                     {"length", 'L', 1, O_LEN},
                                     {"area", 0, 1, O_AREA},
                                     {"diameter", 0, 1, O_DIAM},
                                     {"times", 't', 1, O_TIMES},
                                     {"model", 0, 1, O_MODEL},
                                     {"tolerance", 0, 1, O_TOL},
                                     {"time-unit", 0, 1, O_TUNIT},
                                     {NULL, 0, 0, 0}};

/* Output time units (--time-unit): name and seconds per unit. */
static const struct {
    const char *name;
    double s;
} time_units[] = {{"s", 1.0}, {"min", 60.0}, {"h", 3600.0}, {"d", 86400.0}};

/* Tolerance of the coupling flags: a gradient or flux counts as zero when
 * its magnitude is at most this fraction of the largest over the species
 * at that time (mcd_flux_diagnose; the same as 'mcdiff fluxes'). */
#define BULBS_FLAG_TOL 1e-3

typedef struct bulbs_job {
    cli_state s;
    double x1in[MCD_MAX_SPECIES], x2in[MCD_MAX_SPECIES];
    size_t nx1, nx2;
    double x2[MCD_MAX_SPECIES]; /* validated x2 */
    double V1, V2, L, A;
    int integrated;
    double tol;
    int have_tol;
    double *t;
    size_t nt;
    double *x1t, *x2t; /* nt x n each */
    size_t tunit;      /* index into time_units */
    double *Nt;        /* nt x n capillary fluxes [mol/(m^2 s)], 1 -> 2 */
    unsigned *flags;   /* nt x n MCD_DIAG_* bits */
    int *flux_ok;      /* nt: 1 when the film solve gave the fluxes */
} bulbs_job;

static int parse(bulbs_job *bj, const char *cmd, int argc, char **argv)
{
    cli_state *s = &bj->s;
    cli_args a;
    int id, rc, have_area = 0, have_diam = 0;
    char why[200];
    double d;

    cli_state_defaults(s);
    bj->V1 = bj->V2 = bj->L = bj->A = (double)NAN;
    bj->integrated = 1;
    bj->tol = 1e-9;
    cli_args_init(&a, cmd, argc, argv, bulbs_opts);
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
        case O_X1:
        case O_X2:
            if ((id == O_X1 && bj->nx1) || (id == O_X2 && bj->nx2))
                return cli_usage_error(cmd, a.spelled, "given twice");
            if (cli_parse_list(
                    a.value, id == O_X1 ? bj->x1in : bj->x2in, MCD_MAX_SPECIES,
                    id == O_X1 ? &bj->nx1 : &bj->nx2, why, sizeof why) != 0)
                return cli_usage_error(cmd, a.spelled, "%s", why);
            break;
        case O_V1:
        case O_V2:
            if (cli_parse_volume(a.value, id == O_V1 ? &bj->V1 : &bj->V2, why,
                                 sizeof why) != 0)
                return cli_usage_error(cmd, a.spelled, "%s", why);
            break;
        case O_LEN:
            if (cli_parse_length(a.value, &bj->L, why, sizeof why) != 0)
                return cli_usage_error(cmd, a.spelled, "%s", why);
            break;
        case O_AREA:
        case O_DIAM:
            if (have_area || have_diam)
                return cli_usage_error(cmd, a.spelled,
                                       "give the capillary once: --area or "
                                       "--diameter");
            if (id == O_AREA) {
                if (cli_parse_area(a.value, &bj->A, why, sizeof why) != 0)
                    return cli_usage_error(cmd, a.spelled, "%s", why);
                have_area = 1;
            } else {
                if (cli_parse_length(a.value, &d, why, sizeof why) != 0)
                    return cli_usage_error(cmd, a.spelled, "%s", why);
                bj->A = 0.25 * 3.14159265358979323846 * d * d;
                if (!(bj->A > 0.0) || !isfinite(bj->A))
                    return cli_usage_error(cmd, a.spelled,
                                           "'%s' gives no finite positive "
                                           "area",
                                           a.value);
                have_diam = 1;
            }
            break;
        case O_TIMES:
            if (bj->t)
                return cli_usage_error(cmd, a.spelled, "given twice");
            if (cli_parse_times(a.value, &bj->t, &bj->nt, why, sizeof why) != 0)
                return cli_usage_error(cmd, a.spelled, "%s", why);
            break;
        case O_MODEL:
            if (strcmp(a.value, "integrated") == 0)
                bj->integrated = 1;
            else if (strcmp(a.value, "linearized") == 0)
                bj->integrated = 0;
            else
                return cli_usage_error(cmd, a.spelled,
                                       "'%s' is not a two-bulb model "
                                       "(integrated or linearized)",
                                       a.value);
            break;
        case O_TOL:
            if (cli_parse_number(a.value, &bj->tol, why, sizeof why) != 0)
                return cli_usage_error(cmd, a.spelled, "%s", why);
            if (!(bj->tol >= 1e-12 && bj->tol <= 1e-2))
                return cli_usage_error(cmd, a.spelled,
                                       "'%s' is not in 1e-12..1e-2", a.value);
            bj->have_tol = 1;
            break;
        case O_TUNIT: {
            size_t k, nu = sizeof time_units / sizeof time_units[0];
            for (k = 0; k < nu && strcmp(a.value, time_units[k].name); k++)
                ;
            if (k == nu)
                return cli_usage_error(cmd, a.spelled,
                                       "'%s' is not a time unit (s, min, h "
                                       "or d)",
                                       a.value);
            bj->tunit = k;
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
    if (bj->nx1 == 0)
        return cli_usage_error(cmd, "--x1", "is required (bulb 1 at t = 0)");
    if (bj->nx2 == 0)
        return cli_usage_error(cmd, "--x2", "is required (bulb 2 at t = 0)");
    if (bj->nx1 != s->n)
        return cli_usage_error(cmd, "--x1", "has %zu values for %zu species",
                               bj->nx1, s->n);
    if (bj->nx2 != s->n)
        return cli_usage_error(cmd, "--x2", "has %zu values for %zu species",
                               bj->nx2, s->n);
    if (isnan(bj->V1))
        return cli_usage_error(cmd, "--v1", "is required (volume of bulb 1)");
    if (isnan(bj->V2))
        return cli_usage_error(cmd, "--v2", "is required (volume of bulb 2)");
    if (isnan(bj->L))
        return cli_usage_error(cmd, "-L/--length",
                               "is required (capillary length)");
    if (!have_area && !have_diam)
        return cli_usage_error(cmd, "--area",
                               "the capillary cross-section is required "
                               "(or --diameter)");
    if (!bj->t)
        return cli_usage_error(cmd, "-t/--times", "is required");
    if (bj->have_tol && !bj->integrated)
        return cli_usage_error(cmd, "--tolerance",
                               "is only used by --model integrated");
    return CLI_OK;
}

static void print_csv(const bulbs_job *bj)
{
    const cli_state *s = &bj->s;
    size_t n = s->n, i, k;
    double sN = cli_scale(bj->Nt, bj->nt * n, 1); /* round-off scale */
    cli_csv c;
    cli_csv_init(&c, stdout);
    cli_csv_head(&c, "t", "", time_units[bj->tunit].name);
    for (i = 0; i < n; i++)
        cli_csv_head(&c, "x1_", mcd_mixture_name(s->mix, i), "-");
    for (i = 0; i < n; i++)
        cli_csv_head(&c, "x2_", mcd_mixture_name(s->mix, i), "-");
    for (i = 0; i < n; i++)
        cli_csv_head(&c, "N_", mcd_mixture_name(s->mix, i), "mol/(m^2 s)");
    for (i = 0; i < n; i++)
        cli_csv_head(&c, "flags_", mcd_mixture_name(s->mix, i), "-");
    cli_csv_end_row(&c);
    for (k = 0; k < bj->nt; k++) {
        cli_csv_number(&c, bj->t[k] / time_units[bj->tunit].s);
        /* mole fractions: round-off relative to 1 (CLI_ROUNDOFF_REL) */
        for (i = 0; i < n; i++)
            cli_csv_number(&c, cli_shown(bj->x1t[k * n + i], 1.0));
        for (i = 0; i < n; i++)
            cli_csv_number(&c, cli_shown(bj->x2t[k * n + i], 1.0));
        for (i = 0; i < n; i++)
            cli_csv_number(&c, bj->flux_ok[k] ? cli_shown(bj->Nt[k * n + i], sN)
                                              : (double)NAN);
        for (i = 0; i < n; i++) {
            char buf[64];
            cli_flag_text(bj->flags[k * n + i], buf, sizeof buf);
            /* none: empty, as in 'mcdiff fluxes --csv' */
            cli_csv_text(&c, !bj->flux_ok[k]         ? "n/a"
                             : strcmp(buf, "-") == 0 ? ""
                                                     : buf);
        }
        cli_csv_end_row(&c);
    }
}

/* Capillary fluxes at each output time, N_i from bulb 1 to bulb 2: the
 * exact steady equimolar film between x1(t) and x2(t) (the flux the
 * integrated model uses at that instant), and their coupling flags
 * against the mean gradient (x2 - x1) / L along the capillary. A time at
 * which the film does not solve gets no fluxes (flux_ok 0) and a note. */
static void capillary_fluxes(bulbs_job *bj, const char *cmd)
{
    cli_state *s = &bj->s;
    size_t n = s->n, k, i;
    for (k = 0; k < bj->nt; k++) {
        double grad[MCD_MAX_SPECIES], x1[MCD_MAX_SPECIES], x2[MCD_MAX_SPECIES];
        mcd_film f = {.n_species = n,
                      .c = s->c,
                      .L = bj->L,
                      .Dij = s->Dij,
                      .x0 = x1,
                      .xL = x2};
        mcd_status st;
        /* Round-off (-5.6e-17 for an absent species) is no composition:
         * the film takes fractions in [0, 1]. */
        for (i = 0; i < n; i++) {
            x1[i] = cli_shown(bj->x1t[k * n + i], 1.0);
            x2[i] = cli_shown(bj->x2t[k * n + i], 1.0);
        }
        st = mcd_film_solve(s->ws, &f, MCD_FILM_BOOT_EQUIMOLAR, 0, NULL,
                            MCD_FILM_EXACT, bj->Nt + k * n, NULL, NULL);
        for (i = 0; i < n; i++)
            grad[i] = (x2[i] - x1[i]) / bj->L;
        if (st == MCD_OK)
            st = mcd_flux_diagnose(n, 1, grad, bj->Nt + k * n, BULBS_FLAG_TOL,
                                   bj->flags + k * n);
        bj->flux_ok[k] = st == MCD_OK;
        if (st != MCD_OK)
            fprintf(stderr,
                    "mcdiff %s: warning: no capillary fluxes at t = %g s "
                    "(%s: %s)\n",
                    cmd, bj->t[k], mcd_status_string(st), mcd_last_error());
    }
}

static void print_json(const bulbs_job *bj)
{
    const cli_state *s = &bj->s;
    size_t n = s->n, i, k;
    double xbar[MCD_MAX_SPECIES];
    cli_json j;

    for (i = 0; i < n; i++)
        xbar[i] = (bj->V1 * s->x[i] + bj->V2 * bj->x2[i]) / (bj->V1 + bj->V2);
    cli_json_init(&j, stdout);
    cli_json_object_begin(&j, NULL);
    cli_json_array_begin(&j, "species");
    for (i = 0; i < n; i++)
        cli_json_string(&j, NULL, mcd_mixture_name(s->mix, i));
    cli_json_array_end(&j);
    cli_json_number(&j, "T", s->T);
    cli_json_number(&j, "P", s->P);
    cli_json_number(&j, "c", s->c);
    cli_json_number(&j, "V1", bj->V1);
    cli_json_number(&j, "V2", bj->V2);
    cli_json_number(&j, "A", bj->A);
    cli_json_number(&j, "L", bj->L);
    cli_json_number(&j, "beta",
                    bj->A * (bj->V1 + bj->V2) / (bj->L * bj->V1 * bj->V2));
    cli_json_string(&j, "model", bj->integrated ? "integrated" : "linearized");
    if (bj->integrated)
        cli_json_number(&j, "tolerance", bj->tol);
    else
        cli_json_null(&j, "tolerance");
    cli_state_json_binaries(s, &j);
    cli_json_numbers(&j, "x1_initial", s->x, n);
    cli_json_numbers(&j, "x2_initial", bj->x2, n);
    cli_json_numbers(&j, "x_final", xbar, n);
    cli_json_numbers(&j, "t", bj->t, bj->nt);
    cli_json_string(&j, "time_unit", time_units[bj->tunit].name);
    cli_json_array_begin(&j, "t_in_unit");
    for (k = 0; k < bj->nt; k++)
        cli_json_number(&j, NULL, bj->t[k] / time_units[bj->tunit].s);
    cli_json_array_end(&j);
    cli_json_array_begin(&j, "x1");
    for (k = 0; k < bj->nt; k++)
        cli_json_numbers(&j, NULL, bj->x1t + k * n, n);
    cli_json_array_end(&j);
    cli_json_array_begin(&j, "x2");
    for (k = 0; k < bj->nt; k++)
        cli_json_numbers(&j, NULL, bj->x2t + k * n, n);
    cli_json_array_end(&j);
    cli_json_string(&j, "flux_unit", "mol/(m^2 s)");
    cli_json_array_begin(&j, "N");
    for (k = 0; k < bj->nt; k++) {
        if (bj->flux_ok[k]) {
            cli_json_numbers(&j, NULL, bj->Nt + k * n, n);
        } else {
            cli_json_null(&j, NULL);
        }
    }
    cli_json_array_end(&j);
    cli_json_number(&j, "flag_tolerance", BULBS_FLAG_TOL);
    cli_json_array_begin(&j, "flags");
    for (k = 0; k < bj->nt; k++) {
        if (!bj->flux_ok[k]) {
            cli_json_null(&j, NULL);
            continue;
        }
        cli_json_array_begin(&j, NULL);
        for (i = 0; i < n; i++)
            cli_json_flags(&j, bj->flags[k * n + i]);
        cli_json_array_end(&j);
    }
    cli_json_array_end(&j);
    cli_json_string(&j, "caution", CLI_CAUTION_TRANSFER_LONG);
    cli_json_object_end(&j);
    cli_json_finish(&j);
}

int cli_cmd_bulbs(int argc, char **argv)
{
    const char *cmd = "bulbs";
    bulbs_job *bj = calloc(1, sizeof *bj);
    cli_state *s;
    mcd_status st;
    int rc;
    size_t n;

    if (!bj)
        return cli_fail(cmd, "setting up", MCD_ENOMEM, NULL);
    s = &bj->s;
    rc = parse(bj, cmd, argc, argv);
    if (rc != CLI_OK) {
        rc = rc < 0 ? CLI_OK : rc;
        goto done;
    }
    n = s->n;
    s->comp_basis = s->out_basis = MCD_BASIS_MOLE;
    s->comp_opt = "--x1";
    s->comp = malloc(n * sizeof *s->comp);
    bj->x1t = malloc(bj->nt * n * sizeof *bj->x1t);
    bj->x2t = malloc(bj->nt * n * sizeof *bj->x2t);
    bj->Nt = calloc(bj->nt * n, sizeof *bj->Nt);
    bj->flags = calloc(bj->nt * n, sizeof *bj->flags);
    bj->flux_ok = calloc(bj->nt, sizeof *bj->flux_ok);
    if (!s->comp || !bj->x1t || !bj->x2t || !bj->Nt || !bj->flags ||
        !bj->flux_ok) {
        rc = cli_fail(cmd, "setting up", MCD_ENOMEM, NULL);
        goto done;
    }
    memcpy(s->comp, bj->x1in, n * sizeof *s->comp);
    rc = cli_state_setup(s, cmd);
    if (rc != CLI_OK)
        goto done;
    st = mcd_comp_normalize(n, bj->x2in, bj->x2);
    if (st == MCD_EDOM || st == MCD_EINVAL) {
        rc = cli_fractions_error(cmd, "--x2", st, bj->x2in, n);
        goto done;
    }
    if (bj->integrated)
        st = mcd_bulbs_integrate(s->ws,
                                 &(mcd_bulbs){.n_species = n,
                                              .c = s->c,
                                              .V1 = bj->V1,
                                              .V2 = bj->V2,
                                              .A = bj->A,
                                              .L = bj->L,
                                              .Dij = s->Dij,
                                              .x1_0 = s->x,
                                              .x2_0 = bj->x2},
                                 bj->nt, bj->t, bj->tol, bj->x1t, bj->x2t);
    else
        st = mcd_bulbs_linearized(s->ws,
                                  &(mcd_bulbs){.n_species = n,
                                               .c = s->c,
                                               .V1 = bj->V1,
                                               .V2 = bj->V2,
                                               .A = bj->A,
                                               .L = bj->L,
                                               .Dij = s->Dij,
                                               .x1_0 = s->x,
                                               .x2_0 = bj->x2},
                                  bj->nt, bj->t, bj->x1t, bj->x2t);
    if (st != MCD_OK) {
        rc = cli_fail(cmd,
                      bj->integrated ? "the two-bulb integration"
                                     : "the linearized two-bulb solution",
                      st, mcd_last_error());
        goto done;
    }
    capillary_fluxes(bj, cmd);
    if (s->json) {
        print_json(bj);
    } else {
        print_csv(bj);
        fprintf(stderr, "%s\n", CLI_CAUTION_TRANSFER_SHORT);
    }
    rc = CLI_OK;
done:
    free(bj->t);
    free(bj->x1t);
    free(bj->x2t);
    free(bj->Nt);
    free(bj->flags);
    free(bj->flux_ok);
    cli_state_free(s);
    free(bj);
    return rc;
}
