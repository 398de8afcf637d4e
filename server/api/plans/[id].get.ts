import { idParamsSchema } from '#shared/types/fields'
import type { PlanView } from '#shared/types/planView'

export default defineRoleHandler(ALL_ROLES, async (event, user) => {
  const { id } = await getValidatedRouterParams(event, idParamsSchema.parse)
  // Sent as the service keeps it (server/utils/planViewCache.ts): the text of a PlanView, compressed
  // once per view for a client that accepts brotli or gzip (every browser does).
  const view = await getPlanViewJson(user, id)
  const { body, encoding } = await encodedPlanView(view, pickEncoding(getRequestHeader(event, 'accept-encoding')))
  setResponseHeader(event, 'content-type', 'application/json')
  appendResponseHeader(event, 'vary', 'accept-encoding')
  if (encoding) setResponseHeader(event, 'content-encoding', encoding)
  return body as unknown as PlanView
})
