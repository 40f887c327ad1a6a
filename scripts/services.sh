#!/usr/bin/env bash
# The local fakes (SMTP catcher, S3 store): scripts/services.sh start|stop|restart-smtp
set -euo pipefail
source "$(dirname "$0")/env.sh"
cd "$ROOT"
PIDFILE=$DATA_DIR/fakes-$SMTP_PORT.pid
LOG=$DATA_DIR/fakes-$SMTP_PORT.log
mkdir -p "$DATA_DIR"

running() { [ -f "$PIDFILE" ] && kill -0 "$(cat "$PIDFILE")" 2>/dev/null; }

start() {
  if running; then echo "fakes already running (pid $(cat "$PIDFILE"))"; return; fi
  setsid node_modules/.bin/tsx scripts/fakes.ts >"$LOG" 2>&1 < /dev/null &
  echo $! >"$PIDFILE"
  for _ in $(seq 1 100); do
    if grep -q 'fakes up' "$LOG" 2>/dev/null; then tail -1 "$LOG"; return; fi
    if ! running; then cat "$LOG" >&2; exit 1; fi
    sleep 0.1
  done
  echo "fakes did not start in 10 s; see $LOG" >&2; exit 1
}

stop() {
  if running; then
    kill -- -"$(cat "$PIDFILE")" 2>/dev/null || kill "$(cat "$PIDFILE")" 2>/dev/null || true
    for _ in $(seq 1 30); do running || break; sleep 0.1; done
  fi
  rm -f "$PIDFILE"
}

case "${1:-}" in
  start) start ;;
  stop) stop ;;
  *) echo "usage: scripts/services.sh start|stop" >&2; exit 2 ;;
esac
