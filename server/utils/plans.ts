import type { Knex } from 'knex'
import type { SessionUser } from '#shared/types/auth'
import type { BoardSortKey, PlanBoardPage, PlanBoardQuery, PlanCreateInput, PlanDetail, PlanEvent, PlanHeaderInput, PlanSummary } from '#shared/types/plan'
import type { PlanView } from '#shared/types/planView'
import type { Waypoint } from '#shared/types/waypoint'
import type { FuelInput, StoredLegs } from './planLegs'
import type { CachedPlanView } from './planViewCache'

type LegPlan = Parameters<typeof storeLegs>[1]

const summaryColumns = [
  'plans.id', 'plans.title', 'plans.vessel_id as vesselId', 'vessels.name as vesselName', 'plans.status', 'plans.revision',
  'plans.version', 'plans.departure_utc as departureUtc', 'plans.speed_kn as speedKn', 'plans.limit_lat as limitLat',
  'plans.total_nm as totalNm', 'plans.arrival_utc as arrivalUtc', 'plans.updated_at as updatedAt',
]
const detailColumns = [
  ...summaryColumns, 'plans.company_id as companyId', 'plans.departure_place_id as departurePlaceId', 'plans.arrival_place_id as arrivalPlaceId',
  'dep.time_zone as departureTimeZone', 'arr.time_zone as arrivalTimeZone', 'plans.revision_of_plan_id as revisionOfPlanId',
  'approver.name as approvedByName', 'plans.approved_at as approvedAt', 'creator.name as createdByName', 'vessels.master_user_id as masterUserId',
  'vessels.service_speed_kn as vesselServiceSpeedKn',
]

const iso = (v: unknown) => (v ? new Date(v as string).toISOString() : null)

function toSummary(row: any): PlanSummary {
  return { ...row, speedKn: Number(row.speedKn), departureUtc: iso(row.departureUtc)!, arrivalUtc: iso(row.arrivalUtc), updatedAt: iso(row.updatedAt)! }
}

function toWaypoint(row: any): Waypoint {
  const num = (v: unknown) => (v == null ? null : Number(v))
  return { name: row.name, lat: row.lat, lon: row.lon, method: row.method, speedKn: num(row.speed_kn), xteNm: num(row.xte_nm), turnRadiusNm: num(row.turn_radius_nm), notes: row.notes }
}

function waypointRows(planId: number, waypoints: Waypoint[]) {
  return waypoints.map((w, seq) => ({
    plan_id: planId, seq, name: w.name ?? '', lat: w.lat, lon: normaliseLongitude(w.lon), method: w.method ?? 'rhumb',
    speed_kn: w.speedKn ?? null, xte_nm: w.xteNm ?? null, turn_radius_nm: w.turnRadiusNm ?? null, notes: w.notes ?? null,
  }))
}

export async function listPlans(user: SessionUser): Promise<PlanSummary[]> {
  const rows = await useDb()('plans').join('vessels', 'vessels.id', 'plans.vessel_id')
    .where('plans.company_id', user.companyId).orderBy('plans.departure_utc', 'desc').select(summaryColumns)
  return rows.map(toSummary)
}

/**
 * The plan row in the user's company, or 404 (another company's plan does not exist for them).
 * With `lock` (inside a transaction) the plan row is locked for a write without waiting: PostgreSQL
 * answers 55P03 at once when another write holds it.
 */
export async function findPlan(user: SessionUser, id: number, db: Knex | Knex.Transaction = useDb(), { lock = false } = {}): Promise<PlanDetail> {
  const query = db('plans').join('vessels', 'vessels.id', 'plans.vessel_id')
    .leftJoin('places as dep', 'dep.id', 'plans.departure_place_id').leftJoin('places as arr', 'arr.id', 'plans.arrival_place_id')
    .leftJoin('users as approver', 'approver.id', 'plans.approved_by').leftJoin('users as creator', 'creator.id', 'plans.created_by')
    .where({ 'plans.id': id, 'plans.company_id': user.companyId })
  if (lock) query.forNoKeyUpdate('plans').noWait()
  const row = await query.first(detailColumns)
  if (!row) notFound('Plan')
  return { ...toSummary(row), approvedAt: iso(row.approvedAt), vesselServiceSpeedKn: row.vesselServiceSpeedKn == null ? null : Number(row.vesselServiceSpeedKn) } as PlanDetail
}

