import { distanceTableParamsSchema } from '#shared/types/distanceTable'

export default defineRoleHandler(ALL_ROLES, async (event, user) => {
  const { id } = await getValidatedRouterParams(event, distanceTableParamsSchema.parse)
  return getTable(user, id)
})
