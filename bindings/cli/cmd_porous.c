/* cmd_porous.c - `mcdiff porous`: total molar fluxes of a gas mixture in
 * a porous medium by the Dusty Gas Model (mcd_dgm_fluxes), or with the
 * total flux given and the pressure gradient unknown (mcd_dgm_closed),
 * with the mixture viscosity from Chapman-Enskog and Wilke's rule or the
 * caller's value.
 */
#include <math.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>
#include "cli.h"

#define CAUTION_POROUS_SHORT                                                   \
    "Note: pore-structure parameters are usually fitted; these fluxes are "    \
    "design estimates, not a substitute for measured data, local codes or "    \
    "licensed engineering review (hazardous gases above all)."
#define CAUTION_POROUS_LONG                                                    \
    "Porosity, tortuosity, pore diameter and permeability are usually "        \
    "fitted to measurements of the medium; the fluxes rest on them and on "    \
    "estimated diffusivities and viscosities with the typical errors "         \
    "listed. They are estimates for design studies and do not replace "        \
    "measured data, local codes and licensed engineering review, least of "    \
    "all for equipment handling hazardous gases."

static void help(FILE *f)
{
    fputs(
        "usage: mcdiff porous -s A,B,C -x XA,XB,XC -g GA,GB,GC [-g ...]\n"
        "                     -T TEMP -P PRES --porosity E --tortuosity TAU\n"
        "                     --pore-diameter LEN [options]\n"
        "\n"
        "Total molar fluxes N_i [mol/(m^2 s)] (per unit cross-section of the\n"
        "medium) of an isothermal ideal gas in a porous medium by the Dusty\n"
        "Gas Model: molecular diffusion, Knudsen diffusion and viscous\n"
        "(Darcy) flow, with D^e = (porosity/tortuosity) D. Without\n"
        "--grad-p the pressure is uniform and the total flux follows from\n"
        "the model (Graham's law); with --closed or --total-flux the total\n"
        "flux is given and the pressure gradient is computed.\n"
        "The pore-structure parameters are usually FITTED to measurements\n"
        "of the medium; the results are estimates for design studies.\n"
        "\n"
        "options (lists are comma-separated, one value per species, in the\n"
        "order of -s):\n"
        "  -s, --species LIST        species names or formulas (2 or more)\n"
        "  -x, --mole-fractions LIST mole fractions [-], sum 1\n"
        "  -g, --gradient LIST       mole-fraction gradients [1/m]; repeat\n"
        "                            once per direction (1 to 3)\n"
        "  -T, --temperature TEMP    K or C suffix, bare = K\n"
        "  -P, --pressure PRES       Pa, kPa, MPa, bar or atm, bare = Pa\n"
        "  --porosity E              void fraction [-], in (0, 1]\n"
        "  --tortuosity TAU          tortuosity factor [-], >= 1\n"
        "  --pore-diameter LEN       mean pore diameter; m, mm, um or nm\n"
        "                            suffix, bare = m\n"
        "  --permeability B0         permeability [m^2] (default: from the\n"
        "                            pore diameter, (E/TAU) d^2/32)\n"
        "  --grad-p LIST             pressure gradient [Pa/m], one value per\n"
        "                            direction (default 0: uniform pressure)\n"
        "  --closed                  closed end: total flux 0, pressure\n"
        "                            gradient computed\n"
        "  --total-flux LIST         total flux [mol/(m^2 s)] per direction,\n"
        "                            pressure gradient computed\n"
        "  --viscosity MU            mixture viscosity; Pa.s, mPa.s or cP\n"
        "                            suffix, bare = Pa s (default:\n"
        "                            Chapman-Enskog species values and\n"
        "                            Wilke's rule)\n"
        "  -m, --method NAME         estimate of the binary diffusivities:\n"
        "                            fsg (default), chapman-enskog, wilke-lee\n"
        "  --pair A:B=D[@T,P]        binary diffusivity of a pair [m^2/s, or\n"
        "                            cm2/s suffix], as for 'mcdiff fluxes'\n"
        "  --json                    one JSON object (SI): fluxes under\n"
        "                            \"fluxes\", \"grad_P\", \"viscosity\"\n"
        "  --csv                     the flux table as CSV: header row\n"
        "                            species,x,dx_dz1_per_m,...,\n"
        "                            N_1_mol_per_m2_s,...,DKe_m2_per_s\n"
        "                            (SI; the caution goes to stderr)\n"
        "  --species-file FILE       also load species from FILE\n"
        "  -h, --help                this text\n"
        "\n"
        "example:\n"
        "  mcdiff porous -s H2,N2 -x 0.5,0.5 -g -100,100 -T 300 -P 1atm \\\n"
        "      --porosity 0.4 --tortuosity 3 --pore-diameter 100nm\n",
        f);
}

