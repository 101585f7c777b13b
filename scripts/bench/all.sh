#!/usr/bin/env bash
# npm run bench: every benchmark in turn, on a PostgreSQL cluster of its own (never npm start's
# or npm test's), with the client built for the ones that drive Chromium. Prints figures only.
set -euo pipefail
source "$(dirname "$0")/../lib.sh"

PG_PORT=${PLUMELINE_BENCH_PG_PORT:-$((56000 + $(printf %s "$root" | cksum | cut -d' ' -f1) % 900))}
ensure_node_modules
ensure_chromium
PG_EXTRA_OPTS="-c fsync=off -c synchronous_commit=off" bash scripts/pg.sh start bench "$PG_PORT"
trap 'bash scripts/pg.sh stop bench "$PG_PORT"' EXIT
export BENCH_DATABASE_URL="postgres://postgres@127.0.0.1:$PG_PORT/postgres"
export TEST_ADMIN_DATABASE_URL="$BENCH_DATABASE_URL"
npx vite build --logLevel error

for area in locate analysis layout walk live fieldmap sign-in uploads load; do
  log "bench:$area"
  npm run -s "bench:$area" || log "bench:$area failed (exit $?)"
done
