/* db_file.c - loading species from the mcdiff species text format.
 *
 * The format (documented for users in the README, "Species files"):
 *
 *   mcdiff-species 1            first meaningful line: format name, version
 *   species NAME                starts a block; ends at the next "species"
 *   KEY VALUE [UNIT]            one parameter per line inside a block
 *   # ...                       comment to the end of the line
 *
 * Keys: formula (required), rings, M, V_diff, sigma, eps_k, dipole, Vb, Tb,
 * Tc, Pc, assoc. Dimensional values need an explicit unit from a fixed list;
 * dimensionless ones take none. A block defines the species completely: it
 * is built from its formula as mcd_db_add does, then the given values
 * replace the computed or unknown ones (source "user"). A block whose name
 * exists in the database replaces that species at the same index.
 *
 * All or nothing: the text is applied to a copy of the database, which is
 * swapped in only when the whole text has been read without error.
 * Numbers are parsed strictly: the whole token must be a decimal number
 * (digits, sign, point, exponent; no hex, inf or nan) and finite.
 */
#include <stdio.h>
#include <stdlib.h>
#include <string.h>
#include "base/mcd_internal.h"
#include "data/species.h"

#define MAX_TOKENS 8
#define HEADER_NAME "mcdiff-species"
#define HEADER_VERSION "1"

typedef struct token {
    const char *s;
    size_t len;
} token;

typedef struct unit_def {
    const char *text;
    double factor; /* SI value = value in the unit * factor + offset */
    double offset;
} unit_def;

/* Units accepted per parameter, in mcd_param order. NULL list = no unit.
   Non-ASCII spellings are UTF-8: the angstrom sign as U+00C5 and U+212B,
   the degree sign U+00B0. */
static const unit_def units_M[] = {
    {"kg/mol", 1.0, 0}, {"g/mol", 1e-3, 0}, {NULL, 0, 0}};
static const unit_def units_sigma[] = {{"m", 1.0, 0},
                                       {"nm", 1e-9, 0},
                                       {"pm", 1e-12, 0},
                                       {"angstrom", 1e-10, 0},
                                       {"Angstrom", 1e-10, 0},
                                       {"A", 1e-10, 0},
                                       {"\xc3\x85", 1e-10, 0},
                                       {"\xe2\x84\xab", 1e-10, 0},
                                       {NULL, 0, 0}};
/* An energy over k_B: kelvin only (no offset scale makes sense). */
static const unit_def units_K[] = {{"K", 1.0, 0}, {NULL, 0, 0}};
/* Temperatures: kelvin or Celsius (T/K = t/degC + 273.15, by definition). */
static const unit_def units_T[] = {{"K", 1.0, 0},
                                   {"C", 1.0, 273.15},
                                   {"degC", 1.0, 273.15},
                                   {"\xc2\xb0"
                                    "C",
                                    1.0, 273.15},
                                   {NULL, 0, 0}};
/* 1 debye = 1e-21/c C m = 3.33564e-30 C m (c = 299792458 m/s). */
static const unit_def units_dipole[] = {{"C m", 1.0, 0},
                                        {"C*m", 1.0, 0},
                                        {"debye", 3.33564e-30, 0},
                                        {"D", 3.33564e-30, 0},
                                        {NULL, 0, 0}};
static const unit_def units_Vb[] = {{"m3/mol", 1.0, 0},
                                    {"m^3/mol", 1.0, 0},
                                    {"cm3/mol", 1e-6, 0},
                                    {"cm^3/mol", 1e-6, 0},
                                    {NULL, 0, 0}};
/* Absolute pressures. 1 psi = 1 lbf/in^2 = 4.4482216152605 N /
   (0.0254 m)^2 = 6894.757293168 Pa (exact definitions of the pound, g_n
   and the inch; common practice). */
static const unit_def units_P[] = {
    {"Pa", 1.0, 0},  {"kPa", 1e3, 0},     {"MPa", 1e6, 0},
    {"bar", 1e5, 0}, {"atm", MCD_ATM, 0}, {"psi", 6894.757293168, 0},
    {NULL, 0, 0}};

