#!/usr/bin/env bash
# npm test: the same bootstrapping as npm start against its own cluster and database, then every test project
# (unit, API against the real PostgreSQL, browser end-to-end), ending with one plain summary line.
source "$(dirname "$0")/lib.sh"
cd "$ROOT"
DATA_DIR="${EMULANT_TEST_DATA_DIR:-$ROOT/.data/pg-test}"
ensure_node_modules
if [ ! -x /usr/bin/chromium ]; then log "installing Chromium for browser tests"; apt_install chromium; fi
if ! /usr/bin/python3 -c 'import libsbml' 2>/dev/null; then log "installing libSBML for SBML-qual checks"; apt_install python3-sbml5; fi
bootstrap_database "$DATA_DIR" "${EMULANT_TEST_PG_PORT:-54330}" "${EMULANT_TEST_DB_NAME:-emulant_test}"
cleanup() { if [ "${PG_STARTED_BY_US:-0}" = 1 ]; then stop_postgres "$DATA_DIR"; fi; }
trap cleanup EXIT
export NODE_ENV=test NO_COLOR=1
npx tsx server/cli/main.ts db-setup --reset --seed
log "building the client for browser tests"
npx vite build --logLevel warn
log "typechecking"
npx tsc --noEmit -p tsconfig.json
log "linting (ESLint, then Prettier's check)"
npm run -s lint
status=0
npx vitest run --reporter=default --reporter=json --outputFile=test-report.json "$@" || status=$?
node -e '
  const r = JSON.parse(require("fs").readFileSync("test-report.json", "utf8"));
  const skipped = r.numPendingTests + r.numTodoTests;
  console.log(`${r.numPassedTests} passed, ${r.numFailedTests} failed` + (skipped ? `, ${skipped} skipped` : ""));
  if (r.numTotalTests === 0) { console.error("no test ran"); process.exit(1); }
' || status=1
exit $status
