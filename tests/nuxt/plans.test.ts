import { execFileSync } from 'node:child_process'
import { beforeAll, describe, expect, it } from 'vitest'
import { angleDiff, runOracle } from '../unit/support/oracle'
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

  it('serves a leg table whose distances and courses agree with GeodSolve and RhumbSolve on every leg', async () => {
    // A second plan with legs of each kind: rhumb lines down the coast and along a parallel, geodesics across the equator and an ocean.
    const vessels = (await planner.request('/api/vessels')).body as { id: number }[]
    const made = await planner.request('/api/plans', { method: 'POST', body: { vesselId: vessels[0]!.id, title: 'Test passage, Channel to the Indian Ocean', departureUtc: '2027-03-01T06:00:00Z', speedKn: 12 } })
    expect(made.status).toBe(201)
    const route = [
      { name: 'Lizard offing', lat: 49.85, lon: -5.2 },
      { name: 'Ushant offing', lat: 48.6, lon: -5.4, method: 'rhumb' },
      { name: 'Finisterre offing', lat: 43.0, lon: -9.6, method: 'rhumb', speedKn: 14 },
      { name: 'Off Recife', lat: -8.0, lon: -34.5, method: 'geodesic' },
      { name: 'Cape of Good Hope offing', lat: -34.55, lon: 18.45, method: 'geodesic', speedKn: 13.5 },
      { name: 'Agulhas Bank south', lat: -40, lon: 20, method: 'rhumb' },
      { name: 'Forty south, 60 east', lat: -40, lon: 60, method: 'rhumb' },
    ]
    expect((await planner.request(`/api/plans/${made.body.id}/waypoints`, { method: 'PUT', body: { version: 1, waypoints: route } })).status).toBe(200)
    const { body } = await planner.request(`/api/plans/${made.body.id}`)
    expect(body.legs).toHaveLength(route.length - 1)
    const pairs = route.slice(1).map((b, i) => `${route[i]!.lat} ${route[i]!.lon} ${b.lat} ${b.lon}`)
    const geod = runOracle('GeodSolve', ['-i', '-p', '9'], pairs) // azi1 azi2 s12
    const rhumb = runOracle('RhumbSolve', ['-i', '-p', '9'], pairs) // azi12 s12
    let etaMs = Date.parse('2027-03-01T06:00:00Z'), totalNm = 0
    body.legs.forEach((leg: any, i: number) => {
      const to = route[i + 1]!
      const [azi1, azi2, geodM] = geod[i]!
      const [azi12, rhumbM] = rhumb[i]!
      expect(leg.method, `leg ${i + 1}`).toBe(to.method)
      expect(Math.abs(leg.rhumbDistanceNm - rhumbM! / 1852), `leg ${i + 1} rhumb distance`).toBeLessThan(1e-6) // RhumbSolve
      expect(Math.abs(angleDiff(leg.rhumbCourse, azi12!)), `leg ${i + 1} rhumb course`).toBeLessThan(1e-9) // RhumbSolve
      if (to.method === 'geodesic') {
        expect(Math.abs(leg.distanceNm - geodM! / 1852), `leg ${i + 1} distance`).toBeLessThan(1e-6) // GeodSolve
        expect(Math.abs(angleDiff(leg.initialCourse, azi1!)), `leg ${i + 1} initial course`).toBeLessThan(1e-9) // GeodSolve
        expect(Math.abs(angleDiff(leg.finalCourse, azi2!)), `leg ${i + 1} final course`).toBeLessThan(1e-9) // GeodSolve
        expect(Math.abs(leg.savingNm - (rhumbM! - geodM!) / 1852)).toBeLessThan(1e-6)
      }
      else {
        expect(Math.abs(leg.distanceNm - rhumbM! / 1852), `leg ${i + 1} distance`).toBeLessThan(1e-6) // RhumbSolve
        expect(Math.abs(angleDiff(leg.course, azi12!)), `leg ${i + 1} course`).toBeLessThan(1e-9) // RhumbSolve
      }
      // Time on the leg at the arriving waypoint's speed, else the plan's 12 kn.
      const speedKn = to.speedKn ?? 12
      expect(leg.speedKn).toBe(speedKn)
      totalNm += leg.distanceNm
      etaMs += leg.distanceNm / speedKn * 3_600_000
      expect(Math.abs(Date.parse(leg.etaUtc) - etaMs), `leg ${i + 1} ETA`).toBeLessThan(1000)
    })
    // Along the parallel at 40°S the rhumb course is due east (RhumbSolve gives 90 too).
    expect(body.legs.at(-1).course).toBe(90)
    expect(Math.abs(body.totals.distanceNm - totalNm)).toBeLessThan(1e-6)
    expect(Math.abs(Date.parse(body.totals.etaUtc) - etaMs)).toBeLessThan(1000)

    // The first plan's ocean leg: geodesic at its own 15 kn.
    const first = (await planner.request(`/api/plans/${id}`)).body.legs[0]
    expect(first.method).toBe('geodesic')
    expect(first.speedKn).toBe(15)
    expect(first.distanceNm).toBeCloseTo(geodSolveNm(waypoints[0]!, waypoints[1]!), 6)
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
