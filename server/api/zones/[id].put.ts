import { idParamsSchema } from '#shared/types/fields'
import { zoneUpdateSchema } from '#shared/types/zone'

/** Changes a zone's name, kind, source, validity or geometry (shore desk and admin). */
export default defineRoleHandler(ZONE_KEEPERS, async (event, user) => {
  const { id } = await getValidatedRouterParams(event, idParamsSchema.parse)
  const body = await readValidatedBody(event, zoneUpdateSchema.parse)
  return updateZone(user, id, body)
})
