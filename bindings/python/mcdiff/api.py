"""Function wrappers over the C library, in the order of include/mcdiff.h.

Units are SI throughout (see the header). Fluxes and gradients are
per-species fields: shape (n,) for one direction or (n, n_dim) with n_dim
1..3; a 1-D input gives a 1-D result. Matrices are (n, n), given nested or
flat row-major. Results are numpy arrays when numpy is available, else
lists. Failures raise an McdError subclass (mcdiff.errors).

Calls that need scratch memory accept ``workspace=`` (a Workspace); without
it they use one workspace per thread, grown when a call needs more species.
"""

import collections
import ctypes
import math
import threading

from . import _arrays
from ._arrays import np
from ._native import lib
from ._signatures import (mcd_bulbs, mcd_cells, mcd_dgm, mcd_dgm_cells,
                          mcd_film, mcd_pore, mcd_slab, mcd_state)
from .enums import (Basis, Bootstrap, Diag, FilmBootstrap, FilmMethod, Method,
                    Model, Warning, coerce)
from .errors import error_for
from .handles import Workspace

__all__ = [
    # version
    "version_number", "version_string",
    # formulas
    "formula_molar_mass", "formula_elements", "formula_diffusion_volume",
    "formula_molecule_volume", "element_symbol", "element_weight",
    # compositions
    "normalize", "x_to_w", "w_to_x", "mean_molar_mass_x", "mean_molar_mass_w",
    "x_to_c", "c_to_x", "ideal_gas_c", "grad_x_to_w", "grad_w_to_x",
    # binaries
    "method_name", "method_from_name", "method_typical_error",
    "typical_error_widened", "binary_explain",
    "warning_string", "warning_strings", "binary_fsg", "binary_chapman_enskog",
    "binary_wilke_lee", "binary_brokaw", "binary_wilke_chang",
    "binary_omega_d", "binary_scale",
    "binary_gas", "binary_liquid", "binary_tyn_calus",
    "binary_hayduk_minhas", "method_temperature_range",
    # fluxes
    "flux_compute", "thermal_ratios", "flux_jacobian", "flux_jacobian_tp",
    "flux_batch_jacobian", "fick_matrix",
    "fick_fluxes",
    "fick_eigenvalues",
    "flux_convert", "flux_to_volume_frame", "flux_to_species_frame",
    "flux_total", "flux_velocity_difference", "flux_project", "flux_diagnose",
    # batched
    "flux_batch", "flux_batch_dij", "liquid_flux_batch",
    "to_tiles", "from_tiles", "flux_batch_dij_tiled",
    # transfer
    "film_solve", "film_profile", "bulbs_linearized", "bulbs_integrate",
    # viscosity
    "viscosity_omega22", "viscosity_chapman_enskog", "viscosity_wilke",
    "viscosity_gas", "mixture_viscosities",
    # thermal diffusion from kinetic theory
    "lj_collision_integrals", "thermal_factor_kinetic", "thermal_factor_ce",
    "thermal_factor", "mixture_thermal_ratios", "dufour_heat_flux",
    "dufour_heat_flux_batch",
    "ThermalEstimate", "ThermalRatios", "CollisionIntegrals",
    "THERMAL_CE_TYPICAL_ERROR",
    # porous media
    "pore_permeability", "pore_effective", "knudsen_diffusivity", "bosanquet",
    "dgm_fluxes", "dgm_closed", "dgm_gradients", "dgm_fluxes_batch",
    "slab_solve", "slab_profile",
    # results
    "FickMatrix", "TotalFlux", "ProjectedFlux", "FilmResult", "BulbsResult",
    "ViscosityEstimate", "DgmClosed", "DgmGradients", "SlabResult",
    "TemperatureRange", "LiquidFluxes",
    "default_workspace",
]

FickMatrix = collections.namedtuple("FickMatrix", "D dependent")
FickMatrix.__doc__ = """Generalized Fick matrix D ((n-1) x (n-1), species
other than `dependent` in their original order) and the dependent index."""
TotalFlux = collections.namedtuple("TotalFlux", "total bulk")
TotalFlux.__doc__ = """Total fluxes (shape of the diffusion fluxes) and the
bulk flux N_t or n_t (float for 1-D input, else length n_dim)."""
ProjectedFlux = collections.namedtuple("ProjectedFlux", "flux residual")
FilmResult = collections.namedtuple("FilmResult", "N iterations residual")
FilmResult.__doc__ = """Steady film fluxes N [mol/(m^2 s)], iterations used
and the last relative change (RATIOS: the end-composition residual)."""
LiquidFluxes = collections.namedtuple("LiquidFluxes", "flux warnings")
LiquidFluxes.__doc__ = """Batched fluxes of a liquid (the shape of grad)
and the Warning flags of all cells together (liquid_flux_batch)."""
BulbsResult = collections.namedtuple("BulbsResult", "x1 x2")
BulbsResult.__doc__ = """Two-bulb mole fractions, each n_times x n."""

_tls = threading.local()


def _text(b):
    return None if b is None else b.decode("utf-8", "replace")


def _check(st, function, detail=""):
    if st:
        raise error_for(st, function, detail)


def default_workspace(n_species):
    """This thread's shared workspace, with capacity >= n_species."""
    ws = getattr(_tls, "ws", None)
    if ws is None or ws.closed or ws.capacity < n_species:
        if ws is not None:
            ws.close()
        ws = Workspace(max(int(n_species), 8))
        _tls.ws = ws
    return ws


def _ws(workspace, n):
    if workspace is None:
        return default_workspace(n)
    if not isinstance(workspace, Workspace):
        raise TypeError("workspace must be an mcdiff.Workspace")
    return workspace


def _sc(v, name):
    return _arrays.scalar(v, name)


def _opt(obj, fn):
    """None stays None (NULL); anything else goes through fn."""
    return None if obj is None else fn(obj)


def _ptr(arg):
    return None if arg is None else arg.ptr


def _species_index(value, n, names, fn, arg="species"):
    """A species index 0..n-1 from an index or, with names (the species
    in the order of the arrays), a name (case-insensitive)."""
    if isinstance(value, str):
        if names is None:
            raise TypeError(
                "%s: %s=%r is a name: also pass names=[...] (the species in "
                "the order of the arrays) to refer to species by name, or "
                "give the index 0..%d" % (fn, arg, value, n - 1))
        names = [str(v) for v in names]
        if len(names) != n:
            raise ValueError("%s: names has %d entries for %d species"
                             % (fn, len(names), n))
        low = [v.lower() for v in names]
        if value.lower() not in low:
            raise ValueError("%s: %s=%r is not one of names (%s)"
                             % (fn, arg, value, ", ".join(names)))
        return low.index(value.lower())
    if isinstance(value, bool) or not hasattr(value, "__index__"):
        raise TypeError("%s: %s=%r: expected a species index 0..%d or, with "
                        "names=[...], a species name"
                        % (fn, arg, value, n - 1))
    return int(value)


def _field_result(out, was_1d):
    """Drop the direction axis of a (n, 1) result when the input was 1-D."""
    r = out.result()
    if not was_1d:
        return r
    if np is not None and isinstance(r, np.ndarray):
        return r.reshape(-1)
    return [row[0] for row in r]


def _field_out(n, n_dim, was_1d, out):
    """Output for a per-species field; a caller's 1-D out is used as is."""
    if out is not None and was_1d:
        return _arrays.Output((n,), out), False
    return _arrays.Output((n, n_dim), out), was_1d


# ---------------------------------------------------------------------------
# Version
# ---------------------------------------------------------------------------

def version_number():
    """Runtime library version as MAJOR*10000 + MINOR*100 + PATCH."""
    return int(lib.mcd_version_number())


def version_string():
    """Runtime library version "MAJOR.MINOR.PATCH"."""
    return _text(lib.mcd_version_string())


# ---------------------------------------------------------------------------
# Formulas and elements
# ---------------------------------------------------------------------------

def _fstr(formula):
    if not isinstance(formula, str):
        raise TypeError("formula must be a str")
    return formula.encode()


def formula_molar_mass(formula):
    """Molar mass [kg/mol] of a chemical formula."""
    out = ctypes.c_double()
    st = lib.mcd_formula_molar_mass(_fstr(formula), ctypes.byref(out))
    _check(st, "mcd_formula_molar_mass")
    return out.value


def formula_elements(formula):
    """Element counts of a formula as an ordered dict {symbol: count}."""
    cap = 128
    Z = (ctypes.c_int * cap)()
    cnt = (ctypes.c_long * cap)()
    n = ctypes.c_size_t()
    st = lib.mcd_formula_elements(_fstr(formula), cap, Z, cnt,
                                  ctypes.byref(n))
    _check(st, "mcd_formula_elements")
    return {element_symbol(Z[k]): int(cnt[k]) for k in range(n.value)}


def formula_diffusion_volume(formula, n_rings=0):
    """Fuller-Ensley-Giddings diffusion volume [-] from increments."""
    out = ctypes.c_double()
    st = lib.mcd_formula_diffusion_volume(_fstr(formula), int(n_rings),
                                          ctypes.byref(out))
    _check(st, "mcd_formula_diffusion_volume")
    return out.value


def formula_molecule_volume(formula):
    """Tabulated Fuller diffusion volume of a simple molecule."""
    out = ctypes.c_double()
    st = lib.mcd_formula_molecule_volume(_fstr(formula), ctypes.byref(out))
    _check(st, "mcd_formula_molecule_volume", "formula %r" % formula)
    return out.value


def element_symbol(Z):
    """Symbol of element Z (1..118), or None."""
    return _text(lib.mcd_element_symbol(int(Z)))


def element_weight(Z):
    """Standard atomic weight of element Z [kg/mol]."""
    out = ctypes.c_double()
    st = lib.mcd_element_weight(int(Z), ctypes.byref(out))
    _check(st, "mcd_element_weight", "Z = %d" % int(Z))
    return out.value


# ---------------------------------------------------------------------------
# Compositions
# ---------------------------------------------------------------------------

def normalize(y):
    """Validated, renormalised fractions (mcd_comp_normalize)."""
    a = _arrays.vector(y, None, "y")
    n = a.shape[0]
    out = _arrays.Output((n,))
    _check(lib.mcd_comp_normalize(n, a.ptr, out.ptr), "mcd_comp_normalize")
    return out.result()


def _conv(fname, M, y, yname):
    a = _arrays.vector(y, None, yname)
    n = a.shape[0]
    m = _arrays.vector(M, n, "M")
    out = _arrays.Output((n,))
    _check(getattr(lib, fname)(n, m.ptr, a.ptr, out.ptr), fname)
    return out.result()


def x_to_w(M, x):
    """Mass fractions from mole fractions."""
    return _conv("mcd_comp_x_to_w", M, x, "x")


