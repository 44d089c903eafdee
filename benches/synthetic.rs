//! Print a deterministic synthetic input for the benchmarks and the memory
//! script: `cargo bench --bench synthetic -- catalog 2000 5 > big.toml`
//! (2000 sections × 5 patterns = 10 000 entries) or
//! `cargo bench --bench synthetic -- job 20000 > job.toml`.

#[path = "../tests/support/synthetic.rs"]
mod synthetic;

fn main() {
    let args: Vec<String> = std::env::args().skip(1).filter(|a| a != "--bench").collect();
    let num = |i: usize, d: usize| args.get(i).and_then(|a| a.parse::<usize>().ok()).filter(|&n| n > 0).unwrap_or(d);
    match args.first().map(String::as_str) {
        Some("job") => print!("{}", synthetic::job(num(1, 20_000))),
        _ => print!("{}", synthetic::catalog(num(1, 2000), num(2, 5))),
    }
}
