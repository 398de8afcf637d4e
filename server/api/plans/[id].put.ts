import { idParamsSchema } from '#shared/types/fields'
import { planHeaderSchema } from '#shared/types/plan'

export default defineRoleHandler(EDITORS, async (event, user) => {
  const { id } = await getValidatedRouterParams(event, idParamsSchema.parse)
  const input = await readValidatedBody(event, planHeaderSchema.parse)
  return updatePlanHeader(user, id, input)
})
