/* liq_flux.c - `mcdiff liquid -g ...`: exact Maxwell-Stefan diffusion
 * fluxes of a liquid mixture with the thermodynamic factor Gamma and the
 * Maxwell-Stefan diffusivities of mcd_liquid_eval (mcd_flux_compute), and
 * the generalized Fick matrix (mcd_fick_matrix); molar, mass or
 * volume-average frame (mcd_flux_to_volume_frame). The tables are those of
 * `mcdiff fluxes` (report.c).
 */
#include <math.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>
#include "liq.h"

int liq_molar_masses(const liq_run *r, const char *cmd, const char *why,
                     double *M)
{
    const liq_def *d = &r->def;
    mcd_db *db = NULL;
    size_t i, id;
    int rc = CLI_OK;
    for (i = 0; i < d->n && rc == CLI_OK; i++) {
        if (!isnan(d->M[i])) {
            M[i] = d->M[i];
            continue;
        }
        if (!d->named) {
            rc = cli_usage_error(cmd, "-s/--species",
                                 "%s needs molar masses: name the species "
                                 "(-s, or species records with M=)",
                                 why);
            break;
        }
        if (!db && (rc = cli_open_db(cmd, r->species_file, &db)) != CLI_OK)
            break;
        if (mcd_db_find(db, d->names[i], &id) != MCD_OK ||
            mcd_db_param(db, id, MCD_PARAM_MOLAR_MASS, &M[i]) != MCD_OK)
            rc = cli_usage_error(cmd, d->file ? d->file : "-s/--species",
                                 "species '%s': no molar mass (%s needs it; "
                                 "give M= in its species record or a name "
                                 "of the species table, see 'mcdiff "
                                 "species')",
                                 d->names[i], why);
    }
    mcd_db_free(db);
    return rc;
}

/* Total concentration from exactly one of --concentration, --density and
 * --partial-volumes. */
static int concentration(const liq_run *r, const char *cmd, const double *x,
                         const double *M, double *c, const char **from)
{
    size_t i, n = r->def.n;
    double s = 0.0;
    int nsrc = !isnan(r->conc) + !isnan(r->density) + (r->nVbar > 0);
    if (nsrc == 0)
        return cli_usage_error(cmd, "--concentration",
                               "the fluxes need the total concentration "
                               "(or --density or --partial-volumes)");
    if (nsrc > 1)
        return cli_usage_error(
            cmd, !isnan(r->density) ? "--density" : "--partial-volumes",
            "give one of --concentration, --density and "
            "--partial-volumes");
    if (!isnan(r->conc)) {
        *c = r->conc;
        *from = "--concentration";
        return CLI_OK;
    }
    for (i = 0; i < n; i++)
        s += x[i] * (r->nVbar ? r->Vbar[i] : M[i]);
    *c = r->nVbar ? 1.0 / s : r->density / s;
    *from = r->nVbar ? "--partial-volumes" : "--density";
    if (!(*c > 0.0) || !isfinite(*c))
        return cli_usage_error(cmd, *from,
                               "gives no positive finite concentration");
    return CLI_OK;
}

/* The Fick matrix in the volume-average frame: each column of [D],
 * extended by the dependent row (minus the column sum), is the flux of a
 * unit gradient up to the factor -c, and the frame change is linear. */
static int fick_volume(const liq_run *r, const char *cmd, double c,
                       const double *x, size_t dep, double *D)
{
    size_t n = r->def.n, m = n - 1, i, k, row;
    double col[LIQ_MAX], out[LIQ_MAX], DV[LIQ_MAX * LIQ_MAX];
    mcd_status st;
    for (k = 0; k < m; k++) {
        double sum = 0.0;
        for (i = 0, row = 0; i < n; i++)
            if (i != dep) {
                col[i] = D[row++ * m + k];
                sum += col[i];
            }
        col[dep] = -sum;
        st = mcd_flux_to_volume_frame(n, 1, c, x, r->Vbar, col, out);
        if (st != MCD_OK)
            return cli_fail(cmd, "the volume-frame Fick matrix", st,
                            mcd_last_error());
        for (i = 0, row = 0; i < n; i++)
            if (i != dep)
                DV[row++ * m + k] = out[i];
    }
    memcpy(D, DV, m * m * sizeof *D);
    return CLI_OK;
}

