/* demo_scenario.h - the invented demo scenario shared by examples/demo.c and
 * `mcdiff demo`. Uses only the public header mcdiff.h. */
#ifndef MCDIFF_DEMO_SCENARIO_H
#define MCDIFF_DEMO_SCENARIO_H

#include <stdio.h>

/* Run the scenario, printing about 30 lines to out and any error to err.
 * Returns 0 on success, 1 if a library call failed. */
int demo_scenario_run(FILE *out, FILE *err);

#endif
