import { z } from 'zod'
import { speedKnSchema, tonnesPerDaySchema } from './fields'

/** One measured consumption: tonnes per day at a steady speed through the water. */
export const fuelPointSchema = z.object({
  speedKn: speedKnSchema,
  tonnesPerDay: tonnesPerDaySchema,
})
export type FuelPoint = z.infer<typeof fuelPointSchema>

/** A vessel's fuel data: at least two points at different speeds, enough to fit t/day = c·V^k. */
export const fuelPointsSchema = z.array(fuelPointSchema)
  .min(2, 'fuel data needs at least 2 points (speedKn and tonnesPerDay) to fit a curve')
  .max(50, 'fuel data has at most 50 points')
  .superRefine((points, ctx) => {
    const seen = new Map<number, number>()
    points.forEach((p, i) => {
      const first = seen.get(p.speedKn)
      if (first !== undefined)
        ctx.addIssue({ code: 'custom', path: [i, 'speedKn'], message: `speedKn ${p.speedKn} is given twice (points ${first + 1} and ${i + 1}); give one consumption per speed` })
      else seen.set(p.speedKn, i)
    })
  })

/** Reserve margin (company setting): a percentage of the passage fuel, or days of steaming at a speed. */
export const fuelReserveSchema = z.discriminatedUnion('kind', [
  z.object({
    kind: z.literal('percent'),
    value: z.number({ error: 'value must be a number' }).finite().min(0, 'value (percent) must not be negative').max(100, 'value (percent) is at most 100'),
  }),
  z.object({
    kind: z.literal('days'),
    value: z.number({ error: 'value must be a number' }).finite().min(0, 'value (days) must not be negative').max(60, 'value (days) is at most 60'),
    speedKn: speedKnSchema,
  }),
], { error: 'kind must be "percent" or "days"' })
export type FuelReserve = z.infer<typeof fuelReserveSchema>
