import Papa from 'papaparse'
import type { SessionUser } from '#shared/types/auth'
import { MAX_PLACE_IMPORT_ROWS, placeSchema, type PlaceImportResult, type PlaceImportRow } from '#shared/types/place'

// Header names the importer accepts for each field (lower case, spaces and punctuation ignored).
const HEADER_ALIASES: Record<string, string> = {
  name: 'name', kind: 'kind', type: 'kind',
  latitude: 'lat', lat: 'lat', longitude: 'lon', lon: 'lon', long: 'lon',
  unlocode: 'unlocode', locode: 'unlocode',
  timezone: 'timeZone', tz: 'timeZone', zone: 'timeZone',
}
const REQUIRED = ['name', 'kind', 'lat', 'lon']

// A name as the messages quote it: a cell may be as long as the file, the message stays short.
const quoted = (name: string) => `"${name.length > 60 ? `${name.slice(0, 57)}…` : name}"`

const headerKey = (h: string) => HEADER_ALIASES[h.toLowerCase().replace(/[^a-z]/g, '')] ?? null

/**
 * Reads a place CSV (header row: name, kind, latitude, longitude, unlocode, time zone) into rows with
 * line-numbered problems. Positions may be decimal degrees or navigators' notation. `existing` holds
 * the library's names (lower case) so that a clash is reported in the preview, before any write.
 */
export function readPlaceCsv(text: string, existing: Set<string>): { rows: PlaceImportRow[], fileErrors: string[] } {
  // Parsing stops one row past the limit, so a file of 180,000 short rows costs no more than one of 5,001.
  const parsed = Papa.parse<string[]>(text.replace(/^\uFEFF/, ''), { skipEmptyLines: 'greedy', preview: MAX_PLACE_IMPORT_ROWS + 2 })
  const [header, ...data] = parsed.data
  if (data.length > MAX_PLACE_IMPORT_ROWS)
    throw createError({ statusCode: 400, statusMessage: `file: a place CSV holds at most ${MAX_PLACE_IMPORT_ROWS.toLocaleString('en-GB')} places; this one has more, so split it` })
  if (!header) return { rows: [], fileErrors: ['the file is empty: expected a header row (name, kind, latitude, longitude, unlocode, time zone)'] }
  const keys = header.map(headerKey)
  const missing = REQUIRED.filter(k => !keys.includes(k))
  if (missing.length) return { rows: [], fileErrors: [`line 1: header is missing ${missing.join(', ')} (expected name, kind, latitude, longitude, unlocode, time zone)`] }
  const seen = new Map<string, number>()
  const rows = data.map((cells, i) => {
    const line = i + 2
    const record: Record<string, string> = {}
    keys.forEach((k, j) => { if (k) record[k] = (cells[j] ?? '').trim() })
    const result = placeSchema.safeParse(record)
    const errors = result.success ? [] : result.error.issues.map(issue => `line ${line}: ${issue.path.join('.') || 'row'}: ${issue.message}`)
    const key = (record.name ?? '').toLowerCase()
    if (key && existing.has(key)) errors.push(`line ${line}: name: ${quoted(record.name!)} is already in the library`)
    if (key && seen.has(key)) errors.push(`line ${line}: name: ${quoted(record.name!)} is also on line ${seen.get(key)}`)
    if (key && !seen.has(key)) seen.set(key, line)
    return { line, place: result.success ? { ...result.data, timeZone: result.data.timeZone ?? null } : null, errors }
  })
  const fileErrors = parsed.errors.map(e => `line ${(e.row ?? 0) + 1}: ${e.message}`)
  return { rows, fileErrors }
}

/** Preview lists every row and its problems and writes nothing; commit writes all rows in one transaction, and only when none has a problem. */
export async function importPlaces(user: SessionUser, text: string, mode: 'preview' | 'commit'): Promise<PlaceImportResult> {
  const { rows, fileErrors } = readPlaceCsv(text, await placeNames(user))
  for (const row of rows) if (row.place && !row.place.timeZone) row.place.timeZone = timeZoneAt(row.place.lat, row.place.lon)
  const errorCount = fileErrors.length + rows.reduce((n, r) => n + r.errors.length, 0)
  const result = { mode, rows, fileErrors, errorCount, imported: 0 }
  if (mode === 'preview') return result
  if (errorCount > 0) throw createError({ statusCode: 400, statusMessage: `The file has ${errorCount} problem(s); nothing was imported`, data: result })
  if (rows.length === 0) throw createError({ statusCode: 400, statusMessage: 'file: no places to import' })
  return { ...result, imported: await insertPlaces(user, rows.map(r => r.place!)) }
}
