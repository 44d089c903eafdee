//! The terminal UI's state and logic: plain [`App`] state, an [`Action`]
//! enum, and [`update`], which changes the state and does no I/O — effects
//! (write a file, quit) are returned for the shell in the binary to carry out.
//! Rendering, in [`ui`], reads the state only.

pub mod field;
pub mod keymap;
pub mod theme;
pub mod ui;

use std::path::PathBuf;
use std::sync::Arc;

use fuzzy_matcher::FuzzyMatcher;
use fuzzy_matcher::skim::SkimMatcherV2;

use crate::bay::Bay;
use crate::catalog::Catalog;
use crate::checks::Evaluation;
use crate::job::Job;
use crate::report::shortlist::Format;
use crate::section::Family;
use crate::select::envelope::{LoadLimit, max_live};
use crate::select::{Entry, Metrics, case_for, failure_reason, rank_bay, topping_mix};
use crate::units::{AreaLoad, Length};
use field::{Outcome, TextField};
use keymap::{Key, Keymap};

/// Everything the user can ask for.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum Action {
    /// Move up.
    Up,
    /// Move down.
    Down,
    /// Previous value or pane.
    Left,
    /// Next value or pane.
    Right,
    /// Next pane.
    NextPane,
    /// Previous pane.
    PrevPane,
    /// Span up a step.
    SpanUp,
    /// Span down a step.
    SpanDown,
    /// Span up a fine step.
    SpanUpFine,
    /// Span down a fine step.
    SpanDownFine,
    /// Live load up a step.
    LiveUp,
    /// Live load down a step.
    LiveDown,
    /// Live load up a fine step.
    LiveUpFine,
    /// Live load down a fine step.
    LiveDownFine,
    /// Edit the selected bay value.
    Edit,
    /// Remove the selected load or opening.
    Remove,
    /// Start a search.
    Search,
    /// Next ranking objective.
    CycleObjective,
    /// Show or hide non-viable candidates.
    ToggleFailing,
    /// Detail or chart.
    ToggleView,
    /// Show or leave the side-by-side view of the marked candidates.
    Compare,
    /// Mark the selected candidate for the shortlist.
    Mark,
    /// Write the shortlist (asks for a path).
    WriteShortlist,
    /// Write the calculation sheet of the selected candidate.
    WriteSheet,
    /// Save the job (asks for a path when there is none).
    Save,
    /// US or SI display.
    ToggleUnits,
    /// Next bay.
    NextBay,
    /// Previous bay.
    PrevBay,
    /// Help overlay.
    Help,
    /// Quit (asks first when edits are unsaved).
    Quit,
    /// A key typed into a prompt, the search, an edit or a question.
    Input(Key),
    /// A key bound to nothing: the status line says so.
    Unbound(Key),
    /// Scroll the Detail pane by this many pages (PgUp/PgDn with the
    /// Detail pane focused).
    ScrollPage(i32),
    /// The shell reports that a file exists: ask before overwriting.
    AskOverwrite,
    /// The shell reports success.
    Done,
    /// The shell reports a failure.
    Failed,
}

/// What the shell must do after an update.
#[derive(Debug, Clone, PartialEq)]
pub enum Effect {
    /// Nothing.
    None,
    /// Leave.
    Quit,
    /// Write the shortlist of the marked candidates (or the top ones).
    WriteShortlist {
        /// Where.
        path: PathBuf,
        /// Format.
        format: Format,
        /// Replace an existing file.
        force: bool,
    },
    /// Write the calculation sheet of the selected candidate (Markdown
    /// for a .md path, PDF for a .pdf path, else text).
    WriteSheet {
        /// Where.
        path: PathBuf,
        /// Replace an existing file.
        force: bool,
    },
    /// Save the job (atomically, keeping a backup).
    SaveJob {
        /// Where.
        path: PathBuf,
    },
}

/// Which pane has the keys.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum Focus {
    /// Bay criteria.
    Bay,
    /// Ranked candidates.
    Candidates,
    /// Detail or chart.
    Detail,
}

/// What the lower pane shows.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum View {
    /// Every check of the selected candidate.
    Detail,
    /// Its capacity envelope.
    Chart,
    /// Its camber along the member at release, erection and final.
    Camber,
    /// Its midspan camber against age (ACI 209R-92), with the multipliers' values.
    CamberAge,
    /// The marked candidates side by side, every check a row.
    Compare,
}

/// Display units: the system every pane shows.
pub use crate::units::System as Units;

/// A question waiting for an answer.
#[derive(Debug, Clone, PartialEq)]
pub enum Question {
    /// Quit with unsaved edits?
    Quit,
    /// Overwrite this shortlist file?
    Overwrite(PathBuf, Format),
    /// Overwrite this calculation sheet?
    OverwriteSheet(PathBuf),
}

/// What a prompt asks for.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum PromptKind {
    /// Shortlist path (format from the extension: .md, .csv, .pdf, else text).
    Shortlist,
    /// Path to save the job to.
    SaveJob,
    /// Path of the calculation sheet.
    Sheet,
}

/// Input mode.
#[derive(Debug, Clone, PartialEq)]
pub enum Mode {
    /// Keys go to the keymap.
    Normal,
    /// Typing a search query (the list narrows as it is typed).
    Search(TextField),
    /// Editing a bay field.
    Edit(TextField),
    /// Typing a path.
    Prompt(PromptKind, TextField),
    /// A yes/no question.
    Confirm(Question),
    /// Help overlay.
    Help,
}

