"""Enumerations, flag sets and constants of include/mcdiff.h.

Arguments that take an enumeration also accept its name as a string
(case-insensitive, '-' and '_' alike), e.g. basis="mass",
model="mixture-averaged", bootstrap="stagnant", method="chapman-enskog".
"""

import enum

__all__ = [
    "Param", "Method", "GasMethod", "Basis", "Model", "Bootstrap", "FilmBootstrap",
    "FilmMethod",
    "EstimateWarning", "Diag", "MAX_SPECIES", "MAX_DIM", "SUM_TOL", "GAS_CONSTANT",
    "ATM", "DEPENDENT_AUTO", "coerce",
]

#: Largest number of species accepted by any call (MCD_MAX_SPECIES).
MAX_SPECIES = 1024
#: Largest number of spatial directions (MCD_MAX_DIM).
MAX_DIM = 3
#: Composition sums within this of 1 are renormalised (MCD_SUM_TOL).
SUM_TOL = 1e-6
#: Universal gas constant [J/(mol K)], exact in the 2019 SI (CODATA 2018).
GAS_CONSTANT = 8.31446261815324
#: Standard atmosphere [Pa], exact by definition (MCD_ATM).
ATM = 101325.0
#: dependent=DEPENDENT_AUTO (or None) picks the most abundant species.
DEPENDENT_AUTO = None


class Param(enum.IntEnum):
    """Species parameters (mcd_param); SI units, see param_unit()."""
    MOLAR_MASS = 0
    DIFF_VOLUME = 1
    LJ_SIGMA = 2
    LJ_EPS_K = 3
    DIPOLE = 4
    VB = 5
    TB = 6
    ASSOC = 7
    TC = 8
    PC = 9


# Short machine names of the C library (mcd_param_name), for coerce().
_PARAM_SHORT = {"m": 0, "v_diff": 1, "sigma": 2, "eps_k": 3, "dipole": 4,
                "vb": 5, "tb": 6, "assoc": 7, "tc": 8, "pc": 9}


class Method(enum.IntEnum):
    """Binary diffusivity methods (mcd_method)."""
    FSG = 1
    CHAPMAN_ENSKOG = 2
    WILKE_LEE = 3
    WILKE_CHANG = 4
    USER = 5
    TYN_CALUS = 6
    HAYDUK_MINHAS = 7
    BROKAW = 8


class GasMethod(enum.IntEnum):
    """Gas-phase correlation of a pair (mcd_gas_method); equal to the Method
    of the same name. RECOMMENDED (mixtures only) gives each pair the method
    `mcdiff binary` recommends for it: BROKAW for a polar pair with Brokaw's
    data, else the first of FSG, CHAPMAN_ENSKOG, WILKE_LEE that applies;
    Mixture.pair_method tells which."""
    FSG = 1
    CHAPMAN_ENSKOG = 2
    WILKE_LEE = 3
    BROKAW = 8
    RECOMMENDED = 100


class Basis(enum.IntEnum):
    """Composition / flux basis (mcd_basis)."""
    MOLE = 0
    MASS = 1


class Model(enum.IntEnum):
    """Flux model (mcd_model)."""
    MAXWELL_STEFAN = 0
    MIXTURE_AVERAGED = 1
    ITERATIVE = 2


class Bootstrap(enum.IntEnum):
    """Condition that fixes total fluxes locally (mcd_bootstrap)."""
    TOTAL = 0
    STAGNANT = 1
    EQUIMOLAR = 2
    WEIGHTS = 3


class FilmBootstrap(enum.IntEnum):
    """Condition that fixes the total flux of a film (mcd_film_bootstrap)."""
    TOTAL = 0
    STAGNANT = 1
    EQUIMOLAR = 2
    WEIGHTS = 3
    RATIOS = 4


class FilmMethod(enum.IntEnum):
    """Film theory (mcd_film_method)."""
    EXACT = 0
    LINEARIZED = 1


class EstimateWarning(enum.IntFlag):
    """Warning bits of binary estimates (MCD_WARN_*)."""
    HIGH_PRESSURE = 0x01
    POLAR = 0x02
    TEMPERATURE = 0x04
    QUANTUM = 0x08
    ASSOCIATING = 0x10
    ESTIMATED_PARAM = 0x20
    SCALED = 0x40


#: The name of this class before 0.2; not exported by `import *`, where it
#: would shadow the built-in Warning.
Warning = EstimateWarning  # noqa: A001


class Diag(enum.IntFlag):
    """Per-species coupling diagnostics (MCD_DIAG_*)."""
    REVERSE = 0x1
    OSMOTIC = 0x2
    BARRIER = 0x4


# One vocabulary with the command line: names are the enumeration's own
# (maxwell-stefan, mixture-averaged, mole, mass, chapman-enskog, ...), plus
# the command line's "exact" for the Maxwell-Stefan model; no other
# abbreviations (the CLI refuses them too).
_ALIASES = {
    Model: {"exact": Model.MAXWELL_STEFAN},
    Param: {k: Param(v) for k, v in _PARAM_SHORT.items()},
}


def coerce(cls, value, name="argument"):
    """An enumeration member from a member, its integer value or its name."""
    if isinstance(value, cls):
        return value
    if isinstance(value, str):
        key = value.strip().lower().replace("-", "_").replace(" ", "_")
        alias = _ALIASES.get(cls, {}).get(key)
        if alias is not None:
            return alias
        try:
            return cls[key.upper()]
        except KeyError:
            pass
        choices = sorted({m.name.lower().replace("_", "-") for m in cls}
                         | set(_ALIASES.get(cls, {})))
        raise ValueError("%s: unknown %s %r (one of: %s)"
                         % (name, cls.__name__, value, ", ".join(choices)))
    if isinstance(value, bool):
        raise TypeError("%s: expected a %s, got a bool" % (name, cls.__name__))
    try:
        return cls(int(value))
    except (ValueError, TypeError):
        raise ValueError("%s: %r is not a valid %s"
                         % (name, value, cls.__name__)) from None
