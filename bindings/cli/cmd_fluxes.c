/* cmd_fluxes.c - `mcdiff fluxes`: diffusion fluxes of N species at one
 * state, with the zero-sum residual, coupling flags and the Fick matrix. */
#include <math.h>
#include <stdio.h>
#include <stdlib.h>
#include "cli.h"

static void help(FILE *f)
{
    fputs(
        "usage: mcdiff fluxes -s A,B,C -x XA,XB,XC -g GA,GB,GC [-g ...]\n"
        "                     -T TEMP -P PRES [options]\n"
        "\n"
        "Diffusion fluxes of every species of an ideal-gas mixture at one\n"
        "state, relative to the molar-average velocity (mole basis) or the\n"
        "mass-average velocity (mass basis), with their zero-sum residual,\n"
        "coupling flags and the exact generalized Fick matrix.\n"
        "\n"
        "options (lists are comma-separated, one value per species, in the\n"
        "order of -s):\n"
        "  -s, --species LIST        species names or formulas (2 or more)\n"
        "  -x, --mole-fractions LIST mole fractions [-], sum 1\n"
        "  -w, --mass-fractions LIST mass fractions [-], sum 1 (instead of "
        "-x;\n"
        "                            -g is then in mass fractions too)\n"
        "  -g, --gradient LIST       gradients of the fractions [1/m]; repeat\n"
        "                            once per direction (1 to 3)\n"
        "  -T, --temperature TEMP    K or C suffix (also F), bare = K\n"
        "  -P, --pressure PRES       Pa, kPa, MPa, bar, atm or psi, bare = Pa\n"
        "  --model NAME              exact (Maxwell-Stefan, default) or\n"
        "                            mixture-averaged\n"
        "  --basis NAME              fluxes as mole (J_i [mol/(m^2 s)]) or\n"
        "                            mass (j_i [kg/(m^2 s)]); default: the\n"
        "                            basis of the composition\n" CLI_METHOD_HELP
        "  --pair A:B=D[@T,P]        binary diffusivity of a pair [m^2/s, or\n"
        "                            cm2/s suffix], valid at this state or\n"
        "                            measured at T,P (scaled as T^1.75/P);\n"
        "                            repeat per pair, the rest are estimated\n"
        "  --grad-lnp LIST           gradient of ln P [1/m], one value per\n"
        "                            direction (pressure diffusion)\n"
        "  --thermal-ratios LIST     thermal diffusion ratios k_T [-], one\n"
        "                            per species, summing to 0 (k_T > 0:\n"
        "                            the species moves to the cold side),\n"
        "                            or `estimate': kinetic theory (first\n"
        "                            Chapman-Enskog approximation, pairwise;\n"
        "                            typical error 20-30 %, far less\n"
        "                            accurate than the diffusivities)\n"
        "  --temperature-gradient LIST\n"
        "                            dT/dz [K/m], one value per direction;\n"
        "                            with --thermal-ratios (both or "
        "neither)\n"
        "  --dependent NAME          species left out of the Fick matrix\n"
        "                            (default: the most abundant)\n"
        "  --json                    one JSON object (SI): fluxes under\n"
        "                            \"fluxes\", Fick matrix under "
        "\"fick_matrix\"\n"
        "  --csv                     the flux table as CSV: header row\n"
        "                            species,x,dx_dz1_per_m,...,\n"
        "                            J_1_mol_per_m2_s,...,flags; one row per\n"
        "                            species (SI; the caution goes to stderr)\n"
        "  --species-file FILE       also load species from FILE\n"
        "  -h, --help                this text\n"
        "\n"
        "example:\n"
        "  mcdiff fluxes -s H2,N2,CO2 -x 0.3,0.4,0.3 -g -20,0,20 -T 35C -P "
        "1atm \\\n"
        "      --pair H2:N2=8.38e-5\n",
        f);
}

/* The estimated thermal diffusion ratios, with their caution: kinetic
 * theory's k_T are far less accurate than the diffusivities. */
static void thermal_note(const cli_state *s)
{
    char w[256];
    size_t i;
    printf("  (including thermal diffusion; k_T estimated by kinetic theory, "
           "first Chapman-Enskog\n   approximation, pairwise: typical error "
           "%.0f %%, far less accurate than the\n   diffusivities; use "
           "measured values where they matter)\n  k_T:",
           100.0 * s->kT_rel_err);
    for (i = 0; i < s->n; i++)
        printf(" %s %.4g%s", s->names[i], s->kT[i], i + 1 < s->n ? "," : "\n");
    cli_warn_text(s->kT_warn, w, sizeof w);
    if (w[0] != '\0')
        printf("  warning (k_T): %s\n", w);
}

