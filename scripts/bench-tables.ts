// Distance-table benchmark (capability 9): a 300-place table (44,850 pairs) built by our code,
// the pure computation without the database, side by side in one run with the raw
// geographiclib Inverse calls it needs (one distance-only Inverse per pair). Goal: ≤ 1.5×.
// The land check of the direct pairs is a separate pass of the background job; it is timed
// on its own at the end, not counted in the ratio.
// Run: node node_modules/jiti/lib/jiti-cli.mjs scripts/bench-tables.ts
import { fileURLToPath } from 'node:url'
import { createJiti } from 'jiti'
import geodesic from 'geographiclib-geodesic'
import type { TablePlace, TablePlan } from '../shared/types/distanceTable'
import { computeDistances, pairCount } from '../shared/utils/distanceTable'

const G = geodesic.Geodesic
const geod = G.WGS84
const N = 300
const ROUNDS = 7

// Deterministic places (a small linear congruential generator), spread over the navigable latitudes.
let seed = 20261201
const rand = () => ((seed = (seed * 1664525 + 1013904223) >>> 0) / 2 ** 32)
const places: TablePlace[] = Array.from({ length: N }, (_, i) => ({ id: i + 1, name: `Place ${i + 1}`, lat: -65 + rand() * 135, lon: -180 + rand() * 360 }))
// Twenty "approved plans" whose ends lie near places, so plan matching does real work.
const plans: TablePlan[] = Array.from({ length: 20 }, (_, k) => {
  const a = places[(k * 7) % N]!, b = places[(k * 13 + 5) % N]!
  return { id: k + 1, title: `Plan ${k + 1}`, start: { lat: a.lat + 0.1, lon: a.lon }, end: { lat: b.lat, lon: b.lon - 0.1 }, distanceNm: 1000 + k }
})

function rawInverse(): number {
  let sum = 0
  for (let i = 0; i < N; i++) {
    const a = places[i]!
    for (let j = i + 1; j < N; j++) {
      const b = places[j]!
      sum += geod.Inverse(a.lat, a.lon, b.lat, b.lon, G.DISTANCE).s12!
    }
  }
  return sum
}

function ourTable(): number {
  const { distanceNm } = computeDistances(places, plans, 30)
  return distanceNm[distanceNm.length - 1]!
}

function time(fn: () => number): number {
  const t = performance.now()
  fn()
  return performance.now() - t
}

const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)]!

rawInverse(); ourTable() // warm-up: both paths compiled before timing
const raw: number[] = [], ours: number[] = []
for (let r = 0; r < ROUNDS; r++) {
  // Alternate the order so neither side always runs on a warmer or cooler machine.
  if (r % 2) { ours.push(time(ourTable)); raw.push(time(rawInverse)) }
  else { raw.push(time(rawInverse)); ours.push(time(ourTable)) }
}
const { choice } = computeDistances(places, plans, 30)
const planPairs = choice.planId.filter(p => p > 0).length
console.log(`places ${N}, pairs ${pairCount(N)}, pairs taken from plans ${planPairs}, rounds ${ROUNDS} (median)`)
console.log(`raw geographiclib Inverse, one per pair : ${median(raw).toFixed(1)} ms`)
console.log(`our table build (plans + distances)    : ${median(ours).toFixed(1)} ms`)
console.log(`ratio ours / raw: ${(median(ours) / median(raw)).toFixed(2)}× (goal ≤ 1.5×)`)

// The land pass, outside the ratio: it runs after the distances in the background job.
const root = fileURLToPath(new URL('..', import.meta.url))
const jiti = createJiti(import.meta.url, { alias: { '#shared': `${root}shared` } })
const { geodesicCrossesLand, LAND_STEP_NM } = await jiti.import<typeof import('../server/utils/land')>('../server/utils/land.ts')
geodesicCrossesLand(0, 0, 1, 1)
const t0 = performance.now()
let crossing = 0
for (let i = 0; i < N; i++) for (let j = i + 1; j < N; j++) if (geodesicCrossesLand(places[i]!.lat, places[i]!.lon, places[j]!.lat, places[j]!.lon)) crossing++
console.log(`land pass over all ${pairCount(N)} direct pairs (geodesic every ${LAND_STEP_NM} nm, stops at the first crossing): ${((performance.now() - t0) / 1000).toFixed(1)} s, ${crossing} cross land`)
