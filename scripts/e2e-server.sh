#!/usr/bin/env bash
# Starts the production build on a fresh, seeded database for the end-to-end tests.
set -euo pipefail
cd "$(dirname "$0")/.."
export NODE_ENV=production NEXT_TELEMETRY_DISABLED=1
export FLUEWARD_DB_FILE="$PWD/test-results/e2e-db/flueward.sqlite"
rm -rf "$PWD/test-results/e2e-db"
mkdir -p "$PWD/test-results/e2e-db"
npx tsx scripts/prepare-db.ts
exec npx next start -p "${E2E_PORT:-3100}"
