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
})
