// Workspace benchmark against running servers, in Debian's Chromium through playwright-core. For each
// plan size a plan across the North Pacific is created through the API (alternating geodesic and rhumb
// legs, each with a cross-track limit so the corridor is drawn too), opened in the workspace, and one
// waypoint is moved again and again the way a chart drag moves it (store.moveWaypoint). Measured:
//   open       navigation start → page hydrated, chart track drawn and a click in the sheet answered;
//   recompute  the draft store's leg table (the engine over all waypoints);
//   geometry   the chart's track, corridor and overlays (the 'pw-chart-geometry' measure of ChartPlan);
//   redraw     geometry and Leaflet layers together (the 'pw-chart-redraw' measure);
//   update     edit → every view updated (store, sheet, leg table, fuel, chart), before the next paint.
// BENCH_URL may list several servers (comma-separated, e.g. a build of main beside this one): each is
// measured in turn in the same run and the figures are printed side by side.
// Usage: node scripts/bench-workspace.mjs [--edits 40] [--sizes 500,5000] [--opens 3]; BENCH_EMAIL /
// BENCH_PASSWORD sign in as another planner (default: the demo planner).
import { chromium } from 'playwright-core'

const bases = (process.env.BENCH_URL || 'http://127.0.0.1:3000').split(',').map(u => u.trim().replace(/\/$/, ''))
const arg = (name, fallback) => {
  const i = process.argv.indexOf(`--${name}`)
  return i > 0 ? process.argv[i + 1] : fallback
}
const edits = Number(arg('edits', 40))
const sizes = String(arg('sizes', '500,5000')).split(',').map(Number)
const opens = Number(arg('opens', 3))
// Goals (issue: one frame for an edit on 500 waypoints; 50 ms on 5,000; the 5,000-waypoint plan interactive in 2 s).
const EDIT_GOAL_MS = n => (n <= 500 ? 16 : 50)
const OPEN_GOAL_MS = 2000

async function api(base, path, cookie, init = {}) {
  const res = await fetch(base + path, { ...init, headers: { 'content-type': 'application/json', cookie, ...init.headers } })
  const body = await res.json().catch(() => null)
  if (!res.ok) throw new Error(`${init.method ?? 'GET'} ${path}: HTTP ${res.status} ${JSON.stringify(body)}`)
  return body
}

async function signIn(base) {
  const login = await fetch(`${base}/api/auth/login`, {
    method: 'POST',
    headers: { 'content-type': 'application/json' },
    body: JSON.stringify({ email: process.env.BENCH_EMAIL || 'planner@kestrel-bight.example', password: process.env.BENCH_PASSWORD || 'passage-demo' }),
  })
  if (!login.ok) throw new Error(`sign-in at ${base} failed: HTTP ${login.status}`)
  return login.headers.getSetCookie().map(c => c.split(';')[0])
}

// count waypoints from Japan eastwards across 180°.
async function createPlan(base, cookie, count) {
  const vessels = await api(base, '/api/vessels', cookie)
  const { id } = await api(base, '/api/plans', cookie, { method: 'POST', body: JSON.stringify({ vesselId: vessels[0].id, title: `Benchmark, ${count} waypoints across the North Pacific`, departureUtc: '2026-12-10T02:00:00Z', speedKn: 14.5, limitLat: 48 }) })
  const { plan } = await api(base, `/api/plans/${id}`, cookie)
  const waypoints = Array.from({ length: count }, (_, i) => {
    const lon = 141 + i * (100 / count)
    return { name: `WP ${i + 1}`, lat: 36 + 8 * Math.sin(i / 25), lon: lon > 180 ? lon - 360 : lon, method: i % 2 ? 'geodesic' : 'rhumb', xteNm: 5 }
  })
  await api(base, `/api/plans/${id}/waypoints`, cookie, { method: 'PUT', body: JSON.stringify({ version: plan.version, waypoints }) })
  return id
}

const median = xs => [...xs].sort((p, q) => p - q)[Math.floor(xs.length / 2)]
const stats = (xs) => {
  const s = [...xs].sort((p, q) => p - q)
  return { median: s[Math.floor(s.length / 2)], p95: s[Math.min(s.length - 1, Math.floor(s.length * 0.95))] }
}

