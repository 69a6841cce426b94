/* units.c - strict numbers and quantities with units for the mcdiff tool.
 *
 * A number is: optional sign, digits with an optional decimal point (at
 * least one digit), optional exponent (e/E, optional sign, digits). Nothing
 * else: no spaces, no hex, no "inf"/"nan". A quantity is a number followed
 * directly by a unit word from a short fixed list; a bare number is in the
 * quantity's base unit. Every value must be finite after conversion.
 */
#include <ctype.h>
#include <errno.h>
#include <math.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>
#include "cli.h"

/* Length of the number at the start of text (0 if none). */
static size_t scan_number(const char *t)
{
    size_t i = 0, digits = 0;
    if (t[i] == '+' || t[i] == '-')
        i++;
    while (isdigit((unsigned char)t[i])) {
        i++;
        digits++;
    }
    if (t[i] == '.') {
        i++;
        while (isdigit((unsigned char)t[i])) {
            i++;
            digits++;
        }
    }
    if (digits == 0)
        return 0;
    if (t[i] == 'e' || t[i] == 'E') {
        size_t j = i + 1, ed = 0;
        if (t[j] == '+' || t[j] == '-')
            j++;
        while (isdigit((unsigned char)t[j])) {
            j++;
            ed++;
        }
        if (ed > 0)
            i = j;
    }
    return i;
}

/* Convert the first len characters of t; 0 on success. */
static int convert(const char *t, size_t len, double *out, char *why,
                   size_t whylen)
{
    char buf[128];
    char *end;
    double v;
    if (len == 0) {
        snprintf(why, whylen, "'%s' is not a number", t);
        return -1;
    }
    if (len >= sizeof buf) {
        snprintf(why, whylen, "number too long");
        return -1;
    }
    memcpy(buf, t, len);
    buf[len] = '\0';
    errno = 0;
    v = strtod(buf, &end);
    if (*end != '\0') {
        snprintf(why, whylen, "'%s' is not a number", t);
        return -1;
    }
    if (!isfinite(v) || errno == ERANGE) {
        if (errno == ERANGE && v == 0.0) {
            *out = 0.0; /* underflow to zero is harmless */
            return 0;
        }
        snprintf(why, whylen, "'%s' is out of the finite range", t);
        return -1;
    }
    *out = v;
    return 0;
}

int cli_parse_number(const char *text, double *out, char *why, size_t whylen)
{
    size_t len;
    if (!text || !*text) {
        snprintf(why, whylen, "empty value");
        return -1;
    }
    len = scan_number(text);
    if (len == 0 || text[len] != '\0') {
        snprintf(why, whylen, "'%s' is not a plain number", text);
        return -1;
    }
    return convert(text, len, out, why, whylen);
}

#define PSI 6894.757293168 /* Pa */

int cli_is_plain_number(const char *text)
{
    size_t len = text ? scan_number(text) : 0;
    return len > 0 && text[len] == '\0';
}

int cli_is_unit_word(const char *text)
{
    static const char *const words[] = {"K",
                                        "C",
                                        "degC",
                                        "\xc2\xb0"
                                        "C",
                                        "F",
                                        "degF",
                                        "\xc2\xb0"
                                        "F",
                                        "Pa",
                                        "kPa",
                                        "MPa",
                                        "bar",
                                        "bara",
                                        "atm",
                                        "psi",
                                        "psia",
                                        "barg",
                                        "psig",
                                        "m",
                                        "cm",
                                        "mm",
                                        "in",
                                        "inch",
                                        "m2",
                                        "cm2",
                                        "mm2",
                                        "m3",
                                        "L",
                                        "mL",
                                        "cm3",
                                        "s",
                                        "min",
                                        "h",
                                        "m2/s",
                                        "cm2/s",
                                        "Pa.s",
                                        "mPa.s",
                                        "cP",
                                        "mol/m3",
                                        "kmol/m3",
                                        "mol/L",
                                        "kg/m3",
                                        "g/cm3",
                                        "kg/L",
                                        "g/L",
                                        NULL};
    size_t k;
    for (k = 0; words[k]; k++)
        if (strcmp(text, words[k]) == 0)
            return 1;
    return 0;
}

