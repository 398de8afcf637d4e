import { beforeAll, describe, expect, it } from 'vitest'
import { loginAs, startServer } from '../support/server'
import { openPage, shoot, signIn, useBrowser } from '../support/browser'

await startServer()
const browser = useBrowser()
let places: { id: number, name: string, lat: number, lon: number }[] = []

beforeAll(async () => {
  places = (await (await loginAs('planner')).request('/api/places')).body
})
const place = (name: string) => places.find(p => p.name === name)!

describe('starting a new plan', () => {
  it('reads the limiting latitude as navigators write it and never shows NaN', async () => {
    const page = await browser.newPage(1440, 900)
    await signIn(page, 'planner')
    await openPage(page, '/plans/new')
    await page.getByTestId('new-plan-form').waitFor()
    const limit = page.getByLabel('Limiting latitude (optional)')
    await limit.fill('fifty')
    await limit.blur()
    await page.getByText('Limiting latitude: unexpected "F"').waitFor()
    expect(await limit.inputValue()).toBe('fifty')
    for (const [typed, shown] of [['50N', '50°00.0′'], ['50°N', '50°00.0′'], ['48 45', '48°45.0′']] as const) {
      await limit.fill(typed)
      await limit.blur()
      await expect.poll(() => limit.inputValue()).toBe(shown)
    }
    expect(await page.getByRole('alert').count()).toBe(0)
    // 24-hour UTC whatever the browser's locale: the departure reads back as typed.
    const departure = page.getByLabel('Departure (UTC)')
    await departure.fill('2027-03-01 6 PM')
    await departure.blur()
    await page.getByText('type the date and time as 2026-12-10 06:00').waitFor()
    await departure.fill('2027-03-01 18:30')
    await departure.blur()
    await page.getByLabel('Title').fill('Limit typed as 50N')
    await page.getByRole('button', { name: 'Create plan' }).click()
    await page.waitForURL(/\/plans\/\d+$/)
    await page.getByTestId('plan-workspace').waitFor()
    const id = Number(new URL(page.url()).pathname.split('/').pop())
    const { plan } = (await (await loginAs('planner')).request(`/api/plans/${id}`)).body
    expect(plan.limitLat).toBe(48.75)
    expect(plan.departureUtc).toBe('2027-03-01T18:30:00.000Z')
    expect(await page.getByLabel('Limiting latitude', { exact: true }).inputValue()).toBe('48°45.0′')
    expect(await page.getByLabel('Departure (UTC)').inputValue()).toBe('2027-03-01 18:30')
    await shoot(page, 'new-plan-limit-typed')
  })

  it('starts from the departure place alone, and a new row goes where it makes sense', async () => {
    const page = await browser.newPage(1440, 900)
    await signIn(page, 'planner')
    await openPage(page, '/plans/new')
    await page.getByTestId('new-plan-form').waitFor()
    await page.getByLabel('Title').fill('Departure only, Yokohama')
    await page.getByLabel('Departure place', { exact: true }).selectOption({ label: 'Yokohama (JPYOK)' })
    await page.getByRole('button', { name: 'Create plan' }).click()
    await page.waitForURL(/\/plans\/\d+$/)
    const rows = page.getByTestId('waypoint-row')
    await expect.poll(() => rows.count()).toBe(1)
    const yok = place('Yokohama')
    expect(Number(await rows.first().getAttribute('data-lat'))).toBeCloseTo(yok.lat, 9)
    expect(await rows.first().locator('[data-cell="name"] input').inputValue()).toBe('Yokohama')

    // The next row is one step on (60 nm east of a lone waypoint), never at 0°N 0°E.
    await page.getByTestId('add-waypoint').click()
    await expect.poll(() => rows.count()).toBe(2)
    const lat = Number(await rows.nth(1).getAttribute('data-lat'))
    const lon = Number(await rows.nth(1).getAttribute('data-lon'))
    expect(Math.abs(lat - yok.lat)).toBeLessThan(1)
    expect(lon - yok.lon).toBeGreaterThan(0.5)
    expect(lon - yok.lon).toBeLessThan(1.5)
    // A row inserted between two goes halfway between them.
    await rows.first().getByRole('button', { name: 'Insert after' }).click()
    await expect.poll(() => rows.count()).toBe(3)
    expect(Number(await rows.nth(1).getAttribute('data-lon'))).toBeCloseTo((yok.lon + lon) / 2, 1)
    await shoot(page, 'new-plan-departure-only')
  })

  it('after a lone departure, a new row goes to the arrival place', async () => {
    const api = await loginAs('planner')
    const vessels = (await api.request('/api/vessels')).body as { id: number }[]
    const created = await api.request('/api/plans', {
      method: 'POST',
      body: { vesselId: vessels[0]!.id, title: 'Arrival place known', departureUtc: '2027-02-01T00:00:00Z', speedKn: 14, departurePlaceId: place('Yokohama').id, arrivalPlaceId: place('Seattle').id },
    })
    expect(created.status).toBe(201)
    // Without startFromPlaces the list starts empty; the first row goes to the departure, the next to the arrival.
    const page = await browser.newPage(1440, 900)
    await signIn(page, 'planner')
    await openPage(page, `/plans/${created.body.id}`)
    await page.getByTestId('plan-workspace').waitFor()
    const rows = page.getByTestId('waypoint-row')
    expect(await rows.count()).toBe(0)
    await page.getByTestId('add-waypoint').click()
    await page.getByTestId('add-waypoint').click()
    await expect.poll(() => rows.count()).toBe(2)
    const names = await rows.locator('[data-cell="name"] input').evaluateAll(els => els.map(e => (e as HTMLInputElement).value))
    expect(names).toEqual(['Yokohama', 'Seattle'])
    await page.getByTestId('leg-table').getByTestId('leg-0').waitFor()
  })

  it('refuses a place of another company when starting from places', async () => {
    const other = await loginAs('otherPlanner')
    const vessels = (await other.request('/api/vessels')).body as { id: number }[]
    const res = await other.request('/api/plans', {
      method: 'POST',
      body: { vesselId: vessels[0]!.id, title: 'Foreign place', departureUtc: '2027-02-01T00:00:00Z', speedKn: 14, departurePlaceId: place('Yokohama').id, startFromPlaces: true },
    })
    expect(res.status).toBe(400)
    expect(res.body.message).toMatch(/departurePlaceId/)
  })
})
