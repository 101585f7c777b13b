#!/usr/bin/env bash
# Project-local PostgreSQL: pg.sh start|stop|status|destroy NAME PORT
# NAME picks the cluster folder (.data/NAME), so `npm start` and `npm test` never share one.
# Installs Debian's postgresql when its binaries are missing; runs the server as the
# `postgres` user when we are root (initdb refuses root), as ourselves otherwise.
set -euo pipefail
cmd=${1:?start|stop|status}
name=${2:?cluster name}
port=${3:?port}
root=$(cd "$(dirname "$0")/.." && pwd)
sock="/tmp/plumeline-sock-$port"   # short: socket paths are limited to 107 bytes

find_pgbin() { ls -d /usr/lib/postgresql/*/bin 2>/dev/null | sort -V | tail -1; }

as_pg() {
  if [ "$(id -u)" = 0 ]; then runuser -u postgres -- "$@"; else "$@"; fi
}

install_postgres() {
  echo "PostgreSQL is not installed; installing it from Debian's packages..." >&2
  if [ "$(id -u)" = 0 ]; then
    apt-get update -qq && DEBIAN_FRONTEND=noninteractive apt-get install -y -qq postgresql >/dev/null
  elif command -v sudo >/dev/null 2>&1; then
    sudo apt-get update -qq && sudo DEBIAN_FRONTEND=noninteractive apt-get install -y -qq postgresql >/dev/null
  else
    echo "Cannot install PostgreSQL: run 'apt-get install postgresql' as root, then try again." >&2
    exit 1
  fi
}

# The data folder must be reachable by the postgres user; a checkout under a private home
# folder is not, so fall back to a folder under /tmp named after the checkout.
data_dir() {
  local dir="$root/.data/$name"
  if [ "$(id -u)" = 0 ]; then
    mkdir -p "$dir"
    chown postgres: "$dir"
    if ! runuser -u postgres -- test -w "$dir" 2>/dev/null; then
      dir="/tmp/plumeline-$(printf %s "$root" | cksum | cut -d' ' -f1)-$name"
      mkdir -p "$dir"
      chown postgres: "$dir"
    fi
  else
    mkdir -p "$dir"
  fi
  chmod 700 "$dir"
  printf %s "$dir"
}

pgbin=$(find_pgbin)
if [ -z "$pgbin" ] || [ ! -x "$pgbin/pg_ctl" ]; then
  [ "$cmd" = start ] || { echo "PostgreSQL is not installed" >&2; exit 1; }
  install_postgres
  pgbin=$(find_pgbin)
fi

dir=$(data_dir)
cd /  # runuser complains when postgres cannot enter the current folder

case "$cmd" in
  start)
    mkdir -p "$sock"
    [ "$(id -u)" = 0 ] && chown postgres: "$sock"
    if [ ! -f "$dir/PG_VERSION" ]; then
      as_pg "$pgbin/initdb" -D "$dir" -U postgres --auth=trust -E UTF8 --locale=C.UTF-8 >/dev/null
    fi
    # A cluster left running from this folder on another port is stopped first: one folder, one port.
    if [ -f "$dir/postmaster.pid" ] && as_pg "$pgbin/pg_ctl" -D "$dir" status >/dev/null 2>&1; then
      running_port=$(sed -n 4p "$dir/postmaster.pid")
      [ "$running_port" = "$port" ] || as_pg "$pgbin/pg_ctl" -D "$dir" -m fast -w stop >/dev/null
    fi
    if ! as_pg "$pgbin/pg_isready" -q -h 127.0.0.1 -p "$port"; then
      for attempt in 1 2 3; do
        if as_pg "$pgbin/pg_ctl" -D "$dir" -l "$dir/server.log" -w -t 60 \
          -o "-c listen_addresses=127.0.0.1 -p $port -k $sock${PG_EXTRA_OPTS:+ $PG_EXTRA_OPTS}" start >/dev/null; then
          break
        fi
        # Right after a kill -9 the old postmaster may still be going away: wait and retry.
        [ "$attempt" = 3 ] && { echo "PostgreSQL did not start; see $dir/server.log" >&2; tail -20 "$dir/server.log" >&2; exit 1; }
        sleep 2
      done
    fi
    for _ in $(seq 1 60); do as_pg "$pgbin/pg_isready" -q -h 127.0.0.1 -p "$port" && break; sleep 0.5; done
    ;;
  stop)
    if [ -f "$dir/postmaster.pid" ]; then as_pg "$pgbin/pg_ctl" -D "$dir" -m fast -w stop >/dev/null || true; fi
    ;;
  destroy) # stop and delete the cluster (fault tests' private clusters)
    if [ -f "$dir/postmaster.pid" ]; then as_pg "$pgbin/pg_ctl" -D "$dir" -m immediate -w stop >/dev/null || true; fi
    rm -rf "$dir"
    ;;
  status)
    as_pg "$pgbin/pg_isready" -h 127.0.0.1 -p "$port"
    ;;
  *) echo "unknown command $cmd" >&2; exit 2 ;;
esac
