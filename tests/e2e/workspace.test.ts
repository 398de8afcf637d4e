import { beforeAll, describe, expect, it } from 'vitest'
import type { Page } from 'playwright-core'
import { demoPlans } from '../../db/seeds/demoData'
import { loginAs, startServer } from '../support/server'
import { openPage, shoot, signIn, useBrowser } from '../support/browser'

await startServer()
const browser = useBrowser()
const TITLE = 'Yokohama – Juan de Fuca, North Pacific crossing'
const LIMIT = 48.75
let planId = 0

// Each run starts from the seeded waypoints, whatever an earlier run saved.
beforeAll(async () => {
  const api = await loginAs('planner')
  const plans = (await api.request('/api/plans')).body as { id: number, title: string }[]
  planId = plans.find(p => p.title === TITLE)!.id
  const { plan } = (await api.request(`/api/plans/${planId}`)).body
  const seed = demoPlans.find(p => p.title === TITLE)!
  const waypoints = seed.waypoints.map(([name, lat, lon, method]) => ({ name, lat, lon, method }))
  const res = await api.request(`/api/plans/${planId}/waypoints`, { method: 'PUT', body: { version: plan.version, waypoints } })
  expect(res.status).toBe(200)
  const header = { version: plan.version + 1, title: TITLE, departureUtc: seed.departureUtc, speedKn: seed.speedKn, limitLat: seed.limitLat, departurePlaceId: plan.departurePlaceId, arrivalPlaceId: plan.arrivalPlaceId }
  expect((await api.request(`/api/plans/${planId}`, { method: 'PUT', body: header })).status).toBe(200)
})

const rows = (page: Page) => page.getByTestId('waypoint-row')
const totalNm = async (page: Page) => Number((await page.getByTestId('total-distance').textContent())!.replace(/,/g, ''))
const latitudes = (page: Page) => rows(page).evaluateAll(els => els.map(e => Number(e.getAttribute('data-lat'))))

