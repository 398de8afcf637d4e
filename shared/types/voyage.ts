// Voyage monitoring: position reports on an approved plan and what the API answers for them.
import { z } from 'zod'
import { dateTimeUtcSchema, MAX_ID } from './fields'
import { angleSchema } from './place'
import type { VoyageFlag } from '../utils/monitoring/workReport'

export const REPORT_REMARKS_MAX = 500
export const reportSources = ['manual', 'import'] as const
export type ReportSource = typeof reportSources[number]

/** A decimal rounded to hundredths (what `numeric(…, 2)` stores) within [0, max]. */
function hundredthsFrom0(max: number, unit: string) {
  const range = `must be from 0 to ${max} ${unit}`
  return z.number({ error: 'must be a number' }).finite(range).min(0, range).max(max, range).transform(v => Math.round(v * 100) / 100)
}

/** A position report as entered on board: the position as decimal degrees or as navigators write it (35°12.4′S). */
export const reportSchema = z.object({
  timeUtc: dateTimeUtcSchema,
  lat: angleSchema('latitude'),
  lon: angleSchema('longitude'),
  /** Fuel remaining on board, tonnes. */
  fuelRobT: hundredthsFrom0(1_000_000, 't').nullable().optional(),
  /** Speed as logged on board (the speed made good is worked out from the positions), knots; 0 when stopped. */
  speedKn: hundredthsFrom0(60, 'kn').nullable().optional(),
  remarks: z.string({ error: 'must be text' }).trim().max(REPORT_REMARKS_MAX, `must be at most ${REPORT_REMARKS_MAX} characters`)
    .transform(s => (s === '' ? null : s)).nullable().optional(),
})
export type ReportInput = z.input<typeof reportSchema>
export type Report = z.output<typeof reportSchema>

/** The `:id` and `:reportId` route parameters. */
export const reportParamsSchema = z.object({
  id: z.string().regex(/^\d{1,10}$/, 'id must be a whole number').transform(Number).pipe(z.number().int().min(1).max(MAX_ID)),
  reportId: z.string().regex(/^\d{1,10}$/, 'reportId must be a whole number').transform(Number).pipe(z.number().int().min(1).max(MAX_ID)),
})

/** One report worked out against the plan (the POST answer and each row of the list). */
export interface VoyageReport {
  id: number
  timeUtc: string
  lat: number
  lon: number
  fuelRobT: number | null
  speedKn: number | null
  remarks: string | null
  source: ReportSource
  createdByName: string
  legIndex: number
  /** Positive to starboard of the leg, nm. */
  crossTrackNm: number
  xteLimitNm: number
  alongTrackNm: number
  distanceToGoNm: number
  speedMadeGoodKn: number | null
  etaUtc: string | null
  etaPlannedSpeedsUtc: string
  plannedAlongTrackNm: number
  aheadNm: number
  delayH: number
  fuelUsedT: number | null
  fuelPlannedT: number | null
  flags: VoyageFlag[]
}

/** GET /api/plans/:id/voyage: the plan's schedule and every report worked out against it. */
export interface Voyage {
  planId: number
  title: string
  vesselId: number
  vesselName: string
  status: string
  departureUtc: string
  plannedArrivalUtc: string
  totalNm: number
  thresholds: { defaultXteNm: number, lateH: number, fuelPct: number }
  reports: VoyageReport[]
  /** Whether the caller may add reports (planner, or this vessel's master) and delete them (the master). */
  canReport: boolean
  canDelete: boolean
}
