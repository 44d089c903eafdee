//! Selection for a job: every catalog entry (section × pattern × topping
//! option) evaluated for each bay, filtered, ranked and explained; the
//! capacity envelope by inverting the checks; the span map.

pub mod capacity;
pub mod envelope;

use std::cmp::Ordering;

use serde::Serialize;

use crate::bay::{Bay, Objective};
use crate::case::{DesignCase, Topping};
use crate::catalog::{Catalog, Pattern, Section};
use crate::checks::{Candidate, Evaluation, Verdict, evaluate_brief};
use crate::material::{Aggregate, Mix, Modulus};
use crate::units::{Length, Stress, UnitWeight};

/// One thing the supplier could deliver for a bay.
#[derive(Debug, Clone, Copy)]
pub struct Entry<'c> {
    /// Section.
    pub section: &'c Section,
    /// Strand pattern.
    pub pattern: &'c Pattern,
    /// Precast concrete.
    pub mix: &'c Mix,
    /// Composite topping thickness, if any.
    pub topping: Option<Length>,
}

impl Entry<'_> {
    /// "section / pattern [+ 2 in topping]".
    pub fn label(&self) -> String {
        match self.topping {
            Some(t) => format!("{} / {} + {} in topping", self.section.id, self.pattern.id, fmt_num(t.get())),
            None => format!("{} / {}", self.section.id, self.pattern.id),
        }
    }
    /// The candidate for the engine.
    pub fn candidate(&self) -> Candidate<'_> {
        Candidate {
            section: self.section,
            pattern: self.pattern,
            mix: self.mix,
        }
    }
}

fn fmt_num(v: f64) -> String {
    crate::section::family::fmt(v)
}

/// Figures the objectives compare, per plan area.
#[derive(Debug, Clone, Copy, PartialEq, Serialize)]
pub struct Metrics {
    /// Self-weight with topping, psf.
    pub weight_psf: f64,
    /// Depth with topping, in.
    pub depth_in: f64,
    /// Prestressing strand area per foot of member width, in²/ft.
    pub strand_in2_per_ft: f64,
    /// Price per ft² (None when the catalog gives none).
    pub price_per_ft2: Option<f64>,
    /// Governing ratio.
    pub governing_ratio: f64,
}

/// An evaluated entry, as a ranking keeps it: the verdict and the figures
/// (a ranking holds thousands; [`evaluation`] gives every check of one).
#[derive(Debug, Clone)]
pub struct Ranked<'c> {
    /// The entry.
    pub entry: Entry<'c>,
    /// Whether it works, what governs and what fails first.
    pub verdict: Verdict,
    /// Its figures.
    pub metrics: Metrics,
}

/// The result for one bay.
#[derive(Debug, Clone)]
pub struct BayRanking<'c> {
    /// Viable entries, best first.
    pub viable: Vec<Ranked<'c>>,
    /// Entries that fail, the nearest to passing first within each failure group.
    pub failing: Vec<Ranked<'c>>,
}

/// The default topping concrete: 4000 psi normalweight at 150 pcf (common
/// practice, no source).
pub fn default_topping_mix() -> Mix {
    Mix {
        id: "topping (default 4000 psi)".into(),
        fc: Stress::new(4000.0),
        fci: Stress::new(4000.0),
        unit_weight: UnitWeight::from_unit(150.0, "pcf"),
        aggregate: Aggregate::Carbonate,
        modulus: Modulus::UnitWeight,
    }
}

/// Problems of a job against a catalog, as sentences (empty when sound):
/// a topping mix that is not in the catalog, or a bay no entry can serve.
pub fn cross_check(cat: &Catalog, bays: &[Bay]) -> Vec<String> {
    let mut out = Vec::new();
    for b in bays {
        if let Some(id) = &b.topping_mix
            && !cat.mixes.iter().any(|m| &m.id == id)
        {
            let ids: Vec<&str> = cat.mixes.iter().map(|m| m.id.as_str()).collect();
            out.push(format!(
                "bay '{}': topping_mix '{id}' is not a mix of the catalog{}; it has: {}",
                b.name,
                crate::input::diag::suggestion(id, ids.iter().copied()),
                ids.join(", ")
            ));
        }
        if let Some(other) = &b.beside
            && (other == &b.name || !bays.iter().any(|x| &x.name == other))
        {
            let names: Vec<&str> = bays.iter().map(|x| x.name.as_str()).filter(|n| *n != b.name).collect();
            out.push(format!(
                "bay '{}': beside '{other}' is not another bay of the job{}; it has: {}",
                b.name,
                crate::input::diag::suggestion(other, names.iter().copied()),
                names.join(", ")
            ));
        }
        if !cat.sections.iter().any(|s| b.families.is_empty() || b.families.contains(&s.family)) {
            let fams: Vec<&str> = b.families.iter().map(|f| f.name()).collect();
            out.push(format!(
                "bay '{}': the catalog has no section of the families asked for ({})",
                b.name,
                fams.join(", ")
            ));
        }
    }
    out
}

