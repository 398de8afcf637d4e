import { idParamsSchema } from '#shared/types/fields'
import { remarkSchema } from '#shared/types/signoff'
import { REMARK_ROLES } from '#shared/utils/signoffRules'

export default defineRoleHandler(REMARK_ROLES, async (event, user) => {
  const { id } = await getValidatedRouterParams(event, idParamsSchema.parse)
  const { remarks } = await readValidatedBody(event, remarkSchema.parse)
  setResponseStatus(event, 201)
  return addRemark(user, id, remarks)
})
