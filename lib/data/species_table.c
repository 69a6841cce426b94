/* species_table.c - built-in table of gases and vapours.
 *
 * Columns, units as written in the table, and their sources (per-row
 * exceptions are given by the row flags and in the comments):
 *
 *  M [g/mol]   computed from the formula with the IUPAC CIAAW 2021 standard
 *              atomic weights (elements.c), rounded to 0.1 mg/mol. Exceptions:
 *              air, 28.9644 g/mol, mean molar mass of dry air of the U.S.
 *              Standard Atmosphere 1976 (NOAA/NASA/USAF, 1976) (from memory);
 *              deuterium, 2 x 2.01410177812 g/mol, the atomic mass of 2H of
 *              the Atomic Mass Evaluation 2020 (Wang et al., Chin. Phys. C 45
 *              (2021) 030003) (from memory).
 *  V [-]       Fuller-Ensley-Giddings (1969) diffusion volume: flag 'T' =
 *              the tabulated molecular value, 'I' = summed from the atomic
 *              increments (and n_rings ring increments) of fsg_volumes.c.
 *  sigma [A], eps/k [K]
 *              Lennard-Jones 12-6 parameters from viscosity, R. A. Svehla,
 *              NASA Technical Report R-132 (1962), as reprinted in Reid,
 *              Prausnitz and Poling, The Properties of Gases and Liquids,
 *              4th ed. (1987), Appendix B (flag 'S', from memory unless
 *              noted as confirmed in the data-layer report). Flag 'H':
 *              Hirschfelder, Curtiss and Bird, Molecular Theory of Gases and
 *              Liquids (1954), Table I-A (from memory). Flag 'B': not in
 *              those tables; estimated from the critical constants of this
 *              table by Bird, Stewart and Lightfoot, Transport Phenomena,
 *              2nd ed. (2002), eqs. 1.4-11 and 1.4-13:
 *              eps/k = 0.77 Tc,  sigma = 2.44 (Tc/Pc)^(1/3)
 *              (sigma in Angstrom, Tc in K, Pc in atm).
 *  dipole [debye]
 *              Reid, Prausnitz and Poling, 4th ed. (1987), Appendix A
 *              (from memory); 0 for non-polar molecules (symmetry);
 *              1 debye = 3.33564e-30 C m.
 *  Vb [cm^3/mol]
 *              liquid molar volume at the normal boiling point. Flag 'T':
 *              tabulated values of R. E. Treybal, Mass-Transfer Operations,
 *              3rd ed. (1980), Table 2.3 (from memory). Flag 'L': Le Bas
 *              (1915) additive volumes as given by Reid, Prausnitz and
 *              Poling (1987), Table 3-8: C 14.8, H 3.7, O 7.4 (9.9 in ethyl
 *              esters and ethers), Cl 24.6, F 8.7, S 25.6, six-membered ring
 *              -15.0; the sum is written out in the row. NaN: no value.
 *  Tb, Tc [K], Pc [bar]
 *              Poling, Prausnitz and O'Connell, The Properties of Gases and
 *              Liquids, 5th ed. (2001), Appendix A (from memory). Tb is NaN
 *              for CO2, SF6 and acetylene, which sublime at 1 atm. Air:
 *              pseudo-critical values of the dry-air mixture as listed in
 *              the same appendix (from memory); its Tb is the mixture's
 *              bubble/dew region at 1 atm (about 78.8 K, from memory).
 *  assoc [-]   Wilke-Chang association factor of the species as a solvent,
 *              Wilke and Chang, AIChE J. 1 (1955) 264-270: water 2.6,
 *              methanol 1.9, ethanol 1.5, unassociated solvents 1.0 (given
 *              to the species that are liquids near room temperature and not
 *              associated). NaN for gases and for 1-propanol (no value in
 *              that paper).
 */
#include <math.h>
#include <string.h>
#include "base/mcd_internal.h"
#include "data/species.h"

#define DEBYE 3.33564e-30 /* C m per debye (1e-21/c, c = 299792458 m/s) */
#define BAR 1e5           /* Pa */

const char mcdi_src_m_formula[] =
    "computed from the formula, IUPAC CIAAW 2021 standard atomic weights";
const char mcdi_src_m_air[] =
    "U.S. Standard Atmosphere 1976, dry air 28.9644 g/mol (from memory)";
const char mcdi_src_m_d2[] =
    "2 x atomic mass of 2H, AME 2020 (Wang et al. 2021) (from memory)";
