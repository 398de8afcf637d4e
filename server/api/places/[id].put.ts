import { z } from 'zod'
import { placeSchema } from '#shared/types/place'

const params = z.object({ id: z.coerce.number().int().positive() })

export default defineRoleHandler(SHORE_DESK, async (event, user) => {
  const { id } = await getValidatedRouterParams(event, params.parse)
  const body = await readValidatedBody(event, placeSchema.parse)
  return updatePlace(user, id, body)
})
