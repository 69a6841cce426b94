#!/usr/bin/env python3
"""The Python API over the whole library: formulas, database, binaries,
compositions, mixtures, fluxes in every model/basis/frame, Fick matrices,
batched fluxes and transfer; results against the C command-line tool and
against identities computed here in plain Python.

Runs with and without numpy (MCDIFF_NO_NUMPY=1): inputs are plain lists,
array.array and (when present) numpy arrays, and must give equal results.
"""

import array
import json
import math
import os
import subprocess
import sys
import unittest

import _support
from _support import Rng, flat, max_abs, max_abs_diff

_support.require_numpy_variant(__name__ == "__main__")

import mcdiff  # noqa: E402
from mcdiff._arrays import np  # noqa: E402

R = 8.31446261815324  # J/(mol K), exact in the 2019 SI (CODATA 2018)
ATM = 101325.0        # Pa, exact by definition


def rows(a):
    """A (nested) result as nested Python lists."""
    return a.tolist() if hasattr(a, "tolist") else a


def matvec(A, v):
    return [sum(a * b for a, b in zip(row, v)) for row in A]


class Formulas(unittest.TestCase):
    def test_molar_mass_from_iupac_weights(self):
        # IUPAC conventional atomic weights C 12.011, H 1.008, O 15.999,
        # Cl 35.45 (common practice); 1e-4 relative covers the choice of
        # conventional value vs interval midpoint.
        cases = {"CH4": 12.011 + 4 * 1.008,
                 "CH3COCH3": 3 * 12.011 + 6 * 1.008 + 15.999,
                 "(CH3)2CO": 3 * 12.011 + 6 * 1.008 + 15.999,
                 "C3H5Cl": 3 * 12.011 + 5 * 1.008 + 35.45}
        for f, g_per_mol in cases.items():
            self.assertAlmostEqual(mcdiff.formula_molar_mass(f) * 1e3 /
                                   g_per_mol, 1.0, delta=1e-4, msg=f)

    def test_elements_merged_in_order_of_appearance(self):
        self.assertEqual(list(mcdiff.formula_elements("CH3(CH2)4CH3").items()),
                         [("C", 6), ("H", 14)])
        self.assertEqual(mcdiff.formula_elements("SF6"), {"S": 1, "F": 6})

    def test_diffusion_volumes(self):
        # Fuller, Ensley and Giddings (1969) as reprinted by Reid, Prausnitz
        # and Poling (1987), Table 11-1, from memory: C 15.9, H 2.31, ring
        # -18.3; N2 18.5 tabulated. Sums of four numbers: 1e-12 relative.
        v = mcdiff.formula_diffusion_volume("C6H6", 1)
        self.assertAlmostEqual(v, 6 * 15.9 + 6 * 2.31 - 18.3, delta=1e-12 * v)
        self.assertEqual(mcdiff.formula_molecule_volume("N2"), 18.5)
        with self.assertRaises(mcdiff.NotFoundError):
            mcdiff.formula_molecule_volume("C6H6")
        with self.assertRaises(mcdiff.NoDataError):
            mcdiff.formula_diffusion_volume("SiH4")

    def test_elements(self):
        self.assertEqual(mcdiff.element_symbol(1), "H")
        self.assertEqual(mcdiff.element_symbol(118), "Og")
        self.assertIsNone(mcdiff.element_symbol(0))
        self.assertAlmostEqual(mcdiff.element_weight(6), 12.011e-3,
                               delta=1e-6)
        with self.assertRaises(mcdiff.NotFoundError):
            mcdiff.element_weight(200)
        with self.assertRaises(mcdiff.ParseError):
            mcdiff.formula_elements("c6h6")
        with self.assertRaises(TypeError):
            mcdiff.formula_molar_mass(12)


class DatabaseTests(unittest.TestCase):
    def setUp(self):
        self.db = mcdiff.Database.builtin()

    def tearDown(self):
        self.db.close()

    def test_builtin_table_and_lookup(self):
        db = self.db
        self.assertGreaterEqual(len(db), 40)
        i = db.find("Nitrogen")
        self.assertEqual(db.name(i), "nitrogen")
        self.assertEqual(db.formula(i), "N2")
        self.assertEqual(db.find("N2"), i)       # unique formula
        self.assertEqual(db.index("nitrogen"), i)
        self.assertIn("nitrogen", db)
        self.assertNotIn("unobtainium", db)
        self.assertEqual(list(db), db.names)
        with self.assertRaises(IndexError):
            db.name(len(db))

    def test_params_sources_units(self):
        db = self.db
        p = db.params("nitrogen")
        self.assertAlmostEqual(p[mcdiff.Param.MOLAR_MASS], 28.014e-3,
                               delta=1e-6)
        self.assertEqual(db.param("nitrogen", "M"),
                         p[mcdiff.Param.MOLAR_MASS])
        self.assertEqual(db.param("nitrogen", mcdiff.Param.LJ_SIGMA),
                         db.param("nitrogen", "sigma"))
        srcs = db.sources("nitrogen")
        self.assertEqual(set(srcs), set(p))
        self.assertTrue(all(srcs.values()))
        self.assertEqual(mcdiff.param_name(mcdiff.Param.LJ_EPS_K), "eps_k")
        self.assertEqual(mcdiff.param_unit(mcdiff.Param.PC), "Pa")
        with self.assertRaises(ValueError):
            db.param("nitrogen", "colour")

    def test_add_set_and_load(self):
        db = mcdiff.Database()
        self.assertEqual(len(db), 0)
        i = db.add("my-gas", "C2H6")
        self.assertEqual(db.formula(i), "C2H6")
        db.set_param(i, "sigma", 4.4e-10)
        self.assertEqual(db.param(i, "sigma"), 4.4e-10)
        self.assertEqual(db.source(i, "sigma"), "user")
        with self.assertRaises(mcdiff.DomainError):
            db.set_param(i, "sigma", -1.0)
        with self.assertRaises(mcdiff.ParseError):
            db.add("bad name!", "C2H6")
        path = os.path.join(_support.TEST_DATA, "species-example.txt")
        db.load_file(path)
        self.assertIn("pyridine", db)
        with open(path, encoding="utf-8") as f:
            text = f.read()
        db2 = mcdiff.Database()
        db2.load_string(text)
        self.assertEqual(db2.names, [n for n in db.names if n != "my-gas"])
        # all or nothing: a bad file leaves the database as it was
        n = len(db2)
        for bad in ("species-bad-unit.txt", "species-duplicate-key.txt",
                    "species-missing-formula.txt"):
            with self.assertRaises(mcdiff.McdError):
                db2.load_file(os.path.join(_support.TEST_DATA, bad))
            self.assertEqual(len(db2), n)
        db.close()
        db2.close()


