#!/usr/bin/env python3
"""Independent reference flexure values for plankwise, via concreteproperties.

Reference library: concreteproperties 0.7.0 (on sectionproperties 3.10.2), pinned
in tests/reference/requirements.txt. Run from anywhere:

    python tests/reference/gen_flexure.py [--out FILE]

For each member in MEMBERS below it rebuilds the section from the committed
catalog with the geometry builders of gen_sections.py (which match plankwise's
section properties to 1e-6), adds the strands plankwise places at midspan,
and asks concreteproperties (PrestressedSection) for

  mn_kipft      nominal flexural strength, sagging (top in compression):
                strain compatibility, rectangular stress block, no concrete
                tension (library: ultimate_normal_force_convergence /
                calculate_ultimate_section_actions)
  mcr_kipft     cracking moment (library: calculate_cracking_moment), untopped
  f_bottom_psi, f_top_psi
                uncracked fibre stresses under prestress plus the service
                moment m_service_total_kipft (library: calculate_uncracked_stress),
                compression positive as in plankwise, untopped only

and writes tests/reference/flexure.json (sorted keys, floats in full precision).

Units: inches and kips throughout (stresses in ksi, moments in kip-in inside
the library; the JSON gives kip-ft and psi like plankwise's --json).

Inputs: the geometry comes from catalog/demo-us.toml; the prestress state comes
from plankwise, hard-coded in MEMBERS (fse_ksi, the strand list at midspan, the
service moment) as `plankwise check --json` printed them at this commit --
plankwise's losses and load combinations are not what is being checked here.
The concrete values (f'c, Ec, fr, beta1) are recomputed from the catalog mix with
the ACI formulas and must equal the hard-coded plankwise inputs.

What concreteproperties does differently from plankwise, and how it is handled
-----------------------------------------------------------------------------
The reference values (`mn_kipft`, `mcr_kipft`, `f_*_psi`) model plankwise's
problem as closely as the library allows. Every departure from the library's
native behaviour is listed here; the library-native alternative is computed too
and stored per member under "variants", so each effect can be read off the
JSON. Effects quoted as (variant - reference)/reference over the five members
at this commit.

1. Decompression strain eps2 is ignored. The library's ultimate analysis sets
   the strand strain to the concrete strain at the strand plus the strand's
   "prestress strain" = profile^-1(prestress_stress) ("N.B. ignore eps_ce" in
   concrete_section.py); plankwise adds eps2 = (Pe/A + Pe e e_i / I)/Ec
   (2.2e-4 to 3.6e-4 here). The library uses the prestress stress at ultimate
   only through that strain, so for `mn_kipft` each strand gets its own
   SteelStrand material whose prestress_stress is the profile stress at
   fse/Eps + eps2_i; the library then reads back exactly that strain. eps2_i is
   the library's own uncracked concrete stress at the strand under prestress
   alone (gross model, note 5) divided by Ec.
   Variant `mn_no_eps2_kipft` (prestrain fse/Eps, no eps2):
   -0.85e-3 to -1.43e-3 on the planks; 0 on the tee (all strands at fpu).
2. The prestrain is read back through the non-linear strand curve:
   profile^-1(fse) is ~0.9 % larger than fse/Eps at fse ~ 170 ksi. Handled by 1.
   Variant `mn_library_prestrain_kipft` (prestress_stress = fse: the library's
   native use, effects 1 and 2 together): -0.68e-3 to -1.26e-3 on the planks,
   0 on the tee.
3. Strand curve constants. StrandPCI1992 derives the Devalapura-Tadros
   constants from its inputs: C = E/(ratio fpy), A = E (fpu - ratio fpy) /
   (eps_u E - ratio fpy), B = E - A, and D such that the stress at 1 % strain is
   fpy. For the reference the inputs make them plankwise's 887 / 27613 / 112.4 /
   7.36 exactly: E = 28500 ksi, fpu = 270 ksi, bilinear_yield_ratio =
   28500/(112.4 fpy), fracture_strain from A = 887 (0.027433), and
   yield_strength = the formula's own stress at 1 % strain, 243.04 ksi (the
   round 243 would give D = 7.345). The curve is sampled densely
   (STRAND_N_POINTS); the piecewise-linear profile is within 1.2e-4 ksi of the
   formula everywhere.
   Variant `mn_pci1992_default_kipft`: StrandPCI1992 with the literal inputs
   fpy = 243 ksi (0.9 fpu), default bilinear_yield_ratio 1.04 and sampling,
   fracture_strain 0.035 (the library docs' value) -- constants A 661.2,
   B 27838.8, C 112.77, D 7.70 -- with the plateau of 4 and the library's
   prestrain: -0.71e-2 to -1.41e-2 on the planks (the curve is up to 3.3 ksi
   lower between 1.2 % and 3 % strain); -3e-6 on the tee.
4. No cap at fpu past the fracture strain. StrandPCI1992's points end at
   fracture_strain and scipy's interp1d *extrapolates* past the last segment, so
   the stress keeps rising above fpu; the library does not check strand
   rupture. plankwise caps fps at fpu = 270 ksi, so the reference profile is a
   StrandProfile made of the StrandPCI1992 points, a point (0.027442, 270) where
   the formula reaches fpu, and a plateau at fpu to a strain of 1.
   Variant `mn_raw_pci1992_kipft` (raw StrandPCI1992, constants as in 3,
   default sampling, no plateau, library prestrain): -0.8e-3 to -1.3e-3 on the
   planks (strains < 0.0274), +11.9 % on the tee, whose strand strains are
   0.056 to 0.084 and read 295 to 320 ksi.
5. Transformed vs gross section for Mcr and service stresses. The library's
   "gross" properties are transformed: concrete less the strand holes plus the
   strands at Eps/Ec. plankwise uses the gross concrete section. The
   reference's service model gives the strands E = Ec, so hole plus strand is
   the gross concrete.
   Variants `mcr_transformed_kipft`, `f_bottom_transformed_psi`,
   `f_top_transformed_psi` (strands at Eps): Mcr -1.3e-4 to +5.8e-3; bottom
   fibre -4.8 % to -5.9 %; top fibre +0.24 % to +1.08 %.
6. keyway.area (a lumped area taken off at a height; a plankwise convention,
   not geometry; plank-12in and plank-16in) cannot be given to the library as a
   point area. It is modelled as one slot per web, 0.9 of the web's width, all
   of one height, centred on the keyway centre height, total area =
   keyway.area: the same A and yb as the lumped convention; Ix smaller by the
   slots' own moment of inertia, recorded as `keyway_slot_own_ix_in4` (0.13 and
   0.25 in4, 2e-5 of Ix). The slots are at mid-depth, far below the compression
   zone, so they do not enter Mn.
7. Strand bars. pre.add_bar draws a strand as a 4-point "circle" whose
   irrational vertices CPGeom rounds to 6 decimals, losing 2.4e-6 of a 0.153 in2
   strand's area (so of Pe and of the strand force). The bars here are
   0.5 in x 2a rectangles that survive the rounding (see build_section). The
   library computes a lumped bar's own moment of inertia as a circle's, the hole
   it leaves is the rectangle's: Ix of the gross model is 0.7e-3 in4 per strand
   high (2.3e-6 of Ix for the 8 in plank, less for the others).
8. Solver tolerance. The library's ultimate_bending_capacity stops brentq at
   xtol = 1e-3 in on the neutral-axis depth. Here the same convergence function
   (ultimate_normal_force_convergence, same bracket) is solved to xtol = 1e-6 in.
   Below that the library's axial force has jumps of ~1e-4 kip (nodes at the
   stress-block edge, RectangularStressBlock's 1e-8 strain tolerance): the
   converged axial force is 1e-5 to 1e-4 kip, which leaves Mn uncertain by a few
   1e-7. The run is deterministic, so the committed values reproduce exactly on
   the same platform (check_flexure.py compares at 1e-9).
   Variant `mn_library_solver_kipft` (the library's own solve of the reference
   model): 0 to +3.3e-5.
9. Topped member (unshored composite): two Concrete materials in one section,
   each with its own 0.85 f'c block, gamma = 0.85 (the topping's beta1) for
   both, as plankwise takes a = beta1 c with the topping's beta1 over the whole
   depth (the block stays in the 2 in topping here, so the precast's gamma does
   not matter). eps2 is the precast section's under Pe, since the prestress
   acts on the precast alone. Staged (unshored) Mcr and service stresses -- the
   precast carrying its self weight and the wet topping, the composite the
   rest -- cannot be modelled with calculate_cracking_moment /
   calculate_uncracked_stress (one section, one load stage), so only Mn is
   given for the topped member.
10. Speed only: the ultimate model keeps only the concrete within a depth
   1.1 a_max + 0.1 in of the top, a_max being the depth of concrete that
   0.85 f'c (the weakest concrete) needs to balance Aps fpu. Concrete below the
   stress block carries nothing (tension ignored), so Mn is unchanged as long as
   the block ends above the cut (checked for every solve). The library re-meshes
   every region at every trial neutral axis, and the cored lower part would
   take most of the run time. Against an uncut run: within 1.2e-7 (solver
   resolution, note 8).

Meshing: the library triangulates each region itself with no quality
refinement; stress-block and uncracked integrals over straight-sided triangles
are exact, so only the polygonisation of the cores (gen_sections.CIRCLE_SEGMENTS
segments per circle) approximates the geometry.
"""

