import { idParamsSchema } from '#shared/types/fields'

export default defineRoleHandler(ALL_ROLES, async (event, user) => {
  const { id } = await getValidatedRouterParams(event, idParamsSchema.parse)
  return getVoyage(user, id)
})
