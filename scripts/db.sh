#!/usr/bin/env bash
# Project-local PostgreSQL on loopback: start | stop | status | reset | url | create NAME | drop NAME
# DATABASE_URL overrides all of this for a real deployment; then only `url` is meaningful.
set -euo pipefail
cd "$(dirname "$0")/.."
ROOT=$(pwd)
PGPORT=${KF_PG_PORT:-54329}
DATA="$ROOT/.data/pg"
SOCK="$ROOT/.data/pg-sock"

bindir() {
  if command -v pg_config >/dev/null 2>&1 && [ -x "$(pg_config --bindir)/initdb" ]; then pg_config --bindir; return; fi
  local d
  d=$(ls -d /usr/lib/postgresql/*/bin 2>/dev/null | sort -V | tail -n 1 || true)
  [ -n "$d" ] && [ -x "$d/initdb" ] && echo "$d"
}

ensure_installed() {
  if [ -z "$(bindir)" ]; then
    echo "PostgreSQL server binaries missing; installing Debian's postgresql package" >&2
    export DEBIAN_FRONTEND=noninteractive
    apt-get update -qq && apt-get install -y -qq postgresql >/dev/null
  fi
}

# Run a PostgreSQL binary as the postgres OS user when we are root (initdb and postgres refuse root).
as_pg() {
  if [ "$(id -u)" = "0" ]; then runuser -u postgres -- "$@"; else "$@"; fi
}

prepare_dirs() {
  mkdir -p "$DATA" "$SOCK"
  if [ "$(id -u)" = "0" ]; then chown postgres:postgres "$DATA" "$SOCK"; fi
  chmod 700 "$DATA"
}

is_running() { [ -f "$DATA/postmaster.pid" ] && as_pg "$(bindir)/pg_ctl" -D "$DATA" status >/dev/null 2>&1; }

start() {
  ensure_installed
  local bin; bin=$(bindir)
  prepare_dirs
  if [ ! -f "$DATA/PG_VERSION" ]; then
    as_pg "$bin/initdb" -D "$DATA" -U postgres --auth=trust -E UTF8 --locale=C.UTF-8 >/dev/null
  fi
  if is_running; then echo "PostgreSQL already running on 127.0.0.1:$PGPORT"; return; fi
  as_pg "$bin/pg_ctl" -D "$DATA" -l "$SOCK/pg.log" -w -t 60 \
    -o "-p $PGPORT -c listen_addresses=127.0.0.1 -c unix_socket_directories=$SOCK -c max_connections=200 -c fsync=${KF_PG_FSYNC:-on}" start >/dev/null
  echo "PostgreSQL running on 127.0.0.1:$PGPORT"
}

stop() {
  local bin; bin=$(bindir)
  if [ -n "$bin" ] && is_running; then as_pg "$bin/pg_ctl" -D "$DATA" -m fast -w stop >/dev/null; echo "PostgreSQL stopped"; else echo "PostgreSQL not running"; fi
}

psql_admin() { "$(bindir)/psql" -h 127.0.0.1 -p "$PGPORT" -U postgres -d postgres -v ON_ERROR_STOP=1 -qtA "$@"; }

create_db() {
  local name=$1
  if [ "$(psql_admin -c "SELECT 1 FROM pg_database WHERE datname = '$name'")" != "1" ]; then
    psql_admin -c "CREATE DATABASE \"$name\""
  fi
}

case "${1:-}" in
  start) start ;;
  stop) stop ;;
  status) if is_running; then echo "running on 127.0.0.1:$PGPORT"; else echo "stopped"; exit 3; fi ;;
  reset) stop; rm -rf "$DATA"; start ;;
  url) echo "postgres://postgres@127.0.0.1:$PGPORT/${2:-kettlefork}" ;;
  create) create_db "$2" ;;
  drop) psql_admin -c "DROP DATABASE IF EXISTS \"$2\" WITH (FORCE)" ;;
  *) echo "usage: scripts/db.sh start|stop|status|reset|url [db]|create NAME|drop NAME" >&2; exit 2 ;;
esac
