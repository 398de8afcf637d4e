// Editing on the chart (issue 12 items 3 and 14): waypoints placed by clicking, a drag or a placing
// ashore answered by a notice with Undo, overlapping markers fanned apart, and the chart following
// waypoints typed outside its view. Each test makes its own plan. Positions are invented; which
// are ashore and which afloat is from memory of the Dutch coast (well inland, or miles offshore).
import { beforeAll, describe, expect, it } from 'vitest'
import type { Locator, Page } from 'playwright-core'
import { type Api, loginAs, startServer } from '../support/server'
import { expectStatus, makePlan } from '../support/records'
import { openPage, shoot, signIn, useBrowser } from '../support/browser'

await startServer()
const browser = useBrowser()
let planner: Api
beforeAll(async () => { planner = await loginAs('planner') })

const NORTH_SEA = [
  { name: 'Hook offing', lat: 52.0, lon: 3.9, method: 'rhumb' },
  { name: 'Hook offing bis', lat: 52.0005, lon: 3.9005, method: 'rhumb' },
  { name: 'Texel offing', lat: 53.3, lon: 4.2, method: 'rhumb' },
  { name: 'Broad Fourteens', lat: 52.9, lon: 3.3, method: 'rhumb' },
]
// Woerden, some 35 km inland of the coast (from memory); the North Sea west of the Hook, 30 nm off.
const ASHORE = { lat: 52.09, lon: 4.88 }
const AFLOAT = { lat: 52.6, lon: 3.0 }

const merc = (lat: number) => Math.log(Math.tan(Math.PI / 4 + (lat * Math.PI) / 360))
async function centre(marker: Locator) {
  const b = (await marker.boundingBox())!
  return { x: b.x + b.width / 2, y: b.y + b.height / 2 }
}
/** Screen position of a lat/lon on a Web Mercator map, calibrated on two markers that sit on their waypoints. */
async function projector(chart: Locator, a: number, b: number) {
  const [pa, pb] = [await centre(chart.locator(`.pw-waypoint-marker[data-index="${a}"]`)), await centre(chart.locator(`.pw-waypoint-marker[data-index="${b}"]`))]
  const [wa, wb] = [NORTH_SEA[a]!, NORTH_SEA[b]!]
  const sx = (pb.x - pa.x) / (wb.lon - wa.lon), sy = (pb.y - pa.y) / (merc(wb.lat) - merc(wa.lat))
  return (p: { lat: number, lon: number }) => ({ x: pa.x + sx * (p.lon - wa.lon), y: pa.y + sy * (merc(p.lat) - merc(wa.lat)) })
}
const rows = (page: Page) => page.getByTestId('waypoint-row')

