import { idParamsSchema } from '#shared/types/fields'
import { placeSchema } from '#shared/types/place'

export default defineRoleHandler(SHORE_DESK, async (event, user) => {
  const { id } = await getValidatedRouterParams(event, idParamsSchema.parse)
  const body = await readValidatedBody(event, placeSchema.parse)
  return updatePlace(user, id, body)
})