class Binaries(unittest.TestCase):
    def setUp(self):
        self.db = mcdiff.Database.builtin()

    def tearDown(self):
        self.db.close()

    def test_database_estimates_equal_raw_calls(self):
        db = self.db
        T, P = 320.0, 2.0e5
        a, b = db.find("carbon-dioxide"), db.find("nitrogen")
        pa, pb = db.params(a), db.params(b)
        M, V = mcdiff.Param.MOLAR_MASS, mcdiff.Param.DIFF_VOLUME
        S, E = mcdiff.Param.LJ_SIGMA, mcdiff.Param.LJ_EPS_K
        est = db.binary_gas(a, b, "fsg", T, P)
        self.assertEqual(est.D, mcdiff.binary_fsg(T, P, pa[M], pb[M], pa[V],
                                               pb[V]))
        self.assertEqual(est.rel_err, mcdiff.method_typical_error("fsg"))
        ce = mcdiff.binary_gas(db, a, b, mcdiff.Method.CHAPMAN_ENSKOG, T, P)
        self.assertEqual(ce.D, mcdiff.binary_chapman_enskog(
            T, P, pa[M], pb[M], pa[S], pb[S], pa[E], pb[E]))
        wl = db.binary_gas("carbon-dioxide", "nitrogen", "wilke-lee", T, P)
        self.assertEqual(wl.D, mcdiff.binary_wilke_lee(
            T, P, pa[M], pb[M], pa[S], pb[S], pa[E], pb[E]))
        self.assertIsInstance(est.warnings, mcdiff.EstimateWarning)
        # Brokaw's polar correction: water + air, dipole, Vb, Tb of both
        w, air = db.params("water"), db.params("air")
        Dp, Vb, Tb = (mcdiff.Param.DIPOLE, mcdiff.Param.VB, mcdiff.Param.TB)
        br = db.binary_gas("water", "air", "brokaw", T, P)
        self.assertEqual(br.D, mcdiff.binary_brokaw(
            T, P, w[M], air[M], w[Dp], air[Dp], w[Vb], air[Vb], w[Tb],
            air[Tb]))
        self.assertFalse(br.warnings & mcdiff.EstimateWarning.POLAR)

    def test_mixture_recommended_and_brokaw_pairs(self):
        # MCD_GAS_RECOMMENDED: water (polar) pairs take Brokaw's correction
        # and give the database pair's Brokaw value (same parameters, same
        # expression: equal); nitrogen/air (nonpolar) takes fsg.
        db = self.db
        T, P = 313.15, 101325.0
        names = ["water", "air", "nitrogen"]
        for how in ("recommended", mcdiff.GasMethod.RECOMMENDED, 100):
            mix = db.mixture(names, how)
            self.assertEqual(mix.pair_method(0, 1), mcdiff.Method.BROKAW)
            self.assertEqual(mix.pair_method("nitrogen", "water"),
                             mcdiff.Method.BROKAW)
            self.assertEqual(mix.pair_method(2, 1), mcdiff.Method.FSG)
            D = mix.binaries(T, P)
            self.assertEqual(D[0][1], db.binary_gas("water", "air", "brokaw",
                                                    T, P).D)
            self.assertEqual(D[1][2], db.binary_gas("air", "nitrogen", "fsg",
                                                    T, P).D)
            mix.close()
        # Brokaw as the default and per pair; a given value reads as user
        mix = db.mixture(names, "brokaw")
        self.assertEqual(mix.pair_method(1, 2), mcdiff.Method.BROKAW)
        mix.set_method(1, 2, "recommended")
        self.assertEqual(mix.pair_method(1, 2), mcdiff.Method.FSG)
        mix.set_binary(0, 2, 2.5e-5, T)  # any value: only its method is read
        self.assertEqual(mix.pair_method(2, 0), mcdiff.Method.USER)
        with self.assertRaises(mcdiff.McdError):
            mix.pair_method(1, 1)
        mix.close()
        # a database pair refuses the per-pair choice
        with self.assertRaises(mcdiff.McdError):
            db.binary_gas("water", "air", "recommended", T, P)

    def test_fsg_equation(self):
        # Fuller, Schettler and Giddings (1966): D = 1.00e-3 T^1.75
        # (1/M_A + 1/M_B)^0.5 / (P (V_A^(1/3) + V_B^(1/3))^2) cm^2/s, P in
        # atm, M in g/mol (from memory). Same formula evaluated twice:
        # 1e-12 relative. The bar form of Reid, Prausnitz and Poling (1987,
        # eq. 11-4.4; from memory), 0.00143 T^1.75 / (P M_AB^0.5 (...)^2)
        # with M_AB = 2/(1/M_A + 1/M_B), rounds 1.00e-3 sqrt(2) 1.01325 =
        # 0.001433 to three digits: it agrees to 0.3 %.
        T, P, MA, MB, VA, VB = 300.0, 101325.0, 0.028, 0.044, 18.5, 26.7
        vv = (VA ** (1 / 3) + VB ** (1 / 3)) ** 2
        ref = (1.00e-3 * T ** 1.75 * math.sqrt(1 / (MA * 1e3) +
                                               1 / (MB * 1e3))
               / ((P / ATM) * vv))
        D = mcdiff.binary_fsg(T, P, MA, MB, VA, VB) * 1e4
        self.assertAlmostEqual(D / ref, 1.0, delta=1e-12)
        Mab = 2.0 / (1.0 / (MA * 1e3) + 1.0 / (MB * 1e3))
        ref_bar = 0.00143 * T ** 1.75 / ((P / 1e5) * math.sqrt(Mab) * vv)
        self.assertAlmostEqual(D / ref_bar, 1.0, delta=3e-3)
        # doubling P halves D exactly (1/P law)
        self.assertAlmostEqual(mcdiff.binary_fsg(T, 2 * P, MA, MB, VA, VB) * 2e4,
                               D, delta=1e-15 * D)

    def test_collision_integral_neufeld(self):
        # Neufeld, Janzen and Aziz (1972) constants as reprinted by Reid,
        # Prausnitz and Poling (1987), eq. 11-3.6 (from memory).
        for Ts in (0.3, 0.7, 1.0, 2.5, 10.0, 100.0):
            ref = (1.06036 / Ts ** 0.15610 + 0.19300 / math.exp(0.47635 * Ts)
                   + 1.03587 / math.exp(1.52996 * Ts)
                   + 1.76474 / math.exp(3.89411 * Ts))
            self.assertAlmostEqual(mcdiff.binary_omega_d(Ts), ref,
                                   delta=1e-14 * ref)

    def test_scaling_and_wilke_chang(self):
        D = mcdiff.binary_scale(2e-5, 300.0, ATM, 600.0, 2 * ATM)
        self.assertAlmostEqual(D, 2e-5 * 2 ** 1.75 / 2, delta=1e-18)
        self.assertAlmostEqual(mcdiff.binary_scale(2e-5, 300, ATM, 300, ATM,
                                                   1.5), 2e-5, delta=1e-20)
        # Wilke-Chang: D = 7.4e-8 (phi M_B)^0.5 T / (mu V_A^0.6) cm^2/s with
        # mu in cP, M in g/mol, V in cm^3/mol (Wilke and Chang 1955; from
        # memory); ratio form: D is proportional to sqrt(phi) T / mu.
        d1 = mcdiff.binary_wilke_chang(298.0, 0.89e-3, 0.018, 2.6, 96e-6)
        d2 = mcdiff.binary_wilke_chang(2 * 298.0, 0.89e-3, 0.018, 4 * 2.6, 96e-6)
        self.assertAlmostEqual(d2 / d1, 4.0, delta=1e-12)
        ref = 7.4e-8 * math.sqrt(2.6 * 18.0) * 298.0 / (0.89 * 96 ** 0.6)
        self.assertAlmostEqual(d1 * 1e4 / ref, 1.0, delta=1e-3)
        liq = self.db.binary_liquid("benzene", "water", 298.15, 0.89e-3)
        self.assertGreater(liq.D, 0.0)

    def test_method_names_and_warnings(self):
        for m in mcdiff.Method:
            name = mcdiff.method_name(m)
            self.assertEqual(mcdiff.method_from_name(name.upper()), m)
            self.assertIs(mcdiff.enums.coerce(mcdiff.Method, name,
                                              "method"), m)
        self.assertTrue(math.isnan(mcdiff.method_typical_error("user")))
        self.assertIsNone(mcdiff.method_name(99))
        with self.assertRaises(mcdiff.NotFoundError):
            mcdiff.method_from_name("guess")
        texts = mcdiff.warning_strings(mcdiff.EstimateWarning.POLAR |
                                       mcdiff.EstimateWarning.QUANTUM)
        self.assertEqual(len(texts), 2)
        self.assertTrue(all(texts))
        self.assertIsNone(mcdiff.warning_string(1 << 20))


class Explain(unittest.TestCase):
    """mcd_db_binary_explain and mcd_typical_error_widened from Python."""

    def test_slot_names_follow_the_header(self):
        import re
        from mcdiff import handles
        with open(_support.HEADER) as f:
            text = f.read()
        slots = {int(v): k.lower() for k, v in
                 re.findall(r"#define MCD_EXPLAIN_(\w+) (\d+)", text)
                 if k not in ("RESERVED", "COUNT")}
        count = int(re.search(r"#define MCD_EXPLAIN_COUNT (\d+)", text)[1])
        self.assertEqual(count, handles.EXPLAIN_COUNT)
        self.assertEqual(tuple(slots[k] for k in sorted(slots)),
                         handles.EXPLAIN_SLOTS)

    def test_explain_rebuilds_chapman_enskog(self):
        with mcdiff.Database.builtin() as db:
            est = db.binary_gas("CO2", "N2", "chapman-enskog", 400.0, 2e5)
            v = db.binary_explain("CO2", "N2", "chapman-enskog", 400.0, 2e5)
        self.assertEqual(v["d"], est.D)
        self.assertEqual(v["warn"], est.warnings)
        # Chapman-Enskog in the form 0.002663 T^1.5 / (P_bar M_AB^0.5
        # sigma^2 Omega_D) [cm^2/s] (Poling et al. 2001 eq. 11-3.2, the
        # constant to 4 digits: 2e-4 relative)
        d = 0.002663 * v["t"] ** 1.5 / (v["p"] / 1e5 * math.sqrt(
            1000 * v["m_ab"]) * (1e10 * v["sigma_ab"]) ** 2 * v["omega_d"])
        self.assertAlmostEqual(d * 1e-4 / est.D, 1.0, delta=2e-4)
        self.assertNotIn("v_a", v)

    def test_widened_error(self):
        W = mcdiff.EstimateWarning
        self.assertAlmostEqual(mcdiff.typical_error_widened(
            "fsg", W.HIGH_PRESSURE), 0.108, delta=1e-15)
        self.assertTrue(math.isnan(mcdiff.typical_error_widened("user", 0)))
        with self.assertRaises(mcdiff.InvalidArgumentError):
            mcdiff.typical_error_widened("fsg", 0x80)


class Compositions(unittest.TestCase):
    M = [2.016e-3, 28.014e-3, 44.009e-3, 39.948e-3]

    def test_conversions_agree_with_definitions(self):
        rng = Rng(11)
        for _ in range(50):
            x = rng.composition(4)
            w = flat(mcdiff.x_to_w(self.M, x))
            Mbar = sum(a * b for a, b in zip(x, self.M))
            for i in range(4):
                # a product and a quotient: 4 ulp
                self.assertAlmostEqual(w[i], x[i] * self.M[i] / Mbar,
                                       delta=1e-15)
            # sums of 4 products: a few ulp of ~0.03 (1 ulp = 3.5e-18)
            self.assertAlmostEqual(mcdiff.mean_molar_mass_x(self.M, x), Mbar,
                                   delta=3e-17)
            self.assertAlmostEqual(mcdiff.mean_molar_mass_w(self.M, w), Mbar,
                                   delta=3e-17)
            self.assertLess(max_abs_diff(mcdiff.w_to_x(self.M, w), x), 1e-15)
            c = mcdiff.x_to_c(40.0, x)
            x2, ctot = mcdiff.c_to_x(c)
            self.assertAlmostEqual(ctot, 40.0, delta=1e-13)
            self.assertLess(max_abs_diff(x2, x), 1e-15)

    def test_normalize_and_domain(self):
        y = flat(mcdiff.normalize([0.2, 0.3, 0.5 + 5e-7]))
        self.assertAlmostEqual(sum(y), 1.0, delta=1e-15)
        with self.assertRaises(mcdiff.DomainError):
            mcdiff.normalize([0.2, 0.3, 0.6])
        with self.assertRaises(mcdiff.DomainError):
            mcdiff.normalize([-0.1, 0.5, 0.6])
        with self.assertRaises(mcdiff.InvalidArgumentError):
            mcdiff.normalize([float("nan"), 0.5, 0.5])
        self.assertAlmostEqual(mcdiff.ideal_gas_c(300.0, ATM),
                               ATM / (R * 300.0), delta=1e-12)

    def test_gradient_conversion_is_the_derivative(self):
        # d w / d z from x(z) = x0 + z g by central differences of x_to_w:
        # step 1e-4, error O(h^2) ~ 1e-8 of the gradient.
        rng = Rng(5)
        x0 = rng.composition(4)
        g = [1.0, -2.0, 0.5, 0.5]
        gw = flat(mcdiff.grad_x_to_w(self.M, x0, g))
        h = 1e-4
        wp = flat(mcdiff.x_to_w(self.M, [a + h * b for a, b in zip(x0, g)]))
        wm = flat(mcdiff.x_to_w(self.M, [a - h * b for a, b in zip(x0, g)]))
        fd = [(p - m) / (2 * h) for p, m in zip(wp, wm)]
        self.assertLess(max_abs_diff(gw, fd), 1e-6 * max_abs(fd))
        w0 = flat(mcdiff.x_to_w(self.M, x0))
        back = mcdiff.grad_w_to_x(self.M, w0, [[v, 2 * v] for v in gw])
        self.assertLess(max_abs_diff([r[0] for r in rows(back)], g), 1e-12)
        self.assertLess(max_abs_diff([r[1] for r in rows(back)],
                                     [2 * v for v in g]), 1e-12)

    def test_input_kinds_give_identical_results(self):
        x = [0.1, 0.2, 0.3, 0.4]
        ref = flat(mcdiff.x_to_w(self.M, x))
        kinds = [tuple(x), array.array("d", x), (v for v in x)]
        if np is not None:
            kinds += [np.array(x), np.array([x, x]).T[:, 0],
                      np.array([[v] for v in x])[:, 0]]
        for k in kinds:
            self.assertEqual(flat(mcdiff.x_to_w(self.M, k)), ref)


