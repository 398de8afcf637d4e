// Sea routes that respect the company's zones (capability 12): no-go areas are always kept out
// of, risk areas on request, and on request ECAs are weighted by what a mile inside costs against a
// mile outside (minimum-ECA routing), answered with the shortest route beside it and the difference.
import type { SessionUser } from '#shared/types/auth'
import type { SeaRouteInput, SeaRouteResult } from '#shared/types/routing'
import type { LegZoneDistance } from '#shared/utils/zones/types'
import type { PreparedZones } from '#shared/utils/zones/prepare'
import { legZoneDistances } from '#shared/utils/zones/legZones'
import { DEFAULT_FUEL_GRADES, type FuelGrades } from '#shared/utils/zones/fuelSplit'
import { fitFuelCurve, fuelRate } from '#shared/utils/fuel'
import { planSeaRoute } from './routing/service'
import { zoneRouteAreas } from './zoneAreas'

/** MGO has cost roughly a third more than VLSFO a tonne in recent years (common practice), used when a price is missing. */
const FALLBACK_ECA_FACTOR = 1.3

export interface RouteZoneFigures { distanceNm: number, ecaNm: number, fuelCost: number | null }

/** Distance inside each zone in force now, along the route's geodesic legs. */
function routeZones(prepared: PreparedZones, route: SeaRouteResult): LegZoneDistance[] {
  const now = Date.now()
  const sums = new Map<number, LegZoneDistance>()
  route.waypoints.slice(1).forEach((to, i) => {
    for (const z of legZoneDistances(prepared, { from: route.waypoints[i]!, to, method: 'geodesic', startMs: now, endMs: now })) {
      const sum = sums.get(z.zoneId)
      if (sum) sum.distanceNm += z.distanceNm
      else sums.set(z.zoneId, { ...z })
    }
  })
  return [...sums.values()]
}

async function costModel(user: SessionUser, input: SeaRouteInput) {
  const { fuelPrices } = await getCompanySettings(user.companyId)
  let grades: FuelGrades = DEFAULT_FUEL_GRADES
  let tonnesPerNm: number | null = null
  if (input.vesselId) {
    const vessel = await useDb()('vessels').where({ id: input.vesselId, company_id: user.companyId }).first('id', 'service_speed_kn')
    if (!vessel) throw createError({ statusCode: 400, statusMessage: 'vesselId: no such vessel in your company' })
    const row = await useDb()('vessel_fuel_grades').where({ vessel_id: vessel.id }).first('outside', 'inside_eca as insideEca')
    if (row) grades = row
    const points = await loadFuelPoints(vessel.id)
    const speed = input.speedKn ?? Number(vessel.service_speed_kn)
    if (points.length >= 2) tonnesPerNm = fuelRate(fitFuelCurve(points), speed) / 24 / speed
  }
  const price = (grade: string) => fuelPrices?.find(p => p.grade.toLowerCase() === grade.toLowerCase())?.pricePerTonne ?? null
  const pOut = price(grades.outside)
  const pEca = price(grades.insideEca)
  const factor = pOut && pEca ? Math.max(1, pEca / pOut) : FALLBACK_ECA_FACTOR
  const cost = (distanceNm: number, ecaNm: number) => (tonnesPerNm && pOut != null && pEca != null ? tonnesPerNm * ((distanceNm - ecaNm) * pOut + ecaNm * pEca) : null)
  return { factor, cost }
}

const ecaOf = (zones: LegZoneDistance[]) => zones.reduce((s, z) => s + (z.kind === 'eca' ? z.distanceNm : 0), 0)

export async function planZonedSeaRoute(user: SessionUser, input: SeaRouteInput) {
  const { zones, prepared } = await companyZones(user.companyId)
  const avoid = input.avoidZones ?? []
  const { factor, cost } = await costModel(user, input)
  const figures = (route: SeaRouteResult, z: LegZoneDistance[]): RouteZoneFigures => ({ distanceNm: route.distanceNm, ecaNm: ecaOf(z), fuelCost: cost(route.distanceNm, ecaOf(z)) })
  const route = await planSeaRoute(input, zoneRouteAreas(zones, avoid, factor))
  const onRoute = routeZones(prepared, route)
  if (!avoid.includes('eca')) return { ...route, zones: onRoute }
  const shortest = await planSeaRoute(input, zoneRouteAreas(zones, avoid.filter(k => k !== 'eca'), factor))
  const a = figures(shortest, routeZones(prepared, shortest))
  const b = figures(route, onRoute)
  return {
    ...route, zones: onRoute,
    ecaComparison: {
      ecaCostFactor: factor, shortest: { ...a, waypoints: shortest.waypoints }, minimumEca: b,
      difference: { distanceNm: b.distanceNm - a.distanceNm, ecaNm: b.ecaNm - a.ecaNm, fuelCost: a.fuelCost != null && b.fuelCost != null ? b.fuelCost - a.fuelCost : null },
    },
  }
}
