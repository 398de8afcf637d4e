// Once the session is known: JSON routes take JSON and uploads take files (415), and a write's
// body is read once, counting bytes as they stream and stopping at the route's limit
// (server/utils/requestRules.ts), then handed to the route's own reader. PostgreSQL text cannot
// hold the NUL character, so a body with one is refused here rather than deep inside a write.
export default defineEventHandler(async (event) => {
  if (!event.path.startsWith('/api/') || !isWrite(event.method)) return
  const rule = bodyRuleFor(event.method, event.path.split('?')[0]!)
  const req = event.node.req
  const type = req.headers['content-type']
  const chunked = /\bchunked\b/i.test(String(req.headers['transfer-encoding'] ?? ''))
  const declared = Number(req.headers['content-length'] ?? 0)
  if ((type !== undefined || chunked || declared > 0) && !acceptsContentType(rule.kind, type ?? ''))
    throw createError({ statusCode: 415, statusMessage: rule.kind === 'json' ? 'Send the body as application/json' : 'Send the file as multipart/form-data (field "file") or as text/csv' })
  if (!chunked && !declared) return
  const body = await readBodyWithin(req, rule.limitBytes, () => bodyTooLarge(rule.limitBytes))
  if (body.includes(0) || (rule.kind === 'json' && /\\u0000/i.test(body.toString('latin1'))))
    throw createError({ statusCode: 400, statusMessage: 'Text must not contain the NUL character' })
  event._requestBody = body as Buffer<ArrayBuffer> // h3's readRawBody (and so readBody, readMultipartFormData) returns it as is
})
