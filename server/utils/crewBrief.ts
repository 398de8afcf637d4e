// The crew brief (capability 7): a plan summary for the vessel's crew list, as plain text and
// HTML from the same rows. Approval is stated first and prominently; a plan not yet approved says so.
import type { SessionUser } from '#shared/types/auth'
import type { PlanView } from '#shared/types/planView'
import type { PlanLeg } from '#shared/utils/legTable'
import { ALL_CAUTIONS } from '#shared/utils/cautions'
import { formatDuration, formatLegCourse, formatNumber, formatPlaceTime, formatUtc } from '#shared/utils/format'
import { formatZoneDescription, zoneTime } from '#shared/utils/manoeuvre'
import { formatLimitLatitude, formatPosition } from '#shared/utils/position'
import type { LegZoneDistance } from '#shared/utils/zones/types'

export interface BriefVessel { name: string, imoNumber: string, callSign: string }
export interface CrewBrief { subject: string, text: string, html: string }

const LEG_HEADERS = ['Leg', 'To', 'Position', 'Sailing', 'Course °T', 'Dist nm', 'Speed kn', 'Time', 'ETA UTC', 'ETA ship\'s zone time', 'In zones nm']
const KIND_SHORT = { 'eca': 'ECA', 'no-go': 'NO-GO', 'risk': 'risk', 'custom': 'own' } as const

function legCells(leg: PlanLeg & { zones?: LegZoneDistance[] }): string[] {
  const zone = `${zoneTime(leg.etaUtc, leg.zoneDescription)} (ZD ${formatZoneDescription(leg.zoneDescription)})`
  return [String(leg.index + 1), leg.toName || `WP ${leg.index + 2}`, formatPosition(leg.to, 1), leg.method === 'geodesic' ? 'geodesic' : 'rhumb line',
    formatLegCourse(leg), formatNumber(leg.distanceNm), formatNumber(leg.speedKn), formatDuration(leg.hours), formatUtc(leg.etaUtc), zone,
    leg.zones?.length ? leg.zones.map(z => `${KIND_SHORT[z.kind]} ${formatNumber(z.distanceNm)}`).join(', ') : '—']
}

const local = (iso: string, zone: string | null) => (zone ? formatPlaceTime(iso, zone) : 'local time not known (no time zone for this place)')

function approvalLine(plan: PlanView['plan']): { approved: boolean, line: string } {
  if (plan.status === 'approved' && plan.approvedAt)
    return { approved: true, line: `APPROVED by ${plan.approvedByName ?? 'the master'} on ${formatUtc(plan.approvedAt)} (revision ${plan.revision})` }
  return { approved: false, line: `NOT YET APPROVED: this plan is ${plan.status} (revision ${plan.revision}). Do not navigate by it until the master has approved it.` }
}

/** Distance inside the company's zones, and the no-go and risk areas the track enters, said plainly. */
function zoneFacts(view: PlanView): [string, string][] {
  const zones = view.totals.zones?.byZone ?? []
  const list = (kind: string) => zones.filter(z => z.kind === kind).map(z => `${z.name} ${formatNumber(z.distanceNm)} nm`).join('; ')
  return [
    ...(zones.some(z => z.kind === 'no-go') ? [['NO-GO AREA', `the track enters ${list('no-go')}`] as [string, string]] : []),
    ...(zones.some(z => z.kind === 'risk') ? [['Risk area', `the track enters ${list('risk')}`] as [string, string]] : []),
    ['Inside ECAs', zones.some(z => z.kind === 'eca') ? list('eca') : 'none'],
  ]
}

/** The facts of the brief, in reading order, shared by the text and the HTML. */
function briefFacts(view: PlanView, vessel: BriefVessel) {
  const { plan, waypoints, totals } = view
  const first = waypoints[0]?.name || 'departure'
  const last = waypoints.at(-1)?.name || 'arrival'
  return [
    ['Vessel', `${vessel.name} (IMO ${vessel.imoNumber}, call sign ${vessel.callSign})`],
    ['Voyage', `${plan.title}, revision ${plan.revision}`],
    ['Departure', `${first}: ${formatUtc(plan.departureUtc)}; ${local(plan.departureUtc, plan.departureTimeZone)}`],
    ['Arrival', `${last}: ETA ${formatUtc(totals.etaUtc)}; ${local(totals.etaUtc, plan.arrivalTimeZone)}`],
    ['Total distance', `${formatNumber(totals.distanceNm)} nm in ${view.legs.length} legs (saving over rhumb lines ${formatNumber(totals.savingNm)} nm)`],
    ['Time on passage', `${formatDuration(totals.hours)} at a planned ${formatNumber(plan.speedKn)} kn`],
    ...(plan.limitLat ? [['Limiting latitude', `${formatLimitLatitude(plan.limitLat)} (north and south)`]] : []),
    ...zoneFacts(view),
  ] as [string, string][]
}