/// The bay fields shown and edited in the criteria pane: every bay
/// criterion, read and written through its one definition.
pub use crate::criteria::CRITERIA as FIELDS;

/// A row of the criteria pane: a criterion, one of the bay's loads or
/// openings, or the row that adds one of a kind.
#[derive(Debug, Clone, Copy, PartialEq)]
pub enum PaneRow {
    /// A criterion, by index in [`FIELDS`].
    Criterion(usize),
    /// An item of a kind, by index within the kind.
    Item(&'static crate::items::ItemKind, usize),
    /// Add an item of a kind.
    Add(&'static crate::items::ItemKind),
}

/// One ranked candidate, owned (no borrows into the catalog).
#[derive(Debug, Clone, PartialEq)]
pub struct Row {
    /// Section index in the catalog.
    pub section: usize,
    /// Pattern index in the section.
    pub pattern: usize,
    /// Topping.
    pub topping: Option<Length>,
    /// "section / pattern [+ topping]".
    pub label: String,
    /// Section and pattern designations.
    pub designation: String,
    /// Family.
    pub family: Family,
    /// Remarks.
    pub remarks: String,
    /// Figures.
    pub metrics: Metrics,
    /// Every check passes.
    pub viable: bool,
    /// Governing check title and ratio.
    pub governing: (String, f64),
    /// First failure in order of importance, with how much, and its ratio
    /// (the ratio a failing row shows belongs to the check it names).
    pub failure: Option<(String, f64)>,
}

/// The ratio shown for a failing entry with no failing check to name
/// (cannot happen: a verdict fails only by a check).
const RATIO_FAIL: f64 = 1.0;

/// The ranked rows of a bay, viable first (what the list shows).
pub fn rows_for(cat: &Catalog, bay: &Bay) -> Vec<Row> {
    let r = rank_bay(cat, bay, None);
    let to_row = |x: &crate::select::Ranked| {
        let si = index_in(&cat.sections, x.entry.section);
        let pi = index_in(&cat.sections[si].patterns, x.entry.pattern);
        Row {
            section: si,
            pattern: pi,
            topping: x.entry.topping,
            label: x.entry.label(),
            designation: format!("{} — {}", x.entry.section.designation, x.entry.pattern.designation),
            family: x.entry.section.family,
            remarks: format!("{} {}", x.entry.section.remarks, x.entry.pattern.remarks),
            metrics: x.metrics,
            viable: x.verdict.viable,
            governing: (x.verdict.governing().info.title.to_string(), x.verdict.governing().ratio),
            failure: (!x.verdict.viable).then(|| (failure_reason(x), x.verdict.first_failure().map_or(RATIO_FAIL, |f| f.ratio))),
        }
    };
    r.viable.iter().chain(r.failing.iter()).map(to_row).collect()
}

/// The index of `item` in `list`, found from its address (constant time:
/// a ranking of 10 000 entries would otherwise search 10 000 times).
fn index_in<T>(list: &[T], item: &T) -> usize {
    let size = std::mem::size_of::<T>().max(1);
    let i = (item as *const T as usize).wrapping_sub(list.as_ptr() as usize) / size;
    if list.get(i).is_some_and(|x| std::ptr::eq(x, item)) {
        i
    } else {
        list.iter().position(|x| std::ptr::eq(x, item)).unwrap_or(0)
    }
}

/// Bays with more entries than this are ranked off the UI thread when the
/// shell offers it ([`App::background`]): the next frame comes at once, with
/// the previous list marked as being re-ranked (about 100 ms of ranking on
/// two cores at 10 000 entries; below 2000 it is quicker than a frame).
pub const BACKGROUND_ABOVE: usize = 2000;

/// A ranking the shell is asked to compute: its number and its bay.
#[derive(Debug, Clone)]
pub struct RankRequest {
    /// Increases with every request; only the latest one's answer is kept.
    pub generation: u64,
    /// The bay as it is now.
    pub bay: Bay,
}

/// The UI state.
pub struct App {
    /// The catalog (shared with a ranking thread).
    pub catalog: Arc<Catalog>,
    /// The job being worked on.
    pub job: Job,
    /// Where the job came from (None: the built-in demo or flags).
    pub job_path: Option<PathBuf>,
    /// Current bay index.
    pub bay: usize,
    /// Focus.
    pub focus: Focus,
    /// Input mode.
    pub mode: Mode,
    /// Lower-pane view.
    pub view: View,
    /// Display units.
    pub units: Units,
    /// Selected bay field.
    pub field: usize,
    /// Selected row in the visible list.
    pub selected: usize,
    /// Show non-viable candidates.
    pub show_failing: bool,
    /// Search query.
    pub query: String,
    /// Ranked rows of the current bay, viable first.
    pub rows: Vec<Row>,
    /// Visible rows: index into `rows` and the matched character positions of the label.
    pub visible: Vec<(usize, Vec<usize>)>,
    /// Job edited since loading or saving.
    pub dirty: bool,
    /// Status line message and whether it is an error.
    pub status: (String, bool),
    /// Keymap.
    pub keymap: Keymap,
    /// Evaluation of the selected row (detail pane).
    pub detail: Option<Evaluation>,
    /// First line of the Detail pane shown (it scrolls when it has focus).
    pub detail_scroll: usize,
    /// The last first line the Detail pane can show, as last drawn.
    pub detail_max: std::cell::Cell<usize>,
    /// Lines a page key moves the Detail pane by: its height as last
    /// drawn, less one line kept in view.
    pub detail_page: std::cell::Cell<usize>,
    /// Envelopes for the chart: (label, limits), selected first.
    pub chart: Vec<(String, Vec<LoadLimit>)>,
    /// The camber picture of the selected candidate (when that view shows).
    pub camber: Vec<crate::camber::CamberPoint>,
    /// Its midspan camber against age, days (when that view shows).
    pub camber_age: Vec<(f64, f64)>,
    /// The marked candidates of the bay, evaluated, for the compare view
    /// (label, weight, depth, evaluation).
    pub compare: Vec<(String, Metrics, Evaluation)>,
    /// Monochrome display (NO_COLOR).
    pub mono: bool,
    /// Bays with more entries than this are ranked off the UI thread (the
    /// shell sets it, to [`BACKGROUND_ABOVE`], when it runs a ranking
    /// thread); None ranks every bay at once.
    pub background: Option<usize>,
    /// The ranking the shell should start, if any.
    pub request: Option<RankRequest>,
    /// The generation of the ranking being computed, if one is.
    pub pending: Option<u64>,
    generation: u64,
}

impl App {
    /// A new app on a catalog and a job.
    pub fn new(catalog: Catalog, job: Job, job_path: Option<PathBuf>) -> App {
        let units = crate::units::display::choose(None, job.units, catalog.meta.units);
        let (show_failing, query) = (!job.hide_failing, job.search.clone());
        let mut app = App {
            catalog: Arc::new(catalog),
            job,
            job_path,
            bay: 0,
            focus: Focus::Candidates,
            mode: Mode::Normal,
            view: View::Detail,
            units,
            field: 0,
            selected: 0,
            // the view the job was saved with
            show_failing,
            query,
            rows: Vec::new(),
            visible: Vec::new(),
            dirty: false,
            status: ("? for help · + − span · ] [ live · / search · w shortlist · q quit".into(), false),
            keymap: Keymap::default(),
            detail: None,
            detail_scroll: 0,
            detail_max: std::cell::Cell::new(usize::MAX),
            detail_page: std::cell::Cell::new(1),
            chart: Vec::new(),
            camber: Vec::new(),
            camber_age: Vec::new(),
            compare: Vec::new(),
            mono: false,
            background: None,
            request: None,
            pending: None,
            generation: 0,
        };
        app.rerank();
        app
    }

    /// The current bay.
    pub fn current_bay(&self) -> &Bay {
        &self.job.bays[self.bay]
    }

    /// What a key means now: prompts, edits, questions and the help
    /// overlay take keys first; otherwise the keymap decides.
    pub fn action_for(&self, key: Key) -> Action {
        match self.mode {
            // with the Detail pane focused, page keys page through it
            Mode::Normal if self.focus == Focus::Detail && matches!(key, Key::PageUp | Key::PageDown) => {
                Action::ScrollPage(if key == Key::PageDown { 1 } else { -1 })
            }
            Mode::Normal => self.keymap.action(key).unwrap_or(Action::Unbound(key)),
            _ => Action::Input(key),
        }
    }

    /// Recompute the ranking of the current bay (its inputs changed): at
    /// once, or — for a large bay when the shell ranks in the background —
    /// as a [`RankRequest`] whose answer comes to [`App::ranked`].
    pub fn rerank(&mut self) {
        self.generation += 1;
        let bay = self.job.bays[self.bay].clone();
        if self
            .background
            .is_some_and(|n| crate::select::entries(&self.catalog, &bay).len() > n)
        {
            self.pending = Some(self.generation);
            self.request = Some(RankRequest {
                generation: self.generation,
                bay,
            });
            // the detail follows the new case at once; the list when ranked
            self.refresh_detail();
            return;
        }
        self.pending = None;
        self.request = None;
        self.rows = rows_for(&self.catalog, &bay);
        self.refilter();
    }

    /// The answer to a [`RankRequest`]: kept when it is the latest one.
    pub fn ranked(&mut self, generation: u64, rows: Vec<Row>) {
        if self.pending != Some(generation) {
            return;
        }
        self.pending = None;
        // keep the selection on the same entry when it is still listed
        let keep = self.selected_row().map(|r| r.label.clone());
        self.rows = rows;
        self.refilter();
        if let Some(label) = keep
            && let Some(i) = self.visible.iter().position(|(i, _)| self.rows[*i].label == label)
        {
            self.selected = i;
            self.refresh_detail();
        }
    }

    /// Recompute the visible rows (query or toggle changed).
    pub fn refilter(&mut self) {
        let matcher = SkimMatcherV2::default();
        let q = self.query.trim();
        self.visible = self
            .rows
            .iter()
            .enumerate()
            .filter(|(_, r)| self.show_failing || r.viable)
            .filter_map(|(i, r)| {
                if q.is_empty() {
                    return Some((i, Vec::new()));
                }
                // the label's own match gives the highlight; designation,
                // family and remarks can still let a row through
                if let Some((_, idx)) = matcher.fuzzy_indices(&r.label, q) {
                    return Some((i, idx));
                }
                let hay = format!("{} {} {}", r.designation, r.family.name(), r.remarks);
                matcher.fuzzy_match(&hay, q).map(|_| (i, Vec::new()))
            })
            .collect();
        if self.selected >= self.visible.len() {
            self.selected = self.visible.len().saturating_sub(1);
        }
        self.refresh_detail();
    }

    /// The selected row.
    pub fn selected_row(&self) -> Option<&Row> {
        self.visible.get(self.selected).map(|(i, _)| &self.rows[*i])
    }

    /// The selected row's catalog entry.
    pub fn selected_entry(&self) -> Option<Entry<'_>> {
        self.selected_row().map(|r| self.entry_of(r))
    }

    /// The design case of a row: the current bay with the row's topping.
    pub fn case_of(&self, r: &Row) -> crate::case::DesignCase {
        let bay = self.current_bay();
        case_for(bay, r.topping, &topping_mix(&self.catalog, bay))
    }

    fn entry_of(&self, r: &Row) -> Entry<'_> {
        let s = &self.catalog.sections[r.section];
        Entry {
            section: s,
            pattern: &s.patterns[r.pattern],
            mix: s.mix(&self.catalog),
            topping: r.topping,
        }
    }

