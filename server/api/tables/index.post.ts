import { distanceTableCreateSchema } from '#shared/types/distanceTable'

// Up to IMMEDIATE_TABLE_PLACES places: built now, 201 with the table. Larger: queued, 202 with the table still building.
export default defineRoleHandler(TABLE_BUILDERS, async (event, user) => {
  const input = await readValidatedBody(event, distanceTableCreateSchema.parse)
  const { queued, table } = await createTable(user, input)
  setResponseStatus(event, queued ? 202 : 201)
  return table
})
