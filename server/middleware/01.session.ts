// Every API route needs a live session except signing in, the health check and nuxt-auth-utils'
// own session endpoint (it only ever reveals the caller's own session).
const OPEN = new Set(['POST /api/auth/login', 'GET /api/health'])

export default defineEventHandler(async (event) => {
  if (!event.path.startsWith('/api/')) return
  const path = event.path.split('?')[0]!
  if (OPEN.has(`${event.method} ${path}`) || path === '/api/_auth/session') return
  const session = await requireUserSession(event)
  if (await isSessionRevoked(session.id!)) {
    await clearUserSession(event)
    throw createError({ statusCode: 401, statusMessage: 'Your session has ended; sign in again' })
  }
})
