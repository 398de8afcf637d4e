// Starts the built Passagewright server (.output) for a test file, against the test database
// that `npm test` created, and signs in demo users.
import { fileURLToPath } from 'node:url'
import { beforeAll } from 'vitest'
import { setup, url as testUrl } from '@nuxt/test-utils/e2e'

export const rootDir = fileURLToPath(new URL('../..', import.meta.url))
export const DEMO_PASSWORD = 'passage-demo'

export const demoUsers = {
  admin: 'admin@kestrel-bight.example',
  planner: 'planner@kestrel-bight.example',
  master: 'master@kestrel-bight.example',
  reliefMaster: 'relief.master@kestrel-bight.example',
  shore: 'shore@kestrel-bight.example',
  otherPlanner: 'planner@larkspur-reach.example',
  otherMaster: 'master@larkspur-reach.example',
} as const
export type DemoUser = keyof typeof demoUsers

export async function startServer(env: Record<string, string> = {}) {
  if (!process.env.NUXT_DATABASE_URL) throw new Error('NUXT_DATABASE_URL is not set: run the tests through `npm test`')
  await setup({
    rootDir,
    build: false,
    server: true,
    browser: false,
    setupTimeout: 120_000,
    // PW_OUTPUT_DIR points the tests at a build made in another folder (side-by-side builds).
    nuxtConfig: { nitro: { output: { dir: process.env.PW_OUTPUT_DIR || `${rootDir}.output` } } },
    env: { NUXT_DATABASE_URL: process.env.NUXT_DATABASE_URL, NUXT_SESSION_PASSWORD: process.env.NUXT_SESSION_PASSWORD!, ...env },
  })
  // The test context lives only in the file's top-level hooks; keep the address for nested suites.
  beforeAll(() => { baseUrl = testUrl('/').replace(/\/$/, '') })
}

let baseUrl = ''
export function url(path: string) {
  if (!baseUrl) throw new Error('the server has not started')
  return `${baseUrl}${path}`
}

export interface Api {
  cookie: string
  request: (path: string, init?: { method?: string, body?: unknown, headers?: Record<string, string>, rawBody?: BodyInit }) => Promise<{ status: number, body: any, headers: Headers }>
}

export function client(cookie = ''): Api {
  return {
    cookie,
    async request(path, init = {}) {
      const headers: Record<string, string> = { ...(cookie ? { cookie } : {}), ...init.headers }
      let body: BodyInit | undefined = init.rawBody
      if (init.body !== undefined) { headers['content-type'] ??= 'application/json'; body = JSON.stringify(init.body) }
      const res = await fetch(url(path), { method: init.method ?? 'GET', headers, body, redirect: 'manual' })
      const text = await res.text()
      let parsed: any = text
      try { parsed = JSON.parse(text) }
      catch {}
      return { status: res.status, body: parsed, headers: res.headers }
    },
  }
}

export async function loginAs(who: DemoUser): Promise<Api> {
  return loginWithEmail(demoUsers[who])
}

/** Signs in any user with the demo password. */
export async function loginWithEmail(email: string): Promise<Api> {
  const res = await fetch(url('/api/auth/login'), {
    method: 'POST',
    headers: { 'content-type': 'application/json' },
    body: JSON.stringify({ email, password: DEMO_PASSWORD }),
  })
  if (res.status !== 200) throw new Error(`sign-in as ${email} failed: ${res.status}`)
  const cookie = res.headers.getSetCookie().map(c => c.split(';')[0]).join('; ')
  return client(cookie)
}
