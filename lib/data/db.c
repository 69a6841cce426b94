/* db.c - species database: growable array of species records.
 *
 * Names are compared ASCII case-insensitively. Replacing a species of the
 * same name keeps its index, so indices held by callers stay valid across
 * overrides (they change only through mcd_db_free). The array doubles when
 * full; a failed growth leaves the database unchanged.
 */
#include <math.h>
#include <stdlib.h>
#include <string.h>
#include "base/mcd_internal.h"
#include "data/formula.h"
#include "data/species.h"

const char mcdi_src_user[] = "user";

/* Molar mass of dry air [kg/mol], U.S. Standard Atmosphere 1976. */
#define M_AIR 28.9644e-3
/* Molar mass of D2 [kg/mol]: 2 x 2.01410177812 g/mol (AME 2020). */
#define M_D2 (2.0 * 2.01410177812e-3)

static const char *const param_names[MCD_PARAM_COUNT] = {
    "M", "V_diff", "sigma", "eps_k", "dipole", "Vb", "Tb", "assoc", "Tc", "Pc"};
static const char *const param_units[MCD_PARAM_COUNT] = {
    "kg/mol", "-", "m", "K", "C m", "m^3/mol", "K", "-", "K", "Pa"};

MCD_API const char *mcd_param_name(mcd_param p)
{
    if ((int)p < 0 || (int)p >= MCD_PARAM_COUNT)
        return NULL;
    return param_names[p];
}

MCD_API const char *mcd_param_unit(mcd_param p)
{
    if ((int)p < 0 || (int)p >= MCD_PARAM_COUNT)
        return NULL;
    return param_units[p];
}

static char lower(char c)
{
    return (c >= 'A' && c <= 'Z') ? (char)(c - 'A' + 'a') : c;
}

int mcdi_ieq(const char *a, const char *b)
{
    for (; *a && *b; ++a, ++b)
        if (lower(*a) != lower(*b))
            return 0;
    return *a == *b;
}

mcd_status mcdi_db_check_name(const char *name)
{
    size_t i, len = strlen(name);
    if (len == 0 || len > MCDI_NAME_MAX) {
        mcdi_note("species name must have 1 to %d characters", MCDI_NAME_MAX);
        return MCD_EPARSE;
    }
    for (i = 0; i < len; ++i) {
        char c = name[i];
        int alnum = (c >= 'A' && c <= 'Z') || (c >= 'a' && c <= 'z') ||
                    (c >= '0' && c <= '9');
        if (i == 0 && !alnum) {
            mcdi_note("species name must start with a letter or digit");
            return MCD_EPARSE;
        }
        if (!alnum && strchr("_+-,()'", c) == NULL) {
            unsigned char u = (unsigned char)c;
            if (u >= 0x21 && u < 0x7f)
                mcdi_note("species name: character %zu '%c' not "
                          "allowed",
                          i + 1, c);
            else
                mcdi_note("species name: character %zu (byte 0x%02x) "
                          "not allowed",
                          i + 1, (unsigned)u);
            return MCD_EPARSE;
        }
    }
    return MCD_OK;
}

size_t mcdi_db_index_of(const mcd_db *db, const char *name)
{
    size_t i;
    for (i = 0; i < db->n; ++i)
        if (mcdi_ieq(db->sp[i].name, name))
            return i;
    return (size_t)-1;
}

mcd_status mcdi_db_reserve(mcd_db *db, size_t need)
{
    size_t cap;
    mcdi_species *p;
    if (need <= db->cap)
        return MCD_OK;
    cap = db->cap ? db->cap : 16;
    while (cap < need) {
        if (cap > ((size_t)-1) / 2 / sizeof(mcdi_species))
            return MCD_ENOMEM;
        cap *= 2;
    }
    p = realloc(db->sp, cap * sizeof *p);
    if (p == NULL)
        return MCD_ENOMEM;
    db->sp = p;
    db->cap = cap;
    return MCD_OK;
}

