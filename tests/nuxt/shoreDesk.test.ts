import { beforeAll, describe, expect, it } from 'vitest'
import { loginAs, startServer, type Api } from '../support/server'

await startServer()

let shore: Api, planner: Api, admin: Api, other: Api
beforeAll(async () => {
  ;[shore, planner, admin, other] = await Promise.all([loginAs('shore'), loginAs('planner'), loginAs('admin'), loginAs('otherPlanner')])
})

const placeNamed = async (api: Api, name: string) => (await api.request('/api/places')).body.find((p: any) => p.name === name)

describe('place library', () => {
  it('shore creates, edits and deletes a place; the time zone is derived from the position when not given', async () => {
    const created = await shore.request('/api/places', { method: 'POST', body: { name: 'Kobe test berth', kind: 'port', lat: '34°40.5\'N', lon: '135°12.0\'E', unlocode: 'jp ukb' } })
    expect(created.status).toBe(201)
    expect(created.body).toMatchObject({ name: 'Kobe test berth', unlocode: 'JPUKB', timeZone: 'Asia/Tokyo' })
    expect(created.body.lat).toBeCloseTo(34.675, 9)
    const id = created.body.id
    const edited = await shore.request(`/api/places/${id}`, { method: 'PUT', body: { name: 'Kobe test berth', kind: 'anchorage', lat: 34.6, lon: 135.2, timeZone: 'Asia/Tokyo' } })
    expect(edited.status).toBe(200)
    expect(edited.body).toMatchObject({ kind: 'anchorage', lat: 34.6, unlocode: null })
    expect((await shore.request(`/api/places/${id}`, { method: 'DELETE' })).status).toBe(204)
    expect(await placeNamed(shore, 'Kobe test berth')).toBeUndefined()
  })

  it('planner reads the library but may not change it (403)', async () => {
    expect((await planner.request('/api/places')).status).toBe(200)
    const res = await planner.request('/api/places', { method: 'POST', body: { name: 'Nope', kind: 'port', lat: 1, lon: 1 } })
    expect(res.status).toBe(403)
    const yokohama = await placeNamed(planner, 'Yokohama')
    expect((await planner.request(`/api/places/${yokohama.id}`, { method: 'DELETE' })).status).toBe(403)
  })

  it('answers bad input with 400 naming the field, and a duplicate name with 409', async () => {
    const bad = await shore.request('/api/places', { method: 'POST', body: { name: 'Bad', kind: 'harbour', lat: 95, lon: 10, unlocode: 'J1' } })
    expect(bad.status).toBe(400)
    expect(bad.body.message).toMatch(/kind/)
    expect(bad.body.message).toMatch(/lat/)
    const tz = await shore.request('/api/places', { method: 'POST', body: { name: 'Bad tz', kind: 'port', lat: 1, lon: 1, timeZone: 'Mars/Olympus' } })
    expect(tz.status).toBe(400)
    expect(tz.body.message).toMatch(/^timeZone:/)
    const dup = await shore.request('/api/places', { method: 'POST', body: { name: 'yokohama', kind: 'port', lat: 35, lon: 139 } })
    expect(dup.status).toBe(409)
  })

  it('refuses to delete a place a plan departs from (409) and keeps it', async () => {
    const yokohama = await placeNamed(shore, 'Yokohama')
    const res = await shore.request(`/api/places/${yokohama.id}`, { method: 'DELETE' })
    expect(res.status).toBe(409)
    expect(res.body.message).toMatch(/used by plans/)
    expect(await placeNamed(shore, 'Yokohama')).toBeDefined()
  })

  it('keeps places of another company out of reach (404)', async () => {
    const theirs = (await other.request('/api/places')).body[0]
    const mine = (await shore.request('/api/places')).body
    expect(mine.some((p: any) => p.id === theirs.id)).toBe(false)
    const put = await shore.request(`/api/places/${theirs.id}`, { method: 'PUT', body: { name: 'Taken over', kind: 'port', lat: 1, lon: 1 } })
    expect(put.status).toBe(404)
    expect((await shore.request(`/api/places/${theirs.id}`, { method: 'DELETE' })).status).toBe(404)
  })

  it('derives the time zone for a position (Yokohama → Asia/Tokyo, from memory) and rejects a bad latitude', async () => {
    const res = await planner.request('/api/timezone?lat=35.44&lon=139.64')
    expect(res.body).toEqual({ timeZone: 'Asia/Tokyo' })
    const fremantle = await planner.request('/api/timezone?lat=-32.05&lon=115.74')
    expect(fremantle.body.timeZone).toBe('Australia/Perth') // from memory
    const bad = await planner.request('/api/timezone?lat=91&lon=0')
    expect(bad.status).toBe(400)
    expect(bad.body.message).toMatch(/^lat:/)
  })
})

