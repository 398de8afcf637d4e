// A sweep of the sea router: 200 seeded-random pairs of sea positions and every pair of the demo
// places. Each route is checked against the routing coastline (Natural Earth 1:10m, the land index
// the router uses) every nm along each leg's geodesic, against the geodesic between its ends
// (Debian's GeodSolve as the oracle) and for where its ends lie.
import { describe, expect, it } from 'vitest'
import { demoPlaces } from '../../db/seeds/demoData'
import { useSeaGraph } from '../../server/utils/routing/graphStore'
import { seaRoute } from '../../server/utils/routing/seaRoute'
import { coastDistanceNm, isRoutingLand } from '../../server/utils/routing/coast'
import { MAX_END_MOVE_NM } from '../../shared/types/routing'
import type { LatLon } from '../../shared/types/geo'
import { landPoints } from '../support/seaRouteChecks'
import { fmt, runOracle } from './support/oracle'
import { seededRandom } from './support/random'

const graph = await useSeaGraph()
const land = graph.land

/**
 * Closed water bodies a random point may fall in that no sea route reaches (bounding boxes, from
 * memory): the Caspian Sea and the Great Lakes.
 */
const CLOSED_WATERS = [
  { south: 36, north: 47.5, west: 46, east: 55.5 },
  { south: 41, north: 49.5, west: -93, east: -76 },
]

/**
 * Random sea positions between 65°S and 70°N (inside the default limiting latitude of 72°): every
 * other one at least 30 nm off the coast (open sea), the rest anywhere afloat (coastal water too).
 */
function seaPositions(count: number, seed: number): LatLon[] {
  const rand = seededRandom(seed)
  const out: LatLon[] = []
  while (out.length < count) {
    const lat = -65 + rand() * 135, lon = -180 + rand() * 360
    if (CLOSED_WATERS.some(w => lat >= w.south && lat <= w.north && lon >= w.west && lon <= w.east)) continue
    if (isRoutingLand(land, lat, lon)) continue
    if (out.length % 2 === 0 && coastDistanceNm(land, lat, lon, 30).nm < 30) continue
    out.push({ lat, lon })
  }
  return out
}

interface Case { name: string, from: LatLon, to: LatLon }
const random = seaPositions(400, 20261202)
const cases: Case[] = Array.from({ length: 200 }, (_, i) => ({ name: `random pair ${i + 1}`, from: random[2 * i]!, to: random[2 * i + 1]! }))
for (let i = 0; i < demoPlaces.length; i++) {
  for (let j = i + 1; j < demoPlaces.length; j++) {
    const a = demoPlaces[i]!, b = demoPlaces[j]!
    cases.push({ name: `${a.name} – ${b.name}`, from: { lat: a.lat, lon: a.lon }, to: { lat: b.lat, lon: b.lon } })
  }
}

// A refusal is kept, not thrown, so the case that failed is named by its own test.
const answers = cases.map((c) => {
  try { return seaRoute(graph, c.from, c.to) }
  catch (e) { return e as Error }
})
const routes = answers.map(a => (a instanceof Error ? undefined : a))
const line = (a: LatLon, b: LatLon) => `${fmt(a.lat)} ${fmt(a.lon)} ${fmt(b.lat)} ${fmt(b.lon)}`
// GeodSolve -i: the geodesic between each route's ends, and how far each end lies from the position asked for (metres).
const oracle = runOracle('GeodSolve', ['-i', '-p', '6'], routes.flatMap((r, i) => !r ? ['0 0 0 0', '0 0 0 0', '0 0 0 0'] : [
  line(r.waypoints[0]!, r.waypoints.at(-1)!), line(cases[i]!.from, r.waypoints[0]!), line(cases[i]!.to, r.waypoints.at(-1)!),
])).map(v => v[2]! / 1852)

describe('sea-route sweep: 200 random sea pairs and every pair of the demo places', () => {
  it('has the cases it says', () => {
    expect(cases).toHaveLength(200 + (demoPlaces.length * (demoPlaces.length - 1)) / 2)
  })

  it.each(cases.map((c, i) => [c.name, i] as const))('%s finds a route', (_, i) => {
    expect(answers[i]).not.toBeInstanceOf(Error)
  })

  it.each(cases.map((c, i) => [c.name, i] as const))('%s keeps off the land every nm of every leg', (_, i) => {
    if (!routes[i]) throw answers[i]
    expect(landPoints(land, routes[i])).toEqual([])
  })

  it.each(cases.map((c, i) => [c.name, i] as const))('%s is never shorter than the geodesic between its ends (GeodSolve)', (_, i) => {
    // Equal where open water lies between the ends: allow GeodSolve's printed precision.
    if (!routes[i]) throw answers[i]
    expect(routes[i].distanceNm).toBeGreaterThanOrEqual(oracle[3 * i]! - 1e-6)
  })

  it.each(cases.map((c, i) => [c.name, i] as const))('%s starts and ends as asked, or moved at most 20 nm and says by how much', (_, i) => {
    const r = routes[i]
    if (!r) throw answers[i]
    for (const [end, nm] of [['from', oracle[3 * i + 1]!], ['to', oracle[3 * i + 2]!]] as const) {
      expect(nm).toBeLessThanOrEqual(MAX_END_MOVE_NM)
      // Unmoved ends are the position asked for (to GeodSolve's printed precision); moved ones say how far.
      if (r.moved[end] === undefined) expect(nm).toBeLessThan(1e-8)
      else expect(Math.abs(nm - r.moved[end])).toBeLessThan(0.05)
    }
  })
})
