#!/usr/bin/env python3
"""Tests of the mcdiff command-line tool, driving the built binary.

The binary is taken from the environment variable MCDIFF_CLI (set by
bindings/cli/meson.build) or from the first command-line argument.
Standard library only.
"""
import csv
import io
import json
import math
import os
import shutil
import subprocess
import sys
import tempfile
import unittest

MCDIFF = os.environ.get("MCDIFF_CLI")
MAN_PAGE = os.environ.get("MCDIFF_MAN") or os.path.join(
    os.path.dirname(os.path.abspath(__file__)), "..", "..", "bindings",
    "cli", "mcdiff.1")

R = 8.31446261815324  # J/(mol K), exact in the 2019 SI (CODATA 2018)
ATM = 101325.0        # Pa, exact by definition

COMMANDS = ["species", "binary", "fluxes", "matrix", "film", "bulbs",
            "porous", "demo", "liquid"]


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
                 "film": ["mol/(m^2 s)", "K or C", "atm", "m, cm or",
                          "z_m"],
                 "bulbs": ["m3, L", "s, min, h or d", "cm2", "K or C", "atm",
                           "t_s"],
                 "porous": ["[1/m]", "K or C", "atm", "mol/(m^2 s)", "nm",
                            "m^2", "Pa/m", "cP"],
                 "demo": ["cm^2/s", "mmol/(m^2 s)"],
                 "liquid": ["K or C", "m^3/mol", "m^2/s", "[Pa]"]}
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

    def test_every_help_example_runs(self):
        # the examples under "example" in each --help, with their
        # continuation lines joined, must run and exit 0
        import shlex
        for c in COMMANDS:
            _, out, _ = run(c, "--help")
            text = out.split("example", 1)[1].split("\n", 1)[1]
            text = text.replace("\\\n", " ")
            for line in text.splitlines():
                words = shlex.split(line)
                if not words or words[0] != "mcdiff" or ">" in words:
                    continue
                with self.subTest(example=line):
                    code, out2, err = run(*words[1:])
                    self.assertEqual(code, 0, err)
                    self.assertTrue(out2)

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
            (["binary", "CO2", "N2", "-T", "300", "-P", "1torr"], "-P"),
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


class PractitionerTraps(unittest.TestCase):
    """Units and silent traps met in a first hour with the tool."""

    def binary(self, *args):
        return run_json("binary", "CO2", "N2", "--method", "fsg", *args)

    def test_practical_temperature_and_pressure_units(self):
        ref = self.binary("-T", "370.15", "-P", "101325")
        # 97 C = 370.15 K (Celsius scale); 206.6 F = 370.15 K
        # ((206.6 + 459.67) * 5/9, Fahrenheit scale); 1 psi =
        # 6894.757293168 Pa (pound-force and inch; common practice)
        for T in ("97 C", "97C", "97degC", "97\u00b0C", "206.6F",
                  "206.6degF", "206.6 \u00b0F"):
            with self.subTest(T=T):
                r = self.binary("-T", T, "-P", "101325")
                self.assertAlmostEqual(r["T"], 370.15, delta=1e-9)
        r = self.binary("-T", "370.15", "-P", "14.6959487755psi")
        self.assertAlmostEqual(r["P"] / ATM, 1.0, delta=1e-11)
        self.assertAlmostEqual(r["D"] / ref["D"], 1.0, delta=1e-10)
        code, out, err = run("film", "-s", "H2,N2", "--x0", "0.4,0.6",
                             "--xL", "0.1,0.9", "-L", "0.19685in", "-T",
                             "300", "-P", "1atm", "--equimolar", "--json")
        self.assertEqual(code, 0, err)
        self.assertAlmostEqual(json.loads(out)["L"], 0.19685 * 0.0254,
                               delta=1e-15)

    def test_gauge_pressure_is_refused_with_the_reason(self):
        for P in ("2barg", "30psig", "150kPag"):
            with self.subTest(P=P):
                code, out, err = run("binary", "CO2", "N2", "-T", "300",
                                     "-P", P)
                self.assertEqual(code, 2)
                self.assertEqual(out, "")
                self.assertIn("-P/--pressure", err)
                self.assertIn("gauge", err)
                self.assertIn("absolute", err)

    def test_unit_split_off_by_a_space_says_how_to_write_it(self):
        code, out, err = run("binary", "CO2", "N2", "-T", "60", "C",
                             "-P", "1atm")
        self.assertEqual(code, 2)
        self.assertEqual(out, "")
        self.assertIn("-T/--temperature", err)
        self.assertIn("60C", err)
        self.assertIn('"60 C"', err)
        self.assertNotIn("only two species", err)
        code, _, err = run("fluxes", *STATE3[:6], "-P", "1", "atm",
                           "-g", "-1,0,1")
        self.assertEqual(code, 2)
        self.assertIn("1atm", err)

    def test_repeated_options_are_an_error_naming_the_option(self):
        cases = [
            (["binary", "CO2", "N2", "-T", "300", "-T", "400", "-P", "1atm"],
             "-T/--temperature"),
            (["binary", "CO2", "N2", "-T", "300", "--temperature=400", "-P",
              "1atm"], "-T/--temperature"),
            (["fluxes", *STATE3, "-P", "2atm", "-g", "-1,0,1"],
             "-P/--pressure"),
            (["bulbs", "-s", "H2,N2", "--x1", "1,0", "--x2", "0,1",
              "--v1", "1L", "--V1", "2L", "--v2", "1L", "-L", "5cm",
              "--area", "1cm2", "-T", "300", "-P", "1atm", "-t", "0,1h"],
             "--V1"),
            (["film", "-s", "H2,N2", "--x0", "0.4,0.6", "--xL", "0.1,0.9",
              "--xl", "0.2,0.8", "-L", "5mm", "-T", "300", "-P", "1atm",
              "--equimolar"], "--xl"),
        ]
        for args, name in cases:
            with self.subTest(args=args):
                code, out, err = run(*args)
                self.assertEqual(code, 2, err)
                self.assertEqual(out, "")
                self.assertIn(name, err)
                self.assertIn("given twice", err)
        # options meant to repeat still do: one -g per direction, one
        # --pair per pair
        d = run_json("fluxes", *STATE3, "-g", "-1,0,1", "-g", "1,0,-1",
                     "--pair", "H2:N2=0.8cm2/s", "--pair", "N2:CO2=0.16cm2/s")
        self.assertEqual(len(d["gradients"][0]), 2)

    def test_implausible_diffusivity_warns_and_names_the_unit(self):
        # 8.38 meant in cm^2/s: H2-N2 near 35 C, 1 atm is about 0.8 cm^2/s
        # (from memory of handbook tables)
        code, out, err = run("fluxes", *STATE3, "-g", "-1,0,1", "--pair",
                             "H2:N2=8.38", "--json")
        self.assertEqual(code, 0, err)
        self.assertIn("warning", err)
        self.assertIn("8.38cm2/s", err)
        d = json.loads(out)
        self.assertEqual(len(d["input_warnings"]), 1)
        self.assertIn("8.38cm2/s", d["input_warnings"][0])
        d = run_json("fluxes", *STATE3, "-g", "-1,0,1", "--pair",
                     "H2:N2=8.38cm2/s")
        self.assertEqual(d["input_warnings"], [])

    def test_implausible_viscosity_warns_and_names_the_unit(self):
        # water at 25 C: 0.89 mPa s (common practice)
        code, out, err = run("binary", "ethanol", "water", "-T", "25C",
                             "--viscosity", "0.89", "--json")
        self.assertEqual(code, 0, err)
        self.assertIn("0.89cP", err)
        self.assertIn("0.89cP", json.loads(out)["input_warnings"][0])
        code, out, err = run("binary", "ethanol", "water", "-T", "25C",
                             "--viscosity", "0.89cP", "--json")
        self.assertEqual((code, err), (0, ""))
        self.assertEqual(json.loads(out)["input_warnings"], [])

    def test_gradients_not_summing_to_zero_are_shown_projected(self):
        code, out, err = run("fluxes", *STATE3, "-g", "-20,0,20.5", "--json")
        self.assertEqual(code, 0, err)
        self.assertIn("sum to 0.5", err)
        d = json.loads(out)
        # g_i - x_i * 0.5 with x = 0.3, 0.4, 0.3
        g = [row[0] for row in d["gradients"]]
        for a, b in zip(g, [-20.15, -0.2, 20.35]):
            self.assertAlmostEqual(a, b, delta=1e-12)
        self.assertIn("-20.15,-0.2,20.35", d["input_warnings"][0])
        # the same fluxes as the projected gradients given directly
        ref = run_json("fluxes", *STATE3, "-g", "-20.15,-0.2,20.35")
        self.assertEqual(ref["input_warnings"], [])
        for a, b in zip(d["fluxes"], ref["fluxes"]):
            self.assertAlmostEqual(a[0], b[0], delta=1e-12 * abs(b[0]) + 1e-15)

    def test_total_flux_beyond_the_film_says_what_is_wrong(self):
        film = ["film", "-s", "H2,N2,CO2", "--x0", "0.4,0.3,0.3", "--xL",
                "0.1,0.5,0.4", "-L", "5mm", "-T", "300", "-P", "1atm"]
        code, out, err = run(*film, "--total-flux", "100")
        self.assertEqual(code, 2, err)
        self.assertEqual(out, "")
        self.assertIn("--total-flux", err)
        self.assertIn("c D/L", err)
        self.assertNotIn("failed: singular", err)
        code, _, err = run(*film, "--total-flux", "1")
        self.assertEqual(code, 0, err)

    def test_messages_name_species_not_indices(self):
        code, _, err = run("film", "-s", "acetone,methanol,air", "--x0",
                           "0.319,0.528,0.153", "--xL", "0.5,0.5,0", "-L",
                           "23.8cm", "-T", "328.5", "-P", "99.4kPa",
                           "--stagnant", "air")
        self.assertEqual(code, 2)
        self.assertIn("stagnant species 'air'", err)
        self.assertNotIn("species 2", err)

    def test_fractions_not_summing_to_one_print_their_sum(self):
        code, out, err = run("fluxes", "-s", "H2,N2,CO2", "-x",
                             "0.3,0.4,0.35", "-T", "300", "-P", "1atm",
                             "-g", "-1,0,1")
        self.assertEqual(code, 2)
        self.assertIn("sum to 1.05", err)
        code, _, err = run("film", "-s", "H2,N2", "--x0", "0.4,0.6", "--xL",
                           "0.1,0.8", "-L", "5mm", "-T", "300", "-P", "1atm",
                           "--equimolar")
        self.assertEqual(code, 2)
        self.assertIn("--xL", err)
        self.assertIn("sum to 0.9", err)
        code, _, err = run("bulbs", "-s", "H2,N2", "--x1", "1,0", "--x2",
                           "0,0.5", "--v1", "1L", "--v2", "1L", "-L", "5cm",
                           "--area", "1cm2", "-T", "300", "-P", "1atm", "-t",
                           "0,1h")
        self.assertEqual(code, 2)
        self.assertIn("--x2", err)
        self.assertIn("sum to 0.5", err)


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


