/* report.c - results shared by `mcdiff fluxes` and `mcdiff matrix`: the
 * generalized Fick matrix, flux tables, zero-sum residuals, flags. */
#include <math.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>
#include "cli.h"

const char *cli_state_name(const cli_state *s, size_t i)
{
    return s->mix ? mcd_mixture_name(s->mix, i) : s->names[i];
}

const char *cli_flux_unit(mcd_basis b)
{
    return b == MCD_BASIS_MOLE ? "mol/(m^2 s)" : "kg/(m^2 s)";
}

int cli_state_grad_in(const cli_state *s, const char *cmd, mcd_basis basis,
                      double *out)
{
    mcd_status st;
    size_t nn = s->n * s->n_dim;
    if (basis == s->comp_basis) {
        memcpy(out, s->grad, nn * sizeof *out);
        return CLI_OK;
    }
    if (s->comp_basis == MCD_BASIS_MOLE)
        st = mcd_comp_grad_x_to_w(s->n, s->n_dim, s->M, s->x, s->grad, out);
    else
        st = mcd_comp_grad_w_to_x(s->n, s->n_dim, s->M, s->w, s->grad, out);
    if (st != MCD_OK)
        return cli_fail(cmd, "converting the gradients", st, NULL);
    return CLI_OK;
}

int cli_state_fick(cli_state *s, const char *cmd, double *D, size_t *out_dep)
{
    mcd_status st = mcd_fick_matrix(s->ws,
                                    &(mcd_state){.n_species = s->n,
                                                 .M = s->M,
                                                 .Dij = s->Dij,
                                                 .comp_basis = s->comp_basis,
                                                 .comp = s->comp},
                                    s->out_basis, s->dependent, D, out_dep);
    if (st != MCD_OK)
        return cli_fail(cmd, "the Fick matrix", st, mcd_last_error());
    return CLI_OK;
}

void cli_print_fick(const cli_state *s, const double *D, size_t dep, FILE *f)
{
    size_t n = s->n, m = n - 1, i, k, r, c;
    cli_table t;
    const char *cells[CLI_TABLE_MAX_COLS];
    char buf[CLI_TABLE_MAX_COLS][48];

    fprintf(f,
            "generalized Fick matrix [m^2/s] (exact; dependent species "
            "%s),\n  %s:\n",
            cli_state_name(s, dep),
            s->volume_frame ? "J^V = -c [D^V] grad x, volume-average frame"
            : s->out_basis == MCD_BASIS_MOLE
                ? "J = -c [D] grad x, molar-average frame"
                : "j = -rho [D] grad w, mass-average frame");
    if (m + 1 > CLI_TABLE_MAX_COLS) {
        fprintf(f, "  (%zu x %zu: too wide to print; use --json)\n", m, m);
        return;
    }
    cli_table_init(&t, m + 1);
    for (k = 1; k <= m; k++)
        t.right[k] = 1;
    cells[0] = "";
    for (i = 0, c = 1; i < n; i++)
        if (i != dep)
            cells[c++] = cli_state_name(s, i);
    cli_table_row(&t, cells);
    for (i = 0, r = 0; i < n; i++) {
        if (i == dep)
            continue;
        cells[0] = cli_state_name(s, i);
        for (k = 0; k < m; k++) {
            snprintf(buf[k], sizeof buf[k], "%.4e", D[r * m + k]);
            cells[k + 1] = buf[k];
        }
        cli_table_row(&t, cells);
        r++;
    }
    cli_table_print(&t, f, "  ");
    cli_table_free(&t);
}

void cli_json_fick(const cli_state *s, const double *D, size_t dep, cli_json *j)
{
    size_t n = s->n, m = n - 1, i, r;
    cli_json_array_begin(j, "fick_matrix");
    for (r = 0; r < m; r++)
        cli_json_numbers(j, NULL, D + r * m, m);
    cli_json_array_end(j);
    cli_json_array_begin(j, "fick_species");
    for (i = 0; i < n; i++)
        if (i != dep)
            cli_json_string(j, NULL, cli_state_name(s, i));
    cli_json_array_end(j);
    cli_json_string(j, "fick_dependent", cli_state_name(s, dep));
}

