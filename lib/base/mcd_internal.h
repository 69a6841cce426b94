/* mcd_internal.h - private helpers shared by lib/ files. Never installed.
 * Internal non-static functions use the mcdi_ prefix and are hidden. */
#ifndef MCD_INTERNAL_H
#define MCD_INTERNAL_H

#include <stddef.h>
#include <stdarg.h>
#include <math.h>
#include "mcdiff.h"

#include "base/api_impl.h"
#include "base/error.h"

/* 1 if v is finite (not NaN, not infinite). */
static inline int mcdi_finite(double v) { return isfinite(v); }

#endif
