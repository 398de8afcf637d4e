import { idParamsSchema } from '#shared/types/fields'
import { crewListSchema } from '#shared/types/vessel'

export default defineRoleHandler(ADMIN_ONLY, async (event, user) => {
  const { id } = await getValidatedRouterParams(event, idParamsSchema.parse)
  const { crew } = await readValidatedBody(event, crewListSchema.parse)
  return replaceCrew(user, id, crew)
})