from __future__ import annotations

import argparse
import importlib.metadata
import json
import math
import sys
import time
import tomllib
import warnings
from pathlib import Path

import numpy as np
import shapely
import shapely.affinity
from scipy.optimize import brentq
from shapely.geometry import Polygon, box
from shapely.ops import unary_union

HERE = Path(__file__).resolve().parent
sys.path.insert(0, str(HERE))

import gen_sections  # noqa: E402  (geometry builders and unit parsing)

from concreteproperties.material import Concrete, SteelStrand  # noqa: E402
from concreteproperties.prestressed_section import PrestressedSection  # noqa: E402
from concreteproperties.stress_strain_profile import (  # noqa: E402
    ConcreteLinear,
    RectangularStressBlock,
    StrandHardening,
    StrandPCI1992,
    StrandProfile,
)
from sectionproperties.pre.geometry import CompoundGeometry, Geometry  # noqa: E402

REPO = HERE.parents[1]
DEFAULT_OUT = "tests/reference/flexure.json"

# ------------------------------------------------------------ strand
EPS_KSI = 28500.0  # strand modulus
FPU_KSI = 270.0
# plankwise's Devalapura-Tadros constants for 270 ksi low-relaxation strand:
# fps = eps [A + B / (1 + (C eps)^D)^(1/D)] <= fpu
DT_A, DT_B, DT_C, DT_D = 887.0, 27613.0, 112.4, 7.36
ECU = 0.003
ALPHA = 0.85
# sampling of StrandPCI1992: [0, 0.005), [0.005, 0.015), [0.015, eps_u]
STRAND_STRAIN_CPS = [0.005, 0.015]
STRAND_N_POINTS = [200, 800, 500]
PLATEAU_STRAIN = 1.0
BAR_HALF_WIDTH = 0.25  # strand bars are 0.5 in wide rectangles (see build_section)


