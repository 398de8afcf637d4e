import { idParamsSchema } from '#shared/types/fields'
import type { PlanView } from '#shared/types/planView'

export default defineRoleHandler(ALL_ROLES, async (event, user) => {
  const { id } = await getValidatedRouterParams(event, idParamsSchema.parse)
  // Sent as the service wrote it (stored legs are not parsed and serialised again): the text of a
  // PlanView, encoded once here (a string would be measured and encoded again on its way out).
  setResponseHeader(event, 'content-type', 'application/json')
  return Buffer.from(await getPlanViewJson(user, id)) as unknown as PlanView
})
