/* error.h - the calling thread's error detail, read by mcd_last_error.
 *
 * Every public call that returns an mcd_status runs through its wrapper in
 * api/entry.c (generated from the header by tools/gen_bindings.py), which
 * clears the detail on entry and, when the call fails without having
 * written one, writes "<function>: <status text>". Code below the wrappers
 * writes the detail with mcdi_fail (mcdi_note where the status is returned
 * later), on failure paths only; a path that recovers from a failure it
 * noted calls mcdi_err_clear. */
#ifndef MCD_ERROR_H
#define MCD_ERROR_H

#include <stdarg.h>
#include "mcdiff.h"

/* Capacity of the detail text, NUL included (longer text is cut). */
#define MCDI_ERRLEN 256

/* Write a printf-style detail and return `status` unchanged:
 *   return mcdi_fail(MCD_EDOM, "argument c: %g is not > 0", c); */
mcd_status mcdi_fail(mcd_status status, const char *fmt, ...)
#if defined(__GNUC__)
    __attribute__((format(printf, 2, 3)))
#endif
    ;

/* Write the detail without returning a status. */
void mcdi_note(const char *fmt, ...)
#if defined(__GNUC__)
    __attribute__((format(printf, 1, 2)))
#endif
    ;

/* As mcdi_fail with a va_list. */
mcd_status mcdi_vfail(mcd_status status, const char *fmt, va_list ap)
#if defined(__GNUC__)
    __attribute__((format(printf, 2, 0)))
#endif
    ;

/* The detail itself, one buffer per thread (error.c). Read it through
 * mcdi_err_text; only mcdi_err_clear touches it here. */
extern _Thread_local char mcdi_detail[MCDI_ERRLEN];

/* The wrappers' entry and exit (api/entry.c). Inline: every public call
 * clears the detail. */
static inline void mcdi_err_clear(void) { mcdi_detail[0] = '\0'; }
mcd_status mcdi_err_settle(mcd_status status, const char *function);

/* The current detail ("" if none). */
const char *mcdi_err_text(void);

#endif
