// Voyage monitoring through the API: position reports on an approved plan worked out against it
// (cross-track sign and along-track against GeodSolve/RhumbSolve as the oracle), who may report,
// read and delete, and bad input refused naming the field with nothing stored.
import { describe, expect, it } from 'vitest'
import { demoPlans } from '../../db/seeds/demoData'
import { runOracle, fmt } from '../unit/support/oracle'
import { expectStatus, makePlan } from '../support/records'
import { loginAs, startServer, type Api } from '../support/server'

await startServer()

const NM = 1852
const seeded = demoPlans.find(p => p.title.startsWith('Cape of Good Hope'))!
// The seeded Indian Ocean plan's track (db/seeds/demoData.ts, invented), sailed by Kestrel Meridian.
const WAYPOINTS = seeded.waypoints.map(([name, lat, lon, method]) => ({ name, lat, lon, method }))
const DEPARTURE = '2026-11-24T06:00:00Z'
const hoursAfter = (h: number) => new Date(Date.parse(DEPARTURE) + h * 3_600_000).toISOString()

/** GeodSolve direct: the point `s` metres from (lat, lon) on azimuth `azi`. */
function geodDirect(lat: number, lon: number, azi: number, s: number) {
  const [[lat2, lon2, azi2]] = runOracle('GeodSolve', ['-p', '12'], [`${fmt(lat)} ${fmt(lon)} ${fmt(azi)} ${fmt(s, 6)}`]) as [[number, number, number]]
  return { lat: lat2, lon: lon2, azi2 }
}
/** GeodSolve inverse: distance (m) and azimuths from a to b. */
function geodInverse(a: { lat: number, lon: number }, b: { lat: number, lon: number }) {
  const [[azi1, azi2, s12]] = runOracle('GeodSolve', ['-i', '-p', '12'], [`${fmt(a.lat)} ${fmt(a.lon)} ${fmt(b.lat)} ${fmt(b.lon)}`]) as [[number, number, number]]
  return { azi1, azi2, s12 }
}
/** RhumbSolve inverse and direct. */
function rhumbInverse(a: { lat: number, lon: number }, b: { lat: number, lon: number }) {
  const [[azi12, s12]] = runOracle('RhumbSolve', ['-i', '-p', '12'], [`${fmt(a.lat)} ${fmt(a.lon)} ${fmt(b.lat)} ${fmt(b.lon)}`]) as [[number, number]]
  return { azi12, s12 }
}
function rhumbDirect(lat: number, lon: number, azi: number, s: number) {
  const [[lat2, lon2]] = runOracle('RhumbSolve', ['-p', '12'], [`${fmt(lat)} ${fmt(lon)} ${fmt(azi)} ${fmt(s, 6)}`]) as [[number, number]]
  return { lat: lat2, lon: lon2 }
}

let planner: Api, master: Api, reliefMaster: Api, shore: Api, otherPlanner: Api
let planId: number
let legs: { index: number, method: string, distanceNm: number, cumulativeNm: number, from: { lat: number, lon: number }, to: { lat: number, lon: number } }[]
let totalNm: number

const report = (body: Record<string, unknown>, who: Api = planner, id = planId) => who.request(`/api/plans/${id}/reports`, { method: 'POST', body })

