import { idParamsSchema } from '#shared/types/fields'
import { REVISE_ROLES } from '#shared/utils/signoffRules'

export default defineRoleHandler(REVISE_ROLES, async (event, user) => {
  const { id } = await getValidatedRouterParams(event, idParamsSchema.parse)
  setResponseStatus(event, 201)
  return startRevision(user, id)
})
