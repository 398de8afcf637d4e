// Crew brief through the durable outbox. The test-utils server runs web-only (outbox worker off)
// and queues briefs; the sending is done by server processes this file starts and kills itself,
// so it can take the mail server away, restart the app mid-delivery and count what arrives.
import { mkdirSync, rmSync } from 'node:fs'
import { join } from 'node:path'
import knex from 'knex'
import PgBoss from 'pg-boss'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { PLANNING_CAUTION, LAND_CHECK_CAUTION } from '#shared/utils/cautions'
import { type Api, loginAs, rootDir, startServer } from '../support/server'
import { freePort } from '../support/instances'
import { startMailFake, startWorker, stop, stopAll, waitFor } from '../support/processes'
import { mailsFor } from '../support/mail'
import { waitForOutboxSettled } from '../support/outbox'

await startServer({ NUXT_OUTBOX_WORKER: 'off' })

const mainMailDir = process.env.PW_MAIL_DIR!
const mainSmtpUrl = process.env.NUXT_SMTP_URL || 'smtp://127.0.0.1:2526'
const db = knex({ client: 'pg', connection: process.env.NUXT_DATABASE_URL })

const row = (id: number) => db('outbox_messages').where({ id }).first()

let planner: Api, shore: Api
let approvedPlanId = 0, draftPlanId = 0

beforeAll(async () => {
  planner = await loginAs('planner')
  shore = await loginAs('shore')
  const plans = (await planner.request('/api/plans')).body as { id: number, title: string, status: string }[]
  approvedPlanId = plans.find(p => p.title.startsWith('Cape of Good Hope') && p.status === 'approved')!.id
  draftPlanId = plans.find(p => p.title.startsWith('Yokohama') && p.status === 'draft')!.id
})

afterAll(async () => {
  await stopAll()
  // Leave the demo data as other test files expect it.
  const crewless = db('vessels').where({ imo_number: '9000003' }).select('id')
  await db('plans').whereIn('vessel_id', crewless).delete()
  await db('vessels').where({ imo_number: '9000003' }).delete()
  await db.destroy()
})

describe('queueing a crew brief', () => {
  it('lets planner, master and shore queue a brief; admin 403, another company 404', async () => {
    expect((await (await loginAs('admin')).request(`/api/plans/${draftPlanId}/brief`, { method: 'POST' })).status).toBe(403)
    expect((await (await loginAs('otherPlanner')).request(`/api/plans/${draftPlanId}/brief`, { method: 'POST' })).status).toBe(404)
    const res = await shore.request(`/api/plans/${draftPlanId}/brief`, { method: 'POST' })
    expect(res.status).toBe(202)
    expect(res.body).toMatchObject({ state: 'queued', recipientCount: 5 })
    expect(res.body.messageId).toMatch(/^<brief\.[0-9a-f-]+@[^>]+>$/)
    expect(res.body.subject).toMatch(/NOT YET APPROVED/)
  })

  it('answers 409 when the vessel has no crew list', async () => {
    const company = await db('companies').where({ name: 'Kestrel Bight Shipping' }).first('id')
    const [vessel] = await db('vessels').insert({ company_id: company.id, name: 'Crewless Test Hull', imo_number: '9000003', call_sign: 'TEST1', service_speed_kn: 12 })
      .onConflict('imo_number').merge().returning('id')
    const plan = await planner.request('/api/plans', { method: 'POST', body: { vesselId: vessel.id, title: 'No crew to brief', departureUtc: '2026-12-20T08:00:00Z', speedKn: 12 } })
    const res = await planner.request(`/api/plans/${plan.body.id}/brief`, { method: 'POST' })
    expect(res.status).toBe(409)
    expect(res.body.message).toMatch(/crew list/)
  })
})

