/* The public header must compile on its own as strict C99.
 * (identities only: header and runtime versions agree; no outside check
 * values) */
#include "mcdiff.h"
#include <stdio.h>

int main(void)
{
    if (mcd_version_number() != MCD_VERSION_NUMBER) {
        fprintf(stderr, "runtime %u != header %d\n", mcd_version_number(),
                MCD_VERSION_NUMBER);
        return 1;
    }
    return 0;
}
