// Passage board benchmark at fleet scale, in Debian's Chromium through playwright-core. Makes its own
// database (passagewright_bench_board: migrated, demo data, then BENCH_PLANS plans spread over 50
// vessels and six years, a third of them finished voyages), starts each build in BENCH_OUTPUTS against
// it in turn and measures, signed in as the demo planner:
//   first render  navigation start → the board's rows on screen and the page hydrated (interactive);
//   filter        one input event that changes the filter text → the rows replaced and painted. The new
//                 board waits BOARD_FILTER_DEBOUNCE_MS after the last keystroke before it asks the server,
//                 so its figure is given with and without that wait; the old board filters in the browser.
// BENCH_OUTPUTS lists builds (default `.output`); a build of the commit before the server-side board
// (its board reads every plan from GET /api/plans) is the side-by-side baseline, e.g.
//   BENCH_OUTPUTS=/tmp/board-before/.output,.output node scripts/bench-board.mjs
// Needs PostgreSQL running (npm start, or the test loop): PW_PG_PORT or BENCH_PG_URL names it.
import { spawn, spawnSync } from 'node:child_process'
import { fileURLToPath } from 'node:url'
import pg from 'pg'
import { chromium } from 'playwright-core'

const root = fileURLToPath(new URL('..', import.meta.url))
const PLANS = Number(process.env.BENCH_PLANS || 5000)
const RUNS = Number(process.env.BENCH_RUNS || 5)
const PORT = Number(process.env.BENCH_PORT || 3919)
const base = `http://127.0.0.1:${PORT}`
const outputs = (process.env.BENCH_OUTPUTS || '.output').split(',').map(s => s.trim())
const serverUrl = new URL(process.env.BENCH_PG_URL || `postgres://postgres@127.0.0.1:${process.env.PW_PG_PORT || 54329}/postgres`)
const dbUrl = new URL(serverUrl.href)
dbUrl.pathname = '/passagewright_bench_board'
// Goals (issue 15, goal 4): first render ≤ 500 ms and a filter keystroke ≤ 100 ms with 5,000 plans.
const RENDER_GOAL_MS = 500
const FILTER_GOAL_MS = 100
const DEBOUNCE_MS = 200 // composables/usePlanBoard.ts, BOARD_FILTER_DEBOUNCE_MS

const PORTS = [['Rotterdam', 51.95, 4.05], ['Singapore', 1.26, 103.84], ['Santos', -23.98, -46.3], ['Yokohama', 35.45, 139.65], ['Durban', -29.87, 31.05],
  ['Houston', 29.73, -95.27], ['Fremantle', -32.05, 115.74], ['Algeciras', 36.13, -5.43], ['Busan', 35.1, 129.04], ['Valparaíso', -33.03, -71.63]]

