#!/usr/bin/env python3
"""Independent reference section properties for plankwise, via sectionproperties.

Reference library: sectionproperties 3.10.2 (with shapely 2.2.0), pinned in
tests/reference/requirements.txt. Run from anywhere:

    python tests/reference/gen_sections.py [--out FILE]

It reads catalog/demo-us.toml, catalog/demo-si.toml and
tests/reference/shapes.toml with tomllib, parses the unit strings itself,
rebuilds every section outline and void as a shapely polygon (circles and
arcs polygonised with CIRCLE_SEGMENTS segments per full turn), meshes it with
sectionproperties, runs calculate_geometric_properties() and writes
tests/reference/sections.json:

    {"generator": ..., "sectionproperties": ..., "shapely": ...,
     "circle_segments": N,
     "sections": {"<file stem>/<section id>":
                  {"area_in2", "yb_in", "ix_in4", "perimeter_in"}}}

Nothing here is taken from the plankwise Rust code: the geometry is rebuilt
from the written conventions of the catalog format (see the family builders
below). Coordinates are inches, x across the member from its left edge, y up
from the soffit (y = 0). The one place that mirrors a plankwise convention
rather than geometry is hollow_core.keyway.area: a lumped area taken off
analytically after the meshed analysis (see keyway_area_reduction).

Geometric properties of a triangulated polygon are exact whatever the mesh
density (straight-sided quadratic elements integrate x^2, y^2 exactly), so the
mesh is coarse; the only approximation is the polygonisation of circular arcs.
With 1024 segments per turn an inscribed polygon has 6.3e-6 less area than
the circle (relative), far below 0.01 %.
"""

from __future__ import annotations

import argparse
import importlib.metadata
import json
import math
import re
import sys
import time
import tomllib
from fractions import Fraction
from pathlib import Path

import shapely
import shapely.affinity
from shapely.geometry import Polygon
from shapely.ops import unary_union

from sectionproperties.analysis.section import Section
from sectionproperties.pre.geometry import Geometry

REPO = Path(__file__).resolve().parents[2]
CATALOGS = ["catalog/demo-us.toml", "catalog/demo-si.toml", "tests/reference/shapes.toml"]
DEFAULT_OUT = "tests/reference/sections.json"

# Segments per full circle (quarter arcs get a quarter of them, semicircles half).
CIRCLE_SEGMENTS = 1024

# ------------------------------------------------------------------ units
# Lengths to inches; areas to square inches.
LENGTH_UNITS = {
    "in": 1.0, "inch": 1.0, "inches": 1.0, '"': 1.0,
    "ft": 12.0, "foot": 12.0, "feet": 12.0, "'": 12.0,
    "mm": 1.0 / 25.4,
    "cm": 10.0 / 25.4,
    "m": 1000.0 / 25.4,
}
AREA_UNITS = {
    "in2": 1.0, "in^2": 1.0, "in²": 1.0, "sq in": 1.0,
    "ft2": 144.0, "ft^2": 144.0, "ft²": 144.0,
    "mm2": 1.0 / 25.4**2, "mm^2": 1.0 / 25.4**2, "mm²": 1.0 / 25.4**2,
    "cm2": (10.0 / 25.4) ** 2, "cm^2": (10.0 / 25.4) ** 2, "cm²": (10.0 / 25.4) ** 2,
    "m2": (1000.0 / 25.4) ** 2, "m^2": (1000.0 / 25.4) ** 2, "m²": (1000.0 / 25.4) ** 2,
}

# One term: a number (decimal, "a/b" or "w-a/b") followed by a unit.
_NUM = r"[+-]?(?:\d+-\d+/\d+|\d+/\d+|\d+(?:\.\d*)?(?:[eE][+-]?\d+)?|\.\d+(?:[eE][+-]?\d+)?)"
_TERM = re.compile(r"\s*(" + _NUM + r")\s*(sq in|[A-Za-z]+(?:\^?2|²)?|\"|')\s*")


def _number(text: str) -> float:
    sign = -1 if text.startswith("-") else 1
    text = text.lstrip("+-")
    m = re.fullmatch(r"(\d+)-(\d+)/(\d+)", text)
    if m:
        whole, num, den = (int(g) for g in m.groups())
        return sign * float(whole + Fraction(num, den))
    if "/" in text:
        num, den = text.split("/")
        return sign * float(Fraction(int(num), int(den)))
    return sign * float(text)


