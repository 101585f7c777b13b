#!/usr/bin/env bash
# npm test: installs what is missing, starts a throw-away PostgreSQL cluster of its own (never the
# one `npm start` uses), builds the client, runs every suite, and prints "N passed, N failed" last.
set -euo pipefail
source "$(dirname "$0")/lib.sh"

# A port of its own per checkout, so two checkouts can test at once.
PG_PORT=${PLUMELINE_TEST_PG_PORT:-$((55000 + $(printf %s "$root" | cksum | cut -d' ' -f1) % 900))}

ensure_node_modules

# The house rules first: types, formatting, import walls, unused code (DEVELOPERS.md, "Checks").
log "checking types, formatting, import walls and unused code..."
if ! npm run -s check; then
  log "a check failed (above); fix it before the suites run"
  echo "0 passed, 1 failed"
  exit 1
fi

ensure_chromium
ensure_poppler
log "starting the test PostgreSQL on 127.0.0.1:$PG_PORT..."
PG_EXTRA_OPTS="-c fsync=off -c synchronous_commit=off -c full_page_writes=off -c max_connections=200" \
  bash scripts/pg.sh start test "$PG_PORT"
trap 'bash scripts/pg.sh stop test "$PG_PORT"' EXIT

log "building the client and the server..."
npx vite build --logLevel error
# The fault tests and the two-process test run the production build (tests/helpers/app-process.ts).
node scripts/build.mjs

export TEST_ADMIN_DATABASE_URL="postgres://postgres@127.0.0.1:$PG_PORT/postgres"
mkdir -p .data
results=.data/test-results.json
rm -f "$results"
status=0
npx vitest run --reporter=default --reporter=json --outputFile.json="$results" "$@" || status=$?
node scripts/test-summary.mjs "$results" || status=1
exit $status
