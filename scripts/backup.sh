#!/usr/bin/env bash
# Backup of the database and the uploads: scripts/backup.sh [DEST_DIR]
#   DATABASE_URL  the database to dump (default: the `npm start` one)
#   UPLOADS_DIR   the uploads folder (default: uploads)
# Writes DEST_DIR/plumeline-<UTC stamp>.dump (pg_dump custom format) and
# DEST_DIR/plumeline-<UTC stamp>-uploads.tar.gz, then prints both paths.
# The database is dumped first: uploads are written before the rows that name them, so every file
# the dump names is in the later archive (files added in between are harmless extras).
set -euo pipefail
source "$(dirname "$0")/lib.sh"

dest=${1:-backups}
db_url=${DATABASE_URL:-postgres://postgres@127.0.0.1:${PLUMELINE_PG_PORT:-54329}/plumeline}
uploads=${UPLOADS_DIR:-uploads}
stamp=$(date -u +%Y%m%dT%H%M%SZ)
mkdir -p "$dest"
dump="$dest/plumeline-$stamp.dump"
archive="$dest/plumeline-$stamp-uploads.tar.gz"

# pg_dump takes a consistent snapshot while the app keeps running; -Fc is compressed and lets
# pg_restore pick, reorder and run in parallel.
pg_tool pg_dump --format=custom --no-owner --no-privileges --file="$dump.part" "$db_url"
mv "$dump.part" "$dump"
mkdir -p "$uploads"
tar -czf "$archive.part" -C "$uploads" --exclude='*.part' .
mv "$archive.part" "$archive"
log "database: $dump"
log "uploads:  $archive"
printf '%s\n%s\n' "$dump" "$archive"
