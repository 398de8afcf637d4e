// What GET /api/plans/:id (and every plan write) answers: declared once, returned by
// getPlanView (server/utils/plans.ts), read by the draft store, the save composable and the print page.
import type { FuelCurve } from '../utils/fuel'
import type { LegTableTotals, PlanLeg } from '../utils/legTable'
import type { FuelReserve } from './fuel'
import type { PlanDetail, PlanEvent } from './plan'
import type { Waypoint } from './waypoint'

/** Fuel per leg and for the plan from the vessel's fitted curve and the company's reserve margin. */
export interface PlanFuel {
  curve: FuelCurve
  legTonnes: number[]
  totalTonnes: number
  reserve: FuelReserve
  reserveTonnes: number
  withReserveTonnes: number
}

export interface PlanView {
  plan: PlanDetail
  waypoints: Waypoint[]
  legs: PlanLeg[]
  totals: LegTableTotals
  /** Null when the vessel has fewer than two fuel points (no curve to fit). */
  fuel: PlanFuel | null
  events: PlanEvent[]
}