/// The topping mix for a bay.
pub fn topping_mix(cat: &Catalog, bay: &Bay) -> Mix {
    bay.topping_mix
        .as_ref()
        .and_then(|id| cat.mixes.iter().find(|m| &m.id == id).cloned())
        .unwrap_or_else(default_topping_mix)
}

/// Every entry a bay may use.
pub fn entries<'c>(cat: &'c Catalog, bay: &Bay) -> Vec<Entry<'c>> {
    let mut out = Vec::new();
    for s in &cat.sections {
        if !bay.families.is_empty() && !bay.families.contains(&s.family) {
            continue;
        }
        for p in &s.patterns {
            for &t in &bay.toppings {
                out.push(Entry {
                    section: s,
                    pattern: p,
                    mix: s.mix(cat),
                    topping: t,
                });
            }
        }
    }
    out
}

/// The design case of a bay for one entry (its topping set).
pub fn case_for(bay: &Bay, topping: Option<Length>, mix: &Mix) -> DesignCase {
    let mut c = bay.case.clone();
    c.topping = topping.map(|t| Topping {
        thickness: t,
        mix: mix.clone(),
    });
    c
}

/// Figures of an evaluated entry.
pub fn metrics(e: &Entry, case: &DesignCase, ev: &Evaluation) -> Metrics {
    let b = e.section.props.width_in;
    let self_psf = e.section.weight_per_length(e.mix) / b * 144.0;
    let top_psf = case
        .topping
        .as_ref()
        .map_or(0.0, |t| t.thickness.get() * t.mix.unit_weight.get() * 144.0);
    let price = e.pattern.price.or(e.section.price).map(|p| p.in_unit("/ft2"));
    Metrics {
        weight_psf: self_psf + top_psf,
        depth_in: e.section.props.depth_in + e.topping.map_or(0.0, |t| t.get()),
        strand_in2_per_ft: e.pattern.aps() / b * 12.0,
        price_per_ft2: price,
        governing_ratio: ev.governing().ratio,
    }
}

fn key(o: Objective, m: &Metrics) -> f64 {
    match o {
        Objective::Lightest => m.weight_psf,
        Objective::Shallowest => m.depth_in,
        Objective::LeastSteel => m.strand_in2_per_ft,
        Objective::Cheapest => m.price_per_ft2.unwrap_or(f64::MAX),
        Objective::MostReserve => m.governing_ratio,
    }
}

/// The ranking order: the objective, then the others in their fixed order,
/// then section id, pattern id and topping — a total order, so equal
/// inputs always rank alike. Figures equal to 1e-9 count as ties.
pub fn compare(o: Objective, a: &Ranked, b: &Ranked) -> Ordering {
    let order = std::iter::once(o).chain(Objective::ALL.into_iter().filter(move |&x| x != o));
    for obj in order {
        let (x, y) = (key(obj, &a.metrics), key(obj, &b.metrics));
        if (x - y).abs() > 1e-9 * (1.0 + x.abs().max(y.abs())) {
            return x.total_cmp(&y);
        }
    }
    (a.entry.section.id.as_str(), a.entry.pattern.id.as_str())
        .cmp(&(b.entry.section.id.as_str(), b.entry.pattern.id.as_str()))
        .then_with(|| {
            a.entry
                .topping
                .map(|t| t.get())
                .unwrap_or(0.0)
                .total_cmp(&b.entry.topping.map(|t| t.get()).unwrap_or(0.0))
        })
}

/// Every check of one entry for a bay, numbers only (no notes, no stations).
pub fn evaluation(cat: &Catalog, bay: &Bay, e: &Entry) -> Evaluation {
    evaluate_brief(&e.candidate(), &case_for(bay, e.topping, &topping_mix(cat, bay)))
}

/// Evaluate one entry for a bay, as a ranking keeps it.
pub fn evaluate_entry<'c>(cat: &Catalog, bay: &Bay, e: Entry<'c>) -> Ranked<'c> {
    let case = case_for(bay, e.topping, &topping_mix(cat, bay));
    // a ranking keeps the verdict, not every check nor the station-by-station
    // state: the detail view and the shortlist re-evaluate what they show
    let eval = evaluate_brief(&e.candidate(), &case);
    let metrics = metrics(&e, &case, &eval);
    Ranked {
        entry: e,
        verdict: eval.verdict(),
        metrics,
    }
}

/// Evaluate entries on every core (evaluation is pure), in their original order.
fn evaluate_all<'c>(cat: &Catalog, bay: &Bay, list: Vec<Entry<'c>>) -> Vec<Ranked<'c>> {
    par_map(&list, 64, 128, |&e| evaluate_entry(cat, bay, e))
}

