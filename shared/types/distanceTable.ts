import { z } from 'zod'
import { idSchema } from './fields'
import { PASSAGE_IDS } from '../utils/routing/passages'

export const DEFAULT_TABLE_RADIUS_NM = 30
/**
 * Tables up to this many places are built inside the request; larger ones go to the job queue.
 * A sea table costs one search of the whole sea graph per place (some 0.3 s each on one core), so
 * only small tables are worth a waiting request.
 */
export const IMMEDIATE_TABLE_PLACES = 12
export const MAX_TABLE_PLACES = 300

export const distanceTableCreateSchema = z.object({
  name: z.string({ error: 'name is required' }).trim().min(1, 'name is required').max(120, 'name is at most 120 characters'),
  placeIds: z.array(idSchema, { error: 'must be a list of place ids' })
    .min(2, 'choose at least 2 places').max(MAX_TABLE_PLACES, `choose at most ${MAX_TABLE_PLACES} places`)
    .refine(ids => new Set(ids).size === ids.length, 'a place is chosen twice'),
  radiusNm: z.number({ error: 'radiusNm must be a number' }).finite().positive('radiusNm must be greater than 0').max(500, 'radiusNm is at most 500').optional(),
  /** Passages the table's sea routes keep out of (e.g. ["suez"] for the distances round the Cape). */
  avoid: z.array(z.string({ error: 'must be a passage id' })
    .refine(id => PASSAGE_IDS.includes(id), { error: issue => `unknown passage ${JSON.stringify(issue.input)}` }), { error: 'must be a list of passage ids' })
    .max(PASSAGE_IDS.length, 'too many passages')
    .refine(ids => new Set(ids).size === ids.length, 'a passage is listed twice')
    .optional(),
})
export type DistanceTableCreateInput = z.infer<typeof distanceTableCreateSchema>

export type DistanceTableStatus = 'building' | 'ready' | 'failed'

/** A place as the table saw it when it was built. */
export interface TablePlace { id: number, name: string, lat: number, lon: number }

/** An approved plan reduced to what the table needs: its end points and total distance. */
export interface TablePlan { id: number, title: string, start: { lat: number, lon: number }, end: { lat: number, lon: number }, distanceNm: number, ecaNm?: number }

/** How a pair's distance was obtained: an approved plan, a computed sea route, or the direct geodesic (only where no sea route joins the places). */
export type TableSource = 'plan' | 'sea' | 'direct'

/**
 * The pairs of a table of n places, upper triangle row by row (pair (i, j), i < j, sits at
 * pairIndex(i, j, n)); distances are symmetric, so each pair is stored once.
 * planId: the shortest approved plan used, or null.
 * source: plan, sea or direct (tables built before sea routes hold plan and direct only).
 * via: for sea pairs, the passage ids the route uses in the order it meets them; null otherwise.
 * ecaNm: distance inside emission control areas in force at the build, along the plan or sea route; null for direct pairs.
 * crossesLand: for direct pairs, whether the geodesic crosses the coarse coastline; null otherwise.
 * passages: id and name of every passage the table's sea routes use.
 */
export interface DistanceMatrix {
  distanceNm: number[]
  planId: (number | null)[]
  source: TableSource[]
  via: (string[] | null)[]
  ecaNm: (number | null)[]
  crossesLand: (boolean | null)[]
  plans: { id: number, title: string }[]
  passages: { id: string, name: string }[]
  landStepNm: number
}

export interface DistanceTableSummary {
  id: number
  name: string
  status: DistanceTableStatus
  progress: number
  placeCount: number
  radiusNm: number
  /** Passage ids the table's sea routes avoid. */
  avoid: string[]
  builtAt: string | null
  createdAt: string
  error: string | null
}

export interface DistanceTableDetail extends DistanceTableSummary {
  places: TablePlace[]
  matrix: DistanceMatrix | null
}
