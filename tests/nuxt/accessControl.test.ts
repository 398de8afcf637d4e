// Every API route × every role of two companies → the expected status, from the rules in
// tests/support/accessRules.ts: a route file without a rule fails the first test. The records
// probed are made by this file; another company's callers of every role get 404 (or 403 where
// their role may not call the route at all), so existence never leaks.
import { beforeAll, describe, expect, it } from 'vitest'
import type { Role } from '#shared/types/auth'
import { ALL, BODY_IDS, RECORD_MAKERS, RULES, pathIds, type AccessRule, type BodyIdKind, type RecordKind } from '../support/accessRules'
import { type Api, client, loginAs, loginWithEmail, startServer } from '../support/server'
import { addCompanyUser } from '../support/database'
import { listApiRoutes, routePath, type ApiRoute } from '../support/apiRoutes'

const MISSING_ID = 2_000_000_000
const routes = listApiRoutes()
await startServer()

const idsFor = (route: ApiRoute, rule: AccessRule, own: Record<RecordKind, number>, missing = false) =>
  pathIds(route.pattern, rule, missing ? {} : own, MISSING_ID)

function call(api: Api, route: ApiRoute, ids: Record<string, number>) {
  const rule = RULES[route.key]!
  const path = `${routePath(route, ids)}${rule.query ?? ''}`
  if (route.method === 'GET' || route.method === 'DELETE') return api.request(path, { method: route.method })
  const body = typeof rule.body === 'function' ? (rule.body as () => FormData)() : rule.body ?? {}
  return body instanceof FormData ? api.request(path, { method: route.method, rawBody: body }) : api.request(path, { method: route.method, body })
}

describe('access control, every route × every role of two companies', () => {
  const kestrel = {} as Record<Role, Api>
  const larkspur = {} as Record<Role, Api>
  const own = {} as Record<RecordKind, number>

  beforeAll(async () => {
    // The demo gives the second company a planner and a master; add its shore and admin users.
    await addCompanyUser('Larkspur Reach Carriers', 'shore', 'shore.access@larkspur-reach.example')
    await addCompanyUser('Larkspur Reach Carriers', 'admin', 'admin.access@larkspur-reach.example')
    for (const role of ALL) kestrel[role] = await loginAs(role)
    Object.assign(larkspur, {
      planner: await loginAs('otherPlanner'),
      master: await loginAs('otherMaster'),
      shore: await loginWithEmail('shore.access@larkspur-reach.example'),
      admin: await loginWithEmail('admin.access@larkspur-reach.example'),
    })
    for (const kind of Object.keys(RECORD_MAKERS) as RecordKind[]) own[kind] = await RECORD_MAKERS[kind](kestrel)
  })

  it('has a rule for every route file under server/api', () => {
    expect(routes.length).toBeGreaterThan(30)
    expect(routes.filter(r => !RULES[r.key]).map(r => r.key)).toEqual([])
  })

  it.each(routes.filter(r => RULES[r.key] && RULES[r.key]!.roles !== 'open').map(r => [r.key, r] as const))('%s', async (_key, route) => {
    const rule = RULES[route.key]!
    const roles = rule.roles as Role[]
    const ownIds = idsFor(route, rule, own)
    expect((await call(client(), route, ownIds)).status, 'anonymous').toBe(401)
    for (const role of ALL) {
      if (!roles.includes(role)) {
        expect((await call(kestrel[role], route, ownIds)).status, `${role}: role may not`).toBe(403)
        continue
      }
      // A record that does not exist: the role check has passed, the scope check answers 404, nothing changes.
      const caller = route.key === 'POST /api/auth/logout' ? await loginAs(role) : kestrel[role]
      const res = await call(caller, route, idsFor(route, rule, own, true))
      if (rule.record) expect(res.status, `${role}: missing record`).toBe(404)
      else expect([200, 201, 202, 400], `${role} got ${res.status} ${JSON.stringify(res.body).slice(0, 200)}`).toContain(res.status)
    }
    if (!rule.record) return
    for (const role of ALL) {
      const res = await call(larkspur[role], route, ownIds)
      expect(res.status, `${role} of another company`).toBe(roles.includes(role) ? 404 : 403)
    }
  })

  describe('ids in bodies, scoped to the caller\'s company', () => {
    const foreign = {} as Record<BodyIdKind, number>
    beforeAll(async () => {
      foreign.place = (await larkspur.planner.request('/api/places')).body[0].id
      foreign.vessel = (await larkspur.planner.request('/api/vessels')).body[0].id
      foreign.master = (await larkspur.planner.request(`/api/vessels/${foreign.vessel}`)).body.masterUserId
    })

    it.each(BODY_IDS.map(r => [`${r.route} ${r.field}`, r] as const))('%s: another company\'s record and a missing one get the same 400', async (_name, rule) => {
      const route = routes.find(r => r.key === rule.route)!
      const planVersion = (await kestrel.planner.request(`/api/plans/${own.plan}`)).body.plan.version
      const send = (id: number) => {
        const body = rule.body(id, { plan: own.plan, vessel: own.vessel, place: own.place, planVersion })
        const path = routePath(route, pathIds(route.pattern, RULES[route.key]!, own, MISSING_ID))
        return kestrel[rule.role].request(path, { method: route.method, ...(body instanceof FormData ? { rawBody: body } : { body }) })
      }
      const [other, missing] = [await send(foreign[rule.kind]), await send(MISSING_ID)]
      expect([other.status, missing.status], JSON.stringify([other.body, missing.body]).slice(0, 300)).toEqual([400, 400])
      expect(other.body.message).toMatch(new RegExp(`^${rule.field}: `))
      expect(other.body.message.replace(String(foreign[rule.kind]), '#')).toBe(missing.body.message.replace(String(MISSING_ID), '#'))
    })
  })
})