enum {
    O_X = 1,
    O_GRAD,
    O_EPS,
    O_TAU,
    O_DP,
    O_B0,
    O_GP,
    O_CLOSED,
    O_TOTAL,
    O_MU
};

static const cli_opt porous_opts[] = {
    CLI_MIXTURE_OPTIONS,          {"mole-fractions", 'x', 1, O_X},
    {"gradient", 'g', 1, O_GRAD}, {"porosity", 0, 1, O_EPS},
    {"tortuosity", 0, 1, O_TAU},  {"pore-diameter", 0, 1, O_DP},
    {"permeability", 0, 1, O_B0}, {"grad-p", 0, 1, O_GP},
    {"closed", 0, 0, O_CLOSED},   {"total-flux", 0, 1, O_TOTAL},
    {"viscosity", 0, 1, O_MU},    {NULL, 0, 0, 0}};

typedef struct porous_job {
    cli_state s;
    double xin[MCD_MAX_SPECIES];
    size_t nx;
    double rows[MCD_MAX_DIM][MCD_MAX_SPECIES];
    size_t nrow[MCD_MAX_DIM];
    mcd_pore pore;
    int have_eps, have_tau, have_dp;
    double gP[MCD_MAX_DIM], Nt[MCD_MAX_DIM];
    size_t ngP, nNt;
    int have_gP, closed; /* closed: --closed or --total-flux */
    double mu;           /* NaN: estimate */
    /* results */
    double *N, *DK, B0, mu_used, mu_err;
    int mu_estimated;
    unsigned mu_warn;
} porous_job;

/* Pore diameter: bare = m; suffixes m, mm, um, nm. > 0. */
static int parse_pore_length(const char *text, double *out, char *why,
                             size_t whylen)
{
    static const struct {
        const char *suf;
        double f;
    } units[] = {{"nm", 1e-9}, {"um", 1e-6}, {"mm", 1e-3}, {"m", 1.0}};
    size_t len = strlen(text), k;
    char num[64];
    for (k = 0; k < sizeof units / sizeof units[0]; k++) {
        size_t ls = strlen(units[k].suf);
        if (len > ls && strcmp(text + len - ls, units[k].suf) == 0 &&
            len - ls < sizeof num) {
            memcpy(num, text, len - ls);
            num[len - ls] = '\0';
            if (cli_parse_number(num, out, why, whylen) != 0)
                return -1;
            *out *= units[k].f;
            goto check;
        }
    }
    if (cli_parse_number(text, out, why, whylen) != 0)
        return -1;
check:
    if (!(*out > 0)) {
        snprintf(why, whylen, "'%s' is not > 0", text);
        return -1;
    }
    return 0;
}

