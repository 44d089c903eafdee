//! Rendering: reads the [`App`] only (the candidate table's scroll state is
//! the one thing it touches).

use ratatui::Frame;
use ratatui::buffer::Buffer;
use ratatui::layout::{Constraint, Layout, Rect};
use ratatui::style::Style;
use ratatui::symbols::Marker;
use ratatui::text::{Line, Span};
use ratatui::widgets::{
    Axis, Block, Borders, Cell, Chart, Clear, Dataset, GraphType, Paragraph, Row as TRow, StatefulWidget, Table, TableState, Widget,
};

use super::theme::Theme;
use super::{Action, App, FIELDS, Focus, Mode, PromptKind, Question, Units, View};
use crate::bay::Objective;
use crate::units::display;

/// Draw the whole screen into a frame.
pub fn draw(frame: &mut Frame, app: &App, table: &mut TableState) {
    render(app, frame.area(), frame.buffer_mut(), table);
}

fn theme(app: &App) -> Theme {
    if app.mono { Theme::mono() } else { Theme::color() }
}

fn block<'a>(title: String, focused: bool, t: &Theme) -> Block<'a> {
    Block::default()
        .borders(Borders::ALL)
        .border_style(if focused { t.focus } else { t.border })
        .title(Span::styled(title, if focused { t.focus } else { Style::new() }))
}

/// Render the screen into a buffer.
pub fn render(app: &App, area: Rect, buf: &mut Buffer, table: &mut TableState) {
    let t = theme(app);
    let avail = area.height.saturating_sub(3);
    let main_h = (avail * 55 / 100).max(12.min(avail));
    let [title, main, lower, status, footer] = Layout::vertical([
        Constraint::Length(1),
        Constraint::Length(main_h),
        Constraint::Min(3),
        Constraint::Length(1),
        Constraint::Length(1),
    ])
    .areas(area);
    title_bar(app, title, buf, &t);
    let bay_w = if area.width >= 110 { 30 } else { 27 };
    let [bay, cands] = Layout::horizontal([Constraint::Length(bay_w), Constraint::Min(20)]).areas(main);
    bay_pane(app, bay, buf, &t);
    candidates(app, cands, buf, &t, table);
    match app.view {
        View::Detail => detail(app, lower, buf, &t),
        View::Chart => chart(app, lower, buf, &t),
        View::Camber => camber(app, lower, buf, &t),
        View::CamberAge => camber_age(app, lower, buf, &t),
        View::Compare => compare(app, lower, buf, &t),
    }
    status_line(app, status, buf, &t);
    footer_line(app, footer, buf, &t);
    if app.mode == Mode::Help {
        help(app, area, buf, &t);
    }
}

fn title_bar(app: &App, area: Rect, buf: &mut Buffer, t: &Theme) {
    let b = app.current_bay();
    let text = format!(
        " plankwise · {} · bay {}/{}: {} · {}{} ",
        app.job.project,
        app.bay + 1,
        app.job.bays.len(),
        b.name,
        if app.units == Units::Us { "US" } else { "SI" },
        if app.dirty { " · edited" } else { "" }
    );
    Paragraph::new(text).style(t.title).render(area, buf);
}

fn bay_pane(app: &App, area: Rect, buf: &mut Buffer, t: &Theme) {
    let focused = app.focus == Focus::Bay;
    // every criterion, load and opening; a window that keeps the selected one in sight
    let rows = app.pane_rows().len();
    let height = (area.height as usize).saturating_sub(2).max(1);
    let start = app.field.saturating_sub(height - 1).min(rows.saturating_sub(height));
    let label_w = FIELDS.iter().map(|c| c.label.chars().count()).max().unwrap_or(10).min(13) + 1;
    let lines: Vec<Line> = (start..rows)
        .take(height)
        .map(|i| {
            let (label, text) = app.row_text(i);
            let value = match (&app.mode, i == app.field) {
                (Mode::Edit(f), true) => f.shown(),
                _ => text,
            };
            let style = if focused && i == app.field { t.selected } else { Style::new() };
            let label: String = label.chars().take(label_w - 1).collect();
            Line::from(vec![
                Span::styled(format!("{label:<label_w$}"), t.muted),
                Span::styled(crate::input::escape_controls(&value), style),
            ])
        })
        .collect();
    let title = if rows > height {
        format!(" Bay criteria {}/{} ", app.field + 1, rows)
    } else {
        " Bay criteria ".into()
    };
    Paragraph::new(lines).block(block(title, focused, t)).render(area, buf);
}

