/* cmd_liquid.c - `mcdiff liquid`: activity coefficients, the
 * thermodynamic factor, Maxwell-Stefan diffusivities and partial
 * pressures of a liquid mixture with the caller's model parameters
 * (mcd_liquid_eval, mcd_liquid_vle). Species are numbered 1..N in the
 * order of -x.
 */
#include <math.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>
#include "cli.h"

#define LIQ_MAX 32 /* species on the command line */

static void help(FILE *f)
{
    fputs(
        "usage: mcdiff liquid -x LIST -T TEMP [--model NAME] [--pair SPEC]...\n"
        "                     [options]\n"
        "\n"
        "Activity coefficients, the thermodynamic factor matrix Gamma and,\n"
        "when every pair has infinite-dilution diffusivities, the\n"
        "Maxwell-Stefan diffusivities (Vignes; Kooijman-Taylor for 3 or more\n"
        "species) of a liquid mixture, with your model parameters. Species\n"
        "are numbered 1..N in the order of -x (messages of the library count\n"
        "from 0). A composition at which the\n"
        "liquid splits into two phases is refused (exit 1).\n"
        "\n"
        "options (lists are comma-separated):\n"
        "  -x, --x LIST              liquid mole fractions [-], sum 1\n"
        "  -T, --temperature TEMP    K or C suffix, bare = K\n"
        "  --model NAME              ideal, nrtl (default), wilson, uniquac\n"
        "  --pair I:J=A,B,E,A',B',E'[,ALPHA]\n"
        "                            pair parameters p_ij = A + B/T + E ln T\n"
        "                            (A, E [-], B [K]) and p_ji from A', B',\n"
        "                            E'; ALPHA: NRTL non-randomness (default\n"
        "                            0.3). NRTL tau = p, Wilson Lambda_ij =\n"
        "                            (V_j/V_i) exp(-p_ij), UNIQUAC tau =\n"
        "                            exp(-p). One --pair per pair.\n"
        "  --volumes LIST            Wilson: liquid molar volumes [m^3/mol]\n"
        "  --uniquac-r LIST          UNIQUAC volume parameters r [-]\n"
        "  --uniquac-q LIST          UNIQUAC area parameters q [-]\n"
        "  --dinf I:J=D1,D2          infinite-dilution diffusivities of I in "
        "J\n"
        "                            and J in I [m^2/s, or cm2/s suffix]\n"
        "  --antoine I=A,B,C,TMIN,TMAX  log10(P/Pa) = A - B/(T/K + C), valid\n"
        "                            TMIN..TMAX [K]: adds partial pressures\n"
        "                            x_i gamma_i P_i^sat [Pa]\n"
        "  --json                    one JSON object (SI): \"ln_gamma\",\n"
        "                            \"gamma\", \"Gamma\" (rows i), \"Dij\" "
        "[m^2/s],\n"
        "                            \"partial_pressures_Pa\", \"warnings\"\n"
        "  -h, --help                this text\n"
        "\n"
        "example (NRTL, tau = 1 both ways, alpha 0: ln gamma_1 = 2 x_2^2):\n"
        "  mcdiff liquid -x 0.3,0.7 -T 300 --pair 1:2=1,0,0,1,0,0,0\n",
        f);
}

/* "I:J=..." or "I=..." (want_j 0): 1-based indices into 0-based, the rest
 * after '='. Returns the text after '=' or NULL. */
static const char *parse_idx(const char *s, int want_j, size_t n, size_t *i,
                             size_t *j)
{
    char *end;
    long a = strtol(s, &end, 10), b = 0;
    if (end == s || a < 1 || (size_t)a > n)
        return NULL;
    if (want_j) {
        const char *t;
        if (*end != ':')
            return NULL;
        t = end + 1;
        b = strtol(t, &end, 10);
        if (end == t || b < 1 || (size_t)b > n || b == a)
            return NULL;
    }
    if (*end != '=')
        return NULL;
    *i = (size_t)(a - 1);
    *j = (size_t)(b - 1);
    return end + 1;
}

