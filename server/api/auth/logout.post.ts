// Clearing the session revokes its id (server/plugins/sessionRevocation.ts), so a copied cookie stops working everywhere.
export default defineEventHandler(async (event) => {
  await clearUserSession(event)
  return { ok: true }
})
