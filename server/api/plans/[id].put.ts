import { idParamsSchema, planHeaderSchema } from '#shared/types/plan'

export default defineEventHandler(async (event) => {
  const user = await requireRole(event, EDITORS)
  const { id } = await getValidatedRouterParams(event, idParamsSchema.parse)
  const input = await readValidatedBody(event, planHeaderSchema.parse)
  return updatePlanHeader(user, id, input)
})