// Navigation start → hydrated, track drawn, and a click on the second row's name answered (the store selects it).
async function openOnce(page, id) {
  await page.goto(`/plans/${id}`, { waitUntil: 'commit', timeout: 180_000 })
  await page.waitForFunction((planId) => {
    const app = document.querySelector('#__nuxt')?.__vue_app__
    const nuxt = app?.config.globalProperties.$nuxt
    const store = app?.config.globalProperties.$pinia?._s.get('planDraft')
    return nuxt && !nuxt.isHydrating && store?.planId === planId && document.querySelector('[data-testid="plan-chart"] path.pw-track')
  }, id, { timeout: 180_000, polling: 20 })
  const cell = page.locator('[data-testid="waypoint-row"][data-row="1"] [data-cell="name"] input')
  await cell.click({ timeout: 180_000 })
  await page.waitForFunction(() => document.querySelector('#__nuxt').__vue_app__.config.globalProperties.$pinia._s.get('planDraft').selected === 1, null, { timeout: 180_000, polling: 'raf' })
  return page.evaluate(() => performance.now())
}

async function editMany(page) {
  return page.evaluate(async ({ edits }) => {
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
}

const browser = await chromium.launch({
  executablePath: process.env.CHROMIUM_PATH || '/usr/bin/chromium',
  args: ['--headless', '--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run', '--disable-background-networking', '--disable-component-update', '--disable-sync'],
})
const chromiumVersion = browser.version()
const results = {} // results[size][base] = { open, recompute, geometry, redraw, update }
try {
  for (const size of sizes) {
    results[size] = {}
    for (const base of bases) {
      const cookies = await signIn(base)
      const id = await createPlan(base, cookies.join('; '), size)
      const context = await browser.newContext({ viewport: { width: 1600, height: 1000 }, baseURL: base })
      await context.addCookies(cookies.map((c) => {
        const [name, ...rest] = c.split('=')
        return { name, value: rest.join('='), url: base }
      }))
      const page = await context.newPage()
      await page.addInitScript(() => { window.pwBenchmark = true }) // the chart records its timings only then
      const openMs = []
      for (let k = 0; k < opens; k++) openMs.push(await openOnce(page, id))
      const edited = await editMany(page)
      results[size][base] = { open: median(openMs), ...Object.fromEntries(Object.entries(edited).map(([k, v]) => [k, stats(v)])) }
      await context.close()
    }
  }
}
finally {
  await browser.close()
}

const col = 26
console.log(`Workspace benchmark — Chromium ${chromiumVersion}, viewport 1600×1000; median of ${opens} opens, ${edits} edits (after 5 warm-up edits)`)
console.log(`servers: ${bases.map((b, i) => `[${i + 1}] ${b}`).join('  ')}\n`)
console.log('measure'.padEnd(44), ...bases.map((_, i) => `[${i + 1}] median / p95 ms`.padStart(col)), '  goal')
for (const size of sizes) {
  const rows = [
    ['open', `${size} wp: open → interactive`, size >= 5000 ? `≤ ${OPEN_GOAL_MS} ms` : ''],
    ['recompute', `${size} wp: leg table recompute`, ''],
    ['geometry', `${size} wp: chart geometry`, ''],
    ['redraw', `${size} wp: chart geometry + layers`, ''],
    ['update', `${size} wp: one edit → all views updated`, `median ≤ ${EDIT_GOAL_MS(size)} ms`],
  ]
  for (const [key, label, goal] of rows) {
    const cells = bases.map((b) => {
      const r = results[size][b][key]
      return (typeof r === 'number' ? r.toFixed(0) : `${r.median.toFixed(1)} / ${r.p95.toFixed(1)}`).padStart(col)
    })
    const met = key === 'update' ? results[size][bases.at(-1)].update.median <= EDIT_GOAL_MS(size) : key === 'open' && goal ? results[size][bases.at(-1)].open <= OPEN_GOAL_MS : null
    console.log(label.padEnd(44), ...cells, `  ${goal}${met == null ? '' : met ? ' (met)' : ' (not met)'}`)
  }
  if (bases.length > 1) {
    const [first, last] = [results[size][bases[0]], results[size][bases.at(-1)]]
    console.log(`${size} wp: [${bases.length}] vs [1]`.padEnd(44), `edit ${(first.update.median / last.update.median).toFixed(1)}× faster, open ${(first.open / last.open).toFixed(1)}× faster`)
  }
}
