// Sea-route distances between well-known ports against published port-to-port distance tables
// (within 4 %), the geodesic between the route's ends as a floor (Debian's GeodSolve as the
// oracle), the legs' sum (GeodSolve again) as the distance, and symmetry within 1 %.
// The published figures are from memory of the usual distance tables (NGA Pub. 151 "Distances
// Between Ports" and the commercial port-distance tables agree on them to a few tens of nm); no
// table was at hand to copy from, so each is marked "from memory".
import { describe, expect, it } from 'vitest'
import { useSeaGraph } from '../../server/utils/routing/graphStore'
import { seaRoute } from '../../server/utils/routing/seaRoute'
import type { SeaRouteResult } from '../../shared/types/routing'
import { fmt, runOracle } from './support/oracle'

const graph = await useSeaGraph()

// Port positions: the demo places (db/seeds/demoData.ts, public coordinates) where there is one,
// else the harbour entrance from memory.
const PORTS = {
  rotterdam: { lat: 51.95, lon: 4.14 },
  singapore: { lat: 1.264, lon: 103.84 },
  newYork: { lat: 40.684, lon: -74.044 },
  losAngeles: { lat: 33.72, lon: -118.27 },
  yokohama: { lat: 35.4437, lon: 139.638 },
  honolulu: { lat: 21.3, lon: -157.87 },
  capeTown: { lat: -33.908, lon: 18.433 },
  portSaid: { lat: 31.35, lon: 32.36 },
  gibraltar: { lat: 36.13, lon: -5.35 }, // from memory
  santos: { lat: -23.99, lon: -46.3 }, // from memory
  durban: { lat: -29.87, lon: 31.05 }, // from memory
  houston: { lat: 29.7, lon: -95.0 }, // Barbours Cut, Houston Ship Channel, from memory
  montreal: { lat: 45.56, lon: -73.52 }, // from memory
} as const
type Port = keyof typeof PORTS

interface Pair { from: Port, to: Port, publishedNm: number, avoid?: string[], via?: string[], notVia?: string[] }

const PAIRS: Pair[] = [
  // Published distances, nm: all from memory of published distance tables (see the top of the file).
  { from: 'rotterdam', to: 'singapore', publishedNm: 8290, via: ['suez'] }, // from memory
  { from: 'rotterdam', to: 'newYork', publishedNm: 3350 }, // from memory
  { from: 'newYork', to: 'losAngeles', publishedNm: 4930, via: ['panama'] }, // from memory
  { from: 'yokohama', to: 'losAngeles', publishedNm: 4840 }, // from memory
  { from: 'singapore', to: 'yokohama', publishedNm: 2890 }, // from memory
  { from: 'rotterdam', to: 'yokohama', publishedNm: 11170, via: ['suez'] }, // from memory
  { from: 'gibraltar', to: 'portSaid', publishedNm: 1910 }, // from memory
  { from: 'honolulu', to: 'losAngeles', publishedNm: 2230 }, // from memory
  { from: 'newYork', to: 'santos', publishedNm: 5000 }, // from memory
  { from: 'rotterdam', to: 'durban', publishedNm: 6950, avoid: ['suez'], notVia: ['suez'] }, // from memory
  { from: 'capeTown', to: 'rotterdam', publishedNm: 6170, notVia: ['suez'] }, // from memory
  { from: 'honolulu', to: 'yokohama', publishedNm: 3390 }, // from memory
  // Up the declared fairways the 1:10m coastline closes: Galveston Bay and the St. Lawrence above Québec.
  { from: 'houston', to: 'rotterdam', publishedNm: 5020, via: ['houston', 'dover'] }, // from memory
  // From memory about 3,200 nm (the tables give some 3,150 by the Strait of Belle Isle, 3,300 by Cabot Strait).
  { from: 'montreal', to: 'rotterdam', publishedNm: 3200, via: ['st-lawrence', 'dover'] }, // from memory
]

