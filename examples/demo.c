/* demo.c - standalone demo driver: runs the invented scenario of
 * demo_scenario.c (the same one `mcdiff demo` prints). Exit 0 on success. */
#include <stdio.h>
#include "mcdiff.h"
#include "demo_scenario.h"

int main(void)
{
    if (mcd_version_number() / 10000u != (unsigned)MCD_VERSION_MAJOR) {
        fprintf(stderr, "demo: library %s does not match header %d.%d.%d\n",
                mcd_version_string(), MCD_VERSION_MAJOR, MCD_VERSION_MINOR,
                MCD_VERSION_PATCH);
        return 1;
    }
    return demo_scenario_run(stdout, stderr);
}
