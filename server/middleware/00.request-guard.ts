// The first look at every request, before any session or body is read: writes only from our own
// pages, JSON routes take JSON and uploads take files, a declared size beyond the route's limit is
// refused at once; API answers are never cached; the session cookie is Secure only over HTTPS.
const WRITES = new Set(['POST', 'PUT', 'PATCH', 'DELETE'])

export default defineEventHandler((event) => {
  if (!isHttpsRequest(event)) sendCookiesWithoutSecure(event)
  const path = event.path.split('?')[0]!
  if (path.startsWith('/api/')) setResponseHeader(event, 'cache-control', 'no-store')
  if (!WRITES.has(event.method)) return
  if (!isOwnOrigin(event))
    throw createError({ statusCode: 403, statusMessage: 'This request did not come from a Passagewright page; open the page and try again' })
  if (!path.startsWith('/api/')) return
  const rule = bodyRuleFor(event.method, path)
  const type = getRequestHeader(event, 'content-type')
  const declared = getRequestHeader(event, 'content-length')
  const hasBody = (declared !== undefined && declared !== '0') || getRequestHeader(event, 'transfer-encoding') !== undefined
  if ((type !== undefined || hasBody) && !acceptsContentType(rule.kind, type ?? ''))
    throw createError({ statusCode: 415, statusMessage: rule.kind === 'json' ? 'Send the body as application/json' : 'Send the file as multipart/form-data (field "file") or as text/csv' })
  if (declared !== undefined && Number(declared) > rule.limitBytes) throw bodyTooLarge(rule.limitBytes)
})
