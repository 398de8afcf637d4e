// From the planner's desk to the crew's inboxes, in the browser, with the work alternating between
// two app instances on one database (scale-out): the planner submits on one, the master approves
// on the other, the brief is sent and the outbox shows it delivered once.
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { loginAs, startServer, url } from '../support/server'
import { startInstance, type Instance } from '../support/instances'
import { mailsFor } from '../support/mail'
import { waitForOutboxSettled } from '../support/outbox'
import { openPage, shoot, signIn, useBrowser } from '../support/browser'

await startServer()
const browser = useBrowser()
let second: Instance
beforeAll(async () => { second = await startInstance() })
afterAll(async () => { await second?.stop() })

const deliveredFor = (outboxId: number) => mailsFor(process.env.PW_MAIL_DIR!, outboxId)

describe('sign-off and crew brief across two instances', () => {
  it('planner submits on one instance, master approves on the other, the brief goes out once', async () => {
    const api = await loginAs('planner')
    const vessels = (await api.request('/api/vessels')).body as { id: number, name: string }[]
    const vesselId = vessels.find(v => v.name === 'Kestrel Dawn')!.id
    const { id } = (await api.request('/api/plans', { method: 'POST', body: { vesselId, title: 'Sign-off run – Lizard to Ushant', departureUtc: '2027-02-10T06:00:00Z', speedKn: 13 } })).body
    await api.request(`/api/plans/${id}/waypoints`, { method: 'PUT', body: { version: 1, waypoints: [{ name: 'Lizard offing', lat: 49.85, lon: -5.2 }, { name: 'Ushant offing', lat: 48.6, lon: -5.4, method: 'geodesic' }] } })

    const planner = await browser.newPage()
    await signIn(planner, 'planner')
    await openPage(planner, `/plans/${id}`)
    // The planner's land check of the saved track is kept with the plan for the master.
    await planner.getByTestId('run-land-check').click()
    await planner.getByTestId('land-check-kept').waitFor()
    const { landCheck } = (await api.request(`/api/plans/${id}`)).body
    expect(landCheck.current).toBe(true)
    await planner.getByRole('button', { name: 'Submit for sign-off' }).click()
    await planner.getByTestId('signoff-panel').locator('[data-status="submitted"]').waitFor()
    expect(await planner.getByRole('button', { name: 'Approve' }).count()).toBe(0)

    const master = await browser.newPage()
    await openPage(master, `${second.url}/login`)
    await signIn(master, 'master', second.url)
    await openPage(master, `${second.url}/plans/${id}`)
    // Beside the approval: the kept land check, by whom and what it found.
    const kept = master.getByTestId('signoff-land-check')
    expect(await kept.textContent()).toContain(`Land check by ${landCheck.checkedBy}`)
    expect(await kept.textContent()).toContain(landCheck.flaggedLegs ? `${landCheck.flaggedLegs} of 1 legs flagged` : 'no leg flagged')

    // Approval asks first, naming the plan, its revision, the land check and the zones; "Not yet" changes nothing.
    await master.getByTestId('signoff-actions').getByRole('button', { name: 'Approve' }).click()
    const dialog = master.getByTestId('approve-dialog')
    await dialog.waitFor()
    expect(await dialog.getByTestId('approve-plan').textContent()).toBe('Sign-off run – Lizard to Ushant')
    expect(await dialog.getByTestId('approve-revision').textContent()).toBe('1')
    expect(await dialog.getByTestId('approve-land-check').textContent()).toContain(landCheck.checkedBy)
    expect(await dialog.getByTestId('approve-zones').textContent()).toMatch(/no no-go or risk area/)
    await shoot(master, 'signoff-confirm')
    await dialog.getByRole('button', { name: 'Not yet' }).click()
    await dialog.waitFor({ state: 'hidden' })
    expect((await api.request(`/api/plans/${id}`)).body.plan.status).toBe('submitted')
    await master.getByTestId('signoff-actions').getByRole('button', { name: 'Approve' }).click()
    await dialog.getByTestId('confirm-approve').click()
    await master.getByTestId('approval-line').getByText('Approved by').waitFor()
    await master.getByTestId('signoff-panel').locator('[data-status="approved"]').waitFor()
    await shoot(master, 'signoff-approved')

    // The planner's session, made on the first instance, works on the second.
    await openPage(planner, `${second.url}/plans/${id}`)
    await planner.getByTestId('approval-line').getByText('Approved by').waitFor()
    await planner.getByRole('button', { name: 'Send crew brief' }).click()
    await planner.getByRole('status').waitFor()

    const outbox = (await api.request('/api/outbox')).body as { id: number, planId: number }[]
    const message = outbox.find(m => m.planId === id)!
    await expect.poll(() => deliveredFor(message.id).length, { timeout: 60_000, interval: 500 }).toBe(1)
    await openPage(planner, `${url('')}/outbox`)
    await planner.getByTestId('outbox-table').locator('[data-state="sent"]').first().waitFor()
    await shoot(planner, 'outbox-sent')
    await waitForOutboxSettled([message.id])
    expect(deliveredFor(message.id)).toHaveLength(1)
  })
})