class BinaryExplain(unittest.TestCase):
    """binary --explain, errors widened under warnings, the recommended
    mark and the pair named by each warning."""

    K_B, N_A = 1.380649e-23, 6.02214076e23  # exact (SI 2019)

    def explain(self, *args):
        d = run_json("binary", *args, "--explain")
        # a method that gave no value (brokaw without CO2's Tb) has none
        return d, [r.get("explain") for r in d["results"]]

    def test_intermediates_rebuild_each_estimate_by_hand(self):
        d, ex = self.explain("CO2", "N2", "-T", "400", "-P", "2bar")
        self.assertEqual([r["method"] for r in d["results"]],
                         ["fsg", "chapman-enskog", "wilke-lee", "brokaw"])
        self.assertIsNone(ex[3])  # CO2 sublimes: no Tb for brokaw
        fsg, ce, wl = ex[:3]
        # Fuller et al. (1966) eq. 10, atm form; Chapman-Enskog first
        # approximation (Hirschfelder, Curtiss and Bird 1954 eq. 8.2-44);
        # Wilke-Lee (Poling et al. 2001 eq. 11-4.1). The JSON carries the
        # shortest round-trip decimals: the hand values agree to round-off
        # (some 20 operations: 1e-13).
        T, P = fsg["T"], fsg["P"]
        mab_g = 1e3 * fsg["M_AB"]
        self.assertAlmostEqual(
            fsg["M_AB"] * (1 / fsg["M_A"] + 1 / fsg["M_B"]) / 2, 1, delta=1e-15)
        self.assertAlmostEqual(fsg["V_roots"], fsg["V_A"] ** (1 / 3)
                               + fsg["V_B"] ** (1 / 3), delta=1e-13)
        d_fsg = 1e-4 * 1e-3 * T ** 1.75 * math.sqrt(2 / mab_g) / (
            P / 101325 * fsg["V_roots"] ** 2)
        self.assertAlmostEqual(d_fsg / fsg["D"], 1, delta=1e-13)
        self.assertAlmostEqual(ce["sigma_AB"],
                               (ce["sigma_A"] + ce["sigma_B"]) / 2,
                               delta=1e-24)
        self.assertAlmostEqual(ce["eps_AB_over_k"], math.sqrt(
            ce["eps_A_over_k"] * ce["eps_B_over_k"]), delta=1e-12)
        self.assertAlmostEqual(ce["T_star"], T / ce["eps_AB_over_k"],
                               delta=1e-13)
        mu = ce["M_AB"] / (2 * self.N_A)
        d_ce = 3 / 16 * math.sqrt(2 * math.pi * (self.K_B * T) ** 3 / mu) / (
            P * math.pi * ce["sigma_AB"] ** 2 * ce["Omega_D"])
        self.assertAlmostEqual(d_ce / ce["D"], 1, delta=1e-13)
        f = 3.03 - 0.98 / math.sqrt(mab_g)
        self.assertAlmostEqual(wl["wilke_lee_factor"], f, delta=1e-14)
        d_wl = 1e-4 * f * 1e-3 * T ** 1.5 / (
            P / 1e5 * math.sqrt(mab_g) * (1e10 * wl["sigma_AB"]) ** 2
            * wl["Omega_D"])
        self.assertAlmostEqual(d_wl / wl["D"], 1, delta=1e-13)
        for r, e in zip(d["results"][:3], ex[:3]):
            self.assertEqual(r["D"], e["D"])

    def test_brokaw_pieces_rebuild_the_estimate(self):
        # water + air: Brokaw (1969) is recommended; sigma_AB is the
        # geometric mean and Omega_D carries the polar term, so the first
        # Chapman-Enskog approximation with them rebuilds D (1e-13)
        d, ex = self.explain("water", "air", "-T", "298.15", "-P", "1atm")
        self.assertEqual(d["method"], "brokaw")
        b = ex[[r["method"] for r in d["results"]].index("brokaw")]
        self.assertAlmostEqual(
            b["sigma_AB"] / math.sqrt(b["sigma_A"] * b["sigma_B"]), 1,
            delta=1e-15)
        T, P = b["T"], b["P"]
        mu = b["M_AB"] / (2 * self.N_A)
        d_b = 3 / 16 * math.sqrt(2 * math.pi * (self.K_B * T) ** 3 / mu) / (
            P * math.pi * b["sigma_AB"] ** 2 * b["Omega_D"])
        self.assertAlmostEqual(d_b / b["D"], 1, delta=1e-13)

    def test_wilke_chang_pieces_and_no_gas_warning(self):
        d, (wc,) = self.explain("ethanol", "water", "-T", "25C",
                                "--viscosity", "0.89cP")
        # Wilke and Chang (1955): 7.4e-8 (phi M_B)^0.5 T / (mu V_A^0.6)
        # in cm^2/s, g/mol, cP, cm^3/mol
        hand = 1e-4 * 7.4e-8 * math.sqrt(wc["phi"] * 1e3 * wc["M_B"]) \
            * wc["T"] / (1e3 * wc["mu_B"] * (1e6 * wc["Vb_A"]) ** 0.6)
        self.assertAlmostEqual(hand / d["D"], 1, delta=1e-13)
        self.assertEqual(wc["phi"], 2.6)
        # ethanol is polar (1.7 D) but "polar" is a gas-model warning
        warns = " ".join(d["results"][0]["warnings"])
        self.assertNotIn("Lennard-Jones", warns)
        self.assertNotIn("polar", warns)

    def test_explain_text_shows_the_pieces(self):
        code, out, _ = run("binary", "CO2", "N2", "-T", "590", "-P", "1bar",
                           "--method", "chapman-enskog", "--explain")
        self.assertEqual(code, 0)
        for piece in ("sigma_AB", "eps_AB/k", "T*", "Omega_D", "M_AB",
                      "by hand"):
            self.assertIn(piece, out)
        code, out, _ = run("binary", "CO2", "N2", "-T", "590", "-P", "1bar",
                           "--method", "fsg", "--explain")
        self.assertIn("V_A^(1/3) + V_B^(1/3)", out)

    def test_high_pressure_widens_the_stated_error(self):
        d = run_json("binary", "CO2", "N2", "-T", "300", "-P", "200bar",
                     "--method", "fsg")
        # published 5.4 %, one high-pressure warning: x2 (documented rule)
        self.assertAlmostEqual(d["published_error"], 0.054, delta=1e-15)
        self.assertAlmostEqual(d["typical_error"], 0.108, delta=1e-15)
        code, out, _ = run("binary", "CO2", "N2", "-T", "300", "-P",
                           "200bar", "--method", "fsg")
        self.assertIn("10.8 %", out)
        self.assertNotIn(" 5.4 %", out)
        self.assertIn("rule of thumb", out)
        d = run_json("binary", "CO2", "N2", "-T", "300", "-P", "1atm",
                     "--method", "fsg")
        self.assertEqual(d["typical_error"], d["published_error"])

    def test_only_an_auto_chosen_method_is_recommended(self):
        code, out, _ = run("binary", "CO2", "N2", "-T", "300", "-P", "1atm",
                           "--method", "wilke-lee")
        self.assertNotIn("recommended", out)
        d = run_json("binary", "CO2", "N2", "-T", "300", "-P", "1atm",
                     "--method", "wilke-lee")
        self.assertFalse(d["recommended"])
        self.assertFalse(d["results"][0]["recommended"])
        code, out, _ = run("binary", "CO2", "N2", "-T", "300", "-P", "1atm")
        self.assertEqual(out.count("recommended"), 1)
        d = run_json("binary", "CO2", "N2", "-T", "300", "-P", "1atm")
        self.assertTrue(d["recommended"])

    def test_mixture_warnings_name_their_pair(self):
        base = ("fluxes", "-s", "H2O,N2,CO2", "-x", "0.2,0.5,0.3", "-g",
                "1,-1,0", "-T", "300", "-P", "1atm")
        # the default is the per-pair recommended method: Brokaw for the
        # polar pair water/N2; water/CO2 falls back to Fuller-Schettler-
        # Giddings (CO2 sublimes: no normal boiling point for Brokaw's
        # parameters), as does the non-polar N2/CO2
        d = run_json(*base)
        self.assertEqual(d["binary_source"][0][1], "brokaw")
        self.assertEqual(d["binary_source"][0][2], "fsg")
        self.assertEqual(d["binary_source"][1][2], "fsg")
        args = base + ("--method", "fsg")
        code, out, _ = run(*args)
        self.assertEqual(code, 0)
        self.assertIn("warning (water / nitrogen):", out)
        self.assertIn("warning (water / carbon-dioxide):", out)
        self.assertNotIn("warning (nitrogen / carbon-dioxide)", out)
        d = run_json(*args)
        pairs = [tuple(w["pair"]) for w in d["pair_warnings"]]
        self.assertEqual(pairs, [("water", "nitrogen"),
                                 ("water", "carbon-dioxide")])
        # polar and associating: 5.4 % x 2 x 2 (documented rule)
        self.assertAlmostEqual(d["binary_typical_error"][0][1], 0.216,
                               delta=1e-15)
        self.assertAlmostEqual(d["binary_published_error"][0][1], 0.054,
                               delta=1e-15)
        self.assertAlmostEqual(d["binary_typical_error"][1][2], 0.054,
                               delta=1e-15)


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

    def test_method_recommended_and_brokaw_per_pair(self):
        # --method recommended: each pair the method `binary` recommends for
        # it (water, 1.8 debye, is polar: brokaw; air/methane: fsg), with
        # binary's value and typical error for that pair; the tables name
        # each pair's method. --method brokaw: every pair by Brokaw.
        state = ["-s", "water,air,methane", "-x", "0.1,0.7,0.2",
                 "-T", "313.15", "-P", "1atm"]
        for cmd, extra in (("fluxes", ["-g", "1,-0.5,-0.5"]), ("matrix", [])):
            with self.subTest(cmd=cmd):
                d = run_json(cmd, *state, *extra, "--method", "recommended")
                src = d["binary_source"]
                self.assertEqual(src[0][1], "brokaw")
                self.assertEqual(src[2][0], "brokaw")
                self.assertEqual(src[1][2], "fsg")
                for i, j in ((0, 1), (0, 2), (1, 2)):
                    names = d["species"]
                    b = run_json("binary", names[i], names[j], "-T",
                                 "313.15", "-P", "1atm", "--method",
                                 src[i][j])
                    self.assertEqual(d["binary_D"][i][j], b["D"])
                    self.assertEqual(d["binary_typical_error"][i][j],
                                     b["typical_error"])
                    # and `binary` alone recommends that same method
                    r = run_json("binary", names[i], names[j], "-T",
                                 "313.15", "-P", "1atm")
                    self.assertEqual(r["method"], src[i][j])
                d = run_json(cmd, *state, *extra, "--method", "brokaw")
                self.assertEqual({m for row in d["binary_source"]
                                  for m in row if m}, {"brokaw"})
        code, out, _ = run("fluxes", *state, "-g", "1,-0.5,-0.5", "-m",
                           "recommended", "--pair", "air:methane=0.22cm2/s")
        self.assertEqual(code, 0)
        # the text table's last column names each pair's method
        rows = {tuple(ln.split()[0:3:2]): ln.split()[-1]
                for ln in out.splitlines()
                if ln.startswith("  ") and " / " in ln
                and not ln.strip().startswith("warning")}
        self.assertEqual(rows.get(("water", "air")), "brokaw")
        self.assertEqual(rows.get(("air", "methane")), "given")
        # a polar species without Brokaw's data (CO2 has no Tb): fsg
        d = run_json("matrix", "-s", "ammonia,carbon-dioxide,nitrogen", "-x",
                     "0.2,0.3,0.5", "-T", "300", "-P", "1atm", "--method",
                     "recommended")
        self.assertEqual(d["binary_source"][0][1], "fsg")
        self.assertEqual(d["binary_source"][0][2], "brokaw")
        code, _, err = run("fluxes", *state, "-g", "1,-0.5,-0.5", "-m",
                           "wilke-chang")
        self.assertEqual(code, 2)
        self.assertIn("recommended", err)
        # Brokaw needs CO2's Tb: the error names the pair and the parameter
        code, _, err = run("matrix", "-s", "ammonia,carbon-dioxide", "-x",
                           "0.5,0.5", "-T", "300", "-P", "1atm", "-m",
                           "brokaw")
        self.assertEqual(code, 1)
        self.assertIn("carbon-dioxide", err)
        self.assertIn("Tb", err)

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

    def test_film_ratios_print_the_solved_end_state(self):
        # with --ratios only the matched species' end value is imposed; the
        # others follow from the film. Check the printed end state against
        # the exact profile at z = L and the sum of fractions there.
        args = ["film", "-s", "acetone,methanol,air", "--x0",
                "0.319,0.528,0.153", "--xL", "0,0,1", "-L", "23.8cm", "-T",
                "328.5", "-P", "99.4kPa", "--ratios", "0.4,0.6,0", "--match",
                "acetone"]
        d = run_json(*args)
        self.assertEqual(d["xL_imposed"], "acetone")
        xs = d["xL_solved"]
        self.assertEqual(xs[0], 0.0)
        self.assertAlmostEqual(sum(xs), 1.0, delta=1e-12)
        self.assertNotAlmostEqual(xs[2], 1.0, delta=0.1)  # not the input
        p = run_json(*args, "--profile", "--points", "3")
        for a, b in zip(xs[1:], p["profile"]["x"][-1][1:]):
            self.assertAlmostEqual(a, b, delta=1e-12)
        code, out, _ = run(*args)
        self.assertEqual(code, 0)
        self.assertIn("* = imposed", out)

    def test_json_numbers_are_the_shortest_that_read_back(self):
        # 0.07 prints as 0.07, not 0.070000000000000007, and every number
        # still reads back to the double the tool computed (common
        # practice: shortest round-trip decimal)
        code, out, err = run("fluxes", "-s", "H2,N2,CO2", "-x",
                             "0.07,0.63,0.3", "-g", "1,0,-1", "-T", "300",
                             "-P", "1atm", "--json")
        self.assertEqual(code, 0, err)
        self.assertIn("0.07,", out.replace(" ", ""))
        self.assertNotIn("0.070000000000000007", out)
        d = json.loads(out)
        self.assertEqual(d["mole_fractions"][0], 0.07)

    def test_species_lookup_suggests_and_refuses_ambiguous_formulas(self):
        code, _, err = run("species", "nitrogn")
        self.assertEqual(code, 2)
        self.assertIn("did you mean nitrogen", err)
        code, _, err = run("binary", "C4H10", "N2", "-T", "300", "-P",
                           "1atm")
        self.assertEqual(code, 2)
        self.assertIn("n-butane", err)
        self.assertIn("isobutane", err)
        d = run_json("fluxes", "-s", "h2o,carbon dioxide,N2", "-x",
                     "0.1,0.2,0.7", "-g", "1,0,-1", "-T", "300", "-P", "1atm")
        self.assertEqual(d["species"], ["water", "carbon-dioxide",
                                        "nitrogen"])

    def test_thermal_diffusion_binary_law(self):
        # J_1 = -c D_12 (grad x_1 + k_T grad ln T), grad ln T = (dT/dz)/T
        # (Bird, Stewart and Lightfoot 2002, sec. 24.2; from memory)
        D, T, gx, kT, dTdz = 7.5e-5, 300.0, -10.0, 0.02, 600.0
        d = run_json("fluxes", "-s", "H2,N2", "-x", "0.4,0.6", "-g",
                     f"{gx},{-gx}", "-T", str(T), "-P", "1atm", "--pair",
                     f"H2:N2={D}", "--thermal-ratios", f"{kT},{-kT}",
                     "--temperature-gradient", str(dTdz))
        c = ATM / (R * T)
        want = -c * D * (gx + kT * dTdz / T)
        self.assertAlmostEqual(d["fluxes"][0][0] / want, 1.0, delta=1e-12)
        self.assertEqual(d["thermal_ratios"], [kT, -kT])
        self.assertAlmostEqual(d["grad_lnT"][0], dTdz / T, delta=1e-15)
        # one without the other names the missing option
        code, _, err = run("fluxes", "-s", "H2,N2", "-x", "0.4,0.6", "-g",
                           "1,-1", "-T", "300", "-P", "1atm",
                           "--thermal-ratios", "0.02,-0.02")
        self.assertEqual(code, 2)
        self.assertIn("--temperature-gradient", err)

    def test_thermal_ratios_estimated_by_kinetic_theory(self):
        # `--thermal-ratios estimate`: the library's pairwise kinetic-theory
        # ratios (mcd_mixture_thermal_ratios), which sum to zero; helium,
        # the lightest, goes to the hot side (k_T < 0) and the heavier
        # species to the cold side (common practice); the typical error is
        # printed with the caution
        args = ("fluxes", "-s", "He,Ar,N2", "-x", "0.2,0.5,0.3", "-g",
                "-20,0,20", "-T", "300", "-P", "1atm", "--thermal-ratios",
                "estimate", "--temperature-gradient", "1000")
        d = run_json(*args)
        kT = d["thermal_ratios"]
        self.assertTrue(d["thermal_ratios_estimated"])
        self.assertAlmostEqual(sum(kT), 0.0, delta=1e-15)
        self.assertLess(kT[0], 0.0)
        self.assertGreater(kT[1], 0.0)
        self.assertGreaterEqual(d["thermal_ratios_typical_error"], 0.2)
        # the fluxes are those of the same k_T given by hand
        given = run_json(*args[:-3], ",".join(repr(v) for v in kT),
                         "--temperature-gradient", "1000")
        self.assertFalse(given["thermal_ratios_estimated"])
        for a, b in zip(d["fluxes"], given["fluxes"]):
            self.assertAlmostEqual(a[0], b[0], delta=1e-12 * abs(b[0]))
        code, out, _ = run(*args)
        self.assertEqual(code, 0)
        self.assertIn("far less accurate", out)
        self.assertIn("typical error 30 %", out)

    def test_binary_thermal_factor(self):
        # `binary --thermal-factor X_A`: alpha_T of the pair in the first
        # Chapman-Enskog approximation (mcd_db_thermal_factor). Checks:
        # argon, the heavier, goes to the cold side (alpha_T > 0: "the
        # heavier and larger molecules diffusing towards the cooler side",
        # T. L. Ibbs, "Some Experiments on Thermal Diffusion", 1921,
        # p. 385, stored copy at archive.org); exchanging the species
        # changes the sign only; k_T = x_A x_B alpha_T equals the mixture
        # route of `fluxes --thermal-ratios estimate` for the same pair
        # (exact for two species; the same arithmetic up to rounding,
        # 1e-15 absolute on values of order 0.1); the typical error and the
        # caution are printed in text and JSON.
        base = ("-T", "300", "-P", "1atm", "--method", "chapman-enskog")
        for xa in (0.5, 0.2):
            d = run_json("binary", "argon", "helium", *base,
                         "--thermal-factor", repr(xa))
            t = d["thermal_diffusion"]
            self.assertEqual(t["x_A"], xa)
            self.assertGreater(t["alpha_T"], 0.0)
            self.assertAlmostEqual(t["k_T"], xa * (1 - xa) * t["alpha_T"],
                                   delta=1e-16)
            self.assertGreaterEqual(t["typical_error"], 0.2)
            self.assertIn("far less accurate", t["caution"])
            swapped = run_json("binary", "helium", "argon", *base,
                               "--thermal-factor", repr(1 - xa))
            self.assertAlmostEqual(swapped["thermal_diffusion"]["alpha_T"],
                                   -t["alpha_T"], delta=1e-15)
            f = run_json("fluxes", "-s", "argon,helium", "-x",
                         f"{xa!r},{1 - xa!r}", "-g", "-20,20", "-T", "300",
                         "-P", "1atm", "--thermal-ratios", "estimate",
                         "--temperature-gradient", "1000")
            self.assertAlmostEqual(f["thermal_ratios"][0], t["k_T"],
                                   delta=1e-15)
        code, out, _ = run("binary", "argon", "helium", *base,
                           "--thermal-factor", "0.5")
        self.assertEqual(code, 0)
        for text in ("alpha_T", "typical error 20 %", "far less accurate",
                     "argon moves to the cold side"):
            self.assertIn(text, out)
        for bad in (("--thermal-factor", "1.5"), ("--thermal-factor", "-0.1"),
                    ("--thermal-factor", "half"),
                    ("--thermal-factor", "0.5", "--csv")):
            code, _, err = run("binary", "argon", "helium", *base, *bad)
            self.assertEqual(code, 2, bad)
            self.assertIn("--thermal-factor", err)
        code, _, err = run("binary", "ethanol", "water", "-T", "25C",
                           "--viscosity", "0.89cP", "--thermal-factor", "0.5")
        self.assertEqual(code, 2)
        self.assertIn("gases only", err)
        # a species without Lennard-Jones parameters: a failed estimate
        code, out, err = run("binary", "hydroperoxyl", "nitrogen", "-T",
                             "300", "-P", "1atm", "--thermal-factor", "0.5")
        self.assertEqual(code, 1)
        self.assertEqual(out, "")
        self.assertIn("thermal diffusion factor", err)

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