def w_to_x(M, w):
    """Mole fractions from mass fractions."""
    return _conv("mcd_comp_w_to_x", M, w, "w")


def _mean(fname, M, y, yname):
    a = _arrays.vector(y, None, yname)
    n = a.shape[0]
    m = _arrays.vector(M, n, "M")
    out = ctypes.c_double()
    _check(getattr(lib, fname)(n, m.ptr, a.ptr, ctypes.byref(out)), fname)
    return out.value


def mean_molar_mass_x(M, x):
    """Mean molar mass [kg/mol] from mole fractions."""
    return _mean("mcd_comp_mean_molar_mass_x", M, x, "x")


def mean_molar_mass_w(M, w):
    """Mean molar mass [kg/mol] from mass fractions."""
    return _mean("mcd_comp_mean_molar_mass_w", M, w, "w")


def x_to_c(c, x):
    """Species concentrations c_i = c x_i [mol/m^3]."""
    a = _arrays.vector(x, None, "x")
    n = a.shape[0]
    out = _arrays.Output((n,))
    _check(lib.mcd_comp_x_to_c(n, _sc(c, "c"), a.ptr, out.ptr),
           "mcd_comp_x_to_c")
    return out.result()


def c_to_x(ci):
    """(mole fractions, total concentration) from concentrations."""
    a = _arrays.vector(ci, None, "ci")
    n = a.shape[0]
    out = _arrays.Output((n,))
    tot = ctypes.c_double()
    _check(lib.mcd_comp_c_to_x(n, a.ptr, out.ptr, ctypes.byref(tot)),
           "mcd_comp_c_to_x")
    return out.result(), tot.value


def ideal_gas_c(T, P):
    """Ideal-gas total concentration P/(R T) [mol/m^3]."""
    out = ctypes.c_double()
    _check(lib.mcd_comp_ideal_gas_c(_sc(T, "T"), _sc(P, "P"), ctypes.byref(out)),
           "mcd_comp_ideal_gas_c", "T = %r K, P = %r Pa" % (T, P))
    return out.value


def _grad_conv(fname, M, y, grad, yname):
    a = _arrays.vector(y, None, yname)
    n = a.shape[0]
    m = _arrays.vector(M, n, "M")
    g, nd, was_1d = _arrays.field(grad, n, "grad")
    out = _arrays.Output((n, nd))
    _check(getattr(lib, fname)(n, nd, m.ptr, a.ptr, g.ptr, out.ptr), fname)
    return _field_result(out, was_1d)


def grad_x_to_w(M, x, grad_x):
    """Gradients of mass fractions from mole fractions and their
    gradients."""
    return _grad_conv("mcd_comp_grad_x_to_w", M, x, grad_x, "x")


def grad_w_to_x(M, w, grad_w):
    """Gradients of mole fractions from mass fractions and their
    gradients."""
    return _grad_conv("mcd_comp_grad_w_to_x", M, w, grad_w, "w")


# ---------------------------------------------------------------------------
# Binary diffusivities
# ---------------------------------------------------------------------------

def method_name(method):
    """Short name of a method ("fsg", ...), or None."""
    return _text(lib.mcd_method_name(int(method)))


def method_from_name(name):
    """Method from its short name (case-insensitive), by the library."""
    out = ctypes.c_int()
    st = lib.mcd_method_from_name(name.encode(), ctypes.byref(out))
    _check(st, "mcd_method_from_name", "name %r" % name)
    return Method(out.value)


def method_typical_error(method):
    """Published average relative error of a method (NaN for USER)."""
    return lib.mcd_method_typical_error(coerce(Method, method, "method"))


def typical_error_widened(method, warnings):
    """Typical relative error of a method widened by an estimate's warning
    bits (mcd_typical_error_widened: factor 2 for each of high pressure,
    polar, quantum, associating; 1.5 for each of temperature, estimated
    parameter, scaled; at most 1). NaN for USER. A rule of thumb."""
    out = ctypes.c_double()
    st = lib.mcd_typical_error_widened(coerce(Method, method, "method"),
                                       int(warnings), ctypes.byref(out))
    _check(st, "mcd_typical_error_widened")
    return out.value


def binary_explain(db, a, b, method, T, P=float("nan"),
                   mu_solvent=float("nan")):
    """Intermediates behind a binary estimate as a dict (see
    Database.binary_explain)."""
    return db.binary_explain(a, b, method, T, P, mu_solvent)


def warning_string(bit):
    """Text of one warning bit, or None."""
    return _text(lib.mcd_warning_string(int(bit)))


def warning_strings(bits):
    """Texts of every bit set in a warning mask."""
    bits = int(bits)
    return [warning_string(1 << k) for k in range(32) if bits >> k & 1]


def _raw(fname, *args):
    out = ctypes.c_double()
    vals = [_sc(v, "argument %d" % k) for k, v in enumerate(args)]
    _check(getattr(lib, fname)(*vals, ctypes.byref(out)), fname)
    return out.value


def binary_fsg(T, P, MA, MB, VA, VB):
    """Fuller-Schettler-Giddings estimate [m^2/s] from raw parameters."""
    return _raw("mcd_binary_fsg", T, P, MA, MB, VA, VB)


def binary_chapman_enskog(T, P, MA, MB, sigA, sigB, epsA, epsB):
    """Chapman-Enskog estimate [m^2/s] from Lennard-Jones parameters."""
    return _raw("mcd_binary_chapman_enskog", T, P, MA, MB, sigA, sigB, epsA,
                epsB)


def binary_wilke_lee(T, P, MA, MB, sigA, sigB, epsA, epsB):
    """Wilke-Lee estimate [m^2/s] from Lennard-Jones parameters."""
    return _raw("mcd_binary_wilke_lee", T, P, MA, MB, sigA, sigB, epsA, epsB)


def binary_brokaw(T, P, MA, MB, dipA, dipB, VbA, VbB, TbA, TbB):
    """Chapman-Enskog with Brokaw's polar correction [m^2/s] from dipole
    moments [C m], molar volumes at the boiling point [m^3/mol] and normal
    boiling points [K] (mcd_binary_brokaw)."""
    return _raw("mcd_binary_brokaw", T, P, MA, MB, dipA, dipB, VbA, VbB, TbA,
                TbB)


def binary_wilke_chang(T, mu_solvent, M_solvent, phi, Vb_solute):
    """Wilke-Chang infinite-dilution diffusivity [m^2/s]."""
    return _raw("mcd_binary_wilke_chang", T, mu_solvent, M_solvent, phi,
                Vb_solute)


def binary_tyn_calus(T, mu_solvent, Vb_solute, Vb_solvent):
    """Tyn-Calus infinite-dilution diffusivity [m^2/s] (organic solutes)."""
    return _raw("mcd_binary_tyn_calus", T, mu_solvent, Vb_solute, Vb_solvent)


def binary_hayduk_minhas(T, mu_water, Vb_solute):
    """Hayduk-Minhas infinite-dilution diffusivity [m^2/s] in water."""
    return _raw("mcd_binary_hayduk_minhas", T, mu_water, Vb_solute)


TemperatureRange = collections.namedtuple("TemperatureRange",
                                          "T_min T_max warn")
TemperatureRange.__doc__ = """Temperature range [K] of a liquid correlation
and the warning bits (MCD_WARN_TEMPERATURE outside it) for a temperature."""


def method_temperature_range(method, T):
    """Temperature range of wilke-chang, tyn-calus or hayduk-minhas and
    the warning bits at T [K] (mcd_method_temperature_range)."""
    lo, hi, w = ctypes.c_double(), ctypes.c_double(), ctypes.c_uint()
    st = lib.mcd_method_temperature_range(coerce(Method, method, "method"),
                                          _sc(T, "T"), ctypes.byref(lo),
                                          ctypes.byref(hi), ctypes.byref(w))
    _check(st, "mcd_method_temperature_range")
    return TemperatureRange(lo.value, hi.value, w.value)


def binary_omega_d(T_star):
    """Neufeld-Janzen-Aziz diffusion collision integral Omega_D(T*)."""
    return _raw("mcd_binary_omega_d", T_star)


def binary_scale(D_ref, T_ref, P_ref, T, P, exponent=1.75):
    """D_ref (T/T_ref)^exponent (P_ref/P) [m^2/s]."""
    return _raw("mcd_binary_scale", D_ref, T_ref, P_ref, T, P, exponent)


def binary_gas(db, a, b, method, T, P):
    """Gas binary diffusivity of two species of a Database:
    BinaryEstimate(D, rel_err, warnings)."""
    return db.binary_gas(a, b, method, T, P)


def binary_liquid(db, solute, solvent, T, mu_solvent):
    """Wilke-Chang diffusivity of solute in solvent from a Database:
    BinaryEstimate(D, rel_err, warnings)."""
    return db.binary_liquid(solute, solvent, T, mu_solvent)


# ---------------------------------------------------------------------------
# Diffusion fluxes and Fick matrices
# ---------------------------------------------------------------------------

def flux_compute(Dij, c, comp, grad, *, M=None, model="maxwell-stefan",
                 comp_basis="mole", flux_basis=None, Gamma=None,
                 grad_lnP=None, kT=None, grad_lnT=None, workspace=None,
                 out=None):
    """Diffusion fluxes of all species at one state (mcd_flux_compute).

    Dij: binary diffusivities (n x n) [m^2/s]; c: total concentration
    [mol/m^3]; comp: mole or mass fractions (comp_basis); grad: their
    gradients [1/m], shape (n,) or (n, n_dim). M [kg/mol] is needed for
    the mass basis and pressure diffusion. flux_basis defaults to
    comp_basis: "mole" gives J_i [mol/(m^2 s)] relative to the
    molar-average velocity, "mass" gives j_i [kg/(m^2 s)] relative to the
    mass-average velocity. Gamma: thermodynamic factors (n x n) or None
    (ideal). grad_lnP: length n_dim or None. Thermal diffusion: kT, the
    thermal diffusion ratios (length n, see thermal_ratios), with grad_lnT
    [1/m] (length n_dim); both or neither. out: optional numpy array of
    the result's shape.
    """
    model = coerce(Model, model, "model")
    cb = coerce(Basis, comp_basis, "comp_basis")
    fb = cb if flux_basis is None else coerce(Basis, flux_basis, "flux_basis")
    x = _arrays.vector(comp, None, "comp")
    n = x.shape[0]
    D = _arrays.matrix(Dij, n, n, "Dij")
    g, nd, was_1d = _arrays.field(grad, n, "grad")
    m = _opt(M, lambda v: _arrays.vector(v, n, "M"))
    G = _opt(Gamma, lambda v: _arrays.matrix(v, n, n, "Gamma"))
    lp = _opt(grad_lnP, lambda v: _arrays.vector(
        [v] if isinstance(v, (int, float)) else v, nd, "grad_lnP"))
    kt = _opt(kT, lambda v: _arrays.vector(v, n, "kT"))
    lt = _opt(grad_lnT, lambda v: _arrays.vector(
        [v] if isinstance(v, (int, float)) else v, nd, "grad_lnT"))
    ws = _ws(workspace, n)
    o, was_1d = _field_out(n, nd, was_1d, out)
    state = mcd_state(n_species=n, n_dim=nd, comp_basis=cb, c=_sc(c, "c"),
                      M=_ptr(m), Dij=D.ptr, comp=x.ptr, grad=g.ptr,
                      Gamma=_ptr(G), grad_lnP=_ptr(lp), kT=_ptr(kt),
                      grad_lnT=_ptr(lt))
    st = lib.mcd_flux_compute(ws._p(), model, ctypes.byref(state), fb,
                              o.ptr)
    ws.check(st, "mcd_flux_compute")
    if out is not None:
        return out
    return _field_result(o, was_1d)


