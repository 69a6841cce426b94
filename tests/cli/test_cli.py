#!/usr/bin/env python3
"""Tests of the mcdiff command-line tool, driving the built binary.

The binary is taken from the environment variable MCDIFF_CLI (set by
bindings/cli/meson.build) or from the first command-line argument.
Standard library only.
"""
import json
import math
import os
import subprocess
import sys
import tempfile
import unittest

MCDIFF = os.environ.get("MCDIFF_CLI")

R = 8.31446261815324  # J/(mol K), exact in the 2019 SI (CODATA 2018)
ATM = 101325.0        # Pa, exact by definition

COMMANDS = ["species", "binary", "fluxes", "matrix", "demo"]


def run(*args):
    """Run the tool; return (exit code, stdout, stderr)."""
    p = subprocess.run([MCDIFF, *args], capture_output=True, text=True,
                       timeout=60)
    return p.returncode, p.stdout, p.stderr


def run_json(*args):
    code, out, err = run(*args, "--json")
    if code != 0:
        raise AssertionError(f"exit {code}: {err}")
    return json.loads(out)


STATE3 = ["-s", "hydrogen,nitrogen,carbon-dioxide", "-x", "0.3,0.4,0.3",
          "-T", "35C", "-P", "1atm"]


class Help(unittest.TestCase):
    def test_tool_help_lists_every_command(self):
        for flag in ("--help", "-h"):
            code, out, _ = run(flag)
            self.assertEqual(code, 0)
            for c in COMMANDS:
                self.assertIn(c, out)

    def test_each_subcommand_help_has_usage_example_and_units(self):
        # units expected in the help text of each subcommand
        units = {"species": ["g/mol", "K"],
                 "binary": ["K or C", "Pa", "atm", "m^2/s"],
                 "fluxes": ["[1/m]", "K or C", "atm", "mol/(m^2 s)"],
                 "matrix": ["[1/m]", "K or C", "atm", "m^2/s"],
                 "demo": ["cm^2/s", "mmol/(m^2 s)"]}
        for c in COMMANDS:
            for flag in ("--help", "-h"):
                with self.subTest(command=c, flag=flag):
                    code, out, err = run(c, flag)
                    self.assertEqual(code, 0, err)
                    self.assertIn(f"usage: mcdiff {c}", out)
                    self.assertIn("example", out)
                    self.assertIn(f"mcdiff {c}", out.split("example")[1])
                    for u in units[c]:
                        self.assertIn(u, out)

    def test_no_arguments_is_usage_error(self):
        code, _, err = run()
        self.assertEqual(code, 2)
        self.assertIn("usage", err)


class Version(unittest.TestCase):
    def test_version_prints_header_and_library_versions(self):
        code, out, err = run("--version")
        self.assertEqual(code, 0, err)
        # two version numbers: the header's and the library's (same build)
        words = [w for w in out.replace(",", " ").split()
                 if w.count(".") == 2 and w.replace(".", "").isdigit()]
        self.assertEqual(len(words), 2, out)
        self.assertEqual(words[0], words[1])


