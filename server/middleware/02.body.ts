// Reads a write's body once, counting bytes as they stream and stopping at the route's limit
// (server/utils/requestRules.ts), then hands it to the route's own reader. PostgreSQL text cannot
// hold the NUL character, so a body with one is refused here rather than deep inside a write.
export default defineEventHandler(async (event) => {
  if (!event.path.startsWith('/api/') || !['POST', 'PUT', 'PATCH', 'DELETE'].includes(event.method)) return
  const req = event.node.req
  const chunked = /\bchunked\b/i.test(String(req.headers['transfer-encoding'] ?? ''))
  if (!chunked && !Number(req.headers['content-length'])) return
  const rule = bodyRuleFor(event.method, event.path.split('?')[0]!)
  const body = await readBodyWithin(req, rule.limitBytes, () => bodyTooLarge(rule.limitBytes))
  if (body.includes(0) || (rule.kind === 'json' && /\\u0000/i.test(body.toString('latin1'))))
    throw createError({ statusCode: 400, statusMessage: 'Text must not contain the NUL character' })
  event._requestBody = body as Buffer<ArrayBuffer> // h3's readRawBody (and so readBody, readMultipartFormData) returns it as is
})
