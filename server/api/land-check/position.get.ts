import { landPositionQuerySchema } from '#shared/types/landCheck'

/** Whether a position lies ashore on the coarse coastline (a waypoint dragged or placed on the chart). */
export default defineRoleHandler(ALL_ROLES, async (event) => {
  const { lat, lon } = await getValidatedQuery(event, landPositionQuerySchema.parse)
  return { ashore: isLand(lat, lon) }
})
