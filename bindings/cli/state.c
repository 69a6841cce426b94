/* state.c - the state options shared by `mcdiff fluxes` and `mcdiff matrix`:
 * species, composition, gradients, T, P, model, basis and the binary
 * diffusivities (estimated by a method, or given per pair).
 */
#include <math.h>
#include <stdarg.h>
#include <stdint.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>
#include "cli.h"

enum { O_X = 1, O_W, O_GRAD, O_DLNP, O_KT, O_DTDZ, O_MODEL, O_BASIS, O_DEP };

static const cli_opt state_opts[] = {CLI_MIXTURE_OPTIONS,
                                     {"mole-fractions", 'x', 1, O_X},
                                     {"mass-fractions", 'w', 1, O_W},
                                     {"gradient", 'g', CLI_REPEAT, O_GRAD},
                                     {"grad-lnp", 0, 1, O_DLNP},
                                     {"thermal-ratios", 0, 1, O_KT},
                                     {"temperature-gradient", 0, 1, O_DTDZ},
                                     {"model", 0, 1, O_MODEL},
                                     {"basis", 0, 1, O_BASIS},
                                     {"dependent", 0, 1, O_DEP},
                                     {NULL, 0, 0, 0}};

/* Parse "A:B=D" or "A:B=D@T,P" into p (text is modified: kept by the
 * caller's argv). */
static int parse_pair(char *text, struct cli_pair *p, char *why, size_t whylen)
{
    char *colon = strchr(text, ':');
    char *eq = strchr(text, '=');
    char *at, *comma;
    if (!colon || !eq || colon > eq || colon == text || eq == colon + 1) {
        snprintf(why, whylen, "expected A:B=D (e.g. H2:N2=7.8e-5)");
        return -1;
    }
    *colon = '\0';
    *eq = '\0';
    p->a = text;
    p->b = colon + 1;
    p->T_ref = (double)NAN;
    p->P_ref = (double)NAN;
    at = strchr(eq + 1, '@');
    if (at) {
        *at = '\0';
        comma = strchr(at + 1, ',');
        if (!comma) {
            snprintf(why, whylen,
                     "expected A:B=D@T,P for a value measured at T and P");
            return -1;
        }
        *comma = '\0';
        if (cli_parse_temperature(at + 1, &p->T_ref, why, whylen) != 0 ||
            cli_parse_pressure(comma + 1, &p->P_ref, why, whylen) != 0)
            return -1;
    }
    return cli_parse_diffusivity(eq + 1, &p->D, why, whylen);
}

void cli_state_note(cli_state *s, const char *cmd, const char *fmt, ...)
{
    va_list ap;
    char buf[sizeof s->notes[0]];
    va_start(ap, fmt);
    vsnprintf(buf, sizeof buf, fmt, ap);
    va_end(ap);
    fprintf(stderr, "mcdiff %s: warning: %s\n", cmd, buf);
    if (s->n_notes < sizeof s->notes / sizeof s->notes[0])
        memcpy(s->notes[s->n_notes++], buf, sizeof buf);
}

/* Gradients of fractions that sum to one sum to zero. Other ones are used
 * as the library uses them, projected (g_i -= f_i sum_k g_k, f the
 * fractions): say so and show the projected values. */
void cli_state_project_gradients(cli_state *s, const char *cmd)
{
    const double *f = s->comp_basis == MCD_BASIS_MOLE ? s->x : s->w;
    size_t n = s->n, nd = s->n_dim, d, k;
    for (d = 0; d < nd; d++) {
        double sum = 0.0, big = 0.0;
        char list[300];
        size_t used = 0;
        for (k = 0; k < n; k++) {
            sum += s->grad[k * nd + d];
            big = fmax(big, fabs(s->grad[k * nd + d]));
        }
        if (!(fabs(sum) > 1e-9 * big))
            continue;
        list[0] = '\0';
        for (k = 0; k < n; k++) {
            s->grad[k * nd + d] -= f[k] * sum;
            if (used + 1 < sizeof list)
                used +=
                    (size_t)snprintf(list + used, sizeof list - used, "%s%.6g",
                                     k ? "," : "", s->grad[k * nd + d]);
        }
        cli_state_note(s, cmd,
                       "-g/--gradient%s%.0d: the gradients sum to %.6g 1/m, "
                       "not 0 (fractions summing to 1 have gradients summing "
                       "to 0); used projected: %s",
                       nd > 1 ? " direction " : "", nd > 1 ? (int)d + 1 : 0,
                       sum, list);
    }
}

