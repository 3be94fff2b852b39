#!/usr/bin/env bash
# Runs every benchmark under bench/ (plain tsx scripts). Results land in bench/results/*.json.
set -euo pipefail
cd "$(dirname "$0")/.."
bash scripts/ensure-deps.sh
mkdir -p bench/results
for script in bench/*.bench.ts; do
  [[ -e "$script" ]] || continue
  echo "== $script"
  npx tsx "$script"
done
