//! Command-line interface: clap definitions and the headless commands.

use std::io::{self, Write};
use std::path::PathBuf;

use clap::{Parser, Subcommand};
use serde::Serialize;

use plankwise::catalog::{Catalog, DEMO_US, Problems, SectionSummary, Severity};
use plankwise::checks::{Candidate, evaluate};
use plankwise::input::diag::suggestion;
use plankwise::report;
use plankwise::section::Composite;
use plankwise::units::{Length, System, display};

/// Preliminary selection of precast prestressed floor and roof members.
#[derive(Debug, Parser)]
#[command(
    name = "plankwise",
    version,
    about,
    long_about = "Preliminary selection of precast prestressed floor and roof members (hollow-core, double tee) to ACI 318-19.\n\nWith no command, opens the terminal UI on the built-in demo catalog and job, or on CATALOG and --job JOB. A preliminary selection only: the supplier's engineer and the engineer of record make the final design.",
    args_conflicts_with_subcommands = true
)]
struct Args {
    #[command(subcommand)]
    command: Option<Command>,
    /// Catalog file for the UI (default: the built-in demo catalog).
    catalog: Option<PathBuf>,
    /// Job file for the UI (default: the built-in demo job).
    #[arg(long)]
    job: Option<PathBuf>,
    /// Print the catalog summary and section table instead of opening the UI.
    #[arg(long)]
    summary: bool,
    #[command(flatten)]
    units: UnitsFlag,
}

/// A display system, as the flag spells it.
#[derive(Debug, Clone, Copy, PartialEq, Eq, clap::ValueEnum)]
pub(crate) enum UnitsArg {
    /// US customary: ft-in, in, psf, kip, kip-ft, psi.
    Us,
    /// SI: m, mm, kPa, kN, kN·m, MPa.
    Si,
}

/// The `--units` flag every command takes.
#[derive(Debug, Clone, Copy, Default, clap::Args)]
pub(crate) struct UnitsFlag {
    /// Units of every number printed (default: the job's `units`, else the
    /// catalog's, else us).
    #[arg(long, value_enum, value_name = "SYSTEM")]
    units: Option<UnitsArg>,
}

impl UnitsFlag {
    /// The system the flag names, if given.
    pub(crate) fn flag(&self) -> Option<System> {
        self.units.map(|u| match u {
            UnitsArg::Us => System::Us,
            UnitsArg::Si => System::Si,
        })
    }

    /// The system of this run ([`plankwise::units::display::choose`]).
    pub(crate) fn system(&self, job: Option<&plankwise::job::Job>, cat: &Catalog) -> System {
        plankwise::units::display::choose(self.flag(), job.and_then(|j| j.units), cat.meta.units)
    }
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
        #[command(flatten)]
        units: UnitsFlag,
    },
    /// Run every ACI 318-19 check on one catalog entry for one span and set of loads.
    Check(Box<CheckArgs>),
    /// One entry before service: stripping, yard storage, transport and erection, stage by stage.
    Handling(Box<CheckArgs>),
    /// Rank every catalog entry for each bay of a job (or one bay given by flags).
    Rank(Box<select::RankArgs>),
    /// Largest live load an entry carries over a range of spans, and its longest span.
    Envelope(Box<select::EnvelopeArgs>),
    /// The capacity of the whole catalog: for every entry the longest span at each load level and the check that ends it.
    Capacity(Box<select::CapacityArgs>),
    /// Which entry is best at each span of a range, as breakpoints.
    Spanmap(Box<select::SpanmapArgs>),
    /// Write the shortlist for the supplier (text, Markdown, CSV or PDF).
    Shortlist(Box<select::ShortlistArgs>),
    /// Print the manual page (roff; read it with `plankwise manual | man -l -`).
    Manual,
    /// Print the JSON Schema of the job file (for TOML-aware editors).
    JobSchema,
    /// Print the JSON Schema of the catalog file (for TOML-aware editors).
    CatalogSchema,
    /// Print a shell completion script (bash, zsh, fish, elvish, powershell).
    Completions {
        /// The shell.
        shell: clap_complete::Shell,
    },
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
    #[command(flatten)]
    bay: BayFlags,
    /// Print JSON instead of a table (keys carry their units).
    #[arg(long, conflicts_with = "sheet")]
    json: bool,
    /// Print the calculation sheet instead: every number the checks use,
    /// in order, each with its key in the JSON (`text`, `md` or `pdf`; with
    /// `-o`, a .md or .pdf file names its format).
    #[arg(long, value_name = "FORMAT", num_args = 0..=1, default_missing_value = "text", value_parser = ["text", "md", "pdf"])]
    sheet: Option<String>,
    /// Write to this file instead of the standard output (a PDF needs one).
    #[arg(short = 'o', long = "output")]
    output: Option<PathBuf>,
    /// Replace an existing output file.
    #[arg(long, requires = "output")]
    force: bool,
    #[command(flatten)]
    units: UnitsFlag,
}

