import { landCheckSchema, LAND_CHECK_RESULT_CAUTION } from '#shared/types/landCheck'
import type { LandCheckResult } from '#shared/types/landCheck'

export default defineRoleHandler(ALL_ROLES, async (event) => {
  const { waypoints, clearanceNm } = await readValidatedBody(event, landCheckSchema.parse)
  const legs = waypoints.slice(1).map((to, i) => ({ from: waypoints[i]!, to, method: to.method }))
  const checked = checkLegs(legs, clearanceNm).map(leg => ({
    index: leg.index,
    crossesLand: leg.crossesLand,
    firstLandPoint: leg.firstLandPoint ? { lat: leg.firstLandPoint.lat, lon: leg.firstLandPoint.lon } : null,
    closestApproachNm: leg.closestApproachNm,
    closestCoastPoint: leg.closestCoastPoint,
    withinClearance: leg.withinClearance,
  }))
  return { legs: checked, caution: LAND_CHECK_RESULT_CAUTION } satisfies LandCheckResult
})
