export default defineRoleHandler(ALL_ROLES, async (event, user) => {
  return listPlans(user)
})
