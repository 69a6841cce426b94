/* cmd_species.c - `mcdiff species [NAME]`: the species table. */
#include <math.h>
#include <stdio.h>
#include <string.h>
#include "cli.h"

/* Display scale and unit of each parameter in the tables (JSON is SI). */
static const struct {
    mcd_param p;
    const char *head;
    const char *unit;
    double scale;
} shown[] = {
    {MCD_PARAM_MOLAR_MASS, "M", "g/mol", 1e3},
    {MCD_PARAM_DIFF_VOLUME, "V_diff", "-", 1.0},
    {MCD_PARAM_LJ_SIGMA, "sigma", "Å", 1e10},
    {MCD_PARAM_LJ_EPS_K, "eps/k", "K", 1.0},
    {MCD_PARAM_DIPOLE, "dipole", "D", 1.0 / 3.33564095198152e-30},
    {MCD_PARAM_TB, "Tb", "K", 1.0},
    {MCD_PARAM_VB, "Vb", "cm3/mol", 1e6},
};
/* 1 debye = 1e-21 / c0 C m = 3.33564095198152e-30 C m (c0 the speed of
 * light, exact in the SI). */

static void help(FILE *f)
{
    fputs(
        "usage: mcdiff species [NAME] [--json | --csv] [--species-file FILE]\n"
        "\n"
        "Without NAME: the built-in species table, one line per species,\n"
        "in the units given under each heading (M g/mol, sigma Å, eps/k K,\n"
        "dipole debye, Tb K, Vb cm3/mol; '-' = not known).\n"
        "With NAME (a species name, case-insensitive, or a formula that only\n"
        "one species has): every parameter with its SI value, unit and "
        "source.\n"
        "\n"
        "options:\n"
        "  --json               one JSON object, SI values, key \"species\"\n"
        "  --csv                one row per species, SI values, header\n"
        "                       name,formula,M_kg_per_mol,V_diff,sigma_m,...\n"
        "                       (empty field = not known)\n"
        "  --species-file FILE  also load species from FILE (mcdiff species\n"
        "                       format; values in SI units)\n"
        "  -h, --help           this text\n"
        "\n"
        "examples:\n"
        "  mcdiff species\n"
        "  mcdiff species CO2 --json\n"
        "  mcdiff species --csv > species.csv\n",
        f);
}

static void json_species(cli_json *j, const mcd_db *db, size_t i)
{
    int p;
    cli_json_object_begin(j, NULL);
    cli_json_string(j, "name", mcd_db_name(db, i));
    cli_json_string(j, "formula", mcd_db_formula(db, i));
    for (p = 0; p < MCD_PARAM_COUNT; p++) {
        double v;
        if (mcd_db_param(db, i, (mcd_param)p, &v) == MCD_OK)
            cli_json_number(j, mcd_param_name((mcd_param)p), v);
        else
            cli_json_null(j, mcd_param_name((mcd_param)p));
    }
    cli_json_object_begin(j, "sources");
    for (p = 0; p < MCD_PARAM_COUNT; p++) {
        double v;
        if (mcd_db_param(db, i, (mcd_param)p, &v) == MCD_OK)
            cli_json_string(j, mcd_param_name((mcd_param)p),
                            mcd_db_source(db, i, (mcd_param)p));
    }
    cli_json_object_end(j);
    cli_json_object_end(j);
}

static void json_units(cli_json *j)
{
    int p;
    cli_json_object_begin(j, "units");
    for (p = 0; p < MCD_PARAM_COUNT; p++)
        cli_json_string(j, mcd_param_name((mcd_param)p),
                        mcd_param_unit((mcd_param)p));
    cli_json_object_end(j);
}

/* CSV: header row with SI units in the names, then one row per species. */
static void csv_header(cli_csv *c)
{
    int p;
    cli_csv_text(c, "name");
    cli_csv_text(c, "formula");
    for (p = 0; p < MCD_PARAM_COUNT; p++)
        cli_csv_head(c, NULL, mcd_param_name((mcd_param)p),
                     mcd_param_unit((mcd_param)p));
    cli_csv_end_row(c);
}

static void csv_species(cli_csv *c, const mcd_db *db, size_t i)
{
    int p;
    cli_csv_text(c, mcd_db_name(db, i));
    cli_csv_text(c, mcd_db_formula(db, i));
    for (p = 0; p < MCD_PARAM_COUNT; p++) {
        double v;
        cli_csv_number(c, mcd_db_param(db, i, (mcd_param)p, &v) == MCD_OK
                              ? v
                              : (double)NAN);
    }
    cli_csv_end_row(c);
}

