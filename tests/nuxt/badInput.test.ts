// Input that once reached PostgreSQL and came back as a 500: ids beyond its 32-bit integer,
// values its numeric(…, 2) columns round to 0, dates outside what it or the product takes, NULs,
// and races of identical creations on unique names. Each is a 4xx naming the field, or a 409.
import { beforeAll, describe, expect, it } from 'vitest'
import { type Api, loginAs, startServer, url } from '../support/server'
import { expectStatus, makePlan, vesselIdNamed } from '../support/records'

await startServer()

// PostgreSQL `integer` ends at 2^31 − 1 (PostgreSQL manual, 8.1.1 Integer Types).
const BEYOND_INT = 2_147_483_648

let planner: Api
let shore: Api
let admin: Api
let vesselId: number
let planId: number

beforeAll(async () => {
  planner = await loginAs('planner')
  shore = await loginAs('shore')
  admin = await loginAs('admin')
  vesselId = await vesselIdNamed(planner, 'Kestrel Dawn')
  planId = await makePlan('draft', { planner })
})

function expectFieldRefusal(res: { status: number, body: any }, field: string) {
  expect(res.status, JSON.stringify(res.body)).toBeGreaterThanOrEqual(400)
  expect(res.status, JSON.stringify(res.body)).toBeLessThan(500)
  expect(res.body.message).toMatch(new RegExp(`(^|; )${field.replace(/\./g, '\\.')}: `))
}

describe('ids beyond PostgreSQL integer', () => {
  it.each([
    ['GET', `/api/vessels/${BEYOND_INT}`], ['GET', `/api/tables/${BEYOND_INT}`], ['PUT', `/api/places/${BEYOND_INT}`], ['GET', `/api/plans/99999999999`],
  ])('%s %s is 400 on the id', async (method, path) => {
    const api = method === 'PUT' ? shore : planner
    const res = await api.request(path, { method, ...(method === 'PUT' ? { body: { name: 'X', kind: 'port', lat: 1, lon: 1 } } : {}) })
    expectFieldRefusal(res, 'id')
  })

  it('in body fields: vesselId, version, placeIds, masterUserId, departurePlaceId', async () => {
    expectFieldRefusal(await planner.request('/api/plans', { method: 'POST', body: { vesselId: BEYOND_INT, title: 'Too big', departureUtc: '2027-01-01T00:00:00Z', speedKn: 12 } }), 'vesselId')
    expectFieldRefusal(await planner.request('/api/plans', { method: 'POST', body: { vesselId, title: 'Too big', departureUtc: '2027-01-01T00:00:00Z', speedKn: 12, departurePlaceId: BEYOND_INT } }), 'departurePlaceId')
    expectFieldRefusal(await planner.request(`/api/plans/${planId}/waypoints`, { method: 'PUT', body: { version: BEYOND_INT, waypoints: [{ lat: 1, lon: 1 }, { lat: 2, lon: 2 }] } }), 'version')
    expectFieldRefusal(await shore.request('/api/tables', { method: 'POST', body: { name: 'Too big', placeIds: [1, BEYOND_INT] } }), 'placeIds.1')
    const vessel = (await admin.request(`/api/vessels/${vesselId}`)).body
    expectFieldRefusal(await admin.request(`/api/vessels/${vesselId}`, { method: 'PUT', body: { name: vessel.name, imoNumber: vessel.imoNumber, callSign: vessel.callSign, serviceSpeedKn: 12, masterUserId: BEYOND_INT } }), 'masterUserId')
  })

  it('in a multipart field: the import\'s vesselId', async () => {
    const form = new FormData()
    form.append('file', new Blob(['name,latitude,longitude\nA,52,3.9\nB,52.6,3.4\n'], { type: 'text/csv' }), 'big-id.csv')
    for (const [k, v] of Object.entries({ mode: 'create', vesselId: String(BEYOND_INT), title: 'Too big', departureUtc: '2027-01-01T00:00:00Z', speedKn: '12' })) form.append(k, v)
    expectFieldRefusal(await planner.request('/api/plans/import', { method: 'POST', rawBody: form }), 'vesselId')
  })
})

