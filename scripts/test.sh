#!/usr/bin/env bash
# npm test: install what is missing, start a throwaway PostgreSQL on TEST_PGPORT, type-check, build
# the client, run every vitest suite (unit, reference, API, browser), remove the cluster.
source "$(dirname "$0")/lib/common.sh"
cd "$ROOT"

TEST_PGPORT="${TEST_PGPORT:-54339}"
ensure_node_modules
ensure_debian_packages postgres:postgresql chromium:chromium pdftoppm:poppler-utils

TEST_ROOT="$(mktemp -d /tmp/compline-test.XXXXXX)"
chmod 755 "$TEST_ROOT"
PGDATA_DIR="$TEST_ROOT/pg"
cleanup() {
  stop_cluster "$PGDATA_DIR"
  rm -rf "$TEST_ROOT"
}
trap cleanup EXIT

init_cluster "$PGDATA_DIR" fast
start_cluster "$PGDATA_DIR" "$TEST_PGPORT" fast
ensure_database "$TEST_PGPORT" compline_test
export DATABASE_URL="postgres://postgres@127.0.0.1:$TEST_PGPORT/compline_test"
export TEST_PGDATA="$PGDATA_DIR" TEST_PGPORT TEST_PGBIN="$PGBIN" DATA_DIR="$TEST_ROOT/data"
export NODE_ENV=test
mkdir -p "$ROOT/test-output"

# TEST_QUICK=1 (for a developer re-running a few files) skips the type-check and the client build.
if [ -z "${TEST_QUICK:-}" ]; then
  say "type-checking…"
  npx tsc --noEmit -p tsconfig.json
  say "building the client for the browser tests…"
  npx vite build --logLevel warn
fi
say "running the tests…"
npx vitest run "$@"
