/* binary_db.c - binary diffusivities of species taken from a database, with
 * the method's typical error and warning bits.
 *
 * Species parameters are read only through the public mcd_db_* calls into a
 * small copy (mcdi_spec) that mixture.c also keeps, so that the database
 * route and the mixture route run the same code. No allocation.
 *
 * Missing Lennard-Jones parameters are estimated with the rules used by
 * Wilke and Lee (1955) (Poling, Prausnitz and O'Connell 2001, eqs. 11-4.2
 * and 11-4.3): sigma [A] = 1.18 Vb^(1/3) (Vb in cm^3/mol at the normal
 * boiling point), eps/k = 1.15 Tb; the result is flagged
 * MCD_WARN_ESTIMATED_PARAM.
 *
 * Warning rules (documented; the thresholds are common practice, not a
 * published criterion):
 *  HIGH_PRESSURE  P > 1 MPa (10 bar), or P above 0.3 times the mean critical
 *                 pressure of the pair when both Pc are known: the
 *                 low-pressure laws (D P constant) start to fail as the
 *                 reduced pressure grows (Takahashi's 1974 chart shows a
 *                 few percent by Pr ~ 0.3-0.5 at moderate Tr; from memory).
 *  POLAR          dipole moment of either species above 1 debye. Not set
 *                 on Brokaw's estimate, which corrects for the dipole: for
 *                 such pairs it is the method to prefer
 *                 (mcdi_pair_recommended picks it when the pair is polar
 *                 by this rule and has its data).
 *  TEMPERATURE    FSG: T outside 200..1100 K, roughly the span of the
 *                 1966 data set (common practice); Chapman-Enskog,
 *                 Wilke-Lee and Brokaw: T* = T/eps_AB outside the 0.3..100
 *                 fit range of the Neufeld et al. collision integral;
 *                 Wilke-Chang: T
 *                 outside 273.15..373.15 K or at or above the solvent's
 *                 normal boiling point (common practice).
 *  QUANTUM        H2, D2 or He in the pair and T < 100 K (common practice).
 *  ASSOCIATING    water, HF, NH3, alcohols, acids, amines (name or formula
 *                 rules in mcdi_classify) or an association factor > 1.
 *  ESTIMATED_PARAM  sigma or eps/k estimated as above; Wilke-Chang
 *                 association factor missing (1.0 used).
 */
#include <ctype.h>
#include <string.h>

#include "base/mcd_internal.h"
#include "base/checks.h"
#include "props/binary.h"

static int has(const mcdi_spec *s, mcd_param p)
{
    return (s->known >> (unsigned)p) & 1u;
}

static int lower_eq(const char *a, const char *b)
{
    for (; *a && *b; a++, b++)
        if (tolower((unsigned char)*a) != tolower((unsigned char)*b))
            return 0;
    return *a == *b;
}

/* Case-insensitive: does s end with suffix? */
static int ends_with(const char *s, const char *suffix)
{
    size_t n = strlen(s), m = strlen(suffix);
    return n >= m && lower_eq(s + n - m, suffix);
}

static int contains_nocase(const char *s, const char *needle)
{
    size_t m = strlen(needle);
    for (; *s; s++) {
        size_t k = 0;
        while (k < m && s[k] &&
               tolower((unsigned char)s[k]) ==
                   tolower((unsigned char)needle[k]))
            k++;
        if (k == m)
            return 1;
    }
    return 0;
}

