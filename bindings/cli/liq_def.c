/* liq_def.c - the definition of a liquid of `mcdiff liquid`: the
 * command-line options added to what the parameter file gave (a value
 * given twice is an error naming the file line and the option), the check
 * that every parameter the model needs is there, and the mcd_liquid.
 */
#include <math.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>
#include "liq.h"

static const char *const model_names[4] = {"ideal", "nrtl", "wilson",
                                           "uniquac"};

const char *liq_model_name(int model)
{
    return model >= 0 && model < 4 ? model_names[model] : "?";
}

int liq_model_from_name(const char *name)
{
    for (int k = 0; k < 4; k++)
        if (strcmp(name, model_names[k]) == 0)
            return k;
    return -1;
}

void liq_def_init(liq_def *d)
{
    size_t i, j;
    memset(d, 0, sizeof *d);
    d->model = -1;
    for (i = 0; i < LIQ_MAX; i++) {
        d->M[i] = (double)NAN;
        for (j = 0; j < LIQ_MAX; j++)
            d->pair[i][j].alpha = (double)NAN;
    }
}

const char *liq_origin_text(const liq_def *d, liq_origin at, const char *option,
                            char *buf, size_t len)
{
    if (at > 0)
        snprintf(buf, len, "%s:%d", d->file ? d->file : "?", at);
    else
        snprintf(buf, len, "%s", option);
    return buf;
}

long liq_def_species(const liq_def *d, const char *token)
{
    size_t i;
    if (cli_is_plain_number(token)) {
        char *end;
        long k = strtol(token, &end, 10);
        if (*end == '\0' && k >= 1 && (size_t)k <= d->n)
            return k - 1;
        return -1;
    }
    for (i = 0; d->named && i < d->n; i++)
        if (strcmp(d->names[i], token) == 0)
            return (long)i;
    return -1;
}

const char *liq_def_name(const liq_def *d, size_t i, char *buf, size_t len)
{
    if (d->named)
        return d->names[i];
    snprintf(buf, len, "%u", (unsigned)(i + 1) & 0xffffu);
    return buf;
}

/* "FILE line K gives it already; give it once" for an option. */
static int twice(const liq_def *d, const char *cmd, const char *opt,
                 liq_origin at, const char *what)
{
    char o[300];
    return cli_usage_error(cmd, opt, "%s is already given (%s); give it once",
                           what, liq_origin_text(d, at, opt, o, sizeof o));
}

int liq_def_species_option(liq_def *d, const char *cmd, const char *opt,
                           const char *list)
{
    char buf[LIQ_MAX * LIQ_NAME], *w[LIQ_MAX + 1];
    int n, i;
    if (d->n > 0 && d->named)
        return twice(d, cmd, opt, d->n_at, "the species list");
    if (strlen(list) >= sizeof buf ||
        (n = cli_split_words(strcpy(buf, list), w, LIQ_MAX + 1)) < 1 ||
        n > LIQ_MAX)
        return cli_usage_error(
            cmd, opt, "expected 1 to %d comma-separated names", LIQ_MAX);
    for (i = 0; i < n; i++) {
        if (strlen(w[i]) >= LIQ_NAME || cli_is_plain_number(w[i]))
            return cli_usage_error(cmd, opt, "'%s' is not a usable name", w[i]);
        for (int k = 0; k < i; k++)
            if (strcmp(w[k], w[i]) == 0)
                return cli_usage_error(cmd, opt, "species '%s' listed twice",
                                       w[i]);
        strcpy(d->names[i], w[i]);
    }
    d->n = (size_t)n;
    d->named = 1;
    d->n_at = LIQ_FROM_CLI;
    return CLI_OK;
}

int liq_def_model_option(liq_def *d, const char *cmd, const char *opt,
                         const char *name)
{
    int m = liq_model_from_name(name);
    char o[300];
    if (m < 0)
        return cli_usage_error(cmd, opt,
                               "unknown model '%s' (ideal, nrtl, wilson, "
                               "uniquac)",
                               name);
    if (d->model_at > 0 && d->model != m)
        return cli_usage_error(
            cmd, opt, "'%s' conflicts with model %s of %s", name,
            liq_model_name(d->model),
            liq_origin_text(d, d->model_at, opt, o, sizeof o));
    d->model = m;
    if (d->model_at == 0)
        d->model_at = LIQ_FROM_CLI;
    return CLI_OK;
}

