//! Update tests (state + action → state) and screen tests on ratatui's TestBackend.

use super::keymap::Key;
use super::*;
use crate::catalog::DEMO_US;
use crate::job::DEMO_JOB;
use ratatui::Terminal;
use ratatui::backend::TestBackend;
use ratatui::widgets::TableState;

fn app() -> App {
    App::new(
        Catalog::from_str(DEMO_US, "demo-us.toml").unwrap(),
        Job::from_str(DEMO_JOB, "demo-job.toml").unwrap(),
        None,
    )
}

fn screen(app: &App, w: u16, h: u16) -> String {
    let mut term = Terminal::new(TestBackend::new(w, h)).unwrap();
    let mut state = TableState::default();
    term.draw(|f| ui::draw(f, app, &mut state)).unwrap();
    let buf = term.backend().buffer().clone();
    let mut s = String::new();
    for y in 0..h {
        for x in 0..w {
            s.push_str(buf[(x, y)].symbol());
        }
        s.push('\n');
    }
    s
}

fn press(app: &mut App, keys: &[Key]) -> Vec<Effect> {
    let mut out = Vec::new();
    for &k in keys {
        let a = app.action_for(k);
        out.push(update(app, a));
    }
    out
}

#[test]
fn span_keys_rerank_at_once() {
    let mut a = app();
    let before = a.current_bay().case.span.get();
    let first = a.rows[0].label.clone();
    update(&mut a, Action::SpanUp);
    assert_eq!(a.current_bay().case.span.get(), before + 12.0);
    assert!(a.dirty);
    for _ in 0..6 {
        update(&mut a, Action::SpanUp);
    }
    assert_ne!(a.rows[0].label, first, "a longer span changes the winner");
    update(&mut a, Action::SpanDownFine);
    assert!((a.current_bay().case.span.get() - (before + 7.0 * 12.0 - 1.0)).abs() < 1e-9);
    update(&mut a, Action::SpanDown);
    update(&mut a, Action::SpanUpFine);
    assert!((a.current_bay().case.span.get() - (before + 6.0 * 12.0)).abs() < 1e-9);
}

#[test]
fn live_keys_and_si_steps() {
    let mut a = app();
    let q = a.current_bay().case.live.in_unit("psf");
    update(&mut a, Action::LiveUp);
    update(&mut a, Action::LiveUpFine);
    update(&mut a, Action::LiveDownFine);
    assert!((a.current_bay().case.live.in_unit("psf") - (q + 10.0)).abs() < 1e-9);
    update(&mut a, Action::LiveDown);
    update(&mut a, Action::ToggleUnits);
    assert_eq!(a.units, Units::Si);
    update(&mut a, Action::SpanUp);
    let s0 = a.current_bay().case.span.in_unit("m");
    update(&mut a, Action::SpanUp);
    assert!(
        (a.current_bay().case.span.in_unit("m") - s0 - 0.25).abs() < 1e-9,
        "0.25 m steps in SI"
    );
    assert!(a.field_text(0).ends_with(" m"));
}

#[test]
fn moving_and_panes() {
    let mut a = app();
    update(&mut a, Action::Down);
    assert_eq!(a.selected, 1);
    update(&mut a, Action::Up);
    update(&mut a, Action::Up);
    assert_eq!(a.selected, 0);
    update(&mut a, Action::NextPane);
    assert_eq!(a.focus, Focus::Detail);
    update(&mut a, Action::NextPane);
    assert_eq!(a.focus, Focus::Bay);
    update(&mut a, Action::PrevPane);
    assert_eq!(a.focus, Focus::Detail);
    a.focus = Focus::Bay;
    update(&mut a, Action::Down);
    assert_eq!(a.field, 1);
    update(&mut a, Action::Right); // not an enumerated field: moves pane
    assert_eq!(a.focus, Focus::Candidates);
    update(&mut a, Action::Left);
    assert_eq!(a.focus, Focus::Bay);
}

