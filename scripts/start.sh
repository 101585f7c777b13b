#!/usr/bin/env bash
# npm start: everything a fresh Debian machine with Node 20 needs, then the server.
# Stopping (Ctrl-C or a TERM to this script) stops the app first, waits for it to drain, then
# stops PostgreSQL: the app is never left running without its database.
set -euo pipefail
source "$(dirname "$0")/lib.sh"

PG_PORT=${PLUMELINE_PG_PORT:-54329}
PG_CLUSTER=${PLUMELINE_PG_CLUSTER:-dev}
export PORT=${PORT:-3000}
# The app's own grace period (SHUTDOWN_GRACE_MS) plus a margin before it is killed.
STOP_WAIT_S=$(((${SHUTDOWN_GRACE_MS:-20000} + 999) / 1000 + 10))

server_pid=""
stop_all() {
  trap - INT TERM EXIT
  if [ -n "$server_pid" ] && kill -0 "$server_pid" 2>/dev/null; then
    log "stopping the app..."
    kill -TERM "$server_pid" 2>/dev/null || true
    for _ in $(seq 1 $((STOP_WAIT_S * 10))); do kill -0 "$server_pid" 2>/dev/null || break; sleep 0.1; done
    if kill -0 "$server_pid" 2>/dev/null; then
      log "the app did not stop in ${STOP_WAIT_S}s: killing it"
      kill -KILL "$server_pid" 2>/dev/null || true
    fi
    wait "$server_pid" 2>/dev/null || true
  fi
  log "stopping PostgreSQL..."
  bash scripts/pg.sh stop "$PG_CLUSTER" "$PG_PORT"
}

ensure_node_modules
log "starting PostgreSQL on 127.0.0.1:$PG_PORT (data in .data/$PG_CLUSTER)..."
bash scripts/pg.sh start "$PG_CLUSTER" "$PG_PORT"
trap 'stop_all' EXIT
trap 'stop_all; exit 143' TERM
trap 'stop_all; exit 130' INT
ensure_database "$PG_PORT" plumeline

# The start-script test sets PLUMELINE_BUILD_CLIENT=no: the test command has built the client and
# the server already (and other tests may be running that build).
if [ "${PLUMELINE_BUILD_CLIENT:-yes}" = yes ]; then
  log "building the client and the server..."
  npx vite build --logLevel error
  node scripts/build.mjs
fi

export DATABASE_URL="postgres://postgres@127.0.0.1:$PG_PORT/plumeline"
export NODE_ENV=production
# The production build (dist/server, docs/decisions/0086), no TypeScript loader. node itself (not
# npx) so the pid we signal is the app's: npx would not pass the TERM on.
node --enable-source-maps dist/server/index.js &
server_pid=$!
# `wait` returns early when a trapped signal arrives; the trap then stops everything in order.
wait "$server_pid" || true
