"""mcdiff: multicomponent diffusion fluxes (Python binding of libmcdiff).

A pure-Python ctypes package: no compile step. The C library is found at
import (see mcdiff._native for the search order; set MCDIFF_LIBRARY to its
full path to choose one). SI units everywhere.

    >>> import mcdiff
    >>> db = mcdiff.Database.builtin()
    >>> mix = db.mixture(["hydrogen", "nitrogen", "carbon-dioxide"])
    >>> J = mix.fluxes(308.15, mcdiff.ATM, [0.3, 0.4, 0.3], [1.0, 0.0, -1.0])

Errors raise subclasses of mcdiff.McdError. numpy is used when available
(results are numpy arrays; C-contiguous float64 inputs are not copied);
without numpy, or with MCDIFF_NO_NUMPY=1, lists are returned.
"""

from ._version import BUILT_FOR, __version__
from ._native import lib_path as library_path
from ._arrays import HAVE_NUMPY
from .enums import (ATM, DEPENDENT_AUTO, GAS_CONSTANT, MAX_DIM, MAX_SPECIES,
                    SUM_TOL, Basis, Bootstrap, Diag, FilmBootstrap,
                    FilmMethod, GasMethod, Method, Model, Param,
                    EstimateWarning, Warning)
from .errors import (BadLengthError, DomainError, FileError, InternalError,
                     InvalidArgumentError, McdError, NoConvergenceError,
                     NoDataError, NotFoundError, OutOfMemoryError, ParseError,
                     SingularMatrixError, Status, last_error,
                     status_string)
from .handles import (BinaryEstimate, BinaryMatrices, Database, Evaporation,
                      GasState, Liquid, LiquidState, Mixture, Workspace,
                      param_name, param_unit)
from .api import *  # noqa: F401,F403 - the function API, listed in api.__all__
from . import api as _api

__all__ = [
    "__version__", "BUILT_FOR", "library_path", "HAVE_NUMPY",
    "ATM", "DEPENDENT_AUTO", "GAS_CONSTANT", "MAX_DIM", "MAX_SPECIES",
    "SUM_TOL", "Basis", "Bootstrap", "Diag", "FilmBootstrap", "FilmMethod",
    "GasMethod", "Method", "Model", "Param", "EstimateWarning",
    "McdError", "InvalidArgumentError", "DomainError", "BadLengthError",
    "OutOfMemoryError", "SingularMatrixError", "InternalError",
    "NotFoundError", "ParseError", "NoDataError", "NoConvergenceError",
    "FileError", "Status", "status_string", "last_error",
    "Database", "Mixture", "Workspace", "Liquid", "LiquidState",
    "Evaporation", "BinaryEstimate", "BinaryMatrices",
    "GasState", "param_name", "param_unit",
] + list(_api.__all__)
