// Sign-off (capability 6): each step is one transaction that checks, in order, company scope
// (404), the vessel's master (403) and the state (409), moves the plan, bumps its version and
// writes the event. The role check (403) is done by the route before any of this.
import type { Knex } from 'knex'
import type { SessionUser } from '#shared/types/auth'
import type { PlanDetail, PlanStatus } from '#shared/types/plan'
import { SIGNOFF_STEPS, type SignoffStep } from '#shared/utils/signoffRules'

interface StepOptions { remarks?: string | null, version?: number }

function assertVesselMaster(user: SessionUser, plan: PlanDetail) {
  if (plan.masterUserId !== user.id)
    throw createError({ statusCode: 403, statusMessage: `Only the master of ${plan.vesselName} may sign off this plan` })
}

function assertState(plan: PlanDetail, allowed: readonly PlanStatus[], action: string) {
  if (!allowed.includes(plan.status))
    throw createError({ statusCode: 409, statusMessage: `This plan is ${plan.status}; it cannot be ${action}`, data: { status: plan.status } })
}

function assertSeenVersion(plan: PlanDetail, version: number | undefined) {
  if (version !== undefined && version !== plan.version)
    throw createError({ statusCode: 409, statusMessage: 'The plan was changed by someone else since you loaded it', data: { currentVersion: plan.version } })
}

/** Moves the plan only if nobody moved it first (status and version as read), so two clicks cannot both win. */
async function moveStatus(trx: Knex.Transaction, plan: PlanDetail, to: PlanStatus, extra: Record<string, unknown> = {}) {
  const updated = await trx('plans').where({ id: plan.id, status: plan.status, version: plan.version })
    .update({ status: to, version: plan.version + 1, updated_at: trx.fn.now(), ...extra })
  if (updated === 0) throw createError({ statusCode: 409, statusMessage: 'The plan was changed by someone else at the same moment; reload it' })
}

const PAST: Record<SignoffStep, string> = { submit: 'submitted', approve: 'approved', return: 'returned' }

async function takeStep(user: SessionUser, id: number, step: SignoffStep, options: StepOptions) {
  const rule = SIGNOFF_STEPS[step]
  await useDb().transaction(async (trx) => {
    const plan = await findPlan(user, id, trx)
    if (rule.vesselMasterOnly) assertVesselMaster(user, plan)
    assertState(plan, rule.from, PAST[step])
    assertSeenVersion(plan, options.version)
    if (step === 'submit') await assertSubmittable(trx, plan)
    const extra = step === 'approve' ? { approved_by: user.id, approved_at: trx.fn.now() } : {}
    await moveStatus(trx, plan, rule.to, extra)
    await recordEvent(trx, id, user, PAST[step], plan.status, rule.to, options.remarks ?? null)
  })
  return getPlanView(user, id)
}

async function assertSubmittable(trx: Knex.Transaction, plan: PlanDetail) {
  const { count } = (await trx('waypoints').where({ plan_id: plan.id }).count({ count: '*' }).first()) as { count: string }
  if (Number(count) < 2)
    throw createError({ statusCode: 409, statusMessage: 'A plan needs at least two waypoints before it can be submitted' })
}

export const submitPlan = (user: SessionUser, id: number, version?: number) => takeStep(user, id, 'submit', { version })
export const approvePlan = (user: SessionUser, id: number, version?: number) => takeStep(user, id, 'approve', { version })
export const returnPlan = (user: SessionUser, id: number, remarks: string, version?: number) => takeStep(user, id, 'return', { remarks, version })

const COPIED_COLUMNS = ['company_id', 'vessel_id', 'title', 'departure_utc', 'speed_kn', 'limit_lat', 'departure_place_id', 'arrival_place_id', 'total_nm', 'arrival_utc']
const WAYPOINT_COLUMNS = ['seq', 'name', 'lat', 'lon', 'method', 'speed_kn', 'xte_nm', 'turn_radius_nm', 'notes']

/**
 * Starts a revision: the approved plan is copied, waypoints and all, into a new draft with the next
 * revision number; the approved one stays as it is (frozen, readable). One open revision at a time.
 */
export async function startRevision(user: SessionUser, id: number) {
  const newId = await useDb().transaction(async (trx) => {
    const plan = await findPlan(user, id, trx)
    assertState(plan, ['approved'], 'revised (only an approved plan starts a revision)')
    await trx('plans').where({ id }).forUpdate().first('id')
    const open = await trx('plans').where({ revision_of_plan_id: id }).whereNot({ status: 'approved' }).first('id')
    if (open) throw createError({ statusCode: 409, statusMessage: `A revision of this plan is already in progress (plan ${open.id})`, data: { planId: open.id } })
    const source = await trx('plans').where({ id }).first(COPIED_COLUMNS)
    const [row] = await trx('plans').insert({ ...source, status: 'draft', revision: plan.revision + 1, revision_of_plan_id: id, created_by: user.id }).returning('id')
    await trx.raw(`insert into waypoints (plan_id, ${WAYPOINT_COLUMNS.join(', ')}) select ?, ${WAYPOINT_COLUMNS.join(', ')} from waypoints where plan_id = ?`, [row.id, id])
    await recordEvent(trx, row.id, user, 'revision_started', null, 'draft', `Revision ${plan.revision + 1} of plan ${id} (revision ${plan.revision})`)
    await trx('plans').where({ id }).update({ version: plan.version + 1 })
    await recordEvent(trx, id, user, 'revised', null, null, `Revision ${plan.revision + 1} started as plan ${row.id}`)
    return row.id as number
  })
  return getPlanView(user, newId)
}

/** A remark on any plan of the company. It changes nothing in the plan, so its version stays (no one's edit is refused for it). */
export async function addRemark(user: SessionUser, id: number, remarks: string) {
  const plan = await findPlan(user, id)
  await recordEvent(useDb(), plan.id, user, 'remark', null, null, remarks)
  return { events: await listEvents(id) }
}
