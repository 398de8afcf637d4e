import { planBoardQuerySchema } from '#shared/types/plan'

/** The passage board: one page of the company's plans, sorted and filtered on the server. */
export default defineRoleHandler(ALL_ROLES, async (event, user) => {
  const query = await getValidatedQuery(event, planBoardQuerySchema.parse)
  return listPlanBoard(user, query)
})
