import { idParamsSchema } from '#shared/types/fields'

export default defineRoleHandler(TABLE_BUILDERS, async (event, user) => {
  const { id } = await getValidatedRouterParams(event, idParamsSchema.parse)
  const { queued, table } = await rebuildTable(user, id)
  setResponseStatus(event, queued ? 202 : 200)
  return table
})
