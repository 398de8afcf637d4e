// Zones through the API: upload with line-numbered refusals, validity edits, company scope, and
// the distances inside zones that plan legs, totals and the fuel split carry.
import { beforeAll, describe, expect, it } from 'vitest'
import { loginAs, startServer, type Api } from '../support/server'

await startServer()

let shore: Api, planner: Api, admin: Api, other: Api
beforeAll(async () => {
  ;[shore, planner, admin, other] = await Promise.all([loginAs('shore'), loginAs('planner'), loginAs('admin'), loginAs('otherPlanner')])
})

const box = (lon: number, lat: number, d: number) => [[lon, lat], [lon + d, lat], [lon + d, lat + d], [lon, lat + d], [lon, lat]]
const feature = (coordinates: unknown) => JSON.stringify({ type: 'Feature', properties: {}, geometry: { type: 'Polygon', coordinates } }, null, 2)

describe('zones API', () => {
  it('shore uploads a zone from GeoJSON text, edits its validity, and deletes it; planners read it', async () => {
    const created = await shore.request('/api/zones', { method: 'POST', body: { name: 'Zone API test box', kind: 'risk', source: 'test', validFrom: '2027-01-01', geojson: feature([box(-30, 30, 1)]) } })
    expect(created.status).toBe(201)
    expect(created.body).toMatchObject({ name: 'Zone API test box', kind: 'risk', validFrom: '2027-01-01', validTo: null, vertexCount: 5, polygonCount: 1, approximate: false })
    const id = created.body.id
    const listed = (await planner.request('/api/zones')).body.find((z: any) => z.id === id)
    expect(listed.geometry.coordinates[0][0]).toEqual(box(-30, 30, 1))
    const edited = await admin.request(`/api/zones/${id}`, { method: 'PUT', body: { validTo: '2027-06-30' } })
    expect(edited.status).toBe(200)
    expect(edited.body).toMatchObject({ validFrom: '2027-01-01', validTo: '2027-06-30' })
    const backwards = await shore.request(`/api/zones/${id}`, { method: 'PUT', body: { validTo: '2026-06-30' } })
    expect(backwards.status).toBe(400)
    expect(backwards.body.message).toMatch(/validTo/)
    expect((await planner.request(`/api/zones/${id}`, { method: 'DELETE' })).status).toBe(403)
    expect((await shore.request(`/api/zones/${id}`, { method: 'DELETE' })).status).toBe(204)
    expect((await shore.request(`/api/zones/${id}`, { method: 'PUT', body: { validTo: '2030-01-01' } })).status).toBe(404)
  })

  it('refuses a file whose ring is not closed with the line of the fault, and stores nothing', async () => {
    const before = (await shore.request('/api/zones')).body.length
    const text = feature([[[0, 40], [1, 40], [1, 41], [0, 41]]])
    const res = await shore.request('/api/zones', { method: 'POST', body: { name: 'Zone API open ring', kind: 'custom', geojson: text } })
    expect(res.status).toBe(400)
    expect(res.body.message).toMatch(/^geojson: 1 problem, nothing was saved\. line \d+: .*not closed/)
    const line = text.split('\n').findIndex((l, i, all) => l.trim() === '[' && all[i + 1]!.trim() === '0,' && all[i + 2]!.trim() === '41') + 1
    expect(res.body.data.errors).toEqual([{ line, message: expect.stringMatching(/not closed/) }])
    expect((await shore.request('/api/zones')).body.length).toBe(before)
  })

  it('answers bad fields with 400 naming them and a duplicate name with 409', async () => {
    const bad = await shore.request('/api/zones', { method: 'POST', body: { name: '', kind: 'shoal', validFrom: '2027-02-30', geojson: 5 } })
    expect(bad.status).toBe(400)
    for (const field of ['name', 'kind', 'validFrom', 'geojson']) expect(bad.body.message).toContain(field)
    const dup = await shore.request('/api/zones', { method: 'POST', body: { name: 'north sea eca (incl. english channel)', kind: 'eca', geojson: feature([box(2, 52, 1)]) } })
    expect(dup.status).toBe(409)
  })

  it('keeps each company\'s zones to itself', async () => {
    const mine = (await shore.request('/api/zones')).body as any[]
    const theirs = (await other.request('/api/zones')).body as any[]
    expect(mine.some(z => z.kind === 'no-go')).toBe(true)
    expect(theirs.some(z => z.kind === 'no-go')).toBe(false)
    expect(theirs.map(z => z.id).filter(id => mine.some(m => m.id === id))).toEqual([])
  })
})

