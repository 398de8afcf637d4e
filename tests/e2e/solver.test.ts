import { describe, expect, it } from 'vitest'
import { startServer } from '../support/server'
import { openPage, shoot, signIn, useBrowser } from '../support/browser'

await startServer()
const browser = useBrowser()

describe('quick solver', () => {
  it('answers as the navigator types: three methods side by side, the vertex, the direct problem', async () => {
    const page = await browser.newPage()
    await signIn(page, 'planner')
    await openPage(page, '/solver')
    await page.getByTestId('solver-caution').waitFor()
    const results = page.getByTestId('solver-results')
    await results.waitFor()

    // JFK → Singapore: GeodSolve(1) manual 15 347 628 m = 8287.05 nm; RhumbSolve(1) manual 18 523 563 m = 10 001.92 nm
    await page.getByLabel('From').fill('40-38.383N 073-46.733W')
    await page.getByLabel('To').fill('01°21′33″N 103°59′22″E')
    await expect.poll(() => page.getByTestId('solver-row-geodesic').textContent()).toContain('8287.0')
    expect(await page.getByTestId('solver-row-rhumb-line').textContent()).toContain('103.58°')
    expect(await page.getByTestId('solver-row-rhumb-line').textContent()).toContain('10001.9')
    expect(await page.getByTestId('solver-vertex').textContent()).toContain('Highest latitude')
    await shoot(page, 'solver')

    await page.getByLabel('To').fill('01°61′N 103°59′E')
    await page.getByText('minutes must be less than 60').waitFor()

    // Direct problem: 600 nm due east along the equator on a rhumb line ends at 010°E (a·Δλ, common practice)
    await page.getByLabel('Start').fill('0 0')
    await page.getByLabel('Course °T').fill('90')
    await page.getByLabel('Distance').fill('1113194.9')
    await page.getByLabel('Unit').selectOption('m')
    await expect.poll(() => page.getByTestId('solver-direct-to').textContent()).toBe('00°00.00′N 010°00.00′E')
  })

  it('answers the edge cases in words: along the equator, the same position twice, a latitude beyond 90°', async () => {
    const page = await browser.newPage()
    const errors: string[] = []
    page.on('pageerror', e => errors.push(e.message))
    page.on('console', m => { if (m.type() === 'error') errors.push(m.text()) })
    await signIn(page, 'planner')
    await openPage(page, '/solver')
    await page.getByTestId('solver-results').waitFor()
    const vertex = page.getByTestId('solver-vertex')

    await page.getByLabel('From').fill('0 0')
    await page.getByLabel('To').fill('00 00N 010 00W')
    await expect.poll(() => vertex.textContent()).toContain('runs along the equator')

    await page.getByLabel('To').fill('0 0')
    await expect.poll(() => vertex.textContent()).toContain('the same')
    expect(await page.getByTestId('solver-row-geodesic').textContent()).toContain('—')
    expect(await page.getByTestId('solver-row-geodesic').textContent()).not.toContain('180.00°')

    await page.getByLabel('From').fill('95 00N 010 00E')
    await page.getByText('95° is beyond 90°').waitFor()
    expect(errors).toEqual([])
  })

  it('fits a phone: no sideways scroll, the answers straight after the two positions', async () => {
    const page = await browser.newPage(390, 844)
    await signIn(page, 'planner')
    await openPage(page, '/solver')
    await page.getByTestId('solver-results').waitFor()
    expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(390)
    const top = async (id: string) => (await page.getByTestId(id).boundingBox())!.y
    expect(await top('solver-results')).toBeGreaterThan(await top('solver-positions'))
    expect(await top('solver-results')).toBeLessThan(await top('solver-direct'))
    await shoot(page, 'solver-phone')
  })
})
