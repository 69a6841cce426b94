#!/usr/bin/env python3
"""check_layers.py - the library's layering, checked from its sources.

lib/ holds one folder per layer. A file may include the public header
(mcdiff.h), system headers, and library headers of its own layer or of a
lower one, always written with the folder ("base/workspace.h"). Layers of
the same rank (batched, transfer) do not include each other.

Also checked, because the contributor guide promises them:
  - no function in lib/ is longer than MAX_LINES lines (from the line of
    its name to its closing brace), except those listed in LONG_OK with
    the reason;
  - every .c and .h under lib/ sits in a known layer folder.

Usage: check_layers.py [--root DIR]; exit 0 and one summary line when all
hold, else one line per violation and exit 1.
"""
import argparse
import os
import re
import sys

# rank of each layer folder: a file may include headers of a lower rank or
# of its own folder
RANK = {
    "base": 0,     # status, version, workspace messages, checks, composition, ISA
    "data": 1,     # elements, formulas, species table, databases
    "props": 2,    # binary diffusivities, mixtures
    "flux": 3,     # single-state flux core
    "liquid": 3,   # activity models, thermodynamic factors, liquid diffusivities
    "batched": 4,  # batched fluxes and their kernels
    "transfer": 4, # films, two bulbs
    "porous": 4,   # pore structure, Knudsen, Dusty Gas Model
    "api": 5,      # constructors that size every layer's scratch
}
MAX_LINES = 150
# functions allowed to be longer, with the reason (keep this list short)
LONG_OK = {}

INCLUDE = re.compile(r'^\s*#\s*include\s+"([^"]+)"', re.M)
FUNC_START = re.compile(r'^(?:[A-Za-z_][\w \*]*?)\b([A-Za-z_]\w*)\s*\(')


def lib_files(root):
    out = []
    for dirpath, _, names in os.walk(os.path.join(root, "lib")):
        for n in sorted(names):
            if n.endswith((".c", ".h")):
                out.append(os.path.join(dirpath, n))
    return sorted(out)


def check_includes(root, path, problems):
    rel = os.path.relpath(path, os.path.join(root, "lib"))
    parts = rel.split(os.sep)
    if len(parts) != 2 or parts[0] not in RANK:
        problems.append("%s: not in a layer folder (%s)" % (rel, ", ".join(RANK)))
        return
    layer = parts[0]
    text = open(path, encoding="utf-8").read()
    for m in INCLUDE.finditer(text):
        inc = m.group(1)
        line = text.count("\n", 0, m.start()) + 1
        if inc == "mcdiff.h":
            continue
        if "/" not in inc:
            problems.append("lib/%s:%d: includes \"%s\" without its layer folder"
                            % (rel, line, inc))
            continue
        other = inc.split("/")[0]
        if other not in RANK:
            problems.append("lib/%s:%d: includes \"%s\" from an unknown folder"
                            % (rel, line, inc))
            continue
        if not os.path.exists(os.path.join(root, "lib", inc)):
            problems.append("lib/%s:%d: includes \"%s\", which does not exist"
                            % (rel, line, inc))
            continue
        if other != layer and RANK[other] >= RANK[layer]:
            problems.append("lib/%s:%d: layer %s includes \"%s\" of layer %s "
                            "(same or higher rank)" % (rel, line, layer, inc, other))


def check_lengths(root, path, problems):
    rel = os.path.relpath(path, root)
    lines = open(path, encoding="utf-8").read().split("\n")
    i = 0
    while i < len(lines):
        if lines[i] == "{":
            j = i - 1
            while j > 0 and not FUNC_START.match(lines[j]):
                j -= 1
            m = FUNC_START.match(lines[j])
            name = m.group(1) if m else "?"
            k = i + 1
            while k < len(lines) and lines[k] != "}":
                k += 1
            n = k - j + 1
            if n > MAX_LINES and name not in LONG_OK:
                problems.append("%s:%d: function %s is %d lines (> %d)"
                                % (rel, j + 1, name, n, MAX_LINES))
            i = k
        i += 1


def main():
    ap = argparse.ArgumentParser(description=__doc__.split("\n")[0])
    ap.add_argument("--root", default=os.path.join(os.path.dirname(__file__), ".."))
    args = ap.parse_args()
    root = os.path.abspath(args.root)
    problems = []
    files = lib_files(root)
    for f in files:
        check_includes(root, f, problems)
        check_lengths(root, f, problems)
    for p in problems:
        print(p)
    if problems:
        print("check_layers: %d problem(s) in %d files" % (len(problems), len(files)))
        return 1
    print("check_layers: %d files in %d layers, includes follow the layers, "
          "no function over %d lines" % (len(files), len(RANK), MAX_LINES))
    return 0


if __name__ == "__main__":
    sys.exit(main())
