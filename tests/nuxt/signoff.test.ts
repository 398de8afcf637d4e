// Sign-off state machine through the HTTP API, against the real test database: every role ×
// action × state, the freeze after approval, the revision copy and the events written.
import { beforeAll, describe, expect, it } from 'vitest'
import { type Api, type DemoUser, loginAs, startServer } from '../support/server'

await startServer()

type State = 'draft' | 'submitted' | 'approved' | 'returned'
type Action = 'submit' | 'approve' | 'return' | 'revise'
const ROLES: DemoUser[] = ['planner', 'master', 'reliefMaster', 'shore', 'admin', 'otherPlanner', 'otherMaster']
const STATES: State[] = ['draft', 'submitted', 'approved', 'returned']
const ACTIONS: Action[] = ['submit', 'approve', 'return', 'revise']

// An invented short passage off the Dutch coast.
const WAYPOINTS = [
  { name: 'Test start', lat: 52.0, lon: 3.9, method: 'rhumb' },
  { name: 'Test middle', lat: 52.6, lon: 3.4, method: 'rhumb' },
  { name: 'Test end', lat: 53.3, lon: 4.2, method: 'geodesic' },
]

/** The rule under test: session, role (403), company (404), vessel master (403), state (409). */
function expected(who: DemoUser, action: Action, state: State): number {
  const role = { planner: 'planner', master: 'master', reliefMaster: 'master', shore: 'shore', admin: 'admin', otherPlanner: 'planner', otherMaster: 'master' }[who]
  const foreign = who === 'otherPlanner' || who === 'otherMaster'
  if (action === 'submit' || action === 'revise') {
    if (role !== 'planner' && role !== 'master') return 403
    if (foreign) return 404
    if (action === 'submit') return state === 'draft' || state === 'returned' ? 200 : 409
    return state === 'approved' ? 201 : 409
  }
  if (role !== 'master') return 403
  if (foreign) return 404
  if (who !== 'master') return 403
  return state === 'submitted' ? 200 : 409
}

const as: Partial<Record<DemoUser, Api>> = {}
let vesselId = 0
let counter = 0

async function ok(res: Promise<{ status: number, body: any }>, status = 200) {
  const r = await res
  if (r.status !== status) throw new Error(`expected ${status}, got ${r.status}: ${JSON.stringify(r.body)}`)
  return r.body
}

/** A fresh plan for Kestrel Dawn (master@ is its master) brought to `state` through the API. */
async function planIn(state: State, waypoints = WAYPOINTS): Promise<number> {
  const planner = as.planner!
  const { id } = await ok(planner.request('/api/plans', { method: 'POST', body: { vesselId, title: `Sign-off case ${++counter}`, departureUtc: '2026-12-20T08:00:00Z', speedKn: 12 } }), 201)
  if (waypoints.length) await ok(planner.request(`/api/plans/${id}/waypoints`, { method: 'PUT', body: { version: 1, waypoints } }))
  if (state === 'draft') return id
  await ok(planner.request(`/api/plans/${id}/submit`, { method: 'POST' }))
  if (state === 'approved') await ok(as.master!.request(`/api/plans/${id}/approve`, { method: 'POST' }))
  if (state === 'returned') await ok(as.master!.request(`/api/plans/${id}/return`, { method: 'POST', body: { remarks: 'Add the traffic separation scheme.' } }))
  return id
}

function act(api: Api, id: number, action: Action) {
  return api.request(`/api/plans/${id}/${action}`, { method: 'POST', body: action === 'return' ? { remarks: 'Please re-check leg 2.' } : undefined })
}

beforeAll(async () => {
  for (const who of ROLES) as[who] = await loginAs(who)
  const vessels = (await as.planner!.request('/api/vessels')).body as { id: number, name: string }[]
  vesselId = vessels.find(v => v.name === 'Kestrel Dawn')!.id
})

