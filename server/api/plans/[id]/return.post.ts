import { idParamsSchema } from '#shared/types/fields'
import { returnPlanSchema } from '#shared/types/signoff'
import { SIGNOFF_STEPS } from '#shared/utils/signoffRules'

export default defineRoleHandler(SIGNOFF_STEPS.return.roles, async (event, user) => {
  const { id } = await getValidatedRouterParams(event, idParamsSchema.parse)
  const { remarks, version } = await readValidatedBody(event, returnPlanSchema.parse)
  return returnPlan(user, id, remarks, version)
})
