// Two planners (here: a thousand requests) saving the same plan at once: one wins, the rest get 409.
import { describe, expect, it } from 'vitest'
import { loginAs, startServer } from '../support/server'

await startServer()

describe('racing waypoint saves', () => {
  it('1,000 writes on the same version: exactly one lands, every other one gets 409, no update is lost or mixed', async () => {
    const planner = await loginAs('planner')
    const master = await loginAs('master')
    const vessels = (await planner.request('/api/vessels')).body as { id: number, name: string }[]
    const vesselId = vessels.find(v => v.name === 'Kestrel Dawn')!.id
    const created = await planner.request('/api/plans', { method: 'POST', body: { vesselId, title: 'Race test – Biscay', departureUtc: '2027-01-05T06:00:00Z', speedKn: 13 } })
    expect(created.status).toBe(201)
    const id = created.body.id

    const attempts = Array.from({ length: 1000 }, (_, i) => ({
      who: i % 2 ? planner : master,
      waypoints: [
        { name: `Ushant ${i}`, lat: 48.5, lon: -5.3, method: 'rhumb' },
        { name: 'Finisterre', lat: 43 + i / 10_000, lon: -9.6, method: 'geodesic' },
      ],
    }))
    const results = await Promise.all(attempts.map(a => a.who.request(`/api/plans/${id}/waypoints`, { method: 'PUT', body: { version: 1, waypoints: a.waypoints } })))
    const statuses = results.map(r => r.status)
    expect(statuses.filter(s => s === 200)).toHaveLength(1)
    expect(statuses.filter(s => s === 409)).toHaveLength(999)

    const winner = attempts[statuses.indexOf(200)]!
    const stored = (await planner.request(`/api/plans/${id}`)).body
    expect(stored.plan.version).toBe(2)
    expect(stored.waypoints.map((w: any) => [w.name, w.lat])).toEqual(winner.waypoints.map(w => [w.name, w.lat]))
  })
})
