import { userCreateSchema } from '#shared/types/adminUser'

export default defineEventHandler(async (event) => {
  const user = await requireRole(event, ADMIN_ONLY)
  const body = await readValidatedBody(event, userCreateSchema.parse)
  setResponseStatus(event, 201)
  return createCompanyUser(user, body)
})
