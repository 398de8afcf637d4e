import { beforeAll, describe, expect, it } from 'vitest'
import { client, loginAs, startServer } from '../support/server'
import type { Api } from '../support/server'

await startServer()

const dms = (d: number, m: number, s = 0) => d + m / 60 + s / 3600
const JFK = { lat: dms(40, 38, 23), lon: -dms(73, 46, 44) }
const SIN = { lat: dms(1, 21, 33), lon: dms(103, 59, 22) }

describe('geodesy API', () => {
  let api: Api
  beforeAll(async () => { api = await loginAs('planner') })

  it('needs a session', async () => {
    for (const path of ['inverse', 'direct', 'composite', 'cross-track'])
      expect((await client().request(`/api/geodesy/${path}`, { method: 'POST', body: {} })).status).toBe(401)
  })

  it('inverse: geodesic, rhumb and great ellipse side by side (GeodSolve and RhumbSolve manuals)', async () => {
    const res = await api.request('/api/geodesy/inverse', { method: 'POST', body: { from: JFK, to: SIN } })
    expect(res.status).toBe(200)
    expect(Object.keys(res.body).sort()).toEqual(['geodesic', 'greatEllipse', 'rhumb'])
    expect(Math.abs(res.body.geodesic.distanceM - 15347628)).toBeLessThan(0.5) // GeodSolve(1) manual
    expect(Math.abs(res.body.geodesic.initialCourse - dms(3, 18, 29.9)) * 3600).toBeLessThan(0.05) // GeodSolve(1) manual
    expect(Math.abs(res.body.geodesic.finalCourse - dms(177, 29, 9.2)) * 3600).toBeLessThan(0.05) // GeodSolve(1) manual
    expect(res.body.geodesic.distanceNm).toBeCloseTo(res.body.geodesic.distanceM / 1852, 9)
    expect(Math.abs(res.body.rhumb.distanceM - 18523563)).toBeLessThan(0.5) // RhumbSolve(1) manual
    expect(Math.abs(res.body.rhumb.course - dms(103, 34, 58.2)) * 3600).toBeLessThan(0.05) // RhumbSolve(1) manual
    expect(res.body.greatEllipse.distanceM).toBeGreaterThanOrEqual(res.body.geodesic.distanceM)
    expect(Object.keys(res.body.rhumb).sort()).toEqual(['course', 'distanceM', 'distanceNm'])
  })

  it('inverse: coincident points and antipodes give defined answers', async () => {
    const same = await api.request('/api/geodesy/inverse', { method: 'POST', body: { from: { lat: 10, lon: 20 }, to: { lat: 10, lon: 20 } } })
    expect(same.status).toBe(200)
    expect(same.body.geodesic.distanceM).toBe(0)
    expect(same.body.rhumb.distanceM).toBe(0)
    expect(same.body.greatEllipse.distanceM).toBe(0)
    const anti = await api.request('/api/geodesy/inverse', { method: 'POST', body: { from: { lat: 0, lon: 0 }, to: { lat: 0, lon: 180 } } })
    expect(anti.status).toBe(200)
    expect(Math.abs(anti.body.geodesic.distanceM - 20003931)).toBeLessThan(0.5) // GeographicLib geodesic tests: over the pole
    for (const c of [anti.body.geodesic.initialCourse, anti.body.rhumb.course, anti.body.greatEllipse.initialCourse]) {
      expect(c).toBeGreaterThanOrEqual(0)
      expect(c).toBeLessThan(360)
    }
  })

  it('inverse: bad input answers 400 naming the field', async () => {
    const far = await api.request('/api/geodesy/inverse', { method: 'POST', body: { from: { lat: 91, lon: 0 }, to: { lat: 0, lon: 0 } } })
    expect(far.status).toBe(400)
    expect(far.body.message).toMatch(/from\.lat/)
    const text = await api.request('/api/geodesy/inverse', { method: 'POST', body: { from: { lat: '37N', lon: 0 }, to: { lat: 0, lon: 0 } } })
    expect(text.status).toBe(400)
    expect(text.body.message).toMatch(/from\.lat/)
    const missing = await api.request('/api/geodesy/inverse', { method: 'POST', body: { from: { lat: 0, lon: 0 } } })
    expect(missing.status).toBe(400)
    expect(missing.body.message).toMatch(/to/)
  })

  it('direct: geodesic (Karney 2013, table 2) and rhumb (RhumbSolve manual)', async () => {
    const g = await api.request('/api/geodesy/direct', { method: 'POST', body: { from: { lat: 40, lon: 0 }, course: 30, distanceM: 10_000_000, method: 'geodesic' } })
    expect(g.status).toBe(200)
    expect(g.body.to.lat).toBeCloseTo(41.79331020506, 10) // Karney 2013, table 2
    expect(g.body.to.lon).toBeCloseTo(137.84490004377, 10) // Karney 2013, table 2
    expect(g.body.finalCourse).toBeCloseTo(149.09016931807, 10) // Karney 2013, table 2
    const r = await api.request('/api/geodesy/direct', { method: 'POST', body: { from: JFK, course: dms(103, 34, 58.2), distanceM: 2_000_000, method: 'rhumb' } })
    expect(r.status).toBe(200)
    expect(Math.abs(r.body.to.lat - dms(36, 24, 30.3)) * 3600).toBeLessThan(0.1) // RhumbSolve(1) manual
    expect(Math.abs(r.body.to.lon + dms(51, 28, 26.4)) * 3600).toBeLessThan(0.1) // RhumbSolve(1) manual
  })

  it('direct: a rhumb line over a pole and bad input answer 400, never 500', async () => {
    const pole = await api.request('/api/geodesy/direct', { method: 'POST', body: { from: { lat: 80, lon: 0 }, course: 10, distanceM: 3_000_000, method: 'rhumb' } })
    expect(pole.status).toBe(400)
    expect(pole.body.message).toMatch(/pole/)
    const bad = await api.request('/api/geodesy/direct', { method: 'POST', body: { from: { lat: 0, lon: 0 }, course: 400, distanceM: -1, method: 'sail' } })
    expect(bad.status).toBe(400)
    expect(bad.body.message).toMatch(/course/)
    const zero = await api.request('/api/geodesy/direct', { method: 'POST', body: { from: { lat: 90, lon: 0 }, course: 0, distanceM: 0, method: 'geodesic' } })
    expect(zero.status).toBe(200)
  })

  it('composite: held at the limit, or a clear kind when not needed or not possible', async () => {
    const body = { from: { lat: 35, lon: 141 }, to: { lat: 48.4, lon: -124.8 } }
    const held = await api.request('/api/geodesy/composite', { method: 'POST', body: { ...body, limitLat: 50 } })
    expect(held.status).toBe(200)
    expect(held.body.kind).toBe('composite')
    expect(held.body.points).toHaveLength(4)
    expect(held.body.legs.map((l: { kind: string }) => l.kind)).toEqual(['geodesic', 'parallel', 'geodesic'])
    expect(held.body.distanceNm).toBeCloseTo(held.body.distanceM / 1852, 9)
    expect(Math.abs(held.body.points[1].lat - 50)).toBeLessThan(1e-9)
    expect((await api.request('/api/geodesy/composite', { method: 'POST', body: { ...body, limitLat: 60 } })).body.kind).toBe('not-needed')
    expect((await api.request('/api/geodesy/composite', { method: 'POST', body: { ...body, limitLat: 45 } })).body.kind).toBe('end-beyond-limit')
    const bad = await api.request('/api/geodesy/composite', { method: 'POST', body: { ...body, limitLat: 90 } })
    expect(bad.status).toBe(400)
    expect(bad.body.message).toMatch(/limitLat/)
  })

  it('cross-track: positive to starboard; a leg without length is still answered', async () => {
    const res = await api.request('/api/geodesy/cross-track', { method: 'POST', body: { from: { lat: 0, lon: 0 }, to: { lat: 10, lon: 0 }, position: { lat: 5, lon: 0.5 } } })
    expect(res.status).toBe(200)
    expect(Object.keys(res.body).sort()).toEqual(['alongTrackM', 'crossTrackM'])
    expect(res.body.crossTrackM).toBeGreaterThan(0)
    expect(res.body.alongTrackM).toBeGreaterThan(0)
    const point = await api.request('/api/geodesy/cross-track', { method: 'POST', body: { from: { lat: 1, lon: 1 }, to: { lat: 1, lon: 1 }, position: { lat: 1, lon: 2 } } })
    expect(point.status).toBe(200)
    expect(point.body.alongTrackM).toBe(0)
    const bad = await api.request('/api/geodesy/cross-track', { method: 'POST', body: { from: { lat: 0, lon: 0 }, to: { lat: 1, lon: 1 } } })
    expect(bad.status).toBe(400)
    expect(bad.body.message).toMatch(/position/)
  })
})