describe('position reports on the Indian Ocean voyage', () => {
  it('sets up an approved copy of the seeded plan', async () => {
    ;[planner, master, reliefMaster, shore, otherPlanner] = await Promise.all([loginAs('planner'), loginAs('master'), loginAs('reliefMaster'), loginAs('shore'), loginAs('otherPlanner')])
    planId = await makePlan('approved', { planner, master }, { vesselName: 'Kestrel Meridian', waypoints: WAYPOINTS, departureUtc: DEPARTURE })
    const view = await expectStatus(planner.request(`/api/plans/${planId}`), 200)
    legs = view.legs
    totalNm = view.totals.distanceNm
    expect(legs.map(l => l.method)).toEqual(['geodesic', 'rhumb', 'rhumb', 'rhumb', 'geodesic'])
  })

  it('20 nm to starboard of the first (geodesic) leg: +20 nm, along-track the GeodSolve distance to the foot', async () => {
    const leg = legs[0]!
    // Foot 300 nm along the geodesic, then 20 nm on the perpendicular to starboard (course + 90°), both by GeodSolve.
    const start = geodInverse(leg.from, leg.to)
    const foot = geodDirect(leg.from.lat, leg.from.lon, start.azi1, 300 * NM)
    const p = geodDirect(foot.lat, foot.lon, foot.azi2 + 90, 20 * NM)
    const r = await expectStatus(report({ timeUtc: hoursAfter(20), lat: p.lat, lon: p.lon }), 201)
    expect(r.legIndex).toBe(0)
    expect(r.crossTrackNm).toBeCloseTo(20, 6) // GeodSolve: 20 nm on the perpendicular
    expect(r.alongTrackNm).toBeCloseTo(300, 6) // GeodSolve: 300 nm from departure to the foot
    expect(r.distanceToGoNm).toBeCloseTo(totalNm - 300, 6) // leg table total
    expect(r.speedMadeGoodKn).toBeCloseTo(300 / 20, 6) // 300 nm in 20 h since departure
    expect(r.flags).toContain('off-track') // 20 nm beyond the 5 nm default corridor (company default, common practice)
  })

  it('on the 40°S parallel, 5′ of latitude north: 5.0 nm to port; along-track from RhumbSolve', async () => {
    const leg = legs[1]! // 40S 030E → 40S 060E, a rhumb leg along the parallel, eastbound
    // 5′ of latitude at 40° by the meridian-arc formula M = a(1−e²)/(1−e² sin²φ)^1.5 (Snyder 1987, eq. 4-18):
    // a = 6378137 m, e² = 0.00669438; 1 − e² sin²40° = 0.997234, ^1.5 = 0.995855; M = 6335439 / 0.995855 = 6361811 m/rad;
    // 5′ = 0.00145444 rad → 9252.9 m = 4.996 nm, i.e. 5.0 nm to port (north of an eastbound track).
    const meridianArc = geodInverse({ lat: -40, lon: 45 }, { lat: -40 + 5 / 60, lon: 45 }).s12 / NM
    expect(meridianArc).toBeCloseTo(4.996, 3)
    const r = await expectStatus(report({ timeUtc: hoursAfter(60), lat: '39°55.0′S', lon: '045°00.0′E' }), 201)
    expect(r.legIndex).toBe(1)
    expect(r.crossTrackNm).toBeCloseTo(-meridianArc, 6)
    expect(r.crossTrackNm.toFixed(1)).toBe('-5.0')
    const alongLeg = rhumbInverse(leg.from, { lat: -40, lon: 45 }).s12 / NM
    expect(r.alongTrackNm).toBeCloseTo(legs[0]!.distanceNm + alongLeg, 6) // leg table + RhumbSolve
  })

  it('10 nm to port of the geodesic leg to Fremantle: −10 nm, along-track the leg table plus the GeodSolve distance', async () => {
    const leg = legs[4]! // 40S 100E → Fremantle pilot boarding ground, geodesic; the point 200 nm along it, 10 nm to port
    const start = geodInverse(leg.from, leg.to)
    const foot = geodDirect(leg.from.lat, leg.from.lon, start.azi1, 200 * NM)
    const p = geodDirect(foot.lat, foot.lon, foot.azi2 - 90, 10 * NM)
    const r = await expectStatus(report({ timeUtc: hoursAfter(180), lat: p.lat, lon: p.lon }), 201)
    expect(r.legIndex).toBe(4)
    expect(r.crossTrackNm).toBeCloseTo(-10, 6) // GeodSolve: 10 nm on the perpendicular, to port
    expect(r.alongTrackNm).toBeCloseTo(legs[3]!.cumulativeNm + 200, 6)
    expect(r.distanceToGoNm).toBeCloseTo(totalNm - legs[3]!.cumulativeNm - 200, 6)
  })

  it('lists the reports in time order with the same working', async () => {
    const list = await expectStatus<any[]>(shore.request(`/api/plans/${planId}/reports`), 200)
    expect(list.map(r => r.legIndex)).toEqual([0, 1, 4])
    const voyage = await expectStatus(shore.request(`/api/plans/${planId}/voyage`), 200)
    expect(voyage.reports).toEqual(list)
    expect(voyage.canReport).toBe(false)
    expect(voyage.totalNm).toBeCloseTo(totalNm, 9)
  })
})

