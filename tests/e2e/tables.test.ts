// A shore user builds a distance table big enough to go to the background job, watches the
// progress bar move, and exports the CSV. The demo data has ~20 places, so the test adds 10
// generated ocean positions straight into the test database (removed again afterwards). Then the
// six-port table of the sea-routes issue, built through the form, loaded directly at 1440 and 390 px.
import { readFile } from 'node:fs/promises'
import pg from 'pg'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { startServer } from '../support/server'
import { openPage, shoot, signIn, useBrowser } from '../support/browser'

await startServer()
const browser = useBrowser()
const EXTRA = 10
const prefix = `Bench ${Date.now().toString(36)}`

describe('distance tables page', () => {
  const db = new pg.Client({ connectionString: process.env.NUXT_DATABASE_URL })

  beforeAll(async () => {
    await db.connect()
    const { rows } = await db.query(`select id from companies where name = 'Kestrel Bight Shipping'`)
    // Santos and Durban are not demo places: harbour entrances from memory.
    for (const [name, lat, lon] of [['Santos', -23.99, -46.3], ['Durban', -29.87, 31.05]] as const) {
      await db.query(`insert into places (company_id, name, kind, lat, lon) values ($1, $2, 'port', $3, $4)`, [rows[0].id, `${prefix} ${name}`, lat, lon])
    }
    for (let i = 0; i < EXTRA; i++) {
      // A grid over the open oceans; the land flags do not matter here, only the table's size.
      const lat = -50 + (i % 12) * 9, lon = -170 + Math.floor(i / 12) * 34 + (i % 3)
      await db.query(`insert into places (company_id, name, kind, lat, lon) values ($1, $2, 'ocean_position', $3, $4)`,
        [rows[0].id, `${prefix} ${String(i + 1).padStart(3, '0')}`, lat, lon])
    }
  })
  afterAll(async () => {
    await db.query('delete from places where name like $1', [`${prefix}%`])
    await db.end()
  })

  it('builds a large table with a progress bar, shows the flags and exports CSV', async () => {
    const page = await browser.newPage()
    await signIn(page, 'shore')
    await openPage(page, '/tables')
    await page.getByPlaceholder('e.g. Indian Ocean ports').fill('Oceans and ports')
    await page.getByRole('button', { name: 'Select all' }).click()
    expect(await page.getByTestId('place-picker').locator('input:checked').count()).toBeGreaterThan(EXTRA)
    await page.getByRole('button', { name: 'Build table' }).click()
    await page.waitForURL(/\/tables\?id=\d+/)

    const bar = page.getByRole('progressbar', { name: 'Table build progress' }).last()
    await bar.waitFor()
    const seen = new Set<number>()
    for (let t = 0; t < 240 && await bar.isVisible(); t++) {
      const now = Number(await bar.getAttribute('aria-valuenow').catch(() => null))
      if (Number.isFinite(now) && !seen.has(now) && seen.size === 1) await shoot(page, 'tables-building')
      if (Number.isFinite(now)) seen.add(now)
      await page.waitForTimeout(500)
    }
    expect(seen.size).toBeGreaterThanOrEqual(2) // the bar moved while the job ran

    const matrix = page.getByTestId('distance-matrix')
    await matrix.waitFor({ timeout: 120_000 })
    await page.getByRole('list', { name: 'Legend' }).waitFor()
    expect(await matrix.locator('thead th').count()).toBeGreaterThan(EXTRA)
    await shoot(page, 'tables')

    const [download] = await Promise.all([page.waitForEvent('download'), page.getByRole('link', { name: 'Export CSV' }).click()])
    const csv = await readFile((await download.path())!, 'utf8')
    const lines = csv.split('\r\n')
    expect(lines[0]).toMatch(/^Distance \(nm\),/)
    expect(lines[0]).toContain(`${prefix} 001`)
    expect(lines[1]).toMatch(/,\d+\.\d(,|$)/)
    expect(lines).toContain('S,computed sea route')
    expect(lines.some(l => l.startsWith('Inside ECAs (nm),'))).toBe(true)
  })

  it('shows the six-port table by sea, marks and passages in each cell, the ECA distance on request, and fits a 390 px screen', async () => {
    const page = await browser.newPage()
    await signIn(page, 'shore')
    await openPage(page, '/tables')
    await page.getByPlaceholder('e.g. Indian Ocean ports').fill(`Six ports ${prefix}`)
    for (const name of ['Rotterdam', 'New York', 'Singapore', 'Yokohama', `${prefix} Santos`, `${prefix} Durban`]) {
      await page.getByLabel('Search places').fill(name)
      await page.getByTestId('place-picker').getByText(name, { exact: true }).click()
    }
    expect(await page.getByText('(6 chosen)').count()).toBe(1)
    await page.getByRole('button', { name: 'Build table' }).click()
    await page.waitForURL(/\/tables\?id=\d+/)
    const matrix = page.getByTestId('distance-matrix')
    await matrix.waitFor()
    // 15 pairs, each shown twice (both halves of the square): all by sea, none direct or across land.
    expect(await matrix.locator('td[data-kind="sea"]').count()).toBe(30)
    expect(await matrix.locator('td[data-kind="direct"], td[data-kind="land"]').count()).toBe(0)
    // Columns by name: the two added ports (prefix "Bench …") first, then New York, Rotterdam, Singapore, Yokohama.
    const cell = matrix.locator('tbody tr').filter({ has: page.locator('th', { hasText: /^Rotterdam$/ }) }).locator('td').nth(4)
    expect(await cell.locator('span[title]').first().getAttribute('title')).toMatch(/^Computed sea route via .*Suez Canal/)
    await shoot(page, 'tables-six-ports-1440')
    await page.getByTestId('show-eca').check()
    expect(await matrix.getByTestId('eca-nm').count()).toBe(30)
    await shoot(page, 'tables-six-ports-eca-1440')
    const address = page.url()

    // Loaded directly (server-rendered) on a 390 px screen: the page never scrolls sideways; the matrix scrolls inside its box.
    const phone = await browser.newPage(390, 844)
    await signIn(phone, 'shore')
    const res = await openPage(phone, new URL(address).pathname + new URL(address).search)
    expect(res?.status()).toBe(200)
    const box = phone.getByTestId('distance-matrix-box')
    await box.waitFor()
    const widths = await phone.evaluate(() => ({
      page: document.documentElement.scrollWidth, view: window.innerWidth,
      wide: [...document.querySelectorAll('body *')].filter(el => el.getBoundingClientRect().right > window.innerWidth + 0.5).slice(0, 5).map(el => `${el.tagName}.${el.className}`),
    }))
    expect(widths.page, widths.wide.join(' | ')).toBeLessThanOrEqual(widths.view)
    expect(await box.evaluate(el => el.scrollWidth > el.clientWidth)).toBe(true)
    await shoot(phone, 'tables-six-ports-390')
  })
})
