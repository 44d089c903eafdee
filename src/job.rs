//! The job file: a project's bays and the criteria they share, read from
//! TOML and validated like the catalog (every problem at once, with file,
//! line and column). Keys are documented in `catalog/README.md`.

use serde::Deserialize;
use toml::Spanned;

use crate::case::{Attachment, DesignCase, LineLoadSpec, LoadKind, LossMethod, ServiceClass, Use};
use crate::input::diag::suggestion;
use crate::input::{Ctx, de, join, span, tables};
use crate::catalog::{Problems, content_hash, raw::S};
use crate::fire::Exposure;
use crate::section::Family;
use crate::units::{Area, AreaLoad, Duration, Length, LineLoad, Stress};

/// The ranking objectives, in the fixed order used to break ties.
#[derive(Debug, Clone, Copy, PartialEq, Eq, PartialOrd, Ord, serde::Serialize)]
#[serde(rename_all = "kebab-case")]
pub enum Objective {
    /// Least self-weight per plan area (topping included).
    Lightest,
    /// Least overall depth (topping included).
    Shallowest,
    /// Least strand area per foot of member width.
    LeastSteel,
    /// Lowest price per plan area (entries without a price last).
    Cheapest,
    /// Lowest governing ratio.
    MostReserve,
}

impl Objective {
    /// All, in tie-break order.
    pub const ALL: [Objective; 5] = [
        Objective::Lightest,
        Objective::Shallowest,
        Objective::LeastSteel,
        Objective::Cheapest,
        Objective::MostReserve,
    ];
    /// Catalog spelling.
    pub fn name(self) -> &'static str {
        match self {
            Objective::Lightest => "lightest",
            Objective::Shallowest => "shallowest",
            Objective::LeastSteel => "least-steel",
            Objective::Cheapest => "cheapest",
            Objective::MostReserve => "most-reserve",
        }
    }
    /// From a spelling.
    pub fn from_name(s: &str) -> Option<Objective> {
        Objective::ALL.into_iter().find(|o| o.name() == s)
    }
    /// The next one, cycling (for the UI).
    pub fn next(self) -> Objective {
        let i = Objective::ALL.iter().position(|&o| o == self).unwrap_or(0);
        Objective::ALL[(i + 1) % Objective::ALL.len()]
    }
}

/// A bay: its design case (without topping), the topping options to try and
/// how to rank.
#[derive(Debug, Clone, PartialEq)]
pub struct Bay {
    /// Name.
    pub name: String,
    /// The design case; `topping` is filled per option.
    pub case: DesignCase,
    /// Topping thicknesses to try (None = no topping).
    pub toppings: Vec<Option<Length>>,
    /// Topping mix id in the catalog (None = the default 4000 psi mix).
    pub topping_mix: Option<String>,
    /// Ranking objective.
    pub objective: Objective,
    /// Families allowed (empty = all).
    pub families: Vec<Family>,
    /// Plan area, for totals.
    pub area: Option<Area>,
    /// Number of pieces, for totals (otherwise from the area).
    pub pieces: Option<u32>,
}

/// A validated job.
#[derive(Debug, Clone, PartialEq)]
pub struct Job {
    /// Project name.
    pub project: String,
    /// Engineer.
    pub engineer: String,
    /// Date as written.
    pub date: String,
    /// Code basis.
    pub code: String,
    /// Notes for the shortlist.
    pub notes: Vec<String>,
    /// Bays.
    pub bays: Vec<Bay>,
    /// Content hash of the file.
    pub hash: String,
}

/// The demo job, embedded like the demo catalog.
pub const DEMO_JOB: &str = include_str!("../catalog/demo-job.toml");

#[derive(Debug, Deserialize)]
#[serde(deny_unknown_fields)]
struct RawJobMeta {
    project: S,
    engineer: Option<S>,
    date: Option<S>,
    code: Option<S>,
    notes: Option<Vec<S>>,
}

