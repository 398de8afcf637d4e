// A plan's departure and arrival places are scoped to the caller's company: another company's
// place and one that does not exist get the same 400 naming the field, and nothing stored changes
// (no plan, no header change, no other company's time zone). The other ids bodies carry are
// probed route by route in the access-control suite (BODY_IDS in tests/support/accessRules.ts).
import { beforeAll, describe, expect, it } from 'vitest'
import { type Api, loginAs, startServer } from '../support/server'
import { expectStatus, makePlan, vesselIdNamed } from '../support/records'

await startServer()

const MISSING_ID = 2_000_000_000

let planner: Api
let otherPlanner: Api
let ownPlace: number
let foreignPlace: number
let ownVessel: number

beforeAll(async () => {
  planner = await loginAs('planner')
  otherPlanner = await loginAs('otherPlanner')
  ownPlace = (await expectStatus<{ id: number }[]>(planner.request('/api/places'), 200))[0]!.id
  foreignPlace = (await expectStatus<{ id: number }[]>(otherPlanner.request('/api/places'), 200))[0]!.id
  ownVessel = await vesselIdNamed(planner, 'Kestrel Dawn')
})

const newPlan = (extra: Record<string, unknown>) => ({ vesselId: ownVessel, title: 'Scope of place ids', departureUtc: '2027-02-01T06:00:00Z', speedKn: 12, ...extra })

/** Both answers are 400, name the field, and say the same thing (existence does not leak). */
async function expectSameRefusal(field: string, send: (id: number) => Promise<{ status: number, body: any }>) {
  const foreign = await send(foreignPlace)
  const missing = await send(MISSING_ID)
  expect(foreign.status, JSON.stringify(foreign.body)).toBe(400)
  expect(missing.status, JSON.stringify(missing.body)).toBe(400)
  expect(foreign.body.message).toMatch(new RegExp(`^${field}: `))
  expect(foreign.body.message).toBe(missing.body.message)
}

describe('place ids in a plan', () => {
  it.each(['departurePlaceId', 'arrivalPlaceId'])('POST /api/plans refuses another company\'s or a missing %s, and stores no plan', async (field) => {
    const before = (await planner.request('/api/plans')).body.length
    await expectSameRefusal(field, id => planner.request('/api/plans', { method: 'POST', body: newPlan({ [field]: id }) }))
    await expectSameRefusal(field, id => planner.request('/api/plans', { method: 'POST', body: newPlan({ [field]: id, startFromPlaces: true }) }))
    expect((await planner.request('/api/plans')).body.length).toBe(before)
  })

  it('POST /api/plans takes the company\'s own places', async () => {
    const { id } = await expectStatus<{ id: number }>(planner.request('/api/plans', { method: 'POST', body: newPlan({ departurePlaceId: ownPlace, arrivalPlaceId: ownPlace }) }), 201)
    expect((await planner.request(`/api/plans/${id}`)).body.plan.departurePlaceId).toBe(ownPlace)
  })

  it.each(['departurePlaceId', 'arrivalPlaceId'])('PUT /api/plans/:id refuses another company\'s or a missing %s, and the header stays as it was', async (field) => {
    const id = await makePlan('draft', { planner })
    const before = (await planner.request(`/api/plans/${id}`)).body.plan
    await expectSameRefusal(field, placeId => planner.request(`/api/plans/${id}`, {
      method: 'PUT', body: { version: before.version, title: 'Changed title', departureUtc: before.departureUtc, speedKn: 12, [field]: placeId },
    }))
    const after = (await planner.request(`/api/plans/${id}`)).body.plan
    expect(after).toMatchObject({ version: before.version, title: before.title, departurePlaceId: null, arrivalPlaceId: null })
    expect(after.departureTimeZone).toBe(before.departureTimeZone)
  })
})
