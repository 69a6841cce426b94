/* species_table.c - built-in table of gases and vapours.
 *
 * Columns, units as written in the table, and their sources. Every value
 * carries the source named by its column's source letter; a value not known
 * reliably is NODATA (NaN): the estimators then refuse it (ENODATA) or fall
 * back to another estimate with MCD_WARN_ESTIMATED_PARAM. "From memory"
 * marks a value recalled from the named source but not checked against a
 * printed copy; "confirmed" names where it was checked.
 *
 *  M [kg/mol]  not in the table: computed from the formula with the IUPAC
 *              CIAAW 2021 standard atomic weights (elements.c), exactly as
 *              mcd_db_add does. Exceptions (db.c): air, 28.9644 g/mol, mean
 *              molar mass of dry air of the U.S. Standard Atmosphere 1976
 *              (from memory); deuterium, 2 x 2.01410177812 g/mol (AME 2020,
 *              Wang et al., Chin. Phys. C 45 (2021) 030003) (from memory).
 *  V [-]       not in the table either: the Fuller-Ensley-Giddings (1969)
 *              diffusion volume, the tabulated molecular value where the
 *              method has one, else the sum of atomic increments and
 *              `rings` aromatic or heterocyclic ring increments
 *              (fsg_volumes.c): an estimate by the Fuller method, so named
 *              in its source text. Unknown for formulas with an element
 *              without increment (Si, W, Ga, Al, B, P, As, Hg, U).
 *  sigma [A], eps/k [K], LJ source:
 *              'S' Lennard-Jones 12-6 parameters from viscosity, R. A.
 *                  Svehla, NASA Technical Report R-132 (1962), as reprinted
 *                  in Reid, Prausnitz and Poling, The Properties of Gases
 *                  and Liquids, 4th ed. (1987), Appendix B (from memory);
 *              'H' Hirschfelder, Curtiss and Bird, Molecular Theory of Gases
 *                  and Liquids (1954), Table I-A (from memory);
 *              'B' not in those tables; estimated from the row's critical
 *                  constants by Bird, Stewart and Lightfoot, Transport
 *                  Phenomena, 2nd ed. (2002), eqs. 1.4-11 and 1.4-13:
 *                  eps/k = 0.77 Tc, sigma = 2.44 (Tc/Pc)^(1/3) (sigma in
 *                  Angstrom, Tc in K, Pc in atm); named as an estimate;
 *              0   unknown.
 *  dipole [debye], source:
 *              'A' Reid, Prausnitz and Poling, 4th ed. (1987), Appendix A
 *                  (from memory);
 *              'C' CRC Handbook of Chemistry and Physics, table "Dipole
 *                  moments" (gas phase) (from memory);
 *              'Z' zero by molecular symmetry (atoms, D3h/Td/Oh molecules;
 *                  common practice);
 *              0   unknown. 1 debye = 3.33564e-30 C m.
 *  Vb [cm^3/mol], liquid molar volume at the normal boiling point:
 *              'T' tabulated values of R. E. Treybal, Mass-Transfer
 *                  Operations, 3rd ed. (1980), Table 2.3 (from memory);
 *              'L' Le Bas (1915) additive volumes as given by Reid,
 *                  Prausnitz and Poling (1987), Table 3-8 (from memory):
 *                  C 14.8, H 3.7, O 7.4 (9.9 in ethyl esters and ethers),
 *                  Cl 24.6, Br 27.0, I 37.0, F 8.7, S 25.6; rings:
 *                  three-membered -6.0, four-membered -8.5, six-membered
 *                  -15.0, naphthalene -30.0. The sum is written out in the
 *                  row. Not used where the increment depends on a bond type
 *                  (N, O of acids, esters and ring ethers) or the element
 *                  has none (Si, W, ...): NaN there;
 *              0   unknown.
 *  Tb [K], source:
 *              'A' Poling, Prausnitz and O'Connell, The Properties of Gases
 *                  and Liquids, 5th ed. (2001), Appendix A (from memory);
 *              'C' CRC Handbook of Chemistry and Physics, tables of physical
 *                  constants of inorganic and organic compounds (from
 *                  memory);
 *              'W' NIST Chemistry WebBook, fluid properties (from memory);
 *              0   unknown or none (CO2, SF6, acetylene, SiF4 and UF6
 *                  sublime at 1 atm). Air: the bubble/dew region of the
 *                  dry-air mixture at 1 atm (about 78.8 K, from memory).
 *  Tc [K], Pc [bar], source:
 *              'A' Poling, Prausnitz and O'Connell (2001), Appendix A (from
 *                  memory);
 *              'R' the same appendix's dry-air pseudo-critical values (from
 *                  memory);
 *              'W' NIST Chemistry WebBook, fluid properties (from memory);
 *              'M' dichlorosilane: predicted values of Chen et al. as
 *                  listed by Marsh et al., J. Chem. Eng. Data 61 (2016),
 *                  Supporting Information, Table S1 (confirmed with the
 *                  search tool; the measured critical point is not known);
 *              'E' trichlorosilane: critical point measured by a flow
 *                  method, 474.2 K and 569.9 psia (3.929 MPa), ECHA
 *                  registration dossier for trichlorosilane (confirmed with
 *                  the search tool);
 *              0   unknown.
 *  assoc [-]   Wilke-Chang association factor of the species as a solvent,
 *              Wilke and Chang, AIChE J. 1 (1955) 264-270: water 2.6,
 *              methanol 1.9, ethanol 1.5, unassociated solvents 1.0 (given
 *              to the species that are liquids near room temperature and not
 *              associated). NaN for gases and for the other alcohols, acids,
 *              amines and aprotic polar solvents (no value in that paper).
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
    "estimated by the Fuller method: Fuller, Ensley and Giddings 1969, sum "
    "of atomic increments (Reid, Prausnitz and Poling 1987, Table 11-1)";
static const char SRC_LJ_S[] =
    "Svehla 1962, NASA TR R-132, via Reid, Prausnitz and Poling 1987, "
    "Appendix B (from memory)";
static const char SRC_LJ_H[] =
    "Hirschfelder, Curtiss and Bird 1954, Table I-A (from memory)";
static const char SRC_LJ_B[] =
    "estimated from Tc and Pc, Bird, Stewart and Lightfoot 2002, "
    "eqs. 1.4-11, 1.4-13";
static const char SRC_DIP_A[] =
    "Reid, Prausnitz and Poling 1987, Appendix A (from memory)";
static const char SRC_DIP_C[] =
    "CRC Handbook of Chemistry and Physics, dipole moments, gas phase "
    "(from memory)";
static const char SRC_DIP_Z[] = "zero by molecular symmetry (common practice)";
static const char SRC_VB_T[] =
    "Treybal 1980, Mass-Transfer Operations, Table 2.3 (from memory)";
static const char SRC_VB_L[] =
    "Le Bas method, increments of Reid, Prausnitz and Poling 1987, "
    "Table 3-8 (computed)";
static const char SRC_PPO[] =
    "Poling, Prausnitz and O'Connell 2001, Appendix A (from memory)";
static const char SRC_CRC[] =
    "CRC Handbook of Chemistry and Physics, physical constants of "
    "compounds (from memory)";
static const char SRC_WEBBOOK[] =
    "NIST Chemistry WebBook, fluid properties (from memory)";
static const char SRC_CRIT_AIR[] =
    "Poling, Prausnitz and O'Connell 2001, Appendix A, dry-air "
    "pseudo-critical values (from memory)";
static const char SRC_CRIT_DCS[] =
    "predicted by Chen et al., as listed by Marsh et al., J. Chem. Eng. "
    "Data 61 (2016), Supporting Information Table S1 (confirmed with the "
    "search tool)";
static const char SRC_CRIT_TCS[] =
    "measured (flow method), ECHA registration dossier for "
    "trichlorosilane (confirmed with the search tool)";
static const char SRC_ASSOC[] = "Wilke and Chang 1955, AIChE J. 1, 264";

typedef struct row {
    const char *name, *formula;
    int n_rings;       /* FEG aromatic or heterocyclic rings */
    double sigma_A;    /* Angstrom */
    double eps_k;      /* K */
    char lj_kind;      /* 'S', 'H', 'B' or 0, see above */
    double dip_D;      /* debye */
    char dip_kind;     /* 'A', 'C', 'Z' or 0 */
    double Vb_cm3;     /* cm^3/mol */
    char Vb_kind;      /* 'T', 'L' or 0 */
    double Tb;         /* K */
    char Tb_kind;      /* 'A', 'C', 'W' or 0 */
    double Tc, Pc_bar; /* K, bar */
    char crit_kind;    /* 'A', 'R', 'W', 'M', 'E' or 0 */
    double assoc;      /* - */
} row;

