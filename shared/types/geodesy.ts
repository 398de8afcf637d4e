import { z } from 'zod'
import { latLonSchema, legMethodSchema } from './geo'

/** A course in degrees true, 0 ≤ course ≤ 360 (360 is read as 000). */
export const courseSchema = z.number({ error: 'must be a number' }).finite().min(0, 'must be between 0 and 360').max(360, 'must be between 0 and 360')

export const geodesyInverseSchema = z.object({ from: latLonSchema, to: latLonSchema })
export type GeodesyInverseInput = z.infer<typeof geodesyInverseSchema>

export const geodesyDirectSchema = z.object({
  from: latLonSchema,
  course: courseSchema,
  distanceM: z.number({ error: 'must be a number' }).finite().min(0, 'must not be negative').max(1e8, 'at most 100 000 km'),
  method: legMethodSchema,
})
export type GeodesyDirectInput = z.infer<typeof geodesyDirectSchema>

export const geodesyCompositeSchema = z.object({
  from: latLonSchema,
  to: latLonSchema,
  limitLat: z.number({ error: 'must be a number' }).finite()
    .refine(v => Math.abs(v) > 0 && Math.abs(v) < 90, 'must be between 0 and 90 degrees (either hemisphere)'),
})
export type GeodesyCompositeInput = z.infer<typeof geodesyCompositeSchema>

export const geodesyCrossTrackSchema = z.object({ from: latLonSchema, to: latLonSchema, position: latLonSchema })
export type GeodesyCrossTrackInput = z.infer<typeof geodesyCrossTrackSchema>
