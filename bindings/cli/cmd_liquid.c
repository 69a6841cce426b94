/* cmd_liquid.c - `mcdiff liquid`: a liquid mixture with the caller's
 * activity model and parameters (--params FILE and options). Without -g:
 * activity coefficients, the thermodynamic factor, Maxwell-Stefan
 * diffusivities and partial pressures (mcd_liquid_eval, mcd_liquid_vle);
 * with -g: exact Maxwell-Stefan fluxes and the Fick matrix (liq_flux.c);
 * with --evaporate GAS: the liquid evaporating through a Stefan tube
 * (liq_evap.c). Species are numbered 1..N in the order of the file's
 * species records, -s or -x.
 */
#include <math.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>
#include "liq.h"

static void help(FILE *f)
{
    fputs(
        "usage: mcdiff liquid -x LIST -T TEMP [--params FILE] [--model NAME]\n"
        "                     [--pair SPEC]... [-g LIST]... [options]\n"
        "\n"
        "A liquid mixture with your activity model and parameters (from\n"
        "--params FILE and/or the options below). Without -g: activity\n"
        "coefficients, the thermodynamic factor matrix Gamma and, when every\n"
        "pair has infinite-dilution diffusivities, the Maxwell-Stefan\n"
        "diffusivities (Vignes; Kooijman-Taylor for 3 or more species).\n"
        "With -g: the exact Maxwell-Stefan diffusion fluxes with Gamma and\n"
        "the generalized Fick matrix. With --evaporate GAS: the liquid\n"
        "evaporating through a Stefan tube into GAS. Species are numbered\n"
        "1..N in the order of the file's species records, -s or -x, and may\n"
        "be named by name. A composition at which the liquid splits into\n"
        "two phases is refused (exit 1).\n"
        "\n"
        "the liquid (lists are comma-separated, one value per species):\n"
        "  --params FILE             parameter file (format: man mcdiff,\n"
        "                            PARAMETER FILE); the options below\n"
        "                            complement it, and a value given in\n"
        "                            both is an error naming the file line\n"
        "  -s, --species LIST        species names (without a file)\n"
        "  -x, --mole-fractions LIST liquid mole fractions [-], sum 1\n"
        "  -w, --mass-fractions LIST liquid mass fractions [-], sum 1\n"
        "                            (instead of -x; needs molar masses;\n"
        "                            -g is then in mass fractions too)\n"
        "  -T, --temperature TEMP    K or C suffix, bare = K\n"
        "  --model NAME              ideal, nrtl (default without a file),\n"
        "                            wilson, uniquac\n"
        "  --pair I:J=A,B,E,A',B',E'[,ALPHA]\n"
        "                            pair parameters p_ij = A + B/T + E ln T\n"
        "                            (A, E [-], B [K]) and p_ji from A', B',\n"
        "                            E'; ALPHA: NRTL non-randomness (default\n"
        "                            0.3). NRTL tau = p, Wilson Lambda_ij =\n"
        "                            (V_j/V_i) exp(-p_ij), UNIQUAC tau =\n"
        "                            exp(-p). Repeat per pair.\n"
        "  --volumes LIST            Wilson: liquid molar volumes [m^3/mol]\n"
        "  --uniquac-r LIST          UNIQUAC volume parameters r [-]\n"
        "  --uniquac-q LIST          UNIQUAC area parameters q [-]\n"
        "  --dinf I:J=D1,D2          infinite-dilution diffusivities of I in "
        "J\n"
        "                            and J in I [m^2/s, or cm2/s suffix]\n"
        "  --antoine I=A,B,C,TMIN,TMAX  log10(P/Pa) = A - B/(T/K + C), valid\n"
        "                            TMIN..TMAX [K]: adds partial pressures\n"
        "                            x_i gamma_i P_i^sat [Pa]\n"
        "fluxes (with -g):\n"
        "  -g, --gradient LIST       gradients of the mole fractions [1/m];\n"
        "                            repeat once per direction (1 to 3)\n"
        "  --concentration C         total molar concentration [mol/m^3;\n"
        "                            kmol/m3 or mol/L suffix], or:\n"
        "  --density RHO             liquid density [kg/m^3; g/cm3, kg/L]:\n"
        "                            c = RHO / sum x_i M_i, or:\n"
        "  --partial-volumes LIST    partial molar volumes [m^3/mol]:\n"
        "                            c = 1 / sum x_i V_i (one of the three)\n"
        "  --basis NAME              mole (J_i [mol/(m^2 s)], molar-average\n"
        "                            velocity; default with -x), mass (j_i\n"
        "                            [kg/(m^2 s)], mass-average velocity;\n"
        "                            default with -w) or\n"
        "                            volume (J^V_i [mol/(m^2 s)],\n"
        "                            volume-average velocity; needs\n"
        "                            --partial-volumes)\n"
        "  --dependent NAME          species left out of the Fick matrix\n"
        "                            (default: the most abundant)\n"
        "evaporation (with --evaporate; needs named species and --antoine):\n"
        "  --evaporate GAS           the inert gas above the liquid (a\n"
        "                            species of the table, e.g. air)\n"
        "  -P, --pressure PRES       gas pressure; Pa, kPa, bar, atm; bare Pa\n"
        "  -L, --length LEN          tube length (liquid surface to the\n"
        "                            open end); m, cm or mm, bare = m\n"
        "  --density RHO             liquid density (for the level fall)\n"
        "  --gas-pair A:B=D[@T,P]    gas diffusivity of a pair [m^2/s, or\n"
        "                            cm2/s suffix], as --pair of 'mcdiff\n"
        "                            film'; the rest are estimated\n"
        "  -m, --method NAME         gas estimate: fsg (default),\n"
        "                            chapman-enskog, wilke-lee\n"
        "  --xL LIST                 gas mole fractions at the open end\n"
        "                            (liquid species then GAS; default pure\n"
        "                            GAS)\n"
        "  --species-file FILE       also load species from FILE\n"
        "output:\n"
        "  --json                    one JSON object (SI)\n"
        "  --csv                     the flux table as CSV (with -g or\n"
        "                            --evaporate; the caution goes to stderr)\n"
        "  -h, --help                this text\n"
        "\n"
        "example (NRTL, tau = 1 both ways, alpha 0: ln gamma_1 = 2 x_2^2):\n"
        "  mcdiff liquid -x 0.3,0.7 -T 300 --pair 1:2=1,0,0,1,0,0,0\n"
        "  mcdiff liquid -x 0.3,0.7 -T 300 --pair 1:2=1,0,0,1,0,0,0 \\\n"
        "      --dinf 1:2=2e-9,1e-9 -g -100,100 --concentration 40mol/L\n",
        f);
}