def dt_formula(eps: float) -> float:
    """plankwise's strand curve (for the yield-strength input and a self-check only)."""
    return min(eps * (DT_A + DT_B / (1.0 + (DT_C * eps) ** DT_D) ** (1.0 / DT_D)), FPU_KSI)


def pci1992_matching_constants(n_points=None) -> StrandPCI1992:
    """StrandPCI1992 whose derived constants are plankwise's 887 / 27613 / 112.4 / 7.36."""
    fpy = dt_formula(0.01)  # 243.04 ksi: the library fits D so that f(1 %) = fpy
    ratio = EPS_KSI / (DT_C * fpy)  # C = E / (ratio fpy) = 112.4
    f_so = ratio * fpy
    eps_u = (EPS_KSI * (FPU_KSI - f_so) / DT_A + f_so) / EPS_KSI  # A = 887
    kw = {} if n_points is None else {"strain_cps": STRAND_STRAIN_CPS, "n_points": n_points}
    return StrandPCI1992(
        yield_strength=fpy,
        elastic_modulus=EPS_KSI,
        fracture_strain=eps_u,
        breaking_strength=FPU_KSI,
        bilinear_yield_ratio=ratio,
        **kw,
    )


def cap_strain() -> float:
    """Strain at which plankwise's curve reaches fpu (0.027442)."""
    return brentq(lambda e: e * (DT_A + DT_B / (1.0 + (DT_C * e) ** DT_D) ** (1.0 / DT_D)) - FPU_KSI, 0.01, 0.1, xtol=1e-15)


def with_plateau(p: StrandPCI1992) -> StrandProfile:
    """The StrandPCI1992 points with a plateau at fpu out to PLATEAU_STRAIN, both signs.

    The plateau starts where the formula reaches fpu, or at the profile's last
    point if that is further out (StrandPCI1992's last point, at its fracture
    strain, may lie just short of fpu).
    """
    eps_u = p.strains[-1]
    start = max(cap_strain(), eps_u)
    pts = [(e, f) for e, f in zip(p.strains, p.stresses) if e >= 0.0]
    if start > eps_u:
        pts.append((start, FPU_KSI))
    pts.append((PLATEAU_STRAIN, FPU_KSI))
    neg = [(-e, -f) for e, f in reversed(pts) if e > 0.0]
    strains = [e for e, _ in neg] + [e for e, _ in pts]
    stresses = [f for _, f in neg] + [f for _, f in pts]
    return StrandProfile(strains=strains, stresses=stresses, yield_strength=p.yield_strength)


def strand_constants(p: StrandPCI1992) -> dict:
    """The constants StrandPCI1992 derived (D re-solved the way the library does)."""
    f_so = p.bilinear_yield_ratio * p.yield_strength
    C = p.elastic_modulus / f_so
    A = p.elastic_modulus * (p.breaking_strength - f_so) / (p.fracture_strain * p.elastic_modulus - f_so)
    B = p.elastic_modulus - A

    def f(d):
        return 0.01 * (A + B / (1 + (C * 0.01) ** d) ** (1 / d)) - p.yield_strength

    D = brentq(f, 1, 20, xtol=1e-14)
    return {"A": A, "B": B, "C": C, "D": D}


