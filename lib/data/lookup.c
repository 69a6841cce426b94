/* lookup.c - finding a species in a database by what a user types
 * (mcd_db_find): its name, a common synonym, or its formula.
 *
 * Order (the first rule that gives exactly one species wins):
 *  1. the name, case-insensitive;
 *  2. the name with spaces, '_' and '-' taken as the same character
 *     ("carbon dioxide", "Carbon_Dioxide");
 *  3. a synonym of the table below (other names in common use for a
 *     built-in species: IUPAC names, British spellings, refrigerant
 *     numbers; common practice), whose species must be in the database;
 *  4. a formula, compared by composition (element counts after parsing):
 *     "C2H6O" finds ethanol written C2H5OH, "CH4O" methanol. When several
 *     species share the composition (n-butane and isobutane are both
 *     C4H10) the lookup refuses and names them all;
 *  5. text that is not a formula but differs only in case from exactly
 *     one species' formula text ("h2o", "co2"; "Co" stays cobalt, which
 *     no gas in the table is).
 * A miss names up to three species whose names are closest in edit
 * distance ("did you mean").
 */
#include <ctype.h>
#include <stdio.h>
#include <string.h>

#include "base/mcd_internal.h"
#include "base/checks.h"
#include "data/formula.h"
#include "data/species.h"

#define NONE ((size_t)-1)

/* Other names of built-in species: {synonym, name in the table}. */
static const char *const SYNONYMS[][2] = {
    {"steam", "water"},
    {"water-vapour", "water"},
    {"water-vapor", "water"},
    {"ethene", "ethylene"},
    {"propene", "propylene"},
    {"ethyne", "acetylene"},
    {"butane", "n-butane"},
    {"2-methylpropane", "isobutane"},
    {"i-butane", "isobutane"},
    {"pentane", "n-pentane"},
    {"hexane", "n-hexane"},
    {"heptane", "n-heptane"},
    {"octane", "n-octane"},
    {"methyl-alcohol", "methanol"},
    {"ethyl-alcohol", "ethanol"},
    {"propanol", "1-propanol"},
    {"n-propanol", "1-propanol"},
    {"propan-1-ol", "1-propanol"},
    {"propanone", "acetone"},
    {"ether", "diethyl-ether"},
    {"ethoxyethane", "diethyl-ether"},
    {"ethyl-ethanoate", "ethyl-acetate"},
    {"methylbenzene", "toluene"},
    {"trichloromethane", "chloroform"},
    {"tetrachloromethane", "carbon-tetrachloride"},
    {"methylene-chloride", "dichloromethane"},
    {"hydrogen-sulphide", "hydrogen-sulfide"},
    {"sulphur-dioxide", "sulfur-dioxide"},
    {"sulphur-hexafluoride", "sulfur-hexafluoride"},
    {"nitrogen-monoxide", "nitric-oxide"},
    {"dinitrogen-monoxide", "nitrous-oxide"},
    {"r-134a", "r134a"},
    {"hfc-134a", "r134a"},
    {"r-32", "r32"},
    {"hfc-32", "r32"},
    {"r-22", "r22"},
    {"hcfc-22", "r22"},
};
#define N_SYNONYMS (sizeof SYNONYMS / sizeof SYNONYMS[0])

/* Lower case, with ' ' and '_' read as '-'. */
static int fold(int ch)
{
    if (ch == ' ' || ch == '_')
        return '-';
    return tolower((unsigned char)ch);
}

/* a and b equal after fold(). */
static int loose_eq(const char *a, const char *b)
{
    for (; *a && *b; a++, b++)
        if (fold(*a) != fold(*b))
            return 0;
    return *a == *b;
}

/* Edit distance of a and b after fold(), both at most 63 characters
 * (longer: a large number); one row of the usual dynamic programme. */
static size_t distance(const char *a, const char *b)
{
    size_t la = strlen(a), lb = strlen(b), row[64], i, j;
    if (la > 63 || lb > 63)
        return 1000;
    for (j = 0; j <= lb; j++)
        row[j] = j;
    for (i = 1; i <= la; i++) {
        size_t diag = row[0];
        row[0] = i;
        for (j = 1; j <= lb; j++) {
            size_t up = row[j],
                   best = diag + (fold(a[i - 1]) != fold(b[j - 1]));
            if (up + 1 < best)
                best = up + 1;
            if (row[j - 1] + 1 < best)
                best = row[j - 1] + 1;
            diag = up;
            row[j] = best;
        }
    }
    return row[lb];
}