describe('place CSV import', () => {
  const good = [
    'name,kind,latitude,longitude,unlocode,time zone',
    'Hakodate,port,41°47.0\'N,140°43.0\'E,JPHKD,',
    '"Dover Strait, south-west lane",strait,51 00.0N,001 27.0E,,Europe/London',
    'Valparaiso,Port,-33.03,-71.63,CLVAP,America/Santiago',
  ].join('\n')

  it('previews a good file without importing, then commits it in one go', async () => {
    const preview = await shore.request('/api/places/import?mode=preview', { method: 'POST', rawBody: good, headers: { 'content-type': 'text/csv' } })
    expect(preview.status).toBe(200)
    expect(preview.body.errorCount).toBe(0)
    expect(preview.body.rows).toHaveLength(3)
    expect(preview.body.rows[0].place).toMatchObject({ name: 'Hakodate', timeZone: 'Asia/Tokyo' })
    expect(await placeNamed(shore, 'Hakodate')).toBeUndefined()
    const commit = await shore.request('/api/places/import?mode=commit', { method: 'POST', rawBody: good, headers: { 'content-type': 'text/csv' } })
    expect(commit.status).toBe(200)
    expect(commit.body.imported).toBe(3)
    expect(await placeNamed(shore, 'Dover Strait, south-west lane')).toMatchObject({ kind: 'strait', timeZone: 'Europe/London' })
    expect((await placeNamed(shore, 'Valparaiso')).kind).toBe('port')
  })

  it('lists bad rows with their line numbers and imports nothing', async () => {
    const bad = [
      'name,kind,latitude,longitude,unlocode',
      'Good row,port,10,20,',
      ',port,10,20,',
      'Bad lat,port,95 00N,20,',
      'Bad kind,harbour,10,20,XX1',
      'Good row,port,11,21,',
    ].join('\r\n')
    const before = (await shore.request('/api/places')).body.length
    const preview = await shore.request('/api/places/import?mode=preview', { method: 'POST', rawBody: bad, headers: { 'content-type': 'text/csv' } })
    expect(preview.status).toBe(200)
    const errors = preview.body.rows.flatMap((r: any) => r.errors)
    expect(errors.some((e: string) => /^line 3: name:/.test(e))).toBe(true)
    expect(errors.some((e: string) => /^line 4: lat:/.test(e))).toBe(true)
    expect(errors.some((e: string) => /^line 5: kind:/.test(e))).toBe(true)
    expect(errors.some((e: string) => /^line 5: unlocode:/.test(e))).toBe(true)
    expect(errors.some((e: string) => /^line 6: name: .*also on line 2/.test(e))).toBe(true)
    const commit = await shore.request('/api/places/import?mode=commit', { method: 'POST', rawBody: bad, headers: { 'content-type': 'text/csv' } })
    expect(commit.status).toBe(400)
    expect(commit.body.message).toMatch(/nothing was imported/)
    expect((await shore.request('/api/places')).body.length).toBe(before)
    expect(await placeNamed(shore, 'Good row')).toBeUndefined()
  })

  it('accepts a multipart upload and names a missing header column', async () => {
    const form = new FormData()
    form.append('file', new Blob(['name,kind,latitude\nX,port,1\n'], { type: 'text/csv' }), 'places.csv')
    const res = await fetch((await import('../support/server')).url('/api/places/import?mode=preview'), { method: 'POST', body: form, headers: { cookie: shore.cookie } })
    const body = await res.json()
    expect(res.status).toBe(200)
    expect(body.fileErrors[0]).toMatch(/line 1: header is missing lon/)
    expect((await planner.request('/api/places/import?mode=preview', { method: 'POST', rawBody: good, headers: { 'content-type': 'text/csv' } })).status).toBe(403)
    expect((await shore.request('/api/places/import?mode=later', { method: 'POST', rawBody: good, headers: { 'content-type': 'text/csv' } })).status).toBe(400)
  })
})

