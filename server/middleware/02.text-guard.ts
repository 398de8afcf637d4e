// PostgreSQL cannot store the NUL character in text; refuse it at the door with a 400 instead of
// letting a write fail deep inside a transaction.
export default defineEventHandler(async (event) => {
  if (!event.path.startsWith('/api/') || !['POST', 'PUT', 'PATCH'].includes(event.method)) return
  const type = getRequestHeader(event, 'content-type') ?? ''
  if (!type.includes('json')) return
  const raw = await readRawBody(event, 'utf8')
  if (raw && (raw.includes('\u0000') || /\\u0000/i.test(raw)))
    throw createError({ statusCode: 400, statusMessage: 'Text fields must not contain the NUL character' })
})