export async function loadWaypoints(planId: number, db: Knex | Knex.Transaction = useDb()): Promise<Waypoint[]> {
  return (await db('waypoints').where({ plan_id: planId }).orderBy('seq')).map(toWaypoint)
}

export async function listEvents(planId: number): Promise<PlanEvent[]> {
  const rows = await useDb()('plan_events').where({ plan_id: planId }).orderBy([{ column: 'created_at' }, { column: 'id' }])
  return rows.map(r => ({ id: r.id, userName: r.user_name, role: r.role, kind: r.kind, fromStatus: r.from_status, toStatus: r.to_status, remarks: r.remarks, createdAt: iso(r.created_at)! }))
}

// One query for what a plan view reads besides the plan row: its waypoints and history as JSON
// built by PostgreSQL (no rows to parse and serialise again), its stored legs, and its end positions.
const VIEW_SQL = `select
  (select coalesce(json_agg(json_build_object('name', name, 'lat', lat, 'lon', lon, 'method', method, 'speedKn', speed_kn::float8,
    'xteNm', xte_nm::float8, 'turnRadiusNm', turn_radius_nm::float8, 'notes', notes) order by seq), '[]')::text from waypoints where plan_id = :id) as waypoints,
  (select coalesce(json_agg(json_build_object('id', id, 'userName', user_name, 'role', role, 'kind', kind, 'fromStatus', from_status, 'toStatus', to_status,
    'remarks', remarks, 'createdAt', to_char(created_at at time zone 'UTC', 'YYYY-MM-DD"T"HH24:MI:SS.MS"Z"')) order by created_at, id), '[]')::text
    from plan_events where plan_id = :id) as events,
  (select json_build_array(lat, lon) from waypoints where plan_id = :id order by seq limit 1) as first,
  (select json_build_array(lat, lon) from waypoints where plan_id = :id order by seq desc limit 1) as last,
  (select count(*)::int from waypoints where plan_id = :id) as count,
  case when exists (select 1 from land_checks where plan_id = :id) then ${TRACK_MD5_SQL} end as track_md5,
  l.plan_version, l.engine, l.zone_signature, l.legs_json, l.totals_json, l.fuel_input_json
  from (select 1) one left join plan_legs l on l.plan_id = :id`

/** A plan view built afresh as JSON text: legs read back as stored (see planLegs.ts), recomputed only when stale. */
async function buildPlanViewJson(user: SessionUser, id: number): Promise<string> {
  // The plan row (which scopes the request to the caller's company) and the rest of the view at once:
  // for another company's plan the view's rows are read but never used.
  const [plan, { rows: [r] }] = await Promise.all([findPlan(user, id), useDb().raw(VIEW_SQL, { id })])
  // Without a departure or arrival place, the time zone comes from the first or last waypoint's position.
  plan.departureTimeZone ??= r.first ? timeZoneAt(r.first[0], r.first[1]) : null
  plan.arrivalTimeZone ??= r.count > 1 ? timeZoneAt(r.last[0], r.last[1]) : null
  const legs: StoredLegs = (await storedLegsCurrent(plan, r))
    ? { legsJson: r.legs_json, totalsJson: r.totals_json, fuelInput: JSON.parse(r.fuel_input_json) as FuelInput }
    : await storeLegsOnRead(plan)
  const [fuel, landCheck] = await Promise.all([
    fuelForPlan(user.companyId, plan.vesselId, legs.fuelInput.legs, legs.fuelInput.zones),
    latestLandCheck(useDb(), id, r.track_md5 ?? undefined),
  ])
  return `{"plan":${JSON.stringify(plan)},"waypoints":${r.waypoints},"legs":${legs.legsJson},"totals":${legs.totalsJson},"fuel":${JSON.stringify(fuel)},"events":${r.events},"landCheck":${JSON.stringify(landCheck)}}`
}

