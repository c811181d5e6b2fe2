#!/usr/bin/env bash
# npm test: the same set-up as npm start, on services and a database of its own,
# then every suite (unit, reference, API, end-to-end). Exits non-zero on any failure.
set -euo pipefail
cd "$(dirname "$0")/.."
source scripts/lib/setup.sh

TF_DATA=${TF_DATA:-.data/test}
TF_PG_PORT=${TF_TEST_PG_PORT:-55433}
TF_REDIS_PORT=${TF_TEST_REDIS_PORT:-56380}
TF_DB=timefield_test
TF_REDIS_DURABLE=0

ensure_system_packages chromium poppler-utils
ensure_node_modules
resolve_data_dir
start_postgres
start_redis
export_service_env
export NODE_ENV=test SESSION_SECRET=test-session-secret-not-for-production
trap 'stop_redis; stop_postgres' EXIT

# Start from an empty test database every time.
psql -qc 'DROP SCHEMA public CASCADE; CREATE SCHEMA public;' >/dev/null
redis-cli -p "$TF_REDIS_PORT" flushall >/dev/null
node --import tsx scripts/migrate.ts
log "type-checking"
npx tsc --noEmit -p tsconfig.json
log "building the client (the end-to-end suite serves it)"
npx vite build --logLevel error
status=0
npx vitest run --reporter=default --reporter=json --outputFile.json="$TF_DATA/vitest.json" "$@" || status=$?
# One plain closing line that any CI reader understands.
node -e 'const r=require(process.argv[1]);console.log(`tests: ${r.numPassedTests} passed, ${r.numFailedTests} failed, ${r.numPendingTests+r.numTodoTests} skipped`)' "$TF_DATA/vitest.json" || true
exit $status
