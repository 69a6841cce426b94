/* error.c - the calling thread's error detail (error.h, mcd_last_error). */
#include <stdio.h>
#include <string.h>

#include "base/error.h"
#include "base/mcd_internal.h"

/* One buffer per thread: a failing call never races with another thread's
 * call, and no lock or allocation is needed. */
_Thread_local char mcdi_detail[MCDI_ERRLEN];

mcd_status mcdi_vfail(mcd_status status, const char *fmt, va_list ap)
{
    vsnprintf(mcdi_detail, sizeof mcdi_detail, fmt, ap);
    return status;
}

mcd_status mcdi_fail(mcd_status status, const char *fmt, ...)
{
    va_list ap;
    va_start(ap, fmt);
    mcdi_vfail(status, fmt, ap);
    va_end(ap);
    return status;
}

void mcdi_note(const char *fmt, ...)
{
    va_list ap;
    va_start(ap, fmt);
    vsnprintf(mcdi_detail, sizeof mcdi_detail, fmt, ap);
    va_end(ap);
}

mcd_status mcdi_err_settle(mcd_status status, const char *function)
{
    if (status != MCD_OK && mcdi_detail[0] == '\0')
        snprintf(mcdi_detail, sizeof mcdi_detail, "%s: %s", function,
                 mcd_status_string((int)status));
    return status;
}

const char *mcdi_err_text(void) { return mcdi_detail; }

MCD_API const char *mcd_last_error(void) { return mcdi_detail; }