const char mcdi_src_v_table[] =
    "Fuller, Ensley and Giddings 1969, tabulated molecular volume "
    "(Reid, Prausnitz and Poling 1987, Table 11-1)";
const char mcdi_src_v_increments[] =
    "Fuller, Ensley and Giddings 1969, sum of atomic increments "
    "(Reid, Prausnitz and Poling 1987, Table 11-1)";
static const char SRC_LJ_S[] =
    "Svehla 1962, NASA TR R-132, via Reid, Prausnitz and Poling 1987, "
    "Appendix B (from memory)";
static const char SRC_LJ_H[] =
    "Hirschfelder, Curtiss and Bird 1954, Table I-A (from memory)";
static const char SRC_LJ_B[] =
    "estimated from Tc and Pc, Bird, Stewart and Lightfoot 2002, "
    "eqs. 1.4-11, 1.4-13";
static const char SRC_DIP[] =
    "Reid, Prausnitz and Poling 1987, Appendix A (from memory)";
static const char SRC_VB_T[] =
    "Treybal 1980, Mass-Transfer Operations, Table 2.3 (from memory)";
static const char SRC_VB_L[] =
    "Le Bas method, increments of Reid, Prausnitz and Poling 1987, "
    "Table 3-8 (computed)";
static const char SRC_CRIT[] =
    "Poling, Prausnitz and O'Connell 2001, Appendix A (from memory)";
static const char SRC_CRIT_AIR[] =
    "Poling, Prausnitz and O'Connell 2001, Appendix A, dry-air "
    "pseudo-critical values (from memory)";
static const char SRC_ASSOC[] = "Wilke and Chang 1955, AIChE J. 1, 264";

typedef struct row {
    const char *name, *formula;
    int n_rings;
    double M_g;     /* g/mol */
    double V;       /* FEG diffusion volume */
    char V_kind;    /* 'T' tabulated, 'I' increments */
    double sigma_A; /* Angstrom */
    double eps_k;   /* K */
    double dip_D;   /* debye */
    double Vb_cm3;  /* cm^3/mol */
    char Vb_kind;   /* 'T' tabulated, 'L' Le Bas, 0 none */
    double Tb, Tc;  /* K */
    double Pc_bar;  /* bar */
    double assoc;   /* - */
    char lj_kind;   /* 'S' Svehla, 'H' HCB, 'B' estimated from Tc, Pc */
} row;

/* A missing value in the table (NAN is a float constant: cast once). */
#define NODATA ((double)NAN)

/* name, formula, rings, M, V, V kind, sigma, eps/k, dipole, Vb, Vb kind,
 * Tb, Tc, Pc, assoc, LJ kind */
