/* cmd_matrix.c - `mcdiff matrix`: binary and generalized Fick matrices of a
 * mixture at one state, the Fick matrix's eigenvalues, and (with -g) the
 * fluxes it gives. */
#include <math.h>
#include <stdio.h>
#include <stdlib.h>
#include "cli.h"

static void help(FILE *f)
{
    fputs(
        "usage: mcdiff matrix -s A,B,C -x XA,XB,XC -T TEMP -P PRES [options]\n"
        "\n"
        "The binary diffusivities of every pair, the exact generalized Fick\n"
        "matrix [D] of the ideal-gas mixture ((N-1) x (N-1), without the\n"
        "dependent species) and its eigenvalues. With -g, also the fluxes\n"
        "-c [D] grad x (mole basis) or -rho [D] grad w (mass basis).\n"
        "\n"
        "options (lists are comma-separated, one value per species, in the\n"
        "order of -s):\n"
        "  -s, --species LIST        species names or formulas (2 or more)\n"
        "  -x, --mole-fractions LIST mole fractions [-], sum 1\n"
        "  -w, --mass-fractions LIST mass fractions [-], sum 1 (instead of "
        "-x)\n"
        "  -T, --temperature TEMP    K or C suffix (also F), bare = K\n"
        "  -P, --pressure PRES       Pa, kPa, MPa, bar, atm or psi, bare = Pa\n"
        "  --basis NAME              mole (molar-average frame, default with\n"
        "                            -x) or mass (mass-average frame)\n"
        "  --dependent NAME          species left out (default: most "
        "abundant)\n" CLI_METHOD_HELP
        "  --pair A:B=D[@T,P]        given binary diffusivity [m^2/s, or "
        "cm2/s\n"
        "                            suffix], as for 'mcdiff fluxes'\n"
        "  -g, --gradient LIST       optional gradients of the fractions "
        "[1/m],\n"
        "                            one -g per direction (1 to 3)\n"
        "  --json                    one JSON object (SI): \"fick_matrix\",\n"
        "                            \"binary_D\", \"eigenvalues\", "
        "\"fluxes\"\n"
        "  --csv                     the matrices as CSV rows\n"
        "                            quantity,row,column,value_m2_per_s with\n"
        "                            quantity binary, fick or eigenvalue (not\n"
        "                            with -g: use 'mcdiff fluxes --csv')\n"
        "  --species-file FILE       also load species from FILE\n"
        "  -h, --help                this text\n"
        "\n"
        "example:\n"
        "  mcdiff matrix -s acetone,methanol,air -x 0.3,0.2,0.5 -T 40C "
        "-P 1atm\n",
        f);
}

/* Long CSV: every value is a diffusivity [m^2/s]. */
static void print_csv(const cli_state *s, const double *D, size_t dep,
                      const double *re, const double *im)
{
    size_t n = s->n, m = n - 1, i, k, r, c;
    cli_csv o;
    cli_csv_init(&o, stdout);
    cli_csv_text(&o, "quantity");
    cli_csv_text(&o, "row");
    cli_csv_text(&o, "column");
    cli_csv_head(&o, "value", "", "m^2/s");
    cli_csv_end_row(&o);
    for (i = 0; i < n; i++)
        for (k = i + 1; k < n; k++) {
            cli_csv_text(&o, "binary");
            cli_csv_text(&o, mcd_mixture_name(s->mix, i));
            cli_csv_text(&o, mcd_mixture_name(s->mix, k));
            cli_csv_number(&o, s->Dij[i * n + k]);
            cli_csv_end_row(&o);
        }
    for (i = 0, r = 0; i < n; i++) {
        if (i == dep)
            continue;
        for (k = 0, c = 0; k < n; k++) {
            if (k == dep)
                continue;
            cli_csv_text(&o, "fick");
            cli_csv_text(&o, mcd_mixture_name(s->mix, i));
            cli_csv_text(&o, mcd_mixture_name(s->mix, k));
            cli_csv_number(&o, D[r * m + c]);
            cli_csv_end_row(&o);
            c++;
        }
        r++;
    }
    for (k = 0; k < m; k++) {
        cli_csv_text(&o, "eigenvalue");
        cli_csv_integer(&o, (long long)k + 1);
        cli_csv_text(&o, "real");
        cli_csv_number(&o, re[k]);
        cli_csv_end_row(&o);
        cli_csv_text(&o, "eigenvalue");
        cli_csv_integer(&o, (long long)k + 1);
        cli_csv_text(&o, "imaginary");
        cli_csv_number(&o, im[k]);
        cli_csv_end_row(&o);
    }
}

