import { z } from 'zod'
import { imoNumberSchema } from './imo'
import { emailSchema, idSchema, speedKnSchema } from './fields'
import { fuelPointsSchema, type FuelPoint } from './fuel'
import { fuelPriceSchema } from './company'
import type { FuelCurve } from '../utils/fuel'

/** Particulars an admin edits. */
export const vesselUpdateSchema = z.object({
  name: z.string({ error: 'name is required' }).trim().min(1, 'name is required').max(80, 'name is at most 80 characters'),
  imoNumber: imoNumberSchema,
  callSign: z.string({ error: 'callSign is required' }).trim().toUpperCase().min(3, 'callSign is 3 to 12 letters and digits')
    .max(12, 'callSign is 3 to 12 letters and digits').regex(/^[A-Z0-9]+$/, 'callSign is letters and digits only'),
  serviceSpeedKn: speedKnSchema,
  masterUserId: idSchema.nullable(),
})
export type VesselUpdateInput = z.infer<typeof vesselUpdateSchema>

export const crewMemberSchema = z.object({
  name: z.string({ error: 'name is required' }).trim().min(1, 'name is required').max(120, 'name is at most 120 characters'),
  rank: z.string({ error: 'rank is required' }).trim().min(1, 'rank is required').max(60, 'rank is at most 60 characters'),
  email: emailSchema,
})
export type CrewMember = z.infer<typeof crewMemberSchema>

export const crewListSchema = z.object({ crew: z.array(crewMemberSchema).max(100, 'a crew list has at most 100 people') })
export const vesselFuelSchema = z.object({ points: fuelPointsSchema })

/** The fuel grades a vessel burns outside and inside emission control areas, named as the company's bunker prices name them. */
export const vesselFuelGradesSchema = z.object({
  outside: fuelPriceSchema.shape.grade,
  insideEca: fuelPriceSchema.shape.grade,
}).strict()
export type VesselFuelGrades = z.infer<typeof vesselFuelGradesSchema>

export interface VesselDetail {
  id: number
  name: string
  imoNumber: string
  callSign: string
  serviceSpeedKn: number
  masterUserId: number | null
  masterName: string | null
  crew: (CrewMember & { id: number })[]
  fuelPoints: FuelPoint[]
  /** t/day = c·V^k fitted to the points; null with fewer than two. */
  fuelCurve: FuelCurve | null
  /** The grades burnt outside and inside ECAs; `stored: false` when the vessel has none of its own (the defaults apply). */
  fuelGrades: VesselFuelGrades & { stored: boolean }
  /** Masters of the company, for the assignment list. */
  masters: { id: number, name: string }[]
}
