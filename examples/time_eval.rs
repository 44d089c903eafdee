use plankwise::catalog::{Catalog, DEMO_US};
use plankwise::checks::{Candidate, evaluate, evaluate_brief};
use plankwise::job::{DEMO_JOB, Job};
use plankwise::select::{case_for, topping_mix};
fn main() {
    let cat = Catalog::from_str(DEMO_US, "demo-us.toml").unwrap();
    let job = Job::from_str(DEMO_JOB, "demo-job.toml").unwrap();
    let s = cat.section("plank-8in-4ft").unwrap();
    let cand = Candidate {
        section: s,
        pattern: &s.patterns[1],
        mix: s.mix(&cat),
    };
    let case = case_for(&job.bays[0], None, &topping_mix(&cat, &job.bays[0]));
    for _ in 0..3 {
        for brief in [true] {
            let n = 20000;
            let t = std::time::Instant::now();
            for _ in 0..n {
                if brief {
                    std::hint::black_box(evaluate_brief(&cand, &case));
                } else {
                    std::hint::black_box(evaluate(&cand, &case));
                }
            }
            println!("brief={brief} {:.2} µs", t.elapsed().as_secs_f64() / n as f64 * 1e6);
        }
    }
    let ev = evaluate(&cand, &case);

    println!("stations {}", ev.stations.len());
}
