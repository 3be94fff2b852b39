#!/usr/bin/env bash
# Runs every benchmark (plain tsx scripts under bench/) and prints a summary table.
# Results land in bench/results/*.json (git-ignored), beside the seeded database they ran on.
#   npm run bench                   build if needed, seed the large database, run everything
#   BENCH_SKIP_BUILD=1 npm run bench   use the existing .next build as it is
#   BENCH_DURATION_S=5 npm run bench   shorter load cells (default 10 s each)
# The load benchmarks start `next start` on loopback ports 3500–3599 and stop it themselves.
set -uo pipefail
cd "$(dirname "$0")/.."
bash scripts/ensure-deps.sh
mkdir -p bench/results
export NEXT_TELEMETRY_DISABLED=1

needs_build() {
  [[ "${BENCH_SKIP_BUILD:-}" == "1" ]] && return 1
  [[ -f .next/BUILD_ID ]] || return 0
  [[ -n "$(find app lib components db proxy.ts next.config.mjs package-lock.json -newer .next/BUILD_ID -type f -print -quit 2>/dev/null)" ]]
}
if needs_build; then
  echo "== next build (sources changed since the last build)"
  npx next build || { echo "next build failed"; exit 1; }
fi

failed=()
step() {
  local name="$1"
  shift
  echo
  echo "== $name"
  if ! "$@"; then
    failed+=("$name")
  fi
}

step "bench/seed-large.ts (10,000 jobs, 50,000 inspections)" npx tsx bench/seed-large.ts
step "bench/load.bench.ts" npx tsx bench/load.bench.ts
step "bench/signin-attack.bench.ts" npx tsx bench/signin-attack.bench.ts
# The data modules are `server-only`; the react-server condition lets them load outside Next.
step "bench/db-queries.bench.ts" env NODE_OPTIONS="${NODE_OPTIONS:-} --conditions=react-server" npx tsx bench/db-queries.bench.ts
step "bench/bundle-size.ts" npx tsx bench/bundle-size.ts
# Then every other benchmark (PDF rendering, the engine, …).
for script in bench/*.bench.ts; do
  case "$script" in
    bench/load.bench.ts | bench/signin-attack.bench.ts | bench/db-queries.bench.ts) ;;
    *) [[ -e "$script" ]] && step "$script" npx tsx "$script" ;;
  esac
done

echo
npx tsx bench/summary.ts
if ((${#failed[@]})); then
  echo "benchmarks that did not finish: ${failed[*]}"
  exit 1
fi