void cli_zero_sum(size_t n, size_t n_dim, const double *flux, double *sum,
                  double *rel)
{
    size_t i, d;
    for (d = 0; d < n_dim; d++) {
        double acc = 0.0, big = 0.0;
        for (i = 0; i < n; i++) {
            acc += flux[i * n_dim + d];
            if (fabs(flux[i * n_dim + d]) > big)
                big = fabs(flux[i * n_dim + d]);
        }
        sum[d] = acc;
        rel[d] = big > 0.0 ? fabs(acc) / big : 0.0;
    }
}

void cli_flag_text(unsigned fl, char *buf, size_t len)
{
    snprintf(buf, len, "%s%s%s%s", (fl & MCD_DIAG_REVERSE) ? "reverse " : "",
             (fl & MCD_DIAG_OSMOTIC) ? "osmotic " : "",
             (fl & MCD_DIAG_BARRIER) ? "barrier " : "", fl ? "" : "-");
    if (fl && strlen(buf) > 0)
        buf[strlen(buf) - 1] = '\0';
}

void cli_json_flags(cli_json *j, unsigned fl)
{
    cli_json_array_begin(j, NULL);
    if (fl & MCD_DIAG_REVERSE)
        cli_json_string(j, NULL, "reverse");
    if (fl & MCD_DIAG_OSMOTIC)
        cli_json_string(j, NULL, "osmotic");
    if (fl & MCD_DIAG_BARRIER)
        cli_json_string(j, NULL, "barrier");
    cli_json_array_end(j);
}

void cli_print_fluxes(const cli_state *s, const double *flux,
                      const unsigned *flags, FILE *f)
{
    size_t n = s->n, nd = s->n_dim, i, d, nc = 2 + 2 * nd + 1;
    double sF = cli_scale(flux, n * nd, 1); /* round-off scale */
    cli_table t;
    const char *cells[CLI_TABLE_MAX_COLS];
    char buf[CLI_TABLE_MAX_COLS][64];
    const char fr = s->comp_basis == MCD_BASIS_MOLE ? 'x' : 'w';
    const char *sym = s->out_basis == MCD_BASIS_MOLE ? "J" : "j";
    double sum[MCD_MAX_DIM], rel[MCD_MAX_DIM];

    cli_table_init(&t, nc);
    for (i = 1; i < nc - 1; i++)
        t.right[i] = 1;
    cells[0] = "species";
    snprintf(buf[0], sizeof buf[0], "%c", fr);
    cells[1] = buf[0];
    for (d = 0; d < nd; d++) {
        snprintf(buf[1 + d], sizeof buf[1 + d], "d%c/dz%zu [1/m]", fr, d + 1);
        cells[2 + d] = buf[1 + d];
        snprintf(buf[1 + nd + d], sizeof buf[1 + nd + d], "%s_%zu [%s]", sym,
                 d + 1, cli_flux_unit(s->out_basis));
        cells[2 + nd + d] = buf[1 + nd + d];
    }
    cells[nc - 1] = "flags";
    cli_table_row(&t, cells);
    for (i = 0; i < n; i++) {
        cells[0] = cli_state_name(s, i);
        snprintf(buf[0], sizeof buf[0], "%.5g", s->comp[i]);
        cells[1] = buf[0];
        for (d = 0; d < nd; d++) {
            snprintf(buf[1 + d], sizeof buf[1 + d], "%.5g",
                     s->grad[i * nd + d]);
            cells[2 + d] = buf[1 + d];
            snprintf(buf[1 + nd + d], sizeof buf[1 + nd + d], "%.5e",
                     cli_shown(flux[i * nd + d], sF));
            cells[2 + nd + d] = buf[1 + nd + d];
        }
        if (flags)
            cli_flag_text(flags[i], buf[2 * nd + 1], sizeof buf[2 * nd + 1]);
        else
            snprintf(buf[2 * nd + 1], sizeof buf[2 * nd + 1], "-");
        cells[nc - 1] = buf[2 * nd + 1];
        cli_table_row(&t, cells);
    }
    cli_zero_sum(n, nd, flux, sum, rel);
    cells[0] = "sum";
    cells[1] = "";
    for (d = 0; d < nd; d++) {
        cells[2 + d] = "";
        snprintf(buf[1 + nd + d], sizeof buf[1 + nd + d], "%.2e", sum[d]);
        cells[2 + nd + d] = buf[1 + nd + d];
    }
    cells[nc - 1] = "";
    cli_table_row(&t, cells);
    cli_table_print(&t, f, "  ");
    cli_table_free(&t);
    if (!s->volume_frame) { /* the volume frame has its own sum */
        fprintf(f, "zero-sum residual (sum over species / largest |%s|):", sym);
        for (d = 0; d < nd; d++)
            fprintf(f, " %.1e", rel[d]);
        fprintf(f, "\n");
    }
    if (flags)
        fprintf(f, "flags: reverse = flux up its own gradient, osmotic = "
                   "flux without own gradient,\n       barrier = no flux "
                   "despite a gradient (tolerance 1e-3 of the largest)\n");
}

