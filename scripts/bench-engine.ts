// Engine speed against raw geographiclib-geodesic, measured side by side in one run.
// Rounds alternate between the two sides and the best round of each is kept, so that a busy
// machine slows both alike. Run: npm run bench:engine (node scripts/bench-engine.mjs bundles this
// file with esbuild first, as Vite bundles the engine for the app).
import geodesic from 'geographiclib-geodesic'
import { geodesicInverse } from '../shared/utils/geodesic'
import { rhumbInverse } from '../shared/utils/rhumb'
import { computeLegTable } from '../shared/utils/legTable'
import type { LegTableWaypoint } from '../shared/utils/legTable'
import { densifyRoute } from '../shared/utils/track'
import { seededRandom } from '../tests/unit/support/random'
import { prepareZones } from '../shared/utils/zones/prepare'
import { planZoneDistances } from '../shared/utils/zones/legZones'
import { ecaZones } from '../db/seeds/ecaZones'

const G = geodesic.Geodesic
const raw = G.WGS84
const ROUNDS = Number(process.env.BENCH_ROUNDS ?? 40)

/** Best time (ms) of each side over alternating rounds. */
function sideBySide(a: () => void, b: () => void, rounds = ROUNDS): [number, number] {
  let bestA = Infinity
  let bestB = Infinity
  a(); b() // warm-up
  for (let r = 0; r < rounds; r++) {
    let t = performance.now(); a(); bestA = Math.min(bestA, performance.now() - t)
    t = performance.now(); b(); bestB = Math.min(bestB, performance.now() - t)
  }
  return [bestA, bestB]
}

const rnd = seededRandom(1852)
const N = 4_000
const lat = new Float64Array(N)
const lon = new Float64Array(N)
for (let i = 0; i < N; i++) { lat[i] = Math.asin(2 * rnd() - 1) * 180 / Math.PI; lon[i] = 360 * rnd() - 180 }
const pts = Array.from({ length: N }, (_, i) => ({ lat: lat[i]!, lon: lon[i]! }))
let sink = 0

const rawInverse = () => { for (let i = 1; i < N; i++) sink += raw.Inverse(lat[i - 1]!, lon[i - 1]!, lat[i]!, lon[i]!, G.DISTANCE | G.AZIMUTH).s12! }
const engineInverse = () => { for (let i = 1; i < N; i++) sink += geodesicInverse(pts[i - 1]!, pts[i]!).distanceM }
const engineRhumb = () => { for (let i = 1; i < N; i++) sink += rhumbInverse(pts[i - 1]!, pts[i]!).distanceM }

// A 500-waypoint ocean plan of geodesic legs of 40–200 nm, heading round the world
const plan: LegTableWaypoint[] = [{ name: 'WP1', lat: 30, lon: -170 }]
let course = 80
for (let i = 1; i < 500; i++) {
  course += (rnd() - 0.5) * 40
  const prev = plan[i - 1]!
  const d = raw.Direct(prev.lat, prev.lon, course, (40 + 160 * rnd()) * 1852)
  if (Math.abs(d.lat2!) > 60) course += 180
  plan.push({ name: `WP${i + 1}`, lat: d.lat2!, lon: d.lon2!, method: 'geodesic', turnRadiusNm: 1 })
}
const STEP_NM = 10
const engineTable = () => {
  const t = computeLegTable(plan, '2026-06-01T00:00:00Z', 14)
  const track = densifyRoute(plan, STEP_NM)
  sink += t.totals.distanceNm + track.length
}
const rawTable = () => {
  for (let i = 1; i < plan.length; i++) {
    const a = plan[i - 1]!
    const b = plan[i]!
    const inv = raw.Inverse(a.lat, a.lon, b.lat, b.lon, G.DISTANCE | G.AZIMUTH)
    const line = raw.InverseLine(a.lat, a.lon, b.lat, b.lon, G.LATITUDE | G.LONGITUDE | G.DISTANCE_IN)
    const steps = Math.max(1, Math.ceil(line.s13 / (STEP_NM * 1852)))
    for (let k = 1; k < steps; k++) sink += line.Position(line.s13 * k / steps, G.LATITUDE | G.LONGITUDE).lat2!
    sink += inv.s12!
  }
}

// Zones: the seeded ECAs; the random plan above, and a 500-waypoint plan laid through five ECAs
// (Baltic, North Sea, Channel, North American, Gulf of Mexico), where most legs meet a boundary box.
const zones = prepareZones(ecaZones.map((z, i) => ({ id: i + 1, name: z.name, kind: z.kind, polygons: z.polygons })))
const anchors: [number, number][] = [[60.0, 26.0], [59.5, 21.0], [57.0, 19.5], [55.3, 14.5], [54.6, 11.5], [57.3, 11.5], [57.9, 10.0], [57.5, 7.0],
  [54.0, 4.0], [51.5, 2.0], [50.5, 0.0], [49.9, -2.6], [49.7, -6.7], [46.0, -30.0], [44.0, -50.0], [40.4, -69.0], [40.4, -73.8], [36.0, -75.0],
  [32.0, -79.0], [27.0, -79.8], [24.3, -81.5], [25.5, -85.0], [28.5, -89.0]]