describe('a rhumb leg off a parallel, against RhumbSolve', () => {
  it('cross-track sign and along-track on a south-easterly rhumb leg', async () => {
    // An invented rhumb leg across the Tasman Sea, clear of land.
    const wps = [{ name: 'Tasman A', lat: -35, lon: 155, method: 'rhumb' }, { name: 'Tasman B', lat: -39, lon: 165, method: 'rhumb' }]
    const id = await makePlan('approved', { planner, master }, { vesselName: 'Kestrel Meridian', waypoints: wps, departureUtc: DEPARTURE })
    const { azi12, s12 } = rhumbInverse(wps[0]!, wps[1]!)
    const foot = rhumbDirect(wps[0]!.lat, wps[0]!.lon, azi12, s12 * 0.4)
    // The geodesic leaving the foot at right angles to the rhumb line (course + 90° = starboard) for 8 nm.
    const p = geodDirect(foot.lat, foot.lon, azi12 + 90, 8 * NM)
    const r = await expectStatus(report({ timeUtc: hoursAfter(10), lat: p.lat, lon: p.lon }, planner, id), 201)
    expect(r.crossTrackNm).toBeCloseTo(8, 5) // GeodSolve perpendicular from a RhumbSolve foot
    expect(r.alongTrackNm).toBeCloseTo(s12 * 0.4 / NM, 5) // RhumbSolve
  })
})

describe('who may report, and what is refused', () => {
  it('another company sees no such plan; shore reads but may not report; another vessel\'s master may not', async () => {
    expect((await otherPlanner.request(`/api/plans/${planId}/voyage`)).status).toBe(404)
    expect((await otherPlanner.request(`/api/plans/${planId}/reports`)).status).toBe(404)
    expect((await report({ timeUtc: hoursAfter(181), lat: -35, lon: 110 }, otherPlanner)).status).toBe(404)
    expect((await report({ timeUtc: hoursAfter(181), lat: -35, lon: 110 }, shore)).status).toBe(403)
    expect((await report({ timeUtc: hoursAfter(181), lat: -35, lon: 110 }, reliefMaster)).status).toBe(403)
  })

  it('a plan not approved: 409', async () => {
    const draft = await makePlan('submitted', { planner }, { vesselName: 'Kestrel Meridian', waypoints: WAYPOINTS, departureUtc: DEPARTURE })
    expect((await report({ timeUtc: hoursAfter(1), lat: -35, lon: 19 }, planner, draft)).status).toBe(409)
  })

  it('bad time or position: 400 naming the field, nothing stored', async () => {
    const before = await expectStatus<any[]>(planner.request(`/api/plans/${planId}/reports`), 200)
    const cases: [Record<string, unknown>, string][] = [
      [{ timeUtc: hoursAfter(100), lat: -40, lon: 50 }, 'timeUtc'], // before the latest report (180 h)
      [{ timeUtc: hoursAfter(180), lat: -40, lon: 50 }, 'timeUtc'], // the same time as the latest
      [{ timeUtc: new Date(Date.now() + 86_400_000).toISOString(), lat: -40, lon: 50 }, 'timeUtc'], // tomorrow
      [{ timeUtc: '2026-11-23T06:00:00Z', lat: -40, lon: 50 }, 'timeUtc'], // before departure
      [{ timeUtc: 'yesterday', lat: -40, lon: 50 }, 'timeUtc'],
      [{ timeUtc: hoursAfter(190), lat: '95°00.0′S', lon: 50 }, 'lat'],
      [{ timeUtc: hoursAfter(190), lat: -40, lon: 'east' }, 'lon'],
      [{ timeUtc: hoursAfter(190), lat: -40, lon: 50, fuelRobT: -1 }, 'fuelRobT'],
      [{ timeUtc: hoursAfter(190), lat: -40, lon: 50, speedKn: 99 }, 'speedKn'],
      [{ timeUtc: hoursAfter(190), lat: -40, lon: 50, remarks: 'x'.repeat(501) }, 'remarks'],
    ]
    for (const [body, field] of cases) {
      const r = await report(body)
      expect(r.status, JSON.stringify(body)).toBe(400)
      expect(r.body.message, JSON.stringify(body)).toMatch(new RegExp(`^${field}`))
    }
    expect(await expectStatus(planner.request(`/api/plans/${planId}/reports`), 200)).toEqual(before)
  })

  it('only the vessel\'s master deletes a report, and the history records it', async () => {
    const list = await expectStatus<any[]>(master.request(`/api/plans/${planId}/reports`), 200)
    const last = list.at(-1)!
    expect((await planner.request(`/api/plans/${planId}/reports/${last.id}`, { method: 'DELETE' })).status).toBe(403)
    expect((await reliefMaster.request(`/api/plans/${planId}/reports/${last.id}`, { method: 'DELETE' })).status).toBe(403)
    expect((await master.request(`/api/plans/${planId}/reports/${last.id}`, { method: 'DELETE' })).status).toBe(204)
    expect((await master.request(`/api/plans/${planId}/reports/${last.id}`, { method: 'DELETE' })).status).toBe(404)
    const after = await expectStatus<any[]>(master.request(`/api/plans/${planId}/reports`), 200)
    expect(after.map(r => r.id)).toEqual(list.slice(0, -1).map(r => r.id))
    const view = await expectStatus(master.request(`/api/plans/${planId}`), 200)
    expect(view.events.at(-1)).toMatchObject({ kind: 'report-deleted', userName: expect.any(String) })
  })
})

