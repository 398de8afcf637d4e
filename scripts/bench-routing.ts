// Sea-router benchmark: 200 seeded-random pairs of sea positions (every other one at least 30 nm
// off the coast), each routed once after a warm-up, timed one by one, beside the same number of
// raw geodesic inverses (geographiclib-geodesic) as the baseline of the ratio. Prints the median
// and p95 per route, the graph's load time and the memory the graph adds (RSS and heap).
// Goals (issue 11): median ≤ 150 ms, p95 ≤ 400 ms, the graph ≤ 300 MB.
// Run: npm run bench:routing   (node scripts/bundled.mjs scripts/bench-routing.ts)
import { G, geod } from '#shared/utils/engine/wgs84'
import { useSeaGraph } from '../server/utils/routing/graphStore'
import { coastDistanceNm, isRoutingLand } from '../server/utils/routing/coast'
import { seaRoute } from '../server/utils/routing/seaRoute'

const PAIRS = 200
const MB = 1024 * 1024

// mulberry32 (T. Ettinger, public domain), as the tests' seeded generator.
function seeded(seed: number): () => number {
  let a = seed >>> 0
  return () => {
    a = (a + 0x6D2B79F5) >>> 0
    let t = a
    t = Math.imul(t ^ (t >>> 15), t | 1)
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61)
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296
  }
}

const gc = (globalThis as { gc?: () => void }).gc
gc?.()
const before = process.memoryUsage()
const loadStart = performance.now()
const graph = await useSeaGraph()
const loadMs = performance.now() - loadStart
gc?.()
const after = process.memoryUsage()

// Closed waters a random point may fall in (the Caspian Sea, the Great Lakes), from memory.
const CLOSED = [[36, 47.5, 46, 55.5], [41, 49.5, -93, -76]] as const
const rand = seeded(20261203)
const points: { lat: number, lon: number }[] = []
while (points.length < 2 * PAIRS) {
  const lat = -65 + rand() * 135, lon = -180 + rand() * 360
  if (CLOSED.some(([s, n, w, e]) => lat >= s && lat <= n && lon >= w && lon <= e)) continue
  if (isRoutingLand(graph.land, lat, lon)) continue
  if (points.length % 2 === 0 && coastDistanceNm(graph.land, lat, lon, 30).nm < 30) continue
  points.push({ lat, lon })
}
const pairs = Array.from({ length: PAIRS }, (_, i) => [points[2 * i]!, points[2 * i + 1]!] as const)

// Warm-up: a few routes so the JIT has seen the search before timing.
for (const [a, b] of pairs.slice(0, 10)) seaRoute(graph, a, b)

const routeMs: number[] = []
let failed = 0, nm = 0
const routeStart = performance.now()
for (const [a, b] of pairs) {
  const t = performance.now()
  try { nm += seaRoute(graph, a, b).distanceNm }
  catch { failed++ }
  routeMs.push(performance.now() - t)
}
const routeTotal = performance.now() - routeStart
const peak = process.memoryUsage()

let sink = 0
const geoStart = performance.now()
for (const [a, b] of pairs) sink += geod.Inverse(a.lat, a.lon, b.lat, b.lon, G.DISTANCE).s12!
const geoTotal = performance.now() - geoStart

const sorted = [...routeMs].sort((x, y) => x - y)
const q = (p: number) => sorted[Math.min(sorted.length - 1, Math.floor(p * sorted.length))]!
const median = (sorted[(PAIRS - 1) >> 1]! + sorted[PAIRS >> 1]!) / 2
const p95 = q(0.95)
const rssMb = (after.rss - before.rss) / MB
const pad = (s: string, n = 34) => s.padEnd(n)
console.log(`sea-router benchmark: ${PAIRS} random sea pairs (${failed} without a route), ${graph.nodeCount.toLocaleString('en')} nodes, ${(graph.targets.length / 2).toLocaleString('en')} edges`)
console.log(`${pad('')}${'sea route'.padStart(12)}${'geodesic'.padStart(12)}${'ratio'.padStart(10)}`)
console.log(`${pad(`all ${PAIRS} pairs, ms`)}${routeTotal.toFixed(1).padStart(12)}${geoTotal.toFixed(2).padStart(12)}${(routeTotal / geoTotal).toFixed(0).padStart(10)}`)
console.log(`${pad('per pair, mean ms')}${(routeTotal / PAIRS).toFixed(2).padStart(12)}${(geoTotal / PAIRS).toFixed(4).padStart(12)}`)
console.log(`${pad('median ms per route (goal ≤ 150)')}${median.toFixed(1).padStart(12)}   ${median <= 150 ? 'meets' : 'MISSES'}`)
console.log(`${pad('p95 ms per route (goal ≤ 400)')}${p95.toFixed(1).padStart(12)}   ${p95 <= 400 ? 'meets' : 'MISSES'}`)
console.log(`${pad('slowest route ms')}${sorted.at(-1)!.toFixed(1).padStart(12)}`)
console.log(`${pad('graph load ms')}${loadMs.toFixed(0).padStart(12)}`)
console.log(`${pad('graph adds RSS MB (goal ≤ 300)')}${rssMb.toFixed(0).padStart(12)}   ${rssMb <= 300 ? 'meets' : 'MISSES'}`)
console.log(`${pad('graph adds heap + buffers MB')}${((after.heapUsed + after.arrayBuffers - before.heapUsed - before.arrayBuffers) / MB).toFixed(0).padStart(12)}`)
console.log(`${pad('RSS after the routes MB')}${(peak.rss / MB).toFixed(0).padStart(12)}`)
console.log(`(mean route ${(nm / Math.max(1, PAIRS - failed)).toFixed(0)} nm; checksum ${(sink / 1852).toFixed(0)})`)
