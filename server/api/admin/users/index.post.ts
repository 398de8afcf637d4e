import { userCreateSchema } from '#shared/types/adminUser'

export default defineRoleHandler(ADMIN_ONLY, async (event, user) => {
  const body = await readValidatedBody(event, userCreateSchema.parse)
  setResponseStatus(event, 201)
  return createCompanyUser(user, body)
})
