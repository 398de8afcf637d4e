import { z } from 'zod'
import { latLonSchema } from './geo'
import { idSchema, speedKnSchema } from './fields'
import type { LatLon } from './geo'
import { PASSAGE_IDS } from '../utils/routing/passages'
import type { PassageKind } from '../utils/routing/passages'

export const DEFAULT_ROUTE_CLEARANCE_NM = 10
export const MAX_ROUTE_CLEARANCE_NM = 50
/** Without a limiting latitude, routes stay within 72° of the equator (ice; the graph itself reaches 84°N and 78°S). */
export const DEFAULT_ROUTE_LIMIT_LAT = 72
/** An end farther than this from navigable water is refused. */
export const MAX_END_MOVE_NM = 20

const passageIdSchema = z.string({ error: 'must be a passage id' })
  .refine(id => PASSAGE_IDS.includes(id), { error: issue => `unknown passage ${JSON.stringify(issue.input)}` })

export const seaRouteSchema = z.object({
  from: latLonSchema,
  to: latLonSchema,
  avoid: z.array(passageIdSchema, { error: 'must be a list of passage ids' }).max(PASSAGE_IDS.length, 'too many passages').optional(),
  clearanceNm: z.number({ error: 'must be a number' }).finite().min(0, 'must be 0 or more').max(MAX_ROUTE_CLEARANCE_NM, `at most ${MAX_ROUTE_CLEARANCE_NM} nm`).optional(),
  limitLat: z.number({ error: 'must be a number' }).finite().min(20, 'must be between 20 and 84').max(84, 'must be between 20 and 84').optional(),
  /** Zones to keep out of besides no-go areas (always avoided): risk areas, and ECAs weighted by their fuel cost (minimum-ECA routing). */
  avoidZones: z.array(z.enum(['risk', 'eca'], { error: 'must be "risk" or "eca"' }), { error: 'must be a list of "risk" and "eca"' }).max(2, 'at most "risk" and "eca"').optional(),
  /** For the fuel cost of a minimum-ECA comparison: the vessel's fuel curve, grades and a speed (its service speed when omitted). */
  vesselId: idSchema.optional(),
  speedKn: speedKnSchema.optional(),
})
export type SeaRouteInput = z.infer<typeof seaRouteSchema>

/**
 * Areas a route must keep out of (`block`) or that cost more to cross (`weight`, factor ≥ 1, e.g. an
 * emission control area for minimum-ECA routing). Rings are planar [lon, lat] rings, even-odd (a ring
 * inside another is a hole); membership is tested in the plane, which is fine for zone outlines.
 */
export type RouteArea =
  | { rings: [number, number][][], mode: 'block' }
  | { rings: [number, number][][], mode: 'weight', factor: number }

export interface SeaRouteOptions {
  avoid?: string[]
  clearanceNm?: number
  limitLat?: number
  areas?: RouteArea[]
}

export interface RouteWaypoint extends LatLon { name: string, method: 'geodesic', passageId?: string }

export interface SeaRouteResult {
  distanceNm: number
  distanceM: number
  /** The geodesic between the (moved) ends, for comparison. */
  geodesicNm: number
  via: { id: string, name: string }[]
  waypoints: RouteWaypoint[]
  /** How far each end was moved onto navigable water, nm (absent when not moved). */
  moved: { from?: number, to?: number }
  /** Closest approach to the routing coastline outside declared passages, nm. */
  minClearanceNm: number
  clearanceNm: number
  limitLat: number
}

export interface PassageSummary { id: string, name: string, kind: PassageKind, transitNm?: number }

/** Distance, distance inside ECAs and fuel cost (null without a vessel's curve and both prices) of one route. */
export interface RouteFigures { distanceNm: number, ecaNm: number, fuelCost: number | null }

/** What `POST /api/routing/sea` answers: the route with its distance inside each zone, and with `avoidZones: ["eca"]` the shortest route beside it. */
export interface ZonedSeaRouteResult extends SeaRouteResult {
  zones: { zoneId: number, name: string, kind: 'eca' | 'no-go' | 'risk' | 'custom', distanceNm: number }[]
  ecaComparison?: {
    ecaCostFactor: number
    shortest: RouteFigures & { waypoints: RouteWaypoint[] }
    minimumEca: RouteFigures
    difference: RouteFigures
  }
}
