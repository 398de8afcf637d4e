import { execFileSync } from 'node:child_process'
import { beforeAll, describe, expect, it } from 'vitest'
import { computeLegTable } from '#shared/utils/legTable'
import { loginAs, startServer, type Api } from '../support/server'

await startServer()

// Tokyo Bay offing → Juan de Fuca approach → Cape Flattery offing (invented passage; positions as charted).
const waypoints = [
  { name: 'Nojima Zaki offing', lat: 34.85, lon: 139.95, method: 'rhumb' },
  { name: 'Juan de Fuca Strait entrance', lat: 48.495, lon: -124.8, method: 'geodesic', speedKn: 15 },
  { name: 'Port Angeles pilot station', lat: 48.142, lon: -123.4, method: 'rhumb', xteNm: 0.5, turnRadiusNm: 1 },
]

/** GeodSolve (GeographicLib's command-line inverse solver, Karney 2013) as the oracle for a geodesic distance in nm. */
function geodSolveNm(a: { lat: number, lon: number }, b: { lat: number, lon: number }): number {
  const out = execFileSync('GeodSolve', ['-i', '-p', '9'], { input: `${a.lat} ${a.lon} ${b.lat} ${b.lon}\n` }).toString().trim().split(/\s+/)
  return Number(out[2]) / 1852
}

