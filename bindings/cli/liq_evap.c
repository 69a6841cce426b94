/* liq_evap.c - `mcdiff liquid --evaporate GAS`: the liquid evaporating
 * through a Stefan tube (stagnant gas film) into an inert gas
 * (mcd_liquid_evaporation): interface vapour composition by the modified
 * Raoult's law, exact Maxwell-Stefan film fluxes with the inert stagnant,
 * the evaporation rate and the fall of the liquid level. The gas side is
 * the state of `mcdiff film` (state.c): species from the table, binary
 * diffusivities estimated or given with --gas-pair.
 */
#include <math.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>
#include "liq.h"

typedef struct evap_res {
    double x[LIQ_MAX], lng[LIQ_MAX];
    double y0[LIQ_MAX + 1], N[LIQ_MAX + 1], nm[LIQ_MAX + 1];
    double rate, level;
    unsigned warn;
} evap_res;

static int require(const liq_run *r, const char *cmd)
{
    const liq_def *d = &r->def;
    if (!d->named)
        return cli_usage_error(cmd, "--evaporate",
                               "name the species (-s or species records of "
                               "--params): the gas side needs them from the "
                               "species table");
    if (isnan(r->P))
        return cli_usage_error(cmd, "-P/--pressure",
                               "is required with --evaporate");
    if (isnan(r->L))
        return cli_usage_error(cmd, "-L/--length",
                               "is required with --evaporate (tube length)");
    if (isnan(r->density))
        return cli_usage_error(cmd, "--density",
                               "the liquid density is required with "
                               "--evaporate (for the fall of the level)");
    if (!liq_def_have_antoine(d))
        return cli_usage_error(cmd, "--antoine",
                               "no species has Antoine constants, so nothing "
                               "evaporates (antoine records or --antoine)");
    if (r->nxtop && r->nxtop != d->n + 1)
        return cli_usage_error(cmd, "--xL",
                               "has %zu values for %zu gas species (the "
                               "liquid's, then %s)",
                               r->nxtop, d->n + 1, r->inert);
    return CLI_OK;
}

/* The gas side: species (liquid's and the inert), T, P, estimates or
 * --gas-pair, the composition at the open end. */
static int gas_state(const liq_run *r, const char *cmd, cli_state *g)
{
    const liq_def *d = &r->def;
    size_t i, n = d->n;
    char list[(LIQ_MAX + 1) * LIQ_NAME + 1];
    cli_args a;
    int rc;
    cli_state_defaults(g);
    g->pair_opt = "--gas-pair";
    g->comp_opt = "--xL";
    memset(&a, 0, sizeof a);
    list[0] = '\0';
    for (i = 0; i < n; i++) {
        strcat(list, d->names[i]);
        strcat(list, ",");
    }
    if (strlen(r->inert) >= LIQ_NAME || strchr(r->inert, ','))
        return cli_usage_error(cmd, "--evaporate", "'%s' is not one species",
                               r->inert);
    strcat(list, r->inert);
    a.value = list;
    a.spelled = "--evaporate";
    if ((rc = cli_state_option(g, cmd, &a, CLI_O_SPECIES)) != CLI_OK)
        return rc;
    if (r->method) {
        a.value = r->method;
        a.spelled = "-m/--method";
        if ((rc = cli_state_option(g, cmd, &a, CLI_O_METHOD)) != CLI_OK)
            return rc;
    }
    for (i = 0; i < r->n_gas_pairs; i++) {
        a.value = r->gas_pairs[i];
        a.spelled = "--gas-pair";
        if ((rc = cli_state_option(g, cmd, &a, CLI_O_PAIR)) != CLI_OK)
            return rc;
    }
    g->T = r->T;
    g->P = r->P;
    g->file = r->species_file;
    g->comp_basis = g->out_basis = MCD_BASIS_MOLE;
    g->comp = calloc(n + 1, sizeof *g->comp);
    if (!g->comp)
        return cli_fail(cmd, "setting up", MCD_ENOMEM, NULL);
    for (i = 0; i <= n; i++)
        g->comp[i] = r->nxtop ? r->xtop[i] : (i == n ? 1.0 : 0.0);
    return cli_state_setup(g, cmd);
}