/* One option of the command's own (not the shared mixture options). */
static int own_option(porous_job *pj, const char *cmd, const cli_args *a,
                      int id)
{
    char why[200];
    switch (id) {
    case O_X:
        if (pj->nx)
            return cli_usage_error(cmd, a->spelled, "given twice");
        if (cli_parse_list(a->value, pj->xin, MCD_MAX_SPECIES, &pj->nx, why,
                           sizeof why) != 0)
            return cli_usage_error(cmd, a->spelled, "%s", why);
        return CLI_OK;
    case O_GRAD:
        if (pj->s.n_dim >= MCD_MAX_DIM)
            return cli_usage_error(cmd, a->spelled, "at most %d directions",
                                   MCD_MAX_DIM);
        if (cli_parse_list(a->value, pj->rows[pj->s.n_dim], MCD_MAX_SPECIES,
                           &pj->nrow[pj->s.n_dim], why, sizeof why) != 0)
            return cli_usage_error(cmd, a->spelled, "%s", why);
        pj->s.n_dim++;
        return CLI_OK;
    case O_EPS:
    case O_TAU:
    case O_B0: {
        double v;
        if (cli_parse_number(a->value, &v, why, sizeof why) != 0)
            return cli_usage_error(cmd, a->spelled, "%s", why);
        if (id == O_EPS && !(v > 0 && v <= 1))
            return cli_usage_error(cmd, a->spelled, "%g is not in (0, 1]", v);
        if (id == O_TAU && !(v >= 1))
            return cli_usage_error(cmd, a->spelled, "%g is not >= 1", v);
        if (id == O_B0 && !(v > 0))
            return cli_usage_error(cmd, a->spelled, "%g is not > 0 [m^2]", v);
        if (id == O_EPS) {
            pj->pore.porosity = v;
            pj->have_eps = 1;
        } else if (id == O_TAU) {
            pj->pore.tortuosity = v;
            pj->have_tau = 1;
        } else {
            pj->pore.permeability = v;
        }
        return CLI_OK;
    }
    case O_DP:
        if (parse_pore_length(a->value, &pj->pore.d_pore, why, sizeof why))
            return cli_usage_error(cmd, a->spelled, "%s", why);
        pj->have_dp = 1;
        return CLI_OK;
    case O_GP:
    case O_TOTAL:
        if (cli_parse_list(a->value, id == O_GP ? pj->gP : pj->Nt, MCD_MAX_DIM,
                           id == O_GP ? &pj->ngP : &pj->nNt, why,
                           sizeof why) != 0)
            return cli_usage_error(cmd, a->spelled, "%s", why);
        if (id == O_GP)
            pj->have_gP = 1;
        else
            pj->closed = 2;
        return CLI_OK;
    case O_CLOSED: pj->closed = pj->closed ? pj->closed : 1; return CLI_OK;
    case O_MU:
        if (cli_parse_viscosity(a->value, &pj->mu, why, sizeof why) != 0)
            return cli_usage_error(cmd, a->spelled, "%s", why);
        return CLI_OK;
    }
    return CLI_USAGE;
}

/* The requirements between options, after the scan. */
static int check_options(porous_job *pj, const char *cmd)
{
    cli_state *s = &pj->s;
    size_t k;
    int rc;
    if ((rc = cli_state_require(s, cmd)) != CLI_OK)
        return rc;
    if (pj->nx == 0)
        return cli_usage_error(cmd, "-x/--mole-fractions", "is required");
    if (pj->nx != s->n)
        return cli_usage_error(cmd, "-x/--mole-fractions",
                               "has %zu values for %zu species", pj->nx, s->n);
    if (s->n_dim == 0)
        return cli_usage_error(cmd, "-g/--gradient",
                               "is required (once per direction)");
    for (k = 0; k < s->n_dim; k++)
        if (pj->nrow[k] != s->n)
            return cli_usage_error(cmd, "-g/--gradient",
                                   "direction %zu has %zu values for %zu "
                                   "species",
                                   k + 1, pj->nrow[k], s->n);
    if (!pj->have_eps)
        return cli_usage_error(cmd, "--porosity", "is required");
    if (!pj->have_tau)
        return cli_usage_error(cmd, "--tortuosity", "is required");
    if (!pj->have_dp)
        return cli_usage_error(cmd, "--pore-diameter", "is required");
    if (pj->have_gP && pj->closed)
        return cli_usage_error(cmd, "--grad-p",
                               "is computed with --closed or --total-flux; "
                               "give one or the other");
    if (pj->have_gP && pj->ngP != s->n_dim)
        return cli_usage_error(cmd, "--grad-p",
                               "has %zu values for %zu directions", pj->ngP,
                               s->n_dim);
    if (pj->closed == 2 && pj->nNt != s->n_dim)
        return cli_usage_error(cmd, "--total-flux",
                               "has %zu values for %zu directions", pj->nNt,
                               s->n_dim);
    return CLI_OK;
}

