#!/usr/bin/env bash
# Runs the e2e project N times in a row (default 5) against one build and one test database, and
# prints pass/fail per run and per file. A flaky test shows up as a file that fails in some runs.
#   bash scripts/e2e-loop.sh [N] [--build] [-- extra vitest arguments]
# The database is made fresh once, then kept: later runs meet the records earlier runs left, as a
# suite that makes its own records must tolerate. Logs and JSON reports go to .data/e2e-loop/.
source "$(dirname "$0")/lib.sh"
cd "$ROOT"
RUNS=5; BUILD=0; EXTRA=()
while [ $# -gt 0 ]; do
  case "$1" in
    --build) BUILD=1; shift;;
    --) shift; EXTRA=("$@"); break;;
    *[!0-9]*) die "unknown argument $1";;
    *) RUNS="$1"; shift;;
  esac
done
ensure_node_modules
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
trap cleanup EXIT
# Interrupted: stop the run in progress and end the loop (the EXIT trap then cleans up).
trap 'exit 130' INT TERM
run_db migrate
run_db seed
ensure_sea_graph
OUTPUT="${PW_OUTPUT_DIR:-$ROOT/.output}"
if [ "$BUILD" = 1 ] || [ ! -f "$OUTPUT/server/index.mjs" ]; then
  log "building the app once for all runs"
  npx nuxt build >"$DATA/build-test.log" 2>&1 || { tail -60 "$DATA/build-test.log"; die "build failed"; }
fi

OUT="$DATA/e2e-loop"; rm -rf "$OUT"; mkdir -p "$OUT"
green=0
for run in $(seq "$RUNS"); do
  start=$(date +%s)
  if npx vitest run --project e2e --reporter=default --reporter=json --outputFile.json="$OUT/run-$run.json" "${EXTRA[@]}" >"$OUT/run-$run.log" 2>&1
  then result=pass; green=$((green + 1)); else result=FAIL; fi
  log "run $run/$RUNS: $result in $(( $(date +%s) - start )) s (log: ${OUT#$ROOT/}/run-$run.log)"
done

# Per file: how many runs it passed, and the failing tests by run.
node - "$OUT" "$RUNS" <<'EOF'
const { readFileSync, existsSync } = require('node:fs')
const [dir, runs] = [process.argv[2], Number(process.argv[3])]
const files = new Map()
for (let run = 1; run <= runs; run++) {
  const path = `${dir}/run-${run}.json`
  if (!existsSync(path)) { console.log(`run ${run}: no report (the run stopped before the reporter wrote it; see run-${run}.log)`); continue }
  for (const file of JSON.parse(readFileSync(path, 'utf8')).testResults) {
    const name = file.name.replace(/^.*\/tests\//, 'tests/')
    const entry = files.get(name) ?? { passed: 0, failures: [] }
    const failed = file.assertionResults.filter(t => t.status === 'failed')
    if (file.status === 'passed' && !failed.length) entry.passed++
    else entry.failures.push(`run ${run}: ${failed.map(t => t.fullName).join('; ') || file.message || 'the file failed'}`)
    files.set(name, entry)
  }
}
const width = Math.max(...[...files.keys()].map(n => n.length), 4)
console.log(`\n${'file'.padEnd(width)}  passed`)
for (const [name, { passed, failures }] of [...files].sort()) {
  console.log(`${name.padEnd(width)}  ${passed}/${runs}`)
  for (const f of failures) console.log(`${''.padEnd(width)}    ${f.slice(0, 400)}`)
}
EOF
log "$green/$RUNS runs green"
[ "$green" = "$RUNS" ]
