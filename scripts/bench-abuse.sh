#!/usr/bin/env bash
# npm run bench:abuse: starts the product as its own process (own database emulant_abuse on the test cluster, demo
# seeded, one in-process worker), then fires hostile and careless inputs at it from a second process while that
# process measures /api/health latency. Prints figures; asserts nothing. BENCH_URL skips the start-up and uses a
# server that is already running (signed in with the seeded demo accounts).
source "$(dirname "$0")/lib.sh"
cd "$ROOT"
DATA_DIR="${EMULANT_TEST_DATA_DIR:-$ROOT/.data/pg-test}"
ensure_node_modules
if [ -z "${BENCH_URL:-}" ]; then
  bootstrap_database "$DATA_DIR" "${EMULANT_TEST_PG_PORT:-54330}" emulant_abuse
  SERVER_PID=""
  cleanup() {
    if [ -n "$SERVER_PID" ]; then kill -TERM "$SERVER_PID" 2>/dev/null; wait "$SERVER_PID" 2>/dev/null; fi
    if [ "${PG_STARTED_BY_US:-0}" = 1 ]; then stop_postgres "$DATA_DIR"; fi
  }
  trap cleanup EXIT
  npx tsx server/cli/main.ts db-setup --reset --seed
  port="${EMULANT_ABUSE_PORT:-3199}"
  LOG_LEVEL=error PORT="$port" node --import tsx server/main.ts >/dev/null &
  SERVER_PID=$!
  export BENCH_URL="http://127.0.0.1:$port"
fi
npx tsx tests/bench/abuse.bench.ts
