// Debian's Chromium driven by playwright-core (never a downloaded browser).
import { mkdirSync } from 'node:fs'
import { chromium, type Browser, type Page } from 'playwright-core'
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

export async function signIn(page: Page, who: DemoUser, base = '') {
  await page.goto(`${base}/login`)
  await page.getByLabel('E-mail').fill(demoUsers[who])
  await page.getByLabel('Password').fill(DEMO_PASSWORD)
  await page.getByRole('button', { name: 'Sign in' }).click()
  await page.waitForURL(u => !u.pathname.startsWith('/login'))
}

export async function shoot(page: Page, name: string) {
  await page.screenshot({ path: `${screenshotDir}/${name}.png`, fullPage: true })
}
