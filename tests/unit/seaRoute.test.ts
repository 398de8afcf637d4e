// The sea router against the routing coastline (Natural Earth 1:10m) and published distances.
// Port positions are the demo places (public coordinates) or, where named, from memory.
import { describe, expect, it } from 'vitest'
import { useSeaGraph } from '../../server/utils/routing/graphStore'
import { seaRoute } from '../../server/utils/routing/seaRoute'
import { EndError } from '../../server/utils/routing/ends'
import { isRoutingLand } from '../../server/utils/routing/coast'
import { geodesicNm, landPoints as landPointsOn, legSum } from '../support/seaRouteChecks'
import type { SeaRouteResult } from '../../shared/types/routing'

const graph = await useSeaGraph()
const land = graph.land
const landPoints = (r: SeaRouteResult) => landPointsOn(land, r)

const ROTTERDAM = { lat: 51.95, lon: 4.14 }
const SINGAPORE = { lat: 1.264, lon: 103.84 }
const NEW_YORK = { lat: 40.684, lon: -74.044 }
const LOS_ANGELES = { lat: 33.72, lon: -118.27 }

describe('sea routes', () => {
  it('takes Rotterdam to Singapore by Suez, within 4 % of the published distance', () => {
    const r = seaRoute(graph, ROTTERDAM, SINGAPORE)
    // About 8,290 nm (NGA Pub. 151, Distances Between Ports, as the product brief quotes it).
    expect(Math.abs(r.distanceNm - 8290) / 8290).toBeLessThan(0.04)
    expect(r.via.map(v => v.id)).toEqual(expect.arrayContaining(['dover', 'gibraltar', 'suez', 'bab-el-mandeb', 'malacca']))
    expect(r.distanceNm).toBeGreaterThan(r.geodesicNm)
    expect(r.distanceNm).toBeCloseTo(legSum(r), 6)
    expect(landPoints(r)).toEqual([])
  })

  it('goes round the Cape of Good Hope when Suez is avoided', () => {
    const r = seaRoute(graph, ROTTERDAM, SINGAPORE, { avoid: ['suez'] })
    expect(r.via.map(v => v.id)).not.toContain('suez')
    // The Cape of Good Hope lies at 34°21′S (from memory).
    expect(Math.min(...r.waypoints.map(w => w.lat))).toBeLessThan(-34.3)
    expect(landPoints(r)).toEqual([])
  })

  it('takes New York to Los Angeles by Panama', () => {
    const r = seaRoute(graph, NEW_YORK, LOS_ANGELES)
    expect(r.via.map(v => v.id)).toContain('panama')
    expect(landPoints(r)).toEqual([])
  })
})

describe('route ends', () => {
  it('joins mid-ocean positions far from any graph node, sailing the geodesic where no land lies between', () => {
    // 0°, 140°W to 10°N, 150°W in the open Pacific: 1,565,109.099 m (GeodSolve -i, WGS84) = 845.091 nm.
    const r = seaRoute(graph, { lat: 0, lon: -140 }, { lat: 10, lon: -150 })
    expect(r.moved).toEqual({})
    expect(r.waypoints[0]).toMatchObject({ lat: 0, lon: -140 })
    expect(r.waypoints.at(-1)).toMatchObject({ lat: 10, lon: -150 })
    expect(r.distanceNm).toBeCloseTo(1565109.099 / 1852, 2)
    // 30°S, 20°W to 45°S, 10°E in the South Atlantic: 3,104,263.726 m (GeodSolve -i) = 1,676.168 nm.
    const s = seaRoute(graph, { lat: -30, lon: -20 }, { lat: -45, lon: 10 })
    expect(s.distanceNm).toBeCloseTo(3104263.726 / 1852, 2)
  })

  it('moves a position the coarse coastline puts ashore to the nearest water and says by how much', () => {
    // Leiden lies some 4–5 nm inland of the North Sea beach at Katwijk (from memory).
    const leiden = { lat: 52.16, lon: 4.49 }
    expect(isRoutingLand(land, leiden.lat, leiden.lon)).toBe(true)
    const r = seaRoute(graph, leiden, { lat: 52.0, lon: 3.5 })
    expect(r.moved.from).toBeGreaterThan(3)
    expect(r.moved.from).toBeLessThan(8)
    expect(r.moved.to).toBeUndefined()
    const start = r.waypoints[0]!
    expect(isRoutingLand(land, start.lat, start.lon)).toBe(false)
    // `moved` is the distance from the position asked for to the first waypoint (the README's contract).
    expect(Math.abs(geodesicNm(leiden, start) - r.moved.from!)).toBeLessThan(0.05)
    expect(landPoints(r)).toEqual([])
  })

  it('moves an end in water the coarse coastline closes off onto the open sea nearby, and says by how much', () => {
    // A bay of Pag island off the Croatian coast (from memory): afloat on the 1:10m coastline, but in water it closes off.
    const closedIn = { lat: 44.485, lon: 15.107 }
    expect(isRoutingLand(land, closedIn.lat, closedIn.lon)).toBe(false)
    const r = seaRoute(graph, closedIn, { lat: 44.0, lon: 14.0 })
    expect(r.moved.from).toBeGreaterThan(1)
    expect(r.moved.from).toBeLessThanOrEqual(20)
    expect(Math.abs(geodesicNm(closedIn, r.waypoints[0]!) - r.moved.from!)).toBeLessThan(0.05)
    expect(r.moved.to).toBeUndefined()
    expect(landPoints(r)).toEqual([])
  })

  it.each([
    // Harbour positions from memory: each lies behind narrows the graph's cells are too coarse for.
    ['Trondheim', { lat: 63.44, lon: 10.4 }],
    ['Oslo', { lat: 59.9, lon: 10.74 }],
    ['Philadelphia', { lat: 39.93, lon: -75.14 }],
  ] as const)('reaches %s behind its narrows, moved less than 3 nm', (_, port) => {
    const r = seaRoute(graph, port, { lat: 40, lon: -40 })
    expect(r.moved.from ?? 0).toBeLessThan(3)
    expect(landPoints(r)).toEqual([])
    expect(r.distanceNm).toBeGreaterThanOrEqual(r.geodesicNm)
  })

  it('refuses a position more than 20 nm from navigable water, naming the end', () => {
    // Seville lies some 30 nm up the Guadalquivir from the sea at Sanlúcar (from memory).
    expect(() => seaRoute(graph, { lat: 37.38, lon: -5.99 }, { lat: 36, lon: -8 })).toThrow(EndError)
    try { seaRoute(graph, { lat: 36, lon: -8 }, { lat: 37.38, lon: -5.99 }) }
    catch (e) {
      expect(e).toBeInstanceOf(EndError)
      expect((e as EndError).field).toBe('to')
      expect((e as EndError).message).toMatch(/^to lies more than 20 nm from navigable water/)
    }
    expect.assertions(4)
  })
})