# --------------------------------------------------------------- members
# plankwise's inputs as of this commit, copied from
#   plankwise check --section S --pattern P --span .. --sdl .. --live .. [--topping ..] --json
# (fse_ksi, strands at midspan, concrete, m_service_total_kipft). Regenerate them
# with that command if plankwise's losses, strand placement or loads change.
MEMBERS = [
    {
        "key": "plank-8in-4ft/6x1/2",
        "catalog": "catalog/demo-us.toml",
        "section": "plank-8in-4ft",
        "pattern": "6x1/2",
        "command": 'check --section plank-8in-4ft --pattern 6x1/2 --span "25 ft" --sdl "15 psf" --live "50 psf" --json',
        "fse_ksi": 173.92469182407123,
        "strands": [(1.25, 1.75, 0.153), (9.0, 1.75, 0.153), (16.5, 1.75, 0.153),
                    (31.5, 1.75, 0.153), (39.0, 1.75, 0.153), (46.75, 1.75, 0.153)],
        "concrete": {"fc_psi": 5000.0, "ec_psi": 4286825.748732971, "fr_psi": 530.3300858899106, "beta1": 0.7999999999999999},
        "m_service_total_kipft": 39.58030056505234,
    },
    {
        "key": "plank-12in-4ft/10x1/2",
        "catalog": "catalog/demo-us.toml",
        "section": "plank-12in-4ft",
        "pattern": "10x1/2",
        "command": 'check --section plank-12in-4ft --pattern 10x1/2 --span "30 ft" --sdl "15 psf" --live "50 psf" --json',
        "fse_ksi": 167.5103226425157,
        "strands": [(1.0, 1.75, 0.153), (10.125, 1.75, 0.153), (19.375, 1.75, 0.153), (28.625, 1.75, 0.153),
                    (37.875, 1.75, 0.153), (47.0, 1.75, 0.153), (10.125, 3.75, 0.153), (19.375, 3.75, 0.153),
                    (28.625, 3.75, 0.153), (37.875, 3.75, 0.153)],
        "concrete": {"fc_psi": 5000.0, "ec_psi": 4286825.748732971, "fr_psi": 530.3300858899106, "beta1": 0.7999999999999999},
        "m_service_total_kipft": 66.31962304308107,
    },
    {
        "key": "plank-16in-4ft/6x0.6",
        "catalog": "catalog/demo-us.toml",
        "section": "plank-16in-4ft",
        "pattern": "6x0.6",
        "command": 'check --section plank-16in-4ft --pattern 6x0.6 --span "36 ft" --sdl "15 psf" --live "50 psf" --json',
        "fse_ksi": 170.28844687596424,
        "strands": [(0.9375, 2.0, 0.217), (10.125, 2.0, 0.217), (19.375, 2.0, 0.217),
                    (28.625, 2.0, 0.217), (37.875, 2.0, 0.217), (47.0625, 2.0, 0.217)],
        "concrete": {"fc_psi": 5000.0, "ec_psi": 4286825.748732971, "fr_psi": 530.3300858899106, "beta1": 0.7999999999999999},
        "m_service_total_kipft": 100.12996061583506,
    },
    {
        "key": "tee-32in-10ft/12-depressed",
        "catalog": "catalog/demo-us.toml",
        "section": "tee-32in-10ft",
        "pattern": "12-depressed",
        "command": 'check --section tee-32in-10ft --pattern 12-depressed --span "50 ft" --sdl "10 psf" --live "40 psf" --json',
        "fse_ksi": 176.0792405141094,
        "strands": [(30.0, 3.0, 0.153), (90.0, 3.0, 0.153), (30.0, 5.0, 0.153), (90.0, 5.0, 0.153),
                    (30.0, 7.0, 0.153), (90.0, 7.0, 0.153), (30.0, 9.0, 0.153), (90.0, 9.0, 0.153),
                    (30.0, 11.0, 0.153), (90.0, 11.0, 0.153), (30.0, 13.0, 0.153), (90.0, 13.0, 0.153)],
        "concrete": {"fc_psi": 6000.0, "ec_psi": 4695982.325350043, "fr_psi": 580.9475019311126, "beta1": 0.75},
        "m_service_total_kipft": 375.6103515625,
    },
    {
        "key": "plank-8in-4ft/6x1/2+topping",
        "catalog": "catalog/demo-us.toml",
        "section": "plank-8in-4ft",
        "pattern": "6x1/2",
        "topping": {"thickness_in": 2.0, "mix": "topping-4000"},
        "command": 'check --section plank-8in-4ft --pattern 6x1/2 --span "25 ft" --sdl "15 psf" --live "50 psf" --topping "2 in" --topping-mix topping-4000 --json',
        "fse_ksi": 175.29659834047874,
        "strands": [(1.25, 1.75, 0.153), (9.0, 1.75, 0.153), (16.5, 1.75, 0.153),
                    (31.5, 1.75, 0.153), (39.0, 1.75, 0.153), (46.75, 1.75, 0.153)],
        "concrete": {"fc_psi": 5000.0, "ec_psi": 4286825.748732971, "fr_psi": 530.3300858899106, "beta1": 0.7999999999999999},
        "m_service_total_kipft": 47.39280056505234,
    },
]


