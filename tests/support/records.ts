// Records a test file makes for itself through the API, so no file depends on the shared demo
// records (or on what another file did to them) or on the order files run in.
import type { Api } from './server'

export type PlanState = 'draft' | 'submitted' | 'approved' | 'returned'

// An invented short passage off the Dutch coast, clear of land.
export const NORTH_SEA_WAYPOINTS = [
  { name: 'North Sea start', lat: 52.0, lon: 3.9, method: 'rhumb' },
  { name: 'North Sea middle', lat: 52.6, lon: 3.4, method: 'rhumb' },
  { name: 'North Sea end', lat: 53.3, lon: 4.2, method: 'geodesic' },
]

export async function expectStatus<T = any>(res: Promise<{ status: number, body: any }>, status: number): Promise<T> {
  const r = await res
  if (r.status !== status) throw new Error(`expected ${status}, got ${r.status}: ${JSON.stringify(r.body).slice(0, 300)}`)
  return r.body as T
}

export async function vesselIdNamed(api: Api, name: string): Promise<number> {
  const vessel = (await expectStatus<{ id: number, name: string }[]>(api.request('/api/vessels'), 200)).find(v => v.name === name)
  if (!vessel) throw new Error(`no vessel named ${name}`)
  return vessel.id
}

let made = 0

/**
 * A fresh plan brought to `state` through the API: created and submitted by `planner`, approved or
 * returned by `master` (the master of `vesselName`; Kestrel Dawn's is master@kestrel-bight.example).
 */
export async function makePlan(state: PlanState, who: { planner: Api, master?: Api }, options: { title?: string, vesselName?: string, waypoints?: unknown[], departureUtc?: string } = {}): Promise<number> {
  const vesselId = await vesselIdNamed(who.planner, options.vesselName ?? 'Kestrel Dawn')
  const title = options.title ?? `Test passage ${process.pid}-${++made}`
  const { id } = await expectStatus<{ id: number }>(who.planner.request('/api/plans', { method: 'POST', body: { vesselId, title, departureUtc: options.departureUtc ?? '2027-01-10T08:00:00Z', speedKn: 12 } }), 201)
  await expectStatus(who.planner.request(`/api/plans/${id}/waypoints`, { method: 'PUT', body: { version: 1, waypoints: options.waypoints ?? NORTH_SEA_WAYPOINTS } }), 200)
  if (state === 'draft') return id
  await expectStatus(who.planner.request(`/api/plans/${id}/submit`, { method: 'POST' }), 200)
  if (state === 'submitted') return id
  if (!who.master) throw new Error('approving or returning needs the vessel\'s master')
  if (state === 'approved') await expectStatus(who.master.request(`/api/plans/${id}/approve`, { method: 'POST' }), 200)
  else await expectStatus(who.master.request(`/api/plans/${id}/return`, { method: 'POST', body: { remarks: 'Add the traffic separation scheme.' } }), 200)
  return id
}

export async function planStatus(api: Api, id: number): Promise<string> {
  return (await expectStatus<{ plan: { status: string } }>(api.request(`/api/plans/${id}`), 200)).plan.status
}
