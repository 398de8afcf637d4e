export default defineRoleHandler(ALL_ROLES, async (event, user) => {
  return listPlaces(user)
})
