// The sea router against the routing coastline (Natural Earth 1:10m) and published distances.
// Port positions are the demo places (public coordinates) or, where named, from memory.
import { describe, expect, it } from 'vitest'
import { G, geod } from '../../shared/utils/engine/wgs84'
import { normaliseLongitude } from '../../shared/utils/position'
import { useSeaGraph } from '../../server/utils/routing/graphStore'
import { seaRoute } from '../../server/utils/routing/seaRoute'
import { chordCrossesLand, isRoutingLand } from '../../server/utils/routing/coast'
import type { SeaRouteResult } from '../../shared/types/routing'

const graph = await useSeaGraph()
const land = graph.land

const ROTTERDAM = { lat: 51.95, lon: 4.14 }
const SINGAPORE = { lat: 1.264, lon: 103.84 }
const NEW_YORK = { lat: 40.684, lon: -74.044 }
const LOS_ANGELES = { lat: 33.72, lon: -118.27 }

/** Every leg densified every nm on the geodesic: no point on land, no chord across a coastline edge, outside passages. */
function landPoints(r: SeaRouteResult): string[] {
  const bad: string[] = []
  for (let i = 0; i + 1 < r.waypoints.length; i++) {
    const a = r.waypoints[i]!, b = r.waypoints[i + 1]!
    if (a.passageId && a.passageId === b.passageId) continue
    const line = geod.InverseLine(a.lat, a.lon, b.lat, b.lon, G.LATITUDE | G.LONGITUDE | G.DISTANCE_IN)
    const n = Math.max(1, Math.ceil(line.s13 / 1852))
    let prev = { lat: a.lat, lon: a.lon }
    for (let k = 1; k <= n; k++) {
      const p = k === n ? { lat: b.lat, lon: b.lon } : (({ lat2, lon2 }) => ({ lat: lat2!, lon: lon2! }))(line.Position((line.s13 * k) / n, G.LATITUDE | G.LONGITUDE))
      const bx = prev.lon + normaliseLongitude(p.lon - prev.lon)
      if (isRoutingLand(land, p.lat, p.lon) || chordCrossesLand(land, prev.lon, prev.lat, bx, p.lat)) bad.push(`leg ${i} at ${p.lat.toFixed(3)}, ${p.lon.toFixed(3)}`)
      prev = p
    }
  }
  return bad
}

function legSum(r: SeaRouteResult): number {
  let s = 0
  for (let i = 0; i + 1 < r.waypoints.length; i++) {
    const a = r.waypoints[i]!, b = r.waypoints[i + 1]!
    s += geod.Inverse(a.lat, a.lon, b.lat, b.lon).s12! / 1852
  }
  return s
}

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
