#!/usr/bin/env python3
"""Check that tests/reference/beams.json is what gen_beams.py produces now.

Regenerates the reference values into a temporary file with gen_beams.py
(pycba, pinned in requirements.txt) and compares them with the
committed beams.json: the same keys everywhere, lists of the same length,
every number within 1e-9 of its own size or, in a list of result points,
of the largest size of its key over the list (its diagram), every other
value equal.
Exit 0 when they agree, 1 with a list of the differences otherwise.

    python tests/reference/check_beams.py [--reference FILE]
"""

from __future__ import annotations

import argparse
import json
import sys
import tempfile
from pathlib import Path

HERE = Path(__file__).resolve().parent
sys.path.insert(0, str(HERE))

import gen_beams  # noqa: E402

REL_TOL = 1e-9


def is_number(x) -> bool:
    return isinstance(x, (int, float)) and not isinstance(x, bool)


def diagram_scales(old: list, new: list) -> dict:
    """For a list of result points (dicts), the largest magnitude of each
    numeric key over both lists: a moment or shear is compared to 1e-9 of
    its diagram's largest value, as tests/reference_beams.rs compares
    plankwise with it. A value that should be zero (the moment at a free
    tip) comes out of pycba's matrix solve as roundoff, 1e-10 one way on
    one processor and another way on the next; its own size is no scale."""
    scales: dict = {}
    for item in list(old) + list(new):
        if isinstance(item, dict):
            for k, v in item.items():
                if is_number(v):
                    scales[k] = max(scales.get(k, 0.0), abs(v))
    return scales


def compare(old, new, path, out, floors=None):
    """Append a line to `out` for every difference between old and new;
    `floors` holds, for the keys of a result point, its diagram's scale."""
    if isinstance(old, dict) and isinstance(new, dict):
        for k in sorted(set(old) - set(new)):
            out.append(f"{path}/{k}: in the committed file only")
        for k in sorted(set(new) - set(old)):
            out.append(f"{path}/{k}: regenerated only (not in the committed file)")
        for k in sorted(set(old) & set(new)):
            floor = (floors or {}).get(k, 0.0)
            compare(old[k], new[k], f"{path}/{k}", out, {"": floor})
    elif isinstance(old, list) and isinstance(new, list):
        if len(old) != len(new):
            out.append(f"{path}: committed {len(old)} items, regenerated {len(new)}")
        scales = diagram_scales(old, new)
        for i, (a, b) in enumerate(zip(old, new)):
            compare(a, b, f"{path}[{i}]", out, scales)
    elif is_number(old) and is_number(new):
        if old != new:
            scale = max(abs(old), abs(new), (floors or {}).get("", 0.0))
            rel = abs(old - new) / scale
            if rel > REL_TOL:
                out.append(f"{path}: committed {old!r}, regenerated {new!r} (relative difference {rel:.3e} > {REL_TOL:g})")
    elif old != new:
        out.append(f"{path}: committed {old!r}, regenerated {new!r}")


def main(argv=None) -> int:
    ap = argparse.ArgumentParser(description=__doc__.splitlines()[0])
    ap.add_argument("--reference", default=str(HERE / "beams.json"), help="committed reference file (default: beams.json beside this script)")
    args = ap.parse_args(argv)
    ref_path = Path(args.reference)
    if not ref_path.is_file():
        print(f"check_beams: FAIL: {ref_path} does not exist; run gen_beams.py", file=sys.stderr)
        return 1
    committed = json.loads(ref_path.read_text(encoding="utf-8"))
    with tempfile.TemporaryDirectory() as tmp:
        out = Path(tmp) / "beams.json"
        gen_beams.main(["--out", str(out)])
        fresh = json.loads(out.read_text(encoding="utf-8"))
    diffs: list[str] = []
    compare(committed, fresh, "", diffs)
    n = len(fresh.get("beams", {}))
    if diffs:
        print(f"check_beams: FAIL: {ref_path} differs from a fresh run of gen_beams.py in {len(diffs)} place(s):", file=sys.stderr)
        for d in diffs:
            print(f"  {d}", file=sys.stderr)
        print("check_beams: if the change is intended, regenerate with: python tests/reference/gen_beams.py", file=sys.stderr)
        return 1
    print(f"check_beams: ok: {n} beams in {ref_path.name} match a fresh run (relative tolerance {REL_TOL:g})")
    return 0


if __name__ == "__main__":
    sys.exit(main())
