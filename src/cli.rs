//! Command-line interface: clap definitions and the headless commands.

use std::io::{self, Write};
use std::path::PathBuf;

use clap::{Parser, Subcommand};
use serde::Serialize;

use plankwise::case::{Attachment, DesignCase, LineLoadSpec, LoadKind, LossMethod, ServiceClass, Topping, Use};
use plankwise::catalog::diag::suggestion;
use plankwise::catalog::{Catalog, DEMO_US, Problems, SectionSummary, Severity};
use plankwise::checks::{Candidate, evaluate};
use plankwise::material::{Aggregate, Mix, Modulus};
use plankwise::report;
use plankwise::section::Composite;
use plankwise::units::{Kind, Length, Q, Stress, UnitWeight};

/// Preliminary selection of precast prestressed floor and roof members.
#[derive(Debug, Parser)]
#[command(name = "plankwise", version, about, long_about = None)]
struct Args {
    #[command(subcommand)]
    command: Option<Command>,
}

#[derive(Debug, Subcommand)]
enum Command {
    /// Check a catalog file: print a short summary, or every problem (exit 2).
    Validate {
        /// Catalog file (TOML).
        file: PathBuf,
    },
    /// Print the exact section properties of every section in a catalog.
    Sections {
        /// Catalog file (TOML); the built-in demo catalog when omitted.
        file: Option<PathBuf>,
        /// Print JSON instead of a table (keys carry their units).
        #[arg(long)]
        json: bool,
        /// Add a composite topping of this thickness, e.g. "2 in" or "50 mm".
        #[arg(long, value_name = "THICKNESS")]
        topping: Option<String>,
        /// Mix id of the topping concrete (default: 4000 psi normalweight, 150 pcf).
        #[arg(long, value_name = "MIX", requires = "topping")]
        topping_mix: Option<String>,
    },
    /// Run every ACI 318-19 check on one catalog entry for one span and set of loads.
    Check(Box<CheckArgs>),
}

/// Arguments of `plankwise check`.
#[derive(Debug, clap::Args)]
struct CheckArgs {
    /// Catalog file (TOML); the built-in demo catalog when omitted.
    catalog: Option<PathBuf>,
    /// Section id.
    #[arg(long)]
    section: String,
    /// Strand pattern id.
    #[arg(long)]
    pattern: String,
    /// Span, centre to centre of bearings, e.g. "30 ft" or "9.1 m".
    #[arg(long)]
    span: String,
    /// Superimposed dead load, e.g. "15 psf".
    #[arg(long, default_value = "0 psf")]
    sdl: String,
    /// Live load, e.g. "50 psf".
    #[arg(long, default_value = "0 psf")]
    live: String,
    /// Roof live load, e.g. "20 psf".
    #[arg(long, default_value = "0 psf")]
    roof_live: String,
    /// Snow load, e.g. "30 psf".
    #[arg(long, default_value = "0 psf")]
    snow: String,
    /// Sustained part of the live load, 0 to 1.
    #[arg(long, default_value_t = plankwise::case::DEFAULT_SUSTAINED_LIVE)]
    sustained: f64,
    /// Dead line load across the member, "0.8 klf @ 12 ft" (repeatable).
    #[arg(long = "line-dead", value_name = "W @ X")]
    line_dead: Vec<String>,
    /// Live line load across the member, "0.3 klf @ 8 ft" (repeatable).
    #[arg(long = "line-live", value_name = "W @ X")]
    line_live: Vec<String>,
    /// Composite topping thickness, e.g. "2 in".
    #[arg(long)]
    topping: Option<String>,
    /// Mix id of the topping (default: 4000 psi normalweight, 150 pcf).
    #[arg(long, requires = "topping")]
    topping_mix: Option<String>,
    /// Bearing length at each end.
    #[arg(long, default_value = "4 in")]
    bearing: String,
    /// Highest service class allowed: U, T or C.
    #[arg(long, default_value = "U")]
    class: String,
    /// Average relative humidity, %.
    #[arg(long, default_value_t = plankwise::case::DEFAULT_HUMIDITY)]
    rh: f64,
    /// The member is a roof (default: a floor).
    #[arg(long)]
    roof: bool,
    /// Total prestress loss given as a lump sum instead of Zia et al. (1979), e.g. "30 ksi".
    #[arg(long)]
    lump_loss: Option<String>,
    /// Required fire rating, e.g. "2 h" (1, 1.5, 2, 3 or 4 h).
    #[arg(long)]
    fire: Option<String>,
    /// The assembly is restrained for fire (default unrestrained, conservative).
    #[arg(long)]
    restrained: bool,
    /// Exposed to weather or in contact with ground (durability cover).
    #[arg(long)]
    exposed: bool,
    /// Nonstructural elements attached: "tolerant" (l/240) or "sensitive" (l/480).
    #[arg(long)]
    attached: Option<String>,
    /// Least natural frequency required, Hz (otherwise reported only).
    #[arg(long)]
    min_frequency: Option<f64>,
    /// Print JSON instead of a table (keys carry their units).
    #[arg(long)]
    json: bool,
}