describe('plans API: create, save waypoints, version lock', () => {
  let planner: Api
  let id = 0

  beforeAll(async () => {
    planner = await loginAs('planner')
    const vessels = (await planner.request('/api/vessels')).body as { id: number }[]
    const res = await planner.request('/api/plans', {
      method: 'POST',
      body: { vesselId: vessels[0]!.id, title: 'Test crossing, North Pacific', departureUtc: '2026-12-10T02:00:00Z', speedKn: 14.5, limitLat: 48.75 },
    })
    expect(res.status).toBe(201)
    id = res.body.id
  })

  it('creates a draft at version 1 with no waypoints', async () => {
    const { status, body } = await planner.request(`/api/plans/${id}`)
    expect(status).toBe(200)
    expect(body.plan).toMatchObject({ id, status: 'draft', version: 1, revision: 1, limitLat: 48.75 })
    expect(body.waypoints).toEqual([])
  })

  it('puts waypoints under the version and answers the new view', async () => {
    const res = await planner.request(`/api/plans/${id}/waypoints`, { method: 'PUT', body: { version: 1, waypoints } })
    expect(res.status).toBe(200)
    expect(res.body.plan.version).toBe(2)
    expect(res.body.waypoints.map((w: { name: string }) => w.name)).toEqual(waypoints.map(w => w.name))
    expect(res.body.legs).toHaveLength(2)
  })

  it('answers a stale version with 409 and the current version, and changes nothing', async () => {
    const before = (await planner.request(`/api/plans/${id}`)).body
    const res = await planner.request(`/api/plans/${id}/waypoints`, { method: 'PUT', body: { version: 1, waypoints: waypoints.slice(0, 2) } })
    expect(res.status).toBe(409)
    expect(res.body.data.currentVersion).toBe(2)
    const after = (await planner.request(`/api/plans/${id}`)).body
    expect(after.plan.version).toBe(2)
    expect(after.waypoints).toEqual(before.waypoints)
  })

  it('answers a bad waypoint with 400 naming the field', async () => {
    const bad = [waypoints[0], { ...waypoints[1], lat: 95 }]
    const res = await planner.request(`/api/plans/${id}/waypoints`, { method: 'PUT', body: { version: 2, waypoints: bad } })
    expect(res.status).toBe(400)
    expect(res.body.message).toMatch(/waypoints\.1\.lat/)
    const speed = await planner.request(`/api/plans/${id}/waypoints`, { method: 'PUT', body: { version: 2, waypoints: [waypoints[0], { ...waypoints[1], speedKn: 0 }] } })
    expect(speed.status).toBe(400)
    expect(speed.body.message).toMatch(/waypoints\.1\.speedKn/)
  })

  it('refuses duplicate consecutive waypoints (400) and more than 5,000 waypoints (400)', async () => {
    const dup = await planner.request(`/api/plans/${id}/waypoints`, { method: 'PUT', body: { version: 2, waypoints: [waypoints[0], waypoints[1], { ...waypoints[1], name: 'again' }] } })
    expect(dup.status).toBe(400)
    expect(dup.body.message).toMatch(/waypoints\.2\.lat: waypoint 3 repeats the position of waypoint 2/)
    const many = Array.from({ length: 5001 }, (_, i) => ({ name: `WP${i}`, lat: -60 + (i % 120), lon: -179 + (i % 358) + i / 10_000, method: 'rhumb' }))
    const big = await planner.request(`/api/plans/${id}/waypoints`, { method: 'PUT', body: { version: 2, waypoints: many } })
    expect(big.status).toBe(400)
    expect(big.body.message).toMatch(/waypoints: at most 5000 waypoints/)
    expect((await planner.request(`/api/plans/${id}`)).body.plan.version).toBe(2)
  })

  it('serves the leg table the shared engine computes, and its geodesic distance agrees with GeodSolve', async () => {
    const { body } = await planner.request(`/api/plans/${id}`)
    const engine = computeLegTable(body.waypoints, body.plan.departureUtc, body.plan.speedKn)
    expect(body.legs).toHaveLength(engine.legs.length)
    body.legs.forEach((leg: any, i: number) => {
      const e = engine.legs[i]!
      expect(leg.method).toBe(e.method)
      expect(leg.distanceNm).toBeCloseTo(e.distanceNm, 9)
      expect(leg.hours).toBeCloseTo(e.hours, 9)
      expect(leg.etaUtc).toBe(e.etaUtc)
    })
    expect(body.totals.distanceNm).toBeCloseTo(engine.totals.distanceNm, 9)
    expect(body.totals.etaUtc).toBe(engine.totals.etaUtc)
    const ocean = body.legs[0]
    expect(ocean.method).toBe('geodesic')
    expect(ocean.speedKn).toBe(15)
    expect(ocean.distanceNm).toBeCloseTo(geodSolveNm(waypoints[0]!, waypoints[1]!), 6)
  })

  it('lets shore read but not edit (403)', async () => {
    const shore = await loginAs('shore')
    expect((await shore.request(`/api/plans/${id}`)).status).toBe(200)
    const res = await shore.request(`/api/plans/${id}/waypoints`, { method: 'PUT', body: { version: 2, waypoints } })
    expect(res.status).toBe(403)
    expect((await planner.request(`/api/plans/${id}`)).body.plan.version).toBe(2)
  })

  it('hides the plan from another company (404 on read and write)', async () => {
    const other = await loginAs('otherPlanner')
    expect((await other.request(`/api/plans/${id}`)).status).toBe(404)
    expect((await other.request(`/api/plans/${id}/waypoints`, { method: 'PUT', body: { version: 2, waypoints } })).status).toBe(404)
  })

  it('saves the header under the same version lock', async () => {
    const put = (version: number) => planner.request(`/api/plans/${id}`, { method: 'PUT', body: { version, title: 'Test crossing, held at 48°45′N', departureUtc: '2026-12-11T02:00:00Z', speedKn: 15, limitLat: 48.75 } })
    const res = await put(2)
    expect(res.status).toBe(200)
    expect(res.body.plan).toMatchObject({ version: 3, speedKn: 15, title: 'Test crossing, held at 48°45′N' })
    expect((await put(2)).status).toBe(409)
  })

  it('refuses edits to a plan that is not a draft (409)', async () => {
    const plans = (await planner.request('/api/plans')).body as { id: number, status: string, version: number }[]
    const approved = plans.find(p => p.status === 'approved')!
    const res = await planner.request(`/api/plans/${approved.id}/waypoints`, { method: 'PUT', body: { version: approved.version, waypoints } })
    expect(res.status).toBe(409)
    expect(res.body.message).toMatch(/approved/)
  })
})
