import type { FuelReserve } from '#shared/types/fuel'
import type { PlanFuel } from '#shared/types/planView'
import { fitFuelCurve, planFuel, type FuelCurve } from '#shared/utils/fuel'


/**
 * Fuel per leg and for the plan from the vessel's fitted curve and the company's reserve margin;
 * null when the vessel has fewer than two fuel points (no curve to fit).
 */
export async function fuelForPlan(companyId: number, vesselId: number, legs: readonly { speedKn: number, hours: number }[]): Promise<PlanFuel | null> {
  const points = await loadFuelPoints(vesselId)
  if (points.length < 2) return null
  const curve = fitFuelCurve(points)
  const { reserve } = await getCompanySettings(companyId)
  return { curve, reserve, ...planFuel(curve, legs, reserve) }
}
