/* liq_file.c - the parameter file of `mcdiff liquid --params FILE`.
 *
 * Plain text, one record per line, '#' starts a comment (outside quotes).
 * A record is a keyword, its positional words, then FIELD=VALUE items in
 * any order; a value with spaces is quoted ("..."). Dimensional values
 * carry their unit (no bare numbers). Records:
 *   model NAME                       ideal, nrtl, wilson or uniquac
 *   species NAME [M=..] [V=..] [r=..] [q=..] [source=".."]
 *   pair NAME1 NAME2 [a12= b12= e12= a21= b21= e21=] [alpha=..]
 *        [range=TLO..THI] [source=".."]
 *   dinf NAME1 NAME2 D12=.. D21=.. [source=".."]
 *   antoine NAME A=.. B=.. C=.. log=10|e P=UNIT T=K|C range=TLO..THI
 *        source=".."
 * Every error names the file, the line and the field.
 */
#include <math.h>
#include <stdarg.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>
#include "liq.h"

#define TOK_MAX 24

typedef struct file_ctx {
    liq_def *d;
    const char *cmd;
    const char *path;
    int line;
    const char *rec; /* record keyword */
    char loc[300];   /* "FILE:LINE" */
} file_ctx;

/* Message "FILE:LINE: record 'REC': ..." (CLI_USAGE). */
static int ferr(file_ctx *c, const char *fmt, ...)
#if defined(__GNUC__)
    __attribute__((format(printf, 2, 3)))
#endif
    ;
static int ferr(file_ctx *c, const char *fmt, ...)
{
    char msg[600];
    va_list ap;
    va_start(ap, fmt);
    vsnprintf(msg, sizeof msg, fmt, ap);
    va_end(ap);
    snprintf(c->loc, sizeof c->loc, "%s:%d", c->path, c->line);
    if (c->rec)
        return cli_usage_error(c->cmd, c->loc, "record '%s': %s", c->rec, msg);
    return cli_usage_error(c->cmd, c->loc, "%s", msg);
}

/* Split a line (modified) into words; a word may hold a quoted part
 * (key="a b"), whose quotes are removed. '#' outside quotes ends the
 * line. Returns the count, or -1 for an unclosed quote, -2 for too many
 * words. */
static int split(char *s, char **tok)
{
    int n = 0;
    for (;;) {
        char *w;
        while (*s == ' ' || *s == '\t' || *s == '\r')
            s++;
        if (*s == '\0' || *s == '#' || *s == '\n')
            return n;
        if (n == TOK_MAX)
            return -2;
        w = tok[n++] = s;
        while (*s && *s != ' ' && *s != '\t' && *s != '\r' && *s != '\n' &&
               *s != '#') {
            if (*s == '"') {
                char *q = strchr(s + 1, '"');
                if (!q)
                    return -1;
                memmove(s, s + 1, (size_t)(q - s - 1)); /* drop the quotes */
                memmove(q - 1, q + 1, strlen(q + 1) + 1);
                s = w = q - 1; /* w == s: words are written in place */
                continue;
            }
            *w++ = *s++;
        }
        if (*s == '#' || *s == '\n') {
            *w = '\0';
            return n;
        }
        if (*s)
            s++;
        *w = '\0';
    }
}

/* A value with one of the units (longest words first): SI value. */
typedef struct unit_word {
    const char *word;
    double scale;
} unit_word;

static int with_unit(file_ctx *c, const char *field, const char *text,
                     const unit_word *u, const char *allowed, double *out)
{
    char why[200], num[64];
    size_t lt = strlen(text);
    for (; u->word; u++) {
        size_t lw = strlen(u->word);
        if (lt > lw && strcmp(text + lt - lw, u->word) == 0 &&
            lt - lw < sizeof num) {
            memcpy(num, text, lt - lw);
            num[lt - lw] = '\0';
            if (cli_parse_number(num, out, why, sizeof why) != 0)
                return ferr(c, "field %s: %s", field, why);
            *out *= u->scale;
            if (!(*out > 0.0) || !isfinite(*out))
                return ferr(c, "field %s: '%s' is not a positive value", field,
                            text);
            return CLI_OK;
        }
    }
    if (cli_is_plain_number(text))
        return ferr(c, "field %s: '%s' needs a unit (%s)", field, text,
                    allowed);
    return ferr(c, "field %s: '%s' is not a number with a unit (%s)", field,
                text, allowed);
}

