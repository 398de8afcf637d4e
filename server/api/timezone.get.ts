import { timeZoneQuerySchema } from '#shared/types/place'

/** The IANA time zone at a position, for the place form (derived, then editable). */
export default defineEventHandler(async (event) => {
  await requireRole(event, ALL_ROLES)
  const { lat, lon } = await getValidatedQuery(event, timeZoneQuerySchema.parse)
  return { timeZone: timeZoneAt(lat, lon) }
})
