#!/usr/bin/env python3
"""Independent reference moment and shear diagrams for plankwise, via pycba.

Reference library: pycba 1.0.2 (Python Continuous Beam Analysis, direct
stiffness method), pinned in tests/reference/requirements.txt. Run from anywhere:

    python tests/reference/gen_beams.py [--out FILE]

For each beam in BEAMS below -- a span on two supports with an overhang at
either end or none, carrying uniform loads over the whole member, uniform
loads over part of it and point loads -- pycba analyses the member as a
chain of elements (overhang, span, overhang) with pinned supports at the
bearing centres and free tips, and the script writes

  reactions    the two support reactions, upward positive (lbf)
  points       moment (lbf-in, sagging positive) and shear (lbf) at every
               result point pycba gives, x measured from the left support
               (plankwise's origin), leaving out the points within 1e-6 in
               of a support or a point load (where the shear steps and
               either side is "the" value)

to tests/reference/beams.json (sorted keys, floats in full precision).

Units: inches and pounds-force. Signs: pycba takes downward loads as
positive and gives moments sagging positive, as plankwise does; its shear is
the force on the left face of a cut positive upward -- plankwise's sign too
(the test checks this on the closed forms first). EI does not enter the
statics of a member on two supports; it is set to 1e9 lbf-in2.
"""

from __future__ import annotations

import argparse
import json
from pathlib import Path

import numpy as np
import pycba as cba

HERE = Path(__file__).resolve().parent

# Each beam: span l, overhangs (left, right), and loads in plankwise's form:
#   ("span", w, a, b)   uniform w (lbf/in, down) from a to b (in from the left support)
#   ("point", p, a)     force p (lbf, down) at a
BEAMS = {
    "simple-span-point-patch-uniform": {
        "l": 288.0,
        "overhang": [0.0, 0.0],
        "loads": [("span", 2.0, 0.0, 288.0), ("point", 3000.0, 100.0), ("span", 5.0, 60.0, 180.0)],
    },
    "simple-span-two-points": {
        "l": 360.0,
        "overhang": [0.0, 0.0],
        "loads": [("point", 4000.0, 90.0), ("point", 2500.0, 250.0)],
    },
    "right-overhang-tip-load": {
        "l": 300.0,
        "overhang": [0.0, 60.0],
        "loads": [("span", 2.5, 0.0, 360.0), ("point", 1500.0, 360.0), ("span", 4.0, 320.0, 350.0)],
    },
    "both-overhangs": {
        "l": 300.0,
        "overhang": [48.0, 36.0],
        "loads": [
            ("span", 3.0, -48.0, 336.0),
            ("point", 2000.0, -40.0),
            ("point", 5000.0, 140.0),
            ("span", 6.0, 250.0, 320.0),
        ],
    },
    "patch-across-a-support": {
        "l": 240.0,
        "overhang": [0.0, 72.0],
        "loads": [("span", 8.0, 200.0, 290.0), ("point", 1200.0, 30.0)],
    },
}


def analyse(spec):
    """pycba's reactions and (x, M, V) points for one beam, x from the left support."""
    l = spec["l"]
    a1, a2 = spec["overhang"]
    # the elements: left overhang, span, right overhang (those that exist)
    starts, lengths = [], []
    if a1 > 0:
        starts.append(-a1)
        lengths.append(a1)
    starts.append(0.0)
    lengths.append(l)
    if a2 > 0:
        starts.append(l)
        lengths.append(a2)
    nodes = [starts[0]] + [s + L for s, L in zip(starts, lengths)]
    # pinned at the bearing centres (x = 0 and x = l), free elsewhere
    R = []
    for x in nodes:
        R += ([-1, 0] if abs(x) < 1e-12 or abs(x - l) < 1e-12 else [0, 0])
    LM = []
    for ld in spec["loads"]:
        if ld[0] == "point":
            _, p, at = ld
            for i, (s, L) in enumerate(zip(starts, lengths)):
                # a load exactly on a node goes to the element on its left (or the first)
                if s - 1e-12 <= at <= s + L + 1e-12:
                    LM.append([i + 1, 2, p, at - s])
                    break
        else:
            _, w, a, b = ld
            for i, (s, L) in enumerate(zip(starts, lengths)):
                lo, hi = max(a, s), min(b, s + L)
                if hi - lo > 1e-12:
                    if abs(lo - s) < 1e-12 and abs(hi - s - L) < 1e-12:
                        LM.append([i + 1, 1, w])
                    else:
                        LM.append([i + 1, 3, w, lo - s, hi - lo])
    beam = cba.BeamAnalysis(lengths, 1.0e9, R, LM)
    beam.npts = 200
    beam.analyze()
    res = beam.beam_results
    reactions = [float(r) for r in res.R]
    # every member's own result points (x from the left tip), shifted to plankwise's origin
    skip = [0.0, l] + [ld[2] for ld in spec["loads"] if ld[0] == "point"]
    points = []
    for mr in res.vRes:
        for x, m, v in zip(mr.x, mr.M, mr.V):
            gx = float(x) + starts[0]
            if any(abs(gx - k) < 1e-6 for k in skip):
                continue
            points.append({"x_in": gx, "m_lbin": float(m), "v_lbf": float(v)})
    return reactions, points


def main(argv=None) -> int:
    ap = argparse.ArgumentParser(description=__doc__.splitlines()[0])
    ap.add_argument("--out", default=str(HERE / "beams.json"), help="output file (default: beams.json beside this script)")
    args = ap.parse_args(argv)
    out = {
        "library": f"pycba {cba.__version__ if hasattr(cba, '__version__') else '1.0.2'}",
        "units": "in, lbf; x from the left support; moments sagging positive; shear on the left face, upward positive",
        "beams": {},
    }
    for name, spec in BEAMS.items():
        reactions, points = analyse(spec)
        out["beams"][name] = {
            "l_in": spec["l"],
            "overhang_in": spec["overhang"],
            "loads": [
                {"kind": ld[0], "p_lbf": ld[1], "a_in": ld[2]} if ld[0] == "point" else {"kind": "span", "w_lbf_per_in": ld[1], "a_in": ld[2], "b_in": ld[3]}
                for ld in spec["loads"]
            ],
            "reactions_lbf": reactions,
            "points": points,
        }
    Path(args.out).write_text(json.dumps(out, indent=1, sort_keys=True) + "\n", encoding="utf-8")
    print(f"gen_beams: wrote {len(out['beams'])} beams to {args.out}")
    return 0


if __name__ == "__main__":
    raise SystemExit(main())