def _quantity(text, units: dict[str, float], what: str) -> float:
    if not isinstance(text, str):
        raise ValueError(f"{what}: expected a string with a unit, got {text!r}")
    s = text.strip()
    pos, total, terms = 0, 0.0, 0
    while pos < len(s):
        m = _TERM.match(s, pos)
        if not m:
            raise ValueError(f"{what}: cannot read {text!r} at {s[pos:]!r}")
        unit = m.group(2)
        if unit not in units:
            raise ValueError(f"{what}: unknown unit {unit!r} in {text!r}")
        total += _number(m.group(1)) * units[unit]
        terms += 1
        pos = m.end()
    if terms == 0:
        raise ValueError(f"{what}: empty quantity {text!r}")
    return total


def length(text, what: str = "length") -> float:
    """A length string ("8 in", "1-1/2 in", "30 ft 6 in", "203 mm") in inches."""
    return _quantity(text, LENGTH_UNITS, what)


def area(text, what: str = "area") -> float:
    """An area string ("5 in2", "98.7 mm2") in square inches."""
    return _quantity(text, AREA_UNITS, what)


def point(p, what: str) -> tuple[float, float]:
    if len(p) != 2:
        raise ValueError(f"{what}: a point needs [x, y], got {p!r}")
    return (length(p[0], what + " x"), length(p[1], what + " y"))


# --------------------------------------------------------------- shapes
def arc(cx, cy, r, a0, a1, segments):
    """Points on a circular arc from angle a0 to a1 (radians), both ends included."""
    return [
        (cx + r * math.cos(a0 + (a1 - a0) * k / segments), cy + r * math.sin(a0 + (a1 - a0) * k / segments))
        for k in range(segments + 1)
    ]


def dedupe(pts, eps=1e-12):
    out = []
    for p in pts:
        if not out or abs(p[0] - out[-1][0]) > eps or abs(p[1] - out[-1][1]) > eps:
            out.append(p)
    if len(out) > 1 and abs(out[0][0] - out[-1][0]) <= eps and abs(out[0][1] - out[-1][1]) <= eps:
        out.pop()
    return out


def circle(cx, cy, d):
    n = CIRCLE_SEGMENTS
    r = d / 2
    return [(cx + r * math.cos(2 * math.pi * k / n), cy + r * math.sin(2 * math.pi * k / n)) for k in range(n)]


def stadium(cx, cy, w, h):
    """Overall w x h; semicircular ends on the short dimension."""
    half = CIRCLE_SEGMENTS // 2
    if h >= w:  # vertical: w x (h - w) rectangle, semicircles radius w/2 top and bottom
        r, e = w / 2, (h - w) / 2
        pts = arc(cx, cy + e, r, 0.0, math.pi, half) + arc(cx, cy - e, r, math.pi, 2 * math.pi, half)
    else:  # horizontal: (w - h) x h rectangle, semicircles radius h/2 left and right
        r, e = h / 2, (w - h) / 2
        pts = arc(cx + e, cy, r, -math.pi / 2, math.pi / 2, half) + arc(cx - e, cy, r, math.pi / 2, 1.5 * math.pi, half)
    return dedupe(pts)


def rounded_rectangle(cx, cy, w, h, r):
    if r < 0 or r > min(w, h) / 2 + 1e-12:
        raise ValueError(f"corner radius {r} does not fit a {w} x {h} rectangle")
    q = CIRCLE_SEGMENTS // 4
    ex, ey = w / 2 - r, h / 2 - r
    if r == 0:
        pts = [(cx + w / 2, cy - h / 2), (cx + w / 2, cy + h / 2), (cx - w / 2, cy + h / 2), (cx - w / 2, cy - h / 2)]
    else:
        pts = (
            arc(cx + ex, cy - ey, r, -math.pi / 2, 0.0, q)
            + arc(cx + ex, cy + ey, r, 0.0, math.pi / 2, q)
            + arc(cx - ex, cy + ey, r, math.pi / 2, math.pi, q)
            + arc(cx - ex, cy - ey, r, math.pi, 1.5 * math.pi, q)
        )
    return dedupe(pts)


def with_holes(shell, holes, name):
    """A polygon with holes that must lie strictly inside it and apart from each other."""
    outer = Polygon(shell)
    if not outer.is_valid:
        raise ValueError(f"{name}: the outline is not a simple polygon")
    hole_polys = [Polygon(h) for h in holes]
    for i, hp in enumerate(hole_polys):
        if not hp.is_valid:
            raise ValueError(f"{name}: void {i + 1} is not a simple polygon")
        if not outer.contains(hp) or outer.exterior.distance(hp) <= 0:
            raise ValueError(f"{name}: void {i + 1} is not strictly inside the outline")
        for j in range(i):
            if hp.distance(hole_polys[j]) <= 0:
                raise ValueError(f"{name}: voids {j + 1} and {i + 1} touch or overlap")
    poly = Polygon(shell, holes)
    if not poly.is_valid:
        raise ValueError(f"{name}: invalid polygon with voids")
    return poly


