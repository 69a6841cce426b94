"""Classes owning one C object each: Workspace, Database, Mixture.

Each object owns exactly one pointer. It is released by close(), by leaving
a ``with`` block, or by a weakref.finalize when the object is collected
(also at interpreter exit), whichever comes first; the C free function runs
exactly once. Using a closed object raises ValueError.
"""

import collections
import ctypes
import weakref

from . import _arrays
from ._native import lib
from .enums import GasMethod, Method, Param, EstimateWarning, coerce
from .errors import error_for

__all__ = ["Workspace", "Database", "Mixture", "BinaryEstimate",
           "BinaryMatrices", "GasState", "Liquid", "LiquidState",
           "Evaporation"]


# Names of the slots of mcd_db_binary_explain, in the order of their
# MCD_EXPLAIN_* indices (tests/python/test_api.py checks them against the
# header).
EXPLAIN_SLOTS = ("d", "t", "p", "m_a", "m_b", "m_ab", "v_a", "v_b", "v_roots",
                 "sigma_a", "sigma_b", "sigma_ab", "eps_a", "eps_b", "eps_ab",
                 "t_star", "omega_d", "wl_factor", "phi", "mu_b", "vb_a",
                 "rel_err", "rel_err_widened", "warn", "estimated",
                 "delta_a", "delta_b", "delta_ab")
EXPLAIN_COUNT = 32

BinaryEstimate = collections.namedtuple("BinaryEstimate",
                                        "D rel_err warnings")
BinaryEstimate.__doc__ = """A binary diffusivity estimate: D [m^2/s], the
method's typical relative error [-] and its EstimateWarning flags."""

BinaryMatrices = collections.namedtuple("BinaryMatrices",
                                        "D rel_err warnings")
BinaryMatrices.__doc__ = """Binary diffusivities of a mixture at (T, P):
D (n x n, [m^2/s], diagonal 0), rel_err (n x n typical relative errors,
NaN for user values and on the diagonal) and warnings (n x n nested list
of EstimateWarning flags)."""

GasState = collections.namedtuple("GasState", "c D M")
GasState.__doc__ = """Ideal-gas state of a mixture: c [mol/m^3], binary
diffusivities D (n x n) [m^2/s] and molar masses M [kg/mol]."""


LiquidState = collections.namedtuple("LiquidState",
                                     "lngamma Gamma Dij warnings")
LiquidState.__doc__ = """A liquid at (T, x): ln gamma (n), the thermodynamic
factor Gamma (n x n, the Gamma of flux_compute), the Maxwell-Stefan
diffusivities Dij (n x n, [m^2/s], or None when not asked) and Warning
flags."""

Evaporation = collections.namedtuple(
    "Evaporation", "y0 N mass_rate level_rate warnings")
Evaporation.__doc__ = """Evaporation through a stagnant gas film: interface
gas mole fractions y0 (n + 1), molar fluxes N (n + 1) [mol/(m^2 s)], the
evaporation rate [kg/(m^2 s)], the fall of the liquid level [mm/h] and
Warning flags."""


def _text(b):
    return None if b is None else b.decode("utf-8", "replace")


def _raise(st, function, detail=""):
    raise error_for(st, function, detail)


class _Handle:
    """Base class: one C pointer, released exactly once."""

    _free_name = None
    _kind = "object"

    def __init__(self, ptr):
        self._ptr = ctypes.c_void_p(ptr)
        self._finalizer = weakref.finalize(
            self, getattr(lib, self._free_name), self._ptr)

    @property
    def closed(self):
        return not self._finalizer.alive

    def close(self):
        """Release the C object now (idempotent)."""
        self._finalizer()

    def _p(self):
        if not self._finalizer.alive:
            raise ValueError("operation on a closed %s" % self._kind)
        return self._ptr

    def __enter__(self):
        self._p()
        return self

    def __exit__(self, *exc):
        self.close()
        return False


# ---------------------------------------------------------------------------
# Workspace
# ---------------------------------------------------------------------------

