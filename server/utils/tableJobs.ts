// Large distance tables are built by jobs on the process-shared pg-boss (useBoss, schema
// `pgboss`, also used by the outbox). The table row is the truth (status, generation,
// progress); a job only says "build this generation now". Any server process running the
// worker may take it; a crashed build is retried by pg-boss, and at start-up every table
// still 'building' is queued again. If the queue cannot be reached the build runs in this
// process instead, so a shore user is never left with a table that never finishes.
import type PgBoss from 'pg-boss'

export const TABLE_QUEUE = 'distance-table'
const JOB_OPTIONS = { retryLimit: 2, retryDelay: 10, expireInSeconds: 900 }

let queueReady: Promise<PgBoss> | undefined

function tableQueue(): Promise<PgBoss> {
  if (!queueReady) {
    queueReady = (async () => {
      const boss = await useBoss()
      await boss.createQueue(TABLE_QUEUE, { name: TABLE_QUEUE, policy: 'short', ...JOB_OPTIONS })
      return boss
    })()
    queueReady.catch(() => { queueReady = undefined })
  }
  return queueReady
}

interface TableJob { tableId: number, generation: number }

export async function enqueueTableBuild(tableId: number, generation: number) {
  try {
    const boss = await tableQueue()
    await boss.send(TABLE_QUEUE, { tableId, generation } satisfies TableJob, { singletonKey: `${tableId}:${generation}`, ...JOB_OPTIONS })
  }
  catch (error: any) {
    console.error(`[tables] queue unavailable, building table ${tableId} in this process:`, error.message)
    setImmediate(() => { void runBuild(tableId, generation) })
  }
}

/** Takes table jobs in this process and re-queues builds left unfinished by a stopped process. */
export async function startTableWorker() {
  const boss = await tableQueue()
  await boss.work<TableJob>(TABLE_QUEUE, { pollingIntervalSeconds: 1 }, async ([job]) => {
    if (job) await runBuild(job.data.tableId, job.data.generation)
  })
  const unfinished = await useDb()('distance_tables').where('status', 'building').select('id', 'generation')
  for (const t of unfinished) await enqueueTableBuild(t.id, t.generation)
}
