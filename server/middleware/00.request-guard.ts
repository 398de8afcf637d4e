// The first look at every request, before any session or body is read: writes only from our own
// pages, a declared size beyond the route's limit refused at once; API answers are never cached;
// the session cookie is Secure only over HTTPS.
export default defineEventHandler((event) => {
  if (!isHttpsRequest(event)) sendCookiesWithoutSecure(event)
  const path = event.path.split('?')[0]!
  if (path.startsWith('/api/')) setResponseHeader(event, 'cache-control', 'no-store')
  if (!isWrite(event.method)) return
  if (!isOwnOrigin(event))
    throw createError({ statusCode: 403, statusMessage: 'This request did not come from a Passagewright page; open the page and try again' })
  if (!path.startsWith('/api/')) return
  const { limitBytes } = bodyRuleFor(event.method, path)
  const declared = getRequestHeader(event, 'content-length')
  if (declared !== undefined && Number(declared) > limitBytes) throw bodyTooLarge(limitBytes)
})
