// Every page under pages/, loaded directly (server-rendered, then hydrated) as each demo role and
// signed out: no 5xx, no console error, no uncaught error, and a refusal in the app's own frame
// where the role or the company may not see the page. Who may see what: product.md, "People and
// roles" (another company's record answers 404, not 403).
import { readdirSync } from 'node:fs'
import type { Page } from 'playwright-core'
import { beforeAll, describe, expect, it } from 'vitest'
import { demoUsers, loginAs, rootDir, startServer, type DemoUser } from '../support/server'
import { openPage, shoot, signIn, useBrowser } from '../support/browser'
import { makePlan, vesselIdNamed } from '../support/records'

await startServer()
const browser = useBrowser()

type Expect = { status: 200 } | { status: 403 | 404, text: RegExp } | { redirect: string }
const ids = { plan: 0, vessel: 0 }

const kestrel: readonly DemoUser[] = ['admin', 'planner', 'master', 'reliefMaster', 'shore']
const editors: readonly DemoUser[] = ['planner', 'master', 'reliefMaster', 'otherPlanner', 'otherMaster']
const onlyFor = (allowed: readonly DemoUser[], refusal: Expect) => (who: DemoUser): Expect => allowed.includes(who) ? { status: 200 } : refusal
const everyone = (): Expect => ({ status: 200 })
// A Kestrel Bight record seen from Larkspur Reach: not found, so its existence does not leak.
const ownCompany = (text: RegExp) => onlyFor(kestrel, { status: 404, text })

/** Each page file, the address it is served at and what each signed-in role gets there. */
const pages: Record<string, { path: () => string, expect: (who: DemoUser) => Expect }> = {
  'index.vue': { path: () => '/', expect: everyone },
  'login.vue': { path: () => '/login', expect: () => ({ redirect: '/' }) },
  'outbox.vue': { path: () => '/outbox', expect: everyone },
  'fleet.vue': { path: () => '/fleet', expect: everyone },
  'places.vue': { path: () => '/places', expect: everyone },
  'solver.vue': { path: () => '/solver', expect: everyone },
  'tables.vue': { path: () => '/tables', expect: everyone },
  'zones.vue': { path: () => '/zones', expect: everyone },
  'admin/users.vue': { path: () => '/admin/users', expect: onlyFor(['admin'], { status: 403, text: /Only an admin manages users/ }) },
  'admin/settings.vue': { path: () => '/admin/settings', expect: onlyFor(['admin'], { status: 403, text: /Only an admin changes the company settings/ }) },
  'plans/new.vue': { path: () => '/plans/new', expect: onlyFor(editors, { status: 403, text: /Only planners and masters create plans/ }) },
  'plans/import.vue': { path: () => '/plans/import', expect: onlyFor(editors, { status: 403, text: /Only planners and masters import routes/ }) },
  'plans/[id].vue': { path: () => `/plans/${ids.plan}`, expect: ownCompany(/Plan not found/) },
  'voyage/[id].vue': { path: () => `/plans/${ids.plan}/voyage`, expect: ownCompany(/Plan not found/) },
  'print/plans/[id].vue': { path: () => `/plans/${ids.plan}/print`, expect: ownCompany(/Plan not found/) },
  'vessels/index.vue': { path: () => '/vessels', expect: everyone },
  'vessels/[id].vue': { path: () => `/vessels/${ids.vessel}`, expect: ownCompany(/Vessel not found/) },
}

function pageFiles(dir = `${rootDir}pages`, prefix = ''): string[] {
  return readdirSync(dir, { withFileTypes: true }).flatMap(entry => entry.isDirectory()
    ? pageFiles(`${dir}/${entry.name}`, `${prefix}${entry.name}/`)
    : entry.name.endsWith('.vue') ? [`${prefix}${entry.name}`] : [])
}

beforeAll(async () => {
  const planner = await loginAs('planner')
  ids.plan = await makePlan('draft', { planner }, { title: 'Page smoke passage' })
  ids.vessel = await vesselIdNamed(planner, 'Kestrel Dawn')
})