/// Exit codes.
const OK: i32 = 0;
const BAD_INPUT: i32 = 2;

/// Run the program; returns the exit code.
pub fn run() -> i32 {
    let args = match Args::try_parse() {
        Ok(a) => a,
        Err(e) => {
            let code = if e.use_stderr() { BAD_INPUT } else { OK };
            let _ = e.print();
            return code;
        }
    };
    let result = match args.command {
        None => demo(),
        Some(Command::Validate { file }) => validate(&file),
        Some(Command::Sections {
            file,
            json,
            topping,
            topping_mix,
        }) => sections(file, json, topping.as_deref(), topping_mix.as_deref()),
        Some(Command::Check(a)) => check(&a),
    };
    match result {
        Ok(code) => code,
        Err(Failure::Io(e)) if e.kind() == io::ErrorKind::BrokenPipe => OK,
        Err(Failure::Io(e)) => {
            eprintln!("plankwise: cannot write the output: {e}");
            BAD_INPUT
        }
        Err(Failure::Input(p)) => {
            eprintln!("{p}");
            let n = p.error_count();
            eprintln!("plankwise: {n} problem{} found; nothing was written", if n == 1 { "" } else { "s" });
            BAD_INPUT
        }
        Err(Failure::Message(m)) => {
            eprintln!("plankwise: {m}");
            BAD_INPUT
        }
    }
}

enum Failure {
    Io(io::Error),
    Input(Problems),
    Message(String),
}

impl From<io::Error> for Failure {
    fn from(e: io::Error) -> Self {
        Failure::Io(e)
    }
}
impl From<Problems> for Failure {
    fn from(p: Problems) -> Self {
        Failure::Input(p)
    }
}

fn load(file: Option<&PathBuf>) -> Result<(Catalog, String), Failure> {
    match file {
        Some(f) => Ok((Catalog::load(f)?, f.display().to_string())),
        None => Ok((Catalog::from_str(DEMO_US, "demo-us.toml")?, "demo-us.toml (built in)".into())),
    }
}

fn print_warnings(cat: &Catalog) {
    for w in cat.warnings.iter().filter(|w| w.severity == Severity::Warning) {
        eprintln!("{w}");
    }
}

fn demo() -> Result<i32, Failure> {
    let (cat, name) = load(None)?;
    let mut out = io::stdout().lock();
    writeln!(out, "plankwise {} — demo catalog (invented data)", env!("CARGO_PKG_VERSION"))?;
    writeln!(out)?;
    report::write_summary(&mut out, &cat, &name)?;
    writeln!(out)?;
    report::write_section_table(&mut out, &cat)?;
    writeln!(out)?;
    report::write_cautions(&mut out)?;
    writeln!(out)?;
    writeln!(
        out,
        "Try: plankwise sections catalog/demo-si.toml   ·   plankwise validate FILE   ·   plankwise --help"
    )?;
    Ok(OK)
}