/// `f` of every item, in order, on every core (scoped threads) once there
/// are `min` items or more. The threads take blocks of `block` items in
/// turn, so a thread that drew cheap items does not sit idle.
pub(crate) fn par_map<T: Sync, R: Send>(items: &[T], min: usize, block: usize, f: impl Fn(&T) -> R + Sync) -> Vec<R> {
    let threads = std::thread::available_parallelism().map_or(1, |n| n.get()).min(8);
    if threads < 2 || items.len() < min {
        return items.iter().map(f).collect();
    }
    let next = std::sync::atomic::AtomicUsize::new(0);
    let blocks = items.len().div_ceil(block);
    let mut done: Vec<(usize, Vec<R>)> = std::thread::scope(|s| {
        let handles: Vec<_> = (0..threads)
            .map(|_| {
                s.spawn(|| {
                    let mut mine = Vec::new();
                    loop {
                        let b = next.fetch_add(1, std::sync::atomic::Ordering::Relaxed);
                        if b >= blocks {
                            break mine;
                        }
                        mine.push((b, items[b * block..((b + 1) * block).min(items.len())].iter().map(&f).collect()));
                    }
                })
            })
            .collect();
        handles
            .into_iter()
            .flat_map(|h| h.join().expect("a worker thread panicked"))
            .collect()
    });
    done.sort_by_key(|(b, _)| *b);
    done.into_iter().flat_map(|(_, part)| part).collect()
}

/// Rank every entry for a bay with its own objective (or `objective`).
pub fn rank_bay<'c>(cat: &'c Catalog, bay: &Bay, objective: Option<Objective>) -> BayRanking<'c> {
    let o = objective.unwrap_or(bay.objective);
    // viable first, then split in place (no second copy of the list)
    let mut viable = evaluate_all(cat, bay, entries(cat, bay));
    viable.sort_by_key(|r| !r.verdict.viable);
    let mut failing = viable.split_off(viable.iter().take_while(|r| r.verdict.viable).count());
    failing.shrink_to_fit();
    viable.shrink_to_fit();
    viable.sort_by(|a, b| compare(o, a, b));
    failing.sort_by(|a, b| {
        let (fa, fb) = (a.verdict.first_failure(), b.verdict.first_failure());
        fa.map(|f| f.info.group)
            .cmp(&fb.map(|f| f.info.group))
            .then_with(|| fa.map_or(0.0, |f| f.ratio).total_cmp(&fb.map_or(0.0, |f| f.ratio)))
            .then_with(|| compare(o, a, b))
    });
    BayRanking { viable, failing }
}

/// "Flexural strength: 53.8 kip-ft against 41.0 kip-ft (ratio 1.31)" —
/// the first failure in order of importance and by how much, in the
/// check's own terms ([`crate::checks::CheckResult::shortfall`]).
pub fn failure_reason(r: &Ranked) -> String {
    match r.verdict.first_failure() {
        Some(f) => format!("{}: {}", f.info.title, f.shortfall()),
        None => "passes".into(),
    }
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::catalog::DEMO_US;
    use crate::job::{DEMO_JOB, Job};

    #[test]
    fn demo_job_ranks_with_reasons() {
        let cat = Catalog::from_str(DEMO_US, "demo-us.toml").unwrap();
        let job = Job::from_str(DEMO_JOB, "demo-job.toml").unwrap();
        assert!(cross_check(&cat, &job.bays).is_empty());
        let r = rank_bay(&cat, &job.bays[0], None);
        assert!(!r.viable.is_empty());
        for w in r.viable.windows(2) {
            assert_ne!(compare(Objective::Lightest, &w[0], &w[1]), Ordering::Greater);
            assert!(w[0].metrics.weight_psf <= w[1].metrics.weight_psf + 1e-9);
        }
        for f in &r.failing {
            assert!(failure_reason(f).contains(f.verdict.first_failure().unwrap().info.title));
        }
    }

    #[test]
    fn a_verdict_keeps_what_the_full_evaluation_says() {
        let cat = Catalog::from_str(DEMO_US, "demo-us.toml").unwrap();
        let job = Job::from_str(DEMO_JOB, "demo-job.toml").unwrap();
        let r = rank_bay(&cat, &job.bays[0], None);
        assert!(!r.failing.is_empty());
        for x in r.viable.iter().chain(&r.failing) {
            let ev = evaluation(&cat, &job.bays[0], &x.entry);
            assert_eq!(x.verdict.viable, ev.viable);
            assert_eq!(x.verdict.governing().info.id, ev.governing().info.id);
            assert_eq!(x.verdict.governing().ratio, ev.governing().ratio);
            assert_eq!(
                x.verdict.first_failure().map(|c| (c.info.id, c.ratio)),
                ev.first_failure().map(|c| (c.info.id, c.ratio))
            );
        }
    }
}