    /// Recompute the detail (and the chart when it shows).
    pub fn refresh_detail(&mut self) {
        self.detail_scroll = 0;
        let Some(r) = self.selected_row().cloned() else {
            self.detail = None;
            self.chart.clear();
            return;
        };
        let e = self.entry_of(&r);
        let case = self.case_of(&r);
        self.detail = Some(crate::checks::evaluate(&e.candidate(), &case));
        self.chart.clear();
        self.camber.clear();
        match self.view {
            View::Chart => self.refresh_chart(),
            View::Camber => self.refresh_camber(),
            View::CamberAge => self.refresh_camber_age(),
            View::Compare => self.refresh_compare(),
            View::Detail => {}
        }
    }

    /// Points of the camber picture.
    pub const CAMBER_POINTS: usize = 24;

    /// The camber picture of the selected candidate.
    pub fn refresh_camber(&mut self) {
        let (Some(r), Some(ev)) = (self.selected_row().cloned(), self.detail.as_ref()) else {
            self.camber.clear();
            return;
        };
        let e = self.entry_of(&r);
        let case = self.case_of(&r);
        let m = crate::member::Member::new(e.section, e.pattern, e.mix, &case);
        self.camber = crate::camber::profile(&m, &ev.camber, App::CAMBER_POINTS);
    }

