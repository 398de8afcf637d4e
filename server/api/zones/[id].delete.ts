import { idParamsSchema } from '#shared/types/fields'

export default defineRoleHandler(ZONE_KEEPERS, async (event, user) => {
  const { id } = await getValidatedRouterParams(event, idParamsSchema.parse)
  await deleteZone(user, id)
  setResponseStatus(event, 204)
  return null
})
