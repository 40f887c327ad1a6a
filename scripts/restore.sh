#!/usr/bin/env bash
# scripts/restore.sh FILE [DATABASE] [--yes] — restores a backup made by scripts/backup.sh into
# the app database (from DATABASE_OWNER_URL, else DATABASE_URL) or into DATABASE on the same server, created if missing.
# The restore runs in one transaction: it lands whole or not at all. Replacing a database that
# holds tables needs --yes (or typing its name at the prompt). Stop the app first.
# Restoring into the app database also puts back the photos copied beside the dump (FILE.files,
# scripts/files.ts restore); into another database, it says how to put them back.
set -euo pipefail
source "$(dirname "$0")/env.sh"

usage() { echo "usage: scripts/restore.sh FILE [DATABASE] [--yes]" >&2; exit 2; }
YES=0
ARGS=()
for a in "$@"; do
  case "$a" in
    --yes) YES=1 ;;
    -h|--help) usage ;;
    *) ARGS+=("$a") ;;
  esac
done
[ "${#ARGS[@]}" -ge 1 ] && [ "${#ARGS[@]}" -le 2 ] || usage
FILE=${ARGS[0]}
URL=${DATABASE_OWNER_URL:-$DATABASE_URL}
APP_DB=${URL##*/}
APP_DB=${APP_DB%%\?*}
TARGET=${ARGS[1]:-$APP_DB}
if ! [[ "$TARGET" =~ ^[A-Za-z0-9_]{1,63}$ ]]; then
  echo "The database name may hold letters, digits and _ only: $TARGET" >&2
  exit 2
fi

PGBIN=${PGBIN:-$(ls -d /usr/lib/postgresql/*/bin 2>/dev/null | sort -V | tail -1)}
if [ -z "$PGBIN" ] || [ ! -x "$PGBIN/pg_restore" ]; then
  echo "pg_restore not found (looked in ${PGBIN:-/usr/lib/postgresql/*/bin}); install postgresql or set PGBIN." >&2
  exit 1
fi
[ -f "$FILE" ] || { echo "No such backup file: $FILE" >&2; exit 1; }
"$PGBIN/pg_restore" --list "$FILE" >/dev/null 2>&1 || { echo "Not a pg_dump custom-format file: $FILE" >&2; exit 1; }

# Same server, as the database's owner; the target database swapped in
BASE=${URL%/*}
QUERY=""
[[ "$URL" == *\?* ]] && QUERY="?${URL#*\?}"
ADMIN_URL="$BASE/postgres$QUERY"
TARGET_URL="$BASE/$TARGET$QUERY"
PSQL=("$PGBIN/psql" -X -q -v ON_ERROR_STOP=1)

# Create the target when missing; ask before replacing one that holds tables
if [ "$("${PSQL[@]}" "$ADMIN_URL" -tAc "select 1 from pg_database where datname = '$TARGET'")" != 1 ]; then
  "${PSQL[@]}" "$ADMIN_URL" -c "create database \"$TARGET\""
  echo "Created database $TARGET"
else
  TABLES=$("${PSQL[@]}" "$TARGET_URL" -tAc "select count(*) from information_schema.tables where table_schema = 'public'")
  if [ "$TABLES" != 0 ] && [ "$YES" != 1 ]; then
    if [ -t 0 ]; then
      read -r -p "Database $TARGET holds $TABLES tables that the backup will replace. Type its name to go on: " ANSWER
      [ "$ANSWER" = "$TARGET" ] || { echo "Not restored." >&2; exit 1; }
    else
      echo "Database $TARGET holds $TABLES tables; add --yes to replace them with the backup." >&2
      exit 1
    fi
  fi
fi

# Drop what the backup holds and recreate it, in a single transaction
"$PGBIN/pg_restore" --clean --if-exists --no-owner --no-privileges --single-transaction --exit-on-error \
  --dbname="$TARGET_URL" "$FILE"
echo "Restored $FILE into database $TARGET"
# The backup holds no grants: the app role gets its own again (lib/db-roles.ts)
(cd "$ROOT" && DATABASE_OWNER_URL="$TARGET_URL" node_modules/.bin/tsx scripts/migrate.ts grants)
if [ -d "$FILE.files" ]; then
  if [ "$TARGET" = "$APP_DB" ]; then
    (cd "$ROOT" && node_modules/.bin/tsx scripts/files.ts restore "$FILE.files")
  else
    echo "The photos in $FILE.files were not put back (a restore into another database than the app's):"
    echo "  node_modules/.bin/tsx scripts/files.ts restore $FILE.files"
  fi
fi
