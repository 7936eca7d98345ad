#!/usr/bin/env bash
# Project-local PostgreSQL on 127.0.0.1: start | stop | status | url
# Env: PG_DATA_DIR (default <repo>/.pgdata), PGPORT (default 54329), PG_DB (default carbwright).
# The password is generated on first init and kept in $PG_DATA_DIR.pw (outside the cluster, mode 600).
set -euo pipefail
ROOT="$(cd "$(dirname "${BASH_SOURCE[0]}")/../.." && pwd)"
DATA="${PG_DATA_DIR:-$ROOT/.pgdata}"
# As root the server runs as the postgres user, which cannot enter a checkout under a private folder (/root, a mode-700
# temp dir): the cluster then lives under /var/lib/carbwright, one folder per checkout.
if [ -z "${PG_DATA_DIR:-}" ] && [ "$(id -u)" = 0 ] && id -u postgres >/dev/null 2>&1 && ! runuser -u postgres -- test -x "$ROOT"; then
  DATA="/var/lib/carbwright/$(printf '%s' "$ROOT" | sha256sum | cut -c1-12)/pgdata"
  mkdir -p "$(dirname "$DATA")" && chmod 755 /var/lib/carbwright "$(dirname "$DATA")"
fi
PORT="${PGPORT:-54329}"
DB="${PG_DB:-carbwright}"
PWFILE="$DATA.pw"

find_bin() { ls -d /usr/lib/postgresql/*/bin 2>/dev/null | sort -V -r | while read -r d; do [ -x "$d/initdb" ] && { echo "$d"; break; }; done; }

ensure_installed() {
  PG_BIN="$(find_bin || true)"
  [ -n "$PG_BIN" ] && return 0
  if [ "$(id -u)" = 0 ] && command -v apt-get >/dev/null; then
    echo "PostgreSQL server not found: installing Debian's postgresql package (no default cluster)…" >&2
    mkdir -p /etc/postgresql-common/createcluster.d
    echo 'create_main_cluster = false' > /etc/postgresql-common/createcluster.d/50-no-main.conf
    apt-get update -qq && DEBIAN_FRONTEND=noninteractive apt-get install -y -qq postgresql >&2
    PG_BIN="$(find_bin || true)"
  fi
  if [ -z "$PG_BIN" ]; then
    echo "ERROR: PostgreSQL server binaries not found (looked in /usr/lib/postgresql/*/bin)." >&2
    echo "Install them as root:  apt-get update && apt-get install -y postgresql" >&2
    exit 1
  fi
}

# PostgreSQL refuses to run as root, so as root everything runs as the postgres system user.
as_pg() { if [ "$(id -u)" = 0 ]; then (cd / && runuser -u postgres -- "$@"); else "$@"; fi; }

is_running() { [ -f "$DATA/postmaster.pid" ] && as_pg "$PG_BIN/pg_ctl" -D "$DATA" status >/dev/null 2>&1; }

init_cluster() {
  mkdir -p "$DATA"
  if [ "$(id -u)" = 0 ]; then
    chown postgres: "$DATA"
    if ! runuser -u postgres -- test -x "$DATA"; then
      echo "ERROR: user postgres cannot reach $DATA (a parent directory is not world-searchable?). Set PG_DATA_DIR to a reachable path." >&2
      exit 1
    fi
  fi
  chmod 700 "$DATA"
  local pw; pw="$(head -c 18 /dev/urandom | base64 | tr -dc 'A-Za-z0-9' | head -c 24)"
  umask 077; printf '%s' "$pw" > "$PWFILE"
  local tmp; tmp="$(mktemp)"; printf '%s\n' "$pw" > "$tmp"
  [ "$(id -u)" = 0 ] && chown postgres: "$tmp"
  as_pg "$PG_BIN/initdb" -D "$DATA" -U postgres --pwfile="$tmp" -A scram-sha-256 --auth-local=trust \
    -E UTF8 --locale=C.UTF-8 --no-sync >/dev/null
  rm -f "$tmp"
  local sockdir="$DATA"
  # Unix socket paths are limited to 107 bytes; fall back to TCP only for deep checkouts.
  [ ${#DATA} -gt 80 ] && sockdir=''
  cat >> "$DATA/postgresql.conf" <<CONF
listen_addresses = '127.0.0.1'
port = $PORT
unix_socket_directories = '$sockdir'
max_connections = 60
fsync = ${PG_FSYNC:-on}
synchronous_commit = ${PG_SYNC_COMMIT:-on}
full_page_writes = ${PG_FSYNC:-on}
CONF
}

url() { echo "postgres://postgres:$(cat "$PWFILE")@127.0.0.1:$PORT/$DB"; }

start() {
  ensure_installed
  [ -f "$DATA/PG_VERSION" ] || init_cluster
  # the port lives in postgresql.conf; keep it in step with PGPORT
  sed -i "s/^port = .*/port = $PORT/" "$DATA/postgresql.conf"
  if ! is_running; then
    as_pg "$PG_BIN/pg_ctl" -D "$DATA" -l "$DATA/server.log" -w -t 60 -o "-p $PORT" start >/dev/null || {
      echo "ERROR: PostgreSQL did not start; last lines of $DATA/server.log:" >&2; tail -n 20 "$DATA/server.log" >&2; exit 1; }
  fi
  PGPASSWORD="$(cat "$PWFILE")" "$PG_BIN/psql" -h 127.0.0.1 -p "$PORT" -U postgres -d postgres -tAc \
    "SELECT 1 FROM pg_database WHERE datname='$DB'" | grep -q 1 ||
    PGPASSWORD="$(cat "$PWFILE")" "$PG_BIN/createdb" -h 127.0.0.1 -p "$PORT" -U postgres "$DB"
}

stop() {
  ensure_installed
  if is_running; then as_pg "$PG_BIN/pg_ctl" -D "$DATA" -m fast -w stop >/dev/null; fi
}

case "${1:-}" in
  start) start; url ;;
  stop) stop ;;
  status) ensure_installed; if is_running; then echo "running on 127.0.0.1:$PORT ($DATA)"; else echo stopped; exit 3; fi ;;
  url) url ;;
  *) echo "usage: pg.sh start|stop|status|url" >&2; exit 2 ;;
esac
