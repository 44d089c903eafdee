//! The capacity envelope of an entry and the span map of a bay.
//!
//! The largest superimposed live load is found by inverting the checks:
//! every ratio is evaluated at no live load and at a probe load; for the
//! checks that grow with load, the load that brings the ratio to 1 is
//! solved on that straight line; the least of these is then checked forward,
//! and only where the forward ratio is not 1 within 1e-6 (shear, cracked
//! deflection, a change of governing combination or station) is the answer
//! bracketed and bisected.

use serde::Serialize;

use super::{Entry, case_for, evaluation, rank_bay, topping_mix};
use crate::bay::{Bay, Objective};
use crate::case::DesignCase;
use crate::catalog::Catalog;
use crate::checks::{Evaluation, Prepared, REGISTRY, evaluate_brief, varies_with_load};
use crate::units::{AreaLoad, Length};

/// Probe live load for the linear estimate, psf.
const PROBE_PSF: f64 = 100.0;
/// Largest live load searched, psf.
pub const MAX_LIVE_PSF: f64 = 2000.0;
/// Forward-check tolerance on the governing ratio.
pub const TOLERANCE: f64 = 1e-6;

/// The load limit at one span.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct LoadLimit {
    /// Span, ft.
    pub span_ft: f64,
    /// Largest superimposed live load, psf (None: fails even with none).
    pub live_psf: Option<f64>,
    /// The check that limits it (or fails without live load).
    pub governing: String,
    /// Its ratio at that load (1 within the tolerance when limited by load).
    pub ratio: f64,
}

