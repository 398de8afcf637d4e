// Security headers on pages and API answers, and a 100,000-row route file refused at the door.
import { describe, expect, it } from 'vitest'
import { client, loginAs, startServer } from '../support/server'

await startServer()

describe('security headers', () => {
  it('pages carry our CSP (own scripts, styles, fonts and tiles only), no framing and no sniffing', async () => {
    const res = await client().request('/login')
    const csp = res.headers.get('content-security-policy') ?? ''
    expect(csp).toContain("default-src 'self'")
    expect(csp).toContain("frame-ancestors 'none'")
    expect(csp).toContain("img-src 'self' data: blob:")
    expect(csp).toContain("font-src 'self' data:")
    expect(csp).toMatch(/script-src 'self' 'strict-dynamic' 'nonce-[^']+'/)
    expect(csp).not.toMatch(/https:|http:/)
    expect(res.headers.get('x-content-type-options')).toBe('nosniff')
    expect(res.headers.get('x-frame-options')).toBe('DENY')
  })

  it.each(['/api/health', '/tiles/2/1/1.png'])('%s is not sniffed or framed either', async (path) => {
    const res = await client().request(path)
    expect(res.headers.get('x-content-type-options')).toBe('nosniff')
    expect(res.headers.get('x-frame-options')).toBe('DENY')
  })
})

describe('a route file of 100,000 rows', () => {
  it('is refused with 400 naming the 5,000-waypoint limit, and creates nothing', async () => {
    const planner = await loginAs('planner')
    const before = (await planner.request('/api/plans')).body.length
    const rows = Array.from({ length: 100_000 }, (_, i) => `W${i},${(i % 80) - 40}.5,${(i % 300) - 150}.25`)
    const csv = `name,latitude,longitude\n${rows.join('\n')}\n`
    expect(csv.length).toBeGreaterThan(1_500_000)
    const body = new FormData()
    body.append('file', new Blob([csv], { type: 'text/csv' }), 'huge.csv')
    body.append('mode', 'create')
    body.append('vesselId', '1')
    body.append('title', 'Huge file')
    body.append('departureUtc', '2027-01-01T00:00:00Z')
    body.append('speedKn', '12')
    const res = await planner.request('/api/plans/import', { method: 'POST', rawBody: body })
    expect(res.status).toBe(400)
    expect(res.body.message).toMatch(/5[, ]?000/)
    expect((await planner.request('/api/plans')).body.length).toBe(before)
  })
})
