export default defineRoleHandler(ALL_ROLES, async (_event, user) => listFleet(user))