fn bar(ratio: f64, width: usize, mono: bool) -> String {
    let filled = ((ratio.clamp(0.0, 1.0) * width as f64).round() as usize).min(width);
    let (f, e) = if mono { ('#', '.') } else { ('█', '░') };
    let mut s: String = std::iter::repeat_n(f, filled)
        .chain(std::iter::repeat_n(e, width - filled))
        .collect();
    if ratio > 1.0 {
        s.pop();
        s.push('!');
    }
    s
}

/// The list column of an objective: its heading in the display units.
fn objective_heading(o: Objective, sys: crate::units::System) -> String {
    match o {
        Objective::Lightest => display::unit("psf", sys).to_string(),
        Objective::Shallowest => format!("h {}", display::unit("in", sys)),
        Objective::LeastSteel => display::unit("in²/ft", sys).to_string(),
        Objective::Cheapest => format!("${}", display::unit("/ft²", sys)),
        Objective::MostReserve => "spare".into(),
    }
}

/// An entry's figure for an objective, in the display units.
fn objective_value(o: Objective, m: &crate::select::Metrics, sys: crate::units::System) -> String {
    match o {
        Objective::Lightest => display::num(m.weight_psf, "psf", 1, sys),
        Objective::Shallowest => display::num(m.depth_in, "in", 1, sys),
        Objective::LeastSteel => display::num(m.strand_in2_per_ft, "in²/ft", 3, sys),
        Objective::Cheapest => m.price_per_ft2.map_or("-".into(), |p| display::num(p, "/ft²", 2, sys)),
        // the share of the governing check's capacity left
        Objective::MostReserve => format!("{:.0}%", (100.0 * (1.0 - m.governing_ratio)).max(0.0)),
    }
}

fn candidates(app: &App, area: Rect, buf: &mut Buffer, t: &Theme, state: &mut TableState) {
    let focused = app.focus == Focus::Candidates;
    let viable = app.rows.iter().filter(|r| r.viable).count();
    let mut title = format!(
        " Candidates {viable} viable of {} · {} ",
        app.rows.len(),
        app.current_bay().objective.name()
    );
    if let Mode::Search(f) = &app.mode {
        title.push_str(&format!("· /{} ", f.shown()));
    } else if !app.query.is_empty() {
        title.push_str(&format!("· /{} ", app.query));
    }
    if !app.show_failing {
        title.push_str("· non-viable hidden ");
    }
    if app.pending.is_some() {
        title.push_str("· re-ranking… ");
    }
    let wide = area.width >= 70;
    let sys = app.units;
    // the active objective's figure comes first; a wide list adds weight and
    // depth when the objective is another
    let objective = app.current_bay().objective;
    let extra: Vec<Objective> = [Objective::Lightest, Objective::Shallowest]
        .into_iter()
        .filter(|o| *o != objective)
        .collect();
    // only the rows that fit are built (a ranking can hold 10 000): the
    // window starts where the last frame's did and moves as little as
    // needed to keep the selection in sight; the state keeps its start
    let height = (area.height as usize).saturating_sub(3).max(1);
    let mut start = state.offset().min(app.visible.len().saturating_sub(height));
    if app.selected < start {
        start = app.selected;
    } else if app.selected >= start + height {
        start = app.selected + 1 - height;
    }
    let window = &app.visible[start.min(app.visible.len())..(start + height).min(app.visible.len())];
    let rows: Vec<TRow> = window
        .iter()
        .map(|(i, hits)| {
            let r = &app.rows[*i];
            let marked = app.is_marked(&r.label);
            let label: Vec<Span> = r
                .label
                .chars()
                .enumerate()
                .map(|(k, c)| Span::styled(c.to_string(), if hits.contains(&k) { t.matched } else { Style::new() }))
                .collect();
            // a failing row names its first failure: the ratio is that check's
            let ratio = r.failure.as_ref().map_or(r.governing.1, |f| f.1);
            let style = if r.viable { t.viable } else { t.failing };
            let mut cells = vec![
                Cell::from(if marked { "*" } else { " " }),
                Cell::from(Line::from(label)),
                Cell::from(format!("{:>6}", objective_value(objective, &r.metrics, sys))),
            ];
            if wide {
                for &o in &extra {
                    cells.push(Cell::from(format!("{:>6}", objective_value(o, &r.metrics, sys))));
                }
            }
            cells.push(Cell::from(Span::styled(
                bar(ratio, 8, app.mono),
                if ratio > 1.0 { t.bar_over } else { t.bar_ok },
            )));
            cells.push(Cell::from(format!("{ratio:>5.2}")));
            if wide {
                cells.push(Cell::from(if r.viable {
                    r.governing.0.clone()
                } else {
                    format!("✗ {}", display::localize(r.failure.as_ref().map_or("", |f| f.0.as_str()), sys))
                }));
            } else {
                cells.push(Cell::from(if r.viable { "ok" } else { "✗" }));
            }
            TRow::new(cells).style(style)
        })
        .collect();
    let mut widths = vec![
        Constraint::Length(1),
        Constraint::Min(if wide { 32 } else { 18 }),
        Constraint::Length(6),
    ];
    let mut header = vec![String::new(), "entry".into(), format!("{:>6}", objective_heading(objective, sys))];
    if wide {
        for &o in &extra {
            widths.push(Constraint::Length(6));
            header.push(format!("{:>6}", objective_heading(o, sys)));
        }
    }
    widths.extend([Constraint::Length(8), Constraint::Length(5)]);
    header.extend(["capacity".into(), "ratio".into()]);
    if wide {
        widths.push(Constraint::Fill(1));
        header.push("governs / first failure".into());
    } else {
        widths.push(Constraint::Length(2));
        header.push(String::new());
    }
    let table = Table::new(rows, widths)
        .header(TRow::new(header).style(t.muted))
        .row_highlight_style(t.selected)
        .block(block(title, focused, t));
    let mut local = TableState::default().with_selected(if app.visible.is_empty() { None } else { Some(app.selected - start) });
    StatefulWidget::render(table, area, buf, &mut local);
    *state = TableState::default()
        .with_offset(start)
        .with_selected(if app.visible.is_empty() { None } else { Some(app.selected) });
    if app.visible.is_empty() {
        let inner = Rect {
            x: area.x + 2,
            y: area.y + 2,
            width: area.width.saturating_sub(4),
            height: 1,
        };
        Paragraph::new("no candidate matches").style(t.muted).render(inner, buf);
    }
}