static int plain(file_ctx *c, const char *field, const char *text, double *out)
{
    char why[200];
    if (cli_parse_number(text, out, why, sizeof why) != 0)
        return ferr(c, "field %s: %s", field, why);
    return CLI_OK;
}

/* "TLO..THI", each a temperature with K or C. */
static int trange(file_ctx *c, const char *text, double *lo, double *hi)
{
    char buf[128], why[200];
    char *dots;
    if (strlen(text) >= sizeof buf || !(dots = strstr(strcpy(buf, text), "..")))
        return ferr(c, "field range: '%s' is not TLO..THI (e.g. 288K..357K)",
                    text);
    *dots = '\0';
    if (cli_is_plain_number(buf) || cli_is_plain_number(dots + 2))
        return ferr(c, "field range: '%s' needs units (K or C on both ends)",
                    text);
    if (cli_parse_temperature(buf, lo, why, sizeof why) != 0 ||
        cli_parse_temperature(dots + 2, hi, why, sizeof why) != 0)
        return ferr(c, "field range: %s", why);
    if (!(*lo < *hi))
        return ferr(c,
                    "field range: '%s' is empty (low end not below the "
                    "high end)",
                    text);
    return CLI_OK;
}

/* Species index of a name in a record (declared by an earlier species
 * record). */
static int known(file_ctx *c, const char *name, size_t *out)
{
    long k = liq_def_species(c->d, name);
    if (k < 0 || !c->d->named)
        return ferr(c,
                    "species '%s' is not declared (a 'species' record "
                    "must come first)",
                    name);
    *out = (size_t)k;
    return CLI_OK;
}

/* Field name and value of "key=value"; NULL value when no '='. */
static char *field_value(char *tok)
{
    char *eq = strchr(tok, '=');
    if (!eq || eq == tok)
        return NULL;
    *eq = '\0';
    return eq + 1;
}

/* Two fields given twice on one record. */
static int seen_once(file_ctx *c, unsigned *seen, unsigned bit,
                     const char *field)
{
    if (*seen & bit)
        return ferr(c, "field %s given twice", field);
    *seen |= bit;
    return CLI_OK;
}

static int rec_model(file_ctx *c, char **tok, int nt)
{
    int m;
    if (nt != 2)
        return ferr(c, "expected 'model NAME' (ideal, nrtl, wilson, "
                       "uniquac)");
    if ((m = liq_model_from_name(tok[1])) < 0)
        return ferr(c, "unknown model '%s' (ideal, nrtl, wilson, uniquac)",
                    tok[1]);
    if (c->d->model_at > 0)
        return ferr(c, "the model is already given on line %d", c->d->model_at);
    c->d->model = m;
    c->d->model_at = c->line;
    return CLI_OK;
}

static int rec_species(file_ctx *c, char **tok, int nt)
{
    static const unit_word vu[] = {
        {"cm3/mol", 1e-6}, {"m3/mol", 1.0}, {"L/mol", 1e-3}, {NULL, 0}};
    static const unit_word mu[] = {{"kg/mol", 1.0}, {"g/mol", 1e-3}, {NULL, 0}};
    liq_def *d = c->d;
    size_t i = d->n, k;
    unsigned seen = 0;
    if (nt < 2 || strchr(tok[1], '='))
        return ferr(c, "expected 'species NAME [M=..] [V=..] [r=..] [q=..]'");
    if (d->n > 0 && !d->named)
        return ferr(c, "species are already numbered");
    if (d->n >= LIQ_MAX)
        return ferr(c, "more than %d species", LIQ_MAX);
    /* an empty name ("" in quotes) could never be named again (found by
     * fuzz_liq_file) */
    if (tok[1][0] == '\0' || strlen(tok[1]) >= LIQ_NAME ||
        cli_is_plain_number(tok[1]))
        return ferr(c,
                    "'%s' is not a usable species name (a word, not a "
                    "number, 1 to %d characters)",
                    tok[1], LIQ_NAME - 1);
    if (liq_def_species(d, tok[1]) >= 0)
        return ferr(c, "species '%s' is declared twice", tok[1]);
    strcpy(d->names[i], tok[1]);
    d->named = 1;
    d->n = i + 1;
    d->n_at = c->line;
    for (k = 2; k < (size_t)nt; k++) {
        char *v = field_value(tok[k]);
        int rc, p;
        if (!v)
            return ferr(c, "'%s' is not FIELD=VALUE", tok[k]);
        if (strcmp(tok[k], "source") == 0)
            continue;
        p = strcmp(tok[k], "V") == 0   ? MCD_LIQ_MOLAR_VOLUME
            : strcmp(tok[k], "r") == 0 ? MCD_LIQ_UNIQUAC_R
            : strcmp(tok[k], "q") == 0 ? MCD_LIQ_UNIQUAC_Q
            : strcmp(tok[k], "M") == 0 ? 3
                                       : -1;
        if (p < 0)
            return ferr(c, "unknown field '%s' (M, V, r, q, source)", tok[k]);
        if (seen_once(c, &seen, 1u << p, tok[k]) != CLI_OK)
            return CLI_USAGE;
        if (p == 3) {
            rc = with_unit(c, "M", v, mu, "g/mol or kg/mol", &d->M[i]);
            d->M_at[i] = c->line;
        } else if (p == MCD_LIQ_MOLAR_VOLUME) {
            rc = with_unit(c, "V", v, vu, "cm3/mol, m3/mol or L/mol",
                           &d->sp[p][i]);
            d->sp_at[p][i] = c->line;
        } else {
            rc = plain(c, tok[k], v, &d->sp[p][i]);
            if (rc == CLI_OK && !(d->sp[p][i] > 0))
                rc = ferr(c, "field %s: '%s' is not positive", tok[k], v);
            d->sp_at[p][i] = c->line;
        }
        if (rc != CLI_OK)
            return rc;
    }
    return CLI_OK;
}

