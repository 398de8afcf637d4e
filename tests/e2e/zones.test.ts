// Zones in the browser: the zone list and a refused upload with its lines, a plan through the
// Channel with its ECA distance, zone flags and fuel by grade, the chart's zone layer and the print.
import { writeFileSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { join } from 'node:path'
import { beforeAll, describe, expect, it } from 'vitest'
import { loginAs, startServer } from '../support/server'
import { openPage, shoot, signIn, useBrowser } from '../support/browser'
import { demoPlans } from '../../db/seeds/demoData'

await startServer()
const browser = useBrowser()
let planId = 0

beforeAll(async () => {
  // A plan of this file's own: the demo Rotterdam → New York waypoints on a new draft.
  const planner = await loginAs('planner')
  const vessels = (await planner.request('/api/vessels')).body
  const demo = demoPlans.find(p => p.title.startsWith('Rotterdam'))!
  const created = await planner.request('/api/plans', { method: 'POST', body: { vesselId: vessels.find((v: any) => v.name === 'Kestrel Dawn').id, title: 'Zones e2e Rotterdam – New York', departureUtc: '2027-02-01T06:00:00Z', speedKn: 14 } })
  planId = created.body.id
  const waypoints = demo.waypoints.map(([name, lat, lon, method]) => ({ name, lat, lon, method }))
  expect((await planner.request(`/api/plans/${planId}/waypoints`, { method: 'PUT', body: { version: 1, waypoints } })).status).toBe(200)
})

describe('zones page', () => {
  it('shore sees the seeded ECAs, and a file with an open ring is refused with its line; a good file is stored', async () => {
    const page = await browser.newPage(1440, 1000)
    await signIn(page, 'shore')
    await openPage(page, '/zones')
    const table = page.getByTestId('zones-table')
    await expect.poll(() => table.textContent()).toMatch(/North Sea ECA .*approximate/)
    expect(await table.textContent()).toMatch(/Mediterranean Sea ECA/)
    await page.getByTestId('zone-upload-open').click()
    const bad = join(tmpdir(), 'zones-e2e-open-ring.geojson')
    writeFileSync(bad, JSON.stringify({ type: 'Feature', properties: {}, geometry: { type: 'Polygon', coordinates: [[[-20, 40], [-19, 40], [-19, 41], [-20, 41]]] } }, null, 2))
    await page.getByTestId('zone-file').setInputFiles(bad)
    await page.getByTestId('zone-name').fill('Zones e2e exercise area')
    await page.getByTestId('zone-upload-submit').click()
    const problems = page.getByTestId('zone-upload-problems')
    await problems.waitFor()
    expect(await problems.textContent()).toMatch(/Line 2\d: polygon 1, outer ring is not closed/)
    await shoot(page, 'zones-upload-refused-1440')
    await page.setViewportSize({ width: 390, height: 900 })
    await shoot(page, 'zones-upload-refused-390')
    await page.setViewportSize({ width: 1440, height: 1000 })
    const good = join(tmpdir(), 'zones-e2e-box.geojson')
    writeFileSync(good, JSON.stringify({ type: 'Feature', properties: {}, geometry: { type: 'Polygon', coordinates: [[[-20, 40], [-19, 40], [-19, 41], [-20, 41], [-20, 40]]] } }))
    await page.getByTestId('zone-file').setInputFiles(good)
    await page.getByTestId('zone-upload-submit').click()
    await expect.poll(() => table.textContent()).toMatch(/Zones e2e exercise area/)
    const shore = await loginAs('shore')
    const mine = (await shore.request('/api/zones')).body.find((z: any) => z.name === 'Zones e2e exercise area')
    expect(mine).toMatchObject({ kind: 'no-go', vertexCount: 5 })
    await shore.request(`/api/zones/${mine.id}`, { method: 'DELETE' })
  })

  it('is read-only for a planner', async () => {
    const page = await browser.newPage(390, 900)
    await signIn(page, 'planner')
    await openPage(page, '/zones')
    await page.getByTestId('zones-table').waitFor()
    expect(await page.getByTestId('zone-upload-open').count()).toBe(0)
    expect(await page.getByRole('button', { name: /Delete/ }).count()).toBe(0)
    await shoot(page, 'zones-list-planner-390')
  })
})

describe('a plan through the Channel', () => {
  it('shows ECA distance per leg, the zones on the passage and fuel by grade, live in the workspace', async () => {
    const page = await browser.newPage(1440, 1000)
    await signIn(page, 'planner')
    await openPage(page, `/plans/${planId}`)
    await page.getByTestId('leg-table').waitFor()
    expect(await page.getByTestId('leg-0').getByTestId('zone-chip-eca').textContent()).toMatch(/ECA \d/)
    expect(await page.getByTestId('leg-3').getByTestId('leg-zones').textContent()).toBe('—')
    const summary = page.getByTestId('zone-summary')
    expect(await summary.textContent()).toMatch(/North Sea ECA \(incl\. English Channel\)Emission control area[\d.,]+1, 2, 3North American ECAEmission control area/)
    const grades = page.getByTestId('fuel-by-grade')
    expect(await grades.textContent()).toMatch(/VLSFO.*outside ECAs.*MGO.*in ECAs/)
    expect(await page.getByTestId('fuel-cost-total').textContent()).toMatch(/USD \d/)
    // The chart draws the zones and the key turns them off.
    await expect.poll(() => page.locator('path.pw-zone--eca').count()).toBeGreaterThan(0)
    await page.waitForLoadState('networkidle')
    await shoot(page, 'zones-plan-channel-1440')
    await page.getByTestId('toggle-zones').uncheck()
    await expect.poll(() => page.locator('path.pw-zone').count()).toBe(0)
    await page.getByTestId('toggle-zones').check()
    await page.setViewportSize({ width: 390, height: 900 })
    await shoot(page, 'zones-plan-channel-390')
  })

  it('prints the zones and the fuel by grade', async () => {
    const page = await browser.newPage(688, 1000)
    await signIn(page, 'planner')
    await openPage(page, `/plans/${planId}/print`)
    const zones = page.getByTestId('print-zones')
    await zones.waitFor()
    expect(await zones.textContent()).toMatch(/North Sea ECA.*Emission control area.*1, 2, 3/)
    expect(await page.getByTestId('print-fuel-grades').textContent()).toMatch(/MGO \(inside ECAs\)/)
    await page.emulateMedia({ media: 'print' })
    await shoot(page, 'zones-print')
  })
})
