import { z } from 'zod'
import { latSchema, lonSchema, numberTextSchema } from './fields'
import { normaliseLongitude, parseLatitude, parseLongitude } from '../utils/position'

export const placeKinds = ['port', 'pilot_station', 'canal_approach', 'strait', 'anchorage', 'ocean_position'] as const
export type PlaceKind = typeof placeKinds[number]
export const placeKindLabels: Record<PlaceKind, string> = {
  port: 'Port', pilot_station: 'Pilot station', canal_approach: 'Canal approach',
  strait: 'Strait', anchorage: 'Anchorage', ocean_position: 'Ocean position',
}

/** A place from the library as `GET /api/places` lists it. */
export interface PlaceListItem {
  id: number
  name: string
  kind: string
  lat: number
  lon: number
  unlocode: string | null
  timeZone: string | null
}

/** An angle given as decimal degrees (number) or as navigators write it (text): decimal degrees out. */
export function angleSchema(kind: 'latitude' | 'longitude') {
  return z.union([z.number(), z.string()], { error: `${kind} is required` }).transform((value, ctx) => {
    try {
      if (typeof value === 'string' && !value.trim()) throw new Error(`${kind} is required`)
      const deg = typeof value === 'number' ? value : kind === 'latitude' ? parseLatitude(value) : parseLongitude(value)
      const limit = kind === 'latitude' ? 90 : 180
      if (!Number.isFinite(deg) || Math.abs(deg) > limit) throw new Error(`${kind} must be between -${limit} and ${limit}`)
      return kind === 'longitude' ? normaliseLongitude(deg) : deg
    }
    catch (e) {
      ctx.addIssue({ code: 'custom', message: (e as Error).message.replace(/^(Latitude|Longitude): /, '') })
      return z.NEVER
    }
  })
}

/** True when the runtime knows the IANA time zone name. */
export function isTimeZone(name: string): boolean {
  try {
    new Intl.DateTimeFormat('en', { timeZone: name })
    return true
  }
  catch { return false }
}

/** Optional text: blank means "not given" (null). */
const blankToNull = (s: string) => (s === '' ? null : s)

export const placeKindSchema = z.string({ error: 'kind is required' }).trim()
  .transform(s => s.toLowerCase().replace(/[\s-]+/g, '_'))
  .refine((s): s is PlaceKind => (placeKinds as readonly string[]).includes(s), `kind must be one of ${placeKinds.join(', ')}`)

/** A place in the library; the API, the form and the CSV importer use this one schema. */
export const placeSchema = z.object({
  name: z.string({ error: 'name is required' }).trim().min(1, 'name is required').max(120, 'name is at most 120 characters'),
  kind: placeKindSchema,
  lat: angleSchema('latitude'),
  lon: angleSchema('longitude'),
  unlocode: z.string().trim().transform(s => s.replace(/\s+/g, '').toUpperCase())
    .refine(s => s === '' || /^[A-Z]{2}[A-Z2-9]{3}$/.test(s), 'UN/LOCODE is five characters: country code and three letters or digits 2–9 (e.g. JPYOK)')
    .transform(blankToNull).nullish(),
  /** IANA time zone; when absent the server derives it from the position. */
  timeZone: z.string().trim().refine(s => s === '' || isTimeZone(s), 'timeZone must be an IANA time zone name (e.g. Asia/Tokyo)')
    .transform(blankToNull).nullish(),
})
export type PlaceInput = z.input<typeof placeSchema>
export type Place = z.output<typeof placeSchema>

/** Places one CSV may bring, as route files are capped at 5,000 waypoints: the preview lists every row, so its size stays bounded. */
export const MAX_PLACE_IMPORT_ROWS = 5000

export const placeImportModeSchema = z.object({
  mode: z.enum(['preview', 'commit'], { error: 'mode must be "preview" or "commit"' }),
})

/** One CSV row after reading: the place it makes, or the problems on its line. */
export interface PlaceImportRow {
  line: number
  place: (Omit<Place, 'timeZone'> & { timeZone: string | null }) | null
  errors: string[]
}
export interface PlaceImportResult {
  mode: 'preview' | 'commit'
  rows: PlaceImportRow[]
  fileErrors: string[]
  errorCount: number
  imported: number
}

export const timeZoneQuerySchema = z.object({ lat: numberTextSchema(latSchema), lon: numberTextSchema(lonSchema) })
