// 10,000+ malformed requests across every JSON route: never a 5xx, always a 4xx with a message,
// and the database exactly as it was (row counts and checksums of every table). Among them:
// chunked bodies, NULs sent as octet-stream, ids beyond PostgreSQL's 32-bit integer. Then
// identical requests eight at a time on every write route: never a 5xx. Runs on a scratch
// database of its own so other test files cannot change the fingerprint.
import { describe, expect, it } from 'vitest'
import type { Role } from '#shared/types/auth'
import { createScratchDatabase, tableFingerprints } from '../support/database'
import { client, loginAs, startServer, url, type Api } from '../support/server'
import { listApiRoutes, routePath } from '../support/apiRoutes'
import { BODYLESS, RULES, pathIds } from '../support/accessRules'
import { seededRandom } from '../unit/support/random'

const databaseUrl = await createScratchDatabase('passagewright_fuzz')
await startServer({ NUXT_DATABASE_URL: databaseUrl })

// 10,200 requests take about two minutes on a busy 2-core machine; room for a busier one.
const FUZZ_TIMEOUT_MS = 600_000
const MB_STRING = 'x'.repeat(1_000_000)
const deep = (n: number) => `${'{"a":'.repeat(n)}1${'}'.repeat(n)}`
const WEIRD_VALUES: unknown[] = [null, true, 0, -1, 1e308, -1e308, 9007199254740993, 'NaN', 'Infinity', '-Infinity', '', ' ', '1e999', [], {}, [[[]]], 'ΔΨ', '\u0000', { $gt: '' }, '__proto__']

interface Malformed { body?: BodyInit, contentType?: string, kind: string, chunked?: boolean, bigIds?: boolean }

// PostgreSQL `integer` ends at 2^31 − 1 (PostgreSQL manual, 8.1.1 Integer Types); 2^53 + 1 is not a safe JavaScript integer.
const BEYOND_32_BITS = [2_147_483_648, 4_294_967_296, 9_007_199_254_740_993, 1e15]
const ID_FIELDS = ['vesselId', 'version', 'masterUserId', 'departurePlaceId', 'arrivalPlaceId', 'id']

/** The route's well-formed body with every id in it (and every id the fuzz adds) beyond 32 bits. */
function withBigIds(body: unknown, big: number): unknown {
  const base = body && typeof body === 'object' && !Array.isArray(body) ? { ...body as Record<string, unknown> } : {}
  for (const f of ID_FIELDS) base[f] = big
  base.placeIds = [1, big]
  return base
}

function malformed(rand: () => number, i: number): Malformed {
  const pick = <T>(xs: T[]) => xs[Math.floor(rand() * xs.length)]!
  const value = () => pick(WEIRD_VALUES)
  const nonString = () => pick(WEIRD_VALUES.filter(v => typeof v !== 'string' || v === '\u0000'))
  switch (i % 16) {
    case 0: return { kind: 'wrong top-level type', body: JSON.stringify(value()), contentType: 'application/json' }
    case 1: return { kind: 'missing fields', body: '{}', contentType: 'application/json' }
    case 2: return { kind: 'wrong field types', body: JSON.stringify({ from: value(), to: value(), lat: value(), lon: value(), waypoints: value(), version: value(), name: nonString(), email: nonString(), password: nonString(), vesselId: value(), speedKn: value(), placeIds: value(), reserve: value(), remarks: nonString(), points: value(), crew: pick([null, 'crew', 1, {}, [[]], [{}], [{ name: 1 }]]) }), contentType: 'application/json' }
    case 3: return { kind: 'huge numbers', body: JSON.stringify({ version: 1e308, waypoints: [{ lat: 1e308, lon: -1e308 }, { lat: 91, lon: 0 }], from: { lat: 1e308, lon: 0 }, to: { lat: 0, lon: 1e308 }, speedKn: 1e308, distanceM: 1e308, course: 1e308 }), contentType: 'application/json' }
    case 4: return { kind: 'NaN and Infinity as strings', body: JSON.stringify({ from: { lat: 'NaN', lon: 'Infinity' }, to: { lat: '-Infinity', lon: 'NaN' }, version: 'NaN', speedKn: 'Infinity', waypoints: [{ lat: 'NaN', lon: 'NaN' }] }), contentType: 'application/json' }
    case 5: return { kind: 'deep nesting', body: deep(500 + Math.floor(rand() * 3000)), contentType: 'application/json' }
    case 6: return { kind: 'malformed JSON', body: pick(['{', '{"a":', '[1,2', '{"a":1,}', 'nul', '{"from":{"lat":1e}}', '\u001f\u008b']), contentType: 'application/json' }
    case 7: return { kind: 'invalid UTF-8', body: Buffer.from([0x7b, 0x22, 0x61, 0x22, 0x3a, 0x22, 0xff, 0xfe, 0xc3, 0x28, 0x22, 0x7d]), contentType: 'application/json; charset=utf-8' }
    case 8: return { kind: 'wrong content type', body: pick(['lat=1&lon=2', '<plan/>', 'just text']), contentType: pick(['text/plain', 'application/xml', 'application/x-www-form-urlencoded', 'image/png']) }
    case 9: return { kind: 'extra and unknown fields', body: JSON.stringify({ constructor: { prototype: { admin: true } }, __proto__: { role: 'admin' }, role: 'admin', companyId: 2, id: 1, status: 'approved', extra: value() }), contentType: 'application/json' }
    case 10: return { kind: 'no body', contentType: pick(['application/json', '']) }
    case 12: return { kind: 'chunked JSON', chunked: true, body: pick([deep(200), '{"name":"chunk', JSON.stringify({ version: value(), name: nonString(), waypoints: [{ lat: value(), lon: value() }] })]), contentType: 'application/json' }
    case 13: return { kind: 'NULs as octet-stream', body: Buffer.from(`{"name":"a\u0000b"}\u0000\u0000${'\u0000'.repeat(Math.floor(rand() * 64))}`), contentType: pick(['application/octet-stream', 'application/json']), chunked: rand() < 0.5 }
    case 14: return { kind: 'ids beyond 32 bits', bigIds: true, contentType: 'application/json' }
    case 15: return { kind: 'chunked NULs', chunked: true, body: Buffer.from([0x7b, 0x22, 0x61, 0x22, 0x3a, 0x22, 0x00, 0x22, 0x7d]), contentType: pick(['application/json', 'application/octet-stream', 'text/csv']) }
    default: return i % 100 === 11 ? { kind: '1 MB string', body: JSON.stringify({ name: MB_STRING, title: MB_STRING, email: MB_STRING, remarks: MB_STRING }), contentType: 'application/json' } : { kind: 'arrays of junk', body: JSON.stringify(Array.from({ length: 50 }, value)), contentType: 'application/json' }
  }
}

