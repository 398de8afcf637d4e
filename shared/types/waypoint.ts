import { z } from 'zod'
import { latitudeSchema, legMethodSchema, longitudeSchema } from './geo'

export const MAX_WAYPOINTS = 5000

/** One waypoint as stored and sent over the API. */
export const waypointSchema = z.object({
  name: z.string().trim().max(80, 'at most 80 characters').default(''),
  lat: latitudeSchema,
  lon: longitudeSchema,
  // Method, speed, XTE and turn radius belong to the leg arriving at this waypoint (ignored on the first).
  method: legMethodSchema.default('rhumb'),
  speedKn: z.number().finite().gt(0, 'must be greater than 0').max(60, 'at most 60 kn').nullable().optional(),
  xteNm: z.number().finite().gt(0, 'must be greater than 0').max(100, 'at most 100 nm').nullable().optional(),
  turnRadiusNm: z.number().finite().gt(0, 'must be greater than 0').max(20, 'at most 20 nm').nullable().optional(),
  notes: z.string().max(500, 'at most 500 characters').nullable().optional(),
})
export type WaypointInput = z.input<typeof waypointSchema>
export type Waypoint = z.output<typeof waypointSchema>

function samePosition(a: { lat: number, lon: number }, b: { lat: number, lon: number }) {
  return Math.abs(a.lat - b.lat) < 1e-9 && Math.abs((((a.lon - b.lon) % 360) + 540) % 360 - 180) < 1e-9
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
