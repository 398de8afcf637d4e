// What a request may carry and where it may come from: bodies counted as they stream (413 at the
// route's limit, whatever the framing), writes only from our own pages (Origin / Sec-Fetch-Site),
// JSON routes take only JSON (415), no session cookie on an unauthenticated answer, sign-out that
// holds on nuxt-auth-utils' own routes and on pages, and a cookie that is Secure only over HTTPS.
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { type Api, client, loginAs, startServer, url } from '../support/server'
import { startInstance, type Instance } from '../support/instances'
import { makePlan, planStatus } from '../support/records'
import { residentMb, streamUntilAnswered } from '../support/streaming'

await startServer()

const MB = 1024 * 1024
const LOGIN_BODY = JSON.stringify({ email: 'planner@kestrel-bight.example', password: 'passage-demo' })
const sessionCookie = (headers: Headers) => headers.getSetCookie().find(c => c.startsWith('nuxt-session='))

let planner: Api, master: Api, shore: Api
beforeAll(async () => {
  [planner, master, shore] = await Promise.all([loginAs('planner'), loginAs('master'), loginAs('shore')])
})

describe('bodies are counted as they stream', () => {
  it('a chunked sign-in body is refused with 413 at 16 kB, long before 50 MB have been sent', async () => {
    const answer = await streamUntilAnswered(url('/api/auth/login'), { 'content-type': 'application/json' }, Buffer.alloc(64 * 1024, 0x20), 50 * MB, Buffer.from('{"email":"a@b.example","password":"'))
    expect(answer.status).toBe(413)
    expect(JSON.parse(answer.body).message).toMatch(/larger than 16 kB/)
    expect(answer.sentBytes).toBeLessThan(50 * MB)
  })

  it('a 50 MB chunked multipart upload of places is refused with 413 before it has all been sent', async () => {
    const boundary = 'pw-boundary'
    const head = Buffer.from(`--${boundary}\r\ncontent-disposition: form-data; name="file"; filename="places.csv"\r\ncontent-type: text/csv\r\n\r\nname,kind,latitude,longitude\n`)
    const row = Buffer.from('Probe,port,10,10\n'.repeat(4096))
    const answer = await streamUntilAnswered(url('/api/places/import?mode=preview'), { 'content-type': `multipart/form-data; boundary=${boundary}`, cookie: shore.cookie }, row, 50 * MB, head)
    expect(answer.status).toBe(413)
    expect(answer.sentBytes).toBeLessThan(25 * MB)
  })

  it('a declared Content-Length beyond the limit is refused before any byte is read', async () => {
    const res = await fetch(url('/api/plans'), { method: 'POST', headers: { 'content-type': 'application/json', cookie: planner.cookie }, body: JSON.stringify({ title: 'x'.repeat(1.2 * MB) }) })
    expect(res.status).toBe(413)
    expect((await res.json()).message).toMatch(/larger than 1 MB/)
  })

  it('a waypoint list may be larger than other JSON (6 MB), and not beyond', async () => {
    const id = await makePlan('draft', { planner })
    const waypoints = Array.from({ length: 5000 }, (_, i) => ({ name: `W${i}`, lat: (i % 160) - 80 + 0.5, lon: ((i * 7) % 340) - 170 + 0.25, method: 'rhumb', notes: 'n'.repeat(400) }))
    const { version } = (await planner.request(`/api/plans/${id}`)).body.plan
    const big = await planner.request(`/api/plans/${id}/waypoints`, { method: 'PUT', body: { version, waypoints } })
    expect(JSON.stringify(waypoints).length).toBeGreaterThan(2 * MB)
    expect(big.status).toBe(200)
    const tooBig = await planner.request(`/api/plans/${id}/waypoints`, { method: 'PUT', body: { version: version + 1, waypoints: waypoints.map(w => ({ ...w, notes: 'n'.repeat(1300) })) } })
    expect(tooBig.status).toBe(413)
  })

  describe('eight parallel 50 MB chunked sign-in bodies', () => {
    let instance: Instance
    beforeAll(async () => { instance = await startInstance() })
    afterAll(async () => { await instance?.stop() })

    it('are all refused with 413 while the server stays small and answers its health check', async () => {
      const before = residentMb(instance.process.pid!)
      const answers = await Promise.all(Array.from({ length: 8 }, () =>
        streamUntilAnswered(`${instance.url}/api/auth/login`, { 'content-type': 'application/json' }, Buffer.alloc(256 * 1024, 0x20), 50 * MB, Buffer.from('{"email":"'))))
      const health = await fetch(`${instance.url}/api/health`)
      expect(answers.map(a => a.status)).toEqual(Array(8).fill(413))
      expect(health.status).toBe(200)
      // Bounded by 8 × 16 kB of body plus socket buffers; reading the bodies whole took 700 MB more.
      expect(residentMb(instance.process.pid!) - before).toBeLessThan(150)
    })
  })

  it('a NUL byte in any body is a 400 naming the problem, JSON escape or raw, octet-stream or not', async () => {
    const id = await makePlan('draft', { planner })
    const escaped = await planner.request(`/api/plans/${id}/remarks`, { method: 'POST', rawBody: '{"remarks":"a\\u0000b"}', headers: { 'content-type': 'application/json' } })
    expect(escaped.status).toBe(400)
    expect(escaped.body.message).toMatch(/NUL/)
    const raw = await planner.request(`/api/plans/${id}/remarks`, { method: 'POST', rawBody: Buffer.from('{"remarks":"a\u0000b"}'), headers: { 'content-type': 'application/json' } })
    expect(raw.status).toBe(400)
    const octets = await planner.request(`/api/plans/${id}/remarks`, { method: 'POST', rawBody: Buffer.from([0, 0, 0]), headers: { 'content-type': 'application/octet-stream' } })
    expect(octets.status).toBe(415)
  })
})

