#!/usr/bin/env python3
"""Side by side: flexural strength Mn from plankwise and from concreteproperties.

Reference library: concreteproperties 0.7.0 (on sectionproperties 3.10.2, shapely
2.2.0, numpy 2.4.6, scipy 1.17.1), pinned in tests/reference/requirements.txt.
Run from the repo root:

    python tests/reference/side_by_side.py [--plankwise PATH] [--repeat N] [--cp-repeat K]

For each demo member of gen_flexure.MEMBERS it

  * runs the member's plankwise command (`plankwise check ... --json`) N times
    and reads `mn_kipft`, i.e. Mn at the section of greatest factored moment.
    The time is the median wall time of those runs less the median wall time of
    `plankwise --version` (process start-up), both measured interleaved so that
    they see the same machine load. NB: this is the time of a whole check --
    losses, every check at about 25 stations, deflections, JSON output -- not of
    Mn alone, so it overstates plankwise's Mn time;
  * builds the same member's reference model with the functions of
    gen_flexure.py (the model behind tests/reference/flexure.json, see the notes
    in its header: eps2 through the prestrain, plankwise's strand curve with an
    fpu plateau, concrete cut below the stress block) outside the timed part,
    then times only the ultimate analysis -- the neutral-axis solve of
    gen_flexure.ultimate (brentq to 1e-6 in on the library's
    ultimate_normal_force_convergence) plus calculate_ultimate_section_actions,
    without the stress recovery that gen_flexure.ultimate also does -- K times
    and takes the median.

It prints one row per member: both Mn values, their relative difference, both
times and the speed ratio (concreteproperties time / plankwise time), and a line
with the versions. Importing gen_flexure does not run it (its main is guarded).
Nothing is written.
"""

from __future__ import annotations

import argparse
import importlib.metadata
import platform
import shlex
import statistics
import subprocess
import sys
import time
from pathlib import Path

HERE = Path(__file__).resolve().parent
sys.path.insert(0, str(HERE))

import gen_flexure as gf  # noqa: E402  (reference model builders; main not run on import)
from scipy.optimize import brentq  # noqa: E402

REPO = HERE.parents[1]
RELEASE = REPO / "target/release/plankwise"
DEBUG = REPO / "target/debug/plankwise"


# ---------------------------------------------------------------- plankwise
def run_once(exe: Path, args: list[str]) -> tuple[float, subprocess.CompletedProcess]:
    """Wall time (s) of one plankwise run, and its result."""
    t0 = time.perf_counter()
    p = subprocess.run([str(exe), *args], capture_output=True, text=True, cwd=REPO)
    dt = time.perf_counter() - t0
    return dt, p


def time_plankwise(exe: Path, command: str, repeat: int) -> tuple[float, float, float]:
    """(mn_kipft, median check time s, median --version time s).

    The check and `--version` runs alternate, so both medians are taken under
    the same background load; one untimed run of each first warms the caches.
    """
    import json

    args = shlex.split(command)
    run_once(exe, ["--version"])
    _, p = run_once(exe, args)
    if p.returncode != 0:
        raise RuntimeError(f"plankwise {command}: exit {p.returncode}\n{p.stderr}")
    mn = float(json.loads(p.stdout)["mn_kipft"])
    t_check, t_version = [], []
    for _ in range(repeat):
        t_version.append(run_once(exe, ["--version"])[0])
        t_check.append(run_once(exe, args)[0])
    return mn, statistics.median(t_check), statistics.median(t_version)


# ---------------------------------------------------------- concreteproperties
def reference_model(m: dict):
    """The ultimate model gen_flexure.analyse_member builds for `mn_kipft`.

    Same calls in the same order as the reference path of analyse_member (its
    library-native variants and the service analyses are left out). Returns the
    PrestressedSection and the depth below the top where the concrete was cut.
    """
    sec_entry, mixes = gf.section_entry(m["catalog"], m["section"])
    conc = gf.mix_values(mixes[sec_entry["mix"]])
    poly, _ = gf.precast_polygon(sec_entry, f"{Path(m['catalog']).stem}/{m['section']}")
    strands = [tuple(map(float, s)) for s in m["strands"]]
    fse = m["fse_ksi"]
    aps = sum(a for _, _, a in strands)
    ec = conc["ec_psi"] / 1000.0

    # eps2 at each strand from the gross model under prestress alone (note 1)
    gross = gf.gross_service_model(poly, conc, strands, fse, ec)
    pre = gross.calculate_uncracked_stress(n=0.0, m=0.0)
    eps2 = [(float(s) + fse) / ec for s in pre.strand_stresses]

    # concrete regions: precast, plus the topping for the composite member (note 9)
    regions = [(poly, gf.concrete_material("precast", conc, conc["beta1"]))]
    if "topping" in m:
        tv = gf.mix_values(mixes[m["topping"]["mix"]])
        t = m["topping"]["thickness_in"]
        minx, _, maxx, maxy = poly.bounds
        regions = [
            (poly, gf.concrete_material("precast", conc, tv["beta1"])),
            (gf.box(minx, maxy, maxx, maxy + t), gf.concrete_material("topping", tv, tv["beta1"])),
        ]
    clip_depth = gf.compression_clip_depth(regions, aps * gf.FPU_KSI)
    ult_regions, _ = gf.clip_regions(regions, clip_depth)

    # strands: plankwise's curve with an fpu plateau, prestrain fse/Eps + eps2 (notes 1-4)
    prof = gf.with_plateau(gf.pci1992_matching_constants(gf.STRAND_N_POINTS))
    prestress = [float(-prof.get_stress(-(fse / gf.EPS_KSI + e2))) for e2 in eps2]
    mats = [gf.strand_material(f"strand{i}", prof, p) for i, p in enumerate(prestress)]
    return gf.build_section(ult_regions, strands, mats), clip_depth


