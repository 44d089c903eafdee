#!/usr/bin/env bash
# Peak memory of plankwise, measured with /usr/bin/time -v. Run from the
# repository root: bash benches/memory.sh
#   - a 10 000-entry catalog: validate and rank (target ≤ 30 MB);
#   - a 20 000-bay job on the demo catalog: rank and shortlist, which hold
#     one bay's ranking at a time (target ≤ 50 MB).
set -euo pipefail
cargo build --release --quiet
cargo build --release --quiet --bench synthetic
gen=$(ls -t target/release/deps/synthetic-* | grep -v '\.d$' | head -1)
tmp=$(mktemp -d)
trap 'rm -rf "$tmp"' EXIT
"$gen" catalog 2000 5 > "$tmp/big.toml"
"$gen" job 20000 > "$tmp/job.toml"
echo "catalog: $(grep -c '^\[\[section.pattern\]\]' "$tmp/big.toml") entries, $(du -h "$tmp/big.toml" | cut -f1)"
echo "job: $(grep -c '^\[\[bay\]\]' "$tmp/job.toml") bays, $(du -h "$tmp/job.toml" | cut -f1)"
if [ ! -x /usr/bin/time ]; then apt-get install -y -qq time >/dev/null; fi
measure() {
  /usr/bin/time -v ./target/release/plankwise "$@" > /dev/null 2> "$tmp/time.txt" || true
  kb=$(grep 'Maximum resident set size' "$tmp/time.txt" | awk '{print $NF}')
  secs=$(grep 'Elapsed (wall clock)' "$tmp/time.txt" | awk '{print $NF}')
  echo "plankwise $1 ($2): peak $((kb / 1024)) MB, wall $secs"
}
measure validate "$tmp/big.toml"
measure rank "$tmp/big.toml" --span 24ft --sdl 20psf --live 40psf --top 5
measure rank catalog/demo-us.toml --job "$tmp/job.toml" --top 3
measure shortlist catalog/demo-us.toml --job "$tmp/job.toml" -o "$tmp/list.txt" --force
