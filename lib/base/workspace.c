/* workspace.c - the workspace's accessors
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

double *mcdi_ws_geev_work(mcd_workspace *ws, size_t *out_lwork)
{
    if (out_lwork != NULL)
        *out_lwork = ws == NULL ? 0 : ws->geev_lwork;
    return ws == NULL ? NULL : ws->geev_work;
}
