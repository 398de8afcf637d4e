import { z } from 'zod'
import { latLonSchema, legMethodSchema } from './geo'
import { idSchema, latSchema, lonSchema, numberTextSchema, versionSchema } from './fields'
import type { LatLon } from './geo'

/** Shown with every land check result (the general caution is LAND_CHECK_CAUTION in shared/utils/cautions.ts). */
export const LAND_CHECK_RESULT_CAUTION = 'Coastline data is coarse (Natural Earth 1:10m, the sea router\'s): a clear land check does not mean a safe track; it misses small islands, reefs and harbour works.'

/** Longest track (sum of legs) one land check accepts, in nm: several times round the world. */
export const LAND_CHECK_MAX_TRACK_NM = 100_000
export const LAND_CHECK_MAX_WAYPOINTS = 5000

// Spherical great-circle distance, good enough for a size limit.
function roughNm(a: LatLon, b: LatLon): number {
  const r = Math.PI / 180
  const h = Math.sin(((b.lat - a.lat) * r) / 2) ** 2 + Math.cos(a.lat * r) * Math.cos(b.lat * r) * Math.sin(((b.lon - a.lon) * r) / 2) ** 2
  return (2 * Math.asin(Math.min(1, Math.sqrt(h))) * 180 * 60) / Math.PI
}

/** A waypoint of the checked track; `method` is that of the leg arriving at it (ignored on the first). */
export const landCheckWaypointSchema = latLonSchema.extend({ method: legMethodSchema })

export const landCheckSchema = z.object({
  waypoints: z.array(landCheckWaypointSchema)
    .min(2, 'a land check needs at least 2 waypoints')
    .max(LAND_CHECK_MAX_WAYPOINTS, `at most ${LAND_CHECK_MAX_WAYPOINTS} waypoints`)
    .refine(
      wps => wps.reduce((sum, wp, i) => sum + (i > 0 ? roughNm(wps[i - 1]!, wp) : 0), 0) <= LAND_CHECK_MAX_TRACK_NM,
      `the track is longer than ${LAND_CHECK_MAX_TRACK_NM} nm`,
    ),
  clearanceNm: z.number({ error: 'must be a number' }).finite().min(0, 'must be 0 or more').max(200, 'at most 200 nm'),
})
export type LandCheckInput = z.infer<typeof landCheckSchema>

/** One stretch of a leg over land: where the track goes ashore and where it is afloat again (null: it ends ashore). */
export interface LandCrossing { enter: LatLon, exit: LatLon | null }

export interface LandCheckLeg {
  index: number
  crossesLand: boolean
  firstLandPoint: LatLon | null
  /** Every stretch over land, in the order the leg meets them (empty when it crosses none). */
  crossings: LandCrossing[]
  closestApproachNm: number
  closestCoastPoint: LatLon
  withinClearance: boolean
  /** The declared passage whose fairway corridor holds the leg (then neither crossesLand nor withinClearance), else null; the API always sends it. */
  passage?: { id: string, name: string } | null
}
export interface LandCheckResult { legs: LandCheckLeg[], caution: string }

/** A leg the check flags: it crosses land or passes within the clearance. */
export const isFlaggedLeg = (l: Pick<LandCheckLeg, 'crossesLand' | 'withinClearance'>) => l.crossesLand || l.withinClearance

export const LAND_CHECK_NOTE_MAX = 1000

/** Checks the plan's saved track and keeps the result; `version` is the version the caller looked at. */
export const planLandCheckSchema = z.object({ version: versionSchema, clearanceNm: landCheckSchema.shape.clearanceNm })
export type PlanLandCheckInput = z.infer<typeof planLandCheckSchema>

export const landCheckAckSchema = z.object({
  checkId: idSchema,
  legIndex: z.number({ error: 'must be a number' }).int('must be a whole number').min(0, 'must be 0 or more').max(LAND_CHECK_MAX_WAYPOINTS, `at most ${LAND_CHECK_MAX_WAYPOINTS}`),
  note: z.string({ error: 'a note is required' }).trim().min(1, 'a note is required').max(LAND_CHECK_NOTE_MAX, `at most ${LAND_CHECK_NOTE_MAX} characters`)
    .refine(s => !/[\u0000-\u0008\u000B\u000C\u000E-\u001F\u007F]/.test(s), 'may not contain control characters'),
})
export type LandCheckAckInput = z.infer<typeof landCheckAckSchema>

export interface LandCheckAck { legIndex: number, note: string, userName: string, createdAt: string }

/** The last land check kept for a plan, as GET /api/plans/:id sends it. */
export interface StoredLandCheck extends LandCheckResult {
  id: number
  planVersion: number
  clearanceNm: number
  flaggedLegs: number
  checkedBy: string
  checkedAt: string
  /** False once the track (positions or leg methods) has changed since the check. */
  current: boolean
  acknowledgements: LandCheckAck[]
}

/** GET /api/land-check/position: a position as query text. */
export const landPositionQuerySchema = z.object({ lat: numberTextSchema(latSchema), lon: numberTextSchema(lonSchema) })
