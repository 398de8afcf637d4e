import { reportParamsSchema } from '#shared/types/voyage'

export default defineRoleHandler(SIGNERS, async (event, user) => {
  const { id, reportId } = await getValidatedRouterParams(event, reportParamsSchema.parse)
  await deleteReport(user, id, reportId)
  setResponseStatus(event, 204)
  return null
})