describe('writes only from our own pages', () => {
  it('a forged approval from another origin of the same site is refused (403) and the plan stays submitted', async () => {
    const id = await makePlan('submitted', { planner, master })
    const forged = await master.request(`/api/plans/${id}/approve`, { method: 'POST', headers: { origin: 'http://127.0.0.1:1', 'sec-fetch-site': 'same-site' } })
    expect(forged.status).toBe(403)
    const noOrigin = await master.request(`/api/plans/${id}/approve`, { method: 'POST', headers: { 'sec-fetch-site': 'cross-site' } })
    expect(noOrigin.status).toBe(403)
    const nullOrigin = await master.request(`/api/plans/${id}/approve`, { method: 'POST', headers: { origin: 'null' } })
    expect(nullOrigin.status).toBe(403)
    expect(await planStatus(master, id)).toBe('submitted')
    // From our own page it goes through.
    const own = await master.request(`/api/plans/${id}/approve`, { method: 'POST', headers: { origin: url(''), 'sec-fetch-site': 'same-origin' } })
    expect(own.status).toBe(200)
    expect(await planStatus(master, id)).toBe('approved')
  })

  it('a script or integration that sends no Origin works with the session cookie alone', async () => {
    const id = await makePlan('submitted', { planner, master })
    expect((await master.request(`/api/plans/${id}/approve`, { method: 'POST' })).status).toBe(200)
  })

  it('JSON routes refuse form bodies (415): url-encoded, text/plain and multipart, even empty', async () => {
    const id = await makePlan('submitted', { planner, master })
    const forms: [string, string][] = [
      ['application/x-www-form-urlencoded', 'remarks=forged'],
      ['text/plain', '{"remarks":"forged"}'],
      ['multipart/form-data; boundary=x', '--x\r\ncontent-disposition: form-data; name="remarks"\r\n\r\nforged\r\n--x--\r\n'],
    ]
    for (const [type, body] of forms) {
      const res = await master.request(`/api/plans/${id}/remarks`, { method: 'POST', rawBody: body, headers: { 'content-type': type } })
      expect(res.status, type).toBe(415)
      expect(res.body.message).toMatch(/application\/json/)
    }
    const emptyForm = await master.request(`/api/plans/${id}/approve`, { method: 'POST', rawBody: '', headers: { 'content-type': 'application/x-www-form-urlencoded' } })
    expect(emptyForm.status).toBe(415)
    expect(await planStatus(master, id)).toBe('submitted')
    const events = (await master.request(`/api/plans/${id}`)).body.events as { remarks: string | null }[]
    expect(events.some(e => e.remarks === 'forged')).toBe(false)
  })

  it('upload routes take files, not JSON', async () => {
    const res = await planner.request('/api/plans/import', { method: 'POST', body: { file: 'name,lat,lon' } })
    expect(res.status).toBe(415)
  })
})

