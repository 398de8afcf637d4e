import { idParamsSchema } from '#shared/types/fields'
import { planLandCheckSchema } from '#shared/types/landCheck'

export default defineRoleHandler(EDITORS, async (event, user) => {
  const { id } = await getValidatedRouterParams(event, idParamsSchema.parse)
  const input = await readValidatedBody(event, planLandCheckSchema.parse)
  setResponseStatus(event, 201)
  return runPlanLandCheck(user, id, input)
})
