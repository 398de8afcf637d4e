import type { H3Event } from 'h3'
import type { SessionUser } from '#shared/types/auth'
import type { RoleSet } from '#shared/utils/roles'

/** Session first, then role: 401 without a session, 403 for a role not in `allowed`. */
export async function requireRole(event: H3Event, allowed: RoleSet): Promise<SessionUser> {
  const { user } = await requireUserSession(event)
  if (!allowed.includes(user.role)) throw createError({ statusCode: 403, statusMessage: `Your role (${user.role}) may not do this` })
  return user
}

/**
 * A route whose first line is the session and role check: `defineRoleHandler(EDITORS, async (event, user) => …)`.
 * The role sets live in `shared/utils/roles.ts`; company and vessel scope stay in the services.
 */
export function defineRoleHandler<T>(allowed: RoleSet, handler: (event: H3Event, user: SessionUser) => T | Promise<T>) {
  return defineEventHandler(async (event): Promise<T> => handler(event, await requireRole(event, allowed)))
}

export function notFound(what: string): never {
  throw createError({ statusCode: 404, statusMessage: `${what} not found` })
}
