#!/usr/bin/env python3
"""The loader, the C signature table, versions, exceptions, handles and
the numpy / no-numpy array paths of the mcdiff package."""

import array
import ctypes
import ctypes.util
import gc
import os
import shutil
import subprocess
import sys
import tempfile
import unittest

import _support

_support.require_numpy_variant(__name__ == "__main__")

import mcdiff  # noqa: E402
from mcdiff import _arrays, _native  # noqa: E402

np = _arrays.np


def load_parser():
    """tools/gen_bindings.py, the project's one parser of mcdiff.h (path
    from MCDIFF_GEN_BINDINGS, set by meson, else relative to the checkout)."""
    import importlib.util
    path = os.environ.get("MCDIFF_GEN_BINDINGS",
                          os.path.join(_support.ROOT, "tools",
                                       "gen_bindings.py"))
    spec = importlib.util.spec_from_file_location("gen_bindings", path)
    mod = importlib.util.module_from_spec(spec)
    spec.loader.exec_module(mod)
    return mod


API = load_parser().parse_header(_support.HEADER)


def header_functions():
    """{name: (return CType, [parameter CTypes])} of every MCD_API
    function."""
    return {f.name: (f.ret, [p.ctype for p in f.params])
            for f in API.functions.values()}


ENUMS = set(API.enums)
HANDLES = set(API.structs)  # opaque ones and mcd_allocator: passed by pointer


def ctype_of(c):
    """The ctypes type the table must hold for a parsed C type (a mapping
    written independently of the generator's)."""
    P = ctypes.POINTER
    stars, base = c.depth, c.base
    if stars == 0:
        if base in ENUMS or base == "int":
            return ctypes.c_int
        return {"unsigned": ctypes.c_uint, "size_t": ctypes.c_size_t,
                "double": ctypes.c_double, "void": None}[base]
    if stars == 1:
        if base in HANDLES:
            return ctypes.c_void_p
        if base == "char":
            # const char * -> c_char_p; writable char * (errbuf) -> char buf
            return ctypes.c_char_p if c.base_const else P(ctypes.c_char)
        if base in ENUMS or base == "int":
            return P(ctypes.c_int)
        return P({"unsigned": ctypes.c_uint, "size_t": ctypes.c_size_t,
                  "double": ctypes.c_double, "long": ctypes.c_long}[base])
    if stars == 2:
        if base in HANDLES:
            return P(ctypes.c_void_p)
        if base == "char":
            return P(ctypes.c_char_p)
    raise AssertionError("no mapping for C type %r" % c.c_text)


def header_macros():
    """{name: value} of the numeric #define MCD_* macros."""
    return {n: d.value for n, d in API.defines.items()}


def header_enum_values():
    return API.enumerators


class SignatureTable(unittest.TestCase):
    def test_every_header_function_has_an_entry_and_no_more(self):
        funcs = header_functions()
        self.assertGreater(len(funcs), 70)
        missing = sorted(set(funcs) - set(_native.SIGNATURES))
        extra = sorted(set(_native.SIGNATURES) - set(funcs))
        self.assertEqual(missing, [], "declared in mcdiff.h, not in the table")
        self.assertEqual(extra, [], "in the table, not declared in mcdiff.h")

    def test_argument_and_return_types_match_the_header(self):
        for name, (ret, params) in header_functions().items():
            restype, argtypes = _native.SIGNATURES[name]
            with self.subTest(function=name):
                self.assertEqual(len(argtypes), len(params),
                                 "argument count of %s" % name)
                self.assertIs(restype, ctype_of(ret),
                              "return type %r" % ret.c_text)
                for k, (c, t) in enumerate(zip(params, argtypes)):
                    self.assertIs(t, ctype_of(c), "argument %d (%s) of %s"
                                  % (k, c.c_text, name))

    def test_loaded_functions_carry_the_table(self):
        for name, (restype, argtypes) in _native.SIGNATURES.items():
            fn = getattr(_native.lib, name)
            self.assertIs(fn.restype, restype, name)
            self.assertEqual(list(fn.argtypes), list(argtypes), name)


