import type { PlanFuel } from '#shared/types/planView'
import { fitFuelCurve, planFuel } from '#shared/utils/fuel'
import { DEFAULT_FUEL_GRADES, fuelByGrade } from '#shared/utils/zones/fuelSplit'
import type { LegZoneDistance } from '#shared/utils/zones/types'


/**
 * Fuel per leg and for the plan from the vessel's fitted curve and the company's reserve margin;
 * null when the vessel has fewer than two fuel points (no curve to fit).
 */
export async function fuelForPlan(companyId: number, vesselId: number, legs: readonly { speedKn: number, hours: number, distanceNm: number }[], legZones: readonly LegZoneDistance[][] = []): Promise<PlanFuel | null> {
  // Three small reads at once rather than one after another (this runs on every plan read).
  const [points, { reserve, fuelPrices, currency }, grades] = await Promise.all([
    loadFuelPoints(vesselId),
    getCompanySettings(companyId),
    useDb()('vessel_fuel_grades').where({ vessel_id: vesselId }).first('outside', 'inside_eca as insideEca'),
  ])
  if (points.length < 2) return null
  const curve = fitFuelCurve(points)
  const fuel = planFuel(curve, legs, reserve)
  const byGrade = fuelByGrade(fuel.legTonnes, legs, legZones, fuel.reserveTonnes, grades ?? DEFAULT_FUEL_GRADES, fuelPrices ?? [])
  const speeds = points.map(p => p.speedKn)
  return { curve, reserve, ...fuel, byGrade, currency: currency ?? 'USD', dataSpeedKn: { min: Math.min(...speeds), max: Math.max(...speeds) } }
}