static int parse(porous_job *pj, const char *cmd, int argc, char **argv)
{
    cli_args a;
    int id, rc;
    cli_state_defaults(&pj->s);
    pj->mu = NAN;
    cli_args_init(&a, cmd, argc, argv, porous_opts);
    while ((id = cli_args_next(&a)) != CLI_ARG_END) {
        if (id >= CLI_O_SPECIES && id != CLI_O_HELP)
            rc = cli_state_option(&pj->s, cmd, &a, id);
        else if (id == CLI_ARG_ERROR)
            return CLI_USAGE;
        else if (id == CLI_O_HELP) {
            help(stdout);
            return -1;
        } else if (id == CLI_ARG_POSITIONAL)
            return cli_usage_error(cmd, a.value,
                                   "unexpected argument (options only; see "
                                   "--help)");
        else
            rc = own_option(pj, cmd, &a, id);
        if (rc != CLI_OK)
            return rc;
    }
    return check_options(pj, cmd);
}

/* Mixture viscosity: the caller's, or Chapman-Enskog species values and
 * Wilke's rule. */
static int viscosity(porous_job *pj, const char *cmd)
{
    cli_state *s = &pj->s;
    double *mus;
    mcd_status st;
    if (!isnan(pj->mu)) {
        pj->mu_used = pj->mu;
        pj->mu_err = NAN;
        return CLI_OK;
    }
    mus = malloc(s->n * sizeof *mus);
    if (!mus)
        return cli_fail(cmd, "setting up", MCD_ENOMEM, NULL);
    st = mcd_mixture_viscosities(s->mix, s->T, mus, &pj->mu_warn);
    if (st == MCD_OK)
        st = mcd_viscosity_wilke(s->n, s->M, mus, s->x, &pj->mu_used);
    free(mus);
    if (st != MCD_OK) {
        char err[300];
        snprintf(err, sizeof err, "%s (give --viscosity)", mcd_last_error());
        return cli_fail(cmd, "estimating the viscosity", st, err);
    }
    pj->mu_estimated = 1;
    pj->mu_err = MCD_VISC_CE_TYPICAL_ERROR + MCD_VISC_WILKE_TYPICAL_ERROR;
    return CLI_OK;
}

/* A library failure: out-of-range pore or state input names its option
 * (exit 2); anything else is a failed computation (exit 1). */
static int dgm_failed(const char *cmd, mcd_status st)
{
    const char *d = mcd_last_error();
    static const struct {
        const char *word, *opt;
    } map[] = {{"porosity", "--porosity"},
               {"tortuosity", "--tortuosity"},
               {"d_pore", "--pore-diameter"},
               {"permeability", "--permeability"},
               {"argument mu", "--viscosity"}};
    size_t k;
    if (st == MCD_EDOM || st == MCD_EINVAL)
        for (k = 0; k < sizeof map / sizeof map[0]; k++)
            if (strstr(d, map[k].word))
                return cli_usage_error(cmd, map[k].opt, "%s: %s",
                                       mcd_status_string((int)st), d);
    return cli_fail(cmd, "the Dusty Gas Model", st, d);
}

