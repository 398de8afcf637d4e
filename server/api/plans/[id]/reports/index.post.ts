import { idParamsSchema } from '#shared/types/fields'
import { reportSchema } from '#shared/types/voyage'

export default defineRoleHandler(EDITORS, async (event, user) => {
  const { id } = await getValidatedRouterParams(event, idParamsSchema.parse)
  const report = await readValidatedBody(event, reportSchema.parse)
  setResponseStatus(event, 201)
  return addReport(user, id, report)
})
