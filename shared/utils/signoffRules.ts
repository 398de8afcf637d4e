// The sign-off state machine (capability 6), shared so the server enforces and the workspace
// offers exactly the same steps: draft → submitted → approved, or submitted → returned → draft.
import type { Role } from '../types/auth'
import type { PlanStatus } from '../types/plan'
import { BRIEF_SENDERS, EDITORS, REMARKERS, SIGNERS, type RoleSet } from './roles'

export type SignoffStep = 'submit' | 'approve' | 'return'
export type PlanAction = SignoffStep | 'revise' | 'brief' | 'remark'

interface StepRule { from: readonly PlanStatus[], to: PlanStatus, roles: RoleSet, vesselMasterOnly: boolean }

export const SIGNOFF_STEPS: Record<SignoffStep, StepRule> = {
  submit: { from: ['draft', 'returned'], to: 'submitted', roles: EDITORS, vesselMasterOnly: false },
  approve: { from: ['submitted'], to: 'approved', roles: SIGNERS, vesselMasterOnly: true },
  return: { from: ['submitted'], to: 'returned', roles: SIGNERS, vesselMasterOnly: true },
}

/** Who may start a revision of an approved plan, send the crew brief, add a remark. */
export const REVISE_ROLES: RoleSet = EDITORS
export const BRIEF_ROLES: RoleSet = BRIEF_SENDERS
export const REMARK_ROLES: RoleSet = REMARKERS

export const REMARKS_MAX = 2000

/** The actions this user may take on a plan in its current state (what the workspace shows). */
export function allowedPlanActions(plan: { status: PlanStatus, masterUserId: number | null }, user: { id: number, role: Role }): PlanAction[] {
  const actions: PlanAction[] = []
  for (const [step, rule] of Object.entries(SIGNOFF_STEPS) as [SignoffStep, StepRule][]) {
    if (!rule.roles.includes(user.role) || !rule.from.includes(plan.status)) continue
    if (rule.vesselMasterOnly && plan.masterUserId !== user.id) continue
    actions.push(step)
  }
  if (plan.status === 'approved' && REVISE_ROLES.includes(user.role)) actions.push('revise')
  // The crew get the plan they will sail: the workspace offers the brief once the master has approved it.
  if (plan.status === 'approved' && BRIEF_ROLES.includes(user.role)) actions.push('brief')
  if (REMARK_ROLES.includes(user.role)) actions.push('remark')
  return actions
}
