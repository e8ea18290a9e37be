#!/usr/bin/env bash
# npm run bench:runs: the run-queue benchmark needs a database; like npm test it brings up the project-local test
# cluster (its own database, emulant_bench) unless DATABASE_URL is set, and stops what it started.
source "$(dirname "$0")/lib.sh"
cd "$ROOT"
DATA_DIR="${EMULANT_TEST_DATA_DIR:-$ROOT/.data/pg-test}"
ensure_node_modules
bootstrap_database "$DATA_DIR" "${EMULANT_TEST_PG_PORT:-54330}" emulant_bench
cleanup() { if [ "${PG_STARTED_BY_US:-0}" = 1 ]; then stop_postgres "$DATA_DIR"; fi; }
trap cleanup EXIT
npx tsx server/cli/main.ts db-setup
npx tsx tests/bench/runs.bench.ts
