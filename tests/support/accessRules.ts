// Who may call each API route: the roles table of the product brief (product.md, "People and
// roles") written out for the tests, not read from the server code. A new route gets one row in
// RULES (and, when its path names a new kind of record, a maker in RECORD_MAKERS); the access
// and fuzz suites then cover it as every role of two companies.
import type { Role } from '#shared/types/auth'
import type { Api } from './server'
import { expectStatus, makePlan } from './records'

export const ALL: Role[] = ['planner', 'master', 'shore', 'admin']
export const EDIT: Role[] = ['planner', 'master']
export const DESK: Role[] = ['shore', 'admin']
export const ADMIN: Role[] = ['admin']

export type RecordKind = 'plan' | 'place' | 'vessel' | 'table' | 'zone'

export interface AccessRule {
  /** Who may call it; 'open' needs no session. */
  roles: Role[] | 'open'
  /** The kind of record the path's parameters name: one kind for all, or per parameter (`{ id: 'plan', reportId: 'report' }`). */
  record?: RecordKind | Record<string, RecordKind>
  /** A well-formed body (JSON, or a multipart form for uploads), so validation passes and the scope check answers. */
  body?: unknown | (() => FormData)
  /** A query string the route needs to get past validation. */
  query?: string
}

const csvUpload = (csv: string, fields: Record<string, string> = {}) => () => {
  const form = new FormData()
  form.append('file', new Blob([csv], { type: 'text/csv' }), 'probe.csv')
  for (const [k, v] of Object.entries(fields)) form.append(k, v)
  return form
}

