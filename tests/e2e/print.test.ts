import { fileURLToPath } from 'node:url'
import { beforeAll, describe, expect, it } from 'vitest'
import { type Api, loginAs, startServer } from '../support/server'
import { openPage, shoot, signIn, useBrowser } from '../support/browser'
import { expectStatus, makePlan } from '../support/records'

await startServer()
const browser = useBrowser()

// The seeded North Pacific crossing's positions (Yokohama – Juan de Fuca), for a draft across 180°.
const PACIFIC = [
  { name: 'Nojima Zaki offing', lat: 34.85, lon: 139.95, method: 'rhumb' },
  { name: 'Juan de Fuca Strait entrance', lat: 48.495, lon: -124.8, method: 'geodesic' },
  { name: 'Port Angeles pilot station', lat: 48.142, lon: -123.4, method: 'rhumb' },
]

let planner: Api, master: Api
beforeAll(async () => {
  planner = await loginAs('planner')
  master = await loginAs('master')
})

describe('printable plan', () => {
  it('the master prints an approved plan: header, chart, legs, sign-off and cautions on A4', async () => {
    const id = await makePlan('approved', { planner, master }, { title: 'Print test – approved' })
    const { plan: stored } = await expectStatus<{ plan: { approvedAt: string } }>(planner.request(`/api/plans/${id}`), 200)
    const page = await browser.newPage(688, 1000)
    await signIn(page, 'master')
    await openPage(page, `/plans/${id}/print`)
    const plan = page.getByTestId('print-plan')
    await plan.waitFor()
    expect(await page.getByTestId('signed-in-user').count()).toBe(0)
    expect(await page.getByTestId('print-header').textContent()).toMatch(/IMO \d{7}/)
    expect(await page.getByTestId('print-approved').textContent()).toBe(`Capt. Mirela Oduya, ${stored.approvedAt.slice(0, 16).replace('T', ' ')}Z`) // master of Kestrel Dawn in the seed; time as stored, to the minute
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
    const id = await makePlan('submitted', { planner }, { title: 'Print test – submitted' })
    const page = await browser.newPage(688, 1000)
    await signIn(page, 'planner')
    await openPage(page, `/plans/${id}/print`)
    await page.getByTestId('print-not-approved').waitFor()
    expect(await page.getByTestId('print-signoff').textContent()).toMatch(/Submitted for approval.*\(planner\)/)
    await page.emulateMedia({ media: 'print' })
    await shoot(page, 'print-submitted')
  })

  it('a draft across the 180° meridian prints its chart as one track', async () => {
    const id = await makePlan('draft', { planner }, { title: 'Print test – Pacific draft', waypoints: PACIFIC })
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