int cli_fractions_error(const char *cmd, const char *opt, mcd_status st,
                        const double *v, size_t n)
{
    double sum = 0.0;
    size_t k;
    for (k = 0; k < n; k++)
        sum += v[k];
    return cli_usage_error(cmd, opt,
                           "%s: fractions must be >= 0 and sum to 1 (within "
                           "%g); these sum to %.10g",
                           mcd_status_string(st), MCD_SUM_TOL, sum);
}

int cli_gas_method_from_name(const char *name, mcd_gas_method *out)
{
    mcd_method m;
    if (strcmp(name, "recommended") == 0) {
        *out = MCD_GAS_RECOMMENDED;
        return 0;
    }
    if (mcd_method_from_name(name, &m) != MCD_OK ||
        (m != MCD_METHOD_FSG && m != MCD_METHOD_CHAPMAN_ENSKOG &&
         m != MCD_METHOD_WILKE_LEE && m != MCD_METHOD_BROKAW))
        return -1;
    *out = (mcd_gas_method)m;
    return 0;
}

const char *cli_gas_method_name(mcd_gas_method g)
{
    return g == MCD_GAS_RECOMMENDED ? "recommended"
                                    : mcd_method_name((mcd_method)g);
}

void cli_state_defaults(cli_state *s)
{
    memset(s, 0, sizeof *s);
    s->T = (double)NAN;
    s->P = (double)NAN;
    s->model = MCD_MODEL_MAXWELL_STEFAN;
    s->method = MCD_GAS_RECOMMENDED;
    s->dependent = MCD_DEPENDENT_AUTO;
}

int cli_state_option(cli_state *s, const char *cmd, const cli_args *a, int id)
{
    char why[200];
    switch (id) {
    case CLI_O_JSON: s->json = 1; return CLI_OK;
    case CLI_O_CSV: s->csv = 1; return CLI_OK;
    case CLI_O_FILE: s->file = a->value; return CLI_OK;
    case CLI_O_SPECIES: {
        int n;
        size_t i, j;
        if (s->names_buf)
            return cli_usage_error(cmd, a->spelled, "given twice");
        s->names_buf = malloc(strlen(a->value) + 1);
        if (!s->names_buf)
            return cli_fail(cmd, "reading arguments", MCD_ENOMEM, NULL);
        strcpy(s->names_buf, a->value);
        n = cli_split_words(s->names_buf, s->names, MCD_MAX_SPECIES);
        if (n < 0)
            return cli_usage_error(cmd, a->spelled,
                                   "expected a comma-separated list of "
                                   "species names without empty items");
        if (n < 2)
            return cli_usage_error(cmd, a->spelled,
                                   "give at least two species");
        s->n = (size_t)n;
        for (i = 0; i < s->n; i++)
            for (j = 0; j < i; j++)
                if (strcmp(s->names[i], s->names[j]) == 0)
                    return cli_usage_error(cmd, a->spelled,
                                           "species '%s' listed twice",
                                           s->names[i]);
        return CLI_OK;
    }
    case CLI_O_T:
        if (cli_parse_temperature(a->value, &s->T, why, sizeof why) != 0)
            return cli_usage_error(cmd, a->spelled, "%s", why);
        return CLI_OK;
    case CLI_O_P:
        if (cli_parse_pressure(a->value, &s->P, why, sizeof why) != 0)
            return cli_usage_error(cmd, a->spelled, "%s", why);
        return CLI_OK;
    case CLI_O_METHOD:
        if (cli_gas_method_from_name(a->value, &s->method) != 0)
            return cli_usage_error(cmd, a->spelled,
                                   "'%s' is not a gas estimation method "
                                   "(fsg, chapman-enskog, wilke-lee, brokaw "
                                   "or recommended)",
                                   a->value);
        return CLI_OK;
    case CLI_O_PAIR: {
        char *copy;
        if (s->n_pairs >= sizeof s->pairs / sizeof s->pairs[0])
            return cli_usage_error(cmd, a->spelled, "too many pairs");
        s->pairs[s->n_pairs].text = a->value; /* original text for messages */
        copy = malloc(strlen(a->value) + 1);
        if (!copy)
            return cli_fail(cmd, "reading arguments", MCD_ENOMEM, NULL);
        strcpy(copy, a->value);
        s->pair_bufs[s->n_pairs++] = copy; /* freed by cli_state_free */
        if (parse_pair(copy, &s->pairs[s->n_pairs - 1], why, sizeof why) != 0)
            return cli_usage_error(cmd, cli_pair_opt(s), "'%s': %s", a->value,
                                   why);
        return CLI_OK;
    }
    default: return CLI_USAGE;
    }
}