def cp_mn(sec):
    """Sagging Mn (kip-in) and the neutral-axis depth: gen_flexure.ultimate without the stresses."""
    from concreteproperties.results import UltimateBendingResults

    scratch = UltimateBendingResults(default_units=sec.default_units, theta=0.0)
    _, d_t = gf.extreme_fibre(sec)
    d_n = brentq(sec.ultimate_normal_force_convergence, 1e-6 * d_t, 6 * d_t, args=(0.0, scratch),
                 xtol=1e-6, rtol=1e-12, maxiter=200)
    res = sec.calculate_ultimate_section_actions(d_n=d_n)
    return res.m_x, res.d_n


def time_cp(m: dict, repeat: int) -> tuple[float, float]:
    """(mn_kipft, median time s of the ultimate analysis only)."""
    sec, clip_depth = reference_model(m)  # built once, not timed
    gamma = max(g.material.ultimate_stress_strain_profile.gamma for g in sec.concrete_geometries)
    times, mns = [], []
    for _ in range(repeat):
        t0 = time.perf_counter()
        mx, d_n = cp_mn(sec)
        times.append(time.perf_counter() - t0)
        mns.append(mx / 12.0)
    if gamma * d_n >= clip_depth:
        raise RuntimeError(f"{m['key']}: stress block reaches the cut of the model")
    if max(mns) != min(mns):
        raise RuntimeError(f"{m['key']}: Mn differs between repeats {mns}")
    return mns[0], statistics.median(times)


# ------------------------------------------------------------------------ main
def main(argv=None) -> int:
    ap = argparse.ArgumentParser(description=__doc__.splitlines()[0])
    ap.add_argument("--plankwise", type=Path, default=RELEASE if RELEASE.exists() else DEBUG,
                    help="plankwise binary (default target/release/plankwise if it exists, else target/debug/plankwise)")
    ap.add_argument("--repeat", type=int, default=20, help="plankwise runs per member (default 20)")
    ap.add_argument("--cp-repeat", type=int, default=3, help="concreteproperties Mn solves per member (default 3)")
    args = ap.parse_args(argv)
    exe = args.plankwise if args.plankwise.is_absolute() else Path.cwd() / args.plankwise
    if not exe.exists():
        ap.error(f"no plankwise binary at {exe}")
    if args.repeat < 1 or args.cp_repeat < 1:
        ap.error("repeat counts must be at least 1")

    t_start = time.perf_counter()
    pw_version = subprocess.run([str(exe), "--version"], capture_output=True, text=True).stdout.strip()
    rows = []
    for m in gf.MEMBERS:
        mn_pw, t_check, t_ver = time_plankwise(exe, m["command"], args.repeat)
        mn_cp, t_cp = time_cp(m, args.cp_repeat)
        rows.append((m["key"], mn_pw, mn_cp, t_check - t_ver, t_cp, t_check, t_ver))

    # table
    head = ("member", "Mn pw", "Mn cp", "rel diff", "t pw ms", "t cp ms", "cp/pw")
    fmt = "{:<28} {:>10} {:>10} {:>10} {:>9} {:>10} {:>8}"
    print(fmt.format(*head))
    print(fmt.format("", "kip-ft", "kip-ft", "(pw-cp)/cp", "", "", ""))
    for key, mn_pw, mn_cp, t_pw, t_cp, _, _ in rows:
        ratio = f"{t_cp / t_pw:.0f}x" if t_pw > 0 else "n/a"
        t_pw_s = f"{t_pw * 1e3:.2f}" if t_pw > 0 else "<noise"
        print(fmt.format(key, f"{mn_pw:.3f}", f"{mn_cp:.3f}", f"{(mn_pw - mn_cp) / mn_cp:+.2e}",
                         t_pw_s, f"{t_cp * 1e3:.0f}", ratio))

    # notes
    print()
    print(f"t pw: median of {args.repeat} runs of `plankwise check ... --json` minus the median of "
          f"{args.repeat} runs of `plankwise --version` (start-up; per member, "
          f"{min(r[6] for r in rows) * 1e3:.2f}-{max(r[6] for r in rows) * 1e3:.2f} ms). It is one full "
          "evaluation of all checks at ~25 stations (losses, flexure, shear, stresses, deflections, fire, "
          "JSON), not Mn alone.")
    print(f"t cp: median of {args.cp_repeat} ultimate analyses (neutral-axis solve to 1e-6 in + section "
          "actions) on the gen_flexure reference model, built once untimed (concrete cut below the stress "
          "block, gen_flexure note 10).")
    print(f"versions: plankwise {pw_version.split()[-1]} ({exe.relative_to(REPO) if exe.is_relative_to(REPO) else exe}), "
          f"concreteproperties {importlib.metadata.version('concreteproperties')}, "
          f"sectionproperties {importlib.metadata.version('sectionproperties')}, "
          f"shapely {importlib.metadata.version('shapely')}, numpy {importlib.metadata.version('numpy')}, "
          f"scipy {importlib.metadata.version('scipy')}, Python {platform.python_version()}; "
          f"total run {time.perf_counter() - t_start:.1f} s")
    return 0


if __name__ == "__main__":
    sys.exit(main())
