/* formula.c - chemical formula parser, molar masses and Fuller-Ensley-Giddings
 * increment sums.
 *
 * Grammar (see mcdiff.h):
 *   formula := term+
 *   term    := element count? | '(' term+ ')' count?
 *   element := [A-Z][a-z]?      (must be one of the 118 symbols)
 *   count   := [1-9][0-9]*      (positive; after multiplying out all groups
 *                                each element count <= MCDI_FORMULA_MAX_COUNT)
 * Groups nest at most MCDI_FORMULA_MAX_DEPTH (8) deep. The parser is a
 * recursive descent over the group structure: each group is parsed into its
 * own element list, which is multiplied by the group count and merged into
 * the enclosing list, keeping the order of first appearance. The recursion
 * depth is bounded by 8 and each level holds one mcdi_formula on the stack
 * (about 1.4 kB), so no heap memory is used.
 *
 * Molar mass: M = sum_e n_e A_e with A_e the standard atomic weights of
 * elements.c (IUPAC CIAAW 2021). Diffusion volume: V = sum_e n_e v_e +
 * n_rings v_ring with the increments of fsg_volumes.c (Fuller, Ensley and
 * Giddings 1969).
 */
#include <stdio.h>
#include <string.h>
#include "base/mcd_internal.h"
#include "base/checks.h"
#include "data/formula.h"

typedef struct parser {
    const char *s;
    size_t pos; /* 0-based index of the next character */
} parser;

static int is_upper(char c) { return c >= 'A' && c <= 'Z'; }
static int is_lower(char c) { return c >= 'a' && c <= 'z'; }
static int is_digit(char c) { return c >= '0' && c <= '9'; }

/* Describe character c for a message: 'x' when printable, else its code. */
static void describe_char(char c, char *buf, size_t len)
{
    unsigned char u = (unsigned char)c;
    if (u >= 0x21 && u < 0x7f)
        snprintf(buf, len, "'%c'", c);
    else if (u == ' ')
        snprintf(buf, len, "a space");
    else
        snprintf(buf, len, "byte 0x%02x", (unsigned)u);
}

/* Add count*k of element Z to f, checking the count limit. */
static mcd_status add_atoms(parser *p, size_t at, mcdi_formula *f, int Z,
                            long count)
{
    size_t i;
    for (i = 0; i < f->n; ++i) {
        if (f->Z[i] == Z) {
            if (count > MCDI_FORMULA_MAX_COUNT - f->count[i]) {
                mcdi_note("position %zu: atom count of '%s' exceeds %ld",
                          at + 1, mcd_element_symbol(Z),
                          MCDI_FORMULA_MAX_COUNT);
                return MCD_EPARSE;
            }
            f->count[i] += count;
            return MCD_OK;
        }
    }
    /* n < 118 always holds here: each Z appears at most once. */
    f->Z[f->n] = Z;
    f->count[f->n] = count;
    f->n++;
    return MCD_OK;
}

/* Read an optional count at p->pos; *out = 1 when absent. */
static mcd_status read_count(parser *p, long *out)
{
    size_t start = p->pos;
    long v = 0;
    if (!is_digit(p->s[p->pos])) {
        *out = 1;
        return MCD_OK;
    }
    if (p->s[p->pos] == '0') {
        mcdi_note("position %zu: count must be a positive integer "
                  "without leading zeros",
                  start + 1);
        return MCD_EPARSE;
    }
    while (is_digit(p->s[p->pos])) {
        int d = p->s[p->pos] - '0';
        if (v > (MCDI_FORMULA_MAX_COUNT - d) / 10) {
            mcdi_note("position %zu: count exceeds %ld", start + 1,
                      MCDI_FORMULA_MAX_COUNT);
            return MCD_EPARSE;
        }
        v = v * 10 + d;
        p->pos++;
    }
    *out = v;
    return MCD_OK;
}