static const unit_def *units_of(mcd_param p)
{
    switch (p) {
    case MCD_PARAM_MOLAR_MASS: return units_M;
    case MCD_PARAM_LJ_SIGMA: return units_sigma;
    case MCD_PARAM_LJ_EPS_K: return units_K;
    case MCD_PARAM_DIPOLE: return units_dipole;
    case MCD_PARAM_VB: return units_Vb;
    case MCD_PARAM_TB: return units_T;
    case MCD_PARAM_TC: return units_T;
    case MCD_PARAM_PC: return units_P;
    default: return NULL; /* V_diff, assoc: dimensionless */
    }
}

/* State of the block being read. */
typedef struct block {
    int open;
    size_t line; /* line of its "species" line */
    char name[MCDI_NAME_MAX + 1];
    char formula[MCDI_FORMULA_TEXT_MAX + 1];
    size_t formula_line; /* 0 = not given */
    int rings;
    size_t rings_line;
    double value[MCD_PARAM_COUNT];
    size_t value_line[MCD_PARAM_COUNT]; /* 0 = not given */
} block;

typedef struct loader {
    mcd_db tmp;       /* working copy */
    size_t *def_line; /* per tmp index: line defining it in this text */
    size_t def_cap;
} loader;

static int tok_eq(token t, const char *s)
{
    return strlen(s) == t.len && memcmp(t.s, s, t.len) == 0;
}

static int is_space(char c) { return c == ' ' || c == '\t'; }

/* Show a token in a message, truncated to 40 characters. */
#define TOKFMT "%.*s%s"
#define TOKARG(t)                                                              \
    (int)((t).len > 40 ? 40 : (t).len), (t).s, ((t).len > 40 ? "..." : "")

static mcd_status fail(loader *L, mcd_status st, size_t line, const char *fmt,
                       ...)
#if defined(__GNUC__)
    __attribute__((format(printf, 4, 5)))
#endif
    ;

static mcd_status fail(loader *L, mcd_status st, size_t line, const char *fmt,
                       ...)
{
    char msg[256];
    va_list ap;
    va_start(ap, fmt);
    vsnprintf(msg, sizeof msg, fmt, ap);
    va_end(ap);
    mcdi_note("line %zu: %s", line, msg);
    return st;
}

/* A key given twice in one species block. */
static mcd_status duplicate(loader *L, size_t line, const char *key,
                            size_t first)
{
    return fail(L, MCD_EPARSE, line, "duplicate key '%s' (first on line %zu)",
                key, first);
}

/* Strict decimal number: the whole token, finite. */
static int parse_number(token t, double *out)
{
    char buf[64];
    char *end;
    double v;
    size_t i;
    if (t.len == 0 || t.len >= sizeof buf)
        return 0;
    for (i = 0; i < t.len; ++i) {
        char c = t.s[i];
        if (!((c >= '0' && c <= '9') || c == '+' || c == '-' || c == '.' ||
              c == 'e' || c == 'E'))
            return 0;
    }
    memcpy(buf, t.s, t.len);
    buf[t.len] = '\0';
    v = strtod(buf, &end);
    if (end != buf + t.len || !mcdi_finite(v))
        return 0;
    *out = v;
    return 1;
}

static void list_units(const unit_def *u, char *buf, size_t len)
{
    size_t used = 0;
    buf[0] = '\0';
    for (; u->text != NULL && used + 1 < len; ++u) {
        int n =
            snprintf(buf + used, len - used, "%s%s", used ? ", " : "", u->text);
        if (n < 0)
            break;
        used += (size_t)n;
    }
}

static mcd_status grow_def(loader *L, size_t need)
{
    size_t cap;
    size_t *p;
    if (need <= L->def_cap)
        return MCD_OK;
    cap = L->def_cap ? L->def_cap * 2 : 64;
    while (cap < need)
        cap *= 2;
    p = realloc(L->def_line, cap * sizeof *p);
    if (p == NULL)
        return MCD_ENOMEM;
    memset(p + L->def_cap, 0, (cap - L->def_cap) * sizeof *p);
    L->def_line = p;
    L->def_cap = cap;
    return MCD_OK;
}