unsigned mcdi_classify(const char *name, const char *formula, double assoc)
{
    static const char *const quantum[] = {"H2", "D2", "He", "T2", "HD"};
    static const char *const quantum_names[] = {"hydrogen", "deuterium",
                                                "helium", "helium-4"};
    static const char *const assoc_formulas[] = {"H2O", "D2O",  "HF",
                                                 "NH3", "H2O2", "N2H4"};
    unsigned cls = 0;
    if (formula != NULL) {
        for (size_t k = 0; k < sizeof quantum / sizeof quantum[0]; k++)
            if (strcmp(formula, quantum[k]) == 0)
                cls |= MCDI_CLS_QUANTUM;
        for (size_t k = 0; k < sizeof assoc_formulas / sizeof assoc_formulas[0];
             k++)
            if (strcmp(formula, assoc_formulas[k]) == 0)
                cls |= MCDI_CLS_ASSOC;
        /* Hydroxyl (alcohols, acids COOH, phenols) or amino groups written
         * as such in a condensed formula. Case-sensitive on purpose: "OH"
         * is oxygen + hydrogen, while "Oh" is no element pair. */
        if (strstr(formula, "OH") != NULL || strstr(formula, "NH2") != NULL)
            cls |= MCDI_CLS_ASSOC;
    }
    if (name != NULL) {
        for (size_t k = 0; k < sizeof quantum_names / sizeof quantum_names[0];
             k++)
            if (lower_eq(name, quantum_names[k]))
                cls |= MCDI_CLS_QUANTUM;
        if (lower_eq(name, "water") || lower_eq(name, "ammonia") ||
            lower_eq(name, "hydrogen-fluoride") || ends_with(name, "ol") ||
            contains_nocase(name, "acid") || ends_with(name, "amine"))
            cls |= MCDI_CLS_ASSOC;
    }
    if (assoc > 1.0)
        cls |= MCDI_CLS_ASSOC;
    return cls;
}

mcd_status mcdi_spec_from_db(const mcd_db *db, size_t i, mcdi_spec *out)
{
    mcdi_spec s;
    const char *name;
    if (db == NULL || out == NULL)
        return MCD_EINVAL;
    if (i >= mcd_db_species_count(db))
        return mcdi_fail(MCD_ENOTFOUND,
                         "species index %zu is not in the database (%zu "
                         "species)",
                         i, mcd_db_species_count(db));
    memset(&s, 0, sizeof s);
    for (int p = 0; p < MCD_PARAM_COUNT; p++) {
        double v;
        if (mcdi_api_db_param(db, i, (mcd_param)p, &v) == MCD_OK &&
            mcdi_finite(v)) {
            s.p[p] = v;
            s.known |= 1u << (unsigned)p;
        }
    }
    mcdi_err_clear(); /* unknown parameters are normal here */
    name = mcd_db_name(db, i);
    if (name != NULL) {
        strncpy(s.name, name, sizeof s.name - 1);
        s.name[sizeof s.name - 1] = '\0';
    }
    s.cls =
        mcdi_classify(name, mcd_db_formula(db, i),
                      has(&s, MCD_PARAM_ASSOC) ? s.p[MCD_PARAM_ASSOC] : -1.0);
    *out = s;
    return MCD_OK;
}

/* ENODATA with a detail naming the species, the parameter and the method
 * that needs it. */
static mcd_status missing(const mcdi_spec *s, const char *what, mcd_method m)
{
    return mcdi_fail(MCD_ENODATA, "species '%s' has no %s (needed by %s)",
                     s->name, what, mcd_method_name(m));
}

/* Lennard-Jones parameters of one species, tabulated or estimated from the
 * boiling point (Wilke-Lee rules) for method m. Fails: ENODATA. */
