#!/usr/bin/env bash
# npm run bench:site — re-sizing a site of 10 boards × 36 ways through PUT origin as a ratio
# against the trivial signed-in route, and the site pack of those boards (scripts/bench/site-resize.ts),
# on a production server on its own port (3450, BENCH_PORT) against the demo database. Not part
# of npm test.
set -euo pipefail
export APP_PORT=${BENCH_PORT:-3450} APP_URL=http://127.0.0.1:${BENCH_PORT:-3450}
source "$(dirname "$0")/../env.sh"
cd "$ROOT"
bash scripts/install.sh
bash scripts/pg.sh start
bash scripts/services.sh start
node_modules/.bin/tsx scripts/migrate.ts up
node_modules/.bin/tsx scripts/seed.ts >/dev/null
source scripts/bench/ensure-build.sh
if curl -fsS -o /dev/null "$APP_URL/login" 2>/dev/null; then
  echo "Something already answers on $APP_URL; set BENCH_PORT to a free port." >&2
  exit 1
fi
setsid bash scripts/serve.sh -H 127.0.0.1 -p "$APP_PORT" > "$DATA_DIR/site-server.log" 2>&1 &
APP_PID=$!
trap 'kill -- -$APP_PID 2>/dev/null || true; bash scripts/services.sh stop || true' EXIT
for _ in $(seq 1 100); do curl -fsS -o /dev/null "$APP_URL/login" 2>/dev/null && break; sleep 0.2; done
node_modules/.bin/tsx scripts/bench/site-resize.ts
