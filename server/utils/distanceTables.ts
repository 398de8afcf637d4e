// Distance tables (capability 9): saved, named tables of distances between chosen places,
// taken from the company's approved plans, else the sea route (one Dijkstra per place over the
// sea graph, avoiding the table's passages and the company's no-go zones), else — only where no
// sea route joins the places — the direct geodesic (flagged, and flagged again when it crosses
// the coarse coastline). Each plan or sea pair carries its distance inside the ECAs in force.
// Small tables are built inside the request; larger ones by a job on the shared pg-boss queue,
// which any worker process may take.
import type { Knex } from 'knex'
import type { SessionUser } from '#shared/types/auth'
import {
  DEFAULT_TABLE_RADIUS_NM, IMMEDIATE_TABLE_PLACES,
  type DistanceMatrix, type DistanceTableCreateInput, type DistanceTableDetail, type DistanceTableSummary, type TablePlace, type TablePlan,
} from '#shared/types/distanceTable'
import { choosePlans, ecaAlongNm, geodesicDistanceNm, pairCount, pairIndex } from '#shared/utils/distanceTable'
import { computeLegTable } from '#shared/utils/legTable'
import { PASSAGES } from '#shared/utils/routing/passages'
import type { PreparedZones } from '#shared/utils/zones/prepare'
import { LAND_STEP_NM, geodesicCrossesLand } from './land'
import { useSeaGraph } from './routing/graphStore'
import { seaTable } from './routing/tableSearch'
import { zoneRouteAreas } from './zoneAreas'

/** Share of the progress bar for the sea-route pass; the land check of direct pairs takes the rest. */
const SEA_SHARE = 0.95
/** Work between yields to the event loop (and progress writes), in milliseconds. */
const SLICE_MS = 150

const iso = (v: unknown) => (v ? new Date(v as string).toISOString() : null)

function toSummary(row: any): DistanceTableSummary {
  return {
    id: row.id, name: row.name, status: row.status, progress: Number(row.progress), placeCount: row.places.length,
    radiusNm: Number(row.radius_nm), avoid: row.avoid ?? [], builtAt: iso(row.built_at), createdAt: iso(row.created_at)!, error: row.error ?? null,
  }
}

export async function listTables(user: SessionUser): Promise<DistanceTableSummary[]> {
  const rows = await useDb()('distance_tables').where('company_id', user.companyId).orderBy('created_at', 'desc')
    .select('id', 'name', 'status', 'progress', 'places', 'radius_nm', 'avoid', 'built_at', 'created_at', 'error')
  return rows.map(toSummary)
}

async function findRow(user: SessionUser, id: number, db: Knex = useDb()) {
  const row = await db('distance_tables').where({ id, company_id: user.companyId }).first()
  if (!row) notFound('Distance table')
  return row
}

export async function getTable(user: SessionUser, id: number): Promise<DistanceTableDetail> {
  const row = await findRow(user, id)
  return { ...toSummary(row), places: row.places, matrix: row.matrix ? readMatrix(row.matrix) : null }
}

/** A stored matrix as the current shape: tables built before sea routes know plan and direct pairs only. */
function readMatrix(m: Partial<DistanceMatrix> & Pick<DistanceMatrix, 'distanceNm' | 'planId' | 'crossesLand' | 'plans' | 'landStepNm'>): DistanceMatrix {
  return {
    ...m,
    source: m.source ?? m.planId.map(p => (p ? 'plan' : 'direct')),
    via: m.via ?? m.planId.map(() => null),
    ecaNm: m.ecaNm ?? m.planId.map(() => null),
    passages: m.passages ?? [],
  }
}

/** The chosen places of the company, by name; 400 naming the ids that are not in the library. */
async function loadPlaces(companyId: number, ids: number[]): Promise<TablePlace[]> {
  const rows = await useDb()('places').where('company_id', companyId).whereIn('id', ids).orderBy('name').select('id', 'name', 'lat', 'lon')
  const missing = ids.filter(id => !rows.some(r => r.id === id))
  if (missing.length) throw createError({ statusCode: 400, statusMessage: `placeIds: unknown place ${missing.join(', ')}`, data: { missing } })
  return rows
}