export const RULES: Record<string, AccessRule> = {
  'GET /api/health': { roles: 'open' },
  'POST /api/auth/login': { roles: 'open' },
  'POST /api/auth/logout': { roles: ALL },
  'GET /api/auth/me': { roles: ALL },
  'GET /api/admin/users': { roles: ADMIN },
  'POST /api/admin/users': { roles: ADMIN },
  'GET /api/company/settings': { roles: ALL },
  'PUT /api/company/settings': { roles: ADMIN },
  'POST /api/geodesy/inverse': { roles: ALL },
  'POST /api/geodesy/direct': { roles: ALL },
  'POST /api/geodesy/composite': { roles: ALL },
  'POST /api/geodesy/cross-track': { roles: ALL },
  'POST /api/land-check': { roles: ALL },
  'GET /api/land-check/position': { roles: ALL, query: '?lat=1&lon=1' },
  'GET /api/routing/passages': { roles: ALL },
  'POST /api/routing/sea': { roles: ALL },
  'GET /api/timezone': { roles: ALL, query: '?lat=1&lon=1' },
  'GET /api/outbox': { roles: ALL },
  'GET /api/fleet': { roles: ALL },
  'GET /api/places': { roles: ALL },
  'POST /api/places': { roles: DESK },
  'POST /api/places/import': { roles: DESK, query: '?mode=preview', body: csvUpload('name,kind,latitude,longitude\nProbe,port,1,1\n') },
  'PUT /api/places/:id': { roles: DESK, record: 'place', body: { name: 'Scope probe', kind: 'port', lat: 1, lon: 1 } },
  'DELETE /api/places/:id': { roles: DESK, record: 'place' },
  'GET /api/plans': { roles: ALL },
  'GET /api/plans/board': { roles: ALL },
  'POST /api/plans': { roles: EDIT },
  'POST /api/plans/import': { roles: EDIT, body: csvUpload('name,latitude,longitude\nA,1,1\nB,2,2\n', { mode: 'preview' }) },
  'GET /api/plans/:id': { roles: ALL, record: 'plan' },
  'PUT /api/plans/:id': { roles: EDIT, record: 'plan', body: { version: 1, title: 'Scope probe', departureUtc: '2027-01-01T00:00:00Z', speedKn: 12 } },
  'PUT /api/plans/:id/waypoints': { roles: EDIT, record: 'plan', body: { version: 1, waypoints: [{ lat: 10, lon: 10 }, { lat: 11, lon: 11 }] } },
  'POST /api/plans/:id/submit': { roles: EDIT, record: 'plan' },
  'POST /api/plans/:id/approve': { roles: ['master'], record: 'plan' },
  'POST /api/plans/:id/return': { roles: ['master'], record: 'plan', body: { remarks: 'Scope probe' } },
  'POST /api/plans/:id/revise': { roles: EDIT, record: 'plan' },
  'POST /api/plans/:id/copy': { roles: EDIT, record: 'plan', body: { reversed: true } },
  'POST /api/plans/:id/remarks': { roles: ALL, record: 'plan', body: { remarks: 'Scope probe' } },
  'POST /api/plans/:id/land-check': { roles: EDIT, record: 'plan', body: { version: 1, clearanceNm: 5 } },
  'POST /api/plans/:id/land-check/acknowledge': { roles: EDIT, record: 'plan', body: { checkId: 1, legIndex: 0, note: 'Scope probe' } },
  'POST /api/plans/:id/brief': { roles: ['planner', 'master', 'shore'], record: 'plan' },
  'GET /api/plans/:id/export': { roles: ALL, record: 'plan', query: '?format=csv' },
  'GET /api/plans/:id/voyage': { roles: ALL, record: 'plan' },
  'GET /api/plans/:id/reports': { roles: ALL, record: 'plan' },
  'POST /api/plans/:id/reports': { roles: EDIT, record: 'plan', body: { timeUtc: '2026-11-24T06:00:00Z', lat: -35, lon: 19 } },
  'POST /api/plans/:id/reports/import': { roles: EDIT, record: 'plan', body: csvUpload('time,lat,lon\n2026-11-24T06:00:00Z,-35,19\n', { mode: 'preview' }) },
  'DELETE /api/plans/:id/reports/:reportId': { roles: ['master'], record: 'plan' },
  'GET /api/tables': { roles: ALL },
  'POST /api/tables': { roles: DESK },
  'GET /api/tables/:id': { roles: ALL, record: 'table' },
  'DELETE /api/tables/:id': { roles: DESK, record: 'table' },
  'POST /api/tables/:id/rebuild': { roles: DESK, record: 'table' },
  'GET /api/tables/:id/export': { roles: ALL, record: 'table' },
  'GET /api/zones': { roles: ALL },
  'POST /api/zones': { roles: DESK },
  'PUT /api/zones/:id': { roles: DESK, record: 'zone', body: { validTo: '2030-01-01' } },
  'DELETE /api/zones/:id': { roles: DESK, record: 'zone' },
  'GET /api/vessels': { roles: ALL },
  'GET /api/vessels/:id': { roles: ALL, record: 'vessel' },
  'PUT /api/vessels/:id': { roles: ADMIN, record: 'vessel', body: { name: 'Scope probe', imoNumber: '9074729', callSign: 'ABC1', serviceSpeedKn: 12, masterUserId: null } },
  'PUT /api/vessels/:id/crew': { roles: ADMIN, record: 'vessel', body: { crew: [{ name: 'Scope probe', rank: 'Cadet', email: 'probe@example.com' }] } },
  'PUT /api/vessels/:id/fuel-grades': { roles: DESK, record: 'vessel', body: { outside: 'VLSFO', insideEca: 'MGO' } },
  'PUT /api/vessels/:id/fuel': { roles: DESK, record: 'vessel', body: { points: [{ speedKn: 10, tonnesPerDay: 20 }, { speedKn: 12, tonnesPerDay: 30 }] } },
}

/** The ids to put in a route's path: each parameter's record of its kind from `ids`, or `fallback`. */
export function pathIds(pattern: string, rule: AccessRule, ids: Partial<Record<RecordKind, number>>, fallback: number): Record<string, number> {
  const params = [...pattern.matchAll(/:(\w+)/g)].map(m => m[1]!)
  return Object.fromEntries(params.map((p) => {
    const kind = typeof rule.record === 'string' ? rule.record : rule.record?.[p]
    return [p, (kind && ids[kind]) ?? fallback]
  }))
}

/** The kinds of record a body's id fields name. */
export type BodyIdKind = 'place' | 'vessel' | 'master'
export interface BodyIdRule {
  route: string
  field: string
  kind: BodyIdKind
  role: Role
  /** A body that is well formed apart from `id` in `field`; `own` holds the caller's company's records. */
  body: (id: number, own: { plan: number, vessel: number, place: number, planVersion: number }) => unknown | FormData
}

