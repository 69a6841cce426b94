"""Loading of the C library libmcdiff and the table of its C signatures.

The library is loaded once, at import, from the first of these that works:

1. the path in the environment variable MCDIFF_LIBRARY (if set, it is the
   only candidate: an explicit choice is never silently replaced);
2. a copy shipped beside this package (mcdiff/libmcdiff.so*);
3. the build tree, when the package is used from a source checkout
   (<checkout>/build/lib/libmcdiff.so);
4. the install location written by Meson when the package was installed
   (mcdiff/_install_paths.py, LIBDIR);
5. ctypes.util.find_library('mcdiff') (the bare name: the lookup adds the
   "lib" prefix and suffixes itself).

A candidate whose major version differs from the one this package was
written for is refused and the search goes on. When nothing works, an
ImportError lists every path tried and why it failed.

SIGNATURES holds restype and argtypes of every MCD_API function of
include/mcdiff.h; tests/python/test_native.py checks the table against the
header, function by function and argument by argument.
"""

import ctypes
import ctypes.util
import glob
import os
import sys

from ._version import BUILT_FOR

__all__ = ["lib", "lib_path", "SIGNATURES", "ENV_VAR"]

ENV_VAR = "MCDIFF_LIBRARY"

# ---------------------------------------------------------------------------
# C types used in the table. Handles are opaque: c_void_p, never a mirrored
# struct. Mutable char buffers (errbuf) are POINTER(c_char) so that a
# ctypes.create_string_buffer can be passed; const char * is c_char_p.
# ---------------------------------------------------------------------------
_D = ctypes.c_double
_PD = ctypes.POINTER(ctypes.c_double)
_SZ = ctypes.c_size_t
_PSZ = ctypes.POINTER(ctypes.c_size_t)
_I = ctypes.c_int
_PI = ctypes.POINTER(ctypes.c_int)
_U = ctypes.c_uint
_PU = ctypes.POINTER(ctypes.c_uint)
_PL = ctypes.POINTER(ctypes.c_long)
_S = ctypes.c_char_p
_PS = ctypes.POINTER(ctypes.c_char_p)
_BUF = ctypes.POINTER(ctypes.c_char)
_H = ctypes.c_void_p
_PH = ctypes.POINTER(ctypes.c_void_p)
_ST = ctypes.c_int  # mcd_status and every other enum of the header
_E = ctypes.c_int

