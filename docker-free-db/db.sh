#!/usr/bin/env bash
# Runs PostgreSQL from Debian's packages on 127.0.0.1, as the postgres user, in a project-local data folder.
# Usage: db.sh start|stop|status|reset|ensure-db NAME
# Env: LOADLINE_DB_PORT (54329), LOADLINE_DB_CLUSTER (demo), LOADLINE_DB_FAST=1 (no fsync: test clusters only)
set -euo pipefail

here=$(cd "$(dirname "$0")" && pwd)
project=$(cd "$here/.." && pwd)
port=${LOADLINE_DB_PORT:-54329}
cluster=${LOADLINE_DB_CLUSTER:-demo}
fast=${LOADLINE_DB_FAST:-0}

fail() { echo "docker-free-db: $*" >&2; exit 1; }
say() { echo "docker-free-db: $*"; }

[ "$(id -u)" = 0 ] || fail "run as root (PostgreSQL itself runs as the postgres user)."
[[ "$port" =~ ^[0-9]+$ ]] || fail "LOADLINE_DB_PORT must be a port number, got '$port'."

find_bin() {
  local v
  for v in 17 16 15 14 13; do
    if [ -x "/usr/lib/postgresql/$v/bin/pg_ctl" ]; then echo "/usr/lib/postgresql/$v/bin"; return 0; fi
  done
  return 1
}

install_pg() {
  say "PostgreSQL binaries not found; installing Debian's postgresql package…"
  export DEBIAN_FRONTEND=noninteractive
  apt-get update -qq >/dev/null || fail "apt-get update failed."
  apt-get install -y -qq postgresql >/dev/null || fail "apt-get install postgresql failed."
  # Debian's package starts its own cluster on 5432; we run our own on loopback only.
  if command -v pg_lsclusters >/dev/null; then
    pg_lsclusters -h 2>/dev/null | while read -r ver name _; do pg_ctlcluster "$ver" "$name" stop 2>/dev/null || true; done
  fi
}

PGBIN=$(find_bin) || { install_pg; PGBIN=$(find_bin) || fail "PostgreSQL binaries still missing after install."; }
id postgres >/dev/null 2>&1 || fail "no postgres user; install the postgresql package."

# The postgres user must be able to reach the data folder; a checkout under a private home cannot host it.
base="$project/.db"
if ! runuser -u postgres -- test -x "$project" 2>/dev/null; then
  base="/var/tmp/loadline-db-$(echo -n "$project" | cksum | cut -d' ' -f1)"
fi
dir="$base/$cluster"
data="$dir/data"
run="$dir/run"
log="$dir/postgres.log"
as_pg() { runuser -u postgres -- "$@"; }

is_running() { as_pg "$PGBIN/pg_ctl" -D "$data" status >/dev/null 2>&1; }

init_cluster() {
  mkdir -p "$data" "$run"
  chown -R postgres:postgres "$dir"
  chmod 700 "$data"
  if [ ! -f "$data/PG_VERSION" ]; then
    say "creating cluster '$cluster' in $data"
    as_pg "$PGBIN/initdb" -D "$data" -U postgres --auth=trust -E UTF8 --locale=C.UTF-8 --no-sync >"$dir/initdb.log" 2>&1 \
      || fail "initdb failed; see $dir/initdb.log"
  fi
}

start() {
  init_cluster
  if is_running; then say "cluster '$cluster' already running on 127.0.0.1:$port"; return 0; fi
  # A crash leaves postmaster.pid behind; pg_ctl status said no server, so it is stale.
  if [ -f "$data/postmaster.pid" ]; then
    local pid; pid=$(head -1 "$data/postmaster.pid")
    if [ -n "$pid" ] && kill -0 "$pid" 2>/dev/null; then fail "a process ($pid) still holds $data"; fi
    say "removing stale postmaster.pid"
    rm -f "$data/postmaster.pid"
  fi
  if (exec 3<>/dev/tcp/127.0.0.1/"$port") 2>/dev/null; then fail "port $port on 127.0.0.1 is taken by another program; set LOADLINE_DB_PORT."; fi
  local opts="-c listen_addresses=127.0.0.1 -p $port -k $run -c max_connections=100"
  if [ "$fast" = 1 ]; then opts="$opts -c fsync=off -c synchronous_commit=off -c full_page_writes=off"; fi
  as_pg "$PGBIN/pg_ctl" -D "$data" -l "$log" -w -t 30 start -o "$opts" >/dev/null || { tail -20 "$log" >&2; fail "PostgreSQL did not start; see $log"; }
  say "cluster '$cluster' running on 127.0.0.1:$port"
}

stop() {
  if [ -f "$data/PG_VERSION" ] && is_running; then
    as_pg "$PGBIN/pg_ctl" -D "$data" -m fast -w -t 30 stop >/dev/null || fail "PostgreSQL did not stop; see $log"
    say "cluster '$cluster' stopped"
  else
    say "cluster '$cluster' is not running"
  fi
}

status() {
  if [ -f "$data/PG_VERSION" ] && is_running; then say "cluster '$cluster' running on 127.0.0.1:$port ($data)"; else say "cluster '$cluster' stopped"; return 3; fi
}

ensure_db() {
  local name=$1
  [[ "$name" =~ ^[a-z_][a-z0-9_]*$ ]] || fail "bad database name '$name'"
  local exists
  exists=$(as_pg "$PGBIN/psql" -h 127.0.0.1 -p "$port" -U postgres -tAc "select 1 from pg_database where datname='$name'") || fail "cannot reach PostgreSQL on 127.0.0.1:$port"
  if [ "$exists" != 1 ]; then
    as_pg "$PGBIN/createdb" -h 127.0.0.1 -p "$port" -U postgres "$name" || fail "createdb $name failed"
    say "database '$name' created"
  fi
}

case "${1:-}" in
  start) start ;;
  stop) stop ;;
  status) status ;;
  reset) stop; rm -rf "$dir"; start ;;
  ensure-db) [ -n "${2:-}" ] || fail "ensure-db needs a database name"; ensure_db "$2" ;;
  *) echo "usage: db.sh start|stop|status|reset|ensure-db NAME" >&2; exit 2 ;;
esac
