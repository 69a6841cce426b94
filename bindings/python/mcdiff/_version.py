"""Version of the C library this package was written against.

The loader refuses a library whose major version differs (the C ABI may
change between majors). tests/python/test_native.py checks these numbers
against MCD_VERSION_MAJOR/MINOR/PATCH in include/mcdiff.h.
"""

BUILT_FOR = (0, 4, 0)
BUILT_FOR_NUMBER = BUILT_FOR[0] * 10000 + BUILT_FOR[1] * 100 + BUILT_FOR[2]
__version__ = "%d.%d.%d" % BUILT_FOR
