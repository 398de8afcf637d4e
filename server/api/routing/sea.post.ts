import { seaRouteSchema } from '#shared/types/routing'
import type { SeaRouteResult } from '#shared/types/routing'
import { planSeaRoute } from '~~/server/utils/routing/service'

// The shortest practical sea route between two positions (server/utils/routing).
export default defineRoleHandler(ALL_ROLES, async (event) => {
  const input = await readValidatedBody(event, seaRouteSchema.parse)
  return (await planSeaRoute(input)) satisfies SeaRouteResult
})