async function makeDatabase() {
  const admin = new pg.Client({ connectionString: serverUrl.href })
  await admin.connect()
  await admin.query('drop database if exists passagewright_bench_board with (force)')
  await admin.query('create database passagewright_bench_board')
  await admin.end()
  for (const command of ['migrate', 'seed']) {
    const r = spawnSync(process.execPath, [`${root}node_modules/jiti/lib/jiti-cli.mjs`, `${root}scripts/db.ts`, command], { env: { ...process.env, NUXT_DATABASE_URL: dbUrl.href }, stdio: ['ignore', 'ignore', 'inherit'] })
    if (r.status !== 0) throw new Error(`db ${command} failed`)
  }
  const db = new pg.Client({ connectionString: dbUrl.href })
  await db.connect()
  const { rows: [kb] } = await db.query(`select id from companies where name like 'Kestrel Bight%'`)
  // 50 vessels: the demo's own and invented sisters.
  const { rows: have } = await db.query('select id from vessels where company_id = $1', [kb.id])
  const missing = Math.max(0, 50 - have.length)
  // IMO numbers 98100xx with their check digit (the last digit is the sum of the first six times 7…2, modulo 10).
  for (let g = 1; g <= missing; g++) {
    const six = String(981000 + g)
    const check = [...six].reduce((sum, d, k) => sum + Number(d) * (7 - k), 0) % 10
    await db.query('insert into vessels (company_id, name, imo_number, call_sign, service_speed_kn) values ($1, $2, $3, $4, 14)', [kb.id, `Kestrel Sister ${g}`, `${six}${check}`, `KB${String(g).padStart(3, '0')}`])
  }
  const { rows: vessels } = await db.query('select id from vessels where company_id = $1 order by id', [kb.id])
  // Deterministic spread (no Math.random): plan i departs i × 10.5 h after 2021-01-01, so the older
  // third of them are approved voyages whose ETA has passed.
  const values = []
  const start = Date.UTC(2021, 0, 1)
  for (let i = 0; i < PLANS; i++) {
    const [from] = PORTS[i % PORTS.length]
    const [to] = PORTS[(i * 7 + 3) % PORTS.length]
    const departure = new Date(start + i * 10.5 * 3600_000)
    const nm = 800 + (i * 37) % 9000
    const arrival = new Date(departure.getTime() + nm / 14 * 3600_000)
    const status = departure.getTime() < Date.UTC(2023, 0, 1) ? 'approved' : ['draft', 'submitted', 'approved', 'returned'][i % 4]
    values.push([kb.id, vessels[i % vessels.length].id, `${from} – ${from === to ? 'coastal' : to} voyage ${String(i + 1).padStart(4, '0')}`, departure.toISOString(), 14, status, nm, arrival.toISOString()])
  }
  for (let i = 0; i < values.length; i += 500) {
    const chunk = values.slice(i, i + 500)
    const params = chunk.flat()
    const tuples = chunk.map((_, j) => `(${Array.from({ length: 8 }, (_, k) => `$${j * 8 + k + 1}`).join(', ')})`).join(', ')
    await db.query(`insert into plans (company_id, vessel_id, title, departure_utc, speed_kn, status, total_nm, arrival_utc) values ${tuples}`, params)
  }
  await db.query('analyze plans')
  const { rows: [counts] } = await db.query(`select count(*)::int as plans, count(*) filter (where status = 'approved' and arrival_utc < now())::int as finished from plans where company_id = $1`, [kb.id])
  await db.end()
  return counts
}

function startServer(output) {
  const server = spawn(process.execPath, [`${output}/server/index.mjs`], {
    env: { ...process.env, PORT: String(PORT), NUXT_DATABASE_URL: dbUrl.href, NUXT_OUTBOX_WORKER: 'off', NUXT_SESSION_PASSWORD: process.env.NUXT_SESSION_PASSWORD || 'passagewright-bench-session-password-0123456789' },
    stdio: ['ignore', 'ignore', 'inherit'],
  })
  const kill = () => server.kill('SIGTERM')
  process.on('exit', kill)
  const stopped = new Promise(r => server.on('exit', r))
  return { stop: async () => { kill(); await stopped; process.off('exit', kill) } }
}

async function waitForServer() {
  for (let i = 0; i < 300; i++) {
    try { if ((await fetch(`${base}/api/health`)).ok) return }
    catch {}
    await new Promise(r => setTimeout(r, 100))
  }
  throw new Error('server did not start')
}

const median = xs => [...xs].sort((p, q) => p - q)[Math.floor(xs.length / 2)]