/// Criteria that a bay may override; the same keys as `[defaults]`.
#[derive(Debug, Deserialize, Default, Clone)]
#[serde(deny_unknown_fields)]
struct RawCriteria {
    #[serde(rename = "use")]
    member_use: Option<S>,
    class: Option<S>,
    humidity: Option<Spanned<f64>>,
    fire: Option<S>,
    restrained: Option<bool>,
    exposure: Option<S>,
    attached: Option<S>,
    toppings: Option<Vec<S>>,
    topping_mix: Option<S>,
    objective: Option<S>,
    bearing: Option<S>,
    sustained: Option<Spanned<f64>>,
    families: Option<Vec<S>>,
    lump_loss: Option<S>,
    min_frequency: Option<Spanned<f64>>,
}

#[derive(Debug, Deserialize)]
#[serde(deny_unknown_fields)]
struct RawLine {
    w: S,
    at: S,
    kind: Option<S>,
}

#[derive(Debug, Deserialize)]
#[serde(deny_unknown_fields)]
struct RawBay {
    name: S,
    span: S,
    sdl: Option<S>,
    live: Option<S>,
    roof_live: Option<S>,
    snow: Option<S>,
    line: Option<Vec<Spanned<RawLine>>>,
    area: Option<S>,
    pieces: Option<Spanned<i64>>,
    // the criteria a bay may override (the keys of [defaults]); serde's
    // flatten cannot be combined with deny_unknown_fields, so listed again
    #[serde(rename = "use")]
    member_use: Option<S>,
    class: Option<S>,
    humidity: Option<Spanned<f64>>,
    fire: Option<S>,
    restrained: Option<bool>,
    exposure: Option<S>,
    attached: Option<S>,
    toppings: Option<Vec<S>>,
    topping_mix: Option<S>,
    objective: Option<S>,
    bearing: Option<S>,
    sustained: Option<Spanned<f64>>,
    families: Option<Vec<S>>,
    lump_loss: Option<S>,
    min_frequency: Option<Spanned<f64>>,
}

impl RawBay {
    fn criteria(&self) -> RawCriteria {
        macro_rules! take {
            ($($f:ident),*) => { RawCriteria { $($f: self.$f.clone(),)* } };
        }
        take!(
            member_use,
            class,
            humidity,
            fire,
            restrained,
            exposure,
            attached,
            toppings,
            topping_mix,
            objective,
            bearing,
            sustained,
            families,
            lump_loss,
            min_frequency
        )
    }
}

const TOP_KEYS: &[&str] = &["job", "defaults", "bay"];

fn merge(base: &RawCriteria, over: &RawCriteria) -> RawCriteria {
    macro_rules! pick {
        ($($f:ident),*) => { RawCriteria { $($f: over.$f.clone().or_else(|| base.$f.clone()),)* } };
    }
    pick!(
        member_use,
        class,
        humidity,
        fire,
        restrained,
        exposure,
        attached,
        toppings,
        topping_mix,
        objective,
        bearing,
        sustained,
        families,
        lump_loss,
        min_frequency
    )
}

fn choice<T: Copy>(cx: &mut Ctx, s: &Option<S>, path: &str, field: &str, options: &[(&str, T)], default: T) -> Option<T> {
    let Some(s) = s else { return Some(default) };
    match options.iter().find(|(n, _)| *n == s.get_ref()) {
        Some(&(_, v)) => Some(v),
        None => {
            let names: Vec<&str> = options.iter().map(|o| o.0).collect();
            cx.rep.error(
                span(s),
                &join(path, field),
                format!(
                    "'{}' is not allowed{}; use one of: {}",
                    s.get_ref(),
                    suggestion(s.get_ref(), names.iter().copied()),
                    names.join(", ")
                ),
            );
            None
        }
    }
}

