import Papa from 'papaparse'
import { parseLatitude, parseLongitude, PositionError } from '#shared/utils/position'
import type { LegMethod } from '#shared/types/geo'
import {
  formatRouteDecimal, formatRouteQuantity, MAX_ROUTE_FILE_WAYPOINTS, normaliseRouteLongitude, RouteFileError,
  takeRouteQuantity, tooManyRouteWaypoints, validateRouteWaypoints,
} from './common'
import type { ParsedRouteFile, RawRouteWaypoint, RouteFileIssue, RouteFilePlan, RouteFileWaypoint } from './common'

type CsvField = 'name' | 'lat' | 'lon' | 'method' | 'speedKn' | 'xteNm' | 'turnRadiusNm' | 'notes'

// Header names are compared in lower case with everything but letters dropped ("Speed (kn)" → "speedkn").
const headerAliases: Record<string, CsvField> = {
  name: 'name', waypoint: 'name', wp: 'name', wpt: 'name', waypointname: 'name',
  latitude: 'lat', lat: 'lat',
  longitude: 'lon', lon: 'lon', long: 'lon', lng: 'lon',
  method: 'method', sailing: 'method', legmethod: 'method', geometry: 'method',
  speed: 'speedKn', speedkn: 'speedKn', speedkt: 'speedKn', speedkts: 'speedKn', speedknots: 'speedKn',
  xte: 'xteNm', xtenm: 'xteNm', xtd: 'xteNm', xtdnm: 'xteNm', xtl: 'xteNm', crosstrack: 'xteNm', crosstracklimit: 'xteNm', crosstracklimitnm: 'xteNm',
  turnradius: 'turnRadiusNm', turnradiusnm: 'turnRadiusNm', radius: 'turnRadiusNm', radiusnm: 'turnRadiusNm',
  notes: 'notes', note: 'notes', remarks: 'notes',
}

const methodAliases: Record<string, LegMethod> = {
  geodesic: 'geodesic', gc: 'geodesic', greatcircle: 'geodesic', orthodrome: 'geodesic',
  rhumb: 'rhumb', rl: 'rhumb', rhumbline: 'rhumb', loxodrome: 'rhumb', mercator: 'rhumb',
}

/** The written header, in the order `writeRouteCsv` uses. */
const csvHeader = ['name', 'latitude', 'longitude', 'method', 'speed_kn', 'xte_nm', 'turn_radius_nm', 'notes'] as const

function headerKey(text: string) {
  return text.replace(/^\uFEFF/, '').toLowerCase().replace(/[^a-z]/g, '')
}

function mapHeader(cells: string[], line: number) {
  const columns = new Map<CsvField, number>()
  const ignored: string[] = []
  cells.forEach((cell, index) => {
    const field = headerAliases[headerKey(cell)]
    if (!field) {
      if (cell.trim() !== '') ignored.push(cell.trim())
      return
    }
    if (columns.has(field))
      throw new RouteFileError('bad-columns', `line ${line}: two columns give the ${field === 'lat' ? 'latitude' : field === 'lon' ? 'longitude' : field}: '${cells[columns.get(field)!]}' and '${cell}'`, { line, message: 'duplicate column' })
    columns.set(field, index)
  })
  if (!columns.has('lat') || !columns.has('lon')) {
    const found = cells.map(c => `'${c.trim()}'`).join(', ')
    throw new RouteFileError('bad-columns',
      `line ${line}: the first line must name the columns, with at least latitude (or lat) and longitude (or lon); optional name, method, speed (kn), xte (nm), turn radius (nm), notes. Found ${found}`,
      { line, message: 'latitude and longitude columns are required' })
  }
  return { columns, ignored }
}

function readPosition(raw: RawRouteWaypoint, key: 'lat' | 'lon', text: string) {
  const label = key === 'lat' ? 'latitude' : 'longitude'
  if (text.trim() === '') {
    raw.problems.push(`${label} is missing`)
    return
  }
  try {
    raw.fields[key] = key === 'lat' ? parseLatitude(decimalText(text)) : parseLongitude(decimalText(text))
  }
  catch (error) {
    if (!(error instanceof PositionError)) throw error
    raw.problems.push(`${label} '${text.trim()}': ${error.message.replace(/^(latitude|longitude):\s*/i, '')}`)
  }
}

function readMethod(raw: RawRouteWaypoint, text: string) {
  if (text.trim() === '') return
  const method = methodAliases[text.toLowerCase().replace(/[^a-z]/g, '')]
  if (method) raw.fields.method = method
  else raw.problems.push(`method '${text.trim()}' is not known: use geodesic (GC, great circle) or rhumb (RL, rhumb line)`)
}

/** Undoes the quote that spreadsheet-safe writers put before a leading =, +, -, @ (see `writeRouteCsv`). */
function unescapeFormula(text: string) {
  return /^''*[=+\-@\t\r]/.test(text) ? text.slice(1) : text
}