def run_csv(*args, flag="--csv"):
    """Run with --csv (or no flag when flag is None); return (header, rows,
    stderr). Every row must have as many fields as the header."""
    extra = [flag] if flag else []
    code, out, err = run(*args, *extra)
    if code != 0:
        raise AssertionError(f"exit {code}: {err}")
    table = list(csv.reader(io.StringIO(out)))
    if not table:
        raise AssertionError("empty CSV")
    header, rows = table[0], table[1:]
    for r in rows:
        if len(r) != len(header):
            raise AssertionError(f"row {r} does not match header {header}")
    return header, rows, err


# Carty and Schrodt (1975), Ind. Eng. Chem. Fundam. 14, 276: evaporation of
# an acetone (1) / methanol (2) liquid into air (3) in a Stefan tube at
# 328.5 K and 99.4 kPa. Data as used in the worked example of Taylor and
# Krishna (1993), "Multicomponent Mass Transfer", Wiley, ch. 8 (Stefan
# tube, exact Maxwell-Stefan solution): tube length 0.238 m, vapour at the
# liquid surface x1 = 0.319, x2 = 0.528, pure air at the top,
# Đ12 = 8.48, Đ13 = 13.72, Đ23 = 19.91 mm^2/s, and computed fluxes
# N1 = 1.783e-3, N2 = 3.127e-3 mol/(m^2 s). All these numbers are FROM
# MEMORY (as in tests/test_film.c): the paper and the example text could
# not be confirmed.
STEFAN = ["-s", "acetone,methanol,air", "--x0", "0.319,0.528,0.153",
          "--xL", "0,0,1", "-L", "23.8cm", "-T", "328.5", "-P", "99.4kPa",
          "--pair", "acetone:methanol=8.48e-6",
          "--pair", "acetone:air=0.1372cm2/s",
          "--pair", "methanol:air=19.91e-6"]


class Film(unittest.TestCase):
    def test_stefan_tube_matches_published_fluxes(self):
        d = run_json("film", *STEFAN, "--stagnant", "air")
        self.assertEqual(d["flux_unit"], "mol/(m^2 s)")
        self.assertAlmostEqual(d["L"], 0.238, delta=1e-15)
        N = d["fluxes"]
        # published to 4 digits (from memory, see STEFAN): 1e-3 relative is
        # half a unit in the 4th digit plus the rounding of R in c; the
        # library gives 1.7830e-3 and 3.1280e-3
        self.assertAlmostEqual(N[0] / 1.783e-3, 1.0, delta=1e-3)
        self.assertAlmostEqual(N[1] / 3.127e-3, 1.0, delta=1e-3)
        self.assertEqual(N[2], 0.0)  # stagnant air, exactly
        self.assertIsInstance(d["iterations"], int)
        self.assertGreater(d["iterations"], 0)
        self.assertLessEqual(d["residual"], 1e-12)  # the solver's criterion
        self.assertAlmostEqual(d["total_flux"], N[0] + N[1], delta=1e-18)
        self.assertEqual(d["bootstrap"], {"kind": "stagnant",
                                          "species": "air"})
        self.assertIn("hazardous", d["caution"])
        # --pair in m^2/s and in cm^2/s: the same value
        self.assertAlmostEqual(d["binary_D"][0][2] / 13.72e-6, 1.0,
                               delta=1e-15)

    def test_stefan_tube_both_models_and_table(self):
        d = run_json("film", *STEFAN, "--stagnant", "air", "--model", "both")
        for k in ("fluxes", "fluxes_linearized", "deviation",
                  "iterations_linearized", "residual_linearized"):
            self.assertIn(k, d)
        for i in range(2):
            want = (d["fluxes_linearized"][i] - d["fluxes"][i]) / abs(
                d["fluxes"][i])
            self.assertAlmostEqual(d["deviation"][i], want, delta=1e-15)
            # linearized theory agrees with the exact one to a few per cent
            # for this tube (Taylor and Krishna 1993, ch. 8, from memory);
            # the library measures 0.07 % and 1.9 %
            self.assertLess(abs(d["deviation"][i]), 0.05)
        self.assertEqual(d["deviation"][2], 0.0)  # both exactly 0
        code, out, err = run("film", *STEFAN, "--stagnant", "air",
                             "--model", "both")
        self.assertEqual(code, 0, err)
        self.assertEqual(err, "")
        for text in ("mol/(m^2 s)", "deviation", "iterations", "air",
                     f"{d['fluxes'][0]:.5e}", "hazardous", "review"):
            self.assertIn(text, out)

    def closed_stagnant(self, T, P, D, L, xa0, xaL):
        # B stagnant: N_A = (c D/L) ln((1 - xA_L)/(1 - xA_0)), c = P/(R T)
        # (common practice; e.g. Taylor and Krishna 1993, ch. 8)
        c = P / (R * T)
        return c * D / L * math.log((1 - xaL) / (1 - xa0))

    def test_binary_stagnant_film_equals_closed_form(self):
        cases = [  # species, T [K], P [Pa], D [m^2/s], L [m], L text, x0, xL
            ("H2,N2", 300.0, ATM, 7.8e-5, 0.01, "1cm", 0.4, 0.1),
            ("water,air", 320.0, 2e5, 2.9e-5, 0.005, "5mm", 0.08, 0.01),
            ("CO2,N2", 280.0, 5e4, 1.6e-5, 0.2, "0.2", 0.9, 0.3),
            ("ethanol,N2", 350.0, ATM, 1.4e-5, 0.05, "5cm", 0.02, 0.5),
        ]
        for sp, T, P, D, L, Ltext, x0, xL in cases:
            with self.subTest(species=sp, x0=x0, xL=xL):
                a, b = sp.split(",")
                d = run_json("film", "-s", sp, "--x0", f"{x0},{1 - x0}",
                             "--xL", f"{xL},{1 - xL}", "-L", Ltext, "-T",
                             str(T), "-P", f"{P}", "--pair", f"{a}:{b}={D}",
                             "--stagnant", b)
                want = self.closed_stagnant(T, P, D, L, x0, xL)
                # converged to 1e-12 relative; 1e-9 leaves room for the
                # decimal round trip of the inputs
                self.assertAlmostEqual(d["fluxes"][0] / want, 1.0,
                                       delta=1e-9)
                self.assertEqual(d["fluxes"][1], 0.0)

    def test_binary_other_bootstraps_equal_closed_forms(self):
        T, P, D, L = 300.0, ATM, 7.8e-5, 0.01
        c = P / (R * T)
        base = ["-s", "H2,N2", "--x0", "0.6,0.4", "--xL", "0.2,0.8", "-L",
                "10mm", "-T", "300", "-P", "1atm", "--pair", f"H2:N2={D}"]
        # equimolar: N_A = c D (xA_0 - xA_L)/L (common practice); the
        # weights 1,1 state the same condition
        eq = c * D * (0.6 - 0.2) / L
        for boot in (["--equimolar"], ["--weights", "1,1"]):
            with self.subTest(boot=boot):
                d = run_json("film", *base, *boot)
                self.assertAlmostEqual(d["fluxes"][0] / eq, 1.0, delta=1e-9)
                self.assertAlmostEqual(d["fluxes"][1] / -eq, 1.0,
                                       delta=1e-9)
        # ratios: N_A = z_A (c D/L) ln((z_A - xA_L)/(z_A - xA_0)) (Taylor
        # and Krishna 1993, ch. 8, from memory; the formula quoted in
        # mcdiff.h), with z_A = 2, z_B = -1
        zA = 2.0
        want = zA * c * D / L * math.log((zA - 0.2) / (zA - 0.6))
        d = run_json("film", *base, "--ratios", "2,-1", "--match", "H2")
        self.assertAlmostEqual(d["fluxes"][0] / want, 1.0, delta=1e-9)
        self.assertAlmostEqual(d["fluxes"][1] / (-want / 2), 1.0,
                               delta=1e-9)
        self.assertEqual(d["bootstrap"]["values"], [2, -1])
        # total flux: the total of the stagnant-N2 film reproduces it
        Nst = self.closed_stagnant(T, P, D, L, 0.6, 0.2)
        d = run_json("film", *base, "--total-flux", repr(Nst))
        self.assertAlmostEqual(d["fluxes"][0] / Nst, 1.0, delta=1e-9)
        self.assertLessEqual(abs(d["fluxes"][1]), 1e-9 * Nst)
        self.assertAlmostEqual(d["total_flux"] / Nst, 1.0, delta=1e-12)

    def test_profile_csv_parses_and_ends_match_inputs(self):
        header, rows, err = run_csv("film", *STEFAN, "--stagnant", "air",
                                    "--profile", "--points", "21", flag=None)
        self.assertEqual(header, ["z_m", "x_acetone", "x_methanol",
                                  "x_air"])
        self.assertEqual(len(rows), 21)
        self.assertIn("hazardous", err)  # the caution goes to stderr
        vals = [[float(v) for v in r] for r in rows]
        self.assertEqual(vals[0][0], 0.0)
        self.assertAlmostEqual(vals[-1][0], 0.238, delta=1e-15)
        for p in range(1, 21):
            # equally spaced; 15 printed digits
            self.assertAlmostEqual(vals[p][0], 0.238 * p / 20, delta=1e-14)
        x0, xL = [0.319, 0.528, 0.153], [0.0, 0.0, 1.0]
        for i in range(3):
            # the profile starts at x0 exactly (exp(0) = I) ...
            self.assertAlmostEqual(vals[0][i + 1], x0[i], delta=1e-15)
            # ... and the converged fluxes (1e-12) reproduce xL to ~1e-12,
            # as in tests/test_film.c (1e-11)
            self.assertAlmostEqual(vals[-1][i + 1], xL[i], delta=1e-11)
        for v in vals:
            # every point is a composition: sum 1 to round-off of the
            # matrix exponential
            self.assertAlmostEqual(sum(v[1:]), 1.0, delta=1e-12)
        # --csv with --profile gives the same profile; --json adds it
        h2, rows2, _ = run_csv("film", *STEFAN, "--stagnant", "air",
                               "--profile", "--points", "21")
        self.assertEqual((h2, rows2), (header, rows))
        d = run_json("film", *STEFAN, "--stagnant", "air", "--profile",
                     "--points", "21")
        self.assertEqual(len(d["profile"]["z"]), 21)
        for p in (0, 7, 20):
            for i in range(3):
                self.assertAlmostEqual(d["profile"]["x"][p][i],
                                       vals[p][i + 1], delta=1e-14)

    def test_profile_of_linearized_model_uses_exact_fluxes(self):
        _, rows, _ = run_csv("film", *STEFAN, "--stagnant", "air",
                             "--profile", "--model", "linearized", flag=None)
        # the documented rule: the profile is always the exact solution,
        # so it still ends at xL
        self.assertAlmostEqual(float(rows[-1][3]), 1.0, delta=1e-11)
        self.assertEqual(len(rows), 11)  # default --points

    def test_flux_csv_matches_json(self):
        header, rows, err = run_csv("film", *STEFAN, "--stagnant", "air",
                                    "--model", "both")
        self.assertEqual(header, ["species", "x0", "xL", "N_mol_per_m2_s",
                                  "N_linearized_mol_per_m2_s", "deviation"])
        self.assertIn("review", err)
        d = run_json("film", *STEFAN, "--stagnant", "air", "--model", "both")
        for i, r in enumerate(rows):
            self.assertEqual(r[0], d["species"][i])
            # 15 significant digits in CSV, 17 in JSON
            self.assertAlmostEqual(float(r[3]), d["fluxes"][i],
                                   delta=1e-14 * abs(d["fluxes"][0]))
            self.assertAlmostEqual(float(r[4]), d["fluxes_linearized"][i],
                                   delta=1e-14 * abs(d["fluxes"][0]))

    def test_estimated_diffusivities_are_labelled(self):
        d = run_json("film", "-s", "CO2,N2", "--x0", "0.5,0.5", "--xL",
                     "0,1", "-L", "1cm", "-T", "300", "-P", "1atm",
                     "--stagnant", "N2", "--method", "wilke-lee")
        self.assertEqual(d["binary_source"][0][1], "wilke-lee")
        self.assertGreater(d["binary_typical_error"][0][1], 0.0)
        want = self.closed_stagnant(300.0, ATM, d["binary_D"][0][1], 0.01,
                                    0.5, 0.0)
        self.assertAlmostEqual(d["fluxes"][0] / want, 1.0, delta=1e-9)

    def test_absent_stagnant_species_is_bad_input_with_library_message(self):
        for x0, xL, where in (("0.3,0.7", "0,1", "z = L"),
                              ("0,1", "0.3,0.7", "z = 0")):
            with self.subTest(x0=x0, xL=xL):
                code, out, err = run("film", "-s", "H2,N2", "--x0", x0,
                                     "--xL", xL, "-L", "1cm", "-T", "300",
                                     "-P", "1atm", "--stagnant", "H2")
                self.assertEqual(code, 2, err)
                self.assertEqual(out, "")
                self.assertIn("--stagnant", err)
                self.assertIn(where, err)
                # the library's status text (EDOM) and its detail
                self.assertIn("domain", err)
                self.assertIn("must be present at both ends", err)

    def test_non_converging_ratios_exit_1(self):
        # RATIOS with z_A between the end values: no flux reproduces xL
        # (documented ENOCONV of mcd_film_solve)
        code, out, err = run("film", "-s", "H2,N2", "--x0", "0.6,0.4",
                             "--xL", "0.2,0.8", "-L", "1cm", "-T", "300",
                             "-P", "1atm", "--ratios", "0.4,0.6", "--match",
                             "H2")
        self.assertEqual(code, 1, err)
        self.assertEqual(out, "")
        self.assertIn("failed", err)
        self.assertIn("converge", err)

    def test_bad_film_input_exits_2_and_names_the_argument(self):
        base = ["film", "-s", "H2,N2", "--x0", "0.6,0.4", "--xL",
                "0.2,0.8", "-L", "1cm", "-T", "300", "-P", "1atm"]
        short = ["film", "-s", "H2,N2", "-T", "300", "-P", "1atm"]
        cases = [
            (base, "--stagnant"),                       # no bootstrap
            (base + ["--equimolar", "--stagnant", "N2"], "--stagnant"),
            (base + ["--stagnant", "O2"], "--stagnant"),  # not in the list
            (base + ["--ratios", "2,-1"], "--match"),
            (base + ["--ratios", "2,-1", "--match", "Ar"], "--match"),
            (base + ["--ratios", "0.5,0.4", "--match", "H2"], "--ratios"),
            (base + ["--equimolar", "--match", "H2"], "--match"),
            (base + ["--weights", "1,1,1"], "--weights"),
            (base + ["--weights", "0,0"], "--weights"),
            (base + ["--total-flux", "1e6"], "--total-flux"),
            (base + ["--total-flux", "5mol"], "--total-flux"),
            (base + ["--equimolar", "--model", "fast"], "--model"),
            (base + ["--equimolar", "--points", "5"], "--points"),
            (base + ["--equimolar", "--profile", "--points", "1"],
             "--points"),
            (base + ["--equimolar", "--profile", "--points", "2.5"],
             "--points"),
            (base + ["--equimolar", "--json", "--csv"], "--csv"),
            (base + ["--equimolar", "extra"], "extra"),
            (short + ["--x0", "0.6,0.4", "-L", "1cm", "--equimolar"],
             "--xL"),
            (short + ["--xL", "0.6,0.4", "-L", "1cm", "--equimolar"],
             "--x0"),
            (short + ["--x0", "0.6,0.4,0", "--xL", "0.2,0.8", "-L", "1cm",
                      "--equimolar"], "--x0"),
            (short + ["--x0", "0.6,0.5", "--xL", "0.2,0.8", "-L", "1cm",
                      "--equimolar"], "--x0"),
            (short + ["--x0", "0.6,0.4", "--xL", "0.2,0.7", "-L", "1cm",
                      "--equimolar"], "--xL"),
            (short + ["--x0", "0.6,0.4", "--xL", "0.2,0.8", "--equimolar"],
             "--length"),
            (short + ["--x0", "0.6,0.4", "--xL", "0.2,0.8", "-L", "1km",
                      "--equimolar"], "-L"),
            (short + ["--x0", "0.6,0.4", "--xL", "0.2,0.8", "-L", "-1cm",
                      "--equimolar"], "-L"),
            (short + ["--x0", "0.6,0.4", "--xL", "0.2,0.8", "-L", "0",
                      "--equimolar"], "-L"),
        ]
        for args, name in cases:
            with self.subTest(args=args):
                code, out, err = run(*args)
                self.assertEqual(code, 2, (out, err))
                self.assertIn(name, err)
                self.assertEqual(out, "")