class ExitCodes(unittest.TestCase):
    def test_good_input_exits_0(self):
        for args in (["species"], ["species", "CO2"], ["demo"],
                     ["binary", "CO2", "N2", "-T", "300", "-P", "1atm"],
                     ["fluxes", *STATE3, "-g", "-20,0,20"],
                     ["matrix", *STATE3]):
            with self.subTest(args=args):
                code, out, err = run(*args)
                self.assertEqual(code, 0, err)
                self.assertTrue(out)
                self.assertEqual(err, "")

    def test_bad_input_exits_2_and_names_the_argument(self):
        cases = [
            (["binary", "CO2", "N2", "-T", "abc", "-P", "1atm"], "-T"),
            (["binary", "CO2", "N2", "-T", "300", "-P", "1psi"], "-P"),
            (["binary", "CO2", "N2", "--temperature", "300x", "-P", "1atm"],
             "--temperature"),
            (["binary", "CO2", "N2", "-T", "nan", "-P", "1atm"], "-T"),
            (["binary", "CO2", "N2", "-T", "inf", "-P", "1atm"], "-T"),
            (["binary", "CO2", "N2", "-T", "1e999", "-P", "1atm"], "-T"),
            (["binary", "CO2", "N2", "-T", "0x10", "-P", "1atm"], "-T"),
            (["binary", "CO2", "N2", "-T", " 300", "-P", "1atm"], "-T"),
            (["binary", "CO2", "N2", "-T", "-274C", "-P", "1atm"], "-T"),
            (["binary", "CO2", "N2", "-T", "300", "-P", "-1bar"], "-P"),
            (["binary", "CO2", "N2", "-T", "300"], "--pressure"),
            (["binary", "CO2", "N2", "-T", "300", "-P", "1atm", "-m", "foo"],
             "--method"),
            (["binary", "CO2", "no-such-gas", "-T", "300", "-P", "1atm"],
             "no-such-gas"),
            (["binary", "CO2", "N2", "-T", "300", "-P", "1atm", "--frob"],
             "--frob"),
            (["species", "no-such-gas"], "no-such-gas"),
            (["fluxes", *STATE3], "--gradient"),
            (["fluxes", *STATE3, "-g", "1,2"], "--gradient"),
            (["fluxes", *STATE3, "-g", "1,,2"], "-g"),
            (["fluxes", "-s", "H2,N2", "-x", "0.5,0.6", "-g", "1,-1",
              "-T", "300", "-P", "1atm"], "--mole-fractions"),
            (["fluxes", "-s", "H2,N2", "-x", "1.2,-0.2", "-g", "1,-1",
              "-T", "300", "-P", "1atm"], "--mole-fractions"),
            (["fluxes", *STATE3, "-g", "1,0,-1", "--pair", "H2N2=1e-5"],
             "--pair"),
            (["fluxes", *STATE3, "-g", "1,0,-1", "--pair", "H2:O2=1e-5"],
             "--pair"),
            (["fluxes", *STATE3, "-g", "1,0,-1", "--pair", "H2:N2=-1e-5"],
             "--pair"),
            (["fluxes", *STATE3, "-g", "1,0,-1", "--model", "fast"],
             "--model"),
            (["fluxes", *STATE3, "-g", "1,0,-1", "--basis", "volume"],
             "--basis"),
            (["fluxes", *STATE3, "-g", "1,0,-1", "-g", "1,0,-1", "-g",
              "1,0,-1", "-g", "1,0,-1"], "-g"),
            (["matrix", *STATE3, "--dependent", "oxygen"], "--dependent"),
            (["matrix", *STATE3, "--model", "exact"], "--model"),
            (["demo", "extra"], "extra"),
            (["frobnicate"], "frobnicate"),
        ]
        for args, name in cases:
            with self.subTest(args=args):
                code, out, err = run(*args)
                self.assertEqual(code, 2, (out, err))
                self.assertIn(name, err)
                self.assertEqual(out, "")

    def test_computation_failure_exits_1_with_status_text(self):
        # A species known only by its formula has no Lennard-Jones
        # parameters, so Chapman-Enskog cannot run (MCD_ENODATA).
        with tempfile.NamedTemporaryFile("w", suffix=".txt",
                                         delete=False) as f:
            f.write("mcdiff-species 1\nspecies test-vapour\n"
                    "formula C3H8O\n")
            path = f.name
        try:
            for args in (["binary", "test-vapour", "N2", "-T", "300", "-P",
                          "1atm", "--method", "chapman-enskog"],
                         ["fluxes", "-s", "test-vapour,N2,H2", "-x",
                          "0.2,0.5,0.3", "-g", "1,-1,0", "-T", "300", "-P",
                          "1atm", "--method", "chapman-enskog"]):
                with self.subTest(args=args):
                    code, out, err = run(*args, "--species-file", path)
                    self.assertEqual(code, 1, (out, err))
                    self.assertIn("failed", err)
                    self.assertIn("missing", err)  # mcd_status_string(ENODATA)
                    self.assertEqual(out, "")
            # The same species works with the method that needs only the
            # formula (Fuller-Schettler-Giddings): exit 0.
            code, _, err = run("binary", "test-vapour", "N2", "-T", "300",
                               "-P", "1atm", "--method", "fsg",
                               "--species-file", path)
            self.assertEqual(code, 0, err)
        finally:
            os.unlink(path)