/**
 * GET /api/plans/:id as the JSON text it sends, kept while nothing it shows changes (planViewCache.ts):
 * one query checks that and the company scope; 404 for another company's plan.
 */
export function getPlanViewJson(user: SessionUser, id: number): Promise<CachedPlanView> {
  return cachedPlanView(user, id, buildPlanViewJson)
}

/**
 * Stale legs recomputed and stored by a read. The plan row is locked first, as a save locks it before
 * it stores legs, so the two never wait for each other's locks in opposite orders (storing legs moves
 * the plan's view stamp, which is on the plan row).
 */
function storeLegsOnRead(plan: PlanDetail): Promise<StoredLegs> {
  return useDb().transaction(async (trx) => {
    await trx.raw('select 1 from plans where id = ? for no key update', [plan.id])
    return storeLegs(trx, plan, await loadWaypoints(plan.id, trx))
  })
}

export async function getPlanView(user: SessionUser, id: number): Promise<PlanView> {
  return JSON.parse((await getPlanViewJson(user, id)).json.toString()) as PlanView
}

export async function recordEvent(db: Knex | Knex.Transaction, planId: number, user: SessionUser, kind: string, from: string | null, to: string | null, remarks: string | null = null) {
  await db('plan_events').insert({ plan_id: planId, user_id: user.id, user_name: user.name, role: user.role, kind, from_status: from, to_status: to, remarks })
}

export async function assertVesselInCompany(user: SessionUser, vesselId: number, db: Knex | Knex.Transaction = useDb()) {
  const vessel = await db('vessels').where({ id: vesselId, company_id: user.companyId }).first('id')
  if (!vessel) throw createError({ statusCode: 400, statusMessage: 'vesselId: no such vessel in your company' })
}

type PlaceEnds = Pick<PlanCreateInput, 'departurePlaceId' | 'arrivalPlaceId'>
interface EndPlace { name: string, lat: number, lon: number }

/**
 * The departure and arrival places a body names, each in the user's company; 400 naming the field
 * otherwise, the same answer for another company's place and one that does not exist.
 */
async function endPlaces(user: SessionUser, input: PlaceEnds, db: Knex | Knex.Transaction): Promise<EndPlace[]> {
  const ends = [['departurePlaceId', input.departurePlaceId], ['arrivalPlaceId', input.arrivalPlaceId]] as const
  const list: EndPlace[] = []
  for (const [field, id] of ends) {
    if (id == null) continue
    const place = await db('places').where({ id, company_id: user.companyId }).first('name', 'lat', 'lon')
    if (!place) throw createError({ statusCode: 400, statusMessage: `${field}: no such place in your company` })
    list.push(place)
  }
  return list
}

/** The plan's first (and last) waypoints from its departure and arrival places. */
function waypointsFromPlaces(places: EndPlace[]): Waypoint[] {
  const list: Waypoint[] = places.map((p, i) => ({ name: p.name, lat: p.lat, lon: p.lon, method: i ? 'geodesic' : 'rhumb' }))
  // The same place at both ends (a round trip) starts with the departure only.
  return list.length === 2 && list[0]!.lat === list[1]!.lat && list[0]!.lon === list[1]!.lon ? list.slice(0, 1) : list
}