int cli_state_require(const cli_state *s, const char *cmd)
{
    if (s->json && s->csv)
        return cli_usage_error(cmd, "--csv",
                               "give either --json or --csv, not both");
    if (s->n == 0)
        return cli_usage_error(cmd, "-s/--species", "is required");
    if (isnan(s->T))
        return cli_usage_error(cmd, "-T/--temperature", "is required");
    if (isnan(s->P))
        return cli_usage_error(cmd, "-P/--pressure", "is required");
    return CLI_OK;
}

/* --thermal-ratios (one value per species) and --temperature-gradient (one
 * per direction): both or neither, fluxes only. */
static int thermal_options(const cli_state *s, const char *cmd, int need_grad,
                           size_t nkT, size_t ndT)
{
    if (!s->have_kT && !s->have_dTdz)
        return CLI_OK;
    if (!need_grad)
        return cli_usage_error(
            cmd, s->have_kT ? "--thermal-ratios" : "--temperature-gradient",
            "not used here: thermal diffusion changes "
            "the fluxes, not the Fick matrix");
    if (!s->have_kT || !s->have_dTdz)
        return cli_usage_error(
            cmd, s->have_kT ? "--temperature-gradient" : "--thermal-ratios",
            "is required with %s (thermal diffusion "
            "needs both)",
            s->have_kT ? "--thermal-ratios" : "--temperature-gradient");
    if (nkT != s->n && !s->kT_estimated)
        return cli_usage_error(cmd, "--thermal-ratios",
                               "has %zu values for %zu species", nkT, s->n);
    if (ndT != s->n_dim)
        return cli_usage_error(cmd, "--temperature-gradient",
                               "needs one value per direction (%zu given, "
                               "%zu directions)",
                               ndT, s->n_dim);
    return CLI_OK;
}
int cli_state_parse(cli_state *s, const char *cmd, int argc, char **argv,
                    int need_grad, void (*help)(FILE *))
{
    cli_args a;
    int id, rc, have_x = 0, have_w = 0, have_basis = 0;
    size_t ncomp = 0, k;
    double rows[MCD_MAX_DIM][MCD_MAX_SPECIES];
    size_t nrow[MCD_MAX_DIM] = {0};
    char why[200];
    double comp_tmp[MCD_MAX_SPECIES];
    size_t ndlnp = 0, nkT = 0, ndT = 0;

    cli_state_defaults(s);
    cli_args_init(&a, cmd, argc, argv, state_opts);
    while ((id = cli_args_next(&a)) != CLI_ARG_END) {
        if (id >= CLI_O_SPECIES && id != CLI_O_HELP) {
            rc = cli_state_option(s, cmd, &a, id);
            if (rc != CLI_OK)
                return rc;
            continue;
        }
        switch (id) {
        case CLI_ARG_ERROR: return CLI_USAGE;
        case CLI_O_HELP: help(stdout); return -1;
        case O_X:
        case O_W:
            if (have_x || have_w)
                return cli_usage_error(cmd, a.spelled,
                                       "give one composition: either -x or "
                                       "-w, once");
            if (cli_parse_list(a.value, comp_tmp, MCD_MAX_SPECIES, &ncomp, why,
                               sizeof why) != 0)
                return cli_usage_error(cmd, a.spelled, "%s", why);
            if (id == O_X)
                have_x = 1;
            else
                have_w = 1;
            break;
        case O_GRAD:
            if (s->n_dim >= MCD_MAX_DIM)
                return cli_usage_error(cmd, a.spelled,
                                       "at most %d directions (one -g per "
                                       "direction)",
                                       MCD_MAX_DIM);
            if (cli_parse_list(a.value, rows[s->n_dim], MCD_MAX_SPECIES,
                               &nrow[s->n_dim], why, sizeof why) != 0)
                return cli_usage_error(cmd, a.spelled, "%s", why);
            s->n_dim++;
            break;
        case O_DLNP:
            if (s->have_grad_lnP)
                return cli_usage_error(cmd, a.spelled, "given twice");
            if (cli_parse_list(a.value, s->grad_lnP, MCD_MAX_DIM, &ndlnp, why,
                               sizeof why) != 0)
                return cli_usage_error(cmd, a.spelled, "%s", why);
            s->have_grad_lnP = 1;
            break;
        case O_KT:
            if (s->have_kT)
                return cli_usage_error(cmd, a.spelled, "given twice");
            s->have_kT = 1;
            if (strcmp(a.value, "estimate") == 0) {
                s->kT_estimated = 1; /* filled in cli_state_setup */
                nkT = SIZE_MAX;
                break;
            }
            if (cli_parse_list(a.value, s->kT, MCD_MAX_SPECIES, &nkT, why,
                               sizeof why) != 0)
                return cli_usage_error(cmd, a.spelled, "%s", why);
            break;
        case O_DTDZ:
            if (s->have_dTdz)
                return cli_usage_error(cmd, a.spelled, "given twice");
            if (cli_parse_list(a.value, s->dTdz, MCD_MAX_DIM, &ndT, why,
                               sizeof why) != 0)
                return cli_usage_error(cmd, a.spelled, "%s", why);
            s->have_dTdz = 1;
            break;
        case O_MODEL:
            if (need_grad == 0)
                return cli_usage_error(cmd, a.spelled,
                                       "not used here: the Fick matrix is "
                                       "always the exact Maxwell-Stefan one");
            /* the vocabulary of the Python package too */
            if (strcmp(a.value, "exact") == 0 ||
                strcmp(a.value, "maxwell-stefan") == 0)
                s->model = MCD_MODEL_MAXWELL_STEFAN;
            else if (strcmp(a.value, "mixture-averaged") == 0)
                s->model = MCD_MODEL_MIXTURE_AVERAGED;
            else
                return cli_usage_error(cmd, a.spelled,
                                       "'%s' is not a model (exact, also "
                                       "written maxwell-stefan, or "
                                       "mixture-averaged)",
                                       a.value);
            break;
        case O_BASIS:
            if (strcmp(a.value, "mole") == 0)
                s->out_basis = MCD_BASIS_MOLE;
            else if (strcmp(a.value, "mass") == 0)
                s->out_basis = MCD_BASIS_MASS;
            else
                return cli_usage_error(cmd, a.spelled,
                                       "'%s' is not a basis (mole or mass)",
                                       a.value);
            have_basis = 1;
            break;
        case O_DEP: s->dependent_name = a.value; break;
        case CLI_ARG_POSITIONAL:
            return cli_usage_error(cmd, a.value,
                                   "unexpected argument (options only; see "
                                   "--help)");
        default: return CLI_USAGE;
        }
    }
    if ((rc = cli_state_require(s, cmd)) != CLI_OK)
        return rc;
    if (!have_x && !have_w)
        return cli_usage_error(cmd, "-x/--mole-fractions",
                               "a composition is required (or "
                               "-w/--mass-fractions)");
    if (ncomp != s->n)
        return cli_usage_error(
            cmd, have_x ? "-x/--mole-fractions" : "-w/--mass-fractions",
            "has %zu values for %zu species", ncomp, s->n);
    if (need_grad && s->n_dim == 0)
        return cli_usage_error(cmd, "-g/--gradient",
                               "is required (one per direction)");
    for (k = 0; k < s->n_dim; k++)
        if (nrow[k] != s->n)
            return cli_usage_error(cmd, "-g/--gradient",
                                   "direction %zu has %zu values for %zu "
                                   "species",
                                   k + 1, nrow[k], s->n);
    if (s->have_grad_lnP && (s->n_dim == 0 || ndlnp != s->n_dim))
        return cli_usage_error(cmd, "--grad-lnp",
                               "needs one value per direction (%zu given, "
                               "%zu directions)",
                               ndlnp, s->n_dim);
    if ((rc = thermal_options(s, cmd, need_grad, nkT, ndT)) != CLI_OK)
        return rc;

    s->comp_basis = have_x ? MCD_BASIS_MOLE : MCD_BASIS_MASS;
    if (!have_basis)
        s->out_basis = s->comp_basis;
    s->comp = malloc(s->n * sizeof *s->comp);
    s->grad = malloc((s->n_dim ? s->n_dim : 1) * s->n * sizeof *s->grad);
    if (!s->comp || !s->grad)
        return cli_fail(cmd, "reading arguments", MCD_ENOMEM, NULL);
    memcpy(s->comp, comp_tmp, s->n * sizeof *s->comp);
    for (k = 0; k < s->n; k++) {
        size_t d;
        for (d = 0; d < s->n_dim; d++)
            s->grad[k * s->n_dim + d] = rows[d][k];
    }
    return CLI_OK;
}

