// Distance inside zones against an independent dense sampling (tests/unit/support/zoneReference.ts:
// positions from Debian's GeodSolve/RhumbSolve every 0.1 nm, winding-number classification) on
// generated star-shaped zones that legs cross several times, with holes, and across 180°.
import { describe, expect, it } from 'vitest'
import geodesic from 'geographiclib-geodesic'
import { prepareZones } from '../../shared/utils/zones/prepare'
import { legZoneDistances } from '../../shared/utils/zones/legZones'
import { pointInZone } from '../../shared/utils/zones/inside'
import type { ZoneInput } from '../../shared/utils/zones/types'
import { seededRandom } from './support/random'
import { fmt, runOracle } from './support/oracle'
import { insideByWinding, sampledInsideNm } from './support/zoneReference'

const G = geodesic.Geodesic
const geod = G.WGS84
const NM = 1852
type Ring = [number, number][]

function star(rnd: () => number, lat: number, lon: number, radiusNm: number, points: number, inner: number): Ring {
  const ring: Ring = []
  const turn = 360 * rnd()
  for (let i = 0; i < points; i++) {
    const r = radiusNm * (i % 2 === 0 ? 1 : inner + (1 - inner) * 0.3 * rnd())
    const d = geod.Direct(lat, lon, turn + 360 * i / points, r * NM)
    ring.push([((d.lon2! + 540) % 360) - 180, d.lat2!])
  }
  ring.push([...ring[0]!])
  return ring
}

interface Case { name: string, polygons: Ring[][], from: [number, number], to: [number, number], method: 'geodesic' | 'rhumb' }

function generate(seed: number, count: number, nearAntimeridian: boolean): Case[] {
  const rnd = seededRandom(seed)
  return Array.from({ length: count }, (_, i) => {
    const lat = -60 + 120 * rnd()
    const lon = nearAntimeridian ? (rnd() < 0.5 ? 179.4 + 0.6 * rnd() : -180 + 0.6 * rnd()) : -180 + 360 * rnd()
    const radius = 60 + 240 * rnd()
    const outer = star(rnd, lat, lon, radius, 8 + 2 * Math.floor(5 * rnd()), 0.4 + 0.2 * rnd())
    const polygons: Ring[][] = [i % 3 === 0 ? [outer, star(rnd, lat, lon, radius * 0.18, 6, 0.6)] : [outer]]
    const bearing = 360 * rnd()
    const start = i % 5 === 4 ? 0.05 : 1.4
    const a = geod.Direct(lat, lon, bearing, start * radius * NM)
    const b = geod.Direct(lat, lon, bearing + 180 + 70 * (rnd() - 0.5), 1.4 * radius * NM)
    return { name: `case ${i + 1} at ${lat.toFixed(1)}, ${lon.toFixed(1)}`, polygons, from: [a.lat2!, a.lon2!], to: [b.lat2!, b.lon2!], method: rnd() < 0.5 ? 'geodesic' : 'rhumb' }
  })
}

/** Course and length of the leg as the oracle computes them (GeodSolve -i / RhumbSolve -i). */
function oracleLeg(c: Case) {
  const tool = c.method === 'geodesic' ? 'GeodSolve' : 'RhumbSolve'
  const [r] = runOracle(tool, ['-i', '-p', '9'], [`${fmt(c.from[0])} ${fmt(c.from[1])} ${fmt(c.to[0])} ${fmt(c.to[1])}`])
  return c.method === 'geodesic' ? { course: r![0]!, lengthM: r![2]! } : { course: r![0]!, lengthM: r![1]! }
}

const zoneOf = (polygons: Ring[][]): ZoneInput => ({ id: 1, name: 'Generated', kind: 'custom', polygons })

function engineNm(c: Case): number {
  const prepared = prepareZones([zoneOf(c.polygons)])
  const found = legZoneDistances(prepared, { from: { lat: c.from[0], lon: c.from[1] }, to: { lat: c.to[0], lon: c.to[1] }, method: c.method })
  return found[0]?.distanceNm ?? 0
}

describe('distance inside a zone against dense sampling (0.1 nm, GeodSolve/RhumbSolve positions)', () => {
  const cases = [...generate(1852, 14, false), ...generate(6378, 8, true)]

  it.each(cases.map(c => [c.name, c] as const))('%s', (_name, c) => {
    const leg = oracleLeg(c)
    const expected = sampledInsideNm({ lat1: c.from[0], lon1: c.from[1], course: leg.course, lengthM: leg.lengthM, method: c.method }, c.polygons)
    expect(Math.abs(engineNm(c) - expected), `${c.method}, expected ${expected.toFixed(4)} nm`).toBeLessThan(0.1)
  })

  it('the generated legs cross boundaries several times and some cross 180°', () => {
    const crossings = cases.map((c) => {
      const leg = oracleLeg(c)
      const pts = runOracle(c.method === 'geodesic' ? 'GeodSolve' : 'RhumbSolve', ['-L', fmt(c.from[0]), fmt(c.from[1]), fmt(leg.course), '-p', '9'],
        Array.from({ length: 401 }, (_, k) => fmt(leg.lengthM * k / 400, 6)))
      const flags = pts.map(p => insideByWinding(c.polygons, p[0]!, p[1]!))
      return flags.slice(1).filter((f, k) => f !== flags[k]).length
    })
    expect(Math.max(...crossings)).toBeGreaterThanOrEqual(4)
    expect(crossings.filter(n => n >= 2).length).toBeGreaterThan(cases.length / 2)
    expect(cases.filter(c => Math.sign(c.from[1]) !== Math.sign(c.to[1]) && Math.abs(c.from[1]) > 170).length).toBeGreaterThan(2)
  })
})

describe('point in zone', () => {
  // A 2°×2° square with geodesic edges and a hole; positions checked against the winding number.
  const outer: Ring = [[10, 50], [12, 50], [12, 52], [10, 52], [10, 50]]
  const hole: Ring = [[10.8, 50.8], [11.2, 50.8], [11.2, 51.2], [10.8, 51.2], [10.8, 50.8]]
  const prepared = prepareZones([zoneOf([[outer, hole]])])

  it.each([
    [50.5, 11, true], [51, 11, false], [52.5, 11, false], [50.005, 11, true], [49.999, 11, false], [51.5, 9.99, false], [51.5, 10.01, true],
  ] as const)('(%f, %f) inside: %s', (lat, lon, inside) => {
    expect(pointInZone(prepared, 0, lat, lon)).toBe(inside)
    expect(insideByWinding([[outer, hole]], lat, lon)).toBe(inside)
  })

  it('the edges are geodesics: the edge from (52°N, 10°E) to (52°N, 12°E) bows north of the parallel', () => {
    // GeodSolve -L 52 10 89.2... at half its length: 52.004245°N 11.000001°E; the 50°N edge reaches 50.004309°N.
    for (const [lat, inside] of [[52.0042, true], [52.0043, false], [50.0043, false], [50.0044, true]] as const) {
      expect(pointInZone(prepared, 0, lat, 11), `${lat}`).toBe(inside)
      expect(insideByWinding([[outer, hole]], lat, 11), `${lat}`).toBe(inside)
    }
  })
})
