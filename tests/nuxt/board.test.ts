// GET /api/plans/board: the passage board paged, sorted and filtered on the server, in the caller's
// company only. Every expectation is counted from the plans this file makes (a title prefix no other
// file uses), so plans made by other files never change the answer.
import { beforeAll, describe, expect, it } from 'vitest'
import { client, loginAs, startServer, type Api } from '../support/server'
import { expectStatus, makePlan, vesselIdNamed } from '../support/records'

await startServer()

const PREFIX = `Board ${process.pid}`
type BoardPage = { plans: { id: number, title: string, status: string, vesselName: string, departureUtc: string }[], total: number, viewTotal: number, finished: number, page: number, pageSize: number }

describe('passage board API', () => {
  let planner: Api
  let master: Api
  const made: { id: number, title: string, departureUtc: string, vessel: string }[] = []
  let finishedId = 0

  const board = (api: Api, query: Record<string, string | number>) =>
    expectStatus<BoardPage>(api.request(`/api/plans/board?${new URLSearchParams(Object.entries(query).map(([k, v]) => [k, String(v)]))}`), 200)

  beforeAll(async () => {
    planner = await loginAs('planner')
    master = await loginAs('master')
    const vessels = { 'Kestrel Dawn': await vesselIdNamed(planner, 'Kestrel Dawn'), 'Bight Voyager': await vesselIdNamed(planner, 'Bight Voyager') }
    // Twelve drafts, departures a day apart, made out of order; two on Bight Voyager.
    for (const day of [7, 2, 11, 5, 1, 9, 12, 3, 8, 4, 10, 6]) {
      const vessel = day % 6 === 0 ? 'Bight Voyager' : 'Kestrel Dawn'
      const title = `${PREFIX} leg ${String(day).padStart(2, '0')}`
      const departureUtc = `2027-05-${String(day).padStart(2, '0')}T06:00:00.000Z`
      const { id } = await expectStatus<{ id: number }>(planner.request('/api/plans', { method: 'POST', body: { vesselId: vessels[vessel], title, departureUtc, speedKn: 12 } }), 201)
      made.push({ id, title, departureUtc, vessel })
    }
    // A voyage that ended years ago: approved, its ETA long past.
    finishedId = await makePlan('approved', { planner, master }, { title: `${PREFIX} finished 2021`, departureUtc: '2021-01-10T08:00:00Z' })
  })

  it('pages through the filtered plans without gaps or repeats, the count beside', async () => {
    const seen: number[] = []
    for (const page of [1, 2, 3]) {
      const res = await board(planner, { q: PREFIX, pageSize: 5, page, sort: 'departureUtc', dir: 'asc' })
      expect(res.total).toBe(12)
      expect(res.plans.length).toBe(page < 3 ? 5 : 2)
      seen.push(...res.plans.map(p => p.id))
    }
    expect(new Set(seen).size).toBe(12)
    expect([...seen].sort()).toEqual(made.map(p => p.id).sort())
    const beyond = await board(planner, { q: PREFIX, pageSize: 5, page: 4 })
    expect(beyond.plans).toEqual([])
    expect(beyond.total).toBe(12)
  })

  it('sorts on the server by departure and by title, both ways', async () => {
    const byDeparture = [...made].sort((a, b) => a.departureUtc.localeCompare(b.departureUtc)).map(p => p.id)
    expect((await board(planner, { q: PREFIX, sort: 'departureUtc', dir: 'asc' })).plans.map(p => p.id)).toEqual(byDeparture)
    expect((await board(planner, { q: PREFIX, sort: 'departureUtc', dir: 'desc' })).plans.map(p => p.id)).toEqual([...byDeparture].reverse())
    const titles = (await board(planner, { q: PREFIX, sort: 'title', dir: 'asc', pageSize: 3 })).plans.map(p => p.title)
    expect(titles).toEqual([`${PREFIX} leg 01`, `${PREFIX} leg 02`, `${PREFIX} leg 03`])
    const lastTitles = (await board(planner, { q: PREFIX, sort: 'title', dir: 'desc', pageSize: 2 })).plans.map(p => p.title)
    expect(lastTitles).toEqual([`${PREFIX} leg 12`, `${PREFIX} leg 11`])
  })

  it('filters by text (title or vessel name, wildcards taken literally), state and vessel', async () => {
    expect((await board(planner, { q: `${PREFIX} leg 1` })).plans.map(p => p.title).sort()).toEqual([`${PREFIX} leg 10`, `${PREFIX} leg 11`, `${PREFIX} leg 12`])
    expect((await board(planner, { q: `${PREFIX.toUpperCase()} LEG 07` })).total).toBe(1)
    expect((await board(planner, { q: `${PREFIX}%` })).total).toBe(0)
    expect((await board(planner, { q: `${PREFIX} leg _1` })).total).toBe(0)
    const bight = await vesselIdNamed(planner, 'Bight Voyager')
    const onBight = await board(planner, { q: PREFIX, vesselId: bight })
    expect(onBight.plans.map(p => p.title).sort()).toEqual([`${PREFIX} leg 06`, `${PREFIX} leg 12`])
    expect((await board(planner, { q: PREFIX, status: 'submitted' })).total).toBe(0)
    expect((await board(planner, { q: PREFIX, status: 'draft' })).total).toBe(12)
    // The vessel's name matches too: every plan on Bight Voyager, this file's two among them.
    const byVesselName = await board(planner, { q: 'bight voyager', pageSize: 200, view: 'all' })
    expect(byVesselName.plans.every(p => p.vesselName === 'Bight Voyager')).toBe(true)
    expect(byVesselName.plans.filter(p => p.title.startsWith(PREFIX)).length).toBe(2)
  })

  it('leaves finished voyages out of the default view and shows them on request', async () => {
    const current = await board(planner, { q: PREFIX, pageSize: 200 })
    expect(current.plans.some(p => p.id === finishedId)).toBe(false)
    expect(current.total).toBe(12)
    expect(current.finished).toBeGreaterThanOrEqual(1)
    const all = await board(planner, { q: PREFIX, pageSize: 200, view: 'all' })
    expect(all.total).toBe(13)
    expect(all.plans.find(p => p.id === finishedId)?.status).toBe('approved')
    expect(all.viewTotal).toBe(current.viewTotal + current.finished)
  })

  it('shows one company its own plans only', async () => {
    const other = await loginAs('otherPlanner')
    expect((await board(other, { q: PREFIX, view: 'all' })).total).toBe(0)
    const mine = await board(planner, { q: 'Auckland – Honolulu', view: 'all' })
    expect(mine.total).toBe(0)
    expect((await board(other, { q: 'Auckland – Honolulu', view: 'all' })).total).toBe(1)
    // Another company's vessel filters to nothing, never to that company's plans.
    const otherVessel = await vesselIdNamed(other, 'Larkspur Tern')
    expect((await board(planner, { vesselId: otherVessel, view: 'all' })).total).toBe(0)
  })

  it('refuses a bad query with 400 naming the field, and a caller without a session with 401', async () => {
    const cases: [string, string][] = [
      ['pageSize=201', 'pageSize'], ['pageSize=0', 'pageSize'], ['page=0', 'page'], ['page=1.5', 'page'], ['page=two', 'page'],
      ['sort=speedKn', 'sort'], ['dir=up', 'dir'], ['status=sunk', 'status'], ['vesselId=abc', 'vesselId'], ['view=archive', 'view'],
      [`q=${'x'.repeat(161)}`, 'q'], ['q=a&q=b', 'q'], ['colour=teal', 'colour'],
    ]
    for (const [query, field] of cases) {
      const res = await planner.request(`/api/plans/board?${query}`)
      expect(res.status, query).toBe(400)
      expect(res.body.message, query).toContain(field)
    }
    expect((await client().request('/api/plans/board')).status).toBe(401)
  })
})
