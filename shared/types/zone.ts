import { z } from 'zod'
import { ZONE_KINDS, type ZoneKind, type ZonePolygons } from '../utils/zones/types'

export { ZONE_KINDS, type ZoneKind }
export const zoneKindLabels: Record<ZoneKind, string> = { 'eca': 'Emission control area', 'no-go': 'No-go area', 'risk': 'Risk area', 'custom': 'Own area' }
export const zoneKindShort: Record<ZoneKind, string> = { 'eca': 'ECA', 'no-go': 'No-go', 'risk': 'Risk', 'custom': 'Own' }

export const zoneKindSchema = z.enum(ZONE_KINDS, { error: 'kind must be one of eca, no-go, risk, custom' })
const dayPattern = /^\d{4}-\d{2}-\d{2}$/
const daySchema = z.string({ error: 'must be a date (YYYY-MM-DD)' }).regex(dayPattern, 'must be a date (YYYY-MM-DD)')
  .refine(d => !Number.isNaN(Date.parse(`${d}T00:00:00Z`)) && new Date(`${d}T00:00:00Z`).toISOString().startsWith(d), 'is not a real date')
  // the years dates and times take everywhere (fields.ts); PostgreSQL has no year 0
  .refine(d => d >= '1900' && d < '2200', 'must be between the years 1900 and 2199')
const textSchema = (max: number) => z.string({ error: 'must be text' }).trim().max(max, `is at most ${max} characters`)
  .refine(t => !/[\u0000-\u0008\u000B\u000C\u000E-\u001F]/.test(t), 'must not contain control characters')

/** The GeoJSON as uploaded: the file's text (line numbers in errors refer to it), or the object itself. */
export const zoneGeoJsonSchema = z.union([z.string().max(1_500_000, 'the GeoJSON may be at most 1.5 MB'), z.record(z.string(), z.unknown())], { error: 'geojson must be the GeoJSON text or object' })

const zoneFields = {
  name: textSchema(120).min(1, 'name is required'),
  kind: zoneKindSchema,
  source: textSchema(500).nullish(),
  validFrom: daySchema.nullish(),
  validTo: daySchema.nullish(),
}
const validityOrder = (v: { validFrom?: string | null, validTo?: string | null }) => !v.validFrom || !v.validTo || v.validFrom <= v.validTo
const validityIssue = { message: 'validTo must not be before validFrom', path: ['validTo'] }

/** `POST /api/zones`: a Feature, FeatureCollection, Polygon or MultiPolygon with the zone's kind and name. */
export const zoneCreateSchema = z.object({ ...zoneFields, geojson: zoneGeoJsonSchema }).refine(validityOrder, validityIssue)
export type ZoneCreateInput = z.infer<typeof zoneCreateSchema>

/** `PUT /api/zones/:id`: any of the fields; a new geometry replaces the old. */
export const zoneUpdateSchema = z.object({
  name: zoneFields.name.optional(), kind: zoneKindSchema.optional(), source: zoneFields.source, validFrom: zoneFields.validFrom, validTo: zoneFields.validTo,
  geojson: zoneGeoJsonSchema.optional(),
}).refine(v => Object.values(v).some(x => x !== undefined), { message: 'send at least one of name, kind, source, validFrom, validTo, geojson' })
  .refine(validityOrder, validityIssue)
export type ZoneUpdateInput = z.infer<typeof zoneUpdateSchema>

/** A zone as `GET /api/zones` lists it. */
export interface ZoneSummary {
  id: number
  kind: ZoneKind
  name: string
  source: string | null
  approximate: boolean
  validFrom: string | null
  validTo: string | null
  vertexCount: number
  polygonCount: number
  updatedAt: string
  geometry: { type: 'MultiPolygon', coordinates: ZonePolygons }
}