# ---------------------------------------------------------------- concrete
def mix_values(mix: dict) -> dict:
    """f'c, Ec, fr, beta1 of a catalog mix by ACI 318-19 (psi)."""
    fc = gen_sections._quantity(mix["fc"], {"psi": 1.0, "ksi": 1000.0}, "fc")
    wc = gen_sections._quantity(mix["unit_weight"], {"pcf": 1.0}, "unit_weight")
    if mix.get("modulus", "unit-weight") != "unit-weight":
        raise ValueError(f"mix {mix['id']}: only modulus = unit-weight is modelled")
    lam = {"normalweight": 1.0, "carbonate": 1.0, "siliceous": 1.0}.get(mix.get("aggregate", "normalweight"))
    if lam is None:
        raise ValueError(f"mix {mix['id']}: lightweight aggregate not modelled here")
    ec = 33.0 * wc**1.5 * math.sqrt(fc)  # 19.2.2.1(a)
    fr = 7.5 * lam * math.sqrt(fc)  # 19.2.3.1
    beta1 = min(0.85, max(0.65, 0.85 - 0.05 * (fc - 4000.0) / 1000.0))  # Table 22.2.2.4.3
    return {"fc_psi": fc, "ec_psi": ec, "fr_psi": fr, "beta1": beta1, "unit_weight_pcf": wc}


def concrete_material(name: str, v: dict, gamma: float) -> Concrete:
    fc = v["fc_psi"] / 1000.0
    ec = v["ec_psi"] / 1000.0
    return Concrete(
        name=name,
        density=v["unit_weight_pcf"] / 1000.0 / 1728.0,  # kip/in3 (not used)
        stress_strain_profile=ConcreteLinear(elastic_modulus=ec),
        ultimate_stress_strain_profile=RectangularStressBlock(
            compressive_strength=fc, alpha=ALPHA, gamma=gamma, ultimate_strain=ECU
        ),
        flexural_tensile_strength=v["fr_psi"] / 1000.0,
        colour="lightgrey",
    )


def strand_material(name: str, profile, prestress_ksi: float) -> SteelStrand:
    return SteelStrand(
        name=name,
        density=490.0 / 1000.0 / 1728.0,
        stress_strain_profile=profile,
        colour="black",
        prestress_stress=prestress_ksi,
    )


# ---------------------------------------------------------------- geometry
def section_entry(catalog_rel: str, section_id: str):
    with open(REPO / catalog_rel, "rb") as f:
        cat = tomllib.load(f)
    mixes = {m["id"]: m for m in cat.get("mix", [])}
    for sec in cat.get("section", []):
        if sec["id"] == section_id:
            return sec, mixes
    raise KeyError(f"{catalog_rel}: no section {section_id!r}")


def keyway_slots(poly: Polygon, a: float, c: float):
    """One slot per web at height c, total area a, centred on c (see note 6).

    Each slot is 0.9 of its web's width at c, all the same height h, so their own
    moment of inertia a h^2 / 12 is as small as the webs allow.
    """
    minx, _, maxx, _ = poly.bounds
    chord = poly.intersection(shapely.LineString([(minx - 1, c), (maxx + 1, c)]))
    webs = sorted((g.bounds[0], g.bounds[2]) for g in getattr(chord, "geoms", [chord]))
    widths = [0.9 * (x1 - x0) for x0, x1 in webs]
    h = a / sum(widths)
    slots = [box((x0 + x1) / 2 - w / 2, c - h / 2, (x0 + x1) / 2 + w / 2, c + h / 2) for (x0, x1), w in zip(webs, widths)]
    for s in slots:
        if not poly.contains(s) or poly.exterior.distance(s) <= 0 or any(poly.interiors[i].distance(s) <= 0 for i in range(len(poly.interiors))):
            raise ValueError("a keyway slot does not lie inside a web")
    own_ix = sum(w * h**3 / 12.0 for w in widths)
    return slots, own_ix


def precast_polygon(sec: dict, name: str):
    fams = [k for k in gen_sections.FAMILIES if k in sec]
    if len(fams) != 1:
        raise ValueError(f"{name}: needs exactly one section family")
    built = gen_sections.FAMILIES[fams[0]](sec[fams[0]], name)
    poly = built.polygon
    miny = poly.bounds[1]
    if abs(miny) > 1e-9:
        poly = shapely.affinity.translate(poly, 0.0, -miny)
    own_ix = 0.0
    if built.lumped is not None:
        slots, own_ix = keyway_slots(poly, *built.lumped)
        poly = Polygon(poly.exterior.coords, [list(r.coords) for r in poly.interiors] + [list(s.exterior.coords) for s in slots])
        if not poly.is_valid:
            raise ValueError(f"{name}: invalid polygon after adding keyway slots")
    return poly, own_ix


