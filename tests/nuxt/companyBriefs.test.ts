// Crew briefs go out from the sending company's own address (company settings, mailFrom), and a
// plan's brief cannot be sent without end: BRIEFS_PER_PLAN_PER_HOUR per plan, then 429.
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { type Api, loginAs, startServer } from '../support/server'
import { expectStatus, makePlan } from '../support/records'
import { mailsFor } from '../support/mail'

await startServer()

let admin: Api
let planner: Api
let otherPlanner: Api
let savedSettings: Record<string, unknown>

beforeAll(async () => {
  admin = await loginAs('admin')
  planner = await loginAs('planner')
  otherPlanner = await loginAs('otherPlanner')
  savedSettings = await expectStatus(admin.request('/api/company/settings'), 200)
})
afterAll(async () => {
  await admin.request('/api/company/settings', { method: 'PUT', body: savedSettings })
})

const settingsWith = (mailFrom: unknown) => ({ reserve: savedSettings.reserve, helmDelayS: savedSettings.helmDelayS, mailFrom })

describe('the company\'s sender', () => {
  it.each([
    'Ops\r\nBcc: everyone@example.com <ops@kestrel-bight.example>', 'Ops <ops@kestrel-bight.example>, other@example.com',
    'not an address', '"Quoted" <ops@kestrel-bight.example>', 'Ops <ops@kestrel-bight.example',
  ])('refuses %j with 400 naming mailFrom, and keeps the stored one', async (mailFrom) => {
    const res = await admin.request('/api/company/settings', { method: 'PUT', body: settingsWith(mailFrom) })
    expect(res.status, JSON.stringify(res.body)).toBe(400)
    expect(res.body.message).toMatch(/^mailFrom: /)
    expect((await admin.request('/api/company/settings')).body.mailFrom).toBe(savedSettings.mailFrom)
  })

  it('takes a name and an address, and gives them back normalised', async () => {
    const res = await expectStatus(admin.request('/api/company/settings', { method: 'PUT', body: settingsWith('  Kestrel Bight Ops   <Ops@Kestrel-Bight.example> ') }), 200)
    expect(res.mailFrom).toBe('Kestrel Bight Ops <ops@kestrel-bight.example>')
    await expectStatus(admin.request('/api/company/settings', { method: 'PUT', body: settingsWith(savedSettings.mailFrom) }), 200)
  })

  it('sends each company\'s brief from that company\'s own address', async () => {
    const kestrelPlan = await makePlan('draft', { planner })
    const larkspurPlan = await makePlan('draft', { planner: otherPlanner }, { vesselName: 'Larkspur Tern' })
    const kestrel = await expectStatus<{ id: number, messageId: string }>(planner.request(`/api/plans/${kestrelPlan}/brief`, { method: 'POST' }), 202)
    const larkspur = await expectStatus<{ id: number, messageId: string }>(otherPlanner.request(`/api/plans/${larkspurPlan}/brief`, { method: 'POST' }), 202)
    const dir = process.env.PW_MAIL_DIR!
    await expect.poll(() => mailsFor(dir, kestrel.id, kestrel.messageId).length + mailsFor(dir, larkspur.id, larkspur.messageId).length, { timeout: 60_000, interval: 500 }).toBe(2)
    // The demo senders (db/seeds/05_mail_senders.ts), as the mail fake's parser writes a From header.
    expect(mailsFor(dir, kestrel.id, kestrel.messageId)[0]!.from).toBe('"Kestrel Bight Shipping" <passages@kestrel-bight.example>')
    expect(mailsFor(dir, larkspur.id, larkspur.messageId)[0]!.from).toBe('"Larkspur Reach Carriers" <voyages@larkspur-reach.example>')
    expect(larkspur.messageId).toMatch(/@larkspur-reach\.example>$/)
  })
})

describe('how often a plan\'s brief may go', () => {
  it('queues three briefs of one plan within the hour, refuses the fourth with 429 and Retry-After; another plan is not held back', async () => {
    const plan = await makePlan('draft', { planner })
    for (let i = 0; i < 3; i++) await expectStatus(planner.request(`/api/plans/${plan}/brief`, { method: 'POST' }), 202)
    const refused = await planner.request(`/api/plans/${plan}/brief`, { method: 'POST' })
    expect(refused.status).toBe(429)
    expect(refused.body.message).toMatch(/3 times within the hour/)
    expect(Number(refused.headers.get('retry-after'))).toBeGreaterThan(3000)
    expect(Number(refused.headers.get('retry-after'))).toBeLessThanOrEqual(3600)
    // Refused by any role and on any instance: the count is in the database, not in this server.
    expect((await (await loginAs('master')).request(`/api/plans/${plan}/brief`, { method: 'POST' })).status).toBe(429)
    const outbox = (await planner.request('/api/outbox')).body as { planId: number }[]
    expect(outbox.filter(m => m.planId === plan)).toHaveLength(3)
    await expectStatus(planner.request(`/api/plans/${await makePlan('draft', { planner })}/brief`, { method: 'POST' }), 202)
  })
})
