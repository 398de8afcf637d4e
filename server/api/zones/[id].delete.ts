import { zoneIdParamsSchema } from '#shared/types/zone'

export default defineRoleHandler(ZONE_KEEPERS, async (event, user) => {
  const { id } = await getValidatedRouterParams(event, zoneIdParamsSchema.parse)
  await deleteZone(user, id)
  setResponseStatus(event, 204)
  return null
})
