// Small geometry helpers of the zone engine: the auxiliary sphere of reduced latitude (on which a
// geodesic is a great circle, Karney 2013 §2), Mercator ordinates (in which a rhumb line is straight),
// and the radii of curvature (Snyder 1987, eqs. 4-18, 4-20).
import { G, geod } from '../engine/wgs84'
import { RAD_PER_DEG, WGS84_A, WGS84_E2, WGS84_F } from '../navConstants'
import { conformalTan, tanDeg } from '../engine/auxLatitude'

export { G, geod }
export { wrapLongitude as wrap180 } from '../position'
export const LINE_CAPS = G.LATITUDE | G.LONGITUDE | G.AZIMUTH | G.DISTANCE_IN
export const POS_MASK = G.LATITUDE | G.LONGITUDE | G.AZIMUTH | G.LONG_UNROLL

/** Unit vector on the auxiliary sphere: reduced latitude β (tan β = (1 − f) tan φ), longitude λ. */
export function auxVector(lat: number, lon: number): [number, number, number] {
  const beta = Math.atan((1 - WGS84_F) * Math.tan(lat * RAD_PER_DEG))
  const lam = lon * RAD_PER_DEG
  const cb = Math.cos(beta)
  return [cb * Math.cos(lam), cb * Math.sin(lam), Math.sin(beta)]
}

export type V3 = [number, number, number]
export const dot3 = (a: V3, b: V3) => a[0] * b[0] + a[1] * b[1] + a[2] * b[2]
export function cross3(a: V3, b: V3): V3 {
  return [a[1] * b[2] - a[2] * b[1], a[2] * b[0] - a[0] * b[2], a[0] * b[1] - a[1] * b[0]]
}
export function unit3(a: V3): V3 {
  const n = Math.hypot(a[0], a[1], a[2])
  return n > 0 ? [a[0] / n, a[1] / n, a[2] / n] : [0, 0, 0]
}
/** Angle between unit vectors, radians (atan2 form, accurate for small and large angles). */
export const angle3 = (a: V3, b: V3) => {
  const c = cross3(a, b)
  return Math.atan2(Math.hypot(c[0], c[1], c[2]), dot3(a, b))
}

/** Isometric latitude ψ = asinh(tan χ), the Mercator northing on the unit sphere (Karney 2011, eq. 9). */
export const isometricLat = (lat: number) => Math.asinh(conformalTan(tanDeg(lat)))

/** Radius of the parallel N cos φ and the meridian radius M at a latitude, metres. */
export function radii(lat: number): { parallel: number, meridian: number, prime: number } {
  const phi = lat * RAD_PER_DEG
  const w2 = 1 - WGS84_E2 * Math.sin(phi) ** 2
  const prime = WGS84_A / Math.sqrt(w2)
  return { parallel: prime * Math.cos(phi), meridian: prime * (1 - WGS84_E2) / w2, prime }
}

