import { describe, expect, it } from 'vitest'
import geodesic from 'geographiclib-geodesic'
import { computeLegTable } from '../../shared/utils/legTable'
import { rhumbInverse, rhumbLine, rhumbLinePosition } from '../../shared/utils/rhumb'
import { geodesicPointAt } from '../../shared/utils/geodesic'
import { legCrossTrack, locateOnPlan } from '../../shared/utils/monitoring/planPosition'
import { plannedAlongAt, plannedFuelTo, plannedHoursTo } from '../../shared/utils/monitoring/planTimeline'
import { flagChanges, workReport, workReports, type MonitoringThresholds } from '../../shared/utils/monitoring/workReport'
import { demoPlans } from '../../db/seeds/demoData'

const raw = geodesic.Geodesic.WGS84
const NM = 1852
const seeded = demoPlans.find(p => p.title.startsWith('Cape of Good Hope'))!
const waypoints = seeded.waypoints.map(([name, lat, lon, method]) => ({ name, lat, lon, method }))
// The seeded Indian Ocean plan: departure 2026-11-24 06:00 UTC at 15 kn (db/seeds/demoData.ts, invented).
const table = computeLegTable(waypoints, seeded.departureUtc, seeded.speedKn)
const legs = table.legs
const plan = { departureUtc: seeded.departureUtc, legs, fuelCurve: { c: 0.0141, k: 3 } }
const limits: MonitoringThresholds = { defaultXteNm: 5, lateH: 12, fuelPct: 10 }
const hoursAfter = (h: number) => new Date(Date.parse(seeded.departureUtc) + h * 3_600_000).toISOString()

/** The point a fraction of the way along leg i, by its own method. */
function along(i: number, fraction: number) {
  const leg = legs[i]!
  if (leg.method === 'geodesic') return geodesicPointAt(leg.from, leg.to, leg.distanceNm * NM * fraction)
  const p = rhumbLinePosition(rhumbLine(leg.from, rhumbInverse(leg.from, leg.to).course), leg.distanceNm * NM * fraction)
  return { lat: p.lat, lon: p.lon }
}

/** The point `d` nm along the plan from departure. */
function atDistance(d: number) {
  const i = legs.findIndex(l => l.cumulativeNm > d)
  return along(i, (d - (legs[i]!.cumulativeNm - legs[i]!.distanceNm)) / legs[i]!.distanceNm)
}

describe('a position on the plan', () => {
  it('at each waypoint: the next leg, the distance so far from the leg table, nothing across', () => {
    for (let k = 1; k < legs.length; k++) {
      const at = locateOnPlan(legs, waypoints[k]!)
      expect(at.legIndex).toBe(k)
      expect(at.alongTrackNm).toBeCloseTo(legs[k - 1]!.cumulativeNm, 6) // leg table cumulative distance
      expect(at.distanceToGoNm).toBeCloseTo(table.totals.distanceNm - legs[k - 1]!.cumulativeNm, 6)
      expect(Math.abs(at.crossTrackNm)).toBeLessThan(1e-6)
    }
  })

  it('distance to go is the rest of the leg plus the later legs of the leg table', () => {
    for (const [i, f] of [[0, 0.3], [2, 0.4], [4, 0.75]] as const) {
      const at = locateOnPlan(legs, along(i, f))
      const later = legs.slice(i + 1).reduce((s, l) => s + l.distanceNm, 0)
      expect(at.legIndex).toBe(i)
      expect(at.distanceToGoNm).toBeCloseTo(legs[i]!.distanceNm * (1 - f) + later, 6)
      expect(at.alongLegNm).toBeCloseTo(legs[i]!.distanceNm * f, 6)
    }
  })

  it('20 nm to starboard of the geodesic leg to Fremantle: by the geodesic method, +20 nm', () => {
    const i = legs.length - 1
    const p = along(i, 0.5)
    const course = raw.Inverse(legs[i]!.from.lat, legs[i]!.from.lon, p.lat, p.lon).azi2!
    const off = raw.Direct(p.lat, p.lon, course + 90, 20 * NM)
    const at = locateOnPlan(legs, { lat: off.lat2!, lon: off.lon2! })
    expect(at.legIndex).toBe(i)
    expect(at.crossTrackNm).toBeCloseTo(20, 6) // the offset laid off with geographiclib Direct
  })

  it('outside the turn at 40S 100E, beyond both legs\' spans: the nearer leg, clamped to its end', () => {
    // 40S 100E turns from 090° onto the leg towards Fremantle (NE): 10 nm on 165° lies past the end of one span and behind the other.
    const o = raw.Direct(-40, 100, 165, 10 * NM)
    const p = { lat: o.lat2!, lon: o.lon2! }
    expect(legCrossTrack(legs[3]!, p).alongTrackM).toBeGreaterThan(legs[3]!.distanceNm * NM)
    expect(legCrossTrack(legs[4]!, p).alongTrackM).toBeLessThan(0)
    const at = locateOnPlan(legs, p)
    expect([3, 4]).toContain(at.legIndex)
    expect(at.alongTrackNm).toBeCloseTo(legs[3]!.cumulativeNm, 6)
  })

  it('before the departure point: the first leg, no distance made', () => {
    const at = locateOnPlan(legs, { lat: -34.3, lon: 18.3 })
    expect(at.legIndex).toBe(0)
    expect(at.alongTrackNm).toBe(0)
    expect(at.distanceToGoNm).toBeCloseTo(table.totals.distanceNm, 9)
  })
})

