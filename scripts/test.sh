#!/usr/bin/env bash
# npm test: the same set-up as npm start, on services and a database of its own,
# then every suite (unit, reference, API, end-to-end). Exits non-zero on any failure.
set -euo pipefail
cd "$(dirname "$0")/.."
source scripts/lib/test-services.sh
start_test_services chromium poppler-utils python3-segyio python3-ezdxf proj-bin

log "type-checking"
npx tsc --noEmit -p tsconfig.json
log "building the client (the end-to-end suite serves it)"
npx vite build --logLevel error
status=0
npx vitest run --reporter=default --reporter=json --outputFile.json="$TF_DATA/vitest.json" "$@" || status=$?
# One plain closing line that any CI reader understands.
node -e 'const r=require(process.argv[1]);console.log(`tests: ${r.numPassedTests} passed, ${r.numFailedTests} failed, ${r.numPendingTests+r.numTodoTests} skipped`)' "$TF_DATA/vitest.json" || true
exit $status