/// The ratios that grow with live load, at load `q`: (id, ratio).
fn load_ratios(ev: &Evaluation, driven: &[&'static str]) -> Vec<(&'static str, f64)> {
    ev.checks
        .iter()
        .filter(|c| driven.contains(&c.info.id))
        .map(|c| (c.info.id, c.ratio))
        .collect()
}

/// The largest ratio and its check.
fn top(v: &[(&'static str, f64)]) -> (f64, &'static str) {
    v.iter()
        .fold((f64::NEG_INFINITY, ""), |a, &(id, r)| if r > a.0 { (r, id) } else { a })
}

/// Largest live load on `entry` for `base` (its live load ignored).
pub fn max_live(entry: &Entry, base: &DesignCase) -> LoadLimit {
    let span_ft = base.span.get() / 12.0;
    // one analysis per span; each trial load reuses what the load leaves alone
    // the load the bay's use names is varied; placed loads stay
    let unloaded = base.with_varied(AreaLoad::from_unit(0.0, "psf"));
    let prep = Prepared::new(&entry.candidate(), &unloaded);
    let e0 = prep.evaluation();
    if let Some(f) = e0.first_failure() {
        return LoadLimit {
            span_ft,
            live_psf: None,
            governing: f.info.id.to_string(),
            ratio: f.ratio,
        };
    }
    // at the probe load only the checks the load can change are run again
    let varying: Vec<&'static str> = REGISTRY.iter().map(|c| c.info).filter(varies_with_load).map(|i| i.id).collect();
    let at_probe = prep.ratios_with_live(AreaLoad::from_unit(PROBE_PSF, "psf"), &varying);
    // checks whose ratio rises with load; the rest cannot limit it
    let mut driven: Vec<&'static str> = Vec::new();
    let mut best = (MAX_LIVE_PSF, "none");
    for c0 in &e0.checks {
        let Some(&(_, r1)) = at_probe.iter().find(|c| c.0 == c0.info.id) else {
            continue;
        };
        if r1 > c0.ratio + 1e-12 {
            driven.push(c0.info.id);
            let q = (1.0 - c0.ratio) / (r1 - c0.ratio) * PROBE_PSF;
            if q < best.0 {
                best = (q.max(0.0), c0.info.id);
            }
        }
    }
    if driven.is_empty() {
        return LoadLimit {
            span_ft,
            live_psf: Some(MAX_LIVE_PSF),
            governing: "none".into(),
            ratio: 0.0,
        };
    }
    let ratios = |q: f64| prep.ratios_with_live(AreaLoad::from_unit(q, "psf"), &driven);
    let worst = |q: f64| top(&ratios(q));
    let est = ratios(best.0);
    let (r, id) = top(&est);
    if (r - 1.0).abs() <= TOLERANCE {
        return LoadLimit {
            span_ft,
            live_psf: Some(best.0),
            governing: id.to_string(),
            ratio: r,
        };
    }
    // a second estimate: each check's line through the probe and the first
    // estimate, two loaded points, so both lie past a change of governing
    // combination (1.4D to 1.2D + 1.6L) that the line from no load crosses
    let at_probe: Vec<(&'static str, f64)> = at_probe.into_iter().filter(|c| driven.contains(&c.0)).collect();
    let mut known = vec![
        (0.0, top(&load_ratios(&e0, &driven))),
        (PROBE_PSF, top(&at_probe)),
        (best.0, (r, id)),
    ];
    if (best.0 - PROBE_PSF).abs() > 1e-6 {
        let mut q2 = MAX_LIVE_PSF;
        for &(id, b) in &est {
            let Some(&(_, a)) = at_probe.iter().find(|c| c.0 == id) else {
                continue;
            };
            let slope = (b - a) / (best.0 - PROBE_PSF);
            if slope > 1e-15 {
                let q = PROBE_PSF + (1.0 - a) / slope;
                if q > 0.0 && q < q2 {
                    q2 = q;
                }
            }
        }
        if q2 < MAX_LIVE_PSF {
            let (r2, id2) = worst(q2);
            if (r2 - 1.0).abs() <= TOLERANCE {
                return LoadLimit {
                    span_ft,
                    live_psf: Some(q2),
                    governing: id2.to_string(),
                    ratio: r2,
                };
            }
            known.push((q2, (r2, id2)));
        }
    }
    // not linear: bracket the crossing of 1 with the points known — the
    // highest load within the limit and the lowest one beyond it above that
    let (lo0, (rl, idl)) = known
        .iter()
        .copied()
        .filter(|p| p.1.0 <= 1.0)
        .fold((0.0, known[0].1), |a, p| if p.0 >= a.0 { p } else { a });
    let beyond = known
        .iter()
        .copied()
        .filter(|p| p.1.0 > 1.0 && p.0 > lo0)
        .min_by(|a, b| a.0.total_cmp(&b.0));
    // the ratio at the answer so far (lo)
    let (r, id) = (rl, idl);
    let (mut lo, mut hi, mut flo, mut fhi) = if let Some((qh, (rh, _))) = beyond {
        (lo0, qh, rl - 1.0, rh - 1.0)
    } else {
        let (mut lo, mut flo) = (lo0, rl - 1.0);
        let mut hi = lo0;
        let mut fhi = rl - 1.0;
        while fhi < 0.0 && hi < MAX_LIVE_PSF {
            (lo, flo) = (hi, fhi);
            hi = (hi * 2.0).clamp(1.0, MAX_LIVE_PSF);
            fhi = worst(hi).0 - 1.0;
        }
        if fhi < 0.0 {
            return LoadLimit {
                span_ft,
                live_psf: Some(MAX_LIVE_PSF),
                governing: "none".into(),
                ratio: fhi + 1.0,
            };
        }
        (lo, hi, flo, fhi)
    };
    // search [lo, hi] for ratio − 1 = 0, keeping the bracket (the ratio can
    // jump where the governing check, station or a waiver changes): the
    // secant through the last two points below the limit (exact where the
    // ratio is straight up to a jump), else regula falsi (Illinois), and
    // every third step a bisection
    // seeded with the next known point below the limit, so a ratio that is
    // straight up to a jump (a waiver ending) is solved by the first secant
    let mut below: Option<(f64, f64)> = known
        .iter()
        .filter(|p| p.1.0 <= 1.0 && p.0 < lo)
        .max_by(|a, b| a.0.total_cmp(&b.0))
        .map(|p| (p.0, p.1.0 - 1.0));
    // the true ratio at lo (flo is halved by the Illinois step)
    let mut at_lo = flo;
    let mut last = (r, id);
    let mut side = 0i8;
    let mut answer = lo;
    for k in 0..200 {
        let mid = 0.5 * (lo + hi);
        let secant = below
            .filter(|&(_, f0)| at_lo > f0)
            .map(|(q0, f0)| lo - at_lo * (lo - q0) / (at_lo - f0))
            .filter(|&q| q > lo && q < hi);
        let q = if k % 3 == 2 {
            mid
        } else if let Some(q) = secant {
            q
        } else if fhi > flo {
            (lo * fhi - hi * flo) / (fhi - flo)
        } else {
            mid
        };
        let now = worst(q);
        let f = now.0 - 1.0;
        if f <= 0.0 || f.abs() <= TOLERANCE * 0.1 {
            (answer, last) = (q, now);
        }
        if f.abs() <= TOLERANCE * 0.1 || hi - lo < 1e-9 {
            break;
        }
        if f > 0.0 {
            hi = q;
            fhi = f;
            if side == 1 {
                flo /= 2.0;
            }
            side = 1;
        } else {
            below = Some((lo, at_lo));
            lo = q;
            flo = f;
            at_lo = f;
            if side == -1 {
                fhi /= 2.0;
            }
            side = -1;
        }
    }
    LoadLimit {
        span_ft,
        live_psf: Some(answer),
        governing: last.1.to_string(),
        ratio: last.0,
    }
}

/// The envelope over a range of spans, with the bay's other loads held.
pub fn envelope(entry: &Entry, base: &DesignCase, spans_ft: &[f64]) -> Vec<LoadLimit> {
    let at = |s: f64| {
        let mut c = base.clone();
        c.span = Length::from_unit(s, "ft");
        crate::items::keep_on_member(&mut c);
        max_live(entry, &c)
    };
    // spans are independent: over the cores, one span at a time, since short
    // spans take more trials than long ones that fail with no live load
    super::par_map(spans_ft, 8, 1, |&s| at(s))
}

/// The longest span (ft) the entry carries under the case's loads: the
/// largest viable span on a 1 ft scan down from `max_ft`, then bisected to
/// 0.01 ft against the next, failing one (None when no span from 4 ft works).
pub fn longest_span(entry: &Entry, base: &DesignCase, max_ft: f64) -> Option<f64> {
    let cand = entry.candidate();
    let ok = |s: f64| {
        let mut c = base.clone();
        c.span = Length::from_unit(s, "ft");
        crate::items::keep_on_member(&mut c);
        evaluate_brief(&cand, &c).viable
    };
    let mut s = max_ft.floor();
    if ok(max_ft) {
        return Some(max_ft);
    }
    while s >= 4.0 && !ok(s) {
        s -= 1.0;
    }
    if s < 4.0 {
        return None;
    }
    let (mut lo, mut hi) = (s, (s + 1.0).min(max_ft));
    while hi - lo > 0.005 {
        let mid = 0.5 * (lo + hi);
        if ok(mid) { lo = mid } else { hi = mid }
    }
    Some(lo)
}

/// One run of the span map: from one span to the next, the best entry.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct SpanRun {
    /// From this span, ft.
    pub from_ft: f64,
    /// To this span, ft.
    pub to_ft: f64,
    /// The best entry's label (None: no entry is viable).
    pub best: Option<String>,
}

fn winner(cat: &Catalog, bay: &Bay, span_ft: f64, objective: Objective) -> Option<String> {
    let mut b = bay.clone();
    b.case.span = Length::from_unit(span_ft, "ft");
    crate::items::keep_on_member(&mut b.case);
    rank_bay(cat, &b, Some(objective)).viable.first().map(|r| r.entry.label())
}

/// Which entry is best at each span of [from, to], as runs whose ends are
/// the breakpoints where the winner changes (found to 0.01 ft by bisection
/// between samples `step` apart).
pub fn span_map(cat: &Catalog, bay: &Bay, from_ft: f64, to_ft: f64, step_ft: f64, objective: Objective) -> Vec<SpanRun> {
    let mut runs: Vec<SpanRun> = Vec::new();
    let mut s = from_ft;
    let mut cur = winner(cat, bay, s, objective);
    let mut start = from_ft;
    while s < to_ft - 1e-9 {
        let next = (s + step_ft).min(to_ft);
        let w = winner(cat, bay, next, objective);
        if w != cur {
            let (mut lo, mut hi) = (s, next);
            while hi - lo > 0.005 {
                let mid = 0.5 * (lo + hi);
                if winner(cat, bay, mid, objective) == cur {
                    lo = mid
                } else {
                    hi = mid
                }
            }
            runs.push(SpanRun {
                from_ft: start,
                to_ft: lo,
                best: cur,
            });
            start = hi;
            cur = winner(cat, bay, hi, objective);
        }
        s = next;
    }
    runs.push(SpanRun {
        from_ft: start,
        to_ft,
        best: cur,
    });
    runs
}

/// The envelope of an entry for a bay (its topping mix and loads).
pub fn bay_envelope(cat: &Catalog, bay: &Bay, entry: &Entry, spans_ft: &[f64]) -> Vec<LoadLimit> {
    let base = case_for(bay, entry.topping, &topping_mix(cat, bay));
    envelope(entry, &base, spans_ft)
}

/// The evaluation of an entry at the bay's own loads (for the forward check in tests).
pub fn forward(cat: &Catalog, bay: &Bay, entry: Entry, live_psf: f64) -> Evaluation {
    let mut b = bay.clone();
    b.case = b.case.with_varied(AreaLoad::from_unit(live_psf, "psf"));
    evaluation(cat, &b, &entry)
}