/* Parse terms until end of string or ')' (not consumed) into *acc. */
static mcd_status parse_seq(parser *p, int depth, mcdi_formula *acc)
{
    mcd_status st;
    for (;;) {
        char c = p->s[p->pos];
        size_t at = p->pos;
        if (c == '\0' || c == ')')
            return MCD_OK;
        if (is_upper(c)) {
            size_t len = is_lower(p->s[p->pos + 1]) ? 2 : 1;
            int Z = mcdi_element_lookup(p->s + p->pos, len);
            long n;
            if (Z == 0) {
                mcdi_note("position %zu: unknown element '%.*s'", at + 1,
                          (int)len, p->s + p->pos);
                return MCD_ENOTFOUND;
            }
            p->pos += len;
            if ((st = read_count(p, &n)) != MCD_OK)
                return st;
            if ((st = add_atoms(p, at, acc, Z, n)) != MCD_OK)
                return st;
        } else if (c == '(') {
            mcdi_formula sub;
            long n;
            size_t i;
            if (depth >= MCDI_FORMULA_MAX_DEPTH) {
                mcdi_note("position %zu: groups nested deeper than %d", at + 1,
                          MCDI_FORMULA_MAX_DEPTH);
                return MCD_EPARSE;
            }
            p->pos++;
            sub.n = 0;
            if ((st = parse_seq(p, depth + 1, &sub)) != MCD_OK)
                return st;
            if (p->s[p->pos] != ')') {
                mcdi_note("position %zu: expected ')' to close the '(' "
                          "at position %zu",
                          p->pos + 1, at + 1);
                return MCD_EPARSE;
            }
            if (sub.n == 0) {
                mcdi_note("position %zu: empty group '()'", at + 1);
                return MCD_EPARSE;
            }
            p->pos++;
            if ((st = read_count(p, &n)) != MCD_OK)
                return st;
            for (i = 0; i < sub.n; ++i) {
                if (sub.count[i] > MCDI_FORMULA_MAX_COUNT / n) {
                    mcdi_note("position %zu: atom count of '%s' exceeds "
                              "%ld",
                              at + 1, mcd_element_symbol(sub.Z[i]),
                              MCDI_FORMULA_MAX_COUNT);
                    return MCD_EPARSE;
                }
                if ((st = add_atoms(p, at, acc, sub.Z[i], sub.count[i] * n)) !=
                    MCD_OK)
                    return st;
            }
        } else {
            char d[24];
            describe_char(c, d, sizeof d);
            if (is_digit(c))
                mcdi_note("position %zu: count %s without an element or "
                          "group before it",
                          at + 1, d);
            else
                mcdi_note("position %zu: unexpected %s, expected an "
                          "element symbol or '('",
                          at + 1, d);
            return MCD_EPARSE;
        }
    }
}

mcd_status mcdi_formula_parse(const char *formula, mcdi_formula *out)
{
    parser p;
    mcdi_formula f;
    mcd_status st;
    if (formula == NULL || out == NULL) {
        mcdi_note("formula is NULL");
        return MCD_EINVAL;
    }
    if (formula[0] == '\0') {
        mcdi_note("position 1: empty formula");
        return MCD_EPARSE;
    }
    p.s = formula;
    p.pos = 0;
    f.n = 0;
    if ((st = parse_seq(&p, 0, &f)) != MCD_OK)
        return st;
    if (formula[p.pos] == ')') {
        mcdi_note("position %zu: unbalanced ')'", p.pos + 1);
        return MCD_EPARSE;
    }
    *out = f;
    return MCD_OK;
}

mcd_status mcdi_formula_mass(const mcdi_formula *f, double *out_M)
{
    double M = 0.0;
    size_t i;
    for (i = 0; i < f->n; ++i) {
        double A = mcdi_element_weight_g(f->Z[i]);
        if (!(A > 0.0)) {
            mcdi_note("element '%s' has no standard atomic weight",
                      mcd_element_symbol(f->Z[i]));
            return MCD_ENOTFOUND;
        }
        M += (double)f->count[i] * A;
    }
    *out_M = M * 1e-3;
    return MCD_OK;
}