typedef struct liq_res {
    double x[LIQ_MAX], w[LIQ_MAX], M[LIQ_MAX], grad[LIQ_MAX * MCD_MAX_DIM];
    double lng[LIQ_MAX], G[LIQ_MAX * LIQ_MAX], Dij[LIQ_MAX * LIQ_MAX];
    double flux[LIQ_MAX * MCD_MAX_DIM], gout[LIQ_MAX * MCD_MAX_DIM];
    double fick[LIQ_MAX * LIQ_MAX], c, vsum[MCD_MAX_DIM];
    unsigned flags[LIQ_MAX], warn;
    size_t dep;
    int have_M;
    const char *c_from;
} liq_res;

static void vol_sums(const liq_run *r, liq_res *o)
{
    size_t n = r->def.n, nd = r->n_dim, i, d;
    for (d = 0; d < nd; d++) {
        double s = 0.0, big = 0.0;
        for (i = 0; i < n; i++) {
            s += r->Vbar[i] * o->flux[i * nd + d];
            big = fmax(big, fabs(r->Vbar[i] * o->flux[i * nd + d]));
        }
        o->vsum[d] = big > 0.0 ? fabs(s) / big : 0.0;
    }
}

static void print_text(const liq_run *r, const cli_state *s, const liq_res *o)
{
    size_t n = r->def.n, i, d;
    char w[256];
    printf("liquid, %s model, %zu species, T = %.6g K, c = %.6g mol/m^3 "
           "(from %s)\n",
           liq_model_name(r->def.model), n, r->T, o->c, o->c_from);
    printf("  species         x      ln_gamma         gamma%s\n",
           o->have_M ? "    M [kg/mol]" : "");
    for (i = 0; i < n; i++) {
        printf("  %7s  %8.5f  %12.6g  %12.6g", s->names[i], o->x[i], o->lng[i],
               exp(o->lng[i]));
        if (o->have_M)
            printf("  %12.6g", o->M[i]);
        printf("\n");
    }
    liq_print_matrix("thermodynamic factor Gamma [-] (row i: d_i = sum_j "
                     "Gamma_ij grad x_j):",
                     n, o->G);
    liq_print_matrix("Maxwell-Stefan diffusivities [m^2/s] (Vignes / "
                     "Kooijman-Taylor):",
                     n, o->Dij);
    printf("exact Maxwell-Stefan diffusion fluxes with Gamma, %s:\n",
           s->volume_frame ? "molar, relative to the volume-average velocity"
           : s->out_basis == MCD_BASIS_MOLE
               ? "molar, relative to the molar-average velocity"
               : "mass, relative to the mass-average velocity");
    cli_print_fluxes(s, o->flux, o->flags, stdout);
    if (s->volume_frame) {
        printf("volume frame: sum_i Vbar_i J^V_i = 0 (not sum_i J^V_i); "
               "residual relative to the largest |Vbar_i J^V_i|:");
        for (d = 0; d < r->n_dim; d++)
            printf(" %.1e", o->vsum[d]);
        printf("\n");
    }
    cli_print_fick(s, o->fick, o->dep, stdout);
    cli_warn_text(o->warn, w, sizeof w);
    if (o->warn)
        printf("warnings: %s\n", w);
    printf("%s\n", CLI_CAUTION_SHORT);
}

