// Rhumb lines (constant course) on the WGS84 ellipsoid, with divided differences so that short and
// east–west legs keep full precision (Karney, "The area of rhumb polygons", Stud. Geophys. Geod. 2024;
// GeographicLib Rhumb class; Krüger series to n⁶ from Karney 2011).
import type { LatLon } from '../types/geo'
import { DEG_PER_RAD, NM_M, RAD_PER_DEG, WGS84_A, WGS84_E2 } from './navConstants'
import { normaliseCourse, normaliseLongitude } from './position'
import { stepCount } from './engine/steps'
import { dAsinh, dAtan, dSinh, dSinSeries } from './engine/divided'
import {
  CHI_TO_MU, MU_TO_CHI, RECTIFYING_RADIUS_M, conformalTan, conformalTanFromRectifying,
  geodeticTan, rectifyingFromConformalTan, tanDeg,
} from './engine/auxLatitude'

/** A rhumb line would have to pass over a pole, where its longitude is undefined. */
export class RhumbPoleError extends Error {
  constructor(message = 'the rhumb line would pass over a pole') {
    super(message)
    this.name = 'RhumbPoleError'
  }
}

export interface RhumbInverseResult { course: number, distanceM: number, distanceNm: number }
export interface RhumbDirectResult { lat: number, lon: number, course: number }

/** Quarter meridian, metres: A·π/2 (Karney 2011, eq. 14). */
export const QUARTER_MERIDIAN_M = RECTIFYING_RADIUS_M * Math.PI / 2

/** Longitude difference lon2 − lon1 reduced to −180..180 (east-going when exactly 180). */
function lonDiff(lon1: number, lon2: number): number {
  const d = normaliseLongitude(normaliseLongitude(lon2) - normaliseLongitude(lon1))
  return d === -180 ? 180 : d
}

/** Meridian distance between latitudes, metres: A·|μ2 − μ1| (Karney 2011, eqs. 14, 35). */
export function meridianDistanceM(lat1: number, lat2: number): number {
  const mu1 = rectifyingFromConformalTan(conformalTan(tanDeg(lat1)))
  const mu2 = rectifyingFromConformalTan(conformalTan(tanDeg(lat2)))
  return Math.abs(mu2 - mu1) * RECTIFYING_RADIUS_M
}

/** Δμ/Δψ as divided differences: DConformalToRectifying(χ2, χ1)·Dgd(ψ2, ψ1) (Karney 2024). */
function dMuDPsi(t1: number, t2: number, psi1: number, psi2: number): number {
  const chi1 = Math.atan(t1)
  const chi2 = Math.atan(t2)
  return (1 + dSinSeries(chi2, chi1, CHI_TO_MU)) * dAtan(t2, t1) * dSinh(psi2, psi1)
}

/** Rhumb inverse: tan α = Δλ/Δψ, s = Δμ/cos α with Δμ/Δψ by divided differences (Karney 2024, §2). */
export function rhumbInverse(from: LatLon, to: LatLon): RhumbInverseResult {
  const lon12 = lonDiff(from.lon, to.lon)
  if (Math.abs(from.lat) === 90 || Math.abs(to.lat) === 90) {
    // A pole has no longitude: the shortest rhumb line to or from it is the meridian.
    const distanceM = meridianDistanceM(from.lat, to.lat)
    return { course: to.lat >= from.lat ? 0 : 180, distanceM, distanceNm: distanceM / NM_M }
  }
  const t1 = conformalTan(tanDeg(from.lat))
  const t2 = conformalTan(tanDeg(to.lat))
  const psi1 = Math.asinh(t1)
  const psi2 = Math.asinh(t2)
  const psi12 = psi2 - psi1
  const lam12 = lon12 * RAD_PER_DEG
  const course = normaliseCourse(Math.atan2(lam12, psi12) * DEG_PER_RAD)
  const distanceM = Math.hypot(lam12, psi12) * dMuDPsi(t1, t2, psi1, psi2) * RECTIFYING_RADIUS_M
  return { course, distanceM, distanceNm: distanceM / NM_M }
}