    /// The selected candidate's midspan camber from release to the final age.
    pub fn refresh_camber_age(&mut self) {
        let (Some(r), Some(ev)) = (self.selected_row().cloned(), self.detail.as_ref()) else {
            self.camber_age.clear();
            return;
        };
        let e = self.entry_of(&r);
        let case = self.case_of(&r);
        let m = crate::member::Member::new(e.section, e.pattern, e.mix, &case);
        let x = crate::camber::aged_inputs(&m, &ev.camber);
        let cond = crate::checks::aging_conditions(&m);
        let te = ev.aged.erection_age_days;
        // log-spaced ages, with the erection age on both sides of its step
        let mut ages: Vec<f64> = (0..=40).map(|k| 10f64.powf(4.0 * k as f64 / 40.0)).collect();
        ages.extend([te, te + 1e-6]);
        ages.sort_by(f64::total_cmp);
        self.camber_age = ages
            .into_iter()
            .map(|t| (t, crate::camber::camber_at_age(&x, te, &cond, t)))
            .collect();
    }

    /// The most candidates the compare view shows.
    pub const COMPARE_MOST: usize = 4;

    /// Evaluate the bay's marked candidates (at most four) for the compare view.
    pub fn refresh_compare(&mut self) {
        let rows: Vec<Row> = self
            .current_bay()
            .marked
            .iter()
            .filter_map(|m| self.rows.iter().find(|r| &r.label == m))
            .take(App::COMPARE_MOST)
            .cloned()
            .collect();
        self.compare = rows
            .iter()
            .map(|r| {
                let e = self.entry_of(r);
                let case = self.case_of(r);
                (r.label.clone(), r.metrics, crate::checks::evaluate(&e.candidate(), &case))
            })
            .collect();
    }

    /// The capacity envelopes of the selected and the next two viable candidates.
    pub fn refresh_chart(&mut self) {
        let bay = self.current_bay().clone();
        let span = bay.case.span.get() / 12.0;
        let spans: Vec<f64> = (0..9).map(|k| (span * (0.6 + 0.1 * k as f64)).max(4.0)).collect();
        let mut picks: Vec<Row> = self.selected_row().cloned().into_iter().collect();
        for r in self.rows.iter().filter(|r| r.viable) {
            if picks.len() >= 3 {
                break;
            }
            if !picks.iter().any(|p| p.label == r.label) {
                picks.push(r.clone());
            }
        }
        self.chart = picks
            .iter()
            .map(|r| {
                let e = self.entry_of(r);
                let base = self.case_of(r);
                let lims = spans
                    .iter()
                    .map(|&s| {
                        let mut c = base.clone();
                        c.span = Length::from_unit(s, "ft");
                        max_live(&e, &c)
                    })
                    .collect();
                (r.label.clone(), lims)
            })
            .collect();
    }

    /// A length as the display units show it.
    pub fn show_len(&self, l: Length) -> String {
        crate::units::display::span(l.get(), self.units)
    }

