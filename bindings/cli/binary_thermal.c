/* binary_thermal.c - `mcdiff binary --thermal-factor X_A`: the pair's
 * thermal diffusion factor alpha_T from kinetic theory (first
 * Chapman-Enskog approximation, mcd_db_thermal_factor), printed with its
 * typical error and the caution that thermal diffusion estimates are far
 * less accurate than diffusivities. */
#include <math.h>
#include <stdio.h>
#include "cli.h"

#define THERMAL_CAUTION                                                        \
    "Thermal diffusion estimates are far less accurate than diffusivity "      \
    "estimates (the first Chapman-Enskog approximation with Lennard-Jones "    \
    "parameters; worse for polyatomic and polar gases, and the sign "          \
    "reverses at low reduced temperatures); use measured values where the "    \
    "effect matters to a design."

int cli_thermal_factor_estimate(const char *cmd, const mcd_db *db, size_t a,
                                size_t b, double T, cli_thermal_factor *out)
{
    mcd_status st = mcd_db_thermal_factor(db, a, b, T, out->x_a, &out->alpha,
                                          &out->rel_err, &out->warn);
    if (st != MCD_OK)
        return cli_fail(cmd, "estimating the thermal diffusion factor", st,
                        mcd_db_name(db, a));
    return CLI_OK;
}

void cli_thermal_factor_text(const cli_thermal_factor *t, const char *name_a,
                             FILE *f)
{
    char w[256];
    const double xb = 1.0 - t->x_a;
    fprintf(f,
            "  thermal diffusion (first Chapman-Enskog approximation, "
            "Lennard-Jones):\n"
            "    alpha_T = %.4g at x_A = %.4g, k_T = x_A x_B alpha_T = %.4g, "
            "typical error %.0f %%\n",
            t->alpha, t->x_a, t->x_a * xb * t->alpha, 100.0 * t->rel_err);
    if (t->alpha != 0.0)
        fprintf(f, "    %s moves to the %s side\n", name_a,
                t->alpha > 0.0 ? "cold" : "hot");
    cli_warn_text(t->warn, w, sizeof w);
    if (w[0] != '\0')
        fprintf(f, "  warning (alpha_T): %s\n", w);
    fputs("  Caution: thermal diffusion estimates are far less accurate than "
          "diffusivity\n"
          "  estimates (worse for polyatomic and polar gases; the sign "
          "reverses at low\n"
          "  reduced temperatures); use measured values where the effect "
          "matters.\n",
          f);
}

void cli_thermal_factor_json(cli_json *j, const cli_thermal_factor *t)
{
    unsigned bit;
    cli_json_object_begin(j, "thermal_diffusion");
    cli_json_number(j, "x_A", t->x_a);
    cli_json_number(j, "alpha_T", t->alpha);
    cli_json_number(j, "k_T", t->x_a * (1.0 - t->x_a) * t->alpha);
    cli_json_number(j, "typical_error", t->rel_err);
    cli_json_string(j, "method",
                    "first Chapman-Enskog approximation, "
                    "Lennard-Jones 12-6");
    cli_json_array_begin(j, "warnings");
    for (bit = 1; bit != 0 && bit <= t->warn; bit <<= 1)
        if (t->warn & bit)
            cli_json_string(j, NULL, mcd_warning_string(bit));
    cli_json_array_end(j);
    cli_json_string(j, "caution", THERMAL_CAUTION);
    cli_json_object_end(j);
}
