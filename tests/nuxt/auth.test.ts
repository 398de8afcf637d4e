import { beforeAll, describe, expect, it } from 'vitest'
import { client, DEMO_PASSWORD, demoUsers, loginAs, startServer, url } from '../support/server'
import { addCompanyUser } from '../support/database'
import { postJsonFrom } from '../support/fromAddress'

await startServer()

describe('sign-in and sessions', () => {
  const anon = client()

  it('signs in a demo planner and returns the role through /api/auth/me', async () => {
    const planner = await loginAs('planner')
    const me = await planner.request('/api/auth/me')
    expect(me.status).toBe(200)
    expect(me.body.user).toMatchObject({ email: 'planner@kestrel-bight.example', role: 'planner', companyName: 'Kestrel Bight Shipping' })
  })

  it('answers a wrong password and an unknown user with the same 401 message', async () => {
    const wrong = await anon.request('/api/auth/login', { method: 'POST', body: { email: 'shore@kestrel-bight.example', password: 'not-it' } })
    const unknown = await anon.request('/api/auth/login', { method: 'POST', body: { email: 'nobody@kestrel-bight.example', password: 'passage-demo' } })
    expect(wrong.status).toBe(401)
    expect(unknown.status).toBe(401)
    expect(wrong.body.message).toBe(unknown.body.message)
  })

  it('answers a malformed login body with 400 naming the field', async () => {
    const res = await anon.request('/api/auth/login', { method: 'POST', body: { email: 'not-an-address', password: 'x' } })
    expect(res.status).toBe(400)
    expect(res.body.message).toMatch(/^email:/)
    const missing = await anon.request('/api/auth/login', { method: 'POST', body: { email: 'a@b.example' } })
    expect(missing.status).toBe(400)
    expect(missing.body.message).toMatch(/password/)
  })

  it('refuses protected routes without a session (401) and keeps health open', async () => {
    expect((await anon.request('/api/plans')).status).toBe(401)
    expect((await anon.request('/api/auth/me')).status).toBe(401)
    const health = await anon.request('/api/health')
    expect(health.status).toBe(200)
    expect(health.body.database).toBe('up')
  })

  it('sign-out ends the session, and a copy of the old cookie no longer works', async () => {
    const shore = await loginAs('shore')
    expect((await shore.request('/api/auth/me')).status).toBe(200)
    const out = await shore.request('/api/auth/logout', { method: 'POST' })
    expect(out.status).toBe(200)
    const cleared = out.headers.getSetCookie().map(c => c.split(';')[0]).join('; ')
    expect(cleared).toMatch(/^nuxt-session=$/)
    expect((await client(cleared).request('/api/auth/me')).status).toBe(401)
    expect((await shore.request('/api/auth/me')).status).toBe(401)
    expect((await shore.request('/api/plans')).status).toBe(401)
  })
})

describe('company scope on the passage board', () => {
  let kestrel: any[], larkspur: any[]
  beforeAll(async () => {
    kestrel = (await (await loginAs('planner')).request('/api/plans')).body
    larkspur = (await (await loginAs('otherPlanner')).request('/api/plans')).body
  })

  it('lists only the plans of the user\'s own company', () => {
    expect(kestrel.length).toBeGreaterThanOrEqual(4)
    expect(larkspur.length).toBeGreaterThanOrEqual(1)
    const kestrelIds = new Set(kestrel.map(p => p.id))
    expect(larkspur.some(p => kestrelIds.has(p.id))).toBe(false)
    expect(kestrel.map(p => p.vesselName)).not.toContain('Larkspur Tern')
  })

  it('shows each demo state once at least (draft, submitted, approved, returned)', () => {
    expect(new Set(kestrel.map(p => p.status))).toEqual(new Set(['draft', 'submitted', 'approved', 'returned']))
  })
})

describe('sign-in throttling', () => {
  it('slows repeated failures for one account, then refuses with 429 even the right password', async () => {
    // An account and a client address of this test's own: the counts live in the shared database,
    // so locking out a demo user, or slowing 127.0.0.1, would hold other files back too.
    const email = 'throttle.probe@kestrel-bight.example'
    await addCompanyUser('Kestrel Bight Shipping', 'planner', email)
    const from = '127.0.0.11'
    const attempt = (who: string, password: string) => postJsonFrom(from, url('/api/auth/login'), { email: who, password })
    const delays: number[] = []
    for (let i = 0; i < 10; i++) {
      const res = await attempt(email, `wrong-${i}`)
      delays.push(Number(res.headers['x-signin-delay-ms'] ?? 0))
      expect(res.status).toBe(401)
    }
    // The first five failures answer at once; from the sixth on each is held back longer.
    expect(delays.slice(0, 5)).toEqual([0, 0, 0, 0, 0])
    expect(delays.slice(5)).toEqual([200, 400, 800, 1600, 2000])
    const refused = await attempt(email, DEMO_PASSWORD)
    expect(refused.status).toBe(429)
    // Until the 15-minute window that began with the first failure ends.
    expect(Number(refused.headers['retry-after'])).toBeGreaterThan(800)
    expect(Number(refused.headers['retry-after'])).toBeLessThanOrEqual(900)
    // Another account from the same address is not locked out by this one.
    expect((await attempt(demoUsers.admin, DEMO_PASSWORD)).status).toBe(200)
  })
})