/* A missing value in the table (NAN is a float constant: cast once). */
#define NODATA ((double)NAN)

/* name, formula, FEG rings, sigma, eps/k, LJ source, dipole, its source,
 * Vb, its source, Tb, its source, Tc, Pc, their source, assoc */
/* clang-format off */
static const row table[] = {
    {"hydrogen", "H2", 0, 2.827, 59.7, 'S', 0.0, 'A', 14.3, 'T', 20.28, 'A', 33.19, 13.13, 'A', NODATA},
    {"deuterium", "D2", 0, 2.948, 39.3, 'H', 0.0, 'A', NODATA, 0, 23.7, 'A', 38.35, 16.65, 'A', NODATA},
    {"helium", "He", 0, 2.551, 10.22, 'S', 0.0, 'A', NODATA, 0, 4.22, 'A', 5.19, 2.27, 'A', NODATA},
    {"neon", "Ne", 0, 2.820, 32.8, 'S', 0.0, 'A', NODATA, 0, 27.07, 'A', 44.4, 27.6, 'A', NODATA},
    {"argon", "Ar", 0, 3.542, 93.3, 'S', 0.0, 'A', NODATA, 0, 87.27, 'A', 150.86, 48.98, 'A', NODATA},
    {"krypton", "Kr", 0, 3.655, 178.9, 'S', 0.0, 'A', NODATA, 0, 119.8, 'A', 209.35, 55.0, 'A', NODATA},
    {"xenon", "Xe", 0, 4.047, 231.0, 'S', 0.0, 'A', NODATA, 0, 165.0, 'A', 289.74, 58.4, 'A', NODATA},
    {"nitrogen", "N2", 0, 3.798, 71.4, 'S', 0.0, 'A', 31.2, 'T', 77.35, 'A', 126.2, 33.98, 'A', NODATA},
    {"oxygen", "O2", 0, 3.467, 106.7, 'S', 0.0, 'A', 25.6, 'T', 90.17, 'A', 154.58, 50.43, 'A', NODATA},
    {"air", "air", 0, 3.711, 78.6, 'S', 0.0, 'A', 29.9, 'T', 78.8, 'A', 132.45, 37.74, 'R', NODATA},
    {"carbon-monoxide", "CO", 0, 3.690, 91.7, 'S', 0.1, 'A', 30.7, 'T', 81.66, 'A', 132.85, 34.94, 'A', NODATA},
    {"carbon-dioxide", "CO2", 0, 3.941, 195.2, 'S', 0.0, 'A', 34.0, 'T', NODATA, 0, 304.12, 73.74, 'A', NODATA},
    {"water", "H2O", 0, 2.641, 809.1, 'S', 1.8, 'A', 18.9, 'T', 373.15, 'A', 647.14, 220.64, 'A', 2.6},
    {"ammonia", "NH3", 0, 2.900, 558.3, 'S', 1.5, 'A', 25.8, 'T', 239.82, 'A', 405.4, 113.53, 'A', NODATA},
    {"hydrogen-sulfide", "H2S", 0, 3.623, 301.1, 'S', 0.9, 'A', 32.9, 'T', 212.84, 'A', 373.4, 89.63, 'A', NODATA},
    {"sulfur-dioxide", "SO2", 0, 4.112, 335.4, 'S', 1.6, 'A', 44.8, 'T', 263.13, 'A', 430.8, 78.84, 'A', NODATA},
    {"sulfur-hexafluoride", "SF6", 0, 5.128, 222.1, 'S', 0.0, 'A', (25.6+6*8.7), 'L', NODATA, 0, 318.7, 37.6, 'A', NODATA},
    {"nitrous-oxide", "N2O", 0, 3.828, 232.4, 'S', 0.2, 'A', 36.4, 'T', 184.67, 'A', 309.57, 72.45, 'A', NODATA},
    {"nitric-oxide", "NO", 0, 3.492, 116.7, 'S', 0.2, 'A', 23.6, 'T', 121.38, 'A', 180.0, 64.8, 'A', NODATA},
    {"chlorine", "Cl2", 0, 4.217, 316.0, 'S', 0.0, 'A', 48.4, 'T', 239.12, 'A', 416.9, 79.8, 'A', NODATA},
    {"hydrogen-chloride", "HCl", 0, 3.339, 344.7, 'S', 1.1, 'A', (3.7+24.6), 'L', 188.15, 'A', 324.7, 83.1, 'A', NODATA},
    {"hydrogen-fluoride", "HF", 0, 3.148, 330.0, 'S', 1.8, 'A', (3.7+8.7), 'L', 292.67, 'A', 461.0, 64.8, 'A', NODATA},
    {"bromine", "Br2", 0, 4.296, 507.9, 'S', 0.0, 'A', 53.2, 'T', 331.9, 'A', 584.15, 103.0, 'A', 1.0},
    {"methane", "CH4", 0, 3.758, 148.6, 'S', 0.0, 'A', (14.8+4*3.7), 'L', 111.66, 'A', 190.56, 45.99, 'A', NODATA},
    {"ethane", "C2H6", 0, 4.443, 215.7, 'S', 0.0, 'A', (2*14.8+6*3.7), 'L', 184.55, 'A', 305.32, 48.72, 'A', NODATA},
    {"propane", "C3H8", 0, 5.118, 237.1, 'S', 0.0, 'A', (3*14.8+8*3.7), 'L', 231.02, 'A', 369.83, 42.48, 'A', NODATA},
    {"n-butane", "C4H10", 0, 4.687, 531.4, 'S', 0.0, 'A', (4*14.8+10*3.7), 'L', 272.66, 'A', 425.12, 37.96, 'A', NODATA},
    {"isobutane", "(CH3)3CH", 0, 5.278, 330.1, 'S', 0.1, 'A', (4*14.8+10*3.7), 'L', 261.34, 'A', 407.85, 36.40, 'A', NODATA},
    {"n-pentane", "C5H12", 0, 5.784, 341.1, 'S', 0.0, 'A', (5*14.8+12*3.7), 'L', 309.22, 'A', 469.7, 33.70, 'A', 1.0},
    {"n-hexane", "C6H14", 0, 5.949, 399.3, 'S', 0.0, 'A', (6*14.8+14*3.7), 'L', 341.88, 'A', 507.6, 30.25, 'A', 1.0},
    {"n-heptane", "C7H16", 0, NODATA, NODATA, 'B', 0.0, 'A', (7*14.8+16*3.7), 'L', 371.58, 'A', 540.2, 27.40, 'A', 1.0},
    {"n-octane", "C8H18", 0, NODATA, NODATA, 'B', 0.0, 'A', (8*14.8+18*3.7), 'L', 398.83, 'A', 568.7, 24.90, 'A', 1.0},
    {"ethylene", "C2H4", 0, 4.163, 224.7, 'S', 0.0, 'A', (2*14.8+4*3.7), 'L', 169.42, 'A', 282.34, 50.41, 'A', NODATA},
    {"propylene", "C3H6", 0, 4.678, 298.9, 'S', 0.4, 'A', (3*14.8+6*3.7), 'L', 225.46, 'A', 364.9, 46.0, 'A', NODATA},
    {"acetylene", "C2H2", 0, 4.033, 231.8, 'S', 0.0, 'A', (2*14.8+2*3.7), 'L', NODATA, 0, 308.3, 61.14, 'A', NODATA},
    {"benzene", "C6H6", 1, 5.349, 412.3, 'S', 0.0, 'A', (6*14.8+6*3.7-15.0), 'L', 353.24, 'A', 562.05, 48.95, 'A', 1.0},
    {"toluene", "C7H8", 1, NODATA, NODATA, 'B', 0.4, 'A', (7*14.8+8*3.7-15.0), 'L', 383.79, 'A', 591.75, 41.08, 'A', 1.0},
    {"cyclohexane", "C6H12", 0, 6.182, 297.1, 'S', 0.3, 'A', (6*14.8+12*3.7-15.0), 'L', 353.93, 'A', 553.5, 40.73, 'A', 1.0},
    {"methanol", "CH3OH", 0, 3.626, 481.8, 'S', 1.7, 'A', (14.8+4*3.7+7.4), 'L', 337.69, 'A', 512.64, 80.97, 'A', 1.9},
    {"ethanol", "C2H5OH", 0, 4.530, 362.6, 'S', 1.7, 'A', (2*14.8+6*3.7+7.4), 'L', 351.44, 'A', 513.92, 61.48, 'A', 1.5},
    {"1-propanol", "C3H7OH", 0, 4.549, 576.7, 'S', 1.7, 'A', (3*14.8+8*3.7+7.4), 'L', 370.93, 'A', 536.78, 51.75, 'A', NODATA},
    {"acetone", "CH3COCH3", 0, 4.600, 560.2, 'S', 2.9, 'A', (3*14.8+6*3.7+7.4), 'L', 329.22, 'A', 508.2, 47.01, 'A', 1.0},
    {"diethyl-ether", "C4H10O", 0, 5.678, 313.8, 'S', 1.3, 'A', (4*14.8+10*3.7+9.9), 'L', 307.58, 'A', 466.7, 36.40, 'A', 1.0},
    {"ethyl-acetate", "C4H8O2", 0, 5.205, 521.3, 'S', 1.9, 'A', (4*14.8+8*3.7+7.4+9.9), 'L', 350.26, 'A', 523.3, 38.80, 'A', 1.0},
    {"chloroform", "CHCl3", 0, 5.389, 340.2, 'S', 1.1, 'A', (14.8+3.7+3*24.6), 'L', 334.33, 'A', 536.4, 53.7, 'A', 1.0},
    {"carbon-tetrachloride", "CCl4", 0, 5.947, 322.7, 'S', 0.0, 'A', (14.8+4*24.6), 'L', 349.79, 'A', 556.35, 45.6, 'A', 1.0},
    {"dichloromethane", "CH2Cl2", 0, 4.898, 356.3, 'S', 1.6, 'A', (14.8+2*3.7+2*24.6), 'L', 313.0, 'A', 510.0, 60.8, 'A', 1.0},
    {"r134a", "CH2FCF3", 0, NODATA, NODATA, 'B', 2.1, 'A', (2*14.8+2*3.7+4*8.7), 'L', 247.08, 'A', 374.21, 40.59, 'A', NODATA},
    {"r32", "CH2F2", 0, NODATA, NODATA, 'B', 2.0, 'A', (14.8+2*3.7+2*8.7), 'L', 221.5, 'A', 351.26, 57.82, 'A', NODATA},
    {"r22", "CHClF2", 0, NODATA, NODATA, 'B', 1.4, 'A', (14.8+3.7+24.6+2*8.7), 'L', 232.34, 'A', 369.3, 49.71, 'A', NODATA},
    /* Flame atoms and radicals. Lennard-Jones values only where Svehla
     * lists them; no liquid, boiling or critical data exist. */
    {"atomic-hydrogen", "H", 0, 2.708, 37.0, 'S', 0.0, 'Z', NODATA, 0, NODATA, 0, NODATA, NODATA, 0, NODATA},
    {"atomic-oxygen", "O", 0, 3.050, 106.7, 'S', 0.0, 'Z', NODATA, 0, NODATA, 0, NODATA, NODATA, 0, NODATA},
    {"atomic-nitrogen", "N", 0, 3.298, 71.4, 'S', 0.0, 'Z', NODATA, 0, NODATA, 0, NODATA, NODATA, 0, NODATA},
    {"atomic-carbon", "C", 0, 3.385, 30.6, 'S', 0.0, 'Z', NODATA, 0, NODATA, 0, NODATA, NODATA, 0, NODATA},
    {"hydroxyl", "OH", 0, 3.147, 79.8, 'S', 1.66, 'C', NODATA, 0, NODATA, 0, NODATA, NODATA, 0, NODATA},
    {"hydroperoxyl", "HO2", 0, NODATA, NODATA, 0, 2.09, 'C', NODATA, 0, NODATA, 0, NODATA, NODATA, 0, NODATA},
    {"methylidyne", "CH", 0, 3.370, 68.6, 'S', NODATA, 0, NODATA, 0, NODATA, 0, NODATA, NODATA, 0, NODATA},
    {"methylene", "CH2", 0, NODATA, NODATA, 0, NODATA, 0, NODATA, 0, NODATA, 0, NODATA, NODATA, 0, NODATA},
    {"methyl", "CH3", 0, NODATA, NODATA, 0, 0.0, 'Z', NODATA, 0, NODATA, 0, NODATA, NODATA, 0, NODATA},
    {"formyl", "HCO", 0, NODATA, NODATA, 0, NODATA, 0, NODATA, 0, NODATA, 0, NODATA, NODATA, 0, NODATA},
    {"methoxy", "CH3O", 0, NODATA, NODATA, 0, NODATA, 0, NODATA, 0, NODATA, 0, NODATA, NODATA, 0, NODATA},
    {"hydroxymethyl", "CH2OH", 0, NODATA, NODATA, 0, NODATA, 0, NODATA, 0, NODATA, 0, NODATA, NODATA, 0, NODATA},
    {"ethynyl", "C2H", 0, NODATA, NODATA, 0, NODATA, 0, NODATA, 0, NODATA, 0, NODATA, NODATA, 0, NODATA},
    {"vinyl", "C2H3", 0, NODATA, NODATA, 0, NODATA, 0, NODATA, 0, NODATA, 0, NODATA, NODATA, 0, NODATA},
    {"ethyl", "C2H5", 0, NODATA, NODATA, 0, NODATA, 0, NODATA, 0, NODATA, 0, NODATA, NODATA, 0, NODATA},
    {"ketenyl", "HCCO", 0, NODATA, NODATA, 0, NODATA, 0, NODATA, 0, NODATA, 0, NODATA, NODATA, 0, NODATA},
    {"cyano", "CN", 0, 3.856, 75.0, 'S', NODATA, 0, NODATA, 0, NODATA, 0, NODATA, NODATA, 0, NODATA},
    {"imidogen", "NH", 0, NODATA, NODATA, 0, NODATA, 0, NODATA, 0, NODATA, 0, NODATA, NODATA, 0, NODATA},
    {"amidogen", "NH2", 0, NODATA, NODATA, 0, NODATA, 0, NODATA, 0, NODATA, 0, NODATA, NODATA, 0, NODATA},
    {"nitroxyl", "HNO", 0, NODATA, NODATA, 0, 1.62, 'C', NODATA, 0, NODATA, 0, NODATA, NODATA, 0, NODATA},
    {"diazenyl", "NNH", 0, NODATA, NODATA, 0, NODATA, 0, NODATA, 0, NODATA, 0, NODATA, NODATA, 0, NODATA},
    {"isocyanato", "NCO", 0, NODATA, NODATA, 0, NODATA, 0, NODATA, 0, NODATA, 0, NODATA, NODATA, 0, NODATA},
    /* Stable flame species and light hydrocarbons. */
    {"hydrogen-peroxide", "H2O2", 0, 4.196, 289.3, 'S', 1.57, 'C', (2*3.7+2*7.4), 'L', 423.35, 'C', NODATA, NODATA, 0, NODATA},
    {"formaldehyde", "CH2O", 0, NODATA, NODATA, 'B', 2.33, 'C', (14.8+2*3.7+7.4), 'L', 254.05, 'A', 408.0, 65.9, 'A', NODATA},
    {"acetaldehyde", "CH3CHO", 0, NODATA, NODATA, 'B', 2.75, 'C', (2*14.8+4*3.7+7.4), 'L', 294.0, 'A', 466.0, 55.7, 'A', NODATA},
    {"ketene", "CH2CO", 0, NODATA, NODATA, 0, 1.42, 'C', NODATA, 0, 217.0, 'C', NODATA, NODATA, 0, NODATA},
    {"hydrogen-cyanide", "HCN", 0, 3.630, 569.1, 'S', 2.98, 'C', NODATA, 0, 298.85, 'A', 456.7, 53.9, 'A', NODATA},
    {"nitrogen-dioxide", "NO2", 0, NODATA, NODATA, 'B', 0.316, 'C', NODATA, 0, 294.3, 'A', 431.35, 101.3, 'A', NODATA},
    {"ozone", "O3", 0, NODATA, NODATA, 'B', 0.53, 'C', NODATA, 0, 161.85, 'A', 261.0, 55.7, 'A', NODATA},
    {"propyne", "CH3CCH", 0, 4.761, 251.8, 'S', 0.78, 'C', (3*14.8+4*3.7), 'L', 249.94, 'A', 402.4, 56.3, 'A', NODATA},
    {"1,3-butadiene", "CH2CHCHCH2", 0, NODATA, NODATA, 'B', 0.0, 'Z', (4*14.8+6*3.7), 'L', 268.74, 'A', 425.0, 43.2, 'A', NODATA},
    {"1-butene", "CH2CHCH2CH3", 0, NODATA, NODATA, 'B', 0.34, 'C', (4*14.8+8*3.7), 'L', 266.92, 'A', 419.5, 40.2, 'A', NODATA},
    {"isobutylene", "(CH3)2CCH2", 0, NODATA, NODATA, 'B', 0.50, 'C', (4*14.8+8*3.7), 'L', 266.25, 'A', 417.9, 40.0, 'A', NODATA},
    {"cyclopropane", "(CH2)3", 0, 4.807, 248.9, 'S', 0.0, 'Z', (3*14.8+6*3.7-6.0), 'L', 240.34, 'A', 398.0, 55.4, 'A', NODATA},
    {"isopentane", "(CH3)2CHCH2CH3", 0, NODATA, NODATA, 'B', 0.1, 'A', (5*14.8+12*3.7), 'L', 301.0, 'A', 460.4, 33.8, 'A', 1.0},
    {"neopentane", "C(CH3)4", 0, 6.464, 193.4, 'S', 0.0, 'Z', (5*14.8+12*3.7), 'L', 282.65, 'A', 433.8, 31.99, 'A', NODATA},
    {"dimethyl-ether", "CH3OCH3", 0, 4.307, 395.0, 'S', 1.3, 'A', NODATA, 0, 248.31, 'A', 400.1, 53.7, 'A', NODATA},
    /* CVD and etch gases, precursors and products. Si, W, Ga, Al, B, P,
     * As, Hg and U have no Fuller increment: V unknown. */
    {"silane", "SiH4", 0, 4.084, 207.6, 'S', 0.0, 'Z', NODATA, 0, 161.0, 'A', 269.7, 48.4, 'A', NODATA},
    {"disilane", "Si2H6", 0, NODATA, NODATA, 0, 0.0, 'Z', NODATA, 0, 259.0, 'C', NODATA, NODATA, 0, NODATA},
    {"dichlorosilane", "SiH2Cl2", 0, NODATA, NODATA, 'B', 1.17, 'C', NODATA, 0, 281.5, 'C', 452.0, 45.5, 'M', NODATA},
    {"trichlorosilane", "SiHCl3", 0, NODATA, NODATA, 'B', 0.86, 'C', NODATA, 0, 304.95, 'C', 474.2, 39.29, 'E', NODATA},
    {"silicon-tetrachloride", "SiCl4", 0, NODATA, NODATA, 'B', 0.0, 'Z', NODATA, 0, 330.8, 'A', 507.0, 35.93, 'A', NODATA},
    {"silicon-tetrafluoride", "SiF4", 0, 4.880, 171.9, 'S', 0.0, 'Z', NODATA, 0, NODATA, 0, 259.0, 37.2, 'A', NODATA},
    {"tungsten-hexafluoride", "WF6", 0, NODATA, NODATA, 0, 0.0, 'Z', NODATA, 0, 290.25, 'C', NODATA, NODATA, 0, NODATA},
    {"teos", "Si(OC2H5)4", 0, NODATA, NODATA, 0, NODATA, 0, NODATA, 0, 441.15, 'C', NODATA, NODATA, 0, NODATA},
    {"trimethylgallium", "Ga(CH3)3", 0, NODATA, NODATA, 0, 0.0, 'Z', NODATA, 0, 328.85, 'C', NODATA, NODATA, 0, NODATA},
    {"trimethylaluminium", "Al(CH3)3", 0, NODATA, NODATA, 0, 0.0, 'Z', NODATA, 0, 398.15, 'C', NODATA, NODATA, 0, NODATA},
    {"phosphine", "PH3", 0, 3.981, 251.5, 'S', 0.574, 'C', NODATA, 0, 185.45, 'A', 324.8, 65.4, 'A', NODATA},
    {"arsine", "AsH3", 0, 4.145, 259.8, 'S', 0.217, 'C', NODATA, 0, 210.65, 'C', NODATA, NODATA, 0, NODATA},
    {"diborane", "B2H6", 0, NODATA, NODATA, 0, 0.0, 'Z', NODATA, 0, 180.65, 'C', NODATA, NODATA, 0, NODATA},
    {"boron-trichloride", "BCl3", 0, 5.127, 337.7, 'S', 0.0, 'Z', NODATA, 0, 285.75, 'C', NODATA, NODATA, 0, NODATA},
    {"boron-trifluoride", "BF3", 0, 4.198, 186.3, 'S', 0.0, 'Z', NODATA, 0, 172.85, 'C', 260.8, 49.9, 'A', NODATA},
    {"nitrogen-trifluoride", "NF3", 0, NODATA, NODATA, 'B', 0.235, 'C', NODATA, 0, 144.15, 'A', 234.0, 44.6, 'A', NODATA},
    {"carbon-tetrafluoride", "CF4", 0, 4.662, 134.0, 'S', 0.0, 'A', (14.8+4*8.7), 'L', 145.1, 'A', 227.6, 37.4, 'A', NODATA},
    {"hexafluoroethane", "CF3CF3", 0, NODATA, NODATA, 'B', 0.0, 'Z', (2*14.8+6*8.7), 'L', 195.06, 'W', 293.03, 30.48, 'W', NODATA},
    {"hydrogen-bromide", "HBr", 0, 3.353, 449.0, 'S', 0.83, 'C', (3.7+27.0), 'L', 206.45, 'A', 363.2, 85.5, 'A', NODATA},
    {"hydrogen-iodide", "HI", 0, 4.211, 288.7, 'S', 0.45, 'C', (3.7+37.0), 'L', 237.6, 'A', 424.0, 83.1, 'A', NODATA},
    {"fluorine", "F2", 0, 3.357, 112.6, 'S', 0.0, 'A', (2*8.7), 'L', 85.03, 'A', 144.3, 52.2, 'A', NODATA},
    {"iodine", "I2", 0, 5.160, 474.2, 'S', 0.0, 'A', (2*37.0), 'L', 457.5, 'A', 819.0, 116.5, 'A', NODATA},
    {"hydrazine", "N2H4", 0, NODATA, NODATA, 'B', 1.75, 'C', NODATA, 0, 386.7, 'A', 653.0, 147.0, 'A', NODATA},
    {"mercury", "Hg", 0, 2.969, 750.0, 'S', 0.0, 'Z', NODATA, 0, 629.9, 'A', NODATA, NODATA, 0, NODATA},
    {"uranium-hexafluoride", "UF6", 0, 5.967, 236.8, 'S', 0.0, 'Z', NODATA, 0, NODATA, 0, 505.8, 46.6, 'A', NODATA},
    /* Other inorganic gases. */
    {"carbonyl-sulfide", "COS", 0, 4.130, 336.0, 'S', 0.715, 'C', (14.8+7.4+25.6), 'L', 222.9, 'A', 378.8, 63.5, 'A', NODATA},
    {"carbon-disulfide", "CS2", 0, 4.483, 467.0, 'S', 0.0, 'A', (14.8+2*25.6), 'L', 319.37, 'A', 552.0, 79.0, 'A', 1.0},
    {"cyanogen", "NCCN", 0, 4.361, 348.6, 'S', 0.0, 'Z', NODATA, 0, 252.0, 'A', 400.0, 59.8, 'A', NODATA},
    {"nitrosyl-chloride", "NOCl", 0, 4.112, 395.3, 'S', 1.90, 'C', NODATA, 0, 267.65, 'C', 440.0, 91.2, 'A', NODATA},
    {"phosgene", "COCl2", 0, NODATA, NODATA, 'B', 1.17, 'C', (14.8+7.4+2*24.6), 'L', 280.71, 'A', 455.0, 56.7, 'A', NODATA},
    {"sulfur-trioxide", "SO3", 0, NODATA, NODATA, 'B', 0.0, 'Z', (25.6+3*7.4), 'L', 317.9, 'A', 491.0, 82.1, 'A', NODATA},
    /* Chlorinated hydrocarbons. */
    {"methyl-chloride", "CH3Cl", 0, 4.182, 350.0, 'S', 1.9, 'A', (14.8+3*3.7+24.6), 'L', 249.06, 'A', 416.25, 66.8, 'A', NODATA},
    {"methyl-bromide", "CH3Br", 0, 4.118, 449.2, 'S', 1.8, 'A', (14.8+3*3.7+27.0), 'L', 276.71, 'A', NODATA, NODATA, 0, NODATA},
    {"ethyl-chloride", "C2H5Cl", 0, 4.898, 300.0, 'S', 2.0, 'A', (2*14.8+5*3.7+24.6), 'L', 285.42, 'A', 460.4, 52.7, 'A', NODATA},
    {"vinyl-chloride", "CH2CHCl", 0, NODATA, NODATA, 'B', 1.45, 'C', (2*14.8+3*3.7+24.6), 'L', 259.78, 'A', 432.0, 56.7, 'A', NODATA},
    {"1,2-dichloroethane", "CH2ClCH2Cl", 0, NODATA, NODATA, 'B', 1.8, 'A', (2*14.8+4*3.7+2*24.6), 'L', 356.59, 'A', 561.0, 53.7, 'A', 1.0},
    {"trichloroethylene", "CHClCCl2", 0, NODATA, NODATA, 'B', 0.8, 'A', (2*14.8+3.7+3*24.6), 'L', 360.36, 'A', 571.0, 49.1, 'A', 1.0},
    {"tetrachloroethylene", "CCl2CCl2", 0, NODATA, NODATA, 'B', 0.0, 'A', (2*14.8+4*24.6), 'L', 394.4, 'A', 620.0, 47.6, 'A', 1.0},
    {"chlorobenzene", "C6H5Cl", 1, NODATA, NODATA, 'B', 1.6, 'A', (6*14.8+5*3.7+24.6-15.0), 'L', 404.87, 'A', 632.4, 45.2, 'A', 1.0},
    /* Refrigerants (ASHRAE numbers as names; synonyms in lookup.c). */
    {"r11", "CCl3F", 0, NODATA, NODATA, 'B', 0.46, 'C', (14.8+3*24.6+8.7), 'L', 296.86, 'W', 471.11, 44.08, 'W', NODATA},
    {"r12", "CCl2F2", 0, 5.25, 253.0, 'S', 0.51, 'C', (14.8+2*24.6+2*8.7), 'L', 243.4, 'W', 385.12, 41.36, 'W', NODATA},
    {"r13", "CClF3", 0, NODATA, NODATA, 'B', 0.50, 'C', (14.8+24.6+3*8.7), 'L', 191.7, 'W', 302.0, 38.79, 'W', NODATA},
    {"r23", "CHF3", 0, NODATA, NODATA, 'B', 1.65, 'C', (14.8+3.7+3*8.7), 'L', 191.13, 'W', 299.29, 48.32, 'W', NODATA},
    {"r41", "CH3F", 0, NODATA, NODATA, 'B', 1.85, 'C', (14.8+3*3.7+8.7), 'L', 194.84, 'W', 317.28, 58.97, 'W', NODATA},
    {"r113", "CCl2FCClF2", 0, NODATA, NODATA, 'B', NODATA, 0, (2*14.8+3*24.6+3*8.7), 'L', 320.74, 'W', 487.21, 33.92, 'W', NODATA},
    {"r114", "CClF2CClF2", 0, NODATA, NODATA, 'B', NODATA, 0, (2*14.8+2*24.6+4*8.7), 'L', 276.74, 'W', 418.83, 32.57, 'W', NODATA},
    {"r115", "CClF2CF3", 0, NODATA, NODATA, 'B', NODATA, 0, (2*14.8+24.6+5*8.7), 'L', 233.9, 'W', 353.1, 31.2, 'W', NODATA},
    {"r123", "CHCl2CF3", 0, NODATA, NODATA, 'B', 1.36, 'C', (2*14.8+3.7+2*24.6+3*8.7), 'L', 300.97, 'W', 456.83, 36.62, 'W', NODATA},
    {"r124", "CHClFCF3", 0, NODATA, NODATA, 'B', 1.47, 'C', (2*14.8+3.7+24.6+4*8.7), 'L', 261.19, 'W', 395.43, 36.24, 'W', NODATA},
    {"r125", "CHF2CF3", 0, NODATA, NODATA, 'B', 1.56, 'C', (2*14.8+3.7+5*8.7), 'L', 225.06, 'W', 339.17, 36.18, 'W', NODATA},
    {"r141b", "CH3CCl2F", 0, NODATA, NODATA, 'B', 2.01, 'C', (2*14.8+3*3.7+2*24.6+8.7), 'L', 305.2, 'W', 477.5, 42.12, 'W', NODATA},
    {"r142b", "CH3CClF2", 0, NODATA, NODATA, 'B', 2.14, 'C', (2*14.8+3*3.7+24.6+2*8.7), 'L', 264.03, 'W', 410.26, 40.55, 'W', NODATA},
    {"r143a", "CH3CF3", 0, NODATA, NODATA, 'B', 2.34, 'C', (2*14.8+3*3.7+3*8.7), 'L', 225.91, 'W', 345.86, 37.61, 'W', NODATA},
    {"r152a", "CH3CHF2", 0, NODATA, NODATA, 'B', 2.26, 'C', (2*14.8+4*3.7+2*8.7), 'L', 249.13, 'W', 386.41, 45.17, 'W', NODATA},
    {"r218", "CF3CF2CF3", 0, NODATA, NODATA, 'B', NODATA, 0, (3*14.8+8*8.7), 'L', 236.36, 'W', 345.02, 26.4, 'W', NODATA},
    {"rc318", "(CF2)4", 0, NODATA, NODATA, 'B', 0.0, 'Z', (4*14.8+8*8.7-8.5), 'L', 267.18, 'W', 388.38, 27.78, 'W', NODATA},
    {"r227ea", "CF3CHFCF3", 0, NODATA, NODATA, 'B', NODATA, 0, (3*14.8+3.7+7*8.7), 'L', 256.81, 'W', 374.9, 29.25, 'W', NODATA},
    {"r245fa", "CHF2CH2CF3", 0, NODATA, NODATA, 'B', NODATA, 0, (3*14.8+3*3.7+5*8.7), 'L', 288.29, 'W', 427.01, 36.51, 'W', NODATA},
    {"r1234yf", "CH2CFCF3", 0, NODATA, NODATA, 'B', NODATA, 0, (3*14.8+2*3.7+4*8.7), 'L', 243.67, 'W', 367.85, 33.82, 'W', NODATA},
    {"r1234ze-e", "CHFCHCF3", 0, NODATA, NODATA, 'B', NODATA, 0, (3*14.8+2*3.7+4*8.7), 'L', 254.18, 'W', 382.51, 36.35, 'W', NODATA},
    /* Solvents. */
    {"n-nonane", "C9H20", 0, NODATA, NODATA, 'B', 0.0, 'A', (9*14.8+20*3.7), 'L', 423.97, 'A', 594.6, 22.9, 'A', 1.0},
    {"n-decane", "C10H22", 0, NODATA, NODATA, 'B', 0.0, 'A', (10*14.8+22*3.7), 'L', 447.3, 'A', 617.7, 21.1, 'A', 1.0},
    {"n-dodecane", "C12H26", 0, NODATA, NODATA, 'B', 0.0, 'A', (12*14.8+26*3.7), 'L', 489.47, 'A', 658.0, 18.2, 'A', 1.0},
    {"isooctane", "(CH3)3CCH2CH(CH3)2", 0, NODATA, NODATA, 'B', 0.0, 'A', (8*14.8+18*3.7), 'L', 372.39, 'A', 543.8, 25.7, 'A', 1.0},
    {"methylcyclohexane", "C6H11CH3", 0, NODATA, NODATA, 'B', 0.0, 'A', (7*14.8+14*3.7-15.0), 'L', 374.09, 'A', 572.1, 34.8, 'A', 1.0},
    {"o-xylene", "C6H4(CH3)2", 1, NODATA, NODATA, 'B', 0.5, 'A', (8*14.8+10*3.7-15.0), 'L', 417.59, 'A', 630.3, 37.3, 'A', 1.0},
    {"m-xylene", "C6H4(CH3)2", 1, NODATA, NODATA, 'B', 0.3, 'A', (8*14.8+10*3.7-15.0), 'L', 412.34, 'A', 617.0, 35.4, 'A', 1.0},
    {"p-xylene", "C6H4(CH3)2", 1, NODATA, NODATA, 'B', 0.0, 'A', (8*14.8+10*3.7-15.0), 'L', 411.53, 'A', 616.2, 35.1, 'A', 1.0},
    {"ethylbenzene", "C6H5C2H5", 1, NODATA, NODATA, 'B', 0.4, 'A', (8*14.8+10*3.7-15.0), 'L', 409.36, 'A', 617.2, 36.0, 'A', 1.0},
    {"styrene", "C6H5CHCH2", 1, NODATA, NODATA, 'B', 0.1, 'A', (8*14.8+8*3.7-15.0), 'L', 418.3, 'A', 636.0, 38.4, 'A', 1.0},
    {"naphthalene", "C10H8", 2, NODATA, NODATA, 'B', 0.0, 'A', (10*14.8+8*3.7-30.0), 'L', 491.16, 'A', 748.4, 40.5, 'A', NODATA},
    {"phenol", "C6H5OH", 1, NODATA, NODATA, 'B', 1.6, 'A', (6*14.8+6*3.7+7.4-15.0), 'L', 455.02, 'A', 694.25, 61.3, 'A', NODATA},
    {"1-butanol", "C4H9OH", 0, NODATA, NODATA, 'B', 1.8, 'A', (4*14.8+10*3.7+7.4), 'L', 390.81, 'A', 563.1, 44.2, 'A', NODATA},
    {"2-propanol", "(CH3)2CHOH", 0, NODATA, NODATA, 'B', 1.7, 'A', (3*14.8+8*3.7+7.4), 'L', 355.41, 'A', 508.3, 47.6, 'A', NODATA},
    {"acetic-acid", "CH3COOH", 0, NODATA, NODATA, 'B', 1.3, 'A', NODATA, 0, 391.04, 'A', 592.0, 57.9, 'A', NODATA},
    {"formic-acid", "HCOOH", 0, NODATA, NODATA, 'B', 1.5, 'A', NODATA, 0, 373.71, 'A', 588.0, 58.1, 'A', NODATA},
    {"acetonitrile", "CH3CN", 0, NODATA, NODATA, 'B', 3.5, 'A', NODATA, 0, 354.81, 'A', 545.5, 48.3, 'A', NODATA},
    {"methyl-ethyl-ketone", "CH3COC2H5", 0, NODATA, NODATA, 'B', 3.3, 'A', (4*14.8+8*3.7+7.4), 'L', 352.74, 'A', 535.5, 41.5, 'A', 1.0},
    {"tetrahydrofuran", "(CH2)4O", 1, NODATA, NODATA, 'B', 1.7, 'A', NODATA, 0, 339.12, 'A', 540.1, 51.9, 'A', 1.0},
    {"1,4-dioxane", "C4H8O2", 1, NODATA, NODATA, 'B', 0.4, 'A', NODATA, 0, 374.47, 'A', 587.0, 52.1, 'A', 1.0},
    {"dimethylformamide", "HCON(CH3)2", 0, NODATA, NODATA, 'B', 3.8, 'A', NODATA, 0, 426.0, 'A', 649.6, 44.2, 'A', NODATA},
    {"dimethyl-sulfoxide", "(CH3)2SO", 0, NODATA, NODATA, 'B', 3.96, 'C', NODATA, 0, 462.15, 'A', 729.0, 56.5, 'A', NODATA},
    {"aniline", "C6H5NH2", 1, NODATA, NODATA, 'B', 1.6, 'A', NODATA, 0, 457.17, 'A', 699.0, 53.1, 'A', NODATA},
    {"nitromethane", "CH3NO2", 0, NODATA, NODATA, 'B', 3.1, 'A', NODATA, 0, 374.35, 'A', 588.0, 63.1, 'A', NODATA},
    {"methylamine", "CH3NH2", 0, NODATA, NODATA, 'B', 1.3, 'A', NODATA, 0, 266.82, 'A', 430.05, 74.6, 'A', NODATA},
    {"dimethylamine", "(CH3)2NH", 0, NODATA, NODATA, 'B', 1.0, 'A', NODATA, 0, 280.03, 'A', 437.2, 53.4, 'A', NODATA},
    {"trimethylamine", "(CH3)3N", 0, NODATA, NODATA, 'B', 0.6, 'A', NODATA, 0, 276.02, 'A', 433.25, 40.9, 'A', NODATA},
    {"ethylene-oxide", "(CH2)2O", 1, NODATA, NODATA, 'B', 1.9, 'A', NODATA, 0, 283.85, 'A', 469.0, 71.9, 'A', NODATA},
    {"ethylene-glycol", "HOCH2CH2OH", 0, NODATA, NODATA, 'B', 2.2, 'A', (2*14.8+6*3.7+2*7.4), 'L', 470.45, 'A', 720.0, 82.0, 'A', NODATA},
    {"methanethiol", "CH3SH", 0, NODATA, NODATA, 'B', 1.3, 'A', (14.8+4*3.7+25.6), 'L', 279.11, 'A', 469.95, 72.3, 'A', NODATA},
};
/* clang-format on */

