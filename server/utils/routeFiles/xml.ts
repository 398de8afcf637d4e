import { XMLParser, XMLValidator } from 'fast-xml-parser'
import { RouteFileError } from './common'

export type RouteXmlNode = Record<string, unknown>

/** Refuses DTDs outright: no external entities, no entity expansion (the "billion laughs" bomb). */
export function assertSafeRouteXml(text: string) {
  const match = /<!(DOCTYPE|ENTITY)/i.exec(text)
  if (match) {
    const line = lineAt(text, match.index)
    throw new RouteFileError('unsafe-xml',
      `line ${line}: the file declares a ${match[1]!.toUpperCase()}; route files with DTDs or entity declarations are refused (no external entities, no entity expansion)`,
      { line, message: `${match[1]!.toUpperCase()} declarations are not accepted` })
  }
}

const predefined: Record<string, string> = { amp: '&', lt: '<', gt: '>', quot: '"', apos: '\'' }

/** The five predefined XML entities and character references; nothing else is expanded (XML 1.0 §4.1, §4.6). */
export function decodeRouteXmlText(text: string): string {
  if (!text.includes('&')) return text
  return text.replace(/&(#x[0-9a-f]+|#\d+|[a-z]+);/gi, (whole, ref: string) => {
    if (ref[0] !== '#') return predefined[ref] ?? whole
    const code = ref[1] === 'x' || ref[1] === 'X' ? Number.parseInt(ref.slice(2), 16) : Number.parseInt(ref.slice(1), 10)
    return code > 0 && code <= 0x10FFFF ? String.fromCodePoint(code) : whole
  })
}

// Characters XML 1.0 does not allow at all (§2.2); they are dropped from what we write.
const invalidXmlChars = /[\u0000-\u0008\u000B\u000C\u000E-\u001F\uFFFE\uFFFF]/g

/** Escapes text content. */
export function escapeRouteXmlText(text: string): string {
  return text.replace(invalidXmlChars, '').replace(/&/g, '&amp;').replace(/</g, '&lt;').replace(/>/g, '&gt;')
}

/** Escapes an attribute value; tabs and line ends become character references so that they survive attribute normalisation (XML 1.0 §3.3.3). */
export function escapeRouteXmlAttr(text: string): string {
  return escapeRouteXmlText(text).replace(/"/g, '&quot;').replace(/'/g, '&apos;')
    .replace(/\t/g, '&#9;').replace(/\n/g, '&#10;').replace(/\r/g, '&#13;')
}

const metaSymbol = XMLParser.getMetaDataSymbol() as unknown as string

export interface RouteXmlDocument {
  root: RouteXmlNode
  rootName: string
  /** The line on which an element starts, when the parser recorded it. */
  lineOf: (node: unknown) => number | undefined
}

/**
 * Well-formedness check, then a parse with entity processing off. Element names lose their
 * namespace prefix; attributes are `@name`; text of an element with attributes is `#text`.
 */
export function parseRouteXml(text: string, arrays: ReadonlySet<string>): RouteXmlDocument {
  assertSafeRouteXml(text)
  const valid = XMLValidator.validate(text)
  if (valid !== true) {
    const { line, msg } = valid.err
    throw new RouteFileError('malformed', `line ${line}: the XML is not well formed: ${msg}`, { line, message: msg })
  }
  const parser = new XMLParser({
    ignoreAttributes: false,
    attributeNamePrefix: '@',
    removeNSPrefix: true,
    processEntities: false,
    htmlEntities: false,
    parseTagValue: false,
    parseAttributeValue: false,
    ignoreDeclaration: true,
    ignorePiTags: true,
    captureMetaData: true,
    isArray: (_name, jPath) => arrays.has(String(jPath)),
    tagValueProcessor: (_name, value) => decodeRouteXmlText(value),
    attributeValueProcessor: (_name, value) => decodeRouteXmlText(value),
  })
  const doc = parser.parse(text) as RouteXmlNode
  const rootName = Object.keys(doc).find(k => !k.startsWith('#') && !k.startsWith('@'))
  const root = rootName ? doc[rootName] : undefined
  if (!rootName || typeof root !== 'object' || root === null)
    throw new RouteFileError('no-route', 'the XML holds no route element')

  const newlines: number[] = []
  for (let i = text.indexOf('\n'); i !== -1; i = text.indexOf('\n', i + 1)) newlines.push(i)
  const lineOf = (node: unknown) => {
    const meta = node && typeof node === 'object' ? (node as Record<string, { startIndex?: number }>)[metaSymbol] : undefined
    return meta?.startIndex === undefined ? undefined : lineFromNewlines(newlines, meta.startIndex)
  }
  return { root: root as RouteXmlNode, rootName, lineOf }
}

function lineFromNewlines(newlines: number[], index: number): number {
  let lo = 0
  let hi = newlines.length
  while (lo < hi) {
    const mid = (lo + hi) >> 1
    if (newlines[mid]! < index) lo = mid + 1
    else hi = mid
  }
  return lo + 1
}

function lineAt(text: string, index: number): number {
  let line = 1
  for (let i = text.indexOf('\n'); i !== -1 && i < index; i = text.indexOf('\n', i + 1)) line++
  return line
}

/** Child elements of a node as a list, whether the parser gave one, many or none. */
export function routeXmlChildren(node: unknown, name: string): RouteXmlNode[] {
  if (!node || typeof node !== 'object') return []
  const value = (node as RouteXmlNode)[name]
  const list = Array.isArray(value) ? value : value === undefined ? [] : [value]
  return list.map(v => (v && typeof v === 'object' ? v as RouteXmlNode : { '#text': String(v) }))
}

/** The first child element of that name, or undefined. */
export function routeXmlChild(node: unknown, name: string): RouteXmlNode | undefined {
  return routeXmlChildren(node, name)[0]
}

/** The text of a child element (`<name>text</name>`), or undefined. */
export function routeXmlChildText(node: unknown, name: string): string | undefined {
  if (!node || typeof node !== 'object') return undefined
  const value = (node as RouteXmlNode)[name]
  const first = Array.isArray(value) ? value[0] : value
  if (first === undefined || first === null) return undefined
  if (typeof first === 'object') {
    const text = (first as RouteXmlNode)['#text']
    return text === undefined ? '' : String(text)
  }
  return String(first)
}

/** An attribute's value, or undefined. */
export function routeXmlAttr(node: unknown, name: string): string | undefined {
  if (!node || typeof node !== 'object') return undefined
  const value = (node as RouteXmlNode)[`@${name}`]
  return value === undefined ? undefined : String(value)
}
