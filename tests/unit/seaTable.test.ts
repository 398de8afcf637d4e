// Sea distances of a distance table (one Dijkstra per origin, server/utils/routing/tableSearch.ts)
// for the six-port table of the sea-routes issue: every pair routes over sea, within 4 % of the
// published port-to-port distance where one is known (all from memory of the usual tables, NGA
// Pub. 151 "Distances Between Ports" and the commercial ones; no table was at hand), never below the
// geodesic between the places (Debian's GeodSolve as the oracle), equal to the GeodSolve sum of the
// legs, and within 1 % of the single sea route (A*) between the same places. Over a seeded sample of
// sea positions, no table figure is more than 0.5 % longer than the single route's (a path smoothed
// all at once): the table smooths its paths in windows cut at fixed nodes and searches a graph
// costed and pruned once per table (tableGraph.ts), and neither may cost that.
import { describe, expect, it } from 'vitest'
import { useSeaGraph } from '../../server/utils/routing/graphStore'
import { seaRoute } from '../../server/utils/routing/seaRoute'
import { seaTable } from '../../server/utils/routing/tableSearch'
import type { TableSeaRoute } from '../../server/utils/routing/tableSearch'
import { isRoutingLand } from '../../server/utils/routing/coast'
import { fmt, runOracle } from './support/oracle'
import { seededRandom } from './support/random'

const graph = await useSeaGraph()

// The demo places' positions (db/seeds/demoData.ts) where there is one, else the harbour entrance from memory.
const PORTS = [
  { name: 'Rotterdam', lat: 51.95, lon: 4.14 },
  { name: 'New York', lat: 40.684, lon: -74.044 },
  { name: 'Singapore', lat: 1.264, lon: 103.84 },
  { name: 'Yokohama', lat: 35.4437, lon: 139.638 },
  { name: 'Santos', lat: -23.99, lon: -46.3 }, // from memory
  { name: 'Durban', lat: -29.87, lon: 31.05 }, // from memory
]

// Published distances, nm, all from memory (see the top of the file).
const PUBLISHED: Record<string, number> = {
  'Rotterdam–Singapore': 8290, // from memory
  'Rotterdam–New York': 3350, // from memory
  'Rotterdam–Yokohama': 11170, // from memory
  'New York–Santos': 5000, // from memory
  'Singapore–Yokohama': 2890, // from memory
  'Rotterdam–Durban': 6950, // from memory (by the Cape)
}

async function table(avoid?: string[]) {
  const cells = new Map<string, TableSeaRoute | null>()
  const done = await seaTable(graph, PORTS, { avoid }, (i, j, r) => cells.set(`${PORTS[i]!.name}–${PORTS[j]!.name}`, r))
  return { done, cells }
}

const plain = await table()
const noSuez = await table(['suez'])
const pairs = [...plain.cells.keys()]

describe('sea distances of the six-port table', () => {
  it('routes all 15 pairs over sea', () => {
    expect(plain.done).toBe(true)
    expect(pairs).toHaveLength(15)
    for (const [pair, r] of plain.cells) expect(r, pair).not.toBeNull()
  })

  it.each(Object.entries(PUBLISHED))('%s lies within 4 % of the published %d nm', (pair, nm) => {
    expect(Math.abs(plain.cells.get(pair)!.distanceNm - nm) / nm).toBeLessThan(0.04)
  })

  it('goes Europe–Asia by Suez, and round the Cape when Suez is avoided', () => {
    expect(plain.cells.get('Rotterdam–Singapore')!.via).toContain('suez')
    expect(plain.cells.get('Rotterdam–Yokohama')!.via).toContain('suez')
    const cape = noSuez.cells.get('Rotterdam–Singapore')!
    expect(cape.via).not.toContain('suez')
    // By the Cape about 11,750 nm (from memory); at least well over the Suez figure.
    expect(Math.abs(cape.distanceNm - 11750) / 11750).toBeLessThan(0.04)
    expect(plain.cells.get('New York–Yokohama')!.via).toContain('panama')
  })

  it('never answers less than the geodesic between the places, and answers the sum of its legs (GeodSolve)', () => {
    const routes = [...plain.cells.values()].map(r => r!)
    const ends = runOracle('GeodSolve', ['-i', '-p', '6'], routes.map((r) => {
      const a = r.waypoints[0]!, b = r.waypoints.at(-1)!
      return `${fmt(a.lat)} ${fmt(a.lon)} ${fmt(b.lat)} ${fmt(b.lon)}`
    }))
    const legs = routes.map(r => runOracle('GeodSolve', ['-i', '-p', '6'], r.waypoints.slice(1).map((b, k) => {
      const a = r.waypoints[k]!
      return `${fmt(a.lat)} ${fmt(a.lon)} ${fmt(b.lat)} ${fmt(b.lon)}`
    })).reduce((s, v) => s + v[2]!, 0) / 1852)
    routes.forEach((r, k) => {
      expect(r.distanceNm, pairs[k]).toBeGreaterThanOrEqual(ends[k]![2]! / 1852 - 1e-6)
      expect(r.distanceNm, pairs[k]).toBeCloseTo(legs[k]!, 5)
    })
  })

  it('agrees within 1 % with the single sea route between the same places', () => {
    for (let i = 0; i < PORTS.length; i++) {
      for (let j = i + 1; j < PORTS.length; j++) {
        const pair = `${PORTS[i]!.name}–${PORTS[j]!.name}`
        const single = seaRoute(graph, PORTS[i]!, PORTS[j]!)
        expect(Math.abs(plain.cells.get(pair)!.distanceNm - single.distanceNm) / single.distanceNm, pair).toBeLessThan(0.01)
      }
    }
  })
})

describe('sea distances of a table of random sea positions', () => {
  // 12 positions afloat between 60°S and 65°N, half of them graph nodes near a coast (like ports).
  const rand = seededRandom(20261202)
  const places: { lat: number, lon: number }[] = []
  while (places.length < 6) {
    const lat = -60 + rand() * 125, lon = -180 + rand() * 360
    if (!isRoutingLand(graph.land, lat, lon)) places.push({ lat, lon })
  }
  while (places.length < 12) {
    const v = Math.floor(rand() * graph.nodeCount)
    if (graph.clearNm[v]! < 15 && !graph.nodePassage[v] && Math.abs(graph.lat[v]!) < 65) places.push({ lat: graph.lat[v]!, lon: graph.lon[v]! })
  }

  it('is never more than 0.5 % longer than the single sea route, and about equal to it', async () => {
    const diffs: number[] = []
    await seaTable(graph, places, {}, (i, j, r) => {
      let single: number | null = null
      try { single = seaRoute(graph, places[i]!, places[j]!).distanceNm }
      catch { single = null }
      expect(r === null, `${i}–${j}`).toBe(single === null)
      if (r && single) {
        expect(r.distanceNm, `${i}–${j}`).toBeLessThanOrEqual(single * 1.005)
        diffs.push(Math.abs(r.distanceNm - single) / single)
      }
    })
    expect(diffs.length).toBeGreaterThan(50)
    diffs.sort((a, b) => a - b)
    expect(diffs[diffs.length >> 1]).toBeLessThan(0.001)
  })
})
