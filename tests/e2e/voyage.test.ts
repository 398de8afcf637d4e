// The seeded Indian Ocean voyage sailed in the browser: the master enters three position reports on
// an approved copy of the plan (one 20 nm off track), the voyage page shows them on the chart, in
// the plots and the table, the shore receives one alert, and the fleet view lists the vessel.
import knex from 'knex'
import { afterAll, describe, expect, it } from 'vitest'
import { demoPlans } from '../../db/seeds/demoData'
import { expectStatus, makePlan } from '../support/records'
import { loginAs, startServer } from '../support/server'
import { openPage, shoot, signIn, useBrowser } from '../support/browser'
import { mailsFor } from '../support/mail'
import { waitForOutboxSettled } from '../support/outbox'

await startServer()
const browser = useBrowser()
const db = knex({ client: 'pg', connection: process.env.NUXT_DATABASE_URL })
afterAll(() => db.destroy())

const seeded = demoPlans.find(p => p.title.startsWith('Cape of Good Hope'))!
const WAYPOINTS = seeded.waypoints.map(([name, lat, lon, method]) => ({ name, lat, lon, method }))

describe('sailing the Indian Ocean voyage', () => {
  let planId = 0

  it('the master reports three positions, one off track, on the voyage page', async () => {
    const planner = await loginAs('planner')
    const master = await loginAs('master')
    planId = await makePlan('approved', { planner, master }, { vesselName: 'Kestrel Meridian', waypoints: WAYPOINTS, departureUtc: seeded.departureUtc, title: 'Indian Ocean voyage (browser)' })
    const page = await browser.newPage()
    await signIn(page, 'master')
    await openPage(page, `/plans/${planId}/voyage`)
    const form = page.getByTestId('report-form')
    // Noon-style reports on the 40°S parallel (leg 2, rhumb, eastbound; invented): on track, then 20′ of latitude
    // north (about 20 nm to port, beyond the 5 nm default corridor), then back within 1 nm; 6.3° of longitude a day
    // at 40°S is about 290 nm (60 cos 40° ≈ 46 nm a degree, from memory), the plan's 12 kn, so none is late.
    const reports = [['2026-11-27 06:00', '40°00.0′S', '035°00.0′E'], ['2026-11-28 06:00', '39°40.0′S', '041°18.0′E'], ['2026-11-29 06:00', '40°00.5′S', '047°36.0′E']]
    for (const [time, lat, lon] of reports) {
      await form.getByLabel('Time (UTC)').fill(time!)
      await form.getByLabel('Time (UTC)').blur()
      await form.getByTestId('report-lat').fill(lat!)
      await form.getByTestId('report-lon').fill(lon!)
      const rows = await page.getByTestId('report-table').locator('tbody tr').count()
      await form.getByTestId('report-submit').click()
      await expect.poll(() => page.getByTestId('report-table').locator('tbody tr').count(), { timeout: 30_000 }).toBe(rows + 1)
    }
    const table = page.getByTestId('report-table')
    expect(await table.locator('[data-flag="off-track"]').count()).toBe(1)
    expect(await page.getByTestId('plot-cross-track').locator('circle').count()).toBe(3)
    expect(await page.getByTestId('plot-distance').locator('circle').count()).toBe(4) // departure and three reports
    expect(await page.getByTestId('voyage-chart').locator('.leaflet-interactive').count()).toBeGreaterThan(6)
    await shoot(page, 'voyage-1440')
    const phone = await browser.newPage(390, 844)
    await signIn(phone, 'master')
    await openPage(phone, `/plans/${planId}/voyage`)
    await phone.getByTestId('report-submit').waitFor()
    const box = await phone.getByTestId('report-form').boundingBox()
    expect(box!.width).toBeLessThanOrEqual(390)
    await shoot(phone, 'voyage-390')
  })

  it('the shore receives one alert for the off-track report', async () => {
    const rows = await db('outbox_messages').where({ plan_id: planId, kind: 'voyage_alert' }).select('id', 'subject')
    expect(rows).toHaveLength(1)
    expect(rows[0]!.subject).toMatch(/^Off track: Kestrel Meridian, Indian Ocean voyage/)
    await waitForOutboxSettled([rows[0]!.id])
    const mails = mailsFor(process.env.PW_MAIL_DIR!, rows[0]!.id)
    expect(mails).toHaveLength(1)
    const shore = await db('users').join('companies', 'companies.id', 'users.company_id').where({ 'companies.name': 'Kestrel Bight Shipping', 'users.role': 'shore' }).pluck('users.email')
    expect([...mails[0]!.envelopeTo].sort()).toEqual([...shore].sort())
  })

  it('the fleet view and the board show the vessel on passage', async () => {
    const shoreApi = await loginAs('shore')
    const fleet = await expectStatus<any[]>(shoreApi.request('/api/fleet'), 200)
    const page = await browser.newPage()
    await signIn(page, 'shore')
    await openPage(page, '/fleet')
    const table = page.getByTestId('fleet-table')
    for (const f of fleet) await table.getByText(f.vesselName, { exact: true }).waitFor()
    await page.getByTestId('fleet-chart').locator('.leaflet-interactive').first().waitFor()
    await table.getByRole('button', { name: /To go nm/ }).click()
    await shoot(page, 'fleet-1440')
    const phone = await browser.newPage(390, 844)
    await signIn(phone, 'shore')
    await openPage(phone, '/fleet')
    await phone.getByTestId('fleet-table').waitFor()
    await shoot(phone, 'fleet-390')
    await openPage(page, '/')
    expect(await page.getByTestId('board-voyage').count()).toBeGreaterThan(0)
  })
})
