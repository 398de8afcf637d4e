// GET /api/plans/:id is answered from a kept copy of the serialised view while nothing it shows has
// changed (server/utils/planViewCache.ts). Whatever changes what a plan view shows — through the API
// or straight in the database — is in the very next read, and the company scope holds for a plan
// whose view is kept.
import { get } from 'node:http'
import { brotliDecompressSync, gunzipSync } from 'node:zlib'
import knex from 'knex'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { expectStatus, makePlan } from '../support/records'
import { loginAs, startServer, url, type Api } from '../support/server'

await startServer()
const db = knex({ client: 'pg', connection: process.env.NUXT_DATABASE_URL })

let planner: Api
let master: Api
let shore: Api
let admin: Api
let otherPlanner: Api
let vesselName = ''
let vesselId = 0
let originalSettings: unknown

/** An IMO number with its check digit (IMO Res. A.1078(28): weights 7…2 on the first six digits, the sum's last digit). */
function imoNumber(six: number): string {
  const d = String(six).padStart(6, '0').split('').map(Number)
  return `${d.join('')}${d.reduce((s, x, i) => s + x * (7 - i), 0) % 10}`
}

// Fuel points invented for the test (a vessel of about 15 kn service speed).
const FUEL_POINTS = [{ speedKn: 10, tonnesPerDay: 12 }, { speedKn: 14, tonnesPerDay: 26 }, { speedKn: 17, tonnesPerDay: 41 }]

beforeAll(async () => {
  ;[planner, master, shore, admin, otherPlanner] = await Promise.all([loginAs('planner'), loginAs('master'), loginAs('shore'), loginAs('admin'), loginAs('otherPlanner')])
  // A vessel of this file's own in the planner's company, with the demo master, so no other file's fuel data changes.
  const company = await db('users').where({ email: 'planner@kestrel-bight.example' }).first('company_id')
  const masterRow = await db('users').where({ email: 'master@kestrel-bight.example' }).first('id')
  vesselName = `View cache test ${process.pid}`
  const [row] = await db('vessels').insert({
    company_id: company.company_id, name: vesselName, imo_number: imoNumber(100000 + (process.pid % 900000)), call_sign: 'TEST1', service_speed_kn: 15, master_user_id: masterRow.id,
  }).returning('id')
  vesselId = row.id
  await expectStatus(shore.request(`/api/vessels/${vesselId}/fuel`, { method: 'PUT', body: { points: FUEL_POINTS } }), 200)
  originalSettings = await expectStatus(admin.request('/api/company/settings'), 200)
})

afterAll(async () => {
  await admin.request('/api/company/settings', { method: 'PUT', body: originalSettings })
  await db('plans').where({ vessel_id: vesselId }).delete()
  await db('vessels').where({ id: vesselId }).delete()
  await db.destroy()
})

const view = async (api: Api, id: number) => expectStatus(api.request(`/api/plans/${id}`), 200)