fn validate(file: &PathBuf) -> Result<i32, Failure> {
    let (cat, name) = load(Some(file))?;
    print_warnings(&cat);
    let mut out = io::stdout().lock();
    let warnings = cat.warnings.iter().filter(|w| w.severity == Severity::Warning).count();
    writeln!(
        out,
        "{name}: ok — '{}': {} sections, {} patterns, {} mixes, {warnings} warning(s)",
        cat.meta.name,
        cat.sections.len(),
        cat.entry_count(),
        cat.mixes.len()
    )?;
    Ok(OK)
}

#[derive(Serialize)]
struct SectionJson {
    #[serde(flatten)]
    summary: SectionSummary,
    #[serde(skip_serializing_if = "Option::is_none")]
    composite: Option<CompositeJson>,
}

#[derive(Serialize)]
struct CompositeJson {
    topping_in: f64,
    topping_width_in: f64,
    modular_ratio: f64,
    area_in2: f64,
    yb_in: f64,
    ix_in4: f64,
    sb_in3: f64,
    st_precast_in3: f64,
    st_topping_in3: f64,
    depth_in: f64,
}

fn default_topping() -> Mix {
    // Common practice, no source: cast-in-place topping of 4000 psi normalweight concrete.
    Mix {
        id: "topping (default)".into(),
        fc: Stress::new(4000.0),
        fci: Stress::new(4000.0),
        unit_weight: UnitWeight::from_unit(150.0, "pcf"),
        aggregate: Aggregate::Carbonate,
        modulus: Modulus::UnitWeight,
    }
}

fn sections(file: Option<PathBuf>, json: bool, topping: Option<&str>, topping_mix: Option<&str>) -> Result<i32, Failure> {
    let (cat, _) = load(file.as_ref())?;
    print_warnings(&cat);
    let top = match topping {
        None => None,
        Some(t) => {
            let th = Length::parse(t).map_err(|e| Failure::Message(format!("--topping: {e}")))?;
            if th.get() <= 0.0 || th.get() > 12.0 {
                return Err(Failure::Message(format!("--topping: '{t}' must be more than 0 and at most 12 in")));
            }
            let mix = match topping_mix {
                None => default_topping(),
                Some(id) => cat.mixes.iter().find(|m| m.id == id).cloned().ok_or_else(|| {
                    let ids: Vec<&str> = cat.mixes.iter().map(|m| m.id.as_str()).collect();
                    Failure::Message(format!("--topping-mix: no mix '{id}' in the catalog; it has: {}", ids.join(", ")))
                })?,
            };
            Some((th, mix))
        }
    };
    let rows: Vec<SectionJson> = cat
        .sections
        .iter()
        .map(|s| {
            let composite = top.as_ref().map(|(th, mix)| {
                let n = mix.ec().get() / s.mix(&cat).ec().get();
                let c = Composite::new(&s.props, th.get(), s.props.width_in, n);
                CompositeJson {
                    topping_in: c.topping_in,
                    topping_width_in: c.topping_width_in,
                    modular_ratio: c.n,
                    area_in2: c.area_in2,
                    yb_in: c.yb_in,
                    ix_in4: c.ix_in4,
                    sb_in3: c.sb_in3,
                    st_precast_in3: c.st_precast_in3,
                    st_topping_in3: c.st_topping_in3,
                    depth_in: c.depth_in,
                }
            });
            SectionJson {
                summary: s.summary(&cat),
                composite,
            }
        })
        .collect();
    let mut out = io::stdout().lock();
    if json {
        serde_json::to_writer_pretty(&mut out, &rows).map_err(io::Error::from)?;
        writeln!(out)?;
        return Ok(OK);
    }
    report::write_section_table(&mut out, &cat)?;
    if let Some((th, mix)) = &top {
        writeln!(out)?;
        writeln!(
            out,
            "With a {} in composite topping ({}; n = Ec,topping / Ec,precast):",
            th.get(),
            mix.id
        )?;
        writeln!(
            out,
            "{:<22} {:>6} {:>8} {:>7} {:>9} {:>8} {:>8} {:>8}",
            "section", "n", "A in2", "yb in", "I in4", "Sb in3", "St,pc", "St,top"
        )?;
        for (s, r) in cat.sections.iter().zip(&rows) {
            if let Some(c) = &r.composite {
                writeln!(
                    out,
                    "{:<22} {:>6.3} {:>8.1} {:>7.2} {:>9.0} {:>8.1} {:>8.1} {:>8.1}",
                    s.id, c.modular_ratio, c.area_in2, c.yb_in, c.ix_in4, c.sb_in3, c.st_precast_in3, c.st_topping_in3
                )?;
            }
        }
    }
    Ok(OK)
}

