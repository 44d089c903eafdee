//! Flags that describe one bay on the command line: one flag per bay
//! criterion, made from the same definitions the job reader and the UI
//! use ([`plankwise::criteria`]), so a value is accepted or refused here
//! exactly as in a job file.

use clap::{Arg, ArgAction, ArgMatches, Args, Command, FromArgMatches};

use plankwise::bay::{Bay, Objective};
use plankwise::catalog::Catalog;
use plankwise::criteria::{CRITERIA, Form};
use plankwise::input::diag::suggestion;
use plankwise::units::Length;

use super::Failure;

/// One bay described by flags (used when no job file is given): the
/// criteria given, by job-file key, and the line loads.
#[derive(Debug, Clone, Default)]
pub struct BayFlags {
    /// (criterion key, text) for every flag given.
    pub given: Vec<(&'static str, String)>,
    /// Dead line loads, "0.8 klf @ 12 ft".
    pub line_dead: Vec<String>,
    /// Live line loads.
    pub line_live: Vec<String>,
    /// Items by kind key, as typed: "p=4 kip, at=12 ft".
    pub items: Vec<(&'static str, String)>,
    /// The display system the command's `--units` names, for the words of
    /// a refused value.
    pub units: Option<plankwise::units::System>,
}

/// The values a choice may take, offered to shell completion and help;
/// the text itself is read by the criterion, so a wrong value is refused
/// in the same words as in a job file or the UI.
#[derive(Clone)]
pub struct Offer(pub &'static [&'static str]);

impl clap::builder::TypedValueParser for Offer {
    type Value = String;
    fn parse_ref(&self, _: &Command, _: Option<&Arg>, v: &std::ffi::OsStr) -> Result<String, clap::Error> {
        Ok(v.to_string_lossy().into_owned())
    }
    fn possible_values(&self) -> Option<Box<dyn Iterator<Item = clap::builder::PossibleValue> + '_>> {
        Some(Box::new(self.0.iter().map(|v| clap::builder::PossibleValue::new(*v))))
    }
}

impl Args for BayFlags {
    fn augment_args(mut cmd: Command) -> Command {
        for c in CRITERIA {
            let Some(flag) = c.flag else { continue };
            let default = if c.default.is_empty() {
                String::new()
            } else {
                format!(" [default: {}]", c.default)
            };
            // a choice's values are listed by clap itself
            let help = match c.form {
                Form::Choice(_) => format!("{}{default}", c.help),
                _ => format!("{} — {}{default}", c.help, c.allowed()),
            };
            let mut a = Arg::new(c.key).long(flag).help(help);
            a = match c.form {
                Form::Flag => a.action(ArgAction::SetTrue),
                Form::Choice(choices) => a.value_name(c.key.to_uppercase()).value_parser(Offer(choices)),
                _ => a.value_name(c.key.to_uppercase()),
            };
            if c.key == "toppings" {
                a = a.visible_alias("topping");
            }
            cmd = cmd.arg(a);
        }
        for k in plankwise::items::ITEMS {
            let parts: Vec<&str> = k.parts.iter().map(|p| p.key).collect();
            cmd = cmd.arg(
                Arg::new(k.key)
                    .long(k.flag)
                    .value_name("PARTS")
                    .action(ArgAction::Append)
                    .help(format!(
                        "{} as key=value parts ({}), e.g. {} (repeatable)",
                        k.help,
                        parts.join(", "),
                        k.example()
                    )),
            );
        }
        cmd.arg(
            Arg::new("line_dead")
                .long("line-dead")
                .value_name("W @ X")
                .action(ArgAction::Append)
                .help("dead line load across the member, \"0.8 klf @ 12 ft\" (repeatable)"),
        )
        .arg(
            Arg::new("line_live")
                .long("line-live")
                .value_name("W @ X")
                .action(ArgAction::Append)
                .help("live line load across the member, \"0.3 klf @ 8 ft\" (repeatable)"),
        )
    }
    fn augment_args_for_update(cmd: Command) -> Command {
        Self::augment_args(cmd)
    }
}