void cli_json_fluxes(const cli_state *s, const double *flux,
                     const unsigned *flags, cli_json *j)
{
    size_t n = s->n, nd = s->n_dim, i;
    double sum[MCD_MAX_DIM], rel[MCD_MAX_DIM];
    cli_json_string(j, "flux_unit", cli_flux_unit(s->out_basis));
    cli_json_array_begin(j, "fluxes");
    for (i = 0; i < n; i++)
        cli_json_numbers(j, NULL, flux + i * nd, nd);
    cli_json_array_end(j);
    cli_zero_sum(n, nd, flux, sum, rel);
    cli_json_numbers(j, "zero_sum_residual", sum, nd);
    cli_json_numbers(j, "zero_sum_relative", rel, nd);
    if (flags) {
        cli_json_array_begin(j, "flags");
        for (i = 0; i < n; i++)
            cli_json_flags(j, flags[i]);
        cli_json_array_end(j);
    }
}

void cli_csv_fluxes(const cli_state *s, const double *flux,
                    const unsigned *flags, FILE *f)
{
    size_t n = s->n, nd = s->n_dim, i, d;
    double sF = cli_scale(flux, n * nd, 1); /* round-off scale */
    cli_csv c;
    char name[32];
    const char *fr = s->comp_basis == MCD_BASIS_MOLE ? "x" : "w";
    const char *sym = s->out_basis == MCD_BASIS_MOLE ? "J" : "j";

    cli_csv_init(&c, f);
    cli_csv_text(&c, "species");
    cli_csv_text(&c, fr);
    for (d = 0; d < nd; d++) {
        snprintf(name, sizeof name, "d%s_dz%zu", fr, d + 1);
        cli_csv_head(&c, NULL, name, "1/m");
    }
    for (d = 0; d < nd; d++) {
        snprintf(name, sizeof name, "%s_%zu", sym, d + 1);
        cli_csv_head(&c, NULL, name, cli_flux_unit(s->out_basis));
    }
    if (flags)
        cli_csv_text(&c, "flags");
    cli_csv_end_row(&c);
    for (i = 0; i < n; i++) {
        cli_csv_text(&c, cli_state_name(s, i));
        cli_csv_number(&c, s->comp[i]);
        for (d = 0; d < nd; d++)
            cli_csv_number(&c, s->grad[i * nd + d]);
        for (d = 0; d < nd; d++)
            cli_csv_number(&c, cli_shown(flux[i * nd + d], sF));
        if (flags) {
            char buf[64];
            cli_flag_text(flags[i], buf, sizeof buf);
            cli_csv_text(&c, strcmp(buf, "-") == 0 ? "" : buf);
        }
        cli_csv_end_row(&c);
    }
}