mcd_status mcdi_lj_params(const mcdi_spec *s, mcd_method m, double *sig,
                          double *eps, int *estimated)
{
    if (has(s, MCD_PARAM_LJ_SIGMA) && s->p[MCD_PARAM_LJ_SIGMA] > 0) {
        *sig = s->p[MCD_PARAM_LJ_SIGMA];
    } else if (has(s, MCD_PARAM_VB) && s->p[MCD_PARAM_VB] > 0) {
        /* sigma [A] = 1.18 (Vb [cm^3/mol])^(1/3) */
        *sig = 1.18e-10 * cbrt(1e6 * s->p[MCD_PARAM_VB]);
        *estimated = 1;
    } else {
        return missing(s, "Lennard-Jones sigma nor a molar volume Vb", m);
    }
    if (has(s, MCD_PARAM_LJ_EPS_K) && s->p[MCD_PARAM_LJ_EPS_K] > 0) {
        *eps = s->p[MCD_PARAM_LJ_EPS_K];
    } else if (has(s, MCD_PARAM_TB) && s->p[MCD_PARAM_TB] > 0) {
        *eps = 1.15 * s->p[MCD_PARAM_TB]; /* eps/k = 1.15 Tb */
        *estimated = 1;
    } else {
        return missing(s, "Lennard-Jones epsilon/k nor a boiling point Tb", m);
    }
    return MCD_OK;
}

/* Brokaw's parameters {delta, sigma, eps/k} of one species from its
 * dipole, Vb and Tb (binary.c). Fails: ENODATA naming what is missing. */
static mcd_status brokaw_params(const mcdi_spec *s, double out[3])
{
    static const struct {
        mcd_param p;
        const char *what;
    } need[] = {
        {MCD_PARAM_MOLAR_MASS, "molar mass"},
        {MCD_PARAM_DIPOLE, "dipole moment"},
        {MCD_PARAM_VB, "molar volume at the boiling point (Vb)"},
        {MCD_PARAM_TB, "normal boiling point (Tb)"},
    };
    for (size_t k = 0; k < sizeof need / sizeof need[0]; k++)
        if (!has(s, need[k].p) ||
            !(s->p[need[k].p] > 0 || need[k].p == MCD_PARAM_DIPOLE))
            return missing(s, need[k].what, MCD_METHOD_BROKAW);
    mcdi_brokaw_params(s->p[MCD_PARAM_DIPOLE], s->p[MCD_PARAM_VB],
                       s->p[MCD_PARAM_TB], &out[0], &out[1], &out[2]);
    return MCD_OK;
}

/* Brokaw's pair coefficients (binary.c, mcdi_brokaw_d): the
 * Chapman-Enskog constant with sigma_AB = (sigma_A sigma_B)^(1/2) for both
 * species, eps_AB = (eps_A eps_B)^(1/2), delta_AB = (delta_A
 * delta_B)^(1/2). Fails: ENODATA naming the species and parameter. */
static mcd_status brokaw_coef(const mcdi_spec *a, const mcdi_spec *b,
                              double *out_coef, double *out_eps_ab,
                              double *out_delta_ab)
{
    double pa[3], pb[3], sig;
    mcd_status st;
    if ((st = brokaw_params(a, pa)) != MCD_OK ||
        (st = brokaw_params(b, pb)) != MCD_OK)
        return st;
    sig = sqrt(pa[1] * pb[1]);
    *out_coef = mcdi_ce_coef(a->p[MCD_PARAM_MOLAR_MASS],
                             b->p[MCD_PARAM_MOLAR_MASS], sig, sig);
    *out_eps_ab = sqrt(pa[2] * pb[2]);
    *out_delta_ab = sqrt(pa[0] * pb[0]);
    return MCD_OK;
}

