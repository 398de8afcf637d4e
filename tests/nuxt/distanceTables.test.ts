// Distance tables against the seeded demo data: the approved Cape of Good Hope – Fremantle plan
// gives its own distance; Rotterdam – New York has no approved plan (the seed's is 'submitted'),
// so the table falls back to the direct geodesic, checked against GeodSolve as the oracle.
import { execFileSync } from 'node:child_process'
import { beforeAll, describe, expect, it } from 'vitest'
import { type Api, loginAs, startServer } from '../support/server'
import { runOracle } from '../unit/support/oracle'

await startServer()

/** GeodSolve (GeographicLib's own command-line tool, Karney) as the oracle: distance in nm. */
function geodSolveNm(a: { lat: number, lon: number }, b: { lat: number, lon: number }): number {
  const out = execFileSync('GeodSolve', ['-i', '-p', '9'], { input: `${a.lat} ${a.lon} ${b.lat} ${b.lon}\n` }).toString()
  return Number(out.trim().split(/\s+/)[2]) / 1852
}

const pair = (i: number, j: number, n: number): number => (i < j ? i * n - (i * (i + 1)) / 2 + (j - i - 1) : pair(j, i, n))

describe('distance tables', () => {
  let shore: Api
  let places: any[]
  const byName = (name: string) => places.find(p => p.name === name)

  beforeAll(async () => {
    shore = await loginAs('shore')
    places = (await shore.request('/api/places')).body
  })

  it('takes the approved plan between its end places and links it; a pair without one is the direct geodesic, flagged', async () => {
    const names = ['Cape of Good Hope offing', 'Fremantle pilot boarding ground', 'Rotterdam', 'New York']
    const res = await shore.request('/api/tables', { method: 'POST', body: { name: 'Test four', placeIds: names.map(n => byName(n).id) } })
    expect(res.status).toBe(201)
    const t = res.body
    expect(t.status).toBe('ready')
    expect(t.progress).toBe(1)
    expect(t.radiusNm).toBe(30)
    const n = t.places.length
    const idx = (name: string) => t.places.findIndex((p: any) => p.name === name)

    const plans = (await shore.request('/api/plans')).body
    const cape = plans.find((p: any) => p.title === 'Cape of Good Hope – Fremantle, held at 40°S')
    const view = (await shore.request(`/api/plans/${cape.id}`)).body
    const k = pair(idx('Cape of Good Hope offing'), idx('Fremantle pilot boarding ground'), n)
    expect(t.matrix.planId[k]).toBe(cape.id)
    // The plan's own track, leg by leg from the oracles: GeodSolve for geodesic legs, RhumbSolve for rhumb legs.
    const wps = view.waypoints as { lat: number, lon: number, method: string }[]
    const legLines = wps.slice(1).map((b, i) => `${wps[i]!.lat} ${wps[i]!.lon} ${b.lat} ${b.lon}`)
    const geod = runOracle('GeodSolve', ['-i', '-p', '9'], legLines)
    const rhumb = runOracle('RhumbSolve', ['-i', '-p', '9'], legLines)
    const trackNm = wps.slice(1).reduce((sum, b, i) => sum + (b.method === 'geodesic' ? geod[i]![2]! : rhumb[i]![1]!) / 1852, 0)
    expect(wps.length).toBeGreaterThan(2)
    expect(Math.abs(t.matrix.distanceNm[k] - trackNm)).toBeLessThan(0.01) // the table keeps hundredths of a mile at most
    expect(t.matrix.crossesLand[k]).toBeNull()
    expect(t.matrix.plans).toContainEqual({ id: cape.id, title: cape.title })

    // Every other pair has no plan: the direct geodesic, each checked against GeodSolve.
    let direct = 0
    for (let i = 0; i < n; i++) for (let j = i + 1; j < n; j++) {
      const q = pair(i, j, n)
      if (q === k) continue
      direct++
      expect(t.matrix.planId[q]).toBeNull()
      const oracle = geodSolveNm(t.places[i], t.places[j])
      expect(Math.abs(t.matrix.distanceNm[q] - oracle), `${t.places[i].name} – ${t.places[j].name}`).toBeLessThan(0.001)
      expect(typeof t.matrix.crossesLand[q]).toBe('boolean')
    }
    expect(direct).toBe(5)

    // The geodesic from the Cape to Rotterdam runs over Africa: flagged as crossing land.
    expect(t.matrix.crossesLand[pair(idx('Cape of Good Hope offing'), idx('Rotterdam'), n)]).toBe(true)
  })

  it('lets planners and masters read but not build, rebuild or delete (403)', async () => {
    const planner = await loginAs('planner')
    const master = await loginAs('master')
    const ids = places.slice(0, 3).map(p => p.id)
    expect((await planner.request('/api/tables', { method: 'POST', body: { name: 'Nope', placeIds: ids } })).status).toBe(403)
    const made = await shore.request('/api/tables', { method: 'POST', body: { name: 'Readable', placeIds: ids, radiusNm: 10 } })
    expect(made.status).toBe(201)
    expect((await master.request('/api/tables')).body.some((t: any) => t.id === made.body.id)).toBe(true)
    expect((await planner.request(`/api/tables/${made.body.id}`)).status).toBe(200)
    expect((await planner.request(`/api/tables/${made.body.id}/rebuild`, { method: 'POST' })).status).toBe(403)
    expect((await master.request(`/api/tables/${made.body.id}`, { method: 'DELETE' })).status).toBe(403)
    const admin = await loginAs('admin')
    expect((await admin.request(`/api/tables/${made.body.id}/rebuild`, { method: 'POST' })).status).toBe(200)
    expect((await admin.request(`/api/tables/${made.body.id}`, { method: 'DELETE' })).status).toBe(204)
    expect((await shore.request(`/api/tables/${made.body.id}`)).status).toBe(404)
  })

  it('keeps tables within the company (404) and refuses other companies\' places', async () => {
    const ids = places.slice(0, 2).map(p => p.id)
    const made = await shore.request('/api/tables', { method: 'POST', body: { name: 'Private', placeIds: ids } })
    const other = await loginAs('otherPlanner')
    expect((await other.request(`/api/tables/${made.body.id}`)).status).toBe(404)
    expect((await other.request(`/api/tables/${made.body.id}/export`)).status).toBe(404)
    expect((await other.request('/api/tables')).body.some((t: any) => t.id === made.body.id)).toBe(false)
    const bad = await shore.request('/api/tables', { method: 'POST', body: { name: 'Foreign', placeIds: [ids[0], 999999] } })
    expect(bad.status).toBe(400)
    expect(bad.body.message).toMatch(/placeIds/)
  })

  it('answers bad input with 400 naming the field', async () => {
    const one = await shore.request('/api/tables', { method: 'POST', body: { name: 'One', placeIds: [places[0].id] } })
    expect(one.status).toBe(400)
    expect(one.body.message).toMatch(/placeIds/)
    const noName = await shore.request('/api/tables', { method: 'POST', body: { name: ' ', placeIds: [places[0].id, places[1].id] } })
    expect(noName.status).toBe(400)
    expect(noName.body.message).toMatch(/name/)
    const radius = await shore.request('/api/tables', { method: 'POST', body: { name: 'R', placeIds: [places[0].id, places[1].id], radiusNm: -1 } })
    expect(radius.status).toBe(400)
    expect((await shore.request('/api/tables/abc')).status).toBe(400)
  })

  it('exports CSV: place names as header, distances to one decimal, source marks and a key', async () => {
    const names = ['Cape of Good Hope offing', 'Fremantle pilot boarding ground', 'Rotterdam', 'New York']
    const made = await shore.request('/api/tables', { method: 'POST', body: { name: 'Export', placeIds: names.map(n => byName(n).id) } })
    const res = await shore.request(`/api/tables/${made.body.id}/export`)
    expect(res.status).toBe(200)
    expect(res.headers.get('content-type')).toMatch(/text\/csv/)
    const lines = String(res.body).split('\r\n')
    const header = lines[0]!.split(',')
    expect(header[0]).toBe('Distance (nm)')
    expect(header.slice(1).sort()).toEqual([...names].sort())
    const row = lines.find(l => l.startsWith('Rotterdam,'))!.split(',')
    const oracle = geodSolveNm(byName('Rotterdam'), byName('New York'))
    expect(row[header.indexOf('New York')]).toBe(oracle.toFixed(1))
    expect(lines).toContain('D,direct — not a sailing route')
    expect(lines.some(l => l.startsWith('Source,'))).toBe(true)
    expect(lines.some(l => /^P\d+,"approved plan: Cape of Good Hope – Fremantle, held at 40°S"$/.test(l))).toBe(true)
  })
})