typedef struct unit_def {
    const char *word;
    double scale; /* SI = value * scale + offset */
    double offset;
} unit_def;

static int parse_quantity(const char *text, const unit_def *units,
                          const char *quantity, const char *allowed,
                          double *out, char *why, size_t whylen)
{
    size_t len;
    double v;
    const char *unit;
    const unit_def *u;
    if (!text || !*text) {
        snprintf(why, whylen, "empty value");
        return -1;
    }
    len = scan_number(text);
    if (len == 0) {
        snprintf(why, whylen, "'%s' does not start with a number", text);
        return -1;
    }
    if (convert(text, len, &v, why, whylen) != 0)
        return -1;
    unit = text + len;
    while (*unit == ' ') /* "60 C", quoted as one word */
        unit++;
    if (*unit == '\0') {
        *out = v * units[0].scale + units[0].offset;
    } else {
        for (u = units; u->word; u++)
            if (strcmp(u->word, unit) == 0)
                break;
        if (!u->word && strcmp(quantity, "pressure") == 0 && strlen(unit) > 1 &&
            unit[strlen(unit) - 1] == 'g') {
            snprintf(why, whylen,
                     "'%s' is a gauge pressure: give the absolute pressure "
                     "(gauge plus the ambient pressure; %s)",
                     text, allowed);
            return -1;
        }
        if (!u->word) {
            snprintf(why, whylen, "unknown %s unit '%s' (use %s)", quantity,
                     unit, allowed);
            return -1;
        }
        /* Decimal sub-units divide by an exact power of ten (23.8 cm ->
         * 23.8/100, the double nearest 0.238) rather than multiply by an
         * inexact 0.01. */
        if (u->scale < 1.0 &&
            fabs(1.0 / u->scale - floor(1.0 / u->scale + 0.5)) < 1e-9)
            *out = v / floor(1.0 / u->scale + 0.5) + u->offset;
        else
            *out = v * u->scale + u->offset;
    }
    if (!isfinite(*out)) {
        snprintf(why, whylen, "'%s' is out of the finite range", text);
        return -1;
    }
    return 0;
}

int cli_parse_temperature(const char *text, double *out_K, char *why,
                          size_t whylen)
{
    /* T/K = t/degC + 273.15 = (t/degF + 459.67) * 5/9 (definitions of
       the scales; common practice) */
    static const unit_def units[] = {{"K", 1.0, 0.0},
                                     {"C", 1.0, 273.15},
                                     {"degC", 1.0, 273.15},
                                     {"\xc2\xb0"
                                      "C",
                                      1.0, 273.15},
                                     {"F", 5.0 / 9.0, 459.67 * 5.0 / 9.0},
                                     {"degF", 5.0 / 9.0, 459.67 * 5.0 / 9.0},
                                     {"\xc2\xb0"
                                      "F",
                                      5.0 / 9.0, 459.67 * 5.0 / 9.0},
                                     {NULL, 0, 0}};
    double T;
    if (parse_quantity(text, units, "temperature",
                       "K, C (degC) or F (degF); bare = K", &T, why,
                       whylen) != 0)
        return -1;
    if (!(T > 0.0)) {
        snprintf(why, whylen, "'%s' is not above absolute zero", text);
        return -1;
    }
    *out_K = T;
    return 0;
}

int cli_parse_pressure(const char *text, double *out_Pa, char *why,
                       size_t whylen)
{
    /* 1 psi = 4.4482216152605 N / (0.0254 m)^2 = 6894.757293168 Pa
       (exact definitions of the pound-force and the inch; common
       practice). Absolute pressures only: "barg", "psig" are refused. */
    static const unit_def units[] = {
        {"Pa", 1.0, 0.0},  {"kPa", 1e3, 0.0},  {"MPa", 1e6, 0.0},
        {"bar", 1e5, 0.0}, {"bara", 1e5, 0.0}, {"atm", MCD_ATM, 0.0},
        {"psi", PSI, 0.0}, {"psia", PSI, 0.0}, {NULL, 0, 0}};
    double P;
    if (parse_quantity(text, units, "pressure",
                       "Pa, kPa, MPa, bar, atm or psi, absolute; bare = Pa", &P,
                       why, whylen) != 0)
        return -1;
    if (!(P > 0.0)) {
        snprintf(why, whylen, "'%s' is not a positive pressure", text);
        return -1;
    }
    *out_Pa = P;
    return 0;
}