typedef struct liq_opts {
    const char *pair[LIQ_MAX * LIQ_MAX / 2], *dinf[LIQ_MAX * LIQ_MAX / 2];
    const char *ant[LIQ_MAX], *vol, *ur, *uq;
    size_t npair, ndinf, nant;
} liq_opts;

/* Build the liquid from the options. CLI_OK, or an exit code after a
 * message. */
static int build(const char *cmd, const liq_opts *o, size_t n,
                 mcd_activity_model model, mcd_liquid *liq, int *have_d)
{
    static const struct {
        const char *opt;
        mcd_liquid_param p;
    } sp[3] = {{"--volumes", MCD_LIQ_MOLAR_VOLUME},
               {"--uniquac-r", MCD_LIQ_UNIQUAC_R},
               {"--uniquac-q", MCD_LIQ_UNIQUAC_Q}};
    const char *lists[3] = {o->vol, o->ur, o->uq};
    char why[200];
    double v[8];
    size_t i, j, k, m;
    mcd_status st;
    for (k = 0; k < 3; k++) {
        if (lists[k] == NULL)
            continue;
        if (cli_parse_list(lists[k], v, 8, &m, why, sizeof why) != 0 || m != n)
            return cli_usage_error(cmd, sp[k].opt, "need %zu numbers", n);
        for (i = 0; i < n; i++)
            if ((st = mcd_liquid_set_species(liq, i, sp[k].p, v[i])) != MCD_OK)
                return cli_usage_error(cmd, sp[k].opt, "%s", mcd_last_error());
    }
    for (k = 0; k < o->npair; k++) {
        const char *t = parse_idx(o->pair[k], 1, n, &i, &j);
        if (t == NULL || cli_parse_list(t, v, 8, &m, why, sizeof why) != 0 ||
            (m != 6 && m != 7))
            return cli_usage_error(cmd, "--pair",
                                   "'%s' is not I:J=A,B,E,A',B',E'[,ALPHA] "
                                   "with species 1..%zu",
                                   o->pair[k], n);
        if (mcd_liquid_set_pair(liq, i, j, v, v + 3, m == 7 ? v[6] : 0.3, 0,
                                0) != MCD_OK)
            return cli_usage_error(cmd, "--pair", "%s", mcd_last_error());
    }
    for (k = 0; k < o->ndinf; k++) {
        char buf[128], *c;
        const char *t = parse_idx(o->dinf[k], 1, n, &i, &j);
        if (t == NULL || strlen(t) >= sizeof buf || !(c = strchr(t, ',')))
            return cli_usage_error(cmd, "--dinf", "'%s' is not I:J=D1,D2",
                                   o->dinf[k]);
        memcpy(buf, t, strlen(t) + 1);
        buf[c - t] = '\0';
        if (cli_parse_diffusivity(buf, &v[0], why, sizeof why) != 0 ||
            cli_parse_diffusivity(buf + (c - t) + 1, &v[1], why, sizeof why))
            return cli_usage_error(cmd, "--dinf", "%s", why);
        if (mcd_liquid_set_dinf(liq, i, j, v[0], v[1]) != MCD_OK)
            return cli_usage_error(cmd, "--dinf", "%s", mcd_last_error());
    }
    for (k = 0; k < o->nant; k++) {
        const char *t = parse_idx(o->ant[k], 0, n, &i, &j);
        if (t == NULL || cli_parse_list(t, v, 8, &m, why, sizeof why) != 0 ||
            m != 5)
            return cli_usage_error(cmd, "--antoine",
                                   "'%s' is not I=A,B,C,TMIN,TMAX", o->ant[k]);
        if (mcd_liquid_set_antoine(liq, i, v[0], v[1], v[2], v[3], v[4]) !=
            MCD_OK)
            return cli_usage_error(cmd, "--antoine", "%s", mcd_last_error());
    }
    *have_d = o->ndinf * 2 == n * (n - 1);
    (void)model;
    return CLI_OK;
}