/* Position of db species `dbi` in the state's species list, or -1. */
static long list_position(const cli_state *s, size_t dbi)
{
    size_t i;
    for (i = 0; i < s->n; i++)
        if (s->dbidx[i] == dbi)
            return (long)i;
    return -1;
}

long cli_state_find(const cli_state *s, const char *name)
{
    size_t id;
    if (!s->db || mcd_db_find(s->db, name, &id) != MCD_OK)
        return -1;
    return list_position(s, id);
}

int cli_state_setup(cli_state *s, const char *cmd)
{
    size_t i, n = s->n, k;
    char err[256] = "";
    mcd_status st;
    int rc;
    const char *comp_opt = s->comp_opt ? s->comp_opt
                           : s->comp_basis == MCD_BASIS_MOLE
                               ? "-x/--mole-fractions"
                               : "-w/--mass-fractions";

    rc = cli_open_db(cmd, s->file, &s->db);
    if (rc != CLI_OK)
        return rc;
    s->dbidx = malloc(n * sizeof *s->dbidx);
    if (!s->dbidx)
        return cli_fail(cmd, "setting up", MCD_ENOMEM, NULL);
    for (i = 0; i < n; i++) {
        st = mcd_db_find(s->db, s->names[i], &s->dbidx[i]);
        if (st == MCD_ENOTFOUND)
            return cli_usage_error(cmd, "-s/--species",
                                   "%s (see 'mcdiff species')",
                                   mcd_last_error());
        if (st != MCD_OK)
            return cli_fail(cmd, "looking up species", st, s->names[i]);
        if (list_position(s, s->dbidx[i]) != (long)i)
            return cli_usage_error(cmd, "-s/--species",
                                   "'%s' names a species already listed",
                                   s->names[i]);
    }
    cli_species_names(s->names, n);
    st = mcd_mixture_new(s->db, n, (const char *const *)s->names, s->method,
                         &s->mix);
    if (st != MCD_OK)
        return cli_fail(cmd, "building the mixture", st, mcd_last_error());

    s->user_pair = calloc(n * n, sizeof *s->user_pair);
    if (!s->user_pair)
        return cli_fail(cmd, "setting up", MCD_ENOMEM, NULL);
    for (k = 0; k < s->n_pairs; k++) {
        struct cli_pair *p = &s->pairs[k];
        size_t ia, ib;
        long pa, pb;
        if (mcd_db_find(s->db, p->a, &ia) != MCD_OK ||
            (pa = list_position(s, ia)) < 0)
            return cli_usage_error(cmd, cli_pair_opt(s),
                                   "'%s': '%s' is not in the species list",
                                   p->text, p->a);
        if (mcd_db_find(s->db, p->b, &ib) != MCD_OK ||
            (pb = list_position(s, ib)) < 0)
            return cli_usage_error(cmd, cli_pair_opt(s),
                                   "'%s': '%s' is not in the species list",
                                   p->text, p->b);
        if (pa == pb)
            return cli_usage_error(cmd, cli_pair_opt(s),
                                   "'%s': a pair needs two different species",
                                   p->text);
        if (s->user_pair[(size_t)pa * n + (size_t)pb])
            return cli_usage_error(cmd, cli_pair_opt(s),
                                   "'%s': pair given twice", p->text);
        if (cli_implausible_gas_D(strchr(p->text, '=') + 1, p->D,
                                  isnan(p->P_ref) ? s->P : p->P_ref, err,
                                  sizeof err))
            cli_state_note(s, cmd, "--pair %s: %s", p->text, err);
        st = mcd_mixture_set_binary(s->mix, (size_t)pa, (size_t)pb, p->D,
                                    isnan(p->T_ref) ? s->T : p->T_ref,
                                    isnan(p->P_ref) ? s->P : p->P_ref);
        if (st != MCD_OK) {
            char what[64];
            snprintf(what, sizeof what, "setting %s", cli_pair_opt(s));
            return cli_fail(cmd, what, st, p->text);
        }
        s->user_pair[(size_t)pa * n + (size_t)pb] = 1;
        s->user_pair[(size_t)pb * n + (size_t)pa] = 1;
    }

    if (s->dependent_name) {
        size_t id;
        long pos;
        if (mcd_db_find(s->db, s->dependent_name, &id) != MCD_OK ||
            (pos = list_position(s, id)) < 0)
            return cli_usage_error(cmd, "--dependent",
                                   "'%s' is not in the species list",
                                   s->dependent_name);
        s->dependent = (size_t)pos;
    }

    s->M = malloc(n * sizeof *s->M);
    s->x = malloc(n * sizeof *s->x);
    s->w = malloc(n * sizeof *s->w);
    s->Dij = malloc(n * n * sizeof *s->Dij);
    s->rel_err = malloc(n * n * sizeof *s->rel_err);
    s->warn = calloc(n * n, sizeof *s->warn);
    if (!s->M || !s->x || !s->w || !s->Dij || !s->rel_err || !s->warn)
        return cli_fail(cmd, "setting up", MCD_ENOMEM, NULL);
    st = mcd_mixture_molar_masses(s->mix, s->M);
    if (st != MCD_OK)
        return cli_fail(cmd, "reading molar masses", st, NULL);

    /* Composition: validated and converted; a bad one is bad input. */
    if (s->comp_basis == MCD_BASIS_MOLE) {
        st = mcd_comp_normalize(n, s->comp, s->x);
        if (st == MCD_OK)
            st = mcd_comp_x_to_w(n, s->M, s->x, s->w);
    } else {
        st = mcd_comp_normalize(n, s->comp, s->w);
        if (st == MCD_OK)
            st = mcd_comp_w_to_x(n, s->M, s->w, s->x);
    }
    if (st == MCD_EDOM || st == MCD_EINVAL)
        return cli_fractions_error(cmd, comp_opt, st, s->comp, n);
    if (st != MCD_OK)
        return cli_fail(cmd, "converting the composition", st, NULL);
    if (s->n_dim > 0 && s->grad)
        cli_state_project_gradients(s, cmd);

    st = mcd_comp_ideal_gas_c(s->T, s->P, &s->c);
    if (st != MCD_OK)
        return cli_fail(cmd, "ideal-gas concentration", st, NULL);
    st = mcd_mixture_binaries(s->mix, s->T, s->P, s->Dij, s->rel_err, s->warn);
    if (st != MCD_OK) {
        snprintf(err, sizeof err, "%s (method %s; try --method or --pair)",
                 mcd_last_error(), cli_gas_method_name(s->method));
        return cli_fail(cmd, "estimating binary diffusivities", st, err);
    }
    if (s->kT_estimated) {
        st = mcd_mixture_thermal_ratios(s->mix, s->T, s->x, s->kT, NULL,
                                        &s->kT_rel_err, &s->kT_warn);
        if (st != MCD_OK)
            return cli_fail(cmd, "estimating thermal diffusion ratios", st,
                            mcd_last_error());
    }
    st = mcd_workspace_new(n, &s->ws);
    if (st != MCD_OK)
        return cli_fail(cmd, "allocating a workspace", st, NULL);
    return CLI_OK;
}

