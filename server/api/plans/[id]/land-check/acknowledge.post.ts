import { idParamsSchema } from '#shared/types/fields'
import { landCheckAckSchema } from '#shared/types/landCheck'

export default defineRoleHandler(EDITORS, async (event, user) => {
  const { id } = await getValidatedRouterParams(event, idParamsSchema.parse)
  const input = await readValidatedBody(event, landCheckAckSchema.parse)
  setResponseStatus(event, 201)
  return acknowledgeLandCheckLeg(user, id, input)
})
