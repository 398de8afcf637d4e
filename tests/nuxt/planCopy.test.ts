// POST /api/plans/:id/copy: a new draft from an earlier plan, as it is or reversed (the return passage).
import { beforeAll, describe, expect, it } from 'vitest'
import { loginAs, startServer, type Api } from '../support/server'
import { expectStatus, makePlan, vesselIdNamed } from '../support/records'

await startServer()

// An invented passage off the Dutch and German coasts; each waypoint carries the leg arriving at it.
const WAYPOINTS = [
  { name: 'Maas offing', lat: 52.0, lon: 3.9, method: 'rhumb', notes: 'pilot boards here' },
  { name: 'Texel TSS west', lat: 53.2, lon: 4.1, method: 'rhumb', speedKn: 11, xteNm: 0.5 },
  { name: 'German Bight', lat: 54.0, lon: 7.0, method: 'geodesic', speedKn: 13, turnRadiusNm: 1.5 },
]

type View = { plan: { id: number, title: string, status: string, version: number, vesselId: number, departureUtc: string, arrivalUtc: string | null, speedKn: number, departurePlaceId: number | null, arrivalPlaceId: number | null }, waypoints: typeof WAYPOINTS, totals: { distanceNm: number }, events: { kind: string, remarks: string | null }[] }

describe('copying a plan', () => {
  let planner: Api
  let sourceId = 0
  let source: View

  beforeAll(async () => {
    planner = await loginAs('planner')
    const vesselId = await vesselIdNamed(planner, 'Kestrel Dawn')
    const places = await expectStatus<{ id: number, name: string }[]>(planner.request('/api/places'), 200)
    const placeId = (name: string) => places.find(p => p.name === name)!.id
    const { id } = await expectStatus<{ id: number }>(planner.request('/api/plans', { method: 'POST', body: {
      vesselId, title: 'Maas – German Bight', departureUtc: '2027-03-01T06:00:00Z', speedKn: 12, departurePlaceId: placeId('Rotterdam'), arrivalPlaceId: placeId('Singapore'),
    } }), 201)
    await expectStatus(planner.request(`/api/plans/${id}/waypoints`, { method: 'PUT', body: { version: 1, waypoints: WAYPOINTS } }), 200)
    sourceId = id
    source = await expectStatus<View>(planner.request(`/api/plans/${id}`), 200)
  })

  it('copies the track and header as a new draft of the same vessel, naming where it came from', async () => {
    const { id } = await expectStatus<{ id: number }>(planner.request(`/api/plans/${sourceId}/copy`, { method: 'POST', body: { reversed: false } }), 201)
    expect(id).not.toBe(sourceId)
    const copy = await expectStatus<View>(planner.request(`/api/plans/${id}`), 200)
    expect(copy.plan).toMatchObject({ status: 'draft', version: 1, title: 'Maas – German Bight (copy)', vesselId: source.plan.vesselId, departureUtc: source.plan.departureUtc, speedKn: 12, departurePlaceId: source.plan.departurePlaceId, arrivalPlaceId: source.plan.arrivalPlaceId })
    expect(copy.waypoints).toEqual(source.waypoints)
    expect(copy.events.map(e => e.kind)).toEqual(['created'])
    expect(copy.events[0]!.remarks).toContain(`plan ${sourceId}`)
    // The source is untouched.
    expect((await expectStatus<View>(planner.request(`/api/plans/${sourceId}`), 200)).plan.version).toBe(source.plan.version)
  })

  it('reversed: the waypoints in the other order, each leg keeping its own method, speed and limits, the ports swapped', async () => {
    const { id } = await expectStatus<{ id: number }>(planner.request(`/api/plans/${sourceId}/copy`, { method: 'POST', body: { reversed: true } }), 201)
    const back = await expectStatus<View>(planner.request(`/api/plans/${id}`), 200)
    expect(back.plan.title).toBe('Maas – German Bight (return)')
    expect(back.plan.departurePlaceId).toBe(source.plan.arrivalPlaceId)
    expect(back.plan.arrivalPlaceId).toBe(source.plan.departurePlaceId)
    // The return passage leaves when the outward one arrives (no port time given).
    expect(back.plan.departureUtc).toBe(source.plan.arrivalUtc)
    expect(back.waypoints.map(w => w.name)).toEqual(['German Bight', 'Texel TSS west', 'Maas offing'])
    // Leg German Bight → Texel is the outward Texel → German Bight leg: geodesic at 13 kn, turn radius 1.5 nm.
    expect(back.waypoints[1]).toMatchObject({ method: 'geodesic', speedKn: 13, turnRadiusNm: 1.5, xteNm: null })
    expect(back.waypoints[2]).toMatchObject({ method: 'rhumb', speedKn: 11, xteNm: 0.5, notes: 'pilot boards here' })
    // Geodesic and rhumb-line distances do not depend on the direction sailed (common practice), so the total is the same.
    expect(back.totals.distanceNm).toBeCloseTo(source.totals.distanceNm, 6)
  })

  it('takes a title and departure time of its own, and copies an approved plan too', async () => {
    const master = await loginAs('master')
    const approved = await makePlan('approved', { planner, master })
    const { id } = await expectStatus<{ id: number }>(planner.request(`/api/plans/${approved}/copy`, { method: 'POST', body: { reversed: false, title: 'Second voyage', departureUtc: '2027-05-02T10:00:00Z' } }), 201)
    const copy = await expectStatus<View>(planner.request(`/api/plans/${id}`), 200)
    expect(copy.plan).toMatchObject({ title: 'Second voyage', departureUtc: '2027-05-02T10:00:00.000Z', status: 'draft' })
  })

  it('refuses bad input naming the field, and plans of another company or none as not found', async () => {
    const bad = [[{ reversed: 'yes' }, 'reversed'], [{}, 'reversed'], [{ reversed: true, title: 'ab' }, 'title'],
      [{ reversed: true, departureUtc: '9999-01-01T00:00:00Z' }, 'departureUtc'], [{ reversed: true, vesselId: 1 }, 'vesselId']] as const
    for (const [body, field] of bad) {
      const res = await planner.request(`/api/plans/${sourceId}/copy`, { method: 'POST', body })
      expect(res.status, JSON.stringify(body)).toBe(400)
      expect(res.body.message).toContain(field)
    }
    const other = await loginAs('otherPlanner')
    expect((await planner.request(`/api/plans/${sourceId}/copy`, { method: 'POST' })).status).toBe(400)
    const body = { reversed: true }
    expect((await other.request(`/api/plans/${sourceId}/copy`, { method: 'POST', body })).status).toBe(404)
    expect((await planner.request('/api/plans/2147483647/copy', { method: 'POST', body })).status).toBe(404)
    expect((await (await loginAs('shore')).request(`/api/plans/${sourceId}/copy`, { method: 'POST', body })).status).toBe(403)
  })
})
