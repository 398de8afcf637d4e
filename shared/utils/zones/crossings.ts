// Where a leg crosses a zone's boundary, on the ellipsoid. Geodesic legs: both curves are
// geodesics, intersected by Newton's method in the plane tangent at the current estimate — the
// limit of Karney's ellipsoidal gnomonic intersection (Karney, "Algorithms for geodesics", 2013,
// §8: project about the estimate, intersect as straight lines, move the centre, repeat). Rhumb legs:
// the rhumb line is straight in the Mercator plane, so the boundary's signed offset from it is
// a smooth function along the boundary whose roots are the crossings (Newton with bisection).
import { RAD_PER_DEG } from '../navConstants'
import { rhumbInverse } from '../rhumb'
import type { SubEdge } from './prepare'
import { type GeodesicCurve, type RhumbCurve, geodesicLine } from './legCurve'
import { POS_MASK, cross3, dot3, isometricLat, radii, unit3, wrap180, type V3 } from './geometry'

const TOL_M = 1e-4
const MAX_ITER = 30

/** Signed angle from a to x about the axis n, radians. */
const signedAngle = (a: V3, x: V3, n: V3) => Math.atan2(dot3(cross3(a, x), n), dot3(a, x))

/** Crossing of a geodesic leg with a sub-edge (distance along the leg), or null. */
function geodesicNewton(leg: GeodesicCurve, e: SubEdge, s0: number, t0: number): number | null {
  const line = geodesicLine(leg)
  let s = s0
  let t = t0
  for (let it = 0; it < MAX_ITER; it++) {
    const p = line.Position(s, POS_MASK)
    const q = e.line.Position(e.t0 + t, POS_MASK)
    const latM = (p.lat2! + q.lat2!) / 2
    const r = radii(latM)
    const dLon = wrap180(q.lon2! - p.lon2!)
    const dx = dLon * RAD_PER_DEG * r.parallel
    const dy = (q.lat2! - p.lat2!) * RAD_PER_DEG * r.meridian
    // q's course turned into p's frame by the convergence of the meridians, Δλ·sin φ.
    const a1 = p.azi2! * RAD_PER_DEG
    const a2 = (q.azi2! - dLon * Math.sin(latM * RAD_PER_DEG)) * RAD_PER_DEG
    const u1x = Math.sin(a1); const u1y = Math.cos(a1)
    const u2x = Math.sin(a2); const u2y = Math.cos(a2)
    const den = u1x * u2y - u1y * u2x
    if (Math.abs(den) < 1e-12) return null
    const ds = (dx * u2y - dy * u2x) / den
    const dt = (dx * u1y - dy * u1x) / den
    s += ds
    t += dt
    if (Math.abs(ds) < TOL_M && Math.abs(dt) < TOL_M) {
      const slack = 1e-6 + 1e-12 * leg.lengthM
      if (s < -slack || s > leg.lengthM + slack || t < -slack || t > e.lengthM + slack) return null
      return Math.min(leg.lengthM, Math.max(0, s))
    }
    if (!Number.isFinite(s) || !Number.isFinite(t) || Math.abs(s) > 4e7 || Math.abs(t) > 4e7) return null
  }
  return null
}

/** Adds to `out` the distance along a geodesic leg where it crosses a sub-edge. */
export function geodesicCrossings(leg: GeodesicCurve, e: SubEdge, out: number[]) {
  // Screen on the auxiliary sphere, where both are great circles to within their margins.
  const m = leg.auxMargin + e.auxMargin
  const d1 = dot3(leg.normal, e.v1)
  const d2 = dot3(leg.normal, e.v2)
  if ((d1 > m && d2 > m) || (d1 < -m && d2 < -m)) return
  const a1 = dot3(e.normal, leg.a)
  const a2 = dot3(e.normal, leg.b)
  if ((a1 > m && a2 > m) || (a1 < -m && a2 < -m)) return
  let x = cross3(leg.normal, e.normal)
  if (Math.hypot(x[0], x[1], x[2]) < 1e-14) return // the same great circle: touching, not crossing
  x = unit3(x)
  const mid: V3 = [leg.a[0] + leg.b[0] + e.v1[0] + e.v2[0], leg.a[1] + leg.b[1] + e.v1[1] + e.v2[1], leg.a[2] + leg.b[2] + e.v1[2] + e.v2[2]]
  if (dot3(x, mid) < 0) x = [-x[0], -x[1], -x[2]]
  const s0 = leg.arc > 0 ? signedAngle(leg.a, x, leg.normal) / leg.arc * leg.lengthM : 0
  const eArc = Math.acos(Math.max(-1, Math.min(1, dot3(e.v1, e.v2))))
  const t0 = eArc > 0 ? signedAngle(e.v1, x, e.normal) / eArc * e.lengthM : 0
  const s = geodesicNewton(leg, e, s0, t0)
  if (s !== null) out.push(s)
}