def build_section(regions, strands, strand_mats) -> PrestressedSection:
    """Concrete regions [(polygon, Concrete)] with the strands as lumped bars (note 7).

    The library treats a strand as a lump of its area at its centroid; its shape
    matters only through the area. pre.add_bar draws a 4-point "circle", whose
    irrational vertices CPGeom rounds to 6 decimals, losing 2.4e-6 of a 0.153 in2
    strand's area (and so of Pe and of the strand force at ultimate). Here each bar
    is a 0.5 in x 2a rectangle centred on the strand, whose vertices x +- 0.25,
    y +- a survive that rounding, cut out of the concrete like add_bar does (one
    cut for all strands, so the section is compiled once).
    """
    bars = []
    for (x, y, a), mat in zip(strands, strand_mats):
        bars.append(Geometry(box(x - BAR_HALF_WIDTH, y - a / (4 * BAR_HALF_WIDTH), x + BAR_HALF_WIDTH, y + a / (4 * BAR_HALF_WIDTH)), material=mat))
    cut = unary_union([b.geom for b in bars])
    geoms = []
    for poly, mat in regions:
        for b in bars:
            if poly.intersects(b.geom) and not poly.contains(b.geom):
                raise ValueError("a strand straddles a concrete boundary")
        geoms.append(Geometry(poly.difference(cut), material=mat))
    with warnings.catch_warnings():
        warnings.simplefilter("error")  # no overlap warnings expected
        return PrestressedSection(CompoundGeometry(geoms + bars))


def compression_clip_depth(regions, fpu_force: float) -> float:
    """A depth below the top under which no concrete can be in the stress block.

    The block's force is 0.85 f'c times the concrete area in it and must equal the
    strand force, at most Aps fpu; so the block lies within the depth a_max whose
    area above carries Aps fpu at the weakest 0.85 f'c. Concrete below that carries
    no stress at ultimate (tension ignored), so cutting it off leaves Mn unchanged
    and saves the library meshing it at every trial neutral axis (note 10).
    """
    top = max(poly.bounds[3] for poly, _ in regions)
    bottom = min(poly.bounds[1] for poly, _ in regions)
    fc_min = min(mat.ultimate_stress_strain_profile.compressive_strength for _, mat in regions)
    need = fpu_force / (ALPHA * fc_min)

    def area_above(d):
        band = box(-1e6, top - d, 1e6, top + 1)
        return sum(poly.intersection(band).area for poly, _ in regions)

    if area_above(top - bottom) <= need:
        return top - bottom
    a_max = brentq(lambda d: area_above(d) - need, 1e-9, top - bottom, xtol=1e-9)
    return min(top - bottom, 1.1 * a_max + 0.1)


def clip_regions(regions, depth: float):
    top = max(poly.bounds[3] for poly, _ in regions)
    band = box(-1e6, top - depth, 1e6, top + 1)
    out = []
    for poly, mat in regions:
        q = poly.intersection(band)
        if q.is_empty:
            continue
        if q.geom_type != "Polygon":
            raise ValueError(f"clipped concrete is a {q.geom_type}")
        out.append((q, mat))
    return out, top - depth


# ---------------------------------------------------------------- analyses
def ultimate(sec: PrestressedSection):
    """Sagging Mn: the library's convergence function solved more tightly (note 8).

    Same bracket as the library's ultimate_bending_capacity, xtol 1e-6 in instead
    of 1e-3 in. (The axial force has jumps of ~1e-4 kip where nodes meet the
    stress-block edge -- RectangularStressBlock's 1e-8 strain tolerance -- so a
    much smaller xtol only makes brentq bisect.)
    """
    from concreteproperties.results import UltimateBendingResults

    scratch = UltimateBendingResults(default_units=sec.default_units, theta=0.0)
    _, d_t = extreme_fibre(sec)
    d_n = brentq(sec.ultimate_normal_force_convergence, 1e-6 * d_t, 6 * d_t, args=(0.0, scratch), xtol=1e-6, rtol=1e-12, maxiter=200)
    res = sec.calculate_ultimate_section_actions(d_n=d_n)
    if abs(res.n) > 1e-5 * FPU_KSI * sum(g.calculate_area() for g in sec.strand_geometries):
        raise RuntimeError(f"ultimate: axial force not converged ({res.n})")
    return res, sec.calculate_ultimate_stress(res)


def extreme_fibre(sec):
    from concreteproperties.utils import calculate_extreme_fibre

    return calculate_extreme_fibre(points=sec.compound_geometry.points, theta=0.0)


def fibre_stresses(stress_result):
    """Concrete stresses at the highest and lowest mesh nodes (ksi, compression +)."""
    top_y, bot_y = -math.inf, math.inf
    top, bot = [], []
    for asec, sig in zip(stress_result.concrete_analysis_sections, stress_result.concrete_stresses):
        for (x, y), s in zip(asec.mesh_nodes, sig):
            if y > top_y + 1e-9:
                top_y, top = y, [s]
            elif abs(y - top_y) <= 1e-9:
                top.append(s)
            if y < bot_y - 1e-9:
                bot_y, bot = y, [s]
            elif abs(y - bot_y) <= 1e-9:
                bot.append(s)
    # the stress field depends on y only: all nodes of a fibre agree
    if max(top) - min(top) > 1e-9 * max(1.0, abs(max(top))) or max(bot) - min(bot) > 1e-9 * max(1.0, abs(max(bot))):
        raise RuntimeError("fibre stresses vary along a fibre")
    return float(np.mean(top)), float(np.mean(bot)), top_y, bot_y


