import { z } from 'zod'
import { latSchema, lonSchema } from './fields'

export const latLonSchema = z.object({ lat: latSchema, lon: lonSchema })
export type LatLon = z.infer<typeof latLonSchema>

export const legMethodSchema = z.enum(['geodesic', 'rhumb'])
export type LegMethod = z.infer<typeof legMethodSchema>