/* The species indices i, j of NAME1 and NAME2 of a pair record (line
 * order: i may be the larger). */
static int two_species(file_ctx *c, char **tok, int nt, size_t *i, size_t *j)
{
    if (nt < 3 || strchr(tok[1], '=') || strchr(tok[2], '='))
        return ferr(c, "expected '%s NAME1 NAME2 FIELD=VALUE ...'", c->rec);
    if (known(c, tok[1], i) != CLI_OK || known(c, tok[2], j) != CLI_OK)
        return CLI_USAGE;
    if (*i == *j)
        return ferr(c, "a pair needs two different species");
    return CLI_OK;
}

static int rec_pair(file_ctx *c, char **tok, int nt)
{
    static const char *const fname[6] = {"a12", "b12", "e12",
                                         "a21", "b21", "e21"};
    liq_def *d = c->d;
    size_t i = 0, j = 0, k, f;
    double co[6] = {0, 0, 0, 0, 0, 0}, alpha = (double)NAN, lo = 0, hi = 0;
    unsigned seen = 0;
    liq_pair *p;
    if (two_species(c, tok, nt, &i, &j) != CLI_OK)
        return CLI_USAGE;
    for (k = 3; k < (size_t)nt; k++) {
        char *v = field_value(tok[k]);
        int rc = CLI_OK;
        if (!v)
            return ferr(c, "'%s' is not FIELD=VALUE", tok[k]);
        for (f = 0; f < 6 && strcmp(tok[k], fname[f]) != 0; f++)
            ;
        if (f < 6) {
            if ((rc = seen_once(c, &seen, 1u << f, tok[k])) == CLI_OK)
                rc = plain(c, tok[k], v, &co[f]);
        } else if (strcmp(tok[k], "alpha") == 0) {
            if ((rc = seen_once(c, &seen, 64, "alpha")) == CLI_OK)
                rc = plain(c, "alpha", v, &alpha);
        } else if (strcmp(tok[k], "range") == 0) {
            if ((rc = seen_once(c, &seen, 128, "range")) == CLI_OK)
                rc = trange(c, v, &lo, &hi);
        } else if (strcmp(tok[k], "source") != 0)
            rc = ferr(c,
                      "unknown field '%s' (a12, b12, e12, a21, b21, e21, "
                      "alpha, range, source)",
                      tok[k]);
        if (rc != CLI_OK)
            return rc;
    }
    if (!(seen & 7u) || !(seen & 56u))
        return ferr(c,
                    "pair %s/%s: no parameter of p_%s (give a%s, b%s or "
                    "e%s)",
                    tok[1], tok[2], (seen & 7u) ? "21" : "12",
                    (seen & 7u) ? "21" : "12", (seen & 7u) ? "21" : "12",
                    (seen & 7u) ? "21" : "12");
    p = &d->pair[i < j ? i : j][i < j ? j : i];
    if (p->at > 0)
        return ferr(c, "pair %s/%s is already given on line %d", tok[1], tok[2],
                    p->at);
    /* store as p_ij with i < j */
    for (f = 0; f < 3; f++) {
        p->coef_ij[f] = i < j ? co[f] : co[3 + f];
        p->coef_ji[f] = i < j ? co[3 + f] : co[f];
    }
    p->alpha = alpha;
    p->T_min = lo;
    p->T_max = hi;
    p->at = c->line;
    return CLI_OK;
}