void liq_print_matrix(const char *title, size_t n, const double *A)
{
    char buf[64];
    printf("%s\n", title);
    for (size_t i = 0; i < n; i++) {
        printf("  ");
        for (size_t j = 0; j < n; j++) {
            cli_fmt_num(buf, sizeof buf, A[i * n + j]);
            printf(" %12s", buf);
        }
        printf("\n");
    }
}

void liq_json_matrix(cli_json *js, const char *key, size_t n, const double *A)
{
    cli_json_array_begin(js, key);
    for (size_t i = 0; i < n; i++)
        cli_json_numbers(js, NULL, A + i * n, n);
    cli_json_array_end(js);
}

static void report(int json, const liq_def *d, double T, const double *x,
                   const double *lng, const double *G, const double *D,
                   const double *p, unsigned warn)
{
    double g[LIQ_MAX];
    char wtext[256], nb[16];
    size_t n = d->n;
    for (size_t i = 0; i < n; i++)
        g[i] = exp(lng[i]);
    cli_warn_text(warn, wtext, sizeof wtext);
    if (json) {
        cli_json js;
        cli_json_init(&js, stdout);
        cli_json_object_begin(&js, NULL);
        cli_json_string(&js, "model", liq_model_name(d->model));
        if (d->named) {
            cli_json_array_begin(&js, "species");
            for (size_t i = 0; i < n; i++)
                cli_json_string(&js, NULL, d->names[i]);
            cli_json_array_end(&js);
        }
        cli_json_number(&js, "T_K", T);
        cli_json_numbers(&js, "x", x, n);
        cli_json_numbers(&js, "ln_gamma", lng, n);
        cli_json_numbers(&js, "gamma", g, n);
        liq_json_matrix(&js, "Gamma", n, G);
        if (D != NULL)
            liq_json_matrix(&js, "Dij", n, D);
        if (p != NULL)
            cli_json_numbers(&js, "partial_pressures_Pa", p, n);
        cli_json_string(&js, "warnings", wtext);
        cli_json_string(&js, "caution", CLI_CAUTION_LONG);
        cli_json_object_end(&js);
        cli_json_finish(&js);
        return;
    }
    printf("liquid, %s model, %zu species, T = %g K\n",
           liq_model_name(d->model), n, T);
    printf("  species         x      ln_gamma         gamma%s\n",
           p ? "    p_Pa (x gamma P^sat)" : "");
    for (size_t i = 0; i < n; i++) {
        printf("  %7s  %8.5f  %12.6g  %12.6g",
               liq_def_name(d, i, nb, sizeof nb), x[i], lng[i], g[i]);
        if (p != NULL)
            printf("  %12.6g", p[i]);
        printf("\n");
    }
    liq_print_matrix("thermodynamic factor Gamma [-] (row i: d_i = sum_j "
                     "Gamma_ij grad x_j):",
                     n, G);
    if (D != NULL)
        liq_print_matrix("Maxwell-Stefan diffusivities [m^2/s] (Vignes / "
                         "Kooijman-Taylor):",
                         n, D);
    if (warn)
        printf("warnings: %s\n", wtext);
    printf("%s\n", CLI_CAUTION_SHORT);
}

