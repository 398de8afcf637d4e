// Two app instances on different ports, one database, one session password: sessions made on one
// work on the other, a plan goes through sign-off alternating between them, and with both outbox
// workers running each crew brief is delivered exactly once; failed sign-ins are counted once for both.
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { demoUsers, DEMO_PASSWORD, type DemoUser } from '../support/server'
import { startInstance, type Instance } from '../support/instances'
import { mailsFor } from '../support/mail'
import { waitForOutboxSettled } from '../support/outbox'
import { addCompanyUser } from '../support/database'
import { postJsonFrom } from '../support/fromAddress'

let a: Instance, b: Instance
beforeAll(async () => {
  [a, b] = await Promise.all([startInstance(), startInstance()])
})
afterAll(async () => { await Promise.all([a?.stop(), b?.stop()]) })

async function signIn(base: string, who: DemoUser) {
  const res = await fetch(`${base}/api/auth/login`, { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ email: demoUsers[who], password: DEMO_PASSWORD }) })
  expect(res.status).toBe(200)
  return res.headers.getSetCookie().map(c => c.split(';')[0]).join('; ')
}

async function call(base: string, cookie: string, path: string, method = 'GET', body?: unknown) {
  const res = await fetch(`${base}${path}`, { method, headers: { cookie, ...(body ? { 'content-type': 'application/json' } : {}) }, body: body ? JSON.stringify(body) : undefined })
  return { status: res.status, body: await res.json().catch(() => null) }
}

describe('two instances behind one database', () => {
  it('a session made on one instance works on the other, and sign-out on one ends it on both', async () => {
    const cookie = await signIn(a.url, 'shore')
    expect((await call(b.url, cookie, '/api/auth/me')).body.user.role).toBe('shore')
    expect((await call(b.url, cookie, '/api/auth/logout', 'POST')).status).toBe(200)
    expect((await call(a.url, cookie, '/api/auth/me')).status).toBe(401)
  })

  it('takes a plan through sign-off alternating between the instances, and both workers deliver its brief once', async () => {
    const planner = await signIn(a.url, 'planner')
    const master = await signIn(b.url, 'master')
    const vessels = (await call(b.url, planner, '/api/vessels')).body as { id: number, name: string }[]
    const vesselId = vessels.find(v => v.name === 'Kestrel Dawn')!.id
    const created = await call(a.url, planner, '/api/plans', 'POST', { vesselId, title: 'Scale-out – Skaw to Gothenburg', departureUtc: '2027-02-01T08:00:00Z', speedKn: 12 })
    expect(created.status).toBe(201)
    const id = created.body.id
    const saved = await call(b.url, planner, `/api/plans/${id}/waypoints`, 'PUT', { version: 1, waypoints: [{ name: 'Skaw', lat: 57.8, lon: 10.7 }, { name: 'Vinga', lat: 57.63, lon: 11.6 }] })
    expect(saved.status).toBe(200)
    expect((await call(a.url, planner, `/api/plans/${id}/submit`, 'POST')).status).toBe(200)
    expect((await call(b.url, master, `/api/plans/${id}/approve`, 'POST')).status).toBe(200)
    const view = (await call(a.url, planner, `/api/plans/${id}`)).body
    expect(view.plan.status).toBe('approved')
    expect(view.events.map((e: any) => e.kind)).toEqual(['created', 'submitted', 'approved'])

    const brief = await call(a.url, planner, `/api/plans/${id}/brief`, 'POST')
    expect([200, 201, 202]).toContain(brief.status)
    const outboxId = brief.body.id ?? brief.body.message?.id
    const delivered = () => mailsFor(process.env.PW_MAIL_DIR!, outboxId, brief.body.messageId)
    await expect.poll(() => delivered().length, { timeout: 60_000, interval: 500 }).toBe(1)
    // Counted again once no job for the message is left for either worker.
    await waitForOutboxSettled([outboxId])
    expect(delivered()).toHaveLength(1)
    const outbox = (await call(b.url, planner, '/api/outbox')).body as any[]
    expect(outbox.find(m => m.id === outboxId)?.state).toBe('sent')
  })

  it('counts failed sign-ins for both instances together: alternating between them, the 11th attempt is refused', async () => {
    const email = 'throttle.scaleout@kestrel-bight.example'
    await addCompanyUser('Kestrel Bight Shipping', 'planner', email)
    // From a client address of this test's own, so 127.0.0.1's count stays as other files left it.
    const attempt = (base: string, password: string) => postJsonFrom('127.0.0.12', `${base}/api/auth/login`, { email, password })
    const delays: number[] = []
    for (let i = 0; i < 10; i++) {
      const res = await attempt(i % 2 ? b.url : a.url, `wrong-${i}`)
      expect(res.status).toBe(401)
      delays.push(Number(res.headers['x-signin-delay-ms'] ?? 0))
    }
    // Counted per instance, each would have seen five failures: no delay at all, and no refusal.
    expect(delays).toEqual([0, 0, 0, 0, 0, 200, 400, 800, 1600, 2000])
    expect((await attempt(b.url, DEMO_PASSWORD)).status).toBe(429)
    expect((await attempt(a.url, DEMO_PASSWORD)).status).toBe(429)
  })
})