void cli_state_free(cli_state *s)
{
    size_t k;
    mcd_workspace_free(s->ws);
    mcd_mixture_free(s->mix);
    mcd_db_free(s->db);
    for (k = 0; k < s->n_pairs; k++)
        free(s->pair_bufs[k]);
    free(s->names_buf);
    free(s->comp);
    free(s->grad);
    free(s->dbidx);
    free(s->M);
    free(s->x);
    free(s->w);
    free(s->Dij);
    free(s->rel_err);
    free(s->warn);
    free(s->user_pair);
    memset(s, 0, sizeof *s);
}

/* The method of pair (i, j) as the mixture uses it (the one
 * --method recommended picked, MCD_METHOD_USER for a given value). */
static mcd_method pair_method(const cli_state *s, size_t i, size_t j)
{
    mcd_method m = MCD_METHOD_USER;
    if (mcd_mixture_pair_method(s->mix, i, j, &m) != MCD_OK)
        return (mcd_method)s->method; /* i != j, both in range: cannot */
    return m;
}

static const char *pair_source(const cli_state *s, size_t i, size_t j)
{
    return s->user_pair[i * s->n + j] ? "given"
                                      : mcd_method_name(pair_method(s, i, j));
}

/* The stated error of pair (i, j): the published one of its method
 * widened by the pair's warnings (NaN for a given value). */