describe('role × action × state', () => {
  const cases = ROLES.flatMap(who => ACTIONS.flatMap(action => STATES.map(state => ({ who, action, state, status: expected(who, action, state) }))))
  it.each(cases)('$who $action on a $state plan → $status', async ({ who, action, state, status }) => {
    const id = await planIn(state)
    const before = (await as.planner!.request(`/api/plans/${id}`)).body
    const res = await act(as[who]!, id, action)
    expect(res.status, JSON.stringify(res.body)).toBe(status)
    const after = (await as.planner!.request(`/api/plans/${id}`)).body
    if (status >= 400) {
      expect(after.plan.status).toBe(state)
      expect(after.plan.version).toBe(before.plan.version)
      expect(after.events).toHaveLength(before.events.length)
      return
    }
    const to = { submit: 'submitted', approve: 'approved', return: 'returned', revise: 'approved' }[action]
    expect(after.plan.status).toBe(to)
    expect(after.plan.version).toBe(before.plan.version + 1)
    expect(after.events).toHaveLength(before.events.length + 1)
  })
})

describe('sign-off rules', () => {
  it('refuses to submit a plan with fewer than two waypoints (409 with a message)', async () => {
    // The waypoint sheet itself refuses fewer than two, so the short plan is a new one with none yet.
    const id = await planIn('draft', [])
    const res = await act(as.planner!, id, 'submit')
    expect(res.status).toBe(409)
    expect(res.body.message).toMatch(/at least two waypoints/)
  })

  it('requires remarks (1–2000 characters) to return a plan', async () => {
    const id = await planIn('submitted')
    const url = `/api/plans/${id}/return`
    expect((await as.master!.request(url, { method: 'POST', body: {} })).status).toBe(400)
    expect((await as.master!.request(url, { method: 'POST', body: { remarks: '   ' } })).body.message).toMatch(/^remarks/)
    expect((await as.master!.request(url, { method: 'POST', body: { remarks: 'x'.repeat(2001) } })).status).toBe(400)
    expect((await as.master!.request(url, { method: 'POST', body: { remarks: 'nul \u0000 inside' } })).status).toBe(400)
    expect((await as.master!.request(url, { method: 'POST', body: { remarks: 'bell \u0007 inside' } })).body.message).toMatch(/^remarks: .*control characters/)
    expect((await as.master!.request(url, { method: 'POST', body: { remarks: 'x'.repeat(2000) } })).status).toBe(200)
  })

  it('refuses a step taken against a stale version (409)', async () => {
    const id = await planIn('submitted')
    const res = await as.master!.request(`/api/plans/${id}/approve`, { method: 'POST', body: { version: 1 } })
    expect(res.status).toBe(409)
  })

  it('answers 404 for a plan that does not exist and 401 without a session', async () => {
    expect((await as.planner!.request('/api/plans/999999/submit', { method: 'POST' })).status).toBe(404)
    const id = await planIn('draft')
    expect((await fetch((await import('../support/server')).url(`/api/plans/${id}/submit`), { method: 'POST' })).status).toBe(401)
  })

  it('freezes an approved plan: waypoints and header cannot change', async () => {
    const id = await planIn('approved')
    const view = (await as.planner!.request(`/api/plans/${id}`)).body
    const put = await as.planner!.request(`/api/plans/${id}/waypoints`, { method: 'PUT', body: { version: view.plan.version, waypoints: WAYPOINTS.slice(0, 2) } })
    expect(put.status).toBe(409)
    const header = await as.master!.request(`/api/plans/${id}`, { method: 'PUT', body: { version: view.plan.version, title: 'Changed', departureUtc: '2026-12-21T08:00:00Z', speedKn: 10 } })
    expect(header.status).toBe(409)
    const after = (await as.planner!.request(`/api/plans/${id}`)).body
    expect(after.waypoints).toEqual(view.waypoints)
    expect(after.plan.title).toBe(view.plan.title)
    expect(after.plan.approvedByName).toBe('Capt. Mirela Oduya')
    expect(after.plan.approvedAt).toBeTruthy()
  })

  it('editing a returned plan brings it back to draft, and it can be submitted again', async () => {
    const id = await planIn('returned')
    const view = (await as.planner!.request(`/api/plans/${id}`)).body
    const put = await as.planner!.request(`/api/plans/${id}/waypoints`, { method: 'PUT', body: { version: view.plan.version, waypoints: WAYPOINTS.slice(0, 2) } })
    expect(put.status).toBe(200)
    expect(put.body.plan.status).toBe('draft')
    expect(put.body.events.at(-1)).toMatchObject({ kind: 'reopened', userName: 'Tomas Verhoeven', fromStatus: 'returned', toStatus: 'draft' })
    expect((await act(as.planner!, id, 'submit')).status).toBe(200)
  })
})