int liq_eval_status(const char *cmd, const char *what, mcd_status st)
{
    if (st == MCD_OK)
        return CLI_OK;
    if (st == MCD_EINVAL || st == MCD_ENODATA ||
        (st == MCD_EDOM && strstr(mcd_last_error(), "not stable") == NULL &&
         strstr(mcd_last_error(), "boil") == NULL))
        return cli_usage_error(cmd, what, "%s: %s", mcd_status_string((int)st),
                               cli_detail(mcd_last_error()));
    return cli_fail(cmd, what, st, mcd_last_error());
}

/* Properties of the liquid at (T, x): the command without -g. */
static int properties(liq_run *r, const char *cmd)
{
    liq_def *d = &r->def;
    int rc, have_d = liq_def_have_dinf(d), have_p = liq_def_have_antoine(d);
    double lng[LIQ_MAX], G[LIQ_MAX * LIQ_MAX], D[LIQ_MAX * LIQ_MAX], p[LIQ_MAX];
    unsigned warn = 0;
    mcd_liquid *liq = NULL;
    mcd_workspace *ws = NULL;
    mcd_status st;
    if (r->csv)
        return cli_usage_error(cmd, "--csv",
                               "tables as CSV need -g or --evaporate");
    if ((rc = liq_def_check(d, cmd, 0)) != CLI_OK ||
        (rc = liq_def_build(d, cmd, &liq)) != CLI_OK)
        return rc;
    if ((st = mcd_workspace_new(d->n, &ws)) != MCD_OK)
        rc = cli_fail(cmd, "allocating", st, mcd_last_error());
    if (rc == CLI_OK)
        rc = liq_eval_status(cmd, "the liquid",
                             mcd_liquid_eval(ws, liq, r->T, r->x, lng, G,
                                             have_d ? D : NULL, &warn));
    if (rc == CLI_OK && have_p)
        rc = liq_eval_status(cmd, "the vapour pressures",
                             mcd_liquid_vle(ws, liq, r->T, r->x, p, &warn));
    if (rc == CLI_OK)
        report(r->json, d, r->T, r->x, lng, G, have_d ? D : NULL,
               have_p ? p : NULL, warn);
    mcd_workspace_free(ws);
    mcd_liquid_free(liq);
    return rc;
}

enum {
    O_X = 1,
    O_T,
    O_MODEL,
    O_PAIR,
    O_VOL,
    O_UR,
    O_UQ,
    O_DINF,
    O_ANT,
    O_JSON,
    O_CSV,
    O_HELP,
    O_PARAMS,
    O_SPECIES,
    O_GRAD,
    O_CONC,
    O_RHO,
    O_VBAR,
    O_BASIS,
    O_DEP,
    O_FILE,
    O_EVAP,
    O_P,
    O_LEN,
    O_GPAIR,
    O_METHOD,
    O_XL,
    O_W
};