static double pair_error(const cli_state *s, size_t i, size_t j)
{
    size_t ij = i * s->n + j;
    if (s->user_pair[ij] || isnan(s->rel_err[ij]))
        return (double)NAN;
    return cli_widened_error(pair_method(s, i, j), s->warn[ij]);
}

void cli_state_print_binaries(const cli_state *s, FILE *f)
{
    cli_table t;
    const char *cells[5];
    char pair[160], d1[48], d2[48], e[48];
    size_t i, j, n = s->n;
    unsigned all = 0;

    cli_table_init(&t, 5);
    t.right[1] = t.right[2] = t.right[3] = 1;
    cells[0] = "pair";
    cells[1] = "D [m^2/s]";
    cells[2] = "D [cm^2/s]";
    cells[3] = "typ. error";
    cells[4] = "source";
    cli_table_row(&t, cells);
    for (i = 0; i < n; i++)
        for (j = i + 1; j < n; j++) {
            double D = s->Dij[i * n + j], re = pair_error(s, i, j);
            snprintf(pair, sizeof pair, "%s / %s", mcd_mixture_name(s->mix, i),
                     mcd_mixture_name(s->mix, j));
            snprintf(d1, sizeof d1, "%.4e", D);
            snprintf(d2, sizeof d2, "%.4g", D * 1e4);
            if (isnan(re))
                snprintf(e, sizeof e, "-");
            else
                snprintf(e, sizeof e, "%.1f %%", 100.0 * re);
            cells[0] = pair;
            cells[1] = d1;
            cells[2] = d2;
            cells[3] = e;
            cells[4] = pair_source(s, i, j);
            cli_table_row(&t, cells);
            all |= s->warn[i * n + j];
        }
    cli_table_print(&t, f, "  ");
    cli_table_free(&t);
    for (i = 0; i < n; i++)
        for (j = i + 1; j < n; j++) {
            char w[512];
            if (s->warn[i * n + j] == 0)
                continue;
            cli_warn_text(s->warn[i * n + j], w, sizeof w);
            fprintf(f, "  warning (%s / %s): %s\n", mcd_mixture_name(s->mix, i),
                    mcd_mixture_name(s->mix, j), w);
        }
    if (all)
        fprintf(f, "  %s\n", CLI_WIDEN_NOTE);
}