export async function createPlan(user: SessionUser, input: PlanCreateInput, waypoints: Waypoint[] = [], origin: string | null = null) {
  return useDb().transaction(async (trx) => {
    await assertVesselInCompany(user, input.vesselId, trx)
    const places = await endPlaces(user, input, trx)
    if (input.startFromPlaces && !waypoints.length) waypoints = waypointsFromPlaces(places)
    const [row] = await trx('plans').insert({
      company_id: user.companyId, vessel_id: input.vesselId, title: input.title, departure_utc: input.departureUtc, speed_kn: input.speedKn,
      limit_lat: input.limitLat ?? null, departure_place_id: input.departurePlaceId ?? null, arrival_place_id: input.arrivalPlaceId ?? null, created_by: user.id,
    }).returning('id')
    if (waypoints.length) await writeWaypoints(trx, { id: row.id, companyId: user.companyId, version: 1, status: 'draft', departureUtc: input.departureUtc, speedKn: input.speedKn }, waypoints)
    await recordEvent(trx, row.id, user, 'created', null, 'draft', origin)
    return { id: row.id as number }
  })
}

async function writeWaypoints(trx: Knex.Transaction, plan: LegPlan, waypoints: Waypoint[]) {
  await trx('waypoints').where({ plan_id: plan.id }).delete()
  const rows = waypointRows(plan.id, waypoints)
  for (let i = 0; i < rows.length; i += 1000) await trx('waypoints').insert(rows.slice(i, i + 1000))
  await storeLegTable(trx, plan, waypoints)
}

/** The legs of the version being saved, stored with it; their totals also on the plan row, so the board lists them without reading legs. */
async function storeLegTable(trx: Knex.Transaction, plan: LegPlan, waypoints: Waypoint[]) {
  const { totalsJson } = await storeLegs(trx, plan, waypoints)
  const totals = JSON.parse(totalsJson) as { distanceNm: number, etaUtc: string }
  await trx('plans').where({ id: plan.id }).update({ total_nm: waypoints.length > 1 ? totals.distanceNm : null, arrival_utc: waypoints.length > 1 ? totals.etaUtc : null })
}

function assertEditable(plan: PlanDetail) {
  if (plan.status !== 'draft' && plan.status !== 'returned')
    throw createError({ statusCode: 409, statusMessage: `This plan is ${plan.status}; only a draft can be edited${plan.status === 'approved' ? ' (start a revision to change it)' : ''}` })
}

const staleVersion = (plan: PlanDetail) =>
  createError({ statusCode: 409, statusMessage: 'The plan was changed by someone else since you loaded it', data: { currentVersion: plan.version } })

/** Bumps the version only if the caller saw the current one: the optimistic lock every write goes through. */
async function bumpVersion(trx: Knex.Transaction, plan: PlanDetail, expected: number, extra: Record<string, unknown> = {}) {
  const updated = await trx('plans').where({ id: plan.id, version: expected }).update({ version: expected + 1, updated_at: trx.fn.now(), ...extra })
  if (updated === 0) throw staleVersion(plan)
}

const LOCK_NOT_AVAILABLE = '55P03'

/**
 * An edit of a plan's draft, as one transaction on the plan's locked row. Racing writes must not
 * hold the pool's connections while they wait for the winner: a version already stale is refused
 * from a plain read before any transaction starts, and a write that finds the row taken by another
 * one is refused at once (409, without a version: nothing was saved yet, the draft may be sent again).
 */
async function editDraft(user: SessionUser, id: number, version: number, write: (trx: Knex.Transaction, plan: PlanDetail) => Promise<void>) {
  const seen = await findPlan(user, id)
  assertEditable(seen)
  if (seen.version !== version) throw staleVersion(seen)
  try {
    await useDb().transaction(async (trx) => {
      const plan = await findPlan(user, id, trx, { lock: true })
      assertEditable(plan)
      await write(trx, plan)
    })
  }
  catch (error) {
    if ((error as { code?: string }).code === LOCK_NOT_AVAILABLE)
      throw createError({ statusCode: 409, statusMessage: 'Someone else is saving this plan at this moment; reload it and try again' })
    throw error
  }
}