mcd_status mcdi_pair_coef(const mcdi_spec *a, const mcdi_spec *b, mcd_method m,
                          double *out_coef, double *out_eps_ab,
                          double *out_delta_ab, int *out_estimated)
{
    double sa, sb, ea, eb;
    int est = 0;
    mcd_status st;
    if (m != MCD_METHOD_FSG && m != MCD_METHOD_CHAPMAN_ENSKOG &&
        m != MCD_METHOD_WILKE_LEE && m != MCD_METHOD_BROKAW)
        return MCD_EINVAL;
    *out_delta_ab = 0.0;
    *out_estimated = 0;
    if (m == MCD_METHOD_BROKAW) {
        if ((st = brokaw_coef(a, b, out_coef, out_eps_ab, out_delta_ab)) !=
            MCD_OK)
            return st;
        if (!(*out_coef > 0.0) || !mcdi_finite(*out_coef) ||
            !(*out_eps_ab > 0.0) || !mcdi_finite(*out_eps_ab))
            return MCD_EDOM; /* extreme user parameters */
        return MCD_OK;
    }
    if (!has(a, MCD_PARAM_MOLAR_MASS) || !(a->p[MCD_PARAM_MOLAR_MASS] > 0))
        return missing(a, "molar mass", m);
    if (!has(b, MCD_PARAM_MOLAR_MASS) || !(b->p[MCD_PARAM_MOLAR_MASS] > 0))
        return missing(b, "molar mass", m);
    if (m == MCD_METHOD_FSG) {
        if (!has(a, MCD_PARAM_DIFF_VOLUME) ||
            !(a->p[MCD_PARAM_DIFF_VOLUME] > 0))
            return missing(a, "diffusion volume", m);
        if (!has(b, MCD_PARAM_DIFF_VOLUME) ||
            !(b->p[MCD_PARAM_DIFF_VOLUME] > 0))
            return missing(b, "diffusion volume", m);
        *out_coef = mcdi_fsg_coef(
            a->p[MCD_PARAM_MOLAR_MASS], b->p[MCD_PARAM_MOLAR_MASS],
            a->p[MCD_PARAM_DIFF_VOLUME], b->p[MCD_PARAM_DIFF_VOLUME]);
        *out_eps_ab = 0.0;
        *out_estimated = 0;
        return MCD_OK;
    }
    if ((st = mcdi_lj_params(a, m, &sa, &ea, &est)) != MCD_OK)
        return st;
    if ((st = mcdi_lj_params(b, m, &sb, &eb, &est)) != MCD_OK)
        return st;
    if (m == MCD_METHOD_CHAPMAN_ENSKOG)
        *out_coef = mcdi_ce_coef(a->p[MCD_PARAM_MOLAR_MASS],
                                 b->p[MCD_PARAM_MOLAR_MASS], sa, sb);
    else
        *out_coef = mcdi_wl_coef(a->p[MCD_PARAM_MOLAR_MASS],
                                 b->p[MCD_PARAM_MOLAR_MASS], sa, sb);
    /* Wilke-Lee's factor 3.03 - 0.98/M_AB^(1/2) is negative below
     * M_AB = 0.105 g/mol (no real pair; reachable through user molar
     * masses): outside the correlation's domain. */
    if (!(*out_coef > 0.0) || !mcdi_finite(*out_coef))
        return MCD_EDOM;
    *out_eps_ab = sqrt(ea * eb);
    *out_estimated = est;
    return MCD_OK;
}

int mcdi_pair_polar(const mcdi_spec *a, const mcdi_spec *b)
{
    return (has(a, MCD_PARAM_DIPOLE) && a->p[MCD_PARAM_DIPOLE] > MCDI_DEBYE) ||
           (has(b, MCD_PARAM_DIPOLE) && b->p[MCD_PARAM_DIPOLE] > MCDI_DEBYE);
}

/* The recommendation rule (binary.h). Brokaw's correction is meant for
 * polar pairs (Brokaw 1969; the POLAR flag of the other methods says where
 * they are least reliable); otherwise the order is the CLI's `binary`
 * order, FSG first (its published average error is the smallest of the
 * three, see mcd_method_typical_error). */
mcd_method mcdi_pair_recommended(const mcdi_spec *a, const mcdi_spec *b)
{
    static const mcd_method order[] = {
        MCD_METHOD_FSG, MCD_METHOD_CHAPMAN_ENSKOG, MCD_METHOD_WILKE_LEE};
    double coef, eps, delta;
    int est;
    mcd_method pick = MCD_METHOD_FSG;
    if (mcdi_pair_polar(a, b) && mcdi_pair_coef(a, b, MCD_METHOD_BROKAW, &coef,
                                                &eps, &delta, &est) == MCD_OK)
        pick = MCD_METHOD_BROKAW;
    for (size_t k = 0;
         pick != MCD_METHOD_BROKAW && k < sizeof order / sizeof order[0]; k++)
        if (mcdi_pair_coef(a, b, order[k], &coef, &eps, &delta, &est) ==
            MCD_OK) {
            pick = order[k];
            break;
        }
    mcdi_err_clear(); /* a method without data is no failure here */
    return pick;
}

