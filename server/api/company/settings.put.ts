import { companySettingsSchema } from '#shared/types/company'

export default defineEventHandler(async (event) => {
  const user = await requireRole(event, ADMIN_ONLY)
  const body = await readValidatedBody(event, companySettingsSchema.parse)
  return updateCompanySettings(user, body)
})
