// The searches of a distance table on worker threads: each worker runs the table kernel
// (tableGraph.ts) from its source over the table graph's shared arrays and answers one row's paths
// at a time, so the searches of the next rows run on the other core while this thread smooths the
// paths of the current row. Where no worker can be started (or one fails), rows are searched here.
import { availableParallelism } from 'node:os'
import { Worker } from 'node:worker_threads'
import { tableKernel } from './tableGraph'
import type { FlatSeeds, RowPaths, TableGraph, TableKernel } from './tableGraph'

/** Rows queued per worker ahead of the one being smoothed. */
const AHEAD = 2

// `__name` stands in for the helper some bundlers wrap named functions in.
const WORKER_SOURCE = `
const { parentPort, workerData } = require('node:worker_threads')
var __name = (f) => f
const tableKernel = ${tableKernel.toString()}
const kernel = tableKernel(workerData.offsets, workerData.targets, workerData.cost, workerData.n)
parentPort.on('message', (m) => {
  const paths = kernel.row(m.sources, m.targets)
  parentPort.postMessage({ id: m.id, paths }, paths.filter(p => p && p.length).map(p => p.buffer))
})
`

export interface RowRequest { sources: FlatSeeds, targets: (FlatSeeds | null)[] }

/**
 * How many worker threads a table uses: PW_TABLE_WORKERS, else one per core, at most 2. On two
 * cores, two workers and this thread's smoothing share them better than one worker (a 300-place
 * table in 46 s against 66 s, the same run's machine).
 */
export function tableWorkerCount(): number {
  const set = process.env.PW_TABLE_WORKERS
  if (set !== undefined && set !== '') return Math.max(0, Math.floor(Number(set)) || 0)
  return Math.max(1, Math.min(2, availableParallelism()))
}

/**
 * Rows searched ahead of the caller: `next(i)` is row i's paths (requests are made in row order
 * through `request`), searched on a worker when there is one.
 */
export class RowSearches {
  private readonly workers: Worker[] = []
  private readonly pending = new Map<number, { resolve: (p: RowPaths) => void, reject: (e: unknown) => void }>()
  private readonly results = new Map<number, Promise<RowPaths>>()
  private readonly requests: (RowRequest | null)[]
  private nextToSend = 0
  private local: TableKernel | undefined
  private failed = false

  constructor(private readonly tg: TableGraph, rows: (RowRequest | null)[], workerCount = tableWorkerCount()) {
    this.requests = rows
    for (let w = 0; w < workerCount; w++) {
      try {
        const worker = new Worker(WORKER_SOURCE, { eval: true, workerData: { offsets: tg.offsets, targets: tg.targets, cost: tg.cost, n: tg.nodeCount } })
        worker.on('message', (m: { id: number, paths: RowPaths }) => {
          const p = this.pending.get(m.id)
          this.pending.delete(m.id)
          p?.resolve(m.paths)
        })
        worker.on('error', (e) => { this.fail(e) })
        this.workers.push(worker)
      }
      catch { break }
    }
  }

  private kernel(): TableKernel {
    this.local ??= tableKernel(this.tg.offsets, this.tg.targets, this.tg.cost, this.tg.nodeCount)
    return this.local
  }

  /** A worker failed: its rows, and every row from now on, are searched on this thread. */
  private fail(e: unknown) {
    if (this.failed) return
    this.failed = true
    console.error('[tables] a search worker failed; searching on the main thread:', e)
    for (const [id, p] of this.pending) {
      const r = this.requests[id]
      try { p.resolve(r ? this.kernel().row(r.sources, r.targets) : []) }
      catch (err) { p.reject(err) }
    }
    this.pending.clear()
    this.close()
  }

  private send() {
    const limit = this.workers.length * AHEAD
    while (!this.failed && this.workers.length && this.pending.size < limit && this.nextToSend < this.requests.length) {
      const id = this.nextToSend++
      const r = this.requests[id]
      if (!r) continue
      this.results.set(id, new Promise<RowPaths>((resolve, reject) => {
        this.pending.set(id, { resolve, reject })
        this.workers[id % this.workers.length]!.postMessage({ id, ...r })
      }))
    }
  }

  /** Row i's paths (null when the row has no search). */
  async next(i: number): Promise<RowPaths | null> {
    const r = this.requests[i]
    if (!r) return null
    this.send()
    const queued = this.results.get(i)
    this.results.delete(i)
    const paths = queued ? await queued : this.kernel().row(r.sources, r.targets)
    this.send()
    return paths
  }

  close() {
    for (const w of this.workers) void w.terminate()
    this.workers.length = 0
  }
}
