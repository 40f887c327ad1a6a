#!/usr/bin/env bash
# Sourced by the bench scripts: builds the app into ${NEXT_DIST_DIR:-.next} when there is no
# build there, or when the source changed since it was made (a stale build measures old code).
DIST=${NEXT_DIST_DIR:-.next}
if [ ! -f "$DIST/BUILD_ID" ] || [ ! -f "$DIST/print-worker.mjs" ] || [ ! -f "$DIST/presize-worker.mjs" ] ||
  [ -n "$(find app components features lib models package.json next.config.ts proxy.ts instrumentation.ts -newer "$DIST/BUILD_ID" -print -quit)" ]; then
  # One build at a time on this machine: wait for any other to finish first
  while pgrep -f "next build" >/dev/null; do echo "waiting for another next build to finish…"; sleep 5; done
  npm run --silent build
fi