describe('editing on the chart', () => {
  it('fans overlapping markers, places waypoints by clicking, and offers Undo when one lands ashore', async () => {
    const id = await makePlan('draft', { planner }, { waypoints: NORTH_SEA, title: `Chart editing ${process.pid}` })
    const page = await browser.newPage(1440, 1000)
    await signIn(page, 'planner')
    await openPage(page, `/plans/${id}`)
    const chart = page.getByTestId('plan-chart')
    await chart.locator('path.pw-track').waitFor()
    // Zoom out one step so the land behind the coast is in view.
    const zoom = Number(await chart.getAttribute('data-zoom'))
    await chart.locator('.leaflet-control-zoom-out').click()
    await expect.poll(async () => Number(await chart.getAttribute('data-zoom'))).toBe(zoom - 1)

    // Two waypoints 0.05 nm apart: both markers fanned, far enough apart to tell and take hold of.
    const [m0, m1] = [chart.locator('.pw-waypoint-marker[data-index="0"]'), chart.locator('.pw-waypoint-marker[data-index="1"]')]
    await expect.poll(() => m1.getAttribute('data-fanned')).toBe('')
    expect(await m0.getAttribute('data-fanned')).toBe('')
    const [c0, c1] = [await centre(m0), await centre(m1)]
    expect(Math.hypot(c0.x - c1.x, c0.y - c1.y)).toBeGreaterThanOrEqual(20)
    expect(await chart.locator('.pw-waypoint-marker[data-index="2"]').getAttribute('data-fanned')).toBeNull()

    const at = await projector(chart, 2, 3)
    const box = (await chart.boundingBox())!
    const ashore = at(ASHORE)
    expect(ashore.x).toBeLessThan(box.x + box.width - 10)

    // Placing mode: a click on the chart adds a waypoint there, after the last one.
    await page.getByTestId('chart-place-mode').click()
    expect(await page.getByTestId('chart-place-mode').getAttribute('aria-pressed')).toBe('true')
    const sea = at(AFLOAT)
    await page.mouse.click(sea.x, sea.y)
    await expect.poll(() => rows(page).count()).toBe(5)
    expect(Number(await rows(page).nth(4).getAttribute('data-lat'))).toBeCloseTo(AFLOAT.lat, 1)
    expect(Number(await rows(page).nth(4).getAttribute('data-lon'))).toBeCloseTo(AFLOAT.lon, 1)
    expect(await page.getByTestId('chart-notice').count()).toBe(0)

    // A click ashore places it too, and says so with the way back.
    await page.mouse.click(ashore.x, ashore.y)
    await expect.poll(() => rows(page).count()).toBe(6)
    const notice = page.getByTestId('chart-notice')
    await notice.waitFor()
    expect(await notice.getAttribute('data-tone')).toBe('warn')
    expect(await notice.textContent()).toMatch(/Waypoint 6 was placed ashore/)
    await shoot(page, 'chart-placed-ashore')
    await notice.getByTestId('chart-notice-undo').click()
    await expect.poll(() => rows(page).count()).toBe(5)
    expect(await notice.count()).toBe(0)
    await page.keyboard.press('Escape')
    expect(await page.getByTestId('chart-place-mode').getAttribute('aria-pressed')).toBe('false')

    // Dragging Texel offing onto land: the notice names it and Undo puts it back.
    const texel = await centre(chart.locator('.pw-waypoint-marker[data-index="2"]'))
    await page.mouse.move(texel.x, texel.y)
    await page.mouse.down()
    for (let k = 1; k <= 12; k++) await page.mouse.move(texel.x + ((ashore.x - texel.x) * k) / 12, texel.y + ((ashore.y - texel.y) * k) / 12)
    await page.mouse.up()
    await notice.waitFor()
    expect(await notice.textContent()).toMatch(/Waypoint 3 Texel offing is now ashore on the coarse coastline \(moved [\d.,]+ nm\)/)
    expect(Number(await rows(page).nth(2).getAttribute('data-lat'))).toBeCloseTo(ASHORE.lat, 1)
    await shoot(page, 'chart-dragged-ashore')
    await notice.getByTestId('chart-notice-undo').click()
    await expect.poll(async () => Number(await rows(page).nth(2).getAttribute('data-lat'))).toBe(53.3)
    expect(Number(await rows(page).nth(2).getAttribute('data-lon'))).toBe(4.2)
  })

  it('follows a waypoint typed outside the view', async () => {
    const id = await makePlan('draft', { planner }, { waypoints: NORTH_SEA.slice(2), title: `Chart follows ${process.pid}` })
    const page = await browser.newPage(1440, 1000)
    await signIn(page, 'planner')
    await openPage(page, `/plans/${id}`)
    const chart = page.getByTestId('plan-chart')
    await chart.locator('.pw-waypoint-marker[data-index="1"]').waitFor()
    // The chart shows the two North Sea waypoints: the one typed next lies far outside the view.
    await page.getByTestId('add-waypoint').click()
    const pos = page.getByTestId('wp-position-2').locator('input')
    // Off Ambrose, New York: some 3,000 nm from the first waypoint.
    await pos.fill('40 27.0N 073 49.0W')
    await pos.press('Enter')
    const inside = async (i: number) => {
      const [b, c] = [await chart.locator(`.pw-waypoint-marker[data-index="${i}"]`).boundingBox(), (await chart.boundingBox())!]
      return !!b && b.x >= c.x && b.x + b.width <= c.x + c.width && b.y >= c.y && b.y + b.height <= c.y + c.height
    }
    await expect.poll(() => inside(2), { timeout: 10_000 }).toBe(true)
    expect(await inside(0)).toBe(true)
    await shoot(page, 'chart-follows-typed')
    const v = await expectStatus(planner.request(`/api/plans/${id}`), 200)
    expect(v.waypoints).toHaveLength(2)
  })
})