class Versions(unittest.TestCase):
    def test_package_version_equals_header_macros(self):
        m = header_macros()
        built = tuple(m["MCD_VERSION_" + k]
                      for k in ("MAJOR", "MINOR", "PATCH"))
        self.assertEqual(mcdiff.BUILT_FOR, built)
        self.assertEqual(mcdiff.__version__, "%d.%d.%d" % built)

    def test_runtime_version_matches(self):
        self.assertEqual(mcdiff.version_number() // 10000, mcdiff.BUILT_FOR[0])
        v = mcdiff.version_number()
        self.assertEqual(mcdiff.version_string(),
                         "%d.%d.%d" % (v // 10000, v // 100 % 100, v % 100))

    def test_constants_and_enums_equal_the_header(self):
        m = header_macros()
        self.assertEqual(mcdiff.MAX_SPECIES, m["MCD_MAX_SPECIES"])
        self.assertEqual(mcdiff.MAX_DIM, m["MCD_MAX_DIM"])
        self.assertEqual(mcdiff.SUM_TOL, m["MCD_SUM_TOL"])
        self.assertEqual(mcdiff.GAS_CONSTANT, m["MCD_GAS_CONSTANT"])
        self.assertEqual(mcdiff.ATM, m["MCD_ATM"])
        for cls, prefix in ((mcdiff.EstimateWarning, "MCD_WARN_"),
                            (mcdiff.Diag, "MCD_DIAG_")):
            for member in cls:
                self.assertEqual(int(member), m[prefix + member.name], member)
            # and no header bit is missing from the Python flag set
            self.assertEqual(sorted(k for k in m if k.startswith(prefix)),
                             sorted(prefix + x.name for x in cls), cls)
        vals = header_enum_values()
        groups = ((mcdiff.Status, "MCD_"), (mcdiff.Param, "MCD_PARAM_"),
                  (mcdiff.Method, "MCD_METHOD_"),
                  (mcdiff.GasMethod, "MCD_GAS_"), (mcdiff.Basis, "MCD_BASIS_"),
                  (mcdiff.Model, "MCD_MODEL_"), (mcdiff.Bootstrap, "MCD_BOOT_"),
                  (mcdiff.FilmBootstrap, "MCD_FILM_BOOT_"),
                  (mcdiff.FilmMethod, "MCD_FILM_"))
        for cls, prefix in groups:
            for member in cls:
                self.assertEqual(int(member), vals[prefix + member.name],
                                 "%s.%s" % (cls.__name__, member.name))
        # and no header value is missing from the Python enums
        self.assertEqual(len(mcdiff.Param), vals["MCD_PARAM_COUNT"])
        self.assertEqual(len(mcdiff.Status), vals["MCD_EIO"] + 1)

    def test_status_strings_are_the_library_texts(self):
        for s in mcdiff.Status:
            self.assertEqual(mcdiff.status_string(s),
                             _native.lib.mcd_status_string(int(s)).decode())
            self.assertTrue(mcdiff.status_string(s))


def run_python(code, **env):
    e = dict(os.environ)
    e.update(env)
    e["PYTHONPATH"] = _support.PKG_DIR
    return subprocess.run([sys.executable, "-c", code], capture_output=True,
                          text=True, env=e, timeout=120)


class Loader(unittest.TestCase):
    def test_missing_library_lists_the_path_tried(self):
        bogus = os.path.join(tempfile.gettempdir(), "no-such-dir",
                             "libmcdiff.so")
        p = run_python("import mcdiff", MCDIFF_LIBRARY=bogus)
        self.assertNotEqual(p.returncode, 0)
        self.assertIn("ImportError", p.stderr)
        self.assertIn(bogus, p.stderr)
        self.assertIn("MCDIFF_LIBRARY", p.stderr)
        self.assertIn("no such file", p.stderr)

    def test_search_without_environment_lists_every_candidate(self):
        # Copy the package alone to a temporary directory: no library beside
        # it, no build tree; the error must name each place it looked.
        with tempfile.TemporaryDirectory() as d:
            shutil.copytree(os.path.join(_support.PKG_DIR, "mcdiff"),
                            os.path.join(d, "mcdiff"))
            env = dict(os.environ)
            env.pop("MCDIFF_LIBRARY", None)
            env["PYTHONPATH"] = d
            env["LD_LIBRARY_PATH"] = ""
            p = subprocess.run([sys.executable, "-c", "import mcdiff"],
                               capture_output=True, text=True, env=env,
                               timeout=120)
            if p.returncode == 0:
                self.skipTest("an installed libmcdiff was found by the "
                              "system search")
            self.assertIn("beside the package", p.stderr)
            self.assertIn(os.path.join(d, "mcdiff"), p.stderr)
            self.assertIn("find_library('mcdiff')", p.stderr)
            # and a library copied beside the package is then found
            shutil.copy(_native.lib_path,
                        os.path.join(d, "mcdiff", "libmcdiff.so"))
            p = subprocess.run(
                [sys.executable, "-c",
                 "import mcdiff; print(mcdiff.library_path)"],
                capture_output=True, text=True, env=env, timeout=120)
            self.assertEqual(p.returncode, 0, p.stderr)
            self.assertEqual(p.stdout.strip(),
                             os.path.join(d, "mcdiff", "libmcdiff.so"))

    def test_not_an_mcdiff_library_is_refused(self):
        libm = ctypes.util.find_library("m")
        if not libm:
            self.skipTest("no libm to load")
        p = run_python("import mcdiff", MCDIFF_LIBRARY=libm)
        self.assertNotEqual(p.returncode, 0)
        self.assertIn("not an mcdiff library", p.stderr)

    def _fake_library(self, d, body):
        cc = shutil.which("cc") or shutil.which("gcc")
        if not cc:
            self.skipTest("no C compiler to build a fake library")
        src = os.path.join(d, "fake.c")
        out = os.path.join(d, "libfake.so")
        with open(src, "w") as f:
            f.write(body)
        r = subprocess.run([cc, "-shared", "-fPIC", "-o", out, src],
                           capture_output=True, text=True)
        if r.returncode != 0:
            self.skipTest("cannot build a shared library: " + r.stderr)
        return out

    def test_different_major_version_is_refused(self):
        major = mcdiff.BUILT_FOR[0] + 1
        with tempfile.TemporaryDirectory() as d:
            lib = self._fake_library(
                d, "unsigned mcd_version_number(void) { return %du; }\n"
                % (major * 10000 + 2))
            p = run_python("import mcdiff", MCDIFF_LIBRARY=lib)
        self.assertNotEqual(p.returncode, 0)
        self.assertIn("major versions differ", p.stderr)
        self.assertIn("%d.0.2" % major, p.stderr)

    def test_same_major_with_missing_symbols_names_them(self):
        v = mcdiff.BUILT_FOR[0] * 10000
        with tempfile.TemporaryDirectory() as d:
            lib = self._fake_library(
                d, "unsigned mcd_version_number(void) { return %du; }\n" % v)
            p = run_python("import mcdiff", MCDIFF_LIBRARY=lib)
        self.assertNotEqual(p.returncode, 0)
        self.assertIn("lacks", p.stderr)
        self.assertIn("mcd_flux_compute", p.stderr)


class Exceptions(unittest.TestCase):
    def test_each_code_has_its_class(self):
        expect = {
            1: (mcdiff.InvalidArgumentError, ValueError),
            2: (mcdiff.DomainError, ValueError),
            3: (mcdiff.BadLengthError, ValueError),
            4: (mcdiff.OutOfMemoryError, MemoryError),
            5: (mcdiff.SingularMatrixError, ArithmeticError),
            6: (mcdiff.InternalError, RuntimeError),
            7: (mcdiff.NotFoundError, LookupError),
            8: (mcdiff.ParseError, ValueError),
            9: (mcdiff.NoDataError, LookupError),
            10: (mcdiff.NoConvergenceError, ArithmeticError),
            11: (mcdiff.FileError, OSError),
        }
        from mcdiff.errors import error_for
        for code, (cls, std) in expect.items():
            e = error_for(code, "mcd_x", "detail %d" % code)
            self.assertIs(type(e), cls)
            self.assertIsInstance(e, mcdiff.McdError)
            self.assertIsInstance(e, std)
            self.assertEqual(e.status, code)
            self.assertEqual(e.status_string, mcdiff.status_string(code))
            self.assertIn(mcdiff.status_string(code), str(e))
            self.assertIn("detail %d" % code, str(e))
            self.assertIn("mcd_x", str(e))
        e = error_for(99, "mcd_y")
        self.assertIs(type(e), mcdiff.McdError)

    def test_exceptions_pickle(self):
        import pickle
        e = mcdiff.DomainError(2, "mcd_f", "x[1] < 0")
        e2 = pickle.loads(pickle.dumps(e))
        self.assertIs(type(e2), mcdiff.DomainError)
        self.assertEqual(str(e2), str(e))

    def test_workspace_detail_is_carried(self):
        D = [[0, 1e-5, 1e-5], [1e-5, 0, 1e-5], [1e-5, 1e-5, 0]]
        with self.assertRaises(mcdiff.DomainError) as cm:
            mcdiff.flux_compute(D, 40.0, [0.5, 0.6, -0.1], [1, 0, -1])
        e = cm.exception
        self.assertEqual(e.status, mcdiff.Status.EDOM)
        self.assertEqual(e.function, "mcd_flux_compute")
        self.assertTrue(e.detail, "mcd_last_error text expected")
        self.assertIn(e.detail, str(e))

    def test_library_detail_is_carried(self):
        with self.assertRaises(mcdiff.ParseError) as cm:
            mcdiff.formula_molar_mass("C3H(")
        self.assertIn("position", cm.exception.detail)
        self.assertEqual(mcdiff.last_error(), cm.exception.detail)
        mcdiff.formula_molar_mass("C3H8")
        self.assertEqual(mcdiff.last_error(), "")
        # ENODATA names the species and the parameter
        db = mcdiff.Database()
        db.add("silane", "SiH4")
        db.add("argon", "Ar")
        with self.assertRaises(mcdiff.NoDataError) as cm:
            db.binary_gas("silane", "argon", "fsg", 300.0, 1e5)
        self.assertIn("'silane' has no diffusion volume", str(cm.exception))
        db.close()
        db = mcdiff.Database()
        with self.assertRaises(mcdiff.ParseError) as cm:
            db.load_string("mcdiff-species 1\nspecies x\n  bogus 1\n")
        self.assertIn("line", cm.exception.detail)
        with self.assertRaises(mcdiff.FileError) as cm:
            db.load_file(os.path.join(tempfile.gettempdir(), "nope",
                                      "species.txt"))
        self.assertIsInstance(cm.exception, OSError)
        self.assertIn("species.txt", cm.exception.detail)
        db.close()

    def test_reachable_codes_from_the_api(self):
        db = mcdiff.Database.builtin()
        with self.assertRaises(mcdiff.NotFoundError):
            db.find("unobtainium")
        with self.assertRaises(mcdiff.InvalidArgumentError):
            mcdiff.ideal_gas_c(float("nan"), 1e5)
        with self.assertRaises(mcdiff.DomainError):
            mcdiff.ideal_gas_c(-1.0, 1e5)
        ws = mcdiff.Workspace(2)
        D = [[0, 1e-5, 1e-5], [1e-5, 0, 1e-5], [1e-5, 1e-5, 0]]
        with self.assertRaises(mcdiff.BadLengthError) as cm:
            mcdiff.flux_compute(D, 40.0, [0.2, 0.3, 0.5], [1, 0, -1],
                                workspace=ws)
        self.assertTrue(cm.exception.detail)
        ws.close()
        i = db.add("silane-x", "SiH4")
        with self.assertRaises(mcdiff.NoDataError):
            db.param(i, "V_diff")
        with self.assertRaises(mcdiff.NoConvergenceError) as cm:
            mcdiff.film_solve([[0, 2e-5], [2e-5, 0]], 40, 0.1, [0.5, 0.5],
                              [0.1, 0.9], "ratios", species=0,
                              values=[0.3, 0.7])
        self.assertIn("residual", cm.exception.detail)
        db.close()


class Handles(unittest.TestCase):
    def test_close_is_idempotent_and_blocks_use(self):
        for make in (lambda: mcdiff.Database.builtin(),
                     lambda: mcdiff.Workspace(4)):
            h = make()
            self.assertFalse(h.closed)
            h.close()
            self.assertTrue(h.closed)
            h.close()
            with self.assertRaises(ValueError):
                h._p()
            self.assertIn("closed", repr(h))

    def test_context_manager_closes(self):
        with mcdiff.Database.builtin() as db:
            with db.mixture(["nitrogen", "oxygen"]) as mix:
                self.assertEqual(len(mix), 2)
            self.assertTrue(mix.closed)
            with self.assertRaises(ValueError):
                len(mix)
        self.assertTrue(db.closed)

    def test_finalizer_frees_on_collection(self):
        db = mcdiff.Database.builtin()
        fin = db._finalizer
        self.assertTrue(fin.alive)
        del db
        gc.collect()
        self.assertFalse(fin.alive)

    def test_mixture_outlives_its_database(self):
        db = mcdiff.Database.builtin()
        mix = db.mixture(["hydrogen", "nitrogen"])
        db.close()
        D = mix.binaries(300.0, mcdiff.ATM)
        self.assertGreater(_support.flat(D)[1], 0.0)
        mix.close()

    def test_default_workspace_grows_per_thread(self):
        import threading
        w1 = mcdiff.default_workspace(3)
        self.assertGreaterEqual(w1.capacity, 3)
        w2 = mcdiff.default_workspace(20)
        self.assertGreaterEqual(w2.capacity, 20)
        self.assertTrue(w1.closed or w1 is w2)
        other = []
        t = threading.Thread(target=lambda: other.append(
            mcdiff.default_workspace(3)))
        t.start()
        t.join()
        self.assertIsNot(other[0], mcdiff.default_workspace(3))


class NumpyOrNot(unittest.TestCase):
    def test_numpy_hidden_is_really_not_imported(self):
        code = ("import sys, mcdiff\n"
                "db = mcdiff.Database.builtin()\n"
                "m = db.mixture(['hydrogen', 'nitrogen', 'argon'])\n"
                "J = m.fluxes(300.0, 101325.0, [0.2, 0.3, 0.5], [1, 0, -1])\n"
                "F = mcdiff.fick_matrix(m.binaries(300.0, 101325.0),"
                " [0.2, 0.3, 0.5])\n"
                "e = mcdiff.fick_eigenvalues(F.D)\n"
                "print('numpy' in sys.modules, type(J).__name__,"
                " type(e).__name__, mcdiff.HAVE_NUMPY)\n")
        p = run_python(code, MCDIFF_NO_NUMPY="1")
        self.assertEqual(p.returncode, 0, p.stderr)
        self.assertEqual(p.stdout.split(), ["False", "list", "list", "False"])

    def test_this_process_matches_its_variant(self):
        J = mcdiff.flux_compute([[0, 2e-5], [2e-5, 0]], 40.0, [0.3, 0.7],
                                [1.0, -1.0])
        if _support.NO_NUMPY:
            self.assertNotIn("numpy", sys.modules)
            self.assertFalse(mcdiff.HAVE_NUMPY)
            self.assertIsInstance(J, list)
        else:
            self.assertTrue(mcdiff.HAVE_NUMPY)
            self.assertIsInstance(J, np.ndarray)
            self.assertEqual(J.dtype, np.float64)

    def test_array_module_input_is_not_copied(self):
        a = array.array("d", [0.1, 0.2, 0.7])
        arg = _arrays.as_doubles(a)
        self.assertFalse(arg.copied)
        addr, _ = a.buffer_info()
        self.assertEqual(ctypes.cast(arg.ptr, ctypes.c_void_p).value, addr)
        arg = _arrays.as_doubles([0.1, 0.2, 0.7])
        self.assertTrue(arg.copied)

    @unittest.skipIf(np is None, "numpy hidden or absent")
    def test_contiguous_float64_numpy_input_is_not_copied(self):
        a = np.array([[1.0, 2.0], [3.0, 4.0]])
        arg = _arrays.as_doubles(a)
        self.assertFalse(arg.copied)
        self.assertEqual(ctypes.cast(arg.ptr, ctypes.c_void_p).value,
                         a.ctypes.data)
        for other in (a.T, a.astype(np.float32), a[:, :1],
                      np.array([1, 2, 3])):
            arg = _arrays.as_doubles(other)
            self.assertTrue(arg.copied)
            self.assertEqual(_support.flat(other),
                             [arg.ptr[k] for k in range(arg.size)])

    @unittest.skipIf(np is None, "numpy hidden or absent")
    def test_out_array_is_filled_in_place(self):
        D = np.array([[0, 2e-5, 3e-5], [2e-5, 0, 1e-5], [3e-5, 1e-5, 0]])
        x = np.array([0.2, 0.3, 0.5])
        g = np.array([[1.0, 0.0], [0.0, 1.0], [-1.0, -1.0]])
        out = np.zeros((3, 2))
        r = mcdiff.flux_compute(D, 40.0, x, g, out=out)
        self.assertIs(r, out)
        ref = mcdiff.flux_compute(D, 40.0, x, g)
        self.assertEqual(out.tolist(), ref.tolist())
        with self.assertRaises(ValueError):
            mcdiff.flux_compute(D, 40.0, x, g, out=np.zeros((2, 3)))
        with self.assertRaises(ValueError):
            mcdiff.flux_compute(D, 40.0, x, g, out=np.zeros((3, 2)).T.copy().T)

    def test_bad_shapes_raise_before_the_call(self):
        D = [[0, 1e-5], [1e-5, 0]]
        with self.assertRaises(ValueError):
            mcdiff.flux_compute(D, 40.0, [0.5, 0.5], [1.0, 0.0, 2.0])
        with self.assertRaises(ValueError):
            mcdiff.flux_compute([[0, 1e-5, 1]], 40.0, [0.5, 0.5], [1.0, 0.0])
        with self.assertRaises(ValueError):
            mcdiff.flux_compute(D, 40.0, [[0.5], [0.5, 1]], [1.0, 0.0])
        with self.assertRaises(TypeError):
            mcdiff.flux_compute(D, 40.0, "ab", [1.0, 0.0])
        with self.assertRaises(ValueError):
            mcdiff.flux_compute(D, 40.0, [0.5, 0.5], [1.0, 0.0],
                                model="quantum")


if __name__ == "__main__":
    sys.exit(_support.run(__name__))
