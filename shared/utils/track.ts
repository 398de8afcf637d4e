// Densified tracks for drawing and land checks, and longitude unwrapping across 180°.
import type { LatLon, LegMethod } from '../types/geo'
import { geodesicDensify } from './geodesic'
import { rhumbDensify } from './rhumb'
import { wrapLongitude } from './position'

/** Points along a leg at most stepNm apart, both ends included (geodesic: Karney 2013; rhumb: Karney 2024). */
export function densifyLeg(from: LatLon, to: LatLon, method: LegMethod, stepNm: number): LatLon[] {
  return method === 'geodesic' ? geodesicDensify(from, to, stepNm) : rhumbDensify(from, to, stepNm)
}

/** A whole route densified leg by leg; the method of each waypoint is that of the leg arriving at it. */
export function densifyRoute(waypoints: readonly (LatLon & { method?: LegMethod })[], stepNm: number): LatLon[] {
  const out: LatLon[] = waypoints.length ? [{ lat: waypoints[0]!.lat, lon: waypoints[0]!.lon }] : []
  for (let i = 1; i < waypoints.length; i++) {
    const pts = densifyLeg(waypoints[i - 1]!, waypoints[i]!, waypoints[i]!.method ?? 'rhumb', stepNm)
    for (let k = 1; k < pts.length; k++) out.push(pts[k]!)
  }
  return out
}

/** Longitudes made continuous (each within 180° of the previous) so a track draws across the 180° meridian. */
export function unwrapLongitudes<T extends LatLon>(points: readonly T[]): T[] {
  const out: T[] = []
  let prev = 0
  for (let i = 0; i < points.length; i++) {
    const p = points[i]!
    let lon = p.lon
    if (i > 0) lon = prev + wrapLongitude(lon - prev)
    out.push(lon === p.lon ? p : { ...p, lon })
    prev = lon
  }
  return out
}