int cli_parse_diffusivity(const char *text, double *out, char *why,
                          size_t whylen)
{
    static const unit_def units[] = {
        {"m2/s", 1.0, 0.0}, {"cm2/s", 1e-4, 0.0}, {NULL, 0, 0}};
    double D;
    if (parse_quantity(text, units, "diffusivity", "m2/s or cm2/s; bare = m2/s",
                       &D, why, whylen) != 0)
        return -1;
    if (!(D > 0.0)) {
        snprintf(why, whylen, "'%s' is not a positive diffusivity", text);
        return -1;
    }
    *out = D;
    return 0;
}

int cli_parse_viscosity(const char *text, double *out, char *why, size_t whylen)
{
    static const unit_def units[] = {{"Pa.s", 1.0, 0.0},
                                     {"mPa.s", 1e-3, 0.0},
                                     {"cP", 1e-3, 0.0},
                                     {NULL, 0, 0}};
    double mu;
    if (parse_quantity(text, units, "viscosity",
                       "Pa.s, mPa.s or cP; bare = Pa.s", &mu, why, whylen) != 0)
        return -1;
    if (!(mu > 0.0)) {
        snprintf(why, whylen, "'%s' is not a positive viscosity", text);
        return -1;
    }
    *out = mu;
    return 0;
}

/* A positive quantity (length, area, volume) in one of the units. */
static int parse_positive(const char *text, const unit_def *units,
                          const char *quantity, const char *allowed,
                          double *out, char *why, size_t whylen)
{
    double v;
    if (parse_quantity(text, units, quantity, allowed, &v, why, whylen) != 0)
        return -1;
    if (!(v > 0.0)) {
        snprintf(why, whylen, "'%s' is not a positive %s", text, quantity);
        return -1;
    }
    *out = v;
    return 0;
}

int cli_parse_length(const char *text, double *out, char *why, size_t whylen)
{
    /* 1 in = 0.0254 m exactly (international inch) */
    static const unit_def units[] = {{"m", 1.0, 0.0},       {"cm", 1e-2, 0.0},
                                     {"mm", 1e-3, 0.0},     {"in", 0.0254, 0.0},
                                     {"inch", 0.0254, 0.0}, {NULL, 0, 0}};
    return parse_positive(text, units, "length", "m, cm, mm or in; bare = m",
                          out, why, whylen);
}

int cli_parse_area(const char *text, double *out, char *why, size_t whylen)
{
    static const unit_def units[] = {
        {"m2", 1.0, 0.0}, {"cm2", 1e-4, 0.0}, {"mm2", 1e-6, 0.0}, {NULL, 0, 0}};
    return parse_positive(text, units, "area", "m2, cm2 or mm2; bare = m2", out,
                          why, whylen);
}

int cli_parse_volume(const char *text, double *out, char *why, size_t whylen)
{
    static const unit_def units[] = {{"m3", 1.0, 0.0},
                                     {"L", 1e-3, 0.0},
                                     {"mL", 1e-6, 0.0},
                                     {"cm3", 1e-6, 0.0},
                                     {NULL, 0, 0}};
    return parse_positive(text, units, "volume", "m3, L, mL or cm3; bare = m3",
                          out, why, whylen);
}

int cli_parse_concentration(const char *text, double *out, char *why,
                            size_t whylen)
{
    static const unit_def units[] = {{"mol/m3", 1.0, 0.0},
                                     {"kmol/m3", 1e3, 0.0},
                                     {"mol/L", 1e3, 0.0},
                                     {NULL, 0, 0}};
    return parse_positive(text, units, "concentration",
                          "mol/m3, kmol/m3 or mol/L; bare = mol/m3", out, why,
                          whylen);
}

