"""Print the directory, relative to PREFIX when inside it, into which
`meson install` should put a pure Python package so that THIS interpreter
imports it without PYTHONPATH.

Usage: python3 tools/python_install_dir.py PREFIX

Run by bindings/python/meson.build with the interpreter the package is
installed for. The interpreter's own install schemes (sysconfig) are asked
for their purelib directory; among those lying inside PREFIX and on the
interpreter's sys.path the shortest is taken (for Debian's python3 and
PREFIX=/usr/local that is lib/python3.X/dist-packages, for PREFIX=/usr
lib/python3/dist-packages). Inside a virtual environment the environment's
own site-packages. Otherwise (a prefix the interpreter does not search,
such as /opt/mcdiff) the standard layout lib/python3.X/site-packages below
PREFIX, to be added to PYTHONPATH.
"""

import os
import sys
import sysconfig


def _inside(path, prefix):
    try:
        return os.path.commonpath([path, prefix]) == prefix
    except ValueError:
        return False


def install_dir(prefix):
    prefix = os.path.normpath(os.path.abspath(prefix))
    search = {os.path.normpath(p) for p in sys.path if p}
    if sys.prefix != sys.base_prefix:  # a virtual environment
        return os.path.normpath(sysconfig.get_path("purelib"))
    found = []
    for scheme in sysconfig.get_scheme_names():
        if scheme.startswith("nt") or scheme.endswith(("_user", "_home")):
            continue
        try:
            path = os.path.normpath(sysconfig.get_path("purelib", scheme))
        except KeyError:
            continue
        if path in search and _inside(path, prefix):
            found.append(path)
    if found:
        best = min(found, key=lambda p: (p.count(os.sep), p))
    else:
        best = sysconfig.get_path("purelib", "posix_prefix",
                                  vars={"base": prefix, "platbase": prefix})
        best = os.path.normpath(best)
    return os.path.relpath(best, prefix) if _inside(best, prefix) else best


if __name__ == "__main__":
    if len(sys.argv) != 2:
        sys.exit("usage: python_install_dir.py PREFIX")
    print(install_dir(sys.argv[1]))