describe('unauthenticated answers set no session cookie', () => {
  it.each([
    ['POST', '/api/plans/1/approve'],
    ['POST', '/api/auth/logout'],
    ['GET', '/api/plans'],
    ['GET', '/api/_auth/session'],
    ['GET', '/login'],
    ['GET', '/'],
  ])('%s %s', async (method, path) => {
    const res = await fetch(url(path), { method, redirect: 'manual' })
    expect(res.status).toBeLessThan(500)
    expect(sessionCookie(res.headers)).toBeUndefined()
  })

  it('a 401 says to sign in, not "Server error"', async () => {
    const res = await client().request('/api/plans')
    expect(res.status).toBe(401)
    expect(res.body.message).toMatch(/sign in/i)
  })
})

describe('sign-out holds everywhere', () => {
  it('a revoked cookie gets no user from GET /api/_auth/session and pages render signed out', async () => {
    const who = await loginAs('shore')
    expect((await who.request('/api/_auth/session')).body.user?.email).toBe('shore@kestrel-bight.example')
    expect((await fetch(url('/'), { headers: { cookie: who.cookie }, redirect: 'manual' })).status).toBe(200)
    expect((await who.request('/api/auth/logout', { method: 'POST' })).status).toBe(200)
    const session = await who.request('/api/_auth/session')
    expect(session.body?.user).toBeUndefined()
    const page = await fetch(url('/'), { headers: { cookie: who.cookie }, redirect: 'manual' })
    expect(page.status).toBe(302)
    expect(page.headers.get('location')).toMatch(/^\/login/)
  })

  it('DELETE /api/_auth/session revokes the session it clears', async () => {
    const who = await loginAs('shore')
    expect((await who.request('/api/_auth/session', { method: 'DELETE' })).status).toBe(200)
    expect((await who.request('/api/auth/me')).status).toBe(401)
    expect((await who.request('/api/_auth/session')).body?.user).toBeUndefined()
  })
})

describe('the session cookie is Secure only over HTTPS', () => {
  const signIn = (base: string, headers: Record<string, string> = {}) =>
    fetch(`${base}/api/auth/login`, { method: 'POST', headers: { 'content-type': 'application/json', ...headers }, body: LOGIN_BODY })

  it('plain HTTP: HttpOnly, SameSite=Lax, not Secure, so a browser on the ship\'s network keeps it', async () => {
    const cookie = sessionCookie((await signIn(url(''))).headers)!
    expect(cookie).toMatch(/HttpOnly/i)
    expect(cookie).toMatch(/SameSite=Lax/i)
    expect(cookie).not.toMatch(/Secure/i)
  })

  it('X-Forwarded-Proto: https is believed only from a trusted proxy (NUXT_TRUST_PROXY=on)', async () => {
    expect(sessionCookie((await signIn(url(''), { 'x-forwarded-proto': 'https' })).headers)).not.toMatch(/Secure/i)
    const behindProxy = await startInstance({ NUXT_TRUST_PROXY: 'on' })
    try {
      expect(sessionCookie((await signIn(behindProxy.url, { 'x-forwarded-proto': 'https' })).headers)).toMatch(/;\s*Secure/i)
      expect(sessionCookie((await signIn(behindProxy.url, { 'x-forwarded-proto': 'http' })).headers)).not.toMatch(/Secure/i)
    }
    finally { await behindProxy.stop() }
  })
})

describe('API answers are not cached', () => {
  it('JSON answers carry Cache-Control: no-store; tiles stay immutable', async () => {
    expect((await planner.request('/api/plans')).headers.get('cache-control')).toBe('no-store')
    expect((await client().request('/api/health')).headers.get('cache-control')).toBe('no-store')
    expect((await client().request('/tiles/2/1/1.png')).headers.get('cache-control')).toMatch(/immutable/)
  })
})
