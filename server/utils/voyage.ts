// Voyage monitoring (issue 14): position reports on an approved plan, each worked out against the
// plan's stored legs (shared/utils/monitoring). Scope: everyone in the plan's company reads (another
// company's plan is 404); the planner or the vessel's master adds reports; the master deletes them.
import type { Knex } from 'knex'
import type { SessionUser } from '#shared/types/auth'
import type { PlanDetail } from '#shared/types/plan'
import type { PlanView } from '#shared/types/planView'
import type { Report, ReportSource, Voyage, VoyageReport, VoyageTrack } from '#shared/types/voyage'
import { thinTrack } from '#shared/utils/monitoring/trackLog'
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

/** Points a voyage sends for drawing its imported tracks, all logs together. */
const TRACK_POINTS_FOR_CHART = 4000

async function loadTracks(planId: number): Promise<VoyageTrack[]> {
  const rows = await useDb()('voyage_tracks').where({ plan_id: planId }).orderBy('first_utc').select('id', 'format', 'point_count', 'first_utc', 'last_utc', 'points_json')
  const total = rows.reduce((n, r) => n + r.point_count, 0)
  return rows.map(r => ({
    id: r.id, format: r.format, pointCount: r.point_count, firstUtc: new Date(r.first_utc).toISOString(), lastUtc: new Date(r.last_utc).toISOString(),
    points: thinTrack(JSON.parse(r.points_json) as [number, number, number][], Math.max(2, Math.round(TRACK_POINTS_FOR_CHART * r.point_count / total))),
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
  const tracks = await loadTracks(planId)
  const { plan, totals } = view
  return {
    planId, title: plan.title, vesselId: plan.vesselId, vesselName: plan.vesselName, status: plan.status,
    departureUtc: plan.departureUtc, plannedArrivalUtc: totals.etaUtc, totalNm: totals.distanceNm, thresholds, reports, tracks,
    legs: view.legs.map(l => ({ index: l.index, from: l.from, to: l.to, toName: l.toName, method: l.method, distanceNm: l.distanceNm, cumulativeNm: l.cumulativeNm, speedKn: l.speedKn, hours: l.hours, etaUtc: l.etaUtc, xteNm: l.xteNm })),
    canReport: plan.status === 'approved' && canReportOn(user, plan), canDelete: canDeleteOn(user, plan),
  }
}

/** GET /api/plans/:id/reports */
export async function listReports(user: SessionUser, planId: number): Promise<VoyageReport[]> {
  return (await getVoyage(user, planId)).reports
}

/** 404, 403 and 409 as a write would answer them; the plan and the time of its latest report. */
export async function assertCanReport(user: SessionUser, planId: number) {
  const plan = await findPlan(user, planId)
  if (!canReportOn(user, plan)) throw createError({ statusCode: 403, statusMessage: `Only a planner or the master of ${plan.vesselName} may report on this voyage` })
  assertApproved(plan)
  const last = await useDb()('voyage_reports').where({ plan_id: planId }).max({ t: 'time_utc' }).first()
  return { plan, latestMs: last?.t ? new Date(last.t).getTime() : null }
}

/** The plan, its schedule and thresholds, read once for a write. */
async function voyageContext(user: SessionUser, planId: number) {
  const view = await getPlanView(user, planId)
  return { view, plan: voyagePlanOf(view), limits: await monitoringThresholds(user.companyId) }
}
type VoyageContext = Awaited<ReturnType<typeof voyageContext>>

/** Works out the voyage inside the write's transaction and brings its raised flags in line with the latest report. */
async function reworkAndAlert(trx: Knex.Transaction, user: SessionUser, plan: PlanDetail, ctx: VoyageContext) {
  const reports = workVoyage(ctx.plan, await reportRows(plan.id, trx), ctx.limits)
  const outboxIds = await syncAlerts(trx, user, plan, ctx.view.totals.etaUtc, reports.at(-1), ctx.limits)
  return { reports, outboxIds }
}

/** Locks the plan row: writes to one voyage are checked and worked out one after another. */
async function lockPlan(trx: Knex.Transaction, user: SessionUser, planId: number) {
  await trx('plans').where({ id: planId, company_id: user.companyId }).forUpdate().first('id')
  return findPlan(user, planId, trx)
}

export interface NewReport extends Report { source?: ReportSource }

/**
 * Adds reports in one transaction: 404 outside the company, 403 unless the planner or the vessel's master,
 * 409 unless approved, 400 on `timeUtc` before departure, not after the report before it, or in the future.
 * Returns every report of the voyage worked out, and the ids of the new ones.
 */
export async function addReports(user: SessionUser, planId: number, inputs: readonly NewReport[], alsoInTransaction?: (trx: Knex.Transaction) => Promise<void>) {
  const ctx = await voyageContext(user, planId)
  const result = await useDb().transaction(async (trx) => {
    const plan = await lockPlan(trx, user, planId)
    if (!canReportOn(user, plan)) throw createError({ statusCode: 403, statusMessage: `Only a planner or the master of ${plan.vesselName} may report on this voyage` })
    assertApproved(plan)
    const last = await trx('voyage_reports').where({ plan_id: planId }).max({ t: 'time_utc' }).first()
    let previous = last?.t ? new Date(last.t).getTime() : null
    const departure = Date.parse(plan.departureUtc)
    const rows = inputs.map((input) => {
      const t = Date.parse(input.timeUtc)
      if (t < departure) throw createError({ statusCode: 400, statusMessage: `timeUtc: must not be before the plan's departure (${plan.departureUtc})` })
      if (t > Date.now() + CLOCK_SKEW_MS) throw createError({ statusCode: 400, statusMessage: 'timeUtc: must not be in the future' })
      if (previous !== null && t <= previous)
        throw createError({ statusCode: 400, statusMessage: `timeUtc: must be after the latest report (${new Date(previous).toISOString()})` })
      previous = t
      return {
        plan_id: planId, time_utc: new Date(t), lat: input.lat, lon: input.lon, fuel_rob_t: input.fuelRobT ?? null, speed_kn: input.speedKn ?? null,
        remarks: input.remarks ?? null, source: input.source ?? 'manual', created_by: user.id, created_by_name: user.name,
      }
    })
    const ids: number[] = []
    for (let i = 0; i < rows.length; i += 1000)
      ids.push(...(await trx('voyage_reports').insert(rows.slice(i, i + 1000)).returning('id')).map((r: { id: number }) => r.id))
    if (alsoInTransaction) await alsoInTransaction(trx)
    return { ids, ...(await reworkAndAlert(trx, user, plan, ctx)) }
  })
  for (const id of result.outboxIds) await enqueueCommitted(id)
  return result
}

/** POST /api/plans/:id/reports: the new report worked out against the plan. */
export async function addReport(user: SessionUser, planId: number, input: Report): Promise<VoyageReport> {
  const { ids, reports } = await addReports(user, planId, [input])
  return reports.find(r => r.id === ids[0])!
}

/** DELETE /api/plans/:id/reports/:reportId: the vessel's master only, recorded in the plan's history. */
export async function deleteReport(user: SessionUser, planId: number, reportId: number) {
  const ctx = await voyageContext(user, planId)
  const { outboxIds } = await useDb().transaction(async (trx) => {
    const plan = await lockPlan(trx, user, planId)
    if (!canDeleteOn(user, plan)) throw createError({ statusCode: 403, statusMessage: `Only the master of ${plan.vesselName} may delete a position report` })
    const row = await trx('voyage_reports').where({ id: reportId, plan_id: planId }).first('time_utc', 'lat', 'lon')
    if (!row) notFound('Report')
    await trx('voyage_reports').where({ id: reportId }).delete()
    const at = `${new Date(row.time_utc).toISOString().slice(0, 16)}Z ${formatPosition({ lat: row.lat, lon: row.lon })}`
    await recordEvent(trx, planId, user, 'report-deleted', plan.status, plan.status, `Position report of ${at} deleted`)
    return reworkAndAlert(trx, user, plan, ctx)
  })
  for (const id of outboxIds) await enqueueCommitted(id)
}
