// Reading a zone's GeoJSON (RFC 7946: a Feature, a FeatureCollection, or a bare Polygon or
// MultiPolygon geometry) into polygon coordinates, with every problem tied to the line of the
// uploaded text it is on. jsonc-parser (the JSON scanner of VS Code) gives each value's offset.
import { parseTree, printParseErrorCode, type Node, type ParseError } from 'jsonc-parser'
import type { ZonePolygons } from './types'
import { checkZoneRings } from './ringCheck'

export const ZONE_LIMITS = { maxChars: 1_500_000, maxVertices: 20_000, maxPolygons: 200, maxRingVertices: 10_000, maxIssues: 20, maxAbsLat: 89 }

export interface GeoJsonIssue { line: number, message: string }
export interface ZoneGeoJsonRead { polygons: ZonePolygons, vertexCount: number, issues: GeoJsonIssue[] }

class Lines {
  private starts: number[] = [0]
  constructor(text: string) { for (let i = 0; i < text.length; i++) if (text.charCodeAt(i) === 10) this.starts.push(i + 1) }
  /** 1-based line of a character offset (binary search over line starts). */
  at(offset: number): number {
    let lo = 0
    let hi = this.starts.length - 1
    while (lo < hi) {
      const mid = (lo + hi + 1) >> 1
      if (this.starts[mid]! <= offset) lo = mid
      else hi = mid - 1
    }
    return lo + 1
  }
}

const prop = (node: Node | undefined, key: string): Node | undefined =>
  node?.type === 'object' ? node.children?.find(p => p.children?.[0]?.value === key)?.children?.[1] : undefined

interface Reader { lines: Lines, issues: GeoJsonIssue[], polygons: ZonePolygons, positionLines: number[][][], vertices: number }

function issue(r: Reader, node: Node | undefined, message: string) {
  if (r.issues.length < ZONE_LIMITS.maxIssues) r.issues.push({ line: node ? r.lines.at(node.offset) : 1, message })
}

function readPosition(r: Reader, node: Node, where: string): [number, number] | null {
  const parts = node.type === 'array' ? node.children ?? [] : []
  if (parts.length < 2 || parts.some(p => p.type !== 'number')) { issue(r, node, `${where}: a position is [longitude, latitude] in numbers`); return null }
  const [lon, lat] = [parts[0]!.value as number, parts[1]!.value as number]
  if (!(Math.abs(lon) <= 180)) { issue(r, node, `${where}: longitude ${lon} is outside −180..180`); return null }
  if (!(Math.abs(lat) <= ZONE_LIMITS.maxAbsLat)) { issue(r, node, `${where}: latitude ${lat} is outside −${ZONE_LIMITS.maxAbsLat}..${ZONE_LIMITS.maxAbsLat} (zones may not reach the poles)`); return null }
  return [lon, lat]
}

function readRing(r: Reader, node: Node, where: string): { ring: [number, number][], lines: number[] } | null {
  const items = node.type === 'array' ? node.children ?? [] : []
  if (node.type !== 'array') { issue(r, node, `${where}: a ring is an array of positions`); return null }
  if (items.length > ZONE_LIMITS.maxRingVertices) { issue(r, node, `${where} has ${items.length} positions; a ring may have at most ${ZONE_LIMITS.maxRingVertices}`); return null }
  const ring: [number, number][] = []
  const lines: number[] = []
  items.forEach((p, i) => {
    const pos = readPosition(r, p, `${where}, position ${i + 1}`)
    if (pos) { ring.push(pos); lines.push(r.lines.at(p.offset)) }
  })
  if (ring.length !== items.length) return null
  if (ring.length < 4) { issue(r, node, `${where} has ${ring.length} positions; a closed ring needs at least 4 (the last repeating the first)`); return null }
  const [first, last] = [ring[0]!, ring[ring.length - 1]!]
  if (first[0] !== last[0] || first[1] !== last[1]) { issue(r, items[items.length - 1], `${where} is not closed: its last position [${last.join(', ')}] should repeat the first [${first.join(', ')}]`); return null }
  return { ring, lines }
}

