// Fuel by grade for a plan: each leg's fuel split by the share of its distance inside emission
// control areas, where the vessel burns its 0.10 % sulphur grade (MARPOL Annex VI reg. 14.4);
// the reserve is split as the passage fuel is, and cost is tonnes × the company's price.
import type { LegZoneDistance } from './types'

export interface FuelGrades { outside: string, insideEca: string }
export interface FuelPrice { grade: string, pricePerTonne: number }

/** What a vessel burns when its fuel data names no grades (common practice since 2020: VLSFO at sea, MGO in ECAs). */
export const DEFAULT_FUEL_GRADES: FuelGrades = { outside: 'VLSFO', insideEca: 'MGO' }
export interface FuelByGrade {
  grade: string
  /** Passage fuel of this grade (without reserve). */
  tonnes: number
  reserveTonnes: number
  withReserveTonnes: number
  pricePerTonne: number | null
  /** tonnes × price, null without a price for the grade. */
  cost: number | null
  costWithReserve: number | null
  /** Whether this grade is burnt inside ECAs. */
  insideEca: boolean
}

/** Share of a leg's distance inside ECAs (0..1). */
export function ecaShare(distanceNm: number, zones: readonly LegZoneDistance[]): number {
  if (!(distanceNm > 0)) return 0
  const inside = zones.reduce((s, z) => s + (z.kind === 'eca' ? z.distanceNm : 0), 0)
  return Math.min(1, inside / distanceNm)
}

/** Tonnes and cost by grade, the reserve split in proportion to the passage fuel of each grade. */
export function fuelByGrade(legTonnes: readonly number[], legs: readonly { distanceNm: number }[], legZones: readonly (readonly LegZoneDistance[])[], reserveTonnes: number, grades: FuelGrades, prices: readonly FuelPrice[]): FuelByGrade[] {
  let inside = 0
  let outside = 0
  legTonnes.forEach((t, i) => {
    const share = ecaShare(legs[i]?.distanceNm ?? 0, legZones[i] ?? [])
    inside += t * share
    outside += t * (1 - share)
  })
  const total = inside + outside
  const rows = grades.outside === grades.insideEca
    ? [{ grade: grades.outside, tonnes: total, insideEca: true }]
    : [{ grade: grades.outside, tonnes: outside, insideEca: false }, { grade: grades.insideEca, tonnes: inside, insideEca: true }]
  return rows.map((r) => {
    const reserve = total > 0 ? reserveTonnes * r.tonnes / total : 0
    const price = prices.find(p => p.grade.toLowerCase() === r.grade.toLowerCase())?.pricePerTonne ?? null
    return {
      ...r, reserveTonnes: reserve, withReserveTonnes: r.tonnes + reserve, pricePerTonne: price,
      cost: price === null ? null : r.tonnes * price, costWithReserve: price === null ? null : (r.tonnes + reserve) * price,
    }
  })
}