/** An RMC sentence for a time and position, with its NMEA 0183 checksum (XOR of the characters between $ and *, IEC 61162-1). */
function rmc(t: number, lat: number, lon: number) {
  const d = new Date(t)
  const two = (n: number) => String(n).padStart(2, '0')
  const dm = (v: number, w: number) => `${String(Math.floor(Math.abs(v))).padStart(w, '0')}${(Math.abs(v) % 1 * 60).toFixed(4).padStart(7, '0')}`
  const body = `GPRMC,${two(d.getUTCHours())}${two(d.getUTCMinutes())}${two(d.getUTCSeconds())},A,${dm(lat, 2)},${lat < 0 ? 'S' : 'N'},${dm(lon, 3)},${lon < 0 ? 'W' : 'E'},12.0,090.0,${two(d.getUTCDate())}${two(d.getUTCMonth() + 1)}${two(d.getUTCFullYear() % 100)},,`
  let x = 0
  for (const ch of body) x ^= ch.charCodeAt(0)
  return `$${body}*${x.toString(16).toUpperCase().padStart(2, '0')}`
}

function upload(text: string, fields: Record<string, string>) {
  const form = new FormData()
  form.append('file', new Blob([text], { type: 'text/plain' }), 'track.nmea')
  for (const [k, v] of Object.entries(fields)) form.append(k, v)
  return form
}