function readPolygon(r: Reader, node: Node | undefined, where: string) {
  if (!node || node.type !== 'array' || !node.children?.length) { issue(r, node, `${where}: coordinates must be an array of rings (outer ring first, then holes)`); return }
  if (r.polygons.length >= ZONE_LIMITS.maxPolygons) { issue(r, node, `more than ${ZONE_LIMITS.maxPolygons} polygons in one zone`); return }
  const rings: [number, number][][] = []
  const lines: number[][] = []
  node.children.forEach((ringNode, i) => {
    const read = readRing(r, ringNode, `${where}, ${i === 0 ? 'outer ring' : `hole ${i}`}`)
    if (read) { rings.push(read.ring); lines.push(read.lines); r.vertices += read.ring.length }
  })
  if (rings.length === node.children.length) { r.polygons.push(rings); r.positionLines.push(lines) }
}

function readGeometry(r: Reader, node: Node | undefined, where: string) {
  const type = prop(node, 'type')?.value
  const coords = prop(node, 'coordinates')
  if (type === 'Polygon') readPolygon(r, coords, `${where}polygon ${r.polygons.length + 1}`)
  else if (type === 'MultiPolygon') {
    if (coords?.type !== 'array') return issue(r, node, `${where}MultiPolygon: coordinates must be an array of polygons`)
    for (const p of coords.children ?? []) readPolygon(r, p, `${where}polygon ${r.polygons.length + 1}`)
  }
  else issue(r, node, `${where}geometry type ${JSON.stringify(type ?? null)}: a zone is a Polygon or MultiPolygon`)
}

/** Reads and checks a zone's GeoJSON text; `issues` lists every problem with its line (nothing is usable when there are any). */
export function readZoneGeoJson(text: string): ZoneGeoJsonRead {
  const r: Reader = { lines: new Lines(text), issues: [], polygons: [], positionLines: [], vertices: 0 }
  const empty = (issues: GeoJsonIssue[]) => ({ polygons: [], vertexCount: 0, issues })
  if (text.length > ZONE_LIMITS.maxChars) return empty([{ line: 1, message: `the file is ${(text.length / 1e6).toFixed(1)} MB; a zone's GeoJSON may be at most ${ZONE_LIMITS.maxChars / 1e6} MB` }])
  const errors: ParseError[] = []
  const root = parseTree(text, errors, { disallowComments: true, allowTrailingComma: false })
  if (errors.length || !root) return empty(errors.slice(0, 5).map(e => ({ line: r.lines.at(e.offset), message: `not valid JSON (${printParseErrorCode(e.error)})` })).concat(errors.length ? [] : [{ line: 1, message: 'the file is empty' }]))
  const type = prop(root, 'type')?.value
  if (type === 'FeatureCollection') {
    const features = prop(root, 'features')
    if (features?.type !== 'array' || !features.children?.length) issue(r, features ?? root, 'a FeatureCollection needs a non-empty "features" array')
    features?.children?.forEach((f, i) => {
      if (prop(f, 'type')?.value !== 'Feature') return issue(r, f, `feature ${i + 1}: "type" must be "Feature"`)
      readGeometry(r, prop(f, 'geometry'), `feature ${i + 1}, `)
    })
  }
  else if (type === 'Feature') readGeometry(r, prop(root, 'geometry'), '')
  else if (type === 'Polygon' || type === 'MultiPolygon') readGeometry(r, root, '')
  else issue(r, root, `"type" ${JSON.stringify(type ?? null)}: send a Feature, a FeatureCollection, a Polygon or a MultiPolygon`)
  if (r.vertices > ZONE_LIMITS.maxVertices) issue(r, root, `the zone has ${r.vertices} positions; at most ${ZONE_LIMITS.maxVertices}`)
  if (r.issues.length === 0 && r.polygons.length === 0) issue(r, root, 'the file holds no polygon')
  if (r.issues.length === 0) r.issues.push(...checkZoneRings(r.polygons, r.positionLines).slice(0, ZONE_LIMITS.maxIssues))
  return r.issues.length ? empty(r.issues) : { polygons: r.polygons, vertexCount: r.vertices, issues: [] }
}
