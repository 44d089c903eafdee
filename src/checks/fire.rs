//! Fire resistance of the member: heat transmission and strand cover.
//!
//! Clauses: IBC 2021 §722.2.2.1 (equivalent thickness, Table 722.2.2.1;
//! hollow-core: net area ÷ width, §722.2.2.1.1; double tee: the flange, by
//! the ribbed-soffit rule §722.2.2.1.3; a topping of the same aggregate adds
//! its thickness), §722.2.3 (slab cover, Table 722.2.3(1); beam and stem
//! cover, Tables 722.2.3(4) for beams 8 in wide or more and 722.2.3(5) for
//! stems of any width by area, the smaller value where both apply);
//! §722.2.3.3 and §722.2.3.3.1 (the average of the strands' covers, a
//! corner strand at half its cover, strands on the stem centre line by their
//! centroid; and every strand's own cover — the least concrete between it
//! and any fire-exposed face, soffit, chamfer or stem side — at least the
//! greater of half the table value for the rating and 1 in); ACI 216.1.
//! The rating reached is the least of the criteria, each the largest
//! tabulated rating met; the strand that limits it is named.
//!
//! The beam and stem tables are held from memory: every rating that rests
//! on them says so ([`crate::fire::BEAM_TABLES_MARK`]). The cells of
//! footnote c (stirrups at no more than the member depth) count only for
//! patterns that give such stem reinforcement. The flange strip a stem's
//! area may count is the precast flange, not a topping.
//!
//! Does not cover: two-course floors of different aggregates (§722.2.2.2),
//! insulation or roofing (§722.2.2.3), the ¾ in relief for restrained
//! beams 4 ft apart or closer (not transcribed), and the reduced-cover
//! strength rule of §721.1.5.

use serde::Serialize;

use super::{Analysis, CheckInfo, CheckResult, Group, Reads};
use crate::fire::{BEAM_TABLES_MARK, RATINGS, rating_by_slab_cover, rating_by_thickness, stem_requirement};
use crate::member::Member;
use crate::section::Family;

/// Registry entry.
pub const INFO: CheckInfo = CheckInfo {
    id: "fire",
    title: "Fire rating reached",
    clause: "IBC 2021 722.2.2.1, 722.2.3, 722.2.3.3.1 (Tables 722.2.2.1, 722.2.3(1), 722.2.3(4), 722.2.3(5)); ACI 216.1",
    unit: "h",
    group: Group::Fire,
    reads: Reads::Hours,
    load_driven: false,
};

/// The fire assessment.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct Fire {
    /// Equivalent thickness for heat transmission, in.
    pub equiv_thickness_in: f64,
    /// Rating by heat transmission, h.
    pub rating_thickness_h: f64,
    /// Cover the cover criterion used (least slab cover, or the least
    /// average stem cover), in.
    pub cover_in: f64,
    /// Rating by strand cover, h (None: not rated by plankwise's tables).
    pub rating_cover_h: Option<f64>,
    /// Overall rating, h (None when the cover criterion is not rated).
    pub rating_h: Option<f64>,
    /// The least cover of any one strand to a fire-exposed face, in.
    pub least_strand_cover_in: f64,
    /// Whether the rating rests on the beam and stem tables held from memory.
    pub from_memory: bool,
    /// What decided it.
    pub note: String,
}

/// One strand of a stem and what it counts in the average.
struct StemStrand {
    /// Its contribution to the average (a corner strand at half), in.
    in_average: f64,
    x: f64,
    y: f64,
}

