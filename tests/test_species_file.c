/* test_species_file.c - the species text format: loading, units, every
 * error kind with its line number, all-or-nothing behaviour. */
#define _POSIX_C_SOURCE 200809L /* mkstemp, fdopen */
#include <check.h>
#include <math.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

#include "mcdiff.h"
#include "support.h"

static mcd_db *db;
static void setup(void) { ck_assert_int_eq(mcd_db_new_builtin(&db), MCD_OK); }
static void teardown(void)
{
    mcd_db_free(db);
    db = NULL;
}

static const char *data_path(const char *file)
{
    static char buf[1024];
    const char *dir = getenv("MCD_TEST_DATA");
    ck_assert_msg(dir != NULL, "MCD_TEST_DATA not set");
    snprintf(buf, sizeof buf, "%s/%s", dir, file);
    return buf;
}

static size_t find(const char *name)
{
    size_t i = (size_t)-1;
    ck_assert_msg(mcd_db_find(db, name, &i) == MCD_OK, "%s", name);
    return i;
}

static double param(const char *name, mcd_param p)
{
    double v = SUP_GUARD;
    ck_assert_msg(mcd_db_param(db, find(name), p, &v) == MCD_OK, "%s %s", name,
                  mcd_param_name(p));
    return v;
}

/* Snapshot of everything observable, to prove a failed load changed
 * nothing. */
#define SNAP_MAX 512
typedef struct snap {
    size_t n;
    char name[SNAP_MAX][64];
    char formula[SNAP_MAX][256];
    double v[SNAP_MAX][MCD_PARAM_COUNT];
    int st[SNAP_MAX][MCD_PARAM_COUNT];
    const char *src[SNAP_MAX][MCD_PARAM_COUNT];
} snap;
static snap before, after;

static void take(snap *s)
{
    memset(s, 0, sizeof *s);
    s->n = mcd_db_species_count(db);
    ck_assert_uint_le(s->n, SNAP_MAX);
    for (size_t i = 0; i < s->n; ++i) {
        snprintf(s->name[i], 64, "%s", mcd_db_name(db, i));
        snprintf(s->formula[i], 256, "%s", mcd_db_formula(db, i));
        for (int p = 0; p < MCD_PARAM_COUNT; ++p) {
            s->v[i][p] = SUP_GUARD;
            s->st[i][p] = mcd_db_param(db, i, (mcd_param)p, &s->v[i][p]);
            s->src[i][p] = mcd_db_source(db, i, (mcd_param)p);
        }
    }
}

static void assert_unchanged(void)
{
    take(&after);
    ck_assert_uint_eq(after.n, before.n);
    for (size_t i = 0; i < before.n; ++i) {
        ck_assert_str_eq(after.name[i], before.name[i]);
        ck_assert_str_eq(after.formula[i], before.formula[i]);
        for (int p = 0; p < MCD_PARAM_COUNT; ++p) {
            ck_assert_int_eq(after.st[i][p], before.st[i][p]);
            ck_assert(memcmp(&after.v[i][p], &before.v[i][p], sizeof(double)) ==
                      0);
            ck_assert(after.src[i][p] == before.src[i][p]);
        }
    }
}

/* ------------------------------------------------------------------ */