# An invented cell for the checks that need no outside data.
CELL = ["-s", "H2,N2,CO2", "--x1", "0.5,0.5,0", "--x2", "0,0.3,0.7",
        "--v1", "50cm3", "--v2", "0.2L", "-L", "6cm", "--area", "3mm2",
        "-T", "30C", "-P", "1atm"]
V1, V2 = 50e-6, 0.2e-3
X1_0, X2_0 = [0.5, 0.5, 0.0], [0.0, 0.3, 0.7]


class Bulbs(unittest.TestCase):
    def histories(self, *extra, flag=None):
        header, rows, err = run_csv("bulbs", *CELL, *extra, flag=flag)
        # numbers: t, x1 (3), x2 (3), N (3); then the flags (words)
        vals = [[float(v) for v in r[:10]] for r in rows]
        return header, vals, err

    def test_csv_parses_with_header_and_times(self):
        header, vals, err = self.histories("-t", "0:2h:5")
        self.assertEqual(header, ["t_s", "x1_hydrogen", "x1_nitrogen",
                                  "x1_carbon-dioxide", "x2_hydrogen",
                                  "x2_nitrogen", "x2_carbon-dioxide",
                                  "N_hydrogen_mol_per_m2_s",
                                  "N_nitrogen_mol_per_m2_s",
                                  "N_carbon-dioxide_mol_per_m2_s",
                                  "flags_hydrogen", "flags_nitrogen",
                                  "flags_carbon-dioxide"])
        self.assertEqual([v[0] for v in vals], [0, 1800, 3600, 5400, 7200])
        self.assertIn("hazardous", err)  # caution on stderr, CSV clean
        self.assertEqual(vals[0][1:7], X1_0 + X2_0)
        # --csv gives the same output as the default
        _, vals2, _ = self.histories("-t", "0:2h:5", flag="--csv")
        self.assertEqual(vals, vals2)
        # a list with units
        _, vals3, _ = self.histories("-t", "0,30min,1h,7200s,2.5h")
        self.assertEqual([v[0] for v in vals3], [0, 1800, 3600, 7200, 9000])

    def test_every_species_conserved_at_every_time(self):
        for model in ("integrated", "linearized"):
            with self.subTest(model=model):
                _, vals, _ = self.histories("-t", "0:20h:41", "--model",
                                            model)
                for v in vals:
                    for i in range(3):
                        x1, x2 = v[1 + i], v[4 + i]
                        held = (V1 * x1 + V2 * x2) / (V1 + V2)
                        init = (V1 * X1_0[i] + V2 * X2_0[i]) / (V1 + V2)
                        # conserved to round-off by construction; 15
                        # printed digits
                        self.assertAlmostEqual(held, init, delta=1e-13)
                    self.assertAlmostEqual(sum(v[1:4]), 1.0, delta=1e-12)
                    self.assertAlmostEqual(sum(v[4:7]), 1.0, delta=1e-12)

    def test_late_times_approach_the_volume_weighted_mean(self):
        mean = [(V1 * a + V2 * b) / (V1 + V2) for a, b in zip(X1_0, X2_0)]
        for model in ("integrated", "linearized"):
            with self.subTest(model=model):
                _, vals, _ = self.histories("-t", "0,10h,2000h", "--model",
                                            model)
                last = vals[-1]
                # 2000 h is hundreds of time constants 1/(beta D) for this
                # cell: exp(-hundreds) is far below 1e-9
                for i in range(3):
                    self.assertAlmostEqual(last[1 + i], mean[i], delta=1e-9)
                    self.assertAlmostEqual(last[4 + i], mean[i], delta=1e-9)
                # and the distance to the mean shrinks with time
                d10 = max(abs(vals[1][1 + i] - mean[i]) for i in range(3))
                d0 = max(abs(vals[0][1 + i] - mean[i]) for i in range(3))
                self.assertLess(d10, d0)

    def test_json_keys_and_agreement_with_csv(self):
        d = run_json("bulbs", *CELL, "-t", "0:1h:3")
        for k in ("species", "T", "P", "c", "V1", "V2", "A", "L", "beta",
                  "model", "tolerance", "binary_D", "x1_initial",
                  "x2_initial", "x_final", "t", "x1", "x2", "caution"):
            self.assertIn(k, d)
        self.assertEqual(d["model"], "integrated")
        self.assertAlmostEqual(d["V1"], V1, delta=1e-20)
        self.assertAlmostEqual(d["V2"], V2, delta=1e-20)
        self.assertAlmostEqual(d["A"], 3e-6, delta=1e-21)
        self.assertAlmostEqual(d["L"], 0.06, delta=1e-17)
        # beta = A (V1 + V2)/(L V1 V2) (the cell constant of mcdiff.h)
        self.assertAlmostEqual(d["beta"] / (3e-6 * (V1 + V2) /
                                            (0.06 * V1 * V2)), 1.0,
                               delta=1e-14)
        for i in range(3):
            self.assertAlmostEqual(
                d["x_final"][i], (V1 * X1_0[i] + V2 * X2_0[i]) / (V1 + V2),
                delta=1e-15)
        self.assertEqual(d["t"], [0, 1800, 3600])
        _, vals, _ = self.histories("-t", "0:1h:3")
        for k in range(3):
            for i in range(3):
                self.assertAlmostEqual(d["x1"][k][i], vals[k][1 + i],
                                       delta=1e-14)
                self.assertAlmostEqual(d["x2"][k][i], vals[k][4 + i],
                                       delta=1e-14)
        self.assertIn("hazardous", d["caution"])

    def test_times_in_other_units(self):
        # input in d, output in h: the same instants as in seconds
        header, vals, _ = self.histories("-t", "0,90min,1.5h,0.25d",
                                         "--time-unit", "h")
        self.assertEqual(header[0], "t_h")
        self.assertEqual([v[0] for v in vals], [0, 1.5, 1.5, 6])
        _, vs, _ = self.histories("-t", "0,5400,5400,21600")
        for a, b in zip(vals, vs):
            self.assertEqual(a[1:], b[1:])
        d = run_json("bulbs", *CELL, "-t", "0,2d", "--time-unit", "d")
        self.assertEqual(d["t"], [0, 172800])  # JSON t stays in s
        self.assertEqual(d["time_unit"], "d")
        self.assertEqual(d["t_in_unit"], [0, 2])
        code, out, err = run("bulbs", *CELL, "-t", "0,1h", "--time-unit",
                             "week")
        self.assertEqual(code, 2)
        self.assertIn("--time-unit", err)

    def test_coupling_flags_follow_fluxes_and_gradients(self):
        # The documented rules recomputed from the printed N and x at every
        # time: with g_i = (x2_i - x1_i)/L, zero meaning at most 1e-3 of the
        # largest |g| or |N| of that time.
        d = run_json("bulbs", *CELL, "-t", "0,1min,10min,1h,5h,20h")
        self.assertEqual(d["flag_tolerance"], 1e-3)
        L = d["L"]
        seen = set()
        for k, t in enumerate(d["t"]):
            x1, x2, N = d["x1"][k], d["x2"][k], d["N"][k]
            g = [(b - a) / L for a, b in zip(x1, x2)]
            gmax, nmax = max(map(abs, g)), max(map(abs, N))
            # equimolar capillary: the fluxes sum to zero (round-off of
            # the largest)
            self.assertLess(abs(sum(N)), 1e-12 * nmax)
            for i in range(3):
                small_g = abs(g[i]) <= 1e-3 * gmax
                small_n = abs(N[i]) <= 1e-3 * nmax
                want = []
                if small_g and not small_n:
                    want = ["osmotic"]
                elif small_n and not small_g:
                    want = ["barrier"]
                elif not small_g and not small_n and N[i] * g[i] > 0:
                    want = ["reverse"]
                self.assertEqual(d["flags"][k][i], want, (t, i))
                seen.update(want)
        # hydrogen and carbon dioxide move down their gradients at t = 0
        self.assertEqual(d["flags"][0][0], [])
        self.assertEqual(d["flags"][0][2], [])
        # CSV carries the same words
        header, rows, _ = run_csv("bulbs", *CELL, "-t",
                                  "0,1min,10min,1h,5h,20h")
        j = header.index("flags_hydrogen")
        for k, r in enumerate(rows):
            self.assertEqual([w for w in r[j:j + 3]],
                             [" ".join(f) for f in d["flags"][k]])

    def test_osmotic_and_reverse_diffusion_of_a_species_without_gradient(self):
        # nitrogen at 0.5 in both bulbs between hydrogen and carbon dioxide
        # (an invented cell of the Duncan-Toor kind): at t = 0 nitrogen has
        # a flux but no gradient (osmotic), soon after it flows up its own
        # gradient (reverse); the flux direction is the library's, the
        # flags are the documented rule.
        cell = ["-s", "H2,N2,CO2", "--x1", "0.5,0.5,0", "--x2", "0,0.5,0.5",
                "--v1", "80cm3", "--v2", "0.1L", "-L", "9cm", "--diameter",
                "2mm", "-T", "35C", "-P", "1atm"]
        d = run_json("bulbs", *cell, "-t", "0,5min,1h")
        self.assertEqual(d["flags"][0][1], ["osmotic"])
        self.assertEqual(d["flags"][1][1], ["reverse"])
        self.assertEqual(d["flags"][2][1], ["reverse"])

    def test_round_off_prints_as_zero_in_csv_and_stays_in_json(self):
        # the linearized solution at t = 0 leaves round-off where a species
        # is absent; the CSV prints 0 and JSON the computed double, below
        # the documented bound 2^-46 (mole fractions: scale 1)
        _, rows, _ = run_csv("bulbs", *CELL, "-t", "0,1h", "--model",
                             "linearized")
        d = run_json("bulbs", *CELL, "-t", "0,1h", "--model", "linearized")
        for r, x in ((rows[0][3], d["x1"][0][2]), (rows[0][4], d["x2"][0][0])):
            self.assertEqual(float(r), 0.0)
            self.assertFalse(r.startswith("-"))
            self.assertLessEqual(abs(x), 2.0 ** -46)
        self.assertTrue(d["x1"][0][2] != 0.0 or d["x2"][0][0] != 0.0,
                        "no round-off left at t = 0: the check shows nothing")

    def test_film_profile_end_prints_zero_not_round_off(self):
        # the Stefan tube ends in pure air: acetone and methanol are 0
        # there; the profile's last row prints 0 (round-off bound 2^-46 of
        # the fraction scale 1), JSON the computed doubles within it
        _, rows, _ = run_csv("film", *STEFAN, "--stagnant", "air",
                             "--profile", flag=None)
        self.assertEqual(rows[-1][1:3], ["0", "0"])
        d = run_json("film", *STEFAN, "--stagnant", "air", "--profile")
        for v in d["profile"]["x"][-1][:2]:
            self.assertLessEqual(abs(v), 2.0 ** -46)

    def test_diameter_equals_area(self):
        # A = pi d^2/4 (common practice)
        d_mm = 2.0
        area = math.pi * (d_mm * 1e-3) ** 2 / 4
        a = run_json("bulbs", *[c if c != "3mm2" else repr(area)
                                for c in CELL], "-t", "0,1h")
        cell = CELL[:CELL.index("--area")] + ["--diameter", "2mm"] + \
            CELL[CELL.index("--area") + 2:]
        b = run_json("bulbs", *cell, "-t", "0,1h")
        self.assertAlmostEqual(b["A"] / area, 1.0, delta=1e-15)
        for i in range(3):
            self.assertAlmostEqual(a["x1"][1][i], b["x1"][1][i], delta=1e-12)

    def test_linearized_close_to_integrated(self):
        _, vi, _ = self.histories("-t", "0:10h:11")
        _, vl, _ = self.histories("-t", "0:10h:11", "--model", "linearized")
        # the linearized theory is a close approximation (Toor 1964;
        # common practice), less so for the large differences of this
        # cell (H2 0.5 against 0): allow 0.02 in mole fraction (measured
        # 0.013, deterministic)
        worst = max(abs(a - b) for ri, rl in zip(vi, vl)
                    for a, b in zip(ri[1:], rl[1:]))
        self.assertLess(worst, 0.02)
        self.assertGreater(worst, 0.0)  # two different models

    def test_duncan_toor_nitrogen_diffuses_uphill(self):
        # Duncan and Toor (1962), AIChE J. 8, 38: two-bulb cell (77.99 and
        # 78.63 cm^3, capillary 85.9 mm long, 2.08 mm across) at 35.2 C,
        # 1 atm; bulb 1 H2 0, N2 0.50086, CO2 0.49914; bulb 2 H2 0.50121,
        # N2 0.49879, CO2 0; Đ(H2-N2) = 83.8, Đ(H2-CO2) = 68.0,
        # Đ(N2-CO2) = 16.8 mm^2/s. All FROM MEMORY. They observed that N2,
        # with almost no difference between the bulbs at the start, first
        # diffuses up its own gradient (the difference grows and changes
        # sign) and only later relaxes (from memory; checked qualitatively
        # here, no measured value is used).
        header, rows, _ = run_csv(
            "bulbs", "-s", "H2,N2,CO2", "--x1", "0,0.50086,0.49914",
            "--x2", "0.50121,0.49879,0", "--v1", "77.99cm3", "--v2",
            "78.63cm3", "-L", "85.9mm", "--diameter", "2.08mm", "-t",
            "0:40h:81", "-T", "35.2C", "-P", "1atm",
            "--pair", "H2:N2=83.8e-6", "--pair", "H2:CO2=68.0e-6",
            "--pair", "N2:CO2=16.8e-6", flag=None)
        dn2 = [float(r[header.index("x2_nitrogen")]) -
               float(r[header.index("x1_nitrogen")]) for r in rows]
        self.assertLess(dn2[0], 0.0)           # bulb 1 starts richer
        peak = max(range(len(dn2)), key=lambda k: dn2[k])
        self.assertGreater(dn2[peak], 0.05)    # reversed and grew large
        self.assertGreater(peak, 0)
        self.assertLess(peak, len(dn2) - 1)    # a maximum, then decay
        self.assertLess(dn2[-1], dn2[peak])

    def test_bad_bulbs_input_exits_2_and_names_the_argument(self):
        def cell(opt, value):
            out = list(CELL)
            out[out.index(opt) + 1] = value
            return out

        def without(opt):
            out = list(CELL)
            k = out.index(opt)
            return out[:k] + out[k + 2:]

        T = ["-t", "0,1h"]
        cases = [
            (CELL, "--times"),                          # no times
            (CELL + ["-t", "1h,0"], "-t"),
            (CELL + ["-t", "0:1h:1"], "-t"),
            (CELL + ["-t", "1h:0:5"], "-t"),
            (CELL + ["-t", "0:1h"], "-t"),
            (CELL + ["-t", "0,-1h"], "-t"),
            (CELL + ["-t", "0,1day"], "-t"),
            (CELL + ["-t", "0,,1h"], "-t"),
            (CELL + T + ["-t", "2h"], "-t"),
            (cell("--v1", "-1L") + T, "--v1"),
            (cell("--v2", "5gal") + T, "--v2"),
            (cell("--area", "0") + T, "--area"),
            (cell("-L", "3ft") + T, "-L"),
            (cell("--x2", "0,0.3,0.6") + T, "--x2"),
            (cell("--x1", "0.5,0.5") + T, "--x1"),
            (cell("--x1", "0.5,0.6,-0.1") + T, "--x1"),
            (without("--x2") + T, "--x2"),
            (without("--v1") + T, "--v1"),
            (without("--area") + T, "--area"),
            (without("-L") + T, "--length"),
            (CELL + T + ["--diameter", "2mm"], "--diameter"),
            (CELL + T + ["--model", "fast"], "--model"),
            (CELL + T + ["--tolerance", "1"], "--tolerance"),
            (CELL + T + ["--model", "linearized", "--tolerance", "1e-8"],
             "--tolerance"),
            (CELL + T + ["--json", "--csv"], "--csv"),
            (CELL + T + ["--pair", "H2:Ar=1e-5"], "--pair"),
        ]
        for args, name in cases:
            with self.subTest(args=args):
                code, out, err = run("bulbs", *args)
                self.assertEqual(code, 2, (out, err))
                self.assertIn(name, err)
                self.assertEqual(out, "")


