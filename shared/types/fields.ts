// Field schemas: one rule and one message per kind of value, composed into every object schema.
// Messages do not repeat the field's name: the API prefixes the path ("speedKn: must be …") and
// forms show them beside the field.
import { z } from 'zod'

/** PostgreSQL `integer`: ids and versions beyond it cannot exist. */
export const MAX_ID = 2_147_483_647

function wholeNumber(what: string) {
  const text = `must be ${what} from 1 to ${MAX_ID}`
  return z.number({ error: text }).int(text).min(1, text).max(MAX_ID, text)
}

/** A record id in a body (vesselId, placeIds[i], masterUserId, …). */
export const idSchema = wholeNumber('a record id (a whole number)')

/** The `:id` route parameter: digits only, then the same bounds as a body id. */
export const idParamsSchema = z.object({
  id: z.string({ error: 'id is required' }).regex(/^\d{1,10}$/, 'id must be a whole number').transform(Number).pipe(idSchema),
})

/** The version of a record the caller loaded (optimistic concurrency). */
export const versionSchema = wholeNumber('a whole number')

export const emailSchema = z.string({ error: 'is required' }).trim().toLowerCase().max(254, 'must be at most 254 characters').email('must be an e-mail address')

/**
 * A decimal stored in a `numeric(…, 2)` column: rounded to hundredths here, so what is stored is
 * what was validated (0.004 would otherwise be stored as 0), within [min, max].
 */
function hundredths(min: number, max: number, unit: string) {
  const range = `must be from ${min} to ${max} ${unit}`
  return z.number({ error: 'must be a number' }).finite(range).min(min, range).max(max, range).transform(v => Math.round(v * 100) / 100)
}

/** Speed through the water, knots; a ship on passage makes at least 0.1 kn. */
export const speedKnSchema = hundredths(0.1, 60, 'kn')
/** Cross-track limit (corridor half-width), nautical miles. */
export const xteNmSchema = hundredths(0.01, 100, 'nm')
/** Turn radius, nautical miles. */
export const turnRadiusNmSchema = hundredths(0.01, 20, 'nm')
/** Fuel consumption, tonnes per day. */
export const tonnesPerDaySchema = hundredths(0.01, 2000, 't/day')

export const latSchema = z.number({ error: 'must be a number' }).finite('must be between -90 and 90').min(-90, 'must be between -90 and 90').max(90, 'must be between -90 and 90')

/** Longitude in decimal degrees, −180..180 (the engine and the chart normalise before sending). */
export const lonSchema = z.number({ error: 'must be a number' }).finite('must be between -180 and 180').min(-180, 'must be between -180 and 180').max(180, 'must be between -180 and 180')

/** A number sent as text (query strings, multipart fields): blank is missing, never 0. */
export function numberTextSchema<T extends z.ZodType<number, number>>(schema: T) {
  return z.string({ error: 'is required' }).trim().min(1, 'is required')
    .regex(/^[+-]?(\d+\.?\d*|\.\d+)(e[+-]?\d+)?$/i, 'must be a number').transform(Number).pipe(schema)
}

const FIRST_YEAR = 1900
const LAST_YEAR = 2200
/** A date and time with its offset (ISO 8601), between the years 1900 and 2199. */
export const dateTimeUtcSchema = z.iso.datetime({ offset: true, error: 'must be an ISO 8601 date and time (e.g. 2027-03-01T06:00:00Z)' })
  .refine((s) => {
    const year = new Date(s).getUTCFullYear()
    return year >= FIRST_YEAR && year < LAST_YEAR
  }, `must be between the years ${FIRST_YEAR} and ${LAST_YEAR - 1}`)
