// Geodesics on WGS84 through geographiclib-geodesic (Karney, "Algorithms for geodesics", J. Geodesy 87, 2013).
import { G, geod } from './engine/wgs84'
import type { LatLon } from '../types/geo'
import { NM_M, RAD_PER_DEG, DEG_PER_RAD, WGS84_F } from './navConstants'
import { normaliseCourse, normaliseLongitude } from './position'
import { stepCount } from './engine/steps'

const LATLON = G.LATITUDE | G.LONGITUDE
const INVERSE_MASK = G.DISTANCE | G.AZIMUTH

export interface GeodesicInverseResult {
  distanceM: number
  distanceNm: number
  initialCourse: number
  finalCourse: number
  /** Arc length on the auxiliary sphere, degrees. */
  arcDeg: number
}

export interface GeodesicDirectResult { lat: number, lon: number, finalCourse: number }

/** Geodesic inverse problem: distance and courses (Karney 2013, §4). */
export function geodesicInverse(from: LatLon, to: LatLon): GeodesicInverseResult {
  const r = geod.Inverse(from.lat, from.lon, to.lat, to.lon, INVERSE_MASK)
  return {
    distanceM: r.s12!,
    distanceNm: r.s12! / NM_M,
    initialCourse: normaliseCourse(r.azi1!),
    finalCourse: normaliseCourse(r.azi2!),
    arcDeg: r.a12,
  }
}

/** Geodesic direct problem: position and final course after a course and distance (Karney 2013, §3). */
export function geodesicDirect(from: LatLon, courseDeg: number, distanceM: number): GeodesicDirectResult {
  const r = geod.Direct(from.lat, from.lon, courseDeg, distanceM, LATLON | G.AZIMUTH)
  return { lat: r.lat2!, lon: normaliseLongitude(r.lon2!), finalCourse: normaliseCourse(r.azi2!) }
}

/** Position at a distance along the geodesic from → to (Karney 2013, §3, GeodesicLine). */
export function geodesicPointAt(from: LatLon, to: LatLon, distanceM: number): LatLon {
  const line = geod.InverseLine(from.lat, from.lon, to.lat, to.lon, LATLON | G.DISTANCE_IN)
  const p = line.Position(distanceM, LATLON)
  return { lat: p.lat2!, lon: p.lon2! }
}

/** Points along the geodesic at most stepNm apart, both ends included (Karney 2013, §3). */
export function geodesicDensify(from: LatLon, to: LatLon, stepNm: number): LatLon[] {
  const line = geod.InverseLine(from.lat, from.lon, to.lat, to.lon, LATLON | G.DISTANCE_IN)
  const total = line.s13
  const steps = stepCount(total, stepNm)
  const out: LatLon[] = [{ lat: from.lat, lon: normaliseLongitude(from.lon) }]
  for (let i = 1; i < steps; i++) {
    const p = line.Position(total * i / steps, LATLON)
    out.push({ lat: p.lat2!, lon: p.lon2! })
  }
  out.push({ lat: to.lat, lon: normaliseLongitude(to.lon) })
  return out
}

export interface GeodesicVertex {
  lat: number
  lon: number
  /** True when the vertex lies strictly between the ends of the leg (the leg's highest latitude). */
  between: boolean
  /** Distance from the start along the (extended) geodesic to the vertex, metres; negative if behind. */
  distanceFromStartM: number
}

/** Arc σ1 from the node (equator crossing) to a point on the auxiliary sphere: tan σ1 = tan β1 / cos α1 (Karney 2013, eq. 11). */
export function geodesicArcFromNodeDeg(lat: number, calp: number): number {
  const phi = lat * RAD_PER_DEG
  const sbet = (1 - WGS84_F) * Math.sin(phi)
  const cbet = Math.abs(lat) === 90 ? 0 : Math.cos(phi)
  return Math.atan2(sbet, calp * cbet) * DEG_PER_RAD
}

/** Vertex of a geodesic: the point of highest latitude, at σ = ±90° from the node (Clairaut; Karney 2013, §2). */
export function geodesicVertex(from: LatLon, to: LatLon): GeodesicVertex {
  const line = geod.InverseLine(from.lat, from.lon, to.lat, to.lon, LATLON | G.DISTANCE | G.DISTANCE_IN)
  const sigma1 = geodesicArcFromNodeDeg(from.lat, line.calp1)
  const ahead = ((90 - sigma1) % 180 + 180) % 180
  const behind = ahead - 180
  const inside = ahead > 0 && ahead < line.a13
  const arc = inside || ahead - line.a13 <= -behind ? ahead : behind
  const p = line.ArcPosition(arc, LATLON | G.DISTANCE)
  const between = inside && Math.abs(p.lat2!) > Math.max(Math.abs(from.lat), Math.abs(to.lat))
  return { lat: p.lat2!, lon: p.lon2!, between, distanceFromStartM: p.s12! }
}