describe('zones in the plan', () => {
  it('the demo Rotterdam → New York plan carries ECA distance per leg, totals by zone and kind, and fuel by grade', async () => {
    const plans = (await planner.request('/api/plans')).body as any[]
    const id = plans.find(p => p.title === 'Rotterdam – New York, North Atlantic')!.id
    const { body } = await planner.request(`/api/plans/${id}`)
    expect(body.legs[0].zones).toEqual([{ zoneId: expect.any(Number), name: 'North Sea ECA (incl. English Channel)', kind: 'eca', distanceNm: body.legs[0].distanceNm }])
    expect(body.legs[3].zones).toEqual([])
    const eca = body.totals.zones.byKind.find((k: any) => k.kind === 'eca').distanceNm
    const sum = body.legs.reduce((s: number, l: any) => s + l.zones.reduce((t: number, z: any) => t + z.distanceNm, 0), 0)
    expect(eca).toBeCloseTo(sum, 6)
    // Grades and prices are the demo seed's: VLSFO outside, MGO inside ECAs.
    const grades = body.fuel.byGrade.map((g: any) => g.grade)
    expect(grades).toEqual(['VLSFO', 'MGO'])
    const [vlsfo, mgo] = body.fuel.byGrade
    expect(vlsfo.tonnes + mgo.tonnes).toBeCloseTo(body.fuel.totalTonnes, 6)
    expect(mgo.cost).toBeCloseTo(mgo.tonnes * mgo.pricePerTonne, 6)
    expect(vlsfo.reserveTonnes + mgo.reserveTonnes).toBeCloseTo(body.fuel.reserveTonnes, 6)
    // Every leg here is sailed at one speed, so fuel goes with distance: the MGO share is the ECA share of the distance.
    expect(mgo.tonnes / body.fuel.totalTonnes).toBeCloseTo(eca / body.totals.distanceNm, 6)
    expect(body.totals.zones.entersNoGo).toBe(false)
  })

  it('flags a plan that enters a no-go zone, and counts a zone only after it is uploaded', async () => {
    const vessels = (await planner.request('/api/vessels')).body
    const created = await planner.request('/api/plans', { method: 'POST', body: { vesselId: vessels[0].id, title: 'Zone flag test', departureUtc: '2027-03-01T00:00:00Z', speedKn: 12 } })
    const id = created.body.id
    const put = await planner.request(`/api/plans/${id}/waypoints`, { method: 'PUT', body: { version: 1, waypoints: [{ lat: 10, lon: -40 }, { lat: 10, lon: -38 }] } })
    expect(put.status).toBe(200)
    expect(put.body.totals.zones.entersNoGo).toBe(false)
    const zone = await shore.request('/api/zones', { method: 'POST', body: { name: 'Zone flag test area', kind: 'no-go', geojson: feature([box(-39.5, 9.5, 1)]) } })
    expect(zone.status).toBe(201)
    const { body } = await planner.request(`/api/plans/${id}`)
    expect(body.totals.zones.entersNoGo).toBe(true)
    // The rhumb leg runs along 10°N; the box spans 39.5°W–38.5°W on that parallel (its geodesic sides are meridians), one degree of
    // longitude: 60 · cos φ′ minutes of arc scaled to the ellipsoid, 59.1 nm (N cos φ · 1° / 1852, N = 6 378 800 m at 10°N; from memory of the formula).
    expect(body.legs[0].zones[0]).toMatchObject({ name: 'Zone flag test area', kind: 'no-go' })
    expect(body.legs[0].zones[0].distanceNm).toBeCloseTo(Math.PI / 180 * 6_378_137 / Math.sqrt(1 - 0.00669437999014 * Math.sin(Math.PI / 18) ** 2) * Math.cos(Math.PI / 18) / 1852, 3)
    await shore.request(`/api/zones/${zone.body.id}`, { method: 'DELETE' })
    expect((await planner.request(`/api/plans/${id}`)).body.totals.zones.entersNoGo).toBe(false)
  })
})