/// The criteria pane's row of a criterion.
fn field(key: &str) -> usize {
    FIELDS.iter().position(|c| c.key == key).unwrap()
}

#[test]
fn editing_fields_with_units_and_errors() {
    let mut a = app();
    a.focus = Focus::Bay;
    a.field = 0;
    update(&mut a, Action::Edit);
    assert!(matches!(a.mode, Mode::Edit(_)));
    for _ in 0..12 {
        press(&mut a, &[Key::Backspace]);
    }
    press(&mut a, &"31 ft 6 in".chars().map(Key::Char).collect::<Vec<_>>());
    press(&mut a, &[Key::Enter]);
    assert_eq!(a.current_bay().case.span.get(), 378.0);
    // a wrong unit is an error in the status line, the value stays
    update(&mut a, Action::Edit);
    for _ in 0..20 {
        press(&mut a, &[Key::Backspace]);
    }
    press(&mut a, &"40 psf".chars().map(Key::Char).collect::<Vec<_>>());
    press(&mut a, &[Key::Enter]);
    assert!(
        a.status.1 && a.status.0.contains("is an area load, but a length is needed"),
        "{:?}",
        a.status
    );
    assert_eq!(a.current_bay().case.span.get(), 378.0);
    // 9.6 m in SI
    update(&mut a, Action::Edit);
    for _ in 0..20 {
        press(&mut a, &[Key::Backspace]);
    }
    press(&mut a, &"9.6 m".chars().map(Key::Char).collect::<Vec<_>>());
    press(&mut a, &[Key::Esc]);
    assert_eq!(a.current_bay().case.span.get(), 378.0, "esc cancels");
    // enumerated fields cycle
    a.field = field("fire");
    let f0 = a.current_bay().case.fire_rating;
    update(&mut a, Action::Edit);
    assert_ne!(a.current_bay().case.fire_rating, f0);
    a.field = field("restrained");
    update(&mut a, Action::Right);
    a.field = field("class");
    update(&mut a, Action::Right);
    assert_eq!(a.current_bay().case.class_allowed, crate::case::ServiceClass::T);
    a.field = field("toppings");
    update(&mut a, Action::Edit);
    for _ in 0..10 {
        press(&mut a, &[Key::Backspace]);
    }
    press(&mut a, &"none, 2 in".chars().map(Key::Char).collect::<Vec<_>>());
    press(&mut a, &[Key::Enter]);
    assert_eq!(a.current_bay().toppings.len(), 2);
}

#[test]
fn search_narrows_and_highlights() {
    let mut a = app();
    let all = a.visible.len();
    update(&mut a, Action::Search);
    press(&mut a, &"8in".chars().map(Key::Char).collect::<Vec<_>>());
    assert!(a.visible.len() < all);
    assert!(a.rows[a.visible[0].0].label.contains("8in"), "the best match first");
    let eights = a
        .rows
        .iter()
        .filter(|r| r.label.contains("8in") && (a.show_failing || r.viable))
        .count();
    assert!(a.visible.iter().filter(|(i, _)| a.rows[*i].label.contains("8in")).count() == eights);
    assert!(
        a.visible.iter().any(|v| !v.1.is_empty()),
        "matched characters recorded for highlighting"
    );
    press(&mut a, &[Key::Enter]);
    assert_eq!(a.mode, Mode::Normal);
    assert_eq!(a.query, "8in");
    update(&mut a, Action::Search);
    press(&mut a, &[Key::Esc]);
    assert!(a.query.is_empty());
    assert_eq!(a.visible.len(), all);
}

