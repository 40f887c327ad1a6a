#!/usr/bin/env bash
# The whole test suite from a fresh clone: install, chromium, PostgreSQL (a fresh test
# database), the fakes on their own ports, lint and format, unit + component + integration
# tests, build, browser tests against the built app. Ends with one line: "N passed, N failed".
set -uo pipefail
# `bash scripts/test.sh lint [PATH…]` runs only the lint-and-format step (on PATHs, default all).
LINT_ONLY=0
if [ "${1:-}" = lint ]; then LINT_ONLY=1; shift; fi
LINT_PATHS=("${@:-.}")
# The suite sets its own addresses: nothing inherited from a demo shell may point it elsewhere.
unset DATABASE_URL DATABASE_OWNER_URL APP_URL NEXTAUTH_URL S3_ENDPOINT SMTP_HOST NEXT_DIST_DIR
# TEST_PORT_BASE moves the suite's ports (app, SMTP, catcher, S3, the faults test's PostgreSQL)
# so that two checkouts can run their suites side by side; PGPORT moves the project cluster.
b=${TEST_PORT_BASE:-}
export DB_NAME=boardwright_test S3_BUCKET=boardwright-test
export APP_PORT=${b:-3100}
export SMTP_PORT=$([ -n "$b" ] && echo $((b + 1)) || echo 2535)
export MAIL_CATCHER_URL=http://127.0.0.1:$([ -n "$b" ] && echo $((b + 2)) || echo 2536)
export S3_PORT=$([ -n "$b" ] && echo $((b + 3)) || echo 4579)
if [ -n "$b" ]; then export FAULT_PGPORT=$((b + 4)); fi
source "$(dirname "$0")/env.sh"
cd "$ROOT"
set -e

bash scripts/install.sh

# Lint and format first: no services needed, about a minute of CPU. A failure fails the run,
# after the tests have still run (their figures are worth having).
lint_status=0
echo "== lint (eslint) and format (prettier)"
if ! node_modules/.bin/eslint --max-warnings 0 "${LINT_PATHS[@]}"; then
  lint_status=1
  echo "eslint found problems (npm run lint)" >&2
fi
if ! node_modules/.bin/prettier --check --log-level warn "${LINT_PATHS[@]}"; then
  lint_status=1
  echo "prettier would reformat the files above (npm run format)" >&2
fi
if [ "$LINT_ONLY" = 1 ]; then
  [ "$lint_status" = 0 ] && echo "lint and format: clean"
  exit "$lint_status"
fi
if [ ! -x /usr/bin/chromium ]; then
  if [ "$(id -u)" = 0 ]; then
    echo "Installing Debian's chromium for the browser tests…"
    apt-get update -qq && DEBIAN_FRONTEND=noninteractive apt-get install -y -qq chromium >/dev/null
  else
    echo "The browser tests need Debian's chromium: run 'apt-get install chromium' as root." >&2
    exit 1
  fi
fi

PG_WAS_UP=0
bash scripts/pg.sh status >/dev/null 2>&1 && PG_WAS_UP=1
bash scripts/pg.sh start
bash scripts/pg.sh dropdb "$DB_NAME" >/dev/null
bash scripts/pg.sh createdb "$DB_NAME"
# Fresh mail and object stores: stop the fakes first, their files are open.
bash scripts/services.sh stop
rm -rf "$DATA_DIR/mail-$SMTP_PORT" "$DATA_DIR/s3-$S3_PORT"
bash scripts/services.sh start

RESULTS=$DATA_DIR/test-results
rm -rf "$RESULTS"; mkdir -p "$RESULTS"
APP_PID=
cleanup() {
  trap - EXIT INT TERM
  [ -n "$APP_PID" ] && kill -- -"$APP_PID" 2>/dev/null || true
  bash scripts/services.sh stop || true
  # Stop PostgreSQL only if this run started it (a running demo keeps its database).
  [ "$PG_WAS_UP" = 1 ] || bash scripts/pg.sh stop || true
}
trap cleanup EXIT INT TERM
set +e

node_modules/.bin/tsx scripts/migrate.ts up || exit 1
node_modules/.bin/tsx scripts/seed.ts >/dev/null || exit 1

status=0
echo "== unit, component and integration tests"
node_modules/.bin/vitest run --project unit --project components --project integration \
  --reporter=default --reporter=json --outputFile.json="$RESULTS/fast.json" || status=1

echo "== build"
if npm run --silent build > "$RESULTS/build.log" 2>&1; then
  node scripts/first-load-js.mjs || true
  echo "== browser tests (chromium against the built app on $APP_URL)"
  setsid bash scripts/serve.sh -H 127.0.0.1 -p "$APP_PORT" > "$RESULTS/server.log" 2>&1 &
  APP_PID=$!
  export APP_PID
  for _ in $(seq 1 100); do
    curl -fsS -o /dev/null "$APP_URL/login" && break
    sleep 0.2
  done
  node_modules/.bin/vitest run --project browser \
    --reporter=default --reporter=json --outputFile.json="$RESULTS/browser.json" || status=1
else
  tail -40 "$RESULTS/build.log"
  echo "next build failed" >&2
  status=1
fi

[ "$lint_status" = 0 ] || { echo "lint or format failed (see the top of this run)" >&2; status=1; }
node scripts/count-results.mjs "$RESULTS"/fast.json "$RESULTS"/browser.json || status=1
exit $status
