// Voyage alerts: a flag raised on the latest report of a voyage sends the company's shore users
// one e-mail through the durable outbox (outbox.ts), written in the same transaction as the report
// that raised it. The flag then stays raised, sending nothing more, until a later report clears it.
import type { Knex } from 'knex'
import type { SessionUser } from '#shared/types/auth'
import type { PlanDetail } from '#shared/types/plan'
import type { VoyageReport } from '#shared/types/voyage'
import { VOYAGE_FLAGS, type MonitoringThresholds, type VoyageFlag } from '#shared/utils/monitoring/workReport'
import { PLANNING_CAUTION } from '#shared/utils/cautions'
import { formatNumber, formatUtc } from '#shared/utils/format'
import { formatPosition } from '#shared/utils/position'

export const FLAG_LABELS: Record<VoyageFlag, string> = { 'off-track': 'Off track', 'late': 'Late', 'fuel': 'Fuel beyond plan' }

const side = (xt: number) => (xt >= 0 ? 'to starboard' : 'to port')
const hours = (h: number) => `${formatNumber(Math.abs(h))} h ${h >= 0 ? 'behind' : 'ahead of'} the schedule`

/** What each raised flag says about the report, in words the shore acts on. */
function flagLine(flag: VoyageFlag, r: VoyageReport, limits: MonitoringThresholds, plannedArrivalUtc: string): string {
  if (flag === 'off-track')
    return `Off track: ${formatNumber(Math.abs(r.crossTrackNm), 2)} nm ${side(r.crossTrackNm)} of leg ${r.legIndex + 1} (corridor ${formatNumber(r.xteLimitNm, 2)} nm)`
  if (flag === 'late')
    return `Late: ETA ${formatUtc(r.etaUtc ?? r.etaPlannedSpeedsUtc)} against the planned ${formatUtc(plannedArrivalUtc)} (threshold ${formatNumber(limits.lateH)} h); ${hours(r.delayH)}`
  return `Fuel beyond plan: ${formatNumber(r.fuelUsedT ?? 0)} t used against ${formatNumber(r.fuelPlannedT ?? 0)} t planned for the distance sailed (threshold ${formatNumber(limits.fuelPct)} %)`
}

const escapeHtml = (s: string) => s.replace(/&/g, '&amp;').replace(/</g, '&lt;').replace(/>/g, '&gt;').replace(/"/g, '&quot;').replace(/'/g, '&#39;')

export function composeVoyageAlert(plan: Pick<PlanDetail, 'title' | 'vesselName'>, plannedArrivalUtc: string, r: VoyageReport, raised: readonly VoyageFlag[], limits: MonitoringThresholds) {
  const subject = `${raised.map(f => FLAG_LABELS[f]).join(', ')}: ${plan.vesselName}, ${plan.title}`.slice(0, 300)
  const lines = [
    `${plan.vesselName} — ${plan.title}`,
    `Report of ${formatUtc(r.timeUtc)} at ${formatPosition(r, 1)} (by ${r.createdByName})`,
    '',
    ...raised.map(f => flagLine(f, r, limits, plannedArrivalUtc)),
    '',
    `Along the plan ${formatNumber(r.alongTrackNm)} nm, to go ${formatNumber(r.distanceToGoNm)} nm; speed made good ${r.speedMadeGoodKn == null ? '—' : `${formatNumber(r.speedMadeGoodKn)} kn`}`,
    `ETA ${r.etaUtc ? formatUtc(r.etaUtc) : '— (no way made along the plan)'}; at planned speeds ${formatUtc(r.etaPlannedSpeedsUtc)}; planned arrival ${formatUtc(plannedArrivalUtc)}`,
    '',
    'Each flag is sent once and not again until a later report clears it.',
    PLANNING_CAUTION,
  ]
  const text = `${lines.join('\n')}\n`
  const html = `<!doctype html><html><body style="font-family:sans-serif">${lines.map(l => (l ? `<p style="margin:0 0 4px">${escapeHtml(l)}</p>` : '<br>')).join('')}</body></html>`
  return { subject, text, html }
}

interface AlertRow { flag: VoyageFlag, active: boolean }

/**
 * Brings the plan's raised flags in line with its latest report (none: every flag clears) and writes
 * one alert for the flags newly raised. Returns the outbox ids to enqueue once the transaction commits.
 * Runs under the plan's row lock (the caller holds it), so two reports cannot both raise a flag.
 */
export async function syncAlerts(trx: Knex.Transaction, user: SessionUser, plan: PlanDetail, plannedArrivalUtc: string, latest: VoyageReport | undefined, limits: MonitoringThresholds): Promise<number[]> {
  const flags = latest?.flags ?? []
  const rows: AlertRow[] = await trx('voyage_alerts').where({ plan_id: plan.id }).select('flag', 'active')
  const active = new Set(rows.filter(r => r.active).map(r => r.flag))
  const raised = VOYAGE_FLAGS.filter(f => flags.includes(f) && !active.has(f))
  const cleared = VOYAGE_FLAGS.filter(f => !flags.includes(f) && active.has(f))
  if (cleared.length)
    await trx('voyage_alerts').where({ plan_id: plan.id }).whereIn('flag', cleared).update({ active: false, cleared_at: trx.fn.now() })
  if (!raised.length || !latest) return []
  const recipients = await trx('users').where({ company_id: plan.companyId, role: 'shore' }).orderBy('id').select('name', 'email')
  let outboxId: number | null = null
  if (recipients.length) {
    const mailFrom = (await getCompanySettings(plan.companyId)).mailFrom ?? useRuntimeConfig().mailFrom
    const mail = composeVoyageAlert(plan, plannedArrivalUtc, latest, raised, limits)
    outboxId = (await insertOutboxMessage(trx, { companyId: plan.companyId, planId: plan.id, queuedBy: user.id, recipients, mailFrom, kind: 'voyage_alert', ...mail })).id
  }
  for (const flag of raised) {
    await trx('voyage_alerts').insert({ plan_id: plan.id, flag, active: true, report_id: latest.id, outbox_message_id: outboxId, raised_at: trx.fn.now(), cleared_at: null })
      .onConflict(['plan_id', 'flag']).merge({ active: true, report_id: latest.id, outbox_message_id: outboxId, raised_at: trx.fn.now(), cleared_at: null, times_raised: trx.raw('voyage_alerts.times_raised + 1') })
  }
  return outboxId ? [outboxId] : []
}
