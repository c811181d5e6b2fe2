#!/usr/bin/env bash
# Benchmarks that need PostgreSQL and Redis (npm run bench:upload, npm run bench:runs):
# the test services on ports of their own, an empty database, then the given script.
set -euo pipefail
cd "$(dirname "$0")/.."
source scripts/lib/test-services.sh
start_test_services
node --import tsx "$@"
