// A hostile page on another port of the same host (so the browser sends the SameSite=Lax cookie
// with its requests) tries, while the master is signed in, to approve a plan with an
// auto-submitted form, add a remark, import a route and sign the master out. Nothing of it lands.
import { createServer, type Server } from 'node:http'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { type Api, loginAs, startServer, url } from '../support/server'
import { openPage, shoot, signIn, useBrowser } from '../support/browser'
import { freePort } from '../support/instances'
import { makePlan, planStatus, vesselIdNamed } from '../support/records'

await startServer()
const browser = useBrowser()

function hostilePage(target: string, planId: number, vesselId: number) {
  return `<!doctype html><title>Fleet news</title>
<form id="approve" method="POST" action="${target}/api/plans/${planId}/approve"></form>
<script>
(async () => {
  const blind = { method: 'POST', mode: 'no-cors', credentials: 'include' }
  await fetch('${target}/api/plans/${planId}/remarks', { ...blind, headers: { 'content-type': 'text/plain' }, body: '{"remarks":"Forged remark"}' }).catch(() => {})
  const file = new FormData()
  file.append('file', new Blob(['name,latitude,longitude\\nA,50,-20\\nB,51,-21\\n'], { type: 'text/csv' }), 'forged.csv')
  for (const [k, v] of Object.entries({ mode: 'create', vesselId: '${vesselId}', title: 'Forged import', departureUtc: '2027-01-01T00:00:00Z', speedKn: '12' })) file.append(k, v)
  await fetch('${target}/api/plans/import', { ...blind, body: file }).catch(() => {})
  await fetch('${target}/api/auth/logout', blind).catch(() => {})
  document.getElementById('approve').submit()
})()
</script>`
}

describe('requests from another site', () => {
  let hostile: Server
  let hostileUrl = ''
  let planner: Api, master: Api
  let planId = 0

  beforeAll(async () => {
    planner = await loginAs('planner')
    master = await loginAs('master')
    planId = await makePlan('submitted', { planner, master }, { title: 'Cross-site probe' })
    const page = hostilePage(url(''), planId, await vesselIdNamed(planner, 'Kestrel Dawn'))
    hostile = createServer((_req, res) => res.writeHead(200, { 'content-type': 'text/html' }).end(page))
    const port = await freePort()
    await new Promise<void>(resolve => hostile.listen(port, '127.0.0.1', resolve))
    hostileUrl = `http://127.0.0.1:${port}/`
  })
  afterAll(() => new Promise<void>(resolve => hostile?.close(() => resolve())))

  it('cannot approve, remark, import or sign the master out', async () => {
    const page = await browser.newPage()
    await signIn(page, 'master')
    await page.goto(hostileUrl)
    // The form's submission is the page's last act: its answer is our 403.
    await page.waitForURL(u => u.pathname === `/api/plans/${planId}/approve`)
    expect(await page.textContent('body')).toMatch(/did not come from a Passagewright page/)

    expect(await planStatus(master, planId)).toBe('submitted')
    const events = (await master.request(`/api/plans/${planId}`)).body.events as { remarks: string | null }[]
    expect(events.map(e => e.remarks)).not.toContain('Forged remark')
    const titles = ((await planner.request('/api/plans')).body as { title: string }[]).map(p => p.title)
    expect(titles).not.toContain('Forged import')

    // Still signed in: the plan opens with the master's own Approve button, which works.
    await openPage(page, `/plans/${planId}`)
    await page.getByTestId('signoff-actions').getByRole('button', { name: 'Approve' }).click()
    await page.getByTestId('confirm-approve').click()
    await page.getByTestId('signoff-panel').locator('[data-status="approved"]').waitFor()
    await shoot(page, 'cross-site-after')
    expect(await planStatus(master, planId)).toBe('approved')
  })
})
