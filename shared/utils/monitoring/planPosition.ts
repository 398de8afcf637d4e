// Where a reported position lies on a passage plan: the leg, cross-track and along-track by the
// leg's own method, distance made good along the plan and distance to go (IMO Res. A.893(21),
// monitoring; domain.md "Monitoring").
import type { LatLon, LegMethod } from '../../types/geo'
import { crossTrack } from '../crossTrack'
import { NM_M, RAD_PER_DEG, WGS84_A, WGS84_E2 } from '../navConstants'
import { rhumbCrossTrack } from './rhumbCrossTrack'

/** The part of a leg-table leg that monitoring reads. */
export interface MonitoredLeg {
  index: number
  from: LatLon
  to: LatLon
  method: LegMethod
  distanceNm: number
  speedKn: number
  hours: number
  xteNm: number | null
}

export interface PlanPosition {
  legIndex: number
  /** Distance from the leg, nm; positive to starboard. */
  crossTrackNm: number
  /** Along the leg from its start to the foot of the perpendicular, nm (0 … leg distance). */
  alongLegNm: number
  /** Along the plan from departure, nm (0 … total). */
  alongTrackNm: number
  distanceToGoNm: number
  foot: LatLon
}

/** Cross-track and along-track from one leg by its method (geodesic: Baselga–Martínez-Llario; rhumb: rhumbCrossTrack). */
export function legCrossTrack(leg: Pick<MonitoredLeg, 'from' | 'to' | 'method'>, position: LatLon) {
  return leg.method === 'geodesic' ? crossTrack(leg.from, leg.to, position) : rhumbCrossTrack(leg.from, leg.to, position)
}

interface Candidate { leg: MonitoredLeg, crossM: number, alongM: number, lengthM: number, foot: LatLon, outsideM: number }

/** How far the foot lies outside the leg's span (0 inside). */
const outside = (alongM: number, lengthM: number) => (alongM < 0 ? -alongM : alongM > lengthM ? alongM - lengthM : 0)
/** A foot within 1 mm of a waypoint is at the waypoint (the iterations stop at 1 µm steps). */
const AT_WAYPOINT_M = 1e-3

// The ellipsoid's line element ds² = M² dφ² + N² cos²φ dλ² lies between those of spheres of radius
// min(M, N) = a(1 − e²) and max(M, N) = a / √(1 − e²) in the same coordinates, so haversine distances on
// those spheres bound the geodesic distance from below and above.
const R_LOW = WGS84_A * (1 - WGS84_E2)
const R_HIGH = WGS84_A / Math.sqrt(1 - WGS84_E2)

/** Central angle between two positions (haversine), radians. */
function centralAngle(a: LatLon, b: LatLon): number {
  const dLat = (b.lat - a.lat) * RAD_PER_DEG
  const dLon = (b.lon - a.lon) * RAD_PER_DEG
  const h = Math.sin(dLat / 2) ** 2 + Math.cos(a.lat * RAD_PER_DEG) * Math.cos(b.lat * RAD_PER_DEG) * Math.sin(dLon / 2) ** 2
  return 2 * Math.asin(Math.min(1, Math.sqrt(h)))
}
/** Legs whose span lies farther than this beyond the nearest waypoint's distance are not worked out (nm: see legsNear). */
const NEAR_WINDOW_M = 50 * NM_M

/**
 * The legs that can be the one a position is on, by a cheap bound: any point F of a leg from A to B
 * has d(P,A) + d(P,B) ≤ 2·d(P,F) + length (triangle inequality; d(F,A) + d(F,B) ≤ length by either
 * method), so d(P,F) ≥ (d(P,A) + d(P,B) − length) / 2. Legs whose bound exceeds the distance to the
 * nearest waypoint by more than that distance again (at least 50 nm) are left out: a long plan's
 * reports are then worked out against the few legs near them, not all of them.
 */
export function legsNear(legs: readonly MonitoredLeg[], position: LatLon): MonitoredLeg[] {
  let nearest = Infinity
  const bounds = legs.map((leg) => {
    const ca = centralAngle(position, leg.from)
    const cb = centralAngle(position, leg.to)
    nearest = Math.min(nearest, R_HIGH * Math.min(ca, cb))
    return (R_LOW * (ca + cb) - leg.distanceNm * NM_M) / 2
  })
  const limit = nearest + Math.max(nearest, NEAR_WINDOW_M)
  return legs.filter((_, i) => bounds[i]! <= limit)
}

/**
 * The leg whose along-track span holds the position (0 ≤ along < length: at a waypoint, the next leg);
 * among several, the nearest; when none holds it (outside a turn, before departure, past arrival),
 * the leg whose span it is nearest, the foot clamped to that leg's ends. Only legs near the position
 * are considered (legsNear): a leg whose span holds it far away elsewhere on the plan does not count.
 */
export function locateOnPlan(legs: readonly MonitoredLeg[], position: LatLon): PlanPosition {
  if (!legs.length) throw new RangeError('a plan needs at least one leg')
  const near = legsNear(legs, position)
  const candidates: Candidate[] = near.map((leg) => {
    const r = legCrossTrack(leg, position)
    const lengthM = leg.distanceNm * NM_M
    return { leg, crossM: r.crossTrackM, alongM: r.alongTrackM, lengthM, foot: r.foot, outsideM: outside(r.alongTrackM, lengthM) }
  })
  const last = legs.length - 1
  const inside = candidates.filter(c => c.alongM >= -AT_WAYPOINT_M && (c.leg.index === last ? c.alongM <= c.lengthM + AT_WAYPOINT_M : c.alongM < c.lengthM - AT_WAYPOINT_M))
  const pool = inside.length ? inside : candidates
  // Off every span: rank by the distance to the nearer end of the span (Pythagoras is plenty for a ranking).
  const score = (c: Candidate) => Math.hypot(c.crossM, c.outsideM)
  const best = pool.reduce((a, b) => (score(b) < score(a) ? b : a))
  const alongLegM = Math.min(best.lengthM, Math.max(0, best.alongM))
  const before = legs.slice(0, best.leg.index).reduce((s, l) => s + l.distanceNm, 0)
  const total = legs.reduce((s, l) => s + l.distanceNm, 0)
  const alongTrackNm = before + alongLegM / NM_M
  return {
    legIndex: best.leg.index,
    crossTrackNm: best.crossM / NM_M,
    alongLegNm: alongLegM / NM_M,
    alongTrackNm,
    distanceToGoNm: Math.max(0, total - alongTrackNm),
    foot: best.foot,
  }
}
