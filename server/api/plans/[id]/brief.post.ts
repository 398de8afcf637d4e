import { idParamsSchema } from '#shared/types/plan'
import { BRIEF_ROLES } from '#shared/utils/signoffRules'

export default defineEventHandler(async (event) => {
  const user = await requireRole(event, BRIEF_ROLES)
  const { id } = await getValidatedRouterParams(event, idParamsSchema.parse)
  const queued = await queueCrewBrief(user, id)
  setResponseStatus(event, 202)
  return queued
})
