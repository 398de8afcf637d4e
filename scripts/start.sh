#!/usr/bin/env bash
# npm start: install what is missing, start PostgreSQL and the SMTP fake, migrate, seed, build, serve.
source "$(dirname "$0")/lib.sh"
cd "$ROOT"
PORT="${PORT:-3000}"
port_in_use "$PORT" && die "port $PORT is taken; stop what uses it or set PORT"

ensure_node_modules
start_postgres
ensure_database "${PW_DB:-passagewright}"
ensure_session_password
export NUXT_SMTP_URL="${NUXT_SMTP_URL:-smtp://127.0.0.1:2525}"
MAIL_PID=""
[[ "$NUXT_SMTP_URL" == smtp://127.0.0.1:2525 ]] && start_mail_fake 2525 "$DATA/mail"

APP_PID=""
cleanup() {
  trap - EXIT INT TERM
  log "stopping"
  [ -n "$APP_PID" ] && kill "$APP_PID" 2>/dev/null || true
  [ -n "$MAIL_PID" ] && kill "$MAIL_PID" 2>/dev/null || true
  [ "${PG_STARTED_HERE:-0}" = 1 ] && stop_postgres
}
trap cleanup EXIT INT TERM

run_db migrate
run_db seed-if-empty
ensure_sea_graph
log "building the app"
npx nuxt build >"$DATA/build.log" 2>&1 || { tail -40 "$DATA/build.log"; die "build failed (see .data/build.log)"; }
log "serving on http://localhost:$PORT"
PORT="$PORT" node .output/server/index.mjs &
APP_PID=$!
wait "$APP_PID"