unsigned mcdi_pair_state_warnings(const mcdi_spec *a, const mcdi_spec *b,
                                  double T, double P)
{
    unsigned w = 0;
    if (P > MCDI_HIGH_P)
        w |= MCD_WARN_HIGH_PRESSURE;
    if (has(a, MCD_PARAM_PC) && has(b, MCD_PARAM_PC) &&
        P > MCDI_HIGH_P_REDUCED * 0.5 *
                (a->p[MCD_PARAM_PC] + b->p[MCD_PARAM_PC]))
        w |= MCD_WARN_HIGH_PRESSURE;
    if (mcdi_pair_polar(a, b))
        w |= MCD_WARN_POLAR;
    if (((a->cls | b->cls) & MCDI_CLS_QUANTUM) && T < MCDI_QUANTUM_T)
        w |= MCD_WARN_QUANTUM;
    if ((a->cls | b->cls) & MCDI_CLS_ASSOC)
        w |= MCD_WARN_ASSOCIATING;
    return w;
}

mcd_status mcdi_pair_gas(const mcdi_spec *a, const mcdi_spec *b, mcd_method m,
                         double T, double P, double *out_D, double *out_rel_err,
                         unsigned *out_warn)
{
    double coef, eps_ab, delta_ab, D;
    int est;
    unsigned w;
    mcd_status st;
    if (a == NULL || b == NULL || out_D == NULL)
        return MCD_EINVAL;
    if (!mcdi_finite(T) || !mcdi_finite(P))
        return MCD_EINVAL;
    if (!(T > 0) || !(P > 0))
        return MCD_EDOM;
    w = mcdi_pair_state_warnings(a, b, T, P);
    if ((st = mcdi_pair_coef(a, b, m, &coef, &eps_ab, &delta_ab, &est)) !=
        MCD_OK)
        return st;
    if (est)
        w |= MCD_WARN_ESTIMATED_PARAM;
    if (m == MCD_METHOD_FSG) {
        D = coef * pow(T, 1.75) / P;
        if (T < MCDI_FSG_T_MIN || T > MCDI_FSG_T_MAX)
            w |= MCD_WARN_TEMPERATURE;
    } else {
        double Ts = T / eps_ab;
        /* Brokaw's estimate corrects for the dipole: no POLAR flag. */
        if (m == MCD_METHOD_BROKAW) {
            D = coef * pow(T, 1.5) / (P * mcdi_brokaw_omega(Ts, delta_ab));
            w &= ~MCD_WARN_POLAR;
        } else {
            D = coef * pow(T, 1.5) / (P * mcdi_omega_d(Ts));
        }
        if (Ts < MCDI_TSTAR_MIN || Ts > MCDI_TSTAR_MAX)
            w |= MCD_WARN_TEMPERATURE;
    }
    if (!(D > 0.0) || !mcdi_finite(D))
        return MCD_EDOM; /* overflow or underflow at an extreme state */
    *out_D = D;
    if (out_rel_err != NULL)
        *out_rel_err = mcd_method_typical_error(m);
    if (out_warn != NULL)
        *out_warn = w;
    return MCD_OK;
}