class Workspace(_Handle):
    """Scratch memory for flux, Fick-matrix and transfer calls of up to
    ``n_species`` species (mcd_workspace_new). One thread at a time.

    Module-level functions use a per-thread workspace when none is given;
    pass ``workspace=`` to reuse your own in tight loops.
    """

    _free_name = "mcd_workspace_free"
    _kind = "workspace"

    def __init__(self, n_species):
        out = ctypes.c_void_p()
        st = lib.mcd_workspace_new(int(n_species), ctypes.byref(out))
        if st:
            _raise(st, "mcd_workspace_new",
                   "n_species = %d" % int(n_species))
        super().__init__(out.value)

    @property
    def capacity(self):
        """Largest number of species (mcd_workspace_capacity)."""
        return int(lib.mcd_workspace_capacity(self._p()))

    def set_iterative(self, max_iter=100, tol=1e-10):
        """Settings of Model.ITERATIVE for later batched calls on this
        workspace (max_iter 1..1000, tol >= 0; 0 runs max_iter
        iterations)."""
        st = lib.mcd_workspace_set_iterative(self._p(), int(max_iter),
                                             _arrays.scalar(tol, "tol"))
        self.check(st, "mcd_workspace_set_iterative")

    def iterative_outcome(self):
        """(largest relative error estimate, largest iteration count) of
        the last batched ITERATIVE call on this workspace."""
        err, it = ctypes.c_double(), ctypes.c_size_t()
        st = lib.mcd_workspace_iterative_outcome(self._p(), ctypes.byref(err),
                                              ctypes.byref(it))
        self.check(st, "mcd_workspace_iterative_outcome")
        return err.value, it.value

    def set_threads(self, n_threads):
        """OpenMP threads of later batched calls (0: the OpenMP default;
        ignored in a build without OpenMP)."""
        st = lib.mcd_workspace_set_threads(self._p(), int(n_threads))
        self.check(st, "mcd_workspace_set_threads")

    def set_dij_read(self, upper_only):
        """How later flux_batch_dij calls read Dij: upper_only=False (the
        default) reads and checks both triangles (symmetry included);
        True reads the upper triangle (j > i) only and skips the symmetry
        check: the caller vouches that every cell's matrix is symmetric
        (C: mcd_workspace_set_dij_read, MCD_DIJ_READ_UPPER)."""
        st = lib.mcd_workspace_set_dij_read(self._p(), 1 if upper_only else 0)
        self.check(st, "mcd_workspace_set_dij_read")

    def check(self, st, function):
        """Raise the McdError for status st with this workspace's detail."""
        if st:
            _raise(st, function)

    def __repr__(self):
        if self.closed:
            return "<mcdiff.Workspace closed>"
        return "<mcdiff.Workspace capacity=%d>" % self.capacity


# ---------------------------------------------------------------------------
# Database
# ---------------------------------------------------------------------------

