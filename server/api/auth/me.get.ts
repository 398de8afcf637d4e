export default defineRoleHandler(ALL_ROLES, async (_event, user) => {
  return { user }
})