describe('values the columns cannot keep', () => {
  const header = (extra: Record<string, unknown>) => ({ vesselId, title: 'Edge values', departureUtc: '2027-01-01T00:00:00Z', speedKn: 12, ...extra })

  it.each([0.004, 1.5e-320, 0.0999])('speedKn %s (numeric(5,2) would keep 0 or 0.1) is refused, not rounded into the check', async (speedKn) => {
    expectFieldRefusal(await planner.request('/api/plans', { method: 'POST', body: header({ speedKn }) }), 'speedKn')
  })

  it.each([['xteNm', 0.004], ['turnRadiusNm', 0.004], ['speedKn', 0.004], ['xteNm', 1e-300]])('waypoint %s %s is refused', async (field, value) => {
    const version = (await planner.request(`/api/plans/${planId}`)).body.plan.version
    expectFieldRefusal(await planner.request(`/api/plans/${planId}/waypoints`, { method: 'PUT', body: { version, waypoints: [{ lat: 1, lon: 1 }, { lat: 2, lon: 2, [field]: value }] } }), `waypoints.1.${field}`)
  })

  it('an XTE limit and turn radius just above the bound are stored as sent back', async () => {
    const version = (await planner.request(`/api/plans/${planId}`)).body.plan.version
    // 0.014 rounds to 0.01 at numeric(…, 2): what comes back must be accepted when sent again.
    const saved = await expectStatus(planner.request(`/api/plans/${planId}/waypoints`, { method: 'PUT', body: { version, waypoints: [{ lat: 1, lon: 1 }, { lat: 2, lon: 2, xteNm: 0.014, turnRadiusNm: 0.014 }] } }), 200)
    const back = saved.waypoints[1]
    expect([back.xteNm, back.turnRadiusNm]).toEqual([0.01, 0.01])
    await expectStatus(planner.request(`/api/plans/${planId}/waypoints`, { method: 'PUT', body: { version: saved.plan.version, waypoints: saved.waypoints } }), 200)
  })

  it.each(['9999-01-01T00:00:00Z', '0001-01-01T00:00:00Z', '+275760-09-13T00:00:00Z'])('departure %s is refused', async (departureUtc) => {
    expectFieldRefusal(await planner.request('/api/plans', { method: 'POST', body: header({ departureUtc }) }), 'departureUtc')
  })

  it.each([['validFrom', '0000-01-01'], ['validTo', '0000-06-30'], ['validFrom', '9999-12-31']])('zone %s %s is refused with 400 naming it', async (field, day) => {
    const res = await shore.request('/api/zones', { method: 'POST', body: { name: `Dated zone ${field} ${day}`, kind: 'custom', [field]: day, geojson: { type: 'Polygon', coordinates: [[[-30, 40], [-29, 40], [-29, 41], [-30, 41], [-30, 40]]] } } })
    expectFieldRefusal(res, field)
  })

  it('NUL bytes sent as application/octet-stream are refused before any route reads them', async () => {
    for (const path of ['/api/places', '/api/places/import?mode=preview', '/api/plans/import', '/api/auth/login']) {
      const res = await fetch(url(path), { method: 'POST', headers: { 'content-type': 'application/octet-stream', 'cookie': shore.cookie }, body: Buffer.from('name\u0000,kind\n\u0000\u0000') })
      expect(res.status, path).toBeGreaterThanOrEqual(400)
      expect(res.status, path).toBeLessThan(500)
      expect((await res.json()).message, path).toMatch(/\w/)
    }
  })
})

describe('eight identical creations at once', () => {
  const statuses = (results: { status: number }[]) => results.map(r => r.status).sort()

  it('of a place: one 201, seven 409 naming the field, one row (names differing only in case count as the same)', async () => {
    const name = `Race harbour ${Date.now()}`
    const results = await Promise.all(Array.from({ length: 8 }, (_, i) =>
      shore.request('/api/places', { method: 'POST', body: { name: i % 2 ? name.toUpperCase() : name, kind: 'port', lat: 10.25, lon: 20.25 } })))
    expect(statuses(results)).toEqual([201, 409, 409, 409, 409, 409, 409, 409])
    for (const r of results.filter(r => r.status === 409)) expect(r.body.message).toMatch(/^name: /)
    const places = (await shore.request('/api/places')).body as { name: string }[]
    expect(places.filter(p => p.name.toLowerCase() === name.toLowerCase())).toHaveLength(1)
  })

  it('of a user: one 201, seven 409 naming the field', async () => {
    const email = `race.${Date.now()}@kestrel-bight.example`
    const results = await Promise.all(Array.from({ length: 8 }, () =>
      admin.request('/api/admin/users', { method: 'POST', body: { name: 'Race user', email, role: 'planner', password: 'a-long-password' } })))
    expect(statuses(results)).toEqual([201, 409, 409, 409, 409, 409, 409, 409])
    for (const r of results.filter(r => r.status === 409)) expect(r.body.message).toMatch(/^email: /)
    expect(((await admin.request('/api/admin/users')).body as { email: string }[]).filter(u => u.email === email)).toHaveLength(1)
  })

  it('of a zone: one 201, seven 409 naming the field', async () => {
    const name = `Race zone ${Date.now()}`
    const results = await Promise.all(Array.from({ length: 8 }, () =>
      shore.request('/api/zones', { method: 'POST', body: { name, kind: 'custom', geojson: { type: 'Polygon', coordinates: [[[-30, 40], [-29, 40], [-29, 41], [-30, 41], [-30, 40]]] } } })))
    expect(statuses(results)).toEqual([201, 409, 409, 409, 409, 409, 409, 409])
    for (const r of results.filter(r => r.status === 409)) expect(r.body.message).toMatch(/^name: /)
  })

  it('of a renamed place: two places renamed to the same name at once, one wins', async () => {
    const stamp = Date.now()
    const made = await Promise.all([1, 2, 3, 4].map(i => expectStatus<{ id: number }>(shore.request('/api/places', { method: 'POST', body: { name: `Rename source ${stamp} ${i}`, kind: 'port', lat: 11, lon: 21 + i / 10 } }), 201)))
    const target = `Rename target ${stamp}`
    const results = await Promise.all(made.map(p => shore.request(`/api/places/${p.id}`, { method: 'PUT', body: { name: target, kind: 'port', lat: 11, lon: 21 } })))
    expect(statuses(results)).toEqual([200, 409, 409, 409])
  })
})

describe('small leaks and blanks', () => {
  it('GET /api/timezone with blank lat and lon is 400 naming them, not 200', async () => {
    const res = await planner.request('/api/timezone?lat=&lon=')
    expect(res.status).toBe(400)
    expect(res.body.message).toMatch(/^lat: .*lon: /)
  })

  it('an e-mail address taken in another company is answered as one taken in the admin\'s own, naming no company', async () => {
    const body = (email: string) => ({ name: 'Taken address', email, role: 'planner', password: 'a-long-password' })
    const elsewhere = await admin.request('/api/admin/users', { method: 'POST', body: body('planner@larkspur-reach.example') })
    const here = await admin.request('/api/admin/users', { method: 'POST', body: body('planner@kestrel-bight.example') })
    expect([elsewhere.status, here.status]).toEqual([409, 409])
    expect(elsewhere.body.message).toBe(here.body.message)
    expect(elsewhere.body.message).not.toMatch(/Larkspur|another company/i)
  })
})
