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
    /* Species added with the widened table (names in common use, IUPAC
     * names, refrigerant numbers; common practice). */
    {"hydrogen-atom", "atomic-hydrogen"},
    {"oxygen-atom", "atomic-oxygen"},
    {"nitrogen-atom", "atomic-nitrogen"},
    {"carbon-atom", "atomic-carbon"},
    {"hydroxyl-radical", "hydroxyl"},
    {"hydroperoxy", "hydroperoxyl"},
    {"methyl-radical", "methyl"},
    {"methoxyl", "methoxy"},
    {"ethenyl", "vinyl"},
    {"amino-radical", "amidogen"},
    {"methanal", "formaldehyde"},
    {"ethanal", "acetaldehyde"},
    {"ethenone", "ketene"},
    {"hydrocyanic-acid", "hydrogen-cyanide"},
    {"trioxygen", "ozone"},
    {"methylacetylene", "propyne"},
    {"butadiene", "1,3-butadiene"},
    {"buta-1,3-diene", "1,3-butadiene"},
    {"but-1-ene", "1-butene"},
    {"isobutene", "isobutylene"},
    {"2-methylpropene", "isobutylene"},
    {"2-methylbutane", "isopentane"},
    {"2,2-dimethylpropane", "neopentane"},
    {"dme", "dimethyl-ether"},
    {"methoxymethane", "dimethyl-ether"},
    {"monosilane", "silane"},
    {"dcs", "dichlorosilane"},
    {"tcs", "trichlorosilane"},
    {"tetrachlorosilane", "silicon-tetrachloride"},
    {"tetrafluorosilane", "silicon-tetrafluoride"},
    {"tetraethyl-orthosilicate", "teos"},
    {"tetraethoxysilane", "teos"},
    {"tmga", "trimethylgallium"},
    {"trimethyl-gallium", "trimethylgallium"},
    {"tmal", "trimethylaluminium"},
    {"trimethylaluminum", "trimethylaluminium"},
    {"trimethyl-aluminium", "trimethylaluminium"},
    {"phosphane", "phosphine"},
    {"arsane", "arsine"},
    {"tetrafluoromethane", "carbon-tetrafluoride"},
    {"r14", "carbon-tetrafluoride"},
    {"r-14", "carbon-tetrafluoride"},
    {"r116", "hexafluoroethane"},
    {"r-116", "hexafluoroethane"},
    {"perfluoroethane", "hexafluoroethane"},
    {"diazane", "hydrazine"},
    {"mercury-vapour", "mercury"},
    {"mercury-vapor", "mercury"},
    {"carbonyl-sulphide", "carbonyl-sulfide"},
    {"carbon-disulphide", "carbon-disulfide"},
    {"carbonyl-chloride", "phosgene"},
    {"sulphur-trioxide", "sulfur-trioxide"},
    {"chloromethane", "methyl-chloride"},
    {"r40", "methyl-chloride"},
    {"bromomethane", "methyl-bromide"},
    {"chloroethane", "ethyl-chloride"},
    {"chloroethene", "vinyl-chloride"},
    {"ethylene-dichloride", "1,2-dichloroethane"},
    {"trichloroethene", "trichloroethylene"},
    {"tetrachloroethene", "tetrachloroethylene"},
    {"perchloroethylene", "tetrachloroethylene"},
    {"r-11", "r11"},
    {"cfc-11", "r11"},
    {"r-12", "r12"},
    {"cfc-12", "r12"},
    {"r-13", "r13"},
    {"cfc-13", "r13"},
    {"r-23", "r23"},
    {"hfc-23", "r23"},
    {"fluoroform", "r23"},
    {"r-41", "r41"},
    {"fluoromethane", "r41"},
    {"methyl-fluoride", "r41"},
    {"r-113", "r113"},
    {"cfc-113", "r113"},
    {"r-114", "r114"},
    {"cfc-114", "r114"},
    {"r-115", "r115"},
    {"cfc-115", "r115"},
    {"r-123", "r123"},
    {"hcfc-123", "r123"},
    {"r-124", "r124"},
    {"hcfc-124", "r124"},
    {"r-125", "r125"},
    {"hfc-125", "r125"},
    {"pentafluoroethane", "r125"},
    {"r-141b", "r141b"},
    {"hcfc-141b", "r141b"},
    {"r-142b", "r142b"},
    {"hcfc-142b", "r142b"},
    {"r-143a", "r143a"},
    {"hfc-143a", "r143a"},
    {"r-152a", "r152a"},
    {"hfc-152a", "r152a"},
    {"1,1-difluoroethane", "r152a"},
    {"r-218", "r218"},
    {"octafluoropropane", "r218"},
    {"r-c318", "rc318"},
    {"octafluorocyclobutane", "rc318"},
    {"r-227ea", "r227ea"},
    {"hfc-227ea", "r227ea"},
    {"r-245fa", "r245fa"},
    {"hfc-245fa", "r245fa"},
    {"r-1234yf", "r1234yf"},
    {"hfo-1234yf", "r1234yf"},
    {"r1234ze", "r1234ze-e"},
    {"r-1234ze(e)", "r1234ze-e"},
    {"r1234ze(e)", "r1234ze-e"},
    {"hfo-1234ze(e)", "r1234ze-e"},
    {"r-717", "ammonia"},
    {"r717", "ammonia"},
    {"r-718", "water"},
    {"r718", "water"},
    {"r-744", "carbon-dioxide"},
    {"r744", "carbon-dioxide"},
    {"r-290", "propane"},
    {"r290", "propane"},
    {"r-600", "n-butane"},
    {"r600", "n-butane"},
    {"r-600a", "isobutane"},
    {"r600a", "isobutane"},
    {"r-1270", "propylene"},
    {"r1270", "propylene"},
    {"r-50", "methane"},
    {"r50", "methane"},
    {"r-170", "ethane"},
    {"r170", "ethane"},
    {"r-1150", "ethylene"},
    {"r1150", "ethylene"},
    {"nonane", "n-nonane"},
    {"decane", "n-decane"},
    {"dodecane", "n-dodecane"},
    {"2,2,4-trimethylpentane", "isooctane"},
    {"1,2-dimethylbenzene", "o-xylene"},
    {"1,3-dimethylbenzene", "m-xylene"},
    {"1,4-dimethylbenzene", "p-xylene"},
    {"vinylbenzene", "styrene"},
    {"ethenylbenzene", "styrene"},
    {"hydroxybenzene", "phenol"},
    {"butanol", "1-butanol"},
    {"n-butanol", "1-butanol"},
    {"butan-1-ol", "1-butanol"},
    {"isopropanol", "2-propanol"},
    {"isopropyl-alcohol", "2-propanol"},
    {"propan-2-ol", "2-propanol"},
    {"ipa", "2-propanol"},
    {"ethanoic-acid", "acetic-acid"},
    {"methanoic-acid", "formic-acid"},
    {"methyl-cyanide", "acetonitrile"},
    {"ethanenitrile", "acetonitrile"},
    {"mek", "methyl-ethyl-ketone"},
    {"butanone", "methyl-ethyl-ketone"},
    {"2-butanone", "methyl-ethyl-ketone"},
    {"thf", "tetrahydrofuran"},
    {"oxolane", "tetrahydrofuran"},
    {"dioxane", "1,4-dioxane"},
    {"dmf", "dimethylformamide"},
    {"n,n-dimethylformamide", "dimethylformamide"},
    {"dmso", "dimethyl-sulfoxide"},
    {"dimethyl-sulphoxide", "dimethyl-sulfoxide"},
    {"aminobenzene", "aniline"},
    {"phenylamine", "aniline"},
    {"methanamine", "methylamine"},
    {"oxirane", "ethylene-oxide"},
    {"ethane-1,2-diol", "ethylene-glycol"},
    {"glycol", "ethylene-glycol"},
    {"methyl-mercaptan", "methanethiol"},
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
