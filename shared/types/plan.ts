import { z } from 'zod'
import { latitudeSchema } from './geo'
import { waypointListSchema } from './waypoint'

export const planStatuses = ['draft', 'submitted', 'approved', 'returned'] as const
export type PlanStatus = typeof planStatuses[number]

export interface PlanSummary {
  id: number
  title: string
  vesselId: number
  vesselName: string
  status: PlanStatus
  revision: number
  version: number
  departureUtc: string
  speedKn: number
  limitLat: number | null
  totalNm: number | null
  arrivalUtc: string | null
  updatedAt: string
}

export const idParamsSchema = z.object({ id: z.coerce.number({ error: 'id must be a number' }).int('id must be a whole number').positive('id must be positive').max(2_147_483_647, 'id is too large') })

export const planCreateSchema = z.object({
  vesselId: z.number({ error: 'vesselId must be a number' }).int().positive(),
  title: z.string({ error: 'title is required' }).trim().min(3, 'title needs at least 3 characters').max(160, 'title is at most 160 characters'),
  departureUtc: z.iso.datetime({ offset: true, error: 'departureUtc must be an ISO 8601 date and time' }),
  speedKn: z.number({ error: 'speedKn must be a number' }).finite().gt(0, 'speedKn must be greater than 0').max(60, 'speedKn is at most 60'),
  limitLat: latitudeSchema.refine(v => v > 0 && v < 90, 'limitLat must be between 0 and 90 (applies north and south)').nullable().optional(),
  departurePlaceId: z.number().int().positive().nullable().optional(),
  arrivalPlaceId: z.number().int().positive().nullable().optional(),
})
export type PlanCreateInput = z.infer<typeof planCreateSchema>

export const waypointsPutSchema = z.object({
  version: z.number({ error: 'version must be a number' }).int('version must be a whole number').positive('version must be positive'),
  waypoints: waypointListSchema,
})
export type WaypointsPutInput = z.input<typeof waypointsPutSchema>

export const planHeaderSchema = planCreateSchema.omit({ vesselId: true }).extend({
  version: z.number({ error: 'version must be a number' }).int().positive(),
})
export type PlanHeaderInput = z.infer<typeof planHeaderSchema>

export interface PlanEvent {
  id: number
  userName: string
  role: string
  kind: string
  fromStatus: string | null
  toStatus: string | null
  remarks: string | null
  createdAt: string
}

export interface PlanDetail extends PlanSummary {
  companyId: number
  departurePlaceId: number | null
  arrivalPlaceId: number | null
  departureTimeZone: string | null
  arrivalTimeZone: string | null
  revisionOfPlanId: number | null
  approvedByName: string | null
  approvedAt: string | null
  createdByName: string | null
  masterUserId: number | null
}
