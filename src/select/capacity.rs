//! The capacity of a whole catalog (or the part a bay's filters leave):
//! for every entry, the largest superimposed load it carries at each span
//! of a range and the check that limits it there, and for each of a few
//! load levels the longest span it reaches and the check that stops it.
//!
//! The layout printed from it is our own: one row per entry, one column
//! per load level, each cell the longest span at that load and the check
//! that ends it ([`crate::report::capacity`]). The loads varied are the
//! ones the bay's use names (floor live, or on a roof Lr = S); every other
//! load and criterion of the bay is held.

use serde::Serialize;

use super::envelope::{LoadLimit, envelope};
use super::{Entry, case_for, entries, par_map, topping_mix};
use crate::bay::Bay;
use crate::catalog::Catalog;
use crate::checks::evaluate_brief;
use crate::units::{AreaLoad, Length};

/// How far one load level reaches on one entry.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct Reach {
    /// The varied load, psf.
    pub load_psf: f64,
    /// The longest span the entry carries it over, ft (None: not even the
    /// shortest span of the range).
    pub longest_span_ft: Option<f64>,
    /// The check that fails just beyond it (None: the range's longest span
    /// or the catalog's production limit is reached first).
    pub stopped_by: Option<String>,
}

/// One entry's row of the table.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct CapacityRow {
    /// "section / pattern [+ topping]".
    pub entry: String,
    /// Section id.
    pub section: String,
    /// Pattern id.
    pub pattern: String,
    /// Topping thickness, in (0 for none).
    pub topping_in: f64,
    /// Depth with topping, in.
    pub depth_in: f64,
    /// Self-weight with topping, psf.
    pub weight_psf: f64,
    /// Longest span at each load level.
    pub reach: Vec<Reach>,
    /// The largest load at each span of the range and what limits it.
    pub limits: Vec<LoadLimit>,
}

/// What to tabulate.
#[derive(Debug, Clone, PartialEq)]
pub struct Request {
    /// Spans of the envelope, ft.
    pub spans_ft: Vec<f64>,
    /// Load levels for the longest spans, psf.
    pub loads_psf: Vec<f64>,
    /// Only entries whose depth with topping lies within, in.
    pub depth_in: Option<(f64, f64)>,
}

/// The table for every entry of the catalog the bay admits (its families,
/// toppings; its fire rating and every other criterion are checked).
pub fn table(cat: &Catalog, bay: &Bay, req: &Request) -> Vec<CapacityRow> {
    let tm = topping_mix(cat, bay);
    let all: Vec<Entry> = entries(cat, bay)
        .into_iter()
        .filter(|e| {
            let d = e.section.props.depth_in + e.topping.map_or(0.0, |t| t.get());
            req.depth_in.is_none_or(|(lo, hi)| d >= lo - 1e-9 && d <= hi + 1e-9)
        })
        .collect();
    let hi = req.spans_ft.last().copied().unwrap_or(4.0);
    par_map(&all, 2, 1, |e| {
        let base = case_for(bay, e.topping, &tm);
        let limits = envelope(e, &base, &req.spans_ft);
        let cap = e
            .pattern
            .max_length
            .or(e.section.max_length)
            .map_or(hi, |m| ((m.get() - base.bearing.get()) / 12.0).min(hi));
        let reach = req
            .loads_psf
            .iter()
            .map(|&q| reach(e, &base.with_varied(AreaLoad::from_unit(q, "psf")), q, &req.spans_ft, cap))
            .collect();
        let m = super::metrics(e, &base, &evaluate_brief(&e.candidate(), &base));
        CapacityRow {
            entry: e.label(),
            section: e.section.id.clone(),
            pattern: e.pattern.id.clone(),
            topping_in: e.topping.map_or(0.0, |t| t.get()),
            depth_in: m.depth_in,
            weight_psf: m.weight_psf,
            reach,
            limits,
        }
    })
}

/// The longest span in [lo, cap] ft at which `case`'s loads pass, to the
/// inch below, and the check that fails just beyond it. A member may fail
/// short spans and pass longer ones (release stresses: the self-weight that
/// relieves them grows with the span), so the spans of `grid` are tried
/// from the longest down, and the answer refined between the last that
/// passes and the next one up.
fn reach(e: &Entry, case: &crate::case::DesignCase, q: f64, grid: &[f64], cap: f64) -> Reach {
    let cand = e.candidate();
    let at = |s: f64| {
        let mut c = case.clone();
        c.span = Length::from_unit(s, "ft");
        crate::items::keep_on_member(&mut c);
        evaluate_brief(&cand, &c)
    };
    let none = |why: Option<String>| Reach {
        load_psf: q,
        longest_span_ft: None,
        stopped_by: why,
    };
    if at(cap).viable {
        return Reach {
            load_psf: q,
            longest_span_ft: Some(cap),
            stopped_by: None,
        };
    }
    let mut above = cap;
    let mut below = None;
    for &s in grid.iter().rev().filter(|&&s| s < cap) {
        if at(s).viable {
            below = Some(s);
            break;
        }
        above = s;
    }
    let Some(mut a) = below else {
        // no span of the range: the reason at its shortest
        let first = grid.first().copied().unwrap_or(cap);
        return none(at(first).first_failure().map(|f| f.info.id.to_string()));
    };
    let mut b = above;
    while b - a > 0.01 {
        let mid = 0.5 * (a + b);
        if at(mid).viable { a = mid } else { b = mid }
    }
    // to the inch below (conservative, and a table reads better so)
    let inch = (a * 12.0 + 1e-9).floor() / 12.0;
    let a = if at(inch).viable { inch } else { a };
    Reach {
        load_psf: q,
        longest_span_ft: Some(a),
        stopped_by: at(b).first_failure().map(|f| f.info.id.to_string()),
    }
}
