// Who may call each API route: the roles table of the product brief (product.md, "People and
// roles") written out for the tests, not read from the server code.
import type { Role } from '#shared/types/auth'

export const ALL: Role[] = ['planner', 'master', 'shore', 'admin']
export const EDIT: Role[] = ['planner', 'master']
export const DESK: Role[] = ['shore', 'admin']
export const ADMIN: Role[] = ['admin']

/** Who may call each route; 'open' needs no session. `record` names the kind of record in `:id`. */
export const RULES: Record<string, { roles: Role[] | 'open', record?: 'plan' | 'place' | 'vessel' | 'table' | 'zone' }> = {
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
  'GET /api/routing/passages': { roles: ALL },
  'POST /api/routing/sea': { roles: ALL },
  'GET /api/timezone': { roles: ALL },
  'GET /api/outbox': { roles: ALL },
  'GET /api/places': { roles: ALL },
  'POST /api/places': { roles: DESK },
  'POST /api/places/import': { roles: DESK },
  'PUT /api/places/:id': { roles: DESK, record: 'place' },
  'DELETE /api/places/:id': { roles: DESK, record: 'place' },
  'GET /api/plans': { roles: ALL },
  'POST /api/plans': { roles: EDIT },
  'POST /api/plans/import': { roles: EDIT },
  'GET /api/plans/:id': { roles: ALL, record: 'plan' },
  'PUT /api/plans/:id': { roles: EDIT, record: 'plan' },
  'PUT /api/plans/:id/waypoints': { roles: EDIT, record: 'plan' },
  'POST /api/plans/:id/submit': { roles: EDIT, record: 'plan' },
  'POST /api/plans/:id/approve': { roles: ['master'], record: 'plan' },
  'POST /api/plans/:id/return': { roles: ['master'], record: 'plan' },
  'POST /api/plans/:id/revise': { roles: EDIT, record: 'plan' },
  'POST /api/plans/:id/remarks': { roles: ALL, record: 'plan' },
  'POST /api/plans/:id/brief': { roles: ['planner', 'master', 'shore'], record: 'plan' },
  'GET /api/plans/:id/export': { roles: ALL, record: 'plan' },
  'GET /api/tables': { roles: ALL },
  'POST /api/tables': { roles: DESK },
  'GET /api/tables/:id': { roles: ALL, record: 'table' },
  'DELETE /api/tables/:id': { roles: DESK, record: 'table' },
  'POST /api/tables/:id/rebuild': { roles: DESK, record: 'table' },
  'GET /api/tables/:id/export': { roles: ALL, record: 'table' },
  'GET /api/zones': { roles: ALL },
  'POST /api/zones': { roles: DESK },
  'PUT /api/zones/:id': { roles: DESK, record: 'zone' },
  'DELETE /api/zones/:id': { roles: DESK, record: 'zone' },
  'GET /api/vessels': { roles: ALL },
  'GET /api/vessels/:id': { roles: ALL, record: 'vessel' },
  'PUT /api/vessels/:id': { roles: ADMIN, record: 'vessel' },
  'PUT /api/vessels/:id/crew': { roles: ADMIN, record: 'vessel' },
  'PUT /api/vessels/:id/fuel': { roles: DESK, record: 'vessel' },
}

/** Routes that act on the record without reading a body; the fuzz test leaves them alone. */
export const BODYLESS = new Set(['POST /api/auth/logout', 'POST /api/plans/:id/submit', 'POST /api/plans/:id/approve', 'POST /api/plans/:id/revise', 'POST /api/plans/:id/brief', 'POST /api/tables/:id/rebuild'])

/** A well-formed body for routes on a record, so the scope check (404) is reached past validation. */
export const VALID_BODIES: Record<string, unknown> = {
  'PUT /api/plans/:id': { version: 1, title: 'Scope probe', departureUtc: '2027-01-01T00:00:00Z', speedKn: 12 },
  'PUT /api/plans/:id/waypoints': { version: 1, waypoints: [{ lat: 10, lon: 10 }, { lat: 11, lon: 11 }] },
  'POST /api/plans/:id/remarks': { remarks: 'Scope probe' },
  'POST /api/plans/:id/return': { remarks: 'Scope probe' },
  'PUT /api/places/:id': { name: 'Scope probe', kind: 'port', lat: 1, lon: 1 },
  'PUT /api/zones/:id': { validTo: '2030-01-01' },
  'PUT /api/vessels/:id': { name: 'Scope probe', imoNumber: '9074729', callSign: 'ABC1', serviceSpeedKn: 12, masterUserId: null },
  'PUT /api/vessels/:id/crew': { crew: [{ name: 'Scope probe', rank: 'Cadet', email: 'probe@example.com' }] },
  'PUT /api/vessels/:id/fuel': { points: [{ speedKn: 10, tonnesPerDay: 20 }, { speedKn: 12, tonnesPerDay: 30 }] },
}
