//! Benchmarks with their targets (medians on the project's 2-core machine):
//! evaluate one candidate ≤ 5 µs; rank 10 000 candidates ≤ 16 ms; envelope
//! of 1 000 candidates × 100 spans ≤ 200 ms; load and validate a 10 000-entry
//! catalog ≤ 100 ms; key press to drawn frame ≤ 16 ms (demo) and ≤ 50 ms
//! (10 000 entries; the ranking itself follows from the shell's thread, and
//! `key_to_ranked_frame_10000` times it at once). Run: `cargo bench`.
//! Results are recorded in DEVELOPERS.md.

use plankwise::case::DesignCase;
use plankwise::catalog::{Catalog, DEMO_US};
use plankwise::checks::{Candidate, Evaluation, evaluate, evaluate_brief};
use plankwise::job::{DEMO_JOB, Job};
use plankwise::select::{Entry, case_for, rank_bay, topping_mix};
use plankwise::tui::{Action, App, update};

#[path = "../tests/support/synthetic.rs"]
mod synthetic;

fn main() {
    divan::main();
}

fn demo() -> (Catalog, Job) {
    (
        Catalog::from_str(DEMO_US, "demo-us.toml").unwrap(),
        Job::from_str(DEMO_JOB, "demo-job.toml").unwrap(),
    )
}

/// One demo candidate and bay, evaluated by `eval`.
fn bench_evaluation(b: divan::Bencher, eval: fn(&Candidate, &DesignCase) -> Evaluation) {
    let (cat, job) = demo();
    let s = cat.section("plank-8in-4ft").unwrap();
    let cand = Candidate {
        section: s,
        pattern: &s.patterns[1],
        mix: s.mix(&cat),
    };
    let case = case_for(&job.bays[0], None, &topping_mix(&cat, &job.bays[0]));
    b.bench(|| eval(divan::black_box(&cand), divan::black_box(&case)));
}

#[divan::bench]
fn evaluate_one_candidate(b: divan::Bencher) {
    bench_evaluation(b, evaluate);
}

#[divan::bench]
fn evaluate_one_candidate_brief(b: divan::Bencher) {
    bench_evaluation(b, evaluate_brief);
}

#[divan::bench]
fn rank_demo_bay(b: divan::Bencher) {
    let (cat, job) = demo();
    b.bench(|| rank_bay(&cat, divan::black_box(&job.bays[1]), None));
}

/// The bay of the placed-loads target: 30 ft, every family of the demo
/// catalog; `placed` adds ten point loads along the span (dead, live and
/// roof live, placed where they do most harm across) and a 24 in opening
/// inside one unit, 10 to 13 ft along.
fn placed_bay(placed: bool) -> plankwise::bay::Bay {
    use plankwise::case::{LoadKind, Opening, Placed, PlacedLoad, PointLoad};
    use plankwise::units::{AreaLoad, Force, Length};
    let mut bay = plankwise::bay::Bay::new("placed", Length::from_unit(30.0, "ft"));
    bay.case.sdl = AreaLoad::from_unit(20.0, "psf");
    bay.case.live = AreaLoad::from_unit(50.0, "psf");
    if placed {
        let kinds = [LoadKind::Dead, LoadKind::Live, LoadKind::RoofLive];
        for i in 0..10 {
            bay.case.placed.push(PlacedLoad {
                load: Placed::Point(PointLoad {
                    p: Force::from_unit(0.4 + 0.1 * i as f64, "kip"),
                    at: Length::from_unit(1.5 + 2.9 * i as f64, "ft"),
                    across: None,
                    size: (Length::new(6.0), Length::new(6.0)),
                }),
                kind: kinds[i % 3],
            });
        }
        bay.case.openings.push(Opening {
            from: Length::from_unit(10.0, "ft"),
            to: Length::from_unit(13.0, "ft"),
            across: (Length::new(12.0), Length::new(36.0)),
            header: None,
        });
    }
    bay
}

/// Target: the bay with ten point loads and an opening ranks the demo
/// catalog in under 3 × the time of the same bay without them (compare
/// the two in one run).
#[divan::bench(args = [false, true])]
fn rank_demo_with_ten_points_and_an_opening(b: divan::Bencher, placed: bool) {
    let (cat, _) = demo();
    let bay = placed_bay(placed);
    b.bench(|| rank_bay(&cat, divan::black_box(&bay), None));
}

#[divan::bench(sample_count = 10)]
fn rank_10000_candidates(b: divan::Bencher) {
    let cat = Catalog::from_str(&synthetic::catalog(2000, 5), "synthetic.toml").unwrap();
    assert_eq!(cat.entry_count(), 10_000);
    let (_, job) = demo();
    b.bench(|| rank_bay(&cat, divan::black_box(&job.bays[0]), None));
}