#[test]
fn toggles_objective_bays_and_help() {
    let mut a = app();
    let o = a.current_bay().objective;
    update(&mut a, Action::CycleObjective);
    assert_eq!(a.current_bay().objective, o.next());
    let n = a.visible.len();
    update(&mut a, Action::ToggleFailing);
    assert!(a.visible.len() < n);
    assert!(a.visible.iter().all(|(i, _)| a.rows[*i].viable));
    update(&mut a, Action::ToggleFailing);
    update(&mut a, Action::NextBay);
    assert_eq!(a.bay, 1);
    update(&mut a, Action::PrevBay);
    update(&mut a, Action::PrevBay);
    assert_eq!(a.bay, a.job.bays.len() - 1);
    update(&mut a, Action::Help);
    assert_eq!(a.mode, Mode::Help);
    press(&mut a, &[Key::Char('z')]);
    assert_eq!(a.mode, Mode::Normal);
    update(&mut a, Action::ToggleView);
    assert_eq!(a.view, View::Chart);
    assert!(!a.chart.is_empty());
    update(&mut a, Action::ToggleView);
    assert_eq!(a.view, View::Camber);
    update(&mut a, Action::ToggleView);
    assert_eq!(a.view, View::CamberAge);
    update(&mut a, Action::ToggleView);
    assert_eq!(a.view, View::Detail);
}

#[test]
fn marking_and_writing_the_shortlist_asks_before_overwriting() {
    let mut a = app();
    update(&mut a, Action::Mark);
    assert_eq!(a.marked_labels(0).len(), 1);
    update(&mut a, Action::Mark);
    assert!(a.marked_labels(0).is_empty());
    update(&mut a, Action::Mark);
    update(&mut a, Action::WriteShortlist);
    assert!(matches!(a.mode, Mode::Prompt(PromptKind::Shortlist, _)));
    for _ in 0..20 {
        press(&mut a, &[Key::Backspace]);
    }
    press(&mut a, &"out.md".chars().map(Key::Char).collect::<Vec<_>>());
    let e = press(&mut a, &[Key::Enter]);
    assert_eq!(
        e,
        vec![Effect::WriteShortlist {
            path: "out.md".into(),
            format: Format::Markdown,
            force: false
        }]
    );
    // the shell finds the file exists
    update(&mut a, Action::AskOverwrite);
    assert!(matches!(a.mode, Mode::Confirm(Question::Overwrite(_, Format::Markdown))));
    let e = press(&mut a, &[Key::Char('y')]);
    assert_eq!(
        e,
        vec![Effect::WriteShortlist {
            path: "out.md".into(),
            format: Format::Markdown,
            force: true
        }]
    );
    report(&mut a, Ok("wrote out.md".into()));
    assert_eq!(a.status.0, "wrote out.md");
    // a .pdf path asks for the PDF, whatever its case
    update(&mut a, Action::WriteShortlist);
    for _ in 0..20 {
        press(&mut a, &[Key::Backspace]);
    }
    press(&mut a, &"Out.PDF".chars().map(Key::Char).collect::<Vec<_>>());
    let e = press(&mut a, &[Key::Enter]);
    assert_eq!(
        e,
        vec![Effect::WriteShortlist {
            path: "Out.PDF".into(),
            format: Format::Pdf,
            force: false
        }]
    );
    // every extension is read as the command line reads -o: case aside
    for (name, format) in [
        ("Out.MD", Format::Markdown),
        ("out.markdown", Format::Markdown),
        ("OUT.CSV", Format::Csv),
        ("out.TXT", Format::Text),
        ("out", Format::Text),
    ] {
        update(&mut a, Action::WriteShortlist);
        for _ in 0..20 {
            press(&mut a, &[Key::Backspace]);
        }
        press(&mut a, &typed(name));
        let e = press(&mut a, &[Key::Enter]);
        assert_eq!(
            e,
            vec![Effect::WriteShortlist {
                path: name.into(),
                format,
                force: false
            }],
            "{name}"
        );
    }
}

