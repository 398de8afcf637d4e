import { MAX_WAYPOINTS, waypointListSchema, waypointSchema } from '#shared/types/waypoint'
import type { Waypoint, WaypointInput } from '#shared/types/waypoint'
import { normaliseLongitude } from '#shared/utils/position'

// Everything exported under server/utils is auto-imported across the server: names carry "Route".

export type RouteFileFormat = 'csv' | 'gpx' | 'rtz'

/** Where a problem is: a CSV line, or an XML element such as `waypoint #7` (with its line when known). */
export interface RouteFileIssue { line?: number, element?: string, message: string }

export interface ParsedRouteFile {
  format: RouteFileFormat
  routeName?: string
  /** What the file says of the voyage besides its waypoints (RTZ routeInfo and schedules). */
  vesselName?: string
  departureUtc?: string
  /** The speed most of its legs are planned at. */
  speedKn?: number
  waypoints: Waypoint[]
  /** Problems that stop an import: nothing may be created while there is one. */
  errors: RouteFileIssue[]
  /** What the reader assumed or left out (shown in the preview; the import may go ahead). */
  warnings: RouteFileIssue[]
}

/** What the writers take from a plan; any plan record with these fields will do. */
export interface RouteFilePlan {
  title?: string | null
  vesselName?: string | null
  departureUtc?: string | Date | null
  /** The plan's speed, for legs without one of their own. */
  speedKn?: number | null
  /** UTC time at each waypoint from the leg table: the departure at the first, the arrival at the others. */
  times?: readonly string[]
}

export type RouteFileWaypoint = Pick<WaypointInput, 'name' | 'lat' | 'lon' | 'method' | 'speedKn' | 'xteNm' | 'turnRadiusNm' | 'notes'>

export const MAX_ROUTE_FILE_BYTES = 2 * 1024 * 1024
export const MAX_ROUTE_FILE_WAYPOINTS = MAX_WAYPOINTS

export type RouteFileErrorKind =
  | 'too-large' | 'empty' | 'unsupported-format' | 'unreadable' | 'unsafe-xml'
  | 'malformed' | 'no-route' | 'bad-columns' | 'too-many-waypoints'

/** A whole-file failure: the file cannot be read as a route at all (413 when too large, else 400). */
export class RouteFileError extends Error {
  readonly statusCode: 400 | 413
  constructor(readonly kind: RouteFileErrorKind, message: string, readonly issue?: RouteFileIssue) {
    super(message)
    this.name = 'RouteFileError'
    this.statusCode = kind === 'too-large' ? 413 : 400
  }
}

export function tooManyRouteWaypoints(count: number, where?: RouteFileIssue): RouteFileError {
  return new RouteFileError('too-many-waypoints',
    `the file holds ${count > MAX_WAYPOINTS ? `more than ${MAX_WAYPOINTS.toLocaleString('en')}` : count} waypoints; at most ${MAX_WAYPOINTS.toLocaleString('en')} can be imported`, where)
}

/** A waypoint as read from a file, before validation, with where it was found. */
export interface RawRouteWaypoint {
  where: Omit<RouteFileIssue, 'message'>
  fields: Partial<Record<keyof WaypointInput, unknown>>
  /** Problems the reader found itself (unreadable numbers, unknown methods). */
  problems: string[]
}

const fieldLabels: Record<string, string> = {
  name: 'name', lat: 'latitude', lon: 'longitude', method: 'method', speedKn: 'speed (kn)',
  xteNm: 'cross-track limit (nm)', turnRadiusNm: 'turn radius (nm)', notes: 'notes',
}

/** Checks each waypoint and then the list against the shared waypoint schemas, placing each problem at its line or element. */
export function validateRouteWaypoints(raw: RawRouteWaypoint[]): { waypoints: Waypoint[], errors: RouteFileIssue[] } {
  const waypoints: Waypoint[] = []
  const errors: RouteFileIssue[] = []
  for (const r of raw) {
    for (const message of r.problems) errors.push({ ...r.where, message })
    const result = waypointSchema.safeParse(r.fields)
    if (result.success) {
      if (r.problems.length === 0) waypoints.push(result.data)
      continue
    }
    for (const issue of result.error.issues) {
      const field = String(issue.path[0] ?? '')
      const value = r.fields[field as keyof WaypointInput]
      if (value === undefined && r.problems.length > 0) continue // the reader has already said why it is missing
      const found = typeof value === 'number' ? ` (found ${value})` : ''
      errors.push({ ...r.where, message: `${fieldLabels[field] ?? field}: ${issue.message}${found}` })
    }
  }
  if (errors.length > 0) return { waypoints, errors }

  const list = waypointListSchema.safeParse(waypoints)
  if (!list.success) {
    for (const issue of list.error.issues) {
      const index = typeof issue.path[0] === 'number' ? issue.path[0] : undefined
      errors.push(index === undefined
        ? { message: issue.code === 'too_small' ? `the route has ${waypoints.length} waypoint${waypoints.length === 1 ? '' : 's'}; ${issue.message}` : issue.message }
        : { ...raw[index]!.where, message: issue.message })
    }
  }
  return { waypoints, errors }
}

const decimalPattern = /^[+-]?(?:\d+(?:\.\d*)?|\.\d+)(?:[eE][+-]?\d+)?$/

/** A decimal number from a file; undefined when empty, NaN when it is not a number. */
export function readRouteDecimal(text: unknown): number | undefined {
  if (text === undefined || text === null) return undefined
  const s = String(text).trim()
  if (s === '') return undefined
  return decimalPattern.test(s) ? Number(s) : Number.NaN
}

/**
 * Reads an optional positive quantity (speed, cross-track limit, radius) into `fields[key]`,
 * noting a problem when it is not a number. Zero means "not set", as RTZ writers use it.
 */
export function takeRouteQuantity(raw: RawRouteWaypoint, key: 'speedKn' | 'xteNm' | 'turnRadiusNm', text: unknown, label = fieldLabels[key]!) {
  const value = readRouteDecimal(text)
  if (value === undefined || value === 0) return
  if (Number.isNaN(value)) raw.problems.push(`${label}: '${String(text).trim()}' is not a number`)
  else raw.fields[key] = value
}

/** Fixed decimals without trailing zeros and never in exponent form (xsd:decimal has none). */
export function formatRouteDecimal(value: number, decimals = 8): string {
  const text = value.toFixed(decimals).replace(/(\.\d*?)0+$/, '$1').replace(/\.$/, '')
  return text === '-0' ? '0' : text
}

/** Shortest exact form for speeds, limits and radii; fixed decimals only when the shortest would use an exponent. */
export function formatRouteQuantity(value: number): string {
  const text = String(value)
  return /e/i.test(text) ? formatRouteDecimal(value, 10) : text
}

/** Longitude in −180 ≤ λ < 180, the range GPX 1.1 and RTZ declare. */
export function normaliseRouteLongitude(lon: number): number {
  const normal = normaliseLongitude(lon)
  return normal === 180 ? -180 : normal
}
