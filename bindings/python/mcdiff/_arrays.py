"""Array arguments: lists, array.array and numpy arrays, without numpy too.

Inputs
    * a numpy array that is C-contiguous float64 is passed to C without a
      copy (its data pointer); any other numpy array is converted once with
      numpy.ascontiguousarray(x, dtype=float64);
    * an array.array('d') is passed without a copy (its buffer);
    * anything else (lists, tuples, nested lists, other sequences of
      numbers) is copied into a ctypes double array.
    Matrices may be given nested (rows of columns) or flat (row-major).

Outputs
    numpy arrays when numpy is available, else lists (nested lists for
    matrices). Some calls accept ``out=``: a C-contiguous, writeable float64
    numpy array of the result's shape, filled in place and returned.

Setting the environment variable MCDIFF_NO_NUMPY=1 (before the first import
of mcdiff) makes the package behave exactly as if numpy were absent: it is
never imported.
"""

import array
import ctypes
import numbers
import os

__all__ = ["np", "HAVE_NUMPY", "DoubleArg", "as_doubles", "vector",
           "matrix", "field", "Output", "scalar"]

if os.environ.get("MCDIFF_NO_NUMPY", "") not in ("", "0"):
    np = None
else:
    try:
        import numpy as np
    except ImportError:  # pragma: no cover - depends on the interpreter
        np = None

HAVE_NUMPY = np is not None

_PD = ctypes.POINTER(ctypes.c_double)


class DoubleArg:
    """A double array ready for C: ``ptr`` (POINTER(c_double)), ``shape``
    (tuple), ``size``, ``copied`` (False when the caller's memory is used
    directly) and a reference that keeps the memory alive."""

    __slots__ = ("ptr", "shape", "size", "copied", "_keep")

    def __init__(self, ptr, shape, copied, keep):
        self.ptr = ptr
        self.shape = tuple(shape)
        size = 1
        for s in self.shape:
            size *= s
        self.size = size
        self.copied = copied
        self._keep = keep

    @property
    def ndim(self):
        return len(self.shape)


def _nested_shape_and_flat(obj, name):
    """Shape and flat float list of a number or a (nested) sequence."""
    if isinstance(obj, numbers.Real):
        return (), [float(obj)]
    if isinstance(obj, (str, bytes)):
        raise TypeError("%s: expected numbers, got a string" % name)
    try:
        items = list(obj)
    except TypeError:
        raise TypeError("%s: expected a number or a sequence of numbers, got "
                        "%s" % (name, type(obj).__name__)) from None
    if not items:
        return (0,), []
    if all(isinstance(v, numbers.Real) for v in items):
        return (len(items),), [float(v) for v in items]
    sub_shape = None
    flat = []
    for v in items:
        s, f = _nested_shape_and_flat(v, name)
        if sub_shape is None:
            sub_shape = s
        elif s != sub_shape:
            raise ValueError("%s: ragged nested sequence (rows of shapes %s "
                             "and %s)" % (name, sub_shape, s))
        flat.extend(f)
    return (len(items),) + sub_shape, flat


def as_doubles(obj, name="array"):
    """Convert obj to a DoubleArg (see the module documentation)."""
    if isinstance(obj, DoubleArg):
        return obj
    if np is not None and isinstance(obj, np.ndarray):
        if obj.dtype == np.float64 and obj.flags["C_CONTIGUOUS"]:
            arr, copied = obj, False
        else:
            if not (np.issubdtype(obj.dtype, np.floating)
                    or np.issubdtype(obj.dtype, np.integer)
                    or obj.dtype == np.bool_):
                raise TypeError("%s: numpy array of dtype %s is not "
                                "real-valued" % (name, obj.dtype))
            arr, copied = np.ascontiguousarray(obj, dtype=np.float64), True
        return DoubleArg(arr.ctypes.data_as(_PD), arr.shape, copied, arr)
    if isinstance(obj, array.array) and obj.typecode == "d":
        n = len(obj)
        if n == 0:
            buf = (ctypes.c_double * 1)()
            return DoubleArg(ctypes.cast(buf, _PD), (0,), False, buf)
        buf = (ctypes.c_double * n).from_buffer(obj)
        return DoubleArg(ctypes.cast(buf, _PD), (n,), False, (buf, obj))
    shape, flat = _nested_shape_and_flat(obj, name)
    buf = (ctypes.c_double * max(len(flat), 1))(*flat)
    return DoubleArg(ctypes.cast(buf, _PD), shape, True, buf)


