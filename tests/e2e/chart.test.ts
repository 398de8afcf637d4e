import { beforeAll, describe, expect, it } from 'vitest'
import type { Page } from 'playwright-core'
import { demoPlans } from '../../db/seeds/demoData'
import { loginAs, startServer } from '../support/server'
import { screenshotDir, openPage, shoot, signIn, useBrowser } from '../support/browser'

await startServer()
const browser = useBrowser()
const PACIFIC = 'Yokohama – Juan de Fuca, North Pacific crossing'
let planId = 0

// Start from the seeded waypoints and header, whatever another test file saved into this draft.
beforeAll(async () => {
  const api = await loginAs('planner')
  planId = ((await api.request('/api/plans')).body as { id: number, title: string }[]).find(p => p.title === PACIFIC)!.id
  const { plan } = (await api.request(`/api/plans/${planId}`)).body
  const seed = demoPlans.find(p => p.title === PACIFIC)!
  const waypoints = seed.waypoints.map(([name, lat, lon, method]) => ({ name, lat, lon, method }))
  expect((await api.request(`/api/plans/${planId}/waypoints`, { method: 'PUT', body: { version: plan.version, waypoints } })).status).toBe(200)
  const header = { version: plan.version + 1, title: PACIFIC, departureUtc: seed.departureUtc, speedKn: seed.speedKn, limitLat: seed.limitLat, departurePlaceId: plan.departurePlaceId, arrivalPlaceId: plan.arrivalPlaceId }
  expect((await api.request(`/api/plans/${planId}`, { method: 'PUT', body: header })).status).toBe(200)
})

/** x coordinates of every vertex of an SVG path's `d` ("M x y L x y …"), with the number of subpaths. */
async function pathPoints(page: Page, selector: string) {
  const d = await page.locator(selector).first().getAttribute('d') ?? ''
  const xs = [...d.matchAll(/[ML]\s*(-?[\d.]+)[ ,](-?[\d.]+)/g)].map(m => Number(m[1]))
  return { xs, subpaths: (d.match(/M/g) ?? []).length }
}

/** The map's own zoom (it snaps to halves), which the SVG path coordinates are drawn at. */
async function chartZoom(page: Page) {
  return Number(await page.getByTestId('plan-chart').getAttribute('data-zoom'))
}