/* Build the species of a finished block and put it into the copy. */
static mcd_status close_block(loader *L, block *b)
{
    mcdi_species s;
    mcd_status st;
    char msg[200];
    size_t i;
    int k;
    if (!b->open)
        return MCD_OK;
    b->open = 0;
    if (b->formula_line == 0)
        return fail(L, MCD_EPARSE, b->line, "species '%s' has no formula",
                    b->name);
    st = mcdi_species_from_formula(b->name, b->formula, b->rings, &s);
    if (st != MCD_OK) /* the detail it wrote goes into this file's message */
        snprintf(msg, sizeof msg, "%s", mcdi_err_text());
    if (st == MCD_EINVAL) /* n_rings not allowed for this formula */
        return fail(L, MCD_EPARSE,
                    b->rings_line ? b->rings_line : b->formula_line,
                    "species '%s': %s", b->name, msg);
    if (st != MCD_OK)
        return fail(L, st, b->formula_line, "species '%s': formula: %s",
                    b->name, msg);
    for (k = 0; k < MCD_PARAM_COUNT; ++k) {
        if (b->value_line[k] != 0) {
            s.p[k] = b->value[k];
            s.src[k] = mcdi_src_user;
        }
    }
    if (mcdi_db_index_of(&L->tmp, s.name) == (size_t)-1 &&
        (st = mcdi_db_reserve(&L->tmp, L->tmp.n + 1)) != MCD_OK)
        return fail(L, st, b->line, "out of memory");
    if ((st = grow_def(L, L->tmp.n + 1)) != MCD_OK)
        return fail(L, st, b->line, "out of memory");
    i = mcdi_db_put(&L->tmp, &s);
    L->def_line[i] = b->line;
    return MCD_OK;
}

static mcd_status start_block(loader *L, block *b, size_t line, const token *t,
                              size_t nt)
{
    char msg[160];
    mcd_status st;
    size_t i;
    int k;
    if ((st = close_block(L, b)) != MCD_OK)
        return st;
    if (nt != 2)
        return fail(L, MCD_EPARSE, line,
                    "'species' takes exactly one name, found %zu fields",
                    nt - 1);
    if (t[1].len > MCDI_NAME_MAX)
        return fail(L, MCD_EPARSE, line,
                    "species name longer than %d characters", MCDI_NAME_MAX);
    memset(b, 0, sizeof *b);
    memcpy(b->name, t[1].s, t[1].len);
    b->name[t[1].len] = '\0';
    if (mcdi_db_check_name(b->name) != MCD_OK) {
        snprintf(msg, sizeof msg, "%s", mcdi_err_text());
        return fail(L, MCD_EPARSE, line, "%s", msg);
    }
    i = mcdi_db_index_of(&L->tmp, b->name);
    if (i != (size_t)-1 && i < L->def_cap && L->def_line[i] != 0)
        return fail(L, MCD_EPARSE, line,
                    "species '%s' already defined on line %zu", b->name,
                    L->def_line[i]);
    b->open = 1;
    b->line = line;
    for (k = 0; k < MCD_PARAM_COUNT; ++k)
        b->value[k] = 0.0;
    return MCD_OK;
}

