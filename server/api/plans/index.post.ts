import { planCreateSchema } from '#shared/types/plan'

export default defineRoleHandler(EDITORS, async (event, user) => {
  const input = await readValidatedBody(event, planCreateSchema.parse)
  setResponseStatus(event, 201)
  return createPlan(user, input)
})