static int rec_dinf(file_ctx *c, char **tok, int nt)
{
    liq_def *d = c->d;
    size_t i = 0, j = 0, k;
    double D[2] = {(double)NAN, (double)NAN};
    char why[200];
    if (two_species(c, tok, nt, &i, &j) != CLI_OK)
        return CLI_USAGE;
    for (k = 3; k < (size_t)nt; k++) {
        char *v = field_value(tok[k]);
        int f = -1;
        if (!v)
            return ferr(c, "'%s' is not FIELD=VALUE", tok[k]);
        if (strcmp(tok[k], "D12") == 0)
            f = 0;
        else if (strcmp(tok[k], "D21") == 0)
            f = 1;
        else if (strcmp(tok[k], "source") == 0)
            continue;
        else
            return ferr(c, "unknown field '%s' (D12, D21, source)", tok[k]);
        if (!isnan(D[f]))
            return ferr(c, "field %s given twice", tok[k]);
        if (cli_is_plain_number(v))
            return ferr(c, "field %s: '%s' needs a unit (m2/s or cm2/s)",
                        tok[k], v);
        if (cli_parse_diffusivity(v, &D[f], why, sizeof why) != 0)
            return ferr(c, "field %s: %s", tok[k], why);
    }
    if (isnan(D[0]) || isnan(D[1]))
        return ferr(c,
                    "pair %s/%s: field %s is required (D12: %s "
                    "infinitely dilute in %s; D21 the reverse)",
                    tok[1], tok[2], isnan(D[0]) ? "D12" : "D21", tok[1],
                    tok[2]);
    if (d->dinf_at[i < j ? i : j][i < j ? j : i] > 0)
        return ferr(c, "pair %s/%s is already given on line %d", tok[1], tok[2],
                    d->dinf_at[i < j ? i : j][i < j ? j : i]);
    d->dinf[i][j] = D[0];
    d->dinf[j][i] = D[1];
    d->dinf_at[i < j ? i : j][i < j ? j : i] = c->line;
    return CLI_OK;
}

/* Pressure unit of an Antoine form [Pa]; 0 when unknown. 1 mmHg =
 * 133.322368 Pa (common practice; 1 torr differs by 1.4e-7 relative). */
static double antoine_punit(const char *u)
{
    static const unit_word pu[] = {{"Pa", 1.0},          {"kPa", 1e3},
                                   {"MPa", 1e6},         {"bar", 1e5},
                                   {"atm", MCD_ATM},     {"mmHg", 133.322368},
                                   {"torr", 133.322368}, {NULL, 0}};
    for (const unit_word *p = pu; p->word; p++)
        if (strcmp(p->word, u) == 0)
            return p->scale;
    return 0.0;
}

/* Fields of an antoine record, in the order of fname[]. */
static int antoine_fields(file_ctx *c, char **tok, int nt, double *v6,
                          const char **punit, const char **tunit,
                          const char **source)
{
    static const char *const fname[] = {"A", "B", "C",     "log",
                                        "P", "T", "range", "source"};
    unsigned seen = 0;
    size_t k, f;
    for (k = 2; k < (size_t)nt; k++) {
        char *v = field_value(tok[k]);
        if (!v)
            return ferr(c, "'%s' is not FIELD=VALUE", tok[k]);
        for (f = 0; f < 8 && strcmp(tok[k], fname[f]) != 0; f++)
            ;
        if (f == 8)
            return ferr(c,
                        "unknown field '%s' (A, B, C, log, P, T, range, "
                        "source)",
                        tok[k]);
        if (seen_once(c, &seen, 1u << f, tok[k]) != CLI_OK)
            return CLI_USAGE;
        if (f < 3 && plain(c, tok[k], v, &v6[f]) != CLI_OK)
            return CLI_USAGE;
        if (f == 3) {
            if (strcmp(v, "10") && strcmp(v, "e"))
                return ferr(c, "field log: '%s' is not 10 or e", v);
            v6[3] = v[0] == 'e' ? 0.0 : 1.0;
        }
        if (f == 4)
            *punit = v;
        if (f == 5)
            *tunit = v;
        if (f == 6 && trange(c, v, &v6[4], &v6[5]) != CLI_OK)
            return CLI_USAGE;
        if (f == 7)
            *source = v;
    }
    for (f = 0; f < 8; f++)
        if (!(seen & (1u << f)))
            return ferr(c,
                        "field %s is required (A, B, C, log=10|e, "
                        "P=UNIT, T=K|C, range=TLO..THI, source=\"...\")",
                        fname[f]);
    return CLI_OK;
}