# -------------------------------------------------------------- families
class Built:
    """A section polygon plus an optional lumped area reduction (a, centroid height)."""

    def __init__(self, polygon: Polygon, lumped: tuple[float, float] | None = None):
        self.polygon = polygon
        self.lumped = lumped


def build_hollow_core(hc, name) -> Built:
    width = length(hc["width"], name + " width")
    depth = length(hc["depth"], name + " depth")
    cores = hc["cores"]
    count = int(cores["count"])
    spacing = length(cores["spacing"], name + " cores.spacing")
    cy = length(cores["center_height"], name + " cores.center_height") if "center_height" in cores else depth / 2
    shape = cores["shape"]

    keyway = hc.get("keyway", {})
    if "profile" in keyway:
        left = [point(p, name + " keyway.profile") for p in keyway["profile"]]
        # profile is (inset, height) from soffit to top; left face at x = inset,
        # right face mirrored at x = width - inset. Outline: left face top to
        # bottom, then right face bottom to top.
        shell = [(x, y) for (x, y) in reversed(left)] + [(width - x, y) for (x, y) in left]
        shell = dedupe(shell)
    else:
        shell = [(0.0, 0.0), (width, 0.0), (width, depth), (0.0, depth)]

    holes = []
    for i in range(count):
        cx = width / 2 + (i - (count - 1) / 2) * spacing
        if shape == "circle":
            holes.append(circle(cx, cy, length(cores["diameter"], name + " cores.diameter")))
        elif shape in ("stadium", "oval"):
            holes.append(stadium(cx, cy, length(cores["width"], name + " cores.width"), length(cores["height"], name + " cores.height")))
        elif shape == "rounded-rectangle":
            holes.append(
                rounded_rectangle(
                    cx,
                    cy,
                    length(cores["width"], name + " cores.width"),
                    length(cores["height"], name + " cores.height"),
                    length(cores["corner_radius"], name + " cores.corner_radius"),
                )
            )
        else:
            raise ValueError(f"{name}: unknown core shape {shape!r}")

    lumped = None
    if "area" in keyway:
        a = area(keyway["area"], name + " keyway.area")
        c = length(keyway["center_height"], name + " keyway.center_height") if "center_height" in keyway else depth / 2
        lumped = (a, c)
    return Built(with_holes(shell, holes, name), lumped)


def build_double_tee(dt, name) -> Built:
    B = length(dt["flange_width"], name + " flange_width")
    tf = length(dt["flange_thickness"], name + " flange_thickness")
    h = length(dt["depth"], name + " depth")
    n = int(dt.get("stems", 2))
    s = length(dt["stem_spacing"], name + " stem_spacing")
    wt = length(dt["stem_width_top"], name + " stem_width_top")
    wb = length(dt["stem_width_bottom"], name + " stem_width_bottom")
    c = length(dt["chamfer"], name + " chamfer") if "chamfer" in dt else 0.0
    hs = h - tf  # stem height, soffit to underside of the flange
    slope = (wt - wb) / 2 / hs  # outward movement of a side face per unit height

    parts = [Polygon([(0.0, hs), (B, hs), (B, h), (0.0, h)])]
    for i in range(n):
        x = B / 2 + (i - (n - 1) / 2) * s
        if c > 0:
            stem = [
                (x - (wb / 2 - c), 0.0),
                (x + (wb / 2 - c), 0.0),
                (x + (wb / 2 + slope * c), c),
                (x + wt / 2, hs),
                (x - wt / 2, hs),
                (x - (wb / 2 + slope * c), c),
            ]
        else:
            stem = [(x - wb / 2, 0.0), (x + wb / 2, 0.0), (x + wt / 2, hs), (x - wt / 2, hs)]
        parts.append(Polygon(stem))
    poly = unary_union(parts)
    if poly.geom_type != "Polygon" or len(poly.interiors) != 0:
        raise ValueError(f"{name}: the flange and stems do not form one solid polygon ({poly.geom_type})")
    # drop collinear points left by the union
    poly = shapely.simplify(poly, 0.0)
    return Built(poly)


def build_generic(g, name) -> Built:
    shell = [point(p, name + " outline") for p in g["outline"]]
    holes = []
    for k, v in enumerate(g.get("void", [])):
        what = f"{name} void {k + 1}"
        if "points" in v:
            holes.append([point(p, what) for p in v["points"]])
        else:
            cx, cy = point(v["center"], what + " center")
            holes.append(circle(cx, cy, length(v["diameter"], what + " diameter")))
    return Built(with_holes(shell, holes, name))


