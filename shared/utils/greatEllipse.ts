// Great ellipse: the section of the ellipsoid by the plane through its centre and both points.
// Cartesian construction and semi-minor axis a·b/√(b² cos² i + a² sin² i) as in GeographicLib's
// "Great ellipses" documentation; arc length by Gauss–Legendre quadrature (Abramowitz & Stegun 25.4.29).
import type { LatLon } from '../types/geo'
import { DEG_PER_RAD, NM_M, RAD_PER_DEG, WGS84_A, WGS84_B, WGS84_E2 } from './navConstants'
import { normaliseCourse } from './position'
import { stepCount } from './engine/steps'
import { type Vec3, cross, dot, norm, scale, unit } from './engine/vec3'
import { gaussLegendre } from './engine/quadrature'

export interface GreatEllipseResult { distanceM: number, distanceNm: number, initialCourse: number, finalCourse: number }

interface Section { u: Vec3, v: Vec3, n: Vec3, bs: number, sigma1: number, sigma12: number }

/** Earth-centred Cartesian coordinates of a point on the WGS84 surface (NIMA TR8350.2, eq. 4-14). */
export function ellipsoidToCartesian(p: LatLon): Vec3 {
  const phi = p.lat * RAD_PER_DEG
  const lam = p.lon * RAD_PER_DEG
  const sphi = Math.sin(phi)
  const cphi = Math.abs(p.lat) === 90 ? 0 : Math.cos(phi)
  const nu = WGS84_A / Math.sqrt(1 - WGS84_E2 * sphi * sphi)
  return [nu * cphi * Math.cos(lam), nu * cphi * Math.sin(lam), nu * (1 - WGS84_E2) * sphi]
}

/** Geodetic latitude and longitude of a Cartesian point on the surface: tan φ = z / ((1 − e²)·p). */
function cartesianToSurface(r: Vec3): LatLon {
  return { lat: Math.atan2(r[2], (1 - WGS84_E2) * Math.hypot(r[0], r[1])) * DEG_PER_RAD, lon: Math.atan2(r[1], r[0]) * DEG_PER_RAD }
}

/** Local east, north and up unit vectors at a position. */
function localFrame(p: LatLon): [Vec3, Vec3, Vec3] {
  const phi = p.lat * RAD_PER_DEG
  const lam = p.lon * RAD_PER_DEG
  const [sp, cp, sl, cl] = [Math.sin(phi), Math.cos(phi), Math.sin(lam), Math.cos(lam)]
  return [[-sl, cl, 0], [-sp * cl, -sp * sl, cp], [cp * cl, cp * sl, sp]]
}

/** The section plane and ellipse: n = P1 × P2 (a meridian plane heading north for coincident or antipodal points). */
function section(from: LatLon, to: LatLon): Section {
  const p1 = ellipsoidToCartesian(from)
  const p2 = ellipsoidToCartesian(to)
  let n = cross(p1, p2)
  if (norm(n) <= 1e-9 * WGS84_A * WGS84_A) {
    const [east] = localFrame(from)
    n = scale(east, -1) // meridian of the first point, travelling north
  }
  const nh = unit(n)
  const ci = Math.abs(nh[2])
  const si = Math.hypot(nh[0], nh[1])
  const bs = WGS84_A * WGS84_B / Math.hypot(WGS84_B * ci, WGS84_A * si)
  const u = si > 1e-15 ? unit(cross([0, 0, 1], nh)) : unit([p1[0], p1[1], 0])
  const v = cross(nh, u)
  const sig = (r: Vec3) => Math.atan2(dot(r, v) / bs, dot(r, u) / WGS84_A)
  const sigma1 = sig(p1)
  let sigma12 = sig(p2) - sigma1
  if (sigma12 < 0) sigma12 += 2 * Math.PI
  if (sigma12 > 2 * Math.PI - 1e-15) sigma12 = 0
  return { u, v, n: nh, bs, sigma1, sigma12 }
}

/** Arc length of the section ellipse: ∫ √(a² sin² σ + b′² cos² σ) dσ by Gauss–Legendre (A&S 25.4.29). */
function arcLength(s: Section, sigma12: number): number {
  const a2 = WGS84_A * WGS84_A
  const b2 = s.bs * s.bs
  return gaussLegendre(x => Math.sqrt(a2 * Math.sin(x) ** 2 + b2 * Math.cos(x) ** 2), s.sigma1, s.sigma1 + sigma12, Math.PI / 6)
}

/** Course of the section curve at a point: direction n × (surface normal), as an azimuth. */
function courseAt(n: Vec3, p: LatLon): number {
  const [east, north, up] = localFrame(p)
  const t = cross(n, up)
  return normaliseCourse(Math.atan2(dot(t, east), dot(t, north)) * DEG_PER_RAD)
}

/** Great-ellipse distance and initial/final course between two points (GeographicLib "Great ellipses"). */
export function greatEllipseInverse(from: LatLon, to: LatLon): GreatEllipseResult {
  const s = section(from, to)
  const distanceM = s.sigma12 === 0 ? 0 : arcLength(s, s.sigma12)
  return { distanceM, distanceNm: distanceM / NM_M, initialCourse: courseAt(s.n, from), finalCourse: courseAt(s.n, to) }
}

/** Points along the great ellipse, at equal steps of the parametric angle no longer than about stepNm. */
export function greatEllipseDensify(from: LatLon, to: LatLon, stepNm: number): LatLon[] {
  const s = section(from, to)
  const steps = stepCount(s.sigma12 * WGS84_A, stepNm)
  const out: LatLon[] = [{ lat: from.lat, lon: from.lon }]
  for (let i = 1; i < steps; i++) {
    const sg = s.sigma1 + s.sigma12 * i / steps
    const r: Vec3 = [0, 1, 2].map(k => WGS84_A * Math.cos(sg) * s.u[k]! + s.bs * Math.sin(sg) * s.v[k]!) as Vec3
    out.push(cartesianToSurface(r))
  }
  out.push({ lat: to.lat, lon: to.lon })
  return out
}
