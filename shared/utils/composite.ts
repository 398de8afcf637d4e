// Composite sailing under a limiting latitude on WGS84: geodesic tangent to the limit parallel,
// run along the parallel, geodesic onward (common practice; tangency from Clairaut's relation,
// sin α1 = cos βL / cos β1, with geodesics from geographiclib-geodesic, Karney 2013).
import { G, geod } from './engine/wgs84'
import type { LatLon } from '../types/geo'
import { DEG_PER_RAD, NM_M, RAD_PER_DEG, WGS84_A, WGS84_E2, WGS84_F } from './navConstants'
import { normaliseCourse, normaliseLongitude } from './position'
import { geodesicArcFromNodeDeg, geodesicInverse, geodesicVertex } from './geodesic'

export interface CompositeLeg {
  kind: 'geodesic' | 'parallel'
  from: LatLon
  to: LatLon
  distanceM: number
  distanceNm: number
  initialCourse: number
  finalCourse: number
}

export interface CompositeResult {
  /** composite: the limit is needed and met; not-needed: the plain geodesic stays within it; end-beyond-limit: an end lies poleward of it. */
  kind: 'composite' | 'not-needed' | 'end-beyond-limit'
  message: string
  limitLat: number
  points: LatLon[]
  legs: CompositeLeg[]
  distanceM: number
  distanceNm: number
  geodesicDistanceM: number
  extraM: number
  extraNm: number
}

/** Reduced latitude's cosine: tan β = (1 − f) tan φ (Karney 2013, eq. 6). */
function cosReduced(lat: number): number {
  const phi = lat * RAD_PER_DEG
  return Math.cos(phi) / Math.hypot(Math.cos(phi), (1 - WGS84_F) * Math.sin(phi))
}

/** Geodesic from p tangent to the parallel at `limit` (signed), heading east or west: Clairaut + arc to the vertex. */
function tangentFrom(p: LatLon, limit: number, east: boolean): { point: LatLon, azi: number, distanceM: number } {
  const salp = Math.min(1, cosReduced(limit) / cosReduced(p.lat))
  const calp = Math.sqrt(1 - salp * salp) * Math.sign(limit)
  const azi = Math.atan2(east ? salp : -salp, calp) * DEG_PER_RAD
  const arc = ((90 - geodesicArcFromNodeDeg(p.lat, calp)) % 180 + 180) % 180
  const r = geod.ArcDirectLine(p.lat, p.lon, azi, arc, G.LATITUDE | G.LONGITUDE | G.DISTANCE).ArcPosition(arc, G.LATITUDE | G.LONGITUDE | G.DISTANCE)
  return { point: { lat: r.lat2!, lon: r.lon2! }, azi, distanceM: r.s12! }
}

function leg(kind: CompositeLeg['kind'], from: LatLon, to: LatLon, distanceM: number, c1: number, c2: number): CompositeLeg {
  return { kind, from, to, distanceM, distanceNm: distanceM / NM_M, initialCourse: normaliseCourse(c1), finalCourse: normaliseCourse(c2) }
}

function result(kind: CompositeResult['kind'], message: string, limitLat: number, legs: CompositeLeg[], geodesicDistanceM: number): CompositeResult {
  const distanceM = legs.reduce((sum, l) => sum + l.distanceM, 0)
  const points = [legs[0]!.from, ...legs.map(l => l.to)]
  const extraM = Math.max(0, distanceM - geodesicDistanceM)
  return { kind, message, limitLat, points, legs, distanceM, distanceNm: distanceM / NM_M, geodesicDistanceM, extraM, extraNm: extraM / NM_M }
}

/** Composite sailing from → to, keeping within |limitLat| in both hemispheres. */
export function compositeSailing(from: LatLon, to: LatLon, limitLat: number): CompositeResult {
  const limit = Math.abs(limitLat)
  if (!(limit > 0 && limit < 90)) throw new RangeError('limiting latitude must be between 0° and 90°')
  const g = geodesicInverse(from, to)
  const plain = [leg('geodesic', from, to, g.distanceM, g.initialCourse, g.finalCourse)]
  const beyond = [from, to].filter(p => Math.abs(p.lat) > limit).length
  if (beyond) {
    const which = Math.abs(from.lat) > limit ? (Math.abs(to.lat) > limit ? 'Both ends lie' : 'The departure lies') : 'The destination lies'
    return result('end-beyond-limit', `${which} poleward of the limiting latitude ${limit}°: the limit cannot be kept.`, limit, plain, g.distanceM)
  }
  const vertex = geodesicVertex(from, to)
  if (!vertex.between || Math.abs(vertex.lat) <= limit)
    return result('not-needed', `The geodesic stays within ${limit}° (highest latitude ${Math.abs(vertex.between ? vertex.lat : Math.max(Math.abs(from.lat), Math.abs(to.lat))).toFixed(2)}°).`, limit, plain, g.distanceM)
  const signed = Math.sign(vertex.lat) * limit
  const east = Math.sin(g.initialCourse * RAD_PER_DEG) > 0
  const t1 = tangentFrom(from, signed, east)
  const t2 = tangentFrom(to, signed, !east)
  let run = normaliseLongitude(east ? t2.point.lon - t1.point.lon : t1.point.lon - t2.point.lon)
  if (run < 0 && run > -1e-9) run = 0
  if (run < 0) return result('not-needed', 'The tangent tracks meet before the limiting latitude.', limit, plain, g.distanceM)
  const phi = signed * RAD_PER_DEG
  const runM = run * RAD_PER_DEG * WGS84_A * Math.cos(phi) / Math.sqrt(1 - WGS84_E2 * Math.sin(phi) ** 2)
  const p1 = t1.point
  const p2 = t2.point
  const course = east ? 90 : 270
  return result('composite', `Composite track held at ${limit}°${signed > 0 ? 'N' : 'S'}.`, limit, [
    leg('geodesic', from, p1, t1.distanceM, t1.azi, course),
    leg('parallel', p1, p2, runM, course, course),
    leg('geodesic', p2, to, t2.distanceM, course, t2.azi + 180),
  ], g.distanceM)
}