static void print_text(const liq_run *r, const cli_state *g, const evap_res *o)
{
    size_t n = r->def.n, i;
    cli_table t;
    const char *cells[8];
    char b[8][48], w[256];
    double sN = cli_scale(o->N, n + 1, 1), sn = cli_scale(o->nm, n + 1, 1);
    printf("liquid (%s model, %zu species) evaporating at T = %.6g K into "
           "%s at P = %.6g Pa\nthrough a Stefan tube of length L = %.6g m "
           "(c = %.5g mol/m^3, ideal gas)\n",
           liq_model_name(r->def.model), n, r->T, r->inert, r->P, r->L, g->c);
    printf("gas binary diffusivities:\n");
    cli_state_print_binaries(g, stdout);
    cli_table_init(&t, 7);
    for (i = 1; i < 7; i++)
        t.right[i] = 1;
    cells[0] = "species";
    cells[1] = "x liquid";
    cells[2] = "gamma";
    cells[3] = "y surface";
    cells[4] = "y open end";
    cells[5] = "N [mol/(m^2 s)]";
    cells[6] = "N M [kg/(m^2 s)]";
    cli_table_row(&t, cells);
    for (i = 0; i <= n; i++) {
        cells[0] = cli_state_name(g, i);
        snprintf(b[1], sizeof b[1], i < n ? "%.5g" : "-", i < n ? o->x[i] : 0);
        snprintf(b[2], sizeof b[2], i < n ? "%.5g" : "-",
                 i < n ? exp(o->lng[i]) : 0);
        snprintf(b[3], sizeof b[3], "%.5g", o->y0[i]);
        snprintf(b[4], sizeof b[4], "%.5g", g->x[i]);
        snprintf(b[5], sizeof b[5], "%.5e", cli_shown(o->N[i], sN));
        snprintf(b[6], sizeof b[6], "%.5e", cli_shown(o->nm[i], sn));
        for (size_t k = 1; k < 7; k++)
            cells[k] = b[k];
        cli_table_row(&t, cells);
    }
    cli_table_print(&t, stdout, "  ");
    cli_table_free(&t);
    printf("evaporation rate: %.5e kg/(m^2 s) (%.5g g/(m^2 h))\n", o->rate,
           o->rate * 3.6e6);
    printf("fall of the liquid level: %.5g mm/h (liquid density %.6g "
           "kg/m^3)\n",
           o->level, r->density);
    printf("(exact Maxwell-Stefan film, %s stagnant; surface vapour by the "
           "modified Raoult's law;\n isothermal and quasi-steady: the rate "
           "of this liquid composition and level)\n",
           r->inert);
    cli_warn_text(o->warn, w, sizeof w);
    if (o->warn)
        printf("warnings (liquid): %s\n", w);
    printf("%s\n", LIQ_CAUTION_EVAP_SHORT);
}

static void print_json(const liq_run *r, const cli_state *g, const evap_res *o)
{
    size_t n = r->def.n;
    double p[LIQ_MAX + 1];
    char w[256];
    cli_json j;
    for (size_t i = 0; i <= n; i++)
        p[i] = o->y0[i] * r->P;
    cli_json_init(&j, stdout);
    cli_json_object_begin(&j, NULL);
    cli_state_json_header(g, &j);
    cli_json_string(&j, "inert", r->inert);
    cli_json_number(&j, "L", r->L);
    cli_json_string(&j, "liquid_model", liq_model_name(r->def.model));
    cli_json_numbers(&j, "x_liquid", o->x, n);
    cli_json_numbers(&j, "ln_gamma", o->lng, n);
    cli_json_numbers(&j, "partial_pressures_Pa", p, n);
    cli_json_numbers(&j, "y_surface", o->y0, n + 1);
    cli_json_numbers(&j, "y_open_end", g->x, n + 1);
    cli_json_string(&j, "flux_unit", "mol/(m^2 s)");
    cli_json_numbers(&j, "fluxes", o->N, n + 1);
    cli_json_numbers(&j, "mass_fluxes_kg_per_m2_s", o->nm, n + 1);
    cli_json_number(&j, "evaporation_rate_kg_per_m2_s", o->rate);
    cli_json_number(&j, "level_fall_mm_per_h", o->level);
    cli_json_number(&j, "liquid_density", r->density);
    cli_state_json_binaries(g, &j);
    cli_warn_text(o->warn, w, sizeof w);
    cli_json_string(&j, "liquid_warnings", w);
    cli_json_string(&j, "caution", LIQ_CAUTION_EVAP_LONG);
    cli_json_object_end(&j);
    cli_json_finish(&j);
}

