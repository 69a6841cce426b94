/* cmd_porous.c - `mcdiff porous`: total molar fluxes of a gas mixture in
 * a porous medium by the Dusty Gas Model (mcd_dgm_fluxes), or with the
 * total flux given and the pressure gradient unknown (mcd_dgm_closed),
 * with the mixture viscosity from Chapman-Enskog and Wilke's rule or the
 * caller's value; `mcdiff porous slab`: steady fluxes through a porous
 * slab between two gas states (mcd_slab_solve, mcd_slab_solve_ratios)
 * and its profile (mcd_slab_profile).
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
        "                            Wilke's rule)\n" CLI_METHOD_HELP
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
    O_MU,
    /* slab */
    O_X0,
    O_XL,
    O_LEN,
    O_PL,
    O_STAG,
    O_RATIOS,
    O_MATCH,
    O_PROFILE,
    O_POINTS
};

static const cli_opt porous_opts[] = {
    CLI_MIXTURE_OPTIONS,          {"mole-fractions", 'x', 1, O_X},
    {"gradient", 'g', 1, O_GRAD}, {"porosity", 0, 1, O_EPS},
    {"tortuosity", 0, 1, O_TAU},  {"pore-diameter", 0, 1, O_DP},
    {"permeability", 0, 1, O_B0}, {"grad-p", 0, 1, O_GP},
    {"closed", 0, 0, O_CLOSED},   {"total-flux", 0, 1, O_TOTAL},
    {"viscosity", 0, 1, O_MU},    {NULL, 0, 0, 0}};

static const cli_opt slab_opts[] = {CLI_MIXTURE_OPTIONS,
                                    {"x0", 0, 1, O_X0},
                                    {"xL", 0, 1, O_XL},
                                    {"xl", 0, 1, O_XL},
                                    {"length", 'L', 1, O_LEN},
                                    {"porosity", 0, 1, O_EPS},
                                    {"tortuosity", 0, 1, O_TAU},
                                    {"pore-diameter", 0, 1, O_DP},
                                    {"permeability", 0, 1, O_B0},
                                    {"pL", 0, 1, O_PL},
                                    {"pl", 0, 1, O_PL},
                                    {"stagnant", 0, 1, O_STAG},
                                    {"total-flux", 0, 1, O_TOTAL},
                                    {"ratios", 0, 1, O_RATIOS},
                                    {"match", 0, 1, O_MATCH},
                                    {"viscosity", 0, 1, O_MU},
                                    {"profile", 0, 0, O_PROFILE},
                                    {"points", 0, 1, O_POINTS},
                                    {NULL, 0, 0, 0}};

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
    /* slab: end compositions, thickness, far pressure, bootstrap */
    int slab, profile;
    double x0in[MCD_MAX_SPECIES], xLin[MCD_MAX_SPECIES], xL[MCD_MAX_SPECIES];
    double xmean[MCD_MAX_SPECIES], ratios[MCD_MAX_SPECIES];
    size_t nx0, nxL, nratios, points, its;
    double L, PL;
    const char *boot_opt, *species_name; /* --stagnant / --match */
    const char *match;                   /* --match as given */
    mcd_slab_kind kind;
    size_t species;
    /* results */
    double *N, *DK, B0, mu_used, mu_err, PL_out;
    double *zp, *xp, *Pp; /* slab profile */
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

