import { readFileSync } from 'node:fs'
import { fileURLToPath } from 'node:url'
import { beforeAll, describe, expect, it } from 'vitest'
import { loginAs, startServer, type Api } from '../support/server'

// Route files over HTTP: import preview and create, refusals, export and round trips.
// Fixtures are the invented routes of tests/fixtures/routes.

await startServer()

const fixture = (name: string) => readFileSync(fileURLToPath(new URL(`../fixtures/routes/${name}`, import.meta.url)))

function form(file: { name: string, bytes: Buffer | string, type?: string }, fields: Record<string, string | number> = {}) {
  const body = new FormData()
  body.append('file', new Blob([typeof file.bytes === 'string' ? file.bytes : new Uint8Array(file.bytes)], { type: file.type ?? 'application/octet-stream' }), file.name)
  for (const [k, v] of Object.entries(fields)) body.append(k, String(v))
  return body
}

const upload = (api: Api, file: Parameters<typeof form>[0], fields: Record<string, string | number> = {}) =>
  api.request('/api/plans/import', { method: 'POST', rawBody: form(file, fields) })

let planner: Api, shore: Api, otherPlanner: Api
let vesselId: number
const countPlans = async () => (await planner.request('/api/plans')).body.length as number

beforeAll(async () => {
  planner = await loginAs('planner')
  shore = await loginAs('shore')
  otherPlanner = await loginAs('otherPlanner')
  vesselId = (await planner.request('/api/vessels')).body[0].id
})

describe('import preview', () => {
  it.each([
    // Waypoint counts read off the fixtures: CSV data rows, GPX <rtept> and RTZ <waypoint> elements.
    ['north-atlantic.csv', 'csv', 6],
    ['north-pacific.gpx', 'gpx', 5],
    ['indian-ocean-1-1.rtz', 'rtz', 4],
    ['north-sea-1-0.rtz', 'rtz', 3],
  ])('%s previews as %s with legs and creates nothing', async (name, format, expectedCount) => {
    const before = await countPlans()
    const res = await upload(planner, { name, bytes: fixture(name) }, { departureUtc: '2026-12-20T06:00:00Z', speedKn: 13 })
    expect(res.status).toBe(200)
    expect(res.body.format).toBe(format)
    expect(res.body.errors).toEqual([])
    expect(res.body.waypoints).toHaveLength(expectedCount)
    expect(res.body.legs).toHaveLength(expectedCount - 1)
    expect(res.body.totals.departureUtc).toBe('2026-12-20T06:00:00.000Z')
    expect(res.body.totals.distanceNm).toBeGreaterThan(0)
    expect(await countPlans()).toBe(before)
  })

  it('assumes a departure and a speed when none are given, and says so', async () => {
    const res = await upload(planner, { name: 'north-atlantic.csv', bytes: fixture('north-atlantic.csv') })
    expect(res.status).toBe(200)
    expect(res.body.assumed).toMatchObject({ speedKn: 12, speedGiven: false, departureGiven: false })
  })

  it('lists waypoint errors with their line or element instead of legs', async () => {
    const csv = await upload(planner, { name: 'latitude-95.csv', bytes: fixture('latitude-95.csv') })
    expect(csv.status).toBe(200)
    expect(csv.body.errors).toEqual([{ line: 4, message: expect.stringMatching(/95/) }])
    expect(csv.body.legs).toEqual([])
    const rtz = await upload(planner, { name: 'bad-leg.rtz', bytes: fixture('bad-leg.rtz') })
    expect(rtz.body.errors.map((e: any) => e.element)).toEqual(['waypoint #2', 'waypoint #3'])
  })

  it('carries the reader\'s warnings (a GPX track read as a route)', async () => {
    const res = await upload(planner, { name: 'track-only.gpx', bytes: fixture('track-only.gpx') })
    expect(res.status).toBe(200)
    expect(res.body.warnings[0]).toMatchObject({ element: 'trk #1', message: expect.stringMatching(/no route/) })
  })
})

describe('import create', () => {
  it('creates a draft from a CSV with its waypoints and event', async () => {
    const before = await countPlans()
    const res = await upload(planner, { name: 'north-atlantic.csv', bytes: fixture('north-atlantic.csv'), type: 'text/csv' },
      { mode: 'create', vesselId, title: 'Imported North Atlantic', departureUtc: '2026-12-21T08:00:00Z', speedKn: 14 })
    expect(res.status).toBe(201)
    expect(res.body).toMatchObject({ format: 'csv', waypointCount: 6 })
    const view = await planner.request(`/api/plans/${res.body.id}`)
    expect(view.body.plan).toMatchObject({ status: 'draft', title: 'Imported North Atlantic', speedKn: 14 })
    expect(view.body.waypoints.map((w: any) => w.name)).toEqual(['Maas Centre', 'Dover Strait SW lane', 'Lizard offing', 'Mid-ocean', 'Nantucket approach', 'Ambrose approach'])
    expect(view.body.waypoints[3].method).toBe('geodesic')
    expect(view.body.events.map((e: any) => e.kind)).toEqual(['created'])
    expect(await countPlans()).toBe(before + 1)
  })

  it('creates nothing from a file with a bad waypoint, naming its line', async () => {
    const before = await countPlans()
    const res = await upload(planner, { name: 'latitude-95.csv', bytes: fixture('latitude-95.csv') },
      { mode: 'create', vesselId, title: 'Should not exist', departureUtc: '2026-12-21T08:00:00Z', speedKn: 14 })
    expect(res.status).toBe(400)
    expect(res.body.message).toMatch(/nothing was created.*line 4/)
    expect(res.body.data.errors[0]).toMatchObject({ line: 4 })
    expect(await countPlans()).toBe(before)
  })

  it('names the missing or wrong header field', async () => {
    const res = await upload(planner, { name: 'north-atlantic.csv', bytes: fixture('north-atlantic.csv') },
      { mode: 'create', vesselId, title: 'No speed', departureUtc: '2026-12-21T08:00:00Z' })
    expect(res.status).toBe(400)
    expect(res.body.message).toMatch(/^speedKn:/)
    const foreign = await upload(otherPlanner, { name: 'north-atlantic.csv', bytes: fixture('north-atlantic.csv') },
      { mode: 'create', vesselId, title: 'Foreign vessel', departureUtc: '2026-12-21T08:00:00Z', speedKn: 12 })
    expect(foreign.status).toBe(400)
    expect(foreign.body.message).toMatch(/vesselId/)
    const mode = await upload(planner, { name: 'north-atlantic.csv', bytes: fixture('north-atlantic.csv') }, { mode: 'publish' })
    expect(mode.status).toBe(400)
    expect(mode.body.message).toMatch(/^mode:/)
  })
})

