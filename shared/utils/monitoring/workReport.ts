// A position report worked out against the approved plan (IMO Res. A.893(21), monitoring): where the
// ship is on the plan, speed made good, ETAs, ahead or behind the schedule, fuel against the plan, and
// the flags the shore is alerted to. Speed made good = distance along the plan since the last report
// over the time since it (domain.md "Monitoring"); the rest is common practice.
import type { LatLon } from '../../types/geo'
import type { FuelCurve } from '../fuel'
import { isoUtc } from '../engine/isoTime'
import { locateOnPlan, type MonitoredLeg } from './planPosition'
import { plannedAlongAt, plannedFuelTo, plannedHoursTo } from './planTimeline'

export const VOYAGE_FLAGS = ['off-track', 'late', 'fuel'] as const
export type VoyageFlag = typeof VOYAGE_FLAGS[number]

export interface MonitoringThresholds {
  /** Corridor half-width for legs without their own XTE limit, nm. */
  defaultXteNm: number
  /** The ETA may slip past the planned arrival by this much before the report is flagged late, hours. */
  lateH: number
  /** Fuel used may exceed the plan's fuel for the distance sailed by this percentage. */
  fuelPct: number
}

export interface VoyagePlan {
  departureUtc: string
  legs: readonly MonitoredLeg[]
  /** The vessel's fitted curve, when it has fuel data. */
  fuelCurve?: Pick<FuelCurve, 'c' | 'k'> | null
}

export interface ReportFix extends LatLon { timeUtc: string, fuelRobT?: number | null }

/** What the report before this one left: its time and distance along the plan (none: departure). */
export interface ReportBefore { timeUtc: string, alongTrackNm: number }
/** The first report that gave fuel remaining on board: the baseline fuel used is counted from. */
export interface FuelBaseline { fuelRobT: number, alongTrackNm: number }

export interface WorkedReport {
  legIndex: number
  crossTrackNm: number
  xteLimitNm: number
  alongTrackNm: number
  distanceToGoNm: number
  speedMadeGoodKn: number | null
  /** ETA at the speed made good (null when the ship has made no way along the plan). */
  etaUtc: string | null
  /** ETA at the planned speeds from here. */
  etaPlannedSpeedsUtc: string
  plannedAlongTrackNm: number
  /** Positive: ahead of the schedule. */
  aheadNm: number
  /** Positive: behind the schedule, hours (the planned-speed ETA less the planned arrival). */
  delayH: number
  fuelUsedT: number | null
  fuelPlannedT: number | null
  flags: VoyageFlag[]
}

const HOUR_MS = 3_600_000
/** Below this the ship is taken as stopped and no ETA is extrapolated from it. */
const MIN_SMG_KN = 0.5

/** Works out one report: position on the plan, schedule, fuel and flags (see the file header for the methods). */
export function workReport(plan: VoyagePlan, fix: ReportFix, before: ReportBefore | null, baseline: FuelBaseline | null, limits: MonitoringThresholds): WorkedReport {
  const t = Date.parse(fix.timeUtc)
  const dep = Date.parse(plan.departureUtc)
  const at = locateOnPlan(plan.legs, fix)
  const leg = plan.legs[at.legIndex]!
  const totalH = plan.legs.reduce((s, l) => s + l.hours, 0)
  const hoursOut = (t - dep) / HOUR_MS
  const prevT = before ? Date.parse(before.timeUtc) : dep
  const prevAlong = before ? before.alongTrackNm : 0
  const sinceH = (t - prevT) / HOUR_MS
  const speedMadeGoodKn = sinceH > 0 ? (at.alongTrackNm - prevAlong) / sinceH : null
  const etaUtc = speedMadeGoodKn !== null && speedMadeGoodKn >= MIN_SMG_KN ? isoUtc(t + at.distanceToGoNm / speedMadeGoodKn * HOUR_MS) : null
  const delayH = hoursOut - plannedHoursTo(plan.legs, at.alongTrackNm)
  const etaPlannedSpeedsUtc = isoUtc(dep + (totalH + delayH) * HOUR_MS)
  const plannedAlongTrackNm = plannedAlongAt(plan.legs, hoursOut)
  const fuel = fuelAgainstPlan(plan, fix, at.alongTrackNm, baseline)
  const xteLimitNm = leg.xteNm ?? limits.defaultXteNm
  const flags: VoyageFlag[] = []
  if (Math.abs(at.crossTrackNm) > xteLimitNm) flags.push('off-track')
  const forecast = Date.parse(etaUtc ?? etaPlannedSpeedsUtc)
  if ((forecast - (dep + totalH * HOUR_MS)) / HOUR_MS > limits.lateH) flags.push('late')
  if (fuel.usedT !== null && fuel.plannedT !== null && fuel.plannedT > 0 && fuel.usedT > fuel.plannedT * (1 + limits.fuelPct / 100)) flags.push('fuel')
  return {
    legIndex: at.legIndex, crossTrackNm: at.crossTrackNm, xteLimitNm, alongTrackNm: at.alongTrackNm, distanceToGoNm: at.distanceToGoNm,
    speedMadeGoodKn, etaUtc, etaPlannedSpeedsUtc, plannedAlongTrackNm, aheadNm: at.alongTrackNm - plannedAlongTrackNm, delayH,
    fuelUsedT: fuel.usedT, fuelPlannedT: fuel.plannedT, flags,
  }
}

/** Fuel used since the baseline report (ROB then − ROB now) and the plan's fuel over the same stretch. */
function fuelAgainstPlan(plan: VoyagePlan, fix: ReportFix, alongNm: number, baseline: FuelBaseline | null) {
  if (fix.fuelRobT == null || !baseline) return { usedT: null, plannedT: null }
  const usedT = baseline.fuelRobT - fix.fuelRobT
  if (!plan.fuelCurve) return { usedT, plannedT: null }
  const plannedT = plannedFuelTo(plan.legs, alongNm, plan.fuelCurve) - plannedFuelTo(plan.legs, baseline.alongTrackNm, plan.fuelCurve)
  return { usedT, plannedT }
}

/** Works out reports in time order, each against the one before it and the first with fuel on board. */
export function workReports(plan: VoyagePlan, fixes: readonly ReportFix[], limits: MonitoringThresholds): WorkedReport[] {
  let before: ReportBefore | null = null
  let baseline: FuelBaseline | null = null
  return fixes.map((fix) => {
    const worked = workReport(plan, fix, before, baseline, limits)
    before = { timeUtc: fix.timeUtc, alongTrackNm: worked.alongTrackNm }
    if (!baseline && fix.fuelRobT != null) baseline = { fuelRobT: fix.fuelRobT, alongTrackNm: worked.alongTrackNm }
    return worked
  })
}

/** Flags to alert on (raised now, not yet active) and active flags that have cleared. */
export function flagChanges(active: ReadonlySet<VoyageFlag>, flags: readonly VoyageFlag[]) {
  return { raise: flags.filter(f => !active.has(f)), clear: [...active].filter(f => !flags.includes(f)) }
}