static void print_json(const liq_run *r, const cli_state *s, const liq_res *o)
{
    size_t n = r->def.n, i;
    char w[256];
    double g[LIQ_MAX];
    cli_json j;
    for (i = 0; i < n; i++)
        g[i] = exp(o->lng[i]);
    cli_json_init(&j, stdout);
    cli_json_object_begin(&j, NULL);
    cli_json_string(&j, "model", liq_model_name(r->def.model));
    cli_json_array_begin(&j, "species");
    for (i = 0; i < n; i++)
        cli_json_string(&j, NULL, s->names[i]);
    cli_json_array_end(&j);
    cli_json_number(&j, "T", r->T);
    cli_json_number(&j, "c", o->c);
    cli_json_string(&j, "c_from", o->c_from);
    cli_json_string(&j, "composition_basis",
                    s->comp_basis == MCD_BASIS_MOLE ? "mole" : "mass");
    cli_json_numbers(&j, "mole_fractions", o->x, n);
    if (o->have_M) {
        cli_json_numbers(&j, "mass_fractions", o->w, n);
        cli_json_numbers(&j, "M", o->M, n);
    }
    cli_json_numbers(&j, "ln_gamma", o->lng, n);
    cli_json_numbers(&j, "gamma", g, n);
    liq_json_matrix(&j, "Gamma", n, o->G);
    liq_json_matrix(&j, "Dij", n, o->Dij);
    cli_json_string(&j, "basis",
                    s->out_basis == MCD_BASIS_MOLE ? "mole" : "mass");
    cli_json_string(&j, "frame",
                    s->volume_frame                  ? "volume-average"
                    : s->out_basis == MCD_BASIS_MOLE ? "molar-average"
                                                     : "mass-average");
    if (s->volume_frame) {
        cli_json_numbers(&j, "partial_molar_volumes", r->Vbar, n);
        cli_json_numbers(&j, "volume_sum_relative", o->vsum, r->n_dim);
    }
    cli_json_array_begin(&j, "gradients");
    for (i = 0; i < n; i++)
        cli_json_numbers(&j, NULL, o->grad + i * r->n_dim, r->n_dim);
    cli_json_array_end(&j);
    cli_json_fluxes(s, o->flux, o->flags, &j);
    cli_json_fick(s, o->fick, o->dep, &j);
    cli_json_array_begin(&j, "input_warnings");
    for (i = 0; i < s->n_notes; i++)
        cli_json_string(&j, NULL, s->notes[i]);
    cli_json_array_end(&j);
    cli_warn_text(o->warn, w, sizeof w);
    cli_json_string(&j, "warnings", w);
    cli_json_string(&j, "caution", CLI_CAUTION_LONG);
    cli_json_object_end(&j);
    cli_json_finish(&j);
}

/* Inputs of the flux path: counts, composition, molar masses, c. */
static int inputs(liq_run *r, const char *cmd, liq_res *o)
{
    size_t n = r->def.n, nd = r->n_dim, k, i;
    mcd_status st;
    int rc;
    if (n < 2)
        return cli_usage_error(cmd, "-g/--gradient",
                               "fluxes need two or more species");
    for (k = 0; k < nd; k++)
        if (r->nrow[k] != n)
            return cli_usage_error(cmd, "-g/--gradient",
                                   "direction %zu has %zu values for %zu "
                                   "species",
                                   k + 1, r->nrow[k], n);
    if (r->nVbar && r->nVbar != n)
        return cli_usage_error(cmd, "--partial-volumes",
                               "has %zu values for %zu species", r->nVbar, n);
    if (r->basis == 2 && !r->nVbar)
        return cli_usage_error(cmd, "--basis",
                               "volume needs --partial-volumes");
    if ((st = mcd_comp_normalize(n, r->x, o->x)) != MCD_OK)
        return cli_fractions_error(cmd, "-x/--mole-fractions", st, r->x, n);
    if (r->mass_comp && (st = mcd_comp_normalize(n, r->win, o->w)) != MCD_OK)
        return cli_fractions_error(cmd, "-w/--mass-fractions", st, r->win, n);
    o->have_M = r->basis == 1 || !isnan(r->density) || r->mass_comp;
    if (o->have_M && (rc = liq_molar_masses(r, cmd,
                                            r->mass_comp    ? "-w"
                                            : r->basis == 1 ? "--basis mass"
                                                            : "--density",
                                            o->M)) != CLI_OK)
        return rc;
    if (o->have_M && !r->mass_comp &&
        mcd_comp_x_to_w(n, o->M, o->x, o->w) != MCD_OK)
        return cli_usage_error(cmd, "-x/--mole-fractions",
                               "no mass fractions from these molar masses");
    for (i = 0; i < n; i++)
        for (k = 0; k < nd; k++)
            o->grad[i * nd + k] = r->rows[k][i];
    if (r->dependent) {
        long dp = liq_def_species(&r->def, r->dependent);
        if (dp < 0)
            return cli_usage_error(cmd, "--dependent",
                                   "'%s' is not a species (1..%zu or a name)",
                                   r->dependent, n);
        o->dep = (size_t)dp;
    } else
        o->dep = MCD_DEPENDENT_AUTO;
    return concentration(r, cmd, o->x, o->M, &o->c, &o->c_from);
}

