#!/usr/bin/env bash
# npm run bench: every benchmark against a throwaway PostgreSQL (BENCH_PGPORT), figures printed and
# gathered into docs/performance.md. Benchmarks print figures; they never fail on a time limit.
source "$(dirname "$0")/lib/common.sh"
cd "$ROOT"
BENCH_PGPORT="${BENCH_PGPORT:-54349}"
ensure_node_modules
ensure_debian_packages postgres:postgresql chromium:chromium wrk:wrk
BENCH_ROOT="$(mktemp -d /tmp/compline-bench.XXXXXX)"; chmod 755 "$BENCH_ROOT"
PGDATA_DIR="$BENCH_ROOT/pg"
cleanup() { stop_cluster "$PGDATA_DIR"; rm -rf "$BENCH_ROOT"; }
trap cleanup EXIT
init_cluster "$PGDATA_DIR"
start_cluster "$PGDATA_DIR" "$BENCH_PGPORT"
ensure_database "$BENCH_PGPORT" compline_bench
export DATABASE_URL="postgres://postgres@127.0.0.1:$BENCH_PGPORT/compline_bench" DATA_DIR="$BENCH_ROOT/data" NODE_ENV=production
npx tsx db/seed/run.ts
npx vite build --logLevel warn
for bench in ${BENCH_ONLY:-analysis photo-pipeline bundle import explain analysis-endpoint comp-map analysis-page}; do
  say "benchmark: $bench"
  node --import tsx --expose-gc "scripts/bench/$bench.bench.ts"
done
npx tsx scripts/bench/write-report.ts