mod bay;
mod select;
mod term;

use bay::BayFlags;

/// Exit codes.
const OK: i32 = 0;
/// Worked, but some bay has no viable member.
const NONE_VIABLE: i32 = 1;
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
        None => ui_or_summary(args.catalog.as_ref(), args.job.as_ref(), args.summary, args.units),
        Some(Command::Validate { file }) => validate(&file),
        Some(Command::Sections {
            file,
            json,
            topping,
            topping_mix,
            units,
        }) => sections(file, json, topping.as_deref(), topping_mix.as_deref(), units),
        Some(Command::Check(a)) => check(&a),
        Some(Command::Handling(a)) => handling(&a),
        Some(Command::Rank(a)) => select::rank(&a),
        Some(Command::Envelope(a)) => select::envelope(&a),
        Some(Command::Spanmap(a)) => select::spanmap(&a),
        Some(Command::Capacity(a)) => select::capacity(&a),
        Some(Command::Shortlist(a)) => select::shortlist(&a),
        Some(Command::Manual) => manual().map_err(Failure::Io),
        Some(Command::JobSchema) => schema(plankwise::schema::job()).map_err(Failure::Io),
        Some(Command::CatalogSchema) => schema(plankwise::schema::catalog()).map_err(Failure::Io),
        Some(Command::Completions { shell }) => {
            use clap::CommandFactory;
            clap_complete::generate(shell, &mut Args::command(), "plankwise", &mut io::stdout());
            Ok(OK)
        }
    };
    match result {
        Ok(code) => code,
        Err(Failure::Io(e)) if e.kind() == io::ErrorKind::BrokenPipe => OK,
        Err(Failure::Io(e)) => {
            eprintln!("plankwise: {}", plankwise::input::escape_controls(&e.to_string()));
            BAD_INPUT
        }
        Err(Failure::Input(p)) => {
            eprintln!("{p}");
            let n = p.error_count();
            eprintln!("plankwise: {n} problem{} found; nothing was written", if n == 1 { "" } else { "s" });
            BAD_INPUT
        }
        Err(Failure::Message(m)) => {
            // a message of several lines keeps its lines; each is escaped
            let lines: Vec<String> = m.split('\n').map(plankwise::input::escape_controls).collect();
            eprintln!("plankwise: {}", lines.join("\n"));
            BAD_INPUT
        }
    }
}

