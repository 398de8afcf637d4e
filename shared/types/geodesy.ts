import { z } from 'zod'
import { latLonSchema, legMethodSchema } from './geo'
import { parsePosition } from '../utils/position'

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

/** A position typed as navigators write it (37°47.5'N 122°28.0'W); the message says what is wrong. */
export const positionTextSchema = z.string({ error: 'Type a position' }).trim().min(1, 'Type a position').superRefine((text, ctx) => {
  try { parsePosition(text) }
  catch (e) { ctx.addIssue({ code: 'custom', message: (e as Error).message }) }
})

export const solverPositionsSchema = z.object({ from: positionTextSchema, to: positionTextSchema })
export type SolverPositionsInput = z.infer<typeof solverPositionsSchema>

const numberText = (what: string, min: number, max: number) => z.string({ error: `Type ${what}` }).trim().min(1, `Type ${what}`)
  .refine(v => Number.isFinite(Number(v)) && Number(v) >= min && Number(v) <= max, `${what[0]!.toUpperCase()}${what.slice(1)} must be a number from ${min} to ${max}`)

export const solverDirectSchema = z.object({
  from: positionTextSchema,
  course: numberText('a course', 0, 360),
  distance: numberText('a distance', 0, 100_000_000),
  unit: z.enum(['nm', 'km', 'm']),
  method: legMethodSchema,
})
export type SolverDirectInput = z.infer<typeof solverDirectSchema>