class MixtureTests(unittest.TestCase):
    NAMES = ["hydrogen", "nitrogen", "carbon-dioxide"]

    def setUp(self):
        self.db = mcdiff.Database.builtin()
        self.mix = mcdiff.Mixture(self.db, self.NAMES)

    def tearDown(self):
        self.mix.close()
        self.db.close()

    def test_binaries_symmetric_with_zero_diagonal(self):
        D = rows(self.mix.binaries(300.0, ATM))
        for i in range(3):
            self.assertEqual(D[i][i], 0.0)
            for j in range(3):
                self.assertEqual(D[i][j], D[j][i])
        self.assertEqual(D[0][1], self.db.binary_gas("hydrogen", "nitrogen",
                                                     "fsg", 300.0, ATM).D)
        det = self.mix.binaries_detail(300.0, ATM)
        self.assertEqual(rows(det.D), D)
        self.assertEqual(det.warnings[0][0], mcdiff.EstimateWarning(0))

    def test_user_binary_scales_as_documented(self):
        self.mix.set_binary("hydrogen", "nitrogen", 7.7e-5, 298.0, ATM)
        D = rows(self.mix.binaries(350.0, 2 * ATM))
        ref = 7.7e-5 * (350.0 / 298.0) ** 1.75 / 2
        self.assertAlmostEqual(D[0][1], ref, delta=1e-14 * ref)
        self.mix.set_method(1, 2, "chapman-enskog")
        self.assertEqual(rows(self.mix.binaries(300.0, ATM))[1][2],
                         self.db.binary_gas("nitrogen", "carbon-dioxide",
                                            "chapman-enskog", 300.0, ATM).D)
        with self.assertRaises(mcdiff.McdError):
            self.mix.set_method(0, 0, "fsg")
        with self.assertRaises(KeyError):
            self.mix.index("argon")

    def test_molar_masses_and_gas_state(self):
        M = flat(self.mix.molar_masses())
        self.assertEqual(M, [self.db.param(n, "M") for n in self.NAMES])
        s = self.mix.gas_state(308.15, ATM)
        self.assertAlmostEqual(s.c, ATM / (R * 308.15), delta=1e-12)
        self.assertEqual(self.mix.names, self.NAMES)
        with self.assertRaises(mcdiff.NotFoundError):
            mcdiff.Mixture(self.db, ["hydrogen", "phlogiston"])
        with self.assertRaises(mcdiff.InvalidArgumentError):
            mcdiff.Mixture(self.db, ["hydrogen", "hydrogen"])

    def test_fluxes_equal_the_command_line_tool(self):
        cli = _support.CLI
        if not cli or not os.path.exists(cli):
            self.skipTest("the mcdiff CLI is not built (MCDIFF_CLI unset)")
        for basis in ("mole", "mass"):
            p = subprocess.run(
                [cli, "fluxes", "-s", ",".join(self.NAMES), "-x",
                 "0.3,0.4,0.3", "-T", "35C", "-P", "1atm", "-g", "1,0,-1",
                 "-g", "0,1,-1", "--basis", basis, "--json"],
                capture_output=True, text=True, timeout=60)
            self.assertEqual(p.returncode, 0, p.stderr)
            ref = json.loads(p.stdout)
            J = self.mix.fluxes(ref["T"], ref["P"], [0.3, 0.4, 0.3],
                                [[1, 0], [0, 1], [-1, -1]], flux_basis=basis)
            # same C code on the same inputs; the JSON carries 17 digits:
            # 1e-15 of the largest flux covers the decimal round trip.
            scale = max_abs(ref["fluxes"])
            self.assertLess(max_abs_diff(J, ref["fluxes"]), 1e-15 * scale)
            s = self.mix.gas_state(ref["T"], ref["P"])
            self.assertAlmostEqual(s.c, ref["c"], delta=1e-15 * s.c)
            self.assertLess(max_abs_diff(s.D, ref["binary_D"]), 1e-20)
            F = self.mix.fick_matrix(ref["T"], ref["P"], [0.3, 0.4, 0.3],
                                     basis=basis)
            self.assertEqual(self.NAMES[F.dependent], ref["fick_dependent"])
            self.assertLess(max_abs_diff(F.D, ref["fick_matrix"]),
                            1e-15 * max_abs(ref["fick_matrix"]))


def random_state(rng, n):
    return rng.dij(n), 20.0 + 30.0 * rng.uniform(), rng.composition(n)


def random_grad(rng, n, nd):
    return [[rng.uniform(-10, 10) for _ in range(nd)] for _ in range(n)]


