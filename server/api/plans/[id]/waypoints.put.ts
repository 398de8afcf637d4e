import { idParamsSchema } from '#shared/types/fields'
import { waypointsPutSchema } from '#shared/types/plan'

export default defineRoleHandler(EDITORS, async (event, user) => {
  const { id } = await getValidatedRouterParams(event, idParamsSchema.parse)
  const { version, waypoints } = await readValidatedBody(event, waypointsPutSchema.parse)
  return saveWaypoints(user, id, version, waypoints)
})