/* clang-format off */
static const row table[] = {
    {"hydrogen", "H2", 0, 2.0160, 6.12, 'T', 2.827, 59.7, 0.0, 14.3, 'T', 20.28, 33.19, 13.13, NODATA, 'S'},
    {"deuterium", "D2", 0, 4.02820355624, 6.84, 'T', 2.948, 39.3, 0.0, NODATA, 0, 23.7, 38.35, 16.65, NODATA, 'H'},
    {"helium", "He", 0, 4.0026, 2.67, 'T', 2.551, 10.22, 0.0, NODATA, 0, 4.22, 5.19, 2.27, NODATA, 'S'},
    {"neon", "Ne", 0, 20.1797, 5.98, 'T', 2.820, 32.8, 0.0, NODATA, 0, 27.07, 44.4, 27.6, NODATA, 'S'},
    {"argon", "Ar", 0, 39.9500, 16.20, 'T', 3.542, 93.3, 0.0, NODATA, 0, 87.27, 150.86, 48.98, NODATA, 'S'},
    {"krypton", "Kr", 0, 83.7980, 24.50, 'T', 3.655, 178.9, 0.0, NODATA, 0, 119.8, 209.35, 55.0, NODATA, 'S'},
    {"xenon", "Xe", 0, 131.2930, 32.70, 'T', 4.047, 231.0, 0.0, NODATA, 0, 165.0, 289.74, 58.4, NODATA, 'S'},
    {"nitrogen", "N2", 0, 28.0140, 18.50, 'T', 3.798, 71.4, 0.0, 31.2, 'T', 77.35, 126.2, 33.98, NODATA, 'S'},
    {"oxygen", "O2", 0, 31.9980, 16.30, 'T', 3.467, 106.7, 0.0, 25.6, 'T', 90.17, 154.58, 50.43, NODATA, 'S'},
    {"air", "air", 0, 28.9644, 19.70, 'T', 3.711, 78.6, 0.0, 29.9, 'T', 78.8, 132.45, 37.74, NODATA, 'S'},
    {"carbon-monoxide", "CO", 0, 28.0100, 18.00, 'T', 3.690, 91.7, 0.1, 30.7, 'T', 81.66, 132.85, 34.94, NODATA, 'S'},
    {"carbon-dioxide", "CO2", 0, 44.0090, 26.90, 'T', 3.941, 195.2, 0.0, 34.0, 'T', NODATA, 304.12, 73.74, NODATA, 'S'},
    {"water", "H2O", 0, 18.0150, 13.10, 'T', 2.641, 809.1, 1.8, 18.9, 'T', 373.15, 647.14, 220.64, 2.6, 'S'},
    {"ammonia", "NH3", 0, 17.0310, 20.70, 'T', 2.900, 558.3, 1.5, 25.8, 'T', 239.82, 405.4, 113.53, NODATA, 'S'},
    {"hydrogen-sulfide", "H2S", 0, 34.0760, 27.52, 'I', 3.623, 301.1, 0.9, 32.9, 'T', 212.84, 373.4, 89.63, NODATA, 'S'},
    {"sulfur-dioxide", "SO2", 0, 64.0580, 41.80, 'T', 4.112, 335.4, 1.6, 44.8, 'T', 263.13, 430.8, 78.84, NODATA, 'S'},
    {"sulfur-hexafluoride", "SF6", 0, 146.0504, 71.30, 'T', 5.128, 222.1, 0.0, (25.6+6*8.7), 'L', NODATA, 318.7, 37.6, NODATA, 'S'},
    {"nitrous-oxide", "N2O", 0, 44.0130, 35.90, 'T', 3.828, 232.4, 0.2, 36.4, 'T', 184.67, 309.57, 72.45, NODATA, 'S'},
    {"nitric-oxide", "NO", 0, 30.0060, 10.65, 'I', 3.492, 116.7, 0.2, 23.6, 'T', 121.38, 180.0, 64.8, NODATA, 'S'},
    {"chlorine", "Cl2", 0, 70.9000, 38.40, 'T', 4.217, 316.0, 0.0, 48.4, 'T', 239.12, 416.9, 79.8, NODATA, 'S'},
    {"hydrogen-chloride", "HCl", 0, 36.4580, 23.31, 'I', 3.339, 344.7, 1.1, (3.7+24.6), 'L', 188.15, 324.7, 83.1, NODATA, 'S'},
    {"hydrogen-fluoride", "HF", 0, 20.0064, 17.01, 'I', 3.148, 330.0, 1.8, (3.7+8.7), 'L', 292.67, 461.0, 64.8, NODATA, 'S'},
    {"bromine", "Br2", 0, 159.8080, 69.00, 'T', 4.296, 507.9, 0.0, 53.2, 'T', 331.9, 584.15, 103.0, 1.0, 'S'},
    {"methane", "CH4", 0, 16.0430, 25.14, 'I', 3.758, 148.6, 0.0, (14.8+4*3.7), 'L', 111.66, 190.56, 45.99, NODATA, 'S'},
    {"ethane", "C2H6", 0, 30.0700, 45.66, 'I', 4.443, 215.7, 0.0, (2*14.8+6*3.7), 'L', 184.55, 305.32, 48.72, NODATA, 'S'},
    {"propane", "C3H8", 0, 44.0970, 66.18, 'I', 5.118, 237.1, 0.0, (3*14.8+8*3.7), 'L', 231.02, 369.83, 42.48, NODATA, 'S'},
    {"n-butane", "C4H10", 0, 58.1240, 86.70, 'I', 4.687, 531.4, 0.0, (4*14.8+10*3.7), 'L', 272.66, 425.12, 37.96, NODATA, 'S'},
    {"isobutane", "(CH3)3CH", 0, 58.1240, 86.70, 'I', 5.278, 330.1, 0.1, (4*14.8+10*3.7), 'L', 261.34, 407.85, 36.40, NODATA, 'S'},
    {"n-pentane", "C5H12", 0, 72.1510, 107.22, 'I', 5.784, 341.1, 0.0, (5*14.8+12*3.7), 'L', 309.22, 469.7, 33.70, 1.0, 'S'},
    {"n-hexane", "C6H14", 0, 86.1780, 127.74, 'I', 5.949, 399.3, 0.0, (6*14.8+14*3.7), 'L', 341.88, 507.6, 30.25, 1.0, 'S'},
    {"n-heptane", "C7H16", 0, 100.2050, 148.26, 'I', NODATA, NODATA, 0.0, (7*14.8+16*3.7), 'L', 371.58, 540.2, 27.40, 1.0, 'B'},
    {"n-octane", "C8H18", 0, 114.2320, 168.78, 'I', NODATA, NODATA, 0.0, (8*14.8+18*3.7), 'L', 398.83, 568.7, 24.90, 1.0, 'B'},
    {"ethylene", "C2H4", 0, 28.0540, 41.04, 'I', 4.163, 224.7, 0.0, (2*14.8+4*3.7), 'L', 169.42, 282.34, 50.41, NODATA, 'S'},
    {"propylene", "C3H6", 0, 42.0810, 61.56, 'I', 4.678, 298.9, 0.4, (3*14.8+6*3.7), 'L', 225.46, 364.9, 46.0, NODATA, 'S'},
    {"acetylene", "C2H2", 0, 26.0380, 36.42, 'I', 4.033, 231.8, 0.0, (2*14.8+2*3.7), 'L', NODATA, 308.3, 61.14, NODATA, 'S'},
    {"benzene", "C6H6", 1, 78.1140, 90.96, 'I', 5.349, 412.3, 0.0, (6*14.8+6*3.7-15.0), 'L', 353.24, 562.05, 48.95, 1.0, 'S'},
    {"toluene", "C7H8", 1, 92.1410, 111.48, 'I', NODATA, NODATA, 0.4, (7*14.8+8*3.7-15.0), 'L', 383.79, 591.75, 41.08, 1.0, 'B'},
    {"cyclohexane", "C6H12", 0, 84.1620, 123.12, 'I', 6.182, 297.1, 0.3, (6*14.8+12*3.7-15.0), 'L', 353.93, 553.5, 40.73, 1.0, 'S'},
    {"methanol", "CH3OH", 0, 32.0420, 31.25, 'I', 3.626, 481.8, 1.7, (14.8+4*3.7+7.4), 'L', 337.69, 512.64, 80.97, 1.9, 'S'},
    {"ethanol", "C2H5OH", 0, 46.0690, 51.77, 'I', 4.530, 362.6, 1.7, (2*14.8+6*3.7+7.4), 'L', 351.44, 513.92, 61.48, 1.5, 'S'},
    {"1-propanol", "C3H7OH", 0, 60.0960, 72.29, 'I', 4.549, 576.7, 1.7, (3*14.8+8*3.7+7.4), 'L', 370.93, 536.78, 51.75, NODATA, 'S'},
    {"acetone", "CH3COCH3", 0, 58.0800, 67.67, 'I', 4.600, 560.2, 2.9, (3*14.8+6*3.7+7.4), 'L', 329.22, 508.2, 47.01, 1.0, 'S'},
    {"diethyl-ether", "C4H10O", 0, 74.1230, 92.81, 'I', 5.678, 313.8, 1.3, (4*14.8+10*3.7+9.9), 'L', 307.58, 466.7, 36.40, 1.0, 'S'},
    {"ethyl-acetate", "C4H8O2", 0, 88.1060, 94.30, 'I', 5.205, 521.3, 1.9, (4*14.8+8*3.7+7.4+9.9), 'L', 350.26, 523.3, 38.80, 1.0, 'S'},
    {"chloroform", "CHCl3", 0, 119.3690, 81.21, 'I', 5.389, 340.2, 1.1, (14.8+3.7+3*24.6), 'L', 334.33, 536.4, 53.7, 1.0, 'S'},
    {"carbon-tetrachloride", "CCl4", 0, 153.8110, 99.90, 'I', 5.947, 322.7, 0.0, (14.8+4*24.6), 'L', 349.79, 556.35, 45.6, 1.0, 'S'},
    {"dichloromethane", "CH2Cl2", 0, 84.9270, 62.52, 'I', 4.898, 356.3, 1.6, (14.8+2*3.7+2*24.6), 'L', 313.0, 510.0, 60.8, 1.0, 'S'},
    {"r134a", "CH2FCF3", 0, 102.0316, 95.22, 'I', NODATA, NODATA, 2.1, (2*14.8+2*3.7+4*8.7), 'L', 247.08, 374.21, 40.59, NODATA, 'B'},
    {"r32", "CH2F2", 0, 52.0238, 49.92, 'I', NODATA, NODATA, 2.0, (14.8+2*3.7+2*8.7), 'L', 221.5, 351.26, 57.82, NODATA, 'B'},
    {"r22", "CHClF2", 0, 86.4658, 68.61, 'I', NODATA, NODATA, 1.4, (14.8+3.7+24.6+2*8.7), 'L', 232.34, 369.3, 49.71, NODATA, 'B'},
};
/* clang-format on */