function chunkedStream(bytes: Buffer): ReadableStream<Uint8Array> {
  const half = Math.ceil(bytes.length / 2)
  return new ReadableStream({
    start(controller) {
      controller.enqueue(bytes.subarray(0, half))
      controller.enqueue(bytes.subarray(half))
      controller.close()
    },
  })
}

describe('fuzzing every JSON route', () => {
  it('answers 10,000+ malformed requests with a 4xx and a message, and changes nothing stored', async () => {
    const users: Record<Role, Api> = { planner: await loginAs('planner'), master: await loginAs('master'), shore: await loginAs('shore'), admin: await loginAs('admin') }
    const ids = {
      plan: (await users.planner.request('/api/plans')).body[0].id,
      place: (await users.planner.request('/api/places')).body[0].id,
      vessel: (await users.planner.request('/api/vessels')).body[0].id,
      table: 1,
      zone: (await users.planner.request('/api/zones')).body[0].id,
    }
    const targets = listApiRoutes().filter(r => (r.method === 'POST' || r.method === 'PUT') && !BODYLESS.has(r.key) && RULES[r.key])
    expect(targets.length).toBeGreaterThan(15)
    const before = await tableFingerprints(databaseUrl)

    const rand = seededRandom(20261201)
    const TOTAL = 10_200
    const failures: string[] = []
    const counts: Record<number, number> = {}
    let next = 0
    async function worker() {
      while (next < TOTAL) {
        const i = next++
        const route = targets[i % targets.length]!
        const rule = RULES[route.key]!
        const role = rule.roles === 'open' ? undefined : rule.roles[i % rule.roles.length]!
        const m = malformed(rand, Math.floor(i / targets.length))
        const headers: Record<string, string> = role ? { cookie: users[role].cookie } : {}
        if (m.contentType) headers['content-type'] = m.contentType
        const big = BEYOND_32_BITS[i % BEYOND_32_BITS.length]!
        let body = m.body
        if (m.bigIds) body = JSON.stringify(withBigIds(typeof rule.body === 'function' ? undefined : rule.body, big))
        // A stream has no length: fetch sends it with Transfer-Encoding: chunked, in two pieces.
        if (m.chunked && body !== undefined) body = chunkedStream(Buffer.from(body as string | Buffer))
        const path = routePath(route, m.bigIds ? big : pathIds(route.pattern, rule, ids, 0))
        const res = await fetch(url(path), { method: route.method, headers, body, ...(m.chunked ? { duplex: 'half' } : {}) } as RequestInit)
        const text = await res.text()
        counts[res.status] = (counts[res.status] ?? 0) + 1
        let message = ''
        try { message = JSON.parse(text).message }
        catch {}
        if (res.status < 400 || res.status >= 500 || !message)
          failures.push(`${route.key} [${m.kind}] → ${res.status} ${text.slice(0, 120)}`)
      }
    }
    await Promise.all(Array.from({ length: 16 }, worker))
    console.log('fuzz statuses:', counts)
    expect(failures.slice(0, 20)).toEqual([])
    expect(Object.values(counts).reduce((a, b) => a + b, 0)).toBe(TOTAL)

    expect(await tableFingerprints(databaseUrl)).toEqual(before)
    expect((await client().request('/api/health')).status).toBe(200)
  }, FUZZ_TIMEOUT_MS)
})

