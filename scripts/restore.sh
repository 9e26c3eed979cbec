#!/usr/bin/env bash
# Restore a backup made by backup.sh into an EMPTY database and an empty (or absent) data folder.
#   DATABASE_URL=postgres://…/empty_db DATA_DIR=/path scripts/restore.sh ARCHIVE
# Refuses to overwrite: a database that already has tables, or a photos folder with files, stops it.
source "$(dirname "$0")/lib/common.sh"
ARCHIVE="${1:?usage: restore.sh ARCHIVE}"
ARCHIVE="$(cd "$(dirname "$ARCHIVE")" && pwd)/$(basename "$ARCHIVE")"
cd "$ROOT"
DATABASE_URL="${DATABASE_URL:?set DATABASE_URL to the empty database to restore into}"
DATA_DIR="${DATA_DIR:?set DATA_DIR to the data folder to restore photos into}"

tables="$("$PGBIN/psql" "$DATABASE_URL" -tAc "select count(*) from information_schema.tables where table_schema in ('public','drizzle')")"
if [ "$tables" != "0" ]; then say "refusing: the target database already has $tables tables"; exit 1; fi
if [ -d "$DATA_DIR/photos" ] && [ -n "$(ls -A "$DATA_DIR/photos" 2>/dev/null)" ]; then say "refusing: $DATA_DIR/photos is not empty"; exit 1; fi

WORK="$(mktemp -d)"
trap 'rm -rf "$WORK"' EXIT
tar -C "$WORK" -xzf "$ARCHIVE"
[ -f "$WORK/database.dump" ] || { say "not a Compline backup: no database.dump in $ARCHIVE"; exit 1; }
"$PGBIN/pg_restore" --no-owner --exit-on-error --single-transaction --dbname="$DATABASE_URL" "$WORK/database.dump"
mkdir -p "$DATA_DIR/photos"
cp -a "$WORK/photos/." "$DATA_DIR/photos/"
say "restored $ARCHIVE into ${DATABASE_URL%%\?*} and $DATA_DIR"
