// /admin/settings (admin only) and the vessel page's fuel grades card, loaded directly at 1440 and 390 px.
// Writes here put the settings back as they were (other files read them while this one runs).
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { loginAs, startServer, type Api } from '../support/server'
import { openPage, shoot, signIn, useBrowser } from '../support/browser'
import { expectStatus, vesselIdNamed } from '../support/records'

await startServer()
const browser = useBrowser()
let admin: Api
let original: any
beforeAll(async () => {
  admin = await loginAs('admin')
  original = await expectStatus(admin.request('/api/company/settings'), 200)
})
afterAll(async () => { await admin.request('/api/company/settings', { method: 'PUT', body: original }) })

describe('company settings page', () => {
  it('an admin adds a bunker price, is stopped by a bad currency, and saves', async () => {
    const page = await browser.newPage()
    await signIn(page, 'admin')
    await openPage(page, '/admin/settings')
    const form = page.getByTestId('company-settings')
    await form.waitFor()
    // The demo seed prices VLSFO at 585 USD/t (db/seeds/04_fuel_prices.ts).
    expect(await page.getByLabel('Grade, row 1').inputValue()).toBe('VLSFO')
    expect(await page.getByLabel('Price per tonne, row 1').inputValue()).toBe('585')
    await shoot(page, 'settings-1440')

    const rows = original.fuelPrices.length
    await page.getByRole('button', { name: 'Add grade' }).click()
    const grade = `E2E${process.pid % 1000}`
    await page.getByLabel(`Grade, row ${rows + 1}`).fill(grade)
    await page.getByLabel(`Price per tonne, row ${rows + 1}`).fill('640')
    await page.getByLabel('Currency').fill('U$')
    await form.getByText('currency is a three-letter code').waitFor()
    expect(await page.getByRole('button', { name: 'Save settings' }).isDisabled()).toBe(true)
    await page.getByLabel('Currency').fill('USD')
    // Monitoring thresholds: 0–240 h late (shared/types/company.ts, monitoringSettingsSchema); blank keeps the default.
    await page.getByLabel('Late after h').fill('500')
    await form.getByText('must be from 0 to 240 h').waitFor()
    expect(await page.getByRole('button', { name: 'Save settings' }).isDisabled()).toBe(true)
    await page.getByLabel('Late after h').fill('')
    await page.getByRole('button', { name: 'Save settings' }).click()
    await page.getByRole('status').getByText('Settings saved').waitFor()
    const stored = await expectStatus(admin.request('/api/company/settings'), 200)
    expect(stored.fuelPrices).toContainEqual({ grade, pricePerTonne: 640 })
    expect(stored.monitoring?.lateH).toBe(original.monitoring?.lateH)

    // Removing the new row (the last) leaves the others with their own values.
    await page.getByRole('button', { name: `Remove price row ${rows + 1}` }).click()
    expect(await page.getByLabel('Grade, row 1').inputValue()).toBe('VLSFO')
    expect(await page.getByLabel(`Grade, row ${rows + 1}`).count()).toBe(0)
  })

  it('refuses other roles in the app\'s own frame', async () => {
    const page = await browser.newPage()
    await signIn(page, 'planner')
    const res = await openPage(page, '/admin/settings')
    expect(res?.status()).toBe(403)
    await page.getByText('Only an admin changes the company settings').waitFor()
  })

  it('fits a phone (390 px) without sideways scrolling', async () => {
    const page = await browser.newPage(390, 844)
    await signIn(page, 'admin')
    await openPage(page, '/admin/settings')
    await page.getByTestId('company-settings').waitFor()
    const widths = await page.evaluate(() => ({ scroll: document.documentElement.scrollWidth, viewport: window.innerWidth }))
    expect(widths.scroll).toBeLessThanOrEqual(widths.viewport)
    await shoot(page, 'settings-390')
  })
})

describe('vessel fuel grades card', () => {
  it('the shore desk sees the grades with their prices and edits them', async () => {
    const id = await vesselIdNamed(admin, 'Kestrel Meridian')
    const page = await browser.newPage()
    await signIn(page, 'shore')
    await openPage(page, `/vessels/${id}`)
    const card = page.getByTestId('fuel-grades')
    // Kestrel Meridian burns LSMGO in ECAs at 805 USD/t in the demo (db/seeds/04_fuel_prices.ts).
    await card.getByText('LSMGO').waitFor()
    expect(await card.textContent()).toContain('805 USD/t')
    await card.getByRole('button', { name: 'Edit' }).click()
    await card.getByLabel('Inside ECAs').fill('')
    await card.getByText('grade is required').waitFor()
    expect(await card.getByRole('button', { name: 'Save fuel grades' }).isDisabled()).toBe(true)
    await card.getByLabel('Inside ECAs').fill('LSMGO')
    await card.getByRole('button', { name: 'Save fuel grades' }).click()
    await card.getByRole('button', { name: 'Edit' }).waitFor()
    await shoot(page, 'vessel-grades-1440')
  })
})
