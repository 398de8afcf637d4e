import { z } from 'zod'
import { crewListSchema } from '#shared/types/vessel'

const params = z.object({ id: z.coerce.number().int().positive() })

export default defineRoleHandler(ADMIN_ONLY, async (event, user) => {
  const { id } = await getValidatedRouterParams(event, params.parse)
  const { crew } = await readValidatedBody(event, crewListSchema.parse)
  return replaceCrew(user, id, crew)
})
