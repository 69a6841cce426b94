/* demo_scenario.c - an invented scenario that shows what libmcdiff does.
 *
 * DEMO ONLY: the lacquer, the film and every number below are made up for
 * illustration; nothing here is measured data.
 *
 * A lacquer wet with ethanol and ethyl acetate dries under a stream of
 * slightly humid nitrogen. We look at one point halfway through the gas
 * film above the lacquer, where both solvent vapours fall off towards the
 * stream while the humidity is the same everywhere (zero water gradient).
 * The binary diffusivities come from the built-in species table (Fuller-
 * Schettler-Giddings estimates); the fluxes are computed three ways:
 *   exact        the Maxwell-Stefan equations (mcd_flux_compute),
 *   mixture-avg  effective diffusivities with the zero-sum correction,
 *   naive Fick   J_i = -c D_i grad x_i with D_i the solute's binary
 *                diffusivity in nitrogen, and for nitrogen itself its
 *                Blanc average (1 - x_N2) / sum_j x_j / D_N2,j; no
 *                correction, so the fluxes need not sum to zero.
 * Uses only the public header.
 */
#include <math.h>
#include <stdio.h>
#include "mcdiff.h"
#include "demo_scenario.h"

#define NS 4
#define CARRIER 3 /* nitrogen */

static int check(FILE *err, const char *what, mcd_status st,
                 const mcd_workspace *ws)
{
    if (st == MCD_OK)
        return 0;
    fprintf(err, "demo: %s failed: %s", what, mcd_status_string((int)st));
    if (*mcd_last_error())
        fprintf(err, " (%s)", mcd_last_error());
    fputc('\n', err);
    return 1;
}

