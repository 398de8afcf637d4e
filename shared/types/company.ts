import { z } from 'zod'
import { fuelReserveSchema } from './fuel'

/** Company settings (admin): the fuel reserve margin and the helm delay used for wheel-over. */
export const companySettingsSchema = z.object({
  reserve: fuelReserveSchema,
  helmDelayS: z.number({ error: 'helmDelayS must be a number' }).finite().min(0, 'helmDelayS must not be negative').max(120, 'helmDelayS is at most 120'),
})
export type CompanySettings = z.infer<typeof companySettingsSchema>
