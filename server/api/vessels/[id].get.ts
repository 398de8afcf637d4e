import { z } from 'zod'

const params = z.object({ id: z.coerce.number().int().positive() })

export default defineRoleHandler(ALL_ROLES, async (event, user) => {
  const { id } = await getValidatedRouterParams(event, params.parse)
  return getVessel(user, id)
})
