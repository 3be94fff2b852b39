#!/usr/bin/env bash
# Sends docs/examples/check-request.json to POST /api/check as the demo installer and prints the
# findings. Needs the demo running (npm run demo) and curl. BASE_URL defaults to localhost:3000.
set -euo pipefail
cd "$(dirname "$0")/.."
BASE_URL="${BASE_URL:-http://localhost:3000}"
jar=$(mktemp)
trap 'rm -f "$jar"' EXIT
curl -sf -c "$jar" -H 'Content-Type: application/json' \
  -d '{"email":"installer@flueward.test","password":"ember-trowel-lantern"}' \
  "$BASE_URL/api/auth/sign-in" > /dev/null
curl -s -b "$jar" -H 'Content-Type: application/json' \
  --data-binary @docs/examples/check-request.json "$BASE_URL/api/check"
echo
