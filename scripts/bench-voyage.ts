// Track log import benchmark: a 50,000-line NMEA 0183 log (RMC and GGA each second, invented, on the
// 40°S leg of the demo Indian Ocean passage) read by the importer (checksums, RMC/GGA, dating, time
// order, hourly sampling) side by side with nmea-simple's parse of the same lines alone. Prints medians
// of interleaved runs and their ratio, and the memory the importer's reading holds.
// With BENCH_URL (a running server) and BENCH_PLAN_ID (an approved plan of the demo company), also times
// the preview through the API (upload, reading, no writes), signed in as the demo planner.
//   npm run bench:voyage   (node --expose-gc scripts/bundled.mjs scripts/bench-voyage.ts)
import { parseNmeaSentence } from 'nmea-simple'
import { readTrackLog, sampleFixes } from '../shared/utils/monitoring/trackLog'

const LINES = 50_000
const RUNS = 5

function checksum(body: string) {
  let x = 0
  for (const ch of body) x ^= ch.charCodeAt(0)
  return x.toString(16).toUpperCase().padStart(2, '0')
}
const two = (n: number) => String(n).padStart(2, '0')
const dm = (v: number, w: number) => `${String(Math.floor(Math.abs(v))).padStart(w, '0')}${(Math.abs(v) % 1 * 60).toFixed(4).padStart(7, '0')}`

function makeLog(): string {
  const start = Date.parse('2026-11-26T00:00:00Z')
  const lines: string[] = []
  for (let i = 0; lines.length < LINES; i++) {
    const d = new Date(start + i * 1000)
    const time = `${two(d.getUTCHours())}${two(d.getUTCMinutes())}${two(d.getUTCSeconds())}`
    const date = `${two(d.getUTCDate())}${two(d.getUTCMonth() + 1)}${two(d.getUTCFullYear() % 100)}`
    const lat = -40 + 0.01 * Math.sin(i / 500)
    const lon = 40 + i * 15 / 3600 / 46
    const rmc = `GPRMC,${time},A,${dm(lat, 2)},S,${dm(lon, 3)},E,15.0,090.0,${date},,`
    const gga = `GPGGA,${time},${dm(lat, 2)},S,${dm(lon, 3)},E,1,09,0.9,12.0,M,-20.0,M,,`
    lines.push(`$${rmc}*${checksum(rmc)}`, `$${gga}*${checksum(gga)}`)
  }
  return `${lines.slice(0, LINES).join('\r\n')}\r\n`
}

const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)]!
const text = makeLog()
const lines = text.split(/\r?\n/).filter(Boolean)

function raw() {
  let n = 0
  for (const l of lines) {
    try { parseNmeaSentence(l); n++ }
    catch {}
  }
  return n
}
function ours() {
  const log = readTrackLog(text)
  return sampleFixes(log.fixes, 60).length + log.fixes.length
}

raw(); ours() // warm up
const tRaw: number[] = []
const tOurs: number[] = []
for (let i = 0; i < RUNS; i++) {
  let t = performance.now(); raw(); tRaw.push(performance.now() - t)
  t = performance.now(); ours(); tOurs.push(performance.now() - t)
}
globalThis.gc?.()
const before = process.memoryUsage()
const held = readTrackLog(text)
const after = process.memoryUsage()
console.log(`${LINES.toLocaleString('en-GB')} NMEA lines (${(text.length / 1e6).toFixed(1)} MB), ${held.fixes.length.toLocaleString('en-GB')} fixes, ${sampleFixes(held.fixes, 60).length} hourly reports; median of ${RUNS} interleaved runs`)
console.log(`  nmea-simple parse alone      ${median(tRaw).toFixed(0).padStart(6)} ms`)
console.log(`  importer reading + sampling  ${median(tOurs).toFixed(0).padStart(6)} ms   (${(median(tOurs) / median(tRaw)).toFixed(2)}× the parse alone)`)
console.log(`  heap held by one reading     ${((after.heapUsed - before.heapUsed) / 1e6).toFixed(0).padStart(6)} MB (rss ${((after.rss - before.rss) / 1e6).toFixed(0)} MB)${globalThis.gc ? '' : '  [run node --expose-gc for a settled baseline]'}`)

if (process.env.BENCH_URL && process.env.BENCH_PLAN_ID) {
  const base = process.env.BENCH_URL.replace(/\/$/, '')
  const login = await fetch(`${base}/api/auth/login`, { method: 'POST', headers: { 'content-type': 'application/json', 'origin': base }, body: JSON.stringify({ email: 'planner@kestrel-bight.example', password: 'passage-demo' }) })
  const cookie = login.headers.getSetCookie().map(c => c.split(';')[0]).join('; ')
  const times: number[] = []
  for (let i = 0; i < 3; i++) {
    const form = new FormData()
    form.append('file', new Blob([text], { type: 'text/plain' }), 'bench.nmea')
    form.append('mode', 'preview')
    const t = performance.now()
    const res = await fetch(`${base}/api/plans/${process.env.BENCH_PLAN_ID}/reports/import`, { method: 'POST', headers: { cookie, origin: base }, body: form })
    await res.text()
    times.push(performance.now() - t)
    if (!res.ok) { console.log(`  API preview answered ${res.status}`); break }
  }
  console.log(`  API preview (upload + reading)${median(times).toFixed(0).padStart(6)} ms   (${(median(times) / median(tRaw)).toFixed(2)}× the parse alone)`)
}
