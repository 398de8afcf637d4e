import { z } from 'zod'
import { vesselUpdateSchema } from '#shared/types/vessel'

const params = z.object({ id: z.coerce.number().int().positive() })

export default defineEventHandler(async (event) => {
  const user = await requireRole(event, ADMIN_ONLY)
  const { id } = await getValidatedRouterParams(event, params.parse)
  const body = await readValidatedBody(event, vesselUpdateSchema.parse)
  return updateVessel(user, id, body)
})