// Well-formed bodies for the write routes whose access rule gives none; with the rule's own bodies,
// eight identical copies of each request go at once (the same name, the same version, the same
// approval), as double clicks and retries do.
const CREATE_BODIES: Record<string, (vesselId: number, placeIds: number[]) => unknown> = {
  'POST /api/places': () => ({ name: 'Fuzz twin harbour', kind: 'port', lat: 12.5, lon: 45.5 }),
  'POST /api/zones': () => ({ name: 'Fuzz twin zone', kind: 'custom', geojson: { type: 'Polygon', coordinates: [[[-30, 40], [-29, 40], [-29, 41], [-30, 41], [-30, 40]]] } }),
  'POST /api/admin/users': () => ({ name: 'Fuzz twin', email: 'fuzz.twin@kestrel-bight.example', role: 'planner', password: 'fuzz-twin-password' }),
  'POST /api/plans': vesselId => ({ vesselId, title: 'Fuzz twin plan', departureUtc: '2027-03-01T06:00:00Z', speedKn: 12 }),
  'POST /api/tables': (_v, placeIds) => ({ name: 'Fuzz twin table', placeIds: placeIds.slice(0, 3) }),
}

const UNIQUE_NAMES = new Set(['POST /api/places', 'POST /api/zones', 'POST /api/admin/users'])

describe('identical requests eight at a time', () => {
  it('never answer 5xx on any write route', async () => {
    const users: Record<Role, Api> = { planner: await loginAs('planner'), master: await loginAs('master'), shore: await loginAs('shore'), admin: await loginAs('admin') }
    const vesselId = (await users.planner.request('/api/vessels')).body.find((v: { name: string }) => v.name === 'Kestrel Dawn').id
    const placeIds = (await users.planner.request('/api/places')).body.map((p: { id: number }) => p.id)
    const plan = (await users.planner.request('/api/plans', { method: 'POST', body: CREATE_BODIES['POST /api/plans']!(vesselId, placeIds) })).body.id
    await users.planner.request(`/api/plans/${plan}/waypoints`, { method: 'PUT', body: { version: 1, waypoints: [{ lat: 52, lon: 3.9 }, { lat: 52.6, lon: 3.4 }] } })
    const ids = {
      plan,
      place: placeIds[0],
      vessel: vesselId,
      table: (await users.shore.request('/api/tables', { method: 'POST', body: { name: 'Fuzz twin source', placeIds: placeIds.slice(0, 2) } })).body.id,
      zone: (await users.planner.request('/api/zones')).body[0].id,
    }
    const targets = listApiRoutes().filter(r => r.method !== 'GET' && r.key !== 'POST /api/auth/logout' && RULES[r.key])
    const failures: string[] = []
    for (const route of targets) {
      const rule = RULES[route.key]!
      const role = rule.roles === 'open' ? undefined : rule.roles.includes('master') && route.key.endsWith('/approve') ? 'master' : rule.roles[0]!
      const make = CREATE_BODIES[route.key]
      const body = make ? make(vesselId, placeIds) : rule.body
      const answers = await Promise.all(Array.from({ length: 8 }, async () => {
        const init = typeof body === 'function' ? { rawBody: (body as () => FormData)() } : { body: body ?? (BODYLESS.has(route.key) ? undefined : {}) }
        const api = role ? users[role] : client()
        return api.request(`${routePath(route, pathIds(route.pattern, rule, ids, 0))}${rule.query ?? ''}`, { method: route.method, ...init })
      }))
      for (const a of answers) if (a.status >= 500) failures.push(`${route.key} → ${a.status} ${JSON.stringify(a.body).slice(0, 120)}`)
      if (make) expect(answers.filter(a => a.status === 201).length, `${route.key}: created`).toBeGreaterThanOrEqual(1)
      // Names unique in the company (places, zones) and e-mail addresses: one created, the others 409.
      if (UNIQUE_NAMES.has(route.key)) expect(answers.map(a => a.status).sort(), route.key).toEqual([201, 409, 409, 409, 409, 409, 409, 409])
    }
    expect(failures).toEqual([])
    expect((await client().request('/api/health')).status).toBe(200)
  }, FUZZ_TIMEOUT_MS)
})