def gross_service_model(poly, conc_vals, strands, fse, strand_e):
    """Service model: concrete plus strands of modulus strand_e (Ec -> gross section)."""
    conc = concrete_material("precast", conc_vals, conc_vals["beta1"])
    prof = StrandHardening(yield_strength=FPU_KSI, elastic_modulus=strand_e, fracture_strain=1.0, breaking_strength=FPU_KSI * 1.0001)
    mats = [strand_material("strand", prof, fse)] * len(strands)
    return build_section([(poly, conc)], strands, mats)


def analyse_member(m: dict) -> dict:
    sec_entry, mixes = section_entry(m["catalog"], m["section"])
    name = f"{Path(m['catalog']).stem}/{m['section']}"
    mix = mixes[sec_entry["mix"]]
    conc = mix_values(mix)
    for k, v in m["concrete"].items():
        if abs(conc[k] - v) > 1e-12 * abs(v):
            raise ValueError(f"{m['key']}: {k} from the catalog mix {conc[k]!r} != plankwise's {v!r}")
    poly, own_ix = precast_polygon(sec_entry, name)
    strands = [tuple(map(float, s)) for s in m["strands"]]
    fse = m["fse_ksi"]
    aps = sum(a for _, _, a in strands)
    ec = conc["ec_psi"] / 1000.0

    # -- gross model (strands at E = Ec): section properties, eps2, Mcr, stresses
    gross = gross_service_model(poly, conc, strands, fse, ec)
    gp = gross.gross_properties
    A, yb, Ix = gp.e_a / ec, gp.cy, gp.e_ixx_c / ec
    pe = gp.n_prestress
    # eps2 at each strand: concrete stress there under prestress alone / Ec
    pre = gross.calculate_uncracked_stress(n=0.0, m=0.0)
    eps2 = [(float(s) + fse) / ec for s in pre.strand_stresses]
    strand_pos = [tuple(g.calculate_centroid()) for g in pre.strand_geometries]
    for (x, y, _), (gx, gy) in zip(strands, strand_pos):
        if abs(x - gx) > 1e-9 or abs(y - gy) > 1e-9:
            raise RuntimeError("strand order changed inside the library")

    out: dict = {
        "inputs": {
            "catalog": m["catalog"],
            "section": m["section"],
            "pattern": m["pattern"],
            "plankwise_command": m["command"],
            "fse_ksi": fse,
            "pe_kip": pe,
            "aps_in2": aps,
            "strands": [{"x_in": x, "y_in": y, "area_in2": a} for x, y, a in strands],
            "concrete": {k: conc[k] for k in ("fc_psi", "ec_psi", "fr_psi", "beta1")},
            "m_service_total_kipft": m["m_service_total_kipft"],
            "strand": {"eps_ksi": EPS_KSI, "fpu_ksi": FPU_KSI},
            "ecu": ECU,
            "alpha": ALPHA,
        },
        "gross": {"area_in2": A, "yb_in": yb, "ix_in4": Ix, "keyway_slot_own_ix_in4": own_ix},
        "eps2": eps2,
        "variants": {},
    }

    # -- strand profiles
    pci_ref = pci1992_matching_constants(STRAND_N_POINTS)
    prof_ref = with_plateau(pci_ref)
    out["inputs"]["strand"]["pci1992_constants"] = strand_constants(pci_ref)
    out["inputs"]["strand"]["pci1992_fracture_strain"] = pci_ref.fracture_strain
    out["inputs"]["strand"]["pci1992_yield_strength_ksi"] = pci_ref.yield_strength

    regions = [(poly, concrete_material("precast", conc, conc["beta1"]))]
    if "topping" in m:
        tv = mix_values(mixes[m["topping"]["mix"]])
        gamma = tv["beta1"]  # note 9: the topping's beta1 for the whole block
        t = m["topping"]["thickness_in"]
        minx, _, maxx, maxy = poly.bounds
        regions = [
            (poly, concrete_material("precast", conc, gamma)),
            (box(minx, maxy, maxx, maxy + t), concrete_material("topping", tv, gamma)),
        ]
        out["inputs"]["topping"] = {"thickness_in": t, "mix": m["topping"]["mix"], **{k: tv[k] for k in ("fc_psi", "ec_psi", "beta1")}}
    clip_depth = compression_clip_depth(regions, aps * FPU_KSI)
    ult_regions, _ = clip_regions(regions, clip_depth)
    gamma_max = max(mat.ultimate_stress_strain_profile.gamma for _, mat in regions)

    def mn_with(profile, prestresses):
        mats = [strand_material(f"strand{i}", profile, p) for i, p in enumerate(prestresses)]
        sec = build_section(ult_regions, strands, mats)
        res, st = ultimate(sec)
        if gamma_max * res.d_n >= clip_depth:
            raise RuntimeError(f"{m['key']}: stress block depth {gamma_max * res.d_n} reaches the clip depth {clip_depth}")
        return sec, res, st

    # reference: prestrain = fse/Eps + eps2 (notes 1-4)
    target = [fse / EPS_KSI + e2 for e2 in eps2]
    prestress_ref = [float(-prof_ref.get_stress(-e)) for e in target]
    sec, res, st = mn_with(prof_ref, prestress_ref)
    back = [float(st_mat.material.get_prestress_strain()) for st_mat in sec.strand_geometries]
    for b, e in zip(back, target):
        if abs(b - e) > 1e-12:
            raise RuntimeError("prestrain not recovered")
    ef, _ = extreme_fibre(sec)
    out["mn_kipft"] = res.m_x / 12.0
    out["c_in"] = res.d_n
    out["fps_ksi"] = [float(-s) for s in st.strand_stresses]
    out["strand_strain"] = [float(-e) for e in st.strand_strains]
    out["top_y_in"] = ef[1]
    out["ultimate_model_clip_depth_in"] = clip_depth

    # variants
    v = out["variants"]
    _, r, _ = mn_with(prof_ref, [fse] * len(strands))
    v["mn_library_prestrain_kipft"] = r.m_x / 12.0
    _, r, _ = mn_with(prof_ref, [float(-prof_ref.get_stress(-fse / EPS_KSI))] * len(strands))
    v["mn_no_eps2_kipft"] = r.m_x / 12.0
    pci_def = StrandPCI1992(yield_strength=0.9 * FPU_KSI, elastic_modulus=EPS_KSI, fracture_strain=0.035, breaking_strength=FPU_KSI)
    _, r, _ = mn_with(with_plateau(pci_def), [fse] * len(strands))
    v["mn_pci1992_default_kipft"] = r.m_x / 12.0
    _, r, _ = mn_with(pci1992_matching_constants(None), [fse] * len(strands))
    v["mn_raw_pci1992_kipft"] = r.m_x / 12.0
    lib = sec.ultimate_bending_capacity(positive=True, n=0.0)
    v["mn_library_solver_kipft"] = lib.m_x / 12.0

    if "topping" not in m:
        m_srv = m["m_service_total_kipft"] * 12.0
        mcr = gross.calculate_cracking_moment(n=gp.n_prestress, m_int=gp.m_prestress, positive=True)
        ft, fb, _, _ = fibre_stresses(gross.calculate_uncracked_stress(n=0.0, m=m_srv))
        out["mcr_kipft"] = mcr / 12.0
        out["f_top_psi"] = ft * 1000.0
        out["f_bottom_psi"] = fb * 1000.0
        tr = gross_service_model(poly, conc, strands, fse, EPS_KSI)
        tp = tr.gross_properties
        mcr_t = tr.calculate_cracking_moment(n=tp.n_prestress, m_int=tp.m_prestress, positive=True)
        ft_t, fb_t, _, _ = fibre_stresses(tr.calculate_uncracked_stress(n=0.0, m=m_srv))
        v["mcr_transformed_kipft"] = mcr_t / 12.0
        v["f_top_transformed_psi"] = ft_t * 1000.0
        v["f_bottom_transformed_psi"] = fb_t * 1000.0
    return out


