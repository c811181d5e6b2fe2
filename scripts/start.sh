#!/usr/bin/env bash
# npm start: install what is missing, start PostgreSQL and Redis on loopback, migrate,
# seed the demo scenario, build the client, then run the API and the worker until Ctrl-C.
set -euo pipefail
cd "$(dirname "$0")/.."
source scripts/lib/setup.sh
source scripts/lib/supervise.sh

TF_DATA=${TF_DATA:-.data/dev}
TF_PG_PORT=${TF_PG_PORT:-55432}
TF_REDIS_PORT=${TF_REDIS_PORT:-56379}
TF_DB=${TF_DB:-timefield}
TF_REDIS_DURABLE=1
PORT=${PORT:-8080}

ensure_system_packages
ensure_node_modules
resolve_data_dir
start_postgres
start_redis
export_service_env
export PORT NODE_ENV=production
# Mail goes to the local sink inside the API (admin's outbox page) unless a real SMTP service is set.
[ -n "${SMTP_HOST:-}" ] || export MAIL_SINK_PORT=${MAIL_SINK_PORT:-2525} SMTP_PORT=${MAIL_SINK_PORT:-2525}
# A stable session secret per checkout, so sign-ins survive a restart.
[ -f "$TF_DATA/session-secret" ] || node -e "console.log(require('crypto').randomBytes(32).toString('hex'))" > "$TF_DATA/session-secret"
export SESSION_SECRET=${SESSION_SECRET:-$(cat "$TF_DATA/session-secret")}

node --import tsx scripts/migrate.ts
node --import tsx scripts/seed.ts --only-in-demo-mode
log "building the client"
npx vite build --logLevel error

pids=()
shutdown() {
  trap - INT TERM EXIT
  log "stopping"
  for pid in "${pids[@]}"; do kill -TERM "$pid" 2>/dev/null || true; done
  wait 2>/dev/null || true
  stop_redis
  stop_postgres
  log "stopped"
}
trap shutdown INT TERM EXIT

# TF_WORKERS worker processes (default 1), each started again whenever it stops (crash, out of
# memory, killed); /api/health shows "worker" not ok until one is back. The API keeps answering meanwhile.
workers=${TF_WORKERS:-1}
[[ "$workers" =~ ^[1-9][0-9]*$ ]] || { log "TF_WORKERS must be a whole number from 1 (got '$workers')"; exit 2; }
for _ in $(seq 1 "$workers"); do
  ( supervise worker node --import tsx worker/index.ts ) & pids+=($!)
done
node --import tsx server/index.ts & api=$! pids+=($!)

for _ in $(seq 1 100); do
  curl -sf "http://127.0.0.1:$PORT/api/health" >/dev/null 2>&1 && break
  sleep 0.2
done
# In demo mode the worker also makes the demo's finished run and shared report (once; later starts skip it).
( node --import tsx scripts/demo-finish.ts ) & pids+=($!)
printf '\n  Timefield is running at http://%s:%s\n\n' "${HOST:-127.0.0.1}" "$PORT"
# The demo accounts exist only in local demo mode (server/config.ts decides, for the seed and here).
if node --import tsx -e "import('./server/config.ts').then((c) => process.exit(c.isLocalDemoMode(process.env) ? 0 : 1))"; then
  cat <<MSG
  Demo sign-ins (local demo only; password for all: timefield-demo)
    admin@timefield.test   administrator
    geo@timefield.test     geophysicist
    tech@timefield.test    field technician
    lead@timefield.test    project lead
    client@timefield.test  client

MSG
else
  printf '  No demo accounts here (not local demo mode). Create the first administrator with\n  npm run create-admin -- --email you@example.org --name "Your Name"\n\n'
fi
printf '  Press Ctrl-C to stop.\n\n'
# Stop everything if the API exits on its own.
wait "$api" || true