static int list_all(const mcd_db *db, int json, int csv)
{
    size_t i, n = mcd_db_species_count(db), k;
    enum { NC = 2 + sizeof shown / sizeof shown[0] };
    cli_table t;
    const char *cells[NC];
    char buf[NC][48];

    if (csv) {
        cli_csv c;
        cli_csv_init(&c, stdout);
        csv_header(&c);
        for (i = 0; i < n; i++)
            csv_species(&c, db, i);
        return CLI_OK;
    }
    if (json) {
        cli_json j;
        cli_json_init(&j, stdout);
        cli_json_object_begin(&j, NULL);
        json_units(&j);
        cli_json_array_begin(&j, "species");
        for (i = 0; i < n; i++)
            json_species(&j, db, i);
        cli_json_array_end(&j);
        cli_json_object_end(&j);
        cli_json_finish(&j);
        return CLI_OK;
    }
    if (cli_table_init(&t, NC) != 0)
        return CLI_FAIL;
    for (k = 2; k < NC; k++)
        t.right[k] = 1;
    cells[0] = "name";
    cells[1] = "formula";
    for (k = 0; k < NC - 2; k++)
        cells[k + 2] = shown[k].head;
    cli_table_row(&t, cells);
    cells[0] = "";
    cells[1] = "";
    for (k = 0; k < NC - 2; k++)
        cells[k + 2] = shown[k].unit;
    cli_table_row(&t, cells);
    for (i = 0; i < n; i++) {
        cells[0] = mcd_db_name(db, i);
        cells[1] = mcd_db_formula(db, i);
        for (k = 0; k < NC - 2; k++) {
            double v = (double)NAN;
            if (mcd_db_param(db, i, shown[k].p, &v) == MCD_OK)
                v *= shown[k].scale;
            else
                v = (double)NAN;
            cli_fmt_num(buf[k], sizeof buf[k], v);
            cells[k + 2] = buf[k];
        }
        if (cli_table_row(&t, cells) != 0) {
            cli_table_free(&t);
            return cli_fail("species", "building the table", MCD_ENOMEM, NULL);
        }
    }
    cli_table_print(&t, stdout, "");
    printf("%zu species. 'mcdiff species NAME' shows sources and all "
           "parameters.\n",
           n);
    cli_table_free(&t);
    return CLI_OK;
}

static int show_one(const mcd_db *db, const char *name, int json, int csv)
{
    size_t i;
    int p;
    mcd_status st = mcd_db_find(db, name, &i);
    if (st == MCD_ENOTFOUND)
        return cli_usage_error("species", name, "%s (see 'mcdiff species')",
                               mcd_last_error());
    if (st != MCD_OK)
        return cli_fail("species", "looking up the species", st, name);
    if (csv) {
        cli_csv c;
        cli_csv_init(&c, stdout);
        csv_header(&c);
        csv_species(&c, db, i);
        return CLI_OK;
    }
    if (json) {
        cli_json j;
        cli_json_init(&j, stdout);
        cli_json_object_begin(&j, NULL);
        json_units(&j);
        cli_json_array_begin(&j, "species");
        json_species(&j, db, i);
        cli_json_array_end(&j);
        cli_json_object_end(&j);
        cli_json_finish(&j);
        return CLI_OK;
    }
    printf("%s (%s)\n", mcd_db_name(db, i), mcd_db_formula(db, i));
    {
        cli_table t;
        const char *cells[4];
        char val[48];
        cli_table_init(&t, 4);
        t.right[1] = 1;
        cells[0] = "parameter";
        cells[1] = "value";
        cells[2] = "unit";
        cells[3] = "source";
        cli_table_row(&t, cells);
        for (p = 0; p < MCD_PARAM_COUNT; p++) {
            double v;
            int known = mcd_db_param(db, i, (mcd_param)p, &v) == MCD_OK;
            if (known)
                snprintf(val, sizeof val, "%.6g", v);
            else
                snprintf(val, sizeof val, "-");
            cells[0] = mcd_param_name((mcd_param)p);
            cells[1] = val;
            cells[2] = mcd_param_unit((mcd_param)p);
            cells[3] = known ? mcd_db_source(db, i, (mcd_param)p) : "not known";
            cli_table_row(&t, cells);
        }
        cli_table_print(&t, stdout, "  ");
        cli_table_free(&t);
    }
    return CLI_OK;
}

int cli_cmd_species(int argc, char **argv)
{
    enum { O_JSON = 1, O_HELP, O_FILE, O_CSV };
    static const cli_opt opts[] = {{"json", 0, 0, O_JSON},
                                   {"csv", 0, 0, O_CSV},
                                   {"help", 'h', 0, O_HELP},
                                   {"species-file", 0, 1, O_FILE},
                                   {NULL, 0, 0, 0}};
    cli_args a;
    int id, json = 0, csv = 0, rc;
    const char *name = NULL, *file = NULL;
    mcd_db *db = NULL;

    cli_args_init(&a, "species", argc, argv, opts);
    while ((id = cli_args_next(&a)) != CLI_ARG_END) {
        switch (id) {
        case CLI_ARG_ERROR: return CLI_USAGE;
        case O_HELP: help(stdout); return CLI_OK;
        case O_JSON: json = 1; break;
        case O_CSV: csv = 1; break;
        case O_FILE: file = a.value; break;
        case CLI_ARG_POSITIONAL:
            if (name)
                return cli_usage_error("species", a.value,
                                       "only one species name may be given");
            name = a.value;
            break;
        default: return CLI_USAGE;
        }
    }
    if (json && csv)
        return cli_usage_error("species", "--csv",
                               "give either --json or --csv, not both");
    rc = cli_open_db("species", file, &db);
    if (rc != CLI_OK)
        return rc;
    rc = name ? show_one(db, name, json, csv) : list_all(db, json, csv);
    mcd_db_free(db);
    return rc;
}
