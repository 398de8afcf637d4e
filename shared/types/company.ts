import { z } from 'zod'
import { fuelReserveSchema } from './fuel'
import { emailSchema } from './fields'

/** A bunker price: a fuel grade's name as the vessels' fuel data names it, and its price per tonne. */
export const fuelPriceSchema = z.object({
  grade: z.string({ error: 'grade must be text' }).trim().min(1, 'grade is required').max(24, 'grade is at most 24 characters'),
  pricePerTonne: z.number({ error: 'pricePerTonne must be a number' }).finite().min(0, 'pricePerTonne must not be negative').max(100_000, 'pricePerTonne is at most 100000'),
})
export type FuelPriceInput = z.infer<typeof fuelPriceSchema>

const SENDER = /^(?:([^<>",;\\\u0000-\u001f\u007f]{1,100}?)\s*)?<([^<>\s]+)>$/
const mailFromText = 'must be an e-mail address, optionally with a name: Kestrel Bight Shipping <passages@kestrel-bight.example>'

/**
 * The sender of the company's crew briefs: an address, optionally after a name. Normalised to
 * `Name <address>`; no line breaks, quotes or commas, so it cannot add a header or a second address.
 */
export const mailFromSchema = z.string({ error: mailFromText }).trim().max(320, 'must be at most 320 characters').transform((text, ctx) => {
  const named = SENDER.exec(text)
  const address = emailSchema.safeParse(named ? named[2] : text)
  if (!address.success || (!named && /[<>\s]/.test(text))) {
    ctx.addIssue({ code: 'custom', message: mailFromText })
    return z.NEVER
  }
  const name = named?.[1]?.trim()
  return name ? `${name} <${address.data}>` : address.data
})

/** Voyage monitoring thresholds (see shared/utils/monitoring/workReport.ts); each falls back to its default. */
export const monitoringSettingsSchema = z.object({
  /** Corridor half-width for legs without their own XTE limit, nm. */
  defaultXteNm: z.number({ error: 'must be a number' }).finite().min(0.1, 'must be from 0.1 to 100 nm').max(100, 'must be from 0.1 to 100 nm').optional(),
  /** Hours the ETA may slip past the planned arrival before a report is flagged late. */
  lateH: z.number({ error: 'must be a number' }).finite().min(0, 'must be from 0 to 240 h').max(240, 'must be from 0 to 240 h').optional(),
  /** Percentage by which fuel used may exceed the plan's fuel for the distance sailed. */
  fuelPct: z.number({ error: 'must be a number' }).finite().min(0, 'must be from 0 to 200 %').max(200, 'must be from 0 to 200 %').optional(),
}).strict()
export type MonitoringSettings = z.infer<typeof monitoringSettingsSchema>

/** Company settings (admin): the fuel reserve margin, the helm delay used for wheel-over, bunker prices. */
export const companySettingsSchema = z.object({
  reserve: fuelReserveSchema,
  fuelPrices: z.array(fuelPriceSchema).max(12, 'at most 12 fuel prices').optional(),
  currency: z.string({ error: 'currency must be text' }).regex(/^[A-Z]{3}$/, 'currency is a three-letter code (ISO 4217), e.g. USD').optional(),
  helmDelayS: z.number({ error: 'helmDelayS must be a number' }).finite().min(0, 'helmDelayS must not be negative').max(120, 'helmDelayS is at most 120'),
  /** Crew briefs go out from this address; without it, from the installation's NUXT_MAIL_FROM. */
  mailFrom: mailFromSchema.nullable().optional(),
  monitoring: monitoringSettingsSchema.optional(),
})
export type CompanySettings = z.infer<typeof companySettingsSchema>
