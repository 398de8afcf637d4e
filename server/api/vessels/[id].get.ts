import { z } from 'zod'

const params = z.object({ id: z.coerce.number().int().positive() })

export default defineEventHandler(async (event) => {
  const user = await requireRole(event, ALL_ROLES)
  const { id } = await getValidatedRouterParams(event, params.parse)
  return getVessel(user, id)
})