/* "I:J=rest" or "I=rest" (want_j 0) with species numbers or names; the
 * text after '=' or NULL. */
static const char *parse_ref(const liq_def *d, const char *s, int want_j,
                             size_t *i, size_t *j)
{
    char buf[2 * LIQ_NAME + 4], *colon;
    long a, b = 0;
    const char *e = strchr(s, '=');
    if (!e || (size_t)(e - s) >= sizeof buf)
        return NULL;
    memcpy(buf, s, (size_t)(e - s));
    buf[e - s] = '\0';
    colon = strchr(buf, ':');
    if ((colon != NULL) != (want_j != 0))
        return NULL;
    if (colon) {
        *colon = '\0';
        if ((b = liq_def_species(d, colon + 1)) < 0)
            return NULL;
    }
    if ((a = liq_def_species(d, buf)) < 0 || (want_j && a == b))
        return NULL;
    *i = (size_t)a;
    *j = (size_t)b;
    return e + 1;
}

int liq_def_pair_option(liq_def *d, const char *cmd, const char *text)
{
    double v[8];
    size_t i, j, m, f;
    char why[200], nb[2][16];
    const char *t = parse_ref(d, text, 1, &i, &j);
    liq_pair *p;
    if (t == NULL || cli_parse_list(t, v, 8, &m, why, sizeof why) != 0 ||
        (m != 6 && m != 7))
        return cli_usage_error(cmd, "--pair",
                               "'%s' is not I:J=A,B,E,A',B',E'[,ALPHA] with "
                               "species 1..%zu%s",
                               text, d->n, d->named ? " or their names" : "");
    p = &d->pair[i < j ? i : j][i < j ? j : i];
    if (p->at != 0) {
        char what[200];
        snprintf(what, sizeof what, "pair %s/%s",
                 liq_def_name(d, i, nb[0], sizeof nb[0]),
                 liq_def_name(d, j, nb[1], sizeof nb[1]));
        return twice(d, cmd, "--pair", p->at, what);
    }
    for (f = 0; f < 3; f++) {
        p->coef_ij[f] = i < j ? v[f] : v[3 + f];
        p->coef_ji[f] = i < j ? v[3 + f] : v[f];
    }
    p->alpha = m == 7 ? v[6] : 0.3;
    p->at = LIQ_FROM_CLI;
    return CLI_OK;
}

int liq_def_dinf_option(liq_def *d, const char *cmd, const char *text)
{
    char buf[128], why[200], *comma, nb[2][16];
    size_t i, j;
    double D1, D2;
    const char *t = parse_ref(d, text, 1, &i, &j);
    liq_origin *at;
    if (t == NULL || strlen(t) >= sizeof buf ||
        !(comma = strchr(strcpy(buf, t), ',')))
        return cli_usage_error(cmd, "--dinf", "'%s' is not I:J=D1,D2", text);
    *comma = '\0';
    if (cli_parse_diffusivity(buf, &D1, why, sizeof why) != 0 ||
        cli_parse_diffusivity(comma + 1, &D2, why, sizeof why) != 0)
        return cli_usage_error(cmd, "--dinf", "'%s': %s", text, why);
    at = &d->dinf_at[i < j ? i : j][i < j ? j : i];
    if (*at != 0) {
        char what[200];
        snprintf(what, sizeof what, "the infinite-dilution pair %s/%s",
                 liq_def_name(d, i, nb[0], sizeof nb[0]),
                 liq_def_name(d, j, nb[1], sizeof nb[1]));
        return twice(d, cmd, "--dinf", *at, what);
    }
    d->dinf[i][j] = D1;
    d->dinf[j][i] = D2;
    *at = LIQ_FROM_CLI;
    return CLI_OK;
}

