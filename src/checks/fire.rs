//! Fire resistance of the member: heat transmission and strand cover.
//!
//! Clauses: IBC 2021 §722.2.2.1 (equivalent thickness, Table 722.2.2.1;
//! hollow-core: net area ÷ width, §722.2.2.1.1; double tee: the flange, by
//! the ribbed-soffit rule §722.2.2.1.3; a topping of the same aggregate adds
//! its thickness), §722.2.3 (slab cover, Table 722.2.3(1); beam and stem
//! cover, Tables 722.2.3(4)/(5) with the averaging rules of §722.2.3.3:
//! the average of individual covers, a corner strand at half its cover,
//! strands on the stem centre line by their centroid, no strand below half
//! the table value nor below 1 in); ACI 216.1. The rating reached is the
//! least of the criteria, each the largest tabulated rating met.
//!
//! Does not cover: two-course floors of different aggregates (§722.2.2.2),
//! insulation or roofing (§722.2.2.3), stems narrower than 8 in (Table
//! 722.2.3(5) is not in plankwise's data: such stems are reported as not
//! rated), and the reduced-cover strength rule of §721.1.5.

use serde::Serialize;

use super::{Analysis, CheckInfo, CheckResult, Group};
use crate::fire::{rating_by_beam_cover, rating_by_slab_cover, rating_by_thickness};
use crate::member::Member;
use crate::section::Family;

/// Registry entry.
pub const INFO: CheckInfo = CheckInfo {
    id: "fire",
    title: "Fire rating reached",
    clause: "IBC 2021 722.2.2.1, 722.2.3 (Tables 722.2.2.1, 722.2.3(1), 722.2.3(4)); ACI 216.1",
    unit: "h",
    group: Group::Fire,
    load_driven: false,
};

/// The fire assessment.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct Fire {
    /// Equivalent thickness for heat transmission, in.
    pub equiv_thickness_in: f64,
    /// Rating by heat transmission, h.
    pub rating_thickness_h: f64,
    /// Cover the cover criterion used (least slab cover, or average stem cover), in.
    pub cover_in: f64,
    /// Rating by strand cover, h (None: not rated by plankwise's tables).
    pub rating_cover_h: Option<f64>,
    /// Overall rating, h (None when the cover criterion is not rated).
    pub rating_h: Option<f64>,
    /// What decided it.
    pub note: String,
}

/// Average cover of the strands of one stem by IBC §722.2.3.3, in.
fn stem_average_cover(m: &Member, xc: f64, half_width: impl Fn(f64) -> f64) -> Option<f64> {
    let db = m.db();
    let strands: Vec<(f64, f64)> = m
        .layers
        .iter()
        .flat_map(|l| l.x.iter().map(move |&x| (x, l.y_mid)))
        .filter(|&(x, y)| (x - xc).abs() <= half_width(y))
        .collect();
    if strands.is_empty() {
        return None;
    }
    if strands.len() >= 2 && strands.iter().all(|(x, _)| (x - xc).abs() < 1e-6) {
        // on the stem centre line: distance from the bottom to their centroid
        return Some(strands.iter().map(|s| s.1).sum::<f64>() / strands.len() as f64);
    }
    let covers: Vec<f64> = strands
        .iter()
        .map(|&(x, y)| {
            let bottom = y - db / 2.0;
            let side = half_width(y) - (x - xc).abs() - db / 2.0;
            // a corner strand, about equidistant from bottom and side, counts at half
            if (bottom - side).abs() <= 0.1 * bottom.max(side) {
                bottom.min(side) / 2.0
            } else {
                bottom.min(side)
            }
        })
        .collect();
    Some(covers.iter().sum::<f64>() / covers.len() as f64)
}