static const cli_opt opts[] = {{"x", 'x', 1, O_X},
                               {"mole-fractions", 0, 1, O_X},
                               {"temperature", 'T', 1, O_T},
                               {"model", 0, 1, O_MODEL},
                               {"pair", 0, CLI_REPEAT, O_PAIR},
                               {"volumes", 0, 1, O_VOL},
                               {"uniquac-r", 0, 1, O_UR},
                               {"uniquac-q", 0, 1, O_UQ},
                               {"dinf", 0, CLI_REPEAT, O_DINF},
                               {"antoine", 0, CLI_REPEAT, O_ANT},
                               {"json", 0, 0, O_JSON},
                               {"csv", 0, 0, O_CSV},
                               {"help", 'h', 0, O_HELP},
                               {"params", 0, 1, O_PARAMS},
                               {"species", 's', 1, O_SPECIES},
                               {"gradient", 'g', CLI_REPEAT, O_GRAD},
                               {"concentration", 0, 1, O_CONC},
                               {"density", 0, 1, O_RHO},
                               {"partial-volumes", 0, 1, O_VBAR},
                               {"basis", 0, 1, O_BASIS},
                               {"dependent", 0, 1, O_DEP},
                               {"species-file", 0, 1, O_FILE},
                               {"evaporate", 0, 1, O_EVAP},
                               {"pressure", 'P', 1, O_P},
                               {"length", 'L', 1, O_LEN},
                               {"gas-pair", 0, CLI_REPEAT, O_GPAIR},
                               {"method", 'm', 1, O_METHOD},
                               {"xL", 0, 1, O_XL},
                               {"mass-fractions", 'w', 1, O_W},
                               {NULL, 0, 0, 0}};

/* Options kept as text until the file is read (they refer to species). */
typedef struct liq_texts {
    const char *pair[LIQ_MAX * LIQ_MAX / 2], *dinf[LIQ_MAX * LIQ_MAX / 2];
    const char *ant[LIQ_MAX], *list[3], *species, *model, *model_opt;
    size_t npair, ndinf, nant;
} liq_texts;

/* One option of the scan. CLI_OK, -1 for help printed, or an exit code. */
static int option(liq_run *r, liq_texts *t, const char *cmd, cli_args *a,
                  int id)
{
    char why[200];
    double *num = NULL;
    int (*parse)(const char *, double *, char *, size_t) = NULL;
    switch (id) {
    case CLI_ARG_ERROR: return CLI_USAGE;
    case O_HELP: help(stdout); return -1;
    case O_JSON: r->json = 1; return CLI_OK;
    case O_CSV: r->csv = 1; return CLI_OK;
    case O_X:
    case O_W:
        if (r->nx || r->nw)
            return cli_usage_error(cmd, a->spelled,
                                   "give one composition: either -x or -w, "
                                   "once");
        if (cli_parse_list(a->value, id == O_X ? r->x : r->win, LIQ_MAX,
                           id == O_X ? &r->nx : &r->nw, why, sizeof why))
            return cli_usage_error(cmd, a->spelled, "%s", why);
        r->mass_comp = id == O_W;
        return CLI_OK;
    case O_XL:
        if (cli_parse_list(a->value, r->xtop, LIQ_MAX + 1, &r->nxtop, why,
                           sizeof why))
            return cli_usage_error(cmd, a->spelled, "%s", why);
        return CLI_OK;
    case O_VBAR:
        if (cli_parse_list(a->value, r->Vbar, LIQ_MAX, &r->nVbar, why,
                           sizeof why))
            return cli_usage_error(cmd, a->spelled, "%s", why);
        return CLI_OK;
    case O_GRAD:
        if (r->n_dim >= MCD_MAX_DIM)
            return cli_usage_error(cmd, a->spelled,
                                   "at most %d directions (one -g per "
                                   "direction)",
                                   MCD_MAX_DIM);
        if (cli_parse_list(a->value, r->rows[r->n_dim], LIQ_MAX,
                           &r->nrow[r->n_dim], why, sizeof why))
            return cli_usage_error(cmd, a->spelled, "%s", why);
        r->n_dim++;
        return CLI_OK;
    case O_T: num = &r->T, parse = cli_parse_temperature; break;
    case O_CONC: num = &r->conc, parse = cli_parse_concentration; break;
    case O_RHO: num = &r->density, parse = cli_parse_density; break;
    case O_P: num = &r->P, parse = cli_parse_pressure; break;
    case O_LEN: num = &r->L, parse = cli_parse_length; break;
    case O_MODEL: t->model = a->value, t->model_opt = a->spelled; break;
    case O_SPECIES: t->species = a->value; break;
    case O_VOL: t->list[MCD_LIQ_MOLAR_VOLUME] = a->value; break;
    case O_UR: t->list[MCD_LIQ_UNIQUAC_R] = a->value; break;
    case O_UQ: t->list[MCD_LIQ_UNIQUAC_Q] = a->value; break;
    case O_PARAMS: r->def.file = a->value; break;
    case O_FILE: r->species_file = a->value; break;
    case O_DEP: r->dependent = a->value; break;
    case O_EVAP: r->inert = a->value; break;
    case O_METHOD: r->method = a->value; break;
    case O_BASIS:
        r->basis = strcmp(a->value, "mole") == 0     ? 0
                   : strcmp(a->value, "mass") == 0   ? 1
                   : strcmp(a->value, "volume") == 0 ? 2
                                                     : -2;
        if (r->basis == -2)
            return cli_usage_error(cmd, a->spelled,
                                   "'%s' is not a basis (mole, mass or "
                                   "volume)",
                                   a->value);
        break;
    case O_PAIR:
    case O_DINF:
    case O_ANT:
    case O_GPAIR: {
        size_t *cnt = id == O_PAIR   ? &t->npair
                      : id == O_DINF ? &t->ndinf
                      : id == O_ANT  ? &t->nant
                                     : &r->n_gas_pairs;
        const char **arr = id == O_PAIR   ? t->pair
                           : id == O_DINF ? t->dinf
                           : id == O_ANT  ? t->ant
                                          : r->gas_pairs;
        size_t cap = id == O_ANT     ? LIQ_MAX
                     : id == O_GPAIR ? 64
                                     : LIQ_MAX * LIQ_MAX / 2;
        if (*cnt >= cap)
            return cli_usage_error(cmd, a->spelled, "too many");
        arr[(*cnt)++] = a->value;
        break;
    }
    case CLI_ARG_POSITIONAL:
        return cli_usage_error(cmd, a->value, "unexpected argument");
    default: return CLI_USAGE;
    }
    if (parse && parse(a->value, num, why, sizeof why) != 0)
        return cli_usage_error(cmd, a->spelled, "%s", why);
    return CLI_OK;
}