def _jac_state(Dij, c, comp, grad, M, Gamma, grad_lnP, kT, grad_lnT, cb,
               workspace):
    """The mcd_state of the Jacobian calls, its arrays (kept alive by the
    caller) and the workspace."""
    x = _arrays.vector(comp, None, "comp")
    n = x.shape[0]
    D = _arrays.matrix(Dij, n, n, "Dij")
    g, nd, _ = _arrays.field(grad, n, "grad")
    m = _opt(M, lambda v: _arrays.vector(v, n, "M"))
    G = _opt(Gamma, lambda v: _arrays.matrix(v, n, n, "Gamma"))
    lp = _opt(grad_lnP, lambda v: _arrays.vector(
        [v] if isinstance(v, (int, float)) else v, nd, "grad_lnP"))
    kt = _opt(kT, lambda v: _arrays.vector(v, n, "kT"))
    lt = _opt(grad_lnT, lambda v: _arrays.vector(
        [v] if isinstance(v, (int, float)) else v, nd, "grad_lnT"))
    ws = _ws(workspace, n)
    state = mcd_state(n_species=n, n_dim=nd, comp_basis=cb,
                      c=_sc(c, "c"), M=_ptr(m), Dij=D.ptr, comp=x.ptr,
                      grad=g.ptr, Gamma=_ptr(G), grad_lnP=_ptr(lp),
                      kT=_ptr(kt), grad_lnT=_ptr(lt))
    return state, (x, D, g, m, G, lp, kt, lt), ws, n, nd


def flux_jacobian(Dij, c, comp, grad, *, M=None, Gamma=None, grad_lnP=None,
                  kT=None, grad_lnT=None, model="maxwell-stefan",
                  comp_basis="mole", flux_basis=None, workspace=None):
    """Derivatives of the fluxes of flux_compute with respect to the input
    fractions at fixed gradients (mcd_flux_jacobian): shape (n, n_dim, n),
    [i][d][k] = dF_{i,d}/dy_k, [mol/(m^2 s)] (molar fluxes) or
    [kg/(m^2 s)] (mass fluxes) per unit fraction. model
    "maxwell-stefan" or "mixture-averaged"; comp_basis and flux_basis
    (default: comp_basis) as flux_compute; other arguments as
    flux_compute, grad of shape (n, n_dim). Renormalisation of the
    fractions is included: every row satisfies sum_k y_k dF/dy_k = 0."""
    mdl = coerce(Model, model, "model")
    cb = coerce(Basis, comp_basis, "comp_basis")
    fb = cb if flux_basis is None else coerce(Basis, flux_basis, "flux_basis")
    state, keep, ws, n, nd = _jac_state(Dij, c, comp, grad, M, Gamma,
                                        grad_lnP, kT, grad_lnT, cb, workspace)
    o = _arrays.Output((n, nd, n))
    st = lib.mcd_flux_jacobian(ws._p(), mdl, ctypes.byref(state), fb, o.ptr)
    ws.check(st, "mcd_flux_jacobian")
    del keep
    return o.result()


def flux_jacobian_tp(Dij, c, comp, grad, T, P, dDij_dT, dDij_dP, *, M=None,
                     Gamma=None, grad_lnP=None, kT=None, grad_lnT=None,
                     model="maxwell-stefan", comp_basis="mole",
                     flux_basis=None, workspace=None):
    """Derivatives of the fluxes with respect to T [K] and P [Pa]
    (mcd_flux_jacobian_tp): through c = P / (R T) and your dDij_dT
    [m^2/(s K)], dDij_dP [m^2/(s Pa)] (n x n; for D ~ T^1.75 / P pass
    1.75 D / T and -D / P; zeros for no dependence). Composition,
    gradients, Gamma, kT held fixed. Returns (dF_dT, dF_dP), each of shape
    (n, n_dim)."""
    mdl = coerce(Model, model, "model")
    cb = coerce(Basis, comp_basis, "comp_basis")
    fb = cb if flux_basis is None else coerce(Basis, flux_basis, "flux_basis")
    state, keep, ws, n, nd = _jac_state(Dij, c, comp, grad, M, Gamma,
                                        grad_lnP, kT, grad_lnT, cb, workspace)
    dT = _arrays.matrix(dDij_dT, n, n, "dDij_dT")
    dP = _arrays.matrix(dDij_dP, n, n, "dDij_dP")
    oT = _arrays.Output((n, nd))
    oP = _arrays.Output((n, nd))
    st = lib.mcd_flux_jacobian_tp(ws._p(), mdl, ctypes.byref(state), fb,
                                  _sc(T, "T"), _sc(P, "P"), dT.ptr, dP.ptr,
                                  oT.ptr, oP.ptr)
    ws.check(st, "mcd_flux_jacobian_tp")
    del keep
    return oT.result(), oP.result()


def thermal_ratios(Dij, c, comp, M, DT, *, comp_basis="mole",
                   workspace=None):
    """Thermal diffusion ratios k_T,i [-] from thermal diffusion
    coefficients DT [kg/(m s)] (mcd_thermal_ratios), for flux_compute's
    kT. Dij (n x n) [m^2/s], c [mol/m^3], comp (mole or mass fractions,
    comp_basis), M [kg/mol] (required). DT is first made to sum to zero
    (D_i^T -= w_i sum D^T); the result sums to zero."""
    cb = coerce(Basis, comp_basis, "comp_basis")
    x = _arrays.vector(comp, None, "comp")
    n = x.shape[0]
    D = _arrays.matrix(Dij, n, n, "Dij")
    m = _arrays.vector(M, n, "M")
    dt = _arrays.vector(DT, n, "DT")
    ws = _ws(workspace, n)
    o = _arrays.Output((n,))
    state = mcd_state(n_species=n, comp_basis=cb, c=_sc(c, "c"), M=m.ptr,
                      Dij=D.ptr, comp=x.ptr)
    st = lib.mcd_thermal_ratios(ws._p(), ctypes.byref(state), dt.ptr, o.ptr)
    ws.check(st, "mcd_thermal_ratios")
    return o.result()


def fick_matrix(Dij, comp, *, M=None, comp_basis="mole", Gamma=None,
                basis="mole", dependent=None, workspace=None, names=None):
    """Generalized Fick matrix (mcd_fick_matrix): FickMatrix(D, dependent).

    J = -c [D] grad x (basis "mole") or j = -rho [D] grad w (basis "mass"),
    over the species other than `dependent` (an index or, with names = the
    species in the order of comp, a name; None picks the most abundant).
    D is (n-1) x (n-1) [m^2/s].
    """
    cb = coerce(Basis, comp_basis, "comp_basis")
    b = coerce(Basis, basis, "basis")
    x = _arrays.vector(comp, None, "comp")
    n = x.shape[0]
    D = _arrays.matrix(Dij, n, n, "Dij")
    m = _opt(M, lambda v: _arrays.vector(v, n, "M"))
    G = _opt(Gamma, lambda v: _arrays.matrix(v, n, n, "Gamma"))
    dep = ctypes.c_size_t(ctypes.c_size_t(-1).value if dependent is None
                          else _species_index(dependent, n, names,
                                              "fick_matrix", "dependent"))
    ws = _ws(workspace, n)
    k = max(n - 1, 0)
    o = _arrays.Output((k, k))
    used = ctypes.c_size_t()
    state = mcd_state(n_species=n, comp_basis=cb, M=_ptr(m), Dij=D.ptr,
                      comp=x.ptr, Gamma=_ptr(G))
    st = lib.mcd_fick_matrix(ws._p(), ctypes.byref(state), b, dep.value,
                             o.ptr, ctypes.byref(used))
    ws.check(st, "mcd_fick_matrix")
    return FickMatrix(o.result(), used.value)


def _square(Dmat, name="D"):
    a = _arrays.as_doubles(Dmat, name)
    if a.ndim == 2 and a.shape[0] == a.shape[1]:
        return a, a.shape[0]
    if a.ndim == 1:
        m = math.isqrt(a.size)
        if m * m == a.size:
            return a, m
    if a.ndim == 0:
        return a, 1
    raise ValueError("%s: expected a square matrix, got shape %s"
                     % (name, a.shape))


def fick_fluxes(D, dependent, conc, grad):
    """Fluxes from a Fick matrix (mcd_fick_fluxes): for i != dependent
    F_i = -conc sum_j D_ij grad_j, F_dependent = -(sum of the others).
    conc is c (molar fluxes) or rho (mass fluxes); grad has n = m + 1
    rows (the dependent row is ignored)."""
    a, k = _square(D, "D")
    n = k + 1
    g, nd, was_1d = _arrays.field(grad, n, "grad")
    o = _arrays.Output((n, nd))
    st = lib.mcd_fick_fluxes(n, nd, a.ptr, int(dependent), _sc(conc, "conc"),
                             g.ptr, o.ptr)
    _check(st, "mcd_fick_fluxes")
    return _field_result(o, was_1d)


def fick_eigenvalues(D, *, workspace=None):
    """Eigenvalues of a Fick matrix (LAPACK dgeev), sorted by decreasing
    real part: a complex numpy array, or a list of complex without numpy."""
    a, k = _square(D, "D")
    ws = _ws(workspace, k + 1)
    re = _arrays.Output((k,))
    im = _arrays.Output((k,))
    st = lib.mcd_fick_eigenvalues(ws._p(), k, a.ptr, re.ptr, im.ptr)
    ws.check(st, "mcd_fick_eigenvalues")
    r, i = re.result(), im.result()
    if np is not None:
        return r + 1j * i
    return [complex(u, v) for u, v in zip(r, i)]


# ---------------------------------------------------------------------------
# Bases, frames and total fluxes
# ---------------------------------------------------------------------------