export async function saveWaypoints(user: SessionUser, id: number, version: number, waypoints: Waypoint[]) {
  await editDraft(user, id, version, async (trx, plan) => {
    await bumpVersion(trx, plan, version, plan.status === 'returned' ? { status: 'draft' } : {})
    // Editing a returned plan takes it back to draft: a sign-off step, so it goes in the history.
    if (plan.status === 'returned') await recordEvent(trx, id, user, 'reopened', 'returned', 'draft')
    await writeWaypoints(trx, { ...plan, version: version + 1, status: 'draft' }, waypoints)
  })
  return getPlanView(user, id)
}

export async function updatePlanHeader(user: SessionUser, id: number, input: PlanHeaderInput) {
  await editDraft(user, id, input.version, async (trx, plan) => {
    await endPlaces(user, input, trx)
    await bumpVersion(trx, plan, input.version, {
      title: input.title, departure_utc: input.departureUtc, speed_kn: input.speedKn, limit_lat: input.limitLat ?? null,
      departure_place_id: input.departurePlaceId ?? null, arrival_place_id: input.arrivalPlaceId ?? null,
    })
    await storeLegTable(trx, { ...plan, version: input.version + 1, departureUtc: input.departureUtc, speedKn: input.speedKn }, await loadWaypoints(id, trx))
  })
  return getPlanView(user, id)
}

const BOARD_SORT_COLUMNS: Record<BoardSortKey, string> = {
  title: 'plans.title', vesselName: 'vessels.name', status: 'plans.status',
  departureUtc: 'plans.departure_utc', totalNm: 'plans.total_nm', arrivalUtc: 'plans.arrival_utc',
}
/** A finished voyage: approved, and its ETA has passed. The board's `current` view leaves these out. */
const FINISHED_SQL = `(plans.status = 'approved' and plans.arrival_utc < now())`
const likePattern = (text: string) => `%${text.replace(/[\\%_]/g, m => `\\${m}`)}%`

/** One page of the company's plans for the passage board: filtered, sorted and counted in PostgreSQL. */
export async function listPlanBoard(user: SessionUser, query: PlanBoardQuery): Promise<PlanBoardPage> {
  const db = useDb()
  const rows = db('plans').join('vessels', 'vessels.id', 'plans.vessel_id').where('plans.company_id', user.companyId)
  if (query.view === 'current') rows.whereRaw(`not ${FINISHED_SQL}`)
  if (query.status) rows.where('plans.status', query.status)
  if (query.vesselId) rows.where('plans.vessel_id', query.vesselId)
  if (query.q) {
    const pattern = likePattern(query.q)
    rows.where(w => w.whereRaw('plans.title ilike ?', [pattern])
      .orWhereIn('plans.vessel_id', db('vessels').where('company_id', user.companyId).whereRaw('name ilike ?', [pattern]).select('id')))
  }
  const column = BOARD_SORT_COLUMNS[query.sort]
  const [page, [counts]] = await Promise.all([
    rows.clone().orderBy([{ column, order: query.dir, nulls: 'last' }, { column: 'plans.id', order: query.dir }])
      .limit(query.pageSize).offset((query.page - 1) * query.pageSize)
      .select([...summaryColumns, db.raw('count(*) over ()::int as "boardTotal"')]),
    db('plans').where('company_id', user.companyId)
      .select(db.raw(`count(*) filter (where not ${FINISHED_SQL})::int as current, count(*) filter (where ${FINISHED_SQL})::int as finished`)),
  ])
  // A page past the end has no rows to carry the window count: count once more.
  const total = page.length ? page[0].boardTotal : query.page > 1 ? Number((await rows.clone().count({ n: '*' }))[0]?.n ?? 0) : 0
  return {
    plans: page.map(({ boardTotal: _, ...row }) => toSummary(row)),
    total,
    viewTotal: query.view === 'current' ? counts.current : counts.current + counts.finished,
    finished: counts.finished,
    page: query.page,
    pageSize: query.pageSize,
  }
}
