import { z } from 'zod'
import { legMethodSchema } from './geo'
import { latSchema, lonSchema, speedKnSchema, turnRadiusNmSchema, xteNmSchema } from './fields'
import { normaliseLongitude } from '../utils/position'

export const MAX_WAYPOINTS = 5000

/** One waypoint as stored and sent over the API. */
export const waypointSchema = z.object({
  name: z.string().trim().max(80, 'at most 80 characters').default(''),
  lat: latSchema,
  lon: lonSchema,
  // Method, speed, XTE and turn radius belong to the leg arriving at this waypoint (ignored on the first).
  method: legMethodSchema.default('rhumb'),
  speedKn: speedKnSchema.nullable().optional(),
  xteNm: xteNmSchema.nullable().optional(),
  turnRadiusNm: turnRadiusNmSchema.nullable().optional(),
  notes: z.string().max(500, 'at most 500 characters').nullable().optional(),
})
export type WaypointInput = z.input<typeof waypointSchema>
export type Waypoint = z.output<typeof waypointSchema>

function samePosition(a: { lat: number, lon: number }, b: { lat: number, lon: number }) {
  return Math.abs(a.lat - b.lat) < 1e-9 && Math.abs(normaliseLongitude(a.lon - b.lon)) < 1e-9
}

export const waypointListSchema = z.array(waypointSchema)
  .min(2, 'a plan needs at least 2 waypoints')
  .max(MAX_WAYPOINTS, `at most ${MAX_WAYPOINTS} waypoints`)
  .superRefine((list, ctx) => {
    for (let i = 1; i < list.length; i++) {
      if (samePosition(list[i - 1]!, list[i]!))
        ctx.addIssue({ code: 'custom', path: [i, 'lat'], message: `waypoint ${i + 1} repeats the position of waypoint ${i}` })
    }
  })
