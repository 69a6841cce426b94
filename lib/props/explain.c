/* explain.c - the intermediates behind a binary estimate (for checking it by
 * hand) and the typical error widened by the estimate's warnings.
 *
 * mcd_db_binary_explain runs the same estimating code as mcd_db_binary_gas
 * and mcd_db_binary_liquid (so its D is the same double) and then takes the
 * pieces of the formula apart, from the same species copies and the same
 * private helpers (combining rules, collision integral, Lennard-Jones
 * estimates). Formulas: lib/props/binary.c.
 *
 * Widening rule (mcd_typical_error_widened): a rule of thumb, common
 * practice, not a published law. The published average errors of the
 * methods are averages over validation sets of mostly non-polar gases at
 * low pressure; each warning class that applies says the state is outside
 * that set. Factor 2 for each of high pressure, polar, quantum gas and
 * associating (polar and hydrogen-bonding pairs against measured data show
 * 20-27 % where the published gas averages are 5-8 %: two such classes
 * give the factor 4 seen there); factor 1.5 for each of temperature out of
 * range, estimated parameter and far scaling. Capped at 100 %. No
 * allocation anywhere in this file.
 */
#include <string.h>

#include "base/mcd_internal.h"
#include "base/checks.h"
#include "props/binary.h"

#define WARN_MAJOR                                                             \
    (MCD_WARN_HIGH_PRESSURE | MCD_WARN_POLAR | MCD_WARN_QUANTUM |              \
     MCD_WARN_ASSOCIATING)
#define WARN_MINOR                                                             \
    (MCD_WARN_TEMPERATURE | MCD_WARN_ESTIMATED_PARAM | MCD_WARN_SCALED)

double mcdi_widen_error(double e, unsigned warn)
{
    unsigned b;
    for (b = 1; b <= (WARN_MAJOR | WARN_MINOR); b <<= 1) {
        if (warn & b & WARN_MAJOR)
            e *= MCD_WIDEN_MAJOR;
        else if (warn & b & WARN_MINOR)
            e *= MCD_WIDEN_MINOR;
    }
    return e > MCD_WIDEN_CAP ? MCD_WIDEN_CAP : e;
}

mcd_status mcdi_api_typical_error_widened(mcd_method m, unsigned warn,
                                          double *out_rel_err)
{
    if (out_rel_err == NULL)
        return mcdi_fail(MCD_EINVAL, "argument out_rel_err: is NULL");
    if (mcd_method_name(m) == NULL)
        return mcdi_fail(MCD_EINVAL, "argument m: %d is not a method", (int)m);
    if (warn & ~(unsigned)(WARN_MAJOR | WARN_MINOR))
        return mcdi_fail(MCD_EINVAL,
                         "argument warn: 0x%x holds bits that are no "
                         "MCD_WARN_* bit",
                         warn & ~(unsigned)(WARN_MAJOR | WARN_MINOR));
    *out_rel_err = mcdi_widen_error(mcd_method_typical_error(m), warn);
    return MCD_OK;
}

static int known(const mcdi_spec *s, mcd_param p, double *v)
{
    if (!((s->known >> (unsigned)p) & 1u))
        return 0;
    *v = s->p[p];
    return 1;
}

/* Slots of the gas methods; D, errors and warnings are already set. The
 * estimate succeeded, so every parameter read here exists. */
