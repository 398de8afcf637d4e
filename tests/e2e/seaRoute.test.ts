// The workspace's sea-route panel on a Rotterdam → Singapore draft of this file's own.
import { beforeAll, describe, expect, it } from 'vitest'
import type { Page } from 'playwright-core'
import { loginAs, startServer } from '../support/server'
import { makePlan } from '../support/records'
import { openPage, shoot, signIn, useBrowser } from '../support/browser'

await startServer()
const browser = useBrowser()
let planId = 0

// Rotterdam (Maas entrance) and Singapore (Strait), public port positions as in the demo places.
const ENDS = [
  { name: 'Rotterdam', lat: 51.95, lon: 4.14, method: 'rhumb' },
  { name: 'Singapore', lat: 1.264, lon: 103.84, method: 'geodesic' },
]
// NGA Pub. 151 "Distances Between Ports": Rotterdam – Singapore via Suez about 8,290 nm (from memory);
// the router's own test holds published pairs within 4 %.
const PUBLISHED_NM = 8290

beforeAll(async () => {
  const planner = await loginAs('planner')
  planId = await makePlan('draft', { planner }, { title: `Rotterdam – Singapore by sea ${process.pid}`, waypoints: ENDS })
})

const rows = (page: Page) => page.getByTestId('waypoint-row')
const totalNm = async (page: Page) => Number((await page.getByTestId('total-distance').textContent())!.replace(/[^\d.]/g, ''))

describe('sea-route panel', () => {
  it('previews a Rotterdam → Singapore route through Suez, accepts it as one step and undoes it', async () => {
    const page = await browser.newPage(1440, 1000)
    await signIn(page, 'planner')
    await openPage(page, `/plans/${planId}`)
    const panel = page.getByTestId('sea-route')
    await panel.waitFor()
    expect(await rows(page).count()).toBe(2)
    const geodesicTotal = await totalNm(page)

    await panel.getByTestId('sea-route-suggest').click()
    await panel.getByTestId('sea-route-result').waitFor({ timeout: 30_000 })
    expect(await panel.getByTestId('sea-route-via').textContent()).toContain('Suez Canal')
    const suggested = Number((await panel.getByTestId('sea-route-distance').textContent())!.replace(/[^\d.]/g, ''))
    expect(Math.abs(suggested - PUBLISHED_NM) / PUBLISHED_NM).toBeLessThan(0.04)
    // Previewed on the chart, not yet in the plan.
    await page.locator('path.pw-route-preview').waitFor()
    expect(await rows(page).count()).toBe(2)
    expect(await totalNm(page)).toBe(geodesicTotal)
    // The tiles of the fitted view painted before the screenshot.
    await page.waitForFunction(() => [...document.querySelectorAll<HTMLImageElement>('img.leaflet-tile')].every(i => i.complete))
    await shoot(page, 'sea-route-preview-1440')

    await panel.getByTestId('sea-route-accept').click()
    await expect.poll(() => rows(page).count()).toBeGreaterThan(10)
    expect(await page.locator('path.pw-route-preview').count()).toBe(0)
    const accepted = await totalNm(page)
    expect(Math.abs(accepted - PUBLISHED_NM) / PUBLISHED_NM).toBeLessThan(0.04)
    expect(await page.getByTestId('waypoint-row').first().getAttribute('data-lat')).toBe(String(ENDS[0]!.lat))
    expect(await page.getByTestId('save-state').textContent()).toBe('unsaved changes')
    await shoot(page, 'sea-route-accepted-1440')

    // The land check takes the accepted route's canal legs as through the Suez Canal, not as land.
    await page.getByTestId('run-land-check').click()
    const check = page.getByTestId('land-check')
    await check.getByTestId('land-check-summary').waitFor()
    await expect.poll(() => check.getByTestId('land-check-passage').count()).toBeGreaterThan(3)
    expect(await check.getByTestId('land-check-passage').first().textContent()).toBe('through Suez Canal')
    await check.scrollIntoViewIfNeeded()
    await shoot(page, 'sea-route-land-check-1440')

    // One undo gives back the two waypoints as they were.
    await page.getByTestId('undo').click()
    await expect.poll(() => rows(page).count()).toBe(2)
    expect(await totalNm(page)).toBe(geodesicTotal)
    await page.context().close()
  })

  it('fits a phone: the panel and its preview at 390 px', async () => {
    const page = await browser.newPage(390, 844)
    await signIn(page, 'planner')
    await openPage(page, `/plans/${planId}`)
    const panel = page.getByTestId('sea-route')
    await panel.getByTestId('sea-route-least-eca').check()
    await panel.getByTestId('sea-route-suggest').click()
    await panel.getByTestId('sea-route-result').waitFor({ timeout: 30_000 })
    // The comparison table of the minimum-ECA route against the shortest.
    await panel.locator('table[data-testid="sea-route-eca"]').waitFor()
    const width = await page.evaluate(() => document.documentElement.scrollWidth)
    expect(width).toBeLessThanOrEqual(390)
    await panel.scrollIntoViewIfNeeded()
    await shoot(page, 'sea-route-preview-390')
    await page.context().close()
  })
})
