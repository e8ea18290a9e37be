#!/usr/bin/env bash
# npm run dev: the API under tsx watch and the Vite dev server with hot reload, proxying /api to it.
source "$(dirname "$0")/lib.sh"
cd "$ROOT"
DATA_DIR="${EMULANT_DATA_DIR:-$ROOT/.data/pg}"
ensure_node_modules
bootstrap_database "$DATA_DIR" "${EMULANT_PG_PORT:-54329}" "${EMULANT_DB_NAME:-emulant}"
npx tsx server/cli/main.ts db-setup --seed
trap 'kill 0; if [ "${PG_STARTED_BY_US:-0}" = 1 ]; then stop_postgres "$DATA_DIR"; fi' EXIT
npx tsx watch server/main.ts &
npx vite --host 127.0.0.1 --port 5173