pub(crate) enum Failure {
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

pub(crate) fn load(file: Option<&PathBuf>) -> Result<(Catalog, String), Failure> {
    match file {
        Some(f) => Ok((Catalog::load(f)?, f.display().to_string())),
        None => Ok((Catalog::from_str(DEMO_US, "demo-us.toml")?, "demo-us.toml (built in)".into())),
    }
}

pub(crate) fn print_warnings(cat: &Catalog) {
    for w in cat.warnings.iter().filter(|w| w.severity == Severity::Warning) {
        eprintln!("{w}");
    }
}

fn ui_or_summary(catalog: Option<&PathBuf>, job: Option<&PathBuf>, summary: bool, units: UnitsFlag) -> Result<i32, Failure> {
    use std::io::IsTerminal;
    let terminal = io::stdout().is_terminal() && io::stdin().is_terminal();
    if summary || !terminal {
        // the summary shows the catalog only: a job given with it would be
        // silently unread, so it is refused
        if let Some(j) = job {
            return Err(Failure::Message(format!(
                "--job '{}' is not read {}; rank it with: plankwise rank{} --job {}",
                j.display(),
                if summary {
                    "with --summary, which prints the catalog"
                } else {
                    "when the output is not a terminal (the UI cannot open)"
                },
                catalog.map_or(String::new(), |c| format!(" {}", c.display())),
                j.display()
            )));
        }
        return demo(catalog, units);
    }
    let (cat, _) = load(catalog)?;
    print_warnings(&cat);
    let (job, path) = match (job, catalog) {
        (Some(j), _) if j.as_os_str() == "demo" => (plankwise::job::demo_for(&cat)?.0, None),
        (Some(j), _) => (plankwise::job::Job::load(j)?, Some(j.clone())),
        // the built-in demo catalog opens on the demo job
        (None, None) => (plankwise::job::Job::from_str(plankwise::job::DEMO_JOB, "demo-job.toml")?, None),
        // the SI demo catalog opens on the SI demo job; a user's catalog
        // without a job on one empty bay in its units
        (None, Some(_)) => match plankwise::job::demo_for(&cat)? {
            (j, name) if name.starts_with("demo-job-si") => (j, None),
            _ => (plankwise::job::Job::empty_for(&cat), None),
        },
    };
    let problems = plankwise::select::cross_check(&cat, &job.bays);
    if !problems.is_empty() {
        return Err(Failure::Message(problems.join("\n")));
    }
    let sys = units.system(Some(&job), &cat);
    Ok(term::run(cat, catalog.cloned(), job, path, sys)?)
}

fn demo(catalog: Option<&PathBuf>, units: UnitsFlag) -> Result<i32, Failure> {
    let (cat, name) = load(catalog)?;
    let sys = units.system(None, &cat);
    let mut out = io::stdout().lock();
    writeln!(out, "plankwise {}", env!("CARGO_PKG_VERSION"))?;
    writeln!(out)?;
    report::write_summary(&mut out, &cat, &name)?;
    writeln!(out)?;
    report::write_section_table(&mut out, &cat, sys)?;
    writeln!(out)?;
    report::write_cautions(&mut out)?;
    writeln!(out)?;
    let me = how_to_run();
    writeln!(
        out,
        "In a terminal plankwise opens its UI here. Try: {me} rank --job demo   ·   {me} shortlist --job demo -o list.txt   ·   {me} --help"
    )?;
    if me != "plankwise" {
        writeln!(
            out,
            "(plankwise is not installed: `cargo install --path .` puts it on your PATH; until then the commands above run it from this folder)"
        )?;
    }
    Ok(OK)
}

/// The manual page, made from the clap definitions (`clap_mangen`): the
/// program, every command with its synopsis and options, then the exit
/// codes, the files and the cautions.
fn manual() -> io::Result<i32> {
    use clap::CommandFactory;
    let cmd = Args::command();
    let man = clap_mangen::Man::new(cmd.clone());
    let mut out: Vec<u8> = Vec::new();
    man.render_title(&mut out)?;
    man.render_name_section(&mut out)?;
    man.render_synopsis_section(&mut out)?;
    man.render_description_section(&mut out)?;
    man.render_options_section(&mut out)?;
    man.render_subcommands_section(&mut out)?;
    out.extend_from_slice(b".SH COMMANDS\n");
    for sub in cmd.get_subcommands().filter(|c| c.get_name() != "help") {
        let name = sub.get_name().to_string();
        let page = clap_mangen::Man::new(sub.clone().name(format!("plankwise {name}")));
        let mut part: Vec<u8> = Vec::new();
        page.render_synopsis_section(&mut part)?;
        page.render_description_section(&mut part)?;
        page.render_options_section(&mut part)?;
        let part = String::from_utf8_lossy(&part)
            .replace(".SH SYNOPSIS", &format!(".SS \"{name}\"\n.PP\nSynopsis:"))
            .replace(".SH DESCRIPTION", ".PP\nDescription:")
            .replace(".SH OPTIONS", ".PP\nOptions:");
        out.extend_from_slice(part.as_bytes());
    }
    let tail = format!(
        ".SH EXIT STATUS\n.TP\n0\nsuccess\n.TP\n1\nworked, but no member is viable for some bay\n.TP\n2\nbad input (every problem listed with file, line, column, field, what was found and what is allowed) or a failure; nothing is written\n\
.SH FILES\n.TP\ncatalog (TOML)\nthe producer's mixes, strands, sections and strand patterns, every value a string with its unit (\\(dq8 in\\(dq, \\(dq41.4 MPa\\(dq); see catalog/README.md\n.TP\njob (TOML)\nthe project and its bays: [job], [defaults] and [[bay]] with the criteria, loads and openings; saved by the UI with its edits in place and a .bak backup\n.TP\n~/.config/plankwise/keys.toml\nkey bindings: action = [\\(dqkey\\(dq, ...]\n\
.SH UNITS\nEvery number follows one display system per run: --units us|si, else the job's units, else the catalog's, else US.\n\
.SH CAUTIONS\n{}\n",
        report::CAUTIONS.join("\n.br\n")
    );
    out.extend_from_slice(tail.as_bytes());
    io::stdout().lock().write_all(&out)?;
    Ok(OK)
}

/// `plankwise job-schema` and `plankwise catalog-schema`: a file's JSON Schema.
fn schema(v: serde_json::Value) -> io::Result<i32> {
    let mut out = io::stdout().lock();
    serde_json::to_writer_pretty(&mut out, &v).map_err(io::Error::from)?;
    writeln!(out)?;
    Ok(OK)
}

/// How the user can run this program again, as typed at a shell: the
/// bare name when it is installed on the PATH, else the `cargo run` form
/// (the program was started from a build folder).
fn how_to_run() -> String {
    let exe = std::env::current_exe().ok();
    let built = exe.as_ref().is_some_and(|p| {
        let s = p.to_string_lossy();
        s.contains("/target/release/") || s.contains("/target/debug/")
    });
    let on_path = std::env::var_os("PATH").is_some_and(|paths| std::env::split_paths(&paths).any(|d| d.join("plankwise").is_file()));
    if built && !on_path {
        "cargo run --release --".to_string()
    } else {
        "plankwise".to_string()
    }
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

fn sections(file: Option<PathBuf>, json: bool, topping: Option<&str>, topping_mix: Option<&str>, units: UnitsFlag) -> Result<i32, Failure> {
    let (cat, _) = load(file.as_ref())?;
    let sys = units.system(None, &cat);
    print_warnings(&cat);
    let top = match topping {
        None => None,
        Some(t) => {
            let th = Length::parse(t).map_err(|e| Failure::Message(format!("--topping: {e}")))?;
            if th.get() <= 0.0 || th.get() > 12.0 {
                return Err(Failure::Message(format!("--topping: '{t}' must be more than 0 and at most 12 in")));
            }
            let mix = match topping_mix {
                None => plankwise::select::default_topping_mix(),
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
        write_json(&mut out, &rows, sys)?;
        return Ok(OK);
    }
    report::write_section_table(&mut out, &cat, sys)?;
    if let Some((th, mix)) = &top {
        writeln!(out)?;
        let head = format!(
            "With a {} composite topping ({}; n = Ec,topping / Ec,precast):",
            display::with_unit(th.get(), "in", 2, sys),
            mix.id
        );
        // the default mix's name says its strength
        writeln!(out, "{}", display::localize(&head, sys))?;
        let si = sys == System::Si;
        let (au, hu, iu, su) = if si {
            ("e3mm2", "mm", "e6mm4", "e6mm3")
        } else {
            ("in2", "in", "in4", "in3")
        };
        writeln!(
            out,
            "{:<22} {:>6} {:>9} {:>8} {:>9} {:>9} {:>9} {:>9}",
            "section",
            "n",
            format!("A {au}"),
            format!("yb {hu}"),
            format!("I {iu}"),
            format!("Sb {su}"),
            "St,pc",
            "St,top"
        )?;
        let scaled = |v: f64, us: &'static str, places: usize, per: f64| {
            if si {
                format!("{:.2}", display::convert(v, us, sys).0 / per)
            } else {
                format!("{v:.places$}")
            }
        };
        for (s, r) in cat.sections.iter().zip(&rows) {
            if let Some(c) = &r.composite {
                writeln!(
                    out,
                    "{:<22} {:>6.3} {:>9} {:>8} {:>9} {:>9} {:>9} {:>9}",
                    s.id,
                    c.modular_ratio,
                    scaled(c.area_in2, "in²", 1, 1e3),
                    display::num(c.yb_in, "in", 2, sys),
                    scaled(c.ix_in4, "in⁴", 0, 1e6),
                    scaled(c.sb_in3, "in³", 1, 1e6),
                    scaled(c.st_precast_in3, "in³", 1, 1e6),
                    scaled(c.st_topping_in3, "in³", 1, 1e6)
                )?;
            }
        }
    }
    Ok(OK)
}

fn check(a: &CheckArgs) -> Result<i32, Failure> {
    let (cat, _) = load(a.catalog.as_ref())?;
    print_warnings(&cat);
    let (section, pattern) = find_entry(&cat, &a.section, &a.pattern)?;
    let bay = a.bay.to_bay(&cat)?;
    let case = plankwise::select::case_for(&bay, bay.toppings[0], &plankwise::select::topping_mix(&cat, &bay));
    let cand = Candidate {
        section,
        pattern,
        mix: section.mix(&cat),
    };
    let ev = evaluate(&cand, &case);
    let sys = a.units.system(None, &cat);
    // refused before any work: an input, not a regular file, or there already
    let target = match &a.output {
        None => None,
        Some(o) => {
            let inputs: Vec<&std::path::Path> = a.catalog.iter().map(|p| p.as_path()).collect();
            Some(plankwise::files::writable(o, &inputs, a.force).map_err(|e| Failure::Message(format!("-o: '{}' {e}", o.display())))?)
        }
    };
    // the extension of -o names the sheet's format, as for every -o
    let named = a.output.as_deref().and_then(select::OutFormat::of_path);
    let sheet = a.sheet.as_deref().map(|f| match (f, named) {
        ("text", Some(select::OutFormat::Pdf)) => "pdf",
        ("text", Some(select::OutFormat::Md)) => "md",
        (f, _) => f,
    });
    let mut out: Vec<u8> = Vec::new();
    if a.json {
        let j = report::check::to_json(&cand, &case, &ev);
        write_json(&mut out, &j, sys)?;
    } else if let Some(f) = sheet {
        let j = report::check::to_json(&cand, &case, &ev);
        let title = format!("{} — {}", section.designation, pattern.designation);
        if f == "pdf" {
            if target.is_none() {
                return Err(Failure::Message("--sheet pdf: a PDF goes to a file; give -o FILE.pdf".into()));
            }
            out = report::sheet::pdf(&title, &j, sys).map_err(|e| Failure::Message(format!("the PDF could not be made: {e}")))?;
        } else {
            report::sheet::write(&mut out, &title, &j, sys, f == "md")?;
        }
    } else {
        let title = format!(
            "{} — {} ({} / {})",
            section.designation, pattern.designation, section.id, pattern.id
        );
        report::check::write_table(&mut out, &title, &case, &ev, sys)?;
    }
    match target {
        None => io::stdout().lock().write_all(&out)?,
        Some(real) => {
            let shown = a.output.as_ref().map_or(String::new(), |o| o.display().to_string());
            plankwise::files::write_atomic(&real, &out).map_err(|e| Failure::Message(format!("-o: '{shown}' cannot be written: {e}")))?;
            eprintln!("plankwise: wrote {shown}");
        }
    }
    Ok(OK)
}

/// `plankwise handling`: the stages of one entry before service.
fn handling(a: &CheckArgs) -> Result<i32, Failure> {
    if a.output.is_some() || a.sheet.is_some() {
        return Err(Failure::Message(
            "handling prints to the standard output (text or --json); -o and --sheet belong to check".into(),
        ));
    }
    let (cat, _) = load(a.catalog.as_ref())?;
    print_warnings(&cat);
    let (section, pattern) = find_entry(&cat, &a.section, &a.pattern)?;
    let bay = a.bay.to_bay(&cat)?;
    let case = plankwise::select::case_for(&bay, bay.toppings[0], &plankwise::select::topping_mix(&cat, &bay));
    let m = plankwise::member::Member::new(section, pattern, section.mix(&cat), &case);
    let stages = plankwise::handling::stages(&m, &plankwise::handling::Setup::of(&case));
    let sys = a.units.system(None, &cat);
    let mut out = io::stdout().lock();
    if a.json {
        write_json(&mut out, &stages, sys)?;
        return Ok(OK);
    }
    writeln!(
        out,
        "{} — {} ({} / {}), member {} long; {}",
        section.designation,
        pattern.designation,
        section.id,
        pattern.id,
        display::span(m.lm, sys),
        if case.handling {
            "handling checked"
        } else {
            "handling marked not checked for this bay (reported only)"
        }
    )?;
    let su = display::unit("psi", sys);
    writeln!(
        out,
        "{:<13} {:>5} {:>8} {:>5} {:>22} {:>9} {:>9} {:>17} {:>17} {:>6}",
        "stage",
        "age d",
        format!("f'c {su}"),
        "×w",
        format!("supports from end {}", display::unit("ft", sys)),
        format!("M+ {}", display::unit("kip-ft", sys)),
        format!("M- {}", display::unit("kip-ft", sys)),
        "tension / limit",
        "compr. / limit",
        "ratio"
    )?;
    let (e0, _) = m.ends;
    for st in &stages {
        let from_end: Vec<String> = st
            .supports_in
            .iter()
            .filter(|&&x| x - e0 <= 0.5 * m.lm + 1e-9)
            .map(|x| display::num((x - e0) / 12.0, "ft", 2, sys))
            .collect();
        writeln!(
            out,
            "{:<13} {:>5.0} {:>8} {:>5.1} {:>22} {:>9} {:>9} {:>17} {:>17} {:>6.3}",
            st.name,
            st.age_days,
            display::num(st.fc_psi, "psi", 0, sys),
            st.multiplier,
            from_end.join(", "),
            display::num(st.m_pos_lbin / 12000.0, "kip-ft", 2, sys),
            display::num(st.m_neg_lbin / 12000.0, "kip-ft", 2, sys),
            format!(
                "{} / -{}",
                display::num(st.tension_psi, "psi", 0, sys),
                display::num(st.tension_limit_psi, "psi", 0, sys)
            ),
            format!(
                "{} / {}",
                display::num(st.compression_psi, "psi", 0, sys),
                display::num(st.compression_limit_psi, "psi", 0, sys)
            ),
            st.ratio()
        )?;
    }
    writeln!(out)?;
    for st in &stages {
        writeln!(out, "  {}: ×{} — {}", st.name, st.multiplier, st.multiplier_source)?;
    }
    writeln!(
        out,
        "  limits (PCI, from memory): tension 5λ√f'c(t) (no cracking), compression 0.60 f'c(t); f'c after release by ACI 209R-92 (steam cured), never below f'ci; stresses compression positive"
    )?;
    writeln!(out)?;
    report::write_cautions(&mut out)?;
    Ok(OK)
}

/// A value as JSON in the display system (keys renamed to its units).
pub(crate) fn write_json(out: &mut impl Write, v: &impl Serialize, sys: System) -> Result<(), Failure> {
    let v = serde_json::to_value(v).map_err(io::Error::from)?;
    serde_json::to_writer_pretty(&mut *out, &display::json(v, sys)).map_err(io::Error::from)?;
    writeln!(out)?;
    Ok(())
}

/// A section and pattern by id, with suggestions when misspelt.
fn find_entry<'c>(
    cat: &'c Catalog,
    section: &str,
    pattern: &str,
) -> Result<(&'c plankwise::catalog::Section, &'c plankwise::catalog::Pattern), Failure> {
    let s = cat.section(section).ok_or_else(|| {
        let ids: Vec<&str> = cat.sections.iter().map(|s| s.id.as_str()).collect();
        Failure::Message(format!(
            "--section: no section '{section}'{}; the catalog has: {}",
            suggestion(section, ids.iter().copied()),
            ids.join(", ")
        ))
    })?;
    let p = s.patterns.iter().find(|p| p.id == pattern).ok_or_else(|| {
        let ids: Vec<&str> = s.patterns.iter().map(|p| p.id.as_str()).collect();
        Failure::Message(format!(
            "--pattern: section '{}' has no pattern '{pattern}'{}; it has: {}",
            s.id,
            suggestion(pattern, ids.iter().copied()),
            ids.join(", ")
        ))
    })?;
    Ok((s, p))
}