class Database(_Handle):
    """A species database (mcd_db). ``Database()`` is empty,
    ``Database.builtin()`` holds a copy of the built-in table.

    Species are addressed by index (int) or by name (str, case-insensitive;
    or a formula that exactly one species has). Parameters by Param member,
    its value, or a name ("M", "sigma", "eps_k", "Vb", "molar_mass", ...).
    """

    _free_name = "mcd_db_free"
    _kind = "database"

    def __init__(self, _builtin=False):
        out = ctypes.c_void_p()
        fname = "mcd_db_new_builtin" if _builtin else "mcd_db_new"
        st = getattr(lib, fname)(ctypes.byref(out))
        if st:
            _raise(st, fname)
        super().__init__(out.value)

    @classmethod
    def builtin(cls):
        """A new database holding a copy of the built-in species table."""
        return cls(_builtin=True)

    # -- look-up ----------------------------------------------------------
    def __len__(self):
        return int(lib.mcd_db_species_count(self._p()))

    def find(self, name):
        """Index of a species by name (or unique formula)."""
        if not isinstance(name, str):
            raise TypeError("species name must be a str")
        out = ctypes.c_size_t()
        st = lib.mcd_db_find(self._p(), name.encode(), ctypes.byref(out))
        if st:
            _raise(st, "mcd_db_find", "species %r" % name)
        return out.value

    def index(self, key):
        """Index of a species given by index or name."""
        if isinstance(key, str):
            return self.find(key)
        if isinstance(key, bool) or not isinstance(key, int):
            try:
                key = key.__index__()
            except AttributeError:
                raise TypeError("species must be an index or a name, got %s"
                                % type(key).__name__) from None
        n = len(self)
        if not 0 <= key < n:
            raise IndexError("species index %d out of range (0..%d)"
                             % (key, n - 1))
        return key

    def __contains__(self, name):
        try:
            self.find(name)
            return True
        except LookupError:
            return False

    def __iter__(self):
        return iter(self.names)

    @property
    def names(self):
        """Names of all species, in index order."""
        p = self._p()
        return [_text(lib.mcd_db_name(p, i)) for i in range(len(self))]

    def name(self, species):
        return _text(lib.mcd_db_name(self._p(), self.index(species)))

    def formula(self, species):
        return _text(lib.mcd_db_formula(self._p(), self.index(species)))

    def param(self, species, p):
        """Value of parameter p (SI); NoDataError when not known."""
        p = coerce(Param, p, "param")
        i = self.index(species)
        out = ctypes.c_double()
        st = lib.mcd_db_param(self._p(), i, p, ctypes.byref(out))
        if st:
            _raise(st, "mcd_db_param",
                   "%s of %s" % (param_name(p), self.name(i)))
        return out.value

    def source(self, species, p):
        """Citation text of parameter p ('user' for values set by you)."""
        p = coerce(Param, p, "param")
        return _text(lib.mcd_db_source(self._p(), self.index(species), p))

    def params(self, species):
        """Dict {Param: value} of the parameters known for a species."""
        i = self.index(species)
        out = {}
        v = ctypes.c_double()
        for p in Param:
            st = lib.mcd_db_param(self._p(), i, p, ctypes.byref(v))
            if st == 0:
                out[p] = v.value
            elif st != 9:  # MCD_ENODATA: not known, skipped
                _raise(st, "mcd_db_param")
        return out

    def sources(self, species):
        """Dict {Param: source text} of the parameters known for a species."""
        i = self.index(species)
        known = self.params(i)
        return {p: self.source(i, p) for p in known}

    # -- changes ----------------------------------------------------------
    def add(self, name, formula, n_rings=0):
        """Add (or reset) a species from its formula; returns its index."""
        out = ctypes.c_size_t()
        st = lib.mcd_db_add(self._p(), name.encode(), formula.encode(),
                            int(n_rings), ctypes.byref(out))
        if st:
            _raise(st, "mcd_db_add")
        return out.value

    def set_param(self, species, p, value):
        """Set parameter p (SI units) of a species; its source becomes
        'user'."""
        p = coerce(Param, p, "param")
        i = self.index(species)
        st = lib.mcd_db_set_param(self._p(), i, p,
                                  _arrays.scalar(value, "value"))
        if st:
            _raise(st, "mcd_db_set_param",
                   "%s of %s = %r" % (param_name(p), self.name(i), value))

    def load_file(self, path):
        """Load species from a file in the mcdiff species format (all or
        nothing; the error names the line)."""
        import os
        st = lib.mcd_db_load_file(self._p(), os.fsencode(path))
        if st:
            _raise(st, "mcd_db_load_file")

    def load_string(self, text):
        """Load species from text in the mcdiff species format."""
        st = lib.mcd_db_load_string(self._p(), text.encode())
        if st:
            _raise(st, "mcd_db_load_string")

    # -- estimates ----------------------------------------------------------
    def binary_gas(self, a, b, method, T, P):
        """Gas binary diffusivity of species a and b (mcd_db_binary_gas)."""
        m = coerce(GasMethod, method, "method")
        D, rel, warn = ctypes.c_double(), ctypes.c_double(), ctypes.c_uint()
        st = lib.mcd_db_binary_gas(self._p(), self.index(a), self.index(b), m,
                                _arrays.scalar(T, "T"), _arrays.scalar(P, "P"),
                                ctypes.byref(D), ctypes.byref(rel),
                                ctypes.byref(warn))
        if st:
            _raise(st, "mcd_db_binary_gas", "%s-%s by %s" % (a, b, m.name))
        return BinaryEstimate(D.value, rel.value, EstimateWarning(warn.value))

    def binary_liquid(self, solute, solvent, T, mu_solvent):
        """Wilke-Chang infinite-dilution diffusivity (mcd_db_binary_liquid)."""
        D, rel, warn = ctypes.c_double(), ctypes.c_double(), ctypes.c_uint()
        st = lib.mcd_db_binary_liquid(self._p(), self.index(solute),
                                   self.index(solvent), _arrays.scalar(T, "T"),
                                   _arrays.scalar(mu_solvent, "mu_solvent"),
                                   ctypes.byref(D), ctypes.byref(rel),
                                   ctypes.byref(warn))
        if st:
            _raise(st, "mcd_db_binary_liquid", "%s in %s" % (solute, solvent))
        return BinaryEstimate(D.value, rel.value, EstimateWarning(warn.value))

    def binary_explain(self, a, b, method, T, P=float("nan"),
                       mu_solvent=float("nan")):
        """The intermediates of an estimate (mcd_db_binary_explain): a dict
        from the slot names of EXPLAIN_SLOTS (lower case: "d", "sigma_ab",
        "t_star", ...) to values in SI units; slots the method does not use
        are left out. For "wilke-chang" a is the solute, b the solvent and
        mu_solvent [Pa s] is needed; gas methods need P [Pa]."""
        m = coerce(Method, method, "method")
        out = (ctypes.c_double * EXPLAIN_COUNT)()
        st = lib.mcd_db_binary_explain(
            self._p(), self.index(a), self.index(b), m, _arrays.scalar(T, "T"),
            float(P), float(mu_solvent), out)
        if st:
            _raise(st, "mcd_db_binary_explain", "%s-%s by %s" % (a, b, m.name))
        res = {}
        for k, name in enumerate(EXPLAIN_SLOTS):
            if out[k] == out[k]:  # not NaN
                res[name] = out[k]
        if "warn" in res:
            res["warn"] = EstimateWarning(int(res["warn"]))
        return res

    def mixture(self, names, method="fsg"):
        """A Mixture of the named species (parameters are copied)."""
        return Mixture(self, names, method)

    def __repr__(self):
        if self.closed:
            return "<mcdiff.Database closed>"
        return "<mcdiff.Database %d species>" % len(self)


