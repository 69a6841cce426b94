/*
 * consumer.c - a program outside the mcdiff build, compiled against an
 * installed copy (pkg-config or CMake find_package) by run_install_test.sh.
 * Exit 0 when the installed header and library work together.
 */
#include <mcdiff.h>

#include <math.h>
#include <stdio.h>
#include <string.h>

static int failures;

static void check(int ok, const char *what)
{
    if (!ok) {
        failures++;
        fprintf(stderr, "consumer: FAIL: %s\n", what);
    }
}

int main(void)
{
    mcd_db *db = NULL;
    mcd_mixture *mix = NULL;
    mcd_workspace *ws = NULL;
    const char *names[3] = {"hydrogen", "nitrogen", "carbon-dioxide"};
    double D[9], x[3] = {0.2, 0.5, 0.3};
    double grad[6] = {12.0, -4.0, -20.0,
                      1.0,  8.0,  3.0}; /* 3 species x 2 dims */
    double J[6], c, Dco2, err = 0.0;
    size_t ico2 = 0, in2 = 0;
    char msg[256];
    int d;

    /* header and library come from the same installation */
    check(mcd_version_number() == MCD_VERSION_NUMBER,
          "runtime version equals the installed header's");

    check(mcd_db_new_builtin(&db) == MCD_OK, "built-in database");
    check(mcd_db_find(db, "carbon-dioxide", &ico2) == MCD_OK, "find CO2");
    check(mcd_db_find(db, "nitrogen", &in2) == MCD_OK, "find N2");
    /* CO2-N2, 298.2 K, 1 atm: 0.165 cm^2/s measured (Bird, Stewart and
     * Lightfoot 2002, Table 17.1-1); the estimate must be within the
     * method's own typical error. */
    check(mcd_db_binary_gas(db, ico2, in2, MCD_METHOD_FSG, 298.2, MCD_ATM,
                            &Dco2, &err, NULL) == MCD_OK,
          "FSG CO2-N2");
    check(fabs(Dco2 - 0.165e-4) <= err * 0.165e-4,
          "FSG CO2-N2 within the typical error of 0.165 cm^2/s");

    /* ternary fluxes sum to zero (to round-off of three terms) */
    check(mcd_mixture_new(db, 3, names, MCD_METHOD_FSG, &mix) == MCD_OK,
          "mixture");
    check(mcd_mixture_binaries(mix, 300.0, MCD_ATM, D, NULL, NULL) == MCD_OK,
          "binaries");
    check(mcd_comp_ideal_gas_c(300.0, MCD_ATM, &c) == MCD_OK, "ideal gas c");
    check(mcd_workspace_new(3, &ws) == MCD_OK, "workspace");
    check(mcd_flux_compute(ws, MCD_MODEL_MAXWELL_STEFAN,
                           &(mcd_state){.n_species = 3,
                                        .n_dim = 2,
                                        .Dij = D,
                                        .c = c,
                                        .comp_basis = MCD_BASIS_MOLE,
                                        .comp = x,
                                        .grad = grad},
                           MCD_BASIS_MOLE, J) == MCD_OK,
          "fluxes");
    for (d = 0; d < 2; d++) {
        double s = J[d] + J[2 + d] + J[4 + d];
        double m = fmax(fabs(J[d]), fmax(fabs(J[2 + d]), fabs(J[4 + d])));
        check(fabs(s) <= 1e-13 * m, "fluxes sum to zero");
    }

    mcd_workspace_free(ws);
    mcd_mixture_free(mix);
    mcd_db_free(db);
    if (failures == 0)
        printf("consumer OK: mcdiff %s, D(CO2-N2) = %.4g m^2/s\n",
               mcd_version_string(), Dco2);
    return failures == 0 ? 0 : 1;
}
