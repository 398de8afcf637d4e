import type { SessionUser } from '#shared/types/auth'

export async function listPlaces(user: SessionUser) {
  return useDb()('places').where('company_id', user.companyId).orderBy('name')
    .select('id', 'name', 'kind', 'lat', 'lon', 'unlocode', 'time_zone as timeZone')
}
