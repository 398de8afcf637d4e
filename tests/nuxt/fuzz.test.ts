// 10,000+ malformed requests across every JSON route: never a 5xx, always a 4xx with a message,
// and the database exactly as it was (row counts and checksums of every table). Runs on a
// scratch database of its own so other test files cannot change the fingerprint.
import { describe, expect, it } from 'vitest'
import type { Role } from '#shared/types/auth'
import { createScratchDatabase, tableFingerprints } from '../support/database'
import { client, loginAs, startServer, url, type Api } from '../support/server'
import { listApiRoutes, routePath } from '../support/apiRoutes'
import { BODYLESS, RULES, pathIds } from '../support/accessRules'
import { seededRandom } from '../unit/support/random'

const databaseUrl = await createScratchDatabase('passagewright_fuzz')
await startServer({ NUXT_DATABASE_URL: databaseUrl })

const MB_STRING = 'x'.repeat(1_000_000)
const deep = (n: number) => `${'{"a":'.repeat(n)}1${'}'.repeat(n)}`
const WEIRD_VALUES: unknown[] = [null, true, 0, -1, 1e308, -1e308, 9007199254740993, 'NaN', 'Infinity', '-Infinity', '', ' ', '1e999', [], {}, [[[]]], 'ΔΨ', '\u0000', { $gt: '' }, '__proto__']

interface Malformed { body?: BodyInit, contentType?: string, kind: string }

function malformed(rand: () => number, i: number): Malformed {
  const pick = <T>(xs: T[]) => xs[Math.floor(rand() * xs.length)]!
  const value = () => pick(WEIRD_VALUES)
  const nonString = () => pick(WEIRD_VALUES.filter(v => typeof v !== 'string' || v === '\u0000'))
  switch (i % 12) {
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
    default: return i % 100 === 11 ? { kind: '1 MB string', body: JSON.stringify({ name: MB_STRING, title: MB_STRING, email: MB_STRING, remarks: MB_STRING }), contentType: 'application/json' } : { kind: 'arrays of junk', body: JSON.stringify(Array.from({ length: 50 }, value)), contentType: 'application/json' }
  }
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
        const res = await fetch(url(routePath(route, pathIds(route.pattern, rule, ids, 0))), { method: route.method, headers, body: m.body })
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
  })
})
