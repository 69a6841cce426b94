/* args.c - a small option scanner for the mcdiff tool.
 *
 * Accepted spellings: "--name", "--name=value", "--name value", "-s",
 * "-svalue", "-s value". A value is taken from the next word even when it
 * starts with '-', so negative numbers need no quoting. "--" ends options.
 */
#include <stdio.h>
#include <string.h>
#include "cli.h"

void cli_args_init(cli_args *a, const char *cmd, int argc, char **argv,
                   const cli_opt *opts)
{
    memset(a, 0, sizeof *a);
    a->argc = argc;
    a->argv = argv;
    a->pos = 0;
    a->opts = opts;
    a->cmd = cmd;
}

/* Name the option in messages by its short and long spelling. */
static void name_option(cli_args *a, const cli_opt *o)
{
    if (o->short_name && o->long_name)
        snprintf(a->spelled_buf, sizeof a->spelled_buf, "-%c/--%s",
                 o->short_name, o->long_name);
    else if (o->long_name)
        snprintf(a->spelled_buf, sizeof a->spelled_buf, "--%s", o->long_name);
    else
        snprintf(a->spelled_buf, sizeof a->spelled_buf, "-%c", o->short_name);
    a->spelled = a->spelled_buf;
}

/* The rule on repeated options: one with a value may be given once unless
 * it is CLI_REPEAT (its spellings share the id, so --v1 then --V1 is a
 * repeat too). Returns the id or CLI_ARG_ERROR (message printed). */
static int note_value(cli_args *a, const cli_opt *o)
{
    int k;
    a->last_number = cli_is_plain_number(a->value) ? a->value : NULL;
    if (o->takes_value == CLI_REPEAT)
        return o->id;
    for (k = 0; k < a->n_seen; k++)
        if (a->seen_id[k] == o->id) {
            cli_usage_error(a->cmd, a->spelled,
                            "given twice ('%s', then '%s'); give it once",
                            a->seen_value[k], a->value);
            return CLI_ARG_ERROR;
        }
    if (a->n_seen < CLI_MAX_SEEN) {
        a->seen_id[a->n_seen] = o->id;
        a->seen_value[a->n_seen++] = a->value;
    }
    return o->id;
}

static int take_value(cli_args *a, const cli_opt *o, const char *attached)
{
    name_option(a, o);
    if (attached) {
        a->value = attached;
        return note_value(a, o);
    }
    if (a->pos >= a->argc) {
        return cli_usage_error(a->cmd, a->spelled, "needs a value"),
               CLI_ARG_ERROR;
    }
    a->value = a->argv[a->pos++];
    return note_value(a, o);
}

int cli_args_next(cli_args *a)
{
    const char *w;
    const cli_opt *o;

    a->value = NULL;
    a->spelled = NULL;
    if (a->pos >= a->argc)
        return CLI_ARG_END;
    w = a->argv[a->pos++];
    if (a->only_positional || w[0] != '-' || w[1] == '\0') {
        /* "-T 60 C": the unit was split off by a space */
        const char *num = a->last_number;
        a->last_number = NULL;
        if (!a->only_positional && num && cli_is_unit_word(w)) {
            cli_usage_error(a->cmd, a->spelled_buf,
                            "'%s' after '%s' looks like its unit: write it "
                            "without a space (%s%s) or quote both (\"%s %s\")",
                            w, num, num, w, num, w);
            return CLI_ARG_ERROR;
        }
        a->value = w;
        return CLI_ARG_POSITIONAL;
    }
    a->last_number = NULL;
    if (strcmp(w, "--") == 0) {
        a->only_positional = 1;
        return cli_args_next(a);
    }
    a->spelled = w;
    if (w[1] == '-') {
        const char *name = w + 2;
        const char *eq = strchr(name, '=');
        size_t len = eq ? (size_t)(eq - name) : strlen(name);
        for (o = a->opts; o->long_name || o->short_name; o++) {
            if (o->long_name && strlen(o->long_name) == len &&
                strncmp(o->long_name, name, len) == 0) {
                if (!o->takes_value) {
                    name_option(a, o);
                    if (eq) {
                        cli_usage_error(a->cmd, w, "takes no value");
                        return CLI_ARG_ERROR;
                    }
                    return o->id;
                }
                return take_value(a, o, eq ? eq + 1 : NULL);
            }
        }
        cli_usage_error(a->cmd, w, "unknown option (see --help)");
        return CLI_ARG_ERROR;
    }
    for (o = a->opts; o->long_name || o->short_name; o++) {
        if (o->short_name && o->short_name == w[1]) {
            if (!o->takes_value) {
                name_option(a, o);
                if (w[2] != '\0') {
                    cli_usage_error(a->cmd, w, "takes no value");
                    return CLI_ARG_ERROR;
                }
                return o->id;
            }
            return take_value(a, o, w[2] ? w + 2 : NULL);
        }
    }
    cli_usage_error(a->cmd, w, "unknown option (see --help)");
    return CLI_ARG_ERROR;
}