void cli_state_json_header(const cli_state *s, cli_json *j)
{
    size_t i;
    cli_json_array_begin(j, "species");
    for (i = 0; i < s->n; i++)
        cli_json_string(j, NULL, mcd_mixture_name(s->mix, i));
    cli_json_array_end(j);
    cli_json_number(j, "T", s->T);
    cli_json_number(j, "P", s->P);
    cli_json_number(j, "c", s->c);
    cli_json_numbers(j, "M", s->M, s->n);
    cli_json_numbers(j, "mole_fractions", s->x, s->n);
    cli_json_numbers(j, "mass_fractions", s->w, s->n);
    cli_json_string(j, "basis",
                    s->out_basis == MCD_BASIS_MOLE ? "mole" : "mass");
}

void cli_state_json_binaries(const cli_state *s, cli_json *j)
{
    size_t i, k, n = s->n;
    unsigned all = 0, b;
    cli_json_array_begin(j, "binary_D");
    for (i = 0; i < n; i++)
        cli_json_numbers(j, NULL, s->Dij + i * n, n);
    cli_json_array_end(j);
    cli_json_array_begin(j, "binary_typical_error");
    for (i = 0; i < n; i++) {
        double row[MCD_MAX_SPECIES];
        for (k = 0; k < n; k++)
            row[k] = i == k ? (double)NAN : pair_error(s, i, k);
        cli_json_numbers(j, NULL, row, n);
    }
    cli_json_array_end(j);
    cli_json_array_begin(j, "binary_published_error");
    for (i = 0; i < n; i++) {
        double row[MCD_MAX_SPECIES];
        for (k = 0; k < n; k++)
            row[k] = i == k ? (double)NAN : s->rel_err[i * n + k];
        cli_json_numbers(j, NULL, row, n);
    }
    cli_json_array_end(j);
    cli_json_array_begin(j, "pair_warnings");
    for (i = 0; i < n; i++)
        for (k = i + 1; k < n; k++) {
            if (s->warn[i * n + k] == 0)
                continue;
            cli_json_object_begin(j, NULL);
            cli_json_array_begin(j, "pair");
            cli_json_string(j, NULL, mcd_mixture_name(s->mix, i));
            cli_json_string(j, NULL, mcd_mixture_name(s->mix, k));
            cli_json_array_end(j);
            cli_json_array_begin(j, "warnings");
            for (b = 1; b != 0 && b <= s->warn[i * n + k]; b <<= 1)
                if (s->warn[i * n + k] & b)
                    cli_json_string(j, NULL, mcd_warning_string(b));
            cli_json_array_end(j);
            cli_json_object_end(j);
        }
    cli_json_array_end(j);
    cli_json_array_begin(j, "binary_source");
    for (i = 0; i < n; i++) {
        cli_json_array_begin(j, NULL);
        for (k = 0; k < n; k++) {
            if (i == k)
                cli_json_null(j, NULL);
            else
                cli_json_string(j, NULL, pair_source(s, i, k));
            all |= s->warn[i * n + k];
        }
        cli_json_array_end(j);
    }
    cli_json_array_end(j);
    cli_json_array_begin(j, "warnings");
    for (b = 1; b != 0 && b <= all; b <<= 1)
        if (all & b)
            cli_json_string(j, NULL, mcd_warning_string(b));
    cli_json_array_end(j);
    cli_json_array_begin(j, "input_warnings");
    for (k = 0; k < s->n_notes; k++)
        cli_json_string(j, NULL, s->notes[k]);
    cli_json_array_end(j);
}