fn bay(cx: &mut Ctx, b: &Spanned<RawBay>, defaults: &RawCriteria) -> Option<Bay> {
    let r = b.get_ref();
    let path = format!("bay '{}'", r.name.get_ref());
    let c = merge(defaults, &r.criteria());
    let span_len = cx.ranged::<crate::units::LengthK>(&r.span, &path, "span", (2.0, 200.0), "ft");
    let mut load = |v: &Option<S>, key: &str| -> Option<AreaLoad> {
        match v {
            None => Some(AreaLoad::new(0.0)),
            Some(s) => cx.ranged::<crate::units::AreaLoadK>(s, &path, key, (0.0, 2000.0), "psf"),
        }
    };
    let (sdl, live, roof_live, snow) = (
        load(&r.sdl, "sdl"),
        load(&r.live, "live"),
        load(&r.roof_live, "roof_live"),
        load(&r.snow, "snow"),
    );
    let mut lines = Vec::new();
    let mut lines_ok = true;
    for (i, l) in r.line.iter().flatten().enumerate() {
        let lp = join(&path, &format!("line {}", i + 1));
        let w = cx.ranged::<crate::units::LineLoadK>(&l.get_ref().w, &lp, "w", (0.0, 100.0), "klf");
        let at = cx.q::<crate::units::LengthK>(&l.get_ref().at, &lp, "at");
        let kind = choice(
            cx,
            &l.get_ref().kind,
            &lp,
            "kind",
            &[("dead", LoadKind::Dead), ("live", LoadKind::Live)],
            LoadKind::Dead,
        );
        match (w, at, kind, span_len) {
            (Some(w), Some(at), Some(kind), Some(sp)) => {
                if at.get() < 0.0 || at.get() > sp.get() {
                    cx.rep.error(
                        span(&l.get_ref().at),
                        &join(&lp, "at"),
                        format!("'{}' is not within the {:.2} ft span", l.get_ref().at.get_ref(), sp.get() / 12.0),
                    );
                    lines_ok = false;
                } else {
                    lines.push(LineLoadSpec {
                        w: LineLoad::new(w.get()),
                        at,
                        kind,
                    });
                }
            }
            _ => lines_ok = false,
        }
    }
    let member_use = choice(
        cx,
        &c.member_use,
        &path,
        "use",
        &[("floor", Use::Floor), ("roof", Use::Roof)],
        Use::Floor,
    );
    let class = choice(
        cx,
        &c.class,
        &path,
        "class",
        &[("U", ServiceClass::U), ("T", ServiceClass::T), ("C", ServiceClass::C)],
        ServiceClass::U,
    );
    let exposure = choice(
        cx,
        &c.exposure,
        &path,
        "exposure",
        &[("interior", Exposure::Interior), ("weather", Exposure::Weather)],
        Exposure::Interior,
    );
    let attached = choice(
        cx,
        &c.attached,
        &path,
        "attached",
        &[
            ("none", Attachment::None),
            ("tolerant", Attachment::Tolerant),
            ("sensitive", Attachment::Sensitive),
        ],
        Attachment::None,
    );
    let objective_opts: Vec<(&str, Objective)> = Objective::ALL.iter().map(|o| (o.name(), *o)).collect();
    let objective = choice(cx, &c.objective, &path, "objective", &objective_opts, Objective::Lightest);
    let fire = match &c.fire {
        None => Some(None),
        Some(f) => cx.q::<crate::units::TimeK>(f, &path, "fire").and_then(|h: Duration| {
            if crate::fire::RATINGS.iter().any(|r| (r - h.get()).abs() < 1e-9) {
                Some(Some(h.get()))
            } else {
                cx.rep.error(
                    span(f),
                    &join(&path, "fire"),
                    format!("'{}' is not a tabulated rating; use 1, 1.5, 2, 3 or 4 h", f.get_ref()),
                );
                None
            }
        }),
    };
    let humidity = match &c.humidity {
        None => Some(crate::case::DEFAULT_HUMIDITY),
        Some(h) if (20.0..=100.0).contains(h.get_ref()) => Some(*h.get_ref()),
        Some(h) => {
            cx.rep.error(
                span(h),
                &join(&path, "humidity"),
                format!("{} is outside 20 to 100 (%)", h.get_ref()),
            );
            None
        }
    };
    let sustained = match &c.sustained {
        None => Some(crate::case::DEFAULT_SUSTAINED_LIVE),
        Some(h) if (0.0..=1.0).contains(h.get_ref()) => Some(*h.get_ref()),
        Some(h) => {
            cx.rep.error(
                span(h),
                &join(&path, "sustained"),
                format!("{} is outside 0 to 1 (a fraction of the live load)", h.get_ref()),
            );
            None
        }
    };
    let min_frequency = match &c.min_frequency {
        None => Some(None),
        Some(h) if (0.5..=50.0).contains(h.get_ref()) => Some(Some(*h.get_ref())),
        Some(h) => {
            cx.rep.error(
                span(h),
                &join(&path, "min_frequency"),
                format!("{} is outside 0.5 to 50 (Hz)", h.get_ref()),
            );
            None
        }
    };
    let bearing = match &c.bearing {
        None => Some(Length::new(crate::case::DEFAULT_BEARING_IN)),
        Some(s) => cx.ranged::<crate::units::LengthK>(s, &path, "bearing", (0.5, 24.0), "in"),
    };
    let lump = match &c.lump_loss {
        None => Some(LossMethod::Zia),
        Some(s) => cx
            .ranged::<crate::units::StressK>(s, &path, "lump_loss", (0.0, 100.0), "ksi")
            .map(|v: Stress| LossMethod::LumpSum(v)),
    };
    let mut toppings = Vec::new();
    let mut top_ok = true;
    match &c.toppings {
        None => toppings.push(None),
        Some(list) => {
            for t in list {
                if t.get_ref() == "none" {
                    toppings.push(None);
                } else {
                    match cx.ranged::<crate::units::LengthK>(t, &path, "toppings", (0.5, 12.0), "in") {
                        Some(v) => toppings.push(Some(v)),
                        None => top_ok = false,
                    }
                }
            }
            if list.is_empty() {
                toppings.push(None);
            }
        }
    }
    let mut families = Vec::new();
    for f in c.families.iter().flatten() {
        let opts = [
            ("hollow-core", Family::HollowCore),
            ("double-tee", Family::DoubleTee),
            ("generic", Family::Generic),
        ];
        match choice(cx, &Some(f.clone()), &path, "families", &opts, Family::Generic) {
            Some(v) => families.push(v),
            None => top_ok = false,
        }
    }
    let area = match &r.area {
        None => Some(None),
        Some(a) => cx.ranged::<crate::units::AreaK>(a, &path, "area", (1.0, 1.0e7), "ft2").map(Some),
    };
    let pieces = match &r.pieces {
        None => Some(None),
        Some(p) => cx.count(p, &path, "pieces", (1, 100_000)).map(Some),
    };
    let name = cx.text(&Some(r.name.clone()), &path, "name");
    let mut case = DesignCase::new(span_len?);
    case.sdl = sdl?;
    case.live = live?;
    case.roof_live = roof_live?;
    case.snow = snow?;
    case.line_loads = lines;
    case.member_use = member_use?;
    case.class_allowed = class?;
    case.humidity = humidity?;
    case.sustained_live = sustained?;
    case.bearing = bearing?;
    case.losses = lump?;
    case.fire_rating = fire?;
    case.restrained = c.restrained.unwrap_or(false);
    case.exposure = exposure?;
    case.attachment = attached?;
    case.min_frequency_hz = min_frequency?;
    if !lines_ok || !top_ok {
        return None;
    }
    Some(Bay {
        name,
        case,
        toppings,
        topping_mix: c.topping_mix.map(|s| s.into_inner()),
        objective: objective?,
        families,
        area: area?,
        pieces: pieces?,
    })
}