/* -w: the mole fractions of the liquid from its mass fractions. */
static int mole_fractions(liq_run *r, const char *cmd)
{
    double M[LIQ_MAX], w[LIQ_MAX];
    size_t n = r->def.n;
    mcd_status st;
    int rc = liq_molar_masses(r, cmd, "-w/--mass-fractions", M);
    if (rc != CLI_OK)
        return rc;
    if ((st = mcd_comp_normalize(n, r->win, w)) != MCD_OK)
        return cli_fractions_error(cmd, "-w/--mass-fractions", st, r->win, n);
    if ((st = mcd_comp_w_to_x(n, M, w, r->x)) != MCD_OK)
        return cli_usage_error(cmd, "-w/--mass-fractions", "%s",
                               mcd_last_error());
    r->nx = n;
    return CLI_OK;
}

/* The definition: file, then the options in a fixed order. */
static int define(liq_run *r, liq_texts *t, const char *cmd)
{
    static const char *const lopt[3] = {"--volumes", "--uniquac-r",
                                        "--uniquac-q"};
    liq_def *d = &r->def;
    int rc;
    size_t k;
    if (d->file && (rc = liq_file_load(d, cmd, d->file)) != CLI_OK)
        return rc;
    if (t->species &&
        (rc = liq_def_species_option(d, cmd, "-s/--species", t->species)))
        return rc;
    if (r->nx == 0 && r->nw == 0)
        return cli_usage_error(cmd, "-x/--mole-fractions",
                               "a composition is required (or "
                               "-w/--mass-fractions)");
    if (d->n == 0) {
        d->n = r->mass_comp ? r->nw : r->nx;
        d->n_at = LIQ_FROM_CLI;
    }
    if ((r->mass_comp ? r->nw : r->nx) != d->n)
        return cli_usage_error(
            cmd, r->mass_comp ? "-w/--mass-fractions" : "-x/--mole-fractions",
            "has %zu values for %zu species", r->mass_comp ? r->nw : r->nx,
            d->n);
    if (isnan(r->T))
        return cli_usage_error(cmd, "-T/--temperature", "is required");
    if (t->model &&
        (rc = liq_def_model_option(d, cmd, t->model_opt, t->model)) != CLI_OK)
        return rc;
    if (d->model < 0) {
        if (d->file)
            return cli_usage_error(cmd, d->file,
                                   "no 'model' record (or give --model)");
        d->model = MCD_ACTIVITY_NRTL;
    }
    for (k = 0; k < 3; k++)
        if (t->list[k] && (rc = liq_def_species_list_option(
                               d, cmd, lopt[k], (int)k, t->list[k])) != CLI_OK)
            return rc;
    for (k = 0; k < t->npair; k++)
        if ((rc = liq_def_pair_option(d, cmd, t->pair[k])) != CLI_OK)
            return rc;
    for (k = 0; k < t->ndinf; k++)
        if ((rc = liq_def_dinf_option(d, cmd, t->dinf[k])) != CLI_OK)
            return rc;
    for (k = 0; k < t->nant; k++)
        if ((rc = liq_def_antoine_option(d, cmd, t->ant[k])) != CLI_OK)
            return rc;
    return r->mass_comp ? mole_fractions(r, cmd) : CLI_OK;
}

