#!/usr/bin/env bash
# npm start: everything a fresh Debian machine with Node 20 needs, then the server.
set -euo pipefail
source "$(dirname "$0")/lib.sh"

PG_PORT=${PLUMELINE_PG_PORT:-54329}
export PORT=${PORT:-3000}

ensure_node_modules
log "starting PostgreSQL on 127.0.0.1:$PG_PORT (data in .data/dev)..."
bash scripts/pg.sh start dev "$PG_PORT"
trap 'log "stopping PostgreSQL..."; bash scripts/pg.sh stop dev "$PG_PORT"' EXIT
ensure_database "$PG_PORT" plumeline

log "building the client..."
npx vite build --logLevel error

export DATABASE_URL="postgres://postgres@127.0.0.1:$PG_PORT/plumeline"
export NODE_ENV=production
# Not exec: the trap above must run after the server stops to stop the database too.
npx tsx server/index.ts &
server_pid=$!
trap 'kill -TERM $server_pid 2>/dev/null || true' INT TERM
wait $server_pid || true
wait $server_pid 2>/dev/null || true
