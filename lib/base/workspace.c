/* workspace.c - the workspace's error message and its scratch accessors
 * (workspace.h). The constructor, which sizes every layer's scratch, is
 * api/workspace_new.c. */
#include <stdarg.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

#include "base/mcd_internal.h"
#include "base/workspace.h"

MCD_API size_t mcd_workspace_capacity(const mcd_workspace *ws)
{
    return ws == NULL ? 0 : ws->cap;
}

MCD_API const char *mcd_workspace_last_error(const mcd_workspace *ws)
{
    return ws == NULL ? "" : ws->err;
}

mcd_status mcdi_ws_fail(mcd_workspace *ws, mcd_status status, const char *fmt,
                        ...)
{
    va_list ap;
    if (ws == NULL)
        return status;
    va_start(ap, fmt);
    vsnprintf(ws->err, sizeof(ws->err), fmt, ap);
    va_end(ap);
    return status;
}

void mcdi_ws_clear_error(mcd_workspace *ws)
{
    if (ws != NULL)
        ws->err[0] = '\0';
}

double *mcdi_ws_geev_work(mcd_workspace *ws, size_t *out_lwork)
{
    if (out_lwork != NULL)
        *out_lwork = ws == NULL ? 0 : ws->geev_lwork;
    return ws == NULL ? NULL : ws->geev_work;
}