static int compute(porous_job *pj, const char *cmd)
{
    cli_state *s = &pj->s;
    size_t n = s->n, i;
    mcd_status st;
    mcd_dgm g;
    int rc;
    if ((rc = viscosity(pj, cmd)) != CLI_OK)
        return rc;
    pj->N = malloc(n * s->n_dim * sizeof *pj->N);
    pj->DK = malloc(n * sizeof *pj->DK);
    if (!pj->N || !pj->DK)
        return cli_fail(cmd, "setting up", MCD_ENOMEM, NULL);
    st = mcd_pore_permeability(&pj->pore, &pj->B0);
    for (i = 0; i < n && st == MCD_OK; i++) {
        double dk;
        st = mcd_knudsen_diffusivity(s->T, s->M[i], pj->pore.d_pore, &dk);
        if (st == MCD_OK)
            st = mcd_pore_effective(&pj->pore, dk, &pj->DK[i]);
    }
    if (st != MCD_OK)
        return dgm_failed(cmd, st);
    g = (mcd_dgm){.n_species = n,
                  .n_dim = s->n_dim,
                  .T = s->T,
                  .P = s->P,
                  .mu = pj->mu_used,
                  .M = s->M,
                  .Dij = s->Dij,
                  .x = s->x,
                  .grad_x = s->grad,
                  .grad_P = pj->have_gP ? pj->gP : NULL};
    if (pj->closed)
        st = mcd_dgm_closed(s->ws, &pj->pore, &g, pj->Nt, pj->N, pj->gP);
    else
        st = mcd_dgm_fluxes(s->ws, &pj->pore, &g, pj->N);
    if (st != MCD_OK)
        return dgm_failed(cmd, st);
    return CLI_OK;
}

static void print_csv(const porous_job *pj)
{
    const cli_state *s = &pj->s;
    cli_csv c;
    size_t i, k;
    char name[64];
    cli_csv_init(&c, stdout);
    cli_csv_text(&c, "species");
    cli_csv_text(&c, "x");
    for (k = 0; k < s->n_dim; k++) {
        snprintf(name, sizeof name, "dx_dz%zu_per_m", k + 1);
        cli_csv_text(&c, name);
    }
    for (k = 0; k < s->n_dim; k++) {
        snprintf(name, sizeof name, "N_%zu_mol_per_m2_s", k + 1);
        cli_csv_text(&c, name);
    }
    cli_csv_text(&c, "DKe_m2_per_s");
    cli_csv_end_row(&c);
    for (i = 0; i < s->n; i++) {
        cli_csv_text(&c, s->names[i]);
        cli_csv_number(&c, s->x[i]);
        for (k = 0; k < s->n_dim; k++)
            cli_csv_number(&c, s->grad[i * s->n_dim + k]);
        for (k = 0; k < s->n_dim; k++)
            cli_csv_number(&c, pj->N[i * s->n_dim + k]);
        cli_csv_number(&c, pj->DK[i]);
        cli_csv_end_row(&c);
    }
}

static void print_json(const porous_job *pj)
{
    const cli_state *s = &pj->s;
    cli_json j;
    size_t i;
    cli_json_init(&j, stdout);
    cli_json_object_begin(&j, NULL);
    cli_state_json_header(s, &j);
    cli_json_object_begin(&j, "pore");
    cli_json_number(&j, "porosity", pj->pore.porosity);
    cli_json_number(&j, "tortuosity", pj->pore.tortuosity);
    cli_json_number(&j, "d_pore", pj->pore.d_pore);
    cli_json_number(&j, "permeability", pj->B0);
    cli_json_bool(&j, "permeability_given", pj->pore.permeability > 0);
    cli_json_object_end(&j);
    cli_json_number(&j, "viscosity", pj->mu_used);
    cli_json_string(&j, "viscosity_source",
                    pj->mu_estimated ? "chapman-enskog + wilke" : "user");
    if (pj->mu_estimated)
        cli_json_number(&j, "viscosity_typical_error", pj->mu_err);
    cli_json_string(&j, "mode",
                    pj->closed ? "total flux given" : "gradients given");
    if (pj->closed)
        cli_json_numbers(&j, "total_flux", pj->Nt, s->n_dim);
    cli_json_numbers(&j, "grad_P", pj->gP, s->n_dim);
    cli_json_array_begin(&j, "gradients");
    for (i = 0; i < s->n; i++)
        cli_json_numbers(&j, NULL, s->grad + i * s->n_dim, s->n_dim);
    cli_json_array_end(&j);
    cli_json_numbers(&j, "knudsen_effective", pj->DK, s->n);
    cli_state_json_binaries(s, &j);
    cli_json_array_begin(&j, "fluxes");
    for (i = 0; i < s->n; i++)
        cli_json_numbers(&j, NULL, pj->N + i * s->n_dim, s->n_dim);
    cli_json_array_end(&j);
    cli_json_string(&j, "caution", CAUTION_POROUS_LONG);
    cli_json_object_end(&j);
    cli_json_finish(&j);
}