POROUS = ["porous", "-s", "H2,N2", "-x", "0.5,0.5", "-g", "-100,100",
          "-T", "300", "-P", "1atm", "--porosity", "0.4", "--tortuosity",
          "3", "--pore-diameter", "100nm"]


class Porous(unittest.TestCase):
    """mcdiff porous: Graham's law, the closed end, CSV, bad input."""

    def test_graham_law_under_uniform_pressure(self):
        # Graham (1833): N_H2 / N_N2 = -sqrt(M_N2 / M_H2) at any pore size
        for d in ("10nm", "1um", "1mm"):
            r = run_json(*POROUS[:-1], d)
            N = [row[0] for row in r["fluxes"]]
            M = r["M"]
            self.assertAlmostEqual(N[0] / N[1], -math.sqrt(M[1] / M[0]),
                                   delta=1e-9)
            self.assertIn("fitted", r["caution"])

    def test_closed_end_has_zero_total_flux_and_a_pressure_gradient(self):
        r = run_json(*POROUS, "--closed")
        N = [row[0] for row in r["fluxes"]]
        self.assertAlmostEqual(N[0] + N[1], 0.0, delta=1e-12 * abs(N[0]))
        # hydrogen diffuses out faster: the pressure rises towards +z
        self.assertGreater(r["grad_P"][0], 0.0)
        # the same pressure gradient given back reproduces the fluxes
        r2 = run_json(*POROUS, "--grad-p", repr(r["grad_P"][0]))
        for a, b in zip(r["fluxes"], r2["fluxes"]):
            self.assertAlmostEqual(a[0], b[0], delta=1e-9 * abs(N[0]))

    def test_csv_and_given_viscosity(self):
        header, rows, err = run_csv(*POROUS, "--viscosity", "0.018cP")
        self.assertEqual(header, ["species", "x", "dx_dz1_per_m",
                                  "N_1_mol_per_m2_s", "DKe_m2_per_s"])
        self.assertEqual(len(rows), 2)
        self.assertIn("review", err)
        r = run_json(*POROUS, "--viscosity", "0.018cP")
        self.assertAlmostEqual(r["viscosity"], 1.8e-5, delta=1e-20)
        self.assertEqual(r["viscosity_source"], "user")

    def test_bad_input_names_the_option(self):
        cases = [(["--porosity", "1.5"], "--porosity"),
                 (["--tortuosity", "0.5"], "--tortuosity"),
                 (["--pore-diameter", "-3nm"], "--pore-diameter"),
                 (["--permeability", "0"], "--permeability"),
                 (["--viscosity", "-1"], "--viscosity"),
                 (["--grad-p", "1,2"], "--grad-p"),
                 (["--closed", "--grad-p", "5"], "--grad-p"),
                 (["--total-flux", "1,2"], "--total-flux")]
        for extra, name in cases:
            with self.subTest(extra=extra):
                code, out, err = run(*POROUS, *extra)
                self.assertEqual(code, 2, (out, err))
                self.assertIn(name, err)
                self.assertEqual(out, "")
        code, out, err = run(*[w for w in POROUS if w != "--porosity"
                               and w != "0.4"])
        self.assertEqual(code, 2)
        self.assertIn("--porosity", err)


SLAB = ["porous", "slab", "-s", "H2,N2", "--x0", "0.8,0.2", "--xL",
        "0.1,0.9", "-L", "2mm", "-T", "300", "-P", "1atm", "--porosity",
        "0.4", "--tortuosity", "3", "--pore-diameter", "100nm"]


class PorousSlab(unittest.TestCase):
    """mcdiff porous slab: the four conditions, profile, CSV, bad input."""

    def test_equal_pressures_follow_graham(self):
        # equal end pressures: the pressure stays uniform, Graham's law
        # (1833) holds at every point, N_H2 / N_N2 = -sqrt(M_N2 / M_H2)
        r = run_json(*SLAB, "--pL", "1atm")
        N, M = r["fluxes"], r["M"]
        self.assertAlmostEqual(N[0] / N[1], -math.sqrt(M[1] / M[0]),
                               delta=1e-7)
        self.assertEqual(r["condition"], "pressures")
        self.assertIn("fitted", r["caution"])
        for a, b in zip(r["xL_solved"], [0.1, 0.9]):
            self.assertAlmostEqual(a, b, delta=1e-8)

    def test_stagnant_total_and_ratios(self):
        r = run_json(*SLAB, "--stagnant", "N2")
        self.assertEqual(r["fluxes"][1], 0.0)
        # the hydrogen flux needs a falling pressure across the slab
        self.assertLess(r["PL"], r["P0"])
        t = run_json(*SLAB, "--total-flux", "0.01")
        self.assertAlmostEqual(sum(t["fluxes"]), 0.01, delta=1e-11)
        # 2 H2 -> N2 at the far face (a made-up stoichiometry): N_N2 =
        # -N_H2 / 2; only x_H2 at z = L is matched
        q = run_json(*SLAB, "--ratios", "2,-1", "--match", "H2")
        NA, NB = q["fluxes"]
        self.assertAlmostEqual(NB, -0.5 * NA, delta=1e-15 * abs(NA))
        self.assertAlmostEqual(q["xL_solved"][0], 0.1, delta=1e-8)
        self.assertEqual(q["matched"], "hydrogen")

    def test_profile_and_csv(self):
        header, rows, err = run_csv(*SLAB, "--pL", "0.5atm", "--profile",
                                    "--points", "5")
        self.assertEqual(header, ["z_m", "x_hydrogen", "x_nitrogen", "P_Pa"])
        self.assertEqual(len(rows), 5)
        self.assertAlmostEqual(float(rows[-1][3]), 0.5 * 101325,
                               delta=1e-6 * 101325)
        self.assertAlmostEqual(float(rows[-1][0]), 2e-3, delta=1e-18)
        self.assertIn("review", err)
        header, rows, err = run_csv(*SLAB, "--pL", "0.5atm")
        self.assertEqual(header, ["species", "x0", "xL", "xL_solved",
                                  "N_mol_per_m2_s"])
        self.assertEqual(len(rows), 2)

    def test_bad_input_names_the_option(self):
        cases = [(["--pL", "1atm", "--stagnant", "N2"], "--stagnant"),
                 (["--ratios", "2,-1"], "--match"),
                 (["--ratios", "2,-2", "--match", "H2"], "--ratios"),
                 (["--ratios", "2,-1", "--match", "O2"], "--match"),
                 (["--stagnant", "Ar"], "--stagnant"),
                 (["--stagnant", "N2", "--match", "H2"], "--match"),
                 (["--total-flux", "1,2"], "--total-flux"),
                 (["--pL", "-1"], "--pL"),
                 (["--pL", "1atm", "--points", "5"], "--points"),
                 (["--porosity", "0.5", "--pL", "1atm"], "--porosity"),
                 ([], "--pL")]
        for extra, name in cases:
            with self.subTest(extra=extra):
                code, out, err = run(*SLAB, *extra)
                self.assertEqual(code, 2, (out, err))
                self.assertIn(name, err)
                self.assertEqual(out, "")
        code, out, err = run(*[w for w in SLAB if w not in ("-L", "2mm")],
                             "--pL", "1atm")
        self.assertEqual(code, 2)
        self.assertIn("--length", err)
        code, out, err = run("porous", "slab", "--help")
        self.assertEqual(code, 0)
        self.assertIn("usage: mcdiff porous slab", out)