describe('plan workspace', () => {
  it('edits, splits, holds a limiting latitude and saves the Yokohama – Juan de Fuca draft', async () => {
    const page = await browser.newPage(1600, 1000)
    await signIn(page, 'planner')
    await openPage(page, `/plans/${planId}`)
    await page.getByTestId('plan-workspace').waitFor()
    expect(await rows(page).count()).toBe(4)
    expect(await page.getByTestId('save-state').textContent()).toBe('saved')
    await shoot(page, 'workspace-loaded')

    // Edit the offing position as a navigator types it: the leg table follows.
    const before = await totalNm(page)
    const legBefore = await page.getByTestId('leg-1').getByTestId('leg-distance').textContent()
    const pos = page.getByTestId('wp-position-1').locator('input')
    await pos.fill('34 30.0N 140 30.0E')
    await pos.press('Enter')
    await expect.poll(() => totalNm(page)).not.toBe(before)
    expect(await page.getByTestId('leg-1').getByTestId('leg-distance').textContent()).not.toBe(legBefore)
    expect(await page.getByTestId('save-state').textContent()).toBe('unsaved changes')

    // A position that cannot be read shows its message in place and blocks the save.
    await pos.fill('34 30.0N 190 00E')
    await pos.press('Enter')
    await page.getByTestId('cell-error').waitFor()
    expect(await page.getByTestId('cell-error').textContent()).toMatch(/beyond 180/)
    expect(await page.getByTestId('save').isDisabled()).toBe(true)
    await shoot(page, 'workspace-invalid-cell')
    await pos.press('Escape')
    await pos.blur()
    await expect.poll(() => page.getByTestId('cell-error').count()).toBe(0)

    // Hold the limiting latitude: the ocean leg becomes geodesic – parallel – geodesic, nothing poleward of it.
    expect(Math.max(...(await latitudes(page)))).toBeLessThan(LIMIT)
    // The limit is typed once, in the header, as navigators write it; the track tools hold it.
    await page.getByLabel('Limiting latitude', { exact: true }).fill('48°45′N')
    await page.getByLabel('Limiting latitude', { exact: true }).press('Enter')
    await expect.poll(() => page.getByTestId('tool-limit').textContent()).toContain('48°45.0′')
    await page.getByTestId('apply-limit').click()
    await expect.poll(() => rows(page).count()).toBe(6)
    const lats = await latitudes(page)
    expect(Math.max(...lats)).toBeLessThanOrEqual(LIMIT + 1e-9)
    expect(lats.filter(l => Math.abs(l - LIMIT) < 1e-6)).toHaveLength(2)
    expect(await page.getByTestId('tool-message').textContent()).toMatch(/1 leg replaced/)
    await shoot(page, 'workspace-limit')

    // Split the first composite leg (geodesic up to the limit) every 10° of longitude into rhumb-line legs.
    await page.getByTestId('split-leg').selectOption({ index: 2 })
    await page.getByTestId('split-every').fill('10')
    await page.getByTestId('split').click()
    await expect.poll(() => rows(page).count()).toBeGreaterThan(6)
    const split = await rows(page).count()
    expect(Math.max(...(await latitudes(page)))).toBeLessThanOrEqual(LIMIT + 1e-9)
    const methods = await rows(page).locator('select[data-cell="method"]').evaluateAll(els => els.map(e => (e as HTMLSelectElement).value))
    expect(methods.slice(1, split - 3).every(m => m === 'rhumb')).toBe(true)
    await shoot(page, 'workspace-split')

    // Undo brings the split back out; redo it and save.
    await page.getByTestId('undo').click()
    await expect.poll(() => rows(page).count()).toBe(6)
    await page.getByTestId('split').click()
    await expect.poll(() => rows(page).count()).toBe(split)

    await page.getByTestId('save').click()
    await expect.poll(() => page.getByTestId('save-state').textContent()).toBe('saved')
    await shoot(page, 'workspace-saved')
    const api = await loginAs('planner')
    const stored = (await api.request(`/api/plans/${planId}`)).body
    expect(stored.waypoints).toHaveLength(split)
    expect(Math.max(...stored.waypoints.map((w: { lat: number }) => w.lat))).toBeLessThanOrEqual(LIMIT + 1e-9)
    expect(stored.totals.distanceNm).toBeCloseTo(await totalNm(page), 0)
  })

  it('keeps unsaved changes across a reload', async () => {
    const page = await browser.newPage(1600, 1000)
    await signIn(page, 'planner')
    await openPage(page, `/plans/${planId}`)
    await page.getByTestId('plan-workspace').waitFor()
    const name = page.getByTestId('waypoint-row').nth(1).locator('[data-cell="name"] input')
    await name.fill('Offing, renamed')
    await name.press('Enter')
    await expect.poll(() => page.getByTestId('save-state').textContent()).toBe('unsaved changes')
    await page.waitForTimeout(500)
    await page.reload()
    await page.getByTestId('restored-notice').waitFor()
    expect(await name.inputValue()).toBe('Offing, renamed')
    await shoot(page, 'workspace-restored')
    await page.getByTestId('restored-notice').getByRole('button', { name: 'Discard them' }).click()
    await expect.poll(() => page.getByTestId('save-state').textContent()).toBe('saved')
  })

  it('shows the draft read only to a shore user', async () => {
    const page = await browser.newPage(1600, 1000)
    await signIn(page, 'shore')
    await openPage(page, `/plans/${planId}`)
    await page.getByTestId('plan-workspace').waitFor()
    expect(await page.getByTestId('save').count()).toBe(0)
    await page.getByTestId('read-only-note').waitFor()
    expect(await page.getByTestId('split').count()).toBe(0)
    expect(await page.getByTestId('wp-position-0').locator('input').getAttribute('readonly')).not.toBeNull()
    await shoot(page, 'workspace-shore')
  })

  it('keeps the draft on a conflict, shows what changed, and overwrites deliberately', async () => {
    const page = await browser.newPage(1600, 1000)
    await signIn(page, 'planner')
    await openPage(page, `/plans/${planId}`)
    await page.getByTestId('plan-workspace').waitFor()
    const mine = await rows(page).count()

    // Someone else saves a shorter list meanwhile.
    const api = await loginAs('master')
    const theirs = (await api.request(`/api/plans/${planId}`)).body
    const changed = await api.request(`/api/plans/${planId}/waypoints`, { method: 'PUT', body: { version: theirs.plan.version, waypoints: [theirs.waypoints[0], theirs.waypoints.at(-1)] } })
    expect(changed.status).toBe(200)

    await page.getByTestId('add-waypoint').click()
    await expect.poll(() => rows(page).count()).toBe(mine + 1)
    await page.getByTestId('save').click()
    await page.getByTestId('conflict').waitFor()
    expect(await page.getByTestId('save-state').textContent()).toBe('conflict')
    const text = await page.getByTestId('conflict').textContent()
    expect(text).toContain(`version ${theirs.plan.version + 1}`)
    expect(text).toContain(`Waypoints: 2 on the server, ${mine + 1} in your draft.`)
    expect(await rows(page).count()).toBe(mine + 1)
    await shoot(page, 'workspace-conflict')

    await page.getByTestId('overwrite-mine').click()
    await expect.poll(() => page.getByTestId('save-state').textContent()).toBe('saved')
    expect((await api.request(`/api/plans/${planId}`)).body.waypoints).toHaveLength(mine + 1)
  })

  it('creates a plan from the header form, starting with the departure and arrival places', async () => {
    const page = await browser.newPage(1600, 1000)
    await signIn(page, 'planner')
    await openPage(page, '/plans/new')
    await page.getByTestId('new-plan-form').waitFor()
    await page.getByRole('button', { name: 'Create plan' }).click()
    await page.getByText('title needs at least 3 characters').waitFor()
    await page.getByLabel('Title').fill('Cape Town – Fremantle, trial')
    await page.getByLabel('Departure (UTC)').fill('2027-01-05 08:00')
    await page.getByLabel('Limiting latitude (optional)').fill('40°S')
    await page.getByLabel('Limiting latitude (optional)').blur()
    expect(await page.getByLabel('Limiting latitude (optional)').inputValue()).toBe('40°00.0′')
    await page.getByLabel('Departure place', { exact: true }).selectOption({ label: 'Cape Town (ZACPT)' })
    await page.getByLabel('Arrival place', { exact: true }).selectOption({ label: 'Fremantle (AUFRE)' })
    await shoot(page, 'workspace-new')
    await page.getByRole('button', { name: 'Create plan' }).click()
    await page.waitForURL(/\/plans\/\d+$/)
    await page.getByTestId('plan-workspace').waitFor()
    expect(await rows(page).count()).toBe(2)
    expect(await page.getByLabel('Title').inputValue()).toBe('Cape Town – Fremantle, trial')
    expect(await page.getByTestId('arrival-local').textContent()).toContain('Australia/Perth')

    // Hold 40°S on the new plan: the track bends to the parallel and every waypoint stays north of it.
    await page.getByTestId('apply-limit').click()
    await expect.poll(() => rows(page).count()).toBe(4)
    expect(Math.min(...(await latitudes(page)))).toBeGreaterThanOrEqual(-40 - 1e-9)
    await shoot(page, 'workspace-new-held')
  })

  it('reorders with the keyboard, inserts from the place library and checks the track against land', async () => {
    const page = await browser.newPage(1600, 1000)
    await signIn(page, 'planner')
    await openPage(page, `/plans/${planId}`)
    await page.getByTestId('plan-workspace').waitFor()
    const names = () => rows(page).locator('[data-cell="name"] input').evaluateAll(els => els.map(e => (e as HTMLInputElement).value))
    const start = await names()

    // Alt+↓ moves the row and keeps the cursor in it; Alt+↑ moves it back.
    const second = rows(page).nth(1).locator('[data-cell="name"] input')
    await second.focus()
    await page.keyboard.press('Alt+ArrowDown')
    await expect.poll(names).toEqual([start[0], start[2], start[1], ...start.slice(3)])
    expect(await page.evaluate(() => document.activeElement?.closest('[data-row]')?.getAttribute('data-row'))).toBe('2')
    await page.keyboard.press('Alt+ArrowUp')
    await expect.poll(names).toEqual(start)

    // Insert Seattle from the library after the selected (first) row, then undo it.
    await rows(page).nth(0).locator('[data-cell="name"] input').focus()
    await page.getByLabel('Insert a place from the library').selectOption({ label: 'Seattle (USSEA)' })
    await expect.poll(names).toEqual([start[0], 'Seattle', ...start.slice(1)])
    await page.getByTestId('undo').click()
    await expect.poll(names).toEqual(start)

    await page.getByTestId('run-land-check').click()
    const check = page.getByTestId('land-check')
    await check.getByText('Coastline data is coarse').waitFor()
    expect(await check.getByTestId('land-check-leg').count()).toBe(start.length - 1)
    await shoot(page, 'workspace-land-check')

    // A header change (speed) retimes the legs and is saved with the plan.
    const eta = await page.getByTestId('total-eta').textContent()
    await page.getByLabel('Speed (kn)', { exact: true }).fill('16')
    await page.getByLabel('Speed (kn)', { exact: true }).press('Enter')
    await expect.poll(() => page.getByTestId('total-eta').textContent()).not.toBe(eta)
    await page.getByTestId('save').click()
    await expect.poll(() => page.getByTestId('save-state').textContent()).toBe('saved')
    const api = await loginAs('planner')
    expect((await api.request(`/api/plans/${planId}`)).body.plan.speedKn).toBe(16)
  })
})
