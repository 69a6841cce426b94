/* explain.c - `mcdiff binary --explain`: the intermediates of an estimate
 * (mcd_db_binary_explain) printed so that an engineer can redo the estimate
 * by hand, each method's formula in its usual practical units; and the
 * same slots as a JSON object. */
#include <math.h>
#include <stdio.h>
#include "cli.h"

/* JSON key of each named slot, in MCD_EXPLAIN_* order (SI units). */
static const char *const slot_keys[MCD_EXPLAIN_RESERVED] = {"D",
                                                            "T",
                                                            "P",
                                                            "M_A",
                                                            "M_B",
                                                            "M_AB",
                                                            "V_A",
                                                            "V_B",
                                                            "V_roots",
                                                            "sigma_A",
                                                            "sigma_B",
                                                            "sigma_AB",
                                                            "eps_A_over_k",
                                                            "eps_B_over_k",
                                                            "eps_AB_over_k",
                                                            "T_star",
                                                            "Omega_D",
                                                            "wilke_lee_factor",
                                                            "phi",
                                                            "mu_B",
                                                            "Vb_A",
                                                            "published_error",
                                                            "typical_error",
                                                            "warning_bits",
                                                            "lj_estimated",
                                                            "delta_A",
                                                            "delta_B",
                                                            "delta_AB"};

void cli_explain_json(cli_json *j, const double *v)
{
    size_t k;
    cli_json_object_begin(j, "explain");
    for (k = 0; k < MCD_EXPLAIN_RESERVED; k++)
        if (!isnan(v[k]))
            cli_json_number(j, slot_keys[k], v[k]);
    cli_json_object_end(j);
}

/* One row: what, x with prec significant digits, unit. */
static void row(cli_table *t, const char *what, int prec, double x,
                const char *unit)
{
    char num[48];
    const char *cells[3];
    snprintf(num, sizeof num, "%.*g", prec, x);
    cells[0] = what;
    cells[1] = num;
    cells[2] = unit;
    cli_table_row(t, cells);
}

/* Rows shared by the gas methods: molar masses and M_AB in g/mol. */
static void rows_masses(cli_table *t, const double *v)
{
    row(t, "M_A", 6, 1e3 * v[MCD_EXPLAIN_M_A], "g/mol");
    row(t, "M_B", 6, 1e3 * v[MCD_EXPLAIN_M_B], "g/mol");
    row(t, "M_AB = 2 / (1/M_A + 1/M_B)", 6, 1e3 * v[MCD_EXPLAIN_M_AB], "g/mol");
}

static void rows_lj(cli_table *t, const double *v, int brokaw)
{
    if (brokaw) {
        row(t, "delta_A = 1.94e3 mu_p^2 / (Vb Tb)", 4, v[MCD_EXPLAIN_DELTA_A],
            "");
        row(t, "delta_B", 4, v[MCD_EXPLAIN_DELTA_B], "");
        row(t, "delta_AB = (delta_A delta_B)^(1/2)", 4, v[MCD_EXPLAIN_DELTA_AB],
            "");
    }
    row(t, "sigma_A", 5, 1e10 * v[MCD_EXPLAIN_SIGMA_A], "Angstrom");
    row(t, "sigma_B", 5, 1e10 * v[MCD_EXPLAIN_SIGMA_B], "Angstrom");
    row(t,
        brokaw ? "sigma_AB = (sigma_A sigma_B)^(1/2)"
               : "sigma_AB = (sigma_A + sigma_B) / 2",
        5, 1e10 * v[MCD_EXPLAIN_SIGMA_AB], "Angstrom");
    row(t, "eps_A/k", 5, v[MCD_EXPLAIN_EPS_A], "K");
    row(t, "eps_B/k", 5, v[MCD_EXPLAIN_EPS_B], "K");
    row(t, "eps_AB/k = sqrt(eps_A eps_B) / k", 5, v[MCD_EXPLAIN_EPS_AB], "K");
    row(t, "T* = T / (eps_AB/k)", 5, v[MCD_EXPLAIN_T_STAR], "");
    row(t,
        brokaw ? "Omega_D(T*) + 0.19 delta_AB^2 / T*"
               : "Omega_D(T*) (Neufeld et al. 1972)",
        5, v[MCD_EXPLAIN_OMEGA_D], "");
}

/* The method's formula in practical units, evaluated from the printed
 * slots; returns the hand value in cm^2/s. */