START_TEST(species_file_example_loads)
{
    size_t n = mcd_db_species_count(db), in2 = find("nitrogen");
    mcd_status st = mcd_db_load_file(db, data_path("species-example.txt"));
    ck_assert_msg(st == MCD_OK, "%s", mcd_last_error());
    /* two new species appended, nitrogen replaced in place */
    ck_assert_uint_eq(mcd_db_species_count(db), n + 2);
    ck_assert_uint_eq(find("methyl-acetate"), n);
    ck_assert_uint_eq(find("pyridine"), n + 1);
    ck_assert_uint_eq(find("nitrogen"), in2);
    /* unit conversions: exact factors, so 1e-14 relative (one multiply) */
    ck_assert(sup_rel(param("methyl-acetate", MCD_PARAM_LJ_SIGMA), 4.936e-10) <
              1e-14);
    ck_assert(sup_rel(param("methyl-acetate", MCD_PARAM_DIPOLE),
                      1.7 * 3.33564e-30) < 1e-14);
    ck_assert(sup_rel(param("methyl-acetate", MCD_PARAM_VB), 83.0e-6) < 1e-14);
    ck_assert(sup_rel(param("methyl-acetate", MCD_PARAM_PC), 47.50e5) < 1e-14);
    ck_assert(param("methyl-acetate", MCD_PARAM_ASSOC) == 1.0);
    ck_assert(sup_rel(param("pyridine", MCD_PARAM_PC), 5.63e6) < 1e-14);
    ck_assert(sup_rel(param("pyridine", MCD_PARAM_DIPOLE), 2.3 * 3.33564e-30) <
              1e-14);
    ck_assert(sup_rel(param("nitrogen", MCD_PARAM_LJ_SIGMA), 3.798e-10) <
              1e-14);
    ck_assert(sup_rel(param("nitrogen", MCD_PARAM_VB), 3.12e-5) < 1e-14);
    ck_assert(param("nitrogen", MCD_PARAM_DIPOLE) == 0.0);
    ck_assert(sup_rel(param("nitrogen", MCD_PARAM_MOLAR_MASS), 28.0134e-3) <
              1e-14);
    ck_assert(sup_rel(param("nitrogen", MCD_PARAM_PC), 3.398e6) < 1e-14);
    /* computed values: M from the formula, V from increments with a ring */
    {
        double M;
        ck_assert_int_eq(mcd_formula_molar_mass("C3H6O2", &M), MCD_OK);
        ck_assert(sup_rel(param("methyl-acetate", MCD_PARAM_MOLAR_MASS), M) <
                  1e-15);
        ck_assert_double_eq_tol(param("pyridine", MCD_PARAM_DIFF_VOLUME),
                                5 * 15.9 + 5 * 2.31 + 4.54 - 18.3, 1e-9);
        ck_assert(param("nitrogen", MCD_PARAM_DIFF_VOLUME) == 18.5);
    }
    /* sources: "user" for given values, the method for computed ones */
    ck_assert_str_eq(mcd_db_source(db, find("nitrogen"), MCD_PARAM_MOLAR_MASS),
                     "user");
    ck_assert_str_eq(mcd_db_source(db, find("pyridine"), MCD_PARAM_TB), "user");
    ck_assert_ptr_nonnull(strstr(
        mcd_db_source(db, find("pyridine"), MCD_PARAM_DIFF_VOLUME), "Fuller"));
    /* not given: unknown */
    {
        double v = SUP_GUARD;
        ck_assert_int_eq(
            mcd_db_param(db, find("pyridine"), MCD_PARAM_LJ_SIGMA, &v),
            MCD_ENODATA);
        ck_assert_int_eq(
            mcd_db_param(db, find("nitrogen"), MCD_PARAM_ASSOC, &v),
            MCD_ENODATA);
        ck_assert(v == SUP_GUARD);
    }
    /* loading the same file again replaces the same species: count same */
    ck_assert_int_eq(mcd_db_load_file(db, data_path("species-example.txt")),
                     MCD_OK);
    ck_assert_uint_eq(mcd_db_species_count(db), n + 2);
}
END_TEST

