import { z } from 'zod'

const params = z.object({ id: z.coerce.number().int().positive() })

export default defineRoleHandler(SHORE_DESK, async (event, user) => {
  const { id } = await getValidatedRouterParams(event, params.parse)
  await deletePlace(user, id)
  setResponseStatus(event, 204)
  return null
})
