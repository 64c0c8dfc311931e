#!/usr/bin/env bash
# Private PostgreSQL cluster on 127.0.0.1 only. Works as root (through the postgres user) or as a
# normal user. Usage: bash scripts/pg.sh start|stop|status|ensure-db NAME|fresh-db NAME|destroy
#   PGPORT   port (default 54329, a non-default port so a system PostgreSQL is never touched)
#   PGBASE   folder for the cluster (default .data/, or /tmp/... when postgres cannot reach it)
set -euo pipefail
ROOT="$(cd "$(dirname "$0")/.." && pwd)"
PGPORT="${PGPORT:-54329}"
PGBIN="$(ls -d /usr/lib/postgresql/*/bin 2>/dev/null | sort -V | tail -1)"
[ -x "$PGBIN/initdb" ] || { echo "PostgreSQL server binaries not found (run scripts/ensure-deps.sh)" >&2; exit 1; }

BASE="${PGBASE:-$ROOT/.data}"
if [ "$(id -u)" = 0 ] && [ -z "${PGBASE:-}" ] && ! runuser -u postgres -- test -x "$ROOT" 2>/dev/null; then
  # a parent folder (e.g. /root, mode 700) is closed to the postgres user
  BASE="/tmp/tributary-pg-$(echo "$ROOT" | md5sum | cut -c1-8)"
fi
PGDATA="$BASE/pg"; SOCKDIR="$BASE/sock"; LOG="$BASE/pg.log"

as_pg() { if [ "$(id -u)" = 0 ]; then (cd / && runuser -u postgres -- "$@"); else "$@"; fi; }

start() {
  mkdir -p "$BASE" "$SOCKDIR"
  if [ "$(id -u)" = 0 ]; then chown postgres:postgres "$BASE" "$SOCKDIR"; fi
  if [ ! -s "$PGDATA/PG_VERSION" ]; then
    echo "Creating a private PostgreSQL cluster in $PGDATA"
    as_pg "$PGBIN/initdb" -D "$PGDATA" -U postgres --auth=trust -E UTF8 --locale=C.UTF-8 >/dev/null
  fi
  if as_pg "$PGBIN/pg_ctl" -D "$PGDATA" status >/dev/null 2>&1; then
    echo "PostgreSQL already running on 127.0.0.1:$PGPORT"
    return 0
  fi
  as_pg "$PGBIN/pg_ctl" -D "$PGDATA" -l "$LOG" -w -t 30 \
    -o "-c listen_addresses=127.0.0.1 -p $PGPORT -k $SOCKDIR ${PGEXTRA:-}" start >/dev/null || {
    tail -3 "$LOG" >&2
    echo "PostgreSQL did not start (log: $LOG). If port $PGPORT is taken, set PGPORT to a free port." >&2
    exit 1
  }
  echo "PostgreSQL started on 127.0.0.1:$PGPORT"
}

ensure_db() {
  local name="$1"
  as_pg "$PGBIN/psql" -h 127.0.0.1 -p "$PGPORT" -U postgres -d postgres -tAc \
    "SELECT 1 FROM pg_database WHERE datname='$name'" | grep -q 1 ||
    as_pg "$PGBIN/createdb" -h 127.0.0.1 -p "$PGPORT" -U postgres "$name"
}

# Drops NAME (closing its connections) and creates it empty: for benchmarks that must not
# inherit what earlier runs wrote.
fresh_db() {
  local name="$1"
  as_pg "$PGBIN/psql" -h 127.0.0.1 -p "$PGPORT" -U postgres -d postgres -qc \
    "DROP DATABASE IF EXISTS \"$name\" WITH (FORCE)"
  as_pg "$PGBIN/createdb" -h 127.0.0.1 -p "$PGPORT" -U postgres "$name"
}

stop() {
  if [ -s "$PGDATA/PG_VERSION" ] && as_pg "$PGBIN/pg_ctl" -D "$PGDATA" status >/dev/null 2>&1; then
    as_pg "$PGBIN/pg_ctl" -D "$PGDATA" -m fast -w stop >/dev/null && echo "PostgreSQL stopped"
  fi
}
status() { as_pg "$PGBIN/pg_ctl" -D "$PGDATA" status; }
destroy() { stop; rm -rf "$BASE"; }

case "${1:-start}" in
  start) start ;;
  stop) stop ;;
  status) status ;;
  ensure-db) ensure_db "$2" ;;
  fresh-db) fresh_db "$2" ;;
  destroy) destroy ;;
  *) echo "usage: $0 start|stop|status|ensure-db NAME|fresh-db NAME|destroy" >&2; exit 2 ;;
esac