describe('delivery', () => {
  it('delivers a brief to the crew list with the vessel, totals, approval and cautions', async () => {
    const worker = await startWorker(mainSmtpUrl)
    const queued = (await planner.request(`/api/plans/${approvedPlanId}/brief`, { method: 'POST' })).body
    const [mail] = await waitFor('the brief in the mail fake', () => { const m = mailsFor(mainMailDir, queued.id, queued.messageId); return m.length ? m : false })
    await stop(worker)

    const view = (await planner.request(`/api/plans/${approvedPlanId}`)).body
    const crew = await db('crew_members').join('vessels', 'vessels.id', 'crew_members.vessel_id').where('vessels.name', 'Kestrel Meridian').pluck('crew_members.email')
    expect([...mail!.envelopeTo].sort()).toEqual([...crew].sort())
    expect(mail!.messageId).toBe(queued.messageId)
    for (const body of [mail!.text, mail!.html!]) {
      expect(body).toContain('Kestrel Meridian')
      // The plan's distance as the screen writes it: grouped thousands, one decimal.
      expect(body).toContain(`${view.totals.distanceNm.toLocaleString('en-GB', { minimumFractionDigits: 1, maximumFractionDigits: 1 })} nm`)
      expect(body).toContain('APPROVED by Capt. Mirela Oduya')
      expect(body).toContain('Australia/Perth')
      expect(body.replace(/&#39;/g, '\'')).toContain(PLANNING_CAUTION)
      expect(body).toContain(LAND_CHECK_CAUTION)
    }
    expect(mail!.text).not.toContain('NOT YET APPROVED')
    expect(mail!.text).toContain('Fremantle pilot boarding ground')

    const listed = (await shore.request('/api/outbox')).body.find((m: any) => m.id === queued.id)
    expect(listed).toMatchObject({ state: 'sent', attempts: 1, recipientCount: crew.length, lastError: null, planId: approvedPlanId })
    expect(listed.sentAt).toBeTruthy()
  })

  it('keeps briefs while the mail server is down and delivers each exactly once after it returns, across an app restart', async () => {
    const smtpPort = await freePort()
    const mailDir = join(rootDir, '.data', `mail-outage-${smtpPort}`)
    rmSync(mailDir, { recursive: true, force: true })
    mkdirSync(mailDir, { recursive: true })

    // Mail server down: the worker tries, fails, records the error and waits to retry.
    const first = await startWorker(`smtp://127.0.0.1:${smtpPort}`)
    const retried = (await planner.request(`/api/plans/${draftPlanId}/brief`, { method: 'POST' })).body
    const orphaned = (await planner.request(`/api/plans/${approvedPlanId}/brief`, { method: 'POST' })).body
    for (const id of [retried.id, orphaned.id])
      await waitFor(`message ${id} to fail`, async () => (await row(id))?.state === 'failed')
    expect((await row(retried.id)).last_error).toMatch(/ECONNREFUSED|connect/i)
    const listed = (await planner.request('/api/outbox')).body.find((m: any) => m.id === retried.id)
    expect(listed.state).toBe('failed')
    expect(listed.attempts).toBeGreaterThanOrEqual(1)

    // The app dies without warning; one message even loses its job (as if the enqueue had been lost).
    await new Promise(resolve => setTimeout(resolve, 500))
    await stop(first, 'SIGKILL')
    await db('pgboss.job').where({ name: 'crew-brief', singleton_key: String(orphaned.id) }).delete()
    expect(mailsFor(mailDir, retried.id)).toHaveLength(0)

    // The mail server returns, the app restarts: both messages go, once each.
    const fake = await startMailFake(smtpPort, mailDir)
    const second = await startWorker(`smtp://127.0.0.1:${smtpPort}`)
    for (const id of [retried.id, orphaned.id])
      await waitFor(`message ${id} to be sent`, async () => (await row(id))?.state === 'sent', 90_000)
    await waitForOutboxSettled([retried.id, orphaned.id])
    for (const id of [retried.id, orphaned.id]) {
      const mails = mailsFor(mailDir, id)
      expect(mails, `message ${id}`).toHaveLength(1)
      expect(mails[0]!.messageId).toBe((await row(id)).message_id)
    }
    const sent = await row(retried.id)
    expect(sent.attempts).toBeGreaterThanOrEqual(2)
    expect(sent.last_error).toBeNull()
    await stop(second)
    await stop(fake)
    rmSync(mailDir, { recursive: true, force: true })
  })

  it('never sends a row twice when two workers race for it', async () => {
    const queued = (await planner.request(`/api/plans/${approvedPlanId}/brief`, { method: 'POST' })).body
    // Extra jobs for the same row, as a lost-and-re-enqueued job could leave behind.
    const boss = new PgBoss({ connectionString: process.env.NUXT_DATABASE_URL, schema: 'pgboss', supervise: false, schedule: false })
    await boss.start()
    for (let i = 0; i < 3; i++) await boss.send('crew-brief', { outboxId: queued.id })
    await boss.stop({ graceful: false })
    const [a, b] = await Promise.all([startWorker(mainSmtpUrl), startWorker(mainSmtpUrl)])
    await waitFor('the raced message to be sent', async () => (await row(queued.id))?.state === 'sent')
    await waitForOutboxSettled([queued.id]) // all four jobs for the row done, none still held
    expect(mailsFor(mainMailDir, queued.id, queued.messageId)).toHaveLength(1)
    expect((await row(queued.id)).attempts).toBe(1)
    await Promise.all([stop(a), stop(b)])
  })
})
