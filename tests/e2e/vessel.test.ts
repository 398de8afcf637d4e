import { describe, expect, it } from 'vitest'
import { startServer } from '../support/server'
import { openPage, shoot, signIn, useBrowser } from '../support/browser'

await startServer()
const browser = useBrowser()

describe('shore desk pages', () => {
  it('the vessel page plots the fuel points and the fitted curve', async () => {
    const page = await browser.newPage()
    await signIn(page, 'shore')
    await openPage(page, '/vessels')
    await page.getByRole('link', { name: 'Kestrel Dawn' }).click()
    await page.waitForURL(/\/vessels\/\d+/)
    const plot = page.getByTestId('fuel-plot')
    await plot.waitFor()
    expect(await plot.locator('circle[r="5"]').count()).toBe(6)
    expect(await page.getByTestId('fuel-curve').getAttribute('d')).toMatch(/^M[\d.]+,[\d.]+( L[\d.]+,[\d.]+){10,}/)
    expect(await page.getByTestId('fuel-fit').textContent()).toMatch(/t\/day = [\d.]+ · V\^\d\.\d\d.*k = \d\.\d\d, r² = (0\.9\d\d|1\.000)/)
    expect(await plot.textContent()).toContain('Speed through the water (kn)')
    await shoot(page, 'vessel-fuel')
  })

  it('the place library lists, searches and previews a CSV import', async () => {
    const page = await browser.newPage()
    await signIn(page, 'shore')
    await openPage(page, '/places')
    const table = page.getByTestId('place-table')
    await table.getByText('Yokohama', { exact: true }).waitFor()
    await page.getByLabel('Search places').fill('pilot')
    await expect.poll(() => table.locator('tbody tr').count()).toBeLessThan(6)
    await page.getByLabel('Search places').fill('')
    await page.getByRole('button', { name: 'Import CSV' }).click()
    await page.getByLabel('CSV text').fill('name,kind,latitude,longitude\nCape Flattery offing,ocean_position,48 23.0N,124 50.0W\nBroken,port,95N,10E')
    await page.getByRole('button', { name: 'Preview' }).click()
    await page.getByTestId('import-errors').getByText(/line 3: lat:/).waitFor()
    expect(await page.getByRole('button', { name: /^Import \d+ places/ }).isDisabled()).toBe(true)
    await shoot(page, 'places')
  })

  it('an admin lists the company\'s users and sees the password rule', async () => {
    const page = await browser.newPage()
    await signIn(page, 'admin')
    await openPage(page, '/admin/users')
    await page.getByTestId('user-table').getByText('shore@kestrel-bight.example').waitFor()
    expect(await page.getByTestId('user-table').getByText('larkspur-reach').count()).toBe(0)
    await page.getByLabel('Initial password').fill('short')
    await page.getByRole('button', { name: 'Add user' }).click()
    await page.getByText('password must be at least 10 characters').waitFor()
    await shoot(page, 'admin-users')
  })
})
