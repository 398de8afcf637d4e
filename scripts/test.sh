#!/usr/bin/env bash
# npm test: the same bootstrap on a fresh test database, then the type check and every Vitest project.
source "$(dirname "$0")/lib.sh"
cd "$ROOT"
ensure_node_modules
[ -x /usr/bin/chromium ] || apt_install chromium
command -v GeodSolve >/dev/null && command -v RhumbSolve >/dev/null || apt_install geographiclib-tools
start_postgres
TEST_DB="${PW_TEST_DB:-passagewright_test}"
ensure_database "$TEST_DB" fresh
export PW_TEST_DB="$TEST_DB"
export NUXT_SESSION_PASSWORD="${NUXT_SESSION_PASSWORD:-passagewright-test-session-password-0123456789}"
SMTP_PORT="${PW_TEST_SMTP_PORT:-2526}"
export NUXT_SMTP_URL="smtp://127.0.0.1:$SMTP_PORT"
export PW_MAIL_DIR="$DATA/mail-test"
export NUXT_TILE_CACHE_DIR="$DATA/tiles-test"
rm -rf "$PW_MAIL_DIR"
MAIL_PID=""
port_in_use "$SMTP_PORT" && die "port $SMTP_PORT (SMTP fake for the tests) is taken; set PW_TEST_SMTP_PORT"
start_mail_fake "$SMTP_PORT" "$PW_MAIL_DIR"
cleanup() {
  [ -n "$MAIL_PID" ] && kill "$MAIL_PID" 2>/dev/null || true
  if [ "${PG_STARTED_HERE:-0}" = 1 ]; then stop_postgres; fi
}
trap cleanup EXIT INT TERM

run_db migrate
run_db seed
ensure_sea_graph
# The build runs beside the type check and lint (each mostly one core): the types come from
# `nuxt prepare` in .nuxt, the build works in its own folder so it never rewrites what vue-tsc reads.
since() { echo "$(( $(date +%s) - $1 )) s"; }
t=$(date +%s)
npx nuxt prepare >"$DATA/prepare-test.log" 2>&1 || { tail -30 "$DATA/prepare-test.log"; die "nuxt prepare failed"; }
log "types prepared in $(since "$t"); building the app for the tests beside the type check and lint"
t=$(date +%s)
PW_BUILD_DIR="$DATA/build-test" npx nuxt build >"$DATA/build-test.log" 2>&1 &
BUILD_PID=$!
trap '[ -n "${BUILD_PID:-}" ] && kill "$BUILD_PID" 2>/dev/null; cleanup' EXIT
s=$(date +%s)
npx vue-tsc --build --noEmit
log "type check (vue-tsc --build --noEmit): $(since "$s")"
s=$(date +%s)
npx eslint .
log "lint (eslint, eslint.config.mjs): $(since "$s")"
wait "$BUILD_PID" || { BUILD_PID=""; tail -60 "$DATA/build-test.log"; die "build failed"; }
BUILD_PID=""
log "build done $(since "$t") after it started"
log "tests: unit, components, nuxt, e2e"
s=$(date +%s)
npx vitest run "$@"
log "tests: $(since "$s")"