static mcd_status key_line(loader *L, block *b, size_t line, const token *t,
                           size_t nt)
{
    int k, p = -1;
    double v;
    const unit_def *units, *u;
    char unit[64];
    size_t i, ulen;

    if (!b->open)
        return fail(L, MCD_EPARSE, line,
                    "'" TOKFMT "' before the first 'species' line",
                    TOKARG(t[0]));
    if (tok_eq(t[0], "formula")) {
        if (b->formula_line)
            return duplicate(L, line, "formula", b->formula_line);
        if (nt != 2)
            return fail(L, MCD_EPARSE, line,
                        "'formula' takes exactly one value, found %zu", nt - 1);
        if (t[1].len > MCDI_FORMULA_TEXT_MAX)
            return fail(L, MCD_EPARSE, line,
                        "formula longer than %d characters",
                        MCDI_FORMULA_TEXT_MAX);
        memcpy(b->formula, t[1].s, t[1].len);
        b->formula[t[1].len] = '\0';
        b->formula_line = line;
        return MCD_OK;
    }
    if (tok_eq(t[0], "rings")) {
        long r = 0;
        if (b->rings_line)
            return duplicate(L, line, "rings", b->rings_line);
        if (nt != 2)
            return fail(L, MCD_EPARSE, line,
                        "'rings' takes one integer and no unit");
        for (i = 0; i < t[1].len && r <= 1000; ++i) {
            char c = t[1].s[i];
            r = (c < '0' || c > '9') ? 1001 : r * 10 + (c - '0');
        }
        if (r > 1000)
            return fail(L, MCD_EPARSE, line,
                        "'rings': '" TOKFMT "' is not a non-negative "
                        "integer up to 1000",
                        TOKARG(t[1]));
        b->rings = (int)r;
        b->rings_line = line;
        return MCD_OK;
    }
    for (k = 0; k < MCD_PARAM_COUNT; ++k)
        if (tok_eq(t[0], mcd_param_name((mcd_param)k)))
            p = k;
    if (p < 0)
        return fail(L, MCD_EPARSE, line,
                    "unknown key '" TOKFMT "' (expected formula, rings, M, "
                    "V_diff, sigma, eps_k, dipole, Vb, Tb, Tc, Pc or assoc)",
                    TOKARG(t[0]));
    if (b->value_line[p])
        return duplicate(L, line, mcd_param_name((mcd_param)p),
                         b->value_line[p]);
    if (nt < 2)
        return fail(L, MCD_EPARSE, line, "'%s' needs a value",
                    mcd_param_name((mcd_param)p));
    if (!parse_number(t[1], &v))
        return fail(L, MCD_EPARSE, line,
                    "'%s': '" TOKFMT "' is not a finite decimal number",
                    mcd_param_name((mcd_param)p), TOKARG(t[1]));
    /* Unit: the remaining fields joined by single spaces. */
    ulen = 0;
    unit[0] = '\0';
    for (i = 2; i < nt; ++i) {
        if (ulen + t[i].len + 2 > sizeof unit)
            return fail(L, MCD_EPARSE, line, "'%s': unit text too long",
                        mcd_param_name((mcd_param)p));
        if (ulen)
            unit[ulen++] = ' ';
        memcpy(unit + ulen, t[i].s, t[i].len);
        ulen += t[i].len;
        unit[ulen] = '\0';
    }
    units = units_of((mcd_param)p);
    if (units == NULL) {
        if (ulen)
            return fail(L, MCD_EPARSE, line,
                        "'%s' is dimensionless and takes no unit, found "
                        "'%s'",
                        mcd_param_name((mcd_param)p), unit);
    } else {
        char list[128];
        list_units(units, list, sizeof list);
        if (ulen == 0)
            return fail(L, MCD_EPARSE, line, "'%s' needs a unit (%s)",
                        mcd_param_name((mcd_param)p), list);
        for (u = units; u->text != NULL; ++u)
            if (strcmp(u->text, unit) == 0)
                break;
        if (u->text == NULL && units == units_P && ulen > 1 &&
            unit[ulen - 1] == 'g')
            return fail(L, MCD_EPARSE, line,
                        "'%s': '%s' is a gauge pressure; give the absolute "
                        "pressure (%s)",
                        mcd_param_name((mcd_param)p), unit, list);
        if (u->text == NULL)
            return fail(L, MCD_EPARSE, line,
                        "'%s': unknown unit '%s' (expected %s)",
                        mcd_param_name((mcd_param)p), unit, list);
        v = v * u->factor + u->offset;
    }
    if (mcdi_param_check((mcd_param)p, v) != MCD_OK)
        return fail(L, MCD_EDOM, line, "'%s' must be %s, found %g",
                    mcd_param_name((mcd_param)p),
                    (p == MCD_PARAM_DIPOLE || p == MCD_PARAM_ASSOC) ? ">= 0"
                                                                    : "> 0",
                    v);
    b->value[p] = v;
    b->value_line[p] = line;
    return MCD_OK;
}