describe('vessels and fuel data', () => {
  let vessels: any[]
  beforeAll(async () => { vessels = (await shore.request('/api/vessels')).body })
  const vesselNamed = (name: string) => vessels.find(v => v.name === name)

  it('returns particulars, crew, fuel points and a near-cubic fit for a demo vessel', async () => {
    const res = await planner.request(`/api/vessels/${vesselNamed('Kestrel Dawn').id}`)
    expect(res.status).toBe(200)
    expect(res.body).toMatchObject({ name: 'Kestrel Dawn', imoNumber: '9381201', masterName: 'Capt. Mirela Oduya' })
    expect(res.body.crew.length).toBeGreaterThanOrEqual(4)
    expect(res.body.fuelPoints.length).toBeGreaterThanOrEqual(4)
    // The demo data is invented near c·V³ (common practice): k near 3, a tight fit.
    expect(res.body.fuelCurve.k).toBeGreaterThan(2.7)
    expect(res.body.fuelCurve.k).toBeLessThan(3.3)
    expect(res.body.fuelCurve.r2).toBeGreaterThan(0.99)
  })

  it('rejects bad fuel data with 400 naming the field and changes nothing', async () => {
    const id = vesselNamed('Bight Voyager').id
    const before = (await shore.request(`/api/vessels/${id}`)).body.fuelPoints
    const cases: [unknown, RegExp][] = [
      [{ points: [{ speedKn: 12, tonnesPerDay: 20 }] }, /points: .*at least 2/],
      [{ points: [{ speedKn: 12, tonnesPerDay: 20 }, { speedKn: -1, tonnesPerDay: 5 }] }, /points\.1\.speedKn: must be from 0\.1 to 60 kn/],
      [{ points: [{ speedKn: 12, tonnesPerDay: 20 }, { speedKn: 13, tonnesPerDay: 0 }] }, /points\.1\.tonnesPerDay/],
      [{ points: [{ speedKn: 12, tonnesPerDay: 20 }, { speedKn: 12, tonnesPerDay: 25 }] }, /points\.1\.speedKn: .*twice/],
      [{ points: 'lots' }, /^points:/],
    ]
    for (const [body, message] of cases) {
      const res = await shore.request(`/api/vessels/${id}/fuel`, { method: 'PUT', body })
      expect(res.status).toBe(400)
      expect(res.body.message).toMatch(message)
    }
    expect((await shore.request(`/api/vessels/${id}`)).body.fuelPoints).toEqual(before)
  })

  it('lets shore replace fuel data, and refuses a planner (403)', async () => {
    const id = vesselNamed('Bight Voyager').id
    const before = (await shore.request(`/api/vessels/${id}`)).body.fuelPoints
    const points = [{ speedKn: 10, tonnesPerDay: 12 }, { speedKn: 12, tonnesPerDay: 20.7 }, { speedKn: 14, tonnesPerDay: 32.9 }]
    const res = await shore.request(`/api/vessels/${id}/fuel`, { method: 'PUT', body: { points } })
    expect(res.status).toBe(200)
    expect(res.body.fuelPoints).toEqual(points)
    expect((await planner.request(`/api/vessels/${id}/fuel`, { method: 'PUT', body: { points } })).status).toBe(403)
    await shore.request(`/api/vessels/${id}/fuel`, { method: 'PUT', body: { points: before } })
  })

  it('lets the admin edit particulars and the crew list, with the IMO check digit and master checked', async () => {
    const v = (await admin.request(`/api/vessels/${vesselNamed('Kestrel Meridian').id}`)).body
    const body = { name: v.name, imoNumber: 'IMO 9274563', callSign: v.callSign, serviceSpeedKn: 15.5, masterUserId: v.masterUserId }
    const ok = await admin.request(`/api/vessels/${v.id}`, { method: 'PUT', body })
    expect(ok.status).toBe(200)
    expect(ok.body.serviceSpeedKn).toBe(15.5)
    const badImo = await admin.request(`/api/vessels/${v.id}`, { method: 'PUT', body: { ...body, imoNumber: '9274564' } })
    expect(badImo.status).toBe(400)
    expect(badImo.body.message).toMatch(/^imoNumber: check digit/)
    const planner = (await admin.request('/api/admin/users')).body.find((u: any) => u.role === 'planner')
    const notMaster = await admin.request(`/api/vessels/${v.id}`, { method: 'PUT', body: { ...body, masterUserId: planner.id } })
    expect(notMaster.status).toBe(400)
    expect(notMaster.body.message).toMatch(/^masterUserId:/)
    expect((await shore.request(`/api/vessels/${v.id}`, { method: 'PUT', body })).status).toBe(403)

    const crew = [...v.crew.map(({ name, rank, email }: any) => ({ name, rank, email })), { name: 'Noor Halvorsen', rank: 'Third Officer', email: 'Noor.Halvorsen@example.com' }]
    const saved = await admin.request(`/api/vessels/${v.id}/crew`, { method: 'PUT', body: { crew } })
    expect(saved.status).toBe(200)
    expect(saved.body.crew.at(-1)).toMatchObject({ name: 'Noor Halvorsen', email: 'noor.halvorsen@example.com' })
    const badCrew = await admin.request(`/api/vessels/${v.id}/crew`, { method: 'PUT', body: { crew: [{ name: 'X', rank: 'AB', email: 'not-mail' }] } })
    expect(badCrew.status).toBe(400)
    expect(badCrew.body.message).toMatch(/^crew\.0\.email:/)
    expect((await admin.request(`/api/vessels/${v.id}`)).body.crew).toHaveLength(crew.length)
  })

  it('answers 404 for another company\'s vessel', async () => {
    const theirs = (await other.request('/api/vessels')).body[0]
    expect((await shore.request(`/api/vessels/${theirs.id}`)).status).toBe(404)
    expect((await shore.request(`/api/vessels/${theirs.id}/fuel`, { method: 'PUT', body: { points: [{ speedKn: 10, tonnesPerDay: 10 }, { speedKn: 12, tonnesPerDay: 17 }] } })).status).toBe(404)
  })
})