class Csv(unittest.TestCase):
    """--csv of every command that prints a table parses with the csv
    module: one header row with SI units in the names, then data rows."""

    def test_species_csv(self):
        header, rows, _ = run_csv("species")
        self.assertEqual(header[:4], ["name", "formula", "M_kg_per_mol",
                                      "V_diff"])
        for h in ("sigma_m", "eps_k_K", "dipole_C_m", "Vb_m3_per_mol",
                  "Tb_K", "Tc_K", "Pc_Pa"):
            self.assertIn(h, header)
        d = run_json("species")
        self.assertEqual(len(rows), len(d["species"]))
        for r, s in zip(rows, d["species"]):
            self.assertEqual(r[0], s["name"])
            for h, key in (("M_kg_per_mol", "M"), ("sigma_m", "sigma"),
                           ("Tb_K", "Tb")):
                v = r[header.index(h)]
                if s[key] is None:
                    self.assertEqual(v, "")   # not known: empty field
                else:
                    self.assertAlmostEqual(float(v) / s[key], 1.0,
                                           delta=1e-14)
        header1, rows1, _ = run_csv("species", "CO2")
        self.assertEqual(header1, header)
        self.assertEqual(len(rows1), 1)
        self.assertEqual(rows1[0][0], "carbon-dioxide")

    def test_binary_csv(self):
        header, rows, err = run_csv("binary", "CO2", "N2", "-T", "300",
                                    "-P", "1atm")
        self.assertEqual(header, ["species_a", "species_b", "T_K", "P_Pa",
                                  "method", "status", "D_m2_per_s",
                                  "typical_error", "published_error",
                                  "recommended", "warnings"])
        self.assertIn("review", err)
        d = run_json("binary", "CO2", "N2", "-T", "300", "-P", "1atm")
        self.assertEqual(len(rows), len(d["results"]))
        rec = [r for r in rows if r[header.index("recommended")] == "1"]
        self.assertEqual(len(rec), 1)
        self.assertAlmostEqual(float(rec[0][6]) / d["D"], 1.0, delta=1e-14)
        h2, rows2, _ = run_csv("binary", "ethanol", "water", "-T", "25C",
                               "--viscosity", "0.89cP")
        self.assertIn("viscosity_Pa_s", h2)
        self.assertEqual(rows2[0][h2.index("P_Pa")], "")  # liquid: no P
        self.assertEqual(rows2[0][h2.index("method")], "wilke-chang")

    def test_binary_recommends_brokaw_for_polar_pairs(self):
        # water (1.8 debye) + air: Brokaw's polar correction is recommended;
        # N2 + O2 (nonpolar): the first method that applies, fsg
        d = run_json("binary", "water", "air", "-T", "25C", "-P", "1atm")
        self.assertEqual(d["method"], "brokaw")
        self.assertIn("brokaw", [r["method"] for r in d["results"]])
        d = run_json("binary", "N2", "O2", "-T", "25C", "-P", "1atm")
        self.assertEqual(d["method"], "fsg")
        d = run_json("binary", "ammonia", "H2", "-T", "293", "-P", "1atm",
                     "--method", "brokaw")
        self.assertEqual(d["method"], "brokaw")
        self.assertEqual(len(d["results"]), 1)

    def test_fluxes_csv(self):
        header, rows, _ = run_csv("fluxes", *STATE3, "-g", "-20,0,20",
                                  "-g", "1,2,-3")
        self.assertEqual(header, ["species", "x", "dx_dz1_per_m",
                                  "dx_dz2_per_m", "J_1_mol_per_m2_s",
                                  "J_2_mol_per_m2_s", "flags"])
        d = run_json("fluxes", *STATE3, "-g", "-20,0,20", "-g", "1,2,-3")
        big = max(abs(v) for row in d["fluxes"] for v in row)
        for i, r in enumerate(rows):
            self.assertEqual(r[0], d["species"][i])
            for k in range(2):
                self.assertAlmostEqual(float(r[4 + k]), d["fluxes"][i][k],
                                       delta=1e-14 * big)
            self.assertEqual(r[6].split(), d["flags"][i])
        header, rows, _ = run_csv("fluxes", "-s", "CO2,N2,water", "-w",
                                  "0.3,0.6,0.1", "-g", "2,-1,-1", "-T",
                                  "400", "-P", "2bar")
        self.assertEqual(header, ["species", "w", "dw_dz1_per_m",
                                  "j_1_kg_per_m2_s", "flags"])
        self.assertEqual(len(rows), 3)

    def test_matrix_csv(self):
        header, rows, _ = run_csv("matrix", *STATE3)
        self.assertEqual(header, ["quantity", "row", "column",
                                  "value_m2_per_s"])
        d = run_json("matrix", *STATE3)
        kinds = [r[0] for r in rows]
        self.assertEqual(kinds.count("binary"), 3)
        self.assertEqual(kinds.count("fick"), 4)
        self.assertEqual(kinds.count("eigenvalue"), 4)  # 2 x (real, imag)
        fick = [float(r[3]) for r in rows if r[0] == "fick"]
        flat = [v for row in d["fick_matrix"] for v in row]
        for a, b in zip(fick, flat):
            self.assertAlmostEqual(a / b, 1.0, delta=1e-14)
        re = [float(r[3]) for r in rows
              if r[0] == "eigenvalue" and r[2] == "real"]
        for a, b in zip(re, d["eigenvalues"]["re"]):
            self.assertAlmostEqual(a / b, 1.0, delta=1e-14)
        # fluxes need 'fluxes --csv'
        code, out, err = run("matrix", *STATE3, "-g", "1,0,-1", "--csv")
        self.assertEqual(code, 2)
        self.assertIn("--csv", err)

    def test_json_and_csv_together_is_bad_input(self):
        for args in (["species"], ["binary", "CO2", "N2", "-T", "300", "-P",
                                   "1atm"],
                     ["fluxes", *STATE3, "-g", "1,0,-1"],
                     ["matrix", *STATE3]):
            with self.subTest(args=args):
                code, out, err = run(*args, "--json", "--csv")
                self.assertEqual(code, 2, err)
                self.assertIn("--csv", err)
                self.assertEqual(out, "")


def man_text():
    """The man page rendered as plain ASCII text by groff, or None."""
    if not shutil.which("groff"):
        return None
    p = subprocess.run(["groff", "-man", "-Tascii", "-P-cbou", MAN_PAGE],
                       capture_output=True, text=True, timeout=60)
    if p.returncode != 0:
        raise AssertionError(p.stderr)
    return p.stdout


class Liquid(unittest.TestCase):
    """mcdiff liquid: NRTL with alpha = 0 is the two-suffix Margules
    equation (Renon and Prausnitz 1968): ln gamma_1 = A x_2^2, A = tau_12 +
    tau_21, reduced Gamma 1 - 2 A x_1 x_2; Vignes diffusivities; the
    vapour pressure of water from its Antoine constants (Stull 1947 via
    the NIST WebBook, from memory) against IAPWS-95 (3169.9 Pa at 25 C,
    from memory) within 2 %."""

    MARGULES = ["-x", "0.3,0.7", "-T", "300", "--pair", "1:2=1,0,0,1,0,0,0"]

    def test_margules_limit_and_vignes(self):
        r = run_json("liquid", *self.MARGULES, "--dinf", "1:2=2e-9,1e-9")
        self.assertAlmostEqual(r["ln_gamma"][0], 2 * 0.49, delta=1e-12)
        G = r["Gamma"]
        self.assertAlmostEqual(G[0][0] - G[0][1], 1 - 4 * 0.21, delta=1e-12)
        self.assertAlmostEqual(r["Dij"][0][1] / (2e-9 ** 0.7 * 1e-9 ** 0.3),
                               1.0, delta=1e-12)
        code, out, _ = run("liquid", *self.MARGULES)
        self.assertEqual(code, 0)
        self.assertIn("thermodynamic factor", out)
        self.assertIn("licensed engineering review", out)

    def test_water_vapour_pressure(self):
        r = run_json("liquid", "-x", "1", "-T", "25C", "--model", "ideal",
                     "--antoine", "1=9.6543,1435.264,-64.848,255.9,373")
        self.assertAlmostEqual(r["partial_pressures_Pa"][0] / 3169.9, 1.0,
                               delta=0.02)

    def test_refusals(self):
        # beyond the spinodal (x1 x2 > 1/(2A) = 0.25 / ... ): exit 1
        code, _, err = run("liquid", "-x", "0.5,0.5", "-T", "300", "--pair",
                           "1:2=1,0,0,1,0,0,0")
        self.assertEqual(code, 1)
        self.assertIn("not stable", err)
        for bad in (["-x", "0.3,0.7", "-T", "300"],  # pair missing
                    ["-x", "0.3,0.7", "-T", "300", "--pair", "1:3=1,0,0,1,0,0"],
                    ["-x", "0.3,0.7", "-T", "300", "--pair", "1:2=1,0"],
                    ["-x", "0.3,0.7", "--pair", "1:2=1,0,0,1,0,0"],
                    ["-x", "0.3,0.7", "-T", "300", "--model", "vanlaar"]):
            with self.subTest(args=bad):
                code, _, err = run("liquid", *bad)
                self.assertEqual(code, 2, err)
                self.assertTrue(err.startswith("mcdiff liquid:"), err)


EXAMPLE_LIQUID = os.path.join(
    os.path.dirname(os.path.abspath(__file__)), "..", "..", "examples",
    "liquid-methanol-water.txt")


def solve(A, b):
    """Gaussian elimination with partial pivoting (the test's own solver)."""
    n = len(b)
    M = [list(A[i]) + [b[i]] for i in range(n)]
    for k in range(n):
        p = max(range(k, n), key=lambda r: abs(M[r][k]))
        M[k], M[p] = M[p], M[k]
        for r in range(k + 1, n):
            f = M[r][k] / M[k][k]
            for c in range(k, n + 1):
                M[r][c] -= f * M[k][c]
    x = [0.0] * n
    for k in reversed(range(n)):
        x[k] = (M[k][n] - sum(M[k][c] * x[c] for c in range(k + 1, n))) / \
            M[k][k]
    return x


def ms_fluxes(c, x, D, G, g):
    """Molar diffusion fluxes J (one direction) of the Maxwell-Stefan
    equations d_i = sum_j G_ij g_j = sum_{j != i} (x_i J_j - x_j J_i) /
    (c D_ij), sum J = 0 (Taylor and Krishna 1993, ch. 2; common practice),
    solved here for J_1..J_{n-1} with J_n = -sum: independent of the
    library's symmetric solver."""
    n = len(x)
    d = [sum(G[i][j] * g[j] for j in range(n)) for i in range(n)]

    def resid(u):
        J = list(u) + [-sum(u)]
        return [sum((x[i] * J[j] - x[j] * J[i]) / (c * D[i][j])
                    for j in range(n) if j != i) for i in range(n - 1)]
    cols = [resid([1.0 if k == m else 0.0 for k in range(n - 1)])
            for m in range(n - 1)]
    A = [[cols[m][i] for m in range(n - 1)] for i in range(n - 1)]
    u = solve(A, d[:n - 1])
    return u + [-sum(u)]


def write_params(text):
    f = tempfile.NamedTemporaryFile("w", suffix=".txt", delete=False)
    f.write(text)
    f.close()
    return f.name


# Three species with arbitrary NRTL parameters and diffusivities: the
# checks below are identities, no outside data.
PARAMS3 = """# arbitrary parameters for identity checks
model nrtl
species acetone    M=58.08g/mol
species methanol   M=32.042g/mol
species water      M=18.015g/mol
pair acetone methanol  a12=0.3 a21=0.2 b12=10 alpha=0.3
pair acetone water     a12=0.6 a21=0.9 alpha=0.3 range=280K..350K
pair methanol water    b12=-50 b21=120 e12=0 alpha=0.3
dinf acetone methanol  D12=2.1e-9m2/s D21=2.6e-9m2/s
dinf acetone water     D12=1.2e-9m2/s D21=1.7e-9m2/s
dinf methanol water    D12=1.5e-5cm2/s D21=2.0e-5cm2/s
"""