async function measure(browser) {
  const context = await browser.newContext({ viewport: { width: 1440, height: 900 }, baseURL: base })
  const page = await context.newPage()
  await page.goto('/login')
  await page.locator('html[data-hydrated]').waitFor({ state: 'attached' })
  await page.getByLabel('E-mail').fill('planner@kestrel-bight.example')
  await page.getByLabel('Password').fill('passage-demo')
  await page.getByRole('button', { name: 'Sign in' }).click()
  await page.waitForURL(u => !u.pathname.startsWith('/login'))

  const renders = []
  let rows = 0
  for (let i = 0; i <= RUNS; i++) {
    await page.goto('/', { waitUntil: 'commit' })
    await page.waitForFunction(() => document.documentElement.hasAttribute('data-hydrated') && document.querySelector('table tbody tr'), null, { polling: 'raf', timeout: 60_000 })
    const t = await page.evaluate(() => new Promise(r => requestAnimationFrame(() => r(performance.now()))))
    rows = await page.locator('table tbody tr').count()
    if (i > 0) renders.push(t) // the first load warms the server
  }

  // The floor: the same navigation to a page that reads no data (the quick solver).
  const floors = []
  for (let i = 0; i <= RUNS; i++) {
    await page.goto('/solver', { waitUntil: 'commit' })
    await page.waitForFunction(() => document.documentElement.hasAttribute('data-hydrated') && document.querySelector('main form, main input'), null, { polling: 'raf', timeout: 60_000 })
    const t = await page.evaluate(() => new Promise(r => requestAnimationFrame(() => r(performance.now()))))
    if (i > 0) floors.push(t)
  }
  await page.goto('/', { waitUntil: 'commit' })
  await page.waitForFunction(() => document.documentElement.hasAttribute('data-hydrated') && document.querySelector('table tbody tr'), null, { polling: 'raf', timeout: 60_000 })

  // Whole filter texts set in one input event each, alternating so every one changes the rows.
  const texts = ['Singapore', 'Rotterdam', 'Santos – Algeciras', 'voyage 04', 'Durban', 'Kestrel Sister 7']
  const filters = []
  for (let i = 0; i < RUNS * 2; i++) {
    const ms = await page.evaluate(text => new Promise((resolve) => {
      const input = document.querySelector('input[aria-label="Filter by passage or vessel"]')
      const body = document.querySelector('table tbody')
      const t0 = performance.now()
      const done = () => requestAnimationFrame(() => resolve(performance.now() - t0))
      const observer = new MutationObserver(() => { observer.disconnect(); done() })
      observer.observe(body, { childList: true, subtree: true, characterData: true })
      input.value = text
      input.dispatchEvent(new Event('input', { bubbles: true }))
      setTimeout(() => { observer.disconnect(); resolve(null) }, 30_000)
    }), texts[i % texts.length])
    if (ms == null) throw new Error(`${base}: the filter "${texts[i % texts.length]}" changed nothing on screen within 30 s`)
    filters.push(ms)
  }
  await context.close()
  return { rows, render: median(renders), floor: median(floors), filter: median(filters) }
}

const counts = await makeDatabase()
console.log(`bench database: ${counts.plans} plans of Kestrel Bight, ${counts.finished} of them finished voyages; ${RUNS} runs each, medians`)
const browser = await chromium.launch({ executablePath: process.env.CHROMIUM_PATH || '/usr/bin/chromium', args: ['--headless', '--no-sandbox', '--disable-gpu', '--no-first-run'] })
const results = []
for (const output of outputs) {
  const server = startServer(output)
  try {
    await waitForServer()
    results.push({ output, ...await measure(browser) })
  }
  finally { await server.stop() }
}
await browser.close()

const pad = (s, n) => String(s).padEnd(n)
const ms = v => `${v.toFixed(0)} ms`
console.log(`\n${pad('build', 34)}${pad('rows drawn', 12)}${pad(`first render (goal ≤ ${RENDER_GOAL_MS})`, 30)}${pad('/solver (no data)', 20)}filter keystroke (goal ≤ ${FILTER_GOAL_MS})`)
for (const r of results) {
  // A board that reads /api/plans draws every plan; the paged board draws one page and debounces the filter.
  const paged = r.rows < counts.plans
  const filter = paged ? `${ms(r.filter)} (${ms(r.filter - DEBOUNCE_MS)} after the ${DEBOUNCE_MS} ms pause)` : ms(r.filter)
  console.log(`${pad(r.output, 34)}${pad(r.rows, 12)}${pad(`${ms(r.render)} ${r.render <= RENDER_GOAL_MS ? 'meets' : 'misses'}`, 30)}${pad(ms(r.floor), 20)}${filter} ${(paged ? r.filter - DEBOUNCE_MS : r.filter) <= FILTER_GOAL_MS ? 'meets' : 'misses'}`)
}
if (results.length > 1) {
  const [a, b] = [results[0], results[results.length - 1]]
  console.log(`\n${b.output} against ${a.output}: first render ${(b.render / a.render).toFixed(2)}×, filter keystroke ${(b.filter / a.filter).toFixed(2)}× (${((b.filter - DEBOUNCE_MS) / a.filter).toFixed(2)}× without the pause)`)
}
