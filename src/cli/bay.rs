//! Flags that describe one bay on the command line.

use plankwise::case::{Attachment, DesignCase, LineLoadSpec, LoadKind, LossMethod, ServiceClass, Use};
use plankwise::catalog::Catalog;
use plankwise::input::diag::suggestion;
use plankwise::fire::Exposure;
use plankwise::job::{Bay, Objective};
use plankwise::units::{Kind, Length, Q, Stress};

use super::Failure;

/// One bay described by flags (used when no job file is given).
#[derive(Debug, Clone, clap::Args)]
pub struct BayFlags {
    /// Span, centre to centre of bearings, e.g. "30 ft" or "9.1 m".
    #[arg(long)]
    pub span: Option<String>,
    /// Superimposed dead load, e.g. "15 psf".
    #[arg(long, default_value = "0 psf")]
    pub sdl: String,
    /// Live load, e.g. "50 psf".
    #[arg(long, default_value = "0 psf")]
    pub live: String,
    /// Roof live load, e.g. "20 psf".
    #[arg(long, default_value = "0 psf")]
    pub roof_live: String,
    /// Snow load, e.g. "30 psf".
    #[arg(long, default_value = "0 psf")]
    pub snow: String,
    /// Sustained part of the live load, 0 to 1.
    #[arg(long, default_value_t = plankwise::case::DEFAULT_SUSTAINED_LIVE)]
    pub sustained: f64,
    /// Dead line load across the member, "0.8 klf @ 12 ft" (repeatable).
    #[arg(long = "line-dead", value_name = "W @ X")]
    pub line_dead: Vec<String>,
    /// Live line load across the member, "0.3 klf @ 8 ft" (repeatable).
    #[arg(long = "line-live", value_name = "W @ X")]
    pub line_live: Vec<String>,
    /// Composite topping thickness, e.g. "2 in".
    #[arg(long)]
    pub topping: Option<String>,
    /// Mix id of the topping (default: 4000 psi normalweight, 150 pcf).
    #[arg(long, requires = "topping")]
    pub topping_mix: Option<String>,
    /// Bearing length at each end.
    #[arg(long, default_value = "4 in")]
    pub bearing: String,
    /// Highest service class allowed: U, T or C.
    #[arg(long, default_value = "U")]
    pub class: String,
    /// Average relative humidity, %.
    #[arg(long, default_value_t = plankwise::case::DEFAULT_HUMIDITY)]
    pub rh: f64,
    /// The member is a roof (default: a floor).
    #[arg(long)]
    pub roof: bool,
    /// Total prestress loss given as a lump sum instead of Zia et al. (1979), e.g. "30 ksi".
    #[arg(long)]
    pub lump_loss: Option<String>,
    /// Required fire rating, e.g. "2 h" (1, 1.5, 2, 3 or 4 h).
    #[arg(long)]
    pub fire: Option<String>,
    /// The assembly is restrained for fire (default unrestrained, conservative).
    #[arg(long)]
    pub restrained: bool,
    /// Exposed to weather or in contact with ground (durability cover).
    #[arg(long)]
    pub exposed: bool,
    /// Nonstructural elements attached: "tolerant" (l/240) or "sensitive" (l/480).
    #[arg(long)]
    pub attached: Option<String>,
    /// Least natural frequency required, Hz (otherwise reported only).
    #[arg(long)]
    pub min_frequency: Option<f64>,
}

fn flag<K: Kind>(name: &str, text: &str) -> Result<Q<K>, Failure> {
    Q::<K>::parse(text).map_err(|e| Failure::Message(format!("--{name}: {e}")))
}

fn msg(s: String) -> Failure {
    Failure::Message(s)
}

fn line_load(name: &str, text: &str, kind: LoadKind) -> Result<LineLoadSpec, Failure> {
    let (w, at) = text
        .split_once('@')
        .ok_or_else(|| msg(format!("--{name}: '{text}' should read like \"0.8 klf @ 12 ft\"")))?;
    Ok(LineLoadSpec {
        w: flag::<plankwise::units::LineLoadK>(name, w)?,
        at: flag::<plankwise::units::LengthK>(name, at)?,
        kind,
    })
}

