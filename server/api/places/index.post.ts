import { placeSchema } from '#shared/types/place'

export default defineEventHandler(async (event) => {
  const user = await requireRole(event, SHORE_DESK)
  const body = await readValidatedBody(event, placeSchema.parse)
  setResponseStatus(event, 201)
  return createPlace(user, body)
})
