#!/usr/bin/env python3
"""Exported dynamic symbols of libmcdiff must equal the MCD_API functions
declared in include/mcdiff.h: nothing leaks, nothing declared is missing.
The declarations come from tools/gen_bindings.py, the project's one parser
of the header (path from MCDIFF_GEN_BINDINGS, else relative to this file)."""
import importlib.util
import os
import subprocess
import sys

lib, header = sys.argv[1], sys.argv[2]
gen_path = os.environ.get("MCDIFF_GEN_BINDINGS", os.path.join(
    os.path.dirname(os.path.abspath(__file__)), "..", "tools",
    "gen_bindings.py"))
spec = importlib.util.spec_from_file_location("gen_bindings", gen_path)
gen = importlib.util.module_from_spec(spec)
spec.loader.exec_module(gen)
declared = set(gen.parse_header(header).functions)
out = subprocess.run(["nm", "-D", "--defined-only", lib], check=True,
                     capture_output=True, text=True).stdout
exported = set()
for line in out.splitlines():
    parts = line.split()
    if len(parts) == 3 and parts[1] in ("T", "D", "B", "R"):
        exported.add(parts[2])
bad = False
for s in sorted(exported - declared):
    print(f"exported but not declared: {s}")
    bad = True
for s in sorted(declared - exported):
    print(f"declared but not exported: {s}")
    bad = True
print(f"{len(declared)} declared, {len(exported)} exported")
sys.exit(1 if bad else 0)
