import { loginSchema } from '#shared/types/auth'

const GENERIC = 'E-mail or password is not correct'

export default defineEventHandler(async (event) => {
  const { email, password } = await readValidatedBody(event, loginSchema.parse)
  await assertLoginAllowed(event, email)
  const row = await findUserForLogin(email)
  const ok = row ? await verifyPassword(row.password_hash, password) : await verifyPassword(DUMMY_HASH, password).then(() => false)
  // The attempt was counted by assertLoginAllowed; a failure keeps the count.
  if (!row || !ok) throw createError({ statusCode: 401, statusMessage: GENERIC })
  await recordLoginSuccess(event, email)
  const user = toSessionUser(row)
  await replaceUserSession(event, { user, loggedInAt: Date.now() })
  return { user }
})
