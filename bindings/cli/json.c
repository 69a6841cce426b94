/* json.c - a minimal streaming JSON writer for the mcdiff tool.
 *
 * Objects and arrays nest up to CLI_JSON_MAX_DEPTH levels, each level on its
 * own lines with two-space indentation (number arrays stay on one line).
 * Strings are escaped per RFC 8259; numbers print as the shortest of %.1g
 * .. %.17g that reads back to the same double (0.07, not
 * 0.070000000000000007); NaN and infinities become null.
 */
#include <math.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>
#include "cli.h"

void cli_json_init(cli_json *j, FILE *f)
{
    j->f = f;
    j->depth = 0;
    j->count[0] = 0;
    j->is_array[0] = 1; /* the top level holds one value */
}

static void put_string(FILE *f, const char *s)
{
    const unsigned char *p = (const unsigned char *)(s ? s : "");
    fputc('"', f);
    for (; *p; p++) {
        switch (*p) {
        case '"': fputs("\\\"", f); break;
        case '\\': fputs("\\\\", f); break;
        case '\b': fputs("\\b", f); break;
        case '\f': fputs("\\f", f); break;
        case '\n': fputs("\\n", f); break;
        case '\r': fputs("\\r", f); break;
        case '\t': fputs("\\t", f); break;
        default:
            if (*p < 0x20)
                fprintf(f, "\\u%04x", (unsigned)*p);
            else
                fputc(*p, f); /* UTF-8 bytes pass through */
        }
    }
    fputc('"', f);
}

static void indent(cli_json *j)
{
    int i;
    for (i = 0; i < j->depth; i++)
        fputs("  ", j->f);
}

/* Separator, newline, indentation and key before a value. */
static void lead(cli_json *j, const char *key)
{
    if (j->count[j->depth] > 0)
        fputc(',', j->f);
    if (j->depth > 0) {
        fputc('\n', j->f);
        indent(j);
    }
    if (!j->is_array[j->depth]) {
        put_string(j->f, key);
        fputs(": ", j->f);
    }
    j->count[j->depth]++;
}

static void open_level(cli_json *j, const char *key, int is_array)
{
    lead(j, key);
    fputc(is_array ? '[' : '{', j->f);
    if (j->depth + 1 < CLI_JSON_MAX_DEPTH) {
        j->depth++;
        j->count[j->depth] = 0;
        j->is_array[j->depth] = is_array;
    }
}

static void close_level(cli_json *j, int is_array)
{
    int had = j->count[j->depth] > 0;
    if (j->depth > 0)
        j->depth--;
    if (had) {
        fputc('\n', j->f);
        indent(j);
    }
    fputc(is_array ? ']' : '}', j->f);
}

void cli_json_object_begin(cli_json *j, const char *key)
{
    open_level(j, key, 0);
}
void cli_json_object_end(cli_json *j) { close_level(j, 0); }
void cli_json_array_begin(cli_json *j, const char *key)
{
    open_level(j, key, 1);
}
void cli_json_array_end(cli_json *j) { close_level(j, 1); }

void cli_json_string(cli_json *j, const char *key, const char *s)
{
    lead(j, key);
    if (s)
        put_string(j->f, s);
    else
        fputs("null", j->f);
}

static void put_number(FILE *f, double v)
{
    char buf[40];
    int prec;
    if (!isfinite(v)) {
        fputs("null", f);
        return;
    }
    /* %.17g always reads back (IEEE 754 double); the first shorter one
     * that does is the shortest decimal of the same value */
    for (prec = 1; prec <= 17; prec++) {
        snprintf(buf, sizeof buf, "%.*g", prec, v);
        if (strtod(buf, NULL) == v)
            break;
    }
    /* whole-number magnitudes without an exponent (300, not 3e+02); more
     * digits than the shortest still read back */
    if (strchr(buf, 'e') != NULL && fabs(v) >= 1.0 && fabs(v) < 1e17) {
        int digits = (int)floor(log10(fabs(v))) + 1;
        if (digits > prec)
            snprintf(buf, sizeof buf, "%.*g", digits, v);
    }
    fputs(buf, f);
}

void cli_json_number(cli_json *j, const char *key, double v)
{
    lead(j, key);
    put_number(j->f, v);
}

void cli_json_integer(cli_json *j, const char *key, long long v)
{
    lead(j, key);
    fprintf(j->f, "%lld", v);
}

void cli_json_bool(cli_json *j, const char *key, int v)
{
    lead(j, key);
    fputs(v ? "true" : "false", j->f);
}

void cli_json_null(cli_json *j, const char *key)
{
    lead(j, key);
    fputs("null", j->f);
}

void cli_json_numbers(cli_json *j, const char *key, const double *v, size_t n)
{
    size_t i;
    lead(j, key);
    fputc('[', j->f);
    for (i = 0; i < n; i++) {
        if (i)
            fputs(", ", j->f);
        put_number(j->f, v[i]);
    }
    fputc(']', j->f);
}

void cli_json_finish(cli_json *j) { fputc('\n', j->f); }
