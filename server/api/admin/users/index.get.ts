export default defineEventHandler(async (event) => {
  const user = await requireRole(event, ADMIN_ONLY)
  return listCompanyUsers(user)
})
