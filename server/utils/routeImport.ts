// The HTTP side of route files (capability 8): reading an upload, previewing it, creating a
// draft from it, and exporting a plan. Parsing and writing live in ./routeFiles.
import type { H3Event } from 'h3'
import type { SessionUser } from '#shared/types/auth'
import { planCreateSchema } from '#shared/types/plan'
import type { RouteFileFormatName, RouteImportMode } from '#shared/types/routeFile'
import { routeImportFieldsSchema } from '#shared/types/routeFile'
import { computeLegTable } from '#shared/utils/legTable'
import { routeIssuePlace } from '#shared/utils/routeIssue'
import { parseRouteFile, writeRouteFile } from './routeFiles/index'
import { MAX_ROUTE_FILE_BYTES, RouteFileError } from './routeFiles/common'
import type { ParsedRouteFile } from './routeFiles/common'

// Room for the multipart framing around a full-size file: boundaries, part headers, the text fields.
const MULTIPART_ALLOWANCE = 64 * 1024
const PREVIEW_SPEED_KN = 12

// A 400 that the API error handler turns into "field: message".
const validationError = (issues: readonly { path: PropertyKey[], message: string }[]) =>
  createError({ statusCode: 400, statusMessage: 'Validation Error', data: { issues } })

export interface RouteUpload { mode: RouteImportMode, fileName: string, contentType?: string, bytes: Buffer, fields: Record<string, string> }

/** The uploaded file and text fields; the size is judged from Content-Length before any byte is read. */
export async function readRouteUpload(event: H3Event): Promise<RouteUpload> {
  const type = getRequestHeader(event, 'content-type') ?? ''
  if (!/^multipart\/form-data/i.test(type))
    throw createError({ statusCode: 415, statusMessage: 'Send the route file as multipart/form-data, in a field named file' })
  const lengthHeader = getRequestHeader(event, 'content-length')
  if (!lengthHeader || !/^\d+$/.test(lengthHeader))
    throw createError({ statusCode: 411, statusMessage: 'The upload must state its size (Content-Length)' })
  const length = Number(lengthHeader)
  if (length > MAX_ROUTE_FILE_BYTES + MULTIPART_ALLOWANCE)
    throw createError({ statusCode: 413, statusMessage: `The upload is ${(length / 1048576).toFixed(1)} MB; route files may be at most ${MAX_ROUTE_FILE_BYTES / 1048576} MB`, data: { kind: 'too-large' } })
  const parts = (await readMultipartFormData(event)) ?? []
  const file = parts.find(p => p.name === 'file' && p.filename !== undefined) ?? parts.find(p => p.filename !== undefined)
  if (!file) throw createError({ statusCode: 400, statusMessage: 'file: choose a route file (CSV, GPX or RTZ) to upload' })
  const fields: Record<string, string> = {}
  for (const p of parts) if (p.filename === undefined && p.name) fields[p.name] = p.data.toString('utf8').slice(0, 1000).trim()
  const options = routeImportFieldsSchema.safeParse({ mode: fields.mode || undefined })
  if (!options.success) throw validationError(options.error.issues)
  return { mode: options.data.mode ?? 'preview', fileName: file.filename ?? '', contentType: file.type, bytes: file.data, fields }
}

/** The parsed file; a whole-file failure becomes a 400 or 413 with its kind and place. */
export function readRouteFileUpload(upload: RouteUpload): ParsedRouteFile {
  try {
    return parseRouteFile(upload.fileName, upload.contentType, upload.bytes)
  }
  catch (error) {
    if (!(error instanceof RouteFileError)) throw error
    throw createError({ statusCode: error.statusCode, statusMessage: error.message, data: { kind: error.kind, issue: error.issue } })
  }
}

const numberField = (text: string | undefined) => (text === undefined || text === '' ? undefined : Number(text))

function nextFullHourUtc(): string {
  const d = new Date()
  d.setUTCMinutes(0, 0, 0)
  d.setUTCHours(d.getUTCHours() + 1)
  return d.toISOString()
}