/** Loads `path` directly and collects what went wrong on the way: console errors and uncaught errors. */
async function load(page: Page, path: string) {
  const problems: string[] = []
  const onConsole = (m: import('playwright-core').ConsoleMessage) => { if (m.type() === 'error') problems.push(`console: ${m.text()} (${m.location().url})`) }
  const onError = (e: Error) => problems.push(`uncaught: ${e.message}`)
  page.on('console', onConsole)
  page.on('pageerror', onError)
  const response = await openPage(page, path)
  // Client-side fetches started by hydration end before the page counts as loaded.
  await page.waitForLoadState('networkidle')
  page.off('console', onConsole)
  page.off('pageerror', onError)
  const status = response?.status() ?? 0
  // The browser reports the document's own refusal as a failed resource: that one is the answer we expect.
  const documentUrl = response?.url()
  const real = problems.filter(p => !(status >= 400 && p.startsWith(`console: Failed to load resource: the server responded with a status of ${status}`) && p.endsWith(`(${documentUrl})`)))
  return { status, problems: real, pathname: new URL(page.url()).pathname }
}

async function check(page: Page, path: string, expected: Expect) {
  const { status, problems, pathname } = await load(page, path)
  expect(problems, `${path}: console or uncaught errors`).toEqual([])
  expect(status, `${path}: status`).toBeLessThan(500)
  const refusal = page.getByTestId('app-refusal')
  if ('redirect' in expected) {
    expect(pathname, `${path}: lands on`).toBe(expected.redirect)
    expect(status).toBe(200)
    expect(await refusal.count()).toBe(0)
  }
  else if (expected.status === 200) {
    expect(status, `${path}: status`).toBe(200)
    expect(pathname).toBe(path.split('?')[0])
    expect(await refusal.count(), `${path}: shows a refusal`).toBe(0)
    expect(await page.getByTestId('signed-in-user').count() + await page.getByTestId('print-plan').count(), `${path}: signed-in frame`).toBeGreaterThan(0)
  }
  else {
    expect(status, `${path}: status`).toBe(expected.status)
    await refusal.waitFor()
    expect(await refusal.getAttribute('data-status')).toBe(String(expected.status))
    expect(await refusal.textContent()).toMatch(expected.text)
    // The refusal sits in the usual frame: the header (and its sign-out) stays usable.
    expect(await page.getByTestId('signed-in-user').count()).toBe(1)
  }
}

it('the table covers every page file', () => {
  expect(pageFiles().sort()).toEqual(Object.keys(pages).sort())
})

for (const who of Object.keys(demoUsers) as DemoUser[]) {
  describe(`as ${who}`, () => {
    let page: Page
    beforeAll(async () => {
      page = await browser.newPage()
      await signIn(page, who)
    })
    for (const [file, entry] of Object.entries(pages))
      it(`${file} answers as the role may see it`, async () => check(page, entry.path(), entry.expect(who)))
  })
}

describe('signed out', () => {
  let page: Page
  beforeAll(async () => { page = await browser.newPage() })
  for (const [file, entry] of Object.entries(pages)) {
    it(`${file} asks for a sign-in`, async () => {
      const path = entry.path()
      const { status, problems, pathname } = await load(page, path)
      expect(problems, `${path}: console or uncaught errors`).toEqual([])
      expect(status).toBe(200)
      expect(pathname).toBe('/login')
      expect(new URL(page.url()).searchParams.get('next') ?? '/').toBe(path === '/login' ? '/' : path)
      await page.getByLabel('E-mail').waitFor()
    })
  }
})

// The phone width once per kind of page, for the one role that sees them all (screenshots for review).
describe('at 390 px', () => {
  it('every page loads as the planner without errors', async () => {
    const page = await browser.newPage(390, 844)
    await signIn(page, 'planner')
    for (const [file, entry] of Object.entries(pages)) {
      const { status, problems } = await load(page, entry.path())
      expect(problems, `${file}`).toEqual([])
      expect(status, `${file}`).toBeLessThan(500)
    }
    await load(page, '/admin/users')
    await page.getByTestId('app-refusal').waitFor()
    await shoot(page, 'refusal-390')
  })

  it('the refusal at 1440 px', async () => {
    const page = await browser.newPage()
    await signIn(page, 'shore')
    await load(page, '/plans/new')
    await page.getByTestId('app-refusal').waitFor()
    await shoot(page, 'refusal-1440')
  })
})