static void explain_gas(const mcdi_spec *sa, const mcdi_spec *sb, mcd_method m,
                        double T, double *v)
{
    double MA = sa->p[MCD_PARAM_MOLAR_MASS], MB = sb->p[MCD_PARAM_MOLAR_MASS];
    v[MCD_EXPLAIN_M_A] = MA;
    v[MCD_EXPLAIN_M_B] = MB;
    v[MCD_EXPLAIN_M_AB] = 2.0 / (1.0 / MA + 1.0 / MB);
    if (m == MCD_METHOD_FSG) {
        v[MCD_EXPLAIN_V_A] = sa->p[MCD_PARAM_DIFF_VOLUME];
        v[MCD_EXPLAIN_V_B] = sb->p[MCD_PARAM_DIFF_VOLUME];
        v[MCD_EXPLAIN_V_ROOTS] =
            cbrt(v[MCD_EXPLAIN_V_A]) + cbrt(v[MCD_EXPLAIN_V_B]);
    } else if (m == MCD_METHOD_BROKAW) {
        double pa[3], pb[3], dab;
        /* The estimate read the dipole, Vb and Tb of both. */
        mcdi_brokaw_params(sa->p[MCD_PARAM_DIPOLE], sa->p[MCD_PARAM_VB],
                           sa->p[MCD_PARAM_TB], &pa[0], &pa[1], &pa[2]);
        mcdi_brokaw_params(sb->p[MCD_PARAM_DIPOLE], sb->p[MCD_PARAM_VB],
                           sb->p[MCD_PARAM_TB], &pb[0], &pb[1], &pb[2]);
        dab = sqrt(pa[0] * pb[0]);
        v[MCD_EXPLAIN_SIGMA_A] = pa[1];
        v[MCD_EXPLAIN_SIGMA_B] = pb[1];
        v[MCD_EXPLAIN_SIGMA_AB] = sqrt(pa[1] * pb[1]);
        v[MCD_EXPLAIN_EPS_A] = pa[2];
        v[MCD_EXPLAIN_EPS_B] = pb[2];
        v[MCD_EXPLAIN_EPS_AB] = sqrt(pa[2] * pb[2]);
        v[MCD_EXPLAIN_T_STAR] = T / v[MCD_EXPLAIN_EPS_AB];
        v[MCD_EXPLAIN_OMEGA_D] = mcdi_brokaw_omega(v[MCD_EXPLAIN_T_STAR], dab);
        v[MCD_EXPLAIN_DELTA_A] = pa[0];
        v[MCD_EXPLAIN_DELTA_B] = pb[0];
        v[MCD_EXPLAIN_DELTA_AB] = dab;
        v[MCD_EXPLAIN_ESTIMATED] = 0;
    } else {
        double sga, sgb, ea, eb;
        int est = 0;
        /* Cannot fail: the estimate above read the same parameters. */
        (void)mcdi_lj_params(sa, m, &sga, &ea, &est);
        (void)mcdi_lj_params(sb, m, &sgb, &eb, &est);
        v[MCD_EXPLAIN_SIGMA_A] = sga;
        v[MCD_EXPLAIN_SIGMA_B] = sgb;
        v[MCD_EXPLAIN_SIGMA_AB] = 0.5 * (sga + sgb);
        v[MCD_EXPLAIN_EPS_A] = ea;
        v[MCD_EXPLAIN_EPS_B] = eb;
        v[MCD_EXPLAIN_EPS_AB] = sqrt(ea * eb);
        v[MCD_EXPLAIN_T_STAR] = T / v[MCD_EXPLAIN_EPS_AB];
        v[MCD_EXPLAIN_OMEGA_D] = mcdi_omega_d(v[MCD_EXPLAIN_T_STAR]);
        v[MCD_EXPLAIN_ESTIMATED] = est;
        if (m == MCD_METHOD_WILKE_LEE)
            v[MCD_EXPLAIN_WL_FACTOR] =
                3.03 - 0.98 / sqrt(1000.0 * v[MCD_EXPLAIN_M_AB]);
    }
}

/* Slots of Wilke-Chang (a solute, b solvent), as mcd_db_binary_liquid
 * reads them: phi = 1 when the solvent's association factor is unknown. */
static void explain_liquid(const mcdi_spec *sa, const mcdi_spec *sb, double mu,
                           double *v)
{
    double phi = 1.0, M;
    if (known(sb, MCD_PARAM_ASSOC, &phi) && !(phi > 0))
        phi = 1.0;
    v[MCD_EXPLAIN_PHI] = phi;
    v[MCD_EXPLAIN_M_B] = sb->p[MCD_PARAM_MOLAR_MASS];
    if (known(sa, MCD_PARAM_MOLAR_MASS, &M))
        v[MCD_EXPLAIN_M_A] = M;
    v[MCD_EXPLAIN_MU_B] = mu;
    v[MCD_EXPLAIN_VB_A] = sa->p[MCD_PARAM_VB];
}

mcd_status mcdi_api_db_binary_explain(const mcd_db *db, size_t a, size_t b,
                                      mcd_method method, double T, double P,
                                      double mu_solvent, double *out_values)
{
    double v[MCD_EXPLAIN_COUNT], D, err, wide;
    unsigned warn = 0;
    mcdi_spec sa, sb;
    mcd_status st;
    if ((st = MCDI_CHECK_PTRS2(db, out_values)) != MCD_OK)
        return st;
    if (method == MCD_METHOD_WILKE_CHANG)
        st =
            mcdi_api_db_binary_liquid(db, a, b, T, mu_solvent, &D, &err, &warn);
    else if (method == MCD_METHOD_FSG || method == MCD_METHOD_CHAPMAN_ENSKOG ||
             method == MCD_METHOD_WILKE_LEE || method == MCD_METHOD_BROKAW)
        st = mcdi_api_db_binary_gas(db, a, b, (mcd_gas_method)method, T, P, &D,
                                    &err, &warn);
    else
        return mcdi_fail(MCD_EINVAL,
                         "argument method: %d is not fsg, chapman-enskog, "
                         "wilke-lee, brokaw or wilke-chang",
                         (int)method);
    if (st != MCD_OK)
        return st;
    /* The estimate read both species, so these copies succeed. */
    if ((st = mcdi_spec_from_db(db, a, &sa)) != MCD_OK ||
        (st = mcdi_spec_from_db(db, b, &sb)) != MCD_OK ||
        (st = mcdi_api_typical_error_widened(method, warn, &wide)) != MCD_OK)
        return st;
    for (size_t k = 0; k < MCD_EXPLAIN_COUNT; k++)
        v[k] = (double)NAN;
    v[MCD_EXPLAIN_D] = D;
    v[MCD_EXPLAIN_T] = T;
    v[MCD_EXPLAIN_REL_ERR] = err;
    v[MCD_EXPLAIN_REL_ERR_WIDENED] = wide;
    v[MCD_EXPLAIN_WARN] = (double)warn;
    if (method == MCD_METHOD_WILKE_CHANG) {
        explain_liquid(&sa, &sb, mu_solvent, v);
    } else {
        v[MCD_EXPLAIN_P] = P;
        explain_gas(&sa, &sb, method, T, v);
    }
    memcpy(out_values, v, sizeof v);
    return MCD_OK;
}
