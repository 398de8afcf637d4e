// Zones of a company (capability 12): stored GeoJSON polygons with a kind and validity, and the
// zone engine's prepared index of them, cached per company until a zone changes.
import type { Knex } from 'knex'
import type { SessionUser } from '#shared/types/auth'
import type { ZoneCreateInput, ZoneSummary, ZoneUpdateInput } from '#shared/types/zone'
import { readZoneGeoJson } from '#shared/utils/zones/geojson'
import { prepareZones, type PreparedZones } from '#shared/utils/zones/prepare'
import type { ZonePolygons } from '#shared/utils/zones/types'
import { zoneInput } from '#shared/utils/zones/stored'

const columns = (db: Knex | Knex.Transaction) => [
  'id', 'kind', 'name', 'source', 'approximate', 'geometry', 'vertex_count', 'updated_at',
  db.raw(`to_char(valid_from, 'YYYY-MM-DD') as valid_from`), db.raw(`to_char(valid_to, 'YYYY-MM-DD') as valid_to`),
]

function toSummary(row: any): ZoneSummary {
  const coordinates = row.geometry.coordinates as ZonePolygons
  return {
    id: row.id, kind: row.kind, name: row.name, source: row.source, approximate: row.approximate, validFrom: row.valid_from, validTo: row.valid_to,
    vertexCount: row.vertex_count, polygonCount: coordinates.length, updatedAt: new Date(row.updated_at).toISOString(), geometry: { type: 'MultiPolygon', coordinates },
  }
}

/** The uploaded GeoJSON checked and read; every problem is a 400 that names its line, and nothing is stored. */
function readGeometry(geojson: string | Record<string, unknown>) {
  const text = typeof geojson === 'string' ? geojson : JSON.stringify(geojson, null, 2)
  const read = readZoneGeoJson(text)
  if (read.issues.length) {
    const n = read.issues.length
    const first = read.issues.slice(0, 3).map(i => `line ${i.line}: ${i.message}`).join('; ')
    throw createError({ statusCode: 400, statusMessage: `geojson: ${n} problem${n === 1 ? '' : 's'}, nothing was saved. ${first}`, data: { kind: 'invalid-geojson', errors: read.issues } })
  }
  return { geometry: { type: 'MultiPolygon', coordinates: read.polygons }, vertexCount: read.vertexCount }
}

async function assertNameFree(db: Knex | Knex.Transaction, user: SessionUser, name: string, exceptId?: number) {
  const q = db('zones').where({ company_id: user.companyId }).whereRaw('lower(name) = lower(?)', [name])
  if (exceptId) q.whereNot('id', exceptId)
  if (await q.first('id')) throw createError({ statusCode: 409, statusMessage: `name: a zone called "${name}" already exists` })
}

async function findZone(user: SessionUser, id: number, db: Knex | Knex.Transaction = useDb()): Promise<ZoneSummary> {
  const row = await db('zones').where({ id, company_id: user.companyId }).first(columns(db))
  if (!row) notFound('Zone')
  return toSummary(row)
}

export async function listZones(user: SessionUser): Promise<ZoneSummary[]> {
  const db = useDb()
  return (await db('zones').where({ company_id: user.companyId }).orderBy([{ column: 'kind' }, { column: 'name' }]).select(columns(db))).map(toSummary)
}

export async function createZone(user: SessionUser, input: ZoneCreateInput, options: { approximate?: boolean } = {}) {
  const { geometry, vertexCount } = readGeometry(input.geojson)
  return useDb().transaction(async (trx) => {
    await assertNameFree(trx, user, input.name)
    const [row] = await trx('zones').insert({
      company_id: user.companyId, kind: input.kind, name: input.name, source: input.source ?? null, approximate: options.approximate ?? false,
      valid_from: input.validFrom ?? null, valid_to: input.validTo ?? null, geometry: JSON.stringify(geometry), vertex_count: vertexCount, created_by: user.id,
    }).returning('id')
    return findZone(user, row.id, trx)
  })
}

export async function updateZone(user: SessionUser, id: number, input: ZoneUpdateInput) {
  const read = input.geojson === undefined ? null : readGeometry(input.geojson)
  return useDb().transaction(async (trx) => {
    const current = await findZone(user, id, trx)
    const validFrom = input.validFrom === undefined ? current.validFrom : input.validFrom
    const validTo = input.validTo === undefined ? current.validTo : input.validTo
    if (validFrom && validTo && validTo < validFrom) throw createError({ statusCode: 400, statusMessage: 'validTo: must not be before validFrom' })
    if (input.name !== undefined) await assertNameFree(trx, user, input.name, id)
    await trx('zones').where({ id, company_id: user.companyId }).update({
      ...(input.name !== undefined ? { name: input.name } : {}), ...(input.kind !== undefined ? { kind: input.kind } : {}),
      ...(input.source !== undefined ? { source: input.source } : {}), valid_from: validFrom, valid_to: validTo,
      ...(read ? { geometry: JSON.stringify(read.geometry), vertex_count: read.vertexCount, approximate: false } : {}), updated_at: trx.fn.now(),
    })
    return findZone(user, id, trx)
  })
}

export async function deleteZone(user: SessionUser, id: number) {
  await useDb().transaction(async (trx) => {
    await findZone(user, id, trx)
    await trx('zones').where({ id, company_id: user.companyId }).delete()
  })
}

interface CachedZones { signature: string, zones: ZoneSummary[], prepared: PreparedZones }
const prepared = new Map<number, CachedZones>()

/**
 * The company's zones prepared for the engine. Each instance keeps them while the company's
 * zones are unchanged (one small query of ids and update times decides), so plans read cheaply.
 * Inside a transaction pass it as `db`: a transaction that took a second connection from the pool
 * while holding a row lock could wait for ever on the requests queued behind that lock.
 */
export async function companyZones(companyId: number, db: Knex | Knex.Transaction = useDb()): Promise<CachedZones> {
  const stamps = await db('zones').where({ company_id: companyId }).orderBy('id').select('id', db.raw(`extract(epoch from updated_at)::text as t`))
  const signature = stamps.map((s: any) => `${s.id}:${s.t}`).join(',')
  const hit = prepared.get(companyId)
  if (hit && hit.signature === signature) return hit
  const zones = (await db('zones').where({ company_id: companyId }).orderBy('id').select(columns(db))).map(toSummary)
  const entry = { signature, zones, prepared: prepareZones(zones.map(zoneInput)) }
  if (prepared.size >= 200) prepared.delete(prepared.keys().next().value!)
  prepared.set(companyId, entry)
  return entry
}