describe('revisions', () => {
  it('copies an approved plan into a new draft with revision + 1 and leaves the original as it was', async () => {
    const id = await planIn('approved')
    const original = (await as.planner!.request(`/api/plans/${id}`)).body
    const res = await act(as.planner!, id, 'revise')
    expect(res.status).toBe(201)
    const copy = res.body
    expect(copy.plan.id).not.toBe(id)
    expect(copy.plan).toMatchObject({ status: 'draft', revision: original.plan.revision + 1, revisionOfPlanId: id, title: original.plan.title, vesselId })
    expect(copy.plan.approvedAt).toBeNull()
    expect(copy.waypoints).toEqual(original.waypoints)
    expect(copy.totals.distanceNm).toBeCloseTo(original.totals.distanceNm, 9)
    expect(copy.events.map((e: any) => e.kind)).toEqual(['revision_started'])

    const after = (await as.planner!.request(`/api/plans/${id}`)).body
    expect(after.plan).toMatchObject({ status: 'approved', revision: original.plan.revision, approvedAt: original.plan.approvedAt })
    expect(after.waypoints).toEqual(original.waypoints)
    expect(after.events.at(-1)).toMatchObject({ kind: 'revised', userName: 'Tomas Verhoeven' })

    // The copy is editable; the original still is not. One open revision at a time.
    const edit = await as.planner!.request(`/api/plans/${copy.plan.id}/waypoints`, { method: 'PUT', body: { version: copy.plan.version, waypoints: WAYPOINTS.slice(0, 2) } })
    expect(edit.status).toBe(200)
    expect((await as.planner!.request(`/api/plans/${id}`)).body.waypoints).toEqual(original.waypoints)
    expect((await act(as.master!, id, 'revise')).status).toBe(409)
  })
})

describe('history', () => {
  it('writes an event for every step with who, role, from, to and remarks', async () => {
    const id = await planIn('returned')
    await ok(act(as.planner!, id, 'submit'))
    await ok(act(as.master!, id, 'approve'))
    const { events, plan } = (await as.shore!.request(`/api/plans/${id}`)).body
    expect(plan.status).toBe('approved')
    const steps = events.map((e: any) => [e.kind, e.userName, e.role, e.fromStatus, e.toStatus])
    expect(steps).toEqual([
      ['created', 'Tomas Verhoeven', 'planner', null, 'draft'],
      ['submitted', 'Tomas Verhoeven', 'planner', 'draft', 'submitted'],
      ['returned', 'Capt. Mirela Oduya', 'master', 'submitted', 'returned'],
      ['submitted', 'Tomas Verhoeven', 'planner', 'returned', 'submitted'],
      ['approved', 'Capt. Mirela Oduya', 'master', 'submitted', 'approved'],
    ])
    expect(events[2].remarks).toBe('Add the traffic separation scheme.')
    for (const e of events) expect(Number.isNaN(Date.parse(e.createdAt))).toBe(false)
  })

  it('lets every role of the company add a remark to any plan, without changing its version', async () => {
    const id = await planIn('approved')
    const before = (await as.planner!.request(`/api/plans/${id}`)).body
    for (const who of ['shore', 'admin', 'planner', 'reliefMaster'] as const) {
      const res = await as[who]!.request(`/api/plans/${id}/remarks`, { method: 'POST', body: { remarks: `Remark from ${who}` } })
      expect(res.status, who).toBe(201)
    }
    const after = (await as.planner!.request(`/api/plans/${id}`)).body
    expect(after.plan.version).toBe(before.plan.version)
    expect(after.events.filter((e: any) => e.kind === 'remark').map((e: any) => [e.role, e.remarks])).toEqual([
      ['shore', 'Remark from shore'], ['admin', 'Remark from admin'], ['planner', 'Remark from planner'], ['master', 'Remark from reliefMaster'],
    ])
    expect((await as.otherPlanner!.request(`/api/plans/${id}/remarks`, { method: 'POST', body: { remarks: 'Hello' } })).status).toBe(404)
    expect((await as.shore!.request(`/api/plans/${id}/remarks`, { method: 'POST', body: { remarks: '' } })).status).toBe(400)
  })
})
