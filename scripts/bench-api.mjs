// API load benchmark: each route beside a trivial authenticated route in the same run, with
// autocannon on loopback against the production build. Prints req/s, p50, p99 and ratios.
// BENCH_OUTPUTS lists builds to measure one after the other in the same run (default `.output`), e.g.
// a build of main beside this one: BENCH_OUTPUTS=/tmp/main-output,.output. BENCH_PROFILE=DIR runs
// each server under `node --cpu-prof` and leaves its profile in DIR (`node scripts/profile-top.mjs DIR`
// lists the top functions). BENCH_ONLY=REGEX measures only the routes whose name matches, e.g. BENCH_ONLY=plans.
// Every request sends the Accept-Encoding a browser sends (Chromium's), so the plan route answers compressed
// as it does to the workspace; BENCH_ACCEPT_ENCODING=identity measures the uncompressed answers instead.
import { spawn } from 'node:child_process'
import { readFileSync } from 'node:fs'
import autocannon from 'autocannon'

const PORT = Number(process.env.BENCH_PORT || 3917)
const base = `http://127.0.0.1:${PORT}`
const DURATION = Number(process.env.BENCH_SECONDS || 8)
const outputs = (process.env.BENCH_OUTPUTS || '.output').split(',').map(s => s.trim())
const profileDir = process.env.BENCH_PROFILE
const acceptEncoding = process.env.BENCH_ACCEPT_ENCODING || 'gzip, deflate, br, zstd'

function startServer(output) {
  const args = [...(profileDir ? ['--cpu-prof', '--cpu-prof-dir', profileDir] : []), `${output}/server/index.mjs`]
  const server = spawn(process.execPath, args, { env: { ...process.env, PORT: String(PORT), NUXT_OUTBOX_WORKER: 'off' }, stdio: ['ignore', 'ignore', 'inherit'] })
  const kill = () => server.kill('SIGTERM')
  process.on('exit', kill)
  const stopped = new Promise(r => server.on('exit', r))
  return { pid: server.pid, stop: async () => { kill(); await stopped; process.off('exit', kill) } }
}

async function waitForServer() {
  for (let i = 0; i < 300; i++) {
    try { if ((await fetch(`${base}/api/health`)).ok) return }
    catch {}
    await new Promise(r => setTimeout(r, 100))
  }
  throw new Error('server did not start')
}

async function json(path, cookie, method = 'GET', body) {
  const res = await fetch(`${base}${path}`, { method, headers: { cookie, 'content-type': 'application/json' }, body: body ? JSON.stringify(body) : undefined })
  if (!res.ok) throw new Error(`${method} ${path}: ${res.status} ${await res.text()}`)
  return res.json()
}

function load(title, path, cookie, opts = {}) {
  return new Promise((resolve, reject) => {
    autocannon({ url: `${base}${path}`, connections: 16, duration: DURATION, headers: { cookie, 'content-type': 'application/json', 'accept-encoding': acceptEncoding }, ...opts }, (err, result) => {
      if (err) return reject(err)
      if (result.non2xx) return reject(new Error(`${title}: ${result.non2xx} responses were not 2xx`))
      resolve({ title, rps: result.requests.average, p50: result.latency.p50, p99: result.latency.p99, kB: result.throughput.average / result.requests.average / 1024 })
    })
  })
}

async function signIn() {
  const login = await fetch(`${base}/api/auth/login`, { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ email: 'planner@kestrel-bight.example', password: 'passage-demo' }) })
  return login.headers.getSetCookie().map(c => c.split(';')[0]).join('; ')
}

async function createPlan(cookie, count) {
  const vessels = await json('/api/vessels', cookie)
  const plan = await json('/api/plans', cookie, 'POST', { vesselId: vessels[0].id, title: `Benchmark – ${count} waypoints`, departureUtc: '2027-03-01T00:00:00Z', speedKn: 14 })
  const waypoints = Array.from({ length: count }, (_, i) => ({ name: `WP${i + 1}`, lat: 30 + 10 * Math.sin(i / 20), lon: -170 + i * (180 / count), method: i % 3 ? 'rhumb' : 'geodesic' }))
  await json(`/api/plans/${plan.id}/waypoints`, cookie, 'PUT', { version: 1, waypoints })
  return plan.id
}

const inverseBody = JSON.stringify({ from: { lat: 35.44, lon: 139.64 }, to: { lat: 48.49, lon: -124.8 } })
console.log(`Passagewright API benchmark — autocannon, 16 connections, ${DURATION} s per run, loopback; Accept-Encoding: ${acceptEncoding} (as a browser sends)`)
for (const output of outputs) {
  const server = startServer(output)
  await waitForServer()
  const cookie = await signIn()
  const plan200 = await createPlan(cookie, 200)
  const plan1000 = await createPlan(cookie, 1000)
  await fetch(`${base}/tiles/3/4/2.png`) // render once so the run measures the cache
  const pairs = [
    ['POST /api/geodesy/inverse', () => load('inverse', '/api/geodesy/inverse', cookie, { method: 'POST', body: inverseBody }), 0.6, 5],
    ['GET /api/plans/:id (200 waypoints)', () => load('plan', `/api/plans/${plan200}`, cookie), 0.4, 3],
    ['GET /api/plans/:id (1,000 waypoints)', () => load('plan', `/api/plans/${plan1000}`, cookie), 0.15, 3],
    ['GET /tiles/3/4/2.png (cached)', () => load('tile', '/tiles/3/4/2.png', cookie), null, 5],
  ]
  const only = process.env.BENCH_ONLY ? new RegExp(process.env.BENCH_ONLY) : null
  console.log(`\nbuild: ${output}`)
  console.log('route'.padEnd(38), 'req/s'.padStart(9), 'p50 ms'.padStart(8), 'p99 ms'.padStart(8), '  vs GET /api/auth/me (same run)')
  for (const [name, run, goal, tail] of pairs) {
    if (only && !only.test(name)) continue
    const trivial = await load('me', '/api/auth/me', cookie)
    const r = await run()
    const ratio = r.rps / trivial.rps
    const spread = r.p99 / Math.max(r.p50, 1)
    console.log('GET /api/auth/me'.padEnd(38), trivial.rps.toFixed(0).padStart(9), String(trivial.p50).padStart(8), String(trivial.p99).padStart(8))
    console.log(name.padEnd(38), r.rps.toFixed(0).padStart(9), String(r.p50).padStart(8), String(r.p99).padStart(8),
      `  ${r.kB.toFixed(0)} kB/answer; ${ratio.toFixed(2)}×${goal ? ` (goal ≥ ${goal}×${ratio >= goal ? ', met' : ', not met'})` : ''}; p99/p50 ${spread.toFixed(1)} (goal ≤ ${tail}${spread <= tail ? ', met' : ', not met'})`)
  }
  const rssKb = Number(readFileSync(`/proc/${server.pid}/status`, 'utf8').match(/VmRSS:\s+(\d+)/)[1])
  console.log(`server resident memory after the runs: ${(rssKb / 1024).toFixed(0)} MB`)
  await server.stop()
}
process.exit(0)