const planBody = (vesselId: number, extra: Record<string, unknown> = {}) => ({ vesselId, title: 'Scope probe', departureUtc: '2027-01-01T00:00:00Z', speedKn: 12, ...extra })
const importForm = (vesselId: number) => csvUpload('name,latitude,longitude\nA,52,3.9\nB,52.6,3.4\n', { mode: 'create', vesselId: String(vesselId), title: 'Scope probe', departureUtc: '2027-01-01T00:00:00Z', speedKn: '12' })()

/**
 * Every id a request body carries (issue: another company's places in a plan). The access suite
 * sends another company's record and one that does not exist: both 400 naming the field, with the
 * same message, so a caller learns nothing of other companies' records.
 */
export const BODY_IDS: BodyIdRule[] = [
  { route: 'POST /api/plans', field: 'vesselId', kind: 'vessel', role: 'planner', body: id => planBody(id) },
  { route: 'POST /api/plans', field: 'departurePlaceId', kind: 'place', role: 'planner', body: (id, own) => planBody(own.vessel, { departurePlaceId: id }) },
  { route: 'POST /api/plans', field: 'arrivalPlaceId', kind: 'place', role: 'master', body: (id, own) => planBody(own.vessel, { arrivalPlaceId: id, startFromPlaces: true }) },
  { route: 'PUT /api/plans/:id', field: 'departurePlaceId', kind: 'place', role: 'planner', body: (id, own) => ({ ...planBody(own.vessel, { departurePlaceId: id }), vesselId: undefined, version: own.planVersion }) },
  { route: 'PUT /api/plans/:id', field: 'arrivalPlaceId', kind: 'place', role: 'master', body: (id, own) => ({ ...planBody(own.vessel, { arrivalPlaceId: id }), vesselId: undefined, version: own.planVersion }) },
  { route: 'POST /api/plans/import', field: 'vesselId', kind: 'vessel', role: 'planner', body: id => importForm(id) },
  { route: 'POST /api/tables', field: 'placeIds', kind: 'place', role: 'shore', body: (id, own) => ({ name: 'Scope probe', placeIds: [own.place, id] }) },
  { route: 'PUT /api/vessels/:id', field: 'masterUserId', kind: 'master', role: 'admin', body: id => ({ name: 'Scope probe', imoNumber: '9074729', callSign: 'ABC1', serviceSpeedKn: 12, masterUserId: id }) },
  { route: 'POST /api/routing/sea', field: 'vesselId', kind: 'vessel', role: 'planner', body: id => ({ from: { lat: 51.9, lon: 3.9 }, to: { lat: 53.3, lon: 4.2 }, vesselId: id }) },
]

/** Routes that act on the record without reading a body; the fuzz test leaves them alone. */
export const BODYLESS = new Set(['POST /api/auth/logout', 'POST /api/plans/:id/submit', 'POST /api/plans/:id/approve', 'POST /api/plans/:id/revise', 'POST /api/plans/:id/brief', 'POST /api/tables/:id/rebuild'])

/** How a test makes its own record of each kind, in the company of the callers given. */
export const RECORD_MAKERS: Record<RecordKind, (as: Record<Role, Api>) => Promise<number>> = {
  plan: as => makePlan('draft', { planner: as.planner }),
  place: async as => (await expectStatus<{ id: number }>(as.shore.request('/api/places', { method: 'POST', body: { name: `Access probe ${Date.now()}`, kind: 'port', lat: 10.5, lon: 20.5 } }), 201)).id,
  // No route creates vessels; reading one changes nothing.
  vessel: async as => (await expectStatus<{ id: number }[]>(as.planner.request('/api/vessels'), 200))[0]!.id,
  table: async (as) => {
    const places = await expectStatus<{ id: number }[]>(as.shore.request('/api/places'), 200)
    return (await expectStatus<{ id: number }>(as.shore.request('/api/tables', { method: 'POST', body: { name: `Access probe ${Date.now()}`, placeIds: places.slice(0, 2).map(p => p.id) } }), 201)).id
  },
  zone: async as => (await expectStatus<{ id: number }>(as.shore.request('/api/zones', { method: 'POST', body: { name: `Access probe ${Date.now()}`, kind: 'custom', geojson: { type: 'Polygon', coordinates: [[[-30, 40], [-29, 40], [-29, 41], [-30, 41], [-30, 40]]] } } }), 201)).id,
}