class LiquidFluxes(unittest.TestCase):
    """mcdiff liquid -g: fluxes of a liquid with its Gamma and Đ."""

    @classmethod
    def setUpClass(cls):
        cls.f3 = write_params(PARAMS3)

    @classmethod
    def tearDownClass(cls):
        os.unlink(cls.f3)

    def test_binary_margules_closed_form(self):
        # NRTL with alpha = 0 is the two-suffix Margules equation (Renon
        # and Prausnitz 1968): ln gamma_1 = A x_2^2 with A = tau_12 +
        # tau_21 = 2, so the reduced thermodynamic factor is 1 - 2 A x_1
        # x_2; Vignes (1966): Đ = D12^x2 D21^x1. Binary Maxwell-Stefan:
        # J_1 = -c Đ Gamma dx_1/dz (common practice). All independent of
        # the library; 1e-12 relative is round-off of a few operations.
        for x1, g1, c in ((0.3, -100.0, 4e4), (0.85, 37.0, 1.1e4),
                          (0.1, 2.5e3, 5.5e4)):
            with self.subTest(x1=x1):
                d = run_json("liquid", "-x", f"{x1},{1 - x1}", "-T", "300",
                             "--pair", "1:2=1,0,0,1,0,0,0", "--dinf",
                             "1:2=2e-9,1e-9", "-g", f"{g1},{-g1}",
                             "--concentration", f"{c}")
                Gam = 1 - 4 * x1 * (1 - x1)
                Dv = 2e-9 ** (1 - x1) * 1e-9 ** x1
                want = -c * Dv * Gam * g1
                self.assertAlmostEqual(d["fluxes"][0][0] / want, 1.0,
                                       delta=1e-12)
                self.assertAlmostEqual(d["fluxes"][1][0] / -want, 1.0,
                                       delta=1e-12)
                self.assertAlmostEqual(d["fick_matrix"][0][0] / (Dv * Gam),
                                       1.0, delta=1e-12)
                self.assertEqual(d["c_from"], "--concentration")

    def test_ternary_fluxes_solve_the_maxwell_stefan_equations(self):
        # the printed Gamma and Đ put into the Maxwell-Stefan equations and
        # solved by the test's own elimination give the printed fluxes;
        # two directions, zero-sum; the Fick matrix reproduces them.
        # Tolerance 1e-10 of the largest flux: round-off of two different
        # solutions of a well-conditioned 2 x 2 system.
        g = [[-40.0, 15.0], [65.0, -5.0], [-25.0, -10.0]]
        x = [0.2, 0.3, 0.5]
        d = run_json("liquid", "--params", self.f3, "-x", "0.2,0.3,0.5",
                     "-T", "310", "-g", "-40,65,-25", "-g", "15,-5,-10",
                     "--concentration", "30mol/L")
        self.assertAlmostEqual(d["c"], 3e4, delta=1e-9)
        self.assertEqual(d["species"], ["acetone", "methanol", "water"])
        self.assertEqual(d["fick_dependent"], "water")  # most abundant
        F = d["fluxes"]
        big = max(abs(v) for row in F for v in row)
        self.assertGreater(big, 0.0)
        for k in range(2):
            want = ms_fluxes(3e4, x, d["Dij"], d["Gamma"],
                             [g[i][k] for i in range(3)])
            for i in range(3):
                self.assertAlmostEqual(F[i][k], want[i], delta=1e-10 * big)
            self.assertLessEqual(abs(sum(F[i][k] for i in range(3))),
                                 1e-14 * big)
            Dm = d["fick_matrix"]
            for r in range(2):
                J = -3e4 * sum(Dm[r][m] * g[m][k] for m in range(2))
                self.assertAlmostEqual(F[r][k], J, delta=1e-10 * big)
        # Gamma is not the identity here: ideal fluxes would differ
        ideal = ms_fluxes(3e4, x, d["Dij"], [[1, 0, 0], [0, 1, 0],
                                               [0, 0, 1]], [-40, 65, -25])
        self.assertGreater(max(abs(ideal[i] - F[i][0]) for i in range(3)),
                           1e-3 * big)

    def test_mass_basis_and_volume_frame_are_the_frame_changes(self):
        # j_i = M_i J_i - w_i sum_k M_k J_k and J^V_i = J_i - c x_i sum_k
        # Vbar_k J_k (Taylor and Krishna 1993, ch. 1; common practice);
        # c from --density is rho / sum x_i M_i, from --partial-volumes
        # 1 / sum x_i Vbar_i (definitions)
        x = [0.2, 0.3, 0.5]
        M = [0.05808, 0.032042, 0.018015]
        V = [74e-6, 40.7e-6, 18.1e-6]
        base = ["liquid", "--params", self.f3, "-x", "0.2,0.3,0.5", "-T",
                "310", "-g", "-40,65,-25"]
        rho = 880.0
        cr = rho / sum(x[i] * M[i] for i in range(3))
        mole = run_json(*base, "--density", f"{rho}")
        mass = run_json(*base, "--density", "0.88g/cm3", "--basis", "mass")
        self.assertAlmostEqual(mole["c"] / cr, 1.0, delta=1e-14)
        self.assertEqual(mole["M"], M)
        J = [r[0] for r in mole["fluxes"]]
        Mbar = sum(x[i] * M[i] for i in range(3))
        w = [x[i] * M[i] / Mbar for i in range(3)]
        S = sum(M[k] * J[k] for k in range(3))
        big = max(abs(M[i] * J[i]) for i in range(3))
        for i in range(3):
            self.assertAlmostEqual(mass["fluxes"][i][0], M[i] * J[i] -
                                   w[i] * S, delta=1e-12 * big)
        self.assertEqual(mass["frame"], "mass-average")
        cv = 1 / sum(x[i] * V[i] for i in range(3))
        vs = ",".join(f"{v}" for v in V)
        mol2 = run_json(*base, "--partial-volumes", vs)
        vol = run_json(*base, "--partial-volumes", vs, "--basis", "volume")
        self.assertAlmostEqual(vol["c"] / cv, 1.0, delta=1e-14)
        self.assertEqual(vol["frame"], "volume-average")
        J = [r[0] for r in mol2["fluxes"]]
        SV = sum(V[k] * J[k] for k in range(3))
        bigJ = max(abs(v) for v in J)
        for i in range(3):
            self.assertAlmostEqual(vol["fluxes"][i][0],
                                   J[i] - cv * x[i] * SV, delta=1e-12 * bigJ)
        self.assertLessEqual(abs(sum(V[i] * vol["fluxes"][i][0]
                                     for i in range(3))),
                             1e-14 * max(abs(V[i] * vol["fluxes"][i][0])
                                         for i in range(3)))
        # the volume-frame Fick matrix gives the volume-frame fluxes
        Dm, g = vol["fick_matrix"], [-40.0, 65.0, -25.0]
        for r in range(2):
            self.assertAlmostEqual(vol["fluxes"][r][0],
                                   -cv * (Dm[r][0] * g[0] + Dm[r][1] * g[1]),
                                   delta=1e-10 * bigJ)

    def test_mass_fraction_input_is_the_same_state(self):
        # -w W -g dW describes the state -x X -g dX with x_i = (w_i/M_i)/S,
        # S = sum_k w_k/M_k, and dx_i = (dw_i/M_i - x_i sum_k dw_k/M_k)/S
        # (differentiating the definition; common practice): the molar
        # fluxes agree to round-off (1e-12 of the largest)
        M = [0.05808, 0.032042, 0.018015]
        w = [0.3, 0.25, 0.45]
        dw = [-30.0, 50.0, -20.0]
        S = sum(w[k] / M[k] for k in range(3))
        x = [w[i] / M[i] / S for i in range(3)]
        T = sum(dw[k] / M[k] for k in range(3))
        dx = [(dw[i] / M[i] - x[i] * T) / S for i in range(3)]
        common = ["liquid", "--params", self.f3, "-T", "310",
                  "--concentration", "3e4", "--basis", "mole"]
        a = run_json(*common, "-w", ",".join(map(repr, w)), "-g",
                     ",".join(map(repr, dw)))
        b = run_json(*common, "-x", ",".join(map(repr, x)), "-g",
                     ",".join(map(repr, dx)))
        self.assertEqual(a["composition_basis"], "mass")
        big = max(abs(r[0]) for r in b["fluxes"])
        for i in range(3):
            self.assertAlmostEqual(a["mole_fractions"][i], x[i], delta=1e-15)
            self.assertAlmostEqual(a["fluxes"][i][0], b["fluxes"][i][0],
                                   delta=1e-12 * big)
        # default basis follows the composition: mass fluxes with -w
        m = run_json("liquid", "--params", self.f3, "-T", "310",
                     "--concentration", "3e4", "-w", ",".join(map(repr, w)),
                     "-g", ",".join(map(repr, dw)))
        self.assertEqual(m["basis"], "mass")
        self.assertEqual(m["flux_unit"], "kg/(m^2 s)")

    def test_file_and_options_give_the_same_liquid(self):
        opts = ["-s", "acetone,methanol,water", "--model", "nrtl",
                "--pair", "acetone:methanol=0.3,10,0,0.2,0,0,0.3",
                "--pair", "1:3=0.6,0,0,0.9,0,0,0.3",
                "--pair", "water:methanol=0,120,0,0,-50,0,0.3",
                "--dinf", "1:2=2.1e-9,2.6e-9", "--dinf", "1:3=1.2e-9,1.7e-9",
                "--dinf", "2:3=1.5e-5cm2/s,2.0e-5cm2/s"]
        common = ["-x", "0.2,0.3,0.5", "-T", "310", "-g", "-40,65,-25",
                  "--concentration", "3e4"]
        a = run_json("liquid", "--params", self.f3, *common)
        b = run_json("liquid", *opts, *common)
        for k in ("Gamma", "Dij", "fluxes", "fick_matrix", "ln_gamma"):
            self.assertEqual(a[k], b[k], k)

    def test_text_and_csv(self):
        args = ["liquid", "--params", self.f3, "-x", "0.2,0.3,0.5", "-T",
                "310", "-g", "-40,65,-25", "--concentration", "3e4"]
        d = run_json(*args)
        code, out, err = run(*args)
        self.assertEqual(code, 0, err)
        for text in ("mol/(m^2 s)", "Fick matrix", "zero-sum", "Gamma",
                     "acetone", "licensed engineering review",
                     f"{d['fluxes'][0][0]:.5e}"):
            self.assertIn(text, out)
        header, rows, err = run_csv(*args)
        self.assertEqual(header, ["species", "x", "dx_dz1_per_m",
                                  "J_1_mol_per_m2_s", "flags"])
        self.assertEqual([r[0] for r in rows], d["species"])
        for r, f in zip(rows, d["fluxes"]):
            self.assertAlmostEqual(float(r[3]), f[0], delta=1e-14 * abs(f[0]))
        self.assertIn("review", err)

    def test_bad_flux_input_names_the_option(self):
        base = ["liquid", "--params", self.f3, "-x", "0.2,0.3,0.5", "-T",
                "310"]
        cases = [
            (["-g", "1,-1,0"], "--concentration"),
            (["-g", "1,-1", "--concentration", "3e4"], "-g/--gradient"),
            (["-g", "1,-1,0", "--concentration", "3e4", "--density", "900"],
             "--density"),
            (["-g", "1,-1,0", "--concentration", "3e4", "--basis", "volume"],
             "--basis"),
            (["-g", "1,-1,0", "--concentration", "3e4", "--dependent", "x"],
             "--dependent"),
            (["--concentration", "3e4"], "--concentration"),
            (["-g", "1,-1,0", "--concentration", "-3"], "--concentration"),
        ]
        for extra, opt in cases:
            with self.subTest(args=extra):
                code, out, err = run(*base, *extra)
                self.assertEqual(code, 2, err)
                self.assertEqual(out, "")
                self.assertTrue(err.startswith(f"mcdiff liquid: {opt}"), err)
        code, _, err = run("liquid", "-x", "1", "-T", "300", "--model",
                           "ideal", "-g", "0", "--concentration", "1e4")
        self.assertEqual(code, 2, err)
        self.assertIn("-g/--gradient: fluxes need two or more species", err)


