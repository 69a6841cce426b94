#!/usr/bin/env python3
"""Counts per stage or per source line from the addresses tools/icount.c
wrote (RIPFILE and RIPFILE.maps), mapped through addr2line (binutils) on
the library's debug information (the default build has it).

  usage: tools/icount_report.py RIPFILE [--per B] [--lines FILE...]

Without --lines: instructions per function, where a function inlined
into the kernel's body() is named by the stage it belongs to (the frame
just inside body), so the kernel splits into its stages. --per B divides
every count by B (the blocks of the call, K / 8 on AVX-512). --lines
FILE... prints the count of every line of those source files (paths
under lib/, e.g. batched/kernel_emit.h) that executed.
"""
import argparse
import collections
import signal
import subprocess
import sys


def library_segments(maps_path):
    segs = []
    for line in open(maps_path):
        f = line.split()
        if len(f) >= 6 and "libmcdiff" in f[5]:
            lo, hi = (int(v, 16) for v in f[0].split("-"))
            segs.append((lo, hi, int(f[2], 16), f[5]))
    if not segs:
        sys.exit("icount_report: libmcdiff is not in %s" % maps_path)
    return segs


def main():
    signal.signal(signal.SIGPIPE, signal.SIG_DFL)  # | head
    ap = argparse.ArgumentParser(description=__doc__.split("\n\n")[0])
    ap.add_argument("ripfile")
    ap.add_argument("--per", type=float, default=1.0)
    ap.add_argument("--lines", nargs="+", default=None)
    a = ap.parse_args()
    segs = library_segments(a.ripfile + ".maps")
    lib = segs[0][3]
    count = collections.Counter()
    outside = 0
    for line in open(a.ripfile):
        r = int(line, 16)
        for lo, hi, off, _ in segs:
            if lo <= r < hi:
                count[r - lo + off] += 1
                break
        else:
            outside += 1
    addrs = sorted(count)
    out = subprocess.run(["addr2line", "-f", "-i", "-a", "-e", lib],
                         input="".join("%x\n" % x for x in addrs),
                         capture_output=True, text=True, check=True).stdout
    frames, cur = {}, None
    for line in out.splitlines():
        if line.startswith("0x"):
            cur = int(line, 16)
            frames[cur] = []
        elif cur is not None:
            frames[cur].append(line)
    total = sum(count.values())
    print("library %d, elsewhere %d instructions (per %g: %.1f)"
          % (total, outside, a.per, total / a.per))
    if a.lines:
        by_line = collections.Counter()
        for x in addrs:
            src = frames[x][1].split(" ")[0]
            path, _, num = src.rpartition(":")
            if num.isdigit():
                by_line[(path.split("/")[-1], int(num))] += count[x]
        for name in a.lines:
            text = open("lib/" + name).read().split("\n")
            base = name.split("/")[-1]
            for i, s in enumerate(text, 1):
                c = by_line.get((base, i), 0)
                if c:
                    print("%-20s %5d %8.1f | %s" % (base, i, c / a.per, s))
        return
    by_stage = collections.Counter()
    for x in addrs:
        funcs = frames[x][0::2]
        name = funcs[-1]
        if "body" in funcs:
            i = funcs.index("body")
            name = funcs[i - 1] if i > 0 else "body"
        by_stage[name] += count[x]
    for name, c in by_stage.most_common():
        print("%8d %9.1f  %s" % (c, c / a.per, name))


if __name__ == "__main__":
    main()
