// What GET /api/plans/:id (and every plan write) answers: declared once, returned by
// getPlanView (server/utils/plans.ts), read by the draft store, the save composable and the print page.
import type { FuelCurve } from '../utils/fuel'
import type { LegTableTotals, PlanLeg } from '../utils/legTable'
import type { FuelReserve } from './fuel'
import type { PlanDetail, PlanEvent } from './plan'
import type { Waypoint } from './waypoint'
import type { StoredLandCheck } from './landCheck'
import type { FuelByGrade } from '../utils/zones/fuelSplit'
import type { PlanZoneTotals } from '../utils/zones/legZones'
import type { LegZoneDistance } from '../utils/zones/types'

/** Fuel per leg and for the plan from the vessel's fitted curve and the company's reserve margin. */
export interface PlanFuel {
  curve: FuelCurve
  legTonnes: number[]
  totalTonnes: number
  reserve: FuelReserve
  reserveTonnes: number
  withReserveTonnes: number
  /** Tonnes and cost by fuel grade: the vessel's ECA grade for the distance inside ECAs. */
  byGrade: FuelByGrade[]
  currency: string
  /** The slowest and fastest speeds of the vessel's fuel data: outside them the curve is extrapolated. */
  dataSpeedKn?: { min: number, max: number }
}

/** The plan's distance inside each zone and kind, and whether it enters a no-go or risk area. */
export interface PlanViewZones extends PlanZoneTotals { entersNoGo: boolean, entersRisk: boolean }

export interface PlanView {
  plan: PlanDetail
  waypoints: Waypoint[]
  /** Each leg with its distance inside every zone it enters. */
  legs: (PlanLeg & { zones: LegZoneDistance[] })[]
  totals: LegTableTotals & { zones: PlanViewZones }
  /** Null when the vessel has fewer than two fuel points (no curve to fit). */
  fuel: PlanFuel | null
  events: PlanEvent[]
  /** The last land check kept for the plan (null when none was run on a saved track). */
  landCheck: StoredLandCheck | null
}
