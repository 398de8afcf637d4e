import { z } from 'zod'
import { vesselUpdateSchema } from '#shared/types/vessel'

const params = z.object({ id: z.coerce.number().int().positive() })

export default defineRoleHandler(ADMIN_ONLY, async (event, user) => {
  const { id } = await getValidatedRouterParams(event, params.parse)
  const body = await readValidatedBody(event, vesselUpdateSchema.parse)
  return updateVessel(user, id, body)
})