/** Decimal comma, as spreadsheets in many locales write it in semicolon-separated files. */
function decimalText(text: string) {
  return /^\s*[+-]?\d+,\d+\s*$/.test(text) ? text.replace(',', '.') : text
}

function rowToWaypoint(cells: string[], columns: Map<CsvField, number>, line: number): RawRouteWaypoint {
  const raw: RawRouteWaypoint = { where: { line }, fields: {}, problems: [] }
  const cell = (field: CsvField) => {
    const index = columns.get(field)
    return index === undefined ? '' : (cells[index] ?? '')
  }
  const name = unescapeFormula(cell('name').trim())
  if (name !== '') raw.fields.name = name
  readPosition(raw, 'lat', cell('lat'))
  readPosition(raw, 'lon', cell('lon'))
  readMethod(raw, cell('method'))
  takeRouteQuantity(raw, 'speedKn', decimalText(cell('speedKn')))
  takeRouteQuantity(raw, 'xteNm', decimalText(cell('xteNm')))
  takeRouteQuantity(raw, 'turnRadiusNm', decimalText(cell('turnRadiusNm')))
  const notes = unescapeFormula(cell('notes').trim())
  if (notes !== '') raw.fields.notes = notes
  return raw
}

/**
 * A waypoint list as CSV (RFC 4180 quoting; comma, semicolon or tab separated, detected).
 * The first non-empty line names the columns; each problem is reported with its line number.
 */
export function parseRouteCsv(source: string): ParsedRouteFile {
  const text = source.replace(/^\uFEFF/, '')
  const raws: RawRouteWaypoint[] = []
  const errors: RouteFileIssue[] = []
  const warnings: RouteFileIssue[] = []
  let header: ReturnType<typeof mapHeader> | undefined
  let headerWidth = 0
  let consumed = 0
  let line = 1
  let failure: RouteFileError | undefined

  Papa.parse<string[]>(text, {
    delimitersToGuess: [',', ';', '\t', '|'],
    step(row, parser) {
      const rowLine = line
      const cursor = row.meta.cursor
      for (let i = text.indexOf('\n', consumed); i !== -1 && i < cursor; i = text.indexOf('\n', i + 1)) line++
      consumed = cursor
      const cells = row.data
      for (const e of row.errors) errors.push({ line: rowLine, message: e.message })
      if (cells.every(c => c.trim() === '')) return
      try {
        if (!header) {
          header = mapHeader(cells, rowLine)
          headerWidth = cells.length
          if (header.ignored.length > 0)
            warnings.push({ line: rowLine, message: `column${header.ignored.length > 1 ? 's' : ''} ${header.ignored.map(c => `'${c}'`).join(', ')} ignored` })
          return
        }
        if (raws.length >= MAX_ROUTE_FILE_WAYPOINTS) throw tooManyRouteWaypoints(raws.length + 1, { line: rowLine, message: 'too many waypoints' })
        const raw = rowToWaypoint(cells, header.columns, rowLine)
        if (cells.length > headerWidth && cells.slice(headerWidth).some(c => c.trim() !== ''))
          raw.problems.push(`${cells.length} fields, but the header names ${headerWidth}`)
        raws.push(raw)
      }
      catch (error) {
        if (!(error instanceof RouteFileError)) throw error
        failure = error
        parser.abort()
      }
    },
  })
  if (failure) throw failure
  if (!header) throw new RouteFileError('empty', 'the file holds no lines')

  const { waypoints, errors: invalid } = validateRouteWaypoints(raws)
  return { format: 'csv', waypoints, errors: [...errors, ...invalid].sort((a, b) => (a.line ?? 0) - (b.line ?? 0)), warnings }
}

/**
 * Writes the waypoints as CSV with the columns `parseRouteCsv` reads. Text that starts with
 * =, +, -, @ is quoted with a leading apostrophe so spreadsheets do not run it as a formula.
 */
export function writeRouteCsv(_plan: RouteFilePlan, waypoints: readonly RouteFileWaypoint[]): string {
  const rows = waypoints.map(w => [
    w.name ?? '',
    formatRouteDecimal(w.lat),
    formatRouteDecimal(normaliseRouteLongitude(w.lon)),
    w.method ?? 'rhumb',
    w.speedKn == null ? '' : formatRouteQuantity(w.speedKn),
    w.xteNm == null ? '' : formatRouteQuantity(w.xteNm),
    w.turnRadiusNm == null ? '' : formatRouteQuantity(w.turnRadiusNm),
    w.notes ?? '',
  ].map((value, column) => (column === 0 || column === 7) && /^'*[=+\-@\t\r]/.test(value) ? `'${value}` : value))
  return `${Papa.unparse({ fields: [...csvHeader], data: rows }, { newline: '\r\n' })}\r\n`
}