int liq_def_antoine_option(liq_def *d, const char *cmd, const char *text)
{
    double v[8];
    size_t i, j, m;
    char why[200], nb[16];
    const char *t = parse_ref(d, text, 0, &i, &j);
    liq_antoine *a;
    if (t == NULL || cli_parse_list(t, v, 8, &m, why, sizeof why) != 0 ||
        m != 5)
        return cli_usage_error(cmd, "--antoine",
                               "'%s' is not I=A,B,C,TMIN,TMAX", text);
    a = &d->ant[i];
    if (a->at != 0) {
        char what[200];
        snprintf(what, sizeof what, "Antoine constants of %s",
                 liq_def_name(d, i, nb, sizeof nb));
        return twice(d, cmd, "--antoine", a->at, what);
    }
    a->A = v[0];
    a->B = v[1];
    a->C = v[2];
    a->T_min = v[3];
    a->T_max = v[4];
    snprintf(a->source, sizeof a->source, "--antoine");
    a->at = LIQ_FROM_CLI;
    return CLI_OK;
}

int liq_def_species_list_option(liq_def *d, const char *cmd, const char *opt,
                                int which, const char *list)
{
    double v[LIQ_MAX];
    size_t m, i;
    char why[200], nb[16], what[200];
    if (cli_parse_list(list, v, LIQ_MAX, &m, why, sizeof why) != 0)
        return cli_usage_error(cmd, opt, "%s", why);
    if (m != d->n)
        return cli_usage_error(cmd, opt, "need %zu numbers, one per species",
                               d->n);
    for (i = 0; i < m; i++) {
        if (d->sp_at[which][i] != 0) {
            snprintf(what, sizeof what, "the value of species %s",
                     liq_def_name(d, i, nb, sizeof nb));
            return twice(d, cmd, opt, d->sp_at[which][i], what);
        }
        d->sp[which][i] = v[i];
        d->sp_at[which][i] = LIQ_FROM_CLI;
    }
    return CLI_OK;
}

int liq_def_have_dinf(const liq_def *d)
{
    for (size_t i = 0; i < d->n; i++)
        for (size_t j = i + 1; j < d->n; j++)
            if (d->dinf_at[i][j] == 0)
                return 0;
    return d->n > 1;
}

int liq_def_have_antoine(const liq_def *d)
{
    for (size_t i = 0; i < d->n; i++)
        if (d->ant[i].at != 0)
            return 1;
    return 0;
}

/* Where to give a missing value: "a 'pair' record in FILE or --pair". */
static const char *where(const liq_def *d, const char *rec, const char *opt,
                         char *buf, size_t len)
{
    if (d->file)
        snprintf(buf, len, "a '%s' record in %s or %s", rec, d->file, opt);
    else
        snprintf(buf, len, "%s", opt);
    return buf;
}

int liq_def_check(const liq_def *d, const char *cmd, int need_d)
{
    static const char *const sp_name[3] = {"molar volume V", "UNIQUAC r",
                                           "UNIQUAC q"};
    static const char *const sp_opt[3] = {"--volumes", "--uniquac-r",
                                          "--uniquac-q"};
    size_t i, j, k;
    char nb[2][16], w[400], o[300];
    const char *mname = liq_model_name(d->model);
    for (i = 0; i < d->n && d->model != MCD_ACTIVITY_IDEAL; i++)
        for (j = i + 1; j < d->n; j++) {
            const liq_pair *p = &d->pair[i][j];
            if (p->at == 0)
                return cli_usage_error(cmd, d->file ? d->file : "--pair",
                                       "pair %s/%s: no %s parameters (give %s)",
                                       liq_def_name(d, i, nb[0], sizeof nb[0]),
                                       liq_def_name(d, j, nb[1], sizeof nb[1]),
                                       mname,
                                       where(d, "pair", "--pair", w, sizeof w));
            if (d->model == MCD_ACTIVITY_NRTL && isnan(p->alpha))
                return cli_usage_error(
                    cmd, liq_origin_text(d, p->at, "--pair", o, sizeof o),
                    "pair %s/%s: field alpha is required by the nrtl model",
                    liq_def_name(d, i, nb[0], sizeof nb[0]),
                    liq_def_name(d, j, nb[1], sizeof nb[1]));
        }
    for (k = 0; k < 3; k++) {
        int need = (d->model == MCD_ACTIVITY_WILSON && k == 0) ||
                   (d->model == MCD_ACTIVITY_UNIQUAC && k > 0);
        for (i = 0; need && i < d->n; i++)
            if (d->sp_at[k][i] == 0)
                return cli_usage_error(
                    cmd, d->file ? d->file : sp_opt[k],
                    "species %s: no %s (the %s model needs it; give %s)",
                    liq_def_name(d, i, nb[0], sizeof nb[0]), sp_name[k], mname,
                    where(d, "species", sp_opt[k], w, sizeof w));
    }
    for (i = 0; need_d && i < d->n; i++)
        for (j = i + 1; j < d->n; j++)
            if (d->dinf_at[i][j] == 0)
                return cli_usage_error(
                    cmd, d->file ? d->file : "--dinf",
                    "pair %s/%s: no infinite-dilution diffusivities (the "
                    "fluxes need them for every pair; give %s)",
                    liq_def_name(d, i, nb[0], sizeof nb[0]),
                    liq_def_name(d, j, nb[1], sizeof nb[1]),
                    where(d, "dinf", "--dinf", w, sizeof w));
    return CLI_OK;
}