/* Options of one path given on another: a usage error naming them. */
static int unused(const char *cmd, int given, const char *opt,
                  const char *needs)
{
    if (!given)
        return CLI_OK;
    return cli_usage_error(cmd, opt, "not used here (only %s)", needs);
}

static int check_paths(const liq_run *r, const char *cmd)
{
    int rc, flux = r->n_dim > 0, evap = r->inert != NULL;
    if (r->json && r->csv)
        return cli_usage_error(cmd, "--csv",
                               "give either --json or --csv, not both");
    if (flux && evap)
        return cli_usage_error(cmd, "--evaporate",
                               "give either -g (fluxes) or --evaporate");
    if ((rc = unused(cmd, !flux && !isnan(r->conc), "--concentration",
                     "with -g")) ||
        (rc = unused(cmd, !flux && r->nVbar, "--partial-volumes", "with -g")) ||
        (rc = unused(cmd, !flux && r->basis >= 0, "--basis", "with -g")) ||
        (rc = unused(cmd, !flux && r->dependent, "--dependent", "with -g")) ||
        (rc = unused(cmd, !flux && !evap && !isnan(r->density), "--density",
                     "with -g or --evaporate")) ||
        (rc = unused(cmd, !evap && !isnan(r->P), "-P/--pressure",
                     "with --evaporate")) ||
        (rc = unused(cmd, !evap && !isnan(r->L), "-L/--length",
                     "with --evaporate")) ||
        (rc = unused(cmd, !evap && r->n_gas_pairs, "--gas-pair",
                     "with --evaporate")) ||
        (rc = unused(cmd, !evap && r->method, "-m/--method",
                     "with --evaporate")) ||
        (rc = unused(cmd, !evap && r->nxtop, "--xL", "with --evaporate")))
        return rc;
    return CLI_OK;
}

int cli_cmd_liquid(int argc, char **argv)
{
    const char *cmd = "liquid";
    cli_args a;
    liq_texts t;
    liq_run *r = calloc(1, sizeof *r);
    int id, rc = CLI_OK;
    if (!r)
        return cli_fail(cmd, "setting up", MCD_ENOMEM, NULL);
    memset(&t, 0, sizeof t);
    liq_def_init(&r->def);
    r->T = r->conc = r->density = r->P = r->L = (double)NAN;
    r->basis = -1;
    cli_args_init(&a, cmd, argc, argv, opts);
    while (rc == CLI_OK && (id = cli_args_next(&a)) != CLI_ARG_END)
        rc = option(r, &t, cmd, &a, id);
    if (rc == CLI_OK)
        rc = check_paths(r, cmd);
    if (rc == CLI_OK)
        rc = define(r, &t, cmd);
    if (rc == CLI_OK) {
        for (size_t i = 0; i < r->def.n; i++) {
            snprintf(r->num_names[i], sizeof r->num_names[i], "%zu", i + 1);
            r->name_ptr[i] = r->def.named ? r->def.names[i] : r->num_names[i];
        }
        cli_species_names(r->name_ptr, r->def.n);
        if (r->n_dim > 0)
            rc = liq_run_fluxes(r, cmd);
        else if (r->inert)
            rc = liq_run_evaporation(r, cmd);
        else
            rc = properties(r, cmd);
    }
    free(r);
    return rc < 0 ? CLI_OK : rc;
}
