// Debian's Chromium driven by playwright-core (never a downloaded browser).
import { mkdirSync } from 'node:fs'
import { chromium, type Browser, type Page, type Response } from 'playwright-core'
import { afterAll, beforeAll } from 'vitest'
import { DEMO_PASSWORD, demoUsers, rootDir, url, type DemoUser } from './server'

export const screenshotDir = `${rootDir}tests/e2e/screenshots`

export function useBrowser() {
  const state: { browser?: Browser } = {}
  beforeAll(async () => {
    mkdirSync(screenshotDir, { recursive: true })
    state.browser = await chromium.launch({
      executablePath: process.env.CHROMIUM_PATH || '/usr/bin/chromium',
      args: ['--headless', '--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run', '--disable-background-networking', '--disable-component-update', '--disable-sync'],
    })
  })
  afterAll(async () => { await state.browser?.close() })
  return {
    async newPage(width = 1440, height = 900): Promise<Page> {
      const context = await state.browser!.newContext({ viewport: { width, height }, baseURL: url('') })
      return context.newPage()
    },
  }
}

/** Loads `path` (server-rendered) and waits until Nuxt has hydrated it; use before any typing or clicking. */
export async function openPage(page: Page, path: string): Promise<Response | null> {
  const response = await page.goto(path)
  await page.locator('html[data-hydrated]').waitFor({ state: 'attached' })
  return response
}

export async function signIn(page: Page, who: DemoUser, base = '') {
  await openPage(page, `${base}/login`)
  await page.getByLabel('E-mail').fill(demoUsers[who])
  await page.getByLabel('Password').fill(DEMO_PASSWORD)
  await page.getByRole('button', { name: 'Sign in' }).click()
  await page.waitForURL(u => !u.pathname.startsWith('/login'))
}

export async function shoot(page: Page, name: string) {
  await page.screenshot({ path: `${screenshotDir}/${name}.png`, fullPage: true })
}
