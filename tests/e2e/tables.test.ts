// A shore user builds a distance table big enough to go to the background job, watches the
// progress bar move, and exports the CSV. The demo data has ~20 places, so the test adds 120
// generated ocean positions straight into the test database (removed again afterwards).
import { readFile } from 'node:fs/promises'
import pg from 'pg'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { startServer } from '../support/server'
import { openPage, shoot, signIn, useBrowser } from '../support/browser'

await startServer()
const browser = useBrowser()
const EXTRA = 120
const prefix = `Bench ${Date.now().toString(36)}`

describe('distance tables page', () => {
  const db = new pg.Client({ connectionString: process.env.NUXT_DATABASE_URL })

  beforeAll(async () => {
    await db.connect()
    const { rows } = await db.query(`select id from companies where name = 'Kestrel Bight Shipping'`)
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
    expect(csv).toContain('direct — not a sailing route')
  })
})