#[test]
fn quitting_with_edits_asks_and_saving_clears() {
    let mut a = app();
    assert_eq!(update(&mut a, Action::Quit), Effect::Quit);
    update(&mut a, Action::SpanUp);
    assert_eq!(update(&mut a, Action::Quit), Effect::None);
    assert_eq!(a.mode, Mode::Confirm(Question::Quit));
    press(&mut a, &[Key::Char('n')]);
    assert_eq!(a.mode, Mode::Normal);
    assert_eq!(update(&mut a, Action::Save), Effect::None, "no job path: asks for one");
    let e = press(&mut a, &[Key::Enter]);
    assert_eq!(e, vec![Effect::SaveJob { path: "job.toml".into() }]);
    report(&mut a, Ok("saved job.toml (backup job.toml.bak)".into()));
    assert!(!a.dirty);
    a.job_path = Some("j.toml".into());
    assert_eq!(update(&mut a, Action::Save), Effect::SaveJob { path: "j.toml".into() });
    update(&mut a, Action::SpanUp);
    update(&mut a, Action::Quit);
    assert_eq!(press(&mut a, &[Key::Char('y')]), vec![Effect::Quit]);
}

#[test]
fn non_viable_rows_cannot_be_marked() {
    let mut a = app();
    a.bay = a.job.bays.len() - 1; // the bay no member satisfies
    a.rerank();
    update(&mut a, Action::Mark);
    assert!(a.status.1 && a.marked_labels(0).is_empty());
}

#[test]
fn screen_80x24_shows_every_pane() {
    let a = app();
    let s = screen(&a, 80, 24);
    for frag in [
        "plankwise",
        "Bay criteria",
        "Candidates",
        "Detail",
        "Span",
        "Snow",
        "? help",
        "q quit",
    ] {
        assert!(s.contains(frag), "missing '{frag}' in\n{s}");
    }
    insta::assert_snapshot!("screen_80x24", s);
}

#[test]
fn screen_120x40_uses_the_room() {
    let mut a = app();
    update(&mut a, Action::NextBay);
    let s = screen(&a, 120, 40);
    assert!(s.contains("governs / first"), "{s}");
    assert!(s.contains("ACI 318-19"), "clauses shown when wide");
    insta::assert_snapshot!("screen_120x40", s);
}

#[test]
fn monochrome_chart_and_help_render() {
    let mut a = app();
    a.mono = true;
    update(&mut a, Action::ToggleView);
    let s = screen(&a, 80, 24);
    assert!(s.contains("Capacity") && s.contains("live psf"));
    update(&mut a, Action::Help);
    let s = screen(&a, 80, 24);
    assert!(s.contains("Keys (any key closes)") && s.contains("span + 1 ft"));
    // tiny terminals do not panic
    let _ = screen(&a, 20, 5);
}

#[test]
fn the_list_window_follows_the_selection() {
    // only the rows that fit are drawn: moving past the bottom scrolls by
    // one row, and moving back up keeps the window until the top is passed
    let mut a = app();
    let mut term = Terminal::new(TestBackend::new(120, 24)).unwrap();
    let mut state = TableState::default();
    let n = a.visible.len();
    assert!(n > 12, "the demo bay lists {n} rows");
    let label = |a: &App| a.selected_row().unwrap().label.clone();
    let shown = |term: &Terminal<TestBackend>, text: &str| {
        let buf = term.backend().buffer();
        (0..buf.area.height).any(|y| {
            let line: String = (0..buf.area.width).map(|x| buf[(x, y)].symbol()).collect();
            line.contains(text)
        })
    };
    for _ in 0..n - 1 {
        update(&mut a, Action::Down);
        term.draw(|f| ui::draw(f, &a, &mut state)).unwrap();
        assert!(shown(&term, &label(&a)), "selected '{}' is drawn", label(&a));
    }
    assert_eq!(a.selected, n - 1);
    let bottom_start = state.offset();
    assert!(bottom_start > 0);
    update(&mut a, Action::Up);
    term.draw(|f| ui::draw(f, &a, &mut state)).unwrap();
    assert_eq!(state.offset(), bottom_start, "moving up inside the window does not scroll");
    for _ in 0..n {
        update(&mut a, Action::Up);
    }
    term.draw(|f| ui::draw(f, &a, &mut state)).unwrap();
    assert_eq!((a.selected, state.offset()), (0, 0));
    assert!(shown(&term, &label(&a)));
}

