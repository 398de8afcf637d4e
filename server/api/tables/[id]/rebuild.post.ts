import { distanceTableParamsSchema } from '#shared/types/distanceTable'

export default defineEventHandler(async (event) => {
  const user = await requireRole(event, TABLE_BUILDERS)
  const { id } = await getValidatedRouterParams(event, distanceTableParamsSchema.parse)
  const { queued, table } = await rebuildTable(user, id)
  setResponseStatus(event, queued ? 202 : 200)
  return table
})