/* A setter's refusal: usage error at the value's origin. */
static int refused(const liq_def *d, const char *cmd, liq_origin at,
                   const char *opt, const char *what)
{
    char o[300];
    return cli_usage_error(cmd, liq_origin_text(d, at, opt, o, sizeof o),
                           "%s: %s", what, mcd_last_error());
}

int liq_def_build(const liq_def *d, const char *cmd, mcd_liquid **out)
{
    static const char *const sp_opt[3] = {"--volumes", "--uniquac-r",
                                          "--uniquac-q"};
    mcd_liquid *liq = NULL;
    mcd_status st;
    size_t i, j, k;
    char nb[2][16], what[200];
    int rc = CLI_OK;
    st = mcd_liquid_new(d->n, (mcd_activity_model)d->model, &liq);
    if (st != MCD_OK)
        return cli_fail(cmd, "creating the liquid", st, mcd_last_error());
    for (k = 0; k < 3 && rc == CLI_OK; k++)
        for (i = 0; i < d->n && rc == CLI_OK; i++)
            if (d->sp_at[k][i] != 0 &&
                mcd_liquid_set_species(liq, i, (mcd_liquid_param)k,
                                       d->sp[k][i]) != MCD_OK)
                rc = refused(d, cmd, d->sp_at[k][i], sp_opt[k], "species");
    for (i = 0; i < d->n && rc == CLI_OK; i++)
        for (j = i + 1; j < d->n && rc == CLI_OK; j++) {
            const liq_pair *p = &d->pair[i][j];
            snprintf(what, sizeof what, "pair %s/%s",
                     liq_def_name(d, i, nb[0], sizeof nb[0]),
                     liq_def_name(d, j, nb[1], sizeof nb[1]));
            if (p->at != 0 && d->model != MCD_ACTIVITY_IDEAL &&
                mcd_liquid_set_pair(liq, i, j, p->coef_ij, p->coef_ji,
                                    isnan(p->alpha) ? 0.3 : p->alpha, p->T_min,
                                    p->T_max) != MCD_OK)
                rc = refused(d, cmd, p->at, "--pair", what);
            if (rc == CLI_OK && d->dinf_at[i][j] != 0 &&
                mcd_liquid_set_dinf(liq, i, j, d->dinf[i][j], d->dinf[j][i]) !=
                    MCD_OK)
                rc = refused(d, cmd, d->dinf_at[i][j], "--dinf", what);
        }
    for (i = 0; i < d->n && rc == CLI_OK; i++) {
        const liq_antoine *a = &d->ant[i];
        snprintf(what, sizeof what, "Antoine constants of %s",
                 liq_def_name(d, i, nb[0], sizeof nb[0]));
        if (a->at != 0 && mcd_liquid_set_antoine(liq, i, a->A, a->B, a->C,
                                                 a->T_min, a->T_max) != MCD_OK)
            rc = refused(d, cmd, a->at, "--antoine", what);
    }
    if (rc != CLI_OK) {
        mcd_liquid_free(liq);
        return rc;
    }
    *out = liq;
    return CLI_OK;
}
