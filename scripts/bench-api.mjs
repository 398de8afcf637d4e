// API load benchmark: each route beside a trivial authenticated route in the same run, with
// autocannon on loopback against the production build. Prints req/s, p50, p99 and ratios.
import { spawn } from 'node:child_process'
import { readFileSync } from 'node:fs'
import autocannon from 'autocannon'

const PORT = Number(process.env.BENCH_PORT || 3917)
const base = `http://127.0.0.1:${PORT}`
const DURATION = Number(process.env.BENCH_SECONDS || 8)

const server = spawn(process.execPath, ['.output/server/index.mjs'], {
  env: { ...process.env, PORT: String(PORT), NUXT_OUTBOX_WORKER: 'off' }, stdio: ['ignore', 'ignore', 'inherit'],
})
const stopServer = () => server.kill('SIGTERM')
process.on('exit', stopServer)

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
    autocannon({ url: `${base}${path}`, connections: 16, duration: DURATION, headers: { cookie, 'content-type': 'application/json' }, ...opts }, (err, result) => {
      if (err) return reject(err)
      if (result.non2xx) return reject(new Error(`${title}: ${result.non2xx} responses were not 2xx`))
      resolve({ title, rps: result.requests.average, p50: result.latency.p50, p99: result.latency.p99 })
    })
  })
}

await waitForServer()
const login = await fetch(`${base}/api/auth/login`, { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ email: 'planner@kestrel-bight.example', password: 'passage-demo' }) })
const cookie = login.headers.getSetCookie().map(c => c.split(';')[0]).join('; ')
const vessels = await json('/api/vessels', cookie)
const plan = await json('/api/plans', cookie, 'POST', { vesselId: vessels[0].id, title: 'Benchmark – 200 waypoints', departureUtc: '2027-03-01T00:00:00Z', speedKn: 14 })
const waypoints = Array.from({ length: 200 }, (_, i) => ({ name: `WP${i + 1}`, lat: 30 + 10 * Math.sin(i / 20), lon: -170 + i * 0.9, method: i % 3 ? 'rhumb' : 'geodesic' }))
await json(`/api/plans/${plan.id}/waypoints`, cookie, 'PUT', { version: 1, waypoints })
await fetch(`${base}/tiles/3/4/2.png`) // render once so the run measures the cache

const inverseBody = JSON.stringify({ from: { lat: 35.44, lon: 139.64 }, to: { lat: 48.49, lon: -124.8 } })
const pairs = [
  ['POST /api/geodesy/inverse', () => load('inverse', '/api/geodesy/inverse', cookie, { method: 'POST', body: inverseBody }), 0.6],
  ['GET /api/plans/:id (200 waypoints)', () => load('plan', `/api/plans/${plan.id}`, cookie), null],
  ['GET /tiles/3/4/2.png (cached)', () => load('tile', '/tiles/3/4/2.png', cookie), null],
]

console.log(`Passagewright API benchmark — autocannon, 16 connections, ${DURATION} s per run, loopback\n`)
console.log('route'.padEnd(38), 'req/s'.padStart(9), 'p50 ms'.padStart(8), 'p99 ms'.padStart(8), '  vs GET /api/auth/me (same run)')
for (const [name, run, goal] of pairs) {
  const trivial = await load('me', '/api/auth/me', cookie)
  const r = await run()
  const ratio = r.rps / trivial.rps
  console.log('GET /api/auth/me'.padEnd(38), trivial.rps.toFixed(0).padStart(9), String(trivial.p50).padStart(8), String(trivial.p99).padStart(8))
  console.log(name.padEnd(38), r.rps.toFixed(0).padStart(9), String(r.p50).padStart(8), String(r.p99).padStart(8),
    `  ${ratio.toFixed(2)}×${goal ? ` (goal ≥ ${goal}×)` : ''}; p99/p50 ${(r.p99 / Math.max(r.p50, 1)).toFixed(1)} (goal ≤ 5)`)
}
const rssKb = Number(readFileSync(`/proc/${server.pid}/status`, 'utf8').match(/VmRSS:\s+(\d+)/)[1])
console.log(`\nserver resident memory after the runs: ${(rssKb / 1024).toFixed(0)} MB`)
stopServer()
process.exit(0)