fn detail(app: &App, area: Rect, buf: &mut Buffer, t: &Theme) {
    let focused = app.focus == Focus::Detail;
    let (Some(r), Some(ev)) = (app.selected_row(), app.detail.as_ref()) else {
        Paragraph::new("no candidate selected")
            .block(block(" Detail ".into(), focused, t))
            .render(area, buf);
        return;
    };
    let sys = app.units;
    let h = &ev.history;
    let c = &ev.camber;
    let wide = area.width >= 110;
    let k = |psi: f64| display::num(psi / 1000.0, "ksi", 1, sys);
    let mm = |v: f64| {
        let s = display::num(v, "in", 2, sys);
        if s.starts_with('-') { s } else { format!("+{s}") }
    };
    let u = display::unit("ksi", sys);
    let mut lines = vec![
        Line::from(format!(
            "fse {} {u} · losses {} {u} (ES {} CR {} SH {} RE {}) · class {}",
            k(h.fse_psi),
            k(h.losses.total_psi),
            k(h.losses.es_psi),
            k(h.losses.cr_psi),
            k(h.losses.sh_psi),
            k(h.losses.re_psi),
            ev.service_class.name()
        )),
        Line::from(format!(
            "camber {} / {} / {} {} (release/erection/final) · live {} · fire {} · {:.1} Hz",
            mm(c.camber_release_in),
            mm(c.camber_erection_in),
            mm(c.camber_final_in),
            display::unit("in", sys),
            display::with_unit(c.defl_live_in, "in", 2, sys),
            ev.fire
                .rating_h
                .map_or("not rated".into(), |x| format!("{} h", crate::checks::fire::fmt_h(x))),
            ev.frequency_hz
        ))
        .style(t.muted),
        Line::from(format!(
            "camber with age (ACI 209R-92): erection at {:.0} d {} · final {} (multipliers {} / {})",
            ev.aged.erection_age_days,
            display::with_unit(ev.aged.erection_in, "in", 2, sys),
            display::with_unit(ev.aged.final_in, "in", 2, sys),
            display::with_unit(c.camber_erection_in, "in", 2, sys),
            display::with_unit(c.camber_final_in, "in", 2, sys)
        ))
        .style(t.muted),
    ];
    // which units the bay's openings cut, for this member's width
    if let Some(e) = app.selected_entry() {
        let case = app.case_of(r);
        for o in crate::checks::describe_openings_as(&e.candidate(), &case, true) {
            lines.push(Line::from(crate::input::escape_controls(&display::localize(&o, sys))).style(t.muted));
        }
    }
    // failures first, then the highest ratios: the ones that matter show first
    let mut checks: Vec<&crate::checks::CheckResult> = ev.checks.iter().collect();
    checks.sort_by(|a, b| a.pass.cmp(&b.pass).then(b.ratio.total_cmp(&a.ratio)));
    // the title takes the room the numbers leave and wraps at a word, never cut
    let numbers = 5 + 1 + 9 + 3 + 9 + 1 + 6 + 1 + 5;
    let room = (area.width as usize).saturating_sub(2 + numbers).max(12);
    let title_w = checks.iter().map(|c| c.info.title.chars().count()).max().unwrap_or(10).min(room);
    for ch in checks {
        let (demand, unit) = display::convert(ch.demand, ch.unit, sys);
        let (capacity, _) = display::convert(ch.capacity, ch.unit, sys);
        let mut parts = wrap_words(ch.info.title, title_w).into_iter();
        let first = parts.next().unwrap_or_default();
        let mut spans = vec![
            Span::styled(
                format!("{:<5}", if ch.pass { "ok" } else { "FAIL" }),
                if ch.pass { t.bar_ok } else { t.error },
            ),
            Span::raw(format!(
                "{first:<title_w$} {demand:>9.2} / {capacity:>9.2} {unit:<6} {:>5.2}",
                ch.ratio
            )),
        ];
        if wide {
            spans.push(Span::styled(format!("  {}", ch.info.clause), t.muted));
        }
        lines.push(Line::from(spans));
        for rest in parts {
            lines.push(Line::from(format!("     {rest}")));
        }
    }
    let inner = (area.height as usize).saturating_sub(2);
    let max = lines.len().saturating_sub(inner);
    app.detail_max.set(max);
    app.detail_page.set(inner.saturating_sub(1).max(1));
    let top = app.detail_scroll.min(max);
    let title = if max > 0 {
        format!(
            " Detail {}–{}/{}{}: {} ",
            top + 1,
            (top + inner).min(lines.len()),
            lines.len(),
            if focused { " j/k pgup/pgdn" } else { "" },
            r.designation
        )
    } else {
        format!(" Detail: {} ", r.designation)
    };
    Paragraph::new(lines)
        .scroll((top.min(u16::MAX as usize) as u16, 0))
        .block(block(title, focused, t))
        .render(area, buf);
}

