/* cmd_binary.c - `mcdiff binary A B`: estimates of one binary diffusivity. */
#include <math.h>
#include <stdio.h>
#include <string.h>
#include "cli.h"

static void help(FILE *f)
{
    fputs(
        "usage: mcdiff binary A B -T TEMP -P PRES [--method NAME] "
        "[--explain]\n"
        "                     [--thermal-factor X_A] [--json|--csv]\n"
        "\n"
        "Binary diffusivity of species A and B (names or formulas from\n"
        "'mcdiff species') estimated by every method that applies, or by the\n"
        "one named, each with its typical error and warnings. Without\n"
        "--method, the first method that applies (in the order fsg,\n"
        "chapman-enskog, wilke-lee, brokaw) is marked recommended; when a\n"
        "species is polar (dipole above 1 debye) brokaw is, if it applies.\n"
        "The typical error is the method's published average widened by\n"
        "its warnings (x2 for each polar, associating, quantum-gas or\n"
        "high-pressure warning, x1.5 for each temperature or\n"
        "estimated-parameter warning, at most 100 %; a rule of thumb).\n"
        "\n"
        "options:\n"
        "  -T, --temperature TEMP  temperature; K or C suffix (also F), bare = "
        "K\n"
        "                          (298.15, 298.15K, 25C)\n"
        "  -P, --pressure PRES     pressure; Pa, kPa, MPa, bar, atm or psi "
        "suffix,\n"
        "                          bare = Pa (101325, 1atm, 1.01325bar);\n"
        "                          not used for liquids\n"
        "  -m, --method NAME       fsg, chapman-enskog, wilke-lee, brokaw "
        "or\n"
        "                          wilke-chang (liquid: A dilute in solvent "
        "B,\n"
        "                          needs --viscosity)\n"
        "  --viscosity MU          liquid solvent B's viscosity at TEMP; "
        "selects\n"
        "                          wilke-chang; Pa.s, mPa.s or cP suffix,\n"
        "                          bare = Pa.s\n"
        "  --explain               also show the intermediates of each\n"
        "                          estimate (M_AB, diffusion volumes, "
        "sigma_AB,\n"
        "                          eps_AB/k, T*, Omega_D, phi, ...) and its\n"
        "                          formula, to check it by hand; JSON: an\n"
        "                          \"explain\" object per result (SI)\n"
        "  --thermal-factor X_A    also estimate the pair's thermal "
        "diffusion\n"
        "                          factor alpha_T at mole fraction X_A of A\n"
        "                          (0..1; first Chapman-Enskog "
        "approximation,\n"
        "                          Lennard-Jones; alpha_T > 0: A moves to "
        "the\n"
        "                          cold side); typical error 20 % or more, "
        "far\n"
        "                          less accurate than D; gases, text and "
        "JSON\n"
        "                          (\"thermal_diffusion\" object)\n"
        "  --json                  one JSON object; D in m^2/s under \"D\"\n"
        "  --csv                   one row per method, SI: header\n"
        "                          "
        "species_a,species_b,T_K,P_Pa,method,status,\n"
        "                          "
        "D_m2_per_s,typical_error,published_error,\n"
        "                          recommended,warnings\n"
        "  --species-file FILE     also load species from FILE\n"
        "  -h, --help              this text\n"
        "\n"
        "examples:\n"
        "  mcdiff binary carbon-dioxide nitrogen -T 25C -P 1atm\n"
        "  mcdiff binary H2 N2 -T 350 -P 2bar --method chapman-enskog --json\n"
        "  mcdiff binary CO2 N2 -T 590 -P 1bar --method chapman-enskog "
        "--explain\n"
        "  mcdiff binary ethanol water -T 25C --viscosity 0.89cP\n",
        f);
}

typedef struct result {
    mcd_method m;
    mcd_status st;
    double D, rel_err, pub_err; /* stated (widened) and published error */
    unsigned warn;
    double ex[MCD_EXPLAIN_COUNT]; /* --explain: mcd_db_binary_explain */
} result;