mcd_status mcdi_species_from_formula(const char *name, const char *formula,
                                     int n_rings, mcdi_species *out)
{
    mcdi_species s;
    mcdi_formula f;
    mcd_status st;
    double V;
    int k;
    size_t flen;
    if ((st = mcdi_db_check_name(name)) != MCD_OK)
        return st;
    if (n_rings < 0) {
        mcdi_note("n_rings = %d is negative", n_rings);
        return MCD_EINVAL;
    }
    flen = strlen(formula);
    if (flen > MCDI_FORMULA_TEXT_MAX) {
        mcdi_note("formula longer than %d characters", MCDI_FORMULA_TEXT_MAX);
        return MCD_EPARSE;
    }
    memset(&s, 0, sizeof s);
    memcpy(s.name, name, strlen(name) + 1);
    memcpy(s.formula, formula, flen + 1);
    for (k = 0; k < MCD_PARAM_COUNT; ++k) {
        s.p[k] = (double)NAN;
        s.src[k] = NULL;
    }
    /* Two pseudo-formulas of the built-in table are accepted as well: "air"
     * (any case) and "D2" (deuterium; D is not an element symbol). */
    if (mcdi_ieq(formula, "air") || strcmp(formula, "D2") == 0) {
        int air = formula[0] != 'D';
        if (n_rings != 0) {
            mcdi_note("n_rings must be 0 for '%s'", formula);
            return MCD_EINVAL;
        }
        s.p[MCD_PARAM_MOLAR_MASS] = air ? M_AIR : M_D2;
        s.src[MCD_PARAM_MOLAR_MASS] = air ? mcdi_src_m_air : mcdi_src_m_d2;
        (void)mcdi_fsg_lookup(formula, NULL, &V);
        s.p[MCD_PARAM_DIFF_VOLUME] = V;
        s.src[MCD_PARAM_DIFF_VOLUME] = mcdi_src_v_table;
        *out = s;
        return MCD_OK;
    }
    if ((st = mcdi_formula_parse(formula, &f)) != MCD_OK)
        return st;
    if ((st = mcdi_formula_mass(&f, &s.p[MCD_PARAM_MOLAR_MASS])) != MCD_OK)
        return st;
    s.src[MCD_PARAM_MOLAR_MASS] = mcdi_src_m_formula;
    if (mcdi_fsg_lookup(formula, &f, &V)) {
        if (n_rings != 0) {
            mcdi_note("n_rings must be 0 for the tabulated molecule "
                      "'%s'",
                      formula);
            return MCD_EINVAL;
        }
        s.p[MCD_PARAM_DIFF_VOLUME] = V;
        s.src[MCD_PARAM_DIFF_VOLUME] = mcdi_src_v_table;
    } else {
        st = mcdi_formula_fsg_volume(&f, n_rings, &V);
        if (st == MCD_OK) {
            s.p[MCD_PARAM_DIFF_VOLUME] = V;
            s.src[MCD_PARAM_DIFF_VOLUME] = mcdi_src_v_increments;
        } else if (st != MCD_ENODATA) {
            /* non-positive sum: too many rings for the formula */
            return mcdi_formula_fsg_volume(&f, n_rings, &V);
        }
        /* ENODATA: an element without increment; V stays unknown. */
        mcdi_err_clear();
    }
    *out = s;
    return MCD_OK;
}

size_t mcdi_db_put(mcd_db *db, const mcdi_species *s)
{
    size_t i = mcdi_db_index_of(db, s->name);
    if (i == (size_t)-1) {
        i = db->n++;
    }
    db->sp[i] = *s;
    return i;
}

mcd_status mcdi_param_check(mcd_param p, double value)
{
    if ((int)p < 0 || (int)p >= MCD_PARAM_COUNT)
        return MCD_EINVAL;
    if (!mcdi_finite(value))
        return MCD_EINVAL;
    if (p == MCD_PARAM_DIPOLE || p == MCD_PARAM_ASSOC) {
        if (!(value >= 0.0))
            return MCD_EDOM;
    } else if (!(value > 0.0)) {
        return MCD_EDOM;
    }
    return MCD_OK;
}

