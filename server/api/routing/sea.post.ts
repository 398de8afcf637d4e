import { seaRouteSchema } from '#shared/types/routing'
import type { SeaRouteResult } from '#shared/types/routing'

// The shortest practical sea route between two positions (server/utils/routing), kept out of the
// company's no-go areas (and risk areas or ECAs on request), with the distance inside each zone.
export default defineRoleHandler(ALL_ROLES, async (event, user) => {
  const input = await readValidatedBody(event, seaRouteSchema.parse)
  return (await planZonedSeaRoute(user, input)) satisfies SeaRouteResult
})
