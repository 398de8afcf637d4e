// Every API route × every kind of caller → the expected status, from the rules in
// tests/support/accessRules.ts: a route file without a rule fails the first test.
import { beforeAll, describe, expect, it } from 'vitest'
import type { Role } from '#shared/types/auth'
import { ALL, RULES, VALID_BODIES } from '../support/accessRules'
import { client, loginAs, startServer, type Api } from '../support/server'
import { listApiRoutes, routePath, type ApiRoute } from '../support/apiRoutes'

const MISSING_ID = 2_000_000_000
/** Routes that need a query string to get past validation. */
const withQuery = (path: string) => path.replace(/^\/api\/timezone$/, '/api/timezone?lat=1&lon=1').replace(/^(\/api\/plans\/\d+\/export)$/, '$1?format=csv')
const routes = listApiRoutes()
await startServer()

describe('access control, every route × every caller', () => {
  const users: Partial<Record<Role | 'other', Api>> = {}
  const kestrelIds: Record<string, number> = {}

  beforeAll(async () => {
    for (const role of ALL) users[role] = await loginAs(role)
    users.other = await loginAs('otherPlanner')
    kestrelIds.plan = (await users.planner!.request('/api/plans')).body[0].id
    kestrelIds.place = (await users.planner!.request('/api/places')).body[0].id
    kestrelIds.vessel = (await users.planner!.request('/api/vessels')).body[0].id
    kestrelIds.zone = (await users.planner!.request('/api/zones')).body[0].id
    const tables = (await users.shore!.request('/api/tables')).body
    kestrelIds.table = Array.isArray(tables) && tables[0] ? tables[0].id : 1
  })

  it('has a rule for every route file under server/api', () => {
    expect(routes.length).toBeGreaterThan(30)
    expect(routes.filter(r => !RULES[r.key]).map(r => r.key)).toEqual([])
  })

  const call = (api: Api, route: ApiRoute, id: number) =>
    api.request(withQuery(routePath(route, id)), { method: route.method, ...(route.method === 'GET' || route.method === 'DELETE' ? {} : { body: VALID_BODIES[route.key] ?? {} }) })

  it.each(routes.filter(r => RULES[r.key]?.roles !== 'open').map(r => [r.key, r] as const))('%s: anonymous 401, wrong role 403, right role passes, other company 404', async (_key, route) => {
    const rule = RULES[route.key]!
    const roles = rule.roles as Role[]
    const ownId = rule.record ? kestrelIds[rule.record]! : 0
    expect((await call(client(), route, ownId)).status).toBe(401)
    for (const role of ALL) {
      if (roles.includes(role)) {
        // A record that does not exist: the role check has passed, the scope check answers 404, nothing changes.
        const caller = route.key === 'POST /api/auth/logout' ? await loginAs(role) : users[role]!
        const res = await call(caller, route, rule.record ? MISSING_ID : 0)
        if (rule.record) expect(res.status, `${role}`).toBe(404)
        else expect([200, 201, 400, 415], `${role} got ${res.status}`).toContain(res.status)
      }
      else {
        expect((await call(users[role]!, route, ownId)).status, `${role}`).toBe(403)
      }
    }
    if (rule.record) expect((await call(users.other!, route, ownId)).status).toBe(roles.includes('planner') ? 404 : 403)
  })
})
