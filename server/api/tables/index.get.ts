export default defineEventHandler(async (event) => {
  const user = await requireRole(event, ALL_ROLES)
  return listTables(user)
})