static void print_text(const porous_job *pj)
{
    const cli_state *s = &pj->s;
    size_t i, k;
    printf("%zu species at T = %.6g K, P = %.6g Pa, c = %.5g mol/m^3 "
           "(ideal gas)\n",
           s->n, s->T, s->P, s->c);
    printf("pore structure: porosity %.4g, tortuosity %.4g, pore diameter "
           "%.4g m, permeability %.4g m^2%s\n",
           pj->pore.porosity, pj->pore.tortuosity, pj->pore.d_pore, pj->B0,
           pj->pore.permeability > 0 ? "" : " (from the pore diameter)");
    if (pj->mu_estimated)
        printf("mixture viscosity %.5g Pa s (Chapman-Enskog + Wilke, typical "
               "error %.1f %%)\n",
               pj->mu_used, 100 * pj->mu_err);
    else
        printf("mixture viscosity %.5g Pa s (given)\n", pj->mu_used);
    printf("binary diffusivities (open gas):\n");
    cli_state_print_binaries(s, stdout);
    printf("pressure gradient [Pa/m]:");
    for (k = 0; k < s->n_dim; k++)
        printf(" %.6g", pj->have_gP || pj->closed ? pj->gP[k] : 0.0);
    printf("%s\n", pj->closed ? " (computed: total flux given)" : "");
    printf("Dusty Gas Model total fluxes N [mol/(m^2 s)] per direction, "
           "effective Knudsen diffusivity D_K^e [m^2/s]:\n");
    for (i = 0; i < s->n; i++) {
        printf("  %-16s x %-10.4g", s->names[i], s->x[i]);
        for (k = 0; k < s->n_dim; k++)
            printf(" N%zu %-12.5g", k + 1, pj->N[i * s->n_dim + k]);
        printf(" D_K^e %.4g\n", pj->DK[i]);
    }
    printf("%s\n", CAUTION_POROUS_SHORT);
}

int cli_cmd_porous(int argc, char **argv)
{
    const char *cmd = "porous";
    porous_job *pj = calloc(1, sizeof *pj);
    cli_state *s;
    size_t i, k;
    int rc;
    if (!pj)
        return cli_fail(cmd, "setting up", MCD_ENOMEM, NULL);
    s = &pj->s;
    rc = parse(pj, cmd, argc, argv);
    if (rc != CLI_OK) {
        rc = rc < 0 ? CLI_OK : rc;
        goto done;
    }
    s->comp = malloc(s->n * sizeof *s->comp);
    s->grad = malloc(s->n * s->n_dim * sizeof *s->grad);
    if (!s->comp || !s->grad) {
        rc = cli_fail(cmd, "setting up", MCD_ENOMEM, NULL);
        goto done;
    }
    memcpy(s->comp, pj->xin, s->n * sizeof *s->comp);
    for (i = 0; i < s->n; i++)
        for (k = 0; k < s->n_dim; k++)
            s->grad[i * s->n_dim + k] = pj->rows[k][i];
    s->comp_basis = MCD_BASIS_MOLE;
    s->comp_opt = "-x/--mole-fractions";
    if ((rc = cli_state_setup(s, cmd)) != CLI_OK ||
        (rc = compute(pj, cmd)) != CLI_OK)
        goto done;
    if (s->csv) {
        print_csv(pj);
        fprintf(stderr, "%s\n", CAUTION_POROUS_SHORT);
    } else if (s->json) {
        print_json(pj);
    } else {
        print_text(pj);
    }
    rc = CLI_OK;
done:
    free(pj->N);
    free(pj->DK);
    cli_state_free(s);
    free(pj);
    return rc;
}
