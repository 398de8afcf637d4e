import { idParamsSchema } from '#shared/types/plan'
import { REVISE_ROLES } from '#shared/utils/signoffRules'

export default defineEventHandler(async (event) => {
  const user = await requireRole(event, REVISE_ROLES)
  const { id } = await getValidatedRouterParams(event, idParamsSchema.parse)
  setResponseStatus(event, 201)
  return startRevision(user, id)
})
