// Stored leg tables: computed once per saved version, read back, and frozen with the approval.
import { execFileSync } from 'node:child_process'
import knex from 'knex'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { loginAs, startServer, type Api } from '../support/server'

await startServer()
const db = knex({ client: 'pg', connection: process.env.NUXT_DATABASE_URL })
afterAll(() => db.destroy())

// Nojima Zaki offing → Juan de Fuca Strait entrance (positions as charted), a geodesic leg.
const waypoints = [
  { name: 'Nojima Zaki offing', lat: 34.85, lon: 139.95, method: 'rhumb' },
  { name: 'Juan de Fuca Strait entrance', lat: 48.495, lon: -124.8, method: 'geodesic' },
]
/** GeodSolve (GeographicLib's inverse solver, Karney 2013) as the oracle for the leg's distance in nm. */
const geodSolveNm = () => {
  const out = execFileSync('GeodSolve', ['-i', '-p', '9'], { input: '34.85 139.95 48.495 -124.8\n' }).toString().trim().split(/\s+/)
  return Number(out[2]) / 1852
}
// What an older engine might have stored for that leg: a figure no current engine gives (invented for the test).
const OLDER_ENGINE_NM = 4000.25

let planner: Api
let master: Api
let vesselId = 0

async function newPlan(title: string): Promise<number> {
  const { body } = await planner.request('/api/plans', { method: 'POST', body: { vesselId, title, departureUtc: '2026-12-20T08:00:00Z', speedKn: 12 } })
  expect((await planner.request(`/api/plans/${body.id}/waypoints`, { method: 'PUT', body: { version: 1, waypoints } })).status).toBe(200)
  return body.id
}

/** Rewrites a plan's stored legs as an older engine would have left them. */
async function storeAsOlderEngine(id: number) {
  const row = await db('plan_legs').where({ plan_id: id }).first()
  const legs = JSON.parse(row.legs_json)
  legs[0].distanceNm = OLDER_ENGINE_NM
  await db('plan_legs').where({ plan_id: id }).update({ engine: 'an older engine', legs_json: JSON.stringify(legs) })
}

beforeAll(async () => {
  planner = await loginAs('planner')
  master = await loginAs('master')
  vesselId = ((await planner.request('/api/vessels')).body as { id: number, name: string }[]).find(v => v.name === 'Kestrel Dawn')!.id
})

describe('stored legs', () => {
  it('are computed when the waypoints are saved, for that version, and read back as stored', async () => {
    const id = await newPlan('Stored legs, saved')
    const row = await db('plan_legs').where({ plan_id: id }).first()
    expect(row.plan_version).toBe(2)
    const stored = JSON.parse(row.legs_json)
    expect(Math.abs(stored[0].distanceNm - geodSolveNm())).toBeLessThan(1e-6)
    const view = (await planner.request(`/api/plans/${id}`)).body
    expect(view.plan.version).toBe(2)
    expect(view.legs).toEqual(stored)
    expect(view.totals).toEqual(JSON.parse(row.totals_json))
    expect(view.waypoints.map((w: { name: string }) => w.name)).toEqual(waypoints.map(w => w.name))
  })

  it('of an approved plan survive an engine change: the stored numbers win', async () => {
    const id = await newPlan('Stored legs, approved')
    expect((await planner.request(`/api/plans/${id}/submit`, { method: 'POST' })).status).toBe(200)
    expect((await master.request(`/api/plans/${id}/approve`, { method: 'POST' })).status).toBe(200)
    await storeAsOlderEngine(id)
    const view = (await planner.request(`/api/plans/${id}`)).body
    expect(view.plan.status).toBe('approved')
    expect(view.legs[0].distanceNm).toBe(OLDER_ENGINE_NM)
    expect((await db('plan_legs').where({ plan_id: id }).first()).engine).toBe('an older engine')
  })

  it('of an approved plan stored before legs were kept are computed once on first read, then kept', async () => {
    const id = await newPlan('Stored legs, approved earlier')
    expect((await planner.request(`/api/plans/${id}/submit`, { method: 'POST' })).status).toBe(200)
    expect((await master.request(`/api/plans/${id}/approve`, { method: 'POST' })).status).toBe(200)
    await db('plan_legs').where({ plan_id: id }).delete()
    const view = (await planner.request(`/api/plans/${id}`)).body
    expect(Math.abs(view.legs[0].distanceNm - geodSolveNm())).toBeLessThan(1e-6)
    await storeAsOlderEngine(id)
    expect((await planner.request(`/api/plans/${id}`)).body.legs[0].distanceNm).toBe(OLDER_ENGINE_NM)
  })

  it('of a draft are recomputed by the current engine and stored again', async () => {
    const id = await newPlan('Stored legs, draft')
    await storeAsOlderEngine(id)
    const view = (await planner.request(`/api/plans/${id}`)).body
    expect(Math.abs(view.legs[0].distanceNm - geodSolveNm())).toBeLessThan(1e-6)
    const row = await db('plan_legs').where({ plan_id: id }).first()
    expect(row.engine).not.toBe('an older engine')
    expect(JSON.parse(row.legs_json)[0].distanceNm).toBe(view.legs[0].distanceNm)
  })
})
