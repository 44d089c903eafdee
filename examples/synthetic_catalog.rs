//! Print the deterministic synthetic catalog used by the benchmarks:
//! `cargo run --release --example synthetic_catalog -- 2000 5 > big.toml`
//! gives 2000 sections × 5 patterns = 10 000 entries.

#[path = "../tests/support/synthetic.rs"]
mod synthetic;

fn main() {
    let mut args = std::env::args().skip(1).map(|a| a.parse::<usize>().unwrap_or(0));
    let sections = args.next().filter(|&n| n > 0).unwrap_or(2000);
    let patterns = args.next().filter(|&n| n > 0).unwrap_or(5);
    print!("{}", synthetic::catalog(sections, patterns));
}