describe('the kept plan view', () => {
  it('shows new fuel data in the next read', async () => {
    const id = await makePlan('draft', { planner }, { vesselName })
    const before = await view(planner, id)
    expect(before.fuel.totalTonnes).toBeGreaterThan(0)
    expect((await view(planner, id)).fuel.totalTonnes).toBe(before.fuel.totalTonnes)
    // Twice the consumption at every speed: the fitted curve c·V^k doubles c, so the fuel doubles.
    await expectStatus(shore.request(`/api/vessels/${vesselId}/fuel`, { method: 'PUT', body: { points: FUEL_POINTS.map(p => ({ ...p, tonnesPerDay: 2 * p.tonnesPerDay })) } }), 200)
    expect((await view(planner, id)).fuel.totalTonnes).toBeCloseTo(2 * before.fuel.totalTonnes, 9)
    await expectStatus(shore.request(`/api/vessels/${vesselId}/fuel`, { method: 'PUT', body: { points: FUEL_POINTS } }), 200)
    expect((await view(planner, id)).fuel.totalTonnes).toBeCloseTo(before.fuel.totalTonnes, 9)
  })

  it('shows a remark and a change of the company settings in the next read', async () => {
    const id = await makePlan('submitted', { planner }, { vesselName })
    await view(planner, id)
    const remarks = `Check the tidal window at the pilot station (${process.pid}).`
    await expectStatus(master.request(`/api/plans/${id}/remarks`, { method: 'POST', body: { remarks } }), 201)
    expect((await view(planner, id)).events.map((e: { remarks: string | null }) => e.remarks)).toContain(remarks)

    const reserve = { kind: 'percent', value: 17 }
    await expectStatus(admin.request('/api/company/settings', { method: 'PUT', body: { ...(originalSettings as object), reserve } }), 200)
    const after = await view(planner, id)
    expect(after.fuel.reserve).toEqual(reserve)
    expect(after.fuel.reserveTonnes).toBeCloseTo(0.17 * after.fuel.totalTonnes, 9)
    await expectStatus(admin.request('/api/company/settings', { method: 'PUT', body: originalSettings }), 200)
  })

  it('shows what was written straight into the database, not through the API, in the next read', async () => {
    const id = await makePlan('draft', { planner }, { vesselName })
    await view(planner, id)
    await db('waypoints').where({ plan_id: id, seq: 1 }).update({ name: 'Renamed in the database' })
    expect((await view(planner, id)).waypoints[1].name).toBe('Renamed in the database')
    await db('vessels').where({ id: vesselId }).update({ call_sign: 'TEST2' })
    await db('vessels').where({ id: vesselId }).update({ name: `${vesselName} (renamed)` })
    expect((await view(planner, id)).plan.vesselName).toBe(`${vesselName} (renamed)`)
    await db('vessels').where({ id: vesselId }).update({ name: vesselName })
    expect((await view(planner, id)).plan.vesselName).toBe(vesselName)
  })

  it('is not shown to another company: 404 as for a plan that does not exist', async () => {
    const id = await makePlan('draft', { planner }, { vesselName })
    await view(planner, id)
    await view(planner, id)
    const theirs = await otherPlanner.request(`/api/plans/${id}`)
    expect(theirs.status).toBe(404)
    expect(JSON.stringify(theirs.body)).not.toContain(vesselName)
    expect((await otherPlanner.request(`/api/plans/${id}`, { headers: { 'accept-encoding': 'br' } })).status).toBe(404)
  })

  it('goes out compressed for a client that accepts brotli or gzip, and the same either way', async () => {
    const id = await makePlan('draft', { planner }, { vesselName })
    // node:http hands over the bytes as sent (fetch would decode them).
    const raw = (acceptEncoding: string) => new Promise<{ encoding: string | null, bytes: Buffer }>((resolve, reject) => {
      get(url(`/api/plans/${id}`), { headers: { 'cookie': planner.cookie, 'accept-encoding': acceptEncoding } }, (res) => {
        const chunks: Buffer[] = []
        res.on('data', c => chunks.push(c)).on('error', reject).on('end', () => {
          expect(res.statusCode).toBe(200)
          expect(String(res.headers.vary).toLowerCase()).toContain('accept-encoding')
          resolve({ encoding: res.headers['content-encoding'] ?? null, bytes: Buffer.concat(chunks) })
        })
      }).on('error', reject)
    })
    const plain = await raw('identity')
    expect(plain.encoding).toBeNull()
    const br = await raw('gzip, deflate, br, zstd')
    expect(br.encoding).toBe('br')
    const gz = await raw('gzip;q=1, br;q=0')
    expect(gz.encoding).toBe('gzip')
    const plainView = JSON.parse(plain.bytes.toString())
    expect(plainView.plan.id).toBe(id)
    expect(br.bytes.length).toBeLessThan(plain.bytes.length)
    expect(JSON.parse(brotliDecompressSync(br.bytes).toString())).toEqual(plainView)
    expect(JSON.parse(gunzipSync(gz.bytes).toString())).toEqual(plainView)
  })
})
