// "Delivered exactly once" is counted only once the outbox has settled for the messages in question:
// none of their rows is queued or sending, and no crew-brief job for them is waiting, due for retry
// or held by a worker (pg-boss's created/retry/active). Only then can no further copy be on its
// way, so a late duplicate is counted instead of slipping in after a fixed sleep.
import pg from 'pg'

const POLL_MS = 250

async function unsettled(db: pg.Client, ids: number[]): Promise<string[]> {
  const rows = await db.query<{ id: number, state: string }>(
    `select id, state from outbox_messages where id = any($1::int[]) and state in ('queued', 'sending')`, [ids])
  // Jobs are matched by the row id they carry, not the singleton key, so stray duplicates count too.
  const jobs = await db.query<{ id: string, state: string, outbox_id: string }>(
    `select id, state, data->>'outboxId' as outbox_id from pgboss.job
      where name = 'crew-brief' and state in ('created', 'retry', 'active') and (data->>'outboxId')::int = any($1::int[])`, [ids])
  return [...rows.rows.map(r => `message ${r.id} ${r.state}`), ...jobs.rows.map(j => `job ${j.id} ${j.state} for message ${j.outbox_id}`)]
}

/** Resolves once the outbox has settled for `ids` (two probes in a row find nothing pending). */
export async function waitForOutboxSettled(ids: number[], timeoutMs = 120_000): Promise<void> {
  const db = new pg.Client({ connectionString: process.env.NUXT_DATABASE_URL })
  await db.connect()
  try {
    const until = Date.now() + timeoutMs
    let quietProbes = 0
    let pending: string[] = []
    while (quietProbes < 2) {
      pending = await unsettled(db, ids)
      quietProbes = pending.length ? 0 : quietProbes + 1
      if (Date.now() > until) throw new Error(`the outbox did not settle: ${pending.join(', ')}`)
      if (quietProbes < 2) await new Promise(resolve => setTimeout(resolve, POLL_MS))
    }
  }
  finally {
    await db.end()
  }
}
