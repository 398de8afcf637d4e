import { idParamsSchema } from '#shared/types/fields'

export default defineRoleHandler(SHORE_DESK, async (event, user) => {
  const { id } = await getValidatedRouterParams(event, idParamsSchema.parse)
  await deletePlace(user, id)
  setResponseStatus(event, 204)
  return null
})