def flux_convert(M, x, flux, from_basis, to_basis):
    """Convert diffusion fluxes between the molar (J) and mass (j) bases
    and their frames. x: mole fractions."""
    fb = coerce(Basis, from_basis, "from_basis")
    tb = coerce(Basis, to_basis, "to_basis")
    xa = _arrays.vector(x, None, "x")
    n = xa.shape[0]
    m = _arrays.vector(M, n, "M")
    f, nd, was_1d = _arrays.field(flux, n, "flux")
    o = _arrays.Output((n, nd))
    st = lib.mcd_flux_convert(n, nd, m.ptr, xa.ptr, fb, f.ptr, tb, o.ptr)
    _check(st, "mcd_flux_convert")
    return _field_result(o, was_1d)


def flux_to_volume_frame(c, x, Vbar, J):
    """Molar fluxes relative to the volume-average velocity.
    Vbar: partial molar volumes [m^3/mol] (ideal gas: 1/c each)."""
    xa = _arrays.vector(x, None, "x")
    n = xa.shape[0]
    v = _arrays.vector(Vbar, n, "Vbar")
    f, nd, was_1d = _arrays.field(J, n, "J")
    o = _arrays.Output((n, nd))
    st = lib.mcd_flux_to_volume_frame(n, nd, _sc(c, "c"), xa.ptr, v.ptr,
                                      f.ptr, o.ptr)
    _check(st, "mcd_flux_to_volume_frame")
    return _field_result(o, was_1d)


def flux_to_species_frame(x, J, k):
    """Molar fluxes relative to the velocity of species k (x_k > 0)."""
    xa = _arrays.vector(x, None, "x")
    n = xa.shape[0]
    f, nd, was_1d = _arrays.field(J, n, "J")
    o = _arrays.Output((n, nd))
    st = lib.mcd_flux_to_species_frame(n, nd, xa.ptr, f.ptr, int(k), o.ptr)
    _check(st, "mcd_flux_to_species_frame", "k = %d" % int(k))
    return _field_result(o, was_1d)


def flux_total(comp, diff, bootstrap, *, species=0, values=None,
               basis="mole", names=None):
    """Total fluxes N_i = J_i + x_i N_t (basis "mole") or
    n_i = j_i + w_i n_t ("mass") under a bootstrap condition:
    "total" (values = N_t per direction), "stagnant" (species does not
    move), "equimolar", "weights" (values = nu, length n). species: an
    index or, with names (the species in the order of comp), a name.
    Returns TotalFlux(total, bulk)."""
    b = coerce(Basis, basis, "basis")
    kind = coerce(Bootstrap, bootstrap, "bootstrap")
    y = _arrays.vector(comp, None, "comp")
    n = y.shape[0]
    f, nd, was_1d = _arrays.field(diff, n, "diff")
    vals = None
    if values is not None:
        if isinstance(values, (int, float)):
            values = [values]
        want = n if kind == Bootstrap.WEIGHTS else (
            nd if kind == Bootstrap.TOTAL else None)
        vals = _arrays.vector(values, want, "values")
    o = _arrays.Output((n, nd))
    bulk = _arrays.Output((nd,))
    species = _species_index(species, n, names, "flux_total")
    st = lib.mcd_flux_total(n, nd, b, y.ptr, f.ptr, kind, species,
                            _ptr(vals), o.ptr, bulk.ptr)
    _check(st, "mcd_flux_total", "bootstrap %s" % kind.name.lower())
    bk = bulk.result()
    return TotalFlux(_field_result(o, was_1d),
                     float(bk[0]) if was_1d else bk)


def flux_velocity_difference(M, c, x, J):
    """v - u [m/s], mass- minus molar-average velocity (float for 1-D J,
    else length n_dim)."""
    xa = _arrays.vector(x, None, "x")
    n = xa.shape[0]
    m = _arrays.vector(M, n, "M")
    f, nd, was_1d = _arrays.field(J, n, "J")
    o = _arrays.Output((nd,))
    st = lib.mcd_flux_velocity_difference(n, nd, m.ptr, _sc(c, "c"), xa.ptr,
                                     f.ptr, o.ptr)
    _check(st, "mcd_flux_velocity_difference")
    r = o.result()
    return float(r[0]) if was_1d else r


def flux_project(flux, weights=None, *, inplace=False):
    """Project fluxes onto the zero-sum: F_i -= a_i sum_k F_k with
    a = weights / sum(weights), or 1/n when weights is None.
    Returns ProjectedFlux(flux, residual). With inplace=True, flux must be
    a C-contiguous writeable float64 numpy array or an array.array('d') of
    one direction, which is changed and returned."""
    if inplace:
        f = _arrays.as_doubles(flux, "flux")
        if f.copied:
            raise TypeError("flux_project(inplace=True) needs a C-contiguous "
                            "float64 numpy array or an array.array('d')")
        if np is not None and isinstance(flux, np.ndarray) and \
                not flux.flags["WRITEABLE"]:
            raise ValueError("flux: read-only array")
        n = f.shape[0] if f.ndim >= 1 else 0
        if f.ndim == 1:
            nd, was_1d = 1, True
        elif f.ndim == 2:
            nd, was_1d = f.shape[1], False
        else:
            raise ValueError("flux: expected shape (n,) or (n, n_dim)")
        target = flux
    else:
        src = _arrays.as_doubles(flux, "flux")
        if src.ndim == 1:
            n, nd, was_1d = src.shape[0], 1, True
        elif src.ndim == 2:
            n, nd, was_1d = src.shape[0], src.shape[1], False
        else:
            raise ValueError("flux: expected shape (n,) or (n, n_dim)")
        o = _arrays.Output((n, nd))
        ctypes.memmove(o.ptr, src.ptr, 8 * n * nd)
        f = o
    w = _opt(weights, lambda v: _arrays.vector(v, n, "weights"))
    res = _arrays.Output((nd,))
    st = lib.mcd_flux_project(n, nd, _ptr(w), f.ptr, res.ptr)
    _check(st, "mcd_flux_project")
    r = res.result()
    resid = float(r[0]) if was_1d else r
    if inplace:
        return ProjectedFlux(target, resid)
    return ProjectedFlux(_field_result(f, was_1d), resid)


def flux_diagnose(grad, flux, rel_tol=1e-3):
    """Coupling flags per species: a list of Diag (REVERSE, OSMOTIC,
    BARRIER or none)."""
    g = _arrays.as_doubles(grad, "grad")
    n = g.shape[0] if g.ndim else 0
    g, nd, _ = _arrays.field(grad, n, "grad")
    f = _arrays.field(flux, n, "flux")
    if f[1] != nd:
        raise ValueError("flux: %d directions, grad has %d" % (f[1], nd))
    flags = (ctypes.c_uint * max(n, 1))()
    st = lib.mcd_flux_diagnose(n, nd, g.ptr, f[0].ptr, _sc(rel_tol, "rel_tol"),
                               flags)
    _check(st, "mcd_flux_diagnose")
    return [Diag(flags[i]) for i in range(n)]


# ---------------------------------------------------------------------------
# Batched fluxes
# ---------------------------------------------------------------------------

def _per_cell(v, K, name):
    """A length-K vector; a scalar is repeated K times."""
    if isinstance(v, (int, float)):
        v = [float(v)] * K
    return _arrays.vector(v, K, name)


def _batch_fields(N, K, comp, grad, grad_lnP, layout):
    """Validate batched comp/grad/grad_lnP; returns (comp, grad, n_dim,
    grad_lnP or None)."""
    a = _arrays.as_doubles(comp, "comp")
    want = (N, K) if layout == "soa" else (K, N)
    if not (a.shape == want or (a.ndim == 1 and a.size == N * K)):
        raise ValueError("comp: expected shape %s (layout %r), got %s"
                         % (want, layout, a.shape))
    g = _arrays.as_doubles(grad, "grad")
    if N * K == 0:
        nd = g.shape[-2] if (layout == "soa" and g.ndim == 3) else (
            g.shape[-1] if g.ndim == 3 else 1)
    else:
        nd, rem = divmod(g.size, N * K)
        if rem or not 1 <= nd <= 3:
            raise ValueError("grad: size %d is not N K n_dim with N = %d, "
                             "K = %d, n_dim 1..3" % (g.size, N, K))
    ok = {1: [(N, K) if layout == "soa" else (K, N)]}
    full = (N, nd, K) if layout == "soa" else (K, N, nd)
    if not (g.ndim == 1 or g.shape == full or g.shape in ok.get(nd, [])):
        raise ValueError("grad: expected shape %s%s (layout %r), got %s"
                         % (full, " or %s" % (ok[1][0],) if nd == 1 else "",
                            layout, g.shape))
    lp = None
    if grad_lnP is not None:
        lp = _arrays.as_doubles(grad_lnP, "grad_lnP")
        if lp.size != nd * K:
            raise ValueError("grad_lnP: expected %d values (n_dim x K), got "
                             "%d" % (nd * K, lp.size))
    return a, g, nd, lp


def _batch_thermal(N, K, nd, kT, grad_lnT):
    """Batched kT (N x K values) and grad_lnT (n_dim x K) or None."""
    kt = lt = None
    if kT is not None:
        kt = _arrays.as_doubles(kT, "kT")
        if kt.size != N * K:
            raise ValueError("kT: expected %d values (N x K), got %d"
                             % (N * K, kt.size))
    if grad_lnT is not None:
        lt = _arrays.as_doubles(grad_lnT, "grad_lnT")
        if lt.size != nd * K:
            raise ValueError("grad_lnT: expected %d values (n_dim x K), got "
                             "%d" % (nd * K, lt.size))
    return kt, lt


