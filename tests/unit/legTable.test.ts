import { describe, expect, it } from 'vitest'
import { computeLegTable, createLegMemo } from '../../shared/utils/legTable'
import type { LegTableWaypoint } from '../../shared/utils/legTable'
import { angleDiff, fmt, runOracle } from './support/oracle'

// A North Pacific crossing (positions rounded from public port approaches; speeds invented for the test)
const plan: LegTableWaypoint[] = [
  { name: 'Uraga Suido', lat: 35.1, lon: 139.75 },
  { name: 'Nojima Saki', lat: 34.85, lon: 140.0, method: 'rhumb', turnRadiusNm: 1 },
  { name: 'Mid Pacific', lat: 47.0, lon: -175.0, method: 'geodesic', speedKn: 16, turnRadiusNm: 2 },
  { name: 'Cape Flattery', lat: 48.4, lon: -124.8, method: 'geodesic' },
]

describe('leg table', () => {
  const table = computeLegTable(plan, '2026-06-01T00:00:00Z', 14)
  const lines = plan.slice(1).map((b, i) => `${fmt(plan[i]!.lat)} ${fmt(plan[i]!.lon)} ${fmt(b.lat)} ${fmt(b.lon)}`)
  const rhumb = runOracle('RhumbSolve', ['-i', '-p', '10'], lines) // azi12 s12 S12
  const geod = runOracle('GeodSolve', ['-i', '-p', '10'], lines) // azi1 azi2 s12

  it('distances and courses match the oracle for each leg method', () => {
    expect(table.legs).toHaveLength(3)
    table.legs.forEach((leg, i) => {
      expect(Math.abs(leg.rhumbDistanceNm * 1852 - rhumb[i]![1]!)).toBeLessThan(1e-3)
      if (leg.method === 'rhumb') {
        expect(Math.abs(leg.distanceNm * 1852 - rhumb[i]![1]!)).toBeLessThan(1e-3)
        expect(Math.abs(angleDiff(leg.course, rhumb[i]![0]!))).toBeLessThan(1e-9)
        expect(leg.savingNm).toBe(0)
      }
      else {
        expect(Math.abs(leg.distanceNm * 1852 - geod[i]![2]!)).toBeLessThan(1e-6)
        expect(Math.abs(angleDiff(leg.initialCourse, geod[i]![0]!))).toBeLessThan(1e-9)
        expect(Math.abs(angleDiff(leg.finalCourse, geod[i]![1]!))).toBeLessThan(1e-9)
        expect(Math.abs(leg.savingNm - (rhumb[i]![1]! - geod[i]![2]!) / 1852)).toBeLessThan(1e-6)
      }
    })
  })

  it('time on leg = distance / speed, ETAs accumulate from departure in UTC (common practice)', () => {
    const speeds = [14, 16, 14] // the leg's own speed or the plan default
    let ms = Date.parse('2026-06-01T00:00:00Z')
    let cum = 0
    table.legs.forEach((leg, i) => {
      const nm = (leg.method === 'rhumb' ? rhumb[i]![1]! : geod[i]![2]!) / 1852
      expect(leg.speedKn).toBe(speeds[i])
      expect(leg.hours).toBeCloseTo(nm / speeds[i]!, 9)
      ms += nm / speeds[i]! * 3_600_000
      cum += nm
      expect(Math.abs(Date.parse(leg.etaUtc) - ms)).toBeLessThanOrEqual(1)
      expect(leg.cumulativeNm).toBeCloseTo(cum, 6)
    })
    expect(table.totals.distanceNm).toBeCloseTo(cum, 6)
    expect(Math.abs(Date.parse(table.totals.etaUtc) - ms)).toBeLessThanOrEqual(1)
    expect(table.legs[2]!.zoneDescription).toBe(8) // 124.8°W: ZD +8 (common practice)
  })

  it('course change and wheel-over at each turn (R·tan(Δ/2), common practice)', () => {
    const change = angleDiff(geod[1]![0]!, rhumb[0]![0]!)
    expect(table.legs[0]!.courseChange).toBeCloseTo(change, 9)
    expect(table.legs[0]!.wheelOverNm).toBeCloseTo(1 * Math.tan(Math.abs(change) * Math.PI / 360), 9)
    expect(table.legs[1]!.courseChange).toBeCloseTo(angleDiff(geod[2]![0]!, geod[1]![1]!), 9)
    expect(table.legs[2]!.courseChange).toBeNull()
  })

  it('rejects a bad departure time or speed', () => {
    expect(() => computeLegTable(plan, 'not a date', 12)).toThrow(RangeError)
    expect(() => computeLegTable(plan, '2026-06-01T00:00:00Z', 0)).toThrow(RangeError)
  })

  it('with a memo of solved legs, an edited plan gets the same table as one computed afresh (oracle above)', () => {
    const memo = createLegMemo()
    const first = computeLegTable(plan, '2026-06-01T00:00:00Z', 14, { memo })
    expect(first).toEqual(table)
    // The draft replaces the waypoint it changes: the legs on either side of it are solved again.
    const moved = plan.map((w, i) => (i === 2 ? { ...w, lat: 46.5, method: 'rhumb' as const } : w))
    const again = computeLegTable(moved, '2026-06-01T00:00:00Z', 14, { memo })
    expect(again).toEqual(computeLegTable(moved, '2026-06-01T00:00:00Z', 14))
    expect(again.legs[1]!.method).toBe('rhumb')
    expect(again.legs[1]!.distanceNm).not.toBeCloseTo(table.legs[1]!.distanceNm, 3)
    expect(again.legs[0]!.distanceNm).toBe(table.legs[0]!.distanceNm)
    expect(again.legs[0]!.courseChange).not.toBeCloseTo(table.legs[0]!.courseChange!, 3)
  })
})