describe('track log import', () => {
  // Along the 35°S parallel of an invented Tasman Sea leg, a fix every 10 minutes for 6 hours.
  const wps = [{ name: 'Tasman C', lat: -35, lon: 155, method: 'rhumb' }, { name: 'Tasman D', lat: -35, lon: 165, method: 'rhumb' }]
  const t0 = Date.parse(DEPARTURE)
  const fixes = Array.from({ length: 37 }, (_, i) => rmc(t0 + i * 600_000, -35, 155 + i * 2 / 49.2 / 1))
  let id = 0

  it('previews a log with a corrupt line by its number and writes nothing; create needs skipProblems', async () => {
    id = await makePlan('approved', { planner, master }, { vesselName: 'Kestrel Meridian', waypoints: wps, departureUtc: DEPARTURE })
    const lines = [...fixes]
    lines[4] = lines[4]!.replace(',A,', ',A,1') // a changed field under the old checksum
    const text = lines.join('\n')
    const importUrl = `/api/plans/${id}/reports/import`
    const preview = await expectStatus(planner.request(importUrl, { method: 'POST', rawBody: upload(text, { mode: 'preview', intervalMin: '60' }) }), 200)
    expect(preview.problems).toEqual(['line 5: RMC checksum does not match the sentence'])
    expect(preview.fixCount).toBe(36)
    // 06:00 … 12:00 every 10 min: the first fix of each hour, 06:00 … 12:00 → 7 reports
    expect(preview.reports.map((r: any) => r.timeUtc.slice(11, 16))).toEqual(['06:00', '07:00', '08:00', '09:00', '10:00', '11:00', '12:00'])
    expect(await expectStatus(planner.request(`/api/plans/${id}/reports`), 200)).toEqual([])
    const refused = await planner.request(importUrl, { method: 'POST', rawBody: upload(text, { mode: 'create' }) })
    expect(refused.status).toBe(400)
    expect(refused.body.message).toMatch(/^file: 1 line\(s\) cannot be used \(line 5: /)
    const created = await expectStatus(planner.request(importUrl, { method: 'POST', rawBody: upload(text, { mode: 'create', skipProblems: 'true' }) }), 200)
    expect(created.created).toBe(7)
    const voyage = await expectStatus(shore.request(`/api/plans/${id}/voyage`), 200)
    expect(voyage.reports.map((r: any) => r.source)).toEqual(Array(7).fill('import'))
    expect(voyage.tracks).toHaveLength(1)
    expect(voyage.tracks[0].pointCount).toBe(36)
    // On the parallel itself: no cross-track (Snyder 1987 eq. 3-21 gives 0 for equal latitudes).
    expect(Math.max(...voyage.reports.map((r: any) => Math.abs(r.crossTrackNm)))).toBeLessThan(1e-6)
    // A second import of the same log adds nothing: every fix is at or before the latest report.
    const again = await planner.request(importUrl, { method: 'POST', rawBody: upload(text, { mode: 'create', skipProblems: 'true' }) })
    expect(again.status).toBe(400)
    expect(again.body.message).toMatch(/^file: no fix/)
  })

  it('refuses a bad mode or interval naming the field, and a shore user', async () => {
    const importUrl = `/api/plans/${id}/reports/import`
    const bad = await planner.request(importUrl, { method: 'POST', rawBody: upload(fixes.join('\n'), { mode: 'later' }) })
    expect(bad.status).toBe(400)
    expect(bad.body.message).toMatch(/^mode: /)
    const interval = await planner.request(importUrl, { method: 'POST', rawBody: upload(fixes.join('\n'), { mode: 'preview', intervalMin: '0' }) })
    expect(interval.status).toBe(400)
    expect(interval.body.message).toMatch(/^intervalMin: /)
    expect((await shore.request(importUrl, { method: 'POST', rawBody: upload(fixes.join('\n'), { mode: 'preview' }) })).status).toBe(403)
  })

  it('a log of more than 50,000 lines: 400 naming file', async () => {
    const line = fixes[0]!
    const text = Array.from({ length: 50_001 }, () => line).join('\n')
    const r = await planner.request(`/api/plans/${id}/reports/import`, { method: 'POST', rawBody: upload(text, { mode: 'preview' }) })
    expect(r.status).toBe(400)
    expect(r.body.message).toMatch(/^file: a track log holds at most 50,000 lines/)
  })
})

describe('the fleet', () => {
  it('lists each vessel on passage once, with its latest report worked out; another company sees none of it', async () => {
    const fleet = await expectStatus<any[]>(shore.request('/api/fleet'), 200)
    const meridian = fleet.filter(f => f.vesselName === 'Kestrel Meridian')
    expect(meridian).toHaveLength(1)
    const entry = meridian[0]!
    const voyage = await expectStatus(shore.request(`/api/plans/${entry.planId}/voyage`), 200)
    const last = voyage.reports.at(-1)
    if (last) {
      expect(entry.distanceToGoNm).toBe(last.distanceToGoNm)
      expect(entry.flags).toEqual(last.flags)
      expect(entry.lastReport.timeUtc).toBe(last.timeUtc)
    }
    else expect(entry.distanceToGoNm).toBe(voyage.totalNm)
    const other = await expectStatus<any[]>(otherPlanner.request('/api/fleet'), 200)
    expect(other.some(f => f.vesselName.startsWith('Kestrel'))).toBe(false)
  })
})