class Units(unittest.TestCase):
    def binary(self, T, P):
        return run_json("binary", "CO2", "N2", "-T", T, "-P", P,
                        "--method", "fsg")

    def test_celsius_equals_kelvin(self):
        a = self.binary("25C", "1atm")
        b = self.binary("298.15K", "1atm")
        c = self.binary("298.15", "1atm")
        # 25 C = 298.15 K exactly (definition of the Celsius scale); the
        # sum 25 + 273.15 may differ from the literal 298.15 by one ulp.
        for r in (a, b, c):
            self.assertAlmostEqual(r["T"], 298.15, delta=1e-12)
        self.assertAlmostEqual(a["D"] / c["D"], 1.0, delta=1e-12)
        self.assertEqual(b["D"], c["D"])

    def test_pressure_units_agree(self):
        ref = self.binary("300", "101325")
        self.assertEqual(ref["P"], ATM)
        for P in ("1atm", "101325Pa", "101.325kPa", "1.01325bar",
                  "0.101325MPa"):
            with self.subTest(P=P):
                r = self.binary("300", P)
                # decimal scaling of the unit may cost one ulp
                self.assertAlmostEqual(r["P"] / ATM, 1.0, delta=1e-14)
                self.assertAlmostEqual(r["D"] / ref["D"], 1.0, delta=1e-14)

    def test_option_spellings_agree(self):
        ref = self.binary("25C", "1atm")
        for args in (["-T25C", "-P1atm"],
                     ["--temperature=25C", "--pressure=1atm"],
                     ["--temperature", "25C", "--pressure", "1atm"]):
            with self.subTest(args=args):
                d = run_json("binary", "CO2", "N2", *args, "-m", "fsg")
                self.assertEqual(d["D"], ref["D"])

    def test_exponent_and_sign_forms(self):
        r = self.binary("2.9815e2", "+1.01325e5")
        self.assertAlmostEqual(r["T"], 298.15, delta=1e-12)
        self.assertAlmostEqual(r["P"], ATM, delta=1e-9)


class Json(unittest.TestCase):
    PARAM_KEYS = ["name", "formula", "M", "V_diff", "sigma", "eps_k",
                  "dipole", "Vb", "Tb", "assoc", "Tc", "Pc", "sources"]

    def test_species_json_has_documented_keys(self):
        d = run_json("species")
        self.assertIn("species", d)
        self.assertIn("units", d)
        self.assertGreaterEqual(len(d["species"]), 40)
        for s in d["species"]:
            for k in self.PARAM_KEYS:
                self.assertIn(k, s)
        names = {s["name"] for s in d["species"]}
        for n in ("nitrogen", "carbon-dioxide", "water", "air", "ethanol",
                  "ethyl-acetate", "hydrogen"):
            self.assertIn(n, names)

    def test_species_one_json_and_table(self):
        d = run_json("species", "CO2")
        self.assertEqual(len(d["species"]), 1)
        s = d["species"][0]
        self.assertEqual(s["name"], "carbon-dioxide")
        # M(CO2) = 44.009 g/mol from IUPAC standard atomic weights
        # (C 12.011, O 15.999; common practice)
        self.assertAlmostEqual(s["M"], 44.009e-3, delta=2e-6)
        code, out, _ = run("species", "CO2")
        self.assertEqual(code, 0)
        for p in ("M", "V_diff", "sigma", "kg/mol", "source"):
            self.assertIn(p, out)

    def test_species_table_has_unit_row(self):
        code, out, _ = run("species")
        self.assertEqual(code, 0)
        lines = out.splitlines()
        self.assertIn("g/mol", lines[1])
        self.assertIn("nitrogen", out)

    def test_binary_json_keys(self):
        d = run_json("binary", "CO2", "N2", "-T", "300", "-P", "1atm")
        for k in ("D", "pair", "T", "P", "method", "typical_error",
                  "results", "caution"):
            self.assertIn(k, d)
        self.assertGreaterEqual(len(d["results"]), 1)
        ok = [r for r in d["results"] if r["D"] is not None]
        # "D" is the first method that gave a value (the recommended one)
        self.assertEqual(d["D"], ok[0]["D"])
        self.assertEqual(d["method"], ok[0]["method"])
        for r in d["results"]:
            for k in ("method", "status", "D", "typical_error", "warnings"):
                self.assertIn(k, r)

    def test_fluxes_json_keys_and_shapes(self):
        d = run_json("fluxes", *STATE3, "-g", "-20,0,20", "-g", "5,-5,0")
        for k in ("species", "fluxes", "fick_matrix", "zero_sum_residual",
                  "flags", "binary_D", "caution", "flux_unit"):
            self.assertIn(k, d)
        self.assertEqual(len(d["fluxes"]), 3)
        self.assertTrue(all(len(r) == 2 for r in d["fluxes"]))
        self.assertEqual(len(d["fick_matrix"]), 2)
        self.assertTrue(all(len(r) == 2 for r in d["fick_matrix"]))

    def test_matrix_json_keys(self):
        d = run_json("matrix", *STATE3)
        for k in ("fick_matrix", "fick_species", "fick_dependent",
                  "eigenvalues", "binary_D", "fluxes", "caution"):
            self.assertIn(k, d)
        self.assertIsNone(d["fluxes"])
        # most abundant species is the default dependent one
        self.assertEqual(d["fick_dependent"], "nitrogen")


