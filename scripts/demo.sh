#!/usr/bin/env bash
# One command from a fresh clone: installs packages, builds, creates and seeds the SQLite
# database under data/ (only when it is empty), and serves the app at http://localhost:3000.
set -euo pipefail
cd "$(dirname "$0")/.."
export NEXT_TELEMETRY_DISABLED=1 NODE_ENV=production
# The demo is served over plain HTTP (also to a phone on the same network), so its session
# cookie cannot be Secure. Behind HTTPS, leave COOKIE_SECURE unset: cookies are then Secure
# and named with the __Host- prefix.
export COOKIE_SECURE="${COOKIE_SECURE:-false}"
PORT="${PORT:-3000}"

bash scripts/ensure-deps.sh
echo "[demo] building the production app"
npx next build > /tmp/flueward-build.log 2>&1 || { tail -40 /tmp/flueward-build.log; exit 1; }
npx tsx scripts/prepare-db.ts
echo "[demo] Flueward is starting at http://localhost:${PORT} — demo accounts are listed in README.md"
exec npx next start -p "$PORT"
