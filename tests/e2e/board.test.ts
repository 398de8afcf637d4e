import { describe, expect, it } from 'vitest'
import { startServer } from '../support/server'
import { openPage, shoot, signIn, useBrowser } from '../support/browser'

await startServer()
const browser = useBrowser()

describe('passage board', () => {
  it('a planner signs in, sees the demo plans with their states, and signs out', async () => {
    const page = await browser.newPage()
    await openPage(page, '/')
    await page.waitForURL(/\/login/)
    await signIn(page, 'planner')
    const board = page.getByTestId('plan-board')
    for (const title of ['Yokohama – Juan de Fuca, North Pacific crossing', 'Cape of Good Hope – Fremantle, held at 40°S', 'Rotterdam – New York, North Atlantic'])
      await board.getByText(title).waitFor()
    for (const status of ['draft', 'submitted', 'approved', 'returned'])
      expect(await board.locator(`[data-status="${status}"]`).count()).toBeGreaterThan(0)
    expect(await board.getByText('Auckland – Honolulu').count()).toBe(0)
    expect(await page.getByTestId('signed-in-user').textContent()).toContain('planner')
    await shoot(page, 'board-planner')

    // Other test files approve plans of their own, so count only what the filter must guarantee.
    await page.getByLabel('Filter by status').selectOption('approved')
    await expect.poll(() => board.locator('tbody tr [data-status]:not([data-status="approved"])').count()).toBe(0)
    await board.getByText('Cape of Good Hope – Fremantle, held at 40°S').waitFor()

    await page.getByRole('button', { name: 'Sign out' }).click()
    await page.waitForURL(/\/login/)
    await openPage(page, '/')
    await page.waitForURL(/\/login/)
  })

  it('on a phone (390 px) the board never scrolls sideways and each row shows departure, distance and ETA', async () => {
    const page = await browser.newPage(390, 844)
    await signIn(page, 'planner')
    await openPage(page, '/')
    const row = page.getByTestId('board-row').filter({ hasText: 'Rotterdam – New York, North Atlantic' })
    await row.waitFor()
    const widths = await page.evaluate(() => ({ scroll: document.documentElement.scrollWidth, viewport: window.innerWidth }))
    expect(widths.scroll).toBeLessThanOrEqual(widths.viewport)
    // The demo plan departs 2026-12-03 14:00 UTC (db/seeds/demoData.ts); its distance and ETA are worked out by the server.
    for (const label of ['Departure UTC', 'Distance nm', 'ETA UTC']) {
      const cell = row.locator('td', { hasText: label })
      await cell.waitFor()
      const box = (await cell.boundingBox())!
      expect(box.x).toBeGreaterThanOrEqual(0)
      expect(box.x + box.width).toBeLessThanOrEqual(widths.viewport)
    }
    expect(await row.locator('td', { hasText: 'Departure UTC' }).textContent()).toContain('2026-12-03')
    expect(await row.locator('td', { hasText: 'Distance nm' }).textContent()).toMatch(/\d[\d,]*\.\d/)
    await shoot(page, 'board-390')
  })

  it('pages, sorts and filters on the server, keeping the state in the address', async () => {
    const page = await browser.newPage()
    await signIn(page, 'planner')
    await openPage(page, '/?q=Rotterdam')
    const board = page.getByTestId('plan-board')
    await board.getByText('Rotterdam – New York, North Atlantic').waitFor()
    expect(await board.getByText('Yokohama – Juan de Fuca, North Pacific crossing').count()).toBe(0)
    await page.getByLabel('Filter by passage or vessel').fill('Yokohama – Juan')
    await board.getByText('Yokohama – Juan de Fuca, North Pacific crossing').waitFor()
    await expect.poll(() => board.getByText('Rotterdam – New York, North Atlantic').count()).toBe(0)
    await expect.poll(() => new URL(page.url()).searchParams.get('q')).toBe('Yokohama – Juan')
    await shoot(page, 'board-filtered')
  })
})