int cli_cmd_fluxes(int argc, char **argv)
{
    const char *cmd = "fluxes";
    cli_state s;
    int rc;
    double *flux = NULL, *gout = NULL, *D = NULL, glnT[MCD_MAX_DIM];
    unsigned *flags = NULL;
    size_t dep = 0, n;
    mcd_status st;

    rc = cli_state_parse(&s, cmd, argc, argv, 1, help);
    if (rc != CLI_OK) {
        cli_state_free(&s);
        return rc < 0 ? CLI_OK : rc;
    }
    rc = cli_state_setup(&s, cmd);
    if (rc != CLI_OK)
        goto done;
    n = s.n;
    flux = malloc(n * s.n_dim * sizeof *flux);
    gout = malloc(n * s.n_dim * sizeof *gout);
    D = malloc((n - 1) * (n - 1) * sizeof *D);
    flags = calloc(n, sizeof *flags);
    if (!flux || !gout || !D || !flags) {
        rc = cli_fail(cmd, "setting up", MCD_ENOMEM, NULL);
        goto done;
    }
    for (dep = 0; dep < s.n_dim; dep++) /* grad ln T = (dT/dz) / T */
        glnT[dep] = s.have_dTdz ? s.dTdz[dep] / s.T : 0.0;
    dep = 0;
    st = mcd_flux_compute(
        s.ws, s.model,
        &(mcd_state){.n_species = n,
                     .n_dim = s.n_dim,
                     .M = s.M,
                     .Dij = s.Dij,
                     .c = s.c,
                     .comp_basis = s.comp_basis,
                     .comp = s.comp,
                     .grad = s.grad,
                     .grad_lnP = s.have_grad_lnP ? s.grad_lnP : NULL,
                     .kT = s.have_kT ? s.kT : NULL,
                     .grad_lnT = s.have_kT ? glnT : NULL},
        s.out_basis, flux);
    if (st != MCD_OK) {
        rc = cli_fail(cmd, "the flux computation", st, mcd_last_error());
        goto done;
    }
    /* Flags compare each flux with the gradient in the same basis. */
    rc = cli_state_grad_in(&s, cmd, s.out_basis, gout);
    if (rc != CLI_OK)
        goto done;
    st = mcd_flux_diagnose(n, s.n_dim, gout, flux, 1e-3, flags);
    if (st != MCD_OK) {
        rc = cli_fail(cmd, "the coupling diagnosis", st, NULL);
        goto done;
    }
    rc = cli_state_fick(&s, cmd, D, &dep);
    if (rc != CLI_OK)
        goto done;

    if (s.csv) {
        cli_csv_fluxes(&s, flux, flags, stdout);
        fprintf(stderr, "%s\n", CLI_CAUTION_SHORT);
    } else if (s.json) {
        cli_json j;
        size_t i;
        cli_json_init(&j, stdout);
        cli_json_object_begin(&j, NULL);
        cli_state_json_header(&s, &j);
        cli_json_string(
            &j, "model",
            s.model == MCD_MODEL_MAXWELL_STEFAN ? "exact" : "mixture-averaged");
        cli_json_string(&j, "composition_basis",
                        s.comp_basis == MCD_BASIS_MOLE ? "mole" : "mass");
        cli_json_array_begin(&j, "gradients");
        for (i = 0; i < n; i++)
            cli_json_numbers(&j, NULL, s.grad + i * s.n_dim, s.n_dim);
        cli_json_array_end(&j);
        if (s.have_grad_lnP)
            cli_json_numbers(&j, "grad_lnP", s.grad_lnP, s.n_dim);
        if (s.have_kT) {
            cli_json_numbers(&j, "thermal_ratios", s.kT, n);
            cli_json_bool(&j, "thermal_ratios_estimated", s.kT_estimated);
            if (s.kT_estimated) {
                char w[256];
                cli_json_number(&j, "thermal_ratios_typical_error",
                                s.kT_rel_err);
                cli_warn_text(s.kT_warn, w, sizeof w);
                cli_json_string(&j, "thermal_ratios_warnings", w);
            }
            cli_json_numbers(&j, "temperature_gradient_K_per_m", s.dTdz,
                             s.n_dim);
            cli_json_numbers(&j, "grad_lnT", glnT, s.n_dim);
        }
        cli_state_json_binaries(&s, &j);
        cli_json_fluxes(&s, flux, flags, &j);
        cli_json_fick(&s, D, dep, &j);
        cli_json_string(&j, "caution", CLI_CAUTION_LONG);
        cli_json_object_end(&j);
        cli_json_finish(&j);
    } else {
        printf("%zu species at T = %.6g K, P = %.6g Pa, c = %.5g mol/m^3 "
               "(ideal gas)\n",
               n, s.T, s.P, s.c);
        printf("binary diffusivities:\n");
        cli_state_print_binaries(&s, stdout);
        printf("%s diffusion fluxes, %s:\n",
               s.model == MCD_MODEL_MAXWELL_STEFAN ? "exact Maxwell-Stefan"
                                                   : "mixture-averaged",
               s.out_basis == MCD_BASIS_MOLE
                   ? "molar, relative to the molar-average velocity"
                   : "mass, relative to the mass-average velocity");
        if (s.have_grad_lnP)
            printf("  (including pressure diffusion)\n");
        if (s.have_kT && s.kT_estimated)
            thermal_note(&s);
        else if (s.have_kT)
            printf("  (including thermal diffusion, the given k_T; the flags "
                   "compare with the composition gradients only)\n");
        cli_print_fluxes(&s, flux, flags, stdout);
        cli_print_fick(&s, D, dep, stdout);
        printf("%s\n", CLI_CAUTION_SHORT);
    }
    rc = CLI_OK;
done:
    free(flux);
    free(gout);
    free(D);
    free(flags);
    cli_state_free(&s);
    return rc;
}