/** Every approved plan of the company reduced to its end points and leg-table total, once per build. */
export async function loadApprovedPlans(companyId: number, zones?: { prepared: PreparedZones, atMs: number }): Promise<TablePlan[]> {
  const db = useDb()
  const plans = await db('plans').where({ company_id: companyId, status: 'approved' }).select('id', 'title', 'departure_utc', 'speed_kn')
  if (!plans.length) return []
  const points = await db('waypoints').whereIn('plan_id', plans.map(p => p.id)).orderBy(['plan_id', 'seq'])
    .select('plan_id', 'name', 'lat', 'lon', 'method', 'speed_kn')
  const out: TablePlan[] = []
  for (const p of plans) {
    const wps = points.filter(w => w.plan_id === p.id).map(w => ({ name: w.name, lat: w.lat, lon: w.lon, method: w.method, speedKn: w.speed_kn == null ? null : Number(w.speed_kn) }))
    if (wps.length < 2) continue
    const { totals } = computeLegTable(wps, p.departure_utc, Number(p.speed_kn))
    const plan: TablePlan = { id: p.id, title: p.title, start: wps[0]!, end: wps[wps.length - 1]!, distanceNm: totals.distanceNm }
    if (zones) plan.ecaNm = ecaAlongNm(zones.prepared, wps, zones.atMs)
    out.push(plan)
  }
  return out
}

export async function createTable(user: SessionUser, input: DistanceTableCreateInput) {
  const places = await loadPlaces(user.companyId, input.placeIds)
  const [row] = await useDb()('distance_tables').insert({
    company_id: user.companyId, name: input.name, places: JSON.stringify(places),
    radius_nm: input.radiusNm ?? DEFAULT_TABLE_RADIUS_NM, avoid: JSON.stringify(input.avoid ?? []), created_by: user.id,
  }).returning(['id', 'generation'])
  return startBuild(user, row.id, row.generation, places.length)
}

export async function rebuildTable(user: SessionUser, id: number) {
  const row = await findRow(user, id)
  const current = await useDb()('places').where('company_id', user.companyId).whereIn('id', row.places.map((p: TablePlace) => p.id)).orderBy('name').select('id', 'name', 'lat', 'lon')
  if (current.length < 2) throw createError({ statusCode: 409, statusMessage: 'Fewer than 2 of the table\'s places are left in the library' })
  const [next] = await useDb()('distance_tables').where({ id }).update({
    places: JSON.stringify(current), status: 'building', progress: 0, error: null, generation: useDb().raw('generation + 1'),
  }).returning(['generation'])
  return startBuild(user, id, next.generation, current.length)
}

/** Small tables are built now; larger ones are queued. `queued` tells the route to answer 202. */
async function startBuild(user: SessionUser, id: number, generation: number, placeCount: number) {
  if (placeCount <= IMMEDIATE_TABLE_PLACES) {
    await runBuild(id, generation)
    return { queued: false, table: await getTable(user, id) }
  }
  await enqueueTableBuild(id, generation)
  return { queued: true, table: await getTable(user, id) }
}

export async function deleteTable(user: SessionUser, id: number) {
  await findRow(user, id)
  await useDb()('distance_tables').where({ id, company_id: user.companyId }).delete()
}

/** Writes progress (or the result) only while this build's generation is still the row's. */
async function writeIfCurrent(id: number, generation: number, values: Record<string, unknown>): Promise<boolean> {
  return (await useDb()('distance_tables').where({ id, generation, status: 'building' }).update(values)) > 0
}

const yieldToLoop = () => new Promise<void>(resolve => setImmediate(resolve))

/**
 * Builds one generation of a table: plan choice, then the sea routes origin by origin (pairs a plan
 * serves keep the plan), then the land check of the pairs no sea route joins, yielding every
 * SLICE_MS and writing progress as it goes. Returns quietly when the table was deleted or rebuilt
 * meanwhile. Safe to run again after a crash.
 */
