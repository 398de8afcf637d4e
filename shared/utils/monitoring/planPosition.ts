// Where a reported position lies on a passage plan: the leg, cross-track and along-track by the
// leg's own method, distance made good along the plan and distance to go (IMO Res. A.893(21),
// monitoring; domain.md "Monitoring").
import type { LatLon, LegMethod } from '../../types/geo'
import { crossTrack } from '../crossTrack'
import { NM_M } from '../navConstants'
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

/**
 * The leg whose along-track span holds the position (0 ≤ along < length: at a waypoint, the next leg);
 * among several, the nearest; when none holds it (outside a turn, before departure, past arrival),
 * the leg whose span it is nearest, the foot clamped to that leg's ends.
 */
export function locateOnPlan(legs: readonly MonitoredLeg[], position: LatLon): PlanPosition {
  if (!legs.length) throw new RangeError('a plan needs at least one leg')
  const candidates: Candidate[] = legs.map((leg) => {
    const r = legCrossTrack(leg, position)
    const lengthM = leg.distanceNm * NM_M
    return { leg, crossM: r.crossTrackM, alongM: r.alongTrackM, lengthM, foot: r.foot, outsideM: outside(r.alongTrackM, lengthM) }
  })
  const last = legs.length - 1
  const inside = candidates.filter((c, i) => c.alongM >= -AT_WAYPOINT_M && (i === last ? c.alongM <= c.lengthM + AT_WAYPOINT_M : c.alongM < c.lengthM - AT_WAYPOINT_M))
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
