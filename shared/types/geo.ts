import { z } from 'zod'

export const latitudeSchema = z.number({ error: 'must be a number' }).finite().min(-90, 'must be between -90 and 90').max(90, 'must be between -90 and 90')
export const longitudeSchema = z.number({ error: 'must be a number' }).finite().min(-540, 'must be between -180 and 180').max(540, 'must be between -180 and 180')

export const latLonSchema = z.object({ lat: latitudeSchema, lon: longitudeSchema })
export type LatLon = z.infer<typeof latLonSchema>

export const legMethodSchema = z.enum(['geodesic', 'rhumb'])
export type LegMethod = z.infer<typeof legMethodSchema>
