// Distance tables against the seeded demo data: the approved Cape of Good Hope – Fremantle plan
// gives its own distance; pairs without an approved plan (Rotterdam – New York: the seed's plan is
// 'submitted') take the computed sea route, never below the GeodSolve geodesic and within 4 % of
// published port-to-port distances (from memory of NGA Pub. 151 and the commercial tables); the
// direct geodesic (checked against GeodSolve) is left for pairs no sea route joins.
import { execFileSync } from 'node:child_process'
import { beforeAll, describe, expect, it } from 'vitest'
import { type Api, loginAs, startServer } from '../support/server'
import { runOracle } from '../unit/support/oracle'

await startServer()

/** GeodSolve (GeographicLib's own command-line tool, Karney) as the oracle: distance in nm. */
function geodSolveNm(a: { lat: number, lon: number }, b: { lat: number, lon: number }): number {
  const out = execFileSync('GeodSolve', ['-i', '-p', '9'], { input: `${a.lat} ${a.lon} ${b.lat} ${b.lon}\n` }).toString()
  return Number(out.trim().split(/\s+/)[2]) / 1852
}

const pair = (i: number, j: number, n: number): number => (i < j ? i * n - (i * (i + 1)) / 2 + (j - i - 1) : pair(j, i, n))

describe('distance tables', () => {
  let shore: Api
  let places: any[]
  const byName = (name: string) => places.find(p => p.name === name)

  beforeAll(async () => {
    shore = await loginAs('shore')
    places = (await shore.request('/api/places')).body
  })

  it('takes the approved plan between its end places and links it; other pairs take the sea route with its passages', async () => {
    const names = ['Cape of Good Hope offing', 'Fremantle pilot boarding ground', 'Rotterdam', 'New York']
    const res = await shore.request('/api/tables', { method: 'POST', body: { name: 'Test four', placeIds: names.map(n => byName(n).id) } })
    expect(res.status).toBe(201)
    const t = res.body
    expect(t.status).toBe('ready')
    expect(t.progress).toBe(1)
    expect(t.radiusNm).toBe(30)
    expect(t.avoid).toEqual([])
    const n = t.places.length
    const idx = (name: string) => t.places.findIndex((p: any) => p.name === name)

    const plans = (await shore.request('/api/plans')).body
    const cape = plans.find((p: any) => p.title === 'Cape of Good Hope – Fremantle, held at 40°S')
    const view = (await shore.request(`/api/plans/${cape.id}`)).body
    const k = pair(idx('Cape of Good Hope offing'), idx('Fremantle pilot boarding ground'), n)
    expect(t.matrix.planId[k]).toBe(cape.id)
    expect(t.matrix.source[k]).toBe('plan')
    // The plan's own track, leg by leg from the oracles: GeodSolve for geodesic legs, RhumbSolve for rhumb legs.
    const wps = view.waypoints as { lat: number, lon: number, method: string }[]
    const legLines = wps.slice(1).map((b, i) => `${wps[i]!.lat} ${wps[i]!.lon} ${b.lat} ${b.lon}`)
    const geod = runOracle('GeodSolve', ['-i', '-p', '9'], legLines)
    const rhumb = runOracle('RhumbSolve', ['-i', '-p', '9'], legLines)
    const trackNm = wps.slice(1).reduce((sum, b, i) => sum + (b.method === 'geodesic' ? geod[i]![2]! : rhumb[i]![1]!) / 1852, 0)
    expect(wps.length).toBeGreaterThan(2)
    expect(Math.abs(t.matrix.distanceNm[k] - trackNm)).toBeLessThan(0.01) // the table keeps hundredths of a mile at most
    expect(t.matrix.crossesLand[k]).toBeNull()
    expect(t.matrix.plans).toContainEqual({ id: cape.id, title: cape.title })

    // Every other pair has no plan: a sea route, never shorter than the geodesic (GeodSolve), never flagged as crossing land.
    let sea = 0
    for (let i = 0; i < n; i++) for (let j = i + 1; j < n; j++) {
      const q = pair(i, j, n)
      if (q === k) continue
      sea++
      const label = `${t.places[i].name} – ${t.places[j].name}`
      expect(t.matrix.planId[q], label).toBeNull()
      expect(t.matrix.source[q], label).toBe('sea')
      expect(t.matrix.crossesLand[q], label).toBeNull()
      expect(Array.isArray(t.matrix.via[q]), label).toBe(true)
      // The places may be moved up to 20 nm onto the routing graph's water: allow that at each end.
      expect(t.matrix.distanceNm[q], label).toBeGreaterThan(geodSolveNm(t.places[i], t.places[j]) - 40)
    }
    expect(sea).toBe(5)

    // Rotterdam – New York: about 3,350 nm (from memory, see the top), through the Dover Strait.
    const rn = pair(idx('Rotterdam'), idx('New York'), n)
    expect(Math.abs(t.matrix.distanceNm[rn] - 3350) / 3350).toBeLessThan(0.04)
    expect(t.matrix.via[rn]).toContain('dover')
    expect(t.matrix.passages).toContainEqual({ id: 'dover', name: expect.any(String) })
    // The Cape – Rotterdam geodesic runs over Africa; the sea route goes round it: about 6,170 nm from Cape Town (from memory).
    const cr = pair(idx('Cape of Good Hope offing'), idx('Rotterdam'), n)
    expect(Math.abs(t.matrix.distanceNm[cr] - 6170) / 6170).toBeLessThan(0.04)
  })

  it('builds the six-port table of the sea-routes issue by sea: no pair falls back to the direct geodesic or crosses land', async () => {
    const stamp = Date.now().toString(36)
    // Santos and Durban are not demo places: harbour entrances from memory.
    const extra = await Promise.all([['Santos', -23.99, -46.3], ['Durban', -29.87, 31.05]].map(async ([name, lat, lon]) =>
      (await shore.request('/api/places', { method: 'POST', body: { name: `${name} ${stamp}`, kind: 'port', lat, lon } })).body))
    const ids = [...['Rotterdam', 'New York', 'Singapore', 'Yokohama'].map(n => byName(n).id), ...extra.map((p: any) => p.id)]
    const res = await shore.request('/api/tables', { method: 'POST', body: { name: `Six ports ${stamp}`, placeIds: ids } })
    expect(res.status).toBe(201)
    const t = res.body
    const n = t.places.length
    const idx = (name: string) => t.places.findIndex((p: any) => p.name.startsWith(name))
    expect(t.matrix.source.filter((s: string) => s !== 'plan').every((s: string) => s === 'sea')).toBe(true)
    expect(t.matrix.crossesLand.every((c: boolean | null) => c !== true)).toBe(true)
    // Published port-to-port distances, nm: all from memory (see the top of the file); within 4 %.
    const published: [string, string, number][] = [
      ['Rotterdam', 'Singapore', 8290], // from memory
      ['Rotterdam', 'New York', 3350], // from memory
      ['Rotterdam', 'Yokohama', 11170], // from memory
      ['New York', 'Santos', 5000], // from memory
      ['Singapore', 'Yokohama', 2890], // from memory
    ]
    for (const [a, b, nm] of published) {
      const q = pair(idx(a), idx(b), n)
      expect(t.matrix.source[q], `${a} – ${b}`).toBe('sea')
      expect(Math.abs(t.matrix.distanceNm[q] - nm) / nm, `${a} – ${b}: ${t.matrix.distanceNm[q]}`).toBeLessThan(0.04)
    }
    expect(t.matrix.via[pair(idx('Rotterdam'), idx('Singapore'), n)]).toContain('suez')

    // The same places with Suez avoided: Europe – Asia round the Cape, stored with the table and kept by a rebuild.
    const cape = await shore.request('/api/tables', { method: 'POST', body: { name: `Six ports, no Suez ${stamp}`, placeIds: ids, avoid: ['suez'] } })
    expect(cape.status).toBe(201)
    expect(cape.body.avoid).toEqual(['suez'])
    const rs = pair(idx('Rotterdam'), idx('Singapore'), n)
    expect(cape.body.matrix.via[rs]).not.toContain('suez')
    // Rotterdam – Singapore by the Cape: about 11,750 nm (from memory).
    expect(Math.abs(cape.body.matrix.distanceNm[rs] - 11750) / 11750).toBeLessThan(0.04)
    const again = await shore.request(`/api/tables/${cape.body.id}/rebuild`, { method: 'POST' })
    expect(again.status).toBe(200)
    expect(again.body.avoid).toEqual(['suez'])
    expect(again.body.matrix.via[rs]).not.toContain('suez')
  })

  it('falls back to the direct geodesic, flagged, only where no sea route joins the places (the Caspian Sea has no passage out)', async () => {
    const stamp = Date.now().toString(36)
    // Off Baku, in the Caspian Sea (from memory): water no declared passage joins to the oceans.
    const caspian = (await shore.request('/api/places', { method: 'POST', body: { name: `Caspian ${stamp}`, kind: 'ocean_position', lat: 40.2, lon: 50.4 } })).body
    const ids = [caspian.id, byName('Rotterdam').id, byName('New York').id]
    const t = (await shore.request('/api/tables', { method: 'POST', body: { name: `Caspian ${stamp}`, placeIds: ids } })).body
    const n = t.places.length
    const idx = (name: string) => t.places.findIndex((p: any) => p.name === name)
    const cr = pair(idx(caspian.name), idx('Rotterdam'), n)
    expect(t.matrix.source[cr]).toBe('direct')
    expect(t.matrix.via[cr]).toBeNull()
    expect(t.matrix.ecaNm[cr]).toBeNull()
    expect(Math.abs(t.matrix.distanceNm[cr] - geodSolveNm(caspian, byName('Rotterdam')))).toBeLessThan(0.001)
    expect(t.matrix.crossesLand[cr]).toBe(true) // over Russia and Europe
    expect(t.matrix.source[pair(idx('Rotterdam'), idx('New York'), n)]).toBe('sea')
  })

  it('gives each pair its distance inside the ECAs: Rotterdam – New York crosses the North Sea and North American ECAs, Singapore – Yokohama none', async () => {
    const ids = ['Rotterdam', 'New York', 'Singapore', 'Yokohama'].map(n => byName(n).id)
    const t = (await shore.request('/api/tables', { method: 'POST', body: { name: 'ECA four', placeIds: ids } })).body
    const n = t.places.length
    const idx = (name: string) => t.places.findIndex((p: any) => p.name === name)
    // Hand working (the seeded outlines, db/seeds/ecaZones.ts, approximate from memory of MARPOL Annex VI
    // Appendix VII): the North Sea ECA runs from Rotterdam through the Dover Strait and the Channel to 5°W,
    // about 130 + 250 = 380 nm. The great-circle track to New York meets the North American ECA's seaward
    // side south-east of Newfoundland near 48°W, 45°N, then stays inside to New York (74°W, 40.7°N):
    // about 26° of longitude at a mean latitude near 43° (26 × 60 × cos 43° ≈ 1,140 nm) plus the
    // southing of about 4.5° (270 nm), ≈ 1,170 nm. So about 1,550 nm in all; allow 1,300 to 1,850.
    const rn = t.matrix.ecaNm[pair(idx('Rotterdam'), idx('New York'), n)]
    expect(rn).toBeGreaterThan(1300)
    expect(rn).toBeLessThan(1850)
    // Singapore – Yokohama runs through no ECA (none in the South China Sea or off Japan).
    expect(t.matrix.ecaNm[pair(idx('Singapore'), idx('Yokohama'), n)]).toBe(0)
  })

  it('lets planners and masters read but not build, rebuild or delete (403)', async () => {
    const planner = await loginAs('planner')
    const master = await loginAs('master')
    const ids = places.slice(0, 3).map(p => p.id)
    expect((await planner.request('/api/tables', { method: 'POST', body: { name: 'Nope', placeIds: ids } })).status).toBe(403)
    const made = await shore.request('/api/tables', { method: 'POST', body: { name: 'Readable', placeIds: ids, radiusNm: 10 } })
    expect(made.status).toBe(201)
    expect((await master.request('/api/tables')).body.some((t: any) => t.id === made.body.id)).toBe(true)
    expect((await planner.request(`/api/tables/${made.body.id}`)).status).toBe(200)
    expect((await planner.request(`/api/tables/${made.body.id}/rebuild`, { method: 'POST' })).status).toBe(403)
    expect((await master.request(`/api/tables/${made.body.id}`, { method: 'DELETE' })).status).toBe(403)
    const admin = await loginAs('admin')
    expect((await admin.request(`/api/tables/${made.body.id}/rebuild`, { method: 'POST' })).status).toBe(200)
    expect((await admin.request(`/api/tables/${made.body.id}`, { method: 'DELETE' })).status).toBe(204)
    expect((await shore.request(`/api/tables/${made.body.id}`)).status).toBe(404)
  })

  it('keeps tables within the company (404) and refuses other companies\' places', async () => {
    const ids = places.slice(0, 2).map(p => p.id)
    const made = await shore.request('/api/tables', { method: 'POST', body: { name: 'Private', placeIds: ids } })
    const other = await loginAs('otherPlanner')
    expect((await other.request(`/api/tables/${made.body.id}`)).status).toBe(404)
    expect((await other.request(`/api/tables/${made.body.id}/export`)).status).toBe(404)
    expect((await other.request('/api/tables')).body.some((t: any) => t.id === made.body.id)).toBe(false)
    const bad = await shore.request('/api/tables', { method: 'POST', body: { name: 'Foreign', placeIds: [ids[0], 999999] } })
    expect(bad.status).toBe(400)
    expect(bad.body.message).toMatch(/placeIds/)
  })

  it('answers bad input with 400 naming the field', async () => {
    const one = await shore.request('/api/tables', { method: 'POST', body: { name: 'One', placeIds: [places[0].id] } })
    expect(one.status).toBe(400)
    expect(one.body.message).toMatch(/placeIds/)
    const noName = await shore.request('/api/tables', { method: 'POST', body: { name: ' ', placeIds: [places[0].id, places[1].id] } })
    expect(noName.status).toBe(400)
    expect(noName.body.message).toMatch(/name/)
    const radius = await shore.request('/api/tables', { method: 'POST', body: { name: 'R', placeIds: [places[0].id, places[1].id], radiusNm: -1 } })
    expect(radius.status).toBe(400)
    expect((await shore.request('/api/tables/abc')).status).toBe(400)
    const avoid = await shore.request('/api/tables', { method: 'POST', body: { name: 'A', placeIds: [places[0].id, places[1].id], avoid: ['atlantis'] } })
    expect(avoid.status).toBe(400)
    expect(avoid.body.message).toMatch(/avoid\.0: unknown passage "atlantis"/)
    const twice = await shore.request('/api/tables', { method: 'POST', body: { name: 'A', placeIds: [places[0].id, places[1].id], avoid: ['suez', 'suez'] } })
    expect(twice.status).toBe(400)
    expect(twice.body.message).toMatch(/avoid/)
    const notList = await shore.request('/api/tables', { method: 'POST', body: { name: 'A', placeIds: [places[0].id, places[1].id], avoid: 'suez' } })
    expect(notList.status).toBe(400)
    expect(notList.body.message).toMatch(/avoid/)
  })

  it('exports CSV: place names as header, distances to one decimal, source marks, ECA distances, passages and a key', async () => {
    const names = ['Cape of Good Hope offing', 'Fremantle pilot boarding ground', 'Rotterdam', 'New York']
    const made = await shore.request('/api/tables', { method: 'POST', body: { name: 'Export', placeIds: names.map(n => byName(n).id) } })
    const res = await shore.request(`/api/tables/${made.body.id}/export`)
    expect(res.status).toBe(200)
    expect(res.headers.get('content-type')).toMatch(/text\/csv/)
    const lines = String(res.body).split('\r\n')
    const header = lines[0]!.split(',')
    expect(header[0]).toBe('Distance (nm)')
    expect(header.slice(1).sort()).toEqual([...names].sort())
    const table = (await shore.request(`/api/tables/${made.body.id}`)).body
    const n = table.places.length
    const idx = (name: string) => table.places.findIndex((p: any) => p.name === name)
    const rn = pair(idx('Rotterdam'), idx('New York'), n)
    // Each grid starts at its title line; the Rotterdam row of each grid in turn: distance, source, ECA distance, passages.
    const gridRow = (title: string) => {
      const at = lines.findIndex(l => l.startsWith(`${title},`))
      expect(at, title).toBeGreaterThanOrEqual(0)
      return lines.slice(at).find(l => l.startsWith('Rotterdam,'))!.split(',')
    }
    const col = header.indexOf('New York')
    expect(gridRow('Distance (nm)')[col]).toBe(table.matrix.distanceNm[rn].toFixed(1))
    expect(gridRow('Source')[col]).toBe('S')
    expect(gridRow('Inside ECAs (nm)')[col]).toBe(table.matrix.ecaNm[rn].toFixed(1))
    expect(gridRow('Passages')[col]).toBe(table.matrix.via[rn].join(' '))
    expect(lines).toContain('S,computed sea route')
    expect(lines).toContain('dover,Dover Strait')
    expect(lines.some(l => /^P\d+,"approved plan: Cape of Good Hope – Fremantle, held at 40°S"$/.test(l))).toBe(true)
  })
})