int demo_scenario_run(FILE *out, FILE *err)
{
    static const char *const names[NS] = {"ethanol", "ethyl-acetate", "water",
                                          "nitrogen"};
    static const char *const shortn[NS] = {"EtOH", "EtOAc", "H2O", "N2"};
    /* Invented state: 45 C, 1 atm; surface vapour fractions 0.06 (ethanol)
     * and 0.10 (ethyl acetate), none in the stream; humidity 0.02 on both
     * sides; film 2 mm thick; linear profiles, read at the midpoint. */
    const double T = 318.15, P = MCD_ATM, film = 2e-3;
    const double x[NS] = {0.03, 0.05, 0.02, 0.90};
    double grad[NS] = {-0.06 / film, -0.10 / film, 0.0, 0.0};
    double M[NS], D[NS * NS], rel[NS * NS], c;
    double J_ms[NS], J_ma[NS], J_fk[NS];
    unsigned warn[NS * NS], flags[NS], allwarn = 0;
    mcd_db *db = NULL;
    mcd_mixture *mix = NULL;
    mcd_workspace *ws = NULL;
    int rc = 1;
    size_t i, j;
    double sum_ms = 0, sum_ma = 0, sum_fk = 0, big = 0, dev = 0;

    grad[CARRIER] = -(grad[0] + grad[1] + grad[2]);

    if (check(err, "opening the species table", mcd_db_new_builtin(&db), NULL))
        goto done;
    if (mcd_mixture_new(db, NS, names, MCD_GAS_FSG, &mix) != MCD_OK) {
        fprintf(err, "demo: building the mixture failed: %s\n",
                mcd_last_error());
        goto done;
    }
    if (check(err, "molar masses", mcd_mixture_molar_masses(mix, M), NULL) ||
        check(err, "binary diffusivities",
              mcd_mixture_binaries(mix, T, P, D, rel, warn), NULL) ||
        check(err, "concentration", mcd_comp_ideal_gas_c(T, P, &c), NULL) ||
        check(err, "workspace", mcd_workspace_new(NS, &ws), NULL))
        goto done;
    if (check(err, "exact fluxes",
              mcd_flux_compute(ws, MCD_MODEL_MAXWELL_STEFAN,
                               &(mcd_state){.n_species = NS,
                                            .n_dim = 1,
                                            .M = M,
                                            .Dij = D,
                                            .c = c,
                                            .comp_basis = MCD_BASIS_MOLE,
                                            .comp = x,
                                            .grad = grad},
                               MCD_BASIS_MOLE, J_ms),
              ws) ||
        check(err, "mixture-averaged fluxes",
              mcd_flux_compute(ws, MCD_MODEL_MIXTURE_AVERAGED,
                               &(mcd_state){.n_species = NS,
                                            .n_dim = 1,
                                            .M = M,
                                            .Dij = D,
                                            .c = c,
                                            .comp_basis = MCD_BASIS_MOLE,
                                            .comp = x,
                                            .grad = grad},
                               MCD_BASIS_MOLE, J_ma),
              ws) ||
        check(err, "coupling diagnosis",
              mcd_flux_diagnose(NS, 1, grad, J_ms, 1e-3, flags), NULL))
        goto done;
    for (i = 0; i < NS; i++) {
        double Di;
        if (i != CARRIER) {
            Di = D[i * NS + CARRIER];
        } else {
            double s = 0.0;
            for (j = 0; j < NS; j++)
                if (j != i)
                    s += x[j] / D[i * NS + j];
            Di = (1.0 - x[i]) / s;
        }
        J_fk[i] = -c * Di * grad[i];
    }

    fprintf(out, "mcdiff demo - INVENTED scenario, made-up numbers, for "
                 "illustration only\n");
    fprintf(out,
            "A lacquer wet with ethanol and ethyl acetate dries under "
            "humid nitrogen at\n45 C and 1 atm. Midway through a 2 mm "
            "gas film (c = %.4g mol/m^3):\n",
            c);
    fprintf(out, "  %-14s %6s %12s\n", "species", "x", "dx/dz [1/m]");
    for (i = 0; i < NS; i++)
        fprintf(out, "  %-14s %6.3f %12.1f\n", names[i], x[i], grad[i]);
    fprintf(out,
            "Binary diffusivities D_ij [cm^2/s], %s estimates "
            "(typical error %.1f %%):\n",
            mcd_method_name(MCD_METHOD_FSG),
            100.0 * mcd_method_typical_error(MCD_METHOD_FSG));
    fprintf(out, "  %-6s", "");
    for (j = 0; j < NS; j++)
        fprintf(out, " %7s", shortn[j]);
    fputc('\n', out);
    for (i = 0; i < NS; i++) {
        fprintf(out, "  %-6s", shortn[i]);
        for (j = 0; j < NS; j++) {
            if (i == j)
                fprintf(out, " %7s", "-");
            else
                fprintf(out, " %7.4f", D[i * NS + j] * 1e4);
            allwarn |= warn[i * NS + j];
        }
        fputc('\n', out);
    }
    fprintf(out, "Molar diffusion fluxes J_i [mmol/(m^2 s)], + = away from "
                 "the lacquer:\n");
    fprintf(out, "  %-14s %12s %12s %12s\n", "species", "exact M-S",
            "mixture-avg", "naive Fick");
    for (i = 0; i < NS; i++) {
        fprintf(out, "  %-14s %12.4f %12.4f %12.4f\n", names[i],
                1e3 * J_ms[i] + 0.0, 1e3 * J_ma[i] + 0.0, 1e3 * J_fk[i] + 0.0);
        sum_ms += J_ms[i];
        sum_ma += J_ma[i];
        sum_fk += J_fk[i];
        if (fabs(J_ms[i]) > big)
            big = fabs(J_ms[i]);
        if (fabs(J_ma[i] - J_ms[i]) > dev)
            dev = fabs(J_ma[i] - J_ms[i]);
    }
    fprintf(out, "  %-14s %12.1e %12.1e %12.1e   <- zero-sum\n", "sum",
            1e3 * sum_ms, 1e3 * sum_ma, 1e3 * sum_fk);
    for (i = 0; i < NS; i++) {
        if (flags[i] & MCD_DIAG_OSMOTIC)
            fprintf(out,
                    "Coupling: %s diffuses with no gradient of its own "
                    "(osmotic diffusion).\n",
                    names[i]);
        if (flags[i] & MCD_DIAG_REVERSE)
            fprintf(out,
                    "Coupling: %s diffuses up its own gradient (reverse "
                    "diffusion).\n",
                    names[i]);
        if (flags[i] & MCD_DIAG_BARRIER)
            fprintf(out,
                    "Coupling: %s does not move despite its gradient "
                    "(diffusion barrier).\n",
                    names[i]);
    }
    fprintf(out,
            "Mixture-averaged differs from exact by up to %.1f %% of "
            "the largest flux;\nthe naive Fick fluxes miss the coupling "
            "and leave %.2g mmol/(m^2 s) unbalanced.\n",
            big > 0 ? 100.0 * dev / big : 0.0, 1e3 * sum_fk);
    if (allwarn) {
        unsigned b;
        fprintf(out, "Estimate warnings:");
        for (b = 1; b != 0 && b <= allwarn; b <<= 1)
            if (allwarn & b)
                fprintf(out, " [%s]", mcd_warning_string(b));
        fputc('\n', out);
    }
    fprintf(out, "Caution: estimates carry typical errors; they do not "
                 "replace validated data,\nlocal codes or licensed "
                 "engineering review.\n");
    rc = 0;
done:
    mcd_workspace_free(ws);
    mcd_mixture_free(mix);
    mcd_db_free(db);
    return rc;
}