/// The parsed objective flag.
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
    /// The bay these flags describe; `cat` resolves the topping mix.
    pub fn to_bay(&self, cat: &Catalog) -> Result<Bay, Failure> {
        let span_text = self
            .span
            .as_deref()
            .ok_or_else(|| msg("--span is needed (or --job with a job file)".into()))?;
        let span: Length = flag("span", span_text)?;
        if span.get() <= 12.0 || span.get() > 200.0 * 12.0 {
            return Err(msg(format!("--span: '{span_text}' must be more than 1 ft and at most 200 ft")));
        }
        let mut case = DesignCase::new(span);
        let area = |n: &str, t: &str| -> Result<plankwise::units::AreaLoad, Failure> {
            let v = flag::<plankwise::units::AreaLoadK>(n, t)?;
            if v.get() < 0.0 || v.in_unit("psf") > 2000.0 {
                return Err(msg(format!("--{n}: '{t}' must lie between 0 and 2000 psf")));
            }
            Ok(v)
        };
        case.sdl = area("sdl", &self.sdl)?;
        case.live = area("live", &self.live)?;
        case.roof_live = area("roof-live", &self.roof_live)?;
        case.snow = area("snow", &self.snow)?;
        if !(0.0..=1.0).contains(&self.sustained) {
            return Err(msg(format!("--sustained: {} must lie between 0 and 1", self.sustained)));
        }
        case.sustained_live = self.sustained;
        for l in &self.line_dead {
            case.line_loads.push(line_load("line-dead", l, LoadKind::Dead)?);
        }
        for l in &self.line_live {
            case.line_loads.push(line_load("line-live", l, LoadKind::Live)?);
        }
        if case.line_loads.iter().any(|l| l.at.get() < 0.0 || l.at.get() > span.get()) {
            return Err(msg("--line-dead/--line-live: the position must lie within the span".into()));
        }
        let topping = match &self.topping {
            None => None,
            Some(t) => {
                let th: Length = flag("topping", t)?;
                if th.get() <= 0.0 || th.get() > 12.0 {
                    return Err(msg(format!("--topping: '{t}' must be more than 0 and at most 12 in")));
                }
                Some(th)
            }
        };
        if let Some(id) = &self.topping_mix {
            if !cat.mixes.iter().any(|m| &m.id == id) {
                let ids: Vec<&str> = cat.mixes.iter().map(|m| m.id.as_str()).collect();
                return Err(msg(format!(
                    "--topping-mix: no mix '{id}' in the catalog{}; it has: {}",
                    suggestion(id, ids.iter().copied()),
                    ids.join(", ")
                )));
            }
        }
        case.bearing = flag("bearing", &self.bearing)?;
        if case.bearing.get() <= 0.0 || case.bearing.get() > 24.0 {
            return Err(msg(format!("--bearing: '{}' must be more than 0 and at most 24 in", self.bearing)));
        }
        case.class_allowed = match self.class.to_ascii_uppercase().as_str() {
            "U" => ServiceClass::U,
            "T" => ServiceClass::T,
            "C" => ServiceClass::C,
            other => return Err(msg(format!("--class: '{other}' is not a class; use U, T or C"))),
        };
        if !(20.0..=100.0).contains(&self.rh) {
            return Err(msg(format!("--rh: {} must lie between 20 and 100 %", self.rh)));
        }
        case.humidity = self.rh;
        case.member_use = if self.roof { Use::Roof } else { Use::Floor };
        if let Some(l) = &self.lump_loss {
            let v: Stress = flag("lump-loss", l)?;
            if v.get() < 0.0 || v.in_unit("ksi") > 100.0 {
                return Err(msg(format!("--lump-loss: '{l}' must lie between 0 and 100 ksi")));
            }
            case.losses = LossMethod::LumpSum(v);
        }
        if let Some(f) = &self.fire {
            let h: plankwise::units::Duration = flag("fire", f)?;
            if !plankwise::fire::RATINGS.iter().any(|r| (r - h.get()).abs() < 1e-9) {
                return Err(msg(format!("--fire: '{f}' is not a tabulated rating; use 1, 1.5, 2, 3 or 4 h")));
            }
            case.fire_rating = Some(h.get());
        }
        case.restrained = self.restrained;
        if self.exposed {
            case.exposure = Exposure::Weather;
        }
        case.attachment = match self.attached.as_deref() {
            None => Attachment::None,
            Some("tolerant") => Attachment::Tolerant,
            Some("sensitive") => Attachment::Sensitive,
            Some(other) => {
                return Err(msg(format!(
                    "--attached: '{other}'{} is not a choice; use 'tolerant' (elements not likely damaged, l/240) or 'sensitive' (likely damaged, l/480)",
                    suggestion(other, ["tolerant", "sensitive"])
                )));
            }
        };
        if let Some(f) = self.min_frequency {
            if !(0.5..=50.0).contains(&f) {
                return Err(msg(format!("--min-frequency: {f} must lie between 0.5 and 50 Hz")));
            }
            case.min_frequency_hz = Some(f);
        }
        Ok(Bay {
            name: "bay from the command line".into(),
            case,
            toppings: vec![topping],
            topping_mix: self.topping_mix.clone(),
            objective: Objective::Lightest,
            families: Vec::new(),
            area: None,
            pieces: None,
        })
    }
}