    /// An area load as the display units show it.
    pub fn show_load(&self, q: AreaLoad) -> String {
        match self.units {
            Units::Us => format!("{:.0} psf", q.in_unit("psf")),
            Units::Si => format!("{:.2} kPa", q.in_unit("kPa")),
        }
    }

    /// Every row of the criteria pane: the criteria, then the bay's loads
    /// and openings, then a row to add each kind.
    pub fn pane_rows(&self) -> Vec<PaneRow> {
        let mut rows: Vec<PaneRow> = (0..FIELDS.len()).map(PaneRow::Criterion).collect();
        for (k, i, _) in crate::items::all(&self.current_bay().case) {
            rows.push(PaneRow::Item(k, i));
        }
        rows.extend(crate::items::ITEMS.iter().map(PaneRow::Add));
        rows
    }

    /// The row `i` of the criteria pane.
    pub fn pane_row(&self, i: usize) -> PaneRow {
        let rows = self.pane_rows();
        rows.get(i).copied().unwrap_or(PaneRow::Criterion(0))
    }

    /// Label and value of row `i` of the criteria pane, in the display units.
    pub fn row_text(&self, i: usize) -> (String, String) {
        match self.pane_row(i) {
            PaneRow::Criterion(c) => (FIELDS[c].label.to_string(), self.field_text(c)),
            PaneRow::Item(k, j) => {
                let v = k.list(&self.current_bay().case);
                (
                    format!("{} {}", k.label, j + 1),
                    v.get(j).map_or(String::new(), |v| k.text(v, self.units)),
                )
            }
            PaneRow::Add(k) => (format!("+ {}", k.label.to_lowercase()), "enter to add".into()),
        }
    }

    /// The value of bay field `i` as text, in the display units.
    pub fn field_text(&self, i: usize) -> String {
        FIELDS[i].show(self.current_bay(), self.units)
    }

    /// Whether pane row `i` takes one of a few values, stepped with ← → or
    /// Enter rather than typed.
    pub fn field_cycles(&self, i: usize) -> bool {
        match self.pane_row(i) {
            PaneRow::Criterion(c) => matches!(
                FIELDS[c].form,
                crate::criteria::Form::Choice(_) | crate::criteria::Form::Flag | crate::criteria::Form::Rating
            ),
            _ => false,
        }
    }

    /// What an edit of pane row `i` asks for, in words.
    pub fn row_allowed(&self, i: usize) -> (String, String) {
        match self.pane_row(i) {
            PaneRow::Criterion(c) => (FIELDS[c].label.to_string(), FIELDS[c].allowed_in(self.units)),
            PaneRow::Item(k, _) | PaneRow::Add(k) => (
                k.label.to_string(),
                format!(
                    "key=value parts ({}), e.g. {}; empty removes",
                    k.parts.iter().map(|p| p.key).collect::<Vec<_>>().join(", "),
                    k.example_in(self.units)
                ),
            ),
        }
    }

    /// Remove the load or opening on pane row `i`.
    fn remove_item(&mut self, i: usize) {
        let PaneRow::Item(k, j) = self.pane_row(i) else {
            self.say("only a load or opening can be removed", true);
            return;
        };
        let case = &mut self.job.bays[self.bay].case;
        let mut all = k.list(case);
        if j < all.len() {
            all.remove(j);
            k.store(case, all);
        }
        self.field = self.field.min(self.pane_rows().len() - 1);
        self.changed();
        self.say(format!("removed {} {}", k.label.to_lowercase(), j + 1), false);
    }

    fn say(&mut self, msg: impl Into<String>, error: bool) {
        self.status = (msg.into(), error);
    }

    fn changed(&mut self) {
        self.dirty = true;
        self.rerank();
    }

    fn step_span(&mut self, ft: f64) {
        let step = match self.units {
            Units::Us => Length::from_unit(ft, "ft"),
            Units::Si => Length::from_unit(ft * 0.25, "m"),
        };
        let c = &mut self.job.bays[self.bay].case;
        let new = (c.span.get() + step.get()).clamp(48.0, 2400.0);
        c.span = Length::new(new);
        // loads and openings beyond a shortened span fall away
        let dropped = crate::items::keep_on_member(c);
        let s = self.show_len(Length::new(new));
        self.changed();
        self.say(
            if dropped > 0 {
                format!("span {s}; {dropped} load(s) or opening(s) no longer on the member removed")
            } else {
                format!("span {s}")
            },
            dropped > 0,
        );
    }

    /// Step the uniform load the bay's use names: the floor live load, or
    /// on a roof the larger of the roof live and snow loads (roof live
    /// when they are equal) — the load that enters the combinations.
    fn step_live(&mut self, psf: f64) {
        let step = match self.units {
            Units::Us => AreaLoad::from_unit(psf, "psf"),
            Units::Si => AreaLoad::from_unit(psf * 0.05, "kPa"),
        };
        let top = AreaLoad::from_unit(2000.0, "psf").get();
        let c = &mut self.job.bays[self.bay].case;
        let (name, slot) = match c.member_use {
            crate::case::Use::Floor => ("live load L", &mut c.live),
            crate::case::Use::Roof if c.snow.get() > c.roof_live.get() => ("snow load S", &mut c.snow),
            crate::case::Use::Roof => ("roof live load Lr", &mut c.roof_live),
        };
        *slot = AreaLoad::new((slot.get() + step.get()).clamp(0.0, top));
        let now = *slot;
        let s = self.show_load(now);
        self.changed();
        self.say(format!("{name} {s}"), false);
    }

