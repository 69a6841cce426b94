/* mcd_internal.h - private helpers shared by lib/ files. Never installed.
 * Internal non-static functions use the mcdi_ prefix and are hidden. */
#ifndef MCD_INTERNAL_H
#define MCD_INTERNAL_H

#include <stddef.h>
#include <stdarg.h>
#include <math.h>
#include "mcdiff.h"

/* Write a formatted message into errbuf (if errbuf != NULL && errlen > 0),
 * always NUL-terminated. Never prints. Defined in status.c. */
void mcdi_errbuf_set(char *errbuf, size_t errlen, const char *fmt, ...)
#if defined(__GNUC__)
    __attribute__((format(printf, 3, 4)))
#endif
    ;

/* 1 if v is finite (not NaN, not infinite). */
static inline int mcdi_finite(double v) { return isfinite(v); }

#endif