/// `text` in lines of at most `width` characters, broken between words (a
/// word longer than the width has a line of its own).
fn wrap_words(text: &str, width: usize) -> Vec<String> {
    let mut out = Vec::new();
    let mut cur = String::new();
    for word in text.split(' ') {
        if !cur.is_empty() && cur.chars().count() + 1 + word.chars().count() > width {
            out.push(std::mem::take(&mut cur));
        }
        if !cur.is_empty() {
            cur.push(' ');
        }
        cur.push_str(word);
    }
    out.push(cur);
    out
}

/// Markers of the chart's curves, told apart without colour: the selected
/// candidate, the next best two, and the design point.
pub const CHART_MARKS: [char; 3] = ['o', '+', 'x'];
/// The design point's marker.
pub const DESIGN_MARK: char = '#';

/// `n` + 1 evenly spaced tick labels from `lo` to `hi` (ratatui spreads
/// the labels evenly along the axis).
fn ticks(lo: f64, hi: f64, n: usize, places: usize) -> Vec<String> {
    (0..=n)
        .map(|k| format!("{:.places$}", lo + (hi - lo) * k as f64 / n as f64))
        .collect()
}

fn chart(app: &App, area: Rect, buf: &mut Buffer, t: &Theme) {
    use ratatui::widgets::LegendPosition;
    let focused = app.focus == Focus::Detail;
    let bay = app.current_bay();
    let sys = app.units;
    let roof = bay.case.member_use == crate::case::Use::Roof;
    let to_load = |psf: f64| display::convert(psf, "psf", sys).0;
    let to_span = |ft: f64| display::convert(ft, "ft", sys).0;
    let data: Vec<Vec<(f64, f64)>> = app
        .chart
        .iter()
        .map(|(_, lims)| {
            lims.iter()
                .filter_map(|l| l.live_psf.map(|q| (to_span(l.span_ft), to_load(q.min(500.0)))))
                .collect()
        })
        .collect();
    // the design point: the bay's span and the load its use varies
    let design = (to_span(bay.case.span.get() / 12.0), to_load(bay.case.varied().in_unit("psf")));
    let point = vec![design];
    let colors = [t.focus, t.status, t.muted];
    let short = |label: &str| -> String {
        let l: String = label.chars().take(26).collect();
        if label.chars().count() > 26 { format!("{l}…") } else { l }
    };
    let mut sets: Vec<Dataset> = app
        .chart
        .iter()
        .zip(&data)
        .enumerate()
        .map(|(i, ((label, _), d))| {
            let mark = CHART_MARKS[i.min(2)];
            Dataset::default()
                .name(format!("{mark} {}{}", short(label), if i == 0 { " (selected)" } else { "" }))
                .marker(Marker::Custom(mark))
                .graph_type(GraphType::Line)
                .style(colors[i.min(2)])
                .data(d)
        })
        .collect();
    sets.push(
        Dataset::default()
            .name(format!(
                "{DESIGN_MARK} design point {}, {}",
                display::span(bay.case.span.get(), sys),
                display::with_unit(bay.case.varied().in_unit("psf"), "psf", 0, sys)
            ))
            .marker(Marker::Custom(DESIGN_MARK))
            .graph_type(GraphType::Scatter)
            .style(t.error)
            .data(&point),
    );
    let xs: Vec<f64> = data.iter().flatten().map(|p| p.0).chain([design.0]).collect();
    let ys: Vec<f64> = data.iter().flatten().map(|p| p.1).chain([design.1]).collect();
    let (x0, x1) = (
        xs.iter().copied().fold(f64::INFINITY, f64::min),
        xs.iter().copied().fold(f64::NEG_INFINITY, f64::max),
    );
    let x1 = x1.max(x0 + 1e-6);
    let y1 = ys.iter().copied().fold(0.0, f64::max).max(1.0) * 1.1;
    let load = if roof { "roof Lr or S" } else { "live" };
    let xu = format!("span {}", display::unit("ft", sys));
    let yu = format!("{load} {}", display::unit("psf", sys));
    let (xp, yp) = if sys == Units::Us { (1, 0) } else { (2, 1) };
    let title = format!(
        " Capacity: largest {} by span ",
        if roof { "roof load (Lr = S varied)" } else { "live load" }
    );
    let chart = Chart::new(sets)
        .block(block(title, focused, t))
        .legend_position(Some(LegendPosition::TopRight))
        // the legend always shows, however small the pane
        .hidden_legend_constraints((Constraint::Percentage(100), Constraint::Percentage(100)))
        .x_axis(Axis::default().title(xu).bounds([x0, x1]).labels(ticks(x0, x1, 4, xp)))
        .y_axis(Axis::default().title(yu).bounds([0.0, y1]).labels(ticks(0.0, y1, 4, yp)));
    chart.render(area, buf);
}

