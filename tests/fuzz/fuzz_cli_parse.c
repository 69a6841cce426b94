/* (invariants only: no outside check values)
 * fuzz_cli_parse.c - libFuzzer harness for the command-line tool's number,
 * unit and list parsing (bindings/cli/units.c) and its option scanner
 * (bindings/cli/args.c), compiled into the harness unchanged.
 *
 * First byte: which parser; the rest: the text (NUL-terminated copy). For
 * the option scanner the rest is split at NUL bytes into argv words.
 * Invariants: a parser that succeeds returns a finite value (and a positive
 * one where the quantity must be positive); `why` is always
 * NUL-terminated; a list never reports more items than its capacity; the
 * scanner ends within argc + 1 steps and never reads past argv.
 */
#include <stdarg.h>

#include "cli.h"
#include "fuzz_common.h"

int LLVMFuzzerTestOneInput(const uint8_t *data, size_t size);

/* main.c is not linked: a silent stand-in for its message printer. */
int cli_usage_error(const char *cmd, const char *arg, const char *fmt, ...)
{
    (void)cmd;
    (void)arg;
    (void)fmt;
    return CLI_USAGE;
}

static const cli_opt opts[] = {
    {"temperature", 'T', 1, 1}, {"pressure", 'P', 1, 2}, {"json", 0, 0, 3},
    {"species", 's', 1, 4},     {"x", 'x', 1, 5},        {NULL, 0, 0, 0},
};

int LLVMFuzzerTestOneInput(const uint8_t *data, size_t size)
{
    char why[64];
    double v = 0, list[6];
    size_t n = 0;
    int sel, r;
    char *t;
    if (size < 1)
        return 0;
    sel = data[0] % 8;
    t = fuzz_cstr(data + 1, size - 1);
    memset(why, FUZZ_GUARD_BYTE, sizeof why);
    switch (sel) {
    case 0:
        r = cli_parse_number(t, &v, why, sizeof why);
        FUZZ_REQUIRE(r != 0 || isfinite(v), "number '%s' -> %g", t, v);
        break;
    case 1:
        r = cli_parse_temperature(t, &v, why, sizeof why);
        FUZZ_REQUIRE(r != 0 || (isfinite(v) && v > 0), "temperature '%s' -> %g",
                     t, v);
        break;
    case 2:
        r = cli_parse_pressure(t, &v, why, sizeof why);
        FUZZ_REQUIRE(r != 0 || (isfinite(v) && v > 0), "pressure '%s' -> %g", t,
                     v);
        break;
    case 3:
        r = cli_parse_diffusivity(t, &v, why, sizeof why);
        FUZZ_REQUIRE(r != 0 || (isfinite(v) && v > 0), "diffusivity '%s' -> %g",
                     t, v);
        break;
    case 4:
        r = cli_parse_viscosity(t, &v, why, sizeof why);
        FUZZ_REQUIRE(r != 0 || (isfinite(v) && v > 0), "viscosity '%s' -> %g",
                     t, v);
        break;
    case 5:
        memset(list, FUZZ_GUARD_BYTE, sizeof list);
        r = cli_parse_list(t, list, 5, &n, why, sizeof why);
        if (r == 0) {
            FUZZ_REQUIRE(n <= 5, "list of %zu items for cap 5", n);
            for (size_t k = 0; k < n; k++)
                FUZZ_REQUIRE(isfinite(list[k]), "item %zu", k);
        }
        FUZZ_REQUIRE(fuzz_untouched(list + 5, sizeof list[5]),
                     "list written past cap");
        break;
    case 6: {
        char *words[5];
        r = cli_split_words(t, words, 4);
        FUZZ_REQUIRE(r <= 4 && r >= -1, "split count %d", r);
        for (int k = 0; k < r; k++)
            FUZZ_REQUIRE(words[k] != NULL && words[k][0] != '\0',
                         "empty word %d", k);
        r = 0;
        break;
    }
    default: {
        /* argv from NUL-separated words */
        char *argv[32];
        int argc = 0, steps = 0;
        cli_args a;
        size_t len = size - 1;
        char *p = t;
        while ((size_t)(p - t) < len && argc < 31) {
            argv[argc++] = p;
            p += strlen(p) + 1;
        }
        argv[argc] = NULL;
        cli_args_init(&a, "fuzz", argc, argv, opts);
        while ((r = cli_args_next(&a)) != CLI_ARG_END && r != CLI_ARG_ERROR) {
            FUZZ_REQUIRE(++steps <= argc + 1, "scanner does not end");
            if (r > 0 && opts[r - 1].takes_value)
                FUZZ_REQUIRE(a.value != NULL, "option %d without value", r);
        }
        r = 0;
        break;
    }
    }
    if (r != 0)
        FUZZ_REQUIRE(fuzz_terminated(why, sizeof why) && why[0] != '\0',
                     "no reason given");
    free(t);
    return 0;
}