START_TEST(species_file_layout_variants_accepted)
{
    /* CRLF line ends, tabs, comments after values, blank lines, comments
     * before the header, every unit spelling; into an empty database. */
    mcd_db *d = NULL;
    size_t i;
    double v;
    const char *text = "# leading comment\r\n"
                       "\r\n"
                       "  mcdiff-species\t1   # header\r\n"
                       "species\ta\r\n"
                       "\tformula\tCH4\r\n"
                       "\tsigma 380 pm\r\n"
                       "\teps_k 150 K\r\n"
                       "\tdipole 0 C*m\r\n"
                       "\tVb 37.7 cm^3/mol\r\n"
                       "\tPc 4.6 MPa\r\n"
                       "\tTc 190.6 K\r\n"
                       "\tTb 111.7 K\r\n"
                       "\tM 0.016043 kg/mol\r\n"
                       "\tV_diff 25.14\r\n"
                       "\tassoc 1\r\n"
                       "species b\n"
                       "formula CO2\n"
                       "sigma 3.941 Angstrom\n"
                       "Pc 72.8 atm\n"
                       "Vb 3.4e-5 m^3/mol\n"
                       "dipole 0.0 D\n"
                       "species c\n"
                       "formula CO\n"
                       "sigma 3.69 A\n"
                       "Pc 3494 kPa\n"
                       "dipole 3.3e-31 C m\n"
                       "species d\n"
                       "formula NO\n"
                       "sigma 3.492e-10 m\n"
                       "Pc 64.8 bar\n"
                       "Vb 23.6 cm3/mol\n"
                       "dipole 0.2 debye\n"
                       "species e\n"
                       "formula H2\n"
                       "sigma 0.2827 nm\n"
                       "M 2.016 g/mol\n"
                       "Pc 1.313e6 Pa\n";
    ck_assert_int_eq(mcd_db_new(&d), MCD_OK);
    ck_assert_msg(mcd_db_load_string(d, text) == MCD_OK, "%s",
                  mcd_last_error());
    ck_assert_uint_eq(mcd_db_species_count(d), 5);
    ck_assert_int_eq(mcd_db_find(d, "a", &i), MCD_OK);
    ck_assert_int_eq(mcd_db_param(d, i, MCD_PARAM_LJ_SIGMA, &v), MCD_OK);
    ck_assert(sup_rel(v, 3.8e-10) < 1e-14);
    ck_assert_int_eq(mcd_db_param(d, i, MCD_PARAM_VB, &v), MCD_OK);
    ck_assert(sup_rel(v, 37.7e-6) < 1e-14);
    ck_assert_int_eq(mcd_db_param(d, i, MCD_PARAM_DIFF_VOLUME, &v), MCD_OK);
    ck_assert(v == 25.14);
    ck_assert_str_eq(mcd_db_source(d, i, MCD_PARAM_DIFF_VOLUME), "user");
    ck_assert_int_eq(mcd_db_find(d, "b", &i), MCD_OK);
    ck_assert_int_eq(mcd_db_param(d, i, MCD_PARAM_PC, &v), MCD_OK);
    ck_assert(sup_rel(v, 72.8 * 101325.0) < 1e-14);
    ck_assert_int_eq(mcd_db_find(d, "c", &i), MCD_OK);
    ck_assert_int_eq(mcd_db_param(d, i, MCD_PARAM_DIPOLE, &v), MCD_OK);
    ck_assert(sup_rel(v, 3.3e-31) < 1e-14);
    ck_assert_int_eq(mcd_db_param(d, i, MCD_PARAM_PC, &v), MCD_OK);
    ck_assert(sup_rel(v, 3.494e6) < 1e-14);
    ck_assert_int_eq(mcd_db_find(d, "e", &i), MCD_OK);
    ck_assert_int_eq(mcd_db_param(d, i, MCD_PARAM_MOLAR_MASS, &v), MCD_OK);
    ck_assert(sup_rel(v, 2.016e-3) < 1e-14);
    /* a header alone is a valid, empty species file */
    ck_assert_int_eq(mcd_db_load_string(d, "mcdiff-species 1\n"), MCD_OK);
    ck_assert_uint_eq(mcd_db_species_count(d), 5);
    mcd_db_free(d);
}
END_TEST

