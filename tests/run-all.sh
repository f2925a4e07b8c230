#!/usr/bin/env bash
# Every test Hairline has: types, then jest's projects (engine and parsers,
# server, web components, browser suite against the served export).
set -euo pipefail
cd "$(dirname "$0")/.."

chromium_bin="${HAIRLINE_CHROMIUM:-/usr/bin/chromium}"
if [ ! -x "$chromium_bin" ]; then
  if [ "$(id -u)" = 0 ]; then
    echo "Installing Debian's chromium for the browser tests (about a minute)…"
    apt-get update -qq
    DEBIAN_FRONTEND=noninteractive apt-get install -y -qq chromium >/dev/null
  else
    echo "The browser tests need Debian's chromium: run 'sudo apt-get install chromium', or set HAIRLINE_CHROMIUM to a Chromium binary." >&2
    exit 1
  fi
fi

# The BullMQ tests start their own redis-server on a loopback port; without one they fail and say so.
if [ -z "${HAIRLINE_REDIS_SERVER:-}" ] && ! command -v redis-server >/dev/null 2>&1 && [ ! -x /usr/bin/redis-server ]; then
  if [ "$(id -u)" = 0 ]; then
    echo "Installing Debian's redis-server for the BullMQ tests…"
    apt-get update -qq
    DEBIAN_FRONTEND=noninteractive apt-get install -y -qq redis-server >/dev/null
  else
    echo "The BullMQ tests need Debian's redis-server: run 'sudo apt-get install redis-server', or set HAIRLINE_REDIS_SERVER to a redis-server binary. They will fail without it." >&2
  fi
fi

echo "== type check"
npx tsc --noEmit

echo "== web export (skipped when up to date)"
npx tsx server/cli/build-web.ts

echo "== jest"
mkdir -p tests/artifacts
status=0
npx jest --ci --json --outputFile=tests/artifacts/jest-results.json "$@" || status=$?
node -e '
  const r = require("./tests/artifacts/jest-results.json");
  console.log(`tests: ${r.numPassedTests} passed, ${r.numFailedTests} failed`);
' || true
exit $status
