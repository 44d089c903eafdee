//! Moment and shear diagrams against the PyPI library `pycba` 1.0.2
//! (continuous beam analysis by the direct stiffness method):
//! tests/reference/gen_beams.py analyses five members — simple spans and
//! spans with one or two overhangs, under uniform loads over the whole
//! member or part of it and point loads — and writes the reactions and the
//! moment and shear at every result point to beams.json. plankwise's own
//! statics (`plankwise::beam`) must give the same to 1e-9 of the largest
//! value of each diagram. Closed forms of any statics text come first, to
//! pin the sign conventions the two share.

use std::path::Path;

use approx::assert_relative_eq;
use plankwise::beam::{Beam, Load};

#[test]
fn closed_forms_fix_the_signs() {
    // simple span, point load P at a: R_left = P b / L, M under the load = P a b / L,
    // shear left of the load +P b / L, right of it −P a / L
    let (l, p, a) = (300.0, 1000.0, 100.0);
    let beam = Beam { l };
    let loads = [Load::Point { p, a }];
    let r = beam.reactions(&loads);
    assert_relative_eq!(r.0, p * (l - a) / l);
    assert_relative_eq!(beam.at(&loads, r, a).0, p * a * (l - a) / l, max_relative = 1e-12);
    assert_relative_eq!(beam.at(&loads, r, a - 1.0).1, p * (l - a) / l, max_relative = 1e-12);
    assert_relative_eq!(beam.at(&loads, r, a + 1.0).1, -p * a / l, max_relative = 1e-12);
}

#[test]
fn diagrams_agree_with_pycba() {
    let root = Path::new(env!("CARGO_MANIFEST_DIR"));
    let refs: serde_json::Value = serde_json::from_str(&std::fs::read_to_string(root.join("tests/reference/beams.json")).unwrap()).unwrap();
    assert!(refs["library"].as_str().unwrap().starts_with("pycba"));
    let beams = refs["beams"].as_object().unwrap();
    assert!(beams.len() >= 5);
    for (name, b) in beams {
        let l = b["l_in"].as_f64().unwrap();
        let loads: Vec<Load> = b["loads"]
            .as_array()
            .unwrap()
            .iter()
            .map(|ld| match ld["kind"].as_str().unwrap() {
                "point" => Load::Point {
                    p: ld["p_lbf"].as_f64().unwrap(),
                    a: ld["a_in"].as_f64().unwrap(),
                },
                _ => Load::Span {
                    w: ld["w_lbf_per_in"].as_f64().unwrap(),
                    a: ld["a_in"].as_f64().unwrap(),
                    b: ld["b_in"].as_f64().unwrap(),
                },
            })
            .collect();
        let beam = Beam { l };
        let r = beam.reactions(&loads);
        let want: Vec<f64> = b["reactions_lbf"].as_array().unwrap().iter().map(|v| v.as_f64().unwrap()).collect();
        assert_relative_eq!(r.0, want[0], max_relative = 1e-9);
        assert_relative_eq!(r.1, want[1], max_relative = 1e-9);
        let pts = b["points"].as_array().unwrap();
        assert!(pts.len() > 150, "{name}");
        let scale = |key: &str| pts.iter().map(|p| p[key].as_f64().unwrap().abs()).fold(0.0, f64::max);
        let (sm, sv) = (scale("m_lbin"), scale("v_lbf"));
        for p in pts {
            let x = p["x_in"].as_f64().unwrap();
            let (m, v) = beam.at(&loads, r, x);
            let (pm, pv) = (p["m_lbin"].as_f64().unwrap(), p["v_lbf"].as_f64().unwrap());
            assert!((m - pm).abs() <= 1e-9 * sm, "{name} at {x}: M {m} against pycba {pm}");
            assert!((v - pv).abs() <= 1e-9 * sv, "{name} at {x}: V {v} against pycba {pv}");
        }
    }
}
