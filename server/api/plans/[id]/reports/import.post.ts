import { idParamsSchema } from '#shared/types/fields'
import { trackImportSchema } from '#shared/types/voyage'

/**
 * A track log: multipart with `file` (NMEA 0183 or CSV) and the fields `mode=preview|create`,
 * `intervalMin`, `skipProblems` (which may also come in the query), or the file itself as text/csv.
 * The body limit (413) is the route's entry in server/utils/requestRules.ts.
 */
export default defineRoleHandler(EDITORS, async (event, user) => {
  const { id } = await getValidatedRouterParams(event, idParamsSchema.parse)
  const fields: Record<string, unknown> = { ...getQuery(event) }
  let text: string | undefined
  if ((getRequestHeader(event, 'content-type') ?? '').startsWith('multipart/form-data')) {
    for (const part of (await readMultipartFormData(event)) ?? []) {
      if (part.filename || part.name === 'file') text = part.data.toString('utf8')
      else if (part.name) fields[part.name] = part.data.toString('utf8')
    }
  }
  else text = await readRawBody(event, 'utf8')
  const parsed = trackImportSchema.safeParse(fields)
  if (!parsed.success) throw createError({ statusCode: 400, statusMessage: 'Invalid import fields', data: { issues: parsed.error.issues } })
  const options = parsed.data
  if (!text?.trim()) throw createError({ statusCode: 400, statusMessage: 'file: send a track log (NMEA 0183, or CSV of time, lat, lon)' })
  return importTrackLog(user, id, text, options)
})