/* Fluxes, flags and Fick matrix with the liquid's Gamma and Đ. */
static int compute(liq_run *r, const char *cmd, mcd_workspace *ws,
                   const mcd_liquid *liq, cli_state *s, liq_res *o)
{
    size_t n = r->def.n, nd = r->n_dim;
    mcd_basis b = s->out_basis;
    mcd_status st;
    int rc;
    double JV[LIQ_MAX * MCD_MAX_DIM];
    rc = liq_eval_status(
        cmd, "the liquid",
        mcd_liquid_eval(ws, liq, r->T, o->x, o->lng, o->G, o->Dij, &o->warn));
    if (rc != CLI_OK)
        return rc;
    st = mcd_flux_compute(ws, MCD_MODEL_MAXWELL_STEFAN,
                          &(mcd_state){.n_species = n,
                                       .n_dim = nd,
                                       .comp_basis = s->comp_basis,
                                       .c = o->c,
                                       .M = o->have_M ? o->M : NULL,
                                       .Dij = o->Dij,
                                       .comp = s->comp,
                                       .grad = o->grad,
                                       .Gamma = o->G},
                          b, o->flux);
    if (st != MCD_OK)
        return cli_fail(cmd, "the flux computation", st, mcd_last_error());
    if (s->volume_frame) {
        st = mcd_flux_to_volume_frame(n, nd, o->c, o->x, r->Vbar, o->flux, JV);
        if (st != MCD_OK)
            return cli_usage_error(cmd, "--partial-volumes", "%s",
                                   mcd_last_error());
        memcpy(o->flux, JV, n * nd * sizeof *JV);
        vol_sums(r, o);
    }
    if ((rc = cli_state_grad_in(s, cmd, b, o->gout)) != CLI_OK)
        return rc;
    if ((st = mcd_flux_diagnose(n, nd, o->gout, o->flux, 1e-3, o->flags)))
        return cli_fail(cmd, "the coupling diagnosis", st, NULL);
    st = mcd_fick_matrix(ws,
                         &(mcd_state){.n_species = n,
                                      .M = o->have_M ? o->M : NULL,
                                      .Dij = o->Dij,
                                      .comp_basis = s->comp_basis,
                                      .comp = s->comp,
                                      .Gamma = o->G},
                         b, o->dep, o->fick, &o->dep);
    if (st != MCD_OK)
        return cli_fail(cmd, "the Fick matrix", st, mcd_last_error());
    if (s->volume_frame)
        return fick_volume(r, cmd, o->c, o->x, o->dep, o->fick);
    return CLI_OK;
}

int liq_run_fluxes(liq_run *r, const char *cmd)
{
    liq_res *o = calloc(1, sizeof *o);
    cli_state *s = calloc(1, sizeof *s);
    mcd_liquid *liq = NULL;
    mcd_workspace *ws = NULL;
    mcd_status st;
    size_t i;
    int rc = (o && s) ? CLI_OK : cli_fail(cmd, "setting up", MCD_ENOMEM, NULL);
    if (rc == CLI_OK)
        rc = inputs(r, cmd, o);
    if (rc == CLI_OK && (rc = liq_def_check(&r->def, cmd, 1)) == CLI_OK)
        rc = liq_def_build(&r->def, cmd, &liq);
    if (rc == CLI_OK && (st = mcd_workspace_new(r->def.n, &ws)) != MCD_OK)
        rc = cli_fail(cmd, "allocating a workspace", st, NULL);
    if (rc == CLI_OK) {
        /* the state of the shared tables: names, composition, gradients */
        s->n = r->def.n;
        s->n_dim = r->n_dim;
        for (i = 0; i < s->n; i++)
            s->names[i] = r->name_ptr[i];
        s->comp_basis = r->mass_comp ? MCD_BASIS_MASS : MCD_BASIS_MOLE;
        s->out_basis = r->basis == 1 || (r->basis < 0 && r->mass_comp)
                           ? MCD_BASIS_MASS
                           : MCD_BASIS_MOLE;
        s->volume_frame = r->basis == 2;
        s->comp = r->mass_comp ? o->w : o->x;
        s->x = o->x;
        s->w = o->w;
        s->M = o->have_M ? o->M : NULL;
        s->grad = o->grad;
        s->c = o->c;
        s->T = r->T;
        cli_state_project_gradients(s, cmd);
        rc = compute(r, cmd, ws, liq, s, o);
    }
    if (rc == CLI_OK && r->csv) {
        cli_csv_fluxes(s, o->flux, o->flags, stdout);
        fprintf(stderr, "%s\n", CLI_CAUTION_SHORT);
    } else if (rc == CLI_OK && r->json)
        print_json(r, s, o);
    else if (rc == CLI_OK)
        print_text(r, s, o);
    mcd_workspace_free(ws);
    mcd_liquid_free(liq);
    free(o);
    free(s);
    return rc;
}
