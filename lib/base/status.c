/* status.c - text of status codes. */
#include "mcdiff.h"

MCD_API const char *mcd_status_string(int status)
{
    switch (status) {
    case MCD_OK: return "success";
    case MCD_EINVAL:
        return "invalid argument (NULL pointer, NaN or infinity, bad count or "
               "option)";
    case MCD_EDOM: return "argument outside the model's domain";
    case MCD_EBADLEN: return "array size differs from the workspace or mixture";
    case MCD_ENOMEM: return "out of memory";
    case MCD_ESING: return "singular or indefinite matrix";
    case MCD_EINTERNAL: return "internal error (please report)";
    case MCD_ENOTFOUND: return "not found";
    case MCD_EPARSE: return "malformed input text";
    case MCD_ENODATA: return "a parameter the method needs is missing";
    case MCD_ENOCONV: return "iteration did not converge";
    case MCD_EIO: return "file could not be opened or read";
    default: return "unknown status code";
    }
}