/** Signed offset g(t) of the sub-edge point at t from the rhumb line in the Mercator plane, and dg/dt. */
function rhumbOffset(leg: RhumbCurve, e: SubEdge, x1: number, t: number): [number, number, number, number] {
  const p = e.line.Position(e.t0 + t, POS_MASK)
  const x = x1 + (p.lon2! - e.lineLon1) * RAD_PER_DEG
  const y = isometricLat(p.lat2!)
  const g = leg.ux * (y - leg.y0) - leg.uy * (x - leg.x0)
  // d(x, y)/dt = (sin α, cos α)/(N cos φ): the Mercator plane is conformal.
  const a = p.azi2! * RAD_PER_DEG
  const dg = (leg.ux * Math.cos(a) - leg.uy * Math.sin(a)) / radii(p.lat2!).parallel
  return [g, dg, p.lat2!, p.lon2!]
}

/** Root of g on [lo, hi] where g changes sign: Newton's steps kept inside the bracket, else bisection. */
function rhumbRoot(leg: RhumbCurve, e: SubEdge, x1: number, lo: number, hi: number, glo: number): [number, number] {
  let t = (lo + hi) / 2
  let lat = 0
  let lon = 0
  for (let it = 0; it < 60; it++) {
    const [g, dg, la, lo2] = rhumbOffset(leg, e, x1, t)
    lat = la
    lon = lo2
    if (g === 0) break
    if ((g < 0) === (glo < 0)) { lo = t; glo = g }
    else hi = t
    let next = dg !== 0 ? t - g / dg : (lo + hi) / 2
    if (!(next > lo && next < hi)) next = (lo + hi) / 2
    const step = Math.abs(next - t)
    t = next
    if (step < TOL_M || hi - lo < TOL_M) break
  }
  return [lat, lon]
}

/** The distance along the rhumb leg of a point on its line, if the point lies on the leg. */
function alongRhumb(leg: RhumbCurve, lat: number, lon: number, x1: number, lineLon: number, out: number[]) {
  const x = x1 + (lon - lineLon) * RAD_PER_DEG
  const tau = leg.ux * (x - leg.x0) + leg.uy * (isometricLat(lat) - leg.y0)
  const slack = 1e-9 * Math.max(1, leg.tauEnd)
  if (tau < -slack || tau > leg.tauEnd + slack) return
  const s = tau <= 0 ? 0 : rhumbInverse(leg.from, { lat, lon }).distanceM
  out.push(Math.min(leg.lengthM, Math.max(0, s)))
}

/** Adds to `out` the distances along a rhumb leg where it crosses a sub-edge (at most two). */
export function rhumbCrossings(leg: RhumbCurve, e: SubEdge, out: number[]) {
  const x1 = leg.x0 + wrap180(e.lon1 - leg.lon0) * RAD_PER_DEG
  const x2 = x1 + (e.lon2 - e.lon1) * RAD_PER_DEG
  const g1 = leg.ux * (e.psi1 - leg.y0) - leg.uy * (x1 - leg.x0)
  const g2 = leg.ux * (e.psi2 - leg.y0) - leg.uy * (x2 - leg.x0)
  const b = e.mercBulge
  if ((g1 > b && g2 > b) || (g1 < -b && g2 < -b)) return
  const tau1 = leg.ux * (x1 - leg.x0) + leg.uy * (e.psi1 - leg.y0)
  const tau2 = leg.ux * (x2 - leg.x0) + leg.uy * (e.psi2 - leg.y0)
  if ((tau1 < -b && tau2 < -b) || (tau1 > leg.tauEnd + b && tau2 > leg.tauEnd + b)) return
  const lineLon = e.lineLon1
  const roots: [number, number][] = []
  if (g1 === 0) roots.push([e.lat1, lineLon])
  if ((g1 < 0) !== (g2 < 0) && g1 !== 0) roots.push(rhumbRoot(leg, e, x1, 0, e.lengthM, g1))
  else if (g1 !== 0) {
    // Both ends on one side but within the bow: the sub-edge may dip across and back.
    const sign = g1 < 0 ? -1 : 1
    let lo = 0
    let hi = e.lengthM
    for (let k = 0; k < 40; k++) {
      const m1 = lo + (hi - lo) * 0.382
      const m2 = lo + (hi - lo) * 0.618
      if (sign * rhumbOffset(leg, e, x1, m1)[0] < sign * rhumbOffset(leg, e, x1, m2)[0]) hi = m2
      else lo = m1
    }
    const tm = (lo + hi) / 2
    const gm = rhumbOffset(leg, e, x1, tm)[0]
    if (sign * gm < 0) {
      roots.push(rhumbRoot(leg, e, x1, 0, tm, g1))
      roots.push(rhumbRoot(leg, e, x1, tm, e.lengthM, gm))
    }
  }
  for (const [lat, lon] of roots) alongRhumb(leg, lat, lon, x1, lineLon, out)
}
