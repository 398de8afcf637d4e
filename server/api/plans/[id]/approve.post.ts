import { idParamsSchema } from '#shared/types/fields'
import { signoffStepSchema } from '#shared/types/signoff'
import { SIGNOFF_STEPS } from '#shared/utils/signoffRules'

export default defineRoleHandler(SIGNOFF_STEPS.approve.roles, async (event, user) => {
  const { id } = await getValidatedRouterParams(event, idParamsSchema.parse)
  const body = await readValidatedBody(event, signoffStepSchema.parse)
  return approvePlan(user, id, body?.version)
})
