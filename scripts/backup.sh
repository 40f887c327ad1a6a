#!/usr/bin/env bash
# scripts/backup.sh [FILE] — a backup of the app database (DATABASE_OWNER_URL, else DATABASE_URL, from scripts/env.sh) in
# pg_dump's custom format, to FILE or to .data/backups/<database>-<UTC time>.dump. The file is
# written under a temporary name and checked with pg_restore --list before it takes its name.
# Photos live in object storage (S3), not in the database: they are copied beside the dump, to
# FILE.files (scripts/files.ts backup: every object but the stored prints, with a manifest).
set -euo pipefail
source "$(dirname "$0")/env.sh"

# The client binaries of the same PostgreSQL as scripts/pg.sh (pg_dump must not be older than the server)
PGBIN=${PGBIN:-$(ls -d /usr/lib/postgresql/*/bin 2>/dev/null | sort -V | tail -1)}
if [ -z "$PGBIN" ] || [ ! -x "$PGBIN/pg_dump" ]; then
  echo "pg_dump not found (looked in ${PGBIN:-/usr/lib/postgresql/*/bin}); install postgresql or set PGBIN." >&2
  exit 1
fi

URL=${DATABASE_OWNER_URL:-$DATABASE_URL}
DB=${URL##*/}
DB=${DB%%\?*}
OUT=${1:-$DATA_DIR/backups/$DB-$(date -u +%Y%m%dT%H%M%SZ).dump}
mkdir -p "$(dirname "$OUT")"

# Dump over TCP as the database's owner; owner and grants are left out so the file restores
# under any role (scripts/restore.sh gives the app role its grants again)
"$PGBIN/pg_dump" --format=custom --no-owner --no-privileges --file="$OUT.partial" --dbname="$URL"
"$PGBIN/pg_restore" --list "$OUT.partial" >/dev/null
mv "$OUT.partial" "$OUT"
echo "Backed up database $DB to $OUT ($(du -h "$OUT" | cut -f1))"
(cd "$ROOT" && node_modules/.bin/tsx scripts/files.ts backup "$OUT.files")
