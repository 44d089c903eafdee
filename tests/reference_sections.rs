//! Section properties against the PyPI library `sectionproperties`
//! (version named in tests/reference/sections.json), which rebuilt every
//! section from the same TOML independently and integrated a mesh of it
//! (tests/reference/gen_sections.py). Agreement within 0.1 %.

use std::path::Path;

use plankwise::catalog::Catalog;

const TOLERANCE: f64 = 1e-3;

#[test]
fn section_properties_agree_with_sectionproperties() {
    let root = Path::new(env!("CARGO_MANIFEST_DIR"));
    let refs: serde_json::Value =
        serde_json::from_str(&std::fs::read_to_string(root.join("tests/reference/sections.json")).unwrap()).unwrap();
    let table = refs["sections"].as_object().unwrap();
    let mut compared = 0;
    for file in ["catalog/demo-us.toml", "catalog/demo-si.toml", "tests/reference/shapes.toml"] {
        let cat = Catalog::load(&root.join(file)).unwrap();
        let stem = Path::new(file).file_stem().unwrap().to_str().unwrap();
        for s in &cat.sections {
            let key = format!("{stem}/{}", s.id);
            let r = table
                .get(&key)
                .unwrap_or_else(|| panic!("{key} missing from sections.json: run gen_sections.py"));
            for (name, ours) in [("area_in2", s.props.area_in2), ("yb_in", s.props.yb_in), ("ix_in4", s.props.ix_in4)] {
                let theirs = r[name].as_f64().unwrap();
                let rel = (ours - theirs).abs() / theirs.abs();
                assert!(
                    rel <= TOLERANCE,
                    "{key} {name}: plankwise {ours} vs sectionproperties {theirs} ({:.4} %)",
                    rel * 100.0
                );
            }
            compared += 1;
        }
    }
    assert_eq!(compared, table.len(), "sections.json lists sections no catalog has");
    assert!(compared >= 25, "only {compared} sections compared");
}
