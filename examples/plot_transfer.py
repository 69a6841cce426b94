#!/usr/bin/env python3
"""Plot two multicomponent mass-transfer cases computed by mcdiff.

Left: composition profiles in a Stefan tube, acetone (1) and methanol (2)
evaporating into stagnant air (3) - the Carty and Schrodt (1975)
experiment with the data used by Taylor and Krishna (1993, ch. 8), all
numbers from memory, as in tests/test_film.c.

Middle and right: the Duncan and Toor (1962) two-bulb experiment with
H2 / N2 / CO2 - data as in tests/test_bulbs.c (from memory) - integrated
with the exact quasi-steady film flux (solid) and by the linearized theory
(dashed). Nitrogen first diffuses with no gradient of its own (osmotic),
then against it (reverse), stops with a gradient (barrier) and finally
relaxes normally.

Usage:
    python3 examples/plot_transfer.py [--output FILE.png]   (default:
        examples/transfer.png beside this script)
    python3 examples/plot_transfer.py --check   (draw into a temporary
        file, check it is a PNG under 200 kB, remove it; used by meson)
Needs matplotlib (Agg backend); exits 77 with the reason when it is
missing. The mcdiff package and its library are found as described in
bindings/python/mcdiff/_native.py (MCDIFF_LIBRARY, build tree, ...).
"""

import argparse
import math
import os
import sys
import tempfile

HERE = os.path.dirname(os.path.abspath(__file__))
try:
    import mcdiff
except ImportError:
    sys.path.insert(0, os.path.join(os.path.dirname(HERE), "bindings",
                                    "python"))
    import mcdiff

MAX_BYTES = 200 * 1024

# Carty and Schrodt (1975) Stefan tube (from memory, see above).
CS_T, CS_P, CS_L = 328.5, 99.4e3, 0.238           # K, Pa, m
CS_D = [[0.0, 8.48e-6, 13.72e-6], [8.48e-6, 0.0, 19.91e-6],
        [13.72e-6, 19.91e-6, 0.0]]                  # m^2/s
CS_X0 = [0.319, 0.528, 0.153]                       # liquid surface
CS_XL = [0.0, 0.0, 1.0]                             # top of the tube

# Duncan and Toor (1962) two-bulb cell (from memory, see above).
DT_D = [[0.0, 83.3e-6, 68.0e-6], [83.3e-6, 0.0, 16.8e-6],
        [68.0e-6, 16.8e-6, 0.0]]                    # m^2/s
DT_X1 = [0.0, 0.50086, 0.49914]                     # bulb 1: N2 + CO2
DT_X2 = [0.50121, 0.49879, 0.0]                     # bulb 2: H2 + N2
DT_T, DT_P = 308.35, 101325.0                       # K, Pa
DT_L, DT_DIAM = 85.9e-3, 2.08e-3                    # m
DT_V1, DT_V2 = 77.99e-6, 78.63e-6                   # m^3


def tolist(a):
    return a.tolist() if hasattr(a, "tolist") else a


def stefan_tube():
    c = mcdiff.ideal_gas_c(CS_T, CS_P)
    res = mcdiff.film_solve(CS_D, c, CS_L, CS_X0, CS_XL, "stagnant",
                            species=2)
    z = [CS_L * k / 100 for k in range(101)]
    X = tolist(mcdiff.film_profile(CS_D, c, CS_L, CS_X0, res.N, z))
    return tolist(res.N), z, X


def two_bulbs():
    c = mcdiff.ideal_gas_c(DT_T, DT_P)
    A = math.pi / 4 * DT_DIAM ** 2
    t = [600.0 * k for k in range(0, 145)]           # 0 .. 24 h
    x1, x2 = mcdiff.bulbs_integrate(DT_D, c, DT_V1, DT_V2, A, DT_L, DT_X1,
                                    DT_X2, t, 1e-9)
    l1, l2 = mcdiff.bulbs_linearized(DT_D, c, DT_V1, DT_V2, A, DT_L, DT_X1,
                                     DT_X2, t)
    x1, x2, l1, l2 = tolist(x1), tolist(x2), tolist(l1), tolist(l2)
    # N2 phases from the exact capillary flux
    ws = mcdiff.Workspace(3)
    phases = []
    for k in range(len(t)):
        N = tolist(mcdiff.film_solve(DT_D, c, DT_L, x1[k], x2[k],
                                     "equimolar", workspace=ws).N)
        g = [(b - a) / DT_L for a, b in zip(x1[k], x2[k])]
        phases.append(mcdiff.flux_diagnose(g, N, 0.01)[1])
    ws.close()
    return [v / 3600 for v in t], x1, x2, l1, l2, phases