def vector(obj, n=None, name="vector"):
    """A 1-D input of length n (any length when n is None)."""
    a = as_doubles(obj, name)
    if a.ndim != 1:
        raise ValueError("%s: expected a 1-D sequence, got shape %s"
                         % (name, a.shape))
    if n is not None and a.shape[0] != n:
        raise ValueError("%s: expected length %d, got %d"
                         % (name, n, a.shape[0]))
    return a


def matrix(obj, rows, cols=None, name="matrix"):
    """A rows x cols input, nested or flat row-major."""
    if cols is None:
        cols = rows
    a = as_doubles(obj, name)
    if a.shape == (rows, cols) or (a.ndim == 1 and a.size == rows * cols):
        return a
    raise ValueError("%s: expected shape (%d, %d) or a flat length %d, got "
                     "shape %s" % (name, rows, cols, rows * cols, a.shape))


def field(obj, n, name="gradient"):
    """A per-species field of n rows and n_dim (1..3) columns. A 1-D input
    of length n means one direction. Returns (DoubleArg, n_dim, was_1d)."""
    a = as_doubles(obj, name)
    if a.ndim == 1 and a.shape[0] == n:
        return a, 1, True
    if a.ndim == 2 and a.shape[0] == n and 1 <= a.shape[1] <= 3:
        return a, a.shape[1], False
    raise ValueError("%s: expected shape (%d,) or (%d, n_dim) with n_dim 1 "
                     "to 3, got %s" % (name, n, n, a.shape))


def _nest(flat, shape):
    if len(shape) <= 1:
        return list(flat)
    step = 1
    for s in shape[1:]:
        step *= s
    return [_nest(flat[i * step:(i + 1) * step], shape[1:])
            for i in range(shape[0])]


class Output:
    """An output array of a given shape: ``ptr`` for C, ``result()`` for
    the caller (the numpy array, or a (nested) list without numpy)."""

    __slots__ = ("ptr", "shape", "_arr", "_buf")

    def __init__(self, shape, out=None, name="out"):
        self.shape = tuple(shape)
        size = 1
        for s in self.shape:
            size *= s
        self._arr = None
        self._buf = None
        if out is not None:
            if np is None or not isinstance(out, np.ndarray):
                raise TypeError("%s: must be a numpy array" % name)
            if (out.dtype != np.float64 or not out.flags["C_CONTIGUOUS"]
                    or not out.flags["WRITEABLE"]):
                raise ValueError("%s: must be a C-contiguous, writeable "
                                 "float64 array" % name)
            if out.shape != self.shape:
                raise ValueError("%s: expected shape %s, got %s"
                                 % (name, self.shape, out.shape))
            self._arr = out
            self.ptr = out.ctypes.data_as(_PD)
        elif np is not None:
            self._arr = np.empty(self.shape, dtype=np.float64)
            self.ptr = self._arr.ctypes.data_as(_PD)
        else:
            self._buf = (ctypes.c_double * max(size, 1))()
            self.ptr = ctypes.cast(self._buf, _PD)

    def result(self):
        if self._arr is not None:
            return self._arr
        size = 1
        for s in self.shape:
            size *= s
        return _nest(self._buf[:size], self.shape)


def scalar(value, name="value"):
    """A finite-or-not real scalar as a Python float (the C side checks
    finiteness and range)."""
    if isinstance(value, numbers.Real):
        return float(value)
    if np is not None and isinstance(value, np.ndarray) and value.size == 1:
        return float(value.reshape(()))
    raise TypeError("%s: expected a real number, got %s"
                    % (name, type(value).__name__))
