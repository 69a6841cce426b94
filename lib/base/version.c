/* version.c - runtime version of the library. */
#include "mcdiff.h"

#define MCD_STR2(x) #x
#define MCD_STR(x) MCD_STR2(x)

MCD_API unsigned mcd_version_number(void) { return MCD_VERSION_NUMBER; }

MCD_API const char *mcd_version_string(void)
{
    return MCD_STR(MCD_VERSION_MAJOR) "." MCD_STR(
        MCD_VERSION_MINOR) "." MCD_STR(MCD_VERSION_PATCH);
}
