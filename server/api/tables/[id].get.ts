import { distanceTableParamsSchema } from '#shared/types/distanceTable'

export default defineEventHandler(async (event) => {
  const user = await requireRole(event, ALL_ROLES)
  const { id } = await getValidatedRouterParams(event, distanceTableParamsSchema.parse)
  return getTable(user, id)
})
