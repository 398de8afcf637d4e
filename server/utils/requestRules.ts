// What a request may carry, declared in one place: per-route body limits and kinds, the origin
// rule for writes, and whether the request came over HTTPS. Read by server/middleware/00–02.
import type { IncomingMessage } from 'node:http'
import type { H3Event } from 'h3'

const KB = 1024
const MB = 1024 * KB

/** `json`: application/json only. `upload`: multipart/form-data (a file field) or the file itself as text/csv. */
export type BodyKind = 'json' | 'upload'
export interface BodyRule { limitBytes: number, kind: BodyKind }

const JSON_DEFAULT: BodyRule = { limitBytes: 1 * MB, kind: 'json' }
/** Room for the multipart framing around a full-size file: boundaries, part headers, text fields. */
const MULTIPART_ALLOWANCE = 64 * KB

/**
 * Routes whose body differs from the default (JSON, 1 MB). `:x` matches one path segment; the
 * first match wins. Any other route under /api whose last segment is `import` is an upload of 2 MB.
 */
export const BODY_RULES: [pattern: string, rule: BodyRule][] = [
  ['POST /api/auth/login', { limitBytes: 16 * KB, kind: 'json' }],
  // 5,000 waypoints with names, notes and leg settings
  ['PUT /api/plans/:id/waypoints', { limitBytes: 6 * MB, kind: 'json' }],
  ['POST /api/land-check', { limitBytes: 6 * MB, kind: 'json' }],
  // zone outlines: GeoJSON text of up to 1.5 MB inside the JSON body
  ['POST /api/zones', { limitBytes: 3 * MB, kind: 'json' }],
  ['PUT /api/zones/:id', { limitBytes: 3 * MB, kind: 'json' }],
  // NMEA 0183 track logs of up to 50,000 sentences (about 4 MB)
  ['POST /api/plans/:id/reports/import', { limitBytes: 8 * MB + MULTIPART_ALLOWANCE, kind: 'upload' }],
  // route files and place CSVs: 2 MB
  ['POST /api/**/import', { limitBytes: 2 * MB + MULTIPART_ALLOWANCE, kind: 'upload' }],
]

const compiled = BODY_RULES.map(([pattern, rule]) => {
  const [method, path] = pattern.split(' ') as [string, string]
  const source = path.split('/').map(s => (s === '**' ? '.+' : s.startsWith(':') ? '[^/]+' : s.replace(/[.*+?^${}()|[\]\\]/g, '\\$&'))).join('/')
  return { method, re: new RegExp(`^${source}$`), rule }
})

const WRITES = new Set(['POST', 'PUT', 'PATCH', 'DELETE'])
export const isWrite = (method: string) => WRITES.has(method)

/** The body rule of a request: its route's entry in BODY_RULES, or JSON of at most 1 MB. */
export function bodyRuleFor(method: string, path: string): BodyRule {
  return compiled.find(c => c.method === method && c.re.test(path))?.rule ?? JSON_DEFAULT
}

/** Whether a content type is one the rule's kind accepts (parameters such as charset are ignored). */
export function acceptsContentType(kind: BodyKind, contentType: string): boolean {
  const type = contentType.split(';')[0]!.trim().toLowerCase()
  return kind === 'json' ? type === 'application/json' : type === 'multipart/form-data' || type === 'text/csv'
}

export function byteSizeText(n: number) {
  return n >= MB ? `${(n / MB).toFixed(n % MB ? 1 : 0)} MB` : `${Math.round(n / KB)} kB`
}

/** Reads the body as it streams, refusing it (413) as soon as it passes `limit` bytes, whatever the framing. */
export function readBodyWithin(req: IncomingMessage, limit: number, tooLarge: () => Error): Promise<Buffer> {
  return new Promise((resolve, reject) => {
    const chunks: Buffer[] = []
    let size = 0
    const done = () => { req.off('data', onData); req.off('end', onEnd); req.off('error', onError) }
    function onData(chunk: Buffer) {
      size += chunk.length
      if (size <= limit) return void chunks.push(chunk)
      done()
      chunks.length = 0
      req.resume() // the rest is discarded as it arrives, never kept
      reject(tooLarge())
    }
    function onEnd() { done(); resolve(Buffer.concat(chunks, size)) }
    function onError(error: Error) { done(); reject(error) }
    req.on('data', onData).on('end', onEnd).on('error', onError)
  })
}

const truthy = (v: unknown) => ['1', 'true', 'on', 'yes'].includes(String(v).toLowerCase())
// The process's runtime config (environment read once at start), never useRuntimeConfig(event): that
// copies the whole config and reads the environment for every key again, on every request.

/** True when the request came over TLS, or through a trusted proxy (`NUXT_TRUST_PROXY=on`) that says it did. */
export function isHttpsRequest(event: H3Event): boolean {
  if ((event.node.req.socket as { encrypted?: boolean }).encrypted) return true
  if (!truthy(useRuntimeConfig().trustProxy)) return false
  return (getRequestHeader(event, 'x-forwarded-proto') ?? '').split(',')[0]!.trim().toLowerCase() === 'https'
}

/**
 * A write from a browser must come from one of our own pages: its `Origin` (or, without one,
 * `Sec-Fetch-Site`) must be ours. Scripts and integrations send neither and pass on the cookie alone.
 */
export function isOwnOrigin(event: H3Event): boolean {
  const origin = getRequestHeader(event, 'origin')
  if (origin === undefined) {
    const site = getRequestHeader(event, 'sec-fetch-site')
    return site === undefined || site === 'same-origin'
  }
  const trusted = String(useRuntimeConfig().trustedOrigins || '').split(',').map(s => s.trim()).filter(Boolean)
  if (trusted.includes(origin)) return true
  let host: string
  try { host = new URL(origin).host }
  catch { return false }
  const own = getRequestHost(event, { xForwardedHost: truthy(useRuntimeConfig().trustProxy) })
  return origin !== 'null' && host.toLowerCase() === own.toLowerCase()
}

/** The 413 for a body beyond its route's limit. */
export function bodyTooLarge(limitBytes: number) {
  return createError({ statusCode: 413, statusMessage: `The request body is larger than ${byteSizeText(limitBytes)}, this route's limit` })
}

// Browsers drop a Secure cookie set over plain HTTP (a ship's network reached by address), so
// sign-in would silently fail; the attribute is removed from every cookie of a plain-HTTP answer.
export function sendCookiesWithoutSecure(event: H3Event) {
  const res = event.node.res
  const writeHead = res.writeHead
  res.writeHead = function (this: typeof res, ...args: Parameters<typeof writeHead>) {
    const cookies = res.getHeader('set-cookie')
    if (cookies !== undefined) res.setHeader('set-cookie', [cookies].flat().map(c => String(c).replace(/;\s*Secure(?=;|$)/gi, '')))
    return writeHead.apply(this, args)
  } as typeof writeHead
}
