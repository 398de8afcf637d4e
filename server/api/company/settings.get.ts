export default defineRoleHandler(ALL_ROLES, async (event, user) => {
  return getCompanySettings(user.companyId)
})