static void print_matrix(const char *title, size_t n, const double *A)
{
    char buf[64];
    printf("%s\n", title);
    for (size_t i = 0; i < n; i++) {
        printf("  ");
        for (size_t j = 0; j < n; j++) {
            cli_fmt_num(buf, sizeof buf, A[i * n + j]);
            printf(" %12s", buf);
        }
        printf("\n");
    }
}

static void json_matrix(cli_json *js, const char *key, size_t n,
                        const double *A)
{
    cli_json_array_begin(js, key);
    for (size_t i = 0; i < n; i++)
        cli_json_numbers(js, NULL, A + i * n, n);
    cli_json_array_end(js);
}

static void report(int json, size_t n, mcd_activity_model model, double T,
                   const double *x, const double *lng, const double *G,
                   const double *D, const double *p, unsigned warn)
{
    static const char *const mname[4] = {"ideal", "nrtl", "wilson", "uniquac"};
    double g[LIQ_MAX];
    char wtext[256];
    for (size_t i = 0; i < n; i++)
        g[i] = exp(lng[i]);
    cli_warn_text(warn, wtext, sizeof wtext);
    if (json) {
        cli_json js;
        cli_json_init(&js, stdout);
        cli_json_object_begin(&js, NULL);
        cli_json_string(&js, "model", mname[model]);
        cli_json_number(&js, "T_K", T);
        cli_json_numbers(&js, "x", x, n);
        cli_json_numbers(&js, "ln_gamma", lng, n);
        cli_json_numbers(&js, "gamma", g, n);
        json_matrix(&js, "Gamma", n, G);
        if (D != NULL)
            json_matrix(&js, "Dij", n, D);
        if (p != NULL)
            cli_json_numbers(&js, "partial_pressures_Pa", p, n);
        cli_json_string(&js, "warnings", wtext);
        cli_json_string(&js, "caution", CLI_CAUTION_LONG);
        cli_json_object_end(&js);
        cli_json_finish(&js);
        return;
    }
    printf("liquid, %s model, %zu species, T = %g K\n", mname[model], n, T);
    printf("  species         x      ln_gamma         gamma%s\n",
           p ? "    p_Pa (x gamma P^sat)" : "");
    for (size_t i = 0; i < n; i++) {
        printf("  %7zu  %8.5f  %12.6g  %12.6g", i + 1, x[i], lng[i], g[i]);
        if (p != NULL)
            printf("  %12.6g", p[i]);
        printf("\n");
    }
    print_matrix("thermodynamic factor Gamma [-] (row i: d_i = sum_j "
                 "Gamma_ij grad x_j):",
                 n, G);
    if (D != NULL)
        print_matrix("Maxwell-Stefan diffusivities [m^2/s] (Vignes / "
                     "Kooijman-Taylor):",
                     n, D);
    if (warn)
        printf("warnings: %s\n", wtext);
    printf("%s\n", CLI_CAUTION_SHORT);
}