# name: (restype, [argtypes])
SIGNATURES = {
    # version and status
    "mcd_version_number": (_U, []),
    "mcd_version_string": (_S, []),
    "mcd_status_string": (_S, [_I]),
    # formulas and elements
    "mcd_formula_molar_mass": (_ST, [_S, _PD, _BUF, _SZ]),
    "mcd_formula_elements": (_ST, [_S, _SZ, _PI, _PL, _PSZ, _BUF, _SZ]),
    "mcd_formula_diffusion_volume": (_ST, [_S, _I, _PD, _BUF, _SZ]),
    "mcd_fsg_molecule_volume": (_ST, [_S, _PD]),
    "mcd_element_symbol": (_S, [_I]),
    "mcd_element_weight": (_ST, [_I, _PD]),
    # species database
    "mcd_param_name": (_S, [_E]),
    "mcd_param_unit": (_S, [_E]),
    "mcd_db_new": (_ST, [_PH]),
    "mcd_db_new_builtin": (_ST, [_PH]),
    "mcd_db_free": (None, [_H]),
    "mcd_db_count": (_SZ, [_H]),
    "mcd_db_find": (_ST, [_H, _S, _PSZ]),
    "mcd_db_name": (_S, [_H, _SZ]),
    "mcd_db_formula": (_S, [_H, _SZ]),
    "mcd_db_source": (_S, [_H, _SZ, _E]),
    "mcd_db_param": (_ST, [_H, _SZ, _E, _PD]),
    "mcd_db_add": (_ST, [_H, _S, _S, _I, _PSZ, _BUF, _SZ]),
    "mcd_db_set_param": (_ST, [_H, _SZ, _E, _D]),
    "mcd_db_load_file": (_ST, [_H, _S, _BUF, _SZ]),
    "mcd_db_load_string": (_ST, [_H, _S, _BUF, _SZ]),
    # compositions
    "mcd_comp_normalize": (_ST, [_SZ, _PD, _PD]),
    "mcd_comp_x_to_w": (_ST, [_SZ, _PD, _PD, _PD]),
    "mcd_comp_w_to_x": (_ST, [_SZ, _PD, _PD, _PD]),
    "mcd_comp_mean_molar_mass_x": (_ST, [_SZ, _PD, _PD, _PD]),
    "mcd_comp_mean_molar_mass_w": (_ST, [_SZ, _PD, _PD, _PD]),
    "mcd_comp_x_to_c": (_ST, [_SZ, _D, _PD, _PD]),
    "mcd_comp_c_to_x": (_ST, [_SZ, _PD, _PD, _PD]),
    "mcd_ideal_gas_c": (_ST, [_D, _D, _PD]),
    "mcd_comp_grad_x_to_w": (_ST, [_SZ, _SZ, _PD, _PD, _PD, _PD]),
    "mcd_comp_grad_w_to_x": (_ST, [_SZ, _SZ, _PD, _PD, _PD, _PD]),
    # binary diffusivities
    "mcd_method_name": (_S, [_E]),
    "mcd_method_from_name": (_ST, [_S, _PI]),
    "mcd_method_typical_error": (_D, [_E]),
    "mcd_warning_string": (_S, [_U]),
    "mcd_fsg_raw": (_ST, [_D, _D, _D, _D, _D, _D, _PD]),
    "mcd_chapman_enskog_raw": (_ST, [_D, _D, _D, _D, _D, _D, _D, _D, _PD]),
    "mcd_wilke_lee_raw": (_ST, [_D, _D, _D, _D, _D, _D, _D, _D, _PD]),
    "mcd_wilke_chang_raw": (_ST, [_D, _D, _D, _D, _D, _PD]),
    "mcd_collision_omega_d": (_ST, [_D, _PD]),
    "mcd_binary_scale": (_ST, [_D, _D, _D, _D, _D, _D, _PD]),
    "mcd_binary_gas": (_ST, [_H, _SZ, _SZ, _E, _D, _D, _PD, _PD, _PU]),
    "mcd_binary_liquid": (_ST, [_H, _SZ, _SZ, _D, _D, _PD, _PD, _PU]),
    # mixtures
    "mcd_mixture_new": (_ST, [_H, _SZ, _PS, _E, _PH, _BUF, _SZ]),
    "mcd_mixture_free": (None, [_H]),
    "mcd_mixture_count": (_SZ, [_H]),
    "mcd_mixture_name": (_S, [_H, _SZ]),
    "mcd_mixture_molar_masses": (_ST, [_H, _PD]),
    "mcd_mixture_set_method": (_ST, [_H, _SZ, _SZ, _E]),
    "mcd_mixture_set_binary": (_ST, [_H, _SZ, _SZ, _D, _D, _D]),
    "mcd_mixture_binaries": (_ST, [_H, _D, _D, _PD, _PD, _PU]),
    # workspaces (the allocator argument is passed as an opaque pointer:
    # the Python API does not expose custom allocators)
    "mcd_workspace_alloc": (_ST, [_SZ, _PH]),
    "mcd_workspace_alloc_with": (_ST, [_SZ, _H, _PH]),
    "mcd_workspace_free": (None, [_H]),
    "mcd_workspace_species": (_SZ, [_H]),
    "mcd_workspace_last_error": (_S, [_H]),
    # fluxes and Fick matrices
    "mcd_flux_compute": (_ST, [_H, _E, _SZ, _SZ, _PD, _PD, _D, _E, _PD, _PD,
                               _PD, _PD, _E, _PD]),
    "mcd_fick_matrix": (_ST, [_H, _SZ, _PD, _PD, _E, _PD, _PD, _E, _SZ, _PD,
                              _PSZ]),
    "mcd_fick_fluxes": (_ST, [_SZ, _SZ, _PD, _SZ, _D, _PD, _PD]),
    "mcd_fick_eigenvalues": (_ST, [_H, _SZ, _PD, _PD, _PD]),
    # bases, frames, total fluxes
    "mcd_flux_convert": (_ST, [_SZ, _SZ, _PD, _PD, _E, _PD, _E, _PD]),
    "mcd_flux_to_volume_frame": (_ST, [_SZ, _SZ, _D, _PD, _PD, _PD, _PD]),
    "mcd_flux_to_species_frame": (_ST, [_SZ, _SZ, _PD, _PD, _SZ, _PD]),
    "mcd_flux_total": (_ST, [_SZ, _SZ, _E, _PD, _PD, _E, _SZ, _PD, _PD, _PD]),
    "mcd_velocity_difference": (_ST, [_SZ, _SZ, _PD, _D, _PD, _PD, _PD]),
    "mcd_flux_project": (_ST, [_SZ, _SZ, _PD, _PD, _PD]),
    "mcd_flux_diagnose": (_ST, [_SZ, _SZ, _PD, _PD, _D, _PU]),
    # batched fluxes
    "mcd_flux_batch": (_ST, [_H, _H, _E, _SZ, _SZ, _PD, _PD, _E, _PD, _PD,
                             _PD, _E, _PD]),
    "mcd_flux_batch_dij": (_ST, [_H, _E, _SZ, _SZ, _SZ, _PD, _PD, _PD, _E,
                                 _PD, _PD, _PD, _E, _PD]),
    "mcd_flux_batch_aos": (_ST, [_H, _H, _E, _SZ, _SZ, _PD, _PD, _E, _PD,
                                 _PD, _PD, _E, _PD]),
    "mcd_workspace_set_iterative": (_ST, [_H, _SZ, _D]),
    "mcd_workspace_iterative_info": (_ST, [_H, _PD, _PSZ]),
    "mcd_workspace_set_threads": (_ST, [_H, _SZ]),
    "mcd_mixture_set_temperature_fit": (_ST, [_H, _D, _D, _PD]),
    "mcd_mixture_temperature_fit": (_ST, [_H, _PD, _PD, _PD]),
    # transfer
    "mcd_film_solve": (_ST, [_H, _SZ, _PD, _D, _D, _PD, _PD, _E, _SZ, _PD, _E,
                             _PD, _PSZ, _PD]),
    "mcd_film_profile": (_ST, [_H, _SZ, _PD, _D, _D, _PD, _PD, _SZ, _PD,
                               _PD]),
    "mcd_bulbs_linearized": (_ST, [_H, _SZ, _PD, _D, _D, _D, _D, _D, _PD, _PD,
                                   _SZ, _PD, _PD, _PD]),
    "mcd_bulbs_integrate": (_ST, [_H, _SZ, _PD, _D, _D, _D, _D, _D, _PD, _PD,
                                  _SZ, _PD, _D, _PD, _PD]),
}


