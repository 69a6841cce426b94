/* csv.c - comma-separated output of the mcdiff tool (--csv, and the
 * profiles and histories of `film` and `bulbs`).
 *
 * One header row, then one row per record, fields separated by commas and
 * rows by a line feed. A field holding a comma, a double quote or a line
 * break is put in double quotes with inner quotes doubled (RFC 4180).
 * Numbers print with 15 significant digits (every such decimal reads back
 * to within one unit in the 15th digit); NaN and infinities (not known)
 * are empty fields. Header names carry their SI unit: "D_m2_per_s".
 */
#include <math.h>
#include <stdio.h>
#include <string.h>
#include "cli.h"

void cli_csv_init(cli_csv *c, FILE *f)
{
    c->f = f;
    c->col = 0;
}

static void sep(cli_csv *c)
{
    if (c->col++ > 0)
        fputc(',', c->f);
}

void cli_csv_text(cli_csv *c, const char *s)
{
    sep(c);
    if (!s)
        return;
    if (strpbrk(s, ",\"\r\n") == NULL) {
        fputs(s, c->f);
        return;
    }
    fputc('"', c->f);
    for (; *s; s++) {
        if (*s == '"')
            fputc('"', c->f);
        fputc(*s, c->f);
    }
    fputc('"', c->f);
}

void cli_csv_number(cli_csv *c, double v)
{
    sep(c);
    if (isfinite(v))
        fprintf(c->f, "%.15g", v);
}

void cli_csv_integer(cli_csv *c, long long v)
{
    sep(c);
    fprintf(c->f, "%lld", v);
}

void cli_csv_head(cli_csv *c, const char *prefix, const char *name,
                  const char *unit)
{
    char buf[200];
    size_t used = 0;
    const char *p;
    snprintf(buf, sizeof buf, "%s%s", prefix ? prefix : "", name ? name : "");
    used = strlen(buf);
    if (unit && *unit && strcmp(unit, "-") != 0) {
        /* "m^2/s" -> "_m2_per_s", "C m" -> "_C_m", "mol/(m^2 s)" ->
         * "_mol_per_m2_s", "1/m" -> "_per_m" */
        if (used + 1 < sizeof buf)
            buf[used++] = '_';
        p = unit;
        if (strncmp(p, "1/", 2) == 0 && used + 5 < sizeof buf) {
            memcpy(buf + used, "per_", 4); /* "1/m" -> "per_m" */
            used += 4;
            p += 2;
        }
        for (; *p && used + 6 < sizeof buf; p++) {
            if (*p == '^' || *p == '(' || *p == ')')
                continue;
            if (*p == '/') {
                memcpy(buf + used, "_per_", 5);
                used += 5;
            } else if (*p == ' ') {
                buf[used++] = '_';
            } else {
                buf[used++] = *p;
            }
        }
        buf[used] = '\0';
    }
    cli_csv_text(c, buf);
}

void cli_csv_end_row(cli_csv *c)
{
    fputc('\n', c->f);
    c->col = 0;
}