/// One curve of the camber picture: its value at a point.
type CamberPart = fn(&crate::camber::CamberPoint) -> f64;

/// Markers of the camber picture: release, erection, final.
pub const CAMBER_MARKS: [char; 3] = ['.', 'o', '#'];

fn camber(app: &App, area: Rect, buf: &mut Buffer, t: &Theme) {
    use ratatui::widgets::LegendPosition;
    let focused = app.focus == Focus::Detail;
    let sys = app.units;
    if app.camber.is_empty() {
        Paragraph::new("no candidate selected")
            .block(block(" Camber ".into(), focused, t))
            .render(area, buf);
        return;
    }
    let x = |v: f64| display::convert(v / 12.0, "ft", sys).0;
    let y = |v: f64| display::convert(v, "in", sys).0;
    let parts: [(&str, CamberPart); 3] = [
        ("release", |p| p.release_in),
        ("erection", |p| p.erection_in),
        ("final", |p| p.final_in),
    ];
    let data: Vec<Vec<(f64, f64)>> = parts
        .iter()
        .map(|(_, f)| app.camber.iter().map(|p| (x(p.x_in), y(f(p)))).collect())
        .collect();
    let mid = app.camber.len() / 2;
    let colors = [t.muted, t.status, t.focus];
    let sets: Vec<Dataset> = parts
        .iter()
        .zip(&data)
        .enumerate()
        .map(|(i, ((name, f), d))| {
            Dataset::default()
                .name(format!(
                    "{} {name} {}",
                    CAMBER_MARKS[i],
                    display::with_unit(f(&app.camber[mid]), "in", 2, sys)
                ))
                .marker(Marker::Custom(CAMBER_MARKS[i]))
                .graph_type(GraphType::Line)
                .style(colors[i])
                .data(d)
        })
        .collect();
    let xs = (0.0, x(app.camber.last().map_or(1.0, |p| p.x_in)).max(1e-6));
    let (lo, hi) = data
        .iter()
        .flatten()
        .fold((0.0f64, 0.0f64), |(lo, hi), p| (lo.min(p.1), hi.max(p.1)));
    let pad = 0.15 * (hi - lo).max(1e-3);
    let (y0, y1) = (lo - pad, hi + pad);
    let (xp, yp) = if sys == Units::Us { (1, 2) } else { (2, 1) };
    let chart = Chart::new(sets)
        .block(block(
            " Camber along the span, upward positive (Martin multipliers) ".into(),
            focused,
            t,
        ))
        .legend_position(Some(LegendPosition::TopRight))
        .hidden_legend_constraints((Constraint::Percentage(100), Constraint::Percentage(100)))
        .x_axis(
            Axis::default()
                .title(format!("from support {}", display::unit("ft", sys)))
                .bounds([xs.0, xs.1])
                .labels(ticks(xs.0, xs.1, 4, xp)),
        )
        .y_axis(
            Axis::default()
                .title(format!("camber {}", display::unit("in", sys)))
                .bounds([y0, y1])
                .labels(ticks(y0, y1, 4, yp)),
        );
    chart.render(area, buf);
}