class Reference(unittest.TestCase):
    """The D printed by the tool against handbook experiments."""

    def check(self, a, b, T, D_exp_cm2, source):
        d = run_json("binary", a, b, "-T", T, "-P", "1atm", "--method",
                     "fsg")
        err = d["typical_error"]
        # the method's own published average error, sanity-bounded
        self.assertTrue(0.0 < err < 0.2, err)
        rel = abs(d["D"] - D_exp_cm2 * 1e-4) / (D_exp_cm2 * 1e-4)
        self.assertLessEqual(rel, err, f"{a}-{b}: {d['D']} vs "
                             f"{D_exp_cm2} cm2/s ({source})")
        return rel

    def test_fsg_co2_n2_against_experiment(self):
        # CO2-N2 at 298.2 K, 1 atm: 0.165 cm^2/s; Bird, Stewart and
        # Lightfoot, Transport Phenomena, 2nd ed. (2002), Table 17.1-1
        # (values from Hirschfelder, Curtiss and Bird 1964, p. 579).
        self.check("carbon-dioxide", "nitrogen", "298.2", 0.165,
                   "Bird, Stewart and Lightfoot 2002, Table 17.1-1")

    def test_fsg_ar_n2_against_experiment(self):
        # Ar-N2 at 293.15 K, 101.325 kPa: 0.190 cm^2/s; CRC Handbook of
        # Chemistry and Physics, table "Diffusion in gases" (after Marrero
        # and Mason 1972, J. Phys. Chem. Ref. Data 1, 1).
        self.check("argon", "nitrogen", "293.15", 0.190,
                   "CRC Handbook, Diffusion in gases; Marrero and Mason 1972")

    def test_table_and_json_agree(self):
        d = run_json("binary", "CO2", "N2", "-T", "298.2", "-P", "1atm",
                     "--method", "fsg")
        code, out, _ = run("binary", "CO2", "N2", "-T", "298.2", "-P",
                           "1atm", "--method", "fsg")
        self.assertEqual(code, 0)
        self.assertIn(f"{d['D']:.4e}", out)
        self.assertIn("review", out)  # the caution line


