import { idParamsSchema } from '#shared/types/fields'
import { vesselFuelGradesSchema } from '#shared/types/vessel'

/** Sets the fuel grades the vessel burns outside and inside emission control areas. */
export default defineRoleHandler(SHORE_DESK, async (event, user) => {
  const { id } = await getValidatedRouterParams(event, idParamsSchema.parse)
  const grades = await readValidatedBody(event, vesselFuelGradesSchema.parse)
  return setFuelGrades(user, id, grades)
})
