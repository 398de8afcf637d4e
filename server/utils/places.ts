import type { Knex } from 'knex'
import { find as findTimeZones } from 'geo-tz'
import type { SessionUser } from '#shared/types/auth'
import type { Place, PlaceListItem } from '#shared/types/place'

const columns = ['id', 'name', 'kind', 'lat', 'lon', 'unlocode', 'time_zone as timeZone']

export async function listPlaces(user: SessionUser): Promise<PlaceListItem[]> {
  return useDb()('places').where('company_id', user.companyId).orderBy('name').select(columns)
}

/** IANA time zone at a position (geo-tz, data offline); at sea the nautical zone (Etc/GMT±n). */
export function timeZoneAt(lat: number, lon: number): string | null {
  return findTimeZones(lat, lon)[0] ?? null
}

function placeRow(place: Place) {
  return { name: place.name, kind: place.kind, lat: place.lat, lon: place.lon, unlocode: place.unlocode ?? null, time_zone: place.timeZone ?? timeZoneAt(place.lat, place.lon) }
}

async function assertNameFree(db: Knex | Knex.Transaction, user: SessionUser, name: string, exceptId?: number) {
  const q = db('places').where({ company_id: user.companyId }).whereRaw('lower(name) = lower(?)', [name])
  if (exceptId) q.whereNot('id', exceptId)
  if (await q.first('id')) throw createError({ statusCode: 409, statusMessage: `name: a place called "${name}" is already in the library` })
}

async function findPlace(user: SessionUser, id: number, db: Knex | Knex.Transaction = useDb()): Promise<PlaceListItem> {
  const row = await db('places').where({ id, company_id: user.companyId }).first(columns)
  if (!row) notFound('Place')
  return row
}

export async function createPlace(user: SessionUser, place: Place) {
  return useDb().transaction(async (trx) => {
    await assertNameFree(trx, user, place.name)
    const [row] = await trx('places').insert({ ...placeRow(place), company_id: user.companyId }).returning('id')
    return findPlace(user, row.id, trx)
  })
}

export async function updatePlace(user: SessionUser, id: number, place: Place) {
  return useDb().transaction(async (trx) => {
    await findPlace(user, id, trx)
    await assertNameFree(trx, user, place.name, id)
    await trx('places').where({ id, company_id: user.companyId }).update(placeRow(place))
    return findPlace(user, id, trx)
  })
}

/** Deletes a place unless a plan departs from or arrives at it (409, with the plans named). */
export async function deletePlace(user: SessionUser, id: number) {
  await useDb().transaction(async (trx) => {
    await findPlace(user, id, trx)
    const plans = await trx('plans').where('company_id', user.companyId)
      .andWhere(q => q.where('departure_place_id', id).orWhere('arrival_place_id', id)).limit(3).select('title')
    if (plans.length)
      throw createError({ statusCode: 409, statusMessage: `This place is used by plans (${plans.map(p => p.title).join('; ')}); change those plans first` })
    await trx('places').where({ id, company_id: user.companyId }).delete()
  })
}

/** Inserts many places in one transaction; a name already in the library aborts all of them. */
export async function insertPlaces(user: SessionUser, places: Place[]) {
  return useDb().transaction(async (trx) => {
    const names = places.map(p => p.name.toLowerCase())
    const taken = await trx('places').where('company_id', user.companyId).whereRaw('lower(name) = any(?)', [names]).pluck('name')
    if (taken.length) throw createError({ statusCode: 409, statusMessage: `Already in the library: ${taken.slice(0, 5).join(', ')}` })
    if (places.length) await trx('places').insert(places.map(p => ({ ...placeRow(p), company_id: user.companyId })))
    return places.length
  })
}

/** Names of the company's places (lower case), for checking an import before it is committed. */
export async function placeNames(user: SessionUser): Promise<Set<string>> {
  const names: string[] = await useDb()('places').where('company_id', user.companyId).pluck('name')
  return new Set(names.map(n => n.toLowerCase()))
}
