# Services and an empty, migrated database for tests and service benchmarks (sourced).
# Ports and data of their own, so a running `npm start` is never touched.
source scripts/lib/setup.sh

TF_DATA=${TF_DATA:-.data/test}
TF_PG_PORT=${TF_TEST_PG_PORT:-55433}
TF_REDIS_PORT=${TF_TEST_REDIS_PORT:-56380}
TF_DB=timefield_test
TF_REDIS_DURABLE=0

start_test_services() {
  ensure_system_packages "$@"
  ensure_node_modules
  resolve_data_dir
  start_postgres
  start_redis
  export_service_env
  # Tests that restart a service find it again through these.
  export TF_DATA TF_PG_PORT TF_REDIS_PORT TF_DB
  export NODE_ENV=test SESSION_SECRET=test-session-secret-not-for-production
  trap 'stop_redis; stop_postgres' EXIT
  # Start from an empty database every time.
  PGOPTIONS='--client-min-messages=warning' psql -qc 'DROP SCHEMA public CASCADE; CREATE SCHEMA public;' >/dev/null
  redis-cli -p "$TF_REDIS_PORT" flushall >/dev/null
  node --import tsx scripts/migrate.ts
}
