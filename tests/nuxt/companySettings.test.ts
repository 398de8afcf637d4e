// PUT /api/company/settings (admin only) and PUT /api/vessels/:id/fuel-grades (shore desk): who may
// write, that one company's write never reaches another, and that bad input is a 400 naming the
// field with nothing stored changed. Other files read the Kestrel Bight settings while this one runs,
// so every write here leaves the figures they read as they were (an extra, unused grade; the grades a
// vessel already burns) and the original settings are put back.
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { loginAs, startServer, type Api } from '../support/server'
import { expectStatus, vesselIdNamed } from '../support/records'

await startServer()

let admin: Api
let shore: Api
let planner: Api
let original: any

beforeAll(async () => {
  admin = await loginAs('admin')
  shore = await loginAs('shore')
  planner = await loginAs('planner')
  original = await expectStatus(admin.request('/api/company/settings'), 200)
})
afterAll(async () => { await admin.request('/api/company/settings', { method: 'PUT', body: original }) })

describe('company settings', () => {
  it('the admin adds a bunker price and reads it back; other roles are refused and the settings stay', async () => {
    const extra = { grade: `BIO${process.pid % 1000}`, pricePerTonne: 912 }
    const body = { ...original, fuelPrices: [...original.fuelPrices, extra] }
    const saved = await expectStatus(admin.request('/api/company/settings', { method: 'PUT', body }), 200)
    expect(saved.fuelPrices).toContainEqual(extra)
    expect((await expectStatus(planner.request('/api/company/settings'), 200)).fuelPrices).toContainEqual(extra)
    for (const who of [shore, planner]) expect((await who.request('/api/company/settings', { method: 'PUT', body: original })).status).toBe(403)
    expect((await expectStatus(admin.request('/api/company/settings'), 200)).fuelPrices).toContainEqual(extra)
    await expectStatus(admin.request('/api/company/settings', { method: 'PUT', body: original }), 200)
  })

  it('never shows one company the other\'s settings', async () => {
    const extra = { grade: `SCOPE${process.pid % 1000}`, pricePerTonne: 1 }
    await expectStatus(admin.request('/api/company/settings', { method: 'PUT', body: { ...original, fuelPrices: [...original.fuelPrices, extra] } }), 200)
    const other = await loginAs('otherPlanner')
    const theirs = await expectStatus(other.request('/api/company/settings'), 200)
    expect(theirs.fuelPrices ?? []).not.toContainEqual(extra)
    await expectStatus(admin.request('/api/company/settings', { method: 'PUT', body: original }), 200)
  })

  it('refuses bad settings with 400 naming the field, and stores nothing', async () => {
    const cases: [Record<string, unknown>, string][] = [
      [{ reserve: { kind: 'percent', value: 101 } }, 'reserve.value'],
      [{ reserve: { kind: 'days', value: 2 } }, 'reserve.speedKn'],
      [{ reserve: { kind: 'litres', value: 2 } }, 'reserve'],
      [{ helmDelayS: -1 }, 'helmDelayS'],
      [{ helmDelayS: 'ten' }, 'helmDelayS'],
      [{ currency: 'usd' }, 'currency'],
      [{ mailFrom: 'Kestrel <not an address>' }, 'mailFrom'],
      [{ fuelPrices: [{ grade: '', pricePerTonne: 500 }] }, 'fuelPrices.0.grade'],
      [{ fuelPrices: [{ grade: 'VLSFO', pricePerTonne: -1 }] }, 'fuelPrices.0.pricePerTonne'],
    ]
    for (const [change, field] of cases) {
      const res = await admin.request('/api/company/settings', { method: 'PUT', body: { ...original, ...change } })
      expect(res.status, field).toBe(400)
      expect(res.body.message, field).toContain(field)
    }
    expect(await expectStatus(admin.request('/api/company/settings'), 200)).toEqual(original)
  })
})

describe('vessel fuel grades', () => {
  let vesselId = 0
  beforeAll(async () => { vesselId = await vesselIdNamed(admin, 'Kestrel Meridian') })

  it('the shore desk sets the grades and the vessel page reads them; planners are refused', async () => {
    const before = (await expectStatus(shore.request(`/api/vessels/${vesselId}`), 200)).fuelGrades
    // The demo seed gives Kestrel Meridian VLSFO outside and LSMGO inside ECAs (db/seeds/04_fuel_prices.ts).
    expect(before).toEqual({ outside: 'VLSFO', insideEca: 'LSMGO', stored: true })
    const saved = await expectStatus(shore.request(`/api/vessels/${vesselId}/fuel-grades`, { method: 'PUT', body: { outside: ' VLSFO ', insideEca: 'LSMGO' } }), 200)
    expect(saved.fuelGrades).toEqual({ outside: 'VLSFO', insideEca: 'LSMGO', stored: true })
    expect((await admin.request(`/api/vessels/${vesselId}/fuel-grades`, { method: 'PUT', body: { outside: 'VLSFO', insideEca: 'LSMGO' } })).status).toBe(200)
    for (const who of [planner, await loginAs('master')])
      expect((await who.request(`/api/vessels/${vesselId}/fuel-grades`, { method: 'PUT', body: { outside: 'HFO', insideEca: 'MGO' } })).status).toBe(403)
    expect((await expectStatus(planner.request(`/api/vessels/${vesselId}`), 200)).fuelGrades.insideEca).toBe('LSMGO')
  })

  it('a vessel without grades of its own shows the defaults, marked as such', async () => {
    const other = await loginAs('otherPlanner')
    const theirs = await expectStatus<{ id: number }[]>(other.request('/api/vessels'), 200)
    const detail = await expectStatus(other.request(`/api/vessels/${theirs[0]!.id}`), 200)
    // DEFAULT_FUEL_GRADES (shared/utils/zones/fuelSplit.ts): VLSFO at sea, MGO in ECAs, common practice since 2020.
    expect(detail.fuelGrades).toEqual({ outside: 'VLSFO', insideEca: 'MGO', stored: false })
  })

  it('another company\'s vessel does not exist for the caller, and bad grades are 400 naming the field', async () => {
    const other = await loginAs('otherPlanner')
    const theirs = (await expectStatus<{ id: number }[]>(other.request('/api/vessels'), 200))[0]!.id
    expect((await shore.request(`/api/vessels/${theirs}/fuel-grades`, { method: 'PUT', body: { outside: 'HFO', insideEca: 'MGO' } })).status).toBe(404)
    const cases: [unknown, string][] = [
      [{ outside: '', insideEca: 'MGO' }, 'outside'],
      [{ outside: 'VLSFO' }, 'insideEca'],
      [{ outside: 'VLSFO', insideEca: 'M'.repeat(25) }, 'insideEca'],
      [{ outside: 7, insideEca: 'MGO' }, 'outside'],
      [{ outside: 'VLSFO', insideEca: 'MGO', scrubber: true }, 'scrubber'],
    ]
    for (const [body, field] of cases) {
      const res = await shore.request(`/api/vessels/${vesselId}/fuel-grades`, { method: 'PUT', body })
      expect(res.status, field).toBe(400)
      expect(res.body.message, field).toContain(field)
    }
    expect((await shore.request(`/api/vessels/abc/fuel-grades`, { method: 'PUT', body: { outside: 'HFO', insideEca: 'MGO' } })).status).toBe(400)
    expect((await expectStatus(shore.request(`/api/vessels/${vesselId}`), 200)).fuelGrades).toEqual({ outside: 'VLSFO', insideEca: 'LSMGO', stored: true })
  })
})