def draw(path):
    import matplotlib
    matplotlib.use("Agg")
    import matplotlib.pyplot as plt

    N, z, X = stefan_tube()
    th, x1, x2, l1, l2, phases = two_bulbs()
    names_cs = ["acetone", "methanol", "air"]
    names_dt = ["H$_2$", "N$_2$", "CO$_2$"]
    colours = ["tab:blue", "tab:orange", "tab:green"]

    fig, ax = plt.subplots(1, 3, figsize=(13.5, 4.2))
    a = ax[0]
    zmm = [v * 1e3 for v in z]
    for i in range(3):
        a.plot(zmm, [r[i] for r in X], color=colours[i], label=names_cs[i])
    a.set_xlabel("height above the liquid z [mm]")
    a.set_ylabel("mole fraction [-]")
    a.set_title("Stefan tube (Carty-Schrodt data)\n"
                "N$_1$ = %.3g, N$_2$ = %.3g mmol/(m$^2$ s)"
                % (N[0] * 1e3, N[1] * 1e3), fontsize=10)
    a.set_xlim(0, CS_L * 1e3)
    a.set_ylim(0, 1)
    a.legend(loc="center right", fontsize=9)
    a.grid(alpha=0.3)

    a = ax[1]
    for i in range(3):
        a.plot(th, [r[i] for r in x1], color=colours[i],
               label="%s bulb 1" % names_dt[i])
        a.plot(th, [r[i] for r in x2], color=colours[i], alpha=0.55,
               label="%s bulb 2" % names_dt[i])
        a.plot(th, [r[i] for r in l1], color=colours[i], ls="--", lw=0.9)
        a.plot(th, [r[i] for r in l2], color=colours[i], ls="--", lw=0.9,
               alpha=0.55)
    a.set_xlabel("time [h]")
    a.set_ylabel("mole fraction [-]")
    a.set_title("Two-bulb cell (Duncan-Toor data)\n"
                "solid: exact film flux, dashed: linearized", fontsize=10)
    a.set_xlim(0, th[-1])
    a.set_ylim(0, 0.62)
    a.legend(fontsize=7, ncol=3, loc="lower center")
    a.grid(alpha=0.3)

    a = ax[2]
    a.plot(th, [r[1] for r in x1], color="tab:orange", label="N$_2$ bulb 1")
    a.plot(th, [r[1] for r in x2], color="tab:orange", alpha=0.55,
           label="N$_2$ bulb 2")
    a.plot(th, [r[1] for r in l1], color="tab:orange", ls="--", lw=0.9)
    a.plot(th, [r[1] for r in l2], color="tab:orange", ls="--", lw=0.9,
           alpha=0.55)
    # shade the phases of the exact solution
    rev = [th[k] for k, f in enumerate(phases) if mcdiff.Diag.REVERSE in f]
    if rev:
        a.axvspan(min(rev), max(rev), color="tab:red", alpha=0.08,
                  label="reverse diffusion")
    bar = [th[k] for k, f in enumerate(phases) if mcdiff.Diag.BARRIER in f]
    for k, tb in enumerate(bar):
        a.axvline(tb, color="tab:red", lw=0.8, ls=":",
                  label="diffusion barrier" if k == 0 else None)
    a.axvline(0, color="tab:purple", lw=2.0, label="osmotic (t = 0)")
    a.set_xlabel("time [h]")
    a.set_ylabel("mole fraction of N$_2$ [-]")
    a.set_title("Nitrogen: osmotic, reverse, barrier", fontsize=10)
    a.set_xlim(0, th[-1])
    lo = min(min(r[1] for r in x1), min(r[1] for r in l1))
    hi = max(max(r[1] for r in x2), max(r[1] for r in l2))
    a.set_ylim(lo - 0.01, hi + 0.065)
    a.legend(fontsize=8, loc="upper right", ncol=2)
    a.grid(alpha=0.3)

    fig.suptitle("mcdiff %s: multicomponent mass transfer (SI units)"
                 % mcdiff.version_string(), fontsize=11)
    fig.tight_layout()
    fig.savefig(path, dpi=90)
    plt.close(fig)


def main(argv=None):
    p = argparse.ArgumentParser(description=__doc__.split("\n\n")[0])
    p.add_argument("--output", default=os.path.join(HERE, "transfer.png"),
                   help="PNG file to write (default: %(default)s)")
    p.add_argument("--check", action="store_true",
                   help="draw to a temporary file and check it (for tests)")
    args = p.parse_args(argv)
    try:
        import matplotlib  # noqa: F401
    except ImportError:
        print("SKIP: matplotlib is not available for %s" % sys.executable)
        return 77
    if args.check:
        with tempfile.TemporaryDirectory() as d:
            path = os.path.join(d, "transfer.png")
            draw(path)
            with open(path, "rb") as f:
                head = f.read(8)
            size = os.path.getsize(path)
            if head != b"\x89PNG\r\n\x1a\n":
                print("FAIL: %s is not a PNG file" % path)
                return 1
            if size >= MAX_BYTES:
                print("FAIL: %s is %d bytes (limit %d)" % (path, size,
                                                          MAX_BYTES))
                return 1
            print("ok: PNG of %d bytes" % size)
        return 0
    draw(args.output)
    print("wrote %s (%d bytes)" % (args.output, os.path.getsize(args.output)))
    return 0


if __name__ == "__main__":
    sys.exit(main())