#[divan::bench(sample_count = 3)]
fn envelope_1000_candidates_by_100_spans(b: divan::Bencher) {
    let cat = Catalog::from_str(&synthetic::catalog(200, 5), "synthetic.toml").unwrap();
    let (_, job) = demo();
    let bay = &job.bays[0];
    let spans: Vec<f64> = (0..100).map(|k| 12.0 + 0.3 * k as f64).collect();
    b.bench(|| {
        let mut n = 0;
        for s in &cat.sections {
            for p in &s.patterns {
                let e = Entry {
                    section: s,
                    pattern: p,
                    mix: s.mix(&cat),
                    topping: None,
                };
                n += plankwise::select::envelope::bay_envelope(&cat, bay, &e, &spans).len();
            }
        }
        n
    });
}

#[divan::bench(sample_count = 10)]
fn load_10000_entry_catalog(b: divan::Bencher) {
    let text = synthetic::catalog(2000, 5);
    b.bench(|| Catalog::from_str(divan::black_box(&text), "synthetic.toml").unwrap());
}

fn key_to_frame(
    app: &mut App,
    term: &mut ratatui::Terminal<ratatui::backend::TestBackend>,
    state: &mut ratatui::widgets::TableState,
    up: &mut bool,
) {
    update(app, if *up { Action::SpanUp } else { Action::SpanDown });
    *up = !*up;
    term.draw(|f| plankwise::tui::ui::draw(f, app, state)).unwrap();
}

#[divan::bench]
fn key_to_frame_demo(b: divan::Bencher) {
    let (cat, job) = demo();
    let mut app = App::new(cat, job, None);
    let mut term = ratatui::Terminal::new(ratatui::backend::TestBackend::new(120, 40)).unwrap();
    let mut state = ratatui::widgets::TableState::default();
    let mut up = true;
    b.bench_local(|| key_to_frame(&mut app, &mut term, &mut state, &mut up));
}

/// As the terminal runs it: a bay this large is ranked on the shell's
/// thread, so the frame after the key shows the list marked as re-ranking.
#[divan::bench(sample_count = 20)]
fn key_to_frame_10000(b: divan::Bencher) {
    let cat = Catalog::from_str(&synthetic::catalog(2000, 5), "synthetic.toml").unwrap();
    let (_, job) = demo();
    let mut app = App::new(cat, job, None);
    app.background = Some(plankwise::tui::BACKGROUND_ABOVE);
    let mut term = ratatui::Terminal::new(ratatui::backend::TestBackend::new(120, 40)).unwrap();
    let mut state = ratatui::widgets::TableState::default();
    let mut up = true;
    b.bench_local(|| key_to_frame(&mut app, &mut term, &mut state, &mut up));
}

/// Key press to the frame with the new ranking of 10 000 entries (ranked at once).
#[divan::bench(sample_count = 5)]
fn key_to_ranked_frame_10000(b: divan::Bencher) {
    let cat = Catalog::from_str(&synthetic::catalog(2000, 5), "synthetic.toml").unwrap();
    let (_, job) = demo();
    let mut app = App::new(cat, job, None);
    let mut term = ratatui::Terminal::new(ratatui::backend::TestBackend::new(120, 40)).unwrap();
    let mut state = ratatui::widgets::TableState::default();
    let mut up = true;
    b.bench_local(|| key_to_frame(&mut app, &mut term, &mut state, &mut up));
}

/// The compare view showing: a span key re-ranks and re-evaluates the four
/// marked candidates side by side before the frame (target as the demo: ≤ 16 ms).
#[divan::bench]
fn key_to_frame_demo_compare_view(b: divan::Bencher) {
    let (cat, job) = demo();
    let mut app = App::new(cat, job, None);
    for _ in 0..4 {
        update(&mut app, Action::Mark);
        update(&mut app, Action::Down);
    }
    update(&mut app, Action::Compare);
    assert_eq!(app.compare.len(), 4);
    let mut term = ratatui::Terminal::new(ratatui::backend::TestBackend::new(120, 40)).unwrap();
    let mut state = ratatui::widgets::TableState::default();
    let mut up = true;
    b.bench_local(|| key_to_frame(&mut app, &mut term, &mut state, &mut up));
}

/// Target: the capacity table of the demo catalog (every entry, five load
/// levels, spans 10–60 ft at 0.5 ft) in under 1 s.
#[divan::bench(sample_count = 5)]
fn capacity_table_demo_10_to_60_ft(b: divan::Bencher) {
    let (cat, _) = demo();
    let mut bay = plankwise::bay::Bay::new("capacity", plankwise::units::Length::from_unit(10.0, "ft"));
    bay.case.sdl = plankwise::units::AreaLoad::from_unit(20.0, "psf");
    let req = plankwise::select::capacity::Request {
        spans_ft: (0..=100).map(|k| 10.0 + 0.5 * k as f64).collect(),
        loads_psf: vec![40.0, 60.0, 80.0, 100.0, 150.0],
        depth_in: None,
    };
    b.bench(|| plankwise::select::capacity::table(&cat, divan::black_box(&bay), &req).len());
}
