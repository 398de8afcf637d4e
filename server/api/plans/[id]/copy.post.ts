import { idParamsSchema } from '#shared/types/fields'
import { planCopySchema } from '#shared/types/plan'

export default defineRoleHandler(EDITORS, async (event, user) => {
  const { id } = await getValidatedRouterParams(event, idParamsSchema.parse)
  const input = await readValidatedBody(event, planCopySchema.parse)
  const created = await copyPlan(user, id, input)
  setResponseStatus(event, 201)
  return created
})