impl FromArgMatches for BayFlags {
    fn from_arg_matches(m: &ArgMatches) -> Result<Self, clap::Error> {
        let mut f = BayFlags::default();
        for c in CRITERIA.iter().filter(|c| c.flag.is_some()) {
            match c.form {
                Form::Flag => {
                    if m.get_flag(c.key) {
                        f.given.push((c.key, "true".into()));
                    }
                }
                _ => {
                    if let Some(v) = m.get_one::<String>(c.key) {
                        f.given.push((c.key, v.clone()));
                    }
                }
            }
        }
        // the command's own --units (UnitsFlag), when it has one
        f.units = m.try_get_one::<super::UnitsArg>("units").ok().flatten().map(|u| match u {
            super::UnitsArg::Us => plankwise::units::System::Us,
            super::UnitsArg::Si => plankwise::units::System::Si,
        });
        f.line_dead = m.get_many::<String>("line_dead").map(|v| v.cloned().collect()).unwrap_or_default();
        f.line_live = m.get_many::<String>("line_live").map(|v| v.cloned().collect()).unwrap_or_default();
        for k in plankwise::items::ITEMS {
            for v in m.get_many::<String>(k.key).into_iter().flatten() {
                f.items.push((k.key, v.clone()));
            }
        }
        Ok(f)
    }
    fn update_from_arg_matches(&mut self, m: &ArgMatches) -> Result<(), clap::Error> {
        *self = Self::from_arg_matches(m)?;
        Ok(())
    }
}

fn msg(s: String) -> Failure {
    Failure::Message(s)
}

/// The parsed objective flag of the commands that rank.
pub fn objective(text: Option<&str>) -> Result<Option<Objective>, Failure> {
    match text {
        None => Ok(None),
        Some(t) => Objective::from_name(t).map(Some).ok_or_else(|| {
            let names: Vec<&str> = Objective::ALL.iter().map(|o| o.name()).collect();
            msg(format!(
                "--objective: '{t}'{} is not an objective; use one of: {}",
                suggestion(t, names.iter().copied()),
                names.join(", ")
            ))
        }),
    }
}

impl BayFlags {
    /// Whether a criterion was given on the command line.
    pub fn gives(&self, key: &str) -> bool {
        self.given.iter().any(|(k, _)| *k == key)
    }

    /// The bay these flags describe; `cat` resolves the topping mix.
    pub fn to_bay(&self, cat: &Catalog) -> Result<Bay, Failure> {
        let mut bay = Bay::new("bay from the command line", Length::new(0.0));
        for c in CRITERIA {
            let flag = c.flag.unwrap_or(c.key);
            match self.given.iter().find(|(k, _)| *k == c.key) {
                Some((_, text)) => c.apply(&mut bay, text).map_err(|e| {
                    let sys = plankwise::units::display::choose(self.units, None, cat.meta.units);
                    msg(format!("--{flag}: {}", plankwise::criteria::range_in(&e, sys)))
                })?,
                None if c.required && c.flag.is_some() => {
                    return Err(msg(format!("--{flag} is needed (or --job with a job file)")));
                }
                None if !c.default.is_empty() => c.apply(&mut bay, c.default).expect("defaults are valid"),
                None => {}
            }
        }
        let line = plankwise::items::find("line").expect("line loads are items");
        for (texts, kind, flag) in [(&self.line_dead, "dead", "line-dead"), (&self.line_live, "live", "line-live")] {
            for t in texts {
                let (w, at) = t
                    .split_once('@')
                    .ok_or_else(|| msg(format!("--{flag}: '{t}' should read like \"0.8 klf @ 12 ft\"")))?;
                let v = line
                    .read(&[("w", w.trim()), ("at", at.trim()), ("kind", kind)], &bay.case)
                    .map_err(|(_, e)| msg(format!("--{flag}: {e}")))?;
                let mut all = line.list(&bay.case);
                all.push(v);
                line.store(&mut bay.case, all);
            }
        }
        for (key, text) in &self.items {
            let k = plankwise::items::find(key).expect("a kind");
            let v = k.parse(text, &bay.case).map_err(|e| msg(format!("--{}: {e}", k.flag)))?;
            let mut all = k.list(&bay.case);
            all.push(v);
            k.store(&mut bay.case, all);
        }
        if let Some(id) = &bay.topping_mix
            && !cat.mixes.iter().any(|m| &m.id == id)
        {
            let ids: Vec<&str> = cat.mixes.iter().map(|m| m.id.as_str()).collect();
            return Err(msg(format!(
                "--topping-mix: no mix '{id}' in the catalog{}; it has: {}",
                suggestion(id, ids.iter().copied()),
                ids.join(", ")
            )));
        }
        Ok(bay)
    }
}
