#!/usr/bin/env bash
# npm start: everything a fresh machine needs, then the product on http://127.0.0.1:3000.
source "$(dirname "$0")/lib.sh"
cd "$ROOT"
DATA_DIR="${EMULANT_DATA_DIR:-$ROOT/.data/pg}"
ensure_node_modules
bootstrap_database "$DATA_DIR" "${EMULANT_PG_PORT:-54329}" "${EMULANT_DB_NAME:-emulant}"
cleanup() { if [ "${PG_STARTED_BY_US:-0}" = 1 ]; then stop_postgres "$DATA_DIR"; fi; }
trap cleanup EXIT
trap 'exit 130' INT TERM
npx tsx server/cli/main.ts db-setup --seed
log "building the client"
npx vite build --logLevel warn
# Not exec: the EXIT trap must run after the server stops so the cluster we started is stopped too.
node --import tsx server/main.ts &
SERVER_PID=$!
trap 'kill -TERM $SERVER_PID 2>/dev/null; wait $SERVER_PID; exit 130' INT TERM
wait $SERVER_PID