describe('plan chart', () => {
  it('draws the North Pacific crossing across 180° as one track, and a dragged waypoint updates the sheet and legs', async () => {
    const page = await browser.newPage(1600, 1000)
    await signIn(page, 'planner')
    await openPage(page, `/plans/${planId}`)
    const chart = page.getByTestId('plan-chart')
    await chart.locator('path.pw-track').waitFor()
    await expect.poll(() => chart.locator('img.leaflet-tile-loaded').count(), { timeout: 60_000 }).toBeGreaterThan(3)

    // One continuous path: no step between consecutive points longer than half the world's width in pixels.
    const worldPx = 256 * 2 ** await chartZoom(page)
    const { xs, subpaths } = await pathPoints(page, '[data-testid="plan-chart"] path.pw-track')
    expect(subpaths).toBe(1)
    expect(xs.length).toBeGreaterThan(10)
    for (let i = 1; i < xs.length; i++) expect(Math.abs(xs[i]! - xs[i - 1]!)).toBeLessThan(worldPx / 2)
    // Eastward across the Pacific: the x coordinates grow from Yokohama to Juan de Fuca.
    expect(xs.at(-1)! - xs[0]!).toBeGreaterThan(worldPx / 4)

    // The overlays of the geodesic leg: rhumb alternative, vertex (latitude in its title), limit parallel.
    expect(await chart.locator('path.pw-rhumb-alternative').count()).toBe(1)
    expect(await chart.locator('path.pw-limit-parallel').count()).toBe(1)
    expect(await chart.locator('.pw-vertex-marker').getAttribute('title')).toMatch(/^Vertex of leg 2: \d+°[\d.]+[′']N$/)
    expect(await chart.locator('.pw-waypoint-marker').count()).toBe(4)

    // A cross-track limit typed in the sheet draws the corridor of that leg.
    const xte = page.locator('[data-testid="waypoint-row"][data-row="2"] [data-cell="xte"] input')
    await xte.fill('30')
    await xte.press('Enter')
    await chart.locator('path.pw-corridor').waitFor()
    await page.getByTestId('toggle-great-ellipse').check()
    await chart.locator('path.pw-great-ellipse').waitFor()

    // Drag waypoint 3 (Juan de Fuca Strait entrance, drawn at 235.2° E) south-west.
    const row = page.locator('[data-testid="waypoint-row"][data-row="2"]')
    const before = { lat: Number(await row.getAttribute('data-lat')), lon: Number(await row.getAttribute('data-lon')) }
    const legDistance = page.locator('[data-testid="leg-1"] [data-testid="leg-distance"]')
    const distanceBefore = await legDistance.textContent()
    // At the whole-ocean zoom the Port Angeles marker overlaps it: take hold on the side away from it.
    const centre = async (i: number) => {
      const b = (await chart.locator(`.pw-waypoint-marker[data-index="${i}"]`).boundingBox())!
      return { x: b.x + b.width / 2, y: b.y + b.height / 2 }
    }
    const c2 = await centre(2), c3 = await centre(3)
    const away = Math.hypot(c2.x - c3.x, c2.y - c3.y) || 1
    const x = c2.x + (c2.x - c3.x) / away * 8, y = c2.y + (c2.y - c3.y) / away * 8
    await page.mouse.move(x, y)
    await page.mouse.down()
    for (let k = 1; k <= 10; k++) await page.mouse.move(x - 6 * k, y + 5 * k)
    // The sheet follows during the drag, not only on release.
    await expect.poll(async () => Number(await row.getAttribute('data-lat')), { timeout: 10_000 }).toBeLessThan(before.lat - 0.1)
    await page.mouse.up()
    await expect.poll(() => legDistance.textContent(), { timeout: 10_000 }).not.toBe(distanceBefore)
    const after = { lat: Number(await row.getAttribute('data-lat')), lon: Number(await row.getAttribute('data-lon')) }
    expect(after.lat).toBeLessThan(before.lat)
    // Stored in −180..180 although the marker sits east of 180°: moved west, so more negative.
    expect(after.lon).toBeGreaterThan(-180)
    expect(after.lon).toBeLessThan(before.lon)
    // Still one continuous track after the drag.
    const moved = await pathPoints(page, '[data-testid="plan-chart"] path.pw-track')
    expect(moved.subpaths).toBe(1)
    for (let i = 1; i < moved.xs.length; i++) expect(Math.abs(moved.xs[i]! - moved.xs[i - 1]!)).toBeLessThan(worldPx / 2)
    await page.mouse.move(10, 10)
    await page.waitForTimeout(300)
    await shoot(page, 'chart-pacific')
    await chart.screenshot({ path: `${screenshotDir}/chart-pacific-map.png` })
  })

  it('keeps the drawn track under the limiting parallel once the limit is applied', async () => {
    const page = await browser.newPage(1600, 1000)
    await signIn(page, 'planner')
    await openPage(page, `/plans/${planId}`)
    const chart = page.getByTestId('plan-chart')
    await chart.locator('path.pw-track').waitFor()
    // SVG y grows southwards: the track's northernmost point has the smallest y.
    const ys = async (selector: string) => {
      const d = await chart.locator(selector).getAttribute('d') ?? ''
      return [...d.matchAll(/[ML]\s*(-?[\d.]+)[ ,](-?[\d.]+)/g)].map(m => Number(m[2]))
    }
    const limitY = async () => Math.min(...await ys('path.pw-limit-parallel'))
    expect(Math.min(...await ys('path.pw-track'))).toBeLessThan(await limitY() - 5)
    expect(await chart.locator('.pw-vertex-marker').getAttribute('title')).toMatch(/5\d°/)

    await page.getByTestId('apply-limit').click()
    await expect.poll(async () => Math.min(...await ys('path.pw-track')), { timeout: 10_000 }).toBeGreaterThanOrEqual(await limitY() - 1)
    // Any vertex left lies on or under 48°45'N.
    for (const title of await chart.locator('.pw-vertex-marker').evaluateAll(els => els.map(e => e.getAttribute('title') ?? ''))) {
      const [, deg, min] = /(\d+)°([\d.]+)/.exec(title)!
      expect(Number(deg) + Number(min) / 60).toBeLessThanOrEqual(48.75 + 0.05)
    }
    await shoot(page, 'chart-pacific-limit')
    await chart.screenshot({ path: `${screenshotDir}/chart-pacific-limit-map.png` })
  })
})
