import { landCheckSchema, LAND_CHECK_RESULT_CAUTION } from '#shared/types/landCheck'
import type { LandCheckResult } from '#shared/types/landCheck'

export default defineRoleHandler(ALL_ROLES, async (event) => {
  const { waypoints, clearanceNm } = await readValidatedBody(event, landCheckSchema.parse)
  return { legs: checkTrackLegs(waypoints, clearanceNm, await landCheckCoast()), caution: LAND_CHECK_RESULT_CAUTION } satisfies LandCheckResult
})
