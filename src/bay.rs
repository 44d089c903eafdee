//! A bay of a job: its design case, the options to try and how to rank
//! them — the domain's own terms, read from a job file, from command-line
//! flags or edited in the UI through one definition of each criterion
//! ([`crate::criteria`]).

use crate::case::DesignCase;
use crate::section::Family;
use crate::units::{Area, Length};

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
    /// The members marked for the shortlist (entry labels), kept with the job.
    pub marked: Vec<String>,
    /// The bay whose units sit beside this bay's along a shared line (its
    /// name): the shortlist compares their cambers at erection.
    pub beside: Option<String>,
}

impl Bay {
    /// A bay of this name and span with every other criterion at its default.
    pub fn new(name: &str, span: Length) -> Bay {
        Bay {
            name: name.to_string(),
            case: DesignCase::new(span),
            toppings: vec![None],
            topping_mix: None,
            objective: Objective::Lightest,
            families: Vec::new(),
            area: None,
            pieces: None,
            marked: Vec::new(),
            beside: None,
        }
    }
}