FAMILIES = {"hollow_core": build_hollow_core, "double_tee": build_double_tee, "generic": build_generic}


# ------------------------------------------------------------- analysis
def keyway_area_reduction(A, yb, Ix, a, c):
    """Take a lumped area a with centroid height c off (A, yb, Ix).

    This mirrors plankwise's convention for keyway.area (it is not geometry):
    with Q = A*yb and I0 = Ix + A*yb^2 about the soffit, subtract a, a*c, a*c^2
    and recompute the centroid and the centroidal moment.
    """
    Q = A * yb
    I0 = Ix + A * yb * yb
    A2 = A - a
    Q2 = Q - a * c
    I02 = I0 - a * c * c
    yb2 = Q2 / A2
    return A2, yb2, I02 - A2 * yb2 * yb2


def analyse(built: Built, name: str) -> dict[str, float]:
    poly = built.polygon
    miny = poly.bounds[1]
    if abs(miny) > 1e-9:
        # y is measured from the soffit: put the lowest point at y = 0
        poly = shapely.affinity.translate(poly, 0.0, -miny)
    geom = Geometry(poly)
    # Any triangulation gives exact geometric properties of the polygon; cap the
    # element area only loosely and skip quality refinement to keep it quick.
    geom.create_mesh(mesh_sizes=poly.area / 20, coarse=True)
    sec = Section(geom)
    sec.calculate_geometric_properties()
    A = sec.get_area()
    yb = sec.get_c()[1]
    Ix = sec.get_ic()[0]
    perimeter = sec.get_perimeter()
    # cross-checks with shapely's exact polygon integrals
    if abs(A - poly.area) > 1e-9 * poly.area or abs(yb - poly.centroid.y) > 1e-9 * max(1.0, poly.bounds[3]):
        raise RuntimeError(f"{name}: meshed area/centroid disagree with the polygon's")
    if abs(perimeter - poly.exterior.length) > 1e-9 * perimeter:
        raise RuntimeError(f"{name}: perimeter disagrees with the outline length")
    if built.lumped is not None:
        A, yb, Ix = keyway_area_reduction(A, yb, Ix, *built.lumped)
    return {"area_in2": float(A), "yb_in": float(yb), "ix_in4": float(Ix), "perimeter_in": float(perimeter)}


def generate() -> dict:
    sections = {}
    for rel in CATALOGS:
        path = REPO / rel
        with open(path, "rb") as f:
            cat = tomllib.load(f)
        for sec in cat.get("section", []):
            key = f"{path.stem}/{sec['id']}"
            fams = [k for k in FAMILIES if k in sec]
            if len(fams) != 1:
                raise ValueError(f"{key}: needs exactly one of {list(FAMILIES)}, has {fams}")
            if key in sections:
                raise ValueError(f"{key}: duplicate section id")
            sections[key] = analyse(FAMILIES[fams[0]](sec[fams[0]], key), key)
    sp_version = importlib.metadata.version("sectionproperties")
    return {
        "generator": f"tests/reference/gen_sections.py (sectionproperties {sp_version}, shapely {shapely.__version__})",
        "sectionproperties": sp_version,
        "shapely": shapely.__version__,
        "circle_segments": CIRCLE_SEGMENTS,
        "sections": sections,
    }


def write(data: dict, out: Path) -> None:
    out.parent.mkdir(parents=True, exist_ok=True)
    # json writes floats with repr(), i.e. the shortest round-tripping form
    out.write_text(json.dumps(data, indent=2, sort_keys=True) + "\n", encoding="utf-8")


def main(argv=None) -> int:
    ap = argparse.ArgumentParser(description=__doc__.splitlines()[0])
    ap.add_argument("--out", default=DEFAULT_OUT, help=f"output JSON (default {DEFAULT_OUT}, relative to the repo root)")
    args = ap.parse_args(argv)
    out = Path(args.out)
    if not out.is_absolute():
        out = REPO / out
    t0 = time.perf_counter()
    data = generate()
    write(data, out)
    dt = time.perf_counter() - t0
    print(
        f"gen_sections: {len(data['sections'])} sections from {len(CATALOGS)} catalogs -> {out} "
        f"(sectionproperties {data['sectionproperties']}, {CIRCLE_SEGMENTS} segments/circle, {dt:.1f} s)"
    )
    return 0


if __name__ == "__main__":
    sys.exit(main())