impl Job {
    /// Read and validate the job at `path`.
    pub fn load(path: &std::path::Path) -> Result<Job, Problems> {
        let text = crate::catalog::read_text(path)?;
        Job::from_str(&text, &path.display().to_string())
    }

    /// Validate job text; `file` names it in messages.
    pub fn from_str(text: &str, file: &str) -> Result<Job, Problems> {
        let (mut cx, root) = crate::input::parse(text, file)?;
        let root_span = root.span();
        let root = root.into_inner();
        let mut meta = None;
        let mut defaults = RawCriteria::default();
        let mut raw_bays = Vec::new();
        for (k, v) in root.iter() {
            match k.get_ref().as_ref() {
                "job" => meta = de::<RawJobMeta>(&mut cx.rep, v, "job"),
                "defaults" => {
                    if let Some(d) = de::<RawCriteria>(&mut cx.rep, v, "defaults") {
                        defaults = d;
                    }
                }
                "bay" => {
                    for (i, e) in tables(&mut cx.rep, v, "bay").into_iter().enumerate() {
                        if let Some(b) = de::<RawBay>(&mut cx.rep, e, &format!("bay {}", i + 1)) {
                            raw_bays.push(Spanned::new(e.span(), b));
                        }
                    }
                }
                other => cx.rep.error(
                    Some(k.span()),
                    "",
                    format!(
                        "unknown top-level key '{other}'{}; allowed: {}",
                        suggestion(other, TOP_KEYS.iter().copied()),
                        TOP_KEYS.join(", ")
                    ),
                ),
            }
        }
        if meta.is_none() && !cx.rep.has_errors() {
            cx.rep.error(
                Some(root_span.start..root_span.start),
                "job",
                "missing [job] table with at least project = \"…\"",
            );
        }
        let mut bays = Vec::new();
        for b in &raw_bays {
            if let Some(bay) = bay(&mut cx, b, &defaults) {
                if bays.iter().any(|x: &Bay| x.name == bay.name) {
                    cx.rep.error(
                        span(&b.get_ref().name),
                        &format!("bay '{}' / name", bay.name),
                        "duplicate bay name; each bay needs its own",
                    );
                }
                bays.push(bay);
            }
        }
        if raw_bays.is_empty() && !cx.rep.has_errors() {
            cx.rep.error(
                Some(root_span.start..root_span.start),
                "bay",
                "the job has no bays; add at least one [[bay]] with name and span",
            );
        }
        let meta = match meta {
            Some(m) => m,
            None => return Err(Problems(cx.rep.finish())),
        };
        let project = cx.text(&Some(meta.project), "job", "project");
        let engineer = cx.text(&meta.engineer, "job", "engineer");
        let date = cx.text(&meta.date, "job", "date");
        let code = meta.code.map_or("ACI 318-19".to_string(), |c| c.into_inner());
        if cx.rep.has_errors() {
            return Err(Problems(cx.rep.finish()));
        }
        Ok(Job {
            project,
            engineer,
            date,
            code,
            notes: meta.notes.unwrap_or_default().into_iter().map(|n| n.into_inner()).collect(),
            bays,
            hash: content_hash(text),
        })
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn demo_job_loads() {
        let j = Job::from_str(DEMO_JOB, "demo-job.toml").unwrap();
        assert!((4..=6).contains(&j.bays.len()));
        assert!(j.bays.iter().any(|b| b.case.fire_rating.is_some()));
    }

    #[test]
    fn bay_overrides_defaults_and_problems_are_located() {
        let text = "[job]\nproject = \"p\"\n[defaults]\nclass = \"T\"\nobjective = \"lightest\"\n[[bay]]\nname = \"a\"\nspan = \"20 ft\"\nclass = \"U\"\n[[bay]]\nname = \"b\"\nspan = \"20 ft\"\n";
        let j = Job::from_str(text, "j.toml").unwrap();
        assert_eq!(j.bays[0].case.class_allowed, ServiceClass::U);
        assert_eq!(j.bays[1].case.class_allowed, ServiceClass::T);
        let bad = "[job]\nproject = \"p\"\n[[bay]]\nname = \"a\"\nspan = \"20 psf\"\nobjective = \"lightst\"\n";
        let e = Job::from_str(bad, "j.toml").unwrap_err();
        let s = e.to_string();
        assert!(
            s.contains("j.toml:5:8: error: bay 'a' / span: '20 psf' is an area load, but a length is needed"),
            "{s}"
        );
        assert!(s.contains("'lightst' is not allowed (did you mean 'lightest'?)"), "{s}");
    }
}

fn q(s: &str) -> String {
    toml::Value::String(s.to_string()).to_string()
}

fn num(v: f64) -> String {
    let s = format!("{v:.6}");
    let s = s.trim_end_matches('0').trim_end_matches('.');
    s.to_string()
}

impl Job {
    /// The job as TOML text in the job-file format; loading it again gives
    /// the same bays (every criterion written out per bay).
    pub fn to_toml(&self) -> String {
        let mut o = String::new();
        o.push_str("# plankwise job file\n\n[job]\n");
        o.push_str(&format!(
            "project = {}\nengineer = {}\ndate = {}\ncode = {}\n",
            q(&self.project),
            q(&self.engineer),
            q(&self.date),
            q(&self.code)
        ));
        if !self.notes.is_empty() {
            let n: Vec<String> = self.notes.iter().map(|s| q(s)).collect();
            o.push_str(&format!("notes = [{}]\n", n.join(", ")));
        }
        for b in &self.bays {
            let c = &b.case;
            o.push_str("\n[[bay]]\n");
            o.push_str(&format!("name = {}\nspan = \"{} in\"\n", q(&b.name), num(c.span.get())));
            for (k, v) in [("sdl", c.sdl), ("live", c.live), ("roof_live", c.roof_live), ("snow", c.snow)] {
                if v.get() != 0.0 {
                    o.push_str(&format!("{k} = \"{} psf\"\n", num(v.in_unit("psf"))));
                }
            }
            if !c.line_loads.is_empty() {
                let l: Vec<String> = c
                    .line_loads
                    .iter()
                    .map(|l| {
                        format!(
                            "{{ w = \"{} klf\", at = \"{} in\", kind = \"{}\" }}",
                            num(l.w.in_unit("klf")),
                            num(l.at.get()),
                            if l.kind == LoadKind::Dead { "dead" } else { "live" }
                        )
                    })
                    .collect();
                o.push_str(&format!("line = [{}]\n", l.join(", ")));
            }
            o.push_str(&format!("use = \"{}\"\n", if c.member_use == Use::Roof { "roof" } else { "floor" }));
            o.push_str(&format!("class = \"{}\"\nhumidity = {}\n", c.class_allowed.name(), num(c.humidity)));
            if let Some(h) = c.fire_rating {
                o.push_str(&format!("fire = \"{} h\"\n", num(h)));
            }
            o.push_str(&format!("restrained = {}\n", c.restrained));
            o.push_str(&format!(
                "exposure = \"{}\"\n",
                if c.exposure == Exposure::Weather { "weather" } else { "interior" }
            ));
            o.push_str(&format!(
                "attached = \"{}\"\n",
                match c.attachment {
                    Attachment::None => "none",
                    Attachment::Tolerant => "tolerant",
                    Attachment::Sensitive => "sensitive",
                }
            ));
            let t: Vec<String> = b
                .toppings
                .iter()
                .map(|t| t.map_or("\"none\"".into(), |t| format!("\"{} in\"", num(t.get()))))
                .collect();
            o.push_str(&format!("toppings = [{}]\n", t.join(", ")));
            if let Some(m) = &b.topping_mix {
                o.push_str(&format!("topping_mix = {}\n", q(m)));
            }
            o.push_str(&format!(
                "objective = \"{}\"\nbearing = \"{} in\"\nsustained = {}\n",
                b.objective.name(),
                num(c.bearing.get()),
                num(c.sustained_live)
            ));
            if !b.families.is_empty() {
                let f: Vec<String> = b.families.iter().map(|f| format!("\"{}\"", f.name())).collect();
                o.push_str(&format!("families = [{}]\n", f.join(", ")));
            }
            if let LossMethod::LumpSum(v) = c.losses {
                o.push_str(&format!("lump_loss = \"{} ksi\"\n", num(v.in_unit("ksi"))));
            }
            if let Some(f) = c.min_frequency_hz {
                o.push_str(&format!("min_frequency = {}\n", num(f)));
            }
            if let Some(a) = b.area {
                o.push_str(&format!("area = \"{} ft2\"\n", num(a.in_unit("ft2"))));
            }
            if let Some(p) = b.pieces {
                o.push_str(&format!("pieces = {p}\n"));
            }
        }
        o
    }
}

#[cfg(test)]
mod round_trip {
    use super::*;

    #[test]
    fn written_jobs_load_back_the_same() {
        let j = Job::from_str(DEMO_JOB, "demo-job.toml").unwrap();
        let text = j.to_toml();
        let k = Job::from_str(&text, "written.toml").unwrap();
        assert_eq!(j.bays.len(), k.bays.len());
        for (a, b) in j.bays.iter().zip(&k.bays) {
            assert_eq!(a.name, b.name);
            assert!((a.case.span.get() - b.case.span.get()).abs() < 1e-6);
            assert!((a.case.live.get() - b.case.live.get()).abs() < 1e-9);
            assert_eq!(a.case.fire_rating, b.case.fire_rating);
            assert_eq!(a.toppings.len(), b.toppings.len());
            assert_eq!(a.objective, b.objective);
            assert_eq!(a.families, b.families);
            assert_eq!(a.case.line_loads.len(), b.case.line_loads.len());
        }
        assert_eq!(j.project, k.project);
    }
}
