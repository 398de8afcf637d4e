import { idParamsSchema } from '#shared/types/plan'
import { returnPlanSchema } from '#shared/types/signoff'
import { SIGNOFF_STEPS } from '#shared/utils/signoffRules'

export default defineEventHandler(async (event) => {
  const user = await requireRole(event, SIGNOFF_STEPS.return.roles)
  const { id } = await getValidatedRouterParams(event, idParamsSchema.parse)
  const { remarks, version } = await readValidatedBody(event, returnPlanSchema.parse)
  return returnPlan(user, id, remarks, version)
})
