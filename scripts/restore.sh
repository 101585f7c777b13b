#!/usr/bin/env bash
# Restore a backup made by scripts/backup.sh: scripts/restore.sh DUMP [UPLOADS_ARCHIVE]
#   DATABASE_URL  the database to restore into; it is created when missing and must be empty
#   UPLOADS_DIR   where the uploads go (default: uploads); must be empty or missing
# Stop the app first. Nothing is overwritten: a database with tables or a folder with files is refused.
set -euo pipefail
source "$(dirname "$0")/lib.sh"

dump=${1:?usage: scripts/restore.sh DUMP [UPLOADS_ARCHIVE]}
archive=${2:-}
db_url=${DATABASE_URL:-postgres://postgres@127.0.0.1:${PLUMELINE_PG_PORT:-54329}/plumeline}
uploads=${UPLOADS_DIR:-uploads}
[ -f "$dump" ] || { log "no such dump: $dump"; exit 2; }
[ -z "$archive" ] || [ -f "$archive" ] || { log "no such uploads archive: $archive"; exit 2; }

db_name=${db_url##*/}
db_name=${db_name%%\?*}
admin_url="${db_url%/*}/postgres"
if [ -z "$(pg_tool psql "$admin_url" -tAc "select 1 from pg_database where datname = '$db_name'")" ]; then
  pg_tool psql "$admin_url" -qc "create database \"$db_name\""
fi
tables=$(pg_tool psql "$db_url" -tAc "select count(*) from pg_tables where schemaname not in ('pg_catalog', 'information_schema')")
if [ "$tables" != 0 ]; then
  log "refusing: $db_name already has $tables tables (restore into an empty database)"
  exit 3
fi
if [ -n "$archive" ] && [ -d "$uploads" ] && [ -n "$(ls -A "$uploads" | grep -v '^\.gitkeep$' || true)" ]; then
  log "refusing: $uploads is not empty"
  exit 3
fi

pg_tool pg_restore --no-owner --no-privileges --exit-on-error --dbname="$db_url" "$dump"
if [ -n "$archive" ]; then
  mkdir -p "$uploads"
  tar -xzf "$archive" -C "$uploads"
fi
log "restored $dump${archive:+ and $archive}"