/* One malformed text per error kind: status and message prefix. */
static const struct {
    const char *what, *text;
    mcd_status st;
    const char *msg;
} bad[] = {
    {"empty text", "", MCD_EPARSE, "line 1: missing the header"},
    {"comments only", "# x\n\n", MCD_EPARSE, "line 2: missing the header"},
    {"no header", "species a\nformula H2\n", MCD_EPARSE,
     "line 1: expected the header line"},
    {"wrong version", "mcdiff-species 2\n", MCD_EPARSE,
     "line 1: unsupported format version"},
    {"key before species", "mcdiff-species 1\nsigma 3 A\n", MCD_EPARSE,
     "line 2: 'sigma' before the first 'species' line"},
    {"species without name", "mcdiff-species 1\nspecies\n", MCD_EPARSE,
     "line 2: 'species' takes exactly one name"},
    {"species with two names", "mcdiff-species 1\nspecies a b\n", MCD_EPARSE,
     "line 2: 'species' takes exactly one name"},
    {"bad name", "mcdiff-species 1\nspecies a;b\nformula H2\n", MCD_EPARSE,
     "line 2: species name"},
    {"duplicate species",
     "mcdiff-species 1\nspecies a\nformula H2\n"
     "species A\nformula H2\n",
     MCD_EPARSE, "line 4: species 'A' already defined on line 2"},
    {"unknown key", "mcdiff-species 1\nspecies a\nformula H2\nsigmaa 3 A\n",
     MCD_EPARSE, "line 4: unknown key 'sigmaa'"},
    {"duplicate key",
     "mcdiff-species 1\nspecies a\nformula H2\nTb 20 K\n"
     "Tb 21 K\n",
     MCD_EPARSE, "line 5: duplicate key 'Tb' (first on line 4)"},
    {"duplicate formula",
     "mcdiff-species 1\nspecies a\nformula H2\n"
     "formula H2\n",
     MCD_EPARSE, "line 4: duplicate key 'formula'"},
    {"missing formula (last block)",
     "mcdiff-species 1\nspecies a\nformula H2\n"
     "species b\nTb 20 K\n",
     MCD_EPARSE, "line 4: species 'b' has no formula"},
    {"missing formula (inner block)",
     "mcdiff-species 1\nspecies a\nTb 20 K\n"
     "species b\nformula H2\n",
     MCD_EPARSE, "line 2: species 'a' has no formula"},
    {"formula with two values", "mcdiff-species 1\nspecies a\nformula H2 O\n",
     MCD_EPARSE, "line 3: 'formula' takes exactly one value"},
    {"malformed formula", "mcdiff-species 1\nspecies a\nTb 1 K\nformula C(H\n",
     MCD_EPARSE, "line 4: species 'a': formula: position 4: expected ')'"},
    {"unknown element", "mcdiff-species 1\nspecies a\nformula CH3Xq\n",
     MCD_ENOTFOUND,
     "line 3: species 'a': formula: position 4: unknown element 'Xq'"},
    {"bad rings", "mcdiff-species 1\nspecies a\nformula C6H6\nrings -1\n",
     MCD_EPARSE, "line 4: 'rings': '-1' is not a non-negative integer"},
    {"rings with unit",
     "mcdiff-species 1\nspecies a\nformula C6H6\nrings 1 K\n", MCD_EPARSE,
     "line 4: 'rings' takes one integer"},
    {"rings on tabulated molecule",
     "mcdiff-species 1\nspecies a\nformula H2O\n"
     "rings 1\n",
     MCD_EPARSE, "line 4: species 'a': n_rings must be 0"},
    {"missing value", "mcdiff-species 1\nspecies a\nformula H2\nTb\n",
     MCD_EPARSE, "line 4: 'Tb' needs a value"},
    {"bad number", "mcdiff-species 1\nspecies a\nformula H2\nsigma 4.6x A\n",
     MCD_EPARSE, "line 4: 'sigma': '4.6x' is not a finite decimal number"},
    {"nan", "mcdiff-species 1\nspecies a\nformula H2\nTb nan K\n", MCD_EPARSE,
     "line 4: 'Tb': 'nan' is not a finite"},
    {"inf", "mcdiff-species 1\nspecies a\nformula H2\nTb inf K\n", MCD_EPARSE,
     "line 4: 'Tb': 'inf' is not a finite"},
    {"overflow", "mcdiff-species 1\nspecies a\nformula H2\nTb 1e999 K\n",
     MCD_EPARSE, "line 4: 'Tb': '1e999' is not a finite"},
    {"hex", "mcdiff-species 1\nspecies a\nformula H2\nTb 0x10 K\n", MCD_EPARSE,
     "line 4: 'Tb': '0x10' is not a finite"},
    {"two numbers", "mcdiff-species 1\nspecies a\nformula H2\nTb 1.2.3 K\n",
     MCD_EPARSE, "line 4: 'Tb': '1.2.3' is not a finite"},
    {"missing unit", "mcdiff-species 1\nspecies a\nformula H2\nsigma 2.8\n",
     MCD_EPARSE, "line 4: 'sigma' needs a unit (m, nm, pm, angstrom"},
    {"bad unit", "mcdiff-species 1\nspecies a\nformula H2\nsigma 2.8 furlong\n",
     MCD_EPARSE, "line 4: 'sigma': unknown unit 'furlong'"},
    {"unit of another quantity",
     "mcdiff-species 1\nspecies a\nformula H2\n"
     "Pc 13 K\n",
     MCD_EPARSE, "line 4: 'Pc': unknown unit 'K'"},
    {"wrong case unit", "mcdiff-species 1\nspecies a\nformula H2\nTb 20 k\n",
     MCD_EPARSE, "line 4: 'Tb': unknown unit 'k'"},
    {"unit on dimensionless",
     "mcdiff-species 1\nspecies a\nformula H2\n"
     "assoc 1 K\n",
     MCD_EPARSE, "line 4: 'assoc' is dimensionless"},
    {"negative value", "mcdiff-species 1\nspecies a\nformula H2\nTc -5 K\n",
     MCD_EDOM, "line 4: 'Tc' must be > 0"},
    {"zero sigma", "mcdiff-species 1\nspecies a\nformula H2\nsigma 0 A\n",
     MCD_EDOM, "line 4: 'sigma' must be > 0"},
    {"negative dipole",
     "mcdiff-species 1\nspecies a\nformula H2\n"
     "dipole -1 D\n",
     MCD_EDOM, "line 4: 'dipole' must be >= 0"},
    {"control character", "mcdiff-species 1\nspecies a\nformula H2\x01\n",
     MCD_EPARSE, "line 3: control character (byte 0x01) at column 11"},
    {"too many fields",
     "mcdiff-species 1\nspecies a\nformula H2\n"
     "Tb 1 2 3 4 5 6 7 8\n",
     MCD_EPARSE, "line 4: too many fields"},
};