/* Read text of length len (may contain NUL bytes: reported as errors). */
static mcd_status load_text(mcd_db *db, const char *text, size_t len)
{
    loader L;
    block b;
    mcd_status st = MCD_OK;
    size_t pos = 0, line = 0;
    int have_header = 0;

    memset(&L, 0, sizeof L);
    memset(&b, 0, sizeof b);
    /* Working copy of the database. */
    if (db->n > 0) {
        if (mcdi_db_reserve(&L.tmp, db->n) != MCD_OK) {
            mcdi_note("out of memory");
            return MCD_ENOMEM;
        }
        memcpy(L.tmp.sp, db->sp, db->n * sizeof *db->sp);
        L.tmp.n = db->n;
    }

    while (pos < len && st == MCD_OK) {
        size_t start = pos, end, i, nt = 0;
        token t[MAX_TOKENS + 1];
        while (pos < len && text[pos] != '\n')
            pos++;
        end = pos;
        if (pos < len)
            pos++; /* skip '\n' */
        line++;
        if (end > start && text[end - 1] == '\r')
            end--;
        /* Cut the comment; reject control bytes. */
        for (i = start; i < end; ++i) {
            unsigned char c = (unsigned char)text[i];
            if (c == '#') {
                end = i;
                break;
            }
            if (c == 0 || (c < 0x20 && c != '\t') || c == 0x7f) {
                st = fail(&L, MCD_EPARSE, line,
                          "control character (byte 0x%02x) at column %zu",
                          (unsigned)c, i - start + 1);
                break;
            }
        }
        if (st != MCD_OK)
            break;
        /* Split into fields. */
        i = start;
        while (i < end) {
            while (i < end && is_space(text[i]))
                i++;
            if (i >= end)
                break;
            if (nt == MAX_TOKENS) {
                st = fail(&L, MCD_EPARSE, line, "too many fields");
                break;
            }
            t[nt].s = text + i;
            while (i < end && !is_space(text[i]))
                i++;
            t[nt].len = (size_t)(text + i - t[nt].s);
            nt++;
        }
        if (st != MCD_OK || nt == 0)
            continue;
        if (!have_header) {
            if (nt == 2 && tok_eq(t[0], HEADER_NAME) &&
                tok_eq(t[1], HEADER_VERSION)) {
                have_header = 1;
                continue;
            }
            if (nt >= 1 && tok_eq(t[0], HEADER_NAME))
                st = fail(&L, MCD_EPARSE, line,
                          "unsupported format version (expected '" HEADER_NAME
                          " " HEADER_VERSION "')");
            else
                st = fail(&L, MCD_EPARSE, line,
                          "expected the header line '" HEADER_NAME
                          " " HEADER_VERSION "' first");
            continue;
        }
        if (tok_eq(t[0], "species"))
            st = start_block(&L, &b, line, t, nt);
        else
            st = key_line(&L, &b, line, t, nt);
    }
    if (st == MCD_OK && !have_header)
        st = fail(&L, MCD_EPARSE, line + (line == 0),
                  "missing the header line '" HEADER_NAME " " HEADER_VERSION
                  "'");
    if (st == MCD_OK)
        st = close_block(&L, &b);
    free(L.def_line);
    if (st != MCD_OK) {
        free(L.tmp.sp);
        return st;
    }
    free(db->sp);
    *db = L.tmp;
    return MCD_OK;
}

mcd_status mcdi_api_db_load_string(mcd_db *db, const char *text)
{
    if (db == NULL || text == NULL) {
        mcdi_note("NULL argument");
        return MCD_EINVAL;
    }
    return load_text(db, text, strlen(text));
}

mcd_status mcdi_api_db_load_file(mcd_db *db, const char *path)
{
    FILE *f;
    char *buf = NULL, *p;
    size_t len = 0, cap = 0, got;
    mcd_status st;
    if (db == NULL || path == NULL) {
        mcdi_note("NULL argument");
        return MCD_EINVAL;
    }
    f = fopen(path, "rb");
    if (f == NULL) {
        mcdi_note("cannot open '%s'", path);
        return MCD_EIO;
    }
    for (;;) {
        if (len == cap) {
            size_t ncap = cap ? cap * 2 : 4096;
            if (ncap < cap) {
                st = MCD_ENOMEM;
                goto out;
            }
            p = realloc(buf, ncap);
            if (p == NULL) {
                mcdi_note("out of memory");
                st = MCD_ENOMEM;
                goto out;
            }
            buf = p;
            cap = ncap;
        }
        got = fread(buf + len, 1, cap - len, f);
        len += got;
        if (got == 0) {
            if (ferror(f)) {
                mcdi_note("cannot read '%s'", path);
                st = MCD_EIO;
                goto out;
            }
            break;
        }
    }
    st = load_text(db, buf, len);
out:
    free(buf);
    fclose(f);
    return st;
}