/** A rhumb line set up once for many positions along it (GeographicLib RhumbLine). */
export interface RhumbLine { lat1: number, lon1: number, course: number, salp: number, calp: number, mu1: number, t1: number, r1: number }

/** sin and cos of a course in degrees, exact at multiples of 90°. */
function sinCosDeg(deg: number): [number, number] {
  const q = normaliseCourse(deg)
  if (q === 0) return [0, 1]
  if (q === 90) return [1, 0]
  if (q === 180) return [0, -1]
  if (q === 270) return [-1, 0]
  const r = q * RAD_PER_DEG
  return [Math.sin(r), Math.cos(r)]
}

/** Set up a rhumb line from a point and a course (radius of the parallel r1 = N cos φ). */
export function rhumbLine(from: LatLon, courseDeg: number): RhumbLine {
  const [salp, calp] = sinCosDeg(courseDeg)
  const t1 = conformalTan(tanDeg(from.lat))
  const phi = from.lat * RAD_PER_DEG
  const r1 = Math.abs(from.lat) === 90 ? 0 : WGS84_A * Math.cos(phi) / Math.sqrt(1 - WGS84_E2 * Math.sin(phi) ** 2)
  return { lat1: from.lat, lon1: from.lon, course: normaliseCourse(courseDeg), salp, calp, mu1: rectifyingFromConformalTan(t1), t1, r1 }
}

/** Position at distance s along a rhumb line: μ2 = μ1 + s cos α / A, Δλ = tan α · Δψ (Karney 2024, §2). */
export function rhumbLinePosition(line: RhumbLine, distanceM: number): RhumbDirectResult {
  const mu12 = distanceM * line.calp / RECTIFYING_RADIUS_M
  const mu2 = line.mu1 + mu12
  if (Math.abs(mu2) > Math.PI / 2 * (1 + 4 * Number.EPSILON)) throw new RhumbPoleError()
  if (line.calp === 0 || Math.abs(line.lat1) === 90) {
    // Due east or west (or at a pole): the parallel of radius N cos φ.
    const lon12 = line.r1 > 0 ? line.salp * distanceM / line.r1 * DEG_PER_RAD : 0
    const lat = line.calp === 0 ? line.lat1 : Math.atan(geodeticTan(conformalTanFromRectifying(mu2))) * DEG_PER_RAD
    return { lat, lon: normaliseLongitude(normaliseLongitude(line.lon1) + normaliseLongitude(lon12)), course: line.course }
  }
  const t2 = conformalTanFromRectifying(Math.max(-Math.PI / 2, Math.min(Math.PI / 2, mu2)))
  const lat = Math.atan(geodeticTan(t2)) * DEG_PER_RAD
  // Δψ/Δμ = Dgdinv(τ′2, τ′1) · DRectifyingToConformal(μ2, μ1)
  const dPsiDMu = dAsinh(t2, line.t1) / dAtan(t2, line.t1) * (1 + dSinSeries(mu2, line.mu1, MU_TO_CHI))
  const lon12 = line.salp / line.calp * dPsiDMu * mu12 * DEG_PER_RAD
  return { lat, lon: normaliseLongitude(normaliseLongitude(line.lon1) + normaliseLongitude(lon12)), course: line.course }
}

/** Rhumb direct problem: the position after sailing a constant course for a distance. */
export function rhumbDirect(from: LatLon, courseDeg: number, distanceM: number): RhumbDirectResult {
  return rhumbLinePosition(rhumbLine(from, courseDeg), distanceM)
}

/** Points along the rhumb line from → to, at most stepNm apart, both ends included. */
export function rhumbDensify(from: LatLon, to: LatLon, stepNm: number): LatLon[] {
  const { course, distanceM } = rhumbInverse(from, to)
  const steps = stepCount(distanceM, stepNm)
  const line = rhumbLine(from, course)
  const out: LatLon[] = [{ lat: from.lat, lon: normaliseLongitude(from.lon) }]
  for (let i = 1; i < steps; i++) {
    const p = rhumbLinePosition(line, distanceM * i / steps)
    out.push({ lat: p.lat, lon: p.lon })
  }
  out.push({ lat: to.lat, lon: normaliseLongitude(to.lon) })
  return out
}
