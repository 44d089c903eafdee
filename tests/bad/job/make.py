"""Writes the broken jobs of the files-and-input rules into this folder,
each the demo job (catalog/demo-job.toml) broken in one way, starting with
the message fragment plankwise must print ("# expect: ..."). The older
files here were written by hand. Run: python3 make.py
"""
import pathlib

here = pathlib.Path(__file__).parent
base = (here / "../../../catalog/demo-job.toml").read_text()

BAY1 = 'name = "Level 2 apartments"\nspan = "24 ft"'

cases = {
    "job-control-in-project": ([('project = "Millbrook', 'project = "Mill\\u001b[2Jbrook')], "holds the control character \\u{1b}"),
    "job-control-in-engineer": ([('engineer = "R. Example', 'engineer = "R.\\u0007 Example')], "holds the control character \\u{7}"),
    "job-control-in-notes": ([('"Invented demo job for plankwise; loads are illustrative."', '"Invented\\u202e demo job"')], "holds the control character \\u{202e}"),
    "job-control-in-bay-name": ([('name = "Level 2 apartments"', 'name = "Level 2\\u009b apartments"')], "holds the control character \\u{9b}"),
    "job-control-in-marked": ([(BAY1, BAY1 + '\nmarked = ["plank\\u001b[0m"]')], "holds the control character \\u{1b}"),
    "job-empty-bay-name": ([('name = "Level 2 apartments"', 'name = ""')], "is empty; give it a name"),
    "job-empty-project": ([('project = "Millbrook Terrace mixed-use building (invented)"', 'project = " "')], "is empty; give the project a name"),
    "job-empty-toppings": ([('toppings = ["none"]', 'toppings = []')], "toppings: is empty"),
    "job-empty-families": ([('families = ["hollow-core"]', 'families = []')], "which would allow nothing"),
    "job-span-feet-inches-over": ([('span = "24 ft"', 'span = "24 ft 14 in"')], "14 in is a whole ft or more"),
    "job-span-inches-first": ([('span = "24 ft"', 'span = "6 in 24 ft"')], "'ft' comes after the smaller 'in'"),
    "job-span-in-defaults": ([('objective = "lightest"', 'objective = "lightest"\nspan = "20 ft"')], "'span' belongs to each [[bay]], not to [defaults]"),
    "job-fire-not-a-rating": ([('fire = "1 h"', 'fire = "1.25 h"')], "'1.25 h' is not a tabulated rating; use none, 1, 1.5, 2, 3 or 4 h"),
    "job-bearing-range": ([('bearing = "4 in"', 'bearing = "30 in"')], "'30 in' is outside the allowed range 0.5 to 24 in"),
    "job-humidity-wrong-type": ([('humidity = 70', 'humidity = "70 %"')], "found string; a number is needed"),
    "job-restrained-wrong-type": ([('restrained = false', 'restrained = "no"')], "found string; true or false is needed"),
    "job-units-unknown": ([('code = "ACI 318-19"', 'code = "ACI 318-19"\nunits = "metric"')], "'metric' is not allowed; use one of: us, si"),
    "job-line-unknown-key": ([('line = [{ w = "0.6 klf", at = "8 ft", kind = "dead" }]', 'line = [{ w = "0.6 klf", at = "8 ft", knid = "dead" }]')], "unknown part 'knid' (did you mean 'kind'?); a line has: w, at, kind"),
    "job-line-load-too-large": ([('line = [{ w = "0.6 klf"', 'line = [{ w = "600 klf"')], "'600 klf' is outside the allowed range 0 to 100 klf"),
    "job-marked-not-a-list": ([(BAY1, BAY1 + '\nmarked = "plank-8in-4ft / 6x1/2"')], "a list of entry labels is needed"),
    "job-pieces-zero": ([('pieces = 14', 'pieces = 0')], "0 is outside the allowed range 1 to 100000"),
    "job-families-misspelt": ([('families = ["hollow-core"]', 'families = ["hollowcore"]')], "(did you mean 'hollow-core'?)"),
    "job-point-beyond-span": ([(BAY1, BAY1 + '\npoint = [{ p = "2 kip", at = "30 ft" }]')], "bay 'Level 2 apartments' / point 1 / at: '30 ft' is not on the member; a place along it lies from 0'-0\" to 24'-0\" from the left support"),
    "job-point-force-wrong-kind": ([(BAY1, BAY1 + '\npoint = [{ p = "2 klf", at = "10 ft" }]')], "point 1 / p: '2 klf' is a line load, but a force is needed"),
    "job-point-missing-force": ([(BAY1, BAY1 + '\npoint = [{ at = "10 ft", kind = "live" }]')], "point 1 / p: missing: the force (a force from 0 to 1000 kip)"),
    "job-point-kind-misspelt": ([(BAY1, BAY1 + '\npoint = [{ p = "2 kip", at = "10 ft", kind = "snwo" }]')], "point 1 / kind: 'snwo' is not allowed (did you mean 'snow'?); use one of: dead, live, roof-live, snow"),
    "job-point-not-a-table": ([(BAY1, BAY1 + '\npoint = ["2 kip @ 10 ft"]')], "point 1: a table is needed, e.g. { p = \"4 kip\", at = \"12 ft\""),
    "job-point-number-not-string": ([(BAY1, BAY1 + '\npoint = [{ p = 2, at = "10 ft" }]')], "point 1 / p: found integer; a quoted string is needed"),
    "job-strip-ends-before-start": ([(BAY1, BAY1 + '\nstrip = [{ w = "0.4 klf", from = "12 ft", to = "4 ft" }]')], "strip 1 / to: ends at 4'-0\" but starts at 12'-0\": 'to' must lie beyond 'from'"),
    "job-patch-missing-width": ([(BAY1, BAY1 + '\npatch = [{ q = "100 psf", from = "4 ft", to = "8 ft" }]')], "patch 1 / wide: missing: its width across the span"),
    "job-opening-over-overhang": ([(BAY1, BAY1 + '\noverhang_right = "4 ft"\nopening = [{ from = "22 ft", to = "26 ft", wide = "2 ft" }]')], "opening 1 / to: an opening lies between the supports (0 to 24'-0\"); an overhang is not cut"),
    "job-items-not-a-list": ([(BAY1, BAY1 + '\nopening = { from = "2 ft", to = "4 ft", wide = "2 ft" }')], "opening: a list of tables is needed, e.g. opening = [{ from = \"8 ft\""),
    "job-share-nonsense": ([(BAY1, BAY1 + '\nshare = "half"')], "share: 'half' is not allowed; use one of: whole, rule, or a length such as \"8 ft\""),
    "job-overhang-too-long": ([(BAY1, BAY1 + '\noverhang_left = "40 ft"')], "'40 ft' is outside the allowed range 0 to 30 ft"),
    "job-top-bars-wrong-kind": ([(BAY1, BAY1 + '\ntop_bars = "0.6 in"')], "top_bars: '0.6 in' is a length, but an area is needed"),
    "job-defaults-not-a-table": ([('[job]\n', 'defaults = 3\n\n[job]\n'), ('[defaults]\nuse', '[other]\nuse')], "[defaults] must be a table"),
}

for name, (edit, expect) in sorted(cases.items()):
    text = base
    for old, new in edit:
        assert old in text, (name, old)
        text = text.replace(old, new, 1)
    (here / f"{name}.toml").write_text(f"# expect: {expect}\n" + text)
print(len(cases), "files")