START_TEST(species_file_each_error_names_its_line)
{
    /* Every text starts with a valid block so that atomicity is tested:
     * nothing from before the error may stay in the database. */
    take(&before);
    for (size_t k = 0; k < sizeof bad / sizeof bad[0]; ++k) {
        mcd_status st = mcd_db_load_string(db, bad[k].text);
        ck_assert_msg(st == bad[k].st, "%s: status %d, want %d (%s)",
                      bad[k].what, st, bad[k].st, mcd_last_error());
        ck_assert_msg(
            strncmp(mcd_last_error(), bad[k].msg, strlen(bad[k].msg)) == 0,
            "%s: got '%s', want '%s'", bad[k].what, mcd_last_error(),
            bad[k].msg);
        assert_unchanged();
    }
}
END_TEST

START_TEST(species_file_failure_after_valid_blocks_changes_nothing)
{
    const char *text = "mcdiff-species 1\n"
                       "species new-one\nformula C3H8O\nTb 370 K\n"
                       "species water\nformula H2O\nTb 373.15 K\n"
                       "species bad\nformula CH4\nTc 190 Kelvin\n";
    take(&before);
    ck_assert_int_eq(mcd_db_load_string(db, text), MCD_EPARSE);
    ck_assert_msg(strncmp(mcd_last_error(), "line 10:", 8) == 0, "%s",
                  mcd_last_error());
    assert_unchanged();
    {
        size_t i;
        ck_assert_int_eq(mcd_db_find(db, "new-one", &i), MCD_ENOTFOUND);
    }
}
END_TEST

START_TEST(species_file_bad_files_name_their_line)
{
    static const struct {
        const char *file;
        mcd_status st;
        const char *msg;
    } f[] = {
        {"species-bad-unit.txt", MCD_EPARSE,
         "line 5: 'sigma': unknown unit 'furlong'"},
        {"species-missing-formula.txt", MCD_EPARSE,
         "line 7: species 'no-formula' has no formula"},
        {"species-duplicate-key.txt", MCD_EPARSE,
         "line 6: duplicate key 'Tb' (first on line 4)"},
    };
    take(&before);
    for (size_t k = 0; k < sizeof f / sizeof f[0]; ++k) {
        ck_assert_int_eq(mcd_db_load_file(db, data_path(f[k].file)), f[k].st);
        ck_assert_msg(strncmp(mcd_last_error(), f[k].msg, strlen(f[k].msg)) ==
                          0,
                      "%s: got '%s'", f[k].file, mcd_last_error());
        assert_unchanged();
    }
}
END_TEST

START_TEST(species_file_io_and_argument_errors)
{
    take(&before);
    ck_assert_int_eq(
        mcd_db_load_file(db, data_path("species-does-not-exist.txt")), MCD_EIO);
    ck_assert_ptr_nonnull(strstr(mcd_last_error(), "cannot open"));
    /* a directory opens on Linux but cannot be read */
    ck_assert_int_eq(mcd_db_load_file(db, getenv("MCD_TEST_DATA")), MCD_EIO);
    ck_assert_int_eq(mcd_db_load_file(NULL, "x"), MCD_EINVAL);
    ck_assert_int_eq(mcd_db_load_file(db, NULL), MCD_EINVAL);
    ck_assert_int_eq(mcd_db_load_string(NULL, "x"), MCD_EINVAL);
    ck_assert_int_eq(mcd_db_load_string(db, NULL), MCD_EINVAL);
    /* no error buffer at all */
    ck_assert_int_eq(mcd_db_load_string(db, "junk"), MCD_EPARSE);
    assert_unchanged();
}
END_TEST

