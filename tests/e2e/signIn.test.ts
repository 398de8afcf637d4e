// The sign-in page: a sign-in that worked never says it failed, whatever page it goes on to; a
// `next` that names another site goes to the board instead; a wrong password shows the server's words.
import { describe, expect, it } from 'vitest'
import type { Page } from 'playwright-core'
import { DEMO_PASSWORD, demoUsers, startServer, url } from '../support/server'
import { openPage, shoot, useBrowser } from '../support/browser'

await startServer()
const browser = useBrowser()

async function submit(page: Page, email: string, password: string) {
  await page.getByLabel('E-mail').fill(email)
  await page.getByLabel('Password').fill(password)
  await page.getByRole('button', { name: 'Sign in' }).click()
}

describe('signing in', () => {
  it.each([
    ['/login?next=/places', '/places'],
    ['/login?next=//evil.example/plans', '/'],
    ['/login?next=/%5Cevil.example', '/'],
  ])('from %s goes to %s and shows no failure', async (start, landing) => {
    const page = await browser.newPage()
    await openPage(page, start)
    await submit(page, demoUsers.shore, DEMO_PASSWORD)
    await page.waitForURL(u => !u.pathname.startsWith('/login'))
    expect(page.url().startsWith(url('/')), page.url()).toBe(true)
    expect(new URL(page.url()).pathname).toBe(landing)
    expect(await page.getByText('Sign-in failed').count()).toBe(0)
    await page.context().close()
  })

  it('shows the server\'s message for a wrong password, at 1440 px and 390 px', async () => {
    for (const width of [1440, 390]) {
      const page = await browser.newPage(width, 844)
      await openPage(page, '/login')
      // An address no account has, so no real account's failure count grows.
      await submit(page, `nobody.${width}@kestrel-bight.example`, 'not-the-password')
      await expect.poll(() => page.getByRole('alert').textContent()).toContain('E-mail or password is not correct')
      await shoot(page, `sign-in-failed-${width}`)
      await page.context().close()
    }
  })
})
