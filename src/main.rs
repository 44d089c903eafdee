//! The plankwise binary: parse arguments, run, map errors to exit codes
//! (0 success, 1 no viable member for some bay, 2 bad input or failure).

#![forbid(unsafe_code)]

mod cli;

fn main() {
    std::process::exit(cli::run());
}