    /// Cycle an enumerated field forward (`dir` = 1) or back (−1).
    fn cycle_field(&mut self, dir: i32) {
        use crate::criteria::{Form, Value};
        let PaneRow::Criterion(ci) = self.pane_row(self.field) else {
            return;
        };
        let c = &FIELDS[ci];
        let b = &mut self.job.bays[self.bay];
        let step = |i: usize, n: usize| (i as i32 + dir).rem_euclid(n as i32) as usize;
        let v = match (c.form, c.value(b)) {
            (Form::Choice(choices), Value::Pick(i)) => Value::Pick(step(i, choices.len())),
            (Form::Flag, Value::Flag(f)) => Value::Flag(!f),
            (Form::Rating, Value::Num(h)) => {
                let opts = [None, Some(1.0), Some(1.5), Some(2.0), Some(3.0), Some(4.0)];
                let i = opts.iter().position(|o| *o == h).unwrap_or(0);
                Value::Num(opts[step(i, opts.len())])
            }
            _ => return,
        };
        c.set(b, v);
        let t = self.field_text(ci);
        self.changed();
        self.say(format!("{}: {t}", c.label), false);
    }

    fn apply_edit(&mut self, text: &str) {
        match self.pane_row(self.field) {
            PaneRow::Criterion(ci) => {
                let c = &FIELDS[ci];
                let b = &mut self.job.bays[self.bay];
                match c.apply(b, text) {
                    Ok(()) => {
                        // loads and openings off a shortened member fall away
                        let dropped = crate::items::keep_on_member(&mut b.case);
                        self.job.typed.insert((self.bay, c.key), text.trim().to_string());
                        let t = self.field_text(ci);
                        self.changed();
                        let more = if dropped > 0 {
                            format!("; {dropped} load(s) or opening(s) no longer on the member removed")
                        } else {
                            String::new()
                        };
                        self.say(format!("{}: {t}{more}", c.label), false);
                    }
                    Err(e) => {
                        let e = crate::criteria::range_in(&e, self.units);
                        self.say(format!("{}: {e}", c.label), true)
                    }
                }
            }
            PaneRow::Item(..) if text.trim().is_empty() => self.remove_item(self.field),
            row @ (PaneRow::Item(..) | PaneRow::Add(_)) => {
                let (k, index) = match row {
                    PaneRow::Item(k, j) => (k, Some(j)),
                    PaneRow::Add(k) => (k, None),
                    PaneRow::Criterion(_) => return,
                };
                let case = &mut self.job.bays[self.bay].case;
                match k.parse(text, case) {
                    Ok(v) => {
                        let mut all = k.list(case);
                        let n = match index {
                            Some(j) if j < all.len() => {
                                all[j] = v;
                                j
                            }
                            _ => {
                                all.push(v);
                                all.len() - 1
                            }
                        };
                        k.store(case, all);
                        self.changed();
                        self.say(format!("{} {}: {}", k.label, n + 1, text.trim()), false);
                    }
                    Err(e) => self.say(format!("{}: {e}", k.label), true),
                }
            }
        }
    }

    fn switch_bay(&mut self, dir: i32) {
        let n = self.job.bays.len() as i32;
        self.bay = (self.bay as i32 + dir).rem_euclid(n) as usize;
        self.selected = 0;
        self.rerank();
        let name = self.current_bay().name.clone();
        self.say(format!("bay {}/{}: {name}", self.bay + 1, n), false);
    }

    /// The marked rows of every bay, or the top three viable of each when none is marked.
    pub fn marked_labels(&self, bay: usize) -> Vec<String> {
        self.job.bays.get(bay).map_or(Vec::new(), |b| b.marked.clone())
    }

    /// Whether a row of the current bay is marked.
    pub fn is_marked(&self, label: &str) -> bool {
        self.current_bay().marked.iter().any(|m| m == label)
    }
}

/// The shortlist's format for a path the user typed, by the library's one
/// extension rule ([`crate::report::FileKind`]); text for anything else.
fn format_for(path: &str) -> Format {
    use crate::report::FileKind;
    match FileKind::of_path(std::path::Path::new(path)) {
        Some(FileKind::Markdown) => Format::Markdown,
        Some(FileKind::Csv) => Format::Csv,
        Some(FileKind::Pdf) => Format::Pdf,
        _ => Format::Text,
    }
}

