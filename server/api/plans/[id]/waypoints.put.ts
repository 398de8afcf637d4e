import { idParamsSchema, waypointsPutSchema } from '#shared/types/plan'

export default defineEventHandler(async (event) => {
  const user = await requireRole(event, EDITORS)
  const { id } = await getValidatedRouterParams(event, idParamsSchema.parse)
  const { version, waypoints } = await readValidatedBody(event, waypointsPutSchema.parse)
  return saveWaypoints(user, id, version, waypoints)
})
