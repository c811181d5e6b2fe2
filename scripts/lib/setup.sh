# Shared set-up for scripts/start.sh and scripts/test.sh (sourced, not run).
# Installs what is missing, then starts PostgreSQL and Redis on loopback in a data folder
# of the checkout. Callers set TF_DATA, TF_PG_PORT, TF_REDIS_PORT, TF_DB and TF_REDIS_DURABLE.

PG_BIN=/usr/lib/postgresql/15/bin
APT_UPDATED=0

log() { printf '\033[1m[timefield]\033[0m %s\n' "$*"; }

as_root() { if [ "$(id -u)" = 0 ]; then "$@"; else sudo "$@"; fi; }

apt_install() {
  if [ "$APT_UPDATED" = 0 ]; then
    log "apt-get update"
    as_root apt-get update -qq
    APT_UPDATED=1
  fi
  log "installing $*"
  DEBIAN_FRONTEND=noninteractive as_root apt-get install -y -qq --no-install-recommends "$@" >/dev/null
}

# Debian packages this project needs; each only when absent.
ensure_system_packages() {
  local missing=()
  [ -x "$PG_BIN/initdb" ] || missing+=(postgresql)
  command -v redis-server >/dev/null || missing+=(redis-server)
  for extra in "$@"; do
    case "$extra" in
      chromium) command -v chromium >/dev/null || missing+=(chromium) ;;
      poppler-utils) command -v pdftotext >/dev/null || missing+=(poppler-utils) ;;
      # Only the SEG-Y reference tests use it (a writer to check our reader against); the product never does.
      python3-segyio) /usr/bin/python3 -c 'import segyio' 2>/dev/null || missing+=(python3-segyio) ;;
      # Outside checks of the exports (issue 19): a DXF reader and the PROJ command line; the product uses neither.
      python3-ezdxf) /usr/bin/python3 -c 'import ezdxf' 2>/dev/null || missing+=(python3-ezdxf) ;;
      proj-bin) command -v cs2cs >/dev/null || missing+=(proj-bin) ;;
    esac
  done
  if [ ${#missing[@]} -gt 0 ]; then apt_install "${missing[@]}"; fi
}

# npm ci when node_modules is missing or older than the lock file.
ensure_node_modules() {
  if [ ! -f node_modules/.package-lock.json ] || [ package-lock.json -nt node_modules/.package-lock.json ]; then
    log "npm ci"
    npm ci --no-audit --no-fund --loglevel=error
  fi
}

# PostgreSQL refuses to run as root: run its tools as the postgres user when we are root.
pg_run() {
  if [ "$(id -u)" = 0 ]; then runuser -u postgres -- "$@"; else "$@"; fi
}

# The postgres user must be able to reach the data folder; when a parent directory is
# closed to it, fall back to a folder under /var/tmp keyed by this checkout's path.
resolve_data_dir() {
  mkdir -p "$TF_DATA"
  TF_DATA=$(cd "$TF_DATA" && pwd)
  if [ "$(id -u)" = 0 ] && ! runuser -u postgres -- test -x "$TF_DATA"; then
    local alt="/var/tmp/timefield-$(printf '%s' "$TF_DATA" | md5sum | cut -c1-10)"
    log "postgres cannot reach $TF_DATA; using $alt for the database files"
    TF_DATA=$alt
    mkdir -p "$TF_DATA"
  fi
}

start_postgres() {
  local dir="$TF_DATA/pg"
  mkdir -p "$dir"
  [ "$(id -u)" = 0 ] && chown postgres:postgres "$dir"
  if [ ! -f "$dir/data/PG_VERSION" ]; then
    log "initialising PostgreSQL cluster in $dir/data"
    pg_run "$PG_BIN/initdb" -D "$dir/data" -U postgres --auth-local=trust --auth-host=trust \
      -E UTF8 --locale=C.UTF-8 >/dev/null
  fi
  if pg_run "$PG_BIN/pg_ctl" -D "$dir/data" status >/dev/null 2>&1; then
    log "PostgreSQL already running on 127.0.0.1:$TF_PG_PORT"
  else
    rm -f "$dir/data/postmaster.pid"
    pg_run "$PG_BIN/pg_ctl" -D "$dir/data" -l "$dir/server.log" -w -t 60 \
      -o "-p $TF_PG_PORT -c listen_addresses=127.0.0.1 -k $dir" start >/dev/null
    log "PostgreSQL on 127.0.0.1:$TF_PG_PORT"
  fi
  "$PG_BIN/pg_isready" -q -h 127.0.0.1 -p "$TF_PG_PORT" -t 30
  if ! psql -h 127.0.0.1 -p "$TF_PG_PORT" -U postgres -tAc "SELECT 1 FROM pg_database WHERE datname='$TF_DB'" | grep -q 1; then
    psql -h 127.0.0.1 -p "$TF_PG_PORT" -U postgres -qc "CREATE DATABASE \"$TF_DB\"" >/dev/null
    log "created database $TF_DB"
  fi
}

stop_postgres() {
  pg_run "$PG_BIN/pg_ctl" -D "$TF_DATA/pg/data" -m fast -w stop >/dev/null 2>&1 || true
}

start_redis() {
  local dir="$TF_DATA/redis"
  mkdir -p "$dir"
  if redis-cli -h 127.0.0.1 -p "$TF_REDIS_PORT" ping 2>/dev/null | grep -q PONG; then
    log "Redis already running on 127.0.0.1:$TF_REDIS_PORT"
    return
  fi
  # Queued jobs must survive a restart of the product, so npm start keeps an append-only file.
  local persistence=(--save '' --appendonly no)
  [ "${TF_REDIS_DURABLE:-0}" = 1 ] && persistence=(--appendonly yes --appendfsync everysec)
  redis-server --bind 127.0.0.1 --port "$TF_REDIS_PORT" "${persistence[@]}" --daemonize yes \
    --dir "$dir" --pidfile "$dir/redis.pid" --logfile "$dir/redis.log" --maxmemory-policy noeviction
  for _ in $(seq 1 50); do
    redis-cli -h 127.0.0.1 -p "$TF_REDIS_PORT" ping 2>/dev/null | grep -q PONG && break
    sleep 0.1
  done
  log "Redis on 127.0.0.1:$TF_REDIS_PORT"
}

stop_redis() {
  redis-cli -h 127.0.0.1 -p "$TF_REDIS_PORT" shutdown nosave >/dev/null 2>&1 || true
}

export_service_env() {
  export PGHOST=127.0.0.1 PGPORT="$TF_PG_PORT" PGUSER=postgres PGDATABASE="$TF_DB"
  export REDIS_URL="redis://127.0.0.1:$TF_REDIS_PORT"
}