mcd_status mcdi_formula_fsg_volume(const mcdi_formula *f, int n_rings,
                                   double *out_V)
{
    double V = 0.0;
    size_t i;
    if (n_rings < 0) {
        mcdi_note("n_rings = %d is negative", n_rings);
        return MCD_EINVAL;
    }
    for (i = 0; i < f->n; ++i) {
        double v = mcdi_fsg_atomic_increment(f->Z[i]);
        if (!(v > 0.0)) {
            mcdi_note("element '%s' has no Fuller-Ensley-Giddings "
                      "volume increment",
                      mcd_element_symbol(f->Z[i]));
            return MCD_ENODATA;
        }
        V += (double)f->count[i] * v;
    }
    V += (double)n_rings * mcdi_fsg_ring_increment();
    if (!(V > 0.0)) {
        mcdi_note("n_rings = %d leaves a non-positive diffusion volume "
                  "(%g)",
                  n_rings, V);
        return MCD_EINVAL;
    }
    *out_V = V;
    return MCD_OK;
}

/* The count of element Z in f; 0 when absent (counts are >= 1). */
static long count_of(const mcdi_formula *f, int Z)
{
    size_t j;
    for (j = 0; j < f->n; ++j)
        if (f->Z[j] == Z)
            return f->count[j];
    return 0;
}

int mcdi_formula_same(const mcdi_formula *a, const mcdi_formula *b)
{
    size_t i;
    if (a->n != b->n)
        return 0;
    for (i = 0; i < a->n; ++i)
        if (count_of(b, a->Z[i]) != a->count[i])
            return 0;
    return 1;
}

mcd_status mcdi_api_formula_molar_mass(const char *formula, double *out_M)
{
    mcdi_formula f;
    double M;
    mcd_status st;
    if ((st = MCDI_CHECK_PTRS2(formula, out_M)) != MCD_OK ||
        (st = mcdi_formula_parse(formula, &f)) != MCD_OK ||
        (st = mcdi_formula_mass(&f, &M)) != MCD_OK)
        return st;
    *out_M = M;
    return MCD_OK;
}

mcd_status mcdi_api_formula_elements(const char *formula, size_t cap,
                                     int *out_Z, long *out_count, size_t *out_n)
{
    mcdi_formula f;
    mcd_status st;
    size_t i;
    if ((st = MCDI_CHECK_PTRS2(formula, out_n)) != MCD_OK ||
        (st = MCDI_CHECK_PTRS2(out_Z, out_count)) != MCD_OK ||
        (st = mcdi_formula_parse(formula, &f)) != MCD_OK)
        return st;
    if (f.n > cap) {
        mcdi_note("formula has %zu distinct elements, capacity is %zu", f.n,
                  cap);
        return MCD_EBADLEN;
    }
    for (i = 0; i < f.n; ++i) {
        out_Z[i] = f.Z[i];
        out_count[i] = f.count[i];
    }
    *out_n = f.n;
    return MCD_OK;
}

mcd_status mcdi_api_formula_diffusion_volume(const char *formula, int n_rings,
                                             double *out_V)
{
    mcdi_formula f;
    double V;
    mcd_status st;
    if ((st = MCDI_CHECK_PTRS2(formula, out_V)) != MCD_OK)
        return st;
    if (n_rings < 0)
        return mcdi_fail(MCD_EINVAL, "argument n_rings: %d is negative",
                         n_rings);
    if ((st = mcdi_formula_parse(formula, &f)) != MCD_OK ||
        (st = mcdi_formula_fsg_volume(&f, n_rings, &V)) != MCD_OK)
        return st;
    *out_V = V;
    return MCD_OK;
}
