// Sign-out holds on nuxt-auth-utils' own routes too: GET /api/_auth/session (and so every
// server-rendered page, which reads the session through it) refuses a revoked session, and
// DELETE /api/_auth/session revokes the session it clears.
export default defineNitroPlugin(() => {
  sessionHooks.hook('fetch', async (session, event) => {
    if (!session.user || !session.id || !(await isSessionRevoked(session.id))) return
    await clearUserSession(event)
    throw createError({ statusCode: 401, statusMessage: 'Your session has ended; sign in again' })
  })
  sessionHooks.hook('clear', async (data, event) => {
    const id = event.context.sessions?.['nuxt-session']?.id
    if (id && data.user) await revokeSession(id)
  })
})
