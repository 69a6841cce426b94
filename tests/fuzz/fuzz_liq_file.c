/* (invariants only: no outside check values)
 * fuzz_liq_file.c - libFuzzer harness for the parameter file of
 * `mcdiff liquid --params` (bindings/cli/liq_file.c, with liq_def.c and
 * units.c compiled into the harness unchanged), read from memory.
 *
 * Invariants: the reader ends; on success the definition holds 1 to
 * LIQ_MAX species with non-empty NUL-terminated names, a model in range
 * or none, positive finite species parameters where given, finite pair
 * coefficients and ordered temperature ranges, positive diffusivities for
 * every pair given, Antoine constants with an ordered range and a
 * NUL-terminated non-empty source; and the definition
 * builds into an mcd_liquid or fails with a usage error, never anything
 * else.
 */
#define _POSIX_C_SOURCE 200809L /* fmemopen */
#include <stdarg.h>

#include "fuzz_common.h"
#include "liq.h"

int LLVMFuzzerTestOneInput(const uint8_t *data, size_t size);

/* main.c is not linked: silent stand-ins for its message printers. */
int cli_usage_error(const char *cmd, const char *arg, const char *fmt, ...)
{
    (void)cmd;
    (void)arg;
    (void)fmt;
    return CLI_USAGE;
}

int cli_fail(const char *cmd, const char *what, mcd_status st,
             const char *detail)
{
    (void)cmd;
    (void)what;
    (void)st;
    (void)detail;
    return CLI_FAIL;
}

static void check_def(const liq_def *d)
{
    size_t i, j;
    FUZZ_REQUIRE(d->n >= 1 && d->n <= LIQ_MAX, "n = %zu", d->n);
    FUZZ_REQUIRE(d->model >= -1 && d->model <= 3, "model %d", d->model);
    for (i = 0; i < d->n; i++) {
        FUZZ_REQUIRE(memchr(d->names[i], '\0', LIQ_NAME) != NULL &&
                         d->names[i][0] != '\0',
                     "name %zu", i);
        for (j = 0; j < 3; j++)
            if (d->sp_at[j][i] != 0)
                FUZZ_REQUIRE(isfinite(d->sp[j][i]) && d->sp[j][i] > 0,
                             "species parameter %zu of %zu", j, i);
        if (d->M_at[i] != 0)
            FUZZ_REQUIRE(isfinite(d->M[i]) && d->M[i] > 0, "M of %zu", i);
        if (d->ant[i].at != 0)
            FUZZ_REQUIRE(memchr(d->ant[i].source, '\0', LIQ_SOURCE) &&
                             d->ant[i].source[0] != '\0' &&
                             d->ant[i].T_min < d->ant[i].T_max,
                         "antoine of %zu", i);
        for (j = i + 1; j < d->n; j++) {
            const liq_pair *p = &d->pair[i][j];
            if (p->at != 0)
                for (int k = 0; k < 3; k++)
                    FUZZ_REQUIRE(isfinite(p->coef_ij[k]) &&
                                     isfinite(p->coef_ji[k]) &&
                                     p->T_min <= p->T_max,
                                 "pair %zu/%zu", i, j);
            if (d->dinf_at[i][j] != 0)
                FUZZ_REQUIRE(d->dinf[i][j] > 0 && d->dinf[j][i] > 0,
                             "dinf %zu/%zu", i, j);
        }
    }
}

int LLVMFuzzerTestOneInput(const uint8_t *data, size_t size)
{
    liq_def *d;
    FILE *f;
    int rc;
    if (size == 0)
        return 0;
    d = malloc(sizeof *d);
    f = fmemopen((void *)(uintptr_t)data, size, "r");
    if (!d || !f) {
        free(d);
        if (f)
            fclose(f);
        return 0;
    }
    liq_def_init(d);
    rc = liq_file_read(d, "fuzz", "mem", f);
    fclose(f);
    FUZZ_REQUIRE(rc == CLI_OK || rc == CLI_USAGE, "reader returned %d", rc);
    if (rc == CLI_OK) {
        mcd_liquid *liq = NULL;
        check_def(d);
        if (d->model < 0)
            d->model = MCD_ACTIVITY_NRTL;
        rc = liq_def_build(d, "fuzz", &liq);
        FUZZ_REQUIRE(rc == CLI_OK || rc == CLI_USAGE || rc == CLI_FAIL,
                     "build returned %d", rc);
        FUZZ_REQUIRE((rc == CLI_OK) == (liq != NULL), "liquid %p", (void *)liq);
        mcd_liquid_free(liq);
    }
    free(d);
    return 0;
}
