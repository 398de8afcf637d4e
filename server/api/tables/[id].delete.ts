import { idParamsSchema } from '#shared/types/fields'

export default defineRoleHandler(TABLE_BUILDERS, async (event, user) => {
  const { id } = await getValidatedRouterParams(event, idParamsSchema.parse)
  await deleteTable(user, id)
  setResponseStatus(event, 204)
  return null
})
