#!/usr/bin/env bash
# npm run bench:api — load on loopback against the production build (see bench-api.mjs).
source "$(dirname "$0")/lib.sh"
cd "$ROOT"
ensure_node_modules
start_postgres
ensure_database passagewright_bench fresh
ensure_session_password
trap '[ "${PG_STARTED_HERE:-0}" = 1 ] && stop_postgres' EXIT
run_db migrate >/dev/null
run_db seed >/dev/null
[ -f .output/server/index.mjs ] || npx nuxt build >"$DATA/build-bench.log" 2>&1
node scripts/bench-api.mjs
