// Voyage monitoring: position reports on an approved plan and what the API answers for them.
import { z } from 'zod'
import { dateTimeUtcSchema, MAX_ID, numberTextSchema } from './fields'
import { angleSchema } from './place'
import type { VoyageFlag, WorkedReport } from '../utils/monitoring/workReport'

export const REPORT_REMARKS_MAX = 500
export const reportSources = ['manual', 'import'] as const
export type ReportSource = typeof reportSources[number]

/** A decimal rounded to hundredths (what `numeric(…, 2)` stores) within [0, max]; a blank form field is missing, never 0. */
function hundredthsFrom0(max: number, unit: string) {
  const range = `must be from 0 to ${max} ${unit}`
  const value = z.number({ error: 'must be a number' }).finite(range).min(0, range).max(max, range).transform(v => Math.round(v * 100) / 100)
  return z.preprocess(v => (v === '' ? undefined : v), value.nullable().optional())
}

/** A position report as entered on board: the position as decimal degrees or as navigators write it (35°12.4′S). */
export const reportSchema = z.object({
  timeUtc: dateTimeUtcSchema,
  lat: angleSchema('latitude'),
  lon: angleSchema('longitude'),
  /** Fuel remaining on board, tonnes. */
  fuelRobT: hundredthsFrom0(1_000_000, 't'),
  /** Speed as logged on board (the speed made good is worked out from the positions), knots; 0 when stopped. */
  speedKn: hundredthsFrom0(60, 'kn'),
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
export interface VoyageReport extends WorkedReport {
  id: number
  timeUtc: string
  lat: number
  lon: number
  fuelRobT: number | null
  speedKn: number | null
  remarks: string | null
  source: ReportSource
  createdByName: string
}

export interface VoyageLeg {
  index: number
  from: { lat: number, lon: number }
  to: { lat: number, lon: number }
  toName: string
  method: 'rhumb' | 'geodesic'
  distanceNm: number
  cumulativeNm: number
  speedKn: number
  hours: number
  etaUtc: string
  xteNm: number | null
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
  /** The plan's legs as monitoring reads them: ends, method, corridor (null: the company default) and schedule. */
  legs: VoyageLeg[]
  reports: VoyageReport[]
  /** Imported track logs, thinned for the chart. */
  tracks: VoyageTrack[]
  /** Whether the caller may add reports (planner, or this vessel's master) and delete them (the master). */
  canReport: boolean
  canDelete: boolean
}

/** The fields of POST /api/plans/:id/reports/import besides the file (multipart fields or query). */
export const trackImportSchema = z.object({
  mode: z.enum(['preview', 'create'], { error: 'must be "preview" or "create"' }),
  /** One report per this many minutes of the clock (60: the first fix of each hour). */
  intervalMin: numberTextSchema(z.number({ error: 'must be a number' }).int('must be a whole number of minutes').min(1, 'must be from 1 to 1440 minutes').max(1440, 'must be from 1 to 1440 minutes')).optional(),
  /** Create even though some lines could not be used (they are left out). */
  skipProblems: z.enum(['true', 'false'], { error: 'must be true or false' }).optional(),
})

export interface ImportedReport { line: number, timeUtc: string, lat: number, lon: number, speedKn: number | null }
export interface TrackImportResult {
  mode: 'preview' | 'create'
  format: 'nmea' | 'csv'
  lineCount: number
  fixCount: number
  /** Line-numbered problems (the first 200); problemCount counts them all. */
  problems: string[]
  problemCount: number
  /** Sentences other than RMC and GGA, passed over. */
  ignoredSentences: number
  firstUtc: string | null
  lastUtc: string | null
  intervalMin: number
  /** The reports the log makes: one per interval, after departure and after the voyage's latest report. */
  reports: ImportedReport[]
  /** Sampled fixes left out: before departure or not after the latest report already on the voyage. */
  leftOut: number
  created: number
}

/** A track kept for the chart: [epoch ms, lat, lon] per fix, thinned for drawing. */
export interface VoyageTrack { id: number, format: 'nmea' | 'csv', pointCount: number, firstUtc: string, lastUtc: string, points: [number, number, number][] }

/** GET /api/fleet: one row per vessel on passage (an approved plan under way). */
export interface FleetEntry {
  vesselId: number
  vesselName: string
  planId: number
  title: string
  departureUtc: string
  lastReport: { timeUtc: string, lat: number, lon: number, crossTrackNm: number, speedMadeGoodKn: number | null } | null
  distanceToGoNm: number
  totalNm: number
  etaUtc: string | null
  plannedArrivalUtc: string
  delayH: number | null
  flags: VoyageFlag[]
  /** The plan's waypoints, for the chart. */
  track: [number, number][]
}
