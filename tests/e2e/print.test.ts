import { fileURLToPath } from 'node:url'
import { describe, expect, it } from 'vitest'
import { loginAs, startServer } from '../support/server'
import { openPage, shoot, signIn, useBrowser } from '../support/browser'

await startServer()
const browser = useBrowser()

async function planIdByStatus(status: string) {
  const plans = (await (await loginAs('master')).request('/api/plans')).body as { id: number, status: string }[]
  return plans.find(p => p.status === status)!.id
}

describe('printable plan', () => {
  it('the master prints an approved plan: header, chart, legs, sign-off and cautions on A4', async () => {
    const id = await planIdByStatus('approved')
    const page = await browser.newPage(688, 1000)
    await signIn(page, 'master')
    await openPage(page, `/plans/${id}/print`)
    const plan = page.getByTestId('print-plan')
    await plan.waitFor()
    expect(await page.getByTestId('signed-in-user').count()).toBe(0)
    expect(await page.getByTestId('print-header').textContent()).toMatch(/IMO \d{7}/)
    expect(await page.getByTestId('print-approved').textContent()).toMatch(/Capt\..*2026-11-20 08:30Z/)
    expect(await page.getByTestId('print-not-approved').count()).toBe(0)
    expect(await page.getByTestId('print-legs').locator('tbody tr').count()).toBeGreaterThan(2)
    const cautions = await page.getByTestId('print-cautions').textContent()
    expect(cautions).toMatch(/not type-approved/)
    expect(cautions).toMatch(/Coastline data is coarse/)
    // Every tile under the track has loaded (same-origin images allowed by the CSP).
    await expect.poll(() => page.locator('[data-testid="route-sketch"] image').evaluateAll(imgs => imgs.length)).toBeGreaterThan(0)
    await page.waitForLoadState('networkidle')
    await page.emulateMedia({ media: 'print' })
    expect(await page.getByRole('button', { name: 'Print' }).isVisible()).toBe(false)
    await shoot(page, 'print-approved')
    const pdf = await page.pdf({ format: 'A4', printBackground: true, path: fileURLToPath(new URL('./screenshots/print-approved.pdf', import.meta.url)) })
    expect(pdf.subarray(0, 5).toString()).toBe('%PDF-')
  })

  it('a plan not yet approved prints with a prominent NOT APPROVED box', async () => {
    const id = await planIdByStatus('submitted')
    const page = await browser.newPage(688, 1000)
    await signIn(page, 'planner')
    await openPage(page, `/plans/${id}/print`)
    await page.getByTestId('print-not-approved').waitFor()
    expect(await page.getByTestId('print-signoff').textContent()).toMatch(/Submitted for approval.*\(planner\)/)
    await page.emulateMedia({ media: 'print' })
    await shoot(page, 'print-submitted')
  })

  it('a draft across the 180° meridian prints its chart as one track', async () => {
    const plans = (await (await loginAs('planner')).request('/api/plans')).body as { id: number, title: string }[]
    const id = plans.find(p => p.title.startsWith('Yokohama'))!.id
    const page = await browser.newPage(688, 1000)
    await signIn(page, 'planner')
    await openPage(page, `/plans/${id}/print`)
    await page.getByTestId('print-not-approved').waitFor()
    expect(await page.getByTestId('route-sketch').locator('text', { hasText: /^180°$/ }).count()).toBe(1)
    await page.waitForLoadState('networkidle')
    await page.emulateMedia({ media: 'print' })
    await shoot(page, 'print-pacific-draft')
  })
})

describe('route file import in the browser', () => {
  it('a planner previews a CSV, sees its waypoints and legs, and creates the draft', async () => {
    const page = await browser.newPage()
    await signIn(page, 'planner')
    await page.getByRole('link', { name: 'Import route file' }).click()
    await page.waitForURL(/\/plans\/import/)
    await page.getByLabel('Route file').setInputFiles(fileURLToPath(new URL('../fixtures/routes/north-atlantic.csv', import.meta.url)))
    const preview = page.getByTestId('import-preview')
    await preview.waitFor()
    expect(await page.getByTestId('import-waypoints').locator('tbody tr').count()).toBe(6)
    expect(await page.getByTestId('import-waypoints').textContent()).toContain('52°01.50′N')
    await page.getByTestId('import-totals').waitFor()
    await page.getByLabel('Title').fill('Browser import, North Atlantic')
    await page.waitForLoadState('networkidle')
    await shoot(page, 'import-preview')
    await page.getByRole('button', { name: 'Create draft' }).click()
    await page.waitForURL(/\/plans\/\d+$/)
  })

  it('a file with a bad latitude shows the error with its line and cannot be created', async () => {
    const page = await browser.newPage()
    await signIn(page, 'planner')
    await openPage(page, '/plans/import')
    await page.getByLabel('Route file').setInputFiles(fileURLToPath(new URL('../fixtures/routes/latitude-95.csv', import.meta.url)))
    const errors = page.getByTestId('import-errors')
    await errors.waitFor()
    expect(await errors.textContent()).toMatch(/line 4.*95/)
    expect(await page.getByRole('button', { name: 'Create draft' }).isDisabled()).toBe(true)
    await shoot(page, 'import-errors')
  })
})
