import { randomUUID } from 'node:crypto'
import type { H3Event } from 'h3'

// Every API route needs a live session except signing in and the health check. nuxt-auth-utils'
// own session routes check revocation in server/plugins/sessionRevocation.ts.
const OPEN = new Set(['POST /api/auth/login', 'GET /api/health'])
const SESSION_COOKIE = 'nuxt-session'
const SESSION_HEADER = `x-${SESSION_COOKIE}-session`

export default defineEventHandler(async (event) => {
  const sealed = getCookie(event, SESSION_COOKIE)
  if (!sealed) startUnsavedSession(event)
  // h3 reads a session header before the cookie: only a request without one restores from the cookie.
  const cacheable = !!sealed && getRequestHeader(event, SESSION_HEADER) === undefined
  const restored = cacheable && restoreSession(event, SESSION_COOKIE, sealed)
  if (!event.path.startsWith('/api/')) return
  const path = event.path.split('?')[0]!
  if (OPEN.has(`${event.method} ${path}`) || path === '/api/_auth/session') return
  const session = await getUserSession(event)
  if (cacheable && !restored) rememberSession(event, SESSION_COOKIE, sealed)
  if (!session.user) throw createError({ statusCode: 401, statusMessage: 'Sign in to continue' })
  if (await isSessionRevoked(session.id!)) {
    await clearUserSession(event)
    throw createError({ statusCode: 401, statusMessage: 'Your session has ended; sign in again' })
  }
})

// Without a cookie, h3 would create a session and set its cookie on whatever answer follows, so
// a cross-site request (sent without the cookie) would replace the user's own. A session made
// here is written only when something is stored in it (signing in).
function startUnsavedSession(event: H3Event) {
  event.context.sessions ??= Object.create(null)
  event.context.sessions![SESSION_COOKIE] ??= { id: randomUUID(), createdAt: Date.now(), data: Object.create(null) }
}