static void print_csv(const liq_run *r, const cli_state *g, const evap_res *o)
{
    size_t n = r->def.n, i;
    cli_csv c;
    cli_csv_init(&c, stdout);
    cli_csv_text(&c, "species");
    cli_csv_text(&c, "x_liquid");
    cli_csv_head(&c, "p", "", "Pa");
    cli_csv_text(&c, "y_surface");
    cli_csv_text(&c, "y_open_end");
    cli_csv_head(&c, "N", "", "mol/(m^2 s)");
    cli_csv_head(&c, "NM", "", "kg/(m^2 s)");
    cli_csv_end_row(&c);
    for (i = 0; i <= n; i++) {
        cli_csv_text(&c, cli_state_name(g, i));
        cli_csv_number(&c, i < n ? o->x[i] : (double)NAN);
        cli_csv_number(&c, o->y0[i] * r->P);
        cli_csv_number(&c, o->y0[i]);
        cli_csv_number(&c, g->x[i]);
        cli_csv_number(&c, o->N[i]);
        cli_csv_number(&c, o->nm[i]);
        cli_csv_end_row(&c);
    }
    fprintf(stderr,
            "evaporation rate %.6g kg/(m^2 s), level fall %.6g mm/h\n%s\n",
            o->rate, o->level, LIQ_CAUTION_EVAP_SHORT);
}

int liq_run_evaporation(liq_run *r, const char *cmd)
{
    evap_res o;
    cli_state *g = calloc(1, sizeof *g);
    mcd_liquid *liq = NULL;
    mcd_status st;
    size_t n = r->def.n, i;
    int rc = g ? require(r, cmd) : cli_fail(cmd, "setting up", MCD_ENOMEM, 0);
    memset(&o, 0, sizeof o);
    if (rc == CLI_OK && (st = mcd_comp_normalize(n, r->x, o.x)) != MCD_OK)
        rc = cli_fractions_error(cmd, "-x/--mole-fractions", st, r->x, n);
    if (rc == CLI_OK && (rc = liq_def_check(&r->def, cmd, 0)) == CLI_OK)
        rc = liq_def_build(&r->def, cmd, &liq);
    if (rc == CLI_OK)
        rc = gas_state(r, cmd, g);
    if (rc == CLI_OK)
        rc = liq_eval_status(
            cmd, "the liquid",
            mcd_liquid_eval(g->ws, liq, r->T, o.x, o.lng, NULL, NULL, NULL));
    if (rc == CLI_OK) {
        mcd_film gas = {.n_species = n + 1,
                        .c = g->c,
                        .L = r->L,
                        .Dij = g->Dij,
                        .xL = g->x};
        st = mcd_liquid_evaporation(g->ws, liq, &gas, r->T, r->P, o.x, g->M,
                                    r->density, o.y0, o.N, &o.rate, &o.level,
                                    &o.warn);
        rc = liq_eval_status(cmd, "the evaporation", st);
    }
    if (rc == CLI_OK) {
        for (i = 0; i <= n; i++)
            o.nm[i] = o.N[i] * g->M[i];
        if (r->csv)
            print_csv(r, g, &o);
        else if (r->json)
            print_json(r, g, &o);
        else
            print_text(r, g, &o);
    }
    if (g)
        cli_state_free(g);
    free(g);
    mcd_liquid_free(liq);
    return rc;
}
