#!/usr/bin/env bash
# npm run bench:sizing — the engine on one core, then the board sizing route against a
# trivial signed-in route on a production server (its own port 3200, the demo database).
set -euo pipefail
export APP_PORT=${BENCH_PORT:-3200} APP_URL=http://127.0.0.1:${BENCH_PORT:-3200}
source "$(dirname "$0")/../env.sh"
cd "$ROOT"
bash scripts/install.sh
bash scripts/pg.sh start
node_modules/.bin/tsx scripts/migrate.ts up
node_modules/.bin/tsx scripts/seed.ts >/dev/null
echo "== engine (one core)"
node_modules/.bin/tsx scripts/bench/sizing-engine.ts
source scripts/bench/ensure-build.sh
setsid bash scripts/serve.sh -H 127.0.0.1 -p "$APP_PORT" > "$DATA_DIR/bench-server.log" 2>&1 &
APP_PID=$!
trap 'kill -- -$APP_PID 2>/dev/null || true' EXIT
for _ in $(seq 1 100); do curl -fsS -o /dev/null "$APP_URL/login" && break; sleep 0.2; done
echo "== routes"
node_modules/.bin/tsx scripts/bench/sizing-routes.ts