static void json_warnings(cli_json *j, unsigned bits)
{
    unsigned b;
    cli_json_array_begin(j, "warnings");
    for (b = 1; b != 0 && b <= bits; b <<= 1)
        if (bits & b)
            cli_json_string(j, NULL, mcd_warning_string(b));
    cli_json_array_end(j);
}

/* The method the library recommends for the pair (the per-pair rule of
 * MCD_GAS_RECOMMENDED, read back from a mixture of the two), or 0 when
 * it cannot tell (the same species twice). */
static mcd_method recommended(const mcd_db *db, const size_t idx[2])
{
    const char *names[2] = {mcd_db_name(db, idx[0]), mcd_db_name(db, idx[1])};
    mcd_mixture *mix = NULL;
    mcd_method m = (mcd_method)0;
    if (idx[0] != idx[1] &&
        mcd_mixture_new(db, 2, names, MCD_GAS_RECOMMENDED, &mix) == MCD_OK &&
        mcd_mixture_pair_method(mix, 0, 1, &m) != MCD_OK)
        m = (mcd_method)0;
    mcd_mixture_free(mix);
    return m;
}

int cli_cmd_binary(int argc, char **argv)
{
    enum {
        O_T = 1,
        O_P,
        O_METHOD,
        O_VISC,
        O_JSON,
        O_HELP,
        O_FILE,
        O_CSV,
        O_EXPLAIN,
        O_THERMAL
    };
    static const cli_opt opts[] = {{"temperature", 'T', 1, O_T},
                                   {"pressure", 'P', 1, O_P},
                                   {"method", 'm', 1, O_METHOD},
                                   {"viscosity", 0, 1, O_VISC},
                                   {"json", 0, 0, O_JSON},
                                   {"csv", 0, 0, O_CSV},
                                   {"explain", 0, 0, O_EXPLAIN},
                                   {"help", 'h', 0, O_HELP},
                                   {"species-file", 0, 1, O_FILE},
                                   {"thermal-factor", 0, 1, O_THERMAL},
                                   {NULL, 0, 0, 0}};
    static const mcd_method gas_methods[] = {
        MCD_METHOD_FSG, MCD_METHOD_CHAPMAN_ENSKOG, MCD_METHOD_WILKE_LEE,
        MCD_METHOD_BROKAW};
    const char *cmd = "binary";
    cli_args a;
    int id, json = 0, csv = 0, rc, have_method = 0, best = -1, liquid;
    int explain = 0, widened = 0, recommend, thermal = 0;
    cli_thermal_factor tf = {0};
    const char *names[2] = {NULL, NULL}, *file = NULL;
    size_t npos = 0, idx[2], k, nres = 0;
    double T = (double)NAN, P = (double)NAN, mu = (double)NAN;
    mcd_method method = MCD_METHOD_FSG;
    mcd_db *db = NULL;
    result res[5];
    char why[200], note[400] = "";

    cli_args_init(&a, cmd, argc, argv, opts);
    while ((id = cli_args_next(&a)) != CLI_ARG_END) {
        switch (id) {
        case CLI_ARG_ERROR: return CLI_USAGE;
        case O_HELP: help(stdout); return CLI_OK;
        case O_JSON: json = 1; break;
        case O_CSV: csv = 1; break;
        case O_EXPLAIN: explain = 1; break;
        case O_FILE: file = a.value; break;
        case O_THERMAL:
            if (cli_parse_number(a.value, &tf.x_a, why, sizeof why) != 0)
                return cli_usage_error(cmd, a.spelled, "%s", why);
            if (!(tf.x_a >= 0.0 && tf.x_a <= 1.0))
                return cli_usage_error(cmd, a.spelled,
                                       "%s is not a mole fraction in [0, 1]",
                                       a.value);
            thermal = 1;
            break;
        case O_T:
            if (cli_parse_temperature(a.value, &T, why, sizeof why) != 0)
                return cli_usage_error(cmd, a.spelled, "%s", why);
            break;
        case O_P:
            if (cli_parse_pressure(a.value, &P, why, sizeof why) != 0)
                return cli_usage_error(cmd, a.spelled, "%s", why);
            break;
        case O_VISC:
            if (cli_parse_viscosity(a.value, &mu, why, sizeof why) != 0)
                return cli_usage_error(cmd, a.spelled, "%s", why);
            if (cli_implausible_viscosity(a.value, mu, why, sizeof why)) {
                snprintf(note, sizeof note, "--viscosity %s: %s", a.value, why);
                fprintf(stderr, "mcdiff %s: warning: %s\n", cmd, note);
            }
            break;
        case O_METHOD:
            if (mcd_method_from_name(a.value, &method) != MCD_OK)
                return cli_usage_error(cmd, a.spelled,
                                       "unknown method '%s' (fsg, "
                                       "chapman-enskog, wilke-lee, brokaw, "
                                       "wilke-chang)",
                                       a.value);
            if (method == MCD_METHOD_USER)
                return cli_usage_error(cmd, a.spelled,
                                       "'user' is not an estimation method "
                                       "(give measured pairs to 'mcdiff "
                                       "fluxes --pair')");
            have_method = 1;
            break;
        case CLI_ARG_POSITIONAL:
            if (npos >= 2)
                return cli_usage_error(cmd, a.value,
                                       "only two species may be given");
            names[npos++] = a.value;
            break;
        default: return CLI_USAGE;
        }
    }
    if (npos < 2)
        return cli_usage_error(cmd, npos ? "B" : "A",
                               "missing species name (see --help)");
    if (json && csv)
        return cli_usage_error(cmd, "--csv",
                               "give either --json or --csv, not both");
    liquid = !isnan(mu) || (have_method && method == MCD_METHOD_WILKE_CHANG);
    if (isnan(T))
        return cli_usage_error(cmd, "-T/--temperature", "is required");
    if (isnan(P) && !liquid)
        return cli_usage_error(cmd, "-P/--pressure", "is required");
    if (liquid && isnan(mu))
        return cli_usage_error(cmd, "--viscosity",
                               "is required by wilke-chang");
    if (liquid && have_method && method != MCD_METHOD_WILKE_CHANG)
        return cli_usage_error(cmd, "--viscosity",
                               "is only used by wilke-chang (liquids)");
    if (thermal && liquid)
        return cli_usage_error(cmd, "--thermal-factor",
                               "is estimated for gases only");
    if (thermal && csv)
        return cli_usage_error(cmd, "--thermal-factor",
                               "is shown in the text and JSON output, not "
                               "in --csv");

    rc = cli_open_db(cmd, file, &db);
    if (rc != CLI_OK)
        return rc;
    for (k = 0; k < 2; k++) {
        mcd_status st = mcd_db_find(db, names[k], &idx[k]);
        if (st != MCD_OK) {
            mcd_db_free(db);
            if (st == MCD_ENOTFOUND)
                return cli_usage_error(cmd, names[k],
                                       "%s (see 'mcdiff species')",
                                       mcd_last_error());
            return cli_fail(cmd, "looking up a species", st, names[k]);
        }
    }

    /* Methods to run. */
    if (liquid) {
        res[nres++].m = MCD_METHOD_WILKE_CHANG;
    } else if (have_method) {
        res[nres++].m = method;
    } else {
        for (k = 0; k < sizeof gas_methods / sizeof gas_methods[0]; k++)
            res[nres++].m = gas_methods[k];
    }
    for (k = 0; k < nres; k++) {
        result *r = &res[k];
        r->D = (double)NAN;
        r->rel_err = (double)NAN;
        r->warn = 0;
        if (r->m == MCD_METHOD_WILKE_CHANG)
            r->st = mcd_db_binary_liquid(db, idx[0], idx[1], T, mu, &r->D,
                                         &r->rel_err, &r->warn);
        else
            r->st = mcd_db_binary_gas(db, idx[0], idx[1], (mcd_gas_method)r->m,
                                      T, P, &r->D, &r->rel_err, &r->warn);
        r->pub_err = r->rel_err;
        if (r->st == MCD_OK) {
            r->rel_err = cli_widened_error(r->m, r->warn);
            widened |= r->rel_err != r->pub_err && !isnan(r->pub_err);
        }
        if (r->st == MCD_OK && explain &&
            mcd_db_binary_explain(db, idx[0], idx[1], r->m, T, P, mu, r->ex) !=
                MCD_OK)
            r->st = MCD_EINTERNAL; /* the estimate above succeeded */
        /* Only an estimate the tool chose is recommended: a method the
         * user named is simply the answer. */
        if (r->st == MCD_OK && best < 0)
            best = (int)k;
    }
    /* The library's rule (MCD_GAS_RECOMMENDED, asked of a mixture of the
     * pair): Brokaw's correction for a polar pair with its data. */
    if (nres > 1) {
        mcd_method rec = recommended(db, idx);
        for (k = 0; k < nres; k++)
            if (res[k].m == rec && res[k].st == MCD_OK)
                best = (int)k;
    }
    recommend = !have_method;
    if (best < 0) {
        rc = cli_fail(cmd, nres == 1 ? "the estimate" : "every estimate",
                      res[0].st, mcd_method_name(res[0].m));
        mcd_db_free(db);
        return rc;
    }
    if (thermal && (rc = cli_thermal_factor_estimate(cmd, db, idx[0], idx[1], T,
                                                     &tf)) != CLI_OK) {
        mcd_db_free(db);
        return rc;
    }

    if (csv) {
        cli_csv c;
        cli_csv_init(&c, stdout);
        cli_csv_text(&c, "species_a");
        cli_csv_text(&c, "species_b");
        cli_csv_head(&c, "T", "", "K");
        cli_csv_head(&c, "P", "", "Pa");
        if (!isnan(mu))
            cli_csv_head(&c, "viscosity", "", "Pa s");
        cli_csv_text(&c, "method");
        cli_csv_text(&c, "status");
        cli_csv_head(&c, "D", "", "m^2/s");
        cli_csv_text(&c, "typical_error");
        cli_csv_text(&c, "published_error");
        cli_csv_text(&c, "recommended");
        cli_csv_text(&c, "warnings");
        cli_csv_end_row(&c);
        for (k = 0; k < nres; k++) {
            char w[512] = "";
            cli_csv_text(&c, mcd_db_name(db, idx[0]));
            cli_csv_text(&c, mcd_db_name(db, idx[1]));
            cli_csv_number(&c, T);
            cli_csv_number(&c, liquid ? (double)NAN : P);
            if (!isnan(mu))
                cli_csv_number(&c, mu);
            cli_csv_text(&c, mcd_method_name(res[k].m));
            cli_csv_text(&c, mcd_status_string(res[k].st));
            cli_csv_number(&c, res[k].D);
            cli_csv_number(&c, res[k].rel_err);
            cli_csv_number(&c, res[k].pub_err);
            cli_csv_integer(&c, recommend && (int)k == best);
            if (res[k].st == MCD_OK)
                cli_warn_text(res[k].warn, w, sizeof w);
            cli_csv_text(&c, w);
            cli_csv_end_row(&c);
        }
        fprintf(stderr, "%s\n", CLI_CAUTION_SHORT);
    } else if (json) {
        cli_json j;
        cli_json_init(&j, stdout);
        cli_json_object_begin(&j, NULL);
        cli_json_array_begin(&j, "pair");
        cli_json_string(&j, NULL, mcd_db_name(db, idx[0]));
        cli_json_string(&j, NULL, mcd_db_name(db, idx[1]));
        cli_json_array_end(&j);
        cli_json_number(&j, "T", T);
        if (liquid)
            cli_json_null(&j, "P");
        else
            cli_json_number(&j, "P", P);
        if (!isnan(mu))
            cli_json_number(&j, "viscosity", mu);
        cli_json_number(&j, "D", res[best].D);
        cli_json_string(&j, "method", mcd_method_name(res[best].m));
        cli_json_number(&j, "typical_error", res[best].rel_err);
        cli_json_number(&j, "published_error", res[best].pub_err);
        cli_json_bool(&j, "recommended", recommend);
        cli_json_array_begin(&j, "results");
        for (k = 0; k < nres; k++) {
            cli_json_object_begin(&j, NULL);
            cli_json_string(&j, "method", mcd_method_name(res[k].m));
            cli_json_string(&j, "status", mcd_status_string(res[k].st));
            cli_json_number(&j, "D", res[k].D);
            cli_json_number(&j, "typical_error", res[k].rel_err);
            cli_json_number(&j, "published_error", res[k].pub_err);
            cli_json_bool(&j, "recommended", recommend && (int)k == best);
            json_warnings(&j, res[k].warn);
            if (explain && res[k].st == MCD_OK)
                cli_explain_json(&j, res[k].ex);
            cli_json_object_end(&j);
        }
        cli_json_array_end(&j);
        cli_json_array_begin(&j, "input_warnings");
        if (note[0])
            cli_json_string(&j, NULL, note);
        cli_json_array_end(&j);
        if (thermal)
            cli_thermal_factor_json(&j, &tf);
        cli_json_string(&j, "caution", CLI_CAUTION_LONG);
        cli_json_object_end(&j);
        cli_json_finish(&j);
    } else {
        cli_table t;
        const char *cells[5];
        char d1[48], d2[48], e[48];
        if (liquid)
            printf("%s (%s) dilute in liquid %s (%s) at T = %.6g K, solvent "
                   "viscosity %.6g Pa s\n",
                   mcd_db_name(db, idx[0]), mcd_db_formula(db, idx[0]),
                   mcd_db_name(db, idx[1]), mcd_db_formula(db, idx[1]), T, mu);
        else
            printf("%s (%s) + %s (%s) at T = %.6g K, P = %.6g Pa\n",
                   mcd_db_name(db, idx[0]), mcd_db_formula(db, idx[0]),
                   mcd_db_name(db, idx[1]), mcd_db_formula(db, idx[1]), T, P);
        cli_table_init(&t, 5);
        t.right[1] = t.right[2] = t.right[3] = 1;
        cells[0] = "method";
        cells[1] = "D [m^2/s]";
        cells[2] = "D [cm^2/s]";
        cells[3] = "typ. error";
        cells[4] = "";
        cli_table_row(&t, cells);
        for (k = 0; k < nres; k++) {
            cells[0] = mcd_method_name(res[k].m);
            if (res[k].st == MCD_OK) {
                snprintf(d1, sizeof d1, "%.4e", res[k].D);
                snprintf(d2, sizeof d2, "%.4g", res[k].D * 1e4);
                if (isnan(res[k].rel_err))
                    snprintf(e, sizeof e, "-");
                else
                    snprintf(e, sizeof e, "%.1f %%", 100.0 * res[k].rel_err);
                cells[1] = d1;
                cells[2] = d2;
                cells[3] = e;
                cells[4] = recommend && (int)k == best ? "<- recommended" : "";
            } else {
                cells[1] = "-";
                cells[2] = "-";
                cells[3] = "-";
                cells[4] = mcd_status_string(res[k].st);
            }
            cli_table_row(&t, cells);
        }
        cli_table_print(&t, stdout, "  ");
        cli_table_free(&t);
        for (k = 0; k < nres; k++) {
            char w[512];
            if (res[k].st != MCD_OK || res[k].warn == 0)
                continue;
            cli_warn_text(res[k].warn, w, sizeof w);
            printf("  warning (%s): %s\n", mcd_method_name(res[k].m), w);
        }
        if (widened)
            printf("  %s\n", CLI_WIDEN_NOTE);
        for (k = 0; explain && k < nres; k++)
            if (res[k].st == MCD_OK)
                cli_explain_text(res[k].m, res[k].ex, stdout);
        if (thermal)
            cli_thermal_factor_text(&tf, mcd_db_name(db, idx[0]), stdout);
        printf("%s\n", CLI_CAUTION_SHORT);
    }
    mcd_db_free(db);
    return CLI_OK;
}
