import { timeZoneQuerySchema } from '#shared/types/place'

/** The IANA time zone at a position, for the place form (derived, then editable). */
export default defineRoleHandler(ALL_ROLES, async (event) => {
  const { lat, lon } = await getValidatedQuery(event, timeZoneQuerySchema.parse)
  return { timeZone: timeZoneAt(lat, lon) }
})