mcd_status mcdi_api_db_binary_gas(const mcd_db *db, size_t a, size_t b,
                                  mcd_gas_method gas, double T, double P,
                                  double *out_D, double *out_rel_err,
                                  unsigned *out_warn)
{
    mcd_method method = (mcd_method)gas;
    mcdi_spec sa, sb;
    mcd_status st;
    if ((st = MCDI_CHECK_PTRS2(db, out_D)) != MCD_OK ||
        (st = mcdi_check_positive2(T, "T", P, "P")) != MCD_OK)
        return st;
    if (method != MCD_METHOD_FSG && method != MCD_METHOD_CHAPMAN_ENSKOG &&
        method != MCD_METHOD_WILKE_LEE && method != MCD_METHOD_BROKAW)
        return mcdi_fail(MCD_EINVAL,
                         "argument method: %d is not a gas method of a "
                         "database pair (fsg, chapman-enskog, wilke-lee, "
                         "brokaw; recommended is for mixtures)",
                         (int)method);
    if ((st = mcdi_spec_from_db(db, a, &sa)) != MCD_OK)
        return st;
    if ((st = mcdi_spec_from_db(db, b, &sb)) != MCD_OK)
        return st;
    return mcdi_pair_gas(&sa, &sb, method, T, P, out_D, out_rel_err, out_warn);
}

mcd_status mcdi_api_db_binary_liquid(const mcd_db *db, size_t solute,
                                     size_t solvent, double T,
                                     double mu_solvent, double *out_D,
                                     double *out_rel_err, unsigned *out_warn)
{
    mcdi_spec sa, sb;
    mcd_status st;
    double phi = 1.0, D;
    unsigned w = 0;
    if ((st = MCDI_CHECK_PTRS2(db, out_D)) != MCD_OK ||
        (st = mcdi_check_positive2(T, "T", mu_solvent, "mu_solvent")) != MCD_OK)
        return st;
    if ((st = mcdi_spec_from_db(db, solute, &sa)) != MCD_OK)
        return st;
    if ((st = mcdi_spec_from_db(db, solvent, &sb)) != MCD_OK)
        return st;
    if (!has(&sa, MCD_PARAM_VB))
        return missing(&sa, "molar volume at the boiling point (Vb)",
                       MCD_METHOD_WILKE_CHANG);
    if (!has(&sb, MCD_PARAM_MOLAR_MASS))
        return missing(&sb, "molar mass", MCD_METHOD_WILKE_CHANG);
    if (has(&sb, MCD_PARAM_ASSOC) && sb.p[MCD_PARAM_ASSOC] > 0)
        phi = sb.p[MCD_PARAM_ASSOC];
    else
        w |= MCD_WARN_ESTIMATED_PARAM;
    st = mcdi_api_binary_wilke_chang(T, mu_solvent, sb.p[MCD_PARAM_MOLAR_MASS],
                                     phi, sa.p[MCD_PARAM_VB], &D);
    if (st != MCD_OK)
        return st == MCD_EINVAL ? MCD_EDOM : st;
    {
        unsigned wr = 0; /* the correlation's range (liquid_range.c) */
        (void)mcdi_api_method_temperature_range(MCD_METHOD_WILKE_CHANG, T, NULL,
                                                NULL, &wr);
        w |= wr; /* T > 0 and finite here: the call cannot fail */
    }
    if (has(&sb, MCD_PARAM_TB) && T >= sb.p[MCD_PARAM_TB])
        w |= MCD_WARN_TEMPERATURE;
    /* Wilke-Chang is least reliable for associating solutes (e.g. water or
     * alcohols in organic solvents); an associating solvent is covered by
     * its association factor. MCD_WARN_POLAR is a gas-model warning (the
     * Lennard-Jones or diffusion-volume picture of a polar molecule) and is
     * not set here: polar solutes are part of Wilke and Chang's data. */
    if (sa.cls & MCDI_CLS_ASSOC)
        w |= MCD_WARN_ASSOCIATING;
    *out_D = D;
    if (out_rel_err != NULL)
        *out_rel_err = mcd_method_typical_error(MCD_METHOD_WILKE_CHANG);
    if (out_warn != NULL)
        *out_warn = w;
    return MCD_OK;
}
