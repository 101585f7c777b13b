# Shared set-up steps for start.sh and test.sh (sourced, not run).
root=$(cd "$(dirname "${BASH_SOURCE[0]}")/.." && pwd)
cd "$root"

log() { printf '\033[1m[plumeline]\033[0m %s\n' "$*" >&2; }

ensure_node_modules() {
  # Install when missing, or when the lock's content changed since the last install (a content
  # hash, not file dates: a checkout or merge touches dates without changing what is locked).
  local want have
  want=$(sha256sum package-lock.json | cut -d' ' -f1)
  have=$(cat node_modules/.plumeline-lock-hash 2>/dev/null || true)
  if [ ! -f node_modules/.package-lock.json ] || [ "$want" != "$have" ]; then
    log "installing npm dependencies (npm ci)..."
    npm ci --no-audit --no-fund --loglevel=error
    printf %s "$want" > node_modules/.plumeline-lock-hash
  fi
}

run_as_root() {
  if [ "$(id -u)" = 0 ]; then "$@"; elif command -v sudo >/dev/null 2>&1; then sudo "$@"; else
    log "need root to run: $* (install it by hand and try again)"; return 1; fi
}

ensure_chromium() {
  if [ ! -x /usr/bin/chromium ]; then
    log "installing Debian's chromium for the browser tests..."
    run_as_root apt-get update -qq
    DEBIAN_FRONTEND=noninteractive run_as_root apt-get install -y -qq chromium >/dev/null
  fi
}

ensure_poppler() {
  # pdftoppm renders report pages to PNG for a person to look at after the tests.
  if ! command -v pdftoppm >/dev/null 2>&1; then
    log "installing Debian's poppler-utils for the PDF tests..."
    run_as_root apt-get update -qq
    DEBIAN_FRONTEND=noninteractive run_as_root apt-get install -y -qq poppler-utils >/dev/null
  fi
}

# psql binary of the newest installed PostgreSQL.
pg_tool() { "$(ls -d /usr/lib/postgresql/*/bin | sort -V | tail -1)/$1" "${@:2}"; }

ensure_database() { # port dbname
  local port=$1 db=$2
  if [ -z "$(pg_tool psql -h 127.0.0.1 -p "$port" -U postgres -tAc "select 1 from pg_database where datname='$db'")" ]; then
    pg_tool createdb -h 127.0.0.1 -p "$port" -U postgres "$db"
  fi
}
