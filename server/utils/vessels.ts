import type { SessionUser } from '#shared/types/auth'

export async function listVessels(user: SessionUser) {
  const rows = await useDb()('vessels').leftJoin('users', 'users.id', 'vessels.master_user_id')
    .where('vessels.company_id', user.companyId).orderBy('vessels.name')
    .select('vessels.id', 'vessels.name', 'vessels.imo_number as imoNumber', 'vessels.call_sign as callSign',
      'vessels.service_speed_kn as serviceSpeedKn', 'vessels.master_user_id as masterUserId', 'users.name as masterName')
  return rows.map(r => ({ ...r, serviceSpeedKn: Number(r.serviceSpeedKn) }))
}
