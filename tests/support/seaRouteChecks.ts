// Checks of a sea route against the routing coastline (Natural Earth 1:10m), shared by the router's tests.
import { G, geod } from '../../shared/utils/engine/wgs84'
import { normaliseLongitude } from '../../shared/utils/position'
import { chordCrossesLand, isRoutingLand } from '../../server/utils/routing/coast'
import type { LandData } from '../../server/utils/land'
import type { SeaRouteResult } from '../../shared/types/routing'

/** Every leg densified every nm on the geodesic: no point on land, no chord across a coastline edge, outside passages. */
export function landPoints(land: LandData, r: SeaRouteResult): string[] {
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

/** Sum of the Karney geodesics between the waypoints, nm. */
export function legSum(r: SeaRouteResult): number {
  let s = 0
  for (let i = 0; i + 1 < r.waypoints.length; i++) {
    const a = r.waypoints[i]!, b = r.waypoints[i + 1]!
    s += geod.Inverse(a.lat, a.lon, b.lat, b.lon).s12! / 1852
  }
  return s
}

/** Geodesic distance in nm (Karney, WGS84). */
export function geodesicNm(a: { lat: number, lon: number }, b: { lat: number, lon: number }): number {
  return geod.Inverse(a.lat, a.lon, b.lat, b.lon).s12! / 1852
}