/* The one species whose name passes eq(name, text), NONE if none or
 * several. */
static size_t by_name(const mcd_db *db, const char *text,
                      int (*eq)(const char *, const char *))
{
    size_t i, hit = NONE;
    for (i = 0; i < db->n; ++i)
        if (eq(db->sp[i].name, text)) {
            if (hit != NONE)
                return NONE;
            hit = i;
        }
    return hit;
}

static size_t by_synonym(const mcd_db *db, const char *text)
{
    size_t k;
    for (k = 0; k < N_SYNONYMS; k++)
        if (loose_eq(SYNONYMS[k][0], text))
            return mcdi_db_index_of(db, SYNONYMS[k][1]);
    return NONE;
}

/* Species with the composition of formula f: the count, the first index
 * in *hit, and their names listed in list (comma-separated). */
static size_t by_composition(const mcd_db *db, const mcdi_formula *f,
                             size_t *hit, char *list, size_t cap)
{
    size_t i, hits = 0, used = 0;
    list[0] = '\0';
    for (i = 0; i < db->n; ++i) {
        mcdi_formula g;
        if (mcdi_formula_parse(db->sp[i].formula, &g) != MCD_OK)
            continue; /* "air": not a formula */
        if (!mcdi_formula_same(&g, f))
            continue;
        if (hits++ == 0)
            *hit = i;
        if (used < cap) {
            int w = snprintf(list + used, cap - used, "%s%s",
                             hits > 1 ? ", " : "", db->sp[i].name);
            used += w > 0 ? (size_t)w : 0;
        }
    }
    mcdi_err_clear(); /* the parses of non-formulas noted their errors */
    return hits;
}

/* Up to three names closest to text (distance <= max(2, len / 3)). */
static void suggestions(const mcd_db *db, const char *text, char *out,
                        size_t cap)
{
    size_t best[3] = {NONE, NONE, NONE}, dist[3] = {0, 0, 0}, i, k;
    size_t limit = strlen(text) / 3 > 2 ? strlen(text) / 3 : 2, used = 0;
    for (i = 0; i < db->n; ++i) {
        size_t d = distance(db->sp[i].name, text);
        if (d > limit)
            continue;
        for (k = 0; k < 3; k++)
            if (best[k] == NONE || d < dist[k]) {
                size_t m;
                for (m = 2; m > k; m--) {
                    best[m] = best[m - 1];
                    dist[m] = dist[m - 1];
                }
                best[k] = i;
                dist[k] = d;
                break;
            }
    }
    out[0] = '\0';
    for (k = 0; k < 3 && best[k] != NONE && used < cap; k++) {
        int w = snprintf(out + used, cap - used, "%s%s", k ? ", " : "",
                         db->sp[best[k]].name);
        used += w > 0 ? (size_t)w : 0;
    }
}

mcd_status mcdi_api_db_find(const mcd_db *db, const char *name,
                            size_t *out_index)
{
    char list[160];
    mcdi_formula f;
    size_t i, n_comp = 0;
    mcd_status st;
    if ((st = MCDI_CHECK_PTRS3(db, name, out_index)) != MCD_OK)
        return st;
    if ((i = mcdi_db_index_of(db, name)) == NONE &&
        (i = by_name(db, name, loose_eq)) == NONE &&
        (i = by_synonym(db, name)) == NONE) {
        const int parsed = mcdi_formula_parse(name, &f) == MCD_OK;
        mcdi_err_clear();
        if (parsed)
            n_comp = by_composition(db, &f, &i, list, sizeof list);
        if (n_comp > 1)
            return mcdi_fail(MCD_ENOTFOUND,
                             "'%s' is the formula of several species (%s): "
                             "give the name",
                             name, list);
        if (!parsed) {
            size_t k, hit = NONE, hits = 0;
            for (k = 0; k < db->n; ++k)
                if (mcdi_ieq(db->sp[k].formula, name)) {
                    hit = k;
                    hits++;
                }
            i = hits == 1 ? hit : NONE;
        }
    }
    if (i == NONE) {
        suggestions(db, name, list, sizeof list);
        if (list[0] != '\0')
            return mcdi_fail(MCD_ENOTFOUND,
                             "no species '%s' by name or formula; did you "
                             "mean %s?",
                             name, list);
        return mcdi_fail(MCD_ENOTFOUND, "no species '%s' by name or formula",
                         name);
    }
    *out_index = i;
    return MCD_OK;
}
