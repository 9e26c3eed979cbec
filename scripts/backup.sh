#!/usr/bin/env bash
# Backup: pg_dump (custom format) of DATABASE_URL plus the photos folder, in one timestamped archive.
#   scripts/backup.sh [OUTPUT_DIR]      (default: backups/)
# DATABASE_URL defaults to the local cluster of npm start; DATA_DIR to .data.
source "$(dirname "$0")/lib/common.sh"
cd "$ROOT"
DATABASE_URL="${DATABASE_URL:-postgres://postgres@127.0.0.1:${PGPORT:-54329}/compline}"
DATA_DIR="${DATA_DIR:-.data}"
OUT_DIR="${1:-backups}"
mkdir -p "$OUT_DIR"
STAMP="$(date -u +%Y%m%dT%H%M%SZ)"
WORK="$(mktemp -d)"
trap 'rm -rf "$WORK"' EXIT

"$PGBIN/pg_dump" --format=custom --no-owner --dbname="$DATABASE_URL" --file="$WORK/database.dump"
mkdir -p "$WORK/photos"
if [ -d "$DATA_DIR/photos" ]; then cp -a "$DATA_DIR/photos/." "$WORK/photos/"; fi
printf 'compline backup\ncreated %s\ndatabase %s\n' "$STAMP" "${DATABASE_URL%%\?*}" | sed 's#//[^@]*@#//#' > "$WORK/MANIFEST"
ARCHIVE="$OUT_DIR/compline-backup-$STAMP.tar.gz"
tar -C "$WORK" -czf "$ARCHIVE.partial" MANIFEST database.dump photos
mv "$ARCHIVE.partial" "$ARCHIVE"
say "backup written: $ARCHIVE ($(du -h "$ARCHIVE" | cut -f1))"
echo "$ARCHIVE"