fn flag<K: Kind>(name: &str, text: &str) -> Result<Q<K>, Failure> {
    Q::<K>::parse(text).map_err(|e| Failure::Message(format!("--{name}: {e}")))
}

fn line_load(name: &str, text: &str, kind: LoadKind) -> Result<LineLoadSpec, Failure> {
    let (w, at) = text
        .split_once('@')
        .ok_or_else(|| Failure::Message(format!("--{name}: '{text}' should read like \"0.8 klf @ 12 ft\"")))?;
    Ok(LineLoadSpec {
        w: flag::<plankwise::units::LineLoadK>(name, w)?,
        at: flag::<plankwise::units::LengthK>(name, at)?,
        kind,
    })
}

fn topping_mix(cat: &Catalog, id: Option<&str>) -> Result<Mix, Failure> {
    match id {
        None => Ok(default_topping()),
        Some(id) => cat.mixes.iter().find(|m| m.id == id).cloned().ok_or_else(|| {
            let ids: Vec<&str> = cat.mixes.iter().map(|m| m.id.as_str()).collect();
            Failure::Message(format!(
                "--topping-mix: no mix '{id}' in the catalog{}; it has: {}",
                suggestion(id, ids.iter().copied()),
                ids.join(", ")
            ))
        }),
    }
}