interface Row { pair: Pair, there: SeaRouteResult, back: SeaRouteResult }
const rows: Row[] = PAIRS.map(pair => ({
  pair,
  there: seaRoute(graph, PORTS[pair.from], PORTS[pair.to], { avoid: pair.avoid }),
  back: seaRoute(graph, PORTS[pair.to], PORTS[pair.from], { avoid: pair.avoid }),
}))

// GeodSolve -i (WGS84, metres): one line per route end pair and per leg, both directions.
const routes = rows.flatMap(r => [r.there, r.back])
const endLines = routes.map((r) => {
  const a = r.waypoints[0]!, b = r.waypoints.at(-1)!
  return `${fmt(a.lat)} ${fmt(a.lon)} ${fmt(b.lat)} ${fmt(b.lon)}`
})
const legLines = routes.map(r => r.waypoints.slice(1).map((b, i) => {
  const a = r.waypoints[i]!
  return `${fmt(a.lat)} ${fmt(a.lon)} ${fmt(b.lat)} ${fmt(b.lon)}`
}))
const endM = runOracle('GeodSolve', ['-i', '-p', '6'], endLines).map(v => v[2]!)
const legM = runOracle('GeodSolve', ['-i', '-p', '6'], legLines.flat()).map(v => v[2]!)
const legSumNm: number[] = []
{
  let at = 0
  for (const legs of legLines) {
    let s = 0
    for (let k = 0; k < legs.length; k++) s += legM[at + k]!
    at += legs.length
    legSumNm.push(s / 1852)
  }
}

const label = (p: Pair) => `${p.from} – ${p.to}${p.avoid ? ` (avoiding ${p.avoid.join(', ')})` : ''}`

describe('sea-route distances against published tables', () => {
  it('prints ours beside the published distance', () => {
    const lines = rows.map(({ pair, there, back }) => {
      const d = (there.distanceNm / pair.publishedNm - 1) * 100
      return `  ${label(pair).padEnd(36)} ${there.distanceNm.toFixed(0).padStart(6)} ${back.distanceNm.toFixed(0).padStart(6)} ${String(pair.publishedNm).padStart(6)} ${d.toFixed(1).padStart(6)} %  ${there.via.map(v => v.id).join(', ')}`
    })
    console.log(`pair                                    ours   back published diff   via\n${lines.join('\n')}`)
    expect(lines).toHaveLength(PAIRS.length)
  })

  it.each(rows.map(r => [label(r.pair), r] as const))('%s lies within 4 % of the published distance both ways', (_, { pair, there, back }) => {
    expect(Math.abs(there.distanceNm - pair.publishedNm) / pair.publishedNm).toBeLessThan(0.04)
    expect(Math.abs(back.distanceNm - pair.publishedNm) / pair.publishedNm).toBeLessThan(0.04)
  })

  it.each(rows.map(r => [label(r.pair), r] as const))('%s uses the passages a ship would', (_, { pair, there, back }) => {
    for (const r of [there, back]) {
      const ids = r.via.map(v => v.id)
      for (const id of pair.via ?? []) expect(ids).toContain(id)
      for (const id of pair.notVia ?? []) expect(ids).not.toContain(id)
    }
  })

  it('never answers less than the geodesic between the route\'s ends (GeodSolve)', () => {
    routes.forEach((r, i) => {
      // A route may equal its geodesic (open water between the ends): allow the rounding of GeodSolve's output.
      expect(r.distanceNm, endLines[i]).toBeGreaterThanOrEqual(endM[i]! / 1852 - 1e-6)
      expect(r.geodesicNm).toBeCloseTo(endM[i]! / 1852, 6)
    })
  })

  it('answers the sum of its legs\' geodesics (GeodSolve)', () => {
    routes.forEach((r, i) => expect(r.distanceNm, endLines[i]).toBeCloseTo(legSumNm[i]!, 5))
  })

  it('is symmetric within 1 %', () => {
    for (const { pair, there, back } of rows) {
      expect(Math.abs(there.distanceNm - back.distanceNm) / there.distanceNm, label(pair)).toBeLessThan(0.01)
    }
  })
})