describe('files refused', () => {
  it.each([
    ['malformed.gpx', /line 5: the XML is not well formed/],
    ['billion-laughs.gpx', /DOCTYPE/],
    ['external-entity.rtz', /DOCTYPE/],
    ['wrong-columns.csv', /latitude.*longitude/],
  ])('%s → 400 with its message, nothing created', async (name, message) => {
    const before = await countPlans()
    const res = await upload(planner, { name, bytes: fixture(name) },
      { mode: 'create', vesselId, title: 'Should not exist', departureUtc: '2026-12-21T08:00:00Z', speedKn: 14 })
    expect(res.status).toBe(400)
    expect(res.body.message).toMatch(message)
    expect(res.body.data.kind).toMatch(/malformed|unsafe-xml|bad-columns/)
    expect(await countPlans()).toBe(before)
  })

  it('refuses a 3 MB upload with 413 before reading it', async () => {
    const big = `name,lat,lon\n${'A,1,1\n'.repeat(500_000)}`
    expect(big.length).toBeGreaterThan(3_000_000)
    const res = await upload(planner, { name: 'big.csv', bytes: big })
    expect(res.status).toBe(413)
  })

  it('refuses a file just over 2 MB with 413 and a message', async () => {
    const file = `name,lat,lon\n${'A,1,1\n'.repeat(352_000)}`
    expect(file.length).toBeGreaterThan(2 * 1024 * 1024)
    const res = await upload(planner, { name: 'over.csv', bytes: file })
    expect(res.status).toBe(413)
    expect(res.body.message).toMatch(/at most 2 MB/)
  })

  it('refuses a body that is not multipart (415) and an upload without a file (400)', async () => {
    const json = await planner.request('/api/plans/import', { method: 'POST', body: { waypoints: [] } })
    expect(json.status).toBe(415)
    expect(json.body.message).toMatch(/multipart/)
    const empty = new FormData()
    empty.append('mode', 'preview')
    const noFile = await planner.request('/api/plans/import', { method: 'POST', rawBody: empty })
    expect(noFile.status).toBe(400)
    expect(noFile.body.message).toMatch(/^file:/)
  })

  it('refuses other file types and binary content', async () => {
    const pdf = await upload(planner, { name: 'route.pdf', bytes: '%PDF-1.4' })
    expect(pdf.status).toBe(400)
    expect(pdf.body.message).toMatch(/not route files/)
    const binary = await upload(planner, { name: 'route.csv', bytes: Buffer.from([0x41, 0, 0x42, 0, 0x43]) })
    expect(binary.status).toBe(400)
  })
})

describe('export and round trips', () => {
  let planId: number
  let stored: any[]
  beforeAll(async () => {
    const plans = (await planner.request('/api/plans')).body
    planId = plans.find((p: any) => p.title.startsWith('Cape of Good Hope')).id
    stored = (await planner.request(`/api/plans/${planId}`)).body.waypoints
  })

  it.each(['csv', 'gpx', 'rtz'] as const)('%s export imports back to the same waypoints', async (format) => {
    const file = await shore.request(`/api/plans/${planId}/export?format=${format}`)
    expect(file.status).toBe(200)
    expect(file.headers.get('content-type')).toMatch(format === 'csv' ? /^text\/csv/ : /xml/)
    const disposition = file.headers.get('content-disposition')!
    expect(disposition).toMatch(new RegExp(`^attachment; filename="[\\w.-]+\\.${format}"`))
    const name = /filename="([^"]+)"/.exec(disposition)![1]!
    const back = await upload(planner, { name, bytes: typeof file.body === 'string' ? file.body : JSON.stringify(file.body) })
    expect(back.status).toBe(200)
    expect(back.body.errors).toEqual([])
    expect(back.body.waypoints).toHaveLength(stored.length)
    back.body.waypoints.forEach((w: any, i: number) => {
      expect(Math.abs(w.lat - stored[i].lat)).toBeLessThan(1e-7)
      expect(Math.abs(((w.lon - stored[i].lon + 540) % 360) - 180)).toBeLessThan(1e-7)
      expect(w.name).toBe(stored[i].name)
      if (i > 0) expect(w.method).toBe(stored[i].method)
    })
  })

  it('refuses an unknown format naming the field', async () => {
    const res = await planner.request(`/api/plans/${planId}/export?format=kml`)
    expect(res.status).toBe(400)
    expect(res.body.message).toMatch(/^format:/)
  })

  it('lets shore export but not import (403)', async () => {
    const res = await upload(shore, { name: 'north-atlantic.csv', bytes: fixture('north-atlantic.csv') })
    expect(res.status).toBe(403)
  })

  it('answers 404 for another company\'s plan', async () => {
    expect((await otherPlanner.request(`/api/plans/${planId}/export?format=gpx`)).status).toBe(404)
  })
})
