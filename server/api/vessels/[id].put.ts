import { idParamsSchema } from '#shared/types/fields'
import { vesselUpdateSchema } from '#shared/types/vessel'

export default defineRoleHandler(ADMIN_ONLY, async (event, user) => {
  const { id } = await getValidatedRouterParams(event, idParamsSchema.parse)
  const body = await readValidatedBody(event, vesselUpdateSchema.parse)
  return updateVessel(user, id, body)
})
