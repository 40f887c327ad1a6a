#!/usr/bin/env bash
# The project's own PostgreSQL cluster: scripts/pg.sh start|stop|status|createdb NAME|dropdb NAME
# Loopback only, TCP only, run as a non-root user even when the caller is root.
set -euo pipefail
source "$(dirname "$0")/env.sh"

PGBIN=${PGBIN:-$(ls -d /usr/lib/postgresql/*/bin 2>/dev/null | sort -V | tail -1)}
PGDATA=${PGDATA:-$DATA_DIR/pg}
SUPER=(psql -X -q -v ON_ERROR_STOP=1 -h 127.0.0.1 -p "$PGPORT" -U postgres -d postgres)

need_server() {
  if [ -n "$PGBIN" ] && [ -x "$PGBIN/initdb" ]; then return; fi
  if [ "$(id -u)" = 0 ]; then
    echo "PostgreSQL server binaries not found: installing Debian's postgresql with apt-get"
    apt-get update -qq && DEBIAN_FRONTEND=noninteractive apt-get install -y -qq postgresql >/dev/null
    # Debian starts its own 'main' cluster on 5432; we leave it alone and use our own.
    PGBIN=$(ls -d /usr/lib/postgresql/*/bin | sort -V | tail -1)
  else
    echo "PostgreSQL server binaries are missing. Install them (as root: apt-get install postgresql) and run again." >&2
    exit 1
  fi
}

# As root the server runs as the 'postgres' user, who must be able to reach PGDATA. A clone in a
# private (700) folder is out of its reach; then the cluster lives under /var/tmp, named after
# this checkout, so two checkouts never share one.
choose_runas() {
  RUNAS=()
  if [ "$(id -u)" = 0 ]; then
    RUNAS=(runuser -u postgres --)
    mkdir -p "$PGDATA" 2>/dev/null || true
    chown postgres: "$PGDATA" 2>/dev/null || true
    if ! runuser -u postgres -- test -w "$PGDATA" 2>/dev/null; then
      local hash; hash=$(printf '%s' "$ROOT" | sha1sum | cut -c1-12)
      PGDATA=/var/tmp/boardwright-$hash/pg
      echo "note: $DATA_DIR is not reachable by the postgres user; using $PGDATA"
      mkdir -p "$PGDATA"; chmod 755 "/var/tmp/boardwright-$hash"; chown postgres: "$PGDATA"
    fi
  else
    mkdir -p "$PGDATA"
  fi
  chmod 700 "$PGDATA"
}

start() {
  need_server
  choose_runas
  if [ ! -s "$PGDATA/PG_VERSION" ]; then
    "${RUNAS[@]}" "$PGBIN/initdb" -D "$PGDATA" -U postgres --auth=trust -E UTF8 --locale=C.UTF-8 >/dev/null
  fi
  if ! "${RUNAS[@]}" "$PGBIN/pg_ctl" -D "$PGDATA" status >/dev/null 2>&1; then
    "${RUNAS[@]}" "$PGBIN/pg_ctl" -D "$PGDATA" -l "$PGDATA/server.log" -w -t 30 \
      -o "-c listen_addresses=127.0.0.1 -p $PGPORT -c unix_socket_directories= -c fsync=off -c max_connections=200" \
      start >/dev/null || { echo "PostgreSQL did not start; see $PGDATA/server.log" >&2; tail -5 "$PGDATA/server.log" >&2; exit 1; }
  fi
  if [ "$("${SUPER[@]}" -tAc "select 1 from pg_roles where rolname='boardwright'")" != 1 ]; then
    "${SUPER[@]}" -c "create role boardwright login createdb password 'boardwright'"
  fi
  # The app's own role owns nothing; scripts/migrate.ts gives it its grants after every
  # migration (lib/db-roles.ts)
  if [ "$("${SUPER[@]}" -tAc "select 1 from pg_roles where rolname='boardwright_app'")" != 1 ]; then
    "${SUPER[@]}" -c "create role boardwright_app login password 'boardwright_app'"
  fi
  createdb_ "$DB_NAME"
  echo "PostgreSQL up on 127.0.0.1:$PGPORT (data: $PGDATA)"
}

createdb_() {
  if [ "$("${SUPER[@]}" -tAc "select 1 from pg_database where datname='$1'")" != 1 ]; then
    "${SUPER[@]}" -c "create database \"$1\" owner boardwright"
  fi
}

dropdb_() {
  "${SUPER[@]}" -c "drop database if exists \"$1\" with (force)"
}

stop() {
  need_server
  choose_runas >/dev/null
  if "${RUNAS[@]}" "$PGBIN/pg_ctl" -D "$PGDATA" status >/dev/null 2>&1; then
    "${RUNAS[@]}" "$PGBIN/pg_ctl" -D "$PGDATA" -m fast -w stop >/dev/null
    echo "PostgreSQL stopped"
  fi
}

case "${1:-}" in
  start) start ;;
  stop) stop ;;
  status) need_server; choose_runas >/dev/null; "${RUNAS[@]}" "$PGBIN/pg_ctl" -D "$PGDATA" status ;;
  createdb) createdb_ "$2" ;;
  dropdb) dropdb_ "$2" ;;
  *) echo "usage: scripts/pg.sh start|stop|status|createdb NAME|dropdb NAME" >&2; exit 2 ;;
esac
