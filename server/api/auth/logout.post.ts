export default defineEventHandler(async (event) => {
  const session = await getUserSession(event)
  if (session.id && session.user) await revokeSession(session.id)
  await clearUserSession(event)
  return { ok: true }
})
