export default defineRoleHandler(ADMIN_ONLY, async (event, user) => {
  return listCompanyUsers(user)
})
