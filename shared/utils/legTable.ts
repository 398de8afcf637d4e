// The leg table of a passage plan: courses, distances, times, ETAs and totals (common practice:
// time on leg = distance / speed, ETA accumulated from departure in UTC; IMO Res. A.893(21), planning).
import type { LatLon, LegMethod } from '../types/geo'
import { geodesicInverse } from './geodesic'
import { rhumbInverse } from './rhumb'
import { courseChangeDeg, wheelOverNm, zoneDescription } from './manoeuvre'
import { isoUtc } from './engine/isoTime'

/** A waypoint as the leg table reads it; method, speed and turn radius describe the leg arriving at it. */
export interface LegTableWaypoint extends LatLon {
  name?: string
  method?: LegMethod
  speedKn?: number | null
  xteNm?: number | null
  turnRadiusNm?: number | null
}

interface LegCommon {
  /** 0-based: leg `index` runs from waypoint `index` to waypoint `index + 1`. */
  index: number
  from: LatLon
  to: LatLon
  fromName: string
  toName: string
  distanceNm: number
  rhumbCourse: number
  rhumbDistanceNm: number
  /** Distance saved by sailing the geodesic instead of the rhumb line (0 on rhumb legs). */
  savingNm: number
  speedKn: number
  hours: number
  etaUtc: string
  cumulativeNm: number
  /** Zone description at the arrival waypoint (west positive). */
  zoneDescription: number
  xteNm: number | null
  /** Course change at the arrival waypoint onto the next leg, positive to starboard. */
  courseChange: number | null
  wheelOverNm: number | null
}
export type RhumbLeg = LegCommon & { method: 'rhumb', course: number }
export type GeodesicLeg = LegCommon & { method: 'geodesic', initialCourse: number, finalCourse: number }
export type PlanLeg = RhumbLeg | GeodesicLeg

export interface LegTableTotals { distanceNm: number, hours: number, departureUtc: string, etaUtc: string, rhumbDistanceNm: number, savingNm: number }
export interface LegTable { legs: PlanLeg[], totals: LegTableTotals }
export interface LegTableOptions {
  helmDelayS?: number
  /** Solved legs remembered by their waypoint objects (see createLegMemo); only for waypoints that are never changed in place. */
  memo?: LegMemo
}

interface SolvedLeg { from: LegTableWaypoint, rh: ReturnType<typeof rhumbInverse>, g: ReturnType<typeof geodesicInverse> | null }
export type LegMemo = WeakMap<LegTableWaypoint, SolvedLeg>

/**
 * A memo of solved legs keyed by the arriving waypoint object: when a draft replaces one waypoint
 * of 5,000, the next table solves only the two legs that touch it (the rest is sums and times).
 */
export function createLegMemo(): LegMemo {
  return new WeakMap()
}

function solveLeg(a: LegTableWaypoint, b: LegTableWaypoint, method: LegMethod, memo: LegMemo | undefined): SolvedLeg {
  const known = memo?.get(b)
  if (known && known.from === a) return known
  const solved = { from: a, rh: rhumbInverse(a, b), g: method === 'geodesic' ? geodesicInverse(a, b) : null }
  memo?.set(b, solved)
  return solved
}

function legFor(i: number, a: LegTableWaypoint, b: LegTableWaypoint, speedKn: number, cumNm: number, etaMs: number, memo?: LegMemo): PlanLeg {
  const method = b.method ?? 'rhumb'
  const { rh, g } = solveLeg(a, b, method, memo)
  const distanceNm = g ? g.distanceNm : rh.distanceNm
  const hours = distanceNm / speedKn
  // One literal, then the method's course fields: object spread here made every leg a slow dictionary object.
  const leg = {
    index: i, method, from: { lat: a.lat, lon: a.lon }, to: { lat: b.lat, lon: b.lon }, fromName: a.name ?? '', toName: b.name ?? '',
    distanceNm, rhumbCourse: rh.course, rhumbDistanceNm: rh.distanceNm, savingNm: g ? rh.distanceNm - g.distanceNm : 0,
    speedKn, hours, etaUtc: isoUtc(etaMs + hours * 3_600_000), cumulativeNm: cumNm + distanceNm,
    zoneDescription: zoneDescription(b.lon), xteNm: b.xteNm ?? null, courseChange: null as number | null, wheelOverNm: null as number | null,
  } as PlanLeg
  if (leg.method === 'geodesic') {
    leg.initialCourse = g!.initialCourse
    leg.finalCourse = g!.finalCourse
  }
  else leg.course = rh.course
  return leg
}

/** Leg table for a plan: every leg's course(s), distance, time and ETA, with totals and the turns between legs. */
export function computeLegTable(waypoints: readonly LegTableWaypoint[], departureUtc: string | Date, defaultSpeedKn: number, options: LegTableOptions = {}): LegTable {
  const depMs = new Date(departureUtc).getTime()
  if (!Number.isFinite(depMs)) throw new RangeError('departure time is not a valid date')
  if (!(defaultSpeedKn > 0)) throw new RangeError('default speed must be greater than 0 kn')
  const legs: PlanLeg[] = []
  let cumNm = 0
  let etaMs = depMs
  for (let i = 1; i < waypoints.length; i++) {
    const leg = legFor(i - 1, waypoints[i - 1]!, waypoints[i]!, waypoints[i]!.speedKn || defaultSpeedKn, cumNm, etaMs, options.memo)
    cumNm = leg.cumulativeNm
    etaMs += leg.hours * 3_600_000
    legs.push(leg)
  }
  for (let i = 0; i + 1 < legs.length; i++) {
    const leg = legs[i]!
    const next = legs[i + 1]!
    const change = courseChangeDeg(leg.method === 'geodesic' ? leg.finalCourse : leg.course, next.method === 'geodesic' ? next.initialCourse : next.course)
    const radius = waypoints[i + 1]!.turnRadiusNm
    leg.courseChange = change
    leg.wheelOverNm = radius ? wheelOverNm(radius, change, leg.speedKn, options.helmDelayS ?? 0) : null
  }
  const rhumbNm = legs.reduce((s, l) => s + l.rhumbDistanceNm, 0)
  const savingNm = legs.reduce((s, l) => s + l.savingNm, 0)
  return {
    legs,
    totals: { distanceNm: cumNm, hours: (etaMs - depMs) / 3_600_000, departureUtc: new Date(depMs).toISOString(), etaUtc: new Date(etaMs).toISOString(), rhumbDistanceNm: rhumbNm, savingNm },
  }
}