class LiquidParamFile(unittest.TestCase):
    """The parameter file of mcdiff liquid: errors name the file, the line
    and the field; the command line complements the file."""

    GOOD = ["model wilson", "species a V=40cm3/mol", "species b V=18cm3/mol",
            "pair a b b12=50 b21=230"]

    def fails(self, lines, *extra, x="0.4,0.6"):
        path = write_params("\n".join(lines) + "\n")
        try:
            code, out, err = run("liquid", "--params", path, "-x", x, "-T",
                                 "320", *extra)
        finally:
            os.unlink(path)
        self.assertEqual(code, 2, err)
        self.assertEqual(out, "")
        self.assertTrue(err.startswith("mcdiff liquid: "), err)
        return err.replace(path, "FILE")

    def test_example_file_runs(self):
        d = run_json("liquid", "--params", EXAMPLE_LIQUID, "-x", "0.3,0.7",
                     "-T", "320")
        self.assertEqual(d["model"], "wilson")
        self.assertEqual(d["species"], ["methanol", "water"])
        self.assertEqual(len(d["partial_pressures_Pa"]), 2)

    def test_good_file_and_comments(self):
        path = write_params("# a comment\n\n" + "\n".join(self.GOOD) +
                            "   # trailing comment\n")
        try:
            d = run_json("liquid", "--params", path, "-x", "0.4,0.6", "-T",
                         "320")
        finally:
            os.unlink(path)
        self.assertEqual(d["species"], ["a", "b"])

    def test_errors_name_file_line_and_field(self):
        cases = [
            (self.GOOD + ["pear a b b12=1 b21=1"], "FILE:5:",
             "unknown record 'pear'"),
            (self.GOOD[:3] + ["pair a b b12=50 b21=230 beta=1"], "FILE:4:",
             "unknown field 'beta'"),
            (self.GOOD[:3] + ["pair a b b12=50 b21=x"], "FILE:4:",
             "field b21"),
            (self.GOOD[:3] + ["pair a b b12=50"], "FILE:4:", "p_21"),
            (["model wilson", "species a V=40", "species b V=18cm3/mol"],
             "FILE:2:", "field V: '40' needs a unit"),
            (self.GOOD[:3] + ["pair a c b12=1 b21=1"], "FILE:4:",
             "species 'c' is not declared"),
            (self.GOOD + ["pair b a b12=1 b21=1"], "FILE:5:",
             "already given on line 4"),
            (self.GOOD + ['antoine a A=10 B=1500 C=-40 log=10 P=Pa T=K '
                          'range=280K..360K'], "FILE:5:",
             "field source is required"),
            (self.GOOD + ['antoine a A=10 B=1500 C=-40 log=10 P=psf T=K '
                          'range=280K..360K source="x"'], "FILE:5:",
             "field P"),
            (self.GOOD + ['dinf a b D12=1e-9 D21=1e-9m2/s'], "FILE:5:",
             "field D12: '1e-9' needs a unit"),
            (self.GOOD + ['dinf a b D12=1e-9m2/s'], "FILE:5:",
             "field D21 is required"),
            (self.GOOD + ['species c source="unclosed'], "FILE:5:",
             "unclosed quote"),
            # an empty name in quotes (found by fuzz_liq_file)
            (self.GOOD[:2] + ['species "" V=18cm3/mol'], "FILE:3:",
             "'' is not a usable species name"),
        ]
        for lines, where, what in cases:
            with self.subTest(what=what):
                err = self.fails(lines)
                self.assertIn(where, err)
                self.assertIn(what, err)

    def test_missing_pair_parameter_names_the_pair(self):
        err = self.fails(["model nrtl", "species a", "species b",
                          "species c", "pair a b b12=1 b21=2 alpha=0.3",
                          "pair a c a12=0 a21=0 alpha=0.3"], x="0.2,0.3,0.5")
        self.assertIn("pair b/c", err)
        self.assertIn("'pair' record", err)
        err = self.fails(["model nrtl", "species a", "species b",
                          "pair a b b12=1 b21=2"])
        self.assertIn("FILE:4", err)
        self.assertIn("pair a/b: field alpha is required", err)
        err = self.fails(["model wilson", "species a V=40cm3/mol",
                          "species b", "pair a b b12=1 b21=2"])
        self.assertIn("species b: no molar volume V", err)
        err = self.fails(["species a", "species b"])
        self.assertIn("no 'model' record", err)

    def test_duplicates_with_options_name_the_line(self):
        cases = [
            (["--pair", "a:b=0,1,0,0,1,0"], "--pair", "FILE:4"),
            (["--model", "nrtl"], "--model", "FILE:1"),
            (["--volumes", "1e-5,2e-5"], "--volumes", "FILE:2"),
            (["-s", "a,b"], "-s/--species", "FILE:3"),
        ]
        for extra, opt, where in cases:
            with self.subTest(option=opt):
                err = self.fails(self.GOOD, *extra)
                self.assertTrue(err.startswith(f"mcdiff liquid: {opt}"), err)
                self.assertIn(where, err)
        # the same model is no conflict; a missing value is complemented
        path = write_params("\n".join(self.GOOD) + "\n")
        try:
            d = run_json("liquid", "--params", path, "-x", "0.4,0.6", "-T",
                         "320", "--model", "wilson", "--dinf",
                         "a:b=1e-9,2e-9")
        finally:
            os.unlink(path)
        self.assertAlmostEqual(d["Dij"][0][1] / (1e-9 ** 0.6 * 2e-9 ** 0.4),
                               1.0, delta=1e-12)

    def test_antoine_forms_convert(self):
        # log10(P/mmHg) = A - B/(t/C + C) and ln(P/kPa) = ... describe the
        # same vapour pressure as log10(P/Pa) = A + log10(133.322368) -
        # B/(T/K + C - 273.15) (1 mmHg = 133.322368 Pa; common practice):
        # constants chosen for the identity only
        lines = self.GOOD[:3] + ["pair a b b12=50 b21=230",
                                 'antoine a A=7.5 B=1600 C=230 log=10 '
                                 'P=mmHg T=C range=0C..100C source="x"',
                                 'antoine b A=16.0 B=3800 C=-45 log=e P=kPa '
                                 'T=K range=270K..380K source="y"']
        path = write_params("\n".join(lines) + "\n")
        try:
            d = run_json("liquid", "--params", path, "-x", "0.4,0.6", "-T",
                         "320")
        finally:
            os.unlink(path)
        ps_a = 133.322368 * 10 ** (7.5 - 1600 / (320 - 273.15 + 230))
        ps_b = 1e3 * math.exp(16.0 - 3800 / (320 - 45))
        g = d["gamma"]
        p = d["partial_pressures_Pa"]
        self.assertAlmostEqual(p[0] / (0.4 * g[0] * ps_a), 1, delta=1e-12)
        self.assertAlmostEqual(p[1] / (0.6 * g[1] * ps_b), 1, delta=1e-12)


# Antoine constants of water, log10(P/bar) = A - B/(T/K + C), 4.6543,
# 1435.264, -64.848, 255.9-373 K (Stull 1947 via the NIST Chemistry
# WebBook; from memory, as in tests/test_liquid.c); +5 for Pa.
WATER_ANTOINE = "1=9.6543,1435.264,-64.848,255.9,373"


class LiquidEvaporation(unittest.TestCase):
    def test_single_species_is_stefans_law(self):
        # one volatile species through stagnant air: N = (c D/L)
        # ln((1 - y_L)/(1 - y_0)), y_0 = P^sat/P, c = P/(R T) (Stefan's
        # law; common practice); rate = N M; level fall = rate / rho [m/s]
        # = rate / rho * 3.6e6 mm/h. The film is converged to 1e-12
        # relative: 1e-9 leaves room for the decimal inputs.
        for T, P, L, D, rho, yL in ((298.15, ATM, 0.05, 2.6e-5, 997.0, 0.0),
                                    (330.0, 9e4, 0.12, 2.9e-5, 985.0, 0.01)):
            with self.subTest(T=T):
                args = ["liquid", "-s", "water", "-x", "1", "-T", f"{T}",
                        "--model", "ideal", "--antoine", WATER_ANTOINE,
                        "--evaporate", "air", "-P", f"{P}", "-L", f"{L}",
                        "--density", f"{rho}", "--gas-pair",
                        f"water:air={D}"]
                if yL:
                    args += ["--xL", f"{yL},{1 - yL}"]
                d = run_json(*args)
                psat = 10 ** (9.6543 - 1435.264 / (T - 64.848))
                y0 = psat / P
                c = P / (R * T)
                N = c * D / L * math.log((1 - yL) / (1 - y0))
                self.assertAlmostEqual(d["y_surface"][0] / y0, 1, delta=1e-12)
                self.assertAlmostEqual(d["fluxes"][0] / N, 1.0, delta=1e-9)
                self.assertEqual(d["fluxes"][1], 0.0)  # air stagnant
                M = d["M"][0]
                self.assertAlmostEqual(M, 0.018015, delta=1e-4)  # table
                rate = d["evaporation_rate_kg_per_m2_s"]
                self.assertAlmostEqual(rate / (d["fluxes"][0] * M), 1.0,
                                       delta=1e-14)
                self.assertAlmostEqual(d["level_fall_mm_per_h"] /
                                       (rate / rho * 3.6e6), 1.0, delta=1e-14)
                self.assertIn("flammable or toxic", d["caution"])

    def test_mixture_equals_vle_and_film(self):
        # the surface vapour is x gamma P^sat / P with the gamma of the
        # properties output, and the fluxes are those of `mcdiff film`
        # from that vapour with air stagnant and the same diffusivities
        base = ["liquid", "--params", EXAMPLE_LIQUID, "-x", "0.3,0.7", "-T",
                "320"]
        props = run_json(*base)
        gas = ["--gas-pair", "methanol:water=2.2e-5", "--gas-pair",
               "methanol:air=1.7e-5", "--gas-pair", "water:air=2.7e-5"]
        d = run_json(*base, "--evaporate", "air", "-P", "1atm", "-L", "3cm",
                     "--density", "0.93g/cm3", *gas)
        for i in range(2):
            self.assertAlmostEqual(d["y_surface"][i],
                                   props["partial_pressures_Pa"][i] / ATM,
                                   delta=1e-15)
        y = d["y_surface"]
        f = run_json("film", "-s", "methanol,water,air", "--x0",
                     ",".join(repr(v) for v in y), "--xL", "0,0,1", "-L",
                     "3cm", "-T", "320", "-P", "1atm", "--stagnant", "air",
                     "--pair", "methanol:water=2.2e-5", "--pair",
                     "methanol:air=1.7e-5", "--pair", "water:air=2.7e-5")
        for i in range(2):
            # two runs of the same converged iteration (1e-12)
            self.assertAlmostEqual(d["fluxes"][i] / f["fluxes"][i], 1.0,
                                   delta=1e-10)
        self.assertGreater(y[0] / y[1], 0.3 / 0.7)  # methanol enriched
        code, out, err = run(*base, "--evaporate", "air", "-P", "1atm", "-L",
                             "3cm", "--density", "930", *gas)
        self.assertEqual(code, 0, err)
        for text in ("kg/(m^2 s)", "mm/h", "flammable or toxic",
                     "licensed engineering review", "y surface"):
            self.assertIn(text, out)
        header, rows, err = run_csv(*base, "--evaporate", "air", "-P",
                                    "1atm", "-L", "3cm", "--density", "930",
                                    *gas)
        self.assertEqual(header[0], "species")
        self.assertIn("N_mol_per_m2_s", header)
        self.assertEqual([r[0] for r in rows], ["methanol", "water", "air"])
        self.assertIn("mm/h", err)

    def test_bad_evaporation_input(self):
        base = ["liquid", "--params", EXAMPLE_LIQUID, "-x", "0.3,0.7", "-T",
                "320", "--evaporate", "air"]
        full = ["-P", "1atm", "-L", "3cm", "--density", "930"]
        for args, code, text in (
                ([*base, "-L", "3cm", "--density", "930"], 2, "-P/--pressure"),
                ([*base, "-P", "1atm", "--density", "930"], 2, "-L/--length"),
                ([*base, "-P", "1atm", "-L", "3cm"], 2, "--density"),
                ([*base, *full, "--xL", "0,1"], 2, "--xL"),
                ([*base, *full, "-g", "1,-1"], 2, "--evaporate"),
                ([*base[:-2], "-P", "1atm"], 2, "-P/--pressure"),
                (["liquid", "-x", "0.3,0.7", "-T", "320", "--pair",
                  "1:2=0,1,0,0,1,0", "--evaporate", "air", *full], 2,
                 "--evaporate"),
                # the liquid boils: bubble pressure above P (exit 1)
                ([*base[:5], "-T", "380", "--evaporate", "air", *full], 1,
                 "boils")):
            with self.subTest(args=args[6:]):
                c, out, err = run(*args)
                self.assertEqual(c, code, err)
                self.assertEqual(out, "")
                self.assertIn(text, err)


class ManPage(unittest.TestCase):
    def test_man_page_renders_without_warnings(self):
        self.assertTrue(os.path.exists(MAN_PAGE), MAN_PAGE)
        if shutil.which("groff"):
            p = subprocess.run(["groff", "-man", "-Tutf8", "-ww", MAN_PAGE],
                               capture_output=True, text=True, timeout=60)
            self.assertEqual(p.returncode, 0, p.stderr)
            self.assertEqual(p.stderr, "")
            self.assertIn("MCDIFF(1)", p.stdout)
        else:
            # no formatter: at least a well-formed man(7) source
            with open(MAN_PAGE, encoding="utf-8") as f:
                lines = f.read().splitlines()
            macros = [ln.split()[0] for ln in lines if ln.startswith(".")
                      and not ln.startswith(".\\\"")]
            self.assertIn(".TH", macros)
            self.assertEqual(macros.count(".RS"), macros.count(".RE"))
            self.assertEqual(macros.count(".nf"), macros.count(".fi"))
            for name in ("NAME", "SYNOPSIS", "EXIT STATUS"):
                self.assertTrue(any(ln.startswith(".SH") and name in ln
                                    for ln in lines))

    def test_man_page_covers_commands_options_units_and_exit_codes(self):
        text = man_text()
        if text is None:
            with open(MAN_PAGE, encoding="utf-8") as f:
                text = f.read().replace("\\-", "-").replace("\\:", "")
        flat = " ".join(text.split())
        for c in COMMANDS:
            self.assertIn(f"mcdiff {c}", flat)
        # every long option of every command's --help is documented
        for c in COMMANDS:
            _, out, _ = run(c, "--help")
            opts = {w.strip(",.;:()[]'\"|") for w in out.split()
                    if w.startswith("--") and len(w) > 3}
            opts = {o.split("=")[0] for o in opts}
            with self.subTest(command=c):
                self.assertTrue(opts)
                for o in opts:
                    self.assertIn(o, flat, f"{c}: {o}")
        for unit in ("kPa", "atm", "cm2/s", "mm2", "cm3", "min", "m^2/s",
                     "mol/(m^2 s)", "D_m2_per_s", "N_mol_per_m2_s"):
            self.assertIn(unit, flat)
        self.assertIn("EXIT STATUS", flat)
        for code in ("0 success", "1 the computation failed",
                     "2 bad command line"):
            self.assertIn(code, flat)
        self.assertIn("hazardous gases", flat)
        self.assertIn("licensed engineering review", flat)

    def test_man_l_formats_the_page(self):
        if not shutil.which("man") or not shutil.which("groff"):
            self.skipTest("man or groff not installed")
        env = dict(os.environ, MANPAGER="cat", PAGER="cat", MANWIDTH="80")
        p = subprocess.run(["man", "-l", MAN_PAGE], capture_output=True,
                           text=True, timeout=60, env=env)
        self.assertEqual(p.returncode, 0, p.stderr)
        self.assertIn("EXIT STATUS", p.stdout)


if __name__ == "__main__":
    if len(sys.argv) > 1 and os.path.exists(sys.argv[1]):
        MCDIFF = sys.argv.pop(1)
    if not MCDIFF:
        sys.exit("set MCDIFF_CLI or pass the mcdiff binary as argument")
    MCDIFF = os.path.abspath(MCDIFF)
    unittest.main(verbosity=2)