#[test]
fn large_bays_rank_in_the_background_and_only_the_latest_answer_counts() {
    let mut a = app();
    a.background = Some(0); // every bay counts as large here
    let before = a.rows.clone();
    update(&mut a, Action::SpanUp);
    let first = a.request.take().expect("a ranking is asked for");
    assert_eq!(a.pending, Some(first.generation));
    assert_eq!(a.rows, before, "the list stays until the answer comes");
    assert!(screen(&a, 120, 40).contains("re-ranking"));
    update(&mut a, Action::SpanUp);
    let second = a.request.take().expect("a second ranking");
    assert!(second.generation > first.generation);
    // the shell's thread computes the rows; an out-of-date answer is dropped
    a.ranked(first.generation, rows_for(&a.catalog, &first.bay));
    assert_eq!(a.rows, before);
    assert_eq!(a.pending, Some(second.generation));
    a.ranked(second.generation, rows_for(&a.catalog, &second.bay));
    assert_eq!(a.pending, None);
    assert!(!screen(&a, 120, 40).contains("re-ranking"));
    // the same rows as ranking at once
    let mut sync = app();
    update(&mut sync, Action::SpanUp);
    update(&mut sync, Action::SpanUp);
    assert_eq!(a.rows, sync.rows);
    assert_ne!(a.rows, before, "two feet more span changes the ranking");
}

fn typed(s: &str) -> Vec<Key> {
    s.chars().map(Key::Char).collect()
}

#[test]
fn esc_leaves_a_search_an_edit_and_a_prompt_and_never_quits() {
    let mut a = app();
    let n = a.visible.len();
    update(&mut a, Action::Search);
    let e = press(&mut a, &typed("16in"));
    assert!(e.iter().all(|e| *e == Effect::None));
    assert!(a.visible.len() < n, "the search narrows the list");
    // esc clears the search; a second and third esc do nothing at all
    for _ in 0..3 {
        let e = press(&mut a, &[Key::Esc]);
        assert_eq!(e, vec![Effect::None]);
        assert_eq!(a.mode, Mode::Normal);
    }
    assert_eq!(a.visible.len(), n, "cleared");
    a.focus = Focus::Bay;
    update(&mut a, Action::Edit);
    assert_eq!(press(&mut a, &[Key::Esc, Key::Esc]), vec![Effect::None, Effect::None]);
    update(&mut a, Action::WriteShortlist);
    assert_eq!(press(&mut a, &[Key::Esc, Key::Esc]), vec![Effect::None, Effect::None]);
    assert_eq!(a.mode, Mode::Normal);
}

#[test]
fn a_typed_value_replaces_the_prefilled_one_and_ctrl_u_clears() {
    let mut a = app();
    a.focus = Focus::Bay;
    a.field = field("span");
    update(&mut a, Action::Edit);
    press(&mut a, &typed("25 ft"));
    press(&mut a, &[Key::Enter]);
    assert_eq!(a.current_bay().case.span.get(), 300.0);
    // home, then typing, edits the value instead
    update(&mut a, Action::Edit);
    // the span shows as 25'-0": keep the feet, change the inches
    press(&mut a, &[Key::End, Key::Backspace, Key::Backspace]);
    press(&mut a, &typed("6\""));
    press(&mut a, &[Key::Enter]);
    assert_eq!(a.current_bay().case.span.get(), 306.0, "{:?}", a.status);
    update(&mut a, Action::WriteShortlist);
    press(&mut a, &[Key::Ctrl('u')]);
    let Mode::Prompt(_, f) = &a.mode else { panic!("prompt") };
    assert_eq!(f.text, "");
}