static int rec_antoine(file_ctx *c, char **tok, int nt)
{
    liq_def *d = c->d;
    size_t i = 0;
    double v[6], pu, A, B, C;
    const char *punit = NULL, *tunit = NULL, *source = NULL;
    liq_antoine *a;
    if (nt < 2 || strchr(tok[1], '='))
        return ferr(c, "expected 'antoine NAME A=.. B=.. C=.. log=10|e "
                       "P=UNIT T=K|C range=TLO..THI source=\"...\"'");
    if (known(c, tok[1], &i) != CLI_OK ||
        antoine_fields(c, tok, nt, v, &punit, &tunit, &source) != CLI_OK)
        return CLI_USAGE;
    if ((pu = antoine_punit(punit)) == 0.0)
        return ferr(c,
                    "field P: unknown pressure unit '%s' (Pa, kPa, MPa, "
                    "bar, atm, mmHg, torr)",
                    punit);
    if (strcmp(tunit, "K") && strcmp(tunit, "C"))
        return ferr(c, "field T: '%s' is not K or C", tunit);
    if (strlen(source) == 0 || strlen(source) >= LIQ_SOURCE)
        return ferr(c,
                    "field source: give where the constants come from "
                    "(1 to %d characters)",
                    LIQ_SOURCE - 1);
    /* log_b(P/u) = A - B/(t + C) -> log10(P/Pa) = A' - B'/(T/K + C'):
     * base e divides A and B by ln 10; the unit adds log10(u/Pa); t in C
     * is T/K - 273.15, so C' = C - 273.15 (common practice). */
    A = v[3] > 0.5 ? v[0] : v[0] / log(10.0);
    B = v[3] > 0.5 ? v[1] : v[1] / log(10.0);
    A += log10(pu);
    C = tunit[0] == 'C' ? v[2] - 273.15 : v[2];
    a = &d->ant[i];
    if (a->at > 0)
        return ferr(c, "species %s already has Antoine constants (line %d)",
                    tok[1], a->at);
    a->A = A;
    a->B = B;
    a->C = C;
    a->T_min = v[4];
    a->T_max = v[5];
    strcpy(a->source, source);
    a->at = c->line;
    return CLI_OK;
}

static int one_line(file_ctx *c, char *text)
{
    char *tok[TOK_MAX];
    int nt = split(text, tok);
    c->rec = NULL;
    if (nt == -1)
        return ferr(c, "unclosed quote");
    if (nt == -2)
        return ferr(c, "more than %d words", TOK_MAX);
    if (nt == 0)
        return CLI_OK;
    c->rec = tok[0];
    if (strcmp(tok[0], "model") == 0)
        return rec_model(c, tok, nt);
    if (strcmp(tok[0], "species") == 0)
        return rec_species(c, tok, nt);
    if (strcmp(tok[0], "pair") == 0)
        return rec_pair(c, tok, nt);
    if (strcmp(tok[0], "dinf") == 0)
        return rec_dinf(c, tok, nt);
    if (strcmp(tok[0], "antoine") == 0)
        return rec_antoine(c, tok, nt);
    c->rec = NULL;
    return ferr(c,
                "unknown record '%s' (model, species, pair, dinf, "
                "antoine)",
                tok[0]);
}

int liq_file_read(liq_def *d, const char *cmd, const char *path, FILE *f)
{
    file_ctx c = {.d = d, .cmd = cmd, .path = path};
    char buf[2048];
    int rc = CLI_OK;
    d->file = path;
    while (rc == CLI_OK && fgets(buf, sizeof buf, f)) {
        c.line++;
        if (strlen(buf) == sizeof buf - 1 && buf[sizeof buf - 2] != '\n') {
            c.rec = NULL;
            rc = ferr(&c, "line longer than %zu characters", sizeof buf - 2);
        } else
            rc = one_line(&c, buf);
    }
    if (rc == CLI_OK && d->n == 0)
        rc = cli_usage_error(cmd, path, "no 'species' record");
    return rc;
}

int liq_file_load(liq_def *d, const char *cmd, const char *path)
{
    FILE *f = fopen(path, "r");
    int rc;
    if (!f)
        return cli_usage_error(cmd, "--params", "cannot open '%s'", path);
    rc = liq_file_read(d, cmd, path, f);
    fclose(f);
    return rc;
}