describe('fuel per plan and the company reserve', () => {
  it('adds fuel per leg, total and reserve to GET /api/plans/:id', async () => {
    const plans = (await planner.request('/api/plans')).body
    const plan = plans.find((p: any) => p.vesselName === 'Kestrel Dawn')
    const view = (await planner.request(`/api/plans/${plan.id}`)).body
    expect(view.fuel).not.toBeNull()
    expect(view.fuel.legTonnes).toHaveLength(view.legs.length)
    const sum = view.fuel.legTonnes.reduce((a: number, b: number) => a + b, 0)
    expect(view.fuel.totalTonnes).toBeCloseTo(sum, 9)
    // fuel = c·V^k · hours / 24 (domain.md) for the first leg
    const leg = view.legs[0]
    expect(view.fuel.legTonnes[0]).toBeCloseTo(view.fuel.curve.c * leg.speedKn ** view.fuel.curve.k * leg.hours / 24, 9)
    expect(view.fuel.withReserveTonnes).toBeCloseTo(view.fuel.totalTonnes + view.fuel.reserveTonnes, 9)
  })

  it('lets the admin set the reserve in days; the plan view follows; bad settings are 400', async () => {
    const plan = (await planner.request('/api/plans')).body.find((p: any) => p.vesselName === 'Kestrel Dawn')
    const original = (await admin.request('/api/company/settings')).body
    const put = await admin.request('/api/company/settings', { method: 'PUT', body: { ...original, reserve: { kind: 'days', value: 2, speedKn: 12 } } })
    expect(put.status).toBe(200)
    const fuel = (await planner.request(`/api/plans/${plan.id}`)).body.fuel
    expect(fuel.reserve).toEqual({ kind: 'days', value: 2, speedKn: 12 })
    expect(fuel.reserveTonnes).toBeCloseTo(2 * fuel.curve.c * 12 ** fuel.curve.k, 9)
    const bad = await admin.request('/api/company/settings', { method: 'PUT', body: { ...original, reserve: { kind: 'percent', value: -5 } } })
    expect(bad.status).toBe(400)
    expect(bad.body.message).toMatch(/^reserve\.value:/)
    expect((await shore.request('/api/company/settings', { method: 'PUT', body: original })).status).toBe(403)
    await admin.request('/api/company/settings', { method: 'PUT', body: original })
  })
})

describe('admin users', () => {
  it('lists the company\'s users and creates one who can sign in', async () => {
    const list = await admin.request('/api/admin/users')
    expect(list.status).toBe(200)
    expect(list.body.every((u: any) => u.email.endsWith('kestrel-bight.example'))).toBe(true)
    expect(list.body[0]).not.toHaveProperty('passwordHash')
    const body = { name: 'Selma Vantongeren', email: 'Selma.V@kestrel-bight.example', role: 'shore', password: 'long-enough-secret' }
    const created = await admin.request('/api/admin/users', { method: 'POST', body })
    expect(created.status).toBe(201)
    expect(created.body).toMatchObject({ email: 'selma.v@kestrel-bight.example', role: 'shore' })
    const login = await fetch((await import('../support/server')).url('/api/auth/login'), { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ email: body.email, password: body.password }) })
    expect(login.status).toBe(200)
    expect((await admin.request('/api/admin/users', { method: 'POST', body })).status).toBe(409)
    const short = await admin.request('/api/admin/users', { method: 'POST', body: { ...body, email: 'x@kestrel-bight.example', password: 'short' } })
    expect(short.status).toBe(400)
    expect(short.body.message).toMatch(/^password:/)
    expect((await shore.request('/api/admin/users')).status).toBe(403)
  })
})
