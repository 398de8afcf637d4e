// Land checks kept with a plan (issue 12 items 8 and 13): every crossing of every leg, stored with
// the track it checked, acknowledged leg by leg by editors of the plan's company, and sent with
// GET /api/plans/:id for the master to see at approval. Coastline positions are from memory
// (atlas knowledge), as in tests/unit/landCrossings.test.ts.
import { beforeAll, describe, expect, it } from 'vitest'
import { type Api, loginAs, startServer } from '../support/server'
import { expectStatus, makePlan, NORTH_SEA_WAYPOINTS } from '../support/records'

await startServer()

// Along 40.5°N from off Tarragona to off Vlorë (over Sardinia, the mainland to Taranto, the spit
// across Taranto's harbour entrance and Salento: four stretches over the 1:10m land the check uses,
// where the 1:50m coastline closes the entrance and gives three), then west into the Strait of Otranto, 20 nm or more from either shore.
const MED = [
  { name: 'Off Tarragona', lat: 40.5, lon: 2, method: 'rhumb' },
  { name: 'Off Vlore', lat: 40.5, lon: 19, method: 'rhumb' },
  { name: 'Otranto strait', lat: 40.5, lon: 18.6, method: 'rhumb' },
]

let planner: Api, master: Api, shore: Api, otherPlanner: Api
beforeAll(async () => {
  [planner, master, shore, otherPlanner] = await Promise.all([loginAs('planner'), loginAs('master'), loginAs('shore'), loginAs('otherPlanner')])
})

const view = async (id: number) => expectStatus(planner.request(`/api/plans/${id}`), 200)
const check = (api: Api, id: number, body: unknown) => api.request(`/api/plans/${id}/land-check`, { method: 'POST', body })
const ack = (api: Api, id: number, body: unknown) => api.request(`/api/plans/${id}/land-check/acknowledge`, { method: 'POST', body })

