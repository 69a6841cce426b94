/* formula.h - private interface of the formula parser and element and
 * diffusion-volume tables (data layer). Never installed. */
#ifndef MCD_FORMULA_H
#define MCD_FORMULA_H

#include <stddef.h>
#include "mcdiff.h"

/* Largest number of distinct elements in one parsed formula (all of them). */
#define MCDI_FORMULA_MAX_ELEM 118
/* Largest atom count of one element after multiplying out all groups. */
#define MCDI_FORMULA_MAX_COUNT 1000000000L
/* Deepest nesting of parenthesised groups. */
#define MCDI_FORMULA_MAX_DEPTH 8

/* A parsed formula: distinct elements in order of first appearance. */
typedef struct mcdi_formula {
    size_t n;
    int Z[MCDI_FORMULA_MAX_ELEM];
    long count[MCDI_FORMULA_MAX_ELEM];
} mcdi_formula;

/* Parse formula into *out (written only on success). Errors: EINVAL (NULL),
 * EPARSE (malformed), ENOTFOUND (unknown element); the error detail gets
 * "position K: ...". No allocation. */
mcd_status mcdi_formula_parse(const char *formula, mcdi_formula *out);

/* Molar mass [kg/mol] of a parsed formula; ENOTFOUND (with message) if an
 * element has no standard atomic weight. */
mcd_status mcdi_formula_mass(const mcdi_formula *f, double *out_M);

/* Fuller-Ensley-Giddings increment sum of a parsed formula with n_rings ring
 * increments; ENODATA (with message) for an element without increment,
 * EINVAL for n_rings < 0 or a non-positive sum. */
mcd_status mcdi_formula_fsg_volume(const mcdi_formula *f, int n_rings,
                                   double *out_V);

/* 1 if the two parsed formulas have the same elements and counts. */
int mcdi_formula_same(const mcdi_formula *a, const mcdi_formula *b);

/* elements.c: atomic number of a 1- or 2-letter symbol, 0 if none;
 * standard atomic weight [g/mol] of Z, 0 if none. */
int mcdi_element_lookup(const char *sym, size_t len);
double mcdi_element_weight_g(int Z);

/* fsg_volumes.c: atomic increment of element Z (0 = none) and the ring
 * increment; tabulated molecule volume by formula text (exact match, "air"
 * case-insensitive, "D2") or by composition. Return 1 when found. */
double mcdi_fsg_atomic_increment(int Z);
double mcdi_fsg_ring_increment(void);
int mcdi_fsg_lookup(const char *formula, const mcdi_formula *parsed,
                    double *out_V);

#endif