#[test]
fn an_unbound_key_says_so() {
    let mut a = app();
    press(&mut a, &[Key::Char('Z')]);
    assert!(a.status.1, "{:?}", a.status);
    assert!(
        a.status.0.contains("the key Z does nothing here; ? lists the keys"),
        "{:?}",
        a.status
    );
}

#[test]
fn on_a_roof_the_live_keys_step_the_roof_load() {
    let mut a = app();
    let roof = a
        .job
        .bays
        .iter()
        .position(|b| b.case.member_use == crate::case::Use::Roof)
        .expect("a roof bay in the demo");
    a.bay = roof;
    a.rerank();
    let (lr, s, l) = {
        let c = &a.current_bay().case;
        (c.roof_live.get(), c.snow.get(), c.live.get())
    };
    update(&mut a, Action::LiveUp);
    let c = &a.current_bay().case;
    assert_eq!(c.live.get(), l, "the floor live load stays");
    let step = AreaLoad::from_unit(10.0, "psf").get();
    if s > lr {
        assert!((c.snow.get() - s - step).abs() < 1e-12 && c.roof_live.get() == lr);
        assert!(a.status.0.starts_with("snow load S"), "{:?}", a.status);
    } else {
        assert!((c.roof_live.get() - lr - step).abs() < 1e-12 && c.snow.get() == s);
        assert!(a.status.0.starts_with("roof live load Lr"), "{:?}", a.status);
    }
}

#[test]
fn the_detail_pane_scrolls_when_focused() {
    let mut a = app();
    let s = screen(&a, 80, 24);
    assert!(s.contains("Detail 1–7/"), "{s}");
    // the candidates list moves with j/k; the Detail pane with focus scrolls
    a.focus = Focus::Detail;
    let sel = a.selected;
    press(&mut a, &[Key::Char('j'), Key::Char('j')]);
    assert_eq!((a.selected, a.detail_scroll), (sel, 2));
    let s = screen(&a, 80, 24);
    assert!(s.contains("Detail 3–9/"), "{s}");
    // page down goes to the last page and no further; page up comes back
    for _ in 0..10 {
        press(&mut a, &[Key::PageDown]);
    }
    let last = a.detail_max.get();
    assert!(last > 0 && a.detail_scroll == last, "{} {last}", a.detail_scroll);
    let s = screen(&a, 80, 24);
    let every = a.detail.as_ref().unwrap().checks.len();
    assert!(s.contains(&format!("–{}/{}", last + 7, last + 7)), "{s}");
    assert!(every > 7, "more checks than lines: scrolling reaches them");
    press(&mut a, &[Key::PageUp, Key::PageUp, Key::PageUp, Key::PageUp]);
    assert_eq!(a.detail_scroll, 0);
    // page keys change bays when the Detail pane is not focused
    a.focus = Focus::Candidates;
    press(&mut a, &[Key::PageDown]);
    assert_eq!(a.bay, 1);
}

#[test]
fn titles_wrap_between_words_and_are_never_cut() {
    let a = app();
    let s = screen(&a, 80, 24);
    assert!(!s.contains("Member length within production li "), "{s}");
    let mut a = app();
    a.focus = Focus::Detail;
    a.bay = 1;
    a.rerank();
    // every title appears whole (perhaps over two lines) somewhere in the pane
    let titles: Vec<&str> = a.detail.as_ref().unwrap().checks.iter().map(|c| c.info.title).collect();
    let mut seen = String::new();
    for _ in 0..6 {
        seen.push_str(&screen(&a, 80, 24));
        press(&mut a, &[Key::PageDown]);
    }
    let flat: String = seen.split_whitespace().collect::<Vec<_>>().join(" ");
    for t in titles {
        let first = t.split(' ').next().unwrap();
        assert!(flat.contains(first), "{t}\n{seen}");
    }
}