export async function runBuild(id: number, generation: number): Promise<void> {
  const row = await useDb()('distance_tables').where({ id, generation, status: 'building' }).first()
  if (!row) return
  try {
    const places: TablePlace[] = row.places
    const n = places.length
    const atMs = Date.now()
    const { zones, prepared } = await companyZones(row.company_id)
    const plans = await loadApprovedPlans(row.company_id, { prepared, atMs })
    const choice = choosePlans(places, plans, Number(row.radius_nm))
    const planById = new Map(plans.map(p => [p.id, p]))
    const pairs = pairCount(n)
    const distance = new Float64Array(pairs)
    const source: DistanceMatrix['source'] = Array.from({ length: pairs }, () => 'direct')
    const via: DistanceMatrix['via'] = Array.from({ length: pairs }, () => null)
    const ecaNm: DistanceMatrix['ecaNm'] = Array.from({ length: pairs }, () => null)
    const passagesUsed = new Set<string>()
    let sliceStart = performance.now()
    const pause = async (progress: number) => {
      if (performance.now() - sliceStart < SLICE_MS) return true
      if (!(await writeIfCurrent(id, generation, { progress: Math.min(0.99, progress) }))) return false
      await yieldToLoop()
      sliceStart = performance.now()
      return true
    }
    for (let k = 0; k < pairs; k++) {
      if (!choice.planId[k]) continue
      distance[k] = choice.distanceNm[k]!
      source[k] = 'plan'
      ecaNm[k] = planById.get(choice.planId[k]!)?.ecaNm ?? null
    }
    // Row i has n - 1 - i pairs: progress by pairs done, not by rows.
    const doneAfterRow = (i: number) => pairs - ((n - 1 - i) * (n - 2 - i)) / 2
    const graph = await useSeaGraph()
    const finished = await seaTable(graph, places, { avoid: row.avoid ?? [], areas: zoneRouteAreas(zones, [], 1, atMs) },
      (i, j, route) => {
        const k = pairIndex(i, j, n)
        if (!route) return
        distance[k] = route.distanceNm
        source[k] = 'sea'
        via[k] = route.via
        for (const p of route.via) passagesUsed.add(p)
        ecaNm[k] = ecaAlongNm(prepared, route.waypoints, atMs)
      },
      i => pause((SEA_SHARE * doneAfterRow(i)) / pairs),
      (i, j) => !choice.planId[pairIndex(i, j, n)])
    if (!finished) return
    const crossesLand: (boolean | null)[] = Array.from({ length: pairs }, () => null)
    for (let i = 0; i < n - 1; i++) {
      for (let j = i + 1; j < n; j++) {
        const k = pairIndex(i, j, n)
        if (source[k] !== 'direct') continue
        const a = places[i]!, b = places[j]!
        distance[k] = geodesicDistanceNm(a.lat, a.lon, b.lat, b.lon)
        crossesLand[k] = geodesicCrossesLand(a.lat, a.lon, b.lat, b.lon)
      }
      if (!(await pause(SEA_SHARE + ((1 - SEA_SHARE) * (i + 1)) / (n - 1)))) return
    }
    const used = new Set(choice.planId.filter(p => p > 0))
    const round = (x: number) => Math.round(x * 1000) / 1000
    const matrix: DistanceMatrix = {
      distanceNm: Array.from(distance, round),
      planId: Array.from(choice.planId, p => p || null),
      source, via,
      ecaNm: ecaNm.map(e => (e == null ? null : round(e))),
      crossesLand,
      plans: plans.filter(p => used.has(p.id)).map(p => ({ id: p.id, title: p.title })),
      passages: PASSAGES.filter(p => passagesUsed.has(p.id)).map(p => ({ id: p.id, name: p.name })),
      landStepNm: LAND_STEP_NM,
    }
    await writeIfCurrent(id, generation, { matrix: JSON.stringify(matrix), status: 'ready', progress: 1, built_at: useDb().fn.now() })
  }
  catch (error: any) {
    console.error(`[tables] build of table ${id} failed:`, error)
    await writeIfCurrent(id, generation, { status: 'failed', error: 'The build failed; try a rebuild.' })
  }
}