def flux_batch(mixture, T, P, comp, grad, *, model="maxwell-stefan",
               comp_basis="mole", flux_basis=None, grad_lnP=None, kT=None,
               grad_lnT=None, layout="soa", workspace=None, out=None):
    """Diffusion fluxes of a Mixture at many states (cells) in one call
    (mcd_flux_batch, or mcd_flux_batch_aos with layout="aos").

    layout "soa" (cells last, the fast one): comp (N, K), grad (N, n_dim,
    K) or (N, K) for one direction, grad_lnP (n_dim, K) or (K,).
    layout "aos" (cells first): comp (K, N), grad (K, N, n_dim) or (K, N),
    grad_lnP (K, n_dim) or (K,). T [K] and P [Pa]: length K or scalars.
    Thermal diffusion: kT (N, K) for "soa", (K, N) for "aos", with
    grad_lnT laid out as grad_lnP; both or neither.
    The result has the shape of grad. model may also be "iterative"
    (settings: Workspace.set_iterative).
    """
    from .handles import Mixture
    if not isinstance(mixture, Mixture):
        raise TypeError("mixture must be an mcdiff.Mixture")
    if layout not in ("soa", "aos"):
        raise ValueError("layout must be 'soa' or 'aos'")
    mdl = coerce(Model, model, "model")
    cb = coerce(Basis, comp_basis, "comp_basis")
    fb = cb if flux_basis is None else coerce(Basis, flux_basis, "flux_basis")
    N = len(mixture)
    if isinstance(T, (int, float)) and isinstance(P, (int, float)):
        a = _arrays.as_doubles(comp, "comp")
        if a.ndim == 2:
            K = a.shape[1] if layout == "soa" else a.shape[0]
        else:
            K = a.size // N if N else 0
    else:
        K = len(T) if not isinstance(T, (int, float)) else len(P)
    Ta = _per_cell(T, K, "T")
    Pa = _per_cell(P, K, "P")
    a, g, nd, lp = _batch_fields(N, K, comp, grad, grad_lnP, layout)
    kt, lt = _batch_thermal(N, K, nd, kT, grad_lnT)
    ws = _ws(workspace, N)
    o = _arrays.Output(g.shape, out)
    fname = "mcd_flux_batch" if layout == "soa" else "mcd_flux_batch_aos"
    cells = mcd_cells(n_cells=K, n_dim=nd, comp_basis=cb, comp=a.ptr,
                      grad=g.ptr, grad_lnP=_ptr(lp), kT=_ptr(kt),
                      grad_lnT=_ptr(lt))
    st = getattr(lib, fname)(ws._p(), mixture._p(), mdl, Ta.ptr, Pa.ptr,
                             ctypes.byref(cells), fb, o.ptr)
    ws.check(st, fname)
    return out if out is not None else o.result()


def _dij_call(Dij, c, comp, grad, M, model, comp_basis, flux_basis,
              grad_lnP, kT, grad_lnT, workspace):
    """The arguments of a batched call with per-cell Dij, checked and
    converted: (model, flux basis, N, K, n_dim, M, Dij, c, workspace,
    grad array, the mcd_cells)."""
    mdl = coerce(Model, model, "model")
    cb = coerce(Basis, comp_basis, "comp_basis")
    fb = cb if flux_basis is None else coerce(Basis, flux_basis, "flux_basis")
    ca = _arrays.vector([c] if isinstance(c, (int, float)) else c, None, "c")
    K = ca.shape[0]
    a0 = _arrays.as_doubles(comp, "comp")
    if a0.ndim == 2:
        N = a0.shape[0]
    elif K:
        N = a0.size // K
    else:
        raise ValueError("comp: give shape (N, K) when K = 0")
    D = _arrays.as_doubles(Dij, "Dij")
    if not (D.shape == (N, N, K) or (D.ndim == 1 and D.size == N * N * K)):
        raise ValueError("Dij: expected shape %s, got %s"
                         % ((N, N, K), D.shape))
    a, g, nd, lp = _batch_fields(N, K, a0, grad, grad_lnP, "soa")
    kt, lt = _batch_thermal(N, K, nd, kT, grad_lnT)
    m = _opt(M, lambda v: _arrays.vector(v, N, "M"))
    ws = _ws(workspace, N)
    cells = mcd_cells(n_cells=K, n_dim=nd, comp_basis=cb, comp=a.ptr,
                      grad=g.ptr, grad_lnP=_ptr(lp), kT=_ptr(kt),
                      grad_lnT=_ptr(lt))
    # the arrays the cells point into stay alive with the tuple
    return mdl, fb, N, K, nd, m, D, ca, ws, g, cells, (a, lp, kt, lt)


def flux_batch_dij(Dij, c, comp, grad, *, M=None, model="maxwell-stefan",
                   comp_basis="mole", flux_basis=None, grad_lnP=None,
                   kT=None, grad_lnT=None, workspace=None, out=None):
    """Batched fluxes with your own per-cell binary diffusivities
    (mcd_flux_batch_dij, cells last): Dij (N, N, K) [m^2/s], c (K,)
    [mol/m^3], comp (N, K), grad (N, n_dim, K) or (N, K), grad_lnP
    (n_dim, K) or (K,). M (N,) [kg/mol] for the mass basis or pressure
    diffusion. Thermal diffusion: kT (N, K) with grad_lnT (n_dim, K).
    The result has the shape of grad."""
    mdl, fb, N, K, nd, m, D, ca, ws, g, cells, _keep = _dij_call(
        Dij, c, comp, grad, M, model, comp_basis, flux_basis, grad_lnP, kT,
        grad_lnT, workspace)
    o = _arrays.Output(g.shape, out)
    st = lib.mcd_flux_batch_dij(ws._p(), mdl, N, _ptr(m), D.ptr, ca.ptr,
                                ctypes.byref(cells), fb, o.ptr)
    ws.check(st, "mcd_flux_batch_dij")
    return out if out is not None else o.result()


