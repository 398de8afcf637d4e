import { placeSchema } from '#shared/types/place'

export default defineRoleHandler(SHORE_DESK, async (event, user) => {
  const body = await readValidatedBody(event, placeSchema.parse)
  setResponseStatus(event, 201)
  return createPlace(user, body)
})
