import { distanceTableParamsSchema } from '#shared/types/distanceTable'

export default defineEventHandler(async (event) => {
  const user = await requireRole(event, TABLE_BUILDERS)
  const { id } = await getValidatedRouterParams(event, distanceTableParamsSchema.parse)
  await deleteTable(user, id)
  setResponseStatus(event, 204)
  return null
})
