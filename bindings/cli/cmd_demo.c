/* cmd_demo.c - `mcdiff demo`: the invented scenario of
 * examples/demo_scenario.c. */
#include <stdio.h>
#include "cli.h"
#include "demo_scenario.h"

static void help(FILE *f)
{
    fputs(
        "usage: mcdiff demo\n"
        "\n"
        "A short worked scenario with invented numbers (a solvent-wet lacquer\n"
        "drying in humid nitrogen at 45 C, 1 atm): estimated binary\n"
        "diffusivities [cm^2/s], molar diffusion fluxes [mmol/(m^2 s)] by\n"
        "exact Maxwell-Stefan, mixture-averaged and naive binary Fick, their\n"
        "zero-sums and the coupling flags. Uses only the built-in species.\n"
        "\n"
        "options:\n"
        "  -h, --help   this text\n"
        "\n"
        "example:\n"
        "  mcdiff demo\n",
        f);
}

int cli_cmd_demo(int argc, char **argv)
{
    enum { O_HELP = 1 };
    static const cli_opt opts[] = {{"help", 'h', 0, O_HELP}, {NULL, 0, 0, 0}};
    cli_args a;
    int id;
    cli_args_init(&a, "demo", argc, argv, opts);
    while ((id = cli_args_next(&a)) != CLI_ARG_END) {
        if (id == O_HELP) {
            help(stdout);
            return CLI_OK;
        }
        if (id == CLI_ARG_POSITIONAL)
            return cli_usage_error("demo", a.value,
                                   "unexpected argument (the demo takes no "
                                   "input)");
        return CLI_USAGE;
    }
    return demo_scenario_run(stdout, stderr) == 0 ? CLI_OK : CLI_FAIL;
}