int cli_parse_density(const char *text, double *out, char *why, size_t whylen)
{
    static const unit_def units[] = {{"kg/m3", 1.0, 0.0},
                                     {"g/cm3", 1e3, 0.0},
                                     {"kg/L", 1e3, 0.0},
                                     {"g/L", 1.0, 0.0},
                                     {NULL, 0, 0}};
    return parse_positive(text, units, "density",
                          "kg/m3, g/cm3, kg/L or g/L; bare = kg/m3", out, why,
                          whylen);
}

int cli_parse_time(const char *text, double *out, char *why, size_t whylen)
{
    static const unit_def units[] = {{"s", 1.0, 0.0},
                                     {"min", 60.0, 0.0},
                                     {"h", 3600.0, 0.0},
                                     {"d", 86400.0, 0.0},
                                     {NULL, 0, 0}};
    double v;
    if (parse_quantity(text, units, "time", "s, min, h or d; bare = s", &v, why,
                       whylen) != 0)
        return -1;
    if (!(v >= 0.0)) {
        snprintf(why, whylen, "'%s' is a negative time", text);
        return -1;
    }
    *out = v;
    return 0;
}

/* Largest number of output times accepted. */
#define CLI_MAX_TIMES 1000000

int cli_parse_times(const char *text, double **out, size_t *out_n, char *why,
                    size_t whylen)
{
    char item[128];
    const char *colon = text ? strchr(text, ':') : NULL;
    double *t = NULL;
    size_t n = 0, cap = 0;
    if (!text || !*text) {
        snprintf(why, whylen, "empty value");
        return -1;
    }
    if (colon) {
        /* START:STOP:COUNT */
        const char *colon2 = strchr(colon + 1, ':');
        double t0, t1, cnt;
        size_t len0 = (size_t)(colon - text), k;
        if (!colon2 || strchr(colon2 + 1, ':') || strchr(text, ',') ||
            len0 == 0 || len0 >= sizeof item ||
            (size_t)(colon2 - colon - 1) >= sizeof item) {
            snprintf(why, whylen,
                     "expected START:STOP:COUNT (e.g. 0:2h:25) or a "
                     "comma-separated list");
            return -1;
        }
        memcpy(item, text, len0);
        item[len0] = '\0';
        if (cli_parse_time(item, &t0, why, whylen) != 0)
            return -1;
        memcpy(item, colon + 1, (size_t)(colon2 - colon - 1));
        item[colon2 - colon - 1] = '\0';
        if (cli_parse_time(item, &t1, why, whylen) != 0)
            return -1;
        if (cli_parse_number(colon2 + 1, &cnt, why, whylen) != 0 ||
            cnt != floor(cnt) || cnt < 2 || cnt > CLI_MAX_TIMES) {
            snprintf(why, whylen, "COUNT '%s' is not a whole number in 2..%d",
                     colon2 + 1, CLI_MAX_TIMES);
            return -1;
        }
        if (!(t1 >= t0)) {
            snprintf(why, whylen, "STOP is before START");
            return -1;
        }
        n = (size_t)cnt;
        t = malloc(n * sizeof *t);
        if (!t) {
            snprintf(why, whylen, "out of memory");
            return -1;
        }
        for (k = 0; k < n; k++)
            t[k] = t0 + (t1 - t0) * ((double)k / (double)(n - 1));
        t[n - 1] = t1;
        *out = t;
        *out_n = n;
        return 0;
    }
    for (;;) {
        const char *comma = strchr(text, ',');
        size_t len = comma ? (size_t)(comma - text) : strlen(text);
        double v;
        if (len == 0 || len >= sizeof item) {
            snprintf(why, whylen, "item %zu is %s", n + 1,
                     len ? "too long" : "empty");
            free(t);
            return -1;
        }
        memcpy(item, text, len);
        item[len] = '\0';
        if (cli_parse_time(item, &v, why, whylen) != 0) {
            char inner[160];
            snprintf(inner, sizeof inner, "%s", why);
            snprintf(why, whylen, "item %zu: %s", n + 1, inner);
            free(t);
            return -1;
        }
        if (n > 0 && v < t[n - 1]) {
            snprintf(why, whylen,
                     "item %zu ('%s') is before the one before "
                     "it: times must not decrease",
                     n + 1, item);
            free(t);
            return -1;
        }
        if (n == cap) {
            double *g;
            if (cap >= CLI_MAX_TIMES) {
                snprintf(why, whylen, "more than %d times", CLI_MAX_TIMES);
                free(t);
                return -1;
            }
            cap = cap ? 2 * cap : 16;
            g = realloc(t, cap * sizeof *g);
            if (!g) {
                snprintf(why, whylen, "out of memory");
                free(t);
                return -1;
            }
            t = g;
        }
        t[n++] = v;
        if (!comma)
            break;
        text = comma + 1;
    }
    *out = t;
    *out_n = n;
    return 0;
}

