#!/usr/bin/env bash
# Installs the npm packages from the lock file when they are missing or out of date.
set -euo pipefail
cd "$(dirname "$0")/.."
if [ ! -f node_modules/.package-lock.json ] || [ package-lock.json -nt node_modules/.package-lock.json ]; then
  echo "Installing npm packages (npm ci)…"
  npm ci --no-audit --no-fund --loglevel=error
fi
