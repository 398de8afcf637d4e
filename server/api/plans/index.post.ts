import { planCreateSchema } from '#shared/types/plan'

export default defineEventHandler(async (event) => {
  const user = await requireRole(event, EDITORS)
  const input = await readValidatedBody(event, planCreateSchema.parse)
  setResponseStatus(event, 201)
  return createPlan(user, input)
})
