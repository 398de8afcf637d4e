import { companySettingsSchema } from '#shared/types/company'

export default defineRoleHandler(ADMIN_ONLY, async (event, user) => {
  const body = await readValidatedBody(event, companySettingsSchema.parse)
  return updateCompanySettings(user, body)
})
