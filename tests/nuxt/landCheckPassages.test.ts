// The land check through the built server: a suggested sea route's Suez Canal legs are reported as
// through the canal, not as crossing the coastline; a leg across the Sinai stays a crossing; and no
// leg of a route the router suggests (its ends placed on 1:10m water near Rotterdam and Yokohama)
// is flagged as crossing land by the product's own check. Positions are the demo places (public
// port coordinates) and, across the Sinai, from memory.
import { beforeAll, describe, expect, it } from 'vitest'
import { loginAs, startServer } from '../support/server'
import type { Api } from '../support/server'

await startServer()

const ROTTERDAM = { lat: 51.95, lon: 4.14 }
const SINGAPORE = { lat: 1.264, lon: 103.84 }
const YOKOHAMA = { lat: 35.4437, lon: 139.638 }

interface Leg { index: number, crossesLand: boolean, withinClearance: boolean, firstLandPoint: unknown, passage: { id: string, name: string } | null }

describe('land check with declared passages', () => {
  let api: Api
  beforeAll(async () => { api = await loginAs('planner') })

  it('reports the Suez legs of a suggested route as through the Suez Canal, not as land', async () => {
    const route = await api.request('/api/routing/sea', { method: 'POST', body: { from: ROTTERDAM, to: SINGAPORE } })
    expect(route.status).toBe(200)
    const wps: { lat: number, lon: number, passageId?: string }[] = route.body.waypoints
    const res = await api.request('/api/land-check', { method: 'POST', body: { waypoints: wps.map(w => ({ lat: w.lat, lon: w.lon, method: 'geodesic' })), clearanceNm: 1 } })
    expect(res.status).toBe(200)
    const legs: Leg[] = res.body.legs
    // The legs between consecutive Suez fairway waypoints of the route.
    const canal = legs.filter(l => wps[l.index]!.passageId === 'suez' && wps[l.index + 1]!.passageId === 'suez')
    expect(canal.length).toBeGreaterThan(3)
    for (const l of canal) expect(l).toMatchObject({ crossesLand: false, withinClearance: false, firstLandPoint: null, passage: { id: 'suez', name: 'Suez Canal' } })
    expect(legs.every(l => 'passage' in l)).toBe(true)
  })

  it.each([
    { a: 'Rotterdam', from: ROTTERDAM, b: 'Singapore', to: SINGAPORE },
    { a: 'Yokohama', from: YOKOHAMA, b: 'Rotterdam', to: ROTTERDAM },
  ])('finds no leg of the suggested $a → $b route crossing land', async ({ from, to }) => {
    const route = await api.request('/api/routing/sea', { method: 'POST', body: { from, to } })
    expect(route.status).toBe(200)
    const wps: { lat: number, lon: number }[] = route.body.waypoints
    const res = await api.request('/api/land-check', { method: 'POST', body: { waypoints: wps.map(w => ({ lat: w.lat, lon: w.lon, method: 'geodesic' })), clearanceNm: 1 } })
    expect(res.status).toBe(200)
    const legs: Leg[] = res.body.legs
    expect(legs).toHaveLength(wps.length - 1)
    expect(legs.filter(l => l.crossesLand).map(l => l.index)).toEqual([])
  })

  it('keeps a leg across the Sinai a crossing with no passage', async () => {
    const res = await api.request('/api/land-check', {
      method: 'POST',
      body: { waypoints: [{ lat: 29.9, lon: 32.55, method: 'geodesic' }, { lat: 29.5, lon: 34.9, method: 'geodesic' }], clearanceNm: 1 },
    })
    expect(res.status).toBe(200)
    expect(res.body.legs[0]).toMatchObject({ crossesLand: true, passage: null })
  })
})
