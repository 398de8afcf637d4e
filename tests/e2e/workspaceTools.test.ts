// Workspace tools on drafts of this file's own: several rows at once, copying a plan (and its
// return passage) and the speed warnings.
import { beforeAll, describe, expect, it } from 'vitest'
import type { Page } from 'playwright-core'
import { loginAs, startServer, type Api } from '../support/server'
import { expectStatus, makePlan } from '../support/records'
import { openPage, shoot, signIn, useBrowser } from '../support/browser'

await startServer()
const browser = useBrowser()
let planner: Api

// Invented positions in the southern North Sea, clear of land, one every few miles.
const SIX = Array.from({ length: 6 }, (_, k) => ({ name: `NS ${k + 1}`, lat: 52.2 + 0.15 * k, lon: 3.2 + 0.1 * k, method: 'rhumb', speedKn: 10 + k }))

beforeAll(async () => { planner = await loginAs('planner') })

const rows = (page: Page) => page.getByTestId('waypoint-row')
const names = (page: Page) => rows(page).evaluateAll(els => els.map(e => (e.querySelector('[data-cell="name"] input') as HTMLInputElement | null)?.value ?? ''))
const pick = (page: Page, row: number, shift = false) => rows(page).nth(row).locator('[data-cell="pick"]').click({ modifiers: shift ? ['Shift'] : [] })

async function open(page: Page, id: number) {
  await signIn(page, 'planner')
  await openPage(page, `/plans/${id}`)
  await page.getByTestId('plan-workspace').waitFor()
}

describe('several rows at once', () => {
  it('picks a range with Shift, deletes it in one step, and undo brings it back', async () => {
    const id = await makePlan('draft', { planner }, { waypoints: SIX })
    const page = await browser.newPage()
    await open(page, id)
    await pick(page, 1)
    await pick(page, 3, true)
    expect(await page.getByTestId('picked-count').textContent()).toBe('3 picked')
    await page.getByTestId('bulk-delete').click()
    await expect.poll(() => names(page)).toEqual(['NS 1', 'NS 5', 'NS 6'])
    expect(await page.getByTestId('undo').textContent()).toContain('delete 3 rows')
    await page.getByTestId('undo').click()
    await expect.poll(() => names(page)).toEqual(SIX.map(w => w.name))
  })

  it('moves picked rows with the keyboard and the row box, and reverses them with their legs', async () => {
    const id = await makePlan('draft', { planner }, { waypoints: SIX })
    const page = await browser.newPage()
    await open(page, id)
    await pick(page, 1)
    await pick(page, 2)
    // Alt+↓ on a picked row moves all picked rows; the cursor stays in the same cell of the same waypoint.
    await rows(page).nth(1).locator('[data-cell="name"] input').focus()
    await page.keyboard.press('Alt+ArrowDown')
    await expect.poll(() => names(page)).toEqual(['NS 1', 'NS 4', 'NS 2', 'NS 3', 'NS 5', 'NS 6'])
    expect(await page.evaluate(() => document.activeElement?.closest('[data-row]')?.getAttribute('data-row'))).toBe('2')
    await page.getByTestId('bulk-target').fill('5')
    await page.getByTestId('bulk-move').click()
    await expect.poll(() => names(page)).toEqual(['NS 1', 'NS 4', 'NS 5', 'NS 6', 'NS 2', 'NS 3'])
    await page.getByTestId('bulk-reverse').click()
    await expect.poll(() => names(page)).toEqual(['NS 1', 'NS 4', 'NS 5', 'NS 6', 'NS 3', 'NS 2'])
    // The leg NS 3 → NS 2 is the old leg NS 2 → NS 3 sailed back: its speed (12 kn) now sits on NS 2.
    expect(await rows(page).nth(5).locator('[data-cell="speed"] input').inputValue()).toBe('12')
    await shoot(page, 'workspace-bulk-1440')
    const phone = await browser.newPage(390, 844)
    await open(phone, id)
    await pick(phone, 0)
    await pick(phone, 2, true)
    await phone.getByTestId('waypoint-bulk').scrollIntoViewIfNeeded()
    await shoot(phone, 'workspace-bulk-390')
  })
})

describe('a new plan from an earlier one', () => {
  it('the return passage opens as a new draft with the waypoints reversed', async () => {
    const id = await makePlan('draft', { planner }, { title: `Outward ${process.pid}`, waypoints: SIX })
    const page = await browser.newPage()
    await open(page, id)
    await page.getByTestId('copy-plan-reversed').click()
    await page.waitForURL(u => u.pathname !== `/plans/${id}` && /^\/plans\/\d+$/.test(u.pathname))
    await page.getByTestId('plan-workspace').waitFor()
    await expect.poll(() => names(page)).toEqual(SIX.map(w => w.name).reverse())
    expect(await page.getByLabel('Title', { exact: true }).inputValue()).toBe(`Outward ${process.pid} (return)`)
  })
})

describe('speed warnings', () => {
  it('17.5 kn on Kestrel Dawn: beyond its service speed and its fuel data, both said', async () => {
    const id = await makePlan('draft', { planner }, { waypoints: SIX.map(w => ({ ...w, speedKn: null })) })
    const { plan } = await expectStatus<{ plan: { version: number, title: string, departureUtc: string } }>(planner.request(`/api/plans/${id}`), 200)
    await expectStatus(planner.request(`/api/plans/${id}`, { method: 'PUT', body: { version: plan.version, title: plan.title, departureUtc: plan.departureUtc, speedKn: 17.5 } }), 200)
    const page = await browser.newPage()
    await open(page, id)
    const notes = page.getByTestId('speed-warnings')
    await notes.waitFor()
    // Kestrel Dawn (demo data): service speed 14.5 kn, fuel data measured from 11 to 16 kn.
    expect(await notes.textContent()).toContain('faster than the vessel\'s service speed of 14.5 kn')
    expect(await notes.textContent()).toContain('outside the vessel\'s fuel data (11–16 kn)')
    await shoot(page, 'workspace-speed-warnings-1440')
    // Back within both: the warnings go.
    await page.getByLabel('Speed (kn)', { exact: true }).fill('14')
    await page.getByLabel('Speed (kn)', { exact: true }).press('Enter')
    await expect.poll(() => notes.count()).toBe(0)
  })
})
