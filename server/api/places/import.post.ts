import { placeImportModeSchema } from '#shared/types/place'

const MAX_BYTES = 2_000_000

/** CSV of places: `?mode=preview` lists rows and problems; `?mode=commit` imports when there are none. Body: the CSV text or a multipart file. */
export default defineRoleHandler(SHORE_DESK, async (event, user) => {
  const { mode } = await getValidatedQuery(event, placeImportModeSchema.parse)
  let text: string | undefined
  if ((getRequestHeader(event, 'content-type') ?? '').startsWith('multipart/form-data')) {
    const parts = await readMultipartFormData(event)
    text = parts?.find(p => p.filename || p.name === 'file')?.data.toString('utf8')
  }
  else text = await readRawBody(event, 'utf8')
  if (!text?.trim()) throw createError({ statusCode: 400, statusMessage: 'file: send a CSV file with a header row' })
  if (text.length > MAX_BYTES) throw createError({ statusCode: 413, statusMessage: 'file: a place CSV is at most 2 MB' })
  return importPlaces(user, text, mode)
})
