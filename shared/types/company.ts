import { z } from 'zod'
import { fuelReserveSchema } from './fuel'

/** A bunker price: a fuel grade's name as the vessels' fuel data names it, and its price per tonne. */
export const fuelPriceSchema = z.object({
  grade: z.string({ error: 'grade must be text' }).trim().min(1, 'grade is required').max(24, 'grade is at most 24 characters'),
  pricePerTonne: z.number({ error: 'pricePerTonne must be a number' }).finite().min(0, 'pricePerTonne must not be negative').max(100_000, 'pricePerTonne is at most 100000'),
})
export type FuelPriceInput = z.infer<typeof fuelPriceSchema>

/** Company settings (admin): the fuel reserve margin, the helm delay used for wheel-over, bunker prices. */
export const companySettingsSchema = z.object({
  reserve: fuelReserveSchema,
  fuelPrices: z.array(fuelPriceSchema).max(12, 'at most 12 fuel prices').optional(),
  currency: z.string({ error: 'currency must be text' }).regex(/^[A-Z]{3}$/, 'currency is a three-letter code (ISO 4217), e.g. USD').optional(),
  helmDelayS: z.number({ error: 'helmDelayS must be a number' }).finite().min(0, 'helmDelayS must not be negative').max(120, 'helmDelayS is at most 120'),
})
export type CompanySettings = z.infer<typeof companySettingsSchema>
