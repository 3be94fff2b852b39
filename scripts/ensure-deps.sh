#!/usr/bin/env bash
# Installs what the app and its tests need on a fresh machine: npm packages (from the lock file)
# and, for the browser tests, Debian's Chromium and poppler-utils. Safe to run again.
set -euo pipefail
cd "$(dirname "$0")/.."

if [[ ! -d node_modules ]] || [[ package-lock.json -nt node_modules/.package-lock.json ]]; then
  echo "[setup] installing npm packages (better-sqlite3 compiles from source: about 2 minutes)"
  npm ci --include=dev --no-audit --no-fund
fi

if [[ "${1:-}" == "--test" ]]; then
  missing=()
  command -v chromium >/dev/null 2>&1 || [[ -x /usr/bin/chromium ]] || missing+=(chromium)
  command -v pdftoppm >/dev/null 2>&1 || missing+=(poppler-utils)
  if (( ${#missing[@]} )); then
    if command -v apt-get >/dev/null 2>&1 && [[ $(id -u) -eq 0 ]]; then
      echo "[setup] installing ${missing[*]} from Debian's packages"
      apt-get update -qq && DEBIAN_FRONTEND=noninteractive apt-get install -y -qq "${missing[@]}" >/dev/null
    else
      echo "[setup] ${missing[*]} missing and apt-get unavailable: the browser tests fall back to Playwright's own browser" >&2
    fi
  fi
fi