const ecaPlan: LegTableWaypoint[] = []
{
  const lens = anchors.slice(1).map((p, i) => raw.Inverse(anchors[i]![0], anchors[i]![1], p[0], p[1]).s12!)
  const total = lens.reduce((a, b) => a + b, 0)
  for (let i = 0; i < lens.length; i++) {
    const line = raw.InverseLine(anchors[i]![0], anchors[i]![1], anchors[i + 1]![0], anchors[i + 1]![1], G.LATITUDE | G.LONGITUDE | G.DISTANCE_IN)
    const n = Math.max(1, Math.round(499 * lens[i]! / total))
    for (let k = 0; k < n; k++) {
      const p = line.Position(line.s13 * k / n, G.LATITUDE | G.LONGITUDE)
      ecaPlan.push({ name: `E${ecaPlan.length + 1}`, lat: p.lat2!, lon: p.lon2!, method: ecaPlan.length % 2 ? 'geodesic' : 'rhumb' })
    }
  }
  ecaPlan.push({ name: 'End', lat: anchors.at(-1)![0], lon: anchors.at(-1)![1], method: 'rhumb' })
}
const randomLegs = computeLegTable(plan, '2026-06-01T00:00:00Z', 14).legs
const ecaLegs = computeLegTable(ecaPlan, '2026-06-01T00:00:00Z', 14).legs
const [tZonesRandom, tLegsRandom] = sideBySide(() => { sink += planZoneDistances(zones, randomLegs).legs.length }, () => { sink += computeLegTable(plan, '2026-06-01T00:00:00Z', 14).legs.length }, ROUNDS * 3)
const [tZonesEca, tLegsEca] = sideBySide(() => { sink += planZoneDistances(zones, ecaLegs).legs.length }, () => { sink += computeLegTable(ecaPlan, '2026-06-01T00:00:00Z', 14).legs.length }, ROUNDS * 3)
const [tPrepare] = sideBySide(() => { sink += prepareZones(ecaZones.map((z, i) => ({ id: i + 1, name: z.name, kind: z.kind, polygons: z.polygons }))).edges.length }, () => {}, ROUNDS)
const ecaNm = planZoneDistances(zones, ecaLegs).totals.byKind.find(k => k.kind === 'eca')!.distanceNm

const rate = (ms: number) => `${Math.round((N - 1) / ms * 1000).toLocaleString('en-GB').padStart(10)} /s`
const [tEngine, tRaw] = sideBySide(engineInverse, rawInverse)
const [tRhumb, tRaw2] = sideBySide(engineRhumb, rawInverse)
const [tTable, tRawTable] = sideBySide(engineTable, rawTable, ROUNDS * 3)
const [tLegs] = sideBySide(() => { sink += computeLegTable(plan, '2026-06-01T00:00:00Z', 14).legs.length }, () => {}, ROUNDS * 3)
const trackPoints = densifyRoute(plan, STEP_NM).length

console.log(`Passagewright engine benchmark (best of ${ROUNDS} alternating rounds; ${N - 1} random pairs)`)
console.log(`  geodesic inverse   engine ${rate(tEngine)}   raw geographiclib ${rate(tRaw)}   ratio ${(tRaw / tEngine).toFixed(2)}×  (goal ≥ 0.90×)`)
console.log(`  rhumb inverse      engine ${rate(tRhumb)}   raw geodesic      ${rate(tRaw2)}   ratio ${(tRaw2 / tRhumb).toFixed(2)}×  (goal ≥ 1.00×)`)
console.log(`  500-waypoint plan  leg table + ${STEP_NM}-nm track (${trackPoints} points) ${tTable.toFixed(2)} ms   raw calls ${tRawTable.toFixed(2)} ms   ratio ${(tTable / tRawTable).toFixed(2)}×  (goal ≤ 2.00×)`)
console.log(`  leg table alone    500 waypoints ${tLegs.toFixed(2)} ms (one frame at 60 Hz is 16.7 ms)`)
console.log(`  zones, random plan per-leg zone distances ${tZonesRandom.toFixed(2)} ms   leg table alone ${tLegsRandom.toFixed(2)} ms   ratio ${(tZonesRandom / tLegsRandom).toFixed(2)}×  (goal ≤ 1.50×)`)
console.log(`  zones, ECA plan    per-leg zone distances ${tZonesEca.toFixed(2)} ms   leg table alone ${tLegsEca.toFixed(2)} ms   ratio ${(tZonesEca / tLegsEca).toFixed(2)}×  (goal ≤ 1.50×; ${ecaLegs.length} legs, ${ecaNm.toFixed(0)} nm inside ECAs)`)
console.log(`  zones, preparing the ${zones.zones.length} seeded ECAs (${zones.edges.length} sub-edges, once per change of zones) ${tPrepare.toFixed(2)} ms`)
if (Number.isNaN(sink)) console.log('')