static double formula(mcd_method m, const double *v, FILE *f)
{
    double T = v[MCD_EXPLAIN_T], Pbar = v[MCD_EXPLAIN_P] / 1e5;
    double Mab = 1e3 * v[MCD_EXPLAIN_M_AB], s = 1e10 * v[MCD_EXPLAIN_SIGMA_AB];
    double S = v[MCD_EXPLAIN_V_ROOTS];
    switch (m) {
    case MCD_METHOD_FSG:
        /* 1.00e-3 sqrt(2) (1.01325 bar/atm) = 1.4330e-3 */
        fputs("    D [cm^2/s] = 1.4330e-3 T^1.75 / (P[bar] M_AB^(1/2) S^2)"
              "  (Fuller et al. 1966)\n",
              f);
        return 1.4330e-3 * pow(T, 1.75) / (Pbar * sqrt(Mab) * S * S);
    case MCD_METHOD_CHAPMAN_ENSKOG:
        fputs("    D [cm^2/s] = 2.6635e-3 T^1.5 / (P[bar] M_AB^(1/2) "
              "sigma_AB^2 Omega_D)  (first Chapman-Enskog approximation)\n",
              f);
        return 2.6635e-3 * pow(T, 1.5) /
               (Pbar * sqrt(Mab) * s * s * v[MCD_EXPLAIN_OMEGA_D]);
    case MCD_METHOD_BROKAW:
        fputs("    D [cm^2/s] = 2.6635e-3 T^1.5 / (P[bar] M_AB^(1/2) "
              "sigma_AB^2 Omega_D)  (Brokaw 1969: sigma, eps/k from Vb, Tb "
              "and the dipole; sigma_AB geometric mean; Omega_D includes "
              "+ 0.19 delta_AB^2 / T*)\n",
              f);
        return 2.6635e-3 * pow(T, 1.5) /
               (Pbar * sqrt(Mab) * s * s * v[MCD_EXPLAIN_OMEGA_D]);
    case MCD_METHOD_WILKE_LEE:
        fputs("    D [cm^2/s] = F 1e-3 T^1.5 / (P[bar] M_AB^(1/2) sigma_AB^2 "
              "Omega_D)  (Wilke and Lee 1955)\n",
              f);
        return v[MCD_EXPLAIN_WL_FACTOR] * 1e-3 * pow(T, 1.5) /
               (Pbar * sqrt(Mab) * s * s * v[MCD_EXPLAIN_OMEGA_D]);
    case MCD_METHOD_WILKE_CHANG:
        fputs("    D [cm^2/s] = 7.4e-8 (phi M_B)^(1/2) T / (mu_B[cP] "
              "V_A^0.6)  (Wilke and Chang 1955)\n",
              f);
        return 7.4e-8 * sqrt(v[MCD_EXPLAIN_PHI] * 1e3 * v[MCD_EXPLAIN_M_B]) *
               T /
               (1e3 * v[MCD_EXPLAIN_MU_B] *
                pow(1e6 * v[MCD_EXPLAIN_VB_A], 0.6));
    default: return (double)NAN;
    }
}

void cli_explain_text(mcd_method m, const double *v, FILE *f)
{
    cli_table t;
    double hand;
    cli_table_init(&t, 3);
    t.right[1] = 1;
    fprintf(f, "  by hand, %s:\n", mcd_method_name(m));
    row(&t, "T", 6, v[MCD_EXPLAIN_T], "K");
    if (m == MCD_METHOD_WILKE_CHANG) {
        row(&t, "phi (association factor of B)", 4, v[MCD_EXPLAIN_PHI], "");
        row(&t, "M_B", 6, 1e3 * v[MCD_EXPLAIN_M_B], "g/mol");
        row(&t, "mu_B", 5, 1e3 * v[MCD_EXPLAIN_MU_B], "cP");
        row(&t, "V_A (molar volume at the boiling point)", 5,
            1e6 * v[MCD_EXPLAIN_VB_A], "cm^3/mol");
    } else {
        row(&t, "P", 6, v[MCD_EXPLAIN_P] / 1e5, "bar");
        rows_masses(&t, v);
    }
    if (m == MCD_METHOD_FSG) {
        row(&t, "V_A (diffusion volume)", 5, v[MCD_EXPLAIN_V_A], "");
        row(&t, "V_B (diffusion volume)", 5, v[MCD_EXPLAIN_V_B], "");
        row(&t, "S = V_A^(1/3) + V_B^(1/3)", 6, v[MCD_EXPLAIN_V_ROOTS], "");
    } else if (m != MCD_METHOD_WILKE_CHANG) {
        rows_lj(&t, v, m == MCD_METHOD_BROKAW);
        if (m == MCD_METHOD_WILKE_LEE)
            row(&t, "F = 3.03 - 0.98 / M_AB^(1/2)", 5, v[MCD_EXPLAIN_WL_FACTOR],
                "");
    }
    cli_table_print(&t, f, "    ");
    cli_table_free(&t);
    hand = formula(m, v, f);
    fprintf(f,
            "    = %.5g cm^2/s by hand from the rounded constant; the "
            "estimate is %.5g cm^2/s\n",
            hand, 1e4 * v[MCD_EXPLAIN_D]);
    if (v[MCD_EXPLAIN_ESTIMATED] == 1.0)
        fputs("    (Lennard-Jones parameters estimated: sigma = 1.18 "
              "Vb^(1/3), eps/k = 1.15 Tb)\n",
              f);
}
