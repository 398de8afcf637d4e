// Voyage monitoring (issue 14): position reports on an approved plan, each worked out against the
// plan's stored legs (shared/utils/monitoring). Scope: everyone in the plan's company reads (another
// company's plan is 404); the planner or the vessel's master adds reports; the master deletes them.
import type { Knex } from 'knex'
import type { SessionUser } from '#shared/types/auth'
import type { PlanDetail } from '#shared/types/plan'
import type { PlanView } from '#shared/types/planView'
import type { Report, ReportSource, Voyage, VoyageReport } from '#shared/types/voyage'
import { workReports, type MonitoringThresholds, type VoyagePlan } from '#shared/utils/monitoring/workReport'

/** Defaults for the company settings `monitoring.*` (common practice: a 5 nm corridor, half a day late, 10 % fuel). */
export const MONITORING_DEFAULTS: MonitoringThresholds = { defaultXteNm: 5, lateH: 12, fuelPct: 10 }
/** A report may be stamped this far ahead of the server's clock (clocks on board drift). */
const CLOCK_SKEW_MS = 5 * 60_000

export async function monitoringThresholds(companyId: number): Promise<MonitoringThresholds> {
  const { monitoring } = await getCompanySettings(companyId)
  return { ...MONITORING_DEFAULTS, ...Object.fromEntries(Object.entries(monitoring ?? {}).filter(([, v]) => v != null)) }
}

interface ReportRow {
  id: number, time_utc: Date, lat: number, lon: number, fuel_rob_t: string | null, speed_kn: string | null,
  remarks: string | null, source: ReportSource, created_by_name: string
}

const num = (v: string | null) => (v == null ? null : Number(v))

export function voyagePlanOf(view: PlanView): VoyagePlan {
  return { departureUtc: view.plan.departureUtc, legs: view.legs, fuelCurve: view.fuel?.curve ?? null }
}

async function reportRows(planId: number, db: Knex | Knex.Transaction = useDb()): Promise<ReportRow[]> {
  return db('voyage_reports').where({ plan_id: planId }).orderBy('time_utc')
    .select('id', 'time_utc', 'lat', 'lon', 'fuel_rob_t', 'speed_kn', 'remarks', 'source', 'created_by_name')
}

/** Every report of the plan worked out against it, in time order. */
export function workVoyage(plan: VoyagePlan, rows: readonly ReportRow[], limits: MonitoringThresholds): VoyageReport[] {
  const fixes = rows.map(r => ({ timeUtc: r.time_utc.toISOString(), lat: r.lat, lon: r.lon, fuelRobT: num(r.fuel_rob_t) }))
  const worked = workReports(plan, fixes, limits)
  return rows.map((r, i) => ({
    id: r.id, timeUtc: fixes[i]!.timeUtc, lat: r.lat, lon: r.lon, fuelRobT: num(r.fuel_rob_t), speedKn: num(r.speed_kn),
    remarks: r.remarks, source: r.source, createdByName: r.created_by_name, ...worked[i]!,
  }))
}

const canReportOn = (user: SessionUser, plan: PlanDetail) => user.role === 'planner' || (user.role === 'master' && plan.masterUserId === user.id)
const canDeleteOn = (user: SessionUser, plan: PlanDetail) => user.role === 'master' && plan.masterUserId === user.id

function assertApproved(plan: PlanDetail) {
  if (plan.status !== 'approved')
    throw createError({ statusCode: 409, statusMessage: `This plan is ${plan.status}; position reports go on an approved plan`, data: { status: plan.status } })
}

/** GET /api/plans/:id/voyage */
export async function getVoyage(user: SessionUser, planId: number): Promise<Voyage> {
  const view = await getPlanView(user, planId)
  const thresholds = await monitoringThresholds(user.companyId)
  const reports = workVoyage(voyagePlanOf(view), await reportRows(planId), thresholds)
  const { plan, totals } = view
  return {
    planId, title: plan.title, vesselId: plan.vesselId, vesselName: plan.vesselName, status: plan.status,
    departureUtc: plan.departureUtc, plannedArrivalUtc: totals.etaUtc, totalNm: totals.distanceNm, thresholds, reports,
    canReport: plan.status === 'approved' && canReportOn(user, plan), canDelete: canDeleteOn(user, plan),
  }
}

/** GET /api/plans/:id/reports */
export async function listReports(user: SessionUser, planId: number): Promise<VoyageReport[]> {
  return (await getVoyage(user, planId)).reports
}

/**
 * POST /api/plans/:id/reports: 404 outside the company, 403 unless the planner or the vessel's master,
 * 409 unless approved, 400 on `timeUtc` before departure, not after the previous report, or in the future.
 * The plan row is locked so two reports at once are checked against each other.
 */
export async function addReport(user: SessionUser, planId: number, input: Report, source: ReportSource = 'manual'): Promise<VoyageReport> {
  const id = await useDb().transaction(async (trx) => {
    const plan = await findPlan(user, planId, trx)
    if (!canReportOn(user, plan)) throw createError({ statusCode: 403, statusMessage: `Only a planner or the master of ${plan.vesselName} may report on this voyage` })
    assertApproved(plan)
    await trx('plans').where({ id: planId }).forUpdate().first('id')
    const t = Date.parse(input.timeUtc)
    if (t < Date.parse(plan.departureUtc)) throw createError({ statusCode: 400, statusMessage: `timeUtc: must not be before the plan's departure (${plan.departureUtc})` })
    if (t > Date.now() + CLOCK_SKEW_MS) throw createError({ statusCode: 400, statusMessage: 'timeUtc: must not be in the future' })
    const last = await trx('voyage_reports').where({ plan_id: planId }).max({ t: 'time_utc' }).first()
    if (last?.t && t <= new Date(last.t).getTime())
      throw createError({ statusCode: 400, statusMessage: `timeUtc: must be after the latest report (${new Date(last.t).toISOString()})` })
    const [row] = await trx('voyage_reports').insert({
      plan_id: planId, time_utc: new Date(t), lat: input.lat, lon: input.lon, fuel_rob_t: input.fuelRobT ?? null, speed_kn: input.speedKn ?? null,
      remarks: input.remarks ?? null, source, created_by: user.id, created_by_name: user.name,
    }).returning('id')
    return row.id as number
  })
  const voyage = await getVoyage(user, planId)
  return voyage.reports.find(r => r.id === id)!
}

/** DELETE /api/plans/:id/reports/:reportId: the vessel's master only, recorded in the plan's history. */
export async function deleteReport(user: SessionUser, planId: number, reportId: number) {
  await useDb().transaction(async (trx) => {
    const plan = await findPlan(user, planId, trx)
    if (!canDeleteOn(user, plan)) throw createError({ statusCode: 403, statusMessage: `Only the master of ${plan.vesselName} may delete a position report` })
    const row = await trx('voyage_reports').where({ id: reportId, plan_id: planId }).first('time_utc', 'lat', 'lon')
    if (!row) notFound('Report')
    await trx('voyage_reports').where({ id: reportId }).delete()
    const at = `${new Date(row.time_utc).toISOString().slice(0, 16)}Z ${formatPosition({ lat: row.lat, lon: row.lon })}`
    await recordEvent(trx, planId, user, 'report-deleted', plan.status, plan.status, `Position report of ${at} deleted`)
  })
}
