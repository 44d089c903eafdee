"""Writes the broken job files of this folder from ../../../catalog/demo-job.toml.

Each breaks the demo job in one way; the first line is the fragment
plankwise must print ("# expect: ..."). Run: python3 make.py
"""
import pathlib

here = pathlib.Path(__file__).parent
base = (here / "../../../catalog/demo-job.toml").read_text()

cases = {
    "job-syntax-error": ([('project = "Millbrook', 'project = Millbrook')], "TOML syntax"),
    "job-unknown-key": ([('engineer = "R.', 'enginer = "R.')], "unknown key 'enginer' (did you mean 'engineer'?)"),
    "job-unknown-top-level": ([("[defaults]", "[default]")], "unknown top-level key 'default' (did you mean 'defaults'?)"),
    "job-missing-job-table": ([("[job]\n", "[jobs]\n")], "unknown top-level key 'jobs'"),
    "job-span-wrong-kind": ([('span = "24 ft"', 'span = "24 psf"')], "'24 psf' is an area load, but a length is needed"),
    "job-span-missing-unit": ([('span = "24 ft"', 'span = "24"')], "'24' has no unit"),
    "job-missing-span": ([('name = "Level 2 apartments"\nspan = "24 ft"\n', 'name = "Level 2 apartments"\n')], "missing key 'span'"),
    "job-objective-misspelt": ([('objective = "lightest"', 'objective = "ligthest"')], "(did you mean 'lightest'?)"),
    "job-fire-not-tabulated": ([('fire = "1 h"', 'fire = "2.5 h"')], "'2.5 h' is not a tabulated rating"),
    "job-fire-wrong-kind": ([('fire = "1 h"', 'fire = "1 ft"')], "'1 ft' is a length, but a duration is needed"),
    "job-duplicate-bay": ([('name = "Level 1 retail"', 'name = "Level 2 apartments"')], "duplicate bay name"),
    "job-line-beyond-span": ([('at = "8 ft"', 'at = "28 ft"')], "is not within the 20.00 ft span"),
    "job-line-kind": ([('kind = "dead"', 'kind = "dad"')], "(did you mean 'dead'?)"),
    "job-humidity-range": ([("humidity = 70", "humidity = 170")], "170 is outside 20 to 100"),
    "job-sustained-range": ([("sustained = 0.3", "sustained = 3")], "3 is outside 0 to 1"),
    "job-topping-thickness": ([('toppings = ["none", "2 in"]', 'toppings = ["none", "20 in"]')], "outside the plausible range 0.5 to 12 in"),
    "job-family-misspelt": ([('families = ["hollow-core"]', 'families = ["hollowcore"]')], "(did you mean 'hollow-core'?)"),
    "job-negative-live": ([('live = "40 psf"', 'live = "-40 psf"')], "outside the plausible range 0 to 2000 psf"),
    "job-class-unknown": ([('class = "U"', 'class = "Z"')], "'Z' is not allowed"),
    "job-no-bays": (lambda b: b.split("[[bay]]")[0], "the job has no bays"),
    "job-topping-mix-missing": ([('topping_mix = "topping-4000"', 'topping_mix = "topping-5000"')], "topping_mix 'topping-5000' is not a mix of the catalog"),
    # run against the SI catalog, which has no double tees
    "job-bay-references-nothing": ([('[job]', '# catalog: catalog/demo-si.toml\n[job]')], "the catalog has no section of the families asked for (double-tee)"),
}

for name, (edit, expect) in sorted(cases.items()):
    if callable(edit):
        text = edit(base)
    else:
        text = base
        for old, new in edit:
            assert old in text, (name, old)
            text = text.replace(old, new, 1)
    (here / f"{name}.toml").write_text(f"# expect: {expect}\n" + text)
print(len(cases), "files")