def param_name(p):
    """Short machine name of a parameter ("M", "sigma", ...)."""
    return _text(lib.mcd_param_name(int(p)))


def param_unit(p):
    """SI unit text of a parameter ("kg/mol", "m", ...)."""
    return _text(lib.mcd_param_unit(int(p)))


# ---------------------------------------------------------------------------
# Mixture
# ---------------------------------------------------------------------------

class Mixture(_Handle):
    """N species picked from a Database with their binary diffusivity
    methods (mcd_mixture). The mixture copies what it needs: the database
    may be closed afterwards.

    Species of a mixture are addressed by index or by their name in it.
    """

    _free_name = "mcd_mixture_free"
    _kind = "mixture"

    def __init__(self, db, names, method="fsg"):
        if isinstance(names, str):
            raise TypeError("names must be a sequence of species names")
        names = list(names)
        m = coerce(GasMethod, method, "method")
        arr = (ctypes.c_char_p * max(len(names), 1))(
            *[str(s).encode() for s in names])
        out = ctypes.c_void_p()
        st = lib.mcd_mixture_new(db._p(), len(names), arr, m,
                                 ctypes.byref(out))
        if st:
            _raise(st, "mcd_mixture_new")
        super().__init__(out.value)

    def __len__(self):
        return int(lib.mcd_mixture_species_count(self._p()))

    @property
    def names(self):
        p = self._p()
        return [_text(lib.mcd_mixture_name(p, i)) for i in range(len(self))]

    def index(self, key):
        if isinstance(key, str):
            low = key.lower()
            for i, nm in enumerate(self.names):
                if nm.lower() == low:
                    return i
            raise KeyError("species %r is not in the mixture %s"
                           % (key, self.names))
        return int(key)

    def molar_masses(self):
        """Molar masses [kg/mol] of the species."""
        out = _arrays.Output((len(self),))
        st = lib.mcd_mixture_molar_masses(self._p(), out.ptr)
        if st:
            _raise(st, "mcd_mixture_molar_masses")
        return out.result()

    def set_method(self, i, j, method):
        """Use a method for pair (i, j)."""
        m = coerce(GasMethod, method, "method")
        st = lib.mcd_mixture_set_method(self._p(), self.index(i),
                                        self.index(j), m)
        if st:
            _raise(st, "mcd_mixture_set_method", "pair (%s, %s)" % (i, j))

    def pair_method(self, i, j):
        """The Method pair (i, j) is estimated by: the one set, the one
        GasMethod.RECOMMENDED picked for it, or Method.USER for a value
        given with set_binary (mcd_mixture_pair_method)."""
        out = ctypes.c_int()
        st = lib.mcd_mixture_pair_method(self._p(), self.index(i),
                                         self.index(j), ctypes.byref(out))
        if st:
            _raise(st, "mcd_mixture_pair_method", "pair (%s, %s)" % (i, j))
        return Method(out.value)

    def set_binary(self, i, j, D, T_ref, P_ref=101325.0):
        """A measured binary diffusivity D [m^2/s] at (T_ref [K], P_ref
        [Pa]) for pair (i, j), scaled as (T/T_ref)^1.75 (P_ref/P)."""
        st = lib.mcd_mixture_set_binary(self._p(), self.index(i),
                                        self.index(j),
                                        _arrays.scalar(D, "D"),
                                        _arrays.scalar(T_ref, "T_ref"),
                                        _arrays.scalar(P_ref, "P_ref"))
        if st:
            _raise(st, "mcd_mixture_set_binary", "pair (%s, %s)" % (i, j))

    def binaries(self, T, P, out=None):
        """Binary diffusivities (n x n, [m^2/s], diagonal 0) at T [K],
        P [Pa]."""
        n = len(self)
        o = _arrays.Output((n, n), out)
        st = lib.mcd_mixture_binaries(self._p(), _arrays.scalar(T, "T"),
                                      _arrays.scalar(P, "P"), o.ptr, None,
                                      None)
        if st:
            _raise(st, "mcd_mixture_binaries", "T = %r K, P = %r Pa" % (T, P))
        return o.result()

    def binaries_detail(self, T, P):
        """BinaryMatrices(D, rel_err, warnings) at T [K], P [Pa]."""
        n = len(self)
        d = _arrays.Output((n, n))
        r = _arrays.Output((n, n))
        w = (ctypes.c_uint * max(n * n, 1))()
        st = lib.mcd_mixture_binaries(self._p(), _arrays.scalar(T, "T"),
                                      _arrays.scalar(P, "P"), d.ptr, r.ptr, w)
        if st:
            _raise(st, "mcd_mixture_binaries", "T = %r K, P = %r Pa" % (T, P))
        warns = [[EstimateWarning(w[i * n + j]) for j in range(n)]
                 for i in range(n)]
        return BinaryMatrices(d.result(), r.result(), warns)

    def set_temperature_fit(self, T_min, T_max):
        """Let batched calls evaluate Chapman-Enskog, Wilke-Lee and Brokaw pairs
        from a fit over [T_min, T_max] [K]; returns the fit's largest
        relative error on the diffusivities. (0, 0) removes the fit."""
        err = ctypes.c_double()
        st = lib.mcd_mixture_set_temperature_fit(
            self._p(), _arrays.scalar(T_min, "T_min"),
            _arrays.scalar(T_max, "T_max"), ctypes.byref(err))
        if st:
            _raise(st, "mcd_mixture_set_temperature_fit",
                   "range [%r, %r] K" % (T_min, T_max))
        return err.value

    def clear_temperature_fit(self):
        """Remove a declared temperature fit."""
        self.set_temperature_fit(0.0, 0.0)

    def temperature_fit(self):
        """(T_min, T_max, max_rel_err) of the declared fit, zeros if none."""
        a, b, e = ctypes.c_double(), ctypes.c_double(), ctypes.c_double()
        st = lib.mcd_mixture_temperature_fit(self._p(), ctypes.byref(a),
                                             ctypes.byref(b), ctypes.byref(e))
        if st:
            _raise(st, "mcd_mixture_temperature_fit")
        return a.value, b.value, e.value

    def gas_state(self, T, P):
        """GasState(c, D, M) of the mixture as an ideal gas at T, P."""
        c = ctypes.c_double()
        st = lib.mcd_comp_ideal_gas_c(_arrays.scalar(T, "T"),
                                 _arrays.scalar(P, "P"), ctypes.byref(c))
        if st:
            _raise(st, "mcd_comp_ideal_gas_c", "T = %r K, P = %r Pa" % (T, P))
        return GasState(c.value, self.binaries(T, P), self.molar_masses())

    def fluxes(self, T, P, comp, grad, **kw):
        """Diffusion fluxes of the mixture as an ideal gas at T, P: the
        arguments after grad are those of mcdiff.flux_compute."""
        from .api import flux_compute
        s = self.gas_state(T, P)
        return flux_compute(s.D, s.c, comp, grad, M=s.M, **kw)

    def fick_matrix(self, T, P, comp, **kw):
        """Generalized Fick matrix of the mixture as an ideal gas at T, P
        (arguments after comp as in mcdiff.fick_matrix)."""
        from .api import fick_matrix
        s = self.gas_state(T, P)
        return fick_matrix(s.D, comp, M=s.M, **kw)

    def __repr__(self):
        if self.closed:
            return "<mcdiff.Mixture closed>"
        return "<mcdiff.Mixture %s>" % ", ".join(self.names)