int cli_cmd_matrix(int argc, char **argv)
{
    const char *cmd = "matrix";
    cli_state s;
    int rc;
    double *D = NULL, *re = NULL, *im = NULL, *flux = NULL, *gout = NULL;
    size_t dep = 0, n, m, i;
    mcd_status st;

    rc = cli_state_parse(&s, cmd, argc, argv, 0, help);
    if (rc != CLI_OK) {
        cli_state_free(&s);
        return rc < 0 ? CLI_OK : rc;
    }
    if (s.csv && s.n_dim > 0) {
        rc = cli_usage_error(cmd, "--csv",
                             "holds the matrices only; for fluxes with -g "
                             "use 'mcdiff fluxes --csv'");
        goto done;
    }
    rc = cli_state_setup(&s, cmd);
    if (rc != CLI_OK)
        goto done;
    n = s.n;
    m = n - 1;
    D = malloc(m * m * sizeof *D);
    re = malloc(m * sizeof *re);
    im = malloc(m * sizeof *im);
    if (!D || !re || !im) {
        rc = cli_fail(cmd, "setting up", MCD_ENOMEM, NULL);
        goto done;
    }
    rc = cli_state_fick(&s, cmd, D, &dep);
    if (rc != CLI_OK)
        goto done;
    st = mcd_fick_eigenvalues(s.ws, m, D, re, im);
    if (st != MCD_OK) {
        rc = cli_fail(cmd, "the eigenvalues", st, mcd_last_error());
        goto done;
    }
    if (s.n_dim > 0) {
        double conc = s.c, Mbar;
        flux = malloc(n * s.n_dim * sizeof *flux);
        gout = malloc(n * s.n_dim * sizeof *gout);
        if (!flux || !gout) {
            rc = cli_fail(cmd, "setting up", MCD_ENOMEM, NULL);
            goto done;
        }
        rc = cli_state_grad_in(&s, cmd, s.out_basis, gout);
        if (rc != CLI_OK)
            goto done;
        if (s.out_basis == MCD_BASIS_MASS) {
            st = mcd_comp_mean_molar_mass_x(n, s.M, s.x, &Mbar);
            if (st != MCD_OK) {
                rc = cli_fail(cmd, "the mean molar mass", st, NULL);
                goto done;
            }
            conc = s.c * Mbar; /* rho [kg/m^3] */
        }
        st = mcd_fick_fluxes(n, s.n_dim, D, dep, conc, gout, flux);
        if (st != MCD_OK) {
            rc = cli_fail(cmd, "the fluxes from [D]", st, NULL);
            goto done;
        }
    }

    if (s.csv) {
        print_csv(&s, D, dep, re, im);
        fprintf(stderr, "%s\n", CLI_CAUTION_SHORT);
    } else if (s.json) {
        cli_json j;
        cli_json_init(&j, stdout);
        cli_json_object_begin(&j, NULL);
        cli_state_json_header(&s, &j);
        cli_state_json_binaries(&s, &j);
        cli_json_fick(&s, D, dep, &j);
        cli_json_object_begin(&j, "eigenvalues");
        cli_json_numbers(&j, "re", re, m);
        cli_json_numbers(&j, "im", im, m);
        cli_json_object_end(&j);
        if (flux)
            cli_json_fluxes(&s, flux, NULL, &j);
        else
            cli_json_null(&j, "fluxes");
        cli_json_string(&j, "caution", CLI_CAUTION_LONG);
        cli_json_object_end(&j);
        cli_json_finish(&j);
    } else {
        printf("%zu species at T = %.6g K, P = %.6g Pa, c = %.5g mol/m^3 "
               "(ideal gas)\n",
               n, s.T, s.P, s.c);
        printf("binary diffusivities:\n");
        cli_state_print_binaries(&s, stdout);
        cli_print_fick(&s, D, dep, stdout);
        printf("eigenvalues of [D] [m^2/s]:");
        for (i = 0; i < m; i++) {
            if (im[i] != 0.0)
                printf(" %.4e%+.4ei", re[i], im[i]);
            else
                printf(" %.4e", re[i]);
        }
        printf("\n");
        if (flux) {
            printf("fluxes from [D] (%s):\n", cli_flux_unit(s.out_basis));
            cli_print_fluxes(&s, flux, NULL, stdout);
        }
        printf("%s\n", CLI_CAUTION_SHORT);
    }
    rc = CLI_OK;
done:
    free(D);
    free(re);
    free(im);
    free(flux);
    free(gout);
    cli_state_free(&s);
    return rc;
}