/// Assess the member.
pub fn assess(m: &Member, brief: bool) -> Fire {
    // a brief evaluation (ranking) skips the note
    let say = |a: std::fmt::Arguments| if brief { String::new() } else { a.to_string() };
    let agg = m.mix.aggregate;
    let same = m.case.topping.as_ref().is_some_and(|t| t.mix.aggregate == agg);
    let topping = if same {
        m.case.topping.as_ref().map_or(0.0, |t| t.thickness.get())
    } else {
        0.0
    };
    let te = m.section.equivalent_thickness() + topping;
    let r_t = rating_by_thickness(agg, te);
    let restrained = m.case.restrained;
    let db = m.db();
    let mut note = say(format_args!(
        "te = {te:.2} in{}",
        if m.case.topping.is_some() && !same {
            " (topping of another aggregate not counted)"
        } else {
            ""
        }
    ));
    let (cover, r_c) = match m.section.family {
        Family::DoubleTee => {
            let g = &m.section.geometry;
            let bw = |y: f64| g.width_at(y.max(g.chamfer + 1e-6)) / g.stems.len().max(1) as f64;
            let covers: Vec<f64> = g
                .stems
                .iter()
                .filter_map(|&xc| stem_average_cover(m, xc, |y| bw(y) / 2.0))
                .collect();
            let least_individual = m.layers.iter().map(|l| l.y_mid - db / 2.0).fold(f64::INFINITY, f64::min);
            let avg = covers.iter().copied().fold(f64::INFINITY, f64::min);
            // strands in no stem (all in the flange) are rated by their own least cover
            let avg = if avg.is_finite() { avg } else { least_individual };
            let width = bw(0.0);
            let r = rating_by_beam_cover(agg, restrained, width, avg);
            if least_individual < 1.0 {
                note.push_str(&say(format_args!(
                    "; a strand has {least_individual:.2} in cover, below the 1 in minimum of 722.2.3.3"
                )));
                (avg, Some(0.0))
            } else {
                if r.is_none() {
                    note.push_str(&say(format_args!(
                        "; stems {width:.2} in wide fall under IBC Table 722.2.3(5), not in plankwise's data: average stem cover {avg:.2} in, verify by hand"
                    )));
                }
                (avg, r)
            }
        }
        _ => {
            let least = m
                .layers
                .iter()
                .map(|l| l.y_mid.min(l.y_end) - db / 2.0)
                .fold(f64::INFINITY, f64::min);
            (least, Some(rating_by_slab_cover(agg, restrained, least)))
        }
    };
    let rating = r_c.map(|c| c.min(r_t));
    if let Some(c) = r_c {
        note.push_str(&say(format_args!(
            "; heat transmission {} h, cover {cover:.2} in gives {} h ({})",
            fmt_h(r_t),
            fmt_h(c),
            if restrained { "restrained" } else { "unrestrained" }
        )));
    }
    Fire {
        equiv_thickness_in: te,
        rating_thickness_h: r_t,
        cover_in: cover,
        rating_cover_h: r_c,
        rating_h: rating,
        note,
    }
}

/// "1½" style hours (formatted only when printed).
pub fn fmt_h(h: f64) -> Hours {
    Hours(h)
}

/// Hours as a rating prints them: "1", "1½", "2".
#[derive(Debug, Clone, Copy)]
pub struct Hours(pub f64);

impl std::fmt::Display for Hours {
    fn fmt(&self, f: &mut std::fmt::Formatter) -> std::fmt::Result {
        if (self.0 - 1.5).abs() < 1e-9 {
            f.write_str("1½")
        } else {
            write!(f, "{:.0}", self.0)
        }
    }
}

/// Run only when the case requires a rating.
pub fn run(an: &Analysis) -> Option<CheckResult> {
    let need = an.member.case.fire_rating?;
    let f = &an.fire;
    let reached = f.rating_h.unwrap_or(0.0);
    let mut r = CheckResult::new(&INFO, need, reached, None, f.note.clone());
    if reached < 1.0 {
        // below the lowest tabulated rating: counted as ½ h to keep the ratio finite
        r.ratio = need / 0.5;
        r.note.push_str("; below 1 h, counted as ½ h in the ratio");
    }
    if f.rating_h.is_none() {
        r.note.push_str("; not rated, so not passed");
    }
    Some(r)
}