/// The strands of the stem centred at `xc` and their average cover by IBC
/// §722.2.3.3 (strands on the centre line: the distance from the bottom to
/// their centroid).
fn stem_strands(m: &Member, xc: f64, half_width: impl Fn(f64) -> f64) -> Option<(Vec<StemStrand>, f64)> {
    let db = m.db();
    let strands: Vec<StemStrand> = m
        .layers
        .iter()
        .flat_map(|l| l.x.iter().map(move |&x| (x, l.y_mid)))
        .filter(|&(x, y)| (x - xc).abs() <= half_width(y))
        .map(|(x, y)| {
            let bottom = y - db / 2.0;
            let side = half_width(y) - (x - xc).abs() - db / 2.0;
            // a corner strand, about equidistant from bottom and side, counts at half
            let corner = (bottom - side).abs() <= 0.1 * bottom.max(side);
            StemStrand {
                in_average: if corner { bottom.min(side) / 2.0 } else { bottom.min(side) },
                x,
                y,
            }
        })
        .collect();
    if strands.is_empty() {
        return None;
    }
    let avg = if strands.len() >= 2 && strands.iter().all(|s| (s.x - xc).abs() < 1e-6) {
        strands.iter().map(|s| s.y).sum::<f64>() / strands.len() as f64
    } else {
        strands.iter().map(|s| s.in_average).sum::<f64>() / strands.len() as f64
    };
    Some((strands, avg))
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
    let mut from_memory = false;
    let (cover, r_c, least) = match (m.section.family, &m.section.spec) {
        (Family::DoubleTee, crate::catalog::FamilySpec::DoubleTee(dt)) => {
            from_memory = true;
            let g = &m.section.geometry;
            let n = g.stems.len().max(1) as f64;
            let bw = |y: f64| g.width_at(y.max(g.chamfer + 1e-6)) / n;
            // the narrower (bottom) width of a stem decides Table (4)
            let width = dt.stem_width_bottom.min(dt.stem_width_top);
            // Table (5): a stem's area below the flange, with a strip of
            // flange up to three average stem widths (precast flange only)
            let avg_w = 0.5 * (dt.stem_width_top + dt.stem_width_bottom);
            let stem_area = (m.bare.area_in2 - dt.flange_width * dt.flange_thickness) / n;
            let strip = (3.0 * avg_w).min(dt.flange_width / n) * dt.flange_thickness;
            let area = stem_area + strip;
            let stirrups = m.pattern.web_steel.is_some_and(|w| w.spacing.get() <= m.h_total);
            let stems: Vec<(Vec<StemStrand>, f64)> = g.stems.iter().filter_map(|&xc| stem_strands(m, xc, |y| bw(y) / 2.0)).collect();
            let avg = stems.iter().map(|s| s.1).fold(f64::INFINITY, f64::min);
            // the strand with the least cover of its own, in any stem or the flange
            let all: Vec<(f64, f64, f64)> = m
                .layers
                .iter()
                .flat_map(|l| l.x.iter().map(move |&x| (x, l.y_mid)))
                .map(|(x, y)| (g.clear_cover(x, y, db), x, y))
                .collect();
            let (least, lx, ly) = all
                .iter()
                .copied()
                .fold((f64::INFINITY, 0.0, 0.0), |a, b| if b.0 < a.0 { b } else { a });
            let avg = if avg.is_finite() { avg } else { least };
            let mut reached = 0.0;
            let mut why = String::new();
            for (i, &r) in RATINGS.iter().enumerate() {
                let Some(need) = stem_requirement(agg, restrained, width, area, i, stirrups) else {
                    why = say(format_args!(
                        "{} h is not permitted for stems {width:.2} in wide, {area:.0} in² (Tables 722.2.3(4)/(5))",
                        crate::checks::fire::fmt_h(r)
                    ));
                    break;
                };
                let own_min = (0.5 * need).max(1.0);
                if avg < need - 1e-9 {
                    why = say(format_args!(
                        "{} h needs an average cover of {need:.2} in; the stems give {avg:.2} in",
                        fmt_h(r)
                    ));
                    break;
                }
                if least < own_min - 1e-9 {
                    why = say(format_args!(
                        "{} h needs every strand at {own_min:.2} in from a fire-exposed face (722.2.3.3.1); the strand at x = {lx:.2} in, y = {ly:.2} in has {least:.2} in",
                        fmt_h(r)
                    ));
                    break;
                }
                reached = r;
            }
            note.push_str(&say(format_args!(
                "; stems {width:.2} in wide, {area:.0} in² with the flange strip (Tables 722.2.3(4)/(5), {BEAM_TABLES_MARK}); average stem cover {avg:.2} in, least strand cover {least:.2} in"
            )));
            if !why.is_empty() {
                note.push_str("; ");
                note.push_str(&why);
            }
            (avg, Some(reached), least)
        }
        _ => {
            // slabs: each strand's own cover to the soffit against Table 722.2.3(1)
            let (least, lx, ly) = m
                .layers
                .iter()
                .flat_map(|l| l.x.iter().map(move |&x| (l.y_mid.min(l.y_end) - db / 2.0, x, l.y_mid.min(l.y_end))))
                .fold((f64::INFINITY, 0.0, 0.0), |a, b| if b.0 < a.0 { b } else { a });
            note.push_str(&say(format_args!(
                "; least strand cover {least:.2} in (the strand at x = {lx:.2} in, y = {ly:.2} in)"
            )));
            (least, Some(rating_by_slab_cover(agg, restrained, least)), least)
        }
    };
    let rating = r_c.map(|c| c.min(r_t));
    if let Some(c) = r_c {
        note.push_str(&say(format_args!(
            "; heat transmission {} h, cover gives {} h ({})",
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
        least_strand_cover_in: least,
        from_memory,
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

/// Run only when the case requires a rating. Demand is the rating needed,
/// capacity the rating reached, both in hours; a rating is not a
/// percentage, so the output says "needs 2 h, reaches 1½ h".
pub fn run(an: &Analysis) -> Option<CheckResult> {
    let need = an.member.case.fire_rating?;
    let f = &an.fire;
    let reached = f.rating_h.unwrap_or(0.0);
    let mut r = CheckResult::new(&INFO, need, reached, None, f.note.clone());
    if reached < 1.0 {
        // below the lowest tabulated rating: the ratio only orders failures
        r.ratio = need / 0.5;
        r.pass = false;
    }
    if !an.brief {
        r.note = format!(
            "needs {} h, reaches {} h; {}",
            fmt_h(need),
            if reached < 1.0 {
                "less than 1".to_string()
            } else {
                fmt_h(reached).to_string()
            },
            f.note
        );
    }
    Some(r)
}
