import { idParamsSchema } from '#shared/types/fields'
import { routeExportQuerySchema } from '#shared/types/routeFile'

export default defineRoleHandler(ALL_ROLES, async (event, user) => {
  const { id } = await getValidatedRouterParams(event, idParamsSchema.parse)
  const { format } = await getValidatedQuery(event, routeExportQuerySchema.parse)
  const file = await exportPlanRoute(user, id, format)
  setResponseHeaders(event, {
    'content-type': file.contentType,
    'content-disposition': `attachment; filename="${file.fileName}"; filename*=UTF-8''${encodeURIComponent(file.fileName)}`,
    'cache-control': 'private, no-store',
  })
  return file.body
})
