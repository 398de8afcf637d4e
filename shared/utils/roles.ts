// Who may do what (product brief, "People and roles"): the role sets the server checks and the
// abilities the pages ask, in one place. Pages never compare role strings themselves.
import { roles, type Role } from '../types/auth'

export type RoleSet = readonly Role[]

/** Every signed-in user: reading plans, places, vessels, tables; the solver and land check. */
export const ALL_ROLES = roles satisfies RoleSet
/** Plan editors: create, edit, import and submit plans; start a revision. */
export const EDITORS = ['planner', 'master'] as const satisfies RoleSet
/** Approve or return a submitted plan (and only for the vessel the master commands). */
export const SIGNERS = ['master'] as const satisfies RoleSet
/** The shore desk: the place library, vessels' fuel data and distance tables. */
export const SHORE_DESK = ['shore', 'admin'] as const satisfies RoleSet
/** Users, vessel particulars, crew lists and company settings. */
export const ADMIN_ONLY = ['admin'] as const satisfies RoleSet
/** Send the crew brief of a plan. */
export const BRIEF_SENDERS = ['planner', 'master', 'shore'] as const satisfies RoleSet
/** Add a remark to a plan's history. */
export const REMARKERS = ALL_ROLES
/** Upload, change and delete zones (ECAs, no-go, risk and own areas). */
export const ZONE_KEEPERS = SHORE_DESK
/** Build, rebuild and delete distance tables. */
export const TABLE_BUILDERS = SHORE_DESK

/** The parts of a user the abilities read; the session user and `null` (signed out) both fit. */
type Someone = { role: Role } | null | undefined

export function hasRole(user: Someone, set: RoleSet): boolean {
  return !!user && set.includes(user.role)
}

export const canEditPlan = (user: Someone) => hasRole(user, EDITORS)
export const canSignPlan = (user: Someone) => hasRole(user, SIGNERS)
export const canSendBrief = (user: Someone) => hasRole(user, BRIEF_SENDERS)
export const canEditPlaces = (user: Someone) => hasRole(user, SHORE_DESK)
export const canEditFuel = (user: Someone) => hasRole(user, SHORE_DESK)
export const canBuildTables = (user: Someone) => hasRole(user, TABLE_BUILDERS)
export const canAdminister = (user: Someone) => hasRole(user, ADMIN_ONLY)
export const canEditZones = (user: Someone) => hasRole(user, ZONE_KEEPERS)
