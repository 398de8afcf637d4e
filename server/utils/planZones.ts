// The zone step of a plan read: per-leg distances inside the company's zones, computed at read time
// from the cached prepared zones (zones change apart from plans), with sums by zone and by kind.
import type { LegZoneDistance } from '#shared/utils/zones/types'
import type { PlanViewZones } from '#shared/types/planView'
import { planZoneDistances, type ZoneTableLeg } from '#shared/utils/zones/legZones'
import type { PreparedZones } from '#shared/utils/zones/prepare'

export interface PlanZones { legs: LegZoneDistance[][], totals: PlanViewZones }

export function zonesForLegs(prepared: PreparedZones, legs: readonly ZoneTableLeg[]): PlanZones {
  const { legs: perLeg, totals } = planZoneDistances(prepared, legs)
  return { legs: perLeg, totals: { ...totals, entersNoGo: totals.byZone.some(z => z.kind === 'no-go'), entersRisk: totals.byZone.some(z => z.kind === 'risk') } }
}
