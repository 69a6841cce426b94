"""Exceptions raised for the library's status codes.

Every non-zero mcd_status becomes an McdError subclass chosen by its code.
The exception carries the code (``status``), the library's text for it
(``status_string``, from mcd_status_string), the C function that failed
(``function``) and the detail the library gave for the failing call
(mcd_last_error, read in the calling thread right after the call), followed
by the binding's own context when it adds some.

Where a standard Python exception has the same meaning the subclass also
derives from it, so ``except ValueError`` catches a domain error.
"""

import enum

from ._native import lib

__all__ = [
    "Status", "McdError", "InvalidArgumentError", "DomainError",
    "BadLengthError", "OutOfMemoryError", "SingularMatrixError",
    "InternalError", "NotFoundError", "ParseError", "NoDataError",
    "NoConvergenceError", "FileError", "status_string", "error_for",
    "last_error",
]


class Status(enum.IntEnum):
    """mcd_status codes (values fixed by the C header)."""
    OK = 0
    EINVAL = 1
    EDOM = 2
    EBADLEN = 3
    ENOMEM = 4
    ESING = 5
    EINTERNAL = 6
    ENOTFOUND = 7
    EPARSE = 8
    ENODATA = 9
    ENOCONV = 10
    EIO = 11


def status_string(code):
    """The library's static English text for a status code."""
    return lib.mcd_status_string(int(code)).decode("utf-8", "replace")


def last_error():
    """Detail of this thread's last library call that returned a status:
    '' after a success (mcd_last_error)."""
    return lib.mcd_last_error().decode("utf-8", "replace")


class McdError(Exception):
    """A library call returned a non-zero status.

    Attributes: status (int), status_string (str), function (str, the C
    function), detail (str, possibly empty).
    """

    def __init__(self, status, function="", detail=""):
        self.status = int(status)
        self.status_string = status_string(status)
        self.function = function
        self.detail = detail or ""
        msg = self.status_string
        if function:
            msg = "%s: %s" % (function, msg)
        if self.detail:
            msg = "%s (%s)" % (msg, self.detail)
        super().__init__(msg)

    def __reduce__(self):
        return (type(self), (self.status, self.function, self.detail))


class InvalidArgumentError(McdError, ValueError):
    """MCD_EINVAL: NULL pointer, NaN or infinity, bad count or enum."""


class DomainError(McdError, ValueError):
    """MCD_EDOM: outside the model's domain."""


class BadLengthError(McdError, ValueError):
    """MCD_EBADLEN: size differs from the workspace's or mixture's."""


class OutOfMemoryError(McdError, MemoryError):
    """MCD_ENOMEM: allocation failed."""


class SingularMatrixError(McdError, ArithmeticError):
    """MCD_ESING: singular or indefinite matrix."""


class InternalError(McdError, RuntimeError):
    """MCD_EINTERNAL: a library bug (LAPACK info < 0)."""


class NotFoundError(McdError, LookupError):
    """MCD_ENOTFOUND: unknown species, element or method."""


class ParseError(McdError, ValueError):
    """MCD_EPARSE: malformed formula, file or text."""


class NoDataError(McdError, LookupError):
    """MCD_ENODATA: a parameter the method needs is missing."""


class NoConvergenceError(McdError, ArithmeticError):
    """MCD_ENOCONV: iteration did not converge."""


class FileError(McdError, OSError):
    """MCD_EIO: file could not be opened or read."""

    def __str__(self):  # OSError's own __str__ would format errno fields
        return self.args[0] if self.args else ""


_BY_CODE = {
    Status.EINVAL: InvalidArgumentError,
    Status.EDOM: DomainError,
    Status.EBADLEN: BadLengthError,
    Status.ENOMEM: OutOfMemoryError,
    Status.ESING: SingularMatrixError,
    Status.EINTERNAL: InternalError,
    Status.ENOTFOUND: NotFoundError,
    Status.EPARSE: ParseError,
    Status.ENODATA: NoDataError,
    Status.ENOCONV: NoConvergenceError,
    Status.EIO: FileError,
}


def error_for(status, function="", detail=""):
    """The exception object for a non-zero status (McdError for a code this
    package does not know). Call it right after the failing call: the
    library's detail (last_error) leads, detail adds context."""
    lib_detail = last_error()
    if function and lib_detail.startswith(function + ": "):
        lib_detail = ""  # the generic "<function>: <status>" adds nothing
    if lib_detail and detail and detail not in lib_detail:
        detail = "%s; %s" % (lib_detail, detail)
    elif lib_detail:
        detail = lib_detail
    cls = _BY_CODE.get(status, McdError)
    return cls(status, function, detail)
