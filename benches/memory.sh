#!/usr/bin/env bash
# Peak memory of plankwise with a 10 000-entry catalog (target ≤ 30 MB),
# measured with /usr/bin/time -v. Run from the repository root:
#   bash benches/memory.sh
set -euo pipefail
cargo build --release --quiet --example synthetic_catalog
cargo build --release --quiet
tmp=$(mktemp -d)
trap 'rm -rf "$tmp"' EXIT
./target/release/examples/synthetic_catalog 2000 5 > "$tmp/big.toml"
echo "catalog: $(grep -c '^\[\[section.pattern\]\]' "$tmp/big.toml") entries, $(du -h "$tmp/big.toml" | cut -f1)"
if [ ! -x /usr/bin/time ]; then apt-get install -y -qq time >/dev/null; fi
for what in "validate $tmp/big.toml" "rank $tmp/big.toml --span 24ft --sdl 20psf --live 40psf --top 5"; do
  /usr/bin/time -v ./target/release/plankwise $what > /dev/null 2> "$tmp/time.txt" || true
  kb=$(grep 'Maximum resident set size' "$tmp/time.txt" | awk '{print $NF}')
  secs=$(grep 'Elapsed (wall clock)' "$tmp/time.txt" | awk '{print $NF}')
  echo "plankwise ${what%% *}: peak $((kb / 1024)) MB, wall $secs"
done
