import type { SessionUser } from '#shared/types/auth'
import type { PlanSummary } from '#shared/types/plan'

const summaryColumns = [
  'plans.id', 'plans.title', 'plans.vessel_id as vesselId', 'vessels.name as vesselName', 'plans.status', 'plans.revision',
  'plans.version', 'plans.departure_utc as departureUtc', 'plans.speed_kn as speedKn', 'plans.limit_lat as limitLat',
  'plans.total_nm as totalNm', 'plans.arrival_utc as arrivalUtc', 'plans.updated_at as updatedAt',
]

function toSummary(row: any): PlanSummary {
  return {
    ...row,
    speedKn: Number(row.speedKn),
    departureUtc: new Date(row.departureUtc).toISOString(),
    arrivalUtc: row.arrivalUtc ? new Date(row.arrivalUtc).toISOString() : null,
    updatedAt: new Date(row.updatedAt).toISOString(),
  }
}

export async function listPlans(user: SessionUser): Promise<PlanSummary[]> {
  const rows = await useDb()('plans')
    .join('vessels', 'vessels.id', 'plans.vessel_id')
    .where('plans.company_id', user.companyId)
    .orderBy('plans.departure_utc', 'desc')
    .select(summaryColumns)
  return rows.map(toSummary)
}
