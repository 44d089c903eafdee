use plankwise::catalog::Catalog;
use plankwise::job::{DEMO_JOB, Job};
use plankwise::select::Entry;
#[path = "../tests/support/synthetic.rs"]
mod synthetic;
fn main() {
    let cat = Catalog::from_str(&synthetic::catalog(20, 5), "synthetic.toml").unwrap();
    let job = Job::from_str(DEMO_JOB, "demo-job.toml").unwrap();
    let bay = &job.bays[0];
    let spans: Vec<f64> = (0..100).map(|k| 12.0 + 0.3 * k as f64).collect();
    let t = std::time::Instant::now();
    let mut n = 0;
    let mut gov = std::collections::BTreeMap::new();
    for s in &cat.sections {
        for p in &s.patterns {
            let e = Entry {
                section: s,
                pattern: p,
                mix: s.mix(&cat),
                topping: None,
            };
            for l in plankwise::select::envelope::bay_envelope(&cat, bay, &e, &spans) {
                *gov.entry(l.governing.clone()).or_insert(0) += 1;
                n += 1;
            }
        }
    }
    println!("{n} limits in {:.2} s; {:?}", t.elapsed().as_secs_f64(), gov);
}
