// GET /api/plans/:id answered from the serialised view this instance built last, while PostgreSQL's
// stamps of what the view is made of are unchanged (migration 20261204_40_plan_view_stamps: triggers
// move `plans.view_stamp` on any change of the plan's own rows and `companies.view_stamp` on any
// change of what the company's plans share, whoever writes). Every request runs one indexed query that reads both stamps and
// scopes the plan to the caller's company, so a view is never served stale nor to another company.
// Each view is compressed at most once per encoding, when a client first asks for it.
import { promisify } from 'node:util'
import { brotliCompress, constants, gzip } from 'node:zlib'
import { LRUCache } from 'lru-cache'
import type { SessionUser } from '#shared/types/auth'

export interface CachedPlanView {
  companyId: number
  /** The plan's and the company's stamps when the view was built (read before building it). */
  stamp: string
  json: Buffer
  encoded: Partial<Record<PlanViewEncoding, Promise<Buffer>>>
}
export type PlanViewEncoding = 'br' | 'gzip'

const brotli = promisify(brotliCompress)
const gzipAsync = promisify(gzip)
// Brotli at quality 5 compresses a 1,000-waypoint view (about 750 kB) in tens of milliseconds to
// about a tenth of its size; the top qualities take seconds for a few per cent more.
const compressors: Record<PlanViewEncoding, (b: Buffer) => Promise<Buffer>> = {
  br: b => brotli(b, { params: { [constants.BROTLI_PARAM_QUALITY]: 5, [constants.BROTLI_PARAM_SIZE_HINT]: b.length, [constants.BROTLI_PARAM_MODE]: constants.BROTLI_MODE_TEXT } }),
  gzip: b => gzipAsync(b, { level: 6 }),
}
/** Answers smaller than this go out as they are (compressing them gains less than it costs). */
const MIN_COMPRESS_BYTES = 1024

const views = new LRUCache<number, CachedPlanView>({
  maxSize: 128 * 1024 * 1024,
  // The text plus, at most, its two compressed copies (each well under a third of it).
  sizeCalculation: v => Math.ceil(v.json.length * 1.6),
})
/** Views being built, by plan id and stamp: concurrent misses for one plan build it once. */
const building = new Map<string, Promise<CachedPlanView>>()

const STAMP_SQL = `select p.view_stamp::text || '.' || c.view_stamp::text as stamp
  from plans p join companies c on c.id = p.company_id where p.id = ? and p.company_id = ?`

/** The stamps of the caller's company's plan `id` (404 for another company's plan or none). */
async function planViewStamp(user: SessionUser, id: number): Promise<string> {
  const { rows } = await useDb().raw(STAMP_SQL, [id, user.companyId])
  if (!rows.length) notFound('Plan')
  return rows[0].stamp as string
}

/** The view of the caller's plan `id` as JSON text, from the cache when nothing it shows has changed. */
export async function cachedPlanView(user: SessionUser, id: number, build: (user: SessionUser, id: number) => Promise<string>): Promise<CachedPlanView> {
  // The stamp is read before the view is built: a change made while building moves the stamp past
  // the one stored with the view, so the next request builds again rather than serve it.
  const stamp = await planViewStamp(user, id)
  const hit = views.get(id)
  if (hit && hit.stamp === stamp && hit.companyId === user.companyId) return hit
  const key = `${id}:${stamp}:${user.companyId}`
  let pending = building.get(key)
  if (!pending) {
    pending = build(user, id).then((text) => {
      const view: CachedPlanView = { companyId: user.companyId, stamp, json: Buffer.from(text), encoded: {} }
      const current = views.get(id)
      // A slower build of an older stamp never replaces a newer view.
      if (!current || current.stamp !== stamp) views.set(id, view)
      return view
    }).finally(() => building.delete(key))
    building.set(key, pending)
  }
  return pending
}

/** The encoding to answer with for an Accept-Encoding header: brotli, else gzip, else none. */
export function pickEncoding(acceptEncoding: string | undefined): PlanViewEncoding | null {
  if (!acceptEncoding) return null
  const accepted = new Map<string, number>()
  for (const part of acceptEncoding.toLowerCase().split(',')) {
    const [name, ...params] = part.trim().split(';')
    const q = params.map(p => p.trim()).find(p => p.startsWith('q='))
    accepted.set(name!.trim(), q ? Number(q.slice(2)) || 0 : 1)
  }
  const weight = (name: PlanViewEncoding) => accepted.get(name) ?? (accepted.has('*') ? accepted.get('*')! : 0)
  if (weight('br') > 0) return 'br'
  if (weight('gzip') > 0) return 'gzip'
  return null
}

/** The view's bytes for the encoding (compressed once per view and encoding), or the text as it is. */
export async function encodedPlanView(view: CachedPlanView, encoding: PlanViewEncoding | null): Promise<{ body: Buffer, encoding: PlanViewEncoding | null }> {
  if (!encoding || view.json.length < MIN_COMPRESS_BYTES) return { body: view.json, encoding: null }
  view.encoded[encoding] ??= compressors[encoding](view.json)
  return { body: await view.encoded[encoding]!, encoding }
}