class Fluxes(unittest.TestCase):
    M = [2.016e-3, 28.014e-3, 44.009e-3, 39.948e-3, 16.043e-3, 4.0026e-3]

    def test_identities_over_random_states(self):
        rng = Rng(2024)
        worst = {}

        def note(k, v):
            worst[k] = max(worst.get(k, 0.0), v)

        for trial in range(60):
            n = 2 + trial % 5
            nd = 1 + trial % 3
            D, c, x = random_state(rng, n)
            g = random_grad(rng, n, nd)
            M = self.M[:n]
            J = rows(mcdiff.flux_compute(D, c, x, g, M=M))
            scale = max_abs(J)
            # zero sum over species (8 eps of the sum of |J|)
            for d in range(nd):
                s = sum(J[i][d] for i in range(n))
                note("zero-sum", abs(s) / scale)
                self.assertLessEqual(abs(s), 8 * 2.2e-16 *
                                     sum(abs(J[i][d]) for i in range(n)))
            # Fick matrix fluxes equal the direct ones when gradients sum to
            # zero (project the random gradients first)
            gz = [[g[i][d] - x[i] * sum(g[k][d] for k in range(n))
                   for d in range(nd)] for i in range(n)]
            Jz = rows(mcdiff.flux_compute(D, c, x, gz, M=M))
            F = mcdiff.fick_matrix(D, x, M=M)
            Jf = mcdiff.fick_fluxes(F.D, F.dependent, c, gz)
            note("fick", max_abs_diff(Jf, Jz) / max_abs(Jz))
            self.assertLess(max_abs_diff(Jf, Jz), 1e-11 * max_abs(Jz))
            # mass basis = conversion of the molar fluxes
            jm = mcdiff.flux_compute(D, c, x, g, M=M, flux_basis="mass")
            jc = mcdiff.flux_convert(M, x, J, "mole", "mass")
            note("convert", max_abs_diff(jm, jc) / max_abs(jc))
            self.assertLess(max_abs_diff(jm, jc), 1e-12 * max_abs(jc))
            back = mcdiff.flux_convert(M, x, jc, "mass", "mole")
            self.assertLess(max_abs_diff(back, J), 1e-12 * scale)
            # same basis copies
            self.assertEqual(flat(mcdiff.flux_convert(M, x, J, "mole",
                                                      "mole")), flat(J))
            # ideal gas: volume frame = molar frame (Vbar_i = 1/c)
            JV = mcdiff.flux_to_volume_frame(c, x, [1 / c] * n, J)
            self.assertLess(max_abs_diff(JV, J), 1e-14 * scale)
            # species frame: J^k_k = 0, J^k_i = J_i - x_i J_k / x_k
            k = trial % n
            Jk = rows(mcdiff.flux_to_species_frame(x, J, k))
            for i in range(n):
                for d in range(nd):
                    ref = J[i][d] - x[i] * J[k][d] / x[k]
                    self.assertAlmostEqual(Jk[i][d], ref,
                                           delta=1e-13 * (scale + abs(ref)))
            self.assertEqual(max_abs(Jk[k]), 0.0)
            # velocity difference v - u = sum M_k J_k / (c Mbar)
            vu = flat(mcdiff.flux_velocity_difference(M, c, x, J))
            Mbar = sum(a * b for a, b in zip(x, M))
            for d in range(nd):
                ref = sum(M[i] * J[i][d] for i in range(n)) / (c * Mbar)
                self.assertAlmostEqual(vu[d], ref,
                                       delta=1e-12 * max(abs(ref), 1e-30) +
                                       1e-13 * scale * max(M) / (c * Mbar))
        print("\n  identities: worst relative differences %s"
              % ", ".join("%s %.1e" % kv for kv in sorted(worst.items())))

    def test_thermal_diffusion_binary_law_and_batch(self):
        # J_1 = -c D_12 (grad x_1 + k_T grad ln T) (Bird, Stewart and
        # Lightfoot 2002, sec. 24.2; from memory), k_T from D^T by
        # k_T = rho D_1^T / (c^2 M_1 M_2 D_12) (same source)
        D = [[0, 7.3e-5], [7.3e-5, 0]]
        M = [0.004, 0.040]
        x = [0.4, 0.6]
        c = 41.6
        kT = flat(mcdiff.thermal_ratios(D, c, x, M, [3e-6, -3e-6]))
        rho = c * (x[0] * M[0] + x[1] * M[1])
        want = rho * 3e-6 / (c * c * M[0] * M[1] * 7.3e-5)
        self.assertAlmostEqual(kT[0], want, delta=1e-13 * want)
        self.assertAlmostEqual(kT[1], -want, delta=1e-13 * want)
        J = flat(mcdiff.flux_compute(D, c, x, [5.0, -5.0], kT=kT,
                                     grad_lnT=[20.0]))
        ref = -c * 7.3e-5 * (5.0 + kT[0] * 20.0)
        self.assertAlmostEqual(J[0], ref, delta=1e-13 * abs(ref))
        # the batched call takes per-cell k_T (N, K) and grad ln T (K,)
        K = 3
        Jb = flat(mcdiff.flux_batch_dij(
            [[[0] * K, [7.3e-5] * K], [[7.3e-5] * K, [0] * K]], [c] * K,
            [[x[0]] * K, [x[1]] * K], [[5.0] * K, [-5.0] * K],
            kT=[[kT[0]] * K, [kT[1]] * K], grad_lnT=[20.0] * K))
        for k in range(K):
            self.assertAlmostEqual(Jb[k], ref, delta=1e-13 * abs(ref))
        with self.assertRaises(mcdiff.InvalidArgumentError) as e:
            mcdiff.flux_compute(D, c, x, [5.0, -5.0], kT=kT)
        self.assertIn("grad_lnT", str(e.exception))

    def test_flux_jacobian_two_species_pressure_diffusion(self):
        # J_1 = -c D (grad x_1 + (x_1 - w_1) grad ln P) (Bird, Stewart and
        # Lightfoot 2002, sec. 24.2; from memory): along e_1 - x the
        # derivative is (1 - x_1)(-c D grad ln P (1 - M_1 M_2 / Mbar^2))
        M = [0.002, 0.044]
        x = [0.35, 0.65]
        D = [[0, 6e-5], [6e-5, 0]]
        c, glnP = 40.0, 25.0
        A = mcdiff.flux_jacobian(D, c, x, [[8.0], [-8.0]], M=M,
                                 grad_lnP=[glnP])
        Mbar = x[0] * M[0] + x[1] * M[1]
        want = (1 - x[0]) * (-c * 6e-5 * glnP * (1 - M[0] * M[1] / Mbar**2))
        a = flat(A)  # [i][d][k]
        self.assertAlmostEqual(a[0], want, delta=1e-12 * abs(want))
        self.assertAlmostEqual(a[2], -want, delta=1e-12 * abs(want))

    def test_flux_jacobian_models_bases_and_finite_differences(self):
        # both models, mass fractions and mass fluxes: every column sums to
        # zero, and column k matches a fourth-order central difference of
        # flux_compute along e_k - w (step 1e-4 of the smallest fraction
        # 0.2: truncation ~ (5e-4)^4, round-off ~ 1e-16 / 2e-5 relative;
        # bound 1e-8 of the largest entry)
        D = [[0, 2e-5, 3e-5], [2e-5, 0, 1e-5], [3e-5, 1e-5, 0]]
        M = [0.004, 0.028, 0.044]
        w = [0.2, 0.3, 0.5]
        g = [[1.0], [2.0], [-3.0]]
        for model in ("maxwell-stefan", "mixture-averaged"):
            A = flat(mcdiff.flux_jacobian(D, 40.0, w, g, M=M, model=model,
                                          comp_basis="mass"))
            scale = max(abs(v) for v in A)
            for k in range(3):
                self.assertLess(abs(A[k] + A[3 + k] + A[6 + k]),
                                1e-12 * scale)
                h = 2e-5

                def f(t):
                    y = [w[j] + t * ((j == k) - w[j]) for j in range(3)]
                    return flat(mcdiff.flux_compute(D, 40.0, y, g, M=M,
                                                    model=model,
                                                    comp_basis="mass"))
                fp2, fp1, fm1, fm2 = f(2 * h), f(h), f(-h), f(-2 * h)
                for i in range(3):
                    fd = (-fp2[i] + 8 * fp1[i] - 8 * fm1[i] + fm2[i]) / (12 * h)
                    self.assertAlmostEqual(fd, A[3 * i + k],
                                           delta=1e-8 * scale)
        with self.assertRaises(mcdiff.InvalidArgumentError):
            mcdiff.flux_jacobian(D, 40.0, w, g, model="iterative")

    def test_flux_jacobian_tp_power_law(self):
        # D ~ T^1.75 / P and c = P / (R T): the fluxes go as T^0.75
        # (Fuller-Schettler-Giddings scaling; common practice), so
        # dJ/dT = 0.75 J / T and dJ/dP = 0
        D = [[0, 2e-5, 3e-5], [2e-5, 0, 1e-5], [3e-5, 1e-5, 0]]
        x = [0.2, 0.3, 0.5]
        g = [[1.0], [2.0], [-3.0]]
        T, P = 500.0, 2e5
        dT = [[1.75 * v / T for v in r] for r in D]
        dP = [[-v / P for v in r] for r in D]
        J = flat(mcdiff.flux_compute(D, 40.0, x, g,
                                     model="mixture-averaged"))
        oT, oP = mcdiff.flux_jacobian_tp(D, 40.0, x, g, T, P, dT, dP,
                                         model="mixture-averaged")
        big = max(abs(v) for v in J)
        for i, (a, b) in enumerate(zip(flat(oT), flat(oP))):
            self.assertAlmostEqual(a, 0.75 * J[i] / T, delta=1e-12 * big / T)
            self.assertLess(abs(b), 1e-12 * big / P)

    def test_flux_batch_jacobian_equals_single_state(self):
        D = [[0, 2e-5, 3e-5], [2e-5, 0, 1e-5], [3e-5, 1e-5, 0]]
        xs = [[0.2, 0.3, 0.5], [0.6, 0.0, 0.4]]
        g = [[1.0], [2.0], [-3.0]]
        K = 2
        Dc = [[[D[i][j]] * K for j in range(3)] for i in range(3)]
        comp = [[xs[k][i] for k in range(K)] for i in range(3)]
        grad = [[[g[i][0]] * K] for i in range(3)]
        F, Jb = mcdiff.flux_batch_jacobian(Dc, [40.0] * K, comp, grad)
        Jb = flat(Jb)  # [i][d][k][cell]
        for cell in range(K):
            A = flat(mcdiff.flux_jacobian(D, 40.0, xs[cell], g))
            scale = max(abs(v) for v in A)
            for e in range(9):
                self.assertAlmostEqual(Jb[e * K + cell], A[e],
                                       delta=1e-13 * scale)

    def test_result_shapes_follow_the_gradient(self):
        D = [[0, 2e-5, 3e-5], [2e-5, 0, 1e-5], [3e-5, 1e-5, 0]]
        x = [0.2, 0.3, 0.5]
        J1 = mcdiff.flux_compute(D, 40.0, x, [1.0, 0.0, -1.0])
        J2 = mcdiff.flux_compute(D, 40.0, x, [[1.0], [0.0], [-1.0]])
        if np is not None:
            self.assertEqual(J1.shape, (3,))
            self.assertEqual(J2.shape, (3, 1))
            Jn = mcdiff.flux_compute(np.array(D), 40.0, np.array(x),
                                     np.array([1.0, 0.0, -1.0]))
            self.assertEqual(Jn.shape, (3,))
        else:
            self.assertTrue(all(isinstance(v, float) for v in J1))
            self.assertTrue(all(isinstance(v, list) and len(v) == 1
                                for v in J2))
        self.assertEqual(flat(J1), flat(J2))
        self.assertIsInstance(mcdiff.flux_velocity_difference([1, 2, 3], 40.0, x,
                                                         J1), float)
        self.assertIsInstance(mcdiff.flux_total(x, J1, "equimolar").bulk,
                              float)
        self.assertEqual(len(rows(mcdiff.flux_convert([1, 2, 3], x, J2,
                                                      "mole", "mass"))), 3)

    def test_directions_are_independent_columns(self):
        rng = Rng(7)
        D, c, x = random_state(rng, 4)
        g = random_grad(rng, 4, 3)
        J3 = rows(mcdiff.flux_compute(D, c, x, g))
        for d in range(3):
            J1 = flat(mcdiff.flux_compute(D, c, x, [r[d] for r in g]))
            self.assertEqual(J1, [r[d] for r in J3])

    def test_models_bases_and_options(self):
        rng = Rng(8)
        D, c, x = random_state(rng, 4)
        M = self.M[:4]
        g = [1.0, -0.5, 0.25, -0.75]
        w = flat(mcdiff.x_to_w(M, x))
        gw = flat(mcdiff.grad_x_to_w(M, x, g))
        # the same state given in mass fractions gives the same fluxes
        for model in ("maxwell-stefan", "mixture-averaged"):
            Jx = mcdiff.flux_compute(D, c, x, g, M=M, model=model)
            Jw = mcdiff.flux_compute(D, c, w, gw, M=M, model=model,
                                     comp_basis="mass", flux_basis="mole")
            if model == "maxwell-stefan":
                self.assertLess(max_abs_diff(Jx, Jw), 1e-11 * max_abs(Jx))
        # mixture-averaged equals its closed form (mole basis)
        Jma = flat(mcdiff.flux_compute(D, c, x, g,
                                       model=mcdiff.Model.MIXTURE_AVERAGED))
        raw = []
        for i in range(4):
            s = sum(x[j] / D[i][j] for j in range(4) if j != i)
            raw.append(-c * (1 - x[i]) / s * g[i])
        ref = [raw[i] - x[i] * sum(raw) for i in range(4)]
        self.assertLess(max_abs_diff(Jma, ref), 1e-13 * max_abs(ref))
        # identity Gamma equals no Gamma; pressure diffusion changes fluxes
        I4 = [[float(i == j) for j in range(4)] for i in range(4)]
        self.assertEqual(flat(mcdiff.flux_compute(D, c, x, g, Gamma=I4)),
                         flat(mcdiff.flux_compute(D, c, x, g)))
        Jp = mcdiff.flux_compute(D, c, x, g, M=M, grad_lnP=[50.0])
        self.assertGreater(max_abs_diff(Jp, mcdiff.flux_compute(D, c, x, g)),
                           0.0)
        # the iterative model at one state: the exact fluxes to its tolerance
        Jx = flat(mcdiff.flux_compute(D, c, x, g))
        Ji = flat(mcdiff.flux_compute(D, c, x, g, model="iterative"))
        self.assertLess(max_abs_diff(Ji, Jx), 1e-8 * max_abs(Jx))

    def test_fick_matrix_options_and_eigenvalues(self):
        rng = Rng(9)
        D, c, x = random_state(rng, 4)
        F = mcdiff.fick_matrix(D, x)
        self.assertEqual(F.dependent, max(range(4), key=lambda i: x[i]))
        F0 = mcdiff.fick_matrix(D, x, dependent=0)
        self.assertEqual(F0.dependent, 0)
        e1 = sorted(v.real for v in flat(mcdiff.fick_eigenvalues(F.D)))
        e0 = sorted(v.real for v in flat(mcdiff.fick_eigenvalues(F0.D)))
        # eigenvalues do not depend on the dependent species (Taylor and
        # Krishna 1993, ch. 2): dgeev backward error, 1e-12 of the largest
        self.assertLess(max_abs_diff(e1, e0), 1e-12 * max(e1))
        self.assertTrue(all(v > 0 for v in e1))
        Fm = mcdiff.fick_matrix(D, x, M=self.M[:4], basis="mass")
        self.assertEqual(len(rows(Fm.D)), 3)
        self.assertEqual(flat(mcdiff.fick_eigenvalues([[2.0]])), [2.0])
        self.assertEqual(flat(mcdiff.fick_eigenvalues([])), [])
        with self.assertRaises(ValueError):
            mcdiff.fick_eigenvalues([1.0, 2.0, 3.0])

    def test_total_fluxes_with_every_bootstrap(self):
        rng = Rng(10)
        D, c, x = random_state(rng, 3)
        J = flat(mcdiff.flux_compute(D, c, x, [1.0, -3.0, 2.0]))
        N, Nt = mcdiff.flux_total(x, J, "stagnant", species=2)
        N = flat(N)
        self.assertAlmostEqual(N[2], 0.0, delta=1e-15 * max_abs(J))
        self.assertAlmostEqual(Nt, sum(N), delta=1e-14 * max_abs(J))
        N, Nt = mcdiff.flux_total(x, J, "equimolar")
        self.assertEqual(Nt, 0.0)
        self.assertEqual(flat(N), J)
        N, Nt = mcdiff.flux_total(x, J, "total", values=0.01)
        self.assertEqual(Nt, 0.01)
        self.assertLess(max_abs_diff(N, [J[i] + x[i] * 0.01
                                         for i in range(3)]), 1e-17)
        nu = [1.0, 2.0, 0.5]
        N, Nt = mcdiff.flux_total(x, J, "weights", values=nu)
        self.assertAlmostEqual(sum(a * b for a, b in zip(nu, flat(N))), 0.0,
                               delta=1e-14 * max_abs(J))
        # ratios fix a film's fluxes, not local ones: not a Bootstrap
        with self.assertRaisesRegex(ValueError, "unknown Bootstrap 'ratios'"):
            mcdiff.flux_total(x, J, "ratios", values=[0.2, 0.3, 0.5])
        Jm = [[v, -v] for v in J]
        N2, Nt2 = mcdiff.flux_total(x, Jm, "stagnant", species=2)
        self.assertEqual(len(flat(Nt2)), 2)

    def test_project_and_diagnose(self):
        F = [1.0, 2.0, -2.5]
        P, res = mcdiff.flux_project(F)
        self.assertAlmostEqual(res, 0.5, delta=1e-15)
        self.assertAlmostEqual(sum(flat(P)), 0.0, delta=1e-15)
        self.assertEqual(F, [1.0, 2.0, -2.5])  # the input is not changed
        P, res = mcdiff.flux_project(F, weights=[0.2, 0.3, 0.5])
        self.assertAlmostEqual(flat(P)[0], 1.0 - 0.2 * 0.5, delta=1e-15)
        a = array.array("d", F)
        P, res = mcdiff.flux_project(a, inplace=True)
        self.assertIs(P, a)
        self.assertAlmostEqual(sum(a), 0.0, delta=1e-15)
        with self.assertRaises(TypeError):
            mcdiff.flux_project([1.0, 2.0], inplace=True)
        # osmotic (flux, no gradient), reverse (up the gradient), barrier
        g = [1.0, 0.0, -1.0, 0.5]
        J = [-1.0, 0.5, 0.0, 0.5]
        flags = mcdiff.flux_diagnose(g, J, 1e-3)
        self.assertEqual(flags, [mcdiff.Diag(0), mcdiff.Diag.OSMOTIC,
                                 mcdiff.Diag.BARRIER, mcdiff.Diag.REVERSE])
        with self.assertRaises(mcdiff.InvalidArgumentError):
            mcdiff.flux_diagnose(g, J, 2.0)


