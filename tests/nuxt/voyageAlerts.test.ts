// Voyage alerts through the durable outbox: a flag raised on the latest report sends the company's
// shore users one e-mail, kept through an SMTP outage and an app restart, and none again until a
// later report clears the flag. The test-utils server runs web-only (outbox worker off); the sending
// is done by server processes this file starts and kills.
import { mkdirSync, rmSync } from 'node:fs'
import { join } from 'node:path'
import knex from 'knex'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { PLANNING_CAUTION } from '#shared/utils/cautions'
import { expectStatus, makePlan } from '../support/records'
import { type Api, loginAs, rootDir, startServer } from '../support/server'
import { freePort } from '../support/instances'
import { startMailFake, startWorker, stop, stopAll, waitFor } from '../support/processes'
import { mailsFor } from '../support/mail'
import { waitForOutboxSettled } from '../support/outbox'

await startServer({ NUXT_OUTBOX_WORKER: 'off' })

const db = knex({ client: 'pg', connection: process.env.NUXT_DATABASE_URL })

// An invented rhumb leg across the Tasman Sea, clear of land, sailed from 2026-11-24 06:00 UTC at 12 kn.
const WAYPOINTS = [{ name: 'Tasman A', lat: -35, lon: 155, method: 'rhumb' }, { name: 'Tasman B', lat: -35, lon: 165, method: 'rhumb' }]
const DEPARTURE = '2026-11-24T06:00:00Z'
const hoursAfter = (h: number) => new Date(Date.parse(DEPARTURE) + h * 3_600_000).toISOString()
// On the 35°S parallel 1° of longitude is about 49.2 nm (cos 35° × 60 nm, from memory); 12 kn for h hours
// is 12·h nm along, i.e. 155° + 12h / 49.2 east. 30′ of latitude off the parallel is about 30 nm: off track
// against the 5 nm default corridor; 1′ is about 1 nm: inside it.
const onTrackAt = (h: number, offMinutes = 0) => ({ timeUtc: hoursAfter(h), lat: -35 + offMinutes / 60, lon: 155 + 12 * h / 49.2 })

let planner: Api, master: Api
const alertRows = (planId: number) => db('outbox_messages').where({ plan_id: planId, kind: 'voyage_alert' }).orderBy('id').select('id', 'state', 'subject', 'message_id')

beforeAll(async () => {
  planner = await loginAs('planner')
  master = await loginAs('master')
})

afterAll(async () => {
  await stopAll()
  await db.destroy()
})

describe('alerts to the shore', () => {
  it('sends one alert for an off-track report across an SMTP outage and a restart, to the company\'s shore users', async () => {
    const planId = await makePlan('approved', { planner, master }, { vesselName: 'Kestrel Meridian', waypoints: WAYPOINTS, departureUtc: DEPARTURE })
    const smtpPort = await freePort()
    const mailDir = join(rootDir, '.data', `mail-voyage-${smtpPort}`)
    rmSync(mailDir, { recursive: true, force: true })
    mkdirSync(mailDir, { recursive: true })

    await expectStatus(planner.request(`/api/plans/${planId}/reports`, { method: 'POST', body: onTrackAt(10) }), 201)
    expect(await alertRows(planId)).toEqual([])

    // Mail server down: the worker tries and fails.
    const first = await startWorker(`smtp://127.0.0.1:${smtpPort}`)
    const off = await expectStatus(planner.request(`/api/plans/${planId}/reports`, { method: 'POST', body: onTrackAt(20, 30) }), 201)
    expect(off.flags).toContain('off-track')
    const [queued] = await alertRows(planId)
    expect(queued!.subject).toMatch(/^Off track: Kestrel Meridian, /)
    await waitFor('the alert to fail', async () => (await db('outbox_messages').where({ id: queued!.id }).first())?.state === 'failed')
    await stop(first, 'SIGKILL')

    // Still off track on the next report: no second alert.
    await expectStatus(planner.request(`/api/plans/${planId}/reports`, { method: 'POST', body: onTrackAt(30, 25) }), 201)
    expect(await alertRows(planId)).toHaveLength(1)

    // The mail server returns, the app restarts: the alert goes once.
    const fake = await startMailFake(smtpPort, mailDir)
    const second = await startWorker(`smtp://127.0.0.1:${smtpPort}`)
    await waitFor('the alert to be sent', async () => (await db('outbox_messages').where({ id: queued!.id }).first())?.state === 'sent', 90_000)
    await waitForOutboxSettled([queued!.id])
    const mails = mailsFor(mailDir, queued!.id)
    expect(mails).toHaveLength(1)
    const shore = await db('users').join('companies', 'companies.id', 'users.company_id').where({ 'companies.name': 'Kestrel Bight Shipping', 'users.role': 'shore' }).pluck('users.email')
    expect([...mails[0]!.envelopeTo].sort()).toEqual([...shore].sort())
    expect(mails[0]!.messageId).toBe(queued!.message_id)
    expect(mails[0]!.text).toContain('to port of leg 1') // 30′ north of an eastbound parallel is to port
    expect(mails[0]!.text).toContain(PLANNING_CAUTION)

    // Back inside the corridor the flag clears; off track again raises one new alert.
    const back = await expectStatus(planner.request(`/api/plans/${planId}/reports`, { method: 'POST', body: onTrackAt(40, 1) }), 201)
    expect(back.flags).not.toContain('off-track')
    await expectStatus(planner.request(`/api/plans/${planId}/reports`, { method: 'POST', body: onTrackAt(50, -30) }), 201)
    const rows = await alertRows(planId)
    expect(rows).toHaveLength(2)
    await waitForOutboxSettled(rows.map(r => r.id))
    expect(mailsFor(mailDir, rows[0]!.id)).toHaveLength(1)
    expect(mailsFor(mailDir, rows[1]!.id)).toHaveLength(1)
    expect(mailsFor(mailDir, rows[1]!.id)[0]!.text).toContain('to starboard of leg 1')
    await stop(second)
    await stop(fake)
    rmSync(mailDir, { recursive: true, force: true })
  })

  it('deleting the report that raised a flag clears it, without an e-mail', async () => {
    const planId = await makePlan('approved', { planner, master }, { vesselName: 'Kestrel Meridian', waypoints: WAYPOINTS, departureUtc: DEPARTURE })
    await expectStatus(planner.request(`/api/plans/${planId}/reports`, { method: 'POST', body: onTrackAt(10) }), 201)
    const off = await expectStatus(planner.request(`/api/plans/${planId}/reports`, { method: 'POST', body: onTrackAt(20, 30) }), 201)
    expect(await alertRows(planId)).toHaveLength(1)
    expect((await master.request(`/api/plans/${planId}/reports/${off.id}`, { method: 'DELETE' })).status).toBe(204)
    expect(await db('voyage_alerts').where({ plan_id: planId, flag: 'off-track' }).first('active')).toEqual({ active: false })
    expect(await alertRows(planId)).toHaveLength(1)
  })
})
