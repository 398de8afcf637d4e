// The routing API: the passages list and one sea route through the built server.
import { beforeAll, describe, expect, it } from 'vitest'
import { loginAs, startServer } from '../support/server'
import type { Api } from '../support/server'

await startServer()

// Demo places (public port coordinates).
const ROTTERDAM = { lat: 51.95, lon: 4.14 }
const SINGAPORE = { lat: 1.264, lon: 103.84 }

describe('routing API', () => {
  let api: Api
  beforeAll(async () => { api = await loginAs('shore') })

  it('lists the declared passages with canal transit lengths', async () => {
    const res = await api.request('/api/routing/passages')
    expect(res.status).toBe(200)
    const ids = res.body.map((p: { id: string }) => p.id)
    expect(ids).toEqual(expect.arrayContaining(['suez', 'panama', 'kiel', 'bosporus', 'dardanelles', 'great-belt', 'oresund', 'messina', 'singapore', 'dover', 'gibraltar', 'bab-el-mandeb', 'hormuz', 'malacca', 'magellan', 'torres']))
    const suez = res.body.find((p: { id: string }) => p.id === 'suez')
    expect(suez).toMatchObject({ name: 'Suez Canal', kind: 'canal' })
    expect(suez.transitNm).toBeGreaterThan(80)
    expect(res.body.find((p: { id: string }) => p.id === 'dover').transitNm).toBeUndefined()
  })

  it('answers a route in the contract shape, its distance the sum of its legs', async () => {
    const res = await api.request('/api/routing/sea', { method: 'POST', body: { from: ROTTERDAM, to: SINGAPORE } })
    expect(res.status).toBe(200)
    const r = res.body
    expect(Object.keys(r)).toEqual(expect.arrayContaining(['distanceNm', 'distanceM', 'geodesicNm', 'via', 'waypoints', 'moved', 'minClearanceNm']))
    expect(r.distanceM).toBeCloseTo(r.distanceNm * 1852, 3)
    expect(r.distanceNm).toBeGreaterThan(r.geodesicNm)
    expect(r.via).toContainEqual({ id: 'suez', name: 'Suez Canal' })
    expect(r.waypoints[0]).toMatchObject({ method: 'geodesic' })
    expect(r.waypoints.every((w: { method: string }) => w.method === 'geodesic')).toBe(true)
    expect(typeof r.minClearanceNm).toBe('number')
  })

  it('refuses bad input with 400 naming the field, an unknown passage included', async () => {
    const bad = [
      [{ from: { lat: 95, lon: 0 }, to: SINGAPORE }, 'from.lat'],
      [{ from: ROTTERDAM }, 'to'],
      [{ from: ROTTERDAM, to: SINGAPORE, avoid: ['suez', 'atlantis'] }, 'avoid.1'],
      [{ from: ROTTERDAM, to: SINGAPORE, clearanceNm: -1 }, 'clearanceNm'],
      [{ from: ROTTERDAM, to: SINGAPORE, limitLat: 'north' }, 'limitLat'],
    ] as const
    for (const [body, field] of bad) {
      const res = await api.request('/api/routing/sea', { method: 'POST', body })
      expect(res.status, JSON.stringify(body)).toBe(400)
      expect(res.body.message).toContain(field)
    }
  })

  it('routes from a mid-ocean position, far from any graph node, without moving it', async () => {
    // 0°, 140°W: open Pacific, hundreds of miles from land (from memory).
    const res = await api.request('/api/routing/sea', { method: 'POST', body: { from: { lat: 0, lon: -140 }, to: { lat: 10, lon: -150 } } })
    expect(res.status).toBe(200)
    expect(res.body.moved).toEqual({})
    expect(res.body.waypoints[0]).toMatchObject({ lat: 0, lon: -140 })
  })

  it('refuses an end far inland with 422 naming it', async () => {
    // The central Sahara, hundreds of miles from the sea (from memory).
    const res = await api.request('/api/routing/sea', { method: 'POST', body: { from: ROTTERDAM, to: { lat: 23, lon: 13 } } })
    expect(res.status).toBe(422)
    expect(res.body.message).toMatch(/^to /)
  })
})
