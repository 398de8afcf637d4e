// A place CSV brings at most 5,000 places (as a route file brings at most 5,000 waypoints): a
// 2 MB file of 180,000 short rows is refused after reading 5,001 of them, with a short answer,
// and the preview of a full-size file stays bounded.
import { beforeAll, describe, expect, it } from 'vitest'
import { type Api, loginAs, startServer } from '../support/server'

await startServer()

let shore: Api
beforeAll(async () => { shore = await loginAs('shore') })

const csv = (rows: number, row: (i: number) => string) => `name,kind,latitude,longitude\n${Array.from({ length: rows }, (_, i) => row(i)).join('\n')}\n`
const send = (text: string, mode = 'preview') => shore.request(`/api/places/import?mode=${mode}`, { method: 'POST', headers: { 'content-type': 'text/csv' }, rawBody: text })

describe('place CSV size', () => {
  it('refuses 180,000 rows in under 2 MB with 400 naming the file and the 5,000 limit, in a short answer', async () => {
    const text = csv(180_000, i => `${i % 10},port,1,1`)
    expect(text.length).toBeGreaterThan(1_900_000)
    expect(text.length).toBeLessThan(2_000_000)
    const before = (await shore.request('/api/places')).body.length
    for (const mode of ['preview', 'commit']) {
      const res = await send(text, mode)
      expect(res.status).toBe(400)
      expect(res.body.message).toMatch(/^file: .*5,000/)
      expect(JSON.stringify(res.body).length).toBeLessThan(1000)
    }
    expect((await shore.request('/api/places')).body.length).toBe(before)
  })

  it('refuses 5,001 places and previews 5,000, every row listed and the answer bounded', async () => {
    const row = (i: number) => `Limit probe ${i},anchorage,${(i % 160) - 80}.5,${(i % 340) - 170}.25`
    expect((await send(csv(5001, row))).status).toBe(400)
    const res = await send(csv(5000, row))
    expect(res.status).toBe(200)
    expect(res.body.rows).toHaveLength(5000)
    expect(res.body.errorCount).toBe(0)
    // About 150 bytes a row (line, place with its time zone, no errors).
    expect(JSON.stringify(res.body).length).toBeLessThan(1_500_000)
  })

  it('quotes a name in a message shortly, however long the cell', async () => {
    const long = 'N'.repeat(100_000)
    const res = await send(csv(2, () => `${long},port,1,1`))
    expect(res.status).toBe(200)
    const messages: string[] = res.body.rows.flatMap((r: { errors: string[] }) => r.errors)
    expect(messages.some(m => /also on line 2/.test(m))).toBe(true)
    for (const m of messages) expect(m.length).toBeLessThan(200)
  })
})