/// The midspan camber against age (log scale), by ACI 209R-92 and the
/// age-adjusted effective modulus, with the multipliers' values marked.
fn camber_age(app: &App, area: Rect, buf: &mut Buffer, t: &Theme) {
    use ratatui::widgets::LegendPosition;
    let focused = app.focus == Focus::Detail;
    let sys = app.units;
    let Some(ev) = app.detail.as_ref().filter(|_| !app.camber_age.is_empty()) else {
        Paragraph::new("no candidate selected")
            .block(block(" Camber with age ".into(), focused, t))
            .render(area, buf);
        return;
    };
    let y = |v: f64| display::convert(v, "in", sys).0;
    let curve: Vec<(f64, f64)> = app.camber_age.iter().map(|&(a, c)| (a.log10(), y(c))).collect();
    let c = &ev.camber;
    let a = &ev.aged;
    let marks = vec![
        (a.release_age_days.log10(), y(c.camber_release_in)),
        (a.erection_age_days.log10(), y(c.camber_erection_in)),
        (crate::aging::FINAL_AGE_DAYS.log10(), y(c.camber_final_in)),
    ];
    let sets = vec![
        Dataset::default()
            .name(format!(
                "o ACI 209R-92: erection {}, final {}",
                display::with_unit(a.erection_in, "in", 2, sys),
                display::with_unit(a.final_in, "in", 2, sys)
            ))
            .marker(Marker::Custom('o'))
            .graph_type(GraphType::Line)
            .style(t.focus)
            .data(&curve),
        Dataset::default()
            .name(format!(
                "# multipliers: erection {}, final {}",
                display::with_unit(c.camber_erection_in, "in", 2, sys),
                display::with_unit(c.camber_final_in, "in", 2, sys)
            ))
            .marker(Marker::Custom('#'))
            .graph_type(GraphType::Scatter)
            .style(t.error)
            .data(&marks),
    ];
    let (lo, hi) = curve
        .iter()
        .chain(&marks)
        .fold((0.0f64, 0.0f64), |(lo, hi), p| (lo.min(p.1), hi.max(p.1)));
    // room above the curve for the legend
    let range = (hi - lo).max(1e-3);
    let (y0, y1) = (lo - 0.15 * range, hi + 0.9 * range);
    let yp = if sys == Units::Us { 2 } else { 1 };
    let chart = Chart::new(sets)
        .block(block(
            format!(" Camber at midspan with age · erected at {:.0} d ", a.erection_age_days),
            focused,
            t,
        ))
        .legend_position(Some(LegendPosition::TopLeft))
        .hidden_legend_constraints((Constraint::Percentage(100), Constraint::Percentage(100)))
        .x_axis(
            Axis::default()
                .title("age, days (log)")
                .bounds([0.0, 4.0])
                .labels(["1", "10", "100", "1000", "10000"]),
        )
        .y_axis(
            Axis::default()
                .title(format!("camber {}", display::unit("in", sys)))
                .bounds([y0, y1])
                .labels(ticks(y0, y1, 4, yp)),
        );
    chart.render(area, buf);
}

