# Shared bootstrap for `npm start` and `npm test`: installs what is missing, starts a private
# PostgreSQL cluster on loopback and the local SMTP fake. Sourced, not run.
set -euo pipefail
ROOT="$(cd "$(dirname "${BASH_SOURCE[0]}")/.." && pwd)"
DATA="$ROOT/.data"
PG_PORT="${PW_PG_PORT:-54329}"
PG_DATA="$DATA/pg"
PG_SOCK="$DATA/pg-sock"
mkdir -p "$DATA"

log() { printf '\033[1;36m[passagewright]\033[0m %s\n' "$*"; }
die() { printf '\033[1;31m[passagewright]\033[0m %s\n' "$*" >&2; exit 1; }
as_root() { if [ "$(id -u)" = 0 ]; then "$@"; else sudo "$@"; fi; }

apt_install() {
  log "installing Debian packages: $*"
  as_root env DEBIAN_FRONTEND=noninteractive apt-get update -qq
  as_root env DEBIAN_FRONTEND=noninteractive apt-get install -y -qq "$@" >/dev/null
}

pg_bin() { ls -d /usr/lib/postgresql/*/bin 2>/dev/null | sort -V | tail -n 1; }

ensure_postgres_installed() {
  [ -n "$(pg_bin)" ] && [ -x "$(pg_bin)/pg_ctl" ] || apt_install postgresql
  PGBIN="$(pg_bin)"
}

# npm ci when node_modules is missing or was installed from another lockfile (hash kept beside it).
ensure_node_modules() {
  local stamp="$ROOT/node_modules/.passagewright-lock" want
  want="$(sha256sum "$ROOT/package-lock.json" | cut -d' ' -f1)"
  if [ ! -f "$stamp" ] || [ "$(cat "$stamp")" != "$want" ]; then
    log "installing npm packages (npm ci)"
    (cd "$ROOT" && npm ci --no-audit --no-fund)
    echo "$want" > "$stamp"
  fi
}

# Runs a PostgreSQL program as the cluster owner: `postgres` when we are root, else ourselves.
pg_run() {
  if [ "$(id -u)" = 0 ]; then (cd / && runuser -u postgres -- "$@"); else "$@"; fi
}

port_in_use() { (exec 3<>"/dev/tcp/127.0.0.1/$1") 2>/dev/null; }

# As root the cluster belongs to `postgres`; when that user cannot reach the project folder
# (a checkout under a private home directory), the cluster lives in /var/tmp instead.
place_cluster_for_postgres_user() {
  [ "$(id -u)" = 0 ] || return 0
  if ! runuser -u postgres -- test -x "$DATA" 2>/dev/null; then
    local alt="/var/tmp/passagewright-$(printf '%s' "$ROOT" | sha256sum | cut -c1-12)"
    mkdir -p "$alt"
    PG_DATA="$alt/pg"; PG_SOCK="$alt/pg-sock"
    log "the postgres user cannot reach $DATA; keeping the cluster in $alt"
  fi
}

start_postgres() {
  ensure_postgres_installed
  place_cluster_for_postgres_user
  mkdir -p "$PG_SOCK"
  if [ "$(id -u)" = 0 ]; then chown postgres "$DATA" "$PG_SOCK" "$(dirname "$PG_DATA")"; [ -d "$PG_DATA" ] && chown -R postgres "$PG_DATA"; fi
  if [ ! -f "$PG_DATA/PG_VERSION" ]; then
    log "creating the database cluster in ${PG_DATA#$ROOT/}"
    mkdir -p "$PG_DATA"; [ "$(id -u)" = 0 ] && chown postgres "$PG_DATA"
    pg_run "$PGBIN/initdb" -D "$PG_DATA" -U postgres --auth=trust -E UTF8 --locale=C >/dev/null
  fi
  if pg_run "$PGBIN/pg_ctl" -D "$PG_DATA" status >/dev/null 2>&1; then
    log "PostgreSQL already running on 127.0.0.1:$PG_PORT"
    PG_STARTED_HERE=0
  else
    port_in_use "$PG_PORT" && die "port $PG_PORT is taken by another program; set PW_PG_PORT to a free port"
    pg_run "$PGBIN/pg_ctl" -D "$PG_DATA" -l "$(dirname "$PG_DATA")/pg.log" -w \
      -o "-p $PG_PORT -c listen_addresses=127.0.0.1 -k $PG_SOCK -c max_connections=200 -c fsync=${PW_PG_FSYNC:-on}" start >/dev/null
    log "PostgreSQL started on 127.0.0.1:$PG_PORT"
    PG_STARTED_HERE=1
  fi
}

stop_postgres() { pg_run "$PGBIN/pg_ctl" -D "$PG_DATA" -m fast -w stop >/dev/null 2>&1 || true; }

ensure_database() {
  local db="$1" fresh="${2:-keep}"
  local psql=("$PGBIN/psql" -h 127.0.0.1 -p "$PG_PORT" -U postgres -qAt)
  if [ "$fresh" = fresh ]; then "${psql[@]}" -c "drop database if exists \"$db\" with (force)" postgres >/dev/null; fi
  if [ -z "$("${psql[@]}" -c "select 1 from pg_database where datname='$db'" postgres)" ]; then
    "$PGBIN/createdb" -h 127.0.0.1 -p "$PG_PORT" -U postgres "$db"
    log "database $db created"
  fi
  export NUXT_DATABASE_URL="postgres://postgres@127.0.0.1:$PG_PORT/$db"
}

ensure_session_password() {
  if [ -z "${NUXT_SESSION_PASSWORD:-}" ]; then
    [ -f "$DATA/session-password" ] || node -e "process.stdout.write(require('crypto').randomBytes(32).toString('hex'))" > "$DATA/session-password"
    NUXT_SESSION_PASSWORD="$(cat "$DATA/session-password")"
    export NUXT_SESSION_PASSWORD
  fi
}

start_mail_fake() {
  local port="$1" dir="$2"
  if port_in_use "$port"; then log "SMTP fake port $port already answers; using it"; return; fi
  mkdir -p "$dir"
  node "$ROOT/scripts/mail-fake.mjs" --port "$port" --dir "$dir" >"$DATA/mail-fake-$port.log" 2>&1 &
  MAIL_PID=$!
  for _ in $(seq 50); do port_in_use "$port" && break; sleep 0.1; done
  log "SMTP fake listening on 127.0.0.1:$port (messages kept in ${dir#$ROOT/})"
}

run_db() { node "$ROOT/node_modules/jiti/lib/jiti-cli.mjs" "$ROOT/scripts/db.ts" "$@"; }

# The sea router's graph (Natural Earth 1:10m), built once per set of inputs into .data/routing.
ensure_sea_graph() {
  export PW_ROUTING_CACHE_DIR="${PW_ROUTING_CACHE_DIR:-$DATA/routing}"
  node "$ROOT/scripts/bundled.mjs" "$ROOT/scripts/routing-graph.ts" || die "the sea graph could not be built"
}