/** What the file would become: waypoints and, when they are all valid, the leg table at the given (or an assumed) departure and speed. */
export function previewRoute(parsed: ParsedRouteFile, fields: Record<string, string>) {
  const given = planCreateSchema.pick({ departureUtc: true, speedKn: true }).partial()
  const departure = given.shape.departureUtc.safeParse(fields.departureUtc || undefined)
  const speed = given.shape.speedKn.safeParse(numberField(fields.speedKn))
  const departureUtc = (departure.success && departure.data) || parsed.departureUtc || nextFullHourUtc()
  const speedKn = (speed.success && speed.data) || parsed.speedKn || PREVIEW_SPEED_KN
  const table = parsed.errors.length === 0 ? computeLegTable(parsed.waypoints, departureUtc, speedKn) : null
  return {
    format: parsed.format, routeName: parsed.routeName ?? null, waypoints: parsed.waypoints,
    // What the file itself says of the voyage (RTZ routeInfo and schedules), to fill the header with.
    file: { vesselName: parsed.vesselName ?? null, departureUtc: parsed.departureUtc ?? null, speedKn: parsed.speedKn ?? null },
    legs: table?.legs ?? [], totals: table?.totals ?? null, errors: parsed.errors, warnings: parsed.warnings,
    assumed: { departureUtc, speedKn, departureGiven: !!(departure.success && departure.data), speedGiven: !!(speed.success && speed.data) },
  }
}

/** A draft plan from the file, only when the header is valid and every waypoint was read. */
export async function createPlanFromRoute(user: SessionUser, parsed: ParsedRouteFile, fields: Record<string, string>) {
  // What the form leaves out comes from the file: its route name, its vessel (by name, in the caller's company), schedule and speed.
  const vessel = !fields.vesselId && parsed.vesselName
    ? await useDb()('vessels').where({ company_id: user.companyId }).whereRaw('lower(name) = lower(?)', [parsed.vesselName]).first('id')
    : undefined
  const header = planCreateSchema.safeParse({
    vesselId: numberField(fields.vesselId) ?? vessel?.id, title: fields.title || parsed.routeName || undefined, departureUtc: fields.departureUtc || parsed.departureUtc || undefined,
    speedKn: numberField(fields.speedKn) ?? parsed.speedKn, limitLat: numberField(fields.limitLat) ?? null,
  })
  if (!header.success) throw validationError(header.error.issues)
  if (parsed.errors.length > 0) {
    const first = parsed.errors.slice(0, 3).map(e => `${routeIssuePlace(e)}: ${e.message.replace(/^line \d+: /, '')}`).join('; ')
    const count = parsed.errors.length
    throw createError({ statusCode: 400, statusMessage: `The file has ${count} error${count === 1 ? '' : 's'}; nothing was created. ${first}`, data: { kind: 'invalid-waypoints', errors: parsed.errors } })
  }
  // An RTZ file gives every leg its speed: those at the plan's speed are the plan's, so changing it later moves them too.
  const speedKn = header.data.speedKn
  const waypoints = parsed.format === 'rtz' ? parsed.waypoints.map(w => (w.speedKn === speedKn ? { ...w, speedKn: null } : w)) : parsed.waypoints
  return createPlan(user, header.data, waypoints)
}

/** The plan's route as a file for download (any role of the plan's company). */
export async function exportPlanRoute(user: SessionUser, id: number, format: RouteFileFormatName) {
  const plan = await findPlan(user, id)
  const waypoints = await loadWaypoints(id)
  // The time at each waypoint, for the schedule of formats that carry one (RTZ).
  const legs = waypoints.length > 1 ? computeLegTable(waypoints, plan.departureUtc, plan.speedKn).legs : []
  const times = legs.length ? [plan.departureUtc, ...legs.map(l => l.etaUtc)] : undefined
  return writeRouteFile(format, { ...plan, times }, waypoints)
}