/* The slab's end states and bootstrap (mcdiff porous slab). */
static int slab_option(porous_job *pj, const char *cmd, const cli_args *a,
                       int id)
{
    char why[200];
    double v;
    switch (id) {
    case O_X0:
    case O_XL:
        if ((id == O_X0 && pj->nx0) || (id == O_XL && pj->nxL))
            return cli_usage_error(cmd, a->spelled, "given twice");
        if (cli_parse_list(a->value, id == O_X0 ? pj->x0in : pj->xLin,
                           MCD_MAX_SPECIES, id == O_X0 ? &pj->nx0 : &pj->nxL,
                           why, sizeof why) != 0)
            return cli_usage_error(cmd, a->spelled, "%s", why);
        return CLI_OK;
    case O_LEN:
        if (cli_parse_length(a->value, &pj->L, why, sizeof why) != 0)
            return cli_usage_error(cmd, a->spelled, "%s", why);
        return CLI_OK;
    case O_PL:
    case O_STAG:
    case O_RATIOS:
        if (pj->boot_opt)
            return cli_usage_error(cmd, a->spelled,
                                   "give exactly one of --pL, --stagnant, "
                                   "--total-flux and --ratios");
        pj->boot_opt = a->spelled;
        if (id == O_PL) {
            pj->kind = MCD_SLAB_PRESSURES;
            if (cli_parse_pressure(a->value, &pj->PL, why, sizeof why) != 0)
                return cli_usage_error(cmd, a->spelled, "%s", why);
        } else if (id == O_STAG) {
            pj->kind = MCD_SLAB_STAGNANT;
            pj->species_name = a->value;
        } else if (cli_parse_list(a->value, pj->ratios, MCD_MAX_SPECIES,
                                  &pj->nratios, why, sizeof why) != 0)
            return cli_usage_error(cmd, a->spelled, "%s", why);
        return CLI_OK;
    case O_MATCH: pj->match = a->value; return CLI_OK;
    case O_PROFILE: pj->profile = 1; return CLI_OK;
    case O_POINTS:
        if (cli_parse_number(a->value, &v, why, sizeof why) != 0 ||
            v != floor(v) || v < 2 || v > 100000)
            return cli_usage_error(cmd, a->spelled,
                                   "'%s' is not a whole number in 2..100000",
                                   a->value);
        pj->points = (size_t)v;
        return CLI_OK;
    }
    return CLI_USAGE;
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
    return slab_option(pj, cmd, a, id);
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

static void slab_help(FILE *f)
{
    fputs(
        "usage: mcdiff porous slab -s A,B,C --x0 LIST --xL LIST -L LEN\n"
        "                          -T TEMP -P PRES --porosity E\n"
        "                          --tortuosity TAU --pore-diameter LEN\n"
        "                          CONDITION [options]\n"
        "\n"
        "Steady total molar fluxes N_i [mol/(m^2 s)] (per unit cross-section\n"
        "of the medium, positive towards z = L) through an isothermal porous\n"
        "slab of thickness L between the gas state x0 at pressure P (z = 0)\n"
        "and xL (z = L), by the Dusty Gas Model: a converged numerical\n"
        "solution of the boundary-value problem. The binary diffusivities\n"
        "are estimated at P and scale as 1/pressure along the slab; the\n"
        "mixture viscosity is taken constant at the mean composition.\n"
        "The pore-structure parameters are usually FITTED to measurements\n"
        "of the medium; the results are estimates for design studies.\n"
        "\n"
        "condition (exactly one):\n"
        "  --pL PRES                 pressure at z = L (both ends given)\n"
        "  --stagnant NAME           species NAME does not move; the\n"
        "                            pressure at z = L is a result\n"
        "  --total-flux N            sum of the fluxes [mol/(m^2 s)]; the\n"
        "                            pressure at z = L is a result\n"
        "  --ratios LIST --match NAME  N_i = z_i N_t with flux ratios z [-]\n"
        "                            (sum 1; e.g. a reaction's\n"
        "                            stoichiometry); only xL of NAME is\n"
        "                            matched, the other end values and the\n"
        "                            pressure at z = L are results\n"
        "\n"
        "options (lists are comma-separated, one value per species, in the\n"
        "order of -s):\n"
        "  -s, --species LIST        species names or formulas (2 or more)\n"
        "  --x0 LIST, --xL LIST      mole fractions at z = 0 and z = L, sum 1\n"
        "  -L, --length LEN          slab thickness; m, cm or mm suffix,\n"
        "                            bare = m\n"
        "  -T, --temperature TEMP    K or C suffix, bare = K\n"
        "  -P, --pressure PRES       pressure at z = 0; Pa, kPa, MPa, bar or\n"
        "                            atm, bare = Pa\n"
        "  --porosity E, --tortuosity TAU, --pore-diameter LEN,\n"
        "  --permeability B0, --viscosity MU, -m, --method NAME,\n"
        "  --pair A:B=D[@T,P], --species-file FILE\n"
        "                            as for 'mcdiff porous'\n"
        "  --profile                 print the profile instead: CSV with\n"
        "                            z_m, x_<species>... and P_Pa\n"
        "  --points N                points of the profile, 2 to 100000\n"
        "                            (default 11)\n"
        "  --json                    one JSON object (SI): \"fluxes\",\n"
        "                            \"PL\", \"xL_solved\"; with --profile\n"
        "                            also \"profile\"\n"
        "  --csv                     the flux table as CSV: species,x0,xL,\n"
        "                            xL_solved,N_mol_per_m2_s (SI; the "
        "caution\n"
        "                            goes to stderr)\n"
        "  -h, --help                this text\n"
        "\n"
        "example (hydrogen and nitrogen through a porous disc, nitrogen\n"
        "stagnant):\n"
        "  mcdiff porous slab -s H2,N2 --x0 0.8,0.2 --xL 0.1,0.9 -L 2mm \\\n"
        "      -T 300 -P 1atm --porosity 0.4 --tortuosity 3 \\\n"
        "      --pore-diameter 100nm --stagnant N2\n",
        f);
}

/* The requirements between the slab's options, after the scan. */
static int slab_check_options(porous_job *pj, const char *cmd)
{
    cli_state *s = &pj->s;
    int rc;
    if ((rc = cli_state_require(s, cmd)) != CLI_OK)
        return rc;
    if (pj->nx0 == 0 || pj->nxL == 0)
        return cli_usage_error(cmd, pj->nx0 ? "--xL" : "--x0", "is required");
    if (pj->nx0 != s->n || pj->nxL != s->n)
        return cli_usage_error(cmd, pj->nx0 != s->n ? "--x0" : "--xL",
                               "has %zu values for %zu species",
                               pj->nx0 != s->n ? pj->nx0 : pj->nxL, s->n);
    if (!(pj->L > 0))
        return cli_usage_error(cmd, "-L/--length", "is required");
    if (!pj->have_eps || !pj->have_tau || !pj->have_dp)
        return cli_usage_error(cmd,
                               !pj->have_eps   ? "--porosity"
                               : !pj->have_tau ? "--tortuosity"
                                               : "--pore-diameter",
                               "is required");
    if (pj->closed == 2 && pj->boot_opt)
        return cli_usage_error(cmd, "--total-flux",
                               "give exactly one of --pL, --stagnant, "
                               "--total-flux and --ratios");
    if (pj->closed == 2) {
        if (pj->nNt != 1)
            return cli_usage_error(cmd, "--total-flux",
                                   "takes one value for a slab");
        pj->kind = MCD_SLAB_TOTAL;
        pj->boot_opt = "--total-flux";
    }
    if (!pj->boot_opt)
        return cli_usage_error(cmd, "--pL",
                               "a condition is required: --pL PRES, "
                               "--stagnant NAME, --total-flux N or --ratios "
                               "LIST with --match NAME");
    if (pj->nratios && pj->nratios != s->n)
        return cli_usage_error(cmd, "--ratios",
                               "has %zu values for %zu species", pj->nratios,
                               s->n);
    if (pj->nratios && !pj->match)
        return cli_usage_error(cmd, "--match",
                               "is required with --ratios (the species "
                               "whose xL is matched)");
    if (!pj->nratios && pj->match)
        return cli_usage_error(cmd, "--match", "is only used with --ratios");
    if (pj->nratios)
        pj->species_name = pj->match;
    if (pj->points && !pj->profile)
        return cli_usage_error(cmd, "--points", "is only used with --profile");
    return CLI_OK;
}

/* The options of `porous` (opts porous_opts, then check_options) or of
 * `porous slab` (slab_opts, slab_check_options). */
static int parse(porous_job *pj, const char *cmd, int argc, char **argv,
                 int slab)
{
    cli_args a;
    int id, rc;
    cli_state_defaults(&pj->s);
    pj->mu = (double)NAN;
    cli_args_init(&a, cmd, argc, argv, slab ? slab_opts : porous_opts);
    while ((id = cli_args_next(&a)) != CLI_ARG_END) {
        if (id >= CLI_O_SPECIES && id != CLI_O_HELP)
            rc = cli_state_option(&pj->s, cmd, &a, id);
        else if (id == CLI_ARG_ERROR)
            return CLI_USAGE;
        else if (id == CLI_O_HELP) {
            (slab ? slab_help : help)(stdout);
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
    return slab ? slab_check_options(pj, cmd) : check_options(pj, cmd);
}

/* Mixture viscosity at composition x: the caller's, or Chapman-Enskog
 * species values and Wilke's rule. */
static int viscosity(porous_job *pj, const char *cmd, const double *x)
{
    cli_state *s = &pj->s;
    double *mus;
    mcd_status st;
    if (!isnan(pj->mu)) {
        pj->mu_used = pj->mu;
        pj->mu_err = (double)NAN;
        return CLI_OK;
    }
    mus = malloc(s->n * sizeof *mus);
    if (!mus)
        return cli_fail(cmd, "setting up", MCD_ENOMEM, NULL);
    st = mcd_mixture_viscosities(s->mix, s->T, mus, &pj->mu_warn);
    if (st == MCD_OK)
        st = mcd_viscosity_wilke(s->n, s->M, mus, x, &pj->mu_used);
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
    if ((rc = viscosity(pj, cmd, s->x)) != CLI_OK)
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

/* The pore structure and the viscosity, as JSON members. */
static void json_pore(const porous_job *pj, cli_json *j)
{
    cli_json_object_begin(j, "pore");
    cli_json_number(j, "porosity", pj->pore.porosity);
    cli_json_number(j, "tortuosity", pj->pore.tortuosity);
    cli_json_number(j, "d_pore", pj->pore.d_pore);
    cli_json_number(j, "permeability", pj->B0);
    cli_json_bool(j, "permeability_given", pj->pore.permeability > 0);
    cli_json_object_end(j);
    cli_json_number(j, "viscosity", pj->mu_used);
    cli_json_string(j, "viscosity_source",
                    pj->mu_estimated ? "chapman-enskog + wilke" : "user");
    if (pj->mu_estimated)
        cli_json_number(j, "viscosity_typical_error", pj->mu_err);
}

static void print_json(const porous_job *pj)
{
    const cli_state *s = &pj->s;
    cli_json j;
    size_t i;
    cli_json_init(&j, stdout);
    cli_json_object_begin(&j, NULL);
    cli_state_json_header(s, &j);
    json_pore(pj, &j);
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

/* ------------------------------------------------------------------ */
/* mcdiff porous slab                                                  */
/* ------------------------------------------------------------------ */

/* After the state's setup: xL checked, the named species found, the mean
 * composition for the viscosity. */
static int slab_prepare(porous_job *pj, const char *cmd)
{
    cli_state *s = &pj->s;
    size_t i;
    mcd_status st = mcd_comp_normalize(s->n, pj->xLin, pj->xL);
    if (st != MCD_OK)
        return cli_fractions_error(cmd, "--xL", st, pj->xLin, s->n);
    if (pj->species_name) {
        long k = cli_state_find(s, pj->species_name);
        if (k < 0)
            return cli_usage_error(cmd, pj->nratios ? "--match" : "--stagnant",
                                   "'%s' is not in the species list",
                                   pj->species_name);
        pj->species = (size_t)k;
    }
    for (i = 0; i < s->n; i++)
        pj->xmean[i] = 0.5 * (s->x[i] + pj->xL[i]);
    return CLI_OK;
}

/* The slab's fluxes and, with --profile, its profile. */
static int slab_compute(porous_job *pj, const char *cmd)
{
    cli_state *s = &pj->s;
    size_t n = s->n, p;
    mcd_status st;
    mcd_slab sl;
    int rc;
    if ((rc = slab_prepare(pj, cmd)) != CLI_OK ||
        (rc = viscosity(pj, cmd, pj->xmean)) != CLI_OK)
        return rc;
    if ((st = mcd_pore_permeability(&pj->pore, &pj->B0)) != MCD_OK)
        return dgm_failed(cmd, st);
    if (!pj->points)
        pj->points = 11;
    pj->N = malloc(n * sizeof *pj->N);
    pj->zp = malloc(pj->points * sizeof *pj->zp);
    pj->xp = malloc(pj->points * n * sizeof *pj->xp);
    pj->Pp = malloc(pj->points * sizeof *pj->Pp);
    if (!pj->N || !pj->zp || !pj->xp || !pj->Pp)
        return cli_fail(cmd, "setting up", MCD_ENOMEM, NULL);
    sl = (mcd_slab){.n_species = n,
                    .T = s->T,
                    .mu = pj->mu_used,
                    .L = pj->L,
                    .P_ref = s->P,
                    .M = s->M,
                    .Dij = s->Dij,
                    .x0 = s->x,
                    .P0 = s->P,
                    .xL = pj->xL,
                    .PL = pj->PL};
    if (pj->nratios)
        st = mcd_slab_solve_ratios(s->ws, &pj->pore, &sl, pj->species,
                                   pj->ratios, pj->N, &pj->PL_out, &pj->its);
    else
        st = mcd_slab_solve(s->ws, &pj->pore, &sl, pj->kind, pj->species,
                            pj->Nt[0], pj->N, &pj->PL_out, &pj->its);
    if (st == MCD_EDOM && strstr(mcd_last_error(), "argument ratios"))
        return cli_usage_error(cmd, "--ratios", "%s", mcd_last_error());
    if (st == MCD_EDOM && strstr(mcd_last_error(), "argument PL"))
        return cli_usage_error(cmd, "--pL", "%s", mcd_last_error());
    if (st != MCD_OK)
        return dgm_failed(cmd, st);
    for (p = 0; p < pj->points; p++)
        pj->zp[p] = pj->L * (double)p / (double)(pj->points - 1);
    pj->zp[pj->points - 1] = pj->L;
    st = mcd_slab_profile(s->ws, &pj->pore, &sl, pj->N, pj->points, pj->zp,
                          pj->xp, pj->Pp);
    if (st != MCD_OK)
        return dgm_failed(cmd, st);
    return CLI_OK;
}

static const char *slab_mode(const porous_job *pj)
{
    if (pj->nratios)
        return "ratios";
    return pj->kind == MCD_SLAB_PRESSURES  ? "pressures"
           : pj->kind == MCD_SLAB_STAGNANT ? "stagnant"
                                           : "total flux";
}

static void slab_print_csv(const porous_job *pj)
{
    const cli_state *s = &pj->s;
    const double *xe = pj->xp + (pj->points - 1) * s->n;
    cli_csv c;
    size_t i, p;
    cli_csv_init(&c, stdout);
    if (pj->profile) {
        cli_csv_head(&c, "z", "", "m");
        for (i = 0; i < s->n; i++)
            cli_csv_head(&c, "x_", mcd_mixture_name(s->mix, i), "-");
        cli_csv_head(&c, "P", "", "Pa");
        cli_csv_end_row(&c);
        for (p = 0; p < pj->points; p++) {
            cli_csv_number(&c, pj->zp[p]);
            for (i = 0; i < s->n; i++)
                cli_csv_number(&c, pj->xp[p * s->n + i]);
            cli_csv_number(&c, pj->Pp[p]);
            cli_csv_end_row(&c);
        }
        return;
    }
    cli_csv_text(&c, "species");
    cli_csv_text(&c, "x0");
    cli_csv_text(&c, "xL");
    cli_csv_text(&c, "xL_solved");
    cli_csv_head(&c, "N", "", "mol/(m^2 s)");
    cli_csv_end_row(&c);
    for (i = 0; i < s->n; i++) {
        cli_csv_text(&c, s->names[i]);
        cli_csv_number(&c, s->x[i]);
        cli_csv_number(&c, pj->xL[i]);
        cli_csv_number(&c, xe[i]);
        cli_csv_number(&c, pj->N[i]);
        cli_csv_end_row(&c);
    }
}

static void slab_print_json(const porous_job *pj)
{
    const cli_state *s = &pj->s;
    cli_json j;
    size_t p;
    cli_json_init(&j, stdout);
    cli_json_object_begin(&j, NULL);
    cli_state_json_header(s, &j);
    json_pore(pj, &j);
    cli_json_number(&j, "L", pj->L);
    cli_json_string(&j, "condition", slab_mode(pj));
    if (pj->species_name)
        cli_json_string(&j, pj->nratios ? "matched" : "stagnant",
                        mcd_mixture_name(s->mix, pj->species));
    if (pj->nratios)
        cli_json_numbers(&j, "ratios", pj->ratios, s->n);
    cli_json_numbers(&j, "x0", s->x, s->n);
    cli_json_numbers(&j, "xL", pj->xL, s->n);
    cli_json_numbers(&j, "xL_solved", pj->xp + (pj->points - 1) * s->n, s->n);
    cli_json_number(&j, "P0", s->P);
    cli_json_number(&j, "PL", pj->PL_out);
    cli_json_number(&j, "iterations", (double)pj->its);
    cli_state_json_binaries(s, &j);
    cli_json_numbers(&j, "fluxes", pj->N, s->n);
    if (pj->profile) {
        cli_json_array_begin(&j, "profile");
        for (p = 0; p < pj->points; p++) {
            cli_json_object_begin(&j, NULL);
            cli_json_number(&j, "z", pj->zp[p]);
            cli_json_numbers(&j, "x", pj->xp + p * s->n, s->n);
            cli_json_number(&j, "P", pj->Pp[p]);
            cli_json_object_end(&j);
        }
        cli_json_array_end(&j);
    }
    cli_json_string(&j, "caution", CAUTION_POROUS_LONG);
    cli_json_object_end(&j);
    cli_json_finish(&j);
}

static void slab_print_text(const porous_job *pj)
{
    const cli_state *s = &pj->s;
    const double *xe = pj->xp + (pj->points - 1) * s->n;
    size_t i;
    printf("porous slab, L = %.6g m, %zu species at T = %.6g K; pressure "
           "%.6g Pa at z = 0, %.6g Pa at z = L%s\n",
           pj->L, s->n, s->T, s->P, pj->PL_out,
           pj->kind == MCD_SLAB_PRESSURES && !pj->nratios ? " (given)"
                                                          : " (computed)");
    printf("pore structure: porosity %.4g, tortuosity %.4g, pore diameter "
           "%.4g m, permeability %.4g m^2%s\n",
           pj->pore.porosity, pj->pore.tortuosity, pj->pore.d_pore, pj->B0,
           pj->pore.permeability > 0 ? "" : " (from the pore diameter)");
    if (pj->mu_estimated)
        printf("mixture viscosity %.5g Pa s at the mean composition "
               "(Chapman-Enskog + Wilke, typical error %.1f %%)\n",
               pj->mu_used, 100 * pj->mu_err);
    else
        printf("mixture viscosity %.5g Pa s (given)\n", pj->mu_used);
    printf("binary diffusivities (open gas, at z = 0):\n");
    cli_state_print_binaries(s, stdout);
    printf("condition: %s\n", slab_mode(pj));
    printf("Dusty Gas Model total fluxes N [mol/(m^2 s)], positive towards "
           "z = L:\n");
    for (i = 0; i < s->n; i++) {
        printf("  %-16s x0 %-10.4g xL %-10.4g", s->names[i], s->x[i],
               pj->xL[i]);
        if (pj->nratios)
            printf(" reached %-10.4g%s", xe[i],
                   i == pj->species ? " (matched)" : "");
        printf(" N %.6g\n", pj->N[i]);
    }
    printf("%s\n", CAUTION_POROUS_SHORT);
}

/* mcdiff porous slab ... (argv: the options after "slab") */
static int porous_slab(int argc, char **argv)
{
    const char *cmd = "porous slab";
    porous_job *pj = calloc(1, sizeof *pj);
    cli_state *s;
    int rc;
    if (!pj)
        return cli_fail(cmd, "setting up", MCD_ENOMEM, NULL);
    s = &pj->s;
    rc = parse(pj, cmd, argc, argv, 1);
    if (rc != CLI_OK) {
        rc = rc < 0 ? CLI_OK : rc;
        goto done;
    }
    s->n_dim = 1;
    s->comp = malloc(s->n * sizeof *s->comp);
    s->grad = calloc(s->n, sizeof *s->grad);
    if (!s->comp || !s->grad) {
        rc = cli_fail(cmd, "setting up", MCD_ENOMEM, NULL);
        goto done;
    }
    memcpy(s->comp, pj->x0in, s->n * sizeof *s->comp);
    s->comp_basis = MCD_BASIS_MOLE;
    s->comp_opt = "--x0";
    if ((rc = cli_state_setup(s, cmd)) != CLI_OK ||
        (rc = slab_compute(pj, cmd)) != CLI_OK)
        goto done;
    if (s->csv) {
        slab_print_csv(pj);
        fprintf(stderr, "%s\n", CAUTION_POROUS_SHORT);
    } else if (s->json) {
        slab_print_json(pj);
    } else if (pj->profile) {
        slab_print_csv(pj);
        fprintf(stderr, "%s\n", CAUTION_POROUS_SHORT);
    } else {
        slab_print_text(pj);
    }
    rc = CLI_OK;
done:
    free(pj->N);
    free(pj->zp);
    free(pj->xp);
    free(pj->Pp);
    cli_state_free(s);
    free(pj);
    return rc;
}

int cli_cmd_porous(int argc, char **argv)
{
    const char *cmd = "porous";
    porous_job *pj;
    cli_state *s;
    size_t i, k;
    int rc;
    if (argc > 0 && strcmp(argv[0], "slab") == 0)
        return porous_slab(argc - 1, argv + 1);
    pj = calloc(1, sizeof *pj);
    if (!pj)
        return cli_fail(cmd, "setting up", MCD_ENOMEM, NULL);
    s = &pj->s;
    rc = parse(pj, cmd, argc, argv, 0);
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
