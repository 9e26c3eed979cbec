#!/usr/bin/env bash
# npm run dev: the same database and API as npm start, with Vite's hot reload on :5173 (proxying /api).
source "$(dirname "$0")/lib/common.sh"
cd "$ROOT"
PORT="${PORT:-3000}"; PGPORT="${PGPORT:-54329}"
export PORT PGPORT NODE_ENV=development
ensure_node_modules
PGDATA_DIR=""
if [ -z "${DATABASE_URL:-}" ]; then
  ensure_debian_packages postgres:postgresql
  PGDATA_DIR="$(pick_pgdata "$ROOT/.data/pg" data)"
  init_cluster "$PGDATA_DIR"
  start_cluster "$PGDATA_DIR" "$PGPORT"
  ensure_database "$PGPORT" compline
  export DATABASE_URL="postgres://postgres@127.0.0.1:$PGPORT/compline"
fi
# Stop the API and Vite (this script's own jobs), wait for them, then stop PostgreSQL.
cleanup() {
  trap - INT TERM EXIT
  kill $(jobs -p) 2>/dev/null || true
  wait 2>/dev/null || true
  if [ -n "$PGDATA_DIR" ]; then stop_cluster "$PGDATA_DIR"; fi
}
trap cleanup EXIT; trap 'exit 130' INT; trap 'exit 143' TERM
npx tsx db/seed/run.ts
npx tsx watch server/index.ts &
npx vite --host 127.0.0.1 &
say "open http://127.0.0.1:5173 (API on :$PORT)"
wait