fn check(a: &CheckArgs) -> Result<i32, Failure> {
    let (cat, _) = load(a.catalog.as_ref())?;
    print_warnings(&cat);
    let section = cat.section(&a.section).ok_or_else(|| {
        let ids: Vec<&str> = cat.sections.iter().map(|s| s.id.as_str()).collect();
        Failure::Message(format!(
            "--section: no section '{}'{}; the catalog has: {}",
            a.section,
            suggestion(&a.section, ids.iter().copied()),
            ids.join(", ")
        ))
    })?;
    let pattern = section.patterns.iter().find(|p| p.id == a.pattern).ok_or_else(|| {
        let ids: Vec<&str> = section.patterns.iter().map(|p| p.id.as_str()).collect();
        Failure::Message(format!(
            "--pattern: section '{}' has no pattern '{}'{}; it has: {}",
            section.id,
            a.pattern,
            suggestion(&a.pattern, ids.iter().copied()),
            ids.join(", ")
        ))
    })?;
    let span: Length = flag("span", &a.span)?;
    if span.get() <= 12.0 || span.get() > 200.0 * 12.0 {
        return Err(Failure::Message(format!(
            "--span: '{}' must be more than 1 ft and at most 200 ft",
            a.span
        )));
    }
    let mut case = DesignCase::new(span);
    case.sdl = flag::<plankwise::units::AreaLoadK>("sdl", &a.sdl)?;
    case.live = flag::<plankwise::units::AreaLoadK>("live", &a.live)?;
    case.roof_live = flag::<plankwise::units::AreaLoadK>("roof-live", &a.roof_live)?;
    case.snow = flag::<plankwise::units::AreaLoadK>("snow", &a.snow)?;
    for (n, v) in [
        ("sdl", case.sdl),
        ("live", case.live),
        ("roof-live", case.roof_live),
        ("snow", case.snow),
    ] {
        if v.get() < 0.0 || v.in_unit("psf") > 2000.0 {
            return Err(Failure::Message(format!("--{n}: must lie between 0 and 2000 psf")));
        }
    }
    if !(0.0..=1.0).contains(&a.sustained) {
        return Err(Failure::Message(format!("--sustained: {} must lie between 0 and 1", a.sustained)));
    }
    case.sustained_live = a.sustained;
    for l in &a.line_dead {
        case.line_loads.push(line_load("line-dead", l, LoadKind::Dead)?);
    }
    for l in &a.line_live {
        case.line_loads.push(line_load("line-live", l, LoadKind::Live)?);
    }
    for l in &case.line_loads {
        if l.at.get() < 0.0 || l.at.get() > span.get() {
            return Err(Failure::Message(
                "--line-dead/--line-live: the position must lie within the span".into(),
            ));
        }
    }
    if let Some(t) = &a.topping {
        let th: Length = flag("topping", t)?;
        if th.get() <= 0.0 || th.get() > 12.0 {
            return Err(Failure::Message(format!("--topping: '{t}' must be more than 0 and at most 12 in")));
        }
        case.topping = Some(Topping {
            thickness: th,
            mix: topping_mix(&cat, a.topping_mix.as_deref())?,
        });
    }
    case.bearing = flag("bearing", &a.bearing)?;
    if case.bearing.get() <= 0.0 || case.bearing.get() > 24.0 {
        return Err(Failure::Message(format!(
            "--bearing: '{}' must be more than 0 and at most 24 in",
            a.bearing
        )));
    }
    case.class_allowed = match a.class.to_ascii_uppercase().as_str() {
        "U" => ServiceClass::U,
        "T" => ServiceClass::T,
        "C" => ServiceClass::C,
        other => return Err(Failure::Message(format!("--class: '{other}' is not a class; use U, T or C"))),
    };
    if !(20.0..=100.0).contains(&a.rh) {
        return Err(Failure::Message(format!("--rh: {} must lie between 20 and 100 %", a.rh)));
    }
    case.humidity = a.rh;
    case.member_use = if a.roof { Use::Roof } else { Use::Floor };
    if let Some(l) = &a.lump_loss {
        let v: Stress = flag("lump-loss", l)?;
        if v.get() < 0.0 || v.in_unit("ksi") > 100.0 {
            return Err(Failure::Message(format!("--lump-loss: '{l}' must lie between 0 and 100 ksi")));
        }
        case.losses = LossMethod::LumpSum(v);
    }
    if let Some(f) = &a.fire {
        let h: plankwise::units::Duration = flag("fire", f)?;
        if !plankwise::fire::RATINGS.iter().any(|r| (r - h.get()).abs() < 1e-9) {
            return Err(Failure::Message(format!(
                "--fire: '{f}' is not a tabulated rating; use 1, 1.5, 2, 3 or 4 h"
            )));
        }
        case.fire_rating = Some(h.get());
    }
    case.restrained = a.restrained;
    if a.exposed {
        case.exposure = plankwise::fire::Exposure::Weather;
    }
    case.attachment = match a.attached.as_deref() {
        None => Attachment::None,
        Some("tolerant") => Attachment::Tolerant,
        Some("sensitive") => Attachment::Sensitive,
        Some(other) => {
            return Err(Failure::Message(format!(
                "--attached: '{other}'{} is not a choice; use 'tolerant' (elements not likely damaged, l/240) or 'sensitive' (likely damaged, l/480)",
                suggestion(other, ["tolerant", "sensitive"])
            )));
        }
    };
    if let Some(f) = a.min_frequency {
        if !(0.5..=50.0).contains(&f) {
            return Err(Failure::Message(format!("--min-frequency: {f} must lie between 0.5 and 50 Hz")));
        }
        case.min_frequency_hz = Some(f);
    }
    let cand = Candidate {
        section,
        pattern,
        mix: section.mix(&cat),
    };
    let ev = evaluate(&cand, &case);
    let mut out = io::stdout().lock();
    if a.json {
        let j = report::check::to_json(&cand, &case, &ev);
        serde_json::to_writer_pretty(&mut out, &j).map_err(io::Error::from)?;
        writeln!(out)?;
    } else {
        let title = format!(
            "{} — {} ({} / {})",
            section.designation, pattern.designation, section.id, pattern.id
        );
        report::check::write_table(&mut out, &title, &case, &ev)?;
    }
    Ok(OK)
}
