#!/usr/bin/env bash
# npm start: install what is missing, run PostgreSQL under .data/, migrate, seed the demo, build the
# client, serve app and API on one port. Ctrl-C or SIGTERM stops the server, then the database.
source "$(dirname "$0")/lib/common.sh"
cd "$ROOT"

PORT="${PORT:-3000}"
PGPORT="${PGPORT:-54329}"
export PORT PGPORT NODE_ENV="${NODE_ENV:-production}"

ensure_node_modules

PGDATA_DIR=""
if [ -z "${DATABASE_URL:-}" ]; then
  ensure_debian_packages postgres:postgresql
  PGDATA_DIR="$(pick_pgdata "$ROOT/.data/pg" data)"
  init_cluster "$PGDATA_DIR"
  start_cluster "$PGDATA_DIR" "$PGPORT"
  ensure_database "$PGPORT" compline
  export DATABASE_URL="postgres://postgres@127.0.0.1:$PGPORT/compline"
  say "PostgreSQL is running on 127.0.0.1:$PGPORT (data in $PGDATA_DIR)"
else
  say "using DATABASE_URL; no local cluster started"
fi

SERVER_PID=""
stop_all() {
  trap - INT TERM EXIT
  if [ -n "$SERVER_PID" ] && kill -0 "$SERVER_PID" 2>/dev/null; then
    kill -TERM "$SERVER_PID" 2>/dev/null || true
    wait "$SERVER_PID" 2>/dev/null || true
  fi
  if [ -n "$PGDATA_DIR" ]; then
    say "stopping PostgreSQL…"
    stop_cluster "$PGDATA_DIR"
  fi
}
trap stop_all EXIT
trap 'exit 130' INT
trap 'exit 143' TERM

say "applying migrations and seeding the Port Ellery demo…"
npx tsx db/seed/run.ts
say "building the client…"
npx vite build --logLevel warn
node --import tsx server/index.ts &
SERVER_PID=$!
wait "$SERVER_PID"
