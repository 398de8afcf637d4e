import { idParamsSchema } from '#shared/types/fields'
import type { PlanView } from '#shared/types/planView'

export default defineRoleHandler(ALL_ROLES, async (event, user) => {
  const { id } = await getValidatedRouterParams(event, idParamsSchema.parse)
  // Sent as the service wrote it (stored legs are not parsed and serialised again): the text of a PlanView.
  setResponseHeader(event, 'content-type', 'application/json')
  return await getPlanViewJson(user, id) as unknown as PlanView
})
