#!/usr/bin/env bash
# npm test: installs what is missing, starts a throw-away PostgreSQL cluster of its own (never the
# one `npm start` uses), runs the checks, builds the client and the server, runs every suite, and
# prints "N passed, N failed" last.
set -euo pipefail
source "$(dirname "$0")/lib.sh"

# A port of its own per checkout, so two checkouts can test at once.
PG_PORT=${PLUMELINE_TEST_PG_PORT:-$((55000 + $(printf %s "$root" | cksum | cut -d' ' -f1) % 900))}

ensure_node_modules

ensure_chromium
ensure_poppler

# The house rules (types, formatting, import walls, unused code: DEVELOPERS.md, "Checks"), the
# client and server builds and the test PostgreSQL's start run side by side, each into a log of its
# own (one after the other they took about 100 s); the suites run only once every step has passed.
steps=$(mktemp -d)
trap 'rm -rf "$steps"; bash scripts/pg.sh stop test "$PG_PORT"' EXIT
step() { # name command...
  local name=$1
  shift
  ("$@" >"$steps/$name.log" 2>&1 && touch "$steps/$name.ok") &
}
log "checking types, formatting, import walls and unused code; building the client and the server..."
step typecheck npm run -s typecheck
step rules bash -c 'npm run -s check:format && npm run -s check:walls && npm run -s check:unused'
# The fault tests and the two-process test run the production server build (tests/helpers/app-process.ts).
step build bash -c 'npx vite build --logLevel error && node scripts/build.mjs'
log "starting the test PostgreSQL on 127.0.0.1:$PG_PORT..."
step database env PG_EXTRA_OPTS="-c fsync=off -c synchronous_commit=off -c full_page_writes=off -c max_connections=200" \
  bash scripts/pg.sh start test "$PG_PORT"
wait
failed=0
for name in typecheck rules build database; do
  if [ ! -f "$steps/$name.ok" ]; then
    cat "$steps/$name.log" >&2
    log "$name failed (above)"
    failed=1
  fi
done
if [ $failed = 1 ]; then
  log "fix it before the suites run"
  echo "0 passed, 1 failed"
  exit 1
fi

export TEST_ADMIN_DATABASE_URL="postgres://postgres@127.0.0.1:$PG_PORT/postgres"
mkdir -p .data
results=.data/test-results.json
rm -f "$results"
status=0
npx vitest run --reporter=default --reporter=json --outputFile.json="$results" "$@" || status=$?
node scripts/test-summary.mjs "$results" || status=1
exit $status
