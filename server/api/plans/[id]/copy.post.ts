import { idParamsSchema } from '#shared/types/fields'
import { planCopySchema } from '#shared/types/plan'

export default defineRoleHandler(EDITORS, async (event, user) => {
  const { id } = await getValidatedRouterParams(event, idParamsSchema.parse)
  // The body is optional: no body copies the plan as it is.
  const input = await readValidatedBody(event, body => planCopySchema.parse(body ?? {}))
  const created = await copyPlan(user, id, input)
  setResponseStatus(event, 201)
  return created
})
