// Durable outbox for crew briefs (capability 7). The outbox_messages row is the truth; a pg-boss
// job only says "try this row now" and carries the retry back-off.
//
// Delivery guarantee, as built:
// - Nothing is lost: the row is committed before anything is sent. If the job is lost (enqueue
//   failed, crash before the job was written), the sweep at start and every minute re-enqueues
//   every queued/failed row that has no live job.
// - No double send by concurrent workers: a worker sends only after it has claimed the row with
//   one conditional UPDATE (queued|failed → sending); a second worker or a duplicate job finds
//   nothing to claim and does nothing.
// - The one remaining window: the SMTP server has accepted the message but the process dies (or
//   the database is unreachable) before the row is marked sent. The row then stays 'sending';
//   after STALE_SENDING_MINUTES the sweep hands it back to the queue and it is sent again. That
//   second copy carries the same Message-ID, so mail systems and readers can recognise it as a
//   duplicate. So: exactly once in normal operation and across SMTP outages and restarts; at
//   least once (same Message-ID) if a worker dies between the SMTP "250 OK" and the update.
import { randomUUID } from 'node:crypto'
import type { Knex } from 'knex'
import PgBoss from 'pg-boss'
import nodemailer, { type Transporter } from 'nodemailer'
import type { OutboxMessageSummary, OutboxRecipient } from '#shared/types/outbox'
import type { SessionUser } from '#shared/types/auth'

export const OUTBOX_QUEUE = 'crew-brief'
const PGBOSS_SCHEMA = 'pgboss'
const RETRY = { retryLimit: 20, retryDelay: 5, retryBackoff: true }
const MAX_ATTEMPTS = RETRY.retryLimit + 1
// Longer than the SMTP timeouts below add up to, so a slow but live send is never taken over.
const STALE_SENDING_MINUTES = 5
const SMTP_TIMEOUTS = { connectionTimeout: 10_000, greetingTimeout: 10_000, socketTimeout: 60_000 }

let bossStarting: Promise<PgBoss> | undefined
let transport: { url: string, transporter: Transporter } | undefined
let sweepTimer: ReturnType<typeof setInterval> | undefined
let workerId: string | undefined

/** The process's pg-boss, started on first use on the application database (schema `pgboss`). */
export function useBoss(): Promise<PgBoss> {
  if (!bossStarting) {
    bossStarting = (async () => {
      const connectionString = useRuntimeConfig().databaseUrl || process.env.NUXT_DATABASE_URL
      const boss = new PgBoss({ connectionString, schema: PGBOSS_SCHEMA, max: 4 })
      boss.on('error', error => console.error('[outbox] job queue:', error.message))
      await boss.start()
      await boss.createQueue(OUTBOX_QUEUE, { name: OUTBOX_QUEUE, policy: 'short', ...RETRY, expireInSeconds: 300 })
      return boss
    })()
    bossStarting.catch(() => { bossStarting = undefined })
  }
  return bossStarting
}

/** Asks a worker to try the row now. singletonKey + the 'short' policy: at most one waiting job per row. */
export async function enqueueOutboxMessage(id: number) {
  const boss = await useBoss()
  await boss.send(OUTBOX_QUEUE, { outboxId: id }, { singletonKey: String(id), ...RETRY, expireInSeconds: 300 })
}

/** `mailFrom`: the company's own sender (its settings), else the installation's NUXT_MAIL_FROM; `kind` defaults to a crew brief. */
export interface NewOutboxMessage { companyId: number, planId: number, queuedBy: number, recipients: OutboxRecipient[], subject: string, text: string, html: string, mailFrom: string, kind?: 'crew_brief' | 'voyage_alert' }

/**
 * Writes the message as a queued row with its Message-ID fixed up front, in `db` (a transaction, so
 * the message commits with whatever raised it); the caller enqueues it once committed, and the sweep
 * makes good an enqueue that never happens.
 */
export async function insertOutboxMessage(db: Knex | Knex.Transaction, message: NewOutboxMessage) {
  const kind = message.kind ?? 'crew_brief'
  const [row] = await db('outbox_messages').insert({
    company_id: message.companyId, plan_id: message.planId, queued_by: message.queuedBy, kind,
    recipients: JSON.stringify(message.recipients), subject: message.subject, body_text: message.text, body_html: message.html,
    state: 'queued', message_id: newMessageId(message.mailFrom, kind === 'crew_brief' ? 'brief' : 'alert'), mail_from: message.mailFrom,
  }).returning(['id', 'message_id', 'state'])
  return { id: row.id as number, messageId: row.message_id as string, state: row.state as string }
}

/** Asks for a committed row to be sent; a failed enqueue is logged and left to the sweep. */
export async function enqueueCommitted(id: number) {
  await enqueueOutboxMessage(id).catch(error => console.error(`[outbox] enqueue of message ${id} failed; the sweep will retry:`, error.message))
}

/** Commits the message as a queued row with its Message-ID fixed up front, then enqueues it. */
export async function addToOutbox(message: NewOutboxMessage) {
  const row = await insertOutboxMessage(useDb(), message)
  // The row is already safe; a lost enqueue is made good by the sweep.
  await enqueueCommitted(row.id)
  return row
}

function newMessageId(mailFrom: string, prefix: string) {
  const domain = /@([^>\s]+)/.exec(mailFrom)?.[1] ?? 'passagewright.invalid'
  return `<${prefix}.${randomUUID()}@${domain}>`
}

