import { idParamsSchema } from '#shared/types/fields'
import { vesselFuelSchema } from '#shared/types/vessel'

/** Replaces the vessel's fuel points: two or more, positive, one consumption per speed; anything else is a 400 and nothing changes. */
export default defineRoleHandler(SHORE_DESK, async (event, user) => {
  const { id } = await getValidatedRouterParams(event, idParamsSchema.parse)
  const { points } = await readValidatedBody(event, vesselFuelSchema.parse)
  return replaceFuelPoints(user, id, points)
})
