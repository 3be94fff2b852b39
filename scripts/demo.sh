#!/usr/bin/env bash
# One command from a fresh clone: installs packages, builds, creates and seeds the SQLite
# database under data/ (only when it is empty), and serves the app at http://localhost:3000.
set -euo pipefail
cd "$(dirname "$0")/.."
export NEXT_TELEMETRY_DISABLED=1
# The demo is served over plain HTTP (also to a phone on the same network), so its session
# cookie cannot be Secure. Behind HTTPS, leave COOKIE_SECURE unset: cookies are then Secure
# and named with the __Host- prefix.
export COOKIE_SECURE="${COOKIE_SECURE:-false}"
PORT="${PORT:-3000}"

# Install first without NODE_ENV=production: npm would then leave out the build tools.
bash scripts/ensure-deps.sh
export NODE_ENV=production
echo "[demo] building the production app"
npx next build > /tmp/flueward-build.log 2>&1 || { tail -40 /tmp/flueward-build.log; exit 1; }
npx tsx scripts/prepare-db.ts

# Without a real mail server (SMTP_HOST), e-mail goes to the local fake SMTP server and shows up
# at /dev/outbox; nothing leaves this machine. The fake stops when the demo does.
if [[ -z "${SMTP_HOST:-}" ]]; then
  export FAKE_SMTP_PORT="${FAKE_SMTP_PORT:-2525}"
  export FLUEWARD_OUTBOX_DIR="${FLUEWARD_OUTBOX_DIR:-$PWD/data/outbox}"
  export SMTP_HOST=127.0.0.1 SMTP_PORT="$FAKE_SMTP_PORT" FLUEWARD_DEV_OUTBOX=1
  unset SMTP_SECURE SMTP_USER SMTP_PASSWORD
  ./node_modules/.bin/tsx scripts/fake-smtp.ts &
  smtp_pid=$!
  trap 'kill "$smtp_pid" 2>/dev/null || true' EXIT
  trap 'exit 130' INT
  trap 'exit 143' TERM
  for _ in $(seq 50); do
    kill -0 "$smtp_pid" 2>/dev/null || { echo "[demo] the fake mail server did not start (is port ${FAKE_SMTP_PORT} taken? set FAKE_SMTP_PORT)" >&2; exit 1; }
    (echo > "/dev/tcp/127.0.0.1/${FAKE_SMTP_PORT}") 2>/dev/null && break
    sleep 0.2
  done
  echo "[demo] e-mails go to the local outbox: http://localhost:${PORT}/dev/outbox"
fi

echo "[demo] Flueward is starting at http://localhost:${PORT} — demo accounts are listed in README.md"
# Not exec: the shell stays to stop the fake mail server on exit.
npx next start -p "$PORT"