describe('the plan as a schedule', () => {
  it('expected distance and time are inverse to each other and meet at the leg ends', () => {
    for (const h of [0.5, 17, 60, 130, table.totals.hours - 1]) expect(plannedHoursTo(legs, plannedAlongAt(legs, h))).toBeCloseTo(h, 9)
    expect(plannedAlongAt(legs, legs[0]!.hours)).toBeCloseTo(legs[0]!.distanceNm, 9)
    expect(plannedAlongAt(legs, table.totals.hours + 10)).toBeCloseTo(table.totals.distanceNm, 9)
    expect(plannedHoursTo(legs, table.totals.distanceNm)).toBeCloseTo(table.totals.hours, 9)
  })

  it('planned fuel: rate(V) · hours / 24 over the distance sailed (common practice)', () => {
    // c · 15³ t/day = 47.59 t/day at 15 kn on every leg; 360 nm take 24 h.
    expect(plannedFuelTo(legs, 360, plan.fuelCurve)).toBeCloseTo(0.0141 * 15 ** 3, 9)
    expect(plannedFuelTo(legs, 0, plan.fuelCurve)).toBe(0)
  })
})

describe('a report worked out against the plan', () => {
  it('on schedule: nothing ahead or behind, speed made good the planned 15 kn, ETA the planned arrival, no flags', () => {
    const h = 50
    const p = atDistance(plannedAlongAt(legs, h))
    const w = workReport(plan, { ...p, timeUtc: hoursAfter(h) }, null, null, limits)
    expect(w.legIndex).toBe(1)
    expect(w.aheadNm).toBeCloseTo(0, 6)
    expect(w.delayH).toBeCloseTo(0, 6)
    expect(w.speedMadeGoodKn).toBeCloseTo(15, 6)
    expect(Date.parse(w.etaUtc!)).toBeCloseTo(Date.parse(table.totals.etaUtc), -1)
    expect(w.etaPlannedSpeedsUtc.slice(0, 19)).toBe(table.totals.etaUtc.slice(0, 19))
    expect(w.flags).toEqual([])
  })

  it('a day behind: 360 nm astern of the plan, 24 h late, flagged late past the 12 h threshold', () => {
    const h = 100
    const behind = plannedAlongAt(legs, h - 24)
    const p = atDistance(behind)
    const w = workReport(plan, { ...p, timeUtc: hoursAfter(h) }, { timeUtc: hoursAfter(h - 24), alongTrackNm: behind - 24 * 12 }, null, limits)
    expect(w.aheadNm).toBeCloseTo(-360, 6)
    expect(w.delayH).toBeCloseTo(24, 6)
    expect(w.speedMadeGoodKn).toBeCloseTo(12, 6) // 288 nm in 24 h
    expect(w.flags).toEqual(['late'])
  })

  it('off track beyond the default corridor, and within a leg\'s own wider corridor', () => {
    const p = along(2, 0.5)
    const north = { lat: p.lat + 6 / 60, lon: p.lon } // 6′ of latitude ≈ 6 nm north of the 40°S parallel
    const w = workReport(plan, { ...north, timeUtc: hoursAfter(150) }, null, null, limits)
    expect(w.crossTrackNm).toBeLessThan(-5.9)
    expect(w.xteLimitNm).toBe(5)
    expect(w.flags).toContain('off-track')
    const wide = { ...plan, legs: legs.map((l, i) => (i === 2 ? { ...l, xteNm: 10 } : l)) }
    expect(workReport(wide, { ...north, timeUtc: hoursAfter(150) }, null, null, limits).flags).not.toContain('off-track')
  })

  it('fuel against the plan from the first report with fuel on board; flagged beyond 10 %', () => {
    const fixes = [
      { ...along(1, 0.2), timeUtc: hoursAfter(30), fuelRobT: 2000 },
      { ...along(1, 0.6), timeUtc: hoursAfter(60), fuelRobT: null },
      { ...along(2, 0.1), timeUtc: hoursAfter(90), fuelRobT: 1500 },
    ]
    const [first, , third] = workReports(plan, fixes, limits)
    expect(first!.fuelUsedT).toBeNull() // the baseline itself
    expect(third!.fuelUsedT).toBe(500)
    const planned = plannedFuelTo(legs, third!.alongTrackNm, plan.fuelCurve) - plannedFuelTo(legs, first!.alongTrackNm, plan.fuelCurve)
    expect(third!.fuelPlannedT).toBeCloseTo(planned, 9)
    expect(500 > planned * 1.1).toBe(true)
    expect(third!.flags).toContain('fuel')
    expect(first!.flags).not.toContain('fuel')
  })

  it('speed made good over the time since the report before', () => {
    const fixes = [{ ...along(0, 0.2), timeUtc: hoursAfter(10) }, { ...along(0, 0.8), timeUtc: hoursAfter(30) }]
    const [a, b] = workReports(plan, fixes, limits)
    expect(b!.speedMadeGoodKn).toBeCloseTo((b!.alongTrackNm - a!.alongTrackNm) / 20, 9)
  })
})

describe('alerts once per flag until it clears', () => {
  it('raises new flags, keeps active ones quiet and clears those gone', () => {
    expect(flagChanges(new Set(), ['off-track'])).toEqual({ raise: ['off-track'], clear: [] })
    expect(flagChanges(new Set(['off-track']), ['off-track', 'late'])).toEqual({ raise: ['late'], clear: [] })
    expect(flagChanges(new Set(['off-track', 'late']), ['late'])).toEqual({ raise: [], clear: ['off-track'] })
  })
})
