// The sea router and the company's zones: a no-go area across the direct ocean route is gone round
// and never entered; minimum-ECA routing answers both routes and the difference.
import { beforeAll, describe, expect, it } from 'vitest'
import { geodesicDensify } from '#shared/utils/geodesic'
import { loginAs, startServer, type Api } from '../support/server'

await startServer()

let shore: Api, planner: Api
beforeAll(async () => { [shore, planner] = await Promise.all([loginAs('shore'), loginAs('planner')]) })

// Across the open South Pacific, far from any other test's routes: off Valparaíso → off Hanga Roa (Rapa Nui).
// (The router joins an end to its graph within 40 nm, so the ends lie near coasts; the middle is open ocean.)
const FROM = { lat: -33.02, lon: -71.75 }
const TO = { lat: -27.2, lon: -109.5 }
// A no-go box 10° tall across the direct route at 90°W, its sides on meridians (geodesics) and its top and
// bottom laid every half degree along the parallels.
const along = (lat: number, lon1: number, lon2: number) => Array.from({ length: 5 }, (_, k) => [lon1 + (lon2 - lon1) * k / 4, lat])
const box = [...along(-36, -91, -89), ...along(-26, -89, -91), [-91, -36]]
const insideBox = (p: { lat: number, lon: number }) => p.lat > -35.99 && p.lat < -26.01 && p.lon > -90.99 && p.lon < -89.01
const samples = (waypoints: { lat: number, lon: number }[]) => waypoints.slice(1).flatMap((w, i) => geodesicDensify(waypoints[i]!, w, 1))

describe('sea routes and zones', () => {
  it('goes round a no-go area laid across the direct route and never enters it', async () => {
    const direct = await planner.request('/api/routing/sea', { method: 'POST', body: { from: FROM, to: TO } })
    expect(direct.status).toBe(200)
    // Without the zone the route runs straight through the box (it is open ocean).
    expect(samples(direct.body.waypoints).some(insideBox)).toBe(true)
    const zone = await shore.request('/api/zones', { method: 'POST', body: { name: 'Routing test no-go box', kind: 'no-go', geojson: { type: 'Polygon', coordinates: [box] } } })
    expect(zone.status).toBe(201)
    try {
      const round = await planner.request('/api/routing/sea', { method: 'POST', body: { from: FROM, to: TO } })
      expect(round.status).toBe(200)
      expect(samples(round.body.waypoints).filter(insideBox)).toEqual([])
      expect(round.body.zones.find((z: any) => z.zoneId === zone.body.id)).toBeUndefined()
      // Round the top or bottom of a box reaching 5° either side of the track: well over the direct distance.
      expect(round.body.distanceNm).toBeGreaterThan(direct.body.distanceNm + 20)
    }
    finally { await shore.request(`/api/zones/${zone.body.id}`, { method: 'DELETE' }) }
  })

  it('minimum-ECA routing answers the shortest route beside it and the difference in distance, ECA distance and fuel cost', async () => {
    const vessels = (await planner.request('/api/vessels')).body
    const dawn = vessels.find((v: any) => v.name === 'Kestrel Dawn')
    const body = { from: { lat: 51.95, lon: 4.14 }, to: { lat: 40.45, lon: -73.8 }, avoidZones: ['eca'], vesselId: dawn.id, speedKn: 14 }
    const res = await planner.request('/api/routing/sea', { method: 'POST', body })
    expect(res.status).toBe(200)
    const c = res.body.ecaComparison
    // Demo prices (db/seeds/04_fuel_prices.ts): MGO 780, VLSFO 585 a tonne.
    expect(c.ecaCostFactor).toBeCloseTo(780 / 585, 9)
    expect(c.minimumEca.ecaNm).toBeLessThanOrEqual(c.shortest.ecaNm + 0.1)
    expect(c.minimumEca.distanceNm).toBeGreaterThanOrEqual(c.shortest.distanceNm - 0.1)
    expect(c.shortest.ecaNm).toBeGreaterThan(100)
    expect(c.difference.distanceNm).toBeCloseTo(c.minimumEca.distanceNm - c.shortest.distanceNm, 6)
    expect(c.difference.ecaNm).toBeCloseTo(c.minimumEca.ecaNm - c.shortest.ecaNm, 6)
    expect(c.difference.fuelCost).toBeCloseTo(c.minimumEca.fuelCost - c.shortest.fuelCost, 3)
    expect(c.shortest.fuelCost).toBeGreaterThan(0)
    expect(res.body.zones.some((z: any) => z.kind === 'eca')).toBe(true)
    expect(res.body.distanceNm).toBeCloseTo(c.minimumEca.distanceNm, 6)
  })

  it('refuses an unknown zone kind to avoid, naming the field', async () => {
    const res = await planner.request('/api/routing/sea', { method: 'POST', body: { from: FROM, to: TO, avoidZones: ['no-go'] } })
    expect(res.status).toBe(400)
    expect(res.body.message).toMatch(/avoidZones/)
  })
})