/// The screen at the three sizes in both systems.
#[test]
fn screens_in_both_systems_at_three_sizes() {
    for units in [Units::Us, Units::Si] {
        for (w, h) in [(80, 24), (100, 30), (200, 50)] {
            let mut a = app();
            a.units = units;
            let s = screen(&a, w, h);
            if units == Units::Si {
                for us in [" psf", " ksi", "kip-ft", " in "] {
                    let body: String = s
                        .lines()
                        .filter(|l| !l.contains("Hollow-core plank"))
                        .collect::<Vec<_>>()
                        .join("\n");
                    assert!(!body.contains(us), "'{us}' in an SI screen {w}x{h}:\n{s}");
                }
            }
            insta::assert_snapshot!(format!("screen_{}_{w}x{h}", units.name()), s);
        }
    }
}

#[test]
fn the_compare_view_sets_marked_candidates_side_by_side() {
    let mut a = app();
    update(&mut a, Action::Compare);
    assert_eq!(a.view, View::Compare);
    assert!(a.status.1 && a.status.0.contains("mark two to four"), "{:?}", a.status);
    assert!(screen(&a, 100, 30).contains("Mark two to four viable candidates"));
    // mark three viable candidates
    for _ in 0..3 {
        update(&mut a, Action::Mark);
        update(&mut a, Action::Down);
    }
    assert_eq!(a.compare.len(), 3, "marking refreshes the view");
    let s = screen(&a, 120, 40);
    assert!(s.contains("Compare 3 marked"), "{s}");
    for (label, _, ev) in &a.compare {
        let short: String = label.chars().take(12).collect();
        assert!(s.contains(&short), "{short} in\n{s}");
        // the governing check of each is marked in its column
        assert!(ev.viable);
    }
    assert!(s.contains("◀ governs"), "{s}");
    assert!(s.contains("Flexural strength"), "{s}");
    // the ratio shown is the check's own
    let (_, _, ev) = &a.compare[0];
    let flex = ev.check("flexure").unwrap();
    assert!(s.contains(&format!("{:.2} ok", flex.ratio)), "{s}");
    update(&mut a, Action::Compare);
    assert_eq!(a.view, View::Detail);
}

#[test]
fn the_camber_picture_and_the_chart_legend() {
    let mut a = app();
    update(&mut a, Action::ToggleView);
    assert_eq!(a.view, View::Chart);
    let s = screen(&a, 100, 30);
    // a legend with the markers, the design point labelled, ticks in the units
    for frag in [
        "o plank-6in-4ft / 5x1/2 (selected)",
        "+ ",
        "# design point 24'-0\", 40 psf",
        "span ft",
        "live psf",
    ] {
        assert!(s.contains(frag), "'{frag}' in\n{s}");
    }
    update(&mut a, Action::ToggleView);
    assert_eq!(a.view, View::Camber);
    assert_eq!(a.camber.len(), App::CAMBER_POINTS + 1);
    let ev = a.detail.as_ref().unwrap();
    let mid = a.camber[App::CAMBER_POINTS / 2];
    assert!((mid.final_in - ev.camber.camber_final_in).abs() < 1e-9);
    let s = screen(&a, 100, 30);
    assert!(s.contains("Camber along the span"), "{s}");
    assert!(s.contains(&format!("# final {:.2} in", ev.camber.camber_final_in)), "{s}");
    // camber with age: the curve passes through the values the report prints
    update(&mut a, Action::ToggleView);
    assert_eq!(a.view, View::CamberAge);
    let ev = a.detail.as_ref().unwrap();
    let te = ev.aged.erection_age_days;
    let at = |age: f64| a.camber_age.iter().find(|p| (p.0 - age).abs() < 1e-9).map(|p| p.1);
    assert!((at(te).unwrap() - ev.aged.erection_in).abs() < 1e-12);
    assert!((at(10_000.0).unwrap() - ev.aged.final_in).abs() < 1e-12);
    let s = screen(&a, 100, 30);
    assert!(s.contains("Camber at midspan with age · erected at 30 d"), "{s}");
    assert!(s.contains("ACI 209R-92: erection") && s.contains("# multipliers: erection"), "{s}");
    update(&mut a, Action::ToggleView);
    assert_eq!(a.view, View::Detail);
    // a roof bay's chart varies the roof load
    let roof = a.job.bays.iter().position(|b| b.case.member_use == crate::case::Use::Roof).unwrap();
    a.bay = roof;
    a.rerank();
    update(&mut a, Action::ToggleView);
    let s = screen(&a, 100, 30);
    assert!(s.contains("roof Lr or S psf"), "{s}");
}

