// Workspace benchmark against a running server (BENCH_URL, default http://127.0.0.1:3000), in Debian's
// Chromium through playwright-core: a 500-waypoint plan across the North Pacific is created through the
// API, opened in the workspace, and one waypoint is moved again and again the way a chart drag moves it
// (store.moveWaypoint). Measured per edit, against the 16 ms frame:
//   recompute  the draft store's leg table (the engine over all 500 waypoints);
//   geometry   the chart's track, corridor and overlays (the 'pw-chart-geometry' measure of ChartPlan);
//   redraw     geometry and Leaflet layers together (the 'pw-chart-redraw' measure);
//   update     edit → every view updated (store, sheet, leg table, chart), before the next paint.
// Usage: node scripts/bench-workspace.mjs [--edits 60] [--waypoints 500]; BENCH_EMAIL / BENCH_PASSWORD
// sign in as another planner (default: the demo planner).
import { chromium } from 'playwright-core'

const base = (process.env.BENCH_URL || 'http://127.0.0.1:3000').replace(/\/$/, '')
const arg = (name, fallback) => {
  const i = process.argv.indexOf(`--${name}`)
  return i > 0 ? Number(process.argv[i + 1]) : fallback
}
const edits = arg('edits', 60)
const count = arg('waypoints', 500)
const FRAME_MS = 16

async function api(path, cookie, init = {}) {
  const res = await fetch(base + path, { ...init, headers: { 'content-type': 'application/json', cookie, ...init.headers } })
  const body = await res.json().catch(() => null)
  if (!res.ok) throw new Error(`${init.method ?? 'GET'} ${path}: HTTP ${res.status} ${JSON.stringify(body)}`)
  return { body, res }
}

// Sign in and create the plan: 500 waypoints from Japan eastwards across 180°, alternating
// geodesic and rhumb-line legs, each with a cross-track limit (so the corridor is drawn too).
const login = await fetch(`${base}/api/auth/login`, {
  method: 'POST',
  headers: { 'content-type': 'application/json' },
  body: JSON.stringify({ email: process.env.BENCH_EMAIL || 'planner@kestrel-bight.example', password: process.env.BENCH_PASSWORD || 'passage-demo' }),
})
if (!login.ok) throw new Error(`sign-in failed: HTTP ${login.status}`)
const cookies = login.headers.getSetCookie().map(c => c.split(';')[0])
const cookie = cookies.join('; ')
const vessels = (await api('/api/vessels', cookie)).body
const { id } = (await api('/api/plans', cookie, { method: 'POST', body: JSON.stringify({ vesselId: vessels[0].id, title: `Benchmark, ${count} waypoints across the North Pacific`, departureUtc: '2026-12-10T02:00:00Z', speedKn: 14.5, limitLat: 48 }) })).body
const { plan } = (await api(`/api/plans/${id}`, cookie)).body
const waypoints = Array.from({ length: count }, (_, i) => {
  const lon = 141 + i * (100 / count)
  return { name: `WP ${i + 1}`, lat: 36 + 8 * Math.sin(i / 25), lon: lon > 180 ? lon - 360 : lon, method: i % 2 ? 'geodesic' : 'rhumb', xteNm: 5 }
})
await api(`/api/plans/${id}/waypoints`, cookie, { method: 'PUT', body: JSON.stringify({ version: plan.version, waypoints }) })

const browser = await chromium.launch({
  executablePath: process.env.CHROMIUM_PATH || '/usr/bin/chromium',
  args: ['--headless', '--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run', '--disable-background-networking', '--disable-component-update', '--disable-sync'],
})
try {
  const context = await browser.newContext({ viewport: { width: 1600, height: 1000 }, baseURL: base })
  await context.addCookies(cookies.map((c) => {
    const [name, ...rest] = c.split('=')
    return { name, value: rest.join('='), url: base }
  }))
  const page = await context.newPage()
  const t0 = Date.now()
  await page.goto(`/plans/${id}`)
  await page.locator('[data-testid="plan-chart"] path.pw-track').waitFor({ timeout: 120_000 })
  await page.waitForFunction(n => document.querySelectorAll('.pw-waypoint-marker').length === n, count, { timeout: 120_000 })
  console.log(`workspace with ${count} waypoints open, chart drawn: ${Date.now() - t0} ms (navigation to last marker)`)

  const result = await page.evaluate(async ({ edits }) => {
    const store = document.querySelector('#__nuxt').__vue_app__.config.globalProperties.$pinia._s.get('planDraft')
    // A macrotask after Vue's pre-flush (chart watcher) and render flush, before the next paint.
    const settled = () => new Promise((r) => { const ch = new MessageChannel(); ch.port1.onmessage = r; ch.port2.postMessage(0) })
    const i = Math.floor(store.waypoints.length / 2)
    const out = { recompute: [], geometry: [], redraw: [], update: [] }
    for (let k = -5; k < edits; k++) {
      const w = store.waypoints[i]
      performance.clearMeasures()
      const a = performance.now()
      store.moveWaypoint(i, { lat: w.lat + (k % 2 ? 0.05 : -0.05), lon: w.lon + 0.01 })
      const b = performance.now()
      void store.legTable.totals.distanceNm
      const c = performance.now()
      await settled()
      const d = performance.now()
      const measured = name => performance.getEntriesByName(name).at(-1)?.duration ?? Number.NaN
      if (k >= 0) { out.recompute.push(c - b); out.geometry.push(measured('pw-chart-geometry')); out.redraw.push(measured('pw-chart-redraw')); out.update.push(d - a) }
      await new Promise(r => requestAnimationFrame(() => r()))
    }
    return out
  }, { edits })

  const stats = (xs) => {
    const s = [...xs].sort((p, q) => p - q)
    return { median: s[Math.floor(s.length / 2)], p95: s[Math.min(s.length - 1, Math.floor(s.length * 0.95))], max: s.at(-1) }
  }
  console.log(`one waypoint of ${count} moved ${edits} times (after 5 warm-up edits); goal: within one ${FRAME_MS} ms frame`)
  for (const [name, label] of [['recompute', 'leg table recompute'], ['geometry', 'chart geometry'], ['redraw', 'chart geometry + layers'], ['update', 'edit → all views updated']]) {
    const s = stats(result[name])
    console.log(`  ${label.padEnd(26)} median ${s.median.toFixed(2).padStart(7)} ms   p95 ${s.p95.toFixed(2).padStart(7)} ms   max ${s.max.toFixed(2).padStart(7)} ms   ${s.median <= FRAME_MS ? 'within' : 'over'} the frame`)
  }
}
finally {
  await browser.close()
}
