import { idParamsSchema } from '#shared/types/fields'
import { BRIEF_ROLES } from '#shared/utils/signoffRules'

export default defineRoleHandler(BRIEF_ROLES, async (event, user) => {
  const { id } = await getValidatedRouterParams(event, idParamsSchema.parse)
  const queued = await queueCrewBrief(user, id)
  setResponseStatus(event, 202)
  return queued
})