mcd_status mcdi_api_db_new(mcd_db **out_db)
{
    mcd_db *db;
    if (out_db == NULL)
        return MCD_EINVAL;
    db = calloc(1, sizeof *db);
    if (db == NULL)
        return MCD_ENOMEM;
    *out_db = db;
    return MCD_OK;
}

mcd_status mcdi_api_db_new_builtin(mcd_db **out_db)
{
    mcd_db *db = NULL;
    mcd_status st;
    size_t i, n = mcdi_builtin_count();
    if (out_db == NULL)
        return MCD_EINVAL;
    if ((st = mcdi_api_db_new(&db)) != MCD_OK)
        return st;
    if ((st = mcdi_db_reserve(db, n)) != MCD_OK)
        goto fail;
    for (i = 0; i < n; ++i)
        mcdi_builtin_fill(i, &db->sp[i]);
    db->n = n;
    *out_db = db;
    return MCD_OK;
fail:
    mcd_db_free(db);
    return st;
}

MCD_API void mcd_db_free(mcd_db *db)
{
    if (db == NULL)
        return;
    free(db->sp);
    free(db);
}

MCD_API size_t mcd_db_species_count(const mcd_db *db) { return db ? db->n : 0; }

MCD_API const char *mcd_db_name(const mcd_db *db, size_t i)
{
    if (db == NULL || i >= db->n)
        return NULL;
    return db->sp[i].name;
}

MCD_API const char *mcd_db_formula(const mcd_db *db, size_t i)
{
    if (db == NULL || i >= db->n)
        return NULL;
    return db->sp[i].formula;
}

MCD_API const char *mcd_db_source(const mcd_db *db, size_t i, mcd_param p)
{
    if (db == NULL || i >= db->n || (int)p < 0 || (int)p >= MCD_PARAM_COUNT)
        return NULL;
    return db->sp[i].src[p];
}

mcd_status mcdi_api_db_param(const mcd_db *db, size_t i, mcd_param p,
                             double *out_value)
{
    double v;
    if (db == NULL || out_value == NULL || i >= db->n || (int)p < 0 ||
        (int)p >= MCD_PARAM_COUNT)
        return MCD_EINVAL;
    v = db->sp[i].p[p];
    if (isnan(v))
        return mcdi_fail(MCD_ENODATA, "species '%s' has no %s (%s)",
                         db->sp[i].name, mcd_param_name(p), mcd_param_unit(p));
    *out_value = v;
    return MCD_OK;
}

mcd_status mcdi_api_db_add(mcd_db *db, const char *name, const char *formula,
                           int n_rings, size_t *out_index)
{
    mcdi_species s;
    mcd_status st;
    size_t i;
    if (db == NULL || name == NULL || formula == NULL) {
        mcdi_note("NULL argument");
        return MCD_EINVAL;
    }
    st = mcdi_species_from_formula(name, formula, n_rings, &s);
    if (st != MCD_OK)
        return st;
    if (mcdi_db_index_of(db, name) == (size_t)-1 &&
        (st = mcdi_db_reserve(db, db->n + 1)) != MCD_OK) {
        mcdi_note("out of memory");
        return st;
    }
    i = mcdi_db_put(db, &s);
    if (out_index != NULL)
        *out_index = i;
    return MCD_OK;
}

mcd_status mcdi_api_db_set_param(mcd_db *db, size_t i, mcd_param p,
                                 double value)
{
    mcd_status st;
    if (db == NULL || i >= db->n)
        return MCD_EINVAL;
    if ((st = mcdi_param_check(p, value)) != MCD_OK)
        return st;
    db->sp[i].p[p] = value;
    db->sp[i].src[p] = mcdi_src_user;
    return MCD_OK;
}
