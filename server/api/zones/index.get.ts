/** The company's zones with their geometry (every role of the company reads them). */
export default defineRoleHandler(ALL_ROLES, async (_event, user) => listZones(user))
