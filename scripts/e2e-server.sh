#!/usr/bin/env bash
# Starts the production build on a fresh, seeded database for the end-to-end tests.
set -euo pipefail
cd "$(dirname "$0")/.."
export NODE_ENV=production NEXT_TELEMETRY_DISABLED=1
export FLUEWARD_DB_FILE="$PWD/test-results/e2e-db/flueward.sqlite"
# Photos and record PDFs the tests upload stay beside the test database, out of the demo's data/.
export FLUEWARD_UPLOADS_DIR="$PWD/test-results/e2e-db/uploads"
rm -rf "$PWD/test-results/e2e-db"
mkdir -p "$PWD/test-results/e2e-db"
npx tsx scripts/prepare-db.ts
# The tests stand in for one trusted proxy: a test playing a distant client sends its own
# X-Forwarded-For (lockout tests); every other request is the loopback address Next fills in.
export TRUSTED_PROXY_COUNT=1

# E-mail goes to a fake SMTP server whose outbox the tests read (test-results/e2e-outbox, also
# served at /dev/outbox); a file named .fail-next there makes it refuse the next message.
export FLUEWARD_OUTBOX_DIR="$PWD/test-results/e2e-outbox"
export FAKE_SMTP_PORT="${FAKE_SMTP_PORT:-2626}"
export SMTP_HOST=127.0.0.1 SMTP_PORT="$FAKE_SMTP_PORT" FLUEWARD_DEV_OUTBOX=1
unset SMTP_SECURE SMTP_USER SMTP_PASSWORD MAIL_FROM
rm -rf "$FLUEWARD_OUTBOX_DIR"
mkdir -p "$FLUEWARD_OUTBOX_DIR"
./node_modules/.bin/tsx scripts/fake-smtp.ts &
smtp_pid=$!
trap 'kill "$smtp_pid" 2>/dev/null || true' EXIT
trap 'exit 143' TERM INT
for _ in $(seq 50); do
  kill -0 "$smtp_pid" 2>/dev/null || { echo "[e2e] the fake mail server did not start on port ${FAKE_SMTP_PORT}" >&2; exit 1; }
  (echo > "/dev/tcp/127.0.0.1/${FAKE_SMTP_PORT}") 2>/dev/null && break
  sleep 0.2
done

# Not exec: the shell stays to stop the fake mail server (Playwright also kills the whole group).
npx next start -p "${E2E_PORT:-3100}"