class Batched(unittest.TestCase):
    def setUp(self):
        self.db = mcdiff.Database.builtin()
        self.mix = self.db.mixture(["hydrogen", "nitrogen", "carbon-dioxide",
                                    "argon"])
        self.mix.set_method(1, 3, "chapman-enskog")

    def tearDown(self):
        self.mix.close()
        self.db.close()

    def cells(self, K, nd):
        rng = Rng(77)
        T = [280.0 + 200.0 * rng.uniform() for _ in range(K)]
        P = [0.5e5 + 2e5 * rng.uniform() for _ in range(K)]
        x = [rng.composition(4) for _ in range(K)]
        g = [random_grad(rng, 4, nd) for _ in range(K)]
        return T, P, x, g

    def test_tiled_layout_gives_the_bits_of_soa(self):
        # identity: the same cells in tiles of 8 (to_tiles) give the same
        # bits as the SoA call; padding slots are left as they were
        if np is None:
            with self.assertRaises(RuntimeError):
                mcdiff.to_tiles([1.0])
            return
        rng = Rng(91)
        for N, K, nd in ((3, 1, 3), (5, 9, 2), (11, 17, 3)):
            x = np.array([rng.composition(N) for _ in range(K)]).T.copy()
            g = np.array([[[rng.uniform() - 0.5 for _ in range(K)]
                           for _ in range(nd)] for _ in range(N)])
            D = np.zeros((N, N, K))
            for i in range(N):
                for j in range(i + 1, N):
                    for k in range(K):
                        D[i, j, k] = D[j, i, k] = 1e-5 * (
                            0.2 + rng.uniform())
            c = np.array([30.0 + 20.0 * rng.uniform() for _ in range(K)])
            kT = np.array([[0.02 * (i - (N - 1) / 2.0)] * K
                           for i in range(N)])
            lT = np.full((nd, K), 30.0)
            for model in ("maxwell-stefan", "mixture-averaged", "iterative"):
                J = mcdiff.flux_batch_dij(D, c, x, g, model=model, kT=kT,
                                          grad_lnT=lT)
                out = np.full(((K + 7) // 8, N, nd, 8), 7.5)
                Jt = mcdiff.flux_batch_dij_tiled(
                    mcdiff.to_tiles(D), c, mcdiff.to_tiles(x),
                    mcdiff.to_tiles(g), model=model, kT=mcdiff.to_tiles(kT),
                    grad_lnT=mcdiff.to_tiles(lT), out=out)
                self.assertIs(Jt, out)
                back = mcdiff.from_tiles(Jt, K)
                self.assertEqual(back.tobytes(), np.asarray(J).tobytes())
                pad = Jt[-1, :, :, (K - 1) % 8 + 1:]
                self.assertTrue(np.all(pad == 7.5))
        with self.assertRaises(ValueError):
            mcdiff.flux_batch_dij_tiled(mcdiff.to_tiles(D), c,
                                        mcdiff.to_tiles(x), g)

    def test_upper_triangle_read_gives_the_bits_of_both(self):
        # identity: with set_dij_read(True) the lower triangle and the
        # diagonal are never read (NaN there), the results are the bits of
        # the default read of the symmetric matrix, which refuses the NaN
        if np is None:
            return
        rng = Rng(93)
        N, K = 6, 13
        x = np.array([rng.composition(N) for _ in range(K)]).T.copy()
        g = np.array([[[rng.uniform() - 0.5 for _ in range(K)]
                       for _ in range(3)] for _ in range(N)])
        D = np.zeros((N, N, K))
        for i in range(N):
            for j in range(i + 1, N):
                for k in range(K):
                    D[i, j, k] = D[j, i, k] = 1e-5 * (0.2 + rng.uniform())
        up = np.triu(np.transpose(D, (2, 0, 1)), 1)
        up[np.tril(np.ones((K, N, N), dtype=bool))] = np.nan
        up = np.ascontiguousarray(np.transpose(up, (1, 2, 0)))
        c = np.array([30.0 + 20.0 * rng.uniform() for _ in range(K)])
        ws = mcdiff.Workspace(N)
        J = mcdiff.flux_batch_dij(D, c, x, g, workspace=ws)
        with self.assertRaises(mcdiff.McdError):
            mcdiff.flux_batch_dij(up, c, x, g, workspace=ws)
        ws.set_dij_read(True)
        Ju = mcdiff.flux_batch_dij(up, c, x, g, workspace=ws)
        self.assertEqual(np.asarray(Ju).tobytes(), np.asarray(J).tobytes())
        ws.set_dij_read(False)
        with self.assertRaises(mcdiff.McdError):
            mcdiff.flux_batch_dij(up, c, x, g, workspace=ws)

    def test_batched_equal_single_state_calls(self):
        K, nd = 37, 2
        T, P, x, g = self.cells(K, nd)
        ref = [rows(self.mix.fluxes(T[k], P[k], x[k], g[k]))
               for k in range(K)]
        scale = max_abs(ref)
        # AoS: cells first, same layout as K single calls
        aos = rows(mcdiff.flux_batch(self.mix, T, P, x, g, layout="aos"))
        # SoA: species first, cells last
        comp = [[x[k][i] for k in range(K)] for i in range(4)]
        grad = [[[g[k][i][d] for k in range(K)] for d in range(nd)]
                for i in range(4)]
        soa = rows(mcdiff.flux_batch(self.mix, T, P, comp, grad))
        soa_as_aos = [[[soa[i][d][k] for d in range(nd)] for i in range(4)]
                      for k in range(K)]
        # specialised vector kernels may round differently from the single
        # state solver: 1e-12 of the largest flux
        self.assertLess(max_abs_diff(aos, ref), 1e-12 * scale)
        self.assertLess(max_abs_diff(soa_as_aos, ref), 1e-12 * scale)
        # caller's own Dij and c
        Ds = [rows(self.mix.binaries(T[k], P[k])) for k in range(K)]
        Dij = [[[Ds[k][i][j] for k in range(K)] for j in range(4)]
               for i in range(4)]
        cs = [P[k] / (R * T[k]) for k in range(K)]
        dij = rows(mcdiff.flux_batch_dij(Dij, cs, comp, grad))
        self.assertLess(max_abs_diff(dij, soa), 1e-12 * scale)

    def test_iterative_model_converges_to_exact(self):
        K = 12
        T, P, x, g = self.cells(K, 1)
        g1 = [[r[0] for r in gk] for gk in g]
        ws = mcdiff.Workspace(4)
        exact = rows(mcdiff.flux_batch(self.mix, T, P, x, g1, layout="aos",
                                       workspace=ws))
        ws.set_iterative(200, 1e-12)
        it = rows(mcdiff.flux_batch(self.mix, T, P, x, g1, layout="aos",
                                    model="iterative", workspace=ws))
        err, n_it = ws.iterative_outcome()
        self.assertGreater(n_it, 0)
        self.assertLessEqual(err, 1e-10)
        for k in range(K):
            self.assertLess(max_abs_diff(it[k], exact[k]),
                            1e-9 * max_abs(exact[k]))
        ws.set_threads(0)
        with self.assertRaises(mcdiff.InvalidArgumentError):
            ws.set_iterative(0, 1e-10)
        ws.close()

    def test_temperature_fit_and_errors(self):
        err = self.mix.set_temperature_fit(250.0, 500.0)
        self.assertLess(err, 1e-9)
        self.assertEqual(self.mix.temperature_fit()[:2], (250.0, 500.0))
        self.mix.clear_temperature_fit()
        self.assertEqual(self.mix.temperature_fit(), (0.0, 0.0, 0.0))
        T, P, x, g = self.cells(3, 1)
        g1 = [[r[0] for r in gk] for gk in g]
        x[1] = [0.5, 0.5, 0.5, -0.5]
        with self.assertRaises(mcdiff.DomainError) as cm:
            mcdiff.flux_batch(self.mix, T, P, x, g1, layout="aos")
        self.assertIn("cell 1", cm.exception.detail)
        with self.assertRaises(ValueError):
            mcdiff.flux_batch(self.mix, T, P, x, g1, layout="soa")
        with self.assertRaises(mcdiff.DomainError):
            self.mix.set_temperature_fit(500.0, 250.0)

    @unittest.skipIf(np is None, "numpy hidden or absent")
    def test_numpy_batch_with_out(self):
        K = 1000
        rng = np.random.default_rng(3)
        x = rng.dirichlet(np.ones(4), size=K).T.copy()      # (4, K)
        g = rng.normal(size=(4, 3, K))
        T = np.full(K, 300.0)
        out = np.empty_like(g)
        r = mcdiff.flux_batch(self.mix, T, 1e5, x, g, out=out)
        self.assertIs(r, out)
        # zero sum per cell and direction
        s = np.abs(out.sum(axis=0)).max()
        self.assertLess(s, 1e-14 * np.abs(out).max())


class Transfer(unittest.TestCase):
    def test_film_and_profile_shapes_and_consistency(self):
        rng = Rng(31)
        D = rng.dij(4)
        x0, xL = rng.composition(4), rng.composition(4)
        res = mcdiff.film_solve(D, 40.0, 0.05, x0, xL, "equimolar")
        self.assertAlmostEqual(sum(flat(res.N)), 0.0,
                               delta=1e-13 * max_abs(res.N))
        self.assertLessEqual(res.residual, 1e-12)
        z = [0.0, 0.025, 0.05]
        X = rows(mcdiff.film_profile(D, 40.0, 0.05, x0, res.N, z))
        self.assertEqual(len(X), 3)
        self.assertLess(max_abs_diff(X[0], x0), 1e-15)
        self.assertLess(max_abs_diff(X[2], xL), 1e-10)
        lin = mcdiff.film_solve(D, 40.0, 0.05, x0, xL, "equimolar",
                                method="linearized")
        self.assertLess(max_abs_diff(lin.N, res.N), 0.1 * max_abs(res.N))
        with self.assertRaises(ValueError):
            mcdiff.film_solve(D, 40.0, 0.05, x0, xL, "stagnant")

    def test_bulbs_conserve_every_species(self):
        rng = Rng(32)
        D = rng.dij(3)
        x1, x2 = rng.composition(3), rng.composition(3)
        V1, V2, A, L, c = 7e-5, 9e-5, 3e-6, 0.08, 40.0
        t = [0.0, 600.0, 3600.0, 36000.0]
        for fn in (mcdiff.bulbs_linearized, mcdiff.bulbs_integrate):
            a, b = fn(D, c, V1, V2, A, L, x1, x2, t)
            a, b = rows(a), rows(b)
            self.assertEqual(len(a), 4)
            for k in range(4):
                for i in range(3):
                    tot = V1 * x1[i] + V2 * x2[i]
                    self.assertAlmostEqual(V1 * a[k][i] + V2 * b[k][i], tot,
                                           delta=1e-15 * (V1 + V2))



class Liquids(unittest.TestCase):
    """The Liquid class: a binary NRTL liquid with alpha = 0 is the
    two-suffix Margules equation (Renon and Prausnitz 1968), ln gamma_1 =
    A x_2^2 with A = tau_12 + tau_21 and reduced Gamma 1 - 2 A x_1 x_2;
    Vignes Dij; the binary liquid flux -c Đ Gamma grad x_1; Stefan's law
    for water evaporating into dry air (Antoine constants of water, Stull
    1947 via the NIST WebBook, from memory)."""

    def test_margules_limit_vignes_and_flux(self):
        liq = mcdiff.Liquid(2, "nrtl")
        liq.set_pair(0, 1, [1.0, 0, 0], [1.0, 0, 0], alpha=0.0)
        liq.set_dinf(0, 1, 2e-9, 1e-9)
        s = liq.eval(300.0, [0.3, 0.7])
        G = rows(s.Gamma)
        self.assertAlmostEqual(flat(s.lngamma)[0], 2.0 * 0.49, delta=1e-14)
        self.assertAlmostEqual(G[0][0] - G[0][1], 1 - 4 * 0.21, delta=1e-13)
        D = rows(s.Dij)
        self.assertAlmostEqual(D[0][1] / (2e-9 ** 0.7 * 1e-9 ** 0.3), 1.0,
                               delta=1e-14)
        J = flat(liq.fluxes(300.0, 1.5e4, [0.3, 0.7], [2.0, -2.0]))
        ref = -1.5e4 * D[0][1] * (G[0][0] - G[0][1]) * 2.0
        self.assertAlmostEqual(J[0] / ref, 1.0, delta=1e-12)
        with self.assertRaises(mcdiff.DomainError):
            liq.eval(300.0, [0.5, 0.5])  # beyond the spinodal
        # the warning flags are the package's Warning bits
        self.assertIsInstance(s.warnings, mcdiff.Warning)
        self.assertEqual(int(s.warnings), 0)
        liq.set_pair(0, 1, [1.0, 0, 0], [1.0, 0, 0], alpha=0.0,
                     T_range=(280.0, 290.0))
        w = liq.eval(300.0, [0.3, 0.7]).warnings
        self.assertEqual(w, mcdiff.Warning.TEMPERATURE)
        liq.close()

    def test_batched_fluxes(self):
        # the liquid above (A = 2) at 4 cells, cells last: the binary
        # closed form J_1 = -c Dvignes (1 - 2 A x_1 x_2) grad x_1 (Taylor
        # and Krishna 1993, ch. 2), the single-state route to 1e-13 (the
        # same code per cell), mass fluxes as that route's; with partial
        # molar volumes (constant: c = 1 / sum x_i V_i) the volume frame,
        # J^V_1 = c V_2 J_1 and V_1 J^V_1 + V_2 J^V_2 = 0; an unstable
        # cell (x_1 = 0.5: 2 A x_1 x_2 = 1) raises DomainError naming it
        liq = mcdiff.Liquid(2, "nrtl")
        liq.set_pair(0, 1, [1.0, 0, 0], [1.0, 0, 0], alpha=0.0)
        liq.set_dinf(0, 1, 2e-9, 1e-9)
        x1 = [0.3, 0.1, 0.85, 0.05]
        K, V1, V2, M = 4, 4.1e-5, 1.8e-5, [0.032, 0.018]
        comp = [x1, [1 - v for v in x1]]
        g1 = [2.0, -1.0, 0.5, 3.0]
        grad = [g1, [-v for v in g1]]
        T = [290.0, 300.0, 310.0, 320.0]
        c = [1.0 / (v * V1 + (1 - v) * V2) for v in x1]
        r = liq.flux_batch(T, c, comp, grad)
        self.assertEqual(int(r.warnings), 0)
        J = rows(r.flux)
        for k in range(K):
            x = x1[k]
            ref = (-c[k] * 2e-9 ** (1 - x) * 1e-9 ** x
                   * (1 - 4 * x * (1 - x)) * g1[k])
            self.assertAlmostEqual(J[0][k] / ref, 1.0, delta=1e-12)
            self.assertAlmostEqual(J[1][k] / ref, -1.0, delta=1e-12)
            one = flat(liq.fluxes(T[k], c[k], [x, 1 - x], [g1[k], -g1[k]]))
            self.assertLessEqual(abs(J[0][k] - one[0]), 1e-13 * abs(one[0]))
        jm = rows(mcdiff.liquid_flux_batch(liq, T, c, comp, grad, M=M,
                                           flux_basis="mass").flux)
        for k in range(K):
            x = x1[k]
            one = flat(liq.fluxes(T[k], c[k], [x, 1 - x], [g1[k], -g1[k]],
                                  M=M, flux_basis="mass"))
            for i in range(2):
                self.assertLessEqual(abs(jm[i][k] - one[i]),
                                     1e-13 * abs(one[0]))
        Vbar = [[V1] * K, [V2] * K]
        JV = rows(liq.flux_batch(T, c, comp, grad, Vbar=Vbar).flux)
        for k in range(K):
            self.assertAlmostEqual(JV[0][k] / (c[k] * V2 * J[0][k]), 1.0,
                                   delta=1e-12)
            self.assertLessEqual(abs(V1 * JV[0][k] + V2 * JV[1][k]),
                                 1e-12 * V1 * abs(JV[0][k]))
        comp[0][2], comp[1][2] = 0.5, 0.5
        with self.assertRaises(mcdiff.DomainError) as cm:
            liq.flux_batch(T, c, comp, grad)
        self.assertIn("cell 2:", str(cm.exception))
        self.assertIn("not stable", str(cm.exception))
        liq.close()

    def test_stefan_tube_water(self):
        liq = mcdiff.Liquid(1, "ideal")
        liq.set_antoine(0, 9.6543, 1435.264, -64.848, 255.9, 373.0)
        T, L, Dwa = 298.15, 0.05, 2.6e-5
        p = flat(liq.vle(T, [1.0]))[0]
        self.assertAlmostEqual(p / 3169.9, 1.0, delta=0.02)  # IAPWS-95
        c = ATM / (R * T)
        ev = liq.evaporation(T, ATM, [1.0], Dij=[[0, Dwa], [Dwa, 0]], c=c,
                             L=L, xL=[0.0, 1.0], M=[0.018015, 0.028964],
                             rho_liquid=997.05)
        ref = c * Dwa / L * math.log(1.0 / (1.0 - p / ATM))
        self.assertAlmostEqual(flat(ev.N)[0] / ref, 1.0, delta=1e-10)
        self.assertAlmostEqual(ev.level_rate,
                               ev.mass_rate / 997.05 * 3.6e6, delta=1e-12)

    def test_infinite_dilution_correlations(self):
        # closed forms of the header (Tyn-Calus V_B^0.267 V_A^-0.433 T/mu,
        # Hayduk-Minhas for water), cgs to SI
        D = mcdiff.binary_tyn_calus(298.15, 0.89e-3, 96e-6, 18.9e-6)
        ref = 1e-4 * 8.93e-8 * 18.9 ** 0.267 * 96 ** -0.433 * 298.15 / 0.89
        self.assertAlmostEqual(D / ref, 1.0, delta=1e-12)
        D = mcdiff.binary_hayduk_minhas(298.15, 0.89e-3, 96e-6)
        ref = (1e-4 * 1.25e-8 * (96 ** -0.19 - 0.292) * 298.15 ** 1.52
               * 0.89 ** (9.58 / 96 - 1.12))
        self.assertAlmostEqual(D / ref, 1.0, delta=1e-12)
        # the correlations' temperature range: flagged outside
        for m in ("wilke-chang", "tyn-calus", "hayduk-minhas"):
            r = mcdiff.method_temperature_range(m, 298.15)
            self.assertEqual((r.T_min, r.T_max, r.warn), (273.15, 373.15, 0))
            r = mcdiff.method_temperature_range(m, 400.0)
            self.assertEqual(r.warn, mcdiff.EstimateWarning.TEMPERATURE)
        with self.assertRaises(mcdiff.InvalidArgumentError):
            mcdiff.method_temperature_range("fsg", 300.0)


class Porous(unittest.TestCase):
    """Viscosity and the Dusty Gas Model through Python."""

    def test_viscosity_of_nitrogen_against_the_crc_table(self):
        # CRC Handbook, Viscosity of Gases (Huber and Harvey): N2 17.9 uPa s
        # at 300 K; bound: typical error 1.5 % plus the table's 3 %
        db = mcdiff.Database.builtin()
        est = mcdiff.viscosity_gas(db, "nitrogen", 300.0)
        self.assertLess(abs(est.mu / 17.9e-6 - 1), 0.045)
        self.assertAlmostEqual(est.rel_err, 0.015)
        mix = db.mixture(["nitrogen", "oxygen"])
        mus = mcdiff.mixture_viscosities(mix, 300.0)
        self.assertEqual(flat(mus)[0], est.mu)
        m = mcdiff.viscosity_wilke([0.028014, 0.031998], mus, [1.0, 0.0])
        self.assertAlmostEqual(m, est.mu, delta=1e-15 * est.mu)
        self.assertAlmostEqual(mcdiff.viscosity_omega22(1.0), 1.593,
                               delta=6e-3 * 1.593)

    def test_thermal_diffusion_from_kinetic_theory(self):
        # Omega(1,1)*(1) = 1.440: Bird, Stewart and Lightfoot (2002),
        # Table E.2; rigid-sphere isotopic limit 105/118 (from memory);
        # heavier species (argon) to the cold side (common practice)
        ci = mcdiff.lj_collision_integrals(1.0)
        self.assertAlmostEqual(ci.omega11, 1.440, delta=2e-3 * 1.440)
        self.assertEqual(ci.C, ci.omega12 / ci.omega11)
        e = 1e-7
        a = mcdiff.thermal_factor_kinetic(1 + e, 1 - e, 0.4, 1, 1, 1, 1, 1)
        self.assertAlmostEqual(a / e, 105 / 118, delta=1e-6)
        self.assertEqual(mcdiff.thermal_factor_kinetic(0.04, 0.004, 0.5, 1.1,
                                                       1.2, 5 / 6, 1, 1),
                         0.0)
        db = mcdiff.Database.builtin()
        est = mcdiff.thermal_factor(db, "argon", "helium", 300.0, 0.5)
        self.assertGreater(est.alpha, 0.0)
        self.assertEqual(est.rel_err, mcdiff.THERMAL_CE_TYPICAL_ERROR)
        # the raw call with the table's own parameters (Svehla's LJ values,
        # M from the formula) gives the database route's number
        pa = [db.param(s, p) for p in (mcdiff.Param.MOLAR_MASS,
                                       mcdiff.Param.LJ_SIGMA,
                                       mcdiff.Param.LJ_EPS_K)
              for s in ("argon", "helium")]
        raw = mcdiff.thermal_factor_ce(300.0, *pa, 0.5)
        self.assertAlmostEqual(raw.alpha, est.alpha, delta=1e-14)
        mix = db.mixture(["argon", "helium", "nitrogen"])
        r = mcdiff.mixture_thermal_ratios(mix, 400.0, [0.5, 0.5, 0.0])
        k, th = flat(r.kT), flat(r.theta)
        self.assertAlmostEqual(sum(k), 0.0, delta=1e-16)
        self.assertEqual(k[2], 0.0)
        self.assertAlmostEqual(k[0], 0.5 * th[0], delta=1e-16)
        q = mcdiff.dufour_heat_flux([0.5, 0.5], [0.2, -0.2], 300.0,
                                    [[1.0], [-1.0]])
        self.assertAlmostEqual(flat(q)[0], 0.4 * 8.31446261815324 * 300,
                               delta=1e-9)
        # batched (cells last) = the single-state call per cell, exactly
        xb = [[0.3, 0.0], [0.7, 1.0]]
        thb = [[0.21, 0.35], [-0.09, 0.0]]
        fb = [[[1e-3, 5e-4], [-2e-3, 0.0]], [[-1e-3, -5e-4], [2e-3, 0.0]]]
        Mb = [0.04, 0.004]
        qb = rows(mcdiff.dufour_heat_flux_batch(xb, thb, [300.0, 1250.0], fb,
                                                M=Mb, flux_basis="mass"))
        for k, T in enumerate((300.0, 1250.0)):
            q1 = flat(mcdiff.dufour_heat_flux(
                [xb[0][k], xb[1][k]], [thb[0][k], thb[1][k]], T,
                [[fb[i][d][k] for d in range(2)] for i in range(2)], M=Mb,
                flux_basis="mass"))
            self.assertEqual([qb[0][k], qb[1][k]], q1)
        self.assertNotEqual(qb[0][1], 0.0)
        with self.assertRaises(mcdiff.DomainError):
            mcdiff.dufour_heat_flux_batch(xb, thb, [300.0, -1.0], fb, M=Mb,
                                          flux_basis="mass")
        with self.assertRaises(mcdiff.DomainError):
            mcdiff.lj_collision_integrals(0.1)

    def test_dgm_graham_closed_end_and_inverse(self):
        M = [0.004, 0.040]
        D = [[0, 7e-5], [7e-5, 0]]
        x = [0.3, 0.7]
        pore = dict(porosity=0.4, tortuosity=3.0, d_pore=1e-7)
        N = rows(mcdiff.dgm_fluxes(D, M, x, [-20.0, 20.0], 300.0, 1e5,
                                   2e-5, **pore))
        # Graham's law: N_A / N_B = -sqrt(M_B / M_A)
        self.assertAlmostEqual(N[0] / N[1], -math.sqrt(10.0), delta=1e-12)
        r = mcdiff.dgm_closed(D, M, x, [-20.0, 20.0], 300.0, 1e5, 2e-5,
                              **pore)
        Nc = rows(r.N)
        self.assertAlmostEqual(Nc[0] + Nc[1], 0.0, delta=1e-12 * abs(Nc[0]))
        inv = mcdiff.dgm_gradients(D, M, x, Nc, 300.0, 1e5, 2e-5, **pore)
        self.assertAlmostEqual(inv.grad_P, r.grad_P,
                               delta=1e-9 * abs(r.grad_P))
        g = rows(inv.grad_x)
        self.assertAlmostEqual(g[0], -20.0, delta=1e-8)
        self.assertAlmostEqual(mcdiff.pore_permeability(**pore),
                               0.4 / 3 * 1e-14 / 32, delta=1e-30)
        dk = mcdiff.knudsen_diffusivity(300.0, 0.004, 1e-7)
        self.assertAlmostEqual(mcdiff.pore_effective(dk, 0.4, 3.0),
                               dk * 0.4 / 3, delta=1e-15 * dk)
        self.assertAlmostEqual(mcdiff.bosanquet(1e-5, 1e-5), 5e-6,
                               delta=1e-20)
        # batched: two cells (cells last) equal the single-state calls
        Db = [[[0, 0], [7e-5, 6e-5]], [[7e-5, 6e-5], [0, 0]]]
        xb = [[0.3, 0.6], [0.7, 0.4]]
        gb = [[-20.0, -5.0], [20.0, 5.0]]
        Nb = rows(mcdiff.dgm_fluxes_batch(Db, M, xb, gb, [300.0, 350.0],
                                          [1e5, 2e5], [2e-5, 2.2e-5],
                                          **pore))
        for k, (Dk, xk, gk, Tk, Pk, mk) in enumerate(
                [(7e-5, [0.3, 0.7], [-20.0, 20.0], 300.0, 1e5, 2e-5),
                 (6e-5, [0.6, 0.4], [-5.0, 5.0], 350.0, 2e5, 2.2e-5)]):
            Nk = rows(mcdiff.dgm_fluxes([[0, Dk], [Dk, 0]], M, xk, gk, Tk,
                                        Pk, mk, **pore))
            self.assertEqual([Nb[0][k], Nb[1][k]], Nk)
        # slab with equal end pressures: the isobaric binary closed form
        # (Cunningham and Williams 1980)
        r = mcdiff.slab_solve(D, M, [0.8, 0.2], 1e5, [0.1, 0.9], 1e5, 300.0,
                              2e-5, 1e-3, **pore)
        De = 7e-5 * 0.4 / 3
        DKe = mcdiff.knudsen_diffusivity(300.0, M[0], 1e-7) * 0.4 / 3
        a, b, cc = 1 - math.sqrt(M[0] / M[1]), 1 + De / DKe, 1e5 / (R * 300)
        ref = De * cc / a * math.log((b - a * 0.1) / (b - a * 0.8)) / 1e-3
        self.assertAlmostEqual(flat(r.N)[0], ref, delta=1e-8 * abs(ref))
        xs, Ps = mcdiff.slab_profile(D, M, [0.8, 0.2], 1e5, r.N,
                                     [0.0, 1e-3], 300.0, 2e-5, 1e-3, **pore)
        self.assertAlmostEqual(rows(xs)[1][0], 0.1, delta=1e-8)
        # flux ratios of 2 A -> B: N_B = -N_A / 2, the profile ends at the
        # matched x_A and the returned far pressure
        r = mcdiff.slab_solve(D, M, [0.9, 0.1], 1e5, [0.6, 0.4], None,
                              300.0, 2e-5, 1e-3, kind="ratios", species=0,
                              ratios=[2.0, -1.0], **pore)
        NA, NB = flat(r.N)
        self.assertGreater(NA, 0.0)
        self.assertAlmostEqual(NB, -0.5 * NA, delta=1e-15 * NA)
        xs, Ps = mcdiff.slab_profile(D, M, [0.9, 0.1], 1e5, r.N, [1e-3],
                                     300.0, 2e-5, 1e-3, **pore)
        self.assertAlmostEqual(rows(xs)[0][0], 0.6, delta=1e-8)
        self.assertAlmostEqual(flat(Ps)[0], r.PL, delta=1e-8 * r.PL)
        with self.assertRaises(mcdiff.DomainError) as cm:
            mcdiff.slab_solve(D, M, [0.9, 0.1], 1e5, [0.6, 0.4], None,
                              300.0, 2e-5, 1e-3, kind="ratios",
                              ratios=[2.0, -0.5], **pore)
        self.assertIn("argument ratios", str(cm.exception))
        with self.assertRaises(mcdiff.DomainError) as cm:
            mcdiff.dgm_fluxes(D, M, x, [-20.0, 20.0], 300.0, 1e5, 2e-5,
                              porosity=1.5, tortuosity=3.0, d_pore=1e-7)
        self.assertIn("porosity", str(cm.exception))


class PractitionerMessages(unittest.TestCase):
    """Messages that say what to fix; one vocabulary with the CLI."""

    def test_raw_estimates_name_the_bad_argument(self):
        with self.assertRaises(mcdiff.DomainError) as cm:
            mcdiff.binary_fsg(300.0, -5.0, 2.016e-3, 28.0e-3, 6.12, 18.5)
        self.assertIn("argument P", str(cm.exception))
        with self.assertRaises(mcdiff.DomainError) as cm:
            mcdiff.binary_chapman_enskog(300.0, 1e5, 2e-3, 28e-3, 2.9e-10,
                                         -3.7e-10, 38.0, 71.0)
        self.assertIn("argument sigB", str(cm.exception))
        with self.assertRaises(mcdiff.InvalidArgumentError) as cm:
            mcdiff.binary_wilke_chang(float("nan"), 8.9e-4, 18e-3, 2.6, 6e-5)
        self.assertIn("argument T", str(cm.exception))
        db = mcdiff.Database.builtin()
        with self.assertRaises(mcdiff.DomainError) as cm:
            mcdiff.binary_gas(db, "hydrogen", "nitrogen", "fsg", 300.0, -5.0)
        self.assertIn("argument P", str(cm.exception))

    def test_film_species_by_name(self):
        rng = Rng(33)
        D = rng.dij(3)
        x0, xL = [0.3, 0.4, 0.3], [0.1, 0.3, 0.6]
        names = ["hydrogen", "nitrogen", "carbon-dioxide"]
        by_index = mcdiff.film_solve(D, 40.0, 0.05, x0, xL, "stagnant",
                                     species=2)
        by_name = mcdiff.film_solve(D, 40.0, 0.05, x0, xL, "stagnant",
                                    species="Carbon-Dioxide", names=names)
        self.assertEqual(flat(by_index.N), flat(by_name.N))
        self.assertEqual(flat(by_name.N)[2], 0.0)
        with self.assertRaises(TypeError) as cm:
            mcdiff.film_solve(D, 40.0, 0.05, x0, xL, "stagnant",
                              species="carbon-dioxide")
        self.assertIn("names=", str(cm.exception))
        self.assertNotIn("invalid literal", str(cm.exception))
        with self.assertRaises(ValueError) as cm:
            mcdiff.film_solve(D, 40.0, 0.05, x0, xL, "stagnant",
                              species="argon", names=names)
        self.assertIn("carbon-dioxide", str(cm.exception))
        F = mcdiff.fick_matrix(D, x0, dependent="nitrogen", names=names)
        self.assertEqual(F.dependent, 1)

    def test_import_star_does_not_shadow_builtin_warning(self):
        ns = {}
        exec("from mcdiff import *", ns)
        self.assertNotIn("Warning", ns)
        self.assertIn("EstimateWarning", ns)
        self.assertIs(mcdiff.Warning, mcdiff.EstimateWarning)

    def test_one_vocabulary_with_the_cli(self):
        rng = Rng(34)
        D = rng.dij(3)
        x, g = [0.3, 0.4, 0.3], [-1.0, 0.0, 1.0]
        ref = mcdiff.flux_compute(D, 40.0, x, g, model="maxwell-stefan")
        same = mcdiff.flux_compute(D, 40.0, x, g, model="exact")
        self.assertEqual(flat(ref), flat(same))
        for kw in ({"model": "ms"}, {"model": "mixavg"},
                   {"comp_basis": "molar"}, {"comp_basis": "mol"}):
            with self.subTest(kw=kw), self.assertRaises(ValueError):
                mcdiff.flux_compute(D, 40.0, x, g, **kw)
        db = mcdiff.Database.builtin()
        for m in ("ce", "chapman"):
            with self.subTest(method=m), self.assertRaises(ValueError):
                db.binary_gas("hydrogen", "nitrogen", m, 300.0, 1e5)
        cli = os.environ.get("MCDIFF_CLI")
        if not cli:
            return
        state = ["fluxes", "-s", "H2,N2,CO2", "-x", "0.3,0.4,0.3", "-g",
                 "-1,0,1", "-T", "300", "-P", "1atm"]
        for word, ok in (("exact", True), ("maxwell-stefan", True),
                         ("mixture-averaged", True), ("ms", False)):
            p = subprocess.run([cli, *state, "--model", word],
                               capture_output=True, text=True)
            self.assertEqual(p.returncode == 0, ok, (word, p.stderr))
            try:
                mcdiff.flux_compute(D, 40.0, x, g, model=word)
                py_ok = True
            except ValueError:
                py_ok = False
            self.assertEqual(py_ok, ok, word)
        for word, ok in (("mole", True), ("mass", True), ("molar", False)):
            p = subprocess.run([cli, *state, "--basis", word],
                               capture_output=True, text=True)
            self.assertEqual(p.returncode == 0, ok, (word, p.stderr))
        for word, ok in (("chapman-enskog", True), ("ce", False)):
            p = subprocess.run([cli, "binary", "H2", "N2", "-T", "300", "-P",
                                "1atm", "-m", word],
                               capture_output=True, text=True)
            self.assertEqual(p.returncode == 0, ok, (word, p.stderr))


if __name__ == "__main__":
    sys.exit(_support.run(__name__))
