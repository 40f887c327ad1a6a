#!/usr/bin/env bash
# One command from a fresh clone to the running demo on http://127.0.0.1:3000:
# install, PostgreSQL, mail catcher and S3 fake, migrate, seed, build, serve.
# Ctrl-C stops the app and everything it started.
set -euo pipefail
source "$(dirname "$0")/env.sh"
cd "$ROOT"

bash scripts/install.sh
bash scripts/pg.sh start
bash scripts/services.sh start

APP_PID=
cleanup() {
  trap - EXIT INT TERM
  [ -n "$APP_PID" ] && kill -- -"$APP_PID" 2>/dev/null || true
  bash scripts/services.sh stop || true
  bash scripts/pg.sh stop || true
}
trap cleanup EXIT INT TERM

node_modules/.bin/tsx scripts/migrate.ts up
node_modules/.bin/tsx scripts/seed.ts
if [ "${SKIP_BUILD:-0}" != 1 ] || [ ! -f .next/BUILD_ID ]; then
  npm run --silent build
elif [ ! -f .next/print-worker.mjs ] || [ ! -f .next/presize-worker.mjs ]; then
  node scripts/build-workers.mjs
fi

echo
echo "Boardwright is starting on $APP_URL (Ctrl-C stops it and the services)."
setsid bash scripts/serve.sh -H 127.0.0.1 -p "$APP_PORT" &
APP_PID=$!
wait "$APP_PID"
