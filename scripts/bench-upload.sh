#!/usr/bin/env bash
# npm run bench:upload — a 100 000-pick file through the real API into PostgreSQL, end to end.
set -euo pipefail
cd "$(dirname "$0")/.."
source scripts/lib/test-services.sh
start_test_services
node --import tsx scripts/bench-upload.ts "$@"
