import { z } from 'zod'

const params = z.object({ id: z.coerce.number().int().positive() })

export default defineEventHandler(async (event) => {
  const user = await requireRole(event, SHORE_DESK)
  const { id } = await getValidatedRouterParams(event, params.parse)
  await deletePlace(user, id)
  setResponseStatus(event, 204)
  return null
})