#[test]
fn the_session_is_saved_with_the_job_and_restored() {
    let mut a = app();
    // marks, objective, search, filter and units
    update(&mut a, Action::Mark);
    update(&mut a, Action::CycleObjective);
    update(&mut a, Action::Search);
    press(&mut a, &typed("8in"));
    press(&mut a, &[Key::Enter]);
    update(&mut a, Action::ToggleFailing);
    update(&mut a, Action::ToggleUnits);
    let text = a.job.save_text(a.units);
    let job = Job::from_str(&text, "saved.toml").unwrap();
    let b = App::new(Catalog::from_str(DEMO_US, "demo-us.toml").unwrap(), job, None);
    assert_eq!(b.units, Units::Si);
    assert_eq!(b.query, "8in");
    assert!(!b.show_failing);
    assert_eq!(b.current_bay().marked, a.current_bay().marked);
    assert_eq!(b.current_bay().objective, a.current_bay().objective);
    assert_eq!(b.visible.len(), a.visible.len());
    // the saved file keeps the rest of the user's text as it was
    assert!(
        text.contains("search = \"8in\"") && text.contains("hide_failing = true") && text.contains("units = \"si\""),
        "{text}"
    );
    assert!(text.contains("# plankwise demo job."), "comments kept");
}

#[test]
fn prompts_and_examples_follow_the_display_units() {
    let mut a = app();
    a.units = Units::Si;
    a.focus = Focus::Bay;
    a.field = field("span");
    update(&mut a, Action::Edit);
    let s = screen(&a, 200, 40);
    assert!(s.contains("a length from 0.61 to 61 m"), "{s}");
    press(&mut a, &[Key::Esc]);
    // a new point load starts from an SI example that reads back as typed
    let add = a
        .pane_rows()
        .iter()
        .position(|r| matches!(r, PaneRow::Add(k) if k.key == "point"))
        .unwrap();
    a.field = add;
    update(&mut a, Action::Edit);
    let Mode::Edit(f) = &a.mode else { panic!("edit") };
    assert!(f.text.contains("p=18 kN") && f.text.contains("600 mm"), "{}", f.text);
    press(&mut a, &[Key::Enter]);
    assert_eq!(a.current_bay().case.placed.len(), 1, "{:?}", a.status);
}

#[test]
fn the_calculation_sheet_is_written_from_the_ui() {
    let mut a = app();
    press(&mut a, &[Key::Char('e')]);
    assert!(matches!(&a.mode, Mode::Prompt(PromptKind::Sheet, f) if f.text == "sheet.txt"));
    press(&mut a, &typed("calc.md"));
    let e = press(&mut a, &[Key::Enter]);
    assert_eq!(
        e,
        vec![Effect::WriteSheet {
            path: PathBuf::from("calc.md"),
            force: false
        }]
    );
    // an existing file is asked about first
    update(&mut a, Action::AskOverwrite);
    assert!(matches!(&a.mode, Mode::Confirm(Question::OverwriteSheet(p)) if p == &PathBuf::from("calc.md")));
    let e = press(&mut a, &[Key::Char('y')]);
    assert_eq!(
        e,
        vec![Effect::WriteSheet {
            path: PathBuf::from("calc.md"),
            force: true
        }]
    );
}