/// Apply one action. No I/O: the returned effect is for the shell.
pub fn update(app: &mut App, action: Action) -> Effect {
    if let Action::Input(key) = action {
        return input(app, key);
    }
    match action {
        Action::Up | Action::Down => {
            let down = action == Action::Down;
            match app.focus {
                Focus::Bay => {
                    let n = app.pane_rows().len();
                    app.field = if down {
                        (app.field + 1).min(n - 1)
                    } else {
                        app.field.saturating_sub(1)
                    };
                    // the whole value, however narrow the pane
                    let (label, text) = app.row_text(app.field);
                    app.say(format!("{label}: {text}"), false);
                }
                Focus::Detail => {
                    // the Detail pane scrolls (the drawing stops at its last page)
                    app.detail_scroll = if down {
                        (app.detail_scroll + 1).min(app.detail_max.get())
                    } else {
                        app.detail_scroll.saturating_sub(1)
                    };
                }
                Focus::Candidates => {
                    let n = app.visible.len();
                    if n > 0 {
                        app.selected = if down {
                            (app.selected + 1).min(n - 1)
                        } else {
                            app.selected.saturating_sub(1)
                        };
                        app.refresh_detail();
                    }
                }
            }
        }
        Action::Left | Action::Right => {
            let dir = if action == Action::Right { 1 } else { -1 };
            if app.focus == Focus::Bay && app.field_cycles(app.field) {
                app.cycle_field(dir);
            } else {
                return update(app, if dir > 0 { Action::NextPane } else { Action::PrevPane });
            }
        }
        Action::NextPane | Action::PrevPane => {
            let order = [Focus::Bay, Focus::Candidates, Focus::Detail];
            let i = order.iter().position(|f| *f == app.focus).unwrap_or(0);
            let j = if action == Action::NextPane { (i + 1) % 3 } else { (i + 2) % 3 };
            app.focus = order[j];
        }
        Action::SpanUp => app.step_span(1.0),
        Action::SpanDown => app.step_span(-1.0),
        Action::SpanUpFine => app.step_span(1.0 / 12.0),
        Action::SpanDownFine => app.step_span(-1.0 / 12.0),
        Action::LiveUp => app.step_live(10.0),
        Action::LiveDown => app.step_live(-10.0),
        Action::LiveUpFine => app.step_live(1.0),
        Action::LiveDownFine => app.step_live(-1.0),
        Action::Edit => match app.focus {
            Focus::Bay if app.field_cycles(app.field) => app.cycle_field(1),
            Focus::Bay => {
                let t = match app.pane_row(app.field) {
                    PaneRow::Add(k) => k.example_in(app.units).trim_matches('"').to_string(),
                    _ => app.row_text(app.field).1,
                };
                app.mode = Mode::Edit(TextField::prefilled(t));
            }
            _ => {
                app.view = View::Detail;
                app.focus = Focus::Detail;
            }
        },
        Action::Remove => {
            if app.focus == Focus::Bay {
                app.remove_item(app.field);
            } else {
                app.say("select a load or opening in the bay pane to remove it", true);
            }
        }
        Action::Search => {
            app.mode = Mode::Search(TextField::prefilled(app.query.clone()));
            app.say("search: type to narrow, enter to keep, esc to clear", false);
        }
        Action::CycleObjective => {
            let b = &mut app.job.bays[app.bay];
            b.objective = b.objective.next();
            let n = b.objective.name();
            app.changed();
            app.say(format!("objective: {n}"), false);
        }
        Action::ToggleFailing => {
            app.show_failing = !app.show_failing;
            app.job.hide_failing = !app.show_failing;
            app.refilter();
            app.say(
                if app.show_failing {
                    "showing non-viable candidates"
                } else {
                    "hiding non-viable candidates"
                },
                false,
            );
        }
        Action::ToggleView => {
            app.view = match app.view {
                View::Detail => View::Chart,
                View::Chart => View::Camber,
                View::Camber => View::CamberAge,
                View::CamberAge | View::Compare => View::Detail,
            };
            match app.view {
                View::Chart => app.refresh_chart(),
                View::Camber => app.refresh_camber(),
                View::CamberAge => app.refresh_camber_age(),
                _ => {}
            }
        }
        Action::Compare => {
            if app.view == View::Compare {
                app.view = View::Detail;
            } else {
                app.view = View::Compare;
                app.refresh_compare();
                let n = app.compare.len();
                if n < 2 {
                    app.say("mark two to four viable candidates (space) to compare them side by side", true);
                } else if app.current_bay().marked.len() > App::COMPARE_MOST {
                    app.say(format!("comparing the first {} marked candidates", App::COMPARE_MOST), false);
                }
            }
        }
        Action::Mark => {
            if let Some(r) = app.selected_row() {
                if !r.viable {
                    app.say("only viable candidates go on the shortlist", true);
                } else {
                    // marks belong to the bay and are saved with the job
                    let label = r.label.clone();
                    let marks = &mut app.job.bays[app.bay].marked;
                    if let Some(i) = marks.iter().position(|m| *m == label) {
                        marks.remove(i);
                        app.say(format!("unmarked {label}"), false);
                    } else {
                        marks.push(label.clone());
                        app.say(format!("marked {label}"), false);
                    }
                    app.dirty = true;
                    if app.view == View::Compare {
                        app.refresh_compare();
                    }
                }
            }
        }
        Action::WriteShortlist => app.mode = Mode::Prompt(PromptKind::Shortlist, TextField::prefilled("shortlist.txt")),
        Action::WriteSheet => {
            if app.selected_row().is_some() && app.detail.is_some() {
                app.mode = Mode::Prompt(PromptKind::Sheet, TextField::prefilled("sheet.txt"));
            } else {
                app.say("select a candidate to write its calculation sheet", true);
            }
        }
        Action::Save => {
            return match &app.job_path {
                Some(p) => Effect::SaveJob { path: p.clone() },
                None => {
                    app.mode = Mode::Prompt(PromptKind::SaveJob, TextField::prefilled("job.toml"));
                    Effect::None
                }
            };
        }
        Action::ToggleUnits => {
            app.units = if app.units == Units::Us { Units::Si } else { Units::Us };
            // the job keeps the units its user works in (saved with it)
            app.job.units = Some(app.units);
            app.say(
                if app.units == Units::Us {
                    "US customary display"
                } else {
                    "SI display"
                },
                false,
            );
        }
        Action::NextBay => app.switch_bay(1),
        Action::PrevBay => app.switch_bay(-1),
        Action::Help => app.mode = Mode::Help,
        Action::Quit => {
            if app.dirty {
                app.mode = Mode::Confirm(Question::Quit);
            } else {
                return Effect::Quit;
            }
        }
        Action::AskOverwrite => {
            if let Mode::Prompt(PromptKind::Sheet, p) = &app.mode {
                app.mode = Mode::Confirm(Question::OverwriteSheet(PathBuf::from(p.text.clone())));
            } else if let Mode::Prompt(PromptKind::Shortlist, p) | Mode::Edit(p) = &app.mode {
                let p = PathBuf::from(p.text.clone());
                let f = format_for(&p.to_string_lossy());
                app.mode = Mode::Confirm(Question::Overwrite(p, f));
            }
        }
        Action::ScrollPage(n) => {
            let page = app.detail_page.get().max(1);
            app.detail_scroll = if n > 0 {
                (app.detail_scroll + page).min(app.detail_max.get())
            } else {
                app.detail_scroll.saturating_sub(page)
            };
        }
        // Esc leaves what there is to leave, and never quits
        Action::Unbound(Key::Esc) => {
            if app.query.is_empty() {
                app.say("esc: nothing to leave (q quits)", false);
            } else {
                app.query.clear();
                app.job.search.clear();
                app.refilter();
                app.say("search cleared", false);
            }
        }
        Action::Unbound(key) => {
            let help = app.keymap.key_of(Action::Help).map_or("the help".to_string(), |k| k.to_string());
            app.say(format!("the key {key} does nothing here; {help} lists the keys"), true);
        }
        Action::Done | Action::Failed | Action::Input(_) => {}
    }
    Effect::None
}