#define N_ROWS (sizeof table / sizeof table[0])

size_t mcdi_builtin_count(void) { return N_ROWS; }

void mcdi_builtin_fill(size_t i, mcdi_species *s)
{
    const row *r = &table[i];
    int k;
    memset(s, 0, sizeof *s);
    /* Table names and formulas are far shorter than the buffers. */
    memcpy(s->name, r->name, strlen(r->name) + 1);
    memcpy(s->formula, r->formula, strlen(r->formula) + 1);
    for (k = 0; k < MCD_PARAM_COUNT; ++k) {
        s->p[k] = NAN;
        s->src[k] = NULL;
    }
    s->p[MCD_PARAM_MOLAR_MASS] = r->M_g * 1e-3;
    s->src[MCD_PARAM_MOLAR_MASS] = strcmp(r->name, "air") == 0 ? mcdi_src_m_air
                                   : strcmp(r->name, "deuterium") == 0
                                       ? mcdi_src_m_d2
                                       : mcdi_src_m_formula;
    s->p[MCD_PARAM_DIFF_VOLUME] = r->V;
    s->src[MCD_PARAM_DIFF_VOLUME] =
        r->V_kind == 'T' ? mcdi_src_v_table : mcdi_src_v_increments;
    if (r->lj_kind == 'B') {
        /* Bird, Stewart and Lightfoot (2002) eqs. 1.4-11, 1.4-13. */
        double Pc_atm = r->Pc_bar * BAR / MCD_ATM;
        s->p[MCD_PARAM_LJ_EPS_K] = 0.77 * r->Tc;
        s->p[MCD_PARAM_LJ_SIGMA] = 2.44 * cbrt(r->Tc / Pc_atm) * 1e-10;
        s->src[MCD_PARAM_LJ_EPS_K] = SRC_LJ_B;
        s->src[MCD_PARAM_LJ_SIGMA] = SRC_LJ_B;
    } else if (!isnan(r->sigma_A)) {
        const char *src = r->lj_kind == 'H' ? SRC_LJ_H : SRC_LJ_S;
        s->p[MCD_PARAM_LJ_SIGMA] = r->sigma_A * 1e-10;
        s->p[MCD_PARAM_LJ_EPS_K] = r->eps_k;
        s->src[MCD_PARAM_LJ_SIGMA] = src;
        s->src[MCD_PARAM_LJ_EPS_K] = src;
    }
    if (!isnan(r->dip_D)) {
        s->p[MCD_PARAM_DIPOLE] = r->dip_D * DEBYE;
        s->src[MCD_PARAM_DIPOLE] = SRC_DIP;
    }
    if (!isnan(r->Vb_cm3)) {
        s->p[MCD_PARAM_VB] = r->Vb_cm3 * 1e-6;
        s->src[MCD_PARAM_VB] = r->Vb_kind == 'T' ? SRC_VB_T : SRC_VB_L;
    }
    {
        const char *crit =
            strcmp(r->name, "air") == 0 ? SRC_CRIT_AIR : SRC_CRIT;
        if (!isnan(r->Tb)) {
            s->p[MCD_PARAM_TB] = r->Tb;
            s->src[MCD_PARAM_TB] = SRC_CRIT;
        }
        if (!isnan(r->Tc)) {
            s->p[MCD_PARAM_TC] = r->Tc;
            s->src[MCD_PARAM_TC] = crit;
        }
        if (!isnan(r->Pc_bar)) {
            s->p[MCD_PARAM_PC] = r->Pc_bar * BAR;
            s->src[MCD_PARAM_PC] = crit;
        }
    }
    if (!isnan(r->assoc)) {
        s->p[MCD_PARAM_ASSOC] = r->assoc;
        s->src[MCD_PARAM_ASSOC] = SRC_ASSOC;
    }
}
