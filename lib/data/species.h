/* species.h - private species record and database struct (data layer),
 * shared by species_table.c, db.c and db_file.c. Never installed. */
#ifndef MCD_SPECIES_H
#define MCD_SPECIES_H

#include <stddef.h>
#include "mcdiff.h"

#define MCDI_NAME_MAX 63          /* longest species name (characters) */
#define MCDI_FORMULA_TEXT_MAX 255 /* longest formula text (characters) */

/* One species. Unknown parameters are NaN with src NULL. Sources point to
 * static strings (never owned). */
typedef struct mcdi_species {
    char name[MCDI_NAME_MAX + 1];
    char formula[MCDI_FORMULA_TEXT_MAX + 1];
    double p[MCD_PARAM_COUNT];
    const char *src[MCD_PARAM_COUNT];
} mcdi_species;

struct mcd_db {
    mcdi_species *sp; /* growable array */
    size_t n, cap;
};

/* Source text for values set through the API or a file. */
extern const char mcdi_src_user[];

/* Source texts of molar masses and diffusion volumes, shared by the
 * built-in table and mcd_db_add (species_table.c). */
extern const char mcdi_src_m_formula[], mcdi_src_m_air[], mcdi_src_m_d2[];
extern const char mcdi_src_v_table[], mcdi_src_v_increments[];

/* species_table.c: number of built-in species and filling record i. */
size_t mcdi_builtin_count(void);
void mcdi_builtin_fill(size_t i, mcdi_species *out);

/* db.c helpers shared with db_file.c. */
/* Validate a species name; EPARSE with message if bad. */
mcd_status mcdi_db_check_name(const char *name);
/* Index of a name (case-insensitive) or (size_t)-1. */
size_t mcdi_db_index_of(const mcd_db *db, const char *name);
/* Ensure room for one more species. */
mcd_status mcdi_db_reserve(mcd_db *db, size_t need);
/* Build a record from name and formula as mcd_db_add does (M, V). */
mcd_status mcdi_species_from_formula(const char *name, const char *formula,
                                     int n_rings, mcdi_species *out);
/* Insert or replace (same name keeps index). Caller reserved room. */
size_t mcdi_db_put(mcd_db *db, const mcdi_species *s);
/* Range check of mcd_db_set_param: MCD_OK, EINVAL (NaN/inf) or EDOM. */
mcd_status mcdi_param_check(mcd_param p, double value);
/* ASCII case-insensitive equality. */
int mcdi_ieq(const char *a, const char *b);

#endif