export function composeCrewBrief(view: PlanView, vessel: BriefVessel): CrewBrief {
  const approval = approvalLine(view.plan)
  const subject = `Passage plan ${view.plan.title} – ${vessel.name} – rev ${view.plan.revision} – ${approval.approved ? 'approved' : 'NOT YET APPROVED'}`
  const facts = briefFacts(view, vessel)
  const rows = view.legs.map(legCells)
  return { subject, text: briefText(approval.line, facts, rows), html: briefHtml(approval, facts, rows, subject) }
}

function briefText(approval: string, facts: [string, string][], rows: string[][]) {
  const widths = LEG_HEADERS.map((h, i) => Math.max(h.length, ...rows.map(r => r[i]!.length)))
  const line = (cells: string[]) => cells.map((c, i) => c.padEnd(widths[i]!)).join('  ').trimEnd()
  return [
    `*** ${approval} ***`, '',
    ...facts.map(([k, v]) => `${`${k}:`.padEnd(20)}${v}`), '',
    'Legs', line(LEG_HEADERS), widths.map(w => '-'.repeat(w)).join('  '), ...rows.map(line), '',
    'Cautions', ...ALL_CAUTIONS.map(c => `- ${c}`), '',
    'Sent by Passagewright from the plan as it stood when the brief was queued.',
  ].join('\n')
}

const escapeHtml = (s: string) => s.replace(/[&<>"']/g, ch => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', '\'': '&#39;' })[ch]!)

function briefHtml(approval: { approved: boolean, line: string }, facts: [string, string][], rows: string[][], subject: string) {
  const banner = approval.approved
    ? `<p style="padding:8px 12px;border:2px solid #1f5f3f;background:#e8f3ec;color:#1f5f3f;font-weight:600">${escapeHtml(approval.line)}</p>`
    : `<p style="padding:12px;border:3px solid #9b1c1c;background:#fdecec;color:#9b1c1c;font-size:18px;font-weight:700">${escapeHtml(approval.line)}</p>`
  const cell = 'style="border:1px solid #c8ccd4;padding:3px 6px;white-space:nowrap"'
  const factRows = facts.map(([k, v]) => `<tr><th align="left" style="padding:2px 12px 2px 0">${escapeHtml(k)}</th><td>${escapeHtml(v)}</td></tr>`).join('')
  const head = LEG_HEADERS.map(h => `<th ${cell}>${escapeHtml(h)}</th>`).join('')
  const body = rows.map(r => `<tr>${r.map(c => `<td ${cell}>${escapeHtml(c)}</td>`).join('')}</tr>`).join('')
  return `<!doctype html><html><head><meta charset="utf-8"><title>${escapeHtml(subject)}</title></head>
<body style="font-family:Arial,Helvetica,sans-serif;font-size:14px;color:#1b2330">
${banner}
<table>${factRows}</table>
<h3>Legs</h3>
<table style="border-collapse:collapse;font-size:13px"><thead><tr>${head}</tr></thead><tbody>${body}</tbody></table>
<h3>Cautions</h3>
<ul>${ALL_CAUTIONS.map(c => `<li>${escapeHtml(c)}</li>`).join('')}</ul>
<p style="color:#5b6472;font-size:12px">Sent by Passagewright from the plan as it stood when the brief was queued.</p>
</body></html>`
}

/** A brief may be sent again (a correction, a crew change), but not without end: so many per plan per hour, counted for all instances. */
export const BRIEFS_PER_PLAN_PER_HOUR = 3

async function countBrief(planId: number) {
  try {
    await rateLimiter('crew-brief-plan', BRIEFS_PER_PLAN_PER_HOUR, 3600).consume(limitKey(planId))
  }
  catch (error) {
    if (!isLimitReached(error)) throw error
    const minutes = Math.max(1, Math.ceil(error.msBeforeNext / 60_000))
    throw createError({
      statusCode: 429, statusMessage: `This plan's crew brief was queued ${BRIEFS_PER_PLAN_PER_HOUR} times within the hour; it can be sent again in ${minutes} minute${minutes === 1 ? '' : 's'}`,
      data: { retryAfterS: Math.ceil(error.msBeforeNext / 1000) },
    })
  }
}

/** Composes the brief from the plan as it is now and puts it in the outbox for the vessel's crew list. */
export async function queueCrewBrief(user: SessionUser, planId: number) {
  const view = await getPlanView(user, planId)
  const db = useDb()
  const vessel = await db('vessels').where({ id: view.plan.vesselId }).first('name', 'imo_number as imoNumber', 'call_sign as callSign') as BriefVessel
  const recipients = await db('crew_members').where({ vessel_id: view.plan.vesselId }).orderBy('id').select('name', 'email')
  if (!recipients.length)
    throw createError({ statusCode: 409, statusMessage: `The crew list of ${vessel.name} is empty; add crew members before sending a brief` })
  await countBrief(planId)
  const brief = composeCrewBrief(view, vessel)
  const mailFrom = (await getCompanySettings(user.companyId)).mailFrom ?? useRuntimeConfig().mailFrom
  const queued = await addToOutbox({ companyId: user.companyId, planId, queuedBy: user.id, recipients, mailFrom, ...brief })
  return { ...queued, recipientCount: recipients.length, subject: brief.subject }
}
