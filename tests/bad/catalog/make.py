"""Writes the broken catalogs of this folder from ../../good/minimal.toml.

Each file breaks the base in one way and starts with the message fragment
plankwise must print ("# expect: ..."). Run: python3 make.py
"""
import pathlib

here = pathlib.Path(__file__).parent
base = (here / "../../good/minimal.toml").read_text()
base = base.split("\n", 1)[1]  # drop the base's own comment line

HC = 'cores = { shape = "circle", count = 6, diameter = "5.5 in", spacing = "7.5 in" }'
HCROW = 'row = [{ count = 6, height = "1.75 in" }]'
DTROW = 'row = [{ count = 2, height = "3 in" }, { count = 2, height = "5 in", end_height = "15 in" }]'
GENERIC = '''
[[section]]
id = "gen"
mix = "m5000"

[section.generic]
outline = [["0 in", "0 in"], ["48 in", "0 in"], ["48 in", "6 in"], ["0 in", "6 in"]]
{voids}
[[section.pattern]]
id = "g"
strand = "3/8 in"
row = [{{ count = 4, height = "1.5 in" }}]
'''

cases = {
    # name: (list of (old, new) replacements or a callable, expected fragment)
    "syntax-unterminated-string": ([('name = "Minimal test catalog"', 'name = "Minimal test catalog')], "TOML syntax"),
    "syntax-bad-table-header": ([("[[section]]\nid = \"dt24\"", "[[section]\nid = \"dt24\"")], "TOML syntax"),
    "wrong-type-count": ([("count = 6, diameter", 'count = "six", diameter')], "invalid type"),
    "number-without-quotes": ([('depth = "8 in"', "depth = 8")], "quantities are quoted strings with a unit"),
    "missing-key-spacing": ([(', spacing = "7.5 in" }', " }")], "missing key 'spacing'"),
    "unknown-key-misspelt": ([('width = "48 in"', 'widht = "48 in"')], "unknown key 'widht' (did you mean 'width'?)"),
    "unknown-top-level-key": ([("[catalog]", "[catalogue]")], "unknown top-level key 'catalogue' (did you mean 'catalog'?)"),
    "missing-catalog-table": ([('[catalog]\nname = "Minimal test catalog"\n', "")], "missing [catalog] table"),
    "misspelt-mix-id": ([('id = "hc8"\nmix = "m5000"', 'id = "hc8"\nmix = "m500"')], "no mix with id 'm500' (did you mean 'm5000'?)"),
    "misspelt-strand": ([('id = "p6"\nstrand = "1/2 in"', 'id = "p6"\nstrand = "1/2 inch"')], "no strand '1/2 inch'"),
    "wrong-unit-kind": ([('fc = "5000 psi"', 'fc = "5000 ft"')], "'5000 ft' is a length, but a stress is needed"),
    "missing-unit": ([('fci = "3500 psi"', 'fci = "3500"')], "'3500' has no unit"),
    "unknown-unit": ([('unit_weight = "150 pcf"', 'unit_weight = "150 pfc"')], "'pfc' in '150 pfc' is not a unit of a unit weight"),
    "negative-spacing": ([('spacing = "7.5 in"', 'spacing = "-7.5 in"')], "'-7.5 in' must be greater than zero"),
    "zero-diameter": ([('diameter = "5.5 in"', 'diameter = "0 in"')], "'0 in' must be greater than zero"),
    "cores-overlap": ([('spacing = "7.5 in"', 'spacing = "5 in"')], "cores overlap each other"),
    "cores-cut-bottom-flange": ([('spacing = "7.5 in" }', 'spacing = "7.5 in", center_height = "3 in" }')], "the cores cut through the bottom flange: 0.25 in"),
    "cores-cut-top-flange": ([('spacing = "7.5 in" }', 'spacing = "7.5 in", center_height = "5.2 in" }')], "the cores cut through the top flange"),
    "core-too-close-to-side": ([('width = "48 in"', 'width = "44 in"')], "core 1 is too close to the side face"),
    "strand-above-top": ([(HCROW, 'row = [{ count = 6, height = "9 in" }]')], "'9 in' is not below the top of the 8 in section"),
    "strand-no-bottom-cover": ([(HCROW, 'row = [{ count = 6, height = "0.2 in" }]')], "has no clear cover: it breaks through a surface or into a core"),
    "strand-in-core": ([(HCROW, 'row = [{ count = 1, height = "4 in", x = ["5.25 in"] }]')], "lies inside a core or void"),
    "strand-outside-width": ([(HCROW, 'row = [{ count = 1, height = "1.75 in", x = ["60 in"] }]')], "is not inside the concrete"),
    "fci-above-fc": ([('fci = "3500 psi"', 'fci = "6000 psi"')], "f'ci '6000 psi' is above f'c '5000 psi'"),
    "absurd-fc": ([('fc = "5000 psi"', 'fc = "50000 psi"')], "outside the plausible range 2500 to 15000 psi"),
    "absurd-unit-weight": ([('unit_weight = "150 pcf"', 'unit_weight = "300 pcf"')], "outside the plausible range 90 to 160 pcf"),
    "empty-catalog": (lambda b: '[catalog]\nname = "Nothing here"\n', "the catalog has no sections"),
    "duplicate-section-id": ([('id = "dt24"', 'id = "hc8"')], "duplicate section id 'hc8'"),
    "duplicate-mix-id": ([("[[section]]\nid = \"hc8\"", '[[mix]]\nid = "m5000"\nfc = "6000 psi"\nfci = "4000 psi"\nunit_weight = "150 pcf"\naggregate = "carbonate"\n\n[[section]]\nid = "hc8"')], "duplicate mix id 'm5000'"),
    "duplicate-pattern-id": ([(HCROW, HCROW + '\n\n[[section.pattern]]\nid = "p6"\nstrand = "1/2 in"\n' + HCROW)], "duplicate pattern id 'p6'"),
    "pattern-before-section": (lambda b: '[catalog]\nname = "x"\n\n[[section.pattern]]\nid = "p"\nstrand = "1/2 in"\n' + HCROW + "\n", "before any [[section]]"),
    "depressed-hollow-core": ([(HCROW, 'row = [{ count = 6, height = "1.75 in", end_height = "4 in" }]')], "hollow-core strands stay straight"),
    "depressed-without-hold-down": ([("hold_down = 0.4\n", "")], "depressed rows need 'hold_down'"),
    "hold-down-out-of-range": ([("hold_down = 0.4", "hold_down = 0.9")], "0.9 is outside 0.05 to 0.5"),
    "jacking-too-high": ([('id = "p6"\nstrand = "1/2 in"', 'id = "p6"\nstrand = "1/2 in"\njacking = 0.95')], "0.95 is outside the plausible range 0.5 to 0.85"),
    "zero-strands": ([(HCROW, 'row = [{ count = 0, height = "1.75 in" }]')], "0 is outside the allowed range 1 to 100"),
    "too-many-strands-for-webs": ([(HCROW, 'row = [{ count = 8, height = "1.75 in" }]')], "8 strands do not fit one per web in a unit with 7 webs"),
    "tee-strands-not-shared": ([(DTROW, 'row = [{ count = 3, height = "3 in" }]')], "3 strands do not share equally among 2 stems"),
    "x-count-mismatch": ([(HCROW, 'row = [{ count = 2, height = "1.75 in", x = ["1.25 in"] }]')], "gives 1 positions for a row of 2 strands"),
    "core-shape-misspelt": ([('shape = "circle"', 'shape = "cirle"')], "'cirle' is not a core shape (did you mean 'circle'?)"),
    "circle-with-width": ([('diameter = "5.5 in"', 'diameter = "5.5 in", width = "5.5 in"')], "'width' does not apply to circular cores"),
    "stadium-missing-height": ([(HC, 'cores = { shape = "stadium", count = 6, width = "5.5 in", spacing = "7.5 in" }')], "missing key 'height'"),
    "corner-radius-too-large": ([(HC, 'cores = { shape = "rounded-rectangle", count = 6, width = "5.5 in", height = "5 in", corner_radius = "3 in", spacing = "7.5 in" }')], "more than half the smaller core side"),
    "aggregate-misspelt": ([('aggregate = "carbonate"', 'aggregate = "silicious"')], "(did you mean 'siliceous'?)"),
    "modulus-misspelt": ([('aggregate = "carbonate"', 'aggregate = "carbonate"\nmodulus = "normal-weight"')], "(did you mean 'normalweight'?)"),
    "normalweight-formula-lightweight": ([('unit_weight = "150 pcf"\naggregate = "carbonate"', 'unit_weight = "115 pcf"\naggregate = "sand-lightweight"\nmodulus = "normalweight"')], "applies only to normalweight concrete"),
    "two-geometry-tables": ([("[section.double_tee]", '[section.generic]\noutline = [["0 in", "0 in"], ["1 in", "0 in"], ["1 in", "1 in"]]\n\n[section.double_tee]')], "give exactly one geometry table"),
    "no-geometry-table": ([("[section.hollow_core]\n", "[section.hollow_core_x]\n")], "unknown key 'hollow_core_x' (did you mean 'hollow_core'?)"),
    "section-without-patterns": ([('\n[[section.pattern]]\nid = "p6"\nstrand = "1/2 in"\n' + HCROW + "\n", "\n")], "has no strand patterns"),
    "pattern-without-rows": ([(HCROW, "")], "has no strand rows"),
    "tee-flange-thicker-than-depth": ([('flange_thickness = "2 in"', 'flange_thickness = "30 in"')], "flange_thickness 30 in is not less than depth 24 in"),
    "tee-stems-do-not-fit": ([('stem_spacing = "48 in"', 'stem_spacing = "100 in"')], "the stems do not fit under the flange"),
    "tee-chamfer-too-large": ([('stem_width_bottom = "5.75 in"', 'stem_width_bottom = "5.75 in"\nchamfer = "3 in"')], "chamfer 3 in is too large"),
    "tee-negative-chamfer": ([('stem_width_bottom = "5.75 in"', 'stem_width_bottom = "5.75 in"\nchamfer = "-1 in"')], "must not be negative"),
    "generic-self-intersecting": (lambda b: b + GENERIC.replace('["48 in", "0 in"], ["48 in", "6 in"]', '["48 in", "6 in"], ["48 in", "0 in"]').format(voids=""), "the outline crosses itself"),
    "generic-void-outside": (lambda b: b + GENERIC.format(voids='\n[[section.generic.void]]\ncenter = ["47 in", "3 in"]\ndiameter = "4 in"\n'), "void 1 is not wholly inside the outline"),
    "generic-voids-overlap": (lambda b: b + GENERIC.format(voids='\n[[section.generic.void]]\ncenter = ["20 in", "3 in"]\ndiameter = "3 in"\n\n[[section.generic.void]]\ncenter = ["21 in", "3 in"]\ndiameter = "3 in"\n'), "voids 1 and 2 overlap"),
    "generic-not-at-soffit": (lambda b: b + GENERIC.replace('"0 in"]', '"1 in"]').format(voids=""), "put the soffit at y = 0"),
    "generic-point-three-values": (lambda b: b + GENERIC.replace('["48 in", "0 in"]', '["48 in", "0 in", "1 in"]').format(voids=""), "a point is two lengths [x, y]"),
    "keyway-profile-and-area": ([(HC, HC + '\nkeyway = { area = "4 in2", profile = [["0 in", "0 in"], ["0 in", "8 in"]] }')], "give either 'profile' (side-face points) or 'area'"),
    "keyway-profile-short": ([(HC, HC + '\nkeyway = { profile = [["0 in", "0 in"], ["0.5 in", "4 in"]] }')], "the side-face profile must run from height 0 to the depth (8 in)"),
    "code-basis-unsupported": ([('name = "Minimal test catalog"', 'name = "Minimal test catalog"\ncode = "ACI 318-14"')], "'ACI 318-14' is not supported"),
    "very-long-designation": ([('id = "hc8"\nmix', 'id = "hc8"\ndesignation = "' + "x" * 600 + '"\nmix')], "is 600 characters long; at most 500 allowed"),
    "very-long-id": ([('id = "hc8"', 'id = "' + "h" * 100 + '"')], "is 100 characters long; at most 80 allowed"),
    "strand-fpy-above-fpu": ([("[[section]]\nid = \"hc8\"", '[[strand]]\nid = "odd"\ndiameter = "0.5 in"\narea = "0.153 in2"\nfpu = "270 ksi"\nfpy = "280 ksi"\n\n[[section]]\nid = "hc8"')], "fpy 280 ksi must lie between 0.80 fpu and fpu"),
    "strand-relaxation-misspelt": ([("[[section]]\nid = \"hc8\"", '[[strand]]\nid = "odd"\ndiameter = "0.5 in"\narea = "0.153 in2"\nfpu = "270 ksi"\nrelaxation = "lo"\n\n[[section]]\nid = "hc8"')], "is not a relaxation class"),
    "strand-id-shadows-builtin": ([("[[section]]\nid = \"hc8\"", '[[strand]]\nid = "1/2 in"\ndiameter = "0.5 in"\narea = "0.167 in2"\nfpu = "270 ksi"\n\n[[section]]\nid = "hc8"')], "duplicate strand id '1/2 in'"),
    "max-length-absurd": ([('id = "hc8"\nmix = "m5000"', 'id = "hc8"\nmix = "m5000"\nmax_length = "500 ft"')], "outside the plausible range 5 to 200 ft"),
    "price-unknown-unit": ([('id = "hc8"\nmix = "m5000"', 'id = "hc8"\nmix = "m5000"\nprice = "12 USD"')], "'USD' in '12 USD' is not a unit of a price per area"),
    "bar-fy-absurd": ([(HCROW, HCROW + '\nbar = [{ count = 2, area = "0.2 in2", fy = "600 ksi", height = "6 in" }]')], "outside the plausible range 40 to 100 ksi"),
    "mix-not-a-list": ([("[[mix]]", "[mix]")], "'mix' must be a list of tables, written [[mix]]"),
    "section-mix-broken-only-once": ([('fc = "5000 psi"', 'fc = 5000')], "quantities are quoted strings with a unit"),
    "core-count-absurd": ([("count = 6, diameter", "count = 60, diameter")], "60 is outside the allowed range 1 to 30"),
    # --- refused since the files-and-input rules: text, quantities, geometry, values
    "control-esc-in-name": ([('name = "Minimal test catalog"', 'name = "Minimal \\u001b[31mred"')], "holds the control character \\u{1b}"),
    "control-bidi-in-designation": ([('id = "hc8"\nmix', 'id = "hc8"\ndesignation = "plank \\u202e8 ni"\nmix')], "holds the control character \\u{202e}"),
    "control-c1-in-remarks": ([('id = "hc8"\nmix', 'id = "hc8"\nremarks = "note\\u0085here"\nmix')], "holds the control character \\u{85}"),
    "control-in-section-id": ([('id = "hc8"', 'id = "hc\\u00078"')], "holds the control character \\u{7}"),
    "control-del-in-pattern-id": ([('id = "p6"', 'id = "p\\u007f6"')], "holds the control character \\u{7f}"),
    "control-in-notes": ([('name = "Minimal test catalog"', 'name = "Minimal test catalog"\nnotes = ["fine", "bad\\u001b]0;title\\u0007"]')], "holds the control character \\u{1b}"),
    "control-in-producer": ([('name = "Minimal test catalog"', 'name = "Minimal test catalog"\nproducer = "Acme\\u2066"')], "holds the control character \\u{2066}"),
    "control-in-mix-id": ([('id = "m5000"\nfc', 'id = "m5\\u001b000"\nfc'), ('mix = "m5000"', 'mix = "m5\\u001b000"')], "holds the control character \\u{1b}"),
    "feet-inches-over-a-foot": ([('depth = "8 in"', 'depth = "0 ft 13 in"')], "'0 ft 13 in' is not a well-formed length: 13 in is a whole ft or more"),
    "inches-before-feet": ([('width = "48 in"', 'width = "6 in 3 ft"')], "'ft' comes after the smaller 'in'; give the larger unit first"),
    "same-unit-twice": ([('depth = "8 in"', 'depth = "6 in 2 in"')], "'in' is given twice"),
    "compound-stress": ([('fc = "5000 psi"', 'fc = "5 ksi 0 psi"')], "has several values; a stress takes one number and one unit"),
    "keyway-area-as-large-as-section": ([(HC, HC + '\nkeyway = { area = "400 in2" }')], "is as large as the section itself"),
    "keyway-area-leaves-no-web": ([(HC, HC + '\nkeyway = { area = "30 in2" }')], "leaves no edge web"),
    "keyway-profile-eats-the-web": ([(HC, HC + '\nkeyway = { profile = [["0 in", "0 in"], ["3.5 in", "1 in"], ["3.5 in", "7 in"], ["0 in", "8 in"]] }')], "too close to the side face"),
    "strands-coincide": ([(HCROW, 'row = [{ count = 2, height = "1.75 in", x = ["9 in", "9 in"] }]')], "two strands coincide"),
    "strands-overlap": ([(HCROW, 'row = [{ count = 2, height = "1.75 in", x = ["9 in", "9.3 in"] }]')], "two strands overlap"),
    "strands-overlap-across-rows": ([(DTROW, 'row = [{ count = 2, height = "3 in" }, { count = 2, height = "3.2 in" }]')], "two strands overlap"),
    "debond-beyond-half-member": ([('id = "hc8"\nmix = "m5000"', 'id = "hc8"\nmix = "m5000"\nmax_length = "30 ft"'), (HCROW, 'row = [{ count = 4, height = "1.75 in" }, { count = 2, height = "1.75 in", x = ["9 in", "39 in"], debond = "16 ft" }]')], "reaches half the longest member"),
    "negative-section-price": ([('id = "hc8"\nmix = "m5000"', 'id = "hc8"\nmix = "m5000"\nprice = "-12 /ft2"')], "is negative; a price is 0 or more"),
    "negative-pattern-price": ([('id = "p6"\nstrand = "1/2 in"', 'id = "p6"\nstrand = "1/2 in"\nprice = "-1 /ft2"')], "is negative; a price is 0 or more"),
    "generic-outline-touches-itself": (lambda b: b + GENERIC.replace('[["0 in", "0 in"], ["48 in", "0 in"], ["48 in", "6 in"], ["0 in", "6 in"]]', '[["0 in", "0 in"], ["48 in", "0 in"], ["48 in", "6 in"], ["24 in", "0 in"], ["0 in", "6 in"]]').format(voids=""), "the outline crosses itself"),
    "web-steel-on-hollow-core": ([(HCROW, HCROW + '\nweb_steel = { area = "0.2 in2", spacing = "12 in", fy = "60 ksi" }')], "a hollow-core section has no stems"),
    "web-steel-spacing-absurd": ([(DTROW, DTROW + '\nweb_steel = { area = "0.2 in2", spacing = "100 in", fy = "60 ksi" }')], "'100 in' is outside the plausible range 1 to 48 in"),
    "catalog-units-unknown": ([('name = "Minimal test catalog"', 'name = "Minimal test catalog"\nunits = "imperial"')], "'imperial' is not allowed; use one of: us, si"),
    "empty-name": ([('name = "Minimal test catalog"', 'name = ""')], "is empty"),
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