def to_tiles(a, fill=0.0):
    """An array with the cells last, shape (..., K) as flux_batch_dij
    takes them, in tiles of 8 cells (the C layout MCD_LAYOUT_TILED8):
    shape (ceil(K/8), ..., 8), t[k // 8, ..., k % 8] = a[..., k]; the
    slots of the padding cells hold `fill`. Needs numpy."""
    if np is None:
        raise RuntimeError("to_tiles needs numpy")
    a = np.asarray(a, dtype=np.float64)
    K = a.shape[-1]
    p = np.full(a.shape[:-1] + ((K + 7) // 8 * 8,), fill, dtype=np.float64)
    p[..., :K] = a
    p = p.reshape(a.shape[:-1] + ((K + 7) // 8, 8))
    return np.ascontiguousarray(np.moveaxis(p, -2, 0))


def from_tiles(t, n_cells):
    """The inverse of to_tiles: tiles (T, ..., 8) back to (..., n_cells)."""
    if np is None:
        raise RuntimeError("from_tiles needs numpy")
    t = np.asarray(t, dtype=np.float64)
    T = t.shape[0] if t.ndim >= 2 else 0
    if not 8 * (T - 1) < n_cells <= 8 * T or t.shape[-1] != 8:
        raise ValueError("from_tiles: shape %s does not hold %d cells in "
                         "tiles of 8" % (t.shape, n_cells))
    a = np.moveaxis(t, 0, -2)
    a = a.reshape(a.shape[:-2] + (-1,))
    return np.ascontiguousarray(a[..., :n_cells])


def _tiled_arg(v, shape, name):
    """A tiled input of the given shape (or None), C-contiguous float64."""
    if v is None:
        return None
    a = np.ascontiguousarray(v, dtype=np.float64)
    if a.shape != shape:
        raise ValueError("%s: expected tiled shape %s, got %s"
                         % (name, shape, a.shape))
    return a


def flux_batch_dij_tiled(Dij, c, comp, grad, *, M=None,
                         model="maxwell-stefan", comp_basis="mole",
                         flux_basis=None, grad_lnP=None, kT=None,
                         grad_lnT=None, workspace=None, out=None):
    """flux_batch_dij with every per-cell array in tiles of 8 cells
    (mcd_cells.layout = MCD_LAYOUT_TILED8; faster from N = 7 on, see
    mcdiff.h): with T = ceil(K/8) tiles, Dij (T, N, N, 8), comp (T, N, 8),
    grad (T, N, n_dim, 8), grad_lnP and grad_lnT (T, n_dim, 8), kT
    (T, N, 8); c (K,) as in flux_batch_dij (one row: the same in both
    layouts). Returns the fluxes in tiles, (T, N, n_dim, 8); the padding
    slots of the last tile are not written (0 unless `out` is given).
    to_tiles and from_tiles convert. Needs numpy."""
    if np is None:
        raise RuntimeError("flux_batch_dij_tiled needs numpy")
    mdl = coerce(Model, model, "model")
    cb = coerce(Basis, comp_basis, "comp_basis")
    fb = cb if flux_basis is None else coerce(Basis, flux_basis, "flux_basis")
    ca = _arrays.vector([c] if isinstance(c, (int, float)) else c, None, "c")
    K = ca.shape[0]
    T = (K + 7) // 8
    g = np.ascontiguousarray(grad, dtype=np.float64)
    if g.ndim != 4 or g.shape[0] != T or g.shape[-1] != 8:
        raise ValueError("grad: expected tiled shape (%d, N, n_dim, 8), got "
                         "%s" % (T, g.shape))
    N, nd = g.shape[1], g.shape[2]
    D = _tiled_arg(Dij, (T, N, N, 8), "Dij")
    a = _tiled_arg(comp, (T, N, 8), "comp")
    lp = _tiled_arg(grad_lnP, (T, nd, 8), "grad_lnP")
    kt = _tiled_arg(kT, (T, N, 8), "kT")
    lt = _tiled_arg(grad_lnT, (T, nd, 8), "grad_lnT")
    m = _opt(M, lambda v: _arrays.vector(v, N, "M"))
    ws = _ws(workspace, N)

    def ptr(v):
        return None if v is None else v.ctypes.data_as(
            ctypes.POINTER(ctypes.c_double))
    if out is None:
        out = np.zeros((T, N, nd, 8))
    o = _arrays.Output((T, N, nd, 8), out)
    cells = mcd_cells(n_cells=K, n_dim=nd, comp_basis=cb, comp=ptr(a),
                      grad=ptr(g), grad_lnP=ptr(lp), kT=ptr(kt),
                      grad_lnT=ptr(lt), layout=1)  # MCD_LAYOUT_TILED8
    st = lib.mcd_flux_batch_dij(ws._p(), mdl, N, _ptr(m), ptr(D), ca.ptr,
                                ctypes.byref(cells), fb, o.ptr)
    ws.check(st, "mcd_flux_batch_dij")
    return out


def flux_batch_jacobian(Dij, c, comp, grad, *, M=None,
                        model="maxwell-stefan", comp_basis="mole",
                        flux_basis=None, grad_lnP=None, kT=None,
                        grad_lnT=None, workspace=None):
    """Batched fluxes and composition Jacobians with your own per-cell
    binary diffusivities (mcd_flux_batch_jacobian, cells last; arguments
    as flux_batch_dij, grad of shape (N, n_dim, K)). Returns (flux, jac):
    flux of shape (N, n_dim, K), jac of shape (N, n_dim, N, K) with
    jac[i, d, k, cell] = dF_{i,d}/dy_k of that cell (flux_jacobian)."""
    mdl, fb, N, K, nd, m, D, ca, ws, g, cells, _keep = _dij_call(
        Dij, c, comp, grad, M, model, comp_basis, flux_basis, grad_lnP, kT,
        grad_lnT, workspace)
    o = _arrays.Output((N, nd, K))
    oj = _arrays.Output((N, nd, N, K))
    st = lib.mcd_flux_batch_jacobian(ws._p(), mdl, N, _ptr(m), D.ptr, ca.ptr,
                                     ctypes.byref(cells), fb, o.ptr, oj.ptr)
    ws.check(st, "mcd_flux_batch_jacobian")
    return o.result(), oj.result()


def liquid_flux_batch(liquid, T, c, comp, grad, *, M=None, Vbar=None,
                      model="maxwell-stefan", comp_basis="mole",
                      flux_basis=None, kT=None, grad_lnT=None,
                      workspace=None, out=None):
    """Diffusion fluxes of a Liquid at many cells (mcd_liquid_flux_batch,
    cells last): at each cell Gamma and the Vignes / Kooijman-Taylor Dij
    of the liquid at (T, x), then the Maxwell-Stefan (or
    mixture-averaged) fluxes. T [K] and c [mol/m^3]: length K or
    scalars; comp (N, K); grad (N, n_dim, K) or (N, K); M (N,) [kg/mol]
    for the mass basis; Vbar (N, K) partial molar volumes [m^3/mol] for
    fluxes relative to the volume-average velocity (c sum x_i Vbar_i = 1
    in each cell); thermal diffusion: kT (N, K) with grad_lnT (n_dim, K).
    Returns LiquidFluxes(flux of the shape of grad, Warning flags).
    A cell where the liquid splits raises DomainError naming the cell."""
    from .handles import Liquid
    if not isinstance(liquid, Liquid):
        raise TypeError("liquid must be an mcdiff.Liquid")
    mdl = coerce(Model, model, "model")
    cb = coerce(Basis, comp_basis, "comp_basis")
    fb = cb if flux_basis is None else coerce(Basis, flux_basis, "flux_basis")
    N = len(liquid)
    a0 = _arrays.as_doubles(comp, "comp")
    if a0.ndim == 2:
        K = a0.shape[1]
    else:
        K = a0.size // N if N else 0
    Ta = _per_cell(T, K, "T")
    ca = _per_cell(c, K, "c")
    a, g, nd, _lp = _batch_fields(N, K, a0, grad, None, "soa")
    kt, lt = _batch_thermal(N, K, nd, kT, grad_lnT)
    m = _opt(M, lambda v: _arrays.vector(v, N, "M"))
    V = None
    if Vbar is not None:
        V = _arrays.as_doubles(Vbar, "Vbar")
        if not (V.shape == (N, K) or (V.ndim == 1 and V.size == N * K)):
            raise ValueError("Vbar: expected shape %s, got %s"
                             % ((N, K), V.shape))
    ws = _ws(workspace, N)
    o = _arrays.Output(g.shape, out)
    w = ctypes.c_uint()
    cells = mcd_cells(n_cells=K, n_dim=nd, comp_basis=cb, comp=a.ptr,
                      grad=g.ptr, kT=_ptr(kt), grad_lnT=_ptr(lt))
    st = lib.mcd_liquid_flux_batch(ws._p(), liquid._p(), mdl, Ta.ptr, ca.ptr,
                                   _ptr(m), _ptr(V), ctypes.byref(cells), fb,
                                   o.ptr, ctypes.byref(w))
    ws.check(st, "mcd_liquid_flux_batch")
    return LiquidFluxes(out if out is not None else o.result(),
                        Warning(w.value))


# ---------------------------------------------------------------------------
# Mass transfer: film, two-bulb cell
# ---------------------------------------------------------------------------

def film_solve(Dij, c, L, x0, xL, bootstrap="stagnant", *, species=None,
               values=None, method="exact", workspace=None, names=None):
    """Steady fluxes through a film / Stefan tube (mcd_film_solve).

    bootstrap: "stagnant" (species = the species that does not move),
    "equimolar", "weights" (values = nu), "total" (values = N_t) or
    "ratios" (values = z, species = the species whose end composition is
    matched). species is an index 0..n-1 or, when names (the species in
    the order of x0) is given, a name. method: "exact" (Krishna-Standart)
    or "linearized".
    Returns FilmResult(N, iterations, residual).
    """
    kind = coerce(FilmBootstrap, bootstrap, "bootstrap")
    meth = coerce(FilmMethod, method, "method")
    a0 = _arrays.vector(x0, None, "x0")
    n = a0.shape[0]
    aL = _arrays.vector(xL, n, "xL")
    D = _arrays.matrix(Dij, n, n, "Dij")
    if species is None:
        if kind in (FilmBootstrap.STAGNANT, FilmBootstrap.RATIOS):
            raise ValueError("film_solve: bootstrap %r needs species="
                             % kind.name.lower())
        species = 0
    species = _species_index(species, n, names, "film_solve")
    vals = None
    if values is not None:
        if isinstance(values, (int, float)):
            values = [values]
        vals = _arrays.vector(values, 1 if kind == FilmBootstrap.TOTAL else n,
                              "values")
    ws = _ws(workspace, n)
    o = _arrays.Output((n,))
    it = ctypes.c_size_t()
    res = ctypes.c_double()
    film = mcd_film(n_species=n, c=_sc(c, "c"), L=_sc(L, "L"), Dij=D.ptr,
                    x0=a0.ptr, xL=aL.ptr)
    st = lib.mcd_film_solve(ws._p(), ctypes.byref(film), kind, species,
                            _ptr(vals), meth, o.ptr, ctypes.byref(it),
                            ctypes.byref(res))
    ws.check(st, "mcd_film_solve")
    return FilmResult(o.result(), it.value, res.value)


def film_profile(Dij, c, L, x0, N, z, *, workspace=None):
    """Composition profile x(z) of a steady film for fluxes N: an
    (n_points x n) array, one row per position z [m] in [0, L]."""
    a0 = _arrays.vector(x0, None, "x0")
    n = a0.shape[0]
    D = _arrays.matrix(Dij, n, n, "Dij")
    fl = _arrays.vector(N, n, "N")
    if isinstance(z, (int, float)):
        z = [z]
    zz = _arrays.vector(z, None, "z")
    npt = zz.shape[0]
    ws = _ws(workspace, n)
    o = _arrays.Output((npt, n))
    film = mcd_film(n_species=n, c=_sc(c, "c"), L=_sc(L, "L"), Dij=D.ptr,
                    x0=a0.ptr)
    st = lib.mcd_film_profile(ws._p(), ctypes.byref(film), fl.ptr, npt,
                              zz.ptr, o.ptr)
    ws.check(st, "mcd_film_profile")
    return o.result()


def _bulbs(fname, Dij, c, V1, V2, A, L, x1_0, x2_0, t, extra, workspace):
    a1 = _arrays.vector(x1_0, None, "x1_0")
    n = a1.shape[0]
    a2 = _arrays.vector(x2_0, n, "x2_0")
    D = _arrays.matrix(Dij, n, n, "Dij")
    if isinstance(t, (int, float)):
        t = [t]
    tt = _arrays.vector(t, None, "t")
    nt = tt.shape[0]
    ws = _ws(workspace, n)
    o1 = _arrays.Output((nt, n))
    o2 = _arrays.Output((nt, n))
    cell = mcd_bulbs(n_species=n, c=_sc(c, "c"), V1=_sc(V1, "V1"),
                     V2=_sc(V2, "V2"), A=_sc(A, "A"), L=_sc(L, "L"),
                     Dij=D.ptr, x1_0=a1.ptr, x2_0=a2.ptr)
    args = [ws._p(), ctypes.byref(cell), nt, tt.ptr]
    args += extra + [o1.ptr, o2.ptr]
    ws.check(getattr(lib, fname)(*args), fname)
    return BulbsResult(o1.result(), o2.result())


def bulbs_linearized(Dij, c, V1, V2, A, L, x1_0, x2_0, t, *,
                     workspace=None):
    """Two-bulb compositions by the linearized theory at times t [s]:
    BulbsResult(x1, x2), each n_times x n."""
    return _bulbs("mcd_bulbs_linearized", Dij, c, V1, V2, A, L, x1_0, x2_0,
                  t, [], workspace)


def bulbs_integrate(Dij, c, V1, V2, A, L, x1_0, x2_0, t, rel_tol=1e-8, *,
                    workspace=None):
    """Two-bulb compositions by time integration with the exact film flux
    (Dormand-Prince 5(4)), at non-decreasing times t [s]."""
    return _bulbs("mcd_bulbs_integrate", Dij, c, V1, V2, A, L, x1_0, x2_0,
                  t, [_sc(rel_tol, "rel_tol")], workspace)



# ---------------------------------------------------------------------------
# Gas viscosity
# ---------------------------------------------------------------------------

ViscosityEstimate = collections.namedtuple("ViscosityEstimate",
                                           "mu rel_err warnings")
ViscosityEstimate.__doc__ = """A pure-gas viscosity estimate: mu [Pa s], the
method's typical relative error [-] and its Warning flags."""


def viscosity_omega22(T_star):
    """Neufeld-Janzen-Aziz collision integral Omega(2,2)*(T*) for
    viscosity (mcd_viscosity_omega22)."""
    return _raw("mcd_viscosity_omega22", T_star)


def viscosity_chapman_enskog(T, M, sigma, eps_k):
    """Pure-gas viscosity [Pa s] by Chapman-Enskog: T [K], M [kg/mol],
    Lennard-Jones sigma [m] and epsilon/k [K]."""
    return _raw("mcd_viscosity_chapman_enskog", T, M, sigma, eps_k)


def viscosity_wilke(M, mu, x):
    """Mixture viscosity [Pa s] by Wilke's rule from molar masses M
    [kg/mol], species viscosities mu [Pa s] and mole fractions x."""
    m = _arrays.vector(M, None, "M")
    n = m.shape[0]
    v = _arrays.vector(mu, n, "mu")
    xx = _arrays.vector(x, n, "x")
    out = ctypes.c_double()
    _check(lib.mcd_viscosity_wilke(n, m.ptr, v.ptr, xx.ptr,
                                   ctypes.byref(out)), "mcd_viscosity_wilke")
    return out.value


def viscosity_gas(db, species, T):
    """Viscosity of one species of a Database at T [K] by Chapman-Enskog
    (mcd_db_viscosity_gas): ViscosityEstimate(mu, rel_err, warnings)."""
    mu, rel, warn = ctypes.c_double(), ctypes.c_double(), ctypes.c_uint()
    st = lib.mcd_db_viscosity_gas(db._p(), db.index(species), _sc(T, "T"),
                                  ctypes.byref(mu), ctypes.byref(rel),
                                  ctypes.byref(warn))
    _check(st, "mcd_db_viscosity_gas")
    return ViscosityEstimate(mu.value, rel.value, Warning(warn.value))


def mixture_viscosities(mix, T):
    """Viscosities [Pa s] of every species of a Mixture at T [K]
    (mcd_mixture_viscosities); pass them to viscosity_wilke."""
    n = len(mix)
    o = _arrays.Output((n,))
    _check(lib.mcd_mixture_viscosities(mix._p(), _sc(T, "T"), o.ptr, None),
           "mcd_mixture_viscosities")
    return o.result()


# ---------------------------------------------------------------------------
# Thermal diffusion from kinetic theory
# ---------------------------------------------------------------------------
# Thermal diffusion estimates are far less accurate than diffusivities
# (MCD_THERMAL_CE_TYPICAL_ERROR, 20 % at best for non-polar pairs).

THERMAL_CE_TYPICAL_ERROR = 0.2  # MCD_THERMAL_CE_TYPICAL_ERROR (mcdiff.h)

CollisionIntegrals = collections.namedtuple(
    "CollisionIntegrals", "omega11 omega12 omega13 omega22 A B C")
CollisionIntegrals.__doc__ = """Lennard-Jones reduced collision integrals
Omega(1,1)*, Omega(1,2)*, Omega(1,3)*, Omega(2,2)* and the ratios A*, B*,
C* at one reduced temperature."""
ThermalEstimate = collections.namedtuple("ThermalEstimate",
                                         "alpha rel_err warnings")
ThermalEstimate.__doc__ = """A binary thermal diffusion factor alpha_T [-]
(> 0 when the first species goes to the cold side), the method's typical
relative error [-] (widened by the warnings as diffusivity errors are, for
thermal_factor) and its Warning flags."""
ThermalRatios = collections.namedtuple("ThermalRatios",
                                       "kT theta rel_err warnings")
ThermalRatios.__doc__ = """Thermal diffusion ratios k_T,i [-] of a mixture
(for flux_compute's kT), theta_i = k_T,i / x_i (for dufour_heat_flux), the
typical relative error (widened by the warnings) and the OR of the pairs'
Warning flags."""


def lj_collision_integrals(T_star):
    """Lennard-Jones collision integrals and A*, B*, C* at T* in 0.3..100
    (mcd_lj_collision_integrals): CollisionIntegrals."""
    o, r = (ctypes.c_double * 4)(), (ctypes.c_double * 3)()
    _check(lib.mcd_lj_collision_integrals(_sc(T_star, "T_star"), o, r),
           "mcd_lj_collision_integrals")
    return CollisionIntegrals(*(list(o) + list(r)))


def thermal_factor_kinetic(M1, M2, x1, A, B, C, R1, R2):
    """Binary thermal diffusion factor alpha_T [-] in the first
    Chapman-Enskog approximation from given collision quantities
    (mcd_thermal_factor_kinetic)."""
    return _raw("mcd_thermal_factor_kinetic", M1, M2, x1, A, B, C, R1, R2)


def thermal_factor_ce(T, M1, M2, sig1, sig2, eps1, eps2, x1):
    """Binary thermal diffusion factor alpha_T [-] of two Lennard-Jones
    gases (mcd_thermal_factor_ce): ThermalEstimate (rel_err is the stated
    MCD_THERMAL_CE_TYPICAL_ERROR, not widened by the warnings: the raw
    call has no species to judge; thermal_factor widens it)."""
    out, warn = ctypes.c_double(), ctypes.c_uint()
    vals = [_sc(v, "argument %d" % k)
            for k, v in enumerate((T, M1, M2, sig1, sig2, eps1, eps2, x1))]
    _check(lib.mcd_thermal_factor_ce(*vals, ctypes.byref(out),
                                     ctypes.byref(warn)),
           "mcd_thermal_factor_ce")
    return ThermalEstimate(out.value, THERMAL_CE_TYPICAL_ERROR,
                           Warning(warn.value))


def thermal_factor(db, a, b, T, x_a):
    """Thermal diffusion factor of species a and b of a Database at T [K]
    and mole fraction x_a of a (mcd_db_thermal_factor): ThermalEstimate."""
    out, rel, warn = ctypes.c_double(), ctypes.c_double(), ctypes.c_uint()
    st = lib.mcd_db_thermal_factor(db._p(), db.index(a), db.index(b),
                                   _sc(T, "T"), _sc(x_a, "x_a"),
                                   ctypes.byref(out), ctypes.byref(rel),
                                   ctypes.byref(warn))
    _check(st, "mcd_db_thermal_factor")
    return ThermalEstimate(out.value, rel.value, Warning(warn.value))


def mixture_thermal_ratios(mix, T, x):
    """Pairwise thermal diffusion ratios of a Mixture at T [K] and mole
    fractions x (mcd_mixture_thermal_ratios): ThermalRatios."""
    n = len(mix)
    xx = _arrays.vector(x, n, "x")
    k, th = _arrays.Output((n,)), _arrays.Output((n,))
    rel, warn = ctypes.c_double(), ctypes.c_uint()
    _check(lib.mcd_mixture_thermal_ratios(mix._p(), _sc(T, "T"), xx.ptr,
                                          k.ptr, th.ptr, ctypes.byref(rel),
                                          ctypes.byref(warn)),
           "mcd_mixture_thermal_ratios")
    return ThermalRatios(k.result(), th.result(), rel.value,
                         Warning(warn.value))


def dufour_heat_flux(x, theta, T, flux, *, M=None, flux_basis="mole"):
    """Dufour heat flux q_D [W/m^2] (length n_dim) carried by diffusion
    fluxes flux (n x n_dim; J_i [mol/(m^2 s)] or, with flux_basis="mass"
    and M, j_i [kg/(m^2 s)]) through theta_i = k_T,i / x_i
    (mcd_dufour_heat_flux): q_D = R T sum_i theta_i J_i."""
    fb = coerce(Basis, flux_basis, "flux_basis")
    xx = _arrays.vector(x, None, "x")
    n = xx.shape[0]
    th = _arrays.vector(theta, n, "theta")
    f = _arrays.as_doubles(flux, "flux")
    size = 1
    for d in f.shape:
        size *= d
    nd = size // n if n else 0
    if nd < 1 or size != n * nd:
        raise ValueError("flux: expected n x n_dim values")
    fm = _arrays.matrix(flux, n, nd, "flux")
    m = _arrays.vector(M, n, "M") if M is not None else None
    o = _arrays.Output((nd,))
    _check(lib.mcd_dufour_heat_flux(n, nd, xx.ptr, m.ptr if m else None,
                                    th.ptr, _sc(T, "T"), fb, fm.ptr, o.ptr),
           "mcd_dufour_heat_flux")
    return o.result()


def dufour_heat_flux_batch(x, theta, T, flux, *, M=None, flux_basis="mole"):
    """Dufour heat flux of K cells (mcd_dufour_heat_flux_batch, cells
    last as flux_batch_dij): x and theta (N, K), T (K,) [K] or a scalar,
    flux (N, n_dim, K) or (N, K) for one direction (as flux_batch_dij
    returns it; mass fluxes with flux_basis="mass" and M (N,) [kg/mol]).
    Returns q_D [W/m^2] of shape (n_dim, K), or (K,) when flux is
    (N, K). Each cell equals dufour_heat_flux of that cell to the bit."""
    fb = coerce(Basis, flux_basis, "flux_basis")
    xa = _arrays.as_doubles(x, "x")
    if xa.ndim != 2:
        raise ValueError("x: expected shape (N, K), got %s" % (xa.shape,))
    n, K = xa.shape
    th = _arrays.matrix(theta, n, K, "theta")
    if isinstance(T, (int, float)):
        T = [float(T)] * K
    tt = _arrays.vector(T, K, "T")
    f = _arrays.as_doubles(flux, "flux")
    one_dim = f.ndim == 2
    if one_dim:
        nd = 1
    elif f.ndim == 3 and f.shape[0] == n and f.shape[2] == K:
        nd = f.shape[1]
    else:
        raise ValueError("flux: expected shape (N, n_dim, K) or (N, K) with "
                         "N = %d, K = %d, got %s" % (n, K, f.shape))
    m = _arrays.vector(M, n, "M") if M is not None else None
    o = _arrays.Output((K,) if one_dim else (nd, K))
    _check(lib.mcd_dufour_heat_flux_batch(n, K, nd, xa.ptr,
                                          m.ptr if m else None, th.ptr,
                                          tt.ptr, fb, f.ptr, o.ptr),
           "mcd_dufour_heat_flux_batch")
    return o.result()


# ---------------------------------------------------------------------------
# Porous media
# ---------------------------------------------------------------------------
# Pore-structure parameters are usually fitted to measurements of the
# medium; results are estimates for design studies, not a substitute for
# measured data, codes and licensed engineering review.

DgmClosed = collections.namedtuple("DgmClosed", "N grad_P")
DgmClosed.__doc__ = """Dusty Gas Model fluxes N [mol/(m^2 s)] with the total
flux given, and the pressure gradient grad_P [Pa/m] that carries them."""
DgmGradients = collections.namedtuple("DgmGradients", "grad_x grad_P")
DgmGradients.__doc__ = """Mole-fraction gradients [1/m] and pressure
gradient [Pa/m] that carry given Dusty Gas Model fluxes."""


def _pore(porosity, tortuosity, d_pore, permeability):
    return mcd_pore(porosity=_sc(porosity, "porosity"),
                    tortuosity=_sc(tortuosity, "tortuosity"),
                    d_pore=_sc(d_pore, "d_pore"),
                    permeability=_sc(permeability, "permeability"))


def pore_permeability(porosity, tortuosity, d_pore, permeability=0.0):
    """Permeability B0 [m^2] the Dusty Gas Model uses: the given one, or
    (porosity/tortuosity) d_pore^2 / 32 when permeability is 0."""
    p = _pore(porosity, tortuosity, d_pore, permeability)
    out = ctypes.c_double()
    _check(lib.mcd_pore_permeability(ctypes.byref(p), ctypes.byref(out)),
           "mcd_pore_permeability")
    return out.value


def pore_effective(D, porosity, tortuosity, d_pore=1.0, permeability=0.0):
    """Effective diffusivity (porosity/tortuosity) D [m^2/s]."""
    p = _pore(porosity, tortuosity, d_pore, permeability)
    out = ctypes.c_double()
    _check(lib.mcd_pore_effective(ctypes.byref(p), _sc(D, "D"),
                                  ctypes.byref(out)), "mcd_pore_effective")
    return out.value


def knudsen_diffusivity(T, M, d_pore):
    """Knudsen diffusivity (d_pore/3) sqrt(8 R T / (pi M)) [m^2/s]."""
    return _raw("mcd_knudsen_diffusivity", T, M, d_pore)


def bosanquet(D_m, D_K):
    """Bosanquet interpolation 1 / (1/D_m + 1/D_K) [m^2/s]."""
    return _raw("mcd_bosanquet", D_m, D_K)


def _dgm(Dij, M, x, T, P, mu, porosity, tortuosity, d_pore, permeability):
    xx = _arrays.vector(x, None, "x")
    n = xx.shape[0]
    keep = {"x": xx, "M": _arrays.vector(M, n, "M"),
            "D": _arrays.matrix(Dij, n, n, "Dij")}
    g = mcd_dgm(n_species=n, T=_sc(T, "T"), P=_sc(P, "P"), mu=_sc(mu, "mu"),
                M=keep["M"].ptr, Dij=keep["D"].ptr, x=xx.ptr)
    return n, g, _pore(porosity, tortuosity, d_pore, permeability), keep


def dgm_fluxes(Dij, M, x, grad_x, T, P, mu, *, porosity, tortuosity, d_pore,
               permeability=0.0, grad_P=None, workspace=None):
    """Total molar fluxes N [mol/(m^2 s)] in a porous medium by the Dusty
    Gas Model (mcd_dgm_fluxes). Dij: open-gas binary diffusivities at (T,
    P) [m^2/s]; M [kg/mol]; x mole fractions; grad_x [1/m], shape (n,) or
    (n, n_dim); T [K], P [Pa]; mu: mixture viscosity [Pa s]; pore
    structure: porosity, tortuosity, d_pore [m], permeability [m^2] (0:
    from d_pore); grad_P [Pa/m] (None: uniform pressure)."""
    n, g, p, keep = _dgm(Dij, M, x, T, P, mu, porosity, tortuosity, d_pore,
                         permeability)
    gx, nd, was_1d = _arrays.field(grad_x, n, "grad_x")
    gp = _opt(grad_P, lambda v: _arrays.vector(
        [v] if isinstance(v, (int, float)) else v, nd, "grad_P"))
    g.n_dim, g.grad_x, g.grad_P = nd, gx.ptr, _ptr(gp)
    ws = _ws(workspace, n)
    o, was_1d = _field_out(n, nd, was_1d, None)
    st = lib.mcd_dgm_fluxes(ws._p(), ctypes.byref(p), ctypes.byref(g), o.ptr)
    ws.check(st, "mcd_dgm_fluxes")
    return _field_result(o, was_1d)


def _dirs(v, nd, name):
    return _arrays.vector([v] if isinstance(v, (int, float)) else v, nd, name)


def _dir_result(o, was_1d):
    r = o.result()
    return r[0] if was_1d else r


def dgm_closed(Dij, M, x, grad_x, T, P, mu, *, porosity, tortuosity, d_pore,
               permeability=0.0, N_t=0.0, workspace=None):
    """Dusty Gas Model with the total flux N_t given (0: closed end) and
    the pressure gradient unknown (mcd_dgm_closed): DgmClosed(N, grad_P)."""
    n, g, p, keep = _dgm(Dij, M, x, T, P, mu, porosity, tortuosity, d_pore,
                         permeability)
    gx, nd, was_1d = _arrays.field(grad_x, n, "grad_x")
    nt = _dirs(N_t, nd, "N_t")
    g.n_dim, g.grad_x = nd, gx.ptr
    ws = _ws(workspace, n)
    o, was_1d = _field_out(n, nd, was_1d, None)
    gp = _arrays.Output((nd,))
    st = lib.mcd_dgm_closed(ws._p(), ctypes.byref(p), ctypes.byref(g),
                            nt.ptr, o.ptr, gp.ptr)
    ws.check(st, "mcd_dgm_closed")
    return DgmClosed(_field_result(o, was_1d), _dir_result(gp, was_1d))


def dgm_gradients(Dij, M, x, N, T, P, mu, *, porosity, tortuosity, d_pore,
                  permeability=0.0, workspace=None):
    """Inverse Dusty Gas Model (mcd_dgm_gradients): the gradients that
    carry total fluxes N, DgmGradients(grad_x, grad_P)."""
    n, g, p, keep = _dgm(Dij, M, x, T, P, mu, porosity, tortuosity, d_pore,
                         permeability)
    f, nd, was_1d = _arrays.field(N, n, "N")
    g.n_dim = nd
    ws = _ws(workspace, n)
    o, was_1d = _field_out(n, nd, was_1d, None)
    gp = _arrays.Output((nd,))
    st = lib.mcd_dgm_gradients(ws._p(), ctypes.byref(p), ctypes.byref(g),
                               f.ptr, o.ptr, gp.ptr)
    ws.check(st, "mcd_dgm_gradients")
    return DgmGradients(_field_result(o, was_1d), _dir_result(gp, was_1d))


def dgm_fluxes_batch(Dij, M, x, grad_x, T, P, mu, *, porosity, tortuosity,
                     d_pore, permeability=0.0, grad_P=None, workspace=None):
    """Dusty Gas Model fluxes of K cells (mcd_dgm_fluxes_batch, cells
    last): Dij (N, N, K) [m^2/s], M (N,) [kg/mol], x (N, K), grad_x
    (N, n_dim, K) or (N, K) [1/m], T, P, mu (K,) [K, Pa, Pa s], grad_P
    (n_dim, K) or (K,) [Pa/m] or None; one pore structure for all cells.
    The result [mol/(m^2 s)] has the shape of grad_x."""
    Ta = _arrays.vector([T] if isinstance(T, (int, float)) else T, None, "T")
    K = Ta.shape[0]
    Pa = _arrays.vector([P] if isinstance(P, (int, float)) else P, K, "P")
    mua = _arrays.vector([mu] if isinstance(mu, (int, float)) else mu, K,
                         "mu")
    m = _arrays.vector(M, None, "M")
    N = m.shape[0]
    D = _arrays.as_doubles(Dij, "Dij")
    if not (D.shape == (N, N, K) or (D.ndim == 1 and D.size == N * N * K)):
        raise ValueError("Dij: expected shape %s, got %s"
                         % ((N, N, K), D.shape))
    a, g, nd, gp = _batch_fields(N, K, x, grad_x, grad_P, "soa")
    ws = _ws(workspace, N)
    o = _arrays.Output(g.shape)
    p = _pore(porosity, tortuosity, d_pore, permeability)
    cells = mcd_dgm_cells(n_cells=K, n_dim=nd, T=Ta.ptr, P=Pa.ptr,
                          mu=mua.ptr, Dij=D.ptr, x=a.ptr, grad_x=g.ptr,
                          grad_P=_ptr(gp))
    st = lib.mcd_dgm_fluxes_batch(ws._p(), ctypes.byref(p), N, m.ptr,
                                  ctypes.byref(cells), o.ptr)
    ws.check(st, "mcd_dgm_fluxes_batch")
    return o.result()


SlabResult = collections.namedtuple("SlabResult", "N PL iterations")
SlabResult.__doc__ = """Steady fluxes N [mol/(m^2 s)] through a porous slab,
the pressure PL [Pa] at z = L, and the Newton iterations used."""
_SLAB_KINDS = {"pressures": 0, "stagnant": 1, "total": 2}


def _slab(Dij, M, x0, P0, xL, PL, T, mu, L, P_ref):
    a0 = _arrays.vector(x0, None, "x0")
    n = a0.shape[0]
    keep = {"x0": a0, "M": _arrays.vector(M, n, "M"),
            "D": _arrays.matrix(Dij, n, n, "Dij"),
            "xL": _arrays.vector(x0 if xL is None else xL, n, "xL")}
    sl = mcd_slab(n_species=n, T=_sc(T, "T"), mu=_sc(mu, "mu"),
                  L=_sc(L, "L"), P_ref=_sc(P0 if P_ref is None else P_ref,
                                           "P_ref"),
                  M=keep["M"].ptr, Dij=keep["D"].ptr, x0=a0.ptr,
                  P0=_sc(P0, "P0"), xL=keep["xL"].ptr,
                  PL=_sc(P0 if PL is None else PL, "PL"))
    return n, sl, keep


def slab_solve(Dij, M, x0, P0, xL, PL, T, mu, L, *, porosity, tortuosity,
               d_pore, permeability=0.0, P_ref=None, kind="pressures",
               species=0, value=0.0, ratios=None, workspace=None):
    """Steady Dusty Gas Model fluxes through a porous slab of thickness L
    [m] between (x0, P0 [Pa]) and (xL, PL) (mcd_slab_solve). Dij: open-gas
    binary diffusivities [m^2/s] at P_ref (default P0); mu [Pa s]
    constant. kind: "pressures" (both end pressures given), "stagnant"
    (species does not move; PL ignored and returned) or "total" (sum N =
    value) or "ratios" (N = ratios * N_t, ratios summing to 1, as a
    reaction's stoichiometry fixes them; xL[species] is matched, PL
    ignored and returned: mcd_slab_solve_ratios). Returns
    SlabResult(N, PL, iterations)."""
    if kind not in _SLAB_KINDS and kind != "ratios":
        raise ValueError("kind: one of %s, ratios" % ", ".join(_SLAB_KINDS))
    n, sl, keep = _slab(Dij, M, x0, P0, xL, PL, T, mu, L, P_ref)
    p = _pore(porosity, tortuosity, d_pore, permeability)
    ws = _ws(workspace, n)
    o = _arrays.Output((n,))
    pl = ctypes.c_double()
    it = ctypes.c_size_t()
    if kind == "ratios":
        if ratios is None:
            raise ValueError("ratios: required with kind='ratios'")
        z = _arrays.vector(ratios, n, "ratios")
        st = lib.mcd_slab_solve_ratios(ws._p(), ctypes.byref(p),
                                       ctypes.byref(sl), int(species), z.ptr,
                                       o.ptr, ctypes.byref(pl),
                                       ctypes.byref(it))
        ws.check(st, "mcd_slab_solve_ratios")
        return SlabResult(o.result(), pl.value, it.value)
    st = lib.mcd_slab_solve(ws._p(), ctypes.byref(p), ctypes.byref(sl),
                            _SLAB_KINDS[kind], int(species),
                            _sc(value, "value"), o.ptr, ctypes.byref(pl),
                            ctypes.byref(it))
    ws.check(st, "mcd_slab_solve")
    return SlabResult(o.result(), pl.value, it.value)


def slab_profile(Dij, M, x0, P0, N, z, T, mu, L, *, porosity, tortuosity,
                 d_pore, permeability=0.0, P_ref=None, workspace=None):
    """Profile across a porous slab for fluxes N (mcd_slab_profile):
    (x, P) with x an (n_points x n) array and P the pressures [Pa] at the
    positions z [m] in [0, L]."""
    n, sl, keep = _slab(Dij, M, x0, P0, None, None, T, mu, L, P_ref)
    p = _pore(porosity, tortuosity, d_pore, permeability)
    fl = _arrays.vector(N, n, "N")
    zz = _arrays.vector([z] if isinstance(z, (int, float)) else z, None, "z")
    npt = zz.shape[0]
    ws = _ws(workspace, n)
    ox = _arrays.Output((npt, n))
    oP = _arrays.Output((npt,))
    st = lib.mcd_slab_profile(ws._p(), ctypes.byref(p), ctypes.byref(sl),
                              fl.ptr, npt, zz.ptr, ox.ptr, oP.ptr)
    ws.check(st, "mcd_slab_profile")
    return ox.result(), oP.result()