def _library_file_names():
    """File names the shared library may have on this platform."""
    if sys.platform == "darwin":
        return ["libmcdiff.%d.dylib" % BUILT_FOR[0], "libmcdiff.dylib"]
    if sys.platform in ("win32", "cygwin"):
        return ["mcdiff-%d.dll" % BUILT_FOR[0], "mcdiff.dll", "libmcdiff.dll"]
    return ["libmcdiff.so.%d" % BUILT_FOR[0], "libmcdiff.so"]


def _candidates():
    """(label, path or name) pairs in search order."""
    env = os.environ.get(ENV_VAR)
    if env:
        return [(ENV_VAR, env)]
    here = os.path.dirname(os.path.abspath(__file__))
    out = []
    # 2. beside the package
    for name in _library_file_names():
        out.append(("beside the package", os.path.join(here, name)))
    extra = sorted(glob.glob(os.path.join(here, "libmcdiff.so.*")))
    for p in extra:
        if ("beside the package", p) not in out:
            out.append(("beside the package", p))
    # 3. build tree of a source checkout: <root>/bindings/python/mcdiff
    root = os.path.dirname(os.path.dirname(os.path.dirname(here)))
    if os.path.isfile(os.path.join(root, "include", "mcdiff.h")):
        for name in _library_file_names():
            out.append(("build tree", os.path.join(root, "build", "lib", name)))
    # 4. install location recorded by Meson at install time
    try:
        from . import _install_paths  # generated by bindings/python/meson.build
        for name in _library_file_names():
            out.append(("install location",
                        os.path.join(_install_paths.LIBDIR, name)))
    except ImportError:
        pass
    # 5. the system's library search (bare name, see the module doc)
    found = ctypes.util.find_library("mcdiff")
    out.append(("ctypes.util.find_library('mcdiff')",
                found if found else None))
    return out


def _version_of(handle):
    fn = handle.mcd_version_number
    fn.restype = ctypes.c_uint
    fn.argtypes = []
    return int(fn())


def _bind(handle, path):
    missing = []
    for name, (restype, argtypes) in SIGNATURES.items():
        try:
            fn = getattr(handle, name)
        except AttributeError:
            missing.append(name)
            continue
        fn.restype = restype
        fn.argtypes = argtypes
    if missing:
        raise ImportError(
            "mcdiff: the C library %s lacks %s; this package was written for "
            "mcdiff %d.%d.%d (an older library of the same major version?)"
            % (path, ", ".join(missing), *BUILT_FOR))


def _load():
    tried = []
    for label, path in _candidates():
        if path is None:
            tried.append("%s: nothing found" % label)
            continue
        if os.sep in path and not os.path.exists(path):
            tried.append("%s: %s (no such file)" % (label, path))
            continue
        try:
            handle = ctypes.CDLL(path)
        except OSError as e:
            tried.append("%s: %s (%s)" % (label, path, e))
            continue
        try:
            v = _version_of(handle)
        except AttributeError:
            tried.append("%s: %s (not an mcdiff library: no "
                         "mcd_version_number)" % (label, path))
            continue
        if v // 10000 != BUILT_FOR[0]:
            tried.append("%s: %s (library version %d.%d.%d, package written "
                         "for %d.%d.%d: major versions differ)"
                         % (label, path, v // 10000, v // 100 % 100, v % 100,
                            *BUILT_FOR))
            continue
        _bind(handle, path)
        return handle, path, v
    raise ImportError(
        "mcdiff: cannot load the C library libmcdiff. Tried, in order:\n  "
        + "\n  ".join(tried)
        + "\nSet %s to the full path of the shared library "
          "(e.g. build/lib/libmcdiff.so)." % ENV_VAR)


lib, lib_path, lib_version_number = _load()
del _load
