#!/usr/bin/env bash
# Project-local PostgreSQL on loopback: start | stop | status | reset | where | url | create NAME | drop NAME
# DATABASE_URL overrides all of this for a real deployment; then only `url` is meaningful.
set -euo pipefail
cd "$(dirname "$0")/.."
ROOT=$(pwd)
PGPORT=${KF_PG_PORT:-54329}
DATA=""
SOCK=""

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
# From / so a working folder that user cannot enter does not matter.
as_pg() {
  if [ "$(id -u)" = "0" ]; then (cd / && runuser -u postgres -- "$@"); else "$@"; fi
}

# Can the postgres OS user enter the checkout? Not when it sits inside a private folder, such as
# root's own 0700 home.
server_user_can_enter() {
  id postgres >/dev/null 2>&1 || return 1
  (cd / && runuser -u postgres -- test -x "$ROOT") 2>/dev/null || return 1
  [ ! -d "$ROOT/.data" ] || (cd / && runuser -u postgres -- test -x "$ROOT/.data") 2>/dev/null
}

# Where the cluster lives: .data/ in the checkout, unless we are root and the server's user cannot
# reach it there; then a folder of its own under /var/lib/kettlefork, named after the checkout's path
# (so stop, reset and the next start find the same one).
locate() {
  local dir="$ROOT/.data"
  if [ "$(id -u)" = "0" ] && ! server_user_can_enter; then
    local key; key=$(printf '%s' "$ROOT" | sha256sum | cut -c1-12)
    dir="/var/lib/kettlefork/$(basename "$ROOT")-$key"
  fi
  DATA="$dir/pg"
  SOCK="$dir/pg-sock"
}

# Says once, when the cluster has to live outside the checkout, where it went and why.
explain_location() {
  case "$DATA" in
    "$ROOT"/*) return ;;
  esac
  mkdir -p "$ROOT/.data"
  if [ ! -f "$ROOT/.data/pg-location" ] || [ "$(cat "$ROOT/.data/pg-location")" != "$DATA" ]; then
    echo "The postgres user cannot enter $ROOT (a parent folder is private), so the" >&2
    echo "database cluster for this checkout is kept in $DATA instead." >&2
    echo "$DATA" > "$ROOT/.data/pg-location"
  fi
}

prepare_dirs() {
  mkdir -p "$DATA" "$SOCK"
  chmod 755 "$(dirname "$DATA")"
  if [ "$(id -u)" = "0" ]; then chown postgres:postgres "$DATA" "$SOCK"; fi
  chmod 700 "$DATA"
}

is_running() { [ -f "$DATA/postmaster.pid" ] && as_pg "$(bindir)/pg_ctl" -D "$DATA" status >/dev/null 2>&1; }

start() {
  ensure_installed
  locate
  explain_location
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
  start | stop | status | reset | where) locate ;;
esac

case "${1:-}" in
  start) start ;;
  stop) stop ;;
  status) if is_running; then echo "running on 127.0.0.1:$PGPORT"; else echo "stopped"; exit 3; fi ;;
  reset) stop; rm -rf "$DATA"; start ;;
  where) echo "$DATA" ;;
  url) echo "postgres://postgres@127.0.0.1:$PGPORT/${2:-kettlefork}" ;;
  create) create_db "$2" ;;
  drop) psql_admin -c "DROP DATABASE IF EXISTS \"$2\" WITH (FORCE)" ;;
  *) echo "usage: scripts/db.sh start|stop|status|reset|where|url [db]|create NAME|drop NAME" >&2; exit 2 ;;
esac