/// The marked candidates side by side: every check a row, each cell its
/// ratio and verdict, the check that governs each candidate marked.
fn compare(app: &App, area: Rect, buf: &mut Buffer, t: &Theme) {
    let focused = app.focus == Focus::Detail;
    let sys = app.units;
    if app.compare.len() < 2 {
        Paragraph::new("Mark two to four viable candidates with space, then press v again to see them side by side.")
            .wrap(ratatui::widgets::Wrap { trim: true })
            .block(block(" Compare ".into(), focused, t))
            .render(area, buf);
        return;
    }
    let n = app.compare.len();
    let inner_w = area.width.saturating_sub(2) as usize;
    let col_w = ((inner_w.saturating_sub(22)) / n).clamp(10, 40);
    let name_w = inner_w.saturating_sub(col_w * n + n).max(12);
    let cut = |s: &str, w: usize| -> String {
        if s.chars().count() <= w {
            s.to_string()
        } else {
            let k: String = s.chars().take(w.saturating_sub(1)).collect();
            format!("{k}…")
        }
    };
    let mut header = vec![Cell::from("")];
    header.extend(app.compare.iter().enumerate().map(|(i, (l, _, _))| {
        // section on one line, pattern (and topping) on the next
        let (sec, pat) = l.split_once(" / ").unwrap_or((l.as_str(), ""));
        Cell::from(ratatui::text::Text::from(vec![
            Line::from(cut(&format!("{} {sec}", i + 1), col_w)),
            Line::from(cut(&format!("  {pat}"), col_w)),
        ]))
    }));
    let mut rows: Vec<TRow> = Vec::new();
    let mut heights: Vec<usize> = Vec::new();
    let fig = |name: &str, f: &dyn Fn(&crate::select::Metrics) -> String| {
        let mut cells = vec![Cell::from(name.to_string())];
        cells.extend(app.compare.iter().map(|(_, m, _)| Cell::from(f(m))));
        TRow::new(cells).style(t.muted)
    };
    rows.push(fig(&format!("weight {}", display::unit("psf", sys)), &|m| {
        display::num(m.weight_psf, "psf", 1, sys)
    }));
    rows.push(fig(&format!("depth {}", display::unit("in", sys)), &|m| {
        display::num(m.depth_in, "in", 1, sys)
    }));
    let mut verdict = vec![Cell::from("verdict")];
    verdict.extend(app.compare.iter().map(|(_, _, ev)| {
        Cell::from(Span::styled(
            if ev.viable { "viable" } else { "NOT viable" },
            if ev.viable { t.bar_ok } else { t.error },
        ))
    }));
    rows.push(TRow::new(verdict));
    heights.extend([1, 1, 1]);
    for info in crate::checks::REGISTRY.iter().map(|c| &c.info) {
        if !app.compare.iter().any(|(_, _, ev)| ev.check(info.id).is_some()) {
            continue;
        }
        // the title wraps between words over as many lines as it needs
        let lines = wrap_words(info.title, name_w);
        let height = lines.len().max(1) as u16;
        let mut cells = vec![Cell::from(ratatui::text::Text::from(
            lines.into_iter().map(Line::from).collect::<Vec<_>>(),
        ))];
        for (_, _, ev) in &app.compare {
            let gov = ev.governing().info.id == info.id;
            cells.push(match ev.check(info.id) {
                None => Cell::from("-"),
                Some(c) => Cell::from(Span::styled(
                    format!(
                        "{:.2} {}{}",
                        c.ratio,
                        if c.pass { "ok" } else { "FAIL" },
                        if gov { " ◀ governs" } else { "" }
                    ),
                    if !c.pass {
                        t.error
                    } else if gov {
                        t.focus
                    } else {
                        Style::new()
                    },
                )),
            });
        }
        rows.push(TRow::new(cells).height(height));
        heights.push(height as usize);
    }
    let mut widths = vec![Constraint::Length(name_w as u16)];
    widths.extend(std::iter::repeat_n(Constraint::Length(col_w as u16), n));
    // scrolls as the Detail pane does
    let inner = (area.height as usize).saturating_sub(4);
    let total = rows.len();
    // the first row from which the rest fits: the last the scroll can reach
    let mut max = total;
    let mut used = 0;
    while max > 0 && used + heights[max - 1] <= inner {
        used += heights[max - 1];
        max -= 1;
    }
    app.detail_max.set(max);
    app.detail_page.set(inner.saturating_sub(1).max(1));
    let top = app.detail_scroll.min(max);
    let rows: Vec<TRow> = rows.into_iter().skip(top).collect();
    // the last row shown whole
    let (mut last, mut room) = (top, inner);
    while last < total && heights[last] <= room {
        room -= heights[last];
        last += 1;
    }
    let table = Table::new(rows, widths)
        .header(TRow::new(header).height(2).style(t.muted))
        .block(block(
            format!(" Compare {n} marked · rows {}–{last}/{total} · v to leave ", top + 1),
            focused,
            t,
        ));
    Widget::render(table, area, buf);
}

