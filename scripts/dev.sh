#!/usr/bin/env bash
# npm run dev: the API on :3000 (restarted on change by tsx watch) and Vite's dev server with hot
# reload on :5173, which forwards /api to it. Same database as npm start.
set -euo pipefail
source "$(dirname "$0")/lib.sh"

PG_PORT=${PLUMELINE_PG_PORT:-54329}
ensure_node_modules
bash scripts/pg.sh start dev "$PG_PORT"
ensure_database "$PG_PORT" plumeline
export DATABASE_URL="postgres://postgres@127.0.0.1:$PG_PORT/plumeline"
export PORT=3000 APP_URL=${APP_URL:-http://127.0.0.1:5173}

npx tsx watch server/index.ts &
api_pid=$!
trap 'kill $api_pid 2>/dev/null || true; bash scripts/pg.sh stop dev "$PG_PORT"' EXIT
npx vite --host 127.0.0.1
