import { distanceTableParamsSchema } from '#shared/types/distanceTable'

export default defineRoleHandler(TABLE_BUILDERS, async (event, user) => {
  const { id } = await getValidatedRouterParams(event, distanceTableParamsSchema.parse)
  await deleteTable(user, id)
  setResponseStatus(event, 204)
  return null
})