fn status_line(app: &App, area: Rect, buf: &mut Buffer, t: &Theme) {
    let (text, style) = match &app.mode {
        Mode::Prompt(PromptKind::Shortlist, p) => (
            format!(
                "shortlist file (.txt, .md, .csv or .pdf): {}  type to replace, ctrl-u clears, enter to write, esc to cancel",
                p.shown()
            ),
            t.status,
        ),
        Mode::Prompt(PromptKind::SaveJob, p) => (
            format!("save the job as: {}  type to replace, enter to save, esc to cancel", p.shown()),
            t.status,
        ),
        Mode::Edit(_) => {
            let (label, allowed) = app.row_allowed(app.field);
            (
                format!("edit {label}: {allowed}; type to replace, ← → home end to edit, enter to apply, esc to cancel"),
                t.status,
            )
        }
        Mode::Confirm(Question::Quit) => ("the job has unsaved edits — quit anyway? y / n".into(), t.error),
        Mode::Confirm(Question::Overwrite(p, _)) | Mode::Confirm(Question::OverwriteSheet(p)) => {
            (format!("'{}' exists — replace it? y / n", p.display()), t.error)
        }
        Mode::Prompt(PromptKind::Sheet, p) => (
            format!(
                "calculation sheet file (.txt, .md or .pdf): {}  type to replace, ctrl-u clears, enter to write, esc to cancel",
                p.shown()
            ),
            t.status,
        ),
        _ => (app.status.0.clone(), if app.status.1 { t.error } else { t.status }),
    };
    Paragraph::new(crate::input::escape_controls(&text)).style(style).render(area, buf);
}

fn footer_line(app: &App, area: Rect, buf: &mut Buffer, t: &Theme) {
    let items = [
        (Action::Help, "help"),
        (Action::SpanUp, "span+"),
        (Action::SpanDown, "span−"),
        (Action::LiveUp, "live+"),
        (Action::LiveDown, "live−"),
        (Action::Search, "search"),
        (Action::Mark, "mark"),
        (Action::WriteShortlist, "shortlist"),
        (Action::NextBay, "bay"),
        (Action::ToggleView, "chart"),
        (Action::Compare, "compare"),
        (Action::Quit, "quit"),
    ];
    let text: Vec<String> = items
        .iter()
        .filter_map(|(a, n)| app.keymap.key_of(*a).map(|k| format!("{k} {n}")))
        .collect();
    Paragraph::new(text.join(" · ")).style(t.muted).render(area, buf);
}

fn help(app: &App, area: Rect, buf: &mut Buffer, t: &Theme) {
    let n = app.keymap.bindings.len() as u16;
    // one column when it fits, two side by side on short terminals
    let cols: u16 = if n + 2 <= area.height { 1 } else { 2 };
    let w = area.width.min(if cols == 1 { 64 } else { 80 });
    let rows = n.div_ceil(cols);
    let h = area.height.min(rows + 2);
    let r = Rect {
        x: area.x + (area.width - w) / 2,
        y: area.y + (area.height - h) / 2,
        width: w,
        height: h,
    };
    Clear.render(r, buf);
    let cell = |b: &super::keymap::Binding, width: usize| -> Vec<Span<'static>> {
        let keys: Vec<String> = b.keys.iter().map(|k| k.to_string()).collect();
        let k = format!("{:<14}", keys.join(" "));
        let text: String = b.help.chars().take(width.saturating_sub(15)).collect();
        vec![
            Span::styled(k, t.focus),
            Span::raw(format!("{text:<w$}", w = width.saturating_sub(14))),
        ]
    };
    let colw = ((w - 2) / cols) as usize;
    let lines: Vec<Line> = (0..rows as usize)
        .map(|i| {
            let mut spans = Vec::new();
            for c in 0..cols as usize {
                if let Some(b) = app.keymap.bindings.get(c * rows as usize + i) {
                    spans.extend(cell(b, colw));
                }
            }
            Line::from(spans)
        })
        .collect();
    Paragraph::new(lines)
        .block(block(" Keys (any key closes) ".into(), true, t))
        .render(r, buf);
}
