// Every API route needs a session except signing in and the health check.
const OPEN = new Set(['POST /api/auth/login', 'GET /api/health'])

export default defineEventHandler(async (event) => {
  if (!event.path.startsWith('/api/')) return
  const path = event.path.split('?')[0]
  if (OPEN.has(`${event.method} ${path}`)) return
  await requireUserSession(event)
})
