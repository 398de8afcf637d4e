import type { H3Event } from 'h3'
import type { Role, SessionUser } from '#shared/types/auth'

/** Session first, then role: 401 without a session, 403 for a role not in `allowed`. */
export async function requireRole(event: H3Event, allowed: readonly Role[]): Promise<SessionUser> {
  const { user } = await requireUserSession(event)
  if (!allowed.includes(user.role)) throw createError({ statusCode: 403, statusMessage: `Your role (${user.role}) may not do this` })
  return user
}

export const EDITORS = ['planner', 'master'] as const satisfies readonly Role[]
export const ALL_ROLES = ['planner', 'master', 'shore', 'admin'] as const satisfies readonly Role[]

export function notFound(what: string): never {
  throw createError({ statusCode: 404, statusMessage: `${what} not found` })
}
