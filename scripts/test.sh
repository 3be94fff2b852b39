#!/usr/bin/env bash
# The one test command (npm test): unit tests, a production build, end-to-end tests (including
# the authorization matrix and the fuzz test), the concurrency and crash tests, and a closing
# line "N passed, N failed" counted from every part.
set -uo pipefail
cd "$(dirname "$0")/.."
export NEXT_TELEMETRY_DISABLED=1

bash scripts/ensure-deps.sh --test || exit 1
rm -rf test-results && mkdir -p test-results

echo "== unit tests (vitest)"
npx vitest run --reporter=default --reporter=json --outputFile=test-results/unit-report.json
unit_status=$?

echo "== production build"
build_status=0
rm -rf .next
npx next build > test-results/build.log 2>&1 || { build_status=$?; tail -40 test-results/build.log; }

e2e_status=0
ops_status=0
: > test-results/ops-results.txt
if [[ $build_status -eq 0 ]]; then
  echo "== end-to-end tests (playwright)"
  npx playwright test
  e2e_status=$?

  echo "== concurrency test (two servers, one database file)"
  if npx tsx scripts/concurrency-test.ts; then echo "concurrency pass" >> test-results/ops-results.txt; else echo "concurrency fail" >> test-results/ops-results.txt; ops_status=1; fi

  # The same run as npm run test:crash: at least 50 kills unless CRASH_KILLS says otherwise.
  echo "== crash test (SIGKILL during writes)"
  if npx tsx scripts/crash-test.ts; then echo "crash pass" >> test-results/ops-results.txt; else echo "crash fail" >> test-results/ops-results.txt; ops_status=1; fi
fi

node scripts/test-summary.mjs test-results/unit-report.json test-results/e2e-report.json "$build_status" test-results/ops-results.txt
summary_status=$?

if [[ $unit_status -ne 0 || $build_status -ne 0 || $e2e_status -ne 0 || $ops_status -ne 0 || $summary_status -ne 0 ]]; then exit 1; fi
exit 0
