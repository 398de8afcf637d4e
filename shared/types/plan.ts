import { z } from 'zod'
import { dateTimeUtcSchema, idSchema, latSchema, numberTextSchema, speedKnSchema, versionSchema } from './fields'
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

export const planCreateSchema = z.object({
  vesselId: idSchema,
  title: z.string({ error: 'title is required' }).trim().min(3, 'title needs at least 3 characters').max(160, 'title is at most 160 characters'),
  departureUtc: dateTimeUtcSchema,
  speedKn: speedKnSchema,
  limitLat: latSchema.refine(v => v > 0 && v < 90, 'must be between 0 and 90 (applies north and south)').nullable().optional(),
  departurePlaceId: idSchema.nullable().optional(),
  arrivalPlaceId: idSchema.nullable().optional(),
  /** Start the waypoint list at the departure place (and end it at the arrival place) when they are given. */
  startFromPlaces: z.boolean({ error: 'startFromPlaces must be true or false' }).optional(),
})
export type PlanCreateInput = z.infer<typeof planCreateSchema>

/**
 * A new draft from an earlier plan: the same track (`reversed: false`), or reversed for the return
 * passage. `reversed` is required and unknown fields are refused, so a malformed body never creates a plan.
 */
export const planCopySchema = z.object({
  reversed: z.boolean({ error: 'reversed must be true or false' }),
  title: planCreateSchema.shape.title.optional(),
  departureUtc: dateTimeUtcSchema.optional(),
}).strict()
export type PlanCopyInput = z.infer<typeof planCopySchema>

export const waypointsPutSchema = z.object({
  version: versionSchema,
  waypoints: waypointListSchema,
})
export type WaypointsPutInput = z.input<typeof waypointsPutSchema>

export const planHeaderSchema = planCreateSchema.omit({ vesselId: true, startFromPlaces: true }).extend({
  version: versionSchema,
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
  /** The vessel's service speed, for the warning when the plan is faster. */
  vesselServiceSpeedKn?: number | null
}

/** Columns the passage board sorts by (server side). */
export const boardSortKeys = ['title', 'vesselName', 'status', 'departureUtc', 'totalNm', 'arrivalUtc'] as const
export type BoardSortKey = typeof boardSortKeys[number]
export const BOARD_MAX_PAGE_SIZE = 200
const pageNumberSchema = z.number().int('must be a whole number').min(1, 'must be at least 1').max(100_000, 'is at most 100000')

/**
 * `GET /api/plans/board`: one page of the company's plans, sorted and filtered on the server.
 * `view=current` (the default) leaves out finished voyages: approved plans whose ETA has passed.
 */
export const planBoardQuerySchema = z.object({
  page: numberTextSchema(pageNumberSchema).optional().default(1),
  pageSize: numberTextSchema(z.number().int('must be a whole number').min(1, 'must be at least 1').max(BOARD_MAX_PAGE_SIZE, `is at most ${BOARD_MAX_PAGE_SIZE}`)).optional().default(50),
  sort: z.enum(boardSortKeys, { error: `must be one of ${boardSortKeys.join(', ')}` }).optional().default('departureUtc'),
  dir: z.enum(['asc', 'desc'], { error: 'must be asc or desc' }).optional().default('desc'),
  q: z.string({ error: 'must be text' }).trim().max(160, 'is at most 160 characters').optional().default(''),
  status: z.enum(planStatuses, { error: `must be one of ${planStatuses.join(', ')}` }).optional(),
  vesselId: numberTextSchema(idSchema).optional(),
  view: z.enum(['current', 'all'], { error: 'must be current or all' }).optional().default('current'),
}).strict()
export type PlanBoardQuery = z.infer<typeof planBoardQuerySchema>
export type PlanBoardQueryInput = z.input<typeof planBoardQuerySchema>

export interface PlanBoardPage {
  plans: PlanSummary[]
  /** Plans matching the filter (all pages). */
  total: number
  /** Plans of the company in this view, before the text, status and vessel filters. */
  viewTotal: number
  /** Finished voyages the `current` view leaves out. */
  finished: number
  page: number
  pageSize: number
}