int cli_cmd_liquid(int argc, char **argv)
{
    enum {
        O_X = 1,
        O_T,
        O_MODEL,
        O_PAIR,
        O_VOL,
        O_UR,
        O_UQ,
        O_DINF,
        O_ANT,
        O_JSON,
        O_HELP
    };
    static const cli_opt opts[] = {
        {"x", 'x', 1, O_X},        {"temperature", 'T', 1, O_T},
        {"model", 0, 1, O_MODEL},  {"pair", 0, 1, O_PAIR},
        {"volumes", 0, 1, O_VOL},  {"uniquac-r", 0, 1, O_UR},
        {"uniquac-q", 0, 1, O_UQ}, {"dinf", 0, 1, O_DINF},
        {"antoine", 0, 1, O_ANT},  {"json", 0, 0, O_JSON},
        {"help", 'h', 0, O_HELP},  {NULL, 0, 0, 0}};
    static const char *const mnames[4] = {"ideal", "nrtl", "wilson", "uniquac"};
    const char *cmd = "liquid";
    cli_args a;
    liq_opts o;
    int id, json = 0, rc, have_d = 0, have_p;
    double T = NAN, x[LIQ_MAX], lng[LIQ_MAX], G[LIQ_MAX * LIQ_MAX];
    double D[LIQ_MAX * LIQ_MAX], p[LIQ_MAX];
    size_t n = 0, k;
    unsigned warn = 0;
    mcd_activity_model model = MCD_ACTIVITY_NRTL;
    mcd_liquid *liq = NULL;
    mcd_workspace *ws = NULL;
    mcd_status st;
    char why[200];

    memset(&o, 0, sizeof o);
    cli_args_init(&a, cmd, argc, argv, opts);
    while ((id = cli_args_next(&a)) != CLI_ARG_END) {
        switch (id) {
        case CLI_ARG_ERROR: return CLI_USAGE;
        case O_HELP: help(stdout); return CLI_OK;
        case O_JSON: json = 1; break;
        case O_X:
            if (cli_parse_list(a.value, x, LIQ_MAX, &n, why, sizeof why) != 0)
                return cli_usage_error(cmd, a.spelled, "%s", why);
            break;
        case O_T:
            if (cli_parse_temperature(a.value, &T, why, sizeof why) != 0)
                return cli_usage_error(cmd, a.spelled, "%s", why);
            break;
        case O_MODEL:
            for (k = 0; k < 4 && strcmp(a.value, mnames[k]) != 0; k++)
                ;
            if (k == 4)
                return cli_usage_error(cmd, a.spelled,
                                       "unknown model '%s' (ideal, nrtl, "
                                       "wilson, uniquac)",
                                       a.value);
            model = (mcd_activity_model)k;
            break;
        case O_PAIR:
        case O_DINF:
            if ((id == O_PAIR ? o.npair : o.ndinf) >= LIQ_MAX * LIQ_MAX / 2)
                return cli_usage_error(cmd, a.spelled, "too many");
            if (id == O_PAIR)
                o.pair[o.npair++] = a.value;
            else
                o.dinf[o.ndinf++] = a.value;
            break;
        case O_ANT:
            if (o.nant >= LIQ_MAX)
                return cli_usage_error(cmd, a.spelled, "too many");
            o.ant[o.nant++] = a.value;
            break;
        case O_VOL: o.vol = a.value; break;
        case O_UR: o.ur = a.value; break;
        case O_UQ: o.uq = a.value; break;
        case CLI_ARG_POSITIONAL:
            return cli_usage_error(cmd, a.value, "unexpected argument");
        default: return CLI_USAGE;
        }
    }
    if (n == 0)
        return cli_usage_error(cmd, "-x/--x", "is required");
    if (isnan(T))
        return cli_usage_error(cmd, "-T/--temperature", "is required");
    if ((st = mcd_liquid_new(n, model, &liq)) != MCD_OK)
        return cli_fail(cmd, "creating the liquid", st, mcd_last_error());
    rc = build(cmd, &o, n, model, liq, &have_d);
    if (rc == CLI_OK && (st = mcd_workspace_new(n, &ws)) != MCD_OK)
        rc = cli_fail(cmd, "allocating", st, mcd_last_error());
    if (rc == CLI_OK) {
        st = mcd_liquid_eval(ws, liq, T, x, lng, G, have_d ? D : NULL, &warn);
        if (st == MCD_EINVAL || st == MCD_ENODATA ||
            (st == MCD_EDOM && strstr(mcd_last_error(), "not stable") == NULL))
            rc = cli_usage_error(cmd, "the liquid", "%s: %s",
                                 mcd_status_string((int)st), mcd_last_error());
        else if (st != MCD_OK)
            rc = cli_fail(cmd, "the liquid", st, mcd_last_error());
    }
    have_p = o.nant > 0;
    if (rc == CLI_OK && have_p &&
        (st = mcd_liquid_vle(ws, liq, T, x, p, &warn)) != MCD_OK)
        rc = cli_fail(cmd, "the vapour pressures", st, mcd_last_error());
    if (rc == CLI_OK)
        report(json, n, model, T, x, lng, G, have_d ? D : NULL,
               have_p ? p : NULL, warn);
    mcd_workspace_free(ws);
    mcd_liquid_free(liq);
    return rc;
}
