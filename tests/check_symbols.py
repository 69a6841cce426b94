#!/usr/bin/env python3
"""Exported dynamic symbols of libmcdiff must equal the MCD_API functions
declared in include/mcdiff.h: nothing leaks, nothing declared is missing."""
import re
import subprocess
import sys

lib, header = sys.argv[1], sys.argv[2]
text = open(header, encoding="utf-8").read()
declared = set(re.findall(r"MCD_API\s+[^;(]*?\b(mcd_\w+)\s*\(", text, re.S))
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
