// The plan as a schedule: where the ship is expected at a time, when it is expected at a distance
// along the plan, and the fuel planned to get there (common practice: each leg at its planned speed,
// time = distance / speed; fuel = rate(V) · hours / 24 from the vessel's fitted curve).
import { fuelRate, type FuelCurve } from '../fuel'
import type { MonitoredLeg } from './planPosition'

type TimedLeg = Pick<MonitoredLeg, 'distanceNm' | 'speedKn' | 'hours'>

/** Distance along the plan the schedule expects after `hours` from departure, nm (0 … total). */
export function plannedAlongAt(legs: readonly TimedLeg[], hours: number): number {
  if (!(hours > 0)) return 0
  let t = 0
  let d = 0
  for (const leg of legs) {
    if (hours < t + leg.hours) return d + (hours - t) * leg.speedKn
    t += leg.hours
    d += leg.distanceNm
  }
  return d
}

/** Hours from departure the schedule needs to reach `alongNm` along the plan (beyond the end: the arrival). */
export function plannedHoursTo(legs: readonly TimedLeg[], alongNm: number): number {
  if (!(alongNm > 0)) return 0
  let t = 0
  let d = 0
  for (const leg of legs) {
    if (alongNm < d + leg.distanceNm) return t + (alongNm - d) / leg.speedKn
    t += leg.hours
    d += leg.distanceNm
  }
  return t
}

/** Fuel the plan burns from departure to `alongNm` along it, tonnes: Σ rate(leg speed) · hours on the part of each leg sailed / 24. */
export function plannedFuelTo(legs: readonly TimedLeg[], alongNm: number, curve: Pick<FuelCurve, 'c' | 'k'>): number {
  let d = 0
  let tonnes = 0
  for (const leg of legs) {
    const part = Math.min(leg.distanceNm, Math.max(0, alongNm - d))
    if (part <= 0) break
    tonnes += fuelRate(curve, leg.speedKn) * (part / leg.speedKn) / 24
    d += leg.distanceNm
  }
  return tonnes
}
