// Whether a position lies inside a zone: count the crossings of the meridian northward from it
// with the zone's boundary (even–odd rule per polygon, so holes work), deciding each straddling
// geodesic edge exactly by the side the position lies on (the azimuth of the geodesic to it from
// the edge's start against the edge's own course; Karney 2013, inverse problem).
import type { PreparedZones } from './prepare'
import { searchWrapped } from './prepare'
import { G, geod, wrap180 } from './geometry'

/** Is the sub-edge north of the position (the position lies to the south of its geodesic)? */
function edgeAbove(lat1: number, lon1: number, azi1: number, eastward: boolean, lat: number, lon: number): boolean {
  const r = geod.Inverse(lat1, lon1, lat, lon, G.AZIMUTH)
  const side = Math.sin((r.azi1! - azi1) * Math.PI / 180)
  return eastward ? side > 0 : side < 0
}

/** True when (lat, lon) lies inside the zone (inside one of its polygons and outside that polygon's holes). */
export function pointInZone(prepared: PreparedZones, zoneIndex: number, lat: number, lon: number): boolean {
  const z = prepared.zones[zoneIndex]
  if (!z || lat < z.latMin || lat > z.latMax) return false
  const parity = new Uint8Array(z.polygonCount)
  searchWrapped(prepared.edgeIndex, lon, lat, lon, z.latMax, (i) => {
    const e = prepared.edges[i]!
    if (e.zone !== zoneIndex) return
    const p = e.lon1 + wrap180(lon - e.lon1)
    // Half-open in longitude, so a meridian through a vertex counts it once.
    if (!((e.lon1 <= p && p < e.lon2) || (e.lon2 <= p && p < e.lon1))) return
    if (lat > e.latMax) return
    if (lat < e.latMin || edgeAbove(e.lat1, e.lon1, e.azi1, e.lon2 > e.lon1, lat, lon)) parity[e.poly]! ^= 1
  })
  return parity.includes(1)
}