fn input(app: &mut App, key: Key) -> Effect {
    match app.mode.clone() {
        Mode::Normal => Effect::None,
        Mode::Help => {
            app.mode = Mode::Normal;
            Effect::None
        }
        Mode::Search(mut f) => {
            if matches!(key, Key::Up | Key::Down) {
                // the list moves while the search stays open
                let mode = std::mem::replace(&mut app.mode, Mode::Normal);
                let e = update(app, if key == Key::Up { Action::Up } else { Action::Down });
                app.mode = mode;
                return e;
            }
            match f.key(key) {
                Outcome::Cancel => {
                    app.query.clear();
                    app.job.search.clear();
                    app.mode = Mode::Normal;
                    app.say("search cleared", false);
                }
                Outcome::Done => {
                    // kept with the job, saved with its next save
                    app.job.search = app.query.trim().to_string();
                    app.mode = Mode::Normal;
                }
                Outcome::Edited => {
                    app.query = f.text.clone();
                    app.mode = Mode::Search(f);
                }
                Outcome::Ignored => return Effect::None,
            }
            app.selected = 0;
            app.refilter();
            Effect::None
        }
        Mode::Edit(mut f) => {
            match f.key(key) {
                Outcome::Cancel => {
                    app.mode = Mode::Normal;
                    app.say("edit cancelled", false);
                }
                Outcome::Done => {
                    app.mode = Mode::Normal;
                    app.apply_edit(&f.text);
                }
                Outcome::Edited => app.mode = Mode::Edit(f),
                Outcome::Ignored => {}
            }
            Effect::None
        }
        Mode::Prompt(kind, mut f) => match f.key(key) {
            Outcome::Cancel => {
                app.mode = Mode::Normal;
                app.say("cancelled", false);
                Effect::None
            }
            Outcome::Done => {
                let buf = f.text.trim();
                if buf.is_empty() {
                    app.say("give a file name", true);
                    return Effect::None;
                }
                let path = PathBuf::from(buf);
                match kind {
                    PromptKind::Shortlist => {
                        let format = format_for(buf);
                        // stays in the prompt until the shell answers
                        Effect::WriteShortlist {
                            path,
                            format,
                            force: false,
                        }
                    }
                    PromptKind::SaveJob => {
                        app.mode = Mode::Normal;
                        Effect::SaveJob { path }
                    }
                    // stays in the prompt until the shell answers
                    PromptKind::Sheet => Effect::WriteSheet { path, force: false },
                }
            }
            Outcome::Edited => {
                app.mode = Mode::Prompt(kind, f);
                Effect::None
            }
            Outcome::Ignored => Effect::None,
        },
        Mode::Confirm(q) => match key {
            Key::Char('y') | Key::Char('Y') => {
                app.mode = Mode::Normal;
                match q {
                    Question::Quit => Effect::Quit,
                    Question::Overwrite(path, format) => Effect::WriteShortlist { path, format, force: true },
                    Question::OverwriteSheet(path) => Effect::WriteSheet { path, force: true },
                }
            }
            _ => {
                app.mode = Mode::Normal;
                app.say("not done", false);
                Effect::None
            }
        },
    }
}

/// After the shell has carried out an effect: report it.
pub fn report(app: &mut App, result: Result<String, String>) {
    if matches!(app.mode, Mode::Prompt(PromptKind::Shortlist | PromptKind::Sheet, _)) {
        app.mode = Mode::Normal;
    }
    match result {
        Ok(m) => {
            if m.starts_with("saved") {
                app.dirty = false;
            }
            app.say(m, false);
        }
        Err(e) => app.say(e, true),
    }
}

#[cfg(test)]
mod tests;