function smtp(): Transporter {
  const url = useRuntimeConfig().smtpUrl
  if (transport?.url !== url) {
    transport?.transporter.close()
    transport = { url, transporter: nodemailer.createTransport({ url, ...SMTP_TIMEOUTS } as any) }
  }
  return transport.transporter
}

/** One delivery attempt. Returns without sending when another worker holds or has finished the row. */
export async function deliverOutboxMessage(id: number): Promise<'sent' | 'skipped' | 'gave-up'> {
  const db = useDb()
  const [row] = await db('outbox_messages').where({ id }).whereIn('state', ['queued', 'failed'])
    .update({ state: 'sending', attempts: db.raw('attempts + 1'), claimed_at: db.fn.now() }).returning('*')
  if (!row) return 'skipped'
  try {
    await smtp().sendMail({
      from: row.mail_from ?? useRuntimeConfig().mailFrom,
      to: (row.recipients as OutboxRecipient[]).map(r => ({ name: r.name, address: r.email })),
      subject: row.subject, text: row.body_text, html: row.body_html, messageId: row.message_id,
      headers: { 'X-Passagewright-Outbox-Id': String(row.id), 'X-Passagewright-Plan-Id': String(row.plan_id ?? '') },
    })
  }
  catch (error: any) {
    const gaveUp = row.attempts >= MAX_ATTEMPTS
    const text = `${gaveUp ? `Gave up after ${row.attempts} attempts: ` : ''}${error?.message ?? error}`.slice(0, 1000)
    await db('outbox_messages').where({ id, state: 'sending' }).update({ state: 'failed', last_error: text, claimed_at: null })
    if (gaveUp) return 'gave-up'
    throw error // pg-boss schedules the next attempt with back-off
  }
  await markSent(id)
  return 'sent'
}

/** The SMTP server has the message: record that, trying a few times so a database blip does not cause a resend. */
async function markSent(id: number) {
  for (let attempt = 1; ; attempt++) {
    try {
      await useDb()('outbox_messages').where({ id }).update({ state: 'sent', sent_at: useDb().fn.now(), last_error: null, claimed_at: null })
      return
    }
    catch (error) {
      if (attempt >= 5) throw error
      await new Promise(resolve => setTimeout(resolve, 1000 * attempt))
    }
  }
}

/** Hands rows stuck in 'sending' back to the queue, and re-enqueues queued/failed rows that have no live job. */
export async function sweepOutbox() {
  const db = useDb()
  await db('outbox_messages').where({ state: 'sending' }).where('claimed_at', '<', db.raw(`now() - interval '${STALE_SENDING_MINUTES} minutes'`))
    .update({ state: 'failed', claimed_at: null, last_error: 'The sender stopped while sending; sending again (same Message-ID)' })
  const orphans = await db('outbox_messages as m').whereIn('m.state', ['queued', 'failed']).where('m.attempts', '<', MAX_ATTEMPTS)
    .whereNotExists(q => q.select(db.raw('1')).from(`${PGBOSS_SCHEMA}.job as j`).where('j.name', OUTBOX_QUEUE)
      .whereRaw('j.singleton_key = m.id::text').whereIn('j.state', ['created', 'retry', 'active']))
    .orderBy('m.id').select('m.id')
  for (const { id } of orphans) await enqueueOutboxMessage(id)
  return orphans.length
}

export async function startOutboxWorker() {
  const boss = await useBoss()
  workerId ??= await boss.work<{ outboxId: number }>(OUTBOX_QUEUE, { batchSize: 1, pollingIntervalSeconds: 2 }, async ([job]) => {
    if (job) await deliverOutboxMessage(job.data.outboxId)
  })
  await sweepOutbox()
  if (sweepTimer) return
  sweepTimer = setInterval(() => sweepOutbox().catch(error => console.error('[outbox] sweep:', error.message)), 60_000)
  sweepTimer.unref()
}

export async function stopOutbox() {
  if (sweepTimer) clearInterval(sweepTimer)
  sweepTimer = undefined
  workerId = undefined
  const starting = bossStarting
  bossStarting = undefined
  if (starting) await (await starting.catch(() => undefined))?.stop({ graceful: true, timeout: 10_000 })
  transport?.transporter.close()
  transport = undefined
}

export async function listOutbox(user: SessionUser): Promise<OutboxMessageSummary[]> {
  const rows = await useDb()('outbox_messages as m').leftJoin('plans as p', 'p.id', 'm.plan_id').leftJoin('vessels as v', 'v.id', 'p.vessel_id')
    .leftJoin('users as u', 'u.id', 'm.queued_by').where('m.company_id', user.companyId).orderBy('m.created_at', 'desc').orderBy('m.id', 'desc').limit(500)
    .select('m.id', 'm.plan_id as planId', 'p.title as planTitle', 'v.name as vesselName', 'm.subject', 'm.state', 'm.attempts', 'm.last_error as lastError',
      'm.message_id as messageId', 'u.name as queuedByName', 'm.created_at as createdAt', 'm.sent_at as sentAt', useDb().raw('jsonb_array_length(m.recipients)::int as "recipientCount"'))
  return rows.map(r => ({ ...r, createdAt: new Date(r.createdAt).toISOString(), sentAt: r.sentAt ? new Date(r.sentAt).toISOString() : null }))
}