class Fluxes(unittest.TestCase):
    def zero_sum(self, flux):
        ndim = len(flux[0])
        for k in range(ndim):
            col = [row[k] for row in flux]
            big = max(abs(v) for v in col)
            self.assertGreater(big, 0.0)
            # round-off of a sum of 3-4 terms: a few ulp of the largest
            self.assertLessEqual(abs(sum(col)), 1e-12 * big)

    def test_rows_sum_to_zero_every_model_and_basis(self):
        for extra in ([], ["--model", "mixture-averaged"], ["--basis", "mass"],
                      ["--model", "mixture-averaged", "--basis", "mass"]):
            with self.subTest(extra=extra):
                d = run_json("fluxes", *STATE3, "-g", "-20,0,20", "-g",
                             "3,-1,-2", *extra)
                self.zero_sum(d["fluxes"])
                for r in d["zero_sum_residual"]:
                    self.assertLessEqual(abs(r), 1e-15)

    def test_mass_fraction_input(self):
        d = run_json("fluxes", "-s", "CO2,N2,water", "-w", "0.3,0.6,0.1",
                     "-g", "2,-1,-1", "-T", "400", "-P", "2bar")
        self.zero_sum(d["fluxes"])
        self.assertEqual(d["basis"], "mass")
        self.assertAlmostEqual(sum(d["mass_fractions"]), 1.0, delta=1e-12)

    def test_two_species_is_binary_fick(self):
        # N = 2: J_1 = -c D_12 grad x_1 with c = P/(R T) (common practice).
        D, T, gx = 7.5e-5, 300.0, -10.0
        d = run_json("fluxes", "-s", "H2,N2", "-x", "0.4,0.6", "-g",
                     f"{gx},{-gx}", "-T", str(T), "-P", "1atm", "--pair",
                     f"H2:N2={D}")
        c = ATM / (R * T)
        self.assertAlmostEqual(d["c"] / c, 1.0, delta=1e-12)
        # the linear solve costs a few ulp
        self.assertAlmostEqual(d["fluxes"][0][0] / (-c * D * gx), 1.0,
                               delta=1e-12)
        self.assertAlmostEqual(d["fick_matrix"][0][0] / D, 1.0, delta=1e-12)

    def test_pair_in_cm2_per_s_and_scaled(self):
        a = run_json("fluxes", *STATE3, "-g", "1,0,-1", "--pair",
                     "H2:N2=0.8cm2/s")
        self.assertAlmostEqual(a["binary_D"][0][1] / 0.8e-4, 1.0,
                               delta=1e-12)
        self.assertEqual(a["binary_source"][0][1], "given")
        self.assertEqual(a["binary_source"][0][2], "fsg")
        # a value measured at 298.15 K, 1 atm, scaled to 35 C and 2 atm as
        # (T/T_ref)^1.75 (P_ref/P) (the documented law of the library)
        b = run_json("fluxes", "-s", "H2,N2,CO2", "-x", "0.3,0.4,0.3",
                     "-T", "35C", "-P", "2atm", "-g", "1,0,-1", "--pair",
                     "N2:H2=7.8e-5@25C,1atm")
        want = 7.8e-5 * (308.15 / 298.15) ** 1.75 / 2.0
        self.assertAlmostEqual(b["binary_D"][1][0] / want, 1.0, delta=1e-9)

    def test_matrix_fluxes_equal_exact_fluxes(self):
        g = ["-g", "-20,0,20", "-g", "1,2,-3"]
        f = run_json("fluxes", *STATE3, *g)
        m = run_json("matrix", *STATE3, *g)
        self.assertEqual(f["fick_matrix"], m["fick_matrix"])
        for rf, rm in zip(f["fluxes"], m["fluxes"]):
            for a, b in zip(rf, rm):
                big = max(abs(v) for row in f["fluxes"] for v in row)
                # two algebraically equal routes; round-off only
                self.assertLessEqual(abs(a - b), 1e-10 * big)

    def test_osmotic_flag_for_zero_gradient(self):
        # Duncan and Toor (1962) type state: N2 has no gradient of its own
        # but moves (osmotic diffusion) in H2/N2/CO2.
        d = run_json("fluxes", *STATE3, "-g", "-20,0,20")
        self.assertIn("osmotic", d["flags"][1])
        self.assertNotEqual(d["fluxes"][1][0], 0.0)

    def test_table_output_shows_residual_and_flags(self):
        code, out, err = run("fluxes", *STATE3, "-g", "-20,0,20")
        self.assertEqual(code, 0, err)
        for s in ("zero-sum residual", "osmotic", "mol/(m^2 s)",
                  "Fick matrix", "review"):
            self.assertIn(s, out)


class Demo(unittest.TestCase):
    def test_demo_runs_short_and_labelled(self):
        code, out, err = run("demo")
        self.assertEqual(code, 0, err)
        self.assertIn("INVENTED", out)
        self.assertIn("zero-sum", out)
        self.assertLessEqual(len(out.splitlines()), 40)


if __name__ == "__main__":
    if len(sys.argv) > 1 and os.path.exists(sys.argv[1]):
        MCDIFF = sys.argv.pop(1)
    if not MCDIFF:
        sys.exit("set MCDIFF_CLI or pass the mcdiff binary as argument")
    MCDIFF = os.path.abspath(MCDIFF)
    unittest.main(verbosity=2)
