// A leg set up for the zone engine: its box, its auxiliary-sphere great circle (geodesic legs) or
// its straight line in the Mercator plane (rhumb legs), and positions along it.
import type { LatLon } from '../../types/geo'
import { DEG_PER_RAD, NM_M, RAD_PER_DEG, WGS84_F } from '../navConstants'
import { geodesicInverse } from '../geodesic'
import { rhumbInverse, rhumbLine, rhumbLinePosition, type RhumbLine } from '../rhumb'
import type { ZoneLeg } from './types'
import { LINE_CAPS, POS_MASK, angle3, auxVector, cross3, dot3, geod, isometricLat, unit3, wrap180, type V3 } from './geometry'

const EARTH_R = 6_371_000
type GeodesicLine = ReturnType<typeof geod.DirectLine>

interface CurveCommon { from: LatLon, lengthM: number, lon0: number, latMin: number, latMax: number, lonMin: number, lonMax: number }
export interface GeodesicCurve extends CurveCommon {
  method: 'geodesic'
  course: number
  a: V3
  b: V3
  normal: V3
  arc: number
  auxMargin: number
  line: GeodesicLine | null
}
export interface RhumbCurve extends CurveCommon {
  method: 'rhumb'
  course: number
  x0: number
  y0: number
  ux: number
  uy: number
  tauEnd: number
  rhumb: RhumbLine
}
export type LegCurve = GeodesicCurve | RhumbCurve

/** Latitude (degrees) of a point on the auxiliary sphere. */
const auxLat = (v: V3) => Math.atan(Math.tan(Math.asin(Math.max(-1, Math.min(1, v[2])))) / (1 - WGS84_F)) * DEG_PER_RAD

/** Highest and lowest latitude of the great circle arc a→b on the auxiliary sphere (Clairaut's vertex when it lies between). */
function arcLatRange(a: V3, b: V3, n: V3): [number, number] {
  let lo = Math.min(auxLat(a), auxLat(b))
  let hi = Math.max(auxLat(a), auxLat(b))
  const zn = n[2]
  const top = unit3([-zn * n[0], -zn * n[1], 1 - zn * n[2]])
  for (const t of [top, [-top[0], -top[1], -top[2]] as V3]) {
    if (dot3(cross3(a, t), n) > 0 && dot3(cross3(t, b), n) > 0) { lo = Math.min(lo, auxLat(t)); hi = Math.max(hi, auxLat(t)) }
  }
  return [lo, hi]
}

function geodesicCurve(leg: ZoneLeg): GeodesicCurve {
  const { from, to } = leg
  const inv = leg.courseDeg === undefined || leg.distanceNm === undefined ? geodesicInverse(from, to) : null
  const course = inv ? inv.initialCourse : leg.courseDeg!
  const lengthM = inv ? inv.distanceM : leg.distanceNm! * NM_M
  const a = auxVector(from.lat, from.lon)
  const b = auxVector(to.lat, to.lon)
  const normal = unit3(cross3(a, b))
  const arc = angle3(a, b)
  const auxMargin = 2.5 * WGS84_F * lengthM / EARTH_R + 1e-12
  const [lo, hi] = arcLatRange(a, b, normal)
  const pad = auxMargin * DEG_PER_RAD * 2 + 1e-7
  const lon0 = wrap180(from.lon)
  const s = Math.sin(course * RAD_PER_DEG)
  let d = wrap180(to.lon - from.lon)
  if (s > 1e-12 && d < 0) d += 360
  else if (s < -1e-12 && d > 0) d -= 360
  return {
    method: 'geodesic', from, lengthM, course, a, b, normal, arc, auxMargin, line: null, lon0,
    latMin: Math.max(-90, lo - pad), latMax: Math.min(90, hi + pad), lonMin: Math.min(lon0, lon0 + d) - pad, lonMax: Math.max(lon0, lon0 + d) + pad,
  }
}

function rhumbCurve(leg: ZoneLeg): RhumbCurve {
  const { from, to } = leg
  const inv = leg.courseDeg === undefined || leg.distanceNm === undefined ? rhumbInverse(from, to) : null
  const course = inv ? inv.course : leg.courseDeg!
  const lengthM = inv ? inv.distanceM : leg.distanceNm! * NM_M
  const lon0 = wrap180(from.lon)
  let d = wrap180(to.lon - from.lon)
  if (d === -180 && Math.sin(course * RAD_PER_DEG) > 0) d = 180
  const dx = d * RAD_PER_DEG
  const y0 = isometricLat(from.lat)
  const dy = isometricLat(to.lat) - y0
  const tauEnd = Math.hypot(dx, dy)
  const pad = 1e-7
  return {
    method: 'rhumb', from, lengthM, course, lon0, x0: lon0 * RAD_PER_DEG, y0, ux: tauEnd > 0 ? dx / tauEnd : 0, uy: tauEnd > 0 ? dy / tauEnd : 0, tauEnd,
    rhumb: rhumbLine(from, course),
    latMin: Math.min(from.lat, to.lat) - pad, latMax: Math.max(from.lat, to.lat) + pad, lonMin: Math.min(lon0, lon0 + d) - pad, lonMax: Math.max(lon0, lon0 + d) + pad,
  }
}

/** The leg set up for the zone engine (geodesic or rhumb, as its method says). */
export function legCurve(leg: ZoneLeg): LegCurve {
  return leg.method === 'geodesic' ? geodesicCurve(leg) : rhumbCurve(leg)
}

/** The geodesic leg's line, made on first use (Karney 2013, §3, GeodesicLine). */
export function geodesicLine(c: GeodesicCurve): GeodesicLine {
  return c.line ??= geod.DirectLine(c.from.lat, c.from.lon, c.course, c.lengthM, LINE_CAPS)
}

/** Position at a distance along the leg. */
export function curvePosition(c: LegCurve, distanceM: number): LatLon {
  if (c.method === 'rhumb') {
    const p = rhumbLinePosition(c.rhumb, distanceM)
    return { lat: p.lat, lon: p.lon }
  }
  const p = geodesicLine(c).Position(distanceM, POS_MASK)
  return { lat: p.lat2!, lon: p.lon2! }
}