NOTES = (
    "Reference values model plankwise's method as closely as concreteproperties allows; "
    "see the header of tests/reference/gen_flexure.py for every departure from the library's "
    "native behaviour (eps2 and prestrain set through prestress_stress, strand curve constants, "
    "fpu plateau, gross vs transformed section, keyway slots, strand bar shape, solver tolerance, "
    "topped member, ultimate model cut below the stress block). "
    "'variants' hold the library-native alternatives that quantify each effect. "
    "Moments kip-ft, stresses psi (compression positive), lengths in, strand stresses ksi."
)


def clean(x):
    """Plain Python floats / lists / dicts for the JSON (numpy scalars and 0-d arrays)."""
    if isinstance(x, dict):
        return {k: clean(v) for k, v in x.items()}
    if isinstance(x, (list, tuple)):
        return [clean(v) for v in x]
    if isinstance(x, (bool, str, int)) or x is None:
        return x
    return float(x)


def generate() -> dict:
    members = {}
    for m in MEMBERS:
        if m["key"] in members:
            raise ValueError(f"duplicate member {m['key']}")
        members[m["key"]] = clean(analyse_member(m))
    return {
        "generator": "tests/reference/gen_flexure.py",
        "concreteproperties": importlib.metadata.version("concreteproperties"),
        "sectionproperties": importlib.metadata.version("sectionproperties"),
        "shapely": shapely.__version__,
        "circle_segments": gen_sections.CIRCLE_SEGMENTS,
        "notes": NOTES,
        "members": members,
    }


def main(argv=None) -> int:
    ap = argparse.ArgumentParser(description=__doc__.splitlines()[0])
    ap.add_argument("--out", default=DEFAULT_OUT, help=f"output JSON (default {DEFAULT_OUT}, relative to the repo root)")
    args = ap.parse_args(argv)
    out = Path(args.out)
    if not out.is_absolute():
        out = REPO / out
    t0 = time.perf_counter()
    data = generate()
    gen_sections.write(data, out)
    dt = time.perf_counter() - t0
    print(f"gen_flexure: {len(data['members'])} members -> {out} (concreteproperties {data['concreteproperties']}, {dt:.1f} s)")
    return 0


if __name__ == "__main__":
    sys.exit(main())