#define N_ROWS (sizeof table / sizeof table[0])

size_t mcdi_builtin_count(void) { return N_ROWS; }

/* Source text of a one-letter source code of the tables above. */
static const char *source_of(char kind)
{
    switch (kind) {
    case 'S': return SRC_LJ_S;
    case 'H': return SRC_LJ_H;
    case 'B': return SRC_LJ_B;
    case 'A': return SRC_PPO;
    case 'C': return SRC_CRC;
    case 'W': return SRC_WEBBOOK;
    case 'R': return SRC_CRIT_AIR;
    case 'M': return SRC_CRIT_DCS;
    case 'E': return SRC_CRIT_TCS;
    default: return NULL;
    }
}

static void set(mcdi_species *s, mcd_param p, double v, const char *src)
{
    if (!isnan(v) && src != NULL) {
        s->p[p] = v;
        s->src[p] = src;
    }
}

/* Fill record i: M and V from the formula as mcd_db_add does (the table's
 * formulas all parse; test species_builtin_* checks every row), then the
 * tabulated parameters with their sources. */
void mcdi_builtin_fill(size_t i, mcdi_species *s)
{
    const row *r = &table[i];
    int k;
    if (mcdi_species_from_formula(r->name, r->formula, r->n_rings, s) !=
        MCD_OK) {
        /* Not reached for the table's rows; keep the record well formed. */
        memset(s, 0, sizeof *s);
        memcpy(s->name, r->name, strlen(r->name) + 1);
        memcpy(s->formula, r->formula, strlen(r->formula) + 1);
        for (k = 0; k < MCD_PARAM_COUNT; ++k) {
            s->p[k] = NODATA;
            s->src[k] = NULL;
        }
    }
    mcdi_err_clear(); /* the formula's notes are not the caller's errors */
    if (r->lj_kind == 'B') {
        /* Bird, Stewart and Lightfoot (2002) eqs. 1.4-11, 1.4-13. */
        double Pc_atm = r->Pc_bar * BAR / MCD_ATM;
        set(s, MCD_PARAM_LJ_EPS_K, 0.77 * r->Tc, SRC_LJ_B);
        set(s, MCD_PARAM_LJ_SIGMA, 2.44 * cbrt(r->Tc / Pc_atm) * 1e-10,
            SRC_LJ_B);
    } else {
        set(s, MCD_PARAM_LJ_SIGMA, r->sigma_A * 1e-10, source_of(r->lj_kind));
        set(s, MCD_PARAM_LJ_EPS_K, r->eps_k, source_of(r->lj_kind));
    }
    set(s, MCD_PARAM_DIPOLE, r->dip_D * DEBYE,
        r->dip_kind == 'A'   ? SRC_DIP_A
        : r->dip_kind == 'C' ? SRC_DIP_C
        : r->dip_kind == 'Z' ? SRC_DIP_Z
                             : NULL);
    set(s, MCD_PARAM_VB, r->Vb_cm3 * 1e-6,
        r->Vb_kind == 'T'   ? SRC_VB_T
        : r->Vb_kind == 'L' ? SRC_VB_L
                            : NULL);
    set(s, MCD_PARAM_TB, r->Tb, source_of(r->Tb_kind));
    set(s, MCD_PARAM_TC, r->Tc, source_of(r->crit_kind));
    set(s, MCD_PARAM_PC, r->Pc_bar * BAR, source_of(r->crit_kind));
    set(s, MCD_PARAM_ASSOC, r->assoc, SRC_ASSOC);
}
