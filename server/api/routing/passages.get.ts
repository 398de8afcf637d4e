import { listPassages } from '~~/server/utils/routing/service'

// The declared canals and straits a route can use or avoid.
export default defineRoleHandler(ALL_ROLES, async () => listPassages())