int cli_parse_list(const char *text, double *out, size_t cap, size_t *out_n,
                   char *why, size_t whylen)
{
    size_t n = 0;
    const char *p = text;
    if (!text || !*text) {
        snprintf(why, whylen, "empty list");
        return -1;
    }
    for (;;) {
        const char *comma = strchr(p, ',');
        size_t len = comma ? (size_t)(comma - p) : strlen(p);
        char item[128];
        double v;
        if (len == 0) {
            snprintf(why, whylen, "empty item %zu in list", n + 1);
            return -1;
        }
        if (len >= sizeof item) {
            snprintf(why, whylen, "item %zu too long", n + 1);
            return -1;
        }
        if (n >= cap) {
            snprintf(why, whylen, "more than %zu items", cap);
            return -1;
        }
        memcpy(item, p, len);
        item[len] = '\0';
        if (cli_parse_number(item, &v, why, whylen) != 0) {
            char inner[160];
            snprintf(inner, sizeof inner, "%s", why);
            snprintf(why, whylen, "item %zu: %s", n + 1, inner);
            return -1;
        }
        out[n++] = v;
        if (!comma)
            break;
        p = comma + 1;
    }
    *out_n = n;
    return 0;
}

int cli_split_words(char *buf, char **out, size_t cap)
{
    size_t n = 0;
    char *p = buf;
    for (;;) {
        char *comma = strchr(p, ',');
        if (comma)
            *comma = '\0';
        if (*p == '\0' || n >= cap)
            return -1;
        out[n++] = p;
        if (!comma)
            break;
        p = comma + 1;
    }
    return (int)n;
}

/* The number part of text, for suggestions ("8.38" of "8.38" or "8.38m2/s"). */
static void number_part(const char *text, char *buf, size_t len)
{
    size_t n = scan_number(text);
    if (n >= len)
        n = len - 1;
    memcpy(buf, text, n);
    buf[n] = '\0';
}

int cli_implausible_gas_D(const char *text, double D, double P, char *why,
                          size_t whylen)
{
    const double lo = 0.01, hi = 1000.0; /* D P [Pa m^2/s] */
    char num[64];
    if (D * P >= lo && D * P <= hi)
        return 0;
    number_part(text, num, sizeof num);
    if (D * 1e-4 * P >= lo && D * 1e-4 * P <= hi)
        snprintf(why, whylen,
                 "%.6g m2/s is far outside the range of gas diffusivities "
                 "(%.3g to %.3g m2/s at %.6g Pa); %scm2/s would be inside "
                 "it: write the unit",
                 D, lo / P, hi / P, P, num);
    else
        snprintf(why, whylen,
                 "%.6g m2/s is far outside the range of gas diffusivities "
                 "(%.3g to %.3g m2/s at %.6g Pa)",
                 D, lo / P, hi / P, P);
    return 1;
}

int cli_implausible_viscosity(const char *text, double mu, char *why,
                              size_t whylen)
{
    const double lo = 1e-4, hi = 0.1; /* Pa s */
    char num[64];
    if (mu >= lo && mu <= hi)
        return 0;
    number_part(text, num, sizeof num);
    if (mu * 1e-3 >= lo && mu * 1e-3 <= hi)
        snprintf(why, whylen,
                 "%.6g Pa.s is outside the usual range of solvent "
                 "viscosities (0.1 to 100 cP); %scP would be inside it: "
                 "write the unit",
                 mu, num);
    else
        snprintf(why, whylen,
                 "%.6g Pa.s is outside the usual range of solvent "
                 "viscosities (0.1 to 100 cP) for these correlations",
                 mu);
    return 1;
}