describe('land check of a plan', () => {
  let id = 0, version = 0, checkId = 0
  beforeAll(async () => {
    id = await makePlan('draft', { planner }, { waypoints: MED })
    version = (await view(id)).plan.version
  })

  it('reports every stretch over land of each leg and keeps the result', async () => {
    const kept = await expectStatus(check(planner, id, { version, clearanceNm: 5 }), 201)
    checkId = kept.id
    expect(kept.legs).toHaveLength(2)
    expect(kept.legs[0].crossesLand).toBe(true)
    expect(kept.legs[0].crossings).toHaveLength(4)
    expect(kept.legs[1].crossesLand).toBe(false)
    expect(kept.legs[1].withinClearance).toBe(false)
    expect(kept).toMatchObject({ flaggedLegs: 1, clearanceNm: 5, current: true, planVersion: version, acknowledgements: [] })
  })

  it('sends the kept check with the plan and writes it in the history', async () => {
    const v = await view(id)
    expect(v.landCheck.id).toBe(checkId)
    expect(v.landCheck.current).toBe(true)
    expect(v.landCheck.legs[0].crossings).toHaveLength(4)
    // Running the check changes nothing in the plan: its version stays.
    expect(v.plan.version).toBe(version)
    expect(v.events.at(-1)).toMatchObject({ kind: 'land_checked' })
    expect(v.events.at(-1).remarks).toMatch(/1 of 2 legs flagged.*crossing land: leg 1/)
  })

  it('refuses a check of a version the caller has not seen, and bad clearances naming the field', async () => {
    expect((await check(planner, id, { version: version - 1, clearanceNm: 5 })).status).toBe(409)
    const bad = await check(planner, id, { version, clearanceNm: -1 })
    expect(bad.status).toBe(400)
    expect(bad.body.message).toMatch(/^clearanceNm: /)
    expect((await view(id)).landCheck.id).toBe(checkId)
  })

  it('lets an editor acknowledge a flagged leg with a note, kept with the check and in the history', async () => {
    const note = 'Charted passage planned around Sardinia by the sea route; this leg is the sketch.'
    const kept = await expectStatus(ack(planner, id, { checkId, legIndex: 0, note }), 201)
    expect(kept.acknowledgements).toMatchObject([{ legIndex: 0, note, userName: expect.any(String) }])
    const v = await view(id)
    expect(v.landCheck.acknowledgements).toHaveLength(1)
    expect(v.events.at(-1)).toMatchObject({ kind: 'land_check_acknowledged' })
    expect(v.events.at(-1).remarks).toBe(`Leg 1 (Off Tarragona → Off Vlore): ${note}`)
  })

  it('refuses a note on a leg the check did not flag, an empty note and another plan\'s check, naming the field', async () => {
    const cases: [unknown, string][] = [
      [{ checkId, legIndex: 1, note: 'Clear' }, 'legIndex'],
      [{ checkId, legIndex: 7, note: 'No such leg' }, 'legIndex'],
      [{ checkId, legIndex: 0, note: '   ' }, 'note'],
      [{ legIndex: 0, note: 'No check named' }, 'checkId'],
    ]
    for (const [body, field] of cases) {
      const res = await ack(planner, id, body)
      expect(res.status, JSON.stringify(body)).toBe(400)
      expect(res.body.message).toMatch(new RegExp(`^${field}: `))
    }
    const other = await makePlan('draft', { planner }, { waypoints: MED })
    const otherCheck = await expectStatus(check(planner, other, { version: (await view(other)).plan.version, clearanceNm: 5 }), 201)
    const res = await ack(planner, id, { checkId: otherCheck.id, legIndex: 0, note: 'Wrong plan' })
    expect(res.status).toBe(400)
    expect(res.body.message).toMatch(/^checkId: /)
    expect((await view(id)).landCheck.acknowledgements).toHaveLength(1)
  })

  it('is for editors of the plan\'s company only', async () => {
    expect((await ack(shore, id, { checkId, legIndex: 0, note: 'Shore note' })).status).toBe(403)
    expect((await check(shore, id, { version, clearanceNm: 5 })).status).toBe(403)
    expect((await ack(otherPlanner, id, { checkId, legIndex: 0, note: 'Other company' })).status).toBe(404)
    expect((await check(otherPlanner, id, { version, clearanceNm: 5 })).status).toBe(404)
    // The master is an editor too.
    await expectStatus(ack(master, id, { checkId, legIndex: 0, note: 'Seen by the master.' }), 201)
    expect((await view(id)).landCheck.acknowledgements).toHaveLength(2)
  })

  it('marks the check out of date once the track changes, and refuses notes on it', async () => {
    const v = await view(id)
    const moved = MED.map((w, i) => (i === 2 ? { ...w, lon: 18.7 } : w))
    await expectStatus(planner.request(`/api/plans/${id}/waypoints`, { method: 'PUT', body: { version: v.plan.version, waypoints: moved } }), 200)
    const after = await view(id)
    expect(after.landCheck.id).toBe(checkId)
    expect(after.landCheck.current).toBe(false)
    expect((await ack(planner, id, { checkId, legIndex: 0, note: 'Too late' })).status).toBe(409)
  })
})

describe('land check of an approved plan', () => {
  it('is kept as it was approved: a new check is refused', async () => {
    const id = await makePlan('approved', { planner, master }, { waypoints: NORTH_SEA_WAYPOINTS })
    const v = await view(id)
    expect(v.landCheck).toBeNull()
    expect((await check(planner, id, { version: v.plan.version, clearanceNm: 5 })).status).toBe(409)
  })
})

describe('land check of an unsaved track', () => {
  it('answers every stretch over land without keeping anything', async () => {
    const res = await expectStatus(planner.request('/api/land-check', { method: 'POST', body: { waypoints: MED, clearanceNm: 5 } }), 200)
    expect(res.legs[0].crossings).toHaveLength(4)
    expect(res.id).toBeUndefined()
  })
})
