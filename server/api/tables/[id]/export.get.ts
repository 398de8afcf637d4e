import { idParamsSchema } from '#shared/types/fields'

export default defineRoleHandler(ALL_ROLES, async (event, user) => {
  const { id } = await getValidatedRouterParams(event, idParamsSchema.parse)
  const table = await getTable(user, id)
  if (table.status !== 'ready' || !table.matrix) throw createError({ statusCode: 409, statusMessage: 'The table is not built yet' })
  setHeader(event, 'content-type', 'text/csv; charset=utf-8')
  setHeader(event, 'content-disposition', `attachment; filename="distance-table-${table.id}.csv"`)
  return distanceTableCsv(table)
})
