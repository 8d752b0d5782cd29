#!/usr/bin/env bash
# The project's private PostgreSQL cluster: installed from Debian when missing, its data in
# .data/pg, listening on 127.0.0.1 only. Usage: db.sh start | stop | restart | status | reset DBNAME [--force]
# PG_DATA_DIR puts a cluster elsewhere (the tests start a scratch one to restart it).
set -euo pipefail
source "$(dirname "$0")/lib.sh"

PGBIN=$(ls -d /usr/lib/postgresql/*/bin 2>/dev/null | sort -V | tail -n 1 || true)
PG_DATA=${PG_DATA_DIR:-$DATA_DIR/pg}
PG_SOCK="$PG_DATA-socket"

if [ "$(id -u)" -eq 0 ]; then RUN=(runuser -u postgres --); SUPER=postgres; else RUN=(); SUPER=$(id -un); fi

ensure_installed() {
  if [ -z "$PGBIN" ] || [ ! -x "$PGBIN/initdb" ]; then
    log "Installing PostgreSQL from Debian's packages"
    as_root_apt postgresql postgresql-contrib
    PGBIN=$(ls -d /usr/lib/postgresql/*/bin | sort -V | tail -n 1)
  fi
}

psql_super() { "${RUN[@]}" "$PGBIN/psql" -h "$PG_SOCK" -p "$PG_PORT" -U "$SUPER" -d postgres -v ON_ERROR_STOP=1 -qtA "$@"; }

ensure_database() {
  local db=$1
  if [ "$(psql_super -c "SELECT 1 FROM pg_database WHERE datname = '$db'")" != "1" ]; then
    psql_super -c "CREATE DATABASE \"$db\" OWNER $PG_USER"
  fi
}

start() {
  ensure_installed
  if [ ! -f "$PG_DATA/PG_VERSION" ]; then
    log "Creating the project's PostgreSQL cluster in .data/pg"
    if [ "$(id -u)" -eq 0 ]; then
      install -d -o postgres -g postgres -m 700 "$PG_DATA" "$PG_SOCK"
      if ! runuser -u postgres -- test -x "$PG_DATA"; then
        echo "The postgres user cannot reach $PG_DATA; clone the project into a folder every user can enter." >&2
        exit 1
      fi
    else
      install -d -m 700 "$PG_DATA" "$PG_SOCK"
    fi
    "${RUN[@]}" "$PGBIN/initdb" -D "$PG_DATA" -U "$SUPER" -E UTF8 --locale=C.UTF-8 \
      --auth-local=peer --auth-host=scram-sha-256 > "$DATA_DIR/initdb.log"
  fi
  [ "$(id -u)" -eq 0 ] && install -d -o postgres -g postgres -m 700 "$PG_SOCK"
  if "${RUN[@]}" "$PGBIN/pg_ctl" -D "$PG_DATA" status > /dev/null 2>&1; then
    local running; running=$(sed -n 4p "$PG_DATA/postmaster.pid")
    if [ "$running" != "$PG_PORT" ]; then
      echo "This clone's PostgreSQL is running on port $running, not on PG_PORT=$PG_PORT; stop it first (npm run db:down)." >&2
      exit 1
    fi
  else
    require_free_port PG_PORT "$PG_PORT"
    log "Starting PostgreSQL on 127.0.0.1:$PG_PORT"
    "${RUN[@]}" "$PGBIN/pg_ctl" -D "$PG_DATA" -l "$PG_DATA/server.log" -w -s \
      -o "-c listen_addresses=127.0.0.1 -c port=$PG_PORT -c unix_socket_directories=$PG_SOCK -c max_connections=200" start
  fi
  if [ "$(psql_super -c "SELECT 1 FROM pg_roles WHERE rolname = '$PG_USER'")" != "1" ]; then
    psql_super -c "CREATE ROLE $PG_USER LOGIN CREATEDB PASSWORD '$PG_PASSWORD'"
  fi
  ensure_database brixhouse_dev
  ensure_database brixhouse_test
}

stop() {
  if [ -n "$PGBIN" ] && [ -f "$PG_DATA/PG_VERSION" ] && "${RUN[@]}" "$PGBIN/pg_ctl" -D "$PG_DATA" status > /dev/null 2>&1; then
    log "Stopping PostgreSQL"
    "${RUN[@]}" "$PGBIN/pg_ctl" -D "$PG_DATA" -w -s -m fast stop
  fi
}

# Drop and re-create one database (the tests' own), so a run starts from nothing. Only a
# database whose name ends in _test, unless --force.
reset() {
  local db=$1
  if [[ "$db" != *_test ]] && [ "${2:-}" != "--force" ]; then
    echo "Refusing to reset the database \"$db\": only a database whose name ends in _test is reset without --force." >&2
    exit 1
  fi
  psql_super -c "DROP DATABASE IF EXISTS \"$db\" WITH (FORCE)"
  psql_super -c "CREATE DATABASE \"$db\" OWNER $PG_USER"
}

# Benchmarks: log the plan (with row counts) of every statement over 200 ms in one database.
explain() {
  local db=$1
  psql_super -c "ALTER DATABASE \"$db\" SET session_preload_libraries = 'auto_explain'" \
    -c "ALTER DATABASE \"$db\" SET auto_explain.log_min_duration = '200ms'" \
    -c "ALTER DATABASE \"$db\" SET auto_explain.log_analyze = on" \
    -c "ALTER DATABASE \"$db\" SET auto_explain.log_timing = off"
}

case "${1:-start}" in
  start) start ;;
  stop) stop ;;
  restart) "${RUN[@]}" "$PGBIN/pg_ctl" -D "$PG_DATA" -l "$PG_DATA/server.log" -w -s -m fast restart > /dev/null ;;
  status) "${RUN[@]}" "$PGBIN/pg_ctl" -D "$PG_DATA" status ;;
  reset) reset "$2" "${3:-}" ;;
  explain) explain "$2" ;;
  *) echo "usage: db.sh start|stop|restart|status|reset DBNAME [--force]|explain DBNAME" >&2; exit 2 ;;
esac