# ---------------------------------------------------------------------------
# Liquid
# ---------------------------------------------------------------------------

class Liquid(_Handle):
    """A liquid mixture of n species with an activity model ("ideal",
    "nrtl", "wilson" or "uniquac") and the caller's parameters
    (mcd_liquid_new; see include/mcdiff.h for the forms). Indices are
    0-based. Parameter setters: set_species ("molar_volume" [m^3/mol] for
    Wilson, "r" and "q" for UNIQUAC), set_pair (p(T) = a + b/T + e ln T
    for each direction, alpha for NRTL, the fitted T range), set_dinf
    (infinite-dilution diffusivities), set_antoine (log10(P/Pa) = A -
    B/(T/K + C)).
    """

    _free_name = "mcd_liquid_free"
    _kind = "liquid"
    MODELS = {"ideal": 0, "nrtl": 1, "wilson": 2, "uniquac": 3}
    PARAMS = {"molar_volume": 0, "r": 1, "q": 2}

    def __init__(self, n_species, model="nrtl"):
        m = self.MODELS.get(str(model).lower()) if not isinstance(
            model, int) else model
        if m is None:
            raise ValueError("model must be one of %s" % sorted(self.MODELS))
        out = ctypes.c_void_p()
        st = lib.mcd_liquid_new(int(n_species), int(m), ctypes.byref(out))
        if st:
            _raise(st, "mcd_liquid_new")
        super().__init__(out.value)
        self._n = int(n_species)

    def __len__(self):
        return self._n

    def _st(self, st, fn):
        if st:
            _raise(st, fn)

    def set_species(self, i, param, value):
        p = self.PARAMS.get(param) if isinstance(param, str) else int(param)
        if p is None:
            raise ValueError("param must be one of %s" % sorted(self.PARAMS))
        self._st(lib.mcd_liquid_set_species(self._p(), int(i), p,
                                            _arrays.scalar(value, "value")),
                 "mcd_liquid_set_species")

    def set_pair(self, i, j, coef_ij, coef_ji, alpha=0.0, T_range=(0.0, 0.0)):
        a = _arrays.vector(coef_ij, 3, "coef_ij")
        b = _arrays.vector(coef_ji, 3, "coef_ji")
        self._st(lib.mcd_liquid_set_pair(
            self._p(), int(i), int(j), a.ptr, b.ptr,
            _arrays.scalar(alpha, "alpha"),
            _arrays.scalar(T_range[0], "T_min"),
            _arrays.scalar(T_range[1], "T_max")), "mcd_liquid_set_pair")

    def set_dinf(self, i, j, D_i_in_j, D_j_in_i):
        self._st(lib.mcd_liquid_set_dinf(
            self._p(), int(i), int(j), _arrays.scalar(D_i_in_j, "D_i_in_j"),
            _arrays.scalar(D_j_in_i, "D_j_in_i")), "mcd_liquid_set_dinf")

    def set_antoine(self, i, A, B, C, T_min, T_max):
        self._st(lib.mcd_liquid_set_antoine(
            self._p(), int(i), *[_arrays.scalar(v, k) for v, k in
                                 ((A, "A"), (B, "B"), (C, "C"),
                                  (T_min, "T_min"), (T_max, "T_max"))]),
            "mcd_liquid_set_antoine")

    def _ws(self, workspace, n):
        from .api import _ws
        return _ws(workspace, n)

    def eval(self, T, x, *, diffusivities=True, workspace=None):
        """LiquidState(lngamma, Gamma, Dij, warnings) at T [K] and mole
        fractions x (mcd_liquid_eval)."""
        n = self._n
        ax = _arrays.vector(x, n, "x")
        lg, G = _arrays.Output((n,)), _arrays.Output((n, n))
        D = _arrays.Output((n, n)) if diffusivities else None
        w = ctypes.c_uint()
        ws = self._ws(workspace, n)
        st = lib.mcd_liquid_eval(ws._p(), self._p(), _arrays.scalar(T, "T"),
                                 ax.ptr, lg.ptr, G.ptr,
                                 None if D is None else D.ptr,
                                 ctypes.byref(w))
        self._st(st, "mcd_liquid_eval")
        return LiquidState(lg.result(), G.result(),
                           None if D is None else D.result(),
                           EstimateWarning(w.value))

    def vle(self, T, x, *, workspace=None):
        """Partial pressures [Pa] over the liquid (modified Raoult's
        law, mcd_liquid_vle)."""
        n = self._n
        ax = _arrays.vector(x, n, "x")
        o = _arrays.Output((n,))
        ws = self._ws(workspace, n)
        st = lib.mcd_liquid_vle(ws._p(), self._p(), _arrays.scalar(T, "T"),
                                ax.ptr, o.ptr, None)
        self._st(st, "mcd_liquid_vle")
        return o.result()

    def fluxes(self, T, c, x, grad, **kw):
        """Diffusion fluxes of the liquid at T with total concentration c
        [mol/m^3]: Gamma and Dij from eval, then mcdiff.flux_compute (the
        arguments after grad are those of flux_compute)."""
        from .api import flux_compute
        s = self.eval(T, x)
        return flux_compute(s.Dij, c, x, grad, Gamma=s.Gamma, **kw)

    def flux_batch(self, T, c, comp, grad, **kw):
        """Fluxes at many cells (mcdiff.liquid_flux_batch, cells last; the
        keyword arguments are its): LiquidFluxes(flux, warnings)."""
        from .api import liquid_flux_batch
        return liquid_flux_batch(self, T, c, comp, grad, **kw)

    def evaporation(self, T, P, x_liq, *, Dij, c, L, xL, M, rho_liquid,
                    workspace=None):
        """Evaporation through a stagnant gas film of the liquid's species
        plus one inert last (mcd_liquid_evaporation): Dij, xL and M have
        n + 1 entries. Returns Evaporation(y0, N, mass_rate, level_rate,
        warnings)."""
        from ._signatures import mcd_film
        n = self._n + 1
        D = _arrays.matrix(Dij, n, n, "Dij")
        aL = _arrays.vector(xL, n, "xL")
        aM = _arrays.vector(M, n, "M")
        ax = _arrays.vector(x_liq, self._n, "x_liq")
        y0, N = _arrays.Output((n,)), _arrays.Output((n,))
        rate, level, w = ctypes.c_double(), ctypes.c_double(), ctypes.c_uint()
        film = mcd_film(n_species=n, c=_arrays.scalar(c, "c"),
                        L=_arrays.scalar(L, "L"), Dij=D.ptr, x0=aL.ptr,
                        xL=aL.ptr)
        ws = self._ws(workspace, n)
        st = lib.mcd_liquid_evaporation(
            ws._p(), self._p(), ctypes.byref(film), _arrays.scalar(T, "T"),
            _arrays.scalar(P, "P"), ax.ptr, aM.ptr,
            _arrays.scalar(rho_liquid, "rho_liquid"), y0.ptr, N.ptr,
            ctypes.byref(rate), ctypes.byref(level), ctypes.byref(w))
        self._st(st, "mcd_liquid_evaporation")
        return Evaporation(y0.result(), N.result(), rate.value, level.value,
                           EstimateWarning(w.value))

    def __repr__(self):
        if self.closed:
            return "<mcdiff.Liquid closed>"
        return "<mcdiff.Liquid n=%d>" % self._n
