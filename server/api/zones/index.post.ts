import { zoneCreateSchema } from '#shared/types/zone'

/** A new zone from GeoJSON (shore desk and admin); refused with line-numbered problems, storing nothing. */
export default defineRoleHandler(ZONE_KEEPERS, async (event, user) => {
  const body = await readValidatedBody(event, zoneCreateSchema.parse)
  const zone = await createZone(user, body)
  setResponseStatus(event, 201)
  return zone
})
