import { idParamsSchema } from '#shared/types/plan'

export default defineEventHandler(async (event) => {
  const user = await requireRole(event, ALL_ROLES)
  const { id } = await getValidatedRouterParams(event, idParamsSchema.parse)
  return getPlanView(user, id)
})