START_TEST(species_file_nul_byte_is_rejected)
{
    /* A file with a NUL byte on line 3 (written to a temporary file). */
    static const char content[] = "mcdiff-species 1\nspecies a\nformula H2\0\n";
    char path[] = "/tmp/mcd-species-nul-XXXXXX";
    FILE *fp;
    int fd = mkstemp(path);
    ck_assert_int_ge(fd, 0);
    fp = fdopen(fd, "wb");
    ck_assert_ptr_nonnull(fp);
    ck_assert_uint_eq(fwrite(content, 1, sizeof content - 1, fp),
                      sizeof content - 1);
    fclose(fp);
    take(&before);
    ck_assert_int_eq(mcd_db_load_file(db, path), MCD_EPARSE);
    remove(path);
    ck_assert_msg(
        strcmp(mcd_last_error(),
               "line 3: control character (byte 0x00) at column 11") == 0,
        "%s", mcd_last_error());
    assert_unchanged();
}
END_TEST

/* Units a practitioner writes: the angstrom sign, Celsius temperatures
 * (t/degC + 273.15 = T/K, by definition of the Celsius scale), psi
 * (1 psi = 6894.757293168 Pa from the exact pound-force and inch; common
 * practice); gauge pressures are refused with a message saying so. */
START_TEST(species_file_practical_units)
{
    const char *text = "mcdiff-species 1\n"
                       "species u1\n formula N2\n sigma 3.798 \xc3\x85\n"
                       " Tb 77.1 C\n Tc 100 \xc2\xb0"
                       "C\n Pc 500 psi\n"
                       "species u2\n formula O2\n sigma 3.467 \xe2\x84\xab\n"
                       " Tb -183 degC\n";
    ck_assert_int_eq(mcd_db_load_string(db, text), MCD_OK);
    ck_assert_double_eq_tol(param("u1", MCD_PARAM_LJ_SIGMA), 3.798e-10, 1e-22);
    ck_assert_double_eq_tol(param("u1", MCD_PARAM_TB), 350.25, 1e-9);
    ck_assert_double_eq_tol(param("u1", MCD_PARAM_TC), 373.15, 1e-9);
    ck_assert_double_eq_tol(param("u1", MCD_PARAM_PC), 3447378.646584, 1e-3);
    ck_assert_double_eq_tol(param("u2", MCD_PARAM_LJ_SIGMA), 3.467e-10, 1e-22);
    ck_assert_double_eq_tol(param("u2", MCD_PARAM_TB), 90.15, 1e-9);

    take(&before);
    ck_assert_int_eq(mcd_db_load_string(db, "mcdiff-species 1\nspecies u3\n"
                                            " formula N2\n Pc 30 barg\n"),
                     MCD_EPARSE);
    ck_assert_msg(strstr(mcd_last_error(), "line 4") != NULL &&
                      strstr(mcd_last_error(), "gauge") != NULL &&
                      strstr(mcd_last_error(), "absolute") != NULL,
                  "%s", mcd_last_error());
    ck_assert_int_eq(mcd_db_load_string(db, "mcdiff-species 1\nspecies u3\n"
                                            " formula N2\n Pc 400 psig\n"),
                     MCD_EPARSE);
    ck_assert_msg(strstr(mcd_last_error(), "gauge") != NULL, "%s",
                  mcd_last_error());
    /* an offset unit is not accepted where only a scale makes sense */
    ck_assert_int_eq(mcd_db_load_string(db, "mcdiff-species 1\nspecies u3\n"
                                            " formula N2\n eps_k 71 C\n"),
                     MCD_EPARSE);
    assert_unchanged();
}
END_TEST

int main(void)
{
    Suite *s = suite_create("mcd:species_file");
    TCase *tc = tcase_create("species_file");
    tcase_add_checked_fixture(tc, setup, teardown);
    tcase_add_test(tc, species_file_example_loads);
    tcase_add_test(tc, species_file_layout_variants_accepted);
    tcase_add_test(tc, species_file_each_error_names_its_line);
    tcase_add_test(tc, species_file_failure_after_valid_blocks_changes_nothing);
    tcase_add_test(tc, species_file_bad_files_name_their_line);
    tcase_add_test(tc, species_file_io_and_argument_errors);
    tcase_add_test(tc, species_file_nul_byte_is_rejected);
    tcase_add_test(tc, species_file_practical_units);
    suite_add_tcase(s, tc);
    return sup_run(s);
}
