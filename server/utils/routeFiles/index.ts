import { MAX_ROUTE_FILE_BYTES, RouteFileError } from './common'
import type { ParsedRouteFile, RouteFileFormat, RouteFileIssue, RouteFilePlan, RouteFileWaypoint } from './common'
import { parseRouteCsv, writeRouteCsv } from './csv'
import { parseRouteGpx, writeRouteGpx } from './gpx'
import { parseRouteRtz, writeRouteRtz } from './rtz'

// No re-exports here: Nitro auto-imports every file under server/utils, and a name exported
// from two files is reported as a duplicate. RouteFileError and the types live in ./common.

const extensionFormats: Record<string, RouteFileFormat | 'xml'> = { csv: 'csv', txt: 'csv', tsv: 'csv', gpx: 'gpx', rtz: 'rtz', xml: 'xml' }

function extensionOf(name: string) {
  const match = /\.([a-z0-9]+)$/i.exec(name.trim())
  return match ? match[1]!.toLowerCase() : ''
}

/** Text from the uploaded bytes: BOM first, then the XML declaration's encoding, then UTF-8, else Windows-1252 (old spreadsheet exports). */
function decodeRouteBytes(bytes: Buffer, warnings: RouteFileIssue[]): string {
  if (bytes[0] === 0xEF && bytes[1] === 0xBB && bytes[2] === 0xBF) return decodeWith('utf-8', bytes.subarray(3))
  if (bytes[0] === 0xFF && bytes[1] === 0xFE) return decodeWith('utf-16le', bytes.subarray(2))
  if (bytes[0] === 0xFE && bytes[1] === 0xFF) return decodeWith('utf-16be', bytes.subarray(2))
  const declared = /^\s*<\?xml[^>]*\bencoding\s*=\s*["']([A-Za-z0-9._-]+)["']/.exec(bytes.subarray(0, 200).toString('latin1'))?.[1]
  if (declared && !/^utf-?8$/i.test(declared)) return decodeWith(declared, bytes)
  try {
    return new TextDecoder('utf-8', { fatal: true }).decode(bytes)
  }
  catch {
    warnings.push({ message: 'the file is not UTF-8; it was read as Windows-1252 (check names with accents)' })
    return decodeWith('windows-1252', bytes)
  }
}

function decodeWith(label: string, bytes: Uint8Array): string {
  try {
    return new TextDecoder(label, { fatal: true }).decode(bytes)
  }
  catch {
    throw new RouteFileError('unreadable', `the file cannot be read as ${label} text`)
  }
}

/** Root element of an XML text, without its namespace prefix. */
function xmlRootName(text: string): string | undefined {
  const body = text.replace(/<\?[\s\S]*?\?>|<!--[\s\S]*?-->/g, '')
  return /<(?![?!])(?:[\w.-]+:)?([\w.-]+)/.exec(body)?.[1]
}

/** CSV, GPX or RTZ: XML files by their root element, others by extension and content type. */
export function detectRouteFileFormat(name: string, contentType: string | undefined, text: string): RouteFileFormat {
  const extension = extensionOf(name)
  if (extension === 'rtzp')
    throw new RouteFileError('unsupported-format', 'RTZP files (zipped RTZ) are not read: unzip it and upload the .rtz file inside')
  const byExtension = extensionFormats[extension]
  if (extension !== '' && !byExtension)
    throw new RouteFileError('unsupported-format', `'.${extension}' files are not route files: upload CSV, GPX or RTZ`)
  const type = (contentType ?? '').toLowerCase()
  const looksXml = text.trimStart().startsWith('<')
  if (looksXml) {
    const root = xmlRootName(text)
    if (root === 'gpx') return 'gpx'
    if (root === 'route') return 'rtz'
    if (byExtension === 'gpx' || byExtension === 'rtz') return byExtension
    throw new RouteFileError('unsupported-format', `an XML file with root <${root ?? '?'}> is neither a GPX route nor an RTZ route`)
  }
  if (byExtension === 'gpx' || byExtension === 'rtz' || byExtension === 'xml' || (!byExtension && /xml/.test(type)))
    throw new RouteFileError('malformed', `the file is named or sent as XML (${byExtension ?? type}) but does not start with an XML element`)
  return 'csv'
}

const readers: Record<RouteFileFormat, (text: string) => ParsedRouteFile> = { csv: parseRouteCsv, gpx: parseRouteGpx, rtz: parseRouteRtz }

/**
 * Reads an uploaded route file. Whole-file failures (too large → 413; empty, binary, wrong type,
 * malformed or unsafe XML, missing columns, too many waypoints → 400) throw `RouteFileError`;
 * problems with single waypoints come back in `errors`, each with its line or element.
 */
export function parseRouteFile(name: string, contentType: string | undefined, bytes: Buffer): ParsedRouteFile {
  if (bytes.length > MAX_ROUTE_FILE_BYTES)
    throw new RouteFileError('too-large', `the file is ${(bytes.length / 1048576).toFixed(1)} MB; route files may be at most ${MAX_ROUTE_FILE_BYTES / 1048576} MB`)
  const warnings: RouteFileIssue[] = []
  const text = decodeRouteBytes(bytes, warnings)
  if (text.trim() === '') throw new RouteFileError('empty', 'the file is empty')
  if (text.includes('\u0000')) throw new RouteFileError('unsupported-format', 'this is not a text file: upload CSV, GPX or RTZ')
  const format = detectRouteFileFormat(name, contentType, text)
  let parsed: ParsedRouteFile
  try {
    parsed = readers[format](text)
  }
  catch (error) {
    if (error instanceof RouteFileError || !(error instanceof Error)) throw error
    throw new RouteFileError('malformed', `the ${format.toUpperCase()} file cannot be read: ${error.message}`)
  }
  return { ...parsed, warnings: [...warnings, ...parsed.warnings] }
}

const writers: Record<RouteFileFormat, (plan: RouteFilePlan, waypoints: readonly RouteFileWaypoint[]) => string> = {
  csv: writeRouteCsv, gpx: writeRouteGpx, rtz: writeRouteRtz,
}

const contentTypes: Record<RouteFileFormat, string> = {
  csv: 'text/csv; charset=utf-8',
  gpx: 'application/gpx+xml; charset=utf-8',
  rtz: 'application/xml; charset=utf-8',
}

/** A route file for download: body, content type and a file name made from the plan's title. */
export function writeRouteFile(format: RouteFileFormat, plan: RouteFilePlan, waypoints: readonly RouteFileWaypoint[]) {
  const base = (plan.title ?? '').normalize('NFKD').replace(/[\u0300-\u036F]/g, '').replace(/[^\w.-]+/g, '-').replace(/^-+|-+$/g, '').slice(0, 80) || 'route'
  return { body: writers[format](plan, waypoints), contentType: contentTypes[format], fileName: `${base}.${format}` }
}
